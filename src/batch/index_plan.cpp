#include "sheetmill/batch/index_plan.hpp"

#include <fmt/format.h>
#include <ogr_geometry.h>
#include <ogr_spatialref.h>

#include <array>
#include <cmath>
#include <map>
#include <memory>
#include <set>

#include "sheetmill/config/bounds.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/log.hpp"

namespace sheetmill::batch {

namespace {

constexpr long kMaxSheets = 1000000;
constexpr int kDensifyPerEdge = 16;  // graticule edges are curves in the sheet CRS

struct Cell {
  int i = 0;                  // lattice column (west to east)
  int j = 0;                  // lattice row (south to north)
  Box box;                    // lattice units: metres (grid) or degrees (graticule)
  std::vector<Point> ring;    // in the sheet CRS (graticule: densified edges), for the area test
  std::vector<Point> stored;  // as written to the index: sheet CRS (grid) or lon/lat corners
};

std::string format_km(double m) {
  double km = m / 1000.0;
  if (std::abs(km - std::round(km)) < 1e-9)
    return fmt::format("{}", static_cast<long>(std::round(km)));
  return fmt::format("{:g}", km);
}

// Expands the ID/name templates (see IndexSpec).
std::string expand_sheet_template(const std::string& t, const IndexSheet& s, const Cell& c,
                                  IndexAlignment alignment, const std::string& id) {
  std::string out;
  for (std::size_t i = 0; i < t.size(); ++i) {
    if (t[i] != '{') {
      out.push_back(t[i]);
      continue;
    }
    std::size_t close = t.find('}', i);
    if (close == std::string::npos)
      throw_input_error("--id-template", "unclosed { in \"" + t + "\"");
    std::string token = t.substr(i + 1, close - i - 1);
    i = close;
    int pad = 0;
    if (auto colon = token.find(':'); colon != std::string::npos) {
      try {
        pad = std::stoi(token.substr(colon + 1));
      } catch (const std::exception&) {
        throw_input_error("--id-template", "expected {field:WIDTH} in \"" + t + "\"");
      }
      if (pad < 0 || pad > config::bounds::max_id_pad_digits) {
        throw_input_error(
            "--id-template",
            fmt::format("expected a WIDTH from 0 to {} in {{field:WIDTH}}, got \"{}\"",
                        config::bounds::max_id_pad_digits, t));
      }
      token = token.substr(0, colon);
    }
    std::string v;
    if (token == "row") {
      v = std::to_string(s.row);
    } else if (token == "col") {
      v = std::to_string(s.col);
    } else if (token == "row_a") {
      v = letters_for(s.row);
    } else if (token == "col_a") {
      v = letters_for(s.col);
    } else if (token == "id" && !id.empty()) {
      v = id;
    } else if ((token == "e_km" || token == "n_km") && alignment == IndexAlignment::grid) {
      v = format_km(token == "e_km" ? c.box.min_x : c.box.min_y);
    } else if ((token == "lon" || token == "lat") && alignment == IndexAlignment::graticule) {
      v = fmt::format("{:.4f}", token == "lon" ? c.box.min_x : c.box.min_y);
      while (v.back() == '0') v.pop_back();
      if (v.back() == '.') v.pop_back();
    } else {
      throw_input_error("--id-template", "{" + token + "} is not a field this template can use");
    }
    if (static_cast<int>(v.size()) < pad)
      v.insert(0, static_cast<std::size_t>(pad) - v.size(), '0');
    out += v;
  }
  return out;
}

std::unique_ptr<OGRSpatialReference> parse_crs(const std::string& text) {
  auto srs = std::make_unique<OGRSpatialReference>();
  GdalErrorScope errors;  // PROJ's own message stays out of the terminal
  if (text.empty() || srs->SetFromUserInput(text.c_str()) != OGRERR_NONE) {
    throw_input_error("--crs", "expected a CRS such as EPSG:32633, got \"" + text + "\"");
  }
  srs->SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  return srs;
}

// Lattice cells [i0, i1] x [j0, j1], computed in double, are refused beyond kMaxSheets (a
// frame "at this scale" or graticule cell "at this size" far too small for the area) or beyond
// the range of a cell number, before any is made or cast.
std::array<long, 4> lattice_range(double i0, double i1, double j0, double j1, const char* at_this) {
  if (!((i1 - i0 + 1) * (j1 - j0 + 1) <= static_cast<double>(kMaxSheets))) {
    throw_input_error("--extent",
                      std::string("the area needs more than a million sheets at this ") + at_this);
  }
  for (double v : {i0, i1, j0, j1}) {
    if (!(std::abs(v) < 1e9)) {
      throw_input_error("--extent", std::string("the area lies more than a billion sheets from "
                                                "the CRS's origin at this ") +
                                        at_this);
    }
  }
  return {static_cast<long>(i0), static_cast<long>(i1), static_cast<long>(j0),
          static_cast<long>(j1)};
}

std::vector<Cell> grid_cells(const IndexSpec& spec, IndexPlan& plan) {
  double snap = spec.snap_m;
  if (!(snap > 0)) throw_input_error("--snap", "expected a positive ground length");
  double want_w = spec.frame_width_mm * spec.scale_denominator / 1000.0;
  double want_h = spec.frame_height_mm * spec.scale_denominator / 1000.0;
  double w = std::floor(want_w / snap + 1e-9) * snap;
  double h = std::floor(want_h / snap + 1e-9) * snap;
  if (w <= 0 || h <= 0) {
    throw_input_error("--frame", fmt::format("a {:g} x {:g} mm frame at 1:{:g} is {:g} x {:g} m, "
                                             "smaller than the {:g} m snap",
                                             spec.frame_width_mm, spec.frame_height_mm,
                                             spec.scale_denominator, want_w, want_h, snap));
  }
  double want_overlap = spec.overlap_mm * spec.scale_denominator / 1000.0;
  double overlap = std::round(want_overlap / snap) * snap;
  if (overlap < 0 || overlap >= std::min(w, h)) {
    throw_input_error("--overlap", "the overlap must be at least 0 and less than the frame");
  }
  if (std::abs(w - want_w) > 1e-6 || std::abs(h - want_h) > 1e-6 ||
      std::abs(overlap - want_overlap) > 1e-6) {
    log::info("index: frames are {:g} x {:g} m with {:g} m overlap so corners fall on whole {:g} m",
              w, h, overlap, snap);
  }
  plan.frame_width_m = w;
  plan.frame_height_m = h;
  plan.overlap_m = overlap;
  double step_x = w - overlap;
  double step_y = h - overlap;
  const Box& a = spec.area;
  // Lattice cell i covers [i*step, i*step + size]; keep those overlapping the area's interior.
  auto [i0, i1, j0, j1] = lattice_range(
      std::floor((a.min_x - w) / step_x) + 1, std::ceil(a.max_x / step_x) - 1,
      std::floor((a.min_y - h) / step_y) + 1, std::ceil(a.max_y / step_y) - 1, "scale");
  std::vector<Cell> cells;
  for (long j = j0; j <= j1; ++j) {
    for (long i = i0; i <= i1; ++i) {
      Cell c;
      c.i = static_cast<int>(i);
      c.j = static_cast<int>(j);
      c.box = Box::of(i * step_x, j * step_y, i * step_x + w, j * step_y + h);
      c.ring = {{c.box.min_x, c.box.min_y},
                {c.box.max_x, c.box.min_y},
                {c.box.max_x, c.box.max_y},
                {c.box.min_x, c.box.max_y}};
      c.stored = c.ring;
      cells.push_back(std::move(c));
    }
  }
  return cells;
}

std::vector<Cell> graticule_cells(const IndexSpec& spec, const OGRSpatialReference& srs,
                                  IndexPlan& plan) {
  if (!(spec.cell_width_min > 0) || !(spec.cell_height_min > 0)) {
    throw_input_error("--graticule", "expected positive cell sizes in minutes");
  }
  std::unique_ptr<OGRSpatialReference> geog(srs.CloneGeogCS());
  geog->SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  CoordinateTransformPtr to_geog(OGRCreateCoordinateTransformation(&srs, geog.get()));
  CoordinateTransformPtr to_crs(OGRCreateCoordinateTransformation(geog.get(), &srs));
  if (!to_geog || !to_crs) throw_input_error("--crs", "cannot relate the CRS to its datum");
  // Graticule sheets are stored in longitude and latitude: their edges are meridians and
  // parallels, which the renderer densifies when it projects them.
  plan.crs_wkt = crs_wkt(*geog, "WKT2_2018");
  Box g;
  if (srs.IsGeographic()) {
    g = spec.area;
  } else if (!to_geog->TransformBounds(spec.area.min_x, spec.area.min_y, spec.area.max_x,
                                       spec.area.max_y, &g.min_x, &g.min_y, &g.max_x, &g.max_y,
                                       21)) {
    throw_input_error("--extent", "the area cannot be expressed in longitude and latitude");
  }
  double dx = spec.cell_width_min / 60.0;
  double dy = spec.cell_height_min / 60.0;
  auto [i0, i1, j0, j1] =
      lattice_range(std::floor(g.min_x / dx), std::ceil(g.max_x / dx) - 1, std::floor(g.min_y / dy),
                    std::ceil(g.max_y / dy) - 1, "size");
  std::vector<Cell> cells;
  for (long j = j0; j <= j1; ++j) {
    for (long i = i0; i <= i1; ++i) {
      Cell c;
      c.i = static_cast<int>(i);
      c.j = static_cast<int>(j);
      // Corners from whole multiples of the minutes, so 2.5' cells do not drift.
      double w = i * spec.cell_width_min / 60.0, e = (i + 1) * spec.cell_width_min / 60.0;
      double s = j * spec.cell_height_min / 60.0, n = (j + 1) * spec.cell_height_min / 60.0;
      c.box = Box::of(w, s, e, n);
      std::vector<double> xs, ys;
      auto edge = [&](Point p0, Point p1) {
        for (int k = 0; k < kDensifyPerEdge; ++k) {
          double t = double(k) / kDensifyPerEdge;
          xs.push_back(p0.x + (p1.x - p0.x) * t);
          ys.push_back(p0.y + (p1.y - p0.y) * t);
        }
      };
      edge({w, s}, {e, s});
      edge({e, s}, {e, n});
      edge({e, n}, {w, n});
      edge({w, n}, {w, s});
      if (!srs.IsGeographic() &&
          !to_crs->Transform(static_cast<int>(xs.size()), xs.data(), ys.data())) {
        throw_input_error("--graticule", "a graticule cell cannot be projected to the CRS");
      }
      for (std::size_t k = 0; k < xs.size(); ++k) c.ring.push_back({xs[k], ys[k]});
      c.stored = {{w, s}, {e, s}, {e, n}, {w, n}};
      cells.push_back(std::move(c));
    }
  }
  return cells;
}

OGRPolygon ring_polygon(const std::vector<Point>& ring) {
  OGRPolygon poly;
  OGRLinearRing r;
  for (const Point& p : ring) r.addPoint(p.x, p.y);
  r.closeRings();
  poly.addRing(&r);
  return poly;
}

}  // namespace

std::string letters_for(int n) {
  std::string s;
  while (n > 0) {
    --n;
    s.insert(s.begin(), static_cast<char>('A' + n % 26));
    n /= 26;
  }
  return s;
}

IndexPlan plan_tile_index(const IndexSpec& spec) {
  gdal_init();
  if (!(spec.scale_denominator > 0)) throw_input_error("--scale", "expected a positive scale");
  if (spec.area.empty() || spec.area.width() <= 0 || spec.area.height() <= 0) {
    throw_input_error("--extent", "the area of interest is empty");
  }
  auto srs = parse_crs(spec.crs);
  IndexPlan plan;
  plan.crs_wkt = crs_wkt(*srs, "WKT2_2018");
  std::vector<Cell> cells;
  if (spec.alignment == IndexAlignment::grid) {
    if (srs->IsGeographic()) {
      throw_input_error("--crs", "grid alignment needs a projected CRS (or use --graticule)");
    }
    cells = grid_cells(spec, plan);
  } else {
    cells = graticule_cells(spec, *srs, plan);
  }

  // Keep the cells that meet the area's polygons (all cells when only a box was given).
  std::vector<std::unique_ptr<OGRGeometry>> polygons;
  for (const std::string& wkt : spec.area_polygons_wkt) {
    OGRGeometry* g = nullptr;
    if (OGRGeometryFactory::createFromWkt(wkt.c_str(), nullptr, &g) != OGRERR_NONE || !g) {
      throw_internal_error("area polygon is not valid WKT");
    }
    polygons.emplace_back(g);
  }
  std::vector<Cell> kept;
  for (Cell& c : cells) {
    OGRPolygon poly = ring_polygon(c.ring);
    OGREnvelope env;
    poly.getEnvelope(&env);
    Box b = Box::of(env.MinX, env.MinY, env.MaxX, env.MaxY);
    bool meets = b.min_x < spec.area.max_x && b.max_x > spec.area.min_x &&
                 b.min_y < spec.area.max_y && b.max_y > spec.area.min_y;
    if (meets && !polygons.empty()) {
      meets = false;
      for (const auto& area : polygons) {
        if (poly.Intersects(area.get()) && !poly.Touches(area.get())) {
          meets = true;
          break;
        }
      }
    }
    if (meets) kept.push_back(std::move(c));
  }
  if (kept.empty()) throw_input_error("--extent", "no sheet meets the area of interest");

  int max_j = kept.front().j, min_i = kept.front().i;
  for (const Cell& c : kept) {
    max_j = std::max(max_j, c.j);
    min_i = std::min(min_i, c.i);
  }
  std::map<std::pair<int, int>, std::size_t> at;  // (row, col) -> sheet
  std::set<std::string> ids;
  for (const Cell& c : kept) {
    IndexSheet s;
    s.row = max_j - c.j + 1;
    s.col = c.i - min_i + 1;
    s.id = expand_sheet_template(spec.id_template, s, c, spec.alignment, "");
    s.name = expand_sheet_template(spec.name_template, s, c, spec.alignment, s.id);
    if (!ids.insert(s.id).second) {
      throw_input_error("--id-template", "the template \"" + spec.id_template +
                                             "\" gives two sheets the ID \"" + s.id +
                                             "\"; use {row} and {col} (or more digits)");
    }
    s.ring = c.stored;
    at[{s.row, s.col}] = plan.sheets.size();
    plan.sheets.push_back(std::move(s));
  }
  // n s e w ne nw se sw, as (drow, dcol); rows count southwards.
  static constexpr int kOffsets[8][2] = {{-1, 0}, {1, 0},   {0, 1}, {0, -1},
                                         {-1, 1}, {-1, -1}, {1, 1}, {1, -1}};
  for (IndexSheet& s : plan.sheets) {
    for (int k = 0; k < 8; ++k) {
      auto it = at.find({s.row + kOffsets[k][0], s.col + kOffsets[k][1]});
      if (it != at.end()) s.neighbours[k] = plan.sheets[it->second].id;
    }
  }
  std::sort(plan.sheets.begin(), plan.sheets.end(), [](const IndexSheet& a, const IndexSheet& b) {
    return a.row != b.row ? a.row < b.row : a.col < b.col;
  });
  return plan;
}

}  // namespace sheetmill::batch
