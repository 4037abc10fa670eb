"""Pool boiling: nucleate boiling, heat-flux partitioning and whole boiling curves.

Nucleate boiling: `rohsenow` and `cooper` (heat flux from wall superheat) and
their inverses `rohsenow_superheat` and `cooper_superheat`; the Rohsenow
surface-liquid constants with their sources in `SURFACE_CONSTANTS` and
`surface_constant`. Wall heat-flux partitioning: `partition` (Kurul &
Podowski), whose site-density, departure and frequency closures are chosen by
name from `wetboil.nucleation` and `wetboil.departure`, so that the contact
angle enters through them. Other branches: `natural_convection` (before
onset) and `film_boiling` (Bromley / Berenson form). `curve` assembles the
whole pool-boiling curve of a described surface with its CHF margin.

.. warning::
   Boiling curves and critical heat flux carry correlation uncertainty of
   tens of percent (Rohsenow: +-100 % in flux at a given superheat). Use them
   inside their validity ranges, keep a margin to the critical heat flux, and
   follow the codes and licensed engineering practice that govern your
   application.

Verification tags in the docstrings: [V] seen in the original; [V2] seen
only in a secondary source; [M] from memory; [D] derived here.
"""

from __future__ import annotations

import math
from typing import Any, Callable, Dict, NamedTuple, Optional, Tuple

import numpy as np

from . import chf as _chf
from ._api import check_choice, dispatch, kernel, need_saturation
from ._errors import (WetboilTypeError, WetboilValueError, WetboilWarning, _warn, errstate,
                      one_warning_per_category, report)
from .fluids import Saturation, _is_water

__all__ = [
    "rohsenow",
    "rohsenow_superheat",
    "rohsenow_exponent",
    "cooper",
    "cooper_superheat",
    "SURFACE_CONSTANTS",
    "SurfaceConstant",
    "surface_constant",
    "natural_convection",
    "NATURAL_CONVECTION_GEOMETRIES",
    "film_boiling",
    "FILM_GEOMETRIES",
    "partition",
    "Partition",
    "SITE_DENSITY_CLOSURES",
    "DEPARTURE_CLOSURES",
    "AREA_FACTORS",
    "curve",
    "BoilingCurve",
    "NUCLEATE_METHODS",
    "CHF_METHODS",
]

G = 9.80665






# --------------------------------------------------------------------------- Rohsenow

#: Rohsenow's Prandtl exponent for water and for other liquids [-].
ROHSENOW_N_WATER = 1.0
ROHSENOW_N_OTHER = 1.7


def rohsenow_exponent(fluid: Any) -> float:
    """Rohsenow's Prandtl exponent for a fluid when the surface-liquid pair
    has no fitted one: 1.0 for water, 1.7 for every other liquid.

    Parameters
    ----------
    fluid : Saturation
        A saturated state; its ``name`` says whether it is water (any name
        in `wetboil.fluids.WATER_NAMES`).

    Returns
    -------
    float
        1.0 or 1.7. An unnamed state gets 1.7, the value for liquids other
        than water; `rohsenow` and `rohsenow_superheat` warn when they take
        it for an unnamed state.

    Notes
    -----
    Rohsenow (1952) correlated every liquid with 1.7 [M]; the constants for
    water were later tabulated with 1.0 (Vachon, Nix & Tanger 1968 [M]), and
    the tabulated surface-liquid constants (`SURFACE_CONSTANTS`) carry 1.0
    for water and 1.7 for every other liquid [V2]. This rule is common
    practice. Like C_sf, n is a property of the surface-liquid pair
    (Vachon et al. fitted both per pair): a fitted (C_sf, n) pair always
    takes precedence.

    References
    ----------
    .. [1] W.M. Rohsenow, Trans. ASME 74 (1952) 969-976.
    .. [2] R.I. Vachon, G.H. Nix, G.E. Tanger, "Evaluation of constants for
       the Rohsenow pool-boiling correlation", J. Heat Transfer 90 (1968)
       239-247.

    Examples
    --------
    >>> from wetboil.boiling import rohsenow_exponent
    >>> from wetboil.fluids import water
    >>> w = water(p=101325.0)
    >>> rohsenow_exponent(w), rohsenow_exponent(w.replace(name="R134a"))
    (1.0, 1.7)
    """
    if not isinstance(fluid, Saturation):
        raise WetboilTypeError(f"boiling.rohsenow_exponent: fluid must be a Saturation, got {type(fluid).__name__}")
    return ROHSENOW_N_WATER if _is_water(fluid.name) else ROHSENOW_N_OTHER


def _default_exponent(fluid: Saturation, function: str) -> float:
    """`rohsenow_exponent` of a state, with a warning when the state has no
    name (the choice of exponent then rests on an assumption)."""
    if fluid.name is None:
        _warn(
            f"{function}: the fluid state has no name, so Rohsenow's n = 1.7 (his value for liquids other than "
            "water) was used; pass n=1.0 for water, or name the state (Saturation(..., name=...))", WetboilWarning)
    return rohsenow_exponent(fluid)


#: Rohsenow's C_sf where none is given: water on polished copper (`SURFACE_CONSTANTS`).
ROHSENOW_C_SF_DEFAULT = 0.013


def _default_constant(fluid: Saturation, function: str) -> float:
    """`ROHSENOW_C_SF_DEFAULT`, with a warning when the fluid is not water
    (the constant belongs to a surface-liquid pair)."""
    if not _is_water(fluid.name):
        _warn(
            f"{function}: no C_sf given, so 0.013 (water on polished copper) was used for "
            f"{repr(fluid.name) if fluid.name is not None else 'an unnamed fluid'}; Rohsenow's C_sf belongs to the surface-liquid pair and the "
            "superheat is proportional to it: give the constant of your pair (see boiling.SURFACE_CONSTANTS)", WetboilWarning)
    return ROHSENOW_C_SF_DEFAULT


def _rohsenow_fill(function: str) -> Callable[[Tuple[Any, ...]], Tuple[Any, ...]]:
    """Rohsenow's constant and exponent by fluid where a call of `function`
    leaves ``C_sf`` or ``n`` out."""

    def fill(args: Tuple[Any, ...]) -> Tuple[Any, ...]:
        x, fluid, C_sf, n, g = args
        if C_sf is not None and n is not None:
            return args  # nothing to fill: the very tuple, so the caller evaluates it (not a copy: see `kernel`)
        if type(fluid) is Saturation and fluid.name == "water":  # the common call, in a few lookups: nothing to warn
            return (x, fluid, ROHSENOW_C_SF_DEFAULT if C_sf is None else C_sf, ROHSENOW_N_WATER if n is None else n, g)
        need_saturation(function, fluid)  # the defaults come from the fluid: name a wrong one first
        return (x, fluid, _default_constant(fluid, function) if C_sf is None else C_sf,
                _default_exponent(fluid, function) if n is None else n, g)

    return fill


@kernel("rohsenow_heat_flux", fill=_rohsenow_fill("boiling.rohsenow"))
def rohsenow(wall_superheat: Any, fluid: Saturation, C_sf: Any = None, n: Any = None, g: Any = G) -> Any:
    r"""Rohsenow (1952) nucleate pool-boiling heat flux [W/m2].

    .. math::
        q'' = \mu_l h_{lv}\left[\frac{g(\rho_l-\rho_v)}{\sigma}\right]^{1/2}
        \left[\frac{c_{pl}\,\Delta T_e}{C_{sf}\,h_{lv}\,Pr_l^{\,n}}\right]^3

    Parameters
    ----------
    wall_superheat : array_like
        :math:`\Delta T_e = T_w - T_{sat}` [K], >= 0.
    fluid : Saturation
        Saturated state; uses ``h_lv``, ``rho_l``, ``rho_v``, ``sigma``,
        ``cp_l``, ``k_l``, ``mu_l`` (properties of the saturated liquid).
    C_sf : array_like, optional
        Surface-liquid constant [-]; see `SURFACE_CONSTANTS` and
        `surface_constant`. Default 0.013 (water on polished copper), with
        a `WetboilWarning` when the fluid is not water.
    n : array_like, optional
        Prandtl exponent [-]. Default: `rohsenow_exponent` of the fluid,
        1.0 for water and 1.7 for other liquids (an unnamed state gets 1.7
        with a `WetboilWarning`). Give the n fitted with your C_sf.
    g : array_like, optional
        Acceleration [m/s2]; standard gravity by default.

    Returns
    -------
    float, ndarray, DataArray or Series
        Heat flux [W/m2].

    Notes
    -----
    Clean surfaces in saturated nucleate pool boiling, below the critical
    heat flux. The function does not know the CHF of your heater (a thin
    wire's lies well above a flat plate's), so a superheat past it is not
    flagged here: at 25 K water at 1 atm gives about twice Zuber's CHF.
    Compare with the CHF you design to (`curve` and `sweep` do: they end
    the branch there, or flag it). Stated accuracy: +-100 % in flux at a
    given superheat, +-30 % in superheat at a given flux [V2]. Constants
    outside 0.002 <= C_sf <= 0.02 or 0.8 <= n <= 2 (the span of the
    tabulated values) are flagged (`RangeWarning`). The contact angle enters only through C_sf, which is
    fitted per surface-liquid pair. Verification: the form is [V2]
    (textbook restatements; the Incropera et al. 6th ed. Ex. 10.1 value is
    reproduced in the tests); the original was not read.

    References
    ----------
    .. [1] W.M. Rohsenow, "A method of correlating heat-transfer data for
       surface boiling of liquids", Trans. ASME 74 (1952) 969-976.

    Examples
    --------
    Water at 1 atm on polished copper, the inputs of a textbook worked example
    (Incropera et al., Fundamentals of Heat and Mass Transfer, 6th ed., Ex. 10.1):

    >>> from wetboil.fluids import Saturation
    >>> from wetboil.boiling import rohsenow
    >>> w = Saturation(T=373.15, p=101325.0, rho_l=957.9, rho_v=0.5955, h_lv=2257e3, sigma=58.9e-3,
    ...                cp_l=4217.0, mu_l=279e-6, k_l=4217.0 * 279e-6 / 1.76, name="water")
    >>> round(rohsenow(18.0, w, C_sf=0.0128, g=9.8) / 1e3)   # kW/m2
    836
    >>> (rohsenow([5.0, 10.0, 20.0], w, C_sf=0.0128, g=9.8) / 1e3).round()
    array([  18.,  143., 1147.])
    """


