"""Published closed forms the hostile sheet's expected values come from (mpmath, 50
digits).  The counteroffer package is not used.  Each oracle returns ("ok", value[,
scale]), ("nodeal", None) or ("indet", None); raises Invalid for a domain violation the
header documents beyond the argument kinds; returns None when it has no answer for
these arguments (the case is then not generated).  ORACLE maps a Calc name to its
oracle; a function without one gets only the argument-kind cases."""
import mpmath as mp

mp.mp.dps = 50


class Invalid(Exception):
    pass


def rubinstein(d1, d2, s, opens):
    """Rubinstein (1982) main theorem; Muthoo (1999) ch.3; docs/models/complete-information.md s.1."""
    if d1 == 1 and d2 == 1:
        return None if s <= 0 else ("indet", None)  # both apply: no order documented
    if s <= 0:
        return ("nodeal", None)
    x = (1 - d2) / (1 - d1 * d2)
    return ("ok", s * x if opens else s * d1 * x)


def o_factor(rate, days, basis, cont):
    """Standard compounding (common practice, no source); Muthoo (1999) s.3.2."""
    if cont:
        return ("ok", mp.exp(-rate * days / basis))
    return ("ok", mp.exp(-mp.log1p(rate) * days / basis))  # = (1 + rate)^(-days/basis)


def o_share(d1, d2, s, opens):
    """Rubinstein (1982) main theorem; Muthoo (1999) ch.3; docs/models/complete-information.md s.1."""
    return rubinstein(d1, d2, s, opens)


def o_share_rates(r1, r2, days, s, opens, basis, cont):
    """Rubinstein (1982) with delta_i = factor(rate_i); Muthoo (1999) s.3.2."""
    c = (lambda r: r) if cont else (lambda r: mp.log1p(r))
    rho1, rho2 = c(r1) * days / basis, c(r2) * days / basis
    if rho1 == 0 and rho2 == 0:
        return None if s <= 0 else ("indet", None)
    if s <= 0:
        return ("nodeal", None)
    x = mp.expm1(-rho2) / mp.expm1(-(rho1 + rho2))
    return ("ok", s * x if opens else s * mp.exp(-rho1) * x)


def o_limit(r1, r2, s):
    """Binmore, Rubinstein & Wolinsky (1986); Muthoo (1999) ch.3."""
    if r1 == 0 and r2 == 0:
        return None if s <= 0 else ("indet", None)
    if s <= 0:
        return ("nodeal", None)
    return ("ok", s * r2 / (r1 + r2))


# The combined model refuses money amounts beyond DBL_MAX / 64 as too large to compute
# (invalid, blaming the surplus; lib/src/models/combined.cpp, the header's rule).
COMBINED_MONEY_MAX = mp.mpf(1.7976931348623157e308) / 64


def o_breakdown(d1, d2, p, b1, b2, s, opens):
    """BRW (1986); Muthoo (1999) ch.4; the header's closed form (docs/models/complete-information.md
    s.4)."""
    if max(abs(b1), abs(b2), abs(s)) > COMBINED_MONEY_MAX:
        raise Invalid("a money amount beyond DBL_MAX/64 is too large to compute (header)")
    if p == 0 and d1 == 1 and d2 == 1:
        return None if s <= 0 else ("indet", None)
    a1, a2 = (1 - p) * d1, (1 - p) * d2
    n1 = p * b1 / (1 - a1) if p > 0 else mp.mpf(0)
    n2 = p * b2 / (1 - a2) if p > 0 else mp.mpf(0)
    if s <= n1 + n2:
        return ("nodeal", None)
    # the header states the accuracy relative to the share above the no-deal value
    scale = max(abs(s - n1 - n2), abs(n1), abs(n2))
    if opens:
        return ("ok", n1 + (s - n1 - n2) * (1 - a2) / (1 - a1 * a2), scale)
    return ("ok", s - (n2 + (s - n1 - n2) * (1 - a1) / (1 - a1 * a2)), scale)


def o_deadline(d1, d2, rounds, b1, b2, s, opens, p=0.0):
    """Ståhl (1972) by backward induction (docs/models/complete-information.md s.3: the
    last proposer keeps pie - b_responder; earlier proposers offer delta_r x the
    responder's next share).  With a breakdown risk p > 0 (appended in 1.1) there is no
    closed form here: the value is checked by the C++ tests against quad-precision
    backward induction."""
    if p != 0:
        return None
    t = int(rounds)
    if t == 0:
        return ("nodeal", None)
    if t > 200 or b1 < 0 or b2 < 0 or b1 + b2 >= s or d1 == 0 or d2 == 0:
        return None  # keep to the plain setting of s.3 (b_A + b_B <= pie)
    # proposer in round k (1-based): own when (k odd) == opens
    own_prop = [((k % 2 == 1) == bool(opens)) for k in range(1, t + 1)]
    # the last round
    own = s - b2 if own_prop[-1] else b1
    for k in range(t - 2, -1, -1):
        nxt_own = own
        if own_prop[k]:
            own = s - d2 * (s - nxt_own)
        else:
            own = d1 * nxt_own
    return ("ok", own)


