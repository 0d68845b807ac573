// The block path of the strided loop (lib/src/blocks.cpp): blocks of cto_share whose
// elements are all valid are evaluated by a vectorised kernel, every other block element
// by element.  The contract (counteroffer.h, cto_call_strided) is that the strided loop
// gives exactly what cto_share gives for each element: value bit for bit, status, and
// the report's counts and first indices.  These tests check that on inputs that take
// both paths, with every memory layout the loop distinguishes (contiguous, strided,
// unaligned, broadcast, output on top of an input, strided statuses).
#include <catch2/catch.hpp>

#include <cfloat>
#include <cmath>
#include <cstring>
#include <random>
#include <vector>

#include "counteroffer/counteroffer.h"

namespace {

constexpr size_t kBlock = 256;  // lib/src/table/strided.hpp
constexpr size_t kN = 7 * kBlock + 77;
const int kShare = cto_function_find("share")->id;

struct Columns {
    std::vector<double> own, other, surplus, opens;
};

// Block b of the data: 0 and 1 clean (random factors down to 1 - 1e-12, the own opener
// in block 0, the other in block 1), 2 with one invalid factor, 3 with one surplus of 0
// (no deal), 4 with both factors 1 (indeterminate), 5 with one opens flag of 0.5
// (invalid), 6 clean with extreme surpluses (DBL_MAX, subnormal), then a tail.
Columns make_columns() {
    std::mt19937_64 rng(20261202);
    std::uniform_real_distribution<double> u(0.0, 1.0);
    Columns c;
    for (size_t i = 0; i < kN; ++i) {
        const size_t b = i / kBlock, e = i % kBlock;
        auto factor = [&] { return 1.0 - std::pow(10.0, -12.0 * u(rng)); };
        double f1 = e % 5 == 0 ? u(rng) : factor(), f2 = e % 7 == 0 ? 0.0 : factor();
        double s = 100.0 * u(rng) + 1e-3, op = (b == 1) ? 0.0 : (e % 3 == 0 ? 0.0 : 1.0);
        if (e == 1) f1 = 1.0;  // one side infinitely patient: the formula still applies
        if (b == 2 && e == 100) f2 = std::nan("");
        if (b == 3 && e == 17) s = 0.0;
        if (b == 4 && e == 200) f1 = f2 = 1.0;
        if (b == 5 && e == 255) op = 0.5;
        if (b == 6 && e % 2 == 0) s = DBL_MAX;
        if (b == 6 && e % 2 == 1) s = 4.9e-324;
        c.own.push_back(f1);
        c.other.push_back(f2);
        c.surplus.push_back(s);
        c.opens.push_back(op);
    }
    return c;
}

struct Expected {
    std::vector<double> value;
    std::vector<int> status;
    cto_batch_report report{};
};

Expected scalar_calls(const Columns &c) {
    Expected x;
    x.report.size = sizeof x.report;
    x.report.first_bad_arg = -1;
    for (size_t i = 0; i < kN; ++i) {
        const double a[4] = {c.own[i], c.other[i], c.surplus[i], c.opens[i]};
        double v;
        int bad = -1;
        const int s = cto_call(kShare, a, &v, &bad);
        x.value.push_back(v);
        x.status.push_back(s);
        if (x.report.count[s]++ == 0) {
            x.report.first_index[s] = i;
            if (s == CTO_E_INVALID) x.report.first_bad_arg = bad;
        }
    }
    return x;
}

bool same_bits(double a, double b) { return std::memcmp(&a, &b, sizeof a) == 0; }

// One strided call of share over n elements; the call itself must be accepted.
cto_batch_report run_share(const char *const *ap, const ptrdiff_t *as, char *const *op,
                           const ptrdiff_t *os, signed char *st, ptrdiff_t ss, size_t n = kN) {
    cto_batch_report rep;
    rep.size = sizeof rep;
    REQUIRE(cto_call_strided(kShare, n, ap, as, op, os, st, ss, &rep) == CTO_OK);
    return rep;
}

void check_against(const Expected &x, const std::vector<double> &value,
                   const std::vector<signed char> &status, const cto_batch_report &rep) {
    for (size_t i = 0; i < kN; ++i) {
        INFO("element " << i << " (block " << i / kBlock << ")");
        REQUIRE(same_bits(value[i], x.value[i]));
        REQUIRE(status[i] == x.status[i]);
    }
    for (int s = 0; s < CTO_REPORT_SLOTS; ++s) {
        INFO("status " << s);
        CHECK(rep.count[s] == x.report.count[s]);
        if (rep.count[s] > 0) CHECK(rep.first_index[s] == x.report.first_index[s]);
    }
    CHECK(rep.first_bad_arg == x.report.first_bad_arg);
}

}  // namespace

