// vibtherm table: thermodynamic functions versus temperature.
#include <fmt/format.h>

#include <algorithm>
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
                     rotor_type_name(p.rotor.type), p.species.symmetry_number.value_or(1),
                     p.vibrations_cm1.size(), standard, p.zero_point_energy_J_per_mol / 1e3) +
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
    options->max_temperature_K = *std::max_element(temps.begin(), temps.end());
    const auto paths = batch_paths(*options);
    check_output_is_not_input(options->output, *options, paths, "-o");
    const std::string& f = options->format;
    const TableFormat format = f == "json"  ? TableFormat::json
                               : f == "csv" ? TableFormat::csv
                                            : TableFormat::text;
    const TableWriteOptions write{*breakdown};
    OutputSet outputs;
    const std::size_t out = outputs.add(options->output);
    outputs.write(out, table_begin(format, write));
    // Each species' piece of the output is formatted on its worker; only the pieces in
    // flight are held, so the memory does not grow with the batch.
    const BatchSummary batch = for_each_species<std::string>(
        *options, paths,
        [&](const SpeciesInput& in, std::vector<LogLine>&) {
          const PreparedSpecies& p = in.prepared;
          SpeciesTable table{p.species.name, caption(p), tabulate(p, temps), true, {}, p.notes, {}, {}};
          if (p.tunnelling) table.tunnelling = tunnelling_table(*p.tunnelling, temps);
          for (const ConformerMember& m : p.conformers) table.conformer_files.push_back(m.file);
          if (!p.conformers.empty())
            for (double T : temps) table.populations.push_back(conformer_populations(p, T));
          return table_piece(format, table, write);
        },
        [&, first = true](std::string& piece) mutable {
          if (!first) outputs.write(out, table_separator(format));
          first = false;
          outputs.write(out, piece);
        });
    outputs.write(out, table_end(format, batch.done));
    throw Exit{finish_batch(batch, outputs)};
  });
}

}  // namespace vibtherm::cli
