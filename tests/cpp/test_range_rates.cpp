// share_range and share_swing over the combined model from rates (solve_rates), against
// values from outside the library: the exact quantiles of the d = 2 example of
// docs/models/ranges.md ("The two examples"), the numpy reference run of the same draws
// (tests/reference/range/make_rqmc_reference.py, closed forms of the two examples), the
// breakdown
// closed form of Binmore, Rubinstein & Wolinsky (1986) / Muthoo (1999) ch. 4 for the swing,
// and Shaked & Sutton's (1984) threshold for a walk-away value to bind (docs/models/complete-information.md s.5).
#include <catch2/catch.hpp>

#include <cmath>
#include <fstream>
#include <string>
#include <vector>

#include "range/rates_model.hpp"
#include "test_csv.hpp"
#include "test_range_support.hpp"

using namespace cto_range_test;

namespace {

// The catalogue inputs of solve_from_rates with monthly offers as in the two examples: days = 1,
// basis = 12, continuous compounding (factor exp(-r/12)); no breakdown, fallbacks,
// inside or outside options; surplus 1; own opens.
RangeIn base_in() {
    RangeIn in{};
    in.size = sizeof in;
    const double v[kRangeSlots] = {0.1, 0.05, 1.0, 0.0, 0.0, 0.0, 0.0,
                                   0.0, -INFINITY, -INFINITY, 1.0, 1.0, 12.0, 1.0};
    for (int j = 0; j < kRangeSlots; ++j) in.arg[j] = fixed(v[j]);
    return in;
}

RangeIn in_d2() {
    RangeIn in = base_in();
    in.arg[0] = rate_own();
    in.arg[1] = rate_other();
    return in;
}

RangeIn in_d5() {
    RangeIn in = in_d2();
    in.arg[3] = pert(0.005, 0.02, 0.06);
    in.arg[4] = tri(0.10, 0.20, 0.35);
    in.arg[5] = tri(0.05, 0.15, 0.30);
    return in;
}

RangeOut range(const RangeIn &in, const RangeOptions &o) {
    RangeOut out{};
    out.size = sizeof out;
    share_range(in, o, &out);
    return out;
}

std::vector<std::vector<std::string>> reference_rows(const char *model, int log2n) {
    std::ifstream f(std::string(CTO_REFERENCE_DIR) + "/range/rqmc_reference.csv");
    std::vector<std::vector<std::string>> rows;
    std::string line;
    std::getline(f, line);
    while (std::getline(f, line)) {
        const std::vector<std::string> c = cto_test::split_csv(line);
        if (c[0] == model && std::stoi(c[3]) == log2n && c[4] == "own_quantile") rows.push_back(c);
    }
    return rows;
}

}  // namespace

TEST_CASE("share_range over solve_rates: the numpy reference draws (the examples' closed forms)",
          "[range]") {
    // The same seed gives the same draws in the same dimensions (slots 0, 1, 3, 4, 5), and
    // solve_rates agrees with the closed forms to rounding, so the pooled quantiles agree
    // with the numpy run to rounding.
    for (const char *name : {"d2", "d5"}) {
        const bool is2 = std::string(name) == "d2";
        const RangeOut out = range(is2 ? in_d2() : in_d5(),
                                   options({0.05, 0.1, 0.25, 0.5, 0.75, 0.9, 0.95}, 20240601, 12, 12));
        REQUIRE(out.status == CTO_OK);  // 2^12 reaches three digits in both examples
        const auto rows = reference_rows(name, 12);
        REQUIRE(rows.size() == 7);
        for (size_t k = 0; k < rows.size(); ++k) {
            INFO(name << " p=" << rows[k][5]);
            CHECK(out.own[k].value == Approx(std::stod(rows[k][6])).epsilon(1e-12));
            CHECK(out.own[k].se == Approx(std::stod(rows[k][7])).epsilon(1e-5));
        }
        CHECK(out.p_rational.value == 1.0);
        CHECK(out.edge_fraction.value == 0.0);
        CHECK(out.p_own_binds.value == 0.0);
        CHECK(out.dimension == (is2 ? 2 : 5));
        CHECK(out.spec_version == kSpecVersion);
    }
}

