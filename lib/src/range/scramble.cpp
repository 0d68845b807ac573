// Hashed Owen scrambling; see scramble.hpp for the rule and its sources.
#include "scramble.hpp"

namespace cto::core::range {

namespace {
// The flip of digit k whose k - 1 digits above are `prefix`.
inline uint64_t flip_bit(uint64_t key, unsigned k, uint64_t prefix) {
    const uint64_t node = (uint64_t{1} << (k - 1)) | prefix;
    return mix64(key ^ (node * kGolden)) >> 63;
}

// The flips of digits first..32 of x, as a mask.
inline uint32_t tail_flips(uint64_t x64, uint64_t key, unsigned first) {
    uint64_t flips = 0;
    for (unsigned k = first; k <= 32; ++k)
        flips |= flip_bit(key, k, k == 1 ? 0 : (x64 >> (33 - k))) << (32 - k);
    return static_cast<uint32_t>(flips);
}
}  // namespace

void owen_prefix_masks(uint64_t key, int L, uint32_t *mask, Simd simd) {
    // Level k holds, for each prefix q of k - 1 digits, the flips of digits 1..k; level
    // k + 1 is built from it in place, from the top index down (q >> 1 <= q).
    mask[0] = static_cast<uint32_t>(flip_bit(key, 1, 0) << 31);
    for (unsigned k = 1; k <= static_cast<unsigned>(L); ++k) {
        // The vector build writes the upper prefixes of the level; the loop the rest.
        const uint64_t rest = simd == Simd::kAuto ? prefix_level_avx512(key, k, mask) : uint64_t{1} << k;
        for (uint64_t q = rest; q-- > 0;)
            mask[q] = mask[q >> 1] | static_cast<uint32_t>(flip_bit(key, k + 1, q) << (31 - k));
    }
}

void owen_scramble_block(const uint32_t *x, size_t n, uint64_t key, int L, const uint32_t *mask,
                         uint32_t *y, Simd simd) {
    const unsigned first = static_cast<unsigned>(L) + 2;  // the first digit not cached
    size_t done = 0;
    if (simd == Simd::kAuto) done = scramble_tails_avx512(x, n, key, first, y);
    if (simd != Simd::kScalar) done += scramble_tails_avx2(x + done, n - done, key, first, y + done);
    for (size_t i = done; i < n; ++i) y[i] = tail_flips(x[i], key, first);
    for (size_t i = 0; i < n; ++i) y[i] ^= x[i] ^ mask[L == 0 ? 0 : (x[i] >> (32 - L))];
}

uint32_t owen_scramble(uint32_t x, uint64_t key) {
    return x ^ tail_flips(x, key, 1);
}

}  // namespace cto::core::range
