// Hidden benchmark driver (tag [.bench], not run by ctest): prepares and draws one synthetic
// line source through the feature-layer loop and prints the time per feature of each phase.
// bench/features/run calls it with SHEETMILL_BENCH_SOURCE set; see that script.

#include <ogr_spatialref.h>

#include <catch2/catch.hpp>
#include <chrono>
#include <cstdlib>
#include <fstream>
#include <iostream>
#include <string>

#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/pdf/layered_canvas.hpp"
#include "sheetmill/render/feature_layers.hpp"
#include "support/crs.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {
// Peak resident set so far (VmHWM), kB, from /proc/self/status.
long peak_rss_kb() {
  std::ifstream in("/proc/self/status");
  std::string key;
  long v = 0;
  while (in >> key) {
    if (key == "VmHWM:") {
      in >> v;
      return v;
    }
    in.ignore(1 << 12, '\n');
  }
  return 0;
}
}  // namespace

TEST_CASE("bench: feature layers on one sheet", "[.bench]") {
  const char* src = std::getenv("SHEETMILL_BENCH_SOURCE");
  if (!src) {
    WARN("SHEETMILL_BENCH_SOURCE not set");
    return;
  }
  gdal_init();
  test::TempDir tmp("bench");
  // Two road classes with a casing pass under a fill pass: the common worst case for passes.
  style::Style style;
  style::Layer layer;
  layer.id = "roads";
  layer.source = "roads";
  for (const char* cls : {"a", "b"}) {
    style::Rule r;
    r.name = cls;
    r.filter.kind = style::Filter::Kind::equals;
    r.filter.field = "cls";
    r.filter.values = {cls};
    style::LineSymbol l;
    style::Stroke casing;
    casing.width_mm = 0.6;
    casing.pass = 0;
    style::Stroke fill;
    fill.width_mm = 0.4;
    fill.colour = {1, 0.6, 0.2, 1};
    fill.pass = 1;
    l.strokes = {casing, fill};
    r.line = l;
    layer.rules.push_back(r);
  }
  style.layers.push_back(layer);
  project::Project project;
  project.sources["roads"] = {"roads", src, "", "", true};
  MapFrame frame;
  frame.crs_wkt = test::wkt_of_epsg(32633);
  frame.scale_denominator = 25000;
  frame.ground = Box::of(500000, 4000000, 510000, 4010000);  // 400 x 400 mm
  frame.page_origin_mm = {10, 10};

  using Clock = std::chrono::steady_clock;
  auto t0 = Clock::now();
  text::FontCache fonts;
  render::PreparedLayers prepared;
  auto result = render::prepare_feature_layers(project, style, frame, fonts, prepared);
  auto t1 = Clock::now();
  const long hwm_prepare = peak_rss_kb();
  pdf::LayeredCanvas canvas(420, 420);
  render::draw_feature_layers(canvas, prepared, style);
  auto t2 = Clock::now();
  pdf::GeoRegistration geo;
  geo.frame_page_mm = frame.page_box_mm();
  const Box& g = frame.ground;
  geo.neatline_ground = {
      {g.min_x, g.min_y}, {g.max_x, g.min_y}, {g.max_x, g.max_y}, {g.min_x, g.max_y}};
  for (const Point& p : geo.neatline_ground) geo.neatline_page_mm.push_back(frame.to_page(p));
  geo.crs_wkt = frame.crs_wkt;
  geo.epsg = 32633;
  canvas.finish_pdf(tmp / "bench.pdf", geo, {});
  auto t3 = Clock::now();
  const long n = result.reports.at(0).features;
  auto us = [](auto a, auto b) { return std::chrono::duration<double, std::micro>(b - a).count(); };
  std::cout << "BENCH features=" << n << " prepare_us_per_feature=" << us(t0, t1) / n
            << " draw_us_per_feature=" << us(t1, t2) / n
            << " finish_us_per_feature=" << us(t2, t3) / n
            << " total_us_per_feature=" << us(t0, t3) / n
            << " peak_rss_after_prepare_kb=" << hwm_prepare << "\n";
  CHECK(n > 0);
}
