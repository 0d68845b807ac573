"""The page furniture every sample sheet shares, written through the UNO API: named
styles (palette.py), header, one-line conclusion, inputs, input check, tables, notes
that wrap to their text, charts in the palette, and the page set-up with its footer.

Formulas are typed with the add-in's Calc names (DEALSOLVE, ...); the saved files keep
the add-in's stored names, so a sheet keeps its formulas without the add-in.
"""
import uno
from com.sun.star.awt import Rectangle
from com.sun.star.drawing import LineDash
from com.sun.star.lang import Locale

import palette as pal
from officekit.measure import CELL_PADDING, text_size
from officekit.office import FLAT_ODS, prop, url

CAUTION = ("Caution: every result on this sheet is a model estimate under the stated "
           "assumptions (complete information, stationary strategies, a responder who "
           "accepts when indifferent). It is not financial, legal or tax advice; it "
           "does not replace the judgment of your financial, legal and tax advisers.")
CAUTION_SHORT = ("Caution: model estimates under the stated assumptions (see Method and "
                 "sources), not financial, legal or tax advice.")
FICTION = "All companies, figures and deals on this sheet are fictional."
HOWTO = ("Pale blue cells with a blue rule are inputs: change them and the sheet "
         "recalculates. Every model result comes from the counteroffer Calc add-in "
         "(DEAL... functions). Money: EUR m.")
OK_TEXT = "every input filled"
FOOTER_NOTE = "Model estimates, not financial, legal or tax advice"
COLS = "ABCDEFGHIJKLMNOPQRSTUVWXYZ"
ENUMS = {"HoriJustify": "com.sun.star.table.CellHoriJustify",
         "CharPosture": "com.sun.star.awt.FontSlant"}
VERT = {"STANDARD": 0, "TOP": 1, "CENTER": 2, "BOTTOM": 3}  # CellVertJustify2
DASH = LineDash(uno.Enum("com.sun.star.drawing.DashStyle", "RECT"), 0, 0, 1, 250, 150)


def col_of(a1):
    return "".join(ch for ch in a1 if ch.isalpha())


def row_of(a1):
    return int("".join(ch for ch in a1 if ch.isdigit()))


