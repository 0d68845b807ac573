// cto_solve and cto_solve_rates: the combined model through its structs.
#include "adapters.hpp"

namespace core = cto::core;

namespace {

// An option flagged present travels as its value; absence is -infinity in the core, so a
// present value of -infinity is passed as NaN, which the model rejects like any
// non-finite option.
double option(int present, double value) {
    if (!present) return -core::kInf;
    return value == -core::kInf ? core::kNaN : value;
}

// The outcome written when the call itself is refused or fails: no shares, no deal.
core::SolveOut failed() {
    core::SolveOut o{};
    o.own_share = o.other_share = o.own_no_deal = o.other_no_deal = core::kNaN;
    o.own_delay_loss = o.other_delay_loss = o.opening_advantage = core::kNaN;
    o.binding = CTO_BINDS_NONE;
    o.boundary = false;
    o.rational = false;
    return o;
}

}  // namespace

extern "C" {

CTO_API int cto_solve(const cto_solve_input *in, cto_solve_outcome *out) {
    if (!out || out->size < cto::entry::kSolveOutcome10) return CTO_E_INVALID;
    core::SolveOut so;
    if (!in || in->size < sizeof(cto_solve_input)) {
        cto::entry::publish(failed(), out);
        return CTO_E_INVALID;
    }
    try {
        const core::SolveIn si{in->own_factor,      in->other_factor,
                               in->breakdown_prob,  in->own_fallback,
                               in->other_fallback,  in->own_inside,
                               in->other_inside,    option(in->has_own_outside, in->own_outside),
                               option(in->has_other_outside, in->other_outside),
                               in->surplus,         in->own_opens != 0};
        const int st = core::solve(si, &so, nullptr);
        cto::entry::publish(so, out);
        return st;
    } catch (...) {
        cto::entry::publish(failed(), out);
        return CTO_E_INTERNAL;
    }
}

CTO_API int cto_solve_rates(const cto_solve_rates_input *in, cto_solve_outcome *out) {
    if (!out || out->size < cto::entry::kSolveOutcome10) return CTO_E_INVALID;
    core::SolveOut so;
    if (!in || in->size < sizeof(cto_solve_rates_input)) {
        cto::entry::publish(failed(), out);
        return CTO_E_INVALID;
    }
    try {
        const core::SolveRatesIn si{in->own_rate,      in->other_rate,
                                    in->days,          in->breakdown_prob,
                                    in->own_fallback,  in->other_fallback,
                                    in->own_inside,    in->other_inside,
                                    option(in->has_own_outside, in->own_outside),
                                    option(in->has_other_outside, in->other_outside),
                                    in->surplus,       in->own_opens != 0,
                                    in->basis,         in->continuous != 0};
        const int st = core::solve_rates(si, &so, nullptr);
        cto::entry::publish(so, out);
        return st;
    } catch (...) {
        cto::entry::publish(failed(), out);
        return CTO_E_INTERNAL;
    }
}

}  // extern "C"
