// `sheetmill symbols STYLE -o sheet.pdf`: the style's symbol sheet, every rule as a captioned
// swatch at print size (draw/symbol_sheet.hpp).
#include <memory>

#include "app/commands.hpp"
#include "sheetmill/core/file_format.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/draw/symbol_sheet.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::app {

void add_symbols_command(CLI::App& app, Action& action, const GlobalOptions&) {
  struct Args {
    std::string style;
    std::string output;
  };
  auto args = std::make_shared<Args>();
  CLI::App* cmd = app.add_subcommand(
      "symbols", "Print a style's symbol sheet: every rule as a swatch at print size, to PDF");
  cmd->add_option("style", args->style, "Style file (YAML)")->required()->type_name("FILE");
  cmd->add_option("-o,--output", args->output, "Output file (.pdf)")->required()->type_name("FILE");
  cmd->callback([args, &action] {
    action = [args] {
      file_format_for(args->output, {FileFormat::pdf});
      style::Style style = style::load_style(args->style);
      text::FontCache fonts;
      draw::write_symbol_sheet_pdf(args->output, style, fonts);
      log::info("symbols: wrote {}", args->output);
      return 0;
    };
  });
}

}  // namespace sheetmill::app
