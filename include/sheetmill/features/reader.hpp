#pragma once
// Reading one vector source for one sheet, streamed.
//
// Any OGR source (GeoPackage, Shapefile, GeoJSON, FlatGeobuf, database connections). The frame
// box is transformed to the source CRS (edges densified) and pushed down to GDAL as a spatial
// filter; Source::where goes down as an attribute filter; fields not asked for are ignored by the
// driver. Each feature is reprojected to the sheet CRS (traditional GIS axis order on both
// sides), clipped to `clip_ground`, and handed to the sink; only one feature is alive at a time.
// The Feature passed to the sink is reused: copy what you keep.
//
// A missing source (file absent or unreadable, layer not found): Source::required -> throws
// Error(input); optional -> log::warn and ReadSummary::found = false.

#include <functional>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/features/feature.hpp"
#include "sheetmill/project/project.hpp"

namespace sheetmill::features {

struct ReadRequest {
  std::string sheet_crs_wkt;        // target CRS (WKT or anything OGRSpatialReference reads)
  Box clip_ground;                  // sheet CRS; the frame grown by a small margin
  std::vector<std::string> fields;  // attribute names wanted; Feature::values follow this order
};

struct ReadSummary {
  bool found = true;   // false: an optional source was missing
  long read = 0;       // features GDAL returned after its filters
  long delivered = 0;  // features handed to the sink (non-empty after clipping)
  long failed = 0;     // features whose geometry could not be reprojected
};

using FeatureSink = std::function<void(const Feature&)>;

ReadSummary read_features(const project::Source& source, const ReadRequest& request,
                          const FeatureSink& sink);

}  // namespace sheetmill::features
