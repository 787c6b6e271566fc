// Tests of the SHA-256 digest (output_files.hpp, used by the manifest and the input echo of
// the calculation package) against published values, beyond those in test_output_files.cpp.
#include <catch2/catch.hpp>

#include <string>

#include "cairn/output/output_files.hpp"

using namespace cairn;

TEST_CASE("sha256: the published one-block and two-block examples", "[sha256][published]") {
  // NIST FIPS 180-4 examples (NIST CSRC "Cryptographic Standards and Guidelines: Examples
  // with Intermediate Values", SHA-256): "abc", one block.
  CHECK(sha256_hex("abc") ==
        "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  // The same examples: the 448-bit message "abcdbcde…nopq", two blocks after padding.
  CHECK(sha256_hex("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq") ==
        "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1");
}

TEST_CASE("sha256: the empty message", "[sha256][published]") {
  // NIST CAVP SHA-256 ShortMsg test vectors (SHAVS), Len = 0.
  CHECK(sha256_hex("") == "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
}

TEST_CASE("sha256: a million 'a' and messages at the padding boundaries", "[sha256][published]") {
  // FIPS 180-2 Appendix B.3 (the long message of the earlier edition of the standard):
  // one million repetitions of 'a'.
  CHECK(sha256_hex(std::string(1000000, 'a')) ==
        "cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0");
  // Lengths around the block and padding boundaries: 55 bytes pad into one block, 56 need a
  // second; 63, 64 and 65 cross a block. Values from GNU coreutils 9.1 `sha256sum`.
  CHECK(sha256_hex(std::string(55, 'x')) ==
        "d5e285683cd4efc02d021a5c62014694958901005d6f71e89e0989fac77e4072");
  CHECK(sha256_hex(std::string(56, 'x')) ==
        "04c26261370ee7541549d16dee320c723e3fd14671e66a099afe0a377c16888e");
  CHECK(sha256_hex(std::string(63, 'x')) ==
        "75220b47218278e656f2013bb8f0c455a25eaf01e86c64924e9d48d89776d6f2");
  CHECK(sha256_hex(std::string(64, 'x')) ==
        "7ce100971f64e7001e8fe5a51973ecdfe1ced42befe7ee8d5fd6219506b5393c");
  CHECK(sha256_hex(std::string(65, 'x')) ==
        "9537c5fdf120482f7d58d25e9ed583f52c02b4e304ea814db1633ad565aed7e9");
}
