//! Critical heat flux (maximum of the nucleate boiling curve).

use crate::all_positive;
use crate::fastmath;
use crate::model::{angle_deg, arg, densities, nan_unless, positive, Factored, Kernel, Model};
use crate::trig::cos_deg;
use std::f64::consts::PI;

/// Zuber's constant π/24 of the hydrodynamic CHF [-].
pub const ZUBER_K: f64 = PI / 24.0;
/// Lienhard and Dhir's constant for a large (infinite) flat heater [-].
pub const LIENHARD_DHIR_K: f64 = 0.149;

/// Largest vapour-to-liquid density ratio ρ_v/ρ_l inside the range of the
/// hydrodynamic CHF forms ([`zuber`], [`kandlikar`], [`lienhard_dhir`]) [-].
///
/// The library's own bound, not a published one: these forms take ρ_v ≪ ρ_l,
/// and the factor `[(ρ_l + ρ_v)/ρ_l]^(1/2)` of Zuber's original that they omit
/// reaches 1.10 at 0.21. Beyond it, towards the critical point (where the CHF
/// falls to zero), the value is computed and flagged as extrapolation. For
/// water the bound is 16.96 MPa (T_sat 625.2 K, p/p_crit 0.77, IAPWS-95);
/// for R134a, ammonia and methanol p/p_crit 0.73 to 0.75, nitrogen 0.69,
/// helium 0.62 (CoolProp).
pub const DENSITY_RATIO_MAX: f64 = 0.21;

/// Whether ρ_v/ρ_l ≤ [`DENSITY_RATIO_MAX`].
#[inline(always)]
fn far_from_critical(rho_l: f64, rho_v: f64) -> bool {
    rho_v <= DENSITY_RATIO_MAX * rho_l
}

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
///   Flagged out of range: `K` outside 0.10-0.20, or ρ_v/ρ_l above
///   [`DENSITY_RATIO_MAX`] (near the critical point).
///
/// References: N. Zuber, "Hydrodynamic aspects of boiling heat transfer",
/// AEC Report AECU-4439 (1959); J.H. Lienhard and V.K. Dhir, "Hydrodynamic
/// prediction of peak pool-boiling heat fluxes from finite bodies",
/// J. Heat Transfer 95 (1973) 152-158, doi:10.1115/1.3450013.
#[inline(always)]
pub fn zuber(h_lv: f64, rho_l: f64, rho_v: f64, sigma: f64, k: f64, g: f64) -> f64 {
    let ok = crate::all_positive!(h_lv, rho_v, rho_l - rho_v, sigma, k, g); // rho_l > rho_v > 0
    nan_unless(ok, k * h_lv * rho_v.sqrt() * (sigma * g * (rho_l - rho_v)).sqrt().sqrt())
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
        validity: "saturated pool boiling on a large upward-facing heater; 0.10 <= K <= 0.20 (the constants in use span \
                   0.13 to 0.18); rho_v/rho_l <= 0.21 (the library's own near-critical bound, p/p_crit 0.6-0.77 by \
                   fluid; water below 16.96 MPa)",
        reference: "N. Zuber, Hydrodynamic aspects of boiling heat transfer, AEC Report AECU-4439 (1959); \
                    J.H. Lienhard, V.K. Dhir, J. Heat Transfer 95 (1973) 152-158",
        doi: "10.1115/1.3450013",
        verification: "form and constants pi/24 and 0.149: textbook worked examples (see tests)",
    };
    #[inline(always)]
    fn eval(x: &[f64; 6]) -> [f64; 1] {
        [zuber(x[0], x[1], x[2], x[3], x[4], x[5])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 6]) -> bool {
        positive(x[0]) && densities(x[1], x[2]) && positive(x[2]) && positive(x[3]) && positive(x[4]) && positive(x[5])
    }
    #[inline(always)]
    fn in_range(x: &[f64; 6]) -> bool {
        (0.10..=0.20).contains(&x[4]) && far_from_critical(x[1], x[2])
    }
}

