// One-at-a-time swing; see swing.hpp.
#include "swing.hpp"

#include <cmath>
#include <limits>

#include "counteroffer/counteroffer.h"
#include "distributions.hpp"

namespace cto::core::range {
namespace {

constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();

}  // namespace

void clear_swing_out(SwingOut *o) {
    const size_t size = o->size;
    *o = SwingOut{};
    o->size = size;
    o->bad = -1;
    o->base = kNaN;
    for (SwingRow &r : o->row) r = SwingRow{-1, kNaN, kNaN, kNaN, 0, 0};
}

namespace {

int swing_fail(SwingOut *o, int status, int bad) {
    clear_swing_out(o);
    o->status = status;
    o->bad = status == CTO_E_INVALID ? bad : -1;
    return status;
}

// Own share at x, with the model's status; NaN unless CTO_OK or CTO_E_NO_DEAL.
double own_at(const Model &m, const double *x, int *status, int *bad) {
    Draw d{};
    *status = m.fn(m.ctx, x, &d, bad);
    return (*status == CTO_OK || *status == CTO_E_NO_DEAL) ? d.own : kNaN;
}

// Stable insertion sort by swing, largest first; NaN swings last.
void sort_rows(SwingRow *row, int n) {
    auto before = [](const SwingRow &a, const SwingRow &b) {
        if (std::isnan(b.swing)) return !std::isnan(a.swing);
        return a.swing > b.swing;
    };
    for (int i = 1; i < n; ++i) {
        const SwingRow r = row[i];
        int j = i;
        for (; j > 0 && before(r, row[j - 1]); --j) row[j] = row[j - 1];
        row[j] = r;
    }
}

}  // namespace

int run_swing(const Model &model, const RangeArg *args, int n_slots, SwingOut *out) {
    clear_swing_out(out);
    if (n_slots < 1 || n_slots > kRangeSlots) return swing_fail(out, CTO_E_INTERNAL, -1);
    double x[kRangeSlots];
    bool uncertain[kRangeSlots];
    for (int j = 0; j < n_slots; ++j) {
        const Dist d{args[j].kind, args[j].low, args[j].mode, args[j].high};
        if (d.kind == kFixed ? std::isnan(d.mode) : !dist_valid(d))
            return swing_fail(out, CTO_E_INVALID, j);
        uncertain[j] = d.kind != kFixed && d.low < d.high;
        x[j] = d.kind == kFixed ? d.mode : (uncertain[j] ? dist_mode(d) : d.low);
    }
    int st = CTO_OK, bad = -1;
    out->base = own_at(model, x, &out->base_status, &bad);
    if (out->base_status == CTO_E_INVALID) return swing_fail(out, CTO_E_INVALID, bad);
    int n = 0;
    for (int j = 0; j < n_slots; ++j) {
        if (!uncertain[j]) continue;
        SwingRow &r = out->row[n++];
        r.input = j;
        const double keep = x[j];
        x[j] = args[j].low;
        r.at_low = own_at(model, x, &st, &bad);
        r.status_low = st;
        if (st == CTO_E_INVALID) return swing_fail(out, st, bad);
        x[j] = args[j].high;
        r.at_high = own_at(model, x, &st, &bad);
        r.status_high = st;
        if (st == CTO_E_INVALID) return swing_fail(out, st, bad);
        x[j] = keep;
        r.swing = std::fabs(r.at_high - r.at_low);
    }
    out->n_rows = n;
    sort_rows(out->row, n);
    out->status = CTO_OK;
    return CTO_OK;
}

}  // namespace cto::core::range
