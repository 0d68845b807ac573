// libFuzzer harness over every C entry point of counteroffer.  Arbitrary doubles (NaN,
// infinities, subnormals, huge values, 0, -0, 1, 1 - ulp) and integers go into each named
// function, cto_call, cto_call_strided and cto_solve; the contract is asserted:
//   - a known status; the output is always written;
//   - a finite output whenever the status is ok;
//   - the named function and the table entry point agree bit for bit;
//   - solve: when a deal is rational, own + other = surplus and each side gets at least
//     its no-deal payoff;
//   - share_range and share_swing: a known status and a reason in words of its own.
// Any violation aborts (a finding).  Build and run: tests/fuzz/run-fuzz.sh.
#include <fuzzer/FuzzedDataProvider.h>

#include <cfloat>
#include <cmath>
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <limits>
#include <vector>

#include "counteroffer/counteroffer.h"

namespace {

[[noreturn]] void finding(const char *what, const char *fn) {
    std::fprintf(stderr, "contract violated in %s: %s\n", fn, what);
    std::abort();
}

double sentinel() {
    const uint64_t bits = 0x7ff8dead0000beefULL;  // a NaN with a payload the library never writes
    double d;
    std::memcpy(&d, &bits, sizeof d);
    return d;
}
bool is_sentinel(double d) {
    const double s = sentinel();
    return std::memcmp(&d, &s, sizeof d) == 0;
}

double pick_double(FuzzedDataProvider &p) {
    static const double palette[] = {
        std::numeric_limits<double>::quiet_NaN(),
        std::numeric_limits<double>::infinity(),
        -std::numeric_limits<double>::infinity(),
        0.0, -0.0, 1.0, std::nextafter(1.0, 0.0), std::nextafter(1.0, 2.0), 0.5, -1.0, 2.0,
        DBL_MIN, DBL_TRUE_MIN, -DBL_TRUE_MIN, DBL_MAX, -DBL_MAX, 1e-300, 1e300, 1e-9,
        1.0 - 1e-9, 1.0 - 1e-12, 0.9, 0.95, 0.05, 365.0, 1.0 / 1440, 1e12, -1e12, 3.5};
    switch (p.ConsumeIntegralInRange<int>(0, 3)) {
        case 0: return palette[p.ConsumeIntegralInRange<size_t>(0, sizeof palette / sizeof *palette - 1)];
        case 1: return p.ConsumeProbability<double>();
        case 2: return p.ConsumeFloatingPointInRange<double>(-10.0, 10.0);
        default: {
            const uint64_t bits = p.ConsumeIntegral<uint64_t>();
            double d;
            std::memcpy(&d, &bits, sizeof d);
            return d;
        }
    }
}
int64_t pick_int(FuzzedDataProvider &p) {
    static const int64_t palette[] = {0, 1, 2, 3, 5, -1, 101, 1000000, INT64_MAX, INT64_MIN,
                                      (int64_t(1) << 40) + 1};
    if (p.ConsumeBool()) return palette[p.ConsumeIntegralInRange<size_t>(0, sizeof palette / sizeof *palette - 1)];
    return p.ConsumeIntegral<int64_t>();
}

void check_status(int st, const char *fn) {
    if (st < CTO_OK || st > CTO_E_INTERNAL) finding("unknown status", fn);
    if (st == CTO_E_INTERNAL) finding("internal error", fn);
}
void check_out(int st, double v, const char *fn, bool nan_without_deal = false) {
    check_status(st, fn);
    if (is_sentinel(v)) finding("output not written", fn);
    if (st == CTO_OK && !std::isfinite(v)) finding("non-finite output with status ok", fn);
    if ((st == CTO_E_INVALID || st == CTO_E_INDETERMINATE || st == CTO_E_NO_CONVERGENCE) &&
        !std::isnan(v))
        finding("a number returned with a failing status", fn);
    if (st == CTO_E_NO_DEAL && !nan_without_deal && !std::isfinite(v))
        finding("non-finite no-deal payoff", fn);
    if (st == CTO_E_NO_DEAL && nan_without_deal && !std::isnan(v))
        finding("a value without a deal where the definition says NaN", fn);
}

// The named C function of every catalogue row, generated from the definitions
// (lib/gen/gen_core.py): call_named(id, d, n, out, &found), is_adapter(id).
#include "named_dispatch.inc"

// The typed value of each argument (n[j] for bools, counts and choices, drawn from the
// fuzzer's integers) and the doubles cto_call sees for the same call.
void typed_args(const cto_function_info *f, const double *a, const int64_t *drawn, int64_t *n,
                double *g) {
    int bool_seen = 0, count_seen = 0;
    for (int j = 0; j < f->n_args; ++j) {
        n[j] = 0;
        switch (f->args[j].kind) {
            case CTO_ARG_BOOL: n[j] = drawn[bool_seen++ % 2] & 1; break;
            case CTO_ARG_COUNT: n[j] = drawn[3 + count_seen++ % 5]; break;
            case CTO_ARG_CHOICE: n[j] = drawn[2]; break;
            default: g[j] = a[j]; continue;
        }
        g[j] = static_cast<double>(n[j]);
    }
}

void fuzz_solve(FuzzedDataProvider &p) {
    cto_solve_input in;
    in.size = sizeof in;
    in.own_factor = pick_double(p);
    in.other_factor = pick_double(p);
    in.breakdown_prob = pick_double(p);
    in.own_fallback = pick_double(p);
    in.other_fallback = pick_double(p);
    in.own_inside = pick_double(p);
    in.other_inside = pick_double(p);
    in.own_outside = pick_double(p);
    in.other_outside = pick_double(p);
    in.has_own_outside = p.ConsumeBool();
    in.has_other_outside = p.ConsumeBool();
    in.surplus = pick_double(p);
    in.own_opens = p.ConsumeBool();
    cto_solve_outcome out;
    out.size = sizeof out;
    out.own_share = out.other_share = sentinel();
    const int st = cto_solve(&in, &out);
    if (std::getenv("CTO_FUZZ_VERBOSE"))
        std::fprintf(stderr,
                     "solve(d=%.17g,%.17g p=%.17g b=%.17g,%.17g g=%.17g,%.17g w=%.17g[%d],%.17g[%d] "
                     "S=%.17g opens=%d) -> st=%d own=%.17g other=%.17g nd=%.17g,%.17g\n",
                     in.own_factor, in.other_factor, in.breakdown_prob, in.own_fallback,
                     in.other_fallback, in.own_inside, in.other_inside, in.own_outside,
                     in.has_own_outside, in.other_outside, in.has_other_outside, in.surplus,
                     in.own_opens, st, out.own_share, out.other_share, out.own_no_deal,
                     out.other_no_deal);
    check_out(st, out.own_share, "solve");
    check_out(st, out.other_share, "solve");
    if (st == CTO_OK) {
        const long double S = in.surplus;
        // Errors are relative to the largest money amount that enters the computation.
        long double scale = std::fabs(S);
        for (double m : {in.own_fallback, in.other_fallback, in.own_inside, in.other_inside,
                         out.own_no_deal, out.other_no_deal})
            scale += std::fabs(static_cast<long double>(m));
        if (in.has_own_outside) scale += std::fabs(static_cast<long double>(in.own_outside));
        if (in.has_other_outside) scale += std::fabs(static_cast<long double>(in.other_outside));
        const long double sum = static_cast<long double>(out.own_share) + out.other_share;
        // Subnormal results carry an absolute error of a few DBL_TRUE_MIN.
        const long double tol = 1e-15L * scale + 8.0L * DBL_TRUE_MIN;
        // own + other = surplus, except with one round of delay when the opener's
        // walk-away value exceeds what agreeing now leaves it (its option then binds, and
        // the present values include a round of status-quo flows and breakdown risk).
        const bool opener_binds = in.own_opens ? (out.binding == CTO_BINDS_OWN || out.binding == CTO_BINDS_BOTH)
                                               : (out.binding == CTO_BINDS_OTHER || out.binding == CTO_BINDS_BOTH);
        if (std::fabs(sum - S) > tol && !opener_binds) finding("own + other != surplus", "solve");
        // The opener can walk away only after a rejected offer: it secures the one-round
        // continuation value of its no-deal payoff, c(v) = p b + (1-p)((1-d) g + d v).
        auto cont = [&](double d, double b, double g, double v) {
            const long double p = in.breakdown_prob;
            return static_cast<double>(p * b + (1 - p) * ((1 - static_cast<long double>(d)) * g + static_cast<long double>(d) * v));
        };
        const double own_secure =
            in.own_opens ? std::min(out.own_no_deal, cont(in.own_factor, in.own_fallback, in.own_inside, out.own_no_deal))
                         : out.own_no_deal;
        const double oth_secure =
            in.own_opens ? out.other_no_deal
                         : std::min(out.other_no_deal,
                                    cont(in.other_factor, in.other_fallback, in.other_inside, out.other_no_deal));
        if (out.own_share < own_secure - tol) finding("own below what it secures without a deal", "solve");
        if (out.other_share < oth_secure - tol)
            finding("other below its no-deal payoff", "solve");
        if (!out.deal_rational) finding("ok without a rational deal", "solve");
    }
}

// A range reason: terminated inside the buffer, not empty, never a fallback text.
void check_range_reason(const char *text, size_t size, const char *fn) {
    if (!std::memchr(text, '\0', size)) finding("reason not terminated", fn);
    if (text[0] == '\0') finding("empty reason", fn);
    for (const char *fallback : {"not a valid range", "invalid input (index", " is invalid"})
        if (std::strstr(text, fallback)) finding("a fallback reason", fn);
}

// The ranges engine through the C ABI with small sizes (2 to 4 replicates of at most 2^6
// points): any kinds and values; the status is known, the outcome written, and an ok
// status has finite quantiles in order.
void fuzz_range(FuzzedDataProvider &p) {
    cto_range_input in;
    in.size = sizeof in;
    for (int j = 0; j < CTO_RANGE_INPUTS; ++j) {
        in.arg[j].kind = p.ConsumeIntegralInRange<int>(-1, 4);
        in.arg[j].low = pick_double(p);
        in.arg[j].mode = pick_double(p);
        in.arg[j].high = pick_double(p);
    }
    cto_range_options opt;
    cto_range_default_options(&opt);
    opt.replicates = p.ConsumeIntegralInRange<int>(1, 4);
    opt.log2_start = p.ConsumeIntegralInRange<int>(0, 4);
    opt.log2_max = p.ConsumeIntegralInRange<int>(0, 6);
    opt.digits = p.ConsumeIntegralInRange<int>(0, 16);
    opt.probs[0] = pick_double(p);
    opt.seed = p.ConsumeIntegral<uint64_t>();
    cto_range_outcome out;
    out.size = sizeof out;
    out.own[0].value = sentinel();
    const int st = cto_share_range(&in, &opt, &out);
    if (st < CTO_OK || st > CTO_E_PRECISION || st == CTO_E_INTERNAL) finding("unknown or internal status", "share_range");
    if (st != out.status) finding("returned status differs from out.status", "share_range");
    if (is_sentinel(out.own[0].value)) finding("outcome not written", "share_range");
    if (st == CTO_OK) {
        for (int k = 0; k < out.n_probs; ++k)
            if (!std::isfinite(out.own[k].value)) finding("non-finite quantile with status ok", "share_range");
        for (int k = 1; k < out.n_probs; ++k)
            if (opt.probs[k] > opt.probs[k - 1] && out.own[k].value < out.own[k - 1].value)
                finding("quantiles out of order", "share_range");
    }
    cto_swing_outcome sw;
    sw.size = sizeof sw;
    const int ss = cto_share_swing(&in, &sw);
    if (ss < CTO_OK || ss > CTO_E_PRECISION || ss == CTO_E_INTERNAL) finding("unknown or internal status", "share_swing");
    // The reasons in words for both outcomes (worded without running again): the same
    // status, a NUL-terminated text, and a reason of its own for every invalid index
    // (none of the fallbacks for a verdict that no part of the input explains).
    char reason[256];
    std::memset(reason, 'x', sizeof reason);
    if (cto_range_explain(&in, &opt, &out, reason, sizeof reason) != st)
        finding("range explain status differs", "share_range");
    check_range_reason(reason, sizeof reason, "share_range");
    std::memset(reason, 'x', sizeof reason);
    if (cto_swing_explain(&in, &sw, reason, sizeof reason) != ss)
        finding("swing explain status differs", "share_swing");
    check_range_reason(reason, sizeof reason, "share_swing");
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size) {
    FuzzedDataProvider p(data, size);
    const int which = p.ConsumeIntegralInRange<int>(0, static_cast<int>(cto_function_count()) + 1);
    if (which == static_cast<int>(cto_function_count()) + 1) {
        fuzz_range(p);
        return 0;
    }
    if (which == static_cast<int>(cto_function_count()) || which == 7) {
        fuzz_solve(p);
        if (which == 7) {
            // also the table entry for solve
        } else {
            return 0;
        }
    }
    const cto_function_info *f = cto_function_at(static_cast<size_t>(which));
    double a[CTO_MAX_ARGS];
    int64_t n[8];
    for (double &x : a) x = pick_double(p);
    for (int64_t &x : n) x = pick_int(p);
    n[2] = p.ConsumeIntegralInRange<int>(-1, 2);  // a choice, sometimes out of range
    double named_outs[CTO_MAX_OUTPUTS];
    for (double &o : named_outs) o = sentinel();
    double &named_out = named_outs[0];
    int64_t nt[CTO_MAX_ARGS];
    double g[CTO_MAX_ARGS];
    typed_args(f, a, n, nt, g);
    bool found = false;
    const int named = call_named(f->id, a, nt, named_outs, &found);
    if (!found && !is_adapter(f->id)) finding("no named function in the dispatch", f->name);
    double outs[CTO_MAX_OUTPUTS];
    for (double &o : outs) o = sentinel();
    int bad = -2;
    const int generic = cto_call(f->id, g, outs, &bad);
    check_status(generic, f->name);
    for (int k = 0; k < f->n_outputs; ++k)
        if (is_sentinel(outs[k])) finding("generic output not written", f->name);
    check_out(generic, outs[0], f->name, no_deal_nan(f->id));
    if (generic == CTO_E_INVALID && (bad < 0 || bad >= f->n_args)) finding("no bad argument named", f->name);
    if (generic != CTO_E_INVALID && bad != -1) finding("bad argument named without invalid", f->name);
    // The reason in words: the same status, a NUL-terminated text within the buffer.
    char reason[96];
    std::memset(reason, 'x', sizeof reason);
    if (cto_explain(f->id, g, reason, sizeof reason) != generic) finding("explain status differs", f->name);
    if (std::memchr(reason, '\0', sizeof reason) == nullptr) finding("explain text not terminated", f->name);
    // Counts beyond 2^53 have no exact double: the two paths then see different numbers.
    bool exact_counts = true;
    for (int j = 0; j < f->n_args; ++j)
        if (f->args[j].kind == CTO_ARG_COUNT &&
            std::llabs(nt[j] == INT64_MIN ? INT64_MAX : nt[j]) > (int64_t(1) << 53))
            exact_counts = false;
    if (named >= 0) check_out(named, named_out, f->name, no_deal_nan(f->id));
    if (named >= 0 && exact_counts) {
        if (named != generic) finding("named and generic statuses differ", f->name);
        if (std::memcmp(&named_out, &outs[0], sizeof(double)) != 0 &&
            !(std::isnan(named_out) && std::isnan(outs[0])))
            finding("named and generic values differ", f->name);
    }
    // The strided entry point over three elements, the middle one broadcast.
    const char *args[CTO_MAX_ARGS];
    ptrdiff_t strides[CTO_MAX_ARGS];
    double col[CTO_MAX_ARGS][3];
    for (int j = 0; j < f->n_args; ++j) {
        col[j][0] = col[j][1] = col[j][2] = g[j];
        args[j] = reinterpret_cast<const char *>(col[j]);
        strides[j] = (j % 2) ? 0 : static_cast<ptrdiff_t>(sizeof(double));
    }
    double so[CTO_MAX_OUTPUTS][3];
    char *optr[CTO_MAX_OUTPUTS];
    ptrdiff_t ostr[CTO_MAX_OUTPUTS];
    for (int k = 0; k < f->n_outputs; ++k) {
        so[k][0] = so[k][1] = so[k][2] = sentinel();
        optr[k] = reinterpret_cast<char *>(so[k]);
        ostr[k] = sizeof(double);
    }
    signed char sts[3] = {-9, -9, -9};
    cto_batch_report rep;
    rep.size = sizeof rep;
    if (cto_call_strided(f->id, 3, args, strides, optr, ostr, sts, 1, &rep) != CTO_OK)
        finding("strided call refused", f->name);
    for (int i = 0; i < 3; ++i) {
        if (sts[i] != generic) finding("strided status differs", f->name);
        for (int k = 0; k < f->n_outputs; ++k)
            if (std::memcmp(&so[k][i], &outs[k], sizeof(double)) != 0 &&
                !(std::isnan(so[k][i]) && std::isnan(outs[k])))
                finding("strided value differs", f->name);
    }
    if (rep.count[generic] != 3) finding("report count wrong", f->name);
    // share has a vectorised block path (lib/src/blocks.cpp) for blocks of 256 elements
    // that all come out ok: a full block of this input must give the scalar result.
    if (std::strcmp(f->name, "share") == 0) {
        constexpr int kBlock = 256;
        static double bcol[4][kBlock], bout[kBlock];
        const char *bargs[4];
        const ptrdiff_t bstr[4] = {sizeof(double), sizeof(double), sizeof(double),
                                   sizeof(double)};
        for (int j = 0; j < 4; ++j) {
            for (int i = 0; i < kBlock; ++i) bcol[j][i] = g[j];
            bargs[j] = reinterpret_cast<const char *>(bcol[j]);
        }
        char *bptr[1] = {reinterpret_cast<char *>(bout)};
        const ptrdiff_t bostr[1] = {sizeof(double)};
        cto_batch_report brep;
        brep.size = sizeof brep;
        if (cto_call_strided(f->id, kBlock, bargs, bstr, bptr, bostr, nullptr, 0, &brep) != CTO_OK)
            finding("block call refused", f->name);
        if (brep.count[generic] != kBlock) finding("block report count wrong", f->name);
        for (int i = 0; i < kBlock; ++i)
            if (std::memcmp(&bout[i], &outs[0], sizeof(double)) != 0 &&
                !(std::isnan(bout[i]) && std::isnan(outs[0])))
                finding("block value differs", f->name);
    }
    return 0;
}
