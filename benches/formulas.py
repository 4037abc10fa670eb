"""Every kernel's formula written a second time, by hand, the way a user would
write it without wetboil: as NumPy expressions (the baseline of the array
benchmarks) and with Python's ``math`` module (the baseline of the scalar-call
benchmarks).

Each function takes the kernel's inputs in kernel order, fluid fields
expanded (``wetboil.model_of(f).inputs``), and returns the kernel's outputs (a
tuple when there are several). They do what the published equation says and
nothing more: no validity checks, no range flags, no NaN policy; that is work
wetboil does and the baselines do not. Conditionals that belong to the model
(a branch of a piecewise correlation, the saturation of an angle) are written
with ``np.where``/``np.clip`` and ``if``/``min``/``max`` as a user would.

`benches/run.py` checks that both versions agree with wetboil on physical
inputs before it times anything, and `tests/test_bench_formulas.py` runs the
same check at small size under the test command, so a baseline cannot drift
away from the kernel it is compared with.

Kernels without a closed form (an implicit equation solved by iteration, a
force balance searched over the bubble's growth) are listed in
`NOT_COMPARED` with the reason.
"""

from __future__ import annotations

import math
from typing import Callable, Dict

import numpy as np

#: kernel name -> NumPy version of its formula
NUMPY: Dict[str, Callable[..., object]] = {}
#: kernel name -> pure-Python (math module) version of its formula
PYTHON: Dict[str, Callable[..., object]] = {}
#: kernel name -> why it has no hand-written baseline here
NOT_COMPARED: Dict[str, str] = {
    "water_saturation_t": "IAPWS property releases, not a formula: section 5 compares water() with CoolProp",
    "water_saturation_p": "IAPWS property releases, not a formula: section 5 compares water() with CoolProp",
    "water_screening_chain": "a chain of other kernels: section 2 compares it with NumPy plus CoolProp",
}


def numpy_form(kernel: str) -> Callable[[Callable[..., object]], Callable[..., object]]:
    def register(fn: Callable[..., object]) -> Callable[..., object]:
        assert kernel not in NUMPY, kernel
        NUMPY[kernel] = fn
        return fn

    return register


def python_form(kernel: str) -> Callable[[Callable[..., object]], Callable[..., object]]:
    def register(fn: Callable[..., object]) -> Callable[..., object]:
        assert kernel not in PYTHON, kernel
        PYTHON[kernel] = fn
        return fn

    return register


# =============================================================================
# departure


@numpy_form("fritz_departure")
def _(theta, sigma, rho_l, rho_v, g):
    return 0.0208 * theta * np.sqrt(sigma / (g * (rho_l - rho_v)))


@python_form("fritz_departure")
def _(theta, sigma, rho_l, rho_v, g):
    return 0.0208 * theta * math.sqrt(sigma / (g * (rho_l - rho_v)))


# =============================================================================
# critical heat flux


@numpy_form("kandlikar_chf")
def _(beta, phi, h_lv, rho_l, rho_v, sigma, g):
    c = 1 + np.cos(np.radians(beta))
    return h_lv * np.sqrt(rho_v) * c / 16 * np.sqrt(2 / np.pi + np.pi / 4 * c * np.cos(np.radians(phi))) \
        * (sigma * g * (rho_l - rho_v)) ** 0.25


@python_form("kandlikar_chf")
def _(beta, phi, h_lv, rho_l, rho_v, sigma, g):
    c = 1 + math.cos(math.radians(beta))
    return h_lv * math.sqrt(rho_v) * c / 16 * math.sqrt(2 / math.pi + math.pi / 4 * c * math.cos(math.radians(phi))) \
        * (sigma * g * (rho_l - rho_v)) ** 0.25


# #############################################################################
# wetting

# Hand-written baselines of the wetting kernels (conventions in formulas.py):
# the published equation as a user would write it without wetboil, with the
# model's own saturation of an angle (cos clipped to [-1, 1]) and the sliding
# angle's "never slides" NaN, and nothing else.


# =============================================================================
# Young's equation, spreading, adhesion


@numpy_form("young_angle")
def _(sigma_sv, sigma_sl, sigma_lv):
    return np.degrees(np.arccos(np.clip((sigma_sv - sigma_sl) / sigma_lv, -1, 1)))


@python_form("young_angle")
def _(sigma_sv, sigma_sl, sigma_lv):
    return math.degrees(math.acos(max(-1.0, min(1.0, (sigma_sv - sigma_sl) / sigma_lv))))


@numpy_form("spreading_coefficient")
def _(sigma_sv, sigma_sl, sigma_lv):
    return sigma_sv - sigma_sl - sigma_lv


@python_form("spreading_coefficient")
def _(sigma_sv, sigma_sl, sigma_lv):
    return sigma_sv - sigma_sl - sigma_lv


@numpy_form("young_dupre_adhesion_work")
def _(sigma_lv, theta):
    return sigma_lv * (1 + np.cos(np.radians(theta)))


@python_form("young_dupre_adhesion_work")
def _(sigma_lv, theta):
    return sigma_lv * (1 + math.cos(math.radians(theta)))


# =============================================================================
# surface-energy components


@numpy_form("girifalco_good")
def _(sigma_s, sigma_l, phi):
    return sigma_s + sigma_l - 2 * phi * np.sqrt(sigma_s * sigma_l)


@python_form("girifalco_good")
def _(sigma_s, sigma_l, phi):
    return sigma_s + sigma_l - 2 * phi * math.sqrt(sigma_s * sigma_l)


