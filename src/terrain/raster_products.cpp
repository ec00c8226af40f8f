#include "sheetmill/terrain/raster_products.hpp"

#include <cpl_conv.h>
#include <cpl_string.h>

#include <algorithm>
#include <array>
#include <chrono>
#include <cmath>
#include <functional>
#include <future>

#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/caution.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/file_writer.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/terrain/dem_source.hpp"
#include "terrain/parallel_rows.hpp"

namespace sheetmill::terrain {

namespace {

// A tiled, compressed GeoTIFF at `path` with the source's grid and CRS.
DatasetPtr create_output(const std::string& path, const DemSource& src, int bands,
                         GDALDataType type, const ProductOptions& options) {
  gdal_init();
  GDALDriver* gtiff = GetGDALDriverManager()->GetDriverByName("GTiff");
  CPLStringList opts;
  opts.SetNameValue("TILED", "YES");
  opts.SetNameValue("BLOCKXSIZE", "256");
  opts.SetNameValue("BLOCKYSIZE", "256");
  if (options.compression == "zstd") {
    // Level 1: relief compresses well even so (a 36 M-cell hillshade to ~3 MB) at little cost.
    opts.SetNameValue("COMPRESS", "ZSTD");
    opts.SetNameValue("ZSTD_LEVEL", "1");
  } else if (options.compression == "deflate") {
    opts.SetNameValue("COMPRESS", "DEFLATE");
  } else {
    throw_input_error(path,
                      "compression \"" + options.compression + "\": expected zstd or deflate");
  }
  if (type == GDT_Float32) opts.SetNameValue("PREDICTOR", "3");
  // One compression thread: for_each_band already keeps both cores busy (reading, shading and
  // compressing different bands at once); GDAL's own compression pool on top of that
  // oversubscribed them and measured slower (bench/relief/run).
  opts.SetNameValue("NUM_THREADS", "1");
  opts.SetNameValue("BIGTIFF", "IF_SAFER");
  if (bands >= 3) opts.SetNameValue("PHOTOMETRIC", "RGB");
  if (bands == 4) opts.SetNameValue("ALPHA", "YES");  // unassociated (straight) alpha
  GdalErrorScope errors;
  const RasterGrid& g = src.grid();
  DatasetPtr ds(gtiff->Create(path.c_str(), g.width, g.height, bands, type, opts.List()));
  if (!ds) {
    throw_input_error(
        path,
        "cannot create the output GeoTIFF" +
            (errors.last_failure().empty() ? std::string() : " (" + errors.last_failure() + ")"));
  }
  double gt[6];
  std::copy(g.geotransform, g.geotransform + 6, gt);
  ds->SetGeoTransform(gt);
  ds->SetSpatialRef(&src.crs());  // the parsed CRS itself: no second WKT parse
  ds->SetMetadataItem("TIFFTAG_IMAGEDESCRIPTION", kProductCaution);
  return ds;
}

// A per-dataset mask (0 = hole) inside the TIFF, not a side-car file (which the atomic rename
// would leave behind).
void create_internal_mask(GDALDataset& ds, const std::string& path) {
  CPLConfigOptionSetter internal("GDAL_TIFF_INTERNAL_MASK", "YES", false);
  if (ds.CreateMaskBand(GMF_PER_DATASET) != CE_None) {
    throw_input_error(path, "cannot create the output's mask");
  }
}

// Writes rows of one band (band 0 = the per-dataset mask).
void write_rows(GDALDataset& ds, int band, int row0, int rows, int width, GDALDataType type,
                const void* data, const std::string& path) {
  GdalErrorScope errors;
  GDALRasterBand* b = band > 0 ? ds.GetRasterBand(band) : ds.GetRasterBand(1)->GetMaskBand();
  if (b->RasterIO(GF_Write, 0, row0, width, rows, const_cast<void*>(data), width, rows, type, 0, 0,
                  nullptr) != CE_None) {
    throw_input_error(path, "cannot write: " + library_write_failure(path, errors.last_failure()));
  }
}

// Runs the raster in bands of rows as a three-stage pipeline, each stage in its own thread:
// band k + 1 is read while band k is computed and band k - 1 is written (compressed on all
// cores by GDAL). `compute(dem, first, count, row0, result)` fills `result` for rows
// [row0, row0 + count): `dem` holds rows [row0 - 1, row0 + count + 1) clipped to the raster,
// and the band's own rows start at local row `first`. `write(result, row0, count)` stores it.
// The source and the output are each touched by one thread at a time; two DEM bands and two
// results are alive at once, so memory is bounded by the band size, not the raster.
template <class Result, class Compute, class Write>
void for_each_band(const DemSource& src, GDALDataset& out, const ProductOptions& options,
                   Compute&& compute, Write&& write) {
  const int h = src.grid().height;
  if (h <= 0) return;
  const int step = std::max(1, options.band_rows);
  auto read_band = [&src, h, step](int row0, Dem& dem) {
    const int count = std::min(step, h - row0);
    const int read0 = std::max(0, row0 - 1);
    src.read_rows_into(read0, count + (row0 - read0) + 1, dem);
    // Each source block is needed once (plus a margin row): drop them so the block cache
    // does not grow with the raster.
    src.dataset().FlushCache(false);
  };
  auto write_band = [&](const Result& result, int row0) {
    write(result, row0, std::min(step, h - row0));
    out.FlushCache(false);  // compress and write this band's tiles now
    if (options.progress) options.progress(static_cast<double>(std::min(h, row0 + step)) / h);
  };
  Dem dems[2];
  Result results[2];
  read_band(0, dems[0]);
  std::future<void> reading, computing;
  int k = 0;
  for (int row0 = 0; row0 < h; row0 += step, ++k) {
    if (reading.valid()) reading.get();  // band k is in dems[k % 2]
    if (row0 + step < h) {
      reading = std::async(std::launch::async, read_band, row0 + step, std::ref(dems[(k + 1) % 2]));
    }
    const int count = std::min(step, h - row0);
    computing = std::async(std::launch::async, [&, row0, count, k] {
      compute(static_cast<const Dem&>(dems[k % 2]), row0 - std::max(0, row0 - 1), count, row0,
              results[k % 2]);
    });
    if (k > 0) {
      try {
        write_band(results[(k + 1) % 2], row0 - step);
      } catch (...) {
        // Let the other stages finish with their buffers before they go out of scope.
        if (reading.valid()) reading.wait();
        computing.wait();
        throw;
      }
    }
    try {
      computing.get();
    } catch (...) {
      if (reading.valid()) reading.wait();
      throw;
    }
  }
  write_band(results[(k + 1) % 2], (k - 1) * step);
}

// Reopens the written raster and reads its last row: a file cut short at close fails here.
void verify_reads_back(const AtomicOutput& out, int width, int height, int bands) {
  GdalErrorScope errors;
  DatasetPtr ds(GDALDataset::Open(out.temp_path().c_str(), GDAL_OF_RASTER | GDAL_OF_READONLY));
  std::vector<double> row(static_cast<std::size_t>(width));
  bool whole = ds && ds->GetRasterXSize() == width && ds->GetRasterYSize() == height &&
               ds->GetRasterCount() == bands;
  for (int b = 1; whole && b <= bands; ++b) {
    whole = ds->GetRasterBand(b)->RasterIO(GF_Read, 0, height - 1, width, 1, row.data(), width, 1,
                                           GDT_Float64, 0, 0, nullptr) == CE_None;
  }
  if (!whole) {
    throw_input_error(out.target().string(),
                      "the written raster does not read back whole (" +
                          library_write_failure(out.temp_path(), errors.last_failure()) + ")");
  }
}

void finish(DatasetPtr& ds, AtomicOutput& out) {
  auto t0 = std::chrono::steady_clock::now();
  GdalErrorScope errors;
  const int width = ds->GetRasterXSize(), height = ds->GetRasterYSize();
  const int bands = ds->GetRasterCount();
  ds.reset();  // closing flushes the last tiles; GDAL reports failures through the scope
  if (!errors.last_failure().empty()) {
    throw_input_error(
        out.target().string(),
        "cannot write: " + library_write_failure(out.temp_path(), errors.last_failure()));
  }
  verify_reads_back(out, width, height, bands);
  auto t1 = std::chrono::steady_clock::now();
  out.commit();
  auto t2 = std::chrono::steady_clock::now();
  log::debug("{}: closed in {:.3f} s, committed (fsync, rename) in {:.3f} s", out.target().string(),
             std::chrono::duration<double>(t1 - t0).count(),
             std::chrono::duration<double>(t2 - t1).count());
}

}  // namespace

void write_hillshade_raster(const std::string& dem_path, const std::string& out_path,
                            const ShadeParams& params, const ProductOptions& options) {
  DemSource src(dem_path, options.read);
  AtomicOutput out(out_path);
  DatasetPtr ds = create_output(out.temp_path().string(), src, 1, GDT_Byte, options);
  ds->GetRasterBand(1)->SetNoDataValue(0);
  const int w = src.grid().width;
  for_each_band<std::vector<std::uint8_t>>(
      src, *ds, options,
      [&](const Dem& dem, int first, int count, int, std::vector<std::uint8_t>& bytes) {
        bytes.resize(static_cast<std::size_t>(w) * count);
        detail::parallel_rows(count, [&](int b, int e) {
          hillshade_rows(dem, params, first + b, first + e,
                         bytes.data() + static_cast<std::size_t>(b) * w);
        });
      },
      [&](const std::vector<std::uint8_t>& bytes, int row0, int count) {
        write_rows(*ds, 1, row0, count, w, GDT_Byte, bytes.data(), out_path);
      });
  finish(ds, out);
}

void write_slope_raster(const std::string& dem_path, const std::string& out_path,
                        const SlopeParams& params, const ProductOptions& options) {
  DemSource src(dem_path, options.read);
  AtomicOutput out(out_path);
  DatasetPtr ds = create_output(out.temp_path().string(), src, 1, GDT_Float32, options);
  // Holes are 0, as in every raster product, and marked by a per-dataset mask rather than a
  // nodata value: 0 is also the slope of flat ground (a lake, a plain), which must stay data.
  create_internal_mask(*ds, out_path);
  const int w = src.grid().width;
  struct Band {
    std::vector<float> values;
    std::vector<std::uint8_t> mask;
  };
  for_each_band<Band>(
      src, *ds, options,
      [&](const Dem& dem, int first, int count, int, Band& band) {
        const std::size_t n = static_cast<std::size_t>(w) * count;
        band.values.resize(n);
        band.mask.resize(n);
        detail::parallel_rows(count, [&](int b, int e) {
          slope_rows(dem, params, first + b, first + e,
                     band.values.data() + static_cast<std::size_t>(b) * w);
        });
        for (std::size_t i = 0; i < n; ++i) {
          const bool hole = std::isnan(band.values[i]);
          band.mask[i] = hole ? 0 : 255;
          if (hole) band.values[i] = 0.0f;
        }
      },
      [&](const Band& band, int row0, int count) {
        write_rows(*ds, 1, row0, count, w, GDT_Float32, band.values.data(), out_path);
        write_rows(*ds, 0, row0, count, w, GDT_Byte, band.mask.data(), out_path);
      });
  finish(ds, out);
}

void write_tint_raster(const std::string& dem_path, const std::string& out_path,
                       const ReliefParams& params, bool rgba, const ProductOptions& options) {
  if (!params.tint) throw_internal_error("write_tint_raster: no tint ramp");
  validate_ramp(params.ramp, out_path);
  DemSource src(dem_path, options.read);
  AtomicOutput out(out_path);
  const int bands = rgba ? 4 : 3;
  DatasetPtr ds = create_output(out.temp_path().string(), src, bands, GDT_Byte, options);
  if (!rgba) {
    create_internal_mask(*ds, out_path);
  } else {
    ds->GetRasterBand(4)->SetColorInterpretation(GCI_AlphaBand);
  }
  const int w = src.grid().width;
  using Planes = std::array<std::vector<std::uint8_t>, 4>;
  for_each_band<Planes>(
      src, *ds, options,
      [&](const Dem& dem, int first, int count, int, Planes& planes) {
        ReliefImage img = render_relief(dem, params);
        const std::size_t n = static_cast<std::size_t>(w) * count;
        for (auto& p : planes) p.resize(n);
        for (std::size_t i = 0; i < n; ++i) {
          std::uint32_t px = img.argb[static_cast<std::size_t>(first) * w + i];
          std::uint32_t a = px >> 24;
          // Back from premultiplied to straight colour.
          auto straight = [a](std::uint32_t v) {
            return static_cast<std::uint8_t>(
                a == 0 ? 0 : std::min<std::uint32_t>(255, (v * 255 + a / 2) / a));
          };
          planes[0][i] = straight((px >> 16) & 0xff);
          planes[1][i] = straight((px >> 8) & 0xff);
          planes[2][i] = straight(px & 0xff);
          planes[3][i] = rgba ? static_cast<std::uint8_t>(a) : (a == 0 ? 0 : 255);
        }
      },
      [&](const Planes& planes, int row0, int count) {
        for (int b = 0; b < 3; ++b)
          write_rows(*ds, b + 1, row0, count, w, GDT_Byte, planes[b].data(), out_path);
        write_rows(*ds, rgba ? 4 : 0, row0, count, w, GDT_Byte, planes[3].data(), out_path);
      });
  finish(ds, out);
}

}  // namespace sheetmill::terrain
