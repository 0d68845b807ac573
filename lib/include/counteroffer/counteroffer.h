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
 *     and own's no-deal payoff on CTO_E_NO_DEAL.  A NULL output pointer gives
 *     CTO_E_INVALID (nothing can be written).
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

/* =========================================================================
 * Discounting
 * ========================================================================= */

/*! cto_round_factor: per-round discount factor from an annual rate.
 *  Formula: annual effective (continuous = 0): factor = (1 + rate)^(-days/basis)
 *           = exp(-log1p(rate) * days / basis);
 *           continuous (continuous != 0): factor = exp(-rate * days / basis).
 *  Source: standard compounding (common practice, no source); used as
 *          delta = exp(-r Delta) in Rubinstein (1982) s.1 and Muthoo (1999) s.3.2.
 *  rate   annual rate, fraction per year (0.08 = 8%), >= 0, finite
 *  days   time between offers, days, >= 0, finite
 *  basis  days per year, > 0 (365 by convention)
 *  Status: CTO_OK -> factor in [0, 1]; CTO_E_INVALID -> NaN.
 *  Accuracy: <= 1 ulp beyond the rounding of exp and log1p (relative 2e-16). */
CTO_API int cto_round_factor(double rate, double days, double basis, int continuous,
                             double *out);

/* =========================================================================
 * Alternating offers (Rubinstein 1982)
 * ========================================================================= */

/*! cto_share: own share, alternating offers, infinite horizon.
 *  Formula (Rubinstein 1982, main theorem; Muthoo 1999 ch.3), with
 *  d_own = own_factor and d_oth = other_factor:
 *    own opens:    surplus (1 - d_oth) / (1 - d_own d_oth)
 *    other opens:  surplus d_own (1 - d_oth) / (1 - d_own d_oth)
 *  1 - d_own d_oth is computed as (1 - d_own) + d_own (1 - d_oth), free of cancellation.
 *  own_factor, other_factor  per-round discount factors in [0, 1]
 *  surplus    money to split, finite; own_opens  own makes the first offer
 *  Status: CTO_OK -> share in [0, surplus];
 *          CTO_E_NO_DEAL (surplus <= 0) -> 0;
 *          CTO_E_INDETERMINATE (both factors 1: every split is an equilibrium) -> NaN;
 *          CTO_E_INVALID -> NaN.
 *  One factor 1 is allowed: the infinitely patient side takes everything
 *  (REFERENCE s.12).  Both 0 is the ultimatum game (the opener takes all).
 *  Accuracy: relative error < 1e-15. */
CTO_API int cto_share(double own_factor, double other_factor, double surplus,
                      int own_opens, double *out);

/*! cto_share_from_rates: cto_share with factors from annual rates, cancellation-free.
 *  Formula: rho_i = c(rate_i) days / basis, c(R) = log1p(R) (annual effective) or
 *    R (continuous); own opens: surplus expm1(-rho_oth) / expm1(-(rho_own + rho_oth));
 *    other opens: surplus exp(-rho_own) expm1(-rho_oth) / expm1(-(rho_own + rho_oth)).
 *  Source: Rubinstein (1982); Muthoo (1999) s.3.2 (delta = exp(-r Delta)).
 *  own_rate, other_rate  annual rates, >= 0; days  time between offers, >= 0
 *  basis  days per year, > 0; continuous  rates are continuously compounded
 *  Status: as cto_share; CTO_E_INDETERMINATE when rho_own = rho_oth = 0 (both
 *  rates 0, or days = 0: use cto_limit_share for the frequent-offer limit).
 *  Accuracy: relative error < 1e-15, also with offers seconds apart. */
CTO_API int cto_share_from_rates(double own_rate, double other_rate, double days,
                                 double surplus, int own_opens, double basis,
                                 int continuous, double *out);

/*! cto_limit_share: own share as offers become infinitely frequent.
 *  Formula: surplus other_rate / (own_rate + other_rate)   (the limit of
 *  cto_share_from_rates with continuous = 1 as days -> 0; for annual effective
 *  rates R pass log1p(R)).
 *  Source: Binmore, Rubinstein & Wolinsky (1986); Muthoo (1999) ch.3.
 *  own_rate, other_rate  continuously compounded rates, >= 0 (any common unit)
 *  Status: CTO_OK; CTO_E_NO_DEAL (surplus <= 0) -> 0;
 *          CTO_E_INDETERMINATE (both rates 0) -> NaN; CTO_E_INVALID -> NaN.
 *  Accuracy: 1 rounding in the quotient (relative 2.2e-16) and 1 in the product. */
CTO_API int cto_limit_share(double own_rate, double other_rate, double surplus,
                            double *out);

