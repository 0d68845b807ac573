// Incomplete beta function and its inverse for PERT; see beta.hpp for the formulas.
#include "beta.hpp"

#include <algorithm>
#include <cmath>

namespace cto::core::range {
namespace {

constexpr double kPi = 3.141592653589793238462643383279502884;
constexpr double kTiny = 1e-300;  // Lentz's guard against a zero denominator
constexpr int kMaxTerms = 300;    // for a, b <= 5 the fraction converges in far fewer

// The continued fraction of I_x(a, b) (Numerical Recipes 3rd ed., s.6.4, betacf).
double beta_cf(double x, double a, double b) {
    const double qab = a + b, qap = a + 1.0, qam = a - 1.0;
    double c = 1.0, d = 1.0 - qab * x / qap;
    if (std::fabs(d) < kTiny) d = kTiny;
    d = 1.0 / d;
    double h = d;
    for (int m = 1; m <= kMaxTerms; ++m) {
        const double md = m, m2 = 2.0 * md;
        double aa = md * (b - md) * x / ((qam + m2) * (a + m2));
        d = 1.0 + aa * d;
        if (std::fabs(d) < kTiny) d = kTiny;
        c = 1.0 + aa / c;
        if (std::fabs(c) < kTiny) c = kTiny;
        d = 1.0 / d;
        h *= d * c;
        aa = -(a + md) * (qab + md) * x / ((a + m2) * (qap + m2));
        d = 1.0 + aa * d;
        if (std::fabs(d) < kTiny) d = kTiny;
        c = 1.0 + aa / c;
        if (std::fabs(c) < kTiny) c = kTiny;
        d = 1.0 / d;
        const double del = d * c;
        h *= del;
        if (std::fabs(del - 1.0) <= 0x1p-53) break;
    }
    return h;
}

// (1 - x)^b without rounding 1 - x where it would round.
double pow_one_minus(double x, double b) {
    return x < 0.5 ? std::exp(b * std::log1p(-x)) : std::pow(1.0 - x, b);
}

// x^a (1 - x)^b / B(a, b).
double beta_front(double x, double a, double b, double beta) {
    return std::pow(x, a) * pow_one_minus(x, b) / beta;
}

// I_x(a, b) for 0 < x < 1; *front receives x^a (1 - x)^b / B(a, b).
double inc_beta_inner(double x, double a, double b, double beta, double *front) {
    *front = beta_front(x, a, b, beta);
    if (x < (a + 1.0) / (a + b + 2.0)) return *front * beta_cf(x, a, b) / a;
    return 1.0 - *front * beta_cf(1.0 - x, b, a) / b;
}

// Starting value for the inverse, a, b >= 1 (Numerical Recipes 3rd ed., s.6.4, invbetai;
// Abramowitz & Stegun 1964, 26.5.22 and 26.2.22).
double start_value(double u, double a, double b) {
    const double pp = u < 0.5 ? u : 1.0 - u;
    const double t = std::sqrt(-2.0 * std::log(pp));
    double z = (2.30753 + t * 0.27061) / (1.0 + t * (0.99229 + t * 0.04481)) - t;
    if (u < 0.5) z = -z;
    const double al = (z * z - 3.0) / 6.0;
    const double h = 2.0 / (1.0 / (2.0 * a - 1.0) + 1.0 / (2.0 * b - 1.0));
    const double w = z * std::sqrt(al + h) / h -
                     (1.0 / (2.0 * b - 1.0) - 1.0 / (2.0 * a - 1.0)) * (al + 5.0 / 6.0 - 2.0 / (3.0 * h));
    const double x = a / (a + b * std::exp(2.0 * w));
    return (x > 0.0 && x < 1.0) ? x : 0.5;
}

}  // namespace

double beta_sum6(double a) {
    const double j = std::nearbyint(a);
    const double f = a - j;  // exact: a and j are within a factor of 2
    const double ratio = f == 0.0 ? 1.0 : (kPi * f) / std::sin(kPi * f);
    double prod = 1.0;
    for (int k = 1; k <= 5; ++k)
        if (k != static_cast<int>(j)) prod *= (k - a);
    const double sign = (static_cast<int>(j) % 2 == 0) ? -1.0 : 1.0;  // (-1)^(j+1)
    return sign * ratio * prod / 120.0;
}

double inc_beta(double x, double a, double b, double beta) {
    if (!(x > 0.0)) return 0.0;
    if (!(x < 1.0)) return 1.0;
    double front;
    return inc_beta_inner(x, a, b, beta, &front);
}

namespace {
// Halley's step for I_x(a, b) - u = 0 (Numerical Recipes 3rd ed., s.6.4, invbetai): with
// f' = x^(a-1) (1-x)^(b-1) / B = front / (x (1 - x)) and f''/f' = (a-1)/x - (b-1)/(1-x).
// *f receives I_x(a, b) - u; x itself is returned when f = 0.
double halley(double x, double u, double a, double b, double beta, double *f) {
    double front;
    *f = inc_beta_inner(x, a, b, beta, &front) - u;
    if (*f == 0.0) return x;
    const double t = *f * (x * (1.0 - x)) / front;
    const double curv = (a - 1.0) / x - (b - 1.0) / (1.0 - x);
    return x - t / (1.0 - 0.5 * std::min(1.0, t * curv));
}
}  // namespace

double inc_beta_halley_step(double x, double u, double a, double b, double beta) {
    double f;
    return halley(x, u, a, b, beta, &f);
}

double inc_beta_inv(double u, double a, double b, double beta) {
    if (!(u > 0.0)) return 0.0;
    if (!(u < 1.0)) return 1.0;
    if (a == 1.0 && b == 1.0) return u;
    if (a == 1.0) return -std::expm1(std::log1p(-u) / b);
    if (b == 1.0) return std::exp(std::log(u) / a);
    double x = start_value(u, a, b), lo = 0.0, hi = 1.0;
    for (int it = 0; it < 100; ++it) {
        double f;
        double xn = halley(x, u, a, b, beta, &f);
        if (f == 0.0) return x;
        if (f < 0.0) lo = x; else hi = x;
        if (!(xn > lo && xn < hi)) xn = 0.5 * (lo + hi);
        // Halley's step converges cubically: once a step is below 2^-50 x, the new
        // iterate is correct to rounding (further steps only move it by an ulp or so).
        if (std::fabs(xn - x) <= 0x1p-50 * xn || hi - lo <= 0x1p-52 * hi) return xn;
        x = xn;
    }
    return x;
}

}  // namespace cto::core::range
