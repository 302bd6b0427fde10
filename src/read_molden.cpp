// The Molden normal-mode reader; the format and the external-motion rule are described in
// read_molden.hpp.
#include "vibtherm/read_molden.hpp"

#include <fmt/format.h>

#include <Eigen/Geometry>
#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdint>
#include <filesystem>
#include <numeric>

#include "vibtherm/constants.hpp"
#include "vibtherm/elements.hpp"
#include "vibtherm/read_species.hpp"
#include "vibtherm/species_builder.hpp"
#include "vibtherm/units.hpp"

namespace vibtherm {
namespace {

struct Token {
  std::string_view text;
  int column;  // 1-based
};

struct Line {
  int number;  // 1-based
  std::vector<Token> tokens;
};

struct Section {
  std::string name;       // lower case, without brackets
  Token argument{{}, 0};  // the text after ']' (`AU`), empty when none
  int line = 0;
  std::vector<Line> body;  // its non-blank lines
};

std::vector<Token> tokenize(std::string_view line) {
  std::vector<Token> out;
  std::size_t i = 0;
  while (i < line.size()) {
    if (line[i] == ' ' || line[i] == '\t') {
      ++i;
      continue;
    }
    const std::size_t start = i;
    while (i < line.size() && line[i] != ' ' && line[i] != '\t') ++i;
    out.push_back({line.substr(start, i - start), static_cast<int>(start) + 1});
  }
  return out;
}

std::string lower(std::string_view text) {
  std::string out(text);
  for (char& c : out) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return out;
}

class MoldenReader {
 public:
  explicit MoldenReader(const std::string& file) : file_(file) {}
  Species read(const std::string& text, bool geometry_only);

 private:
  [[noreturn]] void error(int line, int column, const std::string& message) const {
    fail({file_, line, column}, message);
  }
  double number(const Line& line, std::size_t k, const std::string& what) const {
    const std::optional<double> v = parse_number(line.tokens[k].text);
    if (!v)
      error(line.number, line.tokens[k].column,
            what + " is " + quote(line.tokens[k].text) + ", expected a finite number");
    return *v;
  }
  void need_tokens(const Line& line, std::size_t count, const std::string& what,
                   const std::string& form) const {
    if (line.tokens.size() != count)
      error(line.number, line.tokens.front().column,
            fmt::format("{} has {} fields, expected {} ({})", what, line.tokens.size(), count, form));
  }
  std::vector<Section> split(const std::string& text) const;
  std::vector<Atom> fr_coord(const Section& s, std::vector<SourceLocation>& where) const;
  std::vector<Atom> atoms(const Section& s, std::vector<SourceLocation>& where) const;
  void check_modes(const Section& s, std::size_t modes, std::size_t atom_count) const;
  void check_intensities(const Section& s, std::size_t modes) const;

