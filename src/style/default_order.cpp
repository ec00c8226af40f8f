#include "sheetmill/style/default_order.hpp"

#include <algorithm>

namespace sheetmill::style {

int default_layer_order(const Layer& layer) {
  auto any = [&](auto has) { return std::any_of(layer.rules.begin(), layer.rules.end(), has); };
  const bool areas = any([](const Rule& r) { return r.area.has_value(); });
  const bool lines = any([](const Rule& r) { return r.line.has_value(); });
  const bool points = any([](const Rule& r) { return r.point.has_value(); });
  // The group names are the documented optional-content groups (docs/style.md, layers).
  if (layer.water_surface || layer.group == "water")
    return areas || !lines ? kWaterAreaOrder : kWaterLineOrder;
  if (layer.group == "buildings") return kBuildingOrder;
  if (areas) return kAreaFillOrder;
  if (lines) return kTransportOrder;
  if (points) return kPointSymbolOrder;
  return kNamesOrder;
}

}  // namespace sheetmill::style
