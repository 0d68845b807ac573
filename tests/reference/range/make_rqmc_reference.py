"""Reference runs for share_range, computed in numpy independently of the library.

An independent implementation of the generator of docs/models/ranges.md (Sobol' points
from scipy's copy of the Joe & Kuo 2008 direction numbers, natural order; hashed Owen
scrambling; u = (Y + 1/2) 2^-32), the inverse CDFs (triangular closed form; PERT through
scipy.special.betaincinv) and the two examples of docs/models/ranges.md ("The two examples"),
written as closed forms with monthly offers (Delta = 1/12 year, surplus 1, own opens):
  d2: own share x = expm1(-r_B D)/expm1(-(r_A + r_B) D)            (Rubinstein 1982)
      r_A ~ PERT(0.05, 0.10, 0.20), r_B ~ Triangular(0.02, 0.05, 0.12)
  d5: x = [(1 - a_B) - p b_B + p a_B b_A]/(1 - a_A a_B), a_i = (1 - p) exp(-r_i D)
      (Binmore, Rubinstein & Wolinsky 1986; Muthoo 1999 ch. 4), the same r_A, r_B,
      p ~ PERT(0.005, 0.02, 0.06), b_A ~ Triangular(0.10, 0.20, 0.35),
      b_B ~ Triangular(0.05, 0.15, 0.30).
Other's share is 1 - x in both (agreement is immediate and rational at every draw).
Inputs sit in the slots of solve_from_rates: r_A 0, r_B 1, p 3, b_A 4, b_B 5, so their
generator dimensions are 0, 1, 3, 4, 5.

Writes rqmc_reference.csv: model, seed, replicates, log2n, statistic, p, estimate, se
(pooled Hyndman-Fan type-7 quantiles over all R n draws; SE from the R replicate
quantiles; mean and its SE from replicate means) for R = 16 and n = 2^12 (the library
must reproduce these from the same draws) and n = 2^18 (2^22 draws: reference values for
runs with other seeds), plus the first draws of replicate 0 in rqmc_draws.csv for a
draw-by-draw comparison.
Run: .venv/bin/python tests/reference/range/make_rqmc_reference.py   (about a minute)
"""
import csv
import os

import numpy as np
import scipy
from scipy import special

HERE = os.path.dirname(os.path.abspath(__file__))
M64 = np.uint64(0xFFFFFFFFFFFFFFFF)
G = np.uint64(0x9E3779B97F4A7C15)
DELTA = 1.0 / 12.0
PROBS = [0.05, 0.1, 0.25, 0.5, 0.75, 0.9, 0.95]


def mix64(z):
    z = np.asarray(z, dtype=np.uint64)
    with np.errstate(over="ignore"):
        z = (z ^ (z >> np.uint64(30))) * np.uint64(0xBF58476D1CE4E5B9)
        z = (z ^ (z >> np.uint64(27))) * np.uint64(0x94D049BB133111EB)
    return z ^ (z >> np.uint64(31))


def key(seed, r, j):
    with np.errstate(over="ignore"):
        a = mix64(np.uint64(r) + G)
        b = mix64(np.uint64(seed) ^ a)
        return mix64(b ^ (np.uint64(j + 1) * G))


def directions(dims):
    d = np.load(os.path.join(os.path.dirname(scipy.__file__), "stats", "_sobol_direction_numbers.npz"))
    poly, vinit = d["poly"], d["vinit"]
    v = np.zeros((dims, 32), dtype=np.uint64)
    v[0] = [1 << (32 - k) for k in range(1, 33)]
    for j in range(1, dims):
        p = int(poly[j]); s = p.bit_length() - 1
        m = [0] + [int(x) for x in vinit[j][:s]]
        for k in range(s + 1, 33):
            x = (m[k - s] << s) ^ m[k - s]
            for i in range(1, s):
                if (p >> (s - i)) & 1:  # bits of the polynomial below the leading one
                    x ^= m[k - i] << i
            m.append(x)
        v[j] = [m[k] << (32 - k) for k in range(1, 33)]
    return v


def sobol(n, v_j):
    i = np.arange(n, dtype=np.uint64)
    x = np.zeros(n, dtype=np.uint64)
    for k in range(32):
        x ^= np.where((i >> np.uint64(k)) & np.uint64(1), v_j[k], np.uint64(0))
    return x


