#include "convert.hpp"

#include <fmt/format.h>

#include <cctype>
#include <cmath>

#include "vibtherm/error.hpp"
#include "vibtherm/read_species.hpp"
#include "vibtherm/temperatures.hpp"
#include "vibtherm/units.hpp"

namespace vibtherm::python {

namespace {

std::string join(const std::vector<std::string>& words) {
  std::string out;
  for (const auto& w : words) out += (out.empty() ? "" : ", ") + w;
  return out;
}

double finite_number(const py::handle& value, const std::string& what) {
  if (py::isinstance<py::bool_>(value) ||
      !(py::isinstance<py::float_>(value) || py::isinstance<py::int_>(value) ||
        py::hasattr(value, "__float__")))
    throw py::type_error(
        fmt::format("{} is {}, expected a number", what, py::str(py::repr(value)).cast<std::string>()));
  return value.cast<double>();
}

// A YAML flow text for one Python value: numbers shortest round-trip (non-finite ones as
// YAML's .nan/.inf, which the reader refuses with its own message), strings double-quoted,
// map keys plain when they are names or whole numbers (the reader wants atom indices
// unquoted), sequences and NumPy arrays as flow lists.
std::string yaml_flow(const py::handle& value, const std::string& key);

std::string yaml_string(const std::string& text) {
  std::string out = "\"";
  for (char c : text) {
    if (c == '"' || c == '\\')
      out += '\\', out += c;
    else if (static_cast<unsigned char>(c) < 0x20)
      out += fmt::format("\\x{:02x}", static_cast<unsigned char>(c));
    else
      out += c;
  }
  return out + '"';
}

std::string yaml_key(const py::handle& key) {
  if (py::isinstance<py::int_>(key) && !py::isinstance<py::bool_>(key))
    return std::to_string(key.cast<long long>());
  if (!py::isinstance<py::str>(key))
    throw py::type_error(
        fmt::format("key {} is not text, expected a key name", py::str(py::repr(key)).cast<std::string>()));
  const std::string k = key.cast<std::string>();
  bool plain = !k.empty();
  for (char c : k) plain = plain && (std::isalnum(static_cast<unsigned char>(c)) || c == '_');
  return plain ? k : yaml_string(k);
}

std::string yaml_flow(const py::handle& value, const std::string& key) {
  if (value.is_none()) return "null";
  if (py::isinstance<py::bool_>(value)) return value.cast<bool>() ? "true" : "false";
  if (py::isinstance<py::int_>(value)) return std::to_string(value.cast<long long>());
  if (py::isinstance<py::float_>(value)) {
    const double v = value.cast<double>();
    if (std::isnan(v)) return ".nan";
    if (std::isinf(v)) return v > 0 ? ".inf" : "-.inf";
    return fmt::format("{}", v);
  }
  if (py::isinstance<py::str>(value)) return yaml_string(value.cast<std::string>());
  if (py::isinstance<py::dict>(value)) {
    std::string out = "{";
    for (const auto& [k, v] : value.cast<py::dict>())
      out += (out.size() > 1 ? ", " : "") + yaml_key(k) + ": " + yaml_flow(v, key);
    return out + "}";
  }
  if (py::hasattr(value, "tolist")) return yaml_flow(value.attr("tolist")(), key);  // NumPy array or scalar
  if (py::isinstance<py::sequence>(value)) {
    std::string out = "[";
    for (const auto& item : value.cast<py::sequence>())
      out += (out.size() > 1 ? ", " : "") + yaml_flow(item, key);
    return out + "]";
  }
  throw py::type_error(fmt::format("'{}' holds {}, expected numbers, text, lists or dicts", key,
                                   py::str(py::repr(value)).cast<std::string>()));
}

}  // namespace

const std::vector<std::string>& model_option_names() {
  static const std::vector<std::string> names = {"standard_state",
                                                 "pressure",
                                                 "scale",
                                                 "transition_state",
                                                 "imaginary_as_real_below",
                                                 "allow_mode_count_mismatch",
                                                 "max_temperature"};
  return names;
}

ModelOptions model_options(const py::dict& keywords) {
  ModelOptions m;
  std::string standard = "bar";
  for (const auto& [key, value] : keywords) {
    const std::string k = key.cast<std::string>();
    if (k == "standard_state") {
      standard = value.cast<std::string>();
      if (standard == "atm") {
        m.standard_state = StandardState::atm;
        m.pressure_Pa = constants::atmosphere_Pa;
      } else if (standard == "molar") {
        m.standard_state = StandardState::molar;
      } else if (standard != "bar") {
        throw py::value_error(fmt::format("standard_state '{}': expected bar, atm or molar", standard));
      }
    } else if (k == "scale") {
      m.frequency_scale = finite_number(value, "scale");
      if (!(m.frequency_scale > 0.0)) throw py::value_error("scale: expected a positive factor");
    } else if (k == "transition_state") {
      m.transition_state = value.cast<bool>();
    } else if (k == "imaginary_as_real_below") {
      m.imaginary_as_real_below_cm1 = finite_number(value, "imaginary_as_real_below");
    } else if (k == "max_temperature") {
      m.max_temperature_K = finite_number(value, "max_temperature");
    } else if (k == "allow_mode_count_mismatch") {
      m.mode_count_mismatch_is_warning = value.cast<bool>();
    } else if (k != "pressure") {
      throw py::type_error(
          fmt::format("unknown keyword '{}', expected model options ({})", k, join(model_option_names())));
    }
  }
  if (keywords.contains("pressure") && !keywords["pressure"].is_none()) {
    if (m.standard_state == StandardState::molar)
      throw py::value_error("pressure cannot be combined with standard_state='molar'");
    const py::object p = keywords["pressure"];
    // As on the command line, a bare number is refused: 1 could be 1 bar or 1 Pa.
    if (!py::isinstance<py::str>(p))
      throw py::type_error("pressure: expected text with a unit such as '1bar', '1atm' or '101325Pa'");
    m.pressure_Pa = parse_pressure_Pa_or_throw(p.cast<std::string>());
  }
  return m;
}

py::dict take(py::dict& keywords, const std::vector<std::string>& names) {
  py::dict out;
  for (const auto& name : names)
    if (keywords.contains(name.c_str())) {
      out[name.c_str()] = keywords[name.c_str()];
      PyDict_DelItemString(keywords.ptr(), name.c_str());
    }
  return out;
}

std::vector<double> temperatures(const py::handle& value) {
  if (py::isinstance<py::str>(value)) return parse_temperatures(value.cast<std::string>());
  std::vector<double> out;
  if (py::isinstance<py::float_>(value) || py::isinstance<py::int_>(value)) {
    out.push_back(finite_number(value, "temperature"));
  } else {
    for (const auto& item : py::iter(value)) out.push_back(finite_number(item, "temperature"));
  }
  if (out.empty()) throw py::value_error("temperatures: expected at least one temperature");
  for (double T : out)
    if (!(T > 0.0) || !std::isfinite(T))
      throw py::value_error(fmt::format("temperatures must be positive and finite, got {} K", T));
  return out;
}

Species species_from_keys(const py::dict& given) {
  py::dict keys;
  for (const auto& [k, v] : given) keys[k] = v;
  if (keys.contains("symbols") || keys.contains("coordinates")) {
    if (keys.contains("atoms"))
      throw py::type_error("give 'atoms', or 'symbols' with 'coordinates', not both");
    if (!keys.contains("symbols") || !keys.contains("coordinates"))
      throw py::type_error("'symbols' and 'coordinates' go together (coordinates N×3 in ångström)");
    const py::list symbols = py::list(keys["symbols"]);
    py::object coordinates = keys["coordinates"];
    if (py::hasattr(coordinates, "tolist")) coordinates = coordinates.attr("tolist")();
    const py::list rows = py::list(coordinates);
    if (rows.size() != symbols.size())
      throw py::value_error(
          fmt::format("{} symbols but {} coordinate rows, expected one row [x, y, z] per atom",
                      symbols.size(), rows.size()));
    py::list atoms;
    for (std::size_t i = 0; i < symbols.size(); ++i) {
      py::list atom;
      atom.append(symbols[i]);
      for (const auto& x : py::list(rows[i])) atom.append(x);
      atoms.append(atom);
    }
    PyDict_DelItemString(keys.ptr(), "symbols");
    PyDict_DelItemString(keys.ptr(), "coordinates");
    keys["atoms"] = atoms;
  }
  std::string text;
  for (const auto& [k, v] : keys) text += yaml_key(k) + ": " + yaml_flow(v, k.cast<std::string>()) + "\n";
  const std::string origin = "<python>";
  try {
    Species s = read_species_yaml(text, origin);
    s.origin = {origin, 0, 0};
    return s;
  } catch (const InputError& e) {
    // The line and column refer to text made here, not to anything the user wrote.
    throw InputError({origin, 0, 0}, e.message());
  }
}

py::array_t<double> array(const std::vector<double>& values) {
  py::array_t<double> out(static_cast<py::ssize_t>(values.size()));
  std::copy(values.begin(), values.end(), out.mutable_data());
  return out;
}

PreparedSpecies prepared(const py::handle& species, const py::dict& options) {
  if (py::isinstance<PreparedSpecies>(species)) {
    if (!options.empty())
      throw py::type_error("model options are fixed once a species is prepared; pass the Species instead");
    return species.cast<PreparedSpecies>();
  }
  if (py::isinstance<Species>(species))
    return prepare_species(species.cast<Species>(), model_options(options));
  throw py::type_error(fmt::format("expected a vibtherm.Species or vibtherm.PreparedSpecies, got {}",
                                   py::str(py::type::of(species).attr("__name__")).cast<std::string>()));
}

void register_input_error(py::module_& m) {
  static py::exception<InputError> error(m, "InputError", PyExc_ValueError);
  error.doc() =
      "Bad input: str() is the one-line 'FILE:LINE:COL: error: message'; attributes file, line, "
      "column (0 when unknown) and message.";
  py::register_exception_translator([](std::exception_ptr p) {
    try {
      if (p) std::rethrow_exception(p);
    } catch (const InputError& e) {
      py::object instance = py::reinterpret_borrow<py::object>(error.ptr())(e.what());
      instance.attr("file") = e.where().file;
      instance.attr("line") = e.where().line;
      instance.attr("column") = e.where().column;
      instance.attr("message") = e.message();
      PyErr_SetObject(error.ptr(), instance.ptr());
    }
  });
}

}  // namespace vibtherm::python
