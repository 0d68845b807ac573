// The ranges engine through the C ABI (cto_share_range, cto_share_swing): struct
// handling, defaults, invalid input, degenerate ranges and one-input quantiles against
// the closed-form share (the share is monotone in each rate, so the p-quantile of the
// share is the share at the input's p-quantile; docs/models/ranges.md, "Accuracy"),
// and bit identity across threads.
#include <catch2/catch.hpp>

#include <cmath>
#include <cstring>

#include "counteroffer/counteroffer.h"
#include "models/combined.hpp"

namespace {

// Every input fixed at a deal-room case: rates 8% and 5%, offers 30 days apart, no
// breakdown, no options, surplus 100, own opens, basis 365, annual effective rates.
cto_range_input fixed_case() {
    cto_range_input in;
    std::memset(&in, 0, sizeof in);
    in.size = sizeof in;
    const double v[CTO_RANGE_INPUTS] = {0.08, 0.05, 30, 0, 0, 0, 0, 0, -INFINITY, -INFINITY,
                                        100, 1, 365, 0};
    for (int j = 0; j < CTO_RANGE_INPUTS; ++j) {
        in.arg[j].kind = CTO_RANGE_FIXED;
        in.arg[j].low = in.arg[j].mode = in.arg[j].high = v[j];
    }
    return in;
}

// The closed-form share (Rubinstein 1982 from rates), independent of the combined model.
double share_at(double own_rate, double other_rate) {
    double v = NAN;
    REQUIRE(cto_share_from_rates(own_rate, other_rate, 30, 100, 1, 365, 0, &v) == CTO_OK);
    return v;
}

// The combined model from rates with the fixed case's other inputs: what a degenerate
// range must reproduce bit for bit.
double solved_at(double own_rate, double other_rate) {
    const cto::core::SolveRatesIn in{own_rate, other_rate, 30, 0, 0, 0, 0, 0,
                                     -INFINITY, -INFINITY, 100, true, 365, false};
    cto::core::SolveOut o;
    REQUIRE(cto::core::solve_rates(in, &o, nullptr) == CTO_OK);
    return o.own_share;
}

cto_range_outcome run(const cto_range_input &in, const cto_range_options &opt) {
    cto_range_outcome out;
    out.size = sizeof out;
    cto_share_range(&in, &opt, &out);
    return out;
}

}  // namespace

TEST_CASE("ranges through the C ABI: defaults and the status of precision", "[range_capi]") {
    cto_range_options opt;
    cto_range_default_options(&opt);
    CHECK(opt.size == sizeof opt);
    REQUIRE(opt.n_probs == 3);
    CHECK(opt.probs[0] == 0.1);
    CHECK(opt.probs[1] == 0.5);
    CHECK(opt.probs[2] == 0.9);
    CHECK(opt.replicates == 16);
    CHECK(opt.digits == 3);
    CHECK(std::string(cto_status_name(CTO_E_PRECISION)) == "precision_not_reached");
}

TEST_CASE("ranges through the C ABI: one uncertain rate, quantiles of the share",
          "[range_capi]") {
    cto_range_input in = fixed_case();
    in.arg[1].kind = CTO_RANGE_UNIFORM;  // other_rate uniform on [3%, 7%]
    in.arg[1].low = 0.03;
    in.arg[1].high = 0.07;
    cto_range_options opt;
    cto_range_default_options(&opt);
    const cto_range_outcome out = run(in, opt);
    REQUIRE(out.status == CTO_OK);
    CHECK(out.dimension == 1);
    CHECK(out.spec_version >= 1);
    // Own share rises with the other side's rate: the p-quantile is the share at
    // 0.03 + 0.04 p.  The estimate is within its 95% half-width (three digits here).
    for (int k = 0; k < 3; ++k) {
        const double exact = share_at(0.08, 0.03 + 0.04 * opt.probs[k]);
        INFO("p = " << opt.probs[k] << " exact " << exact << " estimate " << out.own[k].value);
        CHECK(std::fabs(out.own[k].value - exact) <= out.own[k].half_width + 1e-12 * exact);
        CHECK(out.own[k].half_width <= 0.5e-3 * std::fabs(exact) * 10);
        CHECK(std::fabs(out.other[k].value - (100 - share_at(0.08, 0.07 - 0.04 * opt.probs[k]))) <=
              out.other[k].half_width + 1e-9);
    }
    CHECK(out.p_rational.value == 1.0);
    // The same inputs and seed with two threads: the same bits.
    opt.threads = 2;
    const cto_range_outcome two = run(in, opt);
    // Field by field (the struct has padding after `digits`, which no rule fixes).
    auto same = [](const cto_range_estimate &x, const cto_range_estimate &y) {
        return std::memcmp(&x.value, &y.value, sizeof x.value) == 0 &&
               std::memcmp(&x.se, &y.se, sizeof x.se) == 0 &&
               std::memcmp(&x.half_width, &y.half_width, sizeof x.half_width) == 0 &&
               x.digits == y.digits;
    };
    for (int k = 0; k < out.n_probs; ++k) CHECK(same(two.own[k], out.own[k]));
    CHECK(same(two.own_mean, out.own_mean));
}

