"""The counteroffer command line on a good and on a broken CSV of deals.

Expected values: Rubinstein (1982) main theorem, S (1 - d2)/(1 - d1 d2), written here;
the deals are fictional.
("models s.N": docs/models/complete-information.md; "the contract":
docs/reference/functions.md.)
"""

import csv
import io
import os
import subprocess
import sys

import pytest

from counteroffer import _cli


def rubinstein(d1, d2, s=1.0):
    return s * (1 - d2) / (1 - d1 * d2)


GOOD = """deal,own_factor,other_factor,surplus,own_opens
Quillon licence,0.97,0.95,12000000,TRUE
Arden supply,0.9,0.8,,false
Tallis JV,0.5,0.5,1,1
"""

BROKEN = """deal,own_factor,other_factor,surplus
Pell line,0.9,0.8,100
Garnet bad factor,1.5,0.8,100
Hollis text,abc,0.8,100
Fenwick short row,0.9
Crane empty factor,,0.8,5
Ostrava no deal,0.9,0.8,-3
Juniper patient,1,1,2
"""


def run(args, stdin_text):
    out, err = io.StringIO(), io.StringIO()
    code = _cli.run(args, stdin=io.StringIO(stdin_text), stdout=out, stderr=err)
    return code, out.getvalue(), err.getvalue()


def test_good_csv():
    code, out, err = run(["-f", "share"], GOOD)
    assert code == 0, err
    rows = list(csv.DictReader(io.StringIO(out)))
    assert [r["deal"] for r in rows] == ["Quillon licence", "Arden supply", "Tallis JV"]
    assert list(rows[0]) == ["deal", "own_factor", "other_factor", "surplus", "own_opens",
                             "status", "value"]
    assert all(r["status"] == "ok" for r in rows)
    assert float(rows[0]["value"]) == pytest.approx(rubinstein(0.97, 0.95, 12e6), rel=1e-15)
    # empty surplus -> default 1; own_opens false -> own gets 1 - other's opener share
    assert float(rows[1]["value"]) == pytest.approx(1 - rubinstein(0.8, 0.9), rel=1e-14)
    assert float(rows[2]["value"]) == pytest.approx(2 / 3, rel=1e-15)
    assert "3 rows (3 ok)" in err


def test_broken_csv_reports_each_bad_row_and_drops_nothing():
    code, out, err = run(["-f", "share"], BROKEN)
    assert code == 1
    rows = list(csv.DictReader(io.StringIO(out)))
    assert len(rows) == 7  # nothing dropped
    assert [r["status"] for r in rows] == ["ok", "invalid", "invalid", "invalid", "invalid",
                                           "no_deal", "indeterminate"]
    assert rows[1]["value"] == "" and rows[0]["value"] != ""
    assert float(rows[5]["value"]) == 0.0  # own's no-deal payoff (the contract)
    lines = err.splitlines()
    assert any(l.startswith("row 2 (line 3): column own_factor = '1.5' is invalid") for l in lines)
    assert any(l.startswith("row 3 (line 4): column own_factor = 'abc' is invalid (not a number")
               for l in lines)
    assert any(l.startswith("row 4 (line 5): expected 4 fields, found 2") for l in lines)
    assert any(l.startswith("row 5 (line 6): column own_factor is empty") for l in lines)
    assert "4 invalid" in err and "1 no_deal" in err and "1 indeterminate" in err


def test_missing_required_column_is_a_usage_error():
    code, out, err = run(["-f", "share"], "deal,own_factor\nx,0.9\n")
    assert code == 2 and "needs the column(s) other_factor" in err and out == ""


def test_solve_columns_and_choices():
    text = "own_factor,other_factor,other_outside\n0.9,0.9,0.5\n0.9,0.9,none\n"
    code, out, err = run(["-f", "solve"], text)
    assert code == 0, err
    rows = list(csv.DictReader(io.StringIO(out)))
    assert float(rows[0]["own_share"]) == pytest.approx(0.5)  # check value(s) 42
    assert float(rows[1]["own_share"]) == pytest.approx(1 / 1.9)  # no option: row 40
    code, out, err = run(["-f", "majority_share"],
                         "factor,parties,votes_needed,role\n0.9,5,3,partner\n0.9,5,none,PROPOSER\n")
    rows = list(csv.DictReader(io.StringIO(out)))
    # Baron & Ferejohn (1989): partner d/n, proposer 1 - d (q-1)/n (check value(s) 65-66)
    assert float(rows[0]["value"]) == pytest.approx(0.18, rel=1e-15)
    assert float(rows[1]["value"]) == pytest.approx(0.64, rel=1e-15)


def test_console_script_on_a_large_file_shows_progress(tmp_path):
    n = 70_000
    src = tmp_path / "deals.csv"
    with open(src, "w") as f:
        f.write("own_factor,other_factor\n")
        for i in range(n):
            f.write(f"{0.5 + 0.4 * i / n},0.9\n")
    dst = tmp_path / "out.csv"
    exe = os.path.join(os.path.dirname(sys.executable), "counteroffer")
    proc = subprocess.run([exe, "--function", "share", str(src), "-o", str(dst)],
                          capture_output=True, text=True, timeout=300)
    assert proc.returncode == 0, proc.stderr
    assert "100.0%" in proc.stderr and f"{n}/{n} rows" in proc.stderr
    with open(dst) as f:
        rows = list(csv.reader(f))
    assert len(rows) == n + 1
    assert float(rows[-1][3]) == pytest.approx(rubinstein(0.5 + 0.4 * (n - 1) / n, 0.9),
                                               rel=1e-14)


