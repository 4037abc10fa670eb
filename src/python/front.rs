//! Public functions as builtin callables with a fast scalar path.
//!
//! The Python front door (`wetboil/_api.py`) builds, for every public
//! function, a plain Python *fallback* with the real signature that handles
//! arrays, xarray, dask, warnings and every error message. This file wraps it
//! in a builtin function object (`builtin_function_or_method`, METH_FASTCALL)
//! whose C-level entry point handles the common case on its own: every argument
//! a plain number or a scalar fluid state, and a clean result. Anything else,
//! including every argument-binding error, is forwarded unchanged to the
//! fallback, so both paths have one behaviour.
//!
//! A builtin carries a real `inspect.signature` (through `__text_signature__`,
//! the first line of its docstring), its own `__module__`, pickles by name, and
//! costs no Python frame, which is what a scalar call from a user's loop needs.

use std::ffi::{c_int, CString};
use std::panic::{catch_unwind, AssertUnwindSafe};

use pyo3::exceptions::{PyRuntimeError, PyValueError};
use pyo3::ffi;
use pyo3::prelude::*;
use pyo3::types::{PyDict, PyFloat, PyInt, PyString, PyTuple};
use pyo3::{intern, Borrowed};

use super::entries;
use super::ufunc::{MAX_IN, MAX_OUT};
use crate::model::Status;

/// Most parameters a public function may have.
pub const MAX_ARGS: usize = 16;

/// The context variables of the element policy (`wetboil._errors._STATE`, a
/// `(invalid, out_of_range)` tuple of actions) and of a validity capture in
/// progress (`wetboil._api._CAPTURE`, None when there is none), given once by
/// [`bind_policy`].
static POLICY: std::sync::OnceLock<(Py<PyAny>, Py<PyAny>)> = std::sync::OnceLock::new();

/// Tell the fast path where the element policy lives (called once, at import).
#[pyfunction]
pub fn _bind_policy(state: Py<PyAny>, capture: Py<PyAny>) {
    let _ = POLICY.set((state, capture));
}

/// Whether an element of `status` (impossible or out of range) needs nothing
/// from the fallback: its category's action is "ignore" and no validity
/// capture is open, so the fallback would return the same numbers without a
/// word. A solver probing outside a range under `errstate(out_of_range="ignore")`
/// then costs a fast call, not a pass through the array machinery (10 us).
fn ignored(py: Python<'_>, status: Status) -> bool {
    let Some((state, capture)) = POLICY.get() else { return false };
    let get = intern!(py, "get");
    let Ok(cap) = capture.bind(py).call_method0(get) else { return false };
    if !cap.is_none() {
        return false;
    }
    let Ok(policy) = state.bind(py).call_method0(get) else { return false };
    let index = if status == Status::Invalid { 0 } else { 1 };
    policy.get_item(index).is_ok_and(|action| action.eq(intern!(py, "ignore")).unwrap_or(false))
}

/// One kernel a public function can evaluate on the fast path.
struct Choice {
    /// The value of the selector parameter that picks this kernel (None for a
    /// function with a single kernel).
    key: Option<Py<PyAny>>,
    entry: usize,
    /// Per kernel input: (parameter index, field index in `_scalars` or -1).
    plan: Vec<(usize, isize)>,
    /// Return only this output (a float), or all of them when negative.
    output: isize,
    result_type: Option<Py<PyAny>>,
    /// `tuple.__new__` when `result_type` is a tuple subclass (a NamedTuple):
    /// `tuple.__new__(result_type, values)` builds the same object as calling
    /// the class, without running its Python-level `__new__` (about 170 ns).
    tuple_new: Option<Py<PyAny>>,
}

