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
    // inspect evaluates at 298.15 K and gives conformer populations up to 1000 K.
    options->max_temperature_K = 1000.0;
    const auto paths = batch_paths(*options);
    check_output_is_not_input(options->output, *options, paths, "-o");
    OutputSet outputs;
    const std::size_t out = outputs.add(options->output);
    std::vector<SpeciesFacts> facts;
    const BatchSummary batch = for_each_species<SpeciesFacts>(
        *options, paths,
        [](const SpeciesInput& in, std::vector<LogLine>&) { return describe_species(in.prepared); },
        [&](SpeciesFacts& f) { facts.push_back(std::move(f)); });
    const std::string& f = options->format;
    outputs.write(out, f == "json"  ? inspect_json(facts)
                       : f == "csv" ? inspect_csv(facts)
                                    : inspect_text(facts));
    throw Exit{finish_batch(batch, outputs)};
  });
}

}  // namespace vibtherm::cli
