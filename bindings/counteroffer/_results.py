"""Result objects of multi-output functions: a frozen dataclass per function for
scalar calls, ArrayResult (a mapping of arrays) for array calls."""

from __future__ import annotations

import dataclasses
from collections.abc import Mapping
from typing import Any, Dict, Iterator, List, Optional, Tuple

import numpy as np

from . import _present
from ._spec import FunctionSpec


class ArrayResult(Mapping):  # type: ignore[type-arg]
    """Results of a multi-output function over arrays: output name -> array.

    Numbers are float64 arrays; which walk-away value binds is an array of words
    ("none", "ours", "theirs", "both"; None where undefined) and whether a deal is
    rational a bool array, as in scalar results.  ``to_records()`` gives a NumPy record
    array.
    """

    __slots__ = ("_data",)

    def __init__(self, data: Dict[str, Any]) -> None:
        self._data = dict(data)

    def __getitem__(self, key: str) -> Any:
        return self._data[key]

    def __iter__(self) -> Iterator[str]:
        return iter(self._data)

    def __len__(self) -> int:
        return len(self._data)

    def __getattr__(self, key: str) -> Any:
        try:
            return self._data[key]
        except KeyError:
            raise AttributeError(key) from None

    def to_records(self) -> np.recarray:
        """The outputs as one record array with a field per output."""
        arrays = [np.asarray(v) for v in self._data.values()]
        return np.rec.fromarrays(arrays, names=",".join(self._data))  # type: ignore[call-overload]

    def __repr__(self) -> str:
        inner = ", ".join(f"{k}={v!r}" for k, v in self._data.items())
        return f"ArrayResult({inner})"


def result_class(spec: FunctionSpec) -> Optional[type]:
    """The frozen dataclass of a scalar call's result, or None for one output."""
    if len(spec.outputs) < 2:
        return None
    fields: List[Tuple[str, Any]] = []
    for k, name in enumerate(spec.output_names):
        words = spec.words(k)
        if spec.is_count(k):
            fields.append((name, Optional[int]))
        elif not words:
            fields.append((name, float))
        elif _present.is_flag(words):
            fields.append((name, bool))
        else:
            fields.append((name, Optional[str]))
    cls_name = "".join(p.capitalize() for p in spec.name.split("_")) + "Result"
    doc = f"Result of {spec.name}() for scalar arguments.\n\n" + "\n".join(
        f"{name}: {help_}" for name, help_ in spec.outputs
    )
    cls = dataclasses.make_dataclass(cls_name, fields, frozen=True, namespace={"__doc__": doc})
    cls.__module__ = "counteroffer"
    return cls
