#!/usr/bin/env python3
"""Checks schemas/species.schema.json against the species files we ship.

Usage: schema_check.py REPOSITORY_ROOT

- The schema itself must be a valid JSON Schema (draft 2020-12).
- Every YAML file under examples/ (recursive), tests/data/ and validation/species/ must
  validate.
- The malformed inputs in tests/bad/ whose fault is one the schema can express (listed
  below) must be rejected by it, so the schema does not drift into accepting anything.
"""
import json
import pathlib
import sys

import jsonschema
import yaml

# tests/bad files whose fault is structural, so the schema must reject them too. The
# others only the reader can judge: YAML syntax, binary content, unknown elements or
# isotopes of a valid form (Cx, C15), duplicate keys (PyYAML keeps the last one),
# 'linear' against the number of rotational values, zero frequencies, coordinates.
SCHEMA_REJECTS = [
    "atoms_not_a_list.yaml",
    "hessian_and_frequencies.yaml",
    "hessian_unit_unknown.yaml",
    "hessian_without_atoms.yaml",
    "missing_atoms.yaml",
    "missing_name.yaml",
    "negative_mass.yaml",
    "quoted_number.yaml",
    "spin_and_levels.yaml",
    "symmetry_not_integer.yaml",
    "top_level_list.yaml",
    "unknown_energy_unit.yaml",
    "unknown_key.yaml",
    "unknown_nested_key.yaml",
    "unknown_phase.yaml",
    "unknown_unit.yaml",
    "zero_mass.yaml",
]


def load(path):
    with open(path, encoding="utf-8") as f:
        data = yaml.safe_load(f)
    # YAML allows integer map keys (isotopes: {2: D}); JSON objects have string keys.
    return json.loads(json.dumps(data))


def main():
    if len(sys.argv) != 2:
        sys.exit(__doc__)
    root = pathlib.Path(sys.argv[1])
    schema = json.loads((root / "schemas" / "species.schema.json").read_text(encoding="utf-8"))
    jsonschema.Draft202012Validator.check_schema(schema)
    validator = jsonschema.Draft202012Validator(schema)

    # Method files (a top-level 'elements') and reaction files (a top-level 'species' list)
    # have schemas of their own.
    others = {}
    for kind, name in (("method", "method"), ("reaction", "reaction_file")):
        path = root / "schemas" / f"{name}.schema.json"
        if path.exists():
            other = json.loads(path.read_text(encoding="utf-8"))
            jsonschema.Draft202012Validator.check_schema(other)
            others[kind] = jsonschema.Draft202012Validator(other)

    def validator_for(document):
        if isinstance(document, dict) and "elements" in document and "method" in others:
            return others["method"]
        if isinstance(document, dict) and isinstance(document.get("species"), list) and "reaction" in others:
            return others["reaction"]
        return validator

    failures = []
    good = sorted(root.glob("examples/**/*.yaml")) + sorted(root.glob("examples/**/*.yml"))
    good += sorted((root / "tests" / "data").glob("*.yaml"))
    good += sorted((root / "validation" / "species").glob("*.yaml"))
    for path in good:
        document = load(path)
        errors = sorted(validator_for(document).iter_errors(document), key=lambda e: list(e.path))
        for e in errors:
            where = "/".join(str(p) for p in e.path) or "(top level)"
            failures.append(f"{path.relative_to(root)}: {where}: {e.message}")

    rejects = SCHEMA_REJECTS
    for name in rejects:
        path = root / "tests" / "bad" / name
        document = load(path)
        if validator_for(document).is_valid(document):
            failures.append(f"tests/bad/{name}: accepted by the schema, expected a rejection")

    for f in failures:
        print("FAIL", f)
    print(f"{len(good)} good files checked, {len(rejects)} bad files checked, {len(failures)} failures")
    sys.exit(1 if failures else 0)


if __name__ == "__main__":
    main()
