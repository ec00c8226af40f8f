#include "sheetmill/terrain/resampling.hpp"

#include "sheetmill/core/error.hpp"

namespace sheetmill::terrain {

Resampling parse_resampling(const std::string& name) {
  if (name == "auto") return Resampling::automatic;
  if (name == "cubic") return Resampling::cubic;
  if (name == "bilinear") return Resampling::bilinear;
  if (name == "average") return Resampling::average;
  throw_input_error(std::string(),
                    "resampling \"" + name + "\": expected one of auto, cubic, bilinear, average");
}

const char* resampling_name(Resampling r) {
  switch (r) {
    case Resampling::automatic:
      return "auto";
    case Resampling::cubic:
      return "cubic";
    case Resampling::bilinear:
      return "bilinear";
    case Resampling::average:
      return "average";
  }
  return "?";
}

Resampling choose_resampling(Resampling asked, double print_cell_m, double dem_cell_m) {
  if (asked != Resampling::automatic) return asked;
  if (print_cell_m > 0 && dem_cell_m > 0 && print_cell_m >= kAverageFromCells * dem_cell_m) {
    return Resampling::average;
  }
  return Resampling::cubic;
}

}  // namespace sheetmill::terrain
