#!/usr/bin/env python3
"""Writes the deal-comparison templates sample-sheets/*.fods through the UNO API.

  build_samples.py --profile DIR [--out DIR]

DIR is a private LibreOffice profile with the counteroffer add-in installed
(scripts/install-addin.sh --profile DIR).  Formulas are typed with the add-in's Calc
names (DEALSOLVE, ...); the saved files keep the add-in's service and method names
(ORG.COUNTEROFFER.DEALFUNCTIONS.GETSOLVE), so a sheet keeps its formulas in an office
without the add-in.  The .fods files are committed; run this after changing a template.

Every scenario, company and deal here is fictional and our own.  Model results come only
from the add-in's functions; the sheets add ordinary arithmetic for presentation
(percentages, differences, present values with DEALFACTOR, the best-candidate highlight).
"""
import argparse
import os
import sys

import uno
from com.sun.star.awt import Rectangle
from com.sun.star.lang import Locale

from officekit.office import FLAT_ODS, Office, prop, url

HERE = os.path.dirname(os.path.abspath(__file__))

CAUTION = ("Caution: every result on this sheet is a model estimate under the stated "
           "assumptions (complete information, stationary strategies, a responder who "
           "accepts when indifferent). It is not financial, legal or tax advice.")
CAUTION_SHORT = ("Caution: model estimates under the stated assumptions (see Method and sources "
                 "below), not financial, legal or tax advice.")
FICTION = "All companies, figures and deals on this sheet are fictional."
HOWTO = ("Yellow cells are inputs: change them and the sheet recalculates. Every model "
         "result comes from the counteroffer Calc add-in (DEAL... functions). Money: EUR m.")

CENTER = uno.Enum("com.sun.star.table.CellHoriJustify", "CENTER")
RIGHT = uno.Enum("com.sun.star.table.CellHoriJustify", "RIGHT")
OK_TEXT = "every input filled"
MONEY = "#,##0.00"
PCT = "0.0%"
FACTOR = "0.000000"
WHOLE = "0"

YELLOW = 0xFFF2CC
GREEN = 0xC6EFCE
GREY = 0xF2F2F2
NAVY = 0x1F3864


def rgb_style(doc, name, **props):
    styles = doc.StyleFamilies.getByName("CellStyles")
    if styles.hasByName(name):
        st = styles.getByName(name)
    else:
        st = doc.createInstance("com.sun.star.style.CellStyle")
        styles.insertByName(name, st)
    for k, v in props.items():
        st.setPropertyValue(k, v)
    return st


