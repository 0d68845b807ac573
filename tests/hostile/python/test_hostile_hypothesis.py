"""Every function survives hostile inputs (issue 6 part 5), checked with hypothesis.

Inputs: NaN, +-inf, subnormals, huge values, -0.0, integers beyond 2**53, booleans,
None, strings, lists, 0-d and empty arrays, arrays of mismatched shapes, object,
string, bytes, complex, datetime, float32 and integer arrays.

What must hold (docs/reference/functions.md "Bad input, on each surface";
bindings/README.md "Errors"):
  * no crash: the call returns or raises a ValueError/TypeError (the package's
    InvalidArgumentError is a ValueError); never an InternalError, SystemError or
    any other exception type;
  * an argument that is invalid by its kind (counteroffer.h CTO_ARG_*: NaN or
    infinite, a factor outside [0, 1], a negative rate, a basis <= 0, a boolean other
    than 0/1, a count that is not whole, a choice that is not one) is never turned
    into a number: under the default policy the call raises; under
    errstate(invalid="ignore") every output of that element is NaN;
  * a non-number (None where no default means "absent", text outside a choice,
    object, bytes, complex or datetime arrays) or shapes that do not broadcast make
    the call raise;
  * a call that returns without a warning returns only finite numbers.
The validity rules below are written from the header, independently of the package.
"""
import math
import warnings

import numpy as np
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st
from hypothesis.extra import numpy as hnp

import counteroffer as co
from conftest import KIND, SPECS

ALLOWED = (ValueError, TypeError)
EDGES = [math.nan, math.inf, -math.inf, 5e-324, -5e-324, -0.0, 0.0, 1.0, -1.0, 0.5, 2.0,
         3.5, 1e308, 1.7976931348623157e308, -1.7976931348623157e308, 2.0**53 + 2, 1e20,
         0.9999999999999999, 1.0000000000000002, 2.2250738585072014e-308]
floats = st.one_of(st.sampled_from(EDGES), st.floats(allow_nan=True, allow_infinity=True,
                                                      allow_subnormal=True))
shapes = hnp.array_shapes(min_dims=0, max_dims=2, min_side=0, max_side=3)


def odd_arrays():
    return st.one_of(
        hnp.arrays(np.complex128, shapes),
        hnp.arrays(np.dtype("M8[s]"), shapes),
        hnp.arrays(np.dtype("S3"), shapes),
        hnp.arrays(np.dtype("U4"), shapes),
        st.lists(st.one_of(floats, st.none(), st.text(max_size=3)), max_size=4).map(
            lambda xs: np.array(xs + [None], dtype=object)[:-1] if xs else
            np.array([], dtype=object)),
    )


def value():
    return st.one_of(
        floats, floats, floats,
        st.integers(-(2**70), 2**70), st.booleans(), st.none(),
        st.text(max_size=6), st.sampled_from(["power", "EXPONENTIAL", "Partner", "own",
                                               "other", "proposer", "chair", "", "1"]),
        hnp.arrays(np.float64, shapes, elements=floats),
        hnp.arrays(np.float32, shapes),
        hnp.arrays(np.int64, shapes),
        hnp.arrays(np.bool_, shapes),
        st.lists(floats, max_size=4),
        odd_arrays(),
    )


class MustRaise(Exception):
    """This argument can only be refused (not a number, or not representable)."""


def numeric(arg, v):
    """The argument as float64 for the library, by the documented conversions, or
    MustRaise.  Returns (array, is_absent)."""
    if v is None:
        if arg.kind == KIND["optional"] or arg.name == "votes_needed":
            return np.float64(0.0 if arg.name == "votes_needed" else -math.inf)
        raise MustRaise
    if isinstance(v, np.ndarray) and v.size == 0:
        return np.zeros(v.shape)  # no element: nothing to refuse or to compute
    if arg.kind == KIND["choice"]:
        names = [c.lower() for c in arg.choices]
        if isinstance(v, str):
            if v.lower() in names:
                return np.float64(names.index(v.lower()))
            raise MustRaise
        if isinstance(v, np.ndarray) and v.dtype.kind in "UO":
            flat = []
            for e in v.ravel().tolist():
                if isinstance(e, str) and e.lower() in names:
                    flat.append(float(names.index(e.lower())))
                elif isinstance(e, float) and v.dtype.kind == "O":
                    flat.append(e)
                else:
                    raise MustRaise
            return np.array(flat, dtype=np.float64).reshape(v.shape)
    if isinstance(v, (bool, np.bool_)):
        return np.float64(v)
    if isinstance(v, int):
        if abs(v) > 2**53 and int(float(v)) != v:
            raise MustRaise  # a double cannot hold it (bindings/README.md)
        return np.float64(v)
    if isinstance(v, float):
        return np.float64(v)
    if isinstance(v, str):
        raise MustRaise
    a = np.asarray(v)
    if a.dtype.kind in "f":
        return a.astype(np.float64)
    if a.dtype.kind in "b":
        return a.astype(np.float64)
    if a.dtype.kind in "iu":
        big = np.abs(a.astype(np.float64)) > 2**53
        if big.any() and any(int(float(w)) != int(w) for w in a[big].ravel().tolist()):
            raise MustRaise
        return a.astype(np.float64)
    if a.dtype.kind == "O":  # element by element: numbers, or None for an absent value
        return np.array([object_element(arg, e) for e in a.ravel().tolist()],
                        dtype=np.float64).reshape(a.shape)
    raise MustRaise  # bytes, text, complex, datetime


