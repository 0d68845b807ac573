// The rules of share_range that do not depend on the model: reproducibility to the bit
// across thread counts (docs/models/ranges.md, "Reproducibility"), degenerate ranges equal
// to fixed inputs ("Input distributions"), invalid input named by index ("Inputs,
// options, outputs"), the precision cap ("Estimators and error bars"),
// and the probabilities counted over draws, against values computed by hand.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <vector>

#include "range/quantile.hpp"
#include "test_range_support.hpp"

using namespace cto_range_test;

namespace {

RangeOut run(ModelFn fn, const std::vector<RangeArg> &a, const RangeOptions &o) {
    RangeOut out{};
    out.size = sizeof out;
    run_range(Model{fn, nullptr}, a.data(), static_cast<int>(a.size()), o, &out);
    return out;
}

std::vector<RangeArg> args_d5() {
    return {rate_own(),          rate_other(),        fixed(365.0 / 12.0), pert(0.005, 0.02, 0.06),
            tri(0.10, 0.20, 0.35), tri(0.05, 0.15, 0.30)};
}

}  // namespace

TEST_CASE("Range rules: bit-identical results for 1, 2, 3 and 16 threads", "[range]") {
    RangeOptions o = options({0.05, 0.5, 0.9}, 42, 8, 12);
    o.digits = 4;
    o.threads = 1;
    const RangeOut one = run(model_d5, args_d5(), o);
    REQUIRE(one.log2_used > 8);  // the doubling ran
    for (int t : {2, 3, 16}) {
        o.threads = t;
        const RangeOut many = run(model_d5, args_d5(), o);
        INFO("threads " << t);
        CHECK(same_result(one, many));
    }
    // And the same run twice (no state survives a call).
    o.threads = 1;
    CHECK(same_result(one, run(model_d5, args_d5(), o)));
    // A different seed gives different draws.
    o.seed = 43;
    CHECK_FALSE(same_result(one, run(model_d5, args_d5(), o)));
}

TEST_CASE("Range rules: a degenerate range equals the fixed input, bit for bit", "[range]") {
    // low = high is a constant that keeps its dimension ("Inputs, options, outputs").
    const RangeOptions o = options({0.1, 0.5, 0.9}, 3, 9, 11);
    std::vector<RangeArg> a = args_d5();
    a[4] = fixed(0.2);
    const RangeOut base = run(model_d5, a, o);
    for (const RangeArg &deg : {uni(0.2, 0.2), tri(0.2, 0.2, 0.2), pert(0.2, 0.2, 0.2)}) {
        a[4] = deg;
        const RangeOut out = run(model_d5, a, o);
        CHECK(same_result(base, out));
        CHECK(out.dimension == 4);
    }
    // Every input constant: no uncertainty, SE 0, all digits, status ok at the first size.
    std::vector<RangeArg> c = {fixed(0.1), uni(0.05, 0.05), fixed(30), fixed(0.02), fixed(0.2),
                               tri(0.15, 0.15, 0.15)};
    const RangeOut k = run(model_d5, c, o);
    REQUIRE(k.status == CTO_OK);
    CHECK(k.dimension == 0);
    CHECK(k.log2_used == 9);
    double x[6] = {0.1, 0.05, 30, 0.02, 0.2, 0.15};
    Draw d{};
    int bad = -1;
    model_d5(nullptr, x, &d, &bad);
    for (int j = 0; j < 3; ++j) {
        CHECK(bits(k.own[j].value) == bits(d.own));
        CHECK(k.own[j].se == 0.0);
        CHECK(k.own[j].digits == 17);
    }
}

