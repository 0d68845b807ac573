// The reasons behind cto_explain.  Every message names the argument (by its catalogue
// name) and says what is wrong in plain words; numbers are written locale-independently.
#include "reasons.hpp"

#include <cmath>
#include <cstring>

#include "text.hpp"

namespace cto::table {
namespace {

Str choices_text(const cto_arg_info &a) {
    Str s;
    for (const char *const *c = a.choices; c && *c; ++c) {
        if (!s.empty()) s += ", ";
        s += *c;
    }
    return s;
}

// What is wrong with a value judged by its argument's kind alone, or "" when the value is
// fine by its kind (then a rule joining it to other arguments failed).
Str kind_problem(const cto_arg_info &a, double v) {
    if (std::isnan(v)) return "is empty or not a number";
    const bool finite = std::isfinite(v);
    switch (a.kind) {
        case CTO_ARG_UNIT: return (v >= 0.0 && v <= 1.0) ? "" : "is outside 0 to 1";
        case CTO_ARG_NONNEG: return !finite ? "is not a finite number" : v < 0.0 ? "is below 0" : "";
        case CTO_ARG_POSITIVE:
            return !finite ? "is not a finite number" : v <= 0.0 ? "must be above 0" : "";
        case CTO_ARG_BOOL: return (v == 0.0 || v == 1.0) ? "" : "must be TRUE or FALSE (1 or 0)";
        case CTO_ARG_COUNT:
            if (!finite || v != std::floor(v)) return "must be a whole number";
            if (v < static_cast<double>(a.min_count))
                return Str("must be at least ") + whole(a.min_count);
            return v >= 9223372036854775808.0 ? "is too large" : "";
        case CTO_ARG_CHOICE: {
            const bool whole = finite && v == std::floor(v) && v >= 0.0;
            int n = 0;
            for (const char *const *c = a.choices; c && *c; ++c) ++n;
            return whole && v < n ? "" : "must be one of: " + choices_text(a);
        }
        case CTO_ARG_OPTIONAL:
            return (finite || v == -INFINITY) ? "" : "is not a finite number";
        default: return finite ? "" : "is not a finite number";
    }
}

Str invalid_reason(const Row &r, const double *args, int bad) {
    if (bad < 0 || bad >= r.info.n_args) return "invalid argument";
    const cto_arg_info &a = r.info.args[bad];
    const double v = args[bad];
    Str what = kind_problem(a, v);
    const Str head = std::isnan(v) ? Str(a.name) + " " : Str(a.name) + " = " + num(v) + " ";
    if (!what.empty()) return std::isnan(v) ? Str(a.name) + " " + what : head + what;
    // Fine by its kind: a rule that joins it to other arguments, or a result too large
    // for double arithmetic (blamed on the money amount).
    if (r.rule[bad][0] != '\0') return head + "does not fit: " + r.rule[bad];
    return head + "does not fit the other arguments or the model's range (" + a.help + ")";
}

double arg_named(const Row &r, const double *args, const char *name, bool *found) {
    for (int j = 0; j < r.info.n_args; ++j)
        if (std::strcmp(r.info.args[j].name, name) == 0) {
            *found = true;
            return args[j];
        }
    *found = false;
    return 0.0;
}

Str no_deal_reason(const Row &r, const double *args, const double *out) {
    bool has_s = false;
    const double s = arg_named(r, args, "surplus", &has_s);
    Str text = "no rational deal (#N/A in Calc): ";
    text += has_s ? "the surplus " + num(s) : "the money to be split";
    text += " does not exceed what the parties get without a deal";
    if (r.no_deal_nan) {
        text += " (no type of the other side gains from a deal";
    } else {
        text += " (own " + num(out[0]);
        if (r.info.n_outputs > 1 && std::strcmp(r.info.outputs[1].name, "other_share") == 0)
            text += ", other " + num(out[1]);
    }
    return text + (r.no_deal_nan ? "); without a deal this result has no value"
                                 : "); the result is own's no-deal payoff");
}

Str ok_reason(const Row &r, const double *args) {
    for (int j = 0; j < r.info.n_args; ++j) {
        const Str note = slip_note(r, j, r.info.args[j].name, args[j]);
        if (!note.empty()) return "ok, but " + note;
    }
    return "ok";
}

}  // namespace

Str status_clause(const Row &r, const char *status) {
    const char *all = r.info.statuses ? r.info.statuses : "";
    const char *at = std::strstr(all, status);
    Str s;
    if (!at) return s;
    char one[2] = {0, 0};
    for (; *at && *at != ';'; ++at) {
        one[0] = *at;
        s += one;
    }
    return s;
}

Str slip_note(const Row &r, int j, const char *label, double v) {
    if (j < 0 || j >= r.info.n_args || r.plausible[j][0] == 0.0) return Str();
    const double lo = r.plausible[j][1], hi = r.plausible[j][2];
    if (v >= lo && v <= hi) return Str();
    return Str(label) + " = " + num(v) + " is outside the usual " + num(lo) + " to " + num(hi) +
           ": " + r.slip[j];
}

Str indeterminate_reason(const Row &r) {
    const Str c = status_clause(r, "indeterminate");
    return "indeterminate: many splits are equilibria, so there is no single answer" +
           (c.empty() ? Str() : Str(" (") + c + ")");
}

int explain(const Row &r, const double *args, char *text, size_t size) {
    double out[CTO_MAX_OUTPUTS];
    int bad = -1;
    const int st = r.thunk(args, out, &bad);
    Str s;
    switch (st) {
        case CTO_OK: s = ok_reason(r, args); break;
        case CTO_E_INVALID: s = invalid_reason(r, args, bad); break;
        case CTO_E_NO_DEAL: s = no_deal_reason(r, args, out); break;
        case CTO_E_INDETERMINATE: s = indeterminate_reason(r); break;
        case CTO_E_NO_CONVERGENCE:
            s = "the numerical method did not converge for these inputs: no result";
            break;
        default: s = "internal error in the library: please report the inputs"; break;
    }
    copy_out(s, text, size);
    return st;
}

}  // namespace cto::table
