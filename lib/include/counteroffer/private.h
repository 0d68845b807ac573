/*
 * counteroffer/private.h -- private information: two-sided private values (the k-double auction) and repeated offers to a side of unknown value.
 * A part of the public interface: include counteroffer/counteroffer.h, which includes
 * every part inside its extern "C" block.
 */
#ifndef COUNTEROFFER_PRIVATE_H
#define COUNTEROFFER_PRIVATE_H

#ifndef COUNTEROFFER_COUNTEROFFER_H
#error "include counteroffer/counteroffer.h, not its parts"
#endif

/* =========================================================================
 * Private information: two-sided private values
 * ========================================================================= */

/* Regimes of cto_double_auction (pinned; only ever appended). */
#define CTO_TRADE_NONE 0        /* buyer_high <= seller_low: no gains from trade      */
#define CTO_TRADE_ONE_PRICE 1   /* only one-price equilibria                           */
#define CTO_TRADE_TRIANGLE 2    /* linear equilibrium, no clamp binds                  */
#define CTO_TRADE_CLAMPED 3     /* linear equilibrium with clamped asks and/or bids     */
#define CTO_TRADE_POSTED_ASK 4  /* the seller's cost is known: a posted ask           */
#define CTO_TRADE_POSTED_BID 5  /* the buyer's value is known: a posted bid           */
/* Flags of cto_double_auction, or-ed together. */
#define CTO_TRADE_FLAG_ONE_PRICE_EXISTS 1   /* efficient one-price equilibria exist    */
#define CTO_TRADE_FLAG_CONVENTION 2         /* expected_price is a convention's value  */
#define CTO_TRADE_FLAG_NEAR_BOUNDARY 4      /* within 1e-9 D of a regime boundary      */
#define CTO_TRADE_FLAG_FIRST_BEST_FEASIBLE 8 /* some mechanism attains the first best  */

/*! Outcome of cto_double_auction.  Set size = sizeof(cto_trade_outcome) before the call;
 *  fields are only ever appended.  Money in the units of the inputs. */
typedef struct cto_trade_outcome {
    size_t size;
    int regime;                      /* CTO_TRADE_*                                   */
    int flags;                       /* CTO_TRADE_FLAG_* bits                         */
    double trade_probability;        /* P(trade)                                      */
    double expected_price;           /* E[price | trade]; NaN without trade           */
    double buyer_gain;               /* E[(v - p) 1{trade}], ex ante                  */
    double seller_gain;              /* E[(p - c) 1{trade}], ex ante                  */
    double total_gain;               /* buyer_gain + seller_gain                      */
    double first_best_gain;          /* E[(v - c)+]                                   */
    double first_best_probability;   /* P(v >= c)                                     */
    double second_best_gain;         /* Myerson-Satterthwaite bound on any mechanism  */
    double second_best_threshold;    /* g*: trade iff v - c >= g* in the best rule    */
    double second_best_probability;  /* P(v - c >= g*)                                */
    double efficiency;               /* total_gain / first_best_gain                  */
    double second_best_efficiency;   /* second_best_gain / first_best_gain            */
    double price_low, price_high;    /* one-price interval [s_hi, b_lo], else NaN     */
    double ask_floor;                /* the lowest ask (clamp); NaN if not linear     */
    double bid_ceiling;              /* the highest bid (clamp); NaN if not linear    */
} cto_trade_outcome;

/*! cto_double_auction: the linear equilibrium of the k-double auction with uniform private
 *  values (Chatterjee & Samuelson 1983; Gibbons 1992 s.3.2.C), generalised to any two
 *  intervals with clamped strategies, its trade probability, expected price and gains,
 *  against the first best and the Myerson-Satterthwaite (1983, Theorem 1 and Corollary 1)
 *  second best.
 *  The seller's cost c ~ U[s_lo, s_hi] and the buyer's value v ~ U[b_lo, b_hi] are
 *  private and independent.  Both name a price at once (ask a, bid b); they trade iff
 *  b >= a at p = k b + (1 - k) a.  With D = b_hi - s_lo,
 *      A_lo = s_lo + (1 - k) D/2,   B_hi = s_lo + (2 - k) D/2,
 *      ask a(c) = max(B_lo, (c + (1 - k) B_hi)/(2 - k)),
 *      bid b(v) = min(A_hi, (v + k A_lo)/(1 + k)),
 *  B_lo = the unclamped bid of b_lo, A_hi = the unclamped ask of s_hi.  Trade happens
 *  iff v - A_lo >= (1 + k)/(2 - k) (c - s_lo); for [0,1]^2 and k = 1/2 iff v >= c + 1/4.
 *  The expectations are exact integrals of affine functions over the clipped trade
 *  polygons (no quadrature).  When B_lo > A_hi only one-price equilibria remain: every
 *  type names one p0 in [s_hi, b_lo]; trade is certain and efficient and the point value
 *  p0 = k s_hi + (1 - k) b_lo is a convention (flag).  A known cost (s_lo = s_hi) gives
 *  a posted ask A* = s + (1 - k)(b_hi - s)/2, a known value a posted bid
 *  B* = u - k (u - s_lo)/2 (the limits of the linear equilibrium).
 *  Second best: trade iff v - c >= g*, g* the root in (0, D/2) of
 *  E[(2(v - c) - D) 1{v - c >= g}] = 0 (uniform virtual values); g* = 0 and the second
 *  best equals the first best when s_hi <= b_lo or one interval is a point.
 *  Arguments (catalogue order): seller_low s_lo <= seller_high s_hi, buyer_low b_lo <=
 *  buyer_high b_hi (money, finite); k in [0, 1], the weight of the bid in the price
 *  (k = 1/2 splits the difference).
 *  Status: CTO_OK -> every field (expected_price NaN only if P(trade) underflows);
 *          CTO_E_NO_DEAL (b_hi <= s_lo: no gains) -> regime none, probabilities and gains
 *          0, prices, ratios and g* NaN;
 *          CTO_E_INVALID (NaN or infinite argument, a low above its high (index of the
 *          high), k outside [0, 1], spreads that overflow) -> every field NaN.
 *  Accuracy: relative error <= 1e-14 against 50-digit quadrature of the strategies
 *  (tests/reference/private), absolute 1e-14 x D for gains near zero; g* to about
 *  1e-15 x D / (density of v - c at g*).
 *  Added in 1.1. */
