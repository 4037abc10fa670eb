"""Shared test data for the reliability suites (properties, robustness,
concurrency, validity ranges).

For every kernel-backed function of the package (the public ones and the
kernel-backed helpers behind the method dispatchers, as registered with the
front door) this module knows how to draw physically meaningful arguments,
how to go back and forth between the public arguments and the kernel's
inputs, which outputs may be negative, and which documented "no answer"
(NaN) or infinite limits a model has. The ranges are our own choice of
physical ranges (water and common liquids on ordinary heaters), not reference
values. The documented exceptions mirror ``allowances`` in ``src/fuzz.rs``.
"""

from __future__ import annotations

import math
from typing import Any, Callable, Dict, List, Optional, Sequence, Tuple

import numpy as np

import wetboil
from wetboil import _api
from wetboil.fluids import FIELDS, Saturation, water

# --------------------------------------------------------------------------- the functions

#: Every kernel-backed function: (test id, function, front-door spec). Several
#: public names share a kernel (onset_superheat / onset_cavity_radius) and one
#: public dispatcher may use several kernels (site_density).
KERNEL_FUNCTIONS: List[Tuple[str, Any, Any]] = sorted(
    ((f"{spec.function}:{spec.model.name}", f, spec) for f, spec in _api._FUNCTIONS.items()),
    key=lambda t: t[0],
)
#: One function per registered kernel.
BY_KERNEL: Dict[str, Tuple[Any, Any]] = {}
for _id, _f, _spec in KERNEL_FUNCTIONS:
    BY_KERNEL.setdefault(_spec.model.name, (_f, _spec))

#: Kernels fused for speed, with no public function of their own (checked
#: at the ufunc level only).
UFUNC_ONLY = sorted(m.name for m in wetboil.models() if m.name not in BY_KERNEL)

SIGNED_OUTPUTS = {"spreading_coefficient", "interfacial_tension", "disjoining_pressure", "hamaker"}

G = 9.80665
P_CRIT = 22.064e6
T_CRIT = 647.096

# --------------------------------------------------------------------------- physical ranges

# (kind, lo, hi): "lin" uniform, "log" log-uniform, "set" one of lo (a tuple),
# "signed" either sign with a log-uniform magnitude.
_RANGES: Dict[str, Tuple[str, Any, Any]] = {
    "contact_angle_deg": ("lin", 0.0, 180.0),
    "advancing_deg": ("lin", 0.0, 180.0),
    "receding_deg": ("lin", 0.0, 180.0),
    "advancing_angle_deg": ("lin", 0.0, 180.0),
    "receding_angle_deg": ("lin", 0.0, 180.0),
    "orientation_deg": ("lin", 0.0, 180.0),
    "cavity_half_angle_deg": ("lin", 0.0, 90.0),
    "inclination_deg": ("lin", 0.0, 89.0),
    "radius": ("log", 1e-8, 1e-4),
    "cavity_radius": ("log", 1e-7, 1e-4),
    "superheat": ("lin", 0.0, 30.0),
    "wall_superheat": ("lin", 0.0, 60.0),
    "heat_flux": ("log", 10.0, 2e6),
    "thermal_layer": ("log", 1e-5, 1e-3),
    "subcooling": ("lin", 0.0, 50.0),
    "p": ("log", 1e3, 2e7),
    "rate": ("log", 1e6, 1e20),
    "g": ("log", 0.5, 30.0),
    "C": ("log", 1e-4, 5e-4),
    "K": ("lin", 0.1, 0.2),
    "velocity": ("lin", -2.0, 2.0),
    "contact_ratio": ("lin", 0.05, 1.0),
    "growth_constant": ("lin", 0.0, 3.0),
    "friction_ratio": ("lin", 0.0, 0.08),
    "diameter": ("log", 1e-4, 1e-2),
    "drag_coefficient": ("lin", 0.5, 2.0),
    "constant": ("lin", 0.3, 1.5),
    "geometry": ("set", (0.0, 1.0, 2.0, 3.0), None),
    "size": ("log", 1e-4, 0.5),
    "area": ("log", 1e-8, 0.25),
    "small_plate_coefficient": ("lin", 10.0, 20.0),
    "sigma_sv": ("lin", 0.0, 0.08),
    "sigma_sl": ("lin", 0.0, 0.08),
    "sigma_lv": ("lin", 0.01, 0.08),
    "sigma_s": ("lin", 0.0, 0.08),
    "sigma_l": ("lin", 0.0, 0.08),
    "phi": ("lin", 0.4, 1.2),
    "solid_dispersive": ("lin", 0.0, 0.06),
    "solid_polar": ("lin", 0.0, 0.06),
    "liquid_dispersive": ("lin", 1e-3, 0.06),
    "liquid_polar": ("lin", 0.0, 0.06),
    "roughness_ratio": ("lin", 1.0, 3.0),
    "solid_fraction": ("lin", 0.0, 1.0),
    "width": ("log", 1e-4, 1e-2),
    "k": ("lin", 0.8, 1.6),
    "mass": ("log", 1e-7, 1e-4),
    "thickness": ("log", 1e-10, 1e-7),
    "hamaker": ("signed", 1e-21, 1e-19),
    "coefficient": ("signed", 1e-30, 1e-20),
    "exponent": ("lin", 1.0, 4.0),
    "height": ("log", 1e-3, 0.5),
    "hamaker_solid": ("lin", 0.0, 1e-19),
    "hamaker_liquid": ("lin", 0.0, 1e-19),
    "C_sf": ("lin", 0.002, 0.02),
    "n": ("lin", 0.8, 2.0),
    "roughness_Rp": ("log", 1e-7, 1e-5),
    "length": ("log", 1e-3, 0.5),
    "expansion_coefficient": ("log", 1e-4, 2e-3),
    "latent_factor": ("lin", 0.0, 1.0),
    "emissivity": ("lin", 0.0, 1.0),
    "site_density": ("log", 1e3, 1e8),
    "departure_diameter": ("log", 1e-4, 5e-3),
    "frequency": ("log", 5.0, 500.0),
    "convection_coefficient": ("lin", 0.0, 5e3),
    "area_factor": ("lin", 1.0, 5.0),
    "T": ("lin", 273.16, T_CRIT),
}

