/*
 * counteroffer/ranges.h -- ranges under uncertainty: quantiles of the split by randomized quasi-Monte Carlo, and the one-at-a-time swing.
 * A part of the public interface: include counteroffer/counteroffer.h, which includes
 * every part inside its extern "C" block.
 */
#ifndef COUNTEROFFER_RANGES_H
#define COUNTEROFFER_RANGES_H

#ifndef COUNTEROFFER_COUNTEROFFER_H
#error "include counteroffer/counteroffer.h, not its parts"
#endif

/* =========================================================================
 * Ranges under uncertainty: quantiles of the split when inputs are ranges
 * =========================================================================
 * share_range: the combined model from rates (solve_from_rates) with any numeric input
 * given as a range, its split's quantiles by randomized quasi-Monte Carlo.  Method
 * (docs/models/ranges.md): Sobol' points (Sobol' 1967) with Joe & Kuo (2008) direction
 * numbers in natural order, hashed nested uniform (Owen 1995, 1997) scrambling fixed by
 * the seed and the replicate; each input x_j = F_j^-1(u_j) for uniform, triangular or
 * PERT (Malcolm et al. 1959; Vose 2008: Beta with alpha = 1 + 4 (m - lo)/(hi - lo),
 * beta = 1 + 4 (hi - m)/(hi - lo)); R independent replicates of n = 2^m points, n doubled
 * until the 95% half-width t_{R-1,0.975} SE of every requested quantile of own share is at
 * most half a unit of its `digits`-th significant digit, or a cap (CTO_E_PRECISION:
 * estimates reported, never a silent rough number); quantiles by Hyndman & Fan (1996)
 * definition 7 over all R n draws, standard errors from the replicates.  The same inputs
 * and seed give the same bits whatever the thread count (spec_version states the rules).
 * Memory: 16 R n bytes at the final size, at most 256 MiB, a cache of scrambling flips
 * of at most 32 MiB, and about 16 n bytes of sorting work per thread.
 *
 * Inputs, in the catalogue order of solve_from_rates: 0 own_rate, 1 other_rate, 2 days,
 * 3 breakdown_prob, 4 own_fallback, 5 other_fallback, 6 own_inside, 7 other_inside,
 * 8 own_outside, 9 other_outside, 10 surplus, 11 own_opens, 12 basis, 13 continuous.
 * own_opens and continuous must be fixed at 0 or 1; an absent walk-away value is a fixed
 * -infinity.  Invalid-input indices (`bad`): 0..13 the inputs, 14 probabilities, 15 seed,
 * 16 replicates, 17 digits, 18 log2_start, 19 log2_max, 20 threads, 21 a size field.
 * Added in 1.1. */
#define CTO_RANGE_FIXED 0      /* the value in `mode`                                  */
#define CTO_RANGE_UNIFORM 1    /* uniform on [low, high]                               */
#define CTO_RANGE_TRIANGULAR 2 /* triangular (low, mode, high)                         */
#define CTO_RANGE_PERT 3       /* PERT (low, mode, high): Beta, weight 4 on the mode   */
#define CTO_RANGE_INPUTS 14
#define CTO_RANGE_MAX_PROBS 32

typedef struct cto_range_arg {
    int kind;                   /* CTO_RANGE_*                                          */
    double low, mode, high;     /* low <= mode <= high; a fixed input uses mode         */
} cto_range_arg;

typedef struct cto_range_input {
    size_t size;                /* sizeof(cto_range_input)                              */
    cto_range_arg arg[CTO_RANGE_INPUTS];
} cto_range_input;

typedef struct cto_range_options {
    size_t size;                /* sizeof(cto_range_options)                            */
    int n_probs;                /* 1..32; default 3                                     */
    double probs[CTO_RANGE_MAX_PROBS]; /* each in (0, 1); default 0.1, 0.5, 0.9         */
    uint64_t seed;              /* default 0                                            */
    int replicates;             /* R, 2..256; default 16                                */
    int digits;                 /* significant digits targeted, 1..15; default 3        */
    int log2_start;             /* first n = 2^log2_start per replicate; default 10     */
    int log2_max;               /* cap; default 20; R 2^log2_max <= 2^24                */
    int threads;                /* worker threads, 0 or 1: the calling thread; default 1*/
} cto_range_options;

typedef struct cto_range_estimate {
    double value, se, half_width; /* estimate, standard error, 95% half-width           */
    int digits;                 /* significant digits the half-width supports           */
} cto_range_estimate;

