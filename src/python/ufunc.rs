//! The one generic mechanism: any [`Kernel`] becomes a NumPy ufunc (float64
//! loop, `N` inputs, `M` outputs) and a scalar entry point.
//!
//! The loop is written once, generically over the kernel type, so each kernel's
//! scalar function is inlined into its own monomorphised loop. The unsafe code
//! is confined to this file: reading and writing the raw strided buffers NumPy
//! hands over, and building the ufunc object from `'static` tables.

use std::cell::Cell;
use std::ffi::{c_char, c_int, c_void, CString};
use std::panic::{catch_unwind, AssertUnwindSafe};

use numpy::npyffi::{npy_intp, PyUFuncGenericFunction, NPY_TYPES, PY_UFUNC_API};
use pyo3::prelude::*;
use rayon::prelude::*;

use super::threads;
use crate::model::{classify, classify_side, evaluate, Factored, Kernel, Model, Status};
use crate::simd;

/// `fn name<K, N, M>(args) -> R` running `body::<K, N, M>` in a clone compiled
/// for AVX2 and FMA where the CPU has them (see [`simd::level`]), else in
/// baseline code. For the kernel evaluations outside the block loops (the
/// scalar entry point, the status ufunc, the factor sides of the grid path):
/// `fastmath`'s fused multiply-adds are one instruction each in the clone,
/// and calls to the software `fma` in baseline x86-64 code. The same bits
/// either way.
macro_rules! fma_clone {
    ($(#[$meta:meta])* fn $name:ident / $clone:ident <K: $bound:ident> ($($a:ident: $t:ty),*) -> $r:ty = $body:ident) => {
        $(#[$meta])*
        fn $name<K: $bound<N, M>, const N: usize, const M: usize>($($a: $t),*) -> $r {
            #[cfg(target_arch = "x86_64")]
            if simd::level() >= simd::AVX2 {
                // SAFETY: the CPU has the features the clone was compiled for.
                return unsafe { $clone::<K, N, M>($($a),*) };
            }
            $body::<K, N, M>($($a),*)
        }

        /// The clone of the function of the same body, compiled for AVX2 and FMA.
        ///
        /// # Safety
        /// The CPU must support AVX2 and FMA.
        #[cfg(target_arch = "x86_64")]
        #[target_feature(enable = "avx2,fma")]
        unsafe fn $clone<K: $bound<N, M>, const N: usize, const M: usize>($($a: $t),*) -> $r {
            $body::<K, N, M>($($a),*)
        }
    };
}

type LoopFn = unsafe extern "C" fn(*mut *mut c_char, *mut npy_intp, *mut npy_intp, *mut c_void);

/// Inputs per kernel that the scalar entry point can take (and the registry
/// allows): ufunc loops themselves have no such limit.
pub const MAX_IN: usize = 24;
/// Outputs per kernel that the scalar entry point can return.
pub const MAX_OUT: usize = 16;

// Element counts of the last calls on this thread: `[invalid, out_of_range]`.
//
// NumPy runs a ufunc's inner loop on the thread that called the ufunc, so a
// thread-local keeps concurrent Python threads apart; rayon workers report
// their counts back through the join, never through this cell.
thread_local! {
    static COUNTS: Cell<Counts> = const { Cell::new([0; 3]) };
}

/// Element counts of a call: `[invalid, out_of_range, beyond_bounds]`, the
/// last the out-of-range elements with an input above its unit-slip bound
/// ([`crate::model::INPUT_BOUNDS`]), so that the range message names that
/// bound without reading the inputs again.
pub type Counts = [u64; 3];

/// The counts of two parts of a call.
#[inline]
pub fn plus(a: Counts, b: Counts) -> Counts {
    [a[0] + b[0], a[1] + b[1], a[2] + b[2]]
}

/// Return and reset this thread's counts.
pub fn take_counts() -> Counts {
    COUNTS.with(|c| c.replace([0; 3]))
}

fn add_counts(n: Counts) {
    COUNTS.with(|c| c.set(plus(c.get(), n)));
}

/// A registered kernel, type-erased.
pub struct Entry {
    pub model: Model,
    pub nin: usize,
    pub nout: usize,
    loop_fn: LoopFn,
    status_fn: LoopFn,
    /// Evaluate over a broadcast grid (see [`GridCall`]).
    pub grid: fn(&GridCall<'_>) -> Counts,
    /// Evaluate one element: the first `nin` entries of `x` in, the first
    /// `nout` of `y` out (fixed-size arrays: no slicing or bounds checks on the
    /// scalar fast path).
    pub scalar: fn(&[f64; MAX_IN], &mut [f64; MAX_OUT]) -> Status,
    /// For kernels in product form ([`Factored`]): the side of each input,
    /// and the evaluation of one side's factors (see [`Sides`]).
    pub sides: Option<Sides>,
}

/// The product form of a factored kernel, type-erased.
pub struct Sides {
    /// Side (0 or 1) of each input.
    pub of_input: Vec<u8>,
    /// `eval(s, ins, outs, codes)`: for each of `codes.len()` points, the
    /// factors of side `s` into `outs` (one slice per output) and the side's
    /// validity code (see `model::classify_side`) into `codes`. Each input
    /// slice has one element per point, or a single element for all.
    pub eval: fn(u8, &[&[f64]], &mut [&mut [f64]], &mut [i8]),
}

/// Build the registry entry of a kernel: the only thing a new model adds to
/// the binding is one call of this function in `registry.rs`.
pub fn entry<K: Kernel<N, M>, const N: usize, const M: usize>() -> Entry {
    const { assert!(N >= 1 && N <= MAX_IN && M >= 1 && M <= MAX_OUT) };
    Entry {
        model: K::MODEL,
        nin: N,
        nout: M,
        loop_fn: ufunc_loop::<K, N, M>,
        status_fn: status_loop::<K, N, M>,
        grid: grid_eval::<K, N, M>,
        scalar: scalar::<K, N, M>,
        sides: None,
    }
}

/// The registry entry of a kernel in product form: as [`entry`], plus its
/// factors for the factorised grid path.
pub fn factored<K: Factored<N, M>, const N: usize, const M: usize>() -> Entry {
    Entry { sides: Some(Sides { of_input: K::SIDES.to_vec(), eval: side_eval::<K, N, M> }), ..entry::<K, N, M>() }
}

fma_clone! {
/// One factor side of a kernel in product form over its axis points, and their validity codes.
fn side_eval / side_eval_avx2 <K: Factored> (s: u8, ins: &[&[f64]], outs: &mut [&mut [f64]], codes: &mut [i8]) -> () =
    side_eval_body
}

#[inline(always)]
fn side_eval_body<K: Factored<N, M>, const N: usize, const M: usize>(
    s: u8,
    ins: &[&[f64]],
    outs: &mut [&mut [f64]],
    codes: &mut [i8],
) {
    if ins.len() != N || outs.len() != M {
        return;
    }
    for i in 0..codes.len() {
        let x: [f64; N] = std::array::from_fn(|k| if ins[k].len() == 1 { ins[k][0] } else { ins[k][i] });
        let y = K::factor(s, &x);
        for m in 0..M {
            outs[m][i] = y[m];
        }
        codes[i] = classify_side::<K, N, M>(s, &x);
    }
}

/// Multiplication, the combining step of the factorised grid path. Not a
/// model: it is never registered, only run through [`product_grid`].
struct Product;
impl Kernel<2, 1> for Product {
    const MODEL: Model = Model {
        name: "product",
        summary: "a * b",
        equation: "a * b",
        inputs: &[],
        outputs: &[],
        domain: "",
        validity: "",
        reference: "",
        doi: "",
        verification: "",
    };
    #[inline(always)]
    fn eval(x: &[f64; 2]) -> [f64; 1] {
        [x[0] * x[1]]
    }
    fn possible(_x: &[f64; 2]) -> bool {
        true
    }
}

/// `out = a * b` over a broadcast grid, through the generic parallel grid
/// loop (`call` has two inputs and one output).
pub fn product_grid(call: &GridCall<'_>) -> Counts {
    grid_eval::<Product, 2, 1>(call)
}

fma_clone! {
/// The scalar entry point.
fn scalar / scalar_avx2 <K: Kernel> (x: &[f64; MAX_IN], y: &mut [f64; MAX_OUT]) -> Status = scalar_body
}

#[inline(always)]
fn scalar_body<K: Kernel<N, M>, const N: usize, const M: usize>(x: &[f64; MAX_IN], y: &mut [f64; MAX_OUT]) -> Status {
    // N <= MAX_IN and M <= MAX_OUT (checked in `entry`): constant indices, no bounds checks.
    // One 8-byte load per input: the caller has just stored them one by one, and a wider load that the
    // compiler would otherwise combine them into cannot be forwarded from those stores (it waits until
    // they reach the cache, about 15 cycles, on every call).
    // SAFETY: `&x[k]` is a valid, aligned reference.
    let xa: [f64; N] = std::array::from_fn(|k| unsafe { std::ptr::read_volatile(&x[k]) });
    let (out, status) = evaluate::<K, N, M>(&xa);
    y[..M].copy_from_slice(&out);
    status
}

/// The raw operands of one inner-loop call: base pointers and byte strides.
#[derive(Clone, Copy)]
struct Operands<const N: usize, const M: usize> {
    ins: [*const u8; N],
    in_steps: [isize; N],
    outs: [*mut u8; M],
    out_steps: [isize; M],
    /// Write full contiguous output blocks with non-temporal stores: set for
    /// calls whose outputs are far larger than the caches (see [`STREAM_MIN`]).
    stream: bool,
}

// SAFETY: the pointers refer to buffers NumPy keeps alive for the duration of
// the inner-loop call, and threads only ever touch disjoint index ranges of
// the outputs (see `run_parallel`), so sharing the descriptor is sound.
unsafe impl<const N: usize, const M: usize> Send for Operands<N, M> {}
unsafe impl<const N: usize, const M: usize> Sync for Operands<N, M> {}

impl<const N: usize, const M: usize> Operands<N, M> {
    /// Evaluate elements `start..end` and return their counts.
    ///
    /// # Safety
    /// `start..end` must lie within the `n` elements NumPy passed, and no other
    /// thread may write the same output elements.
    #[inline(always)]
    unsafe fn run<K: Kernel<N, M>>(&self, start: isize, end: isize) -> Counts {
        #[cfg(target_arch = "x86_64")]
        match simd::level() {
            // SAFETY: the CPU has the features the clone was compiled for.
            simd::AVX512 => return unsafe { self.run_avx512::<K>(start, end) },
            simd::AVX2 => return unsafe { self.run_avx2::<K>(start, end) },
            _ => {}
        }
        unsafe { self.run_blocks::<K, 16>(start, end) }
    }

    /// [`Self::run_blocks`] compiled for AVX2 and FMA, chosen at run time so
    /// that the wheel still runs on any x86-64. Rust never contracts `a*b + c`
    /// into an FMA by itself, and explicit `mul_add`s round the same in every
    /// clone, so every clone gives bit-identical results.
    ///
    /// # Safety
    /// As for [`Self::run`], and the CPU must support AVX2 and FMA.
    #[cfg(target_arch = "x86_64")]
    #[target_feature(enable = "avx2,fma")]
    unsafe fn run_avx2<K: Kernel<N, M>>(&self, start: isize, end: isize) -> Counts {
        unsafe { self.run_blocks::<K, 32>(start, end) }
    }

    /// [`Self::run_blocks`] compiled for AVX-512 (8 lanes): twice the work
    /// per instruction for kernels whose polynomial chains (trig, exp, log)
    /// are latency-bound; bit-identical to the other clones.
    ///
    /// # Safety
    /// As for [`Self::run`], and the CPU must support AVX-512 F, DQ and VL.
    #[cfg(target_arch = "x86_64")]
    #[target_feature(enable = "avx512f,avx512dq,avx512vl,avx2,fma")]
    unsafe fn run_avx512<K: Kernel<N, M>>(&self, start: isize, end: isize) -> Counts {
        unsafe { self.run_blocks::<K, 64>(start, end) }
    }

    /// The loop itself, in blocks of [`BLOCK`] elements: read the inputs of
    /// a block (contiguous ones in place, others gathered into local arrays),
    /// evaluate the kernel over the whole block
    /// (a loop without branches or strides, which the compiler vectorises
    /// when the kernel allows it), then settle each element (validity and
    /// counts, exactly as [`evaluate`]) and scatter the outputs.
    ///
    /// # Safety
    /// As for [`Self::run`].
    #[inline(always)]
    unsafe fn run_blocks<K: Kernel<N, M>, const STORE: usize>(&self, start: isize, end: isize) -> Counts {
        let mut counts = [0u64; 3];
        let mut xb = [[0.0f64; BLOCK]; N];
        let mut yb = [[0.0f64; BLOCK]; M];
        let mut i = start;
        while i < end {
            let len = ((end - i) as usize).min(BLOCK);
            // Where each input of the block is read from: a contiguous input
            // of a full block in place (its loads then interleave with the
            // arithmetic, as in a plain loop, which keeps the memory system
            // busy); anything else is first copied into its column of `xb`.
            let mut src = [std::ptr::null::<f64>(); N];
            for k in 0..N {
                let base = unsafe { self.ins[k].offset(i * self.in_steps[k]) };
                if self.in_steps[k] == 8 && len == BLOCK {
                    src[k] = base as *const f64;
                    if self.stream {
                        prefetch_block(base.wrapping_add(PREFETCH_AHEAD));
                    }
                    continue;
                }
                if self.in_steps[k] == 0 {
                    // A broadcast operand (a grid axis, a scalar): one read.
                    xb[k].fill(unsafe { (base as *const f64).read_unaligned() });
                } else {
                    for (j, v) in xb[k][..len].iter_mut().enumerate() {
                        // Unaligned reads cost nothing on the targets we build
                        // for and keep us safe should NumPy hand over an
                        // unaligned view.
                        *v = unsafe { (base.offset(j as isize * self.in_steps[k]) as *const f64).read_unaligned() };
                    }
                    // The whole block is evaluated, tail included, so that the
                    // loop has a constant trip count. The tail repeats the
                    // block's first element: stale or zero inputs could raise
                    // floating-point flags (which NumPy reports as warnings)
                    // that the caller's data never raised. Kernels are pure
                    // and cannot trap.
                    let first = xb[k][0];
                    xb[k][len..].fill(first);
                }
                src[k] = xb[k].as_ptr();
            }
            // SAFETY (all reads through `src`): each column holds BLOCK
            // readable elements, in place (a full block inside the input
            // view) or in `xb`.
            let at = |j: usize| -> [f64; N] { std::array::from_fn(|k| unsafe { src[k].add(j).read_unaligned() }) };
            // The outputs, whether any is NaN and the range count (the common
            // case of `settle`: when every output of the block is a number,
            // only the range check remains); the tail of a short block
            // repeats its first element and is not counted.
            let sum = K::eval_block(at, len, &mut yb);
            // (an input above its bound, a unit slip, is rare: such a block
            // is settled element by element with the bounds, others without)
            let outlier = crate::model::bound_outlier::<K, N, M, BLOCK>(at, len);
            if outlier {
                counts = settle_bounded::<K, N, M>(at, &mut yb, len, counts);
            } else if !sum.any_nan {
                counts[1] += sum.out_of_range;
            } else {
                counts = settle_block::<K, N, M, false>(at, &mut yb, len, counts);
            }
            for k in 0..M {
                let base = unsafe { self.outs[k].offset(i * self.out_steps[k]) };
                if self.out_steps[k] == 8 {
                    // SAFETY: `len` contiguous elements of the output view.
                    let src = yb[k].as_ptr() as *const u8;
                    if len == BLOCK && self.stream && base as usize % STORE == 0 {
                        unsafe { stream_block::<STORE>(yb[k].as_ptr(), base as *mut f64) };
                    } else if len == BLOCK && self.stream && base as usize % 16 == 0 {
                        // an output NumPy allocated (16-byte aligned): the narrow stores
                        unsafe { stream_block::<16>(yb[k].as_ptr(), base as *mut f64) };
                    } else if len == BLOCK {
                        unsafe { std::ptr::copy_nonoverlapping(src, base, 8 * BLOCK) };
                    } else {
                        unsafe { std::ptr::copy_nonoverlapping(src, base, 8 * len) };
                    }
                } else {
                    for (j, v) in yb[k][..len].iter().enumerate() {
                        unsafe { (base.offset(j as isize * self.out_steps[k]) as *mut f64).write_unaligned(*v) };
                    }
                }
            }
            i += len as isize;
        }
        if self.stream {
            // Order the non-temporal stores before the results are handed back.
            #[cfg(target_arch = "x86_64")]
            unsafe {
                std::arch::x86_64::_mm_sfence()
            };
        }
        counts
    }
}

/// Outputs of at least this many elements (32 MiB each, the size of the
/// L3 cache of the machines we measure on) are written with non-temporal
/// stores: the results cannot stay in cache anyway, and bypassing it saves
/// the read of every output line before its write (a sixth of the memory
/// traffic of a five-input kernel such as Fritz).
const STREAM_MIN: usize = 1 << 22;

/// How far ahead of a block its contiguous inputs are prefetched on such
/// calls [bytes]: four blocks (2 KiB). The hardware prefetcher alone lets a kernel of
/// a few ns per element wait on memory at every 4 KiB page, where it stops:
/// Lemmert-Chawla on 10^7 points ran at 4.9 ns per element on one thread
/// against 4.1 ns on 10^6 (in cache), and at 4.1 ns with this prefetch.
const PREFETCH_AHEAD: usize = 4 * 8 * BLOCK;

/// Ask for the [`BLOCK`] elements (one per cache line of 64 bytes) from `p`
/// on into the cache. A prefetch is a hint that never faults, so `p` may lie
/// past the end of the array (hence the wrapping pointer arithmetic).
#[inline(always)]
fn prefetch_block(p: *const u8) {
    #[cfg(target_arch = "x86_64")]
    for l in 0..8 * BLOCK / 64 {
        use std::arch::x86_64::{_mm_prefetch, _MM_HINT_T0};
        // SAFETY: prefetching has no architectural effect and never faults.
        unsafe { _mm_prefetch::<_MM_HINT_T0>(p.wrapping_add(64 * l) as *const i8) };
    }
    #[cfg(not(target_arch = "x86_64"))]
    let _ = p;
}

/// Copy one block to `STORE`-byte aligned memory with non-temporal stores of `STORE` bytes: 16 (SSE2, the
/// baseline), 32 (AVX) or 64 (AVX-512F). Each clone of the block loop uses its own width (a 64-byte store
/// fills a cache line's write-combining buffer at once; on the Zen 5 machine 64-byte stores write 10^7
/// doubles about 1.4x faster than 16-byte ones on one thread).
///
/// # Safety
/// `src` holds [`BLOCK`] readable elements; `dst` is `STORE`-byte aligned and holds [`BLOCK`] writable
/// elements; the CPU has the instructions of the width (the caller is the clone compiled for them).
#[inline(always)]
unsafe fn stream_block<const STORE: usize>(src: *const f64, dst: *mut f64) {
    #[cfg(target_arch = "x86_64")]
    {
        use std::arch::x86_64::*;
        // SAFETY (every arm): in bounds and aligned (see above); the features are the caller's.
        match STORE {
            64 => {
                for j in (0..BLOCK).step_by(8) {
                    unsafe { _mm512_stream_pd(dst.add(j), _mm512_loadu_pd(src.add(j))) };
                }
            }
            32 => {
                for j in (0..BLOCK).step_by(4) {
                    unsafe { _mm256_stream_pd(dst.add(j), _mm256_loadu_pd(src.add(j))) };
                }
            }
            _ => {
                for j in (0..BLOCK).step_by(2) {
                    unsafe { _mm_stream_pd(dst.add(j), _mm_loadu_pd(src.add(j))) };
                }
            }
        }
    }
    #[cfg(not(target_arch = "x86_64"))]
    unsafe {
        std::ptr::copy_nonoverlapping(src, dst, BLOCK)
    };
}

/// Elements per block of [`Operands::run_blocks`]: large enough to amortise
/// the gather and scatter, small enough that `N + M` blocks stay in L1.
const BLOCK: usize = 64;

/// Settle a block in which some output is NaN: find out, for every element,
/// whether its input was missing, impossible or out of range, and blank the
/// outputs of impossible ones. The same decisions as [`crate::model::settle`] per element,
/// written without branches over the whole block (the tail repeats the first
/// element and is masked out of the counts) so that it vectorises like the
/// kernel itself: sweeps that cross a model's "no answer" region put a NaN in
/// most blocks, and an element-by-element pass there cost more than the
/// kernel (a range check that recomputes the result, a scalar libm call).
///
/// Per element, with `y_nan`/`x_nan` "some output/input is NaN":
/// invalid = y_nan & !x_nan & !possible;
/// out of range = !in_range & (!y_nan | (!x_nan & possible)),
/// where `in_range` is [`crate::model::within`] if `BOUNDED` (the block has
/// an input above its bound) and the kernel's own range
/// otherwise, the same answer there without the compare.
#[inline(always)]
fn settle_block<K: Kernel<N, M>, const N: usize, const M: usize, const BOUNDED: bool>(
    at: impl Fn(usize) -> [f64; N],
    yb: &mut [[f64; BLOCK]; M],
    len: usize,
    counts: Counts,
) -> Counts {
    let (mut invalid, mut out_of_range, mut beyond) = (0u64, 0u64, 0u64);
    for j in 0..BLOCK {
        let x = at(j);
        let y: [f64; M] = std::array::from_fn(|k| yb[k][j]);
        let mut y_nan = false;
        for v in y {
            y_nan |= v.is_nan();
        }
        let mut x_nan = false;
        for v in x {
            x_nan |= v.is_nan();
        }
        let possible = K::possible(&x);
        let in_range = if BOUNDED { crate::model::within::<K, N, M>(&x, &y) } else { K::in_range_with(&x, &y) };
        let live = j < len;
        let blank = y_nan & !x_nan & !possible;
        for column in yb.iter_mut() {
            column[j] = if blank { f64::NAN } else { column[j] };
        }
        let counted = !in_range & (!y_nan | (!x_nan & possible)) & live;
        invalid += (blank & live) as u64;
        out_of_range += counted as u64;
        beyond += (BOUNDED && counted && crate::model::beyond_bounds::<K, N, M>(&x)) as u64;
    }
    [counts[0] + invalid, counts[1] + out_of_range, counts[2] + beyond]
}

/// [`settle_block`] of a block with an input above its bound (a unit slip),
/// kept out of line: inlined, its extra count made the block loop of every
/// call 15 % slower (fritz on 10^7 points, 11.9 to 13.8 ms), for a path that
/// runs only after a unit slip.
#[cold]
#[inline(never)]
fn settle_bounded<K: Kernel<N, M>, const N: usize, const M: usize>(
    at: impl Fn(usize) -> [f64; N],
    yb: &mut [[f64; BLOCK]; M],
    len: usize,
    counts: Counts,
) -> Counts {
    settle_block::<K, N, M, true>(at, yb, len, counts)
}

/// Below this many elements a call runs on the calling thread only.
const PARALLEL_MIN: isize = 1 << 15;

/// The ufunc inner loop, generic over the kernel.
///
/// # Safety
/// Called by NumPy only, with `args` holding `N + M` data pointers to float64
/// elements, `dimensions[0]` the element count and `steps` the `N + M` byte
/// strides. NumPy may pass an output aliasing an input (`out=`): each element
/// is read completely before it is written, so exact aliasing is safe. NumPy
/// copies partly overlapping operands before the call except when the input
/// runs ahead of the output; such calls run in order on this thread (see
/// [`partly_overlapping`]).
unsafe extern "C" fn ufunc_loop<K: Kernel<N, M>, const N: usize, const M: usize>(
    args: *mut *mut c_char,
    dimensions: *mut npy_intp,
    steps: *mut npy_intp,
    _data: *mut c_void,
) {
    // Nothing may unwind into NumPy's C code: a panic (none is expected, the
    // kernels are panic-free) is caught, its elements counted as invalid.
    let flags = fp_flags::save();
    let result = catch_unwind(AssertUnwindSafe(|| unsafe {
        let n = *dimensions as isize;
        let mut op = Operands::<N, M> {
            ins: [std::ptr::null(); N],
            in_steps: [0; N],
            outs: [std::ptr::null_mut(); M],
            out_steps: [0; M],
            stream: n as usize >= STREAM_MIN,
        };
        for k in 0..N {
            op.ins[k] = *args.add(k) as *const u8;
            op.in_steps[k] = *steps.add(k) as isize;
        }
        for k in 0..M {
            op.outs[k] = *args.add(N + k) as *mut u8;
            op.out_steps[k] = *steps.add(N + k) as isize;
        }
        let counts = if n >= PARALLEL_MIN && !partly_overlapping(&op, n) {
            run_parallel::<K, N, M>(op, n)
        } else {
            op.run::<K>(0, n)
        };
        add_counts(counts);
    }));
    if result.is_err() {
        add_counts([unsafe { *dimensions } as u64, 0, 0]);
    }
    fp_flags::restore(flags);
}

/// True when an input shares memory with an output without being exactly the
/// same elements. NumPy hands such operands over uncopied when the input runs
/// ahead of the output (`uf(a[1:], out=a[:-1])`): safe in order, since each
/// block reads its inputs before writing, but not for chunks run in parallel,
/// where one chunk would read what the next one writes.
fn partly_overlapping<const N: usize, const M: usize>(op: &Operands<N, M>, n: isize) -> bool {
    let span = |p: *const u8, step: isize| {
        let (a, b) = (p as isize, p as isize + (n - 1) * step);
        (a.min(b), a.max(b) + 8)
    };
    (0..N).any(|k| {
        let (a0, a1) = span(op.ins[k], op.in_steps[k]);
        (0..M).any(|m| {
            let (b0, b1) = span(op.outs[m] as *const u8, op.out_steps[m]);
            let same = op.ins[k] == op.outs[m] as *const u8 && op.in_steps[k] == op.out_steps[m];
            a0 < b1 && b0 < a1 && !same
        })
    })
}

/// Operands of a call over a broadcast N-d grid: every input and output is
/// a float64 view of `shape` with its own byte strides (0 along broadcast
/// axes). NumPy's ufunc machinery hands array-to-array broadcasts to the inner
/// loop in buffered pieces of 8192 elements, too small to share between
/// threads; this path iterates the grid itself and splits it into tiles.
pub struct GridCall<'a> {
    pub shape: &'a [usize],
    pub ins: &'a [(*const u8, &'a [isize])],
    pub outs: &'a [(*mut u8, &'a [isize])],
}

