// Hashed Owen scrambling; see scramble.hpp for the rule and its sources.
#include "scramble.hpp"

namespace cto::core::range {

uint32_t owen_scramble(uint32_t x, uint64_t key) {
    const uint64_t x64 = x;
    uint64_t flips = 0;
    for (unsigned k = 1; k <= 32; ++k) {
        // The first k - 1 digits of X, behind a leading 1 that marks the depth k.
        const uint64_t prefix = k == 1 ? 0 : (x64 >> (33 - k));
        const uint64_t node = (uint64_t{1} << (k - 1)) | prefix;
        const uint64_t flip = mix64(key ^ (node * kGolden)) >> 63;
        flips |= flip << (32 - k);  // digit k is bit 32 - k (bit 31 is the first digit)
    }
    return static_cast<uint32_t>(x64 ^ flips);
}

}  // namespace cto::core::range
