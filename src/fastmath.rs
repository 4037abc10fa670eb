//! `exp`, `exp_m1`, `ln`, `ln_1p`, `pow`, `cbrt`, `acos` and `asin` as plain arithmetic without
//! branches, so that a kernel using them still vectorises in the binding's
//! block loops (a call to the platform's scalar `pow` or `acos` keeps the
//! whole loop scalar, and NumPy's SIMD versions then win on long arrays).
//!
//! Special cases are handled by selects at the end. `exp` and `ln` use fused
//! multiply-adds (`f64::mul_add`, one rounding by Rust's contract): single
//! instructions in the binding's AVX2/FMA and AVX-512 clones, calls to the
//! `fma` the target links in baseline x86-64 code (compiler-builtins' on
//! Linux: the instruction where the CPU has it, a correctly rounded software
//! version otherwise; `linked_fma_rounds_once` below checks it). Results are
//! deterministic: the same bits in every clone.
//! Accuracy against the platform functions (tests below): `exp`, `ln`,
//! `cbrt`, `acos` and `asin` within 1 ulp, `exp_m1` and `ln_1p` within 2 ulp; `pow(x, y) = exp(y ln x)` within about
//! `(1 + |y ln x|)` ulp, which for the exponents of boiling correlations
//! (|y ln x| < 40) is below 1e-14 relative.
//!
//! Algorithms and coefficients: K.C. Ng et al., fdlibm 5.3 (Sun
//! Microsystems, 1993; public domain), `e_exp.c` (Remez rational form of
//! exp on |r| <= ln2/2), `e_log.c` (Remez polynomial in s = f/(2+f)) and
//! `e_acos.c` and `e_asin.c` (rational approximation of asin on [0, 0.25]
//! with the half-angle reduction), here without their branches. `cbrt` is
//! our own (range reduction, a Chebyshev cubic and two series steps, no
//! division; see there).

// The coefficients are fdlibm's, digit for digit as published (some spell
// constants such as pi/2 split in two parts on purpose).
#![allow(clippy::approx_constant, clippy::excessive_precision)]

const LN2_HI: f64 = 6.931_471_803_691_238_164_90e-01; // low 21 bits zero: k * LN2_HI is exact
const LN2_LO: f64 = 1.908_214_929_270_587_700_02e-10;
const INV_LN2: f64 = 1.442_695_040_888_963_387_00;

const P1: f64 = 1.666_666_666_666_660_190_37e-01;
const P2: f64 = -2.777_777_777_701_559_338_42e-03;
const P3: f64 = 6.613_756_321_437_934_361_17e-05;
const P4: f64 = -1.653_390_220_546_525_153_90e-06;
const P5: f64 = 4.138_136_797_057_238_460_39e-08;

const LG1: f64 = 6.666_666_666_666_735_130e-01;
const LG2: f64 = 3.999_999_999_940_941_908e-01;
const LG3: f64 = 2.857_142_874_366_239_149e-01;
const LG4: f64 = 2.222_219_843_214_978_396e-01;
const LG5: f64 = 1.818_357_216_161_805_012e-01;
const LG6: f64 = 1.531_383_769_920_937_332e-01;
const LG7: f64 = 1.479_819_860_511_658_591e-01;

const PIO2_HI: f64 = 1.570_796_326_794_896_558_00;
const PIO2_LO: f64 = 6.123_233_995_736_766_035_87e-17;
const PS0: f64 = 1.666_666_666_666_666_574_15e-01;
const PS1: f64 = -3.255_658_186_224_009_154_05e-01;
const PS2: f64 = 2.012_125_321_348_629_258_81e-01;
const PS3: f64 = -4.005_553_450_067_941_140_27e-02;
const PS4: f64 = 7.915_349_942_898_145_321_76e-04;
const PS5: f64 = 3.479_331_075_960_211_675_70e-05;
const QS1: f64 = -2.403_394_911_734_414_218_78;
const QS2: f64 = 2.020_945_760_233_505_694_71;
const QS3: f64 = -6.882_839_716_054_532_930_30e-01;
const QS4: f64 = 7.703_815_055_590_193_527_91e-02;

