// The pieces every species reader shares; see species_builder.hpp.
#include "vibtherm/species_builder.hpp"

#include <algorithm>
#include <cctype>
#include <charconv>
#include <cmath>

#include "vibtherm/constants.hpp"
#include "vibtherm/elements.hpp"
#include "vibtherm/spelling.hpp"

namespace vibtherm {

std::string quote(std::string_view text) {
  constexpr std::size_t max_shown = 40;
  std::string shown;
  for (char c : text.substr(0, max_shown)) {
    // Keep the one-line promise even when the offending text holds control characters.
    if (static_cast<unsigned char>(c) < 0x20 || c == 0x7f)
      shown += '?';
    else
      shown += c;
  }
  if (text.size() > max_shown) shown += "...";
  return "'" + shown + "'";
}

std::string join(const std::vector<std::string>& words) {
  std::string out;
  for (const std::string& w : words) out += (out.empty() ? "" : ", ") + w;
  return out;
}

std::pair<int, int> find_binary_content(const std::string& text) {
  int line = 1;
  int column = 1;
  for (std::size_t i = 0; i < text.size();) {
    auto byte = static_cast<unsigned char>(text[i]);
    std::size_t length = 0;
    if (byte == 0) return {line, column};
    if (byte < 0x80) {
      length = 1;
    } else if (byte >= 0xC2 && byte <= 0xDF) {
      length = 2;
    } else if (byte >= 0xE0 && byte <= 0xEF) {
      length = 3;
    } else if (byte >= 0xF0 && byte <= 0xF4) {
      length = 4;
    } else {
      return {line, column};
    }
    if (i + length > text.size()) return {line, column};
    for (std::size_t k = 1; k < length; ++k)
      if ((static_cast<unsigned char>(text[i + k]) & 0xC0) != 0x80) return {line, column};
    // Overlong 3- and 4-byte forms, UTF-16 surrogates and code points above U+10FFFF
    // (Unicode 15, table 3-7 "well-formed UTF-8 byte sequences").
    auto second = static_cast<unsigned char>(length > 1 ? text[i + 1] : 0);
    if ((byte == 0xE0 && second < 0xA0) || (byte == 0xED && second > 0x9F) ||
        (byte == 0xF0 && second < 0x90) || (byte == 0xF4 && second > 0x8F))
      return {line, column};
    if (byte == '\n') {
      ++line;
      column = 1;
    } else {
      ++column;
    }
    i += length;
  }
  return {0, 0};
}

void require_text(const std::string& text, const std::string& file_name) {
  auto [line, column] = find_binary_content(text);
  if (line > 0)
    fail({file_name, line, column},
         "not a text file (NUL byte or invalid UTF-8), expected a UTF-8 species description");
}

Atom atom_of(const AtomLabel& label) {
  Atom atom;
  atom.symbol = label.symbol;
  atom.isotope = label.isotope;
  atom.mass_number = label.mass_number;
  atom.mass_amu = label.mass_amu;
  return atom;
}

AtomLabel resolve_label(std::string_view label, const SourceLocation& where) {
  if (std::optional<IsotopeChoice> iso = find_isotope(label)) {
    AtomLabel out{iso->symbol, "", iso->mass_number, iso->mass_amu};
    if (label != iso->symbol) out.isotope = std::string(label);
    return out;
  }
  std::size_t digits = label.find_first_of("0123456789");
  std::string_view symbol = label.substr(0, digits);
  if (digits != std::string_view::npos && find_element(symbol))
    fail(where,
         "unknown isotope " + quote(label) + ", expected one of " + join(known_isotope_labels(symbol)));
  std::string suggestion = closest_element_symbol(symbol.empty() ? label : symbol);
  std::string message = "unknown element symbol " + quote(label);
  if (!suggestion.empty())
    message += ", did you mean '" + suggestion + "'?";
  else
    message += ", expected an element symbol such as C or Cl, or an isotope label such as D or C13";
  fail(where, message);
}

std::optional<AtomLabel> isotope_with_mass(std::string_view symbol, double mass_amu) {
  std::optional<AtomLabel> best;
  for (const std::string& label : known_isotope_labels(symbol)) {
    const std::optional<IsotopeChoice> iso = find_isotope(label);
    if (!iso || !(std::abs(iso->mass_amu - mass_amu) <= isotope_mass_tolerance_amu)) continue;
    const std::optional<ElementInfo> element = find_element(symbol);
    AtomLabel out{iso->symbol, "", iso->mass_number, iso->mass_amu};
    if (element && iso->mass_number != element->mass_number) out.isotope = label;
    // Of several labels for one isotope (H2 and D), the shortest.
    if (!best || (best->mass_number == out.mass_number && out.isotope.size() < best->isotope.size()))
      best = out;
  }
  return best;
}

std::optional<std::pair<std::size_t, std::size_t>> hessian_asymmetry(const std::vector<double>& full,
                                                                     std::size_t n) {
  double largest = 0.0;
  for (double v : full) largest = std::max(largest, std::abs(v));
  for (std::size_t i = 0; i < n; ++i)
    for (std::size_t j = 0; j < i; ++j)
      if (std::abs(full[i * n + j] - full[j * n + i]) > hessian_symmetry_tolerance * largest)
        return std::pair{i, j};
  return std::nullopt;
}

std::vector<double> symmetrised_hessian(const std::vector<double>& full, std::size_t n, double factor) {
  std::vector<double> out(n * n);
  for (std::size_t i = 0; i < n; ++i) {
    for (std::size_t j = 0; j < i; ++j)
      out[i * n + j] = out[j * n + i] = 0.5 * (full[i * n + j] + full[j * n + i]) * factor;
    out[i * n + i] = full[i * n + i] * factor;
  }
  return out;
}

std::vector<double> hessian_from_lower_triangle(const std::vector<double>& triangle, std::size_t n,
                                                double factor) {
  std::vector<double> out(n * n);
  std::size_t k = 0;
  for (std::size_t i = 0; i < n; ++i)
    for (std::size_t j = 0; j <= i; ++j, ++k) out[i * n + j] = out[j * n + i] = triangle[k] * factor;
  return out;
}

std::map<std::string, int> parse_formula_text(std::string_view text, const SourceLocation& where) {
  std::map<std::string, int> counts;
  std::size_t i = 0;
  if (text.empty()) fail(where, "empty formula, expected element symbols with counts such as CH4");
  while (i < text.size()) {
    if (!std::isupper(static_cast<unsigned char>(text[i])))
      fail(where, "cannot read formula " + quote(text) + " at " + quote(text.substr(i, 1)) +
                      ", expected element symbols with counts such as CH4 or C2H5OH");
    std::size_t start = i++;
    while (i < text.size() && std::islower(static_cast<unsigned char>(text[i]))) ++i;
    std::string symbol(text.substr(start, i - start));
    if (!find_element(symbol)) {
      std::string suggestion = closest_element_symbol(symbol);
      fail(where, "unknown element " + quote(symbol) + " in formula " + quote(text) +
                      (suggestion.empty() ? ", expected element symbols such as C, H, O"
                                          : ", did you mean '" + suggestion + "'?"));
    }
    int count = 1;
    std::size_t digits_start = i;
    while (i < text.size() && std::isdigit(static_cast<unsigned char>(text[i]))) ++i;
    if (i > digits_start) {
      auto [end, ec] = std::from_chars(text.data() + digits_start, text.data() + i, count);
      if (ec != std::errc() || count <= 0 || count > 100000)
        fail(where, "bad count in formula " + quote(text) + ", expected a positive whole number");
    }
    counts[symbol] += count;
    if (counts[symbol] > 100000) fail(where, "formula " + quote(text) + " has too many atoms");
  }
  return counts;
}

std::string formula_text(const std::map<std::string, int>& formula) {
  std::string out;
  for (const auto& [symbol, count] : formula) out += symbol + (count > 1 ? std::to_string(count) : "");
  return out;
}

void check_atoms_apart(const std::vector<Atom>& atoms, const std::vector<SourceLocation>& where) {
  // Quadratic, but species have at most a few hundred atoms.
  for (std::size_t i = 0; i < atoms.size(); ++i)
    for (std::size_t j = 0; j < i; ++j)
      if ((atoms[i].position_angstrom - atoms[j].position_angstrom).norm() < coincident_atoms_angstrom)
        fail(where[i], "atoms " + std::to_string(j + 1) + " and " + std::to_string(i + 1) +
                           " are at the same position, expected distinct coordinates in ångström");
}

std::map<std::string, int> formula_of(const std::vector<Atom>& atoms) {
  std::map<std::string, int> formula;
  for (const Atom& a : atoms) ++formula[a.symbol];
  return formula;
}

// I = h / (8 π² c B): moment of inertia from a rotational constant (common practice;
// e.g. Herzberg, Molecular Spectra and Molecular Structure II, 1945). B in cm^-1 → amu Å².
double moment_from_rotational_constant_amu_A2(double B_cm1) {
  using namespace constants;
  double B_per_m = B_cm1 * 100.0;
  double I_kg_m2 = planck_J_s / (8.0 * pi * pi * speed_of_light_m_s * B_per_m);
  return I_kg_m2 / (atomic_mass_constant_kg * angstrom_m * angstrom_m);
}

}  // namespace vibtherm
