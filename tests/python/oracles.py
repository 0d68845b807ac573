"""Reference computations written in the tests, shared by the Python tests and the
sample-sheet tests (tests/samples): independent of the library's code paths."""

import math


def stationary_shares(S, dA, dB, p=0.0, bA=0.0, bB=0.0, gA=0.0, gB=0.0, wA=-math.inf,
                      wB=-math.inf, rounds=200_000):
    """Backward induction of the combined model (docs/models/combined.md, 'solve'), from far in
    the future: a responder compares the offer with max(w, p b + (1-p)((1-d) g + d y))
    (BRW 1986; Shaked & Sutton 1984; Muthoo 1999 chs. 4-6).  The map is a contraction
    with modulus (1-p)^2 d_A d_B, iterated to its fixed point (at most `rounds` times).
    Returns (x, y): A's share when A proposes, B's share when B proposes."""
    x = y = 0.0
    for _ in range(rounds):
        x_new = S - max(wB, p * bB + (1 - p) * ((1 - dB) * gB + dB * y))
        y_new = S - max(wA, p * bA + (1 - p) * ((1 - dA) * gA + dA * x))
        if x_new == x and y_new == y:
            break
        x, y = x_new, y_new
    return x, y


def game_outcome(S, dA, dB, p=0.0, bA=0.0, bB=0.0, gA=0.0, gB=0.0, wA=-math.inf,
                 wB=-math.inf, rounds=200_001):
    """Backward induction over the finite game of the combined model, A opening, from
    its rules (docs/models/combined.md; Rubinstein 1982; BRW 1986; Shaked & Sutton 1984;
    Muthoo 1999 chs.4-6), in double precision: a responder accepts (when indifferent),
    walks away when that is at least its value of rejecting, or rejects; after a
    rejection breakdown with chance p (fallbacks b), else a round of status quo
    (1-d) g and discounting; a side walked away from gets its own walk-away value or,
    without one, its value of perpetual disagreement d0, which is also every side's
    value after the last round.  Unlike stationary_shares it finds no-deal and
    one-round-late outcomes.  Returns (A's value, B's value, round-0 decision,
    round-1 decision), decisions 'agree', 'walk' or 'reject'."""
    def d0(d, b, g):
        a = (1 - p) * d
        return g if a == 1 else (p * b + (1 - p) * (1 - d) * g) / (1 - a)

    side = {"A": (dA, bA, gA, wA, d0(dA, bA, gA)), "B": (dB, bB, gB, wB, d0(dB, bB, gB))}
    v = {"A": side["A"][4], "B": side["B"][4]}
    kinds = []
    for t in range(rounds - 1, -1, -1):
        P, R = ("A", "B") if t % 2 == 0 else ("B", "A")
        (dP, bP, gP, wP, zP), (dR, bR, gR, wR, zR) = side[P], side[R]
        cR = p * bR + (1 - p) * ((1 - dR) * gR + dR * v[R])
        cP = p * bP + (1 - p) * ((1 - dP) * gP + dP * v[P])
        walk = wR != -math.inf and wR >= cR
        thr = wR if walk else cR
        alt = (wP if wP != -math.inf else zP) if walk else cP
        agree = S - thr >= alt
        v[P], v[R] = (S - thr if agree else alt), thr
        if t < 2:
            kinds.append("agree" if agree else "walk" if walk else "reject")
    return v["A"], v["B"], kinds[1], kinds[0]