/// `a b + c` with one rounding (IEEE 754 fusedMultiplyAdd): one instruction
/// in the AVX2/FMA and AVX-512 clones, a call to the linked `fma` in baseline
/// x86-64 code (see the module notes). Correctly rounded either way, so every
/// clone gives the same bits; only the speed differs.
#[inline(always)]
fn fma(a: f64, b: f64, c: f64) -> f64 {
    a.mul_add(b, c)
}

/// `2^k` for integer `k` in [-1022, 1023], from its bits.
#[inline(always)]
fn two_to(k: i64) -> f64 {
    f64::from_bits((k.wrapping_add(1023) as u64) << 52)
}

/// Round-to-nearest of `x` for |x| < 2^51, as `(the integer as f64, as i64)`.
///
/// Adding and subtracting 1.5 * 2^52 rounds in the FPU's round-to-nearest
/// mode and leaves the integer in the low mantissa bits. Unlike `as i64`
/// (a saturating conversion) or `f64::round` (a libm call on baseline
/// x86-64) this is plain arithmetic, so loops over arrays vectorise.
#[inline(always)]
pub fn round_nearest(x: f64) -> (f64, i64) {
    const MAGIC: f64 = 6_755_399_441_055_744.0; // 1.5 * 2^52
    let m = x + MAGIC;
    // wrapping: outside |x| < 2^51 (and for NaN, inf) the integer is garbage
    // that callers mask or select away, and must not trip overflow checks
    (m - MAGIC, (m.to_bits() as i64).wrapping_sub(MAGIC.to_bits() as i64))
}

/// e^x.
#[inline(always)]
pub fn exp(x: f64) -> f64 {
    // Beyond these the result is 0 or inf anyway; the clamp keeps k in range.
    let xc = x.clamp(-746.0, 710.0);
    let (kf, k) = round_nearest(xc * INV_LN2);
    let r = fma(-kf, LN2_LO, fma(-kf, LN2_HI, xc));
    let t = r * r;
    // Estrin's scheme: the same polynomial as fdlibm's Horner form with a
    // shorter dependency chain (latency is what limits both a scalar call
    // and the vectorised block loops).
    let t2 = t * t;
    let c = fma(-t, fma(t2, fma(t, P4, P3) + t2 * P5, fma(t, P2, P1)), r);
    let y = 1.0 - ((r * c) / (c - 2.0) - r);
    // 2^k in two exact steps, so that k down to -1076 (subnormal and zero
    // results) and up to 1025 (overflow to inf) need no branch.
    let k1 = k >> 1;
    let v = y * two_to(k1) * two_to(k - k1);
    if x.is_nan() {
        x
    } else {
        v
    }
}

