#include "sheetmill/exhibit/exhibit_layout.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/exhibit/furniture.hpp"
#include "sheetmill/sheet/paper_sizes.hpp"
#include "sheetmill/sheet/sheet_crs.hpp"

namespace sheetmill::exhibit {

double tidy_scale(double exact) {
  if (!(exact > 0) || !std::isfinite(exact)) throw_internal_error("tidy_scale of a bad value");
  const double unit = std::pow(10.0, std::floor(std::log10(exact)) - 1);
  return std::ceil(exact / unit - 1e-9) * unit;
}

namespace {

// The sheet CRS through the one shared type (sheet/sheet_crs.hpp), located in the project file.
void set_crs(MapFrame& frame, const ExhibitProject& project) {
  try {
    const sheet::SheetCrs crs = sheet::SheetCrs::resolve(project.crs, "crs");
    frame.crs_wkt = crs.wkt2();
    frame.crs_name = crs.name();
    frame.epsg = crs.epsg();
  } catch (const Error& e) {
    if (e.kind() != Error::Kind::input) throw;
    throw_input_error(SourceLocation{project.file.string(), 0, 0, "crs"}, e.message());
  }
}

}  // namespace

namespace {

// Lines `text` takes at size_pt in a column width_mm wide, at an average advance of half an em
// per character (common practice for a sans serif; draw_notes wraps by shaped widths and warns
// when it runs past the panel).
double lines_of(const std::string& text, double size_pt, double width_mm) {
  const double per_line = std::max(1.0, width_mm / (0.5 * size_pt * kMmPerPt));
  return std::max(1.0, std::ceil(static_cast<double>(text.size()) / per_line));
}

// The height draw_notes needs in a column width_mm wide, with its own line spacing.
double notes_height_mm(const ExhibitProject& project, const TypeScale& type, double width_mm) {
  const double body = type.body_pt * kMmPerPt, fine = type.fine_pt * kMmPerPt;
  double h = 0;
  bool any_label = false;
  for (const AreaOverlay& a : project.areas) {
    if (a.label.empty()) continue;
    any_label = true;
    h += body * 1.4;
  }
  if (any_label) h += body * 0.6;
  auto fine_lines = [&](const std::string& t) {
    h += lines_of(t, type.fine_pt, width_mm) * fine * 1.25;
  };
  if (!project.credits.empty() || !project.producer.empty()) {
    fine_lines("Sources and credits");
    for (const std::string& c : project.credits) fine_lines(c);
    fine_lines("Prepared by " + project.producer + ", " + project.date);
  }
  for (const std::string& n : project.notes) fine_lines(n);
  h += body * 0.4 + body * 1.25;  // the caution's heading
  for (const std::string& c : caution_lines())
    h += lines_of(c, type.body_pt, width_mm) * body * 1.25;
  return h + body * 0.5;  // the last line's descenders
}

}  // namespace

ExhibitLayout compute_exhibit_layout(const ExhibitProject& project) {
  return compute_exhibit_layout(project, {});
}

ExhibitLayout compute_exhibit_layout(const ExhibitProject& project,
                                     const std::vector<Point>& terrain_ground) {
  ExhibitLayout L;
  sheet::PaperSize paper = sheet::oriented(sheet::paper_size(project.paper), project.landscape);
  L.paper_name = paper.name == "custom" ? project.paper : paper.name;
  L.page_w_mm = paper.width_mm;
  L.page_h_mm = paper.height_mm;
  L.type = type_scale_for(L.page_w_mm, L.page_h_mm);
  const double W = L.page_w_mm, H = L.page_h_mm;
  const double diag = std::hypot(W, H);
  L.margin_mm = 0.025 * std::min(W, H);
  const double m = L.margin_mm;
  const double gap = 0.5 * m;

  // Title band: title and subtitle lines at 1.25 x their size.
  double title_h = L.type.title_pt * kMmPerPt * 1.25;
  if (!project.subtitle.empty()) title_h += L.type.subtitle_pt * kMmPerPt * 1.3;
  L.title_box_mm = Box::of(m, m, W - m, m + title_h);

  // Furniture band: as tall as the notes need (they are the tallest column), at least a share
  // of the diagonal that keeps the colour bar, scale, arrow and inset legible (so it keeps pace
  // with the type), at most 30 % of the height on long, low banners.
  const double shares[4] = {0.28, 0.18, 0.18, 0.36};
  const double usable = W - 2 * m - 3 * gap;
  const double band_h = std::min(
      std::max(0.07 * diag, notes_height_mm(project, L.type, usable * shares[3])), 0.30 * H);
  const double band_top = H - m - band_h;
  const double map_top = L.title_box_mm.max_y + gap;
  const double map_bottom = band_top - gap;
  if (map_bottom - map_top < 0.2 * H) {
    throw_input_error(SourceLocation{project.file.string(), 0, 0, "paper"},
                      "paper too small for an exhibit's furniture; use a larger size");
  }
  const double avail_w = W - 2 * m, avail_h = map_bottom - map_top;

  // Scale: the project's, or the tidy scale at which the extent fits.
  const double exact =
      1000.0 * std::max(project.extent.width() / avail_w, project.extent.height() / avail_h);
  double scale = project.scale ? *project.scale : tidy_scale(exact);
  if (scale < exact * (1 - 1e-9)) {
    throw_input_error(SourceLocation{project.file.string(), 0, 0, "scale"},
                      fmt::format("the extent does not fit at 1:{:.0f} on {}; it needs 1:{:.0f} "
                                  "or smaller",
                                  scale, L.paper_name, std::ceil(exact)));
  }
  MapFrame& f = L.frame;
  set_crs(f, project);
  f.scale_denominator = scale;
  // The frame holds the extent at that scale and grows, centred on it, to fill the space for
  // the map as far as there is terrain to show (the DEM's footprint, when the caller read it):
  // the paper shows ground, not blank margins.
  f.ground = project.extent;
  if (terrain_ground.size() >= 3) {
    Box data;
    for (const Point& p : terrain_ground) data.add(p);
    // A millimetre on paper inside the data's edge: the relief reads a margin past the frame.
    data = data.expanded(-scale / 1000.0);
    const double room_w = avail_w * scale / 1000.0, room_h = avail_h * scale / 1000.0;
    auto grow = [](double lo, double hi, double room, double data_lo, double data_hi) {
      const double extra = std::max(0.0, room - (hi - lo));
      // Half the growth each side, the share a side cannot take (no terrain) to the other.
      double a = std::min(extra / 2, std::max(0.0, lo - data_lo));
      double b = std::min(extra - a, std::max(0.0, data_hi - hi));
      a = std::min(extra - b, std::max(0.0, lo - data_lo));
      return std::pair{lo - a, hi + b};
    };
    auto [x0, x1] = grow(f.ground.min_x, f.ground.max_x, room_w, data.min_x, data.max_x);
    auto [y0, y1] = grow(f.ground.min_y, f.ground.max_y, room_h, data.min_y, data.max_y);
    f.ground = Box::of(x0, y0, x1, y1);
  }
  const double w_mm = f.ground.width() * 1000.0 / scale;
  const double h_mm = f.ground.height() * 1000.0 / scale;
  f.page_origin_mm = {m + (avail_w - w_mm) / 2, map_top + (avail_h - h_mm) / 2};
  f.neatline = {{f.ground.min_x, f.ground.min_y},
                {f.ground.max_x, f.ground.min_y},
                {f.ground.max_x, f.ground.max_y},
                {f.ground.min_x, f.ground.max_y}};
  L.map_box_mm = f.page_box_mm();

  // Band columns, left to right: colour bar, scale and north, inset, notes.
  double x = m;
  Box* boxes[4] = {&L.colour_bar_box_mm, &L.scale_box_mm, &L.inset_box_mm, &L.notes_box_mm};
  for (int i = 0; i < 4; ++i) {
    const double w = usable * shares[i];
    *boxes[i] = Box::of(x, band_top, x + w, H - m);
    x += w + gap;
  }
  return L;
}

}  // namespace sheetmill::exhibit
