#!/usr/bin/env python3
"""Notebook-style walk through the Larchmere Fuels screening (fictional demo) with the
vibtherm Python module: read the demo species, tabulate them, see which modes are still
frozen, fit NASA-7 polynomials, and plot Cp(T) when matplotlib is installed.

Run from the repository root after building:

    PYTHONPATH=build/python python3 examples/screening.py [OUTPUT_DIR]

Each `# %%` block is one notebook cell. The picture goes to OUTPUT_DIR/cp.png
(default build/demo); without matplotlib the plotting cell says so and is skipped.
"""
# %% Read the team's species files (a directory: every species file in it, sorted).
import pathlib
import sys

import numpy as np

import vibtherm

here = pathlib.Path(__file__).resolve().parent
species = vibtherm.read(str(here / "fuel-additive"))
print(f"{len(species)} species:", ", ".join(s.name for s in species))

# %% Thermochemistry on one temperature grid: a dict of NumPy arrays per species.
temperatures = np.linspace(300.0, 2000.0, 35)
tables = vibtherm.table(species, temperatures=temperatures)
print(f"\n{'species':<16}{'S(300 K)':>10}{'Cp(300 K)':>11}{'Cp(2000 K)':>12}  J/(mol K)")
for s, t in zip(species, tables):
    print(f"{s.name:<16}{t['S'][0]:>10.2f}{t['Cp'][0]:>11.2f}{t['Cp'][-1]:>12.2f}")

# %% Which vibrations are still frozen at the temperatures the mechanism cares about?
print(f"\n{'species':<16}{'modes':>6}{'frozen at 300 K':>17}{'frozen at 1000 K':>18}")
for s in species:
    m = vibtherm.modes(s, temperatures=[300.0, 1000.0])
    frozen = [row.count("frozen") for row in m["state"]]
    print(f"{s.name:<16}{len(m['wavenumber']):>6}{frozen[0]:>17}{frozen[1]:>18}")

# %% NASA-7 polynomials for the mechanism file, with the fit's largest Cp error.
records = []
for s in species:
    fit = vibtherm.fit(s)
    worst = max(r["errors"]["max_Cp_relative"] for r in fit["ranges"])
    print(f"{s.name:<16} NASA-7 fitted, largest Cp error {100 * worst:.3f} %")
    records.append(fit["record"])
print("\n" + records[0], end="")

# %% Cp(T) of every species, if matplotlib is there.
try:
    import matplotlib

    matplotlib.use("Agg")  # files only, no window
    import matplotlib.pyplot as plt
except ImportError:
    print("matplotlib is not installed: plot skipped")
else:
    out = pathlib.Path(sys.argv[1]) if len(sys.argv) > 1 else here.parent / "build" / "demo"
    out.mkdir(parents=True, exist_ok=True)
    fig, ax = plt.subplots(figsize=(7, 4.5))
    for s, t in zip(species, tables):
        ax.plot(t["T"], t["Cp"], label=s.name)
    ax.set_xlabel("T / K")
    ax.set_ylabel("Cp / (J mol$^{-1}$ K$^{-1}$)")
    ax.set_title("Larchmere Fuels screening (demo): ideal-gas Cp, RRHO")
    ax.legend(fontsize="small")
    fig.tight_layout()
    fig.savefig(out / "cp.png", dpi=100)
    print(f"Cp(T) plot written to {out / 'cp.png'}")
