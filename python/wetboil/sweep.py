"""Describe surfaces once, sweep every operating point, get a ranked answer.

`sweep` evaluates the whole chain (working-fluid angles, onset of boiling,
active cavities, bubble departure, nucleate superheat at the design heat flux,
critical heat flux and its margin) over labelled grids of surfaces, pressures
or temperatures, heat fluxes, orientations and subcoolings, and returns an
`xarray.Dataset`; with ``chunks=`` the same call is lazy on dask (and runs on
a `dask.distributed` cluster when a client is active). `screen` flattens it
to a `pandas.DataFrame` ranked by CHF margin.

Every quantity is computed for all grid points in one pass per block (one
NumPy-level evaluation of the chain per chunk), and every kernel reports the
points where an input left its published validity range (`flag` variables),
so that a result table can say which rows are extrapolations.

.. warning::
   CHF margins computed here inherit the uncertainty of the correlations
   (tens of percent) and their validity ranges. Apply safety margins and
   defer to local codes and licensed engineering practice.
"""

from __future__ import annotations

import contextvars
import math
from typing import Any, Dict, Iterable, List, Mapping, NamedTuple, Optional, Sequence, Tuple, Union

import numpy as np

from . import boiling, chf, departure, nucleation, wetting
from ._api import _coerce, capture_validity, kernel
from ._errors import _STATE, InvalidValueError, WetboilError, WetboilTypeError, WetboilValueError, WetboilWarning, _warn, dropped_warnings, errstate
from .fluids import _SUPPLIED, FIELDS, UNITS, Saturation, from_coolprop, water
from .surface import Surface, WorkingAngles

__all__ = ["sweep", "screen", "ranked_table", "water_chain", "WaterChain", "DEFAULT_METHODS", "QUANTITIES",
           "METHOD_CHOICES", "STATE_FLAG"]

#: Methods used when `methods` does not say otherwise.
DEFAULT_METHODS: Dict[str, Any] = {
    "onset": "hsu",
    "departure": "fritz",
    "frequency": "zuber",
    "nucleate": "auto",
    "chf": ("kandlikar", "zuber"),
}

#: Choices per method key.
METHOD_CHOICES: Dict[str, Tuple[str, ...]] = {
    "onset": ("hsu", "davis_anderson", "kandlikar", "bergles_rohsenow"),
    "departure": ("fritz", "fritz_jakob", "cole_rohsenow", "kocamustafaogullari_ishii"),
    "frequency": ("zuber", "cole", "ivey", "kocamustafaogullari_ishii"),
    "nucleate": ("auto", "rohsenow", "cooper"),
    "chf": ("kandlikar", "zuber", "lienhard_dhir_flat"),
}

#: Output variables with units and meaning (also the flag bit order).
QUANTITIES: Dict[str, Tuple[str, str]] = {
    "static_angle": ("deg", "working fluid's apparent static contact angle"),
    "advancing_angle": ("deg", "working fluid's apparent advancing contact angle"),
    "receding_angle": ("deg", "working fluid's apparent receding contact angle"),
    "onset_superheat": ("K", "wall superheat at the onset of nucleate boiling at the design heat flux (above "
                        "nucleate_superheat: a temperature overshoot at incipience, the wall reaching this superheat "
                        "before boiling starts and then falling to nucleate_superheat; boiling.curve's "
                        "onset_superheat is instead where natural convection first meets the criterion)"),
    "onset_cavity_radius": ("m", "cavity mouth radius that nucleates first at onset (NaN with the onset method "
                            "'bergles_rohsenow', which gives no radius)"),
    "nucleate_superheat": ("K", "wall superheat of nucleate boiling at the design heat flux (flagged in range_flags "
                           "where the design heat flux is at or above the design method's CHF: past the boiling "
                           "crisis the nucleate correlations do not hold)"),
    "cavity_radius_min": ("m", "smallest active cavity mouth radius at the nucleate superheat (Hsu; NaN where no "
                          "cavity is active, as where nucleate_superheat is below onset_superheat)"),
    "cavity_radius_max": ("m", "largest active cavity mouth radius at the nucleate superheat (Hsu; NaN where no "
                          "cavity is active)"),
    "departure_diameter": ("m", "bubble departure diameter"),
    "departure_frequency": ("Hz", "bubble departure frequency"),
    "chf": ("W/m2", "critical heat flux by the first (design) CHF method"),
    "chf_margin": ("1", "critical heat flux of the design method / design heat flux"),
}

#: Name of the last flag bit, after the quantities': the saturated state of the
#: operating point itself. In ``invalid_flags`` it marks points whose fluid
#: state is impossible (the fluid layer gave no state: outside triple point to
#: critical point), in ``range_flags`` states the fluid layer computed outside
#: its own validity range (water above 0.997 T_crit).
STATE_FLAG = "fluid_state"

# every axis a sweep can have, in the order of its outputs (the state axis is one of "p", "T", "state")
_AXES = ("surface", "p", "T", "state", "heat_flux", "orientation", "subcooling")



def _methods(methods: Optional[Mapping[str, Any]]) -> Dict[str, Any]:
    out = dict(DEFAULT_METHODS)
    if methods is None:
        return out
    if not isinstance(methods, Mapping):
        raise WetboilTypeError(f"methods must be a mapping like {DEFAULT_METHODS}, got {type(methods).__name__}")
    for key, value in methods.items():
        if key not in METHOD_CHOICES:
            raise WetboilValueError(f"methods: unknown key {key!r}; keys are {sorted(METHOD_CHOICES)}")
        if not isinstance(value, (str, list, tuple)):
            raise WetboilTypeError(f"methods[{key!r}] must be a method name{' or a list of them' if key == 'chf' else ''}"
                                   f", got {type(value).__name__}; choices are {METHOD_CHOICES[key]}")
        values = (value,) if isinstance(value, str) else tuple(value)
        if key != "chf" and len(values) != 1:
            raise WetboilValueError(f"methods[{key!r}] takes one method name, got {value!r}")
        if not values:
            raise WetboilValueError(f"methods[{key!r}] is empty")
        for v in values:
            if v not in METHOD_CHOICES[key]:
                raise WetboilValueError(f"methods[{key!r}]: unknown method {v!r}; choices are {METHOD_CHOICES[key]}")
        out[key] = values if key == "chf" else values[0]
    return out


def _method_fluid_problem(methods: Mapping[str, Any], fluid_name: Optional[str]) -> Optional[str]:
    """Why `methods` cannot be used with the fluid named `fluid_name`, or None.
    Bergles-Rohsenow's onset is a fit for water (`nucleation.onset_superheat`
    raises for other named fluids); checked before any point is computed."""
    if methods.get("onset") == "bergles_rohsenow" and fluid_name is not None and not nucleation._is_water(fluid_name):
        return (f"onset method 'bergles_rohsenow' is a correlation for water, not for {fluid_name!r}; "
                f"choose one of {', '.join(m for m in METHOD_CHOICES['onset'] if m != 'bergles_rohsenow')}")
    return None


#: Pressure and temperature units that people write instead of Pa and K:
#: (unit, how to convert to SI, the conversion as text).
_UNIT_SLIPS = {
    "p": (("kPa", lambda v: v * 1e3, "x 1e3"), ("bar", lambda v: v * 1e5, "x 1e5"),
          ("MPa", lambda v: v * 1e6, "x 1e6")),
    "T": (("degC", lambda v: v + 273.15, "+ 273.15"),),
}