@numpy_form("owrk_angle")
def _(s_d, s_p, l_d, l_p):
    c = 2 * (np.sqrt(s_d * l_d) + np.sqrt(s_p * l_p)) / (l_d + l_p) - 1
    return np.degrees(np.arccos(np.clip(c, -1, 1)))


@python_form("owrk_angle")
def _(s_d, s_p, l_d, l_p):
    c = 2 * (math.sqrt(s_d * l_d) + math.sqrt(s_p * l_p)) / (l_d + l_p) - 1
    return math.degrees(math.acos(max(-1.0, min(1.0, c))))


# =============================================================================
# rough and composite surfaces


@numpy_form("wenzel_angle")
def _(theta, r):
    return np.degrees(np.arccos(np.clip(r * np.cos(np.radians(theta)), -1, 1)))


@python_form("wenzel_angle")
def _(theta, r):
    return math.degrees(math.acos(max(-1.0, min(1.0, r * math.cos(math.radians(theta))))))


@numpy_form("cassie_baxter_angle")
def _(theta, f, r):
    c = r * f * np.cos(np.radians(theta)) + f - 1
    return np.degrees(np.arccos(np.clip(c, -1, 1)))


@python_form("cassie_baxter_angle")
def _(theta, f, r):
    c = r * f * math.cos(math.radians(theta)) + f - 1
    return math.degrees(math.acos(max(-1.0, min(1.0, c))))


@numpy_form("hemiwicking_angle")
def _(f, r):
    return np.degrees(np.arccos(np.clip((1 - f) / (r - f), -1, 1)))


@python_form("hemiwicking_angle")
def _(f, r):
    return math.degrees(math.acos(max(-1.0, min(1.0, (1 - f) / (r - f)))))


@numpy_form("impregnated_angle")
def _(theta, f, r):
    return np.degrees(np.arccos(1 - f + f * np.cos(np.radians(theta))))


@python_form("impregnated_angle")
def _(theta, f, r):
    return math.degrees(math.acos(1 - f + f * math.cos(math.radians(theta))))


# =============================================================================
# contact-angle hysteresis (Furmidge)


@numpy_form("furmidge_retention_force")
def _(sigma_lv, advancing, receding, width, k):
    return k * width * sigma_lv * (np.cos(np.radians(receding)) - np.cos(np.radians(advancing)))


@python_form("furmidge_retention_force")
def _(sigma_lv, advancing, receding, width, k):
    return k * width * sigma_lv * (math.cos(math.radians(receding)) - math.cos(math.radians(advancing)))


@numpy_form("furmidge_sliding_angle")
def _(mass, sigma_lv, advancing, receding, width, k, g):
    s = k * width * sigma_lv * (np.cos(np.radians(receding)) - np.cos(np.radians(advancing))) / (mass * g)
    return np.degrees(np.arcsin(s))  # NaN where sin > 1: the drop never slides


@python_form("furmidge_sliding_angle")
def _(mass, sigma_lv, advancing, receding, width, k, g):
    s = k * width * sigma_lv * (math.cos(math.radians(receding)) - math.cos(math.radians(advancing))) / (mass * g)
    return math.degrees(math.asin(s)) if s <= 1 else math.nan  # never slides


# =============================================================================
# thin films


@numpy_form("vdw_disjoining_pressure")
def _(thickness, hamaker):
    return -hamaker / (6 * np.pi * thickness**3)


@python_form("vdw_disjoining_pressure")
def _(thickness, hamaker):
    return -hamaker / (6 * math.pi * thickness**3)


@numpy_form("power_law_disjoining_pressure")
def _(thickness, coefficient, exponent):
    return coefficient / thickness**exponent


@python_form("power_law_disjoining_pressure")
def _(thickness, coefficient, exponent):
    return coefficient / thickness**exponent


@numpy_form("vdw_film_thickness")
def _(height, hamaker, rho_l, rho_v, g):
    return np.cbrt(-hamaker / (6 * np.pi * (rho_l - rho_v) * g * height))


@python_form("vdw_film_thickness")
def _(height, hamaker, rho_l, rho_v, g):
    return math.cbrt(-hamaker / (6 * math.pi * (rho_l - rho_v) * g * height))


@numpy_form("effective_hamaker")
def _(hamaker_solid, hamaker_liquid):
    return hamaker_liquid - np.sqrt(hamaker_solid * hamaker_liquid)


@python_form("effective_hamaker")
def _(hamaker_solid, hamaker_liquid):
    return hamaker_liquid - math.sqrt(hamaker_solid * hamaker_liquid)


# #############################################################################
# nucleation

# Hand-written baselines of the nucleation kernels (vapour embryos, nucleation
# barrier, vapour trapping, onset of boiling, active site density): the
# published equations as a user would write them without wetboil, in NumPy and
# with Python's math module. Same conventions as formulas.py: kernel inputs in
# kernel order (fluid fields expanded), kernel outputs returned in kernel order,
# no validity checks and no NaN policy.

NOT_COMPARED["kinetic_superheat_water"] = (
    "implicit in T: the nucleation rate needs IAPWS sigma, p_sat and the metastable liquid density at every iterate"
)
NOT_COMPARED["homogeneous_superheat_water"] = (
    "implicit in T: the nucleation rate needs IAPWS sigma, p_sat and the metastable liquid density at every iterate"
)


# =============================================================================
# vapour embryos


@numpy_form("embryo_superheat_linear")
def _(radius, sigma, T, rho_l, rho_v, h_lv):
    return 2 * sigma * T * (1 / rho_v - 1 / rho_l) / (h_lv * radius)


