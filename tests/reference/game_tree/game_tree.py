"""Backward induction over the finite game of the combined model, written from the
game's rules (docs/models/combined.md), not from any closed form.

The game: rounds 0, 1, 2, ...; A proposes in even rounds, B in odd ones.  The responder
accepts (it accepts when indifferent), walks away if it has a walk-away value (it walks
when that is at least its value of rejecting), or rejects.  After a rejection, talks
break down with chance p (each side gets its fallback b at once); otherwise each side
collects a round of status-quo income (1 - d) g and the rejecter proposes next round,
discounted by d.  When a side walks away it gets its walk-away value w and the other gets
its own walk-away value, or, if it has none, its value of perpetual disagreement d0.
After the last round of the finite game the parties stay in perpetual disagreement
(status-quo income until a breakdown), worth d0 = (p b + (1-p)(1-d) g) / (1 - (1-p) d)
to each (g when p = 0 and d = 1).  The proposer makes the cheapest acceptable offer, or
an unacceptable one when that is strictly better for it.

Rounds are taken two at a time; a stretch of rounds in which every decision repeats is
one affine map, raised to a power by repeated squaring of its 3x3 matrix (the same
arithmetic as the rounds one by one, grouped), so horizons of 10^12 rounds cost a few
hundred matrix products.  Sources of the game: Rubinstein (1982); Binmore, Rubinstein &
Wolinsky (1986) s.4 (breakdown); Shaked & Sutton (1984) and Osborne & Rubinstein (1990)
ch.3 (opting out as a responder); Muthoo (1999) chs.4-6 (breakdown, outside and inside
options).
"""
import mpmath as mp

mp.mp.dps = 50


class Side:
    def __init__(self, d, p, b, g, w):
        self.d, self.b, self.g = mp.mpf(d), mp.mpf(b), mp.mpf(g)
        self.w = None if w is None else mp.mpf(w)
        p = mp.mpf(p)
        self.p = p
        a = (1 - p) * self.d
        self.d0 = self.g if a == 1 else (p * self.b + (1 - p) * (1 - self.d) * self.g) / (1 - a)
        self.n = self.w if self.w is not None else self.d0
        # rejection value: k0 + k1 * v (v: the side's value next round)
        self.k0 = p * self.b + (1 - p) * (1 - self.d) * self.g
        self.k1 = (1 - p) * self.d


def one_round(P, R, S, vP, vR):
    """One round: values next round (vP, vR) -> values now, the decision and its margins.
    Returns (vP, vR, kind, walk_margin, agree_margin, affine) where affine gives
    vP_now = cPP vP + cPR vR + cP0 and vR_now likewise, for the decisions taken."""
    cR = R.k0 + R.k1 * vR
    cP = P.k0 + P.k1 * vP
    walk = R.w is not None and R.w >= cR
    walk_margin = (R.w - cR) if R.w is not None else None
    thr = R.w if walk else cR
    alt = P.n if walk else cP
    agree_margin = (S - thr) - alt
    agree = agree_margin >= 0
    # affine coefficients: vR_now = rr * vR + r0 ; vP_now = pp * vP + pr * vR + p0
    if walk:
        rr, r0 = 0, R.w
    else:
        rr, r0 = R.k1, R.k0
    if agree:
        pp, pr, p0 = 0, -rr, S - r0
    elif walk:
        pp, pr, p0 = 0, 0, P.n
    else:
        pp, pr, p0 = P.k1, 0, P.k0
    kind = ("agree" if agree else "walk" if walk else "reject")
    return (S - thr if agree else alt), thr, kind, walk_margin, agree_margin, (pp, pr, p0, rr, r0)


def matmul(X, Y):
    return [[sum(X[i][k] * Y[k][j] for k in range(3)) for j in range(3)] for i in range(3)]


def apply(M, s):
    return [M[0][0] * s[0] + M[0][1] * s[1] + M[0][2], M[1][0] * s[0] + M[1][1] * s[1] + M[1][2]]


