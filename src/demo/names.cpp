#include "sheetmill/demo/names.hpp"

#include <array>

namespace sheetmill::demo {

namespace {

// Syllables chosen to sound like a place without being one; combinations are checked only
// for uniqueness within the area.
constexpr std::array<const char*, 28> kHeads = {
    "Quen", "Orv",   "Thal",  "Yarr", "Cael", "Lorv",  "Skell", "Vess", "Dwin", "Jask",
    "Ulv",  "Zell",  "Brisk", "Mirr", "Oss",  "Grell", "Havv",  "Tess", "Wenn", "Carr",
    "Fenn", "Hollv", "Ebb",   "Rusk", "Sarn", "Pell",  "Kest",  "Norr"};
constexpr std::array<const char*, 10> kLinks = {"a", "e", "i", "o", "an", "en", "el", "ar", "", ""};
constexpr std::array<const char*, 14> kTowns = {"wick",  "holt",  "stead", "by",    "thorpe",
                                                "ham",   "combe", "ley",   "worth", "den",
                                                "field", "ton",   "hope",  "mere"};
constexpr std::array<const char*, 6> kSummits = {"Knoll", "Top", "Crag", "Hill", "Pike", "Edge"};
constexpr std::array<const char*, 5> kStreams = {"Brook", "Beck", "Water", "Burn", "Rill"};
constexpr std::array<const char*, 6> kLocalities = {"Heath", "Moor", "Wood",
                                                    "Flats", "Leas", "Hollow"};

template <std::size_t N>
const char* pick(Random& rng, const std::array<const char*, N>& list) {
  return list[static_cast<std::size_t>(rng.below(static_cast<int>(N)))];
}

}  // namespace

std::string NameMaker::make_root() {
  std::string s = pick(rng_, kHeads);
  s += pick(rng_, kLinks);
  if (s.size() < 4) s += "en";
  return s;
}

std::string NameMaker::make_settlement() {
  std::string head = pick(rng_, kHeads);
  std::string tail = pick(rng_, kTowns);
  // Avoid doubled consonants across the join ("Skell" + "ley" -> "Skelley" is fine, but
  // "Ossstead" is not).
  if (!tail.empty() && head.back() == tail.front() && head[head.size() - 2] == head.back()) {
    head.pop_back();
  }
  return head + tail;
}

std::string NameMaker::fresh(std::string (NameMaker::*make)()) {
  for (int attempt = 0;; ++attempt) {
    std::string s = (this->*make)();
    if (attempt > 50) s += " " + std::to_string(attempt);
    if (used_.insert(s).second) return s;
  }
}

std::string NameMaker::root() {
  return fresh(&NameMaker::make_root);
}
std::string NameMaker::settlement() {
  return fresh(&NameMaker::make_settlement);
}

std::string NameMaker::farm() {
  std::string r = root();
  return r + " Farm";
}

std::string NameMaker::summit() {
  std::string r = root();
  return r + " " + pick(rng_, kSummits);
}

std::string NameMaker::stream() {
  std::string r = root();
  return r + " " + pick(rng_, kStreams);
}

std::string NameMaker::river() {
  return "River " + root();
}

std::string NameMaker::locality() {
  std::string r = root();
  return r + " " + pick(rng_, kLocalities);
}

}  // namespace sheetmill::demo
