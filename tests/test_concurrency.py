"""Threads, dask worker processes and fork.

* Several Python threads calling kernels at once (small arrays, scalars, large
  arrays on the shared wetboil thread pool, the parallel grid path) get
  results bitwise identical to a serial run, and their element counts (hence
  warnings and errstate) stay per thread.
* Changing the pool size while other threads compute is safe.
* dask.distributed worker processes (LocalCluster, 2 workers, processes=True)
  compute every kernel bitwise identical to the local NumPy call.
* A child started with fork, after the parent has used the thread pool,
  neither hangs nor computes wrong numbers (DESIGN.md section 5: it used to
  hang; the package drops the inherited pool through os.register_at_fork).
  These run in a child interpreter with a timeout, so a hang fails the test
  instead of stopping the test run.
"""

from __future__ import annotations

import os
import subprocess
import sys
import threading
import warnings

import numpy as np
import pytest

import wetboil

import kernel_cases as kc

HERE = os.path.dirname(os.path.abspath(__file__))
SLOW = {"kinetic_superheat_water", "homogeneous_superheat_water"}


def _workload(n_small=64, n_large=40_000, seed=0):
    """(kernel, function, spec, small args, large args, scalar args) for every kernel."""
    rng = np.random.default_rng(seed)
    out = []
    for kernel, (f, spec) in sorted(kc.BY_KERNEL.items()):
        large = None if kernel in SLOW else kc.draw_args(spec, rng, n_large)
        out.append((kernel, f, spec, kc.draw_args(spec, rng, n_small), large, kc.draw_args(spec, rng)))
    return out


def _run(f, spec, args):
    # errstate, not warnings.catch_warnings: the policy is per thread, the warnings filters are not
    with wetboil.errstate(invalid="ignore", out_of_range="ignore"):
        return [np.asarray(o, dtype=float) for o in kc.outputs(kc.call(f, spec, args))]


def _big_endian(spec, args):
    fps = kc.fluid_params(spec)
    return {p: (np.asarray(v, dtype=float).astype(">f8") if p not in fps and np.ndim(v) else v)
            for p, v in args.items()}


def _serial(work):
    res = {}
    for kernel, f, spec, small, large, scalar in work:
        res[kernel, "small"] = _run(f, spec, small)
        res[kernel, "scalar"] = _run(f, spec, scalar)
        if large is not None:
            res[kernel, "large"] = _run(f, spec, large)
            res[kernel, "grid"] = _run(f, spec, _big_endian(spec, large))
    return res


def _same(a, b):
    return len(a) == len(b) and all(kc.same_bits(x, y) for x, y in zip(a, b))


def test_threads_give_the_serial_results():
    work = _workload()
    old = wetboil.get_num_threads()
    try:
        wetboil.set_num_threads(2)
        expect = _serial(work)
        errors = []

        def worker(order):
            try:
                for _ in range(2):
                    for i in order:
                        kernel, f, spec, small, large, scalar = work[i]
                        for kind, args in (("small", small), ("scalar", scalar), ("large", large),
                                           ("grid", None if large is None else _big_endian(spec, large))):
                            if args is None:
                                continue
                            got = _run(f, spec, args)
                            if not _same(got, expect[kernel, kind]):
                                errors.append(f"{kernel} {kind}")
            except Exception as exc:  # noqa: BLE001 - reported below
                errors.append(repr(exc))

        rng = np.random.default_rng(1)
        threads = [threading.Thread(target=worker, args=(rng.permutation(len(work)),)) for _ in range(4)]
        for t in threads:
            t.start()
        for t in threads:
            t.join(timeout=300)
        assert not any(t.is_alive() for t in threads), "a thread hung"
    finally:
        wetboil.set_num_threads(old)
    assert not errors, errors[:20]


