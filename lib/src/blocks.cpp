// Block kernels: functions of core.hpp evaluated over a block of elements at once, in a
// form the compiler vectorises.  The strided loops of table/strided.hpp use them for blocks
// whose elements all come out valid with status ok, and fall back to the scalar
// function for any other block, so a kernel only has to be right on that common path.
//
// Bit-for-bit agreement with the scalar functions: a kernel uses the same inline
// kernels (rub_den, rub_opener, rub_responder) or their operations in the same order
// (the tests compare every element bit for bit with the scalar call), the library is built
// with -ffp-contract=off (no fused multiply-add that the scalar path lacks), and
// vector division, multiplication and subtraction round exactly as their scalar forms.
// This file is built with -fno-trapping-math, which lets the compiler evaluate both
// sides of a select: no result changes (the library never reads the floating-point
// exception flags).  On x86-64 each kernel body is compiled twice, for the baseline
// (SSE2, which has no 64-bit lane compares to vectorise the checks with) and for AVX2,
// and the CPU picks one per call (__builtin_cpu_supports reads what the runtime found at
// start-up; no ifunc, which sanitizer runtimes cannot take this early).
#include "core.hpp"

#if defined(__x86_64__) && (defined(__GNUC__) || defined(__clang__))
#define CTO_X86_DISPATCH 1
#define CTO_ALWAYS_INLINE inline __attribute__((always_inline))
#else
#define CTO_X86_DISPATCH 0
#define CTO_ALWAYS_INLINE inline
#endif

namespace cto::core {
namespace {

CTO_ALWAYS_INLINE bool share_block_body(size_t m, const double *own_factor,
                                        const double *other_factor, const double *surplus,
                                        const double *own_opens, double *out) {
    unsigned all = 1;
    for (size_t i = 0; i < m; ++i) {
        const double f1 = own_factor[i], f2 = other_factor[i], s = surplus[i];
        const double b = own_opens[i];
        const double om1 = 1.0 - f1, om2 = 1.0 - f2;
        // share() computes rub_opener(s, om2, den) = s (om2 / den) as opener and
        // rub_responder(s, f1, om2, den) = s ((f1 om2) / den) as responder; selecting
        // the numerator and the denominator first leaves one division per element.
        const bool opens = b == 1.0;
        const double num = opens ? om2 : f1 * om2;
        const double den = opens ? rub_den(f1, om1, om2) : rub_den(f2, om2, om1);
        const double v = s * (num / den);
        out[i] = v;
        // The checks of rub_prologue, to_bool and finish, as one mask.
        all &= static_cast<unsigned>((f1 >= 0.0) & (f1 <= 1.0) & (f2 >= 0.0) & (f2 <= 1.0) &
                                     (s > 0.0) & (s <= DBL_MAX) & ((b == 1.0) | (b == 0.0)) &
                                     ((f1 != 1.0) | (f2 != 1.0)) & (v >= -DBL_MAX) &
                                     (v <= DBL_MAX));
    }
    return all != 0;
}

#if CTO_X86_DISPATCH
__attribute__((target("avx2"))) bool share_block_avx2(size_t m, const double *a, const double *b,
                                                      const double *c, const double *d,
                                                      double *out) {
    return share_block_body(m, a, b, c, d, out);
}
#endif

}  // namespace

bool share_block(size_t m, const double *own_factor, const double *other_factor,
                 const double *surplus, const double *own_opens, double *out) {
#if CTO_X86_DISPATCH
    if (__builtin_cpu_supports("avx2"))
        return share_block_avx2(m, own_factor, other_factor, surplus, own_opens, out);
#endif
    return share_block_body(m, own_factor, other_factor, surplus, own_opens, out);
}

}  // namespace cto::core
