r"""Wetting: from measured contact angles to the working fluid's angles on a
treated surface, and the thin-film physics near the contact line.

The usual chain:

1. probe-liquid angles measured at room temperature -> the solid's surface
   free energy and its dispersive and polar parts (`surface_energy`,
   Owens-Wendt-Rabel-Kaelble), or Zisman's critical surface tension
   (`critical_surface_tension`);
2. -> the angle of any other liquid, such as the working fluid at its
   saturation temperature (`predict_angle`);
3. -> the apparent angle on the real rough or textured surface (`wenzel`,
   `cassie_baxter`), whether the texture wicks the liquid
   (`hemiwicking_angle`), and the apparent angle once it has
   (`impregnated_angle`);
4. -> hysteresis forces on drops (`retention_force`, `sliding_angle`) and
   thin wetting films (`disjoining_pressure`, `film_thickness`).

Units
-----
Surface tensions, surface free energies and their components are in **N/m**
(= J/m2) at every public function, also in the probe-liquid table
(`PROBE_LIQUIDS`, whose published values are in mN/m and converted when the
table is built). Contact angles are in **degrees, measured through the
liquid**. Hamaker constants in J.

Element problems (an angle outside 0-180, a negative tension, a roughness
ratio below 1, an advancing angle below the receding one) give NaN and one
`InvalidValueWarning` per call; structural problems (fewer than two probe
liquids, an unknown liquid name, shapes that do not fit) raise
`WetboilValueError` / `WetboilTypeError` at once.
"""

from __future__ import annotations

import math
import re
from typing import Any, Dict, List, Mapping, NamedTuple, Tuple

import numpy as np

from ._api import MODELS, _is_dask, _is_pandas, _is_xarray, kernel
from ._errors import WetboilTypeError, WetboilValueError, WetboilWarning, _warn, report
from .fluids import Saturation, _is_water

__all__ = [
    # kernels
    "young_angle",
    "spreading_coefficient",
    "adhesion_work",
    "interfacial_tension",
    "owrk_angle",
    "wenzel",
    "cassie_baxter",
    "hemiwicking_angle",
    "impregnated_angle",
    "retention_force",
    "sliding_angle",
    "disjoining_pressure",
    "power_law_disjoining_pressure",
    "film_thickness",
    "effective_hamaker",
    # fits and tables
    "surface_energy",
    "predict_angle",
    "critical_surface_tension",
    "split_surface_tension",
    "dispersive_fraction",
    "DISPERSIVE_FRACTIONS",
    "probe_liquid",
    "hamaker_constant",
    "ProbeLiquid",
    "SurfaceEnergy",
    "CriticalSurfaceTension",
    "HamakerConstant",
    "PROBE_LIQUIDS",
    "HAMAKER_CONSTANTS",
]

G = 9.80665
_MN = 1e-3  # mN/m -> N/m
#: Largest liquid surface tension [N/m] taken as given; above it a value was almost surely typed in
#: mN/m. The same bound as the kernels' range check (TENSION_MAX in src/model.rs), which warns;
#: the fits below raise, since one such value spoils the whole fit.
_TENSION_MAX = 1.0
#: The kernels' range clause for it (TENSION_CLAUSE in src/model.rs, read from the models' facts), quoted
#: where it flags.
_TENSION_CLAUSE = next(c for m in MODELS.values() for _, _, c in m.input_bounds
                       if c.startswith("liquid surface tension"))


def _question_radians(owner: str, angles: Any, goes_on: str) -> None:
    """One `WetboilWarning` when every given angle lies within (0, pi] and not all are zero, the usual
    sign of angles typed in radians. Degrees and radians cannot be told apart there: a
    superhydrophilic coating measures 0-3 deg, so this asks and goes on (`goes_on` says how); silence
    it with ``warnings.filterwarnings("ignore", message=".*given in radians")``."""
    a = np.asarray(angles, dtype=float)
    given = a[~np.isnan(a)]
    if given.size and (given > 0.0).any() and (given <= math.pi).all():
        _warn(f"{owner}: every contact angle is at most {math.pi:.4f} deg; were they given in radians? Angles "
              f"are in degrees ({goes_on})", WetboilWarning)


# =============================================================================
# Young, spreading, adhesion, Girifalco-Good


@kernel("young_angle")
def young_angle(sigma_sv: Any, sigma_sl: Any, sigma_lv: Any) -> Any:
    r"""Young's equilibrium contact angle [deg].

    .. math:: \cos\theta = \frac{\sigma_{sv} - \sigma_{sl}}{\sigma_{lv}}

    Parameters
    ----------
    sigma_sv : array_like
        Solid-vapour tension (the solid's surface free energy in the vapour)
        [N/m], >= 0.
    sigma_sl : array_like
        Solid-liquid interfacial tension [N/m], >= 0.
    sigma_lv : array_like
        Liquid-vapour surface tension [N/m], > 0.

    Returns
    -------
    float, ndarray, DataArray or Series
        Contact angle through the liquid [deg]: **0** when the spreading
        coefficient :math:`S = \sigma_{sv}-\sigma_{sl}-\sigma_{lv} \ge 0` (the
        liquid spreads), **180** when :math:`\sigma_{sl}-\sigma_{sv} \ge
        \sigma_{lv}`. These ends are physical answers, not errors.

    Notes
    -----
    Validity: no published numeric range. Young's equation describes an ideal
    solid (smooth, rigid, chemically homogeneous) at equilibrium; real
    surfaces show a range of angles between receding and advancing.
    :math:`\sigma_{sv}` is the solid's energy *in the vapour*, lower than in
    vacuum by the spreading pressure of the adsorbed vapour (Fox and Zisman
    1950, eqs. 1-3, seen in the original).

    Negative tensions give NaN and an `InvalidValueWarning`.

    References
    ----------
    .. [1] T. Young, "An essay on the cohesion of fluids", Phil. Trans. R.
       Soc. Lond. 95 (1805) 65-87, doi:10.1098/rstl.1805.0005 (bibliographic
       data from memory).
    .. [2] H.W. Fox, W.A. Zisman, "The spreading of liquids on low energy
       surfaces. I. Polytetrafluoroethylene", J. Colloid Sci. 5 (1950)
       514-531, doi:10.1016/0095-8522(50)90044-4.

    Examples
    --------
    >>> from wetboil.wetting import young_angle
    >>> round(young_angle(0.040, 0.010, 0.0728), 2)
    65.66
    >>> young_angle([0.10, 0.01], 0.01, 0.0728)   # spreads (S > 0); 90 deg
    array([ 0., 90.])
    >>> young_angle(0.0, 0.08, 0.0728)            # complete drying
    180.0
    """


@kernel("spreading_coefficient")
def spreading_coefficient(sigma_sv: Any, sigma_sl: Any, sigma_lv: Any) -> Any:
    r"""Spreading coefficient [N/m].

    .. math:: S = \sigma_{sv} - \sigma_{sl} - \sigma_{lv}

    :math:`S \ge 0`: the liquid spreads (complete wetting). :math:`S < 0`: it
    forms a drop, and by Young's equation :math:`S = \sigma_{lv}(\cos\theta - 1)`.

    Parameters
    ----------
    sigma_sv, sigma_sl : array_like
        Solid-vapour and solid-liquid tensions [N/m], >= 0.
    sigma_lv : array_like
        Liquid surface tension [N/m], > 0.

    Returns
    -------
    float, ndarray, DataArray or Series
        Spreading coefficient [N/m].

    Notes
    -----
    A definition; no validity range. Negative tensions give NaN and an
    `InvalidValueWarning`.

    References
    ----------
    .. [1] P.G. de Gennes, "Wetting: statics and dynamics", Rev. Mod. Phys.
       57 (1985) 827-863, doi:10.1103/RevModPhys.57.827.

    Examples
    --------
    Liquid helium on a metal (common practice: any liquid of very low
    surface tension spreads on a high-energy solid):

    >>> from wetboil.wetting import spreading_coefficient, interfacial_tension
    >>> s_l, s_s = 0.37e-3, 0.5               # N/m
    >>> spreading_coefficient(s_s, interfacial_tension(s_s, s_l), s_l) > 0
    True
    """


@kernel("young_dupre_adhesion_work")
def adhesion_work(sigma_lv: Any, contact_angle_deg: Any) -> Any:
    r"""Young-Dupre reversible work of adhesion [J/m2].

    .. math:: W_a = \sigma_{lv}(1 + \cos\theta)
              \;\;(= \sigma_{sv} + \sigma_{lv} - \sigma_{sl})

    Parameters
    ----------
    sigma_lv : array_like
        Liquid surface tension [N/m], > 0.
    contact_angle_deg : array_like
        Equilibrium contact angle [deg], 0 to 180.

    Returns
    -------
    float, ndarray, DataArray or Series
        Work of adhesion per unit area [J/m2]; :math:`2\sigma_{lv}` (the
        work of cohesion) at 0 deg, 0 at 180 deg. At 0 deg this is a lower
        bound: a liquid that spreads has :math:`W_a \ge 2\sigma_{lv}` (the
        spreading coefficient :math:`W_a - 2\sigma_{lv} \ge 0`), which the
        angle cannot resolve.

    Notes
    -----
    Fox and Zisman's general form is :math:`W_a = \pi_e + \sigma_{lv}(1 +
    \cos\theta)` with :math:`\pi_e` the spreading pressure of the adsorbed
    vapour (seen in the original); the Young-Dupre form assumes
    :math:`\pi_e \approx 0`, usual on low-energy solids.

    References
    ----------
    .. [1] A. Dupré, Théorie mécanique de la chaleur (Gauthier-Villars,
       Paris, 1869) (bibliographic data from memory).
    .. [2] H.W. Fox, W.A. Zisman, J. Colloid Sci. 5 (1950) 514-531,
       doi:10.1016/0095-8522(50)90044-4, eqs. 4-8.

    Examples
    --------
    >>> from wetboil.wetting import adhesion_work
    >>> round(adhesion_work(0.0728, 108.0) * 1e3, 2)   # water on PTFE, mJ/m2
    50.3
    >>> adhesion_work(0.0728, [0.0, 90.0])
    array([0.1456, 0.0728])
    """


