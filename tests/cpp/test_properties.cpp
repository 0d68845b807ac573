// Properties the models must have (docs/models/complete-information.md s.1-6 and s.10), on random inputs
// from a fixed seed.  Each property names the result it follows from.
#include <catch2/catch.hpp>

#include <cmath>
#include <cstring>
#include <iomanip>
#include <random>
#include <vector>

#include "counteroffer/counteroffer.h"
#include "test_support.hpp"

namespace {
std::mt19937_64 rng(20261202);
double uni(double lo, double hi) { return std::uniform_real_distribution<double>(lo, hi)(rng); }
double factor() {  // factors from 0 to within 1e-9 of 1, evenly in log(1 - d)
    return 1.0 - std::pow(10.0, uni(-9.0, 0.0));
}
cto_solve_input solve_in(double dO, double dT) {
    cto_solve_input in{};
    in.size = sizeof in;
    in.own_factor = dO;
    in.other_factor = dT;
    in.surplus = 1;
    in.own_opens = 1;
    return in;
}
cto_solve_outcome run(const cto_solve_input &in, int *st) {
    cto_solve_outcome o;
    o.size = sizeof o;
    *st = cto_solve(&in, &o);
    return o;
}
}  // namespace

TEST_CASE("solve: own + other = surplus whenever a deal is rational (but a one-round delay)", "[property]") {
    // Immediate agreement in every stationary equilibrium: the surplus is split in full
    // (Rubinstein 1982; Muthoo 1999 chs.4-6).
    int rational = 0, delayed = 0;
    for (int i = 0; i < 20000; ++i) {
        cto_solve_input in = solve_in(factor(), factor());
        in.breakdown_prob = uni(0, 1) < 0.3 ? 0.0 : uni(0, 1);
        in.surplus = std::pow(10.0, uni(-6, 12));
        const double S = in.surplus;
        in.own_fallback = uni(-0.5, 0.5) * S;
        in.other_fallback = uni(-0.5, 0.5) * S;
        in.own_inside = uni(0, 1) < 0.5 ? 0.0 : uni(-0.3, 0.5) * S;
        in.other_inside = uni(0, 1) < 0.5 ? 0.0 : uni(-0.3, 0.5) * S;
        in.has_own_outside = uni(0, 1) < 0.5;
        in.has_other_outside = uni(0, 1) < 0.5;
        in.own_outside = uni(-0.2, 0.7) * S;
        in.other_outside = uni(-0.2, 0.7) * S;
        in.own_opens = uni(0, 1) < 0.5;
        int st;
        const cto_solve_outcome o = run(in, &st);
        INFO("case " << i << std::setprecision(17) << ": d " << in.own_factor << ", " << in.other_factor
                      << " p " << in.breakdown_prob << " b " << in.own_fallback << ", " << in.other_fallback
                      << " g " << in.own_inside << ", " << in.other_inside << " w "
                      << (in.has_own_outside ? in.own_outside : -INFINITY) << ", "
                      << (in.has_other_outside ? in.other_outside : -INFINITY) << " S " << S
                      << " opens " << in.own_opens << " -> " << o.own_share << ", " << o.other_share
                      << " nd " << o.own_no_deal << ", " << o.other_no_deal << " binding " << o.binding);
        REQUIRE((st == CTO_OK || st == CTO_E_NO_DEAL));
        if (st == CTO_OK) {
            ++rational;
            CHECK(o.deal_rational == 1);
            const double scale = std::fabs(S) + std::fabs(o.own_no_deal) + std::fabs(o.other_no_deal);
            // The one exception (Muthoo 1999 ch.5-6 timing): when the opener's walk-away
            // value exceeds what agreeing now leaves it, it refuses for a round; the present
            // values then include a round of status-quo flows and breakdown risk and need
            // not add up to the surplus.  The opener's option binds in that case.
            const bool opener_binds = in.own_opens ? (o.binding == CTO_BINDS_OWN || o.binding == CTO_BINDS_BOTH)
                                                   : (o.binding == CTO_BINDS_OTHER || o.binding == CTO_BINDS_BOTH);
            const double gap = S - (o.own_share + o.other_share);
            if (std::fabs(gap) > 1e-15 * scale) {
                ++delayed;
                CHECK(opener_binds);
            }
            // Each side gets at least what it can secure without a deal (individual
            // rationality).  The responder can walk away at once; the opener answers only
            // after a rejected offer, so it can secure the one-round continuation value of
            // its no-deal payoff: c(v) = p b + (1-p)((1-d) g + d v) (Muthoo 1999 ch.5-6).
            auto cont = [&](double d, double b, double g, double v) {
                const double p = in.breakdown_prob;
                return p * b + (1 - p) * ((1 - d) * g + d * v);
            };
            const double own_secure =
                in.own_opens ? std::min(o.own_no_deal, cont(in.own_factor, in.own_fallback,
                                                            in.own_inside, o.own_no_deal))
                             : o.own_no_deal;
            const double oth_secure =
                in.own_opens ? o.other_no_deal
                             : std::min(o.other_no_deal, cont(in.other_factor, in.other_fallback,
                                                              in.other_inside, o.other_no_deal));
            const double tol = 1e-15 * (scale + std::fabs(in.own_fallback) + std::fabs(in.other_fallback) +
                                        std::fabs(in.own_inside) + std::fabs(in.other_inside));
            CHECK(o.own_share >= own_secure - tol);
            CHECK(o.other_share >= oth_secure - tol);
        } else {
            CHECK(o.deal_rational == 0);
            CHECK(o.own_share == o.own_no_deal);
        }
    }
    CHECK(rational > 5000);
    CHECK(delayed < rational / 100);  // a corner, not the rule
}

