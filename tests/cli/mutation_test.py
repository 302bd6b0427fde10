#!/usr/bin/env python3
"""Feeds seeded mutations of the valid inputs in tests/data through the executable and
checks the promise of design.md section 7 on each: the run ends with exit 0, 1 or 2 and
never by a signal or a hang; on 2 it printed exactly one located error line (FILE, or
FILE:LINE:COL, then ": error: ", at most 1,000 characters) besides any warnings, and wrote
nothing; on 0 every number in the output, and in any warning on stderr, is finite (no nan
or inf). Runs are not quiet (-q), so the warnings are checked too.

Species files (.yaml, .xyz, QCSchema .json, Molden .molden) go through `table`, and every
fourth through `fit --allow-missing-hf` (read, prepare, tabulate, fit, write NASA-7), NASA
files (.dat) through `eval`. The
mutations are byte- and line-level edits (a number replaced by an extreme or non-finite
value, lines deleted, duplicated or swapped, bytes flipped, YAML syntax inserted, the file
cut short), one to three per input, from a fixed seed so a failure can be replayed.

Usage: mutation_test.py VIBTHERM_EXE TESTS_DATA_DIR [COUNT=1000] [SEED=1]
"""
import concurrent.futures
import os
import random
import re
import shutil
import subprocess
import sys
import tempfile

exe, data = sys.argv[1], sys.argv[2]
count = int(sys.argv[3]) if len(sys.argv) > 3 else 1000
seed = int(sys.argv[4]) if len(sys.argv) > 4 else 1

EXTREMES = ["nan", "inf", "-inf", "1e308", "-1e308", "1e-320", "0", "-0", "1e30", "-1", "2147483647",
            "4294967297", "1e5", "0.5", "1.0e+400", "0x10", ""]
TOKENS = [":", "[", "]", "{", "}", "- ", "&a ", "*a", "!!binary ", "\t", "\x00", "#", ",", "'", '"', "\n", "  ",
          "{value: 1, unit: eV}", "1e308", "nan", "-", "END", "THERMO", "&"]
NUMBER = re.compile(rb"-?\d+(\.\d*)?([eEdD][-+]?\d+)?")
# A located error line: the file it is about (the mutant, or a file it names: a conformer,
# `from:` or method file), its line and column where the reader knows them, then the error.
LOCATED = re.compile(r"^[^\s:][^:]*(:\d+:\d+|:\d+)?: error: \S")
NON_FINITE = re.compile(r"(?<![a-z])(nan|inf)(?![a-z])")


def mutate(text, rng):
    for _ in range(rng.randint(1, 3)):
        op = rng.randrange(7)
        lines = text.split(b"\n")
        if op == 0:  # a number becomes an extreme or non-finite value
            numbers = list(NUMBER.finditer(text))
            if numbers:
                m = rng.choice(numbers)
                text = text[:m.start()] + rng.choice(EXTREMES).encode() + text[m.end():]
        elif op == 1 and len(lines) > 1:  # a line deleted
            del lines[rng.randrange(len(lines))]
            text = b"\n".join(lines)
        elif op == 2:  # a line duplicated
            i = rng.randrange(len(lines))
            lines.insert(i, lines[i])
            text = b"\n".join(lines)
        elif op == 3 and len(lines) > 1:  # two lines swapped
            i, j = rng.randrange(len(lines)), rng.randrange(len(lines))
            lines[i], lines[j] = lines[j], lines[i]
            text = b"\n".join(lines)
        elif op == 4 and text:  # a byte flipped
            i = rng.randrange(len(text))
            text = text[:i] + bytes([rng.randrange(256)]) + text[i + 1:]
        elif op == 5:  # syntax inserted
            i = rng.randrange(len(text) + 1)
            text = text[:i] + rng.choice(TOKENS).encode() + text[i:]
        elif op == 6 and text:  # cut short
            text = text[:rng.randrange(len(text))]
    return text


