//! Python bindings (`wetboil._core`), built only with the `python` feature.
//!
//! This layer converts and registers; it holds no physics. Every kernel of the
//! registry becomes:
//! * a NumPy ufunc exported under its model name (`_core.fritz_departure`), and
//! * through [`front::make_function`], the public builtin function that the
//!   Python front door builds once per public function, with a fast scalar path.

mod alloc;
mod front;
mod registry;
mod threads;
mod ufunc;

use std::panic::{catch_unwind, AssertUnwindSafe};
use std::sync::OnceLock;

use pyo3::prelude::*;
use pyo3::PyTypeInfo;

use ufunc::{Entry, MAX_IN, MAX_OUT};

static ENTRIES: OnceLock<Vec<Entry>> = OnceLock::new();

fn entries() -> &'static [Entry] {
    ENTRIES.get_or_init(registry::entries)
}

/// Limit the SIMD clones of the kernel loops and of the water properties
/// (2 AVX-512, 1 AVX2/FMA, 0 baseline; each only where the CPU has it) and
/// return the previous limit. For the tests that check every clone gives the
/// same bits.
#[pyfunction]
fn _set_simd_cap(level: u8) -> u8 {
    crate::simd::set_cap(level)
}

/// Return and reset the element counts `(invalid, out_of_range,
/// beyond_bounds)` of the ufunc calls made on this thread since the last call
/// (`beyond_bounds`: the out-of-range elements with an input above its
/// unit-slip bound).
#[pyfunction]
fn take_counts() -> (u64, u64, u64) {
    let [a, b, c] = ufunc::take_counts();
    (a, b, c)
}

/// JSON list of every registered model's facts.
#[pyfunction]
fn models_json() -> String {
    let models: Vec<_> = entries()
        .iter()
        .map(|e| {
            let mut m = serde_json::to_value(e.model).unwrap_or_default();
            m["validity"] = e.model.validity_text().into();
            m["own_validity"] = e.model.validity.into();
            m["bounds"] = e
                .model
                .input_bounds()
                .map(|(i, b)| serde_json::json!([i, b.max, b.clause]))
                .collect::<Vec<_>>()
                .into();
            m
        })
        .collect();
    serde_json::to_string(&models).unwrap_or_else(|_| "[]".to_owned())
}

fn find(kernel: &str) -> PyResult<&'static Entry> {
    entries()
        .iter()
        .find(|e| e.model.name == kernel)
        .ok_or_else(|| pyo3::exceptions::PyValueError::new_err(format!("unknown kernel {kernel:?}")))
}

/// Evaluate kernel `kernel` over a broadcast grid: `inputs` are float64
/// arrays already broadcast to one shape (zero strides allowed), `outputs`
/// fresh float64 arrays of that shape. Runs in parallel with the GIL
/// released; returns the element counts `(invalid, out_of_range,
/// beyond_bounds)`, as [`take_counts`].
#[pyfunction]
fn grid_call<'py>(
    py: Python<'py>,
    kernel: &str,
    inputs: Vec<numpy::PyReadonlyArrayDyn<'py, f64>>,
    outputs: Vec<numpy::PyReadwriteArrayDyn<'py, f64>>,
) -> PyResult<(u64, u64, u64)> {
    let e = find(kernel)?;
    if inputs.len() != e.nin || outputs.len() != e.nout {
        return Err(pyo3::exceptions::PyValueError::new_err(format!(
            "kernel {kernel} takes {} inputs and {} outputs",
            e.nin, e.nout
        )));
    }
    run_grid(py, e.grid, inputs, outputs)
}

/// `out = a * b` for float64 arrays broadcast to `out`'s shape (zero strides
/// allowed): the combining step of the factorised grid path, in parallel
/// with the GIL released.
#[pyfunction]
fn product_call<'py>(
    py: Python<'py>,
    a: numpy::PyReadonlyArrayDyn<'py, f64>,
    b: numpy::PyReadonlyArrayDyn<'py, f64>,
    out: numpy::PyReadwriteArrayDyn<'py, f64>,
) -> PyResult<()> {
    run_grid(py, ufunc::product_grid, vec![a, b], vec![out]).map(|_| ())
}

