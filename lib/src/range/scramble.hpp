// Nested uniform (Owen) scrambling of base-2 digits with a hash instead of stored random
// bits, and the map of a scrambled coordinate to the open unit interval.
//
// Owen (1995, s.3; 1997a) scrambles a digital net by flipping digit k of every coordinate
// with a random bit that depends only on the digits above it; the flips form a binary
// tree of independent fair coins.  Here each coin is a hash of its tree node, keyed by
// seed, replicate and dimension (in the spirit of Burley 2020), so that nothing is stored
// and any point can be generated alone.  The exact rule (docs/models/ranges.md, "The
// generator", steps 3 and 4):
//   mix64(z): z = (z ^ z>>30) * 0xBF58476D1CE4E5B9; z = (z ^ z>>27) * 0x94D049BB133111EB;
//             return z ^ z>>31                       (SplitMix64 finaliser, Steele et al. 2014)
//   G = 0x9E3779B97F4A7C15
//   key(S, r, j) = mix64(mix64(S ^ mix64(r + G)) ^ (j + 1) G)
//   digit k = 1..32:  node = 2^(k-1) | (X >> (33 - k)),  flip = mix64(key ^ node G) >> 63
//   u = (Y + 1/2) 2^-32  (exact in binary64; never 0 or 1)
// All arithmetic is unsigned 64-bit modulo 2^64: identical bits on every platform.
#ifndef CTO_RANGE_SCRAMBLE_HPP
#define CTO_RANGE_SCRAMBLE_HPP

#include <cstddef>
#include <cstdint>

namespace cto::core::range {

inline constexpr uint64_t kGolden = 0x9E3779B97F4A7C15ull;

// SplitMix64 finaliser (Steele, Lea & Flood 2014).
inline uint64_t mix64(uint64_t z) {
    z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9ull;
    z = (z ^ (z >> 27)) * 0x94D049BB133111EBull;
    return z ^ (z >> 31);
}

// The scrambling key of replicate r, 0-based dimension j, for seed S.
inline uint64_t scramble_key(uint64_t seed, uint64_t replicate, uint64_t dim) {
    return mix64(mix64(seed ^ mix64(replicate + kGolden)) ^ ((dim + 1) * kGolden));
}

// Owen-scrambled coordinate Y of the 32-digit coordinate X under `key`.
uint32_t owen_scramble(uint32_t x, uint64_t key);

// Which path owen_prefix_masks and owen_scramble_block take: kAuto the widest the CPU
// has (AVX-512, AVX2, scalar); the others force a narrower one (the cache has AVX-512 and
// scalar builds), so that tests compare every path on one machine.
enum class Simd { kAuto, kAvx2, kScalar };

// A cache of the same flips: the flips of digits 1..L+1 depend only on the first L digits
// of X, so they can be computed once per (key, value of the first L digits) and reused by
// every point.  owen_prefix_masks fills mask[t] for t < 2^L (2^(L+1) - 1 hashes).
// 0 <= L <= kMaxPrefixBits.
inline constexpr int kMaxPrefixBits = 16;
void owen_prefix_masks(uint64_t key, int L, uint32_t *mask, Simd simd = Simd::kAuto);

// y[i] = owen_scramble(x[i], key) for i < n, from the cache of depth L and 31 - L hashes a
// coordinate (the same bits on every path).
void owen_scramble_block(const uint32_t *x, size_t n, uint64_t key, int L, const uint32_t *mask,
                         uint32_t *y, Simd simd = Simd::kAuto);

// The flips of digits first..32 (first >= 2) of x[0..n) into flips[0..n), eight points at
// a time with AVX-512 (AVX512F and AVX512DQ) or four with AVX2 (scramble_simd.cpp); the
// points left over (n mod 8 or 4) are not written.  Each returns how many points it
// wrote: 0 when the CPU lacks the instructions.
size_t scramble_tails_avx512(const uint32_t *x, size_t n, uint64_t key, unsigned first,
                             uint32_t *flips);
size_t scramble_tails_avx2(const uint32_t *x, size_t n, uint64_t key, unsigned first,
                           uint32_t *flips);

// Level k (1 <= k) of owen_prefix_masks with AVX-512: writes mask[q] for the prefixes q
// from 2^k - 1 down to the returned bound (8), or nothing (returning 2^k) for k < 3 or a
// CPU without it; the caller writes the prefixes below the bound.
uint64_t prefix_level_avx512(uint64_t key, unsigned k, uint32_t *mask);

// u = (Y + 0.5) 2^-32, exact: Y + 0.5 needs 33 significant bits.
inline double unit_from_bits(uint32_t y) {
    return (static_cast<double>(y) + 0.5) * 0x1p-32;
}

}  // namespace cto::core::range

#endif  // CTO_RANGE_SCRAMBLE_HPP