def _states_outside_range(fluid: str, axis: str, values: Sequence[float]) -> Optional[str]:
    """Why some of the saturation pressures (`axis` "p", in Pa) or
    temperatures ("T", in K) `values` of a named fluid have no saturated
    state, or None when they all have one. The fluid layer decides (the same
    states `sweep` computes); the message names the bad values, the fluid's
    saturation range (water: triple point to critical point, IAPWS), and a
    unit that would put every value inside it (kPa, bar, MPa; degC)."""
    from .fluids import WATER_P_CRIT, WATER_P_TRIPLE, WATER_T_CRIT, WATER_T_TRIPLE

    unit = "Pa" if axis == "p" else "K"
    is_water = fluid.lower() == "water"

    def missing(v: Sequence[float]) -> Any:
        arr = np.asarray(v, dtype=float)
        # missing properties: the sweep's own call says so (dropped for this thread only, see dropped_warnings)
        with dropped_warnings(), errstate(invalid="ignore", out_of_range="ignore"):
            if is_water:
                s = water(p=arr) if axis == "p" else water(T=arr)
            else:
                s = from_coolprop(fluid, p=arr) if axis == "p" else from_coolprop(fluid, T=arr)
        return np.isnan(np.asarray(s.rho_l)) & ~np.isnan(arr), s

    bad, state = missing(values)
    if not bad.any():
        return None
    if is_water:
        lo = WATER_P_TRIPLE if axis == "p" else WATER_T_TRIPLE
        hi = WATER_P_CRIT if axis == "p" else WATER_T_CRIT
        span = (f"{lo:.7g} {unit} (triple point, IAPWS R14-08(2011)) to "
                f"{hi:.7g} {unit} (critical point, IAPWS R6-95(2018))")
    else:
        crit = np.asarray(state.p_crit if axis == "p" else state.T_crit).ravel()
        span = (f"triple point to critical point ({float(crit[0]):.7g} {unit}, CoolProp)" if crit.size
                and not np.isnan(crit[0]) else "triple point to critical point (CoolProp)")
    shown = ", ".join(f"{v:g}" for v in np.asarray(values, dtype=float)[bad])
    msg = f"{shown} {unit} outside the saturation range of {fluid}: {span}"
    slips = [f"{name} ({how})" for name, to_si, how in _UNIT_SLIPS[axis] if not missing([to_si(v) for v in values])[0].any()]
    if slips:
        msg += f"; give them in {unit}: they look like {' or '.join(slips)}"
    return msg


def _axis(name: str, values: Any, xr: Any, label: str = "") -> Any:
    """The 1-D axis `name` from the argument `label` (default: `name`)."""
    label = label or name
    arr = np.atleast_1d(np.asarray(_coerce("sweep", label, values), dtype=float))  # the kernels' input checks
    if arr.ndim != 1:
        raise WetboilValueError(f"sweep: {label} must be a number or a 1-D sequence, got shape {arr.shape}")
    if arr.size == 0:
        raise WetboilValueError(f"sweep: the {name} axis is empty")
    return xr.DataArray(arr, dims=name, coords={name: arr})


def _given_properties(given: Optional[Mapping[str, Any]], axis: Any) -> Dict[str, Any]:
    """The checked `fluid_properties` of a sweep along `axis` (the labelled
    1-D p or T axis): field -> float, or 1-D float array along the axis (a
    DataArray labelled with the axis is taken by label, not by position)."""
    if given is None:
        return {}
    dim, n = axis.dims[0], axis.size
    if not isinstance(given, Mapping):
        raise WetboilTypeError(f"sweep: fluid_properties must be a mapping of field names to values, got "
                               f"{type(given).__name__}")
    allowed = [f for f in FIELDS if f not in ("T", "p")]
    out: Dict[str, Any] = {}
    for key, value in given.items():
        if key not in allowed:
            raise WetboilValueError(f"sweep: fluid_properties: unknown or fixed field {key!r}; give any of "
                                    f"{', '.join(allowed)} (T and p are the sweep's axis)")
        if hasattr(value, "dims") and np.ndim(value) > 0:
            if tuple(value.dims) != (dim,):
                raise WetboilValueError(f"sweep: fluid_properties[{key!r}] is labelled along {tuple(value.dims)}; "
                                        f"give it along the sweep's {dim!r} axis")
            if dim in value.coords:
                try:  # by label, as DataArrays broadcast everywhere else
                    value = value.sel({dim: axis.values})
                except KeyError:
                    raise WetboilValueError(f"sweep: fluid_properties[{key!r}] has no value at some {dim} of the "
                                            "sweep; label it with the sweep's own states") from None
        try:
            if isinstance(value, (str, bytes)) or isinstance(value, bool):
                raise TypeError
            arr = np.asarray(getattr(value, "values", value), dtype=float)
        except (TypeError, ValueError):
            raise WetboilTypeError(f"sweep: fluid_properties[{key!r}] must be a number or a sequence of numbers, "
                                   f"got {value!r}") from None
        if not (arr.ndim == 0 or (arr.ndim == 1 and arr.size == n)):
            raise WetboilValueError(f"sweep: fluid_properties[{key!r}] must be one number or one value per state "
                                    f"({n}), got shape {arr.shape}")
        if not (np.isfinite(arr) & (arr > 0)).all():  # as a study file's [fluid_properties] table
            raise WetboilValueError(f"sweep: fluid_properties[{key!r}] must be positive and finite "
                                    f"[{UNITS[key]}], got {arr.tolist()!r}")
        out[key] = float(arr) if arr.ndim == 0 else arr
    return out


def _fluid_states(fluid: Any, p: Any, T: Any, xr: Any,
                  fluid_properties: Optional[Mapping[str, Any]] = None) -> Tuple[Saturation, str, Any, Any]:
    """The saturated states of the sweep along one labelled axis, with two
    masks along it: states that are impossible and states outside the fluid
    layer's validity range (both all-False for ready-made `Saturation`
    states, whose NaN fields are missing data). `fluid_properties` (with a
    fluid name only) sets fields of the states before anything is checked."""
    if isinstance(fluid, Saturation):
        if p is not None or T is not None:
            raise WetboilValueError("sweep: give p or T with a fluid name, not with a Saturation")
        if fluid_properties is not None:
            raise WetboilValueError("sweep: fluid_properties goes with a fluid name; set the fields of a "
                                    "Saturation with its .replace()")
        not_given = fluid._not_given()
        if not_given:
            _warn(f"sweep: {', '.join(not_given)} not given to the Saturation: NaN in every quantity that needs "
                  f"{'them' if len(not_given) > 1 else 'it'} (set with .replace())", WetboilWarning)
        shape = fluid.shape
        if len(shape) > 1:
            raise WetboilValueError(f"sweep: a Saturation fluid must be a single state or 1-D, got shape {shape}")
        if shape == ():
            return fluid, "", xr.DataArray(0.0), xr.DataArray(0.0)
        axis = _axis("p", fluid.p, xr) if not np.isnan(np.asarray(fluid.p)).any() else xr.DataArray(
            np.arange(shape[0]), dims="state")
        dim = axis.dims[0]
        fields = {}
        for f in FIELDS:
            v = getattr(fluid, f)
            fields[f] = v if np.ndim(v) == 0 else xr.DataArray(np.asarray(v), dims=dim, coords=axis.coords)
        none = xr.DataArray(np.zeros(shape[0]), dims=dim, coords=axis.coords)
        return Saturation(**fields, name=fluid.name), dim, none, none
    if not isinstance(fluid, str):
        raise WetboilTypeError(f"sweep: fluid must be a fluid name or a Saturation, got {type(fluid).__name__}")
    if (p is None) == (T is None):
        raise WetboilValueError("sweep: give exactly one of p [Pa] or T [K] with a fluid name")
    dim = "p" if p is not None else "T"
    axis = _axis(dim, p if p is not None else T, xr)
    given = _given_properties(fluid_properties, axis)
    # The fluid layer warns once (or raises, in strict mode) for impossible
    # states; the capture keeps which ones, for the flags of every point.
    try:
        with capture_validity() as cap:
            if fluid.lower() == "water":
                states = water(p=axis) if dim == "p" else water(T=axis)
            else:  # the fields given here are not CoolProp's to miss
                token = _SUPPLIED.set(frozenset(given))
                try:
                    states = from_coolprop(fluid, p=axis) if dim == "p" else from_coolprop(fluid, T=axis)
                finally:
                    _SUPPLIED.reset(token)
    except InvalidValueError as exc:  # strict mode: the error says what the warning below would
        problem = _states_outside_range(fluid, dim, axis.values)
        if problem:
            raise InvalidValueError(f"sweep: {problem}; physically impossible (errstate invalid='raise'; by "
                                    "default they give NaN)") from exc
        raise
    if given:  # on the axis; NaN where there is no saturated state, as every other field
        no_state = np.isnan(np.broadcast_to(_field(states, "T"), axis.shape))
        states = states.replace(**{f: xr.DataArray(np.where(no_state, np.nan, v), dims=dim, coords=axis.coords)
                                   for f, v in given.items()})
    given = ~np.isnan(axis.values)
    # a given pressure or temperature without a state is impossible (from_coolprop counts, not masks)
    no_state = np.isnan(np.broadcast_to(_field(states, "rho_l"), given.shape))
    invalid = np.logical_or(np.broadcast_to(cap.invalid, given.shape), no_state & given)
    # a state without a field the chain uses, where the property library has a model for it (one that
    # fails near the critical point, say), is flagged with the state, or its NaN results would go unexplained
    gaps = np.zeros(given.shape, bool)
    lacks = _no_model(states)
    for f in _CHAIN_FIELDS:
        if f not in lacks:
            gaps |= np.isnan(np.broadcast_to(_field(states, f), given.shape)) & ~no_state
    out_of_range = np.logical_or(np.broadcast_to(cap.out_of_range, given.shape), gaps)
    if invalid.any():  # a unit slip (kPa, bar, MPa given as Pa; degC as K) is the usual cause: say so
        problem = _states_outside_range(fluid, dim, axis.values)
        if problem and "they look like" in problem:
            _warn(f"sweep: {problem}", WetboilWarning)
    masks = [xr.DataArray(m.astype(float), dims=dim, coords=axis.coords) for m in (invalid, out_of_range)]
    return states, dim, masks[0], masks[1]


