#pragma once
// Print units. Cairo user space on every sheet surface is millimetres (y down); type sizes are
// stated in points (1 pt = 1/72 in).

namespace sheetmill {

inline constexpr double kMmPerInch = 25.4;
inline constexpr double kPtPerInch = 72.0;
inline constexpr double kMmPerPt = kMmPerInch / kPtPerInch;
inline constexpr double kPtPerMm = kPtPerInch / kMmPerInch;
inline constexpr double kPi = 3.14159265358979323846;
inline constexpr double kDegToRad = kPi / 180.0;
inline constexpr double kRadToDeg = 180.0 / kPi;
inline constexpr double kMetresPerFoot = 0.3048;  // international foot
inline constexpr double kMetresPerUsSurveyFoot = 1200.0 / 3937.0;

}  // namespace sheetmill
