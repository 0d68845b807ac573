// Where the naive formula loses digits and the library does not.  The reference is the
// same formula evaluated in 113-bit quadruple precision (libquadmath), an arithmetic
// independent of the library's double-precision expm1 forms.  docs/models/complete-information.md s.1: at
// Delta = 1e-12 the naive formula is off by about 2.5e-4.
#include <catch2/catch.hpp>

#include <quadmath.h>

#include <cmath>
#include <cstdio>

#include "counteroffer/counteroffer.h"

namespace {
// Rubinstein opener share from continuous rates, in quad precision.
double quad_share(double ra, double rb, double days) {
    const __float128 d = static_cast<__float128>(days) / 365;
    const __float128 num = -expm1q(-static_cast<__float128>(rb) * d);
    const __float128 den = -expm1q(-(static_cast<__float128>(ra) + rb) * d);
    return static_cast<double>(num / den);
}
double naive_share(double ra, double rb, double days) {
    const double da = std::exp(-ra * days / 365), db = std::exp(-rb * days / 365);
    return (1 - db) / (1 - da * db);
}
}  // namespace

TEST_CASE("share from rates: the naive formula loses digits, the library keeps them",
          "[accuracy]") {
    std::printf("%14s %14s %14s\n", "days", "naive rel err", "library rel err");
    const double ra = 0.10, rb = 0.05;  // check values 10-13 (test_published.cpp)
    double worst_lib = 0, worst_naive = 0;
    for (double days : {365.0, 30.0, 1.0, 1.0 / 24, 1.0 / 1440, 1.0 / 86400, 1e-9, 1e-12}) {
        const double ref = quad_share(ra, rb, days);
        double lib;
        REQUIRE(cto_share_from_rates(ra, rb, days, 1, 1, 365, 1, &lib) == CTO_OK);
        const double e_naive = std::fabs(naive_share(ra, rb, days) - ref) / ref;
        const double e_lib = std::fabs(lib - ref) / ref;
        std::printf("%14.6g %14.3g %14.3g\n", days, e_naive, e_lib);
        worst_lib = std::max(worst_lib, e_lib);
        CHECK(e_lib <= 1e-15);
        if (std::isfinite(e_naive)) worst_naive = std::max(worst_naive, e_naive);
    }
    std::printf("worst library error %.3g, worst naive error %.3g\n", worst_lib, worst_naive);
    CHECK(worst_naive > 1e-9);  // with offers minutes to seconds apart the naive form fails
}

TEST_CASE("round_factor and the factor route near 1", "[accuracy]") {
    // A factor within 1e-9 of 1 given as a double is exact; the library's 1 - d d'
    // is formed without cancellation, so share() keeps full relative accuracy.
    double worst_lib = 0, worst_naive = 0;
    for (int i = 1; i <= 2000; ++i) {
        const double eps = std::pow(10.0, -3.0 - 9.0 * i / 2000.0);  // 1e-3 .. 1e-12
        const double a = 1 - eps, b = 1 - 2.5 * eps;               // doubles near 1
        const __float128 qa = a, qb = b;
        const double ref = static_cast<double>((1 - qb) / (1 - qa * qb));
        double lib;
        REQUIRE(cto_share(a, b, 1, 1, &lib) == CTO_OK);
        const double naive = (1 - b) / (1 - a * b);
        worst_lib = std::max(worst_lib, std::fabs(lib - ref) / ref);
        worst_naive = std::max(worst_naive, std::fabs(naive - ref) / ref);
    }
    std::printf("factors within 1e-3..1e-12 of 1: library %.3g, naive %.3g\n", worst_lib,
                worst_naive);
    CHECK(worst_lib <= 1e-15);
    CHECK(worst_naive > 1e-10);  // six or more digits lost
}

namespace {
// Own share from annual rates in quad precision (the model of share_from_rates).
__float128 quad_share_rates(__float128 ro, __float128 rt, double days, bool opens, bool cont) {
    const __float128 t = static_cast<__float128>(days) / 365;
    const __float128 po = (cont ? ro : log1pq(ro)) * t, pt = (cont ? rt : log1pq(rt)) * t;
    const __float128 den = -expm1q(-(po + pt));
    return opens ? -expm1q(-pt) / den : expq(-po) * -expm1q(-pt) / den;
}
}  // namespace

TEST_CASE("share_sensitivity matches a high-precision numerical derivative", "[accuracy]") {
    // Central difference in 113-bit arithmetic: truncation h^2 ~ 1e-24, rounding ~ 1e-22.
    double worst = 0;
    for (double ro : {0.0, 0.02, 0.08, 0.35}) {
        for (double rt : {0.01, 0.05, 0.2}) {
            for (double days : {1.0 / 1440, 1.0, 30.0, 365.0}) {
                for (int opens = 0; opens < 2; ++opens) {
                    for (int cont = 0; cont < 2; ++cont) {
                        for (int wrt = 0; wrt < 2; ++wrt) {
                            const __float128 h = static_cast<__float128>(1e-12);
                            const __float128 qo = ro, qt = rt;
                            const __float128 up = wrt ? quad_share_rates(qo, qt + h, days, opens, cont)
                                                      : quad_share_rates(qo + h, qt, days, opens, cont);
                            const __float128 dn = wrt ? quad_share_rates(qo, qt - h, days, opens, cont)
                                                      : quad_share_rates(qo - h, qt, days, opens, cont);
                            if (ro == 0.0 && wrt == 0) continue;  // one-sided at the domain edge
                            const double ref = static_cast<double>((up - dn) / (2 * h)) * 1000;
                            double lib;
                            REQUIRE(cto_share_sensitivity(ro, rt, days, wrt, 1000, opens, 365, cont,
                                                          &lib) == CTO_OK);
                            const double e = ref == 0.0 ? std::fabs(lib) : std::fabs(lib - ref) / std::fabs(ref);
                            CAPTURE(ro, rt, days, opens, cont, wrt, lib, ref);
                            CHECK(e <= 1e-14);
                            worst = std::max(worst, e);
                        }
                    }
                }
            }
        }
    }
    std::printf("share_sensitivity against the quad derivative: worst rel err %.3g\n", worst);
}
