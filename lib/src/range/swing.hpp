// The one-at-a-time swing of each uncertain input (a "tornado" chart's data): own share
// with that input at its low and at its high while every other input sits at its mode,
// sorted by the size of the swing |share(high) - share(low)|, largest first (ties in
// input order).  This is the one-way sensitivity analysis of decision analysis (e.g.
// Clemen & Reilly 2014, Making Hard Decisions, ch. 5, "tornado diagrams"; Howard 1988);
// it ignores interactions, which share_range's quantiles include.
//
// "Mode": the value of a fixed input, the mode of a triangular or PERT range, the
// midpoint of a uniform one.  An end where the model finds no rational deal gives own's
// no-deal payoff (its status is kept in the row); an invalid end is CTO_E_INVALID naming
// the input; an indeterminate end gives NaN at that end with its status.
#ifndef CTO_RANGE_SWING_HPP
#define CTO_RANGE_SWING_HPP

#include "replicate.hpp"
#include "types.hpp"

namespace cto::core::range {

// Resets *out (keeping out->size): no rows, NaN values, status CTO_OK, bad -1.
void clear_swing_out(SwingOut *out);

// Inputs args[0..n_slots), n_slots <= kRangeSlots.  Writes every field of *out on every
// path; returns out->status (CTO_OK, CTO_E_INVALID with out->bad, CTO_E_INTERNAL).
int run_swing(const Model &model, const RangeArg *args, int n_slots, SwingOut *out);

}  // namespace cto::core::range

#endif  // CTO_RANGE_SWING_HPP