@kernel("girifalco_good")
def interfacial_tension(sigma_s: Any, sigma_l: Any, phi: Any = 1.0) -> Any:
    r"""Girifalco-Good interfacial tension between two phases [N/m].

    .. math:: \gamma_{12} = \gamma_1 + \gamma_2 - 2\Phi\sqrt{\gamma_1\gamma_2}

    Parameters
    ----------
    sigma_s, sigma_l : array_like
        Surface tensions (surface free energies) of the two phases [N/m],
        >= 0. Pass the **dispersive components** of both with ``phi=1`` for
        Fowkes's dispersion-only rule.
    phi : array_like, optional
        Interaction parameter [-], >= 0; 1 by default (like phases held by
        dispersion forces alone).

    Returns
    -------
    float, ndarray, DataArray or Series
        Interfacial tension [N/m]. With :math:`\Phi > 1` it may be negative
        (the model then predicts mixing); it is returned as computed.

    Notes
    -----
    Combined with Young's equation: :math:`\cos\theta = -1 +
    2\Phi\sqrt{\gamma_s/\gamma_{lv}}`. Values of :math:`\Phi` outside 0.5-1.1
    (the spread of values for real pairs, from memory) are flagged with
    `RangeWarning`. The equation's form was checked against a secondary
    source (abstract of J. Colloid Interface Sci. 529 (2018) 243-246); the
    paper itself was not seen.

    References
    ----------
    .. [1] L.A. Girifalco, R.J. Good, "A theory for the estimation of surface
       and interfacial energies. I. Derivation and application to interfacial
       tension", J. Phys. Chem. 61 (1957) 904-909, doi:10.1021/j150553a013
       (bibliographic data from memory).
    .. [2] F.M. Fowkes, "Attractive forces at interfaces", Ind. Eng. Chem.
       56(12) (1964) 40-52, doi:10.1021/ie50660a008 (from memory).

    Examples
    --------
    >>> from wetboil.wetting import interfacial_tension
    >>> round(interfacial_tension(0.020, 0.0728) * 1e3, 2)   # mN/m
    16.48
    >>> interfacial_tension(0.05, 0.05)                      # like phases: none
    0.0
    """


# =============================================================================
# Owens-Wendt-Rabel-Kaelble


@kernel("owrk_angle")
def owrk_angle(solid_dispersive: Any, solid_polar: Any, liquid_dispersive: Any, liquid_polar: Any) -> Any:
    r"""Contact angle [deg] from dispersive and polar surface-energy
    components (Owens-Wendt-Rabel-Kaelble geometric mean).

    .. math:: \frac{\sigma_l(1+\cos\theta)}{2} = \sqrt{\sigma_s^d\sigma_l^d}
              + \sqrt{\sigma_s^p\sigma_l^p},\qquad \sigma_l = \sigma_l^d+\sigma_l^p

    Parameters
    ----------
    solid_dispersive, solid_polar : array_like
        The solid's dispersive and polar surface-energy components [N/m], >= 0.
    liquid_dispersive, liquid_polar : array_like
        The liquid's components [N/m], >= 0, not both zero.

    Returns
    -------
    float, ndarray, DataArray or Series
        Contact angle through the liquid [deg]; 0 where the equation gives
        :math:`\cos\theta \ge 1` (the liquid spreads).

    Notes
    -----
    `predict_angle` calls this with the result of `surface_energy`. The
    two-component split is a model assumption; there is no published
    validity range.

    References
    ----------
    .. [1] D.K. Owens, R.C. Wendt, "Estimation of the surface free energy of
       polymers", J. Appl. Polym. Sci. 13 (1969) 1741-1747,
       doi:10.1002/app.1969.070130815.
    .. [2] D.H. Kaelble, "Dispersion-polar surface tension properties of
       organic solids", J. Adhesion 2 (1970) 66-81 (from memory).
    .. [3] W. Rabel, Farbe und Lack 77 (1971) 997-1005 (from memory).

    Examples
    --------
    Water (21.8 + 51.0 mN/m) on PTFE (12.5 + 1.5 mN/m, Owens and Wendt's
    values, from memory):

    >>> from wetboil.wetting import owrk_angle
    >>> round(owrk_angle(12.5e-3, 1.5e-3, 21.8e-3, 51.0e-3), 1)
    107.8
    """


def predict_angle(surface: Any, liquid_sigma_dispersive: Any, liquid_sigma_polar: Any) -> Any:
    r"""Contact angle [deg] of any liquid on a surface characterised by
    `surface_energy` (Owens-Wendt-Rabel-Kaelble).

    Parameters
    ----------
    surface : SurfaceEnergy or tuple
        The solid's surface energy: a `SurfaceEnergy` (from `surface_energy`),
        or a pair ``(dispersive, polar)`` in **N/m**. A component above
        10 N/m (almost surely typed in mN/m, as tables print them; it makes
        every liquid spread at 0 deg) is flagged with a `RangeWarning`.
    liquid_sigma_dispersive, liquid_sigma_polar : array_like
        The liquid's dispersive and polar surface-tension components [N/m],
        >= 0. For a working fluid at saturation, split its surface tension
        ``fluid.sigma`` with `split_surface_tension`.

    Returns
    -------
    float, ndarray, DataArray or Series
        Contact angle through the liquid [deg] (0 where it spreads).

    Notes
    -----
    This is `owrk_angle` with the solid's components taken from `surface`;
    arrays broadcast (several surfaces against several liquids). The surface
    energy is assumed not to change between the measuring temperature and
    the working temperature, which is rarely checked; treat predictions far
    from room temperature as estimates.

    Examples
    --------
    >>> from wetboil.wetting import surface_energy, predict_angle
    >>> ptfe = surface_energy([108.0, 88.0], ["water", "diiodomethane"], table="owens_wendt_1969")
    >>> round(predict_angle(ptfe, 21.8e-3, 51.0e-3), 1)    # water back again
    108.0
    >>> round(predict_angle((0.030, 0.010), 27.5e-3, 0.0), 1)   # hexadecane spreads
    0.0
    """
    if isinstance(surface, SurfaceEnergy) or (hasattr(surface, "dispersive") and hasattr(surface, "polar")):
        sd, sp = surface.dispersive, surface.polar
    elif isinstance(surface, (tuple, list)) and len(surface) == 2:
        sd, sp = surface
    else:
        raise WetboilTypeError(
            "predict_angle: surface must be a SurfaceEnergy (from wetboil.wetting.surface_energy) "
            f"or a (dispersive, polar) pair in N/m, got {type(surface).__name__}"
        )
    return owrk_angle(sd, sp, liquid_sigma_dispersive, liquid_sigma_polar)


# -----------------------------------------------------------------------------
# probe liquids


class ProbeLiquid(NamedTuple):
    """A probe liquid's surface-tension components [N/m] at 20 C and where
    they come from."""

    name: str
    dispersive: float
    polar: float
    source: str

    @property
    def total(self) -> float:
        """Total surface tension [N/m]."""
        return self.dispersive + self.polar

    def __repr__(self) -> str:
        return (
            f"ProbeLiquid({self.name!r}, total={self.total / _MN:.4g} mN/m, "
            f"dispersive={self.dispersive / _MN:.4g} mN/m, polar={self.polar / _MN:.4g} mN/m)"
        )


_FOWKES_WATER = (
    "dispersive part 21.8 mN/m: F.M. Fowkes, Ind. Eng. Chem. 56(12) (1964) 40-52, doi:10.1021/ie50660a008; "
    "the 21.8/51.0 split as used by Owens & Wendt (1969) and by G. Strom, M. Fredriksson, P. Stenius, "
    "J. Colloid Interface Sci. 119 (1987) 352-361 [from memory, high confidence]"
)
_STROM_DIM = (
    "G. Strom, M. Fredriksson, P. Stenius, J. Colloid Interface Sci. 119 (1987) 352-361, "
    "doi:10.1016/0021-9797(87)90280-3 [from memory]; total 50.8 mN/m and 'apolar for practical purposes' "
    "seen in a secondary source (C.J. van Oss, Interfacial Forces in Aqueous Media, 2nd ed., ch. XVII)"
)
_VAN_OSS = (
    "C.J. van Oss, M.K. Chaudhury, R.J. Good, Chem. Rev. 88 (1988) 927-941, doi:10.1021/cr00088a006, "
    "table of liquids: Lifshitz-van der Waals part used as dispersive, acid-base part as polar "
    "[bibliographic data seen; values from memory, medium confidence]"
)
_OWENS_WENDT = (
    "D.K. Owens, R.C. Wendt, J. Appl. Polym. Sci. 13 (1969) 1741-1747, doi:10.1002/app.1969.070130815 "
    "[split from memory, medium confidence; it reproduces their polymer table, see tests]"
)

# Published values in mN/m at 20 C: (dispersive, polar, source). Converted to
# N/m below; nothing else in the package sees mN/m.
_TABLES_MN: Dict[str, Dict[str, Tuple[float, float, str]]] = {
    "default": {
        "water": (21.8, 51.0, _FOWKES_WATER),
        "diiodomethane": (50.8, 0.0, _STROM_DIM),
        "formamide": (39.0, 19.0, _VAN_OSS),
        "ethylene glycol": (29.0, 19.0, _VAN_OSS),
        "glycerol": (34.0, 30.0, _VAN_OSS),
        "hexadecane": (27.5, 0.0, _VAN_OSS),
    },
    "owens_wendt_1969": {
        "water": (21.8, 51.0, _OWENS_WENDT),
        "diiodomethane": (49.5, 1.3, _OWENS_WENDT),
    },
}

#: Probe-liquid tables: ``PROBE_LIQUIDS[table][name]`` is a `ProbeLiquid`
#: with components in **N/m** (20 C). ``"default"``: water 21.8/51.0 and a
#: fully apolar diiodomethane 50.8/0 (the most widely used pair; with an
#: apolar probe the two-liquid system is triangular), formamide, ethylene
#: glycol, glycerol and hexadecane from van Oss, Chaudhury and Good (1988).
#: ``"owens_wendt_1969"``: water and diiodomethane (methylene iodide,
#: 49.5/1.3) as Owens and Wendt split them. Other water splits circulate
#: (26.25/46.55, 27.19/45.61 mN/m); their original sources were not
#: identified, so they are not offered.
PROBE_LIQUIDS: Dict[str, Dict[str, ProbeLiquid]] = {
    table: {name: ProbeLiquid(name, d * _MN, p * _MN, src) for name, (d, p, src) in rows.items()}
    for table, rows in _TABLES_MN.items()
}

_ALIASES = {
    "methylene iodide": "diiodomethane",
    "ch2i2": "diiodomethane",
    "glycerin": "glycerol",
    "glycerine": "glycerol",
    "n hexadecane": "hexadecane",
    "ethane 1 2 diol": "ethylene glycol",
    "h2o": "water",
}


def _normalise(name: str) -> str:
    key = re.sub(r"[\s_\-,]+", " ", name.strip().lower())
    return _ALIASES.get(key, key)


