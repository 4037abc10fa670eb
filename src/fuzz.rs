//! Bounded fuzzing of every registered kernel, run by `cargo test`.
//!
//! cargo-fuzz needs a nightly toolchain; this is the stable equivalent: a
//! seeded generator feeds each kernel random and adversarial `f64` inputs
//! (NaN, ±inf, ±0, subnormals, huge and tiny magnitudes, values a few ulp
//! either side of domain edges, and random values inside physical ranges) for
//! a bounded time, and checks the [`Kernel`] contract on every sample:
//!
//! * nothing panics (`eval`, `possible`, `in_range`, `evaluate`, `classify`);
//! * `eval` is deterministic (same bits twice);
//! * a NaN input propagates: a NaN output (every output of a single-output
//!   kernel), status `Ok` (code 3, "missing");
//! * an impossible input (code 1) gives a NaN from `eval` itself (so that
//!   `evaluate` can see it) and NaN in every output of `evaluate`, status
//!   `Invalid`;
//! * `classify` agrees with `evaluate`'s status (0 ⇔ Ok, 2 ⇔ OutOfRange);
//! * for possible inputs drawn from physical ranges (domain edges included)
//!   every output is finite, not negative unless it is a signed quantity, and
//!   an angle output at most 180 deg, except where the model documents a
//!   legitimate "no answer" (NaN) or an infinite limit (+inf), listed per
//!   kernel in [`allowances`]. (Huge and tiny inputs may overflow to ±inf or
//!   meet 0 x inf: for them only the contract above is checked.)
//!
//! Time budget: `WETBOIL_FUZZ_SECONDS` (default 10 s in total, shared by all
//! kernels round-robin); seed: `WETBOIL_FUZZ_SEED` (default fixed, so a run is
//! reproducible; every failure prints the seed, the kernel and the inputs).

use std::panic::{catch_unwind, AssertUnwindSafe};
use std::time::{Duration, Instant};

use crate::model::{check_factored, classify, evaluate, BlockSummary, Factored, Kernel, Status};
use crate::{boiling, chain, chf, departure, nucleation, water, wetting};

// ---------------------------------------------------------------------------
// generator

/// splitmix64: small, fast, good enough to spread bits for fuzzing.
struct Rng(u64);

impl Rng {
    fn next_u64(&mut self) -> u64 {
        self.0 = self.0.wrapping_add(0x9E37_79B9_7F4A_7C15);
        let mut z = self.0;
        z = (z ^ (z >> 30)).wrapping_mul(0xBF58_476D_1CE4_E5B9);
        z = (z ^ (z >> 27)).wrapping_mul(0x94D0_49BB_1331_11EB);
        z ^ (z >> 31)
    }
    /// Uniform in [0, 1).
    fn unit(&mut self) -> f64 {
        (self.next_u64() >> 11) as f64 * (1.0 / (1u64 << 53) as f64)
    }
    fn below(&mut self, n: usize) -> usize {
        (self.next_u64() % n as u64) as usize
    }
    fn chance(&mut self, p: f64) -> bool {
        self.unit() < p
    }
    fn uniform(&mut self, lo: f64, hi: f64) -> f64 {
        lo + (hi - lo) * self.unit()
    }
    /// Log-uniform in [lo, hi], both > 0.
    fn log_uniform(&mut self, lo: f64, hi: f64) -> f64 {
        (lo.ln() + (hi.ln() - lo.ln()) * self.unit()).exp()
    }
    fn pick(&mut self, xs: &[f64]) -> f64 {
        xs[self.below(xs.len())]
    }
}

/// Next representable double towards +inf (`up`) or -inf.
fn step_ulp(x: f64, up: bool) -> f64 {
    if x.is_nan() || x.is_infinite() {
        return x;
    }
    if x == 0.0 {
        let tiny = f64::from_bits(1);
        return if up { tiny } else { -tiny };
    }
    let bits = x.to_bits();
    let away = (x > 0.0) == up;
    f64::from_bits(if away { bits + 1 } else { bits - 1 })
}

