// Conversion of the generic double arguments of cto_call / cto_call_strided into the
// core's types.  A value that does not convert is an invalid argument at its index.
#ifndef CTO_TABLE_CONVERT_HPP
#define CTO_TABLE_CONVERT_HPP

#include <cmath>
#include <cstdint>

#include "../core.hpp"

namespace cto::table {

// A boolean travels as 0 or 1; anything else is invalid.
inline bool to_bool(double x, bool &v) {
    if (x == 0.0) {
        v = false;
        return true;
    }
    if (x == 1.0) {
        v = true;
        return true;
    }
    return false;
}
// A whole number in [lo, 2^63).
inline bool to_count(double x, int64_t lo, int64_t &v) {
    if (!(x >= static_cast<double>(lo) && x < 9223372036854775808.0) || x != std::floor(x))
        return false;
    v = static_cast<int64_t>(x);
    return true;
}
// A whole number indexing n choices.
inline bool to_choice(double x, int n, int &v) {
    if (!(x >= 0.0 && x < n) || x != std::floor(x)) return false;
    v = static_cast<int>(x);
    return true;
}
// The invalid-argument outcome of a function with n_out outputs.
inline int reject(int index, double *o, int n_out, int *bad) {
    for (int k = 0; k < n_out; ++k) o[k] = core::kNaN;
    if (bad) *bad = index;
    return CTO_E_INVALID;
}

}  // namespace cto::table

#endif  // CTO_TABLE_CONVERT_HPP
