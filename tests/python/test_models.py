"""Every function against references outside the library.

Each check names its source: a published result (with its "check value" number: the
row of the 50-digit table of published and independently computed values the models
were specified with), mpmath at 50 digits evaluating a published closed form,
scipy.optimize maximising the Nash product, scipy.optimize.brentq on the stationarity
conditions, or a backward induction written in this file.  "models s.N" is section N of
docs/models/complete-information.md; "the contract" is docs/reference/functions.md.
"""

import math

import mpmath
import numpy as np
import pytest
from scipy import optimize

import counteroffer as co
from oracles import stationary_shares

mpmath.mp.dps = 50
FACTORS = [0.0, 0.3, 0.5, 0.9, 0.95, 0.999, 0.999999]


def close(got, want, rtol=2e-15, atol=1e-16):
    assert abs(got - float(want)) <= atol + rtol * abs(float(want)), (got, float(want))


# ---- backward inductions written here --------------------------------------------
def bi_finite(dA, dB, S, T, bA=0.0, bB=0.0):
    """Stahl (1972) finite alternating offers, A proposes in round 1 (models s.3):
    the last proposer keeps S - b_responder; earlier, the proposer offers the responder
    delta_responder times the responder's next-round proposer payoff."""
    last_A = T % 2 == 1  # A proposes in odd rounds
    # v = proposer's payoff in the current round, in that round's money
    v = S - (bB if last_A else bA)
    proposer_is_A = last_A
    for _ in range(T - 1):
        proposer_is_A = not proposer_is_A
        d_resp = dB if proposer_is_A else dA
        v = S - d_resp * v
    assert proposer_is_A
    return v


# ---- discounting -----------------------------------------------------------------
@pytest.mark.parametrize("rate", [0.0, 0.01, 0.08, 0.5, 3.0])
@pytest.mark.parametrize("days", [0.0, 1e-5, 1.0, 30.0, 365.0, 3650.0])
def test_round_factor_mpmath(rate, days):
    # Standard compounding (common practice, no source), at 50 digits with mpmath.
    # A rate of 300% a year is outside the plausible range on purpose: it stays valid.
    r, t = mpmath.mpf(rate), mpmath.mpf(days) / 365
    with co.errstate(implausible="ignore"):
        close(co.round_factor(rate, days), (1 + r) ** (-t))
        close(co.round_factor(rate, days, continuous=True), mpmath.exp(-r * t))
        close(co.round_factor(rate, days, basis=360), (1 + r) ** (-mpmath.mpf(days) / 360))


# ---- Rubinstein (1982) ------------------------------------------------------------
def rubinstein_mp(d1, d2, S=1, opens=True):
    d1, d2 = mpmath.mpf(d1), mpmath.mpf(d2)
    x = S * (1 - d2) / (1 - d1 * d2)
    return x if opens else S * d1 * (1 - d2) / (1 - d1 * d2)


@pytest.mark.parametrize("d1", FACTORS)
@pytest.mark.parametrize("d2", FACTORS)
def test_share_mpmath(d1, d2):
    # Rubinstein (1982) main theorem; Muthoo (1999) ch.3; mpmath at 50 digits.
    for opens in (True, False):
        close(co.share(d1, d2, surplus=7.5, own_opens=opens),
              rubinstein_mp(d1, d2, 7.5, opens), atol=1e-15)


@pytest.mark.parametrize("d1,d2", [(0.5, 0.5), (0.95, 0.9), (0.9, 0.8), (0.3, 0.99)])
def test_share_backward_induction(d1, d2):
    # Rubinstein (1982): the limit of Stahl's finite game, backward induction T = 4001
    close(co.share(d1, d2), bi_finite(d1, d2, 1.0, 4001), rtol=1e-13)
    # check value(s) 9 and 14 (d = 0.5 -> 2/3; 0.95/0.9 -> 0.689655172413793)
    close(co.share(0.5, 0.5), mpmath.mpf(2) / 3)
    close(co.share(0.95, 0.9), 0.689655172413793, rtol=1e-14)


def test_share_one_patient_party():
    # check value(s) 79-81 (one factor 1, and the ultimatum game d = 0)
    assert co.share(1.0, 0.9) == 1.0
    assert co.share(0.9, 1.0) == 0.0
    assert co.share(0.0, 0.0) == 1.0