/*! cto_breakdown_share: own share with a risk that talks break down for good.
 *  Model (BRW 1986; Muthoo 1999 ch.4; timing of REFERENCE s.4.2): after each
 *  rejection, with probability p talks end and each side gets its fallback b_i at
 *  once; otherwise the rejecter counter-offers next round.  With
 *  alpha_i = (1 - p) d_i and the no-deal value d_i^0 = p b_i / (1 - alpha_i)
 *  (the expected present value of waiting for breakdown), the opener gets
 *      d_open^0 + (surplus - d_own^0 - d_oth^0) (1 - alpha_resp) / (1 - alpha_own alpha_oth)
 *  which equals REFERENCE s.4.2's x* and, with d = 1, s.4.1's b_A + S/(2 - p).
 *  own_factor, other_factor in [0, 1]; breakdown_prob p in [0, 1];
 *  own_fallback, other_fallback: money each side gets on breakdown, finite.
 *  It is cto_solve with no status quo and no walk-away options, and agrees with it
 *  bit for bit.
 *  Status: CTO_OK; CTO_E_NO_DEAL (surplus <= d_own^0 + d_oth^0: perpetual
 *          disagreement) -> d_own^0;
 *          CTO_E_INDETERMINATE (p = 0 and both factors 1) -> NaN; CTO_E_INVALID.
 *  Accuracy: relative error < 1e-15 of the share above the no-deal value. */
CTO_API int cto_breakdown_share(double own_factor, double other_factor,
                                double breakdown_prob, double own_fallback,
                                double other_fallback, double surplus, int own_opens,
                                double *out);

/*! cto_outside_option_share: own share when a responder may walk away.
 *  Model (Shaked & Sutton 1984; Binmore, Shaked & Sutton 1989; Muthoo 1999 ch.5;
 *  Osborne & Rubinstein 1990 ch.3): a responder may accept, counter-offer next
 *  round, or opt out at once for its outside option w_i.  Stationary conditions
 *      surplus - x = max(w_resp, d_resp y),  surplus - y = max(w_open, d_open x)
 *  solved exactly over the four linear regimes (REFERENCE s.5 table).
 *  The option is a constraint, not a threat point (outside option principle).
 *  own_outside, other_outside: money, finite (a negative option never binds).
 *  No deal and delay follow the game of cto_solve (it is cto_solve with no breakdown
 *  and no status quo, bit for bit): a side can walk away only when it answers an
 *  offer, so the opener's first chance is one round on.  The opener either agrees at
 *  once, lets the responder walk away (own gets w_own when the other walks), or
 *  refuses for a round, after which the other side agrees, or the opener walks away.
 *  With both options <= 0 nobody walks and a deal is rational when surplus > 0.
 *  Status: CTO_OK (agreement at once or one round late) -> own's payoff;
 *          CTO_E_NO_DEAL -> own's payoff without agreement (w_own, d_own w_own if own
 *          walks one round on, or 0); CTO_E_INDETERMINATE (both factors 1, unless no
 *          agreement is reached); CTO_E_INVALID.
 *  Accuracy: relative error < 1e-15. */
CTO_API int cto_outside_option_share(double own_factor, double other_factor,
                                     double own_outside, double other_outside,
                                     double surplus, int own_opens, double *out);

/*! cto_inside_option_share: own share with status-quo payoffs during talks.
 *  Model (Muthoo 1999 ch.6): while talks go on each side collects a flow whose
 *  present value over perpetual disagreement is g_i; the opener gets
 *      g_open + (surplus - g_own - g_oth)(1 - d_resp)/(1 - d_own d_oth).
 *  own_inside, other_inside: money (present value of the status quo), finite.
 *  It is cto_solve with no breakdown and no walk-away options, bit for bit.
 *  Status: CTO_OK; CTO_E_NO_DEAL (surplus <= g_own + g_oth) -> g_own;
 *          CTO_E_INDETERMINATE (both factors 1); CTO_E_INVALID.
 *  Accuracy: relative error < 1e-15 of the share above g_own. */
CTO_API int cto_inside_option_share(double own_factor, double other_factor,
                                    double own_inside, double other_inside,
                                    double surplus, int own_opens, double *out);

/* ---- solve: every feature at once ---------------------------------------- */

/*! Input of cto_solve.  Set size = sizeof(cto_solve_input); fields may be appended
 *  in later versions (the library reads only the first `size` bytes it knows). */
typedef struct cto_solve_input {
    size_t size;
    double own_factor;      /* per-round discount factor, [0, 1]                */
    double other_factor;    /* per-round discount factor, [0, 1]                */
    double breakdown_prob;  /* chance talks end after each rejection, [0, 1]    */
    double own_fallback;    /* money to own on breakdown                        */
    double other_fallback;  /* money to other on breakdown                      */
    double own_inside;      /* present value of own's status quo (inside option)*/
    double other_inside;    /* present value of other's status quo              */
    double own_outside;     /* own's walk-away value; used when has_own_outside */
    double other_outside;   /* other's walk-away value; used when has_other_... */
    int has_own_outside;    /* 0: own has no walk-away option                   */
    int has_other_outside;  /* 0: other has no walk-away option                 */
    double surplus;         /* money to split                                   */
    int own_opens;          /* own makes the first offer                        */
} cto_solve_input;

