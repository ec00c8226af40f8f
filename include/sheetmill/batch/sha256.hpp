#pragma once
// SHA-256 (FIPS 180-4), streaming. Used for the input digests that decide whether a sheet of a
// batch is up to date; collisions are not a concern, a stable and well-known function is.
// hex() finishes the hash; update() after hex() is an internal error.

#include <array>
#include <cstddef>
#include <cstdint>
#include <string>
#include <string_view>

namespace sheetmill::batch {

class Sha256 {
 public:
  Sha256();
  void update(const void* data, std::size_t size);
  void update(std::string_view text) { update(text.data(), text.size()); }
  // Length-prefixed, so that ("ab","c") and ("a","bc") hash differently.
  void update_field(std::string_view text);
  void update_number(double value);
  // The 32-byte digest as 64 lowercase hex digits.
  std::string hex();

 private:
  void block(const std::uint8_t* p);
  std::array<std::uint32_t, 8> h_;
  std::array<std::uint8_t, 64> buffer_{};
  std::size_t buffered_ = 0;
  std::uint64_t total_bytes_ = 0;
  bool finished_ = false;
};

// Convenience: the hex digest of one string.
std::string sha256_hex(std::string_view text);

}  // namespace sheetmill::batch
