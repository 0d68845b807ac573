// Numerical building blocks of the core: a bracketed root finder and
// cancellation-free elementary forms.
#ifndef CTO_NUMERICS_HPP
#define CTO_NUMERICS_HPP

#include <cfloat>
#include <cmath>

namespace cto::num {

// Result of a bracketed root search.
struct Root {
    double x;
    bool converged;
};

// Brent's method (Brent 1973, "Algorithms for Minimization without Derivatives",
// ch. 4, procedure zero): inverse quadratic interpolation and secant steps, safeguarded
// by bisection, on a bracket [a, b] with f(a) f(b) <= 0.  It stops when the bracket is
// narrower than 4 eps |x| + xtol, i.e. to full double precision; running out of
// iterations is reported, never hidden.
template <class F>
Root brent(F &&f, double a, double b, double fa, double fb, double xtol = 1e-300,
           int max_iter = 400) {
    if (fa == 0.0) return {a, true};
    if (fb == 0.0) return {b, true};
    if ((fa > 0.0) == (fb > 0.0) || !std::isfinite(fa) || !std::isfinite(fb))
        return {NAN, false};
    double c = a, fc = fa, d = b - a, e = d;
    for (int it = 0; it < max_iter; ++it) {
        if ((fb > 0.0) == (fc > 0.0)) {
            c = a;
            fc = fa;
            d = e = b - a;
        }
        if (std::fabs(fc) < std::fabs(fb)) {
            a = b;
            b = c;
            c = a;
            fa = fb;
            fb = fc;
            fc = fa;
        }
        const double tol = 2.0 * DBL_EPSILON * std::fabs(b) + 0.5 * xtol;
        const double m = 0.5 * (c - b);
        if (std::fabs(m) <= tol || fb == 0.0) return {b, true};
        if (std::fabs(e) < tol || std::fabs(fa) <= std::fabs(fb)) {
            d = e = m;  // bisection
        } else {
            double s = fb / fa, p, q;
            if (a == c) {  // secant
                p = 2.0 * m * s;
                q = 1.0 - s;
            } else {  // inverse quadratic interpolation
                const double qq = fa / fc, r = fb / fc;
                p = s * (2.0 * m * qq * (qq - r) - (b - a) * (r - 1.0));
                q = (qq - 1.0) * (r - 1.0) * (s - 1.0);
            }
            if (p > 0.0)
                q = -q;
            else
                p = -p;
            if (2.0 * p < 3.0 * m * q - std::fabs(tol * q) && p < std::fabs(0.5 * e * q)) {
                e = d;
                d = p / q;
            } else {
                d = e = m;
            }
        }
        a = b;
        fa = fb;
        b += (std::fabs(d) > tol) ? d : (m > 0.0 ? tol : -tol);
        fb = f(b);
        if (!std::isfinite(fb)) return {NAN, false};
    }
    return {b, false};
}

// Newton's method safeguarded by bisection (Press, Teukolsky, Vetterling & Flannery
// 2007, "Numerical Recipes", 3rd ed., s.9.4, rtsafe) for a strictly decreasing f whose
// root lies in [lo, hi], started at x.  fd(x, d) returns f(x) and sets d = f'(x).  Every
// value narrows the bracket by its sign; a step that leaves the bracket or does not
// shrink fast enough is replaced by bisection.  Converged means a Newton step below
// 2 eps |x| + xtol (quadratic convergence: the iterate it gives is accurate to the last
// bits), or a bracket narrower than that with both ends moved.  Otherwise (the root
// outside [lo, hi] after all, or out of iterations) it reports not converged, and the
// caller can fall back to brent(), which checks the bracket.
template <class FD>
Root newton_decreasing(FD &&fd, double lo, double hi, double x, double xtol = 1e-300,
                       int max_iter = 100) {
    bool lo_moved = false, hi_moved = false;
    double step_old = hi - lo, step = step_old;
    for (int it = 0; it < max_iter; ++it) {
        double d = 0.0;
        const double fx = fd(x, d);
        if (!std::isfinite(fx)) return {NAN, false};
        if (fx == 0.0) return {x, true};
        if (fx > 0.0) {
            lo = x;
            lo_moved = true;
        } else {
            hi = x;
            hi_moved = true;
        }
        const double tol = 2.0 * DBL_EPSILON * std::fabs(x) + xtol;
        const double dx = d < 0.0 ? fx / d : NAN;
        if (std::fabs(dx) <= tol) return {x - dx, true};  // before the bracket test: the
                                                          // step may round onto an end
        if (hi - lo <= tol) return {0.5 * (lo + hi), lo_moved && hi_moved};
        const double xn = x - dx;
        const bool newton = xn > lo && xn < hi && std::fabs(2.0 * dx) <= std::fabs(step_old);
        step_old = step;
        if (newton) {
            step = -dx;
            x = xn;
        } else {
            step = 0.5 * (hi - lo);
            x = lo + step;
        }
    }
    return {x, false};
}

// log(exp(a) + exp(b) + exp(c)) without overflow; -inf terms are skipped.
double log_sum_exp3(double a, double b, double c);

}  // namespace cto::num

#endif  // CTO_NUMERICS_HPP