TEST_CASE("share_range over solve_rates: exact d = 2 quantiles", "[range]") {
    const double p[3] = {0.1, 0.5, 0.9};
    const double exact[3] = {0.245000119271927, 0.367479205474840, 0.501025023257586};
    const RangeOut out = range(in_d2(), options({0.1, 0.5, 0.9}, 11, 10, 20));
    REQUIRE(out.status == CTO_OK);
    for (int k = 0; k < 3; ++k) {
        INFO("p=" << p[k]);
        // Two half-widths: a fixed-seed check (see test_range_engine.cpp).
        CHECK(std::fabs(out.own[k].value - exact[k]) <= 2 * out.own[k].half_width);
        CHECK(out.own[k].digits >= 3);
        // Other's share is 1 - own's at every draw: its quantile at p is 1 - own's at 1 - p.
        CHECK(std::fabs(out.other[2 - k].value - (1 - exact[k])) <= 2 * out.other[2 - k].half_width);
    }
}

TEST_CASE("share_range over solve_rates: how often other's walk-away value binds",
          "[range]") {
    // Shaked & Sutton (1984); docs/models/complete-information.md s.5: with own opening, other's walk-away value w
    // binds exactly when w > d_B (1 - d_A)/(1 - d_A d_B) (other's share as proposer,
    // discounted one round).  With w ~ U(0, 0.8) the probability is (0.8 - w*)/0.8, and
    // a (0, m, 1)-net hits it within 1/n.
    RangeIn in = base_in();
    in.arg[9] = uni(0.0, 0.8);
    const double dA = std::exp(-0.1 / 12), dB = std::exp(-0.05 / 12);
    const double w_star = dB * (1 - dA) / (1 - dA * dB);
    const RangeOut out = range(in, options({0.5}, 4, 12, 12));
    REQUIRE(out.status == CTO_OK);
    CHECK(std::fabs(out.p_other_binds.value - (0.8 - w_star) / 0.8) <= 1.0 / 4096);
    CHECK(out.p_own_binds.value == 0.0);
    CHECK(out.p_rational.value == 1.0);
}

TEST_CASE("share_range over solve_rates: no-deal draws and invalid inputs", "[range]") {
    // Fallbacks that can exceed the surplus together: b_A, b_B ~ U(0.3, 0.9) with p = 0.5
    // per round and no discounting (rates 0, so the value of waiting is the fallback
    // itself); no deal when b_A + b_B >= 1 (complete-information.md s.4), probability
    // 1 - 0.4^2/2 / 0.36 = 0.777... (the triangle below b_A + b_B = 1 in the square).
    RangeIn in = base_in();
    in.arg[0] = fixed(0.0);
    in.arg[1] = fixed(0.0);
    in.arg[3] = fixed(0.5);
    in.arg[4] = uni(0.3, 0.9);
    in.arg[5] = uni(0.3, 0.9);
    const RangeOut out = range(in, options({0.5}, 2, 12, 12));
    const double p_no_deal = 1.0 - 0.08 / 0.36;
    REQUIRE(out.status == CTO_OK);
    CHECK(std::fabs(out.edge_fraction.value - p_no_deal) <= out.edge_fraction.half_width);
    CHECK(std::fabs(out.p_rational.value - (1 - p_no_deal)) <= out.p_rational.half_width);
    // The median draw has no deal: own's share there is own's fallback (never a formula
    // value), so the median of own share lies in [0.3, 0.9].
    CHECK(out.own[0].value >= 0.3);
    CHECK(out.own[0].value <= 0.9);
    // Invalid: a range on a flag, a flag not 0/1, a negative rate inside a range (the
    // model's own check), a struct size too small.
    struct Case { int slot; RangeArg arg; };
    for (const Case &c : {Case{11, uni(0, 1)}, Case{13, fixed(2)}, Case{0, uni(-0.1, 0.1)},
                          Case{2, tri(-1, 1, 2)}, Case{8, uni(-INFINITY, 0)}}) {
        RangeIn bad = in_d2();
        bad.arg[c.slot] = c.arg;
        const RangeOut o = range(bad, options({0.5}, 0, 8, 8));
        INFO("slot " << c.slot);
        CHECK(o.status == CTO_E_INVALID);
        CHECK(o.bad == c.slot);
        SwingOut s{};
        s.size = sizeof s;
        CHECK(share_swing(bad, &s) == CTO_E_INVALID);
        CHECK(s.bad == c.slot);
    }
    RangeIn small = in_d2();
    small.size = sizeof(RangeIn) - 1;
    CHECK(range(small, options({0.5}, 0, 8, 8)).bad == kBadSize);
    // A degenerate range equals the fixed input exactly (docs/models/ranges.md, "Input
    // distributions").
    RangeIn a = in_d5(), b = in_d5();
    a.arg[4] = fixed(0.2);
    b.arg[4] = pert(0.2, 0.2, 0.2);
    CHECK(same_result(range(a, options({0.1, 0.9}, 8, 9, 10)), range(b, options({0.1, 0.9}, 8, 9, 10))));
}

