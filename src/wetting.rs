//! Wetting: Young's equation, spreading and adhesion, surface-energy
//! components (Girifalco-Good, Owens-Wendt-Rabel-Kaelble), rough and
//! composite surfaces (Wenzel, Cassie-Baxter), contact-angle hysteresis on an
//! inclined plate (Furmidge) and thin wetting films (disjoining pressure).
//!
//! Conventions: contact angles in **degrees, measured through the liquid**;
//! surface and interfacial tensions (and surface free energies) in **N/m**
//! (= J/m2); SI everywhere else. Where an angle formula leaves [-1, 1] in
//! cosine the physical answer is complete wetting (0 deg) or complete drying
//! (180 deg); each kernel says whether it then reports the element as outside
//! the model's validity.
//!
//! Verification key used in the doc comments: **\[V\]** seen in the original
//! (or a faithful copy of it); **\[V2\]** seen in a secondary source only;
//! **\[M\]** from memory, not seen in any source during this work.

use crate::fastmath;
use crate::model::{
    angle_deg, arg, finite, iterate_block, iterate_one, nan_unless, non_negative, positive, BlockSummary, Iteration,
    Kernel, Model,
};
use crate::trig::cos_deg;

// ---------------------------------------------------------------------------
// helpers

/// Angle \[deg\] whose cosine is `c`, saturating at 0 deg for `c >= 1` and at
/// 180 deg for `c <= -1`. NaN stays NaN.
#[inline(always)]
fn angle_from_cos(c: f64) -> f64 {
    // clamp keeps NaN; acos(1) = 0 and acos(-1) * 180/pi = 180 exactly (tests)
    fastmath::acos(c.clamp(-1.0, 1.0)).to_degrees()
}

/// Three tensions of Young's equation: σ_sv ≥ 0, σ_sl ≥ 0, σ_lv > 0, finite.
#[inline(always)]
fn young_tensions(sigma_sv: f64, sigma_sl: f64, sigma_lv: f64) -> bool {
    // non_negative(sigma_sv) & non_negative(sigma_sl) & positive(sigma_lv), in the
    // floating-point lanes (see `all_positive!`)
    crate::all_positive!(sigma_lv; sigma_sv, sigma_sl)
}

// ---------------------------------------------------------------------------
// A1 Young's equation

/// Young's equilibrium contact angle \[deg\].
///
/// `cos θ = (σ_sv − σ_sl) / σ_lv` (Young 1805, in the form written by Fox and
/// Zisman 1950, eq. 3).
///
/// * `sigma_sv`, `sigma_sl`, `sigma_lv` [N/m]: solid-vapour, solid-liquid and
///   liquid-vapour tensions. Possible: σ_sv ≥ 0, σ_sl ≥ 0, σ_lv > 0, all
///   finite; otherwise NaN.
/// * When the spreading coefficient `S = σ_sv − σ_sl − σ_lv ≥ 0`
///   (cos θ ≥ 1) the liquid spreads and the angle is **0**; when
///   `σ_sl − σ_sv ≥ σ_lv` (cos θ ≤ −1) it is **180**. Both are physical
///   outcomes, not errors, and are not flagged.
/// * Validity: no published numeric range. The equation holds for an ideal
///   solid (smooth, rigid, chemically homogeneous) in equilibrium with the
///   vapour; σ_sv is the solid's energy *in the vapour* (γ_s° − π_e).
///
/// References: T. Young, Phil. Trans. R. Soc. Lond. 95 (1805) 65-87,
/// doi:10.1098/rstl.1805.0005 [M, bibliographic]. H.W. Fox, W.A. Zisman,
/// J. Colloid Sci. 5 (1950) 514-531, doi:10.1016/0095-8522(50)90044-4:
/// eqs. 1-3 (Young, with the spreading pressure π_e) [V, first pages seen;
/// DOI M].
#[inline(always)]
pub fn young_angle(sigma_sv: f64, sigma_sl: f64, sigma_lv: f64) -> f64 {
    let ok = young_tensions(sigma_sv, sigma_sl, sigma_lv);
    nan_unless(ok, angle_from_cos((sigma_sv - sigma_sl) / sigma_lv))
}

/// Kernel of [`young_angle`].
pub struct YoungAngle;
impl Kernel<3, 1> for YoungAngle {
    const MODEL: Model = Model {
        name: "young_angle",
        summary: "Young's equilibrium contact angle from the three interfacial tensions",
        equation: "cos(theta) = (sigma_sv - sigma_sl) / sigma_lv, saturating at 0 deg (spreads) and 180 deg",
        inputs: &[arg("sigma_sv", "N/m"), arg("sigma_sl", "N/m"), arg("sigma_lv", "N/m")],
        outputs: &[arg("contact_angle_deg", "deg")],
        domain: "sigma_sv >= 0, sigma_sl >= 0, sigma_lv > 0, all finite",
        validity: "none published: ideal (smooth, rigid, homogeneous) solid in equilibrium with the vapour",
        reference: "T. Young, Phil. Trans. R. Soc. Lond. 95 (1805) 65-87; H.W. Fox, W.A. Zisman, J. Colloid Sci. 5 (1950) 514-531, eq. 3",
        doi: "10.1098/rstl.1805.0005",
        verification: "equation [V] in Fox & Zisman (1950) eqs 1-3; Young (1805) bibliographic data [M]",
    };
    #[inline(always)]
    fn eval(x: &[f64; 3]) -> [f64; 1] {
        [young_angle(x[0], x[1], x[2])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 3]) -> bool {
        young_tensions(x[0], x[1], x[2])
    }
}

// ---------------------------------------------------------------------------
// A2 spreading coefficient and Young-Dupre work of adhesion

/// Spreading coefficient `S = σ_sv − σ_sl − σ_lv` [N/m].
///
/// `S ≥ 0`: the liquid spreads (complete wetting); `S < 0`: it forms a drop
/// with `S = σ_lv (cos θ − 1)` by Young's equation.
///
/// * Inputs [N/m] as in [`young_angle`]; possible: σ_sv ≥ 0, σ_sl ≥ 0,
///   σ_lv > 0, finite; otherwise NaN.
/// * Validity: a definition; no range.
///
/// Reference: the definition as used by de Gennes, Rev. Mod. Phys. 57 (1985)
/// 827-863, doi:10.1103/RevModPhys.57.827 [M, standard identity].
#[inline(always)]
pub fn spreading_coefficient(sigma_sv: f64, sigma_sl: f64, sigma_lv: f64) -> f64 {
    let ok = young_tensions(sigma_sv, sigma_sl, sigma_lv);
    nan_unless(ok, sigma_sv - sigma_sl - sigma_lv)
}

/// Kernel of [`spreading_coefficient`].
pub struct SpreadingCoefficient;
impl Kernel<3, 1> for SpreadingCoefficient {
    const MODEL: Model = Model {
        name: "spreading_coefficient",
        summary: "Spreading coefficient S = sigma_sv - sigma_sl - sigma_lv (S >= 0: the liquid spreads)",
        equation: "S = sigma_sv - sigma_sl - sigma_lv",
        inputs: &[arg("sigma_sv", "N/m"), arg("sigma_sl", "N/m"), arg("sigma_lv", "N/m")],
        outputs: &[arg("spreading_coefficient", "N/m")],
        domain: "sigma_sv >= 0, sigma_sl >= 0, sigma_lv > 0, all finite",
        validity: "none: a definition",
        reference: "P.G. de Gennes, Wetting: statics and dynamics, Rev. Mod. Phys. 57 (1985) 827-863",
        doi: "10.1103/RevModPhys.57.827",
        verification: "standard identity [M]; checked against Young's equation in the unit tests",
    };
    #[inline(always)]
    fn eval(x: &[f64; 3]) -> [f64; 1] {
        [spreading_coefficient(x[0], x[1], x[2])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 3]) -> bool {
        young_tensions(x[0], x[1], x[2])
    }
}

/// Young-Dupré reversible work of adhesion `W_a = σ_lv (1 + cos θ)` [J/m2].
///
/// Dupré's `W_a = σ_sv + σ_lv − σ_sl` combined with Young's equation; Fox and
/// Zisman's general form `W_a = π_e + σ_lv (1 + cos θ)` reduces to it when the
/// spreading pressure π_e of the adsorbed vapour is negligible.
///
/// * `sigma_lv` [N/m] > 0; `contact_angle_deg` θ \[deg\] in [0, 180]; otherwise NaN.
/// * Validity: none published beyond that of Young's equation (π_e ≈ 0).
///
/// References: A. Dupré, Théorie mécanique de la chaleur (Gauthier-Villars,
/// Paris, 1869) [M, bibliographic]; Fox & Zisman (1950) eqs. 4-8 \[V\].
#[inline(always)]
pub fn adhesion_work(sigma_lv: f64, contact_angle_deg: f64) -> f64 {
    let ok = positive(sigma_lv) & angle_deg(contact_angle_deg);
    nan_unless(ok, sigma_lv * (1.0 + cos_deg(contact_angle_deg)))
}

