#include "sheetmill/terrain/tint.hpp"

#include <algorithm>
#include <cmath>
#include <memory>

#include "sheetmill/config/node.hpp"
#include "sheetmill/core/error.hpp"

namespace sheetmill::terrain {

namespace {
Colour mix(const Colour& a, const Colour& b, double t) {
  return {a.r + (b.r - a.r) * t, a.g + (b.g - a.g) * t, a.b + (b.b - a.b) * t,
          a.a + (b.a - a.a) * t};
}

Colour smooth_colour(const TintRamp& ramp, double z) {
  const auto& s = ramp.stops;
  if (z <= s.front().first) return s.front().second;
  if (z >= s.back().first) return s.back().second;
  auto hi = std::upper_bound(s.begin(), s.end(), z,
                             [](double v, const auto& stop) { return v < stop.first; });
  auto lo = hi - 1;
  double span = hi->first - lo->first;
  double t = span > 0 ? (z - lo->first) / span : 0.0;
  return mix(lo->second, hi->second, t);
}

int hex_digit(char c) {
  if (c >= '0' && c <= '9') return c - '0';
  if (c >= 'a' && c <= 'f') return c - 'a' + 10;
  if (c >= 'A' && c <= 'F') return c - 'A' + 10;
  return -1;
}
}  // namespace

Colour tint_colour(const TintRamp& ramp, double z_m) {
  if (ramp.stops.empty()) throw_internal_error("tint_colour: empty ramp");
  if (!ramp.stepped) return smooth_colour(ramp, z_m);
  if (ramp.step_m > 0) {
    double band = std::floor(z_m / ramp.step_m);
    return smooth_colour(ramp, (band + 0.5) * ramp.step_m);
  }
  const auto& s = ramp.stops;
  auto hi = std::upper_bound(s.begin(), s.end(), z_m,
                             [](double v, const auto& stop) { return v < stop.first; });
  return hi == s.begin() ? s.front().second : (hi - 1)->second;
}

void validate_ramp(const TintRamp& ramp, const std::string& where) {
  if (ramp.stops.empty()) throw_input_error(where, "a ramp needs at least one stop");
  for (std::size_t i = 1; i < ramp.stops.size(); ++i) {
    if (!(ramp.stops[i].first >= ramp.stops[i - 1].first)) {
      throw_input_error(where, "ramp stops must be in ascending order of elevation");
    }
  }
  if (!(ramp.step_m >= 0) || !std::isfinite(ramp.step_m)) {
    throw_input_error(where, "ramp step must be a positive length");
  }
}

bool parse_hex_colour(const std::string& text, Colour& out) {
  if ((text.size() != 7 && text.size() != 9) || text[0] != '#') return false;
  int v[4] = {0, 0, 0, 255};
  for (std::size_t i = 0; i + 1 < text.size(); i += 2) {
    int hi = hex_digit(text[i + 1]), lo = hex_digit(text[i + 2]);
    if (hi < 0 || lo < 0) return false;
    v[i / 2] = hi * 16 + lo;
  }
  out = {v[0] / 255.0, v[1] / 255.0, v[2] / 255.0, v[3] / 255.0};
  return true;
}

namespace {
TintRamp ramp_from(const config::ConfigNode& root) {
  root.expect_keys({"blend", "step", "stops"});
  TintRamp ramp;
  if (auto blend = root.find("blend")) {
    ramp.stepped = blend->as_choice({"smooth", "steps"}) == "steps";
  }
  if (auto step = root.find("step")) {
    ramp.step_m = step->as_ground_length_m();
    if (!(ramp.step_m > 0)) step->fail("expected a positive length such as 20 m");
    if (!ramp.stepped) step->fail("a step needs blend: steps");
  }
  config::ConfigNode stops = root.at("stops");
  if (!stops.is_sequence() || stops.items().empty()) {
    stops.fail_expected("a list of stops such as {elevation: 0 m, colour: \"#5b8a50\"}");
  }
  for (const auto& item : stops.items()) {
    item.expect_keys({"elevation", "colour"});
    double z = item.at("elevation").as_ground_length_m();
    config::ConfigNode cn = item.at("colour");
    Colour c;
    if (!parse_hex_colour(cn.as_string(), c)) cn.fail_expected("a colour such as \"#5b8a50\"");
    if (!ramp.stops.empty() && z < ramp.stops.back().first) {
      item.fail("stops must be in ascending order of elevation");
    }
    ramp.stops.emplace_back(z, c);
  }
  return ramp;
}
}  // namespace

TintRamp load_ramp_file(const std::filesystem::path& path) {
  return ramp_from(config::load_file(path));
}

TintRamp load_ramp_string(const std::string& yaml_text, const std::string& name) {
  return ramp_from(config::load_string(yaml_text, name));
}

}  // namespace sheetmill::terrain
