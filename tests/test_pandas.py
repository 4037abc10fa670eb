"""pandas inputs: a Series (or DataFrame) in gives a Series (or DataFrame) out
with the same index, as NumPy's own ufuncs do, computed by position: pandas
inputs must all have the result's shape and one index (labels are neither
aligned nor broadcast). Expected numbers come from the NumPy path of the same
function."""

import warnings

import numpy as np
import pytest

pd = pytest.importorskip("pandas")

import kernel_cases as kc  # noqa: E402
import wetboil  # noqa: E402
from wetboil import WetboilTypeError, WetboilValueError  # noqa: E402
from wetboil import InvalidValueError, InvalidValueWarning  # noqa: E402
from wetboil.chf import kandlikar, lienhard_dhir  # noqa: E402
from wetboil.departure import fritz  # noqa: E402
from wetboil.fluids import water  # noqa: E402
from wetboil.nucleation import site_density  # noqa: E402
from wetboil.wetting import wenzel  # noqa: E402

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
    assert out.attrs == {"units": "m"}  # a DataFrame has no name (README)
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
    with pytest.raises(WetboilValueError, match="different indexes"):
        kandlikar(beta.to_frame(), W, phi.to_frame())
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


ANGLES = pd.DataFrame({"advancing": [60.0, 80.0, 70.0], "receding": [30.0, 50.0, 40.0]}, index=["x", "y", "z"])
ROUGH = pd.Series([1.1, 1.3], index=["advancing", "receding"])  # meant for the rows: the wrong axis


@pytest.mark.parametrize("args, problem", [
    ((ANGLES, ROUGH), "of shapes"), ((ROUGH, ANGLES), "of shapes"),  # a Series and a DataFrame never mix
    ((ANGLES, ANGLES["advancing"] * 0 + 1.2), "of shapes"),  # a Series on the DataFrame's row index either
    ((pd.Series([30.0, 40.0]), np.ones((3, 2))), "of shapes"),  # a Series against a 2-D ndarray
    ((np.array([30.0, 40.0]), pd.Series([1.2])), "of shapes"),  # a length-1 Series
    ((ANGLES, ANGLES[["receding", "advancing"]]), "different columns"),  # same index, other columns
], ids=["df-s", "s-df", "df-row-s", "s-2d", "len1", "columns"])
def test_pandas_inputs_must_have_the_result_shape_and_labels(args, problem):
    with pytest.raises(WetboilValueError, match=r"result's shape and one index.*neither aligns labels nor "
                                                r"broadcasts them: pass \.to_numpy\(\)") as info:
        wenzel(*args)
    assert problem in str(info.value)
    assert "contact_angle_deg" not in str(info.value) and "roughness_ratio" not in str(info.value)
    plain = [a.to_numpy() if hasattr(a, "to_numpy") else a for a in args]
    try:
        np.broadcast_shapes(*(np.shape(a) for a in plain))
    except ValueError:
        return  # a Series on the row index does not broadcast by position either
    with wetboil.errstate(out_of_range="ignore"):
        assert type(wenzel(*plain)) is np.ndarray  # .to_numpy() broadcasts by position, as the message says


@pytest.mark.filterwarnings("ignore::wetboil.RangeWarning")
def test_same_shape_and_labels_are_computed_by_position():
    rough = pd.DataFrame(np.array([[1.1, 1.2], [1.3, 1.4], [1.5, 1.6]]), index=ANGLES.index, columns=ANGLES.columns)
    a, r = ANGLES.to_numpy(), rough.to_numpy()
    for got, expect in [(wenzel(ANGLES, rough), wenzel(a, r)),
                        (wenzel(ANGLES, np.array([1.1, 1.2])), wenzel(a, np.array([1.1, 1.2]))),  # ndarray: by position
                        (wenzel(ANGLES, 1.2), wenzel(a, 1.2))]:
        assert isinstance(got, pd.DataFrame) and got.index.equals(ANGLES.index) and got.columns.equals(ANGLES.columns)
        np.testing.assert_array_equal(got.to_numpy(), expect)
    s, t = ANGLES["advancing"], rough["receding"]
    for got, expect in [(wenzel(s, t), wenzel(s.to_numpy(), t.to_numpy())), (wenzel(s, 1.2), wenzel(s.to_numpy(), 1.2)),
                        (wenzel(pd.Series([60.0], index=["k"]), 1.2), wenzel(np.array([60.0]), 1.2))]:
        assert isinstance(got, pd.Series) and got.name == "apparent_angle_deg"
        np.testing.assert_array_equal(got.to_numpy(), expect)


def test_results_are_wetboil_buffers_not_copies():
    from numpy._core.multiarray import get_handler_name  # numpy >= 2

    def allocator(a):
        while isinstance(a.base, np.ndarray):
            a = a.base
        return get_handler_name(a)

    assert allocator(fritz(ANGLES, W).to_numpy()) == "wetboil_buffer_cache"
    assert allocator(fritz(ANGLES["advancing"], W).to_numpy()) == "wetboil_buffer_cache"


