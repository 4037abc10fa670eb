"""The one generic front door that turns a registered Rust kernel into a public
function.

A public function is written once in its topic module as a *template*: its
signature (argument names, defaults) and its numpy-style docstring. The
`kernel` decorator checks the template against the kernel's facts declared in
Rust (`wetboil._core.models_json()`) and returns a real Python function with
the same signature and docstring that

* sends plain numbers and scalar fluid states straight to the Rust scalar path
  (`_core.Caller`), returning a `float` (or a named tuple);
* sends ndarrays, lists and scalars to the NumPy ufunc, with one warning per
  call for impossible or out-of-range elements (see `wetboil.errstate`);
* computes pandas Series and DataFrames on their numbers, by position (they
  must all have the result's shape and one index), and labels the results
  like them;
* sends xarray objects through `xarray.apply_ufunc`, so they broadcast by
  dimension name, and dask arrays through `dask.array.apply_gufunc` (or
  ``apply_ufunc(dask="parallelized")``), so they stay lazy, multi-output
  kernels included.
"""

from __future__ import annotations

import contextlib
import contextvars
import functools
import inspect
import json
import math
import os
import sys
from typing import Any, Callable, Dict, Iterator, List, Mapping, NamedTuple, Optional, Sequence, Tuple, TypeVar

import numpy as np

from . import _core
from ._errors import _STATE, WetboilError, WetboilTypeError, WetboilValueError, report

__all__ = ["kernel", "models", "MODELS", "set_num_threads", "get_num_threads", "set_buffer_cache", "buffer_cache_info",
           "ufunc_of", "model_of", "validity", "VALIDITY_CODES"]


class Arg(NamedTuple):
    name: str
    unit: str


class Model(NamedTuple):
    """The facts of one published model, as declared next to its Rust kernel.

    `validity` is the range as shown to users: the model's own range
    (`own_validity`) and the clause of each unit-slip bound on its inputs.
    `doi` is that of the first paper `reference` names that has one ("" when
    none has; Zuber's 1959 report and the IAPWS releases have none).
    `input_bounds` lists those bounds as ``(input index, largest magnitude,
    clause)``: an element above one is computed but counted as outside the
    range (a surface tension above 1 N/m was most likely given in mN/m)."""

    name: str
    summary: str
    equation: str
    inputs: Tuple[Arg, ...]
    outputs: Tuple[Arg, ...]
    domain: str
    validity: str
    reference: str
    doi: str
    verification: str
    own_validity: str = ""
    input_bounds: Tuple[Tuple[int, float, str], ...] = ()


def _load_models() -> Dict[str, Model]:
    out = {}
    for m in json.loads(_core.models_json()):
        m["inputs"] = tuple(Arg(**a) for a in m["inputs"])
        m["outputs"] = tuple(Arg(**a) for a in m["outputs"])
        m["input_bounds"] = tuple((int(i), float(mx), str(c)) for i, mx, c in m.pop("bounds"))
        out[m["name"]] = Model(**m)
    return out


MODELS: Dict[str, Model] = _load_models()


def models() -> List[Model]:
    """Every registered kernel's facts (name, equation, units, domain, validity
    range, reference, DOI, verification status) as a list of `Model` tuples."""
    return list(MODELS.values())


def get_num_threads() -> int:
    """Number of threads that large array calls use."""
    return _core.get_num_threads()


def _max_num_threads() -> int:
    """Most threads `set_num_threads` accepts: four per logical core of the
    machine (``os.cpu_count()``). The pool starts every thread it is given
    before a call runs, so a mistyped count (say 100000) would keep the first
    large call starting threads for minutes instead of computing."""
    return 4 * (os.cpu_count() or 1)


def set_num_threads(n: int) -> None:
    """Set the number of threads large array calls use (default: the
    ``WETBOIL_NUM_THREADS`` environment variable, else all cores), from 1 to
    four per logical core (``os.cpu_count()``); a larger count raises
    `WetboilValueError` (the environment variable is capped there, with a
    warning)."""
    if isinstance(n, bool) or not isinstance(n, (int, np.integer)) or n < 1:
        raise WetboilValueError(f"set_num_threads: n must be a positive integer, got {n!r}")
    if n > _max_num_threads():
        raise WetboilValueError(f"set_num_threads: n = {n} is more than four threads per logical core of this machine "
                                f"({os.cpu_count() or 1} cores: at most {_max_num_threads()}); every thread is started "
                                f"before a call runs")
    _core.set_num_threads(int(n))


def _cap_env_threads() -> None:
    # WETBOIL_NUM_THREADS is read by the Rust pool; a count far above the
    # machine's cores would make the first large call start that many threads.
    # Read the variable here rather than asking the pool: get_num_threads()
    # would fix the count at import, and a variable set after the import but
    # before the first call (honoured before the cap) would be ignored.
    raw = os.environ.get("WETBOIL_NUM_THREADS", "").strip()
    if not raw.isdigit():
        return  # unset or not a count: the pool's own default
    n = int(raw)
    if n > _max_num_threads():
        import warnings
        from ._errors import WetboilWarning
        warnings.warn(f"WETBOIL_NUM_THREADS={n} is more than four threads per logical core of this machine; using "
                      f"{_max_num_threads()}", WetboilWarning, stacklevel=2)
        _core.set_num_threads(_max_num_threads())


_cap_env_threads()


def set_buffer_cache(max_bytes: int) -> int:
    """Set how many bytes of freed output arrays wetboil keeps for reuse, and
    return the previous limit. 0 turns the cache off and frees what it holds.

    Large arrays that wetboil's functions return are allocated through a NumPy
    memory handler (NEP 49) that, when such an array is freed, keeps its
    buffer (blocks of 1 MiB and more, at most 32) and hands it out again to
    the next wetboil result of exactly the same size. Repeated calls on
    arrays of one size (the chunks of a sweep, Monte-Carlo batches, the
    iterations of a thermal model) then skip the page faults of fresh memory,
    which cost about 7 ms per 10^7 float64 on the machines we measure and do
    not get faster with threads. The price is that up to `max_bytes` of freed
    memory stays with the process. Default: 1/8 of the physical memory, at
    most 2 GiB; the environment variable ``WETBOIL_BUFFER_CACHE_MB`` sets it
    at start-up. Only wetboil's own results use the handler."""
    if isinstance(max_bytes, bool) or not isinstance(max_bytes, (int, np.integer)) or max_bytes < 0:
        raise WetboilValueError(f"set_buffer_cache: max_bytes must be a non-negative integer, got {max_bytes!r}")
    return _core.set_buffer_cache(int(max_bytes))


