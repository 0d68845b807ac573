"""The sample sheet "uncertain counterparty" (issue 12 point 6), written through the UNO
API by build_samples.py.

Fictional scenario of our own: Corvid Analytics (us) negotiates the split of a data
joint venture with Ferrand Freight, whose cost of capital, breakdown risk and walk-away
value we know only as low / most likely / high.  The sheet shows our share in the most
likely case, the spread of our share over the ranges with its 10th, 50th and 90th
percentiles (DEALRANGE), the chance that a deal is rational at all (DEALRANGEOUTCOME),
and the one-at-a-time swing of each uncertain input (a tornado).

The percentiles and probabilities need the add-in's range functions (DEALRANGE,
DEALRANGEOUTCOME).  Until the add-in has them the builder writes no file: a sheet
showing #NAME? is never shipped (build_samples.py says so and goes on).
"""
from layout import Sheet

INPUTS = [  # row, label, short name, low, most likely, high, style
    (14, "Their cost of capital (annual, effective)", "Their cost of capital", 0.06, 0.11,
     0.20, "CtoInputPercent"),
    (15, "Breakdown risk: chance talks end after a rejected offer", "The breakdown risk",
     0.01, 0.03, 0.08, "CtoInputPercent"),
    (16, "Their walk-away value if talks fail (EUR m)", "Their walk-away value", 15, 25, 60,
     "CtoInputMoney"),
]
SORTED = 30          # first row of the one-at-a-time rows sorted by swing (the tornado)
DETAILS = 35         # page 2: the estimator's output and the percentile table
CAUTION_SHORT = ("Caution: model estimates under the stated assumptions (see Method and "
                 "sources), not financial, legal or tax advice.")
CAUTION = ("Caution: every result on this sheet is a model estimate under the stated "
           "assumptions (complete information in each drawn case, stationary strategies, "
           "a responder who accepts when indifferent, the ranges and their shapes as "
           "stated). It is not financial, legal or tax advice; it does not replace the "
           "judgment of your financial, legal and tax advisers.")
NOTES = [
    "Our share in each case: alternating offers with breakdown risk and walk-away values, "
    "solved exactly (DEALSOLVE): Rubinstein (1982) Econometrica 50(1); Binmore, "
    "Rubinstein & Wolinsky (1986) RAND J. Econ. 17(2) (a breakdown loses the venture for "
    "both); walk-away values as outside options either side may take at any time: Shaked "
    "& Sutton (1984) Econometrica 52(6); Muthoo (1999) chs. 4-5. "
    "Per-round factor (1 + rate)^(-days/365) (DEALFACTOR).",
    "One input at a time (the tornado): our share with one uncertain input at its low and "
    "at its high, the others at their most likely values (DEALSWING); it ignores "
    "interactions, which the percentiles include (one-way sensitivity, Howard 1988; "
    "Clemen & Reilly 2014 ch. 5).",
    "Percentiles over the ranges (DEALRANGE, DEALRANGEOUTCOME): each range a PERT "
    "distribution (low, most likely, high; Malcolm, Roseboom, Clark & Fazar 1959; Vose "
    "2008), sampled with scrambled Sobol' points (Sobol' 1967; Joe & Kuo 2008; Owen 1995) "
    "in 16 independent replicates for the error bars, percentiles by Hyndman & Fan (1996) "
    "definition 7, points doubled until three significant digits; the same inputs always "
    "give the same numbers.",
]


def money(ref):
    return 'TEXT(%s;"#,##0.00")' % ref


def solve_args(rate, breakdown, walk):
    """DEALSOLVE's arguments with their cost of capital, breakdown risk and walk-away
    value from the given cells.  The walk-away values are outside options (either side
    may take its alternative at any time); a breakdown loses the venture for both.  The
    range functions draw each range on its own, so a walk-away value enters once."""
    fo = "DEALFACTOR($B$8;$B$9;$B$12)"
    ft = "DEALFACTOR(%s;$B$9;$B$12)" % rate
    return "%s;%s;%s;0;0;0;0;$B$10;%s;$B$7;$B$11" % (fo, ft, breakdown, walk)


def range_args(extra=()):
    """The 14 inputs of DEALRANGE / DEALRANGEOUTCOME / DEALSWING in the catalogue order
    (addin/README.md "Ranges"): each uncertain input its 1x3 range (low, most likely,
    high: PERT), the others single cells; then `extra` (probability, shape, ...)."""
    return ";".join(["$B$8", "$B$14:$D$14", "$B$9", "$B$15:$D$15", "0", "0", "0", "0",
                     "$B$10", "$B$16:$D$16", "$B$7", "$B$11", "$B$12", "0"] + list(extra))


