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

// The buckets of sort_total for n >= 256 keys: about 2n, at most 2^18.
int bucket_bits(size_t n) {
    const int log2n = 63 - __builtin_clzll(static_cast<unsigned long long>(n));
    return std::min(log2n + 1, 18);
}

}  // namespace

void reserve_sort(SortWork &work, size_t n) {
    work.keys.reserve(2 * n);
    work.count.reserve(n < 256 ? 0 : (size_t{1} << bucket_bits(n)) + 1);
}

void sort_total(double *y, size_t n, SortWork &work) {
    // The integer keys are sorted instead of the doubles (same order, IEEE totalOrder).
    // Short arrays by comparison.  Longer ones are distributed into about 2n buckets by
    // the leading bits of (key - least key), a counting sort (Knuth, TAOCP vol. 3, s.5.2,
    // "distribution counting"), and finished by one straight insertion pass over the
    // whole array, which moves keys only within their bucket.  The draws of a share fill a
    // continuous range of keys, so most buckets hold no key or one and the pass rarely
    // moves anything; a crowded bucket (many equal or nearly equal draws) is sorted by
    // std::sort first, so the work is never worse than n log n.  A sort's result does not
    // depend on the method: equal keys are equal doubles.
    std::vector<uint64_t> &keys = work.keys;
    if (n < 256) {
        keys.resize(n);
        for (size_t i = 0; i < n; ++i) keys[i] = order_key(y[i]);
        std::sort(keys.begin(), keys.end());
        for (size_t i = 0; i < n; ++i) y[i] = from_key(keys[i]);
        return;
    }
    keys.resize(2 * n);
    uint64_t *a = keys.data(), *b = a + n;
    uint64_t least = ~uint64_t{0}, most = 0;
    for (size_t i = 0; i < n; ++i) {
        const uint64_t k = order_key(y[i]);
        a[i] = k;
        least = std::min(least, k);
        most = std::max(most, k);
    }
    if (least == most) return;  // every value the same bits: sorted already
    const int span = 64 - __builtin_clzll(static_cast<unsigned long long>(most - least));
    const int bits = std::min(bucket_bits(n), span);
    const int shift = span - bits;
    const size_t nb = size_t{1} << bits;
    work.count.assign(nb + 1, 0u);
    uint32_t *start = work.count.data();  // start[v + 1]: bucket v's count, start, then end
    for (size_t i = 0; i < n; ++i) ++start[((a[i] - least) >> shift) + 1];
    uint32_t sum = 0;
    bool crowded = false;
    for (size_t v = 1; v <= nb; ++v) {
        const uint32_t c = start[v];
        start[v] = sum;
        sum += c;
        crowded = crowded || c > 32;
    }
    for (size_t i = 0; i < n; ++i) b[start[((a[i] - least) >> shift) + 1]++] = a[i];
    for (size_t v = 0; crowded && v < nb; ++v)  // now bucket v is b[start[v], start[v + 1])
        if (start[v + 1] - start[v] > 32) std::sort(b + start[v], b + start[v + 1]);
    for (size_t i = 1; i < n; ++i) {  // moves a key within its bucket only
        const uint64_t k = b[i];
        size_t j = i;
        for (; j > 0 && b[j - 1] > k; --j) b[j] = b[j - 1];
        b[j] = k;
    }
    for (size_t i = 0; i < n; ++i) y[i] = from_key(b[i]);
}

void sort_total(double *y, size_t n) {
    SortWork work;
    sort_total(y, n, work);
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