def _surface_table(surfaces: Sequence[Surface], fluid: Saturation, nucleate: str,
                   dispersive_fraction: Optional[float], xr: Any) -> Dict[str, Any]:
    """Per-surface inputs as DataArrays along `surface` (angles may also vary
    with the fluid state when they are predicted from probe liquids)."""
    names = [s.name for s in surfaces]
    if len(set(names)) != len(names):
        import collections

        dup = sorted(n for n, k in collections.Counter(names).items() if k > 1)
        raise WetboilValueError(f"sweep: surface names must be unique; {len(dup)} name(s) given more than once: "
                                f"{', '.join(repr(n) for n in dup[:20])}{', ...' if len(dup) > 20 else ''}")
    coord = {"surface": names}
    angles: List[Any] = []
    # flags per angle (static, advancing, receding): the prediction from probe liquids (OWRK, the order of the
    # predicted angles) flags all three; Wenzel or Cassie-Baxter flags only the angle it left its range for
    # (a receding angle that Wenzel saturates at 0 deg does not flag the static one the onset model uses)
    invalid: List[List[bool]] = [[], [], []]
    out_of_range: List[List[bool]] = [[], [], []]
    for s in surfaces:
        # the angle conversions (Wenzel, Cassie-Baxter, OWRK) are flagged like every other step
        with errstate(invalid="ignore", out_of_range="ignore"):
            with capture_validity() as shared:
                try:
                    raw = s._given_angles(fluid, dispersive_fraction)
                except WetboilValueError as exc:
                    if "dispersive_fraction" not in str(exc):
                        raise
                    raise WetboilValueError(f"sweep: surface {s.name!r} is described by probe-liquid angles, and "
                                            f"{exc}: pass dispersive_fraction=... to this call") from None
            converted = []
            for i, x in enumerate(raw):
                with capture_validity() as own:
                    converted.append(s._apparent(x))
                invalid[i].append(bool(np.any(shared.invalid) or np.any(own.invalid)))
                out_of_range[i].append(bool(np.any(shared.out_of_range) or np.any(own.out_of_range)))
        angles.append(WorkingAngles(*converted))

    def stack(values: List[Any]) -> Any:
        if all(not hasattr(v, "dims") and np.ndim(v) == 0 for v in values):
            # plain numbers (angles given for the working fluid): one array, not a concat of one
            # DataArray per surface (about 0.2 s per field for a thousand surfaces)
            return xr.DataArray(np.asarray(values, dtype=float), dims="surface", coords=coord)
        arrs = [v if hasattr(v, "dims") else xr.DataArray(v) for v in values]
        return xr.concat(arrs, dim="surface").assign_coords(coord)

    table = {
        "static_angle": stack([a.static_deg for a in angles]),
        "advancing_angle": stack([a.advancing_deg for a in angles]),
        "receding_angle": stack([a.receding_deg for a in angles]),
    }
    for i, which in enumerate(("static", "advancing", "receding")):
        table[f"{which}_angle_invalid"] = xr.DataArray(np.asarray(invalid[i], dtype=float), dims="surface",
                                                       coords=coord)
        table[f"{which}_angle_out_of_range"] = xr.DataArray(np.asarray(out_of_range[i], dtype=float),
                                                            dims="surface", coords=coord)
    # Rohsenow's exponent of a surface that gives none: by fluid (warned once for an unnamed state,
    # where Rohsenow's nucleate superheat will use it)
    # (C_sf, n) are a fitted pair: a surface's n is used with its own C_sf only (see Surface)
    fitted_n = [s.n if s.C_sf is not None else None for s in surfaces]
    rohsenow_default = any(n is None and (nucleate == "rohsenow" or (nucleate == "auto" and s.C_sf is not None))
                           for s, n in zip(surfaces, fitted_n))
    n_default = boiling._default_exponent(fluid, "sweep") if rohsenow_default else boiling.rohsenow_exponent(fluid)
    if nucleate == "rohsenow" and any(s.C_sf is None for s in surfaces):
        boiling._default_constant(fluid, "sweep")  # warns when the fluid is not water
    for key, given, default in (("C_sf", [s.C_sf for s in surfaces], math.nan), ("n", fitted_n, n_default),
                                ("Rp", [s.Rp for s in surfaces], 1e-6)):
        vals = [v if v is not None else default for v in given]
        table[key] = xr.DataArray(np.asarray(vals, dtype=float), dims="surface", coords=coord)
    return table


class _Results:
    """Values of the chain in order, with their flags folded at once into two
    int32 bit masks (bit i <-> i-th value), so no per-quantity mask is kept."""

    def __init__(self, shape: Tuple[int, ...], state_invalid: Any = None):
        self.shape = shape
        self.values: Dict[str, Any] = {}
        self.invalid = np.zeros(shape, np.int32)
        self.out_of_range = np.zeros(shape, np.int32)
        # points whose fluid state is impossible (None: there are none): a
        # quantity that is NaN there is NaN because of an impossible input
        self.state_invalid = state_invalid

    def add(self, name: str, value: Any, invalid: Any, out_of_range: Any, uses_state: bool = True) -> Any:
        bit = np.int32(1 << len(self.values))
        self.values[name] = value
        if uses_state and self.state_invalid is not None:
            invalid = np.logical_or(invalid, self.state_invalid & np.isnan(value))
        for mask, acc in ((invalid, self.invalid), (out_of_range, self.out_of_range)):
            if np.any(mask):
                np.bitwise_or(acc, bit, out=acc, where=np.broadcast_to(mask, self.shape))
        return value

    def flag(self, name: str, out_of_range: Any) -> None:
        """Set the out-of-range bit of the quantity `name` (added before) where `out_of_range`."""
        bit = np.int32(1 << list(self.values).index(name))
        if np.any(out_of_range):
            np.bitwise_or(self.out_of_range, bit, out=self.out_of_range,
                          where=np.broadcast_to(out_of_range, self.shape))

    def add_state(self, invalid: Any, out_of_range: Any) -> None:
        """The last bit, `STATE_FLAG`: the fluid state of the point itself."""
        bit = np.int32(1 << len(self.values))
        for mask, acc in ((invalid, self.invalid), (out_of_range, self.out_of_range)):
            if np.any(mask):
                np.bitwise_or(acc, bit, out=acc, where=np.broadcast_to(mask, self.shape))


