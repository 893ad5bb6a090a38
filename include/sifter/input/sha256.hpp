#pragma once
/// SHA-256 (FIPS 180-4) of a byte string, to fingerprint the input of a report.
#include <string>
#include <string_view>

namespace sifter {

/// Lower-case hexadecimal SHA-256 digest of the bytes: on the processor's SHA extensions where
/// it has them (x86-64), else portable code; the two give the same digest.
std::string sha256_hex(std::string_view bytes);

namespace detail {
/// Whether this processor has the x86 SHA extensions (and SSSE3, SSE4.1) that sifter uses.
bool sha256_extensions_available();
/// The digest by the portable code alone.
std::string sha256_hex_portable(std::string_view bytes);
/// The digest on the SHA extensions; the portable code where the processor lacks them.
std::string sha256_hex_extensions(std::string_view bytes);
}  // namespace detail

}  // namespace sifter