  std::string file_;
};

std::vector<Section> MoldenReader::split(const std::string& text) const {
  std::vector<Section> out;
  std::size_t start = 0;
  for (int number = 1; start <= text.size(); ++number) {
    std::size_t end = text.find('\n', start);
    if (end == std::string::npos) end = text.size();
    std::string_view line(text.data() + start, end - start);
    if (!line.empty() && line.back() == '\r') line.remove_suffix(1);
    if (number == 1 && line.substr(0, 3) == "\xEF\xBB\xBF") line.remove_prefix(3);
    start = end + 1;
    std::vector<Token> tokens = tokenize(line);
    if (tokens.empty()) continue;
    if (tokens[0].text.front() == '[') {
      const std::size_t open = line.find('[');
      const std::size_t close = line.find(']', open);
      if (close == std::string_view::npos)
        error(number, tokens[0].column,
              "section header " + quote(tokens[0].text) + " has no ']', expected [NAME]");
      Section s;
      s.name = lower(line.substr(open + 1, close - open - 1));
      s.line = number;
      const std::vector<Token> rest = tokenize(line.substr(close + 1));
      if (!rest.empty()) s.argument = {rest[0].text, rest[0].column + static_cast<int>(close) + 1};
      if (out.empty() && s.name != "molden format")
        error(number, tokens[0].column,
              "first section is " + quote(tokens[0].text) +
                  ", expected a Molden file to start with [Molden Format]");
      for (const Section& seen : out)
        if (seen.name == s.name && s.name != "molden format" &&
            (s.name == "freq" || s.name == "fr-coord" || s.name == "fr-norm-coord" || s.name == "atoms" ||
             s.name == "int"))
          error(number, tokens[0].column,
                fmt::format("second {} section (the first is at line {}), expected it once",
                            quote(tokens[0].text), seen.line));
      out.push_back(std::move(s));
    } else if (out.empty()) {
      error(number, tokens[0].column, "text before [Molden Format], expected a Molden file to start with it");
    } else {
      Section& s = out.back();
      // Only the sections read below keep their lines (not basis sets or orbitals), and a
      // list longer than a species may have is refused at its first line too many: a 32 MiB
      // [FREQ] of 16 million lines once took 1.2 GB before its count was checked.
      const bool per_mode = s.name == "freq" || s.name == "int";
      const bool per_atom = s.name == "fr-coord" || s.name == "atoms";
      if (!per_mode && !per_atom && s.name != "fr-norm-coord") continue;
      std::size_t cap = per_mode ? max_species_frequencies : per_atom ? max_species_atoms : SIZE_MAX;
      if (!per_mode && !per_atom) {
        // [FR-NORM-COORD] after [FREQ] and the geometry (the usual order): a header and a line
        // per atom for each mode, so a flood is refused at its first line too many.
        std::size_t modes = 0;
        std::size_t atoms = 0;
        for (const Section& seen : out) {
          if (seen.name == "freq") modes = seen.body.size();
          if (seen.name == "fr-coord" || (seen.name == "atoms" && atoms == 0)) atoms = seen.body.size();
        }
        if (modes > 0 && atoms > 0 && s.body.size() >= modes * (atoms + 1))
          error(number, tokens[0].column,
                fmt::format(
                    "[FR-NORM-COORD] has more than {} lines, expected {} modes of a 'vibration' line and "
                    "{} lines of x y z",
                    modes * (atoms + 1), modes, atoms));
      }
      if (s.body.size() >= cap) {
        const char* header = s.name == "freq"       ? "[FREQ]"
                             : s.name == "int"      ? "[INT]"
                             : s.name == "fr-coord" ? "[FR-COORD]"
                                                    : "[Atoms]";
        error(number, tokens[0].column,
              fmt::format("{} has more than {} lines, more than the {} {} this version accepts", header, cap,
                          cap, per_mode ? "frequencies" : "atoms"));
      }
      s.body.push_back({number, std::move(tokens)});
    }
  }
  if (out.empty())
    fail({file_, 0, 0}, "file holds no section, expected [Molden Format], [FR-COORD] and [FREQ]");
  return out;
}

// The leading letters of a label, title case: "o" → "O", "CL1" → "Cl".
std::string element_part(std::string_view label) {
  std::string out;
  for (char c : label) {
    if (!std::isalpha(static_cast<unsigned char>(c))) break;
    out += static_cast<char>(out.empty() ? std::toupper(static_cast<unsigned char>(c))
                                         : std::tolower(static_cast<unsigned char>(c)));
  }
  return out.empty() ? std::string(label) : out;
}

std::vector<Atom> MoldenReader::fr_coord(const Section& s, std::vector<SourceLocation>& where) const {
  std::vector<Atom> out;
  for (const Line& line : s.body) {
    const std::string what = fmt::format("[FR-COORD] atom {}", out.size() + 1);
    need_tokens(line, 4, what, "symbol x y z in bohr");
    Atom atom = atom_of(
        resolve_label(element_part(line.tokens[0].text), {file_, line.number, line.tokens[0].column}));
    for (std::size_t k = 0; k < 3; ++k)
      atom.position_angstrom[static_cast<int>(k)] =
          number(line, k + 1, what + " coordinate") * constants::bohr_radius_m / constants::angstrom_m;
    where.push_back({file_, line.number, line.tokens[0].column});
    out.push_back(std::move(atom));
  }
  return out;
}

std::vector<Atom> MoldenReader::atoms(const Section& s, std::vector<SourceLocation>& where) const {
  const std::string unit = lower(s.argument.text);
  if (unit != "au" && unit != "angs")
    error(s.line, s.argument.text.empty() ? 1 : s.argument.column,
          "[Atoms] unit is " + (s.argument.text.empty() ? std::string("missing") : quote(s.argument.text)) +
              ", expected AU (bohr) or Angs (ångström) after [Atoms]");
  const double to_angstrom = unit == "au" ? constants::bohr_radius_m / constants::angstrom_m : 1.0;
  std::vector<Atom> out;
  for (const Line& line : s.body) {
    const std::string what = fmt::format("[Atoms] atom {}", out.size() + 1);
    need_tokens(line, 6, what, "label index atomic-number x y z");
    const double z = number(line, 2, what + " atomic number");
    const std::optional<ElementInfo> element =
        z == std::floor(z) && z >= 1 && z <= 200 ? find_element_by_number(static_cast<int>(z)) : std::nullopt;
    if (!element)
      error(line.number, line.tokens[2].column,
            what + " atomic number is " + quote(line.tokens[2].text) +
                ", expected the number of a known element");
    Atom atom = atom_of(resolve_label(element->symbol, {file_, line.number, line.tokens[2].column}));
    for (std::size_t k = 0; k < 3; ++k)
      atom.position_angstrom[static_cast<int>(k)] = number(line, k + 3, what + " coordinate") * to_angstrom;
    where.push_back({file_, line.number, line.tokens[0].column});
    out.push_back(std::move(atom));
  }
  return out;
}

void MoldenReader::check_modes(const Section& s, std::size_t modes, std::size_t atom_count) const {
  std::size_t k = 0;
  std::size_t mode = 0;
  while (k < s.body.size()) {
    const Line& header = s.body[k++];
    ++mode;
    if (lower(header.tokens[0].text) != "vibration" || header.tokens.size() != 2 ||
        header.tokens[1].text != std::to_string(mode))
      error(header.number, header.tokens[0].column,
            fmt::format("[FR-NORM-COORD] line is {}, expected 'vibration {}' and then {} lines of x y z",
                        quote(header.tokens[0].text), mode, atom_count));
    if (mode > modes)
      error(header.number, header.tokens[0].column,
            fmt::format("[FR-NORM-COORD] has more modes than the {} of [FREQ], expected one per wavenumber",
                        modes));
    for (std::size_t a = 0; a < atom_count; ++a, ++k) {
      const std::string what = fmt::format("[FR-NORM-COORD] vibration {} atom {}", mode, a + 1);
      if (k >= s.body.size() || lower(s.body[k].tokens[0].text) == "vibration")
        error(
            header.number, header.tokens[0].column,
            fmt::format("[FR-NORM-COORD] vibration {} has {} atom lines, expected {}", mode, a, atom_count));
      need_tokens(s.body[k], 3, what, "x y z displacements");
      for (std::size_t c = 0; c < 3; ++c) number(s.body[k], c, what + " displacement");
    }
  }
  if (mode != modes)
    error(s.line, 1,
          fmt::format("[FR-NORM-COORD] has {} modes, expected {} (one per [FREQ] wavenumber)", mode, modes));
}

void MoldenReader::check_intensities(const Section& s, std::size_t modes) const {
  if (s.body.size() != modes)
    error(s.line, 1,
          fmt::format("[INT] has {} lines, expected {} (one per [FREQ] wavenumber)", s.body.size(), modes));
  for (std::size_t i = 0; i < s.body.size(); ++i)
    number(s.body[i], 0, fmt::format("[INT] intensity {}", i + 1));
}

bool collinear(const std::vector<Atom>& atoms) {
  if (atoms.size() < 3) return true;
  const Eigen::Vector3d origin = atoms[0].position_angstrom;
  Eigen::Vector3d axis = Eigen::Vector3d::Zero();
  for (const Atom& a : atoms)
    if ((a.position_angstrom - origin).norm() > axis.norm()) axis = a.position_angstrom - origin;
  axis.normalize();
  for (const Atom& a : atoms)
    if ((a.position_angstrom - origin).cross(axis).norm() > 1e-3) return false;
  return true;
}

Species MoldenReader::read(const std::string& text, bool geometry_only) {
  require_text(text, file_);
  const std::vector<Section> sections = split(text);
  const auto find = [&sections](const char* name) -> const Section* {
    for (const Section& s : sections)
      if (s.name == name) return &s;
    return nullptr;
  };
  Species species;
  species.origin = {file_, sections[0].line, 1};
  species.name = std::filesystem::path(file_).stem().string();
  if (species.name.empty()) species.name = "species";
  const Section* frc = find("fr-coord");
  const Section* at = find("atoms");
  if (!frc && !at)
    error(sections[0].line, 1, "no [FR-COORD] or [Atoms] section, expected the geometry of the normal modes");
  std::vector<SourceLocation> where;
  species.atoms = frc ? fr_coord(*frc, where) : atoms(*at, where);
  const Section& geometry = frc ? *frc : *at;
  if (species.atoms.empty())
    error(geometry.line, 1, "[" + geometry.name + "] lists no atoms, expected one line per atom");
  if (frc && at) {
    std::vector<SourceLocation> ignored;
    const std::vector<Atom> other = atoms(*at, ignored);
    if (other.size() != species.atoms.size())
      error(at->line, 1,
            fmt::format("[Atoms] has {} atoms but [FR-COORD] has {}, expected the same molecule",
                        other.size(), species.atoms.size()));
    for (std::size_t i = 0; i < other.size(); ++i)
      if (other[i].symbol != species.atoms[i].symbol)
        fail(where[i],
             fmt::format("atom {} is {} in [FR-COORD] but {} in [Atoms], expected the same molecule", i + 1,
                         species.atoms[i].symbol, other[i].symbol));
  }
  check_atoms_apart(species.atoms, where);
  species.formula = formula_of(species.atoms);
  species.key_locations["atoms"] = {file_, geometry.line, 1};

  const Section* freq = find("freq");
  if (!freq) {
    if (geometry_only || species.atoms.size() == 1) return species;
    error(sections[0].line, 1,
          "no [FREQ] section: this Molden file holds no normal modes, expected [FREQ] "
          "(or name this file with 'from:' in a species file that gives 'frequencies')");
  }
  species.key_locations["frequencies"] = {file_, freq->line, 1};
  std::vector<double> nu;
  for (const Line& line : freq->body) {
    const std::string what = fmt::format("[FREQ] entry {}", nu.size() + 1);
    need_tokens(line, 1, what, "one wavenumber in cm^-1 per line");
    nu.push_back(number(line, 0, what));
  }
  const std::size_t n = species.atoms.size();
  if (const Section* modes = find("fr-norm-coord")) check_modes(*modes, nu.size(), n);
  if (const Section* intensities = find("int")) check_intensities(*intensities, nu.size());
  if (nu.size() > 3 * n)
    error(freq->line, 1,
          fmt::format("[FREQ] has {} entries, more than 3N = {} for {} atoms", nu.size(), 3 * n, n));
  const std::size_t vibrations = n == 1 ? 0 : 3 * n - (collinear(species.atoms) ? 5 : 6);
  std::vector<bool> dropped(nu.size(), false);
  if (nu.size() > vibrations) {
    std::vector<std::size_t> order(nu.size());
    std::iota(order.begin(), order.end(), std::size_t{0});
    std::stable_sort(order.begin(), order.end(),
                     [&nu](std::size_t a, std::size_t b) { return std::abs(nu[a]) < std::abs(nu[b]); });
    const std::size_t surplus = nu.size() - vibrations;
    double largest = 0.0;
    for (std::size_t k = 0; k < surplus; ++k) {
      const std::size_t i = order[k];
      const Line& line = freq->body[i];
      if (!(std::abs(nu[i]) < molden_external_mode_cm1))
        error(line.number, line.tokens[0].column,
              fmt::format(
                  "[FREQ] entry {} is {:g} cm^-1: the file lists {} entries for {} vibrations and this would "
                  "be dropped as a translation or rotation, expected those {} entries below {:g} cm^-1",
                  i + 1, nu[i], nu.size(), vibrations, surplus, molden_external_mode_cm1));
      dropped[i] = true;
      largest = std::max(largest, std::abs(nu[i]));
    }
    species.reader_notes.push_back(fmt::format(
        "Molden file: dropped {} near-zero [FREQ] entries (|wavenumber| <= {:.3g} cm^-1) as translations "
        "and rotations, keeping {} vibrations",
        surplus, largest, vibrations));
  }
  for (std::size_t i = 0; i < nu.size(); ++i) {
    if (dropped[i]) continue;
    if (nu[i] == 0.0)
      error(freq->body[i].number, freq->body[i].tokens[0].column,
            fmt::format("[FREQ] entry {} is 0, expected a non-zero wavenumber (negative for imaginary)",
                        i + 1));
    species.frequencies_cm1.push_back(nu[i]);
  }
  return species;
}

}  // namespace

Species read_species_molden(const std::string& text, const std::string& file_name, bool geometry_only) {
  return MoldenReader(file_name).read(text, geometry_only);
}

}  // namespace vibtherm
