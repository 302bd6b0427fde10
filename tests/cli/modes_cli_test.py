#!/usr/bin/env python3
"""`vibtherm modes` through the executable: pinned JSON keys (design.md section 5), the
JSON Schema, CSV and text views, the SVG picture parsed as XML, adsorbates, thresholds.

Usage: modes_cli_test.py VIBTHERM_EXE PROJECT_ROOT
"""
import csv
import io
import json
import os
import re
import subprocess
import sys
import tempfile
import xml.etree.ElementTree as ET

exe, root = sys.argv[1], sys.argv[2]
water = os.path.join(root, "examples", "fuel-additive", "water.yaml")
adsorbate = os.path.join(root, "tests", "data", "adsorbed-water.yaml")
schema_path = os.path.join(root, "schemas", "modes.schema.json")
results = []


def run(*args):
    return subprocess.run([exe, "modes", *args], capture_output=True, text=True)


def check(name, condition, detail=""):
    results.append(bool(condition))
    print(("ok    " if condition else "FAIL  ") + name + ("" if condition else f"  {detail}"))


# JSON: pinned keys, defaults, numbers.
r = run(water, adsorbate, "--format", "json")
doc = json.loads(r.stdout) if r.returncode == 0 else {"species": []}
check("json exits 0", r.returncode == 0, r.stderr)
check("json has two species", [s.get("name") for s in doc["species"]] == ["H2O", "H2O*"], doc["species"])
pinned_ok = bool(doc["species"])
for s in doc["species"]:
    pinned_ok &= "name" in s and isinstance(s.get("temperatures"), list) and s["temperatures"] != []
    for t in s.get("temperatures", []):
        pinned_ok &= "T" in t and all(k in t.get("dof", {}) for k in ("translation", "rotation", "vibration", "total"))
        pinned_ok &= all(all(k in m for k in ("wavenumber", "Cv_over_R", "state")) for m in t.get("modes", []))
        pinned_ok &= all(m["state"] in ("frozen", "partial", "active") for m in t.get("modes", []))
check("json pinned keys", pinned_ok)
if doc["species"]:
    w, a = doc["species"]
    check("default temperatures", [t["T"] for t in w["temperatures"]] == [50, 100, 200, 298.15, 500, 1000, 2000, 3000],
          [t["T"] for t in w["temperatures"]])
    t298 = w["temperatures"][3]["dof"]
    # Translation 3 + rotation 3 with water's vibrations nearly frozen (common practice);
    # 6.054 from the harmonic model (tests/modes_test.cpp).
    check("water F at 298.15 K", abs(t298["total"] - 6.054) < 0.001, t298)
    check("total = sum of motions", all(abs(t["dof"]["translation"] + t["dof"]["rotation"] + t["dof"]["vibration"]
                                            - t["dof"]["total"]) < 1e-12 for t in w["temperatures"]))
    # Adsorbate: no translation or rotation; classical limit 6N = 18.
    check("adsorbate has no translation or rotation",
          all(t["dof"]["translation"] == 0 and t["dof"]["rotation"] == 0 for t in a["temperatures"]))
    check("adsorbate classical limit 6N", a["classical_dof"]["total"] == 18, a.get("classical_dof"))
    check("adsorbate has 3N modes", all(len(t["modes"]) == 9 for t in a["temperatures"]))

# The output validates against its JSON Schema (when the validator is installed).
try:
    import jsonschema
except ImportError:
    jsonschema = None
    print("skip  schema validation: python3-jsonschema is not installed")
if jsonschema is not None:
    schema = json.load(open(schema_path, encoding="utf-8"))
    try:
        jsonschema.validate(doc, schema, cls=jsonschema.Draft202012Validator)
        check("json validates against schemas/modes.schema.json", True)
    except jsonschema.ValidationError as e:
        check("json validates against schemas/modes.schema.json", False, e.message)
    broken = json.loads(json.dumps(doc))
    broken["species"][0]["temperatures"][0]["modes"][0]["state"] = "warm"
    check("schema rejects an unknown state", not jsonschema.Draft202012Validator(schema).is_valid(broken))