TEST_CASE("share: the block path equals the scalar call in every memory layout",
          "[strided][blocks]") {
    const Columns c = make_columns();
    const Expected x = scalar_calls(c);
    // The data really takes both paths: the invalid, no-deal and indeterminate blocks
    // are there, and most elements are ok.
    REQUIRE(x.report.count[CTO_E_INVALID] == 2);
    REQUIRE(x.report.count[CTO_E_NO_DEAL] == 1);
    REQUIRE(x.report.count[CTO_E_INDETERMINATE] == 1);
    REQUIRE(x.report.count[CTO_OK] == kN - 4);

    const std::vector<const double *> cols = {c.own.data(), c.other.data(), c.surplus.data(),
                                              c.opens.data()};

    SECTION("contiguous and aligned") {
        std::vector<double> out(kN);
        std::vector<signed char> st(kN, -1);
        const char *ap[4];
        ptrdiff_t as[4];
        for (int j = 0; j < 4; ++j) {
            ap[j] = reinterpret_cast<const char *>(cols[static_cast<size_t>(j)]);
            as[j] = sizeof(double);
        }
        char *op[1] = {reinterpret_cast<char *>(out.data())};
        const ptrdiff_t os[1] = {sizeof(double)};
        const cto_batch_report rep = run_share(ap, as, op, os, st.data(), 1);
        check_against(x, out, st, rep);
    }

    SECTION("strided inputs and output, unaligned, statuses every third byte") {
        // Each column interleaved with a filler of 3 doubles, then shifted by one byte.
        std::vector<std::vector<unsigned char>> raw(4);
        const char *ap[4];
        ptrdiff_t as[4];
        for (size_t j = 0; j < 4; ++j) {
            raw[j].assign(kN * 4 * sizeof(double) + 1, 0xAB);
            for (size_t i = 0; i < kN; ++i)
                std::memcpy(&raw[j][1 + i * 4 * sizeof(double)], &cols[j][i], sizeof(double));
            ap[j] = reinterpret_cast<const char *>(raw[j].data() + 1);
            as[j] = 4 * sizeof(double);
        }
        std::vector<unsigned char> oraw(kN * 2 * sizeof(double) + 3);
        char *op[1] = {reinterpret_cast<char *>(oraw.data() + 3)};
        const ptrdiff_t os[1] = {2 * sizeof(double)};
        std::vector<signed char> st3(kN * 3, -1);
        const cto_batch_report rep = run_share(ap, as, op, os, st3.data(), 3);
        std::vector<double> out(kN);
        std::vector<signed char> st(kN);
        for (size_t i = 0; i < kN; ++i) {
            std::memcpy(&out[i], oraw.data() + 3 + i * 2 * sizeof(double), sizeof(double));
            st[i] = st3[i * 3];
        }
        check_against(x, out, st, rep);
    }

    SECTION("output on top of the first input (in place)") {
        std::vector<double> buf = c.own;
        std::vector<signed char> st(kN, -1);
        const char *ap[4] = {reinterpret_cast<const char *>(buf.data()),
                             reinterpret_cast<const char *>(c.other.data()),
                             reinterpret_cast<const char *>(c.surplus.data()),
                             reinterpret_cast<const char *>(c.opens.data())};
        const ptrdiff_t as[4] = {sizeof(double), sizeof(double), sizeof(double), sizeof(double)};
        char *op[1] = {reinterpret_cast<char *>(buf.data())};
        const ptrdiff_t os[1] = {sizeof(double)};
        const cto_batch_report rep = run_share(ap, as, op, os, st.data(), 1);
        check_against(x, buf, st, rep);
    }
}

