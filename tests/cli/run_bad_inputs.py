#!/usr/bin/env python3
"""Runs `vibtherm table` on every malformed species input in tests/bad/ (`vibtherm eval`
on the malformed NASA polynomial files, *.dat, and on eval_*.* of any kind) and on a few bad option values, and checks the promise of design.md section 7: exit status 2, exactly one error
line on stderr (the one in NAME.expected), and no output file.

Usage: run_bad_inputs.py VIBTHERM_EXECUTABLE [TESTS_BAD_DIR]

Each input tests/bad/NAME.EXT has tests/bad/NAME.expected holding the exact stderr line.
The runner works inside tests/bad and passes bare file names, so the expected lines do
not depend on where the repository is checked out.
"""
import os
import pathlib
import subprocess
import sys
import tempfile

# Bad option values, run on a good input: (arguments after `table`, expected stderr line).
ARGUMENT_CASES = [
    (["../data/water.yaml", "--temps", "0,300"],
     "error: temperature list '0,300': temperatures must be positive, got 0 K"),
    (["../data/water.yaml", "--pressure", "-1bar"],
     "error: --pressure '-1bar': expected a positive pressure such as 1bar, 1atm or 101325Pa"),
    (["../data/water.yaml", "--pressure", "0 atm"],
     "error: --pressure '0 atm': expected a positive pressure such as 1bar, 1atm or 101325Pa"),
    # Temperatures, scale and pressure are bounded (limits.hpp); each once gave NaN/inf.
    (["../data/water.yaml", "--temps", "0.001"],
     "error: temperature list '0.001': 0.001 K is outside 1 to 100000 K"),
    (["../data/water.yaml", "--temps", "1e300"],
     "error: temperature list '1e300': 1e+300 K is outside 1 to 100000 K"),
    (["../data/water.yaml", "--temps", "1e-320"],
     "error: temperature list '1e-320': 9.99989e-321 K is outside 1 to 100000 K"),
    (["../data/water.yaml", "--scale", "1e-320"], "error: frequency scale factor is 9.99989e-321, expected 0.1 to 10"),
    (["../data/water.yaml", "--pressure", "1e-30Pa"], "error: pressure is 1e-30, expected 1e-06 to 1e+09 Pa"),
    # Per-quantity scale factors and low-frequency wavenumbers are bounded too (1e308 gave an
    # infinite ZPE, 1e-320 a NaN Cp).
    (["../data/water.yaml", "--scale-zpe", "1e308"],
     "error: --scale-zpe (the zero-point energy's frequency scale factor) is 1e+308, expected 0.1 to 10"),
    (["../data/water.yaml", "--scale-entropy", "1e-320"],
     "error: --scale-entropy (the entropy's frequency scale factor) is 9.99989e-321, expected 0.1 to 10"),
    (["../data/water.yaml", "--low-freq", "qrrho", "--qrrho-omega0", "1e308"],
     "error: the qRRHO reference wavenumber (--qrrho-omega0) is 1e+308, expected 0.01 to 100000 cm^-1"),
    (["../data/water.yaml", "--low-freq", "floor", "--low-freq-floor", "1e-320"],
     "error: the wavenumber floor (--low-freq-floor) is 9.99989e-321, expected 0.01 to 100000 cm^-1"),
    (["../data/water.yaml", "--soft-mode-warning", "1e308"],
     "error: the soft-mode warning threshold (--soft-mode-warning) is 1e+308, expected 0 to 100000 cm^-1"),
    (["/dev/zero"], "/dev/zero: error: is not a regular file (a device, FIFO or socket), expected a species file"),
    (["does-not-exist.yaml"],
     "does-not-exist.yaml: error: cannot read file (missing or not readable), expected a species file"),
]

