#!/usr/bin/env python3
"""Writes tests/reference/game_tree/solve_game_tree.csv: the combined model (solve) on
random cases decided by backward induction over the finite game (game_tree.py, mpmath
50 digits, horizons T to T+3 with (a_A a_B)^(T/2) <= 1e-45), not by any closed form.

Cases: factors uniform, within 1e-6 of 1, exactly 0, 1/2 and 1; breakdown 0, tiny,
interior and 1; surpluses log-uniform from 1e-3 to 1e9 (some negative); fallbacks,
status quo and walk-away values in proportion to the surplus, each walk-away option
present or absent; and pairs that straddle a decision boundary: the surplus is moved
to the root of one of the round-0 or round-1 margins (found by a secant step on the
induction itself) and then 1e-9 of the surplus to either side.  Each case is solved
over horizons T, T+1, T+2 and T+3; a case where they differ is left out and counted.
Cases with p = 0 and both factors 1 are left out (indeterminate: no induction limit).
Fixed seeds; run as two shards, then merge:
    CTO_GT_SHARD=0/2 generate.py & CTO_GT_SHARD=1/2 generate.py; CTO_GT_SHARD=0/2 generate.py merge
(about 4 minutes each on an idle machine).

The outputs are model values under the model's stated assumptions, not financial, legal
or tax advice; the cases are random draws, not real deals.
"""
import csv
import math
import os
import random
import sys

import mpmath as mp

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from game_tree import outcome  # noqa: E402

