// The deadline model: at most `rounds` offers.
// Each function validates its inputs, writes *out on every path and returns a CTO_* status
// (see core.hpp); formulas and sources are documented in the public header.
#ifndef CTO_MODELS_DEADLINE_HPP
#define CTO_MODELS_DEADLINE_HPP

#include <cstdint>

#include "../core.hpp"

namespace cto::core {

int deadline_share(double own_factor, double other_factor, int64_t rounds, double own_fallback,
                   double other_fallback, double surplus, bool own_opens, double *out,
                   int *bad);
// deadline_share with a chance p of breakdown after each rejection (the deadline payoffs
// paid at once); catalogue index of p: 7.  Equals deadline_share bit for bit at p = 0.
int deadline_share_breakdown(double own_factor, double other_factor, int64_t rounds,
                             double own_fallback, double other_fallback, double surplus,
                             bool own_opens, double p, double *out, int *bad);

}  // namespace cto::core

#endif  // CTO_MODELS_DEADLINE_HPP