def buffer_cache_info() -> Dict[str, int]:
    """State of the buffer cache (see `set_buffer_cache`): ``max_bytes``,
    ``held_bytes`` and ``held_blocks`` (freed buffers kept now), ``hits`` and
    ``misses`` (requests of 1 MiB or more served from it, or not, so far)."""
    keys = ("max_bytes", "held_bytes", "held_blocks", "hits", "misses")
    return dict(zip(keys, _core.buffer_cache_info()))


if hasattr(os, "register_at_fork"):
    # A fork()ed child must not reuse the parent's worker threads (they do not
    # exist there); see src/python/threads.rs.
    os.register_at_fork(after_in_child=_core._after_fork_child)


# ----------------------------------------------------------------------------
# argument classification


def _is_xarray(x: Any) -> bool:
    xr = sys.modules.get("xarray")
    return xr is not None and isinstance(x, (xr.DataArray, xr.Variable))


def _is_dask(x: Any) -> bool:
    da = sys.modules.get("dask.array")
    if da is not None and isinstance(x, da.Array):
        return True
    if _is_xarray(x):
        return da is not None and isinstance(x.data, da.Array)
    return False


_NUMERIC_KINDS = "fiu"


def _is_pandas(x: Any) -> bool:
    pd = sys.modules.get("pandas")
    return pd is not None and isinstance(x, (pd.Series, pd.DataFrame))


def _check_pandas(function: str, label: str, value: Any) -> None:
    """Check a pandas input's dtypes, without converting it (`_pandas_values` converts, once): numbers,
    nullable ones included (pd.NA becomes NaN); object columns follow the rules of an object ndarray
    when converted (numbers accepted, None and the rest refused)."""
    import pandas as pd

    api = pd.api.types
    for dt in ([value.dtype] if isinstance(value, pd.Series) else value.dtypes):
        if dt == object:
            continue
        if not api.is_numeric_dtype(dt) or api.is_bool_dtype(dt) or api.is_complex_dtype(dt):
            raise WetboilTypeError(f"{function}: {label} must hold real numbers, got dtype {dt}")


def _pandas_values(function: str, label: str, value: Any) -> np.ndarray:
    """The numbers of a pandas input checked by `_check_pandas`, as a float64 ndarray of its shape:
    missing values of nullable dtypes as NaN, object columns converted as `_coerce` converts an object
    ndarray."""
    import pandas as pd

    if isinstance(value, pd.Series):
        if value.dtype == object:
            return np.asarray(_coerce(function, label, value.to_numpy()), dtype=np.float64)
        return value.to_numpy(dtype=np.float64, na_value=np.nan)
    if not any(dt == object for dt in value.dtypes):
        return value.to_numpy(dtype=np.float64, na_value=np.nan)
    out = np.empty(value.shape)
    for j in range(value.shape[1]):
        out[:, j] = _pandas_values(function, label, value.iloc[:, j])
    return out


def _pandas_like(like: Any, values: np.ndarray, name: Any) -> Any:
    """`values` (an array of `like`'s shape: a fresh wetboil result, or numbers only read, so not
    copied) as a Series named `name` or a DataFrame, with the index (and columns) of the pandas `like`."""
    import pandas as pd

    if isinstance(like, pd.Series):
        return pd.Series(values, index=like.index, name=name, copy=False)
    return pd.DataFrame(values, index=like.index, columns=like.columns, copy=False)


def _coerce(function: str, label: str, value: Any) -> Any:
    """Check one kernel input and bring it to a form the ufunc takes."""
    if type(value) is np.ndarray and value.dtype.kind in _NUMERIC_KINDS and value.dtype.itemsize <= 8:
        return value  # the common case, first (the checks below cost microseconds per call)
    if isinstance(value, float):
        return value
    if isinstance(value, int) and not isinstance(value, bool):
        if -(1 << 63) <= value < 1 << 63:
            return value
        try:
            return float(value)  # beyond int64 the ufunc would not convert it
        except OverflowError:
            raise WetboilValueError(f"{function}: {label} is an integer beyond the range of float64 "
                                    "(about 1.8e308)") from None
    if value is None or isinstance(value, (str, bytes, bytearray, bool, np.bool_)):
        raise WetboilTypeError(f"{function}: {label} must be a number or an array of numbers, got {type(value).__name__}")
    if isinstance(value, (list, tuple)) and _holds_text_or_bool(value):
        raise WetboilTypeError(f"{function}: {label} must hold real numbers, got text or a boolean among them")
    if isinstance(value, _saturation_type()):
        raise WetboilTypeError(f"{function}: {label} must be a number or an array of numbers, got a Saturation "
                               f"(a fluid state: pass the field meant, e.g. fluid.p or fluid.T)")
    if _is_xarray(value) or _is_dask(value):
        xr = sys.modules.get("xarray")
        if xr is not None and isinstance(value, xr.Variable):  # labelled by dimension names, as a DataArray is
            value = xr.DataArray(value)
        kind = value.dtype.kind
        if kind not in _NUMERIC_KINDS:
            raise WetboilTypeError(f"{function}: {label} must hold numbers, got dtype {value.dtype}")
        return value if value.dtype.itemsize <= 8 else value.astype(np.float64)  # long double: kernels are f64
    if _is_pandas(value):
        _check_pandas(function, label, value)  # converted once, in `_dispatch_pandas`
        return value
    if isinstance(value, complex):
        raise WetboilTypeError(f"{function}: {label} must be real, got complex")
    if isinstance(value, np.ma.MaskedArray) and value.dtype.kind in _NUMERIC_KINDS:
        # masked elements are missing data: NaN (propagated silently), not the numbers under the mask
        return np.ma.filled(value.astype(np.float64), np.nan)
    try:
        arr = np.asarray(value)
    except (ValueError, TypeError) as exc:
        raise WetboilValueError(f"{function}: {label} is not a rectangular array of numbers ({exc})") from None
    kind = arr.dtype.kind
    if kind in _NUMERIC_KINDS:
        return arr if arr.dtype.itemsize <= 8 else arr.astype(np.float64)  # long double: kernels are f64
    if kind == "O":
        if any(v is None for v in arr.flat):
            raise WetboilTypeError(f"{function}: {label} contains None; use nan for a missing value")
        if any(isinstance(v, (str, bytes, bool, np.bool_)) for v in arr.flat):  # "45" is text, True no angle
            raise WetboilTypeError(f"{function}: {label} must hold real numbers, got dtype object with text or a "
                                   "boolean among them")
        try:
            return arr.astype(np.float64)
        except (TypeError, ValueError, OverflowError):
            pass
    raise WetboilTypeError(f"{function}: {label} must hold real numbers, got dtype {arr.dtype}")