def _chain(inputs: Dict[str, Any], methods: Dict[str, Any], fluid: Saturation, shape: Tuple[int, ...]) -> _Results:
    """Evaluate every quantity on NumPy arrays, in the order of the flag bits."""
    state_invalid = inputs["fluid_invalid"] > 0
    res = _Results(shape, state_invalid if state_invalid.any() else None)
    q = inputs["in_heat_flux"]
    phi = inputs["in_orientation"]
    sub = inputs["in_subcooling"]
    static, adv, rec = inputs["static_angle"], inputs["advancing_angle"], inputs["receding_angle"]

    # a quantity computed from a flagged angle (Wenzel or Cassie-Baxter left their range, the probe-liquid
    # prediction did) carries that angle's flags beside its own: its value is an extrapolation too
    angle_flags = {name: (inputs[f"{name}_invalid"] > 0, inputs[f"{name}_out_of_range"] > 0)
                   for name in ("static_angle", "advancing_angle", "receding_angle")}

    def add(name: str, value: Any, invalid: Any, out_of_range: Any, angle: Optional[str] = None) -> Any:
        if angle is not None:
            invalid, out_of_range = (np.logical_or(a, b) for a, b in zip((invalid, out_of_range), angle_flags[angle]))
        return res.add(name, value, invalid, out_of_range)

    def run(name: str, fn: Any, angle: Optional[str] = None) -> Any:
        with capture_validity() as cap:
            value = fn()
        return add(name, value, cap.invalid, cap.out_of_range, angle)

    for name, value in (("static_angle", static), ("advancing_angle", adv), ("receding_angle", rec)):
        res.add(name, value, *angle_flags[name])
    onset_angle = rec if methods["onset"] == "kandlikar" else static
    # the angle each onset output depends on: Hsu's superheat and radius on the static angle; Kandlikar's
    # radius on the receding one (his superheat takes none); Davis-Anderson and Bergles-Rohsenow take none
    superheat_by: Optional[str] = "static_angle" if methods["onset"] == "hsu" else None
    radius_by = {"hsu": "static_angle", "kandlikar": "receding_angle"}.get(methods["onset"])
    run("onset_superheat", lambda: nucleation.onset_superheat(q, fluid, onset_angle, method=methods["onset"]),
        superheat_by)
    if methods["onset"] in nucleation.ONSET_RADIUS_METHODS:
        run("onset_cavity_radius", lambda: nucleation.onset_cavity_radius(q, fluid, onset_angle, method=methods["onset"]),
            radius_by)
    else:  # Bergles-Rohsenow: a fit of the onset superheat, with no nucleus and so no radius
        res.add("onset_cavity_radius", math.nan, False, False, uses_state=False)

    # nucleate superheat: each method's value and flags, and with "auto" each point keeps those of
    # the method it uses (Cooper where the surface has no C_sf, Rohsenow elsewhere; a method that
    # no point uses is not run)
    c_sf = inputs["C_sf"]
    by_cooper = np.isnan(c_sf)
    used = [methods["nucleate"]] if methods["nucleate"] != "auto" else (
        ["cooper"] if by_cooper.all() else ["rohsenow"] if not by_cooper.any() else ["cooper", "rohsenow"])
    nucleate = {}
    for m in used:
        with capture_validity() as cap:
            if m == "cooper":
                value = boiling.cooper_superheat(q, fluid, inputs["Rp"])
            else:
                value = boiling.rohsenow_superheat(q, fluid, np.where(by_cooper, boiling.ROHSENOW_C_SF_DEFAULT, c_sf),
                                                   inputs["n"])
        nucleate[m] = (value, cap)
    if len(used) == 2:
        (vc, cc), (vr, cr) = nucleate["cooper"], nucleate["rohsenow"]
        dtw = res.add("nucleate_superheat", np.where(by_cooper, vc, vr), np.where(by_cooper, cc.invalid, cr.invalid),
                      np.where(by_cooper, cc.out_of_range, cr.out_of_range))
    else:
        value, cap = nucleate[used[0]]
        dtw = res.add("nucleate_superheat", value, cap.invalid, cap.out_of_range)
    del nucleate
    # linear thermal layer carrying the design flux: delta = k_l (dT_w + dT_sub) / q
    delta = fluid.k_l * (dtw + sub) / q
    with capture_validity() as cap:
        radii = nucleation.hsu_active_radii(dtw, fluid, static, delta, sub)
    del delta
    add("cavity_radius_min", radii.r_min, cap.invalid, cap.out_of_range, "static_angle")
    add("cavity_radius_max", radii.r_max, cap.invalid, cap.out_of_range, "static_angle")
    # Cole-Rohsenow's constant settled once per sweep (and its warning for an unnamed state given there,
    # not once per block)
    extra = {"C": departure._cole_rohsenow_constant(fluid)} if methods["departure"] == "cole_rohsenow" else {}
    d_by = None if methods["departure"] == "cole_rohsenow" else "static_angle"
    d = run("departure_diameter", lambda: departure.diameter(static, fluid, method=methods["departure"], **extra), d_by)
    # a zero diameter (Fritz at 0 deg) has no departure cycle: the frequency kernels give NaN there, flagged
    run("departure_frequency", lambda: departure.frequency(d, fluid, method=methods["frequency"]), d_by)
    for m in methods["chf"]:
        if m == "kandlikar":
            run(f"chf_{m}", lambda: chf.kandlikar(rec, fluid, phi), "receding_angle")
        else:  # zuber (K = pi/24), lienhard_dhir_flat (K = 0.149)
            K = chf.ZUBER_K if m == "zuber" else chf.LIENHARD_DHIR_K
            with capture_validity() as cap:
                value = chf.zuber(fluid, K=K) * np.ones_like(rec)
            # both hold for a large horizontal heater facing up: at any other orientation the value
            # is that of a heater facing up, outside the form's validity (flagged, not corrected)
            res.add(f"chf_{m}", value, cap.invalid, np.logical_or(cap.out_of_range, ~(phi == 0.0)))
    # The first selected method is the design method: its CHF and margin are
    # reported as "chf" and "chf_margin"; the others stay as chf_<method>.
    first = f"chf_{methods['chf'][0]}"
    bit = np.int32(1 << list(res.values).index(first))
    inv, oor = (res.invalid & bit) != 0, (res.out_of_range & bit) != 0
    primary = res.values[first]
    res.add("chf", primary, inv, oor)
    res.add("chf_margin", primary / q, inv, oor)
    # Rohsenow's and Cooper's correlations are for nucleate boiling below the critical heat flux (Rohsenow's
    # validity in wetboil.models()): at a design flux at or above the design method's CHF the nucleate
    # superheat is an extrapolation past the boiling crisis (boiling.curve gives no design superheat there)
    with np.errstate(invalid="ignore"):
        res.flag("nucleate_superheat", q >= primary)
    res.add_state(state_invalid, inputs["fluid_out_of_range"] > 0)
    return res


def _block(ds: Any, methods: Dict[str, Any], fluid_name: Optional[str], strict: Any = None) -> Any:
    """Evaluate the chain on one block of the broadcast input Dataset (NumPy
    data); module-level so that dask can ship it to workers. `strict`: the
    element policy of the call that built a lazy sweep, applied to the block
    when it is computed."""
    import xarray as xr

    # the inputs arrive on their own axes; broadcast here, as views, so that no
    # full-size copy of an input exists (a chunked sweep would otherwise hold
    # every input field at the size of the grid before its first block)
    ds = xr.broadcast(ds)[0].transpose(*(d for d in _AXES if d in ds.dims))
    arrays = {k: ds[k].values for k in ds.data_vars}
    fluid = Saturation(**{f: arrays[f"fluid_{f}"] for f in FIELDS}, name=fluid_name)
    dims = ds["static_angle"].dims
    shape = ds["static_angle"].shape
    with errstate(invalid="ignore", out_of_range="ignore"):
        res = _chain(arrays, methods, fluid, shape)
    data: Dict[str, Any] = {}
    for name, value in res.values.items():
        data[name] = (dims, np.ascontiguousarray(np.broadcast_to(np.asarray(value, float), shape)))
    data["invalid_flags"] = (dims, res.invalid)
    data["range_flags"] = (dims, res.out_of_range)
    out = xr.Dataset(data, coords=ds.coords)
    if strict is not None:
        _strict(out, strict, list(res.values) + [STATE_FLAG], where=" of a block")
    return out




