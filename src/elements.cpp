// Element and isotope tables.
//
// Sources, and how the numbers got here:
// - Isotope masses: AME2020 atomic mass evaluation (Wang, Huang, Kondev, Audi & Naimi,
//   Chinese Phys. C 45, 030003 (2021)). Transcribed from memory of AME2020 / the
//   NIST "Atomic Weights and Isotopic Compositions" table that reproduces it, not read
//   from the document while writing; digits beyond ~1e-6 amu should be treated as such.
// - Most abundant isotope (mass number): IUPAC isotopic compositions (Meija et al.,
//   Pure Appl. Chem. 88, 293 (2016)), from memory. Tc has no stable isotope; we use
//   Tc-98, a long-lived isotope, as the quantum-chemistry default mass (common practice).
// - Standard atomic weights: IUPAC/CIAAW conventional (abridged) values, CIAAW 2021
//   (Prohaska et al., Pure Appl. Chem. 94, 573 (2022)), from memory. For Tc the mass
//   number of its longest-lived isotope is given in brackets by IUPAC; we use 98.
#include "vibtherm/elements.hpp"

#include <algorithm>
#include <array>
#include <cctype>
#include <charconv>
#include <vector>

#include "vibtherm/spelling.hpp"

namespace vibtherm {
namespace {

constexpr std::array<ElementInfo, 58> element_table{{
    {1, "H", 1, 1.00782503223, 1.008},
    {2, "He", 4, 4.00260325413, 4.002602},
    {3, "Li", 7, 7.0160034366, 6.94},
    {4, "Be", 9, 9.012183065, 9.0121831},
    {5, "B", 11, 11.00930536, 10.81},
    {6, "C", 12, 12.0, 12.011},  // exact by definition of the unified atomic mass unit
    {7, "N", 14, 14.00307400443, 14.007},
    {8, "O", 16, 15.99491461957, 15.999},
    {9, "F", 19, 18.99840316273, 18.998403162},
    {10, "Ne", 20, 19.9924401762, 20.1797},
    {11, "Na", 23, 22.9897692820, 22.98976928},
    {12, "Mg", 24, 23.985041697, 24.305},
    {13, "Al", 27, 26.98153853, 26.9815384},
    {14, "Si", 28, 27.97692653465, 28.085},
    {15, "P", 31, 30.97376199842, 30.973761998},
    {16, "S", 32, 31.9720711744, 32.06},
    {17, "Cl", 35, 34.968852682, 35.45},
    {18, "Ar", 40, 39.9623831237, 39.95},
    {19, "K", 39, 38.9637064864, 39.0983},
    {20, "Ca", 40, 39.962590863, 40.078},
    {21, "Sc", 45, 44.95590828, 44.955907},
    {22, "Ti", 48, 47.94794198, 47.867},
    {23, "V", 51, 50.94395704, 50.9415},
    {24, "Cr", 52, 51.94050623, 51.9961},
    {25, "Mn", 55, 54.93804391, 54.938043},
    {26, "Fe", 56, 55.93493633, 55.845},
    {27, "Co", 59, 58.93319429, 58.933194},
    {28, "Ni", 58, 57.93534241, 58.6934},
    {29, "Cu", 63, 62.92959772, 63.546},
    {30, "Zn", 64, 63.92914201, 65.38},
    {31, "Ga", 69, 68.9255735, 69.723},
    {32, "Ge", 74, 73.921177761, 72.630},
    {33, "As", 75, 74.92159457, 74.921595},
    {34, "Se", 80, 79.9165218, 78.971},
    {35, "Br", 79, 78.9183376, 79.904},
    {36, "Kr", 84, 83.9114977282, 83.798},
    {37, "Rb", 85, 84.9117897379, 85.4678},
    {38, "Sr", 88, 87.9056125, 87.62},
    {39, "Y", 89, 88.9058403, 88.905838},
    {40, "Zr", 90, 89.9046977, 91.222},
    {41, "Nb", 93, 92.9063730, 92.90637},
    {42, "Mo", 98, 97.90540482, 95.95},
    {43, "Tc", 98, 97.9072124, 98.0},  // no stable isotope, see the header comment
    {44, "Ru", 102, 101.9043441, 101.07},
    {45, "Rh", 103, 102.9054980, 102.90549},
    {46, "Pd", 106, 105.9034804, 106.42},
    {47, "Ag", 107, 106.9050916, 107.8682},
    {48, "Cd", 114, 113.90336509, 112.414},
    {49, "In", 115, 114.903878776, 114.818},
    {50, "Sn", 120, 119.90220163, 118.710},
    {51, "Sb", 121, 120.9038120, 121.760},
    {52, "Te", 130, 129.906222748, 127.60},
    {53, "I", 127, 126.9044719, 126.90447},
    {54, "Xe", 132, 131.9041550856, 131.293},
    {78, "Pt", 195, 194.9647917, 195.084},
    {79, "Au", 197, 196.96656879, 196.966570},
    {80, "Hg", 202, 201.97064340, 200.592},
    {82, "Pb", 208, 207.9766525, 207.2},
}};
// H..Xe (54 elements) plus Pt, Au, Hg, Pb.
static_assert(element_table.size() == 54 + 4);

constexpr bool table_is_ordered() {
  for (std::size_t i = 1; i < element_table.size(); ++i)
    if (element_table[i].atomic_number <= element_table[i - 1].atomic_number) return false;
  for (std::size_t i = 0; i < 54; ++i)
    if (element_table[i].atomic_number != static_cast<int>(i) + 1) return false;
  return true;
}
static_assert(table_is_ordered(), "element_table must list Z = 1..54 in order, then heavier ones");

struct OtherIsotope {
  std::string_view symbol;
  int mass_number;
  double mass_amu;
};

// Common stable (and two long-lived) isotopes other than the most abundant one, for
// isotopic substitution. Masses: AME2020, transcribed from memory (see the file header).
constexpr std::array<OtherIsotope, 27> other_isotopes{{
    {"H", 2, 2.01410177812},  // deuterium
    {"H", 3, 3.0160492779},   // tritium (radioactive, used for isotope effects)
    {"He", 3, 3.0160293201},    {"Li", 6, 6.0151228874},   {"B", 10, 10.01293695},
    {"C", 13, 13.00335483507},  {"C", 14, 14.0032419884},  // radioactive, long-lived
    {"N", 15, 15.00010889888},  {"O", 17, 16.99913175650}, {"O", 18, 17.99915961286},
    {"Ne", 22, 21.991385114},   {"Mg", 25, 24.985836976},  {"Mg", 26, 25.982592968},
    {"Si", 29, 28.97649466490}, {"Si", 30, 29.973770136},  {"S", 33, 32.9714589098},
    {"S", 34, 33.967867004},    {"Cl", 37, 36.965902602},  {"Ar", 36, 35.967545105},
    {"K", 41, 40.96182525},     {"Ca", 44, 43.95548156},   {"Fe", 54, 53.93960899},
    {"Ni", 60, 59.93078588},    {"Cu", 65, 64.92778970},   {"Zn", 66, 65.92603381},
    {"Se", 78, 77.9173091},     {"Br", 81, 80.9162897},
}};

char lower(char c) { return static_cast<char>(std::tolower(static_cast<unsigned char>(c))); }

bool equal_ignoring_case(std::string_view a, std::string_view b) {
  return a.size() == b.size() &&
         std::equal(a.begin(), a.end(), b.begin(), [](char x, char y) { return lower(x) == lower(y); });
}

}  // namespace

std::span<const ElementInfo> all_elements() { return element_table; }

std::optional<ElementInfo> find_element(std::string_view symbol) {
  for (const ElementInfo& e : element_table)
    if (e.symbol == symbol) return e;
  return std::nullopt;
}

std::optional<ElementInfo> find_element_by_number(int atomic_number) {
  for (const ElementInfo& e : element_table)
    if (e.atomic_number == atomic_number) return e;
  return std::nullopt;
}

std::optional<IsotopeChoice> find_isotope(std::string_view label) {
  if (label == "D") label = "H2";
  if (label == "T") label = "H3";
  // Split "Cl37" into the symbol and the mass number.
  std::size_t digits = label.find_first_of("0123456789");
  std::string_view symbol = label.substr(0, digits);
  std::optional<ElementInfo> element = find_element(symbol);
  if (!element) return std::nullopt;
  if (digits == std::string_view::npos)
    return IsotopeChoice{std::string(symbol), element->mass_number, element->isotope_mass_amu};
  std::string_view number_text = label.substr(digits);
  if (number_text.front() == '0') return std::nullopt;  // "C013" is not a label
  int mass_number = 0;
  auto [end, ec] = std::from_chars(number_text.data(), number_text.data() + number_text.size(), mass_number);
  if (ec != std::errc() || end != number_text.data() + number_text.size()) return std::nullopt;
  if (mass_number == element->mass_number)
    return IsotopeChoice{std::string(symbol), mass_number, element->isotope_mass_amu};
  for (const OtherIsotope& iso : other_isotopes)
    if (iso.symbol == symbol && iso.mass_number == mass_number)
      return IsotopeChoice{std::string(symbol), mass_number, iso.mass_amu};
  return std::nullopt;
}

std::vector<std::string> known_isotope_labels(std::string_view symbol) {
  std::vector<std::string> labels;
  std::optional<ElementInfo> element = find_element(symbol);
  if (!element) return labels;
  std::vector<int> numbers{element->mass_number};
  for (const OtherIsotope& iso : other_isotopes)
    if (iso.symbol == symbol) numbers.push_back(iso.mass_number);
  std::sort(numbers.begin(), numbers.end());
  for (int n : numbers) labels.push_back(std::string(symbol) + std::to_string(n));
  if (symbol == "H") {
    labels.push_back("D");
    labels.push_back("T");
  }
  return labels;
}

std::string closest_element_symbol(std::string_view symbol) {
  if (symbol.empty()) return "";
  // "CL" or "cl" for "Cl" is by far the most common slip.
  for (const ElementInfo& e : element_table)
    if (equal_ignoring_case(e.symbol, symbol)) return std::string(e.symbol);
  // Otherwise one edit away, keeping the first letter: "Hx" -> "He", "Cll" -> "Cl".
  // Among ties the lighter element wins, being the more likely in a frequency job.
  std::string best;
  for (const ElementInfo& e : element_table) {
    if (lower(e.symbol.front()) != lower(symbol.front())) continue;
    if (edit_distance(e.symbol, symbol, LetterCase::ignored) == 1) {
      best = std::string(e.symbol);
      break;
    }
  }
  return best;
}

}  // namespace vibtherm
