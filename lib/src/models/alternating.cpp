// Alternating offers: fixed costs per round, the cost of one round of delay and the
// first-mover advantage.
// Formulas, sources and status tables are documented in the public header; the comments
// here explain the numerical choices.
#include <algorithm>
#include <cmath>

#include "alternating.hpp"

namespace cto::core {

// ---------------------------------------------------------------------------
// Fixed costs, delay, first mover
// ---------------------------------------------------------------------------
int fixed_cost_share(double own_cost, double other_cost, double surplus, bool own_opens,
                     double *out, int *bad) {
    Check c;
    c.nonneg(own_cost, 0);
    c.nonneg(other_cost, 1);
    c.real(surplus, 2);
    if (!c.ok()) return invalid(c, out, bad);
    const double S = surplus;
    if (!(S > 0.0)) return status_only(CTO_E_NO_DEAL, 0.0, out, bad);
    if (own_cost == other_cost && own_cost < S)
        return status_only(CTO_E_INDETERMINATE, kNaN, out, bad);
    // Proposer X with cost cx against responder cost cy (docs/models/complete-information.md
    // s.2, generalised):
    // cx < cy -> S;  cx > cy -> min(cy, S);  equal costs >= S -> S.
    auto proposer_share = [S](double cx, double cy) { return cx > cy ? std::min(cy, S) : S; };
    const double v = own_opens ? proposer_share(own_cost, other_cost)
                               : S - proposer_share(other_cost, own_cost);
    return status_only(CTO_OK, v, out, bad);
}

int delay_cost(double factor, double stake, double p, double fallback, double *out, int *bad) {
    Check c;
    c.unit(factor, 0);
    c.real(stake, 1);
    c.unit(p, 2);
    c.real(fallback, 3);
    if (!c.ok()) return invalid(c, out, bad);
    // stake - ((1-p) d stake + p fallback) = p (stake - fallback) + (1-p)(1-d) stake
    const double v = p * (stake - fallback) + (1.0 - p) * (1.0 - factor) * stake;
    return finish(v, out, bad, 1);
}

int first_mover_advantage(double own_factor, double other_factor, double surplus, double *out,
                          int *bad) {
    const int pre = rub_prologue(own_factor, other_factor, surplus, out, bad);
    if (pre >= 0) return pre;
    const double om_own = 1.0 - own_factor, om_oth = 1.0 - other_factor;
    const double v = surplus * (om_own * om_oth / rub_den(own_factor, om_own, om_oth));
    return finish(v, out, bad, 2);
}

}  // namespace cto::core
