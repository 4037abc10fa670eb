"""The binding contract: the one ufunc mechanism and the one front door.

These tests check behaviour (dtypes, layouts, broadcasting, errors), not
physics; reference values live in test_references.py. The expected values
here are the same formula evaluated by NumPy, an independent implementation.
"""

import inspect
import math
import os
import pickle
import subprocess
import sys
import warnings

import numpy as np
import pytest

import wetboil
from wetboil import _core

import kernel_cases as kc
from wetboil.chf import kandlikar, zuber
from wetboil.departure import fritz
from wetboil.fluids import Saturation
from wetboil.nucleation import embryo_radius, embryo_superheat

WATER = Saturation(T=373.124, p=101325.0, rho_l=958.35, rho_v=0.59817, h_lv=2.2564e6, sigma=0.058912)
G = 9.80665


def np_fritz(theta, s=WATER, g=G):
    theta = np.asarray(theta, dtype=float)
    return 0.0208 * theta * np.sqrt(s.sigma / (g * (s.rho_l - s.rho_v)))


def np_kandlikar(beta, phi=0.0, s=WATER, g=G):
    c = 1 + np.cos(np.radians(beta))
    return s.h_lv * np.sqrt(s.rho_v) * c / 16 * np.sqrt(2 / np.pi + np.pi / 4 * c * np.cos(np.radians(phi))) * (
        s.sigma * g * (s.rho_l - s.rho_v)
    ) ** 0.25


# --------------------------------------------------------------------------- signatures


def test_real_signatures_and_keywords():
    assert list(inspect.signature(fritz).parameters) == ["contact_angle_deg", "fluid", "g"]
    assert inspect.signature(kandlikar).parameters["orientation_deg"].default == 0.0
    assert inspect.signature(zuber).parameters["K"].default == pytest.approx(math.pi / 24)
    assert fritz(contact_angle_deg=30.0, fluid=WATER) == fritz(30.0, WATER)
    assert kandlikar(30.0, WATER, orientation_deg=45.0) == kandlikar(30.0, WATER, 45.0)
    with pytest.raises(TypeError):
        fritz(30.0)  # missing fluid
    with pytest.raises(TypeError):
        fritz(30.0, WATER, nonsense=1)
    assert "Fritz" in fritz.__doc__ and fritz.__module__ == "wetboil.departure"


def test_models_catalogue_declares_every_kernel():
    names = {m.name for m in wetboil.models()}
    assert {"fritz_departure", "zuber_chf", "kandlikar_chf", "embryo_superheat_linear"} <= names
    for m in wetboil.models():
        assert m.validity and m.reference and m.domain and m.equation, m.name
        assert callable(getattr(_core, m.name))


# --------------------------------------------------------------------------- scalars


def test_scalar_call_returns_python_float():
    for f, args in [(fritz, (45.0, WATER)), (zuber, (WATER,)), (kandlikar, (30.0, WATER)),
                    (embryo_superheat, (1e-5, WATER)), (embryo_radius, (2.0, WATER))]:
        r = f(*args)
        assert type(r) is float, f
    # ints and NumPy scalars are numbers too
    assert fritz(45, WATER) == fritz(45.0, WATER)
    assert fritz(np.float64(45.0), WATER) == fritz(45.0, WATER)
    assert type(fritz(np.float32(45.0), WATER)) is float
    assert type(fritz(np.array(45.0), WATER)) is float


def test_scalar_and_array_paths_agree_to_the_last_bit():
    theta = np.linspace(0, 90, 1001)
    arr = fritz(theta, WATER)
    assert all(fritz(float(t), WATER) == a for t, a in zip(theta, arr))
    beta = np.linspace(0, 180, 181)
    arr = kandlikar(beta, WATER, 30.0)
    assert all(kandlikar(float(b), WATER, 30.0) == a for b, a in zip(beta, arr))


# --------------------------------------------------------------------------- dtypes & layouts

LAYOUTS = {
    "list": lambda a: a.tolist(),
    "float32": lambda a: a.astype(np.float32),
    "int": lambda a: a.round().astype(np.int64),
    "uint8": lambda a: a.round().astype(np.uint8),
    "non-contiguous": lambda a: np.repeat(a, 2)[::2],
    "negative-stride": lambda a: a[::-1].copy()[::-1],
    "big-endian": lambda a: a.astype(">f8"),
    "read-only": lambda a: _readonly(a),
    "object": lambda a: a.astype(object),
}


def _readonly(a):
    a = a.copy()
    a.flags.writeable = False
    return a


@pytest.mark.parametrize("layout", sorted(LAYOUTS))
def test_layouts_and_dtypes(layout):
    base = np.linspace(0.0, 90.0, 37)
    x = LAYOUTS[layout](base)
    expect = np_fritz(np.asarray(x, dtype=float))
    np.testing.assert_allclose(fritz(x, WATER), expect, rtol=1e-15, atol=0)


def test_fortran_order_and_2d():
    a = np.asfortranarray(np.linspace(0, 90, 60).reshape(6, 10))
    out = fritz(a, WATER)
    assert out.shape == (6, 10)
    np.testing.assert_allclose(out, np_fritz(a), rtol=1e-15)


