#!/usr/bin/env python3
"""Checks `vibtherm report` on the demo species: the page parses as XML, has one section
per species, the caution, inline SVG pictures that parse on their own, and nothing
external (no URLs, no src= references, no scripts).

Usage: report_cli_test.py VIBTHERM_EXE PROJECT_ROOT
"""
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
        check(len(svgs) == 2, f"{section.get('id')}: {len(svgs)} pictures, expected Cp(T) and modes")
        for svg in svgs:
            # Each picture stands alone as XML too.
            ET.fromstring(ET.tostring(svg))
        check(section.find(".//pre") is not None, f"{section.get('id')}: no NASA-7 record")
    summary_rows = page.findall(".//table[@class='summary']/tr")
    check(len(summary_rows) == len(sections) + 1, "summary table needs one row per species")
    for e in page.iter():
        for key, value in e.attrib.items():
            check(not re.match(r"\s*(https?:|//|file:)", value), f"external reference {key}={value}")
            check(key != "src", f"src attribute on <{e.tag}>")
            check(not (key == "href" and not value.startswith("#")), f"non-local link {value}")
    check(not re.search(r"https?:", text), "a URL appears in the page")
    check(next(page.iter("script"), None) is None, "a script element appears")
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
    rows = sections[1].findall(".//table[@class='thermo']/tr")
    check(len(rows) == 3, f"--temps 300,900 should give 2 table rows, got {len(rows) - 1}")
    check("linear scale" in "".join(sections[1].itertext()), "--t-axis linear not applied")

for f in failures:
    print("FAIL:", f)
print(f"{'ok' if not failures else 'FAILED'}: report checks")
sys.exit(1 if failures else 0)
