"""Published validity ranges: declared by every model, enforced by one counted
RangeWarning per call.

Every registered model declares its published validity (or says plainly that
there is none, and why). For every kernel with a range the table below gives
kernel inputs that leave it (chosen from the range stated in the model's own
``validity`` text); the test mixes such elements with in-range ones and
checks: the elements are computed (not NaN, unless the model documents a "no
answer" there), exactly one RangeWarning per call names the public function
and counts them, `wetboil.validity` marks exactly them with code 2, and
``errstate(out_of_range=...)`` turns the warning off or into OutOfRangeError.
"""

from __future__ import annotations

import math
import re
import warnings

import numpy as np
import pytest

import wetboil
from wetboil import _core

import kernel_cases as kc

# kernel -> {kernel input name: value outside the published range}; the reason
# quotes the model's validity text.
OUT_OF_RANGE = {
    "water_saturation_t": ({"T": 646.0}, "T <= 0.997 T_crit = 645.15 K"),
    "water_saturation_p": ({"p": 21.8e6}, "T_sat(p) <= 0.997 T_crit"),
    "embryo_superheat_linear": ({"radius": 2e-9}, "superheat <= 0.1 T_sat"),
    "embryo_radius_linear": ({"superheat": 60.0}, "superheat <= 0.1 T_sat"),
    "embryo_superheat_exact": ({"radius": 3e-8}, "superheat <= 0.1 T_sat"),
    "bergles_rohsenow_onset": ({"fluid.p": 0.5e5}, "15 <= p <= 2000 psia"),
    "hsu_onset": ({"heat_flux": 1e14}, "exceeds 0.1 T_sat"),
    "davis_anderson_onset": ({"heat_flux": 1e14}, "exceeds 0.1 T_sat"),
    "kandlikar_onset": ({"heat_flux": 1e14}, "exceeds 0.1 T_sat"),
    "wang_dhir_site_density": ({"contact_angle_deg": 10.0}, "18 <= theta <= 90 deg"),
    "basu_site_density": ({"contact_angle_deg": 10.0}, "30 <= theta <= 90 deg"),
    "hibiki_ishii_site_density": ({"contact_angle_deg": 2.0}, "5 <= theta <= 90 deg"),
    "lemmert_chawla_site_density": ({"wall_superheat": 25.0}, "flagged above 20 K"),
    "fritz_departure": ({"contact_angle_deg": 120.0}, "contact_angle_deg <= 90"),
    "kocamustafaogullari_ishii_departure": ({"contact_angle_deg": 120.0}, "contact_angle_deg <= 90"),
    "klausner_force_balance": ({"orientation_deg": 120.0}, "orientation_deg <= 90"),
    "cole_frequency": ({"diameter": 0.0}, "a zero diameter has no departure cycle"),
    "zuber_frequency": ({"diameter": 0.0}, "a zero diameter has no departure cycle"),
    "ivey_hydrodynamic_frequency": ({"diameter": 0.0}, "a zero diameter has no departure cycle"),
    "ivey_transition_frequency": ({"diameter": 0.0}, "a zero diameter has no departure cycle"),
    "zuber_chf": ({"K": 0.3}, "0.10 <= K <= 0.20"),
    "kandlikar_chf": ({"orientation_deg": 100.0}, "0 <= orientation_deg <= 90"),
    "lienhard_dhir_chf": ({"geometry": 0.0, "size": 1e-3}, "large flat plate L' >= 27"),
    "minimum_heat_flux": ({"C": 0.3}, "0.05 <= C <= 0.20"),
    "rohsenow_heat_flux": ({"C_sf": 0.05}, "0.002 <= C_sf <= 0.02"),
    "rohsenow_superheat": ({"n": 3.0}, "0.8 <= n <= 2"),
    "cooper_heat_flux": ({"fluid.p": 21.0e6}, "0.001 <= p/p_crit <= 0.9"),
    "cooper_superheat": ({"fluid.p": 10.0}, "0.001 <= p/p_crit <= 0.9"),
    "rpi_partition": ({"site_density": 1e9, "departure_diameter": 2e-3}, "area_factor N pi D^2/4 <= 1"),
    "tolubinsky_kostanchuk_departure": ({"subcooling": 70.0}, "0 <= subcooling <= 60 K"),
    "lloyd_moran_natural_convection": ({"length": 1e-4, "superheat": 1.0}, "1e4 <= Ra_L <= 1e11"),
    "churchill_chu_natural_convection": ({"length": 1.0, "superheat": 50.0}, "1e-5 <= Ra_D <= 1e12"),
    "churchill_sphere_natural_convection": ({"length": 1.0, "superheat": 50.0}, "Ra_D <= 1e11"),
    "churchill_chu_vertical_plate_natural_convection": ({"length": 2.0, "superheat": 80.0}, "1e-1 <= Ra_L <= 1e12"),
    "girifalco_good": ({"phi": 1.5}, "0.5 <= phi <= 1.1"),
    "wenzel_angle": ({"contact_angle_deg": 20.0, "roughness_ratio": 2.5}, "|r cos(theta)| <= 1"),
    "cassie_baxter_angle": ({"contact_angle_deg": 10.0, "solid_fraction": 1.0, "roughness_ratio": 2.0},
                            "|cos(theta*)| <= 1"),
    "impregnated_angle": ({"contact_angle_deg": 80.0, "solid_fraction": 0.25, "roughness_ratio": 2.0},
                          "the texture wicks"),
    "vdw_disjoining_pressure": ({"thickness": 3e-10}, "1 nm <= thickness <= 20 nm"),
    "vdw_film_thickness": ({"height": 1e-9, "hamaker": -1e-19}, "result between 1 nm and 20 nm"),
    "water_screening_chain": ({"contact_angle_deg": 120.0}, "contact_angle_deg <= 90 (Fritz)"),
}

