// Checked access to YAML values; see yaml_values.hpp.
#include "yaml_values.hpp"

#include <fmt/format.h>
#include <yaml-cpp/eventhandler.h>

#include <algorithm>
#include <charconv>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <set>
#include <sstream>
#include <string_view>

#include "vibtherm/read_species.hpp"
#include "vibtherm/species_builder.hpp"
#include "vibtherm/spelling.hpp"
#include "vibtherm/units.hpp"

namespace vibtherm {
namespace {

// Records where the documents of a YAML text start, through yaml-cpp's event parser.
// yaml-cpp 0.7 never consumes a ',' where a document's root node should start (", 1",
// "--- ,"): YAML::LoadAll then yields empty documents forever at that position until
// memory runs out (found by fuzzing). Two documents starting at one mark reveal it.
class DocumentCounter : public YAML::EventHandler {
 public:
  std::vector<YAML::Mark> starts;
  void OnDocumentStart(const YAML::Mark& mark) override { starts.push_back(mark); }
  void OnDocumentEnd() override {}
  void OnNull(const YAML::Mark&, YAML::anchor_t) override {}
  void OnAlias(const YAML::Mark&, YAML::anchor_t) override {}
  void OnScalar(const YAML::Mark&, const std::string&, YAML::anchor_t, const std::string&) override {}
  void OnSequenceStart(const YAML::Mark&, const std::string&, YAML::anchor_t,
                       YAML::EmitterStyle::value) override {}
  void OnSequenceEnd() override {}
  void OnMapStart(const YAML::Mark&, const std::string&, YAML::anchor_t, YAML::EmitterStyle::value) override {
  }
  void OnMapEnd() override {}
};

// True when the text may hold more than one YAML document or trip the ',' fault above.
// A YAML stream holds a second document only after a line starting with the marker "---"
// or "..." in column 1 (YAML 1.2, section 9.2), so a text without such a line, and without
// a line starting with ',', holds one document and is parsed once. This scan costs a tiny
// fraction of a parse; the counting pass below runs only when it finds a marker.
bool may_hold_several_documents(const std::string& text) {
  for (std::size_t start = 0; start < text.size();) {
    const std::size_t end = std::min(text.find('\n', start), text.size());
    const std::string_view line(text.data() + start, end - start);
    if (line.starts_with("---") || line.starts_with("...")) return true;
    const std::size_t first = line.find_first_not_of(" \t");
    if (first != std::string_view::npos && line[first] == ',') return true;
    start = end + 1;
  }
  return false;
}

// Counts the values (scalars, nulls, aliases, sequences, maps) of a YAML text through the
// event parser, which keeps no tree, and fails at the first value past max_yaml_values.
class ValueCounter : public YAML::EventHandler {
 public:
  explicit ValueCounter(const std::string& file_name) : file_(file_name) {}
  void OnDocumentStart(const YAML::Mark&) override {}
  void OnDocumentEnd() override {}
  void OnNull(const YAML::Mark& mark, YAML::anchor_t) override { count(mark); }
  void OnAlias(const YAML::Mark& mark, YAML::anchor_t) override { count(mark); }
  void OnScalar(const YAML::Mark& mark, const std::string&, YAML::anchor_t, const std::string&) override {
    count(mark);
  }
  void OnSequenceStart(const YAML::Mark& mark, const std::string&, YAML::anchor_t,
                       YAML::EmitterStyle::value) override {
    count(mark);
  }
  void OnSequenceEnd() override {}
  void OnMapStart(const YAML::Mark& mark, const std::string&, YAML::anchor_t,
                  YAML::EmitterStyle::value) override {
    count(mark);
  }
  void OnMapEnd() override {}

