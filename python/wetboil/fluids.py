"""Fluid states: the saturated properties every kernel reads.

`Saturation` bundles the properties of a saturated liquid and its vapour so
that no public function takes ten loose property arguments. Its fields may be
plain numbers, NumPy arrays or xarray DataArrays; they broadcast against each
other and against the other arguments of the kernels.
"""

from __future__ import annotations

import contextvars
import math
from typing import Any, Optional

import numpy as np

from ._errors import WetboilTypeError, WetboilValueError

__all__ = ["Saturation", "FIELDS", "water", "from_coolprop", "water_at_temperature", "water_at_pressure"]

#: Field order of a saturated state (also the order of the `_scalars` tuple the
#: Rust scalar path reads).
FIELDS = (
    "T",
    "p",
    "rho_l",
    "rho_v",
    "h_lv",
    "sigma",
    "cp_l",
    "k_l",
    "mu_l",
    "mu_v",
    "cp_v",
    "k_v",
    "molar_mass",
    "T_crit",
    "p_crit",
)

UNITS = {
    "T": "K",
    "p": "Pa",
    "rho_l": "kg/m3",
    "rho_v": "kg/m3",
    "h_lv": "J/kg",
    "sigma": "N/m",
    "cp_l": "J/(kg K)",
    "k_l": "W/(m K)",
    "mu_l": "Pa s",
    "mu_v": "Pa s",
    "cp_v": "J/(kg K)",
    "k_v": "W/(m K)",
    "molar_mass": "kg/mol",
    "T_crit": "K",
    "p_crit": "Pa",
}

_DESCRIPTIONS = {
    "T": "saturation temperature",
    "p": "saturation pressure",
    "rho_l": "liquid density",
    "rho_v": "vapour density",
    "h_lv": "latent heat of vaporisation",
    "sigma": "surface tension",
    "cp_l": "liquid isobaric heat capacity",
    "k_l": "liquid thermal conductivity",
    "mu_l": "liquid dynamic viscosity",
    "mu_v": "vapour dynamic viscosity",
    "cp_v": "vapour isobaric heat capacity",
    "k_v": "vapour thermal conductivity",
    "molar_mass": "molar mass",
    "T_crit": "critical temperature",
    "p_crit": "critical pressure",
}


def _is_plain(x: Any) -> bool:
    return isinstance(x, (float, int, np.floating, np.integer)) and not isinstance(x, (bool, np.bool_))


def _check_field(name: str, value: Any) -> Any:
    if _is_plain(value):
        try:
            return float(value)
        except OverflowError:
            raise WetboilValueError(f"Saturation: {name} is an integer beyond the range of float64 "
                                    "(about 1.8e308)") from None
    if value is None or isinstance(value, (str, bytes, bool, np.bool_, complex)):
        raise WetboilTypeError(f"Saturation: {name} must be a number or an array of numbers, got {type(value).__name__}")
    if hasattr(value, "dims") or type(value).__module__.startswith("dask"):
        return value  # xarray / dask objects keep their labels and laziness
    if isinstance(value, np.ma.MaskedArray) and value.dtype.kind in "fiu":
        # masked elements are missing data (NaN), as in a kernel argument: not the numbers under the mask
        value = np.ma.filled(value.astype(np.float64), np.nan)
    arr = np.asarray(value)
    if arr.dtype.kind not in "fiu":
        if arr.dtype.kind == "O" and not any(v is None for v in arr.flat):
            try:
                return arr.astype(np.float64)
            except (TypeError, ValueError):
                pass
        raise WetboilTypeError(f"Saturation: {name} must hold real numbers, got dtype {arr.dtype}")
    return arr.astype(np.float64, copy=False) if arr.ndim else float(arr)


#: The default of the optional `Saturation` fields: a NaN object of its own, so that "not given"
#: (a kernel needing the field warns) is told apart by identity from a NaN the caller passes.
NOT_GIVEN: float = float("nan")


