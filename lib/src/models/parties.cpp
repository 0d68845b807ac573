// More than two parties: unanimity and majority-rule bargaining.
// Formulas, sources and status tables are documented in the public header; the comments
// here explain the numerical choices.
#include <algorithm>
#include <cmath>

#include "parties.hpp"
#include "powers.hpp"

namespace cto::core {

// ---------------------------------------------------------------------------
// More than two parties
// ---------------------------------------------------------------------------
int group_share(double factor, int64_t parties, int64_t position, double surplus, double *out,
                int *bad) {
    Check c;
    c.unit(factor, 0);
    if (parties < 1) c.fail(1);
    if (position < 0 || position >= parties) c.fail(2);
    c.real(surplus, 3);
    if (!c.ok()) return invalid(c, out, bad);
    const double S = surplus;
    if (!(S > 0.0)) return status_only(CTO_E_NO_DEAL, 0.0, out, bad);
    if (parties == 1) return status_only(CTO_OK, S, out, bad);
    if (factor == 1.0) return status_only(CTO_E_INDETERMINATE, kNaN, out, bad);
    if (factor == 0.0) return status_only(CTO_OK, position == 0 ? S : 0.0, out, bad);
    // S d^k (1 - d) / (1 - d^n): d^k by pow (within an ulp for whole k; exp(k log d) would
    // amplify the rounding of log d k-fold), 1 - d^n = -expm1(n log d) (no cancellation).
    const double ld = log_factor(factor);
    const double den = -std::expm1(static_cast<double>(parties) * ld);
    const double num = (1.0 - factor) * std::pow(factor, static_cast<double>(position));
    return finish(S * (num / den), out, bad, 3);
}

int majority_share(double factor, int64_t parties, int64_t votes_needed, int role,
                   double surplus, double *out, int *bad) {
    Check c;
    c.unit(factor, 0);
    if (parties < 1) c.fail(1);
    if (votes_needed < 0) c.fail(2);
    if (role != CTO_ROLE_PROPOSER && role != CTO_ROLE_PARTNER) c.fail(3);
    c.real(surplus, 4);
    if (!c.ok()) return invalid(c, out, bad);
    const int64_t n = parties;
    const int64_t q = votes_needed == 0 ? n / 2 + 1 : votes_needed;
    if (q > n) return invalid_at(2, out, bad);
    if (role == CTO_ROLE_PARTNER && q < 2) return invalid_at(3, out, bad);  // no partners
    const double S = surplus;
    if (!(S > 0.0)) return status_only(CTO_E_NO_DEAL, 0.0, out, bad);
    const double nd = static_cast<double>(n);
    if (role == CTO_ROLE_PARTNER) return finish(S * (factor / nd), out, bad, 4);
    // S (1 - d (q-1)/n) = S ((n - q + 1) + (1 - d)(q - 1)) / n: no cancellation near d = 1.
    const double v = S * ((static_cast<double>(n - q + 1) +
                           (1.0 - factor) * static_cast<double>(q - 1)) / nd);
    return finish(v, out, bad, 4);
}

}  // namespace cto::core
