// Inverse CDFs of the share_range input distributions against mpmath at 40 digits
// (tests/reference/range/dist_inverse.csv, written by make_inverse_table.py by bisection
// on the CDFs, independently of the library's closed forms and of its incomplete beta),
// the 15-digit check values D1-D16 (the closed form or 140-step bisection on mpmath's
// incomplete beta at 40 digits, confirmed by bisection on the triangular CDF and by
// scipy.special.betaincinv; make_inverse_table.py), and the closed-form means of
// the triangular and PERT distributions (Malcolm et al. 1959; Vose 2008).
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <fstream>
#include <string>
#include <vector>

#include "range/beta.hpp"
#include "range/distributions.hpp"
#include "test_csv.hpp"
#include "test_range_support.hpp"

using namespace cto::core::range;

namespace {

int kind_of(const std::string &s) {
    if (s == "uniform") return kUniform;
    if (s == "triangular") return kTriangular;
    return kPert;
}

struct Row {
    std::string source;
    Dist d;
    double u;
    long double value;
};

std::vector<Row> read_table() {
    std::ifstream in(std::string(CTO_REFERENCE_DIR) + "/range/dist_inverse.csv");
    std::vector<Row> rows;
    std::string line;
    std::getline(in, line);
    while (std::getline(in, line)) {
        const std::vector<std::string> f = cto_test::split_csv(line);
        if (f.size() != 7) continue;
        rows.push_back({f[0],
                        {kind_of(f[1]), std::stod(f[2]), std::stod(f[3]), std::stod(f[4])},
                        std::stod(f[5]),
                        std::stold(f[6])});
    }
    return rows;
}

}  // namespace

TEST_CASE("Inverse CDFs: within a few ulp of mpmath at 40 digits", "[range]") {
    const std::vector<Row> rows = read_table();
    REQUIRE(rows.size() == 520);
    double worst[4] = {0, 0, 0, 0};
    for (const Row &r : rows) {
      // Both paths: the engine's plan (PERT: the quintic Hermite table of pert_table.hpp)
      // and the direct iterative inverse.
      const DistPlan plan = dist_plan(r.d);
      for (const double v : {dist_quantile(plan, r.u), dist_quantile(r.d, r.u)}) {
        // Error in ulp of the largest of |value|, |low|, |high|: the result is formed as
        // low + (width) y or high - (width) y, so a value near zero inside a range of
        // larger magnitude cannot be closer than the rounding at that magnitude.
        const double scale = std::fmax(std::fabs(static_cast<double>(r.value)),
                                       std::fmax(std::fabs(r.d.low), std::fabs(r.d.high)));
        const double ulp = std::nextafter(scale, INFINITY) - scale;
        const double err_ulp = static_cast<double>(std::fabs(v - r.value)) / ulp;
        INFO(r.source << " kind " << r.d.kind << " (" << r.d.low << ", " << r.d.mode << ", "
                      << r.d.high << ") u=" << r.u << " got " << v << " want "
                      << static_cast<double>(r.value) << " err(ulp)=" << err_ulp);
        worst[r.d.kind] = std::fmax(worst[r.d.kind], err_ulp);
        // Uniform and triangular: a few roundings.  PERT: the inverse of an incomplete
        // beta whose value is good to a few ulp.  Measured worst (Debian 12, glibc 2.36):
        // uniform 1.4, triangular 0.8, PERT 2.6 ulp (the table path; the iterative 1.6).
        CHECK(err_ulp <= (r.d.kind == kPert ? 4.0 : 2.0));
      }
    }
    WARN("worst error in ulp: uniform " << worst[kUniform] << ", triangular "
                                         << worst[kTriangular] << ", PERT " << worst[kPert]);
}

