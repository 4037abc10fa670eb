"""The robustness matrix: every public function against hostile input.

Each public function (every kernel-backed function, the method dispatchers
with each method, and the table and fitting helpers) is called with NaN,
+-inf, -0.0, huge (1e308) and tiny (5e-324) magnitudes, 0-d and empty arrays,
non-contiguous, negative-stride, Fortran-order, big-endian, read-only,
unaligned, int, float32 and object arrays, lists, mixed DataArray/ndarray
arguments, and wrong types (str, None, dict, complex, bytes, bool, object).
Documented results (DESIGN.md section 4, wetboil._errors, the docstrings):

* element problems never raise: NaN input gives NaN silently, impossible
  elements NaN plus one InvalidValueWarning, out-of-range elements a number
  plus one RangeWarning; no other warning (no NumPy RuntimeWarning) escapes;
* structural problems raise at once a WetboilTypeError (wrong type) or
  WetboilValueError (shapes, unknown method), which are TypeError/ValueError
  and WetboilError;
* every layout and dtype gives the float64 contiguous result, bit for bit;
  0-d input gives a Python float, empty input an empty array of that shape.

The matrix runs in child interpreters (one per group of functions), so that
a crash (a segfault in the extension, an abort) fails a test instead of
killing the test run. The children report one line per failed case.
"""

from __future__ import annotations

import inspect
import json
import math
import os
import subprocess
import sys
import traceback
import warnings
from typing import Any, Callable, Dict, List, Tuple

import numpy as np
import pytest

HERE = os.path.dirname(os.path.abspath(__file__))

# --------------------------------------------------------------------------- the calls

G = 9.80665


def _water():
    from wetboil.fluids import water

    return water(T=373.15)


