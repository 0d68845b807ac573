"""Exact quantiles of own share when one input is uncertain (docs/models/ranges.md).

The share of the opener in Rubinstein's (1982) model from rates with monthly offers
(Delta = 1/12 year, surplus 1), x = expm1(-r_B D)/expm1(-(r_A + r_B) D), increases in r_B
and decreases in r_A.  So with one uncertain rate, the p-quantile of x is x at the
p-quantile of r_B, or at the (1 - p)-quantile of r_A.  Both are computed here with mpmath
at 40 digits: the input quantile by 140 bisections on the input's CDF (PERT through
mpmath's regularised incomplete beta; Malcolm et al. 1959, Vose 2008), then the share.
Writes one_input.csv: uncertain (own_rate/other_rate), kind, low, mode, high, fixed (the
other rate), p, quantile.
Run: .venv/bin/python tests/reference/range/make_one_input.py
"""
import csv
import os

import mpmath as mp

from make_inverse_table import inverse

mp.mp.dps = 40
HERE = os.path.dirname(os.path.abspath(__file__))
D = mp.mpf(1) / 12


def share(rA, rB):
    return mp.expm1(-rB * D) / mp.expm1(-(rA + rB) * D)


CASES = [  # uncertain slot, kind, low, mode, high, the fixed other rate
    ("other_rate", "pert", 0.02, 0.05, 0.12, 0.1),
    ("other_rate", "triangular", 0.02, 0.05, 0.12, 0.1),
    ("other_rate", "uniform", 0.02, 0.0, 0.12, 0.1),
    ("own_rate", "pert", 0.05, 0.10, 0.20, 0.05),
    ("own_rate", "triangular", 0.05, 0.06, 0.30, 0.05),
]
PROBS = [0.05, 0.1, 0.5, 0.9, 0.95]


def main():
    out = os.path.join(HERE, "one_input.csv")
    with open(out, "w", newline="") as f:
        w = csv.writer(f)
        w.writerow(["uncertain", "kind", "low", "mode", "high", "fixed", "p", "quantile"])
        for slot, kind, lo, m, hi, other in CASES:
            for p in PROBS:
                if slot == "other_rate":
                    q = share(mp.mpf(other), inverse(kind, lo, m, hi, p))
                else:
                    q = share(inverse(kind, lo, m, hi, 1 - mp.mpf(p)), mp.mpf(other))
                w.writerow([slot, kind, repr(lo), repr(m), repr(hi), repr(other), repr(p), mp.nstr(q, 25)])
    print("wrote", out)


if __name__ == "__main__":
    main()
