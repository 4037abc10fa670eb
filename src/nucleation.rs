//! Vapour embryos, nucleation and the onset of boiling.

use crate::model::{arg, densities, positive, Kernel, Model};

/// The group `2 σ T_sat v_lv / h_lv` [K m] shared by the embryo and onset models,
/// with `v_lv = 1/ρ_v − 1/ρ_l`.
#[inline(always)]
fn embryo_group(sigma: f64, t_sat: f64, rho_l: f64, rho_v: f64, h_lv: f64) -> f64 {
    2.0 * sigma * t_sat * (1.0 / rho_v - 1.0 / rho_l) / h_lv
}

#[inline(always)]
fn fluid_possible(sigma: f64, t_sat: f64, rho_l: f64, rho_v: f64, h_lv: f64) -> bool {
    positive(sigma) && positive(t_sat) && densities(rho_l, rho_v) && positive(rho_v) && positive(h_lv)
}

/// Equilibrium superheat of a vapour embryo of radius `r` [K], linearised form.
///
/// Young-Laplace `p_v − p_l = 2σ/r` with the Clausius-Clapeyron slope
/// `dp/dT = h_lv / (T v_lv)` taken as constant over the superheat:
///
/// `ΔT = 2 σ T_sat v_lv / (h_lv r)`, `v_lv = 1/ρ_v − 1/ρ_l`.
///
/// Where ρ_v ≪ ρ_l this is the familiar `2σT_sat/(ρ_v h_lv r)`; the `v_lv` form
/// stays right as the pressure rises towards the critical point.
/// Linearisation holds while `2σ/r` is small against the pressure; the result is
/// flagged out of range when it exceeds 10 % of T_sat (our own threshold: the
/// linear form then over-predicts by several percent against the integrated
/// Clausius-Clapeyron form at 1 atm).
///
/// References: the Young-Laplace and Clausius-Clapeyron relations; the
/// linearised embryo superheat is the one used by Y.Y. Hsu, "On the size range
/// of active nucleation cavities on a heating surface", J. Heat Transfer 84
/// (1962) 207-213, doi:10.1115/1.3684339.
#[inline]
pub fn embryo_superheat(radius: f64, sigma: f64, t_sat: f64, rho_l: f64, rho_v: f64, h_lv: f64) -> f64 {
    if !(positive(radius) && fluid_possible(sigma, t_sat, rho_l, rho_v, h_lv)) {
        return f64::NAN;
    }
    embryo_group(sigma, t_sat, rho_l, rho_v, h_lv) / radius
}

/// Radius of the vapour embryo in equilibrium at a liquid superheat [m]; the
/// inverse of [`embryo_superheat`]. Zero superheat gives an infinite radius.
#[inline]
pub fn embryo_radius(superheat: f64, sigma: f64, t_sat: f64, rho_l: f64, rho_v: f64, h_lv: f64) -> f64 {
    if !(superheat >= 0.0 && fluid_possible(sigma, t_sat, rho_l, rho_v, h_lv)) {
        return f64::NAN;
    }
    embryo_group(sigma, t_sat, rho_l, rho_v, h_lv) / superheat
}

const EMBRYO_FLUID_INPUTS: [crate::model::Arg; 5] = [
    arg("fluid.sigma", "N/m"),
    arg("fluid.T", "K"),
    arg("fluid.rho_l", "kg/m3"),
    arg("fluid.rho_v", "kg/m3"),
    arg("fluid.h_lv", "J/kg"),
];

/// Kernel of [`embryo_superheat`].
pub struct EmbryoSuperheat;
impl Kernel<6, 1> for EmbryoSuperheat {
    const MODEL: Model = Model {
        name: "embryo_superheat_linear",
        summary: "Equilibrium superheat of a vapour embryo (Young-Laplace with linearised Clausius-Clapeyron)",
        equation: "dT = 2 * sigma * T_sat * (1/rho_v - 1/rho_l) / (h_lv * radius)",
        inputs: &[
            arg("radius", "m"),
            EMBRYO_FLUID_INPUTS[0],
            EMBRYO_FLUID_INPUTS[1],
            EMBRYO_FLUID_INPUTS[2],
            EMBRYO_FLUID_INPUTS[3],
            EMBRYO_FLUID_INPUTS[4],
        ],
        outputs: &[arg("superheat", "K")],
        domain: "radius > 0, sigma > 0, T > 0, rho_l > rho_v > 0, h_lv > 0",
        validity: "superheat <= 0.1 * T_sat (linearisation; our own threshold, no published range)",
        reference: "Young-Laplace and Clausius-Clapeyron; Y.Y. Hsu, J. Heat Transfer 84 (1962) 207-213",
        doi: "10.1115/1.3684339",
        verification: "identity with the Clapeyron slope checked against IAPWS-95 (tests)",
    };
    #[inline(always)]
    fn eval(x: &[f64; 6]) -> [f64; 1] {
        [embryo_superheat(x[0], x[1], x[2], x[3], x[4], x[5])]
    }
    fn possible(x: &[f64; 6]) -> bool {
        positive(x[0]) && fluid_possible(x[1], x[2], x[3], x[4], x[5])
    }
    fn in_range(x: &[f64; 6]) -> bool {
        Self::eval(x)[0] <= 0.1 * x[2]
    }
}

