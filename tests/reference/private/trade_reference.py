"""Reference values for double_auction at 50 digits, by methods independent of the
library's polygon algorithm (docs/models/private-information.md, "Accuracy and tests").

* The equilibrium strategies are written down from their definition (Chatterjee &
  Samuelson 1983, generalised with clamps; private-information.md s.1.2) and then used only as
  black boxes: the trade boundary for each cost, the end of each clamp and the kinks of
  the outer integrand are found by bisection on the strategies, and the expectations are
  2-D Gauss-Legendre quadrature over the pieces between kinks (where the integrands are
  polynomials, so the rule is exact; a second rule with more nodes must agree to 1e-45).
* The second best (Myerson & Satterthwaite 1983, Theorem 1 and Corollary 1): the
  threshold g* is the root of H(g) = E[(2w - D) 1{w >= g}], H by the same quadrature,
  the root by a bracketing solver to 50 digits.
* A best-response test on grids (float64): for types on a grid, no action on a grid of
  deviations earns more than the equilibrium action; the largest gain is recorded.

Money scenarios are random draws or the textbook [0,1]^2 case; no real deal.
"""
import random

import mpmath as mp
import numpy as np

NODES = {}


def gl(n):
    """Gauss-Legendre nodes and weights on [-1, 1] at the current precision."""
    key = (n, mp.mp.dps)
    if key not in NODES:
        xs, ws = [], []
        for i in range(1, n + 1):
            x = mp.cos(mp.pi * (i - mp.mpf(1) / 4) / (n + mp.mpf(1) / 2))
            for _ in range(100):
                p0, p1 = mp.mpf(1), x
                for j in range(2, n + 1):
                    p0, p1 = p1, ((2 * j - 1) * x * p1 - (j - 1) * p0) / j
                dp = n * (x * p1 - p0) / (x * x - 1)
                dx = p1 / dp
                x -= dx
                if abs(dx) < mp.mpf(10) ** (-mp.mp.dps - 5):
                    break
            xs.append(x)
            ws.append(2 / ((1 - x * x) * dp * dp))
        NODES[key] = (xs, ws)
    return NODES[key]


def integrate(f, a, b, n, m):
    """Gauss-Legendre of the m-vector function f over [a, b]."""
    out = [mp.mpf(0)] * m
    if not b > a:
        return out
    xs, ws = gl(n)
    h, c = (b - a) / 2, (a + b) / 2
    for x, w in zip(xs, ws):
        vals = f(c + h * x)
        for j in range(m):
            out[j] += w * h * vals[j]
    return out


def bisect(pred, lo, hi, it=200):
    """Smallest x in [lo, hi] with pred(x), for a predicate false ... true."""
    if pred(lo):
        return lo
    for _ in range(it):
        mid = (lo + hi) / 2
        if pred(mid):
            hi = mid
        else:
            lo = mid
    return hi


class Auction:
    """The k-double auction equilibrium, from its definition (private-information.md s.1.2)."""

    def __init__(self, slo, shi, blo, bhi, k):
        self.slo, self.shi, self.blo, self.bhi, self.k = [mp.mpf(x) for x in (slo, shi, blo, bhi, k)]
        k = self.k
        D = self.D = self.bhi - self.slo
        self.ls, self.lb = self.shi - self.slo, self.bhi - self.blo
        self.A_lo = ((1 + k) * self.slo + (1 - k) * self.bhi) / 2
        self.B_hi = (k * self.slo + (2 - k) * self.bhi) / 2
        self.B_lo = self.b_lin(self.blo)
        self.A_hi = self.a_lin(self.shi)
        if D <= 0:
            self.regime = "none"
        elif self.ls == 0 and self.lb == 0:
            self.regime = "one_price"
        elif self.ls == 0:
            a_star = ((1 + k) * self.slo + (1 - k) * self.bhi) / 2
            self.post = a_star
            self.regime = "one_price" if self.blo > a_star else "posted_ask"
        elif self.lb == 0:
            b_star = (k * self.slo + (2 - k) * self.bhi) / 2
            self.post = b_star
            self.regime = "one_price" if self.shi < b_star else "posted_bid"
        elif self.B_lo > self.A_hi:
            self.regime = "one_price"
        elif self.A_lo >= self.blo and self.B_hi <= self.shi:
            self.regime = "triangle"
        else:
            self.regime = "clamped"

    def a_lin(self, c):
        return (c + (1 - self.k) * self.B_hi) / (2 - self.k)

    def b_lin(self, v):
        return (v + self.k * self.A_lo) / (1 + self.k)

    def ask(self, c):
        if self.regime == "posted_ask":
            return self.post
        if self.regime == "posted_bid":  # sellers below the posted bid ask it
            return self.post if c <= self.post else c
        return max(self.B_lo, self.a_lin(c))

    def bid(self, v):
        if self.regime == "posted_ask":
            return self.post if v >= self.post else v
        if self.regime == "posted_bid":
            return self.post
        return min(self.A_hi, self.b_lin(v))

    def price(self, a, b):
        return self.k * b + (1 - self.k) * a