class Sheet:
    """One template: a document with one sheet, styles, named cells and charts."""

    def __init__(self, office, title):
        self.doc = office.new_sheet()
        self.sh = self.doc.Sheets.getByIndex(0)
        self.sh.Name = title
        self.title = title
        self.fmts = self.doc.NumberFormats
        self.locale = Locale("en", "US", "")
        rgb_style(self.doc, "CtoInput", CellBackColor=YELLOW, CharColor=0x1F4E79)
        rgb_style(self.doc, "CtoBest", CellBackColor=GREEN, CharWeight=150.0)
        rgb_style(self.doc, "CtoHeading", CharWeight=150.0, CharHeight=10.0, CellBackColor=GREY)
        rgb_style(self.doc, "CtoTitle", CharWeight=150.0, CharHeight=15.0, CharColor=NAVY)
        rgb_style(self.doc, "CtoNote", CharHeight=9.0)
        rgb_style(self.doc, "CtoAlarm", CellBackColor=0xFFC7CE, CharColor=0x9C0006,
                  CharWeight=150.0)

    def fmt(self, code):
        k = self.fmts.queryKey(code, self.locale, False)
        if k == -1:
            k = self.fmts.addNew(code, self.locale)
        return k

    def put(self, a1, value, fmt=None, style=None):
        c = self.sh.getCellRangeByName(a1)
        if isinstance(value, str) and value.startswith("="):
            c.setFormula(value)
        elif isinstance(value, str):
            c.setString(value)
        elif isinstance(value, bool):
            c.setFormula("=TRUE()" if value else "=FALSE()")
        else:
            c.setValue(float(value))
        if style:
            c.CellStyle = style
        if fmt:
            c.NumberFormat = self.fmt(fmt)
        return c

    def inp(self, a1, value, fmt=None):
        c = self.put(a1, value, fmt, "CtoInput")
        if isinstance(value, bool):
            c.setValue(1.0 if value else 0.0)
            c.NumberFormat = self.fmt("BOOLEAN")
        return c

    def style(self, rng, style):
        self.sh.getCellRangeByName(rng).CellStyle = style

    def numfmt(self, rng, code):
        self.sh.getCellRangeByName(rng).NumberFormat = self.fmt(code)

    def name(self, nm, a1):
        col = "".join(ch for ch in a1 if ch.isalpha())
        row = "".join(ch for ch in a1 if ch.isdigit())
        c = self.sh.getCellRangeByName(a1).CellAddress
        self.doc.NamedRanges.addNewByName(
            nm, "$'%s'.$%s$%s" % (self.title, col, row), c, 0)

    def widths(self, cm):
        for i, w in enumerate(cm):
            self.sh.Columns.getByIndex(i).Width = int(w * 1000)

    def header(self, title, scenario):
        self.put("A1", title, style="CtoTitle")
        self.put("A2", scenario + " " + FICTION)
        self.put("A3", CAUTION_SHORT)
        self.sh.getCellRangeByName("A3").CharWeight = 150.0
        self.put("A4", HOWTO)

    def input_rows(self, rows):
        """(row, label, value, number format) -> the label in A, a yellow input in B."""
        for r, label, v, f in rows:
            self.put("A%d" % r, label)
            self.inp("B%d" % r, v, f)

    def column_heads(self, row, heads, height):
        """A table's header row from column A: wrapped headings; height in 1/100 mm."""
        for i, h in enumerate(heads):
            c = self.put("%s%d" % ("ABCDEFGHIJKLMNOPQRSTUVWXYZ"[i], row), h,
                         style="CtoHeading")
            c.IsTextWrapped = True
        self.sh.Rows.getByIndex(row - 1).Height = height

    def notes(self, row, lines):
        self.put("A%d" % row, "Method and sources", style="CtoHeading")
        for i, text in enumerate(lines):
            self.put("A%d" % (row + 1 + i), text, style="CtoNote")
        self.put("A%d" % (row + 2 + len(lines)), CAUTION, style="CtoNote")
        return row + 2 + len(lines)

    def input_check(self, row, blank_ranges, extra=None):
        """A visible check that no input cell is empty (Calc 7.4 passes a single empty
        cell to an add-in as 0: addin/README.md), named check_inputs; the main job
        refuses a sheet whose check is not OK."""
        blanks = "+".join("COUNTBLANK(%s)" % r for r in blank_ranges)
        cond = "%s=0" % blanks
        msg = '"an input cell is empty (Calc would read it as 0)"'
        if extra:
            formula = '=IF(%s;IF(%s;"%s";"%s");%s)' % (cond, extra[0], OK_TEXT, extra[1], msg)
        else:
            formula = '=IF(%s;"%s";%s)' % (cond, OK_TEXT, msg)
        self.put("A%d" % row, "Input check")
        c = self.put("B%d" % row, formula)
        c.HoriJustify = RIGHT
        self.name("check_inputs", "B%d" % row)
        from com.sun.star.sheet.ConditionOperator import NOT_EQUAL
        cf = c.ConditionalFormat
        cf.addNew((prop("Operator", NOT_EQUAL), prop("Formula1", '"%s"' % OK_TEXT),
                   prop("StyleName", "CtoAlarm")))
        c.ConditionalFormat = cf

    def highlight(self, rng, formula):
        """Conditional format: `formula` (relative to rng's top-left) -> style Best."""
        from com.sun.star.sheet.ConditionOperator import FORMULA
        r = self.sh.getCellRangeByName(rng)
        cf = r.ConditionalFormat
        cf.addNew((prop("Operator", FORMULA), prop("Formula1", formula),
                   prop("StyleName", "CtoBest"),
                   prop("SourcePosition", r.getCellByPosition(0, 0).CellAddress)))
        r.ConditionalFormat = cf

    def addr(self, rng):
        return self.sh.getCellRangeByName(rng).RangeAddress

    def chart(self, name, ranges, pos_cell, size_cm, kind, title, xtitle, ytitle,
              rows=False, headers=(True, True)):
        """A chart from `ranges` (A1 strings) at `pos_cell`, size in cm."""
        anchor = self.sh.getCellRangeByName(pos_cell).Position
        rect = Rectangle(anchor.X, anchor.Y, int(size_cm[0] * 1000), int(size_cm[1] * 1000))
        charts = self.sh.Charts
        charts.addNewByName(name, rect, tuple(self.addr(r) for r in ranges),
                            headers[0], headers[1])
        ch = charts.getByName(name).EmbeddedObject
        diag = ch.createInstance("com.sun.star.chart." + kind)
        ch.setDiagram(diag)
        diag = ch.Diagram
        if rows:
            diag.DataRowSource = uno.Enum("com.sun.star.chart.ChartDataRowSource", "ROWS")
        ch.HasMainTitle = True
        ch.Title.String = title
        ch.Title.CharHeight = 12.0
        ch.HasLegend = True
        ch.Legend.Alignment = uno.Enum("com.sun.star.chart.ChartLegendPosition", "BOTTOM")
        diag.HasXAxisTitle = True
        diag.XAxisTitle.String = xtitle
        diag.HasYAxisTitle = True
        diag.YAxisTitle.String = ytitle
        return ch

    def break_before(self, row):
        """A manual page break above 1-based `row` (the charts start a new page)."""
        self.sh.Rows.getByIndex(row - 1).IsStartOfNewPage = True

    def page(self, pages_high=0):
        ps = self.doc.StyleFamilies.getByName("PageStyles").getByName(self.sh.PageStyle)
        ps.IsLandscape = True
        ps.Width, ps.Height = 29700, 21000
        for side in ("LeftMargin", "RightMargin", "TopMargin", "BottomMargin"):
            ps.setPropertyValue(side, 1200)
        ps.ScaleToPagesX = 1
        ps.ScaleToPagesY = pages_high
        ps.HeaderIsOn = False
        ps.FooterIsOn = True
        footer = ps.RightPageFooterContent
        footer.CenterText.setString(
            "counteroffer sample sheet: " + self.title +
            "  |  model estimates, not financial, legal or tax advice")
        ps.RightPageFooterContent = footer

    def save(self, path):
        self.doc.calculateAll()
        self.doc.storeToURL(url(path), (prop("FilterName", FLAT_ODS),))
        self.doc.close(True)