def test_zero_d_and_empty():
    assert fritz(np.array(30.0), WATER) == pytest.approx(np_fritz(30.0))
    e = fritz(np.array([]), WATER)
    assert isinstance(e, np.ndarray) and e.shape == (0,)
    assert fritz(np.empty((0, 3)), WATER).shape == (0, 3)


def test_broadcasting_against_fluid_fields():
    sat = WATER.replace(sigma=np.array([0.05, 0.06]))
    theta = np.array([[10.0], [20.0], [30.0]])
    out = fritz(theta, sat)
    assert out.shape == (3, 2)
    np.testing.assert_allclose(out, np_fritz(theta, s=sat), rtol=1e-15)


def test_large_arrays_use_threads_and_match_serial():
    x = np.random.default_rng(1).uniform(0, 90, 300_000)
    expect = np_kandlikar(x, 30.0)
    old = wetboil.get_num_threads()
    try:
        wetboil.set_num_threads(1)
        serial = kandlikar(x, WATER, 30.0)
        wetboil.set_num_threads(2)
        parallel = kandlikar(x, WATER, 30.0)
    finally:
        wetboil.set_num_threads(old)
    np.testing.assert_array_equal(serial, parallel)
    np.testing.assert_allclose(parallel, expect, rtol=1e-13)


def test_outputs_larger_than_the_caches_take_streaming_stores_with_the_same_bits():
    # Outputs of 2**22 elements or more are written with non-temporal stores
    # (full blocks: 64-byte stores where the block is 64-byte aligned on an
    # AVX-512 machine, 32-byte on AVX2, else 16-byte where it is 16-byte
    # aligned; the tail and misaligned outputs by plain copies). Same numbers
    # as small calls, whatever the alignment, in place or not.
    rng = np.random.default_rng(5)
    n = (1 << 22) + 37
    x = rng.uniform(0, 120, n)
    x[::1000] = np.nan
    sig = rng.uniform(0.05, 0.07, n)
    uf = wetboil.ufunc_of(fritz)
    with np.errstate(invalid="ignore"):
        big = uf(x, sig, WATER.rho_l, WATER.rho_v, G)
        pieces = np.concatenate([uf(x[i:i + 100_000], sig[i:i + 100_000], WATER.rho_l, WATER.rho_v, G)
                                 for i in range(0, n, 100_000)])
        raw = np.empty(n + 1)
        misaligned = raw[1:]  # 8 bytes past a 16-byte boundary: the plain-copy path
        assert misaligned.ctypes.data % 16 == 8
        uf(x, sig, WATER.rho_l, WATER.rho_v, G, out=misaligned)
        aligned = {}
        for align in (64, 32, 16):  # exactly this alignment (not the next larger one)
            raw = np.empty(n + 16)
            skip = (-raw.ctypes.data % 128 + align) % 128 // 8
            aligned[align] = raw[skip:skip + n]
            assert aligned[align].ctypes.data % align == 0 and aligned[align].ctypes.data % (2 * align) == align
            uf(x, sig, WATER.rho_l, WATER.rho_v, G, out=aligned[align])
        inplace = x.copy()
        uf(inplace, sig, WATER.rho_l, WATER.rho_v, G, out=inplace)
    np.testing.assert_array_equal(big, pieces)
    np.testing.assert_array_equal(misaligned, pieces)
    for out in aligned.values():
        np.testing.assert_array_equal(out, pieces)
    np.testing.assert_array_equal(inplace, pieces)
    ok = np.isfinite(x) & (x <= 90)
    np.testing.assert_allclose(big[ok], 0.0208 * x[ok] * np.sqrt(sig[ok] / (G * (WATER.rho_l - WATER.rho_v))),
                               rtol=1e-15)


def test_large_grids_stream_their_outputs_with_the_same_bits():
    # Broadcast grids of 2**22 points or more (the grid path and the
    # factorised path's product) also write with non-temporal stores; blocks
    # of 256 rows (537,600 points) do not.
    from wetboil.wetting import wenzel
    ang = np.linspace(0.0, 120.0, 2048)[:, None]
    rough = np.linspace(1.0, 1.6, 2100)
    with wetboil.errstate(out_of_range="ignore"):
        grid = wenzel(ang, rough)  # array-to-array broadcast: the grid path
        rows = np.vstack([wenzel(ang[i:i + 256], rough) for i in range(0, 2048, 256)])
    np.testing.assert_array_equal(grid, rows)
    p_fluid = Saturation(T=np.full(2100, 373.124), p=101325.0, rho_l=np.linspace(900.0, 1000.0, 2100), rho_v=0.59817,
                         h_lv=2.2564e6, sigma=0.058912)
    with wetboil.errstate(out_of_range="ignore"):
        big = fritz(ang, p_fluid)  # outer product of the two sides: the factorised path
        pieces = np.vstack([fritz(ang[i:i + 256], p_fluid) for i in range(0, 2048, 256)])
    assert big.size >= 1 << 22 and grid.size >= 1 << 22
    np.testing.assert_array_equal(big, pieces)


