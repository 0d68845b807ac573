"""The sample sheet "licence with an unknown reservation value" (issue 13 point 4),
written through the UNO API by build_samples.py.

Fictional scenario of our own: Saltmarsh Biosystems (us) licenses a cell-line assay to
Verrow Diagnostics, whose value of the licence we know only as a range.  We make
repeated offers before a deadline; the sheet shows our opening offer, the chance and
the expected delay of a licence, the deadline effect for 1 to 12 offers (not monotone
where the model says so) and what two-sided private information costs.

Model results come only from the add-in (DEALOPENOFFER, DEALAGREEPROB, DEALAGREEROUND,
DEALTRADEOUTCOME, DEALFACTOR); the sheet adds presentation arithmetic only: the delay
in days, differences of two add-in results, the comparisons of the deadline table and
the conclusion line.
"""
from layout import Sheet

MAX_ROUNDS = 12
PATH = 43                    # the round table's first row (round 1)
FIRST = PATH + MAX_ROUNDS + 4  # the deadline table's first row (one offer)
LAST = FIRST + MAX_ROUNDS - 1
NONE_ROW = LAST + 1          # the same licence with no deadline

CAUTION_SHORT = ("Caution: model estimates under the stated assumptions (see Method and "
                 "sources), not financial, legal or tax advice.")
CAUTION = ("Caution: every result on this sheet is a model estimate under the stated "
           "assumptions (the licensee's value spread evenly over the stated range, each "
           "side playing the equilibrium of the cited models, a licensee who accepts when "
           "indifferent). It is not financial, legal or tax advice; it does not replace "
           "the judgment of your financial, legal and tax advisers.")
NOTES = [
    "Repeated offers to a licensee whose value is known only as a range (DEALOPENOFFER, "
    "DEALAGREEPROB, DEALAGREEROUND): the licensee's value is uniform on lowest to highest; "
    "licensees with higher values sign earlier (skimming): Sobel & Takahashi (1983) Rev. "
    "Econ. Stud. 50(3); Stokey (1981) Bell J. Econ. 12(1); with our reservation value "
    "below the licensee's lowest value (a gap) talks end after finitely many offers: "
    "Fudenberg, Levine & Tirole (1985), in Roth (ed.) Game-Theoretic Models of "
    "Bargaining; Gul, Sonnenschein & Wilson (1986) J. Econ. Theory 39(1); Fudenberg & "
    "Tirole (1991) Game Theory ch. 10.",
    "Breakdown risk enters as the survival-weighted factor (1 - p) / (1 + rate)^(days/365) "
    "(DEALFACTOR x survival), exact when a breakdown leaves each side where it stood "
    "without a licence (Binmore, Rubinstein & Wolinsky 1986 RAND J. Econ. 17(2); Muthoo "
    "1999 ch. 4). Expected delay = days between offers x (expected round of signing - 1), "
    "given that the licence is signed.",
    "The deadline effect: with a gap, the equilibrium with a deadline can change with the "
    "number of offers in a way that is neither monotone nor continuous (the finite-horizon "
    "gap case of Fudenberg, Levine & Tirole 1985); each row of the table is solved "
    "exactly on its own, so no trend should be read off a single deadline.",
    "Two-sided private values (DEALTRADEOUTCOME): the linear equilibrium of the k-double "
    "auction, Chatterjee & Samuelson (1983) Oper. Res. 31(5); Gibbons (1992) s.3.2.C; the "
    "best any negotiation rule can do with private values (second best): Myerson & "
    "Satterthwaite (1983) J. Econ. Theory 29(2), Theorem 1 and Corollary 1.",
]


def money(ref):
    return 'TEXT(%s;"#,##0.00")' % ref


def offers(rounds):
    """The arguments of DEALOPENOFFER and its siblings for `rounds` (0: no deadline)."""
    return "$B$7;$B$8;$B$39;$B$40;%s;$B$9" % rounds


