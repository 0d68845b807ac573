"""Error messages name the function, the argument and the value (issue 14 point 7).

Sources: the catalogue's domains (the public header's argument kinds); Rubinstein
(1982): with own opening, own's share is (1 - d2)/(1 - d1 d2), which for d1 in [0, 1]
covers exactly [1 - d2, 1], so a share below 1 - d2 no own factor can produce.
"""

import numpy as np
import pandas as pd
import pytest

import counteroffer as co


@pytest.mark.parametrize("bad,shown,where", [
    ([0.9, "lots"], "'lots'", "(1,)"),
    ([[0.9, 0.8], [None, 0.5]], "None", "(1, 0)"),
    (np.array([0.9, "x"], dtype=object), "'x'", "(1,)"),
    (pd.Series([0.5, 0.6, "high"]), "'high'", "(2,)"),
])
def test_text_or_none_inside_an_array_names_the_argument(bad, shown, where):
    with pytest.raises(co.InvalidArgumentError,
                       match=rf"^share: own_factor = {shown} at index \{where[:-1]}\) is "
                             r"invalid \(a number is required"):
        co.share(bad, 0.9)


def test_none_inside_a_list_is_an_absent_option_where_the_scalar_call_allows_it():
    # solve: None = no walk-away option (the catalogue); in a list, element by element
    got = co.solve(0.9, 0.9, other_outside=[None, 0.5])
    assert got["binding"].tolist() == [co.solve(0.9, 0.9).binding,
                                       co.solve(0.9, 0.9, other_outside=0.5).binding]
    want = [co.solve(0.9, 0.9).own_share, co.solve(0.9, 0.9, other_outside=0.5).own_share]
    np.testing.assert_array_equal(got["own_share"], want)


def test_implied_factor_says_no_factor_produces_the_share():
    # 1 - 0.95 = 0.05 is the smallest share own can get by opening (Rubinstein 1982)
    # the reason is the library's (cto_explain): the share is within 0 to 1, but no
    # factor produces it with these other arguments
    with pytest.raises(co.InvalidArgumentError,
                       match=r"^implied_factor: observed_share = 0\.01 is invalid \(does not "
                             r"fit: no own factor from 0 to 1 .* as opener own gets at least "
                             r"1 - other_factor"):
        co.implied_factor(0.01, 0.95)
    with pytest.raises(co.InvalidArgumentError, match=r"observed_share = 0\.01 is invalid "
                                                      r"\(does not fit: no own factor from 0 to 1"):
        co.implied_factor([0.5, 0.01], 0.95)  # the same reason for an array element
    assert co.implied_factor(0.06, 0.95) >= 0.0  # just above the bound: reachable
    # outside 0 to 1 the argument's own domain is the reason
    with pytest.raises(co.InvalidArgumentError, match=r"observed_share = 1\.5 is invalid "
                                                      r"\(outside 0 to 1"):
        co.implied_factor(1.5, 0.95)


def test_shape_mismatch_names_the_function_and_the_arguments():
    with pytest.raises(ValueError, match=r"^share: the arguments cannot be broadcast to one "
                                         r"shape \(own_factor \(2,\), other_factor \(3,\)\)"):
        co.share([0.1, 0.2], [0.9, 0.3, 0.3])
    with pytest.raises(ValueError, match=r"^share: .*out \(5,\)"):
        co.share([0.1, 0.2], 0.9, out=np.empty(5))


def test_days_zero_warning_speaks_of_days():
    # No time between offers: no discounting, every split an equilibrium (the table's
    # statuses of share_from_rates and implied_rate)
    with pytest.warns(co.IndeterminateWarning, match=r"days = 0"):
        co.share_from_rates(0.1, 0.1, 0)
    with pytest.warns(co.IndeterminateWarning, match=r"1 of 2 elements.*days = 0"):
        co.share_from_rates(0.1, 0.1, [0, 14])
    with pytest.warns(co.IndeterminateWarning, match=r"days = 0"):
        co.implied_rate(0.5, 0.1, 0)


def test_invalid_element_of_a_series_names_its_label():
    s = pd.Series([0.5, 1.5], index=["Pell line", "Garnet line"])
    with pytest.raises(co.InvalidArgumentError, match=r"first at index \(1,\), label "
                                                      r"'Garnet line'"):
        co.share(s, 0.9)


def test_no_deal_is_explained_where_the_user_meets_it():
    # Rubinstein (1982) needs a positive surplus; without one no split is rational and
    # the result is own's no-deal payoff (the contract), which Calc shows as #N/A
    with pytest.warns(co.NoDealWarning, match=r"no rational deal.*#N/A in Calc.*no-deal "
                                              r"payoff"):
        assert co.share(0.9, 0.9, surplus=-5.0) == 0.0
    with pytest.warns(co.NoDealWarning, match=r"1 of 2 elements \(first at index \(1,\)\): "
                                              r"no rational deal"):
        co.share(0.9, 0.9, surplus=[1.0, -5.0])
    for spec in co.catalogue:
        doc = " ".join(getattr(co, spec.name).__doc__.split())
        if "no_deal" in spec.statuses:
            assert "No deal ------- When the surplus does not exceed" in doc, spec.name
            assert "#N/A" in doc and "no-deal payoff" in doc, spec.name
