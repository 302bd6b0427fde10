#!/usr/bin/env python3
"""`eval` through the executable on the quirk files of tests/data/nasa/: a file with one bad
record (exit 2 and no output; with --keep-going the good species, exit 1), duplicate names,
sanity warnings, the Cv, H and G columns, and the comparison mode --against.

Usage: eval_cli_test.py VIBTHERM_EXECUTABLE REPO_ROOT
"""
import json
import os
import sys
import tempfile

sys.path.insert(0, os.path.dirname(__file__))
from harness import Checks  # noqa: E402

R = 8.314462618  # J/(mol K), CODATA 2018


def main():
    if len(sys.argv) != 3:
        sys.exit(__doc__)
    exe, root = os.path.abspath(sys.argv[1]), sys.argv[2]
    data = os.path.join(root, "tests", "data")
    mix = os.path.join(data, "nasa_quirk_mix.dat")
    c = Checks(exe)
    with tempfile.TemporaryDirectory() as tmp:
        out = os.path.join(tmp, "out.json")
        r = c.run("eval", mix, "--format", "json", "-o", out)
        c.check("one bad record: exit 2", r.returncode == 2, r.stderr)
        c.check("one bad record: nothing written", not os.path.exists(out))
        c.check("the bad record is named with FILE:LINE:COL", "nasa_quirk_mix.dat:19:21: error: species 'BAD-O2'"
                in r.stderr, r.stderr)
        r = c.run("eval", mix, "--format", "json", "-o", out, "--keep-going", "--temps", "300,1000")
        c.check("--keep-going: exit 1", r.returncode == 1, r.stderr)
        names = [s["name"] for s in json.load(open(out))["species"]] if os.path.exists(out) else []
        c.check("--keep-going: every good species tabulated", names == ["O2-A", "O2-B", "AR", "O2-C", "O2-D"], names)
        c.check("--keep-going: the bad one named", "species 'BAD-O2'" in r.stderr, r.stderr)
        rows = json.load(open(out))["species"][0]["rows"]
        c.check("Cv = Cp - R for a gas (ideal gas, common practice)",
                all(abs(x["Cv"] - (x["Cp"] - R)) < 1e-9 for x in rows), rows)
        c.check("absolute H and G = H - TS",
                all(abs(x["G"] - (x["H"] - x["T"] * x["S"] / 1e3)) < 1e-9 for x in rows), rows)
        r = c.run("eval", mix, "--keep-going", "--format", "csv", "--temps", "1000")
        c.check("CSV has Cv, H and G", r.stdout.splitlines()[0].count(",H_kJ_per_mol,G_kJ_per_mol") == 1 and
                r.stdout.splitlines()[1].split(",")[3] != "", r.stdout)

        # Duplicates: one warning with both lines, the first record wins.
        text = open(os.path.join(data, "nasa", "keyword_therm.dat")).read()
        lines = text.splitlines()
        start = next(i for i, l in enumerate(lines) if l.startswith("O2 "))
        dup_record = lines[start:start + 4]
        dup_record[0] = dup_record[0][:45] + "   300.000" + dup_record[0][55:]
        dup = os.path.join(tmp, "dup.dat")
        open(dup, "w").write("\n".join(lines[:-1] + dup_record + ["END"]) + "\n")
        r = c.run("eval", dup, "--species", "O2", "--format", "json", "--temps", "250")
        c.check("duplicate: one warning with both line numbers",
                r.stderr.count("defined more than once") == 1 and f"line {start + 1}, again at line" in r.stderr,
                r.stderr)
        c.check("duplicate: --species returns the first record",
                r.returncode == 0 and "outside" not in r.stderr, r.stderr)

        # Sanity warning: Cp below 5/2 R.
        low = open(os.path.join(data, "nasa", "fifth_element_field.dat")).read().replace(
            " 2.50000000E+00 0.00000000E+00", " 2.00000000E+00 0.00000000E+00")
        lowf = os.path.join(tmp, "low.dat")
        open(lowf, "w").write(low)
        r = c.run("eval", lowf, "--species", "AR")
        c.check("sanity: Cp below 5/2 R warned", "below 5/2 R" in r.stderr and r.returncode == 0, r.stderr)

        # Comparison mode: NASA file against itself, against the other layout, against species files.
        n9a = os.path.join(data, "nasa", "nasa9_published.dat")
        n9b = os.path.join(data, "nasa", "nasa9_ours.dat")
        r = c.run("eval", n9a, "--against", n9b, "--format", "json")
        cmp = json.loads(r.stdout)["species"] if r.returncode == 0 else []
        c.check("--against: published vs our layout, zero differences",
                len(cmp) == 1 and all(cmp[0][k]["difference"] == 0 for k in ("Cp", "H", "S")), r.stdout + r.stderr)
        c.check("--against: the common range every 10 K", cmp and cmp[0]["T_min"] == 200 and cmp[0]["T_max"] == 6000
                and cmp[0]["points"] == 581, cmp)
        fit = os.path.join(tmp, "water.dat")
        water = os.path.join(root, "examples", "fuel-additive", "water.yaml")
        r = c.run("fit", water, "-o", fit)
        r = c.run("eval", fit, "--against", water, "--format", "json")
        cmp = json.loads(r.stdout)["species"] if r.returncode == 0 else []
        c.check("--against species file: the fit's own error, small (< 0.5 % Cp, 0.1 kJ/mol, 0.1 J/(mol K))",
                len(cmp) == 1 and cmp[0]["H_absolute"] and abs(cmp[0]["Cp"]["difference"]) < 0.005 * 60 and
                abs(cmp[0]["H"]["difference"]) < 0.1 and abs(cmp[0]["S"]["difference"]) < 0.1, r.stdout + r.stderr)
        r = c.run("eval", fit, "--against", water)
        c.check("--against text names both sources", r.returncode == 0 and "Largest differences" in r.stdout,
                r.stdout + r.stderr)
    c.finish()


if __name__ == "__main__":
    main()