def inner(au, c, n):
    """Integrals over v of [1, v - c, v - p, p - c, p] on the trade set, given cost c."""
    a = au.ask(c)
    if au.bid(au.bhi) < a:
        return [mp.mpf(0)] * 5
    vt = bisect(lambda v: au.bid(v) >= a, au.blo, au.bhi)
    top = au.bid(au.bhi)
    vk = bisect(lambda v: au.bid(v) >= top, vt, au.bhi)  # start of the bid's plateau

    def f(v):
        p = au.price(a, au.bid(v))
        return [1, v - c, v - p, p - c, p]

    r1 = integrate(f, vt, vk, n, 5)
    r2 = integrate(f, vk, au.bhi, n, 5)
    return [x + y for x, y in zip(r1, r2)]


def linear_moments(au, n):
    """E[1{trade} x (1, w, v - p, p - c, p)] by 2-D quadrature, kinks by bisection."""
    lo, hi = au.slo, au.shi
    bottom = au.ask(lo)
    ck = bisect(lambda c: au.ask(c) > bottom, lo, hi)  # end of the ask's plateau
    c1 = bisect(lambda c: au.bid(au.blo) < au.ask(c), lo, hi)  # trade with every value ends
    c2 = bisect(lambda c: au.bid(au.bhi) < au.ask(c), lo, hi)  # trade ends
    cuts = sorted({lo, hi, ck, c1, c2})
    tot = [mp.mpf(0)] * 5
    for a, b in zip(cuts, cuts[1:]):
        part = integrate(lambda c: inner(au, c, 8), a, b, n, 5)
        tot = [x + y for x, y in zip(tot, part)]
    cell = au.ls * au.lb
    return [x / cell for x in tot]


def degenerate_moments(au, n):
    """Posted ask or posted bid: 1-D quadrature over the unknown side."""
    if au.regime == "posted_ask":
        c = au.slo
        r = inner(au, c, n)
        return [x / au.lb for x in r]
    v = au.bhi
    b = au.bid(v)
    ct = bisect(lambda c: au.ask(c) > b, au.slo, au.shi)

    def f(c):
        p = au.price(au.ask(c), b)
        return [1, v - c, v - p, p - c, p]

    r = integrate(f, au.slo, ct, n, 5)
    return [x / au.ls for x in r]


def gain_moments(au, g, n):
    """[P(w >= g), E[w 1{w >= g}], H(g) = E[(2w - D) 1{w >= g}]] by quadrature."""
    if au.ls == 0 or au.lb == 0:
        raise ValueError("degenerate")

    def f(c):
        v0 = max(au.blo, c + g)
        if v0 >= au.bhi:
            return [0, 0, 0]
        return integrate(lambda v: [1, v - c, 2 * (v - c) - au.D], v0, au.bhi, 4, 3)

    cuts = sorted({au.slo, au.shi, min(max(au.blo - g, au.slo), au.shi),
                   min(max(au.bhi - g, au.slo), au.shi)})
    tot = [mp.mpf(0)] * 3
    for a, b in zip(cuts, cuts[1:]):
        part = integrate(f, a, b, n, 3)
        tot = [x + y for x, y in zip(tot, part)]
    cell = au.ls * au.lb
    return [x / cell for x in tot]


