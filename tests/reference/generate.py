#!/usr/bin/env python3
"""Writes the 50-digit reference tables tests/reference/<function>.csv.

Every expected value is computed with mpmath at 50 significant digits (internally more
where a method loses digits) by a method that is independent of the closed forms the
library uses: exact backward induction (BI) over a long finite game, root finding on the
stationary conditions (bisection), numerical maximisation, numerical differentiation,
enumeration with a grid-search check, and root finding on the forward model for the
inverse problems.  Inputs are exactly representable doubles: each is drawn as a Python
float and the expected value is computed for exactly that double (mp.mpf(float) is
exact).  The seed is fixed, so the tables are reproducible.

Run:  tests/reference/generate.sh   (the project venv's Python, or a scratch venv with
      mpmath under build/ref; about 2 minutes).  generate.sh share solve ... rewrites
      only the named tables (with different draws: the random stream is shared).

The expected values are model values under the models' stated assumptions, not
financial, legal or tax advice.  See tests/reference/README.md for each table's method
and published source.
"""
import csv
import math
import os
import random
import sys
import time

import mpmath as mp

mp.mp.dps = 50
HERE = os.path.dirname(os.path.abspath(__file__))
sys.path.insert(0, os.path.join(HERE, "game_tree"))
import game_tree as GAME_TREE  # noqa: E402  (the combined model's game, from its rules)
mp.mp.dps = 50
# For stress runs only: another seed and output directory (the committed tables use the
# defaults).
OUT = os.environ.get("CTO_REF_OUT", HERE)
SEED = int(os.environ.get("CTO_REF_SEED", "19820101"))
RNG = random.Random(SEED)
NAN = float("nan")
INF = float("inf")

# Argument names in catalogue order (docs/reference/functions.md; the library's table must
# agree: the C++ test checks every header against cto_function_info).
# Argument names in catalogue order, read from the one definition of each function.
sys.path.insert(0, os.path.join(HERE, "..", "..", "lib", "gen"))
import catalogue  # noqa: E402

ARGS = {f.name: [a.name for a in f.args] for f in catalogue.load()}
# Tables written before an argument was appended keep their columns (the test fills in
# the appended argument's default): deadline_share gained breakdown_prob in 1.1.
ARGS["deadline_share"] = ARGS["deadline_share"][:7]
SOLVE_OUTPUTS = ["own_share", "other_share", "binding", "rational"]

ROWS = {name: [] for name in ARGS}
SKIPPED = {}     # function -> list of (reason, inputs): draws rejected by a consistency check
NOTES = {}       # function -> counters printed at the end (e.g. rows with delay)


def note(fn, key, k=1):
    NOTES.setdefault(fn, {}).setdefault(key, 0)
    NOTES[fn][key] += k


def skip(fn, reason, inputs):
    SKIPPED.setdefault(fn, []).append((reason, inputs))


def add(fn, args, status, outs, source):
    assert len(args) == len(ARGS[fn]), fn
    assert status in ("ok", "invalid", "no_deal", "indeterminate", "no_convergence")
    if not isinstance(outs, (list, tuple)):
        outs = [outs]
    ROWS[fn].append((list(args), status, list(outs), source))


def M(x):
    """The exact value of a double (or int) as an mpf."""
    return mp.mpf(x)


# ---------------------------------------------------------------- random inputs
def u(a, b):
    return RNG.uniform(a, b)


def logu(a, b):
    """log-uniform in [a, b], a > 0."""
    return math.exp(RNG.uniform(math.log(a), math.log(b)))


def rfactor(near1=0.15, exact=0.1):
    """A discount factor in [0, 1]: uniform, close to 1, or a round value."""
    r = RNG.random()
    if r < exact:
        return RNG.choice([0.0, 0.5, 0.8, 0.9, 0.95, 0.99, 1.0])
    if r < exact + near1:
        return 1.0 - logu(1e-9, 1e-2)
    return u(0.0, 1.0)


def rsurplus():
    r = RNG.random()
    if r < 0.5:
        return 1.0
    if r < 0.6:
        return RNG.choice([1e12, 1e-6, 1000.0, 2.5e7])
    return logu(1e-6, 1e12)


def near_one_factor():
    """A factor within 1e-9 of 1 (or 1e-16, the last double below 1)."""
    return RNG.choice([1.0 - logu(1e-16, 1e-9), 1.0 - 1e-9, 0.9999999999999999, 1.0 - 2 ** -40])


def fmt_in(v):
    if isinstance(v, bool):
        return "1" if v else "0"
    if isinstance(v, int):
        assert float(v) == v, v   # every argument must be an exact double
        return str(v)
    return repr(float(v))


def fmt_out(v):
    if isinstance(v, float) and math.isnan(v):
        return "nan"
    v = mp.mpf(v)
    if mp.isnan(v):
        return "nan"
    return mp.nstr(v, 25)


# ================================================================ discounting
def round_factor_ref(rate, days, basis, cont):
    """(1 + R)^(-days/basis) as a power at 50 digits, or exp(-R days/basis)."""
    t = M(days) / M(basis)
    if cont:
        return mp.exp(-M(rate) * t)
    return mp.power(1 + M(rate), -t)


