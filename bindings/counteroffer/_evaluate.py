"""Evaluation with the error policy: one call of a catalogue function.

Scalars go through ``_core.call``, arrays through the row's ufunc (``_core.ufuncs``);
the statuses the library reports are gathered per call and the policy of ``_errors``
is applied once, after the loop.  Validation and mathematics are the library's.
"""

from __future__ import annotations

import math
import os
import sys
import warnings
from typing import Any, List, Optional, Sequence, Tuple

import numpy as np

from . import _core, _errors, _present
from ._convert import EXACT_INT, PLAIN, Invalid, convert, fmt, is_dask, is_dask_series
from ._reasons import element, explain, invalid_reason
from ._results import ArrayResult
from ._spec import STATUS_NAMES, FunctionSpec, Status

PACKAGE_DIR = os.path.dirname(os.path.abspath(__file__))


def _warn(message: str, category: type) -> None:
    """Warn at the first caller outside the package (once-per-location filters then
    work on the user's code)."""
    frame = sys._getframe(1)
    level = 2
    while frame is not None and frame.f_code.co_filename.startswith(PACKAGE_DIR):
        frame = frame.f_back  # type: ignore[assignment]
        level += 1
    warnings.warn(message, category, stacklevel=level)


def act(category: str, message: str, action: Optional[str] = None) -> None:
    """Apply the policy of `category` ("invalid", "no_deal", ...) to one message."""
    if action is None:
        action = _errors.geterr().get(category, "raise")
    error, warning = _errors.CLASSES.get(
        category, (_errors.CounterofferError, _errors.CounterofferWarning))
    if action == "raise":
        raise error(message)
    if action == "warn":
        _warn(message, warning)


# ---- messages -------------------------------------------------------------------------
def invalid_message(spec: FunctionSpec, j: int, value: Any, why: Optional[str] = None,
                    position: Optional[Tuple[int, ...]] = None,
                    args: Optional[Sequence[float]] = None) -> str:
    """"<function>: <argument> = <value> is invalid (<why>)": `why` from the conversion,
    or the library's reason for the element's arguments `args`."""
    if not 0 <= j < len(spec.args):
        return f"{spec.name}: invalid arguments ({_core.status_message(Status.INVALID)})"
    arg = spec.args[j]
    if why:
        text = f"{why}; {arg.help}"
    elif args is not None:
        text = invalid_reason(spec, j, args)
    else:
        text = arg.help
    where = f" at index {position}" if position else ""
    return f"{spec.name}: {arg.name} = {fmt(value)}{where} is invalid ({text})"


def status_text(spec: FunctionSpec, code: int, args: Optional[Sequence[float]] = None) -> str:
    """What a status means: the library's reason for the element's arguments `args`
    (e.g. share_from_rates with days = 0), or the status's general meaning."""
    if args is not None:
        return explain(spec, args)
    return _core.status_message(code)


def _position(flat: int, shape: Tuple[int, ...],
              origin: Optional[Tuple[int, ...]]) -> Tuple[int, ...]:
    where = tuple(int(i) for i in np.unravel_index(flat, shape))
    if origin is not None and len(origin) == len(where):
        where = tuple(i + o for i, o in zip(where, origin))
    return where


def _label(index: Any, where: Tuple[int, ...]) -> str:
    if index is None or len(where) != 1:
        return ""
    return f", label {index[where[0]]!r}"


# ---- plausible ranges -----------------------------------------------------------------
def _implausible_message(spec: FunctionSpec, j: int, value: Any, extra: str = "") -> str:
    arg = spec.args[j]
    low, high = arg.plausible  # type: ignore[misc]
    return (f"{spec.name}: {arg.name} = {fmt(value)} is outside its plausible range "
            f"{low:g} to {high:g}{extra}: it looks like a typo or a percentage typed as a "
            f"whole number (8 for 8%); the result uses the value as given")


