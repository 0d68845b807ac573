"""Plot helpers (matplotlib, the optional extra ``counteroffer[plot]``, imported only
when a helper is called): own share's distribution from share_range's quantiles, the
tornado chart of share_swing, and the offer path with the probability of agreement by
round.  They draw the library's numbers as they are; each returns its Axes.
"""

from __future__ import annotations

from typing import Any, Optional, Sequence, Tuple

from ._offers import OfferPathRows
from ._range_results import RangeResult, SwingResult

#: probabilities for plot_share_range's histogram (25 quantiles from 2% to 98%, with 10%,
#: 50% and 90% among them): pass them to share_range(probabilities=...)
PLOT_PROBABILITIES: Tuple[float, ...] = tuple(round(0.02 + 0.04 * k, 2) for k in range(25))


def _pyplot() -> Any:
    try:
        import matplotlib.pyplot as plt
    except ImportError:
        raise ImportError("counteroffer's plot helpers need matplotlib: pip install "
                          "'counteroffer[plot]' (or pip install matplotlib)") from None
    return plt


def _axes(ax: Any) -> Any:
    return _pyplot().subplots()[1] if ax is None else ax


def plot_share_range(result: RangeResult, marks: Sequence[float] = (0.1, 0.5, 0.9), ax: Any = None,
                     title: Optional[str] = None) -> Any:
    """Own share's distribution as a histogram whose bars lie between consecutive
    quantiles of ``result`` (a RangeResult; bar area = the probability between them, so
    the more probabilities, the finer the picture: see PLOT_PROBABILITIES), with the
    quantiles at ``marks`` drawn as vertical lines and their 95% half-widths shaded."""
    ax = _axes(ax)
    probs = list(result.probabilities)
    values = [e.value for e in result.own]
    for k in range(len(probs) - 1):
        width = values[k + 1] - values[k]
        if width > 0:
            bars = ax.bar(values[k], (probs[k + 1] - probs[k]) / width, width=width,
                          align="edge", color="0.75", edgecolor="0.45")
            bars[0].set_gid("share_range_bar")
    for p in marks:
        if p not in probs:
            raise ValueError(f"plot_share_range: probability {p!r} is not in the result "
                             f"(it has {tuple(probs)})")
        e = result.own[probs.index(p)]
        ax.axvline(e.value, color="C0", linestyle="--", label=f"{p:.0%}: {e.value:.4g}")
        if e.half_width > 0:
            ax.axvspan(e.value - e.half_width, e.value + e.half_width, color="C0", alpha=0.2)
    ax.set_title(title or "Own share under uncertain inputs (model estimate)")
    ax.set_xlabel("own share")
    ax.set_ylabel("probability density")
    if marks:
        ax.legend(title="quantiles")
    return ax


def plot_swing(result: SwingResult, ax: Any = None, title: Optional[str] = None) -> Any:
    """The tornado chart of a SwingResult: a bar per uncertain input from own share at
    its low to own share at its high, largest swing on top, the base share as a line."""
    ax = _axes(ax)
    rows = list(result.rows)
    n = len(rows)
    for k, r in enumerate(rows):
        y = n - 1 - k
        ax.barh(y, r.at_low - result.base, left=result.base, color="C3", label="at low"
                if k == 0 else "_low")
        ax.barh(y, r.at_high - result.base, left=result.base, color="C2", label="at high"
                if k == 0 else "_high")
    ax.set_yticks(range(n))
    ax.set_yticklabels([r.input for r in reversed(rows)])
    ax.axvline(result.base, color="0.2", linewidth=1, label=f"base {result.base:.4g}")
    ax.set_title(title or "Swing of own share, one input at a time (model estimate)")
    ax.set_xlabel("own share")
    ax.set_ylabel("uncertain input")
    ax.legend()
    return ax


def plot_offer_path(path: OfferPathRows, ax: Any = None, title: Optional[str] = None) -> Tuple[Any, Any]:
    """The offers of an OfferPathRows by round (or calendar day when it has ``days``)
    on ``ax``, and the probability of agreement by that round on a second y axis.
    Returns (offer axes, probability axes)."""
    ax = _axes(ax)
    x = path.rounds if path.days is None else path.day
    ax.plot(x, path.offer, marker="o", color="C0", label="offer")
    ax.set_xlabel("round" if path.days is None else "day of the offer")
    ax.set_ylabel("offer (money)")
    right = ax.twinx()
    right.plot(x, path.cumulative_probability, marker="s", color="C1",
               label="probability of agreement by then")
    right.set_ylim(0, 1)
    right.set_ylabel("probability of agreement")
    ax.set_title(title or "Offer path and probability of agreement (model estimate)")
    lines = ax.get_legend_handles_labels()
    more = right.get_legend_handles_labels()
    ax.legend(lines[0] + more[0], lines[1] + more[1], loc="center right")
    return ax, right