/// Natural logarithm; NaN for x < 0 or NaN, -inf at 0, inf at inf.
#[inline(always)]
pub fn ln(x: f64) -> f64 {
    // bits of sqrt(2)/2: subtracting them moves the exponent boundary there
    const HALF_SQRT2: u64 = 0x3fe6_a09e_667f_3bcd;
    const MAGIC: f64 = 6_755_399_441_055_744.0; // 1.5 * 2^52, see `round_nearest`
    // subnormals: scale into the normal range first
    let sub = x < f64::MIN_POSITIVE;
    let bits = (x * if sub { 18_014_398_509_481_984.0 } else { 1.0 }).to_bits(); // 2^54
    // x = m 2^k with m in [sqrt(2)/2, sqrt(2)): k from the bits of x / (sqrt(2)/2),
    // m by taking k off the exponent field (integer work only; garbage for
    // x <= 0, inf and NaN, which the select at the end replaces)
    let k = (bits.wrapping_sub(HALF_SQRT2) as i64) >> 52;
    let m = f64::from_bits(bits.wrapping_sub((k as u64) << 52));
    // k as f64 without an i64 -> f64 conversion (none in AVX2): exact for |k| < 2^51
    let dk = (f64::from_bits(MAGIC.to_bits().wrapping_add(k as u64)) - MAGIC) - if sub { 54.0 } else { 0.0 };
    let f = m - 1.0;
    let s = f / (2.0 + f);
    let z = s * s;
    let w = z * z;
    // fdlibm's R(z) = LG1 z + ... + LG7 z^7, in Estrin's scheme with fused
    // multiply-adds (a shorter dependency chain than fdlibm's two Horner
    // halves; the result can differ from fdlibm's in the last bit, still
    // within 1 ulp of the platform's ln: tests)
    let r = z * fma(w * w, fma(w, LG7, fma(z, LG6, LG5)), fma(w, fma(z, LG4, LG3), fma(z, LG2, LG1)));
    let hfsq = 0.5 * f * f;
    let v = fma(dk, LN2_HI, -((hfsq - fma(s, hfsq + r, dk * LN2_LO)) - f));
    if x > 0.0 {
        if x == f64::INFINITY {
            x
        } else {
            v
        }
    } else if x == 0.0 {
        f64::NEG_INFINITY
    } else {
        f64::NAN
    }
}

/// x^y for x >= 0, as `exp(y ln x)`: NaN for x < 0 (the kernels only raise
/// positive quantities to real powers); exactly 1 for y = 0 or x = 1, and
/// exactly x for y = 1 (an exponent of 1 is a common parameter value).
#[inline(always)]
pub fn pow(x: f64, y: f64) -> f64 {
    let v = exp(y * ln(x));
    if y == 0.0 || x == 1.0 {
        1.0
    } else if y == 1.0 {
        x
    } else {
        v
    }
}

/// Cube root, for any sign, without a division (five divisions in the
/// `exp(ln|x|/3)` form this replaces made it the slowest function here).
///
/// With `|x| = m 2^e`, `m` in [1, 2) and `e = 3q + r` (`r` = 0, 1 or 2), the
/// root is `s^(1/3) 2^q` for `s = m 2^r` in [1, 8):
/// 1. `u ≈ s^(-1/3)`: a cubic in `m` (the Chebyshev interpolant of
///    `m^(-1/3)` on [1, 2], relative error 3.0e-4: `numpy.polynomial.
///    chebyshev.chebinterpolate(lambda t: (1.5 + 0.5 t)**(-1/3), 3)`, in
///    powers of `t = 2m - 3`) times `2^(-r/3)`;
/// 2. one fourth-order step `u <- u (1 - d)^(-1/3)` with `d = 1 - s u^3`, the
///    binomial series to `d^3` (error 0.14 d^4: below 1e-13);
/// 3. `c = s u^2`, cut to 17 significant bits so that `c^3` (51 bits) and
///    `s - c^3` are exact; the root is then `c (1 - ρ)^(-1/3)` with
///    `ρ = (s - c^3)/s` (below 3·2^-16, formed as `(s - c^3) u^3`, u^3 standing
///    in for 1/s to about 3e-13), the series to `ρ^3` leaving 0.14 ρ^4 (below
///    1e-18 relative). Against an exact reference the worst error found is
///    0.52 ulp (about 0.35 % of arguments are not correctly rounded).
#[inline(always)]
pub fn cbrt(x: f64) -> f64 {
    const U0: f64 = 0.873_368_210_134_791_8;
    const U1: f64 = -0.097_002_937_604_210_22;
    const U2: f64 = 0.023_249_632_032_596_113;
    const U3: f64 = -0.006_079_131_667_855_009;
    const CBRT_HALF: f64 = 0.793_700_525_984_099_8; // 2^(-1/3)
    const CBRT_QUARTER: f64 = 0.629_960_524_947_436_6; // 2^(-2/3)
    let a = x.abs();
    // subnormals: scale into the normal range first (2^54, a multiple of 3 in the exponent)
    let sub = a < f64::MIN_POSITIVE;
    let bits = (a * if sub { 18_014_398_509_481_984.0 } else { 1.0 }).to_bits();
    let e = ((bits >> 52) & 0x7ff) as i64 - 1023 - if sub { 54 } else { 0 };
    // q = floor(e/3): e/3 - 1/3 lies within 1/3 of q, so rounding it is exact
    let (_, q) = round_nearest(e as f64 * (1.0 / 3.0) - 1.0 / 3.0);
    let r = e - (q + q + q); // 0, 1 or 2 (no 64-bit multiply: slow in vector units)
    let mant = bits & 0x000f_ffff_ffff_ffff;
    let m = f64::from_bits(mant | 0x3ff0_0000_0000_0000); // [1, 2)
    let s = f64::from_bits(mant | (((1023 + r) as u64) << 52)); // m 2^r, [1, 8)
    let t = 2.0 * m - 3.0;
    let u = (U0 + t * U1) + (t * t) * (U2 + t * U3);
    let u = u * if r == 0 { 1.0 } else if r == 1 { CBRT_HALF } else { CBRT_QUARTER };
    let d = 1.0 - s * (u * u * u);
    let u = u + u * d * ((1.0 / 3.0) + d * ((2.0 / 9.0) + d * (14.0 / 81.0)));
    let c = f64::from_bits((s * (u * u)).to_bits() & 0xffff_fff0_0000_0000);
    let rho = (s - c * c * c) * (u * u * u);
    let c = c + c * (rho * ((1.0 / 3.0) + rho * ((2.0 / 9.0) + rho * (14.0 / 81.0))));
    // 2^q is a normal number (|q| <= 358) and the root's scaling by it exact
    let v = c * two_to(q);
    let v = if a > 0.0 && a < f64::INFINITY { v } else { a };
    v.copysign(x)
}

