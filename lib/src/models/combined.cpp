// The combined model (solve) and the special cases that run through its solver:
// breakdown risk, walk-away (outside) options and status-quo (inside) options.
// Formulas, sources and status tables are documented in the public header; the comments
// here explain the numerical choices.
#include <algorithm>
#include <cmath>

#include "combined.hpp"

namespace cto::core {

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

}  // namespace cto::core
