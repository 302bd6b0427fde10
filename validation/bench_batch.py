#!/usr/bin/env python3
"""Batch benchmark of the executable: a mechanism-sized set of species files.

Copies the demo species N times (renamed), then times `inspect` (read + prepare only: the
reference run), `table`, `fit` (NASA-7) and `fit --form nasa9`, each the best of three
runs, and prints the times, species per second, and the ratio to the reference run.
Absolute times depend on the machine; the ratios are what to compare between versions.

Usage: bench_batch.py VIBTHERM_EXE PROJECT_ROOT [COPIES=150]
"""
import os
import pathlib
import subprocess
import sys
import tempfile
import time

exe, root = sys.argv[1], pathlib.Path(sys.argv[2])
copies = int(sys.argv[3]) if len(sys.argv) > 3 else 150
sources = sorted((root / "examples" / "fuel-additive").glob("*.yaml"))

with tempfile.TemporaryDirectory() as tmp:
    for k in range(copies):
        for src in sources:
            text = src.read_text(encoding="utf-8").replace("\nname: ", f"\nname: c{k}-", 1)
            (pathlib.Path(tmp) / f"{k:05d}-{src.name}").write_text(text, encoding="utf-8")
    count = copies * len(sources)

    def best_of_three(*args):
        best = float("inf")
        for _ in range(3):
            start = time.perf_counter()
            subprocess.run([exe, *args, tmp, "-q", "-o", "-"], check=True, stdout=subprocess.DEVNULL)
            best = min(best, time.perf_counter() - start)
        return best

    reference = best_of_three("inspect")
    print(f"{count} species ({copies} copies of {len(sources)} demo species)")
    print(f"{'run':<22} {'seconds':>8} {'species/s':>10} {'ratio':>6}")
    for label, args in [("inspect (reference)", ["inspect"]), ("table (28 T)", ["table"]),
                        ("fit nasa7", ["fit"]), ("fit nasa9", ["fit", "--form", "nasa9"])]:
        t = reference if label.startswith("inspect") else best_of_three(*args)
        print(f"{label:<22} {t:>8.3f} {count / t:>10.0f} {t / reference:>6.2f}")
