// Utilities: the generalised Nash bargaining solution and alternating offers with
// risk-averse parties.
// Formulas, sources and status tables are documented in the public header; the comments
// here explain the numerical choices.
#include <algorithm>
#include <cmath>

#include "utility.hpp"
#include "../numerics.hpp"
#include "powers.hpp"

namespace cto::core {

// ---------------------------------------------------------------------------
// Nash bargaining solution
// ---------------------------------------------------------------------------
int nash_share(double own_fallback, double other_fallback, double own_weight, double surplus,
               double own_curvature, double other_curvature, double *out, int *bad) {
    Check c;
    c.real(own_fallback, 0);
    c.real(other_fallback, 1);
    c.unit(own_weight, 2);
    c.real(surplus, 3);
    c.positive(own_curvature, 4);
    c.positive(other_curvature, 5);
    if (own_curvature > 1.0) c.fail(4);
    if (other_curvature > 1.0) c.fail(5);
    const bool curved = own_curvature < 1.0 || other_curvature < 1.0;
    if (curved && own_fallback < 0.0) c.fail(0);
    if (curved && other_fallback < 0.0) c.fail(1);
    if (!c.ok()) return invalid(c, out, bad);
    const double bo = own_fallback, bt = other_fallback, tau = own_weight;
    const double Sp = surplus - bo - bt;
    if (!std::isfinite(Sp)) return invalid_at(3, out, bad);
    if (!exceeds(surplus, bo, bt)) return status_only(CTO_E_NO_DEAL, bo, out, bad);
    if (!curved || tau == 0.0 || tau == 1.0) return finish(bo + tau * Sp, out, bad, 3);
    const double ao = own_curvature, at = other_curvature;
    // closed form, docs/models/complete-information.md s.8 (CRRA, d = 0)
    if (bo == 0.0 && bt == 0.0) {
        const double wo = ao * tau, wt = at * (1.0 - tau);
        return finish(surplus * (wo / (wo + wt)), out, bad, 3);
    }
    // First-order condition in t, x = bo + t Sp, y = bt + (1 - t) Sp:
    //   h(t) = tau ao y E_t - (1 - tau) at x E_o = 0,  E = 1 - (b/x)^a, formed as
    //   -expm1(-a log1p(t Sp / b)) so that it is accurate for x near b.
    // h is strictly decreasing, positive at t = 0 and negative at t = 1.
    auto E = [](double a, double b, double gain) {
        return b == 0.0 ? 1.0 : -std::expm1(-a * std::log1p(gain / b));
    };
    auto h = [&](double t) {
        const double x = bo + t * Sp, y = bt + (1.0 - t) * Sp;
        return tau * ao * y * E(at, bt, (1.0 - t) * Sp) - (1.0 - tau) * at * x * E(ao, bo, t * Sp);
    };
    const num::Root r = num::brent(h, 0.0, 1.0, h(0.0), h(1.0));
    if (!r.converged) return status_only(CTO_E_NO_CONVERGENCE, kNaN, out, bad);
    return finish(bo + r.x * Sp, out, bad, 3);
}

// ---------------------------------------------------------------------------
// Alternating offers with risk-averse parties
// ---------------------------------------------------------------------------
namespace {

// One party's side of the stationary conditions.  r(v) is the money value of
// rejecting when the party's own next-round proposer share is v:
//   u(r) = p u(b) + alpha u(v);   f(v) = v - r(v)   (its first-mover gap).
// f is computed directly, without forming v - r, so it stays accurate when it is
// small (factors near 1, rare breakdown).
struct Party {
    int utility;
    double a;      // curvature: power exponent, or CARA coefficient k
    double b;      // fallback on breakdown
    double p;      // breakdown probability
    double alpha;  // (1 - p) d
    double om;     // 1 - alpha
    double phi;    // (1 - p)(1 - d)