class Saturation:
    """A saturated liquid-vapour state in SI units.

    Parameters
    ----------
    T : array_like
        Saturation temperature [K].
    p : array_like
        Saturation pressure [Pa].
    rho_l, rho_v : array_like
        Liquid and vapour densities [kg/m3].
    h_lv : array_like
        Latent heat of vaporisation [J/kg].
    sigma : array_like
        Liquid-vapour surface tension [N/m].
    cp_l, cp_v : array_like, optional
        Isobaric heat capacities of liquid and vapour [J/(kg K)].
    k_l, k_v : array_like, optional
        Thermal conductivities of liquid and vapour [W/(m K)].
    mu_l, mu_v : array_like, optional
        Dynamic viscosities of liquid and vapour [Pa s].
    molar_mass : float, optional
        Molar mass [kg/mol].
    T_crit, p_crit : float, optional
        Critical temperature [K] and pressure [Pa].
    name : str, optional
        Fluid name ("water", or a CoolProp name). Correlations with
        fluid-specific constants use it; a state without a name gets the
        general constants.

    Notes
    -----
    Optional properties not given are NaN; a kernel that needs one returns NaN
    and warns (`WetboilWarning`) naming the fields to set with `replace`.
    Physically impossible values (``rho_l <= rho_v``, ``sigma <= 0``...) are
    not rejected here: the kernels turn those elements into NaN and warn
    (see `wetboil.errstate`). Wrong types raise `TypeError` at once. Values
    that look typed in a data sheet's units instead of SI get one
    `WetboilWarning` (kept as given): ``h_lv`` below 5 kJ/kg (given in kJ/kg
    or J/g; not checked within 1 % of ``T_crit`` when it is given),
    ``cp_l`` or ``cp_v`` below 50 J/(kg K) (given in kJ/(kg K)), ``mu_l``
    above 0.2 Pa s (given in mPa s, cP). A surface tension in mN/m is flagged
    by the kernels that use it.

    Examples
    --------
    >>> from wetboil.fluids import Saturation
    >>> s = Saturation(T=373.124, p=101325.0, rho_l=958.35, rho_v=0.598, h_lv=2.2564e6, sigma=0.0589)
    >>> round(s.capillary_length * 1e3, 3)
    2.504
    """

    __slots__ = FIELDS + ("name", "_scalars")

    T: Any
    p: Any
    rho_l: Any
    rho_v: Any
    h_lv: Any
    sigma: Any
    cp_l: Any
    k_l: Any
    mu_l: Any
    mu_v: Any
    cp_v: Any
    k_v: Any
    molar_mass: Any
    T_crit: Any
    p_crit: Any
    name: Optional[str]
    _scalars: Optional[tuple]

    def __init__(
        self,
        T: Any,
        p: Any,
        rho_l: Any,
        rho_v: Any,
        h_lv: Any,
        sigma: Any,
        cp_l: Any = NOT_GIVEN,
        k_l: Any = NOT_GIVEN,
        mu_l: Any = NOT_GIVEN,
        mu_v: Any = NOT_GIVEN,
        cp_v: Any = NOT_GIVEN,
        k_v: Any = NOT_GIVEN,
        molar_mass: Any = NOT_GIVEN,
        T_crit: Any = NOT_GIVEN,
        p_crit: Any = NOT_GIVEN,
        name: Optional[str] = None,
    ) -> None:
        values = locals()
        for f in FIELDS:
            object.__setattr__(self, f, _check_field(f, values[f]))
        if name is not None and not isinstance(name, str):
            raise WetboilTypeError(f"Saturation: name must be a string or None, got {type(name).__name__}")
        object.__setattr__(self, "name", name)
        plain = all(isinstance(getattr(self, f), float) for f in FIELDS)
        if not plain:  # NumPy fields must broadcast together (labelled ones broadcast by name)
            arrays = [(f, np.shape(getattr(self, f))) for f in FIELDS if isinstance(getattr(self, f), np.ndarray)]
            try:
                np.broadcast_shapes(*(shape for _, shape in arrays))
            except ValueError:
                from ._errors import WetboilValueError

                described = ", ".join(f"{f} {shape}" for f, shape in arrays)
                raise WetboilValueError(f"Saturation: field shapes do not broadcast: {described}") from None
        object.__setattr__(self, "_scalars", tuple(getattr(self, f) for f in FIELDS) if plain else None)
        if not _COMPUTED.get():  # states that water() and from_coolprop compute are not typed by hand
            _check_unit_slips(self)

    def __setattr__(self, key: str, value: Any) -> None:
        raise AttributeError("Saturation is immutable; use .replace(field=value)")

    def __reduce__(self):
        return (_rebuild, (tuple(getattr(self, f) for f in FIELDS), self.name, self._not_given()))

    def _not_given(self) -> tuple:
        """The fields the constructor was not given: they hold its default, the `NOT_GIVEN` NaN
        object (kept by `replace`, indexing and pickling), which kernels check by identity; a NaN
        the caller passes (math.nan included) is missing data, not "not given"."""
        return tuple(f for f in FIELDS if getattr(self, f) is NOT_GIVEN)

    # -- construction helpers -------------------------------------------------
    def replace(self, **changes: Any) -> "Saturation":
        """A copy with some fields changed."""
        unknown = set(changes) - set(FIELDS) - {"name"}
        if unknown:
            raise WetboilTypeError(f"Saturation.replace: unknown field(s) {sorted(unknown)}; fields are {FIELDS}")
        kw = {f: getattr(self, f) for f in FIELDS}
        kw["name"] = self.name
        kw.update(changes)
        return Saturation(**kw)

    def __getitem__(self, index: Any) -> "Saturation":
        """Select elements of every array field at once (fields stay aligned;
        scalar fields are kept as they are)."""

        def pick(v: Any) -> Any:
            if isinstance(v, float):
                return v
            if hasattr(v, "isel") and isinstance(index, dict):
                return v.isel(index)
            return v[index]

        fields: dict = {f: pick(getattr(self, f)) for f in FIELDS}
        fields["name"] = self.name
        return Saturation(**fields)

    @property
    def shape(self) -> tuple:
        """Broadcast shape of the fields (``()`` for a single state)."""
        return tuple(np.broadcast_shapes(*(np.shape(getattr(self, f)) for f in FIELDS)))

    # -- derived quantities ---------------------------------------------------
    @property
    def delta_rho(self) -> Any:
        """Density difference rho_l - rho_v [kg/m3]."""
        return self.rho_l - self.rho_v

    @property
    def v_lv(self) -> Any:
        """Specific volume change of evaporation 1/rho_v - 1/rho_l [m3/kg]."""
        return 1.0 / self.rho_v - 1.0 / self.rho_l

    @property
    def capillary_length(self) -> Any:
        """Capillary length sqrt(sigma / (g (rho_l - rho_v))) [m] at standard gravity."""
        return (self.sigma / (9.80665 * (self.rho_l - self.rho_v))) ** 0.5

    @property
    def prandtl_l(self) -> Any:
        """Liquid Prandtl number cp_l mu_l / k_l [-]."""
        return self.cp_l * self.mu_l / self.k_l

    @property
    def reduced_pressure(self) -> Any:
        """p / p_crit [-]."""
        return self.p / self.p_crit

    @property
    def reduced_temperature(self) -> Any:
        """T / T_crit [-]."""
        return self.T / self.T_crit

    # -- conversion -----------------------------------------------------------
    def to_dict(self) -> dict:
        """The fields as a dict (plus "name")."""
        d = {f: getattr(self, f) for f in FIELDS}
        d["name"] = self.name
        return d

    def to_xarray(self, dim: str = "state") -> Any:
        """The state as an `xarray.Dataset` with units in each variable's attrs.
        NumPy fields of one dimension become variables along `dim`."""
        import xarray as xr

        shape = self.shape
        data = {}
        for f in FIELDS:
            v = getattr(self, f)
            if not hasattr(v, "dims"):
                v = np.broadcast_to(np.asarray(v, dtype=float), shape)
                dims = [dim] if len(shape) == 1 else [f"{dim}_{i}" for i in range(len(shape))]
                v = xr.DataArray(v, dims=dims)
            data[f] = v.assign_attrs(units=UNITS[f], long_name=_DESCRIPTIONS[f])
        return xr.Dataset(data, attrs={"fluid": self.name or ""})

    def to_dataframe(self) -> Any:
        """The state as a `pandas.DataFrame`, one row per state point, units in
        the column names."""
        import pandas as pd

        shape = self.shape
        cols = {
            f"{f} [{UNITS[f]}]": np.broadcast_to(np.asarray(getattr(self, f), dtype=float), shape).ravel()
            for f in FIELDS
        }
        return pd.DataFrame(cols)

    def __repr__(self) -> str:
        head = f"Saturation({self.name!r}" if self.name else "Saturation("
        parts = []
        for f in FIELDS:
            v = getattr(self, f)
            if isinstance(v, float):
                if math.isnan(v):
                    continue
                parts.append(f"{f}={v:.6g}")
            else:
                parts.append(f"{f}=<{type(v).__name__} shape {np.shape(v)}>")
        sep = ", " if self.name else ""
        return head + sep + ", ".join(parts) + ")"


