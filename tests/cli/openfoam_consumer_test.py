#!/usr/bin/env python3
"""A real consumer of the NASA-7 file `fit` writes: OpenFOAM's converter for kinetics input
files (chemkinToFoam, Debian package `openfoam`, installed by scripts/install-deps) reads the
demo species' file plus a small reactions file, and the coefficients it writes equal ours.
Also: bare THERMO (no ALL) before the default-temperature line is what it rejects, which is
why `fit` writes THERMO ALL. Exits 77 (ctest: skipped) only when chemkinToFoam is missing.

Second check: the NASA-9 output of `fit --form nasa9` read back by `eval` equals an
independent evaluator written here from NASA/TP-2002-211556 (eqs. for Cp/R, H/RT, S/R).

Usage: openfoam_consumer_test.py VIBTHERM_EXECUTABLE REPO_ROOT
"""
import glob
import json
import math
import os
import re
import shutil
import subprocess
import sys
import tempfile

sys.path.insert(0, os.path.dirname(__file__))
from harness import Checks  # noqa: E402

R = 8.314462618  # J/(mol K), CODATA 2018 (N_A k_B exact)

REACTIONS = """ELEMENTS
C H O
END
SPECIES
{species}
END
REACTIONS
CH3OH+2OH<=>CH2O+2H2O   1.0E+10  0.0  0.0
END
"""


def foam_env():
    env = dict(os.environ)
    for root in ("/usr/share/openfoam", *sorted(glob.glob("/usr/lib/openfoam/openfoam*"))):
        if os.path.exists(os.path.join(root, "etc", "controlDict")):
            env["WM_PROJECT_DIR"] = root
            break
    return env


def our_records(text):
    """name -> (high a1..a7, low a1..a7) from the fixed E15.8 fields (independent of our reader)."""
    lines = text.splitlines()
    out = {}
    for i, line in enumerate(lines):
        if len(line) == 80 and line[79] == "1" and not line.startswith("!"):
            body = "".join(lines[i + k][:75] for k in (1, 2, 3))
            nums = [float(body[15 * j:15 * j + 15]) for j in range(14)]
            out[line[:18].strip()] = (nums[:7], nums[7:])
    return out


def foam_records(text):
    out = {}
    for m in re.finditer(r"^(\S+)\s*\{.*?highCpCoeffs\s*\(([^)]*)\);\s*lowCpCoeffs\s*\(([^)]*)\);", text,
                         re.S | re.M):
        out[m.group(1)] = ([float(x) for x in m.group(2).split()], [float(x) for x in m.group(3).split()])
    return out


def nasa9_eval(a, b1, b2, T):
    """NASA/TP-2002-211556: Cp/R, H/RT, S/R of one interval."""
    cp = a[0] / T**2 + a[1] / T + a[2] + a[3] * T + a[4] * T**2 + a[5] * T**3 + a[6] * T**4
    h = (-a[0] / T**2 + a[1] * math.log(T) / T + a[2] + a[3] * T / 2 + a[4] * T**2 / 3 + a[5] * T**3 / 4
         + a[6] * T**4 / 5 + b1 / T)
    s = (-a[0] / (2 * T**2) - a[1] / T + a[2] * math.log(T) + a[3] * T + a[4] * T**2 / 2 + a[5] * T**3 / 3
         + a[6] * T**4 / 4 + b2)
    return cp, h, s


def nasa9_records(text):
    """Independent reader of our NASA-9 layout: name -> list of (T_low, T_high, a[7], b1, b2)."""
    lines = [l for l in text.splitlines() if l.strip() and not l.startswith("!")]
    out = {}
    i = 0
    while i < len(lines):
        l = lines[i]
        if l.strip().lower() == "thermo":
            i += 2
            continue
        if l.startswith("END"):
            i += 1
            continue
        name = l[:18].strip()
        n = int(lines[i + 1][:2])
        ranges = []
        for r in range(n):
            t = lines[i + 2 + 3 * r]
            c1 = lines[i + 3 + 3 * r]
            c2 = lines[i + 4 + 3 * r]
            lo, hi = float(t[0:11]), float(t[11:22])
            a = [float(c1[16 * k:16 * k + 16].replace("D", "E")) for k in range(5)]
            a += [float(c2[0:16].replace("D", "E")), float(c2[16:32].replace("D", "E"))]
            ranges.append((lo, hi, a, float(c2[48:64].replace("D", "E")), float(c2[64:80].replace("D", "E"))))
        out[name] = ranges
        i += 2 + 3 * n
    return out