/// Kernel of [`adhesion_work`].
pub struct AdhesionWork;
impl Kernel<2, 1> for AdhesionWork {
    const MODEL: Model = Model {
        name: "young_dupre_adhesion_work",
        summary: "Young-Dupre reversible work of adhesion of a liquid on a solid",
        equation: "W_a = sigma_lv * (1 + cos(theta))",
        inputs: &[arg("sigma_lv", "N/m"), arg("contact_angle_deg", "deg")],
        outputs: &[arg("adhesion_work", "J/m2")],
        domain: "sigma_lv > 0, 0 <= contact_angle_deg <= 180",
        validity: "none published: Young's equation with negligible spreading pressure of the adsorbed vapour",
        reference: "A. Dupre, Theorie mecanique de la chaleur (1869); H.W. Fox, W.A. Zisman, J. Colloid Sci. 5 (1950) 514-531, eqs 4-8",
        doi: "10.1016/0095-8522(50)90044-4",
        verification: "equation and the pi_e form [V] in Fox & Zisman (1950) p. 514-515; Dupre (1869) bibliographic [M]",
    };
    #[inline(always)]
    fn eval(x: &[f64; 2]) -> [f64; 1] {
        [adhesion_work(x[0], x[1])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 2]) -> bool {
        positive(x[0]) && angle_deg(x[1])
    }
}

// ---------------------------------------------------------------------------
// A3 Girifalco-Good

/// Girifalco-Good interfacial tension `γ_12 = γ_1 + γ_2 − 2 Φ (γ_1 γ_2)^(1/2)` [N/m].
///
/// With Φ = 1 and only dispersion forces this is Fowkes's rule (with the
/// dispersive components of both phases in the square root).
///
/// * `sigma_s`, `sigma_l` [N/m] ≥ 0 (surface tensions or free energies of the
///   two phases), `phi` [-] ≥ 0, finite; otherwise NaN.
/// * The result may be negative for Φ > 1 (the model then predicts
///   spontaneous mixing); it is returned as computed.
/// * Validity: Φ between 0.5 and 1.1, the spread of the values Girifalco and
///   Good derived for real pairs \[M\]; outside it the result is flagged.
///
/// References: L.A. Girifalco, R.J. Good, J. Phys. Chem. 61 (1957) 904-909,
/// doi:10.1021/j150553a013 [M, bibliographic]; equation form \[V2\] (abstract of
/// J. Colloid Interface Sci. 529 (2018) 243-246: Φ = (1 − γ_12/γ_1)^(1/2)
/// reduces it to Antonov's rule, which holds for this form only).
#[inline(always)]
pub fn interfacial_tension(sigma_s: f64, sigma_l: f64, phi: f64) -> f64 {
    let ok = non_negative(sigma_s) & non_negative(sigma_l) & non_negative(phi);
    nan_unless(ok, sigma_s + sigma_l - 2.0 * phi * (sigma_s * sigma_l).sqrt())
}

/// Kernel of [`interfacial_tension`].
pub struct GirifalcoGood;
impl Kernel<3, 1> for GirifalcoGood {
    const MODEL: Model = Model {
        name: "girifalco_good",
        summary: "Girifalco-Good interfacial tension with interaction parameter phi",
        equation: "gamma_12 = gamma_1 + gamma_2 - 2 * phi * sqrt(gamma_1 * gamma_2)",
        inputs: &[arg("sigma_s", "N/m"), arg("sigma_l", "N/m"), arg("phi", "-")],
        outputs: &[arg("interfacial_tension", "N/m")],
        domain: "sigma_s >= 0, sigma_l >= 0, phi >= 0, all finite",
        validity: "0.5 <= phi <= 1.1 (spread of values for real pairs; from memory)",
        reference: "L.A. Girifalco, R.J. Good, A theory for the estimation of surface and interfacial energies. I., J. Phys. Chem. 61 (1957) 904-909",
        doi: "10.1021/j150553a013",
        verification: "equation form [V2] (abstract of J. Colloid Interface Sci. 529 (2018) 243); bibliographic data, DOI and the phi range [M]",
    };
    #[inline(always)]
    fn eval(x: &[f64; 3]) -> [f64; 1] {
        [interfacial_tension(x[0], x[1], x[2])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 3]) -> bool {
        non_negative(x[0]) && non_negative(x[1]) && non_negative(x[2])
    }
    #[inline(always)]
    fn in_range(x: &[f64; 3]) -> bool {
        (0.5..=1.1).contains(&x[2])
    }
}

// ---------------------------------------------------------------------------
// A4 Owens-Wendt-Rabel-Kaelble

/// Contact angle \[deg\] of a liquid on a solid from dispersive and polar
/// surface-energy components (Owens-Wendt-Rabel-Kaelble geometric mean).
///
/// `σ_l (1 + cos θ) / 2 = (σ_s^d σ_l^d)^(1/2) + (σ_s^p σ_l^p)^(1/2)`,
/// `σ_l = σ_l^d + σ_l^p`.
///
/// * `solid_dispersive`, `solid_polar`, `liquid_dispersive`, `liquid_polar`
///   [N/m] ≥ 0, finite, with `liquid_dispersive + liquid_polar > 0`;
///   otherwise NaN.
/// * cos θ ≥ 1 means the liquid spreads: **0 deg**, not flagged (a physical
///   outcome). The geometric mean never gives cos θ < −1 for non-negative
///   components.
/// * Validity: none published as a numeric range. The split into two
///   additive components is a model assumption; predictions for strongly
///   polar (hydrogen-bonding) pairs are known to be poor.
///
/// References: D.K. Owens, R.C. Wendt, J. Appl. Polym. Sci. 13 (1969)
/// 1741-1747, doi:10.1002/app.1969.070130815 [V: bibliographic data and
/// abstract: water and methylene iodide, "dispersion" and "dipole-hydrogen
/// bonding" components]; D.H. Kaelble, J. Adhesion 2 (1970) 66-81 \[M\];
/// W. Rabel, Farbe und Lack 77 (1971) 997-1005 \[M\].
#[inline(always)]
pub fn owrk_angle(solid_dispersive: f64, solid_polar: f64, liquid_dispersive: f64, liquid_polar: f64) -> f64 {
    let ok = owrk_possible(solid_dispersive, solid_polar, liquid_dispersive, liquid_polar);
    let sigma_l = liquid_dispersive + liquid_polar;
    let wa = 2.0 * ((solid_dispersive * liquid_dispersive).sqrt() + (solid_polar * liquid_polar).sqrt());
    nan_unless(ok, angle_from_cos(wa / sigma_l - 1.0))
}

#[inline(always)]
fn owrk_possible(sd: f64, sp: f64, ld: f64, lp: f64) -> bool {
    non_negative(sd) & non_negative(sp) & non_negative(ld) & non_negative(lp) & (ld + lp > 0.0)
}

/// Kernel of [`owrk_angle`].
pub struct OwrkAngle;
impl Kernel<4, 1> for OwrkAngle {
    const MODEL: Model = Model {
        name: "owrk_angle",
        summary: "Contact angle from dispersive and polar surface-energy components (Owens-Wendt-Rabel-Kaelble)",
        equation: "sigma_l * (1 + cos(theta)) / 2 = sqrt(s_d * l_d) + sqrt(s_p * l_p), sigma_l = l_d + l_p; 0 deg when cos >= 1",
        inputs: &[
            arg("solid_dispersive", "N/m"),
            arg("solid_polar", "N/m"),
            arg("liquid_dispersive", "N/m"),
            arg("liquid_polar", "N/m"),
        ],
        outputs: &[arg("contact_angle_deg", "deg")],
        domain: "all components >= 0 and finite, liquid_dispersive + liquid_polar > 0",
        validity: "none published: two additive components (dispersion, dipole-hydrogen bonding) are assumed",
        reference: "D.K. Owens, R.C. Wendt, Estimation of the surface free energy of polymers, J. Appl. Polym. Sci. 13 (1969) 1741-1747; D.H. Kaelble, J. Adhesion 2 (1970) 66-81; W. Rabel, Farbe und Lack 77 (1971) 997-1005",
        doi: "10.1002/app.1969.070130815",
        verification: "Owens & Wendt bibliographic data and abstract [V]; equation form [M, high], reproduces the Owens-Wendt PTFE/PE/PS rows recalled from memory (see tests)",
    };
    #[inline(always)]
    fn eval(x: &[f64; 4]) -> [f64; 1] {
        [owrk_angle(x[0], x[1], x[2], x[3])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 4]) -> bool {
        owrk_possible(x[0], x[1], x[2], x[3])
    }
}

// ---------------------------------------------------------------------------
// A6 Wenzel and Cassie-Baxter

/// Wenzel apparent contact angle \[deg\] on a rough surface wetted everywhere.
///
/// `cos θ* = r cos θ`, `r` = true area / projected area ≥ 1.
///
/// * `contact_angle_deg` θ \[deg\] in [0, 180] (Young angle on the smooth
///   material), `roughness_ratio` r [-] ≥ 1, finite; otherwise NaN.
/// * Saturation: where `|r cos θ| > 1` the result is **0 deg** (the texture
///   wicks: hemi-wicking) or **180 deg**, and the element is reported as
///   outside the model's validity (RangeWarning): the equation itself has no
///   solution there and the real surface is in a different state (wicked
///   film or trapped gas).
/// * Validity: |r cos θ| ≤ 1; drop much larger than the roughness scale;
///   chemically homogeneous surface.
///
/// Reference: R.N. Wenzel, Resistance of solid surfaces to wetting by water,
/// Ind. Eng. Chem. 28 (1936) 988-994, doi:10.1021/ie50320a024 [M, high; the
/// paper was not seen; equation form \[V2\] in several restatements].
#[inline(always)]
pub fn wenzel(contact_angle_deg: f64, roughness_ratio: f64) -> f64 {
    let ok = wenzel_possible(contact_angle_deg, roughness_ratio);
    nan_unless(ok, angle_from_cos(roughness_ratio * cos_deg(contact_angle_deg)))
}