TEST_CASE("Inverse CDFs: check values D1-D16", "[range]") {
    struct C { int kind; double lo, m, hi, u, want; };
    const C cs[] = {
        {kTriangular, 0.02, 0.05, 0.12, 0.1, 0.0373205080756888},
        {kTriangular, 0.02, 0.05, 0.12, 0.3, 0.0500000000000000},
        {kTriangular, 0.02, 0.05, 0.12, 0.5, 0.0608392021690038},
        {kTriangular, 0.02, 0.05, 0.12, 0.9, 0.0935424868893541},
        {kTriangular, 0, 0, 1, 0.05, 0.0253205655191036},
        {kTriangular, 0, 1, 1, 0.5, 0.707106781186548},
        {kTriangular, 100, 150, 300, 0.975, 272.613872124742},
        {kTriangular, -1, 0.5, 2, 0.25, 0.0606601717798213},
        {kPert, 0.05, 0.10, 0.20, 0.1, 0.0729541540514719},
        {kPert, 0.05, 0.10, 0.20, 0.5, 0.106371876050618},
        {kPert, 0.05, 0.10, 0.20, 0.9, 0.146668504643087},
        {kPert, 0, 0.5, 1, 0.01, 0.105639843550774},
        {kPert, 0.005, 0.02, 0.06, 0.3, 0.0178096042020480},
        {kPert, 0.005, 0.02, 0.06, 0.999, 0.0537621415860214},
        {kPert, 0, 0, 1, 0.5, 0.129449436703876},
        {kPert, 10, 20, 100, 0.7, 37.8615919913636},
    };
    for (const C &c : cs) {
        INFO("(" << c.lo << ", " << c.m << ", " << c.hi << ") u=" << c.u);
        // 15 significant digits are published.
        CHECK(dist_quantile(Dist{c.kind, c.lo, c.m, c.hi}, c.u) ==
              Approx(c.want).epsilon(1e-14));
    }
}

TEST_CASE("Inverse CDFs: PERT tables agree with the iterative inverse", "[range]") {
    // 2^16 + 1 probabilities per shape, including the generator's extreme coordinates; the
    // table path (pert_table.hpp: quintic Hermite, no incomplete beta per draw) against the
    // bracketed Halley iteration (beta.hpp).  An error of the interpolant (it is O(h^6))
    // or of a knot's derivatives would show here far above the bound.
    double worst = 0.0;
    for (const Dist d : {Dist{kPert, 0.05, 0.10, 0.20}, Dist{kPert, 0.0, 0.5, 1.0},
                         Dist{kPert, 0.005, 0.02, 0.06}, Dist{kPert, 0.0, 0.001, 1.0},
                         Dist{kPert, 0.0, 0.999, 1.0}, Dist{kPert, -5.0, 2.0, 3.0}}) {
        const DistPlan plan = dist_plan(d);
        REQUIRE(plan.table);
        const double scale = std::fmax(std::fabs(d.low), std::fabs(d.high));
        const double ulp = std::nextafter(scale, INFINITY) - scale;
        for (int i = 0; i <= 65536; ++i) {
            const double u = i == 0 ? 0x1p-33 : i == 65536 ? 1.0 - 0x1p-33 : i / 65536.0;
            const double err = std::fabs(dist_quantile(plan, u) - dist_quantile(d, u)) / ulp;
            worst = std::fmax(worst, err);
            INFO("(" << d.low << ", " << d.mode << ", " << d.high << ") u=" << u);
            // Each path is within a few ulp of the exact inverse, limited by the rounding
            // of I_x (up to about 4 ulp of I near the continued fraction's switch point,
            // measured against mpmath).  With mpmath as judge at the five probabilities of
            // PERT(-5, 2, 3) where the two paths differ by 9 ulp or more, the table path was
            // at most 6.1 and the iterative path 9.1 ulp of 5 from the exact inverse.  So
            // the two may differ by about 10 ulp of the scale.
            REQUIRE(err <= 12.0);
        }
    }
    WARN("PERT table path against the iterative inverse: worst " << worst << " ulp");
}

TEST_CASE("Inverse CDFs: means by midpoint quadrature match the closed forms", "[range]") {
    // Triangular mean (lo + m + hi)/3; PERT mean (lo + 4m + hi)/6 (Malcolm et al. 1959).
    // The midpoint rule over 2^16 cells of u has error O(n^-1.5) here (square-root ends).
    const int n = 1 << 16;
    for (const Dist d : {Dist{kTriangular, 0.02, 0.05, 0.12}, Dist{kPert, 0.05, 0.10, 0.20},
                         Dist{kPert, 0.0, 0.9, 1.0}, Dist{kTriangular, -1.0, 0.5, 2.0}}) {
        double s = 0.0;
        const DistPlan plan = dist_plan(d);
        for (int i = 0; i < n; ++i) s += dist_quantile(plan, (i + 0.5) / n);
        const double want = d.kind == kTriangular ? (d.low + d.mode + d.high) / 3.0
                                                  : (d.low + 4.0 * d.mode + d.high) / 6.0;
        CHECK(s / n == Approx(want).epsilon(1e-6));
    }
}

