//! Bubble departure diameter and frequency.

use crate::model::{angle_deg, arg, densities, positive, Kernel, Model};

/// Fritz (1935) departure diameter [m].
///
/// `D_d = 0.0208 θ [σ / (g (ρ_l − ρ_v))]^(1/2)` with θ the static contact angle in
/// **degrees**, measured through the liquid; equivalently `1.1918 θ_rad l_c` with
/// `l_c` the capillary length.
///
/// * `contact_angle_deg` θ [deg], `sigma` [N/m], `rho_l`, `rho_v` [kg/m3], `g` [m/s2].
/// * Physically possible: 0 ≤ θ ≤ 180, σ > 0, ρ_l > ρ_v ≥ 0, g > 0; otherwise NaN.
/// * Fritz fitted the maximum volume of a *static* bubble on a horizontal,
///   upward-facing wall (numerical solutions of the Young-Laplace equation,
///   Bashforth-Adams tables) for contact angles up to about 90°; we flag larger angles.
///
/// Reference: W. Fritz, "Berechnung des Maximalvolumens von Dampfblasen",
/// Physikalische Zeitschrift 36 (1935) 379-384.
#[inline]
pub fn fritz(contact_angle_deg: f64, sigma: f64, rho_l: f64, rho_v: f64, g: f64) -> f64 {
    if !(angle_deg(contact_angle_deg) && positive(sigma) && densities(rho_l, rho_v) && positive(g)) {
        return f64::NAN;
    }
    FRITZ_CONSTANT_PER_DEG * contact_angle_deg * (sigma / (g * (rho_l - rho_v))).sqrt()
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
    fn possible(x: &[f64; 5]) -> bool {
        angle_deg(x[0]) && positive(x[1]) && densities(x[2], x[3]) && positive(x[4])
    }
    fn in_range(x: &[f64; 5]) -> bool {
        x[0] <= 90.0
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    // Saturated water at 1 atm (373.124 K), IAPWS-95 as tabulated by NIST
    // Webbook / CoolProp 6.x [values recalled from memory, 4 digits]:
    // sigma = 0.05891 N/m, rho_l = 958.35, rho_v = 0.5982 kg/m3.
    const S: f64 = 0.05891;
    const RL: f64 = 958.35;
    const RV: f64 = 0.5982;

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
}
