"""Uncertain inputs of share_range and share_swing: distribution objects and the
conversion of each argument to the library's (kind, low, mode, high).

An argument is a number (fixed), a tuple ``(low, high)`` (uniform), a tuple
``(low, mode, high)`` (PERT by default, or triangular with ``shape="triangular"``), or a
:class:`Distribution` from :func:`uniform`, :func:`triangular` or :func:`pert`.  Nothing
here checks a domain: every number goes to the library (``cto_share_range``), which
validates it and names the first invalid input.
"""

from __future__ import annotations

import dataclasses
from typing import Any, List, Optional, Sequence, Tuple, Union

from . import _structs
from ._convert import Invalid, _one
from ._spec import FunctionSpec

#: shape keyword -> the library's kind (CTO_RANGE_* of the public header)
KINDS = {
    "uniform": _structs.RANGE_UNIFORM,
    "triangular": _structs.RANGE_TRIANGULAR,
    "pert": _structs.RANGE_PERT,
}
SHAPES = ("pert", "triangular")


@dataclasses.dataclass(frozen=True)
class Distribution:
    """An uncertain input: ``shape`` ("uniform", "triangular" or "pert") on [low, high]
    with its most likely value ``mode`` (None for uniform)."""

    shape: str
    low: float
    mode: Optional[float]
    high: float

    def __repr__(self) -> str:
        inner = [self.low] + ([] if self.mode is None else [self.mode]) + [self.high]
        return f"{self.shape}({', '.join(repr(v) for v in inner)})"


#: What share_range and share_swing take for each input: a number (fixed), (low, high),
#: (low, mode, high) or a Distribution (the type the stub gives every input).
Input = Union[float, int, bool, None, Tuple[float, float], Tuple[float, float, float],
              List[float], Distribution]


def uniform(low: float, high: float) -> Distribution:
    """Every value in [low, high] equally likely."""
    return Distribution("uniform", low, None, high)


def triangular(low: float, mode: float, high: float) -> Distribution:
    """The triangle on [low, high] with its peak at ``mode`` (e.g. Vose 2008)."""
    return Distribution("triangular", low, mode, high)


def pert(low: float, mode: float, high: float) -> Distribution:
    """Beta-PERT on [low, high] with most likely value ``mode`` (weight 4 on the mode;
    Malcolm, Roseboom, Clark & Fazar 1959; Vose 2008)."""
    return Distribution("pert", low, mode, high)


def _number(j: int, given: Any, v: Any) -> float:
    if isinstance(v, (str, bytes)) or v is None:
        raise Invalid(j, given, "a number is required at each end of a range")
    try:
        return float(v)
    except (TypeError, ValueError):
        raise Invalid(j, given, "a number is required at each end of a range") from None


def as_distribution(j: int, value: Any, shape: str) -> Optional[Distribution]:
    """The argument as a Distribution, or None when it is a single value."""
    if isinstance(value, Distribution):
        return value
    if isinstance(value, (tuple, list)):
        if len(value) == 2:
            return uniform(*(_number(j, value, v) for v in value))
        if len(value) == 3:
            lo, mode, hi = (_number(j, value, v) for v in value)
            return Distribution(shape, lo, mode, hi)
        raise Invalid(j, value, "a range is (low, high) or (low, mode, high)")
    return None


def check_shape(j: int, shape: Any) -> str:
    """The shape keyword in lower case; an unknown one is invalid input."""
    text = shape.lower() if isinstance(shape, str) else None
    if text not in SHAPES:
        raise Invalid(j, shape, "shape is 'pert' or 'triangular'")
    return text  # type: ignore[return-value]


def library_args(spec: FunctionSpec, values: Sequence[Any],
                 shape: str) -> Tuple[List[Tuple[int, float, float, float]], List[Any]]:
    """(kind, low, mode, high) per input for the library, and each argument as given
    (a Distribution for a range) for messages and results."""
    out: List[Tuple[int, float, float, float]] = []
    shown: List[Any] = []
    for j, value in enumerate(values):
        dist = as_distribution(j, value, shape)
        if dist is None:
            v = _one(spec, j, value)
            try:
                x = float(v)
            except (TypeError, ValueError):
                raise Invalid(j, value, "one number or a range (a tuple or a distribution)"
                              ) from None
            out.append((_structs.RANGE_FIXED, x, x, x))
            shown.append(value)
            continue
        kind = KINDS.get(dist.shape)
        if kind is None:
            raise Invalid(j, value, "an unknown shape (uniform, triangular or pert)")
        mode = dist.low if dist.mode is None else dist.mode
        out.append((kind, float(dist.low), float(mode), float(dist.high)))
        shown.append(dist)
    return out, shown