/// Kandlikar (2001) critical heat flux with receding contact angle and heater
/// orientation [W/m2].
///
/// `q_CHF = h_lv ρ_v^(1/2) [(1 + cos β)/16] [2/π + (π/4)(1 + cos β) cos φ]^(1/2) [σ g (ρ_l − ρ_v)]^(1/4)`
///
/// * β receding contact angle \[deg\] (through the liquid), φ heater orientation
///   \[deg\] from horizontal facing up (0) through vertical (90) to facing down (180).
/// * Published validity: 0 ≤ φ ≤ 90°. Beyond 90° the result is still computed
///   (and flagged out of range) while the bracket stays positive; where
///   `2/π + (π/4)(1 + cos β) cos φ ≤ 0` the model has no answer and gives NaN.
///   Also flagged: ρ_v/ρ_l above [`DENSITY_RATIO_MAX`] (near the critical point).
/// * Possible: 0 ≤ β ≤ 180, 0 ≤ φ ≤ 180, positive properties, ρ_l > ρ_v.
///
/// Reference: S.G. Kandlikar, "A theoretical model to predict pool boiling CHF
/// incorporating effects of contact angle and orientation", J. Heat Transfer
/// 123 (2001) 1071-1079, doi:10.1115/1.1409265.
#[inline(always)]
pub fn kandlikar(
    receding_angle_deg: f64,
    orientation_deg: f64,
    h_lv: f64,
    rho_l: f64,
    rho_v: f64,
    sigma: f64,
    g: f64,
) -> f64 {
    kandlikar_angle_factor(receding_angle_deg, orientation_deg) * hydrodynamic_group(h_lv, rho_l, rho_v, sigma, g)
}

/// The angle factor of [`kandlikar`], `(1 + cos β)/16 [2/π + (π/4)(1 + cos β) cos φ]^(1/2)`
/// (Zuber's K as a function of the receding angle and orientation). NaN for
/// angles outside 0..180 deg and where the bracket is not positive (facing down).
#[inline(always)]
pub fn kandlikar_angle_factor(receding_angle_deg: f64, orientation_deg: f64) -> f64 {
    let ok = angle_deg(receding_angle_deg) & angle_deg(orientation_deg);
    let c = 1.0 + cos_deg(receding_angle_deg);
    let bracket = 2.0 / PI + PI / 4.0 * c * cos_deg(orientation_deg);
    nan_unless(ok & (bracket > 0.0), c / 16.0 * bracket.sqrt())
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
        validity: "0 <= orientation_deg <= 90; rho_v/rho_l <= 0.21 (the library's own near-critical bound, p/p_crit \
                   0.6-0.77 by fluid; water below 16.96 MPa)",
        reference: "S.G. Kandlikar, A theoretical model to predict pool boiling CHF incorporating effects of \
                    contact angle and orientation, J. Heat Transfer 123 (2001) 1071-1079",
        doi: "10.1115/1.1409265",
        verification: "see wetboil.chf.kandlikar docstring",
    };
    #[inline(always)]
    fn eval(x: &[f64; 7]) -> [f64; 1] {
        [kandlikar(x[0], x[1], x[2], x[3], x[4], x[5], x[6])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 7]) -> bool {
        Self::side_possible(0, x) && Self::side_possible(1, x)
    }
    #[inline(always)]
    fn in_range(x: &[f64; 7]) -> bool {
        Self::side_in_range(0, x) && Self::side_in_range(1, x)
    }
}
impl Factored<7, 1> for Kandlikar {
    const SIDES: [u8; 7] = [0, 0, 1, 1, 1, 1, 1];
    #[inline(always)]
    fn factor(s: u8, x: &[f64; 7]) -> [f64; 1] {
        [if s == 0 { kandlikar_angle_factor(x[0], x[1]) } else { hydrodynamic_group(x[2], x[3], x[4], x[5], x[6]) }]
    }
    #[inline(always)]
    fn side_possible(s: u8, x: &[f64; 7]) -> bool {
        if s == 0 {
            angle_deg(x[0]) & angle_deg(x[1])
        } else {
            scale_possible(x[2], x[3], x[4], x[5], x[6])
        }
    }
    #[inline(always)]
    fn side_in_range(s: u8, x: &[f64; 7]) -> bool {
        if s == 0 {
            x[1] <= 90.0
        } else {
            far_from_critical(x[3], x[4])
        }
    }
}

// ---------------------------------------------------------------------------
// Lienhard & Dhir finite heaters

