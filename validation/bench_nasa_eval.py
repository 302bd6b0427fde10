#!/usr/bin/env python3
"""Benchmark: `eval` reads and tabulates a 1,500-species NASA-7 file at 10 temperatures.

The file is synthetic (not physical data): the O2 record of tests/data/o2_gri30_from_memory.dat
repeated under 1,500 names, one in three with a quirk of published files (digit in
column 79, sign-less exponents, a fifth number on line 4), inside a mechanism file's THERMO
section. Prints the best of 5 wall times next to a reference run (`eval` of one species).

Usage: bench_nasa_eval.py VIBTHERM_EXECUTABLE [COUNT]
"""
import os
import subprocess
import sys
import tempfile
import time

O2 = [
    "O2                TPIS89O   2               G   200.000  3500.000  1000.000    1",
    " 3.28253784E+00 1.48308754E-03-7.57966669E-07 2.09470555E-10-2.16717794E-14    2",
    "-1.08845772E+03 5.45323129E+00 3.78245636E+00-2.99673416E-03 9.84730201E-06    3",
    "-9.68129509E-09 3.24372837E-12-1.06394356E+03 3.65767573E+00                   4",
]


def record(k):
    lines = list(O2)
    lines[0] = f"{'S' + str(k):<18}" + lines[0][18:]
    if k % 3 == 1:
        lines[0] = lines[0][:78] + "7" + lines[0][79]
    elif k % 3 == 2:
        lines[1] = lines[1].replace("E+00", "e 00")
        lines[3] = lines[3][:60] + " 0.00000000E+00" + lines[3][75:]
    return lines


def best_of(cmd, n=5):
    best = float("inf")
    for _ in range(n):
        t = time.perf_counter()
        subprocess.run(cmd, check=True, stdout=subprocess.DEVNULL)
        best = min(best, time.perf_counter() - t)
    return best


def main():
    if len(sys.argv) not in (2, 3):
        sys.exit(__doc__)
    exe = sys.argv[1]
    count = int(sys.argv[2]) if len(sys.argv) == 3 else 1500
    with tempfile.TemporaryDirectory() as tmp:
        big = os.path.join(tmp, "mech.dat")
        one = os.path.join(tmp, "one.dat")
        with open(big, "w") as f:
            f.write("ELEMENTS\nO\nEND\nSPECIES\n" + " ".join(f"S{k}" for k in range(count)) + "\nEND\n")
            f.write("THERMO ALL\n   300.000  1000.000  5000.000\n")
            for k in range(count):
                f.write("\n".join(record(k)) + "\n")
            f.write("END\nREACTIONS\nEND\n")
        with open(one, "w") as f:
            f.write("\n".join(O2) + "\n")
        temps = "300,500,700,900,1100,1300,1500,2000,2500,3000"
        t_big = best_of([exe, "eval", big, "--temps", temps, "--format", "csv"])
        t_one = best_of([exe, "eval", one, "--temps", temps, "--format", "csv"])
        print(f"eval, {count} species x 10 temperatures: {t_big:.3f} s (reference, 1 species: {t_one:.3f} s; "
              f"ratio {t_big / t_one:.1f})")


if __name__ == "__main__":
    main()
