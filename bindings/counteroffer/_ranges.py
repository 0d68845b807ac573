"""share_range and share_swing: the combined model from rates (solve_from_rates) with
inputs given as ranges, through the library's ``cto_share_range`` / ``cto_share_swing``.

This module converts the arguments and applies the package's error policy (``errstate``)
to the library's status, with the library's reason in words (``cto_range_explain``,
``cto_swing_explain``); the validation, its words, the sampling and the estimators are
the library's (docs/models/ranges.md).
"""

from __future__ import annotations

import math
import operator
from typing import Any, Dict, List, Sequence, Tuple

import numpy as np

from . import _core, _errors, _structs
from ._convert import Invalid, fmt
from ._distributions import Input, check_shape, library_args
from ._evaluate import act, check_plausible
from ._range_results import RangeResult, SwingResult, SwingRow, estimate
from ._spec import STATUS_NAMES, FunctionSpec, Status, load_specs

MODEL = "share_range"
#: the inputs in the order of cto_range_input (the catalogue order of solve_from_rates)
INPUTS = ("own_rate", "other_rate", "days", "breakdown_prob", "own_fallback",
          "other_fallback", "own_inside", "other_inside", "own_outside", "other_outside",
          "surplus", "own_opens", "basis", "continuous")
DEFAULTS: Dict[str, Any] = dict(_structs.RANGE_DEFAULTS)
_INT_MAX = 2**31 - 1
_SPEC: List[FunctionSpec] = []


def model_spec() -> FunctionSpec:
    """The 14 inputs of solve_from_rates (cto_range_input's order) as a FunctionSpec for
    the conversions and messages: each argument's label, help, kind and plausible range
    are the library table's (solve_from_rates when the table has it, share_from_rates,
    solve, then the first function with an argument of that name), as the add-in does."""
    if not _SPEC:
        specs = load_specs()
        order = sorted(specs, key=lambda s: (s.name != "solve_from_rates",
                                             s.name != "share_from_rates", s.name != "solve"))
        args = tuple(next(a for s in order for a in s.args if a.name == n) for n in INPUTS)
        none = {a.name: (None, -math.inf) for a in args if a.name in ("own_outside",
                                                                       "other_outside")}
        _SPEC.append(FunctionSpec(-1, MODEL, "", "", "", "", "", args, (), none))
    return _SPEC[0]


def _whole(name: str, value: Any, low: int = -_INT_MAX - 1, high: int = _INT_MAX) -> int:
    """An option as an int for the library; a value beyond a C int is clamped to one the
    library rejects in turn (its reason then shows the clamped value)."""
    if isinstance(value, bool):
        raise _errors.InvalidArgumentError(f"share_range: {name} = {value!r} is invalid "
                                           "(a whole number is required)")
    try:
        n = operator.index(value)
    except TypeError:
        raise _errors.InvalidArgumentError(f"share_range: {name} = {fmt(value)} is invalid "
                                           "(a whole number is required)") from None
    return max(low, min(high, n))


def _probabilities(value: Any) -> List[float]:
    values = [value] if np.ndim(value) == 0 else list(np.ravel(np.asarray(value, dtype=object)))
    try:
        return [float(v) for v in values]
    except (TypeError, ValueError):
        raise _errors.InvalidArgumentError(
            f"share_range: probabilities = {value!r} is invalid (numbers are required)"
        ) from None


def invalid(function: str, out: Dict[str, Any]) -> _errors.InvalidArgumentError:
    """The package's ValueError for the library's invalid outcome: its reason in words
    (``cto_range_explain``: the input by its argument name or the option, and its rule)."""
    return _errors.InvalidArgumentError(f"{function}: {out['reason']}")


def convert(function: str, values: Sequence[Any],
            shape: Any) -> Tuple[FunctionSpec, List[Tuple[int, float, float, float]], List[Any]]:
    spec = model_spec()
    try:
        args, shown = library_args(spec, values, check_shape(-1, shape))
    except Invalid as e:
        name = spec.args[e.index].name if e.index >= 0 else "shape"
        raise _errors.InvalidArgumentError(
            f"{function}: {name} = {fmt(e.value)} is invalid ({e.reason})") from None
    return spec, args, shown


def plausible(spec: FunctionSpec, args: Sequence[Tuple[int, float, float, float]]) -> None:
    """The package's ``implausible`` policy over each input's low, mode and high (after
    the library found them valid), as for the table's functions."""
    check_plausible(spec, [a[2] if a[0] == _structs.RANGE_FIXED else np.array([a[1], a[2], a[3]])
                           for a in args])


def _result(out: Dict[str, Any], names: Sequence[str], shown: Sequence[Any]) -> RangeResult:
    status = out["status"]
    return RangeResult(
        tuple(float(p) for p in out["probabilities"]),
        tuple(estimate(e) for e in out["own"]), tuple(estimate(e) for e in out["other"]),
        estimate(out["own_mean"]), estimate(out["other_mean"]), estimate(out["p_rational"]),
        estimate(out["p_own_binds"]), estimate(out["p_other_binds"]),
        estimate(out["edge_fraction"]), int(out["points_per_replicate"]),
        int(out["replicates"]), int(out["dimension"]), int(out["spec_version"]),
        _core.status_name(status), status == Status.OK,
        tuple(zip(names, shown)), str(out["reason"]))


