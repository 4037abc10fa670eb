"""The benchmark baselines compute what wetboil computes.

`benches/formulas.py` writes every kernel's formula a second time, by hand, as
NumPy expressions and with Python's ``math`` module; `benches/run.py` times
wetboil against them. A baseline that drifted away from its kernel (a wrong
constant, a missing branch) would make every printed ratio meaningless, so
this file runs the benchmark's own agreement check on a small draw for every
kernel.

This is a consistency check of the benchmark, not a validation of the models:
both sides are our own code. The published values live in test_references.py
and the per-topic test files.
"""

from __future__ import annotations

import os
import sys

import pytest

import wetboil

sys.path.insert(0, os.path.join(os.path.dirname(__file__), "..", "benches"))
import formulas  # noqa: E402

KERNELS = sorted(m.name for m in wetboil.models())
COMPARED = [k for k in KERNELS if k not in formulas.NOT_COMPARED]


def test_every_kernel_has_a_baseline_or_a_reason():
    missing = [k for k in KERNELS if k not in formulas.NOT_COMPARED and (k not in formulas.NUMPY or k not in formulas.PYTHON)]
    assert not missing, f"no hand-written NumPy and math formula in benches/formulas.py for {missing}"
    stale = sorted((set(formulas.NUMPY) | set(formulas.PYTHON) | set(formulas.NOT_COMPARED)) - set(KERNELS))
    assert not stale, f"benches/formulas.py names kernels that do not exist: {stale}"


@pytest.mark.parametrize("kernel", COMPARED)
def test_baseline_agrees_with_the_kernel(kernel):
    # 400 array points and one scalar point from the test suite's physical ranges
    why = formulas.check(kernel, n=400, seed=0)
    assert why == "", why


def test_the_check_catches_a_wrong_baseline(monkeypatch):
    # a baseline with the Fritz constant off by 1 % must be reported
    right = formulas.NUMPY["fritz_departure"]
    monkeypatch.setitem(formulas.NUMPY, "fritz_departure", lambda *x: 1.01 * right(*x))
    assert "differ" in formulas.check("fritz_departure", n=50)
    right_py = formulas.PYTHON["fritz_departure"]
    monkeypatch.setitem(formulas.PYTHON, "fritz_departure", lambda *x: 1.01 * right_py(*x))
    assert "Python output" in formulas.check("fritz_departure", n=50)