@python_form("embryo_superheat_linear")
def _(radius, sigma, T, rho_l, rho_v, h_lv):
    return 2 * sigma * T * (1 / rho_v - 1 / rho_l) / (h_lv * radius)


@numpy_form("embryo_radius_linear")
def _(superheat, sigma, T, rho_l, rho_v, h_lv):
    return 2 * sigma * T * (1 / rho_v - 1 / rho_l) / (h_lv * superheat)


@python_form("embryo_radius_linear")
def _(superheat, sigma, T, rho_l, rho_v, h_lv):
    return 2 * sigma * T * (1 / rho_v - 1 / rho_l) / (h_lv * superheat)


# Integrated Clausius-Clapeyron line with the Poynting term, solved by Newton's
# method for z = ln(P/p), P = p_sat(T_l):
#   z - ln(1 + 2 sigma/(p r)) - (P - p)/(rho_l R_v T_l) = 0,
#   1/T_l = 1/T_sat - k z, k = R_s/h_lv = p v_lv/(T_sat h_lv), R_v = p/(rho_v T_sat),
# so (P - p)/(rho_l R_v T_l) = a (e^z - 1)/T_l with a = rho_v T_sat/rho_l.
# Started at z = ln(p_v/p), the left of the root of an increasing concave function.
# A fixed step count: for water from 273.16 to 640 K and radii 1e-8 to 1e-4 m three
# steps already agree with wetboil to 1e-15 (two to 4e-10); the fourth is margin.
EMBRYO_NEWTON_STEPS = 4


@numpy_form("embryo_superheat_exact")
def _(radius, sigma, T, p, rho_l, rho_v, h_lv):
    k = p * (1 / rho_v - 1 / rho_l) / (T * h_lv)
    a = rho_v * T / rho_l
    z_v = np.log1p(2 * sigma / (p * radius))
    z = z_v
    for _ in range(EMBRYO_NEWTON_STEPS):
        inv_t = 1 / T - k * z
        em1 = np.expm1(z)
        f = z - z_v - a * em1 * inv_t
        df = 1 - a * (em1 + 1) * inv_t + a * em1 * k
        z = z - f / df
    u = k * z * T  # 1 - T_sat/T_l
    return T * u / (1 - u)


@python_form("embryo_superheat_exact")
def _(radius, sigma, T, p, rho_l, rho_v, h_lv):
    k = p * (1 / rho_v - 1 / rho_l) / (T * h_lv)
    a = rho_v * T / rho_l
    z_v = math.log1p(2 * sigma / (p * radius))
    z = z_v
    for _ in range(EMBRYO_NEWTON_STEPS):
        inv_t = 1 / T - k * z
        em1 = math.expm1(z)
        f = z - z_v - a * em1 * inv_t
        df = 1 - a * (em1 + 1) * inv_t + a * em1 * k
        z -= f / df
    u = k * z * T  # 1 - T_sat/T_l
    return T * u / (1 - u)


# =============================================================================
# nucleation barrier and vapour trapping


@numpy_form("nucleation_barrier_factor")
def _(contact_angle_deg):
    c = np.cos(np.radians(contact_angle_deg))
    return (2 - c) * (1 + c) ** 2 / 4


@python_form("nucleation_barrier_factor")
def _(contact_angle_deg):
    c = math.cos(math.radians(contact_angle_deg))
    return (2 - c) * (1 + c) ** 2 / 4


@numpy_form("bankoff_trapping")
def _(cavity_half_angle_deg, advancing_deg):
    return np.where(advancing_deg > 2 * cavity_half_angle_deg, 1.0, 0.0)


@python_form("bankoff_trapping")
def _(cavity_half_angle_deg, advancing_deg):
    return 1.0 if advancing_deg > 2 * cavity_half_angle_deg else 0.0


# =============================================================================
# Hsu's range of active cavities and the onset of boiling


@numpy_form("hsu_active_radii")
def _(wall_superheat, sigma, T, rho_l, rho_v, h_lv, contact_angle_deg, thermal_layer, subcooling):
    t = np.radians(contact_angle_deg)
    c1 = (1 + np.cos(t)) / np.sin(t)
    c3 = 1 + np.cos(t)
    zeta = 2 * sigma * T / (rho_v * h_lv)  # Hsu's 1/rho_v form
    theta_w = wall_superheat + subcooling
    a = wall_superheat / theta_w
    root = np.sqrt(a**2 - 4 * zeta * c3 / (thermal_layer * theta_w))  # NaN: no active cavity
    r_max = thermal_layer / (2 * c1) * (a + root)
    # r_min from the product of the roots, not (a - root): that difference cancels
    return thermal_layer * zeta * c3 / (c1**2 * theta_w * r_max), r_max


@python_form("hsu_active_radii")
def _(wall_superheat, sigma, T, rho_l, rho_v, h_lv, contact_angle_deg, thermal_layer, subcooling):
    t = math.radians(contact_angle_deg)
    c1 = (1 + math.cos(t)) / math.sin(t)
    c3 = 1 + math.cos(t)
    zeta = 2 * sigma * T / (rho_v * h_lv)  # Hsu's 1/rho_v form
    theta_w = wall_superheat + subcooling
    a = wall_superheat / theta_w
    d = a**2 - 4 * zeta * c3 / (thermal_layer * theta_w)
    if d < 0:
        return math.nan, math.nan  # no active cavity
    r_max = thermal_layer / (2 * c1) * (a + math.sqrt(d))
    # r_min from the product of the roots, not (a - root): that difference cancels
    return thermal_layer * zeta * c3 / (c1**2 * theta_w * r_max), r_max


