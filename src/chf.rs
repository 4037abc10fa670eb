//! Critical heat flux (maximum of the nucleate boiling curve).

use crate::model::{angle_deg, arg, densities, positive, Kernel, Model};
use crate::trig::cos_deg;
use std::f64::consts::PI;

/// Zuber's constant π/24 of the hydrodynamic CHF [-].
pub const ZUBER_K: f64 = PI / 24.0;
/// Lienhard and Dhir's constant for a large (infinite) flat heater [-].
pub const LIENHARD_DHIR_K: f64 = 0.149;

/// Hydrodynamic critical heat flux [W/m2], Kutateladze-Zuber form.
///
/// `q_max = K h_lv ρ_v^(1/2) [σ g (ρ_l − ρ_v)]^(1/4)`
///
/// * `h_lv` [J/kg], `rho_l`, `rho_v` [kg/m3], `sigma` [N/m], `K` [-], `g` [m/s2].
/// * `K = π/24 ≈ 0.131` (Zuber 1959); `K = 0.149` for a large horizontal flat
///   heater facing up (Lienhard and Dhir 1973, dimensionless size L' > 27).
/// * Zuber's original carries the extra factor `[(ρ_l + ρ_v)/ρ_l]^(1/2)`, below
///   0.04 % for water at 1 atm and omitted here as in the later literature.
/// * Possible: all properties and `K`, `g` positive, ρ_l > ρ_v; otherwise NaN.
///
/// References: N. Zuber, "Hydrodynamic aspects of boiling heat transfer",
/// AEC Report AECU-4439 (1959); J.H. Lienhard and V.K. Dhir, "Hydrodynamic
/// prediction of peak pool-boiling heat fluxes from finite bodies",
/// J. Heat Transfer 95 (1973) 152-158, doi:10.1115/1.3450013.
#[inline]
pub fn zuber(h_lv: f64, rho_l: f64, rho_v: f64, sigma: f64, k: f64, g: f64) -> f64 {
    if !(positive(h_lv) && densities(rho_l, rho_v) && positive(rho_v) && positive(sigma) && positive(k) && positive(g)) {
        return f64::NAN;
    }
    k * h_lv * rho_v.sqrt() * (sigma * g * (rho_l - rho_v)).sqrt().sqrt()
}

/// Kernel of [`zuber`].
pub struct Zuber;
impl Kernel<6, 1> for Zuber {
    const MODEL: Model = Model {
        name: "zuber_chf",
        summary: "Hydrodynamic critical heat flux (Kutateladze-Zuber form) with the constant as a parameter",
        equation: "q_max = K * h_lv * sqrt(rho_v) * (sigma * g * (rho_l - rho_v))**0.25",
        inputs: &[
            arg("fluid.h_lv", "J/kg"),
            arg("fluid.rho_l", "kg/m3"),
            arg("fluid.rho_v", "kg/m3"),
            arg("fluid.sigma", "N/m"),
            arg("K", "-"),
            arg("g", "m/s2"),
        ],
        outputs: &[arg("critical_heat_flux", "W/m2")],
        domain: "h_lv > 0, rho_l > rho_v > 0, sigma > 0, K > 0, g > 0",
        validity: "saturated pool boiling on a large upward-facing heater; 0.10 <= K <= 0.20 (the constants in use span 0.13 to 0.18)",
        reference: "N. Zuber, Hydrodynamic aspects of boiling heat transfer, AEC Report AECU-4439 (1959); \
                    J.H. Lienhard, V.K. Dhir, J. Heat Transfer 95 (1973) 152-158",
        doi: "10.1115/1.3450013",
        verification: "form and constants pi/24 and 0.149: textbook worked examples (see tests)",
    };
    #[inline(always)]
    fn eval(x: &[f64; 6]) -> [f64; 1] {
        [zuber(x[0], x[1], x[2], x[3], x[4], x[5])]
    }
    fn possible(x: &[f64; 6]) -> bool {
        positive(x[0]) && densities(x[1], x[2]) && positive(x[2]) && positive(x[3]) && positive(x[4]) && positive(x[5])
    }
    fn in_range(x: &[f64; 6]) -> bool {
        (0.10..=0.20).contains(&x[4])
    }
}

/// Kandlikar (2001) critical heat flux with receding contact angle and heater
/// orientation [W/m2].
///
/// `q_CHF = h_lv ρ_v^(1/2) [(1 + cos β)/16] [2/π + (π/4)(1 + cos β) cos φ]^(1/2) [σ g (ρ_l − ρ_v)]^(1/4)`
///
/// * β receding contact angle [deg] (through the liquid), φ heater orientation
///   [deg] from horizontal facing up (0) through vertical (90) to facing down (180).
/// * Published validity: 0 ≤ φ ≤ 90°. Beyond 90° the result is still computed
///   (and flagged out of range) while the bracket stays positive; where
///   `2/π + (π/4)(1 + cos β) cos φ ≤ 0` the model has no answer and gives NaN.
/// * Possible: 0 ≤ β ≤ 180, 0 ≤ φ ≤ 180, positive properties, ρ_l > ρ_v.
///
/// Reference: S.G. Kandlikar, "A theoretical model to predict pool boiling CHF
/// incorporating effects of contact angle and orientation", J. Heat Transfer
/// 123 (2001) 1071-1079, doi:10.1115/1.1409265.
#[inline]
pub fn kandlikar(
    receding_angle_deg: f64,
    orientation_deg: f64,
    h_lv: f64,
    rho_l: f64,
    rho_v: f64,
    sigma: f64,
    g: f64,
) -> f64 {
    if !(angle_deg(receding_angle_deg)
        && angle_deg(orientation_deg)
        && positive(h_lv)
        && densities(rho_l, rho_v)
        && positive(rho_v)
        && positive(sigma)
        && positive(g))
    {
        return f64::NAN;
    }
    let c = 1.0 + cos_deg(receding_angle_deg);
    let bracket = 2.0 / PI + PI / 4.0 * c * cos_deg(orientation_deg);
    if bracket <= 0.0 {
        return f64::NAN;
    }
    h_lv * rho_v.sqrt() * (c / 16.0) * bracket.sqrt() * (sigma * g * (rho_l - rho_v)).sqrt().sqrt()
}

