"""The Python surface: signatures, types, broadcasting, out=, pandas, the error policy.

Expected values are the published closed forms, evaluated here independently:
Rubinstein (1982) main theorem, x = S (1 - d2)/(1 - d1 d2) for the opener (Muthoo 1999
ch.3; models s.1).
("models s.N": docs/models/complete-information.md; "the contract":
docs/reference/functions.md.)
"""

import inspect
import math
import threading
import time
import warnings

import numpy as np
import pandas as pd
import pytest

import counteroffer as co
from counteroffer import _core


def rubinstein(d1, d2, s=1.0, opens=True):
    """Rubinstein (1982) main theorem, written here (models s.1)."""
    x = s * (1 - d2) / (1 - d1 * d2)
    return x if opens else s * d1 * (1 - d2) / (1 - d1 * d2)


def expected_signature(row):
    """The Python signature text of one row of the C table (_core.catalogue()), from the
    header's documented encodings of a default as a double: bool 0/1, a choice's index,
    -infinity for an absent optional value; written here, apart from the package's own
    conversion (counteroffer/_spec.py)."""
    parts = []
    for a in row["args"]:
        if not a["has_default"]:
            parts.append(a["name"])
            continue
        d = a["default"]
        if a["kind"] == _core.ARG_BOOL:
            value = bool(d)
        elif a["kind"] == _core.ARG_CHOICE:
            value = a["choices"][int(d)]
        elif a["kind"] == _core.ARG_OPTIONAL and d == -math.inf:
            value = None
        elif row["name"] == "majority_share" and a["name"] == "votes_needed":
            value = None  # the contract: None = simple majority (the table's 0)
        elif float(d).is_integer():
            value = int(d)
        else:
            value = d
        parts.append(f"{a['name']}={value!r}")
    return ", ".join(parts)


def shown_signature(fn):
    params = [p for p in inspect.signature(fn).parameters.values() if p.name != "out"]
    return ", ".join(p.name if p.default is inspect.Parameter.empty else f"{p.name}={p.default!r}"
                     for p in params)


def test_every_table_row_is_a_function_with_the_tables_signature():
    # Source: the library's function table (the one definition of each function).
    rows = _core.catalogue()
    assert [s.name for s in co.catalogue] == [r["name"] for r in rows]
    for row in rows:
        fn = getattr(co, row["name"])
        assert shown_signature(fn) == expected_signature(row), row["name"]
        assert inspect.signature(fn).parameters["out"].kind is inspect.Parameter.KEYWORD_ONLY


def test_signatures_match_the_published_contract_on_samples():
    # Spot checks against the function contract (docs/reference/functions.md, from the
    # design contract): the combined model and the two Python-only defaults.
    assert shown_signature(co.solve) == (
        "own_factor, other_factor, breakdown_prob=0, own_fallback=0, other_fallback=0, "
        "own_inside=0, other_inside=0, own_outside=None, other_outside=None, surplus=1, "
        "own_opens=True")
    assert shown_signature(co.majority_share) == (
        "factor, parties, votes_needed=None, role='proposer', surplus=1")


def test_every_function_is_a_ufunc_underneath():
    for spec in co.catalogue:
        fn = getattr(co, spec.name)
        assert isinstance(fn.ufunc, np.ufunc)
        assert fn.ufunc.nin == len(spec.args) and fn.ufunc.nout == len(spec.outputs)


def test_scalar_in_gives_python_float():
    x = co.share(0.9, 0.95)
    assert type(x) is float
    assert x == pytest.approx(rubinstein(0.9, 0.95), rel=1e-15)
    assert type(co.share(np.float64(0.9), np.float32(0.95))) is float


def test_broadcasting_lists_arrays_scalars():
    d1 = np.array([[0.5], [0.9], [0.99]])
    d2 = [0.5, 0.8]
    got = co.share(d1, d2, surplus=10.0, own_opens=[True, False])
    assert got.shape == (3, 2) and got.dtype == np.float64
    want = np.array([[rubinstein(a, b, 10.0, o) for b, o in zip(d2, [True, False])]
                     for a in d1[:, 0]])
    np.testing.assert_allclose(got, want, rtol=1e-15)


