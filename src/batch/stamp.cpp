#include "sheetmill/batch/stamp.hpp"

#include <fcntl.h>
#include <fmt/format.h>
#include <unistd.h>
#include <yaml-cpp/yaml.h>

#include <ctime>

#include "sheetmill/batch/json_text.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/file_writer.hpp"

namespace sheetmill::batch {

namespace fs = std::filesystem;

fs::path stamp_path(const fs::path& output) {
  fs::path p = output;
  p += ".stamp";
  return p;
}

void write_stamp(const fs::path& output, const Stamp& s) {
  std::string text = "{\n";
  text += "  \"format\": \"sheetmill-stamp-1\",\n";
  text += "  \"sheet_id\": " + json_quote(s.sheet_id) + ",\n";
  text += "  \"digest\": " + json_quote(s.digest) + ",\n";
  text += fmt::format("  \"output_bytes\": {},\n", s.output_bytes);
  text += fmt::format("  \"seconds\": {:.3f},\n", s.seconds);
  text += "  \"rendered_utc\": " + json_quote(s.rendered_utc) + ",\n";
  text += "  \"program_version\": " + json_quote(s.program_version) + ",\n";
  text += "  \"parts\": {";
  bool first = true;
  for (const auto& [k, v] : s.parts) {
    text += (first ? "\n    " : ",\n    ") + json_quote(k) + ": " + json_quote(v);
    first = false;
  }
  text += "\n  }\n}\n";
  write_file_atomically(stamp_path(output), text);
}

std::optional<Stamp> read_stamp(const fs::path& output) {
  fs::path p = stamp_path(output);
  std::error_code ec;
  if (!fs::is_regular_file(p, ec)) return std::nullopt;
  try {
    // JSON as we write it is valid YAML flow syntax.
    YAML::Node n = YAML::LoadFile(p.string());
    if (!n.IsMap() || n["format"].as<std::string>("") != "sheetmill-stamp-1") return std::nullopt;
    Stamp s;
    s.sheet_id = n["sheet_id"].as<std::string>("");
    s.digest = n["digest"].as<std::string>("");
    s.output_bytes = n["output_bytes"].as<std::uintmax_t>(0);
    s.seconds = n["seconds"].as<double>(0);
    s.rendered_utc = n["rendered_utc"].as<std::string>("");
    s.program_version = n["program_version"].as<std::string>("");
    if (n["parts"].IsMap()) {
      for (const auto& kv : n["parts"]) {
        s.parts[kv.first.as<std::string>()] = kv.second.as<std::string>("");
      }
    }
    return s;
  } catch (const YAML::Exception&) {
    return std::nullopt;
  }
}

void remove_stamp(const fs::path& output) {
  fs::path p = stamp_path(output);
  std::error_code ec;
  if (!fs::remove(p, ec)) return;
  fs::path dir = p.parent_path().empty() ? fs::path(".") : p.parent_path();
  int fd = ::open(dir.c_str(), O_RDONLY | O_DIRECTORY);
  if (fd >= 0) {
    ::fsync(fd);
    ::close(fd);
  }
}

bool is_up_to_date(const fs::path& output, const std::string& digest) {
  std::optional<Stamp> s = read_stamp(output);
  if (!s || s->digest != digest || digest.empty()) return false;
  std::error_code ec;
  std::uintmax_t size = fs::file_size(output, ec);
  return !ec && size == s->output_bytes;
}

std::string utc_now_iso() {
  std::time_t t = std::time(nullptr);
  std::tm tm{};
  gmtime_r(&t, &tm);
  char buf[32];
  std::strftime(buf, sizeof buf, "%Y-%m-%dT%H:%M:%SZ", &tm);
  return buf;
}

}  // namespace sheetmill::batch
