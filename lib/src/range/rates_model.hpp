// share_range and share_swing over the combined model from rates (solve_rates,
// models/combined.hpp): the entry points the C ABI wraps.  The two blocks below are
// written for the public header (cto_share_range, cto_share_swing); the method, accuracy
// and figures are in docs/models/ranges.md.
//
/*! cto_share_range: quantiles of the split when inputs are uncertain.
 *  Model: solve_from_rates (own and other's share, whether a deal is rational, which
 *  walk-away value binds) at random inputs X_j = F_j^-1(u_j).  Each of the 14 inputs
 *  (catalogue order of solve_from_rates) is fixed or a range: uniform (low, high),
 *  triangular or PERT (low, mode, high) (PERT: Malcolm, Roseboom, Clark & Fazar 1959;
 *  Beta-PERT as in Vose 2008).  own_opens and continuous must be fixed at 0 or 1.
 *  Method: randomized quasi-Monte Carlo.  u = (Y + 1/2) 2^-32 with Y the Owen-scrambled
 *  (Owen 1995, 1997; hashed as specified in docs/models/ranges.md) natural-order Sobol'
 *  points (Sobol' 1967) from the Joe & Kuo (2008) direction numbers (Bratley & Fox 1988
 *  recurrence); R independent replicates of n = 2^m points.  Quantile estimate: Hyndman &
 *  Fan (1996) definition 7 over all R n draws; standard error: sd of the R replicate
 *  quantiles / sqrt(R); 95% half-width t_{R-1,0.975} SE.  Mean and the fractions of draws
 *  (rational, own binds, other binds, edge case) likewise.  n doubles from 2^log2_start
 *  until every requested quantile of own share has a half-width of at most half a unit
 *  of its `digits`-th significant digit, or n = 2^log2_max.
 *  Inputs: in (size = sizeof), opt (size = sizeof; cto_range_default_options), out
 *  (size = sizeof).  Memory: 16 R n bytes at the final n, at most 256 MiB, and about
 *  16 n bytes of sorting work per thread.
 *  Status: CTO_OK -> every estimate, targets met;
 *          CTO_E_PRECISION (proposed, 6) -> every estimate, some own quantile short of
 *          the target at n = 2^log2_max (its `digits` says how many it has);
 *          CTO_E_INVALID -> NaN estimates, out->bad = the input (0-13) or option (14
 *          probabilities, 15 seed, 16 replicates, 17 digits, 18 log2_start, 19 log2_max,
 *          20 threads, 21 a struct size);
 *          CTO_E_INDETERMINATE -> NaN estimates (a draw without a determinate split);
 *          CTO_E_INTERNAL -> NaN estimates (working memory not available).
 *  Reproducibility: bit-identical for the same inputs, options and seed on one machine
 *  and libm, whatever the thread count; out->spec_version (3) names the rules.
 *  Accuracy: inverse CDFs within 2.6 ulp (of the range's magnitude) of mpmath at 40
 *  digits; 95% error bars cover in 94-94.5% of 200 runs with two uncertain rates (fewer,
 *  82-84% at the 10th/90th percentile, with a single uncertain input: see the docs).
 *  Estimates under the stated assumptions, not financial, legal or tax advice.  Since 1.x.
 */
/*! cto_share_swing: one-at-a-time swing of each uncertain input (a tornado).
 *  For each uncertain input: own share (solve_from_rates) with that input at its low and
 *  at its high, the others at their mode (a uniform range's midpoint); rows sorted by
 *  |share(high) - share(low)|, largest first, ties in input order (one-way sensitivity
 *  analysis; Howard 1988; Clemen & Reilly 2014 ch. 5).  An end with no rational deal gives
 *  own's no-deal payoff, its status kept in the row.
 *  Status: CTO_OK; CTO_E_INVALID with out->bad (as cto_share_range); CTO_E_INTERNAL.
 */
//
// The engine's details (validation order, edge cases, threads) are in engine.hpp.
#ifndef CTO_RANGE_RATES_MODEL_HPP
#define CTO_RANGE_RATES_MODEL_HPP

#include "engine.hpp"
#include "replicate.hpp"
#include "swing.hpp"
#include "types.hpp"

namespace cto::core::range {

// The slots of own_opens and continuous: each must be a fixed 0 or 1 (checked first).
inline constexpr int kOwnOpensSlot = 11, kContinuousSlot = 13;

// Whether a flag slot's input is a fixed 0 or 1.
bool flag_ok(const RangeArg &a);

// The model callback over solve_rates (x: the 14 inputs in catalogue order).
int rates_draw(const void *ctx, const double *x, Draw *d, int *bad);

// in.size and opt.size must be at least the sizes of this version's structs (else
// CTO_E_INVALID with bad = kBadSize); out->size is the caller's to check before the call.
int share_range(const RangeIn &in, const RangeOptions &opt, RangeOut *out);
int share_swing(const RangeIn &in, SwingOut *out);

}  // namespace cto::core::range

#endif  // CTO_RANGE_RATES_MODEL_HPP