def sweep(
    surfaces: Union[Surface, Sequence[Surface]],
    fluid: Union[str, Saturation] = "water",
    *,
    p: Any = None,
    T: Any = None,
    heat_flux: Any,
    orientation_deg: Any = 0.0,
    subcooling: Any = 0.0,
    methods: Optional[Mapping[str, Any]] = None,
    chunks: Optional[Union[int, Mapping[str, int]]] = None,
    progress: bool = False,
    compute: bool = True,
    dispersive_fraction: Optional[float] = None,
    fluid_properties: Optional[Mapping[str, Any]] = None,
) -> Any:
    """Evaluate the boiling chain over a labelled grid.

    Parameters
    ----------
    surfaces : Surface or sequence of Surface
        The candidate treatments (the ``surface`` axis).
    fluid : str or Saturation
        A fluid name with `p` or `T` ("water" is built in; other names go
        through CoolProp), or ready saturated states (a single state or a 1-D
        `Saturation`, whose pressure becomes the ``p`` axis; their NaN fields
        are taken as missing data, not flagged).
    p, T : array_like, optional
        Saturation pressures [Pa] or temperatures [K] (the ``p`` or ``T``
        axis). Values without a saturated state (outside triple point to
        critical point; water: 611.657 Pa to 22.064 MPa, 273.16 K to
        647.096 K) give NaN in every quantity that needs the fluid, the
        ``fluid_state`` bit in ``invalid_flags``, and one warning per call
        from the fluid layer (an error under ``errstate(invalid="raise")``).
    heat_flux : array_like
        Design wall heat fluxes [W/m2] (the ``heat_flux`` axis), positive and
        finite: a zero, negative, NaN or infinite design flux is an error
        (`WetboilValueError`), not a NaN point, since every margin would
        divide by it.
    orientation_deg : array_like
        Heater orientations [deg], 0 facing up, 90 vertical, 180 facing down
        (``orientation``); a value outside 0-180 (or NaN) raises
        `WetboilValueError`.
        Kandlikar's CHF depends on it; the Zuber and Lienhard-Dhir flat-plate
        CHF hold facing up only: at any other orientation they keep the
        facing-up value and are flagged in ``range_flags``.
    subcooling : array_like
        Bulk liquid subcooling [K] (``subcooling``), >= 0 and finite (a
        negative, NaN or infinite value raises `WetboilValueError`). No quantity of the
        present chain changes with it. For Hsu's active cavity range that is
        physics: it takes the subcooling with a thermal layer
        ``delta = k_l (dT_w + dT_sub) / q`` carrying the design flux, and then
        depends on the wall superheat and ``q / k_l`` alone (subcooling
        cancels). The nucleate-boiling (Rohsenow, Cooper), onset and CHF
        correlations here are for saturated pool boiling, and that is an
        omission: subcooling raises the pool-boiling CHF markedly, so on
        subcooled points ``chf`` and ``chf_margin`` are the saturated values
        (conservative), with no subcooling correction applied. The axis keeps subcooled
        operating points labelled in the results.
    methods : mapping, optional
        Method per step, e.g. ``{"onset": "kandlikar", "chf": ["kandlikar",
        "zuber"]}``; the defaults and the choices are
        ``wetboil.sweep.DEFAULT_METHODS`` and ``wetboil.sweep.METHOD_CHOICES``
        (attributes of this function, also importable with ``from
        wetboil.sweep import METHOD_CHOICES``). The first CHF
        method is the design method behind ``chf`` and ``chf_margin``; every
        selected method also gets its own ``chf_<method>`` variable to compare
        against. With "nucleate": "auto", Rohsenow is used where the surface
        has a C_sf and Cooper elsewhere (each point carries the flags of the
        method it used); with "rohsenow", a surface without a C_sf takes
        0.013 (`wetboil.boiling.rohsenow_superheat`'s default, water on
        polished copper; a warning when the fluid is not water). Onset uses the static angle, or the
        receding angle for "kandlikar"; departure uses the static angle (see
        `wetboil.departure.fritz` on the advancing one); CHF
        (Kandlikar) the receding angle. Onset "bergles_rohsenow" is a fit of
        the onset superheat for water with no nucleus: ``onset_cavity_radius``
        is NaN (not flagged), and another named fluid raises
        `WetboilValueError`. A static angle of 0 deg gives Fritz's zero
        departure diameter, for which the frequency correlations have no
        answer: ``departure_frequency`` is NaN there, flagged in
        ``range_flags`` (a valid surface, not an impossible input). The
        default departure method, Fritz, has no pressure term and falls to
        zero with the angle: at low pressure or for well-wetting fluids
        compare "cole_rohsenow" (see `wetboil.departure.fritz`). The default
        design CHF, Kandlikar's, is 1.42 times Zuber's at a receding angle
        of 0 deg (see `wetboil.chf.kandlikar`): keep "zuber" beside it for
        such fluids.
    chunks : int or mapping, optional
        Chunk sizes (per axis name, or one size for every axis): the result
        is computed lazily on dask, block by block (on a `dask.distributed`
        cluster when a client is active). The inputs stay on their own axes
        until a block needs them, so a lazy sweep costs memory only for its
        blocks in flight, and a computed one writes each block into the
        outputs as it finishes (peak about the outputs plus the blocks in
        flight). Chunk so that a block is a small part of the grid: one
        block of the whole grid needs twice the outputs.
    progress : bool
        Show a progress bar while computing a chunked sweep.
    compute : bool
        With `chunks`, return the computed Dataset (default) or the lazy one.
    dispersive_fraction : float, optional
        Dispersive part of the working fluid's surface tension over the
        total, 0-1, for surfaces described by probe-liquid angles (see
        `wetboil.Surface.angles`). By default the fluid's tabulated value
        (`wetboil.wetting.dispersive_fraction`: water, saturated
        hydrocarbons); for another fluid such surfaces raise
        `WetboilValueError` until it is given.
    fluid_properties : mapping, optional
        Saturated-state fields to set, SI units as in `wetboil.fluids.UNITS`
        (any field but ``T`` and ``p``), with a fluid name only: a number
        for every state, or one value per state of `p` or `T`. For the
        properties CoolProp has no model for (surface tension and transport
        properties of several dielectric fluids, e.g. ``{"sigma": ...,
        "k_l": ..., "mu_l": ...}`` from the maker's data sheet) or to
        override its values; the names and values given are kept in
        ``attrs["fluid_properties_given"]``. With a `Saturation`, use its
        ``.replace()`` instead.

    Returns
    -------
    xarray.Dataset
        One variable per entry of ``wetboil.sweep.QUANTITIES`` (units in
        ``attrs``), plus ``chf_<method>`` for each CHF method, and two bit
        masks: ``range_flags`` (bit i set: quantity i used a correlation
        outside its published validity range) and ``invalid_flags`` (bit i
        set: quantity i is NaN because an input was physically impossible);
        a quantity computed from a flagged angle carries that angle's flags
        too (Hsu's onset superheat and radius and the active cavity range
        from the static angle; Kandlikar's onset radius from the receding
        one, his onset superheat and Davis-Anderson's taking no angle; the
        departure diameter and frequency from the static angle, except
        Cole-Rohsenow's; Kandlikar's CHF from the receding angle; an angle
        is flagged each on its own where Wenzel or
        Cassie-Baxter left their range, all three where the probe-liquid
        prediction did);
        the bit order is in their ``attrs["bits"]`` (and as CF's
        ``flag_masks`` / ``flag_meanings``). Beside the state's axis, the
        other saturation variable of each state is a coordinate:
        ``T_sat`` [K] on a pressure axis, ``p_sat`` [Pa] on a temperature
        axis (a wall temperature is ``T_sat`` plus the superheat). The last bit,
        ``fluid_state`` (``wetboil.sweep.STATE_FLAG``), is the operating
        point's saturated state itself: impossible (``invalid_flags``), or
        computed outside the fluid layer's validity range (``range_flags``,
        water above 0.997 T_crit; also a state where CoolProp gives no value
        of a property the chain uses although it has a model for it, as
        surface tension near the critical point). Flagged points give no warnings (the masks
        record them), except the fluid layer's one warning per call for
        states that are impossible or outside its range; under ``wetboil.errstate(invalid="raise")`` or
        ``(out_of_range="raise")`` a computed sweep with points of that kind
        raises instead; a lazy one (``compute=False``) keeps that policy and
        raises when a block with such points is computed. ``attrs`` name the
        ``fluid``, the ``methods``, the ``caution``, and, when some fluid
        field is NaN at every state because CoolProp has no model for it (or
        the given Saturation lacks it), ``fluid_fields_missing``: every
        quantity that needs one is NaN, unflagged (give them in
        `fluid_properties`). A computed sweep whose every finite CHF
        margin is above 1000 warns once (`WetboilWarning`), asking whether
        the heat fluxes were given in W/cm2 or kW/m2 (they are in W/m2).

    Examples
    --------
    >>> import wetboil
    >>> s = [wetboil.Surface("bare (invented)", 78, 88, 52), wetboil.Surface("oxidised (invented)", 24, 33, 11)]
    >>> ds = wetboil.sweep(s, "water", p=[1e5, 5e5], heat_flux=4e5, orientation_deg=[0.0, 90.0])
    >>> ds["chf_margin"].dims
    ('surface', 'p', 'heat_flux', 'orientation', 'subcooling')
    >>> bool((ds["chf_margin"].sel(surface="oxidised (invented)") > ds["chf_margin"].sel(surface="bare (invented)")).all())
    True
    >>> wetboil.sweep.METHOD_CHOICES["chf"]
    ('kandlikar', 'zuber', 'lienhard_dhir_flat')
    """
    import xarray as xr

    if isinstance(surfaces, Surface):
        surfaces = [surfaces]
    if not isinstance(surfaces, Iterable) or isinstance(surfaces, (str, bytes)):
        raise WetboilTypeError(f"sweep: surfaces must be a wetboil.Surface or a sequence of them, "
                               f"got {type(surfaces).__name__}")
    surfaces = list(surfaces)
    if not surfaces:
        raise WetboilValueError("sweep: the surface axis is empty")
    if not all(isinstance(s, Surface) for s in surfaces):
        raise WetboilTypeError("sweep: surfaces must be wetboil.Surface objects")
    meth = _methods(methods)
    if dispersive_fraction is not None and (
            isinstance(dispersive_fraction, bool) or not isinstance(dispersive_fraction, (int, float, np.integer, np.floating))
            or not 0.0 <= float(dispersive_fraction) <= 1.0):
        raise WetboilValueError(f"sweep: dispersive_fraction must be a number in 0-1, got {dispersive_fraction!r}")
    states, state_dim, state_invalid, state_out_of_range = _fluid_states(fluid, p, T, xr, fluid_properties)
    problem = _method_fluid_problem(meth, states.name)
    if problem:
        raise WetboilValueError(f"sweep: {problem}")
    if meth["departure"] == "cole_rohsenow" and states.name is None:
        _warn("sweep: the fluid state has no name, so Cole-Rohsenow's C = 4.65e-4 (the constant for liquids other "
              "than water) is used; name the state (Saturation(..., name=...)) for water's 1.5e-4", WetboilWarning)
    table = _surface_table(surfaces, states, meth["nucleate"], dispersive_fraction, xr)
    table["fluid_invalid"], table["fluid_out_of_range"] = state_invalid, state_out_of_range
    axes = {
        "heat_flux": _axis("heat_flux", heat_flux, xr),
        "orientation": _axis("orientation", orientation_deg, xr, "orientation_deg"),
        "subcooling": _axis("subcooling", subcooling, xr),
    }
    # the axes' own values, refused as the study spec refuses them (a mistyped axis, not a point to flag):
    # a heater faces 0 (up) to 180 deg (down); a negative subcooling is a superheated pool; a NaN or
    # infinite design flux or subcooling (a blank cell read from a sheet) gave unflagged NaN rows, or a
    # CHF margin of exactly 0
    def offending(values: Any) -> str:  # the bad values only, at most 10 (an axis may hold thousands)
        bad = [f"{v:g}" for v in values]
        return ", ".join(bad[:10]) + (f", ... ({len(bad)} values)" if len(bad) > 10 else "")

    qv = axes["heat_flux"].values
    if not ((qv > 0) & np.isfinite(qv)).all():
        raise WetboilValueError(f"sweep: heat_flux must be positive and finite [W/m2], got "
                                f"{offending(qv[~((qv > 0) & np.isfinite(qv))])}")

    o = axes["orientation"].values
    if not ((o >= 0) & (o <= 180)).all():
        raise WetboilValueError(f"sweep: orientation_deg must lie in 0-180 (0 facing up, 90 vertical, 180 facing "
                                f"down), got {offending(o[~((o >= 0) & (o <= 180))])}")
    s = axes["subcooling"].values
    if not ((s >= 0) & np.isfinite(s)).all():
        raise WetboilValueError(f"sweep: subcooling must be zero or positive and finite [K], got "
                                f"{offending(s[~((s >= 0) & np.isfinite(s))])}")
    parts = dict(table)
    parts.update({f"in_{k}": v for k, v in axes.items()})
    for f in FIELDS:
        v = getattr(states, f)
        parts[f"fluid_{f}"] = v if hasattr(v, "dims") else xr.DataArray(float(v))
    order = ["surface"] + ([state_dim] if state_dim else []) + ["heat_flux", "orientation", "subcooling"]
    ds_in = xr.Dataset(parts)  # each input on its own axes: _block broadcasts
    if chunks is not None:
        sizes = list(chunks.values()) if isinstance(chunks, Mapping) else [chunks]
        if not all(isinstance(c, (int, np.integer)) and not isinstance(c, bool) and (c > 0 or c == -1)
                   for c in sizes):
            raise WetboilValueError(f"sweep: chunks must be a positive integer (-1: a whole axis) or a mapping of "
                                    f"axis names to such integers, got {chunks!r}")
        want = dict(chunks) if isinstance(chunks, Mapping) else dict.fromkeys(order, chunks)
        unknown = set(want) - set(order)
        if unknown:
            raise WetboilValueError(f"sweep: chunks names {', '.join(sorted(map(str, unknown)))}, not an axis of "
                                    f"this sweep ({', '.join(order)})")
        ds_in = ds_in.chunk({d: c for d, c in want.items() if d in ds_in.dims})
        template = _template(ds_in, meth, order)
        # a lazy result keeps the element policy of this call, as lazy kernel calls do
        lazy_policy = None if compute or "raise" not in _STATE.get() else _STATE.get()
        result = xr.map_blocks(_block, ds_in, args=(meth, states.name, lazy_policy), template=template)
        if compute:
            result = _compute(result, progress)
    else:
        result = _block(ds_in.compute(), meth, states.name)
    result = _decorate(result, meth, state_dim)
    # the saturation temperature (or pressure) of each state beside its axis: a wall temperature is
    # T_sat + superheat, and the netCDF file should not need the fluid library to rebuild it
    for name, v, unit, long_name in (("T_sat", states.T, "K", "saturation temperature"),
                                     ("p_sat", states.p, "Pa", "saturation pressure")):
        if name[0] != state_dim:
            dims = tuple(getattr(v, "dims", ()))
            result = result.assign_coords({name: (dims, np.asarray(getattr(v, "values", v), dtype=float))})
            result[name].attrs.update(units=unit, long_name=long_name)
    result.attrs["fluid"] = states.name if states.name is not None else "(unnamed Saturation)"
    if any(s.probe_static_deg is not None for s in surfaces):  # the split behind the predicted angles
        result.attrs["dispersive_fraction"] = float(
            dispersive_fraction if dispersive_fraction is not None else wetting.dispersive_fraction(states))
    missing = _missing_fields(states, named=isinstance(fluid, str))
    if missing:
        result.attrs["fluid_fields_missing"] = ", ".join(missing)
    if fluid_properties:
        result.attrs["fluid_properties_given"] = "; ".join(
            f"{f} = {v!r} {UNITS[f]}" if np.ndim(v) == 0 else f"{f} = {list(map(float, v))} {UNITS[f]}"
            for f, v in _given_properties(fluid_properties, result[state_dim]).items())
    if chunks is None or compute:
        _strict(result, _STATE.get(), result["range_flags"].attrs["bits"].split(","))
        if not _QUIET_SLIP.get():
            slip = _margin_slip(result)
            if slip:
                _warn(f"sweep: {slip}", WetboilWarning)
    return result


