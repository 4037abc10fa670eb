"""Inputs NumPy would buffer (reversed, float32, big-endian) against the same
call on a contiguous float64 copy and against the formula as NumPy
expressions, on 10^7 points, all measured in this run (best of 5).

    .venv/bin/python benches/layouts.py

Such inputs are copied once into contiguous float64 and then take the ufunc's
threaded loop; the ratio "vs contiguous" is the price of that copy.
"""

import os
import sys
import time

import numpy as np

import wetboil
from wetboil.chf import kandlikar
from wetboil.departure import fritz
from wetboil.fluids import water

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import formulas  # noqa: E402  (the hand-written NumPy baselines of benches/run.py)

N = 10**7 if "--quick" not in sys.argv else 10**6
W = water(p=101325.0)
G = 9.80665
ALL = wetboil.get_num_threads()


def best(f, *args, repeat=5):
    out = float("inf")
    for _ in range(repeat):
        t0 = time.perf_counter()
        f(*args)
        out = min(out, time.perf_counter() - t0)
    return out


def numpy_kandlikar(beta):
    return formulas.NUMPY["kandlikar_chf"](beta, 0.0, W.h_lv, W.rho_l, W.rho_v, W.sigma, G)


def numpy_fritz(theta):
    return formulas.NUMPY["fritz_departure"](theta, W.sigma, W.rho_l, W.rho_v, G)


def main():
    x = np.random.default_rng(1).uniform(10.0, 80.0, N)
    layouts = {"reversed": x[::-1], "float32": x.astype(np.float32), "big-endian": x.astype(">f8")}
    np.testing.assert_allclose(kandlikar(x, W, 0.0), numpy_kandlikar(x), rtol=1e-12)
    np.testing.assert_allclose(fritz(x, W), numpy_fritz(x), rtol=1e-12)
    print(f"{'kernel':<10} {'layout':<11} {'threads':>7} {'time [ms]':>10} {'vs contiguous':>14} {'vs NumPy':>9}")
    for name, ours, theirs in (("kandlikar", lambda a: kandlikar(a, W, 0.0), numpy_kandlikar),
                               ("fritz", lambda a: fritz(a, W), numpy_fritz)):
        for threads in sorted({1, ALL}):
            wetboil.set_num_threads(threads)
            contiguous = best(ours, x)
            for layout, a in layouts.items():
                t = best(ours, a)
                print(f"{name:<10} {layout:<11} {threads:>7} {t * 1e3:>10.1f} {contiguous / t:>13.2f}x "
                      f"{best(theirs, a, repeat=3) / t:>8.2f}x")
        wetboil.set_num_threads(ALL)


if __name__ == "__main__":
    main()