def _check_array(spec: FunctionSpec, j: int, v: Any, origin: Optional[Tuple[int, ...]],
                 index: Any, action: str) -> None:
    low, high = spec.args[j].plausible  # type: ignore[misc]
    arr = np.asarray(v)
    if arr.size == 0 or arr.dtype.kind not in "biuf":
        return
    # reductions first: no temporary array unless something is out of range
    if not (np.fmin.reduce(arr, axis=None) < low or np.fmax.reduce(arr, axis=None) > high):
        return
    outside = np.isfinite(arr) & ((arr < low) | (arr > high))
    n = int(np.count_nonzero(outside))
    if n:
        flat = int(np.argmax(outside.ravel()))
        where = _position(flat, arr.shape, origin)
        extra = f" in {n} of {arr.size} values (first at index {where}{_label(index, where)})"
        act("implausible", _implausible_message(spec, j, arr.ravel()[flat], extra), action)


def check_plausible(spec: FunctionSpec, vals: Sequence[Any],
                    origin: Optional[Tuple[int, ...]] = None, index: Any = None) -> None:
    """Apply the ``implausible`` policy to values outside their plausible ranges."""
    checked = spec.plausible_args
    if not checked:
        return
    action = _errors.action("implausible")
    if action == "ignore":
        return
    for j in checked:
        v = vals[j]
        if type(v) is not float and np.ndim(v) != 0:
            _check_array(spec, j, v, origin, index, action)
            continue
        low, high = spec.args[j].plausible  # type: ignore[misc]
        if not low <= v <= high and math.isfinite(v):  # NaN fails the first test too
            act("implausible", _implausible_message(spec, j, float(v)), action)


# ---- scalars ----------------------------------------------------------------------
def evaluate_scalar(spec: FunctionSpec, vals: List[Any], originals: Sequence[Any]) -> Any:
    """One evaluation: the outputs as the library gives them, after the policy."""
    args = []
    for j, v in enumerate(vals):
        try:
            args.append(float(v))
        except (TypeError, ValueError):
            raise _errors.InvalidArgumentError(
                invalid_message(spec, j, originals[j], "a number is required")) from None
    status, bad, outs = _core.call(spec.id, args)
    if status == Status.INVALID:
        value = originals[bad] if 0 <= bad < len(originals) else None
        raise _errors.InvalidArgumentError(invalid_message(spec, bad, value, args=args))
    if status != Status.OK:
        act(STATUS_NAMES.get(status, "internal"),
            f"{spec.name}: {status_text(spec, status, args)}")
    check_plausible(spec, args)
    return outs


# ---- arrays -----------------------------------------------------------------------
def _shape_error(spec: FunctionSpec, vals: Sequence[Any], out: Any, error: ValueError) -> str:
    shapes = ", ".join(f"{a.name} {np.shape(v)}" for a, v in zip(spec.args, vals)
                       if np.ndim(v) != 0)
    if out is not None:
        outs = out if isinstance(out, tuple) else (out,)
        shapes += ", out " + ", ".join(str(np.shape(o)) for o in outs)
    return (f"{spec.name}: the arguments cannot be broadcast to one shape ({shapes}); "
            f"NumPy: {error}")


def _run(spec: FunctionSpec, vals: Sequence[Any], out: Any) -> Tuple[Any, Any]:
    ufunc = _core.ufuncs[spec.name]
    _core.tally_reset()
    try:
        res = ufunc(*vals) if out is None else ufunc(*vals, out=out)
    except ValueError as e:
        if "broadcast" not in str(e):
            raise
        raise ValueError(_shape_error(spec, vals, out, e)) from None
    finally:
        tally = _core.tally_take()
    return res, tally


def _first(spec: FunctionSpec, vals: Sequence[Any], code: int,
           origin: Optional[Tuple[int, ...]]) -> Tuple[Tuple[int, ...], Optional[list]]:
    """Where the first element with status `code` is, counted in the whole array, and
    its arguments as doubles (error path only)."""
    st = _core.status_ufuncs[spec.name](*vals)[-1]
    flat = int(np.argmax(np.ravel(st) == code))
    local = _position(flat, np.shape(st), None)
    return _position(flat, np.shape(st), origin), element(vals, np.shape(st), local)