#: A CHF margin above which every design point looks like a heat flux typed in another unit: 50 typed for
#: 50 W/cm2 on water at 5 kPa gives about 8000, 300 for 300 kW/m2 at 1 atm about 4000. Real designs keep
#: margins of a few [common practice]; a fixed flux bound would misfire for cryogens (helium's Zuber CHF at
#: 1 atm is about 6 kW/m2).
_MARGIN_SLIP = 1000.0

#: Set by callers that word the unit-slip question themselves (`wetboil.report` names the spec line).
_QUIET_SLIP: "contextvars.ContextVar[bool]" = contextvars.ContextVar("wetboil_quiet_margin_slip", default=False)


def _margin_slip(ds: Any) -> Optional[str]:
    """The question a computed sweep raises when every finite CHF margin is above `_MARGIN_SLIP`
    (design heat fluxes typed in W/cm2 or kW/m2), or None."""
    # fmin skips NaN without a copy of the (possibly 10^8-point) array; an infinite margin is a zero flux
    smallest = float(np.fmin.reduce(np.asarray(ds["chf_margin"].values, dtype=float), axis=None, initial=np.inf))
    if not (math.isfinite(smallest) and smallest > _MARGIN_SLIP):
        return None
    fluxes = np.asarray(ds["heat_flux"].values, dtype=float)
    shown = ", ".join(f"{q:g}" for q in fluxes[:10]) + (", ..." if fluxes.size > 10 else "")
    return (f"every CHF margin is above {_MARGIN_SLIP:g} (smallest {smallest:.3g}, design heat fluxes {shown} "
            "W/m2); were the heat fluxes given in W/cm2 or kW/m2? They are in W/m2 (1 W/cm2 = 1e4 W/m2, 1 kW/m2 = "
            "1e3 W/m2; the results stand as given)")