@pytest.mark.parametrize("shape", [(3000, 40, 1, 1), (1, 3000, 1, 40), (40, 1, 3000), (50000, 3), (3, 1, 50000, 1)])
def test_grid_path_rows_of_any_length_give_the_element_bits(shape):
    # The grid path drops axes of length 1, merges axes that every operand steps through as one, and
    # runs several short rows per task: the numbers and the validity counts must be those of the
    # element path on materialised inputs. Axes: the first varies the flux, the long one the
    # pressure; one input is a full array (every axis), one a scalar.
    big = [i for i, n in enumerate(shape) if n > 3][-1]
    first = next(i for i, n in enumerate(shape) if n > 1)
    along = lambda axis, v: v.reshape([shape[axis] if i == axis else 1 for i in range(len(shape))])  # noqa: E731
    q = along(first, np.linspace(-1e4, 2e6, shape[first]))  # some impossible (negative) fluxes
    p = along(big, np.geomspace(1e3, 3e7, shape[big]))  # some pressures beyond the critical one
    rough = np.random.default_rng(2).uniform(1e-7, 2e-5, shape)
    args = (q, p, 22.064e6, 0.018015, rough)
    with wetboil.errstate(invalid="ignore", out_of_range="ignore"):
        grid = wetboil._api.evaluate_arrays("cooper_superheat", "boiling.cooper_superheat", *args)
    materialised = [np.ascontiguousarray(np.broadcast_to(a, shape)) for a in args]
    with np.errstate(all="ignore"):
        elements = _core.cooper_superheat(*materialised)
    _core.take_counts()
    assert grid.shape == shape
    np.testing.assert_array_equal(grid, elements)
    # the grid path's counts (impossible, out of range) are those of the element path
    with np.errstate(all="ignore"):
        codes = _core.cooper_superheat_status(*materialised)
        ins = [np.broadcast_to(np.asarray(a, dtype=np.float64), shape) for a in args]
        out = np.empty(shape)
        counts = _core.grid_call("cooper_superheat", ins, [out])
    np.testing.assert_array_equal(out, elements)
    assert (int((codes == 1).sum()), int((codes == 2).sum())) == tuple(int(c) for c in counts[:2])
    assert (codes == 1).any() and (codes == 2).any() and (codes == 0).any()


@pytest.mark.parametrize("name", sorted(kc.BY_KERNEL))
def test_every_simd_clone_gives_the_same_bits(name):
    # The block loops, the scalar entry point and the status ufunc are
    # compiled for baseline x86-64 and for AVX2/FMA (the loops also for
    # AVX-512) and picked at run time. Rust never contracts a*b + c to an FMA
    # and fastmath's explicit fused multiply-adds round once wherever they
    # run, so all must agree to the last bit (on a CPU without a level, the
    # cap is a no-op).
    f, spec = kc.BY_KERNEL[name]
    rng = np.random.default_rng(11)
    n = 1000 + 37  # full blocks and a tail
    inputs = [np.ascontiguousarray(np.broadcast_to(np.asarray(v, dtype=float), (n,)))
              for v in kc.kernel_inputs(spec, kc.draw_args(spec, rng, n))]
    scalar_args = [kc.draw_args(spec, np.random.default_rng(seed)) for seed in range(5)]
    uf, status = getattr(_core, name), getattr(_core, f"{name}_status")
    results = []
    old = _core._set_simd_cap(2)
    try:
        for level in (2, 1, 0):
            _core._set_simd_cap(level)
            with np.errstate(all="ignore"), warnings.catch_warnings():
                warnings.simplefilter("ignore")
                out = uf(*inputs)
                out = out if isinstance(out, tuple) else (out,)
                scalars = [np.asarray(kc.outputs(kc.call(f, spec, a)), dtype=float) for a in scalar_args]
                results.append((*out, status(*inputs), *scalars))
    finally:
        _core._set_simd_cap(old)
    for other in results[1:]:
        for a, b in zip(results[0], other):
            np.testing.assert_array_equal(a.view(np.int64) if a.dtype == np.float64 else a,
                                          b.view(np.int64) if b.dtype == np.float64 else b)


def test_input_running_ahead_of_its_output_is_evaluated_in_order():
    # NumPy passes an input that overlaps the output one element ahead
    # uncopied; evaluated in parallel chunks, a chunk would read elements the
    # next chunk has already overwritten. Such calls run in order.
    # The race shows at chunk boundaries and depends on timing: ten calls.
    n = 1_000_000
    uf = wetboil.ufunc_of(fritz)
    old = wetboil.get_num_threads()
    try:
        wetboil.set_num_threads(2)
        for _ in range(10):
            x = np.linspace(1.0, 89.0, n + 1)
            expect = np_fritz(x[1:])
            uf(x[1:], WATER.sigma, WATER.rho_l, WATER.rho_v, G, out=x[:-1])
            np.testing.assert_allclose(x[:-1], expect, rtol=1e-15)
    finally:
        wetboil.set_num_threads(old)


def test_set_num_threads_rejects_nonsense():
    for bad in (0, -1, 1.5, "2", True):
        with pytest.raises(wetboil.WetboilValueError):
            wetboil.set_num_threads(bad)


