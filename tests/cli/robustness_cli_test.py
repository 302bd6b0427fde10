#!/usr/bin/env python3
"""Regression cases of issue 8's defect list that need more than one file in tests/bad/:
resource abuse (manifest fan-out, huge lists and files, many atoms and modes, with the peak
memory of the refusing run measured), temperatures below 1 K for every subcommand that
takes temperatures, -o/--svg naming an input, --keep-going with every species failing for
fit and eval, errors that carry their file, and CSV per RFC 4180 for eval and reaction.
Each refused run must end with exit 2, one located error line (FILE or FILE:LINE:COL, then
": error: ") and nothing written.

Usage: robustness_cli_test.py VIBTHERM_EXE PROJECT_ROOT [--sanitized]
(--sanitized: an ASan build, whose shadow memory and quarantine multiply the peak memory;
the memory bounds are then not checked, the Release run checks them.)
"""
import csv
import io
import os
import re
import subprocess
import sys
import tempfile

from harness import Checks

exe, root = sys.argv[1], sys.argv[2]
sanitized = "--sanitized" in sys.argv[3:]


def within(rss, limit_mb):
    """Peak memory within the bound (not checked in a sanitizer build)."""
    return sanitized or rss < limit_mb

examples = os.path.join(root, "examples", "fuel-additive")
data = os.path.join(root, "tests", "data")
water = os.path.join(examples, "water.yaml")
checks = Checks(exe)
run, check = checks.run, checks.check
LOCATED = re.compile(r"^[^\s:][^:]*(:\d+:\d+|:\d+)?: error: \S")


def run_measured(*args, cwd=None):
    """Runs the executable; returns (exit status, stderr text, peak RSS in MB of that run)."""
    proc = subprocess.Popen([exe, *args], cwd=cwd, stdout=subprocess.DEVNULL, stderr=subprocess.PIPE)
    stderr = proc.stderr.read()
    _, status, usage = os.wait4(proc.pid, 0)
    proc.returncode = os.waitstatus_to_exitcode(status)
    return proc.returncode, stderr.decode("utf-8", "replace"), usage.ru_maxrss / 1024.0


def refused(name, status, stderr, where, out=None):
    lines = [line for line in stderr.splitlines() if line.strip()]
    check(f"{name}: exit 2, one located line naming {where}",
          status == 2 and len(lines) == 1 and LOCATED.match(lines[0]) is not None and where in lines[0]
          and len(lines[0]) <= 1000, f"{status} {lines[:3]!r}"[:600])
    if out is not None:
        check(f"{name}: nothing written", not os.path.exists(out))


water_text = open(water).read()

