"""Exceptions, warning categories and the element-error policy (`errstate`)."""

from __future__ import annotations

import contextlib
import contextvars
import functools
import sys
import warnings
from types import FrameType
from typing import Any, Callable, Dict, Iterator, Literal, NamedTuple, Optional, Sequence, TypeVar

_F = TypeVar("_F", bound=Callable[..., Any])

__all__ = [
    "WetboilError",
    "WetboilTypeError",
    "WetboilValueError",
    "InvalidValueError",
    "OutOfRangeError",
    "WetboilWarning",
    "InvalidValueWarning",
    "RangeWarning",
    "errstate",
    "geterr",
]

_Action = Literal["ignore", "warn", "raise"]
_ACTIONS = ("ignore", "warn", "raise")


class WetboilError(Exception):
    """Base class of every exception wetboil raises."""


class WetboilTypeError(WetboilError, TypeError):
    """An argument has the wrong type (a string or None where a number belongs...)."""


class WetboilValueError(WetboilError, ValueError):
    """A structural problem: shapes that do not broadcast, a missing or
    contradictory input, an unknown method name."""


class InvalidValueError(WetboilError, ValueError):
    """Raised instead of `InvalidValueWarning` under ``errstate(invalid="raise")``."""


class OutOfRangeError(WetboilError, ValueError):
    """Raised instead of `RangeWarning` under ``errstate(out_of_range="raise")``."""


class WetboilWarning(UserWarning):
    """Base class of wetboil's warnings."""


class InvalidValueWarning(WetboilWarning, RuntimeWarning):
    """Some elements were physically impossible and became NaN."""


class RangeWarning(WetboilWarning):
    """Some elements lie outside the published validity range of the correlation
    (they were computed; treat them as extrapolation). The message counts them
    and quotes the range (the model's ``validity`` in `wetboil.models`)."""


class _State(NamedTuple):
    invalid: _Action
    out_of_range: _Action


_STATE: contextvars.ContextVar[_State] = contextvars.ContextVar("wetboil_errstate", default=_State("warn", "warn"))


def geterr() -> Dict[str, str]:
    """The current element-error policy as ``{"invalid": ..., "out_of_range": ...}``."""
    s = _STATE.get()
    return {"invalid": s.invalid, "out_of_range": s.out_of_range}


#: The policies replaced by the `errstate` blocks open in this thread or task, innermost last. Kept in a
#: context variable, not on the errstate object, so that one object may be shared by threads and tasks
#: (a module-level ``QUIET = wetboil.errstate(...)``), entered again inside itself, or used as a decorator.
_SAVED: contextvars.ContextVar[tuple] = contextvars.ContextVar("wetboil_errstate_saved", default=())


