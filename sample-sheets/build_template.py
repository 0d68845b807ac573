"""The blank deal template (deal_template.fods): one deal to fill in, written by
build_samples.py with the same page furniture as the samples (layout.py).

Every input has data validity (ranges, whole numbers, a TRUE/FALSE list) with help
text shown when the cell is chosen and printed beside it; the input check guards empty
cells and implausible values (a rate typed as 8 instead of 8%: above 1 = 100 % a year;
days between offers above 3650; a breakdown risk above 0.5 a round).  Results appear
only when the check is OK; where the model gives no number, the column beside the
result says why, in the library's words (DEALREASON; addin/README.md "Why a cell
fails").
"""
from layout import OK_TEXT, Sheet

# (row, label, style, validity (kind, low, high), help)
INPUTS = [
    (7, "Deal: the other side's name", "CtoInputText", ("TEXT_LEN", 1, 60),
     "Who we negotiate with; it appears in the conclusion line."),
    (8, "Value to be split, present value (EUR m)", "CtoInputMoney", ("DECIMAL", 0.0, None),
     "What an agreement is worth to both sides together, above zero."),
    (9, "Our cost of capital (annual, effective)", "CtoInputPercent",
     ("DECIMAL", 0.0, None), "A rate per year: type 8% or 0.08, not 8."),
    (10, "Their cost of capital (annual, effective)", "CtoInputPercent",
     ("DECIMAL", 0.0, None), "Their rate per year: type 8% or 0.08, not 8."),
    (11, "Days between offers", "CtoInputWhole", ("WHOLE", 1, None),
     "How long one side takes to answer with a counter-offer, in days (1 or more)."),
    (12, "Breakdown risk: chance talks end after a rejected offer", "CtoInputPercent",
     ("DECIMAL", 0.0, 1.0), "Chance per round that talks end for good: type 3% or "
     "0.03; 0 if talks cannot break down."),
    (13, "Our walk-away value if talks fail (EUR m)", "CtoInputMoney",
     ("DECIMAL", -1e12, 1e12), "What we get elsewhere if there is no deal (0 if nothing)."),
    (14, "Their walk-away value if talks fail (EUR m)", "CtoInputMoney",
     ("DECIMAL", -1e12, 1e12), "What they get elsewhere if there is no deal."),
    (15, "Our status-quo income while we talk, PV (EUR m)", "CtoInputMoney",
     ("DECIMAL", -1e12, 1e12), "Present value of what we keep earning while talks "
     "go on (0 if nothing)."),
    (16, "Their status-quo income while we talk, PV (EUR m)", "CtoInputMoney",
     ("DECIMAL", -1e12, 1e12), "Present value of what they keep earning while talks "
     "go on."),
    (17, "We make the first offer (TRUE or FALSE)", "CtoInputBool", ("LIST", None, None),
     "TRUE if we open the talks, FALSE if they do."),
    (18, "Days per year (day-count basis)", "CtoInputWhole", ("WHOLE", 360, 366),
     "365 unless your rates use another day count (360 to 366)."),
]
# The input check's plausibility limits (issue 15): a cost of capital above 1 is above
# 100 % a year, most likely a percentage typed as a number.
# The same limits as the library's plausible ranges (cto_arg_plausible_range; a test
# compares them).
CHECKS = [
    ("AND(B9<=1.0;B10<=1.0)", "a cost of capital above 100% a year: type 8% or 0.08, "
     "not 8"),
    ("B11<=3650.0", "days between offers above 3650 (ten years): check the unit"),
    ("B12<=0.5", "a breakdown risk above 0.5 a round: type 5% or 0.05, not 5"),
]
# The library's reason in words (DEALREASON, cto_explain: addin/README.md "Why a cell
# fails"), shown beside a result unless it is a plain "<function>: ok".
REASON = 'IF(DEALREASON(%s)="%s: ok";"";DEALREASON(%s))'
NOTES = [
    "Shares: alternating offers with breakdown risk, status-quo income (inside options) "
    "and walk-away options, solved exactly (DEALSOLVE): Rubinstein (1982) Econometrica "
    "50(1); Binmore, Rubinstein & Wolinsky (1986) RAND J. Econ. 17(2); Shaked & Sutton "
    "(1984) Econometrica 52(6); Muthoo (1999) chs. 4-6. On breakdown each side gets its "
    "walk-away value.",
    "Expected loss from one round of delay (DEALDELAYCOST; Muthoo 1999 ch. 4); first-mover "
    "advantage: our share opening minus responding (Rubinstein 1982; Muthoo 1999 ch. 3); "
    "per-round factor (1 + rate)^(-days/365) (DEALFACTOR; Muthoo 1999 s.3.2).",
    "No deadline is modelled here. With a fixed number of offers before a deadline "
    "(DEALDEADLINE; the licence_deadline sample) the split jumps between odd and even "
    "counts of offers, because whoever can make the last offer takes (nearly) all that is "
    "left (Ståhl 1972): a timing convention of that model, not a forecast; show the band "
    "between two consecutive counts.",
    "Muthoo (1999): Bargaining Theory with Applications, Cambridge University Press.",
]


