"""Calls from several threads: the same results as serial calls, and in parallel.

Checks (issue 6 part 5): results computed by 4 threads at once equal the serial
results bit for bit (the library keeps no state: counteroffer.h "No function keeps
state ... all are thread-safe"; the package keeps its per-call status tally per
thread, bindings/README.md); the error policy of one thread does not leak into
another; two threads finish the same total work faster than one when the GIL is
released (bindings/README.md: NumPy releases the GIL around the ufunc loop).
"""
import os
import threading
import time
import warnings

import numpy as np
import pytest

import counteroffer as co
from conftest import SPECS, valid_arrays

N = 20_000  # below the package's own split threshold (2 x 32768): one thread per call


def bits(x):
    """Every output as raw 64-bit patterns (NaN payloads included); words (which
    walk-away value binds) and bools as they are."""
    if isinstance(x, np.ndarray):
        return [np.ascontiguousarray(x, dtype=np.float64).view(np.uint64)]
    return [np.ascontiguousarray(x[k], dtype=np.float64).view(np.uint64)
            if np.asarray(x[k]).dtype.kind == "f" else np.asarray(x[k]) for k in x]


def run_quiet(fn, args):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        with co.errstate(all="ignore"):
            return fn(*args)


def run_threads(jobs):
    """jobs: list of callables; runs them at once (a barrier), returns results."""
    results = [None] * len(jobs)
    errors = []
    barrier = threading.Barrier(len(jobs))

    def work(i):
        try:
            barrier.wait()
            results[i] = jobs[i]()
        except BaseException as e:  # reported in the main thread
            errors.append(e)

    ts = [threading.Thread(target=work, args=(i,)) for i in range(len(jobs))]
    for t in ts:
        t.start()
    for t in ts:
        t.join()
    if errors:
        raise errors[0]
    return results


def test_every_function_threads_equal_serial_bitwise(spec):
    """Four threads each evaluate the same inputs (plus edge values that give every
    status) at once; every thread's outputs equal the serial outputs bit for bit."""
    rng = np.random.default_rng(6)
    args = valid_arrays(spec, N, rng)
    # edges: NaN, out-of-domain, both factors 1, zero surplus, in the first elements
    for a, v in zip(spec.args, args):
        v[:4] = [np.nan, -1.0, 1.0, 0.0]
    fn = getattr(co, spec.name)
    serial = bits(run_quiet(fn, args))
    # 4 threads on the same inputs, each 3 times
    outs = run_threads([lambda: [bits(run_quiet(fn, args)) for _ in range(3)]
                        for _ in range(4)])
    for per_thread in outs:
        for rep in per_thread:
            for got, want in zip(rep, serial):
                assert np.array_equal(got, want)


def test_mixed_functions_threads_equal_serial():
    """Every function at once, one thread each, against its serial result."""
    rng = np.random.default_rng(7)
    cases = [(getattr(co, s.name), valid_arrays(s, 5000, rng)) for s in SPECS]
    serial = [bits(run_quiet(fn, args)) for fn, args in cases]
    outs = run_threads([(lambda fn=fn, args=args: bits(run_quiet(fn, args)))
                        for fn, args in cases])
    for got, want in zip(outs, serial):
        for g, w in zip(got, want):
            assert np.array_equal(g, w)


def test_error_policy_stays_in_its_thread():
    """One thread keeps raising on invalid input (its errstate), another computes valid
    input under the default policy at the same time and never sees an error: the
    status tally is per thread (bindings/README.md "How it works")."""
    good = np.full(N, 0.9)
    bad = np.full(N, 0.9)
    bad[::2] = 2.0  # a factor above 1: invalid (counteroffer.h cto_share)
    want = co.share(good, 0.8)
    stop = time.monotonic() + 1.0

    def raising():
        n = 0
        with co.errstate(invalid="raise"):
            while time.monotonic() < stop:
                with pytest.raises(co.InvalidArgumentError):
                    co.share(bad, 0.8)
                n += 1
        return n

    def clean():
        n = 0
        while time.monotonic() < stop:
            assert np.array_equal(co.share(good, 0.8), want)
            n += 1
        return n

    counts = run_threads([raising, clean, raising, clean])
    assert min(counts) > 0


def _timed(n_threads, fn, args, calls):
    per = calls // n_threads
    t0 = time.perf_counter()
    run_threads([lambda: [fn(*args) for _ in range(per)] for _ in range(n_threads)])
    return time.perf_counter() - t0


def _risk_averse_inputs(n):
    spec = next(s for s in SPECS if s.name == "risk_averse_share")
    args = valid_arrays(spec, n, np.random.default_rng(8))
    args[5] = np.full(n, 0.1)  # breakdown: the root-finding path (costly per element)
    return co.risk_averse_share, args


def test_gil_released_during_a_call():
    """While one thread is inside a long call (0.3 s or more), a pure-Python thread
    must keep running: with the GIL held it could not run at all until the call
    returns.  Independent of machine load (the counter needs only some CPU time)."""
    fn, args = _risk_averse_inputs(150_000)
    old = co.get_num_threads()
    co.set_num_threads(1)
    stamps = []
    done = threading.Event()

    def counter():
        c = 0
        while not done.is_set():
            c += 1
            if c % 200 == 0:
                stamps.append(time.perf_counter())

    t = threading.Thread(target=counter)
    try:
        t.start()
        time.sleep(0.05)
        t0 = time.perf_counter()
        fn(*args)
        t1 = time.perf_counter()
    finally:
        done.set()
        t.join()
        co.set_num_threads(old)
    # the longest pause of the Python thread while the call ran: with the GIL held
    # it is the whole call (checked by hand against math.factorial, which holds it)
    inside = [t0] + [s for s in stamps if t0 < s < t1] + [t1]
    gap = max(b - a for a, b in zip(inside, inside[1:]))
    assert t1 - t0 > 0.15, "the call was too short (%.3f s) to tell" % (t1 - t0)
    assert gap < 0.25 * (t1 - t0), (
        "a Python thread stood still for %.3f s of a %.3f s call: the GIL is held" % (
            gap, t1 - t0))


# The 2-thread speed-up is a timing: it is measured by tests/bench/python_threads_bench.py
# (house rule: speed is checked by benchmarks with same-run ratios, never by timed tests).