#: Set while water() and from_coolprop build their states: values computed from a property library are
#: in SI by construction, and the unit-slip check would read each array field once more for nothing.
_COMPUTED: "contextvars.ContextVar[bool]" = contextvars.ContextVar("wetboil_computed_state", default=False)


def _computed_state(*args: Any, **kwargs: Any) -> "Saturation":
    """`Saturation(*args, **kwargs)` for a state computed by a property library (no unit-slip check)."""
    token = _COMPUTED.set(True)
    try:
        return Saturation(*args, **kwargs)
    finally:
        _COMPUTED.reset(token)


#: Values of a hand-built state that the usual data-sheet units give and no fluid boiled in practice has
#: (field, bound in SI, above the bound?, the unit slip, the SI unit). Bounds checked against CoolProp 8's
#: pure fluids from 1 % above the triple point to 0.99 T_crit: the smallest h_lv is helium's 7.0 kJ/kg at
#: 0.99 T_crit (the next, neon, 21 kJ/kg), the smallest c_p xenon's (339 J/(kg K) liquid, 174 vapour); the
#: largest liquid viscosity is ethanol's 0.125 Pa s at its triple point (tests/test_water.py). A latent
#: heat in kJ/kg (J/g, as data sheets of dielectric coolants print it) is 1000 times too small, and with it
#: every CHF; a heat capacity in kJ/(kg K), or a viscosity in mPa s (cP), is 1000 times off.
_UNIT_SLIPS = (
    ("h_lv", 5e3, False, "kJ/kg (J/g)", "J/kg"),
    ("cp_l", 50.0, False, "kJ/(kg K) (J/(g K))", "J/(kg K)"),
    ("cp_v", 50.0, False, "kJ/(kg K) (J/(g K))", "J/(kg K)"),
    ("mu_l", 0.2, True, "mPa s (cP)", "Pa s"),
)


