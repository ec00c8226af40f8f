#include "sheet/typeset.hpp"

#include <algorithm>
#include <cmath>

#include "sheetmill/core/units.hpp"

namespace sheetmill::sheet {

text::TextPaint paint_of(const style::LabelStyle& style) {
  text::TextPaint p;
  p.colour = style.colour;
  if (style.halo) {
    p.halo = true;
    p.halo_colour = style.halo->colour;
    p.halo_width_mm = style.halo->width_mm;
  }
  return p;
}

SetLine set_line(text::FontCache& fonts, const style::LabelStyle& style,
                 const std::vector<Piece>& pieces) {
  SetLine line;
  for (const auto& p : pieces) {
    if (p.text.empty()) continue;
    auto s = text::shape(fonts, style.font, p.size_pt, p.text, style.letter_spacing_em);
    line.width_mm += s.width_mm;
    line.ascent_mm = std::max(line.ascent_mm, s.ascent_mm);
    line.descent_mm = std::max(line.descent_mm, s.descent_mm);
    line.em_mm = std::max(line.em_mm, p.size_pt * kMmPerPt);
    line.shaped.push_back(std::move(s));
  }
  return line;
}

Box draw_set_line(cairo_t* cr, const SetLine& line, const style::LabelStyle& style, Point origin,
                  double angle_rad) {
  auto paint = paint_of(style);
  Point along{std::cos(angle_rad), std::sin(angle_rad)};
  Point up{along.y, -along.x};  // the glyphs' up direction
  double x = 0;
  for (const auto& s : line.shaped) {
    text::draw_text(cr, s, origin + along * x, angle_rad, paint);
    x += s.width_mm;
  }
  Box b;
  for (Point c : {origin + up * line.ascent_mm, origin - up * line.descent_mm}) {
    b.add(c);
    b.add(c + along * line.width_mm);
  }
  return b;
}

Point align(const SetLine& line, Point anchor, HAlign h, VAlign v) {
  Point o = anchor;
  if (h == HAlign::centre) o.x -= line.width_mm / 2;
  if (h == HAlign::right) o.x -= line.width_mm;
  switch (v) {
    case VAlign::baseline:
      break;
    case VAlign::top:
      o.y += line.ascent_mm;
      break;
    case VAlign::bottom:
      o.y -= line.descent_mm;
      break;
    // Figures and capitals stand about 0.73 em tall in the faces we use (DejaVu, Noto);
    // centring on them, not on the font's full ascent, centres a label on a grid line.
    case VAlign::middle:
      o.y += line.em_mm * 0.365;
      break;
  }
  return o;
}

Box draw_label(cairo_t* cr, text::FontCache& fonts, const style::LabelStyle& style,
               const std::string& text, Point anchor, HAlign h, VAlign v, double size_pt) {
  if (text.empty()) return {};
  SetLine line = set_line(fonts, style, {{text, size_pt > 0 ? size_pt : style.size_pt}});
  return draw_set_line(cr, line, style, align(line, anchor, h, v));
}

std::vector<std::string> wrap_words(text::FontCache& fonts, const style::LabelStyle& style,
                                    const std::string& text, double width_mm, double size_pt) {
  std::vector<std::string> words;
  std::string w;
  for (char c : text) {
    if (c == ' ' || c == '\n') {
      if (!w.empty()) words.push_back(w);
      w.clear();
      if (c == '\n') words.push_back("\n");
    } else {
      w += c;
    }
  }
  if (!w.empty()) words.push_back(w);
  std::vector<std::string> lines;
  std::string current;
  auto flush = [&]() {
    if (!current.empty()) lines.push_back(current);
    current.clear();
  };
  for (const auto& word : words) {
    if (word == "\n") {
      flush();
      continue;
    }
    std::string trial = current.empty() ? word : current + " " + word;
    auto s = text::shape(fonts, style.font, size_pt, trial, style.letter_spacing_em);
    if (s.width_mm > width_mm && !current.empty()) {
      flush();
      current = word;
    } else {
      current = trial;
    }
  }
  flush();
  return lines;
}

double draw_paragraph(cairo_t* cr, text::FontCache& fonts, const style::LabelStyle& style,
                      const std::string& text, Point top_left, double width_mm, double size_pt,
                      double leading) {
  double size = size_pt > 0 ? size_pt : style.size_pt;
  double line_h = size * kMmPerPt * leading;
  double y = top_left.y + size * kMmPerPt * 0.8;
  for (const auto& line : wrap_words(fonts, style, text, width_mm, size)) {
    draw_label(cr, fonts, style, line, {top_left.x, y}, HAlign::left, VAlign::baseline, size);
    y += line_h;
  }
  return y - size * kMmPerPt * 0.8;
}

}  // namespace sheetmill::sheet
