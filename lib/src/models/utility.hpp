// Utilities: the generalised Nash solution and risk-averse alternating offers.
// Each function validates its inputs, writes *out on every path and returns a CTO_* status
// (see core.hpp); formulas and sources are documented in the public header.
#ifndef CTO_MODELS_UTILITY_HPP
#define CTO_MODELS_UTILITY_HPP

#include <cstdint>

#include "../core.hpp"

namespace cto::core {

int nash_share(double own_fallback, double other_fallback, double own_weight, double surplus,
               double own_curvature, double other_curvature, double *out, int *bad);
int risk_averse_share(double own_factor, double other_factor, double own_curvature,
                      double other_curvature, int utility, double p, double own_fallback,
                      double other_fallback, double surplus, bool own_opens, double *out,
                      int *bad);

}  // namespace cto::core

#endif  // CTO_MODELS_UTILITY_HPP