/*! Outcome of cto_solve.  Set size = sizeof(cto_solve_outcome) before the call. */
typedef struct cto_solve_outcome {
    size_t size;
    double own_share;       /* own's payoff (money)                             */
    double other_share;     /* other's payoff (money)                           */
    int binding;            /* CTO_BINDS_NONE / _OWN / _OTHER / _BOTH           */
    int boundary;           /* 1: an option is within 1e-12 x surplus of binding*/
    int deal_rational;      /* 1: the surplus exceeds the no-deal payoffs       */
    double own_no_deal;     /* own's no-deal payoff (see cto_solve)             */
    double other_no_deal;   /* other's no-deal payoff                           */
    /* Appended in 1.x (written when size covers them): */
    int delayed;            /* 1: the agreement comes one round late             */
    double own_delay_loss;  /* own's expected loss if the first offer is refused */
    double other_delay_loss;  /* other's, likewise                               */
    double opening_advantage; /* own's payoff opening minus responding          */
} cto_solve_outcome;

/*! cto_solve: the combined model of the catalogue.  The game (docs/models/combined.md):
 *  own and other alternate offers, the opener first.  The responder accepts (when
 *  indifferent it accepts), walks away if it has a walk-away value w (when walking is
 *  at least as good as rejecting it walks), or rejects.  After a rejection talks break
 *  down with chance p (fallbacks b at once); otherwise each side collects a round of
 *  status-quo income (1 - d) g and the rejecter proposes next round.  When a side walks
 *  away it gets w and the other gets its own w, or, without one, its value of
 *  perpetual disagreement d^0 = (p b + (1-p)(1-d) g)/(1 - alpha), alpha = (1-p) d.
 *  In equilibrium the responder gets max(w, p b + (1-p)((1-d) g + d v)), v its value
 *  as next proposer; the proposer agrees at once, lets the responder walk away, or
 *  refuses for a round, whichever pays it most.  With A the opener,
 *      surplus - x = max(w_B, p b_B + (1-p)((1-d_B) g_B + d_B y))
 *      surplus - y = max(w_A, p b_A + (1-p)((1-d_A) g_A + d_A x))
 *  where both proposers agree (Rubinstein's model on the surplus above (d_A^0, d_B^0)
 *  with factors alpha and options w - d^0, four linear regimes); the other outcomes
 *  are solved exactly over the sixteen combinations of the two states' choices.
 *  Sources: Rubinstein (1982); BRW (1986); Shaked & Sutton (1984); Osborne &
 *  Rubinstein (1990) ch.3; Muthoo (1999) chs.3-6.
 *  A side can walk away only when answering, so the opener's first chance is one round
 *  on, after a possible breakdown, a round of status quo and a round of discounting.
 *  Rational (deal_rational = 1): an agreement on the equilibrium path, in the first
 *  round or one round late (delayed = 1: the opener refuses for a round, then the
 *  other's offer is accepted; the shares are present values and need not add up to
 *  the surplus).  No deal: the responder walks away at once, the opener walks away one
 *  round on, or perpetual disagreement; the shares are those payoffs.
 *  own_no_deal/other_no_deal: on CTO_E_NO_DEAL the shares; on CTO_OK the payoffs of
 *  the same game with every offer unacceptable (what each gets if no deal can be made).
 *  binding: which walk-away options bind in equilibrium (the responder is offered
 *  exactly w), read in both states, so an opener's option can bind.
 *  own_delay_loss, other_delay_loss: each side's payoff minus its value now of the game
 *  after the first offer is refused (breakdown with chance p, else a round of status
 *  quo and discounting, then the other side opens): p b + (1-p)((1-d) g + d v').
 *  opening_advantage: own's payoff when own opens minus own's payoff when other opens.
 *  Status: CTO_OK -> both shares, the binding option, deal_rational = 1;
 *          CTO_E_NO_DEAL -> shares = no-deal payoffs, deal_rational = 0;
 *          CTO_E_INDETERMINATE (p = 0, both factors 1, an agreement anywhere) -> NaN
 *          shares, deal_rational = 1, binding NONE (the table entry point reports
 *          binding as NaN);
 *          CTO_E_INVALID (bad field, NULL, size too small) -> NaN shares.
 *  Accuracy: shares within 1e-15 x the largest money amount (checked against 50-digit
 *  backward induction over the game tree, tests/reference/game_tree); a side's share
 *  formed as a product (no status quo, fallbacks or options) keeps relative 1e-15.
 *  The outcome is written whenever out != NULL and out->size is large enough. */
CTO_API int cto_solve(const cto_solve_input *in, cto_solve_outcome *out);

/*! Input of cto_solve_rates: cto_solve_input with annual rates and the time between
 *  offers in place of the two factors.  Set size = sizeof(cto_solve_rates_input). */
typedef struct cto_solve_rates_input {
    size_t size;
    double own_rate;        /* annual rate, fraction per year, >= 0              */
    double other_rate;      /* annual rate, >= 0                                  */
    double days;            /* time between offers, days, >= 0                    */
    double breakdown_prob;  /* chance talks end after each rejection, [0, 1]    */
    double own_fallback;    /* money to own on breakdown                        */
    double other_fallback;  /* money to other on breakdown                      */
    double own_inside;      /* present value of own's status quo                */
    double other_inside;    /* present value of other's status quo              */
    double own_outside;     /* own's walk-away value; used when has_own_outside */
    double other_outside;   /* other's walk-away value                          */
    int has_own_outside;    /* 0: own has no walk-away option                   */
    int has_other_outside;  /* 0: other has no walk-away option                 */
    double surplus;         /* money to split                                   */
    int own_opens;          /* own makes the first offer                        */
    double basis;           /* days per year, > 0 (365 by convention)           */
    int continuous;         /* rates are continuously compounded                */
} cto_solve_rates_input;

