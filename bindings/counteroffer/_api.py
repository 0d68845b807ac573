"""Python functions generated from the library's function table.

For every catalogue row (``_core.catalogue()``) one Python function is made with the
row's name, its arguments in order and their defaults.  It converts types (string
choices to their index, ``None`` to "absent", booleans to 0/1, pandas Series to arrays),
calls the row's NumPy ufunc (``_core.ufuncs``) or, for scalars, ``_core.call``, and
applies the error policy of ``_errors`` once per call.  Validation and mathematics
are the library's: nothing here checks a domain or computes a model.
"""

from __future__ import annotations

import dataclasses
import math
import sys
import warnings
from collections.abc import Mapping
from typing import Any, Callable, Dict, Iterator, List, Optional, Sequence, Tuple

import numpy as np

from . import _core
from . import _errors
from ._present import DEFAULT_OVERRIDES, OUTPUT_BOOL, OUTPUT_CODES

KIND = dict(_core.ARG_KINDS)
_STATUS_NAMES = {code: _core.status_name(code) for code in range(_core.REPORT_SLOTS)}


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

    @property
    def py_default(self) -> Any:
        """The Python default shown in the signature (from the table's double)."""
        if not self.has_default:
            raise AttributeError(self.name)
        if self.kind == KIND["bool"]:
            return bool(self.default)
        if self.kind == KIND["choice"]:
            return self.choices[int(self.default)]
        if self.kind == KIND["optional"] and self.default == -math.inf:
            return None
        if self.kind == KIND["count"] or float(self.default).is_integer():
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
    # Python defaults that the table's double cannot express (see _present.py)
    overrides: Dict[str, Any]

    def default(self, arg: ArgSpec) -> Any:
        if arg.name in self.overrides:
            return self.overrides[arg.name][0]
        return arg.py_default


def load_specs() -> List[FunctionSpec]:
    specs = []
    for row in _core.catalogue():
        args = tuple(
            ArgSpec(a["name"], a["label"], a["help"], a["kind"], a["has_default"],
                    a["default"], a["min_count"], tuple(a["choices"]))
            for a in row["args"]
        )
        specs.append(
            FunctionSpec(
                row["id"], row["name"], row["calc_name"], row["summary"], row["formula"],
                row["source"], row["statuses"], args,
                tuple((o["name"], o["help"]) for o in row["outputs"]),
                dict(DEFAULT_OVERRIDES.get(row["name"], {})),
            )
        )
    return specs


