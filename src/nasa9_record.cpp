// One NASA-9 record (McBride, Zehe & Gordon, NASA/TP-2002-211556): record 1 (name,
// comment), record 2 (intervals, date, formula, phase, molar mass, ΔfH°), then three lines
// per temperature interval, in fixed columns or spaced.
#include <fmt/format.h>

#include <algorithm>
#include <cmath>

#include "nasa_text.hpp"
#include "vibtherm/limits.hpp"

namespace vibtherm::nasa_text {

namespace {

// Interval line: T range 2F11.3 (columns 1-22), coefficient count I1 (23), T exponents
// 8F5.1 (24-63), H(298.15) - H(0) F15.3 (66-80). The published files leave no blank
// between T_high and the count ("1000.0007 -2.0"); ours write one. Fixed columns first,
// then spaced numbers.
std::optional<std::vector<double>> interval_fields(const std::string& text) {
  if (text.size() < 63) return std::nullopt;
  std::vector<double> out;
  for (auto [a, b] : {std::pair{1, 11}, std::pair{12, 22}, std::pair{23, 23}}) {
    const auto v = to_number(column_text(text, a, b));
    if (!v) return std::nullopt;
    out.push_back(*v);
  }
  for (int k = 0; k < 8; ++k) {
    const auto v = to_number(column_text(text, 24 + 5 * k, 28 + 5 * k));
    if (!v) return std::nullopt;
    out.push_back(*v);
  }
  if (!trim(column_text(text, 64, 65)).empty()) return std::nullopt;
  const std::string h = column_text(text, 66, 80);
  if (!trim(h).empty()) {
    const auto v = to_number(h);
    if (!v) return std::nullopt;
    out.push_back(*v);
  }
  return out;
}

// Coefficient lines: 5D16.9; the second holds a6, a7, an unused field, b1, b2.
std::optional<std::vector<double>> d16_fields(const std::string& text, bool second) {
  if (text.size() < 80) return std::nullopt;
  std::vector<double> out;
  for (int k = 0; k < 5; ++k) {
    const std::string f = column_text(text, 1 + 16 * k, 16 + 16 * k);
    if (second && k == 2) continue;
    const auto v = to_number(f);
    if (!v) return std::nullopt;
    out.push_back(*v);
  }
  return out;
}

}  // namespace

std::optional<Nasa9> read_nasa9_record(Cursor& cur) {
  const Line& r1 = cur.lines[cur.i];
  Nasa9 sp;
  sp.name = first_token(r1.text);
  sp.comment = std::string(trim(column_text(r1.text, 19, 80)));
  ++cur.i;
  cur.next_content();
  const Line& r2 = cur.lines[cur.i];
  const auto count = to_number(column_text(r2.text, 1, 2));
  const int nranges = static_cast<int>(count.value_or(to_number(first_token(r2.text)).value_or(-1)));
  if (nranges < 0 || nranges > 9)
    cur.fail_at(r2, 1,
                fmt::format("species '{}': expected the number of temperature intervals (0-9) in columns 1-2",
                            sp.name));
  sp.date_code = std::string(trim(column_text(r2.text, 4, 9)));
  sp.composition = composition_fields(r2.text, 11, 5, 2, 6).value_or(std::vector<ElementAmount>{});
  const auto phase = to_number(column_text(r2.text, 51, 52));
  const auto mw = to_number(column_text(r2.text, 53, 65));
  const auto hf = to_number(column_text(r2.text, 66, 80));
  if (!phase || !mw || !hf)
    cur.fail_at(r2, 51,
                fmt::format("species '{}': expected phase (cols 51-52), molecular weight (53-65) and "
                            "enthalpy of formation (66-80)",
                            sp.name));
  // The electron's molar mass, 5.5e-4 g/mol, is in the published database: no lower bound.
  if (!(*mw >= 0 && *mw <= limits::max_mass_amu))
    cur.fail_at(r2, 53,
                fmt::format("species '{}': molecular weight {:g}, expected 0 to {:g} g/mol", sp.name, *mw,
                            limits::max_mass_amu));
  if (!(std::abs(*hf) <= limits::max_enthalpy_of_formation_J_per_mol))
    cur.fail_at(
        r2, 66,
        fmt::format("species '{}': enthalpy of formation {:g} J/mol, expected at most {:g} in magnitude",
                    sp.name, *hf, limits::max_enthalpy_of_formation_J_per_mol));
  sp.phase = static_cast<int>(*phase);
  sp.molar_mass_g_per_mol = *mw;
  sp.enthalpy_of_formation_J_per_mol = *hf;
  if (nranges == 0) {
    // An assigned enthalpy at one temperature, no polynomial: the T line is skipped.
    ++cur.i;
    if (cur.next_content()) ++cur.i;
    return std::nullopt;
  }
  for (int r = 0; r < nranges; ++r) {
    ++cur.i;
    if (!cur.next_content())
      cur.fail_at(cur.lines.back(), 0,
                  fmt::format("species '{}': file ends inside its NASA-9 record (interval {} of {})", sp.name,
                              r + 1, nranges));
    const Line& tl = cur.lines[cur.i];
    const std::string ttext = strip_comment(tl.text);
    std::vector<Number> nums;
    if (const auto f = interval_fields(ttext)) {
      static constexpr int columns[] = {1, 12, 23, 24, 29, 34, 39, 44, 49, 54, 59, 66};
      for (std::size_t k = 0; k < f->size(); ++k) {
        int c = columns[k];  // the field's first written character
        while (c <= static_cast<int>(ttext.size()) && ttext[static_cast<std::size_t>(c - 1)] == ' ') ++c;
        nums.push_back(Number{(*f)[k], c, false});
      }
    } else {
      int stop = 0;
      nums = scan_numbers(ttext, 1, stop);
      if (stop != 0 || nums.size() < 10)
        cur.fail_at(tl, stop ? stop : 1,
                    fmt::format("species '{}': expected T_low, T_high, the coefficient count and the T "
                                "exponents of interval {}",
                                sp.name, r + 1));
    }
    Nasa9Range range;
    range.T_low_K = nums[0].value;
    range.T_high_K = nums[1].value;
    if (nums[2].value != 7)
      cur.fail_at(tl, nums[2].column,
                  fmt::format("species '{}': interval {} has {} coefficients; only 7 are supported", sp.name,
                              r + 1, nums[2].value));
    for (int k = 0; k < 7; ++k)
      if (nums[3 + k].value != k - 2)
        cur.fail_at(
            tl, nums[3 + k].column,
            fmt::format("species '{}': interval {}: T exponents must be -2 -1 0 1 2 3 4, found {:g} at "
                        "position {}",
                        sp.name, r + 1, nums[3 + k].value, k + 1));
    if (r == 0 && nums.size() >= 11) {
      sp.H298_minus_H0_J_per_mol = nums.back().value;
      if (!(std::abs(sp.H298_minus_H0_J_per_mol) <= limits::max_enthalpy_of_formation_J_per_mol))
        cur.fail_at(
            tl, nums.back().column,
            fmt::format("species '{}': H(298.15 K) - H(0) {:g} J/mol, expected at most {:g} in magnitude",
                        sp.name, sp.H298_minus_H0_J_per_mol, limits::max_enthalpy_of_formation_J_per_mol));
    }
    std::vector<double> v;
    for (int part = 0; part < 2; ++part) {
      ++cur.i;
      if (!cur.next_content())
        cur.fail_at(cur.lines.back(), 0, fmt::format("species '{}': file ends inside its record", sp.name));
      const Line& cl = cur.lines[cur.i];
      const std::string ctext = strip_comment(cl.text);
      if (auto f = d16_fields(ctext, part == 1)) {
        v.insert(v.end(), f->begin(), f->end());
        continue;
      }
      int stop = 0;
      auto b = scan_numbers(ctext, 1, stop);
      const bool ok = part == 0 ? b.size() == 5 : (b.size() == 4 || b.size() == 5);
      if (stop != 0 || !ok)
        cur.fail_at(cl, stop ? stop : 1,
                    part == 0
                        ? fmt::format("species '{}': interval {}: expected a1..a5 (5D16.9)", sp.name, r + 1)
                        : fmt::format("species '{}': interval {}: expected a6, a7, b1, b2 (D16.9, columns "
                                      "1-32 and 49-80)",
                                      sp.name, r + 1));
      if (b.size() == 5 && part == 1) b.erase(b.begin() + 2);  // the unused field written as a number
      for (const auto& n : b) v.push_back(n.value);
    }
    check_coefficients(cur, tl, v, sp.name);
    std::copy(v.begin(), v.begin() + 7, range.a.begin());
    range.b1 = v[7];
    range.b2 = v[8];
    if (!within_temperature_limits({range.T_low_K, range.T_high_K}))
      cur.fail_at(tl, 1,
                  fmt::format("species '{}': interval {} ({:g}-{:g} K), expected temperatures {:g} to {:g} K",
                              sp.name, r + 1, range.T_low_K, range.T_high_K, limits::min_temperature_K,
                              limits::max_temperature_K));
    if (!sp.ranges.empty() && std::abs(range.T_low_K - sp.ranges.back().T_high_K) > 1e-6)
      cur.fail_at(tl, 1,
                  fmt::format("species '{}': interval {} ({:g}-{:g} K) is not contiguous with the one before",
                              sp.name, r + 1, range.T_low_K, range.T_high_K));
    sp.ranges.push_back(range);
  }
  ++cur.i;
  return sp;
}

}  // namespace vibtherm::nasa_text
