// More than two parties: unanimity and majority rule.
// Each function validates its inputs, writes *out on every path and returns a CTO_* status
// (see core.hpp); formulas and sources are documented in the public header.
#ifndef CTO_MODELS_PARTIES_HPP
#define CTO_MODELS_PARTIES_HPP

#include <cstdint>

#include "../core.hpp"

namespace cto::core {

int group_share(double factor, int64_t parties, int64_t position, double surplus, double *out,
                int *bad);
int majority_share(double factor, int64_t parties, int64_t votes_needed, int role,
                   double surplus, double *out, int *bad);

}  // namespace cto::core

#endif  // CTO_MODELS_PARTIES_HPP
