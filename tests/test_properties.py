"""Property-based invariants over every kernel-backed function (Hypothesis).

Generic properties, for every registered kernel through its public function
(or the kernel-backed helper behind a method dispatcher):

* the scalar fast path (Rust, no ufunc) and the array path (the ufunc) agree
  to the last bit, with plain arguments as arrays and with the fluid's fields
  as arrays too;
* inside the physical domain every output is finite and non-negative (signed
  quantities excepted), apart from the "no answer" NaN or infinite limits a
  model documents (listed in kernel_cases.py, mirrored in src/fuzz.rs);
* impossible inputs give NaN and one counted InvalidValueWarning;
* float32, integer, strided, negative-stride, Fortran-order, big-endian,
  read-only and unaligned inputs give results bitwise equal to the float64
  contiguous result of the same values, at the ufunc and at the public level,
  on the ufunc path and on the parallel grid path.

Physical invariants (monotonicity, limits, inverses) are checked for the
models where the physics or the model's own equation says so; the expected
directions come from the equations quoted in each function's docstring, not
from our own outputs.
"""

from __future__ import annotations

import math
import warnings

import numpy as np
import pytest
from hypothesis import HealthCheck, assume, given, settings
from hypothesis import strategies as st

import wetboil
from wetboil import _core, chf, departure, nucleation, wetting, boiling
from wetboil.fluids import FIELDS, water, water_at_pressure, water_at_temperature

import kernel_cases as kc

SETTINGS = settings(max_examples=200, deadline=None, suppress_health_check=[HealthCheck.too_slow])
FEW = settings(max_examples=60, deadline=None, suppress_health_check=[HealthCheck.too_slow])
IDS = [t[0] for t in kc.KERNEL_FUNCTIONS]
KERNEL_IDS = sorted(kc.BY_KERNEL)


_outputs = kc.outputs


def _quiet(fn, *args, **kwargs):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        return fn(*args, **kwargs)


def _code(spec, x):
    with np.errstate(all="ignore"):
        return int(getattr(_core, f"{spec.model.name}_status")(*x))


# --------------------------------------------------------------------------- coverage


def test_every_registered_kernel_has_a_function_or_is_a_known_fused_kernel():
    assert len(kc.BY_KERNEL) >= 52
    # kernels with no public function of their own: fused variants of public ones
    assert set(kc.UFUNC_ONLY) <= {"water_screening_chain"}, kc.UFUNC_ONLY
    for mod in (wetboil.fluids, wetting, nucleation, departure, chf, boiling):
        for name in mod.__all__:
            f = getattr(mod, name)
            try:
                wetboil.ufunc_of(f)
            except (wetboil.WetboilTypeError, TypeError):
                continue
            assert f in wetboil._api._FUNCTIONS


# --------------------------------------------------------------------------- fast path == array path


@pytest.mark.parametrize("case", IDS)
def test_scalar_fast_path_equals_array_path_and_outputs_are_physical(case):
    _, f, spec = next(t for t in kc.KERNEL_FUNCTIONS if t[0] == case)
    kernel = spec.model.name
    names = kc.output_names(spec)
    fps = kc.fluid_params(spec)

    @SETTINGS
    @given(kc.strategy_args(spec))
    def check(args):
        scalar = _quiet(kc.call, f, spec, args)
        outs = _outputs(scalar)
        assert all(type(v) is float for v in outs), (case, scalar)
        plain_arrays = {p: (v if p in fps else np.array([v])) for p, v in args.items()}
        all_arrays = {
            p: (v.replace(**{fl: np.array([getattr(v, fl)]) for fl in FIELDS}) if p in fps else np.array([v]))
            for p, v in args.items()
        }
        for arrays in (plain_arrays, all_arrays):
            arr = _outputs(_quiet(kc.call, f, spec, arrays))
            for k, (s, a) in enumerate(zip(outs, arr)):
                assert np.shape(a) == (1,), (case, arrays)
                assert kc.same_bits(s, a[0]), (case, names[k], s, a[0], args)
        x = kc.kernel_inputs(spec, args)
        code = _code(spec, x)
        assert code in (0, 2), f"{case}: physical arguments classified impossible: {args}"
        problem = kc.check_outputs(kernel, x, outs, names)
        assert problem is None, f"{case}: {problem} for {args} -> {outs}"

    check()


