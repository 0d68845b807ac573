// solve_rates and deadline_share_breakdown against independent computations:
// backward induction round by round in quad precision (libquadmath, 113 bits), written
// from the rules of the deadline game (docs/models/complete-information.md s.3, Stahl 1972; breakdown
// timing of its s.4, BRW 1986, Muthoo 1999 ch.4), and the factors from rates
// (Muthoo 1999 s.3.2, delta = exp(-r Delta)) evaluated in quad precision.
#include <catch2/catch.hpp>

#include <quadmath.h>

#include <cmath>
#include <cstring>
#include <random>

#include "models/combined.hpp"
#include "models/deadline.hpp"

namespace {

using Q = __float128;

// The deadline game with breakdown, rounds T..1 backward, A proposing in odd rounds:
// the last responder gets its deadline payoff; before that a responder's value of
// rejecting is p b + (1-p) d v (v its value next round); the proposer agrees when the
// surplus less that value is at least its own value of rejecting.  Returns own's value;
// *deal: an agreement on the path from round 1; *tie: some round's proposer is within
// 1e-9 x scale of indifferent (the status is then left unchecked).
Q deadline_bi(Q dO, Q dT, long T, Q bO, Q bT, Q S, bool own_opens, Q p, bool *deal, bool *tie) {
    const Q d[2] = {own_opens ? dO : dT, own_opens ? dT : dO};
    const Q b[2] = {own_opens ? bO : bT, own_opens ? bT : bO};
    const Q scale = fmaxq(fabsq(S), fmaxq(fabsq(bO), fabsq(bT)));
    Q v[2] = {b[0], b[1]};
    bool deal_from = false;  // agreement on the path from round t
    *tie = false;
    for (long t = T; t >= 1; --t) {
        const int P = (t % 2 == 1) ? 0 : 1, R = 1 - P;
        const Q cR = t == T ? b[R] : p * b[R] + (1 - p) * d[R] * v[R];
        const Q cP = t == T ? b[P] : p * b[P] + (1 - p) * d[P] * v[P];
        const bool agree = S - cR >= cP;
        if (fabsq(S - cR - cP) <= static_cast<Q>(1e-9) * scale) *tie = true;
        deal_from = agree || deal_from;
        v[P] = agree ? S - cR : cP;
        v[R] = cR;
    }
    *deal = deal_from;
    return own_opens ? v[0] : v[1];
}

std::mt19937_64 rng(101);
double uni(double lo, double hi) { return std::uniform_real_distribution<double>(lo, hi)(rng); }

}  // namespace

TEST_CASE("deadline_share_breakdown with p = 0 is deadline_share bit for bit", "[deadline][combined]") {
    for (int i = 0; i < 5000; ++i) {
        const double a = 1 - std::pow(10.0, uni(-9, 0)), b = 1 - std::pow(10.0, uni(-9, 0));
        const int64_t T = static_cast<int64_t>(std::pow(10.0, uni(0, 6)));
        const double S = std::pow(10.0, uni(-3, 9));
        const double bo = uni(-0.5, 0.6) * S, bt = uni(-0.5, 0.6) * S;
        const bool opens = i % 2;
        double v1, v2;
        int bad1, bad2;
        const int s1 = cto::core::deadline_share(a, b, T, bo, bt, S, opens, &v1, &bad1);
        const int s2 = cto::core::deadline_share_breakdown(a, b, T, bo, bt, S, opens, 0.0, &v2, &bad2);
        CHECK(s1 == s2);
        CHECK(std::memcmp(&v1, &v2, sizeof v1) == 0);
    }
}

