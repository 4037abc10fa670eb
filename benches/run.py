"""wetboil benchmarks: every number is a ratio against a baseline measured in
the same run, on the same inputs (absolute times are printed for context).

    .venv/bin/python benches/run.py            # full run (10^7 points)
    .venv/bin/python benches/run.py --quick    # 10^6 points, fewer repeats

Sections (targets from the performance issue in brackets):
  1. the foundation pair, fritz + kandlikar, on N Monte-Carlo points vs the
     same math as NumPy expressions [>= 5x]; then every kernel with a closed
     form on N contiguous points vs its formula as NumPy expressions [>= 4x]
  2. the screening chain (water properties from pressure, Hsu onset, Fritz,
     Kandlikar) vs NumPy + CoolProp: contiguous Monte-Carlo inputs through the
     public kernels [>= 3x] and through the fused path [>= 8x]; a broadcast
     grid (angles x pressures) vs NumPy's own broadcasting    [>= 1x]
  3. thread scaling: all threads vs one, contiguous and grid     [>= 1.8x]
  4. scalar calls of every kernel vs a pure-Python `math` version
                                                            [<= 0.5x time]
  5. water() per state point vs CoolProp's AbstractState          [>= 100x]
  6. peak memory of a sweep vs its inputs plus outputs          [<= 1.2x]

The hand-written baselines of sections 1 and 4 live in benches/formulas.py,
one NumPy and one `math` version per kernel; the run first checks that each
agrees with wetboil (so is the same formula) and refuses to time one that
does not. Kernels without a closed form (iterative solutions, chains of other
kernels) are listed after the table with the reason.

Inputs of section 1: the pair runs on Monte-Carlo inputs (every argument,
fluid properties included, a contiguous float64 array: water near 1 atm with
+-2 % property scatter); the other kernels on arguments drawn from the test
suite's physical ranges (tests/kernel_cases.py: fluids are water(T) over
273-640 K), every argument an array. Section 4 calls each kernel with plain
numbers at a point inside its published range. The CoolProp baseline of
section 2 is measured per point on a subset and scaled to N points (it would
take minutes at full size); this is said in its row.
"""

from __future__ import annotations

import os

# Keep OpenBLAS's idle worker threads from spinning on the cores we measure
# (neither side of any benchmark uses BLAS); set before NumPy loads.
os.environ.setdefault("OPENBLAS_NUM_THREADS", "1")

import argparse  # noqa: E402
import functools  # noqa: E402
import math  # noqa: E402
import platform  # noqa: E402
import subprocess  # noqa: E402
import sys  # noqa: E402
import timeit  # noqa: E402

import numpy as np  # noqa: E402

import wetboil  # noqa: E402
from wetboil import boiling, chf, departure, nucleation, wetting  # noqa: E402
from wetboil.fluids import Saturation, water  # noqa: E402

_HERE = os.path.dirname(os.path.abspath(__file__))
sys.path[:0] = [_HERE, os.path.join(_HERE, "..", "tests")]
import formulas  # noqa: E402  (the hand-written baselines)
import kernel_cases as kc  # noqa: E402  (physical input ranges of the test suite)

G = 9.80665


def best(fn, repeat):
    fn()  # warm up (page faults of first allocation, thread pool start)
    return min(timeit.repeat(fn, number=1, repeat=repeat))


#: Shortest time over which `paired` keeps sampling [s].
MIN_WINDOW = 4.0


def paired(fn_a, fn_b, repeat, window=None):
    """Best times of two functions measured in alternation (a, b, a, b, ...),
    so that a slow spell of this shared machine hits both sides of a ratio
    alike instead of whichever happened to run during it. At least `repeat`
    pairs, and more (up to 50) until `window` seconds have passed: the slow
    spells last seconds, and the best of a longer window finds a quiet moment
    for both sides."""
    window = MIN_WINDOW if window is None else window
    fn_a(), fn_b()  # warm up
    ta, tb = [], []
    start = timeit.default_timer()
    while len(ta) < repeat or (timeit.default_timer() - start < window and len(ta) < 50):
        ta.append(timeit.timeit(fn_a, number=1))
        tb.append(timeit.timeit(fn_b, number=1))
    return min(ta), min(tb)


