"""Reference values for offer_path in the gap case (every type worth serving) at 50 digits.

A separate implementation in mpmath of the piecewise-polynomial backward induction
(docs/models/private-information.md s.2.4), built differently from the library's: the
upper envelope of the candidate cutoffs is cut at every pairwise crossing of the
candidates' value quadratics and every domain end, with the winner taken at each
midpoint (s.2.4 steps 1-2 with another envelope; the library sweeps instead).  Each stage is
then checked by **stagewise direct maximisation** (no candidates, no envelope): at
random states the stage objective phi_n(x)(k - x) + d_s W_(n-1)(x), evaluated from the
previous stage, is maximised over the cutoff x by a dense scan and golden-section
refinement, without candidates; the stage value must agree (to 1e-30) and never be beaten.
Each path is also checked by a Monte Carlo of responder types choosing their best round.
Sources: Fudenberg, Levine & Tirole (1985); Gul, Sonnenschein & Wilson (1986) (from memory).
"""
import random

import mpmath as mp

import offers_reference

class Piece:
    __slots__ = ("l", "r", "c", "p", "w")

    def __init__(self, l, r, c, p, w):
        self.l, self.r, self.c, self.p, self.w = l, r, c, p, w


def ev(poly, k):
    return sum(co * k ** i for i, co in enumerate(poly))


def first_stage(a, H, forced):
    if forced or 2 * a >= H:
        return [Piece(a, H, (a, 0), (a, 0), (-a * a, a, 0))]
    return [Piece(a, 2 * a, (a, 0), (a, 0), (-a * a, a, 0)),
            Piece(2 * a, H, (0, mp.mpf(1) / 2), (0, mp.mpf(1) / 2), (0, 0, mp.mpf(1) / 4))]


def candidates(stage, a, H, ds, db):
    out = []
    for pc in stage:
        f0, f1 = db * pc.p[0], (1 - db) + db * pc.p[1]
        w0, w1, w2 = pc.w

        def cand(s, e, x0, x1):
            s, e = max(s, a), min(e, H)
            if e <= s:
                return
            g0, g1 = f0 + f1 * x0, f1 * x1
            h0, h1 = -x0, 1 - x1
            wa = w0 + w1 * x0 + w2 * x0 * x0
            wb, wc = (w1 + 2 * w2 * x0) * x1, w2 * x1 * x1
            out.append((s, e, (x0, x1), (g0, g1),
                        (g0 * h0 + ds * wa, g0 * h1 + g1 * h0 + ds * wb, g1 * h1 + ds * wc)))

        cand(pc.l, H, pc.l, 0)
        cand(pc.r, H, pc.r, 0)
        cand(pc.l, pc.r, 0, 1)
        A = f1 - ds * w2
        if A > 0:
            x0, x1 = (ds * w1 - f0) / (2 * A), f1 / (2 * A)
            s, e = a, H
            if x1 > 0:
                s, e = max(s, (pc.l - x0) / x1), min(e, (pc.r - x0) / x1)
            elif not (pc.l <= x0 <= pc.r):
                continue
            if x1 < 1:
                s = max(s, x0 / (1 - x1))
            elif x1 > 1:
                e = min(e, x0 / (1 - x1))
            cand(s, e, x0, x1)
    return out


def winner(cands, k, k_next):
    """Best candidate on a small interval to the right of k (values at its midpoint)."""
    mid = (k + k_next) / 2
    best, bv = None, None
    for c in cands:
        if c[0] <= k and c[1] >= k_next:
            v = ev(c[4], mid)
            x = c[2][0] + c[2][1] * mid
            if best is None or v > bv + mp.mpf(10) ** -40 or (abs(v - bv) <= mp.mpf(10) ** -40 and x > best[2][0] + best[2][1] * mid):
                best, bv = c, v
    return best


def crossing(c1, c2, lo, hi):
    """Roots of the value difference of two candidates inside (lo, hi)."""
    d = [x - y for x, y in zip(c2[4], c1[4])]
    if d[2] == 0:
        roots = [-d[0] / d[1]] if d[1] != 0 else []
    else:
        disc = d[1] ** 2 - 4 * d[2] * d[0]
        roots = [] if disc < 0 else [(-d[1] - mp.sqrt(disc)) / (2 * d[2]), (-d[1] + mp.sqrt(disc)) / (2 * d[2])]
    return sorted(r for r in roots if lo < r < hi)


def build(stage, a, H, ds, db):
    """The envelope of docs/models/private-information.md s.2.4 step 2, cut differently:
    every domain end and every real root of a pairwise difference of candidates cut
    [a, H]; on each elementary interval the winner is the best candidate at its
    midpoint."""
    cands = candidates(stage, a, H, ds, db)
    pts = set([a, H] + [c[0] for c in cands] + [c[1] for c in cands])
    for i, c1 in enumerate(cands):
        for c2 in cands[i + 1:]:
            lo, hi = max(c1[0], c2[0]), min(c1[1], c2[1])
            if hi > lo:
                pts.update(crossing(c1, c2, lo, hi))
    pts = sorted(p for p in pts if a <= p <= H)
    out = []
    for lo, hi in zip(pts, pts[1:]):
        if hi <= lo:
            continue
        c = winner(cands, lo, hi)
        if out and out[-1][2] is c:
            out[-1] = (out[-1][0], hi, c)
        else:
            out.append((lo, hi, c))
    return [Piece(l, r, c[2], c[3], c[4]) for l, r, c in out]


def lookup(stage, k):
    hits = [pc for pc in stage if pc.l <= k <= pc.r]
    return max(hits, key=lambda pc: ev(pc.c, k))