TEST_CASE("own share rises with own patience and with own outside option", "[property]") {
    // Rubinstein (1982): d x*/d d_own >= 0; outside option principle (Muthoo 1999 ch.5).
    for (int i = 0; i < 5000; ++i) {
        const double d1 = factor(), d2 = factor(), dt = factor();
        const double lo = std::min(d1, d2), hi = std::max(d1, d2);
        for (int opens = 0; opens < 2; ++opens) {
            double a, b;
            REQUIRE(cto_share(lo, dt, 1, opens, &a) == CTO_OK);
            REQUIRE(cto_share(hi, dt, 1, opens, &b) == CTO_OK);
            CHECK(b >= a * (1 - 1e-15));
            const double p = uni(0, 0.2), bo = uni(0, 0.3), bt = uni(0, 0.3);
            if (cto_breakdown_share(lo, dt, p, bo, bt, 1, opens, &a) == CTO_OK &&
                cto_breakdown_share(hi, dt, p, bo, bt, 1, opens, &b) == CTO_OK)
                CHECK(b >= a - 1e-15);
            const double w1 = uni(0, 0.6), w2 = uni(0, 0.6), wt = uni(0, 0.3);
            if (cto_outside_option_share(0.9, 0.9, std::min(w1, w2), wt, 1, opens, &a) == CTO_OK &&
                cto_outside_option_share(0.9, 0.9, std::max(w1, w2), wt, 1, opens, &b) == CTO_OK)
                CHECK(b >= a - 1e-15);
        }
    }
}

TEST_CASE("the opener's advantage is never negative and equals opener minus responder share",
          "[property]") {
    // docs/models/complete-information.md s.10: S (1 - d_A)(1 - d_B)/(1 - d_A d_B) = x* - (S - y*).
    for (int i = 0; i < 5000; ++i) {
        const double a = factor(), b = factor();
        double fma_, as_opener, as_responder;
        if (a == 1.0 && b == 1.0) continue;
        REQUIRE(cto_first_mover_advantage(a, b, 1, &fma_) == CTO_OK);
        REQUIRE(cto_share(a, b, 1, 1, &as_opener) == CTO_OK);
        REQUIRE(cto_share(a, b, 1, 0, &as_responder) == CTO_OK);
        CHECK(fma_ >= 0.0);
        CHECK(std::fabs(fma_ - (as_opener - as_responder)) <= 4.5e-16);
    }
}