def dispatcher_cases() -> List[Tuple[str, Callable[..., Any], Dict[str, Any]]]:
    """(id, function, valid keyword arguments) of every public function that
    is not itself a kernel-backed builtin: method dispatchers (one case per
    method) and the helpers computed in Python."""
    from wetboil import boiling, chf, departure, fluids, nucleation, wetting

    W = _water()
    cases: List[Tuple[str, Callable[..., Any], Dict[str, Any]]] = [
        ("nucleation.embryo_superheat[linear]", nucleation.embryo_superheat, dict(radius=1e-6, fluid=W)),
        ("nucleation.embryo_superheat[exact]", nucleation.embryo_superheat, dict(radius=1e-6, fluid=W, exact=True)),
        ("nucleation.kinetic_superheat", nucleation.kinetic_superheat, dict(contact_angle_deg=90.0, p=101325.0)),
        ("nucleation.homogeneous_superheat", nucleation.homogeneous_superheat, dict(p=101325.0, rate=1e12)),
        ("departure.cole_rohsenow", departure.cole_rohsenow, dict(fluid=W)),
        ("chf.dimensionless_size", chf.dimensionless_size, dict(size=0.01, fluid=W)),
        ("fluids.water[T]", fluids.water, dict(T=373.15)),
        ("fluids.water[p]", fluids.water, dict(p=101325.0)),
        ("boiling.film_boiling[radiation]", boiling.film_boiling,
         dict(wall_superheat=300.0, fluid=W, geometry="cylinder", diameter=5e-3, emissivity=0.5)),
        ("boiling.partition", boiling.partition,
         dict(wall_superheat=10.0, fluid=W, contact_angle_deg=45.0, convection_coefficient=1500.0, subcooling=5.0)),
        ("wetting.surface_energy", wetting.surface_energy,
         dict(contact_angles_deg=[72.0, 40.0, 55.0], liquids=["water", "diiodomethane", "formamide"])),
        ("wetting.predict_angle", wetting.predict_angle,
         dict(surface=(0.030, 0.010), liquid_sigma_dispersive=21.8e-3, liquid_sigma_polar=51.0e-3)),
        ("wetting.critical_surface_tension", wetting.critical_surface_tension,
         dict(sigma_lv=[0.0240, 0.0254, 0.0276], contact_angle_deg=[35.0, 42.0, 46.0])),
        ("wetting.split_surface_tension", wetting.split_surface_tension, dict(sigma_lv=0.0589)),
        ("wetting.probe_liquid", wetting.probe_liquid, dict(name="water")),
        ("wetting.dispersive_fraction", wetting.dispersive_fraction, dict(fluid="water")),
        ("boiling.rohsenow_exponent", boiling.rohsenow_exponent, dict(fluid=W)),
        ("wetting.hamaker_constant", wetting.hamaker_constant, dict(name="water")),
        ("boiling.surface_constant", boiling.surface_constant, dict(liquid="water", surface="copper, polished")),
        ("boiling.curve", boiling.curve,
         dict(fluid=W, superheat=[1.0, 10.0, 30.0, 300.0, 1000.0], receding_angle_deg=45.0, C_sf=0.013,
              natural_convection_coefficient=800.0, design_heat_flux=5e5)),
        ("fluids.from_coolprop", fluids.from_coolprop, dict(name="R134a", T=273.15)),
    ]
    for m in nucleation.ONSET_METHODS:
        cases.append((f"nucleation.onset_superheat[{m}]", nucleation.onset_superheat,
                      dict(heat_flux=1e5, fluid=W, contact_angle_deg=45.0, method=m)))
    for m in nucleation.ONSET_RADIUS_METHODS:
        cases.append((f"nucleation.onset_cavity_radius[{m}]", nucleation.onset_cavity_radius,
                      dict(heat_flux=1e5, fluid=W, contact_angle_deg=45.0, method=m)))
    for m in nucleation.SITE_DENSITY_METHODS:
        cases.append((f"nucleation.site_density[{m}]", nucleation.site_density,
                      dict(wall_superheat=10.0, fluid=W, contact_angle_deg=45.0, method=m)))
    for m in departure.DIAMETER_METHODS:
        extra = dict(wall_superheat=5.0) if m == "force_balance" else {}
        cases.append((f"departure.diameter[{m}]", departure.diameter,
                      dict(contact_angle_deg=45.0, fluid=W, method=m, **extra)))
    for m in departure.FREQUENCY_METHODS:
        cases.append((f"departure.frequency[{m}]", departure.frequency, dict(diameter=2e-3, fluid=W, method=m)))
    for geo in chf.GEOMETRIES:
        cases.append((f"chf.lienhard_dhir[{geo}]", chf.lienhard_dhir, dict(fluid=W, geometry=geo, size=0.01)))
    for m in chf.MINIMUM_METHODS:
        cases.append((f"chf.minimum_heat_flux[{m}]", chf.minimum_heat_flux, dict(fluid=W, method=m)))
    for geo in boiling.NATURAL_CONVECTION_GEOMETRIES:
        cases.append((f"boiling.natural_convection[{geo}]", boiling.natural_convection,
                      dict(superheat=5.0, fluid=W, length=0.01, expansion_coefficient=7.5e-4, geometry=geo)))
    for geo in boiling.FILM_GEOMETRIES:
        kw = dict(wall_superheat=300.0, fluid=W, geometry=geo)
        if geo != "flat_plate":
            kw["diameter"] = 5e-3
        cases.append((f"boiling.film_boiling[{geo}]", boiling.film_boiling, kw))
    return cases


def kernel_cases() -> List[Tuple[str, Callable[..., Any], Dict[str, Any]]]:
    """(id, function, valid keyword arguments) of every kernel-backed function."""
    import kernel_cases as kc

    rng = np.random.default_rng(7)
    out = []
    for case_id, f, spec in kc.KERNEL_FUNCTIONS:
        args = kc.draw_args(spec, rng)
        # keep away from the domain's own edges: the matrix replaces arguments one at a time
        out.append((case_id, f, args))
    return out


GROUPS = ["fluids", "wetting", "nucleation", "departure", "chf", "boiling", "dispatchers"]


def group_cases(group: str):
    if group == "dispatchers":
        return dispatcher_cases()
    return [c for c in kernel_cases() if c[0].startswith(group + ".")]


# --------------------------------------------------------------------------- the checks

VALUES = {
    "nan": math.nan,
    "+inf": math.inf,
    "-inf": -math.inf,
    "-0.0": -0.0,
    "huge": 1e308,
    "tiny": 5e-324,
}
WRONG = {
    "str": "x",
    "None": None,
    "dict": {"a": 1.0},
    "complex": 1 + 2j,
    "bytes": b"1",
    "bool": True,
    "object": object(),
    "ragged": [[1.0, 2.0], [3.0]],
}


class CaseFailure(AssertionError):
    pass


def _is_number_param(v: Any) -> bool:
    return isinstance(v, float) or (isinstance(v, int) and not isinstance(v, bool))