def probe_liquid(name: str, table: str = "default") -> ProbeLiquid:
    """Look up a probe liquid's surface-tension components.

    Parameters
    ----------
    name : str
        Liquid name (case, spaces, hyphens and underscores are ignored;
        "methylene iodide" and "glycerin" are understood).
    table : str, optional
        Which published set: ``"default"`` or ``"owens_wendt_1969"`` (see
        `PROBE_LIQUIDS`).

    Returns
    -------
    ProbeLiquid
        Components in N/m, with the source.

    Raises
    ------
    WetboilValueError
        Unknown table or liquid; the message lists the known names.

    Examples
    --------
    >>> from wetboil.wetting import probe_liquid
    >>> probe_liquid("Methylene iodide")
    ProbeLiquid('diiodomethane', total=50.8 mN/m, dispersive=50.8 mN/m, polar=0 mN/m)
    >>> round(probe_liquid("diiodomethane", table="owens_wendt_1969").polar, 6)   # N/m
    0.0013
    """
    if not isinstance(table, str) or table not in PROBE_LIQUIDS:
        raise WetboilValueError(f"wetting: unknown probe-liquid table {table!r}; known tables: {sorted(PROBE_LIQUIDS)}")
    if not isinstance(name, str):
        raise WetboilTypeError(f"wetting: a probe-liquid name must be a string, got {type(name).__name__}")
    rows = PROBE_LIQUIDS[table]
    key = _normalise(name)
    if key not in rows:
        raise WetboilValueError(
            f"wetting: unknown probe liquid {name!r} in table {table!r}; known liquids: {sorted(rows)} "
            "(or pass your own as {name: (dispersive, polar)} in N/m)"
        )
    return rows[key]


def _custom_liquid(name: Any, spec: Any) -> ProbeLiquid:
    if isinstance(spec, ProbeLiquid):
        # a ProbeLiquid built by hand is held to the same checks as a (dispersive, polar) pair: in
        # mN/m, as tables print them, it would otherwise give surface energies a thousand times too high
        _custom_liquid(spec.name, (spec.dispersive, spec.polar))
        return spec
    try:
        d, p = spec
        d, p = float(d), float(p)
    except (TypeError, ValueError):
        raise WetboilTypeError(
            f"surface_energy: liquid {name!r} must be given as (dispersive, polar) in N/m, got {spec!r}"
        ) from None
    if not (math.isfinite(d) and math.isfinite(p) and d >= 0.0 and p >= 0.0 and d + p > 0.0):
        raise WetboilValueError(f"surface_energy: liquid {name!r} needs finite components >= 0, not both zero; got {spec!r}")
    if d + p > _TENSION_MAX:
        raise WetboilValueError(
            f"surface_energy: liquid {name!r} has components {spec!r}: above 1 N/m; were they given in mN/m? "
            "Components are in N/m."
        )
    return ProbeLiquid(str(name), d, p, "user supplied")


def _resolve_liquids(liquids: Any, table: str) -> Tuple[List[ProbeLiquid], List[str]]:
    """The probe liquids, and the name the caller gave each (a table name as spelled, a mapping key,
    a `ProbeLiquid`'s name), in order."""
    if isinstance(liquids, str):
        raise WetboilTypeError("surface_energy: liquids must be a sequence of names, not a single string")
    if isinstance(liquids, Mapping):
        out = [_custom_liquid(k, v) for k, v in liquids.items()]
        given = [str(k) for k in liquids]
    else:
        try:
            items = list(liquids)
        except TypeError:
            raise WetboilTypeError(
                f"surface_energy: liquids must be a sequence of names or a mapping name -> (dispersive, polar), "
                f"got {type(liquids).__name__}"
            ) from None
        out = [_custom_liquid(item.name, item) if isinstance(item, ProbeLiquid) else probe_liquid(item, table)
               for item in items]
        given = [item.name if isinstance(item, ProbeLiquid) else item for item in items]
    if len(out) < 2:
        known = sorted(PROBE_LIQUIDS.get(table, PROBE_LIQUIDS["default"]))
        raise WetboilValueError(
            f"surface_energy: needs at least two probe liquids (one mostly dispersive, one polar), got {len(out)}; "
            f"known liquids: {known}"
        )
    return out, given


# -----------------------------------------------------------------------------
# surface energy from probe liquids


def _mn(v: Any) -> str:
    if isinstance(v, float) or np.ndim(v) == 0:
        v = float(v)
        return "nan" if math.isnan(v) else f"{v / _MN:.4g}"
    return f"<array {np.shape(v)}>"


def _pm(value: Any, error: Any) -> str:
    """`value ± error` in mN/m, or the value alone where the error is undefined (a fit with
    no degrees of freedom, e.g. two probe liquids for two unknowns)."""
    if (isinstance(error, float) or np.ndim(error) == 0) and math.isnan(float(error)):
        return _mn(value)
    return f"{_mn(value)} ± {_mn(error)}"


class SurfaceEnergy(NamedTuple):
    """Surface free energy of a solid and its parts [N/m], with first-order
    uncertainties (NaN when the fit has no degrees of freedom)."""

    total: Any
    dispersive: Any
    polar: Any
    total_error: Any
    dispersive_error: Any
    polar_error: Any
    liquids: Tuple[str, ...]

    def __repr__(self) -> str:
        return (
            f"SurfaceEnergy(total={_pm(self.total, self.total_error)} mN/m, "
            f"dispersive={_pm(self.dispersive, self.dispersive_error)} mN/m, "
            f"polar={_pm(self.polar, self.polar_error)} mN/m, liquids={self.liquids})"
        )


def _float_array(function: str, label: str, value: Any) -> np.ndarray:
    if isinstance(value, (str, bytes)) or value is None:
        raise WetboilTypeError(f"{function}: {label} must be numbers, got {type(value).__name__}")
    try:
        arr = np.asarray(value, dtype=np.float64)
    except (TypeError, ValueError):
        raise WetboilTypeError(f"{function}: {label} must be an array of real numbers, got {value!r}") from None
    return arr


def _out(x: np.ndarray) -> Any:
    return float(x) if np.ndim(x) == 0 else x


def _string_labels(values: Any) -> Any:
    """The labels of an axis (a pandas index, an xarray coordinate's values) as a list when every one is a
    string, else None (numbers, tuples of a MultiIndex: not liquid names)."""
    labels = list(values)
    return [str(v) for v in labels] if labels and all(isinstance(v, str) for v in labels) else None


def _angles_by_liquid(
    function: str, angles: Any, given: List[str], liqs: List[ProbeLiquid], table: str
) -> Tuple[np.ndarray, Any]:
    """`surface_energy`'s angles as float64 with the liquids along the last axis, in the order of `liqs`,
    and a function ``label(values, name)`` that labels a result of the batch shape like the input (None
    for unlabelled input: plain numbers, lists, ndarrays).

    Labelled angles (an xarray DataArray, a pandas Series or DataFrame) are aligned by name: the one axis
    whose labels name the liquids one to one, in any order, holds them. Without such an axis the last
    axis holds them by position, as for arrays, unless its labels are strings (they would have to be the
    liquids' names) or another axis carries probe-liquid names: then a `WetboilValueError`, never a
    positional match against labels that say otherwise."""
    import sys

    from ._api import _check_pandas, _pandas_values

    label = "contact_angles_deg"
    xr = sys.modules.get("xarray")
    pd = sys.modules.get("pandas")
    # (axis, where, labels, index): the labels along each axis; `index` for an index (a pandas axis, an
    # xarray dimension coordinate), False for another 1-D xarray coordinate along that dimension
    axes: List[Tuple[int, str, Any, bool]]
    if xr is not None and isinstance(angles, xr.DataArray):
        axes = [(i, f"dimension {d!r}" if c == d else f"coordinate {c!r} (dimension {d!r})",
                 _string_labels(angles.coords[c].values), c == d)
                for i, d in enumerate(angles.dims) for c in angles.coords if angles.coords[c].dims == (d,)]
        ndim = angles.ndim
    elif pd is not None and isinstance(angles, pd.DataFrame):
        axes = [(0, "the index (rows)", _string_labels(angles.index), True),
                (1, "the columns", _string_labels(angles.columns), True)]
        ndim = 2
    elif pd is not None and isinstance(angles, pd.Series):
        axes = [(0, "the index", _string_labels(angles.index), True)]
        ndim = 1
    else:
        return _float_array(function, label, angles), None

    n = len(liqs)
    index: Dict[str, int] = {}
    repeated = set()
    for i, (name, liq) in enumerate(zip(given, liqs)):
        for key in {_normalise(str(name)), _normalise(liq.name)}:
            if index.setdefault(key, i) != i:
                repeated.add(key)
    labelled = [(pos, where, labs, is_index) for pos, where, labs, is_index in axes if labs is not None]
    if repeated and labelled:
        raise WetboilValueError(
            f"{function}: liquids {given} name {sorted(repeated)} more than once, so labelled {label} cannot be "
            "aligned with them by name; give each liquid its own name"
        )

    def order(labels: List[str]) -> Any:
        """perm with ``perm[i]`` the position of liquid i among `labels`; None unless one to one."""
        where = [index.get(_normalise(lab)) for lab in labels]
        if None in where or sorted(where) != list(range(n)):  # type: ignore[type-var]
            return None
        return [where.index(i) for i in range(n)]

    def shown(labels: List[str]) -> str:
        return repr(labels) if len(labels) <= 8 else repr(labels[:8])[:-1] + f", ... ({len(labels)} labels)]"

    found = [(pos, where, perm) for pos, where, labs, _ in labelled for perm in [order(labs)] if perm is not None]
    last = ndim - 1
    if len({pos for pos, _, _ in found}) > 1 or len({tuple(perm) for _, _, perm in found}) > 1:
        raise WetboilValueError(
            f"{function}: {label} names the liquids along more than one axis, or in two orders along one "
            f"({', '.join(w for _, w, _ in found)}); only the liquid axis may carry their names, in one order"
        )
    if found:
        pos, perm = found[0][0], found[0][2]
    else:
        known = set(index) | {_normalise(k) for k in PROBE_LIQUIDS.get(table, {})} | set(_ALIASES)
        for p_, where, labs, is_index in labelled:
            if (p_ == last and is_index) or any(_normalise(lab) in known for lab in labs):
                raise WetboilValueError(
                    f"{function}: the labels of {label} along {where}, {shown(labs)}, do not name the liquids "
                    f"{given} one to one. Labelled angles are matched to liquids by name, never by position: "
                    "label the liquid axis with exactly these names (any order; case, spaces, hyphens and "
                    "underscores ignored), or pass plain numbers in the order of liquids"
                )
        pos, perm = last, None  # no labels to go by: the documented positional contract (last axis)

    def take(values: np.ndarray) -> np.ndarray:
        theta = _float_array(function, label, values)
        return theta if perm is None else theta[..., perm]

    if xr is not None and isinstance(angles, xr.DataArray):
        if ndim == 0:
            return _float_array(function, label, angles.values), None  # the shape check reports it
        dim = angles.dims[pos]
        batch = [d for d in angles.dims if d != dim]
        theta = take(angles.transpose(*batch, dim).values)
        # the batch dimensions with their coordinates (and scalar ones); coordinates along the liquid
        # dimension describe liquids, not surfaces, and are dropped
        template = angles.isel({dim: 0}, drop=True)

        def label_xarray(values: np.ndarray, name: str) -> Any:
            return xr.DataArray(values, dims=template.dims, coords=template.coords, name=name,
                                attrs={"units": "N/m"})

        return theta, label_xarray
    _check_pandas(function, label, angles)
    values = _pandas_values(function, label, angles)
    if values.ndim == 1:
        return take(values), None  # a Series is one surface: floats, as for a 1-D array
    theta = take(values if pos == 1 else values.T)
    surfaces = angles.index if pos == 1 else angles.columns
    import pandas

    def label_pandas(values: np.ndarray, name: str) -> Any:
        out = pandas.Series(values, index=surfaces, name=name)
        out.attrs["units"] = "N/m"
        return out

    return theta, label_pandas