def inputs(s):
    s.heading(6, "Inputs")
    s.input_rows([
        (7, "Licensee's value of the licence: lowest (EUR m)", 4, "CtoInputMoney"),
        (8, "Licensee's value of the licence: highest (EUR m)", 16, "CtoInputMoney"),
        (9, "Our reservation value: the rights unlicensed, to us (EUR m)", 1,
         "CtoInputMoney"),
        (10, "Our cost of capital (annual, effective)", 0.10, "CtoInputPercent"),
        (11, "Their cost of capital (annual, effective)", 0.12, "CtoInputPercent"),
        (12, "Days between offers", 30, "CtoInputWhole"),
        (13, "Breakdown risk: chance talks end after a rejected offer", 0.08, "CtoInputPercent"),
        (14, "Offers possible before the deadline (1 to %d)" % MAX_ROUNDS, 8,
         "CtoInputWhole"),
        (15, "Days per year (day-count basis)", 365, "CtoInputWhole"),
        (16, "Our reservation value as they see it: lowest (EUR m)", 0, "CtoInputMoney"),
        (17, "Our reservation value as they see it: highest (EUR m)", 6, "CtoInputMoney"),
        (18, "Two-sided case: weight of their bid in the price (0 to 1)", 0.5, "CtoInputPercent")])
    s.input_check(19, ["B7:B18"], [
        ("B7<B8", "the licensee's lowest value must be below its highest"),
        ("AND(B14>=1;B14<=%d;INT(B14)=B14)" % MAX_ROUNDS,
         "offers before the deadline must be a whole number from 1 to %d" % MAX_ROUNDS),
        ("B16<=B17", "our lowest reservation value (as they see it) is above the highest"),
        ("AND(B18>=0;B18<=1)", "the bid weight must be between 0 and 1")])
    s.validate("B14", "WHOLE", 1, MAX_ROUNDS, "Offers before the deadline",
               "A whole number from 1 to %d (the length of the deadline table)."
               % MAX_ROUNDS)


def results(s):
    s.heading(20, "Results with the deadline above (EUR m unless stated)")
    rows = [
        (21, "Our opening offer (EUR m)", "=DEALOPENOFFER(%s)" % offers("B14"), "CtoMoney"),
        (22, "Chance the licence is signed by the deadline",
         "=DEALAGREEPROB(%s)" % offers("B14"), "CtoPercent"),
        (23, "Expected round of signing, if signed (1: our first offer)",
         "=DEALAGREEROUND(%s)" % offers("B14"), "CtoDecimal"),
        (24, "Expected delay before signing, if signed (days)", "=B12*(B23-1)",
         "CtoWhole"),
        (25, "Our opening offer with no deadline (EUR m)", "=B%d" % NONE_ROW, "CtoMoney"),
        (26, "Chance of a licence with no deadline", "=C%d" % NONE_ROW, "CtoPercent"),
        (27, "Expected delay with no deadline, if signed (days)", "=E%d" % NONE_ROW,
         "CtoWhole")]
    for r, label, formula, style in rows:
        s.put("A%d" % r, label)
        s.put("B%d" % r, formula, style)
    s.merged("C21:H27", '="Reading: the licensee signs as soon as our offer is no more '
             'than its value less what waiting for a lower offer is worth to it, so "&'
             'TEXT(1-B22;"0%")&" of licensees (those who value the licence least) are '
             'still unsigned when the deadline passes. Rows 25 to 27 repeat the last row '
             'of the deadline table below."', "CtoReading", fit=False)


def two_sided(s):
    s.heading(29, "If our reservation value is private too: what private information "
              "costs (EUR m unless stated)")
    out = "INDEX(DEALTRADEOUTCOME($B$16;$B$17;$B$7;$B$8;$B$18);1;%d)"
    rows = [
        (30, "Chance of a licence when both values are private", "=" + out % 1,
         "CtoPercent"),
        (31, "Expected price, if licensed (EUR m)", "=" + out % 2, "CtoMoney"),
        (32, "Expected gain of both sides together (EUR m)", "=" + out % 5, "CtoMoney"),
        (33, "First best: every licence worth signing is signed (EUR m)", "=" + out % 6,
         "CtoMoney"),
        (34, "Second best: the most any negotiation rule achieves (EUR m)",
         "=" + out % 8, "CtoMoney"),
        (35, "Lost to private information: first best less expected (EUR m)",
         "=B33-B32", "CtoMoney"),
        (36, "   of which no rule can recover: first less second best (EUR m)", "=B33-B34", "CtoMoney"),
        (37, "Expected gain as a share of the first best", "=" + out % 11, "CtoPercent")]
    for r, label, formula, style in rows:
        s.put("A%d" % r, label)
        s.put("B%d" % r, formula, style)
    s.merged("C30:H37", '="Reading: by the model the expected gain is never above the '
             'second best and the second best never above the first best (Myerson & '
             'Satterthwaite 1983). Of the "&%s&" EUR m lost, "&%s&" EUR m is lost under '
             'any rule while both values stay private; the rest, "&%s&" EUR m, a better '
             'designed procedure could still recover."' % (money("B35"), money("B36"),
             money("B34-B32")), "CtoReading", fit=False)


