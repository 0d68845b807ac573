// Powers of discount factors, accurate near 1 (shared by the model families).
#ifndef CTO_MODELS_POWERS_HPP
#define CTO_MODELS_POWERS_HPP

#include <cmath>

namespace cto::core {

// log(d) accurately for d near 1 (1 - d is exact for d >= 1/2).
inline double log_factor(double d) { return d > 0.5 ? std::log1p(-(1.0 - d)) : std::log(d); }

// q^m for m >= 0 with q in [0, 1], as exp(m log q).
inline double pow_count(double log_q, double m) {
    if (m == 0.0) return 1.0;
    return std::exp(m * log_q);
}

}  // namespace cto::core

#endif  // CTO_MODELS_POWERS_HPP
