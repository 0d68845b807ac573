"""Frozen copies of a recalculated sheet for colleagues without the add-in.

freeze(doc, source_name, when) turns the loaded, recalculated document into a copy
that needs no add-in: every formula that calls the add-in, and every formula that
depends on one, is replaced by its value, and the value carries its original formula
(with the add-in's Calc names) in a note; a banner row on top says the numbers are
frozen, when and from which file; the sheet is protected (no password) so that an
input cannot be changed by accident while the results stay as they were.  Formulas
that depend only on inputs (the input check) stay live.  write_copies() stores the
copy as .xlsx and .ods.
"""
import os

import uno  # noqa: F401  (makes the com.sun.star modules importable)
from com.sun.star.sheet.CellFlags import FORMULA
from com.sun.star.sheet.FormulaResult import STRING

from officekit.measure import CELL_PADDING, text_size
from officekit.office import ODS, SERVICE, XLSX, prop, url

BANNER = ("Frozen copy, made {when} from {source}: every model result on this sheet is "
          "a fixed value, not a live formula (each keeps its original formula in a "
          "note), so it opens without the counteroffer add-in, and changing an input "
          "here does not update it. The sheet is protected for that reason: change the "
          "inputs in {source} with the add-in installed. Model estimates, not financial, "
          "legal or tax advice.")


def formula_cells(sheet):
    """[cell] of every formula cell of the sheet."""
    out = []
    ranges = sheet.queryContentCells(FORMULA)
    for addr in ranges.RangeAddresses:
        for r in range(addr.StartRow, addr.EndRow + 1):
            for c in range(addr.StartColumn, addr.EndColumn + 1):
                out.append(sheet.getCellByPosition(c, r))
    return out


def calls_addin(cell):
    return SERVICE in cell.getFormula().upper()


def to_freeze(sheet):
    """The add-in formula cells and the formula cells that depend on them."""
    cells = formula_cells(sheet)
    addin = {(c.CellAddress.Column, c.CellAddress.Row) for c in cells if calls_addin(c)}
    out = []
    for c in cells:
        key = (c.CellAddress.Column, c.CellAddress.Row)
        if key in addin or any(depends(r, addin) for r in
                               c.queryPrecedents(True).RangeAddresses):
            out.append(c)
    return out


def depends(addr, addin):
    return any(addr.StartColumn <= col <= addr.EndColumn and
               addr.StartRow <= row <= addr.EndRow for col, row in addin)


def freeze(doc, source, when):
    """Freeze every sheet of `doc` in place; returns the number of cells frozen."""
    n = 0
    for sheet in doc.Sheets:
        frozen = [(c, c.FormulaLocal, c.getError(), c.FormulaResultType2, c.getValue(),
                   c.getString()) for c in to_freeze(sheet)]
        for cell, formula, err, _result, value, text in frozen:
            if err:
                raise RuntimeError("%s!%s shows error %d: a copy would hide it"
                                   % (sheet.Name, cell.AbsoluteName, err))
        for cell, formula, _err, result, value, text in frozen:
            if result == STRING:
                cell.setString(text)
            else:
                cell.setValue(value)
            sheet.Annotations.insertNew(cell.CellAddress,
                                        "Frozen value. Live formula: " + formula)
            n += 1
        banner(doc, sheet, BANNER.format(when=when, source=source))
        sheet.protect("")
    return n


def banner(doc, sheet, text):
    """A first row holding the banner across the used columns; the charts keep their
    place against the rows below it (and so stay on their own page)."""
    cur = sheet.createCursor()
    cur.gotoEndOfUsedArea(False)
    last = max(cur.RangeAddress.EndColumn, 4)
    places = [(shape, anchor_row(sheet, shape)) for shape in sheet.DrawPage]
    sheet.Rows.insertByIndex(0, 1)
    rng = sheet.getCellRangeByPosition(0, 0, last, 0)
    cell = sheet.getCellByPosition(0, 0)
    cell.setString(text)
    cell.CellStyle = "CtoBanner"
    rng.merge(True)
    _, need = text_size(sheet, doc, text, cell, rng.Size.Width - 2 * CELL_PADDING)
    sheet.Rows.getByIndex(0).Height = int(need * 1.08) + 200
    for shape, (row, offset) in places:
        pos = shape.Position
        pos.Y = sheet.getCellByPosition(0, row + 1).Position.Y + offset
        shape.Position = pos


def anchor_row(sheet, shape):
    """(row whose top is at or above the shape's top, the shape's offset from it)."""
    y = shape.Position.Y
    row = 0
    while sheet.getCellByPosition(0, row + 1).Position.Y <= y:
        row += 1
    return row, y - sheet.getCellByPosition(0, row).Position.Y


def write_copies(doc, out_dir, base):
    """<base>-values.xlsx and <base>-values.ods in out_dir; returns their paths."""
    paths = []
    for ext, flt in (("xlsx", XLSX), ("ods", ODS)):
        path = os.path.join(out_dir, "%s-values.%s" % (base, ext))
        if os.path.exists(path):
            os.remove(path)
        doc.storeToURL(url(path), (prop("FilterName", flt),))
        paths.append(path)
    return paths
