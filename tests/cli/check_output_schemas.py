#!/usr/bin/env python3
"""Validates the JSON outputs of the executable against schemas/*.schema.json with an
independent validator (Debian's python3-jsonschema, Draft 2020-12).

Usage: check_output_schemas.py VIBTHERM_EXE PROJECT_ROOT
"""
import json
import os
import subprocess
import sys

import jsonschema

exe, root = sys.argv[1], sys.argv[2]
examples = os.path.join(root, "examples", "fuel-additive")
# (schema file, arguments); a case is listed only when its subcommand exists.
cases = [
    ("table.schema.json", ["table", examples, "--format", "json", "--breakdown", "--temps", "200:3000:400"]),
    ("inspect.schema.json", ["inspect", examples, "--format", "json"]),
    ("modes.schema.json", ["modes", examples, "--format", "json"]),
    ("fit.schema.json", ["fit", examples, "--form", "json"]),
]
# The model extensions: a qrrho species, a transition state with tunnelling, an ensemble,
# an adsorbate (no rotor facts).
data = os.path.join(root, "tests", "data")
extensions = [os.path.join(data, f) for f in ("model-soft-mode.yaml", "model-ts-symmetric.yaml", "model-conformers.yaml",
                                                     "adsorbed-water.yaml")]
cases += [
    ("table.schema.json", ["table", *extensions, "--format", "json", "--breakdown", "--temps", "300,1000"]),
    ("inspect.schema.json", ["inspect", *extensions, "--format", "json"]),
    ("modes.schema.json", ["modes", *extensions, "--format", "json"]),
]
# Reactions: the JANAF checks, with the ln K fit.
reactions = os.path.join(root, "validation", "reactions")
cases += [
    ("reaction.schema.json", ["reaction", os.path.join(reactions, "water-dissociation.yaml"),
                              os.path.join(reactions, "dinitrogen-tetroxide.yaml"), "--format", "json", "--fit-lnk"]),
]
passed = failed = 0
for schema_name, args in cases:
    schema_path = os.path.join(root, "schemas", schema_name)
    if not os.path.exists(schema_path):
        continue
    schema = json.load(open(schema_path, encoding="utf-8"))
    jsonschema.Draft202012Validator.check_schema(schema)
    result = subprocess.run([exe, *args], capture_output=True, text=True)
    try:
        if result.returncode != 0:
            raise ValueError(f"exit {result.returncode}: {result.stderr.strip()}")
        jsonschema.Draft202012Validator(schema).validate(json.loads(result.stdout))
        passed += 1
        print(f"ok    {schema_name}: vibtherm {' '.join(args[:1])}")
    except (ValueError, jsonschema.ValidationError) as error:
        failed += 1
        print(f"FAIL  {schema_name}: {str(error).splitlines()[0]}")
print(f"{passed} passed, {failed} failed")
sys.exit(1 if failed or not passed else 0)
