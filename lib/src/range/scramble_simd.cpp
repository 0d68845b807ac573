// The hashed Owen scramble's tail flips (scramble.cpp) eight digits at a time with
// AVX-512 (native 64-bit products: VPMULLQ of AVX512DQ) or four at a time with AVX2.
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

__attribute__((target("avx2"))) inline __m256i mix64x4(__m256i z) {
    const __m256i c1 = _mm256_set1_epi64x(static_cast<long long>(0xBF58476D1CE4E5B9ull));
    const __m256i c2 = _mm256_set1_epi64x(static_cast<long long>(0x94D049BB133111EBull));
    z = mul64(_mm256_xor_si256(z, _mm256_srli_epi64(z, 30)), c1);
    z = mul64(_mm256_xor_si256(z, _mm256_srli_epi64(z, 27)), c2);
    return _mm256_xor_si256(z, _mm256_srli_epi64(z, 31));
}

// Flips of digits first..32 (first >= 2), four digits per step.
__attribute__((target("avx2"))) uint32_t tail_flips_avx2(uint64_t x, uint64_t key,
                                                         unsigned first) {
    const __m256i g = _mm256_set1_epi64x(static_cast<long long>(kGolden));
    const __m256i kv = _mm256_set1_epi64x(static_cast<long long>(key));
    const __m256i xv = _mm256_set1_epi64x(static_cast<long long>(x));
    const __m256i one = _mm256_set1_epi64x(1);
    uint64_t flips = 0;
    alignas(32) uint64_t bit[4];
    for (unsigned k = first; k <= 32; k += 4) {
        // Lanes k, k+1, k+2, k+3 (beyond 32: computed and discarded).
        const __m256i kk = _mm256_add_epi64(_mm256_set1_epi64x(k), _mm256_set_epi64x(3, 2, 1, 0));
        const __m256i prefix = _mm256_srlv_epi64(xv, _mm256_sub_epi64(_mm256_set1_epi64x(33), kk));
        const __m256i lead = _mm256_sllv_epi64(one, _mm256_sub_epi64(kk, one));
        const __m256i node = _mm256_or_si256(lead, prefix);
        const __m256i h = mix64x4(_mm256_xor_si256(kv, mul64(node, g)));
        _mm256_store_si256(reinterpret_cast<__m256i *>(bit), _mm256_srli_epi64(h, 63));
        for (unsigned l = 0; l < 4 && k + l <= 32; ++l) flips |= bit[l] << (32 - (k + l));
    }
    return static_cast<uint32_t>(flips);
}


// GCC 12's AVX-512 intrinsics pass an undefined vector as the unused merge source, which
// -Wmaybe-uninitialized reports at every inlining site (a false positive of the header,
// GCC bug 105593, from memory); nothing here reads an uninitialised value.
#pragma GCC diagnostic push
#pragma GCC diagnostic ignored "-Wmaybe-uninitialized"
__attribute__((target("avx512f,avx512dq"))) inline __m512i mix64x8(__m512i z) {
    const __m512i c1 = _mm512_set1_epi64(static_cast<long long>(0xBF58476D1CE4E5B9ull));
    const __m512i c2 = _mm512_set1_epi64(static_cast<long long>(0x94D049BB133111EBull));
    z = _mm512_mullo_epi64(_mm512_xor_si512(z, _mm512_srli_epi64(z, 30)), c1);
    z = _mm512_mullo_epi64(_mm512_xor_si512(z, _mm512_srli_epi64(z, 27)), c2);
    return _mm512_xor_si512(z, _mm512_srli_epi64(z, 31));
}

// Flips of digits first..32 (first >= 2), eight digits per step: the top bit of each
// lane's hash is gathered into a mask register and placed at bits 32 - k.
__attribute__((target("avx512f,avx512dq"))) uint32_t tail_flips_avx512(uint64_t x, uint64_t key,
                                                                    unsigned first) {
    const __m512i g = _mm512_set1_epi64(static_cast<long long>(kGolden));
    const __m512i kv = _mm512_set1_epi64(static_cast<long long>(key));
    const __m512i xv = _mm512_set1_epi64(static_cast<long long>(x));
    const __m512i one = _mm512_set1_epi64(1);
    const __m512i lane = _mm512_set_epi64(7, 6, 5, 4, 3, 2, 1, 0);
    uint64_t flips = 0;
    for (unsigned k = first; k <= 32; k += 8) {
        // Lanes k .. k+7 (beyond 32: computed and discarded).
        const __m512i kk = _mm512_add_epi64(_mm512_set1_epi64(k), lane);
        const __m512i prefix = _mm512_srlv_epi64(xv, _mm512_sub_epi64(_mm512_set1_epi64(33), kk));
        const __m512i lead = _mm512_sllv_epi64(one, _mm512_sub_epi64(kk, one));
        const __m512i node = _mm512_or_si512(lead, prefix);
        const __m512i h = mix64x8(_mm512_xor_si512(kv, _mm512_mullo_epi64(node, g)));
        const unsigned top = _mm512_movepi64_mask(h);  // bit l: the top bit of lane l
        for (unsigned l = 0; l < 8 && k + l <= 32; ++l)
            flips |= static_cast<uint64_t>((top >> l) & 1u) << (32 - (k + l));
    }
    return static_cast<uint32_t>(flips);
}
#pragma GCC diagnostic pop

}  // namespace

bool scramble_tail_avx512(uint64_t x, uint64_t key, unsigned first, uint32_t *flips) {
    if (first < 2 || !__builtin_cpu_supports("avx512f") || !__builtin_cpu_supports("avx512dq"))
        return false;
    *flips = tail_flips_avx512(x, key, first);
    return true;
}

bool scramble_tail_avx2(uint64_t x, uint64_t key, unsigned first, uint32_t *flips) {
    if (first < 2 || !__builtin_cpu_supports("avx2")) return false;
    *flips = tail_flips_avx2(x, key, first);
    return true;
}

}  // namespace cto::core::range