/// Geometry code of [`lienhard_dhir`]: large (infinite) horizontal flat heater facing up.
pub const GEOMETRY_FLAT_PLATE: f64 = 0.0;
/// Geometry code: small horizontal flat heater (one vapour jet).
pub const GEOMETRY_SMALL_FLAT_PLATE: f64 = 1.0;
/// Geometry code: horizontal cylinder.
pub const GEOMETRY_CYLINDER: f64 = 2.0;
/// Geometry code: sphere.
pub const GEOMETRY_SPHERE: f64 = 3.0;

/// Lienhard & Dhir's small-flat-heater coefficient in `q_max = c K₁ scale`,
/// `K₁ = σ/(g Δρ A)`, from their ratio form `q_max/q_max,Z = 1.14 λ_d²/A` with
/// `λ_d = 2π√3 l_c`: `c = 1.14 (π/24) (2π√3)² = 17.67` \[D from the ratio form\].
pub const SMALL_PLATE_RATIO_FORM: f64 = 1.14 * (PI / 24.0) * (12.0 * PI * PI);
/// The same coefficient as tabulated in restatements, 18.9 (7 % higher; MODELS Q-8).
pub const SMALL_PLATE_TABULATED: f64 = 18.9;

/// The hydrodynamic group `h_lv ρ_v^(1/2) [σ g (ρ_l − ρ_v)]^(1/4)` [W/m2].
#[inline(always)]
fn chf_scale(h_lv: f64, rho_l: f64, rho_v: f64, sigma: f64, g: f64) -> f64 {
    h_lv * rho_v.sqrt() * (sigma * g * (rho_l - rho_v)).sqrt().sqrt()
}

/// [`chf_scale`], NaN for impossible properties.
#[inline(always)]
fn hydrodynamic_group(h_lv: f64, rho_l: f64, rho_v: f64, sigma: f64, g: f64) -> f64 {
    nan_unless(scale_possible(h_lv, rho_l, rho_v, sigma, g), chf_scale(h_lv, rho_l, rho_v, sigma, g))
}

#[inline(always)]
fn scale_possible(h_lv: f64, rho_l: f64, rho_v: f64, sigma: f64, g: f64) -> bool {
    all_positive!(h_lv, rho_v, sigma, g, rho_l - rho_v)
}

#[inline(always)]
fn geometry_code(x: f64) -> Option<u8> {
    if x == GEOMETRY_FLAT_PLATE {
        Some(0)
    } else if x == GEOMETRY_SMALL_FLAT_PLATE {
        Some(1)
    } else if x == GEOMETRY_CYLINDER {
        Some(2)
    } else if x == GEOMETRY_SPHERE {
        Some(3)
    } else {
        None
    }
}

