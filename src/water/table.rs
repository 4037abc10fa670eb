//! Piecewise Chebyshev interpolants of the saturated-state fields, built once per process from the direct
//! evaluation of the releases ([`super::direct_state`]) and then used by [`super::saturation_t`].
//!
//! # Why
//! A saturated state from the releases costs one IAPWS-95 pass per phase plus the transport releases
//! (about 0.6 us of one core). Along the saturation line every field is a function of T alone, smooth
//! between a few known points, so it can be represented by polynomial pieces to within a few units in
//! the 13th digit of the direct evaluation, and evaluated in a few tens of nanoseconds. IAPWS endorses the
//! approach for property calculations in simulations: IAPWS G13-15, *Guideline on the Fast Calculation of
//! Steam and Water Properties with the Spline-Based Table Look-Up Method (SBTL)* (2015). Here the pieces
//! are Chebyshev interpolants rather than splines: the saturation line is one-dimensional, and they
//! converge spectrally.
//!
//! # How
//! * The variable is tau = (T_c - T)/T_c on [TAU_MIN, tau_triple], cut into pieces at breakpoints:
//!   pieces of at most [`MAX_WIDTH_K`] kelvin away from the critical point, growing geometrically by the
//!   factor [`RATIO`] from TAU_MIN towards it, so that they narrow where the critical power laws
//!   (rho' - rho'' ~ tau^0.33, cp ~ tau^-1) bend the fields.
//! * Extra breakpoints where the transport releases change form (`super::enhancement_switches`): where
//!   each phase's critical enhancements switch on (DeltaChi = 0; the R15-11 conductivity enhancement
//!   starts with a square-root kink of ~1e-5 relative, so the pieces are graded geometrically towards
//!   that point, down to [`GRADE_MIN_K`]) and where R12-08 switches its function Y from series to
//!   closed form (a step of ~1e-10 relative in mu). Interpolating across such points would smear them
//!   over a whole piece.
//! * On each piece, the interpolant of degree [`DEG`] at the DEG + 1 Chebyshev extreme points (both ends
//!   included, so neighbouring pieces agree at their common end), stored as Chebyshev coefficients and
//!   evaluated by Clenshaw's recurrence, which is stable (no conversion to monomials).
//! * The piece of a tau is found from its bits: 32 bins per octave of tau, each naming its first piece,
//!   then at most a few steps forward. No logarithm, no search.
//! * Not tabulated: T itself, p (the double-double SR1-86 p_sat, so that the T <-> p round trip stays
//!   exact) and sigma (R1-76 is a closed form). Below TAU_MIN, the last 0.65 mK below the critical point,
//!   `saturation_t` evaluates the releases directly.
//!
//! The table takes about 3 ms to build, once per process, on first use (`OnceLock`), and about 250 kB.
//! How closely it reproduces the direct evaluation is measured in the tests below and stated in
//! [`super::saturation_t`].

use super::{direct_state, enhancement_switches, psat_dd, T_CRIT, T_TRIPLE};
use std::sync::OnceLock;

/// Number of tabulated fields.
pub(super) const FIELDS: usize = 9;
/// Slots of the tabulated fields in the 12-field saturated state (rho_l, rho_v, h_lv, cp_l, k_l, mu_l,
/// mu_v, cp_v, k_v; see `SAT_FIELDS`).
pub(super) const SLOTS: [usize; FIELDS] = [2, 3, 4, 6, 7, 8, 9, 10, 11];
/// Smallest tau = (T_c - T)/T_c the table covers (T_c - T = 0.65 mK).
pub(super) const TAU_MIN: f64 = 1e-6;
/// Degree of each piece.
const DEG: usize = 12;
/// Widest piece \[K\].
const MAX_WIDTH_K: f64 = 8.0;
/// Growth of the pieces' width in tau from TAU_MIN upwards (until they reach MAX_WIDTH_K).
const RATIO: f64 = 1.1;
/// Narrowest piece of the grading towards an enhancement switch-on point \[K\].
const GRADE_MIN_K: f64 = 1e-7;
/// Bins per octave of tau in the piece index: the top 5 mantissa bits.
const BIN_SHIFT: u32 = 52 - 5;

struct Table {
    /// `bits(tau) >> BIN_SHIFT` of TAU_MIN: bin 0.
    key0: u64,
    /// First piece of each bin.
    first: Box<[u32]>,
    /// Upper tau of each piece (pieces in increasing tau, i.e. decreasing T).
    upper: Box<[f64]>,
    /// Middle and inverse half-width of each piece, in tau.
    mid: Box<[f64]>,
    inv_half: Box<[f64]>,
    /// `coef[i][k][f]`: Chebyshev coefficient of T_k on piece i for field f.
    coef: Box<[[[f64; FIELDS]; DEG + 1]]>,
}

