"""The notebook-style example runs as shipped, with and without matplotlib."""
import os
import subprocess
import sys


def run_example(root, tmp_path, *python_args):
    env = dict(os.environ, MPLBACKEND="Agg")
    return subprocess.run([sys.executable, *python_args, str(root / "examples/screening.py"), str(tmp_path)],
                          capture_output=True, text=True, env=env, cwd=tmp_path, timeout=300)


def test_example_runs_and_plots(root, tmp_path):
    result = run_example(root, tmp_path)
    assert result.returncode == 0, result.stderr
    assert "7 species:" in result.stdout and "NASA-7 fitted" in result.stdout
    try:
        import matplotlib  # noqa: F401
    except ImportError:
        assert "plot skipped" in result.stdout
    else:
        assert (tmp_path / "cp.png").stat().st_size > 1000


def test_example_skips_the_plot_without_matplotlib(root, tmp_path):
    # A path entry whose matplotlib package fails to import, as when it is not installed.
    fake = tmp_path / "no-matplotlib"
    (fake / "matplotlib").mkdir(parents=True)
    (fake / "matplotlib" / "__init__.py").write_text("raise ImportError('not installed')\n")
    env_path = os.pathsep.join([str(fake), os.environ.get("PYTHONPATH", "")])
    env = dict(os.environ, PYTHONPATH=env_path)
    result = subprocess.run([sys.executable, str(root / "examples/screening.py"), str(tmp_path)],
                            capture_output=True, text=True, env=env, cwd=tmp_path, timeout=300)
    assert result.returncode == 0, result.stderr
    assert "matplotlib is not installed: plot skipped" in result.stdout
    assert not (tmp_path / "cp.png").exists()
