#pragma once
// Bilinear sampling of a DEM at scattered points, in the DEM's own grid: the four cell centres
// around the point, weighted by distance along each axis (exact on planes). Within half a cell
// of the grid's edge the edge row or column stands in for the missing one. Heights in metres
// (band scale, offset and vertical unit applied by terrain::DemSource).

#include <optional>
#include <string>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/terrain/dem_source.hpp"

namespace sheetmill::accuracy {

class DemSampler {
 public:
  DemSampler(const std::string& path, const terrain::DemReadOptions& options);
  // nullopt: outside the grid; NaN: a needed cell holds no data.
  std::optional<double> at(Point xy) const;
  const terrain::DemSource& source() const { return source_; }

 private:
  terrain::DemSource source_;
  mutable terrain::Dem rows_;  // the last two rows read (points often come in runs)
  mutable int rows_from_ = -1;
};

}  // namespace sheetmill::accuracy
