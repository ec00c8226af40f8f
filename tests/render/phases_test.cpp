// The sheet's phases take and return plain values (render/phases.hpp): a placement needs no DEM,
// no data file and no style, only a PreparedSheet built here by hand. Analytic case: label
// boxes on a 100 x 100 mm frame, where which overlaps which is known exactly.
#include "sheetmill/render/phases.hpp"

#include <catch2/catch.hpp>

using namespace sheetmill;

namespace {

labels::Candidate label(const std::string& layer, const std::string& text, const Box& box,
                        int priority) {
  labels::Candidate c;
  c.layer = layer;
  c.text = text;
  c.anchor_mm = box.centre();
  c.priority = priority;
  labels::Placement p;
  p.footprint = {text::box_quad(box)};
  p.draw = [](cairo_t*) {};
  c.placements.push_back(std::move(p));
  return c;
}

// 1 km square at 1:10 000: a 100 mm frame at the page's corner, on a 120 mm page.
render::PreparedSheet hand_made_sheet() {
  render::PreparedSheet s;
  s.layout.page_w_mm = s.layout.page_h_mm = 120;
  s.layout.frame.scale_denominator = 10000;
  s.layout.frame.ground = Box::of(0, 0, 1000, 1000);
  s.layout.frame.page_origin_mm = {0, 0};
  s.layout.map_box_mm = s.layout.frame.page_box_mm();
  return s;
}

}  // namespace

TEST_CASE("place() decides names and contour labels against one index", "[render]") {
  render::PreparedSheet sheet = hand_made_sheet();
  REQUIRE(sheet.layout.frame.page_box_mm().max_x == Approx(100));
  // A village name first (higher priority), a contour value overlapping it, one clear of it.
  sheet.features.name_candidates.push_back(label("places", "Ashby", Box::of(10, 10, 30, 20), 60));
  sheet.contours.labels.push_back(label("contours", "120", Box::of(20, 12, 40, 18), 50));
  sheet.contours.labels.push_back(label("contours", "130", Box::of(50, 50, 60, 55), 50));
  // A symbol of an obstacle layer, and a grid label inside the frame: both block labels.
  sheet.features.obstacles.push_back(text::box_quad(Box::of(70, 70, 90, 90)));
  sheet.features.name_candidates.push_back(label("places", "Brill", Box::of(75, 75, 85, 80), 60));
  sheet.grid_labels.push_back(Box::of(5, 85, 25, 95));
  sheet.contours.labels.push_back(label("contours", "140", Box::of(10, 88, 20, 92), 50));
  // Outside the frame: labels stay inside it.
  sheet.contours.labels.push_back(label("contours", "150", Box::of(95, 40, 110, 45), 50));

  const render::Placement p = render::place(sheet);
  // The candidates moved out of the sheet into the placement, split back by kind.
  CHECK(sheet.features.name_candidates.empty());
  CHECK(sheet.contours.labels.empty());
  REQUIRE(p.names.size() == 2);
  REQUIRE(p.contour_labels.size() == 4);
  CHECK(p.names[0].text == "Ashby");
  CHECK(p.names[0].chosen.has_value());
  CHECK_FALSE(p.names[1].chosen.has_value());           // on the obstacle
  CHECK_FALSE(p.contour_labels[0].chosen.has_value());  // under "Ashby"
  CHECK(p.contour_labels[1].chosen.has_value());
  CHECK_FALSE(p.contour_labels[2].chosen.has_value());  // on the grid label
  CHECK_FALSE(p.contour_labels[3].chosen.has_value());  // past the neatline
  CHECK(p.counts.at("places").placed == 1);
  CHECK(p.counts.at("places").dropped == 1);
  CHECK(p.counts.at("contours").placed == 1);
  CHECK(p.counts.at("contours").dropped == 3);
}