def _holds_text_or_bool(seq: Any) -> bool:
    """Whether a (nested) list or tuple holds a string, bytes or a boolean, which NumPy would
    otherwise turn into numbers (True into 1 deg) or text."""
    for v in seq:
        if isinstance(v, (str, bytes, bool, np.bool_)) or (isinstance(v, (list, tuple)) and _holds_text_or_bool(v)):
            return True
    return False


def need_saturation(function: str, fluid: Any) -> Any:
    """`fluid` itself when it is a `wetboil.fluids.Saturation`, else a
    `WetboilTypeError` naming `function`."""
    if not isinstance(fluid, _saturation_type()):
        raise WetboilTypeError(
            f"{function}: fluid must be a wetboil.fluids.Saturation "
            f"(for example wetboil.fluids.water(p=101325.0)), got {type(fluid).__name__}"
        )
    return fluid


def check_choice(function: str, label: str, value: Any, known: Any) -> str:
    """`value` when it is one of the names in `known` (a sequence or mapping);
    else `WetboilTypeError` (not a string) or `WetboilValueError` listing the
    choices. Every ``method=``/``geometry=`` argument goes through here."""
    if not isinstance(value, str):
        raise WetboilTypeError(f"{function}: {label} must be a string, got {type(value).__name__}")
    if value not in known:
        raise WetboilValueError(f"{function}: unknown {label} {value!r}; choices are {', '.join(known)}")
    return value


# ----------------------------------------------------------------------------
# evaluation


def _as_result(outs: Any, result_type: Optional[Callable[..., Any]]) -> Any:
    if result_type is None:
        return outs
    return result_type(*outs)


class ValidityCapture:
    """Per-element flags collected from every kernel evaluated inside
    `capture_validity` (NumPy inputs only): `invalid` (impossible elements)
    and `out_of_range` (outside a published range), broadcast together."""

    def __init__(self) -> None:
        self.invalid: Any = False
        self.out_of_range: Any = False

    def add(self, codes: Any) -> None:
        self.invalid = np.logical_or(self.invalid, codes == 1)
        self.out_of_range = np.logical_or(self.out_of_range, codes == 2)


_CAPTURE: contextvars.ContextVar[Optional[ValidityCapture]] = contextvars.ContextVar("wetboil_capture", default=None)
# the scalar fast path returns flagged elements itself where their action is "ignore" and nothing captures them
_core._bind_policy(_STATE, _CAPTURE)


@contextlib.contextmanager
def capture_validity() -> Iterator[ValidityCapture]:
    """Collect the per-element validity of every kernel call in the block.

    >>> import numpy as np, wetboil
    >>> from wetboil.chf import kandlikar
    >>> from wetboil.fluids import water
    >>> with wetboil.errstate(out_of_range="ignore"), capture_validity() as cap:
    ...     q = kandlikar(np.array([30.0, 60.0]), water(p=1e5), np.array([0.0, 100.0]))
    >>> cap.out_of_range.tolist()
    [False, True]
    """
    cap = ValidityCapture()
    token = _CAPTURE.set(cap)
    try:
        yield cap
    finally:
        _CAPTURE.reset(token)


#: Below this many elements every call goes through the ufunc.
GRID_MIN = 1 << 15


def _shape(x: Any) -> Tuple[int, ...]:
    """`np.shape(x)`, without its dispatch cost for arrays and plain numbers."""
    if type(x) is np.ndarray:
        return x.shape
    if type(x) is float or type(x) is int:
        return ()
    return np.shape(x)


def _broadcast_shape(shapes: Sequence[Tuple[int, ...]]) -> Tuple[int, ...]:
    """`np.broadcast_shapes(*shapes)`, without its cost (a few microseconds) in the common case of
    arrays of one shape and scalars."""
    shape: Tuple[int, ...] = ()
    for s in shapes:
        if s == () or s == shape:
            continue
        if shape != ():
            return tuple(np.broadcast_shapes(*shapes))
        shape = s
    return shape


def _grid_worthy(arrays: Sequence[Any]) -> Optional[Tuple[int, ...]]:
    """The broadcast shape when a call should take the grid path: large, and
    NumPy would otherwise buffer it (array-to-array broadcasting, casting,
    byte swapping, non-contiguous data), which rules out threads."""
    bound = 1  # the product of the sizes bounds the broadcast size: most calls stop here, in well under 1 us
    for a in arrays:
        if type(a) is np.ndarray:
            bound *= a.size
        elif type(a) is not float and type(a) is not int:
            bound = GRID_MIN
            break
    if bound < GRID_MIN:
        return None
    shapes = [_shape(a) for a in arrays]
    shape = _broadcast_shape(shapes)
    if math.prod(shape) < GRID_MIN:
        return None
    for a, s in zip(arrays, shapes):
        if s == ():
            continue
        if s != shape or not isinstance(a, np.ndarray) or a.dtype != np.float64 or not a.flags.c_contiguous \
                or not a.flags.aligned:
            return tuple(shape)
    return None


def _whole(a: Any, shape: Tuple[int, ...]) -> bool:
    """Whether `a` holds an element of its own for every point of `shape`:
    that shape, and not a broadcast view (no zero stride along an axis of
    more than one point)."""
    if _shape(a) != shape:
        return False
    strides = getattr(a, "strides", None)
    return strides is None or all(st != 0 or n == 1 for st, n in zip(strides, shape))