def test_stdin_semicolons_and_python_dash_m():
    text = "own_factor;other_factor;surplus\n0.5;0.5;3\n"
    proc = subprocess.run([sys.executable, "-m", "counteroffer", "-f", "share", "-d", ";"],
                          input=text, capture_output=True, text=True, timeout=120)
    assert proc.returncode == 0, proc.stderr
    rows = list(csv.reader(io.StringIO(proc.stdout), delimiter=";"))
    assert rows[0] == ["own_factor", "other_factor", "surplus", "status", "value"]
    assert float(rows[1][4]) == pytest.approx(rubinstein(0.5, 0.5, 3.0), rel=1e-15)


def test_many_bad_rows_are_summarised_but_all_kept():
    text = "own_factor,other_factor\n" + "2,0.5\n" * 80
    code, out, err = run(["-f", "share", "--max-errors", "5"], text)
    assert code == 1
    assert len(list(csv.DictReader(io.StringIO(out)))) == 80
    assert err.count("is invalid") == 5 and "more bad rows" in err and "80 invalid" in err


def test_map_reads_arguments_from_other_columns():
    text = "deal,wacc_ours,wacc_theirs,cycle\nArden supply,0.10,0.15,14\n"
    code, out, err = run(["-f", "share_from_rates", "--map", "own_rate=wacc_ours",
                          "--map", "other_rate=wacc_theirs,days=cycle"], text)
    assert code == 0, err
    row = next(csv.DictReader(io.StringIO(out)))
    # Rubinstein (1982) with rates: S expm1(-r2 t)/expm1(-(r1 + r2) t), r = log(1 + rate)
    import math
    r1, r2, t = math.log1p(0.10), math.log1p(0.15), 14 / 365
    assert float(row["value"]) == pytest.approx(math.expm1(-r2 * t) / math.expm1(-(r1 + r2) * t),
                                                rel=1e-14)
    code, out, err = run(["-f", "share", "--map", "own_factor"], "own_factor,other_factor\n")
    assert code == 2 and "--map 'own_factor' is invalid (expected ARG=COLUMN" in err
    code, out, err = run(["-f", "share", "--map", "speed=x"], "x,other_factor\n")
    assert code == 2 and "share has no argument 'speed'" in err
    code, out, err = run(["-f", "share", "--map", "own_factor=mine"], "other_factor\n0.5\n")
    assert code == 2 and "needs the column(s) mine" in err


def test_version_is_the_librarys(capsys):
    from counteroffer import _core

    assert _cli.run(["--version"]) == 0
    assert capsys.readouterr().out.strip() == f"counteroffer {_core.version()}"


def test_decimal_commas_in_and_out():
    text = "own_factor;other_factor;surplus\n0,5;0,5;3\n0,9;0,8;1,5\n"
    code, out, err = run(["-f", "share", "-d", ";", "--decimal", ","], text)
    assert code == 0, err
    rows = list(csv.reader(io.StringIO(out), delimiter=";"))
    assert float(rows[1][4].replace(",", ".")) == pytest.approx(rubinstein(0.5, 0.5, 3.0),
                                                                rel=1e-15)
    assert "," in rows[2][4] and "." not in rows[2][4]
    assert float(rows[2][4].replace(",", ".")) == pytest.approx(rubinstein(0.9, 0.8, 1.5),
                                                                rel=1e-15)
    code, out, err = run(["-f", "share", "--decimal", ","], text)
    assert code == 2 and "--decimal , needs another delimiter" in err


def test_binding_and_rational_are_words_as_in_python():
    text = "own_factor,other_factor,other_outside,own_outside\n0.9,0.9,0.5,\n0.9,0.9,0.3,\n" \
           "0.9,0.9,0.5,0.6\n"
    code, out, err = run(["-f", "solve"], text)
    assert code == 0, err
    rows = list(csv.DictReader(io.StringIO(out)))
    # outside option principle (Binmore, Shaked & Sutton 1989): 0.5 > 0.9/1.9 binds
    import counteroffer as co

    assert [r["binding"] for r in rows[:2]] == ["theirs", "none"]
    assert rows[0]["binding"] == co.solve(0.9, 0.9, other_outside=0.5).binding
    # the library's words for the flag (cto_output_word), as in Calc: 0.6 + 0.5 > 1
    assert [r["rational"] for r in rows] == ["yes", "yes", "no"]
    assert rows[2]["status"] == "no_deal"


def test_implausible_rows_are_flagged_in_the_summary():
    text = "own_rate,other_rate,days\n0.08,0.1,30\n8,0.1,30\n0.08,0.1,5000\n"
    code, out, err = run(["-f", "share_from_rates"], text)
    assert code == 0, err  # valid values: evaluated as given
    assert [r["status"] for r in csv.DictReader(io.StringIO(out))] == ["ok"] * 3
    assert "2 rows with implausible values" in err
    assert "row 2: own_rate = 8.0 outside 0 to 1" in err
    assert "row 3: days = 5000.0 outside 0 to 3650" in err


def test_new_table_functions_need_no_command_line_code(capsys):
    # every row of the library's table is a --function choice with its columns listed
    import counteroffer as co

    assert _cli.run(["--help"]) == 0
    out = capsys.readouterr().out
    for spec in co.catalogue:
        assert f"  {spec.name} " in out and spec.args[0].name in out