#[inline(always)]
fn wenzel_possible(theta: f64, r: f64) -> bool {
    angle_deg(theta) & (r >= 1.0) & finite(r)
}

/// Kernel of [`wenzel`].
pub struct Wenzel;
impl Kernel<2, 1> for Wenzel {
    const MODEL: Model = Model {
        name: "wenzel_angle",
        summary: "Wenzel apparent contact angle on a fully wetted rough surface",
        equation: "cos(theta*) = r * cos(theta), saturating at 0 and 180 deg (flagged)",
        inputs: &[arg("contact_angle_deg", "deg"), arg("roughness_ratio", "-")],
        outputs: &[arg("apparent_angle_deg", "deg")],
        domain: "0 <= contact_angle_deg <= 180, roughness_ratio >= 1",
        validity: "|r cos(theta)| <= 1 (beyond it the equation has no solution: 0 or 180 deg is returned and flagged)",
        reference: "R.N. Wenzel, Resistance of solid surfaces to wetting by water, Ind. Eng. Chem. 28 (1936) 988-994",
        doi: "10.1021/ie50320a024",
        verification: "equation form [V2]; bibliographic data and DOI [M, high]",
    };
    #[inline(always)]
    fn eval(x: &[f64; 2]) -> [f64; 1] {
        [wenzel(x[0], x[1])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 2]) -> bool {
        wenzel_possible(x[0], x[1])
    }
    #[inline(always)]
    fn in_range(x: &[f64; 2]) -> bool {
        (x[1] * cos_deg(x[0])).abs() <= 1.0
    }
}

/// Cassie-Baxter apparent contact angle \[deg\] of a drop resting on a
/// composite solid/gas surface (gas trapped under the drop).
///
/// `cos θ* = r_f f cos θ + f − 1`: the drop touches the solid on the area
/// fraction `f` (the wetted solid itself of roughness ratio `r_f`) and the
/// trapped gas (θ = 180 deg) on `1 − f`. With `r_f = 1` this is
/// `cos θ* = f (1 + cos θ) − 1`.
///
/// * `contact_angle_deg` θ \[deg\] in [0, 180]; `solid_fraction` f [-] in
///   [0, 1]; `roughness_ratio` r_f [-] ≥ 1; otherwise NaN.
/// * Saturation at 0 / 180 deg where the cosine leaves [-1, 1], reported as
///   outside validity (RangeWarning), as for [`wenzel`].
/// * Validity: the drop sits on the texture tops (no penetration); the
///   fractions are those under the contact line, not averages under the drop
///   (the area form is the one written here). An intrinsic angle below 90 deg
///   with `f < 1` is flagged (at `f = 1` no gas is trapped and the formula
///   is Wenzel's): on a hydrophilic texture the trapped-gas state is not the
///   stable one (the liquid fills the texture, Wenzel, or wicks into it), so
///   the formula's hydrophobic answer must not be trusted there (J. Bico,
///   C. Thiele, D. Quere, Colloids Surf. A 206 (2002) 41-46 \[M\]).
///
/// Reference: A.B.D. Cassie, S. Baxter, Wettability of porous surfaces,
/// Trans. Faraday Soc. 40 (1944) 546-551, doi:10.1039/tf9444000546 [M, high;
/// the paper was not seen]. The general form `cos θ* = f_1 cos θ_1 − f_2`
/// (with `f_1 + f_2 ≥ 1` on rough tops) \[V2\]: A.J.B. Milne, A. Amirfazli,
/// Adv. Colloid Interface Sci. 170 (2012) 48-55 (abstract).
#[inline(always)]
pub fn cassie_baxter(contact_angle_deg: f64, solid_fraction: f64, roughness_ratio: f64) -> f64 {
    let ok = cassie_possible(contact_angle_deg, solid_fraction, roughness_ratio);
    nan_unless(ok, angle_from_cos(cassie_cos(contact_angle_deg, solid_fraction, roughness_ratio)))
}

#[inline(always)]
fn cassie_cos(theta: f64, f: f64, r: f64) -> f64 {
    r * f * cos_deg(theta) + f - 1.0
}

#[inline(always)]
fn cassie_possible(theta: f64, f: f64, r: f64) -> bool {
    angle_deg(theta) & (0.0..=1.0).contains(&f) & (r >= 1.0) & finite(r)
}

/// Kernel of [`cassie_baxter`].
pub struct CassieBaxter;
impl Kernel<3, 1> for CassieBaxter {
    const MODEL: Model = Model {
        name: "cassie_baxter_angle",
        summary: "Cassie-Baxter apparent contact angle on a composite solid/trapped-gas surface",
        equation: "cos(theta*) = r_f * f * cos(theta) + f - 1, saturating at 0 and 180 deg (flagged)",
        inputs: &[arg("contact_angle_deg", "deg"), arg("solid_fraction", "-"), arg("roughness_ratio", "-")],
        outputs: &[arg("apparent_angle_deg", "deg")],
        domain: "0 <= contact_angle_deg <= 180, 0 <= solid_fraction <= 1, roughness_ratio >= 1",
        validity: "|cos(theta*)| <= 1 before saturation; contact_angle_deg >= 90 where solid_fraction < 1 (a \
                   hydrophilic texture does not hold gas under the drop); drop resting on the texture tops",
        reference: "A.B.D. Cassie, S. Baxter, Wettability of porous surfaces, Trans. Faraday Soc. 40 (1944) 546-551",
        doi: "10.1039/tf9444000546",
        verification: "equation form [V2] (Milne & Amirfazli 2012 abstract); bibliographic data and DOI [M, high]",
    };
    #[inline(always)]
    fn eval(x: &[f64; 3]) -> [f64; 1] {
        [cassie_baxter(x[0], x[1], x[2])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 3]) -> bool {
        cassie_possible(x[0], x[1], x[2])
    }
    #[inline(always)]
    fn in_range(x: &[f64; 3]) -> bool {
        // With f = 1 no gas is trapped (the formula is Wenzel's), so the
        // hydrophilic-texture flag applies only where f < 1.
        (cassie_cos(x[0], x[1], x[2]).abs() <= 1.0) & ((x[0] >= 90.0) | (x[1] >= 1.0))
    }
}

/// Hemi-wicking critical angle \[deg\] of a textured surface: a liquid whose
/// Young angle lies below it wicks into the texture ahead of a drop (a film
/// spreads through the texture while the tops stay dry), one whose angle lies
/// above it does not.
///
/// `cos θ_c = (1 − φ_s) / (r − φ_s)`: a film front that advances by `dx`
/// wets `(r − φ_s) dx` of solid (the texture less its dry tops) and leaves
/// `(1 − φ_s) dx` of liquid surface between the tops, and it advances when
/// that lowers the energy, `(σ_sl − σ_sv)(r − φ_s) + σ_lv (1 − φ_s) < 0`,
/// that is with Young's equation `cos θ > (1 − φ_s)/(r − φ_s)` \[D\].
///
/// * `solid_fraction` φ_s [-] in [0, 1): the fraction of the projected area
///   taken by the dry tops; `roughness_ratio` r [-] ≥ 1, finite; otherwise
///   NaN (φ_s = 1 leaves no gap for a film).
/// * Limits: r = 1 (flat) gives 0 deg, only a spreading liquid wicks;
///   φ_s = 0 gives `cos θ_c = 1/r`, where Wenzel's angle reaches 0 deg
///   \[identity\]; r → ∞ gives 90 deg, so no texture makes a hydrophobic
///   solid wick. θ_c always lies in [0, 90] deg.
/// * Validity: texture much smaller than the drop and the capillary
///   length, tops flat and left dry, the film filling the texture to its
///   height; a static criterion (it says whether the film spreads, not how
///   fast). No numeric range is published.
///
/// Reference: J. Bico, C. Thiele, D. Quere, Wetting of textured surfaces,
/// Colloids Surf. A 206 (2002) 41-46, doi:10.1016/S0927-7757(02)00061-4
/// [M, high: the criterion and bibliographic data; the paper was not seen
/// in this work]; the energy balance above \[D\] gives the same form.
#[inline(always)]
pub fn hemiwicking_angle(solid_fraction: f64, roughness_ratio: f64) -> f64 {
    let ok = hemiwicking_possible(solid_fraction, roughness_ratio);
    nan_unless(ok, angle_from_cos((1.0 - solid_fraction) / (roughness_ratio - solid_fraction)))
}

#[inline(always)]
fn hemiwicking_possible(f: f64, r: f64) -> bool {
    (f >= 0.0) & (f < 1.0) & (r >= 1.0) & finite(r)
}