/// The state behind one public function (the builtin's `__self__`).
#[pyclass(frozen, module = "wetboil._core")]
pub struct Front {
    choices: Vec<Choice>,
    /// Index of the parameter whose value picks the choice, or -1.
    selector: isize,
    /// Parameter names, interned so keyword lookup is a pointer comparison.
    names: Vec<Py<PyString>>,
    /// Per parameter: its default, or None when it is required.
    defaults: Vec<Option<Py<PyAny>>>,
    /// Per parameter: its default as a number, when it is a plain number
    /// (read once here instead of at every call).
    default_numbers: Vec<Option<f64>>,
    /// The Python function with the same signature that does everything else.
    fallback: Py<PyAny>,
    module: String,
    /// The last scalar fluid state seen and its fields. Holding a strong
    /// reference keeps the object alive, so identity means same values
    /// (`Saturation` is immutable).
    cache: GilCell<Option<(Py<PyAny>, [f64; FLUID_FIELDS])>>,
}

/// A cell only ever touched by a thread attached to the interpreter (holding
/// the GIL). abi3 extension modules cannot load into free-threaded CPython,
/// so the GIL serialises every access; no reference into the cell is held
/// across a call into Python (see `Front::fluid`).
struct GilCell<T>(std::cell::UnsafeCell<T>);
// SAFETY: see above; every access happens under the GIL.
unsafe impl<T: Send> Sync for GilCell<T> {}

/// Number of fields of a scalar fluid state's `_scalars` tuple.
const FLUID_FIELDS: usize = 15;

/// The fields of a scalar fluid state, or None when it is not one.
fn fluid_values(obj: Borrowed<'_, '_, PyAny>) -> Option<[f64; FLUID_FIELDS]> {
    let py = obj.py();
    let t = obj.getattr(intern!(py, "_scalars")).ok()?;
    let t = t.cast_into::<PyTuple>().ok()?;
    if t.len() != FLUID_FIELDS {
        return None;
    }
    let mut v = [0.0; FLUID_FIELDS];
    for (i, item) in t.iter().enumerate() {
        v[i] = plain_number(item.as_borrowed())?;
    }
    Some(v)
}

/// A plain Python number (float and its subclasses such as numpy.float64, or
/// an exact int; bool is not a number here) as f64.
#[inline]
fn plain_number(a: Borrowed<'_, '_, PyAny>) -> Option<f64> {
    if let Ok(f) = a.cast::<PyFloat>() {
        return Some(f.value());
    }
    if let Ok(i) = a.cast_exact::<PyInt>() {
        return i.extract::<f64>().ok();
    }
    None
}

