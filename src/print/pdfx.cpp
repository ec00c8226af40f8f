#include "sheetmill/print/pdfx.hpp"

#ifndef POINTERHOLDER_TRANSITION
#define POINTERHOLDER_TRANSITION 4
#endif
#include <ctime>
#include <functional>
#include <qpdf/QPDF.hh>
#include <qpdf/QPDFObjectHandle.hh>
#include <qpdf/QPDFPageDocumentHelper.hh>
#include <qpdf/QPDFPageObjectHelper.hh>
#include <qpdf/QPDFWriter.hh>
#include <qpdf/QUtil.hh>
#include <set>

#include "print/content_rewrite.hpp"
#include "print/pdfx_metadata.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/file_writer.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/pdf/checked_output.hpp"

namespace sheetmill::print {

namespace {

using QOH = QPDFObjectHandle;

QOH name(const char* n) {
  return QOH::newName(n);
}

bool is_name(QOH o, const char* n) {
  return o.isName() && o.getName() == n;
}

// Every dictionary reachable from `o` without following indirect references.
void each_dict(QOH o, const std::function<void(QOH)>& fn) {
  if (o.isStream()) o = o.getDict();
  if (o.isDictionary()) {
    fn(o);
    for (auto& key : o.getKeys()) {
      QOH v = o.getKey(key);
      if (!v.isIndirect()) each_dict(v, fn);
    }
  } else if (o.isArray()) {
    for (int i = 0; i < o.getArrayNItems(); ++i) {
      QOH v = o.getArrayItem(i);
      if (!v.isIndirect()) each_dict(v, fn);
    }
  }
}

struct Converter {
  const CmykMapper& mapper;
  std::set<QPDFObjGen> masks;  // forms used as luminosity soft masks
  PdfxReport report;

  QOH cmyk_array(double r, double g, double b) {
    Cmyk c = mapper.map(r, g, b);
    QOH a = QOH::newArray();
    for (double v : {c.c, c.m, c.y, c.k}) a.appendItem(QOH::newReal(v, 5));
    return a;
  }

  void content(QOH stream, bool mask, QOH resources) {
    auto data = stream.getStreamData(qpdf_dl_generalized);
    std::string text(reinterpret_cast<const char*>(data->getBuffer()), data->getSize());
    detail::Rewritten r = detail::rewrite_content(text, mapper, mask);
    report.colours_converted += r.colours_converted;
    stream.replaceStreamData(r.content, QOH::newNull(), QOH::newNull());
    if (r.overprint_states.empty()) return;
    if (!resources.isDictionary()) {
      resources = QOH::newDictionary();
      stream.getDict().replaceKey("/Resources", resources);
    }
    QOH gs = resources.getKey("/ExtGState");
    if (!gs.isDictionary()) {
      gs = QOH::newDictionary();
      resources.replaceKey("/ExtGState", gs);
    }
    for (const std::string& n : r.overprint_states) {
      QOH d = QOH::newDictionary();
      d.replaceKey("/Type", name("/ExtGState"));
      d.replaceKey("/OP", QOH::newBool(detail::overprint_stroke(n)));
      d.replaceKey("/op", QOH::newBool(detail::overprint_fill(n)));
      d.replaceKey("/OPM", QOH::newInteger(1));  // nonzero overprint mode (section 8.6.7)
      gs.replaceKey(n, d);
    }
  }

  void image(QOH stream, bool mask) {
    QOH d = stream.getDict();
    if (!is_name(d.getKey("/ColorSpace"), "/DeviceRGB")) return;
    if (d.getKey("/BitsPerComponent").getIntValueAsInt() != 8 || d.hasKey("/Decode")) {
      throw_internal_error("an RGB image that is not 8 bits per sample without /Decode");
    }
    auto data = stream.getStreamData(qpdf_dl_all);
    const std::size_t pixels = data->getSize() / 3;
    const unsigned char* rgb = data->getBuffer();
    std::string out;
    if (mask) {
      out.resize(pixels);
      for (std::size_t i = 0; i < pixels; ++i)
        out[i] = static_cast<char>(
            (30 * rgb[3 * i] + 59 * rgb[3 * i + 1] + 11 * rgb[3 * i + 2] + 50) / 100);
      d.replaceKey("/ColorSpace", name("/DeviceGray"));
    } else {
      out.resize(pixels * 4);
      mapper.map_image(rgb, reinterpret_cast<unsigned char*>(out.data()), pixels);
      d.replaceKey("/ColorSpace", name("/DeviceCMYK"));
    }
    stream.replaceStreamData(out, QOH::newNull(), QOH::newNull());
    ++report.images_converted;
  }

