//! Sine and cosine of angles given in degrees.
//!
//! Contact angles and orientations arrive in degrees, and a sweep evaluates
//! their cosines 10^7 to 10^8 times, where the platform `cos` (a general
//! radian-argument routine with a slow path for huge arguments) dominates
//! the cost of a kernel. These functions reduce the argument *exactly in
//! degrees* (so `cos_deg(90.0) == 0.0` and `sin_deg(180.0) == 0.0` exactly,
//! which radians cannot give) and evaluate the fdlibm minimax kernels on
//! |t| <= pi/4. Accuracy: absolute error within 4 machine epsilons of the
//! platform `cos`/`sin` of the reduced argument over -720..720 deg (tests).
//!
//! Kernels: K.C. Ng et al., fdlibm 5.3 (Sun Microsystems, 1993), `k_sin.c`
//! and `k_cos.c` (coefficients of the minimax polynomials; public domain).

use crate::fastmath::round_nearest;

const S1: f64 = -1.666_666_666_666_663_243_48e-01;
const S2: f64 = 8.333_333_333_322_489_461_24e-03;
const S3: f64 = -1.984_126_982_985_794_931_34e-04;
const S4: f64 = 2.755_731_370_707_006_767_89e-06;
const S5: f64 = -2.505_076_025_340_686_341_95e-08;
const S6: f64 = 1.589_690_995_211_550_102_21e-10;

const C1: f64 = 4.166_666_666_666_660_190_37e-02;
const C2: f64 = -1.388_888_888_887_410_957_49e-03;
const C3: f64 = 2.480_158_728_947_672_941_78e-05;
const C4: f64 = -2.755_731_435_139_066_330_35e-07;
const C5: f64 = 2.087_572_321_298_174_827_90e-09;
const C6: f64 = -1.135_964_755_778_819_482_65e-11;

const DEG: f64 = std::f64::consts::PI / 180.0;

/// sin on |x| <= pi/4 (fdlibm __kernel_sin with y = 0).
#[inline(always)]
fn kernel_sin(x: f64) -> f64 {
    let z = x * x;
    let v = z * x;
    // Estrin's scheme (see `fastmath::exp`): a shorter dependency chain
    let z2 = z * z;
    let r = (S2 + z * S3) + z2 * ((S4 + z * S5) + z2 * S6);
    x + v * (S1 + z * r)
}

/// cos on |x| <= pi/4 (fdlibm __kernel_cos with y = 0).
#[inline(always)]
fn kernel_cos(x: f64) -> f64 {
    let z = x * x;
    let z2 = z * z;
    let r = z * ((C1 + z * C2) + z2 * ((C3 + z * C4) + z2 * (C5 + z * C6)));
    let hz = 0.5 * z;
    let w = 1.0 - hz;
    w + (((1.0 - w) - hz) + z * r)
}

/// Largest |angle| in degrees the reduction handles exactly; beyond it the
/// functions return NaN (no physical angle comes near 10^15 degrees).
pub const MAX_ANGLE_DEG: f64 = 1_125_899_906_842_624.0; // 2^50

/// Reduce `deg` to `(quadrant mod 4, remainder in radians, |remainder| <= pi/4)`.
///
/// One exact, branch-free step: with `q` the nearest integer to `deg/90`,
/// `90 q` is exact (|q| < 2^44 for |deg| <= [`MAX_ANGLE_DEG`], and 90 q then
/// needs at most 51 significant bits) and so is `deg - 90 q`: for q != 0 the
/// two terms lie within a factor two of each other (Sterbenz's lemma), and
/// for q = 0 the remainder is `deg` itself. A rounding of `deg * (1/90)` can
/// only move `q` by one where `deg/90` is within an ulp of a half-integer,
/// leaving |remainder| a hair above 45 deg, where the kernels are still
/// accurate. The quadrant is the low two bits of `q` (two's complement, so
/// negative `q` too).
#[inline(always)]
fn reduce(deg: f64) -> (i64, f64) {
    let (q, qi) = round_nearest(deg * (1.0 / 90.0));
    let rem = deg - 90.0 * q;
    (qi & 3, rem * DEG)
}