def gen_round_factor():
    fn = "round_factor"
    src = "direct power (1+R)^(-t) / exp(-R t) at 50 digits; standard compounding (common practice, no source)"
    for i in range(110):
        cont = i % 2
        r = RNG.random()
        rate = RNG.choice([0.0, 0.05, 0.08, 0.1, 1.0]) if r < 0.15 else (logu(1e-6, 3.0) if r < 0.6 else u(0, 0.5))
        days = RNG.choice([1 / 1440, 1 / 86400, 1.0, 7.0, 30.0, 365.0, 0.0]) if RNG.random() < 0.35 else u(0, 400)
        basis = RNG.choice([365.0, 360.0, 365.25, 252.0]) if RNG.random() < 0.8 else u(1, 1000)
        add(fn, [rate, days, basis, cont], "ok", [round_factor_ref(rate, days, basis, cont)], src)
    for a in ([-0.01, 30.0, 365.0, 0], [0.05, -1.0, 365.0, 0], [0.05, 30.0, 0.0, 0],
              [NAN, 30.0, 365.0, 1], [0.05, INF, 365.0, 0], [0.05, 30.0, 365.0, 2],
              [0.05, 30.0, -365.0, 1]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


# ================================================================ the two-party alternating-offers family
class Party:
    def __init__(self, d, b=0.0, g=0.0, w=None):
        self.d, self.b, self.g = M(d), M(b), M(g)
        self.w = None if w is None else M(w)


def cont_value(P, p, v_next):
    """A responder's value of rejecting: breakdown with prob p, else status quo flow
    (1-d) g for the round and the next round's value discounted once."""
    return p * P.b + (1 - p) * ((1 - P.d) * P.g + P.d * v_next)


def wait_value(P, p):
    """No-deal value of waiting forever (root of v = cont_value(v)); the status quo g when
    nothing ever happens (p = 0, d = 1)."""
    al = (1 - p) * P.d
    if al == 1:
        return P.g
    return (p * P.b + (1 - p) * (1 - P.d) * P.g) / (1 - al)


def no_deal_payoffs(P, Q, p):
    """Payoffs without a deal when no discounting and no breakdown leave the induction
    without a limit (both factors 1, p = 0; alternating_reference uses them only there):
    a side whose walk-away value beats its value of waiting walks away, and each side
    with a walk-away value gets it (a side with none keeps its value of waiting);
    otherwise each gets its value of waiting."""
    dP, dQ = wait_value(P, p), wait_value(Q, p)
    walks = (P.w is not None and P.w > dP) or (Q.w is not None and Q.w > dQ)
    if not walks:
        return dP, dQ
    return (P.w if P.w is not None else dP), (Q.w if Q.w is not None else dQ)


def fixed_point_alternating(A, B, p, pi, dps=90):
    """Stationary immediate-agreement solution by bisection on h(x) = x - G(x), where
    G(x) = pi - max(w_B, c_B(pi - max(w_A, c_A(x)))) is non-decreasing with slope at most
    alpha_A alpha_B < 1.  Returns (x, y): A's and B's proposer payoffs."""
    with mp.workdps(dps):
        def tA(x):
            c = cont_value(A, p, x)
            return c if A.w is None else max(A.w, c)

        def tB(y):
            c = cont_value(B, p, y)
            return c if B.w is None else max(B.w, c)

        def h(x):
            return x - (pi - tB(pi - tA(x)))
        mags = [abs(pi), abs(A.b), abs(B.b), abs(A.g), abs(B.g)]
        mags += [abs(P.w) for P in (A, B) if P.w is not None]
        big = 4 * max(mags) + 1
        lo, hi = -big, big
        while h(lo) > 0:
            lo *= 2
        while h(hi) < 0:
            hi *= 2
        for _ in range(400):
            mid = (lo + hi) / 2
            if h(mid) < 0:
                lo = mid
            else:
                hi = mid
            if hi - lo <= mp.mpf(10) ** (-dps + 5) * big:
                break
        x = (lo + hi) / 2
        y = pi - tA(x)
        return +x, +y


def snap(v, scale):
    return mp.mpf(0) if abs(v) < mp.mpf(10) ** -40 * scale else v


def game_tree_decision(A, B, p, pi, allow_ties=False):
    """The decision of the game (docs/models/combined.md) by backward induction over the
    game tree (tests/reference/game_tree/game_tree.py, written from the game's rules):
    returns the induction's result, or None when the two parities differ or a round-0 or
    round-1 margin is within 1e-12 of the money scale (the decision is then rounding)."""
    gt, same, GA, GB = GAME_TREE.outcome(A.d, B.d, p, A.b, B.b, A.g, B.g, A.w, B.w, pi)
    if not same:
        return None
    scale = max(abs(pi), abs(GA.d0), abs(GB.d0), *(abs(P.w) for P in (A, B) if P.w is not None))
    tol = mp.mpf(10) ** -12 * scale if not allow_ties else 0
    for am, wm, P in (("am0", "wm0", GA), ("am1", "wm1", GB)):
        if gt[wm] is not None and abs(gt[wm]) < tol:
            return None
        m = gt[am]
        if gt[wm] is None or gt[wm] < 0:
            # agreeing against rejecting: the margin is the share above d0 times
            # 1 - a_P^2, so it is measured in money as margin / (1 - a_P^2); with a_P = 1
            # the proposer is indifferent by the model (a tie of the model, not of
            # rounding: it agrees, as the library does)
            if P.k1 == 1:
                continue
            m = m / (1 - P.k1 ** 2)
        if abs(m) < tol:
            return None
    return gt, GA, GB


def alternating_reference(fn, A, B, p, pi, own_is_A, header_nd=None, allow_ties=False):
    """Value(s) of the alternating-offers family for one draw.
    Returns (status, own, other, binding, rational, source[, near]) or None when the draw
    is rejected (recorded in SKIPPED).  The decision (deal at round 0, one round late,
    or none) comes from the game-tree induction (game_tree_decision); an immediate deal's
    values come from BI over T rounds (or the stationary root) and must agree with the
    game tree; a late deal's and a no-deal outcome's values are the game tree's.
    header_nd is kept for the callers and unused."""
    aA, aB = (1 - p) * A.d, (1 - p) * B.d
    if aA == 1 and aB == 1:
        ndA, ndB = header_nd
        deal = pi > ndA + ndB
        if deal:
            return ("indeterminate", None, None, None, 1, "both factors 1, no breakdown: every split is an SPE (docs/models/complete-information.md s.1 edge cases)")
        own_nd, oth_nd = (ndA, ndB) if own_is_A else (ndB, ndA)
        return ("no_deal", own_nd, oth_nd, 0, 0, "both factors 1, no breakdown, surplus <= the values of waiting: no deal (docs/models/combined.md, what the outcome says)")
    dec = game_tree_decision(A, B, p, pi, allow_ties)
    if dec is None:
        skip(fn, "game-tree parities differ, or a decision within 1e-12 x scale of a tie", None)
        return None
    gt, GA, GB = dec
    deal = gt["k0"] == "agree" or (gt["k0"] == "reject" and gt["k1"] == "agree")
    if deal and pi <= GA.d0 + GB.d0 and all(P.w is None or P.w < G.d0 for P, G in ((A, GA), (B, GB))):
        # the surplus does not exceed the values of waiting and nobody gains by walking
        # away: a deal would only tie with perpetual disagreement, which counts as no
        # deal (docs/models/complete-information.md s.4 edge cases: b_A + b_B >= S gives no agreement)
        deal = False
        gt = dict(gt, x=GA.d0, t=GB.d0)
    delayed = deal and gt["k0"] != "agree"
    res_scale = max(abs(pi), abs(GA.d0), abs(GB.d0))
    gmethod = "game-tree BI (T and T+1, 50 digits)"
    if not deal or delayed:
        ownv, othv = (gt["x"], gt["t"]) if own_is_A else (gt["t"], gt["x"])
        x, y = gt["x"], gt["y"]
        method = gmethod + ("; agreement one round late" if delayed else "")
        if delayed:
            note(fn, "delayed")
    else:
        # an immediate deal: the game tree's values; where both states agree, confirmed
        # by the root of the stationary conditions (bisection at 90 digits)
        method = gmethod
        if gt["k1"] == "agree":
            x, y = fixed_point_alternating(A, B, p, pi)
            if abs(x - gt["x"]) > mp.mpf(10) ** -30 * max(res_scale, 1) or \
                    abs(y - gt["y"]) > mp.mpf(10) ** -30 * max(res_scale, 1):
                skip(fn, "the game tree and the stationary root differ", (x, gt["x"]))
                return None
            method += ", = stationary root (bisection, 90 digits)"
        ownv, othv = (gt["x"], gt["t"]) if own_is_A else (gt["t"], gt["x"])
    # BI over T rounds and the bisection resolve a value to 1e-45 x the money scale:
    # below 1e-40 x scale a value is 0 (e.g. the whole surplus to a patient side)
    ownv, othv = snap(ownv, res_scale), snap(othv, res_scale)
    if not deal:
        return ("no_deal", ownv, othv, 0, 0, method)
    # which options bind: B's where B answers (round 0), A's where A answers (round 1)
    a_binds = gt["wm1"] is not None and gt["wm1"] >= 0
    b_binds = gt["wm0"] is not None and gt["wm0"] >= 0
    near = any(gt[k] is not None and abs(gt[k]) < 1e-9 * max(abs(pi), 1e-300) for k in ("wm0", "wm1"))
    own_b, oth_b = (a_binds, b_binds) if own_is_A else (b_binds, a_binds)
    binding = (3 if oth_b else 1) if own_b else (2 if oth_b else 0)
    return ("ok", ownv, othv, binding, 1, method, near)


def family_row(fn, A_own, B_oth, p, pi, own_opens, nd_own_oth, allow_ties=False):
    """allow_ties: keep a draw whose decision is within 1e-12 of a tie (the published
    threshold cases, where both sides of the tie give the same values)."""
    A, B = (A_own, B_oth) if own_opens else (B_oth, A_own)
    nd = nd_own_oth if own_opens else (nd_own_oth[1], nd_own_oth[0])
    return alternating_reference(fn, A, B, p, pi, bool(own_opens), nd, allow_ties)


SRC_RUB = "Rubinstein (1982); Muthoo (1999) ch.3"


def gen_share():
    fn = "share"
    n = 0
    while n < 150:
        r = RNG.random()
        if r < 0.2:
            dO, dT = near_one_factor(), (near_one_factor() if RNG.random() < 0.5 else rfactor())
        else:
            dO, dT = rfactor(), rfactor()
        if RNG.random() < 0.5:
            dO, dT = dT, dO
        S = rsurplus()
        if RNG.random() < 0.05:
            S = -S
        if dO == 1.0 and dT == 1.0:
            continue
        opens = RNG.randrange(2)
        res = family_row(fn, Party(dO), Party(dT), 0, M(S), opens, (M(0), M(0)))
        if res is None:
            continue
        add(fn, [dO, dT, S, opens], res[0], [res[1]], res[5] + "; " + SRC_RUB)
        n += 1
    for dO, dT, S, op in ((1.0, 0.9, 1.0, 1), (1.0, 0.9, 1.0, 0), (0.9, 1.0, 1.0, 1), (0.9, 1.0, 1.0, 0),
                          (0.0, 0.0, 1.0, 1), (0.0, 0.0, 1.0, 0), (0.0, 0.7, 5.0, 1), (0.7, 0.0, 5.0, 0),
                          (0.5, 0.5, 0.0, 1), (0.9, 0.8, -3.0, 0), (1.0, 0.999999999, 1e12, 0),
                          (0.999999999, 1.0, 1e-6, 1), (0.5, 0.5, 1.0, 1), (0.95, 0.9, 1.0, 1)):
        res = family_row(fn, Party(dO), Party(dT), 0, M(S), op, (M(0), M(0)))
        add(fn, [dO, dT, S, op], res[0], [res[1]], res[5] + "; " + SRC_RUB + "; docs/models/complete-information.md s.1 edge cases")
    for op in (0, 1):
        add(fn, [1.0, 1.0, 1.0, op], "indeterminate", [NAN], "both factors 1: every split is an SPE (docs/models/complete-information.md s.1 edge cases)")
    for a in ([1.5, 0.9, 1.0, 1], [0.9, -0.1, 1.0, 1], [NAN, 0.9, 1.0, 1], [0.9, 0.9, INF, 1],
              [0.9, 0.9, 1.0, 3], [0.9, 0.9, 1.0, 0.5]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


def rho_of(rate, days, basis, cont):
    c = M(rate) if cont else mp.log(1 + M(rate))
    return c * M(days) / M(basis)


def rdays():
    return RNG.choice([1 / 86400, 1 / 1440, 1 / 24, 1.0, 7.0, 30.0, 91.25, 365.0]) if RNG.random() < 0.5 else logu(1 / 1440, 730)


def rrate():
    r = RNG.random()
    if r < 0.1:
        return RNG.choice([0.0, 0.05, 0.08, 0.1, 0.25])
    if r < 0.6:
        return u(0.0, 0.4)
    return logu(1e-5, 3.0)


def gen_solve_from_rates():
    """The combined model on factors exp(-rho) formed at 50 digits from the rates (the
    library forms them in double with expm1/log1p); each row's decision and values by
    family_row (backward induction over the game tree, tests/reference/game_tree/)."""
    fn = "solve_from_rates"
    src = ("factors exp(-c(rate) days/basis) at 50 digits; Rubinstein (1982); BRW (1986); "
           "Muthoo (1999) chs.3-6 (combined model)")
    n = 0
    while n < 140:
        rO, rT, days = rrate(), rrate(), rdays()
        basis, cont = RNG.choice([365.0, 360.0, 366.0]), RNG.randrange(2)
        if rO == 0 and rT == 0:
            continue
        dO, dT = mp.exp(-rho_of(rO, days, basis, cont)), mp.exp(-rho_of(rT, days, basis, cont))
        p = 0.0 if RNG.random() < 0.4 else (u(0, 0.5) if RNG.random() < 0.6 else logu(1e-6, 1))
        S = rsurplus()
        bO, bT = (u(-0.4, 0.5) * S, u(-0.4, 0.5) * S) if p > 0 or RNG.random() < 0.3 else (0.0, 0.0)
        gO, gT = (u(-0.3, 0.4) * S, u(-0.3, 0.4) * S) if RNG.random() < 0.5 else (0.0, 0.0)
        wO = u(-0.2, 0.8) * S if RNG.random() < 0.5 else -INF
        wT = u(-0.2, 0.8) * S if RNG.random() < 0.5 else -INF
        opens = RNG.randrange(2)
        PO = Party(dO, bO, gO, None if wO == -INF else wO)
        PT = Party(dT, bT, gT, None if wT == -INF else wT)
        res = family_row(fn, PO, PT, M(p), M(S), opens, no_deal_payoffs(PO, PT, M(p)))
        if res is None or res[0] == "indeterminate" or (res[0] == "ok" and res[6]):
            continue
        add(fn, [rO, rT, days, p, bO, bT, gO, gT, wO, wT, S, opens, basis, cont], res[0],
            [res[1], res[2], res[3], res[4]], res[5] + "; " + src)
        n += 1
    for op in (0, 1):
        add(fn, [0.0, 0.0, 30.0, 0.0, 0.0, 0.0, 0.0, 0.0, -INF, -INF, 1.0, op, 365.0, 0],
            "indeterminate", [NAN, NAN, NAN, 1], "both rates 0 and no breakdown: every split is an SPE")
    for a in ([-0.1, 0.05, 30.0, 0.0, 0.0, 0.0, 0.0, 0.0, -INF, -INF, 1.0, 1, 365.0, 0],
              [0.1, 0.05, -1.0, 0.0, 0.0, 0.0, 0.0, 0.0, -INF, -INF, 1.0, 1, 365.0, 0],
              [0.1, 0.05, 30.0, 0.0, 0.0, 0.0, 0.0, 0.0, -INF, -INF, 1.0, 1, 0.0, 0],
              [0.1, 0.05, 30.0, 1.5, 0.0, 0.0, 0.0, 0.0, -INF, -INF, 1.0, 1, 365.0, 0]):
        add(fn, a, "invalid", [NAN, NAN, NAN, NAN], "domain rule (bad-input rules of the contract)")


def gen_share_from_rates():
    fn = "share_from_rates"
    n = 0
    while n < 130:
        rO, rT, days = rrate(), rrate(), rdays()
        if rO == 0 and rT == 0:
            continue
        S = rsurplus()
        opens, basis = RNG.randrange(2), RNG.choice([365.0, 360.0, 365.25])
        cont = RNG.randrange(2)
        with mp.workdps(90):
            dO = mp.exp(-rho_of(rO, days, basis, cont))
            dT = mp.exp(-rho_of(rT, days, basis, cont))
            A, B = Party(0), Party(0)
            A.d, B.d = (dO, dT) if opens else (dT, dO)
            res = alternating_reference(fn, A, B, 0, M(S), bool(opens), (M(0), M(0)))
        if res is None:
            continue
        add(fn, [rO, rT, days, S, opens, basis, cont], res[0], [res[1]],
            res[5] + " on d_i = exp(-rho_i) at 90 digits; Rubinstein (1982); Muthoo (1999) s.3.2")
        n += 1
    for a in ([0.1, 0.05, 365.0, 1.0, 1, 365.0, 1], [0.1, 0.05, 36.5, 1.0, 1, 365.0, 1],
              [0.1, 0.1, 365.0, 1.0, 1, 365.0, 1]):
        with mp.workdps(90):
            A, B = Party(0), Party(0)
            A.d, B.d = mp.exp(-rho_of(a[0], a[2], a[5], 1)), mp.exp(-rho_of(a[1], a[2], a[5], 1))
            res = alternating_reference(fn, A, B, 0, M(1.0), True, (M(0), M(0)))
        add(fn, a, res[0], [res[1]], res[5] + " on d_i = exp(-rho_i); Rubinstein (1982); Muthoo (1999) s.3.2; check value of tests/cpp/test_published.cpp")
    for op in (0, 1):
        add(fn, [0.0, 0.0, 30.0, 1.0, op, 365.0, 0], "indeterminate", [NAN], "both rates 0 (docs/models/complete-information.md s.1 edge cases)")
        add(fn, [0.1, 0.05, 0.0, 1.0, op, 365.0, 1], "indeterminate", [NAN], "days = 0 (header: use limit_share)")
        add(fn, [0.1, 0.05, 30.0, -2.0, op, 365.0, 1], "no_deal", [0.0], "surplus <= 0: no deal, payoff 0 (statuses in docs/reference/functions.md)")
    for a in ([-0.1, 0.05, 30.0, 1.0, 1, 365.0, 0], [0.1, 0.05, -1.0, 1.0, 1, 365.0, 0],
              [0.1, 0.05, 30.0, 1.0, 1, 0.0, 0], [0.1, NAN, 30.0, 1.0, 1, 365.0, 0],
              [0.1, 0.05, 30.0, 1.0, 1, 365.0, 2]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


def gen_limit_share():
    fn = "limit_share"
    src = ("Rubinstein share at offers 1e-40 apart, 120 digits (error O(1e-40)); for positive rates "
           "also = argmax of x^(1/r_own)(S-x)^(1/r_oth) by bisection; BRW (1986); Muthoo (1999) ch.3")
    for i in range(110):
        rO, rT = rrate(), rrate()
        if i < 6:
            rO, rT = [(0.0, 0.1), (0.1, 0.0), (1e-300, 1.0), (5.0, 5.0), (0.1, 0.05), (3e-8, 2.0)][i]
        if rO == 0 and rT == 0:
            continue
        S = rsurplus() if i >= 6 else 1.0
        with mp.workdps(120):
            dl = mp.mpf(10) ** -40
            dO, dT = mp.exp(-M(rO) * dl), mp.exp(-M(rT) * dl)
            v = M(S) * (1 - dT) / (1 - dO * dT)
            if rO > 0 and rT > 0:
                a, b = 1 / M(rO), 1 / M(rT)
                lo, hi = mp.mpf(0), M(S)
                for _ in range(400):
                    mid = (lo + hi) / 2
                    if a / mid - b / (M(S) - mid) > 0:
                        lo = mid
                    else:
                        hi = mid
                nash = (lo + hi) / 2
                assert abs(nash - v) <= mp.mpf(10) ** -35 * M(S), (rO, rT, nash, v)
        add(fn, [rO, rT, S], "ok", [+v], src)
    add(fn, [0.0, 0.0, 1.0], "indeterminate", [NAN], "both rates 0 (docs/models/complete-information.md s.1 edge cases)")
    add(fn, [0.1, 0.05, -1.0], "no_deal", [0.0], "surplus <= 0: no deal, payoff 0 (statuses in docs/reference/functions.md)")
    add(fn, [0.1, 0.05, 0.0], "no_deal", [0.0], "surplus <= 0: no deal, payoff 0 (statuses in docs/reference/functions.md)")
    for a in ([-0.1, 0.05, 1.0], [0.1, INF, 1.0], [0.1, 0.05, NAN]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


def d0_of(d, p, b, g=0.0):
    return wait_value(Party(d, b, g), M(p))


def tiny_share_draws(k):
    """k draws (dO, dT, S, opens) where one side's share is below 1e-6 of the surplus
    (issue 10: each payoff to full relative accuracy): a nearly patient side facing an
    impatient one takes almost everything, as proposer or responder."""
    out = []
    for i in range(k):
        near1 = 1.0 - logu(1e-13, 1e-7)
        other = u(0.05, 0.95) if i % 3 else RNG.choice([0.0, 0.5, 1e-9])
        dO, dT = (near1, other) if i % 2 else (other, near1)
        out.append((dO, dT, rsurplus(), RNG.randrange(2)))
    return out


def add_tiny_rows(fn, make):
    """Rows from tiny_share_draws; make(dO, dT, S, opens) -> (args, own Party, other
    Party, p).  Only rows whose smaller share is below 1e-6 x |surplus| are kept."""
    n = 0
    for dO, dT, S, opens in tiny_share_draws(60):
        args, PO, PT, p = make(dO, dT, S, opens)
        res = family_row(fn, PO, PT, M(p), M(S), opens, (M(0), M(0)))
        if res is None or res[0] != "ok":
            continue
        if min(abs(res[1]), abs(res[2])) >= mp.mpf(10) ** -6 * abs(M(S)):
            continue
        outs = [res[1], res[2], res[3], res[4]] if fn == "solve" else [res[1]]
        add(fn, args, res[0], outs, res[5] + "; a share below 1e-6 of the surplus")
        n += 1
    note(fn, "tiny-share rows", n)


def gen_breakdown_share():
    fn = "breakdown_share"
    src = "Binmore, Rubinstein & Wolinsky (1986); Muthoo (1999) ch.4; docs/models/complete-information.md s.4 timing"
    n = 0
    while n < 160:
        dO, dT = rfactor(), rfactor()
        if RNG.random() < 0.15:
            dO, dT = near_one_factor(), near_one_factor()
        p = RNG.choice([0.0, 1.0, 0.5, 1e-9]) if RNG.random() < 0.15 else (logu(1e-6, 1) if RNG.random() < 0.5 else u(0, 1))
        S = rsurplus()
        bO, bT = u(-0.6, 0.6) * S, u(-0.6, 0.6) * S
        if RNG.random() < 0.2:
            S = u(-0.5, 0.5) * S      # no-deal and settlement-like draws
        opens = RNG.randrange(2)
        ndO, ndT = d0_of(dO, p, bO), d0_of(dT, p, bT)
        if p == 0 and (dO == 1.0 or dT == 1.0):
            ndO = M(0) if dO == 1.0 else ndO
            ndT = M(0) if dT == 1.0 else ndT
        res = family_row(fn, Party(dO, bO), Party(dT, bT), M(p), M(S), opens, (ndO, ndT))
        if res is None:
            continue
        add(fn, [dO, dT, p, bO, bT, S, opens], res[0], [res[1]], res[5] + "; " + src)
        n += 1
        note(fn, res[0])
    # the settlement example (negative fallbacks, docs/models/complete-information.md s.4 edge cases) and edges
    for a in ([1.0, 1.0, 0.5, -0.3, -0.2, 0.0, 1], [1.0, 1.0, 0.1, 0.2, 0.1, 1.0, 1],
              [0.95, 0.9, 0.05, 0.2, 0.1, 1.0, 1], [0.9, 0.8, 1.0, 0.25, 0.5, 0.75, 1],
              [0.9, 0.8, 1.0, 0.25, 0.5, 0.75, 0], [1.0, 0.9, 0.0, 0.3, 0.3, 1.0, 1],
              [0.9, 1.0, 0.0, 0.3, 0.3, 1.0, 0], [1.0, 1.0, 1e-12, 0.2, 0.1, 1.0, 1],
              [1.0, 1.0, 1.0, 0.2, 0.1, 1.0, 1]):
        dO, dT, p, bO, bT, S, op = a
        ndO, ndT = d0_of(dO, p, bO), d0_of(dT, p, bT)
        if p == 0:
            ndO, ndT = M(0), M(0)
        res = family_row(fn, Party(dO, bO), Party(dT, bT), M(p), M(S), op, (ndO, ndT), allow_ties=True)
        if res is None:
            continue
        add(fn, a, res[0], [res[1]], res[5] + "; " + src + "; docs/models/complete-information.md s.4 case")
    add_tiny_rows(fn, lambda dO, dT, S, op: (
        [dO, dT, 1e-9 if op else 0.0, 0.0, 0.0, S, op], Party(dO), Party(dT), 1e-9 if op else 0.0))
    for op in (0, 1):
        add(fn, [1.0, 1.0, 0.0, 0.1, 0.2, 1.0, op], "indeterminate", [NAN], "p = 0 and both factors 1 (docs/models/complete-information.md s.4 edge cases)")
    for a in ([0.9, 0.9, 1.5, 0.0, 0.0, 1.0, 1], [0.9, 0.9, -0.1, 0.0, 0.0, 1.0, 1],
              [0.9, 0.9, 0.1, NAN, 0.0, 1.0, 1], [0.9, 2.0, 0.1, 0.0, 0.0, 1.0, 1],
              [0.9, 0.9, 0.1, 0.0, -INF, 1.0, 1]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


def gen_outside_option_share():
    fn = "outside_option_share"
    src = "Shaked & Sutton (1984); Binmore, Shaked & Sutton (1989); Muthoo (1999) ch.5"
    n = 0
    while n < 170:
        dO, dT = rfactor(), rfactor()
        if RNG.random() < 0.12:
            dO, dT = near_one_factor(), rfactor()
            if RNG.random() < 0.5:
                dO, dT = dT, dO
        if dO == 1.0 and dT == 1.0:
            continue
        S = rsurplus()
        opens = RNG.randrange(2)
        kind = n % 6
        # options around the regime thresholds of docs/models/complete-information.md s.5 (computed in doubles)
        dA, dB = (dO, dT) if opens else (dT, dO)
        den = 1 - dA * dB if dA * dB < 1 else 1e-300
        UA, UB = S * (1 - dB) / den, S * (1 - dA) / den
        if kind == 0:
            wA, wB = u(-0.3, 1) * dA * UA, u(-0.3, 1) * dB * UB
        elif kind == 1:
            wB = u(dB * UB, S)
            wA = u(-0.2, 1) * dA * (S - wB)
        elif kind == 2:
            wA = u(dA * UA, S)
            wB = u(-0.2, 1) * dB * (S - wA)
        elif kind == 3:
            wA, wB = u(0, 0.5) * S, u(0, 0.5) * S
        elif kind == 4:   # at a threshold (the shares are continuous there)
            t = RNG.randrange(3)
            if t == 0:
                wA, wB = 0.0, dB * UB
            elif t == 1:
                wA, wB = dA * UA, 0.0
            else:
                wB = u(dB * UB, S)
                wA = dA * (S - wB)
        else:             # no deal: options exhaust the surplus
            wA, wB = u(0.3, 1.0) * S, u(0.3, 1.0) * S
            if RNG.random() < 0.3:
                wA = u(-1.0, 0.0) * S
                wB = u(1.0, 1.5) * S
        wO, wT = (wA, wB) if opens else (wB, wA)
        nd = no_deal_payoffs(Party(dO, w=wO), Party(dT, w=wT), 0)
        res = family_row(fn, Party(dO, w=wO), Party(dT, w=wT), 0, M(S), opens, nd,
                         allow_ties=(kind == 4))  # drawn at a threshold on purpose
        if res is None:
            continue
        add(fn, [dO, dT, wO, wT, S, opens], res[0], [res[1]], res[5] + "; " + src)
        n += 1
        note(fn, res[0] + (":binding=%d" % res[3] if res[0] == "ok" else ""))
    # check values 40-50 and 83 (tests/cpp/test_published.cpp)
    for a in ([0.9, 0.9, 0.0, 0.3, 1.0, 1], [0.9, 0.9, 0.0, 0.5, 1.0, 1], [0.9, 0.9, 0.5, 0.0, 1.0, 1],
              [0.5, 0.5, 0.4, 0.4, 1.0, 1], [0.95, 0.9, 0.2, 0.45, 1.0, 1], [0.9, 0.95, 0.45, 0.2, 1.0, 0],
              [0.9, 0.9, 0.0, 0.9 / 1.9, 1.0, 1], [0.9, 0.9, 0.6, 0.5, 1.0, 1]):
        dO, dT, wO, wT, S, op = a
        res = family_row(fn, Party(dO, w=wO), Party(dT, w=wT), 0, M(S), op,
                         no_deal_payoffs(Party(dO, w=wO), Party(dT, w=wT), 0), allow_ties=True)
        add(fn, a, res[0], [res[1]], res[5] + "; " + src + "; check value of tests/cpp/test_published.cpp")
    add_tiny_rows(fn, lambda dO, dT, S, op: (
        [dO, dT, -0.1 * abs(S), -0.2 * abs(S), S, op], Party(dO, w=-0.1 * abs(S)),
        Party(dT, w=-0.2 * abs(S)), 0.0))
    for op in (0, 1):
        add(fn, [1.0, 1.0, 0.1, 0.2, 1.0, op], "indeterminate", [NAN], "both factors 1 (docs/models/complete-information.md s.1 edge cases)")
    for a in ([0.9, 0.9, NAN, 0.2, 1.0, 1], [0.9, 0.9, 0.1, INF, 1.0, 1], [1.1, 0.9, 0.1, 0.2, 1.0, 1],
              [0.9, 0.9, 0.1, 0.2, 1.0, -1]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


def gen_inside_option_share():
    fn = "inside_option_share"
    src = "Muthoo (1999) ch.6 (inside options)"
    n = 0
    while n < 140:
        dO, dT = rfactor(), rfactor()
        if RNG.random() < 0.15:
            dO, dT = near_one_factor(), near_one_factor()
        if dO == 1.0 and dT == 1.0:
            continue
        S = rsurplus()
        gO, gT = u(-0.5, 0.6) * S, u(-0.5, 0.6) * S
        if RNG.random() < 0.15:
            S = u(-0.5, 0.5) * S
        opens = RNG.randrange(2)
        res = family_row(fn, Party(dO, g=gO), Party(dT, g=gT), 0, M(S), opens, (M(gO), M(gT)))
        if res is None:
            continue
        add(fn, [dO, dT, gO, gT, S, opens], res[0], [res[1]], res[5] + "; " + src)
        n += 1
        note(fn, res[0])
    for a in ([0.9, 0.9, 0.1, 0.3, 1.0, 1], [0.9, 0.9, 0.1, 0.3, 1.0, 0], [1.0, 0.9, 0.2, 0.1, 1.0, 1],
              [0.9, 1.0, 0.2, 0.1, 1.0, 1]):
        dO, dT, gO, gT, S, op = a
        res = family_row(fn, Party(dO, g=gO), Party(dT, g=gT), 0, M(S), op, (M(gO), M(gT)))
        if res is None:
            continue
        add(fn, a, res[0], [res[1]], res[5] + "; " + src + "; docs/models/complete-information.md s.6: check value 51 of tests/cpp/test_published.cpp, its mirror, one patient side")
    add_tiny_rows(fn, lambda dO, dT, S, op: ([dO, dT, 0.0, 0.0, S, op], Party(dO), Party(dT), 0.0))
    for op in (0, 1):
        add(fn, [1.0, 1.0, 0.1, 0.2, 1.0, op], "indeterminate", [NAN], "both factors 1 (docs/models/complete-information.md s.1 edge cases)")
    for a in ([0.9, 0.9, NAN, 0.2, 1.0, 1], [0.9, -0.9, 0.1, 0.2, 1.0, 1], [0.9, 0.9, 0.1, 0.2, -INF, 1]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


def gen_solve():
    fn = "solve"
    src = "Rubinstein (1982); BRW (1986); Muthoo (1999) chs.3-6 (combined model, docs/models/combined.md)"
    n = 0
    while n < 200:
        dO, dT = rfactor(), rfactor()
        if RNG.random() < 0.1:
            dO, dT = near_one_factor(), near_one_factor()
        p = 0.0 if RNG.random() < 0.3 else (u(0, 1) if RNG.random() < 0.6 else logu(1e-6, 1))
        S = rsurplus()
        bO, bT = (u(-0.4, 0.5) * S, u(-0.4, 0.5) * S) if p > 0 or RNG.random() < 0.3 else (0.0, 0.0)
        gO, gT = (u(-0.3, 0.4) * S, u(-0.3, 0.4) * S) if RNG.random() < 0.6 else (0.0, 0.0)
        wO = u(-0.2, 0.8) * S if RNG.random() < 0.6 else -INF
        wT = u(-0.2, 0.8) * S if RNG.random() < 0.6 else -INF
        if RNG.random() < 0.1:
            S = u(-0.3, 0.6) * S
        opens = RNG.randrange(2)
        PO = Party(dO, bO, gO, None if wO == -INF else wO)
        PT = Party(dT, bT, gT, None if wT == -INF else wT)
        ndO, ndT = no_deal_payoffs(PO, PT, M(p))
        res = family_row(fn, PO, PT, M(p), M(S), opens, (ndO, ndT))
        if res is None:
            continue
        if res[0] == "ok" and res[6]:
            skip(fn, "an option within 1e-9 x surplus of its threshold (binding ambiguous)", None)
            continue
        if res[0] == "indeterminate":
            continue
        add(fn, [dO, dT, p, bO, bT, gO, gT, wO, wT, S, opens], res[0],
            [res[1], res[2], res[3], res[4]], res[5] + "; " + src)
        n += 1
        note(fn, res[0] + (":binding=%d" % res[3] if res[0] == "ok" else ""))
    add_tiny_rows(fn, lambda dO, dT, S, op: (
        [dO, dT, 0.0, 0.0, 0.0, 0.0, 0.0, -INF, -INF, S, op], Party(dO), Party(dT), 0.0))
    # the worked case: the opener can walk away only one round on, so its deal
    # at round 0 is rational although the walk-away values add up to more than S
    a = [0.9999787082350563, 0.9997979186187722, 0.0, 0.0, 0.0, 0.24516090126133086,
         0.20927423291712718, 0.8094438040631461, 0.1905599633344914, 1.0, 1]
    res = family_row(fn, Party(a[0], 0, a[5], a[7]), Party(a[1], 0, a[6], a[8]), M(0), M(1), 1, (M(0), M(0)))
    assert res[0] == "ok" and abs(res[1] - mp.mpf("0.80943625486006266")) < 1e-16, res
    add(fn, a, res[0], [res[1], res[2], res[3], res[4]], res[5] + "; " + src + "; issue 10 worked case")
    for op in (0, 1):
        add(fn, [1.0, 1.0, 0.0, 0.1, 0.1, 0.1, 0.2, -INF, -INF, 1.0, op], "indeterminate",
            [NAN, NAN, NAN, 1], "p = 0 and both factors 1: every split is an SPE (docs/models/combined.md); a deal is rational")
    for a in ([0.9, 0.9, 0.0, 0.0, 0.0, 0.0, 0.0, NAN, -INF, 1.0, 1],
              [0.9, 0.9, 2.0, 0.0, 0.0, 0.0, 0.0, -INF, -INF, 1.0, 1],
              [0.9, 0.9, 0.0, 0.0, 0.0, 0.0, 0.0, INF, -INF, 1.0, 1],
              [0.9, 0.9, 0.0, 0.0, 0.0, 0.0, 0.0, -INF, -INF, 1.0, 2]):
        add(fn, a, "invalid", [NAN, NAN, NAN, NAN], "domain rule (docs/reference/functions.md bad-input rules)")


def gen_first_mover_advantage():
    fn = "first_mover_advantage"
    src = "share as opener minus share as responder, each by %s; Rubinstein (1982); docs/models/complete-information.md s.10"
    n = 0
    while n < 110:
        dO, dT = rfactor(), rfactor()
        if RNG.random() < 0.15:
            dO, dT = near_one_factor(), rfactor()
        if dO == 1.0 and dT == 1.0:
            continue
        S = rsurplus()
        if RNG.random() < 0.04:
            S = -S
        r1 = family_row(fn, Party(dO), Party(dT), 0, M(S), 1, (M(0), M(0)))
        r0 = family_row(fn, Party(dO), Party(dT), 0, M(S), 0, (M(0), M(0)))
        if r1 is None or r0 is None:
            continue
        st = r1[0]
        add(fn, [dO, dT, S], st, [snap(r1[1] - r0[1], abs(M(S))) if st == "ok" else M(0)], src % r1[5])
        n += 1
    for a in ([0.8, 0.8, 1.0], [math.exp(-0.1 / 12), math.exp(-0.05 / 12), 1000.0]):
        r1 = family_row(fn, Party(a[0]), Party(a[1]), 0, M(a[2]), 1, (M(0), M(0)))
        r0 = family_row(fn, Party(a[0]), Party(a[1]), 0, M(a[2]), 0, (M(0), M(0)))
        add(fn, a, "ok", [r1[1] - r0[1]], src % r1[5] + "; docs/models/complete-information.md s.10 example or check value 78 of tests/cpp/test_published.cpp")
    add(fn, [1.0, 1.0, 1.0], "indeterminate", [NAN], "both factors 1 (docs/models/complete-information.md s.1 edge cases)")
    for a in ([NAN, 0.9, 1.0], [0.9, 1.01, 1.0], [0.9, 0.9, INF]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


# ================================================================ deadline (finite horizon)
def deadline_reference(dO, dT, T, bO, bT, S, own_opens):
    """Exact backward induction over T rounds (deadline payoffs at the date of the final
    rejection; the responder accepts when indifferent; each proposer chooses between the
    cheapest acceptable offer and a deliberately rejected one).  Rounds are done one by
    one, 20000 at a time; between such stretches two kinds of phase are crossed at once:
      - agreement in both of the last two rounds and at the 2-round fixed point: the
        2-round affine map is raised to the remaining power by repeated squaring of its
        3x3 matrix (80 digits); a linear condition that holds at both ends of the
        monotone path holds all along it;
      - no agreement in the last two rounds with both values >= 0: values are only
        discounted, v_i -> d_i^n v_i, and agreement resumes at the first n with
        S >= d_own^n v_own + d_oth^n v_oth (found by bisection on n; the right side
        falls with n).
    Returns (status, own value in round 1, first round with agreement or None, method)."""
    if T == 0:
        return "no_deal", M(bO), None, "no bargaining: own's fallback"
    with mp.workdps(80):
        d = {0: M(dO), 1: M(dT)}
        pi = M(S)
        first = 0 if own_opens else 1

        def proposer(k):
            return first if k % 2 == 1 else 1 - first

        def deal_ok(s, X):
            Y = 1 - X
            return pi - d[Y] * s[Y] >= d[X] * s[X]

        def step_matrix(X):
            # agreement in this round: v_X = pi - d_Y v_Y', v_Y = d_Y v_Y'
            Y = 1 - X
            m = mp.zeros(3, 3)
            m[X, Y] = -d[Y]
            m[X, 2] = pi
            m[Y, Y] = d[Y]
            m[2, 2] = 1
            return m

        # round T: the alternatives are the deadline payoffs, undiscounted (at round T)
        k = T
        X = proposer(k)
        Y = 1 - X
        b = {0: M(bO), 1: M(bT)}
        if pi - b[Y] >= b[X]:
            v = {X: pi - b[Y], Y: b[Y]}
            first_deal, deals = k, [True]
        else:
            v = dict(b)
            first_deal, deals = None, [False]
        k -= 1
        jumps = []
        while k >= 1:
            steps = 0
            while k >= 1 and steps < 20000:
                X = proposer(k)
                Y = 1 - X
                cY, cX = d[Y] * v[Y], d[X] * v[X]
                if pi - cY >= cX:
                    v = {X: pi - cY, Y: cY}
                    first_deal = k
                    deals.append(True)
                else:
                    v = {X: cX, Y: cY}
                    deals.append(False)
                k -= 1
                steps += 1
            if k < 1:
                break
            X0 = proposer(k)
            if deals[-1] and deals[-2]:
                two = step_matrix(proposer(k - 1)) * step_matrix(X0)
                m_pairs, rest = divmod(k, 2)
                s0 = mp.matrix([v[0], v[1], 1])
                fp = mp.lu_solve(mp.eye(2) - two[0:2, 0:2], mp.matrix([two[0, 2], two[1, 2]]))
                sfp = mp.matrix([fp[0], fp[1], 1])
                s1 = step_matrix(X0) * s0
                if not (deal_ok(s0, X0) and deal_ok(s1, proposer(k - 1)) and deal_ok(sfp, X0)
                        and deal_ok(step_matrix(X0) * sfp, proposer(k - 1))):
                    raise RuntimeError("deadline: agreement phase not stable")
                P, base, e = mp.eye(3), two, m_pairs
                while e:
                    if e & 1:
                        P = base * P
                    base = base * base
                    e >>= 1
                s = P * s0
                if rest:
                    if not deal_ok(s, proposer(1)):
                        raise RuntimeError("deadline: agreement phase ends early")
                    s = step_matrix(proposer(1)) * s
                v = {0: s[0], 1: s[1]}
                first_deal = 1
                jumps.append("agreement phase of %d rounds by repeated squaring" % k)
                k = 0
            elif not deals[-1] and not deals[-2] and v[0] >= 0 and v[1] >= 0:
                # values at round k+1; with n more rounds of disagreement the proposer of
                # round k+1-n compares S with d_0^n v_0 + d_1^n v_1
                def agree_after(n):
                    return pi >= mp.power(d[0], n) * v[0] + mp.power(d[1], n) * v[1]
                if not agree_after(k):
                    v = {0: mp.power(d[0], k) * v[0], 1: mp.power(d[1], k) * v[1]}
                    jumps.append("disagreement to round 1 (%d rounds)" % k)
                    k = 0
                    break
                lo, hi = 0, k          # agree_after(lo) false, agree_after(hi) true
                while hi - lo > 1:
                    mid = (lo + hi) // 2
                    if agree_after(mid):
                        hi = mid
                    else:
                        lo = mid
                n = hi - 1             # rounds k..k-n+1 disagree
                v = {0: mp.power(d[0], n) * v[0], 1: mp.power(d[1], n) * v[1]}
                jumps.append("disagreement phase of %d rounds" % n)
                k -= n
                deals.extend([False, False])
            else:
                raise RuntimeError("deadline: a pattern of delay that is not a phase")
        status = "ok" if first_deal is not None else "no_deal"
        method = "BI T=%d" % T
        if jumps:
            method += " (rounds one by one; " + ", ".join(jumps) + ")"
        return status, +v[0], first_deal, method


def gen_deadline_share():
    fn = "deadline_share"
    src = "Stahl (1972); Gibbons (1992) s.2.1.D; docs/models/complete-information.md s.3 (deadline payoffs at round T)"

    def row(dO, dT, T, bO, bT, S, opens, extra=""):
        try:
            st, val, first, method = deadline_reference(dO, dT, T, bO, bT, S, opens)
        except RuntimeError as e:
            skip(fn, str(e), (dO, dT, T, bO, bT, S, opens))
            return None
        if st == "ok" and first != 1:
            extra = "; first agreement in round %d" % first + extra
        add(fn, [dO, dT, T, bO, bT, S, opens], st, [val], method + extra + "; " + src)
        note(fn, st + (":delay" if st == "ok" and first != 1 else "") + (":T>20000" if T > 20000 else ""))
        return st, val, first

    rounds_list = list(range(0, 13)) * 3 + [RNG.randrange(13, 400) for _ in range(40)]
    rounds_list += [10 ** k for k in range(2, 13)] * 3 + [10 ** 12 + 1, 2 ** 40 + 1, 999999, 1000001, 25001, 40000]
    for T in rounds_list:
        dO, dT = rfactor(), rfactor()
        if T > 20000 and RNG.random() < 0.6:
            dO, dT = 1.0 - logu(1e-12, 1e-4), 1.0 - logu(1e-12, 1e-4)
        S = rsurplus()
        bO, bT = (u(-0.3, 0.5) * S, u(-0.3, 0.5) * S) if RNG.random() < 0.6 else (0.0, 0.0)
        if T > 20000 and RNG.random() < 0.3:
            bO, bT = u(0.5, 0.9) * S, u(0.5, 0.9) * S      # disagreement near the deadline
        opens = RNG.randrange(2)
        if dO == 1.0 and dT == 1.0 and T > 20000:
            dO = 0.5
        row(dO, dT, T, bO, bT, S, opens)
    # equilibrium delay: a proposer with a negative deadline payoff and less patience than
    # the responder prefers to have its offer rejected (header of cto_deadline_share)
    n = 0
    while n < 40:
        T = RNG.choice([2, 3, 4, 5, 6, 7, 8, 9, 12, 15, 20, 31, 60, 1001, 10 ** 6, 10 ** 12])
        dO, dT = u(0.1, 0.7), u(0.75, 0.99)
        if RNG.random() < 0.5:
            dO, dT = dT, dO
        S = RNG.choice([1.0, 1000.0])
        bO, bT = u(-3, 0.2) * S, u(-3, 0.2) * S
        if RNG.random() < 0.3:
            bO, bT = u(0.5, 1.5) * S, u(0.5, 1.5) * S
        opens = RNG.randrange(2)
        try:
            st, val, first, method = deadline_reference(dO, dT, T, bO, bT, S, opens)
        except RuntimeError:
            continue
        if st == "ok" and first == 1:
            continue
        row(dO, dT, T, bO, bT, S, opens)
        n += 1
    # long disagreement near the deadline (fallbacks above the surplus), then agreement
    for a in ((1 - 1e-7, 1 - 2e-7, 10 ** 9, 0.6, 0.6, 1.0, 1), (1 - 1e-7, 1 - 2e-7, 10 ** 9 + 1, 0.6, 0.6, 1.0, 0),
              (1 - 1e-9, 1 - 1e-9, 10 ** 12, 0.7, 0.5, 1.0, 1), (1 - 1e-6, 1 - 3e-6, 10 ** 7, 0.8, 0.4, 1.0, 0),
              (0.999, 0.9999, 10 ** 6, 0.9, 0.9, 100.0, 1), (1 - 1e-10, 1 - 1e-10, 10 ** 12, 0.9, 0.9, 1.0, 0),
              (1 - 1e-10, 1 - 1e-10, 10 ** 12 + 1, 0.9, 0.9, 1.0, 1), (0.5, 0.9, 10 ** 12, 2.0, 0.0, 1.0, 1)):
        row(*a)
    # a share below 1e-6 of the surplus (issue 10): the last proposer takes (nearly) all,
    # so the other, proposing first, keeps S (1 - d) or a little more
    row(0.11440739460887106, 0.99999999, 2, 0.0, 0.0, 0.21397515719186358, 1, "; issue 10 case")
    for _ in range(12):
        T = RNG.choice([2, 3, 4, 6, 9])
        dN = 1.0 - logu(1e-13, 1e-7)
        dO, dT = (u(0.05, 0.95), dN) if T % 2 == 0 else (dN, u(0.05, 0.95))
        row(dO, dT, T, 0.0, 0.0, rsurplus(), 1, "; a share below 1e-6 of the surplus")
    # check values 23-32 of tests/cpp/test_published.cpp (15-digit values; the BI must reproduce them)
    published = [((0.9, 0.9, 1, 0.0, 0.0), 1.0), ((0.9, 0.9, 2, 0.0, 0.0), 0.1),
                 ((0.9, 0.9, 3, 0.0, 0.0), 0.91), ((0.9, 0.9, 4, 0.0, 0.0), 0.181),
                 ((0.9, 0.9, 10, 0.0, 0.0), 0.342800821), ((0.9, 0.9, 11, 0.0, 0.0), 0.6914792611),
                 ((0.95, 0.9, 5, 0.0, 0.0), 0.916525), ((0.95, 0.9, 6, 0.0, 0.0), 0.2586025),
                 ((0.9, 0.9, 3, 0.1, 0.2), 0.748), ((0.95, 0.9, 4, 0.1, 0.2), 0.26245)]
    for (dO, dT, T, bO, bT), want in published:
        r = row(dO, dT, T, bO, bT, 1.0, 1, "; check value of tests/cpp/test_published.cpp")
        assert r is not None and abs(r[1] - want) < 1e-14, (dO, dT, T, bO, bT, r, want)
    for a in ([0.9, 0.9, -1, 0.0, 0.0, 1.0, 1], [0.9, 0.9, 2.5, 0.0, 0.0, 1.0, 1],
              [0.9, NAN, 3, 0.0, 0.0, 1.0, 1], [0.9, 0.9, 3, 0.0, INF, 1.0, 1]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


# ================================================================ fixed costs
def fixed_cost_bi(cO, cT, S, own_opens, T):
    """Backward induction over T rounds with a fixed cost per round; shares in [0, S];
    after the last rejection both get 0.  Values in the money of the current round."""
    c = {0: M(cO), 1: M(cT)}
    pi = M(S)
    first = 0 if own_opens else 1
    v = {0: M(0), 1: M(0)}
    for k in range(T, 0, -1):
        X = first if k % 2 == 1 else 1 - first
        Y = 1 - X
        need = max(M(0), v[Y] - c[Y])   # the responder accepts at least its continuation
        keep = pi - need
        rej = v[X] - c[X]
        if keep >= rej and need <= pi:
            v = {X: keep, Y: need}
        else:
            v = {X: rej, Y: v[Y] - c[Y]}
    return v[0]


def gen_fixed_cost_share():
    fn = "fixed_cost_share"
    src = "BI over T and T+1 rounds (both last movers) agree; Rubinstein (1982) fixed-cost case; docs/models/complete-information.md s.2"
    n = 0
    while n < 110:
        S = RNG.choice([1.0, 1000.0, 1e-6, 1e9]) if RNG.random() < 0.5 else logu(1e-3, 1e6)
        cO, cT = u(0, 1.3) * S, u(0, 1.3) * S
        if RNG.random() < 0.2:
            cO = RNG.choice([0.0, S, 2 * S])
        if abs(cO - cT) < 2e-3 * S:
            continue
        if RNG.random() < 0.05:
            S = -S
        opens = RNG.randrange(2)
        if S <= 0:
            add(fn, [cO, cT, S, opens], "no_deal", [0.0], "surplus <= 0: no deal, payoff 0 (statuses in docs/reference/functions.md)")
            n += 1
            continue
        T = 2 * int(2 * S / abs(cO - cT)) + 11
        v1 = fixed_cost_bi(cO, cT, S, opens, T)
        v2 = fixed_cost_bi(cO, cT, S, opens, T + 1)
        if abs(v1 - v2) > mp.mpf(10) ** -40 * S:
            skip(fn, "BI with T and T+1 rounds differ", (cO, cT, S, v1, v2))
            continue
        add(fn, [cO, cT, S, opens], "ok", [v1], src.replace("T and", "T=%d and" % T))
        n += 1
    # equal costs: indeterminate below the surplus; at or above it the proposer takes all
    for a in ([0.1, 0.1, 1.0, 1], [0.1, 0.1, 1.0, 0], [0.0, 0.0, 1.0, 1]):
        add(fn, a, "indeterminate", [NAN], "equal costs below the surplus: any split in [c, S] (Rubinstein 1982; docs/models/complete-information.md s.2)")
    for a in ([1.5, 1.5, 1.0, 1], [1.5, 1.5, 1.0, 0], [0.2, 0.1, 1.0, 1], [0.1, 0.2, 1.0, 0],
              [20.0, 10.0, 1000.0, 1], [10.0, 20.0, 1000.0, 0]):
        cO, cT, S, op = a
        T = 2 * int(2 * S / abs(cO - cT)) + 11 if cO != cT else 11
        v1, v2 = fixed_cost_bi(cO, cT, S, op, T), fixed_cost_bi(cO, cT, S, op, T + 1)
        assert abs(v1 - v2) <= mp.mpf(10) ** -40 * S
        add(fn, a, "ok", [v1], src.replace("T and", "T=%d and" % T) + "; check values 15-20 of tests/cpp/test_published.cpp")
    for a in ([-0.1, 0.2, 1.0, 1], [0.1, NAN, 1.0, 1], [0.1, 0.2, INF, 1]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


# ================================================================ delay cost
def gen_delay_cost():
    fn = "delay_cost"
    src = ("stake minus the expected value of the deal one round later, (1-p) d stake + p fallback, "
           "at 50 digits; docs/models/complete-information.md s.4 (delay cost) and its timing")
    for i in range(110):
        f = rfactor()
        stake = rsurplus() * RNG.choice([1, 1, 1, -1])
        p = 0.0 if RNG.random() < 0.3 else u(0, 1)
        fb = 0.0 if RNG.random() < 0.3 else u(-1, 1.2) * stake
        if i < 8:
            f, stake, p, fb = [(0.8, 1.0, 0.0, 0.0), (1.0, 5.0, 0.0, 0.0), (0.0, 5.0, 0.0, 0.0),
                               (1.0, 1.0, 1.0, 1.0), (0.9999999999, 1e12, 0.0, 0.0),
                               (0.95, 100.0, 0.1, 100.0), (0.9, 0.0, 0.5, -2.0), (1.0, 1.0, 0.25, 0.5)][i]
        E = (1 - M(p)) * M(f) * M(stake) + M(p) * M(fb)
        add(fn, [f, stake, p, fb], "ok", [M(stake) - E], src)
    for a in ([1.2, 1.0, 0.0, 0.0], [0.9, NAN, 0.0, 0.0], [0.9, 1.0, -0.5, 0.0], [0.9, 1.0, 0.1, INF]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


# ================================================================ Nash bargaining
def nash_reference(bo, bt, tau, S, ao, at):
    """Maximiser of tau log(u_o(x) - u_o(b_o)) + (1-tau) log(u_t(S-x) - u_t(b_t)),
    u(x) = x^a, by bisection on the derivative (strictly decreasing on (b_o, S - b_t))."""
    with mp.workdps(90):
        bo, bt, tau, S, ao, at = M(bo), M(bt), M(tau), M(S), M(ao), M(at)
        if tau == 0:
            return bo
        if tau == 1:
            return S - bt

        def dL(x):
            y = S - x
            return (tau * ao * mp.power(x, ao - 1) / (mp.power(x, ao) - mp.power(bo, ao)) if ao != 1 else tau / (x - bo)) - \
                   ((1 - tau) * at * mp.power(y, at - 1) / (mp.power(y, at) - mp.power(bt, at)) if at != 1 else (1 - tau) / (y - bt))
        lo, hi = bo, S - bt
        for _ in range(330):
            mid = (lo + hi) / 2
            if mid == lo or mid == hi:
                break
            if dL(mid) > 0:
                lo = mid
            else:
                hi = mid
        return +((lo + hi) / 2)


def gen_nash_share():
    fn = "nash_share"
    src = "bisection on the derivative of the log Nash product, 90 digits; Nash (1950); Kalai (1977); Muthoo (1999) ch.2"
    n = 0
    while n < 130:
        S = rsurplus()
        curved = RNG.random() < 0.6
        ao = (RNG.choice([1.0, 0.5, 0.25]) if RNG.random() < 0.3 else u(0.05, 1.0)) if curved else 1.0
        at = (RNG.choice([1.0, 0.5, 0.8]) if RNG.random() < 0.3 else u(0.05, 1.0)) if curved else 1.0
        lo_b = 0.0 if (ao < 1 or at < 1) else -0.5
        if RNG.random() < 0.3:
            bo, bt = 0.0, 0.0
        else:
            bo, bt = u(lo_b, 0.45) * S, u(lo_b, 0.45) * S
        tau = RNG.choice([0.5, 0.0, 1.0, 1 / 3]) if RNG.random() < 0.2 else u(0, 1)
        if RNG.random() < 0.08:
            bo, bt = u(0.4, 0.8) * S, u(0.4, 0.8) * S
        if S <= bo + bt:
            add(fn, [bo, bt, tau, S, ao, at], "no_deal", [bo], "S <= b_o + b_t: no deal, payoff b_o (docs/models/complete-information.md s.8)")
        else:
            add(fn, [bo, bt, tau, S, ao, at], "ok", [nash_reference(bo, bt, tau, S, ao, at)], src)
        n += 1
    for a in ([0.1, 0.2, 0.5, 1.0, 1.0, 1.0], [0.1, 0.2, 0.3, 1.0, 1.0, 1.0], [0.0, 0.0, 0.5, 1.0, 0.5, 1.0],
              [0.1, 0.2, 0.5, 1.0, 0.5, 1.0]):
        add(fn, a, "ok", [nash_reference(*a)], src + "; check values 54-57 of tests/cpp/test_published.cpp")
    for a in ([-0.1, 0.2, 0.5, 1.0, 0.5, 1.0], [0.1, 0.2, 1.5, 1.0, 1.0, 1.0], [0.1, 0.2, 0.5, 1.0, 0.0, 1.0],
              [0.1, 0.2, 0.5, 1.0, 1.5, 1.0], [NAN, 0.2, 0.5, 1.0, 1.0, 1.0]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


# ================================================================ risk-averse alternating offers
class Util:
    def __init__(self, kind, c):
        self.kind, self.c = kind, M(c)

    def u(self, x):
        if self.kind == 0:
            if x < 0:
                raise ValueError("power utility of a negative amount")
            return mp.power(x, self.c)
        return -mp.expm1(-self.c * x) / self.c

    def inv(self, v):
        if self.kind == 0:
            if v < 0:
                raise ValueError("negative utility")
            return mp.power(v, 1 / self.c)
        t = self.c * v
        if t >= 1:
            raise ValueError("utility above the bound 1/k")
        return -mp.log1p(-t) / self.c


def risk_averse_reference(dA, dB, uA, uB, p, bA, bB, S):
    """Root of the stationary conditions by bisection on h(x) = x - G(x):
    y(x) = S - u_A^-1(p u_A(b_A) + (1-p) d_A u_A(x)),
    G(x) = S - u_B^-1(p u_B(b_B) + (1-p) d_B u_B(y(x))).  Returns (x, y)."""
    with mp.workdps(90):
        dA, dB, p, bA, bB, S = M(dA), M(dB), M(p), M(bA), M(bB), M(S)

        def y_of(x):
            return S - uA.inv(p * uA.u(bA) + (1 - p) * dA * uA.u(x))

        def h(x):
            try:
                y = y_of(x)
            except ValueError:
                return 1
            try:
                g = S - uB.inv(p * uB.u(bB) + (1 - p) * dB * uB.u(y))
            except ValueError:
                return 1 if uB.kind == 0 else -1
            return x - g
        if uA.kind == 0:
            lo, hi = mp.mpf(0), S
        else:
            lo, hi = -abs(S) - 1, abs(S) + 1
            while h(lo) > 0:
                lo *= 2
            while h(hi) < 0:
                hi *= 2
        assert h(lo) <= 0 <= h(hi)
        for _ in range(400):
            mid = (lo + hi) / 2
            if mid == lo or mid == hi:
                break
            if h(mid) < 0:
                lo = mid
            else:
                hi = mid
        x = (lo + hi) / 2
        return +x, +y_of(x)


def gen_risk_averse_share():
    fn = "risk_averse_share"
    src = "root of the stationary conditions by bisection, 90 digits; BRW (1986); Muthoo (1999) chs.3-4; docs/models/complete-information.md s.8"
    n = 0
    while n < 150:
        util = RNG.randrange(2)
        dO, dT = rfactor(near1=0.1), rfactor(near1=0.1)
        if RNG.random() < 0.1:
            dO, dT = near_one_factor(), near_one_factor()
        if dO == 1.0 and dT == 1.0:
            continue
        if util == 0:
            cO = RNG.choice([1.0, 0.5]) if RNG.random() < 0.2 else u(0.1, 1.0)
            cT = RNG.choice([1.0, 0.5]) if RNG.random() < 0.2 else u(0.1, 1.0)
            S = rsurplus()
        else:
            cO, cT = logu(0.05, 5.0), logu(0.05, 5.0)
            S = logu(1e-3, 3.0) if RNG.random() < 0.8 else 1.0
        p = 0.0 if RNG.random() < 0.4 else u(0, 1)
        if p > 0:
            lo_b = 0.0 if util == 0 else -0.3
            bO, bT = u(lo_b, 0.45) * S, u(lo_b, 0.45) * S
        else:
            bO, bT = 0.0, 0.0
        opens = RNG.randrange(2)
        UO, UT = Util(util, cO), Util(util, cT)
        with mp.workdps(90):
            def ce(U, d, b):
                al = (1 - M(p)) * M(d)
                if M(p) == 0:
                    return M(0)
                return U.inv(M(p) * U.u(M(b)) / (1 - al))
            cOw, cTw = ce(UO, dO, bO), ce(UT, dT, bT)
        if M(S) <= cOw + cTw:
            add(fn, [dO, dT, cO, cT, util, p, bO, bT, S, opens], "no_deal", [+cOw],
                "S <= c_own + c_oth: no deal, payoff own's certainty equivalent of waiting (header definition)")
            n += 1
            continue
        if opens:
            x, y = risk_averse_reference(dO, dT, UO, UT, p, bO, bT, S)
            v = x
        else:
            x, y = risk_averse_reference(dT, dO, UT, UO, p, bT, bO, S)
            v = M(S) - x
        add(fn, [dO, dT, cO, cT, util, p, bO, bT, S, opens], "ok", [v], src)
        n += 1
    # check values 58 and 59 of tests/cpp/test_published.cpp
    d1, d2 = math.exp(-0.1), math.exp(-0.05)
    for a in ([0.9, 0.9, 0.5, 1.0, 0, 0.0, 0.0, 0.0, 1.0, 1], [d1, d2, 2.0, 0.5, 1, 0.0, 0.0, 0.0, 1.0, 1]):
        x, y = risk_averse_reference(a[0], a[1], Util(a[4], a[2]), Util(a[4], a[3]), a[5], a[6], a[7], a[8])
        add(fn, a, "ok", [x], src + "; check values 58-59 of tests/cpp/test_published.cpp")
    for op in (0, 1):
        add(fn, [1.0, 1.0, 0.5, 0.5, 0, 0.0, 0.0, 0.0, 1.0, op], "indeterminate", [NAN], "p = 0 and both factors 1 (docs/models/complete-information.md s.4 edge cases)")
    for a in ([0.9, 0.9, 1.5, 0.5, 0, 0.0, 0.0, 0.0, 1.0, 1], [0.9, 0.9, 0.5, 0.5, 2, 0.0, 0.0, 0.0, 1.0, 1],
              [0.9, 0.9, 0.5, 0.5, 0, 0.5, -0.1, 0.0, 1.0, 1], [0.9, 0.9, 0.0, 0.5, 1, 0.0, 0.0, 0.0, 1.0, 1],
              [0.9, 0.9, 0.5, NAN, 0, 0.0, 0.0, 0.0, 1.0, 1]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


# ================================================================ more than two parties
def geometric_sum(d, n):
    """sum_{j<n} d^j by binary doubling (no closed form): s(2m) = s(m)(1 + d^m)."""
    s, pw = mp.mpf(0), mp.mpf(1)      # s = sum_{j<m} d^j, pw = d^m, for the bits so far
    for bit in bin(n)[2:]:
        s, pw = s * (1 + pw), pw * pw                  # m -> 2m
        if bit == "1":
            s, pw = s + pw, pw * d                      # 2m -> 2m+1
    return s


def group_bi(d, n, S, T):
    """BI over T rounds of n-party unanimity bargaining (the proposer offers each responder
    d times its value next round; after the last round everyone gets 0).  z_t is the
    proposer's value in round t; a responder k places after the proposer gets d^k z_{t+k}
    along the chain.  Returns the value of each position in round 1."""
    z = [mp.mpf(0)] * n     # z[j]: proposer value j+1 rounds later (0 beyond T)
    for _ in range(T):
        # responder k (1..n-1) proposes k rounds later; its value now, by the chain of
        # acceptances, is d^k times the value then
        pay = sum(mp.power(d, k) * z[k - 1] for k in range(1, n))
        znew = S - pay
        z = [znew] + z[:-1]
    return [z[0]] + [mp.power(d, k) * z[k - 1] for k in range(1, n)]


def gen_group_share():
    fn = "group_share"
    srcs = "Herrero (1985); Sutton (1986); Osborne & Rubinstein (1990) s.3.13"
    n_rows = 0
    while n_rows < 110:
        d = rfactor()
        n = RNG.choice([1, 2, 3, 4, 5, 7, 10]) if RNG.random() < 0.7 else RNG.choice([25, 100, 1000, 10 ** 6, 10 ** 12, 2 ** 62])
        k = RNG.randrange(n) if n < 100 else RNG.choice([0, 1, n - 1, n // 2])
        if float(k) != k:
            k = n - 1024   # counts must be exact doubles (cto_call takes doubles)
        S = rsurplus()
        if RNG.random() < 0.04:
            S = -S
        if S <= 0:
            add(fn, [d, n, k, S], "no_deal", [0.0], "surplus <= 0: no deal, payoff 0 (statuses in docs/reference/functions.md)")
            n_rows += 1
            continue
        if d == 1.0 and n >= 2:
            add(fn, [d, n, k, S], "indeterminate", [NAN], "d = 1 and n >= 2: stationary shares undefined (header)")
            n_rows += 1
            continue
        with mp.workdps(90):
            dd = M(d)
            if n <= 10 and d <= 0.97:
                T = int(mp.ceil(110 / -mp.log(dd))) + 1 if d > 0 else 2
                T = max(T, 3 * n)
                vals = group_bi(dd, n, M(S), T)
                v = vals[k]
                method = "BI T=%d" % T
            else:
                w0 = M(S) / geometric_sum(dd, n)
                v = w0 * mp.power(dd, k) if not (d == 0 and k == 0) else w0
                method = "stationary linear system w_k = d^k w_0, sum w = S (geometric sum by binary doubling)"
        add(fn, [d, n, k, S], "ok", [+v], method + "; " + srcs)
        n_rows += 1
    for d, n, k in ((1 - 1e-12, 10 ** 12, 0), (1 - 1e-12, 10 ** 12, 10 ** 12 - 1), (1 - 1e-9, 3, 2),
                    (0.9999999999999999, 2, 1), (1 - 1e-6, 10 ** 6, 500000), (0.2384073987281925, 25, 13), (0.09788532699269115, 25, 14), (0.5, 100, 99),
                    (0.3, 1000, 600), (0.999, 1000, 999), (0.01, 60, 59), (0.75, 2 ** 53, 2 ** 52)):
        with mp.workdps(90):
            v = M(1.0) / geometric_sum(M(d), n) * mp.power(M(d), k)
        add(fn, [d, n, k, 1.0], "ok", [+v], "stationary linear system w_k = d^k w_0, sum w = S "
            "(geometric sum by binary doubling), far positions; " + srcs)
    for a in ([0.9, 3, 0, 1.0], [0.9, 3, 2, 1.0], [0.95, 5, 0, 1.0], [0.95, 5, 4, 1.0], [0.9, 1, 0, 7.0],
              [0.0, 4, 0, 1.0], [0.0, 4, 3, 1.0]):
        d, n, k, S = a
        with mp.workdps(90):
            vals = group_bi(M(d), n, M(S), 3000 * n + 1 if n <= 5 else 20)
        add(fn, a, "ok", [+vals[k]], "BI T=%d; " % (3000 * n + 1 if n <= 5 else 20) + srcs + "; check values 61-64 of tests/cpp/test_published.cpp")
    for a in ([0.9, 0, 0, 1.0], [0.9, 3, 3, 1.0], [0.9, 3, -1, 1.0], [1.1, 3, 0, 1.0], [0.9, 2.5, 0, 1.0]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


def gen_majority_share():
    fn = "majority_share"
    src = ("value iteration of the stationary equilibrium (ex-ante value v; proposer buys the q-1 "
           "cheapest votes at d v), 50 digits; Baron & Ferejohn (1989)")
    n_rows = 0
    while n_rows < 110:
        d = rfactor()
        n = RNG.choice([1, 2, 3, 5, 7, 9, 100, 101, 435]) if RNG.random() < 0.8 else RNG.choice([10 ** 6, 10 ** 9])
        qv = RNG.choice([0, 0, RNG.randrange(1, n + 1), n])
        q = n // 2 + 1 if qv == 0 else qv
        role = RNG.randrange(2)
        if role == 1 and q < 2:
            role = 0
        S = rsurplus()
        if RNG.random() < 0.04:
            S = -S
        if S <= 0:
            add(fn, [d, n, qv, role, S], "no_deal", [0.0], "surplus <= 0: no deal, payoff 0")
            n_rows += 1
            continue
        dd, SS = M(d), M(S)
        v = mp.mpf(0)
        for _ in range(60):   # v' = (1/n)(S - (q-1) d v) + ((q-1)/n) d v
            v = (SS - (q - 1) * dd * v) / n + M(q - 1) / n * dd * v
        val = SS - (q - 1) * dd * v if role == 0 else dd * v
        add(fn, [d, n, qv, role, S], "ok", [val], src)
        n_rows += 1
    for a in ([0.9, 5, 3, 0, 1.0], [0.9, 5, 3, 1, 1.0], [0.95, 101, 51, 0, 1.0], [0.95, 101, 51, 1, 1.0],
              [0.9, 5, 5, 0, 1.0]):
        d, n, q, role, S = a
        v = mp.mpf(S) / n
        add(fn, a, "ok", [M(S) - (q - 1) * M(d) * v if role == 0 else M(d) * v], src + "; check values 65-70 of tests/cpp/test_published.cpp")
    for a in ([0.9, 5, 6, 0, 1.0], [0.9, 5, 1, 1, 1.0], [0.9, 0, 0, 0, 1.0], [0.9, 5, 3, 2, 1.0],
              [NAN, 5, 3, 0, 1.0], [0.9, 5, -1, 0, 1.0]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


# ================================================================ inverse problems and sensitivities
def rub_share(dO, dT, opens):
    """The forward model: Rubinstein's share (surplus 1)."""
    return (1 - dT) / (1 - dO * dT) if opens else dO * (1 - dT) / (1 - dO * dT)


def implied_factor_root(s, dT, opens):
    """Own's factor with rub_share(d, d_oth) = s by bisection on [0, 1] (the share rises
    with own's factor), or None when s is not reachable."""
    with mp.workdps(90):
        sM, dTM = M(s), M(dT)
        f = lambda d: rub_share(d, dTM, opens) - sM   # noqa: E731
        lo, hi = mp.mpf(0), mp.mpf(1)
        if f(lo) > 0 or (dTM < 1 and f(hi) < 0):
            return None
        for _ in range(330):
            mid = (lo + hi) / 2
            if f(mid) < 0:
                lo = mid
            else:
                hi = mid
        return +((lo + hi) / 2)


def gen_implied_factor():
    fn = "implied_factor"
    src = "bisection on own's factor in the forward model (Rubinstein share), 90 digits; Rubinstein (1982)"
    n = 0
    while n < 110:
        dtrue, dT = rfactor(), rfactor()
        if dT == 1.0 or dT == 0.0:
            continue
        opens = RNG.randrange(2)
        with mp.workdps(90):
            s = float(rub_share(M(dtrue), M(dT), opens))
        v = implied_factor_root(s, dT, opens)
        if v is None:
            continue
        add(fn, [s, dT, opens], "ok", [v], src)
        n += 1
    for a in ([1.0, 0.9, 1], [0.1, 0.9, 1], [0.0, 0.9, 0], [1.0, 0.9, 0], [0.5, 0.5, 1], [0.25, 0.5, 0],
              [0.5, 0.0, 0], [0.3, 0.9999999999, 1], [0.7, 1e-9, 0]):
        v = implied_factor_root(*a)
        add(fn, a, "ok", [v], src + "; boundary and round cases")
    add(fn, [1.0, 0.0, 1], "indeterminate", [NAN], "other_factor 0, own opens: the share is 1 for every factor (header)")
    add(fn, [0.0, 1.0, 0], "indeterminate", [NAN], "other_factor 1, other opens: the share is 0 for every factor (header)")
    add(fn, [0.0, 1.0, 1], "indeterminate", [NAN], "other_factor 1, own opens: the share is 0 for every factor below 1 (forward model)")
    add(fn, [0.5, 1.0, 1], "invalid", [NAN], "other_factor 1, own opens: only the share 0 is reachable (forward model)")
    for a in ([1.2, 0.9, 1], [0.5, NAN, 1], [0.5, 0.9, 3], [0.5, 0.0, 1], [0.05, 0.9, 1]):
        add(fn, a, "invalid", [NAN], "not reachable or out of domain (header)")


def share_rates_mp(rO, rT, days, S, opens, basis, cont):
    """Forward model share_from_rates at the working precision (rates as mpf)."""
    t = M(days) / M(basis)
    cO = rO if cont else mp.log1p(rO)
    cT = rT if cont else mp.log1p(rT)
    a, b = cO * t, cT * t
    if opens:
        return M(S) * mp.expm1(-b) / mp.expm1(-(a + b))
    return M(S) * mp.exp(-a) * mp.expm1(-b) / mp.expm1(-(a + b))


def gen_implied_rate():
    fn = "implied_rate"
    src = "bisection on own's rate in the forward model (Rubinstein share from rates), 90 digits; Rubinstein (1982); Muthoo (1999) s.3.2"
    n = 0
    while n < 110:
        rtrue, rT, days = rrate(), rrate(), rdays()
        if rT == 0:
            continue
        if rtrue > 2:
            rtrue = u(0, 0.5)
        opens, basis, cont = RNG.randrange(2), RNG.choice([365.0, 360.0]), RNG.randrange(2)
        with mp.workdps(90):
            s = float(share_rates_mp(M(rtrue), M(rT), days, 1.0, opens, basis, cont))
            if not (0 < s < 1):
                continue
            sM = M(s)
            f = lambda r: share_rates_mp(r, M(rT), days, 1.0, opens, basis, cont) - sM   # noqa: E731
            # own's share falls with own's rate
            if f(mp.mpf(0)) < 0:
                continue
            lo, hi = mp.mpf(0), mp.mpf(1)
            while f(hi) > 0:
                hi *= 2
                if hi > 1e6:
                    break
            if hi > 1e6:
                continue
            for _ in range(360):
                mid = (lo + hi) / 2
                if f(mid) > 0:
                    lo = mid
                else:
                    hi = mid
            v = (lo + hi) / 2
        add(fn, [s, rT, days, opens, basis, cont], "ok", [+v], src)
        n += 1
    add(fn, [0.5, 0.05, 0.0, 1, 365.0, 0], "indeterminate", [NAN], "days = 0 (header)")
    for op in (0, 1):
        add(fn, [1.0, 0.05, 30.0, op, 365.0, 0], "ok", [0.0], "forward model: the share 1 needs own rate 0; Rubinstein (1982)")
    for a in ([1.5, 0.05, 30.0, 1, 365.0, 0], [0.5, -0.05, 30.0, 1, 365.0, 0], [0.5, 0.05, 30.0, 1, 0.0, 0],
              [NAN, 0.05, 30.0, 1, 365.0, 0]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


def gen_share_sensitivity():
    fn = "share_sensitivity"
    src = "mp.diff of the forward model (share from rates) at 50 digits; Rubinstein (1982); Muthoo (1999) s.3.2"
    n = 0
    while n < 110:
        rO, rT, days = rrate(), rrate(), rdays()
        if rO == 0 and rT == 0:
            continue
        wrt, opens, cont = RNG.randrange(2), RNG.randrange(2), RNG.randrange(2)
        basis = RNG.choice([365.0, 360.0, 365.25])
        S = rsurplus()
        if wrt == 0:
            g = lambda r: share_rates_mp(r, M(rT), days, S, opens, basis, cont)   # noqa: E731
            v = mp.diff(g, M(rO))
        else:
            g = lambda r: share_rates_mp(M(rO), r, days, S, opens, basis, cont)   # noqa: E731
            v = mp.diff(g, M(rT))
        # mp.diff resolves a derivative to about 1e-50 x surplus: below 1e-40 x surplus it
        # is 0 (e.g. the share does not depend on other's rate when own's rate is 0)
        add(fn, [rO, rT, days, wrt, S, opens, basis, cont], "ok", [snap(v, abs(M(S)))], src)
        n += 1
    for op in (0, 1):
        add(fn, [0.0, 0.0, 30.0, 0, 1.0, op, 365.0, 0], "indeterminate", [NAN], "both rates 0 (as share_from_rates)")
    for a in ([0.1, 0.05, 30.0, 2, 1.0, 1, 365.0, 0], [-0.1, 0.05, 30.0, 0, 1.0, 1, 365.0, 0],
              [0.1, 0.05, NAN, 0, 1.0, 1, 365.0, 0]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


# ================================================================ screening
def screening_profit_of_price(p1, vH, vL, q, ds, db):
    """Seller's profit for a first price p1 with the equilibrium continuation (double
    precision, for the grid check): the buyer types' best responses and the seller's
    period-2 price given the posterior (Fudenberg & Tirole 1983 setting; docs/models/complete-information.md s.12)."""
    qh = vL / vH
    if p1 <= vL:
        return p1                                    # both types buy at once
    ps = (1 - db) * vH + db * vL
    if p1 <= ps:
        return q * p1 + (1 - q) * ds * vL            # high buys now, low at vL later
    if q > qh and p1 <= vH:
        beta = (q - qh) / (q * (1 - qh))             # high buys with prob beta, posterior = qh
        return q * beta * p1 + ds * (1 - q * beta) * vL
    return ds * vL                                   # nobody buys now; vL in period 2


def gen_screening_profit():
    fn = "screening_profit"
    src = ("max over the three candidate strategies (pool, screen, skim) at 50 digits, confirmed by "
           "a grid search over the first price with equilibrium continuation (tolerance 2e-4 v_H); "
           "Fudenberg & Tirole (1983) setting; docs/models/complete-information.md s.12")
    for i in range(110):
        vH = rsurplus()
        vL = vH * (u(0.05, 1.0) if RNG.random() < 0.95 else 1.0)
        q = RNG.choice([0.0, 1.0, 0.3, 0.45, 0.8]) if RNG.random() < 0.15 else u(0, 1)
        ds, db = rfactor(), rfactor()
        if i < 3:
            vH, vL, q, ds, db = [(1.0, 0.5, 0.3, 0.9, 0.8), (1.0, 0.5, 0.45, 0.9, 0.8), (1.0, 0.5, 0.8, 0.9, 0.8)][i]
        H, L, Q, DS, DB = M(vH), M(vL), M(q), M(ds), M(db)
        cands = [L, Q * ((1 - DB) * H + DB * L) + (1 - Q) * DS * L]
        if Q > L / H:
            cands.append(H * ((Q * H - L) + DS * (1 - Q) * L) / (H - L))
        best = max(cands)
        grid = max(screening_profit_of_price(vL + (vH - vL) * j / 5000, vH, vL, q, ds, db) for j in range(5001))
        ps = (1 - db) * vH + db * vL
        grid = max(grid, screening_profit_of_price(ps, vH, vL, q, ds, db))
        assert float(best) >= grid - 1e-12 * vH and float(best) - grid <= 2e-4 * vH, (vH, vL, q, ds, db, best, grid)
        add(fn, [vH, vL, q, ds, db], "ok", [best], src)
    for a in ([0.5, 1.0, 0.5, 0.9, 0.9], [1.0, 0.0, 0.5, 0.9, 0.9], [1.0, 0.5, 1.5, 0.9, 0.9],
              [1.0, 0.5, 0.5, NAN, 0.9], [1.0, -0.5, 0.5, 0.9, 0.9]):
        add(fn, a, "invalid", [NAN], "domain rule (docs/reference/functions.md bad-input rules)")


# ================================================================ published check values
# The check values: 50-digit mpmath values, each confirmed by an independent method
# (backward induction over a long game, root finding, numerical maximisation with scipy,
# a grid search) and written to 15 significant digits, numbered 9 to 84; the library is
# checked against every one of them in tests/cpp/test_published.cpp, which names each
# number.  The generator's own methods must reproduce those that fall in its tables.
# (function, arguments, value, relative tolerance, check value number)
PUBLISHED = [
    ("share", [0.5, 0.5, 1.0, 1], 0.666666666666667, 1e-14, 9),
    ("share_from_rates", [0.1, 0.05, 365.0, 1.0, 1, 365.0, 1], 0.350131861448953, 1e-14, 10),
    ("share_from_rates", [0.1, 0.05, 36.5, 1.0, 1, 365.0, 1], 0.335001381935802, 1e-14, 11),
    ("limit_share", [0.1, 0.05, 1.0], 0.333333333333333, 1e-14, 12),
    ("share_from_rates", [0.1, 0.1, 365.0, 1.0, 1, 365.0, 1], 0.524979187478940, 1e-14, 13),
    ("share", [0.95, 0.9, 1.0, 1], 0.689655172413793, 1e-14, 14),
    ("fixed_cost_share", [0.2, 0.1, 1.0, 1], 0.1, 1e-14, 17),
    ("fixed_cost_share", [0.1, 0.2, 1.0, 0], 0.9, 1e-14, 16),
    ("fixed_cost_share", [20.0, 10.0, 1000.0, 1], 10.0, 1e-14, 19),
    ("fixed_cost_share", [10.0, 20.0, 1000.0, 0], 990.0, 1e-14, 20),
    ("breakdown_share", [1.0, 1.0, 0.1, 0.2, 0.1, 1.0, 1], 0.568421052631579, 1e-14, 33),
    ("breakdown_share", [1.0, 1.0, 1.0, 0.2, 0.1, 1.0, 1], 0.9, 1e-14, 35),
    ("breakdown_share", [0.95, 0.9, 0.05, 0.2, 0.1, 1.0, 1], 0.650500848431770, 1e-14, 36),
    ("breakdown_share", [1.0, 1.0, 1e-12, 0.2, 0.1, 1.0, 1], 0.550000000000175, 1e-14, 82),
    ("outside_option_share", [0.9, 0.9, 0.0, 0.3, 1.0, 1], 0.526315789473684, 1e-14, 40),
    ("outside_option_share", [0.9, 0.9, 0.0, 0.5, 1.0, 1], 0.5, 1e-14, 42),
    ("outside_option_share", [0.9, 0.9, 0.5, 0.0, 1.0, 1], 0.55, 1e-14, 44),
    ("outside_option_share", [0.5, 0.5, 0.4, 0.4, 1.0, 1], 0.6, 1e-14, 46),
    ("outside_option_share", [0.95, 0.9, 0.2, 0.45, 1.0, 1], 0.55, 1e-14, 48),
    ("outside_option_share", [0.9, 0.95, 0.45, 0.2, 1.0, 0], 0.45, 1e-14, 48),
    ("outside_option_share", [0.9, 0.9, 0.0, 0.9 / 1.9, 1.0, 1], 0.526315789473684, 1e-14, 50),
    ("outside_option_share", [0.9, 0.9, 0.6, 0.5, 1.0, 1], 0.6, 1e-14, 83),
    ("inside_option_share", [0.9, 0.9, 0.1, 0.3, 1.0, 1], 0.415789473684211, 1e-14, 51),
    ("nash_share", [0.1, 0.2, 0.5, 1.0, 1.0, 1.0], 0.45, 1e-14, 54),
    ("nash_share", [0.1, 0.2, 0.3, 1.0, 1.0, 1.0], 0.31, 1e-14, 55),
    ("nash_share", [0.0, 0.0, 0.5, 1.0, 0.5, 1.0], 0.333333333333333, 1e-14, 56),
    ("nash_share", [0.1, 0.2, 0.5, 1.0, 0.5, 1.0], 0.4, 1e-14, 57),
    ("risk_averse_share", [0.9, 0.9, 0.5, 1.0, 0, 0.0, 0.0, 0.0, 1.0, 1], 0.369003690036900, 1e-14, 58),
    ("risk_averse_share", [math.exp(-0.1), math.exp(-0.05), 2.0, 0.5, 1, 0.0, 0.0, 0.0, 1.0, 1], 0.324276325976081, 1e-14, 59),
    ("group_share", [0.9, 3, 0, 1.0], 0.369003690036900, 1e-14, 61),
    ("group_share", [0.9, 3, 2, 1.0], 0.298892988929889, 1e-14, 62),
    ("group_share", [0.95, 5, 0, 1.0], 0.221024698128612, 1e-14, 63),
    ("group_share", [0.95, 5, 4, 1.0], 0.180025998030117, 1e-14, 64),
    ("majority_share", [0.9, 5, 3, 0, 1.0], 0.64, 1e-14, 65),
    ("majority_share", [0.9, 5, 3, 1, 1.0], 0.18, 1e-14, 66),
    ("majority_share", [0.95, 101, 51, 0, 1.0], 0.529702970297030, 1e-14, 67),
    ("majority_share", [0.95, 101, 51, 1, 1.0], 0.00940594059405941, 1e-14, 68),
    ("majority_share", [0.9, 5, 5, 0, 1.0], 0.28, 1e-14, 69),
    ("screening_profit", [1.0, 0.5, 0.3, 0.9, 0.8], 0.5, 1e-14, 73),
    ("screening_profit", [1.0, 0.5, 0.45, 0.9, 0.8], 0.5175, 1e-14, 71),
    ("screening_profit", [1.0, 0.5, 0.8, 0.9, 0.8], 0.78, 1e-14, 72),
    ("first_mover_advantage", [0.8, 0.8, 1.0], 0.111111111111111, 1e-14, "complete-information.md s.10 example"),
    # the factors exp(-r/12) are rounded to doubles: 1e-13 covers that rounding
    ("first_mover_advantage", [math.exp(-0.1 / 12), math.exp(-0.05 / 12), 1000.0], 2.77776974025657, 1e-13, 78),
    ("share", [1.0, 0.9, 1.0, 1], 1.0, 1e-14, 79),
    ("share", [0.9, 1.0, 1.0, 1], 0.0, 1e-14, 80),
    ("share", [0.0, 0.0, 1.0, 1], 1.0, 1e-14, 81),
]


def check_published():
    for fn, args, want, tol, ref in PUBLISHED:
        if not ROWS[fn]:
            continue   # a partial run
        hits = [r for r in ROWS[fn] if r[0] == args and r[1] in ("ok", "no_deal")]
        assert hits, ("published row missing", fn, args)
        got = mp.mpf(hits[0][2][0])
        assert abs(got - want) <= tol * max(abs(mp.mpf(want)), mp.mpf(1)), (fn, args, got, want, ref)
    print("published check values reproduced: %d (tests/cpp/test_published.cpp)" % len(PUBLISHED))


# ================================================================ main
def write_tables(only=()):
    total = 0
    for fn, rows in ROWS.items():
        if only and fn not in only:
            continue   # a partial run leaves the other tables alone
        outs = SOLVE_OUTPUTS if fn in ("solve", "solve_from_rates") else ["value"]
        path = os.path.join(OUT, fn + ".csv")
        with open(path, "w", newline="") as fh:
            w = csv.writer(fh, lineterminator="\n")
            w.writerow(ARGS[fn] + ["status"] + outs + ["source"])
            for args, status, vals, source in rows:
                if status in ("invalid",):
                    vals = [NAN] * len(outs)
                assert len(vals) == len(outs), (fn, vals)
                w.writerow([fmt_in(a) for a in args] + [status] + [fmt_out(v) for v in vals] + [source])
        total += len(rows)
        print("%-22s %5d rows" % (fn, len(rows)))
    print("total %d rows" % total)
    return total


def main():
    t0 = time.time()
    gens = [gen_round_factor, gen_share, gen_share_from_rates, gen_limit_share, gen_breakdown_share,
            gen_outside_option_share, gen_inside_option_share, gen_solve, gen_deadline_share,
            gen_fixed_cost_share, gen_delay_cost, gen_first_mover_advantage, gen_nash_share,
            gen_risk_averse_share, gen_group_share, gen_majority_share, gen_implied_factor,
            gen_implied_rate, gen_share_sensitivity, gen_screening_profit, gen_solve_from_rates]
    only = set(sys.argv[1:])
    for g in gens:
        t = time.time()
        if only and g.__name__[4:] not in only:
            continue
        g()
        print("  %s: %.1f s" % (g.__name__, time.time() - t), file=sys.stderr)
    check_published()
    total = write_tables(only)
    for fn, items in SKIPPED.items():
        print("skipped draws in %s: %d (%s)" % (fn, len(items), "; ".join(sorted(set(r for r, _ in items)))))
    for fn, c in NOTES.items():
        print("%s: %s" % (fn, ", ".join("%s=%d" % kv for kv in sorted(c.items()))))
    print("%.0f s" % (time.time() - t0))
    if not only:
        assert total >= 2000, total


if __name__ == "__main__":
    main()
