//! What every published model declares once: its scalar kernel, its physical
//! domain, its published validity range and its bibliographic facts.
//!
//! A model is a zero-sized type implementing [`Kernel`]. The binding layer
//! (`src/python/`, behind the `python` feature) turns any `Kernel` into a NumPy
//! ufunc and a fast scalar entry point through one generic mechanism; the
//! Python front door reads [`Model`] to build signatures, checks and warnings.
//! Nothing here knows about Python.

use serde::Serialize;

/// One input or output of a kernel.
#[derive(Debug, Clone, Copy, Serialize)]
pub struct Arg {
    /// Where the value comes from at the public API: a plain argument name
    /// (`"contact_angle_deg"`) or a field of a fluid-state argument
    /// (`"fluid.sigma"`). Outputs use a plain name.
    pub name: &'static str,
    /// SI unit, written plainly (`"m"`, `"N/m"`, `"kg/m3"`, `"deg"`, `"-"`).
    pub unit: &'static str,
}

/// Shorthand constructor used in the model tables.
pub const fn arg(name: &'static str, unit: &'static str) -> Arg {
    Arg { name, unit }
}

/// The facts of one published model. Declared next to its kernel, exported to
/// Python as JSON, and read by the front door, the docs and `wetboil.models()`.
#[derive(Debug, Clone, Copy, Serialize)]
pub struct Model {
    /// Unique kernel name; also the name of the NumPy ufunc and of the
    /// attribute it is exported under in `wetboil._core`.
    pub name: &'static str,
    /// One line: what it computes.
    pub summary: &'static str,
    /// The equation as plain text.
    pub equation: &'static str,
    /// Inputs in kernel (ufunc) order.
    pub inputs: &'static [Arg],
    /// Outputs in kernel (ufunc) order.
    pub outputs: &'static [Arg],
    /// Which inputs are physically possible (outside: NaN, counted as invalid).
    pub domain: &'static str,
    /// The published validity range (outside: computed, counted as out of range).
    pub validity: &'static str,
    /// Original reference(s).
    pub reference: &'static str,
    /// DOI of the first paper `reference` names that has one, or "" when none has.
    pub doi: &'static str,
    /// What was checked against which source, and what was not.
    pub verification: &'static str,
}

/// A published model as a pure scalar function of `N` float inputs giving `M`
/// float outputs.
///
/// Contract for implementors:
/// * [`Kernel::eval`] is pure, allocation-free and never panics. It returns NaN
///   outputs where [`Kernel::possible`] is false, and propagates NaN inputs.
/// * A NaN output for a *possible* input is a legitimate "no answer" of the
///   model (for example no active cavity); it is not counted as invalid.
/// * [`Kernel::in_range`] is only consulted for possible, NaN-free inputs.
pub trait Kernel<const N: usize, const M: usize> {
    /// The model's facts.
    const MODEL: Model;
    /// The bound on the magnitude of each input that [`within`] adds to
    /// every kernel's own range, from [`INPUT_BOUNDS`] by input name
    /// ([`TENSION_MAX`] for a liquid's surface tension, [`SOLID_ENERGY_MAX`]
    /// for a solid's surface energy, [`HAMAKER_MAX`], [`DROP_WIDTH_MAX`],
    /// [`DROP_MASS_MAX`], [`ROUGHNESS_MAX`]); infinite for every other input.
    const BOUNDS: [f64; N] = input_bounds::<N>(Self::MODEL.inputs);
    /// The outputs for one element.
    fn eval(x: &[f64; N]) -> [f64; M];
    /// The outputs for one element evaluated on its own (the scalar entry
    /// point, [`evaluate`]): bit for bit those of `eval`. A kernel overrides
    /// it only where one element may stop early and a loop over an array may
    /// not (an iteration that reaches its fixed point).
    #[inline(always)]
    fn eval_one(x: &[f64; N]) -> [f64; M] {
        Self::eval(x)
    }
    /// Whether the inputs are physically possible.
    ///
    /// Implementations of this and [`Kernel::in_range`] carry
    /// `#[inline(always)]`: the block loops of the binding call both for
    /// every element, and one call that is not inlined keeps the whole loop
    /// scalar (a range check that recomputes a cube root cost 20 times the
    /// vectorised kernel).
    fn possible(x: &[f64; N]) -> bool;
    /// Whether possible inputs lie inside the published validity range.
    #[inline(always)]
    fn in_range(_x: &[f64; N]) -> bool {
        true
    }
    /// [`Kernel::in_range`] given the outputs `y = eval(x)`, which the loops
    /// and [`evaluate`] have at hand. A kernel whose range is stated on its
    /// result (a site density, a film thickness, a superheat) overrides this
    /// and defines `in_range(x)` as `in_range_with(x, &Self::eval(x))`, so
    /// that the result is not computed a second time for the check.
    #[inline(always)]
    fn in_range_with(x: &[f64; N], _y: &[f64; M]) -> bool {
        Self::in_range(x)
    }
    /// The outputs of a block of `B` elements, `y[m][j] = eval(&at(j))[m]`
    /// bit for bit, with what the binding's loops need to settle the block
    /// ([`BlockSummary`]); its first `len` elements are live, the rest repeat
    /// one of them. The loops evaluate arrays through this, one block at a
    /// time. The default is one loop over the elements, which the compiler
    /// vectorises across them, with the summary folded into the same loop
    /// so that each element's inputs are read once. A kernel
    /// solved by iteration overrides it with [`iterate_block`], which runs
    /// each step as its own pass over the block.
    #[inline(always)]
    fn eval_block<const B: usize>(at: impl Fn(usize) -> [f64; N], len: usize, y: &mut [[f64; B]; M]) -> BlockSummary
    where
        Self: Sized,
    {
        let mut sum = BlockSummary::default();
        for j in 0..B {
            let x = at(j);
            sum.add::<Self, N, M, B>(&x, Self::eval(&x), j, len, y);
        }
        sum
    }
}

