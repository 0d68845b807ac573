// The bargaining models.  Formulas, sources and status tables are documented in the
// public header; the comments here explain the numerical choices.
#include <algorithm>
#include <cmath>

#include "core.hpp"
#include "numerics.hpp"

namespace cto::core {

namespace {

// log(d) accurately for d near 1 (1 - d is exact for d >= 1/2).
double log_factor(double d) { return d > 0.5 ? std::log1p(-(1.0 - d)) : std::log(d); }

// q^m for m >= 0 with q in [0, 1], as exp(m log q).
double pow_count(double log_q, double m) {
    if (m == 0.0) return 1.0;
    return std::exp(m * log_q);
}

}  // namespace

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
// The combined model: breakdown risk, inside options, outside options
// ---------------------------------------------------------------------------
namespace {

enum { kOverflow = -1 };

// Solves with the opener called A.  Inputs are already validated.  Returns a CTO_*
// status or kOverflow (finite inputs whose combination overflows).
int solve_core(const SolveIn &in, SolveOut *o) {
    const bool own_a = in.own_opens;
    const double dA = own_a ? in.own_factor : in.other_factor;
    const double dB = own_a ? in.other_factor : in.own_factor;
    const double bA = own_a ? in.own_fallback : in.other_fallback;
    const double bB = own_a ? in.other_fallback : in.own_fallback;
    const double gA = own_a ? in.own_inside : in.other_inside;
    const double gB = own_a ? in.other_inside : in.own_inside;
    const double wA = own_a ? in.own_outside : in.other_outside;
    const double wB = own_a ? in.other_outside : in.own_outside;
    const double p = in.p, S = in.surplus, q1 = 1.0 - p;

    // alpha_i = (1 - p) d_i is the chance-weighted factor; 1 - alpha_i is formed as
    // p + (1 - p)(1 - d_i), a sum of non-negative terms.
    const double omdA = 1.0 - dA, omdB = 1.0 - dB;
    const double aA = q1 * dA, aB = q1 * dB;
    const double omA = p + q1 * omdA, omB = p + q1 * omdB;

    // No-deal value of waiting: d0 = (p b + (1-p)(1-d) g) / (1 - alpha), a weighted
    // mean of the fallback and the inside option (exactly g when p = 0, b when p = 1).
    auto wait_value = [&](double om, double omd, double b, double g) {
        if (om == 0.0) return g;  // p = 0 and d = 1: the status quo forever
        return (p / om) * b + (q1 * omd / om) * g;
    };
    const double d0A = wait_value(omA, omdA, bA, gA);
    const double d0B = wait_value(omB, omdB, bB, gB);
    o->binding = CTO_BINDS_NONE;
    o->boundary = false;
    o->rational = false;

    // The model on the surplus above (d0A, d0B): factors alpha, options W = w - d0.
    const double Sp = S - d0A - d0B;
    const double WA = wA - d0A, WB = wB - d0B;  // -inf stays -inf (absent)
    if (!std::isfinite(Sp) || !std::isfinite(d0A) || !std::isfinite(d0B) ||
        (std::isfinite(wA) && !std::isfinite(WA)) || (std::isfinite(wB) && !std::isfinite(WB)))
        return kOverflow;
    const bool hasA = WA > 0.0, hasB = WB > 0.0;  // only a positive W can bind
    // No-deal payoffs.  A side whose walk-away value beats waiting walks away at its first
    // answer, which ends the talks for both: each side with a walk-away option then gets
    // it, even one whose option is worse than waiting; a side without one keeps its value
    // of waiting (its status quo and breakdown prospects).  Otherwise nobody walks and
    // each gets its value of waiting, d0.
    const bool walks = hasA || hasB;
    const double ndA = walks && std::isfinite(wA) ? wA : d0A;
    const double ndB = walks && std::isfinite(wB) ? wB : d0B;
    o->own_no_deal = own_a ? ndA : ndB;
    o->other_no_deal = own_a ? ndB : ndA;
    // Rational iff S exceeds the sum of the no-deal payoffs, decided exactly.
    if (!exceeds(S, ndA, ndB)) {
        o->own_share = o->own_no_deal;
        o->other_share = o->other_no_deal;
        return CTO_E_NO_DEAL;
    }
    o->rational = true;
    if (aA == 1.0 && aB == 1.0) {
        o->own_share = o->other_share = kNaN;
        return CTO_E_INDETERMINATE;
    }

    const double den = rub_den(aA, omA, omB);  // 1 - alpha_A alpha_B
    const double UA = rub_opener(Sp, omB, den);  // A's proposer share, regime (i)
    const double UB = rub_opener(Sp, omA, den);  // B's proposer share, regime (i)
    double X, R;                                  // A's amount, B's amount (above d0)
    int regime;
    if ((!hasA || WA <= aA * UA) && (!hasB || WB <= aB * UB)) {
        regime = 1;  // (i) neither option binds: Rubinstein on Sp
        X = UA;
        R = rub_responder(Sp, aB, omA, den);
    } else if (hasB && WB > aB * UB && (!hasA || WA <= aA * (Sp - WB))) {
        regime = 2;  // (ii) B's option binds: B as responder gets exactly W_B
        X = Sp - WB;
        R = WB;
    } else if (hasA && WA > aA * UA && (!hasB || WB <= aB * (Sp - WA))) {
        regime = 3;  // (iii) A's option binds: B proposes S - W_A, A offers aB of it
        const double Y = Sp - WA;
        X = omB * Sp + aB * WA;  // = Sp - aB (Sp - WA), without cancellation
        R = aB * Y;
    } else {
        regime = 4;  // (iv) both bind
        X = Sp - WB;
        R = WB;
    }
    // Boundary: an option within 1e-12 x surplus of a threshold (REFERENCE s.12).
    const double tol = 1e-12 * std::fabs(S);
    bool boundary = false;
    if (hasA && std::fabs(WA - aA * UA) <= tol) boundary = true;
    if (hasB && std::fabs(WB - aB * UB) <= tol) boundary = true;
    if (hasA && hasB &&
        (std::fabs(WA - aA * (Sp - WB)) <= tol || std::fabs(WB - aB * (Sp - WA)) <= tol))
        boundary = true;

    // Shares in money.  Where an option binds, the binding side's payoff is formed from
    // the inputs directly (exactly w_B in (ii) and (iv); a weighted mean in (iii)), which
    // avoids adding back d0 after subtracting it.
    double shareA, shareB;
    switch (regime) {
        case 1:
            shareA = d0A + X;
            shareB = d0B + R;
            break;
        case 3: {  // A's option binds: x = (1 - a_B)(S - d0_B) + a_B w_A
            // A can use its option only as a responder, one round on.  Agreeing now leaves
            // it x; refusing its own offer and walking at the next answer is worth
            // d0_A + a_A W_A.  The gain from agreeing now is (1-a_B) Y + (1-a_A) W_A with
            // Y = Sp - W_A; it is negative only when W_A exceeds Sp (a deal made rational
            // by the other side's poor walk-away value).  Then the equilibrium has one
            // round of delay: B proposes next and gives A exactly w_A, and both shares are
            // present values that add up to less than the surplus.
            const double Y = Sp - WA;
            if (omB * Y + omA * WA < 0.0) {
                shareA = d0A + aA * WA;
                shareB = d0B + aB * Y;
            } else {
                shareA = omB * (S - d0B) + aB * wA;
                shareB = S - shareA;
            }
            break;
        }
        default:  // (ii), (iv): B as responder gets exactly its walk-away value
            shareB = wB;
            shareA = S - wB;
            break;
    }
    if (!std::isfinite(shareA) || !std::isfinite(shareB)) return kOverflow;
    o->own_share = own_a ? shareA : shareB;
    o->other_share = own_a ? shareB : shareA;
    const bool a_binds = regime == 3 || regime == 4, b_binds = regime == 2 || regime == 4;
    const bool own_binds = own_a ? a_binds : b_binds;
    const bool oth_binds = own_a ? b_binds : a_binds;
    o->binding = own_binds ? (oth_binds ? CTO_BINDS_BOTH : CTO_BINDS_OWN)
                           : (oth_binds ? CTO_BINDS_OTHER : CTO_BINDS_NONE);
    o->boundary = boundary;
    return CTO_OK;
}

void nan_outcome(SolveOut *o) {
    o->own_share = o->other_share = o->own_no_deal = o->other_no_deal = kNaN;
    o->binding = CTO_BINDS_NONE;
    o->boundary = false;
    o->rational = false;
}

// Runs solve_core for a special-case function; `surplus_index` is blamed on overflow.
int solve_own(const SolveIn &in, int surplus_index, double *out, int *bad) {
    SolveOut o;
    const int st = solve_core(in, &o);
    if (st == kOverflow) return invalid_at(surplus_index, out, bad);
    return status_only(st, o.own_share, out, bad);
}

}  // namespace

int solve(const SolveIn &in, SolveOut *out, int *bad) {
    Check c;
    c.unit(in.own_factor, 0);
    c.unit(in.other_factor, 1);
    c.unit(in.p, 2);
    c.real(in.own_fallback, 3);
    c.real(in.other_fallback, 4);
    c.real(in.own_inside, 5);
    c.real(in.other_inside, 6);
    c.optional(in.own_outside, 7);
    c.optional(in.other_outside, 8);
    c.real(in.surplus, 9);
    if (bad) *bad = c.bad;
    if (!c.ok()) {
        nan_outcome(out);
        return CTO_E_INVALID;
    }
    const int st = solve_core(in, out);
    if (st == kOverflow) {
        nan_outcome(out);
        if (bad) *bad = 9;
        return CTO_E_INVALID;
    }
    return st;
}

int breakdown_share(double own_factor, double other_factor, double p, double own_fallback,
                    double other_fallback, double surplus, bool own_opens, double *out,
                    int *bad) {
    Check c;
    c.unit(own_factor, 0);
    c.unit(other_factor, 1);
    c.unit(p, 2);
    c.real(own_fallback, 3);
    c.real(other_fallback, 4);
    c.real(surplus, 5);
    if (!c.ok()) return invalid(c, out, bad);
    const SolveIn in{own_factor, other_factor, p,     own_fallback, other_fallback, 0.0,
                     0.0,        -kInf,        -kInf, surplus,      own_opens};
    return solve_own(in, 5, out, bad);
}

namespace {
// outside_option_share and inside_option_share: two factors, one money amount per side,
// the surplus and who opens, validated in catalogue order; the amounts are walk-away
// values (outside) or status-quo values (inside).
int option_model(double own_factor, double other_factor, double own_amount,
                 double other_amount, double surplus, bool own_opens, bool outside,
                 double *out, int *bad) {
    Check c;
    c.unit(own_factor, 0);
    c.unit(other_factor, 1);
    c.real(own_amount, 2);
    c.real(other_amount, 3);
    c.real(surplus, 4);
    if (!c.ok()) return invalid(c, out, bad);
    const SolveIn in{own_factor,
                     other_factor,
                     0.0,
                     0.0,
                     0.0,
                     outside ? 0.0 : own_amount,
                     outside ? 0.0 : other_amount,
                     outside ? own_amount : -kInf,
                     outside ? other_amount : -kInf,
                     surplus,
                     own_opens};
    return solve_own(in, 4, out, bad);
}
}  // namespace

int outside_option_share(double own_factor, double other_factor, double own_outside,
                         double other_outside, double surplus, bool own_opens, double *out,
                         int *bad) {
    return option_model(own_factor, other_factor, own_outside, other_outside, surplus,
                        own_opens, true, out, bad);
}

int inside_option_share(double own_factor, double other_factor, double own_inside,
                        double other_inside, double surplus, bool own_opens, double *out,
                        int *bad) {
    return option_model(own_factor, other_factor, own_inside, other_inside, surplus,
                        own_opens, false, out, bad);
}

// ---------------------------------------------------------------------------
// Deadline (finite horizon)
// ---------------------------------------------------------------------------
// Exact backward induction from the last round.  In each round the proposer either makes
// the offer the responder accepts (its discounted value of going on) or, when that leaves
// it less than its own discounted value of waiting, an offer that is refused; the
// responder accepts when indifferent.  Play therefore runs in phases:
//   - an agreement phase, where the proposer's value follows the two-step linear map
//     F -> S (1 - d_resp) + q F, so F_{s-2m} = F* + q^m (F_s - F*) with q^m = exp(m log q);
//     whether agreement holds in a round is affine in q^m, hence monotone in m;
//   - a disagreement phase (possible with negative payoffs), where each side's value is
//     only discounted, v_i d_i^k; agreement returns when S >= sum_i d_i^k v_i, a constant
//     minus two exponentials in k, which has at most one turning point.
// Each phase is crossed at once by bisection on its monotone pieces, so the cost does not
// grow with `rounds`.  Once agreement holds with both values non-negative (and S >= 0)
// it holds in every earlier round: the proposer can always pay the responder's
// discounted value and keep more than its own.
namespace {

constexpr int kDeadlinePhases = 256;  // phase changes before giving up (no_convergence)

struct Deadline {
    double S;
    double d[2], ld[2];  // factors and their logs, [A, B]; A proposes in odd rounds
    double omA, omB, one_minus_q, log_q;

