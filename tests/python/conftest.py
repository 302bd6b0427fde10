"""pytest set-up for the Python module tests: ctest passes the built executable and the
repository root in VIBTHERM_EXE and VIBTHERM_ROOT, and the module's folder in PYTHONPATH
(see tests/CMakeLists.txt)."""
import json
import os
import pathlib
import subprocess

import pytest

ROOT = pathlib.Path(os.environ.get("VIBTHERM_ROOT", pathlib.Path(__file__).resolve().parents[2]))


@pytest.fixture(scope="session")
def root():
    return ROOT


@pytest.fixture(scope="session")
def cli():
    """Runs `vibtherm ARGS... --format json` (or the given form) and returns the parsed JSON."""
    exe = os.environ.get("VIBTHERM_EXE")
    if not exe:
        pytest.skip("VIBTHERM_EXE not set (run through ctest)")

    def run(*args):
        result = subprocess.run([exe, "-q", *map(str, args)], capture_output=True, text=True, cwd=ROOT)
        assert result.returncode == 0, result.stderr
        return json.loads(result.stdout)

    return run
