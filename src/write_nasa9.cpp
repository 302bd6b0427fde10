#include "vibtherm/write_nasa9.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <set>

#include "vibtherm/error.hpp"

namespace vibtherm {

namespace {

// A fixed-width field; anything wider than `width` is an error, not a truncation.
std::string field(const std::string& text, std::size_t width, const std::string& name, const char* what) {
  if (text.size() > width)
    fail({}, fmt::format("species '{}': {} '{}' does not fit {} columns of the NASA-9 record", name, what,
                         text, width));
  return text;
}

// D16.9: Fortran double-precision exponent letter, as in the published file.
std::string d16_9(double v, const std::string& name) {
  if (!std::isfinite(v)) fail({}, fmt::format("species '{}': coefficient {} cannot be written", name, v));
  std::string s = fmt::format("{:16.9E}", v);
  std::replace(s.begin(), s.end(), 'E', 'D');
  return field(s, 16, name, "coefficient");
}

std::string pad(std::string line, std::size_t width) {
  line.resize(std::max(line.size(), width), ' ');
  return line;
}

}  // namespace

std::string write_nasa9_record(const Nasa9& sp) {
  const std::string& name = sp.name;
  if (name.empty()) fail({}, "NASA-9: a species has an empty name");
  if (name.size() > 18)
    fail({}, fmt::format("species '{}': name has {} characters; the NASA-9 record allows 18 (columns 1-18): "
                         "give a shorter `name` in the species file",
                         name, name.size()));
  if (name.find_first_of(" \t") != std::string::npos)
    fail({}, fmt::format("species '{}': NASA-9 names cannot contain blanks", name));
  if (sp.composition.size() > 5)
    fail({}, fmt::format("species '{}' has {} elements; the NASA-9 record holds five: use --form json", name,
                         sp.composition.size()));
  if (sp.ranges.empty() || sp.ranges.size() > 9)
    fail({},
         fmt::format("species '{}': NASA-9 needs 1 to 9 temperature ranges, has {}", name, sp.ranges.size()));

  // Record 1: name (1-18), comment (19-80).
  // An 18-character name would run into the comment (readers take the name up to the first
  // blank): the comment then starts one column later.
  const std::string comment =
      name.size() == 18 && !sp.comment.empty() && sp.comment.front() != ' ' ? " " + sp.comment : sp.comment;
  std::string out = pad(name, 18) + field(comment, 62, name, "comment");
  while (!out.empty() && out.back() == ' ') out.pop_back();
  out += '\n';
  // Record 2: intervals I2 (1-2), date code (4-9), 5 × (A2, F6.2) (11-50), phase I2 (51-52),
  // molecular weight F13.7 (53-65), ΔfH°(298.15) in J/mol F15.5 (66-80).
  std::string r2 = fmt::format("{:>2} {:<6} ", sp.ranges.size(), field(sp.date_code, 6, name, "date code"));
  for (std::size_t i = 0; i < 5; ++i) {
    if (i < sp.composition.size()) {
      const auto& e = sp.composition[i];
      r2 += fmt::format("{:<2}", field(e.symbol, 2, name, "element symbol"));
      r2 += field(fmt::format("{:6.2f}", e.count), 6, name, "element count");
    } else {
      r2 += fmt::format("{:<2}{:6.2f}", "", 0.0);
    }
  }
  r2 += field(fmt::format("{:2d}", sp.phase), 2, name, "phase");
  r2 += field(fmt::format("{:13.7f}", sp.molar_mass_g_per_mol), 13, name, "molecular weight");
  r2 += field(fmt::format("{:15.5f}", sp.enthalpy_of_formation_J_per_mol), 15, name, "enthalpy of formation");
  out += r2 + '\n';
  for (const auto& r : sp.ranges) {
    // Interval record: T range (2-21), number of coefficients (23), exponents 8F5.1
    // (24-63), H°(298.15) − H°(0) in J/mol F15.3 (66-80).
    std::string r3 = " " + field(fmt::format("{:10.3f}", r.T_low_K), 10, name, "temperature") +
                     field(fmt::format("{:10.3f}", r.T_high_K), 10, name, "temperature") + " 7";
    for (double e : {-2.0, -1.0, 0.0, 1.0, 2.0, 3.0, 4.0, 0.0}) r3 += fmt::format("{:5.1f}", e);
    r3 += "  " + field(fmt::format("{:15.3f}", sp.H298_minus_H0_J_per_mol), 15, name, "H298-H0");
    out += r3 + '\n';
    std::string r4;
    for (int k = 0; k < 5; ++k) r4 += d16_9(r.a[k], name);
    out += r4 + '\n';
    out += d16_9(r.a[5], name) + d16_9(r.a[6], name) + std::string(16, ' ') + d16_9(r.b1, name) +
           d16_9(r.b2, name) + '\n';
  }
  return out;
}

std::string write_nasa9(const std::vector<Nasa9>& species, const Nasa9WriteOptions& options) {
  std::string out;
  for (const auto& c : options.header_comments) out += "! " + c + '\n';
  if (options.thermo_wrapper) {
    // The published file's second line lists the common range breakpoints (up to four,
    // F10.3 each); we list those of the first species.
    out += "thermo\n";
    std::set<double> bps;
    if (!species.empty()) {
      for (const auto& r : species.front().ranges) {
        bps.insert(r.T_low_K);
        bps.insert(r.T_high_K);
      }
    }
    std::string line;
    int n = 0;
    for (double t : bps)
      if (n++ < 4) line += fmt::format("{:10.3f}", t);
    out += line + '\n';
  }
  for (const auto& s : species) out += write_nasa9_record(s);
  if (options.thermo_wrapper) out += "END PRODUCTS\nEND REACTANTS\n";
  return out;
}

}  // namespace vibtherm
