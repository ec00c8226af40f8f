#pragma once
// The demo area's sheet index: 5 km x 5 km sheets on whole kilometres at 1:25 000, 4 columns x
// 3 rows, ids "HV-<row>-<col>" with row 1 in the north and col 1 in the west, and the ids of the
// eight neighbours ("" beyond the index).

#include <vector>

#include "sheetmill/demo/features.hpp"
#include "sheetmill/demo/names.hpp"

namespace sheetmill::demo {

inline constexpr double kSheetSizeM = 5000;

// Each sheet takes the name of its most populous place, else its highest summit, else a new
// locality name from `names`.
std::vector<SheetTile> make_sheet_tiles(const DemoFeatures& features, NameMaker& names);

}  // namespace sheetmill::demo