def o_delay(f, stake, p, b):
    """Delay cost: stake - ((1-p) factor stake + p fallback) (docs/models/complete-information.md s.4)."""
    return ("ok", p * (stake - b) + (1 - p) * (1 - f) * stake)


def o_first(d1, d2, s):
    """docs/models/complete-information.md s.10: surplus (1-d_own)(1-d_oth)/(1-d_own d_oth); Rubinstein
    (1982)."""
    if d1 == 1 and d2 == 1:
        return None if s <= 0 else ("indet", None)
    if s <= 0:
        return ("nodeal", None)
    return ("ok", s * (1 - d1) * (1 - d2) / (1 - d1 * d2))


def o_nash(b1, b2, tau, s, a1, a2):
    """Nash (1950), generalised (Kalai 1977); linear utilities: b_o + tau (S - b_o - b_t)."""
    if a1 != 1 or a2 != 1:
        return None
    if s <= b1 + b2:
        return ("nodeal", None)
    return ("ok", b1 + tau * (s - b1 - b2))


def o_group(d, n, k, s):
    """Herrero (1985); Sutton (1986): S d^k (1-d)/(1-d^n); n = 1 takes S."""
    n, k = int(n), int(k)
    if k > n - 1:
        raise Invalid("position outside [0, n-1] (header)")
    if d == 1 and n >= 2 and s <= 0:
        return None
    if s <= 0:
        return ("nodeal", None)
    if n == 1:
        return ("ok", s)
    if d == 1:
        return ("indet", None)
    return ("ok", s * mp.power(d, k) * (1 - d) / (1 - mp.power(d, n)))


def o_majority(d, n, q, role, s):
    """Baron & Ferejohn (1989): proposer S (1 - d (q-1)/n), partner S d/n."""
    n, q = int(n), int(q)
    if q == 0:
        q = n // 2 + 1
    if q > n:
        raise Invalid("votes needed above parties (header)")
    if role == 1 and q < 2:
        raise Invalid("no coalition partner when q = 1 (header)")
    if s <= 0:
        return ("nodeal", None)
    if role == 0:
        return ("ok", s * (1 - d * mp.mpf(q - 1) / n))
    return ("ok", s * d / n)


def o_implied(s, d2, opens):
    """Inverse of Rubinstein (1982) with surplus 1 (the header's closed forms)."""
    if d2 == 0 or d2 == 1:
        return None  # the indeterminate edges: not generated here
    if opens:
        if s < 1 - d2:
            raise Invalid("share not reachable (header)")
        # 1 - m with m = (1 - s)(1 - d_oth)/(s d_oth), without cancellation
        return ("ok", (s * d2 - (1 - s) * (1 - d2)) / (s * d2))
    # other opens: 1 - m with m = (1 - s)(1 - d_oth)/(s + (1 - s)(1 - d_oth))
    return ("ok", s / (s + (1 - s) * (1 - d2)))


def o_screen(vh, vl, q, ds, db):
    """Fudenberg & Tirole (1983) setting; docs/models/complete-information.md s.12: max of pool, screen,
    skim."""
    if vh < vl:
        raise Invalid("high value below low value (header)")
    best = max(vl, q * ((1 - db) * vh + db * vl) + (1 - q) * ds * vl)
    if q > vl / vh:
        best = max(best, vh * ((q * vh - vl) + ds * (1 - q) * vl) / (vh - vl))
    return ("ok", best)


def o_probe(x, y, z, w):
    """DEALCALLPROBE returns its first argument (addin/README.md)."""
    return ("ok", x)


ORACLE = {
    "DEALFACTOR": o_factor, "DEALSHARE": o_share, "DEALSHARERATE": o_share_rates,
    "DEALSHARELIMIT": o_limit, "DEALBREAKDOWN": o_breakdown, "DEALDEADLINE": o_deadline,
    "DEALDELAYCOST": o_delay, "DEALFIRSTMOVER": o_first, "DEALNASH": o_nash,
    "DEALGROUP": o_group, "DEALMAJORITY": o_majority, "DEALIMPLIEDFACTOR": o_implied,
    "DEALSCREEN": o_screen, "DEALCALLPROBE": o_probe,
}

