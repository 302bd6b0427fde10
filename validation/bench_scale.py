#!/usr/bin/env python3
"""Mechanism-scale benchmark (not a timed test): wall time and peak memory of whole runs
on synthetic mechanisms from gen_mechanism.py, with the machine load beside each figure.

Prints: fit of 10,000 YAML species with -j 2 (target <= 2.0 s, <= 100 MB), of 10,000 XYZ
species (<= 1.0 s), table of 10,000 species at 100 temperatures (<= 100 MB), the same
YAML species without their hindered rotors, linearity 1,000 vs 10,000, and the
per-species speed of `table` against python3-ase's IdealGasThermo computing S and H at
the same 100 temperatures on the same model (every mode harmonic; target >= 150x), and the
wall time and size of a report of 1,000 species (target under 5 s).

Usage: bench_scale.py VIBTHERM_EXE [COUNT=10000] [JOBS=2]
       bench_scale.py VIBTHERM_EXE report [COUNT=1000] [JOBS=2]   (the report part alone)
"""
import os
import pathlib
import subprocess
import sys
import tempfile
import time

here = pathlib.Path(__file__).resolve().parent
exe = sys.argv[1]
report_only = len(sys.argv) > 2 and sys.argv[2] == "report"
args = sys.argv[3:] if report_only else sys.argv[2:]
count = int(args[0]) if args else (1000 if report_only else 10000)
jobs = args[1] if len(args) > 1 else "2"
temps = "300:3000:27.27"  # 100 temperatures from 300 K


def run(*args):
    """Wall seconds and peak RSS (MB) of one run, best of three by wall time."""
    best = (float("inf"), 0.0)
    for _ in range(3):
        start = time.perf_counter()
        p = subprocess.Popen([exe, *args, "-q", "-j", jobs, "-o", "-"], stdout=subprocess.DEVNULL)  # - is stdout: an output file must be a regular file
        _, status, usage = os.wait4(p.pid, 0)
        wall = time.perf_counter() - start
        if os.waitstatus_to_exitcode(status) != 0:
            sys.exit(f"run failed: {' '.join(args)}")
        best = min(best, (wall, usage.ru_maxrss / 1024.0))
    return best


def load():
    return "load {:.1f}/{:.1f}".format(*os.getloadavg()[:2])


def ase_per_species(directory, n):
    """Seconds per species for ase.thermochemistry.IdealGasThermo: S and H at 100 T."""
    import numpy as np
    from ase import Atoms
    from ase.thermochemistry import IdealGasThermo
    import warnings
    T = np.linspace(300.0, 3000.0, 100)
    files = sorted(pathlib.Path(directory).glob("*.yaml"))[:n]
    cm1_to_eV = 1.239841984e-4
    species = []
    for f in files:
        symbols, pos, nu = [], [], []
        for line in f.read_text().splitlines():
            if line.startswith("  - ["):
                parts = line.strip()[3:-1].split(",")
                symbols.append(parts[0].strip())
                pos.append([float(x) for x in parts[1:]])
            elif line.startswith("frequencies:"):
                nu = [float(x) for x in line.split("[")[1].split("]")[0].split(",")]
        species.append((Atoms(symbols=symbols, positions=pos), [v * cm1_to_eV for v in nu]))
    start = time.perf_counter()
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        for atoms, energies in species:
            thermo = IdealGasThermo(vib_energies=energies, geometry="nonlinear", atoms=atoms, symmetrynumber=1,
                                    spin=0)
            for t in T:
                thermo.get_entropy(t, 1e5, verbose=False)
                thermo.get_enthalpy(t, verbose=False)
    return (time.perf_counter() - start) / len(species)