fn table() -> &'static Table {
    static TABLE: OnceLock<Table> = OnceLock::new();
    TABLE.get_or_init(build)
}

fn tau_of(t: f64) -> f64 {
    (T_CRIT - t) / T_CRIT
}

/// Upper end of the table: tau at the triple point.
fn tau_max() -> f64 {
    tau_of(T_TRIPLE)
}

/// Roots in T of the enhancement switch functions (`super::enhancement_switches`), with whether each is
/// a switch-on point (to be graded towards) rather than a form change.
fn switch_points() -> Vec<(f64, bool)> {
    let mut out = Vec::new();
    let hi = T_CRIT * (1.0 - TAU_MIN);
    let steps = 400;
    let at = |k: usize| T_TRIPLE + (hi - T_TRIPLE) * k as f64 / steps as f64;
    let mut prev = enhancement_switches(at(0));
    for k in 1..=steps {
        let cur = enhancement_switches(at(k));
        for f in 0..4 {
            if prev[f].is_finite() && cur[f].is_finite() && (prev[f] > 0.0) != (cur[f] > 0.0) {
                // bisection to the double
                let (mut a, mut b) = (at(k - 1), at(k));
                let sa = prev[f] > 0.0;
                for _ in 0..200 {
                    let m = 0.5 * (a + b);
                    if m <= a || m >= b {
                        break;
                    }
                    if (enhancement_switches(m)[f] > 0.0) == sa {
                        a = m;
                    } else {
                        b = m;
                    }
                }
                out.push((b, f < 2));
            }
        }
        prev = cur;
    }
    out
}

/// Breakpoints in tau, increasing, from TAU_MIN to tau_max.
fn breakpoints() -> Vec<f64> {
    let max_w = MAX_WIDTH_K / T_CRIT;
    let mut b = vec![TAU_MIN];
    loop {
        let last = *b.last().unwrap();
        let next = (last * RATIO).min(last + max_w);
        if next >= tau_max() - 0.3 * max_w {
            break;
        }
        b.push(next);
    }
    b.push(tau_max());
    for (t, graded) in switch_points() {
        let ts = tau_of(t);
        b.push(ts);
        if graded {
            // local base width around ts
            let w = (ts * (RATIO - 1.0)).min(max_w);
            let mut d = 0.5 * w;
            while d * T_CRIT > GRADE_MIN_K {
                b.push(ts - d);
                b.push(ts + d);
                d *= 0.5;
            }
        }
    }
    b.retain(|&x| (TAU_MIN..=tau_max()).contains(&x));
    b.sort_by(f64::total_cmp);
    b.dedup_by(|x, y| (*x - *y).abs() <= 1e-14 * y.abs());
    b
}

fn build() -> Table {
    let b = breakpoints();
    let pieces = b.len() - 1;
    let n = DEG as f64;
    let cos_jk = |j: usize, k: usize| (std::f64::consts::PI * ((j * k) % (2 * DEG)) as f64 / n).cos();
    let mut coef = vec![[[0.0; FIELDS]; DEG + 1]; pieces].into_boxed_slice();
    let mut mid = Vec::with_capacity(pieces);
    let mut inv_half = Vec::with_capacity(pieces);
    for (i, piece) in coef.iter_mut().enumerate() {
        let (lo, hi) = (b[i], b[i + 1]);
        let (m, half) = (0.5 * (lo + hi), 0.5 * (hi - lo));
        mid.push(m);
        inv_half.push(1.0 / half);
        // values at the nodes s_j = cos(pi j / DEG), j = 0..=DEG; the ends exactly at the breakpoints
        let mut fv = [[0.0; FIELDS]; DEG + 1];
        for (j, row) in fv.iter_mut().enumerate() {
            let tau = match j {
                0 => hi,
                _ if j == DEG => lo,
                _ => m + half * cos_jk(j, 1),
            };
            let t = T_CRIT - T_CRIT * tau;
            let st = direct_state::<false>(t, psat_dd::<false>(t));
            for (f, &slot) in SLOTS.iter().enumerate() {
                row[f] = st[slot];
            }
        }
        // a_k = (2/DEG) sum'' f_j cos(pi j k / DEG), halved for k = 0 and k = DEG (the discrete Chebyshev
        // transform on the extreme points; '' halves the first and last terms)
        for (k, a) in piece.iter_mut().enumerate() {
            for f in 0..FIELDS {
                let mut acc = 0.0;
                for (j, row) in fv.iter().enumerate() {
                    let w = if j == 0 || j == DEG { 0.5 } else { 1.0 };
                    acc += w * row[f] * cos_jk(j, k);
                }
                let end = if k == 0 || k == DEG { 0.5 } else { 1.0 };
                a[f] = end * 2.0 / n * acc;
            }
        }
    }
    // bin index: for each bin, the piece containing the bin's smallest tau
    let key0 = TAU_MIN.to_bits() >> BIN_SHIFT;
    let bins = (tau_max().to_bits() >> BIN_SHIFT) - key0 + 1;
    let upper: Box<[f64]> = b[1..].into();
    let mut first = Vec::with_capacity(bins as usize);
    let mut i = 0usize;
    for k in 0..bins {
        let lo = f64::from_bits((key0 + k) << BIN_SHIFT).max(TAU_MIN);
        while i + 1 < pieces && lo >= upper[i] {
            i += 1;
        }
        first.push(i as u32);
    }
    Table { key0, first: first.into(), upper, mid: mid.into(), inv_half: inv_half.into(), coef }
}

