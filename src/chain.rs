//! The screening chain fused into one kernel: saturated water from pressure,
//! Hsu onset superheat, Fritz departure diameter and Kandlikar CHF evaluated
//! in one pass per element.
//!
//! Each step is the published model's own scalar function (no formula is
//! repeated here); fusing them computes the water state once per element
//! instead of materialising twelve property arrays, and reads the inputs
//! and writes the outputs once. The separate public functions give the same
//! numbers bit for bit (tests).

use crate::model::{angle_deg, arg, nan_unless, positive, BlockSummary, Kernel, Model};
use crate::{chf, departure, nucleation, water};

/// Onset superheat \[K\] (Hsu, general contact angle), departure diameter \[m\]
/// (Fritz), CHF [W/m2] (Kandlikar 2001) and the saturation temperature \[K\] of
/// water at pressure `p` \[Pa\].
#[inline]
pub fn water_screening(
    p: f64,
    contact_angle_deg: f64,
    receding_angle_deg: f64,
    orientation_deg: f64,
    heat_flux: f64,
    g: f64,
) -> [f64; 4] {
    screening_from(water::saturation_p(p), contact_angle_deg, receding_angle_deg, orientation_deg, heat_flux, g)
}

/// [`water_screening`] given the saturated state `w` (fields as [`water::SAT_FIELDS`]).
#[inline(always)]
fn screening_from(
    w: [f64; 12],
    contact_angle_deg: f64,
    receding_angle_deg: f64,
    orientation_deg: f64,
    heat_flux: f64,
    g: f64,
) -> [f64; 4] {
    let [t, _p, rho_l, rho_v, h_lv, sigma, _cp_l, k_l, ..] = w;
    let onset = nucleation::hsu_onset(heat_flux, sigma, t, rho_l, rho_v, h_lv, k_l, contact_angle_deg)[0];
    let d = departure::fritz(contact_angle_deg, sigma, rho_l, rho_v, g);
    // a receding angle above the static one is no surface: NaN, which `settle` spreads to all four
    let q = nan_unless(
        receding_angle_deg <= contact_angle_deg,
        chf::kandlikar(receding_angle_deg, orientation_deg, h_lv, rho_l, rho_v, sigma, g),
    );
    [t, onset, d, q]
}

/// Saturation pressure of water \[Pa\] at which ρ_v/ρ_l reaches
/// [`chf::DENSITY_RATIO_MAX`], the near-critical bound of Kandlikar's CHF
/// (IAPWS-95 \[D\]: 16.955 MPa by CoolProp; the test checks it against this
/// crate's water). Below [`water::P_NEAR_CRITICAL`], so it also bounds the state.
pub const P_CHF_MAX: f64 = 1.6955e7;

