// A fast PERT inverse CDF for the inner loop: a table of the exact inverse and a quintic
// Hermite interpolant, with no incomplete beta per draw.
//
// For one half of the distribution (v = u or 1 - u in (0, 1/2], shapes a, b > 1), the
// inverse x(v) = I^-1_v(a, b) is tabulated at K + 1 equally spaced values of s = v^(1/a)
// in [0, (1/2)^(1/a)]; in s the inverse is analytic up to v = 0 (I_x = x^a/(a B) (1 + O(x))
// gives s = x (a B)^(-1/a) (1 + O(x))), so one interpolant serves the tail as well.  At
// each knot the table holds x (I_x(a, b) = v solved by Halley's method, beta.hpp, within a
// few ulp, started from a Taylor step off the previous knot) and
// its first two derivatives in s, from dv/dx = x^(a-1) (1 - x)^(b-1) / B:
//   x'  = dx/ds   = a s^(a-1) B / (x^(a-1) (1 - x)^(b-1)),
//   x'' = d2x/ds2 = (a - 1) x' (1/s - x'/x) + (b - 1) x'^2 / (1 - x),
// and at s = 0 their limits x' = (a B)^(1/a), x'' = 2 (b - 1) (a B)^(2/a) / (a + 1) (from
// the series B_x(a, b) = x^a/a - (b - 1) x^(a+1)/(a + 1) + ...; Abramowitz & Stegun 1964,
// 26.5.4).  Between knots x is the quintic Hermite interpolant of the values and the two
// derivatives at both ends (Burden & Faires, Numerical Analysis, s.3.4, Hermite
// interpolation); its error is O(h^6 max |x^(6)|), with h the knot spacing.  With
// kPertKnots = 512 the interpolant agrees with the iterative inverse to a few ulp of the
// range (tests/cpp/test_range_distributions.cpp; docs/models/ranges.md, "Inverse CDFs").
//
// s = v^(1/a) without exp or log: with v = 2^-q m (m in [1, 2), q = 1..33, which covers
// every v = (Y + 1/2) 2^-32 <= 1/2 the generator makes) and m in the segment j of [1, 2)
// (64 segments, centre c_j = 1 + (j + 1/2)/64),
//   s = 2^(-q/a) c_j^(1/a) (1 + t)^(1/a),   t = (m - c_j)/c_j,  |t| <= 1/129,
// with (1 + t)^(1/a) = 1 + sum_{k=1..7} C(1/a, k) t^k (the binomial series, Abramowitz &
// Stegun 1964, 3.6.8), whose first omitted term is below 2^-60.  m - c_j is exact (both in
// [1, 2)); 2^(-q/a) and c_j^(1/a) are tabulated once per table from long double powers, so
// s is within four ulp (four roundings); other v (below 2^-33, in direct calls) use a long
// double power.
#ifndef CTO_RANGE_PERT_TABLE_HPP
#define CTO_RANGE_PERT_TABLE_HPP

namespace cto::core::range {

inline constexpr int kPertKnots = 512;

struct PertHalf {
    double a, b, beta;       // shapes of this half and B(a, b)
    double h, inv_h;         // knot spacing in s and its reciprocal
    struct Knot {
        double x, dx, d2x;  // x(s_k) and its first two derivatives in s
    };
    Knot knot[kPertKnots + 1];  // one interval's data in two adjacent entries
    static constexpr int kOctaves = 33, kSegments = 64, kTerms = 7;
    double octave[kOctaves + 1];  // octave[q] = 2^(-q/a), q = 1..kOctaves
    double seg_root[kSegments];   // c_j^(1/a)
    double seg_inv[kSegments];    // 1/c_j
    double binom[kTerms + 1];     // binom[k] = C(1/a, k), k = 1..kTerms
};

// Builds the table of one half (a, b > 1; beta = B(a, b)): each knot from the previous
// one by Halley steps (about two incomplete betas a knot).
void pert_half_build(double a, double b, double beta, PertHalf *t);

// The centre c_j = 1 + (j + 1/2)/64 of segment j of [1, 2), exact.
inline double pert_segment_centre(int j) {
    return 1.0 + (j + 0.5) * (1.0 / PertHalf::kSegments);
}

// s = v^(1/a) for v in (0, 1/2] (see above).
double pert_half_root(const PertHalf &t, double v);

// x with I_x(a, b) = v for v in (0, 1/2].
double pert_half_inverse(const PertHalf &t, double v);

}  // namespace cto::core::range

#endif  // CTO_RANGE_PERT_TABLE_HPP