def deadline_table(s):
    s.heading(FIRST - 2, "The deadline effect: the same licence with 1 to %d offers before the "
              "deadline, and with none" % MAX_ROUNDS)
    s.column_heads(FIRST - 1, ["Offers before the deadline", "Our opening offer (EUR m)",
                        "Chance signed by the deadline", "Expected round, if signed",
                        "Expected delay, if signed (days)",
                        "Opening offer against one offer fewer", "Same as no deadline"])
    for k in range(1, MAX_ROUNDS + 2):
        r = FIRST + k - 1
        rounds = "A%d" % r if k <= MAX_ROUNDS else "0"
        if k <= MAX_ROUNDS:
            s.put("A%d" % r, k, "CtoWhole")
        else:
            s.put("A%d" % r, "no deadline", "CtoWord")
        s.put("B%d" % r, "=DEALOPENOFFER(%s)" % offers(rounds), "CtoMoney")
        s.put("C%d" % r, "=DEALAGREEPROB(%s)" % offers(rounds), "CtoPercent")
        s.put("D%d" % r, "=DEALAGREEROUND(%s)" % offers(rounds), "CtoDecimal")
        s.put("E%d" % r, "=$B$12*(D%d-1)" % r, "CtoWhole")
        if 1 < k <= MAX_ROUNDS:
            s.put("F%d" % r, '=IF(B{r}>B{p}+1E-9*ABS(B{p});"higher";IF(B{r}<B{p}-1E-9*'
                  'ABS(B{p});"lower";"same"))'.format(r=r, p=r - 1), "CtoWord")
        if k <= MAX_ROUNDS:
            s.put("G%d" % r, '=IF(AND(ABS(B{r}-$B${n})<=1E-9*ABS($B${n});ABS(C{r}-$C${n})'
                  '<=1E-9);"yes";"")'.format(r=r, n=NONE_ROW), "CtoWord")
    s.highlight("A%d:G%d" % (FIRST, LAST), "$A%d=$B$14" % FIRST)
    rises = 'COUNTIF(F%d:F%d;"higher")' % (FIRST, LAST)
    more = "SUMPRODUCT(C%d:C%d>C%d:C%d+1E-12)" % (FIRST + 1, LAST, FIRST, LAST - 1)
    same = 'INDEX(A%d:A%d;MATCH("yes";G%d:G%d;0))' % (FIRST, LAST, FIRST, LAST)
    reading = (
        '=IF(%s=0;"Reading the table: here every extra offer before the deadline lowers '
        'our opening offer; the chance of a licence rises at "&%s&" of %d steps.";'
        '"Reading the table: the deadline effect is not monotone here. Our opening offer '
        'is higher than with one offer fewer at "&%s&" of the %d deadline lengths (marked '
        'higher), while the chance of a licence rises at only "&%s&" of %d steps"&'
        'IF(COUNTIF(G%d:G%d;"yes")>0;"; from "&%s&" offers on, the deadline no longer '
        'binds and the answer is the one with no deadline";"")&". Read the whole table, '
        'not one deadline.")' % (rises, more, MAX_ROUNDS - 1, rises, MAX_ROUNDS, more,
                                 MAX_ROUNDS - 1, FIRST, LAST, same))
    s.merged("A%d:H%d" % (NONE_ROW + 1, NONE_ROW + 1), reading, "CtoReading", fit=False)
    s.row_height(NONE_ROW + 1, 1000)


def offer_path(s):
    """Round by round with the deadline above (DEALOFFERPATH, a row per round; rows past
    the last round with a chance of agreement are left empty)."""
    s.heading(PATH - 2, "Round by round with the deadline above: our offers and the chance "
              "the licence is signed")
    s.column_heads(PATH - 1, ["Round (1: our first offer; rows end when talks end)", "Our offer (EUR m)",
                              "Cutoff: values above it have signed (EUR m)", "Chance signed in this round",
                              "Chance signed by the end of this round"])
    s.fit_heads(PATH - 1, "A", 5)
    call = "DEALOFFERPATH(%s)" % offers("$B$14")
    for k in range(1, MAX_ROUNDS + 1):  # a cell per value: the path has as many rows as
        r = PATH + k - 1                # rounds with a chance of agreement
        s.put("A%d" % r, '=IF(%d>ROWS(%s);"";%d)' % (k, call, k), "CtoWhole")
        for j, (col, style) in enumerate(zip("BCDE", ("CtoMoney", "CtoMoney", "CtoPercent",
                                                      "CtoPercent")), 2):
            s.put("%s%d" % (col, r), '=IF($A%d="";"";INDEX(%s;$A%d;%d))' % (r, call, r, j),
                  style)
    s.name("report_rows", "A%d:E%d" % (PATH, PATH + MAX_ROUNDS - 1))
    end = PATH + MAX_ROUNDS
    s.merged("A%d:H%d" % (end, end), '="Reading the table: we lower our offer round by round '
             'and each time the licensees who value the licence most sign; the chances '
             'signed in each round add up to "&TEXT(B22;"0.0%")&", the chance by the '
             'deadline; empty rows mean the talks have ended (everyone who will sign has '
             'signed) before the deadline."', "CtoReading", fit=False)
    s.row_height(end, 1000)


