// cto_share_range, cto_share_swing, cto_range_default_options: the ranges engine
// (lib/src/range/) behind the public structs; cto_range_explain, cto_swing_explain: the
// reasons in words for their outcomes (table/range_reasons.hpp).  The public and the core
// structs have the same layout (checked below), so the entry points copy them whole.
#include <cstddef>
#include <cstring>
#include <type_traits>

#include "../core.hpp"
#include "../range/rates_model.hpp"
#include "../table/range_reasons.hpp"

namespace range = cto::core::range;

namespace {

#define CTO_SAME_FIELD(A, B, f) \
    static_assert(offsetof(A, f) == offsetof(B, f), #A "." #f " differs from the core")
static_assert(sizeof(cto_range_arg) == sizeof(range::RangeArg), "cto_range_arg");
static_assert(sizeof(cto_range_input) == sizeof(range::RangeIn), "cto_range_input");
static_assert(sizeof(cto_range_options) == sizeof(range::RangeOptions), "cto_range_options");
static_assert(sizeof(cto_range_estimate) == sizeof(range::Estimate), "cto_range_estimate");
static_assert(sizeof(cto_range_outcome) == sizeof(range::RangeOut), "cto_range_outcome");
static_assert(sizeof(cto_swing_row) == sizeof(range::SwingRow), "cto_swing_row");
static_assert(sizeof(cto_swing_outcome) == sizeof(range::SwingOut), "cto_swing_outcome");
static_assert(CTO_RANGE_INPUTS == range::kRangeSlots && CTO_RANGE_MAX_PROBS == range::kMaxProbs,
              "range limits");
static_assert(CTO_E_PRECISION == range::kPrecisionNotReached, "status");
CTO_SAME_FIELD(cto_range_arg, range::RangeArg, high);
CTO_SAME_FIELD(cto_range_options, range::RangeOptions, seed);
CTO_SAME_FIELD(cto_range_options, range::RangeOptions, threads);
CTO_SAME_FIELD(cto_range_outcome, range::RangeOut, own);
CTO_SAME_FIELD(cto_range_outcome, range::RangeOut, p_rational);
CTO_SAME_FIELD(cto_range_outcome, range::RangeOut, points_per_replicate);
CTO_SAME_FIELD(cto_range_outcome, range::RangeOut, dimension);
CTO_SAME_FIELD(cto_swing_outcome, range::SwingOut, row);
static_assert(std::is_trivially_copyable_v<range::RangeOut> &&
                  std::is_trivially_copyable_v<range::SwingOut>,
              "copied whole");

// Copies a public struct into its core twin (nothing beyond the caller's size is read).
template <class Core, class Pub>
bool load(const Pub *p, Core *c) {
    if (!p || p->size < sizeof(Pub)) return false;
    std::memcpy(c, p, sizeof(Core));
    return true;
}

// The reason for a struct that cannot be read (invalid index 21): in, then opt.
void struct_reason(const cto_range_input *in, const cto_range_options *opt, bool with_opt,
                   char *text, size_t size) {
    if (!in || in->size < sizeof(cto_range_input))
        cto::table::size_reason("in", "cto_range_input", !in, in ? in->size : 0,
                                sizeof(cto_range_input), text, size);
    else if (with_opt)
        cto::table::size_reason("opt", "cto_range_options", !opt, opt ? opt->size : 0,
                                sizeof(cto_range_options), text, size);
}

void clear_text(char *text, size_t size) {
    if (text && size > 0) text[0] = '\0';
}

// The frame of cto_range_explain and cto_swing_explain: an outcome struct that is too
// small is itself the reason; without an outcome (NULL) the function runs here; `word`
// writes the words for the core's copy of the outcome.  Nothing inside throws; a defect
// would be reported as CTO_E_INTERNAL, never propagated.
template <class CoreOut, class PublicOut, class Run, class Word>
int explain_frame(const PublicOut *out, const char *type, char *text, size_t size, Run run,
                  Word word) {
    clear_text(text, size);
    try {
        if (out && out->size < sizeof(PublicOut)) {
            cto::table::size_reason("out", type, false, out->size, sizeof(PublicOut), text,
                                    size);
            return CTO_E_INVALID;
        }
        PublicOut own;
        if (!out) {
            std::memset(&own, 0, sizeof own);
            own.size = sizeof own;
            run(&own);
            out = &own;
        }
        CoreOut r;
        std::memcpy(&r, out, sizeof r);
        word(r);
        return r.status;
    } catch (...) {
        clear_text(text, size);
        return CTO_E_INTERNAL;
    }
}

}  // namespace

extern "C" {

CTO_API void cto_range_default_options(cto_range_options *opt) {
    if (!opt) return;
    const range::RangeOptions d = range::default_options();
    std::memcpy(opt, &d, sizeof d);
    opt->size = sizeof *opt;
}

CTO_API int cto_share_range(const cto_range_input *in, const cto_range_options *opt,
                            cto_range_outcome *out) {
    if (!out || out->size < sizeof(cto_range_outcome)) return CTO_E_INVALID;
    try {
        range::RangeIn ci;
        range::RangeOptions co = range::default_options();
        range::RangeOut r;
        r.size = sizeof r;
        const bool in_ok = load(in, &ci), opt_ok = load(opt, &co);
        if (!in_ok || !opt_ok) {
            range::clear_range_out(&r, co);
            r.status = CTO_E_INVALID;
            r.bad = range::kBadSize;
        } else {
            range::share_range(ci, co, &r);
        }
        std::memcpy(out, &r, sizeof r);
        return out->status;
    } catch (...) {
        out->status = CTO_E_INTERNAL;
        return CTO_E_INTERNAL;
    }
}

CTO_API int cto_share_swing(const cto_range_input *in, cto_swing_outcome *out) {
    if (!out || out->size < sizeof(cto_swing_outcome)) return CTO_E_INVALID;
    try {
        range::RangeIn ci;
        range::SwingOut r;
        r.size = sizeof r;
        if (!load(in, &ci)) {
            range::clear_swing_out(&r);
            r.status = CTO_E_INVALID;
            r.bad = range::kBadSize;
        } else {
            range::share_swing(ci, &r);
        }
        std::memcpy(out, &r, sizeof r);
        return out->status;
    } catch (...) {
        out->status = CTO_E_INTERNAL;
        return CTO_E_INTERNAL;
    }
}

CTO_API int cto_range_explain(const cto_range_input *in, const cto_range_options *opt,
                              const cto_range_outcome *out, char *text, size_t size) {
    return explain_frame<range::RangeOut>(
        out, "cto_range_outcome", text, size,
        [&](cto_range_outcome *run) { cto_share_range(in, opt, run); },
        [&](const range::RangeOut &r) {
            range::RangeIn ci;
            range::RangeOptions co;
            if (!load(in, &ci) || !load(opt, &co))
                struct_reason(in, opt, true, text, size);
            else
                cto::table::range_reason(ci, co, r, text, size);
        });
}

CTO_API int cto_swing_explain(const cto_range_input *in, const cto_swing_outcome *out,
                              char *text, size_t size) {
    return explain_frame<range::SwingOut>(
        out, "cto_swing_outcome", text, size,
        [&](cto_swing_outcome *run) { cto_share_swing(in, run); },
        [&](const range::SwingOut &r) {
            range::RangeIn ci;
            if (!load(in, &ci))
                struct_reason(in, nullptr, false, text, size);
            else
                cto::table::swing_reason(ci, r, text, size);
        });
}

}  // extern "C"