@numpy_form("hsu_onset")
def _(heat_flux, sigma, T, rho_l, rho_v, h_lv, k_l, contact_angle_deg):
    t = np.radians(contact_angle_deg)
    zeta = 2 * sigma * T / (rho_v * h_lv)  # Hsu's 1/rho_v form
    return np.sqrt(4 * (1 + np.cos(t)) * zeta * heat_flux / k_l), np.sin(t / 2) * np.sqrt(2 * zeta * k_l / heat_flux)


@python_form("hsu_onset")
def _(heat_flux, sigma, T, rho_l, rho_v, h_lv, k_l, contact_angle_deg):
    t = math.radians(contact_angle_deg)
    zeta = 2 * sigma * T / (rho_v * h_lv)  # Hsu's 1/rho_v form
    return math.sqrt(4 * (1 + math.cos(t)) * zeta * heat_flux / k_l), math.sin(t / 2) * math.sqrt(2 * zeta * k_l / heat_flux)


@numpy_form("davis_anderson_onset")
def _(heat_flux, sigma, T, rho_l, rho_v, h_lv, k_l):
    g = sigma * T * (1 / rho_v - 1 / rho_l) / h_lv
    return np.sqrt(8 * g * heat_flux / k_l), np.sqrt(2 * g * k_l / heat_flux)


@python_form("davis_anderson_onset")
def _(heat_flux, sigma, T, rho_l, rho_v, h_lv, k_l):
    g = sigma * T * (1 / rho_v - 1 / rho_l) / h_lv
    return math.sqrt(8 * g * heat_flux / k_l), math.sqrt(2 * g * k_l / heat_flux)


@numpy_form("kandlikar_onset")
def _(heat_flux, sigma, T, rho_l, rho_v, h_lv, k_l, contact_angle_deg):
    dT = np.sqrt(8.8 * sigma * T * heat_flux / (rho_v * h_lv * k_l))
    return dT, np.sin(np.radians(contact_angle_deg)) * k_l * dT / (2.2 * heat_flux)


@python_form("kandlikar_onset")
def _(heat_flux, sigma, T, rho_l, rho_v, h_lv, k_l, contact_angle_deg):
    dT = math.sqrt(8.8 * sigma * T * heat_flux / (rho_v * h_lv * k_l))
    return dT, math.sin(math.radians(contact_angle_deg)) * k_l * dT / (2.2 * heat_flux)


@numpy_form("bergles_rohsenow_onset")
def _(heat_flux, p):
    p_bar = p / 1e5
    return (heat_flux / (1082 * p_bar**1.156)) ** (p_bar**0.0234 / 2.16) / 1.8


@python_form("bergles_rohsenow_onset")
def _(heat_flux, p):
    p_bar = p / 1e5
    return (heat_flux / (1082 * p_bar**1.156)) ** (p_bar**0.0234 / 2.16) / 1.8


# =============================================================================
# active nucleation site density


@numpy_form("wang_dhir_site_density")
def _(wall_superheat, sigma, T, rho_v, h_lv, contact_angle_deg, p):
    d_c = 4 * sigma * T / (rho_v * h_lv * wall_superheat)
    return 5e-27 * (1 - np.cos(np.radians(contact_angle_deg))) * d_c**-6


@python_form("wang_dhir_site_density")
def _(wall_superheat, sigma, T, rho_v, h_lv, contact_angle_deg, p):
    d_c = 4 * sigma * T / (rho_v * h_lv * wall_superheat)
    return 5e-27 * (1 - math.cos(math.radians(contact_angle_deg))) * d_c**-6


@numpy_form("basu_site_density")
def _(wall_superheat, contact_angle_deg, p):
    w = 1 - np.cos(np.radians(contact_angle_deg))
    return 1e4 * w * np.where(wall_superheat < 15, 0.34 * wall_superheat**2, 3.4e-5 * wall_superheat**5.3)


@python_form("basu_site_density")
def _(wall_superheat, contact_angle_deg, p):
    w = 1 - math.cos(math.radians(contact_angle_deg))
    return 1e4 * w * (0.34 * wall_superheat**2 if wall_superheat < 15 else 3.4e-5 * wall_superheat**5.3)


@numpy_form("hibiki_ishii_site_density")
def _(wall_superheat, sigma, T, p, rho_l, rho_v, h_lv, molar_mass, contact_angle_deg):
    theta = np.radians(contact_angle_deg)
    rp = np.log10((rho_l - rho_v) / rho_v)
    f = -0.01064 + 0.48246 * rp - 0.22712 * rp**2 + 0.05468 * rp**3
    R = 8.314462618 / molar_mass
    T_w = T + wall_superheat
    R_c = 2 * sigma * (1 + rho_v / rho_l) / p / (np.exp(h_lv * wall_superheat / (R * T_w * T)) - 1)
    return 4.72e5 * (1 - np.exp(-theta**2 / (8 * 0.722**2))) * (np.exp(f * 2.5e-6 / R_c) - 1)


@python_form("hibiki_ishii_site_density")
def _(wall_superheat, sigma, T, p, rho_l, rho_v, h_lv, molar_mass, contact_angle_deg):
    theta = math.radians(contact_angle_deg)
    rp = math.log10((rho_l - rho_v) / rho_v)
    f = -0.01064 + 0.48246 * rp - 0.22712 * rp**2 + 0.05468 * rp**3
    R = 8.314462618 / molar_mass
    T_w = T + wall_superheat
    R_c = 2 * sigma * (1 + rho_v / rho_l) / p / (math.exp(h_lv * wall_superheat / (R * T_w * T)) - 1)
    return 4.72e5 * (1 - math.exp(-theta**2 / (8 * 0.722**2))) * (math.exp(f * 2.5e-6 / R_c) - 1)


