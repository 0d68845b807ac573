// A fast PERT inverse CDF for the inner loop: a table of the exact inverse, a cubic
// Hermite interpolant for the starting value, and one Halley step on the exact
// regularised incomplete beta (beta.hpp), which restores full double precision.
//
// For one half of the distribution (v = u or 1 - u in (0, 1/2], shapes a, b > 1), the
// inverse x(v) = I^-1_v(a, b) is tabulated at K + 1 equally spaced values of s = v^(1/a)
// in [0, (1/2)^(1/a)]; in s the inverse is smooth up to v = 0 (x ~ (a B v)^(1/a) = (a B)^(1/a) s),
// so the interpolant is accurate in the tail as well.  Knot slopes:
// dx/ds = a s^(a-1) B / (x^(a-1) (1 - x)^(b-1)).  Halley's method converges cubically
// (Press et al. 2007, s.9.4 and s.6.4), so from the interpolant's relative error (below
// 1e-9; tests/cpp/test_range_distributions.cpp) one step lands within rounding of the
// iterative inverse.
#ifndef CTO_RANGE_PERT_TABLE_HPP
#define CTO_RANGE_PERT_TABLE_HPP

namespace cto::core::range {

inline constexpr int kPertKnots = 64;

struct PertHalf {
    double a, b, beta;       // shapes of this half and B(a, b)
    double inv_a;            // 1/a
    double h;                // knot spacing in s
    double x[kPertKnots + 1], dx[kPertKnots + 1];
};

// Builds the table of one half (a, b > 1; beta = B(a, b)).  About 65 iterative inverses.
void pert_half_build(double a, double b, double beta, PertHalf *t);

// x with I_x(a, b) = v for v in (0, 1/2].
double pert_half_inverse(const PertHalf &t, double v);

}  // namespace cto::core::range

#endif  // CTO_RANGE_PERT_TABLE_HPP
