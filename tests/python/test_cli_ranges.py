"""The command line's range mode (counteroffer --function share_range) on a CSV of deals
with low/mode/high columns.

Expected values: each row equals share_range called with the same inputs (itself checked
against share_from_rates and scipy's input quantiles in test_ranges.py); a row with every
input fixed is share_from_rates (the table's function; degenerate ranges, header
ranges.h).  The deals are fictional.
"""

import csv
import io

import pytest

import counteroffer as co
from counteroffer import _cli

DEALS = """deal,own_rate,other_rate_low,other_rate_mode,other_rate_high,days,breakdown_prob_low,breakdown_prob_high
Ferncastle supply,0.08,0.04,0.07,0.16,30,0,0.02
Marlow licence,0.06,0.05,,0.09,14,,
Oakridge JV,0.1,0.1,0.1,0.1,30,,
Pell broken range,0.08,0.16,,0.04,30,,
Quarry text,0.08,abc,,0.1,30,,
"""


def run(args, text):
    out, err = io.StringIO(), io.StringIO()
    code = _cli.run(args, stdin=io.StringIO(text), stdout=out, stderr=err)
    return code, list(csv.DictReader(io.StringIO(out.getvalue()))), err.getvalue()


def test_rows_are_share_range_runs():
    code, rows, err = run(["-f", "share_range", "--no-progress"], DEALS)
    assert code == 1, err  # two rows are invalid
    assert [r["deal"] for r in rows] == ["Ferncastle supply", "Marlow licence", "Oakridge JV",
                                         "Pell broken range", "Quarry text"]
    assert list(rows[0])[8:11] == ["status", "own_p0.1", "own_p0.1_half_width"]
    first = co.share_range(0.08, (0.04, 0.07, 0.16), 30, breakdown_prob=(0, 0.02))
    assert [float(rows[0][f"own_p{p:g}"]) for p in first.probabilities] == \
        [e.value for e in first.own]
    assert float(rows[0]["p_rational"]) == first.p_rational.value
    second = co.share_range(0.06, co.uniform(0.05, 0.09), 14)  # no _mode: uniform
    assert float(rows[1]["own_p0.5"]) == second.own[1].value
    # every input fixed: share_from_rates
    assert float(rows[2]["own_p0.5"]) == pytest.approx(co.share_from_rates(0.1, 0.1, 30),
                                                       abs=1e-13)
    assert rows[3]["status"] == "invalid" and rows[3]["own_p0.5"] == ""
    assert rows[4]["status"] == "invalid"
    # the library's reason (docs/models/ranges.md "Reasons in words")
    assert "row 4 (line 5): share_range: other_rate: low 0.16 is above high 0.04\n" in err
    assert "row 5 (line 6)" in err and "not a number" in err
    assert "5 rows (3 ok, 2 invalid)" in err


def test_options_and_triangular_shape():
    code, rows, err = run(["-f", "share_range", "--shape", "triangular", "--probabilities",
                           "0.25,0.75", "--seed", "7", "--digits", "2"], DEALS)
    r = co.share_range(0.08, co.triangular(0.04, 0.07, 0.16), 30, breakdown_prob=(0, 0.02),
                       probabilities=(0.25, 0.75), seed=7, digits=2)
    assert float(rows[0]["own_p0.25"]) == r.own[0].value
    assert float(rows[0]["other_p0.75_half_width"]) == r.other[1].half_width
    assert "own_p0.5" not in rows[0]


def test_precision_not_reached_rows_and_progress_bar():
    text = "own_rate,other_rate_low,other_rate_high,days\n" + "0.08,0.04,0.16,30\n" * 3
    code, rows, err = run(["-f", "share_range", "--digits", "15", "--log2-max", "11",
                           "--progress"], text)
    assert code == 0
    assert [r["status"] for r in rows] == ["precision_not_reached"] * 3
    assert rows[0]["own_p0.5"] != ""
    assert "rows" in err  # the progress bar (forced) and the summary
    # each row's reason in the summary, in the library's words (the same as Python's)
    with co.errstate(precision="ignore"):
        reason = co.share_range(0.08, (0.04, 0.16), 30, digits=15, log2_max=11).reason
    assert reason.startswith("precision not reached: 15 significant digits not reached")
    assert ("counteroffer: 3 rows with a reason to look at (the results are written): "
            f"row 1: {reason}; row 2: {reason}; row 3: {reason}\n") in err


def test_rows_with_a_typed_percentage_in_the_summary():
    # other_rate's high typed as 8 for 8%: valid, computed, flagged with the library's
    # reason (the plausible range of a rate, 0 to 1 a year: common practice, no source)
    text = ("deal,own_rate,other_rate_low,other_rate_high,days\n"
            "Slip,0.08,0.04,8,30\nFine,0.08,0.04,0.08,30\n")
    code, rows, err = run(["-f", "share_range", "--digits", "2"], text)
    assert code == 0 and [r["status"] for r in rows] == ["ok", "ok"]
    assert ("counteroffer: 1 rows with a reason to look at (the results are written): row 1: "
            "ok, but other_rate high = 8 is outside the usual 0 to 1: above 100% a year: a "
            "percentage typed as a whole number? (8% is 0.08)\n") in err
    assert "row 2" not in err


def test_usage_errors():
    code, _rows, err = run(["-f", "share_range"], "deal,own_rate\nx,0.1\n")
    assert code == 2 and "needs the column(s) other_rate, days" in err
    code, _rows, err = run(["-f", "share_range", "--probabilities", "0.5,x"], DEALS)
    assert code == 2 and "--probabilities" in err