/*! cto_solve_rates (solve_from_rates): cto_solve with per-round factors from rates.
 *  Factors: rho_i = c(rate_i) days / basis, c(R) = log1p(R) (annual effective) or R
 *  (continuous); d_i = exp(-rho_i) and 1 - d_i = -expm1(-rho_i), so that offers
 *  minutes apart keep full accuracy (as cto_share_from_rates).  The model, outcome
 *  and statuses are those of cto_solve; with the factors cto_round_factor gives it
 *  agrees with cto_solve to the last digits wherever 1 - d is exact in the factor.
 *  Sources: as cto_solve; Muthoo (1999) s.3.2 (delta = exp(-r Delta)).
 *  Status: as cto_solve; CTO_E_INDETERMINATE when p = 0 and rho_own = rho_oth = 0
 *  (both rates 0, or days = 0) and an agreement is reached somewhere. */
CTO_API int cto_solve_rates(const cto_solve_rates_input *in, cto_solve_outcome *out);

/*! cto_deadline_share: own share when at most `rounds` offers can be made.
 *  Model (Stahl 1972; Gibbons 1992 s.2.1.D; REFERENCE s.3): proposers alternate,
 *  own proposes in round 1 when own_opens; if the last offer is rejected the
 *  parties get their deadline payoffs (valued at the date of the final rejection).
 *  Exact backward induction.  In each round the proposer either offers the
 *  responder its discounted value of going on or, when that leaves it less than its
 *  own discounted value of waiting, makes an offer that is refused (delay can be an
 *  equilibrium when payoffs are negative).  Runs of agreeing rounds follow
 *      x_{t-2m} = x* + q^m (x_t - x*),  q = d_own d_oth, q^m = exp(m log q),
 *  runs of refused rounds only discount, and alternating runs repeat a two-round
 *  map; each run is crossed at once by bisection, so the cost does not grow with
 *  `rounds` (up to 2^63 - 1).
 *  rounds  count >= 0 (0: no bargaining);  fallbacks: deadline payoffs, money.
 *  Status: CTO_OK -> own's payoff (agreement in round 1, or later where delay is
 *          the equilibrium); CTO_E_NO_DEAL (no agreement in any round, or
 *          rounds = 0) -> own's discounted deadline payoff;
 *          CTO_E_NO_CONVERGENCE (more than 256 changes between agreeing and
 *          refusing runs, or every value below 2^-1000 so that rounding would decide)
 *          -> NaN; CTO_E_INVALID.
 *  Accuracy: relative error < 1e-15 (plus 1e-16 x rounds x |log q| in q^m); a
 *  share that is a product (e.g. S (1 - d) in the second-to-last round) keeps its
 *  relative accuracy however small.  cto_deadline_share_breakdown with
 *  breakdown_prob = 0 is this function, bit for bit. */
CTO_API int cto_deadline_share(double own_factor, double other_factor, int64_t rounds,
                               double own_fallback, double other_fallback,
                               double surplus, int own_opens, double *out);

/*! cto_deadline_share_breakdown: cto_deadline_share with a risk of breakdown.
 *  Model (REFERENCE s.3 with the breakdown timing of s.4.2; BRW 1986; Muthoo 1999
 *  ch.4): after each rejection talks break down with chance p and each side gets its
 *  deadline payoff b_i at once; otherwise the next round comes, discounted.  A
 *  responder's value of rejecting is p b + (1-p) d v = (1 - a) d^0 + a v with
 *  a = (1-p) d and d^0 = p b / (1 - a); above d^0 this is the deadline model on
 *  factors a, deadline payoffs b - d^0 and surplus S - d_own^0 - d_oth^0, solved by
 *  the same induction (1 - a = p + (1-p)(1-d) without cancellation).
 *  breakdown_prob p in [0, 1] (catalogue argument 7, default 0); the other
 *  arguments, statuses and accuracy as cto_deadline_share (no deal -> own's payoff
 *  without agreement, including the breakdown prospects). */
CTO_API int cto_deadline_share_breakdown(double own_factor, double other_factor,
                                         int64_t rounds, double own_fallback,
                                         double other_fallback, double surplus,
                                         int own_opens, double breakdown_prob,
                                         double *out);

/*! cto_fixed_cost_share: own share when each round costs a fixed amount.
 *  Model (Rubinstein 1982, fixed-cost case; REFERENCE s.2 generalised table):
 *    own cost < other cost: opener own gets surplus; opener other keeps min(c_own, S)
 *    own cost > other cost: opener own gets min(c_oth, S); opener other takes all.
 *  own_cost, other_cost  money per round, >= 0.
 *  Status: CTO_OK; CTO_E_NO_DEAL (surplus <= 0) -> 0;
 *          CTO_E_INDETERMINATE (equal costs below the surplus: any split in
 *          [c, surplus] is an equilibrium) -> NaN; CTO_E_INVALID.
 *  The outcome jumps at equal costs: treat near-equal costs with care. */
CTO_API int cto_fixed_cost_share(double own_cost, double other_cost, double surplus,
                                 int own_opens, double *out);