# kernels whose validity text says there is no numeric range (and why)
NO_RANGE_WORDS = re.compile(r"\b(no|none|not)\b", re.IGNORECASE)


def _in_range_base(kernel):
    """Public arguments of one element inside the published range."""
    f, spec = kc.BY_KERNEL[kernel]
    rng = np.random.default_rng(1)
    fixed = {  # a few kernels need a hand-picked point inside a narrow range
        "bergles_rohsenow_onset": {"fluid": wetboil.fluids.water(p=5e5)},
        "wang_dhir_site_density": {"fluid": wetboil.fluids.water(p=101325.0), "contact_angle_deg": 45.0,
                                   "wall_superheat": 10.0},
        "basu_site_density": {"fluid": wetboil.fluids.water(p=101325.0), "contact_angle_deg": 45.0,
                              "wall_superheat": 10.0},
        "hibiki_ishii_site_density": {"fluid": wetboil.fluids.water(p=101325.0), "contact_angle_deg": 45.0,
                                      "wall_superheat": 10.0},
        "lienhard_dhir_chf": {"geometry": 0.0, "size": 0.5, "area": 0.25},
        "vdw_film_thickness": {"height": 0.01, "hamaker": -1e-20},
        "vdw_disjoining_pressure": {"thickness": 5e-9},
        "lloyd_moran_natural_convection": {"superheat": 5.0, "length": 0.05},
        "churchill_chu_natural_convection": {"superheat": 5.0, "length": 0.005},
        "churchill_sphere_natural_convection": {"superheat": 5.0, "length": 0.005},
        "churchill_chu_vertical_plate_natural_convection": {"superheat": 5.0, "length": 0.05},
        "rpi_partition": {"site_density": 1e5, "departure_diameter": 1e-3, "area_factor": 4.0},
        "embryo_superheat_exact": {"fluid": wetboil.fluids.water(p=101325.0), "radius": 1e-5},
        "embryo_superheat_linear": {"fluid": wetboil.fluids.water(p=101325.0), "radius": 1e-5},
        "embryo_radius_linear": {"fluid": wetboil.fluids.water(p=101325.0), "superheat": 5.0},
        "cooper_heat_flux": {"fluid": wetboil.fluids.water(p=101325.0)},
        "cooper_superheat": {"fluid": wetboil.fluids.water(p=101325.0)},
        "klausner_force_balance": {"orientation_deg": 0.0},
        "kandlikar_chf": {"orientation_deg": 0.0},
        "impregnated_angle": {"contact_angle_deg": 30.0, "solid_fraction": 0.25, "roughness_ratio": 2.0},
    }.get(kernel, {})
    for _ in range(500):
        args = dict(kc.draw_args(spec, rng), **fixed)
        x = kc.kernel_inputs(spec, args)
        with np.errstate(all="ignore"):
            if int(getattr(_core, f"{kernel}_status")(*x)) == 0:
                return f, spec, args
    raise AssertionError(f"{kernel}: no in-range point found")


