"""Words in an outcome array entered over several cells, compared in a formula.

LibreOffice Calc 7.4 keeps the texts of an add-in's array result apart from the document's
own strings, so `=D1="yes"` on a cell of such an array is FALSE although the cell shows
yes (observed on this project's machine with DEALSOLVEOUTCOME and DEALSWING; the same
behaviour is reported for other Calc extensions that return sequence<sequence<any>>).
A text that passes through a spreadsheet function first compares as expected. The ways
addin/README.md ("Words in outcome arrays") gives a user are checked here, on the shipped
extension:
  * INDEX(DEALSOLVEOUTCOME(...); 1; 4) in one cell (what the sample sheets do),
  * TRIM(D1) = "yes" or D1 & "" = "yes" on a cell of the array.
If Calc starts to compare the array's own cells by value, the last test fails and says so,
so that the README's warning is removed then.

Expected words: the solve outcome's rational column is "yes" for an ordinary deal and its
binding column "none" when no walk-away value is given (docs/reference/functions.md,
solve's outputs); DEALSWING's first column names the input with the largest swing.
"""
import pytest

from officekit.office import SERVICE

SOLVE = "%sGETSOLVEOUTCOME(0.9;0.8;0;0;0;0;0;0.6;-1E300;1;1)" % SERVICE


@pytest.fixture(scope="module")
def sheet(office):
    doc = office.new_sheet()
    sh = doc.Sheets.getByIndex(0)
    sh.getCellRangeByName("A1:H1").setArrayFormula("=" + SOLVE)
    formulas = {
        "A3": '=INDEX(%s;1;4)="yes"' % SOLVE,
        "A4": '=TRIM(D1)="yes"',
        "A5": '=D1&""="yes"',
        "A6": '=TRIM(C1)="none"',
        "A7": '=COUNTIF(A8;"none")',
        "A8": "=INDEX(%s;1;3)" % SOLVE,
        "A9": '=D1="yes"',
    }
    for ref, f in formulas.items():
        sh.getCellRangeByName(ref).setFormula(f)
    doc.calculateAll()
    yield sh
    doc.close(True)


def cell(sheet, ref):
    c = sheet.getCellRangeByName(ref)
    assert c.getError() == 0, ref
    return c


def test_the_array_shows_the_words(sheet):
    assert cell(sheet, "C1").getString() == "none"
    assert cell(sheet, "D1").getString() == "yes"


@pytest.mark.parametrize("ref", ["A3", "A4", "A5", "A6"])
def test_the_documented_comparisons_are_true(sheet, ref):
    assert cell(sheet, ref).getString() == "TRUE", sheet.getCellRangeByName(ref).getFormula()


def test_countif_on_an_index_cell_counts_the_word(sheet):
    assert cell(sheet, "A7").getValue() == 1.0


def test_calc_still_compares_array_text_apart(sheet):
    # The behaviour the README warns of.  When this fails, Calc compares an array's text
    # by value: remove the warning from addin/README.md and README.md.
    assert cell(sheet, "A9").getString() == "FALSE"
