"""Reference values for offer_path at 50 digits, by methods independent of the library's
recursions and closed forms (docs/models/private-information.md, "Accuracy and tests").

* Numerical backward induction (NBI) by first-order conditions: each stage's offer and
  value functions are represented by degree-8 polynomial interpolation at Chebyshev
  nodes; at each node the offerer's problem is solved by a scan and a Newton iteration on
  the first-order condition (ends compared).  It never uses the l, m recursion.
    - seller offers (value space): cutoff x, price phi_n(x) = (1 - d_b) x + d_b P_(n-1)(x)
      from the marginal buyer's indifference (phi_1(x) = x); value
      max_x phi_n(x)(k - x) + d_s W_(n-1)(x) (Sobel & Takahashi 1983; Fudenberg & Tirole
      1991 ch. 10, from memory);
    - buyer offers (cost space, written for the mirror case on its own, not by reversing
      money): sellers of cost below the cutoff x agree; the offer
      psi_n(x) = (1 - d_r) x + d_r Q_(n-1)(x) makes the marginal cost indifferent; value
      max_x (u - psi_n(x))(x - k) + d_o W_(n-1)(x).
  The totals are summed along the path with the output formulas (probability per round
  from the cutoffs, values from the per-round integrals).
* No deadline: the stationary solution found as the fixed point of one NBI stage
  (unknown price slope and value coefficient; findroot), then the path summed to 1e-60.
* Monte Carlo: 4 x 10^6 responder types (numpy PCG64, fixed seed) each choose their best
  round on the NBI path; every total must lie within 4.5 standard errors.

Money scenarios are random draws or the reference's cases; no real deal.
"""
import random

import mpmath as mp
import numpy as np

DEG = 8


def cheb_nodes(a, b):
    return [(a + b) / 2 + (b - a) / 2 * mp.cos(mp.pi * (2 * i + 1) / (2 * (DEG + 1))) for i in range(DEG + 1)]


class Poly:
    """Interpolating polynomial through (xs, ys), coefficients in powers of (x - x0)."""

    def __init__(self, xs, ys, x0):
        self.x0 = x0
        A = mp.matrix([[(x - x0) ** j for j in range(len(xs))] for x in xs])
        self.c = mp.lu_solve(A, mp.matrix(ys))

    def __call__(self, x, d=0):
        t = x - self.x0
        s = mp.mpf(0)
        for j in range(d, len(self.c)):
            f = mp.mpf(1)
            for i in range(d):
                f *= j - i
            s += f * self.c[j] * t ** (j - d)
        return s


def maximise(obj, dobj, d2obj, lo, hi):
    """Max of a smooth function on [lo, hi]: scan, Newton on the derivative, ends."""
    xs = [lo + (hi - lo) * i / 40 for i in range(41)]
    best = max(xs, key=obj)
    cands = [lo, hi]
    x = best
    for _ in range(80):
        d2 = d2obj(x)
        if d2 == 0:
            break
        step = dobj(x) / d2
        x -= step
        if not (lo <= x <= hi):
            break
        if abs(step) < mp.mpf(10) ** (-mp.mp.dps + 3) * (1 + abs(hi - lo)):
            break
    if lo <= x <= hi:
        cands.append(x)
    return max(cands, key=obj)


def nbi_stages(T, lo, hi, d_off, d_resp, price_of, obj_of):
    """Backward induction for n = 1..T on [lo, hi]; returns per stage (P, C) polynomials."""
    nodes = cheb_nodes(lo, hi)
    prevP = prevW = None
    stages = []
    for n in range(1, T + 1):
        Ps, Cs, Ws = [], [], []
        for k in nodes:
            phi, dphi, d2phi = price_of(n, prevP, d_resp)
            obj, dobj, d2obj, lo_x, hi_x = obj_of(k, phi, dphi, d2phi, prevW, d_off)
            x = maximise(obj, dobj, d2obj, lo_x, hi_x)
            Ps.append(phi(x))
            Cs.append(x)
            Ws.append(obj(x))
        P, C, W = Poly(nodes, Ps, lo), Poly(nodes, Cs, lo), Poly(nodes, Ws, lo)
        stages.append((P, C))
        prevP, prevW = P, W
    return stages