@numpy_form("lemmert_chawla_site_density")
def _(wall_superheat):
    return (210 * wall_superheat) ** 1.805


@python_form("lemmert_chawla_site_density")
def _(wall_superheat):
    return (210 * wall_superheat) ** 1.805


# #############################################################################
# departure, critical heat flux, boiling

# Hand-written baselines of the departure, critical-heat-flux and boiling
# kernels (see formulas.py for the conventions): the published equation in
# plain NumPy and in plain Python ``math``, inputs in kernel order (fluid fields
# expanded), outputs in kernel order. No validity checks and no NaN policy for
# impossible inputs; only the model's own branches (piecewise correlations, a
# cap, a cavity that never fires) are written out.

NOT_COMPARED["klausner_force_balance"] = (
    "no closed form: the departure diameter is the first root, over the bubble's growth, of two force balances "
    "(sliding and lift-off: surface tension, growth, drag, shear lift, buoyancy, pressure forces), plus a mode and "
    "driver classification; a hand-written version would be a root search, not a formula"
)


# =============================================================================
# departure diameter


@numpy_form("cole_rohsenow_departure")
def _(sigma, rho_l, rho_v, cp_l, T_sat, h_lv, C, g):
    return C * np.sqrt(sigma / (g * (rho_l - rho_v))) * (rho_l * cp_l * T_sat / (rho_v * h_lv)) ** 1.25


@python_form("cole_rohsenow_departure")
def _(sigma, rho_l, rho_v, cp_l, T_sat, h_lv, C, g):
    return C * math.sqrt(sigma / (g * (rho_l - rho_v))) * (rho_l * cp_l * T_sat / (rho_v * h_lv)) ** 1.25


@numpy_form("kocamustafaogullari_ishii_departure")
def _(theta, sigma, rho_l, rho_v, g):
    drho = rho_l - rho_v
    return 2.5e-5 * (drho / rho_v) ** 0.9 * theta * np.sqrt(sigma / (g * drho))


@python_form("kocamustafaogullari_ishii_departure")
def _(theta, sigma, rho_l, rho_v, g):
    drho = rho_l - rho_v
    return 2.5e-5 * (drho / rho_v) ** 0.9 * theta * math.sqrt(sigma / (g * drho))


@numpy_form("tolubinsky_kostanchuk_departure")
def _(subcooling):
    return np.minimum(0.6e-3 * np.exp(-subcooling / 45), 1.4e-3)


@python_form("tolubinsky_kostanchuk_departure")
def _(subcooling):
    return min(0.6e-3 * math.exp(-subcooling / 45), 1.4e-3)


# =============================================================================
# departure frequency and waiting time


@numpy_form("cole_frequency")
def _(D, rho_l, rho_v, C_D, g):
    return np.sqrt(4 * g * (rho_l - rho_v) / (3 * C_D * D * rho_l))


@python_form("cole_frequency")
def _(D, rho_l, rho_v, C_D, g):
    return math.sqrt(4 * g * (rho_l - rho_v) / (3 * C_D * D * rho_l))


@numpy_form("zuber_frequency")
def _(D, sigma, rho_l, rho_v, K, g):
    return K / D * (sigma * g * (rho_l - rho_v) / rho_l ** 2) ** 0.25


@python_form("zuber_frequency")
def _(D, sigma, rho_l, rho_v, K, g):
    return K / D * (sigma * g * (rho_l - rho_v) / rho_l ** 2) ** 0.25


@numpy_form("ivey_hydrodynamic_frequency")
def _(D, g):
    return 0.90 * np.sqrt(g / D)


@python_form("ivey_hydrodynamic_frequency")
def _(D, g):
    return 0.90 * math.sqrt(g / D)


# 0.44 cm^(1/4) in m^(1/4)
_IVEY_TRANSITION = 0.44 * 0.01 ** 0.25


@numpy_form("ivey_transition_frequency")
def _(D, g):
    return _IVEY_TRANSITION * np.sqrt(g) * D ** -0.75


@python_form("ivey_transition_frequency")
def _(D, g):
    return _IVEY_TRANSITION * math.sqrt(g) * D ** -0.75


@numpy_form("hsu_waiting_time")
def _(r_c, dT_w, dT_sub, sigma, T_sat, rho_l, rho_v, h_lv, k_l, cp_l):
    alpha = k_l / (rho_l * cp_l)
    margin = dT_w - 2 * sigma * T_sat / (rho_v * h_lv * r_c)
    t_w = 9 * r_c ** 2 / (4 * np.pi * alpha) * ((dT_w + dT_sub) / margin) ** 2
    return np.where(margin > 0, t_w, np.nan)  # the cavity never fires when dT_w <= dT_e


@python_form("hsu_waiting_time")
def _(r_c, dT_w, dT_sub, sigma, T_sat, rho_l, rho_v, h_lv, k_l, cp_l):
    margin = dT_w - 2 * sigma * T_sat / (rho_v * h_lv * r_c)
    if margin <= 0:
        return math.nan  # the cavity never fires
    alpha = k_l / (rho_l * cp_l)
    return 9 * r_c ** 2 / (4 * math.pi * alpha) * ((dT_w + dT_sub) / margin) ** 2


# =============================================================================
# critical and minimum heat flux


@numpy_form("zuber_chf")
def _(h_lv, rho_l, rho_v, sigma, K, g):
    return K * h_lv * np.sqrt(rho_v) * (sigma * g * (rho_l - rho_v)) ** 0.25


