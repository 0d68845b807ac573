#include "numerics.hpp"

#include <algorithm>

namespace cto::num {

double log_sum_exp3(double a, double b, double c) {
    const double m = std::max(a, std::max(b, c));
    if (m == -INFINITY) return -INFINITY;
    return m + std::log(std::exp(a - m) + std::exp(b - m) + std::exp(c - m));
}

}  // namespace cto::num
