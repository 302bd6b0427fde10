"""Shared pieces of the command-line check scripts: run the executable, record named
checks, print the closing 'N passed, N failed' line and exit accordingly."""
import subprocess
import sys


class Checks:
    def __init__(self, exe):
        self.exe = exe
        self.results = []

    def run(self, *args):
        return subprocess.run([self.exe, *args], capture_output=True, text=True)

    def check(self, name, condition, detail=""):
        self.results.append(bool(condition))
        print(("ok    " if condition else "FAIL  ") + name + ("" if condition else f"  {detail}"))

    def finish(self):
        failed = self.results.count(False)
        print(f"{len(self.results) - failed} passed, {failed} failed")
        sys.exit(1 if failed else 0)
