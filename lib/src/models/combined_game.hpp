// The stationary equilibrium of the combined model's game (docs/models/combined.md):
// alternating offers in which, after each rejection, talks break down with chance p
// (fallbacks b), otherwise each side collects a round of status-quo income and the
// rejecter proposes next; a responder may accept, reject, or walk away (if it has a
// walk-away option).  The game has two states, "A proposes" and "B proposes"; in each
// the proposer either makes the cheapest acceptable offer (agree) or an unacceptable one,
// which the responder answers by walking away or rejecting.  The equilibrium is found by
// trying the sixteen combinations of the two states' outcomes and keeping the one whose
// values confirm it.  Internal to the combined model; no validation here.
#ifndef CTO_MODELS_COMBINED_GAME_HPP
#define CTO_MODELS_COMBINED_GAME_HPP

namespace cto::core::game {

// One side, in money: d0 its value of perpetual disagreement (status-quo income until a
// breakdown, then its fallback), om = 1 - a and a = (1-p) d its chance-weighted factor,
// w its walk-away value (-inf when absent), n what it gets when the other walks away
// (w when present, else d0).
struct Side {
    double d0, om, a, w, n;
    bool has;  // has a walk-away option
    // Value now of a rejection followed by value v next round: p b + (1-p)((1-d) g + d v).
    double cont(double v) const { return om * d0 + a * v; }
};

// What the proposer of a state does.
enum Kind {
    kAgreeFree,   // acceptable offer; the responder's walk-away option does not bind
    kAgreeBound,  // acceptable offer worth exactly the responder's walk-away value
    kWalk,        // unacceptable offer; the responder walks away
    kReject       // unacceptable offer; the responder rejects (a round of delay)
};

inline bool agrees(Kind k) { return k == kAgreeFree || k == kAgreeBound; }
// The responder's walk-away option binds (it walks, or is offered exactly its value).
inline bool binds(Kind k) { return k == kAgreeBound || k == kWalk; }

// The two states' outcomes and the four values, in money:
//   XA  A's value when A proposes,  TB  B's value when A proposes,
//   ZA  A's value when B proposes,  YB  B's value when B proposes.
// (XA, TB) are the payoffs of the game A opens, (ZA, YB) of the game B opens.
struct Stationary {
    Kind ka, kb;  // A's choice when A proposes, B's when B proposes
    double XA, TB, ZA, YB;
    bool indeterminate;  // p = 0 and both factors 1 with no pattern pinned down
    bool boundary;       // a walk-away value within 1e-12 x scale of binding
};

// The equilibrium for A and B (A is either side) and surplus S.  Inputs are finite
// except w = -inf (absent); a.a = b.a = 1 gives indeterminate unless an outcome is
// pinned down by the walk-away options or no deal.
Stationary solve_stationary(const Side &A, const Side &B, double S);

}  // namespace cto::core::game

#endif  // CTO_MODELS_COMBINED_GAME_HPP
