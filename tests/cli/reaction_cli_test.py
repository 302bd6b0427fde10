#!/usr/bin/env python3
"""The `reaction` subcommand: formats agree, identities hold through the command line,
the reverse reaction gives reciprocal K, and several reactions for one unknown give each
value, their mean and spread.

Usage: reaction_cli_test.py VIBTHERM_EXE PROJECT_ROOT
"""
import csv
import io
import json
import math
import os
import sys
import tempfile

from harness import Checks

exe, root = sys.argv[1], os.path.abspath(sys.argv[2])
data = os.path.join(root, "tests", "data")
checks = Checks(exe)
run, check = checks.run, checks.check
R = 8.314462618  # J/(mol K), CODATA 2018 (N_A k_B)
forward = os.path.join(data, "water-reaction.yaml")
temps = "298.15,1000,1500,2000"

r = run("reaction", forward, "--temps", temps, "--format", "json")
check("reaction json runs", r.returncode == 0, r.stderr)
doc = json.loads(r.stdout) if r.returncode == 0 else {"reactions": [{"rows": []}], "units": {}}
rx = doc["reactions"][0]
check("standard state stated", doc["units"].get("standard_state") == "p° = 1 bar", doc["units"])
check("equation and basis", rx.get("equation") == "water = H2 + 0.5 O2"
      and rx.get("enthalpy_basis") == "enthalpies of formation", rx.get("equation"))
ok = True
for row in rx["rows"]:
    T = row["T"]
    # Textbook identities: ΔG = ΔH − TΔS, ln Kp = −ΔG°/RT, Kc = Kp (p°/(R T c°))^Δn.
    ok &= math.isclose(row["delta_G"], row["delta_H"] - T * row["delta_S"] / 1e3, rel_tol=1e-12, abs_tol=1e-9)
    ok &= math.isclose(row["ln_Kp"], -row["delta_G"] * 1e3 / (R * T), rel_tol=1e-9)
    ok &= math.isclose(row["Kc"], row["Kp"] * (1e5 / (R * T * 1000.0)) ** 0.5, rel_tol=1e-9)
check("identities through the command line", ok and len(rx["rows"]) == 4)

with tempfile.TemporaryDirectory() as tmp:
    reverse = os.path.join(tmp, "reverse.yaml")
    open(reverse, "w").write("name: reverse\nspecies:\n" + "".join(
        f"  - {{file: {os.path.join(data, f)}, coefficient: {c}}}\n"
        for f, c in (("water.yaml", 1), ("hydrogen.yaml", -1), ("oxygen.yaml", -0.5))))
    rr = run("reaction", reverse, "--temps", temps, "--format", "json")
    back = json.loads(rr.stdout)["reactions"][0]["rows"] if rr.returncode == 0 else []
    check("reverse: opposite ΔG, reciprocal K to 1e-12",
          len(back) == 4 and all(math.isclose(a["delta_G"], -b["delta_G"], rel_tol=1e-12)
                                 and math.isclose(a["Kp"] * b["Kp"], 1.0, rel_tol=1e-12)
                                 for a, b in zip(rx["rows"], back)), rr.stderr)

    # CSV and text carry the same numbers.
    rc = run("reaction", forward, "--temps", temps, "--format", "csv")
    rows = list(csv.DictReader(io.StringIO(rc.stdout)))
    check("csv rows match json", len(rows) == 4 and all(
        math.isclose(float(c["Kp"]), j["Kp"], rel_tol=1e-9) for c, j in zip(rows, rx["rows"])), rc.stdout[:300])
    rt = run("reaction", forward, "--temps", temps, "--fit-lnk")
    check("text output with the ln K fit", rt.returncode == 0 and "ln Kp = ln A + n ln T - E/(RT)" in rt.stdout
          and "water = H2 + 0.5 O2" in rt.stdout, rt.stderr)

    # Standard state 1 atm: Kp changes by (p_bar/p_atm)^Δn, Kc not at all (thermodynamic identity).
    ra = run("reaction", forward, "--temps", temps, "--format", "json", "--standard-state", "atm")
    atm = json.loads(ra.stdout)["reactions"][0]["rows"] if ra.returncode == 0 else []
    check("1 atm: Kp scales by (1 bar/1 atm)^0.5, Kc unchanged", len(atm) == 4 and all(
        math.isclose(a["Kp"], b["Kp"] * (1e5 / 101325.0) ** 0.5, rel_tol=1e-9)
        and math.isclose(a["Kc"], b["Kc"], rel_tol=1e-9) for a, b in zip(atm, rx["rows"])), ra.stderr)

    # Two reactions solving for the same unknown: each value, the mean and the spread.
    def species(name, text):
        path = os.path.join(tmp, name)
        open(path, "w").write(text)
        return path
    water_e = open(os.path.join(data, "water-energies-no-method.yaml")).read()
    species("w.yaml", water_e)
    # H2 and O2 with arbitrary energies: the identity below holds for any values.
    species("h2.yaml", open(os.path.join(data, "hydrogen.yaml")).read() + "electronic_energy: -1.17\n")
    species("o2.yaml", open(os.path.join(data, "oxygen.yaml")).read() + "electronic_energy: -150.3\n")
    def reaction(name, coefficients):
        return species(name, f"name: {name}\nspecies:\n" + "".join(
            f"  - {{file: {f}, coefficient: {c}}}\n" for f, c in coefficients) + "unknown: w.yaml\n")
    one = reaction("one.yaml", (("w.yaml", -1), ("h2.yaml", 1), ("o2.yaml", 0.5)))
    two = reaction("two.yaml", (("w.yaml", -2), ("h2.yaml", 2), ("o2.yaml", 1)))
    ru = run("reaction", one, two, "--format", "json", "--temps", "298.15")
    check("unknown: runs", ru.returncode == 0, ru.stderr)
    if ru.returncode == 0:
        u = json.loads(ru.stdout)
        s = u["enthalpies_of_formation"][0]
        dH = u["reactions"][0]["unknown"]["delta_H_298"]
        check("unknown: ΔfH°(H2O) = −ΔrH° (elements at 0)", math.isclose(s["values"][0], -dH, rel_tol=1e-12))
        check("unknown: each value, mean and spread", len(s["values"]) == 2 and
              math.isclose(s["values"][0], s["values"][1], rel_tol=1e-12) and s["standard_deviation"] < 1e-9
              and s["reactions"] == ["one.yaml", "two.yaml"], s)

    out = os.path.join(tmp, "out.json")
    r = run("reaction", forward, os.path.join(root, "tests", "bad", "reaction_unbalanced.yaml"), "-o", out)
    check("an unbalanced reaction in the batch writes nothing", r.returncode == 2 and not os.path.exists(out),
          r.stderr)

checks.finish()
