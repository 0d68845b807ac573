// share_range and share_swing over solve_rates; see rates_model.hpp.
#include "rates_model.hpp"

#include "../models/combined.hpp"

namespace cto::core::range {
namespace {

// The first invalid flag slot, or -1.
int check_flags(const RangeIn &in) {
    if (!flag_ok(in.arg[kOwnOpensSlot])) return kOwnOpensSlot;
    if (!flag_ok(in.arg[kContinuousSlot])) return kContinuousSlot;
    return -1;
}

}  // namespace

bool flag_ok(const RangeArg &a) { return a.kind == kFixed && (a.mode == 0.0 || a.mode == 1.0); }

int rates_draw(const void *, const double *x, Draw *d, int *bad) {
    const SolveRatesIn in{x[0], x[1], x[2], x[3], x[4],        x[5],  x[6],
                          x[7], x[8], x[9], x[10], x[11] != 0.0, x[12], x[13] != 0.0};
    SolveOut o;
    const int st = solve_rates(in, &o, bad);
    *d = Draw{o.own_share, o.other_share, o.rational, o.binding,
              st == CTO_E_NO_DEAL || o.boundary};
    return st;
}

int share_range(const RangeIn &in, const RangeOptions &opt, RangeOut *out) {
    const bool sizes = in.size >= sizeof(RangeIn) && opt.size >= sizeof(RangeOptions);
    const int bad = !sizes ? kBadSize : check_flags(in);
    if (bad >= 0) {
        clear_range_out(out, sizes ? opt : default_options());
        out->status = CTO_E_INVALID;
        out->bad = bad;
        return CTO_E_INVALID;
    }
    return run_range(Model{rates_draw, nullptr}, in.arg, kRangeSlots, opt, out);
}

int share_swing(const RangeIn &in, SwingOut *out) {
    const int bad = in.size < sizeof(RangeIn) ? kBadSize : check_flags(in);
    if (bad >= 0) {
        clear_swing_out(out);
        out->status = CTO_E_INVALID;
        out->bad = bad;
        return CTO_E_INVALID;
    }
    return run_swing(Model{rates_draw, nullptr}, in.arg, kRangeSlots, out);
}

}  // namespace cto::core::range