#: Side (0: surface, 1: fluid) of each input of the kernels in product form.
SIDES: Dict[str, Tuple[int, ...]] = {k: tuple(v) for k, v in _core.factored_sides().items()}


def _factor_axes(arrays: Sequence[Any], sides: Tuple[int, ...], shape: Tuple[int, ...]) -> bool:
    """True when the inputs of the two sides vary along disjoint axes of the
    broadcast `shape` (an outer product, such as angles x pressures)."""
    used: list = [set(), set()]
    for a, s in zip(arrays, sides):
        sh = _shape(a)
        used[s].update(len(shape) - len(sh) + i for i, n in enumerate(sh) if n > 1)
    return not (used[0] & used[1])


def _factorised(name: str, arrays: Sequence[Any], sides: Tuple[int, ...], shape: Tuple[int, ...],
                output: Optional[int] = None) -> Tuple[Any, int, int]:
    """The factorised grid path: each side's factors once per point of its own
    axes, then one parallel multiplication per grid point (for output `output`
    only, when given). Bit-identical to the element path (the kernels compute
    exactly this product; Rust tests check it)."""
    n_out = len(MODELS[name].outputs)
    factors, hist = [], []
    for s in (0, 1):
        mine = [np.asarray(a, dtype=np.float64) for a, sd in zip(arrays, sides) if sd == s]
        sub = np.broadcast_shapes(*(a.shape for a in mine))
        size = int(np.prod(sub))
        ins = [np.require(np.broadcast_to(np.asarray(a, dtype=np.float64), sub), requirements=["C", "A"]).reshape(-1)
               if sd == s else np.ones(1) for a, sd in zip(arrays, sides)]
        outs = [np.empty(size) for _ in range(n_out)]
        codes = np.empty(size, dtype=np.int8)
        _core.factor_call(name, s, ins, outs, codes)
        factors.append([o.reshape(sub) for o in outs])
        hist.append(np.bincount(codes, minlength=4))
    # element code = 3 if either side is 3, else 1 if either is 1, else 2 if either is 2, else 0
    (a_ok, a_bad, a_out, a_nan), (b_ok, b_bad, b_out, b_nan) = (h.tolist() for h in hist)
    a_real, b_real = a_ok + a_bad + a_out, b_ok + b_bad + b_out
    a_pos, b_pos = a_ok + a_out, b_ok + b_out
    invalid = a_real * b_real - a_pos * b_pos
    out_of_range = a_pos * b_pos - a_ok * b_ok
    results = []
    for k, (fa, fb) in enumerate(zip(*factors)):
        if output is not None and k != output:
            continue
        out = np.empty(shape)
        _core.product_call(np.broadcast_to(fa, shape), np.broadcast_to(fb, shape), out)
        results.append(out)
    return (results[0] if len(results) == 1 else tuple(results)), invalid, out_of_range


def evaluate_arrays(name: str, function: str, *arrays: Any, output: Optional[int] = None) -> Any:
    """Evaluate kernel `name` on NumPy-compatible arrays and apply the element
    policy. Whole contiguous float64 arrays (and arrays against scalars) go
    through the ufunc, which threads them itself; large broadcast grids go
    through the factorised grid path when the kernel is in product form and
    the grid is an outer product of its two sides, else through the parallel
    grid path. Whole arrays in other layouts (casts, strides, byte order) are
    copied to contiguous float64 and go through the ufunc. `output=k` returns
    output k only.
    Module-level and picklable (used by dask). The outputs are allocated
    through the buffer cache (see `set_buffer_cache`)."""
    token = _core._cache_enter()
    try:
        return _evaluate_arrays(name, function, arrays, output)
    finally:
        _core._cache_exit(token)


def _evaluate_arrays(name: str, function: str, arrays: Sequence[Any], output: Optional[int]) -> Any:
    cap = _CAPTURE.get()
    if cap is not None:
        with np.errstate(all="ignore"):  # range checks of extreme inputs raise FP flags: not the user's concern
            cap.add(getattr(_core, f"{name}_status")(*arrays))
    shape = _grid_worthy(arrays)
    if shape is not None and all(_shape(a) == () or _whole(a, shape) for a in arrays):
        # nothing is broadcast: only the layout (a cast, a stride, byte order) kept these off the
        # ufunc's threaded contiguous loop, so one copy per such input puts them on it (10x-25x
        # faster than the element-wise grid path at 10^7 points)
        arrays = [np.ascontiguousarray(a, dtype=np.float64) if _shape(a) == shape else a for a in arrays]
        shape = None
    sides = SIDES.get(name)
    outs: Any
    beyond: Optional[int] = None  # out-of-range elements above a unit-slip bound, where the path counts them
    if shape is not None and sides is not None and _factor_axes(arrays, sides, shape):
        outs, invalid, out_of_range = _factorised(name, arrays, sides, shape, output)
        output = None  # already selected
    elif shape is not None:
        n_out = len(MODELS[name].outputs)
        ins = [np.broadcast_to(np.asarray(a, dtype=np.float64), shape) for a in arrays]
        outs_list = [np.empty(shape) for _ in range(n_out)]
        invalid, out_of_range, beyond = _core.grid_call(name, ins, outs_list)
        outs = outs_list[0] if n_out == 1 else tuple(outs_list)
    else:
        uf = getattr(_core, name)
        _core.take_counts()  # discard counts of direct ufunc calls made earlier
        if all(type(a) is float or type(a) is np.ndarray and a.dtype == np.float64 for a in arrays):
            outs = uf(*arrays)  # no cast, and the loops leave the FP flags as they found them (ufunc.rs)
        else:
            with np.errstate(all="ignore"):  # our own policy reports NaNs, not the flags of NumPy's casts
                outs = uf(*arrays)
        invalid, out_of_range, beyond = _core.take_counts()
    if invalid or out_of_range:
        size = int(np.size(outs[0] if isinstance(outs, tuple) else outs))
        # the range text only where the policy shows it
        validity = (_range_text(MODELS[name], arrays, size, out_of_range, beyond)
                    if out_of_range and _STATE.get().out_of_range != "ignore" else "")
        report(function, size, invalid, out_of_range, validity, MODELS[name].domain)
    return outs if output is None else outs[output]


