// The arguments of the add-in's functions that are not catalogue rows: DEALRANGE,
// DEALRANGEOUTCOME and DEALSWING (share_range, share_swing) and DEALOFFERPATH (the rows
// of offer_path).  Shared by the generator (gen/addin_gen.cpp: IDL, Function Wizard
// text) and the glue (src/ranges.hxx, src/offers.hxx), so both agree on names, order
// and limits.  Plain C++: no UNO types.
#ifndef CTO_ADDIN_RANGE_ARGS_H
#define CTO_ADDIN_RANGE_ARGS_H

#include <counteroffer/counteroffer.h>

namespace cto_addin {

// The inputs of share_range in the order of cto_range_input (the catalogue order of
// solve_from_rates).  Their labels, help, kinds and defaults are the catalogue's: the
// first catalogue function with an argument of that name supplies them.
constexpr int kRangeInputs = CTO_RANGE_INPUTS;
inline const char *const kRangeInputNames[kRangeInputs] = {
    "own_rate",     "other_rate",   "days",        "breakdown_prob", "own_fallback",
    "other_fallback", "own_inside", "other_inside", "own_outside",   "other_outside",
    "surplus",      "own_opens",    "basis",       "continuous"};

// The arguments after the inputs (DEALRANGE and DEALRANGEOUTCOME; DEALSWING has none).
struct ExtraArg {
    const char *param;  // IDL parameter name
    const char *label;  // Function Wizard name
    const char *help;   // Function Wizard help (the generator adds "Optional.")
};
constexpr int kRangeExtras = 4;  // arguments 15..18
constexpr int kArgProbability = kRangeInputs, kArgShape = kRangeInputs + 1,
              kArgSeed = kRangeInputs + 2, kArgDigits = kRangeInputs + 3;
inline const ExtraArg kRangeExtra[kRangeExtras] = {
    {"probability", "Probability",
     "probability of the quantile of own share, strictly between 0 and 1 (default 0.5), or a "
     "range of at most 32 probabilities: then an array of the same shape"},
    {"shape", "Shape",
     "\"pert\" (the default) or \"triangular\": the distribution of every input given as 3 "
     "cells (low, mode, high)"},
    {"seed", "Seed",
     "whole number from 0 to 2^53 that fixes the random scrambling (default 0); the same "
     "seed gives the same numbers on every recalculation"},
    {"digits", "Digits",
     "significant digits the 95% error bar of each quantile must reach, 1 to 15 (default 3); "
     "the sample grows until then, or the estimate is Err:523"}};

// The probabilities of DEALRANGEOUTCOME when none are given, and DEALRANGE's default.
constexpr double kDefaultProbability = 0.5;
constexpr int kDefaultDigits = 3;

// DEALOFFERPATH: at most this many rows (rounds) are returned; a longer path (or one
// without a deadline) gives its first rounds.  Columns: round, offer, cutoff, probability
// in that round, probability by that round.
constexpr int64_t kOfferPathMaxRows = 1000;
constexpr int kOfferPathColumns = 5;
// DEALOFFERPATH serves the catalogue function offer_path: its arguments, in its order
// (DEALREASON("DEALOFFERPATH"; ...) gives offer_path's reason for them).
constexpr const char *kOfferPathCalc = "DEALOFFERPATH";
constexpr const char *kOfferPathFunction = "offer_path";

}  // namespace cto_addin

#endif  // CTO_ADDIN_RANGE_ARGS_H
