"""Reference table of the input distributions' inverse CDFs (docs/models/ranges.md).

Writes dist_inverse.csv: kind, low, mode, high, u, value.  The inputs are doubles (printed
in shortest round-trip form, so the C++ test reads the same numbers); the value is the
exact inverse CDF at those inputs to 25 significant digits, computed with mpmath at 40
digits, independently of the library:
  * uniform and triangular: the closed forms of the CDF inverted by 140 bisections on the
    CDF (not the library's closed-form inverse);
  * PERT: Beta(alpha, beta) with alpha = 1 + 4 (m - lo)/(hi - lo), beta = 1 + 4 (hi - m)/(hi - lo)
    (Vose 2008; Malcolm et al. 1959), inverted by 140 bisections on mpmath's regularised
    incomplete beta (mpmath.betainc(..., regularized=True)).
Rows D1-D16 are the inputs of the 15-digit check values D1-D16 of
tests/cpp/test_range_distributions.cpp (made by the closed form or 140 bisections on
mpmath's incomplete beta at 40 digits, and confirmed by bisection on the triangular CDF
and by scipy.special.betaincinv); the others are a grid of shapes and probabilities, including the extreme coordinates
(0.5 and 2^32 - 0.5) * 2^-32 that the generator can produce.
Run: .venv/bin/python tests/reference/range/make_inverse_table.py
"""
import csv
import os

import mpmath as mp

mp.mp.dps = 40
HERE = os.path.dirname(os.path.abspath(__file__))


def tri_cdf(x, lo, m, hi):
    if x <= lo:
        return mp.mpf(0)
    if x >= hi:
        return mp.mpf(1)
    if x <= m:
        return (x - lo) ** 2 / ((hi - lo) * (m - lo))
    return 1 - (hi - x) ** 2 / ((hi - lo) * (hi - m))


def pert_cdf(x, lo, m, hi):
    a = 1 + 4 * (m - lo) / (hi - lo)
    b = 1 + 4 * (hi - m) / (hi - lo)
    y = (x - lo) / (hi - lo)
    if y <= 0:
        return mp.mpf(0)
    if y >= 1:
        return mp.mpf(1)
    return mp.betainc(a, b, 0, y, regularized=True)


def bisect(cdf, lo, hi, u):
    a, b = mp.mpf(lo), mp.mpf(hi)
    for _ in range(140):
        mid = (a + b) / 2
        if cdf(mid) < u:
            a = mid
        else:
            b = mid
    return (a + b) / 2


def inverse(kind, lo, m, hi, u):
    lo, m, hi, u = (mp.mpf(v) for v in (lo, m, hi, u))
    if kind == "uniform":
        return bisect(lambda x: (x - lo) / (hi - lo), lo, hi, u)
    if kind == "triangular":
        return bisect(lambda x: tri_cdf(x, lo, m, hi), lo, hi, u)
    return bisect(lambda x: pert_cdf(x, lo, m, hi), lo, hi, u)


CHECKS = [  # the check values D1-D16 (tests/cpp/test_range_distributions.cpp)
    ("triangular", 0.02, 0.05, 0.12, 0.1), ("triangular", 0.02, 0.05, 0.12, 0.3),
    ("triangular", 0.02, 0.05, 0.12, 0.5), ("triangular", 0.02, 0.05, 0.12, 0.9),
    ("triangular", 0.0, 0.0, 1.0, 0.05), ("triangular", 0.0, 1.0, 1.0, 0.5),
    ("triangular", 100.0, 150.0, 300.0, 0.975), ("triangular", -1.0, 0.5, 2.0, 0.25),
    ("pert", 0.05, 0.10, 0.20, 0.1), ("pert", 0.05, 0.10, 0.20, 0.5),
    ("pert", 0.05, 0.10, 0.20, 0.9), ("pert", 0.0, 0.5, 1.0, 0.01),
    ("pert", 0.005, 0.02, 0.06, 0.3), ("pert", 0.005, 0.02, 0.06, 0.999),
    ("pert", 0.0, 0.0, 1.0, 0.5), ("pert", 10.0, 20.0, 100.0, 0.7),
]

SHAPES = [(0.0, 0.0, 1.0), (0.0, 1.0, 1.0), (0.0, 0.5, 1.0), (0.05, 0.10, 0.20),
          (0.005, 0.02, 0.06), (-3.0, 2.5, 4.0), (1e6, 1.9e6, 2e6), (0.1, 0.1000001, 0.9),
          (0.0, 0.3, 1.0), (0.0, 0.999, 1.0), (0.0, 0.25, 1.0), (0.0, 0.75, 1.0)]
US = [(0.5) * 2.0 ** -32, 1e-6, 0.01, 0.1, 0.25, 0.4, 0.5, 0.5 + 2.0 ** -33, 0.6, 0.75,
      0.9, 0.99, 1 - 1e-6, (2.0 ** 32 - 0.5) * 2.0 ** -32]


def main():
    rows = [("check",) + c for c in CHECKS]
    for kind in ("uniform", "triangular", "pert"):
        for lo, m, hi in SHAPES:
            for u in US:
                rows.append(("grid", kind, lo, m, hi, u))
    out = os.path.join(HERE, "dist_inverse.csv")
    with open(out, "w", newline="") as f:
        w = csv.writer(f)
        w.writerow(["source", "kind", "low", "mode", "high", "u", "value"])
        for src, kind, lo, m, hi, u in rows:
            v = inverse(kind, lo, m, hi, u)
            w.writerow([src, kind, repr(lo), repr(m), repr(hi), repr(u), mp.nstr(v, 25)])
    print("wrote", out, len(rows), "rows")


if __name__ == "__main__":
    main()
