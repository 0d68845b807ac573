// The combined model's outcome beyond the shares: the worked cases of issue 10, the
// no-deal payoffs of a rational deal, and each side's delay loss and the opening
// advantage against two solve calls.  The game: docs/models/combined.md (Rubinstein
// 1982; Binmore, Rubinstein & Wolinsky 1986; Shaked & Sutton 1984; Muthoo 1999 chs.4-6).
#include <catch2/catch.hpp>

#include <cmath>
#include <random>

#include "models/combined.hpp"

namespace {

using cto::core::SolveIn;
using cto::core::SolveOut;

SolveOut run(const SolveIn &in, int *st) {
    SolveOut o;
    int bad;
    *st = cto::core::solve(in, &o, &bad);
    return o;
}

// Backward induction in long double over `rounds` rounds of the game in which every
// offer is refused (docs/models/combined.md: a responder walks away when that is at
// least its value of rejecting; a side walked away from gets its walk-away value or its
// value of perpetual disagreement d0, which is also the value after the last round).
// Returns the payoffs of the side that opens and of the other.
void refused_game(const SolveIn &in, long rounds, long double *opener, long double *other) {
    const bool o = in.own_opens;
    const long double p = in.p;
    const long double d[2] = {o ? in.own_factor : in.other_factor, o ? in.other_factor : in.own_factor};
    const long double b[2] = {o ? in.own_fallback : in.other_fallback, o ? in.other_fallback : in.own_fallback};
    const long double g[2] = {o ? in.own_inside : in.other_inside, o ? in.other_inside : in.own_inside};
    const double w[2] = {o ? in.own_outside : in.other_outside, o ? in.other_outside : in.own_outside};
    long double d0[2], v[2];
    for (int i = 0; i < 2; ++i) {
        const long double a = (1 - p) * d[i];
        d0[i] = a == 1 ? g[i] : (p * b[i] + (1 - p) * (1 - d[i]) * g[i]) / (1 - a);
        v[i] = d0[i];
    }
    for (long t = rounds - 1; t >= 0; --t) {
        const int P = t % 2 == 0 ? 0 : 1, R = 1 - P;
        const long double cR = p * b[R] + (1 - p) * ((1 - d[R]) * g[R] + d[R] * v[R]);
        const long double cP = p * b[P] + (1 - p) * ((1 - d[P]) * g[P] + d[P] * v[P]);
        const bool walk = std::isfinite(w[R]) && w[R] >= cR;
        v[R] = walk ? w[R] : cR;
        v[P] = walk ? (std::isfinite(w[P]) ? w[P] : d0[P]) : cP;
    }
    *opener = v[0];
    *other = v[1];
}

std::mt19937_64 rng(10);
double uni(double lo, double hi) { return std::uniform_real_distribution<double>(lo, hi)(rng); }

}  // namespace

TEST_CASE("issue 10 worked case: the opener walks away only one round on", "[combined][game_tree]") {
    // Backward induction over the game tree (tests/reference/game_tree/game_tree.py,
    // 50 digits): 0.8094362548600626660..., 0.1905637451399373339...
    int st;
    const SolveOut o = run({0.9999787082350563, 0.9997979186187722, 0, 0, 0, 0.24516090126133086,
                            0.20927423291712718, 0.8094438040631461, 0.1905599633344914, 1, true},
                           &st);
    REQUIRE(st == CTO_OK);
    CHECK(o.rational);
    CHECK_FALSE(o.delayed);
    CHECK(o.own_share == Approx(0.80943625486006266603).epsilon(1e-15));
    CHECK(o.other_share == Approx(0.19056374513993733397).epsilon(1e-15));
    // Opened by the other side, own walks away at its first answer: no deal.
    const SolveOut r = run({0.9999787082350563, 0.9997979186187722, 0, 0, 0, 0.24516090126133086,
                            0.20927423291712718, 0.8094438040631461, 0.1905599633344914, 1, false},
                           &st);
    CHECK(st == CTO_E_NO_DEAL);
    CHECK(r.own_share == 0.8094438040631461);
    CHECK(r.other_share == 0.1905599633344914);
}

