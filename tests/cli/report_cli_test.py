#!/usr/bin/env python3
"""Checks `vibtherm report` on the demo species: the page parses as XML, has one section
per species, the caution, inline SVG pictures that parse on their own, and nothing
external (no URLs, no src= references, no scripts).

Usage: report_cli_test.py VIBTHERM_EXE PROJECT_ROOT
"""
import json
import os
import re
import subprocess
import sys
import tempfile
import xml.etree.ElementTree as ET

exe, root = sys.argv[1], sys.argv[2]
examples = os.path.join(root, "examples", "fuel-additive")
failures = []


def check(condition, message):
    if not condition:
        failures.append(message)


def run(args, cwd):
    return subprocess.run([exe] + args, cwd=cwd, capture_output=True, text=True)


with tempfile.TemporaryDirectory() as tmp:
    out = os.path.join(tmp, "tmp.html")
    result = run(["report", examples, "-o", out], root)
    check(result.returncode == 0, f"report exited {result.returncode}: {result.stderr}")
    text = open(out, encoding="utf-8").read()
    page = ET.fromstring(text)  # raises if the markup is not well formed
    sections = [e for e in page.iter("section") if e.get("class") == "species"]
    demo_sections = sections
    species_files = [f for f in os.listdir(examples) if f.endswith((".yaml", ".xyz"))]
    check(len(sections) == len(species_files),
          f"{len(sections)} species sections for {len(species_files)} species files")
    names = [s.find("h2").text for s in sections]
    check(len(set(names)) == len(names), f"duplicate section headings: {names}")
    caution = " ".join("".join(e.itertext()) for e in page.iter("div") if e.get("class") == "caution")
    check("Verify the values against evaluated data" in caution, "caution text missing")
    check("licensed engineering practice" in caution, "caution does not defer to engineering practice")
    for section in sections:
        svgs = list(section.iter("svg"))
        check(len(svgs) == 4, f"{section.get('id')}: {len(svgs)} pictures, expected Cp, S, H and modes")
        for svg in svgs:
            # Each picture stands alone as XML too.
            ET.fromstring(ET.tostring(svg))
        check(section.find(".//pre") is not None, f"{section.get('id')}: no NASA-7 record")
    index_rows = page.findall(".//table[@id='index']/tbody/tr")
    check(len(index_rows) == len(sections), "the index table needs one row per species")
    links = sorted(r.find("td/a").get("href") for r in index_rows)
    check(links == sorted("#" + s.get("id") for s in sections), f"index links {links}")
    for e in page.iter():
        for key, value in e.attrib.items():
            check(not re.match(r"\s*(https?:|//|file:)", value), f"external reference {key}={value}")
            check(key != "src", f"src attribute on <{e.tag}>")
            check(not (key == "href" and not value.startswith("#")), f"non-local link {value}")
    check(not re.search(r"https?:", text), "a URL appears in the page")
    scripts = list(page.iter("script"))
    check(len(scripts) == 1 and scripts[0].get("src") is None, "expected one inline script (index sorting)")
    check("<link" not in text, "a <link> element appears")

    # Reproducible: the same input gives the same bytes (no date in the page).
    again = os.path.join(tmp, "again.html")
    run(["report", examples, "-o", again], root)
    check(open(again, encoding="utf-8").read() == text, "two runs differ")

    # A species without enthalpy of formation: an input error by default (exit 2, no file),
    # reported with its NASA part marked as not fitted under --allow-missing-hf.
    species = open(os.path.join(examples, "water.yaml"), encoding="utf-8").read()
    no_hf = re.sub(r"(?m)^enthalpy_of_formation:.*\n", "", species).replace("name: ", "name: x", 1)
    check(no_hf != species, "could not remove the enthalpy of formation from water.yaml")
    path = os.path.join(tmp, "no-hf.yaml")
    open(path, "w", encoding="utf-8").write(no_hf)
    missing = os.path.join(tmp, "missing.html")
    result = run(["report", path, os.path.join(examples, "methane.yaml"), "-o", missing], root)
    check(result.returncode == 2, f"missing ΔfH without the flag: exit {result.returncode}")
    check(not os.path.exists(missing), "a file was written despite the error")
    result = run(["report", path, os.path.join(examples, "methane.yaml"), "--allow-missing-hf",
                  "--t-axis", "linear", "--temps", "300,900", "-o", missing], root)
    check(result.returncode == 0, f"--allow-missing-hf: exit {result.returncode}: {result.stderr}")
    page = ET.fromstring(open(missing, encoding="utf-8").read())
    sections = [e for e in page.iter("section") if e.get("class") == "species"]
    check(len(sections) == 2, "both species should appear")
    first = "".join(sections[0].itertext())
    check("Not fitted" in first and sections[0].find(".//pre") is None, "missing ΔfH not marked as not fitted")
    check(sections[1].find(".//pre") is not None, "the other species lost its NASA record")
    rows = sections[1].findall(".//table[@class='thermo']/tbody/tr")
    check(len(rows) == 2, f"--temps 300,900 should give 2 table rows, got {len(rows)}")
    check("logarithmic" not in "".join(sections[1].itertext()), "--t-axis linear not applied")

    # The numbers in the tables are those of `table` and `fit` for the same inputs.
    temps = "298.15,500,1000,1500,2000,3000"
    table = json.loads(run(["table", examples, "--temps", temps, "--format", "json"], root).stdout)
    fits = json.loads(run(["fit", examples, "--form", "json"], root).stdout)
    by_name = {s["name"]: s for s in table["species"]}
    fit_by_name = {s["name"]: s for s in fits["species"]}
    for section in demo_sections:
        name = section.find("h2").text
        shown = [[float(c.text) for c in r.findall("td")] for r in section.findall(".//table[@class='thermo']/tbody/tr")]
        expected = [[r["T"], r["Cp"], r["S"], r["H_minus_H298"], r["minus_G_minus_H298_over_T"]]
                    for r in by_name[name]["rows"]]
        check(len(shown) == len(expected), f"{name}: {len(shown)} table rows, `table` has {len(expected)}")
        for a, b in zip(shown, expected):
            check(all(abs(x - y) <= 0.0005 + 1e-9 for x, y in zip(a, b)), f"{name}: table row {a} vs `table` {b}")
        errors = [[c.text for c in r.findall("td")] for r in section.findall(".//table[@class='fit-errors']/tbody/tr")]
        ranges = fit_by_name[name]["ranges"]
        check(len(errors) == len(ranges), f"{name}: fit error rows")
        for row, rng in zip(errors, ranges):
            e = rng["errors"]
            check(abs(float(row[1].rstrip(" %")) - 100 * e["max_Cp_relative"]) <= 0.0005
                  and abs(float(row[3].rstrip(" %")) - 100 * e["rms_Cp_relative"]) <= 0.0005
                  and abs(float(row[4]) - e["max_H_J_per_mol"] / 1000) <= 0.00005
                  and abs(float(row[5]) - e["max_S_J_per_mol_K"]) <= 0.00005,
                  f"{name}: fit errors {row} vs `fit` {e}")

for f in failures:
    print("FAIL:", f)
print(f"{'ok' if not failures else 'FAILED'}: report checks")
sys.exit(1 if failures else 0)