# per kernel, where the general range does not fit
_KERNEL_RANGES: Dict[Tuple[str, str], Tuple[str, Any, Any]] = {
    ("water_saturation_p", "p"): ("log", 611.6571, P_CRIT),  # p_sat(273.16 K) of SR1-86: 611.65707 Pa
    ("kinetic_superheat_water", "p"): ("log", 1e3, 2e7),
    ("homogeneous_superheat_water", "p"): ("log", 1e3, 2e7),
    ("minimum_heat_flux", "C"): ("lin", 0.05, 0.2),
    ("film_boiling", "wall_superheat"): ("lin", 50.0, 800.0),
    ("tolubinsky_kostanchuk_departure", "subcooling"): ("lin", -10.0, 80.0),
    ("vdw_film_thickness", "hamaker"): ("lin", -1e-19, -1e-21),
    ("lloyd_moran_natural_convection", "length"): ("log", 1e-3, 0.2),
    ("churchill_chu_natural_convection", "length"): ("log", 1e-4, 0.05),  # wires to pipes
    ("churchill_sphere_natural_convection", "length"): ("log", 1e-3, 0.05),
    ("churchill_chu_vertical_plate_natural_convection", "length"): ("log", 1e-3, 0.3),  # chips to boards
    ("hemiwicking_angle", "solid_fraction"): ("lin", 0.0, 0.95),  # dry tops < 1: a film needs a gap
}


def param_range(kernel: str, param: str) -> Tuple[str, Any, Any]:
    try:
        return _KERNEL_RANGES.get((kernel, param)) or _RANGES[param]
    except KeyError:
        raise KeyError(f"kernel_cases: no physical range for argument {param!r} of {kernel}") from None


def draw_param(rng: np.random.Generator, kernel: str, param: str, n: Optional[int] = None) -> Any:
    kind, lo, hi = param_range(kernel, param)
    if kind == "lin":
        v = rng.uniform(lo, hi, n)
    elif kind == "log":
        v = np.exp(rng.uniform(math.log(lo), math.log(hi), n))
    elif kind == "signed":
        v = np.exp(rng.uniform(math.log(lo), math.log(hi), n)) * rng.choice([-1.0, 1.0], n)
    else:
        v = rng.choice(np.asarray(lo), n)
    return float(v) if n is None else np.asarray(v, dtype=float)


def strategy_param(kernel: str, param: str):
    """A Hypothesis strategy of one scalar argument."""
    from hypothesis import strategies as st

    kind, lo, hi = param_range(kernel, param)
    if kind == "lin":
        return st.floats(lo, hi, allow_nan=False, allow_infinity=False)
    if kind == "log":
        return st.floats(math.log(lo), math.log(hi)).map(lambda e: min(max(math.exp(e), lo), hi))
    if kind == "signed":
        return st.tuples(st.floats(math.log(lo), math.log(hi)), st.sampled_from([-1.0, 1.0])).map(
            lambda t: t[1] * math.exp(t[0])
        )
    return st.sampled_from(list(lo))