def test_float32_series_in_python_arithmetic_matches_the_ndarray_call():
    size = np.array([1.0e-3, 2.5e-3, 7.0e-3, 1.3e-2], dtype=np.float32)
    index = pd.Index(list("pqrs"))
    with wetboil.errstate(out_of_range="ignore"):
        expect = lienhard_dhir(W, "small_flat_plate", size)
        got = lienhard_dhir(W, "small_flat_plate", pd.Series(size, index=index))
        nullable = lienhard_dhir(W, "small_flat_plate", pd.Series(size, index=index, dtype="Float32"))
    for g in (got, nullable):
        assert isinstance(g, pd.Series) and g.index.equals(index)
        np.testing.assert_array_equal(g.to_numpy(), expect)


def test_nullable_integers_and_floats_with_na():
    beta = pd.Series([30, pd.NA, 45], dtype="Int64")
    phi = pd.Series([0.0, 10.0, pd.NA], dtype="Float64")
    out = kandlikar(beta, W, phi)
    assert isinstance(out, pd.Series) and out.dtype == np.float64
    np.testing.assert_array_equal(out.to_numpy(), kandlikar(np.array([30.0, np.nan, 45.0]), W,
                                                            np.array([0.0, 10.0, np.nan])))


def test_object_series_follow_the_ndarray_rules():
    out = fritz(pd.Series([30.0, 45], dtype=object, index=["a", "b"]), W)
    assert list(out.index) == ["a", "b"]
    np.testing.assert_array_equal(out.to_numpy(), fritz(np.array([30.0, 45.0]), W))
    mixed = pd.DataFrame({"x": pd.Series([30.0, 45], dtype=object), "y": [50.0, 60.0]})
    np.testing.assert_array_equal(fritz(mixed, W).to_numpy(), fritz(np.array([[30.0, 50.0], [45.0, 60.0]]), W))
    for bad in (pd.Series([30.0, None], dtype=object), mixed.assign(y=pd.Series([None, 60.0], dtype=object))):
        with pytest.raises(WetboilTypeError, match="contains None; use nan for a missing value"):
            fritz(bad, W)
    with pytest.raises(WetboilTypeError, match="real numbers, got dtype object"):
        fritz(pd.Series([30.0, "forty"], dtype=object), W)


@pytest.mark.parametrize("empty", [pd.Series([]), pd.Series([], dtype=object), pd.Series([], dtype="float32")],
                         ids=["default", "object", "float32"])
def test_an_empty_series_works_like_an_empty_array(empty):
    out = fritz(empty, W)
    assert isinstance(out, pd.Series) and out.shape == (0,) and out.dtype == np.float64
    assert out.name == "departure_diameter"


def test_validity_of_a_method_picking_function_follows_the_series():
    dT = pd.Series([5.0, 10.0, 500.0, np.nan], index=list("abcd"))
    theta = pd.Series([30.0, 60.0, 90.0, 45.0], index=dT.index)
    codes = wetboil.validity(site_density, dT, W, theta, method="basu")
    assert isinstance(codes, pd.Series) and codes.index.equals(dT.index) and codes.name == "validity"
    assert codes.dtype == np.int8
    np.testing.assert_array_equal(codes.to_numpy(),
                                  wetboil.validity(site_density, dT.to_numpy(), W, theta.to_numpy(), method="basu"))
    assert len(set(codes)) > 1


def test_one_warning_per_call_and_strict_mode_with_a_series():
    theta = pd.Series([20.0, 200.0, 250.0], index=["a", "b", "c"])
    size = pd.Series([0.01, -0.01, -0.02], dtype=np.float32)
    for call in (lambda: fritz(theta, W), lambda: lienhard_dhir(W, "small_flat_plate", size)):
        with warnings.catch_warnings(record=True) as caught:
            warnings.simplefilter("always")
            call()
        invalid = [w for w in caught if issubclass(w.category, InvalidValueWarning)]
        assert len(invalid) == 1 and "2 of 3" in str(invalid[0].message)
        with wetboil.errstate(invalid="raise", out_of_range="ignore"), pytest.raises(InvalidValueError):
            call()


def test_a_list_of_methods_keeps_the_index_as_a_coordinate():
    from wetboil.departure import diameter, frequency

    d = pd.Series([1.0e-3, 2.0e-3], index=pd.Index(["a", "b"], name="surface"))
    f = frequency(d, W, method=["zuber", "cole"])
    assert f.dims == ("method", "surface") and list(f["surface"].values) == ["a", "b"]
    np.testing.assert_array_equal(f.sel({"method": "cole"}).values, frequency(d.to_numpy(), W, method="cole"))
    dd = diameter(pd.Series([30.0, 60.0], index=pd.Index(["x", "y"], name="surface")), W,
                  method=["fritz", "kocamustafaogullari_ishii"])
    assert list(dd["surface"].values) == ["x", "y"]