TEST_CASE("deadline_share_breakdown against quad-precision backward induction", "[deadline][combined]") {
    // Source of the game: docs/models/complete-information.md s.3 (Stahl 1972) with the breakdown of
    // its s.4.
    double worst = 0;
    int deals = 0, nodeals = 0;
    for (int i = 0; i < 3000; ++i) {
        const double a = i % 7 == 0 ? 1.0 : 1 - std::pow(10.0, uni(-6, 0));
        const double b = 1 - std::pow(10.0, uni(-6, 0));
        const double p = i % 5 == 0 ? 1.0 : std::pow(10.0, uni(-8, 0));
        const long T = 1 + static_cast<long>(uni(0, 300));
        const double S = std::pow(10.0, uni(-3, 9)) * (i % 9 == 0 ? -0.3 : 1.0);
        const double bo = uni(-0.5, 0.7) * std::fabs(S), bt = uni(-0.5, 0.7) * std::fabs(S);
        const bool opens = i % 2;
        double v;
        int bad;
        const int st = cto::core::deadline_share_breakdown(a, b, T, bo, bt, S, opens, p, &v, &bad);
        bool deal = false, tie = false;
        const Q want = deadline_bi(a, b, T, bo, bt, S, opens, p, &deal, &tie);
        INFO("case " << i << " d " << a << "," << b << " p " << p << " T " << T << " b " << bo << "," << bt << " S " << S);
        REQUIRE((st == CTO_OK || st == CTO_E_NO_DEAL));
        if (!tie) CHECK((st == CTO_OK) == deal);
        (st == CTO_OK ? deals : nodeals)++;
        const double scale = std::fmax(std::fabs(S), std::fmax(std::fabs(bo), std::fabs(bt)));
        const double err = static_cast<double>(fabsq(static_cast<Q>(v) - want)) / scale;
        worst = std::fmax(worst, err);
        CHECK(err <= 2e-14);
    }
    WARN("deadline with breakdown vs quad BI: worst error / scale " << worst << "; deals " << deals << ", no deal " << nodeals);
    CHECK(deals > 1000);
    CHECK(nodeals > 50);
}

TEST_CASE("deadline_share: a share that is S (1 - d) keeps its relative accuracy", "[deadline][accuracy]") {
    // The case: two rounds, the other side makes the last offer and takes S; own
    // offers it d S first and keeps S (1 - d) (backward induction, docs/models/complete-information.md
    // s.3).
    double v;
    int bad;
    REQUIRE(cto::core::deadline_share(0.11440739460887106, 0.99999999, 2, 0, 0,
                                      0.21397515719186358, true, &v, &bad) == CTO_OK);
    const Q exact = static_cast<Q>(0.21397515719186358) * (1 - static_cast<Q>(0.99999999));
    CHECK(static_cast<double>(fabsq(static_cast<Q>(v) - exact) / exact) <= 1e-15);
    // (value from the issue: 2.1397515826703724e-09)
    CHECK(v == Approx(2.1397515826703724e-09).epsilon(1e-15));
}

TEST_CASE("solve_rates: factors from rates, full accuracy with offers minutes apart", "[combined][rates]") {
    // Rubinstein (1982) on factors exp(-rho), Muthoo (1999) s.3.2: own opening gets
    // S (1 - d_oth) / (1 - d_own d_oth); evaluated here in quad precision.
    double worst = 0;
    for (int i = 0; i < 2000; ++i) {
        cto::core::SolveRatesIn in{};
        in.own_rate = uni(0.001, 0.4);
        in.other_rate = uni(0.001, 0.4);
        in.days = std::pow(10.0, uni(-4, 2.5));  // about 9 seconds to 300 days
        in.own_outside = in.other_outside = -INFINITY;
        in.surplus = std::pow(10.0, uni(-3, 9));
        in.own_opens = i % 2;
        in.basis = 365;
        in.continuous = i % 3 == 0;
        cto::core::SolveOut o;
        int bad;
        REQUIRE(cto::core::solve_rates(in, &o, &bad) == CTO_OK);
        auto rho = [&](double r) {
            const Q c = in.continuous ? static_cast<Q>(r) : log1pq(static_cast<Q>(r));
            return c * static_cast<Q>(in.days) / static_cast<Q>(in.basis);
        };
        const Q om_own = -expm1q(-rho(in.own_rate)), om_oth = -expm1q(-rho(in.other_rate));
        const Q den = -expm1q(-(rho(in.own_rate) + rho(in.other_rate)));
        const Q S = in.surplus;
        const Q own = in.own_opens ? S * om_oth / den : S * (1 - om_own) * om_oth / den;
        const Q oth = in.own_opens ? S * (1 - om_oth) * om_own / den : S * om_own / den;
        const double e1 = static_cast<double>(fabsq(static_cast<Q>(o.own_share) - own) / own);
        const double e2 = static_cast<double>(fabsq(static_cast<Q>(o.other_share) - oth) / oth);
        worst = std::fmax(worst, std::fmax(e1, e2));
        CHECK(e1 <= 1e-14);
        CHECK(e2 <= 1e-14);
    }
    WARN("solve_rates vs quad Rubinstein on exp(-rho): worst relative error " << worst);
}

