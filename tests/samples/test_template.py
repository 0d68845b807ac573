"""The blank deal template, sample-sheets/deal_template.fods (issue 15 point 4).

Sources of the expectations: the Python package for the same inputs (the template must
show the project's numbers, rel. 1e-12); the template's own rules, which issue 15 sets
(empty cells, a rate above 1 = 100 % a year, days above 3650, a breakdown risk above
0.5 a round); the add-in's error values (addin/README.md "Error values": #N/A is no
deal, code 32767).
"""
import os

import pytest

import counteroffer as co

from conftest import SAMPLES, TEMPLATE
from officekit.catalogue import plausible_range

import build_template
import run_samples

REL = 1e-12
# The sheets show the library's words for the walk-away value that binds (none, ours,
# theirs, both: cto_output_word); the package said own/other before 1.1.
BIND = {"none": "none", "own": "ours", "other": "theirs", "ours": "ours",
        "theirs": "theirs", "both": "both"}
EMPTY = "an input cell is empty (Calc would read it as 0)"
# A fictional deal of our own.
DEAL = {"B7": "Orrin Castings", "B8": 80.0, "B9": 0.10, "B10": 0.07, "B11": 30.0,
        "B12": 0.02, "B13": 10.0, "B14": 15.0, "B15": 2.0, "B16": 3.0, "B17": True,
        "B18": 365.0}
RESULTS = ["B%d" % r for r in range(22, 28)] + ["B31", "B32"]


def close(a, b):
    return abs(a - b) <= max(REL * max(abs(a), abs(b)), 1e-12)


class Template:
    def __init__(self, doc):
        self.doc = doc
        self.sh = doc.Sheets.getByIndex(0)

    def cell(self, a1):
        return self.sh.getCellRangeByName(a1)

    def fill(self, values):
        for a1, v in values.items():
            c = self.cell(a1)
            if v is None:
                c.setString("")
            elif isinstance(v, str):
                c.setString(v)
            else:
                c.setValue(float(v))
        self.doc.calculateAll()

    def check(self):
        return self.cell("B19").getString()

    def conclusion(self):
        return self.cell("A5").getString()


@pytest.fixture
def template(book):
    return Template(book(TEMPLATE))


def test_blank_template_shows_no_number(template):
    """As shipped: every input empty, the check says so, no result, no error cell, no
    conclusion: nothing for a reader to mistake for an estimate."""
    t = template
    assert all(t.cell("B%d" % r).getType().value == "EMPTY" for r in range(7, 19))
    assert t.check() == EMPTY
    for a1 in RESULTS:
        assert t.cell(a1).getString() == "" and t.cell(a1).getError() == 0, a1
    assert t.conclusion() == "No conclusion yet: " + EMPTY
    assert run_samples.error_cells(t.doc) == []


def test_every_input_has_validity_and_help(template):
    """Data validity on every input (ranges, whole numbers, a TRUE/FALSE list), with
    its help shown on selection and printed beside the input."""
    kinds = {}
    for r in range(7, 19):
        c = template.cell("B%d" % r)
        v = c.Validation
        kinds[r] = v.Type.value
        assert v.Type.value != "ANY", r
        assert v.ShowInputMessage and len(v.InputMessage) > 10, r
        assert v.ShowErrorMessage and v.ErrorAlertStyle.value == "STOP", r
        assert len(template.cell("C%d" % r).getString()) > 10, r
    assert kinds[11] == "WHOLE" and kinds[18] == "WHOLE" and kinds[17] == "LIST"
    assert kinds[9] == "DECIMAL" and kinds[12] == "DECIMAL"


def test_filled_template_equals_the_package(template):
    """Filled with a deal, every result equals the Python package: the combined model
    with the walk-away values as breakdown payoffs and outside options and the
    status-quo values as inside options (BRW 1986; Muthoo 1999 chs. 4-6)."""
    t = template
    t.fill(DEAL)
    assert t.check() == run_samples.OK_TEXT
    d = DEAL
    fo = co.round_factor(d["B9"], d["B11"], d["B18"])
    ft = co.round_factor(d["B10"], d["B11"], d["B18"])
    args = (d["B12"], d["B13"], d["B14"], d["B15"], d["B16"], d["B13"], d["B14"], d["B8"])
    oth_args = (d["B12"], d["B14"], d["B13"], d["B16"], d["B15"], d["B14"], d["B13"], d["B8"])
    own = co.solve(fo, ft, *args, True)
    exp = {"B22": own.own_share, "B23": co.solve(ft, fo, *oth_args, False).own_share,
           "B24": own.own_share / d["B8"],
           "B26": co.delay_cost(fo, own.own_share, d["B12"], d["B13"]),
           "B27": own.own_share - co.solve(fo, ft, *args, False).own_share,
           "B31": fo, "B32": ft}
    for a1, x in exp.items():
        assert close(t.cell(a1).getValue(), x), (a1, t.cell(a1).getValue(), x)
    assert t.cell("B25").getString() == BIND[own.binding]
    assert all(t.cell("C%d" % r).getString() == "" for r in range(22, 28))
    assert t.conclusion() == (
        "With Orrin Castings: our share %s of 80.00 EUR m (%.0f%%); walk-away value that "
        "binds: %s; one more round of delay costs us %s EUR m." % (
            "{:,.2f}".format(exp["B22"]), 100 * exp["B24"], BIND[own.binding],
            "{:,.2f}".format(exp["B26"])))