def surface_energy(contact_angles_deg: Any, liquids: Any, *, table: str = "default") -> SurfaceEnergy:
    r"""Surface free energy of a solid from probe-liquid contact angles
    (Owens-Wendt-Rabel-Kaelble).

    For each probe liquid *i*:

    .. math:: \frac{\sigma_{l,i}(1+\cos\theta_i)}{2} =
              \sqrt{\sigma_{l,i}^d}\,x + \sqrt{\sigma_{l,i}^p}\,y,
              \qquad x = \sqrt{\sigma_s^d},\; y = \sqrt{\sigma_s^p}

    Two liquids give a 2x2 system solved exactly; more liquids are solved by
    linear least squares in *(x, y)*, with unweighted residuals in this form
    (half the work of adhesion, N/m). Kaelble's plot, which divides each row
    by :math:`\sqrt{\sigma_{l,i}^d}` and fits a line in
    :math:`\sqrt{\sigma_{l,i}^p/\sigma_{l,i}^d}`, weights the liquids
    differently: with three or more liquids its components differ somewhat
    from these (with two, both are exact and agree).

    Parameters
    ----------
    contact_angles_deg : array_like, DataArray, Series or DataFrame
        Measured (static or advancing) angles [deg], one per liquid along the
        **last** axis; leading axes are independent surfaces (a batch).
        **Labelled angles are matched to the liquids by name**, not by
        position: an xarray DataArray whose dimension coordinate (or another
        1-D coordinate along one dimension) holds the liquid names (that
        dimension, wherever it is, holds the liquids), a pandas Series
        indexed by liquid name (one surface), or a DataFrame with the liquid
        names as columns (rows are surfaces) or as its index (columns are
        surfaces). Names are those given in `liquids`, in any
        order (case, spaces, hyphens and underscores ignored, the aliases of
        `probe_liquid` understood). Without liquid names on any axis the last
        axis holds the liquids by position, as for arrays.
    liquids : sequence of str or ProbeLiquid, or mapping
        The probe liquids, in the order of the angles' last axis for
        unlabelled angles: names from the table (see `probe_liquid`),
        `ProbeLiquid` objects, or a mapping ``{name: (dispersive, polar)}`` of
        your own liquids in **N/m**.
    table : str, optional
        Which published probe-liquid table names refer to: ``"default"`` or
        ``"owens_wendt_1969"``. The result depends noticeably on the table.

    Returns
    -------
    SurfaceEnergy
        ``total``, ``dispersive``, ``polar`` [N/m] and their uncertainties
        ``total_error``, ``dispersive_error``, ``polar_error`` [N/m]: the
        least-squares covariance of *(x, y)* scaled by the residual variance
        (n - 2 degrees of freedom), propagated to first order. With two
        liquids the uncertainties are NaN (no degrees of freedom). Floats for
        one surface, arrays for a batch. A DataArray gives DataArrays (also
        for one surface) over its other dimensions, with their coordinates,
        named ``surface_energy_total`` ... ``surface_energy_polar_error``,
        with ``attrs["units"] = "N/m"``; a DataFrame gives Series labelled by
        its surfaces' axis, named and with units likewise; a Series gives
        floats.

    Raises
    ------
    WetboilValueError
        Fewer than two liquids; an unknown liquid name (the message lists the
        known ones); angles whose last axis does not match the liquids;
        labelled angles whose labels do not name the liquids one to one (a
        string-labelled last axis with other names, liquid names on an axis
        that misses or repeats some, names on two axes or in two orders along
        one); probe liquids whose components are proportional (they cannot
        separate the dispersive from the polar part).

    Notes
    -----
    *x* and *y* are square roots and cannot be negative. Where the
    unconstrained solution has a negative root the data are not consistent
    with the two-component model; the fit is then repeated with that
    component fixed at zero (non-negative least squares), and that
    component's uncertainty is NaN.

    Angles outside 0-180 make that surface's result NaN, with one
    `InvalidValueWarning` per call. NaN angles (missing data) give NaN
    silently. A liquid at exactly 0 deg spreads: Young's equation holds
    only as an inequality there (the angle says only that the solid's
    energy is high enough for it to spread), so that surface's result is
    computed at the limit of complete wetting, not fitted, and reported
    with a `RangeWarning`. Prefer probe liquids that bead up; Zisman's
    `critical_surface_tension` likewise leaves spreading liquids out of
    its fit.

    The probe-liquid components matter: water 21.8/51.0 with diiodomethane
    50.8/0 (``"default"``) or 49.5/1.3 (``"owens_wendt_1969"``) give
    components of PTFE that differ by about 1 mN/m.

    References
    ----------
    .. [1] D.K. Owens, R.C. Wendt, "Estimation of the surface free energy of
       polymers", J. Appl. Polym. Sci. 13 (1969) 1741-1747,
       doi:10.1002/app.1969.070130815 (bibliographic data and abstract seen).
    .. [2] D.H. Kaelble, J. Adhesion 2 (1970) 66-81 (from memory).

    Examples
    --------
    PTFE with water 108 deg and methylene iodide 88 deg (Owens and Wendt's
    table, recalled from memory: 12.5 + 1.5 = 14.0 mN/m):

    >>> from wetboil.wetting import surface_energy
    >>> s = surface_energy([108.0, 88.0], ["water", "diiodomethane"], table="owens_wendt_1969")
    >>> round(s.dispersive * 1e3, 1), round(s.polar * 1e3, 1), round(s.total * 1e3, 1)
    (12.5, 1.5, 14.0)

    Three liquids, least squares with uncertainties:

    >>> s = surface_energy([72.0, 40.0, 55.0], ["water", "diiodomethane", "formamide"])
    >>> round(s.total * 1e3, 1), round(s.total_error * 1e3, 1)
    (43.0, 4.5)
    """
    function = "wetting.surface_energy"
    liqs, given = _resolve_liquids(liquids, table)
    theta, relabel = _angles_by_liquid(function, contact_angles_deg, given, liqs, table)
    n = len(liqs)
    if theta.ndim == 0 or theta.shape[-1] != n:
        raise WetboilValueError(
            f"{function}: contact_angles_deg must have one angle per liquid along its last axis "
            f"({n} liquids: {[l.name for l in liqs]}), got shape {theta.shape}"
        )
    d = np.array([l.dispersive for l in liqs])
    p = np.array([l.polar for l in liqs])
    M = np.stack([np.sqrt(d), np.sqrt(p)], axis=1)  # (n, 2)
    if np.linalg.matrix_rank(M, tol=1e-9 * float(np.abs(M).max())) < 2:
        raise WetboilValueError(
            f"{function}: the probe liquids {[l.name for l in liqs]} have proportional components and cannot "
            "separate the dispersive from the polar part; use at least one polar and one apolar liquid"
        )

    _question_radians(function, theta, "the fit goes on with them as degrees")
    bad = ~((theta >= 0.0) & (theta <= 180.0)) & ~np.isnan(theta)
    if bad.any():
        report(function, int(theta.size), int(bad.sum()), 0)
    row_bad = bad.any(axis=-1)
    # A liquid at 0 deg spreads: Young's equation then holds only as an inequality (its work of
    # adhesion is at least 2 sigma_lv), so the angle says only that the solid's energy is high enough.
    spread = (theta == 0.0).any(axis=-1) & ~row_bad
    if spread.any():
        report(f"{function}: a probe liquid at 0 deg spreads, where Young's equation is only an inequality "
               "(the result is computed at the limit of complete wetting, not fitted); surfaces",
               int(spread.size), 0, int(spread.sum()))

    b = (d + p) * (1.0 + np.cos(np.radians(theta))) / 2.0  # (..., n)
    # Unconstrained least squares (exact for n = 2).
    MtM_inv = np.linalg.inv(M.T @ M)
    sol = b @ (MtM_inv @ M.T).T  # (..., 2)
    x, y = sol[..., 0], sol[..., 1]

    # Non-negative roots: where a root is negative, refit with it fixed at 0.
    m0, m1 = M[:, 0], M[:, 1]
    x_only = np.maximum(b @ m0 / (m0 @ m0), 0.0)
    y_only = np.maximum(b @ m1 / (m1 @ m1), 0.0)
    rss_x = np.sum((b - x_only[..., None] * m0) ** 2, axis=-1)
    rss_y = np.sum((b - y_only[..., None] * m1) ** 2, axis=-1)
    neg = (x < 0.0) | (y < 0.0)
    use_x = neg & (rss_x <= rss_y)
    use_y = neg & ~use_x
    x = np.where(use_x, x_only, np.where(use_y, 0.0, x))
    y = np.where(use_y, y_only, np.where(use_x, 0.0, y))

    # Uncertainties from the residual variance.
    fitted = x[..., None] * m0 + y[..., None] * m1
    rss = np.sum((b - fitted) ** 2, axis=-1)
    free = np.where(neg, 1, 2)
    dof = n - free
    with np.errstate(divide="ignore", invalid="ignore"):
        s2 = np.where(dof > 0, rss / np.maximum(dof, 1), np.nan)
        var_x = np.where(neg, s2 / (m0 @ m0), s2 * MtM_inv[0, 0])
        var_y = np.where(neg, s2 / (m1 @ m1), s2 * MtM_inv[1, 1])
        cov_xy = np.where(neg, 0.0, s2 * MtM_inv[0, 1])
        var_x = np.where(use_y, np.nan, var_x)
        var_y = np.where(use_x, np.nan, var_y)
        err_d = 2.0 * np.abs(x) * np.sqrt(var_x)
        err_p = 2.0 * np.abs(y) * np.sqrt(var_y)
        var_t = 4.0 * (x**2 * np.nan_to_num(var_x) + y**2 * np.nan_to_num(var_y) + 2.0 * x * y * cov_xy)
        err_t = np.where(np.isnan(s2), np.nan, np.sqrt(np.maximum(var_t, 0.0)))

    sd, sp = x**2, y**2
    outs = [np.where(row_bad, np.nan, o) for o in (sd + sp, sd, sp, err_t, err_d, err_p)]
    if relabel is None:
        t, d_, p_, et, ed, ep = (_out(o) for o in outs)
    else:
        t, d_, p_, et, ed, ep = (relabel(o, f"surface_energy_{f}") for o, f in zip(outs, SurfaceEnergy._fields))
    return SurfaceEnergy(t, d_, p_, et, ed, ep, tuple(l.name for l in liqs))


