"""wetboil benchmarks: every number is a ratio against a baseline measured in
the same run, on the same inputs (absolute times are printed for context).

    .venv/bin/python benches/run.py            # full run (10^7 points)
    .venv/bin/python benches/run.py --quick    # 10^6 points, fewer repeats

Baselines: the same formulas hand-written as NumPy expressions (arrays), a
pure-Python `math` version (scalar calls), wetboil on one thread (scaling).
Inputs are Monte-Carlo style: every argument, fluid properties included, is a
contiguous float64 array, as when propagating measurement uncertainty.
"""

from __future__ import annotations

import argparse
import math
import os
import platform
import sys
import timeit

import numpy as np

import wetboil
from wetboil.chf import kandlikar
from wetboil.departure import fritz
from wetboil.fluids import Saturation

G = 9.80665


def best(fn, repeat):
    fn()  # warm up (page faults of first allocation, thread pool start)
    return min(timeit.repeat(fn, number=1, repeat=repeat))


def per_call(stmt, ns, n=200_000, repeat=7):
    return min(timeit.repeat(stmt, number=n, repeat=repeat, globals=ns)) / n


class Table:
    def __init__(self):
        self.rows = []

    def add(self, what, ours, base, target, better="lower"):
        ratio = base / ours if better == "lower" else ours / base
        self.rows.append((what, ours, base, ratio, target))

    def show(self):
        w = max(len(r[0]) for r in self.rows)
        print(f"{'benchmark':<{w}}  {'wetboil':>11}  {'baseline':>11}  {'ratio':>7}  target")
        for what, ours, base, ratio, target in self.rows:
            print(f"{what:<{w}}  {fmt(ours):>11}  {fmt(base):>11}  {ratio:>6.2f}x  {target}")


def fmt(t):
    if t >= 1e-3:
        return f"{t * 1e3:.1f} ms"
    if t >= 1e-6:
        return f"{t * 1e6:.2f} us"
    return f"{t * 1e9:.0f} ns"


def monte_carlo_inputs(n, seed=0):
    """Water near 1 atm with +-2 % property scatter and scattered angles."""
    rng = np.random.default_rng(seed)
    jitter = lambda v: v * rng.normal(1.0, 0.02, n)  # noqa: E731
    fluid = Saturation(
        T=jitter(373.124), p=jitter(101325.0), rho_l=jitter(958.35), rho_v=jitter(0.59817),
        h_lv=jitter(2.2564e6), sigma=jitter(0.058912),
    )
    theta = rng.uniform(5.0, 90.0, n)
    receding = rng.uniform(5.0, 90.0, n)
    orientation = rng.uniform(0.0, 90.0, n)
    return fluid, theta, receding, orientation


def numpy_fritz(theta, s, g=G):
    return 0.0208 * theta * np.sqrt(s.sigma / (g * (s.rho_l - s.rho_v)))


def numpy_kandlikar(beta, s, phi, g=G):
    c = 1.0 + np.cos(np.radians(beta))
    return (
        s.h_lv * np.sqrt(s.rho_v) * (c / 16.0)
        * np.sqrt(2.0 / np.pi + (np.pi / 4.0) * c * np.cos(np.radians(phi)))
        * (s.sigma * g * (s.rho_l - s.rho_v)) ** 0.25
    )


def foundation(table, n, repeat):
    fluid, theta, receding, orientation = monte_carlo_inputs(n)

    def ours():
        return fritz(theta, fluid), kandlikar(receding, fluid, orientation)

    def base():
        return numpy_fritz(theta, fluid), numpy_kandlikar(receding, fluid, orientation)

    a, b = ours(), base()
    for x, y in zip(a, b):
        assert np.allclose(x, y, rtol=1e-12), "benchmark inputs disagree"
    t_ours, t_base = best(ours, repeat), best(base, repeat)
    table.add(f"fritz + kandlikar, {n:.0e} points vs NumPy", t_ours, t_base, ">= 5x")

    threads = wetboil.get_num_threads()
    try:
        wetboil.set_num_threads(1)
        t_one = best(ours, repeat)
    finally:
        wetboil.set_num_threads(threads)
    table.add(f"same, {threads} threads vs 1 thread", t_ours, t_one, ">= 1.8x")