// SAFETY: as for `Operands`: the views outlive the call and tiles write
// disjoint output elements.
unsafe impl Sync for GridCall<'_> {}

/// The same grid with its axes of length 1 dropped and neighbouring axes merged where every operand
/// steps through them as through one axis (`stride[d] == stride[d + 1] * shape[d + 1]`, zero strides
/// included): fewer, longer rows. `(shape, strides)` with the strides of the inputs, then the outputs.
/// A sweep's trailing singleton axes (an orientation or a subcooling of one value) otherwise make rows
/// of one element.
fn compact(call: &GridCall<'_>) -> (Vec<usize>, Vec<Vec<isize>>) {
    let ops: Vec<&[isize]> = call.ins.iter().map(|o| o.1).chain(call.outs.iter().map(|o| o.1)).collect();
    let mut shape: Vec<usize> = Vec::new();
    let mut strides: Vec<Vec<isize>> = vec![Vec::new(); ops.len()];
    for (d, &n) in call.shape.iter().enumerate() {
        if n == 1 {
            continue;
        }
        let merge = !shape.is_empty()
            && ops.iter().zip(&strides).all(|(o, s)| s[s.len() - 1] == o[d] * n as isize);
        if merge {
            *shape.last_mut().expect("not empty") *= n;
            for (o, s) in ops.iter().zip(strides.iter_mut()) {
                *s.last_mut().expect("not empty") = o[d];
            }
        } else {
            shape.push(n);
            for (o, s) in ops.iter().zip(strides.iter_mut()) {
                s.push(o[d]);
            }
        }
    }
    (shape, strides)
}