def price_rule(n, prevP, d):
    """Indifference of the marginal responder: (1 - d) x + d P_(n-1)(x); x at the end."""
    if n == 1:
        return (lambda x: x), (lambda x: 1), (lambda x: 0)
    return ((lambda x: (1 - d) * x + d * prevP(x)), (lambda x: (1 - d) + d * prevP(x, 1)),
            (lambda x: d * prevP(x, 2)))


def seller_objective(k, phi, dphi, d2phi, prevW, ds):
    W = prevW if prevW is not None else (lambda x, d=0: mp.mpf(0))
    obj = lambda x: phi(x) * (k - x) + ds * W(x)
    dobj = lambda x: dphi(x) * (k - x) - phi(x) + ds * W(x, 1)
    d2 = lambda x: d2phi(x) * (k - x) - 2 * dphi(x) + ds * W(x, 2)
    return obj, dobj, d2, mp.mpf(0), k


def seller_path(lo, hi, ds, db, T, c):
    """Seller of cost c (no gap: c >= lo) offering to values U[lo, hi]; shifted by c."""
    H, L = hi - c, hi - lo
    stages = nbi_stages(T, mp.mpf(0), H, ds, db, price_rule, seller_objective)
    K, rows = H, []
    for t in range(1, T + 1):
        P, C = stages[T - t]
        p, Kn = P(K), C(K)
        rows.append((c + p, K, Kn, p))
        K = Kn
    pis = [(K0 - K1) / L for _, K0, K1, _ in rows]
    sv = sum(ds ** t * p * pi for t, ((_, _, _, p), pi) in enumerate(zip(rows, pis)))
    bv = sum(db ** t * ((K0 ** 2 - K1 ** 2) / 2 - p * (K0 - K1)) / L for t, (_, K0, K1, p) in enumerate(rows))
    return [r[0] for r in rows], [c + r[2] for r in rows], pis, sv, bv


def buyer_path(lo, hi, d_off, d_resp, T, u):
    """Buyer of value u (no gap: u <= hi) offering to costs U[lo, hi], in cost space."""
    L = hi - lo
    # States: the lowest remaining cost k in [lo, u]; cutoff x in [k, u].

    def obj_of(k, psi, dpsi, d2psi, prevW, d):
        W = prevW if prevW is not None else (lambda x, dd=0: mp.mpf(0))
        obj = lambda x: (u - psi(x)) * (x - k) + d * W(x)
        dobj = lambda x: -dpsi(x) * (x - k) + (u - psi(x)) + d * W(x, 1)
        d2 = lambda x: -d2psi(x) * (x - k) - 2 * dpsi(x) + d * W(x, 2)
        return obj, dobj, d2, k, u

    stages = nbi_stages(T, lo, u, d_off, d_resp, price_rule, obj_of)
    K, rows = lo, []
    for t in range(1, T + 1):
        Q, X = stages[T - t]
        q, Kn = Q(K), X(K)
        rows.append((q, K, Kn))
        K = Kn
    pis = [(K1 - K0) / L for _, K0, K1 in rows]
    bv = sum(d_off ** t * (u - q) * pi for t, ((q, _, _), pi) in enumerate(zip(rows, pis)))
    sv = sum(d_resp ** t * (q * (K1 - K0) - (K1 ** 2 - K0 ** 2) / 2) / L for t, (q, K0, K1) in enumerate(rows))
    return [r[0] for r in rows], [r[2] for r in rows], pis, bv, sv


def stationary(ds, db):
    """Fixed point of one NBI stage for P(x) = lam x, W(x) = w x^2/2 at state 1."""

    def stage(lam, w):
        phi = lambda x: ((1 - db) + db * lam) * x
        obj = lambda x: phi(x) * (1 - x) + ds * w * x * x / 2
        dobj = lambda x: ((1 - db) + db * lam) * (1 - 2 * x) + ds * w * x
        d2 = lambda x: -2 * ((1 - db) + db * lam) + ds * w
        x = maximise(obj, dobj, d2, mp.mpf(0), mp.mpf(1))
        return x, phi(x), 2 * obj(x)

    def F(lam, w):
        _, l2, w2 = stage(lam, w)
        return [l2 - lam, w2 - w]

    lam, w = mp.findroot(F, (mp.mpf("0.3"), mp.mpf("0.3")))
    mu = stage(lam, w)[0]
    return mu, lam