/// Run a grid evaluator over operands that share one shape.
fn run_grid<'py>(
    py: Python<'py>,
    grid: fn(&ufunc::GridCall<'_>) -> ufunc::Counts,
    inputs: Vec<numpy::PyReadonlyArrayDyn<'py, f64>>,
    mut outputs: Vec<numpy::PyReadwriteArrayDyn<'py, f64>>,
) -> PyResult<(u64, u64, u64)> {
    use numpy::PyUntypedArrayMethods;
    let shape: Vec<usize> = outputs[0].shape().to_vec();
    for a in inputs.iter().map(|a| a.shape()).chain(outputs.iter().map(|a| a.shape())) {
        if a != shape.as_slice() {
            return Err(pyo3::exceptions::PyValueError::new_err("grid_call: operands must share one shape"));
        }
    }
    let in_strides: Vec<Vec<isize>> = inputs.iter().map(|a| a.strides().to_vec()).collect();
    let out_strides: Vec<Vec<isize>> = outputs.iter().map(|a| a.strides().to_vec()).collect();
    let ins: Vec<(usize, usize)> = inputs.iter().enumerate().map(|(i, a)| (a.as_array().as_ptr() as usize, i)).collect();
    let outs: Vec<(usize, usize)> =
        outputs.iter_mut().enumerate().map(|(i, a)| (a.as_array_mut().as_mut_ptr() as usize, i)).collect();
    // Pointers travel as integers across the GIL release; the borrowed arrays
    // (held by `inputs`/`outputs` until this function returns) keep them valid.
    let counts = py.detach(|| {
        let ins: Vec<(*const u8, &[isize])> = ins.iter().map(|&(p, i)| (p as *const u8, in_strides[i].as_slice())).collect();
        let outs: Vec<(*mut u8, &[isize])> = outs.iter().map(|&(p, i)| (p as *mut u8, out_strides[i].as_slice())).collect();
        catch_unwind(AssertUnwindSafe(|| grid(&ufunc::GridCall { shape: &shape, ins: &ins, outs: &outs })))
    });
    match counts {
        Ok([a, b, c]) => Ok((a, b, c)),
        Err(_) => Err(pyo3::exceptions::PyRuntimeError::new_err("wetboil: internal error (panic) in grid_call")),
    }
}

/// Number of elements of `a` whose magnitude is above `bound` (NaN is not),
/// in parallel with the GIL released: how a range message finds which
/// unit-slip bound ([`crate::model::INPUT_BOUNDS`]) a call's elements
/// exceeded, without the two temporaries of `np.abs(a) > bound`.
#[pyfunction]
fn count_beyond(py: Python<'_>, a: numpy::PyReadonlyArrayDyn<'_, f64>, bound: f64) -> u64 {
    use rayon::prelude::*;
    let count = |v: &[f64]| v.iter().map(|x| (x.abs() > bound) as u64).sum::<u64>();
    match a.as_slice() {
        Ok(v) => py.detach(|| match threads::pool() {
            Some(pool) if v.len() >= 1 << 16 => pool.install(|| v.par_chunks(1 << 14).map(count).sum()),
            _ => count(v),
        }),
        Err(_) => a.as_array().iter().map(|x| (x.abs() > bound) as u64).sum(),
    }
}

/// Side (0: surface, 1: fluid) of each input of every kernel in product
/// form, by kernel name.
#[pyfunction]
fn factored_sides() -> std::collections::HashMap<&'static str, Vec<u8>> {
    entries().iter().filter_map(|e| Some((e.model.name, e.sides.as_ref()?.of_input.clone()))).collect()
}

/// Evaluate the factors of side `side` of a kernel in product form at `n`
/// points: each input is a contiguous float64 array of `n` elements or of
/// one (used for every point; the other side's inputs are never read);
/// `outputs` (one per kernel output) and `codes` (int8, the side's validity
/// codes) have `n` elements. Serial: the sides of a grid are its axes, small
/// next to the grid itself.
#[pyfunction]
fn factor_call<'py>(
    kernel: &str,
    side: u8,
    inputs: Vec<numpy::PyReadonlyArray1<'py, f64>>,
    mut outputs: Vec<numpy::PyReadwriteArray1<'py, f64>>,
    mut codes: numpy::PyReadwriteArray1<'py, i8>,
) -> PyResult<()> {
    let e = find(kernel)?;
    let Some(sides) = &e.sides else {
        return Err(pyo3::exceptions::PyValueError::new_err(format!("kernel {kernel} is not in product form")));
    };
    let bad = |m: &str| pyo3::exceptions::PyValueError::new_err(format!("factor_call({kernel}): {m}"));
    if side > 1 || inputs.len() != e.nin || outputs.len() != e.nout {
        return Err(bad("side must be 0 or 1, with one array per kernel input and output"));
    }
    let codes = codes.as_slice_mut().map_err(|_| bad("codes must be contiguous int8"))?;
    let n = codes.len();
    let ins: Vec<&[f64]> =
        inputs.iter().map(|a| a.as_slice()).collect::<Result<_, _>>().map_err(|_| bad("inputs must be contiguous, aligned float64"))?;
    if ins.iter().any(|a| a.len() != n && a.len() != 1) {
        return Err(bad("every input must have n elements or one"));
    }
    let mut outs: Vec<&mut [f64]> = outputs
        .iter_mut()
        .map(|a| a.as_slice_mut())
        .collect::<Result<_, _>>()
        .map_err(|_| bad("outputs must be contiguous, aligned float64"))?;
    if outs.iter().any(|a| a.len() != n) {
        return Err(bad("every output must have n elements"));
    }
    let eval = sides.eval;
    catch_unwind(AssertUnwindSafe(|| eval(side, &ins, &mut outs, codes)))
        .map_err(|_| pyo3::exceptions::PyRuntimeError::new_err("wetboil: internal error (panic) in factor_call"))
}