def test_ufunc_out_and_aliasing():
    uf = wetboil.ufunc_of(fritz)
    assert isinstance(uf, np.ufunc) and uf.nin == 5 and uf.nout == 1
    assert uf.__name__ == "fritz_departure"
    x = np.linspace(0, 90, 50)
    out = np.empty_like(x)
    r = uf(x, WATER.sigma, WATER.rho_l, WATER.rho_v, G, out=out)
    assert r is out
    np.testing.assert_allclose(out, np_fritz(x), rtol=1e-15)
    # out aliasing an input (in place)
    y = x.copy()
    uf(y, WATER.sigma, WATER.rho_l, WATER.rho_v, G, out=y)
    np.testing.assert_allclose(y, np_fritz(x), rtol=1e-15)
    # partial overlap: NumPy copies, results stay right
    z = np.linspace(0, 90, 51)
    expect = np_fritz(z[:-1])
    uf(z[:-1], WATER.sigma, WATER.rho_l, WATER.rho_v, G, out=z[1:])
    np.testing.assert_allclose(z[1:], expect, rtol=1e-15)


@pytest.mark.parametrize("n", [1, 3, 63, 64, 65, 130, 40_000])
def test_ufunc_raises_no_floating_point_warning_on_valid_input(n):
    # The loop evaluates blocks of 64 elements; the unused tail of the last
    # block must not raise floating-point flags the caller's data never raised
    # (NumPy would report them as "invalid value encountered" warnings).
    x = np.linspace(1.0, 89.0, n)
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        d = wetboil.ufunc_of(fritz)(x, WATER.sigma, WATER.rho_l, WATER.rho_v, G)
        q = wetboil.ufunc_of(kandlikar)(x, 0.0, WATER.h_lv, WATER.rho_l, WATER.rho_v, WATER.sigma, G)
    np.testing.assert_allclose(d, np_fritz(x), rtol=1e-15)
    np.testing.assert_allclose(q, np_kandlikar(x), rtol=1e-13)


