"""Hypothesis property tests: broadcast shapes, dtype, NaN, own + other = surplus,
monotonicity.

Sources of the properties: NumPy's broadcasting rules (numpy.broadcast_shapes, the
reference implementation); the contract (solve: own and other shares of a rational deal
add up to the surplus; NaN input is an invalid argument); Rubinstein (1982) main
theorem (own share rises with own patience and falls with the other side's: the
closed form S (1 - d2)/(1 - d1 d2) is increasing in d1, decreasing in d2); Baron &
Ferejohn (1989) (the proposer gets at least a partner's share).
("models s.N": docs/models/complete-information.md; "the contract":
docs/reference/functions.md.)
"""

import math

import numpy as np
import pytest
from hypothesis import assume, given
from hypothesis import strategies as st
from hypothesis.extra import numpy as hnp

import counteroffer as co

unit = st.floats(0.0, 1.0)
open_unit = st.floats(0.0, 0.999999)
money = st.floats(1e-6, 1e9)


@given(hnp.mutually_broadcastable_shapes(num_shapes=4, max_dims=3, max_side=4))
def test_broadcast_shapes_match_numpy(shapes):
    in_shapes, result = shapes.input_shapes, shapes.result_shape
    args = [np.full(in_shapes[0], 0.9), np.full(in_shapes[1], 0.8),
            np.full(in_shapes[2], 2.0), np.full(in_shapes[3], True)]
    got = co.share(*args)
    assert np.shape(got) == np.broadcast_shapes(*in_shapes) == result
    if result == ():  # 0-d inputs only are scalars: a Python float (the package's rule)
        assert type(got) is float
    else:
        assert got.dtype == np.float64


@given(hnp.arrays(np.float32, hnp.array_shapes(max_dims=2, max_side=5), elements=unit),
       st.sampled_from([np.float64, np.float32, np.int64, np.int8, np.bool_]))
def test_result_dtype_is_float64(d1, dtype):
    other = np.ones(d1.shape, dtype=dtype) if dtype is not np.bool_ else np.zeros(d1.shape, bool)
    with co.errstate(all="ignore"):
        got = co.share(d1, other * 0 + 0.5 if dtype is not np.bool_ else other)
    assert np.asarray(got).dtype == np.float64 and np.shape(got) == d1.shape


@given(hnp.arrays(np.float64, st.integers(1, 30), elements=st.one_of(unit, st.just(math.nan))))
def test_nan_in_is_invalid_and_gives_nan_out(d1):
    # the contract: NaN input is an invalid argument; the documented array policy
    # with errstate(invalid="ignore") gives NaN out for exactly those elements.
    with co.errstate(invalid="ignore", indeterminate="ignore"):
        got = co.share(d1, 0.5)
    assert np.array_equal(np.isnan(got), np.isnan(d1))
    if np.isnan(d1).any():
        with pytest.raises(ValueError, match="own_factor = nan is invalid"):
            co.share(d1, 0.5)


@given(open_unit, open_unit, st.floats(0.0, 0.5), st.floats(0, 0.4), st.floats(0, 0.4),
       st.floats(0, 0.3), st.floats(0, 0.3), st.booleans(), money)
def test_solve_shares_add_up_to_the_surplus(dA, dB, p, bA, bB, gA, gB, opens, S):
    # the contract 'solve': a rational deal splits the whole surplus
    with co.errstate(no_deal="ignore"):
        r = co.solve(dA, dB, p, bA * S, bB * S, gA * S, gB * S, surplus=S, own_opens=opens)
    if r.rational:
        assert math.isclose(r.own_share + r.other_share, S, rel_tol=4e-15)
        assert -1e-12 * S <= r.own_share <= S * (1 + 1e-12)


@given(st.lists(open_unit, min_size=2, max_size=40), open_unit, st.booleans())
def test_share_rises_with_own_patience(d1s, d2, opens):
    # Rubinstein (1982): S (1 - d2)/(1 - d1 d2) is non-decreasing in d1
    d1 = np.sort(np.array(d1s))
    got = co.share(d1, d2, own_opens=opens)
    assert np.all(np.diff(got) >= -1e-15)


@given(open_unit, st.lists(open_unit, min_size=2, max_size=40), st.booleans())
def test_share_falls_with_other_patience(d1, d2s, opens):
    # Rubinstein (1982): the closed form is non-increasing in d2
    d2 = np.sort(np.array(d2s))
    got = co.share(d1, d2, own_opens=opens)
    assert np.all(np.diff(got) <= 1e-15)


@given(st.floats(0.0, 1.0), st.integers(1, 200), money)
def test_majority_proposer_gets_at_least_a_partner(d, n, S):
    # Baron & Ferejohn (1989): proposer S (1 - d (q-1)/n) >= partner S d / n
    q = n // 2 + 1
    prop = co.majority_share(d, n, surplus=S)
    if q >= 2:
        assert prop >= co.majority_share(d, n, role="partner", surplus=S) * (1 - 1e-15)


@given(open_unit, open_unit, money)
def test_first_mover_advantage_is_the_difference_of_shares(d1, d2, S):
    # models s.10: opener share minus responder share
    got = co.first_mover_advantage(d1, d2, S)
    diff = co.share(d1, d2, S, True) - co.share(d1, d2, S, False)
    assert math.isclose(got, diff, rel_tol=1e-12, abs_tol=1e-15 * S)


@given(st.floats(0.01, 0.99), open_unit, st.booleans())
def test_implied_factor_inverts_share(d1, d2, opens):
    # the inverse problem of Rubinstein (1982): share(implied_factor(s)) = s
    assume(d2 > 1e-3)
    s = co.share(d1, d2, own_opens=opens)
    with co.errstate(all="ignore"):
        f = co.implied_factor(s, d2, opens)
    if not math.isnan(f):
        assert math.isclose(co.share(f, d2, own_opens=opens), s, rel_tol=1e-12, abs_tol=1e-15)
