// vibtherm eval: tabulates the species of an existing NASA-7 / NASA-9 file with the same
// columns as `table` (the model-only columns are left out).
#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <memory>

#include "common.hpp"
#include "vibtherm/nasa.hpp"
#include "vibtherm/read_nasa.hpp"
#include "vibtherm/temperatures.hpp"
#include "vibtherm/write_table.hpp"

namespace vibtherm::cli {

namespace {

struct EvalOptions {
  std::string file;
  std::vector<std::string> species;
  std::string temps_text;
  std::string format = "text";
  std::string output = "-";
  unsigned jobs = 0;
};

std::string caption(const NasaPolynomial& p) {
  if (const auto* n7 = std::get_if<Nasa7>(&p))
    return fmt::format("NASA-7 polynomial, {:g}-{:g}-{:g} K, phase {}", n7->T_low_K, n7->T_mid_K,
                       n7->T_high_K, n7->phase);
  const auto& n9 = std::get<Nasa9>(p);
  std::string bp = fmt::format("{:g}", n9.T_min_K());
  for (const auto& r : n9.ranges) bp += fmt::format("-{:g}", r.T_high_K);
  return fmt::format("NASA-9 polynomial, {} K", bp);
}

}  // namespace

void setup_eval(CLI::App& sub) {
  auto o = std::make_shared<EvalOptions>();
  sub.add_option("file", o->file, "NASA-7 or NASA-9 thermo file")->required();
  sub.add_option("--species", o->species, "species to tabulate (repeatable; default: all, in file order)");
  sub.add_option(
      "--temps", o->temps_text,
      "temperatures in K: list '298.15,500' and/or ranges 'START:STOP:STEP' (default: 298.15 K and "
      "300-3000 K every 100 K, within each polynomial's range)");
  sub.add_option("--format", o->format, "output format")
      ->check(CLI::IsMember({"text", "csv", "json"}))
      ->capture_default_str();
  sub.add_option("-o,--output", o->output, "output file ('-' = standard output)")->capture_default_str();
  add_jobs_option(sub, o->jobs);
  sub.callback([o] {
    check_output_is_not_input(o->output, {o->file}, "-o");
    OutputSet outputs;
    const std::size_t out = outputs.add(o->output);
    const auto all = read_nasa_file(o->file);
    std::vector<const NasaPolynomial*> chosen;
    if (o->species.empty()) {
      for (const auto& p : all) chosen.push_back(&p);
    } else {
      for (const auto& name : o->species) {
        const NasaPolynomial* found = nullptr;
        for (const auto& p : all)
          if (polynomial_name(p) == name) found = &p;
        if (!found) {
          std::string names;
          for (std::size_t k = 0; k < all.size() && k < 10; ++k)
            names += (k ? ", " : "") + polynomial_name(all[k]);
          fail({o->file, 0, 0}, fmt::format("--species '{}': not in the file (it holds {}{})", name, names,
                                            all.size() > 10 ? ", ..." : ""));
        }
        chosen.push_back(found);
      }
    }
    const std::vector<double> asked =
        o->temps_text.empty() ? std::vector<double>{} : parse_temperatures(o->temps_text);
    std::vector<SpeciesTable> tables;
    for (const NasaPolynomial* p : chosen) {
      const std::string& name = polynomial_name(*p);
      std::vector<double> temps;
      if (asked.empty()) {
        for (double T : default_table_temperatures())
          if (polynomial_in_range(*p, T)) temps.push_back(T);
      } else {
        temps = asked;
        for (double T : temps)
          if (!polynomial_in_range(*p, T))
            spdlog::warn("{}: {:g} K is outside the polynomial's range {:g}-{:g} K (extrapolated)", name, T,
                         polynomial_T_min_K(*p), polynomial_T_max_K(*p));
      }
      SpeciesTable table{name, caption(*p), {}, false, {}, {}, {}, {}};
      for (double T : temps) table.rows.push_back(polynomial_table_row(*p, T));
      tables.push_back(std::move(table));
    }
    const std::string& f = o->format;
    outputs.write(out, f == "json"  ? table_json(tables)
                       : f == "csv" ? table_csv(tables)
                                    : table_text(tables));
    outputs.commit();
  });
}

}  // namespace vibtherm::cli
