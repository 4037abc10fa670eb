"""Critical heat flux (the peak of the nucleate boiling curve).

.. warning::
   Critical heat flux predictions carry large uncertainty (typically +-20 to
   +-40 % against data for well-characterised surfaces, more for treated or
   aged ones). Use them only inside each correlation's validity range, apply a
   safety margin, and follow the codes and licensed engineering practice that
   govern your application. wetboil does not certify any design.

Models: `zuber` (Kutateladze-Zuber, constant as a parameter), `kandlikar`
(receding contact angle and orientation), `lienhard_dhir` (finite flat
plates, cylinders, spheres), `minimum_heat_flux` (Zuber, Berenson).

Not provided, on purpose: the roughness-augmented CHF of Chu, Enright & Wang
(Appl. Phys. Lett. 100 (2012) 241603) and the wicking-augmented CHF of
Rahman, Olceroglu & McCarthy (Langmuir 30 (2014) 11225). Neither paper's
equations could be read (only abstracts and first pages were reachable), and
the forms in circulation could not be confirmed against the originals, so no
guess is shipped. Kirichenko & Chernyakov's contact-angle form is left out
for the same reason (two restatements disagree on the sign of an exponent).

Scope: these are saturated pool-boiling forms. They do not predict the CHF
of forced flow (departure from nucleate boiling of a fuel rod or a heated
channel): a pool CHF margin is not a flow-boiling margin. Subcooling is not
corrected for (it raises the pool CHF, so saturated values are on the
conservative side). Towards the critical point, where the CHF falls to
zero, the hydrodynamic forms (`zuber`, `kandlikar`, `lienhard_dhir`) are
flagged out of range above rho_v/rho_l = `DENSITY_RATIO_MAX` (0.21; water
above 16.96 MPa), the library's own bound: they take rho_v << rho_l, and the
factor of Zuber's original they omit reaches 10 % there.
"""

from __future__ import annotations

import math
from typing import Any, Dict

import numpy as np

from . import _core
from ._api import _coerce, _is_pandas, _pandas_like, _pandas_values, check_choice, kernel
from ._errors import WetboilTypeError, WetboilValueError
from .fluids import Saturation


def _real(function: str, label: str, value: Any) -> Any:
    """A number, a float64 array or a float64 Series/DataFrame with the same
    labels (xarray and dask objects kept as they are) for arithmetic done
    here in Python, which then matches the ndarray call bit for bit; wrong
    types raise the front door's WetboilTypeError/WetboilValueError."""
    v = _coerce(function, label, value)
    if isinstance(v, np.ndarray):
        return v.astype(np.float64, copy=False)
    if _is_pandas(v):
        return _pandas_like(v, _pandas_values(function, label, v), getattr(v, "name", None))
    return v

__all__ = [
    "zuber",
    "kandlikar",
    "lienhard_dhir",
    "minimum_heat_flux",
    "dimensionless_size",
    "GEOMETRIES",
    "SMALL_PLATE_FORMS",
    "MINIMUM_METHODS",
    "ZUBER_K",
    "LIENHARD_DHIR_K",
    "BERENSON_K",
    "DENSITY_RATIO_MAX",
]

G = 9.80665
#: Zuber's constant pi/24.
ZUBER_K = math.pi / 24.0
#: Lienhard and Dhir's constant for a large flat heater facing up.
LIENHARD_DHIR_K = 0.149
#: Berenson's constant of the minimum film-boiling heat flux (large horizontal plate).
BERENSON_K = 0.09
#: Largest rho_v/rho_l inside the range of the hydrodynamic CHF forms (zuber,
#: kandlikar, lienhard_dhir): the library's own bound, where the factor
#: sqrt((rho_l + rho_v)/rho_l) these forms omit from Zuber's original reaches
#: 1.10. Above it (water above 16.96 MPa, p/p_crit 0.77; refrigerants from
#: about p/p_crit 0.73, cryogens from 0.62-0.69) the CHF is computed and
#: flagged as extrapolation.
DENSITY_RATIO_MAX: float = _core.CHF_DENSITY_RATIO_MAX


