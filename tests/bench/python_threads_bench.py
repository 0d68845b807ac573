"""Benchmark (not a test): calls from two threads run in parallel on two cores.

The same total work (16 calls of 20,000 elements of risk_averse_share with breakdown
risk, the root-finding path) on 1 and on 2 threads, interleaved, best of 5 each, beside a
GIL-free NumPy loop (np.sin) timed the same way as the machine's reference.  Prints both
speed-ups; with the GIL held the counteroffer figure would stay at or below 1.

Run: .venv/bin/python tests/bench/python_threads_bench.py
"""
import os
import sys
import threading
import time

import numpy as np

import counteroffer as co


def run_threads(jobs):
    ts = [threading.Thread(target=j) for j in jobs]
    for t in ts:
        t.start()
    for t in ts:
        t.join()


def timed(n_threads, fn, args, calls):
    per = calls // n_threads
    t0 = time.perf_counter()
    run_threads([lambda: [fn(*args) for _ in range(per)] for _ in range(n_threads)])
    return time.perf_counter() - t0


def main():
    n = 20_000
    rng = np.random.default_rng(8)
    args = (rng.uniform(0.9, 0.999, n), rng.uniform(0.9, 0.999, n), rng.uniform(0.5, 2.0, n),
            rng.uniform(0.5, 2.0, n), "exponential", np.full(n, 0.1))
    fn = co.risk_averse_share
    x = rng.uniform(0, 1, 400_000)
    old = co.get_num_threads()
    co.set_num_threads(1)  # the package's own split off: one core per call
    try:
        fn(*args)
        one, two, ref1, ref2 = [], [], [], []
        for _ in range(5):
            ref1.append(timed(1, np.sin, (x,), 16))
            one.append(timed(1, fn, args, 16))
            two.append(timed(2, fn, args, 16))
            ref2.append(timed(2, np.sin, (x,), 16))
    finally:
        co.set_num_threads(old)
    print("cpus %d; counteroffer: 1 thread %.3f s, 2 threads %.3f s, speed-up %.2f; "
          "np.sin reference speed-up %.2f"
          % (os.cpu_count() or 1, min(one), min(two), min(one) / min(two), min(ref1) / min(ref2)))
    return 0


if __name__ == "__main__":
    sys.exit(main())
