"""Benchmark of the counteroffer Python package; every ratio is measured in this run.

    .venv/bin/python tests/bench/python_bench.py            # the issue's sizes
    .venv/bin/python tests/bench/python_bench.py --quick    # smaller, for a smoke run

1. share on 10^7 elements against the NumPy expression (1 - f2)/(1 - f1 f2), which
   validates nothing (share checks every factor, and reports statuses).  Goal: <= 0.5 x.
   Timed with the package's default threads and with one thread.
2. risk_averse_share with the exponential utility on 10^6 elements against a
   per-element scipy.optimize.brentq loop on the same stationarity conditions (BRW 1986;
   Muthoo 1999 ch.3-4).  Goal: >= 20 x faster.
3. Peak extra memory of one call (tracemalloc, which NumPy reports its buffers to)
   against the size of the output.  Goal: <= 1.1 x.

Not part of the test run: the figures depend on the machine and its load (the load
average is printed).  Inputs are random but seeded.
"""

from __future__ import annotations

import argparse
import math
import os
import time
import tracemalloc

import numpy as np
from scipy import optimize

import counteroffer as co


def best_time(fn, repeat):
    times = []
    for _ in range(repeat):
        t = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t)
    return min(times)


def peak_extra(fn):
    """(peak bytes allocated during fn above the level before it, the result)."""
    tracemalloc.start()
    tracemalloc.reset_peak()
    before, _ = tracemalloc.get_traced_memory()
    res = fn()
    _, peak = tracemalloc.get_traced_memory()
    tracemalloc.stop()
    return peak - before, res


def brentq_exponential(dA, dB, kA, kB, S):
    """One element by brentq: u_B(S - x) = d_B u_B(y), u_A(S - y) = d_A u_A(x),
    u(x) = (1 - exp(-k x))/k, reduced to one equation in x."""
    def f(x):
        y = S + math.log1p(dA * math.expm1(-kA * x)) / kA  # S - u_A^{-1}(d_A u_A(x))
        return -math.expm1(-kB * (S - x)) / kB + dB * math.expm1(-kB * y) / kB

    return optimize.brentq(f, 0.0, S, xtol=1e-15, rtol=8.9e-16)


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__,
                                 formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("--quick", action="store_true", help="10^6 / 10^5 elements")
    ap.add_argument("--repeat", type=int, default=5)
    ap.add_argument("--brentq-n", type=int, default=None,
                    help="elements for the brentq loop (default: all); fewer are timed "
                         "and the time per element scaled, which the output says")
    ns = ap.parse_args()
    n_share = 10**6 if ns.quick else 10**7
    n_risk = 10**5 if ns.quick else 10**6
    n_brentq = min(ns.brentq_n or n_risk, n_risk)
    rng = np.random.default_rng(20261202)
    print(f"counteroffer {co.__version__}, numpy {np.__version__}; "
          f"load average {os.getloadavg()[0]:.2f} on {os.cpu_count()} CPUs; "
          f"threads {co.get_num_threads()}")
    results = []

    # 1. share against the NumPy expression
    f1 = rng.uniform(0.0, 0.999, n_share)
    f2 = rng.uniform(0.0, 0.999, n_share)
    t_expr = best_time(lambda: (1 - f2) / (1 - f1 * f2), ns.repeat)
    t_share = best_time(lambda: co.share(f1, f2), ns.repeat)
    old = co.set_num_threads(1)
    t_share1 = best_time(lambda: co.share(f1, f2), ns.repeat)
    co.set_num_threads(old)
    diff = np.max(np.abs(co.share(f1, f2) - (1 - f2) / (1 - f1 * f2)))
    print(f"\nshare, {n_share:.0e} elements (max |difference| to the expression {diff:.1e})")
    print(f"  NumPy (1-f2)/(1-f1*f2)       {t_expr * 1e3:9.1f} ms")
    print(f"  share, {co.get_num_threads()} thread(s)            {t_share * 1e3:9.1f} ms"
          f"   ratio {t_share / t_expr:.2f}")
    print(f"  share, 1 thread              {t_share1 * 1e3:9.1f} ms"
          f"   ratio {t_share1 / t_expr:.2f}")
    results.append(("share / NumPy expression", t_share / t_expr, "<= 0.5",
                    t_share / t_expr <= 0.5))
    results.append(("share (1 thread) / NumPy expression", t_share1 / t_expr, "(info)", None))

    # 2. risk_averse_share, exponential utility, against brentq per element
    dA = rng.uniform(0.8, 0.99, n_risk)
    dB = rng.uniform(0.8, 0.99, n_risk)
    kA = rng.uniform(0.5, 3.0, n_risk)
    kB = rng.uniform(0.5, 3.0, n_risk)
    t_ra = best_time(lambda: co.risk_averse_share(dA, dB, kA, kB, "exponential"), ns.repeat)
    ours = co.risk_averse_share(dA, dB, kA, kB, "exponential")
    t = time.perf_counter()
    ref = [brentq_exponential(dA[i], dB[i], kA[i], kB[i], 1.0) for i in range(n_brentq)]
    t_bq = (time.perf_counter() - t) * n_risk / n_brentq
    diff = np.max(np.abs(ours[:n_brentq] - np.array(ref)))
    scaled = "" if n_brentq == n_risk else f" (timed on {n_brentq} elements, scaled)"
    print(f"\nrisk_averse_share exponential, {n_risk:.0e} elements "
          f"(max |difference| to brentq {diff:.1e})")
    print(f"  brentq loop                  {t_bq * 1e3:9.1f} ms{scaled}")
    print(f"  risk_averse_share            {t_ra * 1e3:9.1f} ms   speed-up {t_bq / t_ra:.0f} x")
    results.append(("brentq loop / risk_averse_share", t_bq / t_ra, ">= 20", t_bq / t_ra >= 20))

    # 3. peak extra memory against the output
    for label, fn in [(f"share {n_share:.0e}", lambda: co.share(f1, f2)),
                      (f"risk_averse_share {n_risk:.0e}",
                       lambda: co.risk_averse_share(dA, dB, kA, kB, "exponential")),
                      (f"solve {n_risk:.0e} (4 outputs)",
                       lambda: co.solve(dA, dB, other_outside=0.3))]:
        extra, res = peak_extra(fn)
        out_bytes = sum(np.asarray(v).nbytes for v in res.values()) if isinstance(
            res, co.ArrayResult) else res.nbytes
        ratio = extra / out_bytes
        print(f"\npeak extra memory, {label}: {extra / 2**20:.1f} MiB for "
              f"{out_bytes / 2**20:.1f} MiB of output: {ratio:.3f} x")
        results.append((f"peak extra memory / output, {label}", ratio, "<= 1.1", ratio <= 1.1))

    print("\nsummary")
    for name, value, goal, ok in results:
        mark = "" if ok is None else ("  met" if ok else "  NOT MET")
        print(f"  {name:<52} {value:8.3f}  goal {goal}{mark}")


if __name__ == "__main__":
    main()
