#pragma once
// `render --plates DIR`: one greyscale plate per ink of the style's press section. The sheet is
// rendered once per ink from the style as that plate sees it (style::load_style with the ink),
// then written as a coverage GeoTIFF with registration marks (print/plate.hpp). DIR also gets
// plates.txt: which ink each file carries and which layers put ink on it. The folder appears
// whole or not at all (a temporary folder beside it, then renamed; an existing DIR is replaced).

#include <filesystem>
#include <string>
#include <vector>

#include "sheetmill/project/project.hpp"
#include "sheetmill/render/render.hpp"
#include "sheetmill/style/style.hpp"

namespace sheetmill::render {

struct PlateReport {
  std::string ink;
  std::filesystem::path file;  // inside the plates folder
  std::vector<std::string> layers;
  double mean_coverage = 0;  // 0..1
};

// `style` must have been loaded from its file (Style::file), which is read again per ink.
// Throws Error(input) when the style names no inks or a colour is on no plate.
std::vector<PlateReport> render_plates(const project::Project& project, const style::Style& style,
                                       const std::filesystem::path& dir, double dpi,
                                       const RenderOptions& options = {});

// The plate report as written to plates.txt.
std::string describe_plates(const std::vector<PlateReport>& plates, const style::Style& style,
                            double dpi);

}  // namespace sheetmill::render
