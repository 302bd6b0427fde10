// vibtherm table: thermodynamic functions versus temperature.
#include <fmt/format.h>

#include <memory>

#include "common.hpp"
#include "vibtherm/write_table.hpp"

namespace vibtherm::cli {

namespace {

// The model choices that differ from the plain harmonic, unscaled model, as a second line.
std::string model_line(const PreparedSpecies& p) {
  std::string line;
  if (p.vibration_adjustment.options.method != LowFrequencyMethod::harmonic)
    line += fmt::format("low-frequency treatment {}",
                        low_frequency_method_name(p.vibration_adjustment.options.method));
  if (!(p.scale.zpe == 1.0 && p.scale.enthalpy == 1.0 && p.scale.entropy == 1.0))
    line += fmt::format("{}frequency scale factors: ZPE {:g}, enthalpy {:g}, entropy/Cp {:g}",
                        line.empty() ? "" : "; ", p.scale.zpe, p.scale.enthalpy, p.scale.entropy);
  return line.empty() ? "" : "\n" + line;
}

std::string caption(const PreparedSpecies& p) {
  std::string standard = fmt::format("{:g} Pa", p.options.pressure_Pa);
  if (p.options.standard_state == StandardState::molar)
    standard = "1 mol/L";
  else if (p.options.pressure_Pa == constants::bar_Pa)
    standard = "1 bar";
  else if (p.options.pressure_Pa == constants::atmosphere_Pa)
    standard = "1 atm";
  if (!p.is_gas)
    return fmt::format("adsorbate, {} harmonic modes, ZPE {:.3f} kJ/mol", p.vibrations_cm1.size(),
                       p.zero_point_energy_J_per_mol / 1e3) +
           model_line(p);
  return fmt::format("{} rotor, symmetry number {}, {} vibrations, standard state {}, ZPE {:.3f} kJ/mol",
                     rotor_type_name(p.rotor.type), p.species.symmetry_number, p.vibrations_cm1.size(),
                     standard, p.zero_point_energy_J_per_mol / 1e3) +
         model_line(p);
}

}  // namespace

void setup_table(CLI::App& sub) {
  auto options = std::make_shared<CommonOptions>();
  auto breakdown = std::make_shared<bool>(false);
  add_common_options(sub, *options, true, {"text", "csv", "json"});
  sub.add_flag("--breakdown", *breakdown,
               "add the per-motion contributions (translation, rotation, vibration, electronic)");
  sub.callback([options, breakdown] {
    const auto temps = temperatures_or(*options, default_table_temperatures());
    const Batch batch = load_batch(*options);
    log_species_diagnostics(batch);
    std::vector<SpeciesTable> tables;
    for (const auto& p : batch.species)
      tables.push_back(
          {p.species.name, caption(p), tabulate(p, temps), true,
           p.tunnelling ? tunnelling_table(*p.tunnelling, temps) : std::vector<TunnellingPoint>{}, p.notes});
    const TableWriteOptions write{*breakdown};
    const std::string& f = options->format;
    write_output(options->output, f == "json"  ? table_json(tables, write)
                                  : f == "csv" ? table_csv(tables, write)
                                               : table_text(tables, write));
    throw Exit{batch_status(batch)};
  });
}

}  // namespace vibtherm::cli
