/*
 * counteroffer/table.h -- the catalogue as data: the function table, the generic entry points, plausible ranges, output words and reasons.
 * A part of the public interface: include counteroffer/counteroffer.h, which includes
 * every part inside its extern "C" block.
 */
#ifndef COUNTEROFFER_TABLE_H
#define COUNTEROFFER_TABLE_H

#ifndef COUNTEROFFER_COUNTEROFFER_H
#error "include counteroffer/counteroffer.h, not its parts"
#endif

/* =========================================================================
 * The catalogue as data: one table that drives the wrappers
 * =========================================================================
 * Every function above is described once here: its name, its Calc name, its
 * arguments (kind, default, display label, one-line help with units and domain)
 * and its outputs.  cto_call and cto_call_strided evaluate any function with
 * all arguments passed as doubles; they convert and validate the doubles
 * (booleans must be 0 or 1, counts and choices whole numbers) and report which
 * argument was invalid.  A count travels as a double here, so only counts up to
 * 2^53 are exact on this path (the wrappers reject larger integers); the named C
 * functions take int64_t counts up to 2^63 - 1.  The Python package and the Calc add-in are built on
 * these, so a new catalogue row needs no new wrapper code. */

/* Argument kinds. */
#define CTO_ARG_REAL 0     /* finite real (money)                               */
#define CTO_ARG_UNIT 1     /* finite, in [0, 1] (factors, probabilities, weights)*/
#define CTO_ARG_NONNEG 2   /* finite, >= 0 (rates, days, costs)                 */
#define CTO_ARG_POSITIVE 3 /* finite, > 0 (basis, curvature, values)            */
#define CTO_ARG_BOOL 4     /* 0 or 1                                           */
#define CTO_ARG_COUNT 5    /* whole number >= min_count, within int64           */
#define CTO_ARG_CHOICE 6   /* whole number indexing `choices`                   */
#define CTO_ARG_OPTIONAL 7 /* finite real, or -infinity meaning "absent"        */

typedef struct cto_arg_info {
    const char *name;            /* catalogue (Python keyword) name, e.g. "surplus" */
    const char *label;           /* display name, e.g. "Surplus"                    */
    const char *help;            /* one line: meaning, units, domain                */
    int kind;                    /* CTO_ARG_*                                       */
    int has_default;             /* 1: optional, default_value applies              */
    double default_value;        /* as a double (bool 0/1, choice index, -inf)      */
    int64_t min_count;           /* CTO_ARG_COUNT: smallest allowed value           */
    const char *const *choices;  /* CTO_ARG_CHOICE: NULL-terminated option names    */
} cto_arg_info;

typedef struct cto_output_info {
    const char *name;            /* e.g. "own_share"                                */
    const char *help;            /* one line                                        */
} cto_output_info;

/* No catalogue function has more arguments or outputs than these (buffers for cto_call
 * may be sized by them).  Added in 1.1. */
#define CTO_MAX_ARGS 32
#define CTO_MAX_OUTPUTS 32

typedef struct cto_function_info {
    size_t size;                 /* sizeof(cto_function_info) of the library        */
    int id;                      /* index in the table, for cto_call                */
    const char *name;            /* catalogue name, e.g. "share"                    */
    const char *calc_name;       /* Calc name, e.g. "DEALSHARE"                     */
    const char *summary;         /* one line                                        */
    const char *formula;         /* the formula, plain text                         */
    const char *source;          /* published source: author, year, section         */
    const char *statuses;        /* what each status returns, plain text            */
    int n_args;
    const cto_arg_info *args;
    int n_outputs;
    const cto_output_info *outputs;
} cto_function_info;

/* Number of functions in the catalogue (stable order; only ever appended). */
CTO_API size_t cto_function_count(void);
/* The i-th function, NULL when i >= cto_function_count(). */
CTO_API const cto_function_info *cto_function_at(size_t index);
/* The function with catalogue name `name`, NULL when there is none. */
CTO_API const cto_function_info *cto_function_find(const char *name);

