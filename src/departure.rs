//! Bubble departure diameter and frequency.
//!
//! Departure diameters: [`fritz`] (static maximum volume), [`cole_rohsenow`]
//! (pressure through a modified Jakob number), [`kocamustafaogullari_ishii`]
//! (Fritz times a density-ratio factor) and [`force_balance`] (a Klausner et
//! al. 1993 force balance with advancing and receding angles, pool or flow
//! boiling, any wall orientation). Frequencies: [`cole_frequency`],
//! [`zuber_frequency`], [`ivey_hydrodynamic_frequency`],
//! [`ivey_transition_frequency`]; waiting time: [`waiting_time`].
//!
//! Verification tags used below: **\[V\]** seen in the original or a faithful
//! copy; **\[V2\]** seen only in a secondary source (a restatement, an abstract,
//! general-purpose open code); **\[M\]** from memory, not seen in any source
//! (confidence given); **\[D\]** derived here from the other entries.

use crate::fastmath;
use crate::all_positive;
use crate::model::{angle_deg, arg, densities, nan_unless, non_negative, positive, Factored, Kernel, Model};
use crate::trig::{cos_deg, sin_deg};
use std::f64::consts::PI;

// ---------------------------------------------------------------------------
// Fritz

/// Fritz (1935) departure diameter \[m\].
///
/// `D_d = 0.0208 θ [σ / (g (ρ_l − ρ_v))]^(1/2)` with θ the static contact angle in
/// **degrees**, measured through the liquid; equivalently `1.1918 θ_rad l_c` with
/// `l_c` the capillary length.
///
/// * `contact_angle_deg` θ \[deg\], `sigma` [N/m], `rho_l`, `rho_v` [kg/m3], `g` [m/s2].
/// * Physically possible: 0 ≤ θ ≤ 180, σ > 0, ρ_l > ρ_v ≥ 0, g > 0; otherwise NaN.
/// * Fritz fitted the maximum volume of a *static* bubble on a horizontal,
///   upward-facing wall (numerical solutions of the Young-Laplace equation,
///   Bashforth-Adams tables) for contact angles up to about 90°; we flag larger angles.
/// * Verification: constant 0.0208/deg [M, high] (the most cited restatement;
///   Jakob's 0.0148 θ° √(2σ/gΔρ) is 0.6 % larger, see MODELS Q-5); the original
///   paper was not available to us.
///
/// Reference: W. Fritz, "Berechnung des Maximalvolumens von Dampfblasen",
/// Physikalische Zeitschrift 36 (1935) 379-384 (no DOI).
#[inline(always)]
pub fn fritz(contact_angle_deg: f64, sigma: f64, rho_l: f64, rho_v: f64, g: f64) -> f64 {
    fritz_angle_factor(contact_angle_deg) * capillary_length(sigma, rho_l, rho_v, g)
}

/// The angle factor `0.0208 θ` of [`fritz`]; NaN outside 0..180 deg.
#[inline(always)]
fn fritz_angle_factor(contact_angle_deg: f64) -> f64 {
    nan_unless(angle_deg(contact_angle_deg), FRITZ_CONSTANT_PER_DEG * contact_angle_deg)
}

/// Capillary length `[σ / (g (ρ_l − ρ_v))]^(1/2)` \[m\]; NaN for impossible properties.
#[inline(always)]
fn capillary_length(sigma: f64, rho_l: f64, rho_v: f64, g: f64) -> f64 {
    nan_unless(capillary_possible(sigma, rho_l, rho_v, g), (sigma / (g * (rho_l - rho_v))).sqrt())
}

#[inline(always)]
fn capillary_possible(sigma: f64, rho_l: f64, rho_v: f64, g: f64) -> bool {
    all_positive!(sigma, g, rho_l - rho_v; rho_v)
}

/// The Fritz constant per degree of contact angle [1/deg].
pub const FRITZ_CONSTANT_PER_DEG: f64 = 0.0208;

/// Kernel of [`fritz`].
pub struct Fritz;
impl Kernel<5, 1> for Fritz {
    const MODEL: Model = Model {
        name: "fritz_departure",
        summary: "Fritz (1935) bubble departure diameter from the static contact angle",
        equation: "D_d = 0.0208 * theta_deg * sqrt(sigma / (g * (rho_l - rho_v)))",
        inputs: &[
            arg("contact_angle_deg", "deg"),
            arg("fluid.sigma", "N/m"),
            arg("fluid.rho_l", "kg/m3"),
            arg("fluid.rho_v", "kg/m3"),
            arg("g", "m/s2"),
        ],
        outputs: &[arg("departure_diameter", "m")],
        domain: "0 <= contact_angle_deg <= 180, sigma > 0, rho_l > rho_v >= 0, g > 0",
        validity: "contact_angle_deg <= 90 (static bubbles on an upward-facing horizontal wall)",
        reference: "W. Fritz, Berechnung des Maximalvolumens von Dampfblasen, Physikalische Zeitschrift 36 (1935) 379-384",
        doi: "",
        verification: "constant 0.0208 per degree: see wetboil.departure.fritz docstring",
    };
    #[inline(always)]
    fn eval(x: &[f64; 5]) -> [f64; 1] {
        [fritz(x[0], x[1], x[2], x[3], x[4])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 5]) -> bool {
        Self::side_possible(0, x) && Self::side_possible(1, x)
    }
    #[inline(always)]
    fn in_range(x: &[f64; 5]) -> bool {
        Self::side_in_range(0, x)
    }
}
impl Factored<5, 1> for Fritz {
    const SIDES: [u8; 5] = [0, 1, 1, 1, 1];
    #[inline(always)]
    fn factor(s: u8, x: &[f64; 5]) -> [f64; 1] {
        [if s == 0 { fritz_angle_factor(x[0]) } else { capillary_length(x[1], x[2], x[3], x[4]) }]
    }
    #[inline(always)]
    fn side_possible(s: u8, x: &[f64; 5]) -> bool {
        if s == 0 {
            angle_deg(x[0])
        } else {
            capillary_possible(x[1], x[2], x[3], x[4])
        }
    }
    #[inline(always)]
    fn side_in_range(s: u8, x: &[f64; 5]) -> bool {
        s != 0 || x[0] <= 90.0
    }
}

// ---------------------------------------------------------------------------
// Cole & Rohsenow

/// Cole & Rohsenow's constant for water [-].
pub const COLE_ROHSENOW_WATER: f64 = 1.5e-4;
/// Cole & Rohsenow's constant for fluids other than water [-].
pub const COLE_ROHSENOW_OTHER: f64 = 4.65e-4;

/// Cole & Rohsenow (1969) departure diameter \[m\].
///
/// `D_d = C [σ / (g (ρ_l − ρ_v))]^(1/2) (Ja*)^(5/4)`, with the modified Jakob
/// number `Ja* = ρ_l c_pl T_sat / (ρ_v h_lv)` built on the **absolute**
/// saturation temperature (not on a superheat).
///
/// * `sigma` [N/m], `rho_l`, `rho_v` [kg/m3], `cp_l` [J/(kg K)], `t_sat` \[K\],
///   `h_lv` [J/kg], `c` [-], `g` [m/s2].
/// * `C = 1.5e-4` for water, `4.65e-4` for other fluids ([`COLE_ROHSENOW_WATER`],
///   [`COLE_ROHSENOW_OTHER`]); the Python wrapper picks it from the fluid's name.
/// * Possible: every input positive and finite, ρ_l > ρ_v; otherwise NaN.
/// * Validity: no published range was available to us; the correlation was
///   fitted to pool-boiling data of water and organic liquids over a range of
///   pressures \[M\]. Nothing is flagged.
/// * The contact angle does not enter: the correlation carries the pressure
///   effect that Fritz lacks and no wettability effect.
/// * Verification: form and both constants [M, high]; the original was not
///   available to us. \[D\] water at 1 atm: Ja* ≈ 1118, D ≈ 2.4 mm.
///
/// Reference: R. Cole, W.M. Rohsenow, "Correlation of bubble departure
/// diameters for boiling of saturated liquids", Chem. Eng. Prog. Symp. Ser.
/// 65(92) (1969) 211-213 (no DOI).
#[inline(always)]
#[allow(clippy::too_many_arguments)]
pub fn cole_rohsenow(sigma: f64, rho_l: f64, rho_v: f64, cp_l: f64, t_sat: f64, h_lv: f64, c: f64, g: f64) -> f64 {
    let ok = cole_rohsenow_possible(sigma, rho_l, rho_v, cp_l, t_sat, h_lv, c, g);
    let ja = rho_l * cp_l * t_sat / (rho_v * h_lv);
    // Ja^(5/4) as Ja Ja^(1/4): two correctly rounded square roots, faster
    // and closer than exp(1.25 ln Ja)
    nan_unless(ok, c * (sigma / (g * (rho_l - rho_v))).sqrt() * (ja * ja.sqrt().sqrt()))
}

#[inline(always)]
#[allow(clippy::too_many_arguments)]
fn cole_rohsenow_possible(sigma: f64, rho_l: f64, rho_v: f64, cp_l: f64, t_sat: f64, h_lv: f64, c: f64, g: f64) -> bool {
    all_positive!(sigma, rho_v, cp_l, t_sat, h_lv, c, g, rho_l - rho_v)
}

/// Kernel of [`cole_rohsenow`].
pub struct ColeRohsenow;
impl Kernel<8, 1> for ColeRohsenow {
    const MODEL: Model = Model {
        name: "cole_rohsenow_departure",
        summary: "Cole & Rohsenow (1969) bubble departure diameter from a modified Jakob number",
        equation: "D_d = C * sqrt(sigma/(g*(rho_l-rho_v))) * (rho_l*cp_l*T_sat/(rho_v*h_lv))**1.25",
        inputs: &[
            arg("fluid.sigma", "N/m"),
            arg("fluid.rho_l", "kg/m3"),
            arg("fluid.rho_v", "kg/m3"),
            arg("fluid.cp_l", "J/(kg K)"),
            arg("fluid.T", "K"),
            arg("fluid.h_lv", "J/kg"),
            arg("C", "-"),
            arg("g", "m/s2"),
        ],
        outputs: &[arg("departure_diameter", "m")],
        domain: "all inputs positive and finite, rho_l > rho_v",
        validity: "no published range available; saturated pool boiling of water (C = 1.5e-4) and other liquids (C = 4.65e-4)",
        reference: "R. Cole, W.M. Rohsenow, Correlation of bubble departure diameters for boiling of saturated liquids, \
                    Chem. Eng. Prog. Symp. Ser. 65(92) (1969) 211-213",
        doi: "",
        verification: "form and constants 1.5e-4 / 4.65e-4 from memory (high confidence); original not seen",
    };
    #[inline(always)]
    fn eval(x: &[f64; 8]) -> [f64; 1] {
        [cole_rohsenow(x[0], x[1], x[2], x[3], x[4], x[5], x[6], x[7])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 8]) -> bool {
        cole_rohsenow_possible(x[0], x[1], x[2], x[3], x[4], x[5], x[6], x[7])
    }
}

