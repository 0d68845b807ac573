// The ranges engine: validation, the doubling loop, threads by replicate, estimates.
// See engine.hpp for the method and its sources.
#include "engine.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <memory>
#include <new>
#include <thread>
#include <vector>

#include "counteroffer/counteroffer.h"

namespace cto::core::range {
namespace {

constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();

using Reps = std::vector<ReplicateData>;

}  // namespace

void clear_range_out(RangeOut *o, const RangeOptions &opt) {
    const size_t size = o->size;
    *o = RangeOut{};
    o->size = size;
    o->bad = -1;
    o->spec_version = kSpecVersion;
    const Estimate none{kNaN, kNaN, kNaN, 0};
    o->n_probs = (opt.n_probs >= 1 && opt.n_probs <= kMaxProbs) ? opt.n_probs : 0;
    for (int k = 0; k < kMaxProbs; ++k) {
        o->probs[k] = k < o->n_probs ? opt.probs[k] : kNaN;
        o->own[k] = o->other[k] = none;
    }
    o->own_mean = o->other_mean = o->p_rational = o->p_own_binds = o->p_other_binds =
        o->edge_fraction = none;
    o->replicates = opt.replicates;
}

namespace {

int fail(RangeOut *o, int status, int bad) {
    o->status = status;
    o->bad = status == CTO_E_INVALID ? bad : -1;
    return status;
}

// The first invalid option's index, or -1.
int check_options(const RangeOptions &opt) {
    if (!(opt.n_probs >= 1 && opt.n_probs <= kMaxProbs)) return kBadProbs;
    for (int k = 0; k < opt.n_probs; ++k)
        if (!(opt.probs[k] > 0.0 && opt.probs[k] < 1.0)) return kBadProbs;
    if (!(opt.replicates >= 2 && opt.replicates <= kMaxReplicates)) return kBadReplicates;
    if (!(opt.digits >= 1 && opt.digits <= kMaxDigits)) return kBadDigits;
    if (!(opt.log2_start >= 1 && opt.log2_start <= kMaxLog2)) return kBadLog2Start;
    if (!(opt.log2_max >= opt.log2_start && opt.log2_max <= kMaxLog2)) return kBadLog2Max;
    if ((static_cast<uint64_t>(opt.replicates) << opt.log2_max) > (uint64_t{1} << kMaxLog2Total))
        return kBadLog2Max;
    if (!(opt.threads >= 0 && opt.threads <= kMaxWorkerThreads)) return kBadThreads;
    return -1;
}

// Fills the sampler from the inputs; returns the first invalid input's index, or -1.
int build_sampler(const Model &model, const RangeArg *args, int n_slots, uint64_t seed,
                  Sampler *s) {
    s->model = model;
    s->n_slots = n_slots;
    s->seed = seed;
    for (int j = 0; j < n_slots; ++j) {
        const Dist d{args[j].kind, args[j].low, args[j].mode, args[j].high};
        // A fixed input may be any value the model accepts (e.g. -infinity: "absent");
        // the model's own checks at the probe decide.
        if (d.kind != kFixed && !dist_valid(d)) return j;
        if (d.kind == kFixed && std::isnan(d.mode)) return j;
        s->uncertain[j] = d.kind != kFixed && d.low < d.high;
        s->value[j] = d.kind == kFixed ? d.mode : d.low;
        s->plan[j] = s->uncertain[j] ? dist_plan(d) : DistPlan{};
        s->n_uncertain += s->uncertain[j] ? 1 : 0;
    }
    return -1;
}

// The scrambling cache's L: at most 12 digits, no more than the first round's 2^log2_start
// points per replicate need, and at most 32 MiB for all replicates.  Building it costs
// 2^(L+1) hashes and saves L per point, so L = log2_start is the cheapest for the first
// round, where most runs stop.  A pure cache: results do not depend on it.
int prefix_bits(const Sampler &s, const RangeOptions &opt) {
    int L = std::min(12, opt.log2_start);
    const uint64_t per = static_cast<uint64_t>(opt.replicates) *
                         static_cast<uint64_t>(std::max(s.n_uncertain, 1)) * sizeof(uint32_t);
    while (L > 0 && (per << L) > (uint64_t{32} << 20)) --L;
    return L;
}

// The model at the modes, and at each uncertain input's low and high with the others at
// their modes.  Returns CTO_OK or the failing status (with *bad for CTO_E_INVALID).
int probe(const Sampler &s, const RangeArg *args, int *bad) {
    double x[kSobolDims];
    for (int j = 0; j < s.n_slots; ++j)
        x[j] = s.uncertain[j] ? dist_mode(Dist{args[j].kind, args[j].low, args[j].mode, args[j].high})
                              : s.value[j];
    Draw d{};
    int st = s.model.fn(s.model.ctx, x, &d, bad);
    if (st == CTO_E_INVALID) return st;
    for (int j = 0; j < s.n_slots; ++j) {
        if (!s.uncertain[j]) continue;
        const double keep = x[j];
        for (double end : {args[j].low, args[j].high}) {
            x[j] = end;
            st = s.model.fn(s.model.ctx, x, &d, bad);
            if (st == CTO_E_INVALID) return st;
        }
        x[j] = keep;
    }
    return CTO_OK;
}

// Points from..to-1 of every replicate, each replicate then sorted (own and other's share
// in totalOrder, while its draws are still in the worker's cache); replicates are shared
// among the threads by index (worker w takes r = w, w + T, ...), and each writes only its
// own replicates.
void run_round(const Sampler &s, Reps &reps, uint64_t from, uint64_t to, int threads) {
    const size_t R = reps.size();
    const size_t T = threads <= 1 ? 1 : std::min(static_cast<size_t>(threads), R);
    std::vector<SortWork> sorts(T);
    for (ReplicateData &d : reps) {  // allocation stays in the calling thread
        d.own.resize(static_cast<size_t>(to));
        d.other.resize(static_cast<size_t>(to));
    }
    for (SortWork &w : sorts) reserve_sort(w, static_cast<size_t>(to));
    auto work = [&](size_t w) {
        for (size_t r = w; r < R; r += T) {
            ReplicateData &d = reps[r];
            extend_replicate(s, r, from, to, &d);
            if (d.status != CTO_OK) continue;
            sort_total(d.own.data(), static_cast<size_t>(to), sorts[w]);
            sort_total(d.other.data(), static_cast<size_t>(to), sorts[w]);
        }
    };
    if (T == 1) {
        work(0);
        return;
    }
    // A worker that cannot be started (std::system_error, std::bad_alloc) is run by the
    // calling thread instead: every replicate is still computed exactly once, so the
    // result is the same, and no joinable thread is ever destroyed.
    std::vector<std::thread> pool;
    size_t started = 1;
    try {
        pool.reserve(T - 1);
        for (; started < T; ++started) pool.emplace_back(work, started);
    } catch (...) {
    }
    for (size_t w = started; w < T; ++w) work(w);
    work(0);
    for (std::thread &t : pool) t.join();
}

Estimate make_estimate(double value, const std::vector<double> &per_rep, double t) {
    const MeanSe ms = mean_se(per_rep.data(), per_rep.size());
    const double hw = t * ms.se;
    return {value, ms.se, hw, digits_reached(value, hw)};
}

// Quantile p of own (or other's) share: pooled definition-7 estimate, SE from replicates.
Estimate quantile_estimate(const Reps &reps, size_t n, double p, bool own, double t,
                           std::vector<double> &tmp, std::vector<const double *> &seg) {
    for (size_t r = 0; r < reps.size(); ++r) {
        const double *y = own ? reps[r].own.data() : reps[r].other.data();
        seg[r] = y;
        tmp[r] = quantile7_sorted(y, n, p);
    }
    const double pooled = quantile7_pooled(seg.data(), seg.size(), n, p);
    return make_estimate(pooled, tmp, t);
}

// A fraction or mean per replicate (in replicate order), its pooled value and error.
template <class F>
Estimate replicate_estimate(const Reps &reps, double t, std::vector<double> &tmp, F per_rep) {
    for (size_t r = 0; r < reps.size(); ++r) tmp[r] = per_rep(reps[r]);
    const MeanSe ms = mean_se(tmp.data(), tmp.size());
    return make_estimate(ms.mean, tmp, t);
}

// Fills the estimates for n points per replicate; returns whether the target is met.
bool estimate(Reps &reps, size_t n, const RangeOptions &opt, RangeOut *o) {
    const double t = t975(static_cast<int>(reps.size()) - 1);
    std::vector<double> tmp(reps.size());
    std::vector<const double *> seg(reps.size());
    bool reached = true;
    for (int k = 0; k < opt.n_probs; ++k) {
        o->own[k] = quantile_estimate(reps, n, opt.probs[k], true, t, tmp, seg);
        o->other[k] = quantile_estimate(reps, n, opt.probs[k], false, t, tmp, seg);
        if (!(o->own[k].half_width <= digit_tolerance(o->own[k].value, opt.digits) ||
              o->own[k].half_width == 0.0))
            reached = false;
    }
    const double nd = static_cast<double>(n);
    auto frac = [nd](uint64_t c) { return static_cast<double>(c) / nd; };
    o->own_mean = replicate_estimate(reps, t, tmp, [nd](const ReplicateData &d) { return d.own_sum.value() / nd; });
    o->other_mean = replicate_estimate(reps, t, tmp, [nd](const ReplicateData &d) { return d.other_sum.value() / nd; });
    o->p_rational = replicate_estimate(reps, t, tmp, [&](const ReplicateData &d) { return frac(d.rational); });
    o->p_own_binds = replicate_estimate(reps, t, tmp, [&](const ReplicateData &d) { return frac(d.own_binds); });
    o->p_other_binds = replicate_estimate(reps, t, tmp, [&](const ReplicateData &d) { return frac(d.other_binds); });
    o->edge_fraction = replicate_estimate(reps, t, tmp, [&](const ReplicateData &d) { return frac(d.edge); });
    return reached;
}

// The doubling loop (docs/models/ranges.md, "Estimators and error bars": digit target).
int sample(const Sampler &s, const RangeOptions &opt, RangeOut *o) {
    Reps reps(static_cast<size_t>(opt.replicates));
    for (ReplicateData &d : reps)
        d.masks.resize(static_cast<size_t>(s.n_uncertain) << s.prefix_bits);
    uint64_t done = 0;
    for (int m = opt.log2_start; m <= opt.log2_max; ++m) {
        const uint64_t n = uint64_t{1} << m;
        run_round(s, reps, done, n, opt.threads);
        done = n;
        for (const ReplicateData &d : reps) {  // the first failure in replicate order
            if (d.status == CTO_OK) continue;
            const int dimension = o->dimension;
            clear_range_out(o, opt);  // no estimate of an earlier round survives
            o->dimension = dimension;
            return fail(o, d.status, d.bad);
        }
        const bool reached = estimate(reps, static_cast<size_t>(n), opt, o);
        o->points_per_replicate = n;
        o->log2_used = m;
        if (reached) return fail(o, CTO_OK, -1);
    }
    return fail(o, kPrecisionNotReached, -1);
}

}  // namespace

RangeOptions default_options() {
    RangeOptions o{};
    o.size = sizeof(RangeOptions);
    o.n_probs = 3;
    o.probs[0] = 0.1;
    o.probs[1] = 0.5;
    o.probs[2] = 0.9;
    o.seed = 0;
    o.replicates = 16;
    o.digits = 3;
    o.log2_start = 10;
    o.log2_max = 20;
    o.threads = 1;
    return o;
}

int run_range(const Model &model, const RangeArg *args, int n_slots, const RangeOptions &opt,
              RangeOut *out) {
    clear_range_out(out, opt);
    if (n_slots < 1 || n_slots > kSobolDims) return fail(out, CTO_E_INTERNAL, -1);
    try {
        // The sampler holds a PERT table per input (a few kB each): on the heap.
        const std::unique_ptr<Sampler> sp(new Sampler{});
        const Sampler &s = *sp;
        const int bad_arg = build_sampler(model, args, n_slots, opt.seed, sp.get());
        if (bad_arg >= 0) return fail(out, CTO_E_INVALID, bad_arg);
        int bad = -1;
        const int st = probe(s, args, &bad);
        if (st != CTO_OK) return fail(out, st, bad);
        const int bad_opt = check_options(opt);
        if (bad_opt >= 0) return fail(out, CTO_E_INVALID, bad_opt);
        sp->prefix_bits = prefix_bits(s, opt);
        for (int j = 0; j < n_slots; ++j) out->dimension += s.uncertain[j] ? 1 : 0;
        return sample(s, opt, out);
    } catch (...) {  // std::bad_alloc, std::system_error from std::thread
        clear_range_out(out, opt);
        return fail(out, CTO_E_INTERNAL, -1);
    }
}

}  // namespace cto::core::range