@pytest.mark.parametrize("r1,r2,days", [(0.10, 0.05, 365.0), (0.10, 0.05, 36.5),
                                        (0.1, 0.1, 365.0), (0.07, 0.12, 1.0 / 86400),
                                        (0.2, 0.03, 1e-9)])
def test_share_from_rates_mpmath(r1, r2, days):
    # Rubinstein (1982) with delta = exp(-r Delta) (Muthoo 1999 s.3.2); mpmath at 50
    # digits, including offers a second apart where 1 - delta cancels in double.
    for cont in (True, False):
        c = (lambda r: mpmath.mpf(r)) if cont else (lambda r: mpmath.log1p(mpmath.mpf(r)))
        t = mpmath.mpf(days) / 365
        d1, d2 = mpmath.exp(-c(r1) * t), mpmath.exp(-c(r2) * t)
        for opens in (True, False):
            want = rubinstein_mp(d1, d2, 1, opens)
            close(co.share_from_rates(r1, r2, days, own_opens=opens, continuous=cont), want,
                  rtol=4e-15)
    if days == 365.0 and (r1, r2) == (0.10, 0.05):
        # check value(s) 10 (continuous rates, Delta = 1 year)
        close(co.share_from_rates(0.10, 0.05, 365, continuous=True), 0.350131861448953,
              rtol=1e-14)


def test_limit_share_scipy_nash_product():
    # BRW (1986): as offers become frequent the split maximises x^tau (1-x)^(1-tau),
    # tau = r2/(r1+r2); check value(s) 12. Maximised here with scipy.optimize.
    for r1, r2 in [(0.10, 0.05), (0.3, 0.3), (0.02, 0.5)]:
        tau = r2 / (r1 + r2)
        res = optimize.minimize_scalar(
            lambda x: -(tau * math.log(x) + (1 - tau) * math.log(1 - x)),
            bounds=(1e-12, 1 - 1e-12), method="bounded", options={"xatol": 1e-12})
        assert abs(co.limit_share(r1, r2) - res.x) < 1e-8
        close(co.limit_share(r1, r2, surplus=3.0), 3 * mpmath.mpf(r2) / (r1 + r2))
        # the limit of share_from_rates as days -> 0 (mpmath, continuous rates)
        close(co.share_from_rates(r1, r2, 1e-7, continuous=True), co.limit_share(r1, r2),
              rtol=1e-9)


# ---- breakdown, outside and inside options ------------------------------------------
@pytest.mark.parametrize("dA,dB,p,bA,bB", [(0.95, 0.9, 0.05, 0.2, 0.1),
                                           (1.0, 1.0, 0.1, 0.2, 0.1),
                                           (0.9, 0.8, 0.3, 0.0, 0.25),
                                           (0.99, 0.97, 0.01, -0.1, 0.3)])
def test_breakdown_share_backward_induction(dA, dB, p, bA, bB):
    # BRW (1986); Muthoo (1999) ch.4; models s.4 timing; BI written here
    x, y = stationary_shares(1.0, dA, dB, p=p, bA=bA, bB=bB)
    close(co.breakdown_share(dA, dB, p, bA, bB), x, rtol=1e-12, atol=1e-14)
    close(co.breakdown_share(dA, dB, p, bA, bB, own_opens=False), 1 - y, rtol=1e-12,
          atol=1e-14)


def test_breakdown_share_published_values():
    # check value(s) 33-36 (Muthoo 1999 ch.4; BRW 1986)
    close(co.breakdown_share(1, 1, 0.1, 0.2, 0.1), 0.568421052631579, rtol=1e-14)
    close(1 - co.breakdown_share(1, 1, 0.1, 0.2, 0.1), 0.431578947368421, rtol=1e-14)
    with pytest.warns(co.ImplausibleInputWarning, match="breakdown_prob = 1.0"):
        close(co.breakdown_share(1, 1, 1.0, 0.2, 0.1), 0.9, rtol=1e-15)  # valid, unusual
    close(co.breakdown_share(0.95, 0.9, 0.05, 0.2, 0.1), 0.650500848431770, rtol=1e-14)


