#pragma once
// GDAL's DEM processing (GDALDEMProcessing, a dependency) run in-process as the outside
// reference for hillshade and slope.
#include <cpl_string.h>
#include <gdal_utils.h>

#include <catch2/catch.hpp>
#include <string>
#include <vector>

#include "sheetmill/core/gdal_env.hpp"

namespace sheetmill::terrain::fixture {

// Runs GDALDEMProcessing(`mode`, args) on `path` into memory and returns band 1 as T.
template <class T>
std::vector<T> gdal_dem(const std::string& path, const char* mode,
                        const std::vector<std::string>& args) {
  gdal_init();
  CPLStringList argv;
  for (const auto& a : args) argv.AddString(a.c_str());
  argv.AddString("-of");
  argv.AddString("MEM");
  GDALDEMProcessingOptions* opts = GDALDEMProcessingOptionsNew(argv.List(), nullptr);
  REQUIRE(opts != nullptr);
  DatasetPtr src(GDALDataset::Open(path.c_str(), GDAL_OF_RASTER));
  REQUIRE(src);
  int usage_error = 0;
  DatasetPtr out(
      GDALDataset::FromHandle(GDALDEMProcessing("", src.get(), mode, nullptr, opts, &usage_error)));
  GDALDEMProcessingOptionsFree(opts);
  REQUIRE(out);
  const int w = out->GetRasterXSize(), h = out->GetRasterYSize();
  std::vector<T> values(static_cast<std::size_t>(w) * h);
  GDALDataType type = sizeof(T) == 1 ? GDT_Byte : GDT_Float32;
  REQUIRE(out->GetRasterBand(1)->RasterIO(GF_Read, 0, 0, w, h, values.data(), w, h, type, 0, 0,
                                          nullptr) == CE_None);
  return values;
}

inline std::vector<std::uint8_t> gdal_hillshade(const std::string& path,
                                                const std::vector<std::string>& args) {
  return gdal_dem<std::uint8_t>(path, "hillshade", args);
}

}  // namespace sheetmill::terrain::fixture
