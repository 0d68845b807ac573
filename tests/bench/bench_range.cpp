// share_range against its baseline, in one run (ratios, not absolute times, are the result:
// the machines are noisy).  Three tables, the speed goals of docs/models/ranges.md "Speed":
//   1. cost per point of share_range beside one solve_from_rates evaluation through the
//      strided entry point (cto_call_strided) at the same inputs: the generator, the inverse
//      CDFs and the quantiles should add at most 30%; the ratio is the median of 15
//      back-to-back pairs, which a busy spell on a shared machine cannot move much;
//   2. milliseconds for three significant digits of the 10/50/90% quantiles with the
//      default options on one thread (the sample sheet's deal), with the points reached;
//      Times are this thread's CPU time (CLOCK_THREAD_CPUTIME_ID), best of several runs, so
//      that the time the thread waits for a core on a shared machine is not counted;
//   3. the error of the mean at equal points: randomized QMC (one scrambled replicate)
//      beside plain Monte Carlo (SplitMix64 uniforms; Steele, Lea & Flood 2014).
// Run: build with -DCTO_BUILD_BENCH=ON, then ./build/tests/bench/cto_bench_range
#include <time.h>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <vector>

#include "counteroffer/counteroffer.h"
#include "range/distributions.hpp"
#include "range/rates_model.hpp"
#include "range/scramble.hpp"
#include "range/sobol.hpp"

