// The combined model (solve) and its special cases: breakdown, walk-away and status-quo options.
// Each function validates its inputs, writes *out on every path and returns a CTO_* status
// (see core.hpp); formulas and sources are documented in the public header.
#ifndef CTO_MODELS_COMBINED_HPP
#define CTO_MODELS_COMBINED_HPP

#include <cstdint>

#include "../core.hpp"

namespace cto::core {

int breakdown_share(double own_factor, double other_factor, double p, double own_fallback,
                    double other_fallback, double surplus, bool own_opens, double *out,
                    int *bad);
int outside_option_share(double own_factor, double other_factor, double own_outside,
                         double other_outside, double surplus, bool own_opens, double *out,
                         int *bad);
int inside_option_share(double own_factor, double other_factor, double own_inside,
                        double other_inside, double surplus, bool own_opens, double *out,
                        int *bad);

// The combined model (cto_solve).  Outside options: -infinity means absent.
struct SolveIn {
    double own_factor, other_factor, p, own_fallback, other_fallback, own_inside,
        other_inside, own_outside, other_outside, surplus;
    bool own_opens;
};
struct SolveOut {
    double own_share, other_share, own_no_deal, other_no_deal;
    int binding;  // CTO_BINDS_*
    bool boundary;
    bool rational;  // an agreement is reached on the equilibrium path
    bool delayed;   // ... one round late (the opener's first offer is refused on purpose)
    // Each side's expected loss if the first offer is refused and play goes on from the
    // next round (the other side proposing), and own's payoff opening minus responding
    // (docs/models/combined.md, "Delay loss and opening advantage").
    double own_delay_loss, other_delay_loss, opening_advantage;
};
// Validates (argument indices in the catalogue order of `solve`), then solves.
int solve(const SolveIn &in, SolveOut *out, int *bad);

// The combined model from annual rates (solve_from_rates): per-round log discount
// rho = c(rate) days / basis as in share_from_rates, factor exp(-rho) and 1 - factor =
// -expm1(-rho) (no cancellation with offers minutes apart).  Outside = -infinity: absent.
struct SolveRatesIn {
    double own_rate, other_rate, days, p, own_fallback, other_fallback, own_inside,
        other_inside, own_outside, other_outside, surplus;
    bool own_opens;
    double basis;
    bool continuous;
};
// Validates (indices: own_rate 0, other_rate 1, days 2, breakdown_prob 3, own_fallback 4,
// other_fallback 5, own_inside 6, other_inside 7, own_outside 8, other_outside 9,
// surplus 10, own_opens 11, basis 12, continuous 13), then solves.
int solve_rates(const SolveRatesIn &in, SolveOut *out, int *bad);

}  // namespace cto::core

#endif  // CTO_MODELS_COMBINED_HPP