/// Elements a task of the grid path covers at least when its rows are short (several rows per task:
/// a task per row of a few elements cost more in scheduling than in arithmetic).
const GRID_TASK_MIN: usize = 4096;

/// Evaluate a kernel over a broadcast grid, in parallel tiles of rows.
///
/// # Safety (of the caller's data)
/// Pointers and strides must describe valid float64 views of `shape`;
/// outputs must not overlap each other or the inputs (the binding allocates
/// them fresh). Checked by the caller (`grid_call`), which owns the arrays.
fn grid_eval<K: Kernel<N, M>, const N: usize, const M: usize>(call: &GridCall<'_>) -> Counts {
    if call.ins.len() != N || call.outs.len() != M || call.shape.contains(&0) {
        return [0; 3];
    }
    let (shape, strides) = compact(call);
    let ins: Vec<(*const u8, &[isize])> = call.ins.iter().zip(&strides).map(|(o, s)| (o.0, s.as_slice())).collect();
    let outs: Vec<(*mut u8, &[isize])> =
        call.outs.iter().zip(&strides[N..]).map(|(o, s)| (o.0, s.as_slice())).collect();
    let call = &GridCall { shape: &shape, ins: &ins, outs: &outs };
    let ndim = call.shape.len();
    let inner = if ndim == 0 { 1 } else { call.shape[ndim - 1] as isize };
    let rows: usize = if ndim == 0 { 1 } else { call.shape[..ndim - 1].iter().product() };
    let tile = inner.clamp(1, 1 << 14);
    let tiles_per_row = (inner + tile - 1) / tile;
    // short rows: several whole rows per task
    let rows_per_task = if tiles_per_row == 1 { (GRID_TASK_MIN / inner as usize).max(1) } else { 1 };
    let total = if tiles_per_row == 1 {
        rows.div_ceil(rows_per_task) as isize
    } else {
        rows as isize * tiles_per_row
    };
    let step = |strides: &[isize]| if ndim == 0 { 0 } else { strides[ndim - 1] };
    let size = rows * inner as usize;
    // one tile: part `part` of row `row`
    let run_tile = move |row: usize, part: isize| -> Counts {
        let call: &GridCall<'_> = call;
        let mut op = Operands::<N, M> {
            ins: [std::ptr::null(); N],
            in_steps: [0; N],
            outs: [std::ptr::null_mut(); M],
            out_steps: [0; M],
            stream: size >= STREAM_MIN,
        };
        let mut off_in = [0isize; N];
        let mut off_out = [0isize; M];
        let mut rem = row;
        for d in (0..ndim.saturating_sub(1)).rev() {
            let idx = (rem % call.shape[d]) as isize;
            rem /= call.shape[d];
            for k in 0..N {
                off_in[k] += idx * call.ins[k].1[d];
            }
            for k in 0..M {
                off_out[k] += idx * call.outs[k].1[d];
            }
        }
        for k in 0..N {
            // SAFETY: the offset stays inside the input view (see GridCall).
            op.ins[k] = unsafe { call.ins[k].0.offset(off_in[k]) };
            op.in_steps[k] = step(call.ins[k].1);
        }
        for k in 0..M {
            op.outs[k] = unsafe { call.outs[k].0.offset(off_out[k]) };
            op.out_steps[k] = step(call.outs[k].1);
        }
        let start = part * tile;
        // SAFETY: tiles are disjoint ranges of one row; outputs do not overlap.
        unsafe { op.run::<K>(start, (start + tile).min(inner)) }
    };
    let work = move |t: isize| -> Counts {
        if tiles_per_row == 1 {
            let r0 = t as usize * rows_per_task;
            (r0..(r0 + rows_per_task).min(rows)).map(|r| run_tile(r, 0)).fold([0; 3], plus)
        } else {
            run_tile((t / tiles_per_row) as usize, t % tiles_per_row)
        }
    };
    match threads::pool() {
        Some(pool) if size as isize >= PARALLEL_MIN && total > 1 => {
            let work = &work;
            pool.install(|| (0..total).into_par_iter().map(work).reduce(|| [0; 3], plus))
        }
        _ => (0..total).map(work).fold([0; 3], plus),
    }
}