TEST_CASE("Range rules: invalid ranges and options are named by index", "[range]") {
    const RangeOptions o = options({0.1, 0.5, 0.9}, 0, 8, 10);
    struct Case { int slot; RangeArg arg; };
    const double nan = std::nan("");
    const Case cases[] = {
        {4, RangeArg{kUniform, 0.3, 0.0, 0.2}},       // low > high
        {5, RangeArg{kTriangular, 0.1, 0.4, 0.3}},    // mode above high
        {0, RangeArg{kPert, 0.05, 0.01, 0.2}},        // mode below low
        {1, RangeArg{kPert, nan, 0.05, 0.1}},         // NaN
        {1, RangeArg{kUniform, 0.0, 0.0, INFINITY}},  // infinite
        {4, RangeArg{9, 0.1, 0.2, 0.3}},              // unknown kind
        {3, RangeArg{kPert, 0.0, 0.5, 1.5}},          // p beyond 1: the model's own check
        {0, RangeArg{kFixed, nan, nan, nan}},         // fixed NaN
    };
    for (const Case &c : cases) {
        std::vector<RangeArg> a = args_d5();
        a[static_cast<size_t>(c.slot)] = c.arg;
        const RangeOut out = run(model_d5, a, o);
        INFO("slot " << c.slot);
        CHECK(out.status == CTO_E_INVALID);
        CHECK(out.bad == c.slot);
        CHECK(std::isnan(out.own[0].value));
        CHECK(out.spec_version == kSpecVersion);
    }
    struct OptCase { int bad; RangeOptions o; };
    std::vector<OptCase> opts;
    auto with = [&](int bad, auto edit) {
        RangeOptions x = o;
        edit(x);
        opts.push_back({bad, x});
    };
    with(kBadProbs, [](RangeOptions &x) { x.probs[1] = 0.0; });
    with(kBadProbs, [](RangeOptions &x) { x.probs[2] = 1.0; });
    with(kBadProbs, [](RangeOptions &x) { x.probs[0] = std::nan(""); });
    with(kBadProbs, [](RangeOptions &x) { x.n_probs = 0; });
    with(kBadProbs, [](RangeOptions &x) { x.n_probs = kMaxProbs + 1; });
    with(kBadReplicates, [](RangeOptions &x) { x.replicates = 1; });
    with(kBadReplicates, [](RangeOptions &x) { x.replicates = 257; });
    with(kBadDigits, [](RangeOptions &x) { x.digits = 0; });
    with(kBadLog2Start, [](RangeOptions &x) { x.log2_start = 0; });
    with(kBadLog2Max, [](RangeOptions &x) { x.log2_max = 7; });
    with(kBadLog2Max, [](RangeOptions &x) { x.log2_max = 25; });
    with(kBadLog2Max, [](RangeOptions &x) { x.replicates = 32; x.log2_max = 20; });  // memory cap
    with(kBadThreads, [](RangeOptions &x) { x.threads = -1; });
    for (const OptCase &c : opts) {
        const RangeOut out = run(model_d5, args_d5(), c.o);
        INFO("option index " << c.bad);
        CHECK(out.status == CTO_E_INVALID);
        CHECK(out.bad == c.bad);
    }
}

TEST_CASE("Range rules: precision not reached is a status, with every estimate", "[range]") {
    // Six digits of a quantile need far more than 2^10 points per replicate.
    RangeOptions o = options({0.1, 0.5, 0.9}, 1, 8, 10);
    o.digits = 6;
    const RangeOut out = run(model_d5, args_d5(), o);
    CHECK(out.status == kPrecisionNotReached);
    CHECK(out.log2_used == 10);
    for (int k = 0; k < 3; ++k) {
        CHECK(std::isfinite(out.own[k].value));
        CHECK(out.own[k].half_width > digit_tolerance(out.own[k].value, 6));
        CHECK(out.own[k].digits < 6);
    }
}