/// The rational part of fdlibm's asin/acos: `r(z)` with
/// `asin(x) = x + x r(x^2)` for |x| <= 0.5.
#[inline(always)]
fn asin_rational(z: f64) -> f64 {
    // Estrin's scheme for both polynomials (see `exp`)
    let z2 = z * z;
    let z4 = z2 * z2;
    let p = z * ((PS0 + z * PS1) + z2 * (PS2 + z * PS3) + z4 * (PS4 + z * PS5));
    let q = (1.0 + z * QS1) + z2 * (QS2 + z * QS3) + z4 * QS4;
    p / q
}

/// `(s, df, c)` for |x| >= 0.5: `s = sqrt(z)` with `z = (1 - |x|)/2`, `df` its
/// high 26 bits and `c` the correction with `df + c = sqrt(z)` to double
/// precision. z below 0 (|x| > 1, the caller's NaN) is taken as 0 and at
/// z = 0 the correction is 0, without an invalid operation (a floating-point
/// flag NumPy would report as a warning).
#[inline(always)]
fn half_angle_sqrt(z: f64) -> (f64, f64, f64) {
    let z = z.max(0.0);
    let s = z.sqrt();
    let df = f64::from_bits(s.to_bits() & 0xffff_ffff_0000_0000);
    // s + df >= s >= 1e-154 wherever z > 0: the floor only acts at z = 0
    let c = (z - df * df) / (s + df).max(f64::MIN_POSITIVE);
    (s, df, c)
}

/// Arc cosine \[rad\]; NaN outside [-1, 1].
#[inline(always)]
pub fn acos(x: f64) -> f64 {
    let a = x.abs();
    let small = a < 0.5;
    // one rational evaluation: of z = x^2 (|x| < 0.5) or of z = (1 - |x|)/2
    let z = if small { x * x } else { (1.0 - a) * 0.5 };
    let r = asin_rational(z);
    // |x| < 0.5: pi/2 - asin(x)
    let v_small = PIO2_HI - (x - (PIO2_LO - x * r));
    // |x| >= 0.5: acos(|x|) = 2 asin(sqrt(z)), with sqrt(z) split for accuracy
    let (s, df, c) = half_angle_sqrt(z);
    let v_pos = 2.0 * (df + (r * s + c));
    let v_neg = std::f64::consts::PI - 2.0 * (s + (r * s - PIO2_LO));
    let v = if small {
        v_small
    } else if x > 0.0 {
        v_pos
    } else {
        v_neg
    };
    if a <= 1.0 {
        v
    } else {
        f64::NAN
    }
}