def test_integer_and_bool_arrays_are_accepted():
    got = co.group_share(0.9, np.array([3, 4]), position=np.array([0, 1]))
    # Herrero (1985); OR (1990) s.3.13: S d^k (1 - d)/(1 - d^n)
    want = [(1 - 0.9) / (1 - 0.9 ** 3), 0.9 * (1 - 0.9) / (1 - 0.9 ** 4)]
    np.testing.assert_allclose(got, want, rtol=1e-14)
    got = co.share(0.9, 0.8, own_opens=np.array([True, False]))
    np.testing.assert_allclose(got, [rubinstein(0.9, 0.8), rubinstein(0.9, 0.8, opens=False)],
                               rtol=1e-15)


def test_out_argument_is_written_and_returned():
    out = np.full(4, -1.0)
    res = co.share(np.linspace(0.1, 0.9, 4), 0.5, out=out)
    assert res is out
    np.testing.assert_allclose(out, [rubinstein(d, 0.5) for d in np.linspace(0.1, 0.9, 4)],
                               rtol=1e-15)
    outs = tuple(np.empty(2) for _ in co.solve.spec.outputs)
    r = co.solve([0.9, 0.8], 0.9, out=outs)
    assert r["own_share"] is outs[0]
    np.testing.assert_allclose(outs[0] + outs[1], 1.0, rtol=1e-15)


def test_pandas_series_in_gives_series_out_with_index():
    idx = pd.Index(["Quillon", "Arden", "Tallis"], name="deal")
    s = pd.Series([0.9, 0.95, 0.99], index=idx)
    got = co.share(s, 0.9, surplus=pd.Series([1e6, 2e6, 3e6], index=idx))
    assert isinstance(got, pd.Series)
    assert got.index.equals(idx)
    np.testing.assert_allclose(got.to_numpy(),
                               [rubinstein(d, 0.9, m) for d, m in zip(s, [1e6, 2e6, 3e6])],
                               rtol=1e-15)
    df = co.solve(s, 0.9)
    assert isinstance(df, pd.DataFrame) and list(df.columns) == [
        "own_share", "other_share", "binding", "rational", "own_delay_loss",
        "other_delay_loss", "opening_advantage", "delayed"]
    with pytest.raises(ValueError, match="share one index"):
        co.share(s, pd.Series([0.9, 0.9, 0.9]))


def test_scalar_invalid_raises_value_error_naming_argument_and_value():
    with pytest.raises(ValueError, match=r"^share: own_factor = 1\.5 is invalid \("):
        co.share(1.5, 0.9)
    with pytest.raises(co.InvalidArgumentError, match=r"other_factor = nan"):
        co.share(0.5, float("nan"))
    with pytest.raises(ValueError, match=r"parties = 3\.5 is invalid"):
        co.group_share(0.9, 3.5)  # the contract: 3.5 parties is an error, not 3
    with pytest.raises(ValueError, match=r"utility = 'linear' is invalid"):
        co.risk_averse_share(0.9, 0.9, 0.5, 0.5, utility="linear")
    with pytest.raises(ValueError, match=r"surplus = 'lots' is invalid"):
        co.share(0.9, 0.9, surplus="lots")
    # scalar calls raise whatever errstate says about arrays
    with co.errstate(invalid="ignore"), pytest.raises(ValueError):
        co.share(-0.1, 0.9)


def test_choices_are_case_insensitive_strings_and_arrays():
    # Baron & Ferejohn (1989): partner S d/n
    assert co.majority_share(0.9, 5, 3, role="PARTNER") == pytest.approx(0.9 / 5, rel=1e-15)
    got = co.majority_share(0.9, 5, 3, role=np.array(["proposer", "partner"]))
    np.testing.assert_allclose(got, [1 - 0.9 * 2 / 5, 0.9 / 5], rtol=1e-15)
    with pytest.raises(ValueError, match="role = 'chair'"):
        co.majority_share(0.9, 5, 3, role=["proposer", "chair"])


def test_array_invalid_raises_by_default_with_count_and_index():
    with pytest.raises(ValueError, match=r"own_factor = 1\.5 is invalid .* in 1 of 3 elements "
                                         r"\(first at index \(2,\)\)"):
        co.share([0.5, 0.6, 1.5], 0.9)