/// The tabulated fields (order of [`SLOTS`]) at `tau` = (T_c - T)/T_c, for TAU_MIN <= tau <= tau_triple
/// (the caller checks; NaN is not expected here).
#[inline(always)]
pub(super) fn eval(tau: f64) -> [f64; FIELDS] {
    let tb = table();
    let bin = ((tau.to_bits() >> BIN_SHIFT).saturating_sub(tb.key0) as usize).min(tb.first.len() - 1);
    let mut i = tb.first[bin] as usize;
    let last = tb.upper.len() - 1;
    while i < last && tau >= tb.upper[i] {
        i += 1;
    }
    let s = (tau - tb.mid[i]) * tb.inv_half[i];
    let c = &tb.coef[i];
    // Clenshaw: b_k = a_k + 2 s b_{k+1} - b_{k+2}; p = a_0 + s b_1 - b_2
    let s2 = s + s;
    let mut b1 = [0.0; FIELDS];
    let mut b2 = [0.0; FIELDS];
    for a in c[1..].iter().rev() {
        for f in 0..FIELDS {
            let b = a[f] + s2 * b1[f] - b2[f];
            b2[f] = b1[f];
            b1[f] = b;
        }
    }
    std::array::from_fn(|f| c[0][f] + s * b1[f] - b2[f])
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Worst relative difference, field by field, between the table and the direct evaluation at `n`
    /// temperatures in [lo, hi] (a deterministic irrational walk, never on a node).
    fn worst(lo: f64, hi: f64, n: usize) -> [f64; FIELDS] {
        let mut w = [0.0f64; FIELDS];
        for m in 0..n {
            let t = lo + (hi - lo) * ((m as f64 * 0.618_033_988_749_895) % 1.0);
            let a = eval(tau_of(t));
            let b = direct_state::<false>(t, psat_dd::<false>(t));
            for f in 0..FIELDS {
                w[f] = w[f].max(((a[f] - b[SLOTS[f]]) / b[SLOTS[f]]).abs());
            }
        }
        w
    }

    /// Band by band, the table reproduces the direct evaluation to the 12th digit or better up to 633 K.
    /// Closer to T_c the differences grow to the direct evaluation's own rounding scatter (they do not
    /// shrink with three times narrower pieces, which was tried: they are not interpolation error).
    #[test]
    fn table_matches_direct_evaluation() {
        let edge = T_CRIT * (1.0 - TAU_MIN);
        for (lo, hi, tol) in [
            (T_TRIPLE, 633.16, 1e-12),
            (633.16, 646.0, 1e-10),
            (646.0, 646.9, 2e-9),
            (646.9, edge, 1e-6),
        ] {
            let w = worst(lo, hi, 40_000);
            for f in 0..FIELDS {
                assert!(w[f] < tol, "{lo}-{hi} K, slot {}: {:e} (tolerance {tol:e})", SLOTS[f], w[f]);
            }
        }
    }

    /// The breakpoints include the switch-on of the liquid's critical enhancement (R15-11 conductivity:
    /// a square-root kink at about 430.2 K) and R12-08's two form changes, and the table resolves the
    /// kink: from 1e-6 K beyond it, k_l agrees with the direct evaluation as well as anywhere else (in
    /// the first, GRADE_MIN_K-wide piece the square root is interpolated to ~1e-9).
    #[test]
    fn enhancement_switches_are_breakpoints() {
        let p = switch_points();
        let onset = p.iter().find(|(_, graded)| *graded).expect("liquid enhancement switch-on").0;
        assert!((onset - 430.2).abs() < 0.1, "{p:?}");
        assert_eq!(p.iter().filter(|(_, graded)| !*graded).count(), 2, "{p:?}");
        for (d, tol) in [(-1e-3, 1e-12), (1e-9, 1e-8), (1e-6, 1e-12), (1e-3, 1e-12), (0.1, 1e-12)] {
            let t = onset + d;
            let a = eval(tau_of(t))[4];
            let b = direct_state::<false>(t, psat_dd::<false>(t))[7];
            assert!(((a - b) / b).abs() < tol, "k_l at onset {d:+e} K: {a} vs {b}");
        }
    }
}