TEST_CASE("deadline_share tends to share as rounds grow", "[property]") {
    // Stahl (1972) -> Rubinstein (1982): the gap shrinks like q^(T/2)
    // (docs/models/complete-information.md s.3).
    for (int i = 0; i < 300; ++i) {
        const double a = uni(0.5, 0.999), b = uni(0.5, 0.999);
        const double ba = uni(0, 0.4), bb = uni(0, 0.4);
        double inf_share, prev_gap = 1e300;
        REQUIRE(cto_share(a, b, 1, 1, &inf_share) == CTO_OK);
        for (int64_t T = 1; T < (int64_t(1) << 40); T *= 4) {
            double v;
            REQUIRE(cto_deadline_share(a, b, 2 * T + 1, ba, bb, 1, 1, &v) == CTO_OK);
            const double gap = std::fabs(v - inf_share);
            CHECK(gap <= std::pow(a * b, static_cast<double>(T)) * 1.0 + 1e-15);
            CHECK(gap <= prev_gap + 1e-15);
            prev_gap = gap;
        }
        CHECK(prev_gap <= 1e-15);
    }
}

TEST_CASE("share_from_rates tends to limit_share as days tend to 0", "[property]") {
    // BRW (1986): x*(Delta) -> r_B/(r_A + r_B) with error O(Delta).
    for (int i = 0; i < 2000; ++i) {
        const double ra = uni(0.001, 0.5), rb = uni(0.001, 0.5);
        double lim;
        REQUIRE(cto_limit_share(ra, rb, 1, &lim) == CTO_OK);
        for (double days = 30; days > 1e-9; days /= 10) {
            double v;
            REQUIRE(cto_share_from_rates(ra, rb, days, 1, 1, 365, 1, &v) == CTO_OK);
            // |x(D) - limit| <= r_A r_B D / (r_A + r_B) (first-mover gap bound, s.10).
            CHECK(std::fabs(v - lim) <= (ra * rb / (ra + rb)) * days / 365 + 4e-16);
        }
    }
}

TEST_CASE("implied_factor inverts share", "[property]") {
    for (int i = 0; i < 20000; ++i) {
        const double d = factor(), dt = uni(0.05, 0.999);
        for (int opens = 0; opens < 2; ++opens) {
            double s, back;
            REQUIRE(cto_share(d, dt, 1, opens, &s) == CTO_OK);
            const int st = cto_implied_factor(s, dt, opens, &back);
            INFO("d = " << d << " dt = " << dt << " opens = " << opens << " s = " << s);
            REQUIRE(st == CTO_OK);
            // Conditioning: ds/d(1 - d) is about s/(1 - d d_t), so 1 - d comes back to a
            // relative error of a few ulps of s divided by that sensitivity.
            CHECK(std::fabs((1 - back) - (1 - d)) <= 1e-15 * (1 - d) + 4e-16 * (1 - d * dt) / std::max(s, 1e-300) * 8);
        }
    }
}

TEST_CASE("special functions agree with solve to the last digit", "[property]") {
    // docs/models/complete-information.md s.7: each special function is solve with the other features off.
    for (int i = 0; i < 20000; ++i) {
        const double a = factor(), b = factor();
        const int opens = i % 2;
        cto_solve_input in = solve_in(a, b);
        in.own_opens = opens;
        in.surplus = std::pow(10.0, uni(-3, 9));
        int st;
        double v;
        cto_solve_outcome o = run(in, &st);
        if (cto_share(a, b, in.surplus, opens, &v) == CTO_OK) {
            REQUIRE(st == CTO_OK);
            CHECK(v == o.own_share);
        }
        in.breakdown_prob = uni(0, 1);
        in.own_fallback = uni(-0.2, 0.3) * in.surplus;
        in.other_fallback = uni(-0.2, 0.3) * in.surplus;
        o = run(in, &st);
        const int sb = cto_breakdown_share(a, b, in.breakdown_prob, in.own_fallback,
                                           in.other_fallback, in.surplus, opens, &v);
        CHECK(sb == st);
        if (sb == CTO_OK) CHECK(v == o.own_share);
        in.breakdown_prob = in.own_fallback = in.other_fallback = 0;
        in.has_own_outside = in.has_other_outside = 1;
        in.own_outside = uni(-0.1, 0.6) * in.surplus;
        in.other_outside = uni(-0.1, 0.6) * in.surplus;
        o = run(in, &st);
        const int so = cto_outside_option_share(a, b, in.own_outside, in.other_outside,
                                                in.surplus, opens, &v);
        CHECK(so == st);
        if (so == CTO_OK) CHECK(v == o.own_share);
    }
}

