#!/usr/bin/env python3
"""Enthalpies of formation from electronic energies through the command line: a species
with `electronic_energy` and a method file reaches inspect, fit and the NASA-7 H298.

Usage: formation_cli_test.py VIBTHERM_EXE PROJECT_ROOT
"""
import json
import os
import sys
import tempfile

from harness import Checks

exe, root = sys.argv[1], sys.argv[2]
data = os.path.join(root, "tests", "data")
checks = Checks(exe)
run, check = checks.run, checks.check
energies = os.path.join(data, "water-energies.yaml")
bare = os.path.join(data, "water-energies-no-method.yaml")
method = os.path.join(data, "water-method.yaml")

# water-energies.yaml reproduces D0(H2O) = 219.36 kcal/mol (G2 test set, Curtiss et al.
# 1997, from memory); NIST-JANAF 4th ed. (Chase 1998): ΔfH°(298.15 K) = -241.826 kJ/mol.
r = run("inspect", energies, "--format", "json")
doc = json.loads(r.stdout) if r.returncode == 0 else {"species": [{}]}
s = doc["species"][0]
check("inspect: computed ΔfH° within 0.1 kJ/mol of JANAF",
      abs(s.get("enthalpy_of_formation", 0) + 241.826) < 0.1, r.stdout[-400:] + r.stderr)
check("inspect: the route is recorded", "atomization with method 'test-method'" in s.get("enthalpy_of_formation_route", ""))

# --method for a species without its own key gives the same value.
r2 = run("inspect", bare, "--method", method, "--format", "json")
s2 = json.loads(r2.stdout)["species"][0] if r2.returncode == 0 else {}
check("--method gives the same ΔfH° as the species key",
      s2.get("enthalpy_of_formation") == s.get("enthalpy_of_formation"), r2.stderr)
r3 = run("inspect", bare, "--format", "json")
check("without a method there is no ΔfH°", r3.returncode == 0 and
      "enthalpy_of_formation" not in json.loads(r3.stdout)["species"][0], r3.stderr)

# fit: the NASA-7 record's H(298.15)/R equals the computed ΔfH° (design.md section 6), and the
# route is in the record's comments.
with tempfile.TemporaryDirectory() as tmp:
    out = os.path.join(tmp, "w.json")
    r = run("fit", energies, "--form", "json", "-o", out)
    ok = r.returncode == 0
    fit = json.load(open(out)) if ok else {}
    sp = fit.get("species", [{}])[0] if ok else {}
    check("fit uses the computed ΔfH° without --allow-missing-hf",
          ok and abs(sp.get("enthalpy_of_formation_J_per_mol", 0) / 1e3 + 241.826) < 0.1, r.stderr)
    check("fit notes the route", ok and any("atomization with method" in n for n in sp.get("notes", [])),
          json.dumps(sp.get("notes")))

    # A given enthalpy of formation wins; the computed one is noted beside it.
    both = os.path.join(tmp, "both.yaml")
    open(both, "w").write(open(bare).read() + "enthalpy_of_formation: -241.0\n")
    r = run("inspect", both, "--method", method, "--format", "json")
    sb = json.loads(r.stdout)["species"][0] if r.returncode == 0 else {}
    check("a given ΔfH° wins over the computed one", sb.get("enthalpy_of_formation") == -241.0
          and sb.get("enthalpy_of_formation_route") == "given", r.stderr)
    check("the computed value is shown beside the given one",
          any("as given; computed -241.83" in n for n in sb.get("notes", [])), json.dumps(sb.get("notes")))

    # The method's scale factors feed the per-quantity scaling; the species file's own win.
    scaled = os.path.join(tmp, "scaled-method.yaml")
    open(scaled, "w").write(open(method).read() + "scale: {zpe: 0.9}\n")
    r = run("inspect", bare, "--method", scaled, "--format", "json")
    zpe = json.loads(r.stdout)["species"][0]["zpe"] if r.returncode == 0 else 0
    check("the method's ZPE scale factor is applied", abs(zpe - 0.9 * 53.8798) < 1e-3, r.stderr)

    missing = os.path.join(tmp, "missing.yaml")
    open(missing, "w").write(open(bare).read() + "method: nowhere.yaml\n")
    r = run("inspect", missing)
    check("a missing method file is one located error", r.returncode == 2 and "nowhere.yaml: error: cannot read file"
          in r.stderr, r.stderr)

# The reaction route feeds fit: three reactions for ethane (validation/formation; energies
# from experimental D0, see the files) give the mean as the NASA H298, the route in the notes.
vf = os.path.join(root, "validation", "formation")
sets = ",".join(os.path.join(vf, f"ethane-{n}.yaml") for n in ("hydrogenolysis", "combustion", "steam-reforming"))
with tempfile.TemporaryDirectory() as tmp:
    out = os.path.join(tmp, "e.json")
    r = run("fit", os.path.join(vf, "ethane.yaml"), "--formation-reactions", sets, "--form", "json", "-o", out)
    sp = json.load(open(out))["species"][0] if r.returncode == 0 else {}
    # Mean of the three reactions, printed by validation_reactions: -85.22 kJ/mol.
    check("fit uses the mean of the reaction set", abs(sp.get("enthalpy_of_formation_J_per_mol", 0) / 1e3 + 85.221)
          < 0.01, r.stderr)
    check("fit notes the reaction set", any("reaction set ethane-hydrogenolysis, ethane-combustion" in n
                                            for n in sp.get("notes", [])), json.dumps(sp.get("notes")))
    r = run("inspect", os.path.join(vf, "methane.yaml"), "--formation-reactions", sets, "--format", "json")
    s = json.loads(r.stdout)["species"][0] if r.returncode == 0 else {}
    check("a species that is not the unknown keeps its own value", s.get("enthalpy_of_formation") == -74.87
          and s.get("enthalpy_of_formation_route") == "given", r.stderr)
    r = run("inspect", os.path.join(vf, "ethane.yaml"), "--formation-reactions",
            os.path.join(root, "tests", "data", "water-reaction.yaml"))
    check("a reaction without 'unknown' is refused", r.returncode == 2 and "has no 'unknown'" in r.stderr, r.stderr)

checks.finish()