    static int proposer(int64_t t) { return (t % 2 == 1) ? 0 : 1; }

    // Proposer value at round r <= s given proposer value Fs at round s and agreement in
    // every round r..s (same parity as s).
    double back_same(int64_t s, double Fs, int64_t r) const {
        if (one_minus_q == 0.0) return Fs;  // both factors 1: the values just alternate
        const int X = proposer(r);
        const double star = rub_opener(S, X == 0 ? omB : omA, one_minus_q);
        return star + pow_count(log_q, static_cast<double>((s - r) / 2)) * (Fs - star);
    }
    // Proposer value at any round r <= t, agreement in every round r..t.
    double F_at(int64_t t, double Ft, int64_t r) const {
        if ((t - r) % 2 == 0) return back_same(t, Ft, r);
        const double Ft1 = S - d[proposer(t)] * Ft;  // round t-1, one step of agreement
        return back_same(t - 1, Ft1, r);
    }
    // Whether round r agrees given agreement in round r+1 with proposer value F (weak).
    bool agrees_after(int64_t r, double F) const {
        const int P = proposer(r), R = 1 - P;  // R proposes in round r + 1
        return S - d[R] * F >= d[P] * (S - F);
    }
    // Discounting a value over k rounds: v d^k.
    double disc(int i, double v, double k) const {
        if (v == 0.0 || k == 0.0) return v;
        return v * pow_count(ld[i], k);
    }
};

// Largest index in [lo, hi] where pred holds, given pred(lo) and pred is true on a prefix
// [lo, x] and false after it.
template <class Pred>
int64_t last_true(int64_t lo, int64_t hi, Pred &&pred) {
    while (lo < hi) {
        const int64_t mid = lo + (hi - lo + 1) / 2;
        if (pred(mid))
            lo = mid;
        else
            hi = mid - 1;
    }
    return lo;
}

}  // namespace

int deadline_share(double own_factor, double other_factor, int64_t rounds, double own_fallback,
                   double other_fallback, double surplus, bool own_opens, double *out,
                   int *bad) {
    Check c;
    c.unit(own_factor, 0);
    c.unit(other_factor, 1);
    if (rounds < 0) c.fail(2);
    c.real(own_fallback, 3);
    c.real(other_fallback, 4);
    c.real(surplus, 5);
    if (!c.ok()) return invalid(c, out, bad);
    if (rounds == 0) return status_only(CTO_E_NO_DEAL, own_fallback, out, bad);

    Deadline g;
    g.S = surplus;
    g.d[0] = own_opens ? own_factor : other_factor;
    g.d[1] = own_opens ? other_factor : own_factor;
    g.ld[0] = log_factor(g.d[0]);
    g.ld[1] = log_factor(g.d[1]);
    g.omA = 1.0 - g.d[0];
    g.omB = 1.0 - g.d[1];
    g.one_minus_q = rub_den(g.d[0], g.omA, g.omB);
    g.log_q = std::log1p(-g.one_minus_q);
    const double b[2] = {own_opens ? own_fallback : other_fallback,
                         own_opens ? other_fallback : own_fallback};
    const int own = own_opens ? 0 : 1;
    const double S = surplus;

    // Round T.
    int64_t t = rounds;
    double v[2];   // values of A and B at the date of round t
    bool agreed;   // (weak) agreement in round t
    bool ever;     // a strict gain from agreement somewhere on the path from round t
    {
        const int P = Deadline::proposer(t), R = 1 - P;
        agreed = ever = exceeds(S, b[R], b[P]);
        v[P] = agreed ? S - b[R] : b[P];
        v[R] = b[R];
    }
    // One explicit round back: t -> t - 1.
    auto step = [&] {
        --t;
        const int P = Deadline::proposer(t), R = 1 - P;
        const double cR = g.d[R] * v[R], cP = g.d[P] * v[P];
        const bool strict = S - cR > cP;
        agreed = S - cR >= cP;
        v[P] = agreed ? S - cR : cP;
        v[R] = cR;
        ever = ever || strict;
    };
    auto done = [&](double value, bool deal) {
        if (!std::isfinite(value)) return invalid_at(5, out, bad);
        return status_only(deal ? CTO_OK : CTO_E_NO_DEAL, value, out, bad);
    };

    for (int phase = 0; t > 1; ++phase) {
        if (phase > kDeadlinePhases) return status_only(CTO_E_NO_CONVERGENCE, kNaN, out, bad);
        if (!std::isfinite(v[0]) || !std::isfinite(v[1])) return invalid_at(5, out, bad);
        // Every value and the surplus below 2^-1000: the pattern is decided by rounding in
        // subnormal arithmetic (slow and meaningless), so say so instead of guessing.
        if (phase > 8 && std::fabs(S) < 0x1p-1000 && std::fabs(v[0]) < 0x1p-1000 &&
            std::fabs(v[1]) < 0x1p-1000)
            return status_only(CTO_E_NO_CONVERGENCE, kNaN, out, bad);
        // Which of the next two rounds agree (explicit look-ahead on a copy).
        bool a1, a2 = false;
        {
            const int64_t t0 = t;
            const double v0[2] = {v[0], v[1]};
            const bool ag0 = agreed, ev0 = ever;
            step();
            a1 = agreed;
            if (t > 1) {
                step();
                a2 = agreed;
            }
            t = t0;
            v[0] = v0[0];
            v[1] = v0[1];
            agreed = ag0;
            ever = ev0;
        }
        if (a1 && !agreed) {
            step();  // agreement starts in the next round: take it, then run the phase
            continue;
        }
        if (!a1 && a2 && t > 2) {
            // Alternating phase: round t-1 refuses, round t-2 agrees, and so on in cycles of
            // two rounds.  With X proposing in round t and Y in t-1, after j cycles
            // v_Y = d_Y^(2j) v_Y(0) and v_X = S - v_Y; whether cycle j keeps the pattern is
            // affine in d_Y^(2j), so the cycles that do are a prefix found by bisection.
            const int X = Deadline::proposer(t), Y = 1 - X;
            const double vY0 = v[Y];
            const int64_t J = (t - 1) / 2;
            auto cycle_ok = [&](int64_t j) {
                const double y = g.disc(Y, vY0, static_cast<double>(2 * (j - 1)));
                const double x = S - y;  // j >= 2
                const bool refuse = S - g.d[X] * x < g.d[Y] * y;
                const bool agree = S - g.d[Y] * (g.d[Y] * y) >= g.d[X] * (g.d[X] * x);
                return refuse && agree;
            };
            int64_t jstar = 1;
            if (J >= 2 && cycle_ok(2)) jstar = last_true(2, J, cycle_ok);
            // Take cycle 1 explicitly (it uses v_X(0)), then jump the rest.
            step();
            step();
            if (jstar > 1) {
                const double y = g.disc(Y, v[Y], static_cast<double>(2 * (jstar - 1)));
                v[Y] = y;
                v[X] = S - y;
                t -= 2 * (jstar - 1);
                agreed = true;  // cycle 1, taken explicitly, already recorded any strict gain
            }
            continue;
        }
        if (agreed && a1) {
            const double Ft = v[Deadline::proposer(t)];
            // First round r < t (counting down) where agreement fails; 0 if none.  Rounds of
            // each parity are monotone in m, so each class is bisected on its own.
            int64_t r_fail = 0;
            const bool absorbing = v[0] >= 0.0 && v[1] >= 0.0 && S >= 0.0;
            if (!absorbing) {
                for (int64_t first = t - 1; first >= t - 2 && first >= 1; --first) {
                    // rounds r = first, first - 2, ...: agreement after F at r + 1
                    auto ok_at = [&](int64_t m) {
                        const int64_t r = first - 2 * m;
                        return g.agrees_after(r, g.F_at(t, Ft, r + 1));
                    };
                    if (!ok_at(0)) {
                        r_fail = std::max(r_fail, first);
                        continue;
                    }
                    const int64_t m_max = (first - 1) / 2;
                    if (ok_at(m_max)) continue;  // agreement all the way down this class
                    const int64_t m_ok = last_true(0, m_max, ok_at);
                    r_fail = std::max(r_fail, first - 2 * (m_ok + 1));
                }
            }
            if (r_fail == 0) {
                // Agreement in every round down to round 1.
                const double F1 = g.F_at(t, Ft, 1);
                const double F2 = t >= 2 ? g.F_at(t, Ft, 2) : S - F1;
                if (!ever) ever = F1 > g.d[0] * (S - F2);  // a strict gain in round 1
                return done(own == 0 ? F1 : g.d[1] * F2, ever);
            }
            // Jump to round r_fail + 1 (still agreeing), then take the refusing round.
            const int64_t r1 = r_fail + 1;
            if (r1 < t) {
                const double F = g.F_at(t, Ft, r1);
                const int P = Deadline::proposer(r1);
                v[P] = F;
                v[1 - P] = S - F;
                t = r1;
            }
            step();
        } else {
            if (v[0] >= 0.0 && v[1] >= 0.0 && S <= 0.0) {
                // Nothing to gain in any earlier round: the deadline payoffs, discounted.
                return done(g.disc(own, v[own], static_cast<double>(t - 1)), ever);
            }
            // Agreement returns at round t - k for the first k >= 1 with
            // gap(k) = S - d_A^k v_A - d_B^k v_B >= 0.
            const double vA = v[0], vB = v[1];
            auto gap = [&](int64_t k) {
                const double kk = static_cast<double>(k);
                return S - g.disc(0, vA, kk) - g.disc(1, vB, kk);
            };
            const int64_t K = t - 1;
            int64_t k = -1;
            if (gap(1) >= 0.0) {
                k = 1;
            } else if (K > 1) {
                // The first difference changes sign at most once: split at its turn.
                auto rising = [&](int64_t j) { return gap(j + 1) >= gap(j); };
                const bool r0 = rising(1);
                int64_t turn = K;
                if (K > 2 && rising(K - 1) != r0)
                    turn = last_true(1, K - 1, [&](int64_t j) { return rising(j) == r0; }) + 1;
                // Piece 1 is [1, turn]; piece 2 is [turn, K]; gap(1) < 0.
                auto first_nonneg = [&](int64_t lo, int64_t hi) {  // gap increasing on [lo, hi]
                    if (gap(hi) < 0.0) return int64_t(-1);
                    return last_true(lo, hi, [&](int64_t j) { return gap(j) < 0.0; }) + 1;
                };
                if (r0) {
                    k = first_nonneg(1, turn);  // increasing first; then decreasing, stays below
                } else if (turn < K) {
                    k = first_nonneg(turn, K);  // decreasing first (stays below), then increasing
                }
            }
            if (k < 0) {
                // No agreement in any earlier round: round-1 values are discounted.
                return done(g.disc(own, v[own], static_cast<double>(K)), ever);
            }
            // Rounds t-1 .. t-k+1 refuse; jump to round t - k + 1, then take round t - k.
            const double kk = static_cast<double>(k - 1);
            v[0] = g.disc(0, vA, kk);
            v[1] = g.disc(1, vB, kk);
            t -= k - 1;
            step();
        }
    }
    return done(v[own], ever);
}

// ---------------------------------------------------------------------------
// Fixed costs, delay, first mover
// ---------------------------------------------------------------------------
int fixed_cost_share(double own_cost, double other_cost, double surplus, bool own_opens,
                     double *out, int *bad) {
    Check c;
    c.nonneg(own_cost, 0);
    c.nonneg(other_cost, 1);
    c.real(surplus, 2);
    if (!c.ok()) return invalid(c, out, bad);
    const double S = surplus;
    if (!(S > 0.0)) return status_only(CTO_E_NO_DEAL, 0.0, out, bad);
    if (own_cost == other_cost && own_cost < S)
        return status_only(CTO_E_INDETERMINATE, kNaN, out, bad);
    // Proposer X with cost cx against responder cost cy (REFERENCE s.2, generalised):
    // cx < cy -> S;  cx > cy -> min(cy, S);  equal costs >= S -> S.
    auto proposer_share = [S](double cx, double cy) { return cx > cy ? std::min(cy, S) : S; };
    const double v = own_opens ? proposer_share(own_cost, other_cost)
                               : S - proposer_share(other_cost, own_cost);
    return status_only(CTO_OK, v, out, bad);
}

int delay_cost(double factor, double stake, double p, double fallback, double *out, int *bad) {
    Check c;
    c.unit(factor, 0);
    c.real(stake, 1);
    c.unit(p, 2);
    c.real(fallback, 3);
    if (!c.ok()) return invalid(c, out, bad);
    // stake - ((1-p) d stake + p fallback) = p (stake - fallback) + (1-p)(1-d) stake
    const double v = p * (stake - fallback) + (1.0 - p) * (1.0 - factor) * stake;
    return finish(v, out, bad, 1);
}

int first_mover_advantage(double own_factor, double other_factor, double surplus, double *out,
                          int *bad) {
    const int pre = rub_prologue(own_factor, other_factor, surplus, out, bad);
    if (pre >= 0) return pre;
    const double om_own = 1.0 - own_factor, om_oth = 1.0 - other_factor;
    const double v = surplus * (om_own * om_oth / rub_den(own_factor, om_own, om_oth));
    return finish(v, out, bad, 2);
}

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
    if (bo == 0.0 && bt == 0.0) {  // closed form, REFERENCE s.7 (CRRA, d = 0)
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

int risk_averse_share(double own_factor, double other_factor, double own_curvature,
                      double other_curvature, int utility, double p, double own_fallback,
                      double other_fallback, double surplus, bool own_opens, double *out,
                      int *bad) {
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
        // Closed form (REFERENCE s.7): Rubinstein with factors d^(1/a), via expm1.
        const double lA = log_factor(A.alpha) / A.a, lB = log_factor(B.alpha) / B.a;
        const double den = -std::expm1(lA + lB);
        const double v = own_opens ? S * (-std::expm1(lB) / den)
                                   : S * (std::exp(lB) * -std::expm1(lA) / den);
        return finish(v, out, bad, 8);
    }

    // x: A's proposer share.  y(x) = S - r_A(x);  H(x) = f_B(y(x)) - f_A(x) = T(x) - x,
    // strictly decreasing, zero at the equilibrium.  It is a difference of two small,
    // accurately computed gaps, so the root is well conditioned even with factors
    // within 1e-9 of 1.
    const bool power = utility == CTO_UTILITY_POWER;
    auto y_of = [&](double x) {
        const double y = S - x + A.f(x);
        return power ? std::max(y, 0.0) : y;
    };
    auto H = [&](double x) { return B.f(y_of(x)) - A.f(x); };
    double lo, hi;
    if (power) {
        lo = 0.0;
        hi = S;
    } else {
        // T maps the line into [S - r_B(inf), S - r_B(S - r_A(inf))]; widen a little
        // so that rounding cannot put the root outside.
        const double L = S - B.r_at_infinity();
        const double U = S - B.r(S - A.r_at_infinity());
        const double m = 1e-9 * (std::fabs(L) + std::fabs(U) + std::fabs(S));
        lo = std::min(L, U) - m;
        hi = std::max(L, U) + m;
        if (!std::isfinite(lo) || !std::isfinite(hi)) return invalid_at(8, out, bad);
    }
    num::Root root{kNaN, false};
    if (!power) {
        // CARA: Newton's method on H with its derivative, H' = f_B'(y) y' - f_A'(x),
        // y' = f_A'(x) - 1 (both from the exponentials f already takes), started at the
        // risk-neutral Rubinstein share with factors alpha.  It needs a third of Brent's
        // evaluations; Brent remains the fallback.
        auto HD = [&](double x, double &dH) {
            double dA, dB;
            const double fA = A.f_exp(x, dA);
            const double fB = B.f_exp(S - x + fA, dB);
            dH = dB * (dA - 1.0) - dA;
            return fB - fA;
        };
        double x0 = S * (B.om / (A.om + A.alpha * B.om));
        if (!(x0 > lo && x0 < hi)) x0 = 0.5 * (lo + hi);
        root = num::newton_decreasing(HD, lo, hi, x0);
    }
    if (!root.converged) root = num::brent(H, lo, hi, H(lo), H(hi));
    if (!root.converged) return status_only(CTO_E_NO_CONVERGENCE, kNaN, out, bad);
    const double x = root.x;
    const double v = own_opens ? x : B.r(y_of(x));
    return finish(v, out, bad, 8);
}

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

// ---------------------------------------------------------------------------
// Two-period screening (Fudenberg & Tirole 1983 setting)
// ---------------------------------------------------------------------------
int screening_profit(double high_value, double low_value, double high_prob,
                     double seller_factor, double buyer_factor, double *out, int *bad) {
    Check c;
    c.positive(high_value, 0);
    c.positive(low_value, 1);
    c.unit(high_prob, 2);
    c.unit(seller_factor, 3);
    c.unit(buyer_factor, 4);
    if (c.ok() && low_value > high_value) c.fail(1);
    if (!c.ok()) return invalid(c, out, bad);
    const double vH = high_value, vL = low_value, q = high_prob;
    const double ds = seller_factor, db = buyer_factor;
    const double pool = vL;
    const double screen = q * ((1.0 - db) * vH + db * vL) + (1.0 - q) * ds * vL;
    double best = std::max(pool, screen);
    if (q * vH > vL) {  // skim: only when q exceeds v_L / v_H
        const double skim = ((q * vH - vL) + ds * (1.0 - q) * vL) * (vH / (vH - vL));
        best = std::max(best, skim);
    }
    return finish(best, out, bad, 0);
}

}  // namespace cto::core
