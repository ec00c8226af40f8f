// Fuzz target for the project and style readers: the first byte picks the reader, the rest is
// the file. A reader must return a value or throw sheetmill::Error; any other exception
// escapes to libFuzzer and is reported, as is every crash, leak or undefined behaviour.
#include <unistd.h>

#include <cstddef>
#include <cstdint>
#include <fstream>
#include <string>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/style/style.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  static const std::string path = "/tmp/sheetmill-fuzz-" + std::to_string(getpid()) + ".yaml";
  static bool quiet = (sheetmill::log::set_level(sheetmill::log::Level::quiet), true);
  (void)quiet;
  if (size == 0) return 0;
  {
    std::ofstream out(path, std::ios::binary | std::ios::trunc);
    out.write(reinterpret_cast<const char*>(data + 1), static_cast<std::streamsize>(size - 1));
  }
  try {
    if (data[0] & 1) {
      sheetmill::style::load_style(path);
    } else {
      sheetmill::project::load_project(path);
    }
  } catch (const sheetmill::Error&) {
    // A located input error is the expected outcome for most inputs.
  }
  return 0;
}
