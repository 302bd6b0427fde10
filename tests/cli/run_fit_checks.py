#!/usr/bin/env python3
"""`fit` and `eval` through the executable: round trip of every example species against
`table`, fixed columns, JSON provenance, missing enthalpy of formation, malformed files.

Usage: run_fit_checks.py VIBTHERM_EXE PROJECT_ROOT
"""
import hashlib
import json
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

temps = "200,298.15,300:3000:100"
table = {s["name"]: s["rows"] for s in
         json.loads(run("table", examples, "--temps", temps, "--format", "json").stdout)["species"]}

with tempfile.TemporaryDirectory() as tmp:
    for form, extra in (("nasa7", []), ("nasa9", ["--range", "200:1000:3000"])):
        out = os.path.join(tmp, f"all.{form}")
        r = run("fit", examples, "--form", form, "-o", out, *extra)
        check(f"fit {form} of the examples", r.returncode == 0, r.stderr)
        lines = open(out).read().splitlines()
        check(f"{form}: every line at most 80 columns", all(len(line) <= 80 for line in lines))
        if form == "nasa7":
            records = [line for line in lines if line.endswith("1") and len(line) == 80]
            check("nasa7: one record per example, in input (sorted) order",
                  [line[:18].strip() for line in records] == list(table.keys()), str(records))
            check("nasa7: T_low, T_high, T_mid columns",
                  all(float(line[45:55]) == 200 and float(line[55:65]) == 3000 and float(line[65:73]) == 1000
                      for line in records))
        r = run("eval", out, "--temps", temps, "--format", "json")
        check(f"eval {form}", r.returncode == 0, r.stderr)
        evaluated = {s["name"]: s["rows"] for s in json.loads(r.stdout)["species"]}
        worst_cp = worst_h = worst_s = 0.0
        for name, rows in table.items():
            for a, b in zip(rows, evaluated[name]):
                worst_cp = max(worst_cp, abs(a["Cp"] - b["Cp"]) / a["Cp"])
                worst_h = max(worst_h, abs(a["H_minus_H298"] - b["H_minus_H298"]))
                worst_s = max(worst_s, abs(a["S"] - b["S"]))
        print(f"      {form}: worst |dCp|/Cp {100 * worst_cp:.3f} %, |dH| {worst_h:.4f} kJ/mol, |dS| {worst_s:.4f} J/(mol K)")
        # Issue 3 acceptance: |dCp|/Cp < 0.5 %, |dH| < 0.1 kJ/mol over the whole range.
        check(f"{form}: round trip against table", worst_cp < 0.005 and worst_h < 0.1 and worst_s < 0.1)
        check(f"{form}: eval table has the table's pinned keys",
              all(k in evaluated["H2O"][0] for k in ("T", "Cp", "S", "H_minus_H298")))

    # JSON form: provenance checksum equals the file's SHA-256.
    r = run("fit", water, "--form", "json", "--range", "200:auto:3000")
    doc = json.loads(r.stdout) if r.returncode == 0 else {}
    sp = doc.get("species", [{}])[0]
    digest = hashlib.sha256(open(water, "rb").read()).hexdigest()
    check("json provenance sha256", sp.get("provenance", {}).get("input_sha256") == digest, r.stderr)
    check("json searched breakpoint reported", "searched_breakpoint" in sp and "breakpoint searched" in r.stderr)
    check("json per-range errors", all("max_Cp_relative" in rg["errors"] for rg in sp.get("ranges", [])))

    # Missing enthalpy of formation: error that says how, or H(298.15) = 0 with a note.
    nohf = os.path.join(tmp, "nohf.yaml")
    text = "".join(line for line in open(water) if not line.startswith("enthalpy_of_formation"))
    open(nohf, "w").write(text.replace("name: H2O", "name: H2O-noHf"))
    out = os.path.join(tmp, "nohf.dat")
    r = run("fit", nohf, "-o", out)
    check("missing hf exits 2, one line, names the key",
          r.returncode == 2 and len(r.stderr.strip().splitlines()) == 1 and "enthalpy_of_formation" in r.stderr
          and "--allow-missing-hf" in r.stderr and not os.path.exists(out), r.stderr)
    r = run("fit", nohf, "--allow-missing-hf", "-o", out)
    check("--allow-missing-hf writes a noted record",
          r.returncode == 0 and "! enthalpy of formation missing" in open(out).read(), r.stderr)
    r = run("fit", nohf, water, "--keep-going", "-o", out)
    check("keep-going: exit 1, good species written",
          r.returncode == 1 and "H2O " in open(out).read() and "H2O-noHf" not in open(out).read(), r.stderr)

    # A name too long for NASA-7 is an error, never truncated.
    long_name = os.path.join(tmp, "long.yaml")
    open(long_name, "w").write(open(water).read().replace("name: H2O", "name: water-with-a-long-name"))
    r = run("fit", long_name)
    check("long name is an input error", r.returncode == 2 and "18" in r.stderr, r.stderr)

    # eval: malformed file gives FILE:LINE:COL, unknown species exits 2.
    bad = os.path.join(tmp, "bad.dat")
    good = run("fit", water).stdout.splitlines()
    good[5] = good[5][:20] + "x" + good[5][21:]
    open(bad, "w").write("\n".join(good) + "\n")
    r = run("eval", bad)
    check("malformed NASA-7 names its line", r.returncode == 2 and f"{bad}:6:" in r.stderr, r.stderr)
    r = run("eval", out, "--species", "nothere")
    check("unknown --species exits 2", r.returncode == 2 and "not in the file" in r.stderr, r.stderr)
    r = run("eval", out, "--temps", "5000")
    check("extrapolation warns", r.returncode == 0 and "outside the polynomial's range" in r.stderr, r.stderr)

checks.finish()
