#pragma once
// An overhead power line crossing the area from the south edge to the north edge: straight
// spans of 250-330 m between pylons (one vertex per pylon), turning only at a few angle
// pylons, kept off the lake and away from village centres.

#include <vector>

#include "sheetmill/demo/features.hpp"
#include "sheetmill/demo/scenario.hpp"

namespace sheetmill::demo {

std::vector<PowerLine> string_power_lines(const Scenario& s, const std::vector<Place>& places);

}  // namespace sheetmill::demo