def _leaves(result: Any) -> List[Any]:
    """The numeric parts of a result (floats, arrays, DataArrays, named tuple fields)."""
    from wetboil.fluids import FIELDS, Saturation

    if isinstance(result, Saturation):
        return [getattr(result, f) for f in FIELDS]
    if isinstance(result, tuple):
        out = []
        for r in result:
            out.extend(_leaves(r))
        return out
    if hasattr(result, "data_vars"):  # an xarray Dataset
        return [np.asarray(v.values) for v in result.data_vars.values() if v.dtype.kind in "fiu"]
    if hasattr(result, "dims"):
        return [np.asarray(result.values)] if result.dtype.kind in "fiu" else []
    if isinstance(result, (float, int, np.floating, np.ndarray)) and np.asarray(result).dtype.kind in "fiu":
        return [result]
    return []


def _call(f, kwargs):
    """Call, recording warnings; return (result, exception, warning categories and messages)."""
    import wetboil

    with warnings.catch_warnings(record=True) as rec:
        warnings.simplefilter("always")
        try:
            res, exc = f(**kwargs), None
        except Exception as e:  # noqa: BLE001 - we classify below
            res, exc = None, e
    foreign = [f"{w.category.__name__}: {w.message}" for w in rec if not issubclass(w.category, wetboil.WetboilWarning)]
    return res, exc, rec, foreign


def _same(a, b) -> bool:
    import kernel_cases as kc

    la, lb = _leaves(a), _leaves(b)
    return len(la) == len(lb) and all(kc.same_bits(x, y) for x, y in zip(la, lb))


#: Arguments a method documents as not used (its value is ignored, whatever it is).
UNUSED = {
    "nucleation.onset_superheat[davis_anderson]": {"contact_angle_deg"},
    "nucleation.onset_superheat[bergles_rohsenow]": {"contact_angle_deg"},
    "nucleation.onset_cavity_radius[davis_anderson]": {"contact_angle_deg"},
    "nucleation.site_density[lemmert_chawla]": {"contact_angle_deg", "fluid"},
    "departure.frequency[ivey]": {"fluid"},
    "departure.frequency[ivey_transition]": {"fluid"},
    "departure.diameter[cole_rohsenow]": {"contact_angle_deg"},
    # the default closures (Lemmert-Chawla, Tolubinsky-Kostanchuk, Cole) take no angle
    "boiling.partition": {"contact_angle_deg"},
}
#: Functions whose numeric options are single numbers by signature (one surface, one state).
SCALAR_ONLY = {"boiling.curve"}


