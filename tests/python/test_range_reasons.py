"""share_range and share_swing in Python speak the library's reasons: an invalid input
raises InvalidArgumentError with the reason cto_range_explain gives (the argument by its
name and its rule; the package keeps no rules of its own), the other statuses warn with
it, and RangeResult.reason / SwingResult.reason carry it ("ok", or "ok, but ..." for a
range end that looks like a typed percentage).

Sources: the rules are docs/models/ranges.md "Inputs, options, outputs" (the engine's
checks); the words are the project's contract, docs/models/ranges.md "Reasons in words"
(the C side is tests/cpp/test_range_reasons.cpp); the plausible range of a rate (0 to 1 a
year) is common practice, no source.  The deals are fictional.
"""

import pytest

import counteroffer as co
from counteroffer import _ranges

DEAL = dict(own_rate=0.08, other_rate=(0.04, 0.16), days=30)
QUICK = dict(replicates=4, log2_start=6, log2_max=8, digits=2)


@pytest.mark.parametrize("kw, reason", [
    (dict(other_rate=(0.16, 0.04)), "other_rate: low 0.16 is above high 0.04"),
    (dict(other_rate=co.pert(0.16, 0.1, 0.04)), "other_rate: low 0.16 is above high 0.04"),
    (dict(other_rate=(0.04, 0.2, 0.16)), "other_rate: mode 0.2 is outside low 0.04 to high 0.16"),
    (dict(days=co.triangular(20, 50, 40)), "days: mode 50 is outside low 20 to high 40"),
    (dict(own_fallback=(float("nan"), 5)), "own_fallback: low is empty or not a number"),
    (dict(other_fallback=(0, float("inf"))),
     "other_fallback: high = infinity is not a finite number"),
    (dict(own_outside=(-1e308, 1e308)),
     "own_outside: the range -1e+308 to 1e+308 is too wide (high - low is not a finite "
     "number)"),
    (dict(breakdown_prob=(0.0, 1.5)),
     "breakdown_prob at its high: breakdown_prob = 1.5 is outside 0 to 1"),
    (dict(breakdown_prob=(0.5, 2.5)),
     "breakdown_prob at its midpoint: breakdown_prob = 1.5 is outside 0 to 1"),
    (dict(own_rate=-0.1), "own_rate = -0.1 is below 0"),
    (dict(basis=0), "basis = 0 must be above 0"),
    (dict(own_opens=(0, 1)), "own_opens must be a fixed 0 or 1 (FALSE or TRUE), not a range"),
    (dict(continuous=co.uniform(0, 1)),
     "continuous must be a fixed 0 or 1 (FALSE or TRUE), not a range"),
])
def test_invalid_input_has_the_librarys_reason(kw, reason):
    args = dict(DEAL, **kw)
    for fn in (co.share_range, co.share_swing):  # the swing checks its inputs alike
        with pytest.raises(co.InvalidArgumentError) as e:
            fn(**args)
        assert str(e.value) == f"{fn.__name__}: {reason}"
        assert isinstance(e.value, ValueError)


@pytest.mark.parametrize("kw, reason", [
    (dict(probabilities=0.0), "probability 0 is not strictly between 0 and 1"),
    (dict(probabilities=(0.5, 1.0)),
     "probability 1 (number 2 of the 2 given) is not strictly between 0 and 1"),
    (dict(probabilities=[0.5] * 40), "probabilities: 40 given, at most 32"),
    (dict(probabilities=()), "probabilities: none given (1 to 32 are needed)"),
    (dict(replicates=1),
     "replicates = 1: at least 2 (the error bars come from the spread between replicates)"),
    (dict(replicates=300), "replicates = 300: at most 256"),
    (dict(digits=0), "digits = 0: 1 to 15 significant digits can be targeted"),
    (dict(log2_start=0),
     "log2_start = 0: 1 to 24 (the first sample has 2^log2_start points per replicate)"),
    (dict(log2_max=25), "log2_max = 25: at most 24"),
    (dict(replicates=32, log2_max=20),
     "replicates x 2^log2_max = 32 x 2^20 is above 2^24 draws in all (the cap on working "
     "memory): lower log2_max to 19 or replicates to 16"),
    (dict(threads=65), "threads = 65: 0 to 64 (0 or 1: the calling thread only)"),
])
def test_invalid_option_has_the_librarys_reason(kw, reason):
    with pytest.raises(co.InvalidArgumentError) as e:
        co.share_range(**DEAL, **kw)
    assert str(e.value) == f"share_range: {reason}"


def test_no_rules_on_the_python_side():
    # The words come from the library only: the package keeps no table of rules.
    for name in ("OPTION_RULES", "RANGE_RULE", "FIXED_ONLY", "_reason", "_precision_message"):
        assert not hasattr(_ranges, name), name


def test_ok_and_a_range_end_that_looks_like_a_typed_percentage():
    assert co.share_range(**DEAL, **QUICK).reason == "ok"
    assert co.share_swing(**DEAL).reason == "ok"
    slip = ("ok, but other_rate high = 8 is outside the usual 0 to 1: above 100% a year: a "
            "percentage typed as a whole number? (8% is 0.08)")
    args = dict(DEAL, other_rate=(0.04, 8.0))
    with pytest.warns(co.ImplausibleInputWarning, match="other_rate"):
        assert co.share_range(**args, **QUICK).reason == slip
    with co.errstate(implausible="ignore"):
        assert co.share_swing(**args).reason == slip


def test_precision_not_reached_in_the_librarys_words():
    with pytest.warns(co.PrecisionNotReachedWarning) as w:
        r = co.share_range(**DEAL, digits=15, log2_max=11, probabilities=0.5)
    text = str(w[0].message)
    assert text == f"share_range: {r.reason}"
    assert text.startswith(
        "share_range: precision not reached: 15 significant digits not reached at 2^11 points "
        "per replicate (16 replicates): own share at p = 0.5 has ")
    assert text.endswith("; ask for fewer digits or raise log2_max (up to 20 with 16 replicates)")
    digits = r.own[0].digits
    assert f" has {digits} (" in text and digits < 15


def test_indeterminate_draws_in_the_librarys_words():
    # Both rates 0, no breakdown risk: many splits are equilibria (the combined model).
    with pytest.warns(co.IndeterminateWarning) as w:
        r = co.share_range(0, 0, 30, surplus=(50, 150), **QUICK)
    assert r.status == "indeterminate"
    assert str(w[0].message) == (
        "share_range: indeterminate: many splits are equilibria, so there is no single "
        "answer (indeterminate (both rates 0 or days 0, no breakdown): NaN shares) at the "
        "modes")
