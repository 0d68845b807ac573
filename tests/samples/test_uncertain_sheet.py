"""Tests of the sample sheet "uncertain counterparty"
(sample-sheets/uncertain_counterparty.fods), run headless with the add-in.

The sheet needs the add-in's range functions (DEALRANGE, DEALRANGEOUTCOME); until the
add-in has them the builder writes no file and these tests are skipped (the main job
runs every sample-sheets/*.fods, so it does not run this sheet either).

Sources of the expected values, named beside each check:
  - the Python package `counteroffer` for the same inputs: solve and round_factor give
    our share in the most likely case and at each end of every range (the tornado);
  - the exact quantile for one uncertain input: our share is monotone in each input,
    so its p-quantile is the share at the input's (1 - p)- or p-quantile, the PERT
    quantile from scipy.stats.beta with alpha = 1 + 4 (m - lo)/(hi - lo), beta = 1 + 4
    (hi - m)/(hi - lo) (Malcolm et al. 1959; Vose 2008);
  - plain Monte Carlo with numpy (2^18 draws of the three PERT inputs, our share from
    the package) for the percentiles and the chance of a rational deal with every
    input uncertain; its own error is stated in each tolerance.
"""
import os

import numpy as np
import pytest
from scipy import stats

import counteroffer as co

from conftest import SAMPLES
from test_samples import Cells, close

NAME = "uncertain_counterparty.fods"
SORTED, OUT = 30, 37  # the tornado's rows; the estimator's output and percentile table
ROWS = (14, 15, 16)  # their cost of capital, breakdown risk, walk-away value
NAMES = ("other_rate", "breakdown_prob", "other_outside")  # DEALSWING's words for them
PROBS = [round(0.05 * k, 2) for k in range(1, 20)]
pytestmark = pytest.mark.skipif(
    not os.path.exists(os.path.join(SAMPLES, NAME)),
    reason="the add-in has no DEALRANGE yet: the sheet is not shipped")


def share(c, rate, p, walk):
    """Our share (or our walk-away value where no deal is rational) from the package."""
    fo = co.round_factor(c.v("B8"), c.v("B9"), c.v("B12"))
    ft = co.round_factor(rate, c.v("B9"), c.v("B12"))
    with co.errstate(all="ignore"):
        r = co.solve(fo, ft, p, 0, 0, 0, 0, c.v("B10"), walk, c.v("B7"), c.b("B11"))
    return r.own_share


def ranges(c):
    return [(c.v("B%d" % r), c.v("C%d" % r), c.v("D%d" % r)) for r in ROWS]


def pert_ppf(lo, mode, hi, u):
    if hi == lo:
        return np.full_like(np.asarray(u, float), lo)
    a = 1 + 4 * (mode - lo) / (hi - lo)
    b = 1 + 4 * (hi - mode) / (hi - lo)
    return lo + (hi - lo) * stats.beta.ppf(u, a, b)


def test_most_likely_and_swing_equal_the_package(book):
    """The most likely case and both ends of every range, one at a time (DEALSWING),
    equal the package; the rows come largest swing first, with our labels."""
    c = Cells(book(NAME))
    modes = [m for _, m, _ in ranges(c)]
    assert close(c.v("B19"), share(c, *modes))
    sizes = []
    for k in range(3):
        row = SORTED + k
        i = NAMES.index(c.s("B%d" % row))
        lo, _, hi = ranges(c)[i]
        at_lo, at_hi = list(modes), list(modes)
        at_lo[i], at_hi[i] = lo, hi
        assert close(c.v("C%d" % row), share(c, *at_lo))
        assert close(c.v("D%d" % row), share(c, *at_hi))
        assert close(c.v("E%d" % row), abs(share(c, *at_hi) - share(c, *at_lo)),
                     absolute=1e-11)
        assert c.s("A%d" % row).lower().startswith(("their", "the breakdown"))
        sizes.append(c.v("E%d" % row))
    assert sizes == sorted(sizes, reverse=True)


def test_one_uncertain_input_gives_the_exact_quantile(book):
    """Only their walk-away value uncertain: our share falls as it rises, so our 10th
    percentile is the share at its 90th percentile (and the reverse), within three
    significant digits (the sheet's target)."""
    c = Cells(book(NAME))
    for r in (14, 15):
        for col in "BD":
            c.cell("%s%d" % (col, r)).setValue(c.v("C%d" % r))
    c.doc.calculateAll()
    (lo, m, hi) = ranges(c)[2]
    rate, p = c.v("C14"), c.v("C15")
    for cell, prob in (("B21", 0.9), ("B22", 0.5), ("B23", 0.1)):
        exact = share(c, rate, p, float(pert_ppf(lo, m, hi, prob)))
        assert abs(c.v(cell) - exact) <= 1e-3 * abs(exact), (cell, c.v(cell), exact)


