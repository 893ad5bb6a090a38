#pragma once
/// SHA-256 (FIPS 180-4) of a byte string, to fingerprint the input of a report.
#include <string>
#include <string_view>

namespace sifter {

/// Lower-case hexadecimal SHA-256 digest of the bytes.
std::string sha256_hex(std::string_view bytes);

}  // namespace sifter
