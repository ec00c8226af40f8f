#pragma once
// Angles as degrees, minutes and seconds for graticule labels and notes.
//
// format_dms rounds to `resolution_arcsec` (1, 60 or 3600 choose seconds, minutes or whole
// degrees) and never prints 60 minutes or seconds (carries instead). Hemisphere letters follow
// the value (N/S for latitude, E/W for longitude); the sign is not repeated.

#include <string>

namespace sheetmill::sheet {

enum class AngleKind { latitude, longitude, plain };

std::string format_dms(double degrees, AngleKind kind, double resolution_arcsec = 1);

// "2.4° E" / "0.3° W": a signed angle with one decimal (declination, convergence). East positive.
std::string format_east_west(double degrees, int decimals = 1);

}  // namespace sheetmill::sheet