def _check_unit_slips(s: "Saturation") -> None:
    """Warn (`WetboilWarning`) about fields of `s` that look typed in a data sheet's unit instead of SI
    (see `_UNIT_SLIPS`). Plain numbers and NumPy arrays are checked; labelled and lazy fields are not.
    A latent heat within 1 % of the critical temperature (where it tends to zero) is not flagged when
    ``T_crit`` is given."""
    slips = []
    if s._scalars is not None:  # plain numbers: a few comparisons (NaN compares False: not flagged)
        near_critical = s.T >= 0.99 * s.T_crit
        for field, bound, above, unit, si in _UNIT_SLIPS:
            v = getattr(s, field)
            if (bound < v < math.inf) if above else (0.0 < v < bound and not (field == "h_lv" and near_critical)):
                slips.append(_slip_text(field, v, bound, above, unit, si))
    else:
        near: Any = False
        if isinstance(s.T, (float, np.ndarray)) and isinstance(s.T_crit, (float, np.ndarray)):
            with np.errstate(invalid="ignore"):
                near = np.asarray(s.T) >= 0.99 * np.asarray(s.T_crit)
        for field, bound, above, unit, si in _UNIT_SLIPS:
            v = getattr(s, field)
            if not isinstance(v, (float, np.ndarray)):
                continue
            a = np.asarray(v)
            # one pass without temporaries first (NaN skipped); most arrays stop here
            if (np.fmax.reduce(a, axis=None, initial=-math.inf) <= bound if above
                    else np.fmin.reduce(a, axis=None, initial=math.inf) >= bound):
                continue
            with np.errstate(invalid="ignore"):
                hit = (a > bound) & np.isfinite(a) if above else (a > 0.0) & (a < bound)
                if field == "h_lv":
                    hit = hit & ~near
            if np.any(hit):
                slips.append(_slip_text(field, float(np.broadcast_to(a, np.shape(hit))[hit][0]), bound, above, unit, si))
    if slips:
        from ._errors import WetboilWarning, _warn

        _warn(f"fluids.Saturation{'' if s.name is None else f' {s.name!r}'}: {'; '.join(slips)} Fields are in "
              "SI units (wetboil.fluids.UNITS); a value 1000 times off moves every result that uses it",
              WetboilWarning)


def _slip_text(field: str, value: float, bound: float, above: bool, unit: str, si: str) -> str:
    return f"{field} = {value:g} {si} is {'above' if above else 'below'} {bound:g} {si}: was it given in {unit}?"


def _rebuild(values: tuple, name: Optional[str], not_given: tuple = ()) -> Saturation:
    kw: dict = dict(zip(FIELDS, values))
    kw.update(dict.fromkeys(not_given, NOT_GIVEN))  # "not given" is this very NaN; unpickling made new ones
    kw["name"] = name
    return Saturation(**kw)


# ---------------------------------------------------------------------------
# Built-in water (Rust, IAPWS releases)

#: Molar mass of water [kg/mol] (IAPWS R6-95(2018)).
WATER_MOLAR_MASS = 0.018015268
#: Critical temperature [K] and pressure [Pa] of water (IAPWS R6-95(2018)).
WATER_T_CRIT = 647.096
WATER_P_CRIT = 22.064e6
#: Triple-point temperature [K] and pressure [Pa] of water (IAPWS R14-08(2011)). The saturation line
#: (SR1-86) gives 611.65707 Pa at 273.16 K; `water` gives the triple-point state from 611.657 Pa up to it.
WATER_T_TRIPLE = 273.16
WATER_P_TRIPLE = 611.657

#: Names that mark a state as water (any case; CoolProp's aliases of water included), for the
#: correlations with a water constant or for water only.
WATER_NAMES = ("water", "h2o", "r718")


def _is_water(name: Any) -> bool:
    """Whether a state's `name` says water (see `WATER_NAMES`)."""
    return isinstance(name, str) and name.strip().lower() in WATER_NAMES


def _water_state(T: Any, p: Any, rho_l: Any, rho_v: Any, h_lv: Any, sigma: Any, cp_l: Any, k_l: Any,
                 mu_l: Any, mu_v: Any, cp_v: Any, k_v: Any) -> Saturation:
    if type(T) is float:  # the scalar fast path hands over twelve Python floats
        return _scalar_state((T, p, rho_l, rho_v, h_lv, sigma, cp_l, k_l, mu_l, mu_v, cp_v, k_v,
                              WATER_MOLAR_MASS, WATER_T_CRIT, WATER_P_CRIT), "water")
    return _computed_state(T, p, rho_l, rho_v, h_lv, sigma, cp_l, k_l, mu_l, mu_v, cp_v, k_v,
                           WATER_MOLAR_MASS, WATER_T_CRIT, WATER_P_CRIT, name="water")


