#pragma once
// The render stage's feature-layer loop: read every visible style layer from its project
// source, turn it into page-space geometry grouped by layer and rule, then draw it pass by pass.
//
// PreparedLayers holds only what lands on this sheet, in page millimetres, simplified to
// kSimplifyMm on paper (Douglas and Peucker 1973): its size is bounded by the sheet, not by the
// source. It points into the Style it was prepared from, which must outlive it.

#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/core/map_frame.hpp"
#include "sheetmill/labels/candidate.hpp"
#include "sheetmill/pdf/layered_canvas.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/render/render.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/text/collision_index.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::render {

inline constexpr double kSimplifyMm = 0.05;   // generalisation tolerance on paper
inline constexpr double kClipMarginMm = 5.0;  // features are clipped this far outside the frame

struct PreparedPoint {
  Point at_mm;
  double rotation_deg = 0;  // clockwise on the page
};

// What one rule draws, page mm.
struct PreparedRule {
  const style::Rule* rule = nullptr;
  std::vector<Polyline> lines;               // line features, and area outlines for line symbols
  std::vector<std::vector<Polyline>> areas;  // one entry per polygon: outer ring and holes
  std::vector<PreparedPoint> points;
  long features = 0;
};

struct PreparedLayer {
  const style::Layer* layer = nullptr;
  std::string group;                // PDF group: the layer's group, else its id
  std::vector<PreparedRule> rules;  // parallel to layer->rules
};

struct PreparedLayers {
  std::vector<PreparedLayer> layers;  // style order (visible layers only)
  std::vector<Point> clip_page_mm;    // the neatline on the page; drawing stays inside it
};

struct FeatureLayersResult {
  std::vector<LayerReport> reports;              // one per visible layer, style order
  std::vector<const style::Rule*> legend_rules;  // rules with >= 1 feature and legend text
  std::vector<labels::Candidate> name_candidates;
  std::vector<text::Quad> obstacles;                         // symbols of obstacle layers (page mm)
  std::vector<std::vector<Polyline>> water_polygons_ground;  // water surfaces, ground metres
};

// Reads every style layer visible at the scale. A layer whose source the project does not map
// is skipped with a warning; a missing required source throws Error(input).
FeatureLayersResult prepare_feature_layers(const project::Project& project,
                                           const style::Style& style, const MapFrame& frame,
                                           text::FontCache& fonts, PreparedLayers& out);

// Draws the prepared layers in the style's order, each into its group: areas, then line
// strokes pass by pass across all rules of the layer, then point symbols.
void draw_feature_layers(pdf::LayeredCanvas& canvas, const PreparedLayers& prepared,
                         const style::Style& style);

// One prepared layer into its group of `canvas` (render_sheet interleaves relief and contours).
void draw_feature_layer(pdf::LayeredCanvas& canvas, const PreparedLayer& layer,
                        const std::vector<Point>& clip_page_mm);

// The same drawing onto any page-mm context (tests, previews), clipped to the neatline.
void draw_prepared_layer(cairo_t* cr, const PreparedLayer& layer,
                         const std::vector<Point>& clip_page_mm);

// Is the layer drawn at 1:scale_denominator? (min_scale <= N <= max_scale, 0 = open end)
bool layer_visible(const style::Layer& layer, double scale_denominator);

}  // namespace sheetmill::render