@kernel("rohsenow_superheat", fill=_rohsenow_fill("boiling.rohsenow_superheat"))
def rohsenow_superheat(heat_flux: Any, fluid: Saturation, C_sf: Any = None, n: Any = None, g: Any = G) -> Any:
    r"""Wall superheat at a nucleate-boiling heat flux, Rohsenow (1952) [K];
    the inverse of `rohsenow`.

    .. math::
        \Delta T_e = \frac{C_{sf}\,h_{lv}\,Pr_l^{\,n}}{c_{pl}}
        \left[\frac{q''}{\mu_l h_{lv}}\sqrt{\frac{\sigma}{g(\rho_l-\rho_v)}}\right]^{1/3}

    Parameters
    ----------
    heat_flux : array_like
        Heat flux [W/m2], >= 0.
    fluid : Saturation
        As for `rohsenow`.
    C_sf, n, g : array_like, optional
        As for `rohsenow`.

    Returns
    -------
    float, ndarray, DataArray or Series
        Wall superheat [K].

    References
    ----------
    .. [1] W.M. Rohsenow, Trans. ASME 74 (1952) 969-976.

    Examples
    --------
    >>> from wetboil.fluids import Saturation
    >>> from wetboil.boiling import rohsenow_superheat
    >>> w = Saturation(T=373.15, p=101325.0, rho_l=957.9, rho_v=0.5955, h_lv=2257e3, sigma=58.9e-3,
    ...                cp_l=4217.0, mu_l=279e-6, k_l=4217.0 * 279e-6 / 1.76, name="water")
    >>> round(rohsenow_superheat(836.1e3, w, C_sf=0.0128, g=9.8), 2)
    18.0
    """


# --------------------------------------------------------------------------- Cooper


@kernel("cooper_heat_flux")
def cooper(wall_superheat: Any, fluid: Saturation, roughness_Rp: Any = 1e-6) -> Any:
    r"""Cooper (1984) nucleate pool-boiling heat flux [W/m2], solved
    explicitly for the flux.

    .. math::
        h = 55\,p_r^{\,0.12-0.2\log_{10}R_p}\,(-\log_{10}p_r)^{-0.55}\,M^{-0.5}\,q''^{\,0.67},
        \qquad q'' = h\,\Delta T \;\Rightarrow\; q'' = (A\,\Delta T)^{1/0.33}

    with :math:`p_r = p/p_{crit}`, **R_p in um and M in kg/kmol** in the
    published (dimensional) form. This function takes SI units and converts
    at the boundary: ``roughness_Rp`` [m] x 1e6, ``fluid.molar_mass``
    [kg/mol] x 1e3.

    Parameters
    ----------
    wall_superheat : array_like
        :math:`T_w - T_{sat}` [K], >= 0.
    fluid : Saturation
        Saturated state; uses ``p``, ``p_crit``, ``molar_mass`` [kg/mol].
        Molar masses outside 0.001-1.5 kg/mol are flagged (`RangeWarning`):
        not a published limit but ours, so that one typed in g/mol is caught.
    roughness_Rp : array_like, optional
        Surface roughness parameter R_p [m] (1 um = 1e-6, Cooper's value
        when unknown). R_p is the old DIN 4762 smoothing depth, not R_a
        [M, med]; where only R_a is measured, R_p of about 2.5 R_a is the
        usual estimate (Gorenflo's R_a = 0.4 R_p, from memory, medium
        confidence; it depends on the finish). Values outside 0.01-20 um
        are flagged (`RangeWarning`): not a published limit but ours, and
        one above 1 mm gets its own message (R_p typed in um).

    Returns
    -------
    float, ndarray, DataArray or Series
        Heat flux [W/m2].

    Notes
    -----
    A reduced-pressure correlation: no surface tension, no contact angle;
    wettability enters only as far as it is reflected in R_p. Validity
    flagged outside 0.001 <= p_r <= 0.9 [M, med], for R_p outside
    0.01-20 um and M outside 0.001-1.5 kg/mol (our bounds, see above). Cooper suggested about
    x1.7 for horizontal copper cylinders [M]; not applied. Verification: the
    form is [V2] (CalebBell/ht, citing Cooper 1984; the handbook value it
    quotes is reproduced in the tests); the original was not read.

    References
    ----------
    .. [1] M.G. Cooper, "Saturation nucleate pool boiling - a simple
       correlation", IChemE Symp. Ser. 86 (1984) 785-793.

    Examples
    --------
    >>> from wetboil.fluids import Saturation
    >>> from wetboil.boiling import cooper
    >>> w = Saturation(T=373.124, p=101325.0, rho_l=958.35, rho_v=0.598, h_lv=2.2564e6, sigma=0.0589,
    ...                molar_mass=18.02e-3, p_crit=22048321.0)
    >>> round(cooper(4.3, w) / 4.3, 1)    # h [W/(m2 K)]
    1558.1
    """


@kernel("cooper_superheat")
def cooper_superheat(heat_flux: Any, fluid: Saturation, roughness_Rp: Any = 1e-6) -> Any:
    r"""Wall superheat at a nucleate-boiling heat flux, Cooper (1984) [K];
    the inverse of `cooper`: :math:`\Delta T = q''^{\,0.33}/A`.

    Parameters
    ----------
    heat_flux : array_like
        Heat flux [W/m2], >= 0.
    fluid : Saturation
        As for `cooper`.
    roughness_Rp : array_like, optional
        As for `cooper` [m].

    Returns
    -------
    float, ndarray, DataArray or Series
        Wall superheat [K].

    References
    ----------
    .. [1] M.G. Cooper, IChemE Symp. Ser. 86 (1984) 785-793.

    Examples
    --------
    >>> from wetboil.fluids import Saturation
    >>> from wetboil.boiling import cooper_superheat
    >>> w = Saturation(T=373.124, p=101325.0, rho_l=958.35, rho_v=0.598, h_lv=2.2564e6, sigma=0.0589,
    ...                molar_mass=18.02e-3, p_crit=22048321.0)
    >>> round(cooper_superheat(1e5, w), 2)   # K at 100 kW/m2
    10.49
    """


# --------------------------------------------------------------------------- C_sf table


class SurfaceConstant(NamedTuple):
    """One Rohsenow surface-liquid constant with where it was seen."""

    liquid: str
    surface: str
    C_sf: float
    n: float
    book: str
    note: str


_CENGEL = "Cengel & Ghajar, Heat and Mass Transfer (McGraw-Hill), Table 10-3"
_INCROPERA = "Incropera, DeWitt, Bergman & Lavine, Fundamentals of Heat and Mass Transfer, 6th ed., Table 10.1"
_KREITH = "Kreith, Manglik & Bohn, Principles of Heat Transfer, 7th ed., Ex. 10.1"

#: Rohsenow constants (C_sf, n) by liquid and surface, each with the book it
#: was seen in (MODELS D1, Q-7). The values go back to Rohsenow (1952) and
#: later compilations (Vachon, Nix & Tanger, J. Heat Transfer 90 (1968)
#: 239-247 [M]); those originals were not read. Where books disagree, both
#: entries are kept: choose with ``book=`` in `surface_constant`.
SURFACE_CONSTANTS: Tuple[SurfaceConstant, ...] = (
    SurfaceConstant("water", "copper, polished", 0.0130, 1.0, _CENGEL, ""),
    SurfaceConstant("water", "copper, polished", 0.0128, 1.0, _INCROPERA, "[M, high]: value of the book's Ex. 10.1"),
    SurfaceConstant("water", "copper, scored", 0.0068, 1.0, _CENGEL, ""),
    SurfaceConstant("water", "stainless steel, mechanically polished", 0.0130, 1.0, _CENGEL, ""),
    SurfaceConstant("water", "stainless steel, mechanically polished", 0.0132, 1.0, _KREITH, "[V2]: transcription of the example"),
    SurfaceConstant("water", "stainless steel, ground and polished", 0.0060, 1.0, _CENGEL,
                    "other tables give 0.0080 for this pair, after Vachon, Nix & Tanger (1968) [from memory, "
                    "original not read], a third higher, and so the superheat at a given heat flux; prefer a C_sf "
                    "fitted to your own surface"),
    SurfaceConstant("water", "stainless steel, PTFE pitted", 0.0058, 1.0, _CENGEL, "tabulated under a trade name"),
    SurfaceConstant("water", "stainless steel, chemically etched", 0.0130, 1.0, _CENGEL, ""),
    SurfaceConstant("water", "brass", 0.0060, 1.0, _CENGEL, ""),
    SurfaceConstant("water", "nickel", 0.0060, 1.0, _CENGEL, "a worked example may use 0.0130 (MODELS Q-10)"),
    SurfaceConstant("water", "platinum", 0.0130, 1.0, _CENGEL, ""),
    SurfaceConstant("n-pentane", "copper, polished", 0.0154, 1.7, _CENGEL, ""),
    SurfaceConstant("n-pentane", "chromium", 0.015, 1.7, _CENGEL, ""),
    SurfaceConstant("ethanol", "chromium", 0.0027, 1.7, _CENGEL, ""),
    SurfaceConstant("carbon tetrachloride", "copper", 0.013, 1.7, _CENGEL, ""),
    SurfaceConstant("isopropanol", "copper", 0.0025, 1.7, _CENGEL, ""),
    SurfaceConstant("benzene", "chromium", 0.0101, 1.7, _CENGEL, "printed as 0.101; 0.0101 assumed [M] (MODELS Q-7)"),
)

_BOOKS = {"cengel": _CENGEL, "incropera": _INCROPERA, "kreith": _KREITH}