TEST_CASE("outside options: each regime of Muthoo (1999) ch.5 is reached and reported",
          "[property]") {
    // d = 0.9, pie 1 (check values 40-49 of test_published.cpp): U = 1/1.9; thresholds
    // d U = 0.47368...
    int st;
    cto_solve_input in = solve_in(0.9, 0.9);
    in.has_own_outside = in.has_other_outside = 1;
    in.own_outside = 0.0;
    in.other_outside = 0.3;
    CHECK(run(in, &st).binding == CTO_BINDS_NONE);
    in.other_outside = 0.5;
    CHECK(run(in, &st).binding == CTO_BINDS_OTHER);
    in.own_outside = 0.5;
    in.other_outside = 0.0;
    CHECK(run(in, &st).binding == CTO_BINDS_OWN);
    in.own_factor = in.other_factor = 0.5;
    in.own_outside = in.other_outside = 0.4;
    const cto_solve_outcome both = run(in, &st);
    CHECK(both.binding == CTO_BINDS_BOTH);
    CHECK(both.own_share == Approx(0.6).epsilon(1e-15));  // row 46: pie - w_B
    // At the threshold w_B = d/(1+d) (row 50) the outcome is flagged as a boundary.
    in = solve_in(0.9, 0.9);
    in.has_other_outside = 1;
    in.other_outside = 0.9 / 1.9;
    CHECK(run(in, &st).boundary == 1);
    in.other_outside = 0.3;
    CHECK(run(in, &st).boundary == 0);
}

TEST_CASE("the strided loop equals the scalar calls, with statuses and report", "[property]") {
    for (size_t fi = 0; fi < cto_function_count(); ++fi) {
        const cto_function_info *f = cto_function_at(fi);
        const size_t n = 257;
        const size_t na = static_cast<size_t>(f->n_args), no = static_cast<size_t>(f->n_outputs);
        std::vector<std::vector<double>> cols(na);
        const auto base = cto_test::base_args(f);
        for (size_t j = 0; j < na; ++j) {
            cols[j].resize(n);
            for (size_t i = 0; i < n; ++i) {
                double v = base[j];
                const cto_arg_info &a = f->args[j];
                if (a.kind == CTO_ARG_UNIT) v *= uni(0.8, 1.0);
                if (a.kind == CTO_ARG_REAL) v *= uni(0.8, 1.1);
                if (i % 17 == 3 && j == 0) v = NAN;  // some invalid elements
                cols[j][i] = v;
            }
        }
        std::vector<std::vector<double>> outs(no, std::vector<double>(n));
        std::vector<const char *> ap(na);
        std::vector<ptrdiff_t> as(na, sizeof(double));
        for (size_t j = 0; j < na; ++j) ap[j] = reinterpret_cast<const char *>(cols[j].data());
        as[na - 1] = 0;  // the last argument broadcast from element 0
        std::vector<char *> op(no);
        std::vector<ptrdiff_t> os(no, sizeof(double));
        for (size_t k = 0; k < no; ++k) op[k] = reinterpret_cast<char *>(outs[k].data());
        std::vector<signed char> sts(n, -1);
        cto_batch_report rep;
        rep.size = sizeof rep;
        REQUIRE(cto_call_strided(f->id, n, ap.data(), as.data(), op.data(), os.data(), sts.data(), 1,
                                 &rep) == CTO_OK);
        size_t counted = 0;
        for (int s = 0; s < CTO_REPORT_SLOTS; ++s) counted += rep.count[s];
        CHECK(counted == n);
        for (size_t i = 0; i < n; ++i) {
            std::vector<double> a(na), o(no);
            for (size_t j = 0; j < na; ++j) a[j] = cols[j][j == na - 1 ? 0 : i];
            const int st = cto_call(f->id, a.data(), o.data(), nullptr);
            INFO(f->name << " element " << i);
            CHECK(st == sts[i]);
            for (size_t k = 0; k < no; ++k)
                CHECK((std::memcmp(&o[k], &outs[k][i], sizeof(double)) == 0 ||
                       (std::isnan(o[k]) && std::isnan(outs[k][i]))));
        }
        size_t expect_invalid = 0;
        for (size_t i = 0; i < n; ++i) expect_invalid += (i % 17 == 3);
        CHECK(rep.count[CTO_E_INVALID] == expect_invalid);
        CHECK(rep.first_index[CTO_E_INVALID] == 3);
        CHECK(rep.first_bad_arg == 0);
    }
}
