// Every bad-input rule of the function contract (docs/reference/functions.md, "Bad input,
// on each surface"), for every function and every argument, through the generic entry
// point and the named C functions.  Source: that contract and the edge cases of
// docs/models/complete-information.md.
#include <catch2/catch.hpp>

#include <cmath>
#include <limits>
#include <string>

#include "counteroffer/counteroffer.h"
#include "test_support.hpp"

using cto_test::base_args;
using cto_test::call;

namespace {
const double kInf = std::numeric_limits<double>::infinity();

// Values that are invalid for an argument of the given kind.
std::vector<double> invalid_values(const cto_arg_info &a) {
    std::vector<double> v = {NAN, kInf};
    if (a.kind != CTO_ARG_OPTIONAL) v.push_back(-kInf);
    switch (a.kind) {
        case CTO_ARG_UNIT: v.insert(v.end(), {-1e-300, -0.1, 1.0 + 1e-15, 1.5}); break;
        case CTO_ARG_NONNEG: v.insert(v.end(), {-1e-300, -1.0}); break;
        case CTO_ARG_POSITIVE: v.insert(v.end(), {0.0, -1.0}); break;
        case CTO_ARG_BOOL: v.insert(v.end(), {0.5, 2.0, -1.0}); break;
        case CTO_ARG_COUNT:
            v.insert(v.end(), {3.5, static_cast<double>(a.min_count) - 1.0, 1e19});
            break;
        case CTO_ARG_CHOICE: v.insert(v.end(), {-1.0, 0.5, 2.0, 99.0}); break;
        default: break;
    }
    return v;
}
}  // namespace

TEST_CASE("the base arguments are valid for every function", "[bad-input]") {
    for (size_t i = 0; i < cto_function_count(); ++i) {
        const cto_function_info *f = cto_function_at(i);
        INFO(f->name);
        double v = 0;
        const int st = call(f, base_args(f), &v);
        CHECK(st == CTO_OK);
        CHECK(std::isfinite(v));
    }
}

TEST_CASE("NaN, infinite and out-of-domain arguments give invalid and NaN", "[bad-input]") {
    for (size_t i = 0; i < cto_function_count(); ++i) {
        const cto_function_info *f = cto_function_at(i);
        for (int j = 0; j < f->n_args; ++j) {
            for (double bad_value : invalid_values(f->args[j])) {
                auto a = base_args(f);
                a[static_cast<size_t>(j)] = bad_value;
                std::vector<double> o(static_cast<size_t>(f->n_outputs), 123.0);
                int bad = -7;
                const int st = cto_call(f->id, a.data(), o.data(), &bad);
                INFO(f->name << "(" << f->args[j].name << " = " << bad_value << ")");
                CHECK(st == CTO_E_INVALID);
                CHECK(bad == j);
                for (double x : o) CHECK(std::isnan(x));
            }
        }
    }
}