def test_every_model_declares_its_validity():
    models = {m.name: m for m in wetboil.models()}
    for m in models.values():
        assert m.validity.strip(), f"{m.name}: empty validity"
        ref = re.match(r"as (\w+)\b", m.validity)
        if ref and ref.group(1) in models:  # "as furmidge_retention_force; ...": that model's statement
            m = models[ref.group(1)]
        if m.name not in OUT_OF_RANGE:
            # no numeric range: the text must say so, with a reason (more than a bare "none")
            assert NO_RANGE_WORDS.search(m.validity), f"{m.name}: no range tested, validity {m.validity!r}"
            reason = NO_RANGE_WORDS.split(m.validity, maxsplit=1)[-1]
            assert len(m.validity) > 12 and len(reason.strip(" :;,.()")) > 5, (
                f"{m.name}: validity gives no reason: {m.validity!r}")


def test_the_table_covers_every_kernel_that_flags():
    """Random physical inputs never leave the range of a kernel that declares
    none; every kernel in the table is a registered kernel."""
    names = {m.name for m in wetboil.models()}
    assert set(OUT_OF_RANGE) <= names
    rng = np.random.default_rng(8)
    for kernel, (f, spec) in kc.BY_KERNEL.items():
        if kernel in OUT_OF_RANGE:
            continue
        args = kc.draw_args(spec, rng, 2000)
        with np.errstate(all="ignore"):
            codes = getattr(_core, f"{kernel}_status")(*kc.kernel_inputs(spec, args))
        assert not (codes == 2).any(), f"{kernel} flags elements out of range but has no entry in OUT_OF_RANGE"


