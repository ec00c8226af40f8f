#pragma once
// The 3x3 neighbourhood every relief kernel reads, numbered
//   0 1 2     (north row)
//   3 4 5
//   6 7 8     (south row)
// and the gradients of Horn (1981) and Zevenbergen and Thorne (1987) on it.

#include <cmath>

namespace sheetmill::terrain::detail {

// Gathers the window centred on column c of `mid`; `above` / `below` are null at the grid's
// edge. Missing neighbours (outside the grid or NaN) are filled so that planes stay exact:
// an edge neighbour (1, 3, 5, 7) is reflected through the centre, z'_k = 2 z_4 - z_(8-k), or
// set to z_4 when its opposite is missing too; a corner is reflected the same way when its
// opposite exists, else completed from its two (filled) edge neighbours, z_a + z_b - z_4.
// Edges and hole borders therefore shade like their surroundings. Returns false when the
// centre has no data.
inline bool gather_window(const float* above, const float* mid, const float* below, int width,
                          int c, float w[9]) {
  const float* rows[3] = {above, mid, below};
  bool missing = false;
  for (int r = 0; r < 3; ++r) {
    for (int k = -1; k <= 1; ++k) {
      int cc = c + k;
      bool inside = rows[r] && cc >= 0 && cc < width;
      float v = inside ? rows[r][cc] : NAN;
      w[r * 3 + k + 1] = v;
      missing |= std::isnan(v);
    }
  }
  if (std::isnan(w[4])) return false;
  if (!missing) return true;
  const float original[9] = {w[0], w[1], w[2], w[3], w[4], w[5], w[6], w[7], w[8]};
  for (int i : {1, 3, 5, 7}) {
    if (std::isnan(original[i])) {
      float opposite = original[8 - i];
      w[i] = std::isnan(opposite) ? w[4] : 2.0f * w[4] - opposite;
    }
  }
  // Corner -> its two edge neighbours.
  static constexpr int kSides[9][2] = {{1, 3}, {}, {1, 5}, {}, {}, {}, {3, 7}, {}, {5, 7}};
  for (int i : {0, 2, 6, 8}) {
    if (std::isnan(original[i])) {
      float opposite = original[8 - i];
      w[i] = std::isnan(opposite) ? (w[kSides[i][0]] + w[kSides[i][1]]) - w[4]
                                  : 2.0f * w[4] - opposite;
    }
  }
  return true;
}

// Elevation differences across the window, before division by the cell size: east minus west
// (gx) and north minus south (gy). Differences are taken first so that nearby large
// elevations subtract exactly (Sterbenz) before any rounding of sums.
// Horn (1981): weights 1-2-1; divide by 8 cell widths.
inline void horn_differences(const float w[9], float& gx, float& gy) {
  gx = ((w[2] - w[0]) + (w[5] - w[3]) * 2.0f) + (w[8] - w[6]);
  gy = ((w[0] - w[6]) + (w[1] - w[7]) * 2.0f) + (w[2] - w[8]);
}
// Zevenbergen and Thorne (1987): central differences; divide by 2 cell widths.
inline void zt_differences(const float w[9], float& gx, float& gy) {
  gx = w[5] - w[3];
  gy = w[1] - w[7];
}

}  // namespace sheetmill::terrain::detail
