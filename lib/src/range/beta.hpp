// The regularised incomplete beta function I_x(a, b) and its inverse in x, for the PERT
// distribution (shape parameters a, b >= 1 with a + b = 6).
//
//   I_x(a, b) = x^a (1 - x)^b / (a B(a, b)) * 1/(1 + d_1/(1 + d_2/(1 + ...)))
//   d_{2m+1} = -(a + m)(a + b + m) x / ((a + 2m)(a + 2m + 1)),
//   d_{2m}   =  m (b - m) x / ((a + 2m - 1)(a + 2m)),
// evaluated by the modified Lentz method for x < (a + 1)/(a + b + 2) and through
// I_x(a, b) = 1 - I_{1-x}(b, a) above (Press, Teukolsky, Vetterling & Flannery 2007,
// Numerical Recipes 3rd ed., s.6.4, eq. 6.4.5-6.4.6 and routine betacf).
//
// B(a, 6 - a) comes from the reflection formula Gamma(a) Gamma(1 - a) = pi / sin(pi a) and
// Gamma(6 - a) = Gamma(1 - a) (1 - a)(2 - a)(3 - a)(4 - a)(5 - a):
//   B(a, 6 - a) = (-1)^(j+1) (pi f / sin(pi f)) prod_{k = 1..5, k != j} (k - a) / 120,
// with j the integer nearest to a and f = a - j (exact), so the removable 0/0 at integer a
// never appears (Abramowitz & Stegun 1964, 6.1.17 and 6.1.16).
//
// The inverse solves I_x(a, b) = u by Halley's method (Numerical Recipes 3rd ed., s.6.4,
// routine invbetai: its starting value for a, b >= 1, Abramowitz & Stegun 26.5.22) inside a
// bracket that shrinks on every step; a step that leaves the bracket is replaced by
// bisection.  Closed forms where they exist: a = 1: 1 - (1 - u)^(1/b) = -expm1(log1p(-u)/b);
// b = 1: u^(1/a).
//
// Accuracy against mpmath at 40 digits (tests/reference/range/pert_inverse.csv): see
// docs/models/ranges.md.  Deterministic: the same inputs give the same bits (no global
// state, no platform beta routine), given the same libm.
#ifndef CTO_RANGE_BETA_HPP
#define CTO_RANGE_BETA_HPP

namespace cto::core::range {

// B(a, 6 - a) for 1 <= a <= 5.
double beta_sum6(double a);

// I_x(a, b) for a, b >= 1 and x in [0, 1]; `beta` is B(a, b).
double inc_beta(double x, double a, double b, double beta);

// x in [0, 1] with I_x(a, b) = u, for a, b >= 1, u in [0, 1]; `beta` is B(a, b).
double inc_beta_inv(double u, double a, double b, double beta);

// One Halley step for I_x(a, b) = u from x in (0, 1) (a, b > 1): the refinement that
// pert_table.cpp applies to its interpolated starting value.
double inc_beta_halley_step(double x, double u, double a, double b, double beta);

}  // namespace cto::core::range

#endif  // CTO_RANGE_BETA_HPP