TEST_CASE("solve_rates equals solve on the factors round_factor gives", "[combined][rates]") {
    // Same model, same factors: where 1 - d is exact in the rounded factor (d >= 1/2,
    // Sterbenz) the two differ only by the rounding of d itself.
    for (int i = 0; i < 2000; ++i) {
        cto::core::SolveRatesIn r{};
        r.own_rate = uni(0.01, 0.5);
        r.other_rate = uni(0.01, 0.5);
        r.days = uni(30, 400);
        r.p = i % 2 ? uni(0, 0.2) : 0.0;
        r.own_fallback = uni(-0.2, 0.3);
        r.other_fallback = uni(-0.2, 0.3);
        r.own_inside = uni(-0.1, 0.3);
        r.other_inside = uni(-0.1, 0.3);
        r.own_outside = i % 3 ? uni(-0.2, 0.8) : -INFINITY;
        r.other_outside = i % 4 ? uni(-0.2, 0.8) : -INFINITY;
        r.surplus = 1;
        r.own_opens = i % 2;
        r.basis = 365;
        r.continuous = false;
        double fo, ft;
        int bad;
        cto::core::round_factor(r.own_rate, r.days, r.basis, false, &fo, &bad);
        cto::core::round_factor(r.other_rate, r.days, r.basis, false, &ft, &bad);
        const cto::core::SolveIn s{fo, ft, r.p, r.own_fallback, r.other_fallback, r.own_inside,
                                   r.other_inside, r.own_outside, r.other_outside, r.surplus,
                                   r.own_opens};
        cto::core::SolveOut a, b;
        const int sa = cto::core::solve_rates(r, &a, &bad), sb = cto::core::solve(s, &b, &bad);
        if (a.boundary || b.boundary) continue;
        CHECK(sa == sb);
        CHECK(a.rational == b.rational);
        CHECK(a.own_share == Approx(b.own_share).margin(1e-14));
        CHECK(a.other_share == Approx(b.other_share).margin(1e-14));
    }
}

TEST_CASE("solve_rates reports bad input by catalogue index", "[combined][rates]") {
    cto::core::SolveRatesIn r{0.1, 0.05, 30, 0, 0, 0, 0, 0, -INFINITY, -INFINITY, 1, true, 365, false};
    cto::core::SolveOut o;
    int bad = -2;
    REQUIRE(cto::core::solve_rates(r, &o, &bad) == CTO_OK);
    CHECK(bad == -1);
    const struct { double *field; double value; int index; } cases[] = {
        {&r.own_rate, -0.1, 0},    {&r.other_rate, NAN, 1},     {&r.days, -1, 2},
        {&r.p, 1.5, 3},            {&r.own_fallback, INFINITY, 4}, {&r.other_fallback, NAN, 5},
        {&r.own_inside, NAN, 6},   {&r.other_inside, -INFINITY, 7}, {&r.own_outside, INFINITY, 8},
        {&r.other_outside, NAN, 9}, {&r.surplus, NAN, 10},       {&r.basis, 0, 12}};
    for (const auto &c : cases) {
        const double keep = *c.field;
        *c.field = c.value;
        CHECK(cto::core::solve_rates(r, &o, &bad) == CTO_E_INVALID);
        CHECK(bad == c.index);
        CHECK(std::isnan(o.own_share));
        *c.field = keep;
    }
}