 private:
  void count(const YAML::Mark& mark) {
    if (++values_ > max_yaml_values)
      fail({file_, mark.line + 1, mark.column + 1},
           fmt::format("file holds more than {} YAML values (list entries, keys and scalars), expected fewer",
                       max_yaml_values));
  }
  const std::string& file_;
  std::size_t values_ = 0;
};

// yaml-cpp's node tree costs about 550 bytes per value: a 32 MiB file of short list entries
// ("[1,1,1,...", 16 million values) would need about 9 GB before any check could count
// them. A value ends at one of , [ { : - or a line end, and a flow-map key without a value
// adds a null, so twice the count of those characters plus one bounds the values from
// above; only a text whose bound passes the limit is counted exactly, by events.
void check_yaml_value_count(const std::string& text, const std::string& file_name) {
  std::size_t ends = 0;
  for (const char c : text) ends += c == ',' || c == '[' || c == '{' || c == ':' || c == '-' || c == '\n';
  if (2 * ends + 1 <= max_yaml_values) return;
  std::istringstream stream(text);
  YAML::Parser parser(stream);
  ValueCounter counter(file_name);
  while (parser.HandleNextDocument(counter)) {
  }
}

}  // namespace

YAML::Node load_single_yaml_document(const std::string& text, const std::string& file_name,
                                     const std::string& expected, const std::string& one_per_file) {
  try {
    check_yaml_value_count(text, file_name);
    if (!may_hold_several_documents(text)) return YAML::Load(text);
    std::istringstream stream(text);
    YAML::Parser parser(stream);
    DocumentCounter counter;
    while (counter.starts.size() < 3 && parser.HandleNextDocument(counter)) {
    }
    if (counter.starts.size() == 3 && counter.starts[1].pos == counter.starts[2].pos) {
      const YAML::Mark& stuck = counter.starts[1];
      fail({file_name, stuck.line + 1, stuck.column + 1},
           "malformed YAML: a document cannot start with ',', " + expected);
    }
    if (counter.starts.size() > 1) {
      const YAML::Mark& second = counter.starts[1];
      fail({file_name, second.line + 1, second.column + 1},
           "file holds more than one YAML document, " + one_per_file);
    }
    return YAML::Load(text);
  } catch (const YAML::Exception& e) {
    SourceLocation where{file_name, 0, 0};
    if (!e.mark.is_null()) where = {file_name, e.mark.line + 1, e.mark.column + 1};
    fail(where, "malformed YAML: " + e.msg + ", " + expected);
  }
}

std::string read_input_text_file(const std::string& path, const std::string& what) {
  namespace fs = std::filesystem;
  std::error_code ec;
  const fs::file_status status = fs::status(path, ec);
  if (fs::is_directory(status)) fail({path, 0, 0}, "is a directory, expected " + what);
  if (fs::exists(status) && !fs::is_regular_file(status))
    fail({path, 0, 0}, "is not a regular file (a device, FIFO or socket), expected " + what);
  std::ifstream in(path, std::ios::binary);
  if (!in) fail({path, 0, 0}, "cannot read file (missing or not readable), expected " + what);
  constexpr std::uintmax_t max_bytes = 32u << 20;
  const auto size = fs::file_size(path, ec);
  if (!ec && size > max_bytes) fail({path, 0, 0}, "file has more than 32 MiB, expected " + what);
  std::string text((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
  if (in.bad()) fail({path, 0, 0}, "error while reading file");
  if (text.find_first_not_of(" \t\r\n") == std::string::npos)
    fail({path, 0, 0}, "file is empty, expected " + what);
  return text;
}

SourceLocation YamlValues::at(const YAML::Node& node) const {
  YAML::Mark mark = node.Mark();
  if (mark.is_null()) return {file_, 0, 0};
  return {file_, mark.line + 1, mark.column + 1};
}

void YamlValues::error(const YAML::Node& node, const std::string& message) const { fail(at(node), message); }

std::string YamlValues::describe(const YAML::Node& node) {
  if (node.IsSequence()) return "a list";
  if (node.IsMap()) return "a map";
  if (node.IsNull()) return "nothing";
  if (node.IsScalar()) return quote(node.Scalar());
  return "something undefined";
}

YamlValues::Entries YamlValues::entries(const YAML::Node& map, const std::string& what,
                                        const std::vector<std::string>& allowed) const {
  Entries out;
  for (auto it = map.begin(); it != map.end(); ++it) {
    // A copy: the iterator's pair is a temporary, a reference to its member would dangle.
    const YAML::Node key = it->first;
    if (!key.IsScalar()) error(key, "a key of " + what + " is " + describe(key) + ", expected a plain name");
    const std::string& k = key.Scalar();
    if (std::find(allowed.begin(), allowed.end(), k) == allowed.end()) {
      std::string suggestion = closest_word(k, allowed);
      // A key that is the start of a known one ('symmetry' for 'symmetry_number') is a near miss too.
      for (const std::string& a : allowed)
        if (suggestion.empty() && k.size() >= 3 && a.rfind(k, 0) == 0) suggestion = a;
      if (!suggestion.empty())
        error(key, "unknown key " + quote(k) + " in " + what + ", did you mean '" + suggestion + "'?");
      error(key, "unknown key " + quote(k) + " in " + what + ", expected one of " + join(allowed));
    }
    if (out.count(k)) {
      error(key, "duplicate key " + quote(k) + " in " + what + " (first at line " +
                     std::to_string(at(out[k].key).line) + "), expected each key once");
    }
    out[k] = Entry{key, it->second};
  }
  return out;
}

double YamlValues::number(const YAML::Node& node, const std::string& what) const {
  if (node.IsNull()) error(node, what + " has no value, expected a number");
  if (!node.IsScalar()) error(node, what + " is " + describe(node) + ", expected a number");
  const std::string& s = node.Scalar();
  // A quoted scalar ("1.0") carries the non-specific tag "!": it is text, not a number.
  if (node.Tag() == "!") error(node, what + " is the quoted text " + quote(s) + ", expected a number");
  static const std::set<std::string> non_finite = {".nan",  ".NaN",  ".NAN",  ".inf",  ".Inf",  ".INF",
                                                   "-.inf", "-.Inf", "-.INF", "+.inf", "+.Inf", "+.INF"};
  if (non_finite.count(s) || s == "nan" || s == "inf" || s == "-inf")
    error(node, what + " is " + quote(s) + ", expected a finite number");
  std::optional<double> value = parse_number(s);
  if (!value) error(node, what + " is " + quote(s) + ", expected a number");
  return *value;
}

double YamlValues::positive_number(const YAML::Node& node, const std::string& what) const {
  double value = number(node, what);
  if (!(value > 0.0)) error(node, what + " is " + quote(node.Scalar()) + ", expected a positive number");
  return value;
}

int YamlValues::positive_integer(const YAML::Node& node, const std::string& what) const {
  if (node.IsNull()) error(node, what + " has no value, expected a positive whole number");
  if (!node.IsScalar() || node.Tag() == "!")
    error(node, what + " is " + describe(node) + ", expected a positive whole number");
  const std::string& s = node.Scalar();
  int value = 0;
  auto [end, ec] = std::from_chars(s.data(), s.data() + s.size(), value);
  if (ec != std::errc() || end != s.data() + s.size() || value <= 0)
    error(node, what + " is " + quote(s) + ", expected a positive whole number");
  return value;
}

bool YamlValues::boolean(const YAML::Node& node, const std::string& what) const {
  if (node.IsScalar() && node.Tag() != "!") {
    const std::string& s = node.Scalar();
    // YAML 1.2 core schema booleans only: "yes"/"no"/"on" are too easy to mistype.
    if (s == "true" || s == "True" || s == "TRUE") return true;
    if (s == "false" || s == "False" || s == "FALSE") return false;
  }
  error(node, what + " is " + describe(node) + ", expected true or false");
}

std::string YamlValues::text(const YAML::Node& node, const std::string& what) const {
  if (node.IsNull()) error(node, what + " has no value, expected text");
  if (!node.IsScalar()) error(node, what + " is " + describe(node) + ", expected text");
  return node.Scalar();
}

std::string YamlValues::unit_of(const Entries& e) const {
  const YAML::Node* unit = find(e, "unit");
  return unit ? text(*unit, "'unit'") : std::string("cm^-1");
}

double YamlValues::wavenumber_value(const YAML::Node& node, const std::string& what) const {
  if (node.IsMap()) {
    Entries e = entries(node, what, {"value", "unit"});
    const YAML::Node* value = find(e, "value");
    if (!value) error(node, what + " has no 'value', expected {value: number, unit: text}");
    double v = number(*value, what);
    std::string unit = unit_of(e);
    std::optional<double> cm1 = to_wavenumber_cm1(v, unit);
    if (!cm1)
      error(*find(e, "unit"),
            "unknown wavenumber unit " + quote(unit) + ", expected one of " + wavenumber_units_list());
    return *cm1;
  }
  return number(node, what);
}

std::vector<YamlValues::Located> YamlValues::wavenumbers(const YAML::Node& node, const std::string& what,
                                                         bool allow_single) const {
  std::vector<Located> out;
  if (node.IsMap()) {
    Entries e = entries(node, what, {"values", "value", "unit"});
    const YAML::Node* values = find(e, "values");
    const YAML::Node* value = find(e, "value");
    if (values && value) error(node, what + " has both 'values' and 'value', expected one of them");
    if (!values && !value) error(node, what + " has no 'values', expected {values: [numbers], unit: text}");
    std::string unit = unit_of(e);
    if (!to_wavenumber_cm1(1.0, unit))
      error(*find(e, "unit"),
            "unknown wavenumber unit " + quote(unit) + ", expected one of " + wavenumber_units_list());
    if (value && value->IsSequence()) values = value;  // {value: [...], unit: ...} as well
    if (value && !value->IsSequence()) {
      out.push_back({*to_wavenumber_cm1(number(*value, what), unit), *value});
    } else {
      if (!values->IsSequence())
        error(*values, what + " 'values' is " + describe(*values) + ", expected a list of numbers");
      for (const YAML::Node& item : *values)
        out.push_back({*to_wavenumber_cm1(number(item, what + " value"), unit), item});
    }
    return out;
  }
  if (node.IsSequence()) {
    for (const YAML::Node& item : node)
      out.push_back({wavenumber_value(item, what + " entry " + std::to_string(out.size() + 1)), item});
    return out;
  }
  if (allow_single && node.IsScalar()) return {{number(node, what), node}};
  error(node, what + " is " + describe(node) +
                  ", expected a list of numbers in cm^-1 or {values: [...], unit: ...}");
}

double YamlValues::energy_J_per_mol(const YAML::Node& node, const std::string& what,
                                    const std::string& bare_unit) const {
  double v = 0.0;
  std::string u = bare_unit;
  YAML::Node at_node = node;  // a handle of its own: the entries below go out of scope
  if (node.IsMap()) {
    Entries e = entries(node, what, {"value", "unit"});
    const YAML::Node* value = find(e, "value");
    const YAML::Node* unit = find(e, "unit");
    if (!value) error(node, what + " has no 'value', expected {value: number, unit: " + bare_unit + "}");
    v = number(*value, what);
    if (unit) {
      u = text(*unit, "'unit'");
      at_node.reset(*unit);  // reset, not =: assigning a Node overwrites the node it refers to
    }
  } else {
    v = number(node, what);  // bare number: kJ/mol for enthalpies (design.md section 4)
  }
  std::optional<double> J_per_mol = to_energy_J_per_mol(v, u);
  if (!J_per_mol)
    error(at_node, "unknown energy unit " + quote(u) + ", expected one of " + energy_units_list());
  return *J_per_mol;
}

ScaleFactors YamlValues::scale_factors(const YAML::Node& node, const std::string& what) const {
  if (!node.IsMap())
    error(node, what + " is " + describe(node) +
                    ", expected a map such as {zpe: 0.98, enthalpy: 0.99, entropy: 1.0}");
  const Entries e = entries(node, what, {"zpe", "enthalpy", "entropy"});
  ScaleFactors f;
  if (const YAML::Node* v = find(e, "zpe")) f.zpe = positive_number(*v, what + " 'zpe'");
  if (const YAML::Node* v = find(e, "enthalpy")) f.enthalpy = positive_number(*v, what + " 'enthalpy'");
  if (const YAML::Node* v = find(e, "entropy")) f.entropy = positive_number(*v, what + " 'entropy'");
  if (f.empty()) error(node, what + " is empty, expected at least one of zpe, enthalpy, entropy");
  return f;
}

}  // namespace vibtherm
