"""Which walk-away value binds and whether a deal is rational, as words and bools on
every Python surface: scalar results, NumPy arrays, DataFrames, dask and xarray
(issue 14 point 3: "none", "ours", "theirs", "both", the same words everywhere).

Expected regimes: the outside option principle (Binmore, Shaked & Sutton 1989; Muthoo
1999 ch.5): with factors 0.9 and own proposing, a walk-away value binds when it exceeds
what the other side gets in the Rubinstein split, d/(1 + d) = 0.4737 of the surplus.
"""

import dask.array as da
import numpy as np
import pandas as pd
import pytest
import xarray as xr

import counteroffer as co
from counteroffer import _core

# (own_outside, other_outside) -> which binds, for factors 0.9/0.9, surplus 1, own opens
CASES = [
    (None, None, "none"),   # no options: Rubinstein split
    (0.0, 0.3, "none"),     # 0.3 < 0.4737: the option does not bind
    (0.0, 0.5, "theirs"),   # 0.5 > 0.4737: the other side's option binds
    (0.55, 0.0, "ours"),    # 0.55 > 0.4737, what own gets when responding
    (0.49, 0.49, "both"),   # w >= 0.9 (1 - w) for both sides, and 0.49 + 0.49 < 1
]


def _solve(own, other):
    return co.solve(0.9, 0.9, own_outside=own, other_outside=other)


@pytest.mark.parametrize("own,other,word", CASES)
def test_scalar_result_uses_the_words(own, other, word):
    assert _solve(own, other).binding == word


def test_the_words_match_the_headers_codes():
    # lib/include/counteroffer/counteroffer.h: CTO_BINDS_NONE/_OWN/_OTHER/_BOTH
    codes = co.solve.ufunc(np.full(5, 0.9), 0.9, 0.0, 0.0, 0.0, 0.0, 0.0,
                           [-np.inf, 0.0, 0.0, 0.55, 0.49], [-np.inf, 0.3, 0.5, 0.0, 0.49],
                           1.0, 1.0)[2]
    assert codes.tolist() == [_core.BINDS_NONE, _core.BINDS_NONE, _core.BINDS_OTHER,
                              _core.BINDS_OWN, _core.BINDS_BOTH]


def test_arrays_give_the_same_words_and_bools_as_scalar_calls():
    own = [c[0] for c in CASES]
    other = [c[1] for c in CASES]
    arr = co.solve(0.9, 0.9, own_outside=own, other_outside=other)
    assert arr.binding.tolist() == [c[2] for c in CASES]
    assert arr.binding.tolist() == [_solve(o, t).binding for o, t, _w in CASES]
    assert arr.rational.dtype == bool and arr.rational.all()
    with pytest.warns(co.NoDealWarning):  # 0.6 + 0.5 > 1: no rational deal
        nd = co.solve(0.9, 0.9, own_outside=[0.6, 0.0], other_outside=[0.5, 0.0])
    assert nd.rational.tolist() == [False, True]
    with pytest.warns(co.NoDealWarning):
        assert nd.rational.tolist()[0] is _solve(0.6, 0.5).rational


def test_undefined_binding_is_none_as_in_scalar_results():
    # both factors 1 and no breakdown risk: many equilibria (Rubinstein 1982), NaN shares
    with pytest.warns(co.IndeterminateWarning):
        r = co.solve(1.0, 1.0)
    with pytest.warns(co.IndeterminateWarning):
        arr = co.solve([1.0, 0.9], 1.0)
    assert arr.binding.tolist()[0] == r.binding


def test_dataframe_columns_are_words_and_bools():
    idx = pd.Index(["Pell line", "Garnet line"], name="deal")
    df = co.solve(pd.Series([0.9, 0.9], index=idx), 0.9,
                  other_outside=pd.Series([0.5, 0.3], index=idx))
    assert df["binding"].tolist() == ["theirs", "none"]
    assert df["rational"].dtype == bool


def test_dask_and_xarray_give_the_words_too():
    d = da.from_array(np.array([0.9, 0.9, 0.9]), chunks=2)
    res = co.solve(d, 0.9, other_outside=[0.5, 0.3, 0.5])
    assert res["binding"].compute(scheduler="synchronous").tolist() == ["theirs", "none",
                                                                       "theirs"]
    x = xr.DataArray([0.9, 0.9], dims=("deal",))
    got = co.solve(x, 0.9, other_outside=xr.DataArray([0.5, 0.3], dims=("deal",)))
    assert isinstance(got["binding"], xr.DataArray)
    assert got["binding"].values.tolist() == ["theirs", "none"]


def test_out_keeps_the_codes_the_caller_asked_for():
    outs = tuple(np.empty(2) for _ in range(len(co.solve.spec.outputs)))
    r = co.solve([0.9, 0.9], 0.9, other_outside=[0.5, 0.3], out=outs)
    assert r["binding"] is outs[2] and outs[2].tolist() == [_core.BINDS_OTHER, _core.BINDS_NONE]


def test_whole_number_outputs_are_ints_in_scalar_results_and_on_the_command_line():
    # offer_path with a two-offer deadline: agreement can come in round 1 or 2, so the
    # path uses 2 rounds (the game itself: at most `rounds` offers are made)
    import csv
    import io

    from counteroffer import _cli

    r = co.offer_path(0, 1e6, 0.9, 0.9, rounds=2)
    assert r.rounds_used == 2 and type(r.rounds_used) is int
    counts = [k for k in range(len(co.offer_path.spec.outputs)) if co.offer_path.spec.is_count(k)]
    assert co.offer_path.spec.output_names.index("rounds_used") in counts
    out = io.StringIO()
    _cli.run(["-f", "offer_path"], stdin=io.StringIO(
        "private_low,private_high,offerer_factor,responder_factor,rounds\n0,1e6,0.9,0.9,2\n"),
        stdout=out, stderr=io.StringIO())
    assert next(csv.DictReader(io.StringIO(out.getvalue())))["rounds_used"] == "2"