@pytest.mark.parametrize("dA,dB,wA,wB,a_prop,b_prop", [
    # check value(s) 40-49: (A proposing, B proposing) shares of the proposer
    (0.9, 0.9, 0.0, 0.3, 0.526315789473684, 0.526315789473684),
    (0.9, 0.9, 0.0, 0.5, 0.5, 0.55),
    (0.9, 0.9, 0.5, 0.0, 0.55, 0.5),
    (0.5, 0.5, 0.4, 0.4, 0.6, 0.6),
    (0.95, 0.9, 0.2, 0.45, 0.55, 0.4775),
])
def test_outside_option_share_published_and_bi(dA, dB, wA, wB, a_prop, b_prop):
    # Shaked & Sutton (1984); Binmore, Shaked & Sutton (1989); Muthoo (1999) ch.5
    close(co.outside_option_share(dA, dB, wA, wB), a_prop, rtol=1e-14)
    close(co.outside_option_share(dA, dB, wA, wB, own_opens=False), 1 - b_prop, rtol=1e-14)
    x, y = stationary_shares(1.0, dA, dB, wA=wA, wB=wB)  # backward induction written here
    close(co.outside_option_share(dA, dB, wA, wB), x, rtol=1e-12)
    close(co.outside_option_share(dA, dB, wA, wB, own_opens=False), 1 - y, rtol=1e-12)


def test_outside_option_no_deal():
    # check value(s) 83: w_A + w_B > pie -> A gets its option 0.6, no agreement
    with pytest.warns(co.NoDealWarning):
        close(co.outside_option_share(0.9, 0.9, 0.6, 0.5), 0.6)


@pytest.mark.parametrize("dA,dB,gA,gB", [(0.9, 0.9, 0.1, 0.3), (0.95, 0.8, 0.0, 0.2),
                                         (0.5, 0.99, 0.3, 0.3)])
def test_inside_option_share_bi(dA, dB, gA, gB):
    # Muthoo (1999) ch.6: status-quo flow (1-d) g per round while talks go on; BI here
    x, y = stationary_shares(1.0, dA, dB, gA=gA, gB=gB)
    close(co.inside_option_share(dA, dB, gA, gB), x, rtol=1e-12)
    close(co.inside_option_share(dA, dB, gA, gB, own_opens=False), 1 - y, rtol=1e-12)
    if (dA, dB, gA, gB) == (0.9, 0.9, 0.1, 0.3):
        close(co.inside_option_share(dA, dB, gA, gB), 0.415789473684211, rtol=1e-14)  # row 51


@pytest.mark.parametrize("case", [
    dict(dA=0.95, dB=0.9, p=0.05, bA=0.2, bB=0.1, gA=0.0, gB=0.0, wA=None, wB=None),
    dict(dA=0.9, dB=0.85, p=0.0, bA=0.0, bB=0.0, gA=0.1, gB=0.2, wA=None, wB=0.45),
    dict(dA=0.97, dB=0.9, p=0.02, bA=0.1, bB=0.05, gA=0.05, gB=0.1, wA=0.3, wB=0.35),
    dict(dA=0.5, dB=0.6, p=0.2, bA=0.0, bB=0.1, gA=0.0, gB=0.0, wA=0.4, wB=0.4),
])
def test_solve_backward_induction(case):
    # the contract 'solve': the combined stationary conditions; BI written here
    c = case
    inf = -math.inf
    x, y = stationary_shares(1.0, c["dA"], c["dB"], c["p"], c["bA"], c["bB"], c["gA"],
                             c["gB"], inf if c["wA"] is None else c["wA"],
                             inf if c["wB"] is None else c["wB"])
    r = co.solve(c["dA"], c["dB"], c["p"], c["bA"], c["bB"], c["gA"], c["gB"], c["wA"], c["wB"])
    close(r.own_share, x, rtol=1e-12)
    close(r.own_share + r.other_share, 1.0, rtol=1e-15)
    r2 = co.solve(c["dA"], c["dB"], c["p"], c["bA"], c["bB"], c["gA"], c["gB"], c["wA"],
                  c["wB"], own_opens=False)
    close(r2.own_share, 1 - y, rtol=1e-12)