def check_function(case_id: str, f: Callable[..., Any], base: Dict[str, Any]) -> List[str]:
    """Run the matrix for one function; return one line per failed case."""
    import wetboil
    from wetboil.fluids import Saturation

    fails: List[str] = []

    def fail(what: str) -> None:
        fails.append(f"{case_id}: {what}")

    ref, exc, _, foreign = _call(f, base)
    if exc is not None:
        return [f"{case_id}: valid call raised {type(exc).__name__}: {exc}"]
    if foreign:
        fail(f"valid call emitted {foreign}")
    unused = UNUSED.get(case_id, set())
    base_used = {p: v for p, v in base.items() if p not in unused}
    numeric = [p for p, v in base_used.items() if _is_number_param(v)]
    arrays = [p for p, v in base_used.items() if isinstance(v, list) and all(_is_number_param(x) for x in v)]

    # -- element values: never raise, only wetboil warnings, NaN in -> NaN out
    for p in numeric:
        for label, v in VALUES.items():
            res, exc, rec, foreign = _call(f, dict(base, **{p: v}))
            where = f"{p}={label}"
            if exc is not None:
                if not isinstance(exc, wetboil.WetboilError):
                    fail(f"{where}: raised {type(exc).__name__}: {exc}")
                continue
            if foreign:
                fail(f"{where}: emitted {foreign}")
            cats = [w.category for w in rec]
            one_kernel = getattr(f, "__self__", None) is not None  # composites warn once per kernel they call
            if one_kernel and (cats.count(wetboil.InvalidValueWarning) > 1 or cats.count(wetboil.RangeWarning) > 1):
                fail(f"{where}: more than one warning of a kind: {[str(w.message) for w in rec]}")
            leaves = _leaves(res)
            if label == "nan" and leaves and not any(np.isnan(np.asarray(x, dtype=float)).any() for x in leaves):
                fail(f"{where}: NaN input gave no NaN: {res!r}")
            if label == "nan" and wetboil.InvalidValueWarning in cats and getattr(f, "__self__", None) is not None:
                fail(f"{where}: NaN input (missing data) counted as impossible")

    # -- 0-d, empty, layouts and dtypes of each numeric argument
    for p in (arrays if case_id in SCALAR_ONLY else numeric + arrays):
        v = np.asarray(base[p], dtype=float)
        variants: Dict[str, Any] = {}
        if v.ndim == 0:
            variants["0-d"] = np.array(float(v))
        vec = np.full(24, float(v)) if v.ndim == 0 else v
        strided = np.empty(vec.size * 2)
        strided[::2] = vec
        ro = vec.copy()
        ro.flags.writeable = False
        buf = np.zeros(vec.size * 8 + 1, dtype=np.uint8)
        unaligned = np.frombuffer(buf[1:].data, dtype=np.float64, count=vec.size)
        unaligned[...] = vec
        variants.update({
            "strided": strided[::2],
            "negative_stride": vec[::-1].copy()[::-1],
            "big_endian": vec.astype(">f8"),
            "read_only": ro,
            "unaligned": unaligned,
            "object": vec.astype(object),
            "list": vec.tolist(),
        })
        if float(v.reshape(-1)[0]) == round(float(v.reshape(-1)[0])):
            variants["int64"] = vec.astype(np.int64)
        if v.ndim == 0:
            variants["fortran"] = np.asfortranarray(np.full((4, 6), float(v)))
        want_vec, exc, _, _ = _call(f, dict(base, **{p: vec}))
        if exc is not None:
            fail(f"{p} as an array: raised {type(exc).__name__}: {exc}")
            continue
        for label, arr in variants.items():
            res, exc, _, foreign = _call(f, dict(base, **{p: arr}))
            where = f"{p} {label}"
            if exc is not None:
                fail(f"{where}: raised {type(exc).__name__}: {exc}")
                continue
            if foreign:
                fail(f"{where}: emitted {foreign}")
            if label == "0-d":
                if not _same(res, ref):
                    fail(f"{where}: {res!r} differs from the scalar result {ref!r}")
                if any(not isinstance(x, float) for x in _leaves(res)) and callable(getattr(f, "__self__", None)):
                    fail(f"{where}: 0-d input did not give Python floats: {res!r}")
            elif label == "fortran":
                want, _, _, _ = _call(f, dict(base, **{p: np.full((4, 6), float(v))}))
                if not _same(res, want):
                    fail(f"{where}: differs from the C-order result")
            elif not _same(res, want_vec):
                fail(f"{where}: differs from the float64 contiguous result")
        # float32: the float64 result of the float32 values
        f32 = vec.astype(np.float32)
        res, exc, _, _ = _call(f, dict(base, **{p: f32}))
        want, _, _, _ = _call(f, dict(base, **{p: f32.astype(np.float64)}))
        if exc is not None or not _same(res, want):
            fail(f"{p} float32: {exc or 'differs from the float64 result of the same values'}")
        # empty arrays keep their shape
        if v.ndim == 0:
            for shape in ((0,), (0, 3)):
                res, exc, _, foreign = _call(f, dict(base, **{p: np.empty(shape)}))
                if exc is not None:
                    if not isinstance(exc, wetboil.WetboilError):
                        fail(f"{p} empty {shape}: raised {type(exc).__name__}: {exc}")
                    continue
                for x in _leaves(res):
                    if np.shape(x) not in (shape, ()):
                        fail(f"{p} empty {shape}: result shape {np.shape(x)}")

    # -- wrong types: WetboilTypeError / WetboilValueError, never anything else
    try:
        defaults = {q: d.default for q, d in inspect.signature(f).parameters.items()}
    except (TypeError, ValueError):
        defaults = {}
    for p, v in base_used.items():
        for label, bad in WRONG.items():
            if bad is None and (v is None or defaults.get(p, 0) is None):
                continue  # None is a documented choice of this argument
            if isinstance(v, str) and label in ("str",):
                continue
            if isinstance(v, bool) and label == "bool":
                continue
            if isinstance(v, (list, tuple)) and label == "ragged":
                continue
            res, exc, _, foreign = _call(f, dict(base, **{p: bad}))
            where = f"{p}={label}"
            if exc is None:
                if label in ("bool",) and isinstance(v, bool):
                    continue
                fail(f"{where}: accepted, gave {res!r}")
            elif not isinstance(exc, wetboil.WetboilError):
                fail(f"{where}: raised {type(exc).__name__} (not a WetboilError): {exc}")
            elif not isinstance(exc, (TypeError, ValueError)):
                fail(f"{where}: raised {type(exc).__name__}, not a TypeError/ValueError")
        if isinstance(v, str) and p in ("method", "geometry", "small_plate", "liquid", "surface", "name", "fluid",
                                         "like", "table"):
            res, exc, _, _ = _call(f, dict(base, **{p: "no-such-choice"}))
            if not isinstance(exc, wetboil.WetboilValueError):
                fail(f"{p}='no-such-choice': expected WetboilValueError, got {type(exc).__name__ if exc else res!r}")
        if isinstance(v, Saturation):
            # a fluid whose fields do not broadcast is a structural error, raised at once
            try:
                v.replace(sigma=np.full(3, v.sigma), rho_l=np.full(4, 900.0))
                fail(f"{p}: a Saturation with fields of shapes (3,) and (4,) was accepted")
            except wetboil.WetboilValueError:
                pass
            # a fluid of array fields against an argument that does not broadcast with them
            arr_fluid = v.replace(**{fd: np.full(3, getattr(v, fd)) for fd in ("sigma", "rho_l", "rho_v", "T", "p")})
            others = [q for q in numeric if q != p]
            if others:
                res, exc, _, _ = _call(f, dict(base, **{p: arr_fluid, others[0]: np.ones(4)}))
                if not isinstance(exc, wetboil.WetboilValueError):
                    fail(f"{p} (3,) fields with {others[0]} (4,): expected WetboilValueError, "
                         f"got {type(exc).__name__ if exc else res!r}")
    # -- arguments of shapes that do not broadcast
    if len(numeric) >= 2 and case_id not in SCALAR_ONLY:
        p, q = numeric[:2]
        res, exc, _, _ = _call(f, dict(base, **{p: np.ones(3), q: np.ones(4)}))
        if not isinstance(exc, wetboil.WetboilValueError):
            fail(f"{p} (3,) with {q} (4,): expected WetboilValueError, got {type(exc).__name__ if exc else res!r}")
    return fails