fma_clone! {
/// The validity code of one element, `model::classify`.
fn status_of / status_of_avx2 <K: Kernel> (x: &[f64; N]) -> i8 = classify
}

/// The inner loop of the status ufunc: same inputs as the kernel, one int8
/// output, the validity code of each element (see `model::classify`). Serial;
/// cheap unless the kernel's range is stated on its result (then the kernel
/// is evaluated, as in the value ufunc).
///
/// # Safety
/// As for `ufunc_loop`, with `args[N]` pointing to int8 elements.
unsafe extern "C" fn status_loop<K: Kernel<N, M>, const N: usize, const M: usize>(
    args: *mut *mut c_char,
    dimensions: *mut npy_intp,
    steps: *mut npy_intp,
    _data: *mut c_void,
) {
    let flags = fp_flags::save();
    let _ = catch_unwind(AssertUnwindSafe(|| unsafe {
        let n = *dimensions as isize;
        let out = *args.add(N) as *mut i8;
        let out_step = *steps.add(N) as isize;
        for i in 0..n {
            let mut x = [0.0f64; N];
            for k in 0..N {
                x[k] = (((*args.add(k)) as *const u8).offset(i * *steps.add(k) as isize) as *const f64).read_unaligned();
            }
            ((out as *mut u8).offset(i * out_step) as *mut i8).write_unaligned(status_of::<K, N, M>(&x));
        }
    }));
    fp_flags::restore(flags);
}

