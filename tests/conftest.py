"""Shared test configuration.

Hypothesis explores new examples on every developer run; under CI (the CI
environment variable set, as `.ci/run` is) it runs a fixed, reproducible set
so that a red build always points at a reproducible failure.
"""

import math
import os

import pytest

try:
    from hypothesis import settings

    settings.register_profile("ci", derandomize=True, print_blob=True)
    if os.environ.get("CI"):
        settings.load_profile("ci")
except ImportError:  # pragma: no cover
    pass



@pytest.fixture
def novec649_zuber():
    """For the tests of properties CoolProp lacks: skip unless CoolProp (the reference library) has
    Novec649 without a surface-tension model, and return Zuber's CHF (pi/24) worked by hand at
    pressure `p` [Pa] from CoolProp's saturated densities and latent heat and a given `sigma` [N/m]."""
    CP = pytest.importorskip("CoolProp.CoolProp")
    try:
        CP.PropsSI("I", "P", 1e5, "Q", 0, "Novec649")
        pytest.skip("this CoolProp has a surface-tension model for Novec649")
    except ValueError:
        pass

    def zuber(p, sigma):
        rl, rv = CP.PropsSI("D", "P", p, "Q", 0, "Novec649"), CP.PropsSI("D", "P", p, "Q", 1, "Novec649")
        hlv = CP.PropsSI("H", "P", p, "Q", 1, "Novec649") - CP.PropsSI("H", "P", p, "Q", 0, "Novec649")
        return math.pi / 24 * hlv * math.sqrt(rv) * (sigma * 9.80665 * (rl - rv)) ** 0.25

    return zuber