impl Front {
    /// The fast path. `None` means: let the fallback handle this call.
    ///
    /// # Safety
    /// `args` holds `nargs` positional arguments followed by one value per
    /// entry of `kwnames` (a tuple of str, or null), as CPython's METH_FASTCALL
    /// convention guarantees; all are borrowed references.
    unsafe fn fast<'py>(
        &self,
        py: Python<'py>,
        args: *const *mut ffi::PyObject,
        nargs: usize,
        kwnames: *mut ffi::PyObject,
    ) -> Option<Bound<'py, PyAny>> {
        let np = self.names.len();
        if nargs > np {
            return None;
        }
        let mut slots: [*mut ffi::PyObject; MAX_ARGS] = [std::ptr::null_mut(); MAX_ARGS];
        for (i, slot) in slots.iter_mut().enumerate().take(nargs) {
            *slot = unsafe { *args.add(i) };
        }
        if !kwnames.is_null() {
            let kw = unsafe { Borrowed::from_ptr(py, kwnames) }.cast::<PyTuple>().ok()?;
            for (j, key) in kw.iter().enumerate() {
                let idx = match self.names.iter().position(|n| n.as_ptr() == key.as_ptr()) {
                    Some(i) => i,
                    None => self.names.iter().position(|n| n.bind(py).as_any().eq(&key).unwrap_or(false))?,
                };
                if !slots[idx].is_null() {
                    return None; // given twice: the fallback raises the TypeError
                }
                slots[idx] = unsafe { *args.add(nargs + j) };
            }
        }
        // parameters left to their defaults (bit i: parameter i)
        let mut defaulted = 0u32;
        for (i, slot) in slots.iter_mut().enumerate().take(np) {
            if slot.is_null() {
                *slot = self.defaults[i].as_ref()?.as_ptr();
                defaulted |= 1 << i;
            }
        }

        let choice = if self.selector < 0 {
            self.choices.first()?
        } else {
            // SAFETY: the selector indexes a filled slot (checked in make_function).
            let key = unsafe { Borrowed::from_ptr(py, slots[self.selector as usize]) };
            self.choices.iter().find(|c| {
                c.key.as_ref().is_some_and(|k| {
                    let k = k.bind(py);
                    // bools by identity (True is not 1 here), strings by value
                    k.as_ptr() == key.as_ptr() || (k.is_instance_of::<PyString>() && k.eq(&key).unwrap_or(false))
                })
            })?
        };
        let e = &entries()[choice.entry];
        let mut x = [0.0f64; MAX_IN];
        // The fields of the (single, in every kernel so far) fluid argument.
        for (k, &(ai, field)) in choice.plan.iter().enumerate() {
            // SAFETY: every slot up to np is a live borrowed reference (argument or default).
            let obj = unsafe { Borrowed::from_ptr(py, slots[ai]) };
            x[k] = match (field < 0, defaulted >> ai & 1 == 1) {
                (true, true) => match self.default_numbers[ai] {
                    Some(v) => v,
                    None => plain_number(obj)?,
                },
                (true, false) => plain_number(obj)?,
                (false, _) => self.fluid_field(obj, field as usize)?,
            };
        }
        let mut y = [0.0f64; MAX_OUT];
        let status = (e.scalar)(&x, &mut y);
        let flagged = status != Status::Ok;
        if (flagged && !ignored(py, status)) || (!flagged && y[..e.nout].iter().any(|v| v.is_nan())) {
            return None; // the fallback applies the element policy (and propagates NaN inputs)
        }
        if choice.output >= 0 {
            return Some(PyFloat::new(py, *y.get(choice.output as usize)?).into_any());
        }
        if e.nout == 1 {
            return Some(PyFloat::new(py, y[0]).into_any());
        }
        let values = PyTuple::new(py, y[..e.nout].iter().copied()).ok()?;
        match (&choice.result_type, &choice.tuple_new) {
            (Some(t), Some(new)) => new.bind(py).call1((t.bind(py), values)).ok(),
            (Some(t), None) => t.bind(py).call1(values).ok(),
            (None, _) => Some(values.into_any()),
        }
    }

    /// The fields of a fluid argument, through the one-entry identity cache.
    /// One field of a fluid argument, read from the one-entry identity cache
    /// (filled on a miss) without copying the state.
    #[inline]
    fn fluid_field(&self, obj: Borrowed<'_, '_, PyAny>, field: usize) -> Option<f64> {
        // SAFETY: GIL held (we are inside a call from Python); the shared
        // borrow ends before any Python code can run.
        if let Some((o, v)) = unsafe { &*self.cache.0.get() }.as_ref() {
            if o.as_ptr() == obj.as_ptr() {
                return v.get(field).copied();
            }
        }
        let v = fluid_values(obj)?; // may run Python code (and re-enter)
        // Swap without running Python code, then drop the old entry (its
        // decref may run a finalizer) once the cell is consistent again.
        let old = std::mem::replace(unsafe { &mut *self.cache.0.get() }, Some((obj.to_owned().unbind(), v)));
        drop(old);
        v.get(field).copied()
    }

    /// Forward the call unchanged to the Python fallback.
    ///
    /// # Safety
    /// As for [`Front::fast`].
    unsafe fn slow<'py>(
        &self,
        py: Python<'py>,
        args: *const *mut ffi::PyObject,
        nargs: usize,
        kwnames: *mut ffi::PyObject,
    ) -> PyResult<Bound<'py, PyAny>> {
        let positional =
            PyTuple::new(py, (0..nargs).map(|i| unsafe { Borrowed::from_ptr(py, *args.add(i)) }))?;
        if kwnames.is_null() {
            return self.fallback.bind(py).call1(positional);
        }
        let kw = unsafe { Borrowed::from_ptr(py, kwnames) }.cast::<PyTuple>()?;
        let dict = PyDict::new(py);
        for (j, key) in kw.iter().enumerate() {
            dict.set_item(key, unsafe { Borrowed::from_ptr(py, *args.add(nargs + j)) })?;
        }
        self.fallback.bind(py).call(positional, Some(&dict))
    }
}