def surface_constant(liquid: str, surface: str, book: Optional[str] = None) -> SurfaceConstant:
    """Look up a Rohsenow constant by liquid and surface (case-insensitive).

    Parameters
    ----------
    liquid, surface : str
        As in `SURFACE_CONSTANTS` (e.g. ``"water"``, ``"copper, polished"``).
    book : str, optional
        ``"cengel"``, ``"incropera"`` or ``"kreith"`` where the books
        disagree; by default the first entry (Cengel & Ghajar's table).

    Returns
    -------
    SurfaceConstant
        ``(liquid, surface, C_sf, n, book, note)``.

    Raises
    ------
    WetboilValueError
        Unknown pair or book (the message lists the choices).

    Examples
    --------
    >>> from wetboil.boiling import surface_constant
    >>> surface_constant("water", "copper, polished").C_sf
    0.013
    >>> surface_constant("water", "copper, polished", book="incropera").C_sf
    0.0128
    >>> surface_constant("Water", "Brass")[2:4]
    (0.006, 1.0)
    """
    if not (isinstance(liquid, str) and isinstance(surface, str)):
        raise WetboilTypeError("boiling.surface_constant: liquid and surface must be strings")
    if book is not None:
        check_choice("boiling.surface_constant", "book", book, _BOOKS)
    rows = [r for r in SURFACE_CONSTANTS if r.liquid == liquid.lower() and r.surface == surface.lower()]
    if not rows:
        pairs = sorted({f"{r.liquid} / {r.surface}" for r in SURFACE_CONSTANTS})
        raise WetboilValueError(f"boiling.surface_constant: unknown pair {liquid!r} / {surface!r}; pairs are {'; '.join(pairs)}")
    if book is None:
        return rows[0]
    for r in rows:
        if r.book == _BOOKS[book]:
            return r
    raise WetboilValueError(
        f"boiling.surface_constant: {liquid} / {surface} is not listed from {book!r}; "
        f"listed from: {', '.join(k for k, v in _BOOKS.items() if any(r.book == v for r in rows))}"
    )


# --------------------------------------------------------------------------- natural convection, film boiling


def _lloyd_moran(superheat: Any, fluid: Saturation, length: Any, expansion_coefficient: Any, g: Any) -> Any:
    """Kernel-backed helper of `natural_convection` (a plate)."""


def _churchill_chu(superheat: Any, fluid: Saturation, length: Any, expansion_coefficient: Any, g: Any) -> Any:
    """Kernel-backed helper of `natural_convection` (a horizontal cylinder)."""


def _churchill_sphere(superheat: Any, fluid: Saturation, length: Any, expansion_coefficient: Any, g: Any) -> Any:
    """Kernel-backed helper of `natural_convection` (a sphere)."""


def _churchill_vertical(superheat: Any, fluid: Saturation, length: Any, expansion_coefficient: Any, g: Any) -> Any:
    """Kernel-backed helper of `natural_convection` (a vertical plate)."""


_lloyd_moran.__name__ = _churchill_chu.__name__ = _churchill_sphere.__name__ = "natural_convection"
_churchill_vertical.__name__ = "natural_convection"
_lloyd_moran = kernel("lloyd_moran_natural_convection")(_lloyd_moran)
_churchill_chu = kernel("churchill_chu_natural_convection")(_churchill_chu)
_churchill_sphere = kernel("churchill_sphere_natural_convection")(_churchill_sphere)
_churchill_vertical = kernel("churchill_chu_vertical_plate_natural_convection")(_churchill_vertical)

#: Natural-convection geometries: what `length` is, and the correlation.
NATURAL_CONVECTION_GEOMETRIES: Dict[str, str] = {
    "flat_plate": "area / perimeter of the upper face of a heated horizontal plate (Lloyd & Moran 1974)",
    "vertical_plate": "height of a vertical plate (Churchill & Chu 1975)",
    "cylinder": "diameter of a horizontal cylinder (Churchill & Chu 1975)",
    "sphere": "diameter of a sphere (Churchill 1983)",
}
_NATURAL_CONVECTION_KERNELS = {"flat_plate": _lloyd_moran, "vertical_plate": _churchill_vertical,
                               "cylinder": _churchill_chu, "sphere": _churchill_sphere}


# scalar calls take the Rust fast path (as the one-kernel function did before the geometries)
@dispatch("geometry", {k: (f, None) for k, f in _NATURAL_CONVECTION_KERNELS.items()})
def natural_convection(
    superheat: Any, fluid: Saturation, length: Any, expansion_coefficient: Any, g: Any = G,
    geometry: str = "flat_plate",
) -> Any:
    r"""Natural convection before boiling [W/m2]: from the upper face of a
    heated horizontal plate, Lloyd & Moran (1974), from a vertical plate or
    a horizontal cylinder, Churchill & Chu (1975), or from a sphere,
    Churchill (1983).

    .. math::
        \text{plate:}\quad Nu_L = 0.54\,Ra_L^{1/4}\ (10^4 \le Ra_L \le 10^7),\qquad
        Nu_L = 0.15\,Ra_L^{1/3}\ (10^7 < Ra_L \le 10^{11})

        \text{vertical plate:}\quad Nu_L = \left\{0.825 + \frac{0.387\,Ra_L^{1/6}}
        {[1 + (0.492/Pr)^{9/16}]^{8/27}}\right\}^2\ (10^{-1} \le Ra_L \le 10^{12})

        \text{cylinder:}\quad Nu_D = \left\{0.60 + \frac{0.387\,Ra_D^{1/6}}
        {[1 + (0.559/Pr)^{9/16}]^{8/27}}\right\}^2\ (10^{-5} \le Ra_D \le 10^{12})

        \text{sphere:}\quad Nu_D = 2 + 0.589\left(\frac{Ra_D}{\psi}\right)^{1/4}
        \left(1 + \frac{7.44\times10^{-8}\,Ra_D}{\psi}\right)^{1/12},\
        \psi = [1 + (0.469/Pr)^{9/16}]^{16/9}\ (Ra_D \le 10^{11},\ Pr \ge 0.7)

        Ra_L = \frac{g\beta\,\Delta T\,L^3}{\nu_l\,\alpha_l},\qquad
        Pr = \frac{\mu_l c_{pl}}{k_l},\qquad q'' = Nu_L\,\frac{k_l}{L}\,\Delta T

    Parameters
    ----------
    superheat : array_like
        Wall minus liquid temperature [K], >= 0.
    fluid : Saturation
        Uses ``k_l``, ``rho_l``, ``cp_l``, ``mu_l`` (liquid properties; for
        the film temperature use a state at that temperature).
    length : array_like
        L [m]: area / perimeter of the horizontal plate, height of the
        vertical plate, or the cylinder's or sphere's diameter (see
        `NATURAL_CONVECTION_GEOMETRIES`).
    expansion_coefficient : array_like
        Thermal expansion coefficient :math:`\beta` of the liquid [1/K].
    g : array_like, optional
        Acceleration [m/s2].
    geometry : str, optional
        ``"flat_plate"`` (default; horizontal, facing up),
        ``"vertical_plate"``, ``"cylinder"`` (horizontal) or ``"sphere"``.

    Returns
    -------
    float, ndarray, DataArray or Series
        Heat flux [W/m2]; a Rayleigh number outside the correlation's range
        (1e4-1e11 for the horizontal plate, 1e-1-1e12 for the vertical one,
        1e-5-1e12 for the cylinder, up to 1e11 with Pr >= 0.7 for the sphere)
        is flagged (`RangeWarning`).

    Notes
    -----
    Constants and ranges [M, high]; the originals were not read. The
    vertical-plate, cylinder and sphere forms reproduce CalebBell/ht's
    doctests (a general-purpose heat-transfer library). The vertical plate
    is an isothermal one: a board or cold plate standing in an immersion
    bath, L its height. The sphere's last factor is Churchill's turbulent
    transition (1.014 at Ra_D = 7e6, 1.32 at 1e9 for Pr = 0.7), left out of
    the laminar form often quoted. The cylinder is checked against Morgan's
    (1975) power laws (within 15 % at Pr = 0.71), the sphere against Yuge's
    (1960) 2 + 0.43 Ra^(1/4) (within 10 % at Pr = 0.71).

    References
    ----------
    .. [1] J.R. Lloyd, W.R. Moran, "Natural convection adjacent to horizontal
       surface of various planforms", J. Heat Transfer 96 (1974) 443-447,
       doi:10.1115/1.3450224 (DOI from memory).
    .. [2] S.W. Churchill, H.H.S. Chu, "Correlating equations for laminar and
       turbulent free convection from a horizontal cylinder", Int. J. Heat
       Mass Transfer 18 (1975) 1049-1053, doi:10.1016/0017-9310(75)90222-7
       (DOI from memory).
    .. [3] S.W. Churchill, H.H.S. Chu, "Correlating equations for laminar and
       turbulent free convection from a vertical plate", Int. J. Heat Mass
       Transfer 18 (1975) 1323-1329, doi:10.1016/0017-9310(75)90243-4 (as
       ht's references give it).
    .. [4] S.W. Churchill, "Free convection around immersed bodies", in Heat
       Exchanger Design Handbook, Section 2.5.7 (Hemisphere, 1983) (from
       memory).
    .. [5] T. Yuge, "Experiments on heat transfer from spheres including
       combined natural and forced convection", J. Heat Transfer 82 (1960)
       214-220 (from memory).
    .. [6] V.T. Morgan, "The overall convective heat transfer from smooth
       circular cylinders", Adv. Heat Transfer 11 (1975) 199-264 (from
       memory).

    Examples
    --------
    >>> from wetboil.fluids import Saturation
    >>> from wetboil.boiling import natural_convection
    >>> w = Saturation(T=373.15, p=101325.0, rho_l=957.9, rho_v=0.5955, h_lv=2257e3, sigma=58.9e-3,
    ...                cp_l=4217.0, mu_l=279e-6, k_l=0.680)
    >>> round(natural_convection(3.0, w, 0.075, 7.5e-4) / 3.0)   # h [W/(m2 K)]
    782
    >>> round(natural_convection(3.0, w, 1e-3, 7.5e-4, geometry="cylinder") / 3.0)   # a 1 mm wire
    1622
    """
    check_choice("boiling.natural_convection", "geometry", geometry, NATURAL_CONVECTION_GEOMETRIES)
    return _NATURAL_CONVECTION_KERNELS[geometry](superheat, fluid, length, expansion_coefficient, g)


#: Film-boiling geometries: (constant C, what the length L is).
FILM_GEOMETRIES: Dict[str, Tuple[float, str]] = {
    "cylinder": (0.62, "diameter"),
    "sphere": (0.67, "diameter"),
    "flat_plate": (0.425, "capillary length (computed)"),
}