@pytest.mark.parametrize("cell,value,message", [
    ("B9", 8, "a cost of capital above 100% a year: type 8% or 0.08, not 8"),
    ("B10", 12, "a cost of capital above 100% a year: type 8% or 0.08, not 8"),
    ("B11", 4000, "days between offers above 3650 (ten years): check the unit"),
    ("B12", 0.6, "a breakdown risk above 0.5 a round: type 5% or 0.05, not 5"),
    ("B13", None, EMPTY),
])
def test_implausible_input_withdraws_every_result(template, cell, value, message):
    """A rate typed as 8 instead of 8 %, days above 3650, a breakdown risk above 0.5 a
    round (issue 15's limits) or an emptied cell: the check names it and no result,
    no conclusion is shown."""
    t = template
    t.fill(DEAL)
    t.fill({cell: value})
    assert t.check() == message
    for a1 in RESULTS:
        assert t.cell(a1).getString() == "", a1
    assert t.conclusion() == "No conclusion yet: " + message


def test_limits_are_the_library_plausible_ranges(template):
    """The template's limits are the library's plausible ranges (cto_arg_plausible_range,
    read through the package): a rate up to 1 a year, days up to 3650, a breakdown risk
    up to 0.5 a round, a day basis from 360 to 366."""
    rate = plausible_range("share_from_rates", "own_rate")
    days = plausible_range("share_from_rates", "days")
    risk = plausible_range("solve", "breakdown_prob")
    basis = plausible_range("share_from_rates", "basis")
    conditions = [c for c, _ in build_template.CHECKS]
    assert conditions[0] == "AND(B9<=%r;B10<=%r)" % (rate[1], rate[1]) == "AND(B9<=1.0;B10<=1.0)"
    assert conditions[1] == "B11<=%r" % days[1]
    assert conditions[2] == "B12<=%r" % risk[1]
    v = template.cell("B18").Validation
    assert (float(v.Formula1), float(v.Formula2)) == basis


def test_no_deal_says_why(template):
    """Walk-away values worth more together than the deal: the model has no deal
    (addin/README.md: #N/A, code 32767); the column beside gives the library's reason
    in words (DEALREASON, cto_explain) and the conclusion repeats it, with no number."""
    t = template
    t.fill(DEAL)
    t.fill({"B13": 50.0, "B14": 45.0})
    assert t.check() == run_samples.OK_TEXT
    assert t.cell("B22").getError() == 32767
    why = t.cell("C22").getString()
    assert why.startswith("DEALSOLVE: no rational deal"), why
    assert "80" in why  # the surplus it names
    assert t.cell("C26").getString() == "see our share"
    assert t.conclusion() == "No number from the model for Orrin Castings: " + why


def test_reason_column_is_empty_when_the_model_is_fine(template):
    """With plausible inputs the library's reason is plain ok: nothing is shown."""
    t = template
    t.fill(DEAL)
    assert [t.cell("C%d" % r).getString() for r in range(22, 28)] == [""] * 6


def test_main_job_ships_the_blank_template(office, tmp_path):
    """The main job's step accepts the blank template (its check may say 'empty'),
    writes its report page and copies the template as it is; no frozen copy of it."""
    row, problems = run_samples.process(office, os.path.join(SAMPLES, TEMPLATE),
                                        str(tmp_path))
    assert problems == [] and row["blank"] and row["copies"] == 0
    assert os.path.getsize(str(tmp_path / "deal_template.pdf")) > 0
    with open(os.path.join(SAMPLES, TEMPLATE), "rb") as a, \
            open(str(tmp_path / TEMPLATE), "rb") as b:
        assert a.read() == b.read()


def test_template_formulas_kept_without_addin(office, bare_office):
    """Without the add-in the template keeps every add-in formula (stored names)."""
    path = os.path.join(SAMPLES, TEMPLATE)
    n = []
    for o in (office, bare_office):
        doc = o.load(path)
        try:
            n.append(run_samples.count_cells(doc)[1])
        finally:
            doc.close(True)
    assert n[0] == n[1] >= 7
