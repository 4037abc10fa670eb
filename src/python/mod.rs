//! Python bindings (`wetboil._core`), built only with the `python` feature.
//!
//! This layer converts and registers; it holds no physics. Every kernel of the
//! registry becomes:
//! * a NumPy ufunc exported under its model name (`_core.fritz_departure`), and
//! * through [`front::make_function`], the public builtin function that the
//!   Python front door builds once per public function, with a fast scalar path.

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

/// Return and reset the element counts `(invalid, out_of_range)` of the ufunc
/// calls made on this thread since the last call.
#[pyfunction]
fn take_counts() -> (u64, u64) {
    let [a, b] = ufunc::take_counts();
    (a, b)
}

/// JSON list of every registered model's facts.
#[pyfunction]
fn models_json() -> String {
    let models: Vec<_> = entries().iter().map(|e| &e.model).collect();
    serde_json::to_string(&models).unwrap_or_else(|_| "[]".to_owned())
}

/// Evaluate kernel `kernel` over a broadcast grid: `inputs` are float64
/// arrays already broadcast to one shape (zero strides allowed), `outputs`
/// fresh float64 arrays of that shape. Runs in parallel with the GIL
/// released; returns the element counts `(invalid, out_of_range)`.
#[pyfunction]
fn grid_call<'py>(
    py: Python<'py>,
    kernel: &str,
    inputs: Vec<numpy::PyReadonlyArrayDyn<'py, f64>>,
    mut outputs: Vec<numpy::PyReadwriteArrayDyn<'py, f64>>,
) -> PyResult<(u64, u64)> {
    use numpy::PyUntypedArrayMethods;
    let e = entries()
        .iter()
        .find(|e| e.model.name == kernel)
        .ok_or_else(|| pyo3::exceptions::PyValueError::new_err(format!("unknown kernel {kernel:?}")))?;
    if inputs.len() != e.nin || outputs.len() != e.nout {
        return Err(pyo3::exceptions::PyValueError::new_err(format!(
            "kernel {kernel} takes {} inputs and {} outputs",
            e.nin, e.nout
        )));
    }
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
    let grid = e.grid;
    // Pointers travel as integers across the GIL release; the borrowed arrays
    // (held by `inputs`/`outputs` until this function returns) keep them valid.
    let counts = py.detach(|| {
        let ins: Vec<(*const u8, &[isize])> = ins.iter().map(|&(p, i)| (p as *const u8, in_strides[i].as_slice())).collect();
        let outs: Vec<(*mut u8, &[isize])> = outs.iter().map(|&(p, i)| (p as *mut u8, out_strides[i].as_slice())).collect();
        catch_unwind(AssertUnwindSafe(|| grid(&ufunc::GridCall { shape: &shape, ins: &ins, outs: &outs })))
    });
    match counts {
        Ok([a, b]) => Ok((a, b)),
        Err(_) => Err(pyo3::exceptions::PyRuntimeError::new_err("wetboil: internal error (panic) in grid_call")),
    }
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

#[pymodule]
fn _core(m: &Bound<'_, PyModule>) -> PyResult<()> {
    let py = m.py();
    for e in entries() {
        m.add(e.model.name, ufunc::make_ufunc(py, e)?)?;
        m.add(ufunc::status_name(e.model.name), ufunc::make_status_ufunc(py, e)?)?;
    }
    m.add("Front", front::Front::type_object(py))?;
    m.add_function(wrap_pyfunction!(front::make_function, m)?)?;
    m.add("MAX_ARGS", front::MAX_ARGS)?;
    m.add_function(wrap_pyfunction!(take_counts, m)?)?;
    m.add_function(wrap_pyfunction!(grid_call, m)?)?;
    m.add_function(wrap_pyfunction!(models_json, m)?)?;
    m.add_function(wrap_pyfunction!(get_num_threads, m)?)?;
    m.add_function(wrap_pyfunction!(set_num_threads, m)?)?;
    m.add_function(wrap_pyfunction!(_after_fork_child, m)?)?;
    m.add("MAX_INPUTS", MAX_IN)?;
    m.add("MAX_OUTPUTS", MAX_OUT)?;
    Ok(())
}
