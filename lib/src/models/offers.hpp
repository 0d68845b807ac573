// Repeated offers to a side whose value is private: the offerer (a seller with a known
// cost, or in the mirror case a buyer with a known value) makes an offer each round; the
// responder, whose value (cost) is uniform on [private_low, private_high], accepts or
// waits.  Each function validates its inputs, writes every output on every path and
// returns a CTO_* status (see core.hpp).  The doc blocks below are written to be moved
// into the public header; docs/models/private-information.md has the derivations.
#ifndef CTO_MODELS_OFFERS_HPP
#define CTO_MODELS_OFFERS_HPP

#include <cstdint>

#include "../core.hpp"

namespace cto::core {

// Who makes the offers (proposed CTO_OFFERER_SELLER / CTO_OFFERER_BUYER, values pinned).
enum Offerer : int { kOffererSeller = 0, kOffererBuyer = 1 };

// How the path was found (proposed CTO_PATH_<NAME>, values pinned).
enum OfferRegime : int {
    kPathNone = 0,     // no type gains from agreement (no deal)
    kPathKnown = 1,    // the private value is a point: one offer, accepted
    kPathLinear = 2,   // no gap: linear stage functions (recursion or closed form)
    kPathGap = 3,      // gap: the exact piecewise-polynomial recursion
    kPathCoase = 4,    // no deadline, patient responder: price at cost at once, timing open
    kPathClosed = 5,   // gap, closed form: everyone is served in round 1
};

// One round of the path, t = 1, 2, ...  Money in the units of the inputs.
// One round of the path: the public struct itself (counteroffer.h), so that the caller's
// buffer is written without a copy:
//   offer                   the price offered in round t
//   cutoff                  K_t: the types that have agreed by the end of round t are those
//                           valued above K_t (seller offers) / costing below K_t (buyer offers)
//   round_probability       P(agreement in round t)
//   cumulative_probability  P(agreement by the end of round t)
using OfferRow = cto_offer_row;

// Totals of the path; complete whatever the row capacity.
struct OfferTotals {
    int regime;                    // OfferRegime
    int64_t rounds_used;           // rounds with positive probability; -1: never ends
    int64_t rows_written;          // min(rounds_used, capacity) (capacity when endless)
    int64_t stages;                // gap: stage functions built (audit); else 0
    int64_t pieces;                // gap: largest number of pieces of a stage; else 0
    double agreement_probability;  // P(agreement by the deadline), or ever
    double expected_round;         // E[round | agreement], 1 = the first offer accepted
    double offerer_value;          // offerer's expected present value at round 1, ex ante
    double responder_value;        // responder's expected present value, ex ante
    double opening_offer;          // the first offer
    double last_cutoff;            // the cutoff after the last round (K_T, or the limit)
};

/*! offer_path: repeated offers to a responder of unknown value, the perfect Bayesian
 *  equilibrium with skimming (higher values agree earlier): Sobel & Takahashi (1983) for
 *  the finite horizon, Stokey (1981), Fudenberg, Levine & Tirole (1985) and Gul,
 *  Sonnenschein & Wilson (1986) for no deadline, Fudenberg & Tirole (1991) ch. 10 (all
 *  from memory); the general-interval forms, the gap algorithm and the mirror case are
 *  derived in docs/models/private-information.md s.2.
 *  offerer = seller: a seller of cost c = known_value offers p_1, p_2, ... to a buyer of
 *  value v ~ U[lo, hi]; agreement in round t pays the seller d_s^(t-1)(p_t - c) and the
 *  buyer d_b^(t-1)(v - p_t).  offerer = buyer: a buyer of value u = known_value offers to
 *  a seller of cost c ~ U[lo, hi] (procurement); the same game with money reversed.
 *  Without a gap (c >= lo; buyer offers: u <= hi), with H = hi - c (u - lo) and L = hi - lo:
 *      l_1 = m_1 = 1/2;  g_n = 1 - d_b + d_b l_(n-1),  m_n = g_n/(2 g_n - d_s l_(n-1)),
 *      l_n = g_n m_n;  round t (n = T - t + 1 rounds left): price c + l_n H_(t-1),
 *      H_t = m_n H_(t-1), cutoff c + H_t  (buyer offers: u - l_n H_(t-1), u - H_t);
 *  no deadline: m = 1/(1 + sqrt(1 - d_s)), l = (1 - d_b) m/(1 - d_b m), price
 *  c + l m^(t-1) H, E[round | agreement] = 1/(1 - m), offerer value l H^2/(2L).
 *  With a gap (c < lo) the stage functions are piecewise polynomial and are built exactly.
 *  Arguments: private_low <= private_high (money), offerer_factor, responder_factor per
 *  round in [0, 1], rounds >= 0 (0: no deadline), known_value (money), offerer 0 seller /
 *  1 buyer; rows: the caller's buffer of `capacity` rows (may be NULL with capacity 0).
 *  Status: CTO_OK -> totals and min(rounds_used, capacity) rows;
 *          CTO_E_NO_DEAL (no type gains: hi <= c; buyer offers: lo >= u) -> probabilities
 *          and values 0, rounds 0, the rest NaN;
 *          CTO_E_INDETERMINATE (no deadline, no gap, responder_factor = 1: the offer
 *          falls to the known value at once and the timing is open) -> offerer value 0,
 *          responder value E[gain], agreement probability and opening offer (the known
 *          value), the rest NaN, no rows;
 *          CTO_E_NO_CONVERGENCE (gap only: more than 20,000 stages, a stage of more than
 *          160 pieces, or a path needing a stage dropped from the fixed work space; met
 *          with a very patient offerer and a small gap) -> every total NaN;
 *          CTO_E_INVALID (NaN or infinite money, private_low > private_high (index 1),
 *          factor outside [0, 1], rounds < 0, offerer not 0 or 1, offerer_factor = 1 with
 *          no deadline (index 2: the price never falls in finite time), spreads that
 *          overflow) -> every field NaN.
 *  Accuracy: no gap: relative error <= 1e-14 against 50-digit backward induction
 *  (tests/reference/private; worst measured 3.7e-16), the late rows of a long deadline
 *  lose about one ulp a round; gap: the 15-digit check values of the gap case in
 *  tests/cpp/test_offers_gap.cpp to 5e-15.  Cost: no deadline O(1); deadline, no gap O(rounds) at about 17 ns a round
 *  (34 with rows), O(1) memory; gap: microseconds to milliseconds (stages x pieces^2).
 *  No allocation; the gap case uses about 220 KB of stack.
 *  Proposed C layouts (fields only ever appended; the row stride is rows[0].size, so a
 *  caller built against an older header gets only the fields it knows):
 *      typedef struct cto_offer_row { size_t size; double offer, cutoff,
 *          round_probability, cumulative_probability; } cto_offer_row;
 *      typedef struct cto_offer_outcome { size_t size; int regime; int reserved;
 *          int64_t rounds_used, rows_written, stages, pieces;
 *          double agreement_probability, expected_round, offerer_value, responder_value,
 *                 opening_offer, last_cutoff; } cto_offer_outcome; */
int offer_path(double private_low, double private_high, double offerer_factor,
               double responder_factor, int64_t rounds, double known_value, int offerer,
               OfferRow *rows, int64_t capacity, OfferTotals *out, int *bad);

/*! agreement_probability, expected_agreement_round, opening_offer: the totals of
 *  offer_path as scalars (same arguments, same statuses; NaN except where the status
 *  table of offer_path gives a value: agreement_probability writes 0 with CTO_E_NO_DEAL;
 *  with CTO_E_INDETERMINATE every scalar is NaN).  O(1) without a deadline, O(rounds)
 *  with one. */
int agreement_probability(double private_low, double private_high, double offerer_factor,
                          double responder_factor, int64_t rounds, double known_value,
                          int offerer, double *out, int *bad);
int expected_agreement_round(double private_low, double private_high, double offerer_factor,
                             double responder_factor, int64_t rounds, double known_value,
                             int offerer, double *out, int *bad);
int opening_offer(double private_low, double private_high, double offerer_factor,
                  double responder_factor, int64_t rounds, double known_value, int offerer,
                  double *out, int *bad);

namespace offers_detail {

// The canonical problem: a seller of cost 0 facing values uniform on [a_lo, h] (shifted
// units, h > 0, a_lo = lo - c may be negative: types below 0 never buy), L = h - a_lo.
struct Canon {
    double a;     // max(a_lo, 0): the gap (0: no gap)
    double h;     // H, the highest value
    double len;   // L
    double ds, db;
    int64_t rounds;  // 0: no deadline
};

// The gap case (a > 0): offers, cutoffs, the opening offer and the last cutoff measured
// above the gap (gain - a: the money value is private_low + x for seller offers,
// private_high - x for buyer offers); values in gain units.  Returns a CTO_* status.
int gap_path(const Canon &p, OfferRow *rows, int64_t capacity, OfferTotals *out);

}  // namespace offers_detail

}  // namespace cto::core

#endif  // CTO_MODELS_OFFERS_HPP
