"""Tests of the sample sheet "licence with an unknown reservation value"
(sample-sheets/licence_unknown_value.fods), run headless with the add-in.

Sources of the expected values, named beside each check:
  - the Python package `counteroffer` (bindings/) for the same inputs: opening_offer,
    agreement_probability, expected_agreement_round, double_auction, round_factor
    (the sheet must show the numbers of the project's other surface, rel. 1e-12);
  - the 50-digit reference rows of tests/reference/private/offer_path.csv, computed by a
    separate mpmath implementation (stagewise maximisation, Monte Carlo of types), for
    the gap example of Fudenberg, Levine & Tirole (1985) with deadlines 2, 5, 11 and none;
  - closed forms: the one-offer monopoly price max(v_lo, (v_hi + c)/2) (the terminal
    stage of Fudenberg & Tirole 1991 ch. 10); the Chatterjee & Samuelson (1983) triangle
    formulas and Myerson & Satterthwaite's (1983) uniform example on [0, 1]^2.
"""
import csv
import os

import pytest

import counteroffer as co

from conftest import ROOT
from test_samples import Cells, close

NAME = "licence_unknown_value.fods"
PATH, FIRST, LAST, NONE_ROW = 43, 59, 70, 71
OFFER_PATH_TABLE = os.path.join(ROOT, "tests", "reference", "private", "offer_path.csv")


def factors(c):
    """Per-round factors x survival, from the package (DEALFACTOR's definition)."""
    p, days, basis = c.v("B13"), c.v("B12"), c.v("B15")
    return ((1 - p) * co.round_factor(c.v("B10"), days, basis),
            (1 - p) * co.round_factor(c.v("B11"), days, basis))


def package_row(c, rounds):
    fo, ft = factors(c)
    args = (c.v("B7"), c.v("B8"), fo, ft)
    kw = dict(rounds=rounds, known_value=c.v("B9"))
    return (co.opening_offer(*args, **kw), co.agreement_probability(*args, **kw),
            co.expected_agreement_round(*args, **kw))


def check_against_package(c):
    """Every result cell of the sheet against the Python package, same inputs."""
    fo, ft = factors(c)
    assert close(c.v("B39"), fo) and close(c.v("B40"), ft)
    n = int(c.v("B14"))
    offer, chance, rnd = package_row(c, n)
    assert close(c.v("B21"), offer) and close(c.v("B22"), chance)
    assert close(c.v("B23"), rnd)
    assert close(c.v("B24"), c.v("B12") * (rnd - 1), absolute=1e-9)
    for k in range(1, 14):
        r = FIRST + k - 1
        offer, chance, rnd = package_row(c, k if k <= 12 else 0)
        assert close(c.v("B%d" % r), offer), (r, c.v("B%d" % r), offer)
        assert close(c.v("C%d" % r), chance) and close(c.v("D%d" % r), rnd)
        assert close(c.v("E%d" % r), c.v("B12") * (rnd - 1), absolute=1e-9)
    assert close(c.v("B25"), c.v("B%d" % NONE_ROW)) and close(c.v("B26"), c.v("C%d" % NONE_ROW))
    da = co.double_auction(c.v("B16"), c.v("B17"), c.v("B7"), c.v("B8"), c.v("B18"))
    for cell, x in (("B30", da.trade_probability), ("B31", da.expected_price),
                    ("B32", da.total_gain), ("B33", da.first_best_gain),
                    ("B34", da.second_best_gain), ("B37", da.efficiency),
                    ("B35", da.first_best_gain - da.total_gain),
                    ("B36", da.first_best_gain - da.second_best_gain)):
        assert close(c.v(cell), x, absolute=1e-12), (cell, c.v(cell), x)