namespace {
// A model whose outcome is decided by one uniform input, so that every probability is
// known exactly: slot 0 ~ U(0, 1) is own's fallback b, slot 1 fixed other's fallback 0.3.
// No deal when b + 0.3 >= 1 (b >= 0.7: probability 0.3 exactly); own's walk-away value
// "binds" when b > 0.6 (probability 0.4), other's when b < 0.25 (0.25).
int model_edges(const void *, const double *x, Draw *d, int *) {
    const double b = x[0], c = x[1];
    const int binding = (b > 0.6 ? CTO_BINDS_OWN : 0) | (b < 0.25 ? CTO_BINDS_OTHER : 0);
    if (b + c >= 1.0) {
        *d = Draw{b, c, false, CTO_BINDS_NONE, true};
        return CTO_E_NO_DEAL;
    }
    *d = Draw{b + (1 - b - c) / 2, c + (1 - b - c) / 2, true, binding, false};
    return CTO_OK;
}
int model_indeterminate(const void *, const double *x, Draw *d, int *) {
    if (x[0] > 0.5) {
        *d = Draw{NAN, NAN, true, CTO_BINDS_NONE, true};
        return CTO_E_INDETERMINATE;
    }
    *d = Draw{x[0], 1 - x[0], true, CTO_BINDS_NONE, false};
    return CTO_OK;
}
}  // namespace

TEST_CASE("Range rules: probabilities and the edge-case fraction are counted", "[range]") {
    const RangeOut out = run(model_edges, {uni(0.0, 1.0), fixed(0.3)}, options({0.5, 0.9}, 9, 12, 12));
    // A (0, m, 1)-net puts exactly n p of the n draws below p for p a multiple of 2^-m,
    // up to the one straddling interval: fractions within 1/n of the exact values.
    const double n = 4096.0;
    CHECK(std::fabs(out.p_rational.value - 0.7) <= 1.0 / n);
    CHECK(std::fabs(out.edge_fraction.value - 0.3) <= 1.0 / n);
    CHECK(std::fabs(out.p_own_binds.value - (0.7 - 0.6)) <= 1.0 / n);  // bound and rational
    CHECK(std::fabs(out.p_other_binds.value - 0.25) <= 1.0 / n);
    CHECK(out.p_rational.value + out.edge_fraction.value == 1.0);
    // The 90% quantile of own share lies among the no-deal draws, which take own's no-deal
    // payoff b itself (never a formula value): b = 0.9.
    CHECK(std::fabs(out.own[1].value - 0.9) <= 2.0 / n);
    // Indeterminate draws make the whole run indeterminate.
    const RangeOut ind = run(model_indeterminate, {uni(0.0, 1.0)}, options({0.5}, 1, 8, 8));
    CHECK(ind.status == CTO_E_INDETERMINATE);
    CHECK(std::isnan(ind.own[0].value));
}