/// Largest liquid surface tension [N/m] an element takes without a range
/// flag, in every kernel with such an input (one mechanism, [`within`]).
/// No liquid that boils in service comes near it: mercury, the highest of the
/// common liquids, is about 0.49 N/m at room temperature and liquid sodium
/// about 0.2 N/m at its boiling point [from memory, common practice]. A
/// larger value was almost always given in mN/m, and the models would take
/// it silently: Zuber's CHF goes as sigma^(1/4), 5.6 times too high for
/// water at 58.9 "N/m". Such elements are still computed (a molten metal may
/// mean it) but counted as outside the range, so the call warns. Solid
/// surface energies have their own, larger bound ([`SOLID_ENERGY_MAX`]).
pub const TENSION_MAX: f64 = 1.0;

/// Upper bound [N/m] of a plausible solid surface energy or interfacial
/// tension (or a component of one). A clean metal's is 1-2 J/m2, the
/// highest (refractory metals, diamond faces) about 3-6 J/m2 [from memory,
/// common practice], while a polymer's or an oxide's components typed in
/// mN/m, as tables print them, read 10-70: above the bound, a Young or OWRK
/// angle silently became 0 deg (every liquid spreads), the unsafe side for a
/// wettability-dependent CHF. Flagged like [`TENSION_MAX`], still computed.
pub const SOLID_ENERGY_MAX: f64 = 10.0;

/// The input names that hold a liquid's surface tension or a component of
/// it [N/m]. Every other `"N/m"` input belongs to a solid or an interface
/// (`sigma_sv`, `sigma_sl`, `sigma_s`, `solid_*`); the fuzz tests check that
/// every registered `"N/m"` input is one or the other.
pub const LIQUID_TENSIONS: [&str; 5] = ["sigma_lv", "sigma_l", "fluid.sigma", "liquid_dispersive", "liquid_polar"];

/// The `"N/m"` input names that are not a liquid's ([`LIQUID_TENSIONS`]).
pub const OTHER_TENSIONS: [&str; 5] = ["sigma_sv", "sigma_sl", "sigma_s", "solid_dispersive", "solid_polar"];

const fn same(a: &str, b: &str) -> bool {
    let (a, b) = (a.as_bytes(), b.as_bytes());
    if a.len() != b.len() {
        return false;
    }
    let mut i = 0;
    while i < a.len() {
        if a[i] != b[i] {
            return false;
        }
        i += 1;
    }
    true
}

/// Whether an input name is in a list (compile time).
pub const fn named(name: &str, list: &[&str]) -> bool {
    let mut i = 0;
    while i < list.len() {
        if same(name, list[i]) {
            return true;
        }
        i += 1;
    }
    false
}

/// Why [`TENSION_MAX`] flags: appended to the validity text of every model
/// with a liquid surface-tension input where that text is shown.
pub const TENSION_CLAUSE: &str =
    "liquid surface tension <= 1 N/m (mercury is 0.49 N/m; a larger value was usually given in mN/m)";

/// Why [`SOLID_ENERGY_MAX`] flags: appended like [`TENSION_CLAUSE`] where a
/// solid's surface energy or an interfacial tension is an input.
pub const SOLID_ENERGY_CLAUSE: &str =
    "solid surface energy and interfacial tension <= 10 N/m (a clean metal is 1-2 J/m2; a larger value was usually \
     given in mN/m)";

/// Upper bound \[J\] of the magnitude of a plausible Hamaker constant. Real
/// ones lie between about 1e-21 J (across water) and 5e-19 J (metals)
/// [from memory, common practice: Israelachvili's and Hough & White's
/// tables]; a value typed in units of 1e-20 J, as tables print them, reads
/// 0.1-50 and gave disjoining pressures 1e20 times too high without a word.
pub const HAMAKER_MAX: f64 = 1e-17;