def test_array_invalid_warn_and_ignore_give_nan():
    x = np.array([0.5, np.nan, 2.0])
    with co.errstate(invalid="warn"):
        with pytest.warns(co.InvalidArgumentWarning, match="2 of 3 elements"):
            got = co.share(x, 0.9)
    assert got[0] == pytest.approx(rubinstein(0.5, 0.9), rel=1e-15)
    assert np.isnan(got[1:]).all()
    with co.errstate(invalid="ignore"), warnings.catch_warnings():
        warnings.simplefilter("error")
        assert np.isnan(co.share(x, 0.9)[1:]).all()


def test_no_deal_returns_no_deal_payoff_with_own_warning_class():
    # the contract: no deal returns own's no-deal payoff, never the formula's value
    with pytest.warns(co.NoDealWarning):
        assert co.share(0.9, 0.9, surplus=-5.0) == 0.0
    with pytest.warns(co.NoDealWarning, match="1 of 2 elements"):
        got = co.inside_option_share(0.9, 0.9, [0.7, 0.1], 0.5)
    assert got[0] == 0.7  # own's status-quo value g_own (Muthoo 1999 ch.6)
    with co.errstate(no_deal="raise"), pytest.raises(co.NoDealError):
        co.share(0.9, 0.9, surplus=[1.0, -1.0])
    assert issubclass(co.NoDealWarning, co.CounterofferWarning)


def test_indeterminate_gives_nan_with_warning():
    # Both factors 1: every split is an equilibrium (models s.1)
    with pytest.warns(co.IndeterminateWarning):
        assert math.isnan(co.share(1.0, 1.0))
    with co.errstate(indeterminate="raise"), pytest.raises(co.IndeterminateError):
        co.fixed_cost_share([0.1, 0.1], [0.2, 0.1])


def test_errstate_nests_restores_and_rejects_bad_settings():
    before = co.geterr()
    assert before["invalid"] == "raise" and before["no_deal"] == "warn"
    with co.errstate(all="ignore"):
        assert set(co.geterr().values()) == {"ignore"}
        with co.errstate(no_deal="raise"):
            assert co.geterr()["no_deal"] == "raise"
        assert co.geterr()["no_deal"] == "ignore"
    assert co.geterr() == before
    with pytest.raises(ValueError):
        with co.errstate(invalid="shout"):
            pass
    with pytest.raises(TypeError):
        co.seterr(overflow="raise")
    old = co.seterr(no_deal="ignore")
    try:
        assert co.share(0.9, 0.9, surplus=-1.0) == 0.0
    finally:
        co.seterr(**old)


def test_solve_scalar_result_object_and_array_mapping():
    # Outside option principle (Binmore, Shaked & Sutton 1989; check value(s) 42):
    # d = 0.9, w_B = 0.5: A proposing gets 0.5 and B's option binds.
    r = co.solve(0.9, 0.9, other_outside=0.5)
    assert isinstance(r, co.SolveResult)
    assert r.own_share == pytest.approx(0.5, abs=1e-15)
    assert r.other_share == pytest.approx(0.5, abs=1e-15)
    assert r.binding == "theirs" and r.rational is True
    with pytest.raises(Exception):
        r.own_share = 1.0  # frozen
    arr = co.solve([0.9, 0.9], 0.9, other_outside=[0.5, 0.3])
    assert isinstance(arr, co.ArrayResult)
    assert set(arr) == {"own_share", "other_share", "binding", "rational", "own_delay_loss",
                        "other_delay_loss", "opening_advantage", "delayed"}
    np.testing.assert_allclose(arr["own_share"], [0.5, 1 / 1.9], rtol=1e-15)  # rows 42, 40
    # the same words as the scalar result (issue 14 point 3)
    assert arr.binding.tolist() == ["theirs", "none"]
    assert arr.rational.dtype == bool and arr.rational.tolist() == [True, True]
    rec = arr.to_records()
    assert rec.own_share.shape == (2,)
    with pytest.warns(co.NoDealWarning):
        nd = co.solve(0.9, 0.9, own_outside=0.6, other_outside=0.5)  # check value(s) 83
    assert nd.rational is False and nd.own_share == pytest.approx(0.6, abs=1e-15)