/// The METH_FASTCALL | METH_KEYWORDS entry point of every public function.
unsafe extern "C" fn front_call(
    slf: *mut ffi::PyObject,
    args: *const *mut ffi::PyObject,
    nargs: ffi::Py_ssize_t,
    kwnames: *mut ffi::PyObject,
) -> *mut ffi::PyObject {
    // SAFETY: CPython calls this with the GIL held (attached thread state).
    let py = unsafe { Python::assume_attached() };
    let result = catch_unwind(AssertUnwindSafe(|| {
        // SAFETY: `slf` is the Front this builtin was created with (make_function).
        let front = unsafe { Borrowed::from_ptr(py, slf).cast_unchecked::<Front>() };
        let front = front.get();
        let n = nargs.max(0) as usize;
        match unsafe { front.fast(py, args, n, kwnames) } {
            Some(v) => Ok(v),
            None => unsafe { front.slow(py, args, n, kwnames) },
        }
    }));
    match result {
        Ok(Ok(v)) => v.into_ptr(),
        Ok(Err(err)) => {
            err.restore(py);
            std::ptr::null_mut()
        }
        Err(_) => {
            PyRuntimeError::new_err("wetboil: internal error (panic) in a front-door call").restore(py);
            std::ptr::null_mut()
        }
    }
}

#[pymethods]
impl Front {
    /// Pickling a builtin bound to this object pickles `getattr(obj, name)`:
    /// rebuild `obj` as the public module, whose attribute is the function.
    fn __reduce__(&self, py: Python<'_>) -> PyResult<(Py<PyAny>, (String,))> {
        let import = py.import("importlib")?.getattr("import_module")?;
        Ok((import.unbind(), (self.module.clone(),)))
    }

    /// Names of the Rust kernels behind the function's fast path.
    #[getter]
    fn kernels(&self) -> Vec<&'static str> {
        self.choices.iter().map(|c| entries()[c.entry].model.name).collect()
    }

    /// The Python function that handles every call the fast path does not.
    #[getter]
    fn fallback(&self, py: Python<'_>) -> Py<PyAny> {
        self.fallback.clone_ref(py)
    }
}

/// Whether `t` is a named-tuple class with `nout` fields whose `__new__` is
/// the one `collections.namedtuple` generated (the class that supplies
/// `__new__` also defines `_fields`): then `tuple.__new__(t, values)` builds
/// exactly what calling `t` builds. A subclass with its own `__new__`, a
/// plain tuple subclass or another field count is called instead.
fn plain_named_tuple(t: &Bound<'_, PyAny>, nout: usize) -> PyResult<bool> {
    let Ok(ty) = t.cast::<pyo3::types::PyType>() else {
        return Ok(false);
    };
    if !ty.is_subclass_of::<PyTuple>()? {
        return Ok(false);
    }
    for base in ty.getattr("__mro__")?.try_iter()? {
        let base = base?;
        let own = base.getattr("__dict__")?;
        if own.contains("__new__")? {
            return Ok(own.contains("_fields")? && base.getattr("_fields")?.len()? == nout);
        }
    }
    Ok(false)
}