@pytest.mark.parametrize("kernel", sorted(kc.BY_KERNEL))
def test_no_kernel_ufunc_reports_floating_point_flags(kernel):
    # Kernels compute branch-free and select their answer at the end, so the
    # discarded side of a select (sqrt of a negative discriminant, a division
    # by a zero superheat whose answer is 0) may raise a floating-point flag;
    # the loops restore the flags they found. Physical inputs with a third of
    # each argument at the ends of its range (0 and 180 deg, zero superheat,
    # facing down, ...) and the same for the status ufunc.
    fn, spec = kc.BY_KERNEL[kernel]
    rng = np.random.default_rng(7)
    n = 3000
    args = kc.draw_args(spec, rng, n)
    for p in spec.params:
        if p in kc.fluid_params(spec):
            continue
        kind, lo, hi = kc.param_range(kernel, p)
        if kind in ("lin", "log"):
            v = np.array(args[p], dtype=float)
            v[: n // 6], v[n // 6 : n // 3] = lo, hi
            args[p] = v
    x = [np.asarray(v, dtype=float) for v in kc.kernel_inputs(spec, kc.fix(spec, args))]
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        getattr(_core, kernel)(*x)
        getattr(_core, kernel + "_status")(*x)


def test_ufunc_pickles_by_name():
    uf = wetboil.ufunc_of(fritz)
    assert pickle.loads(pickle.dumps(uf)) is uf
    assert pickle.loads(pickle.dumps(fritz)) is fritz
    s = pickle.loads(pickle.dumps(WATER))
    assert s.sigma == WATER.sigma and np.array_equal(s._scalars, WATER._scalars, equal_nan=True)


# --------------------------------------------------------------------------- element policy


def test_nan_propagates_silently():
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        out = fritz(np.array([np.nan, 30.0]), WATER)
        assert math.isnan(fritz(math.nan, WATER))
    assert np.isnan(out[0]) and out[1] == pytest.approx(np_fritz(30.0))


def test_impossible_elements_nan_and_one_counted_warning():
    with pytest.warns(wetboil.InvalidValueWarning, match=r"departure\.fritz: 2 of 5 element") as rec:
        out = fritz(np.array([-5.0, 0.0, 45.0, 181.0, 90.0]), WATER)
    assert len([w for w in rec if issubclass(w.category, wetboil.InvalidValueWarning)]) == 1
    assert np.isnan(out[[0, 3]]).all() and np.isfinite(out[[1, 2, 4]]).all()
    # the warning points at the caller, not at wetboil's internals
    assert rec[0].filename == __file__
    # ... also when wetboil runs part of the call through xarray (sweep's fluid states)
    with pytest.warns(wetboil.RangeWarning, match="fluids.water_at_pressure") as rec:
        wetboil.sweep([wetboil.Surface("a (invented)", 30, 40, 20)], "water", p=[21.9e6], heat_flux=3e5)
    assert [w.filename for w in rec] == [__file__]
    with pytest.warns(wetboil.InvalidValueWarning):
        assert math.isnan(fritz(-1.0, WATER))
    bad = WATER.replace(rho_v=2000.0)
    with pytest.warns(wetboil.InvalidValueWarning, match="1 of 1"):
        assert math.isnan(zuber(bad))
    with pytest.warns(wetboil.InvalidValueWarning):
        assert math.isnan(fritz(45.0, WATER.replace(sigma=-0.01)))


def test_out_of_range_warns_but_computes():
    with pytest.warns(wetboil.RangeWarning, match=r"chf\.kandlikar: 2 of 3"):
        out = kandlikar(60.0, WATER, np.array([0.0, 100.0, 110.0]))
    assert np.isfinite(out).all()
    np.testing.assert_allclose(out, np_kandlikar(60.0, np.array([0.0, 100.0, 110.0])), rtol=1e-13)
    # facing down on a well-wetted wall the model has no answer: NaN, flagged as out of range only
    with warnings.catch_warnings(record=True) as rec:
        warnings.simplefilter("always")
        assert math.isnan(kandlikar(30.0, WATER, 150.0))
    assert [w.category for w in rec] == [wetboil.RangeWarning]


def test_errstate_controls_both_categories():
    with wetboil.errstate(invalid="raise"):
        with pytest.raises(wetboil.WetboilError):
            fritz(np.array([200.0]), WATER)
        with pytest.raises(wetboil.InvalidValueError) as err:
            fritz(200.0, WATER)
        # nothing was returned, so the message must not claim a NaN was set
        assert "set to NaN" not in str(err.value) and "physically impossible" in str(err.value)
    with wetboil.errstate(out_of_range="raise"):
        with pytest.raises(wetboil.OutOfRangeError):
            kandlikar(30.0, WATER, 120.0)
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        with wetboil.errstate(invalid="ignore", out_of_range="ignore"):
            assert math.isnan(fritz(200.0, WATER))
            kandlikar(30.0, WATER, 120.0)
    assert wetboil.geterr() == {"invalid": "warn", "out_of_range": "warn"}
    with pytest.raises(wetboil.WetboilValueError):
        wetboil.errstate(invalid="loud")


def test_ignored_scalar_elements_give_the_array_path_values_and_stay_captured():
    """A scalar element whose category is ignored returns what the array path returns, bit for bit
    and without a word (the fast path answers it: a solver probing outside a range under
    errstate(out_of_range="ignore") paid 10 us per call on the fallback). Only the ignored category
    is answered there: the other category still warns, strict mode still raises, and a validity
    capture (wetboil.validity, the sweep's flags) still sees the element. Behavioural contract; the
    values are the kernels' own (Kandlikar 2001 beyond 90 deg, Fritz at an impossible angle)."""
    from wetboil._api import capture_validity

    cases = [(kandlikar, (30.0, WATER, 120.0), "out_of_range"), (fritz, (200.0, WATER), "invalid"),
             (kandlikar, (30.0, WATER, 170.0), "out_of_range")]  # facing down: no answer (NaN), flagged
    for f, args, category in cases:
        with wetboil.errstate(**{category: "ignore"}):
            array = f(*(np.array([a]) if isinstance(a, float) else a for a in args))[0]
            with warnings.catch_warnings():
                warnings.simplefilter("error")
                value = f(*args)
            assert type(value) is float and kc.same_bits(value, array), (f, args, value, array)
            with capture_validity() as cap:
                f(*args)
            flags = cap.invalid if category == "invalid" else cap.out_of_range
            assert bool(np.all(flags)), (f, args)
            other = "out_of_range" if category == "invalid" else "invalid"
            with wetboil.errstate(**{category: "raise", other: "ignore"}), pytest.raises(wetboil.WetboilError):
                f(*args)
    with wetboil.errstate(invalid="ignore"), pytest.warns(wetboil.RangeWarning):
        kandlikar(30.0, WATER, 120.0)  # out of range is not ignored here


# --------------------------------------------------------------------------- structural errors
# --------------------------------------------------------------------------- structural errors


@pytest.mark.parametrize("bad", ["30", None, b"x", [1, "a"], {"a": 1}, True, 1 + 2j])
def test_wrong_types_raise_type_error_naming_argument(bad):
    with pytest.raises(TypeError, match="contact_angle_deg") as exc:
        fritz(bad, WATER)
    assert isinstance(exc.value, wetboil.WetboilError)


def test_fluid_must_be_a_saturation():
    with pytest.raises(wetboil.WetboilTypeError, match="Saturation"):
        fritz(30.0, {"sigma": 0.06})
    with pytest.raises(TypeError):
        Saturation(T="hot", p=1e5, rho_l=1000, rho_v=1, h_lv=2e6, sigma=0.06)


def test_shapes_that_do_not_broadcast_name_the_shapes():
    sat = WATER.replace(sigma=np.array([0.05, 0.06, 0.07]))
    with pytest.raises(ValueError, match=r"contact_angle_deg \(4,\).*fluid\.sigma \(3,\)") as exc:
        fritz(np.zeros(4), sat)
    assert isinstance(exc.value, wetboil.WetboilError)


def test_interpreter_survives_hostile_input():
    # Run in a subprocess so that a crash would show as a failed exit code.
    code = r"""
import numpy as np, warnings, wetboil
from wetboil.departure import fritz
from wetboil.fluids import Saturation
warnings.simplefilter("ignore")
W = Saturation(T=373.124, p=101325.0, rho_l=958.35, rho_v=0.59817, h_lv=2.2564e6, sigma=0.058912)
cases = [np.inf, -np.inf, -0.0, 1e308, 5e-324, np.array([np.inf, -np.inf, np.nan]),
         np.zeros((3, 0)), np.ones(10**6)[::-3], np.float16(3), np.arange(10, dtype=np.int8)]
for c in cases:
    fritz(c, W)
for c in ["x", None, object(), [[1, 2], [3]]]:
    try:
        fritz(c, W)
    except (TypeError, ValueError):
        pass
uf = wetboil.ufunc_of(fritz)
for args in [(1.0,) * 5, (np.ones(3),) * 5]:
    uf(*args)
print("survived")
"""
    r = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, timeout=120)
    assert r.returncode == 0, r.stderr
    assert "survived" in r.stdout