# Thresholds move the states: with --active-above 0.5, water's bend (Cv/R 0.66 at 1000 K) is active.
r = run(water, "--temps", "1000", "--format", "json", "--frozen-below", "0.2", "--active-above", "0.5")
modes = json.loads(r.stdout)["species"][0]["temperatures"][0]["modes"] if r.returncode == 0 else []
# Modes are numbered by ascending wavenumber: 1595 (input #2), 3657 (#1), 3756 (#3).
check("thresholds change states", [m["state"] for m in modes] == ["active", "frozen", "frozen"], modes)
r = run(water, "--frozen-below", "0.8", "--active-above", "0.3")
check("crossed thresholds exit 2 with one line", r.returncode == 2 and len(r.stderr.strip().splitlines()) == 1
      and "frozen-below" in r.stderr, r.stderr)

# CSV: a header and one row per motion, electronic and mode at every temperature.
r = run(water, "--temps", "298.15,1000", "--format", "csv")
rows = list(csv.DictReader(io.StringIO(r.stdout))) if r.returncode == 0 else []
check("csv rows", len(rows) == 2 * (5 + 3), len(rows))
check("csv total", any(row["item"] == "total" and row["T_K"] == "298.15" for row in rows))

# Text: the grid and the summary lines.
r = run(water, "--temps", "298.15,3000")
check("text summary line", "at 298.15 K: F =  6.05 of 12 classical" in r.stdout, r.stdout)
check("text grid", "1595.0" in r.stdout and "#" in r.stdout, r.stdout)

def path_vertices(d):
    """Absolute vertices of a path 'Mx yl dx dy dx dy ...' (the form svg_plot writes)."""
    numbers = [float(v) for v in re.findall(r"-?(?:\d+\.?\d*|\.\d+)", d)]
    out = [(numbers[0], numbers[1])]
    for k in range(2, len(numbers) - 1, 2):
        out.append((out[-1][0] + numbers[k], out[-1][1] + numbers[k + 1]))
    return out


# SVG: parsed as XML, with the heat map, the F curve, axis labels and legends.
with tempfile.TemporaryDirectory() as tmp:
    svg = os.path.join(tmp, "modes.svg")
    out = os.path.join(tmp, "modes.json")
    r = run(water, adsorbate, "--temps", "100:3000:100", "--format", "json", "-o", out, "--svg", svg)
    check("svg run exits 0", r.returncode == 0, r.stderr)
    check("no temporary files left", sorted(os.listdir(tmp)) == ["modes.json", "modes.svg"], os.listdir(tmp))
    try:
        tree = ET.parse(svg)
        xml_ok = True
    except (ET.ParseError, OSError) as e:
        xml_ok, tree = False, None
        check("svg is well-formed XML", False, str(e))
    if xml_ok:
        check("svg is well-formed XML", True)
        ns = {"s": "http://www.w3.org/2000/svg"}
        svg_root = tree.getroot()
        check("svg root element", svg_root.tag == "{http://www.w3.org/2000/svg}svg")
        groups = svg_root.findall("s:g[@class='species']", ns)
        check("one group per species", [g.get("data-name") for g in groups] == ["H2O", "H2O*"])
        texts = " ".join(t.text or "" for t in svg_root.iter("{http://www.w3.org/2000/svg}text"))
        check("axis labels", "temperature T / K (logarithmic scale)" in texts and "F = 2 Cv/R" in texts)
        check("legends", "classical plateau" in texts and "Cv/R (1 = classical oscillator)" in texts)
        check("plateau marks", "6 translation + rotation" in texts and "12 all motions classical" in texts
              and "18 all motions classical" in texts)
        for g, n_modes in zip(groups, (3, 9)):
            heat = g.find("s:g[@class='heat-map']", ns)
            cells = heat.findall("s:rect[@fill]", ns) if heat is not None else []
            cells = [c for c in cells if c.get("fill") != "none"]
            # One rectangle per mode row (a gradient fill), not one per sample.
            check(f"heat map rows for {g.get('data-name')}", len(cells) == n_modes, len(cells))
            curve = g.find(".//s:path[@class='total']", ns)
            vertices = path_vertices(curve.get("d")) if curve is not None else []
            # Simplified within a fifth of a pixel, it still spans the plot box left to right.
            check(f"F curve for {g.get('data-name')}", len(vertices) >= 5 and vertices[0][0] == 176
                  and abs(vertices[-1][0] - 770) < 0.05
                  and all(b[0] > a[0] for a, b in zip(vertices, vertices[1:])), vertices[:3])

print(f"{sum(results)} of {len(results)} checks passed")
sys.exit(0 if all(results) else 1)