def test_solve_agrees_with_special_functions():
    # the contract: each special function is solve with the other features off and
    # "must agree with solve to the last digits".
    rng = np.random.default_rng(20261202)
    n = 2000
    dA, dB = rng.uniform(0, 0.999, n), rng.uniform(0, 0.999, n)
    p = rng.uniform(0, 0.5, n)
    b1, b2 = rng.uniform(0, 0.3, n), rng.uniform(0, 0.3, n)
    opens = rng.integers(0, 2, n).astype(bool)
    S = rng.uniform(1, 10, n)
    with co.errstate(all="ignore"):
        pairs = [
            (co.solve(dA, dB, surplus=S, own_opens=opens)["own_share"],
             co.share(dA, dB, S, opens)),
            (co.solve(dA, dB, p, b1, b2, surplus=S, own_opens=opens)["own_share"],
             co.breakdown_share(dA, dB, p, b1, b2, S, opens)),
            (co.solve(dA, dB, own_outside=b1, other_outside=b2, surplus=S,
                      own_opens=opens)["own_share"],
             co.outside_option_share(dA, dB, b1, b2, S, opens)),
            (co.solve(dA, dB, own_inside=b1, other_inside=b2, surplus=S,
                      own_opens=opens)["own_share"],
             co.inside_option_share(dA, dB, b1, b2, S, opens)),
        ]
    for a, b in pairs:
        np.testing.assert_allclose(a, b, rtol=1e-14, atol=1e-15)


# ---- deadline, fixed costs, delay -------------------------------------------------
@pytest.mark.parametrize("T,dA,dB,bA,bB,want", [
    # check value(s) 23-32 (Stahl 1972; closed forms of s.3)
    (1, 0.9, 0.9, 0, 0, 1.0), (2, 0.9, 0.9, 0, 0, 0.1), (3, 0.9, 0.9, 0, 0, 0.91),
    (4, 0.9, 0.9, 0, 0, 0.181), (10, 0.9, 0.9, 0, 0, 0.342800821),
    (11, 0.9, 0.9, 0, 0, 0.6914792611), (5, 0.95, 0.9, 0, 0, 0.916525),
    (6, 0.95, 0.9, 0, 0, 0.2586025), (3, 0.9, 0.9, 0.1, 0.2, 0.748),
    (4, 0.95, 0.9, 0.1, 0.2, 0.26245),
])
def test_deadline_share_published(T, dA, dB, bA, bB, want):
    close(co.deadline_share(dA, dB, T, bA, bB), want, rtol=1e-14)
    close(co.deadline_share(dA, dB, T, bA, bB), bi_finite(dA, dB, 1.0, T, bA, bB), rtol=1e-13)


@pytest.mark.parametrize("T", [1, 2, 7, 50, 999, 1000, 12345])
def test_deadline_share_backward_induction(T):
    # Stahl (1972) finite horizon; BI written here, both opening orders
    dA, dB, bA, bB, S = 0.97, 0.93, 0.05, 0.15, 2.5
    close(co.deadline_share(dA, dB, T, bA, bB, surplus=S), bi_finite(dA, dB, S, T, bA, bB),
          rtol=1e-12)
    # other opens: own's payoff is S minus the other side's round-1 proposer payoff
    close(co.deadline_share(dA, dB, T, bA, bB, surplus=S, own_opens=False),
          S - bi_finite(dB, dA, S, T, bB, bA), rtol=1e-12, atol=1e-14)


def test_deadline_share_long_horizon_is_rubinstein():
    # models s.3: as T -> infinity the shares converge to Rubinstein's
    close(co.deadline_share(0.9, 0.95, 2**62), float(rubinstein_mp(0.9, 0.95)), rtol=1e-14)


@pytest.mark.parametrize("c1,c2,S,opens,want", [
    # check value(s) 15-20 (Rubinstein 1982, fixed-cost case); own = player 1,
    # rows with player 2 proposing give own = pie - player 2's share
    (0.1, 0.2, 1.0, True, 1.0), (0.1, 0.2, 1.0, False, 0.9),
    (0.2, 0.1, 1.0, True, 0.1), (0.2, 0.1, 1.0, False, 0.0),
    (20.0, 10.0, 1000.0, True, 10.0), (20.0, 10.0, 1000.0, False, 0.0),
])
def test_fixed_cost_share_published(c1, c2, S, opens, want):
    close(co.fixed_cost_share(c1, c2, S, opens), want, rtol=1e-15, atol=1e-15)