def paired_calls(fn_a, args_a, fn_b, args_b, n=100_000, repeat=7):
    """Seconds per call of fn_a(*args_a) and fn_b(*args_b), each called with
    its arguments spelled out (no *args unpacking in the timed loop), the way
    user code calls it; measured in alternation as in `paired`."""
    def timer(fn, args):
        ns = {"fn": fn, **{f"a{i}": a for i, a in enumerate(args)}}
        return timeit.Timer(f"fn({', '.join(f'a{i}' for i in range(len(args)))})", globals=ns)
    a, b = timer(fn_a, args_a), timer(fn_b, args_b)
    a.timeit(n), b.timeit(n)  # warm up (caches, branch predictors, CPU clock)
    ta, tb = [], []
    for _ in range(repeat):
        ta.append(a.timeit(n))
        tb.append(b.timeit(n))
    return min(ta) / n, min(tb) / n


class Table:
    def __init__(self):
        self.rows = []

    def add(self, section, what, ours, base, target, ratio=None, note=""):
        ratio = base / ours if ratio is None else ratio
        self.rows.append((section, what, ours, base, ratio, target, note))

    def show(self):
        order = {s: i for i, s in enumerate(sorted({r[0] for r in self.rows}))}
        self.rows.sort(key=lambda r: order[r[0]])  # stable: keeps each section's order
        w = max(len(r[1]) for r in self.rows)
        print(f"\n{'':2} {'benchmark':<{w}}  {'wetboil':>10}  {'baseline':>10}  {'ratio':>7}  {'target':<8} note")
        last = None
        for section, what, ours, base, ratio, target, note in self.rows:
            if section != last:
                print(f"-- {section}")
                last = section
            print(f"{'':2} {what:<{w}}  {fmt(ours):>10}  {fmt(base):>10}  {ratio:>6.2f}x  {target:<8} {note}")


def fmt(t):
    if isinstance(t, str):
        return t
    if t >= 1.0:
        return f"{t:.2f} s"
    if t >= 1e-3:
        return f"{t * 1e3:.1f} ms"
    if t >= 1e-6:
        return f"{t * 1e6:.2f} us"
    return f"{t * 1e9:.0f} ns"


# ---------------------------------------------------------------------------- every kernel against its formula


def monte_carlo(n, seed=0):
    """Water near 1 atm with +-2 % scatter on every property (all arrays),
    and a maker of uniform arrays: the inputs of the headline pair."""
    rng = np.random.default_rng(seed)
    j = lambda v: v * rng.normal(1.0, 0.02, n)  # noqa: E731
    fluid = Saturation(T=j(373.124), p=j(101325.0), rho_l=j(958.35), rho_v=j(0.59817), h_lv=j(2.2564e6),
                       sigma=j(0.058912), cp_l=j(4215.7), k_l=j(0.6791), mu_l=j(2.818e-4), p_crit=22.064e6,
                       molar_mass=0.018015268)
    u = lambda lo, hi: rng.uniform(lo, hi, n)  # noqa: E731
    return fluid, u


def one_thread(fn):
    """fn run on one wetboil thread."""
    def run():
        threads = wetboil.get_num_threads()
        wetboil.set_num_threads(1)
        try:
            return fn()
        finally:
            wetboil.set_num_threads(threads)
    return run


def label(kernel):
    """Row label of a kernel: its public function, and the kernel where one
    function reaches several (methods of site_density, frequency, ...)."""
    _f, spec = formulas.kernel_function(kernel)
    shared = sum(1 for k in formulas.NUMPY if formulas.kernel_function(k)[1].function == spec.function) > 1
    return f"{spec.function} [{kernel}]" if shared else spec.function


