// The batch engine behind cto_call_strided: a loop specialised per catalogue function
// (its table thunk inlined), reading strided arguments, writing strided outputs and
// statuses, and tallying statuses for the report.  Functions with a block kernel
// (lib/src/blocks.cpp) evaluate blocks of kBlock valid elements at once.
#ifndef CTO_TABLE_STRIDED_HPP
#define CTO_TABLE_STRIDED_HPP

#include <cstddef>
#include <cstdint>
#include <cstring>
#include <utility>

#include "../core.hpp"

namespace cto::table {

// ---- strided loops, specialised per function (the thunk is inlined) --------------
struct Tally {
    size_t count[CTO_REPORT_SLOTS] = {};
    size_t first[CTO_REPORT_SLOTS] = {};
    int first_bad = -1;
};

using Thunk = int (*)(const double *, double *, int *);
using Loop = void (*)(size_t, const char *const *, const ptrdiff_t *, char *const *,
                      const ptrdiff_t *, signed char *, ptrdiff_t, Tally &);

// Functions whose core has a block kernel (core::share_block): it evaluates a block of
// elements branch-free, in a form the compiler vectorises, and says whether every
// element came out valid with status ok; otherwise the block is redone element by
// element through the thunk.  The kernel's values equal the thunk's bit for bit.
using BlockKernel = bool (*)(size_t, const double *const *, double *const *);
template <Thunk F>
constexpr BlockKernel kBlockKernel = nullptr;  // specialised by the generated rows
constexpr size_t kBlock = 256;

inline bool is_double_array(const char *p, ptrdiff_t step) {
    return step == static_cast<ptrdiff_t>(sizeof(double)) &&
           reinterpret_cast<uintptr_t>(p) % alignof(double) == 0;
}

// Whether a block of doubles written at out misses every byte that the block's nin
// inputs (at ap, with steps astep) are read from.
inline bool apart_from_inputs(const char *out, const char *const *ap, const ptrdiff_t *astep,
                              int nin) {
    const uintptr_t o_lo = reinterpret_cast<uintptr_t>(out);
    const uintptr_t o_hi = o_lo + kBlock * sizeof(double);
    for (int j = 0; j < nin; ++j) {
        uintptr_t lo = reinterpret_cast<uintptr_t>(ap[j]);
        uintptr_t hi = reinterpret_cast<uintptr_t>(ap[j] + (static_cast<ptrdiff_t>(kBlock) - 1) *
                                                               astep[j]);
        if (hi < lo) std::swap(lo, hi);
        if (!(hi + sizeof(double) <= o_lo || o_hi <= lo)) return false;
    }
    return true;
}

// The position of a strided evaluation: each argument's and output's next address and
// step, the statuses, and the count of ok elements (kept in registers, not in the tally).
template <int NIN, int NOUT>
struct Cursor {
    const char *ap[NIN];
    ptrdiff_t astep[NIN];
    char *op[NOUT];
    ptrdiff_t ostep[NOUT];
    signed char *st;
    ptrdiff_t ss;
    size_t ok = 0, first_ok = 0;
};

// Element i: its inputs read and advanced, the thunk, outputs, status and tally.
template <Thunk F, int NIN, int NOUT>
inline void element(Cursor<NIN, NOUT> &c, size_t i, Tally &t) {
    double a[NIN];
    double o[NOUT];
    for (int j = 0; j < NIN; ++j) {
        std::memcpy(&a[j], c.ap[j], sizeof(double));
        c.ap[j] += c.astep[j];
    }
    int bad = -1;
    int s = F(a, o, &bad);
    for (int k = 0; k < NOUT; ++k) {
        std::memcpy(c.op[k], &o[k], sizeof(double));
        c.op[k] += c.ostep[k];
    }
    if (c.st) c.st[static_cast<ptrdiff_t>(i) * c.ss] = static_cast<signed char>(s);
    if (s == CTO_OK) {
        if (c.ok++ == 0) c.first_ok = i;
        return;
    }
    if (s < 0 || s >= CTO_REPORT_SLOTS) s = CTO_E_INTERNAL;
    if (t.count[s]++ == 0) {
        t.first[s] = i;
        if (s == CTO_E_INVALID) t.first_bad = bad;
    }
}

// Block buffers: inputs gathered (or read in place when they are double arrays),
// outputs written in place when that cannot overwrite an input of the block.
template <int NIN, int NOUT>
struct BlockBuffers {
    double in_buf[NIN][kBlock];
    double out_buf[NOUT][kBlock];
    const double *in[NIN];
    double *out[NOUT];
    bool filled[NIN] = {};  // a broadcast input's buffer holds its value already
};

template <int NIN, int NOUT>
inline void gather(Cursor<NIN, NOUT> &c, BlockBuffers<NIN, NOUT> &b) {
    for (int j = 0; j < NIN; ++j) {
        if (is_double_array(c.ap[j], c.astep[j])) {  // read in place
            b.in[j] = reinterpret_cast<const double *>(c.ap[j]);
            continue;
        }
        b.in[j] = b.in_buf[j];
        if (c.astep[j] == 0 && b.filled[j]) continue;
        const char *p = c.ap[j];
        for (size_t e = 0; e < kBlock; ++e, p += c.astep[j])
            std::memcpy(&b.in_buf[j][e], p, sizeof(double));
        b.filled[j] = c.astep[j] == 0;
    }
    // An output is written in place when it is a double array apart from every input of
    // the block (the element fallback must still read the inputs).
    for (int k = 0; k < NOUT; ++k) {
        const bool in_place = is_double_array(c.op[k], c.ostep[k]) &&
                              apart_from_inputs(c.op[k], c.ap, c.astep, NIN);
        b.out[k] = in_place ? reinterpret_cast<double *>(c.op[k]) : b.out_buf[k];
    }
}

// After a block whose kernel succeeded: advance, scatter buffered outputs, statuses.
template <int NIN, int NOUT>
inline void commit_block(Cursor<NIN, NOUT> &c, BlockBuffers<NIN, NOUT> &b, size_t i) {
    constexpr ptrdiff_t kBytes = static_cast<ptrdiff_t>(kBlock * sizeof(double));
    for (int j = 0; j < NIN; ++j) c.ap[j] += static_cast<ptrdiff_t>(kBlock) * c.astep[j];
    for (int k = 0; k < NOUT; ++k) {
        if (b.out[k] != b.out_buf[k]) {
            c.op[k] += kBytes;
            continue;
        }
        for (size_t e = 0; e < kBlock; ++e, c.op[k] += c.ostep[k])
            std::memcpy(c.op[k], &b.out_buf[k][e], sizeof(double));
    }
    if (c.st) {
        for (size_t e = 0; e < kBlock; ++e)
            c.st[static_cast<ptrdiff_t>(i + e) * c.ss] = static_cast<signed char>(CTO_OK);
    }
    if (c.ok == 0) c.first_ok = i;
    c.ok += kBlock;
}

// Whole blocks through the function's block kernel; a block that is not all valid and
// ok is redone element by element.  Returns the index of the first element left.
template <Thunk F, int NIN, int NOUT>
inline size_t run_blocks(size_t n, Cursor<NIN, NOUT> &c, Tally &t) {
    size_t i = 0;
    BlockBuffers<NIN, NOUT> b;
    for (; n - i >= kBlock; i += kBlock) {
        gather(c, b);
        if (!kBlockKernel<F>(kBlock, b.in, b.out)) {
            for (size_t e = 0; e < kBlock; ++e) element<F>(c, i + e, t);
            continue;
        }
        commit_block(c, b, i);
    }
    return i;
}

template <Thunk F, int NIN, int NOUT>
void strided(size_t n, const char *const *args, const ptrdiff_t *as, char *const *outs,
             const ptrdiff_t *os, signed char *st, ptrdiff_t ss, Tally &t) {
    Cursor<NIN, NOUT> c;
    for (int j = 0; j < NIN; ++j) {
        c.ap[j] = args[j];
        c.astep[j] = as[j];
    }
    for (int k = 0; k < NOUT; ++k) {
        c.op[k] = outs[k];
        c.ostep[k] = os[k];
    }
    c.st = st;
    c.ss = ss;
    size_t i = 0;
    if constexpr (kBlockKernel<F> != nullptr) i = run_blocks<F>(n, c, t);
    for (; i < n; ++i) element<F>(c, i, t);
    if (c.ok > 0 && t.count[CTO_OK] == 0) t.first[CTO_OK] = c.first_ok;
    t.count[CTO_OK] += c.ok;
}

}  // namespace cto::table

#endif  // CTO_TABLE_STRIDED_HPP
