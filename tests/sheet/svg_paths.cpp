#include "svg_paths.hpp"

#include <cairo-svg.h>

#include <catch2/catch.hpp>
#include <sstream>

#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"
#include "support/test_env.hpp"

namespace sheetmill::test {

namespace {

std::string attribute(const std::string& tag, const std::string& name) {
  auto at = tag.find(" " + name + "=\"");
  if (at == std::string::npos) return "";
  auto start = at + name.size() + 3;
  return tag.substr(start, tag.find('"', start) - start);
}

std::string style_value(const std::string& style, const std::string& key) {
  auto at = style.find(key + ":");
  if (at == std::string::npos) return "";
  auto start = at + key.size() + 1;
  return style.substr(start, style.find(';', start) - start);
}

}  // namespace

std::vector<SvgPath> drawn_paths(double width_mm, double height_mm,
                                 const std::function<void(cairo_t*)>& scene,
                                 const std::string& svg_file) {
  {
    CairoSurfacePtr s(
        cairo_svg_surface_create(svg_file.c_str(), width_mm * kPtPerMm, height_mm * kPtPerMm));
    CairoPtr cr(cairo_create(s.get()));
    cairo_scale(cr.get(), kPtPerMm, kPtPerMm);
    scene(cr.get());
    REQUIRE(cairo_status(cr.get()) == CAIRO_STATUS_SUCCESS);
    cr.reset();
    cairo_surface_finish(s.get());
  }
  std::string svg = read_text(svg_file);
  std::vector<SvgPath> out;
  // Glyph outlines are defined in <defs> before the drawing's own group: start after them.
  std::size_t body = svg.find("<g id=\"surface");
  if (body == std::string::npos) body = 0;
  for (std::size_t at = svg.find("<path ", body); at != std::string::npos;
       at = svg.find("<path ", at + 1)) {
    std::string tag = svg.substr(at, svg.find("/>", at) - at);
    std::string style = attribute(tag, "style");
    if (style.empty()) continue;
    SvgPath p;
    p.fill_colour = style_value(style, "fill");
    p.filled = !p.fill_colour.empty() && p.fill_colour != "none";
    if (!p.filled) p.fill_colour.clear();
    p.stroke_colour = style_value(style, "stroke");
    p.stroked = !p.stroke_colour.empty() && p.stroke_colour != "none";
    // Cairo writes user-space coordinates (mm) under transform="matrix(k,0,0,k,0,0)" with
    // k = pt per mm, or device coordinates (pt) without a transform.
    double k = attribute(tag, "transform").empty() ? kMmPerPt : 1.0;
    std::istringstream d(attribute(tag, "d"));
    std::string cmd;
    while (d >> cmd) {
      if (cmd == "M") p.subpaths.emplace_back();
      if (cmd == "M" || cmd == "L") {
        double x = 0, y = 0;
        d >> x >> y;
        p.subpaths.back().push_back({x * k, y * k});
      } else if (cmd == "C") {
        p.has_curves = true;
        double skip = 0;
        for (int i = 0; i < 6; ++i) d >> skip;
      }
    }
    out.push_back(std::move(p));
  }
  return out;
}

}  // namespace sheetmill::test
