// The stationary equilibrium of the combined model's game: the sixteen combinations of
// the two states' outcomes, each one's values in closed form, and the check that the
// values confirm the choices (docs/models/combined.md, "Solving the game").
#include "combined_game.hpp"

#include <cmath>

#include "../core.hpp"

namespace cto::core::game {
namespace {

// S >= x + y exactly (TwoSum, see exceeds in core.hpp).
bool at_least(double S, double x, double y) { return !exceeds(-S, -x, -y); }

// The four values of a combination, from the rules of the game: a responder gets its
// walk-away value where it binds and its value of rejecting otherwise; a proposer gets
// the surplus less the responder's value (agree), what it gets when the other walks
// away (walk), or its own value of rejecting (reject).  Two proposers who both agree
// freely form Rubinstein's loop, solved in closed form; a proposer who rejects while its
// own option does not bind (and a responder who then rejects) keeps its value of
// perpetual disagreement.  Returns false when the combination has no determinate values
// (both factors 1 in Rubinstein's loop).
bool values(const Side &A, const Side &B, double S, Kind ka, Kind kb, Stationary *v) {
    v->ka = ka;
    v->kb = kb;
    const bool bA = binds(ka), bB = binds(kb);  // B's option when A proposes; A's when B does
    if (ka == kAgreeFree && kb == kAgreeFree) {
        // 1 - a_A a_B without cancellation, formed with the proposer first as share()
        // forms it, so that the special cases agree with share() bit for bit.
        const double denA = rub_den(A.a, A.om, B.om), denB = rub_den(B.a, B.om, A.om);
        if (denA == 0.0 || denB == 0.0) return false;
        const double Sp = (S - A.d0) - B.d0;  // the surplus above perpetual disagreement
        v->XA = A.d0 + Sp * (B.om / denA);
        v->TB = B.d0 + Sp * (B.a * A.om / denA);
        v->YB = B.d0 + Sp * (A.om / denB);
        v->ZA = A.d0 + Sp * (A.a * B.om / denB);
        return true;
    }
    bool kX = false, kT = false, kZ = false, kY = false;  // known
    if (ka == kReject && !bB) v->XA = v->ZA = A.d0, kX = kZ = true;
    if (kb == kReject && !bA) v->YB = v->TB = B.d0, kY = kT = true;
    if (bA) v->TB = B.w, kT = true;
    if (bB) v->ZA = A.w, kZ = true;
    if (ka == kWalk) v->XA = A.n, kX = true;
    if (kb == kWalk) v->YB = B.n, kY = true;
    // A proposer agreeing freely against a bound counter-proposal: one rounding per term.
    if (ka == kAgreeFree && kb == kAgreeBound) v->XA = B.om * (S - B.d0) + B.a * A.w, kX = true;
    if (kb == kAgreeFree && ka == kAgreeBound) v->YB = A.om * (S - A.d0) + A.a * B.w, kY = true;
    for (int pass = 0; pass < 4; ++pass) {
        if (!kT && kY) v->TB = B.cont(v->YB), kT = true;
        if (!kZ && kX) v->ZA = A.cont(v->XA), kZ = true;
        if (!kX && agrees(ka) && kT) v->XA = S - v->TB, kX = true;
        if (!kX && ka == kReject && kZ) v->XA = A.cont(v->ZA), kX = true;
        if (!kY && agrees(kb) && kZ) v->YB = S - v->ZA, kY = true;
        if (!kY && kb == kReject && kT) v->YB = B.cont(v->TB), kY = true;
    }
    return kX && kT && kZ && kY;
}

// How far the values are from confirming the choices (0: they confirm them exactly;
// ties go to agreeing and to walking away, the conventions of the game).
double violation(const Side &A, const Side &B, double S, const Stationary &v, bool *exact) {
    double viol = 0.0;
    bool ok = true;
    auto need = [&](bool holds, double margin) {  // margin >= 0 where it holds
        if (!holds) ok = false;
        if (!holds) viol += std::fabs(margin);
    };
    // State A proposes: B's rejection value, whether B's option binds, A's alternatives.
    const double rB = B.cont(v.YB), rA = A.cont(v.ZA);
    const bool bindA = B.has && B.w >= rB;
    need(bindA == binds(v.ka), B.w - rB);
    if (v.ka == kAgreeFree || v.ka == kReject) {
        // Where A's own option does not bind when B proposes, its value of rejecting
        // loops back through c_A twice: agreeing beats rejecting iff S - T_B >= d0_A (for
        // a_A < 1), a comparison not shrunk by the factor 1 - a_A^2.
        const bool loop = !binds(v.kb) && A.a < 1.0;
        const bool agree = loop ? at_least(S, v.TB, A.d0) : S - v.TB >= rA;
        need(agree == (v.ka == kAgreeFree), loop ? (S - v.TB) - A.d0 : (S - v.TB) - rA);
    } else {
        const bool agree = at_least(S, B.w, A.n);
        need(agree == (v.ka == kAgreeBound), (S - B.w) - A.n);
    }
    const double sA = A.cont(v.XA), sB = B.cont(v.TB);
    const bool bindB = A.has && A.w >= sA;
    need(bindB == binds(v.kb), A.w - sA);
    if (v.kb == kAgreeFree || v.kb == kReject) {
        const bool loop = !binds(v.ka) && B.a < 1.0;  // as for A above
        const bool agree = loop ? at_least(S, v.ZA, B.d0) : S - v.ZA >= sB;
        need(agree == (v.kb == kAgreeFree), loop ? (S - v.ZA) - B.d0 : (S - v.ZA) - sB);
    } else {
        const bool agree = at_least(S, A.w, B.n);
        need(agree == (v.kb == kAgreeBound), (S - A.w) - B.n);
    }
    *exact = ok;
    return viol;
}

bool possible(const Side &A, const Side &B, Kind ka, Kind kb) {
    return (B.has || !binds(ka)) && (A.has || !binds(kb));
}

bool near(double a, double b, double tol) { return std::fabs(a - b) <= tol; }

}  // namespace

Stationary solve_stationary(const Side &A, const Side &B, double S) {
    Stationary best{};
    best.indeterminate = false;
    // Perpetual disagreement first: nobody gains by walking away (each walk-away value
    // below its value of waiting) and the surplus does not exceed the two values of
    // waiting.  With a factor of 1 other combinations can tie with it; this one is the
    // limit of the finite games (docs/models/combined.md).
    if ((!A.has || A.w < A.d0) && (!B.has || B.w < B.d0) && !exceeds(S, A.d0, B.d0)) {
        values(A, B, S, kReject, kReject, &best);
    } else {
        static constexpr Kind kOrder[4] = {kAgreeFree, kAgreeBound, kWalk, kReject};
        double least = kInf;
        bool found = false;
        for (Kind ka : kOrder) {
            for (Kind kb : kOrder) {
                Stationary v{};
                if (!possible(A, B, ka, kb) || !values(A, B, S, ka, kb, &v)) continue;
                bool exact = false;
                const double viol = violation(A, B, S, v, &exact);
                if (exact && !found) {
                    best = v;
                    found = true;
                } else if (!found && viol < least) {
                    least = viol;
                    best = v;
                }
            }
        }
        // Both factors 1 (p = 0): waiting costs nothing, so wherever an agreement is
        // reached any split the walk-away options allow is an equilibrium; only an
        // outcome without agreement in either state is determinate.
        if (A.a == 1.0 && B.a == 1.0 && (!found || agrees(best.ka) || agrees(best.kb)))
            best.indeterminate = true;
    }
    const double tol = 1e-12 * std::fabs(S);
    best.boundary = (B.has && near(B.w, B.cont(best.YB), tol)) ||
                    (A.has && near(A.w, A.cont(best.XA), tol));
    return best;
}

}  // namespace cto::core::game
