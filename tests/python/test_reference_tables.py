"""Every catalogue function against the core's 50-digit reference tables.

Source: tests/reference/<name>.csv, written by tests/reference/generate.py with mpmath
at 50 digits by methods independent of the library's closed forms (backward induction,
bisection on the stationary conditions, value iteration, numerical differentiation);
the method and published source of each row is in its `source` column.  Columns:
the function's arguments (as doubles: booleans 0/1, choices as their index, -inf for
an absent option), `status`, the outputs, `source`.

The library's header promises a relative error below 1e-15 (absolute 1e-15 x surplus
near zero); the tolerance here is 4 x that, for the rounding of the tables' inputs
and of this comparison.
"""

import csv
import math
import warnings

import numpy as np
import pytest

import counteroffer as co
from conftest import REFERENCE_DIR

from counteroffer._definitions import definitions

RTOL = 4e-15
# Functions whose reference table has another layout are checked by their own tests
# (the definition's `reference`, e.g. tests/cpp/test_trade_reference.cpp).
NAMES = [s.name for s in co.catalogue if not definitions().get(s.name, {}).get("reference")]

# Rows where the library is known to disagree with its table, each with the issue as
# reported to the core engineer; keyed by (function, row inputs).  Each is checked to
# still disagree, so a fixed library makes this test fail until the entry is removed.
KNOWN_LIB_ISSUES: dict = {}


@pytest.fixture(autouse=True)
def _tables_span_implausible_values():
    """The tables deliberately include rates above 100% a year and breakdown
    probabilities above 0.5: valid values outside the plausible ranges, which warn by
    default.  These tests check values and statuses, not that warning (test_api.py does)."""
    with co.errstate(implausible="ignore"):
        yield


def key(name, spec, r):
    return (name, tuple(r[a.name] for a in spec.args if a.name in r))


def count_value(text):
    """A count column as a Python int when it is an integer literal (the tables hold
    int64 values, some beyond 2**53)."""
    try:
        return int(text)
    except ValueError:
        return float(text)


def representable(spec, r):
    """False when a count is an integer that no double holds exactly: the Python
    package then raises (its arguments pass through cto_call as doubles)."""
    for a in spec.args:
        if a.kind == 5 and a.name in r:
            v = count_value(r[a.name])
            if isinstance(v, int) and int(float(v)) != v:
                return False
    return True


def load(name):
    path = REFERENCE_DIR / f"{name}.csv"
    if not path.exists():
        pytest.fail(f"reference table {path} is missing (the core's tables cover every "
                    "catalogue function)")
    with open(path, newline="") as f:
        rows = list(csv.DictReader(f))
    assert rows, f"{path} has no rows"
    return rows


def scale(spec, row):
    """The money scale of a row: the largest |money argument| (at least 1e-300)."""
    money = [abs(float(row[a.name])) for a in spec.args if a.kind == 0 and a.name in row]
    money = [m for m in money if math.isfinite(m)]
    if not any(a.kind == 0 for a in spec.args):
        return 1.0  # dimensionless results (factors, rates): absolute 1e-15 near zero
    return max(money + [1e-300])


