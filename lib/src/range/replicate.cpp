// One replicate of the randomized QMC rule; see replicate.hpp.
#include "replicate.hpp"

#include <algorithm>
#include <cmath>

#include "counteroffer/counteroffer.h"
#include "scramble.hpp"

namespace cto::core::range {
namespace {

// Points are drawn a block at a time, one input after the other (the scramble and the
// inverse CDF run over the whole block, where the vector units and the out-of-order core
// find independent work), then the model runs point by point in index order.  The block
// is a working size only: every point gets the same bits whatever its position in one.
constexpr size_t kBlock = 64;

// The scrambled Sobol' coordinates of points b .. b+m-1 of one input, as inputs; *last
// is X_{b-1} (any value for b = from, which starts afresh) and becomes X_{b+m-1}.
void draw_block(const Sampler &s, int j, uint64_t key, const uint32_t *mask, uint64_t from,
                uint64_t b, size_t m, uint32_t *last, double *col) {
    uint32_t x[kBlock], y[kBlock];
    const uint32_t *step = sobol_steps(j);  // X_i = X_{i-1} ^ step[ctz(i)] (sobol.hpp)
    uint32_t cur = b == from ? sobol_point(b, j) : *last ^ step[__builtin_ctzll(b)];
    x[0] = cur;
    for (size_t i = 1; i < m; ++i) x[i] = cur ^= step[__builtin_ctzll(b + i)];
    *last = cur;
    owen_scramble_block(x, m, key, s.prefix_bits, mask, y);
    dist_quantile_block(s.plan[j], y, m, col);
}

}  // namespace

void extend_replicate(const Sampler &s, uint64_t r, uint64_t from, uint64_t to,
                      ReplicateData *d) {
    if (d->status != CTO_OK) return;
    const int n = s.n_slots;
    const size_t table = size_t{1} << s.prefix_bits;
    int slot[kSobolDims];  // the uncertain inputs, in input order
    uint64_t key[kSobolDims];
    const uint32_t *mask[kSobolDims] = {};
    double x[kSobolDims];
    int nu = 0;
    for (int j = 0; j < n; ++j) {
        x[j] = s.value[j];
        if (!s.uncertain[j]) continue;
        key[nu] = scramble_key(s.seed, r, static_cast<uint64_t>(j));
        uint32_t *m = d->masks.data() + static_cast<size_t>(nu) * table;
        if (from == 0) owen_prefix_masks(key[nu], s.prefix_bits, m);  // the first round builds the cache
        mask[nu] = m;
        slot[nu++] = j;
    }
    double col[kSobolDims][kBlock];  // 32 KiB of stack at most
    uint32_t last[kSobolDims] = {};
    for (uint64_t b = from; b < to; b += kBlock) {
        const size_t m = static_cast<size_t>(std::min<uint64_t>(kBlock, to - b));
        for (int u = 0; u < nu; ++u)
            draw_block(s, slot[u], key[u], mask[u], from, b, m, &last[u], col[u]);
        for (size_t t = 0; t < m; ++t) {
            for (int u = 0; u < nu; ++u) x[slot[u]] = col[u][t];
            Draw dr{};
            int bad = -1;
            const int st = s.model.fn(s.model.ctx, x, &dr, &bad);
            if ((st != CTO_OK && st != CTO_E_NO_DEAL) || std::isnan(dr.own) ||
                std::isnan(dr.other)) {
                d->status = st == CTO_OK || st == CTO_E_NO_DEAL ? CTO_E_INDETERMINATE : st;
                d->bad = bad;
                return;
            }
            const size_t i = static_cast<size_t>(b) + t;
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
}

}  // namespace cto::core::range
