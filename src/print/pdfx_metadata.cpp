#include "print/pdfx_metadata.hpp"

#include <cstdio>
#include <random>

namespace sheetmill::print::detail {

namespace {

std::string escape(const std::string& s) {
  std::string out;
  for (char c : s) {
    switch (c) {
      case '&':
        out += "&amp;";
        break;
      case '<':
        out += "&lt;";
        break;
      case '>':
        out += "&gt;";
        break;
      case '"':
        out += "&quot;";
        break;
      default:
        out += c;
    }
  }
  return out;
}

// ISO 8601 in UTC, as the Info dictionary's D:...Z dates.
std::string iso_date(std::time_t t) {
  std::tm tm{};
  gmtime_r(&t, &tm);
  char buf[32];
  std::strftime(buf, sizeof buf, "%Y-%m-%dT%H:%M:%SZ", &tm);
  return buf;
}

std::string uuid() {
  std::random_device rd;
  std::mt19937_64 g((static_cast<unsigned long long>(rd()) << 32) ^ rd());
  unsigned long long a = g(), b = g();
  char buf[48];
  std::snprintf(buf, sizeof buf, "uuid:%08llx-%04llx-4%03llx-%04llx-%012llx", a >> 32,
                (a >> 16) & 0xffff, a & 0xfff, ((b >> 48) & 0x3fff) | 0x8000,
                b & 0xffffffffffffULL);
  return buf;
}

std::string alt(const char* tag, const std::string& v) {
  if (v.empty()) return "";
  return std::string("   <") + tag + "><rdf:Alt><rdf:li xml:lang=\"x-default\">" + escape(v) +
         "</rdf:li></rdf:Alt></" + tag + ">\n";
}

}  // namespace

std::string xmp_packet(const XmpFacts& f) {
  const std::string date = iso_date(f.when);
  std::string x;
  x += "<?xpacket begin=\"\xEF\xBB\xBF\" id=\"W5M0MpCehiHzreSzNTczkc9d\"?>\n";
  x += "<x:xmpmeta xmlns:x=\"adobe:ns:meta/\">\n";
  x += " <rdf:RDF xmlns:rdf=\"http://www.w3.org/1999/02/22-rdf-syntax-ns#\">\n";
  x += "  <rdf:Description rdf:about=\"\"\n";
  x += "    xmlns:dc=\"http://purl.org/dc/elements/1.1/\"\n";
  x += "    xmlns:xmp=\"http://ns.adobe.com/xap/1.0/\"\n";
  x += "    xmlns:pdf=\"http://ns.adobe.com/pdf/1.3/\"\n";
  x += "    xmlns:xmpMM=\"http://ns.adobe.com/xap/1.0/mm/\"\n";
  x += "    xmlns:pdfxid=\"http://www.npes.org/pdfx/ns/id/\">\n";
  x += "   <dc:format>application/pdf</dc:format>\n";
  x += alt("dc:title", f.title);
  x += alt("dc:description", f.subject);
  if (!f.author.empty()) {
    x += "   <dc:creator><rdf:Seq><rdf:li>" + escape(f.author) +
         "</rdf:li></rdf:Seq></dc:creator>\n";
  }
  x += "   <xmp:CreateDate>" + date + "</xmp:CreateDate>\n";
  x += "   <xmp:ModifyDate>" + date + "</xmp:ModifyDate>\n";
  x += "   <xmp:MetadataDate>" + date + "</xmp:MetadataDate>\n";
  if (!f.creator.empty()) x += "   <xmp:CreatorTool>" + escape(f.creator) + "</xmp:CreatorTool>\n";
  if (!f.producer.empty()) x += "   <pdf:Producer>" + escape(f.producer) + "</pdf:Producer>\n";
  if (!f.keywords.empty()) x += "   <pdf:Keywords>" + escape(f.keywords) + "</pdf:Keywords>\n";
  x += "   <pdf:Trapped>False</pdf:Trapped>\n";
  x += "   <xmpMM:DocumentID>" + uuid() + "</xmpMM:DocumentID>\n";
  x += "   <xmpMM:InstanceID>" + uuid() + "</xmpMM:InstanceID>\n";
  x += "   <xmpMM:VersionID>1</xmpMM:VersionID>\n";
  x += "   <xmpMM:RenditionClass>default</xmpMM:RenditionClass>\n";
  x += "   <pdfxid:GTS_PDFXVersion>PDF/X-4</pdfxid:GTS_PDFXVersion>\n";
  x += "  </rdf:Description>\n";
  x += " </rdf:RDF>\n";
  x += "</x:xmpmeta>\n";
  // Padding lets a later editor update the packet in place (XMP specification part 1, 7.3.2).
  for (int i = 0; i < 20; ++i) x += std::string(99, ' ') + "\n";
  x += "<?xpacket end=\"w\"?>";
  return x;
}

}  // namespace sheetmill::print::detail
