#!/usr/bin/env python3
"""Command-line promises of issue 12 that no other check script holds, each through the
executable: every subcommand's --help states its temperatures, -q and the exit codes, the
top-level --help the exit codes once; the hindered rotors' part carries one name in table
text, CSV and JSON, in modes text, CSV and JSON and in the README, and no other; an adsorbate's
report section shows no rotor type, moments or rotational constants; the NASA-7 default
breakpoint's Cp warning says when `--range TLOW:auto:THIGH` would not warn (fit and report);
the report names its input file with its SHA-256 and the options; modes are numbered by
ascending wavenumber with the input position, the report's wavenumber list leaves out the
mode a rotor replaces, and an imaginary mode is written one way (1500.0i) everywhere.

Usage: messages_cli_test.py VIBTHERM_EXE PROJECT_ROOT
"""
import hashlib
import json
import os
import re
import sys
import tempfile

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from harness import Checks  # noqa: E402

exe, root = sys.argv[1], sys.argv[2]
checks = Checks(exe)
run, check = checks.run, checks.check
data = os.path.join(root, "tests", "data")

# --help: temperatures, -q and exit status for every subcommand; the top level once.
exit_line = "Exit status: 0 success; 1 some species failed under --keep-going"
for sub, temps in [("inspect", "Temperatures: none"), ("table", "Default temperatures: 298.15 K, then 300 to 3000 K"),
                   ("modes", "Default temperatures: 50, 100, 200, 298.15, 500, 1000, 2000, 3000 K"),
                   ("fit", "Temperatures: the fit grid from --range (NASA-7 200:1000:3000 K"),
                   ("eval", "Default temperatures: 298.15 K, then 300 to 3000 K"),
                   ("report", "Default table temperatures: 298.15, 500, 1000, 1500, 2000, 3000 K"),
                   ("reaction", "Default temperatures: 298.15 K, then 300 to 3000 K")]:
    r = run(sub, "--help")
    check(f"{sub} --help: temperatures, -q, exit codes 0/1/2",
          r.returncode == 0 and temps in r.stdout and "-q, --quiet" in r.stdout and exit_line in r.stdout
          and "2 usage or input error" in r.stdout, r.stdout[-500:])
r = run("--help")
check("top-level --help lists the exit codes exactly once", r.returncode == 0 and r.stdout.count("Exit status") == 1,
      r.stdout[-400:])

# One name for the hindered rotors' part: hindered_rotors (text and CSV columns, JSON keys),
# "hindered rotors" in prose. No other spelling in any output or the README.
ethane = os.path.join(data, "ethane_rotor.yaml")
other_names = re.compile(r"hrot|internal_rotation|internal rotation|hindered_rotor\b|torsion_part|Cp\.hr\b")
outputs = {}
for label, args in [("table text", ["table", "--breakdown"]), ("table csv", ["table", "--breakdown", "--format", "csv"]),
                    ("table json", ["table", "--breakdown", "--format", "json"]), ("modes text", ["modes"]),
                    ("modes csv", ["modes", "--format", "csv"]), ("modes json", ["modes", "--format", "json"])]:
    r = run(*args, ethane, "--temps", "298.15,1000", "-q")
    outputs[label] = r.stdout
    check(f"{label}: the part is called hindered_rotors / hindered rotors and nothing else",
          r.returncode == 0 and ("hindered_rotors" in r.stdout or label == "modes text")
          and not other_names.search(r.stdout), other_names.findall(r.stdout)[:3] or r.stdout[:300])
check("table text column Cp.hindered_rotors", "Cp.hindered_rotors" in outputs["table text"])
check("table csv column Cp_hindered_rotors_J_per_mol_K", "Cp_hindered_rotors_J_per_mol_K" in outputs["table csv"])
rows = json.loads(outputs["table json"])["species"][0]["rows"] if outputs["table json"] else []
check("table json motions.hindered_rotors", rows and all("hindered_rotors" in x["motions"] for x in rows))
modes = json.loads(outputs["modes json"])["species"][0] if outputs["modes json"] else {}
check("modes json dof.hindered_rotors", modes and all("hindered_rotors" in t["dof"] for t in modes["temperatures"]))
check("modes csv item hindered_rotors", ",hindered_rotors," in outputs["modes csv"])
check("modes text explains 2 (oscillator) to 1 (free rotor) quadratic terms",
      "hindered rotors: each counts 2 quadratic terms while it oscillates" in outputs["modes text"]
      and "(from 2 as oscillators to 1 as free rotors)" in outputs["modes text"], outputs["modes text"][:600])
readme = open(os.path.join(root, "README.md"), encoding="utf-8").read()
check("README names the part hindered_rotors and no other way",
      "hindered_rotors" in readme and not other_names.search(readme), other_names.findall(readme)[:3])

