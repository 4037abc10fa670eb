"""Bubble departure diameter and frequency."""

from __future__ import annotations

from typing import Any

from ._api import kernel
from .fluids import Saturation

__all__ = ["fritz"]

G = 9.80665


@kernel("fritz_departure")
def fritz(contact_angle_deg: Any, fluid: Saturation, g: Any = G) -> Any:
    r"""Fritz (1935) bubble departure diameter [m].

    .. math:: D_d = 0.0208\,\theta\,\sqrt{\frac{\sigma}{g(\rho_l-\rho_v)}}

    with the static contact angle :math:`\theta` in **degrees**, measured
    through the liquid (equivalently :math:`1.1918\,\theta_{rad}\,l_c`, with
    :math:`l_c` the capillary length).

    Parameters
    ----------
    contact_angle_deg : array_like
        Static contact angle [deg], 0 to 180.
    fluid : Saturation
        Saturated state; uses ``sigma``, ``rho_l``, ``rho_v``.
    g : array_like, optional
        Acceleration normal to the wall [m/s2]; standard gravity by default.

    Returns
    -------
    float or ndarray or DataArray
        Departure diameter [m].

    Notes
    -----
    Fritz fitted the maximum volume of a *static* bubble on an upward-facing
    horizontal wall; with real boiling use the dynamic (advancing) angle, as
    Han and Griffith (1965) recommend. Results are flagged (`RangeWarning`)
    above 90 deg, where boiling data to support the static fit are scarce
    (our own flag, not a published limit).

    Three forms of the constant circulate: 0.0208 per degree with
    :math:`\sqrt{\sigma/g\Delta\rho}` (used here, the most cited), and
    0.0148 per degree (= 0.851 per radian) with :math:`\sqrt{2\sigma/g\Delta\rho}`;
    they differ by 0.6 %. Fritz's original paper was not available to us; the
    choice follows the common restatement and is marked unverified in
    `wetboil.models()`.

    Impossible elements (angle outside 0-180, sigma <= 0, rho_l <= rho_v,
    g <= 0) give NaN and one `InvalidValueWarning` per call.

    References
    ----------
    .. [1] W. Fritz, "Berechnung des Maximalvolumens von Dampfblasen",
       Physikalische Zeitschrift 36 (1935) 379-384.
    .. [2] Y.Y. Han, P. Griffith, "The mechanism of heat transfer in
       nucleate pool boiling - Part I", Int. J. Heat Mass Transfer 8 (1965)
       887-904, doi:10.1016/0017-9310(65)90073-2 (bibliographic data from
       memory).

    Examples
    --------
    >>> from wetboil.fluids import Saturation
    >>> from wetboil.departure import fritz
    >>> water = Saturation(T=373.124, p=101325.0, rho_l=958.35, rho_v=0.598, h_lv=2.2564e6, sigma=0.0589)
    >>> round(fritz(45.0, water) * 1e3, 3)   # mm
    2.344
    >>> fritz([0.0, 45.0, 90.0], water).round(5)
    array([0.     , 0.00234, 0.00469])
    """
