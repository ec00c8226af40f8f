// The PDF/X-4 file walked with qpdf (the oracle for the structure): the output intent with the
// profile embedded (four components), trim and bleed boxes inside the media box, the version
// key and XMP, fonts embedded, and no RGB left in any content stream, image or group (ISO
// 15930-7 sections 6.2.4, 6.3, 6.7; ISO 32000-1 sections 8.6.4, 8.6.7). And the Little CMS round
// trip: each sRGB colour, read back as the CMYK written in the file and converted to CIELAB
// through the same profile, lies within CIEDE2000 2.0 of the colour stated.
#ifndef POINTERHOLDER_TRANSITION
#define POINTERHOLDER_TRANSITION 4
#endif
#include "sheetmill/print/pdfx.hpp"

#include <cairo.h>
#include <lcms2.h>

#include <catch2/catch.hpp>
#include <fstream>
#include <iterator>
#include <qpdf/BufferInputSource.hh>
#include <qpdf/QPDF.hh>
#include <qpdf/QPDFPageDocumentHelper.hh>
#include <qpdf/QPDFPageObjectHelper.hh>
#include <qpdf/QPDFTokenizer.hh>
#include <set>

#include "sheetmill/core/handles.hpp"
#include "sheetmill/pdf/layered_canvas.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using QOH = QPDFObjectHandle;

namespace {

// sRGB colours from the shipped styles' palettes (styles/exhibit.yaml and the screen
// appearances in styles/field.yaml), drawn as fills in this order.
const char* kColours[] = {"#22262b", "#fbfaf7", "#a8321c", "#1f6fb2", "#c4e2f6", "#9a5b2e",
                          "#c3e3ad", "#5f8f4e", "#e4f1d4", "#e9f0dc", "#f0a13a", "#7a7a7a",
                          "#3a3a3a", "#d9452b", "#2f7fbf", "#6b3fa0"};

Colour hex(const std::string& h) {
  auto v = [&](int i) { return std::stoi(h.substr(1 + 2 * i, 2), nullptr, 16) / 255.0; };
  return {v(0), v(1), v(2), 1};
}

struct Fixture {
  explicit Fixture(bool black_point_compensation = true) { make(black_point_compensation); }
  test::TempDir dir{"pdfx"};
  std::filesystem::path screen = dir / "screen.pdf", print = dir / "print.pdf";
  print::PdfxReport report;
  void make(bool black_point_compensation) {
    pdf::LayeredCanvas canvas(210, 297);
    cairo_t* cr = canvas.begin_group("swatches");
    double y = 20;
    for (const char* c : kColours) {
      Colour k = hex(c);
      cairo_set_source_rgb(cr, k.r, k.g, k.b);
      cairo_rectangle(cr, 20, y, 30, 10);
      cairo_fill(cr);
      y += 12;
    }
    canvas.end_group();
    cr = canvas.begin_group("type");
    cairo_set_source_rgb(cr, 0, 0, 0);
    cairo_select_font_face(cr, "DejaVu Sans", CAIRO_FONT_SLANT_NORMAL, CAIRO_FONT_WEIGHT_NORMAL);
    cairo_set_font_size(cr, 5);
    cairo_move_to(cr, 80, 30);
    cairo_show_text(cr, "Harrowmere 412");
    cairo_set_line_width(cr, 0.2);
    cairo_move_to(cr, 80, 40);
    cairo_line_to(cr, 180, 40);
    cairo_stroke(cr);
    cairo_set_source_rgba(cr, 1, 1, 1, 0.85);  // a halo: transparency, a soft mask in Cairo
    cairo_rectangle(cr, 80, 50, 40, 10);
    cairo_fill(cr);
    canvas.end_group();
    // An RGB image composed with Multiply, as the relief is.
    cr = canvas.begin_group("relief", pdf::Blend::multiply);
    CairoSurfacePtr img(cairo_image_surface_create(CAIRO_FORMAT_RGB24, 64, 64));
    cairo_surface_flush(img.get());
    auto* px = reinterpret_cast<uint32_t*>(cairo_image_surface_get_data(img.get()));
    for (int i = 0; i < 64 * 64; ++i) px[i] = (i % 2) ? 0x808080u : 0x30a060u;
    cairo_surface_mark_dirty(img.get());
    cairo_set_source_surface(cr, img.get(), 80, 80);
    cairo_paint(cr);
    canvas.end_group();
    pdf::GeoRegistration geo;  // no viewport
    pdf::Metadata meta;
    meta.title = "Swatches";
    canvas.finish_pdf(screen, geo, meta);
    print::PdfxOptions o;
    o.colour.profile = print::default_cmyk_profile();
    o.colour.black_point_compensation = black_point_compensation;
    report = print::write_pdfx(screen, print, o, print.string());
  }
};

std::string stream_text(QOH s) {
  auto b = s.getStreamData(qpdf_dl_generalized);
  return std::string(reinterpret_cast<const char*>(b->getBuffer()), b->getSize());
}

// Every operator of a content stream with its operands.
struct Op {
  std::string name;
  std::vector<std::string> operands;
};
std::vector<Op> operators(const std::string& content) {
  auto in = std::make_shared<BufferInputSource>(
      "c",
      new Buffer(reinterpret_cast<unsigned char*>(const_cast<char*>(content.data())),
                 content.size()),
      true);
  QPDFTokenizer tok;
  tok.allowEOF();
  std::vector<Op> ops;
  std::vector<std::string> operands;
  for (;;) {
    auto t = tok.readToken(in, "c", true);
    if (t.getType() == QPDFTokenizer::tt_eof) break;
    if (t.getType() == QPDFTokenizer::tt_word) {
      if (t.getValue() == "ID") {
        char c;
        in->read(&c, 1);
        tok.expectInlineImage(in);
        tok.readToken(in, "c", true);
      }
      ops.push_back({t.getValue(), operands});
      operands.clear();
    } else {
      operands.push_back(t.getValue());
    }
  }
  return ops;
}

std::vector<QOH> content_streams(QPDF& pdf) {
  std::vector<QOH> out;
  for (QOH o : pdf.getAllObjects()) {
    if (!o.isStream()) continue;
    QOH d = o.getDict();
    if ((d.getKey("/Subtype").isName() && d.getKey("/Subtype").getName() == "/Form") ||
        d.getKey("/PatternType").isInteger())
      out.push_back(o);
  }
  for (auto& p : QPDFPageDocumentHelper(pdf).getAllPages())
    for (QOH c : p.getPageContents()) out.push_back(c);
  return out;
}

bool mentions_rgb(QOH o, std::set<QPDFObjGen>& seen) {
  if (o.isIndirect() && !seen.insert(o.getObjGen()).second) return false;
  if (o.isName()) return o.getName() == "/DeviceRGB" || o.getName() == "/CalRGB";
  if (o.isStream()) return mentions_rgb(o.getDict(), seen);
  if (o.isArray()) {
    for (int i = 0; i < o.getArrayNItems(); ++i)
      if (mentions_rgb(o.getArrayItem(i), seen)) return true;
  }
  if (o.isDictionary()) {
    for (auto& k : o.getKeys())
      if (k != "/Parent" && mentions_rgb(o.getKey(k), seen)) return true;
  }
  return false;
}

}  // namespace

