// The guard of every named C function: the output pointer is checked, and no C++
// exception crosses the C boundary (the core throws none; the guard turns a defect into
// CTO_E_INTERNAL instead of undefined behaviour).
#ifndef CTO_CAPI_GUARD_HPP
#define CTO_CAPI_GUARD_HPP

#include "../core.hpp"

namespace cto::capi {

template <class F>
int guarded(double *out, F &&f) {
    if (!out) return CTO_E_INVALID;
    try {
        return f();
    } catch (...) {
        *out = core::kNaN;
        return CTO_E_INTERNAL;
    }
}

}  // namespace cto::capi

#endif  // CTO_CAPI_GUARD_HPP
