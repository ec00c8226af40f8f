#pragma once
// Displacement of line symbols that run together closer than their widths (common practice in
// topographic generalisation): the line of lower priority moves sideways, away from the line it
// yields to, until the two symbols just touch (centre lines exactly the sum of their half-widths
// apart), by at most its stated limit. The parts either side of a moved stretch follow with a
// raised-cosine transition, so the line bends into its new course instead of stepping. Where
// touching would need more than the limit, the line moves the limit and the conflict is reported.
// Where two lines cross (a level crossing, a bridge) or one ends on the other, they keep their
// place there. Page millimetres throughout; memory is that of the lines themselves.

#include <cstddef>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::features {

struct DisplacedLine {
  Polyline line_mm;          // in: as prepared; out: displaced
  double half_width_mm = 0;  // ink either side of the centre line
  int priority = 0;          // a line yields to every line of a higher priority
  double max_shift_mm = 0;   // the most any of its vertices may move
  int group = 0;             // lines of one group (one layer's network) never yield to each other
};

// A stretch where a line could not move far enough.
struct DisplacementConflict {
  std::size_t line = 0;      // index of the line that yields
  std::size_t obstacle = 0;  // index of the line it yields to
  Point at_mm;               // the worst point of the stretch, as displaced
  double overlap_mm = 0;     // how far the two symbols still overlap there
};

struct DisplacementParams {
  double sample_mm = 0.5;           // lines are resampled this densely before they move
  double transition_per_shift = 8;  // transition length on either side per mm of shift
  double min_transition_mm = 3;     // and at least this long
  int rounds = 6;                   // relaxation rounds (a line between two obstacles)
};

// Moves the lines of lower priority in place; lines that need not move stay exactly as they
// were. Returns the conflicts left (at most one per stretch).
std::vector<DisplacementConflict> displace_lines(std::vector<DisplacedLine>& lines,
                                                 const DisplacementParams& params = {});

// The distance from `p` to the polyline `line` (infinity for an empty line).
double distance_to_polyline(Point p, const Polyline& line);

}  // namespace sheetmill::features
