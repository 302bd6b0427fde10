#!/usr/bin/env python3
"""Species read from QC exchange files through the command line: the QCSchema Hessian result
and the Molden files of the water model (tests/data/make_water_exchange_files.py, made from
water-model-hessian-full.yaml; the model force field, not data) give the YAML species' table.

Usage: exchange_cli_test.py VIBTHERM_EXECUTABLE REPO_ROOT
"""
import json
import math
import pathlib
import shutil
import sys
import tempfile

from harness import Checks

R = 8.314462618  # J/(mol K), CODATA 2018 (N_A k_B)


def table(checks, *files):
    result = checks.run("table", *files, "--temps", "200,298.15,1000,3000", "--format", "json")
    if result.returncode != 0:
        return None, result.stderr
    return {s["name"]: s["rows"] for s in json.loads(result.stdout)["species"]}, result.stderr


def close(a, b, rel):
    return abs(a - b) <= rel * max(abs(a), abs(b), 1e-300)


def main():
    exe, root = sys.argv[1], pathlib.Path(sys.argv[2])
    data = root / "tests" / "data"
    checks = Checks(exe)
    tables, stderr = table(checks, str(data / "water-model-hessian-full.yaml"), str(data / "water-model-hessian.json"),
                           str(data / "water-model.molden"), str(data / "water-model-all-modes.molden"))
    checks.check("table reads YAML, QCSchema and Molden in one run", tables is not None, stderr)
    if tables is None:
        checks.finish()
    ref = tables["water-model-hessian-full"]
    # The exchange files carry no symmetry number: σ = 2 is detected from the C2v geometry
    # (point-group order, common practice), so S, Cp and H equal the YAML's (which gives 2).
    for name in ("water-model-hessian", "water-model", "water-model-all-modes"):
        rows = tables.get(name)
        checks.check(f"{name}: a table", rows is not None and len(rows) == 4, sorted(tables))
        if rows is None:
            continue
        ok = all(close(r["Cp"], q["Cp"], 1e-9) and close(r["H_minus_H298"], q["H_minus_H298"], 1e-9) and
                 close(r["S"], q["S"], 1e-9) for r, q in zip(ref, rows))
        checks.check(f"{name}: Cp, H and S as the YAML's (σ = 2 detected)", ok, f"{ref} vs {rows}")
    checks.check("the detected symmetry number is said", "symmetry number 2 from the point group C2v" in stderr, stderr)
    checks.check("the dropped Molden entries are stated", "dropped 6 near-zero [FREQ] entries" in stderr, stderr)
    # The QCSchema `model` (method/basis) is recorded: inspect's key and fit's provenance.
    qc = str(data / "water-model-hessian.json")
    result = checks.run("inspect", qc, "--format", "json")
    facts = json.loads(result.stdout)["species"][0] if result.returncode == 0 else {}
    checks.check("inspect records the QCSchema method/basis", facts.get("computed_with") == "model-force-field/none",
                 result.stdout[-300:] + result.stderr)
    result = checks.run("fit", qc, "--allow-missing-hf", "--form", "json")
    provenance = json.loads(result.stdout)["species"][0]["provenance"] if result.returncode == 0 else {}
    checks.check("fit's provenance records the QCSchema method/basis",
                 provenance.get("model_options", {}).get("computed_with") == "model-force-field/none",
                 json.dumps(provenance) + result.stderr)
    # A manifest line may be an inline species: `from:` plus overrides, errors at its line and column.
    with tempfile.TemporaryDirectory() as tmp:
        shutil.copy(qc, tmp)
        manifest = pathlib.Path(tmp) / "set.list"
        manifest.write_text("water-model-hessian.json\n"
                            "{from: water-model-hessian.json, name: heavy, isotopes: {2: D, 3: D}}  # D2O\n")
        result = checks.run("inspect", str(manifest), "--format", "json")
        names = [s["name"] for s in json.loads(result.stdout)["species"]] if result.returncode == 0 else []
        checks.check("a manifest's inline species is read with its overrides", names == ["water-model-hessian", "heavy"],
                     result.stderr)
        result = checks.run("fit", str(manifest), "--allow-missing-hf", "--form", "json")
        files = [s["provenance"]["input_file"] for s in json.loads(result.stdout)["species"]] \
            if result.returncode == 0 else []
        checks.check("its provenance names the manifest line", len(files) == 2 and files[1].endswith("set.list:2"),
                     str(files) + result.stderr)
        manifest.write_text("water-model-hessian.json\n{from: water-model-hessian.json, symmetry_number: zero}\n")
        result = checks.run("inspect", str(manifest))
        checks.check("an inline species' error is located in the manifest", result.returncode == 2 and
                     result.stderr.strip().endswith("expected a positive whole number") and
                     f"{manifest}:2:" in result.stderr, result.stderr)
    result = checks.run("table", str(root / "tests" / "bad" / "qcschema_gradient.json"))
    checks.check("a gradient result is refused in one line, exit 2",
                 result.returncode == 2 and len(result.stderr.strip().splitlines()) == 1, result.stderr)
    checks.finish()


if __name__ == "__main__":
    main()