def endless_seller(lo, hi, ds, db, c):
    mu, lam = stationary(ds, db)
    H, L = hi - c, hi - lo
    offers, cuts, pis = [], [], []
    sv = bv = er = mp.mpf(0)
    K, t = H, 0
    while K > mp.mpf(10) ** -60 * H:
        p, Kn = lam * K, mu * K
        pi = (K - Kn) / L
        if t < 3:
            offers.append(c + p)
            cuts.append(c + Kn)
        pis.append(pi)
        sv += ds ** t * p * pi
        bv += db ** t * ((K ** 2 - Kn ** 2) / 2 - p * (K - Kn)) / L
        er += (t + 1) * pi
        K, t = Kn, t + 1
    return offers, cuts, pis, sv, bv, er / sum(pis)


def monte_carlo(offers, lo, hi, d_resp, d_off, known, seller, want, seed):
    """Types choose their best round; returns the largest |z| over the totals."""
    rng = np.random.Generator(np.random.PCG64(seed))
    n, chunk = 4_000_000, 50_000
    p = np.array([float(o) for o in offers])
    disc = float(d_resp) ** np.arange(len(p))
    off_disc = float(d_off) ** np.arange(len(p))
    margin = (p - float(known)) if seller else (float(known) - p)
    sums = {k: [0.0, 0.0] for k in ("agree", "offerer", "responder", "round")}
    count = 0
    for _ in range(n // chunk):
        x = rng.uniform(float(lo), float(hi), chunk)
        gain = (x[:, None] - p[None, :]) if seller else (p[None, :] - x[:, None])
        val = np.where(gain >= 0, gain * disc[None, :], -1.0)
        t = np.argmax(val, axis=1)
        best = val[np.arange(chunk), t]
        ok = best >= 0
        parts = {"agree": ok.astype(float), "offerer": np.where(ok, off_disc[t] * margin[t], 0.0),
                 "responder": np.where(ok, best, 0.0), "round": (t + 1)[ok].astype(float)}
        for key, v in parts.items():
            sums[key][0] += v.sum()
            sums[key][1] += (v * v).sum()
        count += int(ok.sum())
    zs = []
    for key, (s1, s2) in sums.items():
        m = count if key == "round" else n
        mean = s1 / m
        se = np.sqrt(max(s2 / m - mean * mean, 0.0) / m)
        if se > 0:
            zs.append(abs(mean - float(want[key])) / se)
    return max(zs)


def finite_row(lo, hi, ds, db, T, known, who):
    m = [mp.mpf(v) for v in (lo, hi, ds, db, known)]
    if who == 0:
        offers, cuts, pis, off_v, resp_v = seller_path(m[0], m[1], m[2], m[3], T, m[4])
    else:
        offers, cuts, pis, off_v, resp_v = buyer_path(m[0], m[1], m[2], m[3], T, m[4])
    agree = sum(pis)
    er = sum((t + 1) * pi for t, pi in enumerate(pis)) / agree
    want = {"agree": agree, "offerer": off_v, "responder": resp_v, "round": er}
    z = monte_carlo(offers, m[0], m[1], m[3], m[2], m[4], who == 0, want, 20260 + T)
    assert z < 4.5, (lo, hi, ds, db, T, known, who, z)
    vals = [offers[0], agree, er, off_v, resp_v,
            offers[1] if T > 1 else mp.nan, cuts[0], cuts[1] if T > 1 else mp.nan]
    src = ("NBI degree-%d Chebyshev, FOC Newton (%s space); MC 4e6 types max |z| %.2f; "
           "Sobel & Takahashi (1983)") % (DEG, "value" if who == 0 else "cost", z)
    return vals, src


def endless_row(lo, hi, ds, db, c):
    m = [mp.mpf(v) for v in (lo, hi, ds, db, c)]
    offers, cuts, pis, sv, bv, er = endless_seller(*m)
    want = {"agree": sum(pis), "offerer": sv, "responder": bv, "round": er}
    mu, lam = stationary(m[2], m[3])
    H = m[1] - m[4]  # the MC uses the first 400 rounds of the path
    long_offers = [m[4] + lam * mu ** t * H for t in range(400)]
    z = monte_carlo(long_offers, m[0], m[1], m[3], m[2], m[4], True, want, 777)
    assert z < 4.5, (lo, hi, ds, db, c, z)
    vals = [offers[0], sum(pis), er, sv, bv, offers[1], cuts[0], cuts[1]]
    src = ("stationary fixed point of one NBI stage (findroot), path summed to 1e-60; "
           "MC 4e6 types max |z| %.2f; Stokey (1981); Gul, Sonnenschein & Wilson (1986)") % z
    return vals, src


def cases():
    out = [(0.0, 1.0, 0.9, 0.9, 2, 0.0, 0), (0.0, 1.0, 0.9, 0.9, 5, 0.0, 0),
           (0.0, 1.0, 0.9, 0.9, 10, 0.0, 0), (10.0, 110.0, 0.9, 0.7, 6, 30.0, 0),
           (0.0, 1.0, 0.9, 0.0, 4, 0.0, 0), (0.0, 1.0, 0.0, 0.9, 4, 0.0, 0),
           (0.0, 1.0, 0.5, 0.99, 12, 0.0, 0), (0.0, 1.0, 0.9, 0.9, 5, 1.0, 1),
           (40.0, 140.0, 0.8, 0.95, 7, 120.0, 1), (0.0, 1.0, 1.0, 0.6, 6, 0.0, 0),
           (0.0, 1.0, 0.9, 0.9, 0, 0.0, 0), (10.0, 110.0, 0.9, 0.7, 0, 30.0, 0),
           (0.0, 1.0, 0.95, 0.8, 0, 0.0, 0), (0.0, 1.0, 0.5, 0.5, 0, 0.0, 0)]
    rng = random.Random(19830611)
    while len(out) < 56:
        lo = rng.uniform(-1, 1)
        hi = lo + rng.choice([1.0, rng.uniform(0.01, 2)])
        scale = rng.choice([1.0, 1.0, 100.0])
        ds, db = rng.choice([rng.random(), 0.9, 0.99]), rng.choice([rng.random(), 0.8, 0.0])
        who = rng.choice([0, 1])
        T = rng.choice([0, rng.randint(1, 14)]) if who == 0 else rng.randint(1, 14)
        if who == 0:
            known = rng.uniform(lo, hi - 0.01)  # no gap: cost >= lowest value
        else:
            known = rng.uniform(lo + 0.01, hi)  # no gap: value <= highest cost
        out.append((lo * scale, hi * scale, ds, db, T, known * scale, who))
    return out


FIELDS = ["opening_offer", "agreement_probability", "expected_round", "offerer_value",
          "responder_value", "offer_2", "cutoff_1", "cutoff_2"]


def table():
    header = ["private_low", "private_high", "offerer_factor", "responder_factor", "rounds",
              "known_value", "offerer", "status"] + FIELDS + ["source"]
    rows = []
    for lo, hi, ds, db, T, known, who in cases():
        if T == 0:
            vals, src = endless_row(lo, hi, ds, db, known)
        else:
            vals, src = finite_row(lo, hi, ds, db, T, known, who)
        rows.append([repr(float(lo)), repr(float(hi)), repr(float(ds)), repr(float(db)), str(T),
                     repr(float(known)), str(who), "ok"] +
                    [mp.nstr(v, 25) if not mp.isnan(v) else "nan" for v in vals] + [src])
    import gap_reference  # the gap case: a separate engine, checked stagewise
    for (lo, hi, ds, db, T, known, who), vals, src in gap_reference.rows():
        rows.append([repr(float(lo)), repr(float(hi)), repr(float(ds)), repr(float(db)), str(T),
                     repr(float(known)), str(who), "ok"] +
                    [mp.nstr(v, 25) if not mp.isnan(v) else "nan" for v in vals] + [src])
    return header, rows