@kernel("zuber_chf")
def zuber(fluid: Saturation, K: Any = ZUBER_K, g: Any = G) -> Any:
    r"""Hydrodynamic critical heat flux [W/m2] (Kutateladze-Zuber form).

    .. math:: q''_{max} = K\,h_{lv}\,\rho_v^{1/2}\,[\sigma g(\rho_l-\rho_v)]^{1/4}

    Parameters
    ----------
    fluid : Saturation
        Saturated state; uses ``h_lv``, ``rho_l``, ``rho_v``, ``sigma``.
    K : array_like, optional
        Constant [-]: ``pi/24`` = 0.131 (Zuber 1959, the default),
        ``0.149`` (Lienhard and Dhir 1973, large flat heater facing up,
        dimensionless size L' = L sqrt(g (rho_l - rho_v)/sigma) > 27).
    g : array_like, optional
        Acceleration [m/s2]; standard gravity by default.

    Returns
    -------
    float, ndarray, DataArray or Series
        Critical heat flux [W/m2].

    Notes
    -----
    Zuber's original carries the factor :math:`[(\rho_l+\rho_v)/\rho_l]^{1/2}`;
    it is omitted, as in Lienhard and Dhir and the later literature. It is
    below 0.04 % for water at 1 atm but grows with pressure: 2.4 % for water
    at 7 MPa, 7.7 % at 15 MPa, 10 % for R134a at 3 MPa (CoolProp's saturated
    densities [D]); leaving it out errs low, the conservative side. Saturated pool boiling on a large, clean,
    upward-facing heater; the model knows nothing of wettability (see
    `kandlikar`). Constants outside 0.10-0.20 are flagged (`RangeWarning`),
    and so is rho_v/rho_l above `DENSITY_RATIO_MAX` (near the critical
    point; the library's own bound, see the module notes).

    Caution: CHF correlations scatter by tens of percent; apply margins and
    follow applicable codes.

    References
    ----------
    .. [1] N. Zuber, "Hydrodynamic aspects of boiling heat transfer", AEC
       Report AECU-4439, 1959.
    .. [2] J.H. Lienhard, V.K. Dhir, "Hydrodynamic prediction of peak
       pool-boiling heat fluxes from finite bodies", J. Heat Transfer 95
       (1973) 152-158, doi:10.1115/1.3450013.

    Examples
    --------
    Water at 1 atm with the inputs of a textbook worked example (Incropera
    et al., Fundamentals of Heat and Mass Transfer, 6th ed., Ex. 10.1):

    >>> from wetboil.fluids import Saturation
    >>> from wetboil.chf import zuber
    >>> w = Saturation(T=373.15, p=101325.0, rho_l=957.9, rho_v=0.5955, h_lv=2257e3, sigma=58.9e-3)
    >>> round(zuber(w, K=0.149, g=9.8) / 1e6, 2)   # MW/m2
    1.26
    """


@kernel("kandlikar_chf")
def kandlikar(receding_angle_deg: Any, fluid: Saturation, orientation_deg: Any = 0.0, g: Any = G) -> Any:
    r"""Kandlikar (2001) critical heat flux with receding contact angle and
    heater orientation [W/m2].

    .. math::
        q''_{CHF} = h_{lv}\,\rho_v^{1/2}\,\frac{1+\cos\beta}{16}
        \left[\frac{2}{\pi}+\frac{\pi}{4}(1+\cos\beta)\cos\phi\right]^{1/2}
        [\sigma g(\rho_l-\rho_v)]^{1/4}

    Parameters
    ----------
    receding_angle_deg : array_like
        Receding contact angle :math:`\beta` [deg], through the liquid
        (Kandlikar recommends the dynamic receding angle).
    fluid : Saturation
        Saturated state; uses ``h_lv``, ``rho_l``, ``rho_v``, ``sigma``.
    orientation_deg : array_like, optional
        Heater orientation :math:`\phi` [deg]: 0 horizontal facing up, 90
        vertical, 180 facing down.
    g : array_like, optional
        Acceleration [m/s2]; standard gravity by default.

    Returns
    -------
    float, ndarray, DataArray or Series
        Critical heat flux [W/m2].

    Notes
    -----
    Published validity: upward-facing heaters, 0 <= phi <= 90 deg. Beyond 90
    deg the value is computed while the bracket stays positive and flagged
    (`RangeWarning`); where :math:`2/\pi + (\pi/4)(1+\cos\beta)\cos\phi \le 0`
    the model has no answer and returns NaN (also flagged). Also flagged:
    rho_v/rho_l above `DENSITY_RATIO_MAX` (near the critical point; the
    library's own bound, see the module notes). The receding angle has no
    range check of its own: the factor (1 + cos beta) falls to exactly 0 W/m2
    at 180 deg, and far above 90 deg the value lies below the minimum heat
    flux of the same fluid; a hydrophobic wall is extrapolation. Identities: at
    beta = 0, phi = 0 the constant is :math:`(1/8)(2/\pi+\pi/2)^{1/2} = 0.186`;
    at phi = 90 the orientation term vanishes. At beta = 0 facing up that
    constant is 1.42 times Zuber's pi/24 (0.131), so on a fully wetting
    liquid (fluorinated dielectric coolants, refrigerants, cryogens: a few
    degrees on metals) Kandlikar's CHF, the sweep's default design method,
    is 42 % above Zuber's, while plain surfaces in such liquids measure near
    Zuber's value [from memory, unconfirmed]; compare both (a sweep keeps
    ``chf_zuber``) before trusting the margin. Vertical (phi = 90) it is
    0.76 of Zuber's.

    Verification: the form was checked against a published review's
    transcription (Liang and Mudawar 2018, Int. J. Heat Mass Transfer) and the
    abstract of the original; the paper itself was not available to us.

    Caution: CHF correlations scatter by tens of percent; apply margins and
    follow applicable codes.

    References
    ----------
    .. [1] S.G. Kandlikar, "A theoretical model to predict pool boiling CHF
       incorporating effects of contact angle and orientation", J. Heat
       Transfer 123 (2001) 1071-1079, doi:10.1115/1.1409265.

    Examples
    --------
    >>> from wetboil.fluids import Saturation
    >>> from wetboil.chf import kandlikar
    >>> w = Saturation(T=373.124, p=101325.0, rho_l=958.35, rho_v=0.598, h_lv=2.2564e6, sigma=0.0589)
    >>> round(kandlikar(45.0, w) / 1e6, 3)
    1.27
    >>> kandlikar([10.0, 45.0, 80.0], w, orientation_deg=90.0).round(-3)
    array([838000., 720000., 495000.])
    """