TEST_CASE("the PDF/X-4 file has its output intent, boxes, version and metadata", "[print]") {
  Fixture f;
  QPDF pdf;
  pdf.processFile(f.print.c_str());
  QOH root = pdf.getRoot();
  // ISO 15930-7 section 6.2.4: one GTS_PDFX output intent with the destination profile.
  QOH intents = root.getKey("/OutputIntents");
  REQUIRE(intents.isArray());
  REQUIRE(intents.getArrayNItems() == 1);
  QOH intent = intents.getArrayItem(0);
  CHECK(intent.getKey("/S").getName() == "/GTS_PDFX");
  QOH icc = intent.getKey("/DestOutputProfile");
  REQUIRE(icc.isStream());
  CHECK(icc.getDict().getKey("/N").getIntValue() == 4);
  std::ifstream in(print::default_cmyk_profile(), std::ios::binary);
  std::string bytes((std::istreambuf_iterator<char>(in)), {});
  auto embedded = icc.getStreamData(qpdf_dl_generalized);
  CHECK(std::string(reinterpret_cast<const char*>(embedded->getBuffer()), embedded->getSize()) ==
        bytes);
  CHECK(bytes.substr(16, 4) == "CMYK");  // the ICC header's colour space (ICC.1:2010 7.2.6)
  CHECK(!intent.getKey("/OutputConditionIdentifier").getUTF8Value().empty());

  QOH info = pdf.getTrailer().getKey("/Info");
  CHECK(info.getKey("/GTS_PDFXVersion").getUTF8Value() == "PDF/X-4");
  CHECK(info.getKey("/Trapped").getName() == "/False");
  CHECK(pdf.getPDFVersion() == "1.6");
  QOH xmp = root.getKey("/Metadata");
  REQUIRE(xmp.isStream());
  std::string x = stream_text(xmp);
  CHECK(x.find("<pdfxid:GTS_PDFXVersion>PDF/X-4</pdfxid:GTS_PDFXVersion>") != std::string::npos);
  CHECK(x.find("xmpMM:DocumentID") != std::string::npos);
  CHECK(x.find("Swatches") != std::string::npos);

  auto pages = QPDFPageDocumentHelper(pdf).getAllPages();
  REQUIRE(pages.size() == 1);
  QOH page = pages[0].getObjectHandle();
  auto box = [&](const char* k) {
    QOH a = page.getKey(k);
    REQUIRE(a.isArray());
    std::array<double, 4> v{};
    for (int i = 0; i < 4; ++i) v[i] = a.getArrayItem(i).getNumericValue();
    return v;
  };
  auto media = box("/MediaBox"), trim = box("/TrimBox"), bleed = box("/BleedBox");
  // Trim inside bleed inside media (ISO 15930-7 section 6.3).
  CHECK(media[0] <= bleed[0]);
  CHECK(bleed[0] <= trim[0]);
  CHECK(media[1] <= bleed[1]);
  CHECK(bleed[1] <= trim[1]);
  CHECK(trim[2] <= bleed[2]);
  CHECK(bleed[2] <= media[2]);
  CHECK(trim[3] <= bleed[3]);
  CHECK(bleed[3] <= media[3]);
  CHECK(trim[2] - trim[0] > 590);                      // A4 portrait in points, not an empty box
  CHECK(root.getKey("/OCProperties").isDictionary());  // the layers stay
}