/// Kernel of [`embryo_radius`].
pub struct EmbryoRadius;
impl Kernel<6, 1> for EmbryoRadius {
    const MODEL: Model = Model {
        name: "embryo_radius_linear",
        summary: "Radius of the vapour embryo in equilibrium at a given superheat (inverse of the linearised form)",
        equation: "radius = 2 * sigma * T_sat * (1/rho_v - 1/rho_l) / (h_lv * superheat)",
        inputs: &[
            arg("superheat", "K"),
            EMBRYO_FLUID_INPUTS[0],
            EMBRYO_FLUID_INPUTS[1],
            EMBRYO_FLUID_INPUTS[2],
            EMBRYO_FLUID_INPUTS[3],
            EMBRYO_FLUID_INPUTS[4],
        ],
        outputs: &[arg("radius", "m")],
        domain: "superheat >= 0, sigma > 0, T > 0, rho_l > rho_v > 0, h_lv > 0",
        validity: "superheat <= 0.1 * T_sat (linearisation; our own threshold, no published range)",
        reference: "Young-Laplace and Clausius-Clapeyron; Y.Y. Hsu, J. Heat Transfer 84 (1962) 207-213",
        doi: "10.1115/1.3684339",
        verification: "inverse of embryo_superheat (tests)",
    };
    #[inline(always)]
    fn eval(x: &[f64; 6]) -> [f64; 1] {
        [embryo_radius(x[0], x[1], x[2], x[3], x[4], x[5])]
    }
    fn possible(x: &[f64; 6]) -> bool {
        x[0] >= 0.0 && fluid_possible(x[1], x[2], x[3], x[4], x[5])
    }
    fn in_range(x: &[f64; 6]) -> bool {
        x[0] <= 0.1 * x[2]
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    // Saturated water at 101325 Pa from IAPWS-95 (values recalled from memory to
    // 5 digits, as tabulated in the NIST Webbook): T = 373.124 K,
    // sigma = 0.058912 N/m (IAPWS R1-76), rho_l = 958.35, rho_v = 0.59817 kg/m3,
    // h_lv = 2256.4e3 J/kg.
    const W: (f64, f64, f64, f64, f64) = (0.058912, 373.124, 958.35, 0.59817, 2256.4e3);

    #[test]
    fn one_micron_embryo_in_water_at_one_atm() {
        // 2*0.058912*373.124*(1/0.59817 - 1/958.35)/2256.4e3/1e-6 = 32.6 K: the
        // order of magnitude quoted for micrometre cavities at 1 atm.
        let dt = embryo_superheat(1e-6, W.0, W.1, W.2, W.3, W.4);
        let expect = 2.0 * W.0 * W.1 * (1.0 / W.3 - 1.0 / W.2) / W.4 / 1e-6;
        assert_relative_eq!(dt, expect, max_relative = 1e-14);
        assert!((32.0..33.2).contains(&dt));
    }

    #[test]
    fn inverse_and_limits() {
        for r in [1e-8, 1e-6, 1e-4] {
            let dt = embryo_superheat(r, W.0, W.1, W.2, W.3, W.4);
            assert_relative_eq!(embryo_radius(dt, W.0, W.1, W.2, W.3, W.4), r, max_relative = 1e-14);
        }
        assert_eq!(embryo_radius(0.0, W.0, W.1, W.2, W.3, W.4), f64::INFINITY);
        assert!(embryo_radius(-1.0, W.0, W.1, W.2, W.3, W.4).is_nan());
        assert!(embryo_superheat(0.0, W.0, W.1, W.2, W.3, W.4).is_nan());
        assert!(embryo_superheat(1e-6, W.0, W.1, 0.5, 0.6, W.4).is_nan());
    }
}