def split_surface_tension(sigma_lv: Any, like: str = "water", table: str = "default") -> Tuple[Any, Any]:
    r"""Split a liquid's surface tension into dispersive and polar parts in
    the proportions of a tabulated probe liquid at 20 C.

    .. math:: \sigma^d = \sigma\,\frac{\sigma_{20}^d}{\sigma_{20}},\qquad
              \sigma^p = \sigma\,\frac{\sigma_{20}^p}{\sigma_{20}}

    Meant for a working fluid at saturation: ``split_surface_tension(fluid.sigma)``
    gives the components of water at its saturation temperature for
    `predict_angle`.

    Parameters
    ----------
    sigma_lv : array_like
        Total surface tension [N/m] (for example ``Saturation.sigma``). A
        value <= 0 or infinite is impossible (NaN, one warning); one above
        1 N/m, most likely given in mN/m, is split but flagged
        (`RangeWarning`), as the kernels flag it.
    like : str, optional
        Probe liquid whose 20 C proportions are used (default water).
    table : str, optional
        Probe-liquid table (see `probe_liquid`).

    Returns
    -------
    (dispersive, polar) : tuple of float, ndarray, DataArray or Series
        Components [N/m]; DataArrays and Series named ``sigma_dispersive``
        and ``sigma_polar``, with ``attrs["units"] = "N/m"``.

    Notes
    -----
    Keeping the proportion constant is **our assumption**, not a published
    model: the temperature dependence of the components is rarely measured.

    Examples
    --------
    >>> from wetboil.wetting import split_surface_tension
    >>> d, p = split_surface_tension(0.0589)      # water near 100 C
    >>> round(d * 1e3, 2), round(p * 1e3, 2)
    (17.64, 41.26)
    """
    liquid = probe_liquid(like, table)
    s = sigma_lv
    if isinstance(s, Saturation):
        raise WetboilTypeError("split_surface_tension: pass fluid.sigma, not the Saturation itself")
    if s is None or isinstance(s, (str, bytes, bool)):
        raise WetboilTypeError(f"split_surface_tension: sigma_lv must be a number or an array, got {type(s).__name__}")
    if isinstance(s, (int, float)):
        s = float(s)
    elif isinstance(s, (np.ndarray, np.generic)) or not hasattr(s, "dtype"):  # xarray and dask keep their type
        s = _float_array("split_surface_tension", "sigma_lv", s)  # float64: float32, int and object arrays too
    fd, fp = liquid.dispersive / liquid.total, liquid.polar / liquid.total
    if not _is_dask(s):  # a lazy array is checked by the kernels it reaches
        s = _check_tension("split_surface_tension", s)
    return _component(s * fd, "sigma_dispersive"), _component(s * fp, "sigma_polar")


def _component(x: Any, name: str) -> Any:
    """A labelled surface-tension component named after itself with its units, as every kernel's
    result is (the arithmetic above would keep the total's name, and so label both parts alike)."""
    if (_is_xarray(x) and hasattr(x, "name")) or (_is_pandas(x) and x.ndim == 1):
        x = x.rename(name)
    if _is_xarray(x) or _is_pandas(x):
        x.attrs = {"units": "N/m"}
    return x


def _check_tension(function: str, s: Any) -> Any:
    """`s` with impossible surface tensions (negative, zero or infinite) set to NaN, as the kernels
    do, reported by the one policy with the values above 1 N/m (most likely given in mN/m), which
    are kept but warned about like the kernels' range flag."""
    v = np.asarray(getattr(s, "values", s), dtype=np.float64)
    with np.errstate(invalid="ignore"):
        bad = ~(v > 0.0) & ~np.isnan(v) | np.isinf(v)
        high = (v > _TENSION_MAX) & ~np.isinf(v)
    if bad.any() or high.any():
        report(function, int(v.size), int(bad.sum()), int(high.sum()), _TENSION_CLAUSE, "surface tension > 0 N/m")
    if bad.any():
        s = s.where(~bad) if hasattr(s, "where") and not isinstance(s, np.ndarray) else np.where(bad, np.nan, v)
        if isinstance(s, np.ndarray) and s.ndim == 0:
            s = float(s)
    return s


_FOWKES_HYDROCARBONS = (
    "saturated hydrocarbons interact by dispersion forces only, so their surface tension is all dispersive: "
    "F.M. Fowkes, Ind. Eng. Chem. 56(12) (1964) 40-52, doi:10.1021/ie50660a008"
)

#: Dispersive part of a working fluid's surface tension over the total [-],
#: by CoolProp name, for `dispersive_fraction`: water as split by Fowkes
#: (21.8 of 72.8 mN/m at 20 C, the default probe table's water) and the
#: saturated hydrocarbons, which Fowkes treats as dispersion-only (1.0).
#: Other fluids have no tabulated split: give one (``dispersive_fraction=``).
DISPERSIVE_FRACTIONS: Dict[str, Tuple[float, str]] = {
    "Water": (PROBE_LIQUIDS["default"]["water"].dispersive / PROBE_LIQUIDS["default"]["water"].total, _FOWKES_WATER),
    **{name: (1.0, _FOWKES_HYDROCARBONS) for name in (
        "Methane", "Ethane", "n-Propane", "n-Butane", "IsoButane", "n-Pentane", "Isopentane", "Neopentane",
        "n-Hexane", "Isohexane", "n-Heptane", "n-Octane", "n-Nonane", "n-Decane", "n-Undecane", "n-Dodecane",
        "Cyclopentane", "CycloHexane",
    )},
}

# lower-case names without separators -> DISPERSIVE_FRACTIONS key (CoolProp's usual aliases included)
_FRACTION_KEYS = {re.sub(r"[\s_\-]+", "", k.lower()): k for k in DISPERSIVE_FRACTIONS}
# CoolProp's aliases of these fluids (CoolProp.get_fluid_param_string(name, "aliases"), CoolProp 8)
_FRACTION_KEYS.update({re.sub(r"[\s_\-]+", "", alias.lower()): key for key, aliases in {
    "Methane": "CH4 R50 n-C1H4", "Ethane": "R170 n-C2H6", "n-Propane": "Propane R290 C3H8 NC3H8 n-C3H8",
    "n-Butane": "Butane R600 NC4H10 n-C4H10", "IsoButane": "R600a ISOBUTAN", "n-Pentane": "Pentane R601 NC5H12 n-C5H12",
    "Isopentane": "ipentane R601a", "Neopentane": "neopentn", "n-Hexane": "Hexane NC6H14 n-C6H14", "Isohexane": "ihexane",
    "n-Heptane": "Heptane NC7H16 n-C7H16", "n-Octane": "Octane NC8H18 n-C8H18", "n-Nonane": "Nonane NC9H20 n-C9H20",
    "n-Decane": "Decane NC10H22 n-C10H22", "n-Undecane": "Undecane C11 NC11H24 n-C11H24",
    "n-Dodecane": "Dodecane C12 NC12H26 n-C12H26", "Cyclopentane": "CYCLOPEN", "CycloHexane": "CYCLOHEX",
}.items() for alias in aliases.split()})


def dispersive_fraction(fluid: Any) -> float:
    r"""Dispersive part of a working fluid's surface tension over the total
    [-], for predicting its contact angle from a solid's surface energy.

    Parameters
    ----------
    fluid : Saturation or str
        A saturated state (its ``name`` is used) or a fluid name (CoolProp's
        names and aliases, any case).

    Returns
    -------
    float
        :math:`\sigma^d/\sigma` from `DISPERSIVE_FRACTIONS`: 0.299 for water
        (Fowkes' 21.8 of 72.8 mN/m), 1.0 for saturated hydrocarbons.

    Raises
    ------
    WetboilValueError
        A fluid with no tabulated split (refrigerants, alcohols, fluorinated
        liquids...) or a state without a name: the polar part of such a
        fluid is not known here, and guessing it moves the predicted angle
        by tens of degrees. Give the fraction yourself where a split is
        needed (``Surface.angles(fluid, dispersive_fraction=...)``,
        ``sweep(..., dispersive_fraction=...)``).

    Notes
    -----
    The fraction is taken as constant up to the saturation temperature
    (**our assumption**; the components' temperature dependence is rarely
    measured).

    Examples
    --------
    >>> from wetboil.wetting import dispersive_fraction
    >>> round(dispersive_fraction("water"), 4), dispersive_fraction("n-Pentane")
    (0.2995, 1.0)
    """
    name = fluid.name if isinstance(fluid, Saturation) else fluid
    if name is None:
        raise WetboilValueError(
            "wetting.dispersive_fraction: the fluid state has no name, so its surface tension cannot be split; "
            "name it (Saturation(..., name=...)) or give dispersive_fraction=... [0-1]"
        )
    if not isinstance(name, str):
        raise WetboilTypeError(
            f"wetting.dispersive_fraction: fluid must be a Saturation or a fluid name, got {type(fluid).__name__}"
        )
    # CoolProp's fluid strings carry the backend, "HEOS::n-Pentane", as from_coolprop and sweep accept them
    bare = name.rpartition("::")[2] if name.strip().upper().startswith("HEOS::") else name
    key = "Water" if _is_water(bare) else _FRACTION_KEYS.get(re.sub(r"[\s_\-]+", "", bare.strip().lower()))
    if key is None:
        raise WetboilValueError(
            f"wetting.dispersive_fraction: no published dispersive/polar split of the surface tension of {name!r} "
            f"is tabulated (known: water and saturated hydrocarbons, see wetting.DISPERSIVE_FRACTIONS); give "
            "dispersive_fraction=... [0-1], the dispersive part of its surface tension over the total, from a "
            "measurement or the literature"
        )
    return DISPERSIVE_FRACTIONS[key][0]