def inputs(s):
    s.heading(6, "What we know")
    s.input_rows([
        (7, "Value the joint venture creates, present value (EUR m)", 80, "CtoInputMoney"),
        (8, "Our cost of capital (annual, effective)", 0.09, "CtoInputPercent"),
        (9, "Days between offers", 30, "CtoInputWhole"),
        (10, "Our walk-away value if talks fail (EUR m)", 12, "CtoInputMoney"),
        (11, "We make the first offer (TRUE or FALSE)", True, "CtoInputBool"),
        (12, "Days per year (day-count basis)", 365, "CtoInputWhole")])
    s.heading(13, "Their side, known only as a range")
    for col, head in zip("BCD", ("Low", "Most likely", "High")):
        s.put("%s13" % col, head, "CtoColumnHead")
    for r, label, _short, lo, mode, hi, style in INPUTS:
        s.put("A%d" % r, label)
        for col, x in zip("BCD", (lo, mode, hi)):
            s.inp("%s%d" % (col, r), x, style)
    order = [("AND(B%d<=C%d;C%d<=D%d)" % (r, r, r, r),
              "row %d: low, most likely and high must be in that order" % r)
             for r, *_ in INPUTS]
    s.input_check(17, ["B7:B12", "B14:D16"], order + [
        ("AND(B14>=0;B15>=0;D15<1)", "their cost of capital must be at least 0 and the "
         "breakdown risk from 0 to below 1")])


def most_likely(s):
    s.heading(18, "Results (EUR m unless stated)")
    s.put("A19", "Our share with every input at its most likely value (EUR m)")
    s.put("B19", "=DEALSOLVE(%s)" % solve_args("C14", "C15", "C16"), "CtoMoney")
    s.put("A20", "Walk-away value that binds in that case")
    s.put("B20", "=INDEX(DEALSOLVEOUTCOME(%s);1;3)" % solve_args("C14", "C15", "C16"),
          "CtoWord")


LABELS = {"other_rate": "Their cost of capital", "breakdown_prob": "The breakdown risk",
          "other_outside": "Their walk-away value"}


def swing_table(s):
    """The tornado: DEALSWING's rows (largest swing first) with our labels."""
    n = len(INPUTS)
    s.heading(SORTED - 2, "One input at a time: our share with each uncertain input at its "
              "low and at its high, the others at their most likely values")
    s.column_heads(SORTED - 1, ["Uncertain input, largest swing first", "Name in the "
                                "add-in", "Our share at its low (EUR m)", "Our share at "
                                "its high (EUR m)", "Swing (EUR m)"])
    s.cell("B%d:D%d" % (SORTED, SORTED + n - 1)).setArrayFormula(
        "DEALSWING(%s)" % range_args())
    for k in range(n):
        r = SORTED + k
        # LEFT(..; LEN): a plain comparison with a text cell of an add-in's array is
        # FALSE in Calc 7.4 although the texts print alike (addin/README.md, "Words in
        # outcome arrays"); a text that passes through a function compares as expected
        lookup = ";".join('LEFT(B%d;%d)="%s";"%s"' % (r, len(key), key, word)
                          for key, word in LABELS.items())
        s.put("A%d" % r, "=IFS(%s;1;B%d)" % (lookup, r))
        s.style("B%d" % r, "CtoWord")
        s.style("C%d:D%d" % (r, r), "CtoMoney")
        s.put("E%d" % r, "=ABS(D%d-C%d)" % (r, r), "CtoMoney")
    s.merged("A%d:G%d" % (SORTED + n, SORTED + n),
             '="Reading: in the most likely case our share is "&%s&" EUR m; "&LOWER(A%d)&" '
             'moves it most, from "&%s&" to "&%s&" EUR m. One input at a time ignores how '
             'the inputs act together; the percentiles above include it."'
             % (money("B19"), SORTED, money("C%d" % SORTED), money("D%d" % SORTED)),
             "CtoReading")


OUTCOME_ROWS = 17  # DEALRANGEOUTCOME's rows with the default probabilities 0.1, 0.5, 0.9
PERCENT_ROWS = range(8, 12)  # the probabilities and the edge fraction (0-based)
PROBS = [round(0.05 * k, 2) for k in range(1, 20)]  # the percentile table: 5th to 95th
MARKED = (0.1, 0.5, 0.9)


