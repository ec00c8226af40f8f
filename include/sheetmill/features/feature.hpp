#pragma once
// One vector feature as plain values, handed from the reader to the stages after it. Coordinates
// are in whatever frame the producer states (the reader delivers ground metres of the sheet CRS).
// A feature may carry several parts of one kind; a GeometryCollection yields parts of every kind.
// Attribute values are parallel to the field list the reader was asked for; a missing or null
// value is std::nullopt.

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::features {

// An area part: outer ring and holes, each ring open (first point not repeated at the end).
struct Polygon {
  Polyline outer;
  std::vector<Polyline> holes;
};

struct Feature {
  long long fid = -1;
  std::vector<Point> points;
  std::vector<Polyline> lines;
  std::vector<Polygon> polygons;
  std::vector<std::optional<std::string>> values;

  // The value of requested field `i`, or nullptr when absent/null (never dangling while the
  // feature lives).
  const std::string* value(std::size_t i) const {
    return i < values.size() && values[i] ? &*values[i] : nullptr;
  }
  bool empty() const { return points.empty() && lines.empty() && polygons.empty(); }
  void clear() {
    fid = -1;
    points.clear();
    lines.clear();
    polygons.clear();
    values.clear();
  }
};

}  // namespace sheetmill::features