# --------------------------------------------------------------------------- impossible inputs

BAD = [-1.0, -5e-324, 0.0, -0.0, 5e-324, 91.0, 181.0, 1e308, math.inf, -math.inf, math.nan]


@pytest.mark.parametrize("kernel", KERNEL_IDS)
def test_impossible_inputs_give_nan_and_one_counted_warning(kernel):
    f, spec = kc.BY_KERNEL[kernel]
    names = kc.output_names(spec)
    rng = np.random.default_rng(11)
    base = kc.draw_args(spec, rng)
    x0 = kc.kernel_inputs(spec, base)
    assert _code(spec, x0) in (0, 2), base
    impossible = 0
    for k in range(len(x0)):
        for bad in BAD:
            x = list(x0)
            x[k] = bad
            code = _code(spec, x)
            with warnings.catch_warnings(record=True) as rec:
                warnings.simplefilter("always")
                outs = _outputs(kc.call(f, spec, kc.args_from_inputs(spec, x, base)))
            cats = [w.category for w in rec]
            inv = [str(w.message) for w in rec if w.category is wetboil.InvalidValueWarning]
            rngw = [str(w.message) for w in rec if w.category is wetboil.RangeWarning]
            where = f"{kernel} input {spec.model.inputs[k].name}={bad!r}"
            if code == 1:
                impossible += 1
                assert all(math.isnan(v) for v in outs), (where, outs)
                assert len(inv) == 1 and "1 of 1" in inv[0], (where, cats)
                assert not rngw, where
            elif code == 3:
                assert any(math.isnan(v) for v in outs), (where, outs)
                assert not inv and not rngw, (where, cats)  # missing data is silent
            else:
                assert not inv, (where, inv)
                assert len(rngw) == (1 if code == 2 else 0), (where, code, rngw)
                unit = spec.model.inputs[k].unit
                if bad in (0.0, -1.0) or (bad in (91.0, 181.0) and unit == "deg"):  # no overflow expected
                    problem = kc.check_outputs(kernel, x, outs, names)
                    assert problem is None, (where, problem, outs)
    assert impossible > 0, f"{kernel}: no impossible input found"


# --------------------------------------------------------------------------- dtypes and layouts


def _layouts(a):
    """Variants of a 1-D float64 array of 24 values: (name, array, values it holds as float64)."""
    ro = a.copy()
    ro.flags.writeable = False
    buf = np.zeros(a.size * 8 + 1, dtype=np.uint8)
    unaligned = np.frombuffer(buf[1:].data, dtype=np.float64, count=a.size)
    unaligned[...] = a
    strided = np.empty(a.size * 3)
    strided[::3] = a
    neg = a[::-1].copy()[::-1]
    f32 = a.astype(np.float32)
    with np.errstate(invalid="ignore"):  # huge values (rates) do not fit: whatever the cast gives
        i64 = np.round(a).astype(np.int64)
        i32 = np.round(a).astype(np.int32)
    return [
        ("float32", f32, f32.astype(np.float64)),
        ("int64", i64, i64.astype(np.float64)),
        ("int32", i32, i32.astype(np.float64)),
        ("strided", strided[::3], a),
        ("negative_stride", neg, a),
        ("big_endian", a.astype(">f8"), a),
        ("read_only", ro, a),
        ("unaligned", unaligned, a),
        ("fortran", np.asfortranarray(a.reshape(4, 6)), a.reshape(4, 6)),
        ("fortran_f32", np.asfortranarray(f32.reshape(4, 6)), f32.astype(np.float64).reshape(4, 6)),
    ]