def _apply_policy(spec: FunctionSpec, vals: Sequence[Any], tally: Any,
                  origin: Optional[Tuple[int, ...]], index: Any) -> None:
    counts, bad, bad_value = tally
    total = sum(counts)
    policy = _errors.geterr()
    for code in range(1, len(counts)):
        category = STATUS_NAMES.get(code, "internal")
        action = policy.get(category, "raise")
        if not counts[code] or action == "ignore":
            continue
        where, args = _first(spec, vals, code, origin)
        at = f"(first at index {where}{_label(index, where)})"
        if code == Status.INVALID:
            msg = (invalid_message(spec, bad, bad_value, args=args) +
                   f" in {counts[code]} of {total} elements {at}")
            if action == "warn":
                msg += "; those results are NaN"
        else:
            msg = (f"{spec.name}: {counts[code]} of {total} elements {at}: "
                   f"{status_text(spec, code, args)}")
        act(category, msg, action)


def evaluate_array(spec: FunctionSpec, vals: Sequence[Any], out: Any = None,
                   origin: Optional[Tuple[int, ...]] = None, index: Any = None) -> Any:
    """The ufunc's raw result (float64 array, or a tuple of them), after the policy.
    `origin` is where these elements start in a larger array (a dask chunk)."""
    res, tally = _run(spec, vals, out)
    _apply_policy(spec, vals, tally, origin, index)
    check_plausible(spec, vals, origin, index)
    return res


def package(spec: FunctionSpec, res: Any, index: Any, out: Any) -> Any:
    """The raw result as the caller gets it: an array, a Series, an ArrayResult or a
    DataFrame, with coded outputs as words (kept as written when out= is given)."""
    if len(spec.outputs) == 1:
        if index is not None:
            import pandas as pd  # type: ignore[import-untyped,unused-ignore]

            return pd.Series(res, index=index, name=spec.name)
        return res
    data = {name: r if out is not None else _present.array(spec.words(k), r)
            for k, (name, r) in enumerate(zip(spec.output_names, res))}
    if index is not None:
        import pandas as pd  # type: ignore[import-untyped,unused-ignore]

        return pd.DataFrame(data, index=index)
    return ArrayResult(data)


# ---- one call -----------------------------------------------------------------------
def evaluate(spec: FunctionSpec, fn: Any, values: Tuple[Any, ...], out: Any,
             result_cls: Optional[type]) -> Any:
    """A call of the Python function `fn` of `spec` with these argument values."""
    # fast path: plain Python numbers only (no choice strings, no None, no arrays)
    if out is None and all(type(v) in PLAIN for v in values) and all(
            type(v) is not int or -EXACT_INT <= v <= EXACT_INT for v in values):
        return _scalar_result(spec, evaluate_scalar(spec, list(values), values), result_cls)
    if any(is_dask_series(v) for v in values):
        from ._dask import evaluate_frame

        return evaluate_frame(spec, fn, values)
    try:
        vals, index, scalar = convert(spec, values)
    except Invalid as e:
        raise _errors.InvalidArgumentError(
            invalid_message(spec, e.index, e.value, e.reason, e.position)) from None
    if any(is_dask(v) for v in vals):
        if out is not None:
            raise TypeError(f"{spec.name}: out= is not supported with dask arrays")
        from ._dask import evaluate_lazy

        return evaluate_lazy(spec, vals)
    if scalar and out is None:
        return _scalar_result(spec, evaluate_scalar(spec, vals, values), result_cls)
    return package(spec, evaluate_array(spec, vals, out, index=index), index, out)


def _scalar_result(spec: FunctionSpec, outs: Sequence[float], result_cls: Optional[type]) -> Any:
    if result_cls is None:
        return float(outs[0])
    return result_cls(*(_present.scalar(spec.words(k), v, spec.is_count(k))
                        for k, v in enumerate(outs)))