/// Arc sine \[rad\]; NaN outside [-1, 1]. fdlibm's `e_asin.c` with its
/// |x| >= 0.975 shortcut dropped (the split form below is as accurate there).
#[inline(always)]
pub fn asin(x: f64) -> f64 {
    const PIO4_HI: f64 = 7.853_981_633_974_482_789_99e-01;
    let a = x.abs();
    let small = a < 0.5;
    let z = if small { x * x } else { (1.0 - a) * 0.5 };
    let r = asin_rational(z);
    let v_small = x + x * r;
    // |x| >= 0.5: asin(|x|) = pi/2 - 2 asin(sqrt(z)), in two halves of pi/4
    let (s, df, c) = half_angle_sqrt(z);
    let v_big = (PIO4_HI - ((2.0 * s * r - (PIO2_LO - 2.0 * c)) - (PIO4_HI - 2.0 * df))).copysign(x);
    let v = if small { v_small } else { v_big };
    if a <= 1.0 {
        v
    } else {
        f64::NAN
    }
}

/// `ln(1 + x)`, accurate also where x is small: `ln(u) x / (u - 1)` with
/// `u = 1 + x` rounded (D. Goldberg, "What every computer scientist should
/// know about floating-point arithmetic", ACM Comput. Surv. 23 (1991) 5-48,
/// theorem 4: the quotient cancels the rounding of u), and x itself where u
/// rounds to 1. NaN below -1, -inf at -1. Within 2 ulp.
#[inline(always)]
pub fn ln_1p(x: f64) -> f64 {
    let u = 1.0 + x;
    let v = ln(u) * (x / (u - 1.0));
    if u == 1.0 {
        x
    } else if u == f64::INFINITY || u == 0.0 {
        ln(u) // inf, or -inf at x = -1
    } else {
        v
    }
}

