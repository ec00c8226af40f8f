// Benchmark helper for bench/relief/run.
//   relief_bench kernel DEM.tif          hillshade kernel throughput, 1 thread and all cores
//   relief_bench sheet DEM.tif           warp + relief for an A1 sheet at 300 dpi
//   relief_bench compare A.tif B.tif     interior cells: max |A - B| and share identical
//   relief_bench resampling DEM.tif [K]  A1 300 dpi warp, bilinear against auto, side by side;
//                                        K > 1 makes the print cells K times coarser
//   relief_bench shade DEM.tif OUT.tif   the library path of `sheetmill shade`
// Times are medians of several runs (steady_clock), printed one result per line.
#include <gdal_priv.h>
#include <hwy/targets.h>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <ctime>
#include <string>
#include <thread>
#include <vector>

#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/terrain/dem_source.hpp"
#include "sheetmill/terrain/raster_products.hpp"
#include "sheetmill/terrain/relief.hpp"
#include "sheetmill/terrain/resampling.hpp"
#include "sheetmill/terrain/shade.hpp"
#include "sheetmill/terrain/shade_kernel.hpp"

using namespace sheetmill;
using namespace sheetmill::terrain;
using Clock = std::chrono::steady_clock;

namespace {
double seconds_since(Clock::time_point t0) {
  return std::chrono::duration<double>(Clock::now() - t0).count();
}
// CPU time of the calling thread: throughput per core even on a shared, loaded machine.
double thread_cpu_seconds() {
  timespec ts{};
  clock_gettime(CLOCK_THREAD_CPUTIME_ID, &ts);
  return ts.tv_sec + ts.tv_nsec * 1e-9;
}
double median(std::vector<double> v) {
  std::sort(v.begin(), v.end());
  return v[v.size() / 2];
}

int kernel(const std::string& path) {
  std::printf("SIMD target chosen at run time: %s\n",
              hwy::TargetName(hwy::SupportedTargets() & ~(hwy::SupportedTargets() - 1)));
  Dem dem = DemSource(path).read_all();
  const int w = dem.width(), h = dem.height();
  const double cells = double(w) * h;
  std::vector<std::uint8_t> out(static_cast<std::size_t>(w) * h);
  for (ShadeMethod m : {ShadeMethod::horn, ShadeMethod::multidirectional}) {
    ShadeParams p{m, 315, 45, 1};
    std::vector<double> one, one_cpu, all;
    for (int i = 0; i < 5; ++i) {
      auto t0 = Clock::now();
      double c0 = thread_cpu_seconds();
      hillshade_rows(dem, p, 0, h, out.data());
      one_cpu.push_back(thread_cpu_seconds() - c0);
      one.push_back(seconds_since(t0));
      // All cores, each on its own band of rows, into the same preallocated output (as the
      // raster products and the sheet renderer run it): what both cores together sustain.
      t0 = Clock::now();
      const unsigned nt = std::max(1u, std::thread::hardware_concurrency());
      std::vector<std::thread> pool;
      for (unsigned t = 0; t < nt; ++t) {
        pool.emplace_back([&, t] {
          int r0 = static_cast<int>(static_cast<long long>(h) * t / nt);
          int r1 = static_cast<int>(static_cast<long long>(h) * (t + 1) / nt);
          hillshade_rows(dem, p, r0, r1, out.data() + static_cast<std::size_t>(r0) * w);
        });
      }
      for (auto& th : pool) th.join();
      all.push_back(seconds_since(t0));
    }
    std::printf(
        "kernel %s: %.0f Mcells; 1 thread: %.3f s CPU = %.2f Gcell/s per core (wall %.3f s);"
        " %u threads: wall %.3f s = %.2f Gcell/s in all\n",
        shade_method_name(m), cells / 1e6, median(one_cpu), cells / median(one_cpu) / 1e9,
        median(one), std::thread::hardware_concurrency(), median(all), cells / median(all) / 1e9);
  }
  // In cache: 48 rows of 2000 cells (~400 KB) shaded 300 times: compute, not memory, bound.
  {
    Dem small = dem;
    small.grid.width = 2000;
    small.grid.height = 48;
    small.z.resize(2000 * 48);
    for (int r = 0; r < 48; ++r)
      std::copy(dem.z.begin() + std::size_t(r) * w, dem.z.begin() + std::size_t(r) * w + 2000,
                small.z.begin() + r * 2000);
    std::vector<double> cpu;
    for (int i = 0; i < 5; ++i) {
      double c0 = thread_cpu_seconds();
      // Interior rows only: the grid's first and last rows take the scalar edge path.
      for (int k = 0; k < 300; ++k) hillshade_rows(small, {}, 1, 47, out.data());
      cpu.push_back(thread_cpu_seconds() - c0);
    }
    std::printf("kernel horn in cache: %.2f Gcell/s per core (CPU time)\n",
                300.0 * 2000 * 46 / median(cpu) / 1e9);
  }
  // The scalar path for comparison (what SIMD buys).
  auto k = detail::shade_coefficients({}, dem.cell_x_m, dem.cell_y_m);
  double c0 = thread_cpu_seconds();
  for (int r = 1; r + 1 < h; ++r) {
    const float* mid = dem.z.data() + static_cast<std::size_t>(r) * w;
    detail::shade_row_scalar(mid - w, mid, mid + w, w, k,
                             out.data() + static_cast<std::size_t>(r) * w);
  }
  double s = thread_cpu_seconds() - c0;
  std::printf("kernel horn scalar path: %.3f s CPU = %.2f Gcell/s per core\n", s, cells / s / 1e9);
  return 0;
}

// An A1 sheet (594 x 841 mm, ISO 216) at 300 dpi over the DEM's centre, at the scale that
// makes the sheet's height span the DEM: 7016 x 9934 cells, about 70 M, all with data. With
// `coarser` > 1 the cells are that many times larger (and fewer: the same ground).
RasterGrid a1_grid(const std::string& path, double coarser = 1) {
  DemSource src(path);
  const RasterGrid& g = src.grid();
  const int w = static_cast<int>(std::ceil(594 / kMmPerInch * 300 / coarser));
  const int h = static_cast<int>(std::ceil(841 / kMmPerInch * 300 / coarser));
  RasterGrid target;
  target.width = w;
  target.height = h;
  double cell = g.cell_y() * g.height / h;
  Box b = g.bounds();
  target.geotransform[0] = b.centre().x - cell * w / 2;
  target.geotransform[1] = cell;
  target.geotransform[3] = b.centre().y + cell * h / 2;
  target.geotransform[5] = -cell;
  target.crs_wkt = g.crs_wkt;
  return target;
}

// The sheet relief's warp with its default (auto) against bilinear, alternating A/B pairs on
// the same grid, medians of wall time.
int resampling(const std::string& path, double coarser) {
  const RasterGrid target = a1_grid(path, coarser);
  const double dem_cell = native_cell_m(path);
  const Resampling chosen = choose_resampling(Resampling::automatic, target.cell_x(), dem_cell);
  std::vector<double> bilinear, automatic;
  for (int i = 0; i < 7; ++i) {
    for (const char* name : {"bilinear", "auto"}) {
      DemReadOptions o;
      o.resampling = name;
      auto t0 = Clock::now();
      Dem dem = read_dem_window(path, target, o);
      (std::string(name) == "auto" ? automatic : bilinear).push_back(seconds_since(t0));
    }
  }
  std::printf(
      "warp %d x %d (%.2f m print cells, %.1f m DEM cells): bilinear %.3f s, auto (%s) %.3f s, "
      "ratio %.2f (medians of 7 A/B pairs)\n",
      target.width, target.height, target.cell_x(), dem_cell, median(bilinear),
      resampling_name(chosen), median(automatic), median(automatic) / median(bilinear));
  return 0;
}

int sheet(const std::string& path) {
  const RasterGrid target = a1_grid(path);
  const int w = target.width, h = target.height;
  ReliefParams params;
  params.tint = true;
  params.ramp = {{{0, {0.35, 0.55, 0.35, 1}}, {600, {0.9, 0.85, 0.65, 1}}}, false, 0};
  std::vector<double> warp, shade, compose;
  for (int i = 0; i < 3; ++i) {
    auto t0 = Clock::now();
    Dem dem = read_dem_window(path, target);
    warp.push_back(seconds_since(t0));
    t0 = Clock::now();
    auto bytes = hillshade(dem, params.shading);
    shade.push_back(seconds_since(t0));
    t0 = Clock::now();
    ReliefImage img = render_relief(dem, params);
    compose.push_back(seconds_since(t0));
  }
  std::printf(
      "sheet A1 300 dpi: %d x %d = %.1f Mcells; warp %.3f s, hillshade %.3f s, "
      "shade+tint image %.3f s (medians of 3)\n",
      w, h, double(w) * h / 1e6, median(warp), median(shade), median(compose));
  return 0;
}

int compare(const std::string& a_path, const std::string& b_path) {
  gdal_init();
  auto read = [](const std::string& p, int& w, int& h) {
    DatasetPtr ds(GDALDataset::Open(p.c_str(), GDAL_OF_RASTER));
    if (!ds) {
      std::fprintf(stderr, "cannot open %s\n", p.c_str());
      std::exit(2);
    }
    w = ds->GetRasterXSize();
    h = ds->GetRasterYSize();
    std::vector<std::uint8_t> v(static_cast<std::size_t>(w) * h);
    if (ds->GetRasterBand(1)->RasterIO(GF_Read, 0, 0, w, h, v.data(), w, h, GDT_Byte, 0, 0,
                                       nullptr) != CE_None)
      std::exit(2);
    return v;
  };
  int wa, ha, wb, hb;
  auto a = read(a_path, wa, ha);
  auto b = read(b_path, wb, hb);
  if (wa != wb || ha != hb) {
    std::printf("compare: sizes differ\n");
    return 1;
  }
  std::size_t n = 0, same = 0;
  int worst = 0;
  for (int r = 1; r + 1 < ha; ++r) {
    for (int c = 1; c + 1 < wa; ++c) {
      std::size_t i = static_cast<std::size_t>(r) * wa + c;
      int d = std::abs(int(a[i]) - int(b[i]));
      ++n;
      same += d == 0;
      worst = std::max(worst, d);
    }
  }
  std::printf("compare: %zu interior cells, max diff %d DN, identical %.4f %%\n", n, worst,
              100.0 * double(same) / double(n));
  return worst <= 1 ? 0 : 1;
}
}  // namespace

int main(int argc, char** argv) {
  std::string cmd = argc > 1 ? argv[1] : "";
  if (cmd == "kernel" && argc == 3) return kernel(argv[2]);
  if (cmd == "sheet" && argc == 3) return sheet(argv[2]);
  if (cmd == "compare" && argc == 4) return compare(argv[2], argv[3]);
  if (cmd == "resampling" && (argc == 3 || argc == 4)) {
    return resampling(argv[2], argc == 4 ? std::atof(argv[3]) : 1.0);
  }
  if (cmd == "shade" && argc == 4) {  // the library path of `sheetmill shade`, no CLI
    if (std::getenv("RELIEF_BENCH_DEBUG")) log::set_level(log::Level::debug);
    write_hillshade_raster(argv[2], argv[3], {});
    return 0;
  }
  std::fprintf(stderr,
               "usage: relief_bench kernel DEM | sheet DEM | resampling DEM [K] | compare A B\n");
  return 2;
}