def test_percentiles_against_plain_monte_carlo(book):
    """Every input uncertain: the sheet's 10th, 50th and 90th percentiles and the chance
    of a rational deal against 2^18 plain Monte Carlo draws through the package (its
    standard error for a percentile is about 0.05 EUR m here; tolerance 0.2 EUR m)."""
    c = Cells(book(NAME))
    rng = np.random.default_rng(20261202)
    n = 1 << 18
    draws = [pert_ppf(lo, m, hi, rng.random(n)) for lo, m, hi in ranges(c)]
    fo = co.round_factor(c.v("B8"), c.v("B9"), c.v("B12"))
    ft = co.round_factor(draws[0], c.v("B9"), c.v("B12"))
    with co.errstate(all="ignore"):
        r = co.solve(fo, ft, draws[1], 0, 0, 0, 0, c.v("B10"), draws[2], c.v("B7"),
                     c.b("B11"))
    own = np.asarray(r.own_share)
    for cell, prob in (("B21", 0.1), ("B22", 0.5), ("B23", 0.9)):
        assert abs(c.v(cell) - np.quantile(own, prob)) <= 0.2, cell
    for i, prob in enumerate(PROBS):  # the percentile table (one DEALRANGE array)
        assert abs(c.v("H%d" % (OUT + i)) - np.quantile(own, prob)) <= 0.2, prob
        if prob in (0.1, 0.5, 0.9):
            assert c.v("I%d" % (OUT + i)) == c.v("H%d" % (OUT + i))
        else:
            assert c.s("I%d" % (OUT + i)) == ""
    assert close(c.v("B22"), c.v("B%d" % (OUT + 1)))
    rational = np.mean(np.asarray(r.rational, bool))
    assert abs(c.v("B24") - rational) <= 5 * np.sqrt(rational * (1 - rational) / n) + 1e-3
    assert c.v("B21") <= c.v("B22") <= c.v("B23")


def test_conclusion_and_reading_follow_the_cells(book):
    """The conclusion and the tornado's reading quote the result cells."""
    c = Cells(book(NAME))
    f = "{:,.2f}".format
    assert c.s("A5") == (
        "Most likely we get %s of %s EUR m; over the ranges 8 in 10 cases give us %s to "
        "%s EUR m, a deal is rational with a %.0f%% chance, and %s moves our share most."
        % (f(c.v("B19")), f(c.v("B7")), f(c.v("B21")), f(c.v("B23")), 100 * c.v("B24"),
           c.s("A%d" % SORTED).lower()))
    assert f(c.v("B%d" % SORTED)) in c.s("A%d" % (SORTED + 3))


def test_input_check(book):
    """A most likely value outside its range, or an empty input, withdraws the
    conclusion."""
    c = Cells(book(NAME))
    c.set("C15", 0.5)
    assert c.s("B17") == "row 15: low, most likely and high must be in that order"
    assert c.s("A5").startswith("No conclusion yet")
    c.set("C15", 0.03)
    c.cell("D16").setString("")
    c.doc.calculateAll()
    assert c.s("B17") == "an input cell is empty (Calc would read it as 0)"


def package_inputs(c):
    """The sheet's inputs as share_range / share_swing arguments (PERT ranges, the
    walk-away values as outside options only, as the sheet passes them)."""
    rate, p, walk = ranges(c)
    return dict(own_rate=c.v("B8"), other_rate=rate, days=c.v("B9"), breakdown_prob=p,
                own_outside=c.v("B10"), other_outside=walk, surplus=c.v("B7"),
                own_opens=c.b("B11"), basis=c.v("B12"))


def test_estimates_equal_the_package(book):
    """The estimator's output block, the percentile table and the tornado equal the
    Python package's share_range and share_swing for the same inputs and seed (the same
    library through the other surface: rel. 1e-12)."""
    if not hasattr(co, "share_range"):
        pytest.skip("this venv's counteroffer package predates share_range")
    c = Cells(book(NAME))
    kw = package_inputs(c)
    r = co.share_range(**kw)
    want = [e.value for e in r.own] + [e.value for e in r.other] + [
        r.own_mean.value, r.other_mean.value, r.p_rational.value, r.p_own_binds.value,
        r.p_other_binds.value, r.edge_fraction.value]
    for i, x in enumerate(want):
        assert close(c.v("B%d" % (OUT + i)), x), (i, c.v("B%d" % (OUT + i)), x)
    assert c.v("B%d" % (OUT + 12)) == r.points_per_replicate
    table = co.share_range(**kw, probabilities=tuple(PROBS))
    for i, e in enumerate(table.own):
        assert close(c.v("H%d" % (OUT + i)), e.value), PROBS[i]
    swing = co.share_swing(**kw)
    for k, row in enumerate(swing.rows):
        assert c.s("B%d" % (SORTED + k)) == row.input
        assert close(c.v("C%d" % (SORTED + k)), row.at_low)
        assert close(c.v("D%d" % (SORTED + k)), row.at_high)
