"""counteroffer: how a jointly created surplus is split in a negotiation.

Every function of the project's catalogue, computed by the counteroffer C library from
published alternating-offers bargaining models (Rubinstein 1982; Binmore, Rubinstein &
Wolinsky 1986; Muthoo 1999; Baron & Ferejohn 1989; Fudenberg & Tirole 1983).

Conventions
    "own" is the party whose result is returned, "other" the counterparty;
    ``own_opens`` (default True) means own makes the first offer.  Money arguments are
    in one unit of your choice (``surplus`` defaults to 1, so results are fractions).
    Patience is a per-round discount factor in [0, 1], or an annual rate plus the days
    between offers.

Arrays
    Every function is a NumPy ufunc underneath: scalars give a Python float, any mix of
    scalars, lists and arrays broadcasts, ``out=`` works, results are float64, a pandas
    Series gives a Series with its index, dask arrays and dask DataFrame columns give
    lazy results.  Which walk-away value binds is a word ("none", "ours", "theirs",
    "both") and whether a deal is rational a bool, in scalar and array results alike.  The loops
    run in C with the GIL released; long arrays are split over a few threads
    (``set_num_threads``).

Errors
    See ``errstate``: invalid input raises ``ValueError`` naming the argument and its
    value; "no deal" returns own's no-deal payoff with a ``NoDealWarning``;
    indeterminate and non-converged results are NaN with a warning; a value outside
    its plausible range (a rate typed as 8 for 8%) is used as given, with an
    ``ImplausibleInputWarning``.

Functions
{functions}

Command line: ``counteroffer --function share deals.csv -o results.csv``.

Results are model estimates under the stated assumptions,
not financial, legal or tax advice.
"""

from __future__ import annotations

from typing import Any, Dict, List

from . import _core
from ._errors import (
    CounterofferError,
    CounterofferWarning,
    IndeterminateError,
    IndeterminateWarning,
    ImplausibleInputError,
    ImplausibleInputWarning,
    InternalError,
    InternalWarning,
    InvalidArgumentError,
    InvalidArgumentWarning,
    NoConvergenceError,
    NoConvergenceWarning,
    NoDealError,
    NoDealWarning,
    PrecisionNotReachedError,
    PrecisionNotReachedWarning,
    errstate,
    geterr,
    seterr,
)
from ._docs import build_doc
from ._factory import make_function
from ._results import ArrayResult
from ._spec import load_specs
from ._distributions import Distribution, pert, triangular, uniform
from ._offers import OfferPathRows, offer_path_rows
from ._plots import PLOT_PROBABILITIES, plot_offer_path, plot_share_range, plot_swing
from ._range_results import Estimate, RangeResult, SwingResult, SwingRow
from ._ranges import share_range, share_swing

__version__: str = _core.version()
if __version__ != _core.HEADER_VERSION:  # the sqlite-style start-up check
    raise ImportError(
        f"counteroffer: library version {__version__} differs from the header "
        f"version {_core.HEADER_VERSION} the module was built with"
    )

for _cls in (CounterofferError, CounterofferWarning, IndeterminateError, IndeterminateWarning,
             ImplausibleInputError, ImplausibleInputWarning, InternalError, InternalWarning, InvalidArgumentError, InvalidArgumentWarning,
             NoConvergenceError, NoConvergenceWarning, NoDealError, NoDealWarning,
             PrecisionNotReachedError, PrecisionNotReachedWarning, Distribution, Estimate,
             OfferPathRows, RangeResult, SwingResult, SwingRow):
    _cls.__module__ = __name__

#: The library's function table, one FunctionSpec per catalogue row, in order.
catalogue = tuple(load_specs())
_functions: Dict[str, Any] = {}
for _spec in catalogue:
    _fn = make_function(_spec, build_doc(_spec))
    _functions[_spec.name] = _fn
    globals()[_spec.name] = _fn
    _result = getattr(_fn, "Result", None)
    if _result is not None:
        globals()[_result.__name__] = _result

__doc__ = (__doc__ or "").format(
    functions="\n".join(f"    {s.name:<22} {s.summary}" for s in catalogue)
)

__all__: List[str] = [s.name for s in catalogue] + [
    "ArrayResult",
    "CounterofferError",
    "CounterofferWarning",
    "IndeterminateError",
    "IndeterminateWarning",
    "ImplausibleInputError",
    "ImplausibleInputWarning",
    "InternalError",
    "InternalWarning",
    "InvalidArgumentError",
    "InvalidArgumentWarning",
    "NoConvergenceError",
    "NoConvergenceWarning",
    "NoDealError",
    "NoDealWarning",
    "PrecisionNotReachedError",
    "PrecisionNotReachedWarning",
    # ranges under uncertainty and the offer path's rows (struct entry points)
    "share_range",
    "share_swing",
    "uniform",
    "triangular",
    "pert",
    "Distribution",
    "Estimate",
    "RangeResult",
    "SwingResult",
    "SwingRow",
    "offer_path_rows",
    "OfferPathRows",
    "plot_share_range",
    "plot_swing",
    "plot_offer_path",
    "PLOT_PROBABILITIES",
    "catalogue",
    "errstate",
    "geterr",
    "seterr",
    "set_num_threads",
    "get_num_threads",
    "status_name",
    "status_message",
] + sorted(r.__name__ for r in (getattr(f, "Result", None) for f in _functions.values()) if r)


def set_num_threads(n: int) -> int:
    """Threads one call may use for a long array (default: the CPU count, at most 8;
    the environment variable COUNTEROFFER_NUM_THREADS sets it at import).  Loops are
    split only above 32768 elements.  Returns the previous setting."""
    return _core.set_num_threads(int(n))


def get_num_threads() -> int:
    """Threads one call may use for a long array (see set_num_threads)."""
    return _core.get_num_threads()


def _threads_from_environment() -> None:
    import os

    text = os.environ.get("COUNTEROFFER_NUM_THREADS", "").strip()
    if text:
        try:
            set_num_threads(int(text))
        except ValueError:
            raise ImportError(f"COUNTEROFFER_NUM_THREADS = {text!r} is invalid "
                              "(a whole number, at least 1)") from None


_threads_from_environment()


def status_name(status: int) -> str:
    """The library's short name of a status code ("ok", "invalid", "no_deal", ...)."""
    return _core.status_name(status)


def status_message(status: int) -> str:
    """The library's one-sentence meaning of a status code for the output."""
    return _core.status_message(status)


del _cls, _spec, _fn, _result