def check_mixed_xarray(case_id: str, f: Callable[..., Any], base: Dict[str, Any]) -> List[str]:
    """One argument a DataArray, another a plain ndarray of the same length:
    a DataArray result with the DataArray's dimension, values as for ndarrays."""
    import xarray as xr

    numeric = [p for p, v in base.items() if _is_number_param(v)]
    if len(numeric) < 2 or case_id in SCALAR_ONLY:
        return []
    p, q = numeric[:2]
    a = np.full(5, float(base[p]))
    b = np.full(5, float(base[q]))
    want, exc, _, _ = _call(f, dict(base, **{p: a, q: b}))
    if exc is not None:
        return [f"{case_id}: arrays raised {exc!r}"]
    res, exc, _, foreign = _call(f, dict(base, **{p: xr.DataArray(a, dims="surface"), q: b}))
    if exc is not None:
        return [f"{case_id}: DataArray with ndarray raised {type(exc).__name__}: {exc}"]
    fails = []
    first = res[0] if isinstance(res, tuple) else res
    if not hasattr(first, "dims") or first.dims != ("surface",):
        fails.append(f"{case_id}: DataArray with ndarray gave {type(first).__name__} {getattr(first, 'dims', '')}")
    elif not _same(res, want):
        fails.append(f"{case_id}: DataArray with ndarray: values differ from the ndarray result")
    if foreign:
        fails.append(f"{case_id}: DataArray with ndarray emitted {foreign}")
    return fails


def run_group(group: str) -> List[str]:
    fails: List[str] = []
    for case_id, f, base in group_cases(group):
        try:
            fails.extend(check_function(case_id, f, base))
            fails.extend(check_mixed_xarray(case_id, f, base))
        except Exception:  # noqa: BLE001 - a bug in a check is a failure too
            fails.append(f"{case_id}: matrix raised {traceback.format_exc(limit=3)}")
    return fails


def _child(code: str, timeout: float = 300) -> subprocess.CompletedProcess:
    env = dict(os.environ, PYTHONPATH=HERE + os.pathsep + os.environ.get("PYTHONPATH", ""))
    return subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, timeout=timeout, env=env)


# --------------------------------------------------------------------------- the tests