typedef struct cto_range_outcome {
    size_t size;                /* sizeof(cto_range_outcome)                            */
    int status;                 /* as returned                                          */
    int bad;                    /* on CTO_E_INVALID: the index (see above), else -1     */
    int spec_version;           /* the generator and estimator rules' version           */
    int n_probs;
    double probs[CTO_RANGE_MAX_PROBS];
    cto_range_estimate own[CTO_RANGE_MAX_PROBS];   /* quantiles of own share (money)    */
    cto_range_estimate other[CTO_RANGE_MAX_PROBS]; /* quantiles of other's share        */
    cto_range_estimate own_mean, other_mean;
    cto_range_estimate p_rational;    /* probability that a deal is rational            */
    cto_range_estimate p_own_binds;   /* probability that own walk-away value binds     */
    cto_range_estimate p_other_binds; /* ... the other side's                           */
    cto_range_estimate edge_fraction; /* draws at an edge case (no deal, boundary)      */
    uint64_t points_per_replicate;    /* n = 2^log2_used                                */
    int replicates;
    int log2_used;
    int dimension;              /* number of uncertain inputs                           */
} cto_range_outcome;

/*! cto_range_default_options: fills *opt with the defaults (size set). */
CTO_API void cto_range_default_options(cto_range_options *opt);

/*! cto_share_range: quantiles of own and other's share, their means and the
 *  probabilities of a rational deal and of each walk-away value binding.
 *  Status: CTO_OK; CTO_E_PRECISION (every estimate reported with its half-width, some
 *  own-share quantile short of the digit target at log2_max); CTO_E_INVALID (out->bad
 *  names the input or option: a low above its high, a mode outside, a probability
 *  outside (0, 1), a bad option, a NULL pointer or too small a size); CTO_E_INDETERMINATE
 *  (some draw has no determinate split, e.g. both rates 0 without breakdown risk);
 *  CTO_E_INTERNAL (memory).  Degenerate ranges (low = high) give the fixed-input result
 *  exactly.  out is written whenever it is not NULL and out->size is large enough. */
CTO_API int cto_share_range(const cto_range_input *in, const cto_range_options *opt,
                            cto_range_outcome *out);

/*! One row of the swing (a tornado chart): own share with one input at its low and at
 *  its high, the others at their modes (a uniform range's midpoint). */
typedef struct cto_swing_row {
    int input;                  /* 0..13                                                */
    double at_low, at_high;     /* own share at the input's low and high                */
    double swing;               /* |at_high - at_low|                                   */
    int status_low, status_high;/* the model's status at each end (ok or no deal)       */
} cto_swing_row;

typedef struct cto_swing_outcome {
    size_t size;                /* sizeof(cto_swing_outcome)                            */
    int status;
    int bad;
    double base;                /* own share with every input at its mode               */
    int base_status;
    int n_rows;                 /* uncertain inputs, sorted by swing, largest first     */
    cto_swing_row row[CTO_RANGE_INPUTS];
} cto_swing_outcome;

/*! cto_share_swing: the one-at-a-time swing of each uncertain input of share_range's
 *  inputs (one-way sensitivity; Clemen & Reilly 2014 ch.5), sorted by size.  It ignores
 *  interactions, which share_range's quantiles include.  Status: CTO_OK; CTO_E_INVALID
 *  (out->bad); CTO_E_INTERNAL.  Added in 1.1. */
CTO_API int cto_share_swing(const cto_range_input *in, cto_swing_outcome *out);

/*! cto_range_explain: why cto_share_range gives what it gives for in and opt, in words
 *  (docs/models/ranges.md "Reasons in words"), written into text (at most size bytes,
 *  NUL-terminated; a longer reason is cut; text may be NULL with size 0).  The reason
 *  words the run's status and invalid index (the checks are the engine's, never repeated
 *  here): an input by its argument name and what is wrong with its range ("other_rate:
 *  low 0.12 is above high 0.08"; "other_rate: mode 0.2 is outside low 0.05 to high 0.1";
 *  "own_opens must be a fixed 0 or 1 (FALSE or TRUE), not a range"); the model's own
 *  reason where it refuses a value the engine probes, as cto_explain words it
 *  ("breakdown_prob at its high: breakdown_prob = 1.5 is outside 0 to 1"); an option
 *  ("probability 1 is not strictly between 0 and 1"; "replicates = 1: at least 2 ...");
 *  a struct that is NULL or too small; draws without a single answer; precision not
 *  reached (the digits asked for, each quantile short of them, and which option to
 *  change); working memory; or "ok", with "ok, but other_rate high = 8 is outside the
 *  usual 0 to 1: ..." for a valid value outside its argument's plausible range
 *  (cto_arg_plausible_range of solve_from_rates).  out: NULL to run cto_share_range here,
 *  or the outcome cto_share_range wrote for the same in and opt, worded without running
 *  it again.  Returns that run's status (CTO_E_INVALID also for an out whose size is too
 *  small).  Added in 1.1. */
CTO_API int cto_range_explain(const cto_range_input *in, const cto_range_options *opt,
                              const cto_range_outcome *out, char *text, size_t size);

/*! cto_swing_explain: the same for cto_share_swing (its inputs' reasons, or "ok");
 *  out: NULL to run cto_share_swing here, or the outcome it wrote for the same in.
 *  Added in 1.1. */
CTO_API int cto_swing_explain(const cto_range_input *in, const cto_swing_outcome *out,
                              char *text, size_t size);


#endif /* COUNTEROFFER_RANGES_H */