def report_part(tmp, gen):
    """The report of a mechanism: up to 1,000 species (a fifth with a hindered rotor), one page,
    best of three runs by wall time, with CPU time and the page's size."""
    report_count = min(count, 1000)
    subprocess.run(gen + [f"{tmp}/report", str(report_count)], check=True)
    page = f"{tmp}/report.html"
    best = None
    for _ in range(3):
        before = load()
        start = time.perf_counter()
        p = subprocess.Popen([exe, "report", f"{tmp}/report", "-q", "-j", jobs, "-o", page])
        _, status, usage = os.wait4(p.pid, 0)
        wall = time.perf_counter() - start
        if os.waitstatus_to_exitcode(status) != 0:
            sys.exit("report run failed")
        if best is None or wall < best[0]:
            best = (wall, usage.ru_utime + usage.ru_stime, before, load())
    wall, cpu, before, after = best
    size = os.path.getsize(page)
    print(f"report of {report_count} YAML species: {wall:.3f} s ({cpu:.2f} s CPU), {size / 1e6:.1f} MB page, "
          f"{size / 1e3 / report_count:.1f} kB per species ({before} before, {after} after)")


with tempfile.TemporaryDirectory() as tmp:
    gen = [sys.executable, str(here / "gen_mechanism.py")]
    if report_only:
        report_part(tmp, gen)
        sys.exit(0)
    small = max(count // 10, 1)
    subprocess.run(gen + [f"{tmp}/yaml", str(count)], check=True)
    subprocess.run(gen + [f"{tmp}/xyz", str(count), "--format", "xyz"], check=True)
    subprocess.run(gen + [f"{tmp}/small", str(small)], check=True)
    # The same species with no hindered rotor (same seed: same geometries and wavenumbers):
    # the model python3-ase's IdealGasThermo computes, every mode harmonic.
    subprocess.run(gen + [f"{tmp}/plain", str(count), "--rotor-share", "0"], check=True)
    print(f"machine: {os.cpu_count()} cores; -j {jobs}; best of three runs each")
    rows = []
    for label, args in [(f"fit {count} YAML", ["fit", f"{tmp}/yaml"]),
                        (f"fit {count} XYZ", ["fit", f"{tmp}/xyz"]),
                        (f"fit --form nasa9 {count} YAML", ["fit", "--form", "nasa9", f"{tmp}/yaml"]),
                        (f"table {count} YAML at 100 T", ["table", "--temps", temps, f"{tmp}/yaml"]),
                        (f"table {count} XYZ at 100 T", ["table", "--temps", temps, f"{tmp}/xyz"]),
                        (f"inspect {count} YAML", ["inspect", f"{tmp}/yaml"]),
                        (f"fit {count} YAML, no rotors", ["fit", f"{tmp}/plain"]),
                        (f"table {count} YAML, no rotors", ["table", "--temps", temps, f"{tmp}/plain"]),
                        (f"fit {small} YAML", ["fit", f"{tmp}/small"])]:
        before = load()
        wall, rss = run(*args)
        rows.append((label, wall, rss))
        print(f"{label:<32} {wall:8.3f} s {rss:8.1f} MB   ({before} before, {load()} after)", flush=True)
    fit_big, fit_small = rows[0][1], rows[-1][1]
    print(f"linearity: fit {count} / fit {small} = {fit_big / fit_small:.2f} (ideal {count / small:.0f})")
    ase = ase_per_species(f"{tmp}/plain", 200)
    ours = rows[7][1] / count
    print(f"table per species at 100 T, same model (every mode harmonic, the rotor-free set): vibtherm "
          f"{ours * 1e6:.1f} us (whole run: read, prepare, format), python3-ase IdealGasThermo {ase * 1e6:.0f} us "
          f"(S and H only, 200 species): ratio {ase / ours:.0f}x")
    with_rotors = rows[3][1] / count
    print(f"  with a fifth of the species carrying a hindered rotor (levels converged to 3000 K): "
          f"{with_rotors * 1e6:.1f} us per species, ratio {ase / with_rotors:.0f}x")

    report_part(tmp, gen)