def _range_text(model: Model, arrays: Sequence[Any], size: int, out_of_range: int,
                beyond: Optional[int] = None) -> str:
    """The part of `model`'s validity text that a call's `out_of_range` elements (of `size`) failed:
    the clause of each unit-slip bound some element exceeds (a surface tension above 1 N/m), and the
    model's own range unless those elements account for every count. Without it, a tension typed
    in mN/m was reported with a whole paragraph of ranges it had not left, and a pressure outside
    a correlation's data with the tension bound it had not exceeded.

    `beyond`, the count of out-of-range elements above some bound, comes from the Rust loops where
    they count it (the ufunc and grid paths): then the inputs are read again only to tell several
    bounds apart, after a unit slip. Otherwise (the factorised path, whose inputs are its axes) one
    pass over each bounded input (`_core.count_beyond`) finds them."""
    if not model.input_bounds:
        return model.validity
    clauses = list(dict.fromkeys(c for _, _, c in model.input_bounds))
    if beyond == 0:
        return model.own_validity or model.validity
    if beyond is not None and len(clauses) == 1:
        exceeded = clauses
        n_over = beyond
    else:
        counted: list = []  # (elements above the bound, in the call's broadcast size; input; bound; clause)
        for i, largest, clause in model.input_bounds:
            a = arrays[i]
            if type(a) is float or type(a) is int:
                n = size if abs(a) > largest else 0
            else:
                a = np.asarray(a)
                n = _core.count_beyond(a if a.dtype == np.float64 else a.astype(np.float64), largest)
                n *= size // max(a.size, 1)
            if n:
                counted.append((n, a, largest, clause))
        if not counted:
            return model.own_validity or model.validity
        exceeded = [c for _, _, _, c in counted]
        n_over = max(n for n, _, _, _ in counted) if beyond is None else beyond
        if beyond is None and len(counted) > 1 and n_over < out_of_range:  # several bounds: their union (rare)
            with np.errstate(invalid="ignore"):
                union = functools.reduce(np.logical_or, (np.abs(np.asarray(a, dtype=np.float64)) > b
                                                         for _, a, b, _ in counted))
            n_over = int(np.sum(union)) * (size // max(int(np.size(union)), 1))
    own = [] if n_over >= out_of_range or not model.own_validity else [model.own_validity]
    return "; ".join(dict.fromkeys(own + exceeded))


def _scalarise(x: Any) -> Any:
    if isinstance(x, np.ndarray) and x.ndim == 0:
        return float(x)
    if isinstance(x, np.floating):
        return float(x)
    return x


class _Spec(NamedTuple):
    model: Model
    function: str  # public qualified name, e.g. "departure.fritz"
    plan: Tuple[Tuple[int, str], ...]  # per kernel input: (argument index, fluid field or "")
    labels: Tuple[str, ...]  # per kernel input: how to name it in messages
    params: Tuple[str, ...]
    result_type: Optional[Callable[..., Any]]
    output: Optional[int] = None  # the one output returned, for `kernel(..., output=k)`
    fill: Optional[Callable[[Tuple[Any, ...]], Tuple[Any, ...]]] = None  # see `kernel`


def _fluids() -> Any:
    """The `wetboil.fluids` module (it imports this one, so it is looked up, not imported at the top:
    a dictionary lookup instead of an import statement in every call, and right after a reload)."""
    mod = sys.modules.get(__package__ + ".fluids")
    if mod is None:
        from . import fluids as mod
    return mod


def _saturation_type() -> type:
    """`wetboil.fluids.Saturation`, looked up as `_fluids` says."""
    return _fluids().Saturation


def _gather(spec: _Spec, args: Sequence[Any]) -> list:
    """The kernel inputs of a call, checked and coerced, in kernel order."""
    inputs, missing = [], []
    fluids = _fluids()  # once per call: the array path's fixed cost is paid by every call
    saturation, not_given = fluids.Saturation, fluids.NOT_GIVEN
    for (ai, field), label in zip(spec.plan, spec.labels):
        a = args[ai]
        if field:
            if not isinstance(a, saturation):
                raise WetboilTypeError(
                    f"{spec.function}: {spec.params[ai]} must be a wetboil.fluids.Saturation "
                    f"(for example wetboil.fluids.water(p=101325.0)), got {type(a).__name__}"
                )
            a = getattr(a, field)
            if a is not_given:  # the constructor's default (Saturation._not_given), per field here
                missing.append(label)
        inputs.append(a if type(a) is float else _coerce(spec.function, label, a))
    if missing:
        from ._errors import WetboilWarning, _warn

        _warn(f"{spec.function}: {', '.join(missing)} not given to the Saturation, so the result is NaN "
              f"(set {'them' if len(missing) > 1 else 'it'} with .replace())", WetboilWarning)
    return inputs


def _under_policy(state: Any, func: Callable[..., Any], *arrays: Any) -> Any:
    """`func(*arrays)` under the element policy `state` (module level: picklable for dask workers)."""
    from ._errors import _STATE

    token = _STATE.set(state)
    try:
        return func(*arrays)
    finally:
        _STATE.reset(token)


def _dispatch(spec: _Spec, inputs: list, func: Callable[..., Any], dtypes: list, names: list) -> Any:
    """Run `func` (a NumPy-level function of the inputs with len(dtypes)
    outputs) through xarray, dask or directly, by the kind of the inputs."""
    n_out = len(dtypes)
    plain = all(type(x) is np.ndarray or type(x) is float or type(x) is int for x in inputs)
    if not plain and any(_is_pandas(x) for x in inputs):
        return _dispatch_pandas(spec, inputs, func, dtypes, names)
    if not plain and any(_is_xarray(x) or _is_dask(x) for x in inputs):
        # lazy (dask) evaluation runs `func` at compute time, perhaps in another thread or process:
        # it keeps the element policy in force at this call, not the one around .compute()
        from ._errors import _STATE

        func = functools.partial(_under_policy, _STATE.get(), func)
    if not plain and any(_is_xarray(x) for x in inputs):
        import xarray as xr

        # an input's attrs (its units above all) do not describe the result: each output gets its own
        # unit below (the coordinates keep theirs)
        kwargs: Dict[str, Any] = dict(dask="parallelized", output_dtypes=dtypes)
        if n_out > 1:
            kwargs["output_core_dims"] = [[] for _ in range(n_out)]
        try:
            outs = xr.apply_ufunc(func, *inputs, **kwargs)
        except WetboilError:
            raise
        except ValueError as exc:  # NumPy's broadcast error, xarray's AlignmentError (sizes of one dimension)
            described = ", ".join(
                f"{lab} {dict(x.sizes)}" if _is_xarray(x) else f"{lab} {_shape(x)}" for lab, x in zip(spec.labels, inputs))
            raise WetboilValueError(f"{spec.function}: argument shapes do not broadcast: {described} "
                                    f"({type(exc).__name__}: {exc})") from None
        units = {o.name: o.unit for o in spec.model.outputs}

        def labelled(o: Any, name: str) -> Any:
            o = o.rename(name)
            o.attrs = {"units": units[name]} if name in units else {}
            return o

        if n_out == 1:
            return labelled(outs, names[0])
        return tuple(labelled(o, nm) for o, nm in zip(outs, names))
    if not plain and any(_is_dask(x) for x in inputs):
        import dask.array as da
        from dask.array.core import unify_chunks

        # apply_gufunc wants equal chunks: rechunk dask inputs (and NumPy ones) to common chunks
        ndim = max(np.ndim(x) for x in inputs)
        pairs: list = []
        for x in inputs:
            if np.ndim(x):
                pairs += [da.asarray(x), "abcdefghijklmnopqrstuvwxyz"[ndim - np.ndim(x):ndim]]
        try:
            unified = iter(unify_chunks(*pairs)[1])
        except ValueError:
            described = ", ".join(f"{lab} {np.shape(x)}" for lab, x in zip(spec.labels, inputs))
            raise WetboilValueError(f"{spec.function}: argument shapes do not broadcast: {described}") from None
        inputs = [next(unified) if np.ndim(x) else x for x in inputs]
        signature = ",".join(["()"] * len(inputs)) + "->" + ",".join(["()"] * n_out)
        outs = da.apply_gufunc(func, signature, *inputs, output_dtypes=(dtypes[0] if n_out == 1 else dtypes))
        return outs if n_out == 1 else tuple(outs)
    shapes = [_shape(x) for x in inputs]
    try:
        _broadcast_shape(shapes)
    except ValueError:
        described = ", ".join(f"{lab} {shp}" for lab, shp in zip(spec.labels, shapes))
        raise WetboilValueError(f"{spec.function}: argument shapes do not broadcast: {described}") from None
    outs = func(*inputs)
    if n_out == 1:
        return _scalarise(outs)
    return tuple(_scalarise(o) for o in outs)


def _dispatch_pandas(spec: _Spec, inputs: list, func: Callable[..., Any], dtypes: list, names: list) -> Any:
    """`_dispatch` for calls with pandas inputs, as NumPy's own ufuncs keep a Series a Series: computed
    on their numbers, each result returned as a Series (or DataFrame) with their index (and columns),
    a Series named after the output, and the output's unit in ``attrs["units"]``.

    wetboil computes by position, so the labels must agree without aligning or broadcasting: every
    pandas input has the shape of the result and one index (and one set of columns); numbers and
    ndarrays broadcast against it as usual. With xarray or dask inputs as well, the pandas ones count as
    plain arrays (the result follows xarray or dask)."""
    import pandas as pd

    frames = [x for x in inputs if _is_pandas(x)]
    first = frames[0]
    lazy_or_xarray = any(_is_xarray(x) or _is_dask(x) for x in inputs)
    try:
        shape = None if lazy_or_xarray else _broadcast_shape([_shape(x) for x in inputs])
    except ValueError:
        shape = None  # `_dispatch` reports shapes that do not broadcast
    problem = None
    if any(x.shape != (first.shape if shape is None else shape) for x in frames):
        got = ", ".join(f"{type(x).__name__} {x.shape}" for x in frames)
        problem = f"got pandas inputs of shapes {got}" + ("" if shape is None else f" for a result of shape {shape}")
    elif not all(x.index.equals(first.index) for x in frames):
        problem = "got pandas inputs with different indexes"
    elif not all(x.columns.equals(first.columns) for x in frames if isinstance(x, pd.DataFrame)):
        problem = "got DataFrames with different columns"
    if problem is not None:
        raise WetboilValueError(
            f"{spec.function}: pandas inputs must all have the result's shape and one index (and the same "
            f"columns); {problem}. wetboil computes by position and neither aligns labels nor broadcasts "
            "them: pass .to_numpy() to broadcast by position (or align the inputs first)")
    values = [_pandas_values(spec.function, label, x) if _is_pandas(x) else x
              for label, x in zip(spec.labels, inputs)]
    outs = _dispatch(spec, values, func, dtypes, names)
    if lazy_or_xarray:
        return outs
    units = {o.name: o.unit for o in spec.model.outputs}

    def labelled(o: Any, name: str) -> Any:
        out = _pandas_like(first, o, name)
        if name in units:
            out.attrs["units"] = units[name]
        return out

    if len(dtypes) == 1:
        return labelled(outs, names[0])
    return tuple(labelled(o, nm) for o, nm in zip(outs, names))


def _evaluate(spec: _Spec, args: Sequence[Any]) -> Any:
    """The array path: gather the kernel inputs, check them, dispatch."""
    inputs = _gather(spec, args)
    if spec.output is not None:
        func = functools.partial(evaluate_arrays, spec.model.name, spec.function, output=spec.output)
        return _dispatch(spec, inputs, func, [np.float64], [spec.model.outputs[spec.output].name])
    n_out = len(spec.model.outputs)
    func = functools.partial(evaluate_arrays, spec.model.name, spec.function)
    outs = _dispatch(spec, inputs, func, [np.float64] * n_out, [o.name for o in spec.model.outputs])
    return outs if n_out == 1 else _as_result(outs, spec.result_type)


#: Meaning of the codes returned by `validity`.
VALIDITY_CODES = {0: "inside the published validity range", 1: "physically impossible",
                  2: "outside the published validity range", 3: "missing input (NaN)"}


def _status_arrays(name: str, *arrays: Any) -> Any:
    with np.errstate(all="ignore"):  # range checks of extreme inputs raise FP flags: not the user's concern
        return getattr(_core, f"{name}_status")(*arrays)


def validity(function: Callable[..., Any], *args: Any, **kwargs: Any) -> Any:
    """Per-element validity codes of a call (without computing it, for a kernel function).

    ``validity(f, *args, **kwargs)`` takes the same arguments as the kernel
    function `f` and returns int8 codes with the broadcast shape:
    0 inside the published validity range, 1 physically impossible (the
    result is NaN), 2 outside the published range (computed, extrapolated),
    3 a missing (NaN) input. Labels and laziness follow the arguments, as for
    `f` itself. Use it to flag rows of a result table.

    A function that picks its model by an argument (``site_density``'s
    `method`, ``lienhard_dhir``'s geometry...) is run instead, with warnings
    off, and the flags of the kernels it evaluates are combined; there 3
    marks any NaN result that no kernel flagged, and dask arguments are
    refused (ask the kernel function itself).

    Examples
    --------
    >>> import wetboil
    >>> from wetboil.chf import kandlikar
    >>> from wetboil.fluids import water
    >>> wetboil.validity(kandlikar, [30.0, 30.0, 200.0, float("nan")], water(p=1e5), [0.0, 120.0, 0.0, 0.0])
    array([0, 2, 1, 3], dtype=int8)
    """
    spec = _FUNCTIONS.get(function)
    if spec is None:
        return _validity_by_running(function, args, kwargs)
    try:
        bound = inspect.signature(function).bind(*args, **kwargs)
    except TypeError as exc:
        raise WetboilTypeError(f"validity: {exc}") from None
    bound.apply_defaults()
    args = tuple(bound.arguments[p] for p in spec.params)
    inputs = _gather(spec, spec.fill(args) if spec.fill is not None else args)
    func = functools.partial(_status_arrays, spec.model.name)
    out = _dispatch(spec, inputs, func, [np.int8], ["validity"])
    return out if not isinstance(out, float) else np.int8(out)


def _validity_by_running(function: Callable[..., Any], args: Sequence[Any], kwargs: Mapping[str, Any]) -> Any:
    """`validity` of a public function that picks its model by an argument (a method, a geometry) or
    combines several: the call is run with the element policy silenced and the flags of every kernel
    it evaluates are combined (1 impossible anywhere, else 2 outside a range, else 3 where the result
    is NaN without either: a missing input). Eager inputs only; labels follow the result."""
    from ._errors import errstate

    module = getattr(function, "__module__", None) or ""
    public = module.startswith("wetboil.") and module.split(".")[1] in ("wetting", "nucleation", "departure",
                                                                         "boiling", "chf", "fluids")
    if not callable(function) or not public:
        raise WetboilTypeError(f"validity: {function!r} is not a wetboil kernel function")
    if any(_is_dask(a) or _is_dask(getattr(a, "data", None)) for a in (*args, *kwargs.values())):
        raise WetboilTypeError(f"validity: {function.__qualname__} picks or combines models; give it eager "
                               "(NumPy or xarray) arguments, or ask validity of the one kernel function it uses")
    with errstate(invalid="ignore", out_of_range="ignore"), capture_validity() as cap, np.errstate(all="ignore"):
        result = function(*args, **kwargs)
    outputs = list(result) if isinstance(result, tuple) else [result]
    nan: Any = False
    for o in outputs:
        try:
            nan = np.logical_or(nan, np.isnan(np.asarray(getattr(o, "values", o), dtype=np.float64)))
        except (TypeError, ValueError):
            raise WetboilTypeError(f"validity: {function.__qualname__} returns {type(result).__name__}, "
                                   "not numbers or arrays; validity covers kernel-shaped results") from None
    codes = np.where(cap.invalid, 1, np.where(cap.out_of_range, 2, np.where(nan, 3, 0))).astype(np.int8)
    first = outputs[0]
    if _is_xarray(first) and codes.shape == first.shape:
        out = first.copy(data=codes).rename("validity")
        out.attrs = {}
        return out
    if _is_pandas(first) and codes.shape == first.shape:
        return _pandas_like(first, codes, "validity")
    return codes if codes.ndim else np.int8(codes)


# ----------------------------------------------------------------------------
# the decorator


F = TypeVar("F", bound=Callable[..., Any])


def kernel(name: str, *, result: Optional[Callable[..., Any]] = None, output: Optional[int] = None,
           fill: Optional[Callable[[Tuple[Any, ...]], Tuple[Any, ...]]] = None) -> Callable[[F], F]:
    """Make a public function from kernel `name` and a template.

    The template supplies the public signature and docstring; its body is
    never run. Every kernel input must be a template argument (``"radius"``)
    or a field of one (``"fluid.sigma"``), and every template argument must
    feed the kernel, so the two cannot drift apart: a mismatch fails at import.
    `result` is the named tuple type of a multi-output kernel; `output=k`
    instead makes a function that returns output k only (and computes only
    that one where the evaluation path allows, as the factorised grid path
    does). `fill` maps the call's arguments (a tuple in template order) to
    the arguments evaluated: it replaces a ``None`` default by a value that
    depends on other arguments (Rohsenow's exponent by fluid), returning
    the very tuple it was given when there is nothing to fill. A filled call
    is made again through the public function, so plain numbers still take
    the Rust fast path; `validity` fills the same way.

    The result is a builtin function (no Python frame on the scalar path) with
    the template's signature, docstring and module; it pickles by name. Calls
    that are not plain scalars are forwarded to a Python fallback with the
    same signature, which handles arrays, xarray, dask and the error policy.
    """
    from .fluids import FIELDS

    model = MODELS[name]

    def build(template: F) -> F:
        sig = inspect.signature(template)
        params = tuple(sig.parameters)
        function = f"{template.__module__.rpartition('.')[2]}.{template.__name__}"
        plan, labels, used = [], [], set()
        for inp in model.inputs:
            arg, _, field = inp.name.partition(".")
            if arg not in sig.parameters:
                raise RuntimeError(f"{function}: kernel {name} needs argument {arg!r}, template has {params}")
            if field and field not in FIELDS:
                raise RuntimeError(f"{function}: {field!r} is not a Saturation field")
            plan.append((params.index(arg), field))
            labels.append(inp.name)
            used.add(arg)
        unused = set(params) - used
        if unused:
            raise RuntimeError(f"{function}: template arguments {sorted(unused)} feed no kernel input")
        if len(model.outputs) > 1 and result is None and output is None:
            raise RuntimeError(f"{function}: a multi-output kernel needs a result type or an output index")
        if output is not None and not 0 <= output < len(model.outputs):
            raise RuntimeError(f"{function}: kernel {name} has no output {output}")
        if len(params) > _core.MAX_ARGS:
            raise RuntimeError(f"{function}: at most {_core.MAX_ARGS} parameters")
        for p in sig.parameters.values():
            if p.kind not in (p.POSITIONAL_OR_KEYWORD, p.KEYWORD_ONLY):
                raise RuntimeError(f"{function}: only plain or keyword-only parameters are supported")
        spec = _Spec(model, function, tuple(plan), tuple(labels), params, None if output is not None else result, output,
                     fill)

        # The fallback: a Python function with exactly the template's
        # parameters (so binding errors read like any Python function's),
        # handling every call the builtin's fast path passes on.
        pieces, star_done = [], False
        for p in sig.parameters.values():
            if p.kind is p.KEYWORD_ONLY and not star_done:
                pieces.append("*")
                star_done = True
            pieces.append(p.name if p.default is p.empty else f"{p.name}=None")
        arglist = ", ".join(params) + ("," if len(params) == 1 else "")
        src = f"def {template.__name__}({', '.join(pieces)}):\n    return _evaluate(_spec, ({arglist}))\n"
        if fill is not None:  # a filled call goes back through the builtin: plain numbers take the Rust fast path
            src = (f"def {template.__name__}({', '.join(pieces)}):\n    args = ({arglist})\n    filled = _fill(args)\n"
                   f"    return _evaluate(_spec, args) if filled is args else _public(*filled)\n")
        namespace: Dict[str, Any] = {"__name__": template.__module__, "_evaluate": _evaluate, "_spec": spec,
                                     "_fill": fill}
        exec(compile(src, f"<wetboil front door {function}>", "exec"), namespace)
        fallback = namespace[template.__name__]
        fallback.__defaults__ = template.__defaults__
        fallback.__kwdefaults__ = template.__kwdefaults__
        fallback.__module__ = template.__module__
        fallback.__qualname__ = template.__qualname__

        f = _builtin(template, sig, fallback,
                     [(None, name, [(ai, FIELDS.index(fl) if fl else -1) for ai, fl in plan],
                       -1 if output is None else output, spec.result_type)], -1)
        _FUNCTIONS[f] = spec
        namespace["_public"] = f
        return f  # type: ignore[return-value]

    return build


_FUNCTIONS: Dict[Any, _Spec] = {}


def _builtin(template: Callable[..., Any], sig: inspect.Signature, fallback: Callable[..., Any],
             choices: list, selector: int) -> Any:
    """The builtin public function: `template`'s name, signature and
    docstring, a Rust fast path over `choices`, and `fallback` for the rest."""
    bare = sig.replace(
        parameters=[p.replace(annotation=p.empty) for p in sig.parameters.values()],
        return_annotation=sig.empty,
    )
    doc = f"{template.__name__}{bare}\n--\n\n{inspect.cleandoc(template.__doc__ or '')}\n"
    return _core.make_function(
        choices,
        selector,
        list(sig.parameters),
        [None if p.default is p.empty else p.default for p in sig.parameters.values()],
        fallback,
        template.__module__,
        template.__name__,
        doc,
    )


def dispatch(selector: str, table: Mapping[Any, Tuple[Callable[..., Any], Optional[int]]]) -> Callable[[F], F]:
    """Give a Python function that picks a kernel by one argument (a method
    name, a flag) a Rust fast path for scalar calls.

    ``table`` maps values of the `selector` parameter to ``(kernel_function,
    output)``: a function built with `kernel` whose parameters are named like
    the decorated function's, and the index of the output to return (None:
    all of them, as that kernel function returns them). Plain-number calls
    with a selector value in the table are evaluated in Rust; every other
    call (arrays, other values, anything the Python body checks) runs the
    decorated function itself, which stays the single source of behaviour.
    List only choices for which the Python body does nothing but call that
    kernel function with the same-named arguments.
    """
    from .fluids import FIELDS

    def build(function: F) -> F:
        sig = inspect.signature(function)
        params = list(sig.parameters)
        if selector not in params:
            raise RuntimeError(f"{function.__name__}: no parameter {selector!r}")
        choices = []
        for key, (kernel_fn, output) in table.items():
            spec = _FUNCTIONS[kernel_fn]
            plan = []
            for (ai, field) in spec.plan:
                pname = spec.params[ai]
                if pname not in params:
                    raise RuntimeError(f"{function.__name__}: kernel argument {pname!r} is not a parameter")
                plan.append((params.index(pname), FIELDS.index(field) if field else -1))
            if spec.output is not None:  # the kernel function already returns one output
                if output not in (None, 0):
                    raise RuntimeError(f"{function.__name__}: {kernel_fn.__name__} returns one output only")
                output = spec.output
            choices.append((key, spec.model.name, plan, -1 if output is None else int(output), spec.result_type))
        f = _builtin(function, sig, function, choices, params.index(selector))
        return f  # type: ignore[no-any-return]

    return build


def ufunc_of(function: Callable[..., Any]) -> np.ufunc:
    """The NumPy ufunc behind a public kernel function (inputs in kernel
    order, fluid fields expanded; see ``model_of(function).inputs``).

    >>> import wetboil
    >>> from wetboil.departure import fritz
    >>> wetboil.ufunc_of(fritz).nin
    5
    """
    spec = _FUNCTIONS.get(function)
    if spec is None:
        raise WetboilTypeError(f"{function!r} is not a wetboil kernel function")
    return getattr(_core, spec.model.name)


def model_of(function: Callable[..., Any]) -> Model:
    """The published model's facts behind a public kernel function."""
    spec = _FUNCTIONS.get(function)
    if spec is None:
        raise WetboilTypeError(f"{function!r} is not a wetboil kernel function")
    return spec.model