@functools.lru_cache(maxsize=None)
def compared_kernels():
    """Every registered kernel with a hand-written formula, after checking
    that the formula agrees with wetboil (refuses to time a baseline that
    computes something else)."""
    names = sorted(m.name for m in wetboil.models() if m.name not in formulas.NOT_COMPARED)
    missing = [k for k in names if k not in formulas.NUMPY or k not in formulas.PYTHON]
    if missing:
        raise SystemExit(f"benches/formulas.py has no hand-written formula for: {', '.join(missing)}")
    for k in names:
        why = formulas.check(k)
        if why:
            raise SystemExit(f"{k}: the hand-written formula disagrees with wetboil: {why}")
    return tuple(names)


def section_kernels(table, n, repeat):
    # The foundation pair, together (the foundation issue's headline ratio).
    f, u = monte_carlo(n)
    th, rec, phi = u(5, 90), u(5, 90), u(0, 90)
    x_fritz, x_kand = (th, f.sigma, f.rho_l, f.rho_v, G), (rec, phi, f.h_lv, f.rho_l, f.rho_v, f.sigma, G)
    both = lambda: (departure.fritz(th, f), chf.kandlikar(rec, f, phi))  # noqa: E731
    both_np = lambda: (formulas.NUMPY["fritz_departure"](*x_fritz), formulas.NUMPY["kandlikar_chf"](*x_kand))  # noqa: E731
    for a, b in zip(both(), both_np()):
        assert np.allclose(a, b, rtol=1e-9), "benchmark formulas disagree"
    t_both, t_both_np = paired(both, both_np, repeat)
    table.add("1. kernels, contiguous", f"fritz + kandlikar, {n:.0e} points vs NumPy", t_both, t_both_np, ">= 5x")
    threads = wetboil.get_num_threads()
    t_all, t_one = paired(both, one_thread(both), repeat + 2)
    table.add("3. threads", f"fritz + kandlikar, contiguous, {threads} threads vs 1", t_all, t_one, ">= 1.8x")
    # the same two rows with the buffer cache off: every result in fresh memory (context)
    limit = wetboil.set_buffer_cache(0)
    try:
        t_cold, t_cold_np = paired(both, both_np, repeat)
        t_cold2, t_cold1 = paired(both, one_thread(both), repeat + 2)
    finally:
        wetboil.set_buffer_cache(limit)
    table.add("1. kernels, contiguous", "  the same, buffer cache off", t_cold, t_cold_np, "(context)")
    table.add("3. threads", "  the same, buffer cache off", t_cold2, t_cold1, "(context)")
    del f, th, rec, phi, x_fritz, x_kand
    # Every kernel with a closed form, on physical inputs drawn as in the test
    # suite (every argument an array; fluids are water(T) over 273-640 K).
    for k in compared_kernels():
        fn, spec, args, x = formulas.draw(k, n)
        ours = lambda: kc.call(fn, spec, args)  # noqa: E731
        base = lambda: formulas.NUMPY[k](*x)  # noqa: E731
        with np.errstate(all="ignore"):
            t_ours, t_base = paired(ours, base, repeat)
            # the memory our call must move at least: its full-size input arrays once, its outputs once
            moved = sum(a.nbytes for a in x if isinstance(a, np.ndarray) and a.size == n)
            moved += sum(np.asarray(o).nbytes for o in kc.outputs(ours()))
        table.add("1. kernels, contiguous", f"{label(k)}, {n:.0e} points vs NumPy", t_ours, t_base, ">= 4x",
                  note=f"({moved / t_ours / 1e9:.0f} GB/s of inputs + outputs)")
        del args, x


