// Table-based PERT inverse; see pert_table.hpp for the formulas and sources.
#include "pert_table.hpp"

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <cstring>

#include "beta.hpp"

namespace cto::core::range {
namespace {

// The knot x with I_x(a, b) = v from `guess`, a Taylor step off the previous knot (error
// O(h^3)): Halley steps (beta.hpp) until a step is below 2^-50 x, as inc_beta_inv ends;
// the bracketed iterative inverse wherever that does not settle within four steps.
double knot(double v, double guess, double a, double b, double beta) {
    double x = guess;
    for (int it = 0; it < 4 && x > 0.0 && x < 1.0; ++it) {
        const double xn = inc_beta_halley_step(x, v, a, b, beta);
        if (std::fabs(xn - x) <= 0x1p-50 * xn) return xn;
        x = xn;
    }
    return inc_beta_inv(v, a, b, beta);
}

// The tables of pert_half_root.
void root_build(double a, PertHalf *t) {
    const long double ia = 1.0L / static_cast<long double>(a);
    t->octave[0] = 1.0;
    for (int q = 1; q <= PertHalf::kOctaves; ++q)
        t->octave[q] = static_cast<double>(std::exp2(-static_cast<long double>(q) * ia));
    for (int j = 0; j < PertHalf::kSegments; ++j) {
        const double c = pert_segment_centre(j);
        t->seg_root[j] = static_cast<double>(std::pow(static_cast<long double>(c), ia));
        t->seg_inv[j] = 1.0 / c;
    }
    long double coef = 1.0L;  // C(1/a, k) = C(1/a, k - 1) (1/a - k + 1)/k
    t->binom[0] = 1.0;
    for (int k = 1; k <= PertHalf::kTerms; ++k) {
        coef *= (ia - (k - 1)) / k;
        t->binom[k] = static_cast<double>(coef);
    }
}

}  // namespace

double pert_half_root(const PertHalf &t, double v) {
    uint64_t bits;
    std::memcpy(&bits, &v, sizeof bits);
    const int q = 1023 - static_cast<int>(bits >> 52);  // v = 2^-q m for normal v > 0
    if (q < 1 || q > PertHalf::kOctaves)  // not from the generator: a long double power
        return static_cast<double>(std::pow(static_cast<long double>(v), 1.0L / t.a));
    const uint64_t mbits = (bits & ((uint64_t{1} << 52) - 1)) | (uint64_t{1023} << 52);
    double m;
    std::memcpy(&m, &mbits, sizeof m);
    const int j = static_cast<int>((bits >> 46) & 63);  // the segment: m's first six bits
    const double tt = (m - pert_segment_centre(j)) * t.seg_inv[j];
    double p = t.binom[PertHalf::kTerms];
    for (int k = PertHalf::kTerms - 1; k >= 1; --k) p = p * tt + t.binom[k];
    const double c = t.seg_root[j];
    return t.octave[q] * (c + c * (p * tt));
}

void pert_half_build(double a, double b, double beta, PertHalf *t) {
    t->a = a;
    t->b = b;
    t->beta = beta;
    const double s_max = std::pow(0.5, 1.0 / a);
    t->h = s_max / kPertKnots;
    t->inv_h = kPertKnots / s_max;
    root_build(a, t);
    const double d0 = std::pow(a * beta, 1.0 / a);  // the limits at s = 0
    t->knot[0] = {0.0, d0, 2.0 * (b - 1.0) * d0 * d0 / (a + 1.0)};
    for (int k = 1; k <= kPertKnots; ++k) {
        const double s = t->h * k;
        // The last knot is the median itself (v = 1/2 exactly, not a rounded s_max^a), from
        // the bracketed iterative inverse as dist_quantile gives it without a table.
        const PertHalf::Knot &prev = t->knot[k - 1];
        const double guess = prev.x + t->h * (prev.dx + 0.5 * t->h * prev.d2x);
        const double x = k == kPertKnots ? inc_beta_inv(0.5, a, b, beta)
                                         : knot(std::pow(s, a), guess, a, b, beta);
        const double d = a * std::pow(s, a - 1.0) * beta /
                         (std::pow(x, a - 1.0) * std::pow(1.0 - x, b - 1.0));
        t->knot[k] = {x, d, (a - 1.0) * d * (1.0 / s - d / x) + (b - 1.0) * d * d / (1.0 - x)};
    }
}

double pert_half_inverse(const PertHalf &t, double v) {
    const double s = pert_half_root(t, v);
    const double pos = s * t.inv_h;  // in [0, K] up to rounding
    const int k = std::min(static_cast<int>(pos), kPertKnots - 1);
    const double w = pos - k, h = t.h;  // w in [0, 1], or a rounding above 1 at v = 1/2
    // Quintic Hermite on [s_k, s_k+1] in w in [0, 1]: the values enter as
    // x_k + (x_k+1 - x_k) H5(w), the scaled derivatives through H1, H4 (first) and
    // H2, H3 (second).
    const double w2 = w * w, w3 = w2 * w;
    const double h5 = w3 * (10.0 + w * (-15.0 + 6.0 * w));
    const double h1 = w + w3 * (-6.0 + w * (8.0 - 3.0 * w));
    const double h4 = w3 * (-4.0 + w * (7.0 - 3.0 * w));
    const double h2 = 0.5 * w2 * (1.0 + w * (-3.0 + w * (3.0 - w)));
    const double h3 = 0.5 * w3 * (1.0 + w * (-2.0 + w));
    const PertHalf::Knot &p = t.knot[k], &q = t.knot[k + 1];
    const double x = p.x + ((q.x - p.x) * h5 + h * ((p.dx * h1 + q.dx * h4) +
                                                     h * (p.d2x * h2 + q.d2x * h3)));
    if (!(x > 0.0 && x < 1.0)) return inc_beta_inv(v, t.a, t.b, t.beta);
    return x;
}

}  // namespace cto::core::range
