#!/usr/bin/env python3
"""Command-line behaviour: exit codes, pinned JSON keys, atomic output, --keep-going.

Usage: run_cli_checks.py VIBTHERM_EXE PROJECT_ROOT
"""
import json
import math
import os
import subprocess
import sys
import tempfile

from harness import Checks

exe, root = sys.argv[1], sys.argv[2]
examples = os.path.join(root, "examples", "fuel-additive")
water = os.path.join(examples, "water.yaml")
checks = Checks(exe)
run, check = checks.run, checks.check

# table JSON: pinned keys (design.md section 5).
r = run("table", water, "--temps", "298.15,1000", "--format", "json")
doc = json.loads(r.stdout) if r.returncode == 0 else {}
row = doc.get("species", [{}])[0].get("rows", [{}])[0] if doc else {}
check("table json keys", r.returncode == 0 and "units" in doc and
      all(k in row for k in ("T", "Cp", "S", "H_minus_H298")), r.stderr)
check("table json H-H298 is zero at 298.15 K", abs(row.get("H_minus_H298", 1.0)) < 1e-9)

# inspect JSON: pinned keys.
r = run("inspect", water, "--format", "json")
spec = json.loads(r.stdout)["species"][0] if r.returncode == 0 else {}
check("inspect json keys", all(k in spec for k in ("name", "rotor", "mass", "moments_of_inertia",
                                                   "symmetry_number", "frequencies", "zpe")), r.stderr)
check("inspect rotor of water", spec.get("rotor") == "nonlinear")
check("moments ascending", spec.get("moments_of_inertia", [1, 0]) == sorted(spec.get("moments_of_inertia", [1, 0])))

# An adsorbate neither translates nor rotates: no rotor type, moments or rotational
# constants in any format (issue 12).
adsorbate = os.path.join(root, "tests", "data", "adsorbed-water.yaml")
r = run("inspect", adsorbate, "--format", "json")
spec = json.loads(r.stdout)["species"][0] if r.returncode == 0 else {}
check("adsorbate json has no rotor facts", r.returncode == 0 and spec.get("phase") == "adsorbate" and
      not any(k in spec for k in ("rotor", "moments_of_inertia", "rotational_constants_cm1")), r.stdout)
r = run("inspect", adsorbate)
check("adsorbate text has no rotor facts", r.returncode == 0 and "rotor" not in r.stdout and
      "moments" not in r.stdout, r.stdout)
r = run("inspect", adsorbate, "--format", "csv")
fields = r.stdout.splitlines()[1].split(",") if r.returncode == 0 else []
check("adsorbate csv leaves rotor and moments empty", fields[3:4] == [""] and fields[6:9] == ["", "", ""], r.stdout)

# CSV has units in the header.
r = run("table", water, "--temps", "300", "--format", "csv")
check("csv header with units", r.returncode == 0 and "Cp_J_per_mol_K" in r.stdout.splitlines()[0])

# Directory input keeps sorted order; -o writes atomically and leaves no temporary file.
with tempfile.TemporaryDirectory() as tmp:
    out = os.path.join(tmp, "t.json")
    r = run("table", examples, "--temps", "500", "--format", "json", "-o", out)
    names = [s["name"] for s in json.load(open(out))["species"]] if r.returncode == 0 else []
    check("directory input", r.returncode == 0 and len(names) >= 6, r.stderr)
    check("no temporary files left", os.listdir(tmp) == ["t.json"], str(os.listdir(tmp)))

    # --keep-going: good species written, failures listed, exit 1.
    bad = os.path.join(tmp, "bad.yaml")
    open(bad, "w").write("name: broken\natoms:\n  - [Xx, 0, 0, 0]\n")
    out2 = os.path.join(tmp, "k.json")
    r = run("table", water, bad, "--format", "json", "-o", out2, "--keep-going")
    check("keep-going exits 1", r.returncode == 1, f"{r.returncode} {r.stderr}")
    check("keep-going writes the good species",
          os.path.exists(out2) and [s["name"] for s in json.load(open(out2))["species"]] == ["H2O"])
    # Without it: exit 2 and nothing written.
    out3 = os.path.join(tmp, "n.json")
    r = run("table", water, bad, "-o", out3)
    check("input error exits 2", r.returncode == 2, f"{r.returncode}")
    check("input error writes nothing", not os.path.exists(out3))
    check("input error is one line", len(r.stderr.strip().splitlines()) == 1, r.stderr)

# Usage errors exit 2; --help exits 0.
check("unknown option exits 2", run("table", water, "--bogus").returncode == 2)
check("bad format exits 2", run("table", water, "--format", "xml").returncode == 2)
check("help exits 0", run("--help").returncode == 0)

# Standard states: 1 atm lowers S by R ln(1.01325) (ideal-gas identity).
def s_at(*extra):
    r = run("table", water, "--temps", "298.15", "--format", "json", *extra)
    return json.loads(r.stdout)["species"][0]["rows"][0]["S"]
check("1 atm standard state", abs(s_at() - s_at("--standard-state", "atm") - 8.314462618 * 0.013163) < 1e-3)