@pytest.mark.parametrize("kernel", sorted(set(KERNEL_IDS) | set(kc.UFUNC_ONLY)))
def test_ufunc_dtypes_and_layouts_bitwise_equal_float64(kernel):
    uf = getattr(_core, kernel)
    rng = np.random.default_rng(3)
    if kernel in kc.BY_KERNEL:
        _, spec = kc.BY_KERNEL[kernel]
        x = [np.asarray(v, dtype=float) * np.ones(24) for v in kc.kernel_inputs(spec, kc.draw_args(spec, rng, 24))]
    else:  # the fused chain: pressure, angles, orientation, flux, g
        x = [rng.uniform(1e3, 2e7, 24), rng.uniform(0, 180, 24), rng.uniform(0, 180, 24),
             rng.uniform(0, 180, 24), rng.uniform(0, 1e6, 24), np.full(24, kc.G)]
    for k in range(len(x)):
        for name, variant, values in _layouts(x[k]):
            args = [xi.reshape(values.shape) if xi.size == values.size else xi for xi in x]
            ref_args = [a.copy() for a in args]
            ref_args[k] = np.ascontiguousarray(values)
            args[k] = variant
            with np.errstate(all="ignore"):
                got, want = uf(*args), uf(*ref_args)
            for g_, w_ in zip(kc.outputs(got), kc.outputs(want)):
                assert kc.same_bits(g_, w_), (kernel, uf.__name__, k, name)


@pytest.mark.parametrize("case", IDS)
def test_public_dtypes_and_layouts_bitwise_equal_float64(case):
    _, f, spec = next(t for t in kc.KERNEL_FUNCTIONS if t[0] == case)
    rng = np.random.default_rng(4)
    args = kc.draw_args(spec, rng, 24)
    fps = kc.fluid_params(spec)
    plain = [p for p in spec.params if p not in fps]
    for p in plain:
        for name, variant, values in _layouts(np.asarray(args[p], dtype=float)):
            # the other arguments take the same shape (2-D for the Fortran variants)
            shaped = {q: (np.reshape(v, values.shape) if q in plain else v) for q, v in args.items()}
            if values.ndim == 2:
                for q in fps:
                    fl = args[q]
                    shaped[q] = fl.replace(**{fd: np.reshape(getattr(fl, fd), values.shape) for fd in FIELDS
                                              if np.ndim(getattr(fl, fd))})
            ref = dict(shaped, **{p: np.ascontiguousarray(values)})
            got = dict(shaped, **{p: variant})
            want_out = _outputs(_quiet(kc.call, f, spec, ref))
            got_out = _outputs(_quiet(kc.call, f, spec, got))
            for g_, w_ in zip(got_out, want_out):
                assert kc.same_bits(g_, w_), (case, p, name)
        # object arrays and lists of numbers are numbers too
        for name, variant in (("object", np.asarray(args[p], dtype=float).astype(object)),
                              ("list", np.asarray(args[p], dtype=float).tolist())):
            want_out = _outputs(_quiet(kc.call, f, spec, args))
            got_out = _outputs(_quiet(kc.call, f, spec, dict(args, **{p: variant})))
            for g_, w_ in zip(got_out, want_out):
                assert kc.same_bits(g_, w_), (case, p, name)


SLOW = {"kinetic_superheat_water", "homogeneous_superheat_water"}


@pytest.mark.parametrize("kernel", KERNEL_IDS)
def test_grid_path_bitwise_equal_to_the_ufunc(kernel):
    """Large calls NumPy would buffer (casts, byte swaps, strides, array-to-array
    broadcasting) take the parallel grid path; whole contiguous float64 arrays
    take the ufunc. Both must give the same bits."""
    f, spec = kc.BY_KERNEL[kernel]
    fps = kc.fluid_params(spec)
    plain = [p for p in spec.params if p not in fps]
    rng = np.random.default_rng(5)
    n = 33_000  # above the grid threshold (2**15)
    args = kc.draw_args(spec, rng, n)
    ref = _outputs(_quiet(kc.call, f, spec, args))  # whole contiguous float64: the ufunc
    p = plain[0]
    a = np.asarray(args[p], dtype=float)
    strided = np.empty(2 * n)
    strided[::2] = a
    variants = [("big_endian", a.astype(">f8")), ("strided", strided[::2])]
    if kernel not in SLOW:
        variants.append(("negative_stride", a[::-1].copy()[::-1]))
    for name, v in variants:
        got = _outputs(_quiet(kc.call, f, spec, dict(args, **{p: v})))
        for g_, w_ in zip(got, ref):
            assert kc.same_bits(g_, w_), (kernel, p, name)
    if kernel in SLOW:
        return
    # array-to-array broadcasting: a (rows, 1) column against (1, cols) rows
    col = {q: (np.asarray(args[q], dtype=float)[:300].reshape(300, 1) if q == p else
               (np.asarray(args[q], dtype=float)[:120].reshape(1, 120) if q in plain else args[q][:120]))
           for q in spec.params}
    for q in fps:  # fluid fields along the row axis
        fl = args[q][:120]
        col[q] = fl.replace(**{fd: np.reshape(getattr(fl, fd), (1, 120)) for fd in FIELDS if np.ndim(getattr(fl, fd))})
    grid = _outputs(_quiet(kc.call, f, spec, col))
    x = [np.asarray(v, dtype=float) for v in kc.kernel_inputs(spec, col)]
    expect = kc.select(spec, kc.outputs(getattr(_core, kernel)(*x)))
    for g_, w_ in zip(grid, expect):
        assert np.shape(g_) == (300, 120) or len(plain) == 1
        assert kc.same_bits(g_, np.broadcast_to(w_, np.shape(g_))), (kernel, "broadcast")


