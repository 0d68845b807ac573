// The hashed Owen scramble's tail flips (scramble.cpp) for eight points at a time with
// AVX-512 (native 64-bit products: VPMULLQ of AVX512DQ) or four at a time with AVX2: each
// lane is one point's coordinate, and the digits run in a loop, so no lane is idle.
//
// Integer arithmetic only, so the result is the same bits as the scalar loop: 64-bit
// products modulo 2^64 are formed from 32-bit ones,
//   a b mod 2^64 = lo(a) lo(b) + ((hi(a) lo(b) + lo(a) hi(b)) << 32)   (mod 2^64),
// the schoolbook identity (Knuth, TAOCP vol. 2, s.4.3.1); AVX512DQ multiplies modulo 2^64
// directly.  The CPU is asked once per call
// (__builtin_cpu_supports reads what the runtime found at start-up; no state of ours).
#include <immintrin.h>

#include <cstdint>

#include "scramble.hpp"

namespace cto::core::range {
namespace {

__attribute__((target("avx2"))) inline __m256i mul64(__m256i a, __m256i b) {
    const __m256i lo = _mm256_mul_epu32(a, b);                        // lo(a) lo(b)
    const __m256i ah = _mm256_srli_epi64(a, 32), bh = _mm256_srli_epi64(b, 32);
    const __m256i cross = _mm256_add_epi64(_mm256_mul_epu32(ah, b), _mm256_mul_epu32(a, bh));
    return _mm256_add_epi64(lo, _mm256_slli_epi64(cross, 32));
}

// The top bit of mix64(z) is the top bit of the second product (the last step,
// z ^ (z >> 31), leaves bit 63 alone), so the kernels stop there.
__attribute__((target("avx2"))) inline __m256i mix64_top_x4(__m256i z) {
    const __m256i c1 = _mm256_set1_epi64x(static_cast<long long>(0xBF58476D1CE4E5B9ull));
    const __m256i c2 = _mm256_set1_epi64x(static_cast<long long>(0x94D049BB133111EBull));
    z = mul64(_mm256_xor_si256(z, _mm256_srli_epi64(z, 30)), c1);
    return mul64(_mm256_xor_si256(z, _mm256_srli_epi64(z, 27)), c2);
}

// The flips of digits first..32 of the coordinates in the lanes (32-bit values in 64-bit
// lanes), four points at a time.  The node's product with G needs one multiplication per
// point, not one per digit: node_{k+1} = 2 node_k + digit k (the leading bit moves up with
// the prefix), so node_{k+1} G = 2 node_k G + (digit k ? G : 0) (mod 2^64).
__attribute__((target("avx2"))) __m256i tail_flips_x4(__m256i xv, __m256i kv, unsigned first) {
    const __m256i g = _mm256_set1_epi64x(static_cast<long long>(kGolden));
    const __m256i one = _mm256_set1_epi64x(1);
    const __m256i node = _mm256_or_si256(_mm256_srl_epi64(xv, _mm_cvtsi32_si128(static_cast<int>(33 - first))),
                                         _mm256_set1_epi64x(1ll << (first - 1)));
    __m256i ng = mul64(node, g);
    __m256i flips = _mm256_setzero_si256();
    for (unsigned k = first; k <= 32; ++k) {
        const __m256i h = mix64_top_x4(_mm256_xor_si256(kv, ng));
        const __m128i at = _mm_cvtsi32_si128(static_cast<int>(32 - k));
        flips = _mm256_or_si256(flips, _mm256_sll_epi64(_mm256_srli_epi64(h, 63), at));
        const __m256i digit = _mm256_and_si256(_mm256_srl_epi64(xv, at), one);
        ng = _mm256_add_epi64(_mm256_slli_epi64(ng, 1),
                              _mm256_and_si256(_mm256_sub_epi64(_mm256_setzero_si256(), digit), g));
    }
    return flips;
}

__attribute__((target("avx2"))) size_t tails_avx2(const uint32_t *x, size_t n, uint64_t key,
                                                  unsigned first, uint32_t *flips) {
    const __m256i kv = _mm256_set1_epi64x(static_cast<long long>(key));
    size_t i = 0;
    alignas(32) uint64_t lane[4];
    for (; i + 4 <= n; i += 4) {
        const __m256i xv = _mm256_cvtepu32_epi64(_mm_loadu_si128(reinterpret_cast<const __m128i *>(x + i)));
        _mm256_store_si256(reinterpret_cast<__m256i *>(lane), tail_flips_x4(xv, kv, first));
        for (size_t l = 0; l < 4; ++l) flips[i + l] = static_cast<uint32_t>(lane[l]);
    }
    return i;
}

// GCC 12's AVX-512 intrinsics pass an undefined vector as the unused merge source, which
// -Wmaybe-uninitialized reports at every inlining site (a false positive of the header,
// GCC bug 105593, from memory); nothing here reads an uninitialised value.
#if defined(__GNUC__) && !defined(__clang__)  // clang has no such warning
#pragma GCC diagnostic push
#pragma GCC diagnostic ignored "-Wmaybe-uninitialized"
#endif
// As mix64_top_x4.
__attribute__((target("avx512f,avx512dq"))) inline __m512i mix64_top_x8(__m512i z) {
    const __m512i c1 = _mm512_set1_epi64(static_cast<long long>(0xBF58476D1CE4E5B9ull));
    const __m512i c2 = _mm512_set1_epi64(static_cast<long long>(0x94D049BB133111EBull));
    z = _mm512_mullo_epi64(_mm512_xor_si512(z, _mm512_srli_epi64(z, 30)), c1);
    return _mm512_mullo_epi64(_mm512_xor_si512(z, _mm512_srli_epi64(z, 27)), c2);
}

// As tail_flips_x4, eight points at a time.  The hash's top bit is moved to bit 32 - k
// by one shift and merged under a one-bit mask (VPTERNLOGQ: flips | (shifted & bit)).
__attribute__((target("avx512f,avx512dq"))) __m512i tail_flips_x8(__m512i xv, __m512i kv,
                                                                 unsigned first) {
    const __m512i g = _mm512_set1_epi64(static_cast<long long>(kGolden));
    const __m512i node = _mm512_or_si512(_mm512_srl_epi64(xv, _mm_cvtsi32_si128(static_cast<int>(33 - first))),
                                         _mm512_set1_epi64(1ll << (first - 1)));
    __m512i ng = _mm512_mullo_epi64(node, g);
    __m512i flips = _mm512_setzero_si512();
    for (unsigned k = first; k <= 32; ++k) {
        const __m512i top = mix64_top_x8(_mm512_xor_si512(kv, ng));
        const __m512i bit = _mm512_set1_epi64(1ll << (32 - k));
        const __m512i moved = _mm512_srl_epi64(top, _mm_cvtsi32_si128(static_cast<int>(31 + k)));
        flips = _mm512_ternarylogic_epi64(flips, moved, bit, 0xF8);  // a | (b & c)
        const __m512i twice = _mm512_slli_epi64(ng, 1);
        ng = _mm512_mask_add_epi64(twice, _mm512_test_epi64_mask(xv, bit), twice, g);
    }
    return flips;
}

__attribute__((target("avx512f,avx512dq"))) size_t tails_avx512(const uint32_t *x, size_t n,
                                                                uint64_t key, unsigned first,
                                                                uint32_t *flips) {
    const __m512i kv = _mm512_set1_epi64(static_cast<long long>(key));
    size_t i = 0;
    for (; i + 8 <= n; i += 8) {
        const __m512i xv = _mm512_cvtepu32_epi64(_mm256_loadu_si256(reinterpret_cast<const __m256i *>(x + i)));
        _mm256_storeu_si256(reinterpret_cast<__m256i *>(flips + i),
                            _mm512_cvtepi64_epi32(tail_flips_x8(xv, kv, first)));
    }
    return i;
}
// Level k of the prefix cache (owen_prefix_masks, scramble.cpp) for the prefixes q of k
// digits from 2^k - 1 down to 8, eight at a time: mask[q] = mask[q >> 1] | flip(k + 1, q)
// << (31 - k), with flip(k + 1, q) the top bit of mix64(key ^ (2^k | q) G).  In place: a
// group q = 8t..8t+7 reads its parents 4t..4t+3, below every group still to be written
// (t >= 1), so going down never reads a mask of this level.
__attribute__((target("avx512f,avx512dq"))) void prefix_level_x8(uint64_t key, unsigned k,
                                                                uint32_t *mask) {
    const __m512i g = _mm512_set1_epi64(static_cast<long long>(kGolden));
    const __m512i kv = _mm512_set1_epi64(static_cast<long long>(key));
    const __m512i lane = _mm512_set_epi64(7, 6, 5, 4, 3, 2, 1, 0);
    const __m256i twice = _mm256_set_epi32(3, 3, 2, 2, 1, 1, 0, 0);
    const __m128i at = _mm_cvtsi32_si128(static_cast<int>(31 - k));
    for (uint64_t t = (uint64_t{1} << k) / 8; t-- > 1;) {
        const __m512i node = _mm512_or_si512(_mm512_set1_epi64(static_cast<long long>((uint64_t{1} << k) | (8 * t))), lane);
        const __m512i top = mix64_top_x8(_mm512_xor_si512(kv, _mm512_mullo_epi64(node, g)));
        const __m256i flips = _mm512_cvtepi64_epi32(_mm512_sll_epi64(_mm512_srli_epi64(top, 63), at));
        const __m256i parent = _mm256_permutevar8x32_epi32(
            _mm256_castsi128_si256(_mm_loadu_si128(reinterpret_cast<const __m128i *>(mask + 4 * t))), twice);
        _mm256_storeu_si256(reinterpret_cast<__m256i *>(mask + 8 * t), _mm256_or_si256(parent, flips));
    }
}

#if defined(__GNUC__) && !defined(__clang__)
#pragma GCC diagnostic pop
#endif

}  // namespace

size_t scramble_tails_avx512(const uint32_t *x, size_t n, uint64_t key, unsigned first,
                             uint32_t *flips) {
    if (first < 2 || !__builtin_cpu_supports("avx512f") || !__builtin_cpu_supports("avx512dq"))
        return 0;
    return tails_avx512(x, n, key, first, flips);
}

uint64_t prefix_level_avx512(uint64_t key, unsigned k, uint32_t *mask) {
    if (k < 3 || !__builtin_cpu_supports("avx512f") || !__builtin_cpu_supports("avx512dq"))
        return uint64_t{1} << k;
    prefix_level_x8(key, k, mask);
    return 8;
}

size_t scramble_tails_avx2(const uint32_t *x, size_t n, uint64_t key, unsigned first,
                           uint32_t *flips) {
    if (first < 2 || !__builtin_cpu_supports("avx2")) return 0;
    return tails_avx2(x, n, key, first, flips);
}

}  // namespace cto::core::range