def _no_model(states: Saturation) -> frozenset:
    """The fields CoolProp has no model for in the fluid of `states` (none for water, which is computed here)."""
    from .fluids import _coolprop_no_model, _is_water

    return frozenset() if states.name is None or _is_water(states.name) else _coolprop_no_model(states.name)


#: The fluid fields the sweep's chain reads (the vapour's transport properties only enter film boiling).
_CHAIN_FIELDS = ("T", "p", "rho_l", "rho_v", "h_lv", "sigma", "cp_l", "k_l", "mu_l")


def _field(states: Saturation, name: str) -> np.ndarray:
    """A field of `states` as a float ndarray (a DataArray's values)."""
    v = getattr(states, name)
    return np.asarray(getattr(v, "values", v), dtype=float)


def _missing_fields(states: Saturation, named: bool) -> List[str]:
    """Fluid fields NaN at every state that has one, so that the quantities
    that need them are NaN everywhere, which no flag records: for a named
    fluid those CoolProp has no model for (a field missing at the requested
    states only is flagged ``fluid_state`` instead); for a given Saturation,
    any (never given)."""
    have = ~np.isnan(_field(states, "rho_l"))
    if not have.any():
        return []
    lacks = _no_model(states) if named else None
    out = []
    for f in FIELDS:
        v = np.broadcast_to(_field(states, f), have.shape)
        if np.isnan(v[have]).all() and (lacks is None or f in lacks):
            out.append(f)
    return out


def _strict(ds: Any, state: Any, bits: List[str], where: str = "") -> None:
    """Under ``errstate(invalid="raise")`` or ``(out_of_range="raise")`` (the
    policy `state`), raise for a computed sweep (or block of one, `where`)
    with points of that kind instead of returning them flagged (the default
    records them in the flag masks, without warnings)."""
    from ._errors import InvalidValueError, OutOfRangeError

    for key, action, flags, error, what in (
            ("invalid", state.invalid, "invalid_flags", InvalidValueError, "a physically impossible input (NaN)"),
            ("out_of_range", state.out_of_range, "range_flags", OutOfRangeError,
             "a correlation outside its published validity range")):
        mask = np.asarray(ds[flags].values)
        if action != "raise" or not mask.any():
            continue
        seen = int(np.bitwise_or.reduce(mask.ravel()))
        names = [b for i, b in enumerate(bits) if seen >> i & 1]
        raise error(f"sweep: {int(np.count_nonzero(mask))} of {mask.size} points{where} with {what}: "
                    f"{', '.join(names)} (errstate {key}='raise'; by default they are recorded in {flags})")


# `wetboil.sweep` names this function (it shadows the module of the same name
# on the package), so the tables its docstring names are reachable from it too.
sweep.DEFAULT_METHODS = DEFAULT_METHODS  # type: ignore[attr-defined]
sweep.METHOD_CHOICES = METHOD_CHOICES  # type: ignore[attr-defined]
sweep.QUANTITIES = QUANTITIES  # type: ignore[attr-defined]
sweep.STATE_FLAG = STATE_FLAG  # type: ignore[attr-defined]


def _template(ds_in: Any, meth: Dict[str, Any], order: List[str]) -> Any:
    import dask.array as da
    import xarray as xr

    # the broadcast shape of the inputs, with their chunks (an axis no input was chunked along: one chunk)
    shape = tuple(ds_in.sizes[d] for d in order)
    chunks = tuple(ds_in.chunks.get(d, (ds_in.sizes[d],)) for d in order)
    # the order in which _chain produces them (it is also the flag-bit order)
    names = list(QUANTITIES)[:-2] + [f"chf_{m}" for m in meth["chf"]] + ["chf", "chf_margin"]
    data = {n: (order, da.zeros(shape, chunks=chunks, dtype=float)) for n in names}
    for n in ("invalid_flags", "range_flags"):
        data[n] = (order, da.zeros(shape, chunks=chunks, dtype=np.int32))
    # the axes' coordinates first, in output order: the Dataset's dims (and to_dataframe's index) then
    # come in the same order as an eager sweep's, whichever input brought an axis in first
    coords = {d: ds_in.coords[d] for d in order if d in ds_in.coords}
    coords.update({k: v for k, v in ds_in.coords.items() if k not in coords})
    return xr.Dataset(data, coords=coords)


def _compute(result: Any, progress: bool) -> Any:
    """The lazy sweep `result` computed into memory. With a scheduler that
    runs in this process (dask's threads, or synchronous), each block is
    written into preallocated outputs as soon as it is done
    (``dask.array.store``) and then dropped, so the peak is the outputs plus
    the blocks in flight; ``.compute()`` would first hold every block and then
    copy them into the outputs (twice the outputs). Any other scheduler (a
    ``distributed`` client, processes), whose workers cannot write into this
    process's arrays, computes the usual way."""
    import contextlib

    import dask.array as da
    import dask.base
    import dask.local
    import dask.threaded
    from dask.diagnostics import ProgressBar

    scheduler = dask.base.get_scheduler(collections=[result])
    if scheduler not in (dask.threaded.get, dask.local.get_sync):
        client = getattr(scheduler, "__self__", None)  # a distributed Client's bound get
        if progress and client is not None and hasattr(client, "persist"):
            from distributed import progress as dist_progress

            persisted = result.persist()
            dist_progress(persisted)
            return persisted.compute()
        if progress:
            with ProgressBar():
                return result.compute()
        return result.compute()
    names = list(result.data_vars)
    out = {n: np.empty(result[n].shape, dtype=result[n].dtype) for n in names}
    with ProgressBar() if progress else contextlib.nullcontext():
        da.store([result[n].data for n in names], [out[n] for n in names], lock=False)
    return result.copy(data=out)


def _decorate(ds: Any, meth: Dict[str, Any], state_dim: str) -> Any:
    bits = []
    for name in (n for n in ds.data_vars if n not in ("invalid_flags", "range_flags")):
        bits.append(name)
        unit, long_name = QUANTITIES.get(name, ("W/m2", f"critical heat flux, method {name[4:]}"))
        ds[name].attrs.update(units=unit, long_name=long_name)
    bits.append(STATE_FLAG)  # the last bit: the fluid state of the point itself
    for n in ("invalid_flags", "range_flags"):
        ds[n].attrs["bits"] = ",".join(bits)  # bit i <-> i-th name
        # the same as CF's bit-field flags (CF conventions section 3.5), which netCDF tools decode
        # (np.int32: the type of the variable, as CF asks; a list, so that attrs compare with ==)
        ds[n].attrs["flag_masks"] = [np.int32(1 << i) for i in range(len(bits))]
        ds[n].attrs["flag_meanings"] = " ".join(bits)
        ds[n].attrs["long_name"] = (
            "quantities that are NaN because an input was impossible (fluid_state: no saturated state at "
            "this pressure or temperature)" if n == "invalid_flags"
            else "quantities computed outside a correlation's published validity range (fluid_state: the "
            "fluid properties themselves)")
    axis_attrs: Tuple[Tuple[str, str, str], ...] = (
            ("surface", "", "surface treatment"),
            ("p", "Pa", "saturation pressure"), ("T", "K", "saturation temperature"),
            ("state", "", "index of the given saturated state"),
            ("heat_flux", "W/m2", "design wall heat flux"),
            ("orientation", "deg", "heater orientation (0 facing up, 90 vertical, 180 facing down)"),
            ("subcooling", "K", "bulk liquid subcooling"))
    for axis, unit, long_name in axis_attrs:
        if axis in ds.coords:
            if unit:
                ds[axis].attrs["units"] = unit
            ds[axis].attrs.setdefault("long_name", long_name)
    ds.attrs.update(
        methods=str({k: list(v) if isinstance(v, tuple) else v for k, v in meth.items()}),
        caution="CHF predictions carry correlation uncertainty of tens of percent and hold only inside their "
        "validity ranges; apply safety margins and defer to local codes and licensed engineering practice.",
        created_by="wetboil",
        wetboil_version=_version(),
    )
    return ds


def _version() -> str:
    from . import __version__
    return __version__


def _flag_text(mask: int, bits: List[str]) -> str:
    return ", ".join(name for bit, name in enumerate(bits) if mask & (1 << bit))