@pytest.mark.parametrize("kernel", sorted(set(OUT_OF_RANGE) & set(kc.BY_KERNEL)))
def test_leaving_the_range_warns_once_per_call_with_a_count(kernel):
    f, spec, base = _in_range_base(kernel)
    changes, reason = OUT_OF_RANGE[kernel]
    names = [a.name for a in spec.model.inputs]
    for name in changes:
        assert name in names, f"{kernel}: no input {name}"
    x_in = kc.kernel_inputs(spec, base)
    x_out = [changes.get(n, v) for n, v in zip(names, x_in)]
    with np.errstate(all="ignore"):
        code = int(getattr(_core, f"{kernel}_status")(*x_out))
    assert code == 2, f"{kernel}: {changes} is not out of range ({reason})"

    # 7 elements, 3 of them out of range
    pattern = np.array([0, 1, 0, 0, 1, 1, 0], dtype=bool)
    x_mix = [np.where(pattern, vo, vi) if vo != vi else vi for vi, vo in zip(x_in, x_out)]
    args = kc.args_from_inputs(spec, x_mix, base)
    with warnings.catch_warnings(record=True) as rec:
        warnings.simplefilter("always")
        out = kc.call(f, spec, args)
    ranges = [w for w in rec if w.category is wetboil.RangeWarning]
    assert len(ranges) == 1, (kernel, [str(w.message) for w in rec])
    msg = str(ranges[0].message)
    assert msg.startswith(spec.function + ":") and "3 of 7" in msg, msg
    # and quotes the range it left, as the model's facts state it, without the unit-slip bounds its
    # inputs are within (they have their own test, test_a_tension_in_mn_per_m_is_flagged)
    assert msg.endswith(f"outside the published validity range ({spec.model.own_validity})"), msg
    assert not [w for w in rec if w.category is wetboil.InvalidValueWarning], kernel
    # the elements are computed, not blanked
    for k, o in enumerate(kc.outputs(out)):
        o = np.broadcast_to(np.asarray(o, dtype=float), pattern.shape)
        assert np.isfinite(o[~pattern]).all() or kernel in kc.NO_ANSWER, (kernel, o)
        computed = ~np.isnan(o[pattern])
        assert computed.all() or kernel in kc.NO_ANSWER, (kernel, kc.output_names(spec)[k], o)
    # validity marks exactly those elements
    codes = np.broadcast_to(wetboil.validity(f, *[args[p] for p in spec.params]), pattern.shape)
    assert codes.tolist() == np.where(pattern, 2, 0).tolist(), (kernel, codes)

    # a scalar call out of range: the fast path hands over to the counted path
    scalar_args = kc.args_from_inputs(spec, x_out, base)
    with warnings.catch_warnings(record=True) as rec:
        warnings.simplefilter("always")
        kc.call(f, spec, scalar_args)
    msgs = [str(w.message) for w in rec if w.category is wetboil.RangeWarning]
    assert len(msgs) == 1 and "1 of 1" in msgs[0] and spec.model.own_validity in msgs[0], (kernel, msgs)

    # errstate: ignore silences, raise raises OutOfRangeError (a ValueError and a WetboilError)
    with warnings.catch_warnings(record=True) as rec, wetboil.errstate(out_of_range="ignore"):
        warnings.simplefilter("always")
        kc.call(f, spec, args)
    assert not [w for w in rec if w.category is wetboil.RangeWarning]
    with wetboil.errstate(out_of_range="raise"), pytest.raises(wetboil.OutOfRangeError, match="3 of 7"):
        kc.call(f, spec, args)
    assert issubclass(wetboil.OutOfRangeError, ValueError) and issubclass(wetboil.OutOfRangeError, wetboil.WetboilError)


LIQUID_TENSIONS = {"sigma_lv", "sigma_l", "fluid.sigma", "liquid_dispersive", "liquid_polar"}
SOLID_ENERGIES = {"sigma_sv", "sigma_sl", "sigma_s", "solid_dispersive", "solid_polar"}
# The bounds every model adds to its own range, by the inputs they apply to, a value in mN/m
# of such an input, and the words of the range clause. A liquid's surface tension above 1 N/m: no
# liquid that boils in service comes near it (mercury, the highest of the common liquids, is about
# 0.49 N/m at room temperature [common practice, from memory]), and the usual cause is a value in
# mN/m, which the models would otherwise take silently (Zuber's CHF 5.6 times too high). A solid's
# surface energy or an interfacial tension above 10 N/m: a clean metal's is 1-2 J/m2, the highest
# solids' about 3-6 [common practice, from memory], while a polymer's components in mN/m, as tables
# print them, read 10-70 and made every liquid spread (0 deg) without a word.
# A Hamaker constant above 1e-17 J in magnitude: real ones are 1e-21 to 5e-19 J [common practice,
# from memory: Israelachvili's and Hough & White's tables], and one typed in units of 1e-20 J, as
# tables print them, gave disjoining pressures 1e20 times too high. A drop's contact width above
# 0.1 m (typed in mm) or its mass above 0.01 kg (typed in mg) [common practice: a drop wider than a
# few capillary lengths, 2.7 mm for water, is a puddle]. A roughness Rp above 1 mm: Cooper (1984)
# writes Rp in micrometres (his default is 1 um), and one typed so reads a micrometre as a metre
# [common practice: machined and coated surfaces are 0.01 to tens of micrometres].
TENSION_BOUNDS = {
    "liquid": (LIQUID_TENSIONS, lambda v: v * 1e3, "liquid surface tension <= 1 N/m"),
    "solid": (SOLID_ENERGIES, lambda v: max(v * 1e3, 10.5), "solid surface energy and interfacial tension <= 10 N/m"),
    "hamaker": ({"hamaker", "hamaker_solid", "hamaker_liquid"}, lambda v: v * 1e20, "|Hamaker constant| <= 1e-17 J"),
    "width": ({"width"}, lambda v: v * 1e3, "drop width <= 0.1 m"),
    "mass": ({"mass"}, lambda v: v * 1e6, "drop mass <= 0.01 kg"),
    "roughness": ({"roughness_Rp"}, lambda v: v * 1e6, "roughness Rp <= 1 mm"),
}