TEST_CASE("the PDF/X-4 file has no RGB colour and its fonts embedded", "[print]") {
  Fixture f;
  CHECK(f.report.images_converted >= 1);
  QPDF pdf;
  pdf.processFile(f.print.c_str());
  long cmyk_ops = 0;
  bool black_text_overprints = false;
  for (QOH s : content_streams(pdf)) {
    std::set<std::string> rgb_spaces;  // fill/stroke set to DeviceRGB by cs/CS
    bool fill_rgb = false, stroke_rgb = false;
    std::string last_gs;
    bool black_fill = false;
    for (const Op& op : operators(stream_text(s))) {
      INFO("operator " << op.name);
      CHECK(op.name != "rg");
      CHECK(op.name != "RG");
      if (op.name == "cs") fill_rgb = !op.operands.empty() && op.operands[0] == "/DeviceRGB";
      if (op.name == "CS") stroke_rgb = !op.operands.empty() && op.operands[0] == "/DeviceRGB";
      CHECK_FALSE(((op.name == "sc" || op.name == "scn") && fill_rgb));
      CHECK_FALSE(((op.name == "SC" || op.name == "SCN") && stroke_rgb));
      if (op.name == "k" || op.name == "K") ++cmyk_ops;
      if (op.name == "k") black_fill = op.operands == std::vector<std::string>{"0", "0", "0", "1"};
      if (op.name == "gs") last_gs = op.operands.at(0);
      if (op.name == "Tj" || op.name == "TJ") {
        // No rich black for type: solid black text is K only, and it overprints.
        CHECK(black_fill);
        black_text_overprints = last_gs == "/SmOv01" || last_gs == "/SmOv11";
      }
    }
  }
  CHECK(cmyk_ops >= 16);
  CHECK(black_text_overprints);
  std::set<QPDFObjGen> seen;
  bool rgb = false;
  for (QOH o : pdf.getAllObjects()) rgb = rgb || mentions_rgb(o, seen);
  CHECK_FALSE(rgb);  // no RGB image, group or shading colour space anywhere
  // Fonts embedded (ISO 15930-7 section 6.3.5): each font's descriptor holds its program.
  int fonts = 0;
  for (QOH o : pdf.getAllObjects()) {
    if (!o.isDictionary() || !o.getKey("/Type").isName() || o.getKey("/Type").getName() != "/Font")
      continue;
    QOH fd = o.getKey("/FontDescriptor");
    if (o.getKey("/Subtype").getName() == "/Type0") {
      fd = o.getKey("/DescendantFonts").getArrayItem(0).getKey("/FontDescriptor");
    }
    if (o.getKey("/Subtype").getName() == "/Type3") continue;  // glyphs are content streams
    ++fonts;
    REQUIRE(fd.isDictionary());
    CHECK((fd.hasKey("/FontFile") || fd.hasKey("/FontFile2") || fd.hasKey("/FontFile3")));
  }
  CHECK(fonts >= 1);
}