/// Peak (critical) heat flux of a finite heater after Lienhard & Dhir [W/m2].
///
/// `q_max = F(L') (π/24) h_lv ρ_v^(1/2) [σ g (ρ_l − ρ_v)]^(1/4)` with the
/// dimensionless size `L' = L [g (ρ_l − ρ_v)/σ]^(1/2)`:
///
/// | geometry (code) | `L` | `F(L')` or `q_max` | published range |
/// |---|---|---|---|
/// | large flat plate (0) | width | `q_max = 0.149 × scale` (F = 1.14) | L' ≥ 27 |
/// | small flat plate (1) | width | `q_max = c K₁ × scale`, `K₁ = σ/(gΔρA)` | 9 ≤ L' ≤ 20 |
/// | cylinder (2) | radius | `0.89 + 2.27 exp(−3.44 √L')` (Sun & Lienhard) | L' ≥ 0.15 |
/// | sphere (3) | radius | `0.84` for L' ≥ 4.26, else `1.734 L'^(−1/2)` | L' ≥ 0.15 |
///
/// * `geometry` code, `size` L \[m\], `area` heater area A \[m2\] (small flat
///   plate only; other geometries ignore it but it must be positive),
///   `small_plate` the small-plate coefficient c [-] (17.67 from the ratio
///   form, 18.9 as tabulated; MODELS Q-8 unresolved), `h_lv` [J/kg],
///   `rho_l`, `rho_v` [kg/m3], `sigma` [N/m], `g` [m/s2].
/// * Possible: a known geometry code, positive size, area, c and properties,
///   ρ_l > ρ_v; otherwise NaN. Outside the published L' range, or with ρ_v/ρ_l
///   above [`DENSITY_RATIO_MAX`] (near the critical point): computed, flagged.
/// * The small-plate form with A = L² is F = 135/L'² \[D\]: above the large
///   plate's 1.14 only below L' = 10.9 (one Taylor cell), 0.34 at L' = 20; kept
///   as stated (the conservative side), not flagged.
/// * Verification: the cylinder form is \[V2\] (two transcribed textbook
///   examples using R' = r [gΔρ/σ]^(1/2)); the flat-plate 0.149 (= 1.14 π/24)
///   is \[V\] in textbook worked examples; the small-plate and sphere forms and
///   every range are \[M, high\]; the original paper was not read.
///
/// References: J.H. Lienhard, V.K. Dhir, "Hydrodynamic prediction of peak
/// pool-boiling heat fluxes from finite bodies", J. Heat Transfer 95 (1973)
/// 152-158, doi:10.1115/1.3450013; K.H. Sun, J.H. Lienhard, "The peak pool
/// boiling heat flux on horizontal cylinders", Int. J. Heat Mass Transfer 13
/// (1970) 1425-1439; the sphere's original: J.S. Ded, J.H. Lienhard, "The
/// peak pool boiling heat flux from a sphere", AIChE J. 18 (1972) 337-342
/// (bibliographic data from memory, two recollections agree; not read).
#[inline(always)]
#[allow(clippy::too_many_arguments)]
pub fn lienhard_dhir(
    geometry: f64,
    size: f64,
    area: f64,
    small_plate: f64,
    h_lv: f64,
    rho_l: f64,
    rho_v: f64,
    sigma: f64,
    g: f64,
) -> f64 {
    let ok = all_positive!(size, area, small_plate) & scale_possible(h_lv, rho_l, rho_v, sigma, g);
    let scale = chf_scale(h_lv, rho_l, rho_v, sigma, g);
    let l_prime = size * (g * (rho_l - rho_v) / sigma).sqrt();
    // every geometry's factor, then a select: no branch, so array loops vectorise
    let small = small_plate * sigma / (g * (rho_l - rho_v) * area);
    let cylinder = ZUBER_K * (0.89 + 2.27 * fastmath::exp(-3.44 * l_prime.sqrt()));
    let sphere = ZUBER_K * if l_prime >= 4.26 { 0.84 } else { 1.734 / l_prime.sqrt() };
    let factor = if geometry == GEOMETRY_FLAT_PLATE {
        LIENHARD_DHIR_K
    } else if geometry == GEOMETRY_SMALL_FLAT_PLATE {
        small
    } else if geometry == GEOMETRY_CYLINDER {
        cylinder
    } else if geometry == GEOMETRY_SPHERE {
        sphere
    } else {
        f64::NAN
    };
    nan_unless(ok, factor * scale)
}

/// Dimensionless size `L' = L [g (ρ_l − ρ_v)/σ]^(1/2)` of [`lienhard_dhir`]: the heater size over the
/// capillary length [-]. Possible: L ≥ 0, ρ_l > ρ_v ≥ 0, σ > 0, g > 0; otherwise NaN.
#[inline(always)]
pub fn dimensionless_size(size: f64, rho_l: f64, rho_v: f64, sigma: f64, g: f64) -> f64 {
    nan_unless(size_possible(&[size, rho_l, rho_v, sigma, g]), size * (g * (rho_l - rho_v) / sigma).sqrt())
}

#[inline(always)]
fn size_possible(x: &[f64; 5]) -> bool {
    crate::all_positive!(x[3], x[4]; x[0]) & densities(x[1], x[2])
}

/// Kernel of [`dimensionless_size`].
pub struct DimensionlessSize;
impl Kernel<5, 1> for DimensionlessSize {
    const MODEL: Model = Model {
        name: "dimensionless_size",
        summary: "Heater size over the capillary length, Lienhard & Dhir's L' (R' for a radius)",
        equation: "L' = L*sqrt(g*(rho_l-rho_v)/sigma)",
        inputs: &[
            arg("size", "m"),
            arg("fluid.rho_l", "kg/m3"),
            arg("fluid.rho_v", "kg/m3"),
            arg("fluid.sigma", "N/m"),
            arg("g", "m/s2"),
        ],
        outputs: &[arg("dimensionless_size", "-")],
        domain: "size >= 0, rho_l > rho_v >= 0, sigma > 0, g > 0",
        validity: "a definition: no range of its own (each CHF form states the L' it holds for)",
        reference: "J.H. Lienhard, V.K. Dhir, Hydrodynamic prediction of peak pool-boiling heat fluxes from \
                    finite bodies, J. Heat Transfer 95 (1973) 152-158",
        doi: "10.1115/1.3450013",
        verification: "definition; the 0.30 m pan of a textbook example reproduced in the tests",
    };
    #[inline(always)]
    fn eval(x: &[f64; 5]) -> [f64; 1] {
        [dimensionless_size(x[0], x[1], x[2], x[3], x[4])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 5]) -> bool {
        size_possible(x)
    }
}