/// Upper bound \[m\] of a drop's contact width in the Furmidge retention
/// force. Water's capillary length is 2.7 mm and a sessile drop wider than a
/// few centimetres is a puddle [common practice]; a width typed in mm reads
/// 1-10 and gave forces a thousand times too high.
pub const DROP_WIDTH_MAX: f64 = 0.1;

/// Upper bound \[kg\] of a drop's mass in the sliding angle: 10 g is 10 mL of
/// water, a puddle [common practice]; a mass typed in mg (a 20 uL drop is
/// 20 mg) reads above it, and one typed in g for drops above 10 uL.
pub const DROP_MASS_MAX: f64 = 0.01;

/// Upper bound \[m\] of a surface roughness Rp: machined and coated heat
/// transfer surfaces lie between 0.01 and tens of micrometres [common
/// practice]; Cooper's correlation writes Rp in micrometres, and a value
/// typed so (1 for his default 1 um) reads 1 m: water at 1 atm and 1e5 W/m2
/// then boils at a superheat 639 times too small \[D\], with only Cooper's
/// whole validity text to explain it.
pub const ROUGHNESS_MAX: f64 = 1e-3;

/// One plausibility bound: the input names it applies to, the bound on
/// their magnitude, and the clause it adds to the validity text.
pub struct InputBound {
    pub names: &'static [&'static str],
    pub max: f64,
    pub clause: &'static str,
}

/// The bounds every kernel adds to its own range, by input name: each
/// catches a unit slip that the models would otherwise take silently. Such
/// elements are still computed but counted as outside the range, so the
/// call warns (a strict mode raises).
pub const INPUT_BOUNDS: [InputBound; 6] = [
    InputBound { names: &LIQUID_TENSIONS, max: TENSION_MAX, clause: TENSION_CLAUSE },
    InputBound { names: &OTHER_TENSIONS, max: SOLID_ENERGY_MAX, clause: SOLID_ENERGY_CLAUSE },
    InputBound {
        names: &["hamaker", "hamaker_solid", "hamaker_liquid"],
        max: HAMAKER_MAX,
        clause: "|Hamaker constant| <= 1e-17 J (real ones are 1e-21 to 5e-19 J; a larger value was usually given in \
                 units of 1e-20 J)",
    },
    InputBound {
        names: &["width"],
        max: DROP_WIDTH_MAX,
        clause: "drop width <= 0.1 m (a larger value was usually given in mm)",
    },
    InputBound {
        names: &["mass"],
        max: DROP_MASS_MAX,
        clause: "drop mass <= 0.01 kg (a larger value was usually given in mg or g)",
    },
    InputBound {
        names: &["roughness_Rp"],
        max: ROUGHNESS_MAX,
        clause: "roughness Rp <= 1 mm (a larger value was usually given in micrometres, as Cooper writes it)",
    },
];

/// The bound of each of `N` inputs (compile time, from a model's table): see [`Kernel::BOUNDS`].
pub const fn input_bounds<const N: usize>(inputs: &[Arg]) -> [f64; N] {
    let mut out = [f64::INFINITY; N];
    let mut i = 0;
    while i < N && i < inputs.len() {
        let mut b = 0;
        while b < INPUT_BOUNDS.len() {
            if named(inputs[i].name, INPUT_BOUNDS[b].names) {
                out[i] = INPUT_BOUNDS[b].max;
            }
            b += 1;
        }
        i += 1;
    }
    out
}

/// Whether some bound of [`input_bounds`] is finite.
pub fn any_bound(bounds: &[f64]) -> bool {
    bounds.iter().any(|b| b.is_finite())
}

impl Model {
    /// The validity range as shown to users: [`Model::validity`], plus the
    /// clause of each [`INPUT_BOUNDS`] entry that applies to one of its inputs.
    pub fn validity_text(&self) -> std::borrow::Cow<'static, str> {
        let applies = |b: &InputBound| self.inputs.iter().any(|a| named(a.name, b.names));
        if !INPUT_BOUNDS.iter().any(applies) {
            return self.validity.into();
        }
        let own = (!self.validity.is_empty()).then_some(self.validity);
        own.into_iter()
            .chain(INPUT_BOUNDS.iter().filter(|b| applies(b)).map(|b| b.clause))
            .collect::<Vec<_>>()
            .join("; ")
            .into()
    }

    /// The [`INPUT_BOUNDS`] of this model's inputs, as (input index, bound
    /// entry): what a range message needs to name the bound an element
    /// exceeded rather than the whole validity text.
    pub fn input_bounds(&self) -> impl Iterator<Item = (usize, &'static InputBound)> + '_ {
        let all: &'static [InputBound] = &INPUT_BOUNDS;
        self.inputs
            .iter()
            .enumerate()
            .flat_map(move |(i, a)| all.iter().filter(move |b| named(a.name, b.names)).map(move |b| (i, b)))
    }
}

