"""The README's code runs as printed (a regression test of the docs, not a
reference check), and its two set-up commands are the ones CI runs."""

import math
import pathlib
import re
import warnings

import pytest

ROOT = pathlib.Path(__file__).parent.parent
README = (ROOT / "README.md").read_text()


def test_tour_runs():
    pytest.importorskip("xarray")
    import wetboil

    blocks = re.findall(r"```python\n(.*?)```", README, re.S)
    assert len(blocks) >= 2
    ns: dict = {}
    exec(compile(blocks[0], "README tour", "exec"), ns)
    with pytest.raises(wetboil.InvalidValueError):
        exec(compile(blocks[1], "README errstate", "exec"), ns)
    # and as its comments say: the first call inside the block is computed, without a warning
    first = blocks[1].splitlines()[1].split("#")[0].strip()
    assert first.startswith("chf.kandlikar(")
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        with wetboil.errstate(invalid="raise", out_of_range="ignore"):
            assert math.isfinite(eval(first, ns))


def test_two_commands_and_ci():
    commands = re.findall(r"```bash\n(.*?)\n```", README.split("## Cautions")[0], re.S)
    assert commands == ["bash tools/demo.sh", "bash tools/test.sh"]
    assert "bash tools/test.sh" in (ROOT / ".ci" / "run").read_text()
    flat = " ".join(README.split())
    assert "## Cautions" in README and "licensed engineering practice" in flat and "safety factor" in flat


def test_setup_names_the_versions_the_build_needs():
    # A fresh machine needs what pyproject.toml (requires-python) and Cargo.toml (rust-version) demand;
    # a distribution's older python3 or cargo fails inside tools/setup.sh, so the README's set-up
    # paragraph must name both minimum versions (the project's own files are the source here).
    top = " ".join(README.split("## Cautions")[0].split())
    py = re.search(r'requires-python\s*=\s*">=([\d.]+)"', (ROOT / "pyproject.toml").read_text()).group(1)
    rust = re.search(r'rust-version\s*=\s*"([\d.]+)"', (ROOT / "Cargo.toml").read_text()).group(1)
    assert f"Python {py} or newer" in top
    assert f"Rust {rust} or newer" in top
    assert "PYTHON=" in top and "PYTHON" in (ROOT / "tools" / "setup.sh").read_text()
