#include "sheetmill/render/plates.hpp"

#include <fmt/format.h>

#include <system_error>

#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/file_writer.hpp"
#include "sheetmill/print/plate.hpp"
#include "sheetmill/render/feature_layers.hpp"

namespace sheetmill::render {

namespace {

namespace fs = std::filesystem;

// Does this colour put ink on the plate? (A plate style draws ink as grey, the rest white.)
bool inks(const Colour& c) {
  return c.a > 0 && (c.r < 0.999 || c.g < 0.999 || c.b < 0.999);
}

bool inks(const style::Stroke& s) {
  return inks(s.colour);
}

bool inks(const style::PointSymbol& p) {
  for (const auto& part : p.parts)
    if ((part.fill && inks(*part.fill)) || (part.outline && inks(*part.outline))) return true;
  return false;
}

bool inks(const style::LabelStyle& l) {
  return inks(l.colour) || (l.halo && inks(l.halo->colour));
}

bool inks(const style::Layer& layer) {
  if (layer.label && inks(*layer.label)) return true;
  for (const style::Rule& r : layer.rules) {
    if (r.label && inks(*r.label)) return true;
    if (r.point && inks(*r.point)) return true;
    if (r.line) {
      for (const auto& s : r.line->strokes)
        if (inks(s)) return true;
      for (const auto& m : r.line->marks)
        if (m.symbol ? inks(*m.symbol) : inks(m.stroke)) return true;  // a symbol replaces the tick
    }
    if (r.area) {
      const auto& a = *r.area;
      if ((a.fill && inks(*a.fill)) || (a.outline && inks(*a.outline))) return true;
      for (const auto& h : a.hatches)
        if (inks(h.stroke)) return true;
      if (a.pattern && inks(a.pattern->symbol)) return true;
    }
  }
  return false;
}

bool inks(const style::LineSymbol& l) {
  for (const auto& s : l.strokes)
    if (inks(s)) return true;
  return false;
}

std::vector<std::string> layers_on(const style::Style& plate, double scale) {
  std::vector<std::string> names;
  if (plate.relief.hillshade) names.push_back("relief");
  if (inks(plate.contours.line) || inks(plate.contours.index_line) || inks(plate.contours.label))
    names.push_back("contours");
  for (const style::Layer& l : plate.layers)
    if (layer_visible(l, scale) && inks(l)) names.push_back(l.id);
  if (inks(plate.grid.line) || inks(plate.grid.label)) names.push_back("grid");
  if (inks(plate.furniture.neatline) || inks(plate.furniture.title) || inks(plate.furniture.body))
    names.push_back("collar");
  return names;
}

// Puts the finished temporary folder in place of `dir` (an old DIR goes only once the new one
// is there).
void replace_folder(const fs::path& temp, const fs::path& dir) {
  std::error_code ec;
  fs::path old;
  if (fs::exists(fs::symlink_status(dir))) {
    if (!fs::is_directory(fs::symlink_status(dir))) {
      throw_input_error(dir.string(),
                        "expected a folder for the plates, found another kind of file");
    }
    old = sibling_temp_path(dir, "old");
    fs::rename(dir, old, ec);
    if (ec) throw_input_error(dir.string(), "cannot replace the plates folder: " + ec.message());
  }
  fs::rename(temp, dir, ec);
  if (ec) {
    if (!old.empty()) fs::rename(old, dir);
    throw_input_error(dir.string(), "cannot put the plates folder in place: " + ec.message());
  }
  if (!old.empty()) fs::remove_all(old, ec);
}

// Removes the temporary folder unless it was renamed into place.
struct TempFolder {
  fs::path path;
  bool kept = false;
  ~TempFolder() {
    std::error_code ec;
    if (!kept) fs::remove_all(path, ec);
  }
};

}  // namespace

std::vector<PlateReport> render_plates(const project::Project& project, const style::Style& style,
                                       const fs::path& dir_as_given, double dpi,
                                       const RenderOptions& options) {
  const fs::path dir =
      dir_as_given.has_filename() ? dir_as_given : dir_as_given.parent_path();  // "out/plates/"
  if (style.press.inks.empty()) {
    throw_input_error(style.file.string(),
                      "press.inks: --plates needs the style to name its inks (docs/style.md)");
  }
  fs::path parent = dir.parent_path().empty() ? fs::path(".") : dir.parent_path();
  if (!fs::is_directory(parent)) {
    throw_input_error(dir.string(), "the folder it would go in does not exist");
  }
  TempFolder temp{sibling_temp_path(dir, "plates")};
  std::error_code ec;
  fs::create_directory(temp.path, ec);
  if (ec) throw_input_error(dir.string(), "cannot create the plates folder: " + ec.message());

  std::vector<PlateReport> plates;
  const std::size_t n = style.press.inks.size();
  for (std::size_t i = 0; i < n; ++i) {
    const style::Ink& ink = style.press.inks[i];
    style::Style plate_style = style::load_style(style.file, ink.name);
    RenderOptions o = options;
    o.format = OutputFormat::geotiff;
    o.raster_dpi = dpi;
    o.print_profile.reset();
    const fs::path render = temp.path / (ink.name + ".render.tif");
    render_sheet(project, plate_style, render, o);
    PlateReport p;
    p.ink = ink.name;
    p.file = fmt::format("{}-{}.tif", i + 1, ink.name);
    print::PlateMarks marks;
    marks.label = fmt::format("Plate {} of {}: {}   {}", i + 1, n, ink.name, project.title);
    marks.margin_mm = style.furniture.margin_mm;
    marks.dpi = dpi;
    print::write_plate(render, temp.path / p.file, marks, (dir / p.file).string());
    fs::remove(render, ec);
    p.mean_coverage = print::mean_coverage(temp.path / p.file);
    p.layers = layers_on(plate_style, project.scale);
    plates.push_back(std::move(p));
  }
  {
    FileWriter report(temp.path / "plates.txt", (dir / "plates.txt").string());
    report.write(describe_plates(plates, style, dpi));
    report.close();
  }
  replace_folder(temp.path, dir);
  temp.kept = true;
  return plates;
}

std::string describe_plates(const std::vector<PlateReport>& plates, const style::Style& style,
                            double dpi) {
  std::string s =
      fmt::format("Plates of {} at {:.0f} dpi: 8-bit ink coverage, 0 = paper, 255 = 100 % ink.\n",
                  style.name, dpi);
  for (std::size_t i = 0; i < plates.size(); ++i) {
    const PlateReport& p = plates[i];
    const style::Ink& ink = style.press.inks[i];
    s += fmt::format("{}: ink {} (as CMYK {:.0f}/{:.0f}/{:.0f}/{:.0f}), mean coverage {:.1f} %\n",
                     p.file.string(), p.ink, ink.cmyk.c * 100, ink.cmyk.m * 100, ink.cmyk.y * 100,
                     ink.cmyk.k * 100, p.mean_coverage * 100);
    s += "  layers: ";
    for (std::size_t k = 0; k < p.layers.size(); ++k) s += (k ? ", " : "") + p.layers[k];
    s += p.layers.empty() ? "none\n" : "\n";
  }
  return s;
}

}  // namespace sheetmill::render