# --------------------------------------------------------------------------- per-element validity


def test_validity_codes_agree_with_the_warnings():
    beta = np.array([30.0, 30.0, 200.0, np.nan, 60.0])
    phi = np.array([0.0, 120.0, 0.0, 0.0, 100.0])
    codes = wetboil.validity(kandlikar, beta, WATER, phi)
    assert codes.dtype == np.int8 and codes.tolist() == [0, 2, 1, 3, 2]
    with warnings.catch_warnings(record=True) as rec:
        warnings.simplefilter("always")
        kandlikar(beta, WATER, phi)
    msgs = {w.category: str(w.message) for w in rec}
    assert "1 of 5" in msgs[wetboil.InvalidValueWarning] and "2 of 5" in msgs[wetboil.RangeWarning]
    # keywords and defaults bind as in the function itself
    assert wetboil.validity(kandlikar, receding_angle_deg=30.0, fluid=WATER) == 0
    with pytest.raises(TypeError):
        wetboil.validity(kandlikar, 30.0)
    with pytest.raises(TypeError):
        wetboil.validity(len, 30.0)


def test_validity_of_functions_that_pick_a_model_by_an_argument():
    # contract (README: validity(f, *args) for the public functions): codes agree with the warnings
    # the function itself emits, for functions that choose their kernel by a method or geometry
    from wetboil import nucleation

    dts = np.array([5.0, 50.0, np.nan, 10.0, 8.0])
    angles = np.array([45.0, 45.0, 45.0, 200.0, 30.0])
    codes = wetboil.validity(nucleation.site_density, dts, WATER, angles, method="basu")
    with warnings.catch_warnings(record=True) as rec:
        warnings.simplefilter("always")
        nucleation.site_density(dts, WATER, angles, method="basu")
    msgs = {w.category: str(w.message) for w in rec}
    assert codes.dtype == np.int8 and codes[2] == 3 and codes[3] == 1
    assert f"{(codes == 1).sum()} of 5" in msgs[wetboil.InvalidValueWarning]
    assert f"{(codes == 2).sum()} of 5" in msgs[wetboil.RangeWarning] and (codes == 2).sum() >= 1
    assert wetboil.validity(nucleation.site_density, 5.0, WATER, 45.0, "basu") == 0  # a number: an int8 code
    from wetboil.chf import lienhard_dhir

    sizes = np.array([1e-4, 1e-3, 2e-3, -1.0])
    codes = wetboil.validity(lienhard_dhir, WATER, "cylinder", sizes)
    with warnings.catch_warnings(record=True) as rec:
        warnings.simplefilter("always")
        lienhard_dhir(WATER, "cylinder", sizes)
    msgs = {w.category: str(w.message) for w in rec}
    assert codes[3] == 1 and f"{(codes == 1).sum()} of 4" in msgs[wetboil.InvalidValueWarning]
    assert codes[0] == 2 and f"{(codes == 2).sum()} of 4" in msgs[wetboil.RangeWarning]
    with pytest.raises(TypeError):  # not a wetboil function: not run
        wetboil.validity(len, [1.0])
    from wetboil.chf import dimensionless_size

    assert wetboil.validity(dimensionless_size, np.array([-1.0, 0.3, np.nan]), WATER).tolist() == [1, 0, 3]


def test_long_double_masked_arrays_and_a_state_for_a_number():
    # contract: kernels compute in float64; a long-double input is converted, not a NumPy casting error;
    # a fluid state passed where a number belongs gets a message that says so
    from wetboil import nucleation, wetting

    ref = wetting.young_angle(0.05, 0.02, 0.07)
    assert wetting.young_angle(np.longdouble(0.05), 0.02, 0.07) == ref
    got = wetting.young_angle(np.array([0.05, 0.05], dtype=np.longdouble), 0.02, 0.07)
    assert got.dtype == np.float64 and got.tolist() == [ref, ref]
    with pytest.raises(wetboil.WetboilTypeError, match="got a Saturation"):
        nucleation.homogeneous_superheat(WATER)
    # masked elements are missing data (NaN, silent), not the values under the mask
    theta = np.ma.masked_array([30.0, 400.0, 60.0], mask=[False, True, False])
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        d = fritz(theta, WATER)
    assert np.isnan(d[1]) and d[0] == fritz(30.0, WATER) and d[2] == fritz(60.0, WATER)


