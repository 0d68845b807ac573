"""The frozen copies the main job writes for colleagues without the add-in (issue 15
point 5): <sheet>-values.xlsx and <sheet>-values.ods.

Source of the expectations: the live sheet itself, recalculated with the add-in (the
copy must show the same values cell for cell, one row lower under its banner), and the
add-in's own names read from the library's table (officekit.catalogue): no formula of
the copy may call the add-in.
"""
import os
import re
import time

import pytest

from conftest import SAMPLES, SHEETS
from officekit.catalogue import functions, methods
from officekit.office import SERVICE

import run_samples
import share

WHEN = time.strftime("%Y-%m-%d %H:%M UTC", time.gmtime())
CALC_NAMES = [f.calc for f in functions()]
ALL_NAMES = list(methods())  # with the range and offer-path functions and DEALREASON


@pytest.fixture(scope="session")
def copies(office, tmp_path_factory):
    """{sheet: (xlsx, ods)} written by the main job's own step (run_samples.process)."""
    out = str(tmp_path_factory.mktemp("copies"))
    made = {}
    for name in SHEETS:
        row, problems = run_samples.process(office, os.path.join(SAMPLES, name), out, WHEN)
        assert problems == [] and row["copies"] == 2
        base = os.path.join(out, name[:-len(".fods")])
        made[name] = (base + "-values.xlsx", base + "-values.ods")
    return made


def calls_addin(formula):
    f = formula.upper()
    return SERVICE in f or any(re.search(r"\b%s\(" % c, f) for c in ALL_NAMES)


def used(sheet):
    cur = sheet.createCursor()
    cur.gotoEndOfUsedArea(False)
    return cur.RangeAddress.EndColumn + 1, cur.RangeAddress.EndRow + 1


def charts_below_last_break(sheet):
    """True when every chart starts at or below the last manual page break."""
    breaks = [b.Position for b in sheet.getRowPageBreaks() if b.ManualBreak]
    top = sheet.getCellByPosition(0, breaks[-1]).Position.Y
    return all(shape.Position.Y >= top for shape in sheet.DrawPage
               if shape.ShapeType == "com.sun.star.drawing.OLE2Shape")  # charts, not notes


def same(a, b):
    """Equal to the 15 significant digits LibreOffice 7.4 writes a number with in ODF
    and OOXML (observed; a half unit in the 15th digit is below 1e-14 relative)."""
    return a == b or abs(a - b) <= 1e-14 * max(abs(a), abs(b))


@pytest.mark.parametrize("name", SHEETS)
@pytest.mark.parametrize("kind", [0, 1], ids=["xlsx", "ods"])
def test_copy_has_the_live_values_and_no_addin_call(book, bare_office, copies, name, kind):
    """Opened where the add-in is missing, the copy recalculates without an error cell;
    no formula, conditional format or named range calls the add-in; every cell shows
    the live sheet's value or text; every cell that called the add-in carries its
    formula, with the add-in's Calc name, in a note; the banner says frozen and when."""
    live = book(name).Sheets.getByIndex(0)
    doc = bare_office.load(copies[name][kind])
    try:
        doc.calculateAll()
        assert run_samples.error_cells(doc) == []
        sh = doc.Sheets.getByIndex(0)
        banner = sh.getCellByPosition(0, 0)
        assert banner.getString().startswith("Frozen copy, made %s from %s" % (WHEN, name))
        assert banner.CellStyle == "CtoBanner" and sh.isProtected()
        for nm in doc.NamedRanges.ElementNames:
            assert not calls_addin(doc.NamedRanges.getByName(nm).Content), nm
        ncol, nrow = used(live)
        notes = 0
        for r in range(nrow):
            for c in range(ncol):
                a, b = live.getCellByPosition(c, r), sh.getCellByPosition(c, r + 1)
                assert not calls_addin(b.getFormula()), (b.AbsoluteName, b.getFormula())
                if a.getType().value == "EMPTY":
                    continue
                if a.FormulaResultType2 == 2 or a.getType().value == "TEXT":
                    assert b.getString() == a.getString(), b.AbsoluteName
                else:
                    assert same(b.getValue(), a.getValue()), (b.AbsoluteName, b.getValue(),
                                                              a.getValue())
                if SERVICE in a.getFormula().upper():
                    note = b.Annotation.String
                    # a cell of a matrix formula keeps it as {=...}
                    assert note.startswith(("Frozen value. Live formula: =",
                                            "Frozen value. Live formula: {=")), b.AbsoluteName
                    assert any(c_ + "(" in note for c_ in ALL_NAMES), note
                    notes += 1
        assert notes >= 20
        assert sh.Charts.getCount() == live.Charts.getCount()
        # the charts stay on their own page, under the banner that moved the rows down
        assert charts_below_last_break(sh)
        cf = sh.getCellRangeByPosition(0, 0, ncol, nrow).ConditionalFormat
        for i in range(cf.getCount()):
            assert not calls_addin(cf.getByIndex(i).Formula1)
    finally:
        doc.close(True)


def test_a_copy_refuses_an_error_cell(book):
    """A frozen copy never turns an error into a plausible number: freezing a sheet with
    an invalid input (negative days: Err:502, docs/reference/functions.md bad input) is
    refused."""
    doc = book("synergy_split.fods")
    doc.Sheets.getByIndex(0).getCellRangeByName("C14").setValue(-5)
    doc.calculateAll()
    with pytest.raises(RuntimeError, match="shows error 502"):
        share.freeze(doc, "synergy_split.fods", WHEN)