// Little CMS's own gamut check (a proofing transform with cmsFLAGS_GAMUTCHECK): does the
// output profile print this sRGB colour? Out-of-gamut colours cannot come back unchanged.
bool in_gamut(const Colour& c) {
  cmsHPROFILE srgb = cmsCreate_sRGBProfile();
  cmsHPROFILE cmyk = cmsOpenProfileFromFile(print::default_cmyk_profile().c_str(), "r");
  REQUIRE(cmyk);
  cmsUInt16Number alarm[cmsMAXCHANNELS] = {0x1234, 0x5678, 0x9abc};
  cmsSetAlarmCodes(alarm);
  cmsHTRANSFORM t = cmsCreateProofingTransform(
      srgb, TYPE_RGB_16, srgb, TYPE_RGB_16, cmyk, INTENT_RELATIVE_COLORIMETRIC,
      INTENT_RELATIVE_COLORIMETRIC, cmsFLAGS_GAMUTCHECK | cmsFLAGS_SOFTPROOFING | cmsFLAGS_NOCACHE);
  REQUIRE(t);
  cmsUInt16Number in[3] = {static_cast<cmsUInt16Number>(c.r * 65535 + 0.5),
                           static_cast<cmsUInt16Number>(c.g * 65535 + 0.5),
                           static_cast<cmsUInt16Number>(c.b * 65535 + 0.5)};
  cmsUInt16Number out[3] = {0, 0, 0};
  cmsDoTransform(t, in, out, 1);
  cmsDeleteTransform(t);
  cmsCloseProfile(cmyk);
  cmsCloseProfile(srgb);
  return !(out[0] == alarm[0] && out[1] == alarm[1] && out[2] == alarm[2]);
}

TEST_CASE("sRGB colours round-trip through the CMYK written within CIEDE2000 2.0", "[print]") {
  // Little CMS 2 as the oracle: the file's CMYK fills, in drawing order, back to CIELAB through
  // the output profile (relative colorimetric), against the CIELAB of the stated sRGB. The
  // file is written colorimetrically (relative colorimetric without black-point compensation,
  // which by design lightens every colour towards the press's black) and only colours inside
  // the profile's gamut can come back within 2.0; the others are listed, not checked.
  Fixture f(/*black_point_compensation=*/false);
  QPDF pdf;
  pdf.processFile(f.print.c_str());
  std::vector<print::Cmyk> fills;
  for (QOH s : content_streams(pdf)) {
    if (!s.isStream()) continue;
    std::vector<Op> ops = operators(stream_text(s));
    std::vector<print::Cmyk> here;
    for (const Op& op : ops) {
      if (op.name == "k" && op.operands.size() == 4) {
        here.push_back({std::stod(op.operands[0]), std::stod(op.operands[1]),
                        std::stod(op.operands[2]), std::stod(op.operands[3])});
      }
    }
    if (here.size() == std::size(kColours)) fills = here;  // the swatches' form
  }
  REQUIRE(fills.size() == std::size(kColours));
  print::ColourEngine engine({print::default_cmyk_profile()});
  int checked = 0;
  for (std::size_t i = 0; i < fills.size(); ++i) {
    Colour c = hex(kColours[i]);
    double de = print::ciede2000(engine.lab_of(c), engine.lab_of(fills[i]));
    INFO(kColours[i] << " -> " << fills[i].c << " " << fills[i].m << " " << fills[i].y << " "
                     << fills[i].k << ": dE00 " << de);
    if (!in_gamut(c)) {
      WARN(kColours[i] << " is outside the profile's gamut: dE00 " << de);
      continue;
    }
    CHECK(de <= 2.0);
    ++checked;
  }
  CHECK(checked >= 8);  // most of the palette is printable: the check is not vacuous
}