/// Kernel of [`hemiwicking_angle`].
pub struct HemiwickingAngle;
impl Kernel<2, 1> for HemiwickingAngle {
    const MODEL: Model = Model {
        name: "hemiwicking_angle",
        summary: "Hemi-wicking critical angle of a textured surface (a liquid below it wicks into the texture)",
        equation: "cos(theta_c) = (1 - phi_s) / (r - phi_s)",
        inputs: &[arg("solid_fraction", "-"), arg("roughness_ratio", "-")],
        outputs: &[arg("critical_angle_deg", "deg")],
        domain: "0 <= solid_fraction < 1, roughness_ratio >= 1",
        validity: "no numeric range published: texture much smaller than the drop and the capillary length, \
                   dry flat tops, film filling the texture; a static criterion",
        reference: "J. Bico, C. Thiele, D. Quere, Wetting of textured surfaces, Colloids Surf. A 206 (2002) 41-46",
        doi: "10.1016/S0927-7757(02)00061-4",
        verification: "form [M, high] and re-derived from the surface-energy balance [D]; limits (flat, phi_s = 0 \
                       meets Wenzel's 0 deg, r -> infinity 90 deg) [identity]",
    };
    #[inline(always)]
    fn eval(x: &[f64; 2]) -> [f64; 1] {
        [hemiwicking_angle(x[0], x[1])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 2]) -> bool {
        hemiwicking_possible(x[0], x[1])
    }
}

/// Apparent contact angle \[deg\] of a drop on a texture that has wicked
/// (hemi-wicking): the drop rests on the dry tops and on the liquid film that
/// fills the texture between them.
///
/// `cos θ* = 1 − φ_s + φ_s cos θ`: Cassie's composite average with the
/// liquid-filled fraction `1 − φ_s` at 0 deg (liquid on liquid) and the tops
/// `φ_s` at the intrinsic angle θ.
///
/// * `contact_angle_deg` θ \[deg\] in [0, 180]; `solid_fraction` φ_s [-] in
///   [0, 1]; `roughness_ratio` r [-] ≥ 1, finite (the whole texture's true /
///   projected area, used only for the validity check); otherwise NaN.
/// * Validity: the texture wicks, θ ≤ θ_c with `cos θ_c = (1 − φ_s)/(r − φ_s)`
///   ([`hemiwicking_angle`]); above θ_c no film fills it and [`wenzel`] (or
///   [`cassie_baxter`]) holds, so such elements are flagged. At θ = θ_c the
///   two meet: `1 − φ_s + φ_s cos θ_c = r cos θ_c` \[identity\]. φ_s = 1
///   (no gaps) is the flat material, θ* = θ.
/// * Limits: φ_s = 0 gives 0 deg (all liquid); θ* ≤ θ always, and θ* < 90 deg.
///
/// Reference: J. Bico, C. Thiele, D. Quere, Wetting of textured surfaces,
/// Colloids Surf. A 206 (2002) 41-46, doi:10.1016/S0927-7757(02)00061-4
/// [M, high: the form and the regime; the paper was not seen in this work];
/// the form is Cassie & Baxter's composite average (see [`cassie_baxter`])
/// with liquid in place of the trapped gas \[D\].
#[inline(always)]
pub fn impregnated_angle(contact_angle_deg: f64, solid_fraction: f64, roughness_ratio: f64) -> f64 {
    let ok = cassie_possible(contact_angle_deg, solid_fraction, roughness_ratio);
    nan_unless(ok, angle_from_cos(1.0 - solid_fraction + solid_fraction * cos_deg(contact_angle_deg)))
}

/// Kernel of [`impregnated_angle`].
pub struct ImpregnatedAngle;
impl Kernel<3, 1> for ImpregnatedAngle {
    const MODEL: Model = Model {
        name: "impregnated_angle",
        summary: "Apparent contact angle on a wicked (liquid-impregnated) texture: drop on dry tops and liquid",
        equation: "cos(theta*) = 1 - phi_s + phi_s * cos(theta)",
        inputs: &[arg("contact_angle_deg", "deg"), arg("solid_fraction", "-"), arg("roughness_ratio", "-")],
        outputs: &[arg("apparent_angle_deg", "deg")],
        domain: "0 <= contact_angle_deg <= 180, 0 <= solid_fraction <= 1, roughness_ratio >= 1",
        validity: "the texture wicks: contact_angle_deg <= the hemi-wicking critical angle, cos(theta_c) = \
                   (1 - phi_s)/(r - phi_s) (above it use Wenzel or Cassie-Baxter); texture much smaller than the \
                   drop, flat dry tops",
        reference: "J. Bico, C. Thiele, D. Quere, Wetting of textured surfaces, Colloids Surf. A 206 (2002) 41-46",
        doi: "10.1016/S0927-7757(02)00061-4",
        verification: "form [M, high] and derived as Cassie's composite average with liquid in the texture [D]; \
                       meets Wenzel at the critical angle and the intrinsic angle at phi_s = 1 [identity]",
    };
    #[inline(always)]
    fn eval(x: &[f64; 3]) -> [f64; 1] {
        [impregnated_angle(x[0], x[1], x[2])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 3]) -> bool {
        cassie_possible(x[0], x[1], x[2])
    }
    #[inline(always)]
    fn in_range(x: &[f64; 3]) -> bool {
        // theta <= theta_c, written without the division (r - phi_s > 0 where phi_s < 1)
        (x[1] >= 1.0) | (cos_deg(x[0]) * (x[2] - x[1]) >= 1.0 - x[1])
    }
}

// ---------------------------------------------------------------------------
// A7 Furmidge retention force and sliding angle

#[inline(always)]
fn hysteresis_possible(sigma_lv: f64, advancing: f64, receding: f64, width: f64, k: f64) -> bool {
    positive(sigma_lv) & angle_deg(advancing) & angle_deg(receding) & (advancing >= receding) & non_negative(width) & positive(k)
}

/// Furmidge retention force \[N\] of a drop pinned by contact-angle hysteresis.
///
/// `F = k w σ_lv (cos θ_r − cos θ_a)`.
///
/// * `sigma_lv` [N/m] > 0; `advancing_deg` θ_a and `receding_deg` θ_r \[deg\]
///   in [0, 180] with θ_a ≥ θ_r (an advancing angle below the receding one is
///   impossible); `width` w \[m\] ≥ 0, the drop's base width perpendicular to
///   the motion; `k` [-] > 0, the retention (shape) factor. Otherwise NaN.
/// * Validity: no published numeric range. Furmidge used k = 1; later work
///   puts k between about 1 and π/2 depending on the contact-line shape
///   (ElSherbini & Jacobi 2006) \[V2\].
///
/// References: C.G.L. Furmidge, Studies at phase interfaces. I. The sliding
/// of liquid drops on solid surfaces and a theory for spray retention,
/// J. Colloid Sci. 17 (1962) 309-324, doi:10.1016/0095-8522(62)90011-9
/// [equation with k = 1 V2 per the project's MODELS.md, not re-read in this
/// work; title and DOI M]. A.I. ElSherbini, A.M. Jacobi, J. Colloid
/// Interface Sci. 299 (2006) 841-849, doi:10.1016/j.jcis.2006.02.018
/// [V2 per MODELS.md (abstract); DOI M].
#[inline(always)]
pub fn retention_force(sigma_lv: f64, advancing_deg: f64, receding_deg: f64, width: f64, k: f64) -> f64 {
    let ok = hysteresis_possible(sigma_lv, advancing_deg, receding_deg, width, k);
    nan_unless(ok, k * width * sigma_lv * (cos_deg(receding_deg) - cos_deg(advancing_deg)))
}

/// Kernel of [`retention_force`].
pub struct RetentionForce;
impl Kernel<5, 1> for RetentionForce {
    const MODEL: Model = Model {
        name: "furmidge_retention_force",
        summary: "Furmidge retention force of a drop pinned by contact-angle hysteresis",
        equation: "F = k * w * sigma_lv * (cos(theta_r) - cos(theta_a))",
        inputs: &[
            arg("sigma_lv", "N/m"),
            arg("advancing_deg", "deg"),
            arg("receding_deg", "deg"),
            arg("width", "m"),
            arg("k", "-"),
        ],
        outputs: &[arg("retention_force", "N")],
        domain: "sigma_lv > 0, 0 <= receding_deg <= advancing_deg <= 180, width >= 0, k > 0",
        validity: "none published as a range; k = 1 (Furmidge), about 1 to pi/2 with contact-line shape (ElSherbini & Jacobi 2006)",
        reference: "C.G.L. Furmidge, J. Colloid Sci. 17 (1962) 309-324; A.I. ElSherbini, A.M. Jacobi, J. Colloid Interface Sci. 299 (2006) 841-849",
        doi: "10.1016/0095-8522(62)90011-9",
        verification: "equation with k = 1 and k range [V2 per MODELS.md, not re-read]; DOIs [M]",
    };
    #[inline(always)]
    fn eval(x: &[f64; 5]) -> [f64; 1] {
        [retention_force(x[0], x[1], x[2], x[3], x[4])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 5]) -> bool {
        hysteresis_possible(x[0], x[1], x[2], x[3], x[4])
    }
}

