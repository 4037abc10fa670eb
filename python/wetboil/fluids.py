"""Fluid states: the saturated properties every kernel reads.

`Saturation` bundles the properties of a saturated liquid and its vapour so
that no public function takes ten loose property arguments. Its fields may be
plain numbers, NumPy arrays or xarray DataArrays; they broadcast against each
other and against the other arguments of the kernels.
"""

from __future__ import annotations

import math
from numbers import Real
from typing import Any, Optional

import numpy as np

from ._errors import WetboilTypeError

__all__ = ["Saturation", "FIELDS"]

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
        return float(value)
    if value is None or isinstance(value, (str, bytes, bool, np.bool_, complex)):
        raise WetboilTypeError(f"Saturation: {name} must be a number or an array of numbers, got {type(value).__name__}")
    if hasattr(value, "dims") or type(value).__module__.startswith("dask"):
        return value  # xarray / dask objects keep their labels and laziness
    arr = np.asarray(value)
    if arr.dtype.kind not in "fiu":
        if arr.dtype.kind == "O":
            try:
                return arr.astype(np.float64)
            except (TypeError, ValueError):
                pass
        raise WetboilTypeError(f"Saturation: {name} must hold real numbers, got dtype {arr.dtype}")
    return arr.astype(np.float64, copy=False) if arr.ndim else float(arr)


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
    Missing optional properties are NaN; a kernel that needs one returns NaN.
    Physically impossible values (``rho_l <= rho_v``, ``sigma <= 0``...) are
    not rejected here: the kernels turn those elements into NaN and warn
    (see `wetboil.errstate`). Wrong types raise `TypeError` at once.

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
        cp_l: Any = math.nan,
        k_l: Any = math.nan,
        mu_l: Any = math.nan,
        mu_v: Any = math.nan,
        cp_v: Any = math.nan,
        k_v: Any = math.nan,
        molar_mass: Any = math.nan,
        T_crit: Any = math.nan,
        p_crit: Any = math.nan,
        name: Optional[str] = None,
    ) -> None:
        values = locals()
        for f in FIELDS:
            object.__setattr__(self, f, _check_field(f, values[f]))
        if name is not None and not isinstance(name, str):
            raise WetboilTypeError(f"Saturation: name must be a string or None, got {type(name).__name__}")
        object.__setattr__(self, "name", name)
        plain = all(isinstance(getattr(self, f), float) for f in FIELDS)
        object.__setattr__(self, "_scalars", tuple(getattr(self, f) for f in FIELDS) if plain else None)

    def __setattr__(self, key: str, value: Any) -> None:
        raise AttributeError("Saturation is immutable; use .replace(field=value)")

    def __reduce__(self):
        return (_rebuild, (tuple(getattr(self, f) for f in FIELDS), self.name))

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


def _rebuild(values: tuple, name: Optional[str]) -> Saturation:
    kw: dict = dict(zip(FIELDS, values))
    kw["name"] = name
    return Saturation(**kw)
