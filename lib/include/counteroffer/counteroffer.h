/*
 * counteroffer.h -- the stable C interface of the counteroffer library.
 *
 * counteroffer computes how a jointly created surplus is split in the published
 * alternating-offers bargaining models and their extensions (Rubinstein 1982;
 * Binmore, Rubinstein & Wolinsky 1986; Muthoo 1999; Baron & Ferejohn 1989;
 * Fudenberg & Tirole 1983).  Every function here is one row of the project's
 * function catalogue, with the catalogue's name, argument order and status codes.
 *
 * Results are model estimates under the stated assumptions, not financial, legal or
 * tax advice.
 *
 * Rules that hold for every function:
 *   - The return value is a status (CTO_OK = 0 on success).
 *   - The output is written on every path: a value on CTO_OK, NaN on
 *     CTO_E_INVALID / CTO_E_INDETERMINATE / CTO_E_NO_CONVERGENCE / CTO_E_INTERNAL,
 *     and own's no-deal payoff on CTO_E_NO_DEAL (NaN for a result that has no value
 *     without a deal: cto_expected_agreement_round, cto_opening_offer).  A NULL
 *     output pointer gives CTO_E_INVALID (nothing can be written).
 *   - A value returned with CTO_OK is finite.
 *   - When several statuses apply, the first of invalid, no deal, indeterminate wins
 *     (e.g. both factors 1 with a surplus of 0 is no deal).
 *   - No function keeps state, allocates, or throws: all are thread-safe.
 *   - Booleans are int (0 = false, any other value = true).
 *   - Conventions: "own" is the party whose result is returned, "other" the
 *     counterparty; own_opens = own makes the first offer.  A responder accepts
 *     when indifferent (needed for an equilibrium to exist).
 *   - Money arguments (surplus, fallbacks, options, costs, stakes) are in one unit
 *     of the caller's choice; results are in the same unit.
 *
 * Accuracy: measured against 50-digit mpmath reference tables computed by
 * independent methods (backward induction, fixed-point iteration, numerical
 * maximisation, root finding); the worst relative error is below 1e-15 on every
 * table (absolute 1e-15 x surplus where a value is near zero).  See README.md.
 */
#ifndef COUNTEROFFER_COUNTEROFFER_H
#define COUNTEROFFER_COUNTEROFFER_H

#include <stddef.h>
#include <stdint.h>

/* ---- Version ------------------------------------------------------------- */
/* The single source of the version: CMake reads these three lines. */
#define CTO_VERSION_MAJOR 1
#define CTO_VERSION_MINOR 1
#define CTO_VERSION_PATCH 0
#define CTO_VERSION_NUMBER \
    (CTO_VERSION_MAJOR * 10000 + CTO_VERSION_MINOR * 100 + CTO_VERSION_PATCH)
#define CTO_STRINGIFY_(x) #x
#define CTO_STRINGIFY(x) CTO_STRINGIFY_(x)
#define CTO_VERSION_STRING                                                   \
    CTO_STRINGIFY(CTO_VERSION_MAJOR) "." CTO_STRINGIFY(CTO_VERSION_MINOR) "." \
        CTO_STRINGIFY(CTO_VERSION_PATCH)

/* ---- Export macro -------------------------------------------------------- */
#if defined(_WIN32)
#  if defined(CTO_BUILDING_SHARED)
#    define CTO_API __declspec(dllexport)
#  elif defined(CTO_USING_SHARED)
#    define CTO_API __declspec(dllimport)
#  else
#    define CTO_API
#  endif
#elif defined(__GNUC__) && __GNUC__ >= 4
#  define CTO_API __attribute__((visibility("default")))
#else
#  define CTO_API
#endif

#ifdef __cplusplus
extern "C" {
#endif

/* ---- Status codes (pinned; only ever appended) --------------------------- */
#define CTO_OK 0               /* success: the output is the model's value      */
#define CTO_E_INVALID 1        /* invalid argument: NaN, infinite, out of domain */
#define CTO_E_NO_DEAL 2        /* no rational deal: output = own's no-deal payoff */
#define CTO_E_INDETERMINATE 3  /* many equilibria (e.g. both factors 1): NaN   */
#define CTO_E_NO_CONVERGENCE 4 /* a numerical method did not converge: NaN     */
#define CTO_E_INTERNAL 5       /* a defect in the library: NaN                 */
#define CTO_E_PRECISION 6      /* share_range: estimates reported, but some requested
                                  quantile is short of the digit target (added in 1.1) */

/* Static, never NULL: "ok", "invalid argument", ...; "unknown status" otherwise. */
CTO_API const char *cto_status_name(int status);
/* Static, never NULL: one sentence on what the status means for the output. */
CTO_API const char *cto_status_message(int status);

/* Runtime version: equals CTO_VERSION_NUMBER / CTO_VERSION_STRING of the header
 * the library was built with (check at start-up that they agree). */
CTO_API unsigned cto_version_number(void);
CTO_API const char *cto_version_string(void);

/* ---- Option constants ---------------------------------------------------- */
#define CTO_UTILITY_POWER 0       /* u(x) = x^a, 0 < a <= 1 (CRRA)              */
#define CTO_UTILITY_EXPONENTIAL 1 /* u(x) = (1 - exp(-k x)) / k, k > 0 (CARA)   */
#define CTO_ROLE_PROPOSER 0       /* majority_share: the recognised proposer     */
#define CTO_ROLE_PARTNER 1        /* majority_share: a coalition partner         */
#define CTO_WRT_OWN 0             /* share_sensitivity: d share / d own rate     */
#define CTO_WRT_OTHER 1           /* share_sensitivity: d share / d other rate   */

/* Which walk-away (outside) option binds in cto_solve. */
#define CTO_BINDS_NONE 0
#define CTO_BINDS_OWN 1
#define CTO_BINDS_OTHER 2
#define CTO_BINDS_BOTH 3

/* The functions, by family (each part documents its functions: formula, source,
 * arguments, statuses, accuracy). */
#include "counteroffer/complete.h"
#include "counteroffer/private.h"
#include "counteroffer/ranges.h"
#include "counteroffer/table.h"

#ifdef __cplusplus
} /* extern "C" */
#endif

#endif /* COUNTEROFFER_COUNTEROFFER_H */