/// Whether the inputs' magnitudes are within their bounds (`bounds`, from
/// [`input_bounds`]; for a factored side, infinite off the side). A NaN is
/// not flagged here (the loops report it as missing).
#[inline(always)]
fn inputs_plausible<const N: usize>(bounds: &[f64; N], x: &[f64; N]) -> bool {
    let mut ok = true;
    for k in 0..N {
        ok &= !(x[k].abs() > bounds[k]);
    }
    ok
}

/// Whether some input of one element is above its bound ([`INPUT_BOUNDS`]):
/// the count of such out-of-range elements lets a range message name the
/// bound instead of the model's whole range.
#[inline(always)]
pub fn beyond_bounds<K: Kernel<N, M>, const N: usize, const M: usize>(x: &[f64; N]) -> bool {
    !inputs_plausible(&K::BOUNDS, x)
}

/// Whether some live element of a block (the first `len` of `B`) has an
/// input above its bound ([`INPUT_BOUNDS`]). The binding's block loops
/// ask this beside [`Kernel::eval_block`] and settle such a block element by
/// element through [`within`], as they do a block with a NaN output: the
/// bound is then one compare per element of the bounded columns, read from
/// the block just loaded, and no work at all for kernels without such an
/// input (a compare inside every kernel's vectorised loop cost up to 45 %,
/// the Furmidge sliding angle's).
#[inline(always)]
pub fn bound_outlier<K: Kernel<N, M>, const N: usize, const M: usize, const B: usize>(
    at: impl Fn(usize) -> [f64; N],
    len: usize,
) -> bool {
    if !any_bound(&K::BOUNDS) {
        return false;
    }
    let mut any = false;
    for j in 0..B {
        let x = at(j);
        any |= !inputs_plausible(&K::BOUNDS, &x) & (j < len);
    }
    any
}

/// Whether a possible element lies inside its kernel's range, given its
/// outputs `y = eval(x)`: the kernel's own [`Kernel::in_range_with`] and the
/// bounds on some inputs common to all kernels ([`INPUT_BOUNDS`]). Every
/// loop, the scalar entry point and [`classify`] decide "out of range"
/// through this or [`within_x`], never through `in_range` alone.
#[inline(always)]
pub fn within<K: Kernel<N, M>, const N: usize, const M: usize>(x: &[f64; N], y: &[f64; M]) -> bool {
    K::in_range_with(x, y) & inputs_plausible(&K::BOUNDS, x)
}

/// [`within`] without the outputs at hand.
#[inline(always)]
pub fn within_x<K: Kernel<N, M>, const N: usize, const M: usize>(x: &[f64; N]) -> bool {
    K::in_range(x) & inputs_plausible(&K::BOUNDS, x)
}

/// What the binding's loops learn while evaluating a block: whether any
/// output is NaN (the block then needs the full settling of each element)
/// and how many live elements lie outside the kernel's own range
/// ([`Kernel::in_range_with`]; all there is to count when no output is NaN
/// and no input exceeds its bound ([`INPUT_BOUNDS`]), which the loops
/// check apart, see [`bound_outlier`]).
#[derive(Debug, Clone, Copy, Default, PartialEq, Eq)]
pub struct BlockSummary {
    pub any_nan: bool,
    pub out_of_range: u64,
}

impl BlockSummary {
    /// Store the outputs `v = eval(x)` of element `j` and count them, branch-free
    /// (sweeps straddle range limits at random; elements from `len` on are not live).
    #[inline(always)]
    pub fn add<K: Kernel<N, M>, const N: usize, const M: usize, const B: usize>(
        &mut self,
        x: &[f64; N],
        v: [f64; M],
        j: usize,
        len: usize,
        y: &mut [[f64; B]; M],
    ) {
        for m in 0..M {
            y[m][j] = v[m];
            self.any_nan |= v[m].is_nan();
        }
        self.out_of_range += (!K::in_range_with(x, &v) & (j < len)) as u64;
    }
}

