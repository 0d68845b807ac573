// Triangular and PERT draws of a block eight at a time with AVX-512 (AVX512F and
// AVX512DQ): the same operations as the scalar path (distributions.cpp; for PERT also
// pert_table.cpp: pert_half_root, pert_half_inverse), in the same order, on each lane;
// both branches of a two-sided formula are computed and the lane's own one kept.  IEEE 754 rounds
// every +, -, x and conversion the same in a vector lane as in a scalar register, and the
// core is compiled without contraction (-ffp-contract=off), so each lane gets the scalar
// path's bits; tests/cpp/test_range_distributions.cpp compares them.  Table entries are
// gathered by byte offsets into the plan (its two halves sit at fixed offsets).  A lane
// the table cannot serve (an interpolant outside (0, 1)) is recomputed by the scalar path.
#include <immintrin.h>

#include <cstddef>
#include <cstdint>

#include "distributions.hpp"
#include "scramble.hpp"

namespace cto::core::range {
namespace {

// GCC 12's AVX-512 intrinsics pass an undefined vector as the unused merge source, which
// -Wmaybe-uninitialized reports at every inlining site (a false positive of the header,
// GCC bug 105593, from memory); nothing here reads an uninitialised value.
#if defined(__GNUC__) && !defined(__clang__)  // clang has no such warning
#pragma GCC diagnostic push
#pragma GCC diagnostic ignored "-Wmaybe-uninitialized"
#endif

#define CTO_AVX512 __attribute__((target("avx512f,avx512dq")))

// A plan's field of lane-dependent half at byte offset `off` (+ idx) in each lane.
CTO_AVX512 inline __m512d gather(const DistPlan &p, __m512i off) {
    return _mm512_i64gather_pd(off, reinterpret_cast<const void *>(&p), 1);
}

CTO_AVX512 inline __m512i bytes(size_t v) { return _mm512_set1_epi64(static_cast<long long>(v)); }
CTO_AVX512 inline __m512d cst(double x) { return _mm512_set1_pd(x); }
CTO_AVX512 inline __m512d add(__m512d a, __m512d b) { return _mm512_add_pd(a, b); }
CTO_AVX512 inline __m512d sub(__m512d a, __m512d b) { return _mm512_sub_pd(a, b); }
CTO_AVX512 inline __m512d mul(__m512d a, __m512d b) { return _mm512_mul_pd(a, b); }

// A number of the plan's lower half in the lanes below the median, of its upper half in
// the others.
CTO_AVX512 inline __m512d per_half(__mmask8 half, double lower, double upper) {
    return _mm512_mask_blend_pd(half, cst(lower), cst(upper));
}

// A table entry at byte offset base + field + idx of each lane.
CTO_AVX512 inline __m512d entry(const DistPlan &p, __m512i base, size_t field, __m512i idx) {
    return gather(p, _mm512_add_epi64(_mm512_add_epi64(base, bytes(field)), idx));
}

// Eight draws: u in the lanes, `half` the lanes above 1/2 (drawn from the upper half).
CTO_AVX512 __m512d pert_x8(const DistPlan &p, __m512d u, __mmask8 half, __mmask8 *redo) {
    const __m512d one = cst(1.0);
    const __m512d v = _mm512_mask_sub_pd(u, half, one, u);  // 1 - u, exact for u >= 1/2
    // Byte offset of each lane's half in the plan.
    const __m512i base = _mm512_mask_blend_epi64(half, bytes(offsetof(DistPlan, lower)),
                                                 bytes(offsetof(DistPlan, upper)));
    // s = v^(1/a) (pert_half_root): octave q and segment j from the bits of v.
    const __m512i bits = _mm512_castpd_si512(v);
    const __m512i q = _mm512_sub_epi64(_mm512_set1_epi64(1023), _mm512_srli_epi64(bits, 52));
    *redo = static_cast<__mmask8>(_mm512_cmplt_epi64_mask(q, _mm512_set1_epi64(1)) |
                                  _mm512_cmpgt_epi64_mask(q, _mm512_set1_epi64(PertHalf::kOctaves)));
    const __m512i qs = _mm512_max_epi64(_mm512_min_epi64(q, _mm512_set1_epi64(PertHalf::kOctaves)),
                                        _mm512_set1_epi64(1));  // in range for the gather
    const __m512d m = _mm512_castsi512_pd(_mm512_or_si512(
        _mm512_and_si512(bits, _mm512_set1_epi64((int64_t{1} << 52) - 1)),
        _mm512_set1_epi64(int64_t{1023} << 52)));
    const __m512i j = _mm512_and_si512(_mm512_srli_epi64(bits, 46), _mm512_set1_epi64(63));
    const __m512i j8 = _mm512_slli_epi64(j, 3);
    const __m512d centre =  // 1 + (j + 1/2)/64, exact (a power of two scales exactly)
        add(one, mul(add(_mm512_cvtepi64_pd(j), cst(0.5)), cst(1.0 / PertHalf::kSegments)));
    // 1/c_j divided here is the table's seg_inv[j] (both correctly rounded): one gather less.
    const __m512d tt = mul(sub(m, centre), _mm512_div_pd(one, centre));
    const PertHalf &L = p.lower, &U = p.upper;
    __m512d poly = per_half(half, L.binom[PertHalf::kTerms], U.binom[PertHalf::kTerms]);
    for (int k = PertHalf::kTerms - 1; k >= 1; --k)
        poly = add(mul(poly, tt), per_half(half, L.binom[k], U.binom[k]));
    const __m512d c = entry(p, base, offsetof(PertHalf, seg_root), j8);
    const __m512d oct = entry(p, base, offsetof(PertHalf, octave), _mm512_slli_epi64(qs, 3));
    const __m512d s = mul(oct, add(c, mul(c, mul(poly, tt))));
    // The interval and the quintic Hermite interpolant (pert_half_inverse).
    const __m512d pos = mul(s, per_half(half, L.inv_h, U.inv_h));
    const __m512i k = _mm512_min_epi64(_mm512_cvttpd_epi64(pos), _mm512_set1_epi64(kPertKnots - 1));
    const __m512d w = sub(pos, _mm512_cvtepi64_pd(k));
    const __m512d h = per_half(half, L.h, U.h);
    const __m512d w2 = mul(w, w), w3 = mul(w2, w);
    const __m512d h5 = mul(w3, add(cst(10.0), mul(w, add(cst(-15.0), mul(cst(6.0), w)))));
    const __m512d h1 = add(w, mul(w3, add(cst(-6.0), mul(w, sub(cst(8.0), mul(cst(3.0), w))))));
    const __m512d h4 = mul(w3, add(cst(-4.0), mul(w, sub(cst(7.0), mul(cst(3.0), w)))));
    const __m512d h2 = mul(mul(cst(0.5), w2), add(cst(1.0), mul(w, add(cst(-3.0), mul(w, sub(cst(3.0), w))))));
    const __m512d h3 = mul(mul(cst(0.5), w3), add(cst(1.0), mul(w, add(cst(-2.0), w))));
    // Knots k and k + 1 of each lane's half.
    const __m512i kb = _mm512_mullo_epi64(k, bytes(sizeof(PertHalf::Knot)));
    const size_t k0 = offsetof(PertHalf, knot), k1 = k0 + sizeof(PertHalf::Knot);
    using Knot = PertHalf::Knot;
    const __m512d px = entry(p, base, k0 + offsetof(Knot, x), kb);
    const __m512d qx = entry(p, base, k1 + offsetof(Knot, x), kb);
    const __m512d pd = entry(p, base, k0 + offsetof(Knot, dx), kb);
    const __m512d qd = entry(p, base, k1 + offsetof(Knot, dx), kb);
    const __m512d pd2 = entry(p, base, k0 + offsetof(Knot, d2x), kb);
    const __m512d qd2 = entry(p, base, k1 + offsetof(Knot, d2x), kb);
    const __m512d x = add(px, add(mul(sub(qx, px), h5),
                                  mul(h, add(add(mul(pd, h1), mul(qd, h4)),
                                             mul(h, add(mul(pd2, h2), mul(qd2, h3)))))));
    const __mmask8 inside = _mm512_cmp_pd_mask(x, _mm512_setzero_pd(), _CMP_GT_OQ) &
                            _mm512_cmp_pd_mask(x, one, _CMP_LT_OQ);
    *redo = static_cast<__mmask8>(*redo | static_cast<__mmask8>(~inside));
    // The two halves: lo + (hi - lo) y below the median, hi - (hi - lo) z above it.
    const __m512d width = cst(p.width);
    return _mm512_mask_blend_pd(half, add(cst(p.d.low), mul(width, x)), sub(cst(p.d.high), mul(width, x)));
}

// Eight triangular draws: lo + w sqrt(u F_m) below the mode, hi - w sqrt((1 - u)(1 - F_m))
// above it.
CTO_AVX512 __m512d triangular_x8(const DistPlan &p, __m512d u) {
    const __m512d below = add(cst(p.d.low), mul(cst(p.width), _mm512_sqrt_pd(mul(u, cst(p.fm)))));
    const __m512d above = sub(cst(p.d.high),
                              mul(cst(p.width), _mm512_sqrt_pd(mul(sub(cst(1.0), u), cst(p.one_minus_fm)))));
    return _mm512_mask_blend_pd(_mm512_cmp_pd_mask(u, cst(p.fm), _CMP_LT_OQ), above, below);
}

CTO_AVX512 size_t block(const DistPlan &p, const uint32_t *y, size_t n, double *x) {
    const bool pert = p.d.kind == kPert;
    size_t i = 0;
    for (; i + 8 <= n; i += 8) {
        // u = (y + 1/2) 2^-32 (unit_from_bits), exact.
        const __m512d yd = _mm512_cvtepu32_pd(_mm256_loadu_si256(reinterpret_cast<const __m256i *>(y + i)));
        const __m512d u = mul(add(yd, cst(0.5)), cst(0x1p-32));
        if (!pert) {
            _mm512_storeu_pd(x + i, triangular_x8(p, u));
            continue;
        }
        const __mmask8 half = _mm512_cmp_pd_mask(u, cst(0.5), _CMP_GT_OQ);
        __mmask8 redo = 0;
        _mm512_storeu_pd(x + i, pert_x8(p, u, half, &redo));
        for (unsigned l = 0; l < 8; ++l)
            if ((redo >> l) & 1u) x[i + l] = dist_quantile(p, unit_from_bits(y[i + l]));
    }
    return i;
}

#undef CTO_AVX512
#if defined(__GNUC__) && !defined(__clang__)
#pragma GCC diagnostic pop
#endif

}  // namespace

size_t dist_block_avx512(const DistPlan &p, const uint32_t *y, size_t n, double *x) {
    const bool kind = (p.d.kind == kPert && p.table) || (p.d.kind == kTriangular && p.width > 0.0);
    if (!kind || !__builtin_cpu_supports("avx512f") || !__builtin_cpu_supports("avx512dq")) return 0;
    return block(p, y, n, x);
}

}  // namespace cto::core::range