// ---------------------------------------------------------------------------
// Kocamustafaogullari & Ishii

/// Kocamustafaogullari & Ishii's coefficient on `θ° l_c` [1/deg]: 2.5e-5,
/// i.e. 0.0012 × 0.0208 (= 2.496e-5, 0.16 % lower) written as one number.
pub const KOCAMUSTAFAOGULLARI_ISHII_CONSTANT: f64 = 2.5e-5;

/// Kocamustafaogullari & Ishii (1983) departure diameter \[m\].
///
/// `D_d = 2.5e-5 ((ρ_l − ρ_v)/ρ_v)^0.9 θ [σ / (g (ρ_l − ρ_v))]^(1/2)`, θ in
/// **degrees**; equivalently `D_d ≈ 0.0012 ((ρ_l − ρ_v)/ρ_v)^0.9 D_Fritz`.
///
/// **The 48× mis-transcription.** 2.5e-5 multiplies `θ° l_c`, *not* the Fritz
/// diameter: `2.5e-5 = 0.0012 × 0.0208`, and the 0.0208 is already inside
/// `D_Fritz`. Applying 2.5e-5 to `D_Fritz` gives 1/48 of the right answer
/// (0.0012/2.5e-5 = 48); applying 0.0012 to `θ° l_c` gives 48× too much. For
/// water at 1 atm and 45° the right value is about 2.2 mm, the mis-transcribed
/// one about 0.045 mm.
///
/// * `contact_angle_deg` θ \[deg\], `sigma` [N/m], `rho_l`, `rho_v` [kg/m3], `g` [m/s2].
/// * Possible: 0 ≤ θ ≤ 180, σ > 0, ρ_l > ρ_v > 0, g > 0; otherwise NaN.
/// * Validity: no published range available to us ([M, low]: water data from
///   about 0.1 to 14 MPa). We flag θ > 90° as Fritz does (our choice).
/// * Verification: the form 0.0012 (Δρ/ρ_v)^0.9 × 0.0208 θ° l_c is \[V2\]
///   (OpenFOAM's implementation, which cites the paper); the paper itself was
///   not seen. MODELS C3 / Q-6.
///
/// Reference: G. Kocamustafaogullari, M. Ishii, "Interfacial area and
/// nucleation site density in boiling systems", Int. J. Heat Mass Transfer 26
/// (1983) 1377-1387 (DOI not verified here, so not given).
#[inline(always)]
pub fn kocamustafaogullari_ishii(contact_angle_deg: f64, sigma: f64, rho_l: f64, rho_v: f64, g: f64) -> f64 {
    ki_angle_factor(contact_angle_deg) * ki_fluid_factor(sigma, rho_l, rho_v, g)
}

/// The angle factor `C θ` of [`kocamustafaogullari_ishii`]; NaN outside 0..180 deg.
#[inline(always)]
fn ki_angle_factor(contact_angle_deg: f64) -> f64 {
    nan_unless(angle_deg(contact_angle_deg), KOCAMUSTAFAOGULLARI_ISHII_CONSTANT * contact_angle_deg)
}

/// The fluid factor `(Δρ/ρ_v)^0.9 [σ/(g Δρ)]^(1/2)` of [`kocamustafaogullari_ishii`] \[m\].
#[inline(always)]
fn ki_fluid_factor(sigma: f64, rho_l: f64, rho_v: f64, g: f64) -> f64 {
    let drho = rho_l - rho_v;
    nan_unless(ki_fluid_possible(sigma, rho_l, rho_v, g), fastmath::pow(drho / rho_v, 0.9) * (sigma / (g * drho)).sqrt())
}

#[inline(always)]
fn ki_fluid_possible(sigma: f64, rho_l: f64, rho_v: f64, g: f64) -> bool {
    all_positive!(sigma, g, rho_v, rho_l - rho_v)
}

/// Kernel of [`kocamustafaogullari_ishii`].
pub struct KocamustafaogullariIshii;
impl Kernel<5, 1> for KocamustafaogullariIshii {
    const MODEL: Model = Model {
        name: "kocamustafaogullari_ishii_departure",
        summary: "Kocamustafaogullari & Ishii (1983) departure diameter: Fritz times a density-ratio factor",
        equation: "D_d = 2.5e-5 * ((rho_l-rho_v)/rho_v)**0.9 * theta_deg * sqrt(sigma/(g*(rho_l-rho_v)))",
        inputs: &[
            arg("contact_angle_deg", "deg"),
            arg("fluid.sigma", "N/m"),
            arg("fluid.rho_l", "kg/m3"),
            arg("fluid.rho_v", "kg/m3"),
            arg("g", "m/s2"),
        ],
        outputs: &[arg("departure_diameter", "m")],
        domain: "0 <= contact_angle_deg <= 180, sigma > 0, rho_l > rho_v > 0, g > 0",
        validity: "no published range available; contact_angle_deg <= 90 (our flag, as for Fritz)",
        reference: "G. Kocamustafaogullari, M. Ishii, Interfacial area and nucleation site density in boiling systems, \
                    Int. J. Heat Mass Transfer 26 (1983) 1377-1387",
        doi: "",
        verification: "coefficient 2.5e-5 = 0.0012 x 0.0208 on theta_deg*l_c: secondary source (OpenFOAM implementation); \
                       paper not seen",
    };
    #[inline(always)]
    fn eval(x: &[f64; 5]) -> [f64; 1] {
        [kocamustafaogullari_ishii(x[0], x[1], x[2], x[3], x[4])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 5]) -> bool {
        Self::side_possible(0, x) && Self::side_possible(1, x)
    }
    #[inline(always)]
    fn in_range(x: &[f64; 5]) -> bool {
        Self::side_in_range(0, x)
    }
}
impl Factored<5, 1> for KocamustafaogullariIshii {
    const SIDES: [u8; 5] = [0, 1, 1, 1, 1];
    #[inline(always)]
    fn factor(s: u8, x: &[f64; 5]) -> [f64; 1] {
        [if s == 0 { ki_angle_factor(x[0]) } else { ki_fluid_factor(x[1], x[2], x[3], x[4]) }]
    }
    #[inline(always)]
    fn side_possible(s: u8, x: &[f64; 5]) -> bool {
        if s == 0 {
            angle_deg(x[0])
        } else {
            ki_fluid_possible(x[1], x[2], x[3], x[4])
        }
    }
    #[inline(always)]
    fn side_in_range(s: u8, x: &[f64; 5]) -> bool {
        s != 0 || x[0] <= 90.0
    }
}

// ---------------------------------------------------------------------------
// Force balance (Klausner, Mei, Bernhard & Zeng 1993)

/// Klausner's coefficient of the growth (unsteady drag) force for a bubble
/// growing at a wall, `C_s = 20/3` [-] [M, med].
pub const KLAUSNER_GROWTH_COEFFICIENT: f64 = 20.0 / 3.0;
/// Radius of curvature of the interface at the bubble foot over the bubble
/// radius, `r_r / r ≈ 5` (Klausner et al.) [-] [M, med].
pub const KLAUSNER_FOOT_CURVATURE_RATIO: f64 = 5.0;
/// Plesset & Zwick's growth constant `b = √3` of `R = (2b/√π) Ja √(α_l t)` [-].
pub const PLESSET_ZWICK_GROWTH_CONSTANT: f64 = 1.732_050_807_568_877_2;
/// Default contact (foot) diameter over bubble diameter, `d_w / D` [-]: our
/// own choice (see [`force_balance`]).
pub const DEFAULT_CONTACT_RATIO: f64 = 0.2;
/// Default bubble inclination from the wall normal \[deg\]: 10° [M, med].
pub const DEFAULT_INCLINATION_DEG: f64 = 10.0;
/// Default friction velocity over bulk velocity, `u_τ / U = 0.04` [-] [M, med].
pub const DEFAULT_FRICTION_RATIO: f64 = 0.04;

/// Departure mode code: no departure below 10 m (the balance never tips).
pub const MODE_NONE: f64 = 0.0;
/// Departure mode code: the balance along the wall tips first (sliding).
pub const MODE_SLIDING: f64 = 1.0;
/// Departure mode code: the balance normal to the wall tips first (lift-off).
pub const MODE_LIFT_OFF: f64 = 2.0;

/// Driver code: no departure.
pub const DRIVER_NONE: f64 = 0.0;
/// Driver code: buoyancy (its component along, or normal to, the wall).
pub const DRIVER_BUOYANCY: f64 = 1.0;
/// Driver code: quasi-steady drag of the flow along the wall.
pub const DRIVER_DRAG: f64 = 2.0;
/// Driver code: shear lift.
pub const DRIVER_SHEAR_LIFT: f64 = 3.0;
/// Driver code: hydrodynamic pressure force.
pub const DRIVER_HYDRODYNAMIC_PRESSURE: f64 = 4.0;
/// Driver code: contact pressure force (capillary pressure on the foot).
pub const DRIVER_CONTACT_PRESSURE: f64 = 5.0;

/// Smallest and largest diameters the balance is searched over \[m\].
const D_MIN: f64 = 1e-8;
const D_MAX: f64 = 10.0;
/// Grid ratio of the scan: twelve points per decade (10^(1/12)).
const SCAN_RATIO: f64 = 1.211_527_658_628_588_4;
/// Scan steps from D_MIN to D_MAX (9 decades).
const SCAN_STEPS: usize = 108;
/// Bisection steps at most (the bracket shrinks below 1e-12 relative in ~40).
const BISECTION_STEPS: usize = 100;

