// Internal C++ core of counteroffer: the mathematics, with no knowledge of any wrapper.
//
// Every model function has the shape
//     int name(inputs..., double *out, int *bad)
// It validates its inputs, writes *out on every path and returns a CTO_* status; on
// CTO_E_INVALID, *bad receives the catalogue index of the first invalid argument.
// Nothing here throws, allocates or keeps state.
//
// The formulas and their sources are documented beside each function in the public
// header lib/include/counteroffer/counteroffer.h; comments here explain the numerics.
#ifndef CTO_CORE_HPP
#define CTO_CORE_HPP

#include <cfloat>
#include <cstddef>
#include <cmath>
#include <cstdint>
#include <limits>

#include "counteroffer/counteroffer.h"

namespace cto::core {

inline constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();
inline constexpr double kInf = std::numeric_limits<double>::infinity();

// ---- argument checks ---------------------------------------------------------
// Records the first failing argument index.  NaN fails every check.
struct Check {
    int bad = -1;
    void fail(int i) {
        if (bad < 0) bad = i;
    }
    void real(double x, int i) {
        if (!std::isfinite(x)) fail(i);
    }
    void unit(double x, int i) {
        if (!(x >= 0.0 && x <= 1.0)) fail(i);
    }
    void nonneg(double x, int i) {
        if (!(x >= 0.0 && x <= DBL_MAX)) fail(i);
    }
    void positive(double x, int i) {
        if (!(x > 0.0 && x <= DBL_MAX)) fail(i);
    }
    // finite, or -infinity meaning "absent"
    void optional(double x, int i) {
        if (!(std::isfinite(x) || x == -kInf)) fail(i);
    }
    bool ok() const { return bad < 0; }
};

// Writes the invalid-argument outcome.
inline int invalid(const Check &c, double *out, int *bad) {
    *out = kNaN;
    if (bad) *bad = c.bad;
    return CTO_E_INVALID;
}
inline int invalid_at(int index, double *out, int *bad) {
    *out = kNaN;
    if (bad) *bad = index;
    return CTO_E_INVALID;
}
inline int status_only(int status, double value, double *out, int *bad) {
    *out = value;
    if (bad) *bad = -1;
    return status;
}
// A result that overflowed although every input was finite: the magnitudes are out of
// range for double arithmetic, which is reported as an invalid argument (never inf).
inline int finish(double value, double *out, int *bad, int blame = 0) {
    if (!std::isfinite(value)) return invalid_at(blame, out, bad);
    return status_only(CTO_OK, value, out, bad);
}

// ---- exact comparisons ------------------------------------------------------
// Whether a > x + y in exact arithmetic, for finite doubles whose sum does not overflow.
// Deciding "is a deal rational" this way keeps the answer right to the last bit when the
// no-deal payoffs add up to the surplus within rounding (Knuth's TwoSum).
inline bool exceeds(double a, double x, double y) {
    const double s = x + y;
    const double bb = s - x;
    const double e = (x - (s - bb)) + (y - bb);  // x + y = s + e exactly
    const double t = a - s;
    const double cc = t - a;
    const double f = (a - (t - cc)) + (-s - cc);  // a - s = t + f exactly
    // a - (x + y) = t + f - e; near a tie t is exact (f = 0) and small.
    return t > e - f;
}

// ---- Rubinstein kernels -----------------------------------------------------
// With om_x = 1 - d_x (exact for d_x >= 1/2), 1 - d_open d_resp is formed as
// om_open + d_open om_resp: a sum of non-negative terms, so no cancellation.
// Rubinstein (1982), main theorem; Muthoo (1999) ch.3.
inline double rub_den(double d_open, double om_open, double om_resp) {
    return om_open + d_open * om_resp;
}
// The fraction is formed first and then scaled by S, so that a tiny (even subnormal)
// surplus keeps its precision: S (1 - d) could otherwise underflow before the division.
// Opener's share of S: S (1 - d_resp) / (1 - d_open d_resp).
inline double rub_opener(double S, double om_resp, double den) { return S * (om_resp / den); }
// Responder's share of S: S d_resp (1 - d_open) / (1 - d_open d_resp).
inline double rub_responder(double S, double d_resp, double om_open, double den) {
    return S * (d_resp * om_open / den);
}

// The checks of the two-factor Rubinstein functions (share, first_mover_advantage):
// returns a status when the outcome is decided (invalid, no deal, indeterminate), or -1
// when the formula applies.
inline int rub_prologue(double own_factor, double other_factor, double surplus, double *out,
                        int *bad) {
    Check c;
    c.unit(own_factor, 0);
    c.unit(other_factor, 1);
    c.real(surplus, 2);
    if (!c.ok()) return invalid(c, out, bad);
    if (!(surplus > 0.0)) return status_only(CTO_E_NO_DEAL, 0.0, out, bad);
    if (own_factor == 1.0 && other_factor == 1.0)
        return status_only(CTO_E_INDETERMINATE, kNaN, out, bad);
    return -1;
}

// cto_share, inline because it is the hottest loop of the wrappers.
inline int share(double own_factor, double other_factor, double surplus, bool own_opens,
                 double *out, int *bad) {
    const int pre = rub_prologue(own_factor, other_factor, surplus, out, bad);
    if (pre >= 0) return pre;
    const double om_own = 1.0 - own_factor, om_oth = 1.0 - other_factor;
    double v;
    if (own_opens) {
        v = rub_opener(surplus, om_oth, rub_den(own_factor, om_own, om_oth));
    } else {
        v = rub_responder(surplus, own_factor, om_oth, rub_den(other_factor, om_oth, om_own));
    }
    return finish(v, out, bad, 2);  // S near DBL_MAX can round past it
}

// cto_share over a block of m elements (own_opens given as 0/1 doubles), branch-free so
// that the compiler vectorises it (blocks.cpp).  Writes a value for every element and
// returns true when every element is valid and has a deal; then out[i] is bit for bit
// what share() writes.  When it returns false the caller redoes the block with share().
bool share_block(size_t m, const double *own_factor, const double *other_factor,
                 const double *surplus, const double *own_opens, double *out);

// a b / c for positive finite a, b, c without overflow or underflow in the steps: the
// mantissas are combined in [1/8, 2) and the exponents added, so only the final result
// rounds (once, also into the subnormal range).  Used where ratios of extreme inputs meet.
inline double mul_div(double a, double b, double c) {
    int ea, eb, ec;
    const double ma = std::frexp(a, &ea), mb = std::frexp(b, &eb), mc = std::frexp(c, &ec);
    return std::ldexp(ma * mb / mc, ea + eb - ec);
}

// Per-round log discount rho = c(rate) days / basis, c = log1p (annual effective) or
// identity (continuous).  Factor = exp(-rho); 1 - factor = -expm1(-rho).
inline double log_discount(double rate, double days, double basis, bool continuous) {
    const double c = continuous ? rate : std::log1p(rate);
    if (c == 0.0 || days == 0.0) return 0.0;  // no discounting
    const double r = days / basis, rho = c * r;
    if (std::isfinite(rho) && r >= DBL_MIN && rho >= DBL_MIN) return rho;
    return mul_div(c, days, basis);  // days/basis or the product left the normal range
}

inline int round_factor(double rate, double days, double basis, bool continuous,
                        double *out, int *bad) {
    Check c;
    c.nonneg(rate, 0);
    c.nonneg(days, 1);
    c.positive(basis, 2);
    if (!c.ok()) return invalid(c, out, bad);
    return status_only(CTO_OK, std::exp(-log_discount(rate, days, basis, continuous)), out,
                       bad);
}

}  // namespace cto::core

#endif  // CTO_CORE_HPP
