// The combined model (solve) and the special cases that run through its solver:
// breakdown risk, walk-away (outside) options and status-quo (inside) options.
// Formulas, sources and status tables are documented in the public header; the comments
// here explain the numerical choices.
#include <algorithm>
#include <cfloat>
#include <cmath>

#include "combined.hpp"
#include "combined_game.hpp"

namespace cto::core {

// ---------------------------------------------------------------------------
// The combined model: breakdown risk, inside options, outside options
// ---------------------------------------------------------------------------
namespace {

enum { kOverflow = -1 };

// Each side's per-round factor d and 1 - d (formed without cancellation by the caller).
struct Factors {
    double own_d, own_om, oth_d, oth_om;
};

// One side of the game (combined_game.hpp) from its inputs.  With a = (1-p) d, 1 - a is
// formed as p + (1-p)(1-d), a sum of non-negative terms.  The value of perpetual
// disagreement d0 = (p b + (1-p)(1-d) g) / (1 - a) is a weighted mean of the fallback and
// the status quo (exactly g when p = 0, b when p = 1, g when 1 - a = 0).
game::Side make_side(double d, double omd, double p, double b, double g, double w) {
    game::Side s;
    const double q1 = 1.0 - p;
    s.a = q1 * d;
    s.om = p + q1 * omd;
    s.d0 = s.om == 0.0 ? g : (p / s.om) * b + (q1 * omd / s.om) * g;
    s.has = w != -kInf;
    s.w = w;
    s.n = s.has ? w : s.d0;
    return s;
}

// Payoffs when no agreement can be signed (the no-deal fields of a rational deal): the
// same game with every offer unacceptable.  A responder walks away when its walk-away
// value is at least its value of rejecting; the state values of the four combinations
// (walk or reject in each state) are known in closed form, and the one they confirm is
// kept (perpetual disagreement first).  Writes the payoffs of the game own (A) opens or
// other (B) opens.
void no_agreement(const game::Side &A, const game::Side &B, bool own_a, double *nd_own,
                  double *nd_oth) {
    double XA = A.d0, TB = B.d0, ZA = A.d0, YB = B.d0;  // nobody walks
    const bool stay = (!A.has || A.w < A.d0) && (!B.has || B.w < B.d0);
    const bool b_walks_back = B.has && B.w >= B.cont(B.n);  // given A walks when B proposes
    const bool a_walks_back = A.has && A.w >= A.cont(A.n);  // given B walks when A proposes
    if (!stay) {
        if (b_walks_back && a_walks_back) {
            XA = A.n, TB = B.w, ZA = A.w, YB = B.n;
        } else if (B.has && !a_walks_back && B.w >= B.cont(B.cont(B.w))) {
            XA = A.n, TB = B.w, ZA = A.cont(A.n), YB = B.cont(B.w);  // only B walks
        } else if (A.has && !b_walks_back && A.w >= A.cont(A.cont(A.w))) {
            ZA = A.w, YB = B.n, XA = A.cont(A.w), TB = B.cont(B.n);  // only A walks
        }
    }
    *nd_own = own_a ? XA : ZA;
    *nd_oth = own_a ? TB : YB;
}

// Each side's loss if the first offer is refused and play goes on from the next round,
// and own's payoff opening minus responding.  A responder whose option does not bind
// gets exactly its value of rejecting (loss 0); in Rubinstein's loop the opener's loss
// x (1 - a^2) and the advantage x (1 - a) are formed from the share x above d0.
void set_losses(const game::Side &A, const game::Side &B, const game::Stationary &v,
                bool own_a, SolveOut *o) {
    double lossA = own_a ? v.XA - A.cont(v.ZA) : v.ZA - A.cont(v.XA);
    double lossB = own_a ? v.TB - B.cont(v.YB) : v.YB - B.cont(v.TB);
    o->opening_advantage = v.XA - v.ZA;
    if (own_a && !game::binds(v.ka)) lossB = 0.0;
    if (!own_a && !game::binds(v.kb)) lossA = 0.0;
    if (v.ka == game::kAgreeFree && v.kb == game::kAgreeFree) {
        const double xA = v.XA - A.d0;  // share above d0 (the closed form's product)
        const double yB = v.YB - B.d0;
        if (own_a) lossA = xA * (A.om * (1.0 + A.a));
        else lossB = yB * (B.om * (1.0 + B.a));
        o->opening_advantage = xA * A.om;
    }
    o->own_delay_loss = lossA;
    o->other_delay_loss = lossB;
}

// Money amounts beyond this are refused as too large to compute (kOverflow, reported as
// an invalid surplus): the game's values add and subtract up to a handful of them, and
// with every amount below DBL_MAX / 64 no sum or difference of the solver overflows.
constexpr double kMoneyMax = DBL_MAX / 64;

bool too_large(const SolveIn &in) {
    const double amounts[] = {in.surplus,    in.own_fallback, in.other_fallback,
                              in.own_inside, in.other_inside, in.own_outside,
                              in.other_outside};
    for (double x : amounts)
        if (std::isfinite(x) && std::fabs(x) > kMoneyMax) return true;  // -inf: absent
    return false;
}

// Solves with own called A.  Inputs are already validated.  Returns a CTO_* status or
// kOverflow (finite inputs whose combination overflows).
int solve_core(const SolveIn &in, const Factors &f, SolveOut *o) {
    if (too_large(in)) return kOverflow;
    const game::Side A = make_side(f.own_d, f.own_om, in.p, in.own_fallback, in.own_inside,
                                   in.own_outside);
    const game::Side B = make_side(f.oth_d, f.oth_om, in.p, in.other_fallback,
                                   in.other_inside, in.other_outside);
    const double S = in.surplus;
    if (!std::isfinite(A.d0) || !std::isfinite(B.d0) || !std::isfinite((S - A.d0) - B.d0) ||
        (A.has && !std::isfinite(A.w - A.d0)) || (B.has && !std::isfinite(B.w - B.d0)))
        return kOverflow;
    const game::Stationary v = game::solve_stationary(A, B, S);
    o->boundary = v.boundary;
    o->delayed = false;
    if (v.indeterminate) {
        o->own_share = o->other_share = kNaN;
        o->own_no_deal = o->other_no_deal = kNaN;
        o->own_delay_loss = o->other_delay_loss = o->opening_advantage = kNaN;
        o->binding = CTO_BINDS_NONE;
        o->rational = true;
        return CTO_E_INDETERMINATE;
    }
    // The game own opens is played from state A, the one other opens from state B.
    const bool own_a = in.own_opens;
    const game::Kind k0 = own_a ? v.ka : v.kb, k1 = own_a ? v.kb : v.ka;
    o->rational = game::agrees(k0) || (k0 == game::kReject && game::agrees(k1));
    o->delayed = o->rational && !game::agrees(k0);
    o->own_share = own_a ? v.XA : v.ZA;
    o->other_share = own_a ? v.TB : v.YB;
    set_losses(A, B, v, own_a, o);
    if (!std::isfinite(o->own_share) || !std::isfinite(o->other_share)) return kOverflow;
    if (!o->rational) {
        o->own_no_deal = o->own_share;
        o->other_no_deal = o->other_share;
        o->binding = CTO_BINDS_NONE;
        return CTO_E_NO_DEAL;
    }
    no_agreement(A, B, own_a, &o->own_no_deal, &o->other_no_deal);
    const bool own_binds = game::binds(v.kb), oth_binds = game::binds(v.ka);
    o->binding = own_binds ? (oth_binds ? CTO_BINDS_BOTH : CTO_BINDS_OWN)
                           : (oth_binds ? CTO_BINDS_OTHER : CTO_BINDS_NONE);
    return CTO_OK;
}

void nan_outcome(SolveOut *o) {
    o->own_share = o->other_share = o->own_no_deal = o->other_no_deal = kNaN;
    o->own_delay_loss = o->other_delay_loss = o->opening_advantage = kNaN;
    o->binding = CTO_BINDS_NONE;
    o->boundary = false;
    o->rational = false;
    o->delayed = false;
}

// 1 - d for a factor given as a double: exact for d >= 1/2 (Sterbenz), one rounding below.
Factors plain_factors(double own_d, double oth_d) {
    return Factors{own_d, 1.0 - own_d, oth_d, 1.0 - oth_d};
}

// Runs solve_core for a special-case function; `surplus_index` is blamed on overflow.
int solve_own(const SolveIn &in, int surplus_index, double *out, int *bad) {
    SolveOut o;
    const int st = solve_core(in, plain_factors(in.own_factor, in.other_factor), &o);
    if (st == kOverflow) return invalid_at(surplus_index, out, bad);
    return status_only(st, o.own_share, out, bad);
}

// The validated model: solve_core, with overflow reported as an invalid surplus.
int solve_checked(const SolveIn &in, const Factors &f, int surplus_index, SolveOut *out,
                  int *bad) {
    const int st = solve_core(in, f, out);
    if (st == kOverflow) {
        nan_outcome(out);
        if (bad) *bad = surplus_index;
        return CTO_E_INVALID;
    }
    if (bad) *bad = -1;
    return st;
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
    if (!c.ok()) {
        if (bad) *bad = c.bad;
        nan_outcome(out);
        return CTO_E_INVALID;
    }
    return solve_checked(in, plain_factors(in.own_factor, in.other_factor), 9, out, bad);
}

int solve_rates(const SolveRatesIn &in, SolveOut *out, int *bad) {
    Check c;
    c.nonneg(in.own_rate, 0);
    c.nonneg(in.other_rate, 1);
    c.nonneg(in.days, 2);
    c.unit(in.p, 3);
    c.real(in.own_fallback, 4);
    c.real(in.other_fallback, 5);
    c.real(in.own_inside, 6);
    c.real(in.other_inside, 7);
    c.optional(in.own_outside, 8);
    c.optional(in.other_outside, 9);
    c.real(in.surplus, 10);
    c.positive(in.basis, 12);
    if (!c.ok()) {
        if (bad) *bad = c.bad;
        nan_outcome(out);
        return CTO_E_INVALID;
    }
    // d = exp(-rho) and 1 - d = -expm1(-rho): full relative accuracy of 1 - d however
    // close the factor is to 1 (share_from_rates does the same).
    const double rho_own = log_discount(in.own_rate, in.days, in.basis, in.continuous);
    const double rho_oth = log_discount(in.other_rate, in.days, in.basis, in.continuous);
    const Factors f{std::exp(-rho_own), -std::expm1(-rho_own), std::exp(-rho_oth),
                    -std::expm1(-rho_oth)};
    const SolveIn si{f.own_d,          f.oth_d,        in.p,           in.own_fallback,
                     in.other_fallback, in.own_inside, in.other_inside, in.own_outside,
                     in.other_outside,  in.surplus,    in.own_opens};
    return solve_checked(si, f, 10, out, bad);
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
