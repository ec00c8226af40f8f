// `sheetmill declination`: magnetic declination and its annual change from a World Magnetic
// Model coefficient file. Thin: parse, call geomag, print.
#include <cstdio>

#include "app/commands.hpp"
#include "app/option_checks.hpp"
#include "sheetmill/geomag/model.hpp"
#include "sheetmill/geomag/report.hpp"

namespace sheetmill::app {

void add_declination_command(CLI::App& app, Action& action, const GlobalOptions&) {
  auto* cmd = app.add_subcommand(
      "declination", "Magnetic declination (east positive) and its annual change at a point");
  auto q = std::make_shared<geomag::DeclinationQuery>();
  auto model_file = std::make_shared<std::string>();
  cmd->add_option("--lat", q->lat_deg, "Geodetic latitude, degrees (north positive)")
      ->required()
      ->check(number_from(-90, 90, "a latitude", "degrees"))
      ->type_name("DEG");
  cmd->add_option("--lon", q->lon_deg, "Longitude, degrees (east positive)")
      ->required()
      ->check(number_from(-360, 360, "a longitude", "degrees"))
      ->type_name("DEG");
  cmd->add_option("--date", q->date, "YYYY-MM-DD or a decimal year")->required()->type_name("DATE");
  cmd->add_option("--height-km", q->height_km, "Height above the WGS 84 ellipsoid, km")
      ->check(number_from(-10, 1000, "a height", "km"))
      ->type_name("KM");
  cmd->add_option("--model", *model_file, "World Magnetic Model coefficient file (.COF)")
      ->required()
      ->type_name("FILE");
  cmd->callback([&action, q, model_file]() {
    action = [q, model_file]() {
      auto model = geomag::Model::load(*model_file);
      std::fputs(geomag::declination_report(model, *q).c_str(), stdout);
      return 0;
    };
  });
}

}  // namespace sheetmill::app