#: The slots' own setters, in FIELDS order (a frozen class: its __setattr__ refuses).
_SETTERS = tuple(vars(Saturation)[f].__set__ for f in FIELDS)
_SET_NAME = vars(Saturation)["name"].__set__
_SET_SCALARS = vars(Saturation)["_scalars"].__set__


def _scalar_state(values: tuple, name: Optional[str]) -> Saturation:
    """A Saturation from 15 Python floats in FIELDS order, without the checks
    of the constructor (for values produced by our own kernels)."""
    s = Saturation.__new__(Saturation)
    for setter, v in zip(_SETTERS, values):
        setter(s, v)
    _SET_NAME(s, name)
    _SET_SCALARS(s, values)
    return s


from ._api import kernel as _kernel  # noqa: E402  (fluids is imported by _api lazily)


@_kernel("water_saturation_t", result=_water_state)
def water_at_temperature(T: Any) -> Saturation:
    """Saturated water and steam at temperature `T` [K]; see `water`."""
    raise NotImplementedError  # pragma: no cover  (replaced by the Rust kernel)


@_kernel("water_saturation_p", result=_water_state)
def water_at_pressure(p: Any) -> Saturation:
    """Saturated water and steam at pressure `p` [Pa]; see `water`."""
    raise NotImplementedError  # pragma: no cover  (replaced by the Rust kernel)


def water(T: Any = None, p: Any = None) -> Saturation:
    r"""Saturated water and steam at temperature `T` [K] or pressure `p` [Pa].

    Computed in Rust from the IAPWS releases, with nothing else installed:

    * saturation line :math:`p_\sigma(T)`: IAPWS SR1-86(1992) (Wagner and
      Pruss 1993), inverted to machine precision for the pressure route;
    * densities, latent heat and heat capacities: IAPWS-95 (R6-95(2018)) at
      the saturated states (both phases moved onto IAPWS-95 at
      :math:`(T, p_\sigma)`);
    * surface tension: IAPWS R1-76(2014);
    * viscosity: IAPWS R12-08 (2008), with its critical enhancement;
    * thermal conductivity: IAPWS R15-11 (2011), with its critical
      enhancement.

    The nine density, enthalpy, heat-capacity and transport fields are read
    from piecewise Chebyshev interpolants of that direct evaluation, built in
    Rust once per process on first use (about 3 ms); they reproduce it to
    1e-12 relative or better up to 633 K, 1e-10 up to 646 K and to its own
    rounding scatter (at most 1e-6) in the last kelvin below T_crit. T, p and
    sigma are evaluated from their closed forms. In arrays a state costs about
    0.08 us of one core (pressure route, with its exact inversion: about
    0.11 us), against tens of microseconds through CoolProp.

    Parameters
    ----------
    T : array_like, optional
        Saturation temperature [K], 273.16 K (triple point) to 647.096 K
        (critical point).
    p : array_like, optional
        Saturation pressure [Pa], 611.657 Pa (triple point, IAPWS R14-08)
        to 22.064 MPa (critical point).

        Give exactly one of `T` and `p`; numbers, arrays, DataArrays and
        dask arrays broadcast as everywhere else.

    Returns
    -------
    Saturation
        Every field filled (``T, p, rho_l, rho_v, h_lv, sigma, cp_l, k_l, mu_l,
        mu_v, cp_v, k_v, molar_mass, T_crit, p_crit``), ``name="water"``.

    Notes
    -----
    Accuracy against IAPWS-95 (CoolProp 8 and iapws 1.5, 275 K to 0.97
    T_crit), from `T`: p 7e-5, rho_l 3e-6, rho_v 7e-5, h_lv 2e-5, cp_l 1.4e-5,
    k_l 1.5e-6, mu_l 3.3e-6, cp_v 1.2e-4, k_v 6e-5, mu_v 7e-6 relative at
    worst; sigma reproduces the R1-76 table. From `p`, the SR1-86 saturation
    line places T_sat within 1.1 mK of the IAPWS-95 phase equilibrium (worst
    near 285 K), and the liquid fields follow that offset: rho_l 8e-6, rho_v
    1.7e-5, h_lv 6e-6, cp_l 3.7e-5, k_l 4.4e-6, mu_l 3.1e-5, cp_v 8.8e-5,
    k_v 4e-5, mu_v 3.6e-6 relative at worst against CoolProp's state at the
    same pressure. Close to the critical point the residual
    difference between the SR1-86 saturation line and the IAPWS-95 phase
    equilibrium is amplified by the diverging compressibility. From 0.97 to
    0.997 T_crit (627.7 to 645.15 K) the worst errors against CoolProp 8 grow
    to cp_v 6e-3, cp_l 3.5e-3 (4.3e-3 from `p`), k_v 2.2e-3, h_lv 5.8e-4, k_l
    5.1e-4 (6.1e-4 from `p`), rho_v 4.7e-4 and below 3.1e-4 for the others,
    and T_sat from `p` to 2.4 mK (worst near 640 K, 20.4 MPa), unflagged;
    above 0.997 T_crit (21.55 MPa) cp, k, h_lv and the densities degrade
    past 0.1-1 %, and those elements are flagged with `RangeWarning`: from
    645.15 to 646.1 K cp_v 1.8e-2, cp_l 1.4e-2, k_v 6.4e-3, k_l 2.5e-3, h_lv
    1.5e-3; in the last kelvin below T_crit, cp_v up to 21 %, cp_l 17 %, k_v
    9.5 %, k_l 7 %, mu_v 1 %, rho_l, rho_v and h_lv 0.3 % (from `T` and from
    `p`; CoolProp 8 and iapws 1.5 agree with each other there [D]). At exactly T_crit, rho_l = rho_v, h_lv = sigma = 0 and cp,
    k, mu are infinite. Outside the triple-to-critical range: NaN and
    `InvalidValueWarning`.

    References
    ----------
    .. [1] IAPWS SR1-86(1992); W. Wagner, A. Pruss, J. Phys. Chem. Ref. Data 22
       (1993) 783-787, doi:10.1063/1.555926.
    .. [2] IAPWS R6-95(2018); W. Wagner, A. Pruss, J. Phys. Chem. Ref. Data 31
       (2002) 387-535, doi:10.1063/1.1461829.
    .. [3] IAPWS R1-76(2014), surface tension of ordinary water substance.
    .. [4] IAPWS R12-08; M.L. Huber et al., J. Phys. Chem. Ref. Data 38 (2009)
       101-125, doi:10.1063/1.3088050.
    .. [5] IAPWS R15-11; M.L. Huber et al., J. Phys. Chem. Ref. Data 41 (2012)
       033102, doi:10.1063/1.4738955.

    Examples
    --------
    >>> from wetboil.fluids import water
    >>> w = water(p=101325.0)
    >>> round(w.T, 3), round(w.sigma * 1e3, 2), round(w.h_lv / 1e3, 1)
    (373.124, 58.92, 2256.5)
    >>> water(T=[300.0, 400.0, 500.0]).p.round(-1)
    array([   3540.,  245770., 2639220.])
    """
    if (T is None) == (p is None):
        raise WetboilValueError("water: give exactly one of T [K] or p [Pa]")
    return water_at_temperature(T) if p is None else water_at_pressure(p)