def test_gathered_warnings_are_per_call_and_survive_an_exception():
    # contract of one_warning_per_category (used by boiling.curve): the parts' warnings become one per
    # category, other warnings pass untouched, and they are given even when the call then raises
    import threading

    from wetboil._errors import one_warning_per_category, report

    @one_warning_per_category("demo.composite")
    def composite(fail):
        report("demo.a", 3, 1, 0)
        report("demo.b", 5, 2, 4)
        warnings.warn("not ours", UserWarning)
        if fail:
            raise RuntimeError("boom")
        return 1.0

    for fail in (False, True):
        with warnings.catch_warnings(record=True) as rec:
            warnings.simplefilter("always")
            try:
                composite(fail)
            except RuntimeError:
                assert fail
        got = {w.category: str(w.message) for w in rec}
        assert len(rec) == 3, [str(w.message) for w in rec]
        assert got[UserWarning] == "not ours"
        assert got[wetboil.InvalidValueWarning] == ("demo.composite: demo.a: 1 of 3 element(s) physically impossible, "
                                                    "set to NaN; demo.b: 2 of 5 element(s) physically impossible, "
                                                    "set to NaN")
        assert got[wetboil.RangeWarning].startswith("demo.composite: demo.b: 4 of 5")
    # the gathering is a context variable, not the warning filters: a call in another thread (its own
    # context) is not gathered while a composite call runs here
    from wetboil._errors import _GATHER

    inside = []

    @one_warning_per_category("demo.outer")
    def outer():
        t = threading.Thread(target=lambda: inside.append(_GATHER.get()))
        t.start()
        t.join()
        return _GATHER.get()

    assert outer() == [] and inside == [None] and _GATHER.get() is None


def test_validity_keeps_labels():
    xr = pytest.importorskip("xarray")
    beta = xr.DataArray([10.0, 200.0], dims="surface")
    codes = wetboil.validity(fritz, beta, WATER)
    assert codes.dims == ("surface",) and codes.values.tolist() == [0, 1]


# --------------------------------------------------------------------------- the parallel grid path


def test_grid_path_matches_the_ufunc_bit_for_bit():
    # array-to-array broadcasting of 2000 x 100 points takes the grid path
    beta = np.linspace(0.0, 90.0, 2000)[:, None]
    sat = WATER.replace(sigma=np.linspace(0.03, 0.07, 100), rho_v=np.linspace(0.5, 5.0, 100))
    phi = np.array(30.0)
    got = kandlikar(beta, sat, phi)
    uf = wetboil.ufunc_of(kandlikar)
    expect = uf(beta, phi, sat.h_lv, sat.rho_l, sat.rho_v, sat.sigma, G)
    assert got.shape == (2000, 100)
    np.testing.assert_array_equal(got, expect)
    # layouts that NumPy would buffer: big-endian, float32, strided, Fortran (copied to contiguous
    # float64 first, or the grid path for the ones with a zero stride)
    x = np.random.default_rng(5).uniform(0, 90, (300, 400))
    base = fritz(np.ascontiguousarray(x), WATER)
    for variant in (x.astype(">f8"), np.asfortranarray(x), x[:, ::-1][:, ::-1], np.repeat(x, 2, axis=1)[:, ::2]):
        np.testing.assert_array_equal(fritz(variant, WATER), base)
    np.testing.assert_array_equal(fritz(x.astype(np.float32), WATER), fritz(x.astype(np.float32).astype(float), WATER))


def test_grid_path_counts_and_threads():
    beta = np.concatenate([np.linspace(0, 90, 999), [200.0]])[:, None]  # one impossible row
    phi = np.array([0.0, 120.0] * 50)[None, :]  # half the columns out of range
    with warnings.catch_warnings(record=True) as rec:
        warnings.simplefilter("always")
        q = kandlikar(beta, WATER, phi)
    msgs = {w.category: str(w.message) for w in rec}
    assert "100 of 100000" in msgs[wetboil.InvalidValueWarning]
    assert "49950 of 100000" in msgs[wetboil.RangeWarning]  # 999 possible rows x 50 columns
    assert np.isnan(q[-1]).all()
    old = wetboil.get_num_threads()
    try:
        wetboil.set_num_threads(1)
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            serial = kandlikar(beta, WATER, phi)
    finally:
        wetboil.set_num_threads(old)
    np.testing.assert_array_equal(serial, q)


# --------------------------------------------------------------------------- factorised grid path

def _sides_grid(name, rows=301, cols=127):
    """Kernel inputs of a factored kernel laid out as an outer product: side-0
    (surface) inputs along rows, side-1 (fluid) inputs along columns, each
    mixing ordinary values with impossible, out-of-range and missing ones."""
    rng = np.random.default_rng(11)
    sides = wetboil._api.SIDES[name]
    specials = {0: [-1.0, 0.0, 90.0, 120.0, 180.0, 181.0, math.nan, math.inf],
                1: [-1.0, 0.0, math.nan, math.inf]}
    model = wetboil._api.MODELS[name]
    typical = {"contact_angle_deg": (0.0, 150.0), "receding_angle_deg": (0.0, 150.0), "orientation_deg": (0.0, 120.0),
               "heat_flux": (0.0, 1e6), "fluid.sigma": (0.01, 0.07), "fluid.T": (280.0, 600.0),
               "fluid.rho_l": (500.0, 1000.0), "fluid.rho_v": (0.01, 600.0), "fluid.h_lv": (1e5, 2.5e6),
               "fluid.k_l": (0.1, 0.7), "g": (1.0, 20.0)}
    arrays = []
    for arg, s in zip(model.inputs, sides):
        n = rows if s == 0 else cols
        lo, hi = typical[arg.name]
        v = rng.uniform(lo, hi, n)
        v[rng.choice(n, 6, replace=False)] = rng.choice(specials[s], 6)
        arrays.append(v.reshape(n, 1) if s == 0 else v.reshape(1, n))
    return arrays


