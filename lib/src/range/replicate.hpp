// One replicate of the randomized QMC rule: the model evaluated at the scrambled Sobol'
// points i = from..to-1 of replicate r, appended to that replicate's samples.
//
// Point i of replicate r has coordinates x_j = F_j^-1(u_{r,i,j}), u = (Y + 1/2) 2^-32, Y the
// Owen scramble (key(seed, r, j)) of the natural-order Sobol' coordinate X_{i,j}
// (sobol.hpp, scramble.hpp); fixed inputs take their value.  The model callback returns
// the shares of the draw; counts and sums are kept in index order, so a replicate's
// statistics are the same whichever thread computes it.
#ifndef CTO_RANGE_REPLICATE_HPP
#define CTO_RANGE_REPLICATE_HPP

#include <cstddef>
#include <cstdint>
#include <vector>

#include "distributions.hpp"
#include "quantile.hpp"
#include "sobol.hpp"

namespace cto::core::range {

// The outcome of the model at one draw.
struct Draw {
    double own, other;  // shares (money); the no-deal payoffs when there is no deal
    bool rational;      // a deal is rational at this draw
    int binding;        // CTO_BINDS_*
    bool edge;          // an edge case of the model (no deal, a regime boundary)
};

// The model: returns CTO_OK or CTO_E_NO_DEAL with *d written, or another status (then
// *bad names the invalid input for CTO_E_INVALID).  Must be thread-safe.
using ModelFn = int (*)(const void *ctx, const double *x, Draw *d, int *bad);
struct Model {
    ModelFn fn;
    const void *ctx;
};

// Everything a replicate needs that does not change during a run.
struct Sampler {
    Model model;
    int n_slots;                  // inputs, <= kSobolDims
    uint64_t seed;
    bool uncertain[kSobolDims];   // slot j drawn (low < high) or fixed
    int n_uncertain;
    int prefix_bits;              // L of the scrambling cache (scramble.hpp); 0: none
    double value[kSobolDims];     // the value of a fixed slot (a degenerate range: low)
    DistPlan plan[kSobolDims];
};

struct ReplicateData {
    std::vector<double> own, other;  // the samples (sorted in totalOrder after each round)
    std::vector<uint32_t> masks;     // scrambling cache: n_uncertain x 2^prefix_bits, built
                                     // by the first extend_replicate (sized by the caller)
    Sum own_sum, other_sum;          // in index order
    uint64_t rational = 0, own_binds = 0, other_binds = 0, edge = 0;
    int status = 0;                  // CTO_OK, or the first failing draw's status
    int bad = -1;
};

// Evaluates points from..to-1 of replicate r into d (whose vectors already hold `from`
// samples and have room for `to`).  Never throws, never allocates.
void extend_replicate(const Sampler &s, uint64_t r, uint64_t from, uint64_t to,
                      ReplicateData *d);

}  // namespace cto::core::range

#endif  // CTO_RANGE_REPLICATE_HPP
