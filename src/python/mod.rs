//! Python bindings (`wetboil._core`), built only with the `python` feature.
//!
//! This layer converts and registers; it holds no physics. Every kernel of the
//! registry becomes:
//! * a NumPy ufunc exported under its model name (`_core.fritz_departure`), and
//! * a fast scalar path through [`Caller`], which the Python front door builds
//!   once per public function.

mod registry;
mod threads;
mod ufunc;

use std::sync::OnceLock;

use pyo3::exceptions::{PyIndexError, PyValueError};
use pyo3::prelude::*;
use pyo3::types::{PyFloat, PyInt, PyTuple};
use pyo3::{intern, PyTypeInfo};

use crate::model::Status;
use ufunc::{Entry, MAX_IN, MAX_OUT};

static ENTRIES: OnceLock<Vec<Entry>> = OnceLock::new();

fn entries() -> &'static [Entry] {
    ENTRIES.get_or_init(registry::entries)
}

/// Most public arguments a front-door function may have.
const MAX_ARGS: usize = 16;

/// The scalar fast path of one public function.
///
/// Built from a kernel name and a *plan*: for each kernel input, the index of
/// the public argument that supplies it and, when that argument is a fluid
/// state, the index of the field in the fluid's `_scalars` tuple (else -1).
/// Calling it with the public arguments returns the result as `float` (or a
/// tuple, or `result_type(*values)`) when every argument is a plain number or a
/// scalar fluid state and the element is clean; it returns `None` otherwise,
/// and the front door takes the array path, which also handles warnings.
#[pyclass(frozen, module = "wetboil._core")]
struct Caller {
    entry: usize,
    plan: Vec<(usize, isize)>,
    nargs: usize,
    result_type: Option<Py<PyAny>>,
}

/// A plain Python number (float, its subclasses such as numpy.float64, or int
/// but not bool) as f64.
#[inline]
fn plain_number(a: &Bound<'_, PyAny>) -> Option<f64> {
    if let Ok(f) = a.cast::<PyFloat>() {
        return Some(f.value());
    }
    if let Ok(i) = a.cast_exact::<PyInt>() {
        return i.extract::<f64>().ok();
    }
    None
}

#[pymethods]
impl Caller {
    #[new]
    #[pyo3(signature = (kernel, plan, nargs, result_type=None))]
    fn new(kernel: &str, plan: Vec<(usize, isize)>, nargs: usize, result_type: Option<Py<PyAny>>) -> PyResult<Self> {
        let entry = entries()
            .iter()
            .position(|e| e.model.name == kernel)
            .ok_or_else(|| PyValueError::new_err(format!("unknown kernel {kernel:?}")))?;
        let e = &entries()[entry];
        if plan.len() != e.nin {
            return Err(PyValueError::new_err(format!(
                "kernel {kernel} takes {} inputs, plan has {}",
                e.nin,
                plan.len()
            )));
        }
        if nargs > MAX_ARGS || plan.iter().any(|&(a, _)| a >= nargs) {
            return Err(PyIndexError::new_err("plan refers to a missing argument"));
        }
        Ok(Caller { entry, plan, nargs, result_type })
    }

    #[pyo3(signature = (*args))]
    fn __call__<'py>(&self, py: Python<'py>, args: &Bound<'py, PyTuple>) -> PyResult<Py<PyAny>> {
        let none = || Ok(py.None());
        if args.len() != self.nargs {
            return none();
        }
        let e = &entries()[self.entry];
        let mut x = [0.0f64; MAX_IN];
        // Each fluid argument's `_scalars` tuple, fetched once per call.
        let mut fluids: [Option<Bound<'py, PyTuple>>; MAX_ARGS] = [const { None }; MAX_ARGS];
        for (slot, &(ai, field)) in self.plan.iter().enumerate() {
            let a = args.get_item(ai)?;
            let v = if field < 0 {
                plain_number(&a)
            } else {
                if fluids[ai].is_none() {
                    match a.getattr(intern!(py, "_scalars")) {
                        Ok(t) => match t.cast_into::<PyTuple>() {
                            Ok(t) => fluids[ai] = Some(t),
                            Err(_) => return none(),
                        },
                        Err(_) => return none(),
                    }
                }
                let t = fluids[ai].as_ref().expect("set above");
                match t.get_item(field as usize) {
                    Ok(item) => plain_number(&item),
                    Err(_) => None,
                }
            };
            match v {
                Some(v) => x[slot] = v,
                None => return none(),
            }
        }
        let mut y = [0.0f64; MAX_OUT];
        let status = (e.scalar)(&x[..e.nin], &mut y[..e.nout]);
        if status != Status::Ok || y[..e.nout].iter().any(|v| v.is_nan()) {
            return none();
        }
        if e.nout == 1 {
            return Ok(PyFloat::new(py, y[0]).into_any().unbind());
        }
        let values = PyTuple::new(py, y[..e.nout].iter().copied())?;
        match &self.result_type {
            Some(t) => Ok(t.bind(py).call1(values)?.unbind()),
            None => Ok(values.into_any().unbind()),
        }
    }

    /// Name of the kernel this caller evaluates.
    #[getter]
    fn kernel(&self) -> &'static str {
        entries()[self.entry].model.name
    }
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
        let uf = ufunc::make_ufunc(py, e)?;
        m.add(e.model.name, uf)?;
    }
    m.add("Caller", Caller::type_object(py))?;
    m.add_function(wrap_pyfunction!(take_counts, m)?)?;
    m.add_function(wrap_pyfunction!(models_json, m)?)?;
    m.add_function(wrap_pyfunction!(get_num_threads, m)?)?;
    m.add_function(wrap_pyfunction!(set_num_threads, m)?)?;
    m.add_function(wrap_pyfunction!(_after_fork_child, m)?)?;
    m.add("MAX_INPUTS", MAX_IN)?;
    m.add("MAX_OUTPUTS", MAX_OUT)?;
    Ok(())
}