# A Hessian replaces frequencies (tests/data/water-model-hessian*.yaml: a model force field).
data = os.path.join(root, "tests", "data")
hessian_triangle = os.path.join(data, "water-model-hessian.yaml")
hessian_full = os.path.join(data, "water-model-hessian-full.yaml")


def table_rows(path):
    r = run("table", path, "--temps", "298.15,1000,3000", "--format", "json")
    return json.loads(r.stdout)["species"][0]["rows"] if r.returncode == 0 else [r.stderr]


def inspect_of(path):
    r = run("inspect", path, "--format", "json")
    return json.loads(r.stdout)["species"][0] if r.returncode == 0 else {"error": r.stderr}


check("hessian: lower triangle and full matrix give the same table",
      table_rows(hessian_triangle) == table_rows(hessian_full), str(table_rows(hessian_triangle)))
h2o = inspect_of(hessian_triangle)
check("hessian: 3N-6 frequencies", len(h2o.get("frequencies", [])) == 3, str(h2o))
with tempfile.TemporaryDirectory() as tmp:
    # The same species given by the frequencies the Hessian yields: the same table.
    text = open(hessian_triangle).read()
    head = text[:text.index("hessian_unit:")]
    by_frequencies = os.path.join(tmp, "f.yaml")
    open(by_frequencies, "w").write(head + "frequencies: " + json.dumps(h2o.get("frequencies", [])) + "\n")
    a, b = table_rows(hessian_triangle), table_rows(by_frequencies)
    check("hessian: same table as its frequencies",
          len(a) == len(b) == 3 and all(abs(x["Cp"] - y["Cp"]) < 1e-9 and abs(x["S"] - y["S"]) < 1e-9
                                        for x, y in zip(a, b)), f"{a} {b}")
    # Isotopes change the masses, so one Hessian gives D2O's frequencies too.
    d2o_path = os.path.join(tmp, "d2o.yaml")
    open(d2o_path, "w").write(text + "isotopes: {2: D, 3: D}\n")
    d2o = inspect_of(d2o_path)
    ratios = [d / h for d, h in zip(d2o.get("frequencies", []), h2o.get("frequencies", []))]
    check("hessian: D2O frequencies between 1/sqrt(2) and 1 of H2O's",
          len(ratios) == 3 and all(0.5 ** 0.5 < q < 1.0 for q in ratios), f"{ratios} {d2o}")

# Hindered rotor end to end: the table shows the internal rotation, the modes analysis
# counts it in F(T), and F + electronic equals the table's 2 Cv/R.
ethane = os.path.join(root, "tests", "data", "ethane_rotor.yaml")
r = run("table", ethane, "--temps", "150,298.15,1000", "--format", "json", "--breakdown")
rows = json.loads(r.stdout)["species"][0]["rows"] if r.returncode == 0 else []
check("hindered rotor: table breakdown has hindered_rotors",
      len(rows) == 3 and all("hindered_rotors" in x.get("motions", {}) for x in rows), r.stderr)
r = run("modes", ethane, "--temps", "150,298.15,1000", "--format", "json")
mspec = json.loads(r.stdout)["species"][0] if r.returncode == 0 else {}
temps = mspec.get("temperatures", [])
R = 8.314462618
check("hindered rotor: modes dof has hindered_rotors, classical 1",
      len(temps) == 3 and all("hindered_rotors" in t["dof"] for t in temps) and
      mspec.get("classical_dof", {}).get("hindered_rotors") == 1 and len(mspec.get("vibrations", [])) == 17,
      r.stderr)
check("hindered rotor: F(T) sums its motions and equals 2 Cv/R of the table",
      len(temps) == len(rows) == 3 and all(
          abs(t["dof"]["translation"] + t["dof"]["rotation"] + t["dof"]["vibration"] +
              t["dof"]["hindered_rotors"] - t["dof"]["total"]) < 1e-9 and
          abs(t["dof"]["total"] + t["dof"].get("electronic", 0.0) - 2.0 * x["Cv"] / R) < 1e-6
          for t, x in zip(temps, rows)), f"{temps} {rows}")
with tempfile.TemporaryDirectory() as tmp:
    # Without the rotor the torsion is harmonic: S at 298.15 K differs (by about 1 J/(mol K)).
    text = open(ethane).read()
    harmonic = os.path.join(tmp, "harmonic.yaml")
    open(harmonic, "w").write(text[:text.index("hindered_rotors:")])
    h = table_rows(harmonic)
    hr = table_rows(ethane)
    check("hindered rotor: changes S against the harmonic torsion",
          len(h) == len(hr) == 3 and all(abs(a["S"] - b["S"]) > 0.1 for a, b in zip(h, hr)), f"{h} {hr}")

