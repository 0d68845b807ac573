// Repeated offers, the gap case (every type is worth serving): the exact
// piecewise-polynomial recursion is being built; until then the core reports
// CTO_E_NO_CONVERGENCE for these inputs with every total NaN.
#include "offers.hpp"

namespace cto::core::offers_detail {

int gap_path(const Canon &, OfferRow *, int64_t, OfferTotals *) { return CTO_E_NO_CONVERGENCE; }

}  // namespace cto::core::offers_detail