# -----------------------------------------------------------------------------
# Zisman


class CriticalSurfaceTension(NamedTuple):
    """Zisman's critical surface tension [N/m] with its fit statistics."""

    value: float
    standard_error: float
    r_squared: float
    slope: float
    intercept: float
    n_points: int

    def __repr__(self) -> str:
        return (
            f"CriticalSurfaceTension(value={_pm(self.value, self.standard_error)} mN/m, "
            f"r_squared={self.r_squared:.4f}, n_points={self.n_points})"
        )


def critical_surface_tension(sigma_lv: Any, contact_angle_deg: Any) -> CriticalSurfaceTension:
    r"""Zisman's critical surface tension of wetting of a solid [N/m].

    A straight line is fitted (ordinary least squares) to
    :math:`\cos\theta` against the liquids' surface tension,
    :math:`\cos\theta = 1 - b(\sigma_{lv} - \sigma_c)`; the critical surface
    tension :math:`\sigma_c` is where the line reaches :math:`\cos\theta = 1`.

    Parameters
    ----------
    sigma_lv : array_like
        Surface tensions of the test liquids [N/m], 1-D, > 0 (best a
        homologous series such as the n-alkanes).
    contact_angle_deg : array_like
        Their contact angles on the solid [deg], same shape, 0 to 180.

    Returns
    -------
    CriticalSurfaceTension
        ``value`` [N/m]; ``standard_error`` [N/m] (first-order, from the
        residual variance with n - 2 degrees of freedom; NaN for two points);
        ``r_squared`` of the line; ``slope`` [m/N] (Zisman's b is
        ``-slope``) and ``intercept`` [-]; ``n_points`` used.

    Raises
    ------
    WetboilValueError
        Shapes that differ, fewer than two liquids with a non-zero angle, or a
        tension above 1 N/m (surface tensions given in mN/m).

    Notes
    -----
    Liquids that spread (angle 0) only say that :math:`\sigma_c \ge
    \sigma_{lv}`; they are left out of the fit (``n_points`` counts the ones
    used). Where :math:`\cos\theta` does not fall with :math:`\sigma_{lv}` the
    line never reaches 1 from below and ``value`` is NaN; so is it where the
    line reaches 1 only at a tension <= 0, which no liquid has (``slope``,
    ``intercept`` and ``r_squared`` are still given). Impossible elements
    (angle outside 0-180, tension <= 0) make the result NaN with one
    `InvalidValueWarning`. Angles all at most :math:`\pi` (and not all 0)
    are questioned with one `WetboilWarning` (given in radians?), as in
    `surface_energy`. The critical surface tension depends on the
    liquid series; polar liquids give curved plots (Dann 1970, from an
    abstract).

    References
    ----------
    .. [1] H.W. Fox, W.A. Zisman, "The spreading of liquids on low energy
       surfaces. I. Polytetrafluoroethylene", J. Colloid Sci. 5 (1950)
       514-531, doi:10.1016/0095-8522(50)90044-4.
    .. [2] W.A. Zisman, "Relation of the equilibrium contact angle to liquid
       and solid constitution", Adv. Chem. Ser. 43 (1964) 1-51,
       doi:10.1021/ba-1964-0043.ch001 (title page and abstract seen).

    Examples
    --------
    >>> from wetboil.wetting import critical_surface_tension
    >>> r = critical_surface_tension([0.0240, 0.0254, 0.0276], [35.0, 42.0, 46.0])
    >>> round(r.value * 1e3, 1), r.n_points
    (18.3, 3)
    """
    function = "wetting.critical_surface_tension"
    s = _float_array(function, "sigma_lv", sigma_lv)
    t = _float_array(function, "contact_angle_deg", contact_angle_deg)
    if s.ndim != 1 or s.shape != t.shape:
        raise WetboilValueError(
            f"{function}: sigma_lv and contact_angle_deg must be 1-D of equal length, got shapes {s.shape} and {t.shape}"
        )
    nan_result = CriticalSurfaceTension(math.nan, math.nan, math.nan, math.nan, math.nan, 0)
    _question_radians(function, t, "the fit goes on with them as degrees")
    bad = (~((t >= 0.0) & (t <= 180.0)) & ~np.isnan(t)) | (~(s > 0.0) & ~np.isnan(s)) | np.isinf(s)
    if bad.any():
        report(function, int(s.size), int(bad.sum()), 0)
        return nan_result
    if np.isnan(s).any() or np.isnan(t).any():
        return nan_result
    if (s > _TENSION_MAX).any():
        raise WetboilValueError(
            f"{function}: sigma_lv has values above 1 N/m (largest {float(s.max()):g}); were they given in mN/m? "
            "Surface tensions are in N/m."
        )
    use = t > 0.0
    n = int(use.sum())
    if n < 2:
        raise WetboilValueError(
            f"{function}: needs at least two liquids with a non-zero contact angle to draw the line, got {n}"
        )
    x, y = s[use], np.cos(np.radians(t[use]))
    xm, ym = x.mean(), y.mean()
    sxx = float(np.sum((x - xm) ** 2))
    if sxx == 0.0:
        raise WetboilValueError(f"{function}: the liquids' surface tensions are all equal; no line can be drawn")
    slope = float(np.sum((x - xm) * (y - ym)) / sxx)
    intercept = float(ym - slope * xm)
    resid = y - (intercept + slope * x)
    rss = float(np.sum(resid**2))
    tss = float(np.sum((y - ym) ** 2))
    r2 = 1.0 - rss / tss if tss > 0.0 else math.nan
    if slope >= 0.0:
        return CriticalSurfaceTension(math.nan, math.nan, r2, slope, intercept, n)
    value = (1.0 - intercept) / slope
    if value <= 0.0:
        # the line reaches cos = 1 only at a tension no liquid has: no critical surface tension
        return CriticalSurfaceTension(math.nan, math.nan, r2, slope, intercept, n)
    if n > 2:
        s2 = rss / (n - 2)
        se = math.sqrt(s2 / slope**2 * (1.0 / n + (value - xm) ** 2 / sxx))
    else:
        se = math.nan
    return CriticalSurfaceTension(float(value), float(se), float(r2), slope, intercept, n)


# =============================================================================
# rough and composite surfaces


@kernel("wenzel_angle")
def wenzel(contact_angle_deg: Any, roughness_ratio: Any) -> Any:
    r"""Wenzel apparent contact angle on a rough surface wetted everywhere [deg].

    .. math:: \cos\theta^* = r\cos\theta

    Parameters
    ----------
    contact_angle_deg : array_like
        Young (intrinsic) angle on the smooth material [deg], 0 to 180.
    roughness_ratio : array_like
        :math:`r` = true area / projected area [-], >= 1.

    Returns
    -------
    float, ndarray, DataArray or Series
        Apparent angle [deg]. Where :math:`|r\cos\theta| > 1` it
        **saturates** at 0 deg (the texture wicks the liquid: hemi-wicking,
        see `hemiwicking_angle` for the texture's own threshold) or
        180 deg, and those elements are reported with one `RangeWarning` per
        call: the equation has no solution there and the real surface is in
        another state (a wicked film, or gas trapped under the drop, see
        `cassie_baxter`).

    Notes
    -----
    Roughness makes a wetting liquid (below 90 deg) wet more and a
    non-wetting one wet less. Valid for drops much larger than the roughness
    on chemically homogeneous surfaces. ``roughness_ratio < 1`` or an angle
    outside 0-180 gives NaN and an `InvalidValueWarning`.

    References
    ----------
    .. [1] R.N. Wenzel, "Resistance of solid surfaces to wetting by water",
       Ind. Eng. Chem. 28 (1936) 988-994, doi:10.1021/ie50320a024 (the paper
       was not seen; equation form checked in restatements, bibliographic
       data from memory).

    Examples
    --------
    >>> from wetboil.wetting import wenzel
    >>> round(wenzel(60.0, 1.5), 2), round(wenzel(120.0, 1.5), 2)
    (41.41, 138.59)
    >>> wenzel(75.0, 1.0)                        # r = 1: the intrinsic angle
    75.0
    """


@kernel("cassie_baxter_angle")
def cassie_baxter(contact_angle_deg: Any, solid_fraction: Any, roughness_ratio: Any = 1.0) -> Any:
    r"""Cassie-Baxter apparent contact angle of a drop on a composite
    solid/trapped-gas surface [deg].

    .. math:: \cos\theta^* = r_f\,f\cos\theta + f - 1

    Parameters
    ----------
    contact_angle_deg : array_like
        Young angle on the smooth material [deg], 0 to 180.
    solid_fraction : array_like
        Area fraction :math:`f` of the projected area where the liquid
        touches solid [-], 0 to 1 (the rest is gas, angle 180 deg).
    roughness_ratio : array_like, optional
        Roughness ratio :math:`r_f` of the wetted solid tops [-], >= 1;
        1 (flat tops) by default.

    Returns
    -------
    float, ndarray, DataArray or Series
        Apparent angle [deg]; saturates at 0 / 180 deg, flagged with
        `RangeWarning` as in `wenzel`. An intrinsic angle below 90 deg with
        ``f < 1`` is flagged too (see Notes).

    Notes
    -----
    ``f = 1`` with ``r_f = 1`` gives the intrinsic angle, ``f = 1`` alone is
    Wenzel, ``f = 0`` is a drop resting on gas (180 deg). The equation holds
    while the liquid rests on the texture tops; whether that state or the
    wetted (Wenzel) state is reached depends on how the drop was deposited.
    On a hydrophilic texture (intrinsic angle below 90 deg) the trapped-gas
    state is not the stable one: the liquid fills the texture or wicks into
    it and the surface wets better, not worse (Bico, Thiele & Quere, Colloids
    Surf. A 206 (2002) 41-46, from memory), so the formula's answer there is
    flagged `RangeWarning` (use `wenzel`). At ``f = 1`` no gas is trapped
    and the answer is Wenzel's, so it is not flagged for the angle.
    Milne and Amirfazli (2012) point out that the fractions under the
    contact line, not area averages, are what matter.

    References
    ----------
    .. [1] A.B.D. Cassie, S. Baxter, "Wettability of porous surfaces", Trans.
       Faraday Soc. 40 (1944) 546-551, doi:10.1039/tf9444000546 (not seen;
       bibliographic data from memory).
    .. [2] A.J.B. Milne, A. Amirfazli, "The Cassie equation: how it is meant
       to be used", Adv. Colloid Interface Sci. 170 (2012) 48-55,
       doi:10.1016/j.cis.2011.12.001 (abstract seen; DOI from memory).

    Examples
    --------
    >>> from wetboil.wetting import cassie_baxter
    >>> round(cassie_baxter(110.0, 0.1), 1)         # a superhydrophobic texture
    159.1
    >>> cassie_baxter(110.0, 1.0)                   # f = 1: the intrinsic angle
    110.0
    """


