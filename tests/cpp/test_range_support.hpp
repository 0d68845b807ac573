// Shared helpers of the share_range tests: the two examples of docs/models/ranges.md
// ("The two examples") written directly as closed forms, option builders, and a
// bitwise comparison of results.
#ifndef CTO_TEST_RANGE_SUPPORT_HPP
#define CTO_TEST_RANGE_SUPPORT_HPP

#include <cmath>
#include <cstdint>
#include <cstring>
#include <initializer_list>

#include "counteroffer/counteroffer.h"
#include "range/engine.hpp"

namespace cto_range_test {

using namespace cto::core::range;

constexpr double kDelta = 1.0 / 12.0;  // monthly offers, in years

// Rubinstein (1982) share of the opener from rates, x = expm1(-r_B D)/expm1(-(r_A+r_B) D),
// slots 0 (r_A) and 1 (r_B), as in the d = 2 example.
inline int model_d2(const void *, const double *x, Draw *d, int *bad) {
    if (!(x[0] >= 0.0) || !(x[1] >= 0.0)) {
        *bad = x[0] >= 0.0 ? 1 : 0;
        return CTO_E_INVALID;
    }
    const double own = std::expm1(-x[1] * kDelta) / std::expm1(-(x[0] + x[1]) * kDelta);
    *d = Draw{own, 1.0 - own, true, CTO_BINDS_NONE, false};
    return CTO_OK;
}

// Breakdown risk with discounting (Binmore, Rubinstein & Wolinsky 1986; Muthoo 1999 ch.4),
// the d = 5 example: slots 0 r_A, 1 r_B, 2 days (unused), 3 p, 4 b_A, 5 b_B.
// x = [(1 - a_B) - p b_B + p a_B b_A]/(1 - a_A a_B), a_i = (1 - p) exp(-r_i D).  No deal
// (the fallbacks reach the surplus of 1) gives the fallbacks and counts as an edge case.
inline int model_d5(const void *, const double *x, Draw *d, int *bad) {
    if (!(x[3] >= 0.0 && x[3] <= 1.0)) {
        *bad = 3;
        return CTO_E_INVALID;
    }
    const double p = x[3], bA = x[4], bB = x[5];
    if (!(bA + bB < 1.0)) {
        *d = Draw{bA, bB, false, CTO_BINDS_NONE, true};
        return CTO_E_NO_DEAL;
    }
    const double aA = (1 - p) * std::exp(-x[0] * kDelta), aB = (1 - p) * std::exp(-x[1] * kDelta);
    const double own = ((1 - aB) - p * bB + p * aB * bA) / (1 - aA * aB);
    *d = Draw{own, 1.0 - own, true, CTO_BINDS_NONE, false};
    return CTO_OK;
}

inline RangeArg fixed(double v) { return RangeArg{kFixed, v, v, v}; }
inline RangeArg pert(double lo, double m, double hi) { return RangeArg{kPert, lo, m, hi}; }
inline RangeArg tri(double lo, double m, double hi) { return RangeArg{kTriangular, lo, m, hi}; }
inline RangeArg uni(double lo, double hi) { return RangeArg{kUniform, lo, 0.0, hi}; }

// The inputs of the two examples.
inline RangeArg rate_own() { return pert(0.05, 0.10, 0.20); }
inline RangeArg rate_other() { return tri(0.02, 0.05, 0.12); }

inline RangeOptions options(std::initializer_list<double> probs, uint64_t seed, int log2_start,
                            int log2_max, int replicates = 16) {
    RangeOptions o = default_options();
    o.n_probs = 0;
    for (double p : probs) o.probs[o.n_probs++] = p;
    o.seed = seed;
    o.log2_start = log2_start;
    o.log2_max = log2_max;
    o.replicates = replicates;
    return o;
}

inline uint64_t bits(double x) {
    uint64_t b;
    std::memcpy(&b, &x, sizeof b);
    return b;
}

inline bool same_estimate(const Estimate &a, const Estimate &b) {
    return bits(a.value) == bits(b.value) && bits(a.se) == bits(b.se) &&
           bits(a.half_width) == bits(b.half_width) && a.digits == b.digits;
}

// Every field of two results, doubles compared by bit pattern.
inline bool same_result(const RangeOut &a, const RangeOut &b) {
    bool same = a.status == b.status && a.bad == b.bad && a.spec_version == b.spec_version &&
                a.n_probs == b.n_probs && a.points_per_replicate == b.points_per_replicate &&
                a.replicates == b.replicates && a.log2_used == b.log2_used &&
                a.dimension == b.dimension;
    for (int k = 0; k < kMaxProbs; ++k)
        same = same && bits(a.probs[k]) == bits(b.probs[k]) && same_estimate(a.own[k], b.own[k]) &&
               same_estimate(a.other[k], b.other[k]);
    for (auto m : {&RangeOut::own_mean, &RangeOut::other_mean, &RangeOut::p_rational,
                   &RangeOut::p_own_binds, &RangeOut::p_other_binds, &RangeOut::edge_fraction})
        same = same && same_estimate(a.*m, b.*m);
    return same;
}

}  // namespace cto_range_test

#endif  // CTO_TEST_RANGE_SUPPORT_HPP
