// Alternating offers from annual rates; inverse problems and sensitivities.
// Each function validates its inputs, writes *out on every path and returns a CTO_* status
// (see core.hpp); formulas and sources are documented in the public header.
#ifndef CTO_MODELS_RATES_HPP
#define CTO_MODELS_RATES_HPP

#include <cstdint>

#include "../core.hpp"

namespace cto::core {

int share_from_rates(double own_rate, double other_rate, double days, double surplus,
                     bool own_opens, double basis, bool continuous, double *out, int *bad);
int limit_share(double own_rate, double other_rate, double surplus, double *out, int *bad);
int implied_factor(double observed_share, double other_factor, bool own_opens, double *out,
                   int *bad);
int implied_rate(double observed_share, double other_rate, double days, bool own_opens,
                 double basis, bool continuous, double *out, int *bad);
int share_sensitivity(double own_rate, double other_rate, double days, int wrt, double surplus,
                      bool own_opens, double basis, bool continuous, double *out, int *bad);

}  // namespace cto::core

#endif  // CTO_MODELS_RATES_HPP
