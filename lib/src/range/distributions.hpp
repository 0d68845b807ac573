// Input distributions given by low / mode / high, and their inverse CDFs (quantile
// functions), which turn a uniform coordinate u in (0, 1) into an input value.
//
//   fixed:       F^-1(u) = mode (the value).
//   uniform:     F^-1(u) = lo + u (hi - lo).
//   triangular:  F_m = (m - lo)/(hi - lo);
//                F^-1(u) = lo + (hi - lo) sqrt(u F_m)                 if u < F_m,
//                        = hi - (hi - lo) sqrt((1 - u)(hi - m)/(hi - lo))  otherwise
//                (the standard closed form, e.g. Vose 2008, ch. on the triangular
//                distribution; written with F_m so that no product of ranges overflows).
//   PERT:        X = lo + (hi - lo) Y,  Y ~ Beta(alpha, beta),
//                alpha = 1 + 4 (m - lo)/(hi - lo),  beta = 6 - alpha,
//                mean (lo + 4 m + hi)/6 (Malcolm, Roseboom, Clark & Fazar 1959, the PERT
//                mean; the beta form with weight 4 on the mode is the "Beta-PERT" of Vose
//                2008, ch. on the PERT distribution).  Lower half (u <= 1/2):
//                X = lo + (hi - lo) I^-1_u(alpha, beta); upper half:
//                X = hi - (hi - lo) I^-1_{1-u}(beta, alpha), so that each end is reached
//                without cancellation (1 - u is exact for u >= 1/2).
// lo = hi is a constant: every u maps to lo exactly (the input keeps its dimension).
#ifndef CTO_RANGE_DISTRIBUTIONS_HPP
#define CTO_RANGE_DISTRIBUTIONS_HPP

#include <cstddef>
#include <cstdint>

#include "pert_table.hpp"

namespace cto::core::range {

// The kinds of an input (values of RangeArg::kind; proposed as CTO_RANGE_* constants).
enum : int { kFixed = 0, kUniform = 1, kTriangular = 2, kPert = 3 };

struct Dist {
    int kind;
    double low, mode, high;  // fixed: the value is `mode`; uniform: `mode` is ignored
};

// Whether the distribution is well formed: a known kind; finite numbers; low <= high and
// hi - lo finite (uniform, triangular, PERT); low <= mode <= high (triangular, PERT).
bool dist_valid(const Dist &d);

// Whether the input is uncertain (a valid range with low < high).
bool dist_uncertain(const Dist &d);

// The value used for "the others at their mode" (swing; validation): the value of a
// fixed input, the mode of triangular and PERT, the midpoint of uniform.
double dist_mode(const Dist &d);

// F^-1(u) for u in (0, 1); NaN for an invalid distribution or u outside (0, 1).  PERT by
// the iterative inverse of beta.hpp (no table): for single values.
double dist_quantile(const Dist &d, double u);

// Precomputed constants of one distribution, for the inner loop of the engine.  PERT with
// both shapes above 1 also carries the tables of pert_table.hpp (building them costs about
// 130 iterative inverses; evaluating then costs one incomplete beta).  The two paths agree
// to within an ulp or two of the result (tests/cpp/test_range_distributions.cpp).
struct DistPlan {
    Dist d;
    double width;        // hi - lo
    double fm;           // triangular: (m - lo)/(hi - lo); PERT: unused
    double one_minus_fm; // triangular: (hi - m)/(hi - lo)
    double alpha, beta, beta_fn;  // PERT: shapes and B(alpha, beta)
    bool table;                   // PERT: the tables below are built
    PertHalf lower, upper;        // PERT: I^-1(alpha, beta) and I^-1(beta, alpha) on (0, 1/2]
};
DistPlan dist_plan(const Dist &d);  // d must be valid
double dist_quantile(const DistPlan &p, double u);

// x[i] = dist_quantile(p, unit_from_bits(y[i])) for i < n (scramble.hpp's u = (y + 1/2)
// 2^-32): the same bits, triangular and PERT eight at a time where the CPU has AVX-512.
void dist_quantile_block(const DistPlan &p, const uint32_t *y, size_t n, double *x);

// The triangular and PERT draws of dist_quantile_block eight at a time with AVX-512
// (dist_simd.cpp), the same bits: returns how many it wrote (a multiple of 8); 0 for other
// kinds, a PERT plan without a table, or a CPU without AVX-512.
size_t dist_block_avx512(const DistPlan &p, const uint32_t *y, size_t n, double *x);

}  // namespace cto::core::range

#endif  // CTO_RANGE_DISTRIBUTIONS_HPP