def check_round_table(c):
    """The round table (DEALOFFERPATH) against the package's totals for the same inputs
    and the identities of the skimming path (Fudenberg & Tirole 1991 ch. 10): the first
    offer is the opening offer; the chances per round add up to the chance by the
    deadline and accumulate to the last column; a licensee with a value above the cutoff
    has signed: chance by round t = (highest - cutoff_t)/(highest - lowest); the
    expected round is sum t p_t / sum p_t; offers fall round by round."""
    n = int(c.v("B14"))
    offer, chance, rnd = package_row(c, n)
    lo, hi = c.v("B7"), c.v("B8")
    rows = []
    for k in range(1, 13):
        r = PATH + k - 1
        if c.s("A%d" % r) == "":
            assert all(c.s("%s%d" % (col, r)) == "" for col in "BCDE")
            continue
        rows.append([c.v("%s%d" % (col, r)) for col in "ABCDE"])
    assert 1 <= len(rows) <= n
    assert [int(t) for t, *_ in rows] == list(range(1, len(rows) + 1))
    assert close(rows[0][1], offer)
    assert close(sum(p for *_, p, _ in rows), chance, absolute=1e-13)
    assert close(rows[-1][4], chance, absolute=1e-13)
    total = 0.0
    for t, o, cut, p, by in rows:
        total += p
        assert close(by, total, absolute=1e-13)
        assert close(by, (hi - cut) / (hi - lo), absolute=1e-12)
    assert close(sum(t * p for t, _, _, p, _ in rows) / chance, rnd, rel=1e-12)
    assert all(a[1] > b[1] for a, b in zip(rows, rows[1:]))
    return rows


def test_equals_python_package(book):
    """The scenario as shipped: every result and every deadline row equal the package."""
    c = Cells(book(NAME))
    check_against_package(c)
    assert len(check_round_table(c)) == 8  # the scenario: a slow descent to the deadline


def test_deadline_effect_is_not_monotone_in_the_scenario(book):
    """The scenario shows the deadline effect where it occurs: the opening offer rises
    again for some deadlines while the chance of a licence stalls (the finite-horizon
    gap case, Fudenberg, Levine & Tirole 1985), and long deadlines give the no-deadline
    answer; the words of the comparison columns follow the numbers."""
    c = Cells(book(NAME))
    offers = [c.v("B%d" % r) for r in range(FIRST, LAST + 1)]
    words = [c.s("F%d" % r) for r in range(FIRST + 1, LAST + 1)]
    for k in range(1, 12):
        want = ("higher" if offers[k] > offers[k - 1] * (1 + 1e-9) else
                "lower" if offers[k] < offers[k - 1] * (1 - 1e-9) else "same")
        assert words[k - 1] == want, k + 1
    assert "higher" in words and "lower" in words
    same = [c.s("G%d" % r) == "yes" for r in range(FIRST, LAST + 1)]
    assert same[-1] and not same[0]
    reading = c.s("A%d" % (NONE_ROW + 1))
    assert reading.startswith("Reading the table: the deadline effect is not monotone")
    assert "%d of the 12 deadline lengths" % words.count("higher") in reading
    first_same = same.index(True) + 1
    assert "from %d offers on" % first_same in reading


def test_reference_rows_of_the_gap_example(book):
    """Inputs set to the gap example of Fudenberg, Levine & Tirole (1985) (values uniform
    on 0.2 to 1.2, reservation 0, both factors 0.9: rates 0 and a 10% breakdown risk):
    the deadline rows 2, 5, 11 and no deadline equal the 50-digit reference rows (a
    separate mpmath implementation, tests/reference/private/offer_path.csv), and one
    offer gives the monopoly price max(v_lo, (v_hi + c)/2) (Fudenberg & Tirole 1991
    ch. 10, terminal stage)."""
    c = Cells(book(NAME))
    for cell, x in (("B7", 0.2), ("B8", 1.2), ("B9", 0), ("B10", 0), ("B11", 0),
                    ("B13", 0.1)):
        c.cell(cell).setValue(x)
    c.set("B14", 5)
    assert c.v("B39") == c.v("B40") == 0.9
    with open(OFFER_PATH_TABLE, newline="") as fh:
        rows = [r for r in csv.DictReader(fh) if r["private_low"] == "0.2"
                and r["private_high"] == "1.2" and r["offerer_factor"] == "0.9"
                and r["responder_factor"] == "0.9" and r["known_value"] == "0.0"
                and r["offerer"] == "0"]
    assert {int(r["rounds"]) for r in rows} >= {2, 5, 11, 0}
    for ref in rows:
        n = int(ref["rounds"])
        row = NONE_ROW if n == 0 else FIRST + n - 1
        assert close(c.v("B%d" % row), float(ref["opening_offer"]), rel=1e-13), n
        assert close(c.v("C%d" % row), float(ref["agreement_probability"]), rel=1e-13), n
        assert close(c.v("D%d" % row), float(ref["expected_round"]), rel=1e-13), n
    assert close(c.v("B%d" % FIRST), max(0.2, (1.2 + 0) / 2))
    check_against_package(c)
    for ref in rows:  # the round table: second offer and first two cutoffs
        if int(ref["rounds"]) in (2, 5):
            c.set("B14", int(ref["rounds"]))
            assert close(c.v("B%d" % (PATH + 1)), float(ref["offer_2"]), rel=1e-13)
            assert close(c.v("C%d" % PATH), float(ref["cutoff_1"]), rel=1e-13)
            assert close(c.v("C%d" % (PATH + 1)), float(ref["cutoff_2"]), rel=1e-13)
            check_round_table(c)


