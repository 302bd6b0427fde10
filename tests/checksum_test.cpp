#include "vibtherm/checksum.hpp"

#include <doctest/doctest.h>

using namespace vibtherm;

TEST_CASE("SHA-256 test vectors") {
  // FIPS 180-2, Appendix B.1 ("abc"), and the digest of the empty message (common practice).
  CHECK(sha256_hex("abc") == "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  CHECK(sha256_hex("") == "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
}
