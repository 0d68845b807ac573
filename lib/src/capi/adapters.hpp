// Hand-written adapters of the functions whose C interface is a struct (lib/functions/
// marks them `adapter = true`): their table thunk, and the one translation of the core's
// outcome into the public struct that both the thunk and the named C function use.
#ifndef CTO_CAPI_ADAPTERS_HPP
#define CTO_CAPI_ADAPTERS_HPP

#include <cstddef>

#include "../models.hpp"
#include "../table/convert.hpp"

namespace cto::entry {

// The size of cto_solve_outcome in version 1.0, before fields were appended: a caller
// built against 1.0 passes it, and gets the fields it knows.
constexpr size_t kSolveOutcome10 = offsetof(cto_solve_outcome, delayed);

// Whether the caller's struct holds field F (it was appended after 1.0).
#define CTO_HOLDS(out, F) ((out)->size >= offsetof(cto_solve_outcome, F) + sizeof((out)->F))

// The solve outcome in the public struct; fields past out->size are not written.
inline void publish(const core::SolveOut &so, cto_solve_outcome *out) {
    out->own_share = so.own_share;
    out->other_share = so.other_share;
    out->own_no_deal = so.own_no_deal;
    out->other_no_deal = so.other_no_deal;
    out->binding = so.binding;
    out->boundary = so.boundary ? 1 : 0;
    out->deal_rational = so.rational ? 1 : 0;
    if (CTO_HOLDS(out, delayed)) out->delayed = so.delayed ? 1 : 0;
    if (CTO_HOLDS(out, own_delay_loss)) out->own_delay_loss = so.own_delay_loss;
    if (CTO_HOLDS(out, other_delay_loss)) out->other_delay_loss = so.other_delay_loss;
    if (CTO_HOLDS(out, opening_advantage)) out->opening_advantage = so.opening_advantage;
}
#undef CTO_HOLDS

// The table's doubles from the public struct: own_share, other_share, binding (NaN where
// the status gives no answer: invalid, indeterminate, no convergence, internal) and
// rational (NaN for invalid and internal).
inline void to_values(int status, const cto_solve_outcome &c, double *o) {
    o[0] = c.own_share;
    o[1] = c.other_share;
    o[2] = status == CTO_OK || status == CTO_E_NO_DEAL ? static_cast<double>(c.binding)
                                                       : core::kNaN;
    o[3] = status == CTO_E_INVALID || status == CTO_E_INTERNAL ? core::kNaN
                                                               : (c.deal_rational ? 1.0 : 0.0);
    o[4] = c.own_delay_loss;
    o[5] = c.other_delay_loss;
    o[6] = c.opening_advantage;
    o[7] = status == CTO_OK || status == CTO_E_NO_DEAL ? (c.delayed ? 1.0 : 0.0) : core::kNaN;
}

// The table's outputs of a solve outcome: through the public struct (the one translation
// of the outcome, publish) into the catalogue order (to_values).  Returns st.
inline int solve_values(int st, const core::SolveOut &so, double *o) {
    cto_solve_outcome c;
    c.size = sizeof c;
    publish(so, &c);
    to_values(st, c, o);
    return st;
}

inline int solve_thunk(const double *a, double *o, int *bad) {
    bool opens;
    if (!table::to_bool(a[10], opens)) return table::reject(10, o, 8, bad);
    const core::SolveIn in{a[0], a[1], a[2], a[3], a[4], a[5], a[6], a[7], a[8], a[9], opens};
    core::SolveOut so;
    const int st = core::solve(in, &so, bad);
    return solve_values(st, so, o);
}

// solve_from_rates through the table: the 14 arguments in catalogue order, solve's outputs.
inline int solve_from_rates_thunk(const double *a, double *o, int *bad) {
    bool opens, continuous;
    if (!table::to_bool(a[11], opens)) return table::reject(11, o, 8, bad);
    if (!table::to_bool(a[13], continuous)) return table::reject(13, o, 8, bad);
    const core::SolveRatesIn in{a[0], a[1], a[2],  a[3],  a[4], a[5],  a[6],
                                a[7], a[8], a[9], a[10], opens, a[12], continuous};
    core::SolveOut so;
    const int st = core::solve_rates(in, &so, bad);
    return solve_values(st, so, o);
}

}  // namespace cto::entry

namespace cto::core {

// offer_path's totals without the rows: the table's and cto_offer_path's model.
inline int offer_totals(double private_low, double private_high, double offerer_factor,
                        double responder_factor, int64_t rounds, double known_value,
                        int offerer, OfferTotals *out, int *bad) {
    return offer_path(private_low, private_high, offerer_factor, responder_factor, rounds,
                      known_value, offerer, nullptr, 0, out, bad);
}

}  // namespace cto::core

#endif  // CTO_CAPI_ADAPTERS_HPP
