"""share_range and share_swing in Python: inputs as tuples and distribution objects,
results, the error policy, and checks against sources outside the ranges engine.

Sources named beside each check:
* the share is monotone in each rate (Rubinstein 1982; docs/models/ranges.md, "The two
  examples"), so a
  quantile of the share is the share at the input's quantile (its complement for a
  decreasing dependence); the input quantiles come from scipy.stats (uniform, triang,
  beta with the Beta-PERT parameters of Vose 2008 / Malcolm et al. 1959), the share from
  the table's ``share_from_rates`` (its own 50-digit tests: tests/reference);
* degenerate ranges give the fixed-input result exactly (header ranges.h), and a fixed
  run is the table's share_from_rates;
* the swing's ends are share_from_rates at each end, the others at their modes
  (Howard 1988; Clemen & Reilly 2014 ch. 5: one-way sensitivity).

Fictional scenario: Ferncastle Foods and a regional distributor renegotiate a supply
contract, offers a month apart; our cost of capital is 8%, theirs 4% to 16%.
"""

import dataclasses
import math
import struct

import numpy as np
import pytest
import scipy.stats

import counteroffer as co


def pert_ppf(p, lo, mode, hi):
    """Beta-PERT quantile through scipy (Vose 2008: alpha = 1 + 4(m - lo)/(hi - lo))."""
    a = 1 + 4 * (mode - lo) / (hi - lo)
    return lo + (hi - lo) * scipy.stats.beta.ppf(p, a, 6 - a)


def tri_ppf(p, lo, mode, hi):
    return scipy.stats.triang.ppf(p, (mode - lo) / (hi - lo), loc=lo, scale=hi - lo)


def bits(x):
    return struct.pack("<d", x)


# ---- one uncertain input: quantile = share at the input's quantile (monotone) -------
@pytest.mark.parametrize("given, ppf", [
    ((0.04, 0.16), lambda p: scipy.stats.uniform.ppf(p, 0.04, 0.12)),
    (co.triangular(0.04, 0.07, 0.16), lambda p: tri_ppf(p, 0.04, 0.07, 0.16)),
    ((0.04, 0.07, 0.16), lambda p: pert_ppf(p, 0.04, 0.07, 0.16)),
])
def test_one_uncertain_rate_quantiles_are_the_share_at_the_rate_quantiles(given, ppf):
    r = co.share_range(0.08, given, 30)
    assert r.status == "ok" and r.dimension == 1
    for p, est in zip(r.probabilities, r.own):
        exact = co.share_from_rates(0.08, float(ppf(p)), 30)  # increasing in other_rate
        # the median within its reported half-width; the tails within 3 half-widths:
        # docs/models/ranges.md (coverage) shows one-input tail error bars run narrow
        allowed = est.half_width * (1 if p == 0.5 else 3)
        assert abs(est.value - exact) <= allowed, (p, est, exact)


def test_share_falls_in_own_rate_so_the_quantiles_swap():
    # own_rate ~ U(0.05, 0.11): the share's p-quantile is the share at the rate's (1 - p)
    r = co.share_range((0.05, 0.11), 0.08, 30)
    for p, est in zip(r.probabilities, r.own):
        exact = co.share_from_rates(0.05 + 0.06 * (1 - p), 0.08, 30)
        assert abs(est.value - exact) <= 3 * est.half_width
    assert abs(r.own[1].value - co.share_from_rates(0.08, 0.08, 30)) <= r.own[1].half_width


def test_other_share_is_the_rest_of_the_surplus():
    # closed form of the complete-information split: other = surplus - own (Rubinstein 1982)
    r = co.share_range(0.08, (0.04, 0.16), 30, surplus=5e6)
    for p, own, other in zip(r.probabilities, r.own, r.other):
        exact = 5e6 - co.share_from_rates(0.08, 0.04 + 0.12 * (1 - p), 30, surplus=5e6)
        assert abs(other.value - exact) <= 3 * other.half_width + 1e-9 * 5e6


