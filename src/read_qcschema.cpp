// The QCSchema reader; see read_qcschema.hpp for what it reads. Form and units only: the
// frequencies come from the Hessian in prepare_species, like a YAML Hessian's.
#include "vibtherm/read_qcschema.hpp"

#include <fmt/format.h>

#include <cmath>
#include <filesystem>
#include <nlohmann/json.hpp>

#include "json_location.hpp"
#include "vibtherm/constants.hpp"
#include "vibtherm/elements.hpp"
#include "vibtherm/limits.hpp"
#include "vibtherm/read_species.hpp"
#include "vibtherm/species_builder.hpp"
#include "vibtherm/units.hpp"

namespace vibtherm {
namespace {

using nlohmann::json;

const std::string accepted_kinds =
    "expected a QCSchema result (schema_name qcschema_output or qcschema_result) or molecule "
    "(qcschema_molecule)";

JsonPath operator/(JsonPath path, JsonStep step) {
  path.push_back(std::move(step));
  return path;
}

std::string describe(const json& v) {
  if (v.is_array()) return v.empty() ? "an empty list" : "a list";
  if (v.is_object()) return "a map";
  if (v.is_null()) return "null";
  if (v.is_boolean()) return v.get<bool>() ? "true" : "false";
  if (v.is_string()) return "text " + quote(v.get_ref<const std::string&>());
  return quote(v.dump());
}

// "H", "CL", "cl" → "H", "Cl", "Cl": QCSchema symbols are title case, some writers use capitals.
std::string title_case(std::string s) {
  for (std::size_t i = 0; i < s.size(); ++i)
    s[i] = static_cast<char>(i == 0 ? std::toupper(static_cast<unsigned char>(s[i]))
                                    : std::tolower(static_cast<unsigned char>(s[i])));
  return s;
}

class QcReader {
 public:
  QcReader(const std::string& text, const std::string& file) : text_(text), file_(file) {}

  Species read(bool geometry_only);

 private:
  SourceLocation at(const JsonPath& path) const {
    const auto [line, column] = locate_json_value(text_, path);
    return {file_, line, column};
  }
  [[noreturn]] void error(const JsonPath& path, const std::string& message) const { fail(at(path), message); }

  const json* member(const json& object, const std::string& key) const {
    const auto it = object.find(key);
    return it == object.end() ? nullptr : &*it;
  }
  double number(const json& v, const JsonPath& path) const {
    if (!v.is_number())
      error(path, "'" + json_path_text(path) + "' is " + describe(v) + ", expected a number");
    const double x = v.get<double>();
    if (!std::isfinite(x))
      error(path, "'" + json_path_text(path) + "' is " + quote(v.dump()) + ", expected a finite number");
    return x;
  }
  int whole_number(const json& v, const JsonPath& path, int lowest) const {
    const double x = number(v, path);
    if (x != std::floor(x) || x < lowest || x > 1000)
      error(path, fmt::format("'{}' is {}, expected a whole number from {} to 1000", json_path_text(path),
                              quote(v.dump()), lowest));
    return static_cast<int>(x);
  }
  const std::string& text(const json& v, const JsonPath& path) const {
    if (!v.is_string()) error(path, "'" + json_path_text(path) + "' is " + describe(v) + ", expected text");
    return v.get_ref<const std::string&>();
  }
  const json& list(const json& v, const JsonPath& path, const std::string& expected) const {
    if (!v.is_array() || v.empty())
      error(path, "'" + json_path_text(path) + "' is " + describe(v) + ", expected " + expected);
    return v;
  }
  // Numbers given flat (n values) or as rows of `width` (n / width rows); row-major.
  std::vector<double> matrix(const json& v, const JsonPath& path, std::size_t n, std::size_t width,
                             const std::string& expected) const;

  void molecule(const json& m, const JsonPath& path, Species& species) const;
  std::vector<double> hessian(const json& h, const JsonPath& path, std::size_t atom_count) const;

