"""The function catalogue, read once from its definitions in lib/functions/.

Each catalogue function is defined once, in lib/functions/<name>.toml (arguments shared by
several functions in lib/functions/arguments.toml).  This module reads and checks those
files; gen_core.py writes the C++ that the library is built from, gen_docs.py the tables
of the README files, and the Python package and the tests read the same definitions.

Requires Python 3.11 (tomllib).
"""

from __future__ import annotations

import dataclasses
import math
import pathlib
import tomllib
from typing import Any, Dict, List, Optional, Tuple

ROOT = pathlib.Path(__file__).resolve().parents[2]
FUNCTIONS_DIR = ROOT / "lib" / "functions"

#: Argument kinds, in the order of the CTO_ARG_* constants of the public header.
KINDS = ("real", "unit", "nonneg", "positive", "bool", "count", "choice", "optional")
#: The C type of a named-function parameter of each kind.
C_TYPES = {"bool": "int", "count": "int64_t", "choice": "int"}

_FUNCTION_KEYS = {"id", "name", "calc_name", "summary", "formula", "source", "statuses",
                  "args", "arg", "output", "example", "model", "adapter", "block_kernel",
                  "outcome", "reference", "no_deal_nan", "named"}
_ARG_KEYS = {"name", "label", "help", "kind", "default", "min", "choices", "plausible", "slip", "rule"}


class DefinitionError(ValueError):
    """A definition file is malformed (the message names the file and the field)."""


@dataclasses.dataclass(frozen=True)
class Arg:
    name: str
    label: str
    help: str
    kind: str
    has_default: bool
    default: float  # as the table's double: bool 0/1, choice index, -inf for absent
    min_count: int
    choices: Tuple[str, ...]
    plausible: Optional[Tuple[float, float]]
    slip: str  # what a value outside the plausible range suggests
    rule: str  # a rule joining it to other arguments, for the reason when it breaks it
    absent: bool  # the default means "absent" (an optional value: -inf; a count: 0)

    @property
    def kind_index(self) -> int:
        return KINDS.index(self.kind)

    @property
    def c_type(self) -> str:
        return C_TYPES.get(self.kind, "double")


@dataclasses.dataclass(frozen=True)
class Output:
    name: str
    help: str
    words: Tuple[str, ...] = ()  # a coded output: the word for code 0, 1, ...
    c_type: str = "double"  # its field's type in a struct outcome: double, int or int64


@dataclasses.dataclass(frozen=True)
class Function:
    id: int
    name: str
    calc_name: str
    summary: str
    formula: str
    source: str
    statuses: str
    args: Tuple[Arg, ...]
    outputs: Tuple[Output, ...]
    model: str  # the core function cto::core::<model>
    # A struct outcome: (public C struct, core struct); its fields are the outputs, by name.
    outcome: Optional[Tuple[str, str]]
    # A reference table in another layout, checked by the function's own tests (a path
    # under tests/reference/); None: tests/reference/<name>.csv in the common layout.
    reference: Optional[str]
    # The result has no value without a deal (e.g. the expected round of agreement): NaN
    # with CTO_E_NO_DEAL instead of own's no-deal payoff.
    no_deal_nan: bool
    # The named C functions: (C name without cto_, number of leading arguments it takes;
    # the rest take their defaults).  Default: one, cto_<name> with every argument.  A
    # C function is never changed once released, so an appended argument gets a new one.
    named: Tuple[Tuple[str, int], ...]
    adapter: bool  # table thunk and named C entry are hand-written (struct interfaces)
    block_kernel: Optional[str]
    example_scenario: Optional[str]
    example_python: Optional[str]
    path: pathlib.Path


VALUE_OUTPUT = Output("value", "the function's result")


def _fail(path: pathlib.Path, what: str) -> DefinitionError:
    return DefinitionError(f"{path.relative_to(ROOT)}: {what}")


