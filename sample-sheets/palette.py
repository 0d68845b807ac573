"""The sample sheets' own look: a palette and the named cell styles built from it.

Chosen for print and for colour-blind readers: the roles differ in lightness as well as
hue (an input is a pale blue cell with a blue rule, the best candidate a pale amber cell
in bold, a warning white bold text on a dark red-brown cell), so they survive a
grey-scale printer and the common red-green deficiencies; blue against amber is the
pair such readers tell apart best.  Text is near-black on white or on the pale fills
(contrast ratio above 7:1).  Every cell of a sheet gets its look from one of the named
styles below (Format > Styles in Calc), never from direct formatting, so a deal team
can restyle a sheet in one place.
"""
from com.sun.star.table import BorderLine2

# ---- the palette (RGB) ----------------------------------------------------------------
INK = 0x1B1F24         # body text
SLATE = 0x46535F       # notes, help text
TITLE = 0x0B5563       # titles and rules: a deep teal
RULE = 0x8797A6        # thin rules, chart grid
HEAD = 0xE3E8ED        # heading rows: a cool light grey
INPUT = 0xDDEDF8       # input cells: a pale blue ...
INPUT_RULE = 0x2E6E9E  # ... with a blue rule
BEST = 0xFADDB0        # the best candidate: a pale amber
ALARM = 0x8E2B0B       # warnings: white bold text on a dark red-brown
WHITE = 0xFFFFFF
BANNER = 0x33404C      # the banner of a frozen copy: white text on dark slate

# Chart series, in order: blue, amber, teal, grey (lines also differ in dash and marker).
SERIES = (0x2E6E9E, 0xC7781A, 0x0B5563, 0x7B8794)

# The stock presets of a widely sold spreadsheet that issue 15 asks us not to use; the
# tests check that none of them appears in a sheet.
FORBIDDEN = (0xC6EFCE, 0xFFC7CE, 0x9C0006, 0xFFF2CC, 0x1F4E79, 0x1F3864)

PALETTE = (INK, SLATE, TITLE, RULE, HEAD, INPUT, INPUT_RULE, BEST, ALARM, WHITE, BANNER) \
    + SERIES

MONEY = "#,##0.00"
PCT = "0.0%"
FACTOR = "0.0000"
DECIMAL = "0.00"
WHOLE = "0"
BOOL = "BOOLEAN"

BOLD, NORMAL = 150.0, 100.0


def line(color, width=35):
    b = BorderLine2()
    b.Color = color
    b.OuterLineWidth = width
    b.LineWidth = width
    return b


def no_line():
    return BorderLine2()


def _input(fmt):
    return dict(parent="CtoInput", NumberFormat=fmt)


# name -> properties; "parent" names the parent style, "NumberFormat" a format code.
STYLES = {
    "CtoText": dict(CharColor=INK, CharHeight=10.0),
    "CtoTitle": dict(parent="CtoText", CharColor=TITLE, CharHeight=15.0, CharWeight=BOLD),
    "CtoSubtitle": dict(parent="CtoText", CharColor=SLATE, IsTextWrapped=True,
                        VertJustify="TOP"),
    "CtoCaution": dict(parent="CtoText", CharHeight=9.0, CharWeight=BOLD,
                       IsTextWrapped=True, VertJustify="TOP"),
    "CtoConclusion": dict(parent="CtoText", CharHeight=12.0, CharWeight=BOLD,
                          IsTextWrapped=True, VertJustify="CENTER",
                          TopBorder=line(TITLE, 53), BottomBorder=line(TITLE, 53)),
    "CtoHeading": dict(parent="CtoText", CharWeight=BOLD, CellBackColor=HEAD,
                       VertJustify="CENTER"),
    "CtoColumnHead": dict(parent="CtoHeading", IsTextWrapped=True, HoriJustify="CENTER"),
    "CtoLabel": dict(parent="CtoText"),
    "CtoMoney": dict(parent="CtoText", NumberFormat=MONEY),
    "CtoPercent": dict(parent="CtoText", NumberFormat=PCT),
    "CtoFactor": dict(parent="CtoText", NumberFormat=FACTOR),
    "CtoDecimal": dict(parent="CtoText", NumberFormat=DECIMAL),
    "CtoWhole": dict(parent="CtoText", NumberFormat=WHOLE),
    "CtoWord": dict(parent="CtoText", HoriJustify="RIGHT"),
    "CtoCheck": dict(parent="CtoText", CharWeight=BOLD, HoriJustify="LEFT"),
    "CtoNote": dict(parent="CtoText", CharHeight=9.0, CharColor=SLATE, IsTextWrapped=True,
                    VertJustify="TOP"),
    "CtoReading": dict(parent="CtoNote", CharPosture="ITALIC", VertJustify="CENTER",
                       LeftBorder=line(TITLE, 35)),
    "CtoHelp": dict(parent="CtoNote", VertJustify="CENTER"),
    "CtoInput": dict(parent="CtoText", CellBackColor=INPUT, CharColor=INK,
                     TopBorder=line(INPUT_RULE, 18), BottomBorder=line(INPUT_RULE, 18),
                     LeftBorder=line(INPUT_RULE, 18), RightBorder=line(INPUT_RULE, 18)),
    "CtoInputMoney": _input(MONEY),
    "CtoInputPercent": _input(PCT),
    "CtoInputWhole": _input(WHOLE),
    "CtoInputBool": dict(parent="CtoInput", NumberFormat=BOOL, HoriJustify="RIGHT"),
    "CtoInputText": dict(parent="CtoInput", CharWeight=BOLD, HoriJustify="RIGHT"),
    # conditional and emphasis styles
    "CtoBest": dict(parent="CtoText", CellBackColor=BEST, CharWeight=BOLD),
    "CtoBestName": dict(parent="CtoBest", HoriJustify="RIGHT"),
    "CtoAlarm": dict(parent="CtoText", CellBackColor=ALARM, CharColor=WHITE,
                     CharWeight=BOLD, HoriJustify="LEFT"),
    "CtoBanner": dict(parent="CtoText", CellBackColor=BANNER, CharColor=WHITE,
                      CharWeight=BOLD, IsTextWrapped=True, VertJustify="CENTER"),
}
