"""Hostile-input checks found by a new-user trial, beyond the robustness matrix.

Every check here is of the library's documented contract (README, "Errors and
`errstate`"; `wetboil._errors`), not of a published number: one warning per
call and category, no NumPy RuntimeWarning escaping, masked elements are
missing data (NaN, silently) wherever a number is taken, wrong input raises a
WetboilTypeError/WetboilValueError, and an xarray object in gives a labelled
result out. Numbers compared below are the library's own results for the same
input written another way (no external source is needed for that).
"""

from __future__ import annotations

import math
import warnings
from collections import Counter

import numpy as np
import pytest

import wetboil
from wetboil import boiling, chf, departure
from wetboil.fluids import Saturation, water

W = water(T=373.15)
BASE = dict(T=373.15, p=101325.0, rho_l=958.35, rho_v=0.598, h_lv=2.2564e6, sigma=0.0589)


def _record(call):
    with warnings.catch_warnings(record=True) as rec:
        warnings.simplefilter("always")
        result = call()
    return result, Counter(w.category for w in rec)


def test_partition_gives_one_warning_per_category():
    # a wall superheat of 1e6 K leaves Lemmert-Chawla's range and a subcooling of 100 K the partition's
    # own; a negative one is impossible in the frequency closure and in the partition itself
    _, counts = _record(lambda: boiling.partition(np.array([10.0, 1e6, -1.0]), W, convection_coefficient=1500.0,
                                                  subcooling=np.array([5.0, 100.0, 5.0])))
    assert counts[wetboil.RangeWarning] == 1, counts
    assert counts[wetboil.InvalidValueWarning] == 1, counts


def test_partition_strict_mode_still_raises():
    with wetboil.errstate(invalid="raise"), pytest.raises(wetboil.InvalidValueError):
        boiling.partition(np.array([10.0, -1.0]), W, convection_coefficient=1500.0, subcooling=5.0)


def test_lienhard_dhir_small_plate_lets_no_numpy_overflow_warning_out():
    # size**2 overflows for an absurd size: the element is flagged by wetboil's own policy only
    _, counts = _record(lambda: chf.lienhard_dhir(W, "small_flat_plate", np.array([0.01, 1e200])))
    assert RuntimeWarning not in counts, counts
    assert all(issubclass(c, wetboil.WetboilWarning) for c in counts), counts


@pytest.mark.parametrize("call", [
    lambda v: departure.fritz(v, W),
    lambda v: wetboil.validity(departure.fritz, v, W),
    lambda v: departure.fritz(45.0, W.replace(sigma=0.0589 + 0.0 * v)),
    lambda v: chf.lienhard_dhir(W, "small_flat_plate", 1e-4 * v),
])
def test_xarray_variable_gives_a_labelled_result(call):
    xr = pytest.importorskip("xarray")
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", wetboil.RangeWarning)  # the small plate here is outside its range
        out = call(xr.Variable("x", [45.0, 60.0]))
    assert isinstance(out, xr.DataArray) and out.dims == ("x",)


def test_xarray_variable_matches_dataarray():
    xr = pytest.importorskip("xarray")
    a = departure.fritz(xr.Variable("x", [45.0, 60.0]), W)
    b = departure.fritz(xr.DataArray([45.0, 60.0], dims="x"), W)
    np.testing.assert_array_equal(a.values, b.values)


def test_masked_saturation_field_is_missing_data():
    # the element under the mask (a surface tension typed in mN/m) must not be used: NaN, as a masked
    # kernel argument gives, and as a NaN field gives (silently: missing data)
    sigma = np.ma.masked_array([0.0589, 58.9], mask=[False, True])
    out, counts = _record(lambda: departure.fritz(45.0, Saturation(**{**BASE, "sigma": sigma})))
    assert np.isnan(out[1]) and not counts, (out, counts)
    assert out[0] == departure.fritz(45.0, Saturation(**BASE))


def test_saturation_integer_beyond_float64_is_a_value_error():
    with pytest.raises(wetboil.WetboilValueError, match="beyond the range of float64"):
        Saturation(**{**BASE, "T": 10**400})


def test_saturation_explicit_nan_field_still_propagates_silently():
    out, counts = _record(lambda: departure.fritz(45.0, Saturation(**{**BASE, "sigma": float("nan")})))
    assert math.isnan(out) and not counts


def test_deeply_nested_toml_is_a_file_error(tmp_path):
    deep = "x = " + "[" * 5000 + "]" * 5000 + "\n"
    (tmp_path / "s.toml").write_text(deep)
    with pytest.raises(wetboil.WetboilValueError, match="nested too deeply"):
        wetboil.load_surfaces(tmp_path / "s.toml")
    from wetboil.report import load_spec

    with pytest.raises(wetboil.WetboilValueError, match="nested too deeply"):
        load_spec(tmp_path / "s.toml")


def test_endless_input_file_is_refused_not_read_into_memory():
    # in a child capped at 4 GiB of address space, so that a regression fails (MemoryError) instead of
    # filling the machine's memory
    import os
    import subprocess
    import sys

    if not os.path.exists("/dev/zero"):
        pytest.skip("no /dev/zero")
    code = (
        "import resource; resource.setrlimit(resource.RLIMIT_AS, (4 << 30, 4 << 30))\n"
        "import wetboil\nfrom wetboil.report import load_spec\n"
        "for f in (load_spec, wetboil.load_surfaces):\n"
        "    try:\n        f('/dev/zero')\n    except wetboil.WetboilValueError as e:\n"
        "        assert 'MiB' in str(e), e\n    else:\n        raise SystemExit('no error')\n"
    )
    run = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, timeout=120,
                         env={**os.environ, "PYTHONPATH": os.pathsep.join(sys.path)})
    assert run.returncode == 0, run.stderr[-2000:]


def test_a_nan_the_caller_passes_is_missing_data_not_a_field_left_out():
    # [contract] an optional Saturation field left out makes a kernel that needs it warn that it was
    # not given; a NaN the caller passes (math.nan as much as np.nan) is missing data and propagates
    # silently, as NaN inputs do everywhere (outside trial: math.nan was the "not given" marker itself).
    import math
    import warnings

    from wetboil.fluids import Saturation
    from wetboil.nucleation import onset_superheat

    base = dict(T=373.124, p=101325.0, rho_l=958.35, rho_v=0.5982, h_lv=2.2564e6, sigma=0.05891)
    with pytest.warns(wetboil.WetboilWarning, match="k_l"):
        assert math.isnan(onset_superheat(1e5, Saturation(**base)))
    for nan in (math.nan, float("nan"), np.nan):
        with warnings.catch_warnings():
            warnings.simplefilter("error")
            assert math.isnan(onset_superheat(1e5, Saturation(**base, k_l=nan)))
    left_out = Saturation(**base)
    assert left_out._not_given() == left_out.replace(sigma=0.05)._not_given()
    assert "k_l" in left_out._not_given() and "k_l" not in Saturation(**base, k_l=math.nan)._not_given()


@pytest.mark.parametrize("value", [
    np.array([45.0, "45"], dtype=object),   # text NumPy would parse as a number
    [True, 45.0],                           # True would be 1 deg
    [[45.0, 50.0], [60.0, "x"]],
    bytearray(b"ab"),                       # would be read as the angles 97 and 98 deg
])
def test_text_and_booleans_among_numbers_are_refused(value):
    # [contract] wrong types raise WetboilTypeError (a TypeError), as a bare "45" or True already did
    # (outside robustness trial: these were accepted silently)
    with pytest.raises(wetboil.WetboilTypeError, match="contact_angle_deg"):
        wetboil.wetting.wenzel(value, 1.2)
