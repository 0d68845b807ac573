// Sobol' direction numbers (compile-time table) and natural-order points; see sobol.hpp.
#include "sobol.hpp"

#include <array>
#include <cstddef>

namespace cto::core::range {
namespace {

struct JoeKuoRow {
    int dim, s, a;
    uint32_t m[10];
};

constexpr JoeKuoRow kRows[] = {
#include "joe_kuo_table.inc"
};
static_assert(sizeof(kRows) / sizeof(kRows[0]) == kSobolDims - 1, "one row per dimension 2..");

using Table = std::array<std::array<uint32_t, kSobolBits>, kSobolDims>;

// Bratley & Fox (1988), s.2: the recurrence for m_k, k > s, then v_k = m_k 2^(32-k).
constexpr Table make_directions() {
    Table v{};
    for (int k = 1; k <= kSobolBits; ++k) v[0][k - 1] = uint32_t{1} << (kSobolBits - k);
    for (int j = 1; j < kSobolDims; ++j) {
        const JoeKuoRow &row = kRows[j - 1];
        uint64_t m[kSobolBits + 1] = {};
        for (int k = 1; k <= row.s; ++k) m[k] = row.m[k - 1];
        for (int k = row.s + 1; k <= kSobolBits; ++k) {
            uint64_t x = (m[k - row.s] << row.s) ^ m[k - row.s];
            for (int i = 1; i < row.s; ++i) {
                const uint64_t a_i = (static_cast<uint64_t>(row.a) >> (row.s - 1 - i)) & 1u;
                x ^= (a_i * m[k - i]) << i;
            }
            m[k] = x;
        }
        for (int k = 1; k <= kSobolBits; ++k)
            v[j][k - 1] = static_cast<uint32_t>(m[k] << (kSobolBits - k));
    }
    return v;
}

constexpr Table kDirections = make_directions();

// Prefix XORs: kSteps[j][t] = v_1 ^ ... ^ v_{t+1}.
constexpr Table make_steps() {
    Table s{};
    for (int j = 0; j < kSobolDims; ++j) {
        uint32_t acc = 0;
        for (int t = 0; t < kSobolBits; ++t) {
            acc ^= kDirections[j][t];
            s[j][t] = acc;
        }
    }
    return s;
}

constexpr Table kSteps = make_steps();

}  // namespace

uint32_t sobol_direction(int j, int k) {
    if (j < 0 || j >= kSobolDims || k < 1 || k > kSobolBits) return 0;
    return kDirections[static_cast<std::size_t>(j)][static_cast<std::size_t>(k - 1)];
}

uint32_t sobol_point(uint64_t i, int j) {
    if (j < 0 || j >= kSobolDims) return 0;
    const auto &v = kDirections[static_cast<std::size_t>(j)];
    uint32_t x = 0;
    for (std::size_t k = 0; k < kSobolBits && i != 0; ++k, i >>= 1)
        if (i & 1u) x ^= v[k];
    return x;
}

const uint32_t *sobol_steps(int j) { return kSteps[static_cast<std::size_t>(j)].data(); }

}  // namespace cto::core::range