# --------------------------------------------------------------------------- Lienhard & Dhir


#: Geometries of `lienhard_dhir` and their kernel codes.
GEOMETRIES: Dict[str, float] = {"flat_plate": 0.0, "small_flat_plate": 1.0, "cylinder": 2.0, "sphere": 3.0}
#: Small-flat-plate coefficient c in q_max = c K1 scale: Lienhard & Dhir's
#: ratio form 1.14 (pi/24) (2 pi sqrt 3)^2 = 17.67, or the tabulated 18.9.
SMALL_PLATE_FORMS: Dict[str, float] = {
    "lienhard_dhir": 1.14 * (math.pi / 24.0) * 12.0 * math.pi**2,
    "tabulated": 18.9,
}


def _lienhard_dhir_kernel(
    geometry: Any, size: Any, area: Any, small_plate_coefficient: Any, fluid: Saturation, g: Any
) -> Any:
    """Kernel-backed helper of `lienhard_dhir` (geometry as a code)."""


_lienhard_dhir_kernel.__name__ = "lienhard_dhir"
_lienhard_dhir_kernel = kernel("lienhard_dhir_chf")(_lienhard_dhir_kernel)




@kernel("dimensionless_size")
def dimensionless_size(size: Any, fluid: Saturation, g: Any = G) -> Any:
    r"""Dimensionless heater size :math:`L' = L\,[g(\rho_l-\rho_v)/\sigma]^{1/2}` [-],
    the heater size over the capillary length (Lienhard & Dhir's L', R').

    Parameters
    ----------
    size : array_like
        Heater size L [m], >= 0: the width of a plate, the radius of a
        cylinder or sphere (as `lienhard_dhir` takes it).
    fluid : Saturation
        Saturated state; uses ``sigma``, ``rho_l``, ``rho_v``.
    g : array_like, optional
        Acceleration [m/s2]; standard gravity by default.

    Returns
    -------
    float, ndarray, DataArray or Series
        Dimensionless size L' [-].

    Notes
    -----
    A definition, with no validity range of its own: each CHF form of
    `lienhard_dhir` states the L' (or R') it holds for. A negative size,
    ``sigma <= 0``, ``g <= 0`` or ``rho_l <= rho_v`` is impossible: NaN and
    one `InvalidValueWarning` per call, as everywhere.

    References
    ----------
    .. [1] J.H. Lienhard, V.K. Dhir, "Hydrodynamic prediction of peak
       pool-boiling heat fluxes from finite bodies", J. Heat Transfer 95
       (1973) 152-158, doi:10.1115/1.3450013.

    Examples
    --------
    >>> from wetboil.fluids import Saturation
    >>> from wetboil.chf import dimensionless_size
    >>> w = Saturation(T=373.15, p=101325.0, rho_l=957.9, rho_v=0.5955, h_lv=2257e3, sigma=58.9e-3)
    >>> round(dimensionless_size(0.30, w, g=9.8), 1)
    119.7
    """