/// The floating-point exception flags of the calling thread, saved before an
/// inner loop and put back after it.
///
/// NumPy clears these flags before a ufunc call and reports the ones set after
/// it as RuntimeWarnings ("invalid value encountered"). Our kernels compute
/// branch-free and select their answer at the end, so the discarded side of a
/// select (a square root of a negative where the model has no answer, a
/// division by a zero superheat whose answer is 0) can raise a flag for input
/// that is perfectly valid; the compiler may also evaluate both sides of a
/// select. What a ufunc has to say about its elements it says through NaN and
/// the validity counts (the element policy), so the loops leave the flags as
/// they found them: flags NumPy's own casting raised before the loop stay.
/// (Worker threads' flags never reached the caller anyway; this makes the
/// calling thread's part behave the same.) A consequence: `np.errstate(over=
/// "raise")` and friends never fire for wetboil ufuncs; an overflow shows as
/// an infinite element, a domain error as NaN with its validity code. The
/// compiler may move floating-point operations across the save and restore
/// (it does not model these flags), so this is a best effort, which the
/// tests check on every kernel.
mod fp_flags {
    /// The flags now.
    #[inline]
    pub fn save() -> u32 {
        #[cfg(target_arch = "x86_64")]
        {
            let mut csr: u32 = 0;
            // SAFETY: stores MXCSR into a local.
            unsafe { std::arch::asm!("stmxcsr [{}]", in(reg) &mut csr, options(nostack, preserves_flags)) };
            csr & 0x3f
        }
        #[cfg(target_arch = "aarch64")]
        {
            let fpsr: u64;
            // SAFETY: reads FPSR.
            unsafe { std::arch::asm!("mrs {}, fpsr", out(reg) fpsr, options(nomem, nostack, preserves_flags)) };
            (fpsr & 0x9f) as u32
        }
        #[cfg(not(any(target_arch = "x86_64", target_arch = "aarch64")))]
        {
            0
        }
    }