@kernel("hemiwicking_angle")
def hemiwicking_angle(solid_fraction: Any, roughness_ratio: Any) -> Any:
    r"""Hemi-wicking critical angle of a textured surface [deg] (Bico, Thiele
    & Quere 2002).

    .. math:: \cos\theta_c = \frac{1 - \phi_s}{r - \phi_s}

    A liquid whose Young (intrinsic) angle on the material lies **below**
    :math:`\theta_c` wicks into the texture: a film runs ahead of a drop
    through the texture while the tops stay dry, and the drop's apparent
    angle falls towards 0. Above :math:`\theta_c` the texture does not wick
    and `wenzel` (or `cassie_baxter`) gives the apparent angle.

    Parameters
    ----------
    solid_fraction : array_like
        :math:`\phi_s`, fraction of the projected area taken by the texture
        tops, which stay dry [-], 0 <= phi_s < 1.
    roughness_ratio : array_like
        :math:`r` = true area / projected area of the texture [-], >= 1.

    Returns
    -------
    float, ndarray, DataArray or Series
        Critical angle [deg], between 0 (flat, ``r = 1``: only a spreading
        liquid wicks) and 90 (reached only as ``r`` grows without bound: no
        texture makes a hydrophobic material wick).

    Notes
    -----
    A film front that advances by :math:`dx` wets :math:`(r - \phi_s)\,dx`
    of solid and leaves :math:`(1 - \phi_s)\,dx` of free liquid surface
    between the tops; it advances where that lowers the energy, which with
    Young's equation is :math:`\cos\theta > \cos\theta_c`. With no tops
    (:math:`\phi_s = 0`) the threshold is :math:`\cos\theta = 1/r`, where
    Wenzel's angle reaches 0. Wicking textures raise the critical heat flux
    by feeding liquid to the dry spots; this function says whether a texture
    wicks, not how fast (the wicking rate needs the texture's permeability).
    Valid for textures much smaller than the drop and the capillary length,
    with flat tops. ``solid_fraction`` outside [0, 1) or ``roughness_ratio``
    below 1 gives NaN and an `InvalidValueWarning`.

    References
    ----------
    .. [1] J. Bico, C. Thiele, D. Quere, "Wetting of textured surfaces",
       Colloids Surf. A 206 (2002) 41-46, doi:10.1016/S0927-7757(02)00061-4
       (the paper was not seen; criterion and bibliographic data from
       memory, and re-derived from the energy balance in the Notes).

    Examples
    --------
    >>> from wetboil.wetting import hemiwicking_angle, wenzel
    >>> round(hemiwicking_angle(0.25, 2.0), 2)        # pillars: cos = 0.75/1.75
    64.62
    >>> hemiwicking_angle(0.3, 1.0)                   # flat: nothing short of spreading wicks
    0.0
    >>> round(wenzel(hemiwicking_angle(0.0, 1.6), 1.6), 4)   # no tops: Wenzel's 0 deg (acos near 1: ~1e-6)
    0.0
    """


@kernel("impregnated_angle")
def impregnated_angle(contact_angle_deg: Any, solid_fraction: Any, roughness_ratio: Any) -> Any:
    r"""Apparent contact angle on a texture that has wicked [deg] (hemi-wicking,
    Bico, Thiele & Quere 2002): the drop rests on the dry tops and on the
    liquid film that fills the texture between them.

    .. math:: \cos\theta^* = 1 - \phi_s + \phi_s\cos\theta

    Cassie's composite average with the liquid-filled fraction
    :math:`1-\phi_s` at 0 deg (liquid on liquid) and the tops at the
    intrinsic angle :math:`\theta`. It holds where the texture wicks,
    :math:`\theta \le \theta_c` (`hemiwicking_angle`); there `wenzel`
    has no answer on a very rough texture (:math:`r\cos\theta > 1`) and
    `cassie_baxter`'s trapped gas is not the stable state. Above
    :math:`\theta_c` the elements are computed and flagged with a
    `RangeWarning`: use `wenzel` (or `cassie_baxter` on a hydrophobic
    texture). At :math:`\theta_c` the two meet.

    Parameters
    ----------
    contact_angle_deg : array_like
        Intrinsic (Young) angle of the liquid on the material [deg], 0-180.
    solid_fraction : array_like
        :math:`\phi_s`, fraction of the projected area taken by the
        texture tops [-], 0-1 (1: no gaps, the flat material).
    roughness_ratio : array_like
        :math:`r` = true area / projected area of the whole texture [-],
        >= 1; only for the check that the texture wicks.

    Returns
    -------
    float, ndarray, DataArray or Series
        Apparent angle [deg]: at most the intrinsic angle, 0 where there are
        no tops (``solid_fraction = 0``).

    Notes
    -----
    Wicking textures are the laser-textured and micro-pillar surfaces whose
    critical heat flux rises with wicking; the apparent receding angle from
    here can feed `wetboil.chf.kandlikar`, which does not model the wicking
    flow itself. Valid for textures much smaller than the drop and the
    capillary length, with flat tops. Impossible elements (angle outside
    0-180, ``solid_fraction`` outside 0-1, ``roughness_ratio`` below 1)
    give NaN and an `InvalidValueWarning`.

    References
    ----------
    .. [1] J. Bico, C. Thiele, D. Quere, "Wetting of textured surfaces",
       Colloids Surf. A 206 (2002) 41-46, doi:10.1016/S0927-7757(02)00061-4
       (the paper was not seen; form and regime from memory, high
       confidence; the form is Cassie & Baxter's average with liquid in
       place of the trapped gas).

    Examples
    --------
    >>> from wetboil.wetting import impregnated_angle, wenzel
    >>> round(impregnated_angle(50.0, 0.25, 2.0), 1)   # pillars wicking at 50 deg (theta_c = 64.6)
    24.4
    >>> round(impregnated_angle(64.6, 0.25, 2.0), 2), round(wenzel(64.6, 2.0), 2)   # near theta_c: they meet
    (30.99, 30.92)
    >>> impregnated_angle(40.0, 0.0, 1.5)                 # no tops: liquid on liquid
    0.0
    """


# =============================================================================
# hysteresis


@kernel("furmidge_retention_force")
def retention_force(sigma_lv: Any, advancing_deg: Any, receding_deg: Any, width: Any, k: Any = 1.0) -> Any:
    r"""Furmidge retention force of a drop pinned by contact-angle
    hysteresis [N].

    .. math:: F = k\,w\,\sigma_{lv}(\cos\theta_r - \cos\theta_a)

    Parameters
    ----------
    sigma_lv : array_like
        Liquid surface tension [N/m], > 0.
    advancing_deg, receding_deg : array_like
        Advancing and receding angles [deg], 0 to 180, advancing >= receding.
    width : array_like
        Width of the drop's base perpendicular to the motion [m], >= 0.
    k : array_like, optional
        Retention factor [-], > 0: 1 in Furmidge's paper (default); about 1
        to :math:`\pi/2` depending on the contact-line shape (ElSherbini and
        Jacobi 2006).

    Returns
    -------
    float, ndarray, DataArray or Series
        Retention force [N].

    Notes
    -----
    An advancing angle below the receding one is impossible: NaN and an
    `InvalidValueWarning`. No published validity range for the equation
    itself. Neither paper was seen in this work: the equation with k = 1
    and the k range are tagged as seen in secondary sources (an abstract) in
    the project's model catalogue, and are otherwise from memory.

    References
    ----------
    .. [1] C.G.L. Furmidge, "Studies at phase interfaces. I. The sliding of
       liquid drops on solid surfaces and a theory for spray retention", J.
       Colloid Sci. 17 (1962) 309-324, doi:10.1016/0095-8522(62)90011-9
       (title and DOI from memory).
    .. [2] A.I. ElSherbini, A.M. Jacobi, "Retention forces and contact angles
       for critical liquid drops on non-horizontal surfaces", J. Colloid
       Interface Sci. 299 (2006) 841-849, doi:10.1016/j.jcis.2006.02.018
       (DOI from memory).

    Examples
    --------
    >>> from wetboil.wetting import retention_force
    >>> round(retention_force(0.0728, 110.0, 90.0, 2e-3) * 1e6, 1)   # uN
    49.8
    """


@kernel("furmidge_sliding_angle")
def sliding_angle(
    mass: Any, sigma_lv: Any, advancing_deg: Any, receding_deg: Any, width: Any, k: Any = 1.0, g: Any = G
) -> Any:
    r"""Critical tilt [deg] at which a drop starts to slide down a plate
    (Furmidge force balance).

    .. math:: m g \sin\alpha = k\,w\,\sigma_{lv}(\cos\theta_r - \cos\theta_a)

    Parameters
    ----------
    mass : array_like
        Drop mass [kg], > 0.
    sigma_lv : array_like
        Liquid surface tension [N/m], > 0.
    advancing_deg, receding_deg : array_like
        Advancing and receding angles [deg], 0 to 180, advancing >= receding.
    width : array_like
        Width of the drop's base perpendicular to the motion [m], >= 0.
    k : array_like, optional
        Retention factor [-], > 0 (1 by default; see `retention_force`).
    g : array_like, optional
        Acceleration of gravity [m/s2]; standard gravity by default.

    Returns
    -------
    float, ndarray, DataArray or Series
        Tilt from the horizontal [deg] at which the drop slides; 0 without
        hysteresis. **NaN when the drop never slides** (the retention force
        exceeds its weight, :math:`\sin\alpha > 1`, so it clings even to a
        vertical plate). That NaN is the model's answer, not an input error:
        it comes without a warning. Use `retention_force` to tell it from a
        NaN input.

    Notes
    -----
    Impossible input (advancing below receding, mass <= 0...) gives NaN with
    an `InvalidValueWarning`. The base width is taken as given; it changes
    as the plate tilts, so use the width measured at sliding.

    References
    ----------
    See `retention_force`.

    Examples
    --------
    A 20 uL (20 mg) water drop at about 100 deg sits on a base about 3.9 mm
    wide (a spherical cap, worked by hand); with angles 110/90 deg:

    >>> from wetboil.wetting import sliding_angle
    >>> round(sliding_angle(20e-6, 0.0728, 110.0, 90.0, 3.9e-3), 2)
    29.68
    >>> sliding_angle(1e-6, 0.0728, 110.0, 60.0, 1.4e-3)   # a 1 uL drop, 110/60 deg: never slides
    nan
    """


