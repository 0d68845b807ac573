// Estimators of share_range; see quantile.hpp for the definitions and sources.
#include "quantile.hpp"

#include <algorithm>
#include <cmath>
#include <cstring>
#include <limits>
#include <utility>

namespace cto::core::range {
namespace {

// A key whose unsigned order is IEEE totalOrder on doubles.
uint64_t order_key(double x) {
    uint64_t b;
    std::memcpy(&b, &x, sizeof b);
    return (b >> 63) ? ~b : (b | (uint64_t{1} << 63));
}

double from_key(uint64_t k) {
    const uint64_t b = (k >> 63) ? (k & ~(uint64_t{1} << 63)) : ~k;
    double x;
    std::memcpy(&x, &b, sizeof x);
    return x;
}

// Number of values <= the value with key `k` in the sorted segments.
size_t count_le(const double *const *seg, size_t nseg, size_t len, uint64_t k) {
    size_t c = 0;
    for (size_t s = 0; s < nseg; ++s) {
        const double *b = seg[s];
        c += static_cast<size_t>(
            std::upper_bound(b, b + len, k, [](uint64_t key, double v) { return key < order_key(v); }) - b);
    }
    return c;
}

// The order statistic of rank r (0-based) of the union of the sorted segments.
double order_stat(const double *const *seg, size_t nseg, size_t len, size_t r) {
    uint64_t lo = 0, hi = ~uint64_t{0};  // the answer's key lies in [lo, hi]
    while (lo < hi) {
        const uint64_t mid = lo + (hi - lo) / 2;
        if (count_le(seg, nseg, len, mid) >= r + 1) hi = mid; else lo = mid + 1;
    }
    return from_key(lo);
}

}  // namespace

void sort_total(double *y, size_t n, std::vector<uint64_t> &keys) {
    // The integer keys are sorted instead of the doubles (same order, IEEE totalOrder).
    // Short arrays by comparison; longer ones by a least-significant-digit radix sort
    // (Knuth, TAOCP vol. 3, s.5.2.5) of eight 8-bit digits, skipping each digit that all
    // keys share (the shares of one deal agree in their leading bits).  A sort's result
    // does not depend on the method: equal keys are equal doubles.
    if (n < 256) {
        keys.resize(n);
        for (size_t i = 0; i < n; ++i) keys[i] = order_key(y[i]);
        std::sort(keys.begin(), keys.end());
        for (size_t i = 0; i < n; ++i) y[i] = from_key(keys[i]);
        return;
    }
    keys.resize(2 * n);
    uint64_t *a = keys.data(), *b = a + n;
    size_t count[8][256] = {};
    for (size_t i = 0; i < n; ++i) {
        const uint64_t k = order_key(y[i]);
        a[i] = k;
        for (int d = 0; d < 8; ++d) ++count[d][(k >> (8 * d)) & 0xFF];
    }
    for (int d = 0; d < 8; ++d) {
        size_t *c = count[d];
        if (c[(a[0] >> (8 * d)) & 0xFF] == n) continue;  // one bucket: the digit is shared
        size_t sum = 0;
        for (int v = 0; v < 256; ++v) {
            const size_t t = c[v];
            c[v] = sum;
            sum += t;
        }
        for (size_t i = 0; i < n; ++i) b[c[(a[i] >> (8 * d)) & 0xFF]++] = a[i];
        std::swap(a, b);
    }
    for (size_t i = 0; i < n; ++i) y[i] = from_key(a[i]);
}

void sort_total(double *y, size_t n) {
    std::vector<uint64_t> keys;
    sort_total(y, n, keys);
}

double quantile7_sorted(const double *y, size_t n, double p) {
    const double h = static_cast<double>(n - 1) * p;
    const double jf = std::floor(h);
    const size_t j = static_cast<size_t>(jf);
    if (j + 1 >= n) return y[n - 1];
    const double lo = y[j], hi = y[j + 1];
    if (lo == hi) return lo;
    return lo + (h - jf) * (hi - lo);
}

double quantile7_pooled(const double *const *seg, size_t k, size_t len, double p) {
    const size_t n = k * len;
    const double h = static_cast<double>(n - 1) * p;
    const double jf = std::floor(h);
    const size_t j = static_cast<size_t>(jf);
    const double lo = order_stat(seg, k, len, std::min(j, n - 1));
    if (j + 1 >= n) return lo;
    const double hi = order_stat(seg, k, len, j + 1);
    if (lo == hi) return lo;
    return lo + (h - jf) * (hi - lo);
}

void Sum::add(double x) {
    const double t = s + x;
    if (std::fabs(s) >= std::fabs(x)) c += (s - t) + x; else c += (x - t) + s;
    s = t;
}

MeanSe mean_se(const double *x, size_t k) {
    Sum s;
    for (size_t i = 0; i < k; ++i) s.add(x[i]);
    const double m = s.value() / static_cast<double>(k);
    Sum q;
    for (size_t i = 0; i < k; ++i) q.add((x[i] - m) * (x[i] - m));
    const double var = q.value() / static_cast<double>(k - 1);
    return {m, std::sqrt(var / static_cast<double>(k))};
}

double t975(int nu) {
    static constexpr double kT[kMaxNu] = {
#include "t_quantiles.inc"
    };
    if (nu < 1 || nu > kMaxNu) return std::numeric_limits<double>::quiet_NaN();
    return kT[nu - 1];
}

double digit_tolerance(double q, int digits) {
    if (q == 0.0 || !std::isfinite(q)) return 0.0;
    const double e = std::floor(std::log10(std::fabs(q)));
    return 0.5 * std::pow(10.0, e - digits + 1);
}

int digits_reached(double q, double half_width) {
    if (half_width == 0.0) return 17;
    int d = 0;
    while (d < 17 && half_width <= digit_tolerance(q, d + 1)) ++d;
    return d;
}

}  // namespace cto::core::range