def _film_kernel(
    wall_superheat: Any, constant: Any, length: Any, latent_factor: Any, emissivity: Any, fluid: Saturation, g: Any
) -> Any:
    """Kernel-backed helper of `film_boiling`."""


_film_kernel.__name__ = "film_boiling"
_film_kernel = kernel("film_boiling")(_film_kernel)


@one_warning_per_category("boiling.film_boiling")
def film_boiling(
    wall_superheat: Any,
    fluid: Saturation,
    geometry: str = "cylinder",
    diameter: Any = None,
    latent_factor: Any = 0.4,
    emissivity: Any = 0.0,
    g: Any = G,
) -> Any:
    r"""Stable film-boiling heat flux, Bromley form [W/m2].

    .. math::
        q''_{conv} = C\left[\frac{g\,k_v^3\,\rho_v(\rho_l-\rho_v)\,(h_{lv}+a\,c_{pv}\Delta T)}
        {\mu_v\,L\,\Delta T}\right]^{1/4}\Delta T,
        \qquad q'' = q''_{conv} + \tfrac34\,\varepsilon\sigma_{SB}(T_w^4-T_{sat}^4)

    ===================  ======  ====================================  =========================
    geometry             C       L                                     source
    ===================  ======  ====================================  =========================
    ``"cylinder"``       0.62    diameter (horizontal cylinder)        Bromley (1950) [V2]
    ``"sphere"``         0.67    diameter                              [V2]
    ``"flat_plate"``     0.425   :math:`[\sigma/(g\Delta\rho)]^{1/2}`  Berenson (1961) [M, med]
    ===================  ======  ====================================  =========================

    Parameters
    ----------
    wall_superheat : array_like
        :math:`T_w - T_{sat}` [K], > 0.
    fluid : Saturation
        Uses ``h_lv``, ``cp_v``, ``rho_l``, ``rho_v``, ``k_v``, ``mu_v``
        (vapour properties at the film temperature (T_w + T_sat)/2 are
        recommended; the state's vapour fields are used as given) and ``T``.
    geometry : str, optional
        One of `FILM_GEOMETRIES`.
    diameter : array_like, optional
        Cylinder or sphere diameter [m] (required for those; an error for
        ``"flat_plate"``).
    latent_factor : array_like, optional
        a in :math:`h_{lv} + a\,c_{pv}\Delta T`: 0.4 (Bromley's restatement,
        default) or 0.8 (used by other texts) [M].
    emissivity : array_like, optional
        Wall emissivity for the radiation term, 0 to 1 (0 = none, the
        default); outside 0-1 the element is impossible (NaN and
        `InvalidValueWarning`). The 3/4 weighting is the common explicit
        simplification [V2]; the radiation uses ``fluid.T`` as T_sat.
    g : array_like, optional
        Acceleration [m/s2].

    Returns
    -------
    float, ndarray, DataArray or Series
        Heat flux [W/m2]. Valid only above the minimum heat flux
        (`wetboil.chf.minimum_heat_flux`), which is not checked here.

    Notes
    -----
    Bromley's :math:`D^{-1/4}` is not flagged at any diameter, but it holds
    for tubes of moderate size only: on large tubes it sends the flux
    towards zero where it tends to the flat plate's, and on thin wires the
    measured flux rises above it [from memory, unconfirmed: Breen &
    Westwater, Chem. Eng. Prog. 58 (1962), about 0.8 <= lambda_c/D <= 8
    with :math:`\lambda_c = 2\pi[\sigma/(g\Delta\rho)]^{1/2}`]. Water at
    1 atm, 300 K: 19.2 kW/m2 on a 0.5 m cylinder against 49.5 kW/m2 on a
    plate [D]. Radiation is off unless ``emissivity`` is given; it adds a
    growing share at large superheats.

    References
    ----------
    .. [1] L.A. Bromley, "Heat transfer in stable film boiling", Chem. Eng.
       Prog. 46 (1950) 221-227 (bibliographic data from memory).
    .. [2] P.J. Berenson, "Film-boiling heat transfer from a horizontal
       surface", J. Heat Transfer 83 (1961) 351-358.

    Examples
    --------
    >>> from wetboil.fluids import Saturation
    >>> from wetboil.boiling import film_boiling
    >>> w = Saturation(T=373.15, p=101325.0, rho_l=957.9, rho_v=0.5955, h_lv=2257e3, sigma=58.9e-3,
    ...                cp_v=2080.0, k_v=0.0331, mu_v=14.85e-6)
    >>> round(film_boiling(155.0, w, "cylinder", diameter=5e-3) / 1e3, 1)   # kW/m2
    43.5
    """
    need_saturation("boiling.film_boiling", fluid)
    check_choice("boiling.film_boiling", "geometry", geometry, FILM_GEOMETRIES)
    constant = FILM_GEOMETRIES[geometry][0]
    if geometry == "flat_plate":
        if diameter is not None:
            raise WetboilValueError("boiling.film_boiling: diameter is used by the cylinder and sphere geometries "
                                    "only, not by 'flat_plate' (Berenson's length is the capillary length)")
        g = _chf._real("boiling.film_boiling", "g", g)
        # the capillary length as 1 m over Lienhard & Dhir's L' of 1 m: that kernel's checks (sigma > 0,
        # rho_l > rho_v; one warning, named under this function) and labels, for any state
        length = 1.0 / _chf.dimensionless_size(1.0, fluid, g)
    else:
        if diameter is None:
            raise WetboilValueError(f"boiling.film_boiling: geometry {geometry!r} needs diameter=... [m]")
        length = diameter
    return _film_kernel(wall_superheat, constant, length, latent_factor, emissivity, fluid, g)


# --------------------------------------------------------------------------- partitioning


class Partition(NamedTuple):
    """Wall heat flux split by `partition` [W/m2], with the closures' values."""

    evaporation: Any
    quenching: Any
    convection: Any
    total: Any
    quench_area_fraction: Any
    site_density: Any
    departure_diameter: Any
    frequency: Any


class _RpiOut(NamedTuple):
    evaporation: Any
    quenching: Any
    convection: Any
    total: Any
    quench_area_fraction: Any


def _rpi_kernel(
    site_density: Any,
    departure_diameter: Any,
    frequency: Any,
    wall_superheat: Any,
    subcooling: Any,
    convection_coefficient: Any,
    area_factor: Any,
    fluid: Saturation,
) -> Any:
    """Kernel-backed helper of `partition`."""


_rpi_kernel.__name__ = "partition"
_rpi_kernel = kernel("rpi_partition", result=_RpiOut)(_rpi_kernel)


def _tolubinsky(subcooling: Any) -> Any:
    """Tolubinsky & Kostanchuk (1970) departure diameter (RPI's closure)."""


_tolubinsky.__name__ = "partition"
_tolubinsky = kernel("tolubinsky_kostanchuk_departure")(_tolubinsky)

#: Site-density closures of `partition` beyond a number, an array or a callable:
#: names passed to ``wetboil.nucleation.site_density(..., method=name)``.
SITE_DENSITY_CLOSURES: Tuple[str, ...] = ("lemmert_chawla", "wang_dhir", "basu", "hibiki_ishii")
#: Departure-diameter closures: Tolubinsky & Kostanchuk (RPI's own) or any
#: method of ``wetboil.departure.diameter``.
DEPARTURE_CLOSURES: Tuple[str, ...] = ("tolubinsky_kostanchuk",) + (
    "fritz",
    "fritz_jakob",
    "cole_rohsenow",
    "kocamustafaogullari_ishii",
    "force_balance",
)

#: The closures by name that take no contact angle (RPI's own, and Cole & Rohsenow's diameter): every
#: other named closure needs ``contact_angle_deg``, and an angle given with only these is not used.
_ANGLE_FREE: Tuple[str, ...] = ("lemmert_chawla", "tolubinsky_kostanchuk", "cole_rohsenow")
#: Area (bubble influence) factors K of `partition`.
AREA_FACTORS: Tuple[str, ...] = ("kurul_podowski", "del_valle_kenning")


def _site_density(method: Any, wall_superheat: Any, fluid: Saturation, contact_angle_deg: Any) -> Any:
    if callable(method):
        return method(wall_superheat, fluid, contact_angle_deg)
    if not isinstance(method, str):
        return method  # a number or an array: the site density itself [1/m2]
    check_choice("boiling.partition", "site_density closure", method, SITE_DENSITY_CLOSURES)
    from . import nucleation

    fn = getattr(nucleation, "site_density", None)
    if fn is None:
        raise WetboilValueError(
            "boiling.partition: wetboil.nucleation.site_density is not available in this build; "
            "pass site_density= as a number [1/m2], an array or a callable"
        )
    if contact_angle_deg is None:
        if method not in _ANGLE_FREE:
            raise WetboilValueError(f"boiling.partition: site_density closure {method!r} needs contact_angle_deg=...")
        contact_angle_deg = 90.0  # not used by Lemmert-Chawla
    return fn(wall_superheat, fluid, contact_angle_deg, method=method)


def _departure(
    method: Any, wall_superheat: Any, fluid: Saturation, contact_angle_deg: Any, receding: Any, subcooling: Any, g: Any
) -> Any:
    if callable(method):
        return method(wall_superheat, fluid, contact_angle_deg)
    if not isinstance(method, str):
        return method
    check_choice("boiling.partition", "departure closure", method, DEPARTURE_CLOSURES)
    if method == "tolubinsky_kostanchuk":
        d = _tolubinsky(subcooling)
        if fluid.name is not None and not _is_water(fluid.name):  # the closure's data are water's
            size = int(np.size(d))
            report("departure 'tolubinsky_kostanchuk'", size, 0, size,
                   validity=f"fitted to subcooled water boiling only; fluid {fluid.name!r}")
        return d
    from . import departure

    if method == "cole_rohsenow":
        return departure.diameter(0.0, fluid, method=method, g=g)
    if contact_angle_deg is None:
        raise WetboilValueError(f"boiling.partition: departure closure {method!r} needs contact_angle_deg=...")
    if method == "force_balance":
        return departure.diameter(
            contact_angle_deg,
            fluid,
            method=method,
            wall_superheat=wall_superheat,
            receding_angle_deg=contact_angle_deg if receding is None else receding,
            g=g,
        )
    return departure.diameter(contact_angle_deg, fluid, method=method, g=g)


