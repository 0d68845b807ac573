// DEALRANGE, DEALRANGEOUTCOME and DEALSWING: the Calc forms of share_range and
// share_swing (cto_share_range, cto_share_swing; addin/README.md "Ranges").
//
// Conversion only.  Each of the 14 inputs (range_args.h) is left out (its catalogue
// default, fixed), one cell (fixed), 2 cells in a row or a column (low, high: uniform) or
// 3 cells (low, mode, high: PERT, or triangular with the shape argument); any other shape
// is Err:502.  An empty cell or text inside is NaN, which the library rejects.  The
// library validates everything else and names the bad input (out.bad), which becomes
// Err:502 for that argument.  Precision not reached (CTO_E_PRECISION) is Err:523 for
// each quantile short of the digit target; DEALRANGEOUTCOME shows every estimate with its
// half-width, its digits and the status word.  DEALREASON("DEALRANGE"; ...) (and
// "DEALRANGEOUTCOME", "DEALSWING") converts the same arguments with the same functions
// and returns the library's reason (cto_range_explain, cto_swing_explain), or what a
// value the add-in could not convert must be.
#ifndef CTO_ADDIN_RANGES_HXX
#define CTO_ADDIN_RANGES_HXX

#include <algorithm>
#include <cstdio>
#include <vector>

#include "convert.hxx"
#include "range_args.h"

namespace {

using Table = std::vector<const cto_function_info *>;
using cto_addin::kRangeInputs;

const cto_arg_info kNumberArg = {"value", "Value", "", CTO_ARG_REAL, 0, 0.0, 0, nullptr};

// The catalogue's description of the argument called `name` (its label, help, kind and
// default): the first one with a default, else the first (a walk-away value is required
// in DEALOUTSIDE but optional in the combined model, whose inputs these are).  The same
// rule as gen/addin_gen.cpp, so the Function Wizard and the glue agree.
const cto_arg_info *catalogue_arg(const Table &table, const char *name) {
    const cto_arg_info *first = nullptr;
    for (const cto_function_info *f : table) {
        if (!f) continue;
        for (int j = 0; j < f->n_args; ++j) {
            const cto_arg_info &a = f->args[j];
            if (!a.name || std::strcmp(a.name, name) != 0) continue;
            if (a.has_default) return &a;
            if (!first) first = &a;
        }
    }
    return first;
}

struct RangeArgs {
    const cto_arg_info *info[kRangeInputs];