def main():
    if len(sys.argv) != 3:
        sys.exit(__doc__)
    exe, root = os.path.abspath(sys.argv[1]), sys.argv[2]
    demo = sorted(glob.glob(os.path.join(root, "examples", "fuel-additive", "*.yaml")) +
                  glob.glob(os.path.join(root, "examples", "fuel-additive", "*.xyz")))
    c = Checks(exe)
    with tempfile.TemporaryDirectory() as tmp:
        # NASA-9 read back by eval and by the evaluator above.
        n9 = os.path.join(tmp, "therm9.dat")
        r = c.run("fit", *demo, "--form", "nasa9", "-o", n9)
        c.check("fit --form nasa9", r.returncode == 0, r.stderr)
        records = nasa9_records(open(n9).read())
        temps = [250.0, 298.15, 700.0, 1000.0, 1500.0, 2500.0]
        r = c.run("eval", n9, "--temps", ",".join(str(t) for t in temps), "--format", "json")
        c.check("eval reads the NASA-9 output", r.returncode == 0, r.stderr)
        evaluated = {s["name"]: s["rows"] for s in json.loads(r.stdout)["species"]}
        c.check("every NASA-9 species read back", set(evaluated) == set(records), f"{set(evaluated)} {set(records)}")
        worst = 0.0
        for name, ranges in records.items():
            for row in evaluated.get(name, []):
                T = row["T"]
                lo, hi, a, b1, b2 = next(x for x in ranges if T <= x[1] or x is ranges[-1])
                cp, h, s = nasa9_eval(a, b1, b2, T)
                worst = max(worst, abs(cp * R - row["Cp"]) / abs(cp * R), abs(s * R - row["S"]) / abs(s * R),
                            abs(h * R * T / 1e3 - row["H"]) / max(1.0, abs(h * R * T / 1e3)))
        c.check(f"NASA-9: eval equals the independent evaluator (worst relative {worst:.1e})", worst < 1e-9)

        tool = shutil.which("chemkinToFoam")
        if not tool:
            print("chemkinToFoam not found (Debian package openfoam): consumer check skipped")
            sys.exit(1 if False in c.results else 77)
        n7 = os.path.join(tmp, "therm.dat")
        r = c.run("fit", *demo, "-o", n7)
        c.check("fit (NASA-7)", r.returncode == 0, r.stderr)
        ours = our_records(open(n7).read())
        names = sorted(ours)
        with open(os.path.join(tmp, "reactions.inp"), "w") as f:
            f.write(REACTIONS.format(species=" ".join(names)))
        # The converter needs transport data per species: Sutherland coefficients, here
        # placeholders of the right form (this check is about thermodynamic records only).
        with open(os.path.join(tmp, "transport"), "w") as f:
            for n in names:
                f.write(f"{n}\n{{\n    transport\n    {{\n        As 1.67212e-06;\n        Ts 170.672;\n    }}\n}}\n")

        def convert(thermo, out):
            return subprocess.run([tool, "reactions.inp", thermo, "transport", out + ".reactions", out + ".thermo"],
                                  cwd=tmp, env=foam_env(), capture_output=True, text=True, timeout=300)

        r = convert("therm.dat", "foam")
        c.check("chemkinToFoam accepts the file fit writes", r.returncode == 0, (r.stdout + r.stderr)[-2000:])
        if r.returncode == 0:
            foam = foam_records(open(os.path.join(tmp, "foam.thermo")).read())
            c.check("it converts every species", set(foam) == set(ours), f"{sorted(foam)} vs {names}")
            diff = [n for n in names if n in foam and foam[n] != ours[n]]
            c.check("its coefficients equal ours (all 14 of every species)", not diff, f"differ: {diff}")
        bare = open(n7).read().replace("THERMO ALL\n", "THERMO\n", 1)
        open(os.path.join(tmp, "bare.dat"), "w").write(bare)
        r = convert("bare.dat", "bare")
        c.check("with bare THERMO it refuses the default-temperature line (why fit writes THERMO ALL)",
                r.returncode != 0, r.stdout[-500:])
    c.finish()


if __name__ == "__main__":
    main()
