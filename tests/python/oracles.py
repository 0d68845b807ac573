"""Reference computations written in the tests, shared by the Python tests and the
sample-sheet tests (tests/samples): independent of the library's code paths."""

import math


def stationary_shares(S, dA, dB, p=0.0, bA=0.0, bB=0.0, gA=0.0, gB=0.0, wA=-math.inf,
                      wB=-math.inf, rounds=200_000):
    """Backward induction of the combined model of CATALOGUE.md ('solve'), from far in
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