/// Critical sliding angle \[deg\] of a drop of mass `m` on a tilted plate
/// (tilt from horizontal) from Furmidge's balance
/// `m g sin α = k w σ_lv (cos θ_r − cos θ_a)`.
///
/// * `mass` \[kg\] > 0, `g` [m/s2] > 0, the other inputs as in
///   [`retention_force`]; otherwise NaN (counted as impossible).
/// * **Never slides**: when the retention force exceeds the drop's weight
///   (`sin α > 1`) the drop stays put even on a vertical plate; the result is
///   **NaN**, which is the model's answer and not an input error: it is not
///   counted or warned about. Compare with [`retention_force`] to tell the
///   two NaNs apart.
/// * Zero hysteresis (θ_a = θ_r) gives 0 deg: the drop slides at any tilt.
/// * Validity: as [`retention_force`]; α measured from the horizontal.
///
/// References: as [`retention_force`].
#[inline(always)]
pub fn sliding_angle(mass: f64, sigma_lv: f64, advancing_deg: f64, receding_deg: f64, width: f64, k: f64, g: f64) -> f64 {
    let f = retention_force(sigma_lv, advancing_deg, receding_deg, width, k);
    let s = f / (mass * g);
    // s > 1: never slides (fastmath::asin gives NaN there); NaN f stays NaN
    nan_unless(positive(mass) & positive(g), fastmath::asin(s).to_degrees())
}

/// Kernel of [`sliding_angle`].
pub struct SlidingAngle;
impl Kernel<7, 1> for SlidingAngle {
    const MODEL: Model = Model {
        name: "furmidge_sliding_angle",
        summary: "Critical tilt at which a drop starts to slide (Furmidge force balance); NaN when it never slides",
        equation: "sin(alpha) = k * w * sigma_lv * (cos(theta_r) - cos(theta_a)) / (m * g); NaN when sin(alpha) > 1",
        inputs: &[
            arg("mass", "kg"),
            arg("sigma_lv", "N/m"),
            arg("advancing_deg", "deg"),
            arg("receding_deg", "deg"),
            arg("width", "m"),
            arg("k", "-"),
            arg("g", "m/s2"),
        ],
        outputs: &[arg("sliding_angle_deg", "deg")],
        domain: "mass > 0, sigma_lv > 0, 0 <= receding_deg <= advancing_deg <= 180, width >= 0, k > 0, g > 0",
        validity: "as furmidge_retention_force; a NaN result for possible input means the drop never slides",
        reference: "C.G.L. Furmidge, J. Colloid Sci. 17 (1962) 309-324",
        doi: "10.1016/0095-8522(62)90011-9",
        verification: "force balance with k = 1 [V2 per MODELS.md, not re-read]; DOI [M]",
    };
    #[inline(always)]
    fn eval(x: &[f64; 7]) -> [f64; 1] {
        [sliding_angle(x[0], x[1], x[2], x[3], x[4], x[5], x[6])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 7]) -> bool {
        positive(x[0]) && positive(x[6]) && hysteresis_possible(x[1], x[2], x[3], x[4], x[5])
    }
}

// ---------------------------------------------------------------------------
// A8 disjoining pressure, films, Hamaker constants

/// Smallest film thickness \[m\] for which a continuum van der Waals film is
/// meaningful (a few molecular diameters) [M, common practice].
pub const VDW_FILM_MIN: f64 = 1e-9;
/// Thickness \[m\] above which retardation weakens the non-retarded `1/δ³` law
/// noticeably (it sets in from about 5 nm and is strong by a few tens of
/// nanometres, depending on the materials) [M, common practice].
pub const VDW_FILM_MAX: f64 = 20e-9;

/// Non-retarded van der Waals disjoining pressure of a flat film \[Pa\].
///
/// `Π(δ) = −A / (6 π δ³)`, the derivative `−dW/dδ` of the interaction energy
/// per area `W = −A/(12 π δ²)` of two half-spaces across the film.
///
/// * `thickness` δ \[m\] > 0; `hamaker` A \[J\], finite, the *effective* Hamaker
///   constant of the solid / film / vapour system. Sign convention: A < 0
///   gives Π > 0, a repulsive film that thickens: the liquid wets (see
///   [`effective_hamaker`]). Otherwise NaN.
/// * Validity: 1 nm ≤ δ ≤ 20 nm (continuum limit below, retardation above)
///   [M, common practice]; outside, computed and flagged.
///
/// References: H.C. Hamaker, Physica 4 (1937) 1058-1072,
/// doi:10.1016/S0031-8914(37)80203-7 (W = −A/(12πD²), A = π² C ρ₁ ρ₂)
/// \[V2\]; P.G. de Gennes, Rev. Mod. Phys. 57 (1985) 827-863 (Π form and
/// sign) [M, high].
#[inline(always)]
pub fn disjoining_pressure(thickness: f64, hamaker: f64) -> f64 {
    let ok = positive(thickness) & finite(hamaker);
    nan_unless(ok, -hamaker / (6.0 * std::f64::consts::PI * thickness * thickness * thickness))
}

/// Kernel of [`disjoining_pressure`].
pub struct VdwDisjoiningPressure;
impl Kernel<2, 1> for VdwDisjoiningPressure {
    const MODEL: Model = Model {
        name: "vdw_disjoining_pressure",
        summary: "Non-retarded van der Waals disjoining pressure of a flat film (A < 0: wetting film)",
        equation: "Pi = -A / (6 * pi * delta^3)",
        inputs: &[arg("thickness", "m"), arg("hamaker", "J")],
        outputs: &[arg("disjoining_pressure", "Pa")],
        domain: "thickness > 0, hamaker finite",
        validity: "1 nm <= thickness <= 20 nm (continuum limit; retardation), common practice, from memory",
        reference: "H.C. Hamaker, Physica 4 (1937) 1058-1072; P.G. de Gennes, Rev. Mod. Phys. 57 (1985) 827-863",
        doi: "10.1016/S0031-8914(37)80203-7",
        verification: "W = -A/(12 pi D^2) [V2]; Pi = -dW/dD derived here; sign convention and validity limits [M]",
    };
    #[inline(always)]
    fn eval(x: &[f64; 2]) -> [f64; 1] {
        [disjoining_pressure(x[0], x[1])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 2]) -> bool {
        positive(x[0]) && finite(x[1])
    }
    #[inline(always)]
    fn in_range(x: &[f64; 2]) -> bool {
        (VDW_FILM_MIN..=VDW_FILM_MAX).contains(&x[0])
    }
}

/// General power-law disjoining pressure `Π = B / δ^n` \[Pa\].
///
/// n = 3 is the non-retarded van der Waals film (`B = −A/(6π)`), n = 4 the
/// fully retarded one.
///
/// * `thickness` δ \[m\] > 0; `coefficient` B [Pa m^n] finite; `exponent` n
///   [-] > 0 finite; otherwise NaN.
/// * Validity: none of its own; B and n come with the film model the user
///   takes them from.
///
/// Reference: de Gennes (1985) [M, high].
#[inline(always)]
pub fn power_law_disjoining_pressure(thickness: f64, coefficient: f64, exponent: f64) -> f64 {
    iterate_one::<PowerLawDisjoiningPressure, 3, 1, 1>(&[thickness, coefficient, exponent])[0]
}

/// Kernel of [`power_law_disjoining_pressure`].
pub struct PowerLawDisjoiningPressure;

/// [`power_law_disjoining_pressure`] in two passes, `n ln δ` and then
/// `B e^(-n ln δ)` (see [`Iteration`] on why; a product where `B / δ^n`
/// would divide: divisions bound the vectorised blocks).
impl Iteration<3, 1, 1> for PowerLawDisjoiningPressure {
    const MAX_STEPS: usize = 0;
    #[inline(always)]
    fn start(x: &[f64; 3]) -> [f64; 1] {
        [x[2] * fastmath::ln(x[0])]
    }
    #[inline(always)]
    fn finish(x: &[f64; 3], s: &[f64; 1]) -> [f64; 1] {
        let [thickness, coefficient, exponent] = *x;
        // positive(thickness) & positive(exponent) & finite(coefficient): |B| is finite and
        // not negative exactly when B is finite
        let ok = crate::all_positive!(thickness, exponent; coefficient.abs());
        // B = 0 is zero pressure even where δ^-n overflows (0 * inf would be NaN)
        let pi = if coefficient == 0.0 { 0.0 } else { coefficient * fastmath::exp(-s[0]) };
        [nan_unless(ok, pi)]
    }
}
impl Kernel<3, 1> for PowerLawDisjoiningPressure {
    const MODEL: Model = Model {
        name: "power_law_disjoining_pressure",
        summary: "General power-law disjoining pressure Pi = B / delta^n",
        equation: "Pi = B / delta^n",
        inputs: &[arg("thickness", "m"), arg("coefficient", "Pa m^n"), arg("exponent", "-")],
        outputs: &[arg("disjoining_pressure", "Pa")],
        domain: "thickness > 0, coefficient finite, exponent > 0",
        validity: "none of its own: B and n belong to the film model they come from",
        reference: "P.G. de Gennes, Wetting: statics and dynamics, Rev. Mod. Phys. 57 (1985) 827-863",
        doi: "10.1103/RevModPhys.57.827",
        verification: "form [M, high]",
    };
    #[inline(always)]
    fn eval(x: &[f64; 3]) -> [f64; 1] {
        iterate_one::<Self, 3, 1, 1>(x)
    }
    #[inline(always)]
    fn eval_block<const B: usize>(at: impl Fn(usize) -> [f64; 3], len: usize, y: &mut [[f64; B]; 1]) -> BlockSummary {
        iterate_block::<Self, Self, 3, 1, 1, B>(at, len, y)
    }
    #[inline(always)]
    fn possible(x: &[f64; 3]) -> bool {
        positive(x[0]) && finite(x[1]) && positive(x[2])
    }
}