# A sanitizer report must never pass as an ordinary exit status: AddressSanitizer exits 1
# by default, which the checks below accept under --keep-going. Status 86 is refused.
SANITIZER_EXIT = 86
ENV = dict(os.environ)
ENV["ASAN_OPTIONS"] = ":".join(filter(None, [ENV.get("ASAN_OPTIONS", ""), f"exitcode={SANITIZER_EXIT}"]))
ENV["UBSAN_OPTIONS"] = ":".join(filter(None, [ENV.get("UBSAN_OPTIONS", ""), f"exitcode={SANITIZER_EXIT}"]))


def run_one(job):
    path, subcommand, out = job
    extra = ["--allow-missing-hf"] if subcommand == "fit" else []
    try:
        r = subprocess.run([exe, subcommand, os.path.basename(path), *extra, "-o", out], cwd=os.path.dirname(path),
                           capture_output=True, timeout=60, env=ENV)
    except subprocess.TimeoutExpired:
        return f"{path}: no end within 60 s"
    stderr = r.stderr.decode("utf-8", "replace")
    lines = [line for line in stderr.splitlines() if line.strip()]
    if r.returncode < 0:
        return f"{path}: ended by signal {-r.returncode}: {stderr[-300:]}"
    if r.returncode == SANITIZER_EXIT:
        return f"{path}: sanitizer report: {stderr[-600:]}"
    if r.returncode not in (0, 1, 2):
        return f"{path}: exit status {r.returncode}: {stderr[-300:]}"
    if r.returncode == 2:
        errors = [line for line in lines if not line.startswith(("vibtherm: warning: ", "vibtherm: info: "))]
        if len(errors) != 1 or not LOCATED.match(errors[0]) or len(errors[0]) > 1000:
            return f"{path}: exit 2 with stderr {errors[:3]!r}, expected one located error line"
        if os.path.exists(out):
            return f"{path}: exit 2 but {out} was written"
    if r.returncode == 0:
        if not os.path.exists(out):
            return f"{path}: exit 0 without an output file"
        body = open(out, "rb").read().decode("utf-8", "replace").lower()
        if NON_FINITE.search(body):
            return f"{path}: exit 0 with a non-finite number in the output"
        if NON_FINITE.search(stderr.lower()):
            return f"{path}: exit 0 with a non-finite number on stderr: {stderr[-300:]}"
    return None


with tempfile.TemporaryDirectory() as tmp:
    # A copy of tests/data, so that mutated files sit beside the files they refer to
    # (conformer ensembles name their members relative to themselves).
    work = os.path.join(tmp, "data")
    shutil.copytree(data, work)
    seeds = sorted(f for f in os.listdir(data) if f.endswith((".yaml", ".xyz", ".json", ".molden", ".dat")))
    rng = random.Random(seed)
    jobs = []
    for k in range(count):
        name = seeds[k % len(seeds)]
        stem, ext = os.path.splitext(name)
        text = open(os.path.join(data, name), "rb").read()
        path = os.path.join(work, f"mutant-{k:04d}-{stem}{ext}")
        with open(path, "wb") as f:
            f.write(mutate(text, rng))
        subcommand = "eval" if ext == ".dat" else "fit" if (k // len(seeds)) % 4 == 3 else "table"
        jobs.append((path, subcommand, os.path.join(tmp, f"out-{k:04d}.txt")))
    with concurrent.futures.ThreadPoolExecutor(max_workers=os.cpu_count() or 2) as pool:
        results = list(pool.map(run_one, jobs))
    for (path, _, out), problem in zip(jobs, results):
        if problem:
            print("FAIL ", problem)
            # Keep the failing input for replay next to the build.
            shutil.copy(path, os.path.join(os.getcwd(), os.path.basename(path)))
    failures = [p for p in results if p]
    print(f"{count} mutations of {len(seeds)} inputs (seed {seed}): {count - len(failures)} as promised, "
          f"{len(failures)} not")
    sys.exit(1 if failures else 0)