@pytest.mark.parametrize("bound,kernel", sorted((b, k) for b, (names, _, _) in TENSION_BOUNDS.items()
                                                for k, (f, spec) in kc.BY_KERNEL.items()
                                                if {a.name for a in spec.model.inputs} & names))
def test_a_tension_in_mn_per_m_is_flagged(bound, kernel):
    # Every kernel that takes such an input flags it in the slipped unit (the other inputs stay in range).
    names, slip, clause = TENSION_BOUNDS[bound]
    f, spec, base = _in_range_base(kernel)
    inputs = [a.name for a in spec.model.inputs]
    x_out = [slip(v) if n in names else v for n, v in zip(inputs, kc.kernel_inputs(spec, base))]
    assert clause in spec.model.validity, spec.model.validity
    with np.errstate(all="ignore"):
        assert int(getattr(_core, f"{kernel}_status")(*x_out)) == 2, kernel
    with warnings.catch_warnings(record=True) as rec:
        warnings.simplefilter("always")
        kc.call(f, spec, kc.args_from_inputs(spec, x_out, base))
    msgs = [str(w.message) for w in rec if w.category is wetboil.RangeWarning]
    assert len(msgs) == 1 and clause in msgs[0], (kernel, [str(w.message) for w in rec])
    # The message names the bound the element exceeded, not the model's own range it did not leave.
    own = spec.model.own_validity
    assert own and own in spec.model.validity and own not in msgs[0], (kernel, msgs[0])


def test_tension_outliers_are_counted_in_large_arrays():
    # The block loops check the tension bound apart from the kernel (rare path):
    # scattered outliers among 200 001 elements (several blocks, both threads),
    # some next to NaN and to out-of-range elements, are each counted once, and
    # match the per-element codes. Counting [identity: 1 in 997, 1 in 13].
    n = 200_001
    w = wetboil.fluids.water(p=101325.0)
    sigma = np.full(n, w.sigma)
    sigma[::997] *= 1e3          # mN/m slips
    K = np.full(n, 0.149)
    K[5::13] = 0.3               # out of Zuber's own range (0.10-0.20)
    sigma[7::101] = np.nan       # missing data
    f = w.replace(sigma=sigma)
    codes = wetboil.validity(wetboil.chf.zuber, f, K)
    want = int(((sigma > 1) | (K > 0.2))[~np.isnan(sigma)].sum())
    assert int((codes == 2).sum()) == want
    with pytest.warns(wetboil.RangeWarning, match=f"{want} of {n}") as rec:
        q = wetboil.chf.zuber(f, K)
    assert np.isnan(q[7::101]).all() and np.isfinite(q[::997][~np.isnan(sigma[::997])]).all()
    # The loops count the elements above the bound apart ([identity]: the slips that are not NaN),
    # on the ufunc path and on the grid path (a broadcast the ufunc would buffer)
    slips = int((sigma > 1)[~np.isnan(sigma)].sum())
    _core.take_counts()
    with np.errstate(all="ignore"):
        _core.zuber_chf(w.h_lv, w.rho_l, w.rho_v, sigma, K, 9.80665)
    assert _core.take_counts() == (0, want, slips)
    sig2, k2 = sigma[:400, None], K[None, :300]
    shape = (400, 300)
    ins = [np.broadcast_to(np.asarray(v, dtype=np.float64), shape)
           for v in (w.h_lv, w.rho_l, w.rho_v, sig2, k2, 9.80665)]
    out = np.empty(shape)
    with np.errstate(all="ignore"):
        counts = _core.grid_call("zuber_chf", ins, [out])
    over = np.broadcast_to(~np.isnan(sig2) & (sig2 > 1), shape)
    assert counts[2] == int(over.sum()) and counts[1] == int((over | (np.broadcast_to(k2, shape) > 0.2)
                                                              & ~np.isnan(np.broadcast_to(sig2, shape))).sum())
    # Both kinds are named: Zuber's own constant range and the tension bound.
    (msg,) = [str(w.message) for w in rec]
    assert "0.10 <= K <= 0.20" in msg and "liquid surface tension <= 1 N/m" in msg
    # Only K outside its range: the tension bound, not exceeded, is not quoted.
    with pytest.warns(wetboil.RangeWarning) as rec:
        wetboil.chf.zuber(w, K)
    (msg,) = [str(w.message) for w in rec]
    assert "0.10 <= K <= 0.20" in msg and "surface tension" not in msg


