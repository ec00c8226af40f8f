// Fuzz target for the tile-index reader: the input is a GeoJSON tile index in GDAL's memory
// file system. The reader must return sheets or throw sheetmill::Error; anything else escapes
// to libFuzzer and is reported, as is every crash, leak or undefined behaviour.
#include <cpl_vsi.h>

#include <cstddef>
#include <cstdint>

#include "sheetmill/batch/tile_index_io.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/log.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  static bool ready =
      (sheetmill::gdal_init(), sheetmill::log::set_level(sheetmill::log::Level::quiet), true);
  (void)ready;
  const char* path = "/vsimem/fuzz-index.geojson";
  VSILFILE* f = VSIFileFromMemBuffer(path, const_cast<GByte*>(data), size, FALSE);
  if (!f) return 0;
  VSIFCloseL(f);
  try {
    sheetmill::batch::read_tile_index(path, "", "sheet_id", "name");
  } catch (const sheetmill::Error&) {
    // A named input error is the expected outcome for most inputs.
  }
  VSIUnlink(path);
  return 0;
}