def test_two_sided_closed_forms(book):
    """Both ranges 0 to 1, bid weight 1/2: Chatterjee & Samuelson (1983) give a chance of
    trade 9/32 and a gain 9/64; the first best is 1/6 and the second best 9/64, attained
    by this auction (Myerson & Satterthwaite 1983, uniform example)."""
    c = Cells(book(NAME))
    for cell, x in (("B7", 0), ("B8", 1), ("B9", 0), ("B16", 0), ("B17", 1)):
        c.cell(cell).setValue(x)
    c.set("B18", 0.5)
    assert close(c.v("B30"), 9 / 32) and close(c.v("B32"), 9 / 64)
    assert close(c.v("B33"), 1 / 6) and close(c.v("B34"), 9 / 64)
    assert close(c.v("B36") + 9 / 64, 1 / 6) and abs(c.v("B34") - c.v("B32")) < 1e-14
    check_against_package(c)


def test_edits_follow_the_model(book):
    """A longer deadline that reaches the no-deadline answer: one more offer (8 -> 9)
    drops the opening offer to the no-deadline one and every licensee signs (the
    deadline stops binding); an emptied input or a bad deadline withdraws the results'
    conclusion (the input check)."""
    c = Cells(book(NAME))
    c.set("B14", 9)
    assert close(c.v("B21"), c.v("B25")) and close(c.v("B22"), c.v("B26"))
    check_against_package(c)
    c.set("B14", 13)
    assert c.s("B19") == "offers before the deadline must be a whole number from 1 to 12"
    c.set("B14", 8)
    c.set("B8", 3)
    assert c.s("B19") == "the licensee's lowest value must be below its highest"
    c.cell("B8").setString("")
    c.doc.calculateAll()
    assert c.s("B19") == "an input cell is empty (Calc would read it as 0)"
    assert c.s("A5").startswith("No conclusion yet")


@pytest.mark.parametrize("rounds", [1, 3, 12])
def test_deadline_input_edit(book, rounds):
    """The highlighted deadline row is the one the headline results repeat."""
    c = Cells(book(NAME))
    c.set("B14", rounds)
    r = FIRST + rounds - 1
    assert c.v("B21") == c.v("B%d" % r) and c.v("B22") == c.v("C%d" % r)
    check_against_package(c)
    check_round_table(c)


def test_round_table_as_long_as_the_path(book):
    """The report shows the round table as long as the path (8 rounds in the scenario,
    of 12 rows), and the round charts draw only those rows (run_samples.trim_report_rows,
    the main job's step)."""
    import run_samples
    doc = book(NAME)
    sh = doc.Sheets.getByIndex(0)
    assert run_samples.trim_report_rows(doc) == 4
    for k in range(1, 13):
        assert sh.Rows.getByIndex(PATH + k - 2).IsVisible == (k <= 8), k
    round_charts = [list(ch.getRanges()) for ch in sh.Charts
                    if min(r.StartRow for r in ch.getRanges()) == PATH - 2]
    assert len(round_charts) == 2
    for ranges in round_charts:
        assert max(r.EndRow for r in ranges) == PATH + 6


@pytest.mark.parametrize("rounds", [2, 8, 9])
def test_round_table_equals_the_package(book, rounds):
    """The round table equals the Python package's offer_path_rows for the same inputs
    (the same library through the other surface: rel. 1e-12)."""
    if not hasattr(co, "offer_path_rows"):
        pytest.skip("this venv's counteroffer package predates offer_path_rows")
    c = Cells(book(NAME))
    c.set("B14", rounds)
    fo, ft = factors(c)
    p = co.offer_path_rows(c.v("B7"), c.v("B8"), fo, ft, rounds=rounds,
                           known_value=c.v("B9"))
    assert len(p.offer) == sum(c.s("A%d" % (PATH + k)) != "" for k in range(12))
    for k in range(len(p.offer)):
        r = PATH + k
        for col, want in zip("BCDE", (p.offer[k], p.cutoff[k], p.round_probability[k],
                                      p.cumulative_probability[k])):
            assert close(c.v("%s%d" % (col, r)), float(want), absolute=1e-13), (col, r)