def section_scalar(table, repeat):
    """Every kernel called with plain numbers (and a scalar water state)
    against the same formula in pure Python on plain floats."""
    # The foundation pair, as in section 1: one function calling fritz and
    # kandlikar on a water state, against one calling their math versions.
    w = water(p=101325.0)
    py_fritz, py_kandlikar = formulas.PYTHON["fritz_departure"], formulas.PYTHON["kandlikar_chf"]

    def ours_pair(theta, fluid, receding, orientation):
        return departure.fritz(theta, fluid), chf.kandlikar(receding, fluid, orientation)

    def python_pair(theta, sigma, rho_l, rho_v, h_lv, receding, orientation):
        return (py_fritz(theta, sigma, rho_l, rho_v, G),
                py_kandlikar(receding, orientation, h_lv, rho_l, rho_v, sigma, G))

    assert np.allclose(ours_pair(40.0, w, 30.0, 0.0), python_pair(40.0, w.sigma, w.rho_l, w.rho_v, w.h_lv, 30.0, 0.0),
                       rtol=1e-12, atol=0.0)
    t_ours, t_py = paired_calls(ours_pair, (40.0, w, 30.0, 0.0), python_pair,
                                (40.0, w.sigma, w.rho_l, w.rho_v, w.h_lv, 30.0, 0.0), repeat=2 * repeat + 1)
    table.add("4. scalar calls", "fritz + kandlikar (one function calling both) vs pure-Python math", t_ours, t_py,
              "<= 0.5x", note="(ratio = speed-up)")
    # Between scalars and sweeps: arrays of a thousand candidates, where a call's fixed cost (argument
    # checks, dispatch, the element policy) matters as much as its loop. No target; context.
    k_arr = np.linspace(5.0, 90.0, 1000)
    np_fritz, np_kandlikar = formulas.NUMPY["fritz_departure"], formulas.NUMPY["kandlikar_chf"]
    assert np.allclose(ours_pair(k_arr, w, k_arr, 0.0)[1],
                       np_kandlikar(k_arr, 0.0, w.h_lv, w.rho_l, w.rho_v, w.sigma, G), rtol=1e-12, atol=0.0)
    t_ours, t_np = paired_calls(ours_pair, (k_arr, w, k_arr, 0.0),
                                lambda th, s, rl, rv, h, rec, phi: (np_fritz(th, s, rl, rv, G),
                                                                    np_kandlikar(rec, phi, h, rl, rv, s, G)),
                                (k_arr, w.sigma, w.rho_l, w.rho_v, w.h_lv, k_arr, 0.0), n=10_000, repeat=2 * repeat + 1)
    table.add("4. scalar calls", "fritz + kandlikar on 1000-element arrays vs NumPy", t_ours, t_np, "(context)",
              note="(ratio = speed-up; a call's fixed cost)")
    for k in compared_kernels():
        # a point inside the published range with a finite answer: elements
        # outside the range (RangeWarning) or without an answer (NaN) are
        # rare cases that the fast path hands to the Python fallback
        for seed in range(200):
            fn, spec, args, x = formulas.draw(k, None, seed)
            if seed >= 100:  # correlations fitted to water at 1 atm only
                args.update({p: water(p=101325.0) for p in kc.fluid_params(spec)})
                x = kc.kernel_inputs(spec, args)
            ours_args = [args[p] for p in spec.params]
            values = kc.outputs(fn(*ours_args))
            in_range = not np.any(wetboil.validity(fn, *ours_args))  # (warnings are off during the run)
            if in_range and all(isinstance(v, float) and math.isfinite(v) for v in values):
                break
        else:
            raise SystemExit(f"{k}: no in-range scalar point in 200 draws")
        t_ours, t_py = paired_calls(fn, ours_args, formulas.PYTHON[k], x, repeat=2 * repeat + 1)
        table.add("4. scalar calls", f"{label(k)} vs pure-Python math", t_ours, t_py, "<= 0.5x",
                  note="(ratio = speed-up)")