/// One fast-path choice as passed from Python: (selector value or None,
/// kernel name, plan, output index or -1, result type or None).
type ChoiceSpec = (Option<Py<PyAny>>, String, Vec<(usize, isize)>, isize, Option<Py<PyAny>>);

/// Build the public builtin function `module.name`.
///
/// `choices` lists the kernels its fast path can evaluate; with one choice
/// `selector` is -1, otherwise it is the index of the parameter whose value
/// picks the choice (a method name, a flag). Every other call goes to
/// `fallback`. `doc` must start with the text signature line
/// (`name(a, b=1.0)\n--\n\n`).
#[pyfunction]
#[allow(clippy::too_many_arguments)]
#[pyo3(signature = (choices, selector, names, defaults, fallback, module, name, doc))]
pub fn make_function<'py>(
    py: Python<'py>,
    choices: Vec<ChoiceSpec>,
    selector: isize,
    names: Vec<String>,
    defaults: Vec<Option<Py<PyAny>>>,
    fallback: Py<PyAny>,
    module: String,
    name: &str,
    doc: &str,
) -> PyResult<Bound<'py, PyAny>> {
    if names.len() > MAX_ARGS || names.len() != defaults.len() {
        return Err(PyValueError::new_err("inconsistent parameters for a front-door function"));
    }
    if selector >= names.len() as isize || (selector < 0 && choices.len() != 1) {
        return Err(PyValueError::new_err("a function with several kernels needs a selector parameter"));
    }
    let mut built = Vec::with_capacity(choices.len());
    for (key, kernel, plan, output, result_type) in choices {
        let entry = entries()
            .iter()
            .position(|e| e.model.name == kernel)
            .ok_or_else(|| PyValueError::new_err(format!("unknown kernel {kernel:?}")))?;
        let e = &entries()[entry];
        if plan.len() != e.nin || plan.iter().any(|&(a, _)| a >= names.len()) || output >= e.nout as isize {
            return Err(PyValueError::new_err(format!("plan of kernel {kernel} does not fit")));
        }
        let tuple_new = match &result_type {
            Some(t) if plain_named_tuple(t.bind(py), e.nout)? => Some(py.get_type::<PyTuple>().getattr("__new__")?.unbind()),
            _ => None,
        };
        built.push(Choice { key, entry, plan, output, result_type, tuple_new });
    }
    let default_numbers = defaults.iter().map(|d| d.as_ref().and_then(|d| plain_number(d.bind(py).as_borrowed()))).collect();
    let front = Bound::new(
        py,
        Front {
            choices: built,
            selector,
            names: names.iter().map(|n| PyString::intern(py, n).unbind()).collect(),
            defaults,
            default_numbers,
            fallback,
            module: module.clone(),
            cache: GilCell(std::cell::UnsafeCell::new(None)),
        },
    )?;
    let name_c: &'static CString = Box::leak(Box::new(CString::new(name)?));
    let doc_c: &'static CString = Box::leak(Box::new(CString::new(doc.replace('\0', " "))?));
    // CPython keeps the method definition for the life of the function
    // object; leak it so it is 'static.
    let def: &'static mut ffi::PyMethodDef = Box::leak(Box::new(ffi::PyMethodDef {
        ml_name: name_c.as_ptr(),
        ml_meth: ffi::PyMethodDefPointer { PyCFunctionFastWithKeywords: front_call },
        ml_flags: (ffi::METH_FASTCALL | ffi::METH_KEYWORDS) as c_int,
        ml_doc: doc_c.as_ptr(),
    }));
    let module_name = PyString::new(py, &module);
    // SAFETY: `def` is 'static; `front` and `module_name` are live objects
    // (CPython takes its own references to both).
    unsafe {
        let f = ffi::PyCFunction_NewEx(def, front.as_ptr(), module_name.as_ptr());
        Bound::from_owned_ptr_or_err(py, f)
    }
}