def first_best(au, n):
    if au.ls == 0 and au.lb == 0:
        return mp.mpf(1), au.D
    if au.ls == 0:
        r = integrate(lambda v: [1 if v >= au.slo else 0, max(v - au.slo, 0)],
                      max(au.blo, au.slo), au.bhi, n, 2)
        return r[0] / au.lb, r[1] / au.lb
    if au.lb == 0:
        r = integrate(lambda c: [1, au.bhi - c], au.slo, min(au.shi, au.bhi), n, 2)
        return r[0] / au.ls, r[1] / au.ls
    p, w, _ = gain_moments(au, mp.mpf(0), n)
    return p, w


def second_best(au, n):
    """(g*, SB, P_SB); the direct test decides first-best feasibility (s.1.5)."""
    pf, fb = first_best(au, n)
    if au.ls == 0 or au.lb == 0 or au.blo >= au.shi:
        return mp.mpf(0), fb, pf
    H = lambda g: gain_moments(au, g, n)[2]
    lo, hi = mp.mpf(0), au.D / 2
    for _ in range(40):  # bracket first, then a bracketing solver to full precision
        mid = (lo + hi) / 2
        if H(mid) < 0:
            lo = mid
        else:
            hi = mid
    g = mp.findroot(H, (lo, hi), solver="anderson", tol=mp.mpf(10) ** (-2 * mp.mp.dps + 10))
    p, w, _ = gain_moments(au, g, n)
    return g, w, p


def moments(au, n):
    if au.regime == "one_price":
        k = au.k
        pk = k * au.shi + (1 - k) * au.blo
        ev, ec = (au.blo + au.bhi) / 2, (au.slo + au.shi) / 2
        return [mp.mpf(1), ev - ec, ev - pk, pk - ec, pk]
    if au.regime in ("posted_ask", "posted_bid"):
        m = degenerate_moments(au, n)
    else:
        m = linear_moments(au, n)
    return m[:4] + [m[4] / m[0]]


def best_response_gain(au, unclamped=False):
    """Largest gain from deviating (float64 grids); 0 when the regime is not linear."""
    if au.regime not in ("triangle", "clamped"):
        return 0.0
    k = float(au.k)
    f = lambda x: float(x)
    A_lo, B_hi, B_lo, A_hi = f(au.A_lo), f(au.B_hi), f(au.B_lo), f(au.A_hi)
    if unclamped:
        B_lo, A_hi = -np.inf, np.inf
    ask = lambda c: np.maximum(B_lo, (c + (1 - k) * B_hi) / (2 - k))
    bid = lambda v: np.minimum(A_hi, (v + k * A_lo) / (1 + k))
    slo, shi, blo, bhi = f(au.slo), f(au.shi), f(au.blo), f(au.bhi)
    M = 20001
    vs = blo + (bhi - blo) * (np.arange(M) + 0.5) / M
    cs = slo + (shi - slo) * (np.arange(M) + 0.5) / M
    bids, asks = bid(vs), ask(cs)
    acts = np.linspace(min(slo, blo), max(shi, bhi), 201)
    worst = 0.0
    for t in (np.arange(21) + 0.5) / 21:  # interior types: the top seller's ask ties the bid cap
        c, v = slo + (shi - slo) * t, blo + (bhi - blo) * t
        pay_s = lambda a: np.mean(np.where(bids >= a, k * bids + (1 - k) * a - c, 0.0))
        pay_b = lambda b: np.mean(np.where(asks <= b, v - (k * b + (1 - k) * asks), 0.0))
        es, eb = pay_s(float(ask(c))), pay_b(float(bid(v)))
        worst = max(worst, max(pay_s(a) for a in acts) - es, max(pay_b(b) for b in acts) - eb)
    return worst


FIELDS = ["trade_probability", "total_gain", "buyer_gain", "seller_gain", "expected_price",
          "first_best_gain", "first_best_probability", "second_best_gain",
          "second_best_threshold", "second_best_probability"]