def range_results(s):
    """Rows 21 to 26 from the estimator's output, which a details block on page 2 shows
    whole (DEALRANGEOUTCOME: estimate, 95% half-width, digits); the percentile table
    beside it (one DEALRANGE call over 19 probabilities)."""
    out = DETAILS + 2  # first row of the outcome block
    rows = [(21, "Our share, 10th percentile (EUR m)", 0, "CtoMoney"),
            (22, "Our share, median (EUR m)", 1, "CtoMoney"),
            (23, "Our share, 90th percentile (EUR m)", 2, "CtoMoney"),
            (24, "Chance a deal is rational at all", 8, "CtoPercent"),
            (25, "Chance their walk-away value binds", 10, "CtoPercent")]
    for r, label, k, style in rows:
        s.put("A%d" % r, label)
        s.put("B%d" % r, "=B%d" % (out + k), style)
    s.put("A26", "Spread of our share: 90th less 10th percentile (EUR m)")
    s.put("B26", "=B23-B21", "CtoMoney")
    s.heading(DETAILS, "Details: the estimator's output (DEALRANGEOUTCOME)", "D")
    s.column_heads(DETAILS + 1, ["Estimate, in the add-in's words (own: us; other: them)",
                                 "Value", "95% error bar (plus or minus)", "Digits"], "A")
    s.cell("A%d:D%d" % (out, out + OUTCOME_ROWS - 1)).setArrayFormula(
        "DEALRANGEOUTCOME(%s)" % range_args())
    for i in range(OUTCOME_ROWS):
        r = out + i
        s.style("A%d" % r, "CtoLabel")
        s.style("B%d:C%d" % (r, r), "CtoPercent" if i in PERCENT_ROWS else
                "CtoWhole" if i >= 12 else "CtoMoney")
        s.style("D%d" % r, "CtoWhole")
    s.style("B%d" % (out + 15), "CtoWord")
    s.heading(DETAILS, "Our share by percentile", "I", first="G")
    s.column_heads(DETAILS + 1, ["Percentile", "Our share (EUR m)", "Marked (EUR m)"], "G")
    s.fit_heads(DETAILS + 1, "A", 9)  # one height for both blocks' heads
    first, last = out, out + len(PROBS) - 1
    for i, p in enumerate(PROBS):
        s.put("G%d" % (first + i), p, "CtoPercent")
        s.style("H%d" % (first + i), "CtoMoney")
        if p in MARKED:
            s.put("I%d" % (first + i), "=H%d" % (first + i), "CtoMoney")
    s.cell("H%d:H%d" % (first, last)).setArrayFormula(
        "DEALRANGE(%s)" % range_args(["G%d:G%d" % (first, last)]))
    for i in range(len(PROBS)):  # the look comes from the style, not from the formula
        s.cell("I%d" % (first + i)).setPropertyToDefault("NumberFormat")
    return first, last


def has_range_functions(s):
    """True when the add-in in this office answers DEALRANGE (else the cell shows
    #NAME?, error 525)."""
    c = s.put("Z1", "=DEALRANGE(0.1;0.1;30)")
    s.doc.calculateAll()
    ok = c.getError() != 525
    c.clearContents(1023)  # every content and attribute flag (com.sun.star.sheet.CellFlags)
    return ok


def uncertain(office, path):
    """Writes the sheet; returns False (and writes nothing) when the add-in lacks the
    range functions."""
    s = Sheet(office, "Uncertain counterparty", [11.0, 3.2, 2.7, 2.7, 2.4, 2.2, 2.2, 2.6, 2.4])
    ready = has_range_functions(s)
    if not ready:
        s.doc.close(True)
        return False
    s.header("Uncertain counterparty: Corvid Analytics and Ferrand Freight",
             "Corvid Analytics (us) and Ferrand Freight split the value of a data joint "
             "venture; we know Ferrand's cost of capital, breakdown risk and walk-away "
             "value only as a low, a most likely and a high figure.",
             caution=CAUTION_SHORT)
    inputs(s)
    most_likely(s)
    swing_table(s)
    first, last = range_results(s)
    s.conclusion('"Most likely we get "&%s&" of "&%s&" EUR m; over the ranges 8 in 10 '
                 'cases give us "&%s&" to "&%s&" EUR m, a deal is rational with a "&'
                 'TEXT(B24;"0%%")&" chance, and "&LOWER(A%d)&" moves our share most."'
                 % (money("B19"), money("B7"), money("B21"), money("B23"), SORTED))
    for nm, a1 in (("key_most_likely", "B19"), ("key_p10", "B21"), ("key_p50", "B22"),
                   ("key_p90", "B23"), ("key_rational", "B24"), ("in_their_rate", "C14"),
                   ("in_surplus", "B7")):
        s.name(nm, a1)
    s.break_before(DETAILS)
    end = s.notes(last + 2, NOTES, caution=CAUTION)
    top = end + 1
    s.break_before(top)
    fan = s.chart("fan", ["G%d:I%d" % (DETAILS + 1, last)], "A%d" % top, (13.2, 11.0),
            "BarDiagram", "Our share by percentile (10th, 50th and 90th marked)",
            "Percentile", "EUR m")
    tornado = s.chart("tornado", ["A%d:A%d" % (SORTED - 1, SORTED + len(INPUTS) - 1),
                                  "C%d:D%d" % (SORTED - 1, SORTED + len(INPUTS) - 1)],
            "D%d" % top, (13.2, 11.0), "BarDiagram",
            "One input at a time: our share at each input's low and high",
            "Uncertain input", "EUR m")
    tornado.Diagram.Vertical = True  # horizontal bars ...
    tornado.Diagram.XAxis.ReverseDirection = True  # ... the largest swing on top
    for ct in fan.getFirstDiagram().getCoordinateSystems()[0].getChartTypes():
        ct.OverlapSequence = (100, 100)  # the marked bars over their own percentile
    s.page()
    s.save(path)
    return True
