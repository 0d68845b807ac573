// ns per evaluation of every catalogue function, beside naive hand-written loops compiled
// in the same run (same compiler, flags and inputs).  Ratios, not absolute times, are the
// result: the machines are noisy.  Run: build with -DCTO_BUILD_BENCH=ON, then
//   ./build/bench/tests/bench/cto_bench_core
#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <random>
#include <vector>

#include "counteroffer/counteroffer.h"

namespace {
using Clock = std::chrono::steady_clock;
volatile double g_sink;

template <class F>
double ns_per_eval(size_t n, F &&body) {
    double best = 1e300;
    for (int rep = 0; rep < 5; ++rep) {  // best of five
        const auto t0 = Clock::now();
        body();
        const double ns = std::chrono::duration<double, std::nano>(Clock::now() - t0).count();
        best = std::min(best, ns / static_cast<double>(n));
    }
    return best;
}

// Typical argument values for each function (valid, ordinary deal-room inputs).
std::vector<double> typical(const cto_function_info *f, std::mt19937_64 &rng) {
    std::uniform_real_distribution<double> u(0.0, 1.0);
    std::vector<double> a;
    for (int j = 0; j < f->n_args; ++j) {
        const cto_arg_info &arg = f->args[j];
        const std::string n = arg.name;
        double v = arg.has_default ? arg.default_value : 0.0;
        if (n.find("factor") != std::string::npos) v = 0.9 + 0.099 * u(rng);
        else if (n.find("rate") != std::string::npos) v = 0.02 + 0.1 * u(rng);
        else if (n == "days") v = 1 + 60 * u(rng);
        else if (n == "breakdown_prob") v = 0.01 + 0.1 * u(rng);
        else if (n.find("fallback") != std::string::npos || n.find("inside") != std::string::npos)
            v = 0.1 * u(rng);
        else if (n.find("outside") != std::string::npos) v = 0.4 * u(rng);
        else if (n == "rounds") v = std::floor(1 + 100 * u(rng));
        else if (n.find("cost") != std::string::npos) v = 0.01 + 0.05 * u(rng);
        else if (n == "stake") v = u(rng);
        else if (n.find("curvature") != std::string::npos) v = 0.3 + 0.7 * u(rng);
        else if (n == "parties") v = 5;
        else if (n == "observed_share") v = 0.45 + 0.1 * u(rng);
        else if (n == "high_value") v = 1;
        else if (n == "low_value") v = 0.5;
        else if (n == "high_prob") v = u(rng);
        a.push_back(v);
    }
    return a;
}
}  // namespace

int main() {
    const size_t n = 1 << 16;
    std::mt19937_64 rng(7);
    std::uniform_real_distribution<double> u(0.9, 0.999);
    std::vector<double> fa(n), fb(n), out(n);
    for (size_t i = 0; i < n; ++i) {
        fa[i] = u(rng);
        fb[i] = u(rng);
    }
    // Baselines: the naive Rubinstein formula, no validation, and the naive rate form.
    const double naive_share = ns_per_eval(n, [&] {
        for (size_t i = 0; i < n; ++i) out[i] = (1 - fb[i]) / (1 - fa[i] * fb[i]);
        g_sink = out[n / 2];
    });
    const double naive_rates = ns_per_eval(n, [&] {
        for (size_t i = 0; i < n; ++i) {
            const double da = std::exp(-fa[i] * 30 / 365), db = std::exp(-fb[i] * 30 / 365);
            out[i] = (1 - db) / (1 - da * db);
        }
        g_sink = out[n / 2];
    });
    std::printf("baseline: naive (1-b)/(1-a*b) loop %.2f ns/eval; naive rate form %.2f ns/eval\n\n",
                naive_share, naive_rates);
    std::printf("%-24s %12s %12s %14s\n", "function", "scalar ns", "strided ns", "x naive share");
    for (size_t fi = 0; fi < cto_function_count(); ++fi) {
        const cto_function_info *f = cto_function_at(fi);
        const size_t m = (std::string(f->name) == "nash_share" ||
                          std::string(f->name) == "risk_averse_share" ||
                          std::string(f->name) == "deadline_share")
                             ? n / 16
                             : n;
        const size_t na = static_cast<size_t>(f->n_args), no = static_cast<size_t>(f->n_outputs);
        std::vector<std::vector<double>> cols(na, std::vector<double>(m));
        for (size_t i = 0; i < m; ++i) {
            const auto a = typical(f, rng);
            for (size_t j = 0; j < na; ++j) cols[j][i] = a[j];
        }
        std::vector<std::vector<double>> outs(no, std::vector<double>(m));
        std::vector<double> args(na), o(no);
        const double scalar = ns_per_eval(m, [&] {
            for (size_t i = 0; i < m; ++i) {
                for (size_t j = 0; j < na; ++j) args[j] = cols[j][i];
                cto_call(f->id, args.data(), o.data(), nullptr);
                outs[0][i] = o[0];
            }
            g_sink = outs[0][m / 2];
        });
        std::vector<const char *> ap(na);
        std::vector<ptrdiff_t> as(na, sizeof(double)), os(no, sizeof(double));
        std::vector<char *> op(no);
        for (size_t j = 0; j < na; ++j) ap[j] = reinterpret_cast<const char *>(cols[j].data());
        for (size_t k = 0; k < no; ++k) op[k] = reinterpret_cast<char *>(outs[k].data());
        const double strided = ns_per_eval(m, [&] {
            cto_call_strided(f->id, m, ap.data(), as.data(), op.data(), os.data(), nullptr, 0,
                             nullptr);
            g_sink = outs[0][m / 2];
        });
        std::printf("%-24s %12.2f %12.2f %14.2f\n", f->name, scalar, strided, strided / naive_share);
    }
    // The named C function for share, called directly in a loop.
    const double named = ns_per_eval(n, [&] {
        for (size_t i = 0; i < n; ++i) cto_share(fa[i], fb[i], 1, 1, &out[i]);
        g_sink = out[n / 2];
    });
    std::printf("\ncto_share called in a loop: %.2f ns/eval = %.2f x the naive loop\n", named,
                named / naive_share);
    return 0;
}