TEST_CASE("cross-argument domain rules name the right argument", "[bad-input]") {
    double v;
    int bad;
    const cto_function_info *g = cto_function_find("group_share");
    CHECK(call(g, {0.9, 3, 3, 1}, &v, &bad) == CTO_E_INVALID);  // position must be < parties
    CHECK(bad == 2);
    const cto_function_info *m = cto_function_find("majority_share");
    CHECK(call(m, {0.9, 5, 6, 0, 1}, &v, &bad) == CTO_E_INVALID);  // votes > parties
    CHECK(bad == 2);
    CHECK(call(m, {0.9, 1, 0, 1, 1}, &v, &bad) == CTO_E_INVALID);  // no partner when q = 1
    CHECK(bad == 3);
    const cto_function_info *n = cto_function_find("nash_share");
    CHECK(call(n, {0.1, 0.2, 0.5, 1, 1.5, 1}, &v, &bad) == CTO_E_INVALID);  // curvature > 1
    CHECK(bad == 4);
    CHECK(call(n, {-0.1, 0.2, 0.5, 1, 0.5, 1}, &v, &bad) == CTO_E_INVALID);  // negative fallback
    CHECK(bad == 0);
    CHECK(call(n, {-0.1, 0.2, 0.5, 1, 1, 1}, &v, &bad) == CTO_OK);  // fine when risk neutral
    const cto_function_info *r = cto_function_find("risk_averse_share");
    CHECK(call(r, {0.9, 0.9, 1.2, 1, 0, 0, 0, 0, 1, 1}, &v, &bad) == CTO_E_INVALID);
    CHECK(bad == 2);
    CHECK(call(r, {0.9, 0.9, 0.5, 1, 0, 0.1, 0, -0.1, 1, 1}, &v, &bad) == CTO_E_INVALID);
    CHECK(bad == 7);
    CHECK(call(r, {0.9, 0.9, 1.2, 1, 1, 0.1, 0, -0.1, 1, 1}, &v, &bad) == CTO_OK);  // CARA
    const cto_function_info *s = cto_function_find("screening_profit");
    CHECK(call(s, {0.5, 1.0, 0.5, 0.9, 0.9}, &v, &bad) == CTO_E_INVALID);  // v_L > v_H
    CHECK(bad == 1);
    const cto_function_info *i = cto_function_find("implied_factor");
    CHECK(call(i, {0.01, 0.9, 1}, &v, &bad) == CTO_E_INVALID);  // below the d_own = 0 share 0.1
    CHECK(bad == 0);
}