def objective(prev, n, k, x, ds, db):
    """Stage objective evaluated directly from the previous stage (no candidates)."""
    if n == 1:
        return x * (k - x)
    pc = lookup(prev, x)
    return ((1 - db) * x + db * ev(pc.p, x)) * (k - x) + ds * ev(pc.w, x)


def stagewise_check(prev, stage, n, a, ds, db, rng):
    """Direct maximisation at random states; returns the largest value difference."""
    worst = mp.mpf(0)
    for _ in range(4):
        k = a + (stage[-1].r - a) * mp.mpf(rng.random())
        f = lambda x: objective(prev, n, k, x, ds, db)
        xs = [a + (k - a) * i / 600 for i in range(601)]
        i = max(range(len(xs)), key=lambda j: f(xs[j]))
        lo, hi = xs[max(i - 1, 0)], xs[min(i + 1, 600)]
        g = (mp.sqrt(5) - 1) / 2
        for _ in range(120):  # golden section on the bracket
            x1, x2 = hi - g * (hi - lo), lo + g * (hi - lo)
            if f(x1) < f(x2):
                lo = x1
            else:
                hi = x2
        # The maximum may sit exactly on a breakpoint of the previous stage, at the top of
        # a price jump (attained there, approached from one side): evaluate those too.
        ends = [q for pc in prev for q in (pc.l, pc.r) if q <= k]
        direct = max([f((lo + hi) / 2), f(xs[i])] + [f(q) for q in ends])
        value = ev(lookup(stage, k).w, k)
        assert direct <= value + mp.mpf(10) ** -30, (n, k, direct, value)
        worst = max(worst, abs(direct - value))
    return worst


def gap_path(lo, hi, ds, db, T, c, rng):
    """Seller of cost c < lo; returns offers, cutoffs, probabilities, values, N, SW."""
    a, H, L = lo - c, hi - c, hi - lo
    stages = [first_stage(a, H, T == 0)]
    sw = mp.mpf(0)
    while True:
        n = len(stages) + 1
        if T and n > T:
            break
        nxt = build(stages[-1], a, H, ds, db)
        sw = max(sw, stagewise_check(stages[-1], nxt, n, a, ds, db, rng))
        same = len(nxt) == len(stages[-1]) and all(
            abs(p.r - q.r) < mp.mpf(10) ** -40 and all(abs(x - y) < mp.mpf(10) ** -40 for x, y in zip(p.w, q.w))
            for p, q in zip(nxt, stages[-1]))
        stages.append(nxt)
        if same:
            break
    top = len(stages)
    rows, K, t = [], H, 1
    while True:
        n = min(T - t + 1, top) if T else top
        pc = lookup(stages[n - 1], K)
        p, Kn = ev(pc.p, K), min(K, ev(pc.c, K))
        if Kn - a <= mp.mpf(10) ** -40 * L:
            Kn = a
        rows.append((p, K, Kn))
        K = Kn
        if K == a or (T and t == T):
            break
        t += 1
    pis = [(K0 - K1) / L for _, K0, K1 in rows]
    sv = sum(ds ** i * p * pi for i, ((p, _, _), pi) in enumerate(zip(rows, pis)))
    bv = sum(db ** i * pi * ((K0 + K1) / 2 - p) for i, ((p, K0, K1), pi) in enumerate(zip(rows, pis)))
    while pis and pis[-1] == 0:
        pis.pop()
        rows.pop()
    return [c + r[0] for r in rows], [c + r[2] for r in rows], pis, sv, bv, top, sw


def row(lo, hi, ds, db, T, c, rng):
    m = [mp.mpf(v) for v in (lo, hi, ds, db, c)]
    offers, cuts, pis, sv, bv, N, sw = gap_path(m[0], m[1], m[2], m[3], T, m[4], rng)
    agree = sum(pis)
    er = sum((i + 1) * pi for i, pi in enumerate(pis)) / agree
    want = {"agree": agree, "offerer": sv, "responder": bv, "round": er}
    z = offers_reference.monte_carlo(offers, m[0], m[1], m[3], m[2], m[4], True, want, 4242 + T)
    assert z < 4.5, (lo, hi, ds, db, T, c, z)
    vals = [offers[0], agree, er, sv, bv, offers[1] if len(offers) > 1 else mp.nan, cuts[0],
            cuts[1] if len(cuts) > 1 else mp.nan]
    src = ("gap: piecewise backward induction in mpmath (envelope cut at all pairwise crossings), "
           "N=%d stages, stagewise direct maximisation |diff| %.1e; MC 4e6 types max |z| %.2f; "
           "Fudenberg, Levine & Tirole (1985)") % (N, float(sw), z)
    return vals, src


def cases():
    out = [(0.2, 1.2, 0.9, 0.9, 2, 0.0), (0.2, 1.2, 0.9, 0.9, 5, 0.0), (0.2, 1.2, 0.9, 0.9, 11, 0.0),
           (0.2, 1.2, 0.9, 0.9, 0, 0.0), (30.0, 100.0, 0.9, 0.8, 8, 10.0), (0.1, 1.0, 0.95, 0.9, 0, 0.0),
           (0.3, 1.0, 0.9, 0.95, 0, 0.0)]
    rng = random.Random(19850102)
    while len(out) < 16:
        lo = rng.uniform(0.05, 1)
        hi = lo + rng.uniform(0.2, 1.5)
        c = lo - rng.uniform(0.02, 0.8)
        out.append((lo, hi, rng.uniform(0.3, 0.92), rng.uniform(0, 0.9), rng.choice([0, rng.randint(2, 9)]), c))
    return out


def rows():
    rng = random.Random(7)
    out = []
    for lo, hi, ds, db, T, c in cases():
        vals, src = row(lo, hi, ds, db, T, c, rng)
        out.append(([lo, hi, ds, db, T, c, 0], vals, src))
    return out
