// Incomplete information: two-period screening of a buyer of unknown value.
// Formulas, sources and status tables are documented in the public header; the comments
// here explain the numerical choices.
#include <algorithm>
#include <cmath>

#include "incomplete.hpp"

namespace cto::core {

// ---------------------------------------------------------------------------
// Two-period screening (Fudenberg & Tirole 1983 setting)
// ---------------------------------------------------------------------------
int screening_profit(double high_value, double low_value, double high_prob,
                     double seller_factor, double buyer_factor, double *out, int *bad) {
    Check c;
    c.positive(high_value, 0);
    c.positive(low_value, 1);
    c.unit(high_prob, 2);
    c.unit(seller_factor, 3);
    c.unit(buyer_factor, 4);
    if (c.ok() && low_value > high_value) c.fail(1);
    if (!c.ok()) return invalid(c, out, bad);
    const double vH = high_value, vL = low_value, q = high_prob;
    const double ds = seller_factor, db = buyer_factor;
    const double pool = vL;
    const double screen = q * ((1.0 - db) * vH + db * vL) + (1.0 - q) * ds * vL;
    double best = std::max(pool, screen);
    if (q * vH > vL) {  // skim: only when q exceeds v_L / v_H
        const double skim = ((q * vH - vL) + ds * (1.0 - q) * vL) * (vH / (vH - vL));
        best = std::max(best, skim);
    }
    return finish(best, out, bad, 0);
}

}  // namespace cto::core