/*! cto_arg_plausible_range: the range of values of argument `arg_index` of function
 *  `function_id` that look like what a user means.  A value outside it is still valid and
 *  computed, but looks like a typing slip: a rate of 8 (800% a year) typed for 8%, more
 *  than 3650 days between offers, a breakdown probability above 0.5 a round, a day basis
 *  outside 360 to 366.  Returns CTO_OK and writes low and high (either pointer may be
 *  NULL) when the argument has such a range; CTO_E_INVALID with NaN otherwise (no range,
 *  or an unknown function or argument).  Added in 1.1. */
CTO_API int cto_arg_plausible_range(int function_id, int arg_index, double *low,
                                    double *high);

/*! cto_output_word: the word for value `code` of a coded output (output `output_index`
 *  of function `function_id`): solve's binding 0..3 is "none", "ours", "theirs", "both";
 *  its rational 0/1 is "no", "yes".  Static, or NULL when the output is not coded or the
 *  code is not one of its values (NaN included).  Added in 1.1. */
CTO_API const char *cto_output_word(int function_id, int output_index, double code);

/*! cto_explain: why catalogue function `id` gives what it gives for these arguments
 *  (all n_args as doubles, as cto_call takes them), in words, written into text (at most
 *  size bytes, NUL-terminated; a longer reason is cut): "own_factor = 1.2 is outside 0
 *  to 1"; "no rational deal (#N/A in Calc): the surplus 100 does not exceed what the
 *  parties get without a deal (own 70, other 60); ..."; "indeterminate: ..."; "ok, but
 *  own_rate = 8 is outside the usual 0 to 1: above 100% a year: a percentage typed as a
 *  whole number? (8% is 0.08)"; or "ok".  Returns the function's status (as cto_call);
 *  CTO_E_INVALID for an unknown id or NULL args.  text may be NULL (size 0).  Added in
 *  1.1. */
CTO_API int cto_explain(int id, const double *args, char *text, size_t size);

/*! cto_call: evaluate catalogue function `id` with all n_args arguments as
 *  doubles (defaults are not applied here: pass every argument).  Writes
 *  n_outputs values to outputs.  *bad_arg (may be NULL) receives the index of
 *  the first invalid argument, or -1.  Returns the function's status. */
CTO_API int cto_call(int id, const double *args, double *outputs, int *bad_arg);

/*! Per-call summary of a strided evaluation.  Set size before the call. */
#define CTO_REPORT_SLOTS 8
typedef struct cto_batch_report {
    size_t size;
    size_t count[CTO_REPORT_SLOTS];        /* elements per status code          */
    size_t first_index[CTO_REPORT_SLOTS];  /* first element with that status    */
    int first_bad_arg;                     /* argument index of the first invalid
                                              element, or -1                    */
} cto_batch_report;

/*! cto_call_strided: evaluate function `id` over n elements.  Argument j of
 *  element i is read at args[j] + i * arg_strides[j] (bytes; 0 broadcasts one
 *  value); output k is written at outputs[k] + i * output_strides[k].  statuses,
 *  when not NULL, receives each element's status as a signed char with stride
 *  status_stride.  report (may be NULL) is filled in.  Every element's outputs
 *  are written.  Returns CTO_OK, or CTO_E_INVALID when id or a pointer is bad
 *  (then nothing is written).  The loop is specialised per function; for share
 *  it evaluates blocks of 256 valid elements with vector instructions (AVX2 where
 *  the CPU has it), with results identical bit for bit to cto_call's. */
CTO_API int cto_call_strided(int id, size_t n, const char *const *args,
                             const ptrdiff_t *arg_strides, char *const *outputs,
                             const ptrdiff_t *output_strides, signed char *statuses,
                             ptrdiff_t status_stride, cto_batch_report *report);


#endif /* COUNTEROFFER_TABLE_H */