TEST_CASE("breakdown certain: an opener's walk-away value above the surplus is never used", "[combined]") {
    // p = 1: any rejection ends the talks with the fallbacks (docs/models/complete-information.md s.4:
    // an ultimatum with breakdown payoffs), so the opener never answers an offer: its offer S - b_B
    // beats its fallback b_A, a deal.  Derived from the game (docs/models/combined.md).
    int st;
    const SolveOut o = run({0.9, 0.8, 1.0, 0.1, 0.2, 0, 0, 5.0, -INFINITY, 1, true}, &st);
    REQUIRE(st == CTO_OK);
    CHECK(o.own_share == Approx(0.8).epsilon(1e-15));
    CHECK(o.other_share == Approx(0.2).epsilon(1e-15));
}

TEST_CASE("no-deal payoffs of a rational deal: the game with every offer refused", "[combined]") {
    int checked = 0;
    for (int i = 0; i < 3000; ++i) {
        SolveIn in{uni(0, 0.98), uni(0, 0.98), i % 3 ? uni(0, 1) : 0.0, uni(-0.3, 0.5), uni(-0.3, 0.5),
                   uni(-0.3, 0.5), uni(-0.3, 0.5), i % 4 ? uni(-0.5, 1.2) : -INFINITY,
                   i % 5 ? uni(-0.5, 1.2) : -INFINITY, 1.0, i % 2 == 0};
        int st;
        const SolveOut o = run(in, &st);
        if (st != CTO_OK) continue;
        long double op, ot;
        refused_game(in, 4001, &op, &ot);
        const long double own = in.own_opens ? op : ot, oth = in.own_opens ? ot : op;
        INFO("case " << i);
        CHECK(std::fabs(o.own_no_deal - own) <= 1e-12L);
        CHECK(std::fabs(o.other_no_deal - oth) <= 1e-12L);
        ++checked;
    }
    CHECK(checked > 1000);
}

TEST_CASE("delay losses and opening advantage equal two solve calls", "[combined]") {
    // Definitions (docs/models/combined.md): loss_i = V_i - [p b_i + (1-p)((1-d_i) g_i +
    // d_i V_i']] with V' the payoffs of the game the other side opens; advantage = own's
    // payoff opening minus responding.  Without options, breakdown and status quo the
    // opener's loss is x (1 - d_open^2) and the advantage Rubinstein's first-mover
    // advantage S (1-d_A)(1-d_B)/(1 - d_A d_B) (docs/models/complete-information.md s.10).
    for (int i = 0; i < 5000; ++i) {
        SolveIn in{uni(0, 1), uni(0, 1), i % 3 ? uni(0, 1) : 0.0, uni(-0.3, 0.5), uni(-0.3, 0.5),
                   uni(-0.3, 0.5), uni(-0.3, 0.5), i % 4 ? uni(-0.5, 1.2) : -INFINITY,
                   i % 5 ? uni(-0.5, 1.2) : -INFINITY, std::pow(10.0, uni(-3, 9)), i % 2 == 0};
        for (double *m : {&in.own_fallback, &in.other_fallback, &in.own_inside, &in.other_inside,
                          &in.own_outside, &in.other_outside})
            *m *= in.surplus;
        int st, st2;
        const SolveOut o = run(in, &st);
        SolveIn flip = in;
        flip.own_opens = !in.own_opens;
        const SolveOut f = run(flip, &st2);
        if (st == CTO_E_INDETERMINATE || st2 == CTO_E_INDETERMINATE) continue;
        const double p = in.p;
        auto cont = [&](double d, double b, double g, double v) {
            return p * b + (1 - p) * ((1 - d) * g + d * v);
        };
        const double scale = in.surplus * 4;
        INFO("case " << i);
        CHECK(o.own_delay_loss ==
              Approx(o.own_share - cont(in.own_factor, in.own_fallback, in.own_inside, f.own_share)).margin(1e-14 * scale));
        CHECK(o.other_delay_loss ==
              Approx(o.other_share - cont(in.other_factor, in.other_fallback, in.other_inside, f.other_share)).margin(1e-14 * scale));
        const double adv = in.own_opens ? o.own_share - f.own_share : f.own_share - o.own_share;
        CHECK(o.opening_advantage == Approx(adv).margin(1e-14 * scale));
    }
    int st;
    const SolveOut r = run({0.8, 0.8, 0, 0, 0, 0, 0, -INFINITY, -INFINITY, 1, true}, &st);
    CHECK(r.opening_advantage == Approx(1.0 / 9.0).epsilon(1e-15));    // complete-information.md s.10 example
    CHECK(r.own_delay_loss == Approx((1 - 0.64) / 1.8).epsilon(1e-15));  // (1 - d^2) x*, x* = 1/1.8
    CHECK(r.other_delay_loss == 0.0);
}
