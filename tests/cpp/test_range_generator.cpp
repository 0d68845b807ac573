// The generator of share_range: Sobol' points (Joe & Kuo 2008 direction numbers,
// Bratley & Fox 1988 recurrence, natural order) and hashed Owen scrambling, against
// exact test vectors (rows 2..10 of Joe & Kuo's file new-joe-kuo-6.21201; the points and
// scrambled points of docs/models/ranges.md "The generator" for seed 20240601, computed
// with 64-bit integers by a numpy and an independent pure-Python implementation of those
// rules, which agreed bit for bit) and against the defining properties of a scrambled
// (0, m, 1)-net in each coordinate (Owen 1995, s.3).
#include <catch2/catch.hpp>

#include <algorithm>
#include <cstdint>
#include <cstring>
#include <vector>

#include "range/scramble.hpp"
#include "range/sobol.hpp"

using namespace cto::core::range;

namespace {
uint64_t bits(double x) {
    uint64_t b;
    std::memcpy(&b, &x, sizeof b);
    return b;
}
}  // namespace

TEST_CASE("Sobol direction numbers: rows 2..10 of Joe & Kuo (2008)", "[range]") {
    // Dimension 1: v_k = 2^(32-k).
    for (int k = 1; k <= 32; ++k) CHECK(sobol_direction(0, k) == (uint32_t{1} << (32 - k)));
    // Rows 2..10 (s, a, m_1..m_s) of new-joe-kuo-6.21201: the first s numbers are
    // m_k 2^(32-k).
    struct Row { int dim; std::vector<uint32_t> m; };
    const Row rows[] = {{2, {1}},          {3, {1, 3}},         {4, {1, 3, 1}},
                        {5, {1, 1, 1}},    {6, {1, 1, 3, 3}},   {7, {1, 3, 5, 13}},
                        {8, {1, 1, 5, 5, 17}}, {9, {1, 1, 5, 5, 5}}, {10, {1, 1, 7, 11, 19}}};
    for (const Row &r : rows)
        for (size_t k = 1; k <= r.m.size(); ++k)
            CHECK(sobol_direction(r.dim - 1, static_cast<int>(k)) ==
                  (r.m[k - 1] << (32 - static_cast<int>(k))));
    // The recurrence beyond the initial numbers, worked by hand for dimension 3
    // (s = 2, a = 1, m = 1, 3): m_3 = 2 a_1 m_2 ^ 4 m_1 ^ m_1 = 6 ^ 4 ^ 1 = 3;
    // m_4 = 2 m_3 ^ 4 m_2 ^ m_2 = 6 ^ 12 ^ 3 = 9 (Bratley & Fox 1988, s.2).
    CHECK(sobol_direction(2, 3) == (3u << 29));
    CHECK(sobol_direction(2, 4) == (9u << 28));
}

TEST_CASE("Sobol points: unscrambled X_i, the test vectors", "[range]") {
    struct Case { uint64_t i; uint32_t x[5]; };
    const Case cases[] = {
        {0, {0, 0, 0, 0, 0}},
        {1, {2147483648u, 2147483648u, 2147483648u, 2147483648u, 2147483648u}},
        {2, {1073741824u, 3221225472u, 3221225472u, 3221225472u, 1073741824u}},
        {3, {3221225472u, 1073741824u, 1073741824u, 1073741824u, 3221225472u}},
        {7, {3758096384u, 3758096384u, 536870912u, 1610612736u, 3758096384u}},
        {15, {4026531840u, 268435456u, 2952790016u, 805306368u, 1342177280u}},
    };
    for (const Case &c : cases)
        for (int j = 0; j < 5; ++j) CHECK(sobol_point(c.i, j) == c.x[j]);
}

TEST_CASE("Sobol points: the natural-order step equals the direct XOR", "[range]") {
    for (int j : {0, 1, 4, 13, 63}) {
        uint32_t x = 0;
        for (uint64_t i = 1; i < 4096; ++i) {
            x ^= sobol_steps(j)[__builtin_ctzll(i)];
            REQUIRE(x == sobol_point(i, j));
        }
    }
}

TEST_CASE("Sobol points: each coordinate of 2^m points is a (0, m, 1)-net", "[range]") {
    // Sobol (1967): the first 2^m points put exactly one point in each interval
    // [k 2^-m, (k+1) 2^-m) of every coordinate.
    const int m = 10;
    for (int j = 0; j < kSobolDims; ++j) {
        std::vector<int> seen(size_t{1} << m, 0);
        for (uint64_t i = 0; i < (uint64_t{1} << m); ++i) ++seen[sobol_point(i, j) >> (32 - m)];
        for (int s : seen) REQUIRE(s == 1);
    }
}

