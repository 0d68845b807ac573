"""The offer path a row per round (``cto_offer_path_rows``): ``offer_path_rows``.

The totals come from ``counteroffer.offer_path`` (the table's function, with its
conversions, messages and error policy); the rows from the library's struct entry point
with the same arguments.  Nothing here computes a model value: the calendar day of a
round is (round - 1) x days, a unit conversion.
"""

from __future__ import annotations

import dataclasses
from typing import Any, Dict, Optional, Tuple

import numpy as np

from . import _errors, _structs
from ._convert import Invalid, convert, fmt
from ._evaluate import invalid_message
from ._spec import FunctionSpec, load_specs

#: rows when there is no deadline and the cumulative probability has not settled (within
#: SETTLED of the total) sooner; a deadline's rows are all written up to max_rows
MAX_ROWS = 10_000
SETTLED = 1e-12
_SPEC: list = []


def _spec() -> FunctionSpec:
    if not _SPEC:
        _SPEC.append(next(s for s in load_specs() if s.name == "offer_path"))
    return _SPEC[0]


@dataclasses.dataclass(frozen=True)
class OfferPathRows:
    """The offer path of repeated offers to a side of unknown value, a row per round.

    ``totals`` is offer_path's result (``rows_written`` = the rows here); ``offer``,
    ``cutoff``, ``round_probability`` and ``cumulative_probability`` are arrays, one
    element per round from round 1; ``day`` is the calendar day of each round's offer
    ((round - 1) x days) when ``days`` was given.  ``complete`` is False when rows were
    cut at ``max_rows`` before the rounds ended (with a deadline) or before the
    cumulative probability came within 1e-12 of the total (without one).
    """

    totals: Any
    offer: np.ndarray
    cutoff: np.ndarray
    round_probability: np.ndarray
    cumulative_probability: np.ndarray
    days: Optional[float]
    complete: bool

    @property
    def rounds(self) -> np.ndarray:
        """Round numbers, 1 for the opening offer."""
        return np.arange(1, len(self.offer) + 1)

    @property
    def day(self) -> Optional[np.ndarray]:
        if self.days is None:
            return None
        return (self.rounds - 1) * self.days

    def to_frame(self) -> Any:
        """A pandas DataFrame, a row per round (index ``round``): offer, cutoff,
        probability of agreement in the round and by the round, and with ``days`` the
        calendar day of the round's offer."""
        import pandas as pd  # type: ignore[import-untyped,unused-ignore]

        data: Dict[str, Any] = {"offer": self.offer, "cutoff": self.cutoff,
                "round_probability": self.round_probability,
                "cumulative_probability": self.cumulative_probability}
        if self.days is not None:
            data = {"day": self.day, **data}
        return pd.DataFrame(data, index=pd.Index(self.rounds, name="round"))

    def __repr__(self) -> str:
        t = self.totals
        more = "" if self.complete else ", cut at max_rows"
        return (f"OfferPathRows({len(self.offer)} rounds{more}; agreement probability "
                f"{t.agreement_probability:.6g}, expected round {t.expected_round:.6g}, "
                f"opening offer {t.opening_offer:.6g})")


def _scalars(values: Tuple[Any, ...]) -> list:
    spec = _spec()
    try:
        vals, _index, scalar = convert(spec, values)
    except Invalid as e:
        raise _errors.InvalidArgumentError(
            invalid_message(spec, e.index, e.value, e.reason, e.position)) from None
    if not scalar:
        raise TypeError("offer_path_rows: one deal at a time (scalar arguments); use "
                        "offer_path for arrays of deals")
    return [float(v) for v in vals]


def _settled(cum: np.ndarray, total: float) -> int:
    """Rows up to the first whose cumulative probability is within SETTLED of the total."""
    close = np.flatnonzero(np.abs(total - cum) <= SETTLED)
    return int(close[0]) + 1 if close.size else len(cum)


def offer_path_rows(
    private_low: float, private_high: float, offerer_factor: float, responder_factor: float,
    rounds: int = 0, known_value: float = 0.0, offerer: str = "seller", *,
    days: Optional[float] = None, max_rows: int = MAX_ROWS,
) -> OfferPathRows:
    """offer_path's equilibrium path a row per round (Sobel & Takahashi 1983; Stokey
    1981; Fudenberg, Levine & Tirole 1985; Gul, Sonnenschein & Wilson 1986; see
    docs/models/private-information.md s.2): the arguments of offer_path, plus ``days``
    between offers (for the calendar day of each round) and ``max_rows``.

    With a deadline every round with a chance of agreement is a row (up to max_rows);
    without one the rows go on until the cumulative probability is within 1e-12 of the
    total, or max_rows (default 10,000).  Returns an OfferPathRows (``.to_frame()``).
    Model estimates under stated assumptions, not financial, legal or tax advice.

    >>> import counteroffer as co
    >>> p = co.offer_path_rows(0, 1, 0.9, 0.9, rounds=2)
    >>> len(p.offer), round(float(p.cumulative_probability[-1]), 12)
    (2, 0.576923076923)
    """
    from . import offer_path  # type: ignore[attr-defined]

    given = (private_low, private_high, offerer_factor, responder_factor, rounds, known_value,
             offerer)
    totals = offer_path(*given)  # conversions, messages and the error policy of the table
    args = _scalars(given)
    if isinstance(max_rows, bool) or not isinstance(max_rows, (int, np.integer)) or max_rows < 0:
        raise _errors.InvalidArgumentError(
            f"offer_path_rows: max_rows = {fmt(max_rows)} is invalid (a whole number from 0)")
    if days is not None and not isinstance(days, (int, float, np.integer, np.floating)):
        raise _errors.InvalidArgumentError(
            f"offer_path_rows: days = {fmt(days)} is invalid (a number of days, or None)")
    _st, t, rows = _structs.offer_path_rows(args[0], args[1], args[2], args[3], int(args[4]),
                                            args[5], int(args[6]), int(max_rows))
    table = np.array(rows, dtype=np.float64).reshape(-1, 4)
    n = len(table)
    total = float(t["agreement_probability"])
    if int(t["rounds_used"]) < 0 and n:  # no end: cut where the probability has settled
        n = _settled(table[:, 3], total)
    complete = n == 0 or int(t["rounds_used"]) == len(table) or (
        int(t["rounds_used"]) < 0 and abs(total - table[n - 1, 3]) <= SETTLED)
    totals = dataclasses.replace(totals, rows_written=n)
    return OfferPathRows(totals, table[:n, 0].copy(), table[:n, 1].copy(),
                         table[:n, 2].copy(), table[:n, 3].copy(),
                         None if days is None else float(days), bool(complete))
