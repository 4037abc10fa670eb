"""The typed face: the package type-checks and its stubs match the runtime
(mypy's stubtest compares every public name, signature and default)."""

import pathlib
import subprocess
import sys

import pytest

pytest.importorskip("mypy")
ROOT = pathlib.Path(__file__).parent.parent


def test_stubtest_matches_runtime():
    r = subprocess.run(
        [sys.executable, "-m", "mypy.stubtest", "wetboil", "--mypy-config-file", str(ROOT / "pyproject.toml")],
        capture_output=True, text=True, timeout=600, cwd=ROOT,
    )
    assert r.returncode == 0, r.stdout[-6000:] + r.stderr[-2000:]
