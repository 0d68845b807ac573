/*
 * counteroffer/complete.h -- the complete-information models: discounting, alternating offers and their extensions (breakdown, walk-away and status-quo options, the combined model, deadlines, fixed costs), Nash bargaining and risk aversion, more than two parties, inverse problems, two-period screening.
 * A part of the public interface: include counteroffer/counteroffer.h, which includes
 * every part inside its extern "C" block.
 */
#ifndef COUNTEROFFER_COMPLETE_H
#define COUNTEROFFER_COMPLETE_H

#ifndef COUNTEROFFER_COUNTEROFFER_H
#error "include counteroffer/counteroffer.h, not its parts"
#endif

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
 *  (docs/models/complete-information.md s.1, edge cases).  Both 0 is the ultimatum game (the opener takes all).
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
 *  Model (BRW 1986; Muthoo 1999 ch.4; timing of docs/models/complete-information.md s.4): after each
 *  rejection, with probability p talks end and each side gets its fallback b_i at
 *  once; otherwise the rejecter counter-offers next round.  With
 *  alpha_i = (1 - p) d_i and the no-deal value d_i^0 = p b_i / (1 - alpha_i)
 *  (the expected present value of waiting for breakdown), the opener gets
 *      d_open^0 + (surplus - d_own^0 - d_oth^0) (1 - alpha_resp) / (1 - alpha_own alpha_oth)
 *  which equals the x* of docs/models/complete-information.md s.4 and, with d = 1, its
 *  b_A + (S - b_A - b_B)/(2 - p).
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
 *  solved exactly over the four linear regimes (docs/models/complete-information.md s.5 table).
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
 *  Model (Ståhl 1972; Gibbons 1992 s.2.1.D; docs/models/complete-information.md s.3): proposers alternate,
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
 *  Model (docs/models/complete-information.md s.3 with the breakdown timing of s.4; BRW 1986; Muthoo 1999
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
 *  Model (Rubinstein 1982, fixed-cost case; docs/models/complete-information.md s.2, generalised):
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
 *  Source: docs/models/complete-information.md s.4 (delay cost, and the timing of a breakdown).
 *  factor in [0,1]; stake: money at stake, finite; p in [0,1]; fallback: money.
 *  Status: CTO_OK; CTO_E_INVALID -> NaN.   Accuracy: relative error < 1e-15. */
CTO_API int cto_delay_cost(double factor, double stake, double breakdown_prob,
                           double fallback, double *out);

/*! cto_first_mover_advantage: own share as opener minus own share as responder.
 *  Formula: surplus (1 - d_own)(1 - d_oth) / (1 - d_own d_oth)  (docs/models/complete-information.md s.10;
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
 *  Sources: Nash (1950); Kalai (1977); Muthoo (1999) ch.2; docs/models/complete-information.md s.8.
 *  own_fallback, other_fallback  disagreement payoffs, money (>= 0 when a
 *  curvature is below 1); own_weight tau in [0,1]; curvatures in (0, 1].
 *  Status: CTO_OK; CTO_E_NO_DEAL (S <= b_o + b_t) -> b_o; CTO_E_NO_CONVERGENCE;
 *          CTO_E_INVALID.   Accuracy: relative error < 1e-15. */
CTO_API int cto_nash_share(double own_fallback, double other_fallback,
                           double own_weight, double surplus, double own_curvature,
                           double other_curvature, double *out);

/*! cto_risk_averse_share: alternating offers with concave utilities.
 *  Stationary conditions (BRW 1986; Muthoo 1999 ch.3-4; docs/models/complete-information.md s.8, s.4),
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
 *  buyer of unknown value (Fudenberg & Tirole 1983 setting; docs/models/complete-information.md s.12).
 *  The maximum of  pool v_L;  screen q((1-d_b) v_H + d_b v_L) + (1-q) d_s v_L;
 *  and, when q > v_L/v_H, skim v_H((q v_H - v_L) + d_s (1-q) v_L)/(v_H - v_L).
 *  high_value v_H >= low_value v_L > 0 (money); high_prob q in [0,1];
 *  seller_factor d_s, buyer_factor d_b in [0,1].
 *  Status: CTO_OK; CTO_E_INVALID -> NaN.   Accuracy: relative error < 1e-15. */
CTO_API int cto_screening_profit(double high_value, double low_value,
                                 double high_prob, double seller_factor,
                                 double buyer_factor, double *out);


#endif /* COUNTEROFFER_COMPLETE_H */