# --------------------------------------------------------------------------- physical invariants

EPS = float(np.finfo(float).eps)
angle = st.floats(0.0, 180.0)
WATER_STATE = st.floats(275.0, 640.0).map(lambda T: water(T=T))
WATER_1ATM = water(p=101325.0)


def _pair(lo, hi):
    return st.tuples(st.floats(lo, hi), st.floats(lo, hi)).map(sorted)


@FEW
@given(_pair(0.0, 180.0), st.floats(0.0, 90.0), WATER_STATE)
def test_chf_rises_as_the_receding_angle_falls(pair, orientation, w):
    # Kandlikar (2001): q ~ (1 + cos b)/16 [2/pi + pi/4 (1 + cos b) cos phi]^(1/2); for phi <= 90
    # both factors fall as b rises.
    lo, hi = pair
    q_lo, q_hi = _quiet(chf.kandlikar, [lo, hi], w, orientation)
    assert q_lo >= q_hi >= 0  # (1 + cos b) reaches 0 at 180 deg


@FEW
@given(_pair(0.0, 180.0), WATER_STATE, st.sampled_from(["fritz", "fritz_jakob", "kocamustafaogullari_ishii"]))
def test_departure_diameter_rises_with_angle(pair, w, method):
    # Fritz: D = 0.0208 theta (sigma/(g drho))^(1/2); Kocamustafaogullari-Ishii: the same times a density factor.
    lo, hi = pair
    d = _quiet(departure.diameter, [lo, hi], w, method=method)
    assert 0 <= d[0] <= d[1]
    if hi - lo > 1e-9:
        assert d[0] < d[1]


@FEW
@given(_pair(0.0, 180.0), st.floats(1e3, 1e6), WATER_STATE)
def test_onset_superheat_against_angle_as_each_model_says(pair, q, w):
    lo, hi = pair
    # Hsu tangency: dT = 2 cos(theta/2) (2 zeta q/k_l)^(1/2): falls as the angle rises (wetting delays onset);
    # the critical radius sin(theta/2) (2 zeta k_l/q)^(1/2) rises.
    dt = _quiet(nucleation.onset_superheat, q, w, [lo, hi], method="hsu")
    assert dt[0] >= dt[1] >= 0
    r = _quiet(nucleation.onset_cavity_radius, q, w, [lo, hi], method="hsu")
    assert r[0] <= r[1]
    # Davis-Anderson and Bergles-Rohsenow do not use the angle; Kandlikar's superheat does not either.
    for method in ("davis_anderson", "kandlikar", "bergles_rohsenow"):
        v = np.broadcast_to(_quiet(nucleation.onset_superheat, q, w, [lo, hi], method=method), (2,))
        assert v[0] == v[1]


@FEW
@given(_pair(1e2, 1e7), WATER_STATE, angle, st.sampled_from(nucleation.ONSET_METHODS))
def test_onset_superheat_rises_with_heat_flux(pair, w, theta, method):
    lo, hi = pair
    dt = _quiet(nucleation.onset_superheat, [lo, hi], w, theta, method=method)
    assert dt[0] <= dt[1] * (1 + 4 * EPS)  # up to rounding of neighbouring doubles


