// Two-sided private values: the k-double auction with uniform types, its linear
// equilibrium, the first best and the Myerson-Satterthwaite second best.
// Each function validates its inputs, writes every output on every path and returns a
// CTO_* status (see core.hpp).  The doc blocks below are written to be moved into the
// public header; docs/models/private-information.md has the derivations.
#ifndef CTO_MODELS_TRADE_HPP
#define CTO_MODELS_TRADE_HPP

#include <cstdint>

#include "../core.hpp"

namespace cto::core {

// Regimes of double_auction (proposed public names CTO_TRADE_<NAME>, values pinned).
enum TradeRegime : int {
    kTradeNone = 0,       // CTO_TRADE_NONE: b_hi <= s_lo, no gains exist
    kTradeOnePrice = 1,   // CTO_TRADE_ONE_PRICE: only one-price equilibria (B_lo > A_hi)
    kTradeTriangle = 2,   // CTO_TRADE_TRIANGLE: Chatterjee-Samuelson, no clamp binds
    kTradeClamped = 3,    // CTO_TRADE_CLAMPED: low asks and/or high bids are clamped
    kTradePostedAsk = 4,  // CTO_TRADE_POSTED_ASK: seller's cost known (s_lo = s_hi)
    kTradePostedBid = 5,  // CTO_TRADE_POSTED_BID: buyer's value known (b_lo = b_hi)
};
// Flags of double_auction (proposed CTO_TRADE_FLAG_<NAME>), or-ed together.
enum TradeFlag : int {
    kTradeFlagOnePriceExists = 1,  // s_hi <= b_lo: efficient one-price equilibria exist,
                                   // every price in [price_low, price_high]
    kTradeFlagConvention = 2,      // expected_price is the convention point value
    kTradeFlagNearBoundary = 4,    // within 1e-9 D of B_lo = A_hi, where outputs jump
    kTradeFlagFirstBestFeasible = 8,  // some mechanism attains the first best
};

// The outputs of double_auction.  Money in the units of the inputs.
struct TradeOut {
    int regime;                      // TradeRegime
    int flags;                       // TradeFlag bits
    double trade_probability;        // P(trade)
    double expected_price;           // E[price | trade]; NaN without trade
    double buyer_gain;               // E[(v - p) 1{trade}], ex ante
    double seller_gain;              // E[(p - c) 1{trade}], ex ante
    double total_gain;               // buyer_gain + seller_gain = E[(v - c) 1{trade}]
    double first_best_gain;          // E[(v - c)+]
    double first_best_probability;   // P(v >= c)
    double second_best_gain;         // Myerson-Satterthwaite bound on any mechanism
    double second_best_threshold;    // g*: trade iff v - c >= g* in the best mechanism
    double second_best_probability;  // P(v - c >= g*)
    double efficiency;               // total_gain / first_best_gain
    double second_best_efficiency;   // second_best_gain / first_best_gain
    double price_low, price_high;    // one-price interval [s_hi, b_lo]; NaN if s_hi > b_lo
    double ask_floor;                // B_lo: the lowest ask (clamp); NaN if not linear
    double bid_ceiling;              // A_hi: the highest bid (clamp); NaN if not linear
};

/*! double_auction: the linear equilibrium of the k-double auction with uniform private
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
 *  Proposed C layout (fields only ever appended):
 *      typedef struct cto_trade_outcome {
 *          size_t size; int regime; int flags;
 *          double trade_probability, expected_price, buyer_gain, seller_gain, total_gain,
 *                 first_best_gain, first_best_probability, second_best_gain,
 *                 second_best_threshold, second_best_probability, efficiency,
 *                 second_best_efficiency, price_low, price_high, ask_floor, bid_ceiling;
 *      } cto_trade_outcome; */
int double_auction(double seller_low, double seller_high, double buyer_low,
                   double buyer_high, double k, TradeOut *out, int *bad);

/*! trade_probability: P(trade) of double_auction (same arguments, same statuses; 0 with
 *  CTO_E_NO_DEAL, NaN with CTO_E_INVALID).  Accuracy as double_auction. */
int trade_probability(double seller_low, double seller_high, double buyer_low,
                      double buyer_high, double k, double *out, int *bad);

// The equilibrium strategies of double_auction in money units, for tests that treat
// them as black boxes (best-response checks).  Valid only in the regimes triangle and
// clamped, where the strategies are linear with clamps.
struct TradeStrategies {
    double s_lo, k, a_lo, b_hi_line, ask_floor, bid_ceiling;
    double ask(double cost) const;
    double bid(double value) const;
};
// Fills *st for valid inputs in the linear regimes and returns true; false otherwise.
bool trade_strategies(double seller_low, double seller_high, double buyer_low,
                      double buyer_high, double k, TradeStrategies *st);

}  // namespace cto::core

#endif  // CTO_MODELS_TRADE_HPP
