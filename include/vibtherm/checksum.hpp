// Checksums for provenance records: SHA-256 (FIPS 180-4) through OpenSSL's libcrypto,
// so that a user can compare with `sha256sum`.
#pragma once

#include <string>
#include <string_view>

namespace vibtherm {

// Lower-case hexadecimal SHA-256 digest of `bytes`.
std::string sha256_hex(std::string_view bytes);

}  // namespace vibtherm