/// The forces on an attached bubble of one diameter \[N\], in the wall frame:
/// `x` along the wall (the flow direction, up the slope on an inclined wall),
/// `y` normal to the wall into the liquid.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Forces {
    /// Capillary force along the wall, magnitude; it opposes the drive along the wall.
    pub surface_tension_x: f64,
    /// Capillary force normal to the wall (≤ 0, towards the wall).
    pub surface_tension_y: f64,
    /// Growth (unsteady drag) force component along the wall, magnitude; opposes the drive.
    pub growth_x: f64,
    /// Growth force component normal to the wall (≤ 0).
    pub growth_y: f64,
    /// Quasi-steady drag along the wall (signed like the flow).
    pub drag: f64,
    /// Shear lift (≥ 0).
    pub shear_lift: f64,
    /// Buoyancy component along the wall (up the slope > 0).
    pub buoyancy_x: f64,
    /// Buoyancy component normal to the wall (away from the wall > 0).
    pub buoyancy_y: f64,
    /// Hydrodynamic pressure force (≥ 0).
    pub hydrodynamic_pressure: f64,
    /// Contact pressure force (≥ 0).
    pub contact_pressure: f64,
}

impl Forces {
    /// Along-wall drive minus along-wall retention: the bubble slides once positive.
    #[inline(always)]
    pub fn sliding_excess(&self) -> f64 {
        (self.drag + self.buoyancy_x).abs() - (self.surface_tension_x + self.growth_x)
    }
    /// Sum of the forces normal to the wall: the bubble lifts off once positive.
    #[inline(always)]
    pub fn lift_off_excess(&self) -> f64 {
        self.surface_tension_y
            + self.growth_y
            + self.shear_lift
            + self.buoyancy_y
            + self.hydrodynamic_pressure
            + self.contact_pressure
    }
}

/// sin(h)/h, with its limit 1 at h = 0.
#[inline(always)]
fn sinc(h: f64) -> f64 {
    if h.abs() < 1e-4 {
        1.0 - h * h / 6.0
    } else {
        h.sin() / h
    }
}

/// Reichardt's velocity profile `u⁺(y⁺)` and its slope `du⁺/dy⁺` (κ = 0.4).
#[inline(always)]
fn reichardt(yp: f64) -> (f64, f64) {
    let e11 = (-yp / 11.0).exp();
    let e3 = (-yp / 3.0).exp();
    let u = 2.5 * (1.0 + 0.4 * yp).ln() + 7.8 * (1.0 - e11 - yp / 11.0 * e3);
    let du = 1.0 / (1.0 + 0.4 * yp) + 7.8 * (e11 / 11.0 - e3 / 11.0 + yp / 33.0 * e3);
    (u, du)
}

/// Everything of one force-balance case that does not depend on the diameter.
#[derive(Debug, Clone, Copy)]
struct Balance {
    sigma: f64,
    rho_l: f64,
    drho: f64,
    mu_l: f64,
    nu_l: f64,
    g: f64,
    ratio: f64,
    /// F_sy = -π d_w σ s_y
    s_y: f64,
    /// |F_sx| = d_w σ c_x
    c_x: f64,
    /// |F_du| \[N\], size-independent with the √t growth law.
    growth: f64,
    sin_tilt: f64,
    cos_tilt: f64,
    sin_phi: f64,
    cos_phi: f64,
    /// friction velocity [m/s] and flow sign
    u_tau: f64,
    flow_sign: f64,
}

impl Balance {
    fn new(x: &[f64; 17]) -> Balance {
        let [adv, rec, sigma, rho_l, rho_v, h_lv, cp_l, k_l, mu_l, superheat, velocity, orientation, ratio, tilt, b, friction, g] =
            *x;
        let (a, r) = (adv.to_radians(), rec.to_radians());
        let d = a - r;
        // (cos β − cos α)/(α − β) = sin((α+β)/2) sin((α−β)/2)/((α−β)/2): exact and
        // smooth through α = β, where it tends to sin α (the 0/0 of F_sy).
        let s_y = ((a + r) / 2.0).sin() * sinc(d / 2.0);
        let den = PI * PI - d * d;
        let c_x = if den > 0.0 { 1.25 * PI * d * (a.sin() + r.sin()) / den } else { f64::INFINITY };
        let alpha_l = k_l / (rho_l * cp_l);
        let ja = rho_l * cp_l * superheat / (rho_v * h_lv);
        let kg = 2.0 * b / PI.sqrt() * ja * alpha_l.sqrt();
        // R = K √t: r² (3/2 C_s ṙ² + r r̈) = K⁴ (3 C_s/2 − 1)/4 for every t.
        let growth = rho_l * PI * kg.powi(4) * (1.5 * KLAUSNER_GROWTH_COEFFICIENT - 1.0) / 4.0;
        let (sin_tilt, cos_tilt) = (sin_deg(tilt), cos_deg(tilt));
        let (sin_phi, cos_phi) = (sin_deg(orientation), cos_deg(orientation));
        Balance {
            sigma,
            rho_l,
            drho: rho_l - rho_v,
            mu_l,
            nu_l: mu_l / rho_l,
            g,
            ratio,
            s_y,
            c_x,
            growth,
            sin_tilt,
            cos_tilt,
            sin_phi,
            cos_phi,
            u_tau: friction * velocity.abs(),
            flow_sign: if velocity < 0.0 { -1.0 } else { 1.0 },
        }
    }

    /// The forces on an attached bubble of diameter `d` \[m\].
    #[inline(always)]
    fn forces(&self, d: f64) -> Forces {
        let r = 0.5 * d;
        let dw = self.ratio * d;
        let (mut drag, mut lift, mut hydro) = (0.0, 0.0, 0.0);
        if self.u_tau > 0.0 {
            let yp = r * self.u_tau / self.nu_l;
            let (up, dup) = reichardt(yp);
            let uc = self.u_tau * up; // liquid velocity at the bubble centre
            let shear = self.u_tau * self.u_tau / self.nu_l * dup;
            if uc > 0.0 {
                let re = 2.0 * r * uc / self.nu_l;
                let n = 0.65;
                let bracket = 2.0 / 3.0 + ((12.0 / re).powf(n) + 0.796f64.powf(n)).powf(-1.0 / n);
                drag = self.flow_sign * 6.0 * PI * self.mu_l * uc * r * bracket;
                let gs = shear * r / uc;
                let cl = 3.877 * gs.sqrt() * (1.0 / (re * re) + 0.014 * gs * gs).sqrt().sqrt();
                lift = 0.5 * self.rho_l * uc * uc * PI * r * r * cl;
                hydro = 9.0 / 8.0 * self.rho_l * uc * uc * PI * dw * dw / 4.0;
            }
        }
        let buoyancy = PI / 6.0 * d * d * d * self.drho * self.g;
        Forces {
            surface_tension_x: dw * self.sigma * self.c_x,
            surface_tension_y: -PI * dw * self.sigma * self.s_y,
            growth_x: self.growth * self.sin_tilt,
            growth_y: -self.growth * self.cos_tilt,
            drag,
            shear_lift: lift,
            buoyancy_x: buoyancy * self.sin_phi,
            buoyancy_y: buoyancy * self.cos_phi,
            hydrodynamic_pressure: hydro,
            contact_pressure: PI * dw * dw / 4.0 * 2.0 * self.sigma / (KLAUSNER_FOOT_CURVATURE_RATIO * r),
        }
    }
}

/// Smallest diameter in [D_MIN, D_MAX] at which `excess` turns positive \[m\]:
/// 0 when it is already positive at D_MIN (the balance tips as soon as the
/// bubble exists), NaN when it never does (or is NaN). A geometric scan of
/// twelve points per decade brackets the first sign change, bisection refines
/// it to 1e-12 relative. No allocation, bounded work.
#[inline]
fn first_tip<F: Fn(f64) -> f64>(excess: F) -> f64 {
    let mut lo = D_MIN;
    let g0 = excess(lo);
    if g0.is_nan() {
        return f64::NAN;
    }
    if g0 > 0.0 {
        return 0.0;
    }
    for _ in 0..SCAN_STEPS {
        let hi = (lo * SCAN_RATIO).min(D_MAX);
        let gh = excess(hi);
        if gh.is_nan() {
            return f64::NAN;
        }
        if gh > 0.0 {
            let (mut a, mut b) = (lo, hi);
            for _ in 0..BISECTION_STEPS {
                let m = 0.5 * (a + b);
                if excess(m) > 0.0 {
                    b = m;
                } else {
                    a = m;
                }
                if b - a <= 1e-12 * b {
                    break;
                }
            }
            return 0.5 * (a + b);
        }
        lo = hi;
    }
    f64::NAN
}

#[inline(always)]
fn force_balance_possible(x: &[f64; 17]) -> bool {
    let [adv, rec, sigma, rho_l, rho_v, h_lv, cp_l, k_l, mu_l, superheat, velocity, orientation, ratio, tilt, b, friction, g] =
        *x;
    angle_deg(adv)
        && angle_deg(rec)
        && rec <= adv
        && positive(sigma)
        && densities(rho_l, rho_v)
        && positive(rho_v)
        && positive(h_lv)
        && positive(cp_l)
        && positive(k_l)
        && positive(mu_l)
        && non_negative(superheat)
        && velocity.is_finite()
        && angle_deg(orientation)
        && ratio > 0.0
        && ratio <= 1.0
        && (0.0..90.0).contains(&tilt)
        && non_negative(b)
        && non_negative(friction)
        && non_negative(g)
}

