// Two-sided private values: the k-double auction and the efficiency bounds.
// The mathematics and sources are in trade.hpp and docs/models/private-information.md;
// the comments here explain the numerical choices.
//
// Numerics.  Every expectation is the integral of an affine function over a convex
// polygon: a rectangle of types (c, v) clipped by one half-plane v >= alpha + rho c.
// Such an integral is exact: area x the mean of the function at the three vertices of
// each triangle of a fan.  To keep it accurate far from the origin, all four endpoints
// are shifted by s_lo and scaled by a power of two S (exact) so that the rectangle and
// the trade region lie within [-2, 2]^2; the intersection points of the clip are formed
// from the line's own equation (never by interpolating along a long edge, which would
// cancel), and the fan starts at a vertex of the clipped polygon, so the triangles are
// small where the region is small.
#include <algorithm>
#include <cmath>

#include "trade.hpp"

namespace cto::core {

namespace {

struct Pt {
    double x, y;  // shifted, scaled cost and value
    bool on;      // on the clip line (exactly, by construction)
};
struct Poly {
    int n = 0;
    Pt p[8];
};

// The rectangle [x0, x1] x [y0, y1] clipped by y >= alpha + rho x (rho > 0), one pass of
// Sutherland-Hodgman over the corners in counter-clockwise order.
Poly clip_rect(double x0, double x1, double y0, double y1, double alpha, double rho) {
    const Pt corner[4] = {{x0, y0, false}, {x1, y0, false}, {x1, y1, false}, {x0, y1, false}};
    Poly out;
    for (int i = 0; i < 4; ++i) {
        const Pt &a = corner[i], &b = corner[(i + 1) % 4];
        const bool ina = a.y - alpha - rho * a.x >= 0.0;
        const bool inb = b.y - alpha - rho * b.x >= 0.0;
        if (ina) out.p[out.n++] = a;
        if (ina != inb) {
            Pt q;
            if (i % 2 == 0) {  // horizontal edge (y fixed)
                q = {(a.y - alpha) / rho, a.y, true};
            } else {  // vertical edge (x fixed)
                q = {a.x, alpha + rho * a.x, true};
            }
            out.p[out.n++] = q;
        }
    }
    return out;
}

// Integrals over the polygon of m affine functions given by their vertex values
// (fill(pt, vals) writes m values).  Returns the area; ints[j] the integral of f_j.
template <class F>
double integrate(const Poly &poly, int m, F fill, double *ints) {
    for (int j = 0; j < m; ++j) ints[j] = 0.0;
    if (poly.n < 3) return 0.0;
    double area = 0.0;
    double f0[6], f1[6], f2[6];
    fill(poly.p[0], f0);
    fill(poly.p[1], f1);
    for (int i = 1; i + 1 < poly.n; ++i) {
        const Pt &a = poly.p[0], &b = poly.p[i], &c = poly.p[i + 1];
        fill(c, f2);
        const double t = 0.5 * ((b.x - a.x) * (c.y - a.y) - (c.x - a.x) * (b.y - a.y));
        area += t;
        for (int j = 0; j < m; ++j) ints[j] += t * ((f0[j] + f1[j] + f2[j]) / 3.0);
        for (int j = 0; j < m; ++j) f1[j] = f2[j];
    }
    return area;
}

// The problem in shifted, scaled units: s_lo = 0, s_hi = ls, b_lo = bl, b_hi = d.
struct Frame {
    double s_lo, S;  // money = s_lo + S x (prices), S x (gains)
    double ls, lb, bl, d, k;
};

// Rectangle restricted to the gain w = y - x >= g: {area, integral of w}.
void gain_region(const Frame &f, double g, double *area, double *int_w) {
    const Poly poly = clip_rect(0.0, f.ls, f.bl, f.d, g, 1.0);
    double w[1];
    *area = integrate(poly, 1, [&](const Pt &p, double *v) { v[0] = p.on ? g : p.y - p.x; }, w);
    *int_w = w[0];
}

// H(g) x ls lb = integral of (2 w - d) over w >= g (Myerson-Satterthwaite with uniform
// virtual values); increasing on [0, d/2].
double ms_h(const Frame &f, double g) {
    const Poly poly = clip_rect(0.0, f.ls, f.bl, f.d, g, 1.0);
    double h[1];
    integrate(poly, 1, [&](const Pt &p, double *v) { v[0] = p.on ? 2.0 * g - f.d : 2.0 * (p.y - p.x) - f.d; }, h);
    return h[0];
}

// First best and second best (scaled units), into out (scaled; converted by the caller).
void efficiency_bounds(const Frame &f, TradeOut *o) {
    const double ls = f.ls, lb = f.lb, d = f.d, bl = f.bl;
    if (ls == 0.0 && lb == 0.0) {
        o->first_best_probability = 1.0;
        o->first_best_gain = d;
    } else if (ls == 0.0) {  // c = s known: w = v - s, uniform on [bl, d]
        o->first_best_probability = bl >= 0.0 ? 1.0 : d / lb;
        o->first_best_gain = bl >= 0.0 ? 0.5 * (d + bl) : 0.5 * d * (d / lb);
    } else if (lb == 0.0) {  // v = u known: w = u - c, c uniform on [0, ls]
        o->first_best_probability = d >= ls ? 1.0 : d / ls;
        o->first_best_gain = d >= ls ? d - 0.5 * ls : 0.5 * d * (d / ls);
    } else if (bl >= ls) {  // every value above every cost: E[w] by the means
        o->first_best_probability = 1.0;
        o->first_best_gain = 0.5 * (bl + d - ls);
    } else {
        double area, iw;
        gain_region(f, 0.0, &area, &iw);
        o->first_best_probability = std::min(1.0, area / ls / lb);
        o->first_best_gain = iw / ls / lb;
    }
    // Direct test for the first best (never the sign of a rounded H(0)).
    if (ls == 0.0 || lb == 0.0 || bl >= ls) {
        o->flags |= kTradeFlagFirstBestFeasible;
        o->second_best_threshold = 0.0;
        o->second_best_gain = o->first_best_gain;
        o->second_best_probability = o->first_best_probability;
        return;
    }
    double lo = 0.0, hi = 0.5 * d;  // H(lo) < 0 <= H(hi)
    for (int it = 0; it < 2200; ++it) {
        const double mid = 0.5 * (lo + hi);
        if (!(mid > lo && mid < hi)) break;
        (ms_h(f, mid) < 0.0 ? lo : hi) = mid;
    }
    const double g = std::fabs(ms_h(f, lo)) < std::fabs(ms_h(f, hi)) ? lo : hi;
    double area, iw;
    gain_region(f, g, &area, &iw);
    o->second_best_threshold = g;
    o->second_best_gain = iw / ls / lb;
    o->second_best_probability = area / ls / lb;
}

void set_all(TradeOut *o, double x) {
    o->trade_probability = o->expected_price = o->buyer_gain = o->seller_gain = x;
    o->total_gain = o->first_best_gain = o->first_best_probability = x;
    o->second_best_gain = o->second_best_threshold = o->second_best_probability = x;
    o->efficiency = o->second_best_efficiency = x;
    o->price_low = o->price_high = o->ask_floor = o->bid_ceiling = x;
}

// One-price equilibria: certain, efficient trade at the convention price.
void one_price(const Frame &f, TradeOut *o) {
    o->regime = kTradeOnePrice;
    o->flags |= kTradeFlagConvention;
    const double spread = f.bl - f.ls;  // >= 0: the interval of prices
    o->trade_probability = 1.0;
    o->expected_price = f.k * f.ls + (1.0 - f.k) * f.bl;
    o->buyer_gain = 0.5 * f.lb + f.k * spread;
    o->seller_gain = (1.0 - f.k) * spread + 0.5 * f.ls;
    o->total_gain = 0.5 * (f.bl + f.d - f.ls);
}

// The linear equilibrium (triangle and clamped) by the polygon algorithm.
void linear(const Frame &f, double a_lo, double b_hi, double b_floor, double a_ceil,
            TradeOut *o) {
    const double k = f.k, rho = (1.0 + k) / (2.0 - k);
    const double cstar = (2.0 - k) * b_floor - (1.0 - k) * b_hi;  // a_lin(c*) = B_lo
    const double vstar = (1.0 + k) * a_ceil - k * a_lo;            // b_lin(v*) = A_hi
    const double xs[3] = {0.0, std::clamp(cstar, 0.0, f.ls), f.ls};
    const double ys[3] = {f.bl, std::clamp(vstar, f.bl, f.d), f.d};
    double area = 0.0, ints[4] = {0, 0, 0, 0};  // w, v - p, p - c, p
    for (int i = 0; i < 2; ++i) {
        for (int j = 0; j < 2; ++j) {
            if (!(xs[i + 1] > xs[i]) || !(ys[j + 1] > ys[j])) continue;
            const bool ask_clamped = i == 0, bid_clamped = j == 1;
            const Poly poly = clip_rect(xs[i], xs[i + 1], ys[j], ys[j + 1], a_lo, rho);
            double part[4];
            area += integrate(poly, 4, [&](const Pt &p, double *v) {
                const double ask = ask_clamped ? b_floor : (p.x + (1.0 - k) * b_hi) / (2.0 - k);
                const double bid = bid_clamped ? a_ceil : (p.y + k * a_lo) / (1.0 + k);
                const double price = k * bid + (1.0 - k) * ask;
                v[0] = p.y - p.x;
                v[1] = p.y - price;
                v[2] = price - p.x;
                v[3] = price;
            }, part);
            for (int m = 0; m < 4; ++m) ints[m] += part[m];
        }
    }
    const double cell = f.ls * f.lb;
    o->trade_probability = std::min(1.0, area / cell);
    o->total_gain = ints[0] / cell;
    o->buyer_gain = ints[1] / cell;
    o->seller_gain = ints[2] / cell;
    o->expected_price = area > 0.0 ? ints[3] / area : kNaN;
}

// Posted ask (cost known) or posted bid (value known): the limits of the linear one.
void posted(const Frame &f, TradeOut *o) {
    const double k = f.k, d = f.d;
    if (f.ls == 0.0) {
        o->regime = kTradePostedAsk;
        const double ask = 0.5 * (1.0 - k) * d, above = 0.5 * (1.0 + k) * d;  // b_hi - A*
        o->trade_probability = above / f.lb;
        o->expected_price = ask;
        o->buyer_gain = 0.5 * above * (above / f.lb);
        o->seller_gain = ask * (above / f.lb);
    } else {
        o->regime = kTradePostedBid;
        const double bid = 0.5 * (2.0 - k) * d, below = 0.5 * k * d;  // u - B*
        o->trade_probability = bid / f.ls;
        o->expected_price = bid;
        o->seller_gain = 0.5 * bid * (bid / f.ls);
        o->buyer_gain = below * (bid / f.ls);
    }
    o->total_gain = o->buyer_gain + o->seller_gain;
}

// Equilibrium in scaled units; returns the regime's constants through o.
void solve_scaled(const Frame &f, TradeOut *o, double *b_floor, double *a_ceil) {
    const double k = f.k, d = f.d;
    *b_floor = *a_ceil = kNaN;
    if (f.ls == 0.0 || f.lb == 0.0) {
        const bool one = (f.ls == 0.0 && f.lb == 0.0) ||
                         (f.ls == 0.0 && f.bl > 0.5 * (1.0 - k) * d) ||
                         (f.lb == 0.0 && f.ls < 0.5 * (2.0 - k) * d);
        if (one) one_price(f, o);
        else posted(f, o);
        return;
    }
    const double a_lo = 0.5 * (1.0 - k) * d, b_hi = 0.5 * (2.0 - k) * d;
    *b_floor = (f.bl + k * a_lo) / (1.0 + k);
    *a_ceil = (f.ls + (1.0 - k) * b_hi) / (2.0 - k);
    if (std::fabs(*b_floor - *a_ceil) <= 1e-9 * d) o->flags |= kTradeFlagNearBoundary;
    if (*b_floor > *a_ceil) {
        one_price(f, o);
        *b_floor = *a_ceil = kNaN;
        return;
    }
    o->regime = (a_lo >= f.bl && b_hi <= f.ls) ? kTradeTriangle : kTradeClamped;
    linear(f, a_lo, b_hi, *b_floor, *a_ceil, o);
}

// Validates; on success fills the frame (or reports no gains through *none).
int make_frame(double s_lo, double s_hi, double b_lo, double b_hi, double k, Frame *f,
               bool *none, int *bad_index) {
    Check c;
    c.real(s_lo, 0);
    c.real(s_hi, 1);
    if (s_hi < s_lo) c.fail(1);  // a low above its high: the high is reported
    c.real(b_lo, 2);
    c.real(b_hi, 3);
    if (b_hi < b_lo) c.fail(3);
    c.unit(k, 4);
    const double ls = s_hi - s_lo, lb = b_hi - b_lo, d = b_hi - s_lo, bl = b_lo - s_lo;
    if (c.ok() && !std::isfinite(ls)) c.fail(1);
    if (c.ok() && !std::isfinite(bl)) c.fail(2);
    if (c.ok() && !(std::isfinite(lb) && std::isfinite(d))) c.fail(3);
    if (!c.ok()) {
        *bad_index = c.bad;
        return CTO_E_INVALID;
    }
    *none = !(d > 0.0);
    const double m = std::max({ls, lb, std::fabs(d), std::fabs(bl)});
    int e = 0;
    (void)std::frexp(m > 0.0 ? m : 1.0, &e);
    const double S = std::ldexp(1.0, std::min(e, 1023));
    *f = {s_lo, S, ls / S, lb / S, bl / S, d / S, k};
    return CTO_OK;
}

}  // namespace

namespace {
int solve(double seller_low, double seller_high, double buyer_low, double buyer_high,
          double k, bool bounds, TradeOut *o, int *bad);
}  // namespace

int double_auction(double seller_low, double seller_high, double buyer_low,
                   double buyer_high, double k, TradeOut *o, int *bad) {
    return solve(seller_low, seller_high, buyer_low, buyer_high, k, true, o, bad);
}

// The probability alone skips the first and second best (the bisection for g*).
int trade_probability(double seller_low, double seller_high, double buyer_low,
                      double buyer_high, double k, double *out, int *bad) {
    TradeOut o;
    const int st = solve(seller_low, seller_high, buyer_low, buyer_high, k, false, &o, bad);
    *out = o.trade_probability;
    return st;
}

namespace {
// The whole outcome; `bounds` adds the first and second best and the ratios.
int solve(double seller_low, double seller_high, double buyer_low, double buyer_high,
          double k, bool bounds, TradeOut *o, int *bad) {
    o->regime = kTradeNone;
    o->flags = 0;
    set_all(o, kNaN);
    Frame f{};
    bool none = false;
    int bi = -1;
    if (make_frame(seller_low, seller_high, buyer_low, buyer_high, k, &f, &none, &bi) !=
        CTO_OK) {
        if (bad) *bad = bi;
        return CTO_E_INVALID;
    }
    if (bad) *bad = -1;
    if (none) {
        o->trade_probability = o->buyer_gain = o->seller_gain = o->total_gain = 0.0;
        o->first_best_gain = o->first_best_probability = 0.0;
        o->second_best_gain = o->second_best_probability = 0.0;
        return CTO_E_NO_DEAL;
    }
    double b_floor, a_ceil;
    solve_scaled(f, o, &b_floor, &a_ceil);
    if (bounds) efficiency_bounds(f, o);
    const double S = f.S;
    o->efficiency = o->total_gain / o->first_best_gain;
    o->second_best_efficiency = o->second_best_gain / o->first_best_gain;
    o->expected_price = f.s_lo + S * o->expected_price;
    o->buyer_gain *= S;
    o->seller_gain *= S;
    o->total_gain *= S;
    o->first_best_gain *= S;
    o->second_best_gain *= S;
    o->second_best_threshold *= S;
    o->ask_floor = f.s_lo + S * b_floor;  // NaN stays NaN outside the linear regimes
    o->bid_ceiling = f.s_lo + S * a_ceil;
    if (f.bl >= f.ls) {
        o->flags |= kTradeFlagOnePriceExists;
        o->price_low = seller_high;
        o->price_high = buyer_low;
    }
    const double must[] = {o->trade_probability, o->buyer_gain, o->seller_gain,
                           o->total_gain, bounds ? o->first_best_gain : 0.0,
                           bounds ? o->second_best_gain : 0.0, o->expected_price};
    for (double x : must) {
        if (!std::isfinite(x)) {  // finite inputs whose results leave the double range
            o->flags = 0;
            o->regime = kTradeNone;
            set_all(o, kNaN);
            if (bad) *bad = 3;
            return CTO_E_INVALID;
        }
    }
    return CTO_OK;
}
}  // namespace

double TradeStrategies::ask(double cost) const {
    const double line = s_lo + ((cost - s_lo) + (1.0 - k) * (b_hi_line - s_lo)) / (2.0 - k);
    return std::max(ask_floor, line);
}
double TradeStrategies::bid(double value) const {
    const double line = s_lo + ((value - s_lo) + k * (a_lo - s_lo)) / (1.0 + k);
    return std::min(bid_ceiling, line);
}

bool trade_strategies(double seller_low, double seller_high, double buyer_low,
                      double buyer_high, double k, TradeStrategies *st) {
    TradeOut o;
    if (double_auction(seller_low, seller_high, buyer_low, buyer_high, k, &o, nullptr) !=
            CTO_OK ||
        (o.regime != kTradeTriangle && o.regime != kTradeClamped))
        return false;
    const double d = buyer_high - seller_low;
    *st = {seller_low, k, seller_low + 0.5 * (1.0 - k) * d, seller_low + 0.5 * (2.0 - k) * d,
           o.ask_floor, o.bid_ceiling};
    return true;
}

}  // namespace cto::core
