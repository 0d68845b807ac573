"""Where a valid argument value looks like a typo: the plausible range of an argument.

The ranges belong to the library's one definition of each function and come through
``cto_arg_plausible_range`` (``_core.arg_plausible_range``).  A library built before
that entry point existed has no ranges; for it this adapter uses the interim thresholds
of issue 14 (a rate above 1 = 100% a year, more than 3650 days between offers, a
breakdown probability above 0.5 a round), so the warning works the same either way.
"""

from __future__ import annotations

from typing import Dict, Optional, Tuple

from . import _core

#: interim thresholds while the library has no plausible ranges (issue 14, point 2)
_INTERIM: Dict[str, Tuple[float, float]] = {
    "rate": (0.0, 1.0),
    "days": (0.0, 3650.0),
    "breakdown_prob": (0.0, 0.5),
}


def _interim(arg_name: str) -> Optional[Tuple[float, float]]:
    if arg_name.endswith("_rate"):
        return _INTERIM["rate"]
    return _INTERIM.get(arg_name)


def plausible_range(function_id: int, arg_index: int,
                    arg_name: str) -> Optional[Tuple[float, float]]:
    """(low, high) of argument `arg_index` of function `function_id`, or None."""
    if _core.HAS_PLAUSIBLE_RANGES:
        found = _core.arg_plausible_range(function_id, arg_index)
        return None if found is None else (float(found[0]), float(found[1]))
    return _interim(arg_name)