# Bad fit options (arguments after `fit`): each once exhausted memory (std::bad_alloc).
FIT_ARGUMENT_CASES = [
    (["../data/water.yaml", "--grid-step", "1e-14"], "error: --grid-step is 1e-14, expected 0.1 to 2800 K"),
    (["../data/water.yaml", "--range", "200:1000:1e300"],
     "error: --range '200:1000:1e300': breakpoint 3 is 1e+300, expected 1 to 100000 K"),
    (["../data/water.yaml", "--range", "200:auto:1e8"],
     "error: --range '200:auto:1e8': breakpoint 3 is 1e+08, expected 1 to 100000 K"),
]

# eval of a non-regular file once read /dev/zero until memory ran out.
EVAL_ARGUMENT_CASES = [
    (["/dev/zero"], "/dev/zero: error: is not a regular file (a device, FIFO or socket), expected a NASA polynomial file"),
    (["../data/o2_gri30_from_memory.dat", "--against", "/dev/zero"],
     "/dev/zero: error: is not a regular file (a device, FIFO or socket), expected a NASA polynomial file"),
]


def run_case(exe, bad_dir, args, expected, label, failures, subcommand="table"):
    with tempfile.TemporaryDirectory() as tmp:
        out = os.path.join(tmp, "out.txt")
        result = subprocess.run([exe, subcommand, *args, "-o", out], cwd=bad_dir, capture_output=True,
                                text=True, errors="replace", timeout=60)
        problems = []
        if result.returncode != 2:
            problems.append(f"exit status {result.returncode}, expected 2")
        lines = [line for line in result.stderr.splitlines() if line.strip()]
        if lines != [expected]:
            problems.append(f"stderr {lines!r}, expected [{expected!r}]")
        left = os.listdir(tmp)
        if left:
            problems.append(f"files written: {left}")
        if problems:
            failures.append(f"{label}: " + "; ".join(problems))


def main():
    if len(sys.argv) not in (2, 3):
        sys.exit(__doc__)
    exe = os.path.abspath(sys.argv[1])
    bad_dir = pathlib.Path(sys.argv[2] if len(sys.argv) == 3 else pathlib.Path(__file__).parent.parent / "bad")
    failures = []
    inputs = sorted(p for p in bad_dir.iterdir() if p.suffix != ".expected")
    expected_files = {p.stem for p in bad_dir.glob("*.expected")}
    for stem in sorted(expected_files - {p.stem for p in inputs}):
        failures.append(f"{stem}.expected has no input file")
    for path in inputs:
        expected_path = path.with_suffix(".expected")
        if not expected_path.exists():
            failures.append(f"{path.name}: no {expected_path.name}")
            continue
        expected = expected_path.read_text(encoding="utf-8").strip()
        # eval_NAME.*: a file of another kind given to eval (a species file, say).
        subcommand = "eval" if path.suffix == ".dat" or path.name.startswith("eval_") else "table"
        args = [path.name]
        if path.name.startswith("method_"):  # a method file, applied to a species with energies
            args = ["../data/water-energies-no-method.yaml", "--method", path.name]
        elif path.name.startswith("reaction_"):  # a reaction file
            subcommand = "reaction"
        run_case(exe, bad_dir, args, expected, path.name, failures, subcommand)
    for args, expected in ARGUMENT_CASES:
        run_case(exe, bad_dir, args, expected, " ".join(args), failures)
    for args, expected in FIT_ARGUMENT_CASES:
        run_case(exe, bad_dir, args, expected, "fit " + " ".join(args), failures, "fit")
    for args, expected in EVAL_ARGUMENT_CASES:
        run_case(exe, bad_dir, args, expected, "eval " + " ".join(args), failures, "eval")
    total = len(inputs) + len(ARGUMENT_CASES) + len(FIT_ARGUMENT_CASES) + len(EVAL_ARGUMENT_CASES)
    for f in failures:
        print("FAIL", f)
    print(f"{total - len(failures)} of {total} bad-input cases behave as expected")
    sys.exit(1 if failures else 0)


if __name__ == "__main__":
    main()