# ---- 1. synergy split with three candidates ----------------------------------------
def synergy(office, path):
    s = Sheet(office, "Synergy split")
    s.header("Synergy split: Halvard Instruments and three acquisition candidates",
             "Halvard Instruments is choosing which of three sensor makers to acquire; "
             "each deal creates the synergy below, to be split in negotiation.")
    s.widths([11.8, 3.4, 3.4, 3.4, 0.6])
    s.put("A6", "Deal-wide inputs", style="CtoHeading")
    s.put("A7", "Synergy to be split, present value (EUR m)")
    s.inp("B7", 120, MONEY)
    s.put("A8", "Our cost of capital (annual, effective)")
    s.inp("B8", 0.09, PCT)
    s.put("A9", "We make the first offer (TRUE or FALSE)")
    s.inp("B9", True)
    s.put("A10", "Days per year (day-count basis)")
    s.inp("B10", 365, WHOLE)
    s.put("A12", "Candidate inputs", style="CtoHeading")
    cand = {"B": ("Norrvik Sensors", 0.14, 30, 0.05, 12, 20),
            "C": ("Aldea Robotics", 0.11, 21, 0.02, 12, 35),
            "D": ("Pellucid Optics", 0.08, 45, 0.08, 12, 8)}
    s.put("A13", "Their cost of capital (annual, effective)")
    s.put("A14", "Days between offers")
    s.put("A15", "Breakdown risk: chance talks end after a rejected offer")
    s.put("A16", "Our walk-away value if this deal fails (EUR m)")
    s.put("A17", "Their walk-away value if this deal fails (EUR m)")
    for col, (nm, rate, days, p, wo, wt) in cand.items():
        s.inp(col + "12", nm)
        s.inp(col + "13", rate, PCT)
        s.inp(col + "14", days, WHOLE)
        s.inp(col + "15", p, PCT)
        s.inp(col + "16", wo, MONEY)
        s.inp(col + "17", wt, MONEY)
        s.sh.getCellRangeByName(col + "12").CharWeight = 150.0
    s.put("A19", "Results (EUR m unless stated)", style="CtoHeading")
    labels = {
        20: "Our share of the synergy (EUR m)",
        21: "Their share of the synergy (EUR m)",
        22: "Our share, % of the synergy",
        23: "Our expected loss if agreement slips one round (EUR m)",
        24: "Their expected loss if agreement slips one round (EUR m)",
        25: "First-mover advantage: our share opening minus responding (EUR m)",
        26: "Walk-away value that binds",
        27: "Our per-round discount factor",
        28: "Their per-round discount factor",
        29: "Our share with delay cost only: no breakdown, no walk-away (EUR m)",
        30: "   change if our cost of capital rises 1 point (EUR m)",
        31: "   change if their cost of capital rises 1 point (EUR m)",
    }
    for r, t in labels.items():
        s.put("A%d" % r, t)
    for c in "BCD":
        own = "%s27;%s28;%s15;%s16;%s17;0;0;%s16;%s17;$B$7" % ((c,) * 7)
        oth = "%s28;%s27;%s15;%s17;%s16;0;0;%s17;%s16;$B$7" % ((c,) * 7)
        s.put(c + "19", "=%s12" % c, style="CtoHeading")
        s.put(c + "20", "=DEALSOLVE(%s;$B$9)" % own, MONEY)
        s.put(c + "21", "=DEALSOLVE(%s;NOT($B$9))" % oth, MONEY)
        s.put(c + "22", "=%s20/$B$7" % c, PCT)
        s.put(c + "23", "=DEALDELAYCOST(%s27;%s20;%s15;%s16)" % ((c,) * 4), MONEY)
        s.put(c + "24", "=DEALDELAYCOST(%s28;%s21;%s15;%s17)" % ((c,) * 4), MONEY)
        s.put(c + "25", "=DEALSOLVE(%s;TRUE())-DEALSOLVE(%s;FALSE())" % (own, own), MONEY)
        s.put(c + "26", '=CHOOSE(INDEX(DEALSOLVEOUTCOME(%s;$B$9);1;3)+1;'
                        '"neither";"ours";"theirs";"both")' % own)
        s.put(c + "27", "=DEALFACTOR($B$8;%s14;$B$10)" % c, FACTOR)
        s.put(c + "28", "=DEALFACTOR(%s13;%s14;$B$10)" % (c, c), FACTOR)
        s.put(c + "29", "=DEALSHARERATE($B$8;%s13;%s14;$B$7;$B$9;$B$10)" % (c, c), MONEY)
        s.put(c + "30", '=DEALSENSITIVITY($B$8;%s13;%s14;"own";$B$7;$B$9;$B$10)/100'
              % (c, c), MONEY)
        s.put(c + "31", '=DEALSENSITIVITY($B$8;%s13;%s14;"other";$B$7;$B$9;$B$10)/100'
              % (c, c), MONEY)
        s.sh.getCellRangeByName(c + "26").HoriJustify = uno.Enum(
            "com.sun.star.table.CellHoriJustify", "RIGHT")
    s.put("A33", "Best candidate for us (largest share in EUR m)", style="CtoHeading")
    s.put("B33", "=INDEX(B12:D12;MATCH(MAX(B20:D20);B20:D20;0))", style="CtoBest")
    s.put("A34", "Our share with the best candidate (EUR m)")
    s.put("B34", "=MAX(B20:D20)", MONEY)
    s.input_check(18, ["B7:B10", "B12:D17"])
    s.highlight("B19:D22", "B$20=MAX($B$20:$D$20)")
    s.name("key_best_candidate", "B33")
    s.name("key_best_share", "B34")
    s.name("in_surplus", "B7")
    s.name("in_our_rate", "B8")
    s.name("in_we_open", "B9")
    s.name("in_basis", "B10")
    s.chart("split", ["A19:D21"], "F6", (15.5, 8.6), "BarDiagram",
            "Split of the synergy by candidate", "Candidate", "EUR m",
            rows=True)
    s.chart("delay", ["A19:D19", "A23:D24"], "F26", (15.5, 8.0), "BarDiagram",
            "Expected loss if agreement slips one round", "Candidate", "EUR m",
            rows=True)
    s.notes(36, [
        "Shares: alternating offers with breakdown risk and walk-away options, solved exactly (DEALSOLVE):",
        "   Rubinstein (1982) Econometrica 50(1), main theorem; breakdown risk: Binmore, Rubinstein & Wolinsky (1986) "
        "RAND J. Econ. 17(2) and Muthoo (1999) ch. 4;",
        "   walk-away (outside) options as constraints: Shaked & Sutton (1984) Econometrica 52(6); Binmore, Shaked & "
        "Sutton (1989) QJE 104(4); Muthoo (1999) ch. 5.",
        "   On breakdown each side gets its walk-away value. Their share is computed from their side of the same model.",
        "Per-round discount factor (1 + rate)^(-days/365) (DEALFACTOR; Muthoo 1999 s.3.2).",
        "Expected loss from one round of delay: p (share - walk-away) + (1 - p)(1 - factor) share (DEALDELAYCOST; "
        "Muthoo 1999 ch. 4).",
        "First-mover advantage: the same model with us opening minus us responding (Rubinstein 1982; Muthoo 1999 ch. 3).",
        "Delay-cost-only share and its exact derivative per rate (DEALSHARERATE, DEALSENSITIVITY): Rubinstein (1982); "
        "Muthoo (1999) s.3.2.",
        "Muthoo (1999): Bargaining Theory with Applications, Cambridge University Press.",
    ])
    s.page(1)
    s.save(path)


