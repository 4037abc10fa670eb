"""pandas inputs: a Series (or DataFrame) in gives a Series (or DataFrame) out
with the same index, as NumPy's own ufuncs do, computed by position (labels
are not aligned: different indexes are refused). Expected numbers come from
the NumPy path of the same function."""

import warnings

import numpy as np
import pytest

pd = pytest.importorskip("pandas")

import kernel_cases as kc  # noqa: E402
import wetboil  # noqa: E402
from wetboil import WetboilTypeError, WetboilValueError  # noqa: E402
from wetboil.chf import kandlikar  # noqa: E402
from wetboil.departure import fritz  # noqa: E402
from wetboil.fluids import water  # noqa: E402

W = water(p=101325.0)


@pytest.mark.parametrize("name", sorted(kc.BY_KERNEL))
def test_every_kernel_function_keeps_a_series_index(name):
    f, spec = kc.BY_KERNEL[name]
    if name.startswith("water_saturation"):
        pytest.skip("returns a Saturation, whose fields are NumPy arrays (see test_a_fluid_state_from_a_series)")
    rng = np.random.default_rng(5)
    n = 7
    args = kc.draw_args(spec, rng, n)
    array_params = [p for p in spec.params if isinstance(args[p], np.ndarray) and args[p].shape == (n,)]
    if not array_params:
        pytest.skip("no array argument of its own (fluid fields only)")
    index = pd.Index([f"candidate {i}" for i in range(n)], name="surface")
    as_series = dict(args, **{array_params[0]: pd.Series(args[array_params[0]], index=index)})
    with warnings.catch_warnings(), np.errstate(all="ignore"):
        warnings.simplefilter("ignore")
        expect = kc.outputs(kc.call(f, spec, args))
        got = kc.outputs(kc.call(f, spec, as_series))
    names = kc.output_names(spec)
    assert len(got) == len(expect) == len(names)
    for g, e, out_name in zip(got, expect, names):
        assert isinstance(g, pd.Series), type(g)
        assert g.index.equals(index) and g.name == out_name
        np.testing.assert_array_equal(g.to_numpy(), e)


def test_units_and_validity_follow_the_series():
    theta = pd.Series([20.0, 45.0, 200.0], index=["a", "b", "c"])
    with pytest.warns(wetboil.InvalidValueWarning):
        d = fritz(theta, W)
    assert d.attrs == {"units": "m"} and d.name == "departure_diameter"
    codes = wetboil.validity(fritz, theta, W)
    assert isinstance(codes, pd.Series) and list(codes) == [0, 0, 1] and list(codes.index) == ["a", "b", "c"]


def test_dataframe_in_dataframe_out():
    df = pd.DataFrame({"advancing": [60.0, 80.0], "receding": [30.0, 50.0]}, index=["x", "y"])
    out = fritz(df, W)
    assert isinstance(out, pd.DataFrame) and out.index.equals(df.index) and out.columns.equals(df.columns)
    np.testing.assert_array_equal(out.to_numpy(), fritz(df.to_numpy(), W))


def test_missing_values_of_nullable_dtypes_are_nan():
    s = pd.Series([30.0, None], dtype="Float64")
    out = fritz(s, W)
    assert np.isnan(out.iloc[1]) and out.iloc[0] == fritz(30.0, W)


def test_different_indexes_are_refused_not_aligned():
    beta = pd.Series([30.0, 40.0], index=["a", "b"])
    phi = pd.Series([0.0, 90.0], index=["b", "a"])
    with pytest.raises(WetboilValueError, match="different indexes"):
        kandlikar(beta, W, phi)
    # the same index: by position, as NumPy
    np.testing.assert_array_equal(kandlikar(beta, W, phi.set_axis(beta.index)).to_numpy(),
                                  kandlikar(beta.to_numpy(), W, phi.to_numpy()))


def test_non_numeric_series_is_a_type_error():
    with pytest.raises(WetboilTypeError, match="real numbers"):
        fritz(pd.Series(["30", "40"]), W)
    with pytest.raises(WetboilTypeError, match="real numbers"):
        fritz(pd.Series([True, False]), W)


def test_a_fluid_state_from_a_series():
    # a Saturation holds NumPy fields (documented): the state is right, the index is not kept
    p = pd.Series([1.0e5, 2.0e5], index=["low", "high"])
    state = water(p=p)
    assert isinstance(state.T, np.ndarray)
    np.testing.assert_array_equal(state.T, water(p=p.to_numpy()).T)