  // Type 2 (exponential) and Type 3 (stitching) functions of an RGB shading (Cairo's gradients).
  void function(QOH f) {
    int type = f.getKey("/FunctionType").getIntValueAsInt();
    if (type == 2) {
      for (const char* k : {"/C0", "/C1"}) {
        QOH c = f.getKey(k);
        double v[3] = {k[2] == '0' ? 0.0 : 1.0, k[2] == '0' ? 0.0 : 1.0, k[2] == '0' ? 0.0 : 1.0};
        if (c.isArray() && c.getArrayNItems() == 3)
          for (int i = 0; i < 3; ++i) v[i] = c.getArrayItem(i).getNumericValue();
        f.replaceKey(k, cmyk_array(v[0], v[1], v[2]));
      }
    } else if (type == 3) {
      QOH fs = f.getKey("/Functions");
      for (int i = 0; i < fs.getArrayNItems(); ++i) function(fs.getArrayItem(i));
    } else {
      throw_internal_error("an RGB shading with a function of type " + std::to_string(type) +
                           "; it cannot be made CMYK yet");
    }
  }

  void dictionary(QOH d) {
    // Transparency groups blend in CMYK (masks in grey).
    if (is_name(d.getKey("/S"), "/Transparency") && is_name(d.getKey("/CS"), "/DeviceRGB")) {
      d.replaceKey("/CS", name("/DeviceCMYK"));
    }
    if (is_name(d.getKey("/S"), "/Luminosity")) {
      QOH bc = d.getKey("/BC");
      if (bc.isArray() && bc.getArrayNItems() == 3) {
        double l = 0.3 * bc.getArrayItem(0).getNumericValue() +
                   0.59 * bc.getArrayItem(1).getNumericValue() +
                   0.11 * bc.getArrayItem(2).getNumericValue();
        d.replaceKey("/BC", QOH::parse("[" + std::to_string(l) + "]"));
      }
    }
    if (d.hasKey("/ShadingType") && is_name(d.getKey("/ColorSpace"), "/DeviceRGB")) {
      d.replaceKey("/ColorSpace", name("/DeviceCMYK"));
      QOH f = d.getKey("/Function");
      if (f.isArray()) throw_internal_error("an RGB shading with one function per component");
      function(f);
      if (QOH bg = d.getKey("/Background"); bg.isArray() && bg.getArrayNItems() == 3) {
        d.replaceKey("/Background", cmyk_array(bg.getArrayItem(0).getNumericValue(),
                                               bg.getArrayItem(1).getNumericValue(),
                                               bg.getArrayItem(2).getNumericValue()));
      }
      ++report.shadings_converted;
    }
  }
};

std::string pdf_date(std::time_t t) {
  std::tm tm{};
  gmtime_r(&t, &tm);
  char buf[32];
  std::strftime(buf, sizeof buf, "D:%Y%m%d%H%M%SZ", &tm);
  return buf;
}

}  // namespace

PdfxReport write_pdfx(const std::filesystem::path& in, const std::filesystem::path& out,
                      const PdfxOptions& options, const std::string& shown_as) {
  ColourEngine engine(options.colour);
  CmykMapper mapper(engine, options.exact);
  Converter conv{mapper, {}, {}};
  conv.report.profile = engine.description();
  try {
    QPDF pdf;
    pdf.processFile(in.c_str());
    std::vector<QOH> objects = pdf.getAllObjects();
    // Soft masks first: their forms are rewritten as grey.
    for (QOH& o : objects) {
      each_dict(o, [&](QOH d) {
        QOH sm = d.getKey("/SMask");
        if (sm.isDictionary() && is_name(sm.getKey("/S"), "/Luminosity")) {
          QOH g = sm.getKey("/G");
          if (g.isStream()) {
            conv.masks.insert(g.getObjGen());
            QOH group = g.getDict().getKey("/Group");
            if (group.isDictionary() && is_name(group.getKey("/CS"), "/DeviceRGB"))
              group.replaceKey("/CS", name("/DeviceGray"));
          }
        }
      });
    }
    for (QOH& o : objects) each_dict(o, [&](QOH d) { conv.dictionary(d); });
    for (QOH& o : objects) {
      if (!o.isStream()) continue;
      QOH d = o.getDict();
      bool mask = conv.masks.count(o.getObjGen()) > 0;
      if (is_name(d.getKey("/Subtype"), "/Form") || d.getKey("/PatternType").isInteger()) {
        conv.content(o, mask, d.getKey("/Resources"));
      } else if (is_name(d.getKey("/Subtype"), "/Image")) {
        conv.image(o, mask);
      }
    }

    QPDFPageDocumentHelper doc(pdf);
    std::time_t now = std::time(nullptr);
    const std::string date = pdf_date(now);
    QOH info = pdf.getTrailer().getKey("/Info");
    if (!info.isDictionary()) {
      info = pdf.makeIndirectObject(QOH::newDictionary());
      pdf.getTrailer().replaceKey("/Info", info);
    }
    for (QPDFPageObjectHelper& page : doc.getAllPages()) {
      QOH p = page.getObjectHandle();
      for (QOH c : page.getPageContents()) conv.content(c, false, p.getKey("/Resources"));
      QOH group = p.getKey("/Group");
      if (group.isDictionary()) conv.dictionary(group);
      // No bleed beyond the paper: the sheet's margin is white (docs/print.md).
      QOH media = p.getKey("/MediaBox");
      double b = options.bleed_mm * kPtPerMm;
      // The trim box is the media box, item for item (a rounded copy could poke out of it).
      QOH trim = QOH::newArray(), bleed = QOH::newArray();
      for (int i = 0; i < 4; ++i) {
        QOH v = media.getArrayItem(i);
        trim.appendItem(v.shallowCopy());
        bleed.appendItem(b > 0 ? QOH::newReal(v.getNumericValue() + (i < 2 ? -b : b), 4)
                               : v.shallowCopy());
      }
      p.replaceKey("/TrimBox", trim);
      p.replaceKey("/BleedBox", bleed);
    }

    // The output intent (ISO 15930-7 section 6.2.4): the profile embedded, four components.
    QOH icc = QOH::newStream(&pdf, engine.profile_bytes());
    icc.getDict().replaceKey("/N", QOH::newInteger(4));
    QOH intent = QOH::newDictionary();
    intent.replaceKey("/Type", name("/OutputIntent"));
    intent.replaceKey("/S", name("/GTS_PDFX"));
    const std::string condition = conv.report.profile.empty() ? "Custom" : conv.report.profile;
    intent.replaceKey("/OutputConditionIdentifier", QOH::newUnicodeString(condition));
    intent.replaceKey("/OutputCondition", QOH::newUnicodeString(condition));
    intent.replaceKey("/Info", QOH::newUnicodeString(condition));
    intent.replaceKey("/RegistryName", QOH::newString("http://www.color.org"));
    intent.replaceKey("/DestOutputProfile", icc);
    QOH intents = QOH::newArray();
    intents.appendItem(pdf.makeIndirectObject(intent));
    pdf.getRoot().replaceKey("/OutputIntents", intents);

    info.replaceKey("/GTS_PDFXVersion", QOH::newString("PDF/X-4"));
    info.replaceKey("/Trapped", name("/False"));
    info.replaceKey("/CreationDate", QOH::newString(date));
    info.replaceKey("/ModDate", QOH::newString(date));
    if (!info.hasKey("/Title")) info.replaceKey("/Title", QOH::newUnicodeString("Map sheet"));
    detail::XmpFacts facts;
    auto text = [&](const char* k) {
      QOH v = info.getKey(k);
      return v.isString() ? v.getUTF8Value() : std::string();
    };
    facts.title = text("/Title");
    facts.subject = text("/Subject");
    facts.keywords = text("/Keywords");
    facts.author = text("/Author");
    facts.creator = text("/Creator");
    facts.producer = text("/Producer");
    facts.when = now;
    QOH xmp = QOH::newStream(&pdf, detail::xmp_packet(facts));
    xmp.getDict().replaceKey("/Type", name("/Metadata"));
    xmp.getDict().replaceKey("/Subtype", name("/XML"));
    pdf.getRoot().replaceKey("/Metadata", xmp);

    FileWriter file(out, shown_as);
    pdf::QpdfSink sink(file);
    QPDFWriter writer(pdf);
    writer.setOutputPipeline(&sink);
    writer.setObjectStreamMode(qpdf_o_generate);
    writer.setCompressStreams(true);
    writer.setDecodeLevel(qpdf_dl_none);
    // PDF/X-4 is built on PDF 1.6 (ISO 15930-7 section 6.1).
    writer.forcePDFVersion("1.6");
    writer.write();
    sink.flush();  // the sink gathers writes into blocks (pdf/checked_output.hpp)
    file.close();
  } catch (const Error&) {
    throw;
  } catch (const std::exception& e) {
    throw_internal_error(std::string("making the PDF/X file with qpdf: ") + e.what());
  }
  pdf::verify_pdf(out, 1, shown_as);
  return conv.report;
}

}  // namespace sheetmill::print