TEST_CASE("Range estimators: type-7 quantiles, pooled selection, t quantiles", "[range]") {
    // Hyndman & Fan (1996), definition 7 (numpy's and R's default): for 1, 2, 3, 4,
    // p = 0.5 gives 2.5, p = 0.1 gives 1.3 (h = 0.3), p = 0.9 gives 3.7.
    const double y[4] = {1, 2, 3, 4};
    CHECK(quantile7_sorted(y, 4, 0.5) == 2.5);
    CHECK(quantile7_sorted(y, 4, 0.1) == Approx(1.3).epsilon(1e-15));
    CHECK(quantile7_sorted(y, 4, 0.9) == Approx(3.7).epsilon(1e-15));
    // The pooled selection over sorted segments equals sorting the union (with ties,
    // signed zeros and negative values).
    std::vector<std::vector<double>> seg = {{-0.0, 0.5, 0.5, 2.0, 7.0},
                                            {-3.0, 0.0, 0.5, 1.0, 9.0},
                                            {-1.0, -0.0, 0.25, 0.75, 1.5}};
    std::vector<double> all;
    std::vector<const double *> ptr;
    for (auto &s : seg) {
        all.insert(all.end(), s.begin(), s.end());
        ptr.push_back(s.data());
    }
    sort_total(all.data(), all.size());
    for (double p : {0.01, 0.1, 0.2, 0.25, 0.5, 0.77, 0.9, 0.99}) {
        INFO("p=" << p);
        CHECK(bits(quantile7_pooled(ptr.data(), 3, 5, p)) ==
              bits(quantile7_sorted(all.data(), all.size(), p)));
    }
    CHECK(std::signbit(all[3]));  // totalOrder: -0 before +0
    CHECK_FALSE(std::signbit(all[5]));
    // t_{nu, 0.975}: 12.7062 (nu = 1), 2.2281 (nu = 10) from standard t tables (from
    // memory); 2.13145 (nu = 15) as in docs/models/ranges.md, "Estimators and error bars"
    // (the table in t_quantiles.inc is computed by mpmath).
    CHECK(t975(1) == Approx(12.7062).epsilon(1e-5));
    CHECK(t975(10) == Approx(2.2281).epsilon(1e-4));
    CHECK(t975(15) == Approx(2.13145).epsilon(1e-6));
    CHECK(std::isnan(t975(0)));
    // Digit target: half a unit of the third significant digit of 0.367 is 5e-4
    // ("Estimators and error bars").
    CHECK(digit_tolerance(0.367, 3) == Approx(5e-4).epsilon(1e-15));
    CHECK(digit_tolerance(36.7, 3) == Approx(0.05).epsilon(1e-15));
    CHECK(digits_reached(0.367, 4.9e-4) == 3);
    CHECK(digits_reached(0.367, 5.1e-4) == 2);
}

TEST_CASE("Ranges: the sort puts doubles in IEEE 754 totalOrder at every length", "[range]") {
    // IEEE 754-2008 s.5.10 totalOrder: -inf < negatives < -0 < +0 < positives < +inf,
    // compared here with std::sort on a comparator written from that definition, for lengths
    // on both sides of the switch from comparison to bucket sorting, and for values that
    // share their leading bits, values that do not, a crowd of equal values beside a spread
    // (a bucket too full for insertion) and values all equal.
    auto total_less = [](double a, double b) {
        if (a < b) return true;
        if (b < a) return false;
        return std::signbit(a) && !std::signbit(b);  // -0 before +0
    };
    uint64_t state = 42;
    auto next = [&state] {  // SplitMix64 (Steele, Lea & Flood 2014) as a test stream
        state += 0x9E3779B97F4A7C15ull;
        uint64_t z = state;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9ull;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBull;
        return z ^ (z >> 31);
    };
    for (size_t n : {size_t{1}, size_t{2}, size_t{255}, size_t{256}, size_t{257}, size_t{4096},
                     size_t{1} << 18}) {
        for (int kind = 0; kind < 5; ++kind) {
            std::vector<double> y(n);
            for (size_t i = 0; i < n; ++i) {
                const double u = static_cast<double>(next() >> 11) * 0x1p-53;
                if (kind == 0) y[i] = 41.0 + u;                    // one deal: shared leading bits
                else if (kind == 1) y[i] = (u - 0.5) * 1e6;        // both signs, wide range
                else if (kind == 2) y[i] = (i % 7 == 0) ? -0.0 : (i % 11 == 0) ? 0.0 : (i % 13 == 0) ? -INFINITY
                         : (i % 17 == 0) ? INFINITY : std::ldexp(u, static_cast<int>(next() % 200) - 100);
                else if (kind == 3) y[i] = (i % 2 == 0) ? 12.5 : 10.0 + 5.0 * u;  // no deal in half
                else y[i] = 0.25;
            }
            std::vector<double> want = y;
            std::sort(want.begin(), want.end(), total_less);
            sort_total(y.data(), n);
            INFO("n=" << n << " kind=" << kind);
            for (size_t i = 0; i < n; ++i) REQUIRE(bits(y[i]) == bits(want[i]));
        }
    }
}