TEST_CASE("Owen scrambling: keys and scrambled Y_i, test vectors of seed 20240601", "[range]") {
    const uint64_t seed = 20240601u;
    const uint64_t keys[5] = {1477901222294324753ull, 3882548067397510560ull,
                              4377152723251617012ull, 1113273965586026184ull,
                              15490029513646465910ull};
    for (uint64_t j = 0; j < 5; ++j) CHECK(scramble_key(seed, 0, j) == keys[j]);
    struct Case { uint64_t i; uint32_t y[5]; };
    const Case cases[] = {
        {0, {4145063413u, 992096932u, 142159265u, 3599808578u, 1461867620u}},
        {1, {998121602u, 3299638858u, 2871160855u, 816657774u, 3490645301u}},
        {2, {2735199545u, 2656216199u, 3457338328u, 1637339465u, 1009769028u}},
        {3, {1127485016u, 1593264820u, 2096545517u, 2660024579u, 3211536288u}},
        {7, {1857168623u, 2940027048u, 999408482u, 3112175082u, 2456824603u}},
        {15, {2016785431u, 565903173u, 2481632096u, 4143353119u, 693270442u}},
    };
    for (const Case &c : cases)
        for (int j = 0; j < 5; ++j)
            CHECK(owen_scramble(sobol_point(c.i, j), keys[j]) == c.y[j]);
    // u for i = 0, dimensions 1-2, compared by bit pattern (the same test vectors).
    CHECK(bits(unit_from_bits(4145063413u)) == bits(0.96509778255131096));
    CHECK(bits(unit_from_bits(992096932u)) == bits(0.23099056736100465));
}

TEST_CASE("Owen scrambling keeps the net: one point per interval, u in (0, 1)", "[range]") {
    // A nested uniform scramble is a bijection on each level of the digit tree, so the
    // scrambled points keep the (0, m, 1)-net property (Owen 1995, s.3, Proposition 1).
    const int m = 12;
    for (uint64_t r = 0; r < 3; ++r)
        for (int j : {0, 3, 13}) {
            const uint64_t key = scramble_key(7, r, static_cast<uint64_t>(j));
            std::vector<int> seen(size_t{1} << m, 0);
            for (uint64_t i = 0; i < (uint64_t{1} << m); ++i) {
                const uint32_t y = owen_scramble(sobol_point(i, j), key);
                ++seen[y >> (32 - m)];
                const double u = unit_from_bits(y);
                REQUIRE((u > 0.0 && u < 1.0));
            }
            for (int s : seen) REQUIRE(s == 1);
        }
    // The extreme coordinates map strictly inside (0, 1).
    CHECK(unit_from_bits(0) == 0x1p-33);
    CHECK(unit_from_bits(0xFFFFFFFFu) == 1.0 - 0x1p-33);
}

TEST_CASE("Owen scrambling: the prefix cache and the vector paths give the same bits", "[range]") {
    // owen_scramble_block is a cache of owen_scramble's flips (scramble.hpp; built eight
    // prefixes at a time with AVX-512, and by the scalar loop) with the remaining digits
    // hashed eight or four points at a time: equal for every x, on each path: AVX-512 and AVX2 (scramble_simd.cpp, where the CPU has them) and the scalar
    // one; checked on 2^16 pseudo-random x (SplitMix64) and the extremes, for several cache
    // depths, in blocks of 37 (so that every path also leaves points to the next one).  The
    // paths the CPU has are named in the test output.
    std::vector<uint32_t> mask(size_t{1} << kMaxPrefixBits);
    std::vector<uint32_t> x(65536), want(x.size()), got(x.size());
    uint64_t state = 1;
    for (size_t t = 0; t < x.size(); ++t) {
        state += kGolden;
        x[t] = t == 0 ? 0u : t == 1 ? 0xFFFFFFFFu : static_cast<uint32_t>(mix64(state) >> 32);
    }
    for (int L : {0, 1, 2, 7, 12, 16}) {
        const uint64_t key = scramble_key(20240601u, 3, static_cast<uint64_t>(L));
        owen_prefix_masks(key, L, mask.data());
        std::vector<uint32_t> scalar(mask.size());  // the cache's vector and scalar builds agree
        owen_prefix_masks(key, L, scalar.data(), Simd::kScalar);
        for (size_t t = 0; t < (size_t{1} << L); ++t) REQUIRE(mask[t] == scalar[t]);
        for (size_t t = 0; t < x.size(); ++t) want[t] = owen_scramble(x[t], key);
        for (Simd path : {Simd::kAuto, Simd::kAvx2, Simd::kScalar}) {
            for (size_t b = 0; b < x.size(); b += 37)
                owen_scramble_block(x.data() + b, std::min<size_t>(37, x.size() - b), key, L,
                                    mask.data(), got.data() + b, path);
            for (size_t t = 0; t < x.size(); ++t) REQUIRE(got[t] == want[t]);
        }
    }
    uint32_t probe[8] = {};
    WARN("vector paths on this CPU: AVX-512 " << (scramble_tails_avx512(probe, 8, 2, 3, probe) == 8)
                                              << ", AVX2 " << (scramble_tails_avx2(probe, 4, 2, 3, probe) == 4));
}