/// A kernel solved by iteration, as a state of `S` floats per element: made
/// from the inputs, stepped until it settles, turned into the outputs.
///
/// [`iterate_one`] runs one element and [`iterate_block`] a block of them;
/// the two give the same bits, because of this contract on `step`: once it
/// reports a state settled (a fixed point, or a state whose outputs are NaN
/// whatever follows), every further step leaves [`Iteration::finish`]'s
/// result unchanged.
///
/// Why two forms: a loop over elements that iterates inside each element
/// vectorises only with every step written out and no exit, and then runs
/// the worst case for every element as one long chain of dependent
/// operations, which the processor cannot overlap across elements (the exact
/// embryo superheat: 100 ns per element on one AVX-512 thread). Step by step
/// over a whole block, each pass is short and vectorises, and the block stops
/// as soon as all of its elements have settled (38 ns).
///
/// With no steps (`MAX_STEPS = 0`, `step` left to its default) the same
/// machinery splits a closed form in two passes, `start` and `finish`. That
/// pays where one element is a long chain of dependent operations, such as
/// the logarithm feeding the exponential of `x^y`: the processor overlaps
/// only a few elements of such a chain, and many of each half (Lemmert-Chawla
/// on one AVX-512 thread: 4.1 ns per element in one pass, 3.0 in two).
pub trait Iteration<const N: usize, const M: usize, const S: usize> {
    /// Steps after which an element that has not settled is left as it is
    /// (`finish` then decides whether it has an answer).
    const MAX_STEPS: usize;
    /// The state before the first step.
    fn start(x: &[f64; N]) -> [f64; S];
    /// One step: the next state, and whether it has settled. The default, a
    /// state that is already settled, serves the two-pass form.
    #[inline(always)]
    fn step(s: &[f64; S]) -> ([f64; S], bool) {
        (*s, true)
    }
    /// The outputs from the inputs and the last state.
    fn finish(x: &[f64; N], s: &[f64; S]) -> [f64; M];
}

/// One element of an [`Iteration`]: steps until the state settles or
/// `MAX_STEPS` have run.
#[inline(always)]
pub fn iterate_one<I: Iteration<N, M, S>, const N: usize, const M: usize, const S: usize>(x: &[f64; N]) -> [f64; M] {
    let mut s = I::start(x);
    for _ in 0..I::MAX_STEPS {
        let (next, settled) = I::step(&s);
        s = next;
        if settled {
            break;
        }
    }
    I::finish(x, &s)
}

/// A block of `B` elements of an [`Iteration`], as [`Kernel::eval_block`] for
/// the kernel `K` it solves: outputs bit for bit those of [`iterate_one`]
/// (see the contract there). Each step is a pass over the whole block (a
/// short loop that vectorises across elements), and the block stops after
/// the first pass in which every element was settled.
#[inline(always)]
#[allow(clippy::needless_range_loop)] // j indexes every column of the state
pub fn iterate_block<K, I, const N: usize, const M: usize, const S: usize, const B: usize>(
    at: impl Fn(usize) -> [f64; N],
    len: usize,
    y: &mut [[f64; B]; M],
) -> BlockSummary
where
    K: Kernel<N, M>,
    I: Iteration<N, M, S>,
{
    let mut st = [[0.0f64; B]; S];
    for j in 0..B {
        let s0 = I::start(&at(j));
        for k in 0..S {
            st[k][j] = s0[k];
        }
    }
    for _ in 0..I::MAX_STEPS {
        let mut moving = false;
        for j in 0..B {
            let (next, settled) = I::step(&std::array::from_fn(|k| st[k][j]));
            for k in 0..S {
                st[k][j] = next[k];
            }
            moving |= !settled;
        }
        if !moving {
            break;
        }
    }
    let mut sum = BlockSummary::default();
    for j in 0..B {
        let x = at(j);
        sum.add::<K, N, M, B>(&x, I::finish(&x, &std::array::from_fn(|k| st[k][j])), j, len, y);
    }
    sum
}

/// A kernel in product form: every output is a factor of the *surface*
/// inputs (side 0: contact angles, orientation) times a factor of the others
/// (side 1: fluid properties, heat flux, gravity). Most wettability models
/// are such an angle factor times a fluid group, and a sweep over angles x
/// pressures then needs each factor once per point of its own axis and one
/// multiplication per grid point, which is what the binding's factorised grid
/// path does.
///
/// Contract (checked for every factored kernel by the tests of this module):
/// * `eval(x)[m] == factor(0, x)[m] * factor(1, x)[m]` bit for bit, so the
///   factorised path and the element path give identical numbers;
/// * `factor(s, x)` reads only the inputs with `SIDES[k] == s`, and is NaN
///   where `side_possible(s, x)` is false;
/// * `possible(x) == side_possible(0, x) && side_possible(1, x)`, and the same
///   for `in_range` with `side_in_range`.
pub trait Factored<const N: usize, const M: usize>: Kernel<N, M> {
    /// The side (0 or 1) of each input.
    const SIDES: [u8; N];
    /// The factor of side `s` of each output.
    fn factor(s: u8, x: &[f64; N]) -> [f64; M];
    /// Whether the inputs of side `s` are physically possible.
    fn side_possible(s: u8, x: &[f64; N]) -> bool;
    /// Whether the inputs of side `s` lie inside the published range.
    #[inline(always)]
    fn side_in_range(_s: u8, _x: &[f64; N]) -> bool {
        true
    }
}