/// How a physical value of an input is drawn.
#[derive(Clone, Copy)]
enum Range {
    /// Uniform on [lo, hi].
    Lin(f64, f64),
    /// Log-uniform on [lo, hi] (lo > 0).
    Log(f64, f64),
    /// Zero or log-uniform on [lo, hi].
    ZeroOrLog(f64, f64),
    /// Either sign, log-uniform magnitude in [lo, hi].
    SignedLog(f64, f64),
    /// One of a few values.
    Set(&'static [f64]),
}

/// The physical range of a kernel input, by its declared name. Every input
/// name of every registered kernel must appear here (the test fails on an
/// unknown one), so a new kernel cannot slip past the fuzzer.
fn physical_range(kernel: &str, name: &str) -> Range {
    use Range::*;
    let name = name.strip_prefix("fluid.").unwrap_or(name);
    match (kernel, name) {
        ("water_saturation_t", "T") => Lin(273.16, 647.096),
        ("water_saturation_p" | "water_screening_chain", "p") => Log(611.655, 22.064e6),
        ("kinetic_superheat_water" | "homogeneous_superheat_water", "p") => Log(611.655, 22.0e6),
        ("rpi_partition", "frequency") => Log(1.0, 1e3),
        ("tolubinsky_kostanchuk_departure", "subcooling") => Lin(-20.0, 100.0),
        ("rpi_partition", "site_density") => ZeroOrLog(1e2, 1e9),
        ("lienhard_dhir_chf", "geometry") => Set(&[0.0, 1.0, 2.0, 3.0]),
        ("cole_rohsenow_departure", "C") => Log(1e-5, 1e-3),
        ("zuber_chf", "K") => Log(0.05, 0.3),
        ("minimum_heat_flux", "C") => Log(0.02, 0.3),
        (_, "contact_angle_deg" | "advancing_deg" | "receding_deg" | "advancing_angle_deg" | "receding_angle_deg") => {
            Lin(0.0, 180.0)
        }
        (_, "orientation_deg") => Lin(0.0, 180.0),
        (_, "cavity_half_angle_deg" | "inclination_deg") => Lin(0.0, 90.0),
        (_, "T") => Lin(273.16, 640.0),
        (_, "p") => Log(611.655, 2.2e7),
        (_, "p_crit") => Log(2.2e7, 2.3e7),
        (_, "rho_l") => Lin(300.0, 2000.0),
        (_, "rho_v") => Log(1e-3, 300.0),
        (_, "h_lv") => Log(1e4, 3e6),
        (_, "sigma" | "sigma_lv") => Log(1e-4, 0.1),
        (_, "sigma_sv" | "sigma_sl" | "sigma_s" | "sigma_l") => ZeroOrLog(1e-4, 0.1),
        (_, "solid_dispersive" | "solid_polar" | "liquid_dispersive" | "liquid_polar") => ZeroOrLog(1e-4, 0.08),
        (_, "cp_l" | "cp_v") => Log(500.0, 1e4),
        (_, "k_l" | "k_v") => Log(0.01, 1.0),
        (_, "mu_l" | "mu_v") => Log(1e-6, 1e-2),
        (_, "molar_mass") => Log(0.002, 0.3),
        (_, "g") => Log(0.1, 100.0),
        (_, "superheat" | "wall_superheat") => ZeroOrLog(1e-3, 200.0),
        (_, "subcooling") => ZeroOrLog(1e-3, 100.0),
        (_, "heat_flux") => ZeroOrLog(1.0, 1e7),
        (_, "radius" | "cavity_radius") => Log(1e-9, 1e-3),
        (_, "diameter" | "departure_diameter") => Log(1e-6, 1e-1),
        (_, "thermal_layer") => Log(1e-6, 1e-2),
        (_, "size" | "length") => Log(1e-4, 1.0),
        (_, "area") => Log(1e-8, 1.0),
        (_, "width") => ZeroOrLog(1e-5, 1e-2),
        (_, "height") => Log(1e-4, 1.0),
        (_, "thickness") => Log(1e-10, 1e-6),
        (_, "mass") => Log(1e-9, 1e-3),
        (_, "rate") => Log(1e-3, 1e30),
        (_, "velocity") => Lin(-5.0, 5.0),
        (_, "contact_ratio") => Lin(0.0, 1.0),
        (_, "growth_constant") => Lin(0.0, 3.0),
        (_, "friction_ratio") => Lin(0.0, 0.1),
        (_, "drag_coefficient" | "constant") => Log(0.1, 2.0),
        (_, "latent_factor" | "emissivity") => Lin(0.0, 1.0),
        (_, "roughness_ratio") => Lin(1.0, 3.0),
        (_, "solid_fraction") => Lin(0.0, 1.0),
        (_, "phi") => Lin(0.0, 1.5),
        (_, "k") => Log(0.5, 2.0),
        (_, "C_sf") => Log(1e-3, 0.03),
        (_, "n") => Lin(0.5, 2.5),
        (_, "roughness_Rp") => Log(1e-8, 1e-5),
        (_, "convection_coefficient") => ZeroOrLog(1.0, 1e5),
        (_, "area_factor") => Lin(1.0, 5.0),
        (_, "expansion_coefficient") => Log(1e-5, 1e-2),
        (_, "small_plate_coefficient") => Log(1.0, 30.0),
        (_, "hamaker") => SignedLog(1e-22, 1e-18),
        (_, "hamaker_solid" | "hamaker_liquid") => ZeroOrLog(1e-22, 1e-18),
        (_, "coefficient") => SignedLog(1e-40, 1e-10),
        (_, "exponent") => Lin(0.5, 4.0),
        _ => panic!("fuzz: no physical range for input {name:?} of kernel {kernel}: add one to physical_range"),
    }
}

fn draw(rng: &mut Rng, r: Range) -> f64 {
    match r {
        Range::Lin(lo, hi) => {
            // the edges themselves now and then: domain limits are where kernels break
            match rng.below(16) {
                0 => lo,
                1 => hi,
                _ => rng.uniform(lo, hi),
            }
        }
        Range::Log(lo, hi) => match rng.below(16) {
            0 => lo,
            1 => hi,
            _ => rng.log_uniform(lo, hi),
        },
        Range::ZeroOrLog(lo, hi) => {
            if rng.chance(0.1) {
                0.0
            } else {
                rng.log_uniform(lo, hi)
            }
        }
        Range::SignedLog(lo, hi) => {
            let m = rng.log_uniform(lo, hi);
            if rng.chance(0.5) {
                m
            } else {
                -m
            }
        }
        Range::Set(xs) => rng.pick(xs),
    }
}

/// Values that break careless floating-point code.
const SPECIALS: &[f64] = &[
    f64::NAN,
    f64::INFINITY,
    f64::NEG_INFINITY,
    0.0,
    -0.0,
    5e-324,
    -5e-324,
    2.225_073_858_507_201e-308, // smallest normal
    1e-300,
    1e-30,
    1e30,
    1e300,
    1e308,
    -1e308,
    f64::MAX,
    f64::MIN,
    -1.0,
    1.0,
    0.5,
    90.0,
    180.0,
    360.0,
    -180.0,
    647.096,
    22.064e6,
];

/// One adversarial input: a special value, a physical value nudged by an ulp
/// or scaled by a large power of ten, or a physical value.
fn adversarial(rng: &mut Rng, r: Range) -> f64 {
    match rng.below(6) {
        0 | 1 => rng.pick(SPECIALS),
        2 => step_ulp(draw(rng, r), rng.chance(0.5)),
        3 => {
            let e = rng.below(601) as i32 - 300;
            draw(rng, r) * 10f64.powi(e)
        }
        4 => -draw(rng, r),
        _ => draw(rng, r),
    }
}

// ---------------------------------------------------------------------------
// what each model documents

/// What a model documents beyond "finite outputs for possible inputs".
#[derive(Default, Clone, Copy)]
struct Allow {
    /// Possible inputs may give NaN outputs (a documented "no answer").
    no_answer: bool,
    /// Possible inputs where a NaN output is a documented "no answer" (when
    /// `no_answer` is false).
    no_answer_where: Option<fn(&[f64]) -> bool>,
    /// Possible inputs may give +inf outputs (a documented infinite limit).
    infinite: bool,
}

/// Documented exceptions, each with the documentation it rests on.
fn allowances(kernel: &str) -> Allow {
    let no_answer = Allow { no_answer: true, ..Allow::default() };
    let infinite = Allow { infinite: true, ..Allow::default() };
    match kernel {
        // At exactly T_crit: rho_l = rho_v, h_lv = sigma = 0, cp, k, mu infinite (fluids.water docs).
        "water_saturation_t" | "water_saturation_p" => infinite,
        // Zero superheat gives an infinite radius (nucleation::embryo_radius docs).
        "embryo_radius_linear" => infinite,
        // NaN when the iteration finds no root (nucleation::embryo_superheat_exact docs).
        "embryo_superheat_exact" => no_answer,
        // NaN when the rate is not reached before the spinodal (cnt_superheat_water docs).
        "kinetic_superheat_water" | "homogeneous_superheat_water" => no_answer,
        // No active cavity: NaN, NaN; r_max infinite at 180 deg (hsu_active_radii docs).
        "hsu_active_radii" => Allow { no_answer: true, infinite: true, ..Allow::default() },
        // Zero heat flux gives an infinite critical radius (onset_cavity_radius
        // docs); where the radius factor sin(theta/2) (Hsu) or sin(theta_r)
        // (Kandlikar) is also zero the radius is 0 x inf: no answer.
        "hsu_onset" => Allow {
            infinite: true,
            no_answer_where: Some(|x| x[0] == 0.0 && x[7] == 0.0),
            ..Allow::default()
        },
        "kandlikar_onset" => Allow {
            infinite: true,
            no_answer_where: Some(|x| x[0] == 0.0 && (x[7] == 0.0 || x[7] == 180.0)),
            ..Allow::default()
        },
        "davis_anderson_onset" => infinite,
        // Explosive growth outside the data may reach +inf (flagged out of range);
        // f(rho+) <= 0, i.e. rho_l below about 2.05 rho_v, has no answer (hibiki_ishii docs).
        "hibiki_ishii_site_density" => Allow {
            infinite: true,
            no_answer_where: Some(|x| x[4] < 2.06 * x[5]),
            ..Allow::default()
        },
        // No departure found: NaN diameter, mode and driver 0 (force_balance docs).
        "klausner_force_balance" => no_answer,
        // The cavity never fires: NaN (waiting_time docs).
        "hsu_waiting_time" => no_answer,
        // Facing down with a bracket <= 0 the model has no answer (chf::kandlikar docs).
        "kandlikar_chf" => no_answer,
        // The drop never slides: NaN (furmidge_sliding_angle validity).
        "furmidge_sliding_angle" => no_answer,
        // A zero diameter has no departure cycle (departure.rs, freq_possible).
        "cole_frequency" | "zuber_frequency" | "ivey_hydrodynamic_frequency" | "ivey_transition_frequency" => Allow {
            no_answer_where: Some(|x| x[0] == 0.0),
            ..Allow::default()
        },
        // The fused chain has the answers of its steps: none from Kandlikar
        // facing down (the critical point is an impossible input).
        "water_screening_chain" => Allow {
            no_answer_where: Some(|x| x[3] > 90.0),
            ..Allow::default()
        },
        _ => Allow::default(),
    }
}

/// Outputs that may be negative for possible inputs; every other output is a
/// magnitude (diameter, flux, density, frequency, time, superheat, angle...).
fn may_be_negative(output: &str) -> bool {
    matches!(output, "spreading_coefficient" | "interfacial_tension" | "disjoining_pressure" | "hamaker")
}

// ---------------------------------------------------------------------------
// the check of one sample

struct Report {
    seed: u64,
    samples: u64,
    /// kernel -> possible samples drawn from physical ranges (to show the
    /// strict checks really ran)
    physical_possible: std::collections::BTreeMap<&'static str, u64>,
    /// (kernel, kind of failure) -> (count, first example)
    failures: std::collections::BTreeMap<(String, String), (u64, String)>,
}

impl Report {
    fn fail(&mut self, kernel: &str, x: &[f64], what: String) {
        // group by kernel and the wording before the first digit or bracket
        let kind: String = what.chars().take_while(|c| !c.is_ascii_digit() && *c != '[' && *c != '(').collect();
        let seed = self.seed;
        let e = self
            .failures
            .entry((kernel.to_owned(), kind))
            .or_insert_with(|| (0, format!("{kernel}: {what}; inputs {x:?} (seed {seed})")));
        e.0 += 1;
    }
}

/// Check one sample; returns its outputs `eval(x)` (None if it panicked),
/// which [`check_block`] compares the block form with.
fn check<K: Kernel<N, M>, const N: usize, const M: usize>(x: &[f64; N], physical: bool, report: &mut Report) -> Option<[f64; M]> {
    let name = K::MODEL.name;
    report.samples += 1;
    let run = catch_unwind(AssertUnwindSafe(|| {
        let y1 = K::eval(x);
        // the scalar entry point's form (the same function for most kernels):
        // equal bits also show that eval is deterministic
        let y2 = K::eval_one(x);
        let possible = K::possible(x);
        let in_range = if possible && !x.iter().any(|v| v.is_nan()) { Some(K::in_range(x)) } else { None };
        (y1, y2, possible, in_range, evaluate::<K, N, M>(x), classify::<K, N, M>(x))
    }));
    let Ok((y, y2, possible, in_range, (out, status), code)) = run else {
        report.fail(name, x, "panicked".into());
        return None;
    };
    if let Some(r) = in_range {
        if catch_unwind(AssertUnwindSafe(|| K::in_range_with(x, &y))).ok() != Some(r) {
            report.fail(name, x, format!("in_range_with(x, eval(x)) differs from in_range(x) = {r}"));
        }
    }
    let bits = |v: &[f64; M]| v.map(f64::to_bits);
    if bits(&y) != bits(&y2) {
        report.fail(name, x, format!("eval and eval_one differ (or eval is not deterministic): {y:?} vs {y2:?}"));
    }
    let all_nan = |v: &[f64; M]| v.iter().all(|o| o.is_nan());
    let any_nan = |v: &[f64; M]| v.iter().any(|o| o.is_nan());
    match code {
        3 => {
            // evaluate recognises missing data only through a NaN output
            // (a fused multi-output kernel may still answer its other outputs)
            if status != Status::Ok || !any_nan(&y) || bits(&out) != bits(&y) {
                report.fail(name, x, format!("NaN input not propagated: eval {y:?}, status {status:?}"));
            }
        }
        1 => {
            if possible {
                report.fail(name, x, "classify says impossible but possible() is true".into());
            }
            // eval must show the impossibility by a NaN; evaluate then blanks every output
            if !any_nan(&y) || status != Status::Invalid || !all_nan(&out) {
                report.fail(name, x, format!("impossible input gave {y:?} (status {status:?}, classify 1)"));
            }
        }
        0 | 2 => {
            let want = if code == 0 { Status::Ok } else { Status::OutOfRange };
            if status != want {
                report.fail(name, x, format!("classify {code} but evaluate status {status:?} (outputs {out:?})"));
            }
            if bits(&out) != bits(&y) {
                report.fail(name, x, format!("evaluate changed the outputs of a possible input: {y:?} -> {out:?}"));
            }
            if !physical {
                return Some(y); // huge and tiny inputs may overflow to ±inf or give 0 x inf: only the contract above
            }
            *report.physical_possible.entry(name).or_insert(0) += 1;
            let allow = allowances(name);
            for (k, &v) in y.iter().enumerate() {
                let out = K::MODEL.outputs[k];
                if v.is_nan() {
                    if !(allow.no_answer || allow.no_answer_where.is_some_and(|f| f(x))) {
                        let what = format!("output {} is NaN for a possible physical input (outputs {y:?})", out.name);
                        report.fail(name, x, what);
                    }
                } else if v.is_infinite() {
                    if !(allow.infinite && v > 0.0) {
                        report.fail(name, x, format!("output {} is {v} for a possible physical input", out.name));
                    }
                } else if v < 0.0 && !may_be_negative(out.name) {
                    report.fail(name, x, format!("output {} is negative for a possible physical input: {v}", out.name));
                } else if out.unit == "deg" && v > 180.0 {
                    report.fail(name, x, format!("angle output {} above 180 deg: {v}", out.name));
                }
            }
        }
        other => report.fail(name, x, format!("classify returned {other}")),
    }
    Some(y)
}

/// Fuzz one kernel until `deadline`.
fn run<K: Kernel<N, M>, const N: usize, const M: usize>(rng: &mut Rng, deadline: Instant, report: &mut Report) {
    let ranges: [Range; N] = std::array::from_fn(|k| physical_range(K::MODEL.name, K::MODEL.inputs[k].name));
    // Every input is also tried on its own with each special value, the others physical.
    for k in 0..N {
        for &s in SPECIALS {
            let mut x: [f64; N] = std::array::from_fn(|j| draw(rng, ranges[j]));
            x[k] = s;
            // ±0 is an ordinary physical value (a flux, a superheat, an angle): strict checks
            check::<K, N, M>(&x, s == 0.0, report);
        }
    }
    let mut i = 0u64;
    let mut block = [([0.0; N], [0.0; M]); BLOCK];
    loop {
        // physical samples half the time; otherwise a few inputs made adversarial
        let physical = i % 2 == 0;
        let mut x: [f64; N] = std::array::from_fn(|j| draw(rng, ranges[j]));
        if !physical {
            let n_bad = 1 + rng.below(N.min(3));
            for _ in 0..n_bad {
                let j = rng.below(N);
                x[j] = adversarial(rng, ranges[j]);
            }
        }
        // (a sample that panicked is reported by check and left out of the blocks)
        if let Some(y) = check::<K, N, M>(&x, physical, report) {
            block[i as usize % BLOCK] = (x, y);
        }
        i += 1;
        if i % BLOCK as u64 == 0 {
            check_block::<K, N, M>(&block, 1 + rng.below(BLOCK), report);
            if Instant::now() >= deadline {
                break;
            }
        }
    }
}

/// Elements per block in [`check_block`], as in the binding's loops.
const BLOCK: usize = 64;

/// The block form of a kernel (`Kernel::eval_block`, what the binding's loops
/// run) against its element form on the last `BLOCK` samples (inputs and the
/// outputs `eval` gave them in [`check`]), of which the first `len` are live:
/// the same output bits, and the same summary as the elements give one by one.
fn check_block<K: Kernel<N, M>, const N: usize, const M: usize>(
    samples: &[([f64; N], [f64; M]); BLOCK],
    len: usize,
    report: &mut Report,
) {
    let name = K::MODEL.name;
    let mut y = [[0.0; BLOCK]; M];
    let Ok(sum) = catch_unwind(AssertUnwindSafe(|| K::eval_block(|j| samples[j].0, len, &mut y))) else {
        report.fail(name, &samples[0].0, "eval_block panicked".into());
        return;
    };
    let mut want = BlockSummary::default();
    for (j, (x, v)) in samples.iter().enumerate() {
        // (a NaN's sign and payload carry no meaning, and vectorised code
        // may order the operands of a commutative operation differently)
        let same = |a: f64, b: f64| a.to_bits() == b.to_bits() || (a.is_nan() && b.is_nan());
        if (0..M).any(|m| !same(v[m], y[m][j])) {
            let got: [f64; M] = std::array::from_fn(|m| y[m][j]);
            report.fail(name, x, format!("eval_block and eval differ: {got:?} vs {v:?}"));
        }
        want.any_nan |= v.iter().any(|o| o.is_nan());
        want.out_of_range += (j < len && !K::in_range_with(x, v)) as u64;
    }
    if sum != want {
        report.fail(name, &samples[0].0, format!("eval_block's summary {sum:?}, the elements give {want:?}"));
    }
}

type Runner = fn(&mut Rng, Instant, &mut Report);

/// One line per kernel: the same kernels (and the same `N, M`) as
/// `src/python/registry.rs`; `fuzz_list_matches_the_registry` keeps them equal.
macro_rules! kernels {
    ($($k:ty, $n:literal, $m:literal;)*) => {
        /// (registry text `Type,N,M`, model name, fuzzer)
        const KERNELS: &[(&str, &str, Runner)] = &[$((
            concat!(stringify!($k), ",", stringify!($n), ",", stringify!($m)),
            <$k as Kernel<$n, $m>>::MODEL.name,
            run::<$k, $n, $m> as Runner,
        )),*];
        /// Their models' facts, in the same order.
        const FUZZED_MODELS: &[crate::model::Model] = &[$(<$k as Kernel<$n, $m>>::MODEL),*];
    };
}

kernels! {
    water::SaturationT, 1, 12;
    water::SaturationP, 1, 12;
    nucleation::EmbryoSuperheat, 6, 1;
    nucleation::EmbryoRadius, 6, 1;
    nucleation::EmbryoSuperheatExact, 7, 1;
    nucleation::BarrierFactor, 1, 1;
    nucleation::KineticSuperheatWater, 3, 1;
    nucleation::HomogeneousSuperheatWater, 2, 1;
    nucleation::Bankoff, 2, 1;
    nucleation::HsuActiveRadii, 9, 2;
    nucleation::HsuOnset, 8, 2;
    nucleation::DavisAnderson, 7, 2;
    nucleation::KandlikarOnset, 8, 2;
    nucleation::BerglesRohsenow, 2, 1;
    nucleation::WangDhir, 7, 1;
    nucleation::Basu, 3, 1;
    nucleation::HibikiIshii, 9, 1;
    nucleation::LemmertChawla, 1, 1;
    departure::Fritz, 5, 1;
    departure::ColeRohsenow, 8, 1;
    departure::KocamustafaogullariIshii, 5, 1;
    departure::ForceBalance, 17, 5;
    departure::ColeFrequency, 5, 1;
    departure::ZuberFrequency, 6, 1;
    departure::IveyHydrodynamicFrequency, 2, 1;
    departure::IveyTransitionFrequency, 2, 1;
    departure::WaitingTime, 10, 1;
    chf::Zuber, 6, 1;
    chf::Kandlikar, 7, 1;
    chf::LienhardDhir, 9, 1;
    chf::DimensionlessSize, 5, 1;
    chf::MinimumHeatFlux, 6, 1;
    boiling::Rohsenow, 11, 1;
    boiling::RohsenowSuperheat, 11, 1;
    boiling::Cooper, 5, 1;
    boiling::CooperSuperheat, 5, 1;
    boiling::RpiPartition, 12, 5;
    boiling::TolubinskyKostanchuk, 1, 1;
    boiling::NaturalConvection, 8, 1;
    boiling::NaturalConvectionCylinder, 8, 1;
    boiling::NaturalConvectionVerticalPlate, 8, 1;
    boiling::NaturalConvectionSphere, 8, 1;
    boiling::FilmBoiling, 13, 1;
    wetting::YoungAngle, 3, 1;
    wetting::SpreadingCoefficient, 3, 1;
    wetting::AdhesionWork, 2, 1;
    wetting::GirifalcoGood, 3, 1;
    wetting::OwrkAngle, 4, 1;
    wetting::Wenzel, 2, 1;
    wetting::CassieBaxter, 3, 1;
    wetting::HemiwickingAngle, 2, 1;
    wetting::ImpregnatedAngle, 3, 1;
    wetting::RetentionForce, 5, 1;
    wetting::SlidingAngle, 7, 1;
    wetting::VdwDisjoiningPressure, 2, 1;
    wetting::PowerLawDisjoiningPressure, 3, 1;
    wetting::VdwFilmThickness, 5, 1;
    wetting::EffectiveHamaker, 2, 1;
    chain::WaterScreening, 6, 4;
}

/// Check the product contract of a factored kernel on `n` samples (special,
/// physical and adversarial); the first violation, if any.
fn run_factored<K: Factored<N, M>, const N: usize, const M: usize>(rng: &mut Rng, n: usize) -> Option<String> {
    let ranges: [Range; N] = std::array::from_fn(|k| physical_range(K::MODEL.name, K::MODEL.inputs[k].name));
    let mut samples: Vec<[f64; N]> = Vec::new();
    for k in 0..N {
        for &v in SPECIALS {
            let mut x: [f64; N] = std::array::from_fn(|j| draw(rng, ranges[j]));
            x[k] = v;
            samples.push(x);
        }
    }
    for i in 0..n {
        let mut x: [f64; N] = std::array::from_fn(|j| draw(rng, ranges[j]));
        if i % 2 == 1 {
            let j = rng.below(N);
            x[j] = adversarial(rng, ranges[j]);
        }
        samples.push(x);
    }
    samples.iter().find_map(|x| {
        catch_unwind(AssertUnwindSafe(|| check_factored::<K, N, M>(x))).err().map(|e| {
            e.downcast_ref::<String>().cloned().unwrap_or_else(|| format!("{}: contract violated at {x:?}", K::MODEL.name))
        })
    })
}

type FactoredRunner = fn(&mut Rng, usize) -> Option<String>;

/// The kernels registered with `factored::<...>()` in `src/python/registry.rs`.
macro_rules! factored {
    ($($k:ty, $n:literal, $m:literal;)*) => {
        const FACTORED: &[(&str, FactoredRunner)] = &[$((
            concat!(stringify!($k), ",", stringify!($n), ",", stringify!($m)),
            run_factored::<$k, $n, $m> as FactoredRunner,
        )),*];
    };
}

factored! {
    nucleation::HsuOnset, 8, 2;
    nucleation::KandlikarOnset, 8, 2;
    departure::Fritz, 5, 1;
    departure::KocamustafaogullariIshii, 5, 1;
    chf::Kandlikar, 7, 1;
}

#[test]
fn factored_kernels_keep_the_product_contract() {
    let mut rng = Rng(0x4641_4354_4f52_5321);
    let failures: Vec<String> = FACTORED.iter().filter_map(|(_, run)| run(&mut rng, 20_000)).collect();
    assert!(failures.is_empty(), "{}", failures.join("\n"));
}

fn compact(s: &str) -> String {
    s.chars().filter(|c| !c.is_whitespace()).collect()
}

#[test]
fn fuzz_list_matches_the_registry() {
    // Read the registration table as text: it is compiled only with the
    // "python" feature, but must list exactly the kernels fuzzed here.
    let registry = include_str!("python/registry.rs");
    let mut registered: Vec<String> = registry
        .lines()
        .filter_map(|l| {
            let l = l.trim();
            let rest = l.strip_prefix("entry::<").or_else(|| l.strip_prefix("factored::<"))?;
            let inner = rest.strip_suffix(">(),")?;
            Some(compact(inner))
        })
        .collect();
    let mut registered_factored: Vec<String> = registry
        .lines()
        .filter_map(|l| Some(compact(l.trim().strip_prefix("factored::<")?.strip_suffix(">(),")?)))
        .collect();
    let mut factored: Vec<String> = FACTORED.iter().map(|(k, _)| compact(k)).collect();
    factored.sort();
    registered_factored.sort();
    assert_eq!(factored, registered_factored, "src/fuzz.rs FACTORED must list the factored::<...>() lines of the registry");
    let mut fuzzed: Vec<String> = KERNELS.iter().map(|(k, _, _)| compact(k)).collect();
    assert!(!registered.is_empty(), "no entry::<...>() lines found in src/python/registry.rs");
    fuzzed.sort();
    registered.sort();
    assert_eq!(fuzzed, registered, "src/fuzz.rs must list exactly the kernels of src/python/registry.rs");
}

#[test]
fn every_tension_input_is_a_liquids_or_a_solids() {
    // The bounds on liquid surface tensions (model::TENSION_MAX) and on solid
    // surface energies (model::SOLID_ENERGY_MAX), two of model::INPUT_BOUNDS,
    // find their inputs by name: a new "N/m" input must be put in one list or
    // the other.
    use crate::model::{named, LIQUID_TENSIONS, OTHER_TENSIONS};
    for m in FUZZED_MODELS {
        for a in m.inputs.iter().filter(|a| a.unit == "N/m") {
            assert!(
                named(a.name, &LIQUID_TENSIONS) ^ named(a.name, &OTHER_TENSIONS),
                "{}: input {} [N/m] must be in exactly one of model::LIQUID_TENSIONS and model::OTHER_TENSIONS",
                m.name,
                a.name
            );
        }
        for a in m.inputs.iter().filter(|a| named(a.name, &LIQUID_TENSIONS)) {
            assert_eq!(a.unit, "N/m", "{}: {}", m.name, a.name);
        }
    }
}

#[test]
fn every_input_bound_names_inputs_that_exist() {
    // The bounds of model::INPUT_BOUNDS find their inputs by name: a renamed
    // input would silently lose its unit-slip check, so every name must be an
    // input of some kernel, in the unit the bound is written for.
    use crate::model::{named, INPUT_BOUNDS};
    let units = ["N/m", "N/m", "J", "m", "kg", "m"];
    assert_eq!(units.len(), INPUT_BOUNDS.len());
    for (b, unit) in INPUT_BOUNDS.iter().zip(units) {
        for name in b.names {
            let used: Vec<_> = FUZZED_MODELS.iter().flat_map(|m| m.inputs.iter()).filter(|a| a.name == *name).collect();
            assert!(!used.is_empty(), "model::INPUT_BOUNDS: no kernel has an input {name}");
            assert!(used.iter().all(|a| a.unit == unit), "{name}: unit is not {unit}");
        }
        assert!(FUZZED_MODELS.iter().any(|m| m.inputs.iter().any(|a| named(a.name, b.names))));
    }
}

#[test]
fn fuzz_every_kernel() {
    let seconds: f64 = std::env::var("WETBOIL_FUZZ_SECONDS").ok().and_then(|s| s.trim().parse().ok()).unwrap_or(10.0);
    let seed: u64 = std::env::var("WETBOIL_FUZZ_SEED")
        .ok()
        .and_then(|s| s.trim().parse().ok())
        .unwrap_or(0x5745_5442_4f49_4c21);
    let mut rng = Rng(seed);
    let mut report = Report { seed, samples: 0, physical_possible: Default::default(), failures: Default::default() };
    let start = Instant::now();
    let budget = Duration::from_secs_f64(seconds.max(0.0));
    // Two rounds over all kernels so that a slow kernel cannot starve the
    // others: each kernel gets an equal slice of each round.
    let slice = budget / (2 * KERNELS.len() as u32);
    for _round in 0..2 {
        for (_, _, runner) in KERNELS {
            runner(&mut rng, Instant::now() + slice, &mut report);
        }
    }
    eprintln!(
        "fuzz: {} samples over {} kernels in {:.1} s (seed {seed})",
        report.samples,
        KERNELS.len(),
        start.elapsed().as_secs_f64()
    );
    let starved: Vec<String> = KERNELS
        .iter()
        .map(|&(_, n, _)| n)
        .filter(|n| report.physical_possible.get(n).copied().unwrap_or(0) < 30)
        .map(|n| format!("{n} ({} possible physical samples)", report.physical_possible.get(n).copied().unwrap_or(0)))
        .collect();
    assert!(seconds < 1.0 || starved.is_empty(), "kernels hardly reached with possible inputs: {starved:?}");
    let lines: Vec<String> = report.failures.values().map(|(n, first)| format!("{n} x {first}")).collect();
    assert!(lines.is_empty(), "{} kind(s) of fuzz failure:\n{}", lines.len(), lines.join("\n"));
}
