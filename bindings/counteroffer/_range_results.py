"""Result objects of share_range and share_swing: frozen dataclasses with a readable
repr and ``to_frame()`` (pandas).  The numbers are the library's, as it reports them."""

from __future__ import annotations

import dataclasses
import math
from typing import Any, Dict, Tuple


@dataclasses.dataclass(frozen=True)
class Estimate:
    """One estimate with its standard error (from the replicates), 95% half-width
    (t_{R-1, 0.975} SE) and the significant digits that half-width supports."""

    value: float
    se: float
    half_width: float
    digits: int

    def __str__(self) -> str:
        if self.half_width == 0:  # every draw equal: the value as it is
            return f"{self.value!r} ± 0"
        return f"{_shown(self.value, self.digits)} ± {_shown(self.half_width, 2)}"


def _shown(x: float, digits: int) -> str:
    """x to `digits` significant digits (1 to 15), without an exponent for money-sized
    numbers (1e-4 to 1e15), thousands separated."""
    digits = max(1, min(digits, 15))
    if x == 0 or not math.isfinite(x) or not 1e-4 <= abs(x) < 1e15:
        return f"{x:.{digits}g}"
    places = max(0, digits - 1 - math.floor(math.log10(abs(x))))
    return f"{x:,.{places}f}"


def estimate(d: Dict[str, Any]) -> Estimate:
    return Estimate(float(d["value"]), float(d["se"]), float(d["half_width"]), int(d["digits"]))


@dataclasses.dataclass(frozen=True)
class RangeResult:
    """Result of share_range: quantiles of own and other's share (money, in the
    surplus's unit) at ``probabilities``, means, the probabilities that a deal is
    rational and that each walk-away value binds, the fraction of draws at an edge case,
    the sample used, the status ("ok" or "precision not reached"), the generator's spec
    version and the library's reason in words (``reason``: "ok", "ok, but <a range end
    that looks like a typing slip>", or what precision was not reached and what to
    change).  Model estimates under stated assumptions, not advice."""

    probabilities: Tuple[float, ...]
    own: Tuple[Estimate, ...]
    other: Tuple[Estimate, ...]
    own_mean: Estimate
    other_mean: Estimate
    p_rational: Estimate
    p_own_binds: Estimate
    p_other_binds: Estimate
    edge_fraction: Estimate
    points_per_replicate: int
    replicates: int
    dimension: int
    spec_version: int
    status: str
    precision_reached: bool
    inputs: Tuple[Tuple[str, Any], ...] = dataclasses.field(default=(), repr=False)
    reason: str = dataclasses.field(default="ok", repr=False)

    def quantile(self, p: float) -> Estimate:
        """Own share's estimate at one of the requested probabilities."""
        for q, e in zip(self.probabilities, self.own):
            if q == p:
                return e
        raise KeyError(f"probability {p!r} was not requested (have {self.probabilities})")

    def to_frame(self) -> Any:
        """A pandas DataFrame, a row per probability: each share's quantile, its standard
        error, 95% half-width and digits reached."""
        import pandas as pd  # type: ignore[import-untyped,unused-ignore]

        data: Dict[str, Any] = {}
        for side, ests in (("own", self.own), ("other", self.other)):
            data[side] = [e.value for e in ests]
            data[f"{side}_se"] = [e.se for e in ests]
            data[f"{side}_half_width"] = [e.half_width for e in ests]
            data[f"{side}_digits"] = [e.digits for e in ests]
        return pd.DataFrame(data, index=pd.Index(list(self.probabilities), name="probability"))

    def __repr__(self) -> str:
        lines = [f"RangeResult(status={self.status!r}, {self.replicates} x "
                 f"{self.points_per_replicate} points, {self.dimension} uncertain inputs, "
                 f"spec {self.spec_version})"]
        lines.append(f"  {'p':<6} {'own share (± 95%)':<26} other share (± 95%)")
        for p, o, t in zip(self.probabilities, self.own, self.other):
            lines.append(f"  {p:<6g} {str(o):<26} {t}")
        lines.append(f"  {'mean':<6} {str(self.own_mean):<26} {self.other_mean}")
        lines.append(f"  P(deal rational) {self.p_rational}; P(own walk-away binds) "
                     f"{self.p_own_binds}; P(other's binds) {self.p_other_binds}; "
                     f"edge-case draws {self.edge_fraction}")
        return "\n".join(lines)


@dataclasses.dataclass(frozen=True)
class SwingRow:
    """One input of the swing: own share with it at its low and at its high, the others
    at their modes; the statuses at each end ("ok" or "no_deal")."""

    input: str
    low: float
    high: float
    at_low: float
    at_high: float
    swing: float
    status_low: str
    status_high: str


@dataclasses.dataclass(frozen=True)
class SwingResult:
    """Result of share_swing: own share with every input at its mode (``base``) and one
    row per uncertain input, largest swing first (a tornado chart).  One-at-a-time: it
    ignores interactions, which share_range's quantiles include.  ``reason``: the
    library's reason in words ("ok", or "ok, but <a range end that looks like a typing
    slip>")."""

    base: float
    base_status: str
    rows: Tuple[SwingRow, ...]
    reason: str = dataclasses.field(default="ok", repr=False)

    def to_frame(self) -> Any:
        """A pandas DataFrame, a row per uncertain input (its name as the index), largest
        swing first."""
        import pandas as pd  # type: ignore[import-untyped,unused-ignore]

        cols = [f.name for f in dataclasses.fields(SwingRow)][1:]
        return pd.DataFrame([[getattr(r, c) for c in cols] for r in self.rows], columns=cols,
                            index=pd.Index([r.input for r in self.rows], name="input"))

    def __repr__(self) -> str:
        lines = [f"SwingResult(base={self.base!r}, {len(self.rows)} uncertain inputs)"]
        for r in self.rows:
            lines.append(f"  {r.input:<16} {r.at_low:.6g} at {r.low:g} .. {r.at_high:.6g} at "
                         f"{r.high:g}  (swing {r.swing:.6g})")
        return "\n".join(lines)