/// Validity code of one side of a factored kernel's element, with the codes
/// of [`classify`]: 3 when an input of the side is NaN, else 1 impossible,
/// 2 out of range, 0 inside. The element's own code is the combination
/// (3 if either side is 3, else 1 if either is 1, else 2 if either is 2).
#[inline(always)]
pub fn classify_side<K: Factored<N, M>, const N: usize, const M: usize>(s: u8, x: &[f64; N]) -> i8 {
    if (0..N).any(|k| K::SIDES[k] == s && x[k].is_nan()) {
        3
    } else if !K::side_possible(s, x) {
        1
    } else if !within_side::<K, N, M>(s, x) {
        2
    } else {
        0
    }
}

/// [`within_x`] for side `s` of a factored kernel: its own
/// [`Factored::side_in_range`] and the [`INPUT_BOUNDS`] of the side's inputs.
#[inline(always)]
pub fn within_side<K: Factored<N, M>, const N: usize, const M: usize>(s: u8, x: &[f64; N]) -> bool {
    let bounds: [f64; N] = std::array::from_fn(|k| if K::SIDES[k] == s { K::BOUNDS[k] } else { f64::INFINITY });
    K::side_in_range(s, x) & inputs_plausible(&bounds, x)
}

/// Outcome of one element, as the generic loops count it.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Status {
    /// Computed, inputs possible and in range (or a NaN input propagated).
    Ok,
    /// Physically impossible input: outputs are NaN.
    Invalid,
    /// Computed, but outside the published validity range.
    OutOfRange,
}

/// Evaluate one element and classify it. Generic over every kernel; the ufunc
/// loop and the scalar entry point both go through here, so they agree to the
/// last bit.
///
/// The common case (all outputs numbers) costs one range check: a kernel
/// returns NaN for impossible input, so a NaN-free result came from a possible
/// one. Only NaN results take the slower classification.
#[inline(always)]
pub fn evaluate<K: Kernel<N, M>, const N: usize, const M: usize>(x: &[f64; N]) -> ([f64; M], Status) {
    settle::<K, N, M>(x, K::eval_one(x))
}

/// Classify the outputs `y = K::eval(x)` of one element (and blank them when
/// the input is impossible). [`evaluate`] is `settle(x, eval(x))`; the block
/// loops of the binding evaluate a whole block first, so the kernel
/// vectorises, and then settle each element with this same function.
#[inline(always)]
pub fn settle<K: Kernel<N, M>, const N: usize, const M: usize>(x: &[f64; N], y: [f64; M]) -> ([f64; M], Status) {
    if !y.iter().any(|v| v.is_nan()) {
        let status = if within::<K, N, M>(x, &y) { Status::Ok } else { Status::OutOfRange };
        return (y, status);
    }
    if x.iter().any(|v| v.is_nan()) {
        (y, Status::Ok)
    } else if !K::possible(x) {
        ([f64::NAN; M], Status::Invalid)
    } else if !within::<K, N, M>(x, &y) {
        (y, Status::OutOfRange)
    } else {
        (y, Status::Ok)
    }
}

/// `value` where `ok`, NaN elsewhere: the branch-free form of a kernel's
/// "impossible input gives NaN" guard. An early `return f64::NAN` inside a
/// kernel stops the compiler from vectorising the block loops; computing the
/// value unconditionally (NaN-safe arithmetic, no traps) and selecting at the
/// end does not.
#[inline(always)]
pub fn nan_unless(ok: bool, value: f64) -> f64 {
    if ok {
        value
    } else {
        f64::NAN
    }
}

/// [`nan_unless`] for kernels with several outputs.
#[inline(always)]
pub fn nans_unless<const M: usize>(ok: bool, values: [f64; M]) -> [f64; M] {
    values.map(|v| nan_unless(ok, v))
}

/// Validity code of one element, without computing it: 0 inside the published
/// range, 1 physically impossible, 2 possible but outside the published range,
/// 3 missing (a NaN input). Agrees with [`evaluate`]'s status for kernels that
/// honour the [`Kernel`] contract (checked by the property tests).
#[inline(always)]
pub fn classify<K: Kernel<N, M>, const N: usize, const M: usize>(x: &[f64; N]) -> i8 {
    if x.iter().any(|v| v.is_nan()) {
        3
    } else if !K::possible(x) {
        1
    } else if !within_x::<K, N, M>(x) {
        2
    } else {
        0
    }
}

// The predicates below combine their tests with `&`, not `&&`: short-circuit
// jumps inside a kernel keep the block loops of the binding from vectorising.
// They test finiteness with float comparisons (`x < inf`), not `is_finite`,
// which LLVM lowers to a sequence of integer operations on the bits: one
// compare per test instead of five, in every element of every block.

