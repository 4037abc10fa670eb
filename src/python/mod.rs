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
    m.add_function(wrap_pyfunction!(models_json, m)?)?;
    m.add_function(wrap_pyfunction!(get_num_threads, m)?)?;
    m.add_function(wrap_pyfunction!(set_num_threads, m)?)?;
    m.add_function(wrap_pyfunction!(_after_fork_child, m)?)?;
    m.add("MAX_INPUTS", MAX_IN)?;
    m.add("MAX_OUTPUTS", MAX_OUT)?;
    Ok(())
}
