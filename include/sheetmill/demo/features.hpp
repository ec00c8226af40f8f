#pragma once
// The demo area's vector features as plain values, one struct per output layer. Coordinates are
// EPSG:32632 metres; rings are closed implicitly (first vertex not repeated); lines run in the
// direction the layer documents (water lines downstream).

#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::demo {

struct WaterLine {
  Polyline line;     // first vertex upstream
  std::string kind;  // river | stream
  std::string name;
  int strahler = 1;
};
struct WaterArea {
  Polyline ring;
  std::string kind;  // lake | pond
  std::string name;
  double level_m = 0;
};
struct Road {
  Polyline line;
  std::string road_class;  // main | secondary | minor
  std::string ref;
  std::string name;
};
struct Track {
  Polyline line;
  std::string kind;  // track | path
};
struct Railway {
  Polyline line;
  std::string kind = "rail";
  std::string name;
};
struct Building {
  Polyline ring;
  std::string kind;  // house | farm | church | barn | works
};
struct LandcoverArea {
  std::vector<Polyline> rings;  // outer ring first, then holes
  std::string kind;             // wood | orchard | marsh | scrub
};
struct PowerLine {
  Polyline line;  // one vertex per pylon
  int voltage_kv = 110;
};
struct Place {
  Point at;
  std::string name;
  std::string kind;  // village | hamlet | farm | locality
  int population = 0;
};
struct Summit {
  Point at;
  std::string name;
  double elevation_m = 0;
};
struct ControlPoint {
  Point at;
  std::string id;    // "BM 114", "TP 7"
  std::string kind;  // benchmark | trig
  double elevation_m = 0;
};

struct DemoFeatures {
  std::vector<WaterLine> water_lines;
  std::vector<WaterArea> water_areas;
  std::vector<Road> roads;
  std::vector<Track> tracks;
  std::vector<Railway> railways;
  std::vector<Building> buildings;
  std::vector<LandcoverArea> landcover;
  std::vector<PowerLine> power_lines;
  std::vector<Place> places;
  std::vector<Summit> summits;
  std::vector<ControlPoint> control_points;
};

// One map sheet of the tile index.
struct SheetTile {
  std::string sheet_id;  // "HV-<row>-<col>", row 1 in the north, col 1 in the west
  std::string name;
  int row = 0;
  int col = 0;
  Box ground;
  std::string n, s, e, w, ne, nw, se, sw;  // neighbour ids, "" where none
};

}  // namespace sheetmill::demo
