// The root finders of the core (lib/src/numerics.hpp) and the model that uses Newton's
// method: risk_averse_share with exponential utility.  References: the C library's cbrt
// (within 1 ulp), and the stationary conditions of Binmore, Rubinstein & Wolinsky (1986)
// / Muthoo (1999) ch.3-4 solved by bisection in 113-bit quad precision in the test.
#include <catch2/catch.hpp>

#include <quadmath.h>

#include <cmath>
#include <random>

#include "../../lib/src/numerics.hpp"
#include "counteroffer/counteroffer.h"

using cto::num::newton_decreasing;

TEST_CASE("safeguarded Newton: converges to the last bits, and says when it cannot",
          "[solver]") {
    // f(x) = 2 - x^3 on [0, 4] from the far end: root cbrt(2) (C library, within 1 ulp).
    auto cube = [](double x, double &d) {
        d = -3.0 * x * x;
        return 2.0 - x * x * x;
    };
    const auto r = newton_decreasing(cube, 0.0, 4.0, 3.9);
    REQUIRE(r.converged);
    CHECK(std::fabs(r.x - std::cbrt(2.0)) <= 2.3e-16 * std::cbrt(2.0));
    // A derivative of no use (0): bisection alone still finds the root 1 of 1 - x.
    auto flat = [](double x, double &d) {
        d = 0.0;
        return 1.0 - x;
    };
    const auto b = newton_decreasing(flat, 0.0, 4.0, 3.0);
    REQUIRE(b.converged);
    CHECK(std::fabs(b.x - 1.0) <= 4.5e-16);
    // The root (5) outside the bracket [0, 1]: never reported as converged.
    auto outside = [](double x, double &d) {
        d = -1.0;
        return 5.0 - x;
    };
    CHECK_FALSE(newton_decreasing(outside, 0.0, 1.0, 0.5).converged);
    // A function that turns to NaN: not converged, NaN.
    auto nan = [](double, double &d) {
        d = -1.0;
        return NAN;
    };
    const auto n = newton_decreasing(nan, 0.0, 1.0, 0.5);
    CHECK_FALSE(n.converged);
    CHECK(std::isnan(n.x));
}

namespace {
// Exponential utility u(x) = (1 - e^{-k x})/k and its inverse, in quad precision.
__float128 u(__float128 k, __float128 x) { return -expm1q(-k * x) / k; }
__float128 u_inv(__float128 k, __float128 w) { return -log1pq(-k * w) / k; }

// A's proposer share x of the stationary pair (x, y) (BRW 1986; Muthoo 1999 ch.4):
//   u_A(S - y) = p u_A(b_A) + (1-p) d_A u_A(x),  u_B(S - x) = p u_B(b_B) + (1-p) d_B u_B(y)
// by bisection on x: R(x) = u_B(S - x) - p u_B(b_B) - (1-p) d_B u_B(y(x)) decreases in x.
__float128 quad_share(double dA, double dB, double kA, double kB, double p, double bA,
                      double bB, double S) {
    const __float128 KA = kA, KB = kB, P = p, Q = 1 - static_cast<__float128>(p);
    auto y_of = [&](__float128 x) {
        return S - u_inv(KA, P * u(KA, bA) + Q * dA * u(KA, x));
    };
    auto R = [&](__float128 x) {
        return u(KB, S - x) - P * u(KB, bB) - Q * dB * u(KB, y_of(x));
    };
    __float128 lo = -4 * static_cast<__float128>(S), hi = 4 * static_cast<__float128>(S);
    for (int i = 0; i < 300 && hi - lo > static_cast<__float128>(1e-32) * fabsq(hi); ++i) {
        const __float128 m = (lo + hi) / 2;
        (R(m) > 0 ? lo : hi) = m;
    }
    return (lo + hi) / 2;
}
}  // namespace

TEST_CASE("risk_averse_share, exponential: Newton's root equals a quad-precision bisection",
          "[solver][property]") {
    std::mt19937_64 rng(20261202);
    std::uniform_real_distribution<double> uni(0.0, 1.0);
    double worst = 0.0;
    for (int i = 0; i < 400; ++i) {
        const double dA = 1.0 - std::pow(10.0, -6.0 * uni(rng) - 0.3);  // 0.5 .. 1 - 1e-6
        const double dB = 1.0 - std::pow(10.0, -6.0 * uni(rng) - 0.3);
        const double S = std::pow(10.0, 4.0 * uni(rng) - 2.0);         // 0.01 .. 100
        const double kA = std::pow(10.0, 2.0 * uni(rng) - 1.0) / S;     // k S in 0.1 .. 10
        const double kB = std::pow(10.0, 2.0 * uni(rng) - 1.0) / S;
        const double p = i % 3 == 0 ? 0.0 : 0.3 * uni(rng);
        const double bA = i % 2 ? 0.0 : 0.2 * S * uni(rng), bB = 0.2 * S * uni(rng);
        double own_open = NAN, own_resp = NAN;
        REQUIRE(cto_risk_averse_share(dA, dB, kA, kB, CTO_UTILITY_EXPONENTIAL, p, bA, bB, S, 1,
                                      &own_open) == CTO_OK);
        // As responder, own is party B of the pair in which the other side (here given
        // the same parameters as A) opens.
        REQUIRE(cto_risk_averse_share(dB, dA, kB, kA, CTO_UTILITY_EXPONENTIAL, p, bB, bA, S, 0,
                                      &own_resp) == CTO_OK);
        const __float128 x = quad_share(dA, dB, kA, kB, p, bA, bB, S);
        const double want_open = static_cast<double>(x), want_resp = static_cast<double>(S - x);
        INFO("case " << i << ": dA " << dA << " dB " << dB << " kA " << kA << " kB " << kB
                     << " p " << p << " S " << S);
        const double e1 = std::fabs(own_open - want_open) / S;
        const double e2 = std::fabs(own_resp - want_resp) / S;
        CHECK(e1 <= 2e-15);
        CHECK(e2 <= 2e-15);
        worst = std::max(worst, std::max(e1, e2));
    }
    WARN("worst error relative to the surplus: " << worst);
}
