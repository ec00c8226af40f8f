#include "sheetmill/batch/output_name.hpp"

#include <algorithm>
#include <array>
#include <cctype>
#include <cstdint>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/utf8.hpp"

namespace sheetmill::batch {

namespace fs = std::filesystem;

namespace {

constexpr std::size_t kMaxValueBytes = 150;
constexpr std::size_t kMaxComponentBytes = 200;

bool unsafe_ascii(unsigned char c) {
  static constexpr std::string_view kUnsafe = "/\\:*?\"<>|";
  return c < 0x20 || c == 0x7f || kUnsafe.find(char(c)) != std::string_view::npos;
}

std::string upper_ascii(std::string_view s) {
  std::string out(s);
  for (char& c : out) c = static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
  return out;
}

// Windows device names are reserved whatever the extension ("CON.pdf" too).
bool reserved_stem(std::string_view component) {
  std::string stem = upper_ascii(component.substr(0, component.find('.')));
  while (!stem.empty() && stem.back() == ' ') stem.pop_back();
  static const std::array<std::string_view, 4> kPlain = {"CON", "PRN", "AUX", "NUL"};
  if (std::find(kPlain.begin(), kPlain.end(), stem) != kPlain.end()) return true;
  return stem.size() == 4 && (stem.starts_with("COM") || stem.starts_with("LPT")) &&
         stem[3] >= '1' && stem[3] <= '9';
}

// The rules for a whole component, after substitution.
std::string finish_component(std::string c) {
  if (c.empty() || c == "." || c == "..") return "_";
  if (c.front() == '.') c.insert(c.begin(), '_');  // no hidden files, no "..x" tricks
  if (c.back() == '.' || c.back() == ' ') c.back() = '_';
  if (reserved_stem(c)) c.insert(c.begin(), '_');
  return c;
}

}  // namespace

std::string sanitise_component(std::string_view raw) {
  std::string out;
  for (std::size_t i = 0; i < raw.size() && out.size() < kMaxValueBytes;) {
    std::uint32_t cp = 0;
    std::size_t n = utf8_sequence(raw, i, cp);
    if (n == 0) {
      out.push_back('_');
      ++i;
      continue;
    }
    if ((n == 1 && unsafe_ascii(static_cast<unsigned char>(raw[i]))) ||
        hides_or_reorders_text(cp)) {
      out.push_back('_');
    } else if (out.size() + n <= kMaxValueBytes) {
      out.append(raw.substr(i, n));
    } else {
      break;  // never cut a character in half
    }
    i += n;
  }
  return finish_component(out);
}

fs::path expand_output_name(const std::string& file_template, const SheetJob& job,
                            const std::string& where) {
  if (file_template.empty()) throw_input_error(where, "the output file template is empty");
  if (file_template.front() == '/' || file_template.front() == '\\') {
    throw_input_error(
        where, "the output file template must be a relative path, got \"" + file_template + "\"");
  }
  auto value_of = [&](const std::string& field) -> std::string {
    if (field == "id") return job.id;
    if (field == "name") return job.name;
    auto it = job.fields.find(field);
    if (it == job.fields.end()) {
      throw_input_error(where, "the output file template names {" + field +
                                   "}, which is not a field of the tile index");
    }
    return it->second;
  };
  std::vector<std::string> components(1);
  for (std::size_t i = 0; i < file_template.size(); ++i) {
    char c = file_template[i];
    if (c == '{') {
      std::size_t close = file_template.find('}', i);
      if (close == std::string::npos) {
        throw_input_error(where,
                          "unclosed { in the output file template \"" + file_template + "\"");
      }
      std::string field = file_template.substr(i + 1, close - i - 1);
      std::string v = sanitise_component(value_of(field));
      // An all-unsafe value becomes "_" inside a longer component too.
      components.back() += v;
      i = close;
    } else if (c == '/') {
      components.emplace_back();
    } else if (unsafe_ascii(static_cast<unsigned char>(c))) {
      throw_input_error(where, "the output file template \"" + file_template +
                                   "\" holds a character not allowed in file names");
    } else {
      components.back().push_back(c);
    }
  }
  fs::path out;
  for (const std::string& raw : components) {
    if (raw == "..") {
      throw_input_error(where, "the output file template \"" + file_template +
                                   "\" must not climb out of the output folder with ..");
    }
    std::string c = finish_component(raw);
    if (c.size() > kMaxComponentBytes) {
      throw_input_error(where, "output file name \"" + c + "\" for sheet " +
                                   quote_untrusted(job.id) + " is longer than " +
                                   std::to_string(kMaxComponentBytes) + " bytes");
    }
    out /= c;
  }
  return out;
}

void check_unique_outputs(const std::vector<SheetJob>& jobs, const std::string& where) {
  std::vector<std::pair<std::string, std::size_t>> keys;
  keys.reserve(jobs.size());
  for (std::size_t i = 0; i < jobs.size(); ++i) {
    std::string k = jobs[i].output.lexically_normal().string();
    for (char& c : k) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    keys.emplace_back(std::move(k), i);
  }
  std::sort(keys.begin(), keys.end());
  for (std::size_t i = 1; i < keys.size(); ++i) {
    if (keys[i].first == keys[i - 1].first) {
      const SheetJob& a = jobs[keys[i - 1].second];
      const SheetJob& b = jobs[keys[i].second];
      // The IDs as the data holds them, escaped: their file names are what looks alike.
      throw_input_error(where, "sheets " + quote_untrusted(a.id) + " and " + quote_untrusted(b.id) +
                                   " would both be written to " + b.output.filename().string() +
                                   " (IDs must be unique; change the IDs or the file template)");
    }
  }
}

}  // namespace sheetmill::batch