namespace {
namespace rg = cto::core::range;
using Clock = std::chrono::steady_clock;
volatile double g_sink;

constexpr int kSolveFromRates = 26;  // table id of solve_from_rates (lib/functions/solve_from_rates.toml)

double ms_since(Clock::time_point t0) {
    return std::chrono::duration<double, std::milli>(Clock::now() - t0).count();
}

double thread_cpu_ms() {
    timespec t{};
    clock_gettime(CLOCK_THREAD_CPUTIME_ID, &t);
    return static_cast<double>(t.tv_sec) * 1e3 + static_cast<double>(t.tv_nsec) * 1e-6;
}

// Best of `reps` runs in this thread's CPU time (one-thread work only).
template <class F>
double best_ms(int reps, F &&body) {
    double best = 1e300;
    for (int r = 0; r < reps; ++r) {
        const double t0 = thread_cpu_ms();
        body();
        best = std::min(best, thread_cpu_ms() - t0);
    }
    return best;
}

// Best of `reps` runs in wall-clock time (for work spread over threads).
template <class F>
double best_wall_ms(int reps, F &&body) {
    double best = 1e300;
    for (int r = 0; r < reps; ++r) {
        const auto t0 = Clock::now();
        body();
        best = std::min(best, ms_since(t0));
    }
    return best;
}

cto_range_arg fixed(double v) { return cto_range_arg{CTO_RANGE_FIXED, v, v, v}; }
cto_range_arg pert(double lo, double m, double hi) { return cto_range_arg{CTO_RANGE_PERT, lo, m, hi}; }
cto_range_arg tri(double lo, double m, double hi) { return cto_range_arg{CTO_RANGE_TRIANGULAR, lo, m, hi}; }

struct Case {
    const char *name;
    cto_range_input in;
};

// The sample sheet "uncertain counterparty" (sample-sheets/build_uncertain.py, fictional):
// their cost of capital, the breakdown risk and their walk-away value as PERT ranges.
Case sample_deal() {
    Case c{"sample sheet deal (3 PERT)", {}};
    c.in.size = sizeof c.in;
    const double v[CTO_RANGE_INPUTS] = {0.09, 0.11, 30, 0.03, 0, 0, 0, 0, 12, 25, 80, 1, 365, 0};
    for (int j = 0; j < CTO_RANGE_INPUTS; ++j) c.in.arg[j] = fixed(v[j]);
    c.in.arg[1] = pert(0.06, 0.11, 0.20);
    c.in.arg[3] = pert(0.01, 0.03, 0.08);
    c.in.arg[9] = pert(15, 25, 60);
    return c;
}

// Two rates only, triangular (a cheap inverse CDF): the generator's own cost shows.
Case two_rates() {
    Case c{"two rates (triangular)", {}};
    c.in.size = sizeof c.in;
    const double v[CTO_RANGE_INPUTS] = {0.1, 0.05, 30, 0, 0, 0, 0, 0, -INFINITY, -INFINITY, 1, 1, 365, 0};
    for (int j = 0; j < CTO_RANGE_INPUTS; ++j) c.in.arg[j] = fixed(v[j]);
    c.in.arg[0] = tri(0.05, 0.10, 0.20);
    c.in.arg[1] = tri(0.02, 0.05, 0.12);
    return c;
}

// Five inputs: both rates, the breakdown risk and both walk-away values.
Case five_inputs() {
    Case c = sample_deal();
    c.name = "five inputs (PERT, triangular)";
    c.in.arg[0] = tri(0.07, 0.09, 0.12);
    c.in.arg[8] = tri(8, 12, 20);
    return c;
}

rg::Dist dist_of(const cto_range_arg &a) { return rg::Dist{a.kind, a.low, a.mode, a.high}; }

// The draws share_range makes (replicate 0, seed 0), as 14 input columns.
std::vector<std::vector<double>> draws(const cto_range_input &in, size_t n) {
    std::vector<std::vector<double>> col(CTO_RANGE_INPUTS, std::vector<double>(n));
    for (int j = 0; j < CTO_RANGE_INPUTS; ++j) {
        const cto_range_arg &a = in.arg[j];
        const rg::DistPlan plan = rg::dist_plan(dist_of(a));
        const uint64_t key = rg::scramble_key(0, 0, static_cast<uint64_t>(j));
        for (size_t i = 0; i < n; ++i)
            col[j][i] = a.kind == CTO_RANGE_FIXED
                            ? a.mode
                            : rg::dist_quantile(plan, rg::unit_from_bits(rg::owen_scramble(
                                                          rg::sobol_point(i, j), key)));
    }
    return col;
}

// Table 1: ns per point, share_range at a fixed size beside the strided model.
void cost_per_point(const Case &c) {
    const int m = 14, R = 16;
    const size_t n = size_t{R} << m;
    cto_range_options opt;
    cto_range_default_options(&opt);
    opt.log2_start = opt.log2_max = m;
    opt.replicates = R;
    opt.digits = 15;  // never reached: exactly R 2^m points
    cto_range_outcome out{};
    out.size = sizeof out;
    const auto col = draws(c.in, n);
    std::vector<const char *> args(CTO_RANGE_INPUTS);
    std::vector<ptrdiff_t> strides(CTO_RANGE_INPUTS, sizeof(double));
    for (int j = 0; j < CTO_RANGE_INPUTS; ++j) args[j] = reinterpret_cast<const char *>(col[j].data());
    const cto_function_info *f = cto_function_find("solve_from_rates");
    std::vector<std::vector<double>> res(static_cast<size_t>(f->n_outputs), std::vector<double>(n));
    std::vector<char *> outs;
    std::vector<ptrdiff_t> ostr(res.size(), sizeof(double));
    for (auto &r : res) outs.push_back(reinterpret_cast<char *>(r.data()));
    // The two alternate, back to back, 15 times; the ratio is the median of the 15 pairs'
    // ratios (a busy spell on the shared machine slows a pair, not the median), the
    // times the best of each.
    double t_range = 1e300, t_strided = 1e300;
    std::vector<double> ratio;
    for (int r = 0; r < 15; ++r) {
        const double a = best_ms(1, [&] { cto_share_range(&c.in, &opt, &out); });
        const double b = best_ms(1, [&] {
            cto_call_strided(kSolveFromRates, n, args.data(), strides.data(), outs.data(),
                             ostr.data(), nullptr, 0, nullptr);
        });
        t_range = std::min(t_range, a);
        t_strided = std::min(t_strided, b);
        ratio.push_back(a / b);
    }
    std::sort(ratio.begin(), ratio.end());
    g_sink = out.own[1].value + res[0][n / 2];
    const double ns_range = t_range * 1e6 / static_cast<double>(n);
    const double ns_strided = t_strided * 1e6 / static_cast<double>(n);
    std::printf("%-32s %2d   %8.0f   %8.0f    %5.2f   %5.2f-%4.2f\n", c.name, out.dimension, ns_range,
                ns_strided, ratio[ratio.size() / 2], ratio[3], ratio[ratio.size() - 4]);
}

// Table 2: three digits of the 10/50/90% quantiles with the defaults, one thread.
void three_digits(const Case &c) {
    cto_range_options opt;
    cto_range_default_options(&opt);
    cto_range_outcome out{};
    out.size = sizeof out;
    const double t = best_ms(9, [&] { cto_share_range(&c.in, &opt, &out); });
    opt.threads = 2;
    const double t2 = best_wall_ms(9, [&] { cto_share_range(&c.in, &opt, &out); });
    std::printf("%-32s %2d   %6.1f   %6.1f   2^%-2d x %2d   %9llu  %d   %.4g / %.4g / %.4g\n", c.name,
                out.dimension, t, t2, out.log2_used, out.replicates,
                static_cast<unsigned long long>(out.points_per_replicate) *
                    static_cast<unsigned long long>(out.replicates),
                out.status, out.own[0].value, out.own[1].value, out.own[2].value);
}

// Table 3: RMSE of the mean of own share over 40 repetitions, plain MC beside one
// scrambled replicate, against a 2^22-point RQMC reference of the same model.
void mean_error(const Case &c) {
    double x[CTO_RANGE_INPUTS];
    std::vector<rg::DistPlan> plan;  // a few tens of kB each: on the heap
    for (int j = 0; j < CTO_RANGE_INPUTS; ++j) plan.push_back(rg::dist_plan(dist_of(c.in.arg[j])));
    auto eval = [&](auto &&unit) {
        for (int j = 0; j < CTO_RANGE_INPUTS; ++j)
            x[j] = c.in.arg[j].kind == CTO_RANGE_FIXED ? c.in.arg[j].mode
                                                       : rg::dist_quantile(plan[j], unit(j));
        rg::Draw d{};
        int bad = -1;
        rg::rates_draw(nullptr, x, &d, &bad);
        return d.own;
    };
    cto_range_options opt;
    cto_range_default_options(&opt);
    opt.log2_start = opt.log2_max = 18;
    opt.digits = 15;
    opt.seed = 12345;
    cto_range_outcome ref{};
    ref.size = sizeof ref;
    cto_share_range(&c.in, &opt, &ref);
    const double exact = ref.own_mean.value;
    std::printf("%s: reference mean %.9f (16 x 2^18 points, 95%% half-width %.1e)\n", c.name, exact,
                ref.own_mean.half_width);
    std::printf("   n    RMSE MC     RMSE RQMC   RQMC / MC\n");
    for (int m = 8; m <= 16; m += 2) {
        const uint64_t n = uint64_t{1} << m;
        double se_mc = 0, se_q = 0;
        for (uint64_t rep = 0; rep < 40; ++rep) {
            double smc = 0, sq = 0;
            uint64_t state = 987654321 + rep * 7919;
            uint64_t key[CTO_RANGE_INPUTS];
            for (int j = 0; j < CTO_RANGE_INPUTS; ++j) key[j] = rg::scramble_key(99, rep, static_cast<uint64_t>(j));
            for (uint64_t i = 0; i < n; ++i) {
                smc += eval([&](int) {
                    state += rg::kGolden;
                    return (static_cast<double>(rg::mix64(state) >> 11) + 0.5) * 0x1p-53;
                });
                sq += eval([&](int j) {
                    return rg::unit_from_bits(rg::owen_scramble(rg::sobol_point(i, j), key[j]));
                });
            }
            se_mc += std::pow(smc / static_cast<double>(n) - exact, 2);
            se_q += std::pow(sq / static_cast<double>(n) - exact, 2);
        }
        std::printf("2^%-3d  %.3e   %.3e   %.4f\n", m, std::sqrt(se_mc / 40), std::sqrt(se_q / 40),
                    std::sqrt(se_q / se_mc));
    }
}

}  // namespace

int main() {
    const Case cases[] = {sample_deal(), two_rates(), five_inputs()};
    std::printf("1. Cost per point: share_range (16 x 2^14 points) beside cto_call_strided of\n"
                "   solve_from_rates over the same draws (goal: ratio at most 1.3; the median of\n"
                "   15 back-to-back pairs; ns: the best of each)\n");
    std::printf("%-32s %2s   %8s   %8s    %5s   %s\n", "case", "d", "ns/point", "strided", "ratio",
                "middle 9 of 15");
    for (const Case &c : cases) cost_per_point(c);
    std::printf("\n2. Three significant digits of q10/q50/q90, default options (goal: 20 ms a cell)\n");
    std::printf("%-32s %2s   %6s   %6s   %-8s   %9s  %s   %s\n", "case", "d", "ms", "2 thr*", "n x R",
                "points", "st", "q10 / q50 / q90");
    for (const Case &c : cases) three_digits(c);
    std::printf("   (ms: CPU time of the calling thread; *2 thr: wall-clock time with two threads)\n");
    std::printf("\n3. Error of the mean at equal points (goal: RQMC at most 1/10 of MC's)\n");
    for (const Case &c : cases) mean_error(c);
    return 0;
}