/// Kernel of [`kandlikar`].
pub struct Kandlikar;
impl Kernel<7, 1> for Kandlikar {
    const MODEL: Model = Model {
        name: "kandlikar_chf",
        summary: "Kandlikar (2001) critical heat flux from receding contact angle and heater orientation",
        equation: "q = h_lv*sqrt(rho_v)*(1+cos b)/16*sqrt(2/pi + pi/4*(1+cos b)*cos phi)*(sigma*g*(rho_l-rho_v))**0.25",
        inputs: &[
            arg("receding_angle_deg", "deg"),
            arg("orientation_deg", "deg"),
            arg("fluid.h_lv", "J/kg"),
            arg("fluid.rho_l", "kg/m3"),
            arg("fluid.rho_v", "kg/m3"),
            arg("fluid.sigma", "N/m"),
            arg("g", "m/s2"),
        ],
        outputs: &[arg("critical_heat_flux", "W/m2")],
        domain: "0 <= receding_angle_deg <= 180, 0 <= orientation_deg <= 180, positive properties, rho_l > rho_v",
        validity: "0 <= orientation_deg <= 90",
        reference: "S.G. Kandlikar, A theoretical model to predict pool boiling CHF incorporating effects of \
                    contact angle and orientation, J. Heat Transfer 123 (2001) 1071-1079",
        doi: "10.1115/1.1409265",
        verification: "see wetboil.chf.kandlikar docstring",
    };
    #[inline(always)]
    fn eval(x: &[f64; 7]) -> [f64; 1] {
        [kandlikar(x[0], x[1], x[2], x[3], x[4], x[5], x[6])]
    }
    fn possible(x: &[f64; 7]) -> bool {
        angle_deg(x[0])
            && angle_deg(x[1])
            && positive(x[2])
            && densities(x[3], x[4])
            && positive(x[4])
            && positive(x[5])
            && positive(x[6])
    }
    fn in_range(x: &[f64; 7]) -> bool {
        x[1] <= 90.0
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn incropera_example_10_1() {
        // Incropera, DeWitt, Bergman & Lavine, Fundamentals of Heat and Mass
        // Transfer, 6th ed., Example 10.1: water at 1 atm, C = 0.149,
        // rho_l = 957.9, rho_v = 0.5955 kg/m3, h_fg = 2257 kJ/kg, sigma = 58.9e-3 N/m,
        // g = 9.8 m/s2 (inputs as printed in the book [recalled from memory]);
        // printed answer q_max = 1.26 MW/m2.
        let q = zuber(2257e3, 957.9, 0.5955, 58.9e-3, 0.149, 9.8);
        assert_relative_eq!(q, 1.26e6, max_relative = 0.005);
    }

    #[test]
    fn kandlikar_limits_and_identities() {
        let (h, rl, rv, s, g): (f64, f64, f64, f64, f64) = (2257e3, 957.9, 0.5955, 58.9e-3, 9.80665);
        let group = h * rv.sqrt() * (s * g * (rl - rv)).powf(0.25);
        // beta = 0, phi = 0: K = (2/16) sqrt(2/pi + pi/2) = 0.1858 (identity of the form).
        let k0 = kandlikar(0.0, 0.0, h, rl, rv, s, g) / group;
        assert_relative_eq!(k0, 0.125 * (2.0 / PI + PI / 2.0).sqrt(), max_relative = 1e-12);
        // CHF falls as the receding angle rises and as the heater turns down.
        assert!(kandlikar(10.0, 0.0, h, rl, rv, s, g) > kandlikar(60.0, 0.0, h, rl, rv, s, g));
        assert!(kandlikar(45.0, 0.0, h, rl, rv, s, g) > kandlikar(45.0, 90.0, h, rl, rv, s, g));
        // Vertical: the orientation term vanishes.
        let kv = kandlikar(90.0, 90.0, h, rl, rv, s, g) / group;
        assert_relative_eq!(kv, (1.0 / 16.0) * (2.0 / PI).sqrt(), max_relative = 1e-12);
        // Facing down with a well-wetted wall: bracket negative, no answer.
        assert!(kandlikar(0.0, 180.0, h, rl, rv, s, g).is_nan());
        // At 180 deg receding angle, (1 + cos) = 0: zero CHF.
        assert_eq!(kandlikar(180.0, 0.0, h, rl, rv, s, g), 0.0);
        assert!(kandlikar(-1.0, 0.0, h, rl, rv, s, g).is_nan());
        assert!(kandlikar(10.0, 181.0, h, rl, rv, s, g).is_nan());
    }

    #[test]
    fn classification() {
        use crate::model::{evaluate, Status};
        let x = [30.0, 120.0, 2257e3, 957.9, 0.5955, 58.9e-3, 9.80665];
        assert_eq!(evaluate::<Kandlikar, 7, 1>(&x).1, Status::OutOfRange);
        let x = [30.0, 200.0, 2257e3, 957.9, 0.5955, 58.9e-3, 9.80665];
        assert_eq!(evaluate::<Kandlikar, 7, 1>(&x).1, Status::Invalid);
    }
}
