#!/usr/bin/env python3
"""Batches: -j gives the same bytes for any thread count; outputs are written together or
not at all, never over an input, keep their mode and write through symbolic links.

Usage: scale_checks.py VIBTHERM_EXE PROJECT_ROOT
"""
import os
import stat
import sys
import tempfile

from harness import Checks

exe, root = sys.argv[1], sys.argv[2]
examples = os.path.join(root, "examples", "fuel-additive")
data = os.path.join(root, "tests", "data")
water = os.path.join(examples, "water.yaml")
checks = Checks(exe)
run, check = checks.run, checks.check

# Byte-identical output (and stderr) for 1, 2 and 5 threads, every subcommand.
inputs = [examples, os.path.join(data, "ethane_rotor.yaml"), os.path.join(data, "adsorbed-water.yaml"),
          os.path.join(data, "argon.yaml")]
for args in (["table", "--format", "csv", "--breakdown"], ["table", "--format", "json"], ["table"],
             ["fit", "--allow-missing-hf"], ["fit", "--form", "json", "--allow-missing-hf"],
             ["fit", "--form", "nasa9", "--allow-missing-hf", "--range", "200:auto:6000"],
             ["inspect", "--format", "json"], ["modes", "--format", "csv"],
             ["report", "--allow-missing-hf", "-o", "-"]):
    outs = [run(*args, *inputs, "-j", str(j)) for j in (1, 2, 5)]
    check(f"-j 1/2/5 give the same bytes: {' '.join(args)}",
          all(o.returncode == 0 for o in outs) and len({o.stdout for o in outs}) == 1
          and len({o.stderr for o in outs}) == 1, outs[0].stderr[-300:])

with tempfile.TemporaryDirectory() as tmp:
    # The first error in input order is the one reported, whatever the thread count.
    bad1 = os.path.join(tmp, "b1.yaml")
    open(bad1, "w").write("name: one\natoms:\n  - [Xx, 0, 0, 0]\n")
    bad2 = os.path.join(tmp, "b2.yaml")
    open(bad2, "w").write("name: two\natoms:\n  - [Qq, 0, 0, 0]\n")
    errs = {run("table", water, bad1, water, bad2, "-j", str(j)).stderr for j in (1, 2, 4)}
    check("first error in input order for any -j", len(errs) == 1 and "b1.yaml" in errs.pop())

    # -o naming an input is refused and the input is untouched.
    copy = os.path.join(tmp, "w.yaml")
    open(copy, "w").write(open(water).read())
    r = run("table", copy, "-o", copy)
    check("-o naming an input: exit 2", r.returncode == 2 and "names the input file" in r.stderr, r.stderr)
    check("-o naming an input: input kept", open(copy).read() == open(water).read())

    # modes -o m.txt --svg missing-dir/m.svg: exit 2, m.txt not written.
    m = os.path.join(tmp, "m.txt")
    r = run("modes", water, "-o", m, "--svg", os.path.join(tmp, "missing", "m.svg"))
    check("--svg into a missing directory: exit 2, -o not written", r.returncode == 2 and not os.path.exists(m),
          r.stderr)

    # --keep-going with every species failing leaves the old output as it was.
    old = os.path.join(tmp, "old.csv")
    open(old, "w").write("precious\n")
    r = run("table", bad1, bad2, "--keep-going", "-o", old)
    check("keep-going, all failed: exit 1, old output kept", r.returncode == 1 and open(old).read() == "precious\n",
          r.stderr)

    # A replaced output keeps its mode; a symbolic link is written through.
    kept = os.path.join(tmp, "kept.txt")
    open(kept, "w").write("x")
    os.chmod(kept, 0o600)
    r = run("table", water, "-o", kept)
    check("replaced output keeps mode 600", r.returncode == 0 and stat.S_IMODE(os.stat(kept).st_mode) == 0o600)
    real = os.path.join(tmp, "real.txt")
    open(real, "w").write("x")
    link = os.path.join(tmp, "link.txt")
    os.symlink(real, link)
    r = run("table", water, "-o", link)
    check("symbolic link written through", r.returncode == 0 and os.path.islink(link) and
          open(real).read().startswith("== H2O =="), r.stderr)
    check("no temporary files left", sorted(os.listdir(tmp)) == sorted(
        ["b1.yaml", "b2.yaml", "w.yaml", "old.csv", "kept.txt", "real.txt", "link.txt"]), str(os.listdir(tmp)))

# Non-regular files are refused with one located line.
r = run("table", "/dev/zero")
check("/dev/zero refused", r.returncode == 2 and len(r.stderr.strip().splitlines()) == 1, r.stderr)

with tempfile.TemporaryDirectory() as tmp:
    zero = os.path.join(tmp, "zero.yaml")
    os.symlink("/dev/zero", zero)
    r = run("table", zero)
    check("a .yaml link to /dev/zero refused", r.returncode == 2 and "not a regular file" in r.stderr, r.stderr)

    body = "".join(line for line in open(water) if not line.startswith("name:"))  # water without its name
    def species(file, name):
        path = os.path.join(tmp, file)
        open(path, "w").write(f"name: '{name}'\n" + body)
        return path
    # fit refuses NASA-7 names that a reader takes as a keyword or a comment, naming the file.
    for file, name in (("endo.yaml", "ENDO"), ("thermox.yaml", "THERMOX"), ("bang.yaml", "C!H4"),
                       ("reac.yaml", "REACTIONS")):
        r = run("fit", species(file, name), "-o", os.path.join(tmp, "out.dat"))
        check(f"fit refuses the NASA-7 name {name}", r.returncode == 2 and r.stderr.startswith(file) is False and
              file in r.stderr and len(r.stderr.strip().splitlines()) == 1, r.stderr)
    # A 100,000-character name is cut in messages.
    r = run("fit", species("long.yaml", "N" * 100000))
    check("long name cut in the error line", r.returncode == 2 and len(r.stderr) < 2000 and "long.yaml" in r.stderr,
          r.stderr[:200])
    # CSV fields quoted per RFC 4180.
    import csv
    import io
    for sub in (["table", "--temps", "300"], ["inspect"], ["modes", "--temps", "300"]):
        r = run(*sub, species("comma.yaml", 'a,b "c"'), "--format", "csv")
        rows = list(csv.reader(io.StringIO(r.stdout)))
        check(f"{sub[0]} CSV quotes a name with a comma", r.returncode == 0 and len(rows) > 1 and
              all(len(row) == len(rows[0]) for row in rows) and rows[1][0] == 'a,b "c"', r.stdout[:300])

sys.exit(checks.finish())