def section_chain(table, n, repeat):
    """Water from pressure -> Hsu onset, Fritz, Kandlikar: contiguous, fused, grid."""
    import CoolProp.CoolProp as CP

    rng = np.random.default_rng(7)
    p = rng.uniform(5e4, 5e6, n)
    th, phi, q = rng.uniform(5, 90, n), rng.uniform(0, 90, n), rng.uniform(1e4, 1e6, n)
    rec = th * rng.uniform(0.1, 0.95, n)  # a surface's receding angle lies below its static one

    def public():
        w = water(p=p)
        return (nucleation.onset_superheat(q, w, th), departure.fritz(th, w), chf.kandlikar(rec, w, phi))

    def fused():
        return wetboil.water_chain(p, th, rec, q, phi)

    def numpy_math(s, k=None):
        t_, r_, f_, q_ = (th, rec, phi, q) if k is None else (th[:k], rec[:k], phi[:k], q[:k])
        z = 2 * s.sigma * s.T / (s.rho_v * s.h_lv)  # Hsu's 1/rho_v embryo group
        c, cr = np.cos(np.radians(t_)), 1 + np.cos(np.radians(r_))
        onset = np.sqrt(4 * (1 + c) * z * q_ / s.k_l)
        d = 0.0208 * t_ * np.sqrt(s.sigma / (G * (s.rho_l - s.rho_v)))
        qc = s.h_lv * np.sqrt(s.rho_v) * cr / 16 * np.sqrt(2 / np.pi + np.pi / 4 * cr * np.cos(np.radians(f_))) \
            * (s.sigma * G * (s.rho_l - s.rho_v)) ** 0.25
        return onset, d, qc

    # CoolProp properties per point, measured on a subset and scaled to n
    m = 20_000 if n >= 10**7 else 5_000
    st = CP.AbstractState("HEOS", "Water")

    def coolprop_props(pp):
        out = np.empty((7, len(pp)))
        for i, v in enumerate(pp):
            st.update(CP.PQ_INPUTS, v, 0.0)
            out[0, i], out[1, i], out[2, i] = st.T(), st.rhomass(), st.hmass()
            out[3, i], out[4, i] = st.surface_tension(), st.conductivity()
            st.update(CP.PQ_INPUTS, v, 1.0)
            out[5, i], out[6, i] = st.rhomass(), st.hmass()
        return out

    t_cp = best(lambda: coolprop_props(p[:m]), 2) * n / m
    props = coolprop_props(p[:m])
    sub = Saturation(T=props[0], p=p[:m], rho_l=props[1], rho_v=props[5], h_lv=props[6] - props[2], sigma=props[3],
                     k_l=props[4])
    full = water(p=p)
    t_np = best(lambda: numpy_math(full), repeat)
    base = t_cp + t_np
    # same math: our chain against NumPy on CoolProp properties (different property sources: loose check)
    ours_sub = fused()
    ref = numpy_math(sub, m)
    assert np.allclose(ours_sub.departure_diameter[:m], ref[1], rtol=0.02)
    t_pub, t_fused = best(public, repeat), best(fused, repeat)
    note = f"(CoolProp {t_cp / n * 1e6:.1f} us/point on {m} points, scaled)"
    table.add("2. screening chain", f"public kernels, {n:.0e} contiguous points", t_pub, base, ">= 3x", note=note)
    table.add("2. screening chain", f"fused path (water_chain), {n:.0e} points", t_fused, base, ">= 8x", note=note)

    # broadcast grid: angles x pressures, properties once per pressure on both sides
    na, npr = (2000, n // 2000)
    ang = np.linspace(5, 90, na)[:, None]
    pg = np.geomspace(5e4, 5e6, npr)
    wg = water(p=pg)
    qg = 3e5

    def grid_ours():
        return (nucleation.onset_superheat(qg, wg, ang), departure.fritz(ang, wg), chf.kandlikar(ang, wg, 30.0))

    def grid_numpy():
        s = wg
        z = 2 * s.sigma * s.T / (s.rho_v * s.h_lv)  # Hsu's 1/rho_v embryo group
        c = np.cos(np.radians(ang))
        onset = np.sqrt(4 * (1 + c)) * np.sqrt(z * qg / s.k_l)
        d = (0.0208 * ang) * np.sqrt(s.sigma / (G * (s.rho_l - s.rho_v)))
        cr = 1 + c
        qc = (cr / 16 * np.sqrt(2 / np.pi + np.pi / 4 * cr * np.cos(np.radians(30.0)))) * (
            s.h_lv * np.sqrt(s.rho_v) * (s.sigma * G * (s.rho_l - s.rho_v)) ** 0.25)
        return onset, d, qc

    for a, b in zip(grid_ours(), grid_numpy()):
        assert np.allclose(a, b, rtol=1e-9)
    t_grid, t_grid_np = paired(grid_ours, grid_numpy, repeat)
    table.add("2. screening chain", f"grid {na} angles x {npr} pressures vs NumPy broadcasting", t_grid, t_grid_np, ">= 1x")

    # 3. thread scaling
    threads = wetboil.get_num_threads()
    t_pub2, t_pub1 = paired(public, one_thread(public), repeat)
    t_grid2, t_grid1 = paired(grid_ours, one_thread(grid_ours), repeat + 2)
    table.add("3. threads", f"public chain, contiguous, {threads} threads vs 1", t_pub2, t_pub1, ">= 1.8x")
    table.add("3. threads", f"grid, {threads} threads vs 1", t_grid2, t_grid1, ">= 1.8x")
    # What the grid's writes alone allow: the grid path's last step (one multiplication per point, each
    # result written once with non-temporal stores) into three outputs of the same size, all threads
    # against one. Near 1x means one core already writes at the machine's memory rate.
    fa, fb = np.linspace(1.0, 2.0, na)[:, None], np.linspace(1.0, 2.0, npr)[None, :]
    outs = list(grid_ours())  # our results' own buffers (cache-line aligned, as every large result)

    def writes():
        for o in outs:
            wetboil._core.product_call(np.broadcast_to(fa, o.shape), np.broadcast_to(fb, o.shape), o)

    t_w2, t_w1 = paired(writes, one_thread(writes), repeat + 2)
    gb = 3 * outs[0].nbytes / 1e9
    table.add("3. threads", f"  grid writes alone, {threads} threads vs 1", t_w2, t_w1, "(context)",
              note=f"({gb / t_w2:.0f} GB/s on {threads} threads, {gb / t_w1:.0f} GB/s on 1)")


def section_water(table, repeat, n_points):
    import CoolProp.CoolProp as CP

    T = np.linspace(280.0, 620.0, n_points)
    st = CP.AbstractState("HEOS", "Water")
    sub = T[:: max(1, n_points // 4000)]

    def coolprop():
        for t in sub:
            st.update(CP.QT_INPUTS, 0.0, t)
            st.p(); st.rhomass(); st.hmass(); st.cpmass(); st.conductivity(); st.viscosity(); st.surface_tension()
            st.update(CP.QT_INPUTS, 1.0, t)
            st.rhomass(); st.hmass(); st.cpmass(); st.conductivity(); st.viscosity()

    t_ours, t_base = paired(lambda: water(T=T), coolprop, repeat + 2)
    t_ours, t_base = t_ours / n_points, t_base / len(sub)
    table.add("5. water()", f"water(T) per state point, {n_points:.0e} points vs CoolProp AbstractState", t_ours, t_base, ">= 100x")
    t_scalar = min(timeit.repeat(lambda: water(T=300.0), number=20_000, repeat=repeat)) / 20_000
    table.add("5. water()", "water(T=300.0) scalar call vs CoolProp AbstractState", t_scalar, t_base, "(context)")

    # the pressure route: the same fields from p (CoolProp's PQ inputs, ours the exact inversion)
    p = np.geomspace(1e3, 2e7, n_points)
    sub_p = p[:: max(1, n_points // 4000)]

    def coolprop_p():
        for v in sub_p:
            st.update(CP.PQ_INPUTS, v, 0.0)
            st.T(); st.rhomass(); st.hmass(); st.cpmass(); st.conductivity(); st.viscosity(); st.surface_tension()
            st.update(CP.PQ_INPUTS, v, 1.0)
            st.rhomass(); st.hmass(); st.cpmass(); st.conductivity(); st.viscosity()

    t_ours, t_base = paired(lambda: water(p=p), coolprop_p, repeat + 2)
    t_ours, t_base = t_ours / n_points, t_base / len(sub_p)
    table.add("5. water()", f"water(p) per state point, {n_points:.0e} points vs CoolProp AbstractState", t_ours, t_base,
              ">= 100x")


_MEMORY_PROBE = r"""
import sys, tracemalloc, numpy as np, wetboil
def status(key):
    for line in open("/proc/self/status"):
        if line.startswith(key + ":"):
            return int(line.split()[1]) * 1024
n = int(sys.argv[1])
chunks = {"p": int(sys.argv[2])} if len(sys.argv) > 2 else None
na = 2000
s = [wetboil.Surface(f"S{i}", 30.0 + i, 40.0 + i, 20.0 + i) for i in range(10)]
p = np.geomspace(1e5, 5e6, n // (10 * na))
hf = np.linspace(1e5, 1e6, na)
wetboil.fluids.water(T=300.0)  # imports and one-time tables before the baseline
with open("/proc/self/clear_refs", "w") as f:
    f.write("5")  # reset the peak resident size (VmHWM) to the current one
before = status("VmRSS")
tracemalloc.start()
ds = wetboil.sweep(s, "water", p=p, heat_flux=hf, chunks=chunks)
cur, peak = tracemalloc.get_traced_memory()
high = status("VmHWM")
# distinct buffers only: "chf" shares its array with the design method's chf_<method>
outputs = sum({v.values.__array_interface__["data"][0]: v.nbytes for v in ds.data_vars.values()}.values())
inputs = p.nbytes + hf.nbytes + 10 * 3 * 8
print(high - before + inputs, peak, outputs + inputs, ds["chf"].size)
"""


def section_memory(table, n):
    """Peak resident memory the sweep added (what the process really held,
    freed buffers kept by the buffer cache included), plus its inputs,
    against inputs plus outputs. The peak traced by tracemalloc (live NumPy
    arrays only) is given in the note. Then the same sweep chunked with dask
    (blocks of a tenth of the pressures), computed into memory (context: the
    target is for the sweep itself)."""
    for chunk, target in ((None, ">= 1/1.2"), (max(n // (10 * 2000 * 10), 1), "(context)")):
        r = subprocess.run([sys.executable, "-c", _MEMORY_PROBE, str(n)] + ([str(chunk)] if chunk else []),
                           capture_output=True, text=True, timeout=3600)
        if r.returncode != 0:
            print("memory probe failed:", r.stderr[-2000:])
            return
        peak, traced, io, points = (int(float(v)) for v in r.stdout.split())
        what = f"sweep of {points:.0e} points" if chunk is None else f"  the same in dask blocks of {chunk} pressures"
        table.add("6. memory", f"{what}: peak resident vs inputs + outputs", f"{peak / 2**20:.0f} MiB",
                  f"{io / 2**20:.0f} MiB", target, ratio=io / peak,
                  note=f"(ratio = (in+out)/peak; traced arrays peak {traced / 2**20:.0f} MiB)")


def main(argv=None):
    ap = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("--quick", action="store_true", help="10^6 points and fewer repeats")
    ap.add_argument("--only", nargs="*", choices=["kernels", "chain", "scalar", "water", "memory"],
                    help="run only these sections")
    args = ap.parse_args(argv)
    n = 10**6 if args.quick else 10**7
    repeat = 2 if args.quick else 3
    print(f"wetboil {wetboil.__version__}, numpy {np.__version__}, Python {platform.python_version()}, "
          f"{os.cpu_count()} cpus, {wetboil.get_num_threads()} wetboil threads, {n:.0e} points")
    only = set(args.only or ["kernels", "chain", "scalar", "water", "memory"])
    table = Table()
    wetboil.errstate(invalid="ignore", out_of_range="ignore").__enter__()  # warnings are not what we time
    if "kernels" in only:
        section_kernels(table, n, repeat)
    if "chain" in only:
        section_chain(table, n, repeat)
    if "scalar" in only:
        section_scalar(table, repeat)
    if "water" in only:
        section_water(table, repeat, 10**5 if args.quick else 10**6)
    if "memory" in only:
        section_memory(table, n)
    table.show()
    if {"kernels", "scalar"} & set(only):
        print("\nnot in sections 1 and 4 (no closed form to write by hand):")
        for k, why in sorted(formulas.NOT_COMPARED.items()):
            print(f"   {k}: {why}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
