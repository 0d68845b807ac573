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
    bool rational;
};
// Validates (argument indices in the catalogue order of `solve`), then solves.
int solve(const SolveIn &in, SolveOut *out, int *bad);

}  // namespace cto::core

#endif  // CTO_MODELS_COMBINED_HPP
