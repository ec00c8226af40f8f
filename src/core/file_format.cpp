#include "sheetmill/core/file_format.hpp"

#include <algorithm>
#include <cctype>
#include <string>
#include <vector>

#include "sheetmill/core/error.hpp"

namespace sheetmill {

namespace {

struct Extension {
  const char* text;
  FileFormat format;
};

constexpr Extension kExtensions[] = {{".pdf", FileFormat::pdf},
                                     {".png", FileFormat::png},
                                     {".tif", FileFormat::geotiff},
                                     {".tiff", FileFormat::geotiff}};

std::string lower(std::string s) {
  std::transform(s.begin(), s.end(), s.begin(),
                 [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
  return s;
}

}  // namespace

FileFormat file_format_for(const std::filesystem::path& path,
                           std::initializer_list<FileFormat> supported) {
  const std::string ext = lower(path.extension().string());
  std::vector<std::string> listed;
  for (const Extension& e : kExtensions) {
    if (std::find(supported.begin(), supported.end(), e.format) == supported.end()) continue;
    if (ext == e.text) return e.format;
    listed.emplace_back(e.text);
  }
  std::string list;
  for (std::size_t i = 0; i < listed.size(); ++i) {
    list += (i == 0 ? "" : i + 1 == listed.size() ? " or " : ", ") + listed[i];
  }
  const std::string what = ext.empty() ? "a file name without an extension"
                                       : "cannot write " + path.extension().string() + " files";
  throw_input_error(path.string(), what + "; this command writes " + list);
}

}  // namespace sheetmill