    double f(double v) const {
        if (utility == CTO_UTILITY_POWER) {
            if (v <= 0.0) return b > 0.0 ? -std::pow(p, 1.0 / a) * b : 0.0;
            // c = 1 - alpha - p (b/v)^a = p (1 - (b/v)^a) + phi;  f = -v expm1(log1p(-c)/a)
            const double cc = b > 0.0 ? p * -std::expm1(a * std::log(b / v)) + phi : om;
            return -v * std::expm1(std::log1p(-cc) / a);
        }
        const double k = a, e1 = k * (v - b), e2 = k * v;
        if (std::max(e1, e2) < 700.0) {
            const double w = p * std::expm1(e1) + phi * std::expm1(e2);
            return std::log1p(w) / k;
        }
        const double l = num::log_sum_exp3(p > 0.0 ? std::log(p) + e1 : -kInf,
                                           phi > 0.0 ? std::log(phi) + e2 : -kInf,
                                           alpha > 0.0 ? std::log(alpha) : -kInf);
        return l / k;
    }
    // CARA only: f(v) and its derivative.  With 1 + w = p e^{k(v-b)} + phi e^{kv} + alpha
    // (the bracket of f's log, both branches above), f' = 1 - alpha / (1 + w), in
    // [1 - alpha, 1).
    double f_exp(double v, double &df) const {
        const double k = a, e1 = k * (v - b), e2 = k * v;
        if (std::max(e1, e2) < 700.0) {
            const double w = p * std::expm1(e1) + phi * std::expm1(e2);
            df = 1.0 - alpha / (1.0 + w);
            return std::log1p(w) / k;
        }
        const double v_f = f(v);
        df = 1.0 - alpha * std::exp(-k * v_f);
        return v_f;
    }
    // Money value of rejecting when the next-round proposer share is v.
    double r(double v) const { return v - f(v); }
    // Certainty equivalent of waiting for breakdown for ever: u^-1(p u(b) / (1 - alpha)).
    double no_deal() const {
        if (p == 0.0) return 0.0;
        const double w = p / om;
        if (utility == CTO_UTILITY_POWER) return b * std::pow(w, 1.0 / a);
        return -std::log1p(w * std::expm1(-a * b)) / a;
    }
    // r(v) as v -> +infinity (CARA only: utilities are bounded above by 1/k).
    double r_at_infinity() const { return -std::log1p(p * std::expm1(-a * b) - alpha) / a; }
};

}  // namespace

namespace {

// The argument checks of risk_averse_share, in catalogue order.
Check check_risk_averse(double own_factor, double other_factor, double own_curvature,
                        double other_curvature, int utility, double p, double own_fallback,
                        double other_fallback, double surplus) {
    Check c;
    c.unit(own_factor, 0);
    c.unit(other_factor, 1);
    c.positive(own_curvature, 2);
    c.positive(other_curvature, 3);
    if (utility != CTO_UTILITY_POWER && utility != CTO_UTILITY_EXPONENTIAL) c.fail(4);
    c.unit(p, 5);
    c.real(own_fallback, 6);
    c.real(other_fallback, 7);
    c.real(surplus, 8);
    if (utility == CTO_UTILITY_POWER) {
        if (own_curvature > 1.0) c.fail(2);
        if (other_curvature > 1.0) c.fail(3);
        if (own_fallback < 0.0) c.fail(6);
        if (other_fallback < 0.0) c.fail(7);
    }
    return c;
}

enum { kBadBracket = -1 };

// A's proposer share x, the root of H(x) = f_B(y(x)) - f_A(x) = T(x) - x with
// y(x) = S - r_A(x): strictly decreasing, zero at the equilibrium.  It is a difference of
// two small, accurately computed gaps, so the root is well conditioned even with factors
// within 1e-9 of 1.  Returns CTO_OK, CTO_E_NO_CONVERGENCE or kBadBracket (the bracket
// overflowed).
int proposer_share(const Party &A, const Party &B, double S, double *x) {
    const bool power = A.utility == CTO_UTILITY_POWER;
    auto y_of = [&](double v) {
        const double y = S - v + A.f(v);
        return power ? std::max(y, 0.0) : y;
    };
    auto H = [&](double v) { return B.f(y_of(v)) - A.f(v); };
    double lo = 0.0, hi = S;
    if (!power) {
        // T maps the line into [S - r_B(inf), S - r_B(S - r_A(inf))]; widen a little
        // so that rounding cannot put the root outside.
        const double L = S - B.r_at_infinity();
        const double U = S - B.r(S - A.r_at_infinity());
        const double m = 1e-9 * (std::fabs(L) + std::fabs(U) + std::fabs(S));
        lo = std::min(L, U) - m;
        hi = std::max(L, U) + m;
        if (!std::isfinite(lo) || !std::isfinite(hi)) return kBadBracket;
    }
    num::Root root{kNaN, false};
    if (!power) {
        // CARA: Newton's method on H with its derivative, H' = f_B'(y) y' - f_A'(x),
        // y' = f_A'(x) - 1 (both from the exponentials f already takes), started at the
        // risk-neutral Rubinstein share with factors alpha.  It needs a third of Brent's
        // evaluations; Brent remains the fallback.
        auto HD = [&](double v, double &dH) {
            double dA, dB;
            const double fA = A.f_exp(v, dA);
            const double fB = B.f_exp(S - v + fA, dB);
            dH = dB * (dA - 1.0) - dA;
            return fB - fA;
        };
        double x0 = S * (B.om / (A.om + A.alpha * B.om));
        if (!(x0 > lo && x0 < hi)) x0 = 0.5 * (lo + hi);
        root = num::newton_decreasing(HD, lo, hi, x0);
    }
    if (!root.converged) root = num::brent(H, lo, hi, H(lo), H(hi));
    if (!root.converged) return CTO_E_NO_CONVERGENCE;
    *x = root.x;
    return CTO_OK;
}

}  // namespace

int risk_averse_share(double own_factor, double other_factor, double own_curvature,
                      double other_curvature, int utility, double p, double own_fallback,
                      double other_fallback, double surplus, bool own_opens, double *out,
                      int *bad) {
    const Check c = check_risk_averse(own_factor, other_factor, own_curvature, other_curvature,
                                      utility, p, own_fallback, other_fallback, surplus);
    if (!c.ok()) return invalid(c, out, bad);

    const double S = surplus;
    auto party = [&](double d, double a, double b) {
        const double q1 = 1.0 - p;
        return Party{utility, a, b, p, q1 * d, p + q1 * (1.0 - d), q1 * (1.0 - d)};
    };
    const Party A = own_opens ? party(own_factor, own_curvature, own_fallback)
                              : party(other_factor, other_curvature, other_fallback);
    const Party B = own_opens ? party(other_factor, other_curvature, other_fallback)
                              : party(own_factor, own_curvature, own_fallback);
    const double ndA = A.no_deal(), ndB = B.no_deal();
    if (!std::isfinite(ndA + ndB)) return invalid_at(8, out, bad);
    if (!exceeds(S, ndA, ndB))
        return status_only(CTO_E_NO_DEAL, own_opens ? ndA : ndB, out, bad);
    if (A.alpha == 1.0 && B.alpha == 1.0)
        return status_only(CTO_E_INDETERMINATE, kNaN, out, bad);
    // One infinitely patient party with no breakdown risk takes everything.
    if (A.alpha == 1.0) return status_only(CTO_OK, own_opens ? S : 0.0, out, bad);
    if (B.alpha == 1.0) return status_only(CTO_OK, own_opens ? 0.0 : S, out, bad);

    if (utility == CTO_UTILITY_POWER && p == 0.0) {
        // Closed form (docs/models/complete-information.md s.8): Rubinstein with factors
        // d^(1/a), via expm1.
        const double lA = log_factor(A.alpha) / A.a, lB = log_factor(B.alpha) / B.a;
        const double den = -std::expm1(lA + lB);
        const double v = own_opens ? S * (-std::expm1(lB) / den)
                                   : S * (std::exp(lB) * -std::expm1(lA) / den);
        return finish(v, out, bad, 8);
    }
    double x = kNaN;
    const int st = proposer_share(A, B, S, &x);
    if (st == kBadBracket) return invalid_at(8, out, bad);
    if (st != CTO_OK) return status_only(st, kNaN, out, bad);
    // Own's payoff as responder: the value of rejecting A's offer, r_B(y(x)).
    double y = S - x + A.f(x);
    if (utility == CTO_UTILITY_POWER) y = std::max(y, 0.0);
    const double v = own_opens ? x : B.r(y);
    return finish(v, out, bad, 8);
}

}  // namespace cto::core