def _frequency(method: Any, diameter: Any, fluid: Saturation, g: Any) -> Any:
    if callable(method):
        return method(diameter, fluid)
    if not isinstance(method, str):
        return method
    from . import departure

    check_choice("boiling.partition", "frequency closure", method, departure.FREQUENCY_METHODS)
    return departure.frequency(diameter, fluid, method=method, g=g)


@one_warning_per_category("boiling.partition")
def partition(
    wall_superheat: Any,
    fluid: Saturation,
    contact_angle_deg: Any = None,
    *,
    convection_coefficient: Any,
    subcooling: Any = 0.0,
    site_density: Any = "lemmert_chawla",
    departure: Any = "tolubinsky_kostanchuk",
    frequency: Any = "cole",
    area_factor: Any = "kurul_podowski",
    receding_angle_deg: Any = None,
    g: Any = G,
) -> Partition:
    r"""Wall heat-flux partitioning of Kurul & Podowski (1990), the "RPI" model.

    .. math::
        q''_w &= q''_e + q''_q + q''_c \\
        q''_e &= N_a\,f\,\tfrac{\pi}{6}D_d^3\,\rho_v h_{lv} \\
        A_q &= \min\!\left(1,\ K N_a \tfrac{\pi}{4} D_d^2\right) \\
        q''_q &= A_q\,\frac{2 k_l f\,t_w^{1/2}}{(\pi\alpha_l)^{1/2}}\,(T_w-T_l),
            \qquad t_w = 0.8/f \\
        q''_c &= h_c\,(1-A_q)\,(T_w-T_l)

    with :math:`T_w - T_l = \Delta T_w + \Delta T_{sub}`.

    **Closures, selectable** (each a name, a number or array, or a callable):

    * ``site_density`` :math:`N_a` [1/m2]: ``"lemmert_chawla"`` (RPI's
      original, no angle), or ``"wang_dhir"``, ``"basu"``,
      ``"hibiki_ishii"`` (contact-angle dependent), computed at call time by
      ``wetboil.nucleation.site_density(wall_superheat, fluid,
      contact_angle_deg=..., method=name)``; a callable gets
      ``(wall_superheat, fluid, contact_angle_deg)``.
    * ``departure`` :math:`D_d` [m]: ``"tolubinsky_kostanchuk"`` (RPI's
      original, :math:`\min(0.6\,\mathrm{mm}\,e^{-\Delta T_{sub}/45}, 1.4\,\mathrm{mm})`,
      no angle) or any method of `wetboil.departure.diameter` (``"fritz"``,
      ``"kocamustafaogullari_ishii"``, ``"force_balance"`` with
      ``receding_angle_deg``...); a callable gets ``(wall_superheat, fluid,
      contact_angle_deg)``.
    * ``frequency`` f [Hz]: any method of `wetboil.departure.frequency`
      (``"cole"``, RPI's original, with C_D = 1); a callable gets
      ``(departure_diameter, fluid)``.
    * ``area_factor`` K [-]: ``"kurul_podowski"`` (4, an influence diameter
      of 2 D_d [M, med]) or ``"del_valle_kenning"``
      (:math:`4.8\,e^{-Ja_{sub}/80}`, :math:`Ja_{sub} = \rho_l c_{pl}\Delta
      T_{sub}/(\rho_v h_{lv})` [V2]); or a number.

    The contact angle enters only through the closures that take it; an
    angle given when no chosen closure takes it (RPI's own, the defaults,
    take none) gives a `WetboilWarning`, so that an array of angles is not
    read as a wettability study it is not.

    Parameters
    ----------
    wall_superheat : array_like
        :math:`T_w - T_{sat}` [K], >= 0.
    fluid : Saturation
        Uses ``rho_l``, ``rho_v``, ``h_lv``, ``k_l``, ``cp_l`` and what the
        closures need.
    contact_angle_deg : array_like, optional
        Contact angle [deg] for the closures that need it (the advancing
        angle for ``"force_balance"``).
    convection_coefficient : array_like
        Single-phase coefficient :math:`h_c` [W/(m2 K)] (natural convection
        in a pool, forced convection in a channel); keyword, required.
    subcooling : array_like, optional
        :math:`T_{sat} - T_l` [K]; 0 by default. Negative values (liquid
        next to the wall superheated, :math:`T_l > T_{sat}`, as in a CFD
        cell near a boiling wall) are accepted while :math:`T_w \ge T_l`:
        the fluxes use :math:`T_w - T_l` only, and Tolubinsky & Kostanchuk's
        1.4 mm cap is reached below -38 K (flagged, outside their data).
    site_density, departure, frequency, area_factor : str, number or callable
        The closures (above).
    receding_angle_deg : array_like, optional
        Receding angle for ``departure="force_balance"`` (default: the
        contact angle).
    g : array_like, optional
        Acceleration [m/s2].

    Returns
    -------
    Partition
        ``(evaporation, quenching, convection, total, quench_area_fraction,
        site_density, departure_diameter, frequency)``; fluxes in W/m2.

    Raises
    ------
    WetboilValueError
        Unknown closure name (the message lists the choices), or a closure
        that needs ``contact_angle_deg`` without it.

    Notes
    -----
    The model was built for subcooled flow boiling; in pool boiling use it
    as a mechanistic decomposition, not a validated prediction. Where
    :math:`K N_a \pi D_d^2/4 > 1` the influence areas cover the wall, the
    area is capped at 1 and the element is flagged (`RangeWarning`): the
    partition is leaving its regime, as near the critical heat flux.
    Verification: the structure is [M, high]; the quenching term with
    t_w = 0.8/f, Tolubinsky-Kostanchuk, Cole with C_D = 1 and Del Valle &
    Kenning's factor are [V2] (OpenFOAM's implementations, which cite the
    papers); MODELS D10's attribution of K = 4 to Del Valle & Kenning is
    corrected here (K = 4 is Kurul & Podowski's). The originals were not read.

    References
    ----------
    .. [1] N. Kurul, M.Z. Podowski, "Multidimensional effects in forced
       convection subcooled boiling", Proc. 9th Int. Heat Transfer Conf.,
       Jerusalem (1990) vol. 2, 21-26 (pages from memory).
    .. [2] M. Del Valle, D.B.R. Kenning, "Subcooled flow boiling at high heat
       flux", Int. J. Heat Mass Transfer 28 (1985) 1907-1920.
    .. [3] V.I. Tolubinsky, D.M. Kostanchuk, Proc. 4th Int. Heat Transfer
       Conf., Paris (1970) vol. 5, B-2.8 (from memory).
    .. [4] M. Lemmert, J.M. Chawla, "Influence of flow velocity on surface
       boiling heat transfer coefficient", in Heat Transfer in Boiling,
       Academic Press (1977) 237-247.

    Examples
    --------
    Given site density (fixed closures as numbers), Tolubinsky diameter and
    Cole frequency, water at 1 atm, 10 K superheat, 5 K subcooling:

    >>> from wetboil.fluids import Saturation
    >>> from wetboil.boiling import partition
    >>> w = Saturation(T=373.124, p=101325.0, rho_l=958.35, rho_v=0.5982, h_lv=2.2564e6, sigma=0.05891,
    ...                cp_l=4215.7, k_l=0.6791)
    >>> r = partition(10.0, w, convection_coefficient=1500.0, subcooling=5.0, site_density=2e5)
    >>> round(r.departure_diameter * 1e3, 3), round(r.frequency, 1)
    (0.537, 156.0)
    >>> [round(x / 1e3, 1) for x in r[:4]]
    [3.4, 56.7, 18.4, 78.6]
    """
    need_saturation("boiling.partition", fluid)
    n_a = _site_density(site_density, wall_superheat, fluid, contact_angle_deg)
    d = _departure(departure, wall_superheat, fluid, contact_angle_deg, receding_angle_deg, subcooling, g)
    f = _frequency(frequency, d, fluid, g)
    if isinstance(area_factor, str):
        check_choice("boiling.partition", "area_factor", area_factor, AREA_FACTORS)
        if area_factor == "kurul_podowski":
            k: Any = 4.0
        else:
            ja = fluid.rho_l * fluid.cp_l * subcooling / (fluid.rho_v * fluid.h_lv)
            k = 4.8 * np.exp(-ja / 80.0) if not isinstance(ja, float) else 4.8 * math.exp(-ja / 80.0)
    else:
        k = area_factor
    # an angle no chosen closure takes would drop the surface's wettability without a word (RPI's own
    # closures, the defaults, have none); a callable closure is given the angle and may use it
    def takes_angle(c: Any) -> bool:  # a closure may also be a number or an array: no angle
        return callable(c) or (isinstance(c, str) and c not in _ANGLE_FREE)

    with_angle = [c for c in SITE_DENSITY_CLOSURES + DEPARTURE_CLOSURES if c not in _ANGLE_FREE]
    hints = {"contact_angle_deg": (takes_angle(site_density) or takes_angle(departure),
                                   f"an angle-dependent closure ({', '.join(map(repr, with_angle))}) takes it"),
             "receding_angle_deg": (callable(departure) or (isinstance(departure, str) and departure == "force_balance"),
                                    "only departure='force_balance' takes it")}
    label = lambda c: repr(c) if isinstance(c, str) else "given values"  # noqa: E731
    for name, given in (("contact_angle_deg", contact_angle_deg), ("receding_angle_deg", receding_angle_deg)):
        used, hint = hints[name]
        if given is not None and not used:
            _warn(f"boiling.partition: {name} is not used by the chosen closures (site_density="
                          f"{label(site_density)}, departure={label(departure)}): {hint}", WetboilWarning)
    out = _rpi_kernel(n_a, d, f, wall_superheat, subcooling, convection_coefficient, k, fluid)
    e, qq, c, total, area = out
    return Partition(e, qq, c, total, area, n_a, d, f)


# --------------------------------------------------------------------------- the assembled curve

#: Nucleate-boiling correlations of `curve`.
NUCLEATE_METHODS: Tuple[str, ...] = ("rohsenow", "cooper")
#: Critical-heat-flux models of `curve`.
CHF_METHODS: Tuple[str, ...] = ("kandlikar", "lienhard_dhir", "zuber")


