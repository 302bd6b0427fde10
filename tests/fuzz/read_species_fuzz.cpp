// libFuzzer entry point for the species-file dispatcher (read_species): each input is
// written to a file whose extension the first byte picks (.yaml, .yml, .xyz or another),
// then read by path, so the size and regular-file checks and the choice of reader are
// exercised with the readers behind them. A malformed input must end in an InputError.
#include <unistd.h>

#include <cstddef>
#include <cstdint>
#include <filesystem>
#include <fstream>
#include <string>
#include <system_error>

#include "species_checks.hpp"
#include "vibtherm/error.hpp"
#include "vibtherm/read_species.hpp"

namespace {

// A directory of this process's own, removed when the fuzzer exits.
struct ScratchDirectory {
  std::filesystem::path path =
      std::filesystem::temp_directory_path() / ("vibtherm-fuzz-" + std::to_string(::getpid()));
  ScratchDirectory() { std::filesystem::create_directories(path); }
  ~ScratchDirectory() {
    std::error_code ignored;
    std::filesystem::remove_all(path, ignored);
  }
};

const std::filesystem::path& scratch_directory() {
  static const ScratchDirectory dir;
  return dir.path;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  static const char* const extensions[] = {".yaml", ".yml", ".xyz", ".txt"};
  const char* extension = extensions[size == 0 ? 0 : data[0] % 4];
  const std::filesystem::path path = scratch_directory() / (std::string("species") + extension);
  {
    std::ofstream out(path, std::ios::binary | std::ios::trunc);
    out.write(reinterpret_cast<const char*>(data), static_cast<std::streamsize>(size));
  }
  try {
    vibtherm::fuzz::check_species(vibtherm::read_species_file(path.string()));
  } catch (const vibtherm::InputError&) {
  }
  return 0;
}
