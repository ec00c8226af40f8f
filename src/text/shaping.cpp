#include "sheetmill/text/shaping.hpp"

#include <cairo.h>
#include <hb.h>

#include <cmath>

#include "sheetmill/core/units.hpp"
#include "text/itemise.hpp"

namespace sheetmill::text {

bool is_valid_utf8(std::string_view s) {
  return detail::valid_utf8(s);
}

ShapedText shape(FontCache& fonts, const FontKey& key, double size_pt, std::string_view utf8,
                 double letter_spacing_em) {
  ShapedText out;
  // Ill-formed bytes become U+FFFD: HarfBuzz would shape them so, and cairo refuses a text
  // that is not UTF-8 (callers that can name the source check first: is_valid_utf8).
  out.utf8 = detail::sanitised_utf8(utf8);
  out.size_pt = size_pt;
  const double size_mm = size_pt * kMmPerPt;
  double pen = 0;
  const Font& primary = fonts.primary(key);
  out.ascent_mm = primary.ascender_em() * size_mm;
  out.descent_mm = primary.descender_em() * size_mm;
  HbBufferPtr buf(hb_buffer_create());
  // Spans come in visual order, each in one direction: HarfBuzz lays a right-to-left span's
  // glyphs out left to right too, so the pen only ever moves right.
  for (const detail::Span& span : detail::itemise(fonts, key, out.utf8)) {
    hb_buffer_clear_contents(buf.get());
    // The whole text is context; only the span is shaped, so clusters are offsets into utf8.
    hb_buffer_add_utf8(buf.get(), out.utf8.data(), static_cast<int>(out.utf8.size()), span.begin,
                       static_cast<int>(span.end - span.begin));
    hb_buffer_set_direction(buf.get(), span.rtl ? HB_DIRECTION_RTL : HB_DIRECTION_LTR);
    hb_buffer_guess_segment_properties(buf.get());  // the script (and language) of the span
    hb_shape(span.font->hb(), buf.get(), nullptr, 0);
    unsigned n = 0;
    hb_glyph_info_t* info = hb_buffer_get_glyph_infos(buf.get(), &n);
    hb_glyph_position_t* pos = hb_buffer_get_glyph_positions(buf.get(), &n);
    const double k = size_mm / span.font->units_per_em();
    ShapedRun run;
    run.font = span.font;
    run.byte_begin = span.begin;
    run.byte_end = span.end;
    for (unsigned g = 0; g < n; ++g) {
      ShapedGlyph sg;
      sg.glyph_id = info[g].codepoint;
      sg.cluster = info[g].cluster;
      sg.pen_mm = pen;
      sg.x_mm = pen + pos[g].x_offset * k;
      sg.y_mm = -pos[g].y_offset * k;
      sg.advance_mm = pos[g].x_advance * k;
      pen += sg.advance_mm;
      bool cluster_ends = g + 1 == n || info[g + 1].cluster != info[g].cluster;
      if (letter_spacing_em != 0 && cluster_ends) pen += letter_spacing_em * size_mm;
      run.glyphs.push_back(sg);
    }
    out.ascent_mm = std::max(out.ascent_mm, span.font->ascender_em() * size_mm);
    out.descent_mm = std::max(out.descent_mm, span.font->descender_em() * size_mm);
    out.runs.push_back(std::move(run));
  }
  // Letter spacing is between letters: none after the last one.
  if (letter_spacing_em != 0 && !out.runs.empty()) pen -= letter_spacing_em * size_mm;
  out.width_mm = pen;
  return out;
}

namespace {

// Glyphs and clusters of one run for cairo_show_text_glyphs, so the PDF carries the text itself
// (searchable, selectable), not just glyph shapes.
struct CairoRun {
  std::vector<cairo_glyph_t> glyphs;
  std::vector<cairo_text_cluster_t> clusters;
  cairo_text_cluster_flags_t flags = cairo_text_cluster_flags_t(0);
  bool clusters_ok = true;
};

CairoRun cairo_run(const ShapedRun& run, double dx, double dy) {
  CairoRun cr;
  for (const auto& g : run.glyphs) {
    cr.glyphs.push_back({g.glyph_id, dx + g.x_mm, dy + g.y_mm});
  }
  const auto& gl = run.glyphs;
  if (gl.empty()) return cr;
  // Clusters go through the text forwards; for a right-to-left run (clusters falling along the
  // glyphs) cairo's BACKWARD flag maps them to the glyphs from the end.
  const bool backward = gl.size() > 1 && gl.front().cluster > gl.back().cluster;
  if (backward) cr.flags = CAIRO_TEXT_CLUSTER_FLAG_BACKWARD;
  const std::size_t n = gl.size();
  auto glyph_at = [&](std::size_t k) -> const ShapedGlyph& { return gl[backward ? n - 1 - k : k]; };
  std::size_t i = 0;
  while (i < n) {
    std::size_t j = i;
    while (j < n && glyph_at(j).cluster == glyph_at(i).cluster) ++j;
    const uint32_t start = glyph_at(i).cluster;
    const uint32_t next = j < n ? glyph_at(j).cluster : run.byte_end;
    if (next <= start) {  // not monotonic (should not happen): glyphs only, no text
      cr.clusters_ok = false;
      break;
    }
    cr.clusters.push_back({static_cast<int>(next - start), static_cast<int>(j - i)});
    i = j;
  }
  return cr;
}

void set_colour(cairo_t* cr, const Colour& c) {
  cairo_set_source_rgba(cr, c.r, c.g, c.b, c.a);
}

// One font set-up for the halo's path and the fill: the face at `size_mm`, no hinting and no
// hinted metrics, so both come from the same unhinted outlines at the same positions whatever
// the surface (recording in mm, PDF, image); see LoadedFont in font.cpp.
void use_font(cairo_t* cr, const Font& font, double size_mm) {
  static cairo_font_options_t* const options = [] {
    cairo_font_options_t* o = cairo_font_options_create();
    cairo_font_options_set_hint_style(o, CAIRO_HINT_STYLE_NONE);
    cairo_font_options_set_hint_metrics(o, CAIRO_HINT_METRICS_OFF);
    return o;
  }();
  cairo_set_font_face(cr, font.cairo_face());
  cairo_set_font_size(cr, size_mm);
  cairo_set_font_options(cr, options);
}

void show_run(cairo_t* cr, const std::string& utf8, const ShapedRun& run, const CairoRun& g) {
  const uint32_t first = g.flags ? run.glyphs.back().cluster : run.glyphs.front().cluster;
  if (g.clusters_ok && !g.clusters.empty()) {
    int bytes = 0;
    for (const auto& c : g.clusters) bytes += c.num_bytes;
    cairo_show_text_glyphs(cr, utf8.data() + first, bytes, g.glyphs.data(),
                           static_cast<int>(g.glyphs.size()), g.clusters.data(),
                           static_cast<int>(g.clusters.size()), g.flags);
  } else {
    cairo_show_glyphs(cr, g.glyphs.data(), static_cast<int>(g.glyphs.size()));
  }
}

void paint_runs(cairo_t* cr, const ShapedText& text, const std::vector<CairoRun>& runs,
                const TextPaint& paint) {
  const double size_mm = text.size_pt * kMmPerPt;
  if (paint.halo && paint.halo_width_mm > 0) {
    cairo_save(cr);
    cairo_new_path(cr);
    for (std::size_t r = 0; r < runs.size(); ++r) {
      use_font(cr, *text.runs[r].font, size_mm);
      cairo_glyph_path(cr, runs[r].glyphs.data(), static_cast<int>(runs[r].glyphs.size()));
    }
    set_colour(cr, paint.halo_colour);
    cairo_set_line_width(cr, 2 * paint.halo_width_mm);
    cairo_set_line_join(cr, CAIRO_LINE_JOIN_ROUND);
    cairo_stroke(cr);
    cairo_restore(cr);
  }
  set_colour(cr, paint.colour);
  for (std::size_t r = 0; r < runs.size(); ++r) {
    use_font(cr, *text.runs[r].font, size_mm);
    show_run(cr, text.utf8, text.runs[r], runs[r]);
  }
}

}  // namespace

void draw_text(cairo_t* cr, const ShapedText& text, Point origin_mm, double angle_rad,
               const TextPaint& paint) {
  if (text.empty()) return;
  cairo_save(cr);
  cairo_translate(cr, origin_mm.x, origin_mm.y);
  cairo_rotate(cr, angle_rad);
  std::vector<CairoRun> runs;
  for (const auto& run : text.runs) runs.push_back(cairo_run(run, 0, 0));
  paint_runs(cr, text, runs, paint);
  cairo_restore(cr);
}

void draw_placed_glyphs(cairo_t* cr, const ShapedText& text, const std::vector<PlacedGlyph>& glyphs,
                        const TextPaint& paint) {
  const double size_mm = text.size_pt * kMmPerPt;
  // Two passes so no glyph's halo covers a neighbour's ink.
  for (int pass = paint.halo ? 0 : 1; pass < 2; ++pass) {
    for (const auto& pg : glyphs) {
      const ShapedRun& run = text.runs[pg.run];
      const ShapedGlyph& g = run.glyphs[pg.index];
      cairo_save(cr);
      cairo_translate(cr, pg.origin_mm.x, pg.origin_mm.y);
      cairo_rotate(cr, pg.angle_rad);
      use_font(cr, *run.font, size_mm);
      cairo_glyph_t cg{g.glyph_id, 0, 0};
      if (pass == 0) {
        cairo_new_path(cr);
        cairo_glyph_path(cr, &cg, 1);
        set_colour(cr, paint.halo_colour);
        cairo_set_line_width(cr, 2 * paint.halo_width_mm);
        cairo_set_line_join(cr, CAIRO_LINE_JOIN_ROUND);
        cairo_stroke(cr);
      } else {
        set_colour(cr, paint.colour);
        // The glyph's own cluster text keeps the label extractable letter by letter.
        uint32_t begin = g.cluster;
        uint32_t end = run.byte_end;
        for (const auto& other : run.glyphs) {
          if (other.cluster > begin && other.cluster < end) end = other.cluster;
        }
        bool first_of_cluster = pg.index == 0 || run.glyphs[pg.index - 1].cluster != g.cluster;
        if (first_of_cluster && end > begin) {
          cairo_text_cluster_t cl{static_cast<int>(end - begin), 1};
          cairo_show_text_glyphs(cr, text.utf8.data() + begin, static_cast<int>(end - begin), &cg,
                                 1, &cl, 1, cairo_text_cluster_flags_t(0));
        } else {
          cairo_show_glyphs(cr, &cg, 1);
        }
      }
      cairo_restore(cr);
    }
  }
}

}  // namespace sheetmill::text