/// Force-balance departure diameter with contact-angle hysteresis, for pool
/// and flow boiling on a wall of any orientation; Klausner, Mei, Bernhard &
/// Zeng (1993).
///
/// Returns `[diameter, mode, driver, sliding_diameter, lift_off_diameter]`:
/// * `sliding_diameter` \[m\]: smallest D at which the balance **along** the wall
///   tips, `|F_qs + F_b sin φ| > |F_sx| + |F_du| sin θ_i`;
/// * `lift_off_diameter` \[m\]: smallest D at which the balance **normal** to the
///   wall tips, `F_sy + F_du,y + F_sL + F_b cos φ + F_h + F_cp > 0`;
/// * `diameter` = the smaller of the two; `mode` = [`MODE_SLIDING`] (1) or
///   [`MODE_LIFT_OFF`] (2) for the balance that tips first (sliding on a tie),
///   [`MODE_NONE`] (0) with `diameter` NaN when neither tips below 10 m;
/// * `driver`: the largest force pushing in the direction that tipped, at the
///   departure diameter: [`DRIVER_BUOYANCY`] (1), [`DRIVER_DRAG`] (2),
///   [`DRIVER_SHEAR_LIFT`] (3), [`DRIVER_HYDRODYNAMIC_PRESSURE`] (4),
///   [`DRIVER_CONTACT_PRESSURE`] (5); [`DRIVER_NONE`] (0) without departure.
///
/// A diameter of 0 means the balance tips as soon as the bubble exists (for
/// example a zero contact angle without growth force, or no hysteresis on a
/// vertical wall without growth force: nothing then holds the bubble).
///
/// **Forces** (Klausner et al. 1993; all \[M\], see Verification), with `r = D/2`,
/// foot diameter `d_w = k D`, α advancing and β receding angle (radians):
/// * surface tension `F_sx = −1.25 d_w σ π(α−β)/(π²−(α−β)²) (sin α + sin β)`,
///   `F_sy = −d_w σ π/(α−β) (cos β − cos α)`; at α = β the 0/0 is taken by its
///   limit `F_sy = −π d_w σ sin α` (computed as `sin((α+β)/2) sinc((α−β)/2)`);
/// * growth (unsteady drag) `F_du = −ρ_l π r² (3/2 C_s ṙ² + r r̈)`, `C_s = 20/3`,
///   inclined by θ_i from the wall normal against the drive;
/// * quasi-steady drag `F_qs = 6π μ_l U r [2/3 + ((12/Re)^0.65 + 0.796^0.65)^(−1/0.65)]`,
///   `Re = 2 r U/ν_l`;
/// * shear lift `F_sL = ½ ρ_l U² π r² C_L`, `C_L = 3.877 G_s^½ (Re⁻² + 0.014 G_s²)^¼`,
///   `G_s = (dU/dy) r/U`;
/// * buoyancy `F_b = (π/6) D³ (ρ_l − ρ_v) g`, components `sin φ` along and
///   `cos φ` normal to the wall;
/// * hydrodynamic pressure `F_h = (9/8) ρ_l U² π d_w²/4`; contact pressure
///   `F_cp = (π d_w²/4) 2σ/r_r`, `r_r = 5 r`.
///
/// **Closures we chose** (the paper's own experiment fixed some of them):
/// * growth law: diffusion-controlled `R = (2b/√π) Ja √(α_l t)`,
///   `Ja = ρ_l c_pl ΔT_w/(ρ_v h_lv)` with the wall superheat; `b = √3` is Plesset
///   & Zwick's (1954) uniform-superheat solution, Zuber (1961) wrote the same
///   form with an empirical `b` between about 1 and √3 for a wall [M, med]. With
///   `R ∝ √t` the growth force `(9/4) π ρ_l K⁴` (`K = R/√t`, `C_s = 20/3`) does
///   not depend on the size: it is what holds small bubbles on the wall. It
///   scales as `b⁴ ΔT_w⁴`, so the result is very sensitive to both.
/// * liquid velocity at the bubble centre `U = u_τ u⁺(y⁺ = r u_τ/ν_l)` and shear
///   `dU/dy = (u_τ²/ν_l) du⁺/dy⁺` from Reichardt's wall law, with
///   `u_τ = friction_ratio × |velocity|` (0.04 by default, the estimate
///   Klausner et al. took from Hinze [M, med]); `velocity` is the bulk liquid
///   velocity along +x (negative: flow down the slope).
/// * foot diameter `d_w = contact_ratio × D`. Klausner et al. used a fixed
///   `d_w = 0.09 mm` for R113 on nichrome [M, med]; a ratio keeps the model
///   fluid-independent. Our default 0.2 makes the pool-boiling limit without
///   growth force agree with Fritz within 5 % at 45°.
/// * inclination θ_i = 10° by default [M, med]; Zeng et al. (1993) later found it
///   from the growth dynamics.
///
/// **Frame**: `orientation_deg` φ = 0 horizontal facing up, 90 vertical, 180
/// facing down; x along the wall in the flow direction and, on an inclined
/// wall, up the slope (so buoyancy along the wall is `F_b sin φ ≥ 0`).
///
/// **Limits** \[D\]: with no flow and no growth force (ΔT_w = 0) on an upward
/// wall, lift-off reduces to buoyancy against surface tension,
/// `D = [6 k σ (s_y − k/5)/(g Δρ)]^½` with `s_y = (cos β − cos α)/(α − β)`:
/// it scales as g^−½, is 0 at 0°, and grows with the angle up to 90°. Facing
/// down without flow, buoyancy presses the bubble on the wall: no departure (NaN).
///
/// * Inputs: `advancing_deg` α, `receding_deg` β \[deg\] (0 ≤ β ≤ α ≤ 180),
///   `sigma` [N/m], `rho_l`, `rho_v` [kg/m3], `h_lv` [J/kg], `cp_l` [J/(kg K)],
///   `k_l` [W/(m K)], `mu_l` [Pa s], `wall_superheat` \[K\] ≥ 0, `velocity` [m/s],
///   `orientation_deg` φ \[deg\] in [0, 180], `contact_ratio` k in (0, 1],
///   `inclination_deg` θ_i in [0, 90), `growth_constant` b ≥ 0,
///   `friction_ratio` ≥ 0, `g` [m/s2] ≥ 0. Otherwise NaN (all five outputs).
/// * Validity: no published range. Klausner et al. compared the model with R113
///   flow boiling on an upward-facing horizontal heater; we flag
///   `orientation_deg > 90` (downward-facing walls) as out of range.
/// * Verification: every force expression and constant above is from memory
///   (structure high confidence, constants medium); the paper was not available
///   to us, and no published case (inputs with measured and predicted diameters)
///   could be found, so the tests check the limiting identities instead.
///
/// References: J.F. Klausner, R. Mei, D.M. Bernhard, L.Z. Zeng, "Vapor bubble
/// departure in forced convection boiling", Int. J. Heat Mass Transfer 36
/// (1993) 651-662, doi:10.1016/0017-9310(93)80041-R (DOI from memory);
/// L.Z. Zeng, J.F. Klausner, D.M. Bernhard, R. Mei, "A unified model for the
/// prediction of bubble detachment diameters in boiling systems. II. Flow
/// boiling", Int. J. Heat Mass Transfer 36 (1993) 2271-2279 (the successor;
/// not implemented: it drops the surface-tension force and so the angles);
/// M.S. Plesset, S.A. Zwick, "The growth of vapor bubbles in superheated
/// liquids", J. Appl. Phys. 25 (1954) 493-500, doi:10.1063/1.1721668;
/// N. Zuber, "The dynamics of vapor bubbles in nonuniform temperature fields",
/// Int. J. Heat Mass Transfer 2 (1961) 83-98; H. Reichardt, "Vollständige
/// Darstellung der turbulenten Geschwindigkeitsverteilung in glatten
/// Leitungen", Z. Angew. Math. Mech. 31 (1951) 208-219.
#[allow(clippy::too_many_arguments)]
pub fn force_balance(
    advancing_deg: f64,
    receding_deg: f64,
    sigma: f64,
    rho_l: f64,
    rho_v: f64,
    h_lv: f64,
    cp_l: f64,
    k_l: f64,
    mu_l: f64,
    wall_superheat: f64,
    velocity: f64,
    orientation_deg: f64,
    contact_ratio: f64,
    inclination_deg: f64,
    growth_constant: f64,
    friction_ratio: f64,
    g: f64,
) -> [f64; 5] {
    let x = [
        advancing_deg,
        receding_deg,
        sigma,
        rho_l,
        rho_v,
        h_lv,
        cp_l,
        k_l,
        mu_l,
        wall_superheat,
        velocity,
        orientation_deg,
        contact_ratio,
        inclination_deg,
        growth_constant,
        friction_ratio,
        g,
    ];
    force_balance_array(&x)
}

fn force_balance_array(x: &[f64; 17]) -> [f64; 5] {
    if !force_balance_possible(x) {
        return [f64::NAN; 5];
    }
    let fb = Balance::new(x);
    // Without flow and without buoyancy along the wall nothing drives sliding.
    let slide = if fb.u_tau == 0.0 && fb.sin_phi == 0.0 {
        f64::NAN
    } else {
        first_tip(|d| fb.forces(d).sliding_excess())
    };
    let lift = first_tip(|d| fb.forces(d).lift_off_excess());
    let (d, mode) = match (slide.is_nan(), lift.is_nan()) {
        (true, true) => return [f64::NAN, MODE_NONE, DRIVER_NONE, slide, lift],
        (false, true) => (slide, MODE_SLIDING),
        (true, false) => (lift, MODE_LIFT_OFF),
        (false, false) => {
            if slide <= lift {
                (slide, MODE_SLIDING)
            } else {
                (lift, MODE_LIFT_OFF)
            }
        }
    };
    let f = fb.forces(d.max(D_MIN));
    let driver = if mode == MODE_SLIDING {
        let s = if f.drag + f.buoyancy_x < 0.0 { -1.0 } else { 1.0 };
        if s * f.drag >= s * f.buoyancy_x {
            DRIVER_DRAG
        } else {
            DRIVER_BUOYANCY
        }
    } else {
        let mut best = (f.buoyancy_y, DRIVER_BUOYANCY);
        for cand in [
            (f.shear_lift, DRIVER_SHEAR_LIFT),
            (f.hydrodynamic_pressure, DRIVER_HYDRODYNAMIC_PRESSURE),
            (f.contact_pressure, DRIVER_CONTACT_PRESSURE),
        ] {
            if cand.0 > best.0 {
                best = cand;
            }
        }
        best.1
    };
    [d, mode, driver, slide, lift]
}