with tempfile.TemporaryDirectory() as tmp:
    # An adsorbate neither translates nor rotates: its report section shows no rotor facts.
    page = os.path.join(tmp, "report.html")
    r = run("report", os.path.join(data, "adsorbed-water.yaml"), os.path.join(data, "water.yaml"),
            "--allow-missing-hf", "-q", "-o", page)
    html = open(page, encoding="utf-8").read() if r.returncode == 0 else ""
    sections = dict(re.findall(r'<section class="species" id="species-\d+">\s*<h2>([^<]*)</h2>(.*?)</section>',
                               html, re.S))
    facts = {name: re.findall(r"<dt>([^<]*)</dt>", body.split("</dl>")[0]) for name, body in sections.items()}
    phase = {name: "<dt>phase</dt><dd>adsorbate</dd>" in body for name, body in sections.items()}
    adsorbate = next((facts[n] for n, a in phase.items() if a), None)
    gas = next((facts[n] for n, a in phase.items() if not a), [])
    rotor_facts = {"rotor", "principal moments", "rotational constants", "point group", "symmetry number σ"}
    check("report: the gas shows rotor type, moments and rotational constants", rotor_facts <= set(gas), gas)
    check("report: the adsorbate shows none of them",
          adsorbate is not None and "phase" in adsorbate and not rotor_facts & set(adsorbate), facts)

    # The default NASA-7 breakpoint warns; the warning says --range 200:auto:3000 would not, and it does not.
    floppy = os.path.join(data, "floppy-synthetic.yaml")
    out = os.path.join(tmp, "floppy.dat")
    r = run("fit", floppy, "-o", out)
    advice = [line for line in r.stderr.splitlines() if "would not warn" in line]
    check("fit: default breakpoint warning names the range that would not warn",
          r.returncode == 0 and len(advice) == 1 and "--range 200:auto:3000 would not warn" in advice[0]
          and "exceeds 0.5 %" in r.stderr, r.stderr)
    r = run("fit", floppy, "--range", "200:auto:3000", "-o", out)
    check("fit --range 200:auto:3000 indeed does not warn", r.returncode == 0 and "warning" not in r.stderr, r.stderr)
    r = run("report", floppy, "-q", "-o", page)
    html = open(page, encoding="utf-8").read() if r.returncode == 0 else ""
    check("report: the fit warnings carry the same advice", "--range 200:auto:3000 would not warn" in html)

    # Input file, its SHA-256 and the options; the rotor's torsion (289 cm^-1) is not listed as a vibration.
    r = run("report", ethane, "-q", "-o", page)
    html = open(page, encoding="utf-8").read() if r.returncode == 0 else ""
    digest = hashlib.sha256(open(ethane, "rb").read()).hexdigest()
    check("report: input file and its SHA-256", f"<dt>input file</dt><dd>{ethane}</dd>" in html
          and f"<dt>input SHA-256</dt><dd>{digest}</dd>" in html)
    check("report: the options used", '<table class="options">' in html and "<code>--range</code>" in html)
    used = re.search(r"<dt>vibrations used, ascending</dt><dd>([^<]*) cm⁻¹</dd>", html)
    listed = [float(v) for v in used.group(1).split(", ")] if used else []
    check("report: wavenumber list ascending, without the mode the rotor replaces",
          len(listed) == 17 and listed == sorted(listed) and 289.0 not in listed, listed)

# Modes by ascending wavenumber, each with its position in the input.
m = modes.get("vibrations", [])
order = [v["wavenumber"] for v in m]
raw = re.search(r"frequencies: \[([^\]]*)\]", open(ethane, encoding="utf-8").read(), re.S)
given = [float(v) for v in raw.group(1).replace("\n", " ").split(",")] if raw else []
check("modes: numbered 1.. by ascending wavenumber, input position beside",
      [v["index"] for v in m] == list(range(1, len(m) + 1)) and order == sorted(order)
      and all(given[v["input_position"] - 1] == v["wavenumber"] for v in m), m[:2])

# An imaginary mode is written 1500.0i in inspect text, messages and the report; never as -1500.
ts = os.path.join(data, "model-ts-symmetric.yaml")
r_inspect = run("inspect", ts)
r_table = run("table", ts)
with tempfile.TemporaryDirectory() as tmp:
    page = os.path.join(tmp, "ts.html")
    r_report = run("report", ts, "--allow-missing-hf", "-q", "-o", page)
    html = open(page, encoding="utf-8").read() if r_report.returncode == 0 else ""
for label, text in [("inspect text", r_inspect.stdout), ("table messages", r_table.stderr), ("report", html)]:
    check(f"{label}: imaginary mode written 1500.0i, not -1500", "1500.0i" in text and "-1500" not in text,
          text[:400])
check("report: the imaginary mode listed as the reaction coordinate, left out",
      "1500.0i (reaction coordinate, left out)" in html)

checks.finish()