TEST_CASE("share_swing over solve_rates: each input at its ends, sorted by swing", "[range]") {
    // The d = 5 example: every end evaluated by the breakdown closed form (test support,
    // Binmore, Rubinstein & Wolinsky 1986; Muthoo 1999 ch. 4), the others at their modes.
    SwingOut s{};
    s.size = sizeof s;
    REQUIRE(share_swing(in_d5(), &s) == CTO_OK);
    REQUIRE(s.n_rows == 5);
    const double mode[6] = {0.10, 0.05, 30.0, 0.02, 0.20, 0.15};
    const double lo[6] = {0.05, 0.02, 0, 0.005, 0.10, 0.05}, hi[6] = {0.20, 0.12, 0, 0.06, 0.35, 0.30};
    auto formula = [&](int slot, double v) {
        double x[6];
        for (int j = 0; j < 6; ++j) x[j] = mode[j];
        x[slot] = v;
        Draw d{};
        int bad = -1;
        model_d5(nullptr, x, &d, &bad);
        return d.own;
    };
    Draw base{};
    int bad = -1;
    model_d5(nullptr, mode, &base, &bad);
    CHECK(s.base == Approx(base.own).epsilon(1e-13));
    for (int k = 0; k < s.n_rows; ++k) {
        const SwingRow &r = s.row[k];
        INFO("row " << k << " input " << r.input);
        const int slot = r.input == 0 ? 0 : r.input == 1 ? 1 : r.input;  // slots 0,1,3,4,5
        CHECK(r.at_low == Approx(formula(slot, lo[slot])).epsilon(1e-13));
        CHECK(r.at_high == Approx(formula(slot, hi[slot])).epsilon(1e-13));
        CHECK(r.swing == std::fabs(r.at_high - r.at_low));
        if (k > 0) CHECK(r.swing <= s.row[k - 1].swing);
    }
    // Own's share falls with own's rate and rises with other's (Rubinstein 1982).
    for (int k = 0; k < s.n_rows; ++k) {
        if (s.row[k].input == 0) CHECK(s.row[k].at_high < s.row[k].at_low);
        if (s.row[k].input == 1) CHECK(s.row[k].at_high > s.row[k].at_low);
    }
}

TEST_CASE("share_range over solve_rates: every numeric input uncertain", "[range]") {
    // Twelve uncertain inputs (a fictional deal: quarterly offers, walk-away values on both
    // sides, status-quo income, money amounts in millions).  Checks of consistency that
    // hold for any correct engine: finite estimates, quantiles in order, fractions in
    // [0, 1], rational + edge >= 1 - (boundary draws), the swing sorted with 12 rows,
    // and the same bits with two threads.
    RangeIn in = base_in();
    in.arg[0] = pert(0.06, 0.09, 0.15);
    in.arg[1] = tri(0.04, 0.07, 0.12);
    in.arg[2] = uni(60, 120);
    in.arg[3] = pert(0.0, 0.03, 0.10);
    in.arg[4] = tri(1.0, 2.0, 3.0);
    in.arg[5] = tri(0.5, 1.5, 4.0);
    in.arg[6] = uni(0.0, 1.0);
    in.arg[7] = uni(0.0, 0.5);
    in.arg[8] = pert(2.0, 3.0, 6.0);
    in.arg[9] = tri(1.0, 2.5, 5.0);
    in.arg[10] = pert(8.0, 10.0, 14.0);
    in.arg[12] = uni(360, 366);
    in.arg[13] = fixed(0.0);
    RangeOptions o = options({0.1, 0.5, 0.9}, 17, 10, 14);
    const RangeOut out = range(in, o);
    REQUIRE((out.status == CTO_OK || out.status == kPrecisionNotReached));
    CHECK(out.dimension == 12);
    for (int k = 0; k < 3; ++k) {
        CHECK(std::isfinite(out.own[k].value));
        CHECK(std::isfinite(out.other[k].half_width));
        if (k > 0) CHECK(out.own[k].value >= out.own[k - 1].value);
    }
    for (const Estimate *e : {&out.p_rational, &out.p_own_binds, &out.p_other_binds, &out.edge_fraction}) {
        CHECK(e->value >= 0.0);
        CHECK(e->value <= 1.0);
    }
    CHECK(out.p_rational.value + out.edge_fraction.value >= 1.0 - 1e-12);
    o.threads = 2;
    CHECK(same_result(out, range(in, o)));
    SwingOut s{};
    s.size = sizeof s;
    REQUIRE(share_swing(in, &s) == CTO_OK);
    CHECK(s.n_rows == 12);
    for (int k = 1; k < s.n_rows; ++k) CHECK(s.row[k].swing <= s.row[k - 1].swing);
}