TEST_CASE("share: broadcast surplus and opener flag on the block path", "[strided][blocks]") {
    // The wrappers pass scalar arguments with stride 0; the loop fills their block
    // buffer once.  Checked against cto_share element by element, for both openers and
    // for a broadcast surplus of 0 (every element no deal).
    const Columns c = make_columns();
    for (const double surplus : {250.0, 0.0}) {
        for (const double opens : {1.0, 0.0}) {
            std::vector<double> out(kN);
            std::vector<signed char> st(kN, -1);
            const char *ap[4] = {reinterpret_cast<const char *>(c.own.data()),
                                 reinterpret_cast<const char *>(c.other.data()),
                                 reinterpret_cast<const char *>(&surplus),
                                 reinterpret_cast<const char *>(&opens)};
            const ptrdiff_t as[4] = {sizeof(double), sizeof(double), 0, 0};
            char *op[1] = {reinterpret_cast<char *>(out.data())};
            const ptrdiff_t os[1] = {sizeof(double)};
            const cto_batch_report rep = run_share(ap, as, op, os, st.data(), 1);
            size_t counted[CTO_REPORT_SLOTS] = {};
            for (size_t i = 0; i < kN; ++i) {
                double v;
                const int s = cto_share(c.own[i], c.other[i], surplus, opens == 1.0, &v);
                INFO("element " << i << ", surplus " << surplus << ", opens " << opens);
                REQUIRE(same_bits(v, out[i]));
                REQUIRE(s == st[i]);
                ++counted[s];
            }
            for (int s = 0; s < CTO_REPORT_SLOTS; ++s) CHECK(rep.count[s] == counted[s]);
        }
    }
}

TEST_CASE("share: block values agree with the published formula", "[strided][blocks]") {
    // Rubinstein (1982), main theorem: the opener's share (1 - d_r)/(1 - d_o d_r), the
    // responder's d_r (1 - d_o)/(1 - d_o d_r) of a surplus of 1; evaluated here in long
    // double, so a wrong kernel (say, the branches swapped) fails at once.
    const Columns c = make_columns();
    std::vector<double> out(kN);
    const double one = 1.0, zero = 0.0;
    for (const double *opens : {&one, &zero}) {
        const char *ap[4] = {reinterpret_cast<const char *>(c.own.data()),
                             reinterpret_cast<const char *>(c.other.data()),
                             reinterpret_cast<const char *>(&one),
                             reinterpret_cast<const char *>(opens)};
        const ptrdiff_t as[4] = {sizeof(double), sizeof(double), 0, 0};
        char *op[1] = {reinterpret_cast<char *>(out.data())};
        const ptrdiff_t os[1] = {sizeof(double)};
        run_share(ap, as, op, os, nullptr, 0, kBlock * 2);
        for (size_t i = 0; i < kBlock * 2; ++i) {
            const long double d1 = c.own[i], d2 = c.other[i];
            const long double den = 1.0L - d1 * d2;
            const long double want = *opens == 1.0 ? (1.0L - d2) / den : d1 * (1.0L - d2) / den;
            INFO("element " << i);
            // Long double keeps 11 more bits than double; with factors within 1e-12 of 1
            // the naive 1 - d1 d2 still loses some, hence 1e-6 relative (the library's
            // own accuracy is checked against mpmath in test_reference.cpp).
            CHECK(std::fabs(out[i] - static_cast<double>(want)) <=
                  1e-6 * static_cast<double>(want) + 1e-300);
        }
    }
}