def test_element_counts_stay_per_thread():
    """One thread computes clean arrays under errstate(raise) while others
    compute arrays full of impossible and out-of-range elements: the clean
    thread never sees their counts (on the ufunc, the pool and the grid path)."""
    from wetboil.departure import fritz

    w = wetboil.fluids.water(p=101325.0)
    clean = np.linspace(1.0, 89.0, 50_000)
    dirty = np.where(np.arange(50_000) % 3 == 0, 250.0, 120.0)  # impossible and out of range
    expect = fritz(clean, w)
    stop = threading.Event()
    errors = []

    def noisy():
        with wetboil.errstate(invalid="ignore", out_of_range="ignore"):
            while not stop.is_set():
                fritz(dirty, w)
                fritz(dirty[::2], w)  # strided: the grid path
                fritz(dirty[:100], w)

    def strict():
        try:
            with wetboil.errstate(invalid="raise", out_of_range="raise"):
                for _ in range(60):
                    for x in (clean, clean[::-1].copy()[::-1], clean[:100]):
                        got = fritz(x, w)
                        if not kc.same_bits(got, expect if x.size == clean.size else expect[:100]):
                            errors.append("wrong values")
        except Exception as exc:  # noqa: BLE001
            errors.append(repr(exc))

    others = [threading.Thread(target=noisy) for _ in range(2)]
    main = threading.Thread(target=strict)
    for t in others + [main]:
        t.start()
    main.join(timeout=300)
    stop.set()
    for t in others:
        t.join(timeout=60)
    assert not main.is_alive()
    assert not errors, errors[:5]


def test_resizing_the_pool_while_threads_compute():
    from wetboil.chf import kandlikar

    w = wetboil.fluids.water(p=101325.0)
    x = np.linspace(0.0, 90.0, 200_000)
    expect = kandlikar(x, w, 30.0)
    old = wetboil.get_num_threads()
    stop = threading.Event()
    errors = []

    def compute():
        try:
            while not stop.is_set():
                if not kc.same_bits(kandlikar(x, w, 30.0), expect):
                    errors.append("wrong values")
        except Exception as exc:  # noqa: BLE001
            errors.append(repr(exc))

    threads = [threading.Thread(target=compute) for _ in range(3)]
    try:
        for t in threads:
            t.start()
        for i in range(40):
            wetboil.set_num_threads(1 + i % 3)
    finally:
        stop.set()
        for t in threads:
            t.join(timeout=120)
        wetboil.set_num_threads(old)
    assert not any(t.is_alive() for t in threads)
    assert not errors, errors[:5]