@python_form("zuber_chf")
def _(h_lv, rho_l, rho_v, sigma, K, g):
    return K * h_lv * math.sqrt(rho_v) * (sigma * g * (rho_l - rho_v)) ** 0.25


@numpy_form("lienhard_dhir_chf")
def _(geometry, size, area, small_plate, h_lv, rho_l, rho_v, sigma, g):
    drho = rho_l - rho_v
    scale = h_lv * np.sqrt(rho_v) * (sigma * g * drho) ** 0.25
    L = size * np.sqrt(g * drho / sigma)
    K = np.select(
        [geometry == 0, geometry == 1, geometry == 2, geometry == 3],
        [
            0.149,  # large flat plate
            small_plate * sigma / (g * drho * area),  # small flat plate: C lambda^2 / A
            np.pi / 24 * (0.89 + 2.27 * np.exp(-3.44 * np.sqrt(L))),  # cylinder
            np.pi / 24 * np.where(L >= 4.26, 0.84, 1.734 / np.sqrt(L)),  # sphere
        ],
        np.nan,
    )
    return K * scale


@python_form("lienhard_dhir_chf")
def _(geometry, size, area, small_plate, h_lv, rho_l, rho_v, sigma, g):
    drho = rho_l - rho_v
    scale = h_lv * math.sqrt(rho_v) * (sigma * g * drho) ** 0.25
    L = size * math.sqrt(g * drho / sigma)
    if geometry == 0:
        return 0.149 * scale
    if geometry == 1:
        return small_plate * sigma / (g * drho * area) * scale
    if geometry == 2:
        return math.pi / 24 * (0.89 + 2.27 * math.exp(-3.44 * math.sqrt(L))) * scale
    return math.pi / 24 * (0.84 if L >= 4.26 else 1.734 / math.sqrt(L)) * scale


@numpy_form("dimensionless_size")
def _(size, rho_l, rho_v, sigma, g):
    return size * np.sqrt(g * (rho_l - rho_v) / sigma)


@python_form("dimensionless_size")
def _(size, rho_l, rho_v, sigma, g):
    return size * math.sqrt(g * (rho_l - rho_v) / sigma)


@numpy_form("minimum_heat_flux")
def _(C, h_lv, rho_l, rho_v, sigma, g):
    return C * rho_v * h_lv * (sigma * g * (rho_l - rho_v) / (rho_l + rho_v) ** 2) ** 0.25


@python_form("minimum_heat_flux")
def _(C, h_lv, rho_l, rho_v, sigma, g):
    return C * rho_v * h_lv * (sigma * g * (rho_l - rho_v) / (rho_l + rho_v) ** 2) ** 0.25


# =============================================================================
# nucleate boiling


@numpy_form("rohsenow_heat_flux")
def _(dT, C_sf, n, h_lv, rho_l, rho_v, sigma, cp_l, k_l, mu_l, g):
    Pr = cp_l * mu_l / k_l
    return mu_l * h_lv * np.sqrt(g * (rho_l - rho_v) / sigma) * (cp_l * dT / (C_sf * h_lv * Pr ** n)) ** 3


@python_form("rohsenow_heat_flux")
def _(dT, C_sf, n, h_lv, rho_l, rho_v, sigma, cp_l, k_l, mu_l, g):
    Pr = cp_l * mu_l / k_l
    return mu_l * h_lv * math.sqrt(g * (rho_l - rho_v) / sigma) * (cp_l * dT / (C_sf * h_lv * Pr ** n)) ** 3


@numpy_form("rohsenow_superheat")
def _(q, C_sf, n, h_lv, rho_l, rho_v, sigma, cp_l, k_l, mu_l, g):
    Pr = cp_l * mu_l / k_l
    return C_sf * h_lv * Pr ** n / cp_l * np.cbrt(q / (mu_l * h_lv * np.sqrt(g * (rho_l - rho_v) / sigma)))


@python_form("rohsenow_superheat")
def _(q, C_sf, n, h_lv, rho_l, rho_v, sigma, cp_l, k_l, mu_l, g):
    Pr = cp_l * mu_l / k_l
    return C_sf * h_lv * Pr ** n / cp_l * (q / (mu_l * h_lv * math.sqrt(g * (rho_l - rho_v) / sigma))) ** (1 / 3)


@numpy_form("cooper_heat_flux")
def _(dT, p, p_crit, M, Rp):
    pr = p / p_crit
    A = 55 * pr ** (0.12 - 0.2 * np.log10(Rp * 1e6)) * (-np.log10(pr)) ** -0.55 * (M * 1e3) ** -0.5
    return (A * dT) ** (1 / 0.33)


@python_form("cooper_heat_flux")
def _(dT, p, p_crit, M, Rp):
    pr = p / p_crit
    A = 55 * pr ** (0.12 - 0.2 * math.log10(Rp * 1e6)) * (-math.log10(pr)) ** -0.55 * (M * 1e3) ** -0.5
    return (A * dT) ** (1 / 0.33)


@numpy_form("cooper_superheat")
def _(q, p, p_crit, M, Rp):
    pr = p / p_crit
    A = 55 * pr ** (0.12 - 0.2 * np.log10(Rp * 1e6)) * (-np.log10(pr)) ** -0.55 * (M * 1e3) ** -0.5
    return q ** 0.33 / A


@python_form("cooper_superheat")
def _(q, p, p_crit, M, Rp):
    pr = p / p_crit
    A = 55 * pr ** (0.12 - 0.2 * math.log10(Rp * 1e6)) * (-math.log10(pr)) ** -0.55 * (M * 1e3) ** -0.5
    return q ** 0.33 / A


