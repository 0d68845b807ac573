// Repeated offers to a responder of unknown value: validation, the canonical form, the
// edge cases, and the no-gap paths (finite recursion and the stationary closed form).
// The gap case is in offers_gap.cpp.  Mathematics and sources: offers.hpp and
// docs/models/private-information.md s.2; the comments here explain the numerics.
//
// Canonical form.  Both cases are one game in "gain units": a seller of cost 0 offers
// prices x to a responder whose gain from agreeing at price 0 is uniform on [a_lo, h].
// Seller offers: gain = v - c, price = p - c.  Buyer offers: the seller's gain at the
// buyer's offer q is q - cost; write it as (u - cost) - (u - q): the seller's type is
// u - cost, uniform on [u - hi, u - lo], and the buyer's "price" is its own margin u - q.
// Accepting now rather than next round compares the same differences in both cases, and
// the offerer's payoff is the price, so the equilibrium conditions coincide; the money
// results map back by offer = c + x (seller) or u - x (buyer), cutoff likewise.
#include <algorithm>
#include <cfloat>
#include <cmath>

#include "offers.hpp"

namespace cto::core {

using offers_detail::Canon;

namespace {

void clear_totals(OfferTotals *o, double x) {
    o->regime = kPathNone;
    o->rounds_used = 0;
    o->rows_written = 0;
    o->stages = 0;
    o->pieces = 0;
    o->agreement_probability = o->expected_round = o->offerer_value = x;
    o->responder_value = o->opening_offer = o->last_cutoff = x;
}

// Finite deadline, no gap: the l, m recursion in n = rounds remaining (forward in n, so
// O(1) memory).  The totals are carried by recursions of their own, also forward in n:
//   q_n = (1 - m_n) + m_n q_(n-1)             mass agreeing within n rounds / state
//   r_n = (1 - m_n) + m_n (q_(n-1) + r_(n-1))  sum of round x mass / state
//   b_n = (1 - m_n)((1 + m_n)/2 - l_n) + d_b m_n^2 b_(n-1)   responder value / state^2
// The rows need (l, m) in the reverse order; the last `cap` values are parked in the
// caller's rows and turned into money in a second pass.  Every difference from 1 is
// carried as a sum of non-negative terms:
//   g - d_s l' = (1 - d_b)(1 - l') + (1 - d_s) l',   1 - l_n = (g (1 - g) + num)/den,
//   (1 + m)/2 - l = (1 - m)/2 + m d_b (1 - l').
void linear_finite(const Canon &p, OfferRow *rows, int64_t cap, OfferTotals *o) {
    const double ds = p.ds, db = p.db;
    const int64_t T = p.rounds;
    double l = 0.5, oml = 0.5, m = 0.5, om = 0.5;
    double q = 0.5, r = 0.5, b = 0.125, prod = 0.5;
    if (T - 1 < cap) rows[T - 1] = {l, m, om, 0.0};
    for (int64_t n = 2; n <= T; ++n) {
        const double omg = db * oml, g = (1.0 - db) + db * l;
        const double num = (1.0 - db) * oml + (1.0 - ds) * l, den = g + num;
        const double mn = g / den, omn = num / den, ln = g * mn;
        const double omln = (g * omg + num) / den;
        b = omn * (0.5 * omn + mn * omg) + db * mn * mn * b;
        r = omn + mn * (q + r);
        q = omn + mn * q;
        prod *= mn;
        if (prod < DBL_MIN) prod = 0.0;  // no subnormal steps (slow); the cutoff is c
        l = ln, oml = omln, m = mn, om = omn;
        if (T - n < cap) rows[T - n] = {l, m, om, 0.0};
    }
    const double h = p.h, hl = p.h / p.len;
    o->regime = kPathLinear;
    o->rounds_used = T;
    o->rows_written = std::min(T, cap);
    o->agreement_probability = hl * q;
    o->expected_round = r / q;
    o->offerer_value = 0.5 * l * h * hl;
    o->responder_value = b * h * hl;
    o->opening_offer = l * h;
    o->last_cutoff = h * prod;
    double hp = h, cum = 0.0;
    for (int64_t t = 0; t < o->rows_written; ++t) {
        const OfferRow s = rows[t];  // parked: {l_n, m_n, 1 - m_n, 0}
        const double pi = s.round_probability * hp / p.len;
        cum += pi;
        rows[t] = {s.offer * hp, s.cutoff * hp, pi, std::min(cum, 1.0)};
        hp *= s.cutoff;
        if (hp < DBL_MIN * p.h) hp = 0.0;  // below every representable share of H
    }
}

// No deadline, no gap: the stationary linear equilibrium (docs/models/private-information.md
// s.2.3), with s = sqrt(1 - d_s):
// m = 1/(1 + s), 1 - m = s/(1 + s), 1 - d_b m = (1 - d_b) + d_b s/(1 + s).
void linear_endless(const Canon &p, OfferRow *rows, int64_t cap, OfferTotals *o) {
    const double ds = p.ds, db = p.db, h = p.h, hl = p.h / p.len;
    const double s = std::sqrt(1.0 - ds);
    const double mu = 1.0 / (1.0 + s), omu = s / (1.0 + s), log_mu = -std::log1p(s);
    const double om_dbmu = (1.0 - db) + db * omu;
    const double lam = (1.0 - db) * mu / om_dbmu;
    const double gap_lam = 0.5 * omu + mu * db * omu / om_dbmu;  // (1 + mu)/2 - lam
    const double om_dbmu2 = (1.0 - db) + db * omu * (1.0 + mu);  // 1 - d_b mu^2
    o->regime = kPathLinear;
    o->rounds_used = -1;
    o->rows_written = cap;
    o->agreement_probability = hl;
    o->expected_round = (1.0 + s) / s;
    o->offerer_value = 0.5 * lam * h * hl;
    o->responder_value = h * hl * omu * gap_lam / om_dbmu2;
    o->opening_offer = lam * h;
    o->last_cutoff = 0.0;
    for (int64_t t = 0; t < cap; ++t) {
        const double before = std::exp(static_cast<double>(t) * log_mu);  // mu^(t-1)
        const double by = -std::expm1(static_cast<double>(t + 1) * log_mu);  // 1 - mu^t
        rows[t] = {lam * h * before, h * (before * mu), before * omu * hl, by * hl};
    }
}

// Money units: offer = base + sign x, cutoff likewise; values and probabilities unchanged.
void to_money(double base, double sign, OfferRow *rows, OfferTotals *o) {
    for (int64_t t = 0; t < o->rows_written; ++t) {
        rows[t].offer = base + sign * rows[t].offer;
        rows[t].cutoff = base + sign * rows[t].cutoff;
    }
    o->opening_offer = base + sign * o->opening_offer;
    o->last_cutoff = base + sign * o->last_cutoff;
}

constexpr int64_t kMaxDeadline = 10000000;  // offers; documented in the public header

int validate(double lo, double hi, double ds, double db, int64_t rounds, double known,
             int offerer, Canon *p, int *bad_index) {
    Check c;
    c.real(lo, 0);
    c.real(hi, 1);
    if (hi < lo) c.fail(1);
    c.unit(ds, 2);
    c.unit(db, 3);
    // A deadline costs O(rounds): beyond kMaxDeadline offers (a fraction of a second) the
    // call would hold a spreadsheet cell for minutes, so it is refused (0: no deadline).
    if (rounds < 0 || rounds > kMaxDeadline) c.fail(4);
    c.real(known, 5);
    if (offerer != kOffererSeller && offerer != kOffererBuyer) c.fail(6);
    if (c.ok() && rounds == 0 && ds == 1.0) c.fail(2);  // no deadline needs d_s < 1
    const bool seller = offerer == kOffererSeller;
    const double len = hi - lo;
    const double h = seller ? hi - known : known - lo;      // highest gain
    const double a_lo = seller ? lo - known : known - hi;   // lowest gain
    if (c.ok() && !std::isfinite(len)) c.fail(1);
    if (c.ok() && !(std::isfinite(h) && std::isfinite(a_lo))) c.fail(5);
    *bad_index = c.bad;
    *p = {std::max(a_lo, 0.0), h, len, ds, db, rounds};
    return c.ok() ? CTO_OK : CTO_E_INVALID;
}

// Everything but validation and the money transform, in gain units.
int solve_canonical(const Canon &p, OfferRow *rows, int64_t cap, OfferTotals *o) {
    if (!(p.h > 0.0)) {  // no type gains from agreement
        o->agreement_probability = o->offerer_value = o->responder_value = 0.0;
        return CTO_E_NO_DEAL;
    }
    if (p.len == 0.0) {  // value known: complete information, one offer at the value
        o->regime = kPathKnown;
        o->rounds_used = 1;
        o->rows_written = std::min<int64_t>(1, cap);
        if (cap > 0) rows[0] = {p.h, p.h, 1.0, 1.0};
        o->agreement_probability = o->expected_round = 1.0;
        o->offerer_value = o->opening_offer = o->last_cutoff = p.h;
        o->responder_value = 0.0;
        return CTO_OK;
    }
    if (p.a > 0.0) return offers_detail::gap_path(p, rows, cap, o);
    if (p.rounds > 0) {
        linear_finite(p, rows, cap, o);
        return CTO_OK;
    }
    if (p.db == 1.0) {  // Coase: the price falls to cost at once; timing indeterminate
        o->regime = kPathCoase;
        o->agreement_probability = p.h / p.len;
        o->offerer_value = 0.0;
        o->responder_value = 0.5 * p.h * (p.h / p.len);
        o->opening_offer = 0.0;
        return CTO_E_INDETERMINATE;
    }
    linear_endless(p, rows, cap, o);
    return CTO_OK;
}

}  // namespace

int offer_path(double private_low, double private_high, double offerer_factor,
               double responder_factor, int64_t rounds, double known_value, int offerer,
               OfferRow *rows, int64_t capacity, OfferTotals *out, int *bad) {
    clear_totals(out, kNaN);
    if (!rows || capacity < 0) capacity = 0;
    Canon p{};
    int bi = -1;
    if (validate(private_low, private_high, offerer_factor, responder_factor, rounds,
                 known_value, offerer, &p, &bi) != CTO_OK) {
        if (bad) *bad = bi;
        return CTO_E_INVALID;
    }
    if (bad) *bad = -1;
    const int st = solve_canonical(p, rows, capacity, out);
    if (st == CTO_E_NO_CONVERGENCE) clear_totals(out, kNaN);
    const bool seller = offerer == kOffererSeller;
    // The gap case measures offers above the lowest gain: the base is then the end of the
    // private interval itself (exact), not the known value plus a rounded gap.
    const bool gap = out->regime == kPathGap || out->regime == kPathClosed;
    const double base = gap ? (seller ? private_low : private_high) : known_value;
    to_money(base, seller ? 1.0 : -1.0, rows, out);
    return st;
}

namespace {
int scalar(double lo, double hi, double ds, double db, int64_t rounds, double known,
           int offerer, double OfferTotals::*field, double *out, int *bad) {
    OfferTotals o;
    const int st = offer_path(lo, hi, ds, db, rounds, known, offerer, nullptr, 0, &o, bad);
    *out = st == CTO_E_INDETERMINATE ? kNaN : o.*field;
    return st;
}
}  // namespace

int agreement_probability(double private_low, double private_high, double offerer_factor,
                          double responder_factor, int64_t rounds, double known_value,
                          int offerer, double *out, int *bad) {
    return scalar(private_low, private_high, offerer_factor, responder_factor, rounds,
                  known_value, offerer, &OfferTotals::agreement_probability, out, bad);
}
int expected_agreement_round(double private_low, double private_high, double offerer_factor,
                             double responder_factor, int64_t rounds, double known_value,
                             int offerer, double *out, int *bad) {
    return scalar(private_low, private_high, offerer_factor, responder_factor, rounds,
                  known_value, offerer, &OfferTotals::expected_round, out, bad);
}
int opening_offer(double private_low, double private_high, double offerer_factor,
                  double responder_factor, int64_t rounds, double known_value, int offerer,
                  double *out, int *bad) {
    return scalar(private_low, private_high, offerer_factor, responder_factor, rounds,
                  known_value, offerer, &OfferTotals::opening_offer, out, bad);
}

}  // namespace cto::core