def test_a_solid_surface_energy_above_1_j_per_m2_is_not_flagged():
    # A clean metal's surface energy is 1-2 J/m2 [common practice, from memory]:
    # below the solids' bound of 10 N/m, not flagged.
    with warnings.catch_warnings():
        warnings.simplefilter("error", wetboil.WetboilWarning)
        theta = wetboil.wetting.young_angle(2.0, 1.95, 0.0728)
    assert theta == pytest.approx(math.degrees(math.acos(0.05 / 0.0728)), rel=1e-12)  # Young [identity]


def test_in_range_calls_do_not_warn():
    for kernel in sorted(set(OUT_OF_RANGE) & set(kc.BY_KERNEL)):
        f, spec, base = _in_range_base(kernel)
        with warnings.catch_warnings():
            warnings.simplefilter("error", wetboil.WetboilWarning)
            kc.call(f, spec, base)


def test_one_warning_per_category_when_both_happen():
    """Impossible and out-of-range elements in one call: one warning of each
    kind, each with its own count."""
    from wetboil.departure import fritz

    w = wetboil.fluids.water(p=101325.0)
    theta = np.array([30.0, 120.0, 200.0, 150.0, -5.0, math.nan])
    with warnings.catch_warnings(record=True) as rec:
        warnings.simplefilter("always")
        d = fritz(theta, w)
    by = {w_.category: str(w_.message) for w_ in rec}
    assert len(rec) == 2
    assert "2 of 6" in by[wetboil.InvalidValueWarning] and "2 of 6" in by[wetboil.RangeWarning]
    assert np.isnan(d[[2, 4, 5]]).all() and np.isfinite(d[[0, 1, 3]]).all()


def test_range_message_names_each_bound_exceeded_and_counts_their_union():
    # Two bounded inputs of Young's equation, each above its bound in a different element (typed in
    # mN/m [common practice: a clean metal's surface energy is 1-2 J/m2, from memory]): both clauses
    # are named, and since the two elements are all that is out of range, not the model's own text.
    with pytest.warns(wetboil.RangeWarning) as rec:
        wetboil.wetting.young_angle([20.0, 0.02], [0.01, 20.0], [0.072, 0.072])
    (msg,) = [str(w.message) for w in rec]
    assert "2 of 2" in msg and msg.count("solid surface energy") == 1
    own = wetboil.models()[[m.name for m in wetboil.models()].index("young_angle")].own_validity
    assert own not in msg
    # one slipped element among others outside nothing: the count of the bounded input alone
    with pytest.warns(wetboil.RangeWarning, match=r"1 of 3 .*liquid surface tension <= 1 N/m"):
        wetboil.wetting.young_angle(0.03, 0.01, [0.072, 72.0, 0.05])


def test_count_beyond_counts_magnitudes_in_any_layout():
    # |x| > bound, NaN not counted; contiguous (parallel above 65536 elements) or strided [identity]
    x = np.array([-2.0, -0.5, 0.5, 2.0, np.nan, np.inf])
    assert _core.count_beyond(x, 1.0) == 3
    big = np.tile(x, 50_000)
    assert _core.count_beyond(big, 1.0) == 150_000
    assert _core.count_beyond(big[::2], 1.0) == int((np.abs(big[::2]) > 1.0).sum())