@numpy_form("rpi_partition")
def _(N, D, f, dT_w, dT_sub, h_c, K, rho_l, rho_v, h_lv, k_l, cp_l):
    dT = dT_w + dT_sub
    q_e = N * f * np.pi * D ** 3 / 6 * rho_v * h_lv
    A = np.minimum(1.0, K * N * np.pi * D ** 2 / 4)
    alpha = k_l / (rho_l * cp_l)
    q_q = A * 2 * k_l * f * np.sqrt(0.8 / (f * np.pi * alpha)) * dT
    q_c = h_c * (1 - A) * dT
    return q_e, q_q, q_c, q_e + q_q + q_c, A


@python_form("rpi_partition")
def _(N, D, f, dT_w, dT_sub, h_c, K, rho_l, rho_v, h_lv, k_l, cp_l):
    dT = dT_w + dT_sub
    q_e = N * f * math.pi * D ** 3 / 6 * rho_v * h_lv
    A = min(1.0, K * N * math.pi * D ** 2 / 4)
    alpha = k_l / (rho_l * cp_l)
    q_q = A * 2 * k_l * f * math.sqrt(0.8 / (f * math.pi * alpha)) * dT
    q_c = h_c * (1 - A) * dT
    return q_e, q_q, q_c, q_e + q_q + q_c, A


@numpy_form("lloyd_moran_natural_convection")
def _(dT, L, beta, k_l, rho_l, cp_l, mu_l, g):
    Ra = g * beta * dT * L ** 3 * rho_l ** 2 * cp_l / (mu_l * k_l)
    Nu = np.where(Ra <= 1e7, 0.54 * Ra ** 0.25, 0.15 * np.cbrt(Ra))
    return Nu * k_l / L * dT


@python_form("lloyd_moran_natural_convection")
def _(dT, L, beta, k_l, rho_l, cp_l, mu_l, g):
    Ra = g * beta * dT * L ** 3 * rho_l ** 2 * cp_l / (mu_l * k_l)
    Nu = 0.54 * Ra ** 0.25 if Ra <= 1e7 else 0.15 * Ra ** (1 / 3)
    return Nu * k_l / L * dT


@numpy_form("churchill_chu_natural_convection")
def _(dT, D, beta, k_l, rho_l, cp_l, mu_l, g):
    Ra = g * beta * dT * D ** 3 * rho_l ** 2 * cp_l / (mu_l * k_l)
    Pr = mu_l * cp_l / k_l
    Nu = (0.60 + 0.387 * Ra ** (1 / 6) / (1 + (0.559 / Pr) ** (9 / 16)) ** (8 / 27)) ** 2
    return Nu * k_l / D * dT


@python_form("churchill_chu_natural_convection")
def _(dT, D, beta, k_l, rho_l, cp_l, mu_l, g):
    Ra = g * beta * dT * D ** 3 * rho_l ** 2 * cp_l / (mu_l * k_l)
    Pr = mu_l * cp_l / k_l
    Nu = (0.60 + 0.387 * Ra ** (1 / 6) / (1 + (0.559 / Pr) ** (9 / 16)) ** (8 / 27)) ** 2
    return Nu * k_l / D * dT


@numpy_form("churchill_chu_vertical_plate_natural_convection")
def _(dT, L, beta, k_l, rho_l, cp_l, mu_l, g):
    Ra = g * beta * dT * L ** 3 * rho_l ** 2 * cp_l / (mu_l * k_l)
    Pr = mu_l * cp_l / k_l
    Nu = (0.825 + 0.387 * Ra ** (1 / 6) / (1 + (0.492 / Pr) ** (9 / 16)) ** (8 / 27)) ** 2
    return Nu * k_l / L * dT


@python_form("churchill_chu_vertical_plate_natural_convection")
def _(dT, L, beta, k_l, rho_l, cp_l, mu_l, g):
    Ra = g * beta * dT * L ** 3 * rho_l ** 2 * cp_l / (mu_l * k_l)
    Pr = mu_l * cp_l / k_l
    Nu = (0.825 + 0.387 * Ra ** (1 / 6) / (1 + (0.492 / Pr) ** (9 / 16)) ** (8 / 27)) ** 2
    return Nu * k_l / L * dT


@numpy_form("churchill_sphere_natural_convection")
def _(dT, D, beta, k_l, rho_l, cp_l, mu_l, g):
    Ra = g * beta * dT * D ** 3 * rho_l ** 2 * cp_l / (mu_l * k_l)
    Pr = mu_l * cp_l / k_l
    psi = (1 + (0.469 / Pr) ** (9 / 16)) ** (16 / 9)
    return (2 + 0.589 * (Ra / psi) ** 0.25 * (1 + 7.44e-8 * Ra / psi) ** (1 / 12)) * k_l / D * dT


@python_form("churchill_sphere_natural_convection")
def _(dT, D, beta, k_l, rho_l, cp_l, mu_l, g):
    Ra = g * beta * dT * D ** 3 * rho_l ** 2 * cp_l / (mu_l * k_l)
    Pr = mu_l * cp_l / k_l
    psi = (1 + (0.469 / Pr) ** (9 / 16)) ** (16 / 9)
    return (2 + 0.589 * (Ra / psi) ** 0.25 * (1 + 7.44e-8 * Ra / psi) ** (1 / 12)) * k_l / D * dT


# =============================================================================
# film boiling


SIGMA_SB = 5.670374419e-8  # W/(m2 K4), CODATA 2018