/// Equilibrium thickness \[m\] of a wetting film on a vertical wall at height
/// `z` above the pool (extended meniscus, non-retarded van der Waals film).
///
/// Hydrostatic balance `Π(δ) = (ρ_l − ρ_v) g z` with `Π = −A/(6πδ³)`:
/// `δ(z) = [−A / (6 π (ρ_l − ρ_v) g z)]^(1/3)`.
///
/// * `height` z \[m\] > 0; `hamaker` A \[J\] **< 0** (a wetting film; with A ≥ 0
///   no thick film is stable and the model does not apply); `rho_l > rho_v ≥ 0`
///   [kg/m3]; `g` [m/s2] > 0. Otherwise NaN (counted as impossible).
/// * Validity: the result between 1 nm and 20 nm, as for
///   [`disjoining_pressure`] (at heights of millimetres to centimetres the
///   film is thicker and retardation matters: flagged).
///
/// References: de Gennes (1985) [M, high]; MODELS A8 [M, high].
#[inline(always)]
pub fn film_thickness(height: f64, hamaker: f64, rho_l: f64, rho_v: f64, g: f64) -> f64 {
    let ok = film_possible(height, hamaker, rho_l, rho_v, g);
    nan_unless(ok, fastmath::cbrt(-hamaker / (6.0 * std::f64::consts::PI * (rho_l - rho_v) * g * height)))
}

#[inline(always)]
fn film_possible(height: f64, hamaker: f64, rho_l: f64, rho_v: f64, g: f64) -> bool {
    // positive(height) & (hamaker < 0) & finite(hamaker) & densities(rho_l, rho_v) & positive(g),
    // in two comparisons (`all_positive!`; the truth table is tested in model.rs): -hamaker is
    // positive exactly when hamaker is finite and below zero. A quarter of the kernel's time went
    // into joining the five masks.
    crate::all_positive!(height, -hamaker, g, rho_l - rho_v; rho_v)
}

/// Kernel of [`film_thickness`].
pub struct VdwFilmThickness;
impl Kernel<5, 1> for VdwFilmThickness {
    const MODEL: Model = Model {
        name: "vdw_film_thickness",
        summary: "Wetting-film thickness on a vertical wall above a pool (non-retarded van der Waals, extended meniscus)",
        equation: "delta = (-A / (6 * pi * (rho_l - rho_v) * g * z))^(1/3)",
        inputs: &[
            arg("height", "m"),
            arg("hamaker", "J"),
            arg("fluid.rho_l", "kg/m3"),
            arg("fluid.rho_v", "kg/m3"),
            arg("g", "m/s2"),
        ],
        outputs: &[arg("film_thickness", "m")],
        domain: "height > 0, hamaker < 0 (wetting film), rho_l > rho_v >= 0, g > 0",
        validity: "result between 1 nm and 20 nm (non-retarded van der Waals film), common practice, from memory",
        reference: "P.G. de Gennes, Wetting: statics and dynamics, Rev. Mod. Phys. 57 (1985) 827-863",
        doi: "10.1103/RevModPhys.57.827",
        verification: "hydrostatic balance Pi(delta) = drho g z [M, high]; derived from vdw_disjoining_pressure",
    };
    #[inline(always)]
    fn eval(x: &[f64; 5]) -> [f64; 1] {
        [film_thickness(x[0], x[1], x[2], x[3], x[4])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 5]) -> bool {
        film_possible(x[0], x[1], x[2], x[3], x[4])
    }
    #[inline(always)]
    fn in_range(x: &[f64; 5]) -> bool {
        Self::in_range_with(x, &Self::eval(x))
    }
    #[inline(always)]
    fn in_range_with(_x: &[f64; 5], y: &[f64; 1]) -> bool {
        (VDW_FILM_MIN..=VDW_FILM_MAX).contains(&y[0])
    }
}

/// Effective Hamaker constant \[J\] of a liquid film on a solid, exposed to its
/// vapour (or vacuum), from the two materials' own constants by the
/// combining relation
/// `A_SLV ≈ (√A_SS − √A_LL)(√A_VV − √A_LL)` with `A_VV ≈ 0`:
/// `A_SLV = A_LL − √(A_SS A_LL)`.
///
/// Negative when the solid's constant exceeds the liquid's: the film is
/// repulsive (wetting), the usual case for liquids on metals and glass.
///
/// * `hamaker_solid` A_SS and `hamaker_liquid` A_LL \[J\] ≥ 0, finite
///   (constants across vacuum, e.g. the table in `wetboil.wetting`);
///   otherwise NaN.
/// * Validity: none published as a range; the combining relation is an
///   approximation (typically good to tens of percent, worse when the
///   materials' refractive indices or dielectric constants differ strongly)
///   \[M\].
///
/// References: H.C. Hamaker, Physica 4 (1937) 1058-1072 (three-media sum
/// A_SLV = A_SV + A_LL - A_SL - A_LV, solid and vapour across the liquid)
/// \[M\]; the geometric-mean rule A_ij = sqrt(A_ii A_jj) for unlike
/// attraction constants, D. Berthelot, C. R. Acad. Sci. Paris 126 (1898)
/// 1703-1706 \[M\].
#[inline(always)]
pub fn effective_hamaker(hamaker_solid: f64, hamaker_liquid: f64) -> f64 {
    let ok = non_negative(hamaker_solid) & non_negative(hamaker_liquid);
    nan_unless(ok, hamaker_liquid - (hamaker_solid * hamaker_liquid).sqrt())
}

