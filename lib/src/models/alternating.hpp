// Alternating offers: fixed costs, one round of delay, the first-mover advantage.
// Each function validates its inputs, writes *out on every path and returns a CTO_* status
// (see core.hpp); formulas and sources are documented in the public header.
#ifndef CTO_MODELS_ALTERNATING_HPP
#define CTO_MODELS_ALTERNATING_HPP

#include <cstdint>

#include "../core.hpp"

namespace cto::core {

int fixed_cost_share(double own_cost, double other_cost, double surplus, bool own_opens,
                     double *out, int *bad);
int delay_cost(double factor, double stake, double p, double fallback, double *out, int *bad);
int first_mover_advantage(double own_factor, double other_factor, double surplus, double *out,
                          int *bad);

}  // namespace cto::core

#endif  // CTO_MODELS_ALTERNATING_HPP
