#include "render/print_options.hpp"

namespace sheetmill::render {

print::PdfxOptions pdfx_options(const style::Style& style, const std::filesystem::path& profile) {
  print::PdfxOptions o;
  o.colour = style.press.colour;
  o.colour.profile = profile;
  for (const auto& [name, c] : style.press.colours) {
    if (c.cmyk) o.exact.push_back({c.appearance, *c.cmyk});
  }
  for (const style::Ink& ink : style.press.inks) o.exact.push_back({ink.appearance, ink.cmyk});
  return o;
}

}  // namespace sheetmill::render