# ---- degenerate ranges and fixed inputs ----------------------------------------------
def test_degenerate_ranges_equal_the_fixed_input_result_exactly():
    fixed = co.share_range(0.08, 0.1, 30, breakdown_prob=0.01)
    degenerate = co.share_range((0.08, 0.08), (0.1, 0.1, 0.1), 30, breakdown_prob=(0.01, 0.01))
    for f in dataclasses.fields(fixed):
        if f.name not in ("inputs",):
            assert getattr(fixed, f.name) == getattr(degenerate, f.name), f.name


def test_all_fixed_inputs_give_share_from_rates():
    r = co.share_range(0.08, 0.1, 30, surplus=2e6, own_opens=False, basis=360, continuous=True)
    exact = co.share_from_rates(0.08, 0.1, 30, surplus=2e6, own_opens=False, basis=360,
                                continuous=True)
    for est in r.own + (r.own_mean,):
        assert abs(est.value - exact) <= 1e-13 * 2e6
        assert est.half_width == 0
    assert r.dimension == 0 and r.p_rational.value == 1


# ---- reproducibility ------------------------------------------------------------------
def test_same_seed_same_bits_whatever_the_threads():
    kw = dict(breakdown_prob=(0.0, 0.01, 0.03), seed=20240601)
    a = co.share_range((0.05, 0.08, 0.12), co.triangular(0.04, 0.06, 0.16), 30, **kw)
    b = co.share_range((0.05, 0.08, 0.12), co.triangular(0.04, 0.06, 0.16), 30, threads=2, **kw)
    c = co.share_range((0.05, 0.08, 0.12), co.triangular(0.04, 0.06, 0.16), 30,
                       breakdown_prob=(0.0, 0.01, 0.03), seed=7)
    for x, y in zip(a.own + a.other, b.own + b.other):
        assert bits(x.value) == bits(y.value) and bits(x.se) == bits(y.se)
    assert a.own[1].value != c.own[1].value  # another seed, other draws


def test_tuple_and_distribution_objects_agree():
    a = co.share_range(0.08, (0.04, 0.07, 0.16), 30, shape="triangular")
    b = co.share_range(0.08, co.triangular(0.04, 0.07, 0.16), 30)
    c = co.share_range(0.08, (0.04, 0.07, 0.16), 30)  # pert by default
    d = co.share_range(0.08, co.pert(0.04, 0.07, 0.16), 30)
    assert a.own == b.own and c.own == d.own and a.own != c.own
    assert co.share_range(0.08, co.uniform(0.04, 0.16), 30).own == \
        co.share_range(0.08, [0.04, 0.16], 30).own


# ---- results ------------------------------------------------------------------------
def test_result_frame_and_repr():
    r = co.share_range(0.08, (0.04, 0.16), 30, probabilities=(0.25, 0.5, 0.75))
    df = r.to_frame()
    assert list(df.index) == [0.25, 0.5, 0.75]
    assert {"own", "own_se", "own_half_width", "own_digits", "other"} <= set(df.columns)
    assert df.loc[0.5, "own"] == r.quantile(0.5).value
    text = repr(r)
    assert "status='ok'" in text and "0.25" in text and "P(deal rational)" in text
    assert r.spec_version == 3 and r.replicates == 16 and r.points_per_replicate >= 1024
    assert dict(r.inputs)["other_rate"] == co.uniform(0.04, 0.16)
    with pytest.raises(KeyError):
        r.quantile(0.1)


def test_walk_away_probabilities_and_edge_cases():
    # other's walk-away value U(0.3, 0.7) against a share of about 0.5: it binds in part
    # of the draws (solve's rule: the responder gets max(share, walk-away); Binmore,
    # Shaked & Sutton 1989), never own's (none given)
    r = co.share_range(0.08, 0.08, 30, other_outside=(0.3, 0.7), digits=2)
    assert 0 < r.p_other_binds.value < 1 and r.p_own_binds.value == 0
    assert r.p_rational.value == 1