# --------------------------------------------------------------------------- fluids

#: Water at the temperatures the ranges sample (built-in IAPWS properties).
WATER_T = (273.16, 640.0)


def water_states(T: Any) -> Saturation:
    return water(T=T)


def other_fluids() -> List[Saturation]:
    """A few non-water saturated states (CoolProp), when it is installed."""
    try:
        from wetboil.fluids import from_coolprop

        return [from_coolprop(name, T=T) for name, T in (("R134a", 273.15), ("Ammonia", 300.0), ("Ethanol", 351.0))]
    except Exception:  # pragma: no cover - CoolProp is in the test extra
        return []


_OTHERS: Optional[List[Saturation]] = None


def others() -> List[Saturation]:
    global _OTHERS
    if _OTHERS is None:
        _OTHERS = other_fluids()
    return _OTHERS


def strategy_fluid():
    from hypothesis import strategies as st

    waters = st.floats(*WATER_T).map(water_states)
    extra = others()
    return st.one_of(waters, st.sampled_from(extra)) if extra else waters


def fluid_arrays(rng: np.random.Generator, n: int) -> Saturation:
    """Water states of `n` random temperatures (array fields)."""
    return water(T=rng.uniform(*WATER_T, n))


# --------------------------------------------------------------------------- arguments <-> kernel inputs


def fluid_params(spec: Any) -> set:
    return {spec.params[i] for i, field in spec.plan if field}


def fix(spec: Any, args: Dict[str, Any]) -> Dict[str, Any]:
    """Make drawn arguments obey the orderings a kernel needs (receding <=
    advancing, receding <= static); works on scalars and arrays alike."""
    for adv, rec in (("advancing_angle_deg", "receding_angle_deg"), ("advancing_deg", "receding_deg"),
                     ("contact_angle_deg", "receding_angle_deg")):
        if adv in args and rec in args:
            a, r = args[adv], args[rec]
            args[adv], args[rec] = np.maximum(a, r), np.minimum(a, r)
            if np.ndim(a) == 0:
                args[adv], args[rec] = float(args[adv]), float(args[rec])
    return args


def draw_args(spec: Any, rng: np.random.Generator, n: Optional[int] = None) -> Dict[str, Any]:
    """Physical arguments of a kernel function: scalars (n None) or arrays of n."""
    args: Dict[str, Any] = {}
    fp = fluid_params(spec)
    for p in spec.params:
        if p in fp:
            args[p] = water(T=float(rng.uniform(*WATER_T))) if n is None else fluid_arrays(rng, n)
        else:
            args[p] = draw_param(rng, spec.model.name, p, n)
    return fix(spec, args)


def strategy_args(spec: Any):
    """A Hypothesis strategy of physical scalar arguments (a dict)."""
    from hypothesis import strategies as st

    fp = fluid_params(spec)
    parts = {p: (strategy_fluid() if p in fp else strategy_param(spec.model.name, p)) for p in spec.params}
    return st.fixed_dictionaries(parts).map(lambda a: fix(spec, dict(a)))


def kernel_inputs(spec: Any, args: Dict[str, Any]) -> List[Any]:
    """The kernel (ufunc) inputs of a call, in kernel order."""
    out = []
    for i, field in spec.plan:
        a = args[spec.params[i]]
        out.append(getattr(a, field) if field else a)
    return out


def args_from_inputs(spec: Any, x: Sequence[Any], base: Dict[str, Any]) -> Dict[str, Any]:
    """Public arguments that feed the kernel inputs `x` (fluid fields set on a
    copy of the fluid in `base`)."""
    args = dict(base)
    changes: Dict[str, Dict[str, Any]] = {}
    for (i, field), v in zip(spec.plan, x):
        p = spec.params[i]
        if field:
            changes.setdefault(p, {})[field] = v
        else:
            args[p] = v
    for p, fields in changes.items():
        args[p] = args[p].replace(**fields)
    return args


def call(f: Any, spec: Any, args: Dict[str, Any]) -> Any:
    return f(*[args[p] for p in spec.params])


def outputs(result: Any) -> List[Any]:
    """The outputs of a call as a list (one entry per kernel output; the water
    functions return a Saturation whose first 12 fields are the outputs)."""
    if isinstance(result, Saturation):
        return [getattr(result, f) for f in FIELDS[:12]]
    return list(result) if isinstance(result, tuple) else [result]


