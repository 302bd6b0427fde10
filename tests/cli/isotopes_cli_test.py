"""Isotope labels reach every writer: inspect (text, CSV, JSON), report, fit JSON and the
NASA-7/9 records show heavy water as D2O with 20.03 g/mol.

D 2.014101778 u (CODATA 2018 / AME2020, from memory) and the standard atomic weights
H 1.008, O 15.999 (IUPAC/CIAAW conventional values, common practice):
D2O 2 x 2.014101778 + 15.999 = 20.0272 g/mol, H2O 18.015 g/mol.

Usage: isotopes_cli_test.py VIBTHERM_EXE PROJECT_ROOT
"""
import json
import os
import pathlib
import re
import sys
import tempfile

from harness import Checks

D2O_G_PER_MOL = 2 * 2.014101778 + 15.999
H2O_G_PER_MOL = 2 * 1.008 + 15.999


def formula_fields(record2):
    """Record 2, columns 11-50 of a NASA-9 record: five (symbol A2, count F6.2) fields."""
    out = []
    for k in range(5):
        field = record2[10 + 8 * k:18 + 8 * k]
        if len(field) == 8:
            out.append((field[:2].strip(), float(field[2:])))
    return out


def main():
    exe, root = sys.argv[1], pathlib.Path(sys.argv[2])
    data = root / "tests" / "data"
    labelled = str(data / "heavy-water.yaml")             # atoms written as D
    by_key = str(data / "heavy-water-from-qcschema.yaml")  # isotopes: {2: D, 3: D}
    natural = str(data / "water.yaml")
    c = Checks(exe)

    r = c.run("inspect", labelled, by_key, natural, "--format", "json")
    species = json.loads(r.stdout)["species"] if r.returncode == 0 else []
    c.check("inspect --format json exits 0", r.returncode == 0, r.stderr)
    by_name = {s["name"]: s for s in species}
    for name in ("heavy-water", "heavy-water-model"):
        s = by_name.get(name, {})
        c.check(f"inspect JSON {name}: formula D2O", s.get("formula") == "D2O", s.get("formula"))
        c.check(f"inspect JSON {name}: molar_mass 20.03 g/mol",
                abs(s.get("molar_mass", 0) - D2O_G_PER_MOL) < 1e-4, s.get("molar_mass"))
    w = by_name.get("water", {})
    c.check("inspect JSON natural water: H2O, 18.015 g/mol",
            w.get("formula") == "H2O" and abs(w.get("molar_mass", 0) - H2O_G_PER_MOL) < 1e-6, w)

    r = c.run("inspect", labelled)
    c.check("inspect text: formula D2O", re.search(r"^\s+formula\s+D2O$", r.stdout, re.M), r.stdout)
    c.check("inspect text: 20.0272 g/mol, isotope masses said",
            "20.0272 g/mol (isotope masses for labelled atoms" in r.stdout, r.stdout)
    r = c.run("inspect", labelled, "--format", "csv")
    row = r.stdout.splitlines()[1].split(",") if r.returncode == 0 else []
    c.check("inspect CSV: D2O and 20.027", len(row) > 5 and row[1] == "D2O" and
            abs(float(row[5]) - D2O_G_PER_MOL) < 1e-3, r.stdout)

    with tempfile.TemporaryDirectory() as tmp:
        page = os.path.join(tmp, "report.html")
        r = c.run("report", labelled, "-o", page)
        c.check("report exits 0", r.returncode == 0, r.stderr)
        html = open(page, encoding="utf-8").read() if r.returncode == 0 else ""
        c.check("report: formula D2O in the index and the facts", html.count(">D2O<") >= 2, html[:400])
        c.check("report: molar mass 20.0272 g/mol", "20.0272 g/mol" in html, "")
        c.check("report: no natural-abundance formula or mass", "H2O" not in html and "18.015" not in html, "")

        fit_json = os.path.join(tmp, "fit.json")
        r = c.run("fit", labelled, "--form", "json", "-o", fit_json)
        fit = json.load(open(fit_json))["species"][0] if r.returncode == 0 else {}
        c.check("fit JSON: composition D 2, O 1", fit.get("composition") == {"D": 2, "O": 1}, fit.get("composition"))
        c.check("fit JSON: molar_mass_g_per_mol 20.03",
                abs(fit.get("molar_mass_g_per_mol", 0) - D2O_G_PER_MOL) < 1e-4, fit.get("molar_mass_g_per_mol"))

        nasa7 = os.path.join(tmp, "d2o.dat")
        r = c.run("fit", labelled, "-o", nasa7)
        first = next((l for l in open(nasa7) if len(l.rstrip()) == 80 and l[79] == "1"), "") if r.returncode == 0 else ""
        # Columns 25-44: element symbol (2) and count (3) pairs (NASA TM-4513 layout).
        c.check("NASA-7 record: elements D 2 O 1", [(first[24 + 5 * k:26 + 5 * k].strip(), first[26 + 5 * k:29 + 5 * k].strip()) for k in range(2)]
                == [("D", "2"), ("O", "1")], first)

        nasa9 = os.path.join(tmp, "d2o9.dat")
        r = c.run("fit", labelled, "--form", "nasa9", "-o", nasa9)
        lines = open(nasa9).read().splitlines() if r.returncode == 0 else []
        record2 = next((l for l in lines if re.match(r"^ ?\d ", l)), "")
        # Record 2, columns 53-65: molecular weight (NASA TP-2002-211556 layout).
        weight = float(record2[52:65]) if len(record2) >= 65 else 0.0
        c.check("NASA-9 record: molecular weight 20.0272", abs(weight - D2O_G_PER_MOL) < 1e-4, record2)
        c.check("NASA-9 record: formula D 2 O 1", formula_fields(record2)[:2] == [("D", 2.0), ("O", 1.0)], record2)
    c.finish()


if __name__ == "__main__":
    main()