def lienhard_dhir(
    fluid: Saturation, geometry: str, size: Any, area: Any = None, small_plate: str = "lienhard_dhir", g: Any = G
) -> Any:
    r"""Peak (critical) heat flux of a finite heater, Lienhard & Dhir (1973) [W/m2].

    .. math::
        q''_{max} = F(L')\,\frac{\pi}{24}\,h_{lv}\,\rho_v^{1/2}\,[\sigma g(\rho_l-\rho_v)]^{1/4},
        \qquad L' = L\,\sqrt{g(\rho_l-\rho_v)/\sigma}

    ======================  ==========  ==========================================  ====================
    geometry                size L      F(L')                                       published range
    ======================  ==========  ==========================================  ====================
    ``"flat_plate"``        width       1.14 (K = 0.149), large plate facing up     L' >= 27
    ``"small_flat_plate"``  width       :math:`1.14\,\lambda_d^2/A`, see below     9 <= L' <= 20
    ``"cylinder"``          radius      :math:`0.89 + 2.27\,e^{-3.44\sqrt{L'}}`     R' >= 0.15
    ``"sphere"``            radius      0.84 (R' >= 4.26), :math:`1.734\,R'^{-1/2}`  R' >= 0.15
    ======================  ==========  ==========================================  ====================

    Parameters
    ----------
    fluid : Saturation
        Saturated state; uses ``h_lv``, ``rho_l``, ``rho_v``, ``sigma``.
    geometry : str
        One of `GEOMETRIES`; an unknown name raises `WetboilValueError`
        listing them.
    size : array_like
        Heater width [m] (flat plates) or radius [m] (cylinder, sphere). The
        cylinder is a horizontal one, as Sun & Lienhard's.
    area : array_like, optional
        Heater area A [m2], small flat plate only; default ``size**2``.
    small_plate : str, optional
        Small-plate form (MODELS Q-8, unresolved): ``"lienhard_dhir"``
        (default) is their ratio form :math:`1.14\,\lambda_d^2/A` with
        :math:`\lambda_d = 2\pi\sqrt3\,l_c`, i.e.
        :math:`q = 17.67\,K_1\,h_{lv}\rho_v^{1/2}[\sigma g\Delta\rho]^{1/4}`,
        :math:`K_1 = \sigma/(g\Delta\rho A)`; ``"tabulated"`` uses 18.9
        :math:`K_1` as tabulated in restatements (7 % higher). The definition
        of :math:`\lambda_d` in the original was not read; both are kept.
    g : array_like, optional
        Acceleration [m/s2]; standard gravity by default.

    Returns
    -------
    float, ndarray, DataArray or Series
        Critical heat flux [W/m2]. Sizes outside the published range, and
        states with rho_v/rho_l above `DENSITY_RATIO_MAX` (near the
        critical point), are computed and flagged (`RangeWarning`).

    Notes
    -----
    Saturated pool boiling of clean, well-wetted heaters; no wettability
    effect (compare `kandlikar`). The large-cylinder (0.90) and small-cylinder
    (0.94 R'^(-1/4)) forms in circulation approximate the Sun-Lienhard
    expression used here. With :math:`A = L^2` the small-plate form is
    :math:`F = 1.14 \cdot 12\pi^2/L'^2 = 135/L'^2` [D]: above the large
    plate's 1.14 only for :math:`L' < 10.9` (one Taylor cell,
    :math:`A < \lambda_d^2`), 0.34 at the published end :math:`L' = 20`. That
    low end is the form as stated, kept and not flagged (it is the
    conservative side); a heater that holds several cells is nearer the
    large-plate value. Verification: the cylinder form is [V2] (two
    transcribed textbook examples); 0.149 is [V] in textbook worked examples;
    the small-plate and sphere forms and all ranges are [M, high]; the
    original paper was not read.

    Caution: CHF correlations scatter by tens of percent; apply margins and
    follow applicable codes.

    References
    ----------
    .. [1] J.H. Lienhard, V.K. Dhir, "Hydrodynamic prediction of peak
       pool-boiling heat fluxes from finite bodies", J. Heat Transfer 95
       (1973) 152-158, doi:10.1115/1.3450013.
    .. [2] K.H. Sun, J.H. Lienhard, "The peak pool boiling heat flux on
       horizontal cylinders", Int. J. Heat Mass Transfer 13 (1970) 1425-1439.

    Examples
    --------
    >>> from wetboil.fluids import Saturation
    >>> from wetboil.chf import lienhard_dhir
    >>> w = Saturation(T=373.15, p=101325.0, rho_l=957.9, rho_v=0.5955, h_lv=2257e3, sigma=58.9e-3)
    >>> round(lienhard_dhir(w, "flat_plate", 0.30, g=9.8) / 1e6, 2)    # MW/m2
    1.26
    >>> round(lienhard_dhir(w, "cylinder", 0.5e-3, g=9.8) / 1e6, 2)   # thin wire
    1.52
    >>> lienhard_dhir(w, "cone", 0.01)
    Traceback (most recent call last):
    ...
    wetboil._errors.WetboilValueError: chf.lienhard_dhir: unknown geometry 'cone'; choices are flat_plate, small_flat_plate, cylinder, sphere
    """
    code = GEOMETRIES[check_choice("chf.lienhard_dhir", "geometry", geometry, GEOMETRIES)]
    coefficient = SMALL_PLATE_FORMS[check_choice("chf.lienhard_dhir", "small_plate form", small_plate, SMALL_PLATE_FORMS)]
    if area is None:
        size = _real("chf.lienhard_dhir", "size", size)
        with np.errstate(over="ignore"):  # an absurd size overflows to inf: the kernel flags that element
            area = size * size if code == GEOMETRIES["small_flat_plate"] else 1.0
    elif code != GEOMETRIES["small_flat_plate"]:
        raise WetboilValueError(f"chf.lienhard_dhir: area is used by the small_flat_plate geometry only, "
                                f"not by {geometry!r} (its size alone sets the heat flux)")
    return _lienhard_dhir_kernel(code, size, area, coefficient, fluid, g)


