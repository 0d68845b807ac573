"""How Python shows what a double cannot say: absent defaults and coded outputs.

Everything here is about presentation, never about what is valid.  A coded output's
words come from the library (``cto_output_word``, in ``FunctionSpec.output_words``):
solve's ``binding`` is "none", "ours", "theirs" or "both" on every surface (Python
scalars and arrays, DataFrames, the command line, Calc).  An output whose words are
"no" and "yes" is a flag, shown in Python as a bool (the command line writes the word).
"""

from __future__ import annotations

import math
import sys
from typing import Any, FrozenSet, Optional, Sequence

import numpy as np

from ._definitions import definitions

def absent_names(function: str) -> FrozenSet[str]:
    """Arguments whose default means "absent" beyond what the table's double says, from
    the function's definition: majority_share's votes_needed = None is a simple majority
    (the table's default 0).  An optional value's absence (-infinity) needs no entry:
    its kind says it."""
    return frozenset(a["name"] for a in definitions().get(function, {}).get("args", [])
                     if a.get("absent") and a.get("kind") != "optional")


FLAG_WORDS = ("no", "yes")


def is_flag(words: Sequence[str]) -> bool:
    return tuple(words) == FLAG_WORDS


def legend(name: str, words: Sequence[str], count: bool = False) -> Optional[str]:
    """One line on how output `name` is shown in Python, or None for a plain number."""
    if count:
        return (f"{name} is a whole number: an int in a scalar result (None where "
                "undefined), float64 in arrays")
    if not words:
        return None
    if is_flag(words):
        return f"{name} is a bool (False where the model leaves it undefined)"
    shown = ", ".join(f"{w!r} ({code})" for code, w in enumerate(words))
    return (f"{name} is a word: {shown}; None where the model leaves it undefined "
            "(invalid input, many equilibria)")


def _word(words: Sequence[str], value: float) -> Optional[str]:
    if value != value or value != int(value) or not 0 <= value < len(words):
        return None  # NaN: undefined
    return words[int(value)]


def whole(value: float) -> Optional[int]:
    """A whole-number output (a count of rounds) as an int, None where undefined."""
    if value != value or value in (math.inf, -math.inf) or value != int(value):
        return None
    return int(value)


def scalar(words: Sequence[str], value: float, count: bool = False) -> Any:
    """One output of a scalar call as Python shows it."""
    if count:
        return whole(value)
    if not words:
        return float(value)
    if is_flag(words):
        return bool(value == 1.0)
    return _word(words, value)


def cell(words: Sequence[str], value: float) -> str:
    """A coded output as the command line writes it: its word, empty where undefined."""
    return _word(words, value) or ""


def _numpy(words: Sequence[str], codes: Any) -> np.ndarray:
    codes = np.asarray(codes)
    if is_flag(words):
        return np.asarray(codes == 1.0)
    n = len(words)
    table = np.array(list(words) + [None], dtype=object)
    ok = (codes >= 0) & (codes < n) & (codes == np.floor(codes))
    index = np.where(ok, np.nan_to_num(codes, nan=n), n).astype(np.intp)
    return table[index]


def array(words: Sequence[str], values: Any) -> Any:
    """One output of an array call as Python shows it: words (an object array, None
    where undefined) for a coded output, bool for a flag, the values unchanged for a
    number.  NumPy arrays, dask arrays and xarray DataArrays keep their type."""
    if not words:
        return values
    words = tuple(words)
    xr = sys.modules.get("xarray")
    if xr is not None and isinstance(values, xr.DataArray):
        return values.copy(data=array(words, values.data))
    da = sys.modules.get("dask.array")
    if da is not None and isinstance(values, da.Array):
        dtype = bool if is_flag(words) else object
        return values.map_blocks(lambda block: _numpy(words, block), dtype=dtype)
    return _numpy(words, values)


def dtype(words: Sequence[str]) -> Any:
    """The NumPy dtype an output has in Python arrays."""
    if not words:
        return np.float64
    return bool if is_flag(words) else object