  const std::string& text_;
  std::string file_;
};

std::vector<double> QcReader::matrix(const json& v, const JsonPath& path, std::size_t n, std::size_t width,
                                     const std::string& expected) const {
  list(v, path, expected);
  std::vector<double> out;
  out.reserve(n);
  if (v[0].is_array()) {
    if (v.size() * width != n)
      error(path, fmt::format("'{}' has {} rows, expected {} rows of {} ({})", json_path_text(path), v.size(),
                              n / width, width, expected));
    for (std::size_t i = 0; i < v.size(); ++i) {
      const JsonPath row = path / i;
      if (!v[i].is_array() || v[i].size() != width)
        error(row,
              fmt::format("'{}' is {}{}, expected a row of {} numbers", json_path_text(row), describe(v[i]),
                          v[i].is_array() ? fmt::format(" of {}", v[i].size()) : "", width));
      for (std::size_t j = 0; j < width; ++j) out.push_back(number(v[i][j], row / j));
    }
    return out;
  }
  if (v.size() != n)
    error(path,
          fmt::format("'{}' has {} values, expected {} ({})", json_path_text(path), v.size(), n, expected));
  for (std::size_t i = 0; i < v.size(); ++i) out.push_back(number(v[i], path / i));
  return out;
}

void QcReader::molecule(const json& m, const JsonPath& path, Species& species) const {
  if (!m.is_object())
    error(path, "'" + (path.empty() ? std::string("molecule") : json_path_text(path)) + "' is " +
                    describe(m) + ", expected a QCSchema molecule {symbols, geometry, ...}");
  const json* symbols = member(m, "symbols");
  const json* geometry = member(m, "geometry");
  if (!symbols || !geometry)
    error(path, std::string("molecule has no '") + (symbols ? "geometry" : "symbols") +
                    "', expected 'symbols' (element symbols) and 'geometry' (3N coordinates in bohr)");
  const JsonPath sp = path / "symbols";
  list(*symbols, sp, "a list of element symbols");
  std::vector<AtomLabel> labels;
  for (std::size_t i = 0; i < symbols->size(); ++i)
    labels.push_back(resolve_label(title_case(text((*symbols)[i], sp / i)), at(sp / i)));
  const std::size_t n = labels.size();
  const JsonPath gp = path / "geometry";
  const std::vector<double> xyz_bohr =
      matrix(*geometry, gp, 3 * n, 3, fmt::format("x, y, z in bohr for each of the {} atoms", n));
  if (const json* real = member(m, "real")) {
    const JsonPath rp = path / "real";
    if (!real->is_array() || real->size() != n)
      error(rp, fmt::format("'{}' is {}, expected {} booleans", json_path_text(rp), describe(*real), n));
    for (std::size_t i = 0; i < n; ++i)
      if (!(*real)[i].is_boolean() || !(*real)[i].get<bool>())
        error(rp / i, fmt::format("atom {} is not real ({}), expected no ghost atoms in a species", i + 1,
                                  describe((*real)[i])));
  }
  const json* masses = member(m, "masses");
  const json* mass_numbers = member(m, "mass_numbers");
  for (const auto& [given, key] : {std::pair{masses, "masses"}, std::pair{mass_numbers, "mass_numbers"}})
    if (given && (!given->is_array() || given->size() != n))
      error(
          path / key,
          fmt::format("'{}' is {}, expected {} values, one per atom", json_path_text(path / key),
                      describe(*given) + (given->is_array() ? fmt::format(" of {}", given->size()) : ""), n));
  std::vector<SourceLocation> where;
  for (std::size_t i = 0; i < n; ++i) {
    AtomLabel label = labels[i];
    if (masses) {
      const double mass = number((*masses)[i], path / "masses" / i);
      const std::optional<AtomLabel> iso = isotope_with_mass(label.symbol, mass);
      if (!iso)
        error(path / "masses" / i,
              fmt::format("mass {} of atom {} ({}) is no isotope mass of {} within {} amu, expected one of "
                          "{} (isotope masses, not average atomic weights)",
                          mass, i + 1, label.symbol, label.symbol, isotope_mass_tolerance_amu,
                          join(known_isotope_labels(label.symbol))));
      label = *iso;
    }
    if (mass_numbers && !(*mass_numbers)[i].is_null()) {
      const JsonPath mp = path / "mass_numbers" / i;
      const int a = whole_number((*mass_numbers)[i], mp, -1);
      if (a != -1) {  // -1: not given (QCSchema)
        const std::string wanted = label.symbol + std::to_string(a);
        const AtomLabel by_number = resolve_label(wanted, at(mp));
        if (masses && by_number.mass_number != label.mass_number)
          error(mp, fmt::format("mass number {} of atom {} disagrees with its mass {}, expected both of "
                                "one isotope",
                                a, i + 1, label.mass_amu));
        if (!masses) label = isotope_with_mass(label.symbol, by_number.mass_amu).value_or(by_number);
      }
    }
    Atom atom = atom_of(label);
    for (int k = 0; k < 3; ++k)
      atom.position_angstrom[k] =
          xyz_bohr[3 * i + static_cast<std::size_t>(k)] * constants::bohr_radius_m / constants::angstrom_m;
    where.push_back(at(sp / i));
    species.atoms.push_back(std::move(atom));
  }
  check_atoms_apart(species.atoms, where);
  species.formula = formula_of(species.atoms);
  species.key_locations["atoms"] = at(sp);

  if (const json* q = member(m, "molecular_charge")) {
    species.charge = whole_number(*q, path / "molecular_charge", -1000);
    species.key_locations["charge"] = at(path / "molecular_charge");
  }
  // Without a multiplicity QCSchema takes the lowest one the electron count allows, as
  // prepare_species does for an absent one (electrons.hpp).
  if (const json* s = member(m, "molecular_multiplicity")) {
    species.electronic_levels = {{0.0, whole_number(*s, path / "molecular_multiplicity", 1)}};
    species.key_locations["spin_multiplicity"] = at(path / "molecular_multiplicity");
  }
  if (const json* name = member(m, "name");
      name && name->is_string() && !name->get_ref<const std::string&>().empty()) {
    for (char c : name->get_ref<const std::string&>())
      if (static_cast<unsigned char>(c) < 0x20 || c == 0x7f)
        error(path / "name", "molecule 'name' contains a control character, expected a one-line label");
    species.name = name->get<std::string>();
  }
}

std::vector<double> QcReader::hessian(const json& h, const JsonPath& path, std::size_t atom_count) const {
  const std::size_t n = 3 * atom_count;
  const std::vector<double> full =
      matrix(h, path, n * n, n,
             fmt::format("the {}×{} Cartesian Hessian in hartree/bohr^2 for N = {} atoms", n, n, atom_count));
  if (const auto ij = hessian_asymmetry(full, n)) {
    const auto [i, j] = *ij;
    error(path,
          fmt::format("'{}' is not symmetric: row {}, column {} is {} but row {}, column {} is {}, "
                      "expected equal values (within 1e-4 of the largest element)",
                      json_path_text(path), i + 1, j + 1, full[i * n + j], j + 1, i + 1, full[j * n + i]));
  }
  return symmetrised_hessian(full, n, *to_force_constant_J_per_m2(1.0, "hartree/bohr^2"));
}

// Every JSON value but the first follows a ',' or opens a container, outside strings; so
// counting those characters bounds the values of the tree before it is built, and the
// file is refused at the one past max_json_values.
void check_json_value_count(const std::string& text, const std::string& file) {
  std::size_t values = 1;
  bool in_string = false;
  for (std::size_t i = 0; i < text.size(); ++i) {
    const char c = text[i];
    if (in_string) {
      if (c == '\\')
        ++i;
      else if (c == '"')
        in_string = false;
    } else if (c == '"') {
      in_string = true;
    } else if ((c == ',' || c == '[' || c == '{') && ++values > max_json_values) {
      const auto [line, column] = line_column_at(text, i);
      fail({file, line, column},
           fmt::format("file holds more than {} JSON values, expected fewer", max_json_values));
    }
  }
}

Species QcReader::read(bool geometry_only) {
  require_text(text_, file_);
  check_json_value_count(text_, file_);
  json root;
  try {
    root = json::parse(text_);
  } catch (const json::parse_error& e) {
    const auto [line, column] = line_column_at(text_, e.byte == 0 ? 0 : e.byte - 1);
    std::string what = e.what();
    // "[json.exception.parse_error.101] parse error at line 1, column 2: syntax error ..."
    if (const std::size_t colon = what.find(": "); colon != std::string::npos) what = what.substr(colon + 2);
    fail({file_, line, column}, "malformed JSON (" + what + "), " + accepted_kinds);
  } catch (const json::exception& e) {
    // "[json.exception.out_of_range.406] number overflow parsing '1e999'": located at the token.
    std::string what = e.what();
    if (const std::size_t close = what.find("] "); close != std::string::npos) what = what.substr(close + 2);
    const std::size_t open = what.find('\''), end = what.rfind('\'');
    const std::size_t at = open < end ? text_.find(what.substr(open + 1, end - open - 1)) : std::string::npos;
    const auto [line, column] = at == std::string::npos ? std::pair{0, 0} : line_column_at(text_, at);
    fail({file_, line, column}, "malformed JSON (" + what + "), " + accepted_kinds);
  }
  if (!root.is_object()) error({}, "top level is " + describe(root) + ", " + accepted_kinds);
  const json* schema = member(root, "schema_name");
  if (!schema) error({}, "JSON document has no 'schema_name', " + accepted_kinds);
  const std::string& kind = text(*schema, {"schema_name"});
  const bool is_molecule = kind == "qcschema_molecule" || kind == "qc_schema_molecule";
  const bool is_result = kind == "qcschema_output" || kind == "qcschema_result" || kind == "qc_schema_output";
  if (!is_molecule && !is_result)
    error({"schema_name"},
          "'schema_name' is " + quote(kind) +
              (kind.find("input") != std::string::npos ? " (a job's input, not its result)" : "") + ", " +
              accepted_kinds);

  Species species;
  species.origin = at({});
  species.name = std::filesystem::path(file_).stem().string();
  if (species.name.empty()) species.name = "species";
  if (is_molecule) {
    molecule(root, {}, species);
    if (!geometry_only && species.atoms.size() > 1)
      error({"schema_name"},
            "a QCSchema molecule holds no vibrations, expected a result of driver 'hessian' "
            "(or name this file with 'from:' in a species file that gives 'frequencies')");
    return species;
  }
  if (const json* ok = member(root, "success"); ok && ok->is_boolean() && !ok->get<bool>())
    error({"success"}, "'success' is false: the job failed, expected the result of a finished job");
  const json* m = member(root, "molecule");
  if (!m) error({}, "result has no 'molecule', expected the molecule the result refers to");
  molecule(*m, {"molecule"}, species);

  const json* properties = member(root, "properties");
  if (properties && !properties->is_object())
    error({"properties"}, "'properties' is " + describe(*properties) + ", expected a map");
  const json* driver = member(root, "driver");
  if (!driver)
    error({}, "result has no 'driver', expected driver 'hessian' with the Hessian in 'return_result'");
  const std::string& what = text(*driver, {"driver"});
  const json* energy = properties ? member(*properties, "return_energy") : nullptr;
  const auto take_energy = [&](const json& value, const JsonPath& path, const char* key) {
    const double hartree = number(value, path);
    limits::check_range(hartree, -limits::max_molecular_energy_hartree, limits::max_molecular_energy_hartree,
                        key, "hartree", at(path));
    species.electronic_energy_J_per_mol = *to_energy_J_per_mol(hartree, "hartree");
    species.key_locations["electronic_energy"] = at(path);
  };
  if (energy && !energy->is_null())
    take_energy(*energy, {"properties", "return_energy"}, "'return_energy'");
  else if (const json* r = member(root, "return_result"); what == "energy" && r)
    take_energy(*r, {"return_result"}, "'return_result'");
  JsonPath hessian_path;
  const json* h = nullptr;
  if (what == "hessian") {
    hessian_path = {"return_result"};
    h = member(root, "return_result");
    if (!h) error({}, "result of driver 'hessian' has no 'return_result', expected the 3N×3N Hessian there");
  } else if (const json* ph = properties ? member(*properties, "return_hessian") : nullptr;
             ph && !ph->is_null()) {
    hessian_path = {"properties", "return_hessian"};
    h = ph;
  } else if (what != "energy" && what != "gradient" && what != "properties") {
    error({"driver"}, "'driver' is " + quote(what) + ", expected hessian, energy, gradient or properties");
  }
  if (h && species.atoms.size() > 1) {
    species.hessian_J_per_m2 = hessian(*h, hessian_path, species.atoms.size());
    species.key_locations["hessian"] = species.key_locations["frequencies"] = at(hessian_path);
  } else if (!h && !geometry_only && species.atoms.size() > 1) {
    error({"driver"},
          "'driver' is " + quote(what) +
              ": this result holds no Hessian, expected a result of driver 'hessian' (or name this file "
              "with 'from:' in a species file that gives 'frequencies')");
  }

  std::string model;
  if (const json* mo = member(root, "model"); mo && mo->is_object()) {
    for (const char* key : {"method", "basis"})
      if (const json* v = member(*mo, key); v && v->is_string() && !v->get_ref<const std::string&>().empty())
        model += (model.empty() ? "" : "/") + v->get<std::string>();
  }
  if (!model.empty()) {
    for (char& c : model)
      if (static_cast<unsigned char>(c) < 0x20 || c == 0x7f) c = '?';
    species.computed_with = model;
    species.reader_notes.push_back("QCSchema result computed with " + model + " (driver " + what + ")");
  }
  return species;
}

}  // namespace

Species read_species_qcschema(const std::string& text, const std::string& file_name, bool geometry_only) {
  return QcReader(text, file_name).read(geometry_only);
}

bool looks_like_json(std::string_view text) {
  if (text.substr(0, 3) == "\xEF\xBB\xBF") text.remove_prefix(3);
  const std::size_t first = text.find_first_not_of(" \t\r\n");
  return first != std::string_view::npos && text[first] == '{';
}

}  // namespace vibtherm