class BoilingCurve(NamedTuple):
    """An assembled boiling curve (returned by `curve` when xarray is absent).

    Arrays along ``superheat`` [K]: ``heat_flux`` (the assembled curve),
    ``natural_convection``, ``nucleate``, ``film`` (each branch's own
    correlation over the whole range), ``regime`` (labels). Scalars: the
    points of the curve and the CHF margin (see `curve`)."""

    superheat: Any
    heat_flux: Any
    natural_convection: Any
    nucleate: Any
    film: Any
    regime: Any
    onset_superheat: float
    critical_heat_flux: float
    critical_superheat: float
    minimum_heat_flux: float
    minimum_superheat: float
    design_heat_flux: float
    design_superheat: float
    chf_margin: float


def _scalar_state(fluid: Saturation) -> None:
    if fluid._scalars is None:
        raise WetboilValueError(
            "boiling.curve: fluid must be a single state (plain numbers); call curve once per state"
        )


def _require(fluid: Saturation, fields: Tuple[str, ...], why: str) -> None:
    missing = [f for f in fields if math.isnan(getattr(fluid, f))]
    if missing:
        raise WetboilValueError(f"boiling.curve: {why} needs fluid field(s) {', '.join(missing)} (NaN in the state)")


def _bisect(fun: Callable[[float], float], lo: float, hi: float) -> float:
    """Root of an increasing function on [lo, hi] by bisection in log space (NaN if not bracketed)."""
    flo, fhi = fun(lo), fun(hi)
    if not (flo <= 0.0 <= fhi):
        return math.nan
    for _ in range(100):
        mid = math.sqrt(lo * hi)
        if fun(mid) > 0.0:
            hi = mid
        else:
            lo = mid
        if hi / lo - 1.0 < 1e-13:
            break
    return math.sqrt(lo * hi)


def _onset(fluid: Saturation, q_nc: Callable[[float], float], method: str, contact_angle_deg: Any) -> float:
    """Onset superheat: where the natural-convection line meets the nucleation
    onset criterion of `wetboil.nucleation.onset_superheat` (fixed point of
    dT = onset_superheat(q_nc(dT)))."""
    from . import nucleation

    fn = getattr(nucleation, "onset_superheat", None)
    if fn is None:
        raise WetboilValueError(
            "boiling.curve: wetboil.nucleation.onset_superheat is not available in this build; pass onset_superheat=... [K]"
        )
    kwargs: Dict[str, Any] = {"method": method}
    if contact_angle_deg is not None:
        kwargs["contact_angle_deg"] = contact_angle_deg
    dt = 1.0
    for _ in range(200):
        new = float(fn(q_nc(dt), fluid, **kwargs))
        if not math.isfinite(new):
            return math.nan
        if abs(new - dt) <= 1e-10 * max(1.0, dt):
            return new
        dt = new
    return dt