def _str(d: Dict[str, Any], key: str, path: pathlib.Path) -> str:
    v = d.get(key)
    if not isinstance(v, str) or not v:
        raise _fail(path, f"'{key}' must be a non-empty string")
    return v


def _arg(name: str, d: Dict[str, Any], path: pathlib.Path) -> Arg:
    unknown = set(d) - _ARG_KEYS
    if unknown:
        raise _fail(path, f"argument {name}: unknown field(s) {sorted(unknown)}")
    kind = _str(d, "kind", path)
    if kind not in KINDS:
        raise _fail(path, f"argument {name}: kind {kind!r} is not one of {KINDS}")
    choices = tuple(d.get("choices", ()))
    if (kind == "choice") != bool(choices):
        raise _fail(path, f"argument {name}: 'choices' goes with kind 'choice' only")
    has_default = "default" in d
    default = 0.0
    if has_default:
        dv = d["default"]
        if kind == "bool":
            if not isinstance(dv, bool):
                raise _fail(path, f"argument {name}: a bool default must be true or false")
            default = 1.0 if dv else 0.0
        elif kind == "choice":
            if dv not in choices:
                raise _fail(path, f"argument {name}: default {dv!r} is not a choice")
            default = float(choices.index(dv))
        elif kind == "optional" and dv == "absent":
            default = -math.inf
        elif kind == "count" and dv == "absent":
            default = 0.0
        elif isinstance(dv, (int, float)) and not isinstance(dv, bool):
            default = float(dv)
        else:
            raise _fail(path, f"argument {name}: default {dv!r} does not fit kind {kind}")
    if ("min" in d) != (kind == "count"):
        raise _fail(path, f"argument {name}: 'min' goes with (and is needed by) kind 'count'")
    plausible = d.get("plausible")
    if plausible is not None:
        if (not isinstance(plausible, list) or len(plausible) != 2
                or not all(isinstance(x, (int, float)) for x in plausible)
                or not plausible[0] <= plausible[1]):
            raise _fail(path, f"argument {name}: 'plausible' must be [low, high]")
        plausible = (float(plausible[0]), float(plausible[1]))
    if (plausible is None) != ("slip" not in d):
        raise _fail(path, f"argument {name}: 'plausible' and 'slip' go together")
    return Arg(name=d.get("name", name), label=_str(d, "label", path),
               help=_str(d, "help", path), kind=kind, has_default=has_default,
               default=default, min_count=int(d.get("min", 0)), choices=choices,
               plausible=plausible, slip=d.get("slip", ""), rule=d.get("rule", ""), absent=d.get("default") == "absent")


def load_shared_args(directory: pathlib.Path = FUNCTIONS_DIR) -> Dict[str, Arg]:
    path = directory / "arguments.toml"
    data = tomllib.loads(path.read_text(encoding="utf-8"))
    return {key: _arg(key, d, path) for key, d in data.items()}