def scramble(x, kj):
    flips = np.zeros_like(x)
    with np.errstate(over="ignore"):
        for k in range(1, 33):
            prefix = np.zeros_like(x) if k == 1 else x >> np.uint64(33 - k)
            node = np.uint64(1 << (k - 1)) | prefix
            flip = mix64(np.uint64(kj) ^ (node * G)) >> np.uint64(63)
            flips |= flip << np.uint64(32 - k)
    return x ^ flips


def unit(y):
    return (y.astype(np.float64) + 0.5) * 2.0 ** -32


def tri_inv(u, lo, m, hi):
    fm = (m - lo) / (hi - lo)
    return np.where(u < fm, lo + np.sqrt(u * (hi - lo) * (m - lo)),
                    hi - np.sqrt((1 - u) * (hi - lo) * (hi - m)))


def pert_inv(u, lo, m, hi):
    a = 1 + 4 * (m - lo) / (hi - lo)
    b = 1 + 4 * (hi - m) / (hi - lo)
    return lo + (hi - lo) * special.betaincinv(a, b, u)


INPUTS = {  # slot: (inverse CDF, low, mode, high)
    0: (pert_inv, 0.05, 0.10, 0.20), 1: (tri_inv, 0.02, 0.05, 0.12),
    3: (pert_inv, 0.005, 0.02, 0.06), 4: (tri_inv, 0.10, 0.20, 0.35),
    5: (tri_inv, 0.05, 0.15, 0.30),
}


def own_share(model, x):
    rA, rB = x[0], x[1]
    if model == "d2":
        return np.expm1(-rB * DELTA) / np.expm1(-(rA + rB) * DELTA)
    p, bA, bB = x[3], x[4], x[5]
    aA, aB = (1 - p) * np.exp(-rA * DELTA), (1 - p) * np.exp(-rB * DELTA)
    return ((1 - aB) - p * bB + p * aB * bA) / (1 - aA * aB)


def replicate(model, seed, r, n, v):
    slots = [0, 1] if model == "d2" else [0, 1, 3, 4, 5]
    x = {}
    for j in slots:
        inv, lo, m, hi = INPUTS[j]
        x[j] = inv(unit(scramble(sobol(n, v[j]), key(seed, r, j))), lo, m, hi)
    return own_share(model, x)


def type7(y_sorted, p):
    n = len(y_sorted)
    h = (n - 1) * p
    j = int(np.floor(h))
    if j + 1 >= n:
        return y_sorted[-1]
    return y_sorted[j] + (h - j) * (y_sorted[j + 1] - y_sorted[j])


def main():
    v = directions(6)
    rows, draws = [], []
    R, seed = 16, 20240601
    for model, log2n in (("d2", 12), ("d5", 12), ("d2", 18), ("d5", 18)):
        n = 1 << log2n
        reps = [np.sort(replicate(model, seed, r, n, v)) for r in range(R)]
        if log2n == 12:
            draws += [(model, seed, i, repr(float(y))) for i, y in enumerate(replicate(model, seed, 0, 16, v))]
        pooled = np.sort(np.concatenate(reps))
        for which in ("own", "other"):
            for p in PROBS:
                if which == "own":
                    est = type7(pooled, p)
                    per = np.array([type7(y, p) for y in reps])
                else:  # other = 1 - own: its p-quantile from own's sorted draws reversed
                    est = type7(np.sort(1 - pooled), p)
                    per = np.array([type7(np.sort(1 - y), p) for y in reps])
                rows.append((model, seed, R, log2n, which + "_quantile", p, repr(float(est)),
                             repr(float(per.std(ddof=1) / np.sqrt(R)))))
            means = np.array([np.mean(y if which == "own" else 1 - y) for y in reps])
            rows.append((model, seed, R, log2n, which + "_mean", "", repr(float(means.mean())),
                         repr(float(means.std(ddof=1) / np.sqrt(R)))))
    with open(os.path.join(HERE, "rqmc_reference.csv"), "w", newline="") as f:
        w = csv.writer(f)
        w.writerow(["model", "seed", "replicates", "log2n", "statistic", "p", "estimate", "se"])
        w.writerows(rows)
    with open(os.path.join(HERE, "rqmc_draws.csv"), "w", newline="") as f:
        w = csv.writer(f)
        w.writerow(["model", "seed", "index", "own_share"])
        w.writerows(draws)
    print("wrote rqmc_reference.csv and rqmc_draws.csv")


if __name__ == "__main__":
    main()
