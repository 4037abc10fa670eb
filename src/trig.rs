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
/// Both steps are exact and branch-free: `deg - 360 k` with `k` the nearest
/// integer to `deg/360` is exact by Sterbenz's lemma (360 k lies within a
/// factor two of `deg` whenever k != 0, and 360 k is exact for k < 2^47), and
/// `d - 90 q` is exact because both terms are multiples of the same power of
/// two and the result is no larger than |d|.
#[inline(always)]
fn reduce(deg: f64) -> (i64, f64) {
    let (k, _) = round_nearest(deg * (1.0 / 360.0));
    let d = deg - 360.0 * k;
    let (q, qi) = round_nearest(d * (1.0 / 90.0));
    let rem = d - 90.0 * q;
    (qi & 3, rem * DEG)
}

/// cos of an angle in degrees. NaN for NaN, infinite or |deg| > [`MAX_ANGLE_DEG`].
#[inline(always)]
pub fn cos_deg(deg: f64) -> f64 {
    let (q, t) = reduce(deg);
    // Branch-free quadrant selection: angles in a sweep fall in random
    // quadrants, and a mispredicted branch costs more than both polynomials.
    // q = 0: cos t, 1: -sin t, 2: -cos t, 3: sin t.
    let v = select(q & 1 == 1, kernel_sin(t), kernel_cos(t), (q + 1) & 2 != 0);
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
    let v = select(q & 1 == 0, kernel_sin(t), kernel_cos(t), q & 2 != 0);
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
