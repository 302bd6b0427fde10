#include "vibtherm/write_inspect.hpp"

#include <fmt/format.h>
#include <fmt/ranges.h>

#include <nlohmann/json.hpp>

#include "vibtherm/markup.hpp"
#include "vibtherm/point_group.hpp"

namespace vibtherm {

namespace {

std::string numbers(const std::vector<double>& values, const char* spec) {
  std::string out;
  for (double v : values) out += (out.empty() ? "" : "  ") + fmt::format(fmt::runtime(spec), v);
  return out.empty() ? "-" : out;
}

std::string wavenumbers(const std::vector<double>& values) {
  std::string out;
  int column = 0;
  for (double v : values) {
    if (column == 8) out += "\n" + std::string(22, ' '), column = 0;
    out += v < 0 ? fmt::format("{:>9.1f}i", -v) : fmt::format("{:>9.1f} ", v);
    ++column;
  }
  return out.empty() ? "-" : out;
}

}  // namespace

std::string inspect_text(const std::vector<SpeciesFacts>& all) {
  std::string out;
  for (size_t k = 0; k < all.size(); ++k) {
    const auto& f = all[k];
    if (k > 0) out += '\n';
    out += fmt::format("== {} ==\n", f.name);
    auto line = [&](const char* label, const std::string& value) {
      out += fmt::format("  {:<20}{}\n", label, value);
    };
    line("formula", f.formula.empty() ? "-" : f.formula);
    line("phase", f.phase);
    line("mass", fmt::format("{:.6f} amu (isotopic){}", f.mass_amu,
                             f.molar_mass_g_per_mol > 0
                                 ? fmt::format(", {:.4f} g/mol ({})", f.molar_mass_g_per_mol,
                                               f.isotope_labels
                                                   ? "isotope masses for labelled atoms, standard atomic "
                                                     "weights otherwise"
                                                   : "standard atomic weights")
                                 : std::string()));
    // An adsorbate neither translates nor rotates: its rotor facts would mean nothing.
    if (f.phase != "adsorbate") {
      line("rotor", rotor_type_name(f.rotor));
      line("moments", fmt::format("{:.5f}  {:.5f}  {:.5f} amu A^2", f.moments_amu_A2[0], f.moments_amu_A2[1],
                                  f.moments_amu_A2[2]));
      line("rot. constants", numbers(f.rotational_constants_cm1, "{:.5f}") + " cm^-1");
      line("", numbers(f.rotational_constants_GHz, "{:.4f}") + " GHz");
      line("rot. temperatures", numbers(f.rotational_temperatures_K, "{:.4f}") + " K");
      line("point group", f.point_group.empty()
                              ? std::string("- (no geometry)")
                              : point_group_display(f.point_group) + (f.chiral ? " (chiral)" : ""));
      line("symmetry number", std::to_string(f.symmetry_number) + (f.racemic ? " (racemic: + R ln 2)" : ""));
    }
    line("ground degeneracy", std::to_string(f.ground_degeneracy));
    line("modes", fmt::format("{} given, {} expected for N = {}, {} imaginary", f.given_modes,
                              f.expected_modes, f.atom_count, f.imaginary_modes));
    line("frequencies", wavenumbers(f.frequencies_cm1) + (f.frequencies_cm1.empty() ? "" : " cm^-1"));
    line("zero-point energy", fmt::format("{:.4f} kJ/mol", f.zero_point_energy_J_per_mol / 1e3));
    if (f.enthalpy_of_formation_J_per_mol)
      line("formation enthalpy",
           fmt::format("{:.3f} kJ/mol at 298.15 K ({})", *f.enthalpy_of_formation_J_per_mol / 1e3,
                       f.enthalpy_of_formation_route));
    if (f.wigner_kappa_298)
      line("tunnelling 298.15 K",
           fmt::format("kappa Wigner {:.4f}, Eckart {}", *f.wigner_kappa_298,
                       f.eckart_kappa_298 ? fmt::format("{:.4f}", *f.eckart_kappa_298)
                                          : std::string("- (give 'tunnelling' barrier heights)")));
    for (std::size_t i = 0; i < f.conformers.size(); ++i) {
      const ConformerFacts& c = f.conformers[i];
      std::string pops;
      for (std::size_t j = 0; j < c.populations.size(); ++j)
        pops += fmt::format("{}{:.4f} at {:g} K", j ? ", " : "", c.populations[j],
                            f.population_temperatures_K[j]);
      line(i == 0 ? "conformers" : "",
           fmt::format("{} {}: relative energy {:.3f} kJ/mol, ZPE {:.3f} kJ/mol, level {:.3f} kJ/mol; "
                       "population {}",
                       i + 1, c.file, c.relative_energy_J_per_mol / 1e3, c.zero_point_energy_J_per_mol / 1e3,
                       c.level_J_per_mol / 1e3, pops));
    }
    if (!f.computed_with.empty()) line("computed with", f.computed_with);
    for (const auto& w : f.warnings) line("warning", w);
    for (const auto& n : f.notes) line("note", n);
  }
  return out;
}

std::string inspect_csv(const std::vector<SpeciesFacts>& all) {
  std::string out =
      "species,formula,phase,rotor,mass_amu,molar_mass_g_per_mol,Ia_amu_A2,Ib_amu_A2,Ic_amu_A2,symmetry_"
      "number,"
      "atoms,modes_given,modes_expected,imaginary,zpe_kJ_per_mol,point_group\n";
  for (const auto& f : all) {
    // An adsorbate has no rotor: its rotor and moment fields are empty.
    const bool rotates = f.phase != "adsorbate";
    const std::string rotor = rotates ? std::string(rotor_type_name(f.rotor)) : std::string();
    const std::string moments = rotates ? fmt::format("{:.6f},{:.6f},{:.6f}", f.moments_amu_A2[0],
                                                      f.moments_amu_A2[1], f.moments_amu_A2[2])
                                        : std::string(",,");
    out += fmt::format("{},{},{},{},{:.6f},{:.4f},{},{},{},{},{},{},{:.6f},{}\n", csv_field(f.name),
                       csv_field(f.formula), f.phase, rotor, f.mass_amu, f.molar_mass_g_per_mol, moments,
                       f.symmetry_number, f.atom_count, f.given_modes, f.expected_modes, f.imaginary_modes,
                       f.zero_point_energy_J_per_mol / 1e3, f.point_group);
  }
  return out;
}

std::string inspect_json(const std::vector<SpeciesFacts>& all) {
  nlohmann::ordered_json doc;
  doc["species"] = nlohmann::ordered_json::array();
  for (const auto& f : all) {
    nlohmann::ordered_json s;
    // An adsorbate neither translates nor rotates: no rotor type, moments or constants.
    const bool rotates = f.phase != "adsorbate";
    s["name"] = f.name;
    if (rotates) s["rotor"] = rotor_type_name(f.rotor);
    s["mass"] = f.mass_amu;
    if (rotates) s["moments_of_inertia"] = f.moments_amu_A2;
    s["symmetry_number"] = f.symmetry_number;
    s["point_group"] =
        f.point_group.empty() ? nlohmann::ordered_json() : nlohmann::ordered_json(f.point_group);
    if (!f.point_group.empty()) s["chiral"] = f.chiral;
    if (f.racemic) s["racemic"] = true;
    s["frequencies"] = f.frequencies_cm1;
    s["zpe"] = f.zero_point_energy_J_per_mol / 1e3;
    if (f.enthalpy_of_formation_J_per_mol) {
      s["enthalpy_of_formation"] = *f.enthalpy_of_formation_J_per_mol / 1e3;
      s["enthalpy_of_formation_route"] = f.enthalpy_of_formation_route;
    }
    s["formula"] = f.formula;
    s["phase"] = f.phase;
    s["molar_mass"] = f.molar_mass_g_per_mol;
    if (rotates) {
      s["rotational_constants_cm1"] = f.rotational_constants_cm1;
      s["rotational_constants_GHz"] = f.rotational_constants_GHz;
      s["rotational_temperatures_K"] = f.rotational_temperatures_K;
    }
    s["ground_degeneracy"] = f.ground_degeneracy;
    s["mode_counts"] = {{"given", f.given_modes},
                        {"expected", f.expected_modes},
                        {"imaginary", f.imaginary_modes},
                        {"atoms", f.atom_count}};
    if (f.wigner_kappa_298) s["tunnelling_298"]["kappa_wigner"] = *f.wigner_kappa_298;
    if (f.eckart_kappa_298) s["tunnelling_298"]["kappa_eckart"] = *f.eckart_kappa_298;
    if (!f.conformers.empty()) {
      s["population_temperatures"] = f.population_temperatures_K;
      for (const ConformerFacts& c : f.conformers)
        s["conformers"].push_back({{"file", c.file},
                                   {"relative_energy", c.relative_energy_J_per_mol / 1e3},
                                   {"zpe", c.zero_point_energy_J_per_mol / 1e3},
                                   {"level", c.level_J_per_mol / 1e3},
                                   {"populations", c.populations}});
    }
    if (!f.computed_with.empty()) s["computed_with"] = f.computed_with;
    s["warnings"] = f.warnings;
    s["notes"] = f.notes;
    doc["species"].push_back(s);
  }
  return doc.dump(2) + '\n';
}

}  // namespace vibtherm
