// Incomplete information: two-period screening.
// Each function validates its inputs, writes *out on every path and returns a CTO_* status
// (see core.hpp); formulas and sources are documented in the public header.
#ifndef CTO_MODELS_INCOMPLETE_HPP
#define CTO_MODELS_INCOMPLETE_HPP

#include <cstdint>

#include "../core.hpp"

namespace cto::core {

int screening_profit(double high_value, double low_value, double high_prob,
                     double seller_factor, double buyer_factor, double *out, int *bad);

}  // namespace cto::core

#endif  // CTO_MODELS_INCOMPLETE_HPP