/// Kernel of [`force_balance`].
pub struct ForceBalance;
impl Kernel<17, 5> for ForceBalance {
    const MODEL: Model = Model {
        name: "klausner_force_balance",
        summary: "Klausner et al. (1993) force-balance departure diameter with advancing/receding angles, \
                  pool or flow boiling, any wall orientation",
        equation: "smallest D with |F_qs + F_b sin(phi)| > |F_sx| + |F_du| sin(theta_i) (sliding) or \
                   F_sy + F_du,y + F_sL + F_b cos(phi) + F_h + F_cp > 0 (lift-off); \
                   F_sx = -1.25 d_w sigma pi (a-b)/(pi^2-(a-b)^2) (sin a + sin b), F_sy = -d_w sigma pi/(a-b) (cos b - cos a), \
                   F_du = -rho_l pi r^2 (3/2 C_s rdot^2 + r rddot), R = (2b/sqrt(pi)) Ja sqrt(alpha_l t)",
        inputs: &[
            arg("advancing_angle_deg", "deg"),
            arg("receding_angle_deg", "deg"),
            arg("fluid.sigma", "N/m"),
            arg("fluid.rho_l", "kg/m3"),
            arg("fluid.rho_v", "kg/m3"),
            arg("fluid.h_lv", "J/kg"),
            arg("fluid.cp_l", "J/(kg K)"),
            arg("fluid.k_l", "W/(m K)"),
            arg("fluid.mu_l", "Pa s"),
            arg("wall_superheat", "K"),
            arg("velocity", "m/s"),
            arg("orientation_deg", "deg"),
            arg("contact_ratio", "-"),
            arg("inclination_deg", "deg"),
            arg("growth_constant", "-"),
            arg("friction_ratio", "-"),
            arg("g", "m/s2"),
        ],
        outputs: &[
            arg("diameter", "m"),
            arg("mode", "-"),
            arg("driver", "-"),
            arg("sliding_diameter", "m"),
            arg("lift_off_diameter", "m"),
        ],
        domain: "0 <= receding <= advancing <= 180 deg, positive fluid properties with rho_l > rho_v, wall_superheat >= 0, \
                 finite velocity, 0 <= orientation_deg <= 180, 0 < contact_ratio <= 1, 0 <= inclination_deg < 90, \
                 growth_constant >= 0, friction_ratio >= 0, g >= 0",
        validity: "no published range; orientation_deg <= 90 (the model was built for an upward-facing heater; our flag); \
                   advancing angle <= 90 deg (the data were R113 on a wetting wall; with the foot ratio fixed, the \
                   diameter then falls with the angle, opposite to Fritz; our flag)",
        reference: "J.F. Klausner, R. Mei, D.M. Bernhard, L.Z. Zeng, Vapor bubble departure in forced convection boiling, \
                    Int. J. Heat Mass Transfer 36 (1993) 651-662; growth law: M.S. Plesset, S.A. Zwick, J. Appl. Phys. 25 \
                    (1954) 493-500",
        doi: "10.1016/0017-9310(93)80041-R",
        verification: "force expressions and constants from memory (structure high, constants medium confidence); DOI from \
                       memory; no published case found: tests check limiting identities",
    };
    #[inline(always)]
    fn eval(x: &[f64; 17]) -> [f64; 5] {
        force_balance_array(x)
    }
    #[inline(always)]
    fn possible(x: &[f64; 17]) -> bool {
        force_balance_possible(x)
    }
    #[inline(always)]
    fn in_range(x: &[f64; 17]) -> bool {
        (x[11] <= 90.0) & (x[0] <= 90.0)
    }
}

// ---------------------------------------------------------------------------
// Departure frequency

/// Ivey's hydrodynamic-region constant in `f D^(1/2) = 0.90 g^(1/2)` [-].
pub const IVEY_HYDRODYNAMIC: f64 = 0.90;
/// Ivey's transition-region constant in `f D^(3/4) = 0.44 g^(1/2)`, published
/// as 0.44 cm^(1/4) (D in cm, g in cm/s2); in SI `0.44 × 0.01^(1/4) = 0.13914`
/// m^(1/4).
pub const IVEY_TRANSITION_SI: f64 = 0.44 * 0.316_227_766_016_837_94;
/// Zuber's constant 0.59 in `f D = 0.59 [σ g Δρ/ρ_l²]^(1/4)` [-].
pub const ZUBER_FREQUENCY_CONSTANT: f64 = 0.59;

/// A zero departure diameter (Fritz's at 0 deg: a perfectly wetting wall) is a
/// possible input with no departure cycle: the frequencies give NaN there,
/// flagged out of range rather than impossible, so that a chain of public
/// functions treats it as a sweep does.
#[inline(always)]
fn freq_possible(diameter: f64, rho_l: f64, rho_v: f64, g: f64) -> bool {
    all_positive!(g, rho_l - rho_v; rho_v, diameter)
}

/// `value` where the inputs are possible and the diameter positive, else NaN.
#[inline(always)]
fn with_bubble(ok: bool, diameter: f64, value: f64) -> f64 {
    nan_unless(ok & (diameter > 0.0), value)
}



/// Cole (1960) departure frequency \[Hz\].
///
/// `f = [4 g (ρ_l − ρ_v) / (3 C_D D ρ_l)]^(1/2)`, with `C_D = 1` in Cole's paper:
/// the bubble's rise velocity from a drag balance divided by its diameter.
///
/// * `diameter` D \[m\] ≥ 0 (0: NaN, flagged: no departure cycle), `rho_l`, `rho_v` [kg/m3],
///   `drag_coefficient` C_D > 0, `g` [m/s2] > 0.
/// * Validity: pool boiling near the critical heat flux, where Cole took his
///   photographs; no numeric range published that we know of. Nothing flagged.
/// * Verification: form with `C_D = 1` \[V2\] (OpenFOAM's implementation); paper
///   not seen. Identity: `f ∝ g^(1/2) D^(−1/2)`, like Ivey's hydrodynamic region.
///
/// Reference: R. Cole, "A photographic study of pool boiling in the region of
/// the critical heat flux", AIChE J. 6 (1960) 533-538, doi:10.1002/aic.690060405
/// (DOI from memory).
#[inline(always)]
pub fn cole_frequency(diameter: f64, rho_l: f64, rho_v: f64, drag_coefficient: f64, g: f64) -> f64 {
    let ok = freq_possible(diameter, rho_l, rho_v, g) & positive(drag_coefficient);
    with_bubble(ok, diameter, (4.0 * g * (rho_l - rho_v) / (3.0 * drag_coefficient * diameter * rho_l)).sqrt())
}

/// Kernel of [`cole_frequency`].
pub struct ColeFrequency;
impl Kernel<5, 1> for ColeFrequency {
    const MODEL: Model = Model {
        name: "cole_frequency",
        summary: "Cole (1960) bubble departure frequency from a drag-buoyancy rise velocity",
        equation: "f = sqrt(4*g*(rho_l-rho_v)/(3*C_D*D*rho_l)), C_D = 1",
        inputs: &[
            arg("diameter", "m"),
            arg("fluid.rho_l", "kg/m3"),
            arg("fluid.rho_v", "kg/m3"),
            arg("drag_coefficient", "-"),
            arg("g", "m/s2"),
        ],
        outputs: &[arg("frequency", "Hz")],
        domain: "diameter >= 0, rho_l > rho_v >= 0, drag_coefficient > 0, g > 0",
        validity: "no published numeric range (pool boiling near the critical heat flux); diameter > 0 (a zero \
                   diameter has no departure cycle: NaN, flagged)",
        reference: "R. Cole, A photographic study of pool boiling in the region of the critical heat flux, AIChE J. 6 (1960) 533-538",
        doi: "10.1002/aic.690060405",
        verification: "form with C_D = 1: secondary source (OpenFOAM implementation); DOI from memory",
    };
    #[inline(always)]
    fn eval(x: &[f64; 5]) -> [f64; 1] {
        [cole_frequency(x[0], x[1], x[2], x[3], x[4])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 5]) -> bool {
        freq_possible(x[0], x[1], x[2], x[4]) && positive(x[3])
    }
    #[inline(always)]
    fn in_range(x: &[f64; 5]) -> bool {
        x[0] > 0.0
    }
}

/// Zuber (1963) departure frequency \[Hz\].
///
/// `f = (K / D) [σ g (ρ_l − ρ_v) / ρ_l²]^(1/4)` with `K = 0.59` (Zuber); the
/// bracket is the terminal rise velocity of a large bubble (Harmathy's form).
/// Kocamustafaogullari & Ishii (1995) use the same form with `K = 1.18` (= 2 × 0.59);
/// pass it as `constant` rather than confusing the two.
///
/// * `diameter` D \[m\] ≥ 0 (0: NaN, flagged), `sigma` [N/m] > 0, `rho_l`, `rho_v` [kg/m3],
///   `constant` K > 0, `g` [m/s2] > 0.
/// * Validity: no published numeric range; isolated-bubble region of pool boiling.
/// * Verification: constant 0.59 [M, high]; 1.18 \[V2\] (OpenFOAM's
///   implementation of Kocamustafaogullari & Ishii 1995). Identity: `f ∝ g^(1/4)/D`.
///
/// References: N. Zuber, "Nucleate boiling. The region of isolated bubbles and
/// the similarity with natural convection", Int. J. Heat Mass Transfer 6 (1963)
/// 53-78; G. Kocamustafaogullari, M. Ishii, Int. J. Heat Mass Transfer 38 (1995)
/// 481-493 (DOIs not verified here, so not given).
#[inline(always)]
pub fn zuber_frequency(diameter: f64, sigma: f64, rho_l: f64, rho_v: f64, constant: f64, g: f64) -> f64 {
    let ok = freq_possible(diameter, rho_l, rho_v, g) & positive(sigma) & positive(constant);
    with_bubble(ok, diameter, constant / diameter * (sigma * g * (rho_l - rho_v) / (rho_l * rho_l)).sqrt().sqrt())
}

/// Kernel of [`zuber_frequency`].
pub struct ZuberFrequency;
impl Kernel<6, 1> for ZuberFrequency {
    const MODEL: Model = Model {
        name: "zuber_frequency",
        summary: "Zuber (1963) bubble departure frequency from the large-bubble rise velocity",
        equation: "f = K/D * (sigma*g*(rho_l-rho_v)/rho_l**2)**0.25, K = 0.59 (Zuber) or 1.18 (Kocamustafaogullari-Ishii 1995)",
        inputs: &[
            arg("diameter", "m"),
            arg("fluid.sigma", "N/m"),
            arg("fluid.rho_l", "kg/m3"),
            arg("fluid.rho_v", "kg/m3"),
            arg("constant", "-"),
            arg("g", "m/s2"),
        ],
        outputs: &[arg("frequency", "Hz")],
        domain: "diameter >= 0, sigma > 0, rho_l > rho_v >= 0, constant > 0, g > 0",
        validity: "no published numeric range (isolated-bubble region of pool boiling); diameter > 0 (a zero \
                   diameter has no departure cycle: NaN, flagged)",
        reference: "N. Zuber, Nucleate boiling. The region of isolated bubbles and the similarity with natural convection, \
                    Int. J. Heat Mass Transfer 6 (1963) 53-78",
        doi: "",
        verification: "0.59 from memory (high confidence); 1.18 secondary source (OpenFOAM); DOI not verified",
    };
    #[inline(always)]
    fn eval(x: &[f64; 6]) -> [f64; 1] {
        [zuber_frequency(x[0], x[1], x[2], x[3], x[4], x[5])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 6]) -> bool {
        freq_possible(x[0], x[2], x[3], x[5]) && positive(x[1]) && positive(x[4])
    }
    #[inline(always)]
    fn in_range(x: &[f64; 6]) -> bool {
        x[0] > 0.0
    }
}

