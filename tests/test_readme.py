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