def inputs(s):
    s.heading(6, "Inputs")
    s.put("C6", "What to enter", "CtoHeading")
    for r, label, style, (kind, low, high), help_text in INPUTS:
        s.put("A%d" % r, label)
        s.inp("B%d" % r, "", style)
        s.put("C%d" % r, help_text, "CtoHelp")
        s.fit("C%d" % r)
        if kind == "LIST":
            s.validate("B%d" % r, kind, title=label, help_text=help_text,
                       values=["TRUE()", "FALSE()"])
        else:
            s.validate("B%d" % r, kind, low, high, title=label, help_text=help_text)
    s.input_check(19, ["B7:B18"], CHECKS)


def results(s):
    ok = 'check_inputs="%s"' % OK_TEXT
    fo, ft = "B31", "B32"
    own = "%s;%s;B12;B13;B14;B15;B16;B13;B14;B8" % (fo, ft)
    oth = "%s;%s;B12;B14;B13;B16;B15;B14;B13;B8" % (ft, fo)
    ours = '"DEALSOLVE";%s;B17' % own
    s.heading(21, "Results (EUR m unless stated)")
    s.put("C21", "What the model says (when not plain ok)", "CtoHeading")
    rows = [
        (22, "Our share of the value (EUR m)", "DEALSOLVE(%s;B17)" % own, "CtoMoney", ours),
        (23, "Their share of the value (EUR m)", "DEALSOLVE(%s;NOT(B17))" % oth, "CtoMoney",
         '"DEALSOLVE";%s;NOT(B17)' % oth),
        (24, "Our share, % of the value", "B22/B8", "CtoPercent", None),
        (25, "Walk-away value that binds", "INDEX(DEALSOLVEOUTCOME(%s;B17);1;3)" % own,
         "CtoWord", None),
        (26, "Our expected loss if agreement slips one round (EUR m)",
         "DEALDELAYCOST(%s;B22;B12;B13)" % fo, "CtoMoney",
         '"DEALDELAYCOST";%s;B22;B12;B13' % fo),
        (27, "First-mover advantage: opening minus responding (EUR m)",
         "DEALSOLVE(%s;TRUE())-DEALSOLVE(%s;FALSE())" % (own, own), "CtoMoney",
         '"DEALSOLVE";%s;NOT(B17)' % own),
    ]
    for r, label, formula, style, why in rows:
        s.put("A%d" % r, label)
        s.put("B%d" % r, '=IF(%s;%s;"")' % (ok, formula), style)
        if why:
            reason = REASON % (why, why.split(";")[0].strip('"'), why)
            if "B22" in why:  # an error in B22 would pass on: row 22 says why
                reason = 'IF(ISERROR(B22);"see our share";%s)' % reason
            s.put("C%d" % r, '=IF(%s;%s;"")' % (ok, reason), "CtoHelp")
    s.heading(30, "Details: per-round discount factors (1 = delay costs nothing)")
    s.put("A31", "Our per-round discount factor")
    s.put("B31", '=IF(%s;DEALFACTOR(B9;B11;B18);"")' % ok, "CtoFactor")
    s.put("A32", "Their per-round discount factor")
    s.put("B32", '=IF(%s;DEALFACTOR(B10;B11;B18);"")' % ok, "CtoFactor")


def template(office, path):
    s = Sheet(office, "Deal", [11.0, 3.4, 12.0])
    s.header("Deal template: how a negotiated value may split",
             "A blank deal to fill in: enter the blue cells for one negotiation; the "
             "results and the conclusion appear once every input is filled and plausible. "
             "Save a copy under the deal's name.", fiction=False)
    inputs(s)
    results(s)
    s.conclusion('IF(ISERROR(B22);"No number from the model for "&B7&": "&C22;'
                 '"With "&B7&": our share "&TEXT(B22;"#,##0.00")&" of "&TEXT(B8;"#,##0.00")&'
                 '" EUR m ("&TEXT(B24;"0%")&"); walk-away value that binds: "&B25&"; one '
                 'more round of delay costs us "&TEXT(B26;"#,##0.00")&" EUR m.")')
    for nm, a1 in (("blank_template", "A1"), ("key_our_share", "B22"),
                   ("key_their_share", "B23")):
        s.name(nm, a1)
    s.break_before(30)
    s.notes(34, NOTES)
    s.page()
    s.save(path)
