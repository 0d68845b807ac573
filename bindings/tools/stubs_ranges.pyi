# Ranges under uncertainty, the offer path's rows and the plot helpers (bindings/counteroffer
# _distributions, _range_results, _ranges, _offers, _plots): appended by gen_stubs.py.
# Each name is typed where it is written (the modules carry the annotations), so the stub
# only re-exports them.
from counteroffer._distributions import (Distribution as Distribution, pert as pert,
                                         triangular as triangular, uniform as uniform)
from counteroffer._offers import OfferPathRows as OfferPathRows, offer_path_rows as offer_path_rows
from counteroffer._plots import (PLOT_PROBABILITIES as PLOT_PROBABILITIES,
                                 plot_offer_path as plot_offer_path,
                                 plot_share_range as plot_share_range, plot_swing as plot_swing)
from counteroffer._range_results import (Estimate as Estimate, RangeResult as RangeResult,
                                         SwingResult as SwingResult, SwingRow as SwingRow)
from counteroffer._ranges import share_range as share_range, share_swing as share_swing