def share_range(
    own_rate: Input, other_rate: Input, days: Input, breakdown_prob: Input = 0,
    own_fallback: Input = 0, other_fallback: Input = 0, own_inside: Input = 0,
    other_inside: Input = 0, own_outside: Input = None, other_outside: Input = None,
    surplus: Input = 1, own_opens: Input = True, basis: Input = 365,
    continuous: Input = False, *,
    shape: str = "pert", probabilities: Any = (0.1, 0.5, 0.9), seed: int = 0,
    replicates: int = 16, digits: int = 3, log2_start: int = 10, log2_max: int = 20,
    threads: int = 1,
) -> RangeResult:
    """Quantiles of own and other's share when inputs of solve_from_rates are ranges.

    Each numeric argument is a number, ``(low, high)`` (uniform), ``(low, mode, high)``
    (``shape="pert"``, the default, or ``"triangular"``) or a distribution object
    (``uniform``, ``triangular``, ``pert``); own_opens and continuous are fixed.  The
    library draws randomized quasi-Monte Carlo points (Sobol' 1967; Joe & Kuo 2008;
    Owen 1995 scrambling) in ``replicates`` independent replicates of 2**log2_start
    points each, doubled until the 95% half-width of every quantile of own share at
    ``probabilities`` is within half a unit of its ``digits``-th significant digit, or
    2**log2_max points (status "precision not reached": a PrecisionNotReachedWarning,
    ``errstate(precision=...)``).  Quantiles by Hyndman & Fan (1996) definition 7; the
    same inputs and ``seed`` give the same bits whatever ``threads``.  Method and
    accuracy: docs/models/ranges.md; Python: docs/python-ranges.md.

    Returns a RangeResult (``.to_frame()``: a pandas DataFrame of the quantiles).
    Results are model estimates under stated assumptions, not financial, legal or tax
    advice.

    >>> import counteroffer as co
    >>> r = co.share_range(0.08, (0.04, 0.08, 0.16), 30)
    >>> r.status, r.dimension
    ('ok', 1)
    """
    values = (own_rate, other_rate, days, breakdown_prob, own_fallback, other_fallback,
              own_inside, other_inside, own_outside, other_outside, surplus, own_opens, basis,
              continuous)
    spec, args, shown = convert("share_range", values, shape)
    seed_int = _whole("seed", seed, -1, 2**64 - 1)
    if seed_int < 0:  # the option is an unsigned 64-bit integer: a conversion
        raise _errors.InvalidArgumentError(f"share_range: seed = {fmt(seed)} is invalid "
                                           "(a whole number from 0 to 2**64 - 1)")
    out = _structs.share_range(
        args, _probabilities(probabilities), seed_int, _whole("replicates", replicates),
        _whole("digits", digits), _whole("log2_start", log2_start),
        _whole("log2_max", log2_max), _whole("threads", threads))
    status = out["status"]
    if status == Status.INVALID:
        raise invalid("share_range", out)
    plausible(spec, args)
    if status == _structs.E_PRECISION:
        act("precision", f"share_range: {out['reason']}")
    elif status != Status.OK:
        act(STATUS_NAMES.get(status, "internal"), f"share_range: {out['reason']}")
    return _result(out, [a.name for a in spec.args], shown)


def share_swing(
    own_rate: Input, other_rate: Input, days: Input, breakdown_prob: Input = 0,
    own_fallback: Input = 0, other_fallback: Input = 0, own_inside: Input = 0,
    other_inside: Input = 0, own_outside: Input = None, other_outside: Input = None,
    surplus: Input = 1, own_opens: Input = True, basis: Input = 365,
    continuous: Input = False, *,
    shape: str = "pert",
) -> SwingResult:
    """One-at-a-time swing of own share over each uncertain input (a tornado chart).

    The arguments are those of share_range.  For each uncertain input, own share with
    that input at its low and at its high, every other input at its mode (a uniform
    range's midpoint), sorted by the size of the swing, largest first (one-way
    sensitivity; Howard 1988; Clemen & Reilly 2014, ch. 5).  It ignores interactions,
    which share_range's quantiles include.  Returns a SwingResult (``.to_frame()``).
    Model estimates under stated assumptions, not financial, legal or tax advice.
    """
    values = (own_rate, other_rate, days, breakdown_prob, own_fallback, other_fallback,
              own_inside, other_inside, own_outside, other_outside, surplus, own_opens, basis,
              continuous)
    spec, args, shown = convert("share_swing", values, shape)
    out = _structs.share_swing(args)
    status = out["status"]
    if status == Status.INVALID:
        raise invalid("share_swing", out)
    plausible(spec, args)
    if status != Status.OK:
        act(STATUS_NAMES.get(status, "internal"), f"share_swing: {out['reason']}")
    rows = tuple(
        SwingRow(spec.args[j].name, args[j][1], args[j][3], float(lo), float(hi), float(sw),
                 _core.status_name(sl), _core.status_name(sh))
        for j, lo, hi, sw, sl, sh in out["rows"])
    return SwingResult(float(out["base"]), _core.status_name(out["base_status"]), rows,
                       str(out["reason"]))