# ---- 2. supply-contract renegotiation ------------------------------------------------
DAYS = [1, 2, 3, 5, 7, 10, 14, 21, 30, 45, 60, 75, 90]


def supply(office, path):
    s = Sheet(office, "Supply contract")
    s.header("Supply-contract renegotiation: Kestrel Foundry and Brightwater Motors",
             "Kestrel Foundry (us) supplies castings to Brightwater Motors; the contract "
             "is up for renewal and both sides keep some income while they dispute it.")
    s.widths([12.6, 2.9, 2.9, 2.9, 2.9, 2.9, 2.9, 2.6, 2.6])
    s.put("A6", "Inputs", style="CtoHeading")
    rows = [
        (7, "Value of the renewed contract to both sides, present value (EUR m)", 48, MONEY),
        (8, "Our cost of capital (annual, effective)", 0.18, PCT),
        (9, "Their cost of capital (annual, effective)", 0.08, PCT),
        (10, "Our status-quo income during the dispute, present value (EUR m)", 12, MONEY),
        (11, "Their status-quo value during the dispute, present value (EUR m)", 15, MONEY),
        (12, "Our walk-away value: a contract with another buyer (EUR m)", 19, MONEY),
        (13, "Their walk-away value: a second-source supplier (EUR m)", 24, MONEY),
        (14, "We make the first offer (TRUE or FALSE)", True, None),
        (15, "Days between offers (headline results)", 14, WHOLE),
        (16, "Days per year (day-count basis)", 365, WHOLE),
    ]
    s.input_rows(rows)
    fo = "DEALFACTOR($B$8;$B$15;$B$16)"
    ft = "DEALFACTOR($B$9;$B$15;$B$16)"
    s.put("A18", "Headline results (EUR m unless stated)", style="CtoHeading")
    s.put("A19", "Our share of the contract value (EUR m)")
    s.put("B19", "=DEALSOLVE(%s;%s;0;0;0;B10;B11;B12;B13;B7;B14)" % (fo, ft), MONEY)
    s.put("A20", "Their share of the contract value (EUR m)")
    s.put("B20", "=DEALSOLVE(%s;%s;0;0;0;B11;B10;B13;B12;B7;NOT(B14))" % (ft, fo), MONEY)
    s.put("A21", "Our share, % of the contract value")
    s.put("B21", "=B19/B7", PCT)
    s.put("A22", "Walk-away value that binds")
    s.put("B22", '=CHOOSE(INDEX(DEALSOLVEOUTCOME(%s;%s;0;0;0;B10;B11;B12;B13;B7;B14);1;3)'
                 '+1;"neither";"ours";"theirs";"both")' % (fo, ft))
    s.sh.getCellRangeByName("B22").HoriJustify = RIGHT
    s.put("A23", "Our share if neither side had status-quo income (EUR m)")
    s.put("B23", "=DEALOUTSIDE(%s;%s;B12;B13;B7;B14)" % (fo, ft), MONEY)
    s.put("A24", "Effect of both sides' status-quo income on our share (EUR m)")
    s.put("B24", "=B19-B23", MONEY)
    s.name("key_our_share", "B19")
    s.name("key_their_share", "B20")
    s.name("key_binding", "B22")
    s.name("in_days", "B15")
    s.input_check(17, ["B7:B16", "A28:A%d" % (27 + len(DAYS))])
    s.name("in_our_inside", "B10")
    s.put("A26", "How the split moves as offers come from 1 to 90 days apart", style="CtoHeading")
    heads = ["Days between offers", "Our share, we open", "Our share, they open",
             "Their share, we open", "Their share, they open", "First-mover advantage",
             "Walk-away that binds (we open)", "Our factor per round",
             "Their factor per round"]
    s.column_heads(27, heads, 1000)
    for i, d in enumerate(DAYS):
        r = 28 + i
        s.inp("A%d" % r, d, WHOLE)
        s.sh.getCellRangeByName("A%d" % r).HoriJustify = CENTER
        s.put("H%d" % r, "=DEALFACTOR($B$8;A%d;$B$16)" % r, FACTOR)
        s.put("I%d" % r, "=DEALFACTOR($B$9;A%d;$B$16)" % r, FACTOR)
        own = "H%d;I%d;0;0;0;$B$10;$B$11;$B$12;$B$13;$B$7" % (r, r)
        oth = "I%d;H%d;0;0;0;$B$11;$B$10;$B$13;$B$12;$B$7" % (r, r)
        s.put("B%d" % r, "=DEALSOLVE(%s;TRUE())" % own, MONEY)
        s.put("C%d" % r, "=DEALSOLVE(%s;FALSE())" % own, MONEY)
        s.put("D%d" % r, "=DEALSOLVE(%s;FALSE())" % oth, MONEY)
        s.put("E%d" % r, "=DEALSOLVE(%s;TRUE())" % oth, MONEY)
        s.put("F%d" % r, "=B%d-C%d" % (r, r), MONEY)
        s.put("G%d" % r, '=CHOOSE(INDEX(DEALSOLVEOUTCOME(%s;TRUE());1;3)+1;'
                         '"neither";"ours";"theirs";"both")' % own)
        s.sh.getCellRangeByName("G%d" % r).HoriJustify = uno.Enum(
            "com.sun.star.table.CellHoriJustify", "RIGHT")
    last = 27 + len(DAYS)
    s.chart("days", ["A27:C%d" % last], "A%d" % (last + 2), (13.5, 8.5), "XYDiagram",
            "Our share against days between offers", "Days between offers", "EUR m",
            headers=(True, False))
    s.chart("fma", ["A27:A%d" % last, "F27:F%d" % last], "E%d" % (last + 2), (13.0, 8.5),
            "XYDiagram", "First-mover advantage against days between offers",
            "Days between offers", "EUR m", headers=(True, False))
    s.break_before(last + 2)
    s.notes(last + 22, [
        "Shares: alternating offers with inside options (status-quo payoffs while talks go on) and walk-away options,",
        "   solved exactly (DEALSOLVE): Rubinstein (1982) Econometrica 50(1); inside options: Muthoo (1999) ch. 6, "
        "the status quo sets the disagreement point;",
        "   Binmore, Rubinstein & Wolinsky (1986) RAND J. Econ. 17(2); walk-away (outside) options only truncate "
        "the split: Shaked & Sutton (1984) Econometrica 52(6);",
        "   Binmore, Shaked & Sutton (1989) QJE 104(4); Muthoo (1999) ch. 5. No breakdown risk on this sheet.",
        "Share without status-quo income (DEALOUTSIDE): Muthoo (1999) ch. 5. Per-round factor (1 + rate)^(-days/365) "
        "(DEALFACTOR; Muthoo 1999 s.3.2).",
        "First-mover advantage: our share opening minus responding in the same model (Rubinstein 1982; Muthoo 1999 ch. 3).",
        "Status-quo values are the present value of what each side collects if the dispute never ends (a flow f at "
        "rate r is worth f / r; Muthoo 1999 ch. 6).",
        "'Ours' binds: when they open, they must offer us our walk-away value, so our share when they open equals it "
        "and our share when we open follows from it.",
        "Muthoo (1999): Bargaining Theory with Applications, Cambridge University Press.",
    ])
    s.page(0)
    s.save(path)