# =============================================================================
# thin films


@kernel("vdw_disjoining_pressure")
def disjoining_pressure(thickness: Any, hamaker: Any) -> Any:
    r"""Non-retarded van der Waals disjoining pressure of a flat film [Pa].

    .. math:: \Pi(\delta) = -\frac{A}{6\pi\delta^3}

    Parameters
    ----------
    thickness : array_like
        Film thickness :math:`\delta` [m], > 0.
    hamaker : array_like
        Effective Hamaker constant :math:`A` of the solid/film/vapour system
        [J]. **Sign convention: A < 0 gives** :math:`\Pi > 0`, a repulsive
        film that thickens (the liquid wets). See `effective_hamaker` to build
        it from the materials' own constants.

    Returns
    -------
    float, ndarray, DataArray or Series
        Disjoining pressure [Pa].

    Notes
    -----
    :math:`\Pi = -dW/d\delta` with the interaction energy per area
    :math:`W = -A/(12\pi\delta^2)` of two half-spaces (Hamaker 1937, seen in
    a secondary source). Thicknesses outside 1-20 nm are flagged
    (`RangeWarning`): below, the film is a few molecules thick; above,
    retardation weakens the force (common practice, from memory). For the
    retarded regime use `power_law_disjoining_pressure` with n = 4.

    References
    ----------
    .. [1] H.C. Hamaker, "The London-van der Waals attraction between
       spherical particles", Physica 4 (1937) 1058-1072,
       doi:10.1016/S0031-8914(37)80203-7.
    .. [2] P.G. de Gennes, "Wetting: statics and dynamics", Rev. Mod. Phys.
       57 (1985) 827-863, doi:10.1103/RevModPhys.57.827.

    Examples
    --------
    >>> from wetboil.wetting import disjoining_pressure
    >>> round(disjoining_pressure(5e-9, -1e-19))      # Pa
    42441
    """


@kernel("power_law_disjoining_pressure")
def power_law_disjoining_pressure(thickness: Any, coefficient: Any, exponent: Any) -> Any:
    r"""General power-law disjoining pressure [Pa].

    .. math:: \Pi(\delta) = \frac{B}{\delta^n}

    Parameters
    ----------
    thickness : array_like
        Film thickness [m], > 0.
    coefficient : array_like
        :math:`B` [Pa m^n]; :math:`B = -A/(6\pi)` reproduces
        `disjoining_pressure` with n = 3.
    exponent : array_like
        :math:`n` [-], > 0: 3 for non-retarded, 4 for fully retarded van der
        Waals films.

    Returns
    -------
    float, ndarray, DataArray or Series
        Disjoining pressure [Pa].

    Notes
    -----
    No validity range of its own: B and n belong to the film model they come
    from.

    References
    ----------
    .. [1] P.G. de Gennes, Rev. Mod. Phys. 57 (1985) 827-863,
       doi:10.1103/RevModPhys.57.827.

    Examples
    --------
    >>> import math
    >>> from wetboil.wetting import power_law_disjoining_pressure
    >>> round(power_law_disjoining_pressure(5e-9, 1e-19 / (6 * math.pi), 3))
    42441
    """


@kernel("vdw_film_thickness")
def film_thickness(height: Any, hamaker: Any, fluid: Saturation, g: Any = G) -> Any:
    r"""Thickness of the wetting film on a vertical wall at height *z* above
    the pool (extended meniscus, non-retarded van der Waals) [m].

    The film's disjoining pressure balances the hydrostatic suction,
    :math:`\Pi(\delta) = (\rho_l-\rho_v) g z`:

    .. math:: \delta(z) = \left[\frac{-A}{6\pi(\rho_l-\rho_v) g z}\right]^{1/3}

    Parameters
    ----------
    height : array_like
        Height above the flat pool surface [m], > 0.
    hamaker : array_like
        Effective Hamaker constant [J], **< 0** for a wetting film (see
        `disjoining_pressure`). With A >= 0 no thick film is stable; the
        element gives NaN and an `InvalidValueWarning`.
    fluid : Saturation
        Uses ``rho_l`` and ``rho_v``.
    g : array_like, optional
        Acceleration of gravity [m/s2]; standard gravity by default.

    Returns
    -------
    float, ndarray, DataArray or Series
        Film thickness [m]. Results outside 1-20 nm are flagged
        (`RangeWarning`): thicker films, found a few centimetres or less
        above the pool, are weakened by retardation and this formula
        overestimates them.

    References
    ----------
    .. [1] P.G. de Gennes, Rev. Mod. Phys. 57 (1985) 827-863,
       doi:10.1103/RevModPhys.57.827 (from memory).

    Examples
    --------
    >>> from wetboil.fluids import Saturation
    >>> from wetboil.wetting import film_thickness
    >>> w = Saturation(T=373.124, p=101325.0, rho_l=958.35, rho_v=0.598, h_lv=2.2564e6, sigma=0.0589)
    >>> round(film_thickness(1.0, -1e-19, w) * 1e9, 2)   # nm, one metre up
    8.27
    """


@kernel("effective_hamaker")
def effective_hamaker(hamaker_solid: Any, hamaker_liquid: Any) -> Any:
    r"""Effective Hamaker constant of a liquid film on a solid, against its
    vapour [J] (combining relation).

    .. math:: A_{SLV} \approx (\sqrt{A_{SS}}-\sqrt{A_{LL}})(\sqrt{A_{VV}}-\sqrt{A_{LL}})
              = A_{LL} - \sqrt{A_{SS}A_{LL}}\quad(A_{VV}\approx 0)

    Parameters
    ----------
    hamaker_solid, hamaker_liquid : array_like
        The materials' own Hamaker constants across vacuum [J], >= 0 (see
        `HAMAKER_CONSTANTS`).

    Returns
    -------
    float, ndarray, DataArray or Series
        Effective constant [J]; negative (a wetting film) when the solid's
        constant exceeds the liquid's.

    Notes
    -----
    An approximation: Hamaker's three-media sum with the geometric-mean
    (Berthelot) rule for the cross constants; expect tens of percent, more
    when the materials' optical properties differ strongly.

    References
    ----------
    .. [1] H.C. Hamaker, "The London-van der Waals attraction between
       spherical particles", Physica 4 (1937) 1058-1072 (the three-media
       sum; from memory).
    .. [2] D. Berthelot, "Sur le mélange des gaz", C. R. Acad. Sci. Paris
       126 (1898) 1703-1706 (the geometric-mean rule for the attraction
       constant of unlike molecules; from memory).

    Examples
    --------
    >>> from wetboil.wetting import effective_hamaker, hamaker_constant
    >>> a = effective_hamaker(hamaker_constant("glass"), hamaker_constant("water"))
    >>> round(a * 1e20, 2)        # water wets glass: A < 0
    -2.07
    """


class HamakerConstant(NamedTuple):
    """A material's Hamaker constant across vacuum [J] and its source."""

    name: str
    value: float
    source: str

    def __repr__(self) -> str:
        return f"HamakerConstant({self.name!r}, {self.value:.3g} J)"


_HOUGH_WHITE = ("D.B. Hough and L.R. White, Adv. Colloid Interface Sci. 14 (1980) 3-41, Lifshitz-theory "
                "values [from memory]")
_HOUGH_WHITE_MED = _HOUGH_WHITE[:-len(" [from memory]")] + " [from memory, medium confidence]"
_PARSEGIAN_WEISS = "V.A. Parsegian and G.H. Weiss, J. Colloid Interface Sci. 81 (1981) 285-289 [from memory]"
_COMMON = "common practice value of colloid-science tables; no original source located"

#: Hamaker constants of materials across vacuum, ``name -> HamakerConstant``
#: (value in J), with their sources: Hough & White's (1980) Lifshitz-theory
#: values for the liquids, polystyrene and PTFE (from memory, rounded to two
#: figures); Parsegian & Weiss (1981) for metals ("metal" is the middle of the
#: range 25-40e-20 J for gold, silver and copper); the paraffin and glass
#: values are common practice with no original located (for fused silica
#: Hough & White give about 6.5e-20 J, from memory; soda-lime glasses are
#: quoted higher).
HAMAKER_CONSTANTS: Dict[str, HamakerConstant] = {
    name: HamakerConstant(name, value, src)
    for name, value, src in [
        ("water", 3.7e-20, _HOUGH_WHITE),
        ("ethanol", 4.2e-20, _HOUGH_WHITE_MED),
        ("n-pentane", 3.8e-20, _HOUGH_WHITE + " (3.75e-20 J)"),
        ("n-decane", 4.8e-20, _HOUGH_WHITE),
        ("n-hexadecane", 5.2e-20, _HOUGH_WHITE),
        ("solid paraffin", 7.1e-20, _COMMON),
        ("polystyrene", 6.5e-20, _HOUGH_WHITE_MED),
        ("glass", 9.0e-20, _COMMON + " (approximate)"),
        ("ptfe", 3.8e-20, _HOUGH_WHITE),
        ("metal", 3.25e-19, _PARSEGIAN_WEISS + "; middle of 25-40e-20 J for Au, Ag, Cu"),
    ]
}


def hamaker_constant(name: str) -> float:
    """A material's Hamaker constant across vacuum [J] from `HAMAKER_CONSTANTS`.

    Parameters
    ----------
    name : str
        Material name (case and repeated spaces are ignored; "hexadecane",
        "decane" and "pentane" are understood).

    Returns
    -------
    float
        Hamaker constant across vacuum [J] (``HAMAKER_CONSTANTS[name].source``
        names where the value comes from).

    Raises
    ------
    WetboilValueError
        Unknown material; the message lists the known names.

    Examples
    --------
    >>> from wetboil.wetting import hamaker_constant
    >>> hamaker_constant("water")
    3.7e-20
    """
    if not isinstance(name, str):
        raise WetboilTypeError(f"hamaker_constant: name must be a string, got {type(name).__name__}")
    key = re.sub(r"\s+", " ", name.strip().lower())
    key = {"hexadecane": "n-hexadecane", "decane": "n-decane", "pentane": "n-pentane"}.get(key, key)
    if key not in HAMAKER_CONSTANTS:
        raise WetboilValueError(f"hamaker_constant: unknown material {name!r}; known: {sorted(HAMAKER_CONSTANTS)}")
    return HAMAKER_CONSTANTS[key].value