TEST_CASE("Inverse CDFs: constants, validation, ends", "[range]") {
    // lo = hi is a constant (docs/models/ranges.md, "Input distributions"), exactly.
    for (int k : {kUniform, kTriangular, kPert})
        for (double u : {1e-10, 0.3, 0.5, 0.9999})
            CHECK(dist_quantile(Dist{k, 0.07, 0.07, 0.07}, u) == 0.07);
    CHECK(dist_quantile(Dist{kFixed, 0, 0.25, 0}, 0.3) == 0.25);
    // Invalid: low > high, mode outside, NaN, infinite, unknown kind (docs/models/ranges.md, "Inputs, options, outputs").
    const double nan = std::nan("");
    for (const Dist d : {Dist{kUniform, 1, 0, 0}, Dist{kTriangular, 0, 2, 1},
                         Dist{kPert, 0, -1, 1}, Dist{kPert, nan, 0.5, 1},
                         Dist{kTriangular, 0, 0.5, INFINITY}, Dist{kFixed, 0, nan, 0},
                         Dist{7, 0, 0.5, 1}, Dist{kUniform, -1e308, 0, 1e308}}) {
        CHECK_FALSE(dist_valid(d));
        CHECK(std::isnan(dist_quantile(d, 0.5)));
    }
    CHECK(std::isnan(dist_quantile(Dist{kUniform, 0, 0, 1}, 0.0)));
    CHECK(std::isnan(dist_quantile(Dist{kUniform, 0, 0, 1}, 1.0)));
    // Monotone in u across the two halves of the PERT inverse.
    const Dist d{kPert, 0.05, 0.10, 0.20};
    double prev = 0.0;
    for (int i = 1; i < 4096; ++i) {
        const double v = dist_quantile(d, i / 4096.0);
        REQUIRE(v > prev);
        prev = v;
    }
}

TEST_CASE("Beta function B(a, 6 - a) against Gamma values", "[range]") {
    // B(3, 3) = 1/30, B(1, 5) = 1/5, B(2, 4) = 1/20; B(2.5, 3.5) = Gamma(2.5) Gamma(3.5) / 120
    // with Gamma(2.5) = 3 sqrt(pi)/4, Gamma(3.5) = 15 sqrt(pi)/8 (Abramowitz & Stegun 6.1.12).
    CHECK(beta_sum6(3.0) == Approx(1.0 / 30).epsilon(1e-15));
    CHECK(beta_sum6(1.0) == Approx(0.2).epsilon(1e-15));
    CHECK(beta_sum6(2.0) == Approx(0.05).epsilon(1e-15));
    const double pi = 3.141592653589793;
    CHECK(beta_sum6(2.5) == Approx(45.0 * pi / 32.0 / 120.0).epsilon(4e-16));
    // I_x(2, 4) = sum_{j=2..5} C(5, j) x^j (1-x)^(5-j) (binomial sum, A&S 26.5.4; every
    // term positive, so the sum is accurate to a few ulp).
    for (double x : {0.01, 0.2, 0.5, 0.8}) {
        const double y = 1 - x;
        const double want = 10 * x * x * y * y * y + 10 * x * x * x * y * y +
                            5 * x * x * x * x * y + x * x * x * x * x;
        CHECK(inc_beta(x, 2.0, 4.0, beta_sum6(2.0)) == Approx(want).epsilon(1e-14));
    }
}