# --------------------------------------------------------------------------- minimum heat flux

#: Methods of `minimum_heat_flux` and their constants.
MINIMUM_METHODS: Dict[str, float] = {"berenson": BERENSON_K, "zuber": ZUBER_K}


def _minimum_kernel(C: Any, fluid: Saturation, g: Any) -> Any:
    """Kernel-backed helper of `minimum_heat_flux`."""


_minimum_kernel.__name__ = "minimum_heat_flux"
_minimum_kernel = kernel("minimum_heat_flux")(_minimum_kernel)


def minimum_heat_flux(fluid: Saturation, method: str = "berenson", g: Any = G) -> Any:
    r"""Minimum film-boiling heat flux (the Leidenfrost point) [W/m2].

    .. math::
        q''_{min} = C\,\rho_v\,h_{lv}\left[\frac{\sigma g(\rho_l-\rho_v)}{(\rho_l+\rho_v)^2}\right]^{1/4}

    ===================  ==========  ==============================================
    method               C           source
    ===================  ==========  ==============================================
    ``"berenson"``       0.09        Berenson (1961), large horizontal plate, +-50 %
    ``"zuber"``          pi/24       Zuber (1959), Taylor instability of the film
    ===================  ==========  ==============================================

    Parameters
    ----------
    fluid : Saturation
        Saturated state; uses ``h_lv``, ``rho_l``, ``rho_v``, ``sigma``.
    method : str, optional
        One of `MINIMUM_METHODS`; an unknown name raises `WetboilValueError`.
    g : array_like, optional
        Acceleration [m/s2]; standard gravity by default.

    Returns
    -------
    float, ndarray, DataArray or Series
        Minimum heat flux [W/m2].

    Notes
    -----
    For large horizontal upward-facing heaters; the Leidenfrost point is
    strongly affected by surface condition, so treat it as an estimate.
    Verification: the form and C = 0.09 are [V2] (transcribed textbook
    example; MODELS D8); the originals were not read. No published worked
    example of q_min was found; the tests check the form and a derived value.

    References
    ----------
    .. [1] N. Zuber, "Hydrodynamic aspects of boiling heat transfer", AEC
       Report AECU-4439, 1959.
    .. [2] P.J. Berenson, "Film-boiling heat transfer from a horizontal
       surface", J. Heat Transfer 83 (1961) 351-358, doi:10.1115/1.3682280
       (DOI from memory).

    Examples
    --------
    >>> from wetboil.fluids import Saturation
    >>> from wetboil.chf import minimum_heat_flux
    >>> w = Saturation(T=373.15, p=101325.0, rho_l=957.9, rho_v=0.5955, h_lv=2257e3, sigma=58.9e-3)
    >>> round(minimum_heat_flux(w, g=9.8) / 1e3, 1)              # kW/m2
    18.9
    >>> round(minimum_heat_flux(w, method="zuber", g=9.8) / 1e3, 1)
    27.6
    """
    C = MINIMUM_METHODS[check_choice("chf.minimum_heat_flux", "method", method, MINIMUM_METHODS)]
    return _minimum_kernel(C, fluid, g)
