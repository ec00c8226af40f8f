// Drawing the report page from plain values: no file is opened here.
#include "sheetmill/accuracy/report_page.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <filesystem>

#include "sheetmill/accuracy/summary.hpp"
#include "sheetmill/core/caution.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/text/shaping.hpp"

namespace sheetmill::accuracy {

namespace {

constexpr Box kMapBox{12, 30, 172, 190};
constexpr Box kHistogramBox{186, 36, 285, 100};
constexpr Colour kInk{0.1, 0.1, 0.1, 1};
constexpr Colour kHigh{0.78, 0.16, 0.12, 1};  // DEM reads high
constexpr Colour kLow{0.12, 0.32, 0.75, 1};   // DEM reads low

void set_colour(cairo_t* cr, Colour c) {
  cairo_set_source_rgba(cr, c.r, c.g, c.b, c.a);
}

struct Writer {
  cairo_t* cr;
  text::FontCache& fonts;
  // Draws `s` with its baseline start (or end, or centre) at `at`; returns its width.
  double put(const std::string& s, Point at, double size_pt, int weight = 400, double align = 0,
             Colour colour = kInk) {
    text::ShapedText t = text::shape(fonts, {"DejaVu Sans", weight, false}, size_pt, s);
    text::TextPaint paint;
    paint.colour = colour;
    text::draw_text(cr, t, {at.x - align * t.width_mm, at.y}, 0, paint);
    return t.width_mm;
  }
  // Word-wrapped into `width_mm`; returns the baseline after the last line.
  double paragraph(const std::string& s, Point at, double width_mm, double size_pt,
                   Colour colour = kInk) {
    double leading_mm = size_pt * 0.3528 * 1.3;
    std::string line, word;
    auto width = [&](const std::string& x) {
      return text::shape(fonts, {"DejaVu Sans", 400, false}, size_pt, x).width_mm;
    };
    auto flush = [&] {
      put(line, at, size_pt, 400, 0, colour);
      at.y += leading_mm;
      line.clear();
    };
    for (std::size_t i = 0; i <= s.size(); ++i) {
      if (i < s.size() && s[i] != ' ') {
        word += s[i];
        continue;
      }
      std::string next = line.empty() ? word : line + " " + word;
      if (!line.empty() && width(next) > width_mm) {
        flush();
        next = word;
      }
      line = next;
      word.clear();
    }
    if (!line.empty()) flush();
    return at.y;
  }
};

struct MapView {
  RasterGrid grid;
  Box box_mm;
  Point to_page(Point xy) const {
    Box g = grid.bounds();
    return {box_mm.min_x + (xy.x - g.min_x) / g.width() * box_mm.width(),
            box_mm.min_y + (g.max_y - xy.y) / g.height() * box_mm.height()};
  }
  double mm_per_ground_m() const { return box_mm.width() / grid.bounds().width(); }
};

void draw_shade(cairo_t* cr, const ReportMap& map, const Box& box) {
  const int w = map.grid.width, h = map.grid.height;
  CairoSurfacePtr img(cairo_image_surface_create(CAIRO_FORMAT_RGB24, w, h));
  check_cairo(cairo_surface_status(img.get()), "report hillshade");
  cairo_surface_flush(img.get());
  unsigned char* data = cairo_image_surface_get_data(img.get());
  const int stride = cairo_image_surface_get_stride(img.get());
  for (int r = 0; r < h; ++r) {
    auto* row = reinterpret_cast<std::uint32_t*>(data + r * stride);
    for (int c = 0; c < w; ++c) {
      std::uint8_t s = map.shade[static_cast<std::size_t>(r) * w + c];
      // Lightened (half-way to white) so the residual symbols read above the relief; no data
      // is paper white.
      std::uint32_t v = s == 0 ? 255u : 128u + s / 2u;
      row[c] = (v << 16) | (v << 8) | v;
    }
  }
  cairo_surface_mark_dirty(img.get());
  cairo_save(cr);
  cairo_rectangle(cr, box.min_x, box.min_y, box.width(), box.height());
  cairo_clip(cr);
  cairo_translate(cr, box.min_x, box.min_y);
  cairo_scale(cr, box.width() / w, box.height() / h);
  cairo_set_source_surface(cr, img.get(), 0, 0);
  cairo_pattern_set_filter(cairo_get_source(cr), CAIRO_FILTER_GOOD);
  cairo_paint(cr);
  cairo_restore(cr);
}

double nice_below(double v) {
  double decade = std::pow(10.0, std::floor(std::log10(v)));
  for (double step : {5.0, 2.0, 1.0}) {
    if (step * decade <= v) return step * decade;
  }
  return decade;
}

// The panel's box for the window: as large as fits in kMapBox with the window's shape, top-aligned.
Box fitted_box(const RasterGrid& grid) {
  Box g = grid.bounds();
  double s = std::min(kMapBox.width() / g.width(), kMapBox.height() / g.height());
  double x0 = kMapBox.centre().x - s * g.width() / 2;
  return Box::of(x0, kMapBox.min_y, x0 + s * g.width(), kMapBox.min_y + s * g.height());
}

void draw_residual_map(Writer& w, const Assessment& a, const ReportMap& map) {
  cairo_t* cr = w.cr;
  const Box box = fitted_box(map.grid);
  MapView view{map.grid, box};
  draw_shade(cr, map, box);
  double max_abs = std::max(a.all.max_abs_m, 1e-9);
  cairo_save(cr);
  cairo_rectangle(cr, box.min_x, box.min_y, box.width(), box.height());
  cairo_clip(cr);
  for (const Residual& r : a.residuals) {
    Point p = view.to_page(r.xy);
    if (r.status != PointStatus::used) {
      // Refused points: a small grey cross where they fall on the map.
      cairo_set_source_rgb(cr, 0.45, 0.45, 0.45);
      cairo_set_line_width(cr, 0.3);
      cairo_move_to(cr, p.x - 1, p.y - 1);
      cairo_line_to(cr, p.x + 1, p.y + 1);
      cairo_move_to(cr, p.x - 1, p.y + 1);
      cairo_line_to(cr, p.x + 1, p.y - 1);
      cairo_stroke(cr);
      continue;
    }
    // Area in proportion to |error| (a circle's radius as its square root), 0.6 to 3.2 mm.
    double radius = 0.6 + 2.6 * std::sqrt(std::abs(r.error_m) / max_abs);
    cairo_arc(cr, p.x, p.y, radius, 0, 2 * M_PI);
    set_colour(cr, r.error_m >= 0 ? kHigh : kLow);
    cairo_fill_preserve(cr);
    cairo_set_source_rgb(cr, 1, 1, 1);
    cairo_set_line_width(cr, 0.25);
    cairo_stroke(cr);
    if (r.outlier) {
      cairo_arc(cr, p.x, p.y, radius + 0.8, 0, 2 * M_PI);
      set_colour(cr, kInk);
      cairo_set_line_width(cr, 0.35);
      cairo_stroke(cr);
      w.put(r.id, {p.x + radius + 1.2, p.y + 1}, 6.5, 700);
    }
  }
  cairo_restore(cr);
  cairo_rectangle(cr, box.min_x, box.min_y, box.width(), box.height());
  set_colour(cr, kInk);
  cairo_set_line_width(cr, 0.3);
  cairo_stroke(cr);
  // Scale bar: a round ground length near a quarter of the panel.
  double bar_m = nice_below(0.25 * box.width() / view.mm_per_ground_m());
  double bar_mm = bar_m * view.mm_per_ground_m();
  double y = box.max_y + 5;
  cairo_rectangle(cr, box.max_x - bar_mm, y - 1, bar_mm, 1);
  cairo_fill(cr);
  std::string label =
      bar_m >= 1000 ? fmt::format("{:g} km", bar_m / 1000) : fmt::format("{:g} m", bar_m);
  w.put(label, {box.max_x - bar_mm - 1.5, y}, 7, 400, 1);
  w.paragraph(fmt::format("Circles: DEM minus surveyed height at each check point; red where the "
                          "DEM reads high, blue where low; area in proportion to the error "
                          "(largest {} m). Ringed and named: beyond three standard deviations. "
                          "Grey crosses: points refused.",
                          format_metres(a.all.max_abs_m)),
              {kMapBox.min_x, y + 4}, kMapBox.width(), 7);
}

void draw_histogram(Writer& w, const Assessment& a) {
  cairo_t* cr = w.cr;
  const Box& b = kHistogramBox;
  std::vector<double> e;
  for (const Residual& r : a.residuals) {
    if (r.status == PointStatus::used) e.push_back(r.error_m);
  }
  w.put("Residuals (DEM minus surveyed), metres", {b.min_x, b.min_y - 4}, 9, 700);
  double range = std::max({a.all.max_abs_m, a.all.nssda_95_m, 1e-6}) * 1.1;
  int bins = std::clamp(static_cast<int>(std::ceil(std::sqrt(e.size()))) | 1, 5, 25);
  std::vector<int> count(bins, 0);
  for (double v : e) {
    int k = static_cast<int>(std::floor((v + range) / (2 * range) * bins));
    ++count[std::clamp(k, 0, bins - 1)];
  }
  int top = std::max(1, *std::max_element(count.begin(), count.end()));
  double bin_mm = b.width() / bins;
  auto x_of = [&](double v) { return b.min_x + (v + range) / (2 * range) * b.width(); };
  for (int k = 0; k < bins; ++k) {
    double h = 0.85 * b.height() * count[k] / top;
    double centre = -range + (k + 0.5) * 2 * range / bins;
    set_colour(cr, centre >= 0 ? kHigh : kLow);
    cairo_rectangle(cr, b.min_x + k * bin_mm + 0.2, b.max_y - h, bin_mm - 0.4, h);
    cairo_fill(cr);
  }
  set_colour(cr, kInk);
  cairo_set_line_width(cr, 0.3);
  cairo_move_to(cr, b.min_x, b.max_y);
  cairo_line_to(cr, b.max_x, b.max_y);
  cairo_stroke(cr);
  // The NSSDA 95 % band and the mean.
  double dashes[] = {1.2, 0.8};
  cairo_set_dash(cr, dashes, 2, 0);
  for (double v : {-a.all.nssda_95_m, a.all.nssda_95_m}) {
    cairo_move_to(cr, x_of(v), b.min_y);
    cairo_line_to(cr, x_of(v), b.max_y);
  }
  cairo_stroke(cr);
  cairo_set_dash(cr, nullptr, 0, 0);
  cairo_move_to(cr, x_of(a.all.mean_m), b.min_y + 4);
  cairo_line_to(cr, x_of(a.all.mean_m), b.max_y);
  cairo_set_line_width(cr, 0.5);
  cairo_stroke(cr);
  w.put("mean", {x_of(a.all.mean_m), b.min_y + 3}, 6.5, 400, 0.5);
  w.put("-95 %", {x_of(-a.all.nssda_95_m) - 0.8, b.min_y + 3}, 6.5, 400, 1);
  w.put("+95 %", {x_of(a.all.nssda_95_m) + 0.8, b.min_y + 3}, 6.5, 400, 0);
  for (double v : {-range, 0.0, range}) {
    w.put(format_metres(v), {x_of(v), b.max_y + 4}, 7, 400, v < 0 ? 0 : v > 0 ? 1 : 0.5);
  }
  w.put(fmt::format("{} points in {} bins; tallest bar {}", e.size(), bins, top),
        {b.min_x, b.max_y + 8}, 7);
}

void draw_figures(Writer& w, const Assessment& a) {
  double x = kHistogramBox.min_x, y = 124;
  auto row = [&](const std::string& name, const std::string& value) {
    w.put(name, {x, y}, 8);
    w.put(value, {x + 52, y}, 8, 700);
    y += 4.6;
  };
  w.put("Figures", {x, y - 6}, 9, 700);
  row("check points used", fmt::format("{} of {}", a.used, a.residuals.size()));
  if (a.used < a.residuals.size()) {
    row("refused: outside, nodata", fmt::format("{}, {}", a.outside, a.nodata));
    row("refused: duplicate, no height", fmt::format("{}, {}", a.duplicate, a.no_height));
  }
  row("mean error (bias)", format_metres(a.all.mean_m) + " m");
  row("standard deviation", format_metres(a.all.sd_m) + " m");
  row("RMSE_z", format_metres(a.all.rmse_m) + " m");
  row("NSSDA 95 % (1.96 RMSE_z)", format_metres(a.all.nssda_95_m) + " m");
  if (a.has_cover) {
    row("NVA, non-vegetated", format_metres(a.non_vegetated.nssda_95_m) + " m");
    row("VVA, vegetated (95th pct)", format_metres(a.vegetated.abs_p95_m) + " m");
  }
  row("NMAS 1947 finest interval", format_metres(a.all.nmas_interval_m) + " m");
  row("outliers beyond 3 SD",
      a.outlier_ids.empty() ? std::string("none") : std::to_string(a.outlier_ids.size()));
  if (a.horizontal) {
    row("horizontal RMSE_r", format_metres(a.horizontal->stats.rmse_r_m) + " m");
    row("NSSDA horizontal 95 %", format_metres(a.horizontal->stats.nssda_95_m) + " m");
  }
  y += 2;
  y = w.paragraph(vertical_statement(a, a.date), {x, y}, kHistogramBox.width(), 8);
  if (a.all.max_abs_m == 0) {
    w.paragraph(
        "Every check point equals the DEM exactly: the points are not independent of the "
        "DEM, and the test says nothing about its accuracy.",
        {x, y + 1}, kHistogramBox.width(), 8, kHigh);
  }
}

}  // namespace

void draw_report_page(cairo_t* cr, const Assessment& a, const ReportMap& map,
                      text::FontCache& fonts) {
  cairo_save(cr);
  cairo_set_source_rgb(cr, 1, 1, 1);
  cairo_paint(cr);
  Writer w{cr, fonts};
  std::string dem = std::filesystem::path(a.dem_path).filename().string();
  w.put("Vertical accuracy of " + dem, {12, 16}, 16, 700);
  w.put(fmt::format("{} check points of {} (layer {}, heights from {})", a.residuals.size(),
                    std::filesystem::path(a.points_path).filename().string(), a.points_layer,
                    a.height_field),
        {12, 23}, 9);
  draw_residual_map(w, a, map);
  draw_histogram(w, a);
  draw_figures(w, a);
  w.paragraph(kProductCaution, {kHistogramBox.min_x, 186}, kHistogramBox.width(), 7,
              {0.55, 0.1, 0.1, 1});
  cairo_restore(cr);
}

}  // namespace sheetmill::accuracy