/// `e^x - 1`, accurate also where it is small: the Taylor series to x^16 on
/// |x| < 1/2 (truncation below 2e-18 relative), `exp(x) - 1` beyond (an exact
/// subtraction there by Sterbenz's lemma down to x = -ln 2, then within
/// 1 ulp of the result since |e^x - 1| >= 0.39). Within 2 ulp overall.
#[inline(always)]
pub fn exp_m1(x: f64) -> f64 {
    const C: [f64; 15] = [
        1.0 / 2.0,
        1.0 / 6.0,
        1.0 / 24.0,
        1.0 / 120.0,
        1.0 / 720.0,
        1.0 / 5_040.0,
        1.0 / 40_320.0,
        1.0 / 362_880.0,
        1.0 / 3_628_800.0,
        1.0 / 39_916_800.0,
        1.0 / 479_001_600.0,
        1.0 / 6_227_020_800.0,
        1.0 / 87_178_291_200.0,
        1.0 / 1_307_674_368_000.0,
        1.0 / 20_922_789_888_000.0,
    ];
    let x2 = x * x;
    let x4 = x2 * x2;
    let x8 = x4 * x4;
    // Estrin's scheme for the coefficients of x^2 .. x^16
    let lo = (C[0] + x * C[1]) + x2 * (C[2] + x * C[3]) + x4 * ((C[4] + x * C[5]) + x2 * (C[6] + x * C[7]));
    let hi = (C[8] + x * C[9]) + x2 * (C[10] + x * C[11]) + x4 * ((C[12] + x * C[13]) + x2 * C[14]);
    // (-0.0 + 0.0 would give +0.0: keep the sign of a zero argument)
    let series = if x == 0.0 { x } else { x + x2 * (lo + x8 * hi) };
    let direct = exp(x) - 1.0;
    if x.abs() < 0.5 {
        series
    } else {
        direct
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Distance in units in the last place (same sign, finite).
    fn ulps(a: f64, b: f64) -> u64 {
        if a == b {
            return 0;
        }
        (a.to_bits() as i64 - b.to_bits() as i64).unsigned_abs()
    }

    /// splitmix64 for reproducible samples
    fn samples(n: usize, seed: u64) -> impl Iterator<Item = f64> {
        let mut s = seed;
        (0..n).map(move |_| {
            s = s.wrapping_add(0x9E37_79B9_7F4A_7C15);
            let mut z = s;
            z = (z ^ (z >> 30)).wrapping_mul(0xBF58_476D_1CE4_E5B9);
            z = (z ^ (z >> 27)).wrapping_mul(0x94D0_49BB_1331_11EB);
            ((z ^ (z >> 31)) >> 11) as f64 / (1u64 << 53) as f64
        })
    }

    /// The `fma` that baseline code links rounds once (a target whose `fma`
    /// rounded twice would give other bits there than the SIMD clones; some
    /// C runtimes' software versions do). Cases where the plain `a*b + c`
    /// differs, through `black_box` so that no constant folding answers.
    #[test]
    fn linked_fma_rounds_once() {
        use std::hint::black_box as bb;
        let e = f64::EPSILON; // 2^-52
        // (1 + 2^-52)(1 - 2^-52) - 1 = -2^-104 exactly; the plain form gives 0
        assert_eq!(fma(bb(1.0 + e), bb(1.0 - e), bb(-1.0)), -(e * e / 1.0));
        // (2^27 + 1)(2^27 - 1) - 2^54 = -1; the plain form rounds 2^54 - 1 to 2^54 and gives 0
        let t = 134_217_728.0; // 2^27
        assert_eq!(fma(bb(t + 1.0), bb(t - 1.0), bb(-t * t)), -1.0);
        // a product below the smallest normal with an addend that keeps it exact
        assert_eq!(fma(bb(f64::MIN_POSITIVE), bb(0.5), bb(0.0)), f64::MIN_POSITIVE / 2.0);
    }

    // Reference: Rust's std (the platform libm, correctly rounded or within
    // 1 ulp), on 10^6 random arguments per function plus the special values.

    #[test]
    fn exp_within_one_ulp() {
        let mut worst = 0;
        for u in samples(1_000_000, 1) {
            let x = -745.0 + 1454.0 * u;
            let (a, b) = (exp(x), x.exp());
            if b.is_finite() && b >= f64::MIN_POSITIVE {
                worst = worst.max(ulps(a, b));
            } else {
                assert!((a - b).abs() <= 5e-324 * 2.0 || a == b, "exp({x}) = {a}, std {b}");
            }
        }
        for u in samples(200_000, 2) {
            let x = -2.0 + 4.0 * u;
            worst = worst.max(ulps(exp(x), x.exp()));
        }
        assert!(worst <= 1, "exp worst {worst} ulp");
        assert_eq!(exp(0.0), 1.0);
        assert_eq!(exp(f64::NEG_INFINITY), 0.0);
        assert_eq!(exp(f64::INFINITY), f64::INFINITY);
        assert_eq!(exp(709.9), f64::INFINITY);
        assert_eq!(exp(-800.0), 0.0);
        assert!(exp(f64::NAN).is_nan());
    }

    #[test]
    fn ln_within_one_ulp() {
        let mut worst = 0;
        for u in samples(1_000_000, 3) {
            // log-uniform over the whole positive range, subnormals included
            let x = (2.0f64).powf(-1074.0 + 2097.0 * u);
            if x > 0.0 && x.is_finite() {
                worst = worst.max(ulps(ln(x), x.ln()));
            }
        }
        for u in samples(200_000, 4) {
            let x = 0.5 + 1.5 * u; // around 1, where ln is small
            worst = worst.max(ulps(ln(x), x.ln()));
        }
        assert!(worst <= 1, "ln worst {worst} ulp");
        assert_eq!(ln(1.0), 0.0);
        assert_eq!(ln(0.0), f64::NEG_INFINITY);
        assert_eq!(ln(-0.0), f64::NEG_INFINITY);
        assert_eq!(ln(f64::INFINITY), f64::INFINITY);
        assert!(ln(-1.0).is_nan() && ln(f64::NAN).is_nan() && ln(f64::NEG_INFINITY).is_nan());
        assert_eq!(ln(5e-324), (5e-324f64).ln());
    }

    #[test]
    fn pow_within_bound() {
        // relative error bound (1 + |y ln x|) ulp, on the argument ranges of
        // boiling correlations (bases 1e-9..1e9, exponents -5..5)
        let mut worst: f64 = 0.0;
        let mut us = samples(2_000_000, 5);
        for _ in 0..1_000_000 {
            let x = 10f64.powf(-9.0 + 18.0 * us.next().unwrap());
            let y = -5.0 + 10.0 * us.next().unwrap();
            let (a, b) = (pow(x, y), x.powf(y));
            let rel = ((a - b) / b).abs() / f64::EPSILON / (1.0 + (y * x.ln()).abs());
            worst = worst.max(rel);
        }
        assert!(worst <= 1.0, "pow worst {worst} x (1 + |y ln x|) eps");
        assert_eq!(pow(2.0, 0.0), 1.0);
        assert_eq!(pow(1.0, 1e300), 1.0);
        assert_eq!(pow(0.0, 2.0), 0.0);
        assert_eq!(pow(0.0, -2.0), f64::INFINITY);
        assert_eq!(pow(f64::INFINITY, 0.5), f64::INFINITY);
        assert!(pow(-2.0, 0.5).is_nan());
        assert_eq!(pow(0.3, 1.0), 0.3);
        assert!((pow(10.0, 2.0) / 100.0 - 1.0).abs() <= 4.0 * f64::EPSILON);
    }

    #[test]
    fn cbrt_within_one_ulp() {
        let mut worst = 0;
        for u in samples(1_000_000, 8) {
            let x = (2.0f64).powf(-1074.0 + 2097.0 * u);
            if x > 0.0 && x.is_finite() {
                worst = worst.max(ulps(cbrt(x), x.cbrt())).max(ulps(cbrt(-x), (-x).cbrt()));
            }
        }
        assert!(worst <= 1, "cbrt worst {worst} ulp");
        // every exact cube of an integer below 2^53 gives its root exactly
        for i in 1..208_064i64 {
            assert_eq!(cbrt((i * i * i) as f64), i as f64, "cbrt({}^3)", i);
        }
        // the ends of the range, subnormals included (std as reference)
        for x in [f64::MIN_POSITIVE, 5e-324, 1e-310, f64::MAX, 1.0 - f64::EPSILON / 2.0, 2.0, 4.0] {
            assert!(ulps(cbrt(x), x.cbrt()) <= 1, "cbrt({x:e}) = {:e}, std {:e}", cbrt(x), x.cbrt());
        }
        assert_eq!(cbrt(27.0), 3.0);
        assert_eq!(cbrt(-8.0), -2.0);
        assert_eq!(cbrt(0.0).to_bits(), 0.0f64.to_bits());
        assert_eq!(cbrt(-0.0).to_bits(), (-0.0f64).to_bits());
        assert_eq!(cbrt(f64::INFINITY), f64::INFINITY);
        assert!(cbrt(f64::NAN).is_nan());
    }

    #[test]
    fn acos_within_one_ulp() {
        let mut worst = 0;
        for u in samples(1_000_000, 6) {
            let x = -1.0 + 2.0 * u;
            worst = worst.max(ulps(acos(x), x.acos()));
        }
        for u in samples(100_000, 7) {
            let x = 1.0 - 1e-6 * u; // near the ends
            worst = worst.max(ulps(acos(x), x.acos())).max(ulps(acos(-x), (-x).acos()));
        }
        assert!(worst <= 1, "acos worst {worst} ulp");
        assert_eq!(acos(1.0), 0.0);
        assert_eq!(acos(-1.0), std::f64::consts::PI);
        assert_eq!(acos(0.0), std::f64::consts::FRAC_PI_2);
        assert!(acos(1.0 + f64::EPSILON).is_nan() && acos(f64::NAN).is_nan());
    }

    #[test]
    fn asin_within_one_ulp() {
        let mut worst = 0;
        for u in samples(1_000_000, 9) {
            let x = -1.0 + 2.0 * u;
            worst = worst.max(ulps(asin(x), x.asin()));
        }
        for u in samples(100_000, 10) {
            let x = 1.0 - 1e-6 * u; // near the ends
            worst = worst.max(ulps(asin(x), x.asin())).max(ulps(asin(-x), (-x).asin()));
            let t = 1e-300 * (1.0 + u); // tiny: asin(x) = x
            assert_eq!(asin(t), t);
        }
        assert!(worst <= 1, "asin worst {worst} ulp");
        assert_eq!(asin(1.0), std::f64::consts::FRAC_PI_2);
        assert_eq!(asin(-1.0), -std::f64::consts::FRAC_PI_2);
        assert_eq!(asin(0.0).to_bits(), 0.0f64.to_bits());
        assert_eq!(asin(-0.0).to_bits(), (-0.0f64).to_bits());
        assert!(asin(1.0 + f64::EPSILON).is_nan() && asin(f64::NAN).is_nan());
    }

    #[test]
    fn exp_m1_within_two_ulp() {
        let mut worst = 0;
        for u in samples(1_000_000, 11) {
            let x = -40.0 + 750.0 * u;
            let b = x.exp_m1();
            if b.is_finite() {
                worst = worst.max(ulps(exp_m1(x), b));
            }
        }
        for u in samples(1_000_000, 12) {
            // log-uniform magnitudes 1e-300..2, both signs: the series and the switch at 1/2
            let x = 10f64.powf(-300.0 + 300.3 * u) * if u > 0.5 { 1.0 } else { -1.0 };
            worst = worst.max(ulps(exp_m1(x), x.exp_m1()));
        }
        assert!(worst <= 2, "exp_m1 worst {worst} ulp");
        assert_eq!(exp_m1(0.0).to_bits(), 0.0f64.to_bits());
        assert_eq!(exp_m1(-0.0).to_bits(), (-0.0f64).to_bits());
        assert_eq!(exp_m1(-800.0), -1.0);
        assert_eq!(exp_m1(f64::NEG_INFINITY), -1.0);
        assert_eq!(exp_m1(710.0), f64::INFINITY);
        assert!(exp_m1(f64::NAN).is_nan());
    }

    #[test]
    fn ln_1p_within_two_ulp() {
        let mut worst = 0;
        for u in samples(1_000_000, 13) {
            // log-uniform magnitudes 1e-300..1e300 above zero, and (-1, 0)
            let x = 10f64.powf(-300.0 + 600.0 * u);
            worst = worst.max(ulps(ln_1p(x), x.ln_1p()));
            let y = -(10f64.powf(-300.0 + 300.0 * u)).min(1.0 - f64::EPSILON);
            worst = worst.max(ulps(ln_1p(y), y.ln_1p()));
        }
        assert!(worst <= 2, "ln_1p worst {worst} ulp");
        assert_eq!(ln_1p(0.0).to_bits(), 0.0f64.to_bits());
        assert_eq!(ln_1p(-0.0).to_bits(), (-0.0f64).to_bits());
        assert_eq!(ln_1p(-1.0), f64::NEG_INFINITY);
        assert_eq!(ln_1p(f64::INFINITY), f64::INFINITY);
        assert_eq!(ln_1p(f64::MAX), f64::MAX.ln());
        assert!(ln_1p(-1.5).is_nan() && ln_1p(f64::NAN).is_nan());
    }
}
