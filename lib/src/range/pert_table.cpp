// Table-started PERT inverse; see pert_table.hpp.
#include "pert_table.hpp"

#include <algorithm>
#include <cmath>

#include "beta.hpp"

namespace cto::core::range {

void pert_half_build(double a, double b, double beta, PertHalf *t) {
    t->a = a;
    t->b = b;
    t->beta = beta;
    t->inv_a = 1.0 / a;
    const double s_max = std::pow(0.5, 1.0 / a);
    t->h = s_max / kPertKnots;
    t->x[0] = 0.0;
    t->dx[0] = std::pow(a * beta, 1.0 / a);  // the limit of dx/ds at s = 0
    for (int k = 1; k <= kPertKnots; ++k) {
        const double s = t->h * k;
        const double x = inc_beta_inv(std::pow(s, a), a, b, beta);
        t->x[k] = x;
        t->dx[k] = a * std::pow(s, a - 1.0) * beta /
                   (std::pow(x, a - 1.0) * std::pow(1.0 - x, b - 1.0));
    }
}

double pert_half_inverse(const PertHalf &t, double v) {
    const double s = std::exp(std::log(v) * t.inv_a);
    const double pos = std::min(s / t.h, static_cast<double>(kPertKnots) - 1e-9);
    const int k = static_cast<int>(pos);
    const double w = pos - k, hh = t.h;
    // Cubic Hermite on [s_k, s_k+1] in the local variable w in [0, 1].
    const double w2 = w * w, w3 = w2 * w;
    const double h00 = 2 * w3 - 3 * w2 + 1, h10 = w3 - 2 * w2 + w, h01 = -2 * w3 + 3 * w2,
                 h11 = w3 - w2;
    double x = h00 * t.x[k] + h10 * hh * t.dx[k] + h01 * t.x[k + 1] + h11 * hh * t.dx[k + 1];
    if (!(x > 0.0 && x < 1.0)) return inc_beta_inv(v, t.a, t.b, t.beta);
    return inc_beta_halley_step(x, v, t.a, t.b, t.beta);
}

}  // namespace cto::core::range