/// Kernel of [`water_screening`].
pub struct WaterScreening;
impl Kernel<6, 4> for WaterScreening {
    const MODEL: Model = Model {
        name: "water_screening_chain",
        summary: "Fused screening chain for water: saturation state from pressure, Hsu onset superheat, Fritz \
                  departure diameter, Kandlikar CHF",
        equation: "water_saturation_p(p) -> hsu_onset(q, theta) , fritz_departure(theta), kandlikar_chf(beta, phi)",
        inputs: &[
            arg("p", "Pa"),
            arg("contact_angle_deg", "deg"),
            arg("receding_angle_deg", "deg"),
            arg("orientation_deg", "deg"),
            arg("heat_flux", "W/m2"),
            arg("g", "m/s2"),
        ],
        outputs: &[
            arg("T_sat", "K"),
            arg("onset_superheat", "K"),
            arg("departure_diameter", "m"),
            arg("critical_heat_flux", "W/m2"),
        ],
        domain: "as the four models: 611.657 Pa <= p < 22.064 MPa, angles 0-180 deg with receding_angle_deg <= \
                 contact_angle_deg, heat_flux >= 0, g > 0",
        validity: "every step inside its own range: T_sat <= 0.997 T_crit, Hsu's superheat at theta = 0 <= 0.1 T_sat, \
                   contact_angle_deg <= 90 (Fritz), orientation_deg <= 90 and p <= 16.955 MPa (rho_v/rho_l <= 0.21, \
                   Kandlikar)",
        reference: "see water_saturation_p, hsu_onset, fritz_departure, kandlikar_chf",
        doi: "",
        verification: "bitwise equal to the chain of the separate kernels (tests)",
    };
    #[inline(always)]
    fn eval(x: &[f64; 6]) -> [f64; 4] {
        water_screening(x[0], x[1], x[2], x[3], x[4], x[5])
    }
    /// The water states of the block with their saturation temperatures solved together
    /// ([`water::saturation_p_each`]), then the models over the block.
    #[inline(always)]
    fn eval_block<const B: usize>(at: impl Fn(usize) -> [f64; 6], len: usize, y: &mut [[f64; B]; 4]) -> BlockSummary {
        let mut ws = [[0.0; 12]; B];
        water::saturation_p_each::<B>(|j| at(j)[0], |j, w| ws[j] = w);
        // the models in a loop of their own, which vectorises
        let mut sum = BlockSummary::default();
        for (j, &w) in ws.iter().enumerate() {
            let x = at(j);
            sum.add::<Self, 6, 4, B>(&x, screening_from(w, x[1], x[2], x[3], x[4], x[5]), j, len, y);
        }
        sum
    }
    #[inline(always)]
    fn possible(x: &[f64; 6]) -> bool {
        !water::t_sat(x[0]).is_nan()
            && x[0] < water::P_CRIT // one phase: no surface tension, no bubble, no CHF
            && angle_deg(x[1])
            && angle_deg(x[2])
            && x[2] <= x[1] // a receding angle above the static one: no such surface
            && angle_deg(x[3])
            && x[4] >= 0.0
            && x[4].is_finite()
            && positive(x[5])
    }
    #[inline(always)]
    fn in_range(x: &[f64; 6]) -> bool {
        Self::in_range_with(x, &Self::eval(x))
    }
    /// The steps' ranges. P_CHF_MAX < P_NEAR_CRITICAL: the one bound keeps both the state and
    /// Kandlikar's ratio. Hsu's bound (its superheat at θ = 0 within 0.1 T_sat) from the outputs:
    /// that superheat is the onset over cos(θ/2), for θ ≤ 90° (beyond, Fritz flags the element);
    /// at the bound itself the two roundings may differ in the last bit.
    #[inline(always)]
    fn in_range_with(x: &[f64; 6], y: &[f64; 4]) -> bool {
        x[0] <= P_CHF_MAX
            && x[1] <= 90.0
            && x[3] <= 90.0
            && !(y[1] > 0.1 * y[0] * crate::trig::cos_deg(0.5 * x[1]))
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// P_CHF_MAX is the pressure of Kandlikar's density-ratio bound for this crate's water:
    /// the separate kernel's flag changes within 0.05 % of it, and the state bound lies above.
    #[test]
    fn chf_pressure_bound_is_the_density_ratio_bound() {
        const { assert!(P_CHF_MAX < water::P_NEAR_CRITICAL) };
        let in_range = |p: f64| {
            let w = water::saturation_p(p);
            chf::Kandlikar::in_range(&[20.0, 0.0, w[4], w[2], w[3], w[5], 9.80665])
        };
        assert!(in_range(P_CHF_MAX * (1.0 - 5e-4)));
        assert!(!in_range(P_CHF_MAX * (1.0 + 5e-4)));
        assert!(WaterScreening::in_range(&[P_CHF_MAX, 45.0, 20.0, 0.0, 1e5, 9.80665]));
        assert!(!WaterScreening::in_range(&[P_CHF_MAX * 1.001, 45.0, 20.0, 0.0, 1e5, 9.80665]));
    }

    /// The chain flags Hsu's linearisation bound as the separate kernel does: water at 2 kPa
    /// (T_sat 290.6 K) with 1e5 W/m2 has a superheat at 0 deg of about 39 K, above 29 K.
    #[test]
    fn chain_flags_the_onset_bound_as_hsu_does() {
        for &(p, q) in &[(2e3, 1e5), (2e3, 2e4), (1e4, 3e5), (101325.0, 1e6), (101325.0, 3e7)] {
            let w = water::saturation_p(p);
            for th in [0.0, 30.0, 60.0, 90.0] {
                let hsu = nucleation::HsuOnset::in_range(&[q, w[5], w[0], w[2], w[3], w[4], w[7], th]);
                assert_eq!(WaterScreening::in_range(&[p, th, 0.5 * th, 0.0, q, 9.80665]), hsu, "{p} {q} {th}");
            }
        }
        assert!(!WaterScreening::in_range(&[2e3, 45.0, 20.0, 0.0, 1e5, 9.80665]));
    }

    #[test]
    fn fused_equals_the_separate_models() {
        for &p in &[1.0e4, 101325.0, 1.0e6, 1.0e7] {
            for &(th, rec, phi, q) in &[(45.0, 20.0, 0.0, 1e5), (80.0, 60.0, 90.0, 5e5), (10.0, 5.0, 30.0, 0.0)] {
                let w = water::saturation_p(p);
                let out = water_screening(p, th, rec, phi, q, 9.80665);
                assert_eq!(out[0], w[0]);
                assert_eq!(out[1], nucleation::hsu_onset(q, w[5], w[0], w[2], w[3], w[4], w[7], th)[0]);
                assert_eq!(out[2], departure::fritz(th, w[5], w[2], w[3], 9.80665));
                assert_eq!(out[3], chf::kandlikar(rec, phi, w[4], w[2], w[3], w[5], 9.80665));
            }
        }
        assert!(water_screening(-1.0, 45.0, 20.0, 0.0, 1e5, 9.80665).iter().all(|v| v.is_nan()));
    }

    /// At the critical point (IAPWS R6-95: 22.064 MPa) liquid and vapour are one phase: the chain's
    /// input is impossible, as each model's state is (sigma = 0); just below it is possible.
    #[test]
    fn critical_pressure_is_impossible() {
        let x = |p: f64| [p, 45.0, 20.0, 0.0, 1e5, 9.80665];
        assert!(!WaterScreening::possible(&x(water::P_CRIT)));
        assert!(WaterScreening::possible(&x(22.0e6)) && !WaterScreening::in_range(&x(22.0e6)));
        assert!(WaterScreening::possible(&x(water::P_TRIPLE)));
        // hysteresis: the receding angle cannot exceed the static one (equal is a surface without hysteresis)
        assert!(!WaterScreening::possible(&[1e5, 40.0, 60.0, 0.0, 1e5, 9.80665]));
        assert!(WaterScreening::possible(&[1e5, 40.0, 40.0, 0.0, 1e5, 9.80665]));
    }

    /// The block path (saturation temperatures solved together) gives the element path's bits.
    #[test]
    fn block_equals_elements() {
        let ps = [f64::NAN, -1.0, 611.0, 611.657, 1.0e4, 101325.0, 1.0e6, 1.0e7, 2.2e7, 22.064e6, 3.0e7];
        let xs: Vec<[f64; 6]> = (0..100)
            .map(|i| {
                let f = i as f64;
                [ps[i % ps.len()] * (1.0 + 1e-3 * f), 5.0 + 1.7 * f, 3.0 + 0.8 * f, 0.9 * f, 1e3 * f, 9.80665]
            })
            .collect();
        for (c, chunk) in xs.chunks(64).enumerate() {
            let len = chunk.len();
            let mut y = [[0.0; 64]; 4];
            WaterScreening::eval_block::<64>(|j| chunk[j.min(len - 1)], len, &mut y);
            for j in 0..len {
                let v = WaterScreening::eval(&chunk[j]);
                for m in 0..4 {
                    assert_eq!(y[m][j].to_bits(), v[m].to_bits(), "chunk {c} element {j} output {m}");
                }
            }
        }
    }
}