@FEW
@given(_pair(0.0, 180.0))
def test_flat_wall_barrier_falls_with_angle(pair):
    # f = (2 - cos t)(1 + cos t)^2/4: 1 at 0 deg, 1/2 at 90, 0 at 180, decreasing
    f = nucleation.barrier_factor(list(pair))
    assert 1.0 >= f[0] >= f[1] >= 0.0


@settings(max_examples=15, deadline=None)
@given(_pair(0.0, 180.0), st.floats(2e3, 1e7))
def test_kinetic_superheat_falls_with_angle(pair, p):
    dt = _quiet(nucleation.kinetic_superheat, list(pair), p)
    assume(not np.isnan(dt).any())
    assert dt[0] >= dt[1] >= 0.0


@FEW
@given(angle, _pair(1.0, 3.0))
def test_wenzel_amplifies(theta, rs):
    # cos t* = r cos t (Wenzel 1936): roughness pushes the angle away from 90 deg
    r1, r2 = rs
    t1, t2 = _quiet(wetting.wenzel, theta, [r1, r2])
    # acos amplifies one ulp of cos t by 1/sin t: allow that much (in degrees)
    slack = 1e-12 + 4 * np.finfo(float).eps / max(np.sin(np.radians(theta)), 1e-300) * 180 / np.pi
    if theta < 90.0:
        assert t2 <= t1 + slack and t1 <= theta + slack
    elif theta > 90.0:
        assert t2 >= t1 - slack and t1 >= theta - slack
    else:
        assert t1 == t2 == 90.0
    # (acos near 1 resolves angles to about 1e-6 deg)
    assert _quiet(wetting.wenzel, theta, 1.0) == pytest.approx(theta, abs=2e-6)


@FEW
@given(angle, _pair(0.0, 1.0))
def test_cassie_baxter_air_fraction_raises_the_angle(theta, fs):
    # cos t* = f (cos t + 1) - 1 (r = 1): less solid under the drop, higher angle; f = 1 is the intrinsic angle
    f_lo, f_hi = fs
    t_lo, t_hi = _quiet(wetting.cassie_baxter, theta, [f_lo, f_hi])
    assert t_lo >= t_hi - 1e-9
    assert _quiet(wetting.cassie_baxter, theta, 1.0) == pytest.approx(theta, abs=2e-6)


@FEW
@given(_pair(273.16, 647.0))
def test_water_saturation_monotone_in_temperature(pair):
    # Along the saturation line p_sat and rho_v rise with T; h_lv and sigma fall (IAPWS SR1-86, R1-76, R6-95).
    lo, hi = pair
    assume(hi - lo > 1e-9)
    w = _quiet(water_at_temperature, np.array([lo, hi]))
    assert w.p[0] < w.p[1]
    assert w.rho_v[0] < w.rho_v[1]
    assert w.h_lv[0] > w.h_lv[1]
    assert w.sigma[0] > w.sigma[1]
    assert w.rho_l[1] < w.rho_l[0] or lo < 278.0  # liquid density peaks near 277 K


@FEW
@given(_pair(611.6571, 22.06e6))  # from p_sat(273.16 K) = 611.65707 Pa (SR1-86)
def test_water_saturation_temperature_rises_with_pressure_and_round_trips(pair):
    lo, hi = pair
    assume(hi > lo * (1 + 1e-12))
    w = _quiet(water_at_pressure, np.array([lo, hi]))
    assert w.T[0] < w.T[1]
    back = _quiet(water_at_temperature, w.T)
    np.testing.assert_allclose(back.p, [lo, hi], rtol=1e-13)


@FEW
@given(WATER_STATE, st.floats(0.1, 50.0), st.floats(0.002, 0.02), st.floats(0.8, 2.0))
def test_rohsenow_and_its_inverse(w, dt, c_sf, n):
    q = _quiet(boiling.rohsenow, dt, w, c_sf, n)
    assert q > 0
    assert _quiet(boiling.rohsenow_superheat, q, w, c_sf, n) == pytest.approx(dt, rel=1e-12)
    assert _quiet(boiling.rohsenow, dt * 1.01, w, c_sf, n) > q