/// cos of an angle in degrees. NaN for NaN, infinite or |deg| > [`MAX_ANGLE_DEG`].
#[inline(always)]
pub fn cos_deg(deg: f64) -> f64 {
    let (q, t) = reduce(deg);
    // Branch-free quadrant selection: angles in a sweep fall in random
    // quadrants, and a mispredicted branch costs more than both polynomials.
    // q = 0: cos t, 1: -sin t, 2: -cos t, 3: sin t.
    // `+ 0.0`: an exact zero (cos 90, from -sin 0) is +0.0, not -0.0 (every other value unchanged)
    let v = select(q & 1 == 1, kernel_sin(t), kernel_cos(t), (q + 1) & 2 != 0) + 0.0;
    if deg.abs() <= MAX_ANGLE_DEG { v } else { f64::NAN }
}

/// `a` if `pick_a` else `b`, negated when `negate`, without branches.
#[inline(always)]
fn select(pick_a: bool, a: f64, b: f64, negate: bool) -> f64 {
    let mask = (pick_a as u64).wrapping_neg();
    let bits = (a.to_bits() & mask) | (b.to_bits() & !mask);
    f64::from_bits(bits ^ ((negate as u64) << 63))
}

/// sin of an angle in degrees. NaN for NaN, infinite or |deg| > [`MAX_ANGLE_DEG`].
#[inline(always)]
pub fn sin_deg(deg: f64) -> f64 {
    let (q, t) = reduce(deg);
    // q = 0: sin t, 1: cos t, 2: -sin t, 3: -cos t.
    let v = select(q & 1 == 0, kernel_sin(t), kernel_cos(t), q & 2 != 0) + 0.0; // +0.0 at exact zeros
    if deg.abs() <= MAX_ANGLE_DEG { v } else { f64::NAN }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn exact_at_multiples_of_ninety() {
        assert_eq!(cos_deg(0.0), 1.0);
        assert_eq!(cos_deg(90.0), 0.0);
        assert_eq!(cos_deg(180.0), -1.0);
        assert_eq!(cos_deg(270.0), 0.0);
        assert_eq!(cos_deg(-90.0), 0.0);
        assert_eq!(sin_deg(180.0), 0.0);
        assert_eq!(sin_deg(90.0), 1.0);
        assert_eq!(sin_deg(-90.0), -1.0);
        // exact zeros are +0.0 (a -0.0 made results at 90 and 180 deg print as "-0")
        for z in [-0.0, 0.0, 90.0, 180.0, 270.0, -90.0, -180.0, 360.0] {
            for v in [cos_deg(z), sin_deg(z)] {
                assert!(v != 0.0 || v.is_sign_positive(), "{z} deg");
            }
        }
        assert!((cos_deg(60.0) - 0.5).abs() <= f64::EPSILON);
        assert!((sin_deg(30.0) - 0.5).abs() <= f64::EPSILON);
    }

    #[test]
    fn agrees_with_the_platform_functions() {
        // Reference: std's cos/sin of the angle reduced to [-180, 180] and then
        // converted to radians; that conversion rounds (|t| <= pi, error up to
        // ~2 eps absolute), so allow 4 eps absolute.
        let mut worst: f64 = 0.0;
        let mut x = -720.0;
        while x <= 720.0 {
            let mut r = x % 360.0;
            if r > 180.0 {
                r -= 360.0;
            } else if r < -180.0 {
                r += 360.0;
            }
            let t = r * DEG;
            worst = worst.max((cos_deg(x) - t.cos()).abs()).max((sin_deg(x) - t.sin()).abs());
            x += 0.013_7;
        }
        assert!(worst <= 4.0 * f64::EPSILON, "worst error {} eps", worst / f64::EPSILON);
    }

    /// The reduction of earlier versions: first modulo 360, then modulo 90,
    /// each step exact. The one-step reduction must give the same remainder
    /// and quadrant, so the same bits.
    fn reduce_in_two_steps(deg: f64) -> (i64, f64) {
        let (k, _) = round_nearest(deg * (1.0 / 360.0));
        let d = deg - 360.0 * k;
        let (q, qi) = round_nearest(d * (1.0 / 90.0));
        (qi & 3, (d - 90.0 * q) * DEG)
    }

    #[test]
    fn one_step_reduction_equals_two_exact_steps() {
        // angles of every magnitude up to MAX_ANGLE_DEG, both signs, plus the
        // half-integer multiples of 90 deg where the rounding of deg/90 decides
        let mut state = 0x9e37_79b9_7f4a_7c15u64;
        let mut next = || {
            state ^= state << 13;
            state ^= state >> 7;
            state ^= state << 17;
            state
        };
        let mut checked = 0;
        for i in 0..400_000 {
            let u = (next() >> 11) as f64 / (1u64 << 53) as f64;
            let exp = (next() % 51) as i32; // magnitude 2^0 .. 2^50
            let sign = if next() & 1 == 1 { -1.0 } else { 1.0 };
            let deg = if i % 4 == 0 {
                // near 45 + 90 m
                let m = (next() % 1_000_000) as f64;
                let base = 45.0 + 90.0 * m;
                sign * f64::from_bits((base.to_bits() as i64 + (next() % 5) as i64 - 2) as u64)
            } else {
                sign * u * 2f64.powi(exp)
            };
            if deg.abs() > MAX_ANGLE_DEG {
                continue;
            }
            let (q1, t1) = reduce(deg);
            let (q2, t2) = reduce_in_two_steps(deg);
            // the same angle: the same quadrant and remainder, or the neighbouring
            // quadrant where deg/90 lies within the rounding of deg * (1/90) of a
            // half-integer (remainder +-45 deg either way, the excess growing
            // with |deg|: 0.25 deg at 2^50 deg)
            let same = q1 == q2 && t1.to_bits() == t2.to_bits();
            let slack = (deg.abs() * 2.0 * f64::EPSILON + 1e-13) * DEG;
            let boundary = ((q1 - q2).rem_euclid(4) == 1 || (q2 - q1).rem_euclid(4) == 1)
                && (t1.abs() - 45.0 * DEG).abs() <= slack
                && (t2.abs() - 45.0 * DEG).abs() <= slack;
            assert!(same || boundary, "{deg}: ({q1}, {t1}) vs ({q2}, {t2})");
            if !same {
                // at a quadrant boundary both paths describe the same point
                let (c1, c2) = (select(q1 & 1 == 1, kernel_sin(t1), kernel_cos(t1), (q1 + 1) & 2 != 0),
                                select(q2 & 1 == 1, kernel_sin(t2), kernel_cos(t2), (q2 + 1) & 2 != 0));
                assert!((c1 - c2).abs() <= 2.0 * f64::EPSILON, "{deg}: cos {c1} vs {c2}");
            }
            checked += 1;
        }
        assert!(checked > 300_000);
    }

    #[test]
    fn pythagoras_and_non_finite() {
        for i in 0..=1800 {
            let x = i as f64 * 0.1;
            let (c, s) = (cos_deg(x), sin_deg(x));
            assert!((c * c + s * s - 1.0).abs() < 4.0 * f64::EPSILON);
        }
        assert!(cos_deg(f64::NAN).is_nan());
        assert!(cos_deg(f64::INFINITY).is_nan());
        assert!(sin_deg(f64::NEG_INFINITY).is_nan());
        assert!(cos_deg(1e17).is_nan() && sin_deg(-1e16).is_nan());
        // Large angles reduce exactly (std's fmod is exact): 10^14 + 30 deg is 190 deg mod 360.
        for x in [1e14 + 30.0, -3.0e13 - 45.0, MAX_ANGLE_DEG - 0.25, 7.0e9 + 0.125] {
            let r = (x % 360.0) * DEG;
            assert!((cos_deg(x) - r.cos()).abs() < 4.0 * f64::EPSILON, "{x}");
            assert!((sin_deg(x) - r.sin()).abs() < 4.0 * f64::EPSILON, "{x}");
        }
    }
}