/// Kernel of [`lienhard_dhir`].
pub struct LienhardDhir;
impl Kernel<9, 1> for LienhardDhir {
    const MODEL: Model = Model {
        name: "lienhard_dhir_chf",
        summary: "Lienhard & Dhir (1973) peak heat flux of finite heaters: flat plates, cylinders, spheres",
        equation: "q_max = F(L') * pi/24 * h_lv*sqrt(rho_v)*(sigma*g*(rho_l-rho_v))**0.25, L' = L*sqrt(g*(rho_l-rho_v)/sigma)",
        inputs: &[
            arg("geometry", "-"),
            arg("size", "m"),
            arg("area", "m2"),
            arg("small_plate_coefficient", "-"),
            arg("fluid.h_lv", "J/kg"),
            arg("fluid.rho_l", "kg/m3"),
            arg("fluid.rho_v", "kg/m3"),
            arg("fluid.sigma", "N/m"),
            arg("g", "m/s2"),
        ],
        outputs: &[arg("critical_heat_flux", "W/m2")],
        domain: "geometry code 0-3, size > 0, area > 0, coefficient > 0, positive properties, rho_l > rho_v",
        validity: "large flat plate L' >= 27; small flat plate 9 <= L' <= 20; cylinder and sphere R' >= 0.15; \
                   rho_v/rho_l <= 0.21 (the library's own near-critical bound, p/p_crit 0.6-0.77 by fluid; water \
                   below 16.96 MPa)",
        reference: "J.H. Lienhard, V.K. Dhir, J. Heat Transfer 95 (1973) 152-158; \
                    K.H. Sun, J.H. Lienhard, Int. J. Heat Mass Transfer 13 (1970) 1425-1439",
        doi: "10.1115/1.3450013",
        verification: "cylinder form: secondary (transcribed textbook examples); 0.149: textbook worked example; \
                       small-plate and sphere forms and ranges from memory (high confidence); originals not read",
    };
    #[inline(always)]
    fn eval(x: &[f64; 9]) -> [f64; 1] {
        [lienhard_dhir(x[0], x[1], x[2], x[3], x[4], x[5], x[6], x[7], x[8])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 9]) -> bool {
        geometry_code(x[0]).is_some()
            && positive(x[1])
            && positive(x[2])
            && positive(x[3])
            && scale_possible(x[4], x[5], x[6], x[7], x[8])
    }
    #[inline(always)]
    fn in_range(x: &[f64; 9]) -> bool {
        let lp = dimensionless_size(x[1], x[5], x[6], x[7], x[8]);
        far_from_critical(x[5], x[6])
            && match geometry_code(x[0]) {
                Some(0) => lp >= 27.0,
                Some(1) => (9.0..=20.0).contains(&lp),
                _ => lp >= 0.15,
            }
    }
}

// ---------------------------------------------------------------------------
// Minimum heat flux

/// Berenson's constant of the minimum film-boiling heat flux (large horizontal plate) [-].
pub const BERENSON_MIN_K: f64 = 0.09;
/// Zuber's constant of the minimum heat flux, π/24 [-].
pub const ZUBER_MIN_K: f64 = PI / 24.0;

