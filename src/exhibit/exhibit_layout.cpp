#include "sheetmill/exhibit/exhibit_layout.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/units.hpp"
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

ExhibitLayout compute_exhibit_layout(const ExhibitProject& project) {
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

  // Furniture band: a share of the diagonal (so it keeps pace with the type), at most 30 % of
  // the height on long, low banners.
  const double band_h = std::min(0.11 * diag, 0.30 * H);
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
  // The frame is the extent itself at that scale, centred in the space for the map: no relief
  // is asked for beyond what the project chose to show.
  const double w_mm = project.extent.width() * 1000.0 / scale;
  const double h_mm = project.extent.height() * 1000.0 / scale;
  f.ground = project.extent;
  f.page_origin_mm = {m + (avail_w - w_mm) / 2, map_top + (avail_h - h_mm) / 2};
  f.neatline = {{f.ground.min_x, f.ground.min_y},
                {f.ground.max_x, f.ground.min_y},
                {f.ground.max_x, f.ground.max_y},
                {f.ground.min_x, f.ground.max_y}};
  L.map_box_mm = f.page_box_mm();

  // Band columns, left to right: colour bar, scale and north, inset, notes.
  const double shares[4] = {0.28, 0.18, 0.18, 0.36};
  const double usable = W - 2 * m - 3 * gap;
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
