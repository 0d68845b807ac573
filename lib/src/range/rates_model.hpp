// share_range and share_swing over the combined model from rates (solve_rates,
// models/combined.hpp): the entry points the C ABI wraps.
//
// Inputs: RangeIn::arg[0..13] in the catalogue order of solve_from_rates (types.hpp).
// Each numeric input is fixed or a range; own_opens (11) and continuous (13) must be fixed
// at 0 or 1; an absent walk-away value (8, 9) is a fixed -infinity.  A draw's outcome is
// solve_rates's: own and other's share (the no-deal payoffs when no deal is rational),
// whether a deal is rational, which walk-away value binds; an edge case is a draw with no
// rational deal or on a regime boundary (REFERENCE s.12).
//
// share_range: see engine.hpp for the method, status table and memory.  Status: CTO_OK;
// kPrecisionNotReached (every estimate reported, some own-share quantile short of the
// digit target at the cap); CTO_E_INVALID with out->bad (the input or option index:
// 0-13 inputs, 14 probabilities, 15 seed, 16 replicates, 17 digits, 18 log2_start,
// 19 log2_max, 20 threads, 21 a struct size); CTO_E_INDETERMINATE (some draw has no
// determinate split, e.g. both rates 0 without breakdown risk); CTO_E_INTERNAL (memory).
// share_swing: see swing.hpp.
#ifndef CTO_RANGE_RATES_MODEL_HPP
#define CTO_RANGE_RATES_MODEL_HPP

#include "engine.hpp"
#include "replicate.hpp"
#include "swing.hpp"
#include "types.hpp"

namespace cto::core::range {

// The model callback over solve_rates (x: the 14 inputs in catalogue order).
int rates_draw(const void *ctx, const double *x, Draw *d, int *bad);

// in.size and opt.size must be at least the sizes of this version's structs (else
// CTO_E_INVALID with bad = kBadSize); out->size is the caller's to check before the call.
int share_range(const RangeIn &in, const RangeOptions &opt, RangeOut *out);
int share_swing(const RangeIn &in, SwingOut *out);

}  // namespace cto::core::range

#endif  // CTO_RANGE_RATES_MODEL_HPP