class Sheet:
    """One template: a document with one sheet, its styles, named cells and charts."""

    def __init__(self, office, title, widths_cm):
        self.doc = office.new_sheet()
        self.sh = self.doc.Sheets.getByIndex(0)
        self.sh.Name = title
        self.title = title
        self.fmts = self.doc.NumberFormats
        self.locale = Locale("en", "US", "")
        self.install_styles()
        for i, w in enumerate(widths_cm):
            self.sh.Columns.getByIndex(i).Width = int(w * 1000)
        self.last_col = COLS[len(widths_cm) - 1]

    # ---- styles and cells ------------------------------------------------------------
    def fmt(self, code):
        k = self.fmts.queryKey(code, self.locale, False)
        if k == -1:
            k = self.fmts.addNew(code, self.locale)
        return k

    def install_styles(self):
        styles = self.doc.StyleFamilies.getByName("CellStyles")
        for name, props in pal.STYLES.items():  # parents come first in STYLES
            st = self.doc.createInstance("com.sun.star.style.CellStyle")
            styles.insertByName(name, st)
            for k, v in props.items():
                if k == "parent":
                    st.ParentStyle = v
                elif k == "NumberFormat":
                    st.NumberFormat = self.fmt(v)
                elif k == "VertJustify":
                    st.VertJustify = VERT[v]
                elif k in ENUMS:
                    st.setPropertyValue(k, uno.Enum(ENUMS[k], v))
                else:
                    st.setPropertyValue(k, v)

    def cell(self, a1):
        return self.sh.getCellRangeByName(a1)

    def put(self, a1, value, style="CtoLabel"):
        c = self.cell(a1)
        if isinstance(value, str) and value.startswith("="):
            c.setFormula(value)
        elif isinstance(value, str):
            c.setString(value)
        elif isinstance(value, bool):
            c.setValue(1.0 if value else 0.0)
        else:
            c.setValue(float(value))
        c.CellStyle = style
        return c

    def inp(self, a1, value, style="CtoInputMoney"):
        return self.put(a1, value, style)

    def style(self, rng, style):
        self.cell(rng).CellStyle = style

    def name(self, nm, a1):
        c = self.cell(a1)
        addr = c.RangeAddress
        ref = "$'%s'.$%s$%d" % (self.title, col_of(a1.split(":")[0]), addr.StartRow + 1)
        if ":" in a1:
            end = a1.split(":")[1]
            ref += ":$%s$%d" % (col_of(end), addr.EndRow + 1)
        self.doc.NamedRanges.addNewByName(nm, ref, c.getCellByPosition(0, 0).CellAddress, 0)

    def row_height(self, row, h):
        self.sh.Rows.getByIndex(row - 1).Height = int(h)

    # ---- text that wraps to fit ------------------------------------------------------
    def fit(self, rng):
        """Row height of a one-row range (merged or not) set to what its wrapped text
        needs, measured with Calc's text engine, never below the default height."""
        r = self.cell(rng)
        first = r.getCellByPosition(0, 0)
        text = first.getString()
        width = r.Size.Width - 2 * CELL_PADDING
        _, h = text_size(self.sh, self.doc, text, first, width)
        row = r.RangeAddress.StartRow
        self.sh.Rows.getByIndex(row).Height = max(int(h * 1.08) + 120, 452)

    def merged(self, rng, value, style, fit=True):
        """A text or formula spread over `rng` (one row), wrapped, its height fitted."""
        self.put(rng.split(":")[0], value, style)
        self.cell(rng).merge(True)
        if fit:
            self.fit(rng)
        return rng

    def wide(self, row, value, style, first="A"):
        return self.merged("%s%d:%s%d" % (first, row, self.last_col, row), value, style)

    # ---- the blocks of a sheet -------------------------------------------------------
    def header(self, title, scenario, fiction=True, caution=CAUTION_SHORT):
        self.wide(1, title, "CtoTitle")
        self.wide(2, scenario + (" " + FICTION if fiction else ""), "CtoSubtitle")
        self.wide(3, caution, "CtoCaution")
        self.wide(4, HOWTO, "CtoSubtitle")

    def conclusion(self, formula, row=5):
        """The one-line conclusion, computed from the sheet's results: named
        `conclusion`; refused while the input check is not OK."""
        self.wide(row, '=IF(check_inputs<>"%s";"No conclusion yet: " & check_inputs;%s)'
                  % (OK_TEXT, formula), "CtoConclusion")
        self.row_height(row, 1250)
        self.name("conclusion", "A%d" % row)

    def heading(self, row, text, last=None, first="A"):
        """A heading bar from `first` to `last`; merged over it when the text needs
        more than its first cell (then nothing else may go into that bar)."""
        c = self.put("%s%d" % (first, row), text, "CtoHeading")
        last = last or self.last_col
        for col in COLS[COLS.index(first) + 1:COLS.index(last) + 1]:
            if not self.cell("%s%d" % (col, row)).getFormula():
                self.style("%s%d" % (col, row), "CtoHeading")
        need, _ = text_size(self.sh, self.doc, text, c)
        if need > c.Size.Width - 2 * CELL_PADDING and last != first:
            self.cell("%s%d:%s%d" % (first, row, last, row)).merge(True)

    def input_rows(self, rows):
        """(row, label, value, style) -> the label in A, an input in B."""
        for r, label, v, style in rows:
            self.put("A%d" % r, label)
            self.inp("B%d" % r, v, style)

    def column_heads(self, row, heads, first="A"):
        start = COLS.index(first)
        for i, h in enumerate(heads):
            self.put("%s%d" % (COLS[start + i], row), h, "CtoColumnHead")
        self.fit_heads(row, first, len(heads))

    def fit_heads(self, row, first, n):
        start = COLS.index(first)
        need = 452
        for i in range(n):
            c = self.cell("%s%d" % (COLS[start + i], row))
            _, h = text_size(self.sh, self.doc, c.getString(), c,
                             c.Size.Width - 2 * CELL_PADDING)
            need = max(need, int(h * 1.08) + 120)
        self.row_height(row, need)

    def notes(self, row, lines, caution=CAUTION):
        """Method and sources: one wrapped line per entry, then the caution (each sheet
        may state its own assumptions in it)."""
        self.heading(row, "Method and sources")
        for i, text in enumerate(lines):
            self.wide(row + 1 + i, text, "CtoNote")
        self.wide(row + 1 + len(lines), caution, "CtoCaution")
        return row + 2 + len(lines)

    def input_check(self, row, blank_ranges, checks=()):
        """A visible check under the inputs, named check_inputs: no input cell empty
        (Calc 7.4 passes a single empty cell to an add-in as 0: addin/README.md), then
        each (condition that must hold, message) in turn.  The main job refuses a sheet
        whose check is not OK."""
        blanks = "+".join("COUNTBLANK(%s)" % r for r in blank_ranges)
        formula = '"%s"' % OK_TEXT
        for cond, msg in reversed(list(checks)):
            formula = 'IF(%s;%s;"%s")' % (cond, formula, msg)
        formula = '=IF(%s=0;%s;"an input cell is empty (Calc would read it as 0)")' % (
            blanks, formula)
        self.put("A%d" % row, "Input check")
        c = self.put("B%d" % row, formula, "CtoCheck")
        self.cell("B%d:%s%d" % (row, self.last_col, row)).merge(True)
        self.name("check_inputs", "B%d" % row)
        from com.sun.star.sheet.ConditionOperator import NOT_EQUAL
        cf = c.ConditionalFormat
        cf.addNew((prop("Operator", NOT_EQUAL), prop("Formula1", '"%s"' % OK_TEXT),
                   prop("StyleName", "CtoAlarm")))
        c.ConditionalFormat = cf

    def highlight(self, rng, formula, style="CtoBest"):
        """Conditional format: `formula` (relative to rng's top-left) -> `style`."""
        from com.sun.star.sheet.ConditionOperator import FORMULA
        r = self.cell(rng)
        cf = r.ConditionalFormat
        cf.addNew((prop("Operator", FORMULA), prop("Formula1", formula),
                   prop("StyleName", style),
                   prop("SourcePosition", r.getCellByPosition(0, 0).CellAddress)))
        r.ConditionalFormat = cf

    def validate(self, a1, kind, low=None, high=None, title="", help_text="", error="",
                 values=None):
        """Data validity on an input: kind WHOLE, DECIMAL or LIST (`values`), between
        low and high (either may be None), with help shown when the cell is chosen."""
        from com.sun.star.sheet.ConditionOperator import BETWEEN, GREATER_EQUAL, LESS_EQUAL
        c = self.cell(a1)
        v = c.Validation
        v.Type = uno.Enum("com.sun.star.sheet.ValidationType", kind)
        if kind == "LIST":
            v.setFormula1(";".join(values))
        elif low is not None and high is not None:
            v.setOperator(BETWEEN)
            v.setFormula1(repr(low))
            v.setFormula2(repr(high))
        elif low is not None:
            v.setOperator(GREATER_EQUAL)
            v.setFormula1(repr(low))
        else:
            v.setOperator(LESS_EQUAL)
            v.setFormula1(repr(high))
        v.IgnoreBlankCells = True
        v.ShowInputMessage = True
        v.InputTitle = title[:30]
        v.InputMessage = help_text
        v.ShowErrorMessage = True
        v.ErrorTitle = "Not a valid input"
        v.ErrorMessage = error or help_text
        v.ErrorAlertStyle = uno.Enum("com.sun.star.sheet.ValidationAlertStyle", "STOP")
        c.Validation = v

    # ---- charts ----------------------------------------------------------------------
    def chart(self, name, ranges, pos_cell, size_cm, kind, title, xtitle, ytitle,
              rows=False, headers=(True, True)):
        """A chart from `ranges` at `pos_cell`: plain white background, the value axis
        from zero, series in the palette (lines also differ in dash and marker)."""
        anchor = self.cell(pos_cell).Position
        rect = Rectangle(anchor.X, anchor.Y, int(size_cm[0] * 1000), int(size_cm[1] * 1000))
        self.sh.Charts.addNewByName(name, rect, tuple(self.cell(r).RangeAddress
                                                      for r in ranges), headers[0], headers[1])
        ch = self.sh.Charts.getByName(name).EmbeddedObject
        ch.setDiagram(ch.createInstance("com.sun.star.chart." + kind))
        diag = ch.Diagram
        if rows:
            diag.DataRowSource = uno.Enum("com.sun.star.chart.ChartDataRowSource", "ROWS")
        ch.HasMainTitle = True
        ch.Title.String = title
        ch.Title.CharHeight = 12.0
        ch.Title.CharColor = pal.INK
        ch.HasLegend = True
        ch.Legend.Alignment = uno.Enum("com.sun.star.chart.ChartLegendPosition", "BOTTOM")
        ch.Legend.FillStyle = uno.Enum("com.sun.star.drawing.FillStyle", "NONE")
        ch.Legend.LineStyle = uno.Enum("com.sun.star.drawing.LineStyle", "NONE")
        diag.HasXAxisTitle = True
        diag.XAxisTitle.String = xtitle
        diag.HasYAxisTitle = True
        diag.YAxisTitle.String = ytitle
        if kind == "XYDiagram":
            diag.Lines = True
        self.plain(ch, lines=kind in ("XYDiagram", "LineDiagram"))
        return ch

    def plain(self, ch, lines):
        """White area, no wall fill, light grid, value axis from zero, palette series."""
        none = uno.Enum("com.sun.star.drawing.FillStyle", "NONE")
        ch.Area.FillStyle = uno.Enum("com.sun.star.drawing.FillStyle", "SOLID")
        ch.Area.FillColor = pal.WHITE
        ch.Area.LineStyle = uno.Enum("com.sun.star.drawing.LineStyle", "NONE")
        diag = ch.Diagram
        diag.Wall.FillStyle = none
        diag.Wall.LineColor = pal.RULE
        y = diag.YAxis
        y.AutoMin = False
        y.Min = 0.0
        y.LineColor = pal.RULE
        diag.XAxis.LineColor = pal.RULE
        if diag.HasYAxisGrid:
            diag.YMainGrid.LineColor = pal.HEAD
        series = []
        for ct in ch.getFirstDiagram().getCoordinateSystems()[0].getChartTypes():
            series += list(ct.getDataSeries())
        for i, one in enumerate(series):
            color = pal.SERIES[i % len(pal.SERIES)]
            one.Color = color
            one.FillColor = color
            if lines:
                one.LineWidth = 60
                one.LineColor = color
                one.LineStyle = uno.Enum("com.sun.star.drawing.LineStyle",
                                         "DASH" if i % 2 else "SOLID")
                if i % 2:
                    one.LineDash = DASH
            else:
                one.LineStyle = uno.Enum("com.sun.star.drawing.LineStyle", "NONE")

    # ---- page and file ---------------------------------------------------------------
    def break_before(self, row):
        """A manual page break above 1-based `row`."""
        self.sh.Rows.getByIndex(row - 1).IsStartOfNewPage = True

    def page(self):
        """A4 landscape, one page wide; footer: file name | caution | date and page."""
        ps = self.doc.StyleFamilies.getByName("PageStyles").getByName(self.sh.PageStyle)
        ps.IsLandscape = True
        ps.Width, ps.Height = 29700, 21000
        for side in ("LeftMargin", "RightMargin", "TopMargin", "BottomMargin"):
            ps.setPropertyValue(side, 1200)
        ps.ScaleToPagesX = 1
        ps.ScaleToPagesY = 0
        ps.HeaderIsOn = False
        ps.FooterIsOn = True
        footer = ps.RightPageFooterContent
        self.field_text(footer.LeftText, [("field", "FileName")])
        self.field_text(footer.CenterText, [("text", FOOTER_NOTE)])
        self.field_text(footer.RightText, [
            ("text", "Printed "), ("field", "DateTime"), ("text", "  |  Page "),
            ("field", "PageNumber"), ("text", " of "), ("field", "PageCount")])
        ps.RightPageFooterContent = footer

    def field_text(self, text, parts):
        text.setString("")
        cur = text.createTextCursor()
        for kind, what in parts:
            if kind == "text":
                text.insertString(cur, what, False)
                continue
            f = self.doc.createInstance("com.sun.star.text.TextField." + what)
            if what == "DateTime":
                f.IsDate = True
                f.IsFixed = False
                f.NumberFormat = self.fmt("YYYY-MM-DD")
            if what == "FileName":
                f.FileFormat = 3  # com.sun.star.text.FilenameDisplayFormat.NAME_AND_EXT
            text.insertTextContent(cur, f, False)

    def save(self, path):
        self.doc.calculateAll()
        self.doc.storeToURL(url(path), (prop("FilterName", FLAT_ODS),))
        self.doc.close(True)