TEST_CASE("ranges through the C ABI: degenerate ranges equal the fixed input",
          "[range_capi]") {
    cto_range_input in = fixed_case();
    in.arg[0].kind = CTO_RANGE_PERT;  // low = mode = high
    in.arg[1].kind = CTO_RANGE_TRIANGULAR;
    cto_range_options opt;
    cto_range_default_options(&opt);
    const cto_range_outcome out = run(in, opt);
    REQUIRE(out.status == CTO_OK);
    const double exact = solved_at(0.08, 0.05);
    for (int k = 0; k < 3; ++k) CHECK(out.own[k].value == exact);
    CHECK(std::fabs(exact - share_at(0.08, 0.05)) <= 1e-14 * exact);
}

TEST_CASE("ranges through the C ABI: invalid ranges, options and structs", "[range_capi]") {
    cto_range_options opt;
    cto_range_default_options(&opt);
    cto_range_input in = fixed_case();
    in.arg[2].kind = CTO_RANGE_UNIFORM;  // days: low above high
    in.arg[2].low = 40;
    in.arg[2].high = 20;
    cto_range_outcome out = run(in, opt);
    CHECK(out.status == CTO_E_INVALID);
    CHECK(out.bad == 2);
    in = fixed_case();
    in.arg[1].kind = CTO_RANGE_TRIANGULAR;  // mode outside
    in.arg[1].low = 0.03;
    in.arg[1].mode = 0.09;
    in.arg[1].high = 0.07;
    out = run(in, opt);
    CHECK(out.status == CTO_E_INVALID);
    CHECK(out.bad == 1);
    in = fixed_case();
    opt.probs[0] = 1.0;  // a probability must be inside (0, 1)
    out = run(in, opt);
    CHECK(out.status == CTO_E_INVALID);
    CHECK(out.bad == 14);
    cto_range_default_options(&opt);
    in.size = sizeof in - 1;
    out = run(in, opt);
    CHECK(out.status == CTO_E_INVALID);
    CHECK(out.bad == 21);
    out.size = sizeof out;
    CHECK(cto_share_range(nullptr, &opt, &out) == CTO_E_INVALID);
    CHECK(cto_share_range(&in, &opt, nullptr) == CTO_E_INVALID);
    out.size = 8;
    CHECK(cto_share_range(&in, &opt, &out) == CTO_E_INVALID);
}

TEST_CASE("ranges through the C ABI: the swing of each uncertain input", "[range_capi]") {
    cto_range_input in = fixed_case();
    in.arg[0].kind = CTO_RANGE_TRIANGULAR;  // own rate 6% .. 8% .. 12%
    in.arg[0].low = 0.06;
    in.arg[0].high = 0.12;
    in.arg[1].kind = CTO_RANGE_UNIFORM;  // other rate 4.9% .. 5.1%: a small swing
    in.arg[1].low = 0.049;
    in.arg[1].high = 0.051;
    cto_swing_outcome out;
    out.size = sizeof out;
    REQUIRE(cto_share_swing(&in, &out) == CTO_OK);
    REQUIRE(out.n_rows == 2);
    CHECK(out.row[0].input == 0);  // the larger swing first
    CHECK(out.row[1].input == 1);
    CHECK(out.row[0].at_low == solved_at(0.06, 0.05));
    CHECK(out.row[0].at_high == solved_at(0.12, 0.05));
    CHECK(out.row[1].at_low == solved_at(0.08, 0.049));
    CHECK(out.row[0].swing >= out.row[1].swing);
    CHECK(out.base == solved_at(0.08, 0.05));
    CHECK(std::fabs(out.row[0].at_high - share_at(0.12, 0.05)) <= 1e-13 * out.base);
}
