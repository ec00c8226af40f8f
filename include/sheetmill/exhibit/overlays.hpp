#pragma once
// The vector overlays of an exhibit, read once for the frame and kept as page-millimetre
// geometry (bounded by the sheet: only features inside the frame, clipped to it).
//
// Draw order (draw_overlays): water areas (fill and outline), water lines, roads by class (main,
// secondary, minor: wider and stronger first), the veil outside the focus areas, area outlines
// (a white casing under the colour), names (river names along their line, lake names inside
// the lake, road numbers in boxes), then place callouts (dot, leader and boxed name). Names and
// callouts avoid each other through one CollisionIndex.

#include <cairo.h>

#include <functional>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/core/map_frame.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "sheetmill/exhibit/type_scale.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::exhibit {

struct PageArea {
  std::vector<Polyline> rings;  // outer rings and holes, page mm
};

struct Place {
  std::string name;
  Point at_mm;
};

// A line with what its source says about it (page mm).
struct NamedLine {
  Polyline line;
  std::string name;  // water: the river's name; roads: the road's number
  std::string kind;  // roads: the class ("main", "secondary", anything else is minor)
};

struct NamedArea {
  PageArea area;
  std::string name;
};

struct OverlayData {
  std::vector<PageArea> water_areas;
  std::vector<Polyline> water_lines;
  std::vector<Polyline> roads;
  std::vector<NamedLine> road_lines;         // the roads again, with class and number
  std::vector<NamedLine> named_waters;       // water lines with a name
  std::vector<NamedArea> named_lakes;        // water areas with a name
  std::vector<std::vector<PageArea>> areas;  // parallel to ExhibitProject::areas
  std::vector<PageArea> veil;                // the frame minus the focus areas (even-odd)
  std::vector<Place> places;
};

// Reads every overlay layer of the project for `frame`. Missing files throw Error(input).
OverlayData read_overlays(const ExhibitProject& project, const MapFrame& frame);

struct CalloutReport {
  int placed_free = 0;    // placed without touching another callout
  int placed_forced = 0;  // every position collided; placed at the first one anyway
};

// Where the overlays go: `begin(name)` gives the context for one named layer (water, roads,
// veil, areas, names, places), `end()` closes it. A LayeredCanvas makes each an optional content
// group.
struct OverlayTarget {
  std::function<cairo_t*(const char*)> begin;
  std::function<void()> end;
};

CalloutReport draw_overlay_groups(const OverlayTarget& target, const ExhibitProject& project,
                                  const MapFrame& frame, const OverlayData& data,
                                  const TypeScale& type, text::FontCache& fonts);

// All of them onto one context, in the same order.
CalloutReport draw_overlays(cairo_t* cr, const ExhibitProject& project, const MapFrame& frame,
                            const OverlayData& data, const TypeScale& type, text::FontCache& fonts);

}  // namespace sheetmill::exhibit