@pytest.mark.parametrize("name", NAMES)
def test_reference_table_arrays(name):
    spec = next(s for s in co.catalogue if s.name == name)
    fn = getattr(co, name)
    all_rows = load(name)
    header = list(all_rows[0])
    rows = [r for r in all_rows if representable(spec, r)]
    for r in all_rows:
        if not representable(spec, r):  # see representable(): a ValueError, not a guess
            with pytest.raises(ValueError, match="cannot represent exactly"):
                fn(*[count_value(r[a.name]) if a.kind == 5 else float(r[a.name])
                     for a in spec.args if a.name in r])
    known = {i for i, r in enumerate(rows) if key(name, spec, r) in KNOWN_LIB_ISSUES}
    # a table may leave out trailing arguments with defaults (appended later)
    present = [a for a in spec.args if a.name in header]
    assert header[: len(present)] == [a.name for a in present]
    assert all(a.has_default for a in spec.args[len(present):])
    out_names = [o for o, _h in spec.outputs]
    assert header[len(present)] == "status"
    # a table may hold the first outputs only (outputs appended later are checked by the
    # function's own tests)
    n_cols = len(header) - len(present) - 2
    assert header[len(present) + 1: len(present) + 1 + n_cols] == out_names[:n_cols] \
        or out_names == ["value"]
    out_names = out_names[:n_cols]
    args = [np.array([float(r[a.name]) for r in rows]) if a.name in header
            else np.full(len(rows), spec.default_double(a)) for a in spec.args]
    with co.errstate(all="ignore"):
        got = fn(*args)
    outs = [got] if len(out_names) == 1 else [got[o] for o in out_names]
    statuses = fn.status_ufunc(*args)[-1]
    want_cols = header[len(present) + 1: len(present) + 1 + len(out_names)]
    worst = 0.0
    for i, r in enumerate(rows):
        want_status = r["status"]
        if i in known:
            assert co.status_name(int(statuses[i])) != want_status, (
                "fixed in the library? remove from KNOWN_LIB_ISSUES", r)
            continue
        assert co.status_name(int(statuses[i])) == want_status, (i, r)
        s = scale(spec, r)
        for k, (out, col) in enumerate(zip(outs, want_cols)):
            want = float(r[col])
            if spec.words(k):  # a coded output: the table's code, the package's word
                words = spec.words(k)  # (a no/yes output is a bool in Python)
                if math.isnan(want) and words == ("no", "yes"):
                    # an invalid row: a bool array holds False there; the status array
                    # (checked above) is what marks the row invalid
                    assert not out[i], (i, col, r)
                    continue
                expect = (None if math.isnan(want) else bool(want) if words == ("no", "yes")
                          else words[int(want)])
                assert out[i] == expect, (i, col, r)
                continue
            g = float(out[i])
            if math.isnan(want):
                assert math.isnan(g), (i, col, r, g)
                continue
            err = abs(g - want)
            tol = RTOL * abs(want) + RTOL * s
            worst = max(worst, err / (abs(want) + s))
            assert err <= tol, (i, col, g, want, r["source"])
    print(f"{name}: {len(rows)} rows, worst relative error {worst:.2e}")


@pytest.mark.parametrize("name", NAMES)
def test_reference_table_scalar_calls(name):
    """The same rows through the scalar path: float out, ValueError for invalid rows,
    the package's warning for no_deal / indeterminate / no_convergence."""
    spec = next(s for s in co.catalogue if s.name == name)
    fn = getattr(co, name)
    rows = load(name)
    n_present = len([a for a in spec.args if a.name in rows[0]])
    first_out = list(rows[0])[n_present + 1]
    for r in rows:
        if key(name, spec, r) in KNOWN_LIB_ISSUES:
            continue  # checked in test_reference_table_arrays
        if not representable(spec, r):
            with pytest.raises(ValueError, match="cannot represent exactly"):
                fn(*[count_value(r[a.name]) if a.kind == 5 else float(r[a.name])
                     for a in spec.args[:n_present]])
            continue
        vals = []
        for a in spec.args[:n_present]:  # left-out trailing arguments take their defaults
            v = count_value(r[a.name]) if a.kind == 5 else float(r[a.name])
            if a.kind == 4 and v in (0.0, 1.0):
                v = bool(v)  # booleans as Python bools
            elif a.kind == 6 and v == int(v) and 0 <= v < len(a.choices):
                v = a.choices[int(v)]  # choices as their strings
            elif a.kind == 7 and v == -math.inf:
                v = None  # an absent walk-away option
            vals.append(v)
        status = r["status"]
        if status == "invalid":
            with pytest.raises(ValueError, match=rf"^{name}: \w+ = .* is invalid"):
                fn(*vals)
            continue
        with warnings.catch_warnings(record=True) as w:
            warnings.simplefilter("always")
            res = fn(*vals)
        classes = {type(m.message) for m in w}
        expected = {"ok": set(), "no_deal": {co.NoDealWarning},
                    "indeterminate": {co.IndeterminateWarning},
                    "no_convergence": {co.NoConvergenceWarning}}[status]
        assert classes == expected, (r, classes)
        g = res if len(spec.outputs) == 1 else getattr(res, spec.outputs[0][0])
        assert isinstance(g, float)
        want = float(r[first_out])
        if math.isnan(want):
            assert math.isnan(g)
        else:
            assert abs(g - want) <= RTOL * (abs(want) + scale(spec, r)), (r, g)