# ---- 3. licence with a deadline --------------------------------------------------------
MAX_ROUNDS = 12


def licence(office, path):
    s = Sheet(office, "Licence deadline")
    s.header("Licence negotiation with a deadline: Lumen Biologics and Corvane Pharma",
             "Lumen Biologics (us) licenses an assay platform to Corvane Pharma, which "
             "must sign before its trial starts: only a limited number of offers fit.")
    s.widths([12.0, 2.7, 2.7, 2.7, 2.7, 2.3, 2.3, 2.5, 2.7, 2.7])
    s.put("A6", "Inputs", style="CtoHeading")
    rows = [
        (7, "Value of the licence to both sides, present value (EUR m)", 60, MONEY),
        (8, "Our cost of capital (annual, effective)", 0.12, PCT),
        (9, "Their cost of capital (annual, effective)", 0.08, PCT),
        (10, "Days between offers", 21, WHOLE),
        (11, "Offers possible before the deadline (rounds, 1 to %d)" % MAX_ROUNDS, 8, WHOLE),
        (12, "Breakdown risk: chance talks end for good after a rejected offer", 0.04, PCT),
        (13, "Our payoff if the deadline passes with no licence (EUR m)", 6, MONEY),
        (14, "Their payoff if the deadline passes with no licence (EUR m)", 0, MONEY),
        (15, "We make the first offer (TRUE or FALSE)", True, None),
        (16, "Days per year (day-count basis)", 365, WHOLE),
    ]
    s.input_rows(rows)
    s.put("A18", "Results (EUR m unless stated)", style="CtoHeading")
    s.put("A19", "Our per-round factor, times the chance talks survive a rejection")
    s.put("B19", "=(1-B12)*DEALFACTOR(B8;B10;B16)", FACTOR)
    s.put("A20", "Their per-round factor, times the chance talks survive a rejection")
    s.put("B20", "=(1-B12)*DEALFACTOR(B9;B10;B16)", FACTOR)
    s.put("A21", "Our share if agreed in round 1 (EUR m)")
    s.put("B21", "=DEALDEADLINE(B19;B20;B11;B13;B14;B7;B15)", MONEY)
    s.put("A22", "Their share if agreed in round 1 (EUR m)")
    s.put("B22", "=DEALDEADLINE(B20;B19;B11;B14;B13;B7;NOT(B15))", MONEY)
    s.put("A23", "Who makes the last offer before the deadline")
    s.put("B23", '=IF(ISODD(B11)=B15;"we";"they")')
    s.sh.getCellRangeByName("B23").HoriJustify = uno.Enum(
        "com.sun.star.table.CellHoriJustify", "RIGHT")
    s.put("A24", "Our share with no deadline, same breakdown risk (EUR m)")
    s.put("B24", "=DEALBREAKDOWN(DEALFACTOR(B8;B10;B16);DEALFACTOR(B9;B10;B16);B12;0;0;B7;B15)",
          MONEY)
    s.put("A25", "What the deadline is worth to us (EUR m)")
    s.put("B25", "=B21-B24", MONEY)
    s.name("key_our_share", "B21")
    s.name("key_their_share", "B22")
    s.name("key_last_offer", "B23")
    s.name("in_rounds", "B11")
    s.input_check(17, ["B7:B16"], ("AND(B11>=1;B11<=%d;INT(B11)=B11)" % MAX_ROUNDS,
                                   "rounds must be a whole number from 1 to %d" % MAX_ROUNDS))
    v = s.sh.getCellRangeByName("B11").Validation
    v.Type = uno.Enum("com.sun.star.sheet.ValidationType", "WHOLE")
    v.setOperator(uno.Enum("com.sun.star.sheet.ConditionOperator", "BETWEEN"))
    v.setFormula1("1")
    v.setFormula2(str(MAX_ROUNDS))
    v.ShowErrorMessage = True
    v.ErrorMessage = "Offers before the deadline: a whole number from 1 to %d." % MAX_ROUNDS
    s.sh.getCellRangeByName("B11").Validation = v
    s.name("in_breakdown", "B12")
    s.put("A27", "Round by round: the split if agreement is reached in that round",
          style="CtoHeading")
    heads = ["Round", "Our share if agreed in this round", "Their share if agreed in "
             "this round", "Value we lose vs round 1",
             "Value they lose vs round 1", "Who proposes", "Offers left",
             "Chance talks are still open", "Our share, present value today",
             "Their share, present value today"]
    s.column_heads(28, heads, 1400)
    for k in range(1, MAX_ROUNDS + 1):
        r = 28 + k
        g = "IF(A%d>$B$11;\"\";%%s)" % r
        s.put("A%d" % r, k, WHOLE)
        s.sh.getCellRangeByName("A%d" % r).HoriJustify = CENTER
        s.put("F%d" % r, "=" + g % ('IF(ISODD(A%d)=$B$15;"we";"they")' % r))
        s.put("G%d" % r, "=" + g % ("$B$11-A%d+1" % r), WHOLE)
        s.put("B%d" % r, "=" + g % ("DEALDEADLINE($B$19;$B$20;G%d;$B$13;$B$14;$B$7;F%d=\"we\")"
                                    % (r, r)), MONEY)
        s.put("C%d" % r, "=" + g % ("DEALDEADLINE($B$20;$B$19;G%d;$B$14;$B$13;$B$7;F%d=\"they\")"
                                    % (r, r)), MONEY)
        s.put("H%d" % r, "=" + g % ("(1-$B$12)^(A%d-1)" % r), PCT)
        s.put("I%d" % r, "=" + g % ("B%d*H%d*DEALFACTOR($B$8;(A%d-1)*$B$10;$B$16)"
                                    % (r, r, r)), MONEY)
        s.put("J%d" % r, "=" + g % ("C%d*H%d*DEALFACTOR($B$9;(A%d-1)*$B$10;$B$16)"
                                    % (r, r, r)), MONEY)
        s.put("D%d" % r, "=" + g % ("$I$29-I%d" % r), MONEY)
        s.put("E%d" % r, "=" + g % ("$J$29-J%d" % r), MONEY)
        for col in "FG":
            s.sh.getCellRangeByName("%s%d" % (col, r)).HoriJustify = uno.Enum(
                "com.sun.star.table.CellHoriJustify", "RIGHT")
    last = 28 + MAX_ROUNDS
    s.chart("position", ["A28:C%d" % last], "A%d" % (last + 2), (13.5, 8.5), "LineDiagram",
            "The split if agreement is reached in round k", "Round", "EUR m",
            headers=(True, True))
    s.chart("loss", ["A28:A%d" % last, "D28:E%d" % last], "E%d" % (last + 2), (14.0, 8.5),
            "LineDiagram", "Value lost against rounds of delay (present value)", "Round",
            "EUR m", headers=(True, True))
    s.break_before(last + 2)
    s.notes(last + 22, [
        "Shares with a deadline: finite alternating offers solved by backward induction (DEALDEADLINE): Ståhl (1972) "
        "Bargaining Theory;",
        "   Gibbons (1992) Game Theory for Applied Economists s.2.1.D. The last proposer keeps the value less the "
        "responder's deadline payoff.",
        "Breakdown risk enters as the survival-weighted factor (1 - p) x factor; this is exact when a breakdown leaves "
        "neither side anything from this licence",
        "   (Binmore, Rubinstein & Wolinsky 1986 RAND J. Econ. 17(2); Muthoo 1999 ch. 4).",
        "No-deadline comparison: the infinite-horizon model with the same breakdown risk (DEALBREAKDOWN; BRW 1986; "
        "Muthoo 1999 ch. 4).",
        "Present value today of agreement in round k: share x (1 - p)^(k-1) x discount over (k - 1) x days between "
        "offers (DEALFACTOR, (1 + rate)^(-days/365)).",
        "Muthoo (1999): Bargaining Theory with Applications, Cambridge University Press.",
    ])
    s.page(0)
    s.save(path)


TEMPLATES = [("synergy_split.fods", synergy), ("supply_renegotiation.fods", supply),
             ("licence_deadline.fods", licence)]


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--profile", required=True)
    ap.add_argument("--out", default=HERE)
    args = ap.parse_args()
    with Office(args.profile) as office:
        if not office.has_addin():
            print("error: the counteroffer add-in does not answer in profile " + args.profile,
                  file=sys.stderr)
            return 1
        for fname, fn in TEMPLATES:
            path = os.path.join(args.out, fname)
            fn(office, path)
            print("wrote", path)
    return 0


if __name__ == "__main__":
    sys.exit(main())