_NO_MODEL: dict = {}  # fluid name -> _coolprop_no_model's answer (idempotent, so a race only recomputes)


def _coolprop_no_model(name: str) -> frozenset:
    """The fields CoolProp has no model for in fluid `name`, as CoolProp itself
    says when asked at a reference state ("... model is not available for
    this fluid", "surface tension curve not provided"): unlike a model that
    fails at some states only (a surface tension close to the critical point,
    a transport model whose solver does not converge there)."""
    hit = _NO_MODEL.get(name)
    if hit is None:
        hit = _NO_MODEL[name] = _probe_no_model(name)
    return hit


def _probe_no_model(name: str) -> frozenset:
    import CoolProp.CoolProp as CP

    missing: set = set()
    try:
        state = CP.AbstractState("HEOS", name)
        t_ref = state.Ttriple() + 0.5 * (state.T_critical() - state.Ttriple())
        for q, fields in ((0.0, (("cp_l", state.cpmass), ("k_l", state.conductivity), ("mu_l", state.viscosity),
                                 ("sigma", state.surface_tension))),
                          (1.0, (("cp_v", state.cpmass), ("k_v", state.conductivity), ("mu_v", state.viscosity)))):
            state.update(CP.QT_INPUTS, q, t_ref)
            for field, call in fields:
                try:
                    call()
                except ValueError as exc:
                    if "not available" in str(exc) or "not provided" in str(exc):
                        missing.add(field)
    except ValueError:
        pass  # no reference state: nothing is known to be missing, the data decide
    return frozenset(missing)


def _coolprop_fluid(name: str) -> str:
    """The pure-fluid name in a CoolProp fluid string: ``"HEOS::Water"`` is
    ``"Water"`` (HEOS is the backend used); other backends and mixtures are
    refused with the reason."""
    from ._errors import WetboilValueError

    backend, sep, fluid = name.rpartition("::")
    if sep and backend.strip().upper() != "HEOS":
        raise WetboilValueError(f"from_coolprop: {name!r}: only CoolProp's HEOS backend (its reference equations of "
                                f"state) is used; give the fluid name alone, e.g. {fluid.strip()!r}")
    fluid = fluid.strip()
    if not fluid:
        raise WetboilValueError(f"from_coolprop: {name!r} names no fluid; give one, e.g. 'Water' or 'HEOS::Water'")
    if "&" in fluid or "[" in fluid:
        raise WetboilValueError(f"from_coolprop: {name!r} is a mixture: its boiling has a temperature glide and no "
                                "single saturated state; give a pure fluid (or build a Saturation from your own "
                                "bubble-point properties)")
    return fluid


