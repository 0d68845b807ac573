// Shared helpers for the C++ tests: valid base arguments for every catalogue function.
#ifndef CTO_TEST_SUPPORT_HPP
#define CTO_TEST_SUPPORT_HPP

#include <cmath>
#include <string>
#include <vector>

#include "counteroffer/counteroffer.h"

namespace cto_test {

// A valid, ordinary argument vector for function f: defaults where the catalogue has
// them, and a typical value for each required argument (a deal-room case: factors
// 0.9/0.95, a surplus of 1, fallbacks well below the surplus).
inline std::vector<double> base_args(const cto_function_info *f) {
    std::vector<double> a;
    const std::string fn = f->name;
    for (int j = 0; j < f->n_args; ++j) {
        const cto_arg_info &arg = f->args[j];
        const std::string n = arg.name;
        double v = arg.has_default ? arg.default_value : 0.0;
        if (!arg.has_default) {
            if (n == "own_factor" || n == "factor") v = 0.9;
            else if (n == "other_factor") v = 0.95;
            else if (n == "rate" || n == "own_rate") v = 0.08;
            else if (n == "other_rate") v = 0.05;
            else if (n == "days") v = 30;
            else if (n == "breakdown_prob") v = 0.05;
            else if (n == "own_fallback") v = 0.1;
            else if (n == "other_fallback") v = 0.2;
            else if (n == "own_outside") v = 0.1;
            else if (n == "other_outside") v = 0.3;
            else if (n == "own_inside") v = 0.05;
            else if (n == "other_inside") v = 0.1;
            else if (n == "rounds") v = 7;
            else if (n == "own_cost") v = 0.01;
            else if (n == "other_cost") v = 0.02;
            else if (n == "stake") v = 0.5;
            else if (n == "own_curvature") v = 0.5;
            else if (n == "other_curvature") v = 0.8;
            else if (n == "parties") v = 5;
            else if (n == "seller_low") v = 0.0;
            else if (n == "seller_high") v = 1.0;
            else if (n == "buyer_low") v = 0.25;
            else if (n == "buyer_high") v = 1.25;
            else if (n == "private_low") v = 0.0;
            else if (n == "private_high") v = 1.0;
            else if (n == "offerer_factor") v = 0.9;
            else if (n == "responder_factor") v = 0.85;
            else if (n == "observed_share") v = 0.55;
            else if (n == "high_value") v = 1.0;
            else if (n == "low_value") v = 0.5;
            else if (n == "high_prob") v = 0.45;
            else if (n == "seller_factor") v = 0.9;
            else if (n == "buyer_factor") v = 0.8;
            else v = NAN;  // a new argument name: the test will fail and say so
        }
        a.push_back(v);
    }
    return a;
}

inline int call(const cto_function_info *f, const std::vector<double> &a, double *out,
                int *bad = nullptr) {
    std::vector<double> o(static_cast<size_t>(f->n_outputs));
    const int st = cto_call(f->id, a.data(), o.data(), bad);
    *out = o[0];
    return st;
}

}  // namespace cto_test

#endif