@numpy_form("film_boiling")
def _(dT, C, L, a, eps, T, h_lv, cp_v, rho_l, rho_v, k_v, mu_v, g):
    conv = C * (g * k_v ** 3 * rho_v * (rho_l - rho_v) * (h_lv + a * cp_v * dT) / (mu_v * L * dT)) ** 0.25 * dT
    return conv + 0.75 * eps * SIGMA_SB * ((T + dT) ** 4 - T ** 4)


@python_form("film_boiling")
def _(dT, C, L, a, eps, T, h_lv, cp_v, rho_l, rho_v, k_v, mu_v, g):
    conv = C * (g * k_v ** 3 * rho_v * (rho_l - rho_v) * (h_lv + a * cp_v * dT) / (mu_v * L * dT)) ** 0.25 * dT
    return conv + 0.75 * eps * SIGMA_SB * ((T + dT) ** 4 - T ** 4)


# =============================================================================
# the agreement check (used by benches/run.py and tests/test_bench_formulas.py)


def kernel_function(kernel: str):
    """(function, spec) of the kernel-backed function that returns all of the
    kernel's outputs, or its first one (several public names can share a
    kernel: onset_superheat and onset_cavity_radius)."""
    from wetboil import _api

    found = [(f, s) for f, s in _api._FUNCTIONS.items() if s.model.name == kernel]
    if not found:
        raise KeyError(f"no kernel-backed function for {kernel}")
    return min(found, key=lambda fs: (fs[1].output or 0, fs[1].function))


def draw(kernel: str, n, seed: int = 0):
    """(function, spec, public arguments, kernel inputs) for n points (arrays)
    or one point (n None), drawn from the physical ranges of the test suite
    (tests/kernel_cases.py)."""
    import kernel_cases as kc

    f, spec = kernel_function(kernel)
    args = kc.draw_args(spec, np.random.default_rng(seed), n)
    return f, spec, args, kc.kernel_inputs(spec, args)


def outputs_of(spec, result):
    """The outputs a kernel-backed function returned, as a list."""
    import kernel_cases as kc

    return kc.outputs(result)


def check(kernel: str, n: int = 2000, seed: int = 0, rtol: float = 1e-9) -> str:
    """Why the hand-written versions of `kernel` disagree with wetboil on n
    drawn points and one drawn scalar point, or "" when they agree (relative
    tolerance `rtol`, NaN where wetboil gives NaN)."""
    import warnings

    import kernel_cases as kc
    import wetboil

    problems = []
    with warnings.catch_warnings(), wetboil.errstate(invalid="ignore", out_of_range="ignore"):
        warnings.simplefilter("ignore")
        f, spec, args, x = draw(kernel, n, seed)
        with np.errstate(all="ignore"):
            theirs = NUMPY[kernel](*x)
        theirs = list(theirs) if isinstance(theirs, tuple) else [theirs]
        # every output of the kernel (its ufunc: a public function may return
        # only some of them), then what the public function returns
        raw = getattr(wetboil._core, kernel)(*[np.asarray(v, float) for v in x])
        raw = list(raw) if isinstance(raw, tuple) else [raw]
        pairs = [(f"output {k}", a, b) for k, (a, b) in enumerate(zip(raw, theirs))]
        pairs += [(f"{spec.function} output {k}", a, b)
                  for k, (a, b) in enumerate(zip(kc.outputs(kc.call(f, spec, args)), kc.select(spec, theirs)))]
        if len(raw) != len(theirs):
            problems.append(f"NumPy version returns {len(theirs)} outputs, the kernel {len(raw)}")
        for what, a, b in pairs:
            a, b = np.broadcast_arrays(np.asarray(a, float), np.asarray(b, float))
            bad = ~np.isclose(a, b, rtol=rtol, atol=0.0, equal_nan=True)
            if bad.any():
                i = int(np.flatnonzero(bad.reshape(-1))[0])
                problems.append(f"NumPy {what}: {bad.sum()} of {a.size} differ, e.g. wetboil {a.reshape(-1)[i]!r} "
                                f"vs {b.reshape(-1)[i]!r} at inputs {[float(np.reshape(v, -1)[i % np.size(v)]) for v in x]}")
            # agreement on NaN alone proves nothing: most drawn points must have an answer
            if np.count_nonzero(np.isfinite(a)) < a.size // 10:
                problems.append(f"NumPy {what}: only {np.count_nonzero(np.isfinite(a))} of {a.size} drawn points finite")
        for s in range(seed, seed + 20):
            f, spec, args, x = draw(kernel, None, s)
            ours = kc.outputs(kc.call(f, spec, args))
            if all(np.isfinite(v) for v in ours):
                break
        else:
            problems.append("no drawn scalar point with a finite answer in 20 draws")
        theirs = PYTHON[kernel](*x)
        theirs = kc.select(spec, list(theirs) if isinstance(theirs, tuple) else [theirs])
        for k, (a, b) in enumerate(zip(ours, theirs)):
            if not (math.isclose(a, b, rel_tol=rtol) or (math.isnan(a) and math.isnan(b))):
                problems.append(f"Python output {k}: wetboil {a!r} vs {b!r} at inputs {x}")
    return "; ".join(problems)


if __name__ == "__main__":
    import os
    import sys

    sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "tests"))
    import wetboil

    names = sys.argv[1:] or sorted(m.name for m in wetboil.models())
    for name in names:
        if name in NOT_COMPARED:
            print(f"{name:38s} not compared: {NOT_COMPARED[name]}")
        elif name not in NUMPY or name not in PYTHON:
            print(f"{name:38s} MISSING")
        else:
            print(f"{name:38s} {check(name) or 'ok'}")
