// One replicate of the randomized QMC rule; see replicate.hpp.
#include "replicate.hpp"

#include <cmath>

#include "counteroffer/counteroffer.h"
#include "scramble.hpp"

namespace cto::core::range {

void extend_replicate(const Sampler &s, uint64_t r, uint64_t from, uint64_t to,
                      ReplicateData *d) {
    if (d->status != CTO_OK) return;
    const int n = s.n_slots;
    uint64_t key[kSobolDims];
    uint32_t x_bits[kSobolDims];
    double x[kSobolDims];
    const int L = s.prefix_bits;
    const size_t table = size_t{1} << L;
    const uint32_t *mask[kSobolDims] = {};
    for (int j = 0, u = 0; j < n; ++j) {
        x[j] = s.value[j];
        if (!s.uncertain[j]) continue;
        key[j] = scramble_key(s.seed, r, static_cast<uint64_t>(j));
        x_bits[j] = sobol_point(from, j);
        uint32_t *m = d->masks.data() + static_cast<size_t>(u++) * table;
        if (from == 0) owen_prefix_masks(key[j], L, m);  // the first round builds the cache
        mask[j] = m;
    }
    for (uint64_t i = from; i < to; ++i) {
        for (int j = 0; j < n; ++j) {
            if (!s.uncertain[j]) continue;
            if (i != from) x_bits[j] ^= sobol_step(i, j);
            const uint32_t y = owen_scramble_cached(x_bits[j], key[j], L, mask[j]);
            x[j] = dist_quantile(s.plan[j], unit_from_bits(y));
        }
        Draw dr{};
        int bad = -1;
        const int st = s.model.fn(s.model.ctx, x, &dr, &bad);
        if ((st != CTO_OK && st != CTO_E_NO_DEAL) || std::isnan(dr.own) || std::isnan(dr.other)) {
            d->status = st == CTO_OK || st == CTO_E_NO_DEAL ? CTO_E_INDETERMINATE : st;
            d->bad = bad;
            return;
        }
        d->own[i] = dr.own;
        d->other[i] = dr.other;
        d->own_sum.add(dr.own);
        d->other_sum.add(dr.other);
        d->rational += dr.rational ? 1u : 0u;
        d->own_binds += (dr.binding == CTO_BINDS_OWN || dr.binding == CTO_BINDS_BOTH) ? 1u : 0u;
        d->other_binds += (dr.binding == CTO_BINDS_OTHER || dr.binding == CTO_BINDS_BOTH) ? 1u : 0u;
        d->edge += (dr.edge || st == CTO_E_NO_DEAL) ? 1u : 0u;
    }
}

}  // namespace cto::core::range