/*! cto_delay_cost: expected value one party loses if agreement slips one round.
 *  Formula: stake - ((1-p) factor stake + p fallback)
 *         = p (stake - fallback) + (1-p)(1-factor) stake    (computed this way).
 *  Source: REFERENCE s.10 (holding cost (1 - d) s), s.4.2 timing.
 *  factor in [0,1]; stake: money at stake, finite; p in [0,1]; fallback: money.
 *  Status: CTO_OK; CTO_E_INVALID -> NaN.   Accuracy: relative error < 1e-15. */
CTO_API int cto_delay_cost(double factor, double stake, double breakdown_prob,
                           double fallback, double *out);

/*! cto_first_mover_advantage: own share as opener minus own share as responder.
 *  Formula: surplus (1 - d_own)(1 - d_oth) / (1 - d_own d_oth)  (REFERENCE s.10;
 *  equal for both parties).  Source: Rubinstein (1982); Muthoo (1999) ch.3.
 *  Status: CTO_OK; CTO_E_NO_DEAL (surplus <= 0) -> 0; CTO_E_INDETERMINATE
 *  (both factors 1); CTO_E_INVALID.   Accuracy: relative error < 1e-15. */
CTO_API int cto_first_mover_advantage(double own_factor, double other_factor,
                                      double surplus, double *out);

/* =========================================================================
 * Nash bargaining and risk aversion
 * ========================================================================= */

/*! cto_nash_share: own amount in the generalised Nash bargaining solution.
 *  Maximises (u_o(x) - u_o(b_o))^tau (u_t(S-x) - u_t(b_t))^(1-tau) over x, with
 *  u(x) = x^a (a = curvature in (0, 1]; a = 1 is risk neutral).
 *  Linear: x = b_o + tau (S - b_o - b_t).  Curvature below 1 and zero fallbacks:
 *  x = S a_o tau / (a_o tau + a_t (1 - tau)); otherwise the first-order condition is
 *  solved by a bracketed root finder (Brent 1973) to full double precision.
 *  Sources: Nash (1950); Kalai (1977); Muthoo (1999) ch.2; REFERENCE s.7.
 *  own_fallback, other_fallback  disagreement payoffs, money (>= 0 when a
 *  curvature is below 1); own_weight tau in [0,1]; curvatures in (0, 1].
 *  Status: CTO_OK; CTO_E_NO_DEAL (S <= b_o + b_t) -> b_o; CTO_E_NO_CONVERGENCE;
 *          CTO_E_INVALID.   Accuracy: relative error < 1e-15. */
CTO_API int cto_nash_share(double own_fallback, double other_fallback,
                           double own_weight, double surplus, double own_curvature,
                           double other_curvature, double *out);

/*! cto_risk_averse_share: alternating offers with concave utilities.
 *  Stationary conditions (BRW 1986; Muthoo 1999 ch.3-4; REFERENCE s.7, s.4.1),
 *  with A the opener:
 *      u_B(S - x) = p u_B(b_B) + (1-p) d_B u_B(y),
 *      u_A(S - y) = p u_A(b_A) + (1-p) d_A u_A(x).
 *  utility = CTO_UTILITY_POWER: u = x^a, a in (0, 1]; with p = 0 the closed form
 *  uses effective factors d^(1/a).  CTO_UTILITY_EXPONENTIAL: u = (1 - e^(-k x))/k,
 *  k > 0 (shares then depend on the scale of the surplus).  Otherwise the
 *  conditions are reduced to one equation in the first-mover gap x + y - S, which
 *  is well conditioned near d = 1, and solved to full double precision: for
 *  exponential utility by Newton's method with the exact derivative, safeguarded by
 *  bisection (Numerical Recipes 3rd ed. s.9.4), started at the Rubinstein share with
 *  factors (1-p) d; otherwise, or if Newton does not settle, by Brent's method (Brent
 *  1973); running out of iterations is CTO_E_NO_CONVERGENCE.
 *  Fallbacks must be >= 0 for power utility.
 *  Status: CTO_OK; CTO_E_NO_DEAL (S <= c_own + c_oth, c_i the certainty
 *  equivalent of waiting for breakdown, u_i^-1(p u_i(b_i)/(1 - alpha_i))) -> c_own;
 *  CTO_E_INDETERMINATE (p = 0, both factors 1); CTO_E_NO_CONVERGENCE; CTO_E_INVALID.
 *  Accuracy: relative error < 1e-15 (absolute 1e-15 x surplus near zero). */
CTO_API int cto_risk_averse_share(double own_factor, double other_factor,
                                  double own_curvature, double other_curvature,
                                  int utility, double breakdown_prob,
                                  double own_fallback, double other_fallback,
                                  double surplus, int own_opens, double *out);

/* =========================================================================
 * More than two parties
 * ========================================================================= */

/*! cto_group_share: unanimity bargaining among n parties, stationary equilibrium.
 *  Formula (Herrero 1985; Sutton 1986; Osborne & Rubinstein 1990 s.3.13):
 *    share of the party k places after the proposer = S d^k (1 - d)/(1 - d^n),
 *  with 1 - d^n = -expm1(n log d).  n = 1: the single party takes S.
 *  factor d in [0,1]; parties n >= 1; position k in [0, n-1].
 *  Status: CTO_OK; CTO_E_NO_DEAL (S <= 0) -> 0; CTO_E_INDETERMINATE (d = 1 and
 *  n >= 2); CTO_E_INVALID.   Accuracy: relative error < 1e-15. */
