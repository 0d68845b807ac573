// Estimators of share_range: sample quantiles, replicate statistics, error bars and the
// significant-digit target (docs/models/ranges.md, "Estimators and error bars").
//
//   Sample quantile, Hyndman & Fan (1996) definition 7: for sorted y_(0) <= ... <= y_(n-1)
//   and h = (n - 1) p, j = floor(h):  Q = y_(j) + (h - j)(y_(j+1) - y_(j))  (y_(n) = y_(n-1)).
//   Point estimate: definition 7 over all R n values pooled.  Standard error: the standard
//   deviation (divisor R - 1) of the R replicate estimates over sqrt(R) (Owen 1995, s.2 and
//   L'Ecuyer & Lemieux 2002 on independent replicates of a randomized QMC rule).
//   95% half-width: t_{R-1, 0.975} SE (Student 1908; the t quantiles are tabulated to 20
//   digits from mpmath in t_quantiles.inc).
//   Target (three significant digits by default): half-width <= 0.5 * 10^(E - digits + 1),
//   E = floor(log10 |Q|).
// Orders are IEEE totalOrder (-0 before +0); NaN never reaches these functions.  Sums run in
// index order with Neumaier's compensation (Neumaier 1974), so results do not depend on how
// the work was split.
#ifndef CTO_RANGE_QUANTILE_HPP
#define CTO_RANGE_QUANTILE_HPP

#include <cmath>
#include <cstddef>
#include <cstdint>
#include <vector>

namespace cto::core::range {

// Sorts y[0..n) in IEEE totalOrder (no NaN); `work` is working memory, reused between
// calls (may throw std::bad_alloc; the engine catches it).
struct SortWork {
    std::vector<uint64_t> keys;
    std::vector<uint32_t> count;
};
void sort_total(double *y, size_t n, SortWork &work);
// Reserves `work` for arrays of up to n values, so that sort_total then never allocates
// (and so never throws: the engine sorts in its worker threads).
void reserve_sort(SortWork &work, size_t n);
void sort_total(double *y, size_t n);

// Definition 7 quantile of sorted y[0..n), n >= 1, p in [0, 1].
double quantile7_sorted(const double *y, size_t n, double p);

// Definition 7 quantile of the union of k sorted segments seg[s][0..len) (equal lengths),
// without merging them: the two order statistics are found by bisection on the totalOrder
// keys, counting with binary searches in each segment.
double quantile7_pooled(const double *const *seg, size_t k, size_t len, double p);

// Neumaier-compensated running sum.
struct Sum {
    double s = 0.0, c = 0.0;
    void add(double x) {
        const double t = s + x;
        if (std::fabs(s) >= std::fabs(x)) c += (s - t) + x; else c += (x - t) + s;
        s = t;
    }
    double value() const { return s + c; }
};

// Mean and standard error (sd / sqrt(k), sd with divisor k - 1) of x[0..k), k >= 2.
struct MeanSe {
    double mean, se;
};
MeanSe mean_se(const double *x, size_t k);

// t_{nu, 0.975} for 1 <= nu <= kMaxNu; NaN otherwise.
inline constexpr int kMaxNu = 255;
double t975(int nu);

// Half a unit of significant digit `digits` of q: 0.5 * 10^(floor(log10|q|) - digits + 1);
// 0 for q = 0 (only an exact zero half-width reaches it).
double digit_tolerance(double q, int digits);

// The most significant digits d (0..17) with half_width <= digit_tolerance(q, d); 17 when
// the half-width is 0.
int digits_reached(double q, double half_width);

}  // namespace cto::core::range

#endif  // CTO_RANGE_QUANTILE_HPP