#: Fields the caller sets itself right after `from_coolprop` (sweep's `fluid_properties`): no warning
#: that CoolProp lacks them. A context variable, so threads and tasks each keep their own.
_SUPPLIED: "contextvars.ContextVar[frozenset]" = contextvars.ContextVar("wetboil_supplied_fields", default=frozenset())


def from_coolprop(name: str, T: Any = None, p: Any = None) -> Saturation:
    """Saturated state of any fluid CoolProp knows, at `T` [K] or `p` [Pa].

    Parameters
    ----------
    name : str
        CoolProp fluid name ("Water", "R134a", "Novec649", "n-Pentane", ...),
        also with CoolProp's ``"HEOS::"`` backend prefix (the backend used);
        other backends, mixtures and CoolProp's predefined blends (R407C,
        R410A, Air...) raise `WetboilValueError`.
    T, p : array_like, optional
        Exactly one of saturation temperature [K] or pressure [Pa]. Numbers,
        arrays and DataArrays (labels kept).

    Returns
    -------
    Saturation
        All fields that CoolProp provides for the fluid (properties without a
        CoolProp model, often surface tension or transport properties of less
        common fluids, are NaN), ``name`` set to `name`.

    Notes
    -----
    Needs the optional CoolProp package: ``pip install "wetboil[coolprop]"``.
    CoolProp is called once per state point in a Python loop (its HEOS
    backend, about 20-50 us per point for all fields), so a 10^4-point array
    takes about a second; use `water` for water, which is computed in Rust
    about 100 times faster. States outside triple point to critical point give
    NaN and `InvalidValueWarning`. CoolProp's surface tension of water is its
    own fit, not IAPWS R1-76; against R1-76 it is 0.1 % high near 300 K,
    about 1 % low from 550 to 600 K (5.5-10 MPa), and 4 % high at 645 K,
    7 % at 646.5 K [D, CoolProp 8.0 against the R1-76 equation]. Where
    CoolProp's surface-tension fit gives zero or less below the critical
    point (methane above 0.99904 T_crit in CoolProp 8), ``sigma`` is NaN,
    as where CoolProp gives no value: one `WetboilWarning` names it, and a
    sweep flags those points ``fluid_state``.

    Examples
    --------
    >>> from wetboil.fluids import from_coolprop
    >>> r = from_coolprop("R134a", T=273.15)
    >>> round(r.p / 1e3, 1), r.name
    (292.8, 'R134a')
    """
    from ._errors import WetboilTypeError, WetboilValueError, WetboilWarning, _warn, report

    try:
        import CoolProp.CoolProp as CP
    except ImportError:
        raise ImportError(
            "wetboil.fluids.from_coolprop needs CoolProp: pip install \"wetboil[coolprop]\" (or pip install CoolProp)"
        ) from None
    if not isinstance(name, str):
        raise WetboilTypeError(f"from_coolprop: name must be a string, got {type(name).__name__}")
    name = _coolprop_fluid(name)
    if (T is None) == (p is None):
        raise WetboilValueError("from_coolprop: give exactly one of T [K] or p [Pa]")
    given = T if p is None else p
    try:
        state = CP.AbstractState("HEOS", name)
        pure = CP.get_fluid_param_string(name, "pure")
    except ValueError as exc:
        raise WetboilValueError(f"from_coolprop: CoolProp does not know the fluid {name!r} ({exc})") from None
    if pure != "true":
        # a predefined blend (R407C, R410A, Air...), which CoolProp models as pseudo-pure with a bubble and
        # a dew line: the liquid at the bubble point and the vapour at the dew point of the same
        # temperature are at two pressures, so h_lv and rho_v would belong to no state
        try:
            glide = (f" ({CP.PropsSI('T', 'P', 101325.0, 'Q', 1, name) - CP.PropsSI('T', 'P', 101325.0, 'Q', 0, name):.2g} K "
                     "at 1 atm)")
        except ValueError:
            glide = ""
        raise WetboilValueError(f"from_coolprop: {name!r} is a blend: its boiling has a temperature glide{glide} and no "
                                "single saturated state; give a pure fluid (or build a Saturation from your own "
                                "bubble-point properties)")
    template = given if hasattr(given, "dims") else None
    if isinstance(given, (str, bytes)) or given is None or isinstance(given, bool):
        raise WetboilTypeError(f"from_coolprop: {'T' if p is None else 'p'} must be a number or an array of numbers")
    try:
        raw = np.asarray(given.values if template is not None else given)
    except (TypeError, ValueError) as exc:
        raise WetboilValueError(f"from_coolprop: {'T' if p is None else 'p'} is not a rectangular array of numbers ({exc})") from None
    if raw.dtype.kind not in "fiu" and not (raw.dtype.kind == "O" and not any(v is None for v in raw.flat)):
        raise WetboilTypeError(f"from_coolprop: {'T' if p is None else 'p'} must hold real numbers")
    try:
        values = raw.astype(np.float64)
    except (TypeError, ValueError):
        raise WetboilTypeError(f"from_coolprop: {'T' if p is None else 'p'} must hold real numbers") from None
    t_trip, t_crit = state.Ttriple(), state.T_critical()
    p_crit = state.p_critical()
    try:
        state.update(CP.QT_INPUTS, 0.0, t_trip)
        p_trip = state.p()
    except ValueError:
        p_trip = 0.0
    lo, hi = (t_trip, t_crit) if p is None else (p_trip, p_crit)
    out = {f: np.full(values.shape, math.nan) for f in FIELDS[:12]}
    invalid = 0
    key = CP.QT_INPUTS if p is None else CP.PQ_INPUTS

    def read(call: Any) -> float:
        try:
            return float(call())
        except ValueError:
            return math.nan

    for idx, v in np.ndenumerate(values):
        if math.isnan(v):
            continue
        if not (lo <= v < hi):
            invalid += 1
            continue
        try:
            if p is None:
                state.update(key, 0.0, v)
            else:
                state.update(key, v, 0.0)
        except ValueError:
            invalid += 1
            continue
        T_s, p_s = state.T(), state.p()
        out["T"][idx], out["p"][idx] = T_s, p_s
        out["rho_l"][idx], h_l = state.rhomass(), state.hmass()
        out["cp_l"][idx] = read(state.cpmass)
        out["k_l"][idx] = read(state.conductivity)
        out["mu_l"][idx] = read(state.viscosity)
        # CoolProp's surface-tension fit can cross zero just below its critical temperature (methane
        # above 0.99904 T_crit, CoolProp 8): a saturated liquid below T_crit has sigma > 0, so a
        # value <= 0 is the fit's, not the fluid's; it is "no value" (warned and flagged as such
        # below), not an impossible input for every kernel downstream
        sig = read(state.surface_tension)
        out["sigma"][idx] = sig if sig > 0.0 else math.nan
        state.update(CP.QT_INPUTS, 1.0, T_s)
        out["rho_v"][idx], h_v = state.rhomass(), state.hmass()
        out["h_lv"][idx] = h_v - h_l
        out["cp_v"][idx] = read(state.cpmass)
        out["k_v"][idx] = read(state.conductivity)
        out["mu_v"][idx] = read(state.viscosity)
    if invalid:
        # say where the saturated states are: a temperature in degC or a pressure in bar is the usual cause
        span = (f"T from {t_trip:.6g} K to {t_crit:.6g} K" if p is None
                else f"p from {p_trip:.6g} Pa to {p_crit:.6g} Pa")
        report(f"fluids.from_coolprop ({name!r} has saturated states at {span} only, from the lowest state "
               "of CoolProp's equation (the triple point; helium's lambda point) to the critical point)",
               values.size, invalid, 0)
    # properties CoolProp has no model for (often surface tension or transport properties of less
    # common fluids): say so once here, or every kernel that needs them gives a silent NaN
    have_state = ~np.isnan(out["T"])
    absent: list = []
    if have_state.any():
        supplied = _SUPPLIED.get()
        absent = [f for f in FIELDS[:12] if np.isnan(out[f][have_state]).all()]
        no_model = [f for f in absent if f in _coolprop_no_model(name)]
        if set(no_model) - supplied:
            _warn(f"fluids.from_coolprop: CoolProp has no {', '.join(f for f in no_model if f not in supplied)} "
                  f"for {name!r}: NaN in those fields, and in every result that needs them (set them with "
                  f".replace(), or give them to sweep or screen as fluid_properties)", WetboilWarning)
        # a model that fails at some states only (surface tension close to the critical point, say)
        gaps = {f: int(np.isnan(out[f][have_state]).sum()) for f in FIELDS[:12]
                if f not in no_model and f not in supplied}
        gaps = {f: k for f, k in gaps.items() if k}
        if gaps:
            n_state = int(have_state.sum())
            _warn(f"fluids.from_coolprop: CoolProp gave no "
                  f"{', '.join(f'{f} at {k} of {n_state}' for f, k in gaps.items())} saturated state(s) of "
                  f"{name!r}: NaN there, and in every result that needs them", WetboilWarning)
    fields: dict = {}
    for f in FIELDS[:12]:
        v = out[f]
        if template is not None:
            # the labels of `given`, not its attrs (its units are those of T or p)
            v = template.copy(data=v).rename(f)
            v.attrs = {"units": UNITS[f]}
        elif v.ndim == 0:
            v = NOT_GIVEN if f in absent else float(v)  # a kernel needing it then says so (see Saturation)
        fields[f] = v
    return _computed_state(**fields, molar_mass=state.molar_mass(), T_crit=t_crit, p_crit=p_crit, name=name)