def test_delay_cost_mpmath():
    # models s.10: stake - ((1-p) factor stake + p fallback), mpmath at 50 digits
    for f, s, p, b in [(0.98, 3e6, 0.05, 1e6), (0.9999999, 1.0, 0.0, 0.0), (0.5, -2.0, 0.3, 4.0)]:
        F, Sm, P, B = map(mpmath.mpf, (f, s, p, b))
        close(co.delay_cost(f, s, p, b), Sm - ((1 - P) * F * Sm + P * B), rtol=1e-14, atol=1e-22)


def test_first_mover_advantage_published():
    # check value(s) 78: r = 0.10, 0.05 per year, monthly offers, pie 1000
    d1, d2 = math.exp(-0.10 / 12), math.exp(-0.05 / 12)
    close(co.first_mover_advantage(d1, d2, 1000.0), 2.77776974025657, rtol=1e-12)
    for a, b in [(0.9, 0.8), (0.5, 0.99), (0.0, 0.3)]:  # models s.10 formula, mpmath
        A, B = mpmath.mpf(a), mpmath.mpf(b)
        close(co.first_mover_advantage(a, b), (1 - A) * (1 - B) / (1 - A * B))


# ---- Nash bargaining and risk aversion ------------------------------------------
@pytest.mark.parametrize("bo,bt,tau,S,a,b", [
    (0.1, 0.2, 0.5, 1.0, 1.0, 1.0), (0.1, 0.2, 0.3, 1.0, 1.0, 1.0),
    (0.0, 0.0, 0.5, 1.0, 0.5, 1.0), (0.1, 0.2, 0.5, 1.0, 0.5, 1.0),
    (2.0, 1.0, 0.7, 10.0, 0.3, 0.8), (0.0, 0.5, 0.2, 3.0, 1.0, 0.6),
])
def test_nash_share_scipy_maximisation(bo, bt, tau, S, a, b):
    # Nash (1950); Kalai (1977); Muthoo (1999) ch.2: maximise the (log) Nash product
    # (u_o(x) - u_o(b_o))^tau (u_t(S-x) - u_t(b_t))^(1-tau) with scipy.optimize.
    def neg_log(x):
        return -(tau * math.log(x ** a - bo ** a) + (1 - tau) * math.log((S - x) ** b - bt ** b))

    lo, hi = bo, S - bt
    eps = 1e-12 * S
    res = optimize.minimize_scalar(neg_log, bounds=(lo + eps, hi - eps), method="bounded",
                                   options={"xatol": 1e-13 * S})
    got = co.nash_share(bo, bt, tau, S, a, b)
    assert abs(got - res.x) < 1e-7 * S
    # and the first-order condition solved with scipy.optimize.brentq (models s.8)
    foc = lambda x: (tau * a * x ** (a - 1) / (x ** a - bo ** a)
                     - (1 - tau) * b * (S - x) ** (b - 1) / ((S - x) ** b - bt ** b))
    root = optimize.brentq(foc, lo + eps, hi - eps, xtol=1e-15, rtol=8.9e-16)
    close(got, root, rtol=1e-11)


def test_nash_share_published():
    # check value(s) 54-57 (Nash 1950; Kalai 1977; Muthoo 1999 ch.2)
    close(co.nash_share(0.1, 0.2), 0.45, rtol=1e-15)
    close(co.nash_share(0.1, 0.2, 0.3), 0.31, rtol=1e-15)
    close(co.nash_share(0, 0, 0.5, 1, 0.5, 1), mpmath.mpf(1) / 3, rtol=1e-15)
    close(co.nash_share(0.1, 0.2, 0.5, 1, 0.5, 1), 0.4, rtol=1e-14)


def cara(k):
    u = lambda x: -math.expm1(-k * x) / k
    inv = lambda v: -math.log1p(-k * v) / k
    return u, inv