@pytest.mark.parametrize("group", GROUPS)
def test_robustness_matrix(group):
    code = (
        "import json, test_robustness as t\n"
        f"fails = t.run_group({group!r})\n"
        "print('RESULT ' + json.dumps(fails))\n"
    )
    r = _child(code)
    assert r.returncode == 0, f"the interpreter did not survive (exit {r.returncode}):\n{r.stderr[-3000:]}"
    line = next((l for l in r.stdout.splitlines() if l.startswith("RESULT ")), None)
    assert line is not None, r.stdout[-2000:] + r.stderr[-2000:]
    fails = json.loads(line[len("RESULT "):])
    assert not fails, f"{len(fails)} failed case(s):\n" + "\n".join(fails[:60])


def test_every_public_function_is_in_the_matrix():
    import kernel_cases as kc
    from wetboil import boiling, chf, departure, fluids, nucleation, wetting

    covered = {f for _, f, _ in dispatcher_cases()} | {f for _, f, _ in kc.KERNEL_FUNCTIONS}
    skipped: set = set()
    for mod in (fluids, wetting, nucleation, departure, chf, boiling):
        for name in mod.__all__:
            obj = getattr(mod, name)
            if callable(obj) and not isinstance(obj, type) and obj not in skipped:
                assert obj in covered, f"{mod.__name__}.{name} is not in the robustness matrix"


def test_ten_million_elements():
    """10^7 elements through the ufunc (threaded) and through the grid path
    (big-endian input), in a child interpreter; spot values against scalars."""
    code = r"""
import numpy as np, wetboil, warnings
from wetboil.departure import fritz
from wetboil.chf import kandlikar
from wetboil.fluids import water
w = water(p=101325.0)
n = 10**7
x = np.linspace(0.0, 180.0, n)
with warnings.catch_warnings():
    warnings.simplefilter("ignore")   # half of the angles lie above Fritz's 90 deg
    d = fritz(x, w)
    q = kandlikar(x.astype(">f8"), w, 30.0)
assert d.shape == (n,) and q.shape == (n,)
for i in (0, 1, n // 3, n // 2, n - 1):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        assert d[i] == fritz(float(x[i]), w), i
        assert q[i] == kandlikar(float(x[i]), w, 30.0), i
assert np.isfinite(d).all() and (q >= 0).all()
print("ok")
"""
    r = _child(code, timeout=600)
    assert r.returncode == 0 and "ok" in r.stdout, r.stderr[-3000:]


def test_errors_are_both_builtin_and_wetboil_errors():
    import wetboil

    for cls, builtin in ((wetboil.WetboilTypeError, TypeError), (wetboil.WetboilValueError, ValueError)):
        assert issubclass(cls, builtin) and issubclass(cls, wetboil.WetboilError)
    assert issubclass(wetboil.InvalidValueWarning, wetboil.WetboilWarning)
    assert issubclass(wetboil.RangeWarning, wetboil.WetboilWarning)


def test_validity_never_emits_numpy_warnings():
    """`wetboil.validity` of extreme values: codes only, no RuntimeWarning from
    the range checks' floating-point flags."""
    import kernel_cases as kc
    import wetboil

    rng = np.random.default_rng(2)
    for case_id, f, spec in kc.KERNEL_FUNCTIONS:
        args = kc.draw_args(spec, rng)
        for p in spec.params:
            if p in kc.fluid_params(spec):
                continue
            for bad in (np.array([math.nan, 1e308, -1e308, 5e-324, math.inf]),):
                with warnings.catch_warnings():
                    warnings.simplefilter("error")
                    codes = wetboil.validity(f, **dict(args, **{p: bad}))
                assert codes.dtype == np.int8 and codes.shape == (5,), case_id


def test_python_integers_beyond_int64():
    """Behavioural contract: an int beyond int64 is converted as float64 does (exactly like
    float(value)); one beyond float64 is a clear WetboilValueError naming the argument, not a bare
    OverflowError from the conversion."""
    import wetboil
    from wetboil.departure import fritz
    from wetboil.fluids import water

    w = water(p=101325.0)
    with pytest.warns(wetboil.InvalidValueWarning):  # an impossible angle: NaN and a warning
        assert np.isnan(fritz(2**63, w))
    assert fritz(45, w, g=2**70) == fritz(45.0, w, g=float(2**70))
    with pytest.raises(wetboil.WetboilValueError, match="contact_angle_deg is an integer beyond the range"):
        fritz(10**400, w)