@one_warning_per_category("boiling.curve")
def curve(
    fluid: Saturation,
    superheat: Any,
    *,
    receding_angle_deg: Any = None,
    contact_angle_deg: Optional[float] = None,
    orientation_deg: float = 0.0,
    nucleate: str = "rohsenow",
    C_sf: Optional[float] = None,
    n: Optional[float] = None,
    roughness_Rp: float = 1e-6,
    chf: Optional[str] = None,
    geometry: str = "flat_plate",
    size: Optional[float] = None,
    natural_convection_coefficient: Optional[float] = None,
    expansion_coefficient: Optional[float] = None,
    onset: str = "davis_anderson",
    onset_superheat: Optional[float] = None,
    largest_cavity_radius: Optional[float] = None,
    minimum: str = "berenson",
    latent_factor: float = 0.4,
    emissivity: float = 0.0,
    design_heat_flux: Optional[float] = None,
    g: float = G,
) -> Any:
    r"""An assembled pool-boiling curve of a described surface, with the
    margin to the critical heat flux at a design heat flux.

    Branches, in order of wall superheat :math:`\Delta T = T_w - T_{sat}`:

    1. **natural convection** up to the onset of nucleate boiling:
       :math:`q = h_{nc}\Delta T` with ``natural_convection_coefficient``, or
       `natural_convection` with ``expansion_coefficient``: Lloyd & Moran on
       a plate facing up (L = size/4, a square plate; 1e4 <= Ra <= 1e11),
       Churchill & Chu on a vertical plate (``orientation_deg=90``, height
       L = size) and on a cylinder, Churchill on a sphere (D = 2 size);
    2. **onset** :math:`\Delta T_{ONB}`: where the natural-convection line
       meets ``wetboil.nucleation.onset_superheat(q, fluid, method=onset)``
       (default Davis & Anderson), or ``onset_superheat`` if given;
    3. **nucleate branch** (`rohsenow` or `cooper`) from the onset to the
       critical heat flux, taking the larger of it and natural convection;
    4. **CHF cap** at :math:`\Delta T_{CHF}` where the nucleate branch reaches
       :math:`q_{max}`: ``chf="kandlikar"`` (receding angle and orientation;
       the default on a plate when ``receding_angle_deg`` is given),
       ``"lienhard_dhir"`` (``geometry`` and ``size``; the default
       otherwise, and always on a cylinder or sphere) or ``"zuber"`` (pi/24);
    5. **transition** between :math:`(\Delta T_{CHF}, q_{max})` and the
       Leidenfrost point :math:`(\Delta T_{min}, q_{min})`: a straight line in
       log-log coordinates -- an engineering construction, not a correlation;
    6. **film branch** (`film_boiling`, Bromley form for ``"cylinder"`` and
       ``"sphere"`` with D = 2 size, Berenson's plate form otherwise) above
       :math:`\Delta T_{min}`, where it equals the minimum heat flux
       (`wetboil.chf.minimum_heat_flux`, ``minimum="berenson"``). Both
       minimum forms are a flat plate's: on a ``"cylinder"`` or ``"sphere"``
       a `RangeWarning` says so (Lienhard & Wong, J. Heat Transfer 86 (1964)
       220-226, found flat-plate predictions inapplicable to small wires). It uses
       the vapour properties of the one saturated state given, where
       `film_boiling` recommends them at the film temperature. At low
       reduced pressure the branch runs low (water at 1 atm, flat plate: 5 %
       at 100 K, 14 % at 300 K, 24 % at 600 K against CoolProp steam at
       :math:`(T_w + T_{sat})/2` [D]); towards the critical point it runs
       high, because the saturated vapour's :math:`c_{pv}` grows far above
       the film's: water at 10 MPa +23 % at 100 K and +38 % at 300 K, at
       15 MPa +55 % and +90 %; nitrogen at 3 MPa (:math:`p/p_{crit}` = 0.89)
       +110 % at 50 K [D, same comparison]. High is the unsafe side: at a
       given film-boiling flux the wall superheat comes out too small, and so
       does the Leidenfrost superheat (water at 15 MPa: 434 K here, 884 K
       with the vapour at the film temperature; nitrogen at 3 MPa: 38 K
       against 93 K [D]). At low reduced pressure it errs the other way
       for cooling transients: the low film branch puts the Leidenfrost
       superheat high, so a quench or a cryogenic chill-down is predicted
       to rewet too early (liquid nitrogen at 1 atm: 66 K here, about 39 K
       from Berenson's minimum-superheat form with the vapour at the film
       temperature [D, that form from memory]). For the film regime itself
       call `film_boiling` with a state at the film temperature.

    Wettability enters the curve through the CHF (Kandlikar's receding
    angle) and an onset criterion that uses an angle (``onset="hsu"``)
    only. The minimum heat flux, the Leidenfrost point, the transition line
    and the film branch are the hydrodynamic forms, the same at every angle,
    although measured Leidenfrost points and transition boiling move with
    the wettability [from memory: Ramilison & Lienhard, J. Heat Transfer
    109 (1987); Vakarelski et al., Nature 489 (2012), vapour layers kept on
    superhydrophobic spheres]. Radiation across the film is off by default
    (``emissivity=0``): it adds a growing share at large superheats (water at
    1 atm on a plate facing up, emissivity 0.8: +13 % at 300 K and +59 %
    at 800 K [D]), so give the wall's emissivity for a curve past a few
    hundred kelvin.

    Parameters
    ----------
    fluid : Saturation
        One saturated state (plain numbers) with the liquid transport
        properties (``cp_l``, ``k_l``, ``mu_l``), the vapour ones for the film
        branch (``cp_v``, ``k_v``, ``mu_v``), and ``p_crit``, ``molar_mass``
        for Cooper.
    superheat : array_like
        Wall superheats [K] (> 0) at which to evaluate the curve.
    receding_angle_deg : float, optional
        Receding contact angle [deg] (for ``chf="kandlikar"``). With another
        CHF method it is not used, and a `WetboilWarning` says so.
    contact_angle_deg : float, optional
        Static contact angle [deg] for an onset criterion that uses it
        (``onset="hsu"``); the default ``"davis_anderson"`` does not.
    orientation_deg : float, optional
        Heater orientation [deg] (0 facing up, 90 vertical). Kandlikar's CHF
        depends on it (beyond 90 deg a `RangeWarning`); the flat-plate forms
        of Zuber and Lienhard-Dhir hold facing up only and do not: any other
        orientation gives a `RangeWarning` and the facing-up value.
        ``chf="kandlikar"`` or ``"zuber"`` on a ``"cylinder"`` or ``"sphere"``
        is a flat-heater value that ignores ``size``: a `RangeWarning` (use
        ``chf="lienhard_dhir"`` for those bodies). On a plate the other
        branches do not depend on it either: Berenson's film branch and
        minimum heat flux (and Lloyd & Moran's natural convection, with
        ``expansion_coefficient``) are forms for a horizontal surface facing
        up, so any other orientation also gives a `RangeWarning` for them and
        their facing-up values; at exactly 90 deg natural convection is
        Churchill & Chu's vertical plate instead. The ``"cylinder"`` forms
        (Sun & Lienhard's CHF, Churchill & Chu's natural convection, Bromley's
        film branch) are a horizontal cylinder's, taken as orientation 0: at
        any other value (a vertical rod or tube) a `RangeWarning` and the
        horizontal values. A sphere has no orientation.
    nucleate : str, optional
        One of `NUCLEATE_METHODS`.
    C_sf, n : float, optional
        Rohsenow constants (see `surface_constant`); by default C_sf 0.013
        (water on polished copper; a warning for other fluids) and n from
        `rohsenow_exponent` (1.0 water, 1.7 other liquids).
    roughness_Rp : float, optional
        Cooper's R_p [m].
    chf : str, optional
        One of `CHF_METHODS` (default as in 4. above). Kandlikar's (2001)
        form has no heater-size term: it is a large flat heater's, however
        small ``size`` is (a 20 mm evaporator in water at 10 kPa is only 7.5
        capillary lengths wide); ``"lienhard_dhir"`` carries the size and
        flags heaters too small for its forms.
    geometry : str, optional
        ``"flat_plate"``, ``"small_flat_plate"``, ``"cylinder"`` or
        ``"sphere"`` (Lienhard-Dhir CHF and film branch).
    size : float, optional
        Heater width (plates) or radius (cylinder, sphere) [m]; required for
        cylinders and spheres and for natural convection by ``expansion_coefficient``.
    natural_convection_coefficient : float, optional
        :math:`h_{nc}` [W/(m2 K)]; or give ``expansion_coefficient`` [1/K].
    expansion_coefficient : float, optional
        Liquid thermal expansion coefficient [1/K] for Lloyd & Moran (plates),
        Churchill & Chu (cylinders) or Churchill (spheres).
        Superheats where the curve uses that branch (and the onset it sets)
        outside the correlation's Rayleigh range give its `RangeWarning`.
    onset : str, optional
        Method name for ``wetboil.nucleation.onset_superheat``.
    onset_superheat : float, optional
        Give the onset superheat [K] directly instead.
    largest_cavity_radius : float, optional
        Mouth radius of the largest cavity on the surface [m]. The tangency
        criteria assume cavities of every size; in a pool (thick thermal
        layer) they put the onset at a fraction of a kelvin. With this
        radius the onset is at least the superheat that cavity's embryo
        needs (`wetboil.nucleation.embryo_superheat`), as in Hsu (1962).
    minimum : str, optional
        One of `wetboil.chf.MINIMUM_METHODS`.
    latent_factor, emissivity : float, optional
        Film branch, as in `film_boiling`.
    design_heat_flux : float, optional
        Design heat flux [W/m2], >= 0: gives ``design_superheat`` on the
        nucleate branch and ``chf_margin`` = :math:`q_{max}/q_{design}` (a
        ratio [-], not a difference; NaN for a NaN design flux).
    g : float, optional
        Acceleration [m/s2].

    Returns
    -------
    xarray.Dataset or BoilingCurve
        With xarray installed, a Dataset along ``superheat`` with variables
        ``heat_flux`` (the assembled curve), ``natural_convection``,
        ``nucleate``, ``film`` (each branch over the whole range),
        ``regime`` (labels: "natural convection", "nucleate", "transition",
        "film"; "none", with a NaN heat flux, where the state gives no onset,
        CHF or Leidenfrost point) and 0-d variables ``onset_superheat``,
        ``critical_heat_flux``, ``critical_superheat``,
        ``minimum_heat_flux``, ``minimum_superheat``, ``design_heat_flux``,
        ``design_superheat``, ``chf_margin`` (units in ``attrs``). Without
        xarray, a `BoilingCurve` named tuple with the same fields.

    Raises
    ------
    WetboilValueError
        Unknown method or geometry names (listed), a fluid state that is not
        a single state, missing properties, or missing inputs (natural
        convection, size).

    Notes
    -----
    ``chf_margin`` below 1 means the design flux exceeds the predicted
    critical heat flux. A margin computed from correlations that scatter by
    tens of percent is not a safety factor: keep the margins your codes
    require and verify on the real surface. Element warnings of the
    underlying correlations (out-of-range orientation, C_sf, reduced
    pressure...) are passed on, gathered into one warning per category
    that names each correlation and its count.

    The branches are independent correlations and need not meet in order:
    the onset can lie beyond the CHF superheat (large cavities at low
    pressure), the Leidenfrost superheat below it (water below about
    20 kPa), or the CHF below the minimum heat flux (Kandlikar's CHF at
    receding angles near 165 deg and above). Each case gives a
    `RangeWarning`; the nucleate branch still runs to the CHF, and the film
    branch starts at the larger of the two superheats.

    Examples
    --------
    >>> import numpy as np
    >>> from wetboil.fluids import Saturation
    >>> from wetboil.boiling import curve
    >>> w = Saturation(T=373.15, p=101325.0, rho_l=957.9, rho_v=0.5955, h_lv=2257e3, sigma=58.9e-3,
    ...                cp_l=4217.0, mu_l=279e-6, k_l=0.680, cp_v=2080.0, k_v=0.0331, mu_v=14.85e-6, name="water")
    >>> c = curve(w, np.geomspace(1.0, 1000.0, 61), receding_angle_deg=45.0, C_sf=0.0128,
    ...           natural_convection_coefficient=1000.0, onset_superheat=5.0, design_heat_flux=8e5)
    >>> round(float(c["critical_heat_flux"]) / 1e6, 2), round(float(c["critical_superheat"]), 1)
    (1.27, 20.3)
    >>> round(float(c["chf_margin"]), 2)
    1.58
    >>> sorted(set(c["regime"].values.tolist()))
    ['film', 'natural convection', 'nucleate', 'transition']
    """
    fn = "boiling.curve"
    need_saturation(fn, fluid)
    _scalar_state(fluid)
    check_choice(fn, "nucleate method", nucleate, NUCLEATE_METHODS)
    chf_chosen = chf is None
    if chf is None:
        # Kandlikar (2001) models a flat heater; a cylinder's or a sphere's size sets its peak flux
        flat = geometry not in ("cylinder", "sphere")
        chf = "kandlikar" if receding_angle_deg is not None and flat else "lienhard_dhir"
    check_choice(fn, "chf method", chf, CHF_METHODS)
    check_choice(fn, "geometry", geometry, _chf.GEOMETRIES)
    check_choice(fn, "minimum method", minimum, _chf.MINIMUM_METHODS)
    options = dict(receding_angle_deg=receding_angle_deg, contact_angle_deg=contact_angle_deg,
                   orientation_deg=orientation_deg, C_sf=C_sf, n=n, roughness_Rp=roughness_Rp, size=size,
                   natural_convection_coefficient=natural_convection_coefficient,
                   expansion_coefficient=expansion_coefficient, onset_superheat=onset_superheat,
                   largest_cavity_radius=largest_cavity_radius, latent_factor=latent_factor, emissivity=emissivity,
                   design_heat_flux=design_heat_flux, g=g)
    for label, value in options.items():  # one surface, one state: single numbers (or None where optional)
        if value is not None and not (
            isinstance(value, (int, float, np.integer, np.floating, np.ndarray))
            and not isinstance(value, (bool, np.bool_)) and np.ndim(value) == 0
            and np.asarray(value).dtype.kind in "fiu"
        ):
            raise WetboilTypeError(f"{fn}: {label} must be a single number, got {type(value).__name__}")
    dts = np.atleast_1d(np.asarray(_chf._real(fn, "superheat", superheat), dtype=float))
    if dts.ndim != 1:
        raise WetboilValueError(f"{fn}: superheat must be one-dimensional, got shape {dts.shape}")
    if np.any(~(dts > 0)):
        raise WetboilValueError(f"{fn}: superheat values must be positive numbers [K]")
    if geometry in ("cylinder", "sphere", "small_flat_plate") and size is None:
        raise WetboilValueError(f"{fn}: geometry {geometry!r} needs size=... [m]")

    # -- nucleate branch and its inverse
    if nucleate == "rohsenow":
        _require(fluid, ("cp_l", "k_l", "mu_l"), "the Rohsenow branch")
        if C_sf is None:  # chosen (and warned about) once, not at every call below
            C_sf = _default_constant(fluid, fn)
        if n is None:
            n = _default_exponent(fluid, fn)

        def q_nb(x: Any) -> Any:
            return rohsenow(x, fluid, C_sf, n, g)

        def dt_nb(q: Any) -> Any:
            return rohsenow_superheat(q, fluid, C_sf, n, g)

    else:
        _require(fluid, ("p_crit", "molar_mass"), "the Cooper branch")

        def q_nb(x: Any) -> Any:
            return cooper(x, fluid, roughness_Rp)

        def dt_nb(q: Any) -> Any:
            return cooper_superheat(q, fluid, roughness_Rp)

    # -- natural convection
    if natural_convection_coefficient is not None:
        h_nc = float(natural_convection_coefficient)

        def q_nc(x: Any) -> Any:
            with np.errstate(over="ignore"):  # an absurd coefficient overflows to inf, no NumPy warning
                return h_nc * np.asarray(x, dtype=float) if np.ndim(x) else h_nc * float(x)

    elif expansion_coefficient is not None:
        if size is None:
            raise WetboilValueError(f"{fn}: natural convection by expansion_coefficient needs size=... [m]")
        _require(fluid, ("cp_l", "k_l", "mu_l"), "natural convection")
        # a square plate of width `size` (area / perimeter = size / 4; standing vertical, height = size);
        # a cylinder or sphere of radius `size`
        if geometry in ("cylinder", "sphere"):
            nc_geometry, length = geometry, 2.0 * size
        elif orientation_deg == 90.0:
            nc_geometry, length = "vertical_plate", size
        else:
            nc_geometry, length = "flat_plate", size / 4.0

        def q_nc(x: Any) -> Any:
            with errstate(out_of_range="ignore"):
                return natural_convection(x, fluid, length, expansion_coefficient, g, nc_geometry)

    else:
        raise WetboilValueError(
            f"{fn}: natural convection needs natural_convection_coefficient=... [W/(m2 K)] "
            "or expansion_coefficient=... [1/K] (with size=...)"
        )

    # -- critical heat flux
    if receding_angle_deg is not None and chf != "kandlikar":
        # the surface's wettability would drop out of the CHF without a word
        why = " (Kandlikar's, which has one, models a flat heater)" if chf_chosen else ""
        _warn(f"{fn}: receding_angle_deg is not used: chf='{chf}' has no wettability term{why}", WetboilWarning)
    if chf == "kandlikar":
        if receding_angle_deg is None:
            raise WetboilValueError(f"{fn}: chf='kandlikar' needs receding_angle_deg=...")
        q_max = float(_chf.kandlikar(receding_angle_deg, fluid, orientation_deg, g))
    elif chf == "zuber":
        q_max = float(_chf.zuber(fluid, _chf.ZUBER_K, g))
    elif size is None:
        q_max = float(_chf.zuber(fluid, _chf.LIENHARD_DHIR_K, g))
    else:
        q_max = float(_chf.lienhard_dhir(fluid, geometry, size, g=g))
    if chf != "kandlikar" and geometry in (None, "flat_plate", "small_flat_plate") and not orientation_deg == 0.0:
        # the flat-plate forms hold for a heater facing up: elsewhere the value is that of one facing up
        report(f"{fn}: chf='{chf}' (a horizontal heater facing up) at orientation_deg={orientation_deg:g}", 1, 0, 1)
    if geometry not in ("cylinder", "sphere") and not orientation_deg == 0.0:
        # Berenson's film-boiling and minimum-heat-flux forms are for a horizontal surface facing up
        # (Berenson 1961), as is Lloyd & Moran's natural convection from the upper face of a heated
        # plate (1974): at any other orientation the branches keep their facing-up values
        facing_up = [f"the film branch and minimum='{minimum}'"]
        if natural_convection_coefficient is None and not orientation_deg == 90.0:
            facing_up.append("natural convection (Lloyd & Moran)")
        report(f"{fn}: {' and '.join(facing_up)} (a horizontal surface facing up) at "
               f"orientation_deg={orientation_deg:g}", 1, 0, 1)
    if geometry == "cylinder" and not orientation_deg == 0.0:
        # Sun & Lienhard's CHF (1970), Churchill & Chu's natural convection (1975) and Bromley's film
        # boiling (1950) are forms for a horizontal cylinder: a tilted or vertical one (a fuel rod, a
        # standing heater tube) keeps the horizontal values
        horizontal = ([f"chf='{chf}'"] if chf == "lienhard_dhir" else []) + (
            ["natural convection"] if natural_convection_coefficient is None else []) + ["the film branch"]
        report(f"{fn}: geometry 'cylinder' (a horizontal cylinder: {', '.join(horizontal)}) at "
               f"orientation_deg={orientation_deg:g}", 1, 0, 1)
    if geometry in ("cylinder", "sphere"):
        # both minimum-heat-flux forms are a flat plate's; Lienhard & Wong (1964) found them inapplicable
        # to small wires (their cylinder form is not in this library): the Leidenfrost point moves with it
        report(f"{fn}: minimum='{minimum}' (a flat plate's minimum heat flux) on geometry {geometry!r}", 1, 0, 1)
    if chf in ("kandlikar", "zuber") and geometry in ("cylinder", "sphere"):
        # Kandlikar (2001) and Zuber (1959) model a flat heater: on a cylinder or a sphere they ignore
        # its size, which sets the peak heat flux of small bodies (Sun & Lienhard 1970; Lienhard & Dhir 1973)
        report(f"{fn}: chf='{chf}' (a flat heater; the size is not used) on geometry {geometry!r}", 1, 0, 1)
    dt_chf = float(dt_nb(q_max))

    # -- onset
    if onset_superheat is not None:
        dt_onb = float(onset_superheat)
    else:
        dt_onb = _onset(fluid, lambda x: float(q_nc(x)), onset, contact_angle_deg)
    dt_tangency = dt_onb  # where the natural-convection line meets the onset criterion (or as given)
    if largest_cavity_radius is not None:
        from . import nucleation

        dt_onb = max(dt_onb, float(nucleation.embryo_superheat(largest_cavity_radius, fluid)))

    # -- film branch and the Leidenfrost point
    _require(fluid, ("cp_v", "k_v", "mu_v"), "the film branch")
    film_geometry = geometry if geometry in ("cylinder", "sphere") else "flat_plate"
    diameter = 2.0 * size if (film_geometry != "flat_plate" and size is not None) else None
    q_min = float(_chf.minimum_heat_flux(fluid, minimum, g))

    def q_film(x: Any) -> Any:
        return film_boiling(x, fluid, film_geometry, diameter, latent_factor, emissivity, g)

    dt_min = _bisect(lambda x: float(q_film(x)) - q_min, 1e-3, 1e4)
    # The branches come from independent correlations and need not meet in order. Large cavities'
    # embryo superheats at low pressure can put the onset beyond the CHF superheat. At low reduced
    # pressure (water below about 20 kPa) the film branch reaches q_min at a smaller superheat than
    # the nucleate branch reaches the CHF; on very non-wetting surfaces (Kandlikar's CHF at
    # receding angles near 165 deg and above) the CHF falls below q_min. Either way there is no
    # transition regime between a maximum and a minimum: say so.
    if dt_onb >= dt_chf:
        report(f"{fn}: the onset superheat ({dt_onb:.3g} K) is not below the CHF superheat ({dt_chf:.3g} K): "
               "the correlations give no nucleate branch at this state", 1, 0, 1)
    if dt_min <= dt_chf:
        report(f"{fn}: the Leidenfrost superheat ({dt_min:.3g} K, film branch at the minimum heat flux) is not "
               f"above the CHF superheat ({dt_chf:.3g} K): the correlations give no transition regime at this "
               f"state; the curve drops from the CHF to the film branch at {dt_chf:.3g} K", 1, 0, 1)
    elif q_max <= q_min:
        report(f"{fn}: the critical heat flux ({q_max:.3g} W/m2, {chf}) is not above the minimum heat flux "
               f"({q_min:.3g} W/m2, {minimum}): the correlations give no boiling crisis at this state; "
               "the 'transition' line does not fall", 1, 0, 1)

    # -- assemble
    nat = np.asarray(q_nc(dts), dtype=float)
    nuc = np.asarray(q_nb(dts), dtype=float)
    fil = np.asarray(q_film(dts), dtype=float)
    q = np.full(dts.shape, np.nan)  # no branch (a NaN onset, CHF or Leidenfrost point): no answer
    regime = np.full(dts.shape, "none", dtype=object)
    below = dts < dt_onb
    nucl = (~below) & (dts <= dt_chf)
    film_mask = (dts >= dt_min) & ~(dts <= dt_chf)  # the nucleate branch runs to the CHF whatever dt_min is
    trans = (dts > dt_chf) & ~film_mask
    q[below] = nat[below]
    regime[below] = "natural convection"
    q[nucl] = np.maximum(nat[nucl], nuc[nucl])
    regime[nucl] = np.where(nuc[nucl] > nat[nucl], "nucleate", "natural convection")
    if np.any(trans):
        if math.isfinite(dt_min) and dt_min > dt_chf > 0.0 and q_max > 0.0 and q_min > 0.0:  # (q_max = 0 at 180 deg)
            slope = math.log(q_min / q_max) / math.log(dt_min / dt_chf)
            with np.errstate(over="ignore"):  # a subnormal dt_chf (absurd C_sf, flagged already) overflows
                q[trans] = q_max * (dts[trans] / dt_chf) ** slope
        else:
            q[trans] = np.nan
    regime[trans] = "transition"
    q[film_mask] = fil[film_mask]
    regime[film_mask] = "film"
    regime_labels = regime.astype(str)
    if natural_convection_coefficient is None:
        # q_nc ignores the correlation's Rayleigh range (the onset iteration runs through any superheat);
        # where the curve uses the branch, and at the onset it sets, pass its RangeWarning on
        used = dts[regime == "natural convection"]
        if onset_superheat is None and math.isfinite(dt_tangency):
            used = np.append(used, dt_tangency)
        if used.size:
            natural_convection(used, fluid, length, expansion_coefficient, g, nc_geometry)

    if design_heat_flux is not None:
        q_d = float(design_heat_flux)
        if q_d < 0.0:
            raise WetboilValueError(f"{fn}: design_heat_flux must be zero or positive [W/m2], got {q_d:g}")
        dt_d = float(dt_nb(q_d)) if q_d < q_max else math.nan
        # a NaN design flux (missing data) gives a NaN margin, not an infinite one
        margin = q_max / q_d if q_d != 0.0 else math.inf
    else:
        q_d, dt_d, margin = math.nan, math.nan, math.nan

    points = {
        "onset_superheat": (dt_onb, "K", "onset of nucleate boiling where the natural-convection line meets the "
                            "onset criterion (the boiling curve's own onset; a sweep's onset_superheat is the "
                            "criterion at the design heat flux instead)"),
        "critical_heat_flux": (q_max, "W/m2", f"critical heat flux ({chf})"),
        "critical_superheat": (dt_chf, "K", "superheat where the nucleate branch reaches the CHF"),
        "minimum_heat_flux": (q_min, "W/m2", f"minimum film-boiling heat flux ({minimum})"),
        "minimum_superheat": (dt_min, "K", "Leidenfrost superheat (film branch at the minimum heat flux)"),
        "design_heat_flux": (q_d, "W/m2", "design heat flux"),
        "design_superheat": (dt_d, "K", "nucleate-branch superheat at the design heat flux"),
        "chf_margin": (margin, "1", "critical heat flux over design heat flux"),
    }
    try:
        import xarray as xr
    except ImportError:  # pragma: no cover - xarray is installed with the test extra
        return BoilingCurve(dts, q, nat, nuc, fil, regime_labels, *(v[0] for v in points.values()))
    coords = {"superheat": ("superheat", dts, {"units": "K", "long_name": "wall superheat T_w - T_sat"})}
    data: Dict[str, Any] = {
        "heat_flux": ("superheat", q, {"units": "W/m2", "long_name": "assembled boiling curve"}),
        "natural_convection": ("superheat", nat, {"units": "W/m2", "long_name": "natural-convection branch"}),
        "nucleate": ("superheat", nuc, {"units": "W/m2", "long_name": f"nucleate branch ({nucleate})"}),
        "film": ("superheat", fil, {"units": "W/m2", "long_name": f"film branch ({film_geometry})"}),
        "regime": ("superheat", regime_labels, {"long_name": "boiling regime"}),
    }
    for name, (value, unit, long_name) in points.items():
        data[name] = ((), value, {"units": unit, "long_name": long_name})
    return xr.Dataset(
        data,
        coords=coords,
        attrs={
            "fluid": fluid.name or "",
            "nucleate": nucleate,
            "chf": chf,
            "geometry": geometry,
            "caution": "correlation estimates (tens of percent); keep code-required margins to CHF",
        },
    )
