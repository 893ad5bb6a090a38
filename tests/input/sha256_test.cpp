// Specification of the input's fingerprint: SHA-256 as FIPS 180-4 defines it, whichever
// processor computes it.
#include "sifter/input/sha256.hpp"

#include <gtest/gtest.h>

#include <random>
#include <string>

namespace sifter {
namespace {

// FIPS 180-2, Appendix B.1-B.3 (the one-block, two-block and one-million-"a" messages) and the
// empty message; the digests recalled from memory and checked with Python's hashlib.
struct Vector {
  std::string message;
  const char* digest;
};

std::vector<Vector> published() {
  return {{"abc", "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad"},
          {"", "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855"},
          {"abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq",
           "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1"},
          {std::string(1000000, 'a'), "cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0"}};
}

TEST(Sha256, ThePublishedExamplesOnEveryPath) {
  for (const auto& v : published()) {
    SCOPED_TRACE(v.message.substr(0, 20));
    EXPECT_EQ(sha256_hex(v.message), v.digest);
    EXPECT_EQ(detail::sha256_hex_portable(v.message), v.digest);
    EXPECT_EQ(detail::sha256_hex_extensions(v.message), v.digest);
  }
}

// Every length around the block and padding boundaries (55/56/64 bytes), and random bytes:
// the SHA extensions give the portable code's digest. On a processor without them both calls
// run the portable code, and the test says so.
TEST(Sha256, TheProcessorsExtensionsGiveThePortableDigestAtEveryLength) {
  if (!detail::sha256_extensions_available())
    GTEST_SKIP() << "this processor has no SHA extensions: only the portable code runs";
  std::mt19937 rng(20261203);
  std::uniform_int_distribution<int> byte(0, 255);
  std::string text;
  for (std::size_t n = 0; n < 300; ++n) {
    EXPECT_EQ(detail::sha256_hex_extensions(text), detail::sha256_hex_portable(text)) << n << " bytes";
    text += static_cast<char>(byte(rng));
  }
  text.resize(100003);
  for (auto& c : text) c = static_cast<char>(byte(rng));
  EXPECT_EQ(detail::sha256_hex_extensions(text), detail::sha256_hex_portable(text));
}

}  // namespace
}  // namespace sifter