def output_names(spec: Any) -> List[str]:
    """Names of the outputs a kernel-backed function returns: all of the
    kernel's, or the one it selects (``kernel(..., output=k)``)."""
    names = [o.name for o in spec.model.outputs]
    return names if spec.output is None else [names[spec.output]]


def select(spec: Any, kernel_outputs: List[Any]) -> List[Any]:
    """The kernel's outputs (from the raw ufunc) that the function returns."""
    return kernel_outputs if spec.output is None else [kernel_outputs[spec.output]]


def to_scalar_args(args: Dict[str, Any], i: int) -> Dict[str, Any]:
    """Element i of array arguments (fluids included)."""
    out = {}
    for k, v in args.items():
        if isinstance(v, Saturation):
            out[k] = v[i] if v.shape else v
        else:
            out[k] = float(np.asarray(v).reshape(-1)[i]) if np.ndim(v) else v
    return out


# --------------------------------------------------------------------------- documented exceptions

# Kernel input vectors x are in kernel order (as `wetboil.model_of(f).inputs`).
_ALWAYS = lambda x: True  # noqa: E731

#: Possible inputs whose outputs may be NaN: a documented "no answer".
NO_ANSWER: Dict[str, Callable[[Sequence[float]], bool]] = {
    "embryo_superheat_exact": _ALWAYS,  # no root of the integrated form
    "kinetic_superheat_water": _ALWAYS,  # rate not reached before the spinodal
    "homogeneous_superheat_water": _ALWAYS,
    "hsu_active_radii": _ALWAYS,  # no active cavity
    "klausner_force_balance": _ALWAYS,  # no departure found
    "hsu_waiting_time": _ALWAYS,  # the cavity never fires
    "kandlikar_chf": _ALWAYS,  # facing down: no answer
    "furmidge_sliding_angle": _ALWAYS,  # the drop never slides
    # zero flux and a zero radius factor: 0 x inf
    "hsu_onset": lambda x: x[0] == 0.0 and x[7] == 0.0,
    "kandlikar_onset": lambda x: x[0] == 0.0 and x[7] in (0.0, 180.0),
    # f(rho+) <= 0 close to the critical point
    "hibiki_ishii_site_density": lambda x: x[4] < 2.06 * x[5],
    # a zero departure diameter (Fritz at 0 deg) has no departure cycle
    **{k: (lambda x: x[0] == 0.0) for k in ("cole_frequency", "zuber_frequency", "ivey_hydrodynamic_frequency",
                                           "ivey_transition_frequency")},
    # at the critical point rho_l = rho_v: no departure, no CHF; Kandlikar facing down
    "water_screening_chain": lambda x: x[0] >= P_CRIT or x[3] > 90.0,
}

#: Kernels with a documented +inf (water at T_crit, zero superheat or flux
#: radii, Hsu's r_max at 180 deg, Hibiki-Ishii's explosive growth).
INFINITE = {
    "water_saturation_t",
    "water_saturation_p",
    "embryo_radius_linear",
    "hsu_active_radii",
    "hsu_onset",
    "davis_anderson_onset",
    "kandlikar_onset",
    "hibiki_ishii_site_density",
}


def check_outputs(kernel: str, x: Sequence[float], values: Sequence[float], names: Sequence[str]) -> Optional[str]:
    """Why the outputs of a possible input break the output rules, or None."""
    for v, name in zip(values, names):
        v = float(v)
        if math.isnan(v):
            if not NO_ANSWER.get(kernel, lambda x: False)(x):
                return f"output {name} is NaN"
        elif math.isinf(v):
            if not (v > 0 and kernel in INFINITE):
                return f"output {name} is {v}"
        elif v < 0 and name not in SIGNED_OUTPUTS:
            return f"output {name} is negative ({v})"
    return None


# --------------------------------------------------------------------------- comparison


def same_bits(a: Any, b: Any) -> bool:
    """Equal to the last bit (NaN equals NaN; -0.0 differs from 0.0)."""
    a = np.ascontiguousarray(np.asarray(a, dtype=np.float64))
    b = np.ascontiguousarray(np.asarray(b, dtype=np.float64))
    if a.shape != b.shape:
        return False
    na, nb = np.isnan(a), np.isnan(b)
    return bool(np.array_equal(na, nb) and np.array_equal(a[~na].view(np.uint64), b[~nb].view(np.uint64)))