HERE = os.path.dirname(os.path.abspath(__file__))
# Shards (CTO_GT_SHARD=i/k) draw from seed 20261202 + i and write part i of k; "merge"
# joins the parts in order into solve_game_tree.csv (the committed table: k = 2).
SHARD, SHARDS = (int(x) for x in os.environ.get("CTO_GT_SHARD", "0/1").split("/"))
RNG = random.Random(20261202 + SHARD)
N = -(-int(os.environ.get("CTO_GT_CASES", "3200")) // SHARDS)
HEADER = ["own_factor", "other_factor", "breakdown_prob", "own_fallback", "other_fallback",
          "own_inside", "other_inside", "own_outside", "other_outside", "surplus", "own_opens",
          "status", "own_share", "other_share", "binding", "rational", "delayed",
          "own_delay_loss", "other_delay_loss", "opening_advantage", "tie", "path", "min_margin",
          "source"]
SRC = ("game-tree backward induction, T and T+1 with (a_A a_B)^(T/2) <= 1e-45 (game_tree.py); Rubinstein (1982); "
       "BRW (1986); Shaked & Sutton (1984); Muthoo (1999) chs.4-6")


def factor():
    r = RNG.random()
    if r < 0.12:
        return RNG.choice([0.0, 0.5, 1.0])
    if r < 0.35:
        return 1.0 - 10 ** RNG.uniform(-9, -6)      # within 1e-6 of 1
    if r < 0.55:
        return 1.0 - 10 ** RNG.uniform(-6, -1)
    return RNG.uniform(0.0, 1.0)


def draw():
    dO, dT = factor(), factor()
    r = RNG.random()
    p = 0.0 if r < 0.35 else 1.0 if r < 0.45 else 10 ** RNG.uniform(-9, -3) if r < 0.55 else RNG.random()
    S = 10 ** RNG.uniform(-3, 9)
    m = lambda lo, hi: RNG.uniform(lo, hi) * S  # noqa: E731
    bO, bT = (m(-0.5, 0.6), m(-0.5, 0.6)) if RNG.random() < 0.5 else (0.0, 0.0)
    gO, gT = (m(-0.3, 0.6), m(-0.3, 0.6)) if RNG.random() < 0.5 else (0.0, 0.0)
    wO = m(-0.6, 1.3) if RNG.random() < 0.65 else -math.inf
    wT = m(-0.6, 1.3) if RNG.random() < 0.65 else -math.inf
    if RNG.random() < 0.15:
        S = -S * RNG.uniform(0, 0.5) if RNG.random() < 0.3 else S * RNG.uniform(0.2, 1.0)
    opens = RNG.randrange(2)
    return [dO, dT, p, bO, bT, gO, gT, wO, wT, S, opens]


def evaluate(case):
    dO, dT, p, bO, bT, gO, gT, wO, wT, S, opens = case
    w = lambda v: None if v == -math.inf else v  # noqa: E731
    if opens:
        r, ok, A, B = outcome(dO, dT, p, bO, bT, gO, gT, w(wO), w(wT), S)
    else:
        r, ok, A, B = outcome(dT, dO, p, bT, bO, gT, gO, w(wT), w(wO), S)
    return r, ok, A, B


def margins(r):
    return [("am0", r["am0"]), ("wm0", r["wm0"]), ("am1", r["am1"]), ("wm1", r["wm1"])]


def row(case, r, A, B):
    opens = case[10]
    S = mp.mpf(case[9])
    c = lambda P, v: P.k0 + P.k1 * v  # noqa: E731
    rational = r["k0"] == "agree" or (r["k0"] == "reject" and r["k1"] == "agree")
    delayed = rational and r["k0"] != "agree"
    # own is A (the opener) when own opens, else B
    if opens:
        own, oth = r["x"], r["t"]
        own_loss, oth_loss, adv = r["x"] - c(A, r["z"]), r["t"] - c(B, r["y"]), r["x"] - r["z"]
        own_b, oth_b = r["wm1"], r["wm0"]       # own answers in round 1, other in round 0
    else:
        own, oth = r["t"], r["x"]
        own_loss, oth_loss, adv = r["t"] - c(B, r["y"]), r["x"] - c(A, r["z"]), r["y"] - r["t"]
        own_b, oth_b = r["wm0"], r["wm1"]
    binds = lambda m: m is not None and m >= 0  # noqa: E731
    binding = 0
    if rational:
        binding = (3 if binds(oth_b) else 1) if binds(own_b) else (2 if binds(oth_b) else 0)
    scale = max(abs(S), abs(A.d0), abs(B.d0), *(abs(P.w) for P in (A, B) if P.w is not None))
    least = min(abs(m) for _, m in margins(r) if m is not None) / max(scale, 1e-300)
    # a decision within 1e-12 of the money scale of a tie is left to rounding in double
    # precision (the test then checks the values only)
    tie = least <= mp.mpf(10) ** -12
    return ([repr(float(v)) if not isinstance(v, int) else str(v) for v in case] +
            ["ok" if rational else "no_deal"] +
            [mp.nstr(v, 25) for v in (own, oth)] + [binding, int(rational), int(delayed)] +
            [mp.nstr(v, 25) for v in (own_loss, oth_loss, adv)] +
            [int(tie), r["k0"] + "/" + r["k1"], mp.nstr(least, 3)])


def straddle(case, r):
    """Two cases on either side of the root (in the surplus) of one margin, or []."""
    ms = [(k, m) for k, m in margins(r) if m is not None]
    k, m0 = RNG.choice(ms)
    S0 = case[9]
    h = abs(S0) * 1e-3 + 1e-6
    c2 = list(case)
    c2[9] = S0 + h
    r2, ok2, _, _ = evaluate(c2)
    m1 = dict(margins(r2))[k]
    if m1 is None or m1 == m0 or not ok2:
        return []
    root = float(S0 - m0 * h / (m1 - m0))
    if not math.isfinite(root) or root == 0:
        return []
    out = []
    for sgn in (-1, 1):
        c3 = list(case)
        c3[9] = root + sgn * 1e-9 * max(abs(root), 1e-3)
        out.append(c3)
    return out


def main():
    rows, dropped, pairs = [], 0, 0
    queue = []
    while len(rows) < N:
        case = queue.pop() if queue else draw()
        dO, dT, p = case[0], case[1], case[2]
        if p == 0 and dO == 1.0 and dT == 1.0:
            continue
        r, ok, A, B = evaluate(case)
        if not ok:
            dropped += 1
            continue
        rows.append(row(case, r, A, B) + [SRC])
        if len(rows) % 200 == 0:
            print("...", len(rows), "rows", flush=True)
        if not queue and RNG.random() < 0.3:
            extra = straddle(case, r)
            if extra:
                pairs += 1
                queue.extend(extra)
    name = "solve_game_tree.csv" if SHARDS == 1 else "part%d.csv" % SHARD
    path = os.path.join(HERE, name)
    with open(path, "w", newline="") as f:
        wr = csv.writer(f, lineterminator="\n")
        wr.writerow(HEADER)
        wr.writerows(rows)
    kinds = {}
    for rw in rows:
        kinds[rw[21]] = kinds.get(rw[21], 0) + 1
    ties = sum(1 for rw in rows if rw[20] == 1)
    print("rows", len(rows), "boundary pairs", pairs, "ties", ties,
          "dropped (horizons T..T+3 differ)", dropped)
    print("round-0/round-1 decisions:", dict(sorted(kinds.items())))


def merge():
    """Joins part0.csv .. part{k-1}.csv (k from CTO_GT_SHARD) into solve_game_tree.csv."""
    rows = []
    for i in range(SHARDS):
        with open(os.path.join(HERE, "part%d.csv" % i), newline="") as f:
            rows.extend(list(csv.reader(f))[1:])
    with open(os.path.join(HERE, "solve_game_tree.csv"), "w", newline="") as f:
        wr = csv.writer(f, lineterminator="\n")
        wr.writerow(HEADER)
        wr.writerows(rows)
    print("merged", len(rows), "rows")


if __name__ == "__main__":
    merge() if sys.argv[1:] == ["merge"] else main()