def offer_charts(s, top):
    last = PATH + MAX_ROUNDS - 1
    s.chart("path", ["A%d:B%d" % (PATH - 1, last)], "A%d" % top, (13.2, 8.6),
            "XYDiagram", "Our offer round by round", "Round", "EUR m",
            headers=(True, False))
    ch = s.chart("signed", ["A%d:A%d" % (PATH - 1, last), "D%d:E%d" % (PATH - 1, last)],
                 "D%d" % top, (13.2, 8.6), "XYDiagram", "Chance the licence is signed, by "
                 "round", "Round", "Probability", headers=(True, False))
    ch.Diagram.YAxis.AutoMax = False
    ch.Diagram.YAxis.Max = 1.0  # a probability: the axis ends at certainty


def details(s):
    s.heading(38, "Details: per-round factors, times the chance talks survive a "
              "rejection", "D")
    s.put("A39", "Our per-round factor x survival")
    s.put("B39", "=(1-B13)*DEALFACTOR(B10;B12;B15)", "CtoFactor")
    s.put("A40", "Their per-round factor x survival")
    s.put("B40", "=(1-B13)*DEALFACTOR(B11;B12;B15)", "CtoFactor")


def licence_private(office, path):
    s = Sheet(office, "Licence unknown value",
              [11.8, 2.6, 2.6, 2.5, 2.6, 2.8, 2.4, 2.4])
    s.header("Licence with an unknown reservation value: Saltmarsh Biosystems and Verrow "
             "Diagnostics",
             "Saltmarsh Biosystems (us) licenses a cell-line assay to Verrow Diagnostics. "
             "We do not know what the licence is worth to Verrow, only a range; we make "
             "the offers, and Verrow must decide before its next budget round.",
             caution=CAUTION_SHORT)
    inputs(s)
    results(s)
    two_sided(s)
    offer_path(s)
    deadline_table(s)
    details(s)
    s.conclusion(
        '"Open at "&%s&" EUR m: with "&B14&" offers before the deadline the licence is '
        'signed with a "&TEXT(B22;"0%%")&" chance, after "&TEXT(B24;"#,##0")&" days on '
        'average if signed; if our reservation value is private too, private information '
        'costs "&%s&" of "&%s&" EUR m of gains."' % (money("B21"), money("B35"),
                                                    money("B33")))
    for nm, a1 in (("key_opening_offer", "B21"), ("key_agreement_chance", "B22"),
                   ("key_delay_days", "B24"), ("key_gain_lost", "B35"),
                   ("in_rounds", "B14"), ("in_value_low", "B7"), ("in_value_high", "B8"),
                   ("in_reservation", "B9")):
        s.name(nm, a1)
    s.break_before(PATH - 2)
    s.break_before(NONE_ROW + 3)
    end = s.notes(NONE_ROW + 3, NOTES, caution=CAUTION)
    top = end + 1
    s.break_before(top)
    offer_charts(s, top)
    s.chart("opening", ["A%d:B%d" % (FIRST - 1, LAST)], "A%d" % (top + 20), (13.2, 8.6),
            "XYDiagram",
            "Our opening offer against the deadline", "Offers before the deadline",
            "EUR m", headers=(True, False))
    ch = s.chart("chance", ["A%d:A%d" % (FIRST - 1, LAST), "C%d:C%d" % (FIRST - 1, LAST)],
                 "D%d" % (top + 20), (13.2, 8.6),
            "XYDiagram", "Chance of a licence by the deadline",
            "Offers before the deadline", "Probability", headers=(True, False))
    ch.Diagram.YAxis.AutoMax = False
    ch.Diagram.YAxis.Max = 1.0  # a probability: the axis ends at certainty
    s.page()
    s.save(path)
