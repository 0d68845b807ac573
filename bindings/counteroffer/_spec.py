"""The library's function table as Python objects: FunctionSpec and ArgSpec.

One FunctionSpec per row of ``_core.catalogue()`` (the C table, ``cto_function_at``), in
table order.  Argument kinds and statuses are the header's constants, exported by
``_core`` under their C names (``CTO_ARG_UNIT`` is ``_core.ARG_UNIT``); nothing here
numbers them again.
"""

from __future__ import annotations

import dataclasses
import functools
import math
from typing import Any, Dict, List, Optional, Tuple

from . import _core
from ._definitions import definitions
from ._present import absent_names


class Kind:
    """Argument kinds (CTO_ARG_* of the public header)."""

    REAL = _core.ARG_REAL
    UNIT = _core.ARG_UNIT
    NONNEG = _core.ARG_NONNEG
    POSITIVE = _core.ARG_POSITIVE
    BOOL = _core.ARG_BOOL
    COUNT = _core.ARG_COUNT
    CHOICE = _core.ARG_CHOICE
    OPTIONAL = _core.ARG_OPTIONAL


class Status:
    """Status codes (CTO_OK, CTO_E_* of the public header)."""

    OK = _core.OK
    INVALID = _core.E_INVALID
    NO_DEAL = _core.E_NO_DEAL
    INDETERMINATE = _core.E_INDETERMINATE
    NO_CONVERGENCE = _core.E_NO_CONVERGENCE
    INTERNAL = _core.E_INTERNAL


#: status code -> the library's short name ("ok", "invalid", "no_deal", ...)
STATUS_NAMES: Dict[int, str] = {code: _core.status_name(code) for code in range(_core.REPORT_SLOTS)}


@dataclasses.dataclass(frozen=True)
class ArgSpec:
    name: str
    label: str
    help: str
    kind: int
    has_default: bool
    default: float
    min_count: int
    choices: Tuple[str, ...]
    #: (low, high) from cto_arg_plausible_range: values outside are valid but look like a
    #: typing slip (a rate typed as 8 for 8%); None: the argument has no such range
    plausible: Optional[Tuple[float, float]] = None

    @property
    def py_default(self) -> Any:
        """The Python default shown in the signature (from the table's double)."""
        if not self.has_default:
            raise AttributeError(self.name)
        if self.kind == Kind.BOOL:
            return bool(self.default)
        if self.kind == Kind.CHOICE:
            return self.choices[int(self.default)]
        if self.kind == Kind.OPTIONAL and self.default == -math.inf:
            return None
        if self.kind == Kind.COUNT or float(self.default).is_integer():
            return int(self.default)
        return float(self.default)


@dataclasses.dataclass(frozen=True)
class FunctionSpec:
    id: int
    name: str
    calc_name: str
    summary: str
    formula: str
    source: str
    statuses: str
    args: Tuple[ArgSpec, ...]
    outputs: Tuple[Tuple[str, str], ...]
    # defaults that mean "absent" beyond the table's double: name -> (None, the double)
    overrides: Dict[str, Any]
    #: per output, the words of its codes (cto_output_word), empty for a number
    output_words: Tuple[Tuple[str, ...], ...] = ()
    #: per output, its C type in the definition: "double", "int" or "int64"
    output_types: Tuple[str, ...] = ()

    def default(self, arg: ArgSpec) -> Any:
        """The argument's Python default (as in the signature)."""
        if arg.name in self.overrides:
            return self.overrides[arg.name][0]
        return arg.py_default

    def default_double(self, arg: ArgSpec) -> float:
        """The double the library takes for the argument's default."""
        if arg.name in self.overrides:
            return float(self.overrides[arg.name][1])
        return float(arg.default)

    def none_double(self, arg: ArgSpec) -> Optional[float]:
        """The double that None stands for in this argument, or None if it has none."""
        if arg.name in self.overrides and self.overrides[arg.name][0] is None:
            return float(self.overrides[arg.name][1])
        if arg.kind == Kind.OPTIONAL:
            return -math.inf
        return None

    @functools.cached_property
    def plausible_args(self) -> Tuple[int, ...]:
        """Indices of the arguments that have a plausible range."""
        return tuple(j for j, a in enumerate(self.args) if a.plausible is not None)

    @property
    def output_names(self) -> List[str]:
        return [name for name, _help in self.outputs]

    def words(self, k: int) -> Tuple[str, ...]:
        """The words of output k's codes, empty when it is a number."""
        return self.output_words[k] if k < len(self.output_words) else ()

    def is_count(self, k: int) -> bool:
        """Output k is a whole number (an int field in the C outcome), not a code."""
        return (k < len(self.output_types) and self.output_types[k] in ("int", "int64")
                and not self.words(k))


def _arg(fid: int, j: int, a: Dict[str, Any]) -> ArgSpec:
    found = _core.arg_plausible_range(fid, j)
    return ArgSpec(a["name"], a["label"], a["help"], a["kind"], a["has_default"], a["default"],
                   a["min_count"], tuple(a["choices"]),
                   None if found is None else (float(found[0]), float(found[1])))


def _output_types(name: str, n: int) -> Tuple[str, ...]:
    outs = definitions().get(name, {}).get("outputs", [])
    return tuple(str(o.get("type", "double")) for o in outs) if len(outs) == n else ()


def load_specs() -> List[FunctionSpec]:
    """The library's table, one FunctionSpec per row, in order."""
    specs = []
    for row in _core.catalogue():
        args = tuple(_arg(row["id"], j, a) for j, a in enumerate(row["args"]))
        absent = absent_names(row["name"])
        overrides = {a.name: (None, a.default) for a in args if a.name in absent}
        specs.append(
            FunctionSpec(
                row["id"], row["name"], row["calc_name"], row["summary"], row["formula"],
                row["source"], row["statuses"], args,
                tuple((o["name"], o["help"]) for o in row["outputs"]),
                overrides,
                tuple(tuple(o["words"]) for o in row["outputs"]),
                _output_types(row["name"], len(row["outputs"])),
            )
        )
    return specs
