#include "sheetmill/batch/sha256.hpp"

#include <catch2/catch.hpp>
#include <string>

#include "support/test_env.hpp"

using sheetmill::batch::Sha256;
using sheetmill::batch::sha256_hex;

// Published example digests: FIPS 180-2, Appendix B (B.1 "abc", B.2 the 448-bit message,
// B.3 one million "a"); the empty-message digest is the widely published value (NIST CSRC
// examples page), cross-checked below with coreutils' sha256sum.
TEST_CASE("SHA-256 matches the FIPS 180-2 example digests", "[batch]") {
  CHECK(sha256_hex("abc") == "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  CHECK(sha256_hex("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq") ==
        "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1");
  Sha256 million;
  std::string chunk(1000, 'a');
  for (int i = 0; i < 1000; ++i) million.update(chunk);
  CHECK(million.hex() == "cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0");
  CHECK(sha256_hex("") == "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
}

TEST_CASE("SHA-256 agrees with coreutils sha256sum across block boundaries", "[batch]") {
  sheetmill::test::TempDir dir;
  // Lengths around the 55/56/64-byte padding edges, where hand-written padding goes wrong.
  for (std::size_t n : {55u, 56u, 63u, 64u, 65u, 119u, 120u, 1000u}) {
    std::string data;
    for (std::size_t i = 0; i < n; ++i) data.push_back(static_cast<char>((i * 131 + 7) & 0xff));
    sheetmill::test::write_text(dir / "data.bin", data);
    auto r = sheetmill::test::run_command({"sha256sum", (dir / "data.bin").string()});
    REQUIRE(r.exit_code == 0);
    // Fed in uneven pieces, to exercise the buffering too.
    Sha256 h;
    for (std::size_t at = 0; at < n; at += 17) h.update(data.substr(at, 17));
    CHECK(h.hex() == r.out.substr(0, 64));
  }
}
