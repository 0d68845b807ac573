"""How Python shows what a double cannot say: absent defaults, coded and 0/1 outputs.

Everything here is about presentation, never about what is valid.  The codes are the
header's constants (``CTO_BINDS_*``, exported by ``_core``); the words are the ones every
surface uses (Python scalars and arrays, DataFrames, the command line, Calc).
"""

from __future__ import annotations

import sys
from typing import Any, Dict, Optional, Tuple

import numpy as np

from . import _core

#: Python defaults the table's double cannot express: name -> (Python default, the
#: double passed to the library for it).  votes_needed=None means a simple majority,
#: which the C table encodes as 0.
# TODO(lib): the one definition marks such defaults ("absent"); read it from the table
# once cto_arg_info carries it, and drop this entry.
DEFAULT_OVERRIDES: Dict[str, Dict[str, Tuple[Any, float]]] = {
    "majority_share": {"votes_needed": (None, 0.0)},
}

#: Coded outputs: name -> {code: word}.  "ours" is own's walk-away value, "theirs" the
#: other side's.
OUTPUT_CODES: Dict[str, Dict[int, str]] = {
    "binding": {
        _core.BINDS_NONE: "none",
        _core.BINDS_OWN: "ours",
        _core.BINDS_OTHER: "theirs",
        _core.BINDS_BOTH: "both",
    },
}

#: Outputs that are 0/1 flags, shown as bool.
OUTPUT_BOOL = frozenset({"rational"})


def legend(name: str) -> Optional[str]:
    """One line on how output `name` is shown, or None for a plain number."""
    if name in OUTPUT_CODES:
        words = ", ".join(f"{w!r} ({code})" for code, w in sorted(OUTPUT_CODES[name].items()))
        return (f"{name} is a word: {words}; None where the model leaves it undefined "
                "(invalid input, many equilibria)")
    if name in OUTPUT_BOOL:
        return f"{name} is a bool (False where the model leaves it undefined)"
    return None


def scalar(name: str, value: float) -> Any:
    """One output of a scalar call as Python shows it."""
    if name in OUTPUT_CODES:
        if value != value or value != int(value):  # NaN: undefined
            return None
        return OUTPUT_CODES[name].get(int(value))
    if name in OUTPUT_BOOL:
        return bool(value == 1.0)
    return float(value)


def _numpy(name: str, codes: np.ndarray) -> np.ndarray:
    words = OUTPUT_CODES.get(name)
    if words is None:
        return np.asarray(codes == 1.0)
    n = max(words) + 1
    table = np.array([words.get(k) for k in range(n)] + [None], dtype=object)
    codes = np.asarray(codes)
    ok = (codes >= 0) & (codes < n) & (codes == np.floor(codes))
    index = np.where(ok, np.nan_to_num(codes, nan=n), n).astype(np.intp)
    return table[index]


def array(name: str, values: Any) -> Any:
    """One output of an array call as Python shows it: words (an object array, None
    where undefined) for coded outputs, bool for flags, the values unchanged otherwise.
    NumPy arrays, dask arrays and xarray DataArrays keep their type."""
    if name not in OUTPUT_CODES and name not in OUTPUT_BOOL:
        return values
    dtype = object if name in OUTPUT_CODES else bool
    xr = sys.modules.get("xarray")
    if xr is not None and isinstance(values, xr.DataArray):
        return values.copy(data=array(name, values.data))
    da = sys.modules.get("dask.array")
    if da is not None and isinstance(values, da.Array):
        return values.map_blocks(lambda block: _numpy(name, block), dtype=dtype)
    return _numpy(name, values)
