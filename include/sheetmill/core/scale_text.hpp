#pragma once
// The one reading of a map scale written by a person: the representative fraction "1:25000",
// the same with thousands separated by spaces ("1:25 000", as printed on sheets) or thin spaces,
// or the bare denominator "25000". Used by the project and style readers and the command line.

#include <optional>
#include <string_view>

namespace sheetmill {

// The largest denominator read: 1:100 000 000 (a world map on a page). Larger is a typo, and
// would make the frame's ground extent overflow the work any sheet can do.
inline constexpr double kMaxScaleDenominator = 1e8;

// The denominator N of 1:N, or nullopt when `text` is not one of the forms above or N is not
// from 1 to kMaxScaleDenominator. Never throws.
std::optional<double> parse_scale_denominator(std::string_view text);

// What every scale message says is expected.
inline constexpr const char* kScaleExpected =
    "a scale from 1:1 to 1:100 000 000 such as 1:25000, 1:25 000 or 25000";

}  // namespace sheetmill