@FEW
@given(WATER_STATE, st.floats(0.1, 50.0), st.floats(1e-7, 1e-5))
def test_cooper_and_its_inverse(w, dt, rp):
    q = _quiet(boiling.cooper, dt, w, rp)
    assert q > 0
    assert _quiet(boiling.cooper_superheat, q, w, rp) == pytest.approx(dt, rel=1e-11)
    assert _quiet(boiling.cooper, dt * 1.01, w, rp) > q


@FEW
@given(WATER_STATE, st.floats(1e-8, 1e-4))
def test_embryo_radius_inverts_embryo_superheat(w, r):
    dt = _quiet(nucleation.embryo_superheat, r, w)
    assert dt > 0
    assert _quiet(nucleation.embryo_radius, dt, w) == pytest.approx(r, rel=1e-13)
    # Where 2 sigma/r is small against p the integrated form tends to 2 sigma T/(rho_v h_lv r), the
    # linear form over (1 - rho_v/rho_l) (embryo_superheat docs; first-order chemical-potential
    # balance dT = v_v dp T/h_lv), at every pressure up to the critical point.
    x = w.rho_v / w.rho_l
    if 2 * w.sigma / (r * w.p) < 1e-3:
        exact = _quiet(nucleation.embryo_superheat, r, w, exact=True)
        assert exact == pytest.approx(dt / (1 - x), rel=2e-3)


@FEW
@given(_pair(1e-5, 1e-2), WATER_STATE, st.sampled_from(departure.FREQUENCY_METHODS))
def test_departure_frequency_falls_with_diameter(pair, w, method):
    lo, hi = pair
    f = _quiet(departure.frequency, [lo, hi], w, method=method)
    assert f[0] * (1 + 4 * EPS) >= f[1] > 0  # up to rounding of neighbouring doubles


@FEW
@given(_pair(0.0, 40.0), WATER_STATE, st.floats(5.0, 90.0), st.sampled_from(nucleation.SITE_DENSITY_METHODS))
def test_site_density_rises_with_superheat(pair, w, theta, method):
    lo, hi = pair
    n = _quiet(nucleation.site_density, [lo, hi], w, theta, method=method)
    assume(not np.isinf(n).any())
    assert 0 <= n[0] <= n[1] * (1 + 4 * EPS)  # up to rounding of neighbouring doubles


@FEW
@given(_pair(0.0, 180.0), WATER_STATE, st.floats(1.0, 30.0), st.sampled_from(["wang_dhir", "basu", "hibiki_ishii"]))
def test_site_density_rises_with_angle(pair, w, dt, method):
    # 1 - cos(theta) (Wang-Dhir, Basu) and 1 - exp(-theta^2/(8 mu^2)) (Hibiki-Ishii) rise with theta
    lo, hi = pair
    n = _quiet(nucleation.site_density, dt, w, [lo, hi], method=method)
    assume(not np.isinf(n).any())
    assert 0 <= n[0] <= n[1] * (1 + 4 * EPS)  # up to rounding of neighbouring doubles


@FEW
@given(WATER_STATE)
def test_critical_heat_flux_exceeds_the_minimum_heat_flux(w):
    q_max = chf.zuber(w)
    for method in chf.MINIMUM_METHODS:
        assert 0 < _quiet(chf.minimum_heat_flux, w, method=method) < q_max


@FEW
@given(st.floats(0.0, 0.08), st.floats(0.0, 0.08), st.floats(0.01, 0.08))
def test_young_angle_and_young_dupre_agree(s_sv, s_sl, s_lv):
    # W = sigma_lv (1 + cos t) = sigma_lv + sigma_sv - sigma_sl while |sigma_sv - sigma_sl| <= sigma_lv
    assume(abs(s_sv - s_sl) <= s_lv)
    t = wetting.young_angle(s_sv, s_sl, s_lv)
    assert 0.0 <= t <= 180.0
    assert wetting.adhesion_work(s_lv, t) == pytest.approx(s_lv + s_sv - s_sl, rel=1e-9, abs=1e-12)
    assert wetting.spreading_coefficient(s_sv, s_sl, s_lv) <= 0.0 + 1e-15