def row(slo, shi, blo, bhi, k):
    au = Auction(slo, shi, blo, bhi, k)
    if au.regime == "none":
        vals = [0, 0, 0, 0, mp.nan, 0, 0, 0, mp.nan, 0]
        return (au.regime, "no_deal", vals,
                "D <= 0: no gains (private-information.md s.1.7)")
    with mp.workdps(70):  # 20 guard digits: endpoints near 1e9 cost 9 of them
        m = moments(au, 12)
        m2 = moments(au, 16)
        size = max(1, abs(au.slo), abs(au.bhi))
        assert all(abs(x - y) <= mp.mpf(10) ** -55 * size for x, y in zip(m, m2)), (slo, shi, blo, bhi, k)
        pf, fb = first_best(au, 12)
        g, sb, psb = second_best(au, 12)
    vals = [m[0], m[1], m[2], m[3], m[4], fb, pf, sb, g, psb]
    br = best_response_gain(au)
    scale = float(au.D)
    assert br <= 2e-4 * scale, (slo, shi, blo, bhi, k, br)
    src = ("GL quadrature of black-box strategies, kinks by bisection; BR grid gain %.1e; "
           "Chatterjee & Samuelson (1983); Myerson & Satterthwaite (1983)") % br
    if au.regime == "clamped":
        power = best_response_gain(au, unclamped=True)
        src += "; unclamped lines fail by %.2g" % power
    return au.regime, "ok", vals, src


def cases():
    """Textbook cases and those of the check values in tests/cpp/test_trade_published.cpp,
    then random draws (fixed seed)."""
    out = [(0.0, 1.0, 0.0, 1.0, 0.5), (0.0, 1.0, 0.0, 1.0, 0.25), (0.0, 1.0, 0.3, 1.0, 0.5),
           (0.0, 1.0, 0.5, 1.5, 0.3), (10.0, 30.0, 20.0, 50.0, 0.5),
           (100.0, 200.0, 120.0, 260.0, 0.5), (0.0, 2.0, 1.0, 1.5, 0.7), (0.0, 1.0, 1.0, 2.0, 0.5),
           (0.0, 1.0, 2.0, 3.0, 0.5), (0.4, 0.4, 0.0, 1.0, 0.2), (0.0, 1.0, 0.7, 0.7, 0.9),
           (0.5, 0.5, 1.0, 1.0, 0.3), (0.0, 1.0, 0.99, 1.01, 0.5), (0.0, 1.0, 0.9, 3.0, 0.5),
           (1e9, 1e9 + 1.0, 1e9 + 0.25, 1e9 + 1.5, 0.5), (0.0, 1.0, -2.0, 0.1, 0.5),
           (0.0, 1.0, 0.0, 1.0, 0.0), (0.0, 1.0, 0.0, 1.0, 1.0), (0.0, 1.0, 0.3, 1.0, 0.0),
           (0.0, 1.0, 0.3, 1.0, 1.0), (2.0, 3.0, 0.0, 1.0, 0.5)]
    rng = random.Random(19830201)
    while len(out) < 60:
        s = sorted([rng.uniform(-1, 1), rng.uniform(-1, 1)])
        b = sorted([rng.uniform(-1, 1), rng.uniform(-1, 1)])
        scale = 10 ** rng.choice([0, 0, 0, 2, -3])
        k = rng.choice([0.5, rng.random(), rng.random()])
        if b[1] <= s[0]:
            continue
        out.append((s[0] * scale, s[1] * scale, b[0] * scale, b[1] * scale, k))
    return out


def table():
    header = ["seller_low", "seller_high", "buyer_low", "buyer_high", "k", "status", "regime"]
    header += FIELDS + ["source"]
    rows = []
    for c in cases():
        regime, status, vals, src = row(*c)
        rows.append([repr(float(x)) for x in c] + [status, regime] +
                    [mp.nstr(v, 25) if not mp.isnan(v) else "nan" for v in vals] + [src])
    return header, rows