    /// Put the flags back to `saved` (the control bits are left alone).
    #[inline]
    pub fn restore(saved: u32) {
        #[cfg(target_arch = "x86_64")]
        {
            let mut csr: u32 = 0;
            // SAFETY: reads MXCSR, then writes it back with only its six
            // exception-flag bits (0-5) replaced.
            unsafe {
                std::arch::asm!("stmxcsr [{}]", in(reg) &mut csr, options(nostack, preserves_flags));
                csr = (csr & !0x3f) | (saved & 0x3f);
                // (no preserves_flags: writing the MXCSR exception flags is the point)
                std::arch::asm!("ldmxcsr [{}]", in(reg) &csr, options(nostack, readonly));
            }
        }
        #[cfg(target_arch = "aarch64")]
        {
            let mut fpsr: u64;
            // SAFETY: reads FPSR and writes it back with only its cumulative
            // exception bits (IOC, DZC, OFC, UFC, IXC, IDC) replaced.
            unsafe {
                std::arch::asm!("mrs {}, fpsr", out(reg) fpsr, options(nomem, nostack, preserves_flags));
                fpsr = (fpsr & !0x9f) | (saved as u64 & 0x9f);
                // (no preserves_flags: writing FPSR is the point)
                std::arch::asm!("msr fpsr, {}", in(reg) fpsr, options(nomem, nostack));
            }
        }
        #[cfg(not(any(target_arch = "x86_64", target_arch = "aarch64")))]
        let _ = saved;
    }
}