/// True when `x` is a finite number strictly above zero.
#[inline(always)]
pub fn positive(x: f64) -> bool {
    (x > 0.0) & (x < f64::INFINITY)
}

/// True when every argument is a finite number strictly above zero:
/// `positive(a) & positive(b) & ...`, computed in the floating-point lanes.
/// Each comparison of a vector of doubles yields a 256-bit mask, and joining
/// many masks with `&` makes the compiler narrow every one of them first (a
/// third of a Rohsenow evaluation went into that). Here two comparisons settle
/// any number of values: their minimum is above zero (for non-NaN values the
/// plain `a < b ? a : b` minimum, one instruction, is exact), and the sum of
/// `x * 0` is zero (it is NaN as soon as one value is infinite or NaN,
/// whatever the minimum did with it). A macro, not a function over an array:
/// a loop inside the block loops of the binding would stop them vectorising.
///
/// `all_positive!(a, b; c, d)` also requires the values after the semicolon
/// to be finite and not negative (one more comparison).
#[macro_export]
macro_rules! all_positive {
    ($first:expr $(, $rest:expr)* ; $($nn:expr),+ $(,)?) => {{
        let nn = $crate::all_positive!(@fold $($nn),+);
        let pos = $crate::all_positive!(@fold $first $(, $rest)*);
        (pos.0 > 0.0) & (nn.0 >= 0.0) & (pos.1 + nn.1 == 0.0)
    }};
    ($first:expr $(, $rest:expr)* $(,)?) => {{
        let pos = $crate::all_positive!(@fold $first $(, $rest)*);
        (pos.0 > 0.0) & (pos.1 == 0.0)
    }};
    // (minimum, sum of x * 0)
    (@fold $first:expr $(, $rest:expr)*) => {{
        let first: f64 = $first;
        let lo = first;
        let zero = first * 0.0;
        $(
            let x: f64 = $rest;
            let lo = if x < lo { x } else { lo };
            let zero = zero + x * 0.0;
        )*
        (lo, zero)
    }};
}

/// True when `x` is finite and not negative.
#[inline(always)]
pub fn non_negative(x: f64) -> bool {
    (x >= 0.0) & (x < f64::INFINITY)
}

/// True when `x` is a finite number.
#[inline(always)]
pub fn finite(x: f64) -> bool {
    x.abs() < f64::INFINITY
}

/// True for a contact angle in degrees inside [0, 180].
#[inline(always)]
pub fn angle_deg(x: f64) -> bool {
    (x >= 0.0) & (x <= 180.0)
}

/// True when the densities describe a liquid denser than its vapour.
#[inline(always)]
pub fn densities(rho_l: f64, rho_v: f64) -> bool {
    positive(rho_l) & non_negative(rho_v) & (rho_l > rho_v)
}

/// Standard acceleration of gravity [m/s2] (CGPM 1901, exact by definition).
pub const G_STANDARD: f64 = 9.80665;

