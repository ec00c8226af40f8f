#pragma once
// The exhibit's relief, cut into horizontal strips so that no full-page raster is ever held.
//
// A ReliefPlan is the relief grid (the map frame at the relief resolution) and its strips; each
// strip is rendered on its own (terrain::render_relief_window reads it with a one-cell margin,
// so strips join without a seam) and flattened onto white paper as 8-bit RGB rows. Memory is
// bounded by one strip: about max_strip_pixels * 20 bytes.

#include <cstdint>
#include <vector>

#include "sheetmill/core/map_frame.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "sheetmill/terrain/relief.hpp"

namespace sheetmill::exhibit {

struct ReliefStrip {
  int row0 = 0;  // first row in the relief grid
  int rows = 0;
};

struct ReliefPlan {
  RasterGrid grid;  // the whole relief grid over the frame
  std::vector<ReliefStrip> strips;
  terrain::ReliefParams params;
  terrain::DemReadOptions read_options;
  std::string dem_path;
  double px_mm = 0;  // size of a relief cell on paper
  Point origin_mm;   // page position of the grid's top-left corner
};

inline constexpr long kDefaultStripPixels = 4L * 1024 * 1024;

ReliefPlan plan_relief(const ExhibitProject& project, const MapFrame& frame,
                       const terrain::TintRamp& ramp, double dpi,
                       long max_strip_pixels = kDefaultStripPixels);

// The plan's strip `index`, width * rows * 3 bytes of sRGB, composited over white.
std::vector<std::uint8_t> render_strip_rgb(const ReliefPlan& plan, std::size_t index);

// The same rows as premultiplied ARGB32 for painting with Cairo.
terrain::ReliefImage render_strip_argb(const ReliefPlan& plan, std::size_t index);

// Elevation range (metres) of the DEM under `frame`, from a coarse read (at most ~512 cells on
// the long side). Throws Error(input) when there is no data under the frame.
std::pair<double, double> elevation_range(const ExhibitProject& project, const MapFrame& frame);

}  // namespace sheetmill::exhibit