def brentq_exponential(dA, dB, kA, kB, S, p=0.0, bA=0.0, bB=0.0):
    """BRW (1986); Muthoo (1999) ch.3-4 stationarity conditions with CARA utilities,
    reduced to one equation in x (A's share as opener) and solved with scipy's brentq:
        u_B(S - x) = p u_B(b_B) + (1-p) d_B u_B(y),
        u_A(S - y) = p u_A(b_A) + (1-p) d_A u_A(x)."""
    uA, invA = cara(kA)
    uB, _ = cara(kB)

    def f(x):
        y = S - invA(p * uA(bA) + (1 - p) * dA * uA(x))
        return uB(S - x) - (p * uB(bB) + (1 - p) * dB * uB(y))

    return optimize.brentq(f, 0.0, S, xtol=1e-300, rtol=8.9e-16, maxiter=500)


@pytest.mark.parametrize("dA,dB,kA,kB,S", [
    (math.exp(-0.1), math.exp(-0.05), 2.0, 0.5, 1.0), (0.9, 0.95, 1.0, 1.0, 1.0),
    (0.99, 0.98, 0.3, 3.0, 2.0), (0.5, 0.7, 5.0, 0.01, 1.0), (0.97, 0.9, 2e-7, 1e-7, 2e7),
])
def test_risk_averse_exponential_brentq(dA, dB, kA, kB, S):
    got = co.risk_averse_share(dA, dB, kA, kB, "exponential", surplus=S)
    close(got, brentq_exponential(dA, dB, kA, kB, S), rtol=1e-12, atol=1e-15 * S)
    # other opens: own's payoff is S - (other's opener share with roles swapped)
    got2 = co.risk_averse_share(dA, dB, kA, kB, "exponential", surplus=S, own_opens=False)
    close(got2, S - brentq_exponential(dB, dA, kB, kA, S), rtol=1e-12, atol=1e-15 * S)


def test_risk_averse_exponential_published_and_breakdown():
    # check value(s) 59: kA = 2, kB = 0.5, rA = 0.1, rB = 0.05, Delta = 1
    close(co.risk_averse_share(math.exp(-0.1), math.exp(-0.05), 2, 0.5, "exponential"),
          0.324276325976081, rtol=1e-13)
    # with breakdown risk and fallbacks: brentq on the stationarity conditions above
    got = co.risk_averse_share(0.95, 0.9, 1.5, 0.7, "exponential", 0.1, 0.1, 0.2)
    close(got, brentq_exponential(0.95, 0.9, 1.5, 0.7, 1.0, 0.1, 0.1, 0.2), rtol=1e-12)


@pytest.mark.parametrize("d1,d2,a,b", [(0.9, 0.9, 0.5, 1.0), (0.95, 0.8, 0.3, 0.7),
                                       (0.99, 0.999, 1.0, 0.2)])
def test_risk_averse_power_mpmath(d1, d2, a, b):
    # models s.8 CRRA closed form: Rubinstein with effective factors d^(1/a), mpmath
    e1 = mpmath.mpf(d1) ** (1 / mpmath.mpf(a))
    e2 = mpmath.mpf(d2) ** (1 / mpmath.mpf(b))
    close(co.risk_averse_share(d1, d2, a, b), rubinstein_mp(e1, e2), rtol=1e-14)
    if (d1, d2, a, b) == (0.9, 0.9, 0.5, 1.0):
        close(co.risk_averse_share(d1, d2, a, b), 0.369003690036900, rtol=1e-14)  # row 58


# ---- more than two parties --------------------------------------------------------
def test_group_share_published_and_mpmath():
    # Herrero (1985); Sutton (1986); Osborne & Rubinstein (1990) s.3.13; rows 61-64
    close(co.group_share(0.9, 3), 0.369003690036900, rtol=1e-14)
    close(co.group_share(0.9, 3, 2), 0.298892988929889, rtol=1e-14)
    close(co.group_share(0.95, 5), 0.221024698128612, rtol=1e-14)
    close(co.group_share(0.95, 5, 4), 0.180025998030117, rtol=1e-14)
    for d, n, k in [(0.999999, 7, 3), (0.5, 40, 39), (0.9, 1, 0)]:
        D = mpmath.mpf(d)
        want = D ** k * (1 - D) / (1 - D ** n) if n > 1 else 1
        close(co.group_share(d, n, k), want, rtol=1e-14)