class errstate(contextlib.ContextDecorator):
    """Context manager (or function decorator) setting how element problems are reported.

    Parameters
    ----------
    invalid : {"ignore", "warn", "raise"}, optional
        Physically impossible elements (they become NaN): ignore silently, emit
        one `InvalidValueWarning` per call (default), or raise `InvalidValueError`.
    out_of_range : {"ignore", "warn", "raise"}, optional
        Elements outside a correlation's published validity range (they are
        computed): ignore, emit one `RangeWarning` per call (default), or raise
        `OutOfRangeError`.

    Notes
    -----
    The setting is per thread and per asyncio task (a context variable). A
    lazy (dask-backed) result keeps the setting of the call that built it,
    whenever and wherever it is computed; its warnings come at compute time,
    one per chunk. Threads started inside the block (a thread pool) begin
    with the default policy, unless started with a copy of the context
    (``asyncio.to_thread``, ``contextvars.copy_context().run``): open the
    block inside the function they run. One errstate object may be shared:
    by several threads at once, entered again inside itself, or used as a
    decorator of a plain function (``@wetboil.errstate(...)``; a coroutine
    or generator function is refused, as its body runs after the call).

    In a loop or a solver, each call that meets a problem emits its own
    warning. Python's default filter shows a given message once per line of
    code, but the message carries the counts ("3 of 50 element(s)"), so calls
    on arrays whose counts vary each show one: a root finder or an ODE solver
    probing outside a range can print hundreds. There, wrap the calls in
    ``errstate(out_of_range="ignore")`` (and ``invalid="ignore"`` where NaN
    is handled) and check the solution once afterwards with the function
    itself or `wetboil.validity`. A scalar call whose problem is ignored
    stays on the fast scalar path (about 0.12 us on a 2-vCPU test machine);
    one that warns or raises, or has a NaN input, goes through the Python
    path that words the message (about 10 us).

    Examples
    --------
    >>> import wetboil
    >>> from wetboil.departure import fritz
    >>> water = wetboil.fluids.Saturation(T=373.124, p=101325.0, rho_l=958.35, rho_v=0.598, h_lv=2.2564e6, sigma=0.0589)
    >>> with wetboil.errstate(invalid="ignore"):
    ...     fritz(200.0, water)   # an impossible angle, silently NaN
    nan
    """

    def __init__(self, invalid: Optional[_Action] = None, out_of_range: Optional[_Action] = None) -> None:
        for label, value in (("invalid", invalid), ("out_of_range", out_of_range)):
            if value is not None and value not in _ACTIONS:
                raise WetboilValueError(f"errstate: {label} must be one of {_ACTIONS}, got {value!r}")
        self._invalid = invalid
        self._out_of_range = out_of_range

    def __call__(self, func: Any) -> Any:
        # a decorated coroutine or generator function would return its coroutine or generator before
        # running a line of its body, outside the block: refuse it rather than apply nothing
        import inspect

        if inspect.iscoroutinefunction(func) or inspect.isgeneratorfunction(func) or inspect.isasyncgenfunction(func):
            raise WetboilTypeError(f"errstate: cannot decorate {getattr(func, '__qualname__', func)!r}, a coroutine or "
                                   "generator function (its body runs after the call returns); open the block inside it")
        return super().__call__(func)

    def __enter__(self) -> "errstate":
        old = _STATE.get()
        _SAVED.set(_SAVED.get() + ((self, old),))
        _STATE.set(_State(self._invalid or old.invalid, self._out_of_range or old.out_of_range))
        return self

    def __exit__(self, *exc) -> None:
        saved = _SAVED.get()
        if not saved or saved[-1][0] is not self:
            # left in another thread or task than it was entered in, or out of order: restoring another
            # block's saved policy would leave it (strict mode, say) on for the rest of this context
            raise WetboilError("errstate: exited in another thread or task than it was entered in, or out of order")
        _STATE.set(saved[-1][1])
        _SAVED.set(saved[:-1])


def _stacklevel() -> int:
    """Stack level of the caller of the outermost wetboil frame: the user's line, also when wetboil
    runs part of a call through another library (``sweep`` through ``xarray.apply_ufunc``)."""
    frame: Optional[FrameType] = sys._getframe(1)
    level, outermost = 1, 1
    while frame is not None:
        if frame.f_globals.get("__name__", "").startswith("wetboil"):
            outermost = level
        frame = frame.f_back
        level += 1
    return outermost + 1


def report(function: str, size: int, invalid: int, out_of_range: int, validity: str = "", domain: str = "") -> None:
    """Apply the current policy to the counts of one call; `validity`, the
    model's range as its facts state it, is quoted in the range message, and
    `domain`, where its inputs are possible, in the impossible-element message
    (a temperature in degC or a pressure in bar then says what was expected)."""
    if not (invalid or out_of_range):
        return
    state = _STATE.get()
    if invalid and state.invalid != "ignore":
        msg = f"{function}: {invalid} of {size} element(s) physically impossible"
        if domain:
            msg += f" (possible: {domain})"
        if state.invalid == "raise":
            raise InvalidValueError(msg + " (errstate invalid='raise'; by default they give NaN)")
        msg += ", set to NaN"
        _warn(msg, InvalidValueWarning)
    if out_of_range and state.out_of_range != "ignore":
        msg = f"{function}: {out_of_range} of {size} element(s) outside the published validity range"
        if validity:
            msg += f" ({validity})"
        if state.out_of_range == "raise":
            raise OutOfRangeError(msg)
        _warn(msg, RangeWarning)