# Scan rotors: the fit's residuals are noted; a bumped point and a wrong period are warned
# about on stderr (threshold 0.2 kJ/mol, README "Hindered internal rotors").
with tempfile.TemporaryDirectory() as tmp:
    text = open(ethane).read()
    head = text[:text.index("hindered_rotors:")]
    def scan_yaml(name, points, symmetry=3):
        path = os.path.join(tmp, name)
        pts = ", ".join(f"[{a}, {e:.6f}]" for a, e in points)
        open(path, "w").write(head + f"hindered_rotors:\n  - {{bond: [1, 2], symmetry: {symmetry}, "
                              f"scan: [{pts}], replaces: 289}}\n")
        return path
    cosine = [(a, 6.0 * (1 - math.cos(math.radians(3 * a)))) for a in range(0, 360, 10)]
    r = run("inspect", scan_yaml("clean.yaml", cosine), "--format", "json")
    notes = json.loads(r.stdout)["species"][0].get("notes", []) if r.returncode == 0 else []
    check("scan rotor: note gives the fit's RMS and largest residual",
          any("residual RMS 0.000 kJ/mol" in n for n in notes) and "warning" not in r.stderr, f"{notes} {r.stderr}")
    bumped = [(a, e + (0.5 if a == 40 else 0.0)) for a, e in cosine]
    r = run("table", scan_yaml("bumped.yaml", bumped), "--temps", "298.15")
    check("scan rotor: a point 0.5 kJ/mol off is warned about (period and residual)",
          r.returncode == 0 and "does not repeat every 120 deg" in r.stderr and "misses the scan by up to" in r.stderr,
          r.stderr)
    twofold = [(a, 6.0 * (1 - math.cos(math.radians(2 * a)))) for a in range(0, 360, 10)]
    r = run("table", scan_yaml("twofold.yaml", twofold), "--temps", "298.15")
    check("scan rotor: a two-fold scan declared three-fold is warned about",
          r.returncode == 0 and "does not repeat every 120 deg (symmetry 3)" in r.stderr, r.stderr)

# Methanol's OH rotor: the coupled reduced moment (default) is 6.5 % below the bond-axis
# one (issue 7 figure; README "Hindered internal rotors") and the note gives both.
with tempfile.TemporaryDirectory() as tmp:
    text = open(os.path.join(root, "examples", "fuel-additive", "methanol.yaml")).read()
    moments = {}
    for moment in ("coupled", "bond_axis"):
        path = os.path.join(tmp, moment + ".yaml")
        open(path, "w").write(text + "hindered_rotors:\n  - {bond: [2, 1], symmetry: 3, barrier: 4.5, "
                              f"replaces: 295, moment: {moment}}}\n")
        r = run("inspect", path, "--format", "json")
        notes = json.loads(r.stdout)["species"][0].get("notes", []) if r.returncode == 0 else []
        found = [n for n in notes if "reduced moment" in n]
        moments[moment] = float(found[0].split("reduced moment ")[1].split()[0]) if found else float("nan")
        check(f"methanol rotor note names the {moment} moment",
              len(found) == 1 and ("coupled to the overall rotation" in found[0]) == (moment == "coupled"), notes)
    check("methanol rotor: coupled moment 6.5 % below the bond-axis one",
          abs(moments["coupled"] / moments["bond_axis"] - 1 + 0.065) < 0.001, moments)

# A misspelt subcommand: one line, exit 2, a suggestion; help states exit codes and defaults.
r = run("tabel", water)
check("unknown subcommand suggests table", r.returncode == 2 and r.stderr.strip().count("\n") == 0
      and "unknown subcommand 'tabel', did you mean 'table'?" in r.stderr, r.stderr)
r = run("--help")
check("top-level help lists the exit codes", "Exit status: 0 success; 1" in r.stdout, r.stdout[-300:])
for sub, default in [("table", "Default temperatures: 298.15 K, then 300 to 3000 K"),
                     ("modes", "Default temperatures: 50, 100, 200"),
                     ("report", "Default table temperatures: 298.15, 500"), ("inspect", "Temperatures: none")]:
    r = run(sub, "--help")
    check(f"{sub} --help states defaults, -q and exit codes",
          default in r.stdout and "-q, --quiet" in r.stdout and "Exit status" in r.stdout, r.stdout[-400:])

# An adsorbate's surface site joins the NASA-7 composition (once); a gas cannot have one.
with tempfile.TemporaryDirectory() as tmp:
    base = open(os.path.join(root, "tests", "data", "adsorbed-water.yaml"), encoding="utf-8").read()
    site = os.path.join(tmp, "site.yaml")
    open(site, "w", encoding="utf-8").write(base + "surface_site: Pt\n")
    r = run("fit", site, "--allow-missing-hf", "-q")
    first = next((line for line in r.stdout.splitlines() if line.rstrip().endswith("1") and "G" in line[40:50]
                  or line[44:45] == "S"), "")
    check("surface site in the NASA-7 composition", r.returncode == 0 and "PT  1" in first.upper(), r.stdout + r.stderr)
    gas = os.path.join(tmp, "gas-site.yaml")
    open(gas, "w", encoding="utf-8").write(open(water, encoding="utf-8").read() + "surface_site: Pt\n")
    r = run("table", gas)
    check("surface site on a gas is an input error", r.returncode == 2 and "'surface_site' is for an adsorbate" in r.stderr,
          r.stderr)

checks.finish()
