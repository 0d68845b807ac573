// Published check values, numbered 9 to 84: each was computed with mpmath at 50 digits
// and confirmed by an independent method (backward induction over a long game, root
// finding, numerical maximisation with scipy, a grid search for the screening values) and
// written to 15 significant digits; tests/reference/generate.py reproduces those of its
// tables with its own methods (its list PUBLISHED, under the same numbers).  Each check
// names its number and source.  Values are compared to 5e-15 relative (15 significant
// digits) unless the exact value is known (then to 1e-15).  Sections "s.N" are those of
// docs/models/complete-information.md.
#include <catch2/catch.hpp>

#include <cmath>

#include "counteroffer/counteroffer.h"

namespace {
double rel(double got, double want) {
    return want == 0.0 ? std::fabs(got) : std::fabs(got - want) / std::fabs(want);
}
#define CHECK_VALUE(call, want, tol)          \
    do {                                      \
        v_ = -1.0;                            \
        const int st_ = (call);               \
        INFO(#call << " = " << v_);           \
        CHECK(st_ == CTO_OK);                 \
        CHECK(rel(v_, (want)) <= (tol));      \
    } while (0)
constexpr double k15 = 5e-15;  // 15 significant digits as printed in the table
constexpr double kExact = 1e-15;
}  // namespace

TEST_CASE("Rubinstein (1982) shares, check values 9-14", "[published]") {
    double v_;
    // Value 9: d1 = d2 = 0.5, proposer 1/(1+d) = 2/3. Rubinstein (1982) theorem.
    CHECK_VALUE(cto_share(0.5, 0.5, 1, 1, &v_), 2.0 / 3.0, kExact);
    // Value 10: r = (0.10, 0.05), Delta = 1 year, continuous; Muthoo (1999) s.3.2.
    CHECK_VALUE(cto_share_from_rates(0.10, 0.05, 365, 1, 1, 365, 1, &v_), 0.350131861448953, k15);
    // Value 11: the same with Delta = 0.1.
    CHECK_VALUE(cto_share_from_rates(0.10, 0.05, 36.5, 1, 1, 365, 1, &v_), 0.335001381935802, k15);
    // Value 12: the limit r2/(r1+r2) = 1/3; BRW (1986).
    CHECK_VALUE(cto_limit_share(0.10, 0.05, 1, &v_), 1.0 / 3.0, kExact);
    // Value 13: r1 = r2 = 0.1, Delta = 1: 1/(1 + exp(-0.1)).
    CHECK_VALUE(cto_share_from_rates(0.1, 0.1, 365, 1, 1, 365, 1, &v_), 0.524979187478940, k15);
    // Value 14: d1 = 0.95, d2 = 0.9: 0.1/0.145 = 20/29.
    CHECK_VALUE(cto_share(0.95, 0.9, 1, 1, &v_), 20.0 / 29.0, kExact);
}

TEST_CASE("Fixed costs, Rubinstein (1982), check values 15-22", "[published]") {
    double v_;
    // own = player 1 opening, or own = player 2 opening (values 16, 18, 20).
    CHECK_VALUE(cto_fixed_cost_share(0.1, 0.2, 1, 1, &v_), 1.0, kExact);      // value 15
    CHECK_VALUE(cto_fixed_cost_share(0.2, 0.1, 1, 1, &v_), 0.1, kExact);      // value 16 (own = 2)
    CHECK_VALUE(cto_fixed_cost_share(0.2, 0.1, 1, 1, &v_), 0.1, kExact);      // value 17
    CHECK_VALUE(cto_fixed_cost_share(0.1, 0.2, 1, 1, &v_), 1.0, kExact);      // value 18 (own = 2)
    CHECK_VALUE(cto_fixed_cost_share(20, 10, 1000, 1, &v_), 10.0, kExact);    // value 19
    CHECK_VALUE(cto_fixed_cost_share(10, 20, 1000, 1, &v_), 1000.0, kExact);  // value 20 (own = 2)
    // The responder's side: player 1 (cost 0.1) answering player 2 (cost 0.2), who keeps
    // only c_1 = 0.1 as the higher-cost opener (value 16 seen from player 1).
    CHECK_VALUE(cto_fixed_cost_share(0.1, 0.2, 1, 0, &v_), 0.9, kExact);
    // Values 21-22: equal costs give a continuum [c, 1]: indeterminate (s.2).
    double v = 0;
    CHECK(cto_fixed_cost_share(0.1, 0.1, 1, 1, &v) == CTO_E_INDETERMINATE);
    CHECK(std::isnan(v));
}

TEST_CASE("Finite horizon, Stahl (1972), check values 23-32", "[published]") {
    double v_;
    // Values 23-28: d = 0.9, b = 0: (1 - (-d)^T)/(1 + d).
    CHECK_VALUE(cto_deadline_share(0.9, 0.9, 1, 0, 0, 1, 1, &v_), 1.0, kExact);
    CHECK_VALUE(cto_deadline_share(0.9, 0.9, 2, 0, 0, 1, 1, &v_), 0.1, 4 * kExact);
    CHECK_VALUE(cto_deadline_share(0.9, 0.9, 3, 0, 0, 1, 1, &v_), 0.91, kExact);
    CHECK_VALUE(cto_deadline_share(0.9, 0.9, 4, 0, 0, 1, 1, &v_), 0.181, kExact);
    CHECK_VALUE(cto_deadline_share(0.9, 0.9, 10, 0, 0, 1, 1, &v_), 0.342800821, kExact);
    CHECK_VALUE(cto_deadline_share(0.9, 0.9, 11, 0, 0, 1, 1, &v_), 0.6914792611, kExact);
    // Values 29-30: d = (0.95, 0.9).
    CHECK_VALUE(cto_deadline_share(0.95, 0.9, 5, 0, 0, 1, 1, &v_), 0.916525, kExact);
    CHECK_VALUE(cto_deadline_share(0.95, 0.9, 6, 0, 0, 1, 1, &v_), 0.2586025, kExact);
    // Values 31-32: with deadline payoffs b = (0.1, 0.2).
    CHECK_VALUE(cto_deadline_share(0.9, 0.9, 3, 0.1, 0.2, 1, 1, &v_), 0.748, kExact);
    CHECK_VALUE(cto_deadline_share(0.95, 0.9, 4, 0.1, 0.2, 1, 1, &v_), 0.26245, kExact);
}

TEST_CASE("Breakdown risk, BRW (1986) / Muthoo (1999) ch.4, check values 33-38, 82", "[published]") {
    double v_;
    // Values 33-34: p = 0.1, b = (0.2, 0.1), no discounting: 0.2 + 0.7/1.9.
    CHECK_VALUE(cto_breakdown_share(1, 1, 0.1, 0.2, 0.1, 1, 1, &v_), 0.2 + 0.7 / 1.9, kExact);
    // Value 34 is B's share as responder: own = B (other opens), own fallback 0.1.
    CHECK_VALUE(cto_breakdown_share(1, 1, 0.1, 0.1, 0.2, 1, 0, &v_), 0.431578947368421, k15);
    // Value 35: p = 1 is an ultimatum: pie - bB = 0.9.
    CHECK_VALUE(cto_breakdown_share(1, 1, 1, 0.2, 0.1, 1, 1, &v_), 0.9, kExact);
    // Value 36: p = 0.05, d = (0.95, 0.9), b = (0.2, 0.1); BI over 4001 rounds.
    CHECK_VALUE(cto_breakdown_share(0.95, 0.9, 0.05, 0.2, 0.1, 1, 1, &v_), 0.650500848431770, k15);
    // Value 37: the limit Delta -> 0 with lambda = 0.5, r = (0.1, 0.05) is the asymmetric Nash
    // solution 0.521739130434783; at Delta = 1e-6 (d = exp(-r Delta), p = 1 - exp(-lambda
    // Delta)) the finite-Delta share is within O(Delta) of it.
    const double D = 1e-6;
    CHECK_VALUE(cto_breakdown_share(std::exp(-0.1 * D), std::exp(-0.05 * D), -std::expm1(-0.5 * D),
                                    0.2, 0.1, 1, 1, &v_),
                0.521739130434783, 1e-6);
    // Value 82: p = 1e-12, no discounting: 0.550000000000175.
    CHECK_VALUE(cto_breakdown_share(1, 1, 1e-12, 0.2, 0.1, 1, 1, &v_), 0.550000000000175, k15);
}

TEST_CASE("Outside options, Muthoo (1999) ch.5 / BSS (1989), check values 40-50, 83", "[published]") {
    double v_;
    CHECK_VALUE(cto_outside_option_share(0.9, 0.9, 0, 0.3, 1, 1, &v_), 1 / 1.9, kExact);  // 40
    CHECK_VALUE(cto_outside_option_share(0.9, 0.9, 0.3, 0, 1, 1, &v_), 1 / 1.9, kExact);  // 41 (B proposing)
    CHECK_VALUE(cto_outside_option_share(0.9, 0.9, 0, 0.5, 1, 1, &v_), 0.5, kExact);      // 42
    CHECK_VALUE(cto_outside_option_share(0.9, 0.9, 0.5, 0, 1, 1, &v_), 0.55, kExact);     // 43 (B proposing)
    CHECK_VALUE(cto_outside_option_share(0.9, 0.9, 0.5, 0, 1, 1, &v_), 0.55, kExact);     // 44
    CHECK_VALUE(cto_outside_option_share(0.9, 0.9, 0, 0.5, 1, 1, &v_), 0.5, kExact);      // 45 (B proposing)
    CHECK_VALUE(cto_outside_option_share(0.5, 0.5, 0.4, 0.4, 1, 1, &v_), 0.6, kExact);    // 46-47
    CHECK_VALUE(cto_outside_option_share(0.95, 0.9, 0.2, 0.45, 1, 1, &v_), 0.55, kExact); // 48
    // Value 49: B proposing with dA = 0.95, dB = 0.9, wA = 0.2, wB = 0.45: own = B.
    CHECK_VALUE(cto_outside_option_share(0.9, 0.95, 0.45, 0.2, 1, 1, &v_), 0.4775, kExact);
    // Value 50: threshold wB = d/(1+d): both branches agree.
    CHECK_VALUE(cto_outside_option_share(0.9, 0.9, 0, 0.9 / 1.9, 1, 1, &v_), 1 / 1.9, kExact);
    // Value 83: wA + wB > pie: no deal, A gets its option 0.6.
    double v = 0;
    CHECK(cto_outside_option_share(0.9, 0.9, 0.6, 0.5, 1, 1, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.6);
}

TEST_CASE("Inside options, Muthoo (1999) ch.6, check values 51-53", "[published]") {
    double v_;
    CHECK_VALUE(cto_inside_option_share(0.9, 0.9, 0.1, 0.3, 1, 1, &v_), 0.415789473684211, k15);  // 51
    // Value 52: r = (0.1, 0.05), flows (0.01, 0.02)/yr -> g = f/r = (0.1, 0.4), Delta = 1.
    CHECK_VALUE(cto_inside_option_share(std::exp(-0.1), std::exp(-0.05), 0.1, 0.4, 1, 1, &v_),
                0.275065930724477, k15);
    // Value 53: the limit g_A + tau (pie - g) = 0.1 + 0.5/3, approached at Delta = 1e-6.
    const double D = 1e-6;
    CHECK_VALUE(cto_inside_option_share(std::exp(-0.1 * D), std::exp(-0.05 * D), 0.1, 0.4, 1, 1, &v_),
                0.266666666666667, 1e-6);
}

TEST_CASE("Nash bargaining solution, Nash (1950) / Kalai (1977), check values 54-57, 60", "[published]") {
    double v_;
    CHECK_VALUE(cto_nash_share(0.1, 0.2, 0.5, 1, 1, 1, &v_), 0.45, kExact);  // 54
    CHECK_VALUE(cto_nash_share(0.1, 0.2, 0.3, 1, 1, 1, &v_), 0.31, kExact);  // 55
    CHECK_VALUE(cto_nash_share(0, 0, 0.5, 1, 0.5, 1, &v_), 1.0 / 3.0, kExact);  // 56
    CHECK_VALUE(cto_nash_share(0.1, 0.2, 0.5, 1, 0.5, 1, &v_), 0.4, kExact);    // 57: exactly 0.4
}

TEST_CASE("Risk aversion in alternating offers, BRW (1986), check values 58-59", "[published]") {
    double v_;
    // Value 58: CRRA u_A = x^0.5, d = 0.9: effective factors 0.81, 0.9: 0.1/0.271.
    CHECK_VALUE(cto_risk_averse_share(0.9, 0.9, 0.5, 1, CTO_UTILITY_POWER, 0, 0, 0, 1, 1, &v_),
                0.1 / 0.271, kExact);
    // Value 59: CARA k = (2, 0.5), r = (0.1, 0.05), Delta = 1; BI with utilities T = 4001.
    CHECK_VALUE(cto_risk_averse_share(std::exp(-0.1), std::exp(-0.05), 2, 0.5,
                                      CTO_UTILITY_EXPONENTIAL, 0, 0, 0, 1, 1, &v_),
                0.324276325976081, k15);
}

TEST_CASE("More than two parties, check values 61-70", "[published]") {
    double v_;
    // Herrero (1985); Sutton (1986): (1 - d)/(1 - d^n) and d^k times it.
    CHECK_VALUE(cto_group_share(0.9, 3, 0, 1, &v_), 0.1 / 0.271, kExact);  // 61
    CHECK_VALUE(cto_group_share(0.9, 3, 2, 1, &v_), 0.298892988929889, k15);  // 62
    CHECK_VALUE(cto_group_share(0.95, 5, 0, 1, &v_), 0.221024698128612, k15);  // 63
    CHECK_VALUE(cto_group_share(0.95, 5, 4, 1, &v_), 0.180025998030117, k15);  // 64
    // Baron & Ferejohn (1989): proposer 1 - d (q-1)/n, partner d/n.
    CHECK_VALUE(cto_majority_share(0.9, 5, 3, CTO_ROLE_PROPOSER, 1, &v_), 0.64, kExact);  // 65
    CHECK_VALUE(cto_majority_share(0.9, 5, 3, CTO_ROLE_PARTNER, 1, &v_), 0.18, kExact);   // 66
    CHECK_VALUE(cto_majority_share(0.95, 101, 51, CTO_ROLE_PROPOSER, 1, &v_), 0.529702970297030, k15);  // 67
    CHECK_VALUE(cto_majority_share(0.95, 101, 0, CTO_ROLE_PARTNER, 1, &v_), 0.00940594059405941, k15);  // 68
    CHECK_VALUE(cto_majority_share(0.9, 5, 5, CTO_ROLE_PROPOSER, 1, &v_), 0.28, kExact);  // 69
    CHECK_VALUE(cto_majority_share(0.9, 5, 5, CTO_ROLE_PARTNER, 1, &v_), 0.18, kExact);   // 70
}

TEST_CASE("Screening, Fudenberg & Tirole (1983) setting, check values 71-73", "[published]") {
    double v_;
    CHECK_VALUE(cto_screening_profit(1, 0.5, 0.45, 0.9, 0.8, &v_), 0.5175, kExact);  // 71 screen
    CHECK_VALUE(cto_screening_profit(1, 0.5, 0.8, 0.9, 0.8, &v_), 0.78, kExact);     // 72 skim
    CHECK_VALUE(cto_screening_profit(1, 0.5, 0.3, 0.9, 0.8, &v_), 0.5, kExact);      // 73 pool
}

TEST_CASE("Delay costs and first-mover advantage, s.10 and check value 78", "[published]") {
    double v_;
    // s.10 example: d = 0.8, first-mover advantage 1/9.
    CHECK_VALUE(cto_first_mover_advantage(0.8, 0.8, 1, &v_), 1.0 / 9.0, kExact);
    // Value 78: r = (0.10, 0.05) a year, monthly offers, pie 1000.
    CHECK_VALUE(cto_first_mover_advantage(std::exp(-0.10 / 12), std::exp(-0.05 / 12), 1000, &v_),
                2.77776974025657, k15);
    // s.10: the proposer's one-round holding cost (1 - d) x* = 0.2 / 1.8 = 1/9.
    CHECK_VALUE(cto_delay_cost(0.8, 1 / 1.8, 0, 0, &v_), 1.0 / 9.0, kExact);
}

TEST_CASE("Edge cases, check values 79-84 and the edge cases of s.1 and s.4", "[published]") {
    double v_;
    CHECK_VALUE(cto_share(1, 0.9, 1, 1, &v_), 1.0, 0.0);  // 79: the patient side takes all
    CHECK_VALUE(cto_share(0.9, 1, 1, 1, &v_), 0.0, 0.0);  // 80
    CHECK_VALUE(cto_share(0, 0, 1, 1, &v_), 1.0, 0.0);    // 81: ultimatum
    double v = 1;
    CHECK(cto_share(0.9, 0.9, -1, 1, &v) == CTO_E_NO_DEAL);  // 84: negative pie
    CHECK(v == 0.0);
    // s.4 settlement (negative fallbacks): pi = 0, litigation payoffs (-0.3, -0.2),
    // p = 0.5: transfer 1/30 (b_A + (S - b_A - b_B)/(2 - p) = -0.3 + 0.5/1.5).
    CHECK_VALUE(cto_breakdown_share(1, 1, 0.5, -0.3, -0.2, 0, 1, &v_), 1.0 / 30.0, 4 * kExact);
    // s.1 edge cases: both factors 1 is indeterminate, never 1/2.
    CHECK(cto_share(1, 1, 1, 1, &v) == CTO_E_INDETERMINATE);
    CHECK(std::isnan(v));
}