/// Split `0..n` into chunks evaluated on the wetboil thread pool.
fn run_parallel<K: Kernel<N, M>, const N: usize, const M: usize>(op: Operands<N, M>, n: isize) -> Counts {
    let Some(pool) = threads::pool() else {
        // SAFETY: the whole range on this thread.
        return unsafe { op.run::<K>(0, n) };
    };
    // Many more chunks than threads: the cost per element varies along real
    // inputs (water properties near the critical point, a sorted sweep), and
    // work stealing can only even out the threads to within one chunk.
    let workers = pool.current_num_threads() as isize;
    // Whole blocks per chunk, so that every block of an aligned output stays aligned (full-width
    // non-temporal stores, see `stream_block`).
    let chunk = ((n / (32 * workers)).max(PARALLEL_MIN / 4) + BLOCK as isize - 1) / BLOCK as isize * BLOCK as isize;
    let chunks = (n + chunk - 1) / chunk;
    pool.install(|| {
        (0..chunks)
            .into_par_iter()
            // SAFETY: chunks are disjoint and within 0..n.
            .map(|c| unsafe { op.run::<K>(c * chunk, ((c + 1) * chunk).min(n)) })
            .reduce(|| [0; 3], plus)
    })
}

/// Create the NumPy ufunc of an entry (float64 in, float64 out).
pub fn make_ufunc<'py>(py: Python<'py>, e: &Entry) -> PyResult<Bound<'py, PyAny>> {
    let m = &e.model;
    let doc = format!(
        "{}\n\n{}\n\nInputs: {}\nOutputs: {}\nDomain: {}\nValidity: {}\nReference: {}{}\n",
        m.summary,
        m.equation,
        m.inputs.iter().map(|a| format!("{} [{}]", a.name, a.unit)).collect::<Vec<_>>().join(", "),
        m.outputs.iter().map(|a| format!("{} [{}]", a.name, a.unit)).collect::<Vec<_>>().join(", "),
        m.domain,
        m.validity_text(),
        m.reference,
        if m.doi.is_empty() { String::new() } else { format!(", doi:{}", m.doi) },
    );
    build_ufunc(py, m.name, &doc, e.loop_fn, e.nin, e.nout, NPY_TYPES::NPY_DOUBLE)
}

