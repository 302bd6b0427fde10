// Writers for the frozen-out-modes diagnostics (modes.hpp): a grid a person reads at a
// glance, CSV in long form, JSON with the keys pinned in design.md section 5 (the SVG
// picture is write_modes_svg.hpp). Writers format; they compute no physics.
#pragma once

#include <string>
#include <vector>

#include "vibtherm/modes.hpp"

namespace vibtherm {

// Per species: a header with the classical limits, one row per mode (wavenumber, θ,
// zero-point share, half-activation temperature, then state and Cv/R share at each
// temperature), and one summary line per temperature.
std::string modes_to_text(const std::vector<ModesReport>& reports);

// One row per (species, temperature, item), item being a motion, the total, or a mode.
std::string modes_to_csv(const std::vector<ModesReport>& reports);

// {"units", "thresholds", "species": [{"name", "phase", "rotor", "classical_dof", "vibrations",
//   "temperatures": [{"T", "dof", "modes": [{"index", "wavenumber", "Cv_over_R", "state"}]}]}]}
// Indented with 1 space per level; one trailing newline.
std::string modes_to_json(const std::vector<ModesReport>& reports);

}  // namespace vibtherm