@pytest.mark.parametrize("name", sorted(wetboil._api.SIDES))
def test_factorised_grid_path_equals_the_element_path(name):
    # Kernels in product form evaluate an outer-product grid factor by factor;
    # numbers (bit for bit) and the invalid / out-of-range counts must equal
    # those of the element-by-element ufunc on the fully broadcast grid.
    from kernel_cases import same_bits

    arrays = _sides_grid(name)
    shape = np.broadcast_shapes(*(a.shape for a in arrays))
    assert wetboil._api._factor_axes(arrays, wetboil._api.SIDES[name], shape)
    outs, invalid, out_of_range = wetboil._api._factorised(name, arrays, wetboil._api.SIDES[name], shape)
    _core.take_counts()
    with np.errstate(all="ignore"):
        expect = getattr(_core, name)(*(np.ascontiguousarray(np.broadcast_to(a, shape)) for a in arrays))
    counts = _core.take_counts()
    outs, expect = (outs, expect) if isinstance(outs, tuple) else ((outs,), (expect,))
    for o, e in zip(outs, expect):
        assert o.shape == shape
        assert same_bits(o, e)
    assert (invalid, out_of_range) == counts[:2]
    assert invalid > 0
    assert out_of_range > 0 or name in ("hsu_onset", "kandlikar_onset")  # the onset models have no range limit


def test_factorised_grid_path_takes_unaligned_and_readonly_input():
    # Blocks unpickled on a dask worker can be unaligned views: the factorised
    # path must copy them to aligned memory, not fail (found by the LocalCluster test).
    n = 40_000
    buf = np.zeros(n * 8 + 1, dtype=np.uint8)
    x = np.frombuffer(buf.data, dtype=np.float64, count=n, offset=1)  # unaligned, read-only
    assert not x.flags.aligned
    x_ = np.linspace(1.0, 89.0, n)
    buf[1:] = x_.view(np.uint8)
    np.testing.assert_array_equal(kandlikar(x, WATER, 30.0), kandlikar(x_, WATER, 30.0))


def test_shape_shortcuts_agree_with_numpy():
    # The array path's own _shape/_broadcast_shape skip NumPy's dispatch in the common case; they must
    # give NumPy's answers (and its error) for every combination. Reference: numpy.shape and
    # numpy.broadcast_shapes.
    from wetboil._api import _broadcast_shape, _shape
    rng = np.random.default_rng(4)
    values = [1.0, 2, np.float64(3.0), np.array(4.0), [1.0, 2.0], np.ones(3), np.ones((2, 3)), np.ones((1, 3)),
              np.ones((3, 1)), np.ones((2, 1, 3)), np.ones(0), np.ma.masked_array(np.ones(3)), np.ones((4, 2))]
    for v in values:
        assert _shape(v) == np.shape(v)
    for _ in range(500):
        pick = [values[i] for i in rng.integers(0, len(values), rng.integers(1, 5))]
        shapes = [np.shape(v) for v in pick]
        try:
            want = np.broadcast_shapes(*shapes)
        except ValueError:
            with pytest.raises(ValueError):
                _broadcast_shape(shapes)
        else:
            assert _broadcast_shape(shapes) == want, shapes


def test_set_num_threads_rejects_counts_far_above_the_cores():
    # Common practice, no published source: a thread pool larger than a few
    # threads per core only adds start-up and switching. wetboil's pool starts
    # every thread before a call runs: set_num_threads(100000) made the next
    # large call spend minutes starting threads (1750 started after 35 s on a
    # 2-core machine) instead of computing.
    old = wetboil.get_num_threads()
    try:
        for bad in (4 * (os.cpu_count() or 1) + 1, 100_000, 2**40):
            with pytest.raises(wetboil.WetboilValueError, match="per logical core"):
                wetboil.set_num_threads(bad)
            assert wetboil.get_num_threads() == old
        wetboil.set_num_threads(4 * (os.cpu_count() or 1))  # the largest count allowed
    finally:
        wetboil.set_num_threads(old)


def test_environment_thread_count_far_above_the_cores_is_capped():
    import subprocess
    code = ("import warnings, os\n"
            "with warnings.catch_warnings(record=True) as w:\n"
            "    warnings.simplefilter('always')\n"
            "    import wetboil\n"
            "print(wetboil.get_num_threads() == 4 * (os.cpu_count() or 1), "
            "any('WETBOIL_NUM_THREADS' in str(x.message) for x in w))\n")
    env = dict(os.environ, WETBOIL_NUM_THREADS="100000")
    out = subprocess.run([sys.executable, "-c", code], env=env, capture_output=True, text=True, timeout=120)
    assert out.stdout.split() == ["True", "True"], out.stdout + out.stderr
