"""Value conversion, shared by the Python functions and the command line.

Python values (numbers, booleans, choice strings, None, lists, NumPy arrays, pandas
Series) and text cells of a CSV file become the doubles the library's table takes:
a choice is its index, a boolean 0 or 1, an absent value the table's code for it.
Nothing here checks a domain: a value that is not a number at all is reported, every
number goes to the library, which validates it.
"""

from __future__ import annotations

import sys
from typing import Any, List, Optional, Sequence, Tuple

import numpy as np

from ._spec import ArgSpec, FunctionSpec, Kind

EXACT_INT = 2**53  # every integer up to this passes through a double exactly
PLAIN = frozenset({float, int, bool})
_TRUE = frozenset({"1", "true", "yes", "y", "t"})
_FALSE = frozenset({"0", "false", "no", "n", "f"})


class Invalid(Exception):
    """A value is not a number the library could take: argument index, the value, the
    reason, and for an element of an array its position."""

    def __init__(self, index: int, value: Any, reason: str,
                 position: Optional[Tuple[int, ...]] = None) -> None:
        super().__init__(index, value, reason, position)
        self.index, self.value, self.reason, self.position = index, value, reason, position


def is_dask(x: Any) -> bool:
    mod = sys.modules.get("dask.array")
    return mod is not None and isinstance(x, mod.Array)


def is_dask_series(x: Any) -> bool:
    mod = sys.modules.get("dask.dataframe")
    return mod is not None and isinstance(x, mod.Series)


def is_series(x: Any) -> bool:
    mod = sys.modules.get("pandas")
    return mod is not None and isinstance(x, mod.Series)


def fmt(value: Any) -> str:
    """A value as the error messages show it."""
    if isinstance(value, (float, np.floating)):
        return repr(float(value))
    if isinstance(value, (bool, np.bool_)):
        return repr(bool(value))
    if isinstance(value, (int, np.integer)):
        return repr(int(value))
    return repr(value)


def _choices_text(arg: ArgSpec) -> str:
    return "not one of " + ", ".join(map(repr, arg.choices))


def _element(spec: FunctionSpec, j: int, v: Any, position: Tuple[int, ...]) -> float:
    """One element of an object or text array -> its double."""
    arg = spec.args[j]
    if v is None:
        absent = spec.none_double(arg)
        if absent is None:
            raise Invalid(j, v, "a number is required", position)
        return absent
    if isinstance(v, bytes):
        raise Invalid(j, v, "a number is required", position)
    if isinstance(v, str):
        if arg.kind == Kind.CHOICE:
            for k, c in enumerate(arg.choices):
                if v.lower() == c.lower():
                    return float(k)
            raise Invalid(j, v, _choices_text(arg), position)
        raise Invalid(j, v, "a number is required", position)
    if isinstance(v, (bool, np.bool_)):
        return float(v)
    try:
        return float(v)
    except (TypeError, ValueError):
        raise Invalid(j, v, "a number is required", position) from None


def _object_array(spec: FunctionSpec, j: int, arr: np.ndarray) -> np.ndarray:
    flat = np.empty(arr.size, dtype=np.float64)
    for k, v in enumerate(arr.ravel().tolist()):  # tolist: Python objects, not np.str_
        position = tuple(int(i) for i in np.unravel_index(k, arr.shape))
        flat[k] = _element(spec, j, v, position)
    return flat.reshape(arr.shape)


def _check_exact_int(j: int, v: int) -> None:
    """The library takes every argument as a double (cto_call, cto_call_strided): an
    integer that a double cannot hold exactly would silently become another number."""
    if int(float(v)) != v:
        raise Invalid(j, v, "an integer above 2**53 that a double cannot represent exactly; "
                            "the library's table interface takes doubles")


def _one(spec: FunctionSpec, j: int, v: Any) -> Any:
    if v is None or isinstance(v, str):
        return _element(spec, j, v, ())
    if isinstance(v, (bool, np.bool_)):
        return float(v)
    if isinstance(v, (int, np.integer)):
        if abs(int(v)) > EXACT_INT:
            _check_exact_int(j, int(v))
        return v
    if isinstance(v, (list, tuple)):
        arr = np.asarray(v)
        # NumPy turns [0.9, "x"] into texts ("0.9", "x"): keep the elements as given
        v = np.asarray(v, dtype=object) if arr.dtype.kind in "US" else arr
    if isinstance(v, np.ndarray):
        if v.dtype.kind in "USO":
            return _object_array(spec, j, v)
        if v.dtype.kind in "iu" and v.size:
            big = np.abs(v.astype(np.float64)) > EXACT_INT
            if big.any():
                for w in v[big].ravel().tolist():
                    _check_exact_int(j, int(w))
    return v


def convert(spec: FunctionSpec, values: Sequence[Any]) -> Tuple[List[Any], Any, bool]:
    """Arguments -> (values for the ufunc, pandas index or None, all scalar)."""
    out: List[Any] = []
    index = None
    scalar = True
    for j, v in enumerate(values):
        if is_series(v):
            if index is None:
                index = v.index
            elif not index.equals(v.index):
                raise ValueError(f"{spec.name}: pandas Series arguments must share one index")
            v = v.to_numpy()
        v = _one(spec, j, v)
        if np.ndim(v) != 0:
            scalar = False
        out.append(v)
    return out, index, scalar


class CellError(Exception):
    """A text cell is not a value of its argument (the message says what is expected)."""


def parse_cell(spec: FunctionSpec, arg: ArgSpec, text: str, decimal: str = ".") -> float:
    """One text cell of the command line's input -> the double the library takes
    (conversion only, no domain checks).  An empty cell is the caller's business."""
    t = text.strip()
    low = t.lower()
    if arg.kind == Kind.BOOL:
        if low in _TRUE:
            return 1.0
        if low in _FALSE:
            return 0.0
        raise CellError("expected TRUE/FALSE or 1/0")
    if decimal != ".":
        t = t.replace(decimal, ".")
    if arg.kind == Kind.CHOICE and not is_number(t):
        for k, c in enumerate(arg.choices):
            if low == c.lower():
                return float(k)
        raise CellError("expected one of " + ", ".join(arg.choices))
    if low == "none":
        absent = spec.none_double(arg)
        if absent is None:
            raise CellError("a number is required")
        return absent
    try:
        return float(t)
    except ValueError:
        raise CellError("not a number") from None


def is_number(t: str) -> bool:
    try:
        float(t)
    except ValueError:
        return False
    return True
