#pragma once
// Invented place names for the demo area, built from syllables of our own and drawn
// deterministically from the seed. Every name handed out is unique within one NameMaker.

#include <cstdint>
#include <set>
#include <string>

#include "sheetmill/demo/random.hpp"

namespace sheetmill::demo {

class NameMaker {
 public:
  explicit NameMaker(std::uint64_t seed) : rng_(Random(seed).fork(77)) {}

  std::string settlement();  // "Orvwick"
  std::string farm();        // "Yarrow Farm" style: "<root> Farm"
  std::string summit();      // "Quen Knoll", "Skellan Top"
  std::string stream();      // "Lorvet Brook"
  std::string river();       // "River Thessan"
  std::string locality();    // "Caelmoor Heath"
  std::string root();        // a bare invented root, "Vessan"

 private:
  std::string fresh(std::string (NameMaker::*make)());
  std::string make_root();
  std::string make_settlement();
  Random rng_;
  std::set<std::string> used_;
};

}  // namespace sheetmill::demo