CTO_API int cto_group_share(double factor, int64_t parties, int64_t position,
                            double surplus, double *out);

/*! cto_majority_share: Baron & Ferejohn (1989) closed-rule legislative bargaining.
 *  Formula: proposer S (1 - d (q - 1)/n) = S ((n - q + 1) + (1 - d)(q - 1))/n;
 *           each coalition partner S d / n.   q = votes needed (proposer included).
 *  votes_needed 0 means a simple majority, q = floor(n/2) + 1; else 1 <= q <= n.
 *  role CTO_ROLE_PROPOSER or CTO_ROLE_PARTNER (a partner exists only when q >= 2).
 *  Status: CTO_OK; CTO_E_NO_DEAL (S <= 0) -> 0; CTO_E_INVALID.
 *  Accuracy: relative error < 1e-15. */
CTO_API int cto_majority_share(double factor, int64_t parties, int64_t votes_needed,
                               int role, double surplus, double *out);

/* =========================================================================
 * Inverse problems and sensitivities
 * ========================================================================= */

/*! cto_implied_factor: own per-round factor that makes an observed split the
 *  Rubinstein equilibrium (inverse of cto_share with surplus 1).
 *  Own opens: 1 - d_own = (1 - s)(1 - d_oth)/(s d_oth), needs s in [1 - d_oth, 1].
 *  Other opens: 1 - d_own = (1 - s)(1 - d_oth)/(s + (1 - s)(1 - d_oth)).
 *  observed_share s: own's fraction of the surplus, [0, 1]; other_factor in [0,1].
 *  Status: CTO_OK -> factor in [0,1]; CTO_E_INDETERMINATE (the share does not
 *  depend on own's factor: other_factor 0 with own opening (share 1), or
 *  other_factor 1 (share 0), at the only reachable share) -> NaN;
 *  CTO_E_INVALID (share not reachable by any factor in [0,1]) -> NaN.
 *  Accuracy: relative error < 1e-15 in 1 - d. */
CTO_API int cto_implied_factor(double observed_share, double other_factor,
                               int own_opens, double *out);

/*! cto_implied_rate: cto_implied_factor as an annual rate.
 *  With rho_oth = c(other_rate) days/basis: own opens m = (1-s) expm1(rho_oth)/s,
 *  other opens m = (1-s) u / (s + (1-s) u), u = -expm1(-rho_oth); then
 *  rho_own = -log1p(-m) and rate = rho_own basis/days (continuous) or
 *  expm1(rho_own basis / days) (annual effective).
 *  Status: CTO_OK -> rate >= 0; CTO_E_INDETERMINATE (days = 0 or the share does
 *  not depend on own's rate); CTO_E_INVALID (share not reachable with a finite
 *  rate, or bad input).   Accuracy: relative error < 1e-14. */
CTO_API int cto_implied_rate(double observed_share, double other_rate, double days,
                             int own_opens, double basis, int continuous,
                             double *out);

/*! cto_share_sensitivity: exact derivative of cto_share_from_rates's own share
 *  with respect to own's (wrt = CTO_WRT_OWN) or other's (CTO_WRT_OTHER) annual
 *  rate, in money per unit of rate (per 1.00 = 100 percentage points).
 *  With a = -expm1(-rho_own), b = -expm1(-rho_oth), D = -expm1(-(rho_own+rho_oth)):
 *    own opens:   d/d rho_own = -S b e^-(rho_own+rho_oth)/D^2,
 *                 d/d rho_oth =  S a e^-rho_oth / D^2;
 *    other opens: d/d rho_own = -S b e^-rho_own / D^2,
 *                 d/d rho_oth =  S a e^-(rho_own+rho_oth) / D^2;
 *  times d rho/d rate = days/basis / (1 + rate) (effective) or days/basis.
 *  Status: as cto_share_from_rates.   Accuracy: relative error < 1e-15. */
CTO_API int cto_share_sensitivity(double own_rate, double other_rate, double days,
                                  int wrt, double surplus, int own_opens,
                                  double basis, int continuous, double *out);

/* =========================================================================
 * Incomplete information
 * ========================================================================= */

/*! cto_screening_profit: seller's best expected revenue over two price offers to a
 *  buyer of unknown value (Fudenberg & Tirole 1983 setting; REFERENCE s.9).
 *  The maximum of  pool v_L;  screen q((1-d_b) v_H + d_b v_L) + (1-q) d_s v_L;
 *  and, when q > v_L/v_H, skim v_H((q v_H - v_L) + d_s (1-q) v_L)/(v_H - v_L).
 *  high_value v_H >= low_value v_L > 0 (money); high_prob q in [0,1];
 *  seller_factor d_s, buyer_factor d_b in [0,1].
 *  Status: CTO_OK; CTO_E_INVALID -> NaN.   Accuracy: relative error < 1e-15. */