def test_tally_is_per_thread():
    # Each thread's call must see only its own statuses (numpy runs the loop on the
    # calling thread; the tally is thread-local).
    errors = []

    def work(k):
        try:
            x = np.full(50_000, 0.5)
            x[k] = 5.0  # one invalid element per call, at a thread-specific index
            for _ in range(20):
                try:  # warnings.catch_warnings is process-global; exceptions are not
                    co.share(x, 0.9)
                except ValueError as e:
                    msg = str(e)
                else:
                    msg = "no error"
                assert f"1 of 50000 elements (first at index ({k},))" in msg, msg
        except Exception as e:  # pragma: no cover - reported below
            errors.append(e)

    threads = [threading.Thread(target=work, args=(k,)) for k in (3, 777, 40_000, 49_999)]
    for t in threads:
        t.start()
    for t in threads:
        t.join()
    assert not errors, errors


def test_help_gives_an_overview_and_docstrings_are_complete():
    assert "Functions" in co.__doc__ and "share_from_rates" in co.__doc__
    assert "not financial, legal or tax advice" in co.__doc__
    for spec in co.catalogue:
        doc = " ".join(getattr(co, spec.name).__doc__.split())
        for part in ("Formula", "Source", "Parameters", "Examples", "Fictional scenario",
                     spec.source, "not financial, legal or tax advice"):
            assert part in doc, (spec.name, part)
        for a in spec.args:
            assert f"{a.name} :" in doc


def test_version_matches_header():
    import re
    from conftest import ROOT

    header = (ROOT / "lib/include/counteroffer/counteroffer.h").read_text()
    parts = [re.search(rf"#define CTO_VERSION_{p} (\d+)", header).group(1)
             for p in ("MAJOR", "MINOR", "PATCH")]
    assert co.__version__ == ".".join(parts)


@pytest.mark.parametrize("threads", [1, 2, 3])
def test_long_loops_split_over_threads_report_like_one(threads):
    # The statuses of a loop split over threads are merged: counts add, the first
    # invalid element and its value are the first in array order.
    old = co.set_num_threads(threads)
    try:
        n = 400_003
        x = np.full(n, 0.9)
        x[[250_000, 399_999]] = [7.0, 8.0]
        x[300_000] = 1.0  # with other_factor 1: indeterminate
        other = np.full(n, 0.5)
        other[300_000] = 1.0
        with pytest.raises(ValueError, match=r"own_factor = 7\.0 is invalid .* in 2 of 400003 "
                                             r"elements \(first at index \(250000,\)\)"):
            co.share(x, other)
        with co.errstate(invalid="ignore"), pytest.warns(co.IndeterminateWarning,
                                                         match="1 of 400003"):
            got = co.share(x, other)
        assert np.isnan(got[[250_000, 300_000, 399_999]]).all()
        np.testing.assert_allclose(np.delete(got, [250_000, 300_000, 399_999]),
                                   (1 - 0.5) / (1 - 0.9 * 0.5), rtol=1e-15)
    finally:
        co.set_num_threads(old)
    with pytest.raises(ValueError):
        co.set_num_threads(0)


def test_warnings_point_at_the_callers_line():
    # so that Python's once-per-location warning filters work on the user's code
    with pytest.warns(co.NoDealWarning) as rec:
        co.share(0.9, 0.9, surplus=-1.0)
    assert rec[0].filename == __file__
    with pytest.warns(co.NoDealWarning) as rec:
        co.share([0.9], 0.9, surplus=-1.0)
    assert rec[0].filename == __file__
    with co.errstate(invalid="warn"), pytest.warns(co.InvalidArgumentWarning) as rec:
        co.share([2.0], 0.9)
    assert rec[0].filename == __file__


def test_the_loop_runs_with_the_gil_released():
    # While one thread is inside a long share() loop, another thread keeps running
    # Python code: with the GIL held, the main thread would stall for the whole loop.
    x = np.random.default_rng(3).uniform(0, 0.99, 10_000_000)
    old = co.set_num_threads(1)
    started, gaps = threading.Event(), []
    duration = []

    def work():
        started.set()
        t = time.perf_counter()
        co.share(x, 0.9)
        duration.append(time.perf_counter() - t)

    try:
        th = threading.Thread(target=work)
        th.start()
        started.wait()
        last = time.perf_counter()
        while th.is_alive():
            now = time.perf_counter()
            gaps.append(now - last)
            last = now
        th.join()
    finally:
        co.set_num_threads(old)
    assert max(gaps) < 0.5 * duration[0], (max(gaps), duration[0])