    explicit RangeArgs(const Table &t) {
        for (int j = 0; j < kRangeInputs; ++j) {
            info[j] = catalogue_arg(t, cto_addin::kRangeInputNames[j]);
            if (!info[j])
                throw css::uno::RuntimeException(
                    "counteroffer: the add-in was built for another catalogue");
        }
    }
    // The label of argument j (0-based) of DEALRANGE, for messages.
    const char *label(int j) const {
        if (j >= 0 && j < kRangeInputs) return info[j]->label;
        if (j >= kRangeInputs && j < kRangeInputs + cto_addin::kRangeExtras)
            return cto_addin::kRangeExtra[j - kRangeInputs].label;
        return "";
    }
};

bool omitted(const Arg &a) {
    return !a.seq && a.any->getValueTypeClass() == css::uno::TypeClass_VOID;
}

// A given cell or range element: empty is NaN (invalid), never the default.
double given_value(const css::uno::Any &v, const cto_arg_info &info) {
    return v.getValueTypeClass() == css::uno::TypeClass_VOID ? kNaN : to_double(v, info);
}

// One input of share_range from its Calc argument (see the head of this file).
cto_range_arg range_input(const char *calc, int j, const Arg &a, const cto_arg_info &info,
                          int shape) {
    cto_range_arg r{CTO_RANGE_FIXED, kNaN, kNaN, kNaN};
    if (omitted(a)) {
        r.low = r.mode = r.high = info.has_default ? info.default_value : kNaN;
        return r;
    }
    View v;
    if (!make_view(a, v) || (v.rows != 1 && v.cols != 1) || v.rows > 3 || v.cols > 3)
        throw_invalid_arg(calc, j, info.label,
                          "one cell, or 2 cells (low, high) or 3 (low, mode, high) in a row "
                          "or a column");
    const sal_Int32 n = v.rows * v.cols;
    double x[3];
    for (sal_Int32 i = 0; i < n; ++i)
        x[i] = given_value(v.rows == 1 ? v.at(0, i) : v.at(i, 0), info);
    if (n == 1) {
        r.low = r.mode = r.high = x[0];
    } else if (n == 2) {
        r.kind = CTO_RANGE_UNIFORM;  // the library takes a uniform range's mode as its midpoint
        r.low = x[0];
        r.high = x[1];
    } else {
        r.kind = shape;
        r.low = x[0];
        r.mode = x[1];
        r.high = x[2];
    }
    return r;
}

// The shape of every 3-cell input: "pert" (default) or "triangular", any case.
int range_shape(const char *calc, const Arg &a) {
    if (omitted(a)) return CTO_RANGE_PERT;
    View v;
    if (make_view(a, v) && v.rows == 1 && v.cols == 1 &&
        v.first().getValueTypeClass() == css::uno::TypeClass_STRING) {
        const OUString s = static_cast<const OUString *>(v.first().getValue())->trim();
        if (equals_ignore_case(s, "pert")) return CTO_RANGE_PERT;
        if (equals_ignore_case(s, "triangular")) return CTO_RANGE_TRIANGULAR;
    }
    throw_invalid_arg(calc, cto_addin::kArgShape, cto_addin::kRangeExtra[1].label,
                      "\"pert\" or \"triangular\"");
}

// One number from an optional single-value argument (NaN when it is not one).
double single_value(const Arg &a) {
    View v;
    if (!make_view(a, v) || v.rows != 1 || v.cols != 1) return kNaN;
    return given_value(v.first(), kNumberArg);
}

// The seed: a whole number 0..2^53 (a double holds no more exactly); the option is an
// unsigned integer, so a value that cannot become one is Err:502 here.
std::uint64_t range_seed(const char *calc, const Arg &a) {
    if (omitted(a)) return 0;
    const double s = single_value(a);
    if (!(s >= 0.0 && s <= 9007199254740992.0 && s == std::floor(s)))
        throw_invalid_arg(calc, cto_addin::kArgSeed, cto_addin::kRangeExtra[2].label,
                          "a whole number from 0 to 2^53");
    return static_cast<std::uint64_t>(s);
}

// The digit target: a whole number passes as it is (beyond +/-10^6 as +/-10^6), for the
// library to judge (out.bad names the digits option); anything else cannot become one.
int range_digits(const char *calc, const Arg &a) {
    if (omitted(a)) return cto_addin::kDefaultDigits;
    const double d = single_value(a);
    if (!(d == std::floor(d)))
        throw_invalid_arg(calc, cto_addin::kArgDigits, cto_addin::kRangeExtra[3].label,
                          "a whole number");
    return static_cast<int>(std::max(-1e6, std::min(1e6, d)));
}

// The probabilities: left out, DEALRANGE's 0.5 (the outcome form keeps the library's
// 0.1, 0.5, 0.9); a value; or a range of at most CTO_RANGE_MAX_PROBS, row-major.
struct Probs {
    sal_Int32 rows = 1, cols = 1;
    bool array = false;  // given as a range (or inline array): the result has its shape
};
Probs range_probs(const char *calc, const Arg &a, bool outcome, cto_range_options &opt) {
    Probs p;
    if (omitted(a)) {
        if (!outcome) {
            opt.n_probs = 1;
            opt.probs[0] = cto_addin::kDefaultProbability;
        }
        return p;
    }
    View v;
    if (!make_view(a, v) ||
        static_cast<std::int64_t>(v.rows) * v.cols > CTO_RANGE_MAX_PROBS)
        throw_invalid_arg(calc, cto_addin::kArgProbability, cto_addin::kRangeExtra[0].label,
                          "a value, or a range of at most 32 probabilities");
    p.rows = v.rows;
    p.cols = v.cols;
    p.array = v.m != nullptr;
    int k = 0;
    for (sal_Int32 r = 0; r < v.rows; ++r)
        for (sal_Int32 c = 0; c < v.cols; ++c) opt.probs[k++] = given_value(v.at(r, c), kNumberArg);
    opt.n_probs = k;
    return p;
}

// The library's invalid index (cto_share_range's out.bad) as DEALRANGE's argument.
int range_bad_arg(int bad) {
    if (bad >= 0 && bad < kRangeInputs) return bad;
    switch (bad) {
    case kRangeInputs: return cto_addin::kArgProbability;
    case kRangeInputs + 1: return cto_addin::kArgSeed;
    case kRangeInputs + 3: return cto_addin::kArgDigits;
    default: return -1;
    }
}

cto_range_input range_inputs(const char *calc, const RangeArgs &ra, const Arg *args,
                             int shape) {
    cto_range_input in;
    std::memset(&in, 0, sizeof in);
    in.size = sizeof in;
    for (int j = 0; j < kRangeInputs; ++j)
        in.arg[j] = range_input(calc, j, args[j], *ra.info[j], shape);
    return in;
}

// DEALRANGE's (or DEALRANGEOUTCOME's) 18 arguments as the library's inputs and options;
// a value that cannot become one throws Err:502 naming it.
struct RangeRun {
    cto_range_input in;
    cto_range_options opt;
    cto_range_outcome out;
    Probs probs;
    int status;
};
void convert_range(const char *calc, const RangeArgs &ra, const Arg *args, bool outcome,
                   RangeRun &run) {
    const int shape = range_shape(calc, args[cto_addin::kArgShape]);
    run.in = range_inputs(calc, ra, args, shape);
    cto_range_default_options(&run.opt);
    run.probs = range_probs(calc, args[cto_addin::kArgProbability], outcome, run.opt);
    run.opt.seed = range_seed(calc, args[cto_addin::kArgSeed]);
    run.opt.digits = range_digits(calc, args[cto_addin::kArgDigits]);
}

// Converts the arguments and runs cto_share_range.  Invalid input throws Err:502; the
// status is returned (out is written).
void run_range(const char *calc, const Table &t, const Arg *args, bool outcome, RangeRun &run) {
    const RangeArgs ra(t);
    convert_range(calc, ra, args, outcome, run);
    std::memset(&run.out, 0, sizeof run.out);
    run.out.size = sizeof run.out;
    run.status = cto_share_range(&run.in, &run.opt, &run.out);
    if (run.status == CTO_E_INVALID) {
        const int j = range_bad_arg(run.out.bad);
        throw_invalid_arg(calc, j, ra.label(j));
    }
}

// Which quantiles are short of the digit target (only when the library says so; should
// it name none, every one is treated as short: never a silent rough number).
std::vector<bool> short_quantiles(const RangeRun &run) {
    const int n = run.out.n_probs;
    std::vector<bool> s(static_cast<size_t>(n), false);
    if (run.status != CTO_E_PRECISION) return s;
    bool any = false;
    for (int k = 0; k < n; ++k) any = any || (s[static_cast<size_t>(k)] = run.out.own[k].digits < run.opt.digits);
    if (!any) s.assign(static_cast<size_t>(n), true);
    return s;
}

// DEALRANGE: own share at the probability, or an array of the probabilities' shape.
css::uno::Any range_quantiles(const Table &t, const Arg *args) {
    const char *calc = "DEALRANGE";
    RangeRun run;
    run_range(calc, t, args, false, run);
    if (run.status != CTO_OK && run.status != CTO_E_PRECISION)
        return status_result(calc, run.status);
    const std::vector<bool> rough = short_quantiles(run);
    if (!run.probs.array) {
        const cto_range_estimate &e = run.out.own[0];
        if (rough[0])
            throw css::sheet::NoConvergenceException(
                "DEALRANGE: precision not reached: " + OUString::number(e.value) + " +/- " +
                    OUString::number(e.half_width) + " (95%); see DEALRANGEOUTCOME",
                css::uno::Reference<css::uno::XInterface>());
        if (!std::isfinite(e.value))
            throw css::uno::RuntimeException("DEALRANGE: the library returned a non-finite value");
        return css::uno::Any(e.value);
    }
    css::uno::Sequence<css::uno::Sequence<double>> res(run.probs.rows);
    int k = 0;
    for (sal_Int32 r = 0; r < run.probs.rows; ++r) {
        css::uno::Sequence<double> row(run.probs.cols);
        for (sal_Int32 c = 0; c < run.probs.cols; ++c, ++k)
            row.getArray()[c] = rough[static_cast<size_t>(k)]
                                    ? error_nan(kErrNoConvergence)
                                    : element(CTO_OK, run.out.own[k].value);
        res.getArray()[r] = row;
    }
    return css::uno::Any(res);
}

OUString number_text(double x) {
    char b[32];
    std::snprintf(b, sizeof b, "%.15g", x);
    return OUString::createFromAscii(b);
}

using AnyRow = css::uno::Sequence<css::uno::Any>;

AnyRow outcome_row(const OUString &label, const css::uno::Any &value,
                   const css::uno::Any &half_width = css::uno::Any(OUString()),
                   const css::uno::Any &digits = css::uno::Any(OUString())) {
    AnyRow row(4);
    row.getArray()[0] <<= label;
    row.getArray()[1] = value;
    row.getArray()[2] = half_width;
    row.getArray()[3] = digits;
    return row;
}

AnyRow estimate_row(const OUString &label, const cto_range_estimate &e) {
    return outcome_row(label, css::uno::Any(element(CTO_OK, e.value)),
                       css::uno::Any(element(CTO_OK, e.half_width)),
                       css::uno::Any(static_cast<double>(e.digits)));
}

// DEALRANGEOUTCOME: label | estimate | 95% half-width | significant digits, a row per
// output in the order of addin/README.md "DEALRANGEOUTCOME".
css::uno::Any range_outcome(const Table &t, const Arg *args) {
    const char *calc = "DEALRANGEOUTCOME";
    RangeRun run;
    run_range(calc, t, args, true, run);
    if (run.status != CTO_OK && run.status != CTO_E_PRECISION)
        return status_result(calc, run.status);
    const cto_range_outcome &o = run.out;
    std::vector<AnyRow> rows;
    for (int k = 0; k < o.n_probs; ++k)
        rows.push_back(estimate_row("own share, p = " + number_text(o.probs[k]), o.own[k]));
    for (int k = 0; k < o.n_probs; ++k)
        rows.push_back(estimate_row("other share, p = " + number_text(o.probs[k]), o.other[k]));
    rows.push_back(estimate_row("own share, mean", o.own_mean));
    rows.push_back(estimate_row("other share, mean", o.other_mean));
    rows.push_back(estimate_row("probability of a rational deal", o.p_rational));
    rows.push_back(estimate_row("probability own walk-away value binds", o.p_own_binds));
    rows.push_back(estimate_row("probability other walk-away value binds", o.p_other_binds));
    rows.push_back(estimate_row("edge fraction", o.edge_fraction));
    rows.push_back(outcome_row("points per replicate",
                               css::uno::Any(static_cast<double>(o.points_per_replicate))));
    rows.push_back(outcome_row("replicates", css::uno::Any(static_cast<double>(o.replicates))));
    rows.push_back(outcome_row("uncertain inputs", css::uno::Any(static_cast<double>(o.dimension))));
    // the library's status word ("ok", "precision_not_reached") with spaces
    rows.push_back(outcome_row("status", css::uno::Any(OUString::createFromAscii(
                                             cto_status_name(run.status)).replace('_', ' '))));
    rows.push_back(outcome_row("spec version", css::uno::Any(static_cast<double>(o.spec_version))));
    css::uno::Sequence<AnyRow> res(static_cast<sal_Int32>(rows.size()));
    for (size_t i = 0; i < rows.size(); ++i) res.getArray()[i] = rows[i];
    return css::uno::Any(res);
}

// DEALSWING: a row per uncertain input, largest swing first: the input's catalogue name,
// own share at its low, at its high (each end's status as its error value).  With no
// uncertain input, one row "none" with the share at the modes twice.
css::uno::Any range_swing(const Table &t, const Arg *args) {
    const char *calc = "DEALSWING";
    const RangeArgs ra(t);
    const cto_range_input in = range_inputs(calc, ra, args, CTO_RANGE_PERT);
    cto_swing_outcome out;
    std::memset(&out, 0, sizeof out);
    out.size = sizeof out;
    const int st = cto_share_swing(&in, &out);
    if (st == CTO_E_INVALID) {
        const int j = out.bad >= 0 && out.bad < kRangeInputs ? out.bad : -1;
        throw_invalid_arg(calc, j, ra.label(j));
    }
    if (st != CTO_OK) return status_result(calc, st);
    const int n = out.n_rows < 0 ? 0 : out.n_rows > kRangeInputs ? kRangeInputs : out.n_rows;
    css::uno::Sequence<AnyRow> res(n > 0 ? n : 1);
    if (n == 0) {
        const double base = element(out.base_status, out.base);
        AnyRow row(3);
        row.getArray()[0] <<= OUString("none");
        row.getArray()[1] <<= base;
        row.getArray()[2] <<= base;
        res.getArray()[0] = row;
    }
    for (int i = 0; i < n; ++i) {
        const cto_swing_row &s = out.row[i];
        if (s.input < 0 || s.input >= kRangeInputs)
            throw css::uno::RuntimeException("DEALSWING: the library named no input");
        AnyRow row(3);
        row.getArray()[0] <<= OUString::createFromAscii(cto_addin::kRangeInputNames[s.input]);
        row.getArray()[1] <<= element(s.status_low, s.at_low);
        row.getArray()[2] <<= element(s.status_high, s.at_high);
        res.getArray()[i] = row;
    }
    return css::uno::Any(res);
}

// The range function DEALREASON is asked about: DEALRANGE, DEALRANGEOUTCOME, DEALSWING
// (or share_range, share_swing), any case; None for any other name.
enum class RangeFn { None, Range, Outcome, Swing };
RangeFn range_function(const OUString &name) {
    const OUString n = name.trim();
    if (equals_ignore_case(n, "DEALRANGE") || equals_ignore_case(n, "share_range"))
        return RangeFn::Range;
    if (equals_ignore_case(n, "DEALRANGEOUTCOME")) return RangeFn::Outcome;
    if (equals_ignore_case(n, "DEALSWING") || equals_ignore_case(n, "share_swing"))
        return RangeFn::Swing;
    return RangeFn::None;
}

// DEALREASON for a range function: its arguments (as given to DEALREASON) converted as
// the function converts them, then the library's reason for the run; a value the add-in
// cannot convert gives the add-in's own message.  Never fails on the user's input.
OUString range_reason(const Table &t, RangeFn fn,
                      const css::uno::Sequence<css::uno::Any> &given) {
    const bool swing = fn == RangeFn::Swing;
    const char *calc = swing ? "DEALSWING"
                             : (fn == RangeFn::Outcome ? "DEALRANGEOUTCOME" : "DEALRANGE");
    const sal_Int32 n = kRangeInputs + (swing ? 0 : cto_addin::kRangeExtras);
    if (given.getLength() > n)
        return OUString::createFromAscii(calc) + " takes at most " + OUString::number(n) +
               " arguments; " + OUString::number(given.getLength()) + " were given";
    std::vector<css::uno::Any> values(static_cast<size_t>(n));
    for (sal_Int32 j = 0; j < given.getLength(); ++j) values[static_cast<size_t>(j)] = given[j];
    std::vector<Arg> args;
    for (const css::uno::Any &v : values) args.emplace_back(v);
    const RangeArgs ra(t);
    char text[1024];
    try {
        if (swing) {
            const cto_range_input in = range_inputs(calc, ra, args.data(), CTO_RANGE_PERT);
            cto_swing_explain(&in, nullptr, text, sizeof text);
        } else {
            RangeRun run;
            convert_range(calc, ra, args.data(), fn == RangeFn::Outcome, run);
            cto_range_explain(&run.in, &run.opt, nullptr, text, sizeof text);
        }
    } catch (const css::lang::IllegalArgumentException &e) {
        return e.Message;
    }
    return OUString::createFromAscii(calc) + ": " +
           OUString(text, static_cast<sal_Int32>(std::strlen(text)), RTL_TEXTENCODING_UTF8);
}

} // namespace

#endif // CTO_ADDIN_RANGES_HXX
