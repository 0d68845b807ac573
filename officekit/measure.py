"""Text extents as Calc's own text engine lays them out: a temporary text shape on the
sheet's draw page, with the font of a cell, grows to fit the text; its size is read
back and the shape removed.  Sizes are in 1/100 mm at 100 % scale.

Used by the sample-sheet builder (row heights of wrapped notes) and by the sheet tests
(no text wider than the room it has)."""

FONT_PROPS = ("CharFontName", "CharHeight", "CharWeight", "CharPosture")
# Room Calc leaves between a cell's edge and its text, on each side (1/100 mm; about
# two pixels at 100 %, measured on LibreOffice 7.4: common practice, no source).
CELL_PADDING = 60


def text_size(sheet, doc, text, font_of, width=None):
    """(width, height) of `text` set in the font of the cell `font_of`; with `width`
    given the text wraps at that width and the height is what it needs."""
    shape = doc.createInstance("com.sun.star.drawing.TextShape")
    page = sheet.DrawPage
    page.add(shape)
    try:
        shape.setString(text)
        for p in FONT_PROPS:
            shape.setPropertyValue(p, font_of.getPropertyValue(p))
        for p in ("TextLeftDistance", "TextRightDistance", "TextUpperDistance",
                  "TextLowerDistance"):
            shape.setPropertyValue(p, 0)
        if width is None:
            shape.TextAutoGrowWidth = True
            shape.TextAutoGrowHeight = True
            shape.TextWordWrap = False
        else:
            shape.TextAutoGrowWidth = False
            shape.TextAutoGrowHeight = True
            shape.TextWordWrap = True
            size = shape.Size
            size.Width = int(width)
            size.Height = 100
            shape.Size = size
        return shape.Size.Width, shape.Size.Height
    finally:
        page.remove(shape)


def room(sheet, cell):
    """(width, height) the cell's text has: its merged area if it is merged."""
    rng = cell
    if cell.IsMerged:
        cur = sheet.createCursorByRange(cell)
        cur.collapseToMergedArea()
        rng = cur
    return rng.Size.Width, rng.Size.Height
