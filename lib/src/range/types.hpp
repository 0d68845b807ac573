// The interface structs of share_range and share_swing, laid out for the C ABI: each
// struct that crosses it starts with `size_t size` (the caller sets sizeof) and is only
// ever appended to.  Plain standard-layout types with C member types only, so that the
// public header can declare the same layouts as cto_range_arg, cto_range_in,
// cto_range_options, cto_range_out and cto_swing_out (proposed names) and the core can
// use these definitions for them.
//
// Input slots follow the catalogue order of solve_from_rates:
//   0 own_rate, 1 other_rate, 2 days, 3 breakdown_prob, 4 own_fallback, 5 other_fallback,
//   6 own_inside, 7 other_inside, 8 own_outside, 9 other_outside, 10 surplus,
//   11 own_opens, 12 basis, 13 continuous.
// Slot j is dimension j of the generator, always (a fixed or degenerate input keeps its
// dimension, so the draws of the others do not depend on which inputs are uncertain).
// own_opens and continuous must be fixed at 0 or 1; an absent walk-away value is a fixed
// -infinity (the only non-finite value accepted, and only in slots 8 and 9).
// Invalid-input indices (`bad`): 0..13 the inputs; 14 probabilities, 15 seed,
// 16 replicates, 17 digits, 18 log2_start, 19 log2_max, 20 threads, 21 a `size` field.
#ifndef CTO_RANGE_TYPES_HPP
#define CTO_RANGE_TYPES_HPP

#include <cstddef>
#include <cstdint>

namespace cto::core::range {

inline constexpr int kSpecVersion = 3;     // generator and estimator rules (docs: "Reproducibility")
inline constexpr int kRangeSlots = 14;     // inputs of solve_from_rates
inline constexpr int kMaxProbs = 32;       // probabilities per call
inline constexpr int kMaxReplicates = 256; // t quantiles are tabulated to R - 1 = 255
inline constexpr int kMaxLog2 = 24;        // points per replicate at most 2^24
inline constexpr int kMaxLog2Total = 24;   // replicates x points at most 2^24 (memory cap)
inline constexpr int kMaxDigits = 15;      // significant digits targeted at most
inline constexpr int kMaxWorkerThreads = 64;  // the threads option at most

// Status appended for share_range (proposed CTO_E_PRECISION in the public header): every
// output is an estimate, but the half-width of some requested quantile of own share is
// still above the digit target at the largest sample size.
inline constexpr int kPrecisionNotReached = 6;

// Bad-index values beyond the inputs.
enum : int {
    kBadProbs = 14, kBadSeed = 15, kBadReplicates = 16, kBadDigits = 17, kBadLog2Start = 18,
    kBadLog2Max = 19, kBadThreads = 20, kBadSize = 21
};

// One input: kind kFixed (value in `mode`), kUniform (low, high), kTriangular or kPert
// (low, mode, high); see distributions.hpp.  Proposed: cto_range_arg.
struct RangeArg {
    int kind;
    double low, mode, high;
};

// Proposed: cto_range_in.
struct RangeIn {
    size_t size;
    RangeArg arg[kRangeSlots];
};

// Proposed: cto_range_options (cto_range_default_options fills the defaults).
struct RangeOptions {
    size_t size;
    int n_probs;                // 1..kMaxProbs; default 3
    double probs[kMaxProbs];    // each in (0, 1); default 0.1, 0.5, 0.9
    uint64_t seed;              // default 0
    int replicates;             // R, 2..kMaxReplicates; default 16
    int digits;                 // significant digits targeted, 1..15; default 3
    int log2_start;             // first n = 2^log2_start per replicate; default 10
    int log2_max;               // cap; default 20; R 2^log2_max <= 2^kMaxLog2Total
    int threads;                // worker threads, 0 or 1 = the calling thread; default 1
};

// An estimate with its standard error, 95% half-width and significant digits reached.
struct Estimate {
    double value, se, half_width;
    int digits;
};

// Proposed: cto_range_out.
struct RangeOut {
    size_t size;
    int status;        // CTO_OK, kPrecisionNotReached, CTO_E_INVALID, CTO_E_INDETERMINATE, ...
    int bad;           // on CTO_E_INVALID: the index of the first invalid input (see above); else -1
    int spec_version;  // kSpecVersion
    int n_probs;
    double probs[kMaxProbs];
    Estimate own[kMaxProbs];    // quantiles of own share (money)
    Estimate other[kMaxProbs];  // quantiles of other's share (money)
    Estimate own_mean, other_mean;
    Estimate p_rational;        // probability that a deal is rational
    Estimate p_own_binds;       // probability that own walk-away value binds
    Estimate p_other_binds;     // probability that other's walk-away value binds
    Estimate edge_fraction;     // fraction of draws at an edge case (no deal, boundary)
    uint64_t points_per_replicate;  // n = 2^log2_used
    int replicates;
    int log2_used;
    int dimension;              // number of uncertain inputs
};

// One row of the swing (tornado).  Proposed: cto_swing_row.
struct SwingRow {
    int input;           // slot index 0..13
    double at_low;       // own share with this input at its low, the others at their mode
    double at_high;      // ... at its high
    double swing;        // |at_high - at_low|
    int status_low, status_high;  // the model's status at each end (CTO_OK or CTO_E_NO_DEAL)
};

// Proposed: cto_swing_out.
struct SwingOut {
    size_t size;
    int status;
    int bad;
    double base;         // own share with every input at its mode
    int base_status;
    int n_rows;          // uncertain inputs, sorted by swing, largest first
    SwingRow row[kRangeSlots];
};

}  // namespace cto::core::range

#endif  // CTO_RANGE_TYPES_HPP
