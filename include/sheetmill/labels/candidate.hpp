#pragma once
// Label placement shared by every kind of label on a sheet (feature names, contour values, spot
// heights). Each stage turns its labels into Candidates, each with alternative Placements in
// preference order; place() decides them all against one CollisionIndex, highest priority first.

#include <cairo.h>

#include <functional>
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "sheetmill/text/collision_index.hpp"

namespace sheetmill::labels {

struct Placement {
  std::vector<text::Quad> footprint;   // page mm; what the label occupies
  std::function<void(cairo_t*)> draw;  // draws the label (text, halo) in page mm
  double cost = 0;                     // among one candidate's placements, lower is better
};

struct Candidate {
  std::string layer;     // for the render log's per-layer counts
  std::string text;      // what it says, for the log of dropped labels
  Point anchor_mm;       // where it belongs on the page (the feature's point, line middle, ...)
  int priority = 50;     // higher first
  bool may_drop = true;  // false: placed at its best position even if it collides
  std::vector<Placement> placements;
  std::optional<std::size_t> chosen;  // set by place()
};

struct LayerCount {
  long placed = 0;
  long dropped = 0;
};

// Decides every candidate (stable by priority, then input order), inserting chosen footprints in
// `index`. Returns placed and dropped counts per layer; each dropped label is logged at debug
// level (--verbose) with its layer, text and page position.
std::map<std::string, LayerCount> place(std::vector<Candidate>& candidates,
                                        text::CollisionIndex& index);

// Draws the chosen placement of every candidate, in priority order.
void draw_placed(cairo_t* cr, const std::vector<Candidate>& candidates);

}  // namespace sheetmill::labels