/// Number of threads large array calls use.
#[pyfunction]
fn get_num_threads() -> usize {
    threads::num_threads()
}

/// Set the number of threads large array calls use (at least 1).
#[pyfunction]
fn set_num_threads(n: usize) {
    threads::set_num_threads(n)
}

/// Drop the thread pool inherited through fork(); registered with
/// os.register_at_fork by the package.
#[pyfunction]
fn _after_fork_child() {
    threads::after_fork_child()
}

/// Install the buffer cache as NumPy's memory handler in this context and
/// return the previous handler (a token for `_cache_exit`), or None.
#[pyfunction]
fn _cache_enter(py: Python<'_>) -> PyResult<Option<Py<PyAny>>> {
    alloc::enter(py)
}

/// Restore the handler returned by `_cache_enter`.
#[pyfunction]
fn _cache_exit(py: Python<'_>, token: Option<Py<PyAny>>) -> PyResult<()> {
    alloc::exit(py, token)
}

/// Set the most bytes of freed output buffers kept for reuse (0 turns the
/// cache off and frees what it holds); returns the previous limit.
#[pyfunction]
fn set_buffer_cache(max_bytes: usize) -> usize {
    alloc::set_max_bytes(max_bytes)
}

/// The buffer cache's `(max_bytes, held_bytes, held_blocks, hits, misses)`.
#[pyfunction]
fn buffer_cache_info() -> (usize, usize, usize, u64, u64) {
    alloc::info()
}

#[pymodule]
fn _core(m: &Bound<'_, PyModule>) -> PyResult<()> {
    let py = m.py();
    for e in entries() {
        m.add(e.model.name, ufunc::make_ufunc(py, e)?)?;
        m.add(ufunc::status_name(e.model.name), ufunc::make_status_ufunc(py, e)?)?;
    }
    m.add("Front", front::Front::type_object(py))?;
    m.add_function(wrap_pyfunction!(front::make_function, m)?)?;
    m.add_function(wrap_pyfunction!(front::_bind_policy, m)?)?;
    m.add("MAX_ARGS", front::MAX_ARGS)?;
    m.add_function(wrap_pyfunction!(take_counts, m)?)?;
    m.add_function(wrap_pyfunction!(_set_simd_cap, m)?)?;
    m.add_function(wrap_pyfunction!(grid_call, m)?)?;
    m.add_function(wrap_pyfunction!(product_call, m)?)?;
    m.add_function(wrap_pyfunction!(factored_sides, m)?)?;
    m.add_function(wrap_pyfunction!(factor_call, m)?)?;
    m.add_function(wrap_pyfunction!(models_json, m)?)?;
    m.add_function(wrap_pyfunction!(count_beyond, m)?)?;
    m.add_function(wrap_pyfunction!(get_num_threads, m)?)?;
    m.add_function(wrap_pyfunction!(set_num_threads, m)?)?;
    m.add_function(wrap_pyfunction!(_after_fork_child, m)?)?;
    m.add_function(wrap_pyfunction!(_cache_enter, m)?)?;
    m.add_function(wrap_pyfunction!(_cache_exit, m)?)?;
    m.add_function(wrap_pyfunction!(set_buffer_cache, m)?)?;
    m.add_function(wrap_pyfunction!(buffer_cache_info, m)?)?;
    m.add("MAX_INPUTS", MAX_IN)?;
    m.add("MAX_OUTPUTS", MAX_OUT)?;
    m.add("CHF_DENSITY_RATIO_MAX", crate::chf::DENSITY_RATIO_MAX)?;
    Ok(())
}
