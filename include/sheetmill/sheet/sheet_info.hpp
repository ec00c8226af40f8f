#pragma once
// What the collar says about a sheet, gathered before drawing (so no drawing routine opens a
// file): identity, neighbours, datums, magnetic and grid north, sources and producer.
//
// describe_sheet() reads the magnetic model file when the project names one (geomag::Model) and
// uses the tile index the caller passes (when null and the layout frames an index sheet, it
// reads the project's index itself). Fields the render knows better (contour
// interval, vertical datum when the DEM states it) may be overwritten by the caller afterwards.

#include <optional>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/geomag/model.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/sheet/layout.hpp"
#include "sheetmill/sheet/sheet_contents.hpp"
#include "sheetmill/sheet/tile_index.hpp"

namespace sheetmill::sheet {

// North at the sheet centre. All angles in degrees measured from true north, east positive.
struct NorthInfo {
  Point centre_lonlat;                      // where the values hold
  double grid_convergence_deg = 0;          // true north -> grid north
  double scale_factor = 1;                  // point scale factor at the centre
  std::optional<double> declination_deg;    // true north -> magnetic north
  std::optional<double> annual_change_deg;  // of the declination, degrees per year
  std::string date;                         // the date the declination holds for ("2026-12-01")
  std::string source;                       // "WMM-2025" or "stated in the project"
  // Grid north -> magnetic north (declination minus convergence); absent without declination.
  std::optional<double> grid_magnetic_angle_deg() const {
    if (!declination_deg) return std::nullopt;
    return *declination_deg - grid_convergence_deg;
  }
};

struct AdjoiningSheet {
  std::string id;
  std::string name;
  int column = 0;  // -1 west, 0, +1 east
  int row = 0;     // -1 north, 0, +1 south
};

struct SheetInfo {
  std::string sheet_id;
  std::string sheet_name;
  std::vector<AdjoiningSheet> neighbours;
  std::vector<std::vector<Point>> index_outlines;  // every index sheet, ground (location diagram)
  std::string location_caption;                    // what the location diagram shows
  Box location_area;                 // ground the location diagram covers (five sheet sizes across)
  std::vector<Point> dem_footprint;  // the DEM's outline, ground; empty: none
  std::vector<Polyline> location_graticule;  // parallels and meridians over location_area
  double contour_interval_m = 0;             // 0: no contours on this sheet
  // The unit heights and the interval are shown in (the DEM's vertical unit).
  double height_unit_m = 1;
  std::string height_unit_symbol = "m";
  std::string height_unit_name = "metres";
  std::string vertical_datum;
  // The DEM's tested accuracy and any warning about the contour interval (render fills them).
  std::vector<std::string> accuracy_notes;
  std::optional<double> sea_level_m;  // set: the sheet shows depths below this height (metres)
  std::string crs_name;
  std::string datum_name;
  std::string projection_name;
  int epsg = 0;
  double grid_interval_m = 0;
  // The project's stated bars ("m", "ft", "mi"); empty: metres, and an imperial bar too when
  // heights are not in metres (sheet::scale_bar_units).
  std::vector<std::string> scale_bar_units;
  NorthInfo north;
  SheetContents shown;  // what the render drew on the map face (for the legend)
};

// What the location diagram shows of a tile index: the whole index up to kLocationWholeIndex
// sheets; beyond that, the sheets within kLocationReach sheet widths and heights of this one,
// and the outline of the index's extent. The batch's change detection digests the same.
inline constexpr std::size_t kLocationWholeIndex = 300;
inline constexpr double kLocationReach = 4.0;

// `model`: the project's magnetic model already loaded (a batch worker loads it once); null and
// the project names a model file: describe_sheet loads it.
SheetInfo describe_sheet(const project::Project& project, const Layout& layout,
                         const TileIndexContents* index = nullptr,
                         const geomag::Model* model = nullptr);

}  // namespace sheetmill::sheet