/// Minimum film-boiling heat flux (the Leidenfrost point of the boiling curve) [W/m2].
///
/// `q_min = C ρ_v h_lv [σ g (ρ_l − ρ_v) / (ρ_l + ρ_v)²]^(1/4)`
///
/// * `C = π/24` (Zuber 1959, from Taylor-instability collapse of the vapour
///   film) or `C = 0.09` (Berenson 1961, fitted to his large horizontal plate
///   data, about ±50 %; MODELS D8).
/// * `c` [-], `h_lv` [J/kg], `rho_l`, `rho_v` [kg/m3], `sigma` [N/m], `g` [m/s2].
/// * Possible: positive inputs, ρ_l > ρ_v; otherwise NaN. Constants outside
///   0.05-0.20 are flagged (the two in use are 0.09 and 0.131).
/// * Verification: the form and 0.09 are \[V2\] (a transcribed textbook
///   example; MODELS D8 records it from a textbook); originals not read.
///
/// References: N. Zuber, AECU-4439 (1959); P.J. Berenson, "Film-boiling heat
/// transfer from a horizontal surface", J. Heat Transfer 83 (1961) 351-358,
/// doi:10.1115/1.3682280 (DOI from memory).
#[inline(always)]
pub fn minimum_heat_flux(c: f64, h_lv: f64, rho_l: f64, rho_v: f64, sigma: f64, g: f64) -> f64 {
    let ok = positive(c) & scale_possible(h_lv, rho_l, rho_v, sigma, g);
    let s = rho_l + rho_v;
    nan_unless(ok, c * rho_v * h_lv * (sigma * g * (rho_l - rho_v) / (s * s)).sqrt().sqrt())
}

