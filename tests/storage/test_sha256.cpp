// SHA-256 against the example vectors of FIPS 180-2 (Appendix B.1, B.2, B.3),
// which FIPS 180-4 and NIST's published examples repeat.
#include <doctest/doctest.h>

#include <string>

#include "storage/sha256.hpp"

using soffit::storage::Sha256;
using soffit::storage::sha256_hex;

TEST_CASE("SHA-256 of the FIPS 180-2 one-block message \"abc\"") {
  const std::string m = "abc";
  // FIPS 180-2 Appendix B.1
  CHECK(sha256_hex(m.data(), m.size()) == "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
}

TEST_CASE("SHA-256 of the FIPS 180-2 448-bit two-block message") {
  const std::string m = "abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq";
  REQUIRE(m.size() * 8 == 448);
  // FIPS 180-2 Appendix B.2
  CHECK(sha256_hex(m.data(), m.size()) == "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1");
}

TEST_CASE("SHA-256 of one million 'a', fed in uneven pieces") {
  // FIPS 180-2 Appendix B.3; the pieces cross the 64-byte block boundary at every offset.
  Sha256 h;
  const std::string piece(997, 'a');
  size_t fed = 0;
  while (fed + piece.size() <= 1'000'000) {
    h.update(piece);
    fed += piece.size();
  }
  h.update(std::string(1'000'000 - fed, 'a'));
  CHECK(h.hex_digest() == "cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0");
}

TEST_CASE("SHA-256 of the empty message") {
  // FIPS 180-4 example values (NIST CSRC "SHA256.pdf", empty string), from memory
  CHECK(sha256_hex("", 0) == "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
}