/// Check the [`Factored`] contract of `K` at `x` (for the kernel modules'
/// tests): panics with a message naming the kernel on any violation.
#[cfg(test)]
pub fn check_factored<K: Factored<N, M>, const N: usize, const M: usize>(x: &[f64; N]) {
    let name = K::MODEL.name;
    let (a, b) = (K::factor(0, x), K::factor(1, x));
    let y = K::eval(x);
    for m in 0..M {
        let p = a[m] * b[m];
        assert!(
            p.to_bits() == y[m].to_bits() || (p.is_nan() && y[m].is_nan()),
            "{name}: eval {:e} != factor product {:e} at {x:?}",
            y[m],
            p
        );
    }
    assert_eq!(K::possible(x), K::side_possible(0, x) && K::side_possible(1, x), "{name}: possible at {x:?}");
    if K::possible(x) {
        assert_eq!(K::in_range(x), K::side_in_range(0, x) && K::side_in_range(1, x), "{name}: in_range at {x:?}");
        assert_eq!(
            within_x::<K, N, M>(x),
            within_side::<K, N, M>(0, x) && within_side::<K, N, M>(1, x),
            "{name}: within at {x:?}"
        );
    }
    for s in 0..2u8 {
        let f = K::factor(s, x);
        if !K::side_possible(s, x) {
            assert!(f.iter().all(|v| v.is_nan()), "{name}: factor {s} not NaN for impossible inputs {x:?}");
        }
        // the other side's inputs must not matter
        let mut z = *x;
        for k in 0..N {
            if K::SIDES[k] != s {
                z[k] = if z[k] == 1.5 { 2.5 } else { 1.5 };
            }
        }
        let g = K::factor(s, &z);
        for m in 0..M {
            assert!(
                f[m].to_bits() == g[m].to_bits() || (f[m].is_nan() && g[m].is_nan()),
                "{name}: factor {s} reads the other side's inputs at {x:?}"
            );
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    struct Half;
    impl Kernel<1, 1> for Half {
        const MODEL: Model = Model {
            name: "half",
            summary: "",
            equation: "y = x/2",
            inputs: &[arg("x", "-")],
            outputs: &[arg("y", "-")],
            domain: "x >= 0",
            validity: "x <= 10",
            reference: "",
            doi: "",
            verification: "",
        };
        fn eval(x: &[f64; 1]) -> [f64; 1] {
            [if x[0] >= 0.0 { x[0] / 2.0 } else { f64::NAN }]
        }
        #[inline(always)]
        fn possible(x: &[f64; 1]) -> bool {
            x[0] >= 0.0
        }
        #[inline(always)]
        fn in_range(x: &[f64; 1]) -> bool {
            x[0] <= 10.0
        }
    }

    #[test]
    fn classification() {
        assert_eq!(evaluate::<Half, 1, 1>(&[4.0]), ([2.0], Status::Ok));
        assert_eq!(evaluate::<Half, 1, 1>(&[20.0]), ([10.0], Status::OutOfRange));
        let (y, s) = evaluate::<Half, 1, 1>(&[-1.0]);
        assert!(y[0].is_nan());
        assert_eq!(s, Status::Invalid);
        // NaN input is missing data: propagated, not counted.
        let (y, s) = evaluate::<Half, 1, 1>(&[f64::NAN]);
        assert!(y[0].is_nan());
        assert_eq!(s, Status::Ok);
    }

    /// Special values for the predicate truth tables: NaN, infinities, signed zeros, subnormals, extremes.
    const SPECIAL: [f64; 11] =
        [f64::NAN, f64::NEG_INFINITY, -1.0, -0.0, 0.0, 5e-324, 1e-300, 1.0, 2.5, 1e308, f64::INFINITY];

    /// `all_positive!` has the truth table of the chains of `positive`/`non_negative` it replaces, and
    /// `rho_l - rho_v` among its positive values that of `densities(rho_l, rho_v)` with rho_v after the
    /// semicolon (or among the positive values, for the kernels that also require rho_v > 0).
    #[test]
    fn all_positive_truth_table() {
        for &a in &SPECIAL {
            for &b in &SPECIAL {
                assert_eq!(crate::all_positive!(a, b), positive(a) & positive(b), "{a} {b}");
                assert_eq!(crate::all_positive!(a; b), positive(a) & non_negative(b), "{a}; {b}");
                for &c in &SPECIAL {
                    assert_eq!(crate::all_positive!(a, b, c), positive(a) & positive(b) & positive(c), "{a} {b} {c}");
                    assert_eq!(
                        crate::all_positive!(a, b; c),
                        positive(a) & positive(b) & non_negative(c),
                        "{a} {b}; {c}"
                    );
                    assert_eq!(
                        crate::all_positive!(a; b, c),
                        positive(a) & non_negative(b) & non_negative(c),
                        "{a}; {b} {c}"
                    );
                    // finite(c) as |c| among the values after the semicolon (power_law finish)
                    assert_eq!(
                        crate::all_positive!(a, b; c.abs()),
                        positive(a) & positive(b) & finite(c),
                        "{a} {b}; |{c}|"
                    );
                    // (sigma, rho_l, rho_v) as in capillary_possible and ki_fluid_possible
                    let (sigma, rho_l, rho_v) = (a, b, c);
                    assert_eq!(
                        crate::all_positive!(sigma, rho_l - rho_v; rho_v),
                        positive(sigma) & densities(rho_l, rho_v),
                        "sigma {a} rho_l {b} rho_v {c}"
                    );
                    assert_eq!(
                        crate::all_positive!(sigma, rho_v, rho_l - rho_v),
                        positive(sigma) & densities(rho_l, rho_v) & positive(rho_v),
                        "sigma {a} rho_l {b} rho_v {c}"
                    );
                    // (hamaker, rho_l, rho_v) as in film_possible, every sign of hamaker
                    for hamaker in SPECIAL.iter().flat_map(|&h| [h, -h]) {
                        assert_eq!(
                            crate::all_positive!(1.0, -hamaker, 1.0, rho_l - rho_v; rho_v),
                            (hamaker < 0.0) & finite(hamaker) & densities(rho_l, rho_v),
                            "hamaker {hamaker} rho_l {b} rho_v {c}"
                        );
                    }
                    // (p, p_crit) as in cooper_possible
                    let (p, p_crit) = (b, c);
                    assert_eq!(
                        crate::all_positive!(a, p, p_crit - p),
                        positive(a) & positive(p) & positive(p_crit) & (p < p_crit),
                        "{a} p {b} p_crit {c}"
                    );
                }
            }
        }
    }
}
