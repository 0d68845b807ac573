"""solve against backward induction over the game tree, re-derived live for a random
subset of tests/reference/game_tree/solve_game_tree.csv (the C++ test checks every row).

The induction (tests/reference/game_tree/game_tree.py) is written from the game's rules
(docs/models/combined.md; Rubinstein 1982; Binmore, Rubinstein & Wolinsky 1986; Shaked &
Sutton 1984; Muthoo 1999 chs.4-6), in 50-digit arithmetic over horizons T and T+1.
"""
import csv
import math
import os
import random
import sys

import pytest

import counteroffer as co

HERE = os.path.dirname(os.path.abspath(__file__))
GT = os.path.join(HERE, "..", "reference", "game_tree")
sys.path.insert(0, GT)
from game_tree import outcome  # noqa: E402

mp = pytest.importorskip("mpmath")

with open(os.path.join(GT, "solve_game_tree.csv"), newline="") as f:
    ROWS = list(csv.DictReader(f))
SUBSET = random.Random(2026).sample(ROWS, 40)
BINDING = {0: "none", 1: "ours", 2: "theirs", 3: "both"}


def _inputs(r):
    f = {k: float(r[k]) for k in ("own_factor", "other_factor", "breakdown_prob",
                                  "own_fallback", "other_fallback", "own_inside",
                                  "other_inside", "own_outside", "other_outside", "surplus")}
    for k in ("own_outside", "other_outside"):
        if f[k] == -math.inf:
            f[k] = None
    return f, r["own_opens"] == "1"


@pytest.mark.parametrize("row", SUBSET, ids=[str(i) for i in range(len(SUBSET))])
def test_solve_matches_live_backward_induction(row):
    f, opens = _inputs(row)
    own = (f["own_factor"], f["own_fallback"], f["own_inside"], f["own_outside"])
    oth = (f["other_factor"], f["other_fallback"], f["other_inside"], f["other_outside"])
    A, B = (own, oth) if opens else (oth, own)
    r, same_parity, _, _ = outcome(A[0], B[0], f["breakdown_prob"], A[1], B[1], A[2], B[2],
                                   A[3], B[3], f["surplus"])
    assert same_parity
    rational = r["k0"] == "agree" or (r["k0"] == "reject" and r["k1"] == "agree")
    own_v, oth_v = (r["x"], r["t"]) if opens else (r["t"], r["x"])
    scale = max(abs(f["surplus"]), *(abs(v) for v in (f["own_outside"], f["other_outside"])
                                     if v is not None), 1e-300)
    # the committed row is what the generator wrote from the same induction
    assert abs(own_v - mp.mpf(row["own_share"])) <= mp.mpf(10) ** -20 * scale
    assert rational == (row["rational"] == "1")
    with co.errstate(all="ignore"):
        res = co.solve(f["own_factor"], f["other_factor"], f["breakdown_prob"],
                       f["own_fallback"], f["other_fallback"], f["own_inside"],
                       f["other_inside"], f["own_outside"], f["other_outside"],
                       f["surplus"], opens)
    if row["tie"] != "1":
        assert res.rational == rational
        if rational:
            assert res.binding == BINDING[int(row["binding"])]
    assert abs(res.own_share - float(own_v)) <= 1e-13 * scale
    assert abs(res.other_share - float(oth_v)) <= 1e-13 * scale


def test_grouped_rounds_equal_rounds_one_by_one():
    # The induction groups stretches of identical decisions into one affine map raised
    # to a power; over horizons short enough to take round by round the two must agree
    # (the same arithmetic, grouped).
    import game_tree as gt
    rng = random.Random(7)
    for row in rng.sample(ROWS, 25):
        f, opens = _inputs(row)
        A = gt.Side(f["own_factor"], f["breakdown_prob"], f["own_fallback"], f["own_inside"],
                    f["own_outside"])
        B = gt.Side(f["other_factor"], f["breakdown_prob"], f["other_fallback"],
                    f["other_inside"], f["other_outside"])
        S = mp.mpf(f["surplus"])
        T = rng.randrange(500, 1500)
        grouped = gt.solve_game(A, B, S, T)
        if grouped is None:
            continue
        vA, vB = A.d0, B.d0
        for t in range(T - 1, -1, -1):
            if t % 2 == 0:
                vA, vB = gt.one_round(A, B, S, vA, vB)[:2]
            else:
                vB, vA = gt.one_round(B, A, S, vB, vA)[:2]
        scale = max(abs(S), abs(A.d0), abs(B.d0), 1)
        assert abs(grouped["x"] - vA) <= mp.mpf(10) ** -25 * scale
        assert abs(grouped["t"] - vB) <= mp.mpf(10) ** -25 * scale