# ---- results of multi-output functions -------------------------------------------
class ArrayResult(Mapping):  # type: ignore[type-arg]
    """Results of a multi-output function over arrays: output name -> float64 array.

    Codes are kept as numbers here (see the function's docstring for their meaning);
    ``to_records()`` gives a NumPy record array.
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


def _result_class(spec: FunctionSpec) -> Optional[type]:
    if len(spec.outputs) < 2:
        return None
    fields: List[Tuple[str, Any]] = []
    for name, _help in spec.outputs:
        if name in OUTPUT_CODES:
            fields.append((name, Optional[str]))
        elif name in OUTPUT_BOOL:
            fields.append((name, bool))
        else:
            fields.append((name, float))
    cls_name = "".join(p.capitalize() for p in spec.name.split("_")) + "Result"
    doc = f"Result of {spec.name}() for scalar arguments.\n\n" + "\n".join(
        f"{name}: {help_}" for name, help_ in spec.outputs
    )
    cls = dataclasses.make_dataclass(cls_name, fields, frozen=True, namespace={"__doc__": doc})
    cls.__module__ = "counteroffer"
    return cls


def _present_scalar(name: str, value: float) -> Any:
    if name in OUTPUT_CODES:
        codes = OUTPUT_CODES[name]
        if not (0 <= value < len(codes)) or value != int(value):  # NaN: undefined
            return None
        return codes[int(value)]
    if name in OUTPUT_BOOL:
        return bool(value == 1.0)
    return float(value)


# ---- argument conversion ------------------------------------------------------------
def _is_dask(x: Any) -> bool:
    mod = sys.modules.get("dask.array")
    return mod is not None and isinstance(x, mod.Array)


def _is_series(x: Any) -> bool:
    mod = sys.modules.get("pandas")
    return mod is not None and isinstance(x, mod.Series)


def _fmt(value: Any) -> str:
    if isinstance(value, (float, np.floating)):
        return repr(float(value))
    if isinstance(value, (bool, np.bool_)):
        return repr(bool(value))
    if isinstance(value, (int, np.integer)):
        return repr(int(value))
    return repr(value)


class _Invalid(Exception):
    """A conversion failed: (arg index, value, reason)."""

    def __init__(self, index: int, value: Any, reason: str) -> None:
        super().__init__(index, value, reason)
        self.index, self.value, self.reason = index, value, reason


def _choice_index(arg: ArgSpec, j: int, value: Any) -> Any:
    lookup = {c.lower(): float(k) for k, c in enumerate(arg.choices)}
    if isinstance(value, str):
        try:
            return lookup[value.lower()]
        except KeyError:
            raise _Invalid(j, value, "not one of " + ", ".join(map(repr, arg.choices))) from None
    arr = np.asarray(value)
    if arr.dtype.kind in "UO" and arr.ndim > 0:
        flat = [lookup.get(str(v).lower(), math.nan) if isinstance(v, str) else v
                for v in arr.ravel().tolist()]
        for v_in, v_out in zip(arr.ravel().tolist(), flat):
            if isinstance(v_in, str) and math.isnan(v_out):
                raise _Invalid(j, v_in, "not one of " + ", ".join(map(repr, arg.choices)))
        return np.asarray(flat, dtype=np.float64).reshape(arr.shape)
    return value


_EXACT_INT = 2**53  # every integer up to this passes through a double exactly
_PLAIN = frozenset({float, int, bool})


def _check_exact_int(j: int, v: int) -> None:
    """The library takes every argument as a double (cto_call, cto_call_strided): an
    integer that a double cannot hold exactly would silently become another number."""
    if int(float(v)) != v:
        raise _Invalid(j, v, "an integer above 2**53 that a double cannot represent exactly; "
                             "the library's table interface takes doubles")


def _convert(spec: FunctionSpec, values: Sequence[Any]) -> Tuple[List[Any], Any, bool]:
    """Arguments -> (values for the ufunc, pandas index or None, all scalar)."""
    out: List[Any] = []
    index = None
    scalar = True
    for j, (arg, v) in enumerate(zip(spec.args, values)):
        if v is None:
            if arg.name in spec.overrides:
                v = spec.overrides[arg.name][1]
            elif arg.kind == KIND["optional"]:
                v = -math.inf
            else:
                raise _Invalid(j, v, "a number is required")
        if _is_series(v):
            if index is None:
                index = v.index
            elif not index.equals(v.index):
                raise ValueError(f"{spec.name}: pandas Series arguments must share one index")
            v = v.to_numpy()
        if arg.kind == KIND["choice"]:
            v = _choice_index(arg, j, v)
        if isinstance(v, (bool, np.bool_)):
            v = float(v)
        elif isinstance(v, str):
            raise _Invalid(j, v, "a number is required")
        elif isinstance(v, (int, np.integer)):
            if abs(int(v)) > _EXACT_INT:
                _check_exact_int(j, int(v))
        elif isinstance(v, (list, tuple)):
            v = np.asarray(v)
        if isinstance(v, np.ndarray) and v.dtype.kind in "iu" and v.size:
            big = np.abs(v.astype(np.float64)) > _EXACT_INT
            if big.any():
                for w in v[big].ravel().tolist():
                    _check_exact_int(j, int(w))
        if np.ndim(v) != 0:
            scalar = False
        out.append(v)
    return out, index, scalar


# ---- the error policy ---------------------------------------------------------------
def _classes(status_name: str) -> Tuple[type, type]:
    return _errors.CLASSES.get(
        status_name, (_errors.CounterofferError, _errors.CounterofferWarning)
    )


def _act(name: str, status_name: str, message: str, stacklevel: int) -> None:
    action = _errors.geterr().get(status_name, "raise")
    error, warning = _classes(status_name)
    if action == "raise":
        raise error(f"{name}: {message}")
    if action == "warn":
        warnings.warn(f"{name}: {message}", warning, stacklevel=stacklevel)


def _invalid_message(spec: FunctionSpec, j: int, value: Any, reason: Optional[str] = None) -> str:
    if 0 <= j < len(spec.args):
        arg = spec.args[j]
        why = f"{reason}; {arg.help}" if reason else arg.help
        return f"{spec.name}: {arg.name} = {_fmt(value)} is invalid ({why})"
    return f"{spec.name}: invalid arguments ({_core.status_message(1)})"


# ---- evaluation -------------------------------------------------------------------
def _evaluate_scalar(spec: FunctionSpec, vals: List[Any], originals: Sequence[Any],
                     result_cls: Optional[type]) -> Any:
    args = []
    for j, v in enumerate(vals):
        try:
            args.append(float(v))
        except (TypeError, ValueError):
            raise _errors.InvalidArgumentError(
                _invalid_message(spec, j, originals[j], "a number is required")) from None
    status, bad, outs = _core.call(spec.id, args)
    if status == 1:
        j = bad
        raise _errors.InvalidArgumentError(
            _invalid_message(spec, j, originals[j] if 0 <= j < len(originals) else None))
    if status != 0:
        _act(spec.name, _STATUS_NAMES.get(status, "internal"), _core.status_message(status), 5)
    if result_cls is None:
        return float(outs[0])
    return result_cls(*(_present_scalar(n, v) for (n, _h), v in zip(spec.outputs, outs)))


def _first_index(spec: FunctionSpec, vals: List[Any], code: int) -> Tuple[int, ...]:
    """Where the first element with status `code` is (error path only)."""
    res = _core.status_ufuncs[spec.name](*vals)
    st = res[-1]
    flat = int(np.argmax(np.ravel(st) == code))
    return tuple(int(i) for i in np.unravel_index(flat, np.shape(st)))


def _evaluate_array(spec: FunctionSpec, vals: List[Any], out: Any, index: Any) -> Any:
    ufunc = _core.ufuncs[spec.name]
    _core.tally_reset()
    try:
        if out is None:
            res = ufunc(*vals)
        else:
            res = ufunc(*vals, out=out)
    finally:
        counts, bad, bad_value = _core.tally_take()
    total = sum(counts)
    for code in range(1, len(counts)):
        if not counts[code]:
            continue
        status_name = _STATUS_NAMES.get(code, "internal")
        if code == 1:
            action = _errors.geterr().get("invalid", "raise")
            if action == "ignore":
                continue
            where = _first_index(spec, vals, code)
            msg = _invalid_message(spec, bad, bad_value)
            msg += f" in {counts[code]} of {total} elements (first at index {where})"
            error, warning = _classes(status_name)
            if action == "raise":
                raise error(msg)
            warnings.warn(msg + "; those results are NaN", warning, stacklevel=4)
            continue
        msg = f"{counts[code]} of {total} elements: {_core.status_message(code)}"
        _act(spec.name, status_name, msg, 5)
    if len(spec.outputs) == 1:
        if index is not None:
            import pandas as pd  # type: ignore[import-untyped,unused-ignore]

            return pd.Series(res, index=index, name=spec.name)
        return res
    data = {name: r for (name, _h), r in zip(spec.outputs, res)}
    if index is not None:
        import pandas as pd  # type: ignore[import-untyped,unused-ignore]

        return pd.DataFrame(data, index=index)
    return ArrayResult(data)


def _evaluate_dask(spec: FunctionSpec, fn: Callable[..., Any], vals: List[Any]) -> Any:
    import dask.array as da

    policy = _errors.geterr()
    positions = [j for j, v in enumerate(vals) if np.ndim(v) != 0]
    arrays = da.broadcast_arrays(*(da.asarray(vals[j]) for j in positions))

    names = [name for name, _h in spec.outputs]

    def block(*blocks: Any) -> Any:
        full = list(vals)
        for j, b in zip(positions, blocks):
            full[j] = b
        with _errors.errstate(**policy):
            r = fn(*full)
        if len(names) == 1:
            return r
        return np.stack([np.asarray(r[n]) for n in names], axis=-1)

    if len(names) == 1:
        return da.map_blocks(block, *arrays, dtype=np.float64)
    # one evaluation for all outputs: a stacked block with the outputs on a new last axis
    pairs: List[Any] = []
    for a in arrays:
        pairs += [a, tuple(range(a.ndim))]
    _chunks, arrays = da.core.unify_chunks(*pairs)
    ndim = arrays[0].ndim
    stacked = da.map_blocks(block, *arrays, dtype=np.float64, new_axis=ndim,
                            chunks=arrays[0].chunks + ((len(names),),))
    return ArrayResult({n: stacked[..., k] for k, n in enumerate(names)})


def make_function(spec: FunctionSpec, doc: str) -> Callable[..., Any]:
    result_cls = _result_class(spec)

    def evaluate(values: Tuple[Any, ...], out: Any) -> Any:
        # fast path: plain Python numbers only (no choice strings, no None, no arrays)
        if out is None and all(type(v) in _PLAIN for v in values) and all(
                type(v) is not int or -_EXACT_INT <= v <= _EXACT_INT for v in values):
            return _evaluate_scalar(spec, list(values), values, result_cls)
        try:
            vals, index, scalar = _convert(spec, values)
        except _Invalid as e:
            raise _errors.InvalidArgumentError(
                _invalid_message(spec, e.index, e.value, e.reason)) from None
        if any(_is_dask(v) for v in vals):
            if out is not None:
                raise TypeError(f"{spec.name}: out= is not supported with dask arrays")
            return _evaluate_dask(spec, fn, vals)
        if scalar and out is None:
            return _evaluate_scalar(spec, vals, values, result_cls)
        return _evaluate_array(spec, vals, out, index)

    params = []
    namespace: Dict[str, Any] = {"_evaluate": evaluate}
    for arg in spec.args:
        if arg.has_default:
            namespace[f"_d_{arg.name}"] = spec.default(arg)
            params.append(f"{arg.name}=_d_{arg.name}")
        else:
            params.append(arg.name)
    names = ", ".join(a.name for a in spec.args)
    src = (
        f"def {spec.name}({', '.join(params)}, *, out=None):\n"
        f"    return _evaluate(({names},), out)\n"
    )
    exec(src, namespace)  # noqa: S102 - a signature built from the library's table
    fn = namespace[spec.name]
    fn.__module__ = "counteroffer"
    fn.__qualname__ = spec.name
    fn.__doc__ = doc
    fn.spec = spec  # type: ignore[attr-defined]
    fn.ufunc = _core.ufuncs[spec.name]  # type: ignore[attr-defined]
    fn.status_ufunc = _core.status_ufuncs[spec.name]  # type: ignore[attr-defined]
    if result_cls is not None:
        fn.Result = result_cls  # type: ignore[attr-defined]
    return fn
