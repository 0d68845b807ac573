"""Valid values that look like typos: a warning of the package's own, configurable like
the other statuses, the value used as given (issue 14 point 2).

The thresholds checked here are the issue's (common practice, no source): a rate above 1
(100% a year), more than 3650 days between offers, a breakdown probability above 0.5 a
round; they come from the library (cto_arg_plausible_range).
Expected values: standard compounding (common practice, no source), written here.
"""

import warnings

import numpy as np
import pytest

import counteroffer as co
from counteroffer import _core


def spec(name):
    return next(s for s in co.catalogue if s.name == name)


def plausible(name, arg):
    return next(a for a in spec(name).args if a.name == arg).plausible


def test_ranges_come_from_the_library():
    for s in co.catalogue:  # cto_arg_plausible_range: the one definition of each function
        for j, a in enumerate(s.args):
            assert a.plausible == _core.arg_plausible_range(s.id, j)
    assert plausible("round_factor", "rate")[1] == 1.0
    assert plausible("share_from_rates", "days")[1] == 3650.0
    assert plausible("breakdown_share", "breakdown_prob")[1] == 0.5
    assert plausible("share", "own_factor") is None  # a factor's domain is its range


def test_a_rate_typed_as_a_whole_number_warns_and_is_used_as_given():
    with pytest.warns(co.ImplausibleInputWarning,
                      match=r"^round_factor: rate = 8\.0 is outside its plausible range 0 to "
                            r"1: .*percentage typed as a whole number"):
        got = co.round_factor(8.0, 30)
    assert got == pytest.approx(9.0 ** (-30 / 365), rel=1e-15)  # 800% a year, as given
    assert issubclass(co.ImplausibleInputWarning, co.CounterofferWarning)


def test_plausible_values_do_not_warn():
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        co.share_from_rates(0.08, 0.12, 3650)
        co.breakdown_share(0.9, 0.9, 0.5, 0.1, 0.1)
        co.share_from_rates(np.array([0.0, 1.0]), 0.12, 30)


def test_arrays_count_and_locate_the_implausible_values():
    days = np.array([[30.0, 4000.0], [14.0, 5000.0]])
    with pytest.warns(co.ImplausibleInputWarning,
                      match=r"days = 4000\.0 is outside its plausible range 0 to 3650 in 2 of "
                            r"4 values \(first at index \(0, 1\)\)"):
        co.share_from_rates(0.1, 0.12, days)


def test_the_policy_turns_it_off_or_into_an_error():
    with co.errstate(implausible="ignore"), warnings.catch_warnings():
        warnings.simplefilter("error")
        co.breakdown_share(0.9, 0.9, [0.7, 0.1], 0.1, 0.1)
    with co.errstate(implausible="raise"), pytest.raises(co.ImplausibleInputError,
                                                         match="breakdown_prob = 0.7"):
        co.breakdown_share(0.9, 0.9, 0.7, 0.1, 0.1)
    assert co.geterr()["implausible"] == "warn"


def test_invalid_values_are_reported_as_invalid_only():
    # 1.5 is outside [0, 1]: an invalid probability, not an implausible one
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        with pytest.raises(co.InvalidArgumentError, match="breakdown_prob = 1.5"):
            co.breakdown_share(0.9, 0.9, 1.5, 0.1, 0.1)
