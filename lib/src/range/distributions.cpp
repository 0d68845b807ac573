// Inverse CDFs of the input distributions; see distributions.hpp for the formulas.
#include "distributions.hpp"

#include <cmath>
#include <limits>

#include "beta.hpp"
#include "scramble.hpp"

namespace cto::core::range {

bool dist_valid(const Dist &d) {
    switch (d.kind) {
        case kFixed:
            return std::isfinite(d.mode);
        case kUniform:
            return std::isfinite(d.low) && std::isfinite(d.high) && d.low <= d.high &&
                   std::isfinite(d.high - d.low);
        case kTriangular:
        case kPert:
            return std::isfinite(d.low) && std::isfinite(d.high) && std::isfinite(d.mode) &&
                   d.low <= d.mode && d.mode <= d.high && std::isfinite(d.high - d.low);
        default:
            return false;
    }
}

bool dist_uncertain(const Dist &d) {
    return dist_valid(d) && d.kind != kFixed && d.low < d.high;
}

double dist_mode(const Dist &d) {
    if (d.kind == kFixed) return d.mode;
    if (d.kind == kUniform) return d.low == d.high ? d.low : d.low + 0.5 * (d.high - d.low);
    return d.mode;
}

namespace {
DistPlan plan_without_table(const Dist &d) {
    DistPlan p{};
    p.d = d;
    if (d.kind == kFixed) return p;
    p.width = d.high - d.low;
    if (!(p.width > 0.0) || d.kind == kUniform) return p;
    p.fm = (d.mode - d.low) / p.width;
    p.one_minus_fm = (d.high - d.mode) / p.width;
    if (d.kind == kPert) {
        p.alpha = 1.0 + 4.0 * p.fm;
        p.beta = 6.0 - p.alpha;
        p.beta_fn = beta_sum6(p.alpha);
    }
    return p;
}

// The PERT quantile from the plan: tables when built, else the iterative inverse.
double pert_quantile(const DistPlan &p, double u) {
    const Dist &d = p.d;
    if (u <= 0.5) {
        const double y = p.table ? pert_half_inverse(p.lower, u)
                                 : inc_beta_inv(u, p.alpha, p.beta, p.beta_fn);
        return d.low + p.width * y;
    }
    const double v = 1.0 - u;  // exact for u >= 1/2
    const double z = p.table ? pert_half_inverse(p.upper, v)
                             : inc_beta_inv(v, p.beta, p.alpha, p.beta_fn);
    return d.high - p.width * z;
}
}  // namespace

DistPlan dist_plan(const Dist &d) {
    DistPlan p = plan_without_table(d);
    if (d.kind == kPert && p.width > 0.0 && p.alpha > 1.0 && p.beta > 1.0) {
        pert_half_build(p.alpha, p.beta, p.beta_fn, &p.lower);
        pert_half_build(p.beta, p.alpha, p.beta_fn, &p.upper);
        p.table = true;
    }
    return p;
}

double dist_quantile(const DistPlan &p, double u) {
    const Dist &d = p.d;
    if (d.kind == kFixed) return d.mode;
    if (!(p.width > 0.0)) return d.low;  // lo = hi: a constant
    switch (d.kind) {
        case kUniform:
            return d.low + u * p.width;
        case kTriangular:
            if (u < p.fm) return d.low + p.width * std::sqrt(u * p.fm);
            return d.high - p.width * std::sqrt((1.0 - u) * p.one_minus_fm);
        default:  // kPert
            return pert_quantile(p, u);
    }
}

void dist_quantile_block(const DistPlan &p, const uint32_t *y, size_t n, double *x) {
    for (size_t i = dist_block_avx512(p, y, n, x); i < n; ++i)
        x[i] = dist_quantile(p, unit_from_bits(y[i]));
}

double dist_quantile(const Dist &d, double u) {
    if (!dist_valid(d) || !(u > 0.0 && u < 1.0)) return std::numeric_limits<double>::quiet_NaN();
    return dist_quantile(plan_without_table(d), u);
}

}  // namespace cto::core::range
