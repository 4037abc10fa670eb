"""The typed face: the package type-checks and its stubs match the runtime
(mypy's stubtest compares every public name, signature and default)."""

import pathlib
import subprocess
import sys

import pytest

pytest.importorskip("mypy")
ROOT = pathlib.Path(__file__).parent.parent


def test_stubtest_matches_runtime(tmp_path):
    import wetboil

    # The extension exports one ufunc per registered kernel; _core.pyi types
    # them through a module __getattr__, which stubtest does not read, so the
    # exact list of kernel names (and nothing else) is allowed here.
    # wetboil.__main__ runs the command line on import and cannot be imported;
    # _errors._Action is a Literal alias, which stubtest mistakes for a Union;
    # _core.__all__ lists those ufuncs too.
    allow = tmp_path / "allowlist.txt"
    names = [f"wetboil._core.{m.name}{suffix}" for m in wetboil.models() for suffix in ("", "_status")] + ["wetboil.__main__", "wetboil._errors._Action", "wetboil._core.__all__"]
    allow.write_text("\n".join(names) + "\n")
    r = subprocess.run(
        [sys.executable, "-m", "mypy.stubtest", "wetboil", "--mypy-config-file", str(ROOT / "pyproject.toml"),
         "--allowlist", str(allow)],
        capture_output=True, text=True, timeout=600, cwd=ROOT,
    )
    assert r.returncode == 0, r.stdout[-6000:] + r.stderr[-2000:]