def _function(path: pathlib.Path, shared: Dict[str, Arg]) -> Function:
    d = tomllib.loads(path.read_text(encoding="utf-8"))
    unknown = set(d) - _FUNCTION_KEYS
    if unknown:
        raise _fail(path, f"unknown field(s) {sorted(unknown)}")
    name = _str(d, "name", path)
    if path.stem != name:
        raise _fail(path, f"the file must be named {name}.toml")
    inline = {k: _arg(k, v, path) for k, v in d.get("arg", {}).items()}
    args: List[Arg] = []
    for ref in d.get("args", []):
        if ref.startswith("@"):
            if ref[1:] not in inline:
                raise _fail(path, f"argument {ref} has no [arg.{ref[1:]}] table")
            args.append(inline.pop(ref[1:]))
        elif ref in shared:
            args.append(shared[ref])
        else:
            raise _fail(path, f"argument {ref!r} is not in arguments.toml (inline ones start with @)")
    if inline:
        raise _fail(path, f"[arg.*] tables not listed in 'args': {sorted(inline)}")
    names = [a.name for a in args]
    if len(set(names)) != len(names):
        raise _fail(path, "an argument name appears twice")
    seen_default = False
    for a in args:
        if seen_default and not a.has_default:
            raise _fail(path, f"required argument {a.name} after an optional one")
        seen_default = seen_default or a.has_default
    outputs = tuple(Output(_str(o, "name", path), _str(o, "help", path),
                           tuple(o.get("words", ())), o.get("type", "double"))
                    for o in d.get("output", [])) or (VALUE_OUTPUT,)
    if any(o.c_type not in ("double", "int", "int64") for o in outputs):
        raise _fail(path, "an output's type is double, int or int64")
    outcome = d.get("outcome")
    if outcome is not None:
        if set(outcome) != {"c", "core"}:
            raise _fail(path, "'outcome' needs c (the public struct) and core (the core struct)")
        outcome = (outcome["c"], outcome["core"])
    example = d.get("example", {})
    fid = d.get("id")
    if not isinstance(fid, int) or fid < 0:
        raise _fail(path, "'id' must be a whole number >= 0")
    adapter = bool(d.get("adapter", False))
    if len(outputs) > 1 and not adapter and outcome is None:
        raise _fail(path, "a function with several outputs needs an outcome struct or an adapter")
    calc_name = d.get("calc_name")
    if not isinstance(calc_name, str):
        raise _fail(path, "'calc_name' must be a string (\"\": no Calc function of its own)")
    return Function(id=fid, name=name, calc_name=calc_name,
                    summary=_str(d, "summary", path), formula=_str(d, "formula", path),
                    source=_str(d, "source", path), statuses=_str(d, "statuses", path),
                    args=tuple(args), outputs=outputs, model=d.get("model", name),
                    outcome=outcome, reference=d.get("reference"),
                    no_deal_nan=bool(d.get("no_deal_nan", False)),
                    named=tuple((n["name"], int(n["args"])) for n in d.get("named", []))
                    or ((name, len(args)),),
                    adapter=adapter, block_kernel=d.get("block_kernel"),
                    example_scenario=example.get("scenario"),
                    example_python=(example.get("python") or "").strip("\n") or None,
                    path=path)


def load(directory: pathlib.Path = FUNCTIONS_DIR) -> List[Function]:
    """Every function, in id order; raises DefinitionError on any inconsistency."""
    shared = load_shared_args(directory)
    functions = [_function(p, shared) for p in sorted(directory.glob("*.toml"))
                 if p.name != "arguments.toml"]
    functions.sort(key=lambda f: f.id)
    for f in functions:
        if not f.adapter and not any(n == len(f.args) for _c, n in f.named):
            raise DefinitionError(f"{f.name}: one named C function must take every argument")
        for c, n in f.named:
            if not 0 < n <= len(f.args) or any(not a.has_default for a in f.args[n:]):
                raise DefinitionError(f"{f.name}: cto_{c} may leave out only trailing "
                                      "arguments with defaults")
        if len(f.args) > 32 or len(f.outputs) > 32:
            raise DefinitionError(f"{f.name}: more than CTO_MAX_ARGS / CTO_MAX_OUTPUTS (32)")
    ids = [f.id for f in functions]
    if ids != list(range(len(functions))):
        raise DefinitionError(f"ids must be 0..{len(functions) - 1} without gaps; found {ids}")
    for attr in ("name", "calc_name"):
        values = [getattr(f, attr) for f in functions if getattr(f, attr)]
        dup = {v for v in values if values.count(v) > 1}
        if dup:
            raise DefinitionError(f"duplicate {attr}: {sorted(dup)}")
    return functions


def python_default(arg: Arg) -> Any:
    """The default as a Python value (None for an absent option)."""
    if arg.kind == "bool":
        return bool(arg.default)
    if arg.kind == "choice":
        return arg.choices[int(arg.default)]
    if arg.absent:
        return None
    if arg.kind == "count" or float(arg.default).is_integer():
        return int(arg.default)
    return arg.default