#: Element warnings being gathered by `one_warning_per_category` (per thread and task, like the policy).
_GATHER: contextvars.ContextVar[Optional[list]] = contextvars.ContextVar("wetboil_gather", default=None)


def _warn(msg: str, category: type) -> None:
    gathered = _GATHER.get()
    if gathered is not None:
        gathered.append((category, msg))
    else:
        warnings.warn(msg, category, stacklevel=_stacklevel())


@contextlib.contextmanager
def dropped_warnings() -> Iterator[None]:
    """wetboil's own warnings in the block dropped, for this thread and task only.

    `warnings.catch_warnings` swaps the process-wide filter list and is not
    thread-safe (Python's documentation says so): sweeps run from several
    threads at once left "ignore WetboilWarning" installed for the whole
    process. Every wetboil warning goes through `_warn`, which this stops."""
    token = _GATHER.set([])
    try:
        yield
    finally:
        _GATHER.reset(token)


def _gathered(parts: dict, label: Callable[[str], str], run: Callable[[], Any]) -> Any:
    """``run()`` with the element warnings it reports gathered into `parts` (category -> messages),
    each message passed through `label`."""
    gathered: list = []
    token = _GATHER.set(gathered)
    try:
        return run()
    finally:
        _GATHER.reset(token)
        for category, msg in gathered:
            parts.setdefault(category, []).append(label(msg) if issubclass(category, _ELEMENT) else msg)


#: The element warnings, which `_give` joins into one per call; any other (advice such as "no C_sf
#: given") is given on its own, as written, once per distinct message.
_ELEMENT = (InvalidValueWarning, RangeWarning)


def _give(function: str, parts: dict) -> None:
    """One warning per element category of the gathered `parts`, naming `function`; each distinct
    advice warning on its own."""
    for category, messages in parts.items():
        if issubclass(category, _ELEMENT):
            _warn(f"{function}: {'; '.join(dict.fromkeys(messages))}", category)  # each distinct part once
        else:
            for msg in dict.fromkeys(messages):
                _warn(msg, category)


def each_method(function: str, methods: Sequence[str], one: Callable[[str], Any]) -> list:
    """``[one(m) for m in methods]`` for a public function given a list of methods, as one call: the
    element warnings of all methods are given as at most one warning per category, each part naming
    its method and the correlation that counted (``"departure.diameter: method 'fritz_jakob'
    (departure.fritz): 1 of 3 element(s) ..."``). Under ``errstate(...="raise")`` the first raises."""

    def labelled(m: str) -> Callable[[str], str]:
        def label(msg: str) -> str:
            source, sep, rest = msg.partition(": ")
            if not sep:
                return f"method {m!r}: {msg}"
            return f"method {m!r}: {rest}" if source == function else f"method {m!r} ({source}): {rest}"

        return label

    results: list = []
    parts: dict = {}
    try:
        for m in methods:
            results.append(_gathered(parts, labelled(m), lambda: one(m)))
    finally:
        _give(function, parts)
    return results


def one_warning_per_category(function: str) -> Callable[[_F], _F]:
    """Decorator for a public function built from several kernel calls: their element warnings are
    gathered and given as at most one `InvalidValueWarning` and one `RangeWarning` per call (advice
    warnings, each on its own, once), each naming the parts (``"boiling.curve: chf.kandlikar: 1 of 1 element(s) outside ...; ..."``), also
    when the call ends in an exception. The gathering is a context variable that `report` reads (per
    thread and task; the process-wide warning filters are not touched), so other warnings and other
    threads' calls are unaffected; under ``errstate(...="raise")`` the first part raises."""
    own = f"{function}: "  # the function's own reports name it already (for the raising case)

    def label(msg: str) -> str:
        return msg[len(own):] if msg.startswith(own) else msg

    def decorate(f: _F) -> _F:
        @functools.wraps(f)
        def wrapper(*args: Any, **kwargs: Any) -> Any:
            parts: dict = {}
            try:
                return _gathered(parts, label, lambda: f(*args, **kwargs))
            finally:
                _give(function, parts)

        return wrapper  # type: ignore[return-value]

    return decorate