/// Kernel of [`minimum_heat_flux`].
pub struct MinimumHeatFlux;
impl Kernel<6, 1> for MinimumHeatFlux {
    const MODEL: Model = Model {
        name: "minimum_heat_flux",
        summary: "Minimum film-boiling heat flux (Zuber pi/24, Berenson 0.09) with the constant as a parameter",
        equation: "q_min = C * rho_v * h_lv * (sigma*g*(rho_l-rho_v)/(rho_l+rho_v)**2)**0.25",
        inputs: &[
            arg("C", "-"),
            arg("fluid.h_lv", "J/kg"),
            arg("fluid.rho_l", "kg/m3"),
            arg("fluid.rho_v", "kg/m3"),
            arg("fluid.sigma", "N/m"),
            arg("g", "m/s2"),
        ],
        outputs: &[arg("minimum_heat_flux", "W/m2")],
        domain: "C > 0, positive properties, rho_l > rho_v > 0, g > 0",
        validity: "large horizontal upward-facing heater; 0.05 <= C <= 0.20",
        reference: "N. Zuber, AEC Report AECU-4439 (1959); P.J. Berenson, Film-boiling heat transfer from a horizontal \
                    surface, J. Heat Transfer 83 (1961) 351-358",
        doi: "10.1115/1.3682280",
        verification: "form and C = 0.09: secondary source (transcribed textbook example); originals not read",
    };
    #[inline(always)]
    fn eval(x: &[f64; 6]) -> [f64; 1] {
        [minimum_heat_flux(x[0], x[1], x[2], x[3], x[4], x[5])]
    }
    #[inline(always)]
    fn possible(x: &[f64; 6]) -> bool {
        positive(x[0]) && scale_possible(x[1], x[2], x[3], x[4], x[5])
    }
    #[inline(always)]
    fn in_range(x: &[f64; 6]) -> bool {
        (0.05..=0.20).contains(&x[0])
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
    fn a_surface_tension_in_mn_per_m_is_flagged() {
        use crate::model::{classify, classify_side, evaluate, Status};
        // Water at 1 atm (Incropera Ex. 10.1 inputs, as above) with sigma typed
        // as 58.9 (mN/m): Zuber's group grows by 1000^(1/4) = 5.62 [identity]
        // and the element is flagged, through the bound shared by every kernel.
        let ok = [2257e3, 957.9, 0.5955, 58.9e-3, 0.149, 9.8];
        let slip = [2257e3, 957.9, 0.5955, 58.9, 0.149, 9.8];
        let (a, sa) = evaluate::<Zuber, 6, 1>(&ok);
        let (b, sb) = evaluate::<Zuber, 6, 1>(&slip);
        assert_eq!((sa, sb), (Status::Ok, Status::OutOfRange));
        assert_relative_eq!(b[0] / a[0], 1000f64.powf(0.25), max_relative = 1e-12);
        assert_eq!(classify::<Zuber, 6, 1>(&slip), 2);
        // The factored form flags the fluid side, not the angle side.
        let k = [10.0, 0.0, 2257e3, 957.9, 0.5955, 58.9, 9.80665];
        assert_eq!(evaluate::<Kandlikar, 7, 1>(&k).1, Status::OutOfRange);
        assert_eq!((classify_side::<Kandlikar, 7, 1>(0, &k), classify_side::<Kandlikar, 7, 1>(1, &k)), (0, 2));
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

    #[test]
    fn lienhard_dhir_forms() {
        let (h, rl, rv, s, g): (f64, f64, f64, f64, f64) = (2257e3, 957.9, 0.5955, 58.9e-3, 9.8);
        let scale = h * rv.sqrt() * (s * g * (rl - rv)).powf(0.25);
        let lc = (s / (g * (rl - rv))).sqrt();
        // Large flat plate: the 0.149 constant of zuber().
        assert_relative_eq!(lienhard_dhir(0.0, 0.3, 0.09, SMALL_PLATE_RATIO_FORM, h, rl, rv, s, g), zuber(h, rl, rv, s, 0.149, g), max_relative = 1e-14);
        // Small plate: 1.14 (lambda_d^2/A) pi/24 with lambda_d = 2 pi sqrt3 l_c.
        let a = (12.0 * lc) * (12.0 * lc);
        let lam = 2.0 * PI * 3f64.sqrt() * lc;
        assert_relative_eq!(
            lienhard_dhir(1.0, 12.0 * lc, a, SMALL_PLATE_RATIO_FORM, h, rl, rv, s, g),
            1.14 * lam * lam / a * ZUBER_K * scale,
            max_relative = 1e-12
        );
        assert_relative_eq!(SMALL_PLATE_RATIO_FORM, 17.67, max_relative = 1e-3);
        // Cylinder: Sun-Lienhard tends to 0.89 pi/24 for a large radius.
        let big = lienhard_dhir(2.0, 1.0, 1.0, 17.67, h, rl, rv, s, g) / scale;
        assert_relative_eq!(big, 0.89 * ZUBER_K, max_relative = 1e-6);
        // Sphere: continuous at R' = 4.26 (1.734/sqrt(4.26) = 0.840).
        let r = 4.26 * lc;
        let lo = lienhard_dhir(3.0, r * (1.0 - 1e-9), 1.0, 17.67, h, rl, rv, s, g);
        let hi = lienhard_dhir(3.0, r, 1.0, 17.67, h, rl, rv, s, g);
        assert_relative_eq!(lo, hi, max_relative = 2e-3);
        assert!(lienhard_dhir(4.0, 1.0, 1.0, 17.67, h, rl, rv, s, g).is_nan());
        assert!(lienhard_dhir(0.5, 1.0, 1.0, 17.67, h, rl, rv, s, g).is_nan());
        assert!(lienhard_dhir(2.0, -1.0, 1.0, 17.67, h, rl, rv, s, g).is_nan());
        use crate::model::{evaluate, Status};
        assert_eq!(evaluate::<LienhardDhir, 9, 1>(&[0.0, 0.01, 1.0, 17.67, h, rl, rv, s, g]).1, Status::OutOfRange);
        assert_eq!(evaluate::<LienhardDhir, 9, 1>(&[2.0, 0.1 * lc, 1.0, 17.67, h, rl, rv, s, g]).1, Status::OutOfRange);
        assert_eq!(evaluate::<LienhardDhir, 9, 1>(&[2.0, 1.0 * lc, 1.0, 17.67, h, rl, rv, s, g]).1, Status::Ok);
    }

    #[test]
    fn minimum_heat_flux_form() {
        let (h, rl, rv, s, g): (f64, f64, f64, f64, f64) = (2257e3, 957.9, 0.5955, 58.9e-3, 9.8);
        let q = minimum_heat_flux(0.09, h, rl, rv, s, g);
        assert_relative_eq!(q, 0.09 * rv * h * (s * g * (rl - rv) / ((rl + rv) * (rl + rv))).powf(0.25), max_relative = 1e-14);
        // [D] about 18.9 kW/m2 for water at 1 atm with these properties.
        assert!((18.8e3..19.1e3).contains(&q), "{q}");
        assert_relative_eq!(minimum_heat_flux(ZUBER_MIN_K, h, rl, rv, s, g) / q, ZUBER_MIN_K / 0.09, max_relative = 1e-14);
        assert!(minimum_heat_flux(0.0, h, rl, rv, s, g).is_nan());
        assert!(minimum_heat_flux(0.09, h, rv, rl, s, g).is_nan());
    }
}