def screen(
    surfaces: Union[Surface, Sequence[Surface]],
    fluid: Union[str, Saturation] = "water",
    heat_flux: Any = None,
    orientation_deg: Any = 0.0,
    subcooling: Any = 0.0,
    methods: Optional[Mapping[str, Any]] = None,
    *,
    p: Any = None,
    T: Any = None,
    dispersive_fraction: Optional[float] = None,
    fluid_properties: Optional[Mapping[str, Any]] = None,
) -> Any:
    """Rank surface treatments: one row per surface and operating point.

    Takes the arguments of `sweep` but its chunking ones (the operating
    points are the grid of the given pressures or states, heat fluxes,
    orientations and subcoolings; `dispersive_fraction` and
    `fluid_properties` as there) and
    returns a `pandas.DataFrame` sorted by CHF margin, highest first (the
    best candidates first; ties by surface name). Column names carry units;
    ``flags`` names the quantities whose correlations left their published
    validity range on that row, ``impossible`` those that are NaN because an
    input was impossible, and also ``fluid_state`` when the operating point
    has no saturated state (e.g. above the critical pressure).

    Examples
    --------
    >>> import wetboil
    >>> s = [wetboil.Surface("bare (invented)", 78, 88, 52), wetboil.Surface("oxidised (invented)", 24, 33, 11)]
    >>> df = wetboil.screen(s, "water", heat_flux=4e5, p=101325.0)
    >>> list(df["surface"])
    ['oxidised (invented)', 'bare (invented)']
    """
    if heat_flux is None:
        raise WetboilValueError("screen: heat_flux (the design heat flux [W/m2]) is required")
    quiet = _QUIET_SLIP.set(True)  # asked below, named after the function the user called
    try:
        ds = sweep(surfaces, fluid, p=p, T=T, heat_flux=heat_flux, orientation_deg=orientation_deg,
                   subcooling=subcooling, methods=methods, dispersive_fraction=dispersive_fraction,
                   fluid_properties=fluid_properties)
    except WetboilError as exc:
        # the same checks as sweep's, named after the function the user called
        if exc.args and isinstance(exc.args[0], str) and exc.args[0].startswith("sweep: "):
            exc.args = ("screen: " + exc.args[0][len("sweep: "):],) + exc.args[1:]
        raise
    finally:
        _QUIET_SLIP.reset(quiet)
    slip = _margin_slip(ds)
    if slip:
        _warn(f"screen: {slip}", WetboilWarning)
    return ranked_table(ds)


def ranked_table(ds: Any) -> Any:
    """A sweep's Dataset as the ranked `pandas.DataFrame` of `screen`: one row
    per grid point, best CHF margin first, units in the column names, the
    flag bit masks spelled out as the quantities they name."""
    bits = ds["range_flags"].attrs["bits"].split(",")
    df = ds.to_dataframe().reset_index()
    df["flags"] = [_flag_text(int(m), bits) for m in df.pop("range_flags")]
    df["impossible"] = [_flag_text(int(m), bits) for m in df.pop("invalid_flags")]
    for other in ("T_sat", "p_sat"):  # the other saturation variable beside its state's column
        if other in df.columns and ("p" if other == "T_sat" else "T") in df.columns:
            df.insert(df.columns.get_loc("p" if other == "T_sat" else "T") + 1, other, df.pop(other))
    # a dimensionless quantity is "1" in the Dataset (CF), "-" in the table (an engineer's column label)
    units = {name: "-" if ds[name].attrs.get("units") == "1" else ds[name].attrs.get("units", "")
             for name in ds.data_vars}
    units.update({"heat_flux": "W/m2", "orientation": "deg", "subcooling": "K", "p": "Pa", "T": "K", "T_sat": "K",
                  "p_sat": "Pa"})
    df = df.sort_values(["chf_margin", "surface"], ascending=[False, True], kind="mergesort").reset_index(drop=True)
    df = df.rename(columns={c: f"{c} [{units[c]}]" for c in df.columns if units.get(c)})
    df.attrs["units"] = units
    for key in ("fluid", "fluid_fields_missing", "fluid_properties_given", "dispersive_fraction", "methods", "caution",
                "wetboil_version"):
        if key in ds.attrs:
            df.attrs[key] = ds.attrs[key]
    return df


class WaterChain(NamedTuple):
    """Outputs of `water_chain`."""

    T_sat: Any
    onset_superheat: Any
    departure_diameter: Any
    critical_heat_flux: Any


@kernel("water_screening_chain", result=WaterChain)
def water_chain(p: Any, contact_angle_deg: Any, receding_angle_deg: Any, heat_flux: Any,  # type: ignore[empty-body]
                orientation_deg: Any = 0.0, g: Any = 9.80665) -> WaterChain:
    """The screening chain for water fused into one pass per element.

    Saturated water at `p` [Pa] (`wetboil.fluids.water`), the Hsu onset
    superheat at `heat_flux` [W/m2] with the static angle
    (`wetboil.nucleation.onset_superheat`, method "hsu"), the Fritz departure
    diameter (`wetboil.departure.fritz`) and the Kandlikar CHF with the
    receding angle and `orientation_deg` (`wetboil.chf.kandlikar`), in one
    Rust loop that computes the water state once per element and writes
    only the four results. Bit for bit the numbers of the separate functions;
    meant for Monte-Carlo studies and sweeps of 10^7-10^8 points where each
    element has its own pressure.

    One status per element: where any input is impossible (a pressure
    outside 611.657 Pa to 22.064 MPa, the critical point included, where
    liquid and vapour are one phase; an angle outside 0-180 deg; a receding
    angle above the static one, which no surface has; a negative heat flux;
    g <= 0) all four results of that element are NaN, ``T_sat``
    too, and the call counts it once. Call the separate functions to keep
    the results that do not depend on the bad input.

    Parameters
    ----------
    p : array_like
        Saturation pressure [Pa], 611.657 Pa to 22.064 MPa.
    contact_angle_deg : array_like
        Static contact angle through the liquid [deg], 0 to 180 (Hsu onset,
        Fritz departure).
    receding_angle_deg : array_like
        Receding contact angle [deg], 0 to the static angle (Kandlikar CHF).
    heat_flux : array_like
        Wall heat flux [W/m2], >= 0 (Hsu onset).
    orientation_deg : array_like, optional
        Heater orientation [deg]: 0 facing up (the default), 90 vertical,
        180 facing down (Kandlikar CHF).
    g : array_like, optional
        Acceleration [m/s2]; standard gravity by default.

    Returns
    -------
    WaterChain
        ``T_sat`` [K], ``onset_superheat`` [K], ``departure_diameter`` [m],
        ``critical_heat_flux`` [W/m2].

    Notes
    -----
    Each step holds inside its own validity range, and elements outside it
    are computed and flagged (`RangeWarning`) as by the separate functions:
    T_sat up to 0.997 T_crit (645.15 K), contact angles up to 90 deg
    (Fritz), orientations up to 90 deg (Kandlikar; beyond, the CHF is NaN
    where his form has no answer, as in `wetboil.chf.kandlikar`), pressures
    up to 16.955 MPa (Kandlikar's near-critical bound rho_v/rho_l <= 0.21),
    and Hsu's onset superheat at 0 deg up to 0.1 T_sat. The chain is one
    kernel: an element outside any step's range is counted once, for all
    four outputs.

    References
    ----------
    .. [1] Y.Y. Hsu, "On the size range of active nucleation cavities on a
       heating surface", J. Heat Transfer 84 (1962) 207-213,
       doi:10.1115/1.3684339.
    .. [2] W. Fritz, "Berechnung des Maximalvolumens von Dampfblasen",
       Physikalische Zeitschrift 36 (1935) 379-384.
    .. [3] S.G. Kandlikar, "A theoretical model to predict pool boiling CHF
       incorporating effects of contact angle and orientation", J. Heat
       Transfer 123 (2001) 1071-1079, doi:10.1115/1.1409265.
    .. [4] IAPWS SR1-86(1992), R6-95(2018), R1-76(2014) (see
       `wetboil.fluids.water`).

    Examples
    --------
    >>> from wetboil.sweep import water_chain
    >>> r = water_chain(101325.0, 70.0, 40.0, 3e5)
    >>> round(r.T_sat, 3), round(r.departure_diameter * 1e3, 2), round(r.critical_heat_flux / 1e6, 2)
    (373.124, 3.65, 1.33)
    """