/// Ivey (1967) departure frequency, hydrodynamic region \[Hz\].
///
/// `f D^(1/2) = 0.90 g^(1/2)`, i.e. `f = 0.90 (g/D)^(1/2)`; dimensionally
/// consistent, the constant holds in any unit system.
///
/// * `diameter` D \[m\] ≥ 0 (0: NaN, flagged), `g` [m/s2] > 0.
/// * Validity: Ivey's hydrodynamic region (larger bubbles, where buoyancy and
///   drag set the cycle); the region boundaries are not reproduced here, so
///   nothing is flagged.
/// * Verification: constant 0.90 [M, med]; paper not seen. Identity:
///   `f ∝ g^(1/2) D^(−1/2)`, the form of Cole's relation.
///
/// Reference: H.J. Ivey, "Relationships between bubble frequency, departure
/// diameter and rise velocity in nucleate boiling", Int. J. Heat Mass Transfer
/// 10 (1967) 1023-1040 (DOI not verified here, so not given).
#[inline(always)]
pub fn ivey_hydrodynamic_frequency(diameter: f64, g: f64) -> f64 {
    let ok = non_negative(diameter) & positive(g);
    with_bubble(ok, diameter, IVEY_HYDRODYNAMIC * (g / diameter).sqrt())
}

/// Ivey (1967) departure frequency, transition region \[Hz\].
///
/// `f D^(3/4) = 0.44 g^(1/2)`, published with D in cm and g in cm/s2, so that
/// the constant carries cm^(1/4). Converted: `f = 0.13914 g^(1/2) D^(−3/4)` with
/// D in m and g in m/s2 (0.44 cm^(1/4) = 0.44 × (0.01 m)^(1/4) =
/// [`IVEY_TRANSITION_SI`] m^(1/4)).
///
/// * `diameter` D \[m\] ≥ 0 (0: NaN, flagged), `g` [m/s2] > 0.
/// * Validity: Ivey's transition region; boundaries not reproduced, nothing flagged.
/// * Verification: 0.44 cm^(1/4) [M, med]; the conversion is \[D\] and checked in
///   the tests against the CGS evaluation.
///
/// Reference: as [`ivey_hydrodynamic_frequency`].
#[inline(always)]
pub fn ivey_transition_frequency(diameter: f64, g: f64) -> f64 {
    let ok = non_negative(diameter) & positive(g);
    // D^(-3/4) as 1/(D^(1/2) D^(1/4)): square roots, faster and closer than
    // exp(-0.75 ln D)
    let root = diameter.sqrt();
    with_bubble(ok, diameter, IVEY_TRANSITION_SI * g.sqrt() / (root * root.sqrt()))
}

const IVEY_REFERENCE: &str = "H.J. Ivey, Relationships between bubble frequency, departure diameter and rise velocity \
                              in nucleate boiling, Int. J. Heat Mass Transfer 10 (1967) 1023-1040";

/// Kernel of [`ivey_hydrodynamic_frequency`].
pub struct IveyHydrodynamicFrequency;
impl Kernel<2, 1> for IveyHydrodynamicFrequency {
    const MODEL: Model = Model {
        name: "ivey_hydrodynamic_frequency",
        summary: "Ivey (1967) bubble departure frequency, hydrodynamic region",
        equation: "f = 0.90 * sqrt(g / D)",
        inputs: &[arg("diameter", "m"), arg("g", "m/s2")],
        outputs: &[arg("frequency", "Hz")],
        domain: "diameter >= 0, g > 0",
        validity: "Ivey's hydrodynamic region (boundaries not reproduced, not flagged); diameter > 0 (a zero diameter \
                   has no departure cycle: NaN, flagged)",
        reference: IVEY_REFERENCE,
        doi: "",
        verification: "constant 0.90 from memory (medium confidence); paper not seen",
    };
    #[inline(always)]
    fn eval(x: &[f64; 2]) -> [f64; 1] {
        [ivey_hydrodynamic_frequency(x[0], x[1])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 2]) -> bool {
        non_negative(x[0]) && positive(x[1])
    }
    #[inline(always)]
    fn in_range(x: &[f64; 2]) -> bool {
        x[0] > 0.0
    }
}

/// Kernel of [`ivey_transition_frequency`].
pub struct IveyTransitionFrequency;
impl Kernel<2, 1> for IveyTransitionFrequency {
    const MODEL: Model = Model {
        name: "ivey_transition_frequency",
        summary: "Ivey (1967) bubble departure frequency, transition region (dimensional constant converted to SI)",
        equation: "f = 0.44 cm^0.25 * sqrt(g) * D**-0.75 = 0.13914 m^0.25 * sqrt(g) * D**-0.75",
        inputs: &[arg("diameter", "m"), arg("g", "m/s2")],
        outputs: &[arg("frequency", "Hz")],
        domain: "diameter >= 0, g > 0",
        validity: "Ivey's transition region (boundaries not reproduced, not flagged); diameter > 0 (a zero diameter \
                   has no departure cycle: NaN, flagged)",
        reference: IVEY_REFERENCE,
        doi: "",
        verification: "constant 0.44 cm^(1/4) from memory (medium confidence); SI conversion derived and tested",
    };
    #[inline(always)]
    fn eval(x: &[f64; 2]) -> [f64; 1] {
        [ivey_transition_frequency(x[0], x[1])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 2]) -> bool {
        non_negative(x[0]) && positive(x[1])
    }
    #[inline(always)]
    fn in_range(x: &[f64; 2]) -> bool {
        x[0] > 0.0
    }
}

// ---------------------------------------------------------------------------
// Waiting time

/// Waiting time before a cavity re-activates after a departure \[s\]: Hsu's
/// (1962) activation criterion with transient conduction into the liquid, in
/// the closed form of Han & Griffith (1965).
///
/// `t_w = 9 r_c² / (4 π α_l) [(ΔT_w + ΔT_sub) / (ΔT_w − ΔT_e)]²`,
/// `ΔT_e = 2 σ T_sat / (ρ_v h_lv r_c)`, `α_l = k_l/(ρ_l c_pl)`.
///
/// Model: after departure, liquid at `T_sat − ΔT_sub` touches the wall at
/// `T_sat + ΔT_w`; the thermal layer grows as `δ = (π α_l t)^(1/2)` (linear-profile
/// approximation of the semi-infinite conduction solution). The cavity fires
/// when the liquid at the top of the nucleus, `y = 3/2 r_c`, reaches the
/// embryo's equilibrium superheat `ΔT_e` in Hsu's form with `1/ρ_v`, the one
/// [`crate::nucleation::hsu_active_radii`] uses (and the limit of the exact
/// embryo superheat for large radii; the `v_lv` form of
/// [`crate::nucleation::embryo_superheat`] is lower by `1 − ρ_v/ρ_l`, 5 % at
/// 70 bar and 16 % at 150 bar for water, and let a cavity fire here that the
/// active range rules out). Solving `T(3/2 r_c, t_w) = T_sat + ΔT_e` gives the
/// formula \[D\].
///
/// * `cavity_radius` r_c \[m\] > 0, `wall_superheat` ΔT_w \[K\] ≥ 0, `subcooling`
///   ΔT_sub \[K\] ≥ 0, fluid `sigma`, `t_sat` \[K\], `rho_l`, `rho_v`, `h_lv`, `k_l`, `cp_l`.
/// * No answer (NaN, not counted as invalid): `ΔT_w ≤ ΔT_e`, the cavity never
///   becomes active at this superheat.
/// * Validity: no published range; the nucleus height 3/2 r_c and the linear
///   profile are the model's approximations. Nothing flagged.
/// * Verification: the closed form and the factor 3/2 are [M, med]; the
///   derivation from the stated model is \[D\] and checked in the tests.
///
/// References: Y.Y. Hsu, "On the size range of active nucleation cavities on a
/// heating surface", J. Heat Transfer 84 (1962) 207-213, doi:10.1115/1.3684339;
/// C.-Y. Han, P. Griffith, "The mechanism of heat transfer in nucleate pool
/// boiling - Part I", Int. J. Heat Mass Transfer 8 (1965) 887-904,
/// doi:10.1016/0017-9310(65)90073-2 (DOI from memory).
#[inline(always)]
#[allow(clippy::too_many_arguments)]
pub fn waiting_time(
    cavity_radius: f64,
    wall_superheat: f64,
    subcooling: f64,
    sigma: f64,
    t_sat: f64,
    rho_l: f64,
    rho_v: f64,
    h_lv: f64,
    k_l: f64,
    cp_l: f64,
) -> f64 {
    let x = [cavity_radius, wall_superheat, subcooling, sigma, t_sat, rho_l, rho_v, h_lv, k_l, cp_l];
    let de = crate::nucleation::vapour_group(sigma, t_sat, rho_v, h_lv) / cavity_radius;
    let margin = wall_superheat - de;
    let alpha = k_l / (rho_l * cp_l);
    let q = (wall_superheat + subcooling) / margin;
    // no waiting time (the cavity never activates) unless the wall superheat exceeds the embryo's
    nan_unless(waiting_possible(&x) & (margin > 0.0), 9.0 * cavity_radius * cavity_radius / (4.0 * PI * alpha) * q * q)
}

#[inline(always)]
fn waiting_possible(x: &[f64; 10]) -> bool {
    all_positive!(x[0], x[3], x[4], x[6], x[7], x[8], x[9]; x[1], x[2]) & densities(x[5], x[6])
}

