#pragma once
// The words of an accuracy test: the terminal summary, the statement in the NSSDA's reporting
// form for a sheet's notes, and the warning when a sheet's contour interval is finer than the
// DEM supports by NMAS (1947). Plain strings; nothing is drawn or written here.

#include <optional>
#include <string>

#include "sheetmill/accuracy/assess.hpp"

namespace sheetmill::accuracy {

// Several lines, each ending in '\n'.
std::string summary_text(const Assessment& a);

// FGDC-STD-007.3-1998 section 3.2.3, the reporting form for data tested to the standard:
// "Tested ___ (meters, feet) vertical accuracy at 95% confidence level", with the number of
// check points and the date of the test: "Tested 0.05 metres vertical accuracy at 95 %
// confidence level (NSSDA; 39 check points, 2026-12-01)."
std::string vertical_statement(const Assessment& a, const std::string& date);

// The same for the horizontal test: "Tested 1.2 metres horizontal accuracy at 95 % ...".
std::string horizontal_statement(const HorizontalAssessment& h, const std::string& date);

// A warning when `interval_m` (> 0) is finer than the finest interval NMAS allows from these
// check points, else nullopt.
std::optional<std::string> interval_warning(const Assessment& a, double interval_m);

// Metres with as many decimals as the figure needs (3 significant digits, at most millimetres).
std::string format_metres(double m);

}  // namespace sheetmill::accuracy