def test_dask_worker_processes_give_identical_results():
    distributed = pytest.importorskip("distributed")
    da = pytest.importorskip("dask.array")
    rng = np.random.default_rng(6)
    cases = []
    for kernel, (f, spec) in sorted(kc.BY_KERNEL.items()):
        n = 40 if kernel in SLOW else 4_000
        args = kc.draw_args(spec, rng, n)
        fps = kc.fluid_params(spec)
        lazy_args = {p: (da.from_array(np.asarray(v, dtype=float), chunks=n // 2) if p not in fps else v)
                     for p, v in args.items()}
        cases.append((kernel, f, spec, args, lazy_args))
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        with distributed.LocalCluster(n_workers=2, threads_per_worker=1, processes=True,
                                      dashboard_address=None) as cluster, distributed.Client(cluster) as client:
            lazy = [kc.outputs(kc.call(f, spec, lazy_args)) for _, f, spec, _, lazy_args in cases]
            computed = client.compute(lazy, sync=True)
            # scalar calls of the public functions themselves, shipped to the workers (they pickle
            # by name; the kernel-backed helpers of the dispatchers carry their dispatcher's name)
            public = [c for c in cases if getattr(sys.modules[c[1].__module__], c[1].__name__, None) is c[1]]
            futures = [client.submit(f, *[kc.to_scalar_args(args, 0)[p] for p in spec.params], pure=False)
                       for _, f, spec, args, _ in public]
            remote_scalars = dict(zip([c[0] for c in public], client.gather(futures)))
            pids = set(client.run(os.getpid).values())
    assert len(pids) == 2 and os.getpid() not in pids
    assert len(remote_scalars) >= 30
    for (kernel, f, spec, args, _), got in zip(cases, computed):
        want = _run(f, spec, args)
        assert _same([np.asarray(g, dtype=float) for g in got], want), kernel
        if kernel in remote_scalars:
            local = _run(f, spec, kc.to_scalar_args(args, 0))
            assert _same([np.asarray(s, dtype=float) for s in kc.outputs(remote_scalars[kernel])], local), kernel


FORK_CHILD = r"""
import multiprocessing as mp, os, sys, threading, time, warnings
import numpy as np
import wetboil
from wetboil.chf import kandlikar
from wetboil.departure import fritz

warnings.simplefilter("ignore")
w = wetboil.fluids.water(p=101325.0)
x = np.linspace(0.0, 90.0, 400_000)            # above the pool threshold: the pool runs
grid = np.linspace(0.0, 90.0, 300_000)[::3]    # strided: the parallel grid path
wetboil.set_num_threads(2)
expect = kandlikar(x, w, 30.0)                  # the parent's pool has run
expect_grid = fritz(grid, w)

def child(q):
    try:
        q.put((bool(np.array_equal(kandlikar(x, w, 30.0), expect)),
               bool(np.array_equal(fritz(grid, w), expect_grid)),
               wetboil.get_num_threads()))
    except BaseException as exc:
        q.put(repr(exc))

ctx = mp.get_context("fork")
for round_ in range(3):
    q = ctx.Queue()
    p = ctx.Process(target=child, args=(q,))
    p.start()
    p.join(timeout=60)
    if p.is_alive():
        p.kill()
        print("HUNG", round_)
        sys.exit(3)
    res = q.get(timeout=10)
    assert res == (True, True, 2), res
    assert p.exitcode == 0, p.exitcode
    kandlikar(x, w, 30.0)                       # the parent's pool still works

# fork while another thread keeps the pool busy
stop = threading.Event()
def busy():
    while not stop.is_set():
        kandlikar(x, w, 30.0)
t = threading.Thread(target=busy)
t.start()
try:
    for round_ in range(5):
        time.sleep(0.01 * round_)
        pid = os.fork()
        if pid == 0:
            ok = np.array_equal(kandlikar(x, w, 30.0), expect) and np.array_equal(fritz(grid, w), expect_grid)
            os._exit(0 if ok else 1)
        deadline = time.time() + 60
        while True:
            done, status = os.waitpid(pid, os.WNOHANG)
            if done:
                break
            if time.time() > deadline:
                os.kill(pid, 9)
                print("HUNG-BUSY", round_)
                sys.exit(3)
            time.sleep(0.01)
        assert os.waitstatus_to_exitcode(status) == 0, status
finally:
    stop.set()
    t.join()
print("fork ok")
"""


@pytest.mark.skipif(not hasattr(os, "fork"), reason="no fork on this platform")
def test_fork_after_the_pool_has_run_neither_hangs_nor_miscomputes():
    env = dict(os.environ, PYTHONPATH=HERE + os.pathsep + os.environ.get("PYTHONPATH", ""))
    r = subprocess.run([sys.executable, "-W", "ignore::DeprecationWarning", "-c", FORK_CHILD],
                       capture_output=True, text=True, timeout=400, env=env)
    assert r.returncode == 0 and "fork ok" in r.stdout, (r.returncode, r.stdout[-2000:], r.stderr[-3000:])


def test_sweeps_in_threads_leave_the_process_warning_filters_alone():
    """Sweeps run from several threads at once, each with a pressure beyond
    the critical point (a state the sweep explains with a look at other
    units), give every thread its own one warning per call, and leave the
    process-wide warning filters as they were. The look used to silence its
    own warnings with `warnings.catch_warnings`, which swaps the module's
    global filter list and "is not thread-safe" (Python documentation,
    `warnings` module, "Temporarily Suppressing Warnings" / catch_warnings);
    interleaved, the threads left "ignore WetboilWarning" installed for the
    whole process: later RangeWarnings and InvalidValueWarnings, on any
    thread, never came."""
    surfaces = [wetboil.Surface("a (invented)", 70.0, 80.0, 40.0), wetboil.Surface("b (invented)", 20.0, 30.0, 10.0)]
    n_threads, calls = 4, 25
    barrier = threading.Barrier(n_threads)

    def work() -> None:
        barrier.wait()
        for _ in range(calls):
            # 2.3e7 Pa: above water's critical pressure 22.064 MPa (IAPWS R6-95(2018)), no saturated state
            wetboil.sweep(surfaces, "water", p=[1e5, 2.3e7], heat_flux=1e5)

    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        work_once = wetboil.sweep(surfaces, "water", p=[1e5, 2.3e7], heat_flux=1e5)  # first imports add filters
    assert int(work_once["invalid_flags"].sel(p=2.3e7).min()) != 0
    with warnings.catch_warnings(record=True) as seen:
        warnings.simplefilter("always")
        before = list(warnings.filters)
        threads = [threading.Thread(target=work) for _ in range(n_threads)]
        for t in threads:
            t.start()
        for t in threads:
            t.join()
        after = list(warnings.filters)
        with wetboil.errstate(invalid="warn"):
            wetboil.departure.fritz(200.0, wetboil.fluids.water(p=101325.0))  # an impossible angle, afterwards
    assert after == before
    invalid = [w for w in seen if issubclass(w.category, wetboil.InvalidValueWarning)]
    assert len(invalid) == n_threads * calls + 1, len(invalid)


# --------------------------------------------------------------------------- one errstate object, shared
# Behavioural checks of the policy itself (no physical number is involved): Python's contextvars
# semantics (PEP 567) are the reference. The orientation 100 deg lies outside Kandlikar's (2001)
# published 0-90 deg, so the call is flagged; see wetboil.chf.kandlikar.

SHARED_RAISE = wetboil.errstate(out_of_range="raise")


def _kandlikar_flagged():
    w = wetboil.fluids.water(p=101325.0)
    return wetboil.chf.kandlikar(30.0, w, orientation_deg=100.0)


def test_one_errstate_object_shared_by_threads():
    """A module-level errstate used by several threads at once: each thread gets the policy inside the
    block and its own default back after it. It used to keep the tokens on the object, so a thread
    left the block with another thread's token (ValueError: created in a different Context) and the
    other kept the strict policy after its block."""
    n = 4
    barrier = threading.Barrier(n)
    inside, after, errors = [], [], []

    def worker():
        try:
            with SHARED_RAISE:
                barrier.wait()  # every thread inside the block at once
                try:
                    _kandlikar_flagged()
                    inside.append("no raise")
                except wetboil.OutOfRangeError:
                    inside.append("raised")
                barrier.wait()  # every thread leaves in turn while the others are still inside
            after.append(wetboil.geterr())
        except Exception as exc:  # noqa: BLE001 - the failure being tested
            errors.append(repr(exc))

    threads = [threading.Thread(target=worker) for _ in range(n)]
    for t in threads:
        t.start()
    for t in threads:
        t.join()
    assert errors == []
    assert inside == ["raised"] * n
    assert after == [{"invalid": "warn", "out_of_range": "warn"}] * n


def test_one_errstate_object_entered_inside_itself_and_as_decorator():
    quiet = wetboil.errstate(out_of_range="ignore")
    with quiet:
        with quiet:
            assert wetboil.geterr()["out_of_range"] == "ignore"
        assert wetboil.geterr()["out_of_range"] == "ignore"
    assert wetboil.geterr()["out_of_range"] == "warn"

    @wetboil.errstate(out_of_range="raise")
    def strict():
        return _kandlikar_flagged()

    with pytest.raises(wetboil.OutOfRangeError):
        strict()
    assert wetboil.geterr() == {"invalid": "warn", "out_of_range": "warn"}  # restored after the exception
    with warnings.catch_warnings():
        warnings.simplefilter("error", wetboil.RangeWarning)
        with pytest.raises(wetboil.RangeWarning):
            _kandlikar_flagged()  # the default policy again outside the decorated function


def test_one_errstate_object_shared_by_asyncio_tasks():
    import asyncio

    shared = wetboil.errstate(invalid="ignore")

    async def task(delay):
        with shared:
            await asyncio.sleep(delay)
            inside = wetboil.geterr()["invalid"]
        return inside, wetboil.geterr()["invalid"]

    async def main():
        return await asyncio.gather(task(0.02), task(0.0), task(0.01))

    assert asyncio.run(main()) == [("ignore", "warn")] * 3


def test_errstate_refuses_what_it_cannot_keep():
    """A coroutine or generator function decorated with errstate would run its body after the
    decorator's block closed (the policy silently not applied): refused. An errstate left in another
    context than it was entered in (PEP 567: contextvars.Context.run) raises instead of restoring
    another block's saved policy, which left strict mode on (review). Python's semantics are the
    reference; no physical number is involved."""
    import contextvars

    with pytest.raises(wetboil.WetboilTypeError, match="coroutine or generator"):
        @wetboil.errstate(out_of_range="raise")
        async def coro():
            return None
    with pytest.raises(wetboil.WetboilTypeError, match="coroutine or generator"):
        @wetboil.errstate(out_of_range="raise")
        def gen():
            yield 1
    cm = wetboil.errstate(out_of_range="raise")
    cm.__enter__()
    try:
        with pytest.raises(wetboil.WetboilError, match="another thread or task"):
            contextvars.Context().run(cm.__exit__, None, None, None)
        assert wetboil.geterr()["out_of_range"] == "raise"  # this context's block is still open
    finally:
        cm.__exit__(None, None, None)
    assert wetboil.geterr() == {"invalid": "warn", "out_of_range": "warn"}
    a, b = wetboil.errstate(invalid="ignore"), wetboil.errstate(invalid="raise")
    a.__enter__()
    b.__enter__()
    with pytest.raises(wetboil.WetboilError, match="out of order"):
        a.__exit__(None, None, None)
    b.__exit__(None, None, None)
    a.__exit__(None, None, None)
    assert wetboil.geterr() == {"invalid": "warn", "out_of_range": "warn"}