/// Kernel of [`effective_hamaker`].
pub struct EffectiveHamaker;
impl Kernel<2, 1> for EffectiveHamaker {
    const MODEL: Model = Model {
        name: "effective_hamaker",
        summary: "Effective Hamaker constant of a liquid film on a solid against its vapour (combining relation)",
        equation: "A_SLV = A_LL - sqrt(A_SS * A_LL)",
        inputs: &[arg("hamaker_solid", "J"), arg("hamaker_liquid", "J")],
        outputs: &[arg("hamaker", "J")],
        domain: "hamaker_solid >= 0, hamaker_liquid >= 0, finite",
        validity: "none published: an approximate combining relation",
        reference: "H.C. Hamaker, Physica 4 (1937) 1058-1072 (three-media sum); D. Berthelot, C. R. Acad. Sci. \
                    Paris 126 (1898) 1703-1706 (geometric-mean rule)",
        doi: "",
        verification: "combining relation [M]",
    };
    #[inline(always)]
    fn eval(x: &[f64; 2]) -> [f64; 1] {
        [effective_hamaker(x[0], x[1])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 2]) -> bool {
        non_negative(x[0]) && non_negative(x[1])
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn angle_from_cos_is_exact_at_the_ends() {
        assert_eq!(angle_from_cos(1.0), 0.0);
        assert_eq!(angle_from_cos(1.5), 0.0);
        assert_eq!(angle_from_cos(-1.0), 180.0);
        assert_eq!(angle_from_cos(-7.0), 180.0);
        assert_eq!(angle_from_cos(0.0), 90.0);
        assert!(angle_from_cos(f64::NAN).is_nan());
    }
    use crate::model::{evaluate, Status, G_STANDARD};
    use approx::assert_relative_eq;

    // Probe liquids at 20 C in N/m (the table of wetboil.wetting): water
    // 72.8 = 21.8 + 51.0 mN/m (Fowkes 1964 dispersive part; Owens & Wendt
    // 1969), methylene iodide 50.8 = 49.5 + 1.3 (Owens & Wendt 1969 split)
    // [both from memory].
    const WATER: (f64, f64) = (21.8e-3, 51.0e-3);
    const MI_OW: (f64, f64) = (49.5e-3, 1.3e-3);

    #[test]
    fn young_limits_and_identities() {
        // 0 and 180 deg ends: spreading and drying, not NaN.
        assert_eq!(young_angle(0.1, 0.02, 0.05), 0.0);
        assert_eq!(young_angle(0.02, 0.1, 0.05), 180.0);
        // Exactly at the ends.
        assert_eq!(young_angle(0.07, 0.02, 0.05), 0.0);
        assert_eq!(young_angle(0.02, 0.07, 0.05), 180.0);
        // sigma_sv = sigma_sl gives 90 deg.
        assert_relative_eq!(young_angle(0.03, 0.03, 0.07), 90.0, max_relative = 1e-14);
        // Inverse of the cosine relation.
        for theta in [1.0f64, 30.0, 60.0, 120.0, 179.0] {
            let lv = 0.0728;
            let sl = 0.01;
            let sv = sl + lv * theta.to_radians().cos();
            if sv >= 0.0 {
                assert_relative_eq!(young_angle(sv, sl, lv), theta, max_relative = 1e-11);
            }
        }
        for bad in [(-0.01, 0.01, 0.05), (0.01, -0.01, 0.05), (0.01, 0.01, 0.0), (0.01, 0.01, f64::INFINITY)] {
            assert!(young_angle(bad.0, bad.1, bad.2).is_nan());
        }
    }

    #[test]
    fn spreading_and_young_dupre_identities() {
        let (sv, sl, lv) = (0.045, 0.012, 0.0728);
        let theta = young_angle(sv, sl, lv);
        // S = sigma_lv (cos theta - 1) for a partially wetting liquid.
        assert_relative_eq!(spreading_coefficient(sv, sl, lv), lv * (theta.to_radians().cos() - 1.0), max_relative = 1e-12);
        // Young-Dupre: W_a = sigma_sv + sigma_lv - sigma_sl.
        assert_relative_eq!(adhesion_work(lv, theta), sv + lv - sl, max_relative = 1e-12);
        // Limits of W_a: 2 sigma at 0 deg (cohesion), 0 at 180 deg.
        assert_eq!(adhesion_work(lv, 0.0), 2.0 * lv);
        assert!(adhesion_work(lv, 180.0).abs() < 1e-17);
        assert!(adhesion_work(lv, 180.1).is_nan());
        assert!(adhesion_work(-lv, 10.0).is_nan());
    }

    #[test]
    fn liquid_helium_spreads_on_high_energy_solids() {
        // Common practice, no source: liquid helium (0.1-1 mN/m) on glass or
        // metals (100-1000 mN/m) spreads. Interfacial tension estimated with
        // Girifalco-Good, phi = 1.
        for gl in [0.1e-3, 0.37e-3, 1e-3] {
            for gs in [0.1, 0.5, 1.0] {
                let gsl = interfacial_tension(gs, gl, 1.0);
                assert!(spreading_coefficient(gs, gsl, gl) > 0.0);
                assert_eq!(young_angle(gs, gsl, gl), 0.0);
            }
        }
    }

    #[test]
    fn girifalco_good_with_young() {
        // Combined with Young: cos theta = -1 + 2 phi sqrt(gs / gl).
        let (gs, gl) = (0.020, 0.0728);
        for phi in [0.6, 0.8, 1.0] {
            let gsl = interfacial_tension(gs, gl, phi);
            let c = -1.0 + 2.0 * phi * (gs / gl).sqrt();
            assert_relative_eq!(young_angle(gs, gsl, gl), c.acos().to_degrees(), max_relative = 1e-12);
        }
        // Identical phases with phi = 1: no interface.
        assert!(interfacial_tension(0.05, 0.05, 1.0).abs() < 1e-17);
        // phi = 0: no interaction, gamma_12 = gamma_1 + gamma_2.
        assert_eq!(interfacial_tension(0.02, 0.05, 0.0), 0.07);
        assert!(interfacial_tension(0.02, 0.05, -0.1).is_nan());
        assert_eq!(evaluate::<GirifalcoGood, 3, 1>(&[0.02, 0.05, 1.3]).1, Status::OutOfRange);
    }

    #[test]
    fn owrk_reproduces_owens_wendt_ptfe() {
        // Owens & Wendt (1969), table of polymers [from memory]: PTFE with
        // water 108 deg and methylene iodide 88 deg has gamma_d = 12.5,
        // gamma_h = 1.5 mN/m. The forward model must return those angles.
        let (sd, sp) = (12.5e-3, 1.5e-3);
        assert_relative_eq!(owrk_angle(sd, sp, WATER.0, WATER.1), 108.0, epsilon = 0.5);
        assert_relative_eq!(owrk_angle(sd, sp, MI_OW.0, MI_OW.1), 88.0, epsilon = 0.5);
    }

    #[test]
    fn owrk_limits() {
        // A liquid on a solid of identical components spreads (W_a = 2 sigma_l).
        assert_eq!(owrk_angle(WATER.0, WATER.1, WATER.0, WATER.1), 0.0);
        // A solid of zero energy: cos = -1, 180 deg.
        assert_eq!(owrk_angle(0.0, 0.0, WATER.0, WATER.1), 180.0);
        // Purely dispersive pair = Girifalco-Good with phi = 1 (Fowkes).
        let (gs, gl) = (0.030, 0.0508);
        let gsl = interfacial_tension(gs, gl, 1.0);
        assert_relative_eq!(owrk_angle(gs, 0.0, gl, 0.0), young_angle(gs, gsl, gl), max_relative = 1e-12);
        assert!(owrk_angle(-1e-3, 0.0, gl, 0.0).is_nan());
        assert!(owrk_angle(1e-3, 0.0, 0.0, 0.0).is_nan());
    }

    #[test]
    fn wenzel_identities_and_saturation() {
        for theta in [0.0, 10.0, 45.0, 90.0, 135.0, 180.0] {
            // r = 1 gives the intrinsic angle.
            assert_relative_eq!(wenzel(theta, 1.0), theta, epsilon = 1e-9);
        }
        // 90 deg stays 90 at any roughness.
        assert_relative_eq!(wenzel(90.0, 3.0), 90.0, epsilon = 1e-9);
        // Roughness amplifies: hydrophilic gets more so, hydrophobic too.
        assert!(wenzel(60.0, 1.5) < 60.0 && wenzel(120.0, 1.5) > 120.0);
        // Saturation, flagged as outside validity.
        assert_eq!(wenzel(30.0, 2.0), 0.0);
        assert_eq!(wenzel(150.0, 2.0), 180.0);
        assert_eq!(evaluate::<Wenzel, 2, 1>(&[30.0, 2.0]).1, Status::OutOfRange);
        assert_eq!(evaluate::<Wenzel, 2, 1>(&[60.0, 1.5]).1, Status::Ok);
        // Impossible input.
        assert!(wenzel(30.0, 0.9).is_nan());
        assert!(wenzel(-1.0, 1.5).is_nan());
        assert_eq!(evaluate::<Wenzel, 2, 1>(&[30.0, 0.9]).1, Status::Invalid);
    }

    #[test]
    fn hemiwicking_limits_and_energy_balance() {
        // Flat: only a spreading liquid wicks.
        assert_eq!(hemiwicking_angle(0.3, 1.0), 0.0);
        // No tops: the threshold is where Wenzel's angle reaches 0 [identity].
        for r in [1.2, 1.5, 2.0, 4.0] {
            let t = hemiwicking_angle(0.0, r);
            assert_relative_eq!(cos_deg(t), 1.0 / r, max_relative = 1e-12);
            assert_relative_eq!(wenzel(t, r), 0.0, epsilon = 1e-5);
        }
        // Very rough: approaches 90 deg from below, never beyond.
        let t = hemiwicking_angle(0.5, 1e9);
        assert!(t < 90.0 && t > 89.99);
        // The energy balance [D]: at theta_c a film front costs nothing, per unit
        // advance and with Young's equation, (r - phi_s)(-cos theta_c) + (1 - phi_s) = 0.
        for (f, r) in [(0.1, 1.5), (0.3, 2.0), (0.6, 3.0)] {
            let c = cos_deg(hemiwicking_angle(f, r));
            assert_relative_eq!((r - f) * (-c) + (1.0 - f), 0.0, epsilon = 1e-12);
        }
        assert!(hemiwicking_angle(1.0, 2.0).is_nan());
        assert!(hemiwicking_angle(-0.1, 2.0).is_nan());
        assert!(hemiwicking_angle(0.3, 0.9).is_nan());
        assert!(hemiwicking_angle(0.3, f64::INFINITY).is_nan());
    }

    #[test]
    fn impregnated_meets_wenzel_at_the_wicking_threshold() {
        // [identity] at theta_c the wicked state and Wenzel's give one angle; below it the
        // wicked angle is in range and below the intrinsic one, above it flagged.
        for (f, r) in [(0.1, 1.5), (0.25, 2.0), (0.6, 3.0)] {
            let tc = hemiwicking_angle(f, r);
            assert_relative_eq!(impregnated_angle(tc, f, r), wenzel(tc, r), max_relative = 1e-9);
            assert_eq!(evaluate::<ImpregnatedAngle, 3, 1>(&[tc - 1e-6, f, r]).1, Status::Ok);
            assert_eq!(evaluate::<ImpregnatedAngle, 3, 1>(&[tc + 1e-3, f, r]).1, Status::OutOfRange);
            for t in [0.0, 0.5 * tc, tc] {
                assert!(impregnated_angle(t, f, r) <= t + 1e-12);
            }
        }
        // Bico et al.'s pillars worked by hand: phi_s = 0.25, r = 2 (theta_c = 64.6 deg), theta = 50 deg:
        // cos = 1 - 0.25 (1 - cos 50 deg) = 0.91070, 24.4 deg.
        assert_relative_eq!(impregnated_angle(50.0, 0.25, 2.0), (0.75 + 0.25 * cos_deg(50.0)).acos().to_degrees(), max_relative = 1e-12);
        assert!((impregnated_angle(50.0, 0.25, 2.0) - 24.4).abs() < 0.05);
        // No tops: all liquid, 0 deg; all tops: the flat material.
        assert_eq!(impregnated_angle(40.0, 0.0, 1.5), 0.0);
        assert_relative_eq!(impregnated_angle(40.0, 1.0, 1.5), 40.0, max_relative = 1e-12);
        assert_eq!(evaluate::<ImpregnatedAngle, 3, 1>(&[120.0, 1.0, 1.5]).1, Status::Ok);
        assert!(impregnated_angle(40.0, 1.1, 1.5).is_nan());
        assert!(impregnated_angle(40.0, 0.5, 0.9).is_nan());
        assert!(impregnated_angle(190.0, 0.5, 1.5).is_nan());
    }

    #[test]
    fn tensions_and_solid_energies_have_their_bounds() {
        // A clean metal's surface energy is 1-2 J/m2 [common practice, from
        // memory]: not flagged. The liquid's tension in mN/m is, and so are a
        // solid's energies in mN/m (PTFE's 12.5 + 1.5 mN/m dispersive and
        // polar, Owens & Wendt 1969, from memory), which made every liquid
        // spread in silence.
        assert_eq!(evaluate::<YoungAngle, 3, 1>(&[2.0, 1.95, 0.0728]).1, Status::Ok);
        assert_eq!(evaluate::<YoungAngle, 3, 1>(&[2.0, 1.95, 72.8]).1, Status::OutOfRange);
        assert_eq!(evaluate::<YoungAngle, 3, 1>(&[40.0, 10.0, 0.0728]).1, Status::OutOfRange);
        assert_eq!(evaluate::<OwrkAngle, 4, 1>(&[0.03, 0.01, 0.0218, 0.051]).1, Status::Ok);
        assert_eq!(evaluate::<OwrkAngle, 4, 1>(&[0.03, 0.01, 21.8, 51.0]).1, Status::OutOfRange);
        assert_eq!(evaluate::<OwrkAngle, 4, 1>(&[12.5, 1.5, 0.0218, 0.051]).1, Status::OutOfRange);
        assert_eq!(evaluate::<GirifalcoGood, 3, 1>(&[20.0, 0.0728, 1.0]).1, Status::OutOfRange);
        assert_eq!(evaluate::<GirifalcoGood, 3, 1>(&[2.0, 0.0728, 1.0]).1, Status::Ok);
        assert!(YoungAngle::MODEL.validity_text().contains("mN/m"));
        assert!(YoungAngle::MODEL.validity_text().contains("solid surface energy"));
        assert!(!Wenzel::MODEL.validity_text().contains("mN/m"));
    }

    #[test]
    fn cassie_baxter_identities() {
        for theta in [0.0, 30.0, 90.0, 150.0, 180.0] {
            // f = 1, r_f = 1 gives the intrinsic angle.
            assert_relative_eq!(cassie_baxter(theta, 1.0, 1.0), theta, epsilon = 1e-9);
            // f = 1 with rough tops is Wenzel.
            assert_relative_eq!(cassie_baxter(theta, 1.0, 1.3), wenzel(theta, 1.3), epsilon = 1e-9);
            // f = 0: the drop rests on gas only.
            assert_eq!(cassie_baxter(theta, 0.0, 1.0), 180.0);
        }
        // Lotus-type numbers: theta = 110 deg, f = 0.1 -> cos = 0.1 (1 + cos 110) - 1.
        let c: f64 = 0.1 * (1.0 + 110f64.to_radians().cos()) - 1.0;
        assert_relative_eq!(cassie_baxter(110.0, 0.1, 1.0), c.acos().to_degrees(), max_relative = 1e-12);
        assert!(cassie_baxter(110.0, 1.1, 1.0).is_nan());
        assert!(cassie_baxter(110.0, 0.5, 0.99).is_nan());
        // Saturation flagged.
        assert_eq!(cassie_baxter(20.0, 1.0, 2.0), 0.0);
        assert_eq!(evaluate::<CassieBaxter, 3, 1>(&[20.0, 1.0, 2.0]).1, Status::OutOfRange);
        // The hydrophilic flag needs trapped gas (f < 1); f = 1 is Wenzel's state.
        assert_eq!(evaluate::<CassieBaxter, 3, 1>(&[60.0, 1.0, 1.4]).1, Status::Ok);
        assert_eq!(evaluate::<CassieBaxter, 3, 1>(&[60.0, 0.9, 1.4]).1, Status::OutOfRange);
    }

    #[test]
    fn furmidge_force_and_sliding_angle() {
        let (s, w) = (0.0728, 2e-3);
        // No hysteresis: no retention, slides at 0 deg tilt.
        assert_eq!(retention_force(s, 80.0, 80.0, w, 1.0), 0.0);
        assert_eq!(sliding_angle(1e-5, s, 80.0, 80.0, w, 1.0, G_STANDARD), 0.0);
        // Maximal hysteresis 180/0: F = 2 k w sigma.
        assert_relative_eq!(retention_force(s, 180.0, 0.0, w, 1.0), 2.0 * w * s, max_relative = 1e-14);
        // Force balance round trip.
        let m = 20e-6; // 20 mg
        let a = sliding_angle(m, s, 110.0, 90.0, w, 1.0, G_STANDARD);
        assert_relative_eq!(m * G_STANDARD * a.to_radians().sin(), retention_force(s, 110.0, 90.0, w, 1.0), max_relative = 1e-12);
        // A drop too light to slide even on a vertical plate: NaN, possible input.
        let (y, st) = evaluate::<SlidingAngle, 7, 1>(&[1e-7, s, 110.0, 60.0, w, 1.0, G_STANDARD]);
        assert!(y[0].is_nan());
        assert_eq!(st, Status::Ok);
        // Advancing below receding is impossible.
        assert!(retention_force(s, 60.0, 70.0, w, 1.0).is_nan());
        let (_, st) = evaluate::<SlidingAngle, 7, 1>(&[m, s, 60.0, 70.0, w, 1.0, G_STANDARD]);
        assert_eq!(st, Status::Invalid);
    }

    #[test]
    fn disjoining_pressure_and_film() {
        // A < 0: repulsive (wetting) film, positive pressure; 1/d^3 scaling.
        let a = -1e-19;
        let p1 = disjoining_pressure(5e-9, a);
        assert!(p1 > 0.0);
        assert_relative_eq!(p1 / disjoining_pressure(10e-9, a), 8.0, max_relative = 1e-12);
        // Power law with n = 3 and B = -A/(6 pi) is the van der Waals form.
        let b = -a / (6.0 * std::f64::consts::PI);
        assert_relative_eq!(power_law_disjoining_pressure(5e-9, b, 3.0), p1, max_relative = 1e-12);
        // Film: Pi(delta(z)) = drho g z.
        let (rl, rv, z) = (958.35, 0.598, 0.5);
        let d = film_thickness(z, a, rl, rv, G_STANDARD);
        assert_relative_eq!(disjoining_pressure(d, a), (rl - rv) * G_STANDARD * z, max_relative = 1e-12);
        // z^-1/3: eight times higher, half as thick.
        assert_relative_eq!(film_thickness(8.0 * z, a, rl, rv, G_STANDARD), d / 2.0, max_relative = 1e-12);
        // A >= 0: no wetting film, outside the model's domain.
        assert!(film_thickness(z, 1e-20, rl, rv, G_STANDARD).is_nan());
        assert!(film_thickness(0.0, a, rl, rv, G_STANDARD).is_nan());
        assert!(disjoining_pressure(0.0, a).is_nan());
        assert!(power_law_disjoining_pressure(1e-9, 1.0, 0.0).is_nan());
        // Limits of B delta^-n: delta^-n overflowing (inf, and 0 for B = 0, not
        // NaN) or underflowing (0); n = 4, the retarded film, to rounding.
        assert_eq!(power_law_disjoining_pressure(1e-200, 1.0, 3.0), f64::INFINITY);
        assert_eq!(power_law_disjoining_pressure(1e-200, 0.0, 3.0), 0.0);
        assert_eq!(power_law_disjoining_pressure(1e200, -1.0, 3.0), 0.0);
        assert_relative_eq!(power_law_disjoining_pressure(2e-8, 3.2e-29, 4.0), 3.2e-29 / 1.6e-31, max_relative = 1e-14);
        // A centimetre above the pool the film is beyond 20 nm: flagged.
        let (y, st) = evaluate::<VdwFilmThickness, 5, 1>(&[0.01, a, rl, rv, G_STANDARD]);
        assert!(y[0] > VDW_FILM_MAX);
        assert_eq!(st, Status::OutOfRange);
    }

    #[test]
    fn effective_hamaker_signs() {
        // Water (3.7e-20 J) on glass (about 9e-20 J) across its vapour: wetting
        // film, A < 0. Material values: Hough & White (1980) for water [M]; the glass
        // value is common practice (see HAMAKER_CONSTANTS in wetboil.wetting).
        let a = effective_hamaker(9e-20, 3.7e-20);
        assert!(a < 0.0);
        assert_relative_eq!(a, (9e-20f64.sqrt() - 3.7e-20f64.sqrt()) * (0.0 - 3.7e-20f64.sqrt()), max_relative = 1e-12);
        // Same material: no net film force.
        assert!(effective_hamaker(5e-20, 5e-20).abs() < 1e-35);
        // Liquid with the larger constant (hexadecane 5.2e-20 on PTFE 3.8e-20 [M]): A > 0, no wetting film.
        assert!(effective_hamaker(3.8e-20, 5.2e-20) > 0.0);
        assert!(effective_hamaker(-1e-20, 5e-20).is_nan());
    }
}