def object_element(arg, e):
    """One element of an object array (bindings/README.md: a text or None inside an
    array is refused naming the argument, except None where it means "absent")."""
    if e is None and (arg.kind == KIND["optional"] or arg.name == "votes_needed"):
        return 0.0 if arg.name == "votes_needed" else -math.inf
    if isinstance(e, (bool, int, float)):
        return float(e)
    raise MustRaise


def invalid_mask(arg, x):
    """Elements invalid by the argument's kind (counteroffer.h CTO_ARG_*)."""
    k = arg.kind
    with np.errstate(invalid="ignore"):
        bad = np.isnan(x)
        if k == KIND["optional"]:
            return bad | (x == math.inf)
        bad = bad | ~np.isfinite(x)
        if k == KIND["unit"]:
            bad |= (x < 0) | (x > 1)
        elif k == KIND["nonneg"]:
            bad |= x < 0
        elif k == KIND["positive"]:
            bad |= ~(x > 0)
        elif k == KIND["bool"]:
            bad |= (x != 0) & (x != 1)
        elif k == KIND["count"]:
            lo = 0 if arg.name == "votes_needed" else arg.min_count
            bad |= (x != np.floor(x)) | (x < lo) | (np.abs(x) >= 2.0**63)
        elif k == KIND["choice"]:
            bad |= (x != np.floor(x)) | (x < 0) | (x >= len(arg.choices))
    return bad


def outputs(res):
    if isinstance(res, float):
        return [np.float64(res)]
    if isinstance(res, np.ndarray):
        return [res]
    if hasattr(res, "keys"):
        # the numbers: which option binds is a word (None where undefined) and whether
        # a deal is rational a bool (False where undefined), as in scalar results
        return [np.asarray(res[k], dtype=np.float64) for k in res.keys()
                if np.asarray(res[k]).dtype.kind == "f"]
    # a frozen result of a scalar call (solve): its numbers
    vals = [getattr(res, f) for f in res.__dataclass_fields__]
    return [np.float64(v) for v in vals if isinstance(v, (float, bool))]


def call(fn, args, **policy):
    with warnings.catch_warnings(record=True) as w:
        warnings.simplefilter("always")
        with co.errstate(**policy):
            res = fn(*args)
    return res, w


def check(spec, args):
    fn = getattr(co, spec.name)
    try:
        xs = [numeric(a, v) for a, v in zip(spec.args, args)]
        shape = np.broadcast_shapes(*[np.shape(x) for x in xs])
        masks = [np.broadcast_to(invalid_mask(a, np.asarray(x, dtype=np.float64)), shape)
                 for a, x in zip(spec.args, xs)]
        bad = np.logical_or.reduce(masks) if masks else np.zeros(shape, bool)
        must_raise = False
    except (MustRaise, ValueError):
        must_raise, bad, shape = True, None, None
    try:
        res, w = call(fn, args)
    except co.InternalError as e:
        pytest.fail("%s%r: InternalError %s" % (spec.name, args, e))
    except ALLOWED:
        if must_raise or not bad.any():
            return
        # invalid elements: under invalid="ignore" each becomes NaN (array calls);
        # a call with scalars only raises whatever the policy (bindings/README.md)
        try:
            res, w = call(fn, args, invalid="ignore")
        except ALLOWED:
            assert shape == (), "%s%r: raised under invalid='ignore'" % (spec.name, args)
            return
        for out in outputs(res):
            assert np.isnan(np.broadcast_to(out, shape)[bad]).all(), (
                "%s%r: a number from invalid input under invalid='ignore': %r" % (
                    spec.name, args, res))
        return
    assert not must_raise, "%s%r: returned %r for input it cannot accept" % (
        spec.name, args, res)
    assert not bad.any(), "%s%r: returned %r for invalid input (default policy)" % (
        spec.name, args, res)
    if not w:
        for out in outputs(res):
            assert np.isfinite(out).all(), "%s%r: non-finite %r without a warning" % (
                spec.name, args, res)


@pytest.mark.parametrize("spec", SPECS, ids=[s.name for s in SPECS])
def test_hostile_inputs(spec):
    strat = st.tuples(*[value() for _ in spec.args])

    @settings(max_examples=150, deadline=None, database=None, derandomize=True,
              suppress_health_check=list(HealthCheck))
    @given(strat)
    def run(args):
        check(spec, args)

    run()


@pytest.mark.parametrize("out", [
    np.empty(3, dtype=np.int64), np.empty(4), np.empty((3, 1)), [0.0, 0.0, 0.0],
    np.empty(3, dtype=object), np.empty(3, dtype=np.float32), "out",
    np.empty(6)[::2].view(np.complex128) if False else np.empty(3, dtype=np.complex128),
])
def test_bad_out_arguments(out):
    """out= of the wrong dtype, shape or type is refused, never written past."""
    x = np.array([0.9, 0.8, 0.7])
    try:
        r = co.share(x, 0.5, out=out)
    except ALLOWED:
        return
    # accepted: only where NumPy's casting rules allow it, and then correct
    want = co.share(x, 0.5)
    assert np.allclose(np.asarray(r, dtype=np.complex128).real.ravel()[:3], want)


def test_read_only_out_is_refused():
    out = np.empty(3)
    out.flags.writeable = False
    with pytest.raises(ALLOWED):
        co.share(np.array([0.9, 0.8, 0.7]), 0.5, out=out)