@pytest.mark.parametrize("d,n,q,prop,partner", [
    # check value(s) 65-70 (Baron & Ferejohn 1989, closed rule)
    (0.9, 5, 3, 0.64, 0.18), (0.95, 101, 51, 0.529702970297030, 0.00940594059405941),
    (0.9, 5, 5, 0.28, 0.18),
])
def test_majority_share_published(d, n, q, prop, partner):
    close(co.majority_share(d, n, q), prop, rtol=1e-14)
    close(co.majority_share(d, n, q, "partner"), partner, rtol=1e-14)
    if q == n // 2 + 1:  # votes_needed=None is a simple majority (the contract)
        close(co.majority_share(d, n), prop, rtol=1e-14)


# ---- inverse problems and sensitivities ----------------------------------------------
@pytest.mark.parametrize("d1,d2", [(0.97, 0.95), (0.5, 0.9), (0.1, 0.3), (0.999, 0.99)])
def test_implied_factor_mpmath(d1, d2):
    # Inverse of Rubinstein (1982), solved at 50 digits with mpmath.findroot
    for opens in (True, False):
        s = co.share(d1, d2, own_opens=opens)
        f = lambda x: rubinstein_mp(x, d2, 1, opens) - mpmath.mpf(s)
        root = mpmath.findroot(f, mpmath.mpf(d1))
        close(co.implied_factor(s, d2, opens), root, rtol=1e-12)


@pytest.mark.parametrize("r1,r2,days", [(0.10, 0.15, 14.0), (0.05, 0.02, 90.0),
                                        (0.3, 0.1, 1.0)])
def test_implied_rate_mpmath(r1, r2, days):
    # Inverse of share_from_rates (Rubinstein 1982; Muthoo 1999 s.3.2), mpmath.findroot
    t = mpmath.mpf(days) / 365
    for opens in (True, False):
        s = co.share_from_rates(r1, r2, days, own_opens=opens)

        def f(r):
            d1 = (1 + r) ** (-t)
            d2 = (1 + mpmath.mpf(r2)) ** (-t)
            return rubinstein_mp(d1, d2, 1, opens) - mpmath.mpf(s)

        close(co.implied_rate(s, r2, days, opens), mpmath.findroot(f, mpmath.mpf(r1)),
              rtol=1e-9)


@pytest.mark.parametrize("r1,r2,days", [(0.10, 0.15, 14.0), (0.08, 0.08, 365.0),
                                        (0.2, 0.01, 1e-3)])
def test_share_sensitivity_mpmath_diff(r1, r2, days):
    # Exact derivative of share_from_rates, against mpmath.diff at 50 digits
    for cont in (False, True):
        for opens in (True, False):
            def sh(a, b):
                c = (lambda r: r) if cont else mpmath.log1p
                t = mpmath.mpf(days) / 365
                return rubinstein_mp(mpmath.exp(-c(a) * t), mpmath.exp(-c(b) * t), 2, opens)

            d_own = mpmath.diff(lambda a: sh(a, mpmath.mpf(r2)), mpmath.mpf(r1))
            d_oth = mpmath.diff(lambda b: sh(mpmath.mpf(r1), b), mpmath.mpf(r2))
            kw = dict(surplus=2.0, own_opens=opens, continuous=cont)
            close(co.share_sensitivity(r1, r2, days, **kw), d_own, rtol=1e-13)
            close(co.share_sensitivity(r1, r2, days, "other", **kw), d_oth, rtol=1e-13)


# ---- incomplete information ---------------------------------------------------------
@pytest.mark.parametrize("q,want", [(0.45, 0.5175), (0.8, 0.78), (0.3, 0.5)])
def test_screening_profit_published(q, want):
    # check value(s) 71-73 (Fudenberg & Tirole 1983 setting): vH=1, vL=0.5,
    # ds=0.9, db=0.8; the values are the derived formula's (the grid check is 1e-3)
    close(co.screening_profit(1.0, 0.5, q, 0.9, 0.8), want, rtol=1e-14)
