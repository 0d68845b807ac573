// The reasons behind cto_range_explain and cto_swing_explain; see range_reasons.hpp.
#include "range_reasons.hpp"

#include <cmath>
#include <cstdint>
#include <cstring>

#include "../range/distributions.hpp"
#include "../range/rates_model.hpp"
#include "reasons.hpp"

namespace cto::table {
namespace {

namespace rg = cto::core::range;
using rg::RangeArg;
using rg::RangeIn;

constexpr int kSlots = rg::kRangeSlots;

// The catalogue row whose arguments the range functions take (solve_from_rates), or
// nullptr in a library built without it.
const Row *model_row() {
    for (size_t i = 0; i < row_count(); ++i) {
        const Row *r = row(static_cast<int>(i));
        if (r && std::strcmp(r->info.name, "solve_from_rates") == 0 && r->info.n_args == kSlots)
            return r;
    }
    return nullptr;
}

Str slot_name(const Row *m, int j) {
    if (m && j >= 0 && j < m->info.n_args) return m->info.args[j].name;
    return "input " + whole(j);
}

rg::Dist dist_of(const RangeArg &a) { return rg::Dist{a.kind, a.low, a.mode, a.high}; }

// The value the engine uses for input a at "the modes": a fixed value, the mode of a
// triangular or PERT range, a uniform range's midpoint, a degenerate range's low.
double mode_value(const RangeArg &a) {
    if (a.kind == rg::kFixed) return a.mode;
    const rg::Dist d = dist_of(a);
    return rg::dist_uncertain(d) ? rg::dist_mode(d) : a.low;
}

bool uncertain(const RangeArg &a) { return rg::dist_uncertain(dist_of(a)); }

// ---- an input's own range ------------------------------------------------------------

const char *const kKindNames[] = {"0 (fixed)", "1 (uniform)", "2 (triangular)", "3 (PERT)"};

// What is wrong with one end of a range ("" when it is a finite number).
Str end_problem(const char *end, double v) {
    if (std::isnan(v)) return Str(end) + " is empty or not a number";
    if (std::isinf(v)) return Str(end) + " = " + num(v) + " is not a finite number";
    return Str();
}

// Why the engine refused input slot j's own range (its verdict: dist_valid, and NaN for
// a fixed value), or "" when the range itself is fine (then the model refused a value).
Str range_problem(const Str &name, const RangeArg &a) {
    if (a.kind == rg::kFixed)
        return std::isnan(a.mode) ? name + " is empty or not a number" : Str();
    if (rg::dist_valid(dist_of(a))) return Str();
    if (a.kind < rg::kFixed || a.kind > rg::kPert) {
        Str s = name + ": kind " + whole(a.kind) + " is not one of ";
        for (int k = 0; k < 4; ++k) s += Str(k ? ", " : "") + kKindNames[k];
        return s;
    }
    const bool has_mode = a.kind != rg::kUniform;
    for (const Str &p : {end_problem("low", a.low), has_mode ? end_problem("mode", a.mode) : Str(),
                         end_problem("high", a.high)})
        if (!p.empty()) return name + ": " + p;
    if (a.low > a.high) return name + ": low " + num(a.low) + " is above high " + num(a.high);
    if (has_mode && !(a.low <= a.mode && a.mode <= a.high))
        return name + ": mode " + num(a.mode) + " is outside low " + num(a.low) + " to high " +
               num(a.high);
    if (!std::isfinite(a.high - a.low))
        return name + ": the range " + num(a.low) + " to " + num(a.high) +
               " is too wide (high - low is not a finite number)";
    return name + ": not a valid range";
}

Str flag_problem(const Str &name, const RangeArg &a) {
    const char *rule = " must be a fixed 0 or 1 (FALSE or TRUE)";
    if (a.kind != rg::kFixed) return name + rule + ", not a range";
    if (std::isnan(a.mode)) return name + " is empty or not a number: it" + rule;
    return name + " = " + num(a.mode) + rule;
}

// ---- the model at the engine's probe points -------------------------------------------

// A probe point: the modes (slot -1), or slot `slot` at its low (end 0) or high (end 1)
// with the others at their modes; the order in which the engine tries them.
struct Probe {
    int slot;
    int end;
};

void fill_point(const RangeIn &in, Probe p, double *x) {
    for (int j = 0; j < kSlots; ++j) x[j] = mode_value(in.arg[j]);
    if (p.slot >= 0) x[p.slot] = p.end == 0 ? in.arg[p.slot].low : in.arg[p.slot].high;
}

// The first probe point where the model gives `status` (and, for CTO_E_INVALID, names
// slot `bad`); false when there is none (the engine met it at a draw inside the ranges).
bool find_probe(const Row &m, const RangeIn &in, int status, int bad, Probe *found, double *x) {
    for (int slot = -1; slot < kSlots; ++slot) {
        if (slot >= 0 && !uncertain(in.arg[slot])) continue;
        for (int end = 0; end < (slot < 0 ? 1 : 2); ++end) {
            const Probe p{slot, end};
            fill_point(in, p, x);
            double out[CTO_MAX_OUTPUTS];
            int b = -1;
            const int st = m.thunk(x, out, &b);
            if (st == status && (status != CTO_E_INVALID || b == bad)) {
                *found = p;
                return true;
            }
        }
    }
    return false;
}

const char *end_word(Probe p) { return p.end == 0 ? "low" : "high"; }

// Where the model refused slot `bad`: "" at the modes for a fixed input, "<name> at its
// mode" (or midpoint), "<name> at its high", or "with <other> at its low 0.1 (the others
// at their modes)".
Str refused_where(const Row &m, const RangeIn &in, Probe p, int bad) {
    if (p.slot < 0) {
        if (!uncertain(in.arg[bad])) return Str();
        return slot_name(&m, bad) +
               (in.arg[bad].kind == rg::kUniform ? " at its midpoint" : " at its mode");
    }
    if (p.slot == bad) return slot_name(&m, bad) + " at its " + end_word(p);
    const double v = p.end == 0 ? in.arg[p.slot].low : in.arg[p.slot].high;
    return "with " + slot_name(&m, p.slot) + " at its " + end_word(p) + " " + num(v) +
           " (the others at their modes)";
}

// Slot `bad` refused by the model: its reason (cto_explain's words) at the probe point.
Str model_refusal(const Row &m, const RangeIn &in, int bad) {
    Probe p{-1, 0};
    double x[kSlots];
    const RangeArg &a = in.arg[bad];
    if (!find_probe(m, in, CTO_E_INVALID, bad, &p, x))
        return slot_name(&m, bad) + ": the model refuses a value drawn inside the range " +
               num(a.low) + " to " + num(a.high);
    char text[512];
    explain(m, x, text, sizeof text);
    const Str where = refused_where(m, in, p, bad);
    return where.empty() ? Str(text) : where + ": " + text;
}

Str input_reason(const Row *m, const RangeIn &in, int bad) {
    const Str name = slot_name(m, bad);
    const RangeArg &a = in.arg[bad];
    if ((bad == rg::kOwnOpensSlot || bad == rg::kContinuousSlot) && !rg::flag_ok(a))
        return flag_problem(name, a);
    const Str own = range_problem(name, a);
    if (!own.empty() || !m) return own.empty() ? name + " is invalid" : own;
    return model_refusal(*m, in, bad);
}

Str indeterminate_words(const Row *m, const RangeIn &in) {
    if (!m) return "indeterminate: some draws have no single answer";
    Probe p{-1, 0};
    double x[kSlots];
    const Str head = indeterminate_reason(*m);
    if (!find_probe(*m, in, CTO_E_INDETERMINATE, -1, &p, x))
        return head + " at some draws inside the ranges";
    if (p.slot < 0) return head + " at the modes";
    return head + " at some draws, e.g. with " + slot_name(m, p.slot) + " at its " +
           end_word(p) + " " + num(x[p.slot]) + " and the others at their modes";
}

// ---- options --------------------------------------------------------------------------

Str ordinal_of(int k, int n) { return "number " + whole(k + 1) + " of the " + whole(n) + " given"; }

Str probs_problem(const rg::RangeOptions &o) {
    if (o.n_probs < 1)
        return "probabilities: none given (1 to " + whole(rg::kMaxProbs) + " are needed)";
    if (o.n_probs > rg::kMaxProbs)
        return "probabilities: " + whole(o.n_probs) + " given, at most " + whole(rg::kMaxProbs);
    for (int k = 0; k < o.n_probs; ++k) {
        const double p = o.probs[k];
        if (p > 0.0 && p < 1.0) continue;
        const Str which = o.n_probs > 1 ? " (" + ordinal_of(k, o.n_probs) + ")" : Str();
        if (std::isnan(p)) return "probability" + which + " is empty or not a number";
        return "probability " + num(p) + which + " is not strictly between 0 and 1";
    }
    return "probabilities: invalid";
}

// The largest log2_max the memory cap (replicates x 2^log2_max <= 2^24) allows.
int log2_cap(int replicates) {
    int m = rg::kMaxLog2;
    while (m > 0 && (static_cast<uint64_t>(replicates) << m) > (uint64_t{1} << rg::kMaxLog2Total))
        --m;
    return m;
}

Str log2_max_problem(const rg::RangeOptions &o) {
    const Str head = "log2_max = " + whole(o.log2_max);
    if (o.log2_max < o.log2_start) return head + " is below log2_start = " + whole(o.log2_start);
    if (o.log2_max > rg::kMaxLog2) return head + ": at most " + whole(rg::kMaxLog2);
    const int cap = log2_cap(o.replicates);
    return "replicates x 2^log2_max = " + whole(o.replicates) + " x 2^" + whole(o.log2_max) +
           " is above 2^" + whole(rg::kMaxLog2Total) +
           " draws in all (the cap on working memory): lower log2_max to " + whole(cap) +
           " or replicates to " +
           whole(static_cast<long long>((uint64_t{1} << rg::kMaxLog2Total) >> o.log2_max));
}

Str option_reason(const rg::RangeOptions &o, int bad) {
    switch (bad) {
        case rg::kBadProbs: return probs_problem(o);
        case rg::kBadSeed: return "seed: a whole number from 0 to 2^64 - 1 is needed";
        case rg::kBadReplicates:
            return "replicates = " + whole(o.replicates) +
                   (o.replicates < 2 ? Str(": at least 2 (the error bars come from the spread "
                                           "between replicates)")
                                     : ": at most " + whole(rg::kMaxReplicates));
        case rg::kBadDigits:
            return "digits = " + whole(o.digits) + ": 1 to " + whole(rg::kMaxDigits) +
                   " significant digits can be targeted";
        case rg::kBadLog2Start:
            return "log2_start = " + whole(o.log2_start) + ": 1 to " + whole(rg::kMaxLog2) +
                   " (the first sample has 2^log2_start points per replicate)";
        case rg::kBadLog2Max: return log2_max_problem(o);
        case rg::kBadThreads:
            return "threads = " + whole(o.threads) + ": 0 to " + whole(rg::kMaxWorkerThreads) +
                   " (0 or 1: the calling thread only)";
        default: return "invalid input (index " + whole(bad) + ")";
    }
}

// ---- statuses other than invalid ------------------------------------------------------

Str precision_words(const rg::RangeOptions &o, const rg::RangeOut &out) {
    Str s = "precision not reached: " + whole(o.digits) + " significant digits not reached at 2^" +
            whole(out.log2_used) + " points per replicate (" + whole(out.replicates) +
            " replicates):";
    const int n = out.n_probs < rg::kMaxProbs ? out.n_probs : rg::kMaxProbs;
    bool first = true;
    for (int k = 0; k < n; ++k) {
        const rg::Estimate &e = out.own[k];
        if (e.digits >= o.digits) continue;
        s += Str(first ? " " : "; ") + "own share at p = " + num(out.probs[k], 6) + " has " +
             whole(e.digits) + " (" + num(e.value, 6) + " +/- " + num(e.half_width, 2) + " at 95%)";
        first = false;
    }
    const int cap = log2_cap(out.replicates);
    if (out.log2_used < cap)
        return s + "; ask for fewer digits or raise log2_max (up to " + whole(cap) + " with " +
               whole(out.replicates) + " replicates)";
    return s + "; ask for fewer digits (" + whole(out.replicates) + " x 2^" +
           whole(out.log2_used) + " draws is the most the cap of 2^" + whole(rg::kMaxLog2Total) +
           " allows)";
}

// The first range end (or fixed value) outside its argument's plausible range, or "".
Str slip_in_ranges(const Row *m, const RangeIn &in) {
    if (!m) return Str();
    for (int j = 0; j < kSlots; ++j) {
        const RangeArg &a = in.arg[j];
        const Str name = slot_name(m, j);
        if (a.kind == rg::kFixed) {
            const Str note = slip_note(*m, j, name.c_str(), a.mode);
            if (!note.empty()) return note;
            continue;
        }
        const struct { const char *end; double v; bool used; } ends[] = {
            {" low", a.low, true},
            {" mode", a.mode, a.kind != rg::kUniform},
            {" high", a.high, true}};
        for (const auto &e : ends) {
            if (!e.used) continue;
            const Str note = slip_note(*m, j, (name + e.end).c_str(), e.v);
            if (!note.empty()) return note;
        }
    }
    return Str();
}

// "ok" or the precision text, then the first slip: "ok, but ..." or "...; also ...".
Str ok_words(const Row *m, const RangeIn &in, const Str &head, bool ok) {
    const Str slip = slip_in_ranges(m, in);
    if (slip.empty()) return head;
    return ok ? head + ", but " + slip : head + "; also " + slip;
}

}  // namespace

void range_reason(const RangeIn &in, const rg::RangeOptions &opt, const rg::RangeOut &out,
                  char *text, size_t size) {
    const Row *m = model_row();
    Str s;
    switch (out.status) {
        case CTO_OK: s = ok_words(m, in, "ok", true); break;
        case CTO_E_PRECISION: s = ok_words(m, in, precision_words(opt, out), false); break;
        case CTO_E_INVALID:
            s = out.bad >= 0 && out.bad < kSlots ? input_reason(m, in, out.bad)
                                                 : option_reason(opt, out.bad);
            break;
        case CTO_E_INDETERMINATE: s = indeterminate_words(m, in); break;
        case CTO_E_INTERNAL:
            s = "working memory for the draws could not be allocated (16 bytes x replicates x "
                "2^log2_max at most): lower log2_max or replicates";
            break;
        default: s = "internal error in the library: please report the inputs"; break;
    }
    copy_out(s, text, size);
}

void swing_reason(const RangeIn &in, const rg::SwingOut &out, char *text, size_t size) {
    const Row *m = model_row();
    Str s;
    switch (out.status) {
        case CTO_OK: s = ok_words(m, in, "ok", true); break;
        case CTO_E_INVALID:
            s = out.bad >= 0 && out.bad < kSlots ? input_reason(m, in, out.bad)
                                                 : option_reason(rg::RangeOptions{}, out.bad);
            break;
        default: s = "internal error in the library: please report the inputs"; break;
    }
    copy_out(s, text, size);
}

void size_reason(const char *name, const char *type, bool null, size_t given, size_t need,
                 char *text, size_t size) {
    const Str t = Str("sizeof(") + type + ")";
    const Str s = null ? Str(name) + " is NULL: pass a " + type + " with size = " + t
                       : Str(name) + "->size = " + whole(static_cast<long long>(given)) +
                             " is below " + t + " = " + whole(static_cast<long long>(need)) +
                             ": set it to " + t + " before the call";
    copy_out(s, text, size);
}

}  // namespace cto::table