@FEW
@given(st.floats(0.5, 30.0), WATER_STATE, st.floats(1.0, 179.0), st.floats(1e-5, 1e-3), st.floats(0.0, 20.0))
def test_hsu_active_radii_are_ordered(dt, w, theta, delta, sub):
    r = _quiet(nucleation.hsu_active_radii, dt, w, theta, delta, sub)
    if not math.isnan(r.r_min):
        assert 0 < r.r_min <= r.r_max


@FEW
@given(_pair(0.0, 180.0), st.floats(0.0, 180.0), st.floats(0.01, 0.08), st.floats(1e-4, 1e-2))
def test_retention_force_rises_with_hysteresis(adv, rec, s_lv, width):
    a1, a2 = adv
    assume(rec <= a1)
    f1, f2 = _quiet(wetting.retention_force, s_lv, [a1, a2], rec, width)
    assert 0 <= f1 <= f2


@FEW
@given(_pair(0.0, 180.0), st.floats(0.0, 90.0))
def test_vapour_trapping_is_monotone_in_the_advancing_angle(adv, beta):
    # Bankoff: traps when theta_a > 2 beta
    t1, t2 = nucleation.traps_vapour(beta, list(adv))
    assert t1 <= t2 and {t1, t2} <= {0.0, 1.0}


@FEW
@given(_pair(0.0, 30.0), WATER_STATE, st.floats(1e-3, 0.2), st.floats(1e-4, 2e-3))
def test_natural_convection_rises_with_superheat(pair, w, length, beta):
    lo, hi = pair
    q = _quiet(boiling.natural_convection, [lo, hi], w, length, beta)
    # rounding may reverse the order of neighbouring doubles by an ulp or two
    assert 0 <= q[0] <= q[1] * (1 + 4 * EPS)


@FEW
@given(_pair(50.0, 800.0), WATER_STATE, st.floats(1e-4, 1e-2))
def test_film_boiling_rises_with_superheat(pair, w, d):
    lo, hi = pair
    q = _quiet(boiling.film_boiling, [lo, hi], w, "cylinder", diameter=d)
    # rounding may reverse the order of neighbouring doubles by an ulp or two
    # (found by hypothesis at 800 K - 1 ulp against 800 K)
    assert 0 < q[0] <= q[1] * (1 + 4 * EPS)


# --------------------------------------------------------------------------- the method dispatchers


def _dispatcher_cases():
    from test_robustness import SCALAR_ONLY, UNUSED, dispatcher_cases

    out = []
    for case_id, f, base in dispatcher_cases():
        numeric = [p for p, v in base.items() if isinstance(v, float) and p not in UNUSED.get(case_id, ())]
        if numeric and case_id not in SCALAR_ONLY:
            out.append((case_id, f, base, numeric))
    return out


DISPATCHERS = _dispatcher_cases()


@pytest.mark.parametrize("case", [c[0] for c in DISPATCHERS])
def test_dispatcher_scalar_path_equals_array_path(case):
    """Every method of every dispatcher: plain numbers and one-element arrays
    give the same bits, and the scalar call returns Python floats."""
    _, f, base, numeric = next(c for c in DISPATCHERS if c[0] == case)
    values = st.fixed_dictionaries({p: st.floats(0.5 * base[p], 1.5 * base[p]) for p in numeric})

    @settings(max_examples=40, deadline=None)
    @given(values)
    def check(drawn):
        args = dict(base, **drawn)
        scalar = _quiet(f, **args)
        leaves = [v for v in kc.outputs(scalar) if not isinstance(v, str)]
        assert all(isinstance(v, float) for v in leaves), (case, scalar)
        arr = _quiet(f, **dict(args, **{p: np.array([v]) for p, v in drawn.items()}))
        arr_leaves = [v for v in kc.outputs(arr) if not isinstance(v, str)]
        for s, a in zip(leaves, arr_leaves):
            assert kc.same_bits(s, np.asarray(a).reshape(-1)[0]), (case, args, s, a)

    check()
