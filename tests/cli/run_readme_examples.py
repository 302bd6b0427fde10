#!/usr/bin/env python3
"""Runs every `build/vibtherm ...` command shown in README.md with the built executable,
from the project root, and checks that each exits 0. Output files go to a temporary dir.

Usage: run_readme_examples.py VIBTHERM_EXE PROJECT_ROOT
"""
import os
import re
import shlex
import subprocess
import sys
import tempfile

exe, root = sys.argv[1], sys.argv[2]
commands = [line.strip() for line in open(os.path.join(root, "README.md"), encoding="utf-8")
            if line.strip().startswith("build/vibtherm ")]
if not commands:
    sys.exit("README.md shows no build/vibtherm commands")
failed = 0
with tempfile.TemporaryDirectory() as tmp:
    for command in commands:
        args = shlex.split(command)
        args[0] = exe
        # Relative output files land in the temporary directory, not in the tree.
        for i, a in enumerate(args):
            if args[i - 1] in ("-o", "--output", "--svg") and i > 0:
                args[i] = os.path.join(tmp, os.path.basename(a))
        result = subprocess.run(args, cwd=root, capture_output=True, text=True)
        status = "ok" if result.returncode == 0 else f"FAILED ({result.returncode})"
        print(f"{status}: {command}")
        if result.returncode != 0:
            print(result.stderr)
            failed += 1
print(f"{len(commands) - failed} passed, {failed} failed")
sys.exit(1 if failed else 0)