/// Kernel of [`waiting_time`].
pub struct WaitingTime;
impl Kernel<10, 1> for WaitingTime {
    const MODEL: Model = Model {
        name: "hsu_waiting_time",
        summary: "Waiting time before a cavity re-activates: Hsu's criterion with transient conduction (Han-Griffith form)",
        equation: "t_w = 9 r_c^2/(4 pi alpha_l) * ((dT_w + dT_sub)/(dT_w - 2 sigma T_sat/(rho_v h_lv r_c)))**2",
        inputs: &[
            arg("cavity_radius", "m"),
            arg("wall_superheat", "K"),
            arg("subcooling", "K"),
            arg("fluid.sigma", "N/m"),
            arg("fluid.T", "K"),
            arg("fluid.rho_l", "kg/m3"),
            arg("fluid.rho_v", "kg/m3"),
            arg("fluid.h_lv", "J/kg"),
            arg("fluid.k_l", "W/(m K)"),
            arg("fluid.cp_l", "J/(kg K)"),
        ],
        outputs: &[arg("waiting_time", "s")],
        domain: "cavity_radius > 0, wall_superheat >= 0, subcooling >= 0, positive fluid properties, rho_l > rho_v",
        validity: "no published range (linear-profile transient conduction; nucleus height 3/2 r_c)",
        reference: "Y.Y. Hsu, On the size range of active nucleation cavities on a heating surface, J. Heat Transfer 84 \
                    (1962) 207-213; C.-Y. Han, P. Griffith, Int. J. Heat Mass Transfer 8 (1965) 887-904",
        doi: "10.1115/1.3684339",
        verification: "closed form and factor 3/2 from memory (medium confidence); derivation from the stated model checked",
    };
    #[inline(always)]
    fn eval(x: &[f64; 10]) -> [f64; 1] {
        [waiting_time(x[0], x[1], x[2], x[3], x[4], x[5], x[6], x[7], x[8], x[9])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 10]) -> bool {
        waiting_possible(x)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::model::{evaluate, Status};
    use approx::assert_relative_eq;

    // Saturated water at 1 atm (373.124 K), IAPWS-95 as tabulated by NIST
    // Webbook / CoolProp 6.x [values recalled from memory, 4 digits]:
    // sigma = 0.05891 N/m, rho_l = 958.35, rho_v = 0.5982 kg/m3, h_lv = 2.2564e6 J/kg,
    // cp_l = 4215.7 J/(kg K), k_l = 0.6791 W/(m K), mu_l = 2.8176e-4 Pa s.
    const S: f64 = 0.05891;
    const RL: f64 = 958.35;
    const RV: f64 = 0.5982;
    const HLV: f64 = 2.2564e6;
    const CPL: f64 = 4215.7;
    const KL: f64 = 0.6791;
    const MUL: f64 = 2.8176e-4;
    const TS: f64 = 373.124;
    const G: f64 = 9.80665;

    #[test]
    fn capillary_length_form() {
        // Identity: 0.0208 θ_deg = 1.1918 θ_rad (0.0208 * 180/π = 1.19175).
        let lc = (S / (9.80665 * (RL - RV))).sqrt();
        let d = fritz(45.0, S, RL, RV, 9.80665);
        assert_relative_eq!(d, 0.0208 * 180.0 / std::f64::consts::PI * (45f64).to_radians() * lc, max_relative = 1e-12);
        // l_c of water at 1 atm is 2.5 mm (common practice figure).
        assert_relative_eq!(lc, 2.5e-3, max_relative = 0.01);
    }

    #[test]
    fn limits() {
        assert_eq!(fritz(0.0, S, RL, RV, 9.80665), 0.0);
        assert!(fritz(90.0, S, RL, RV, 9.80665) < fritz(91.0, S, RL, RV, 9.80665));
        // Gravity scaling g^-1/2.
        let r = fritz(50.0, S, RL, RV, 9.80665) / fritz(50.0, S, RL, RV, 4.0 * 9.80665);
        assert_relative_eq!(r, 2.0, max_relative = 1e-12);
        for bad in [-1.0, 180.1, f64::INFINITY] {
            assert!(fritz(bad, S, RL, RV, 9.80665).is_nan());
        }
        assert!(fritz(45.0, -S, RL, RV, 9.80665).is_nan());
        assert!(fritz(45.0, S, RV, RL, 9.80665).is_nan());
        assert!(fritz(45.0, S, RL, RV, 0.0).is_nan());
    }

    #[test]
    fn cole_rohsenow_form_and_limits() {
        let lc = (S / (G * (RL - RV))).sqrt();
        let ja = RL * CPL * TS / (RV * HLV);
        let d = cole_rohsenow(S, RL, RV, CPL, TS, HLV, COLE_ROHSENOW_WATER, G);
        assert_relative_eq!(d, 1.5e-4 * lc * ja.powf(1.25), max_relative = 1e-14);
        // [D] water at 1 atm: Ja* about 1118, D about 2.4 mm.
        assert!((1110.0..1125.0).contains(&ja), "{ja}");
        assert!((2.3e-3..2.5e-3).contains(&d), "{d}");
        // Ja*^(5/4): doubling T_sat (other properties fixed) multiplies D by 2^1.25.
        let d2 = cole_rohsenow(S, RL, RV, CPL, 2.0 * TS, HLV, COLE_ROHSENOW_WATER, G);
        assert_relative_eq!(d2 / d, 2f64.powf(1.25), max_relative = 1e-12);
        // g^-1/2 and linear in C.
        assert_relative_eq!(d / cole_rohsenow(S, RL, RV, CPL, TS, HLV, 1.5e-4, 4.0 * G), 2.0, max_relative = 1e-12);
        let other = cole_rohsenow(S, RL, RV, CPL, TS, HLV, COLE_ROHSENOW_OTHER, G);
        assert_relative_eq!(other / d, 4.65 / 1.5, max_relative = 1e-12);
        assert!(cole_rohsenow(S, RL, RV, CPL, TS, HLV, 0.0, G).is_nan());
        assert!(cole_rohsenow(S, RL, 0.0, CPL, TS, HLV, 1.5e-4, G).is_nan());
        assert!(cole_rohsenow(S, RL, RV, CPL, f64::NAN, HLV, 1.5e-4, G).is_nan());
    }

    #[test]
    fn kocamustafaogullari_ishii_is_fritz_times_density_factor() {
        let ratio = ((RL - RV) / RV).powf(0.9);
        for theta in [10.0, 45.0, 80.0] {
            let ki = kocamustafaogullari_ishii(theta, S, RL, RV, G);
            let fr = fritz(theta, S, RL, RV, G);
            // 2.5e-5 on theta_deg * l_c == (2.5e-5/0.0208) * ratio * D_Fritz (0.0012 to 0.16 %).
            assert_relative_eq!(ki, 2.5e-5 / 0.0208 * ratio * fr, max_relative = 1e-12);
            assert_relative_eq!(ki, 0.0012 * ratio * fr, max_relative = 2e-3);
            // The mis-transcription (2.5e-5 applied to D_Fritz) is 48x smaller: not what we compute.
            let wrong = 2.5e-5 * ratio * fr;
            assert_relative_eq!(ki / wrong, 1.0 / 0.0208, max_relative = 1e-12);
        }
        // [D] water at 1 atm and 45 deg: about 2.2 mm (the wrong form gives about 0.045 mm).
        let d = kocamustafaogullari_ishii(45.0, S, RL, RV, G);
        assert!((2.1e-3..2.25e-3).contains(&d), "{d}");
        assert_eq!(kocamustafaogullari_ishii(0.0, S, RL, RV, G), 0.0);
        assert!(kocamustafaogullari_ishii(30.0, S, RL, RV, G) < kocamustafaogullari_ishii(60.0, S, RL, RV, G));
        let r = kocamustafaogullari_ishii(50.0, S, RL, RV, G) / kocamustafaogullari_ishii(50.0, S, RL, RV, 4.0 * G);
        assert_relative_eq!(r, 2.0, max_relative = 1e-12);
        assert!(kocamustafaogullari_ishii(45.0, S, RL, 0.0, G).is_nan());
        assert!(kocamustafaogullari_ishii(-1.0, S, RL, RV, G).is_nan());
    }

    /// Water at 1 atm with the default closures and the given case.
    fn fb(adv: f64, rec: f64, superheat: f64, velocity: f64, orientation: f64, g: f64) -> [f64; 5] {
        force_balance(
            adv,
            rec,
            S,
            RL,
            RV,
            HLV,
            CPL,
            KL,
            MUL,
            superheat,
            velocity,
            orientation,
            DEFAULT_CONTACT_RATIO,
            DEFAULT_INCLINATION_DEG,
            PLESSET_ZWICK_GROWTH_CONSTANT,
            DEFAULT_FRICTION_RATIO,
            g,
        )
    }

    /// \[D\] Lift-off without flow and without growth force on an upward wall:
    /// (π/6) D³ Δρ g = π k D σ (s_y − k/5).
    fn static_lift_off(adv: f64, rec: f64, g: f64) -> f64 {
        let (a, b) = (adv.to_radians(), rec.to_radians());
        let s_y = if a == b { a.sin() } else { (b.cos() - a.cos()) / (a - b) };
        let k = DEFAULT_CONTACT_RATIO;
        (6.0 * k * S * (s_y - k / 5.0) / (g * (RL - RV))).sqrt()
    }

    #[test]
    fn pool_boiling_without_growth_is_buoyancy_against_surface_tension() {
        for (adv, rec) in [(45.0, 45.0), (50.0, 30.0), (90.0, 60.0), (20.0, 20.0)] {
            let r = fb(adv, rec, 0.0, 0.0, 0.0, G);
            assert_relative_eq!(r[0], static_lift_off(adv, rec, G), max_relative = 1e-9);
            assert_eq!(r[1], MODE_LIFT_OFF);
            assert_eq!(r[2], DRIVER_BUOYANCY);
            assert!(r[3].is_nan()); // nothing drives sliding on a horizontal wall without flow
            assert_eq!(r[0], r[4]);
        }
        // g^-1/2 scaling in that limit.
        assert_relative_eq!(fb(45.0, 45.0, 0.0, 0.0, 0.0, G)[0] / fb(45.0, 45.0, 0.0, 0.0, 0.0, 4.0 * G)[0], 2.0, max_relative = 1e-9);
        // At 45 deg the default contact ratio agrees with Fritz within 5 % (our calibration of the default).
        assert_relative_eq!(fb(45.0, 45.0, 0.0, 0.0, 0.0, G)[0], fritz(45.0, S, RL, RV, G), max_relative = 0.05);
        // Zero angle and no growth force: nothing holds the bubble.
        assert_eq!(fb(0.0, 0.0, 0.0, 0.0, 0.0, G)[0], 0.0);
    }

    #[test]
    fn diameter_grows_with_angle_and_with_hysteresis_hold() {
        let mut last = 0.0;
        for theta in [5.0, 15.0, 30.0, 45.0, 60.0, 75.0, 90.0] {
            for superheat in [0.0, 3.0] {
                let d = fb(theta, theta, superheat, 0.0, 0.0, G)[0];
                assert!(d.is_finite() && d > 0.0);
                if superheat == 0.0 {
                    assert!(d > last, "{theta}: {d} <= {last}");
                    last = d;
                }
            }
        }
        // The alpha = beta limit of F_sy is continuous (0/0 handled explicitly).
        let exact = fb(45.0, 45.0, 2.0, 0.0, 0.0, G)[0];
        let near = fb(45.0, 45.0 - 1e-7, 2.0, 0.0, 0.0, G)[0];
        assert_relative_eq!(exact, near, max_relative = 1e-6);
    }

    #[test]
    fn growth_force_is_size_independent_and_holds_the_bubble() {
        let x = [45.0, 40.0, S, RL, RV, HLV, CPL, KL, MUL, 5.0, 0.0, 0.0, 0.2, 10.0, 3f64.sqrt(), 0.04, G];
        let b = Balance::new(&x);
        let (f1, f2) = (b.forces(1e-4), b.forces(3e-3));
        assert_eq!(f1.growth_y, f2.growth_y);
        let ja = RL * CPL * 5.0 / (RV * HLV);
        let kg = 2.0 * 3f64.sqrt() / PI.sqrt() * ja * (KL / (RL * CPL)).sqrt();
        assert_relative_eq!(-f1.growth_y, 9.0 / 4.0 * PI * RL * kg.powi(4) * 10f64.to_radians().cos(), max_relative = 1e-12);
        // More superheat, faster growth, larger departure diameter.
        assert!(fb(45.0, 40.0, 5.0, 0.0, 0.0, G)[0] > fb(45.0, 40.0, 1.0, 0.0, 0.0, G)[0]);
        // Growth force removed: the balance's value at the root is zero.
        let d = fb(45.0, 40.0, 5.0, 0.0, 0.0, G)[0];
        assert!(b.forces(d * (1.0 - 1e-9)).lift_off_excess() <= 0.0);
        assert!(b.forces(d * (1.0 + 1e-9)).lift_off_excess() > 0.0);
    }

    #[test]
    fn orientation() {
        // Facing down without flow: buoyancy presses the bubble on the wall.
        let r = fb(45.0, 30.0, 2.0, 0.0, 180.0, G);
        assert!(r[0].is_nan() && r[3].is_nan() && r[4].is_nan());
        assert_eq!((r[1], r[2]), (MODE_NONE, DRIVER_NONE));
        // Vertical wall without flow and without growth: slides when buoyancy
        // beats the along-wall capillary force, (π/6) D³ Δρ g = k D σ c_x [D].
        let (a, b) = (60f64.to_radians(), 40f64.to_radians());
        let cx = 1.25 * PI * (a - b) * (a.sin() + b.sin()) / (PI * PI - (a - b) * (a - b));
        let k = DEFAULT_CONTACT_RATIO;
        let expect = (6.0 * k * S * cx / (PI * G * (RL - RV))).sqrt();
        let r = fb(60.0, 40.0, 0.0, 0.0, 90.0, G);
        assert_relative_eq!(r[0], expect, max_relative = 1e-9);
        assert_eq!((r[1], r[2]), (MODE_SLIDING, DRIVER_BUOYANCY));
        assert!(r[4].is_nan()); // no normal force lifts it on a vertical wall without flow
        // No hysteresis and no growth force on a vertical wall: nothing holds it.
        assert_eq!(fb(50.0, 50.0, 0.0, 0.0, 90.0, G)[0], 0.0);
        // Tilting an upward wall lowers the normal buoyancy: lift-off diameter grows.
        assert!(fb(45.0, 45.0, 1.0, 0.0, 30.0, G)[4] > fb(45.0, 45.0, 1.0, 0.0, 0.0, G)[4]);
    }

    #[test]
    fn flow_makes_bubbles_slide_off_smaller() {
        // Water at 1 atm, 2 K superheat: pool about 2.2 mm, then smaller with flow.
        let pool = fb(45.0, 36.0, 2.0, 0.0, 0.0, G);
        let mut last = pool[0];
        for u in [0.25, 0.5, 1.0, 2.0] {
            let r = fb(45.0, 36.0, 2.0, u, 0.0, G);
            assert!(r[0] < last, "{u}: {} >= {last}", r[0]);
            last = r[0];
            // A flow in -x gives the same sizes on a horizontal wall.
            let back = fb(45.0, 36.0, 2.0, -u, 0.0, G);
            assert_relative_eq!(back[0], r[0], max_relative = 1e-12);
        }
        let r = fb(45.0, 36.0, 2.0, 2.0, 0.0, G);
        assert_eq!((r[1], r[2]), (MODE_SLIDING, DRIVER_DRAG));
        // With a strong growth force (5 K) the growth force's along-wall part holds
        // the bubble and it lifts off instead, pushed by the shear lift.
        let r = fb(45.0, 36.0, 5.0, 2.0, 0.0, G);
        assert_eq!((r[1], r[2]), (MODE_LIFT_OFF, DRIVER_SHEAR_LIFT));
    }

    #[test]
    fn force_balance_domain_and_classification() {
        assert!(fb(30.0, 40.0, 1.0, 0.0, 0.0, G)[0].is_nan()); // receding above advancing
        assert!(fb(30.0, 20.0, -1.0, 0.0, 0.0, G)[0].is_nan());
        assert!(fb(30.0, 20.0, 1.0, f64::INFINITY, 0.0, G)[0].is_nan());
        assert!(fb(30.0, 20.0, 1.0, 0.0, 181.0, G)[0].is_nan());
        let mut x = [45.0, 40.0, S, RL, RV, HLV, CPL, KL, MUL, 5.0, 0.0, 120.0, 0.2, 10.0, 3f64.sqrt(), 0.04, G];
        assert_eq!(evaluate::<ForceBalance, 17, 5>(&x).1, Status::OutOfRange);
        x[12] = 0.0; // contact ratio must be positive
        assert_eq!(evaluate::<ForceBalance, 17, 5>(&x).1, Status::Invalid);
        x[12] = 0.2;
        x[11] = 180.0;
        x[9] = 1.0;
        // facing down: no departure, a legitimate NaN (flagged only as out of range)
        let (y, s) = evaluate::<ForceBalance, 17, 5>(&x);
        assert!(y[0].is_nan());
        assert_eq!(s, Status::OutOfRange);
        // Full-range hysteresis: singular along the wall, never slides; finite otherwise.
        let r = fb(180.0, 0.0, 1.0, 1.0, 0.0, G);
        assert!(r[3].is_nan());
    }

    #[test]
    fn frequencies() {
        let d = 2.5e-3;
        // Cole with C_D = 1, Zuber 0.59: the published forms.
        assert_relative_eq!(
            cole_frequency(d, RL, RV, 1.0, G),
            (4.0 * G * (RL - RV) / (3.0 * d * RL)).sqrt(),
            max_relative = 1e-14
        );
        assert_relative_eq!(
            zuber_frequency(d, S, RL, RV, ZUBER_FREQUENCY_CONSTANT, G) * d,
            0.59 * (S * G * (RL - RV) / (RL * RL)).powf(0.25),
            max_relative = 1e-14
        );
        // Ivey hydrodynamic: f D^(1/2) = 0.90 g^(1/2).
        assert_relative_eq!(ivey_hydrodynamic_frequency(d, G) * d.sqrt(), 0.90 * G.sqrt(), max_relative = 1e-14);
        // Ivey transition: evaluate the published CGS form (D in cm, g in cm/s2) and compare.
        let cgs = 0.44 * (100.0 * G).sqrt() * (100.0 * d).powf(-0.75);
        assert_relative_eq!(ivey_transition_frequency(d, G), cgs, max_relative = 1e-12);
        // Scalings: Cole and Ivey hydrodynamic g^1/2 D^-1/2, Zuber g^1/4 D^-1.
        assert_relative_eq!(cole_frequency(d, RL, RV, 1.0, 4.0 * G) / cole_frequency(d, RL, RV, 1.0, G), 2.0, max_relative = 1e-12);
        assert_relative_eq!(cole_frequency(d, RL, RV, 1.0, G) / cole_frequency(4.0 * d, RL, RV, 1.0, G), 2.0, max_relative = 1e-12);
        assert_relative_eq!(
            zuber_frequency(d, S, RL, RV, 0.59, 16.0 * G) / zuber_frequency(d, S, RL, RV, 0.59, G),
            2.0,
            max_relative = 1e-12
        );
        for bad in [0.0, -1e-3, f64::INFINITY] {
            assert!(cole_frequency(bad, RL, RV, 1.0, G).is_nan() || bad.is_infinite());
            assert!(ivey_hydrodynamic_frequency(bad, G).is_nan() || bad.is_infinite());
        }
        assert!(zuber_frequency(d, -S, RL, RV, 0.59, G).is_nan());
        assert!(cole_frequency(d, RL, RV, 0.0, G).is_nan());
    }

    #[test]
    fn waiting_time_solves_its_model() {
        let (rc, dtw, sub) = (5e-6, 8.0, 3.0);
        let t = waiting_time(rc, dtw, sub, S, TS, RL, RV, HLV, KL, CPL);
        // At t_w the linear-profile liquid temperature at y = 3/2 r_c equals T_sat + dT_e,
        // Hsu's embryo superheat 2 sigma T_sat / (rho_v h_lv r_c).
        let alpha = KL / (RL * CPL);
        let delta = (PI * alpha * t).sqrt();
        let t_at = dtw - (dtw + sub) * 1.5 * rc / delta; // above T_sat
        let de = 2.0 * S * TS / (RV * HLV * rc);
        assert_relative_eq!(t_at, de, max_relative = 1e-10);
        // Subcooling lengthens the wait; more superheat shortens it.
        assert!(waiting_time(rc, dtw, 0.0, S, TS, RL, RV, HLV, KL, CPL) < t);
        assert!(waiting_time(rc, 2.0 * dtw, sub, S, TS, RL, RV, HLV, KL, CPL) < t);
        // A cavity that cannot fire at this superheat has no waiting time.
        let too_small = 1e-7; // needs about 326 K
        assert!(waiting_time(too_small, dtw, sub, S, TS, RL, RV, HLV, KL, CPL).is_nan());
        let (y, s) = evaluate::<WaitingTime, 10, 1>(&[too_small, dtw, sub, S, TS, RL, RV, HLV, KL, CPL]);
        assert!(y[0].is_nan());
        assert_eq!(s, Status::Ok);
        assert!(waiting_time(-rc, dtw, sub, S, TS, RL, RV, HLV, KL, CPL).is_nan());
    }
}