/// Name of the status ufunc of a kernel.
pub fn status_name(kernel: &str) -> String {
    format!("{kernel}_status")
}

/// Create the status ufunc of an entry (float64 in, one int8 out: 0 in range,
/// 1 impossible, 2 outside the published range, 3 missing input).
pub fn make_status_ufunc<'py>(py: Python<'py>, e: &Entry) -> PyResult<Bound<'py, PyAny>> {
    let doc = format!(
        "Validity code of each element of {}: 0 inside the published range ({}), 1 physically impossible \
         ({}), 2 outside the published range, 3 missing (NaN input).",
        e.model.name,
        e.model.validity_text(),
        e.model.domain
    );
    build_ufunc(py, &status_name(e.model.name), &doc, e.status_fn, e.nin, 1, NPY_TYPES::NPY_BYTE)
}

/// Build a ufunc with one loop. Every pointer handed to NumPy is leaked on
/// purpose: NumPy keeps them for the life of the ufunc, i.e. the process.
fn build_ufunc<'py>(
    py: Python<'py>,
    name: &str,
    doc: &str,
    loop_fn: LoopFn,
    nin: usize,
    nout: usize,
    out_type: NPY_TYPES,
) -> PyResult<Bound<'py, PyAny>> {
    let funcs: &'static mut [PyUFuncGenericFunction] = Box::leak(Box::new([Some(loop_fn)]));
    let data: &'static mut [*mut c_void] = Box::leak(Box::new([std::ptr::null_mut()]));
    let mut t = vec![NPY_TYPES::NPY_DOUBLE as c_char; nin];
    t.extend(std::iter::repeat_n(out_type as c_char, nout));
    let types: &'static mut [c_char] = Box::leak(t.into_boxed_slice());
    let name: &'static CString = Box::leak(Box::new(CString::new(name).expect("kernel names have no NUL")));
    let doc: &'static CString = Box::leak(Box::new(CString::new(doc.replace('\0', " ")).expect("no NUL left")));
    // SAFETY: all pointers are 'static, `types` holds nin + nout entries for
    // the single loop, and NumPy copies nothing it does not own.
    unsafe {
        let ptr = PY_UFUNC_API.PyUFunc_FromFuncAndData(
            py,
            funcs.as_mut_ptr(),
            data.as_mut_ptr(),
            types.as_mut_ptr(),
            1,
            nin as c_int,
            nout as c_int,
            -1, // PyUFunc_None: no identity
            name.as_ptr(),
            doc.as_ptr(),
            0,
        );
        Bound::from_owned_ptr_or_err(py, ptr)
    }
}
