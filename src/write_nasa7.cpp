#include "vibtherm/write_nasa7.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cctype>
#include <cmath>
#include <map>

#include "vibtherm/error.hpp"

namespace vibtherm {

namespace {

// 1PE15.8: sign or blank, one digit, 8 decimals, E, signed two-digit exponent.
std::string e15_8(double v, const std::string& name) {
  if (!std::isfinite(v)) fail({}, fmt::format("species '{}': coefficient {} cannot be written", name, v));
  std::string s = fmt::format("{:15.8E}", v);
  if (s.size() != 15) fail({}, fmt::format("species '{}': coefficient {} does not fit E15.8", name, v));
  return s;
}

// Fixed-point temperature in `width` columns with as many of 3 decimals as leave a blank
// in front: T_mid has only 8 columns (66-73), and "3000.0001000.000" would defeat the
// many readers that split line 1 on blanks.
std::string temperature_field(double T, int width, const std::string& name) {
  for (int decimals = 3; decimals >= 0; --decimals) {
    std::string s = fmt::format("{:{}.{}f}", T, width, decimals);
    if (static_cast<int>(s.size()) == width && s.front() == ' ') return s;
  }
  fail({}, fmt::format("species '{}': temperature {} K does not fit {} columns", name, T, width));
}

void check_name(const Nasa7& sp) {
  if (sp.name.empty()) fail({}, "NASA-7: a species has an empty name");
  if (sp.name.size() > 18)
    fail({}, fmt::format("species '{}': name has {} characters; NASA-7 allows 18 (columns 1-18): give a "
                         "shorter `name` in the species file",
                         sp.name, sp.name.size()));
  if (sp.name.find_first_of(" \t") != std::string::npos)
    fail({}, fmt::format("species '{}': NASA-7 names cannot contain blanks", sp.name));
  // A reader of the format takes '!' as the start of a comment, and a line starting with
  // END, THERMO or REACTIONS as a section keyword: such a name would not read back.
  if (sp.name.find('!') != std::string::npos)
    fail({},
         fmt::format("species '{}': NASA-7 names cannot contain '!' (a reader takes it as a comment): give "
                     "another `name` in the species file",
                     sp.name));
  std::string upper = sp.name;
  for (char& c : upper) c = static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
  for (const char* keyword : {"END", "THERMO", "REACTIONS"})
    if (upper.rfind(keyword, 0) == 0)
      fail({}, fmt::format("species '{}': a NASA-7 name cannot start with {} (a reader takes the line as the "
                           "keyword): give another `name` in the species file",
                           sp.name, keyword));
  if (sp.note.size() > 6)
    fail({}, fmt::format("species '{}': note '{}' is longer than 6 characters (columns 19-24)", sp.name,
                         sp.note));
}

std::string element_fields(const Nasa7& sp) {
  if (sp.composition.size() > 4)
    fail({}, fmt::format("species '{}' has {} elements; the NASA-7 record holds four: use --form nasa9 "
                         "(five) or --form json",
                         sp.name, sp.composition.size()));
  std::string out;
  for (const auto& e : sp.composition) {
    if (e.symbol.empty() || e.symbol.size() > 2)
      fail({}, fmt::format("species '{}': element symbol '{}' does not fit 2 columns", sp.name, e.symbol));
    if (e.count != std::round(e.count) || e.count < 0 || e.count > 999)
      fail({}, fmt::format("species '{}': element count {} of {} is not a whole number 0-999", sp.name,
                           e.count, e.symbol));
    out += fmt::format("{:<2}{:>3}", e.symbol, static_cast<int>(e.count));
  }
  out.resize(20, ' ');
  return out;
}

std::string numbered(std::string line, char number) {
  line.resize(79, ' ');
  line += number;
  return line + '\n';
}

}  // namespace

std::string write_nasa7_record(const Nasa7& sp) {
  check_name(sp);
  std::string out;
  for (const auto& c : sp.comments) out += "! " + c + '\n';
  // An 18-character name would run into the note (readers take the name up to the first
  // blank): the note then starts one column later, in columns 20-24.
  const std::string note = sp.name.size() == 18 && !sp.note.empty() ? " " + sp.note : sp.note;
  if (note.size() > 6)
    fail({}, fmt::format("species '{}': note '{}' does not fit columns 20-24 after an 18-character name",
                         sp.name, sp.note));
  std::string l1 = fmt::format("{:<18}{:<6}", sp.name, note);  // cols 1-24
  l1 += element_fields(sp);                                    // cols 25-44
  l1 += sp.phase;                                              // col 45
  l1 += temperature_field(sp.T_low_K, 10, sp.name);            // cols 46-55
  l1 += temperature_field(sp.T_high_K, 10, sp.name);           // cols 56-65
  l1 += temperature_field(sp.T_mid_K, 8, sp.name);             // cols 66-73
  out += numbered(l1, '1');
  const auto& h = sp.high;
  const auto& l = sp.low;
  out += numbered(e15_8(h[0], sp.name) + e15_8(h[1], sp.name) + e15_8(h[2], sp.name) + e15_8(h[3], sp.name) +
                      e15_8(h[4], sp.name),
                  '2');
  out += numbered(e15_8(h[5], sp.name) + e15_8(h[6], sp.name) + e15_8(l[0], sp.name) + e15_8(l[1], sp.name) +
                      e15_8(l[2], sp.name),
                  '3');
  out += numbered(e15_8(l[3], sp.name) + e15_8(l[4], sp.name) + e15_8(l[5], sp.name) + e15_8(l[6], sp.name),
                  '4');
  return out;
}

std::string write_nasa7(const std::vector<Nasa7>& species, const Nasa7WriteOptions& options) {
  std::string out;
  for (const auto& c : options.header_comments) out += "! " + c + '\n';
  if (options.thermo_wrapper) {
    // THERMO ALL, not THERMO: kinetics-input converters take the default-temperature line
    // that follows only after THERMO ALL (with bare THERMO they expect records at once).
    out += "THERMO ALL\n";
    // Default temperatures T_low, T_mid, T_high for records that omit them: the widest
    // range of the file and the most common T_mid.
    double lo = 300.0, mid = 1000.0, hi = 5000.0;
    if (!species.empty()) {
      lo = species.front().T_low_K;
      hi = species.front().T_high_K;
      for (const auto& s : species) {
        lo = std::min(lo, s.T_low_K);
        hi = std::max(hi, s.T_high_K);
      }
      // The most common T_mid, the first in file order among equals (counted once each:
      // a mechanism has thousands of records).
      std::map<double, int> count;
      for (const auto& s : species) ++count[s.T_mid_K];
      int best = 0;
      for (const auto& s : species) {
        const int n = count[s.T_mid_K];
        if (n > best) {
          best = n;
          mid = s.T_mid_K;
        }
      }
    }
    out += temperature_field(lo, 10, "THERMO") + temperature_field(mid, 10, "THERMO") +
           temperature_field(hi, 10, "THERMO") + '\n';
  }
  for (const auto& s : species) out += write_nasa7_record(s);
  if (options.thermo_wrapper) out += "END\n";
  return out;
}

}  // namespace vibtherm
