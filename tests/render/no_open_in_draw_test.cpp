// The draw phase takes values only (render/phases.hpp): no source file of the drawing stages
// calls a GDAL/OGR open function, nor one of the project's own wrappers that open a dataset or a
// file of inputs. Scanned in the sources themselves, comments and string literals left out, so a
// call added to a drawing file fails this test. The open functions are GDAL's C and C++ API
// (gdal.h, gdal_priv.h, ogr_api.h; https://gdal.org/api/); the wrappers are ours (core/gdal_env,
// terrain/dem, features/reader, sheet/tile_index, geomag/model).
#include <algorithm>
#include <catch2/catch.hpp>
#include <filesystem>
#include <fstream>
#include <regex>
#include <set>
#include <sstream>
#include <string>
#include <vector>

namespace fs = std::filesystem;

namespace {

const fs::path kSrc = fs::path(SHEETMILL_SOURCE_DIR) / "src";

// What opens data: GDAL's own functions, then the project's wrappers around them.
const std::regex kOpenCall(
    R"(\b(GDALOpen|GDALOpenEx|GDALOpenShared|OGROpen|OGROpenShared|OGR_Dr_Open|)"
    R"(GDALDataset\s*::\s*Open|GDALDataset\s*::\s*OpenShared|OGRSFDriverRegistrar\s*::\s*Open|)"
    R"(open_raster|open_vector|open_with|read_dem|read_dem_window|read_features|)"
    R"(read_tile_index|Model\s*::\s*load)\s*\()");

// The text with comments and string and character literals blanked (lines kept, so a hit can
// be reported by line).
std::string code_only(const std::string& s) {
  std::string out = s;
  enum { code, line_c, block_c, str, chr } st = code;
  for (std::size_t i = 0; i < s.size(); ++i) {
    const char c = s[i], n = i + 1 < s.size() ? s[i + 1] : '\0';
    switch (st) {
      case code:
        if (c == '/' && n == '/')
          st = line_c;
        else if (c == '/' && n == '*')
          st = block_c;
        else if (c == '"')
          st = str;
        else if (c == '\'')
          st = chr;
        else
          continue;
        out[i] = ' ';
        break;
      case line_c:
        if (c == '\n')
          st = code;
        else
          out[i] = ' ';
        break;
      case block_c:
        if (c == '*' && n == '/') {
          out[i] = out[i + 1] = ' ';
          ++i;
          st = code;
        } else if (c != '\n') {
          out[i] = ' ';
        }
        break;
      case str:
      case chr:
        if (c == '\\') {
          out[i] = ' ';
          if (i + 1 < s.size()) out[++i] = ' ';
        } else if ((st == str && c == '"') || (st == chr && c == '\'')) {
          out[i] = ' ';
          st = code;
        } else if (c != '\n') {
          out[i] = ' ';
        }
        break;
    }
  }
  return out;
}

// "file:line: call" for every open call in `text`.
std::vector<std::string> open_calls(const std::string& text, const std::string& name) {
  std::vector<std::string> hits;
  const std::string code = code_only(text);
  for (auto it = std::sregex_iterator(code.begin(), code.end(), kOpenCall);
       it != std::sregex_iterator(); ++it) {
    const auto line = 1 + std::count(code.begin(), code.begin() + it->position(), '\n');
    hits.push_back(name + ":" + std::to_string(line) + ": " + it->str());
  }
  return hits;
}

std::string slurp(const fs::path& p) {
  std::ifstream in(p, std::ios::binary);
  std::ostringstream s;
  s << in.rdbuf();
  return s.str();
}

// The drawing sources: whole stages, and the drawing files of the stages that also read.
std::vector<fs::path> drawing_sources() {
  std::vector<fs::path> files;
  auto whole = [&](const std::string& stage, const std::set<std::string>& except) {
    for (const auto& e : fs::directory_iterator(kSrc / stage)) {
      const std::string name = e.path().filename().string();
      if (except.count(name)) continue;
      if (e.path().extension() == ".cpp" || e.path().extension() == ".hpp")
        files.push_back(e.path());
    }
  };
  whole("draw", {});
  whole("labels", {});
  // The finisher's GeoTIFF export reopens the file it has just written, to check it is whole
  // before the rename: a read of the output, not of an input.
  whole("pdf", {"raster_export.cpp"});
  // The sheet stage's readers belong to read and prepare: the layout finds an index sheet, the
  // collar facts read the magnetic model and the DEM's footprint, the tile index reader.
  whole("sheet", {"layout.cpp", "sheet_info.cpp", "location_context.cpp", "tile_index.cpp"});
  for (const char* f : {"render/draw_sheet.cpp", "render/draw_order.cpp", "render/finish_sheet.cpp",
                        "contours/draw_contours.cpp"})
    files.push_back(kSrc / f);
  return files;
}

}  // namespace

TEST_CASE("the open-call scanner finds calls in code and ignores comments and strings",
          "[render]") {
  // Planted calls: the scan must find each, or the test below could not fail.
  CHECK(open_calls("auto d = GDALOpen(path, GA_ReadOnly);", "a").size() == 1);
  CHECK(open_calls("x = GDALOpenEx (p, 0, nullptr, nullptr, nullptr);", "a").size() == 1);
  CHECK(open_calls("DatasetPtr d(GDALDataset::Open(p.c_str()));", "a").size() == 1);
  CHECK(open_calls("h = OGROpen(p, 0, nullptr);", "a").size() == 1);
  CHECK(open_calls("auto r = open_raster(dem);", "a").size() == 1);
  CHECK(open_calls("auto m = geomag::Model::load(f);", "a").size() == 1);
  CHECK(open_calls("int n;\nauto t = sheet::read_tile_index(ti, crs);", "f.cpp") ==
        std::vector<std::string>{"f.cpp:2: read_tile_index("});
  // Not calls: comments, strings, longer names.
  CHECK(open_calls("// GDALOpen(path)\n/* OGROpen(p) */", "a").empty());
  CHECK(open_calls(R"(log("GDALOpen(x) failed");)", "a").empty());
  CHECK(open_calls("my_GDALOpen_count = 1; reopen_raster_cache();", "a").empty());
}

TEST_CASE("no drawing source opens a dataset or an input file", "[render]") {
  const auto files = drawing_sources();
  // The scan covers files that exist: every stage's drawing files, and the draw phase.
  REQUIRE(files.size() > 20);
  std::vector<std::string> hits;
  for (const fs::path& f : files) {
    INFO(f.string());
    REQUIRE(fs::is_regular_file(f));
    for (auto& h : open_calls(slurp(f), fs::relative(f, kSrc).string()))
      hits.push_back(std::move(h));
  }
  for (const auto& h : hits) UNSCOPED_INFO(h);
  CHECK(hits.empty());
}
