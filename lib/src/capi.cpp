// The exported C functions: each one checks its output pointer, calls the core and
// guarantees that no C++ exception crosses the boundary (the core throws none; the
// guard turns a defect into CTO_E_INTERNAL instead of undefined behaviour).
#include <cstring>

#include "models.hpp"

namespace core = cto::core;

namespace {

template <class F>
int guarded(double *out, F &&f) {
    if (!out) return CTO_E_INVALID;
    try {
        return f();
    } catch (...) {
        *out = core::kNaN;
        return CTO_E_INTERNAL;
    }
}

}  // namespace

extern "C" {

CTO_API const char *cto_status_name(int status) {
    switch (status) {
        case CTO_OK: return "ok";
        case CTO_E_INVALID: return "invalid";
        case CTO_E_NO_DEAL: return "no_deal";
        case CTO_E_INDETERMINATE: return "indeterminate";
        case CTO_E_NO_CONVERGENCE: return "no_convergence";
        case CTO_E_INTERNAL: return "internal";
        default: return "unknown";
    }
}

CTO_API const char *cto_status_message(int status) {
    switch (status) {
        case CTO_OK: return "success: the output is the model's value";
        case CTO_E_INVALID:
            return "invalid argument (NaN, infinite or outside its domain): the output is NaN";
        case CTO_E_NO_DEAL:
            return "no rational deal (the surplus does not exceed what the parties get "
                   "without one): the output is own's no-deal payoff";
        case CTO_E_INDETERMINATE:
            return "indeterminate (many equilibria, e.g. both parties infinitely patient): "
                   "the output is NaN";
        case CTO_E_NO_CONVERGENCE:
            return "the numerical method did not converge: the output is NaN";
        case CTO_E_INTERNAL: return "internal error in the library: the output is NaN";
        default: return "unknown status code";
    }
}

CTO_API unsigned cto_version_number(void) { return CTO_VERSION_NUMBER; }
CTO_API const char *cto_version_string(void) { return CTO_VERSION_STRING; }

CTO_API int cto_round_factor(double rate, double days, double basis, int continuous,
                             double *out) {
    return guarded(out, [&] {
        return core::round_factor(rate, days, basis, continuous != 0, out, nullptr);
    });
}

CTO_API int cto_share(double own_factor, double other_factor, double surplus, int own_opens,
                      double *out) {
    return guarded(out, [&] {
        return core::share(own_factor, other_factor, surplus, own_opens != 0, out, nullptr);
    });
}

CTO_API int cto_share_from_rates(double own_rate, double other_rate, double days,
                                 double surplus, int own_opens, double basis, int continuous,
                                 double *out) {
    return guarded(out, [&] {
        return core::share_from_rates(own_rate, other_rate, days, surplus, own_opens != 0,
                                      basis, continuous != 0, out, nullptr);
    });
}

CTO_API int cto_limit_share(double own_rate, double other_rate, double surplus, double *out) {
    return guarded(out,
                   [&] { return core::limit_share(own_rate, other_rate, surplus, out, nullptr); });
}

CTO_API int cto_breakdown_share(double own_factor, double other_factor, double breakdown_prob,
                                double own_fallback, double other_fallback, double surplus,
                                int own_opens, double *out) {
    return guarded(out, [&] {
        return core::breakdown_share(own_factor, other_factor, breakdown_prob, own_fallback,
                                     other_fallback, surplus, own_opens != 0, out, nullptr);
    });
}

CTO_API int cto_outside_option_share(double own_factor, double other_factor,
                                     double own_outside, double other_outside, double surplus,
                                     int own_opens, double *out) {
    return guarded(out, [&] {
        return core::outside_option_share(own_factor, other_factor, own_outside, other_outside,
                                          surplus, own_opens != 0, out, nullptr);
    });
}

CTO_API int cto_inside_option_share(double own_factor, double other_factor, double own_inside,
                                    double other_inside, double surplus, int own_opens,
                                    double *out) {
    return guarded(out, [&] {
        return core::inside_option_share(own_factor, other_factor, own_inside, other_inside,
                                         surplus, own_opens != 0, out, nullptr);
    });
}

CTO_API int cto_solve(const cto_solve_input *in, cto_solve_outcome *out) {
    if (!out || out->size < sizeof(cto_solve_outcome)) return CTO_E_INVALID;
    auto fail = [out](int status) {
        out->own_share = out->other_share = out->own_no_deal = out->other_no_deal = core::kNaN;
        out->binding = CTO_BINDS_NONE;
        out->boundary = 0;
        out->deal_rational = 0;
        return status;
    };
    if (!in || in->size < sizeof(cto_solve_input)) return fail(CTO_E_INVALID);
    try {
        const core::SolveIn si{in->own_factor,
                               in->other_factor,
                               in->breakdown_prob,
                               in->own_fallback,
                               in->other_fallback,
                               in->own_inside,
                               in->other_inside,
                               in->has_own_outside ? in->own_outside : -core::kInf,
                               in->has_other_outside ? in->other_outside : -core::kInf,
                               in->surplus,
                               in->own_opens != 0};
        // A present option must be a finite number (absence is said with the flag).
        if ((in->has_own_outside && !std::isfinite(in->own_outside)) ||
            (in->has_other_outside && !std::isfinite(in->other_outside)))
            return fail(CTO_E_INVALID);
        core::SolveOut so;
        const int st = core::solve(si, &so, nullptr);
        out->own_share = so.own_share;
        out->other_share = so.other_share;
        out->own_no_deal = so.own_no_deal;
        out->other_no_deal = so.other_no_deal;
        out->binding = so.binding;
        out->boundary = so.boundary ? 1 : 0;
        out->deal_rational = so.rational ? 1 : 0;
        return st;
    } catch (...) {
        return fail(CTO_E_INTERNAL);
    }
}

CTO_API int cto_deadline_share(double own_factor, double other_factor, int64_t rounds,
                               double own_fallback, double other_fallback, double surplus,
                               int own_opens, double *out) {
    return guarded(out, [&] {
        return core::deadline_share(own_factor, other_factor, rounds, own_fallback,
                                    other_fallback, surplus, own_opens != 0, out, nullptr);
    });
}

CTO_API int cto_fixed_cost_share(double own_cost, double other_cost, double surplus,
                                 int own_opens, double *out) {
    return guarded(out, [&] {
        return core::fixed_cost_share(own_cost, other_cost, surplus, own_opens != 0, out,
                                      nullptr);
    });
}

CTO_API int cto_delay_cost(double factor, double stake, double breakdown_prob, double fallback,
                           double *out) {
    return guarded(out, [&] {
        return core::delay_cost(factor, stake, breakdown_prob, fallback, out, nullptr);
    });
}

CTO_API int cto_first_mover_advantage(double own_factor, double other_factor, double surplus,
                                      double *out) {
    return guarded(out, [&] {
        return core::first_mover_advantage(own_factor, other_factor, surplus, out, nullptr);
    });
}

CTO_API int cto_nash_share(double own_fallback, double other_fallback, double own_weight,
                           double surplus, double own_curvature, double other_curvature,
                           double *out) {
    return guarded(out, [&] {
        return core::nash_share(own_fallback, other_fallback, own_weight, surplus,
                                own_curvature, other_curvature, out, nullptr);
    });
}

CTO_API int cto_risk_averse_share(double own_factor, double other_factor, double own_curvature,
                                  double other_curvature, int utility, double breakdown_prob,
                                  double own_fallback, double other_fallback, double surplus,
                                  int own_opens, double *out) {
    return guarded(out, [&] {
        return core::risk_averse_share(own_factor, other_factor, own_curvature,
                                       other_curvature, utility, breakdown_prob, own_fallback,
                                       other_fallback, surplus, own_opens != 0, out, nullptr);
    });
}

CTO_API int cto_group_share(double factor, int64_t parties, int64_t position, double surplus,
                            double *out) {
    return guarded(out, [&] {
        return core::group_share(factor, parties, position, surplus, out, nullptr);
    });
}

CTO_API int cto_majority_share(double factor, int64_t parties, int64_t votes_needed, int role,
                               double surplus, double *out) {
    return guarded(out, [&] {
        return core::majority_share(factor, parties, votes_needed, role, surplus, out, nullptr);
    });
}

CTO_API int cto_implied_factor(double observed_share, double other_factor, int own_opens,
                               double *out) {
    return guarded(out, [&] {
        return core::implied_factor(observed_share, other_factor, own_opens != 0, out, nullptr);
    });
}

CTO_API int cto_implied_rate(double observed_share, double other_rate, double days,
                             int own_opens, double basis, int continuous, double *out) {
    return guarded(out, [&] {
        return core::implied_rate(observed_share, other_rate, days, own_opens != 0, basis,
                                  continuous != 0, out, nullptr);
    });
}

CTO_API int cto_share_sensitivity(double own_rate, double other_rate, double days, int wrt,
                                  double surplus, int own_opens, double basis, int continuous,
                                  double *out) {
    return guarded(out, [&] {
        return core::share_sensitivity(own_rate, other_rate, days, wrt, surplus, own_opens != 0,
                                       basis, continuous != 0, out, nullptr);
    });
}

CTO_API int cto_screening_profit(double high_value, double low_value, double high_prob,
                                 double seller_factor, double buyer_factor, double *out) {
    return guarded(out, [&] {
        return core::screening_profit(high_value, low_value, high_prob, seller_factor,
                                      buyer_factor, out, nullptr);
    });
}

}  // extern "C"