CTO_API int cto_double_auction(double seller_low, double seller_high, double buyer_low,
                               double buyer_high, double k, cto_trade_outcome *out);

/*! cto_trade_probability: P(trade) of cto_double_auction (same arguments and statuses;
 *  0 with CTO_E_NO_DEAL, NaN with CTO_E_INVALID), as a scalar function.  Added in 1.1. */
CTO_API int cto_trade_probability(double seller_low, double seller_high, double buyer_low,
                                  double buyer_high, double k, double *out);

/* =========================================================================
 * Private information: repeated offers to a side of unknown value
 * ========================================================================= */

#define CTO_OFFERER_SELLER 0  /* we sell to a buyer of unknown value                   */
#define CTO_OFFERER_BUYER 1   /* we buy from a seller of unknown cost (procurement)     */

/*! Totals of cto_offer_path.  Set size = sizeof(cto_offer_outcome) before the call;
 *  fields are only ever appended. */
typedef struct cto_offer_outcome {
    size_t size;
    int regime;                    /* 0 no deal, 1 known value, 2 no gap, 3 gap,
                                      4 immediate with open timing, 5 closed form       */
    int reserved;
    int64_t rounds_used;           /* rounds with a positive chance; -1: never ends    */
    int64_t rows_written;          /* rows written by cto_offer_path_rows               */
    int64_t stages, pieces;        /* gap case: stage functions and most pieces of one  */
    double agreement_probability;  /* by the deadline, or ever                          */
    double expected_round;         /* E[round | agreement]; 1 = the first offer         */
    double offerer_value;          /* the offerer's expected present value, ex ante     */
    double responder_value;        /* the responder's expected present value, ex ante   */
    double opening_offer;          /* the first offer                                   */
    double last_cutoff;            /* the cutoff type after the last round              */
} cto_offer_outcome;

/*! One round of cto_offer_path_rows. */
typedef struct cto_offer_row {
    double offer;                  /* the price offered in this round                   */
    double cutoff;                 /* types beyond it (in the responder's favour) have
                                      agreed by the end of the round                    */
    double round_probability;      /* P(agreement in this round)                        */
    double cumulative_probability; /* P(agreement by the end of this round)             */
} cto_offer_row;

/*! cto_offer_path: repeated offers to a responder of unknown value, the perfect Bayesian
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
 *  rounds is at most 10,000,000 (the deadline costs O(rounds)); more is CTO_E_INVALID.
 *  cto_offer_path gives the totals; cto_offer_path_rows also the rows per round.
 *  Added in 1.1. */
CTO_API int cto_offer_path(double private_low, double private_high, double offerer_factor,
                           double responder_factor, int64_t rounds, double known_value,
                           int offerer, cto_offer_outcome *out);

/*! cto_offer_path_rows: cto_offer_path with the rows per round written into rows[0 ..
 *  capacity) (out->rows_written of them; rows may be NULL with capacity 0).  The totals
 *  are always complete.  Added in 1.1. */
CTO_API int cto_offer_path_rows(double private_low, double private_high,
                                double offerer_factor, double responder_factor,
                                int64_t rounds, double known_value, int offerer,
                                cto_offer_row *rows, int64_t capacity, cto_offer_outcome *out);

/*! cto_agreement_probability, cto_expected_agreement_round, cto_opening_offer: totals of
 *  cto_offer_path as scalar functions (same arguments and statuses; NaN where the
 *  total has no value).  Added in 1.1. */
CTO_API int cto_agreement_probability(double private_low, double private_high,
                                      double offerer_factor, double responder_factor,
                                      int64_t rounds, double known_value, int offerer,
                                      double *out);
CTO_API int cto_expected_agreement_round(double private_low, double private_high,
                                         double offerer_factor, double responder_factor,
                                         int64_t rounds, double known_value, int offerer,
                                         double *out);
CTO_API int cto_opening_offer(double private_low, double private_high, double offerer_factor,
                              double responder_factor, int64_t rounds, double known_value,
                              int offerer, double *out);


#endif /* COUNTEROFFER_PRIVATE_H */