TEST_CASE("Inverse CDFs: the PERT table's root v^(1/a) without exp or log", "[range]") {
    // pert_half_root (pert_table.hpp: octave and segment tables and the binomial series,
    // Abramowitz & Stegun 3.6.8) against the C library's long double power, on every octave
    // edge and segment edge the generator's v = (Y + 1/2) 2^-32 <= 1/2 can meet, and on 2^16
    // pseudo-random such v (SplitMix64).  Bound: four roundings of relative size 2^-53 (the
    // two tabulated constants, the sum and the product; the series' own error is below
    // 2^-60) are at most 4 ulp of the result; a wrong table entry or a missing series term
    // would be thousands.
    double worst = 0.0;
    for (const double a : {1.0 + 1e-9, 1.2, 1.8, 3.0, 4.6, 5.0 - 1e-9}) {
        PertHalf t;
        pert_half_build(a, 6.0 - a, beta_sum6(a), &t);
        auto check = [&](double v) {
            const long double want = std::pow(static_cast<long double>(v), 1.0L / a);
            const double got = pert_half_root(t, v);
            const double w = static_cast<double>(want);
            const double ulp = std::nextafter(w, INFINITY) - w;
            const double err = static_cast<double>(std::fabs(static_cast<long double>(got) - want)) / ulp;
            worst = std::fmax(worst, err);
            INFO("a=" << a << " v=" << v);
            REQUIRE(err <= 4.0);
        };
        uint64_t state = 7;
        for (int i = 0; i < 65536; ++i) {
            state += 0x9E3779B97F4A7C15ull;
            uint64_t z = state;
            z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9ull;
            z = (z ^ (z >> 27)) * 0x94D049BB133111EBull;
            z ^= z >> 31;
            check((static_cast<double>(z >> 33) + 0.5) * 0x1p-32);  // Y < 2^31: v < 1/2
        }
        for (int q = 1; q <= 33; ++q)
            for (int j = 0; j <= 64; ++j) {
                const double v = std::ldexp(1.0 + j / 64.0, -q - 1);  // segment and octave edges
                if (v >= 0x1p-33 && v <= 0.5) check(v);
            }
        check(0x1p-40);  // below the generator's range: the long double power
    }
    WARN("PERT root v^(1/a) against powl: worst " << worst << " ulp");
}

TEST_CASE("Inverse CDFs: a block of draws gives each draw's bits", "[range]") {
    // dist_quantile_block (the engine's loop; triangular and PERT eight at a time with
    // AVX-512 where the CPU has it, dist_simd.cpp) against dist_quantile on each coordinate alone, bit for
    // bit, for every kind, on 2^16 + 6 coordinates: SplitMix64 ones and the generator's
    // extremes, both sides of the median and of an octave, in blocks of 37 (so that the
    // vector path leaves points to the scalar one).
    std::vector<uint32_t> y = {0u, 1u, 0x7FFFFFFFu, 0x80000000u, 0x3FFFFFFFu, 0xFFFFFFFFu};
    uint64_t state = 11;
    while (y.size() < 65536 + 6) {
        state += 0x9E3779B97F4A7C15ull;
        uint64_t z = state;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9ull;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBull;
        y.push_back(static_cast<uint32_t>((z ^ (z >> 31)) >> 32));
    }
    std::vector<double> got(y.size());
    for (const Dist d : {Dist{kPert, 0.05, 0.10, 0.20}, Dist{kPert, 0.0, 0.5, 1.0},
                         Dist{kPert, 0.0, 0.001, 1.0}, Dist{kPert, -5.0, 2.0, 3.0},
                         Dist{kPert, 0.0, 0.0, 1.0}, Dist{kPert, 2.0, 2.0, 2.0},
                         Dist{kTriangular, 0.02, 0.05, 0.12}, Dist{kUniform, -1.0, 0.0, 3.0},
                         Dist{kFixed, 7.0, 7.0, 7.0}}) {
        const DistPlan plan = dist_plan(d);
        for (size_t b = 0; b < y.size(); b += 37)
            dist_quantile_block(plan, y.data() + b, std::min<size_t>(37, y.size() - b), got.data() + b);
        INFO("kind " << d.kind << " (" << d.low << ", " << d.mode << ", " << d.high << ")");
        for (size_t i = 0; i < y.size(); ++i) {
            const double want = dist_quantile(plan, (static_cast<double>(y[i]) + 0.5) * 0x1p-32);
            INFO("y=" << y[i]);
            REQUIRE(cto_range_test::bits(got[i]) == cto_range_test::bits(want));
        }
    }
}
