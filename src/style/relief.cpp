// The relief section: hillshading and the elevation tint under the map.
#include "style/reader.hpp"

namespace sheetmill::style::detail {

namespace {

bool is_off(const ConfigNode& n) {
  return n.is_scalar() && (n.as_string() == "off" || n.as_string() == "false");
}

// 0..1 or "40%".
double read_fraction(const ConfigNode& n) {
  std::optional<double> v;
  if (n.is_scalar()) {
    std::string s = n.as_string();
    bool percent = !s.empty() && s.back() == '%';
    v = parse_number(percent ? s.substr(0, s.size() - 1) : s);
    if (v && percent) *v /= 100;
  }
  if (!v || *v < 0 || *v > 1) n.fail_expected("a strength from 0 to 1 or 0% to 100%");
  return *v;
}

void read_shading(const ConfigNode& n, ReliefStyle& r) {
  if (is_off(n)) {
    r.hillshade = false;
    return;
  }
  n.expect_keys(
      {"method", "light_azimuth", "light_altitude", "exaggeration", "strength", "flat_ground"});
  r.hillshade = true;
  if (auto m = n.find("method")) {
    r.method = m->as_choice({"horn", "zevenbergen-thorne", "multidirectional"});
  }
  if (auto a = n.find("light_azimuth")) {
    r.azimuth_deg = a->as_angle_deg();
    if (r.azimuth_deg < 0 || r.azimuth_deg >= 360) a->fail_expected("an azimuth from 0 to 360");
  }
  if (auto a = n.find("light_altitude")) {
    r.altitude_deg = a->as_angle_deg();
    if (!(r.altitude_deg > 0 && r.altitude_deg <= 90)) {
      a->fail_expected("an altitude above 0 and up to 90 degrees");
    }
  }
  if (auto e = n.find("exaggeration")) {
    r.exaggeration = e->as_number();
    if (!(r.exaggeration > 0 && r.exaggeration <= 100)) e->fail_expected("a factor above 0");
  }
  if (auto s = n.find("strength")) r.shade_strength = read_fraction(*s);
  if (auto f = n.find("flat_ground"))
    r.flat_ground_white = f->as_choice({"white", "grey"}) == "white";
}

// `over: [low, high]` for a built-in ramp or for stops given in percent.
std::pair<double, double> read_over(const ConfigNode& over) {
  auto ends = over.items();
  if (ends.size() != 2) over.fail_expected("two elevations [low, high] such as [0m, 800m]");
  double low = ends[0].as_ground_length_m(), high = ends[1].as_ground_length_m();
  if (!(high > low)) over.fail("expected the high elevation above the low one");
  return {low, high};
}

// Stops at elevations ("120m") or, with `over`, at percentages of that range ("40%").
std::vector<TintStop> read_stops(const ConfigNode& n, const std::optional<ConfigNode>& over,
                                 const Reader& rd) {
  std::optional<std::pair<double, double>> range;
  if (over) range = read_over(*over);
  std::vector<TintStop> stops;
  for (const auto& item : n.items()) {
    item.expect_keys({"at", "colour"});
    ConfigNode at = item.at("at");
    std::string text = at.as_string();
    double elevation_m = 0;
    if (range) {
      std::optional<double> pct;
      if (!text.empty() && text.back() == '%') pct = parse_number(text.substr(0, text.size() - 1));
      if (!pct || *pct < 0 || *pct > 100) {
        at.fail_expected("a percentage of the over range such as 40% (stops with over)");
      }
      elevation_m = range->first + *pct / 100 * (range->second - range->first);
    } else {
      elevation_m = at.as_ground_length_m();
    }
    TintStop s{elevation_m, rd.colour(item.at("colour"))};
    if (!stops.empty() && !(s.elevation_m > stops.back().elevation_m)) {
      at.fail("expected tint stops in rising order, " + text + " is not above the stop before it");
    }
    stops.push_back(s);
  }
  if (stops.size() < 2)
    n.fail("expected at least two tint stops, got " + std::to_string(stops.size()));
  return stops;
}

void read_tint(const ConfigNode& n, const Reader& rd, ReliefStyle& r) {
  if (is_off(n)) {
    r.tint = false;
    return;
  }
  n.expect_keys({"stops", "ramp", "over", "stepped", "steps", "strength"});
  r.tint = true;
  if (n.has("stops") == n.has("ramp")) n.fail("expected either stops or a ramp (with over)");
  if (auto s = n.find("stops")) {
    r.tint_stops = read_stops(*s, n.find("over"), rd);
  } else {
    ConfigNode ramp = n.at("ramp");
    auto [low, high] = read_over(n.at("over"));
    auto stops = builtin_ramp(ramp.as_string(), low, high);
    if (!stops) {
      std::string names;
      for (const auto& name : builtin_ramp_names()) names += (names.empty() ? "" : ", ") + name;
      ramp.fail_expected("one of " + names);
    }
    r.tint_stops = *stops;
  }
  if (auto s = n.find("stepped")) r.tint_stepped = s->as_bool();
  if (auto s = n.find("steps")) {
    r.tint_steps_follow_contours = s->as_choice({"stops", "contours"}) == "contours";
    if (!r.tint_stepped) s->fail("steps needs stepped: true");
  }
  if (auto s = n.find("strength")) r.tint_strength = read_fraction(*s);
}

}  // namespace

ReliefStyle default_relief() {
  return ReliefStyle{};
}

ReliefStyle read_relief(const ConfigNode& n, Reader& rd, ReliefStyle r) {
  n.expect_keys({"shading", "tint", "water_shade", "raster_dpi", "resampling", "order"});
  if (auto o = n.find("order")) r.order = o->as_int();
  if (auto s = n.find("shading")) read_shading(*s, r);
  if (auto t = n.find("tint")) read_tint(*t, rd, r);
  if (auto w = n.find("water_shade")) r.water_shade = rd.colour(*w);
  if (auto d = n.find("raster_dpi")) {
    r.dpi = d->as_number();
    if (!(r.dpi >= 50 && r.dpi <= 1200)) d->fail_expected("a resolution from 50 to 1200 dpi");
  }
  if (auto s = n.find("resampling")) {
    r.resampling = s->as_choice({"auto", "cubic", "bilinear", "average"});
  }
  return r;
}

}  // namespace sheetmill::style::detail