CTO_API int cto_screening_profit(double high_value, double low_value,
                                 double high_prob, double seller_factor,
                                 double buyer_factor, double *out);

/* =========================================================================
 * Private information: two-sided private values
 * ========================================================================= */

/* Regimes of cto_double_auction (pinned; only ever appended). */
#define CTO_TRADE_NONE 0        /* buyer_high <= seller_low: no gains from trade      */
#define CTO_TRADE_ONE_PRICE 1   /* only one-price equilibria                           */
#define CTO_TRADE_TRIANGLE 2    /* linear equilibrium, no clamp binds                  */
#define CTO_TRADE_CLAMPED 3     /* linear equilibrium with clamped asks and/or bids     */
#define CTO_TRADE_POSTED_ASK 4  /* the seller's cost is known: a posted ask           */
#define CTO_TRADE_POSTED_BID 5  /* the buyer's value is known: a posted bid           */
/* Flags of cto_double_auction, or-ed together. */
#define CTO_TRADE_FLAG_ONE_PRICE_EXISTS 1   /* efficient one-price equilibria exist    */
#define CTO_TRADE_FLAG_CONVENTION 2         /* expected_price is a convention's value  */
#define CTO_TRADE_FLAG_NEAR_BOUNDARY 4      /* within 1e-9 D of a regime boundary      */
#define CTO_TRADE_FLAG_FIRST_BEST_FEASIBLE 8 /* some mechanism attains the first best  */

/*! Outcome of cto_double_auction.  Set size = sizeof(cto_trade_outcome) before the call;
 *  fields are only ever appended.  Money in the units of the inputs. */
typedef struct cto_trade_outcome {
    size_t size;
    int regime;                      /* CTO_TRADE_*                                   */
    int flags;                       /* CTO_TRADE_FLAG_* bits                         */
    double trade_probability;        /* P(trade)                                      */
    double expected_price;           /* E[price | trade]; NaN without trade           */
    double buyer_gain;               /* E[(v - p) 1{trade}], ex ante                  */
    double seller_gain;              /* E[(p - c) 1{trade}], ex ante                  */
    double total_gain;               /* buyer_gain + seller_gain                      */
    double first_best_gain;          /* E[(v - c)+]                                   */
    double first_best_probability;   /* P(v >= c)                                     */
    double second_best_gain;         /* Myerson-Satterthwaite bound on any mechanism  */
    double second_best_threshold;    /* g*: trade iff v - c >= g* in the best rule    */
    double second_best_probability;  /* P(v - c >= g*)                                */
    double efficiency;               /* total_gain / first_best_gain                  */
    double second_best_efficiency;   /* second_best_gain / first_best_gain            */
    double price_low, price_high;    /* one-price interval [s_hi, b_lo], else NaN     */
    double ask_floor;                /* the lowest ask (clamp); NaN if not linear     */
    double bid_ceiling;              /* the highest bid (clamp); NaN if not linear    */
} cto_trade_outcome;

/*! cto_double_auction: the linear equilibrium of the k-double auction with uniform private
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
 *  Added in 1.1. */
CTO_API int cto_double_auction(double seller_low, double seller_high, double buyer_low,
                               double buyer_high, double k, cto_trade_outcome *out);

/*! cto_trade_probability: P(trade) of cto_double_auction (same arguments and statuses;
 *  0 with CTO_E_NO_DEAL, NaN with CTO_E_INVALID), as a scalar function.  Added in 1.1. */
CTO_API int cto_trade_probability(double seller_low, double seller_high, double buyer_low,
                                  double buyer_high, double k, double *out);

/* =========================================================================
 * Private information: repeated offers to a side of unknown value
 * ========================================================================= */

#define CTO_OFFERER_SELLER 0  /* we sell to a buyer of unknown value                   */
#define CTO_OFFERER_BUYER 1   /* we buy from a seller of unknown cost (procurement)     */

/*! Totals of cto_offer_path.  Set size = sizeof(cto_offer_outcome) before the call;
 *  fields are only ever appended. */
typedef struct cto_offer_outcome {
    size_t size;
    int regime;                    /* 0 no deal, 1 known value, 2 no gap, 3 gap,
                                      4 immediate with open timing, 5 closed form       */
    int reserved;
    int64_t rounds_used;           /* rounds with a positive chance of agreement; -1: none*/
    int64_t rows_written;          /* rows written by cto_offer_path_rows               */
    int64_t stages, pieces;        /* gap case: stage functions and most pieces of one  */
    double agreement_probability;  /* by the deadline, or ever                          */
    double expected_round;         /* E[round | agreement]; 1 = the first offer         */
    double offerer_value;          /* the offerer's expected present value, ex ante     */
    double responder_value;        /* the responder's expected present value, ex ante   */
    double opening_offer;          /* the first offer                                   */
    double last_cutoff;            /* the cutoff type after the last round              */
} cto_offer_outcome;

/*! One round of cto_offer_path_rows. */
typedef struct cto_offer_row {
    double offer;                  /* the price offered in this round                   */
    double cutoff;                 /* types beyond it (in the responder's favour) have
                                      agreed by the end of the round                    */
    double round_probability;      /* P(agreement in this round)                        */
    double cumulative_probability; /* P(agreement by the end of this round)             */
} cto_offer_row;