def scalar_calls(table, repeat):
    water = Saturation(T=373.124, p=101325.0, rho_l=958.35, rho_v=0.59817, h_lv=2.2564e6, sigma=0.058912)

    def py_fritz(theta, f, g=G):
        return 0.0208 * theta * math.sqrt(f.sigma / (g * (f.rho_l - f.rho_v)))

    def py_kandlikar(beta, f, phi=0.0, g=G):
        c = 1.0 + math.cos(math.radians(beta))
        return (f.h_lv * math.sqrt(f.rho_v) * c / 16.0
                * math.sqrt(2.0 / math.pi + math.pi / 4.0 * c * math.cos(math.radians(phi)))
                * (f.sigma * g * (f.rho_l - f.rho_v)) ** 0.25)

    ns = dict(fritz=fritz, kandlikar=kandlikar, py_fritz=py_fritz, py_kandlikar=py_kandlikar, w=water)
    assert math.isclose(fritz(45.0, water), py_fritz(45.0, water), rel_tol=1e-14)
    for name, ours, base in [
        ("fritz", "fritz(45.0, w)", "py_fritz(45.0, w)"),
        ("kandlikar", "kandlikar(30.0, w, 10.0)", "py_kandlikar(30.0, w, 10.0)"),
    ]:
        t_ours, t_base = per_call(ours, ns, repeat=repeat), per_call(base, ns, repeat=repeat)
        table.add(f"scalar call {name} vs pure-Python math", t_ours, t_base, "<= 0.5x time (>= 2x)")


def water_properties(table, repeat, n_points):
    """water() per state point against CoolProp's AbstractState (its fastest
    interface) for the same 12 fields, same temperatures."""
    from wetboil.fluids import water

    try:
        import CoolProp.CoolProp as CP
    except ImportError:
        print("(CoolProp not installed: water() benchmark skipped)")
        return
    T = np.linspace(280.0, 620.0, n_points)
    t_ours = best(lambda: water(T=T), repeat) / n_points
    st = CP.AbstractState("HEOS", "Water")
    sub = T[:: max(1, n_points // 4000)]

    def coolprop():
        for t in sub:
            st.update(CP.QT_INPUTS, 0.0, t)
            st.p(); st.rhomass(); st.hmass(); st.cpmass(); st.conductivity(); st.viscosity(); st.surface_tension()
            st.update(CP.QT_INPUTS, 1.0, t)
            st.rhomass(); st.hmass(); st.cpmass(); st.conductivity(); st.viscosity()

    t_base = best(coolprop, max(2, repeat // 2)) / len(sub)
    table.add(f"water(T) per state point ({n_points:.0e} points) vs CoolProp AbstractState", t_ours, t_base, ">= 100x")
    w = water(T=300.0)
    t_scalar = per_call("water(T=300.0)", dict(water=water), n=20_000, repeat=repeat)
    table.add("water(T) scalar call vs CoolProp AbstractState", t_scalar, t_base, "(context)")
    assert abs(w.p / CP.PropsSI("P", "T", 300.0, "Q", 0, "Water") - 1) < 2e-4


def main(argv=None):
    ap = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("--quick", action="store_true", help="10^6 points and fewer repeats")
    args = ap.parse_args(argv)
    n = 10**6 if args.quick else 10**7
    repeat = 3 if args.quick else 5
    print(f"wetboil {wetboil.__version__}, numpy {np.__version__}, Python {platform.python_version()}, "
          f"{os.cpu_count()} cpus, {wetboil.get_num_threads()} wetboil threads")
    table = Table()
    foundation(table, n, repeat)
    scalar_calls(table, repeat)
    water_properties(table, repeat, 10**5 if args.quick else 10**6)
    table.show()
    return 0


if __name__ == "__main__":
    sys.exit(main())