TEST_CASE("no rational deal gives no_deal and own's no-deal payoff, never the formula",
          "[bad-input]") {
    double v;
    // Surplus <= 0 (docs/models/complete-information.md s.1 edge cases; check value 84 of test_published.cpp:
    // the formula would give -0.526).
    CHECK(cto_share(0.9, 0.9, -1, 1, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.0);
    CHECK(cto_share(0.9, 0.9, 0, 1, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.0);
    CHECK(cto_share_from_rates(0.1, 0.05, 30, -5, 1, 365, 0, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.0);
    CHECK(cto_limit_share(0.1, 0.05, -1, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.0);
    CHECK(cto_first_mover_advantage(0.9, 0.9, -1, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.0);
    CHECK(cto_fixed_cost_share(0.1, 0.2, -1, 1, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.0);
    CHECK(cto_group_share(0.9, 3, 1, -1, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.0);
    CHECK(cto_majority_share(0.9, 5, 0, 0, 0, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.0);
    CHECK(cto_share_sensitivity(0.1, 0.05, 30, 0, -1, 1, 365, 0, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.0);
    // Breakdown without discounting: b_A + b_B >= pie (docs/models/complete-information.md s.4) -> own's
    // fallback.
    CHECK(cto_breakdown_share(1, 1, 0.3, 0.6, 0.5, 1, 1, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.6);
    // With discounting the no-deal value is the present value of waiting for breakdown:
    // p b / (1 - (1-p) d) = 0.5 * 2 / (1 - 0.25) for b = 2, d = 0.5, p = 0.5.
    CHECK(cto_breakdown_share(0.5, 0.5, 0.5, 2, 2, 1, 1, &v) == CTO_E_NO_DEAL);
    CHECK(v == Approx(0.5 * 2 / 0.75).epsilon(1e-15));
    // Outside options w_A + w_B > pie (row 83) and inside options g_A + g_B >= pie.
    CHECK(cto_outside_option_share(0.9, 0.9, 0.6, 0.5, 1, 0, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.6);
    CHECK(cto_inside_option_share(0.9, 0.9, 0.75, 0.25, 1, 1, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.75);
    // Nash: pie <= b_own + b_oth.
    CHECK(cto_nash_share(0.6, 0.5, 0.5, 1, 1, 1, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.6);
    CHECK(cto_risk_averse_share(0.9, 0.9, 0.5, 0.5, 0, 1, 0.6, 0.5, 1, 1, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.6);
    // Deadline: no bargaining at all, and deadline payoffs above the pie.
    CHECK(cto_deadline_share(0.9, 0.9, 0, 0.25, 0.5, 1, 1, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.25);
    CHECK(cto_deadline_share(0.9, 0.9, 1, 0.6, 0.5, 1, 1, &v) == CTO_E_NO_DEAL);
    CHECK(v == 0.6);
    // solve: the outcome carries both no-deal payoffs.
    cto_solve_input in = {sizeof(cto_solve_input), 0.9, 0.9, 0, 0, 0, 0, 0, 0.6, 0.5, 1, 1, 1, 1};
    cto_solve_outcome out;
    out.size = sizeof out;
    CHECK(cto_solve(&in, &out) == CTO_E_NO_DEAL);
    CHECK(out.own_share == 0.6);
    CHECK(out.other_share == 0.5);
    CHECK(out.deal_rational == 0);
}

TEST_CASE("indeterminate cases give indeterminate and NaN", "[bad-input]") {
    double v;
    CHECK(cto_share(1, 1, 1, 1, &v) == CTO_E_INDETERMINATE);
    CHECK(std::isnan(v));
    CHECK(cto_share_from_rates(0, 0, 30, 1, 1, 365, 0, &v) == CTO_E_INDETERMINATE);
    CHECK(std::isnan(v));
    CHECK(cto_share_from_rates(0.1, 0.05, 0, 1, 1, 365, 0, &v) == CTO_E_INDETERMINATE);
    CHECK(std::isnan(v));
    CHECK(cto_limit_share(0, 0, 1, &v) == CTO_E_INDETERMINATE);
    CHECK(cto_breakdown_share(1, 1, 0, 0.1, 0.1, 1, 1, &v) == CTO_E_INDETERMINATE);
    CHECK(cto_outside_option_share(1, 1, 0.1, 0.2, 1, 1, &v) == CTO_E_INDETERMINATE);
    CHECK(cto_inside_option_share(1, 1, 0.1, 0.2, 1, 1, &v) == CTO_E_INDETERMINATE);
    CHECK(cto_fixed_cost_share(0.1, 0.1, 1, 1, &v) == CTO_E_INDETERMINATE);
    CHECK(std::isnan(v));
    CHECK(cto_first_mover_advantage(1, 1, 1, &v) == CTO_E_INDETERMINATE);
    CHECK(cto_risk_averse_share(1, 1, 0.5, 0.5, 0, 0, 0, 0, 1, 1, &v) == CTO_E_INDETERMINATE);
    CHECK(cto_group_share(1, 3, 0, 1, &v) == CTO_E_INDETERMINATE);
    CHECK(cto_implied_factor(1, 0, 1, &v) == CTO_E_INDETERMINATE);
    CHECK(cto_implied_rate(0.5, 0.05, 0, 1, 365, 0, &v) == CTO_E_INDETERMINATE);
    CHECK(cto_share_sensitivity(0.1, 0.05, 0, 0, 1, 1, 365, 0, &v) == CTO_E_INDETERMINATE);
    // Equal fixed costs at or above the pie are determinate: the proposer takes all (s.2).
    CHECK(cto_fixed_cost_share(2, 2, 1, 1, &v) == CTO_OK);
    CHECK(v == 1.0);
}

TEST_CASE("a NULL output pointer is invalid and nothing crashes", "[bad-input]") {
    CHECK(cto_round_factor(0.1, 30, 365, 0, nullptr) == CTO_E_INVALID);
    CHECK(cto_share(0.9, 0.9, 1, 1, nullptr) == CTO_E_INVALID);
    CHECK(cto_screening_profit(1, 0.5, 0.5, 0.9, 0.9, nullptr) == CTO_E_INVALID);
    CHECK(cto_solve(nullptr, nullptr) == CTO_E_INVALID);
    cto_solve_outcome out;
    out.size = sizeof out;
    CHECK(cto_solve(nullptr, &out) == CTO_E_INVALID);
    CHECK(std::isnan(out.own_share));
    cto_solve_input in{};
    in.size = 8;  // too small to hold the fields
    CHECK(cto_solve(&in, &out) == CTO_E_INVALID);
    double o[4];
    CHECK(cto_call(-1, o, o, nullptr) == CTO_E_INVALID);
    CHECK(cto_call(999, o, o, nullptr) == CTO_E_INVALID);
    CHECK(cto_call(0, nullptr, o, nullptr) == CTO_E_INVALID);
    CHECK(cto_function_at(cto_function_count()) == nullptr);
    CHECK(cto_function_find("no_such_function") == nullptr);
    CHECK(cto_function_find(nullptr) == nullptr);
}

TEST_CASE("solve: a present walk-away option must be finite", "[bad-input]") {
    cto_solve_input in = {sizeof(cto_solve_input), 0.9, 0.9, 0, 0, 0, 0, 0, NAN, 0, 1, 0, 1, 1};
    cto_solve_outcome out;
    out.size = sizeof out;
    CHECK(cto_solve(&in, &out) == CTO_E_INVALID);
    in.has_own_outside = 0;  // then the value is ignored
    CHECK(cto_solve(&in, &out) == CTO_OK);
}

TEST_CASE("status names and messages are static, distinct and never NULL", "[status]") {
    const char *names[] = {"ok", "invalid", "no_deal", "indeterminate", "no_convergence",
                           "internal"};
    for (int s = 0; s < 6; ++s) {
        CHECK(std::string(cto_status_name(s)) == names[s]);
        CHECK(cto_status_message(s) != nullptr);
        CHECK(std::string(cto_status_message(s)).size() > 10);
    }
    CHECK(std::string(cto_status_name(77)) == "unknown");
    CHECK(cto_status_message(-3) != nullptr);
    // Pinned values (counteroffer.h: status codes are only ever appended).
    STATIC_REQUIRE(CTO_OK == 0);
    STATIC_REQUIRE(CTO_E_INVALID == 1);
    STATIC_REQUIRE(CTO_E_NO_DEAL == 2);
    STATIC_REQUIRE(CTO_E_INDETERMINATE == 3);
    STATIC_REQUIRE(CTO_E_NO_CONVERGENCE == 4);
    STATIC_REQUIRE(CTO_E_INTERNAL == 5);
}

TEST_CASE("runtime version equals the header's", "[version]") {
    CHECK(cto_version_number() == CTO_VERSION_NUMBER);
    CHECK(std::string(cto_version_string()) == CTO_VERSION_STRING);
    CHECK(std::string(CTO_VERSION_STRING) ==
          std::to_string(CTO_VERSION_MAJOR) + "." + std::to_string(CTO_VERSION_MINOR) + "." +
              std::to_string(CTO_VERSION_PATCH));
}

TEST_CASE("plausible ranges: rates, days, breakdown and basis; none elsewhere", "[bad_input]") {
    // The thresholds of a typed percentage (8 for 8%) and similar slips: common practice,
    // no source (a rate above 100% a year, more than ten years between offers, talks more
    // likely to end than to go on after a rejection, day bases 360 to 366).
    double lo = 0.0, hi = 0.0;
    const cto_function_info *f = cto_function_find("share_from_rates");
    REQUIRE(f != nullptr);
    REQUIRE(cto_arg_plausible_range(f->id, 0, &lo, &hi) == CTO_OK);
    CHECK(lo == 0.0);
    CHECK(hi == 1.0);
    REQUIRE(cto_arg_plausible_range(f->id, 2, &lo, &hi) == CTO_OK);
    CHECK(hi == 3650.0);
    REQUIRE(cto_arg_plausible_range(f->id, 5, &lo, &hi) == CTO_OK);  // basis
    CHECK(lo == 360.0);
    CHECK(hi == 366.0);
    CHECK(cto_arg_plausible_range(f->id, 3, &lo, &hi) == CTO_E_INVALID);  // surplus: none
    CHECK(std::isnan(lo));
    const cto_function_info *s = cto_function_find("solve");
    REQUIRE(cto_arg_plausible_range(s->id, 2, &lo, &hi) == CTO_OK);  // breakdown_prob
    CHECK(hi == 0.5);
    CHECK(cto_arg_plausible_range(s->id, 99, nullptr, nullptr) == CTO_E_INVALID);
    CHECK(cto_arg_plausible_range(-1, 0, &lo, &hi) == CTO_E_INVALID);
    CHECK(cto_arg_plausible_range(static_cast<int>(cto_function_count()), 0, &lo, &hi) ==
          CTO_E_INVALID);
}
