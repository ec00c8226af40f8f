#include "sheetmill/contours/spot_heights.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <cstring>
#include <limits>
#include <numeric>

namespace sheetmill::contours {

namespace {

// Topographic prominence by a descending sweep with union-find (the usual flooding
// formulation): cells join the components of their higher neighbours; where two components
// meet, the one with the lower peak ends, its prominence being its peak minus the col's
// elevation. `sign` = -1 sweeps the inverted surface (depth of depressions).
//
// The ground beyond the grid's edge and inside nodata is unknown: it may rise higher than a
// peak next to it, or hold a higher col. Each component therefore keeps the highest level at
// which it reached a cell on the edge or next to nodata, and a peak counts only when its
// component stayed clear of such cells down to `min_prominence` below it. A peak on the edge
// itself, or a row of maxima along a DEM's edge (a tilted plane), never counts.
// The cells with data in the sweep's order: by value, highest first, equal values in index order
// (what a stable sort of the indices gives). A stable LSD radix sort on a key that orders the
// values (the IEEE 754 bits of a float, mapped to an unsigned integer in the same order), so the
// order is exactly the comparison sort's, in linear time.
std::vector<std::uint32_t> sweep_order(const terrain::Dem& dem, double sign) {
  const std::size_t n = dem.z.size();
  std::vector<std::uint64_t> items;  // (descending key << 32) | index
  items.reserve(n);
  for (std::size_t i = 0; i < n; ++i) {
    const float z = dem.z[i];
    if (std::isnan(z)) continue;
    float v = static_cast<float>(sign) * z;  // exact: sign is +1 or -1
    if (v == 0) v = 0;                       // -0 and +0 compare equal
    std::uint32_t bits;
    std::memcpy(&bits, &v, sizeof bits);
    // Ascending order of floats as unsigned integers, then inverted for highest first.
    const std::uint32_t ascending = (bits & 0x80000000u) ? ~bits : bits | 0x80000000u;
    items.push_back(std::uint64_t{~ascending} << 32 | i);
  }
  std::vector<std::uint64_t> tmp(items.size());
  // Three stable passes of 11 bits over the key (bits 32..64); indices are already ascending.
  for (int shift = 32; shift < 64; shift += 11) {
    std::vector<std::size_t> count(2049, 0);
    for (std::uint64_t it : items) ++count[((it >> shift) & 2047) + 1];
    for (std::size_t k = 1; k < count.size(); ++k) count[k] += count[k - 1];
    for (std::uint64_t it : items) tmp[count[(it >> shift) & 2047]++] = it;
    items.swap(tmp);
  }
  std::vector<std::uint64_t>().swap(tmp);
  std::vector<std::uint32_t> order(items.size());
  for (std::size_t k = 0; k < items.size(); ++k) order[k] = static_cast<std::uint32_t>(items[k]);
  return order;
}

std::vector<SpotHeight> prominent_cells(const terrain::Dem& dem, double min_prominence, double sign,
                                        SpotHeight::Kind kind) {
  const int w = dem.width(), h = dem.height();
  const std::size_t n = static_cast<std::size_t>(w) * h;
  const std::vector<std::uint32_t> order = sweep_order(dem, sign);
  if (order.empty()) return {};
  auto val = [&](std::uint32_t i) { return sign * static_cast<double>(dem.z[i]); };
  constexpr std::uint32_t none = 0xFFFFFFFFu;
  // Levels are elevations of cells (or -infinity), so floats hold them exactly; a peak's
  // prominence is computed from its col's level at the end, as peak minus col in double.
  //
  // A component's root is always its peak: a component begins as its peak alone, a merge hangs
  // the ended roots under the survivor's, and a joining cell goes under the survivor's too. So
  // one array per cell serves both as the root's reach of unknown ground while the component
  // lives and as the peak's once it has ended.
  constexpr float never = -std::numeric_limits<float>::infinity();
  const float not_ended = std::numeric_limits<float>::quiet_NaN();
  std::vector<std::uint32_t> parent(n, none);  // none = not yet flooded
  std::vector<float> col(n, not_ended);        // at peaks once they end: the col's level
  std::vector<float> touch(n, never);          // at roots/peaks: highest level reaching unknown
  auto find = [&](std::uint32_t x) {
    while (parent[x] != x) x = parent[x] = parent[parent[x]];
    return x;
  };
  // On the grid's edge or next to a nodata cell.
  auto borders_unknown = [&](int cx, int cy) {
    if (cx == 0 || cy == 0 || cx == w - 1 || cy == h - 1) return true;
    for (int dy = -1; dy <= 1; ++dy)
      for (int dx = -1; dx <= 1; ++dx)
        if (std::isnan(dem.at(cx + dx, cy + dy))) return true;
    return false;
  };
  auto level = [&](std::uint32_t i) { return static_cast<float>(val(i)); };  // exact
  std::uint32_t roots[8];
  for (std::uint32_t c : order) {
    parent[c] = c;
    int cx = static_cast<int>(c % w), cy = static_cast<int>(c / w);
    const float own_touch = borders_unknown(cx, cy) ? level(c) : never;
    int nroots = 0;
    for (int dy = -1; dy <= 1; ++dy) {
      for (int dx = -1; dx <= 1; ++dx) {
        int x = cx + dx, y = cy + dy;
        if ((dx == 0 && dy == 0) || x < 0 || y < 0 || x >= w || y >= h) continue;
        std::uint32_t nb = static_cast<std::uint32_t>(y) * w + x;
        if (parent[nb] == none) continue;
        std::uint32_t r = find(nb);
        if (std::find(roots, roots + nroots, r) == roots + nroots) roots[nroots++] = r;
      }
    }
    if (nroots == 0) {  // a new peak
      touch[c] = own_touch;
      continue;
    }
    // The surviving component is the one with the highest peak.
    std::uint32_t best = roots[0];
    for (int k = 1; k < nroots; ++k)
      if (val(roots[k]) > val(best)) best = roots[k];
    float merged_touch = std::max(own_touch, touch[best]);
    for (int k = 0; k < nroots; ++k) {
      const std::uint32_t ended = roots[k];  // its own peak
      if (ended == best) continue;
      // Unknown ground reached through the ended component joins the survivor only at the col.
      merged_touch = std::max(merged_touch, std::min(touch[ended], level(c)));
      col[ended] = level(c);
      // The col itself may border unknown ground: a higher col could lie beyond it.
      touch[ended] = std::max(touch[ended], own_touch);
      parent[ended] = best;
    }
    parent[c] = best;
    touch[best] = merged_touch;
  }
  double lowest = val(order.back());
  std::vector<SpotHeight> out;
  for (std::uint32_t c : order) {
    double p = std::isnan(col[c]) ? -1.0 : val(c) - static_cast<double>(col[c]);
    const double reached_unknown = touch[c];
    if (parent[c] == c && p < 0) p = val(c) - lowest;  // a peak that never ended
    if (p < min_prominence || p < 0) continue;
    if (!(val(c) - reached_unknown > min_prominence)) continue;
    int x = static_cast<int>(c % w), y = static_cast<int>(c / w);
    const double* gt = dem.grid.geotransform;
    SpotHeight s;
    s.ground = {gt[0] + (x + 0.5) * gt[1], gt[3] + (y + 0.5) * gt[5]};
    s.elevation_m = dem.z[c];
    s.kind = kind;
    out.push_back(s);
  }
  return out;  // in sweep order: highest (or lowest) first
}

}  // namespace

std::vector<SpotHeight> find_summits(const terrain::Dem& dem, double min_prominence_m) {
  return prominent_cells(dem, min_prominence_m, 1, SpotHeight::Kind::summit);
}

std::vector<SpotHeight> find_depression_bottoms(const terrain::Dem& dem, double min_depth_m) {
  return prominent_cells(dem, min_depth_m, -1, SpotHeight::Kind::depression);
}

HeightUnit height_unit(double metres_per_unit) {
  if (std::abs(metres_per_unit - 1.0) < 1e-9 || !(metres_per_unit > 0)) return {};
  if (std::abs(metres_per_unit - 0.3048) < 1e-6 || std::abs(metres_per_unit - 1200.0 / 3937) < 1e-6)
    return {metres_per_unit, "ft", "feet"};
  return {metres_per_unit, fmt::format("x {:g} m", metres_per_unit),
          fmt::format("units of {:g} m", metres_per_unit)};
}

std::string elevation_text(double elevation_m, double round_m, const std::string& text_template) {
  if (!(round_m > 0)) round_m = 1;
  double v = std::round(elevation_m / round_m) * round_m;
  int decimals = 0;
  while (decimals < 3 &&
         std::abs(v * std::pow(10, decimals) - std::round(v * std::pow(10, decimals))) > 1e-6)
    ++decimals;
  std::string value = fmt::format("{:.{}f}", v, decimals);
  if (value == "-0") value = "0";
  if (text_template.empty()) return value;
  std::string out = text_template;
  for (const char* key : {"{elevation_m}", "{ele}"}) {
    for (std::size_t at; (at = out.find(key)) != std::string::npos;)
      out.replace(at, std::string(key).size(), value);
  }
  return out;
}

}  // namespace sheetmill::contours
