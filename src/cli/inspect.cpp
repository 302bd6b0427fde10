// vibtherm inspect: derived facts of each species.
#include <memory>

#include "common.hpp"
#include "vibtherm/facts.hpp"
#include "vibtherm/write_inspect.hpp"

namespace vibtherm::cli {

void setup_inspect(CLI::App& sub) {
  auto options = std::make_shared<CommonOptions>();
  add_common_options(sub, *options, false, {"text", "csv", "json"});
  sub.callback([options] {
    const Batch batch = load_batch(*options);
    log_species_diagnostics(batch);
    std::vector<SpeciesFacts> facts;
    for (const auto& p : batch.species) facts.push_back(describe_species(p));
    const std::string& f = options->format;
    write_output(options->output, f == "json"  ? inspect_json(facts)
                                  : f == "csv" ? inspect_csv(facts)
                                               : inspect_text(facts));
    throw Exit{batch_status(batch)};
  });
}

}  // namespace vibtherm::cli
