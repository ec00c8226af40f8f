#pragma once
// The sheet's accuracy notes from the project's `accuracy:` check points (docs/accuracy.md): the
// NSSDA statement, and a warning (also logged) when the sheet's contour interval is finer than
// the DEM supports by NMAS (1947). Empty when the project names no check points.

#include <string>
#include <vector>

#include "sheetmill/project/project.hpp"

namespace sheetmill::render {

std::vector<std::string> accuracy_notes(const project::Project& project, double interval_m);

}  // namespace sheetmill::render
