// Alternating offers from annual rates, and the inverse problems and sensitivities of
// the rate form.
// Formulas, sources and status tables are documented in the public header; the comments
// here explain the numerical choices.
#include <algorithm>
#include <cmath>

#include "rates.hpp"
#include "powers.hpp"

namespace cto::core {

// ---------------------------------------------------------------------------
// Alternating offers from rates
// ---------------------------------------------------------------------------
// Below this total per-round log discount, expm1 works in subnormal numbers and loses
// digits; the share then equals its frequent-offer limit to far beyond double precision
// (the correction is O(rho)).
static constexpr double kTinyRho = 1e-150;

int share_from_rates(double own_rate, double other_rate, double days, double surplus,
                     bool own_opens, double basis, bool continuous, double *out, int *bad) {
    Check c;
    c.nonneg(own_rate, 0);
    c.nonneg(other_rate, 1);
    c.nonneg(days, 2);
    c.real(surplus, 3);
    c.positive(basis, 5);
    if (!c.ok()) return invalid(c, out, bad);
    if (!(surplus > 0.0)) return status_only(CTO_E_NO_DEAL, 0.0, out, bad);
    const double rho_own = log_discount(own_rate, days, basis, continuous);
    const double rho_oth = log_discount(other_rate, days, basis, continuous);
    const double sum = rho_own + rho_oth;
    if (sum < kTinyRho) {
        if (days == 0.0 || (own_rate == 0.0 && other_rate == 0.0))
            return status_only(CTO_E_INDETERMINATE, kNaN, out, bad);
        const double k_own = continuous ? own_rate : std::log1p(own_rate);
        const double k_oth = continuous ? other_rate : std::log1p(other_rate);
        return finish(k_oth == 0.0 ? 0.0 : mul_div(surplus, k_oth, k_own + k_oth), out, bad, 3);
    }
    const double om_oth = -std::expm1(-rho_oth);  // 1 - other's factor
    const double den = -std::expm1(-sum);         // 1 - product of the factors
    const double v = own_opens ? surplus * (om_oth / den)
                               : surplus * (std::exp(-rho_own) * om_oth / den);
    return finish(v, out, bad, 3);
}

int limit_share(double own_rate, double other_rate, double surplus, double *out, int *bad) {
    Check c;
    c.nonneg(own_rate, 0);
    c.nonneg(other_rate, 1);
    c.real(surplus, 2);
    if (!c.ok()) return invalid(c, out, bad);
    if (!(surplus > 0.0)) return status_only(CTO_E_NO_DEAL, 0.0, out, bad);
    if (own_rate == 0.0 && other_rate == 0.0)
        return status_only(CTO_E_INDETERMINATE, kNaN, out, bad);
    double ro = own_rate, rt = other_rate;
    if (!std::isfinite(ro + rt)) {  // both near DBL_MAX: scale to avoid overflow
        ro *= 0.25;
        rt *= 0.25;
    }
    return finish(rt == 0.0 ? 0.0 : mul_div(surplus, rt, ro + rt), out, bad, 2);
}

// ---------------------------------------------------------------------------
// Inverse problems and sensitivities
// ---------------------------------------------------------------------------
namespace {
// 1 - d_own for an observed share s, from the Rubinstein share (surplus 1):
//   own opens:   (1 - s)(1 - d_oth) / (s d_oth)
//   other opens: (1 - s)(1 - d_oth) / (s + (1 - s)(1 - d_oth))
// written with om_oth = 1 - d_oth and, for own opens, g = (1 - d_oth)/d_oth.
double implied_complement(double s, double om_oth, double g, bool own_opens) {
    const double oms = 1.0 - s;
    return own_opens ? oms * g / s : oms * om_oth / (s + oms * om_oth);
}
}  // namespace

int implied_factor(double observed_share, double other_factor, bool own_opens, double *out,
                   int *bad) {
    Check c;
    c.unit(observed_share, 0);
    c.unit(other_factor, 1);
    if (!c.ok()) return invalid(c, out, bad);
    const double s = observed_share, dt = other_factor, om_t = 1.0 - dt;
    // Cases where the share does not depend on own's factor.
    if (own_opens && dt == 0.0)  // own as opener always takes everything
        return s == 1.0 ? status_only(CTO_E_INDETERMINATE, kNaN, out, bad)
                        : invalid_at(0, out, bad);
    if (dt == 1.0)  // the infinitely patient other takes everything (own factor < 1)
        return s == 0.0 ? status_only(CTO_E_INDETERMINATE, kNaN, out, bad)
                        : invalid_at(0, out, bad);
    if (own_opens && s < om_t) return invalid_at(0, out, bad);  // below the d_own = 0 share
    const double m = implied_complement(s, om_t, om_t / dt, own_opens);  // 1 - d_own
    if (!(m >= 0.0 && m <= 1.0)) return invalid_at(0, out, bad);
    double d;
    if (m <= 0.5) {
        d = 1.0 - m;
    } else if (own_opens) {
        d = (s - om_t) / (s * dt);
    } else {
        d = s / (s + (1.0 - s) * om_t);
    }
    return status_only(CTO_OK, std::min(1.0, std::max(0.0, d)), out, bad);
}

int implied_rate(double observed_share, double other_rate, double days, bool own_opens,
                 double basis, bool continuous, double *out, int *bad) {
    Check c;
    c.unit(observed_share, 0);
    c.nonneg(other_rate, 1);
    c.nonneg(days, 2);
    c.positive(basis, 4);
    if (!c.ok()) return invalid(c, out, bad);
    if (days == 0.0) return status_only(CTO_E_INDETERMINATE, kNaN, out, bad);
    const double s = observed_share;
    const double rho_t = log_discount(other_rate, days, basis, continuous);
    if (rho_t == 0.0)  // other infinitely patient: own gets 0 whatever its rate
        return s == 0.0 ? status_only(CTO_E_INDETERMINATE, kNaN, out, bad)
                        : invalid_at(0, out, bad);
    if (own_opens && rho_t == kInf)  // other's factor 0: the opener takes everything
        return s == 1.0 ? status_only(CTO_E_INDETERMINATE, kNaN, out, bad)
                        : invalid_at(0, out, bad);
    // 1 - d_own = m; with (1 - d_oth)/d_oth = expm1(rho_t) and 1 - d_oth = -expm1(-rho_t).
    const double m = implied_complement(s, -std::expm1(-rho_t), std::expm1(rho_t), own_opens);
    if (!(m >= 0.0 && m < 1.0)) return invalid_at(0, out, bad);  // needs a finite rate
    const double rho_own = -std::log1p(-m);
    const double per_year = rho_own * (basis / days);
    const double rate = continuous ? per_year : std::expm1(per_year);
    if (!std::isfinite(rate)) return invalid_at(0, out, bad);
    return status_only(CTO_OK, rate, out, bad);
}

int share_sensitivity(double own_rate, double other_rate, double days, int wrt, double surplus,
                      bool own_opens, double basis, bool continuous, double *out, int *bad) {
    Check c;
    c.nonneg(own_rate, 0);
    c.nonneg(other_rate, 1);
    c.nonneg(days, 2);
    if (wrt != CTO_WRT_OWN && wrt != CTO_WRT_OTHER) c.fail(3);
    c.real(surplus, 4);
    c.positive(basis, 6);
    if (!c.ok()) return invalid(c, out, bad);
    const double S = surplus;
    if (!(S > 0.0)) return status_only(CTO_E_NO_DEAL, 0.0, out, bad);
    const double rate = wrt == CTO_WRT_OWN ? own_rate : other_rate;
    const double dc = continuous ? 1.0 : 1.0 / (1.0 + rate);  // d c(R) / dR
    const double rho_o = log_discount(own_rate, days, basis, continuous);
    const double rho_t = log_discount(other_rate, days, basis, continuous);
    const double sum = rho_o + rho_t;
    double v;
    if (sum < kTinyRho) {
        if (days == 0.0 || (own_rate == 0.0 && other_rate == 0.0))
            return status_only(CTO_E_INDETERMINATE, kNaN, out, bad);
        // Frequent-offer limit S k_t/(k_o + k_t): derivative in k, times dk/dR.
        const double ko = continuous ? own_rate : std::log1p(own_rate);
        const double kt = continuous ? other_rate : std::log1p(other_rate);
        const double ks = ko + kt;
        v = (wrt == CTO_WRT_OWN ? -S * (kt / ks) / ks : S * (ko / ks) / ks) * dc;
    } else {
        const double a = -std::expm1(-rho_o), bb = -std::expm1(-rho_t);
        const double D = -std::expm1(-sum);
        const double E = own_opens ? (wrt == CTO_WRT_OWN ? std::exp(-sum) : std::exp(-rho_t))
                                   : (wrt == CTO_WRT_OWN ? std::exp(-rho_o) : std::exp(-sum));
        const double dshare = wrt == CTO_WRT_OWN ? -S * bb / D * E / D : S * a / D * E / D;
        v = dshare * (days / basis) * dc;
    }
    return finish(v, out, bad, 4);
}

}  // namespace cto::core
