"""Critical heat flux (the peak of the nucleate boiling curve).

.. warning::
   Critical heat flux predictions carry large uncertainty (typically +-20 to
   +-40 % against data for well-characterised surfaces, more for treated or
   aged ones). Use them only inside each correlation's validity range, apply a
   safety margin, and follow the codes and licensed engineering practice that
   govern your application. wetboil does not certify any design.
"""

from __future__ import annotations

import math
from typing import Any

from ._api import kernel
from .fluids import Saturation

__all__ = ["zuber", "kandlikar", "ZUBER_K", "LIENHARD_DHIR_K"]

G = 9.80665
#: Zuber's constant pi/24.
ZUBER_K = math.pi / 24.0
#: Lienhard and Dhir's constant for a large flat heater facing up.
LIENHARD_DHIR_K = 0.149


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
    float or ndarray or DataArray
        Critical heat flux [W/m2].

    Notes
    -----
    Zuber's original carries the factor :math:`[(\rho_l+\rho_v)/\rho_l]^{1/2}`
    (below 0.04 % for water at 1 atm); it is omitted, as in Lienhard and Dhir
    and the later literature. Saturated pool boiling on a large, clean,
    upward-facing heater; the model knows nothing of wettability (see
    `kandlikar`). Constants outside 0.10-0.20 are flagged (`RangeWarning`).

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
    float or ndarray or DataArray
        Critical heat flux [W/m2].

    Notes
    -----
    Published validity: upward-facing heaters, 0 <= phi <= 90 deg. Beyond 90
    deg the value is computed while the bracket stays positive and flagged
    (`RangeWarning`); where :math:`2/\pi + (\pi/4)(1+\cos\beta)\cos\phi \le 0`
    the model has no answer and returns NaN (also flagged). Identities: at
    beta = 0, phi = 0 the constant is :math:`(1/8)(2/\pi+\pi/2)^{1/2} = 0.186`;
    at phi = 90 the orientation term vanishes.

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