with tempfile.TemporaryDirectory() as tmp:
    out = os.path.join(tmp, "out.txt")

    # Manifests that list each other: 17 manifests x 4 lines once expanded to 4^17 paths and
    # ended in std::bad_alloc. Refused at the manifest read that passes the limit.
    open(os.path.join(tmp, "w.yaml"), "w").write(water_text)
    def manifest_chain(prefix, depth):
        """prefix1.list .. prefix{depth}.list, each naming the next four times, the last w.yaml."""
        for i in range(1, depth + 1):
            entry = f"{prefix}{i + 1}.list" if i < depth else "w.yaml"
            open(os.path.join(tmp, f"{prefix}{i}.list"), "w").write((entry + "\n") * 4)
        return f"{prefix}1.list"
    status, err, rss = run_measured("table", manifest_chain("m", 17), "-o", out, cwd=tmp)
    refused("17 manifests x 4 lines", status, err, ".list:", out)
    check(f"17 manifests x 4 lines: peak memory {rss:.0f} MB < 200 MB", within(rss, 200))
    # 12 deep (within the depth limit): 4^12 = 16.8 million paths, refused by the counts.
    status, err, rss = run_measured("table", manifest_chain("d", 12), "-o", out, cwd=tmp)
    refused("12 manifests x 4 lines", status, err, ".list:", out)
    check(f"12 manifests x 4 lines: peak memory {rss:.0f} MB < 200 MB", within(rss, 200))

    # A frequency list of 16 million short entries in 32 MB of YAML: before the value
    # count (read_species.hpp max_yaml_values) yaml-cpp's tree needed about 9 GB; a 200 MB
    # list once needed more than 6 GB. Now refused at the first value past the limit.
    big = os.path.join(tmp, "big-list.yaml")
    head, tail = water_text.split("[3657.0, 1595.0, 3756.0]")
    with open(big, "w") as f:  # written in pieces: the test process stays small
        f.write(head + "[")
        for _ in range(16):
            f.write("1," * 1_000_000)
        f.write("1]" + tail)
    status, err, rss = run_measured("table", big, "-o", out)
    refused("YAML list of 16 million values", status, err, "big-list.yaml:", out)
    check("YAML list of 16 million values: the value limit named", "YAML values" in err, err[:300])
    check(f"YAML list of 16 million values: peak memory {rss:.0f} MB < 300 MB", within(rss, 300))
    os.remove(big)
    # The same flood in the other line-based readers: an XYZ frequency line of 8 million
    # numbers (325 MB before), a Molden [FREQ] (1.2 GB) and [FR-NORM-COORD] (1 GB) of 16
    # million lines, each refused at its first entry too many.
    xyz_head, xyz_tail = open(os.path.join(data, "water.xyz")).read().split("3756.0")
    molden = open(os.path.join(data, "water-model.molden")).read()
    for file, head, tail, piece in (("flood.xyz", xyz_head + "3756.0\n", xyz_tail, "1," * 1_000_000),
                                    ("freq-flood.molden", molden.split("[FREQ]\n")[0] + "[FREQ]\n",
                                     molden.split("[FREQ]\n")[1], "1\n" * 1_000_000),
                                    ("modes-flood.molden", molden.split("[FR-NORM-COORD]\n")[0] + "[FR-NORM-COORD]\n",
                                     molden.split("[FR-NORM-COORD]\n")[1], "1\n" * 1_000_000)):
        path = os.path.join(tmp, file)
        with open(path, "w") as f:
            f.write(head)
            for _ in range(8 if file.endswith(".xyz") else 16):
                f.write(piece)
            f.write(tail)
        status, err, rss = run_measured("table", path, "-o", out)
        refused(f"{file} of millions of entries", status, err, file + ":", out)
        check(f"{file} of millions of entries: peak memory {rss:.0f} MB < 300 MB", within(rss, 300))
        os.remove(path)

    # An XYZ file of 32 million blank lines (600 MB of line views before): refused by its line count.
    path = os.path.join(tmp, "blank.xyz")
    with open(path, "w") as f:
        f.write(open(os.path.join(data, "water.xyz")).read())
        for _ in range(32):
            f.write("\n" * 1_000_000)
    status, err, rss = run_measured("table", path, "-o", out)
    refused("XYZ file of 32 million blank lines", status, err, "blank.xyz:", out)
    check(f"XYZ file of 32 million blank lines: peak memory {rss:.0f} MB < 300 MB", within(rss, 300))
    os.remove(path)

    # A QCSchema Hessian of 16 million numbers (658 MB before): refused by the value count.
    qc = open(os.path.join(data, "water-model-hessian.json")).read()
    start = qc.index('"return_result"')
    open_bracket = qc.index("[", start)
    close_bracket = qc.rindex("]", 0, qc.index('"properties"'))  # the end of return_result
    path = os.path.join(tmp, "flood.json")
    with open(path, "w") as f:
        f.write(qc[:open_bracket] + "[0")
        for _ in range(16):
            f.write(",0" * 1_000_000)
        f.write("]" + qc[close_bracket + 1:])
    status, err, rss = run_measured("table", path, "-o", out)
    refused("QCSchema array of 16 million numbers", status, err, "flood.json:", out)
    check("QCSchema array of 16 million numbers: the value limit named", "JSON values" in err, err[:300])
    check(f"QCSchema array of 16 million numbers: peak memory {rss:.0f} MB < 300 MB", within(rss, 300))
    os.remove(path)

    # A species file over 32 MiB is refused before it is read (a sparse file: no disk used).
    huge = os.path.join(tmp, "huge.yaml")
    with open(huge, "w") as f:
        f.write(water_text)
        f.truncate(33 << 20)
    status, err, rss = run_measured("table", huge, "-o", out)
    refused("33 MiB species file", status, err, "huge.yaml", out)
    check(f"33 MiB species file: peak memory {rss:.0f} MB < 100 MB", within(rss, 100))
    os.remove(huge)

    # A NASA file over 64 MiB is refused before it is read.
    huge_nasa = os.path.join(tmp, "huge.dat")
    with open(huge_nasa, "w") as f:
        f.truncate(65 << 20)
    status, err, rss = run_measured("eval", huge_nasa, "-o", out)
    refused("65 MiB NASA file", status, err, "huge.dat", out)
    check(f"65 MiB NASA file: peak memory {rss:.0f} MB < 100 MB", within(rss, 100))
    os.remove(huge_nasa)

    # Atom and frequency counts (read_species.hpp): 2,001 atoms, 6,001 wavenumbers refused.
    def adsorbate(path, atoms, modes):
        lines = ["name: big-slab", "phase: adsorbate", "enthalpy_of_formation: 0", "atoms:"]
        lines += [f"  - [C, {1.5 * k:.3f}, {1.3 * (k % 7):.3f}, {1.1 * (k % 11):.3f}]" for k in range(atoms)]
        lines.append("frequencies: [" + ", ".join(str(50 + (7 * k) % 3500) for k in range(modes)) + "]")
        open(path, "w").write("\n".join(lines) + "\n")
        return path
    status, err, _ = run_measured("table", adsorbate(os.path.join(tmp, "a2001.yaml"), 2001, 6003), "-o", out)
    refused("2,001 atoms", status, err, "a2001.yaml", out)
    many = os.path.join(tmp, "f6001.yaml")
    open(many, "w").write(water_text.replace("frequencies: [3657.0, 1595.0, 3756.0]",
                                             "frequencies: [" + ", ".join(["1500"] * 6001) + "]"))
    status, err, _ = run_measured("table", many, "-o", out)
    refused("6,001 frequencies", status, err, "f6001.yaml", out)
    # The largest accepted species (2,000 atoms, 6,000 modes) goes through report and
    # modes --svg (10^6 modes once aborted both; they are now refused by the count above).
    slab = adsorbate(os.path.join(tmp, "a2000.yaml"), 2000, 6000)
    status, err, rss = run_measured("modes", slab, "--svg", os.path.join(tmp, "slab.svg"), "-o",
                                    os.path.join(tmp, "slab.txt"), "-q")
    check(f"modes --svg of 6,000 modes: exit 0, peak memory {rss:.0f} MB < 500 MB",
          status == 0 and within(rss, 500) and os.path.getsize(os.path.join(tmp, "slab.svg")) > 0, err[:300])
    status, err, rss = run_measured("report", slab, "-o", os.path.join(tmp, "slab.html"), "-q")
    check(f"report of 6,000 modes: exit 0, peak memory {rss:.0f} MB < 500 MB",
          status == 0 and within(rss, 500) and os.path.getsize(os.path.join(tmp, "slab.html")) > 0, err[:300])
    for name in ("a2001.yaml", "f6001.yaml", "a2000.yaml", "slab.svg", "slab.txt", "slab.html"):
        os.remove(os.path.join(tmp, name))

    # Temperatures below 1 K (water once showed S = -230.6 J/(mol K) at 1 mK, printed as
    # 0.00 K) are refused by every subcommand that takes temperatures.
    nasa = os.path.join(data, "o2_gri30_from_memory.dat")
    reaction = os.path.join(root, "validation", "reactions", "water-dissociation.yaml")
    for args in (["table", water, "--temps", "0.001"], ["modes", water, "--temps", "0.5"],
                 ["report", water, "--temps", "0.5"], ["eval", nasa, "--temps", "0.5"],
                 ["reaction", reaction, "--temps", "0.5"], ["fit", water, "--range", "0.5:1000:3000"],
                 ["fit", water, "--form", "nasa9", "--range", "0.5:1000:6000"]):
        r = run(*args, "-o", out)
        lines = r.stderr.strip().splitlines()
        check(f"{args[0]} {' '.join(args[2:])}: exit 2, one line, the 1 K bound named, nothing written",
              r.returncode == 2 and len(lines) == 1 and ("1 to 100000 K" in lines[0] or "expected 1 to" in lines[0])
              and not os.path.exists(out), r.stderr[:300])

    # -o or --svg naming an input: refused for every subcommand, the input untouched.
    copy = os.path.join(tmp, "copy.yaml")
    open(copy, "w").write(water_text)
    fitted = os.path.join(tmp, "fitted.dat")
    run("fit", water, "-o", fitted)
    fitted_text = open(fitted).read()
    for args in (["fit", copy, "-o", copy], ["modes", copy, "-o", copy], ["inspect", copy, "-o", copy],
                 ["report", copy, "-o", copy], ["modes", copy, "--svg", copy, "-o", out],
                 ["modes", copy, "-o", out, "--svg", copy], ["eval", fitted, "-o", fitted],
                 ["eval", fitted, "--against", copy, "-o", copy]):
        r = run(*args)
        check(f"{' '.join(os.path.basename(a) for a in args)}: exit 2, inputs kept, nothing written",
              r.returncode == 2 and len(r.stderr.strip().splitlines()) == 1 and open(copy).read() == water_text
              and open(fitted).read() == fitted_text and not os.path.exists(out), r.stderr[:300])

    # Inputs other than the species files: a manifest (top-level or nested), the method
    # file, a reaction's species file, eval's --against file; each once was replaced, exit 0.
    inner = os.path.join(tmp, "inner.list")
    open(inner, "w").write("copy.yaml\n")
    outer = os.path.join(tmp, "outer.list")
    open(outer, "w").write("inner.list\n")
    method_copy = os.path.join(tmp, "method.yaml")
    open(method_copy, "w").write(open(os.path.join(data, "water-method.yaml")).read())
    energies = os.path.join(data, "water-energies-no-method.yaml")
    kept_files = {p: open(p).read() for p in (inner, outer, method_copy, copy, fitted)}
    rxn = os.path.join(tmp, "rxn.yaml")
    open(rxn, "w").write("species:\n  - {file: copy.yaml, coefficient: -1}\n  - {file: w.yaml, coefficient: 1}\n")
    for args in (["table", inner, "-o", inner], ["table", outer, "-o", inner], ["fit", outer, "-o", outer],
                 ["table", energies, "--method", method_copy, "-o", method_copy],
                 ["reaction", rxn, "-o", copy], ["eval", fitted, "--against", outer, "-o", inner],
                 ["eval", fitted, "--against", tmp, "-o", copy]):
        r = run(*args)
        check(f"{' '.join(os.path.basename(a) for a in args)}: exit 2, inputs kept",
              r.returncode == 2 and "names the input file" in r.stderr and len(r.stderr.strip().splitlines()) == 1
              and all(open(p).read() == t for p, t in kept_files.items()), r.stderr[:300])
    for p in (inner, outer, method_copy, rxn):
        os.remove(p)

    # Files read through a species file: a conformer's file and a 'from' file (both once
    # replaced by -o, exit 0).
    sub = os.path.join(tmp, "through")
    os.makedirs(sub, exist_ok=True)
    for name in ("water.yaml", "water-model-all-modes.molden", "model-conformers.yaml", "water-from-molden.yaml"):
        open(os.path.join(sub, name), "w").write(open(os.path.join(data, name)).read())
    kept_files = {p: open(p).read() for p in (os.path.join(sub, "water.yaml"),
                                              os.path.join(sub, "water-model-all-modes.molden"))}
    for args in (["table", os.path.join(sub, "model-conformers.yaml"), "-o", os.path.join(sub, "water.yaml")],
                 ["fit", os.path.join(sub, "model-conformers.yaml"), "-o", os.path.join(sub, "water.yaml")],
                 ["table", os.path.join(sub, "water-from-molden.yaml"), "-o",
                  os.path.join(sub, "water-model-all-modes.molden")]):
        r = run(*args, "-q")
        check(f"{' '.join(os.path.basename(a) for a in args)}: a file read through the species file is refused",
              r.returncode == 2 and "names the input file" in r.stderr and len(r.stderr.strip().splitlines()) == 1
              and all(open(p).read() == t for p, t in kept_files.items()), r.stderr[:300])

    # --keep-going with every species failing leaves an existing output as it was.
    bad1 = os.path.join(tmp, "b1.yaml")
    open(bad1, "w").write("name: one\natoms:\n  - [Xx, 0, 0, 0]\n")
    bad2 = os.path.join(tmp, "b2.yaml")
    open(bad2, "w").write("name: two\natoms:\n  - [Qq, 0, 0, 0]\n")
    old = os.path.join(tmp, "old.dat")
    for args in (["fit", bad1, bad2], ["modes", bad1, bad2], ["inspect", bad1, bad2], ["report", bad1, bad2]):
        open(old, "w").write("precious\n")
        r = run(*args, "--keep-going", "-o", old)
        check(f"{args[0]} --keep-going, every species failing: exit 1, old output kept",
              r.returncode == 1 and open(old).read() == "precious\n", r.stderr[:300])
    bad_nasa = os.path.join(tmp, "all-bad.dat")
    open(bad_nasa, "w").write("\n".join(line[:20] + "x" + line[21:] if i % 4 == 1 else line
                                        for i, line in enumerate(fitted_text.splitlines()[4:8])) + "\n")
    open(old, "w").write("precious\n")
    r = run("eval", bad_nasa, "--keep-going", "-o", old)
    check("eval --keep-going, every record failing: exit 1, old output kept",
          r.returncode == 1 and open(old).read() == "precious\n", r.stderr[:300])

    # Errors carry their file: a NASA name too long is reported against the species file
    # (it once came as "species '...': name has 24 characters; NASA-7 allows 18" alone).
    long_name = os.path.join(tmp, "long-name.yaml")
    open(long_name, "w").write(water_text.replace("name: H2O", "name: water-with-a-long-name"))
    for form in ("nasa7", "nasa9"):
        r = run("fit", long_name, "--form", form, "-o", out)
        refused(f"fit --form {form} of a 24-character name", r.returncode, r.stderr, "long-name.yaml", out)
    # A name of a million characters is cut in the message (a 50 MB name was echoed whole).
    million = os.path.join(tmp, "million.yaml")
    open(million, "w").write(water_text.replace("name: H2O", "name: " + "N" * 1_000_000))
    r = run("fit", million, "-o", out)
    refused("fit of a 1,000,000-character name", r.returncode, r.stderr, "million.yaml", out)

    # CSV fields quoted per RFC 4180 in eval (a NASA name with a comma and a quote) and
    # reaction (a reaction name with both).
    comma_nasa = os.path.join(tmp, "comma.dat")
    open(comma_nasa, "w").write(fitted_text.replace("H2O               ", 'H2O,"x"           ', 1))
    r = run("eval", comma_nasa, "--temps", "300,1000", "--format", "csv")
    rows = list(csv.reader(io.StringIO(r.stdout)))
    check("eval CSV quotes a name with a comma and a quote",
          r.returncode == 0 and len(rows) == 3 and all(len(row) == len(rows[0]) for row in rows)
          and rows[1][0] == 'H2O,"x"', r.stdout[:300] + r.stderr[:300])
    reaction_copy = os.path.join(tmp, "reaction.yaml")
    text = open(reaction).read()
    text = re.sub(r"(?m)^name:.*$", 'name: \'split, "quoted"\'', text) if re.search(r"(?m)^name:", text) \
        else 'name: \'split, "quoted"\'\n' + text
    species_dir = os.path.dirname(reaction)
    text = re.sub(r"file: *([^,}\s]+)", lambda m: "file: " + os.path.join(species_dir, m.group(1)), text)
    open(reaction_copy, "w").write(text)
    r = run("reaction", reaction_copy, "--temps", "300,1000", "--format", "csv")
    rows = list(csv.reader(io.StringIO(r.stdout)))
    check("reaction CSV quotes a name with a comma and a quote",
          r.returncode == 0 and len(rows) >= 3 and all(len(row) == len(rows[0]) for row in rows)
          and any(row[0] == 'split, "quoted"' for row in rows[1:]), r.stdout[:300] + r.stderr[:300])

checks.finish()