def block(A, B, S, s):
    """Rounds 2k+1 (B proposes) then 2k (A proposes), from state s = (vA, vB) at round
    2k+2.  Returns the state at round 2k, the two rounds' decisions (with whether the
    responder's walk-away value sets its payoff: the block's matrix depends on it) and
    the block's 3x3 matrix."""
    vA, vB = s
    yB, zA, k1, wm1, _, (pp, pr, p0, rr, r0) = one_round(B, A, S, vB, vA)
    # round 2k+1: B proposer: yB = pp vB + pr vA + p0 ; zA = rr vA + r0
    M1 = [[rr, 0, r0], [pr, pp, p0], [0, 0, 1]]          # (vA, vB) -> (zA, yB)
    xA, tB, k0, wm0, _, (qq, qr, q0, ss, s0) = one_round(A, B, S, zA, yB)
    M0 = [[qq, qr, q0], [0, ss, s0], [0, 0, 1]]          # (zA, yB) -> (xA, tB)
    walks = (wm1 is not None and wm1 >= 0, wm0 is not None and wm0 >= 0)
    return [xA, tB], (k1, k0) + walks, matmul(M0, M1)


def solve_game(A, B, S, T):
    """Backward induction over rounds 0..T-1 (A opens).  Returns a dict with the values
    at rounds 0 and 1, the kinds and margins of rounds 0 and 1."""
    s = [A.d0, B.d0]
    r = T                       # values known at round r
    if r % 2 == 1:              # round T-1 is even: A proposes; take it alone
        xA, tB, *_ = one_round(A, B, S, s[0], s[1])
        s, r = [xA, tB], r - 1
    budget = 3000               # blocks taken one at a time before giving up
    taken = 0                   # the first 200 blocks one at a time (past the transient)
    wait, gap = 0, 1            # after a failed jump, try again only `gap` blocks later
    steps = 0                   # every pass counts: at most 4000 (else give up)
    pows, pow_kinds = [], None  # M^(2^j) of the current decisions, kept while they last
    while r > 2:
        steps += 1
        if steps > 4000:
            return None
        s1, kinds, M = block(A, B, S, s)
        blocks = (r - 2) // 2 if taken >= 200 and wait == 0 else 1
        taken += 1
        wait = max(wait - 1, 0)
        # powers M^(2^j) while 2^j <= blocks (the same M while the decisions repeat)
        if kinds != pow_kinds:
            pows, pow_kinds = [M], kinds
        while 2 ** len(pows) <= blocks:
            pows.append(matmul(pows[-1], pows[-1]))
        moved = False
        for j in range(len(pows) - 1, 0, -1):
            n = 2 ** j
            if n > blocks:
                continue
            cand = apply(pows[j], s)
            if block(A, B, S, cand)[1] == kinds:
                s, r, moved = cand, r - 2 * n, True
                gap = 1
                break
        if not moved:
            if blocks > 1:
                wait, gap = gap, min(2 * gap, 512)
            s, r = s1, r - 2
            budget -= 1
            if budget == 0:
                return None     # the decisions keep changing: no stretch to jump
    # rounds 1 and 0 one at a time (r == 2), recording decisions
    vA, vB = s
    yB, zA, k1, wm1, am1, _ = one_round(B, A, S, vB, vA)
    xA, tB, k0, wm0, am0, _ = one_round(A, B, S, zA, yB)
    return {"x": xA, "t": tB, "z": zA, "y": yB, "k0": k0, "k1": k1,
            "wm0": wm0, "am0": am0, "wm1": wm1, "am1": am1}


def horizon(A, B):
    """An even T with (a_A a_B)^(T/2 - 1) <= 1e-45 (capped at 2^60)."""
    q = A.k1 * B.k1
    if q == 0:
        return 12
    if q >= 1:
        return 2 ** 60
    T = 2 * int(mp.ceil(104 / -mp.log(q))) + 12
    return min(T, 2 ** 60)


def outcome(dA, dB, p, bA, bB, gA, gB, wA, wB, S, T=None):
    """A opens.  Horizons T, T+1, T+2 and T+3 (both parities, and each jump pattern
    twice); returns (result, all four agree to 1e-30 of the money scale, A, B)."""
    A, B = Side(dA, p, bA, gA, wA), Side(dB, p, bB, gB, wB)
    S = mp.mpf(S)
    T = T or horizon(A, B)
    runs = [solve_game(A, B, S, T + k) for k in range(4)]
    if any(r is None for r in runs):
        return {}, False, A, B
    r1 = runs[0]
    scale = max(abs(S), abs(A.d0), abs(B.d0), 1e-300)
    same = all((r1["k0"], r1["k1"]) == (r2["k0"], r2["k1"]) and
               all(abs(r1[k] - r2[k]) <= mp.mpf(10) ** -30 * scale for k in "xtzy")
               for r2 in runs[1:])
    return r1, same, A, B