# ---- error policy ----------------------------------------------------------------------
def test_precision_not_reached_warns_and_is_configurable():
    kw = dict(digits=15, log2_max=11)
    with pytest.warns(co.PrecisionNotReachedWarning, match="precision not reached"):
        r = co.share_range(0.08, (0.04, 0.16), 30, **kw)
    assert r.status == "precision_not_reached" and not r.precision_reached
    with co.errstate(precision="ignore"):
        assert co.share_range(0.08, (0.04, 0.16), 30, **kw).status == "precision_not_reached"
    with co.errstate(precision="raise"), pytest.raises(co.PrecisionNotReachedError):
        co.share_range(0.08, (0.04, 0.16), 30, **kw)
    assert co.geterr()["precision"] == "warn"


# The library's rules and words: tests/python/test_range_reasons.py.  Here the ones a
# value meets before it reaches the library (its type: a number, a tuple of 2 or 3, a
# shape keyword, a seed that fits an unsigned 64-bit integer).
@pytest.mark.parametrize("kw, words", [
    (dict(shape="normal"), "shape = 'normal' is invalid"),
    (dict(seed=-1), "seed = -1 is invalid (a whole number from 0 to 2**64 - 1)"),
    (dict(replicates=2.5), "replicates = 2.5 is invalid (a whole number is required)"),
    (dict(other_rate=(0.04, "x")), "a number is required"),
    (dict(other_rate=(0.01, 0.02, 0.03, 0.04)), "a range is (low, high)"),
])
def test_invalid_input_names_the_argument(kw, words):
    args = dict(own_rate=0.08, other_rate=(0.04, 0.16), days=30)
    args.update(kw)
    with pytest.raises(ValueError) as e:
        co.share_range(**args)
    assert isinstance(e.value, co.InvalidArgumentError)
    assert words in str(e.value) and str(e.value).startswith("share_range: ")


def test_implausible_range_end_warns():
    with pytest.warns(co.ImplausibleInputWarning, match="other_rate"):
        co.share_range(0.08, (0.04, 8.0), 30, digits=2)


# ---- the swing --------------------------------------------------------------------------
def test_swing_ends_are_share_from_rates_at_the_ends():
    s = co.share_swing((0.05, 0.08, 0.12), (0.04, 0.16), 30)
    assert [r.input for r in s.rows] == sorted([r.input for r in s.rows],
                                                key=lambda n: -s.to_frame().loc[n, "swing"])
    modes = {"own_rate": 0.08, "other_rate": 0.10}  # PERT mode; uniform midpoint
    assert abs(s.base - co.share_from_rates(0.08, 0.10, 30)) <= 1e-13
    for r in s.rows:
        for end, got in ((r.low, r.at_low), (r.high, r.at_high)):
            args = dict(modes, **{r.input: end})
            assert abs(got - co.share_from_rates(args["own_rate"], args["other_rate"], 30)) \
                <= 1e-13
        assert r.swing == abs(r.at_high - r.at_low)
        assert r.status_low == r.status_high == "ok"
    df = s.to_frame()
    assert list(df.index) == [r.input for r in s.rows]
    assert list(df["swing"]) == sorted(df["swing"], reverse=True)
    assert "other_rate" in repr(s)


def test_signature_defaults_are_the_tables_and_the_librarys():
    import inspect

    sig = inspect.signature(co.share_range)
    table = inspect.signature(co.share_from_rates)
    for name in ("surplus", "own_opens", "basis", "continuous"):
        assert sig.parameters[name].default == table.parameters[name].default
    from counteroffer import _structs

    for name, value in _structs.RANGE_DEFAULTS.items():
        assert sig.parameters[name].default == value, name
    assert math.isclose(co.share_range(0.08, 0.1, 30).own[0].value,
                        co.share_from_rates(0.08, 0.1, 30), rel_tol=0, abs_tol=1e-13)
    assert np.all(np.isfinite([e.value for e in co.share_range(0.08, 0.1, 30).own]))


def test_docstring_examples_of_the_struct_functions():
    import doctest

    finder, runner = doctest.DocTestFinder(), doctest.DocTestRunner(
        optionflags=doctest.ELLIPSIS | doctest.NORMALIZE_WHITESPACE)
    n = 0
    for fn in (co.share_range, co.offer_path_rows):
        for test in finder.find(fn, fn.__name__, globs={}):
            n += len(test.examples)
            runner.run(test)
    assert runner.summarize(verbose=False).failed == 0 and n >= 4