/*! cto_offer_path: repeated offers to a responder of unknown value, the perfect Bayesian
 *  equilibrium with skimming (higher values agree earlier): Sobel & Takahashi (1983) for
 *  the finite horizon, Stokey (1981), Fudenberg, Levine & Tirole (1985) and Gul,
 *  Sonnenschein & Wilson (1986) for no deadline, Fudenberg & Tirole (1991) ch. 10 (all
 *  from memory); the general-interval forms, the gap algorithm and the mirror case are
 *  derived in docs/models/private-information.md s.2.
 *  offerer = seller: a seller of cost c = known_value offers p_1, p_2, ... to a buyer of
 *  value v ~ U[lo, hi]; agreement in round t pays the seller d_s^(t-1)(p_t - c) and the
 *  buyer d_b^(t-1)(v - p_t).  offerer = buyer: a buyer of value u = known_value offers to
 *  a seller of cost c ~ U[lo, hi] (procurement); the same game with money reversed.
 *  Without a gap (c >= lo; buyer offers: u <= hi), with H = hi - c (u - lo) and L = hi - lo:
 *      l_1 = m_1 = 1/2;  g_n = 1 - d_b + d_b l_(n-1),  m_n = g_n/(2 g_n - d_s l_(n-1)),
 *      l_n = g_n m_n;  round t (n = T - t + 1 rounds left): price c + l_n H_(t-1),
 *      H_t = m_n H_(t-1), cutoff c + H_t  (buyer offers: u - l_n H_(t-1), u - H_t);
 *  no deadline: m = 1/(1 + sqrt(1 - d_s)), l = (1 - d_b) m/(1 - d_b m), price
 *  c + l m^(t-1) H, E[round | agreement] = 1/(1 - m), offerer value l H^2/(2L).
 *  With a gap (c < lo) the stage functions are piecewise polynomial and are built exactly.
 *  Arguments: private_low <= private_high (money), offerer_factor, responder_factor per
 *  round in [0, 1], rounds >= 0 (0: no deadline), known_value (money), offerer 0 seller /
 *  1 buyer; rows: the caller's buffer of `capacity` rows (may be NULL with capacity 0).
 *  Status: CTO_OK -> totals and min(rounds_used, capacity) rows;
 *          CTO_E_NO_DEAL (no type gains: hi <= c; buyer offers: lo >= u) -> probabilities
 *          and values 0, rounds 0, the rest NaN;
 *          CTO_E_INDETERMINATE (no deadline, no gap, responder_factor = 1 < offerer_factor's
 *          complement: the price falls to cost at once, timing open) -> offerer value 0,
 *          responder value E[gain], agreement probability and opening offer (the cost or
 *          value), the rest NaN, no rows;
 *          CTO_E_NO_CONVERGENCE (gap: the piecewise recursion exceeded its fixed work
 *          space) -> NaN;
 *          CTO_E_INVALID (NaN or infinite money, private_low > private_high (index 1),
 *          factor outside [0, 1], rounds < 0, offerer not 0 or 1, offerer_factor = 1 with
 *          no deadline (index 2: the price never falls in finite time), spreads that
 *          overflow) -> every field NaN.
 *  Accuracy: relative error <= 1e-14 against 50-digit backward induction
 *  (tests/reference/private); the finite recursion loses about one ulp a round in the
 *  late rows.  Cost: O(1) without a deadline, O(rounds) with one (no gap), no allocation.
 *  cto_offer_path gives the totals; cto_offer_path_rows also the rows per round.
 *  Added in 1.1. */
CTO_API int cto_offer_path(double private_low, double private_high, double offerer_factor,
                           double responder_factor, int64_t rounds, double known_value,
                           int offerer, cto_offer_outcome *out);

/*! cto_offer_path_rows: cto_offer_path with the rows per round written into rows[0 ..
 *  capacity) (out->rows_written of them; rows may be NULL with capacity 0).  The totals
 *  are always complete.  Added in 1.1. */
CTO_API int cto_offer_path_rows(double private_low, double private_high,
                                double offerer_factor, double responder_factor,
                                int64_t rounds, double known_value, int offerer,
                                cto_offer_row *rows, int64_t capacity, cto_offer_outcome *out);

/*! cto_agreement_probability, cto_expected_agreement_round, cto_opening_offer: totals of
 *  cto_offer_path as scalar functions (same arguments and statuses; NaN where the
 *  total has no value).  Added in 1.1. */
CTO_API int cto_agreement_probability(double private_low, double private_high,
                                      double offerer_factor, double responder_factor,
                                      int64_t rounds, double known_value, int offerer,
                                      double *out);
CTO_API int cto_expected_agreement_round(double private_low, double private_high,
                                         double offerer_factor, double responder_factor,
                                         int64_t rounds, double known_value, int offerer,
                                         double *out);
CTO_API int cto_opening_offer(double private_low, double private_high, double offerer_factor,
                              double responder_factor, int64_t rounds, double known_value,
                              int offerer, double *out);

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
 * Memory: 16 R n bytes at the final size, at most 256 MiB.
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

#ifdef __cplusplus
} /* extern "C" */
#endif

#endif /* COUNTEROFFER_COUNTEROFFER_H */
