// The ranges engine: quantiles of the shares when inputs are uncertain, by randomized
// quasi-Monte Carlo with independent replicates and a sample size that doubles until the
// requested significant digits are reached.
//
// Method (docs/models/ranges.md):
//   * Draws.  Input j is F_j^-1(u_j) with u from Owen-scrambled Sobol' points (Sobol' 1967;
//     Joe & Kuo 2008 direction numbers; Bratley & Fox 1988; Owen 1995, 1997a), hashed so
//     that replicate r of seed S is fixed by (S, r) alone (sobol.hpp, scramble.hpp).
//     Distributions: uniform, triangular, PERT (Malcolm et al. 1959; Vose 2008).
//   * Replicates.  R independent replicates of n = 2^m points each (Owen 1995, s.2).
//     n starts at 2^log2_start and doubles (the first n points of each replicate are kept:
//     natural order makes the larger rule an extension of the smaller) until, for every
//     requested p, the 95% half-width t_{R-1,0.975} SE of own share's quantile is at most
//     half a unit of its `digits`-th significant digit, or n = 2^log2_max (then status
//     kPrecisionNotReached, every estimate still reported with its half-width).
//   * Estimates.  Quantile: Hyndman & Fan (1996) definition 7 over all R n draws; SE from
//     the R replicate quantiles.  Mean: the mean of all draws; SE from replicate means.
//     Probabilities (deal rational, each walk-away value binds, edge case): fractions of
//     all draws; SE from replicate fractions.
//   * Edge cases.  A draw with no rational deal takes the model's no-deal payoffs (never
//     a formula value) and counts as an edge case, as does a draw on a regime boundary.
//     A draw the model reports indeterminate makes the run CTO_E_INDETERMINATE; a draw it
//     reports invalid makes it CTO_E_INVALID naming the input.
//   * Reproducibility.  The result depends only on the inputs, options and seed: not on
//     the thread count (threads take whole replicates; every reduction runs in replicate
//     order) nor on the run.  Bit identity across machines also needs the same libm
//     (exp, log, pow, sin, expm1, log1p are not correctly rounded everywhere).
//   * Memory.  16 R 2^m bytes at the final size m (own and other's share per draw), at
//     most 256 MiB (R 2^log2_max <= 2^24 is enforced; the default R = 16, log2_max = 20
//     reaches it).  A failed allocation gives CTO_E_INTERNAL.
//   * Validation.  In order: each input's range (a known kind, finite, low <= mode <= high,
//     a finite width), then the model at the modes and at each uncertain input's low and
//     high with the others at their modes (the model's own domain checks), then the
//     options: 1 <= n_probs <= 32 and every p in (0, 1); 2 <= R <= 256; 1 <= digits <= 15;
//     1 <= log2_start <= log2_max <= 24; R 2^log2_max <= 2^24; 0 <= threads <= 64.
#ifndef CTO_RANGE_ENGINE_HPP
#define CTO_RANGE_ENGINE_HPP

#include "replicate.hpp"
#include "types.hpp"

namespace cto::core::range {

// The default options: p = 0.1, 0.5, 0.9; seed 0; R = 16; 3 digits; 2^10 .. 2^20; 1 thread.
RangeOptions default_options();

// Resets *out (keeping out->size) to "no estimate": NaN estimates, status CTO_OK, bad -1,
// the spec version and the requested probabilities.
void clear_range_out(RangeOut *out, const RangeOptions &opt);

// Runs the engine over `model` with inputs args[0..n_slots) (n_slots <= kSobolDims).
// Writes every field of *out on every path (NaN estimates when there is none); returns
// out->status.  Nothing escapes as an exception.
int run_range(const Model &model, const RangeArg *args, int n_slots, const RangeOptions &opt,
              RangeOut *out);

}  // namespace cto::core::range

#endif  // CTO_RANGE_ENGINE_HPP
