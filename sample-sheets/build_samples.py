#!/usr/bin/env python3
"""Writes the deal-comparison templates sample-sheets/*.fods through the UNO API.

  build_samples.py --profile DIR [--out DIR]

DIR is a private LibreOffice profile with the counteroffer add-in installed
(scripts/lib.sh ensure_addin_profile).  The .fods files are committed; run this after
changing a template (with the repository root on PYTHONPATH).

Every scenario, company and deal here is fictional and our own.  Model results come only
from the add-in's functions; the sheets add ordinary arithmetic for presentation
(percentages, differences, present values with DEALFACTOR, the best-candidate highlight,
the conclusion line).
"""
import argparse
import os
import sys

from officekit.office import Office

import build_private
import build_template
import build_uncertain
from layout import Sheet

HERE = os.path.dirname(os.path.abspath(__file__))
MUTHOO = "Muthoo (1999): Bargaining Theory with Applications, Cambridge University Press."
# DEALSOLVEOUTCOME's third column is the library's word for the walk-away value that
# binds: none, ours, theirs or both (cto_output_word; addin/README.md).


def money(ref):
    return 'TEXT(%s;"#,##0.00")' % ref


# ---- 1. synergy split with three candidates ----------------------------------------
SYN_NOTES = [
    "Shares: alternating offers with breakdown risk and walk-away options, solved exactly "
    "(DEALSOLVE): Rubinstein (1982) Econometrica 50(1), main theorem; breakdown risk: "
    "Binmore, Rubinstein & Wolinsky (1986) RAND J. Econ. 17(2) and Muthoo (1999) ch. 4; "
    "walk-away (outside) options as constraints: Shaked & Sutton (1984) Econometrica 52(6); "
    "Binmore, Shaked & Sutton (1989) QJE 104(4); Muthoo (1999) ch. 5. On breakdown each "
    "side gets its walk-away value. Their share comes from their side of the same model.",
    "Expected loss from one round of delay: p (share - walk-away) + (1 - p)(1 - factor) "
    "share (DEALDELAYCOST; Muthoo 1999 ch. 4). First-mover advantage: the same model with "
    "us opening minus us responding (Rubinstein 1982; Muthoo 1999 ch. 3).",
    "Delay-cost-only share and its exact derivative per rate (DEALSHARERATE, "
    "DEALSENSITIVITY): Rubinstein (1982); Muthoo (1999) s.3.2. Per-round discount factor "
    "(1 + rate)^(-days/365) (DEALFACTOR; Muthoo 1999 s.3.2).",
    MUTHOO,
]


def synergy_inputs(s):
    s.heading(6, "Deal-wide inputs")
    s.input_rows([
        (7, "Synergy to be split, present value (EUR m)", 120, "CtoInputMoney"),
        (8, "Our cost of capital (annual, effective)", 0.09, "CtoInputPercent"),
        (9, "We make the first offer (TRUE or FALSE)", True, "CtoInputBool"),
        (10, "Days per year (day-count basis)", 365, "CtoInputWhole")])
    s.heading(12, "Candidate inputs")
    cand = {"B": ("Norrvik Sensors", 0.14, 30, 0.05, 12, 20),
            "C": ("Aldea Robotics", 0.11, 21, 0.02, 12, 35),
            "D": ("Pellucid Optics", 0.08, 45, 0.08, 12, 8)}
    for r, label in ((13, "Their cost of capital (annual, effective)"),
                     (14, "Days between offers"),
                     (15, "Breakdown risk: chance talks end after a rejected offer"),
                     (16, "Our walk-away value if this deal fails (EUR m)"),
                     (17, "Their walk-away value if this deal fails (EUR m)")):
        s.put("A%d" % r, label)
    styles = ("CtoInputText", "CtoInputPercent", "CtoInputWhole", "CtoInputPercent",
              "CtoInputMoney", "CtoInputMoney")
    for col, values in cand.items():
        for r, v, st in zip(range(12, 18), values, styles):
            s.inp("%s%d" % (col, r), v, st)
    s.input_check(18, ["B7:B10", "B12:D17"])


def synergy_results(s):
    s.heading(19, "Results (EUR m unless stated)")
    labels = {
        20: "Our share of the synergy (EUR m)",
        21: "Their share of the synergy (EUR m)",
        22: "Our share, % of the synergy",
        23: "Our expected loss if agreement slips one round (EUR m)",
        24: "First-mover advantage: opening minus responding (EUR m)",
        25: "Their expected loss if agreement slips one round (EUR m)",
        26: "Walk-away value that binds",
        27: "Our share with delay cost only (EUR m)",
        28: "   change if our cost of capital rises 1 point (EUR m)",
        29: "   change if their cost of capital rises 1 point (EUR m)",
    }
    for r, t in labels.items():
        s.put("A%d" % r, t)
    for c in "BCD":
        own = "%s35;%s36;%s15;%s16;%s17;0;0;%s16;%s17;$B$7" % ((c,) * 7)
        oth = "%s36;%s35;%s15;%s17;%s16;0;0;%s17;%s16;$B$7" % ((c,) * 7)
        s.put(c + "19", "=%s12" % c, "CtoColumnHead")
        s.put(c + "20", "=DEALSOLVE(%s;$B$9)" % own, "CtoMoney")
        s.put(c + "21", "=DEALSOLVE(%s;NOT($B$9))" % oth, "CtoMoney")
        s.put(c + "22", "=%s20/$B$7" % c, "CtoPercent")
        s.put(c + "23", "=DEALDELAYCOST(%s35;%s20;%s15;%s16)" % ((c,) * 4), "CtoMoney")
        s.put(c + "24", "=DEALSOLVE(%s;TRUE())-DEALSOLVE(%s;FALSE())" % (own, own),
              "CtoMoney")
        s.put(c + "25", "=DEALDELAYCOST(%s36;%s21;%s15;%s17)" % ((c,) * 4), "CtoMoney")
        s.put(c + "26", '=INDEX(DEALSOLVEOUTCOME(%s;$B$9);1;3)' % own, "CtoWord")
        s.put(c + "27", "=DEALSHARERATE($B$8;%s13;%s14;$B$7;$B$9;$B$10)" % (c, c),
              "CtoMoney")
        s.put(c + "28", '=DEALSENSITIVITY($B$8;%s13;%s14;"own";$B$7;$B$9;$B$10)/100'
              % (c, c), "CtoMoney")
        s.put(c + "29", '=DEALSENSITIVITY($B$8;%s13;%s14;"other";$B$7;$B$9;$B$10)/100'
              % (c, c), "CtoMoney")
        s.put(c + "35", "=DEALFACTOR($B$8;%s14;$B$10)" % c, "CtoFactor")
        s.put(c + "36", "=DEALFACTOR(%s13;%s14;$B$10)" % (c, c), "CtoFactor")
    # the identity beside the two rows it joins (BRW 1986; docs/models/complete-information.md s.10)
    s.merged("E22:E26", '=IF(COUNTIF(B26:D26;"none")=0;"";"Rows 23 and 24 are equal '
             'by the model where no walk-away binds ("&COUNTIF(B26:D26;"none")&" of 3 '
             'here): the responder is offered exactly what waiting is worth, so what we '
             'lose by one round of delay is what we gain by opening.")', "CtoReading",
             fit=False)
    s.put("A31", "Best candidate for us (largest share in EUR m)", "CtoHeading")
    s.put("B31", "=INDEX(B12:D12;MATCH(MAX(B20:D20);B20:D20;0))", "CtoBestName")
    s.put("A32", "Our share with the best candidate (EUR m)")
    s.put("B32", "=MAX(B20:D20)", "CtoMoney")
    s.heading(34, "Details: per-round discount factors (1 = delay costs nothing)", "D")
    s.put("A35", "Our per-round discount factor")
    s.put("A36", "Their per-round discount factor")
    s.highlight("B19:D22", "B$20=MAX($B$20:$D$20)")


def synergy(office, path):
    s = Sheet(office, "Synergy split", [11.6, 3.4, 3.4, 3.4, 8.0])
    s.header("Synergy split: Halvard Instruments and three acquisition candidates",
             "Halvard Instruments is choosing which of three sensor makers to acquire; "
             "each deal creates the synergy below, to be split in negotiation.")
    synergy_inputs(s)
    synergy_results(s)
    s.conclusion('"Best candidate: "&B31&", our share "&%s&" of "&%s&" EUR m ("&'
                 'TEXT(B32/B7;"0%%")&"); one more round of delay would cost us "&%s&'
                 '" EUR m with them."' % (money("B32"), money("B7"),
                                          money("INDEX(B23:D23;1;MATCH(B31;B12:D12;0))")))
    for nm, a1 in (("key_best_candidate", "B31"), ("key_best_share", "B32"),
                   ("in_surplus", "B7"), ("in_our_rate", "B8"), ("in_we_open", "B9"),
                   ("in_basis", "B10")):
        s.name(nm, a1)
    s.break_before(34)
    end = s.notes(38, SYN_NOTES)
    top = end + 1
    s.break_before(top)
    s.chart("split", ["A19:D21"], "A%d" % top, (13.2, 11.0), "BarDiagram",
            "Split of the synergy by candidate", "Candidate", "EUR m", rows=True)
    s.chart("delay", ["A19:D19", "A23:D23", "A25:D25"], "C%d" % top,
            (13.2, 11.0), "BarDiagram", "Expected loss if agreement slips one round",
            "Candidate", "EUR m", rows=True)
    s.page()
    s.save(path)


# ---- 2. supply-contract renegotiation ------------------------------------------------
DAYS = [1, 2, 3, 5, 7, 10, 14, 21, 30, 45, 60, 75, 90]
SUP_NOTES = [
    "Shares: alternating offers with inside options (status-quo payoffs while talks go on) "
    "and walk-away options, solved exactly (DEALSOLVE): Rubinstein (1982) Econometrica "
    "50(1); inside options: Muthoo (1999) ch. 6, the status quo sets the disagreement "
    "point; Binmore, Rubinstein & Wolinsky (1986) RAND J. Econ. 17(2); walk-away (outside) "
    "options only truncate the split: Shaked & Sutton (1984) Econometrica 52(6); Binmore, "
    "Shaked & Sutton (1989) QJE 104(4); Muthoo (1999) ch. 5. No breakdown risk here.",
    "Share without status-quo income (DEALOUTSIDE): Muthoo (1999) ch. 5. Per-round factor "
    "(1 + rate)^(-days/365) (DEALFACTOR; Muthoo 1999 s.3.2). First-mover advantage: our "
    "share opening minus responding in the same model (Rubinstein 1982; Muthoo 1999 ch. 3).",
    "Status-quo values are the present value of what each side collects if the dispute "
    "never ends (a flow f at rate r is worth f / r; Muthoo 1999 ch. 6).",
    MUTHOO,
]


def supply_headline(s, fo, ft):
    s.heading(18, "Headline results (EUR m unless stated)")
    s.put("A19", "Our share of the contract value (EUR m)")
    s.put("B19", "=DEALSOLVE(%s;%s;0;0;0;B10;B11;B12;B13;B7;B14)" % (fo, ft), "CtoMoney")
    s.put("A20", "Their share of the contract value (EUR m)")
    s.put("B20", "=DEALSOLVE(%s;%s;0;0;0;B11;B10;B13;B12;B7;NOT(B14))" % (ft, fo),
          "CtoMoney")
    s.put("A21", "Our share, % of the contract value")
    s.put("B21", "=B19/B7", "CtoPercent")
    s.put("A22", "Walk-away value that binds")
    s.put("B22", '=INDEX(DEALSOLVEOUTCOME(%s;%s;0;0;0;B10;B11;B12;B13;B7;B14);1;3)'
          % (fo, ft), "CtoWord")
    s.put("A23", "Our share if neither side had status-quo income (EUR m)")
    s.put("B23", "=DEALOUTSIDE(%s;%s;B12;B13;B7;B14)" % (fo, ft), "CtoMoney")
    s.put("A24", "Effect of both sides' status-quo income on our share (EUR m)")
    s.put("B24", "=B19-B23", "CtoMoney")


def supply_table(s, last):
    s.heading(26, "How the split moves as offers come from 1 to 90 days apart", "G")
    s.heading(26, "Details", "J", first="I")
    s.column_heads(27, ["Days between offers", "Our share, we open", "Our share, they open",
                        "Their share, we open", "Their share, they open",
                        "First-mover advantage", "Walk-away that binds (we open)"])
    s.column_heads(27, ["Our factor per round", "Their factor per round"], "I")
    s.fit_heads(27, "A", 10)
    for i, d in enumerate(DAYS):
        r = 28 + i
        s.inp("A%d" % r, d, "CtoInputWhole")
        s.put("I%d" % r, "=DEALFACTOR($B$8;A%d;$B$16)" % r, "CtoFactor")
        s.put("J%d" % r, "=DEALFACTOR($B$9;A%d;$B$16)" % r, "CtoFactor")
        own = "I%d;J%d;0;0;0;$B$10;$B$11;$B$12;$B$13;$B$7" % (r, r)
        oth = "J%d;I%d;0;0;0;$B$11;$B$10;$B$13;$B$12;$B$7" % (r, r)
        s.put("B%d" % r, "=DEALSOLVE(%s;TRUE())" % own, "CtoMoney")
        s.put("C%d" % r, "=DEALSOLVE(%s;FALSE())" % own, "CtoMoney")
        s.put("D%d" % r, "=DEALSOLVE(%s;FALSE())" % oth, "CtoMoney")
        s.put("E%d" % r, "=DEALSOLVE(%s;TRUE())" % oth, "CtoMoney")
        s.put("F%d" % r, "=B%d-C%d" % (r, r), "CtoMoney")
        s.put("G%d" % r, '=INDEX(DEALSOLVEOUTCOME(%s;TRUE());1;3)' % own, "CtoWord")
    reading = (
        '="Reading the table: columns 2 and 4 add up to the contract value by the model, '
        'as do columns 3 and 5."&IF(COUNTIF(G28:G%d;"ours")=0;"";" Where our walk-away '
        'binds ("&COUNTIF(G28:G%d;"ours")&" of %d rows), our share when they open equals '
        'our walk-away value, "&%s&" EUR m, at every interval: they offer us no more than '
        'we can get elsewhere (outside option principle, Binmore, Shaked & Sutton 1989), '
        'and our share when we open follows from it.")'
        % (last, last, len(DAYS), money("B12")))
    s.merged("A%d:G%d" % (last + 1, last + 1), reading, "CtoReading", fit=False)
    s.row_height(last + 1, 1500)


def supply(office, path):
    s = Sheet(office, "Supply contract", [11.4, 2.5, 2.5, 2.5, 2.5, 2.5, 2.7, 0.5, 2.3, 2.3])
    s.header("Supply-contract renegotiation: Kestrel Foundry and Brightwater Motors",
             "Kestrel Foundry (us) supplies castings to Brightwater Motors; the contract "
             "is up for renewal and both sides keep some income while they dispute it.")
    s.heading(6, "Inputs")
    s.input_rows([
        (7, "Value of the renewed contract to both sides, PV (EUR m)", 48, "CtoInputMoney"),
        (8, "Our cost of capital (annual, effective)", 0.18, "CtoInputPercent"),
        (9, "Their cost of capital (annual, effective)", 0.08, "CtoInputPercent"),
        (10, "Our status-quo income during the dispute, PV (EUR m)", 12, "CtoInputMoney"),
        (11, "Their status-quo value during the dispute, PV (EUR m)", 15, "CtoInputMoney"),
        (12, "Our walk-away value: a contract with another buyer (EUR m)", 19,
         "CtoInputMoney"),
        (13, "Their walk-away value: a second-source supplier (EUR m)", 24, "CtoInputMoney"),
        (14, "We make the first offer (TRUE or FALSE)", True, "CtoInputBool"),
        (15, "Days between offers (headline results)", 14, "CtoInputWhole"),
        (16, "Days per year (day-count basis)", 365, "CtoInputWhole")])
    last = 27 + len(DAYS)
    s.input_check(17, ["B7:B16", "A28:A%d" % last])
    supply_headline(s, "DEALFACTOR($B$8;$B$15;$B$16)", "DEALFACTOR($B$9;$B$15;$B$16)")
    supply_table(s, last)
    s.conclusion('"We get "&%s&" of "&%s&" EUR m ("&TEXT(B21;"0%%")&") when "&IF(B14;'
                 '"we";"they")&" open with offers "&B15&" days apart; the walk-away value that binds: "&B22&'
                 '"; status-quo income moves our share by "&%s&" EUR m."'
                 % (money("B19"), money("B7"), money("B24")))
    for nm, a1 in (("key_our_share", "B19"), ("key_their_share", "B20"),
                   ("key_binding", "B22"), ("in_days", "B15"), ("in_our_inside", "B10")):
        s.name(nm, a1)
    end = s.notes(last + 3, SUP_NOTES)
    top = end + 1
    s.break_before(top)
    s.chart("days", ["A27:C%d" % last], "A%d" % top, (13.2, 11.0), "XYDiagram",
            "Our share against days between offers", "Days between offers", "EUR m",
            headers=(True, False))
    s.chart("fma", ["A27:A%d" % last, "F27:F%d" % last], "D%d" % top, (13.2, 11.0),
            "XYDiagram", "First-mover advantage against days between offers",
            "Days between offers", "EUR m", headers=(True, False))
    s.page()
    s.save(path)


# ---- 3. licence with a deadline --------------------------------------------------------
MAX_ROUNDS = 12
LIC_NOTES = [
    "Shares with a deadline: finite alternating offers solved by backward induction "
    "(DEALDEADLINE): Ståhl (1972) Bargaining Theory; Gibbons (1992) Game Theory for "
    "Applied Economists s.2.1.D. The last proposer keeps the value less the responder's "
    "deadline payoff.",
    "Odd or even number of offers: whoever can make the last offer before the deadline "
    "holds an ultimatum and takes (nearly) all that is left, so one offer more or fewer "
    "hands that advantage to the other side and the split jumps between odd and even "
    "counts (Ståhl 1972). This is the model's timing convention, not a forecast that one "
    "more round of talks moves the split: show the band between two consecutive counts "
    "(the round table has them), not one of them.",
    "Breakdown risk enters as the survival-weighted factor (1 - p) x factor; this is exact "
    "when a breakdown leaves neither side anything from this licence (Binmore, Rubinstein "
    "& Wolinsky 1986 RAND J. Econ. 17(2); Muthoo 1999 ch. 4). No-deadline comparison: the "
    "infinite-horizon model with the same breakdown risk (DEALBREAKDOWN; BRW 1986; "
    "Muthoo 1999 ch. 4).",
    "Present value today of agreement in round k: share x (1 - p)^(k-1) x discount over "
    "(k - 1) x days between offers (DEALFACTOR, (1 + rate)^(-days/365)).",
    MUTHOO,
]


def licence_results(s):
    s.heading(18, "Results (EUR m unless stated)")
    s.put("A19", "Our share if agreed in round 1 (EUR m)")
    s.put("B19", "=DEALDEADLINE(B42;B43;B11;B13;B14;B7;B15)", "CtoMoney")
    s.put("A20", "Their share if agreed in round 1 (EUR m)")
    s.put("B20", "=DEALDEADLINE(B43;B42;B11;B14;B13;B7;NOT(B15))", "CtoMoney")
    s.put("A21", "Who makes the last offer before the deadline")
    s.put("B21", '=IF(ISODD(B11)=B15;"we";"they")', "CtoWord")
    s.put("A22", "Our share with no deadline, same breakdown risk (EUR m)")
    s.put("B22", "=DEALBREAKDOWN(DEALFACTOR(B8;B10;B16);DEALFACTOR(B9;B10;B16);B12;0;0;"
          "B7;B15)", "CtoMoney")
    s.put("A23", "What the deadline is worth to us (EUR m)")
    s.put("B23", "=B19-B22", "CtoMoney")
    s.heading(41, "Details: per-round factors, times the chance talks survive a "
              "rejection", "D")
    s.put("A42", "Our per-round factor x survival")
    s.put("B42", "=(1-B12)*DEALFACTOR(B8;B10;B16)", "CtoFactor")
    s.put("A43", "Their per-round factor x survival")
    s.put("B43", "=(1-B12)*DEALFACTOR(B9;B10;B16)", "CtoFactor")


def licence_table(s):
    s.heading(25, "Round by round: the split if agreement is reached in that round", "H")
    s.column_heads(26, ["Round", "Our share if agreed then", "Their share if agreed then",
                        "Value we lose vs round 1", "Value they lose vs round 1",
                        "Who proposes", "Offers left", "Chance talks are still open"])
    s.column_heads(26, ["Our share, PV today", "Their share, PV today"], "I")
    s.fit_heads(26, "A", 10)
    for k in range(1, MAX_ROUNDS + 1):
        r = 26 + k
        g = "IF(A%d>$B$11;\"\";%%s)" % r
        s.put("A%d" % r, k, "CtoWhole")
        s.put("F%d" % r, "=" + g % ('IF(ISODD(A%d)=$B$15;"we";"they")' % r), "CtoWord")
        s.put("G%d" % r, "=" + g % ("$B$11-A%d+1" % r), "CtoWhole")
        s.put("B%d" % r, "=" + g % ("DEALDEADLINE($B$42;$B$43;G%d;$B$13;$B$14;$B$7;"
                                    "F%d=\"we\")" % (r, r)), "CtoMoney")
        s.put("C%d" % r, "=" + g % ("DEALDEADLINE($B$43;$B$42;G%d;$B$14;$B$13;$B$7;"
                                    "F%d=\"they\")" % (r, r)), "CtoMoney")
        s.put("H%d" % r, "=" + g % ("(1-$B$12)^(A%d-1)" % r), "CtoPercent")
        s.put("I%d" % r, "=" + g % ("B%d*H%d*DEALFACTOR($B$8;(A%d-1)*$B$10;$B$16)"
                                    % (r, r, r)), "CtoMoney")
        s.put("J%d" % r, "=" + g % ("C%d*H%d*DEALFACTOR($B$9;(A%d-1)*$B$10;$B$16)"
                                    % (r, r, r)), "CtoMoney")
        s.put("D%d" % r, "=" + g % ("$I$27-I%d" % r), "CtoMoney")
        s.put("E%d" % r, "=" + g % ("$J$27-J%d" % r), "CtoMoney")
    s.name("report_rows", "A27:J%d" % (26 + MAX_ROUNDS))
    s.merged("A39:J39", '="Reading the table: round 1 repeats the headline split (rows 19 '
             'and 20); in every round the two shares add up to the licence value, "&%s&" '
             'EUR m, by the model; the value lost is measured against agreeing in round 1, '
             'so it is zero there by construction."' % money("B7"), "CtoReading",
             fit=False)
    s.row_height(39, 1000)


def licence(office, path):
    s = Sheet(office, "Licence deadline", [10.6, 2.5, 2.5, 2.5, 2.5, 2.1, 2.0, 2.3, 2.5, 2.5])
    s.header("Licence negotiation with a deadline: Lumen Biologics and Corvane Pharma",
             "Lumen Biologics (us) licenses an assay platform to Corvane Pharma, which "
             "must sign before its trial starts: only a limited number of offers fit.")
    s.heading(6, "Inputs")
    s.input_rows([
        (7, "Value of the licence to both sides, PV (EUR m)", 60, "CtoInputMoney"),
        (8, "Our cost of capital (annual, effective)", 0.12, "CtoInputPercent"),
        (9, "Their cost of capital (annual, effective)", 0.08, "CtoInputPercent"),
        (10, "Days between offers", 21, "CtoInputWhole"),
        (11, "Offers possible before the deadline (1 to %d)" % MAX_ROUNDS, 8,
         "CtoInputWhole"),
        (12, "Breakdown risk: chance talks end after a rejected offer", 0.04,
         "CtoInputPercent"),
        (13, "Our payoff if the deadline passes with no licence (EUR m)", 6, "CtoInputMoney"),
        (14, "Their payoff if the deadline passes with no licence (EUR m)", 0,
         "CtoInputMoney"),
        (15, "We make the first offer (TRUE or FALSE)", True, "CtoInputBool"),
        (16, "Days per year (day-count basis)", 365, "CtoInputWhole")])
    s.input_check(17, ["B7:B16"], [("AND(B11>=1;B11<=%d;INT(B11)=B11)" % MAX_ROUNDS,
                                    "rounds must be a whole number from 1 to %d"
                                    % MAX_ROUNDS)])
    s.validate("B11", "WHOLE", 1, MAX_ROUNDS, "Offers before the deadline",
               "A whole number from 1 to %d (the length of the round table)." % MAX_ROUNDS)
    licence_results(s)
    licence_table(s)
    s.conclusion('"We get "&%s&" of "&%s&" EUR m ("&TEXT(B19/B7;"0%%")&") if we agree in '
                 'round 1; "&B21&" make the last offer; against talks with no deadline, the '
                 'deadline "&IF(B23<0;"costs us "&%s;"is worth "&%s&" to us")&" EUR m."'
                 % (money("B19"), money("B7"), money("-B23"), money("B23")))
    for nm, a1 in (("key_our_share", "B19"), ("key_their_share", "B20"),
                   ("key_last_offer", "B21"), ("in_rounds", "B11"),
                   ("in_breakdown", "B12")):
        s.name(nm, a1)
    end = s.notes(45, LIC_NOTES)
    top = end + 1
    last = 26 + MAX_ROUNDS
    s.break_before(top)
    s.chart("position", ["A26:C%d" % last], "A%d" % top, (13.2, 11.0), "LineDiagram",
            "The split if agreement is reached in round k", "Round", "EUR m")
    s.chart("loss", ["A26:A%d" % last, "D26:E%d" % last], "E%d" % top, (13.2, 11.0),
            "LineDiagram", "Value lost against rounds of delay (present value)", "Round",
            "EUR m")
    s.page()
    s.save(path)


TEMPLATES = [("synergy_split.fods", synergy), ("supply_renegotiation.fods", supply),
             ("licence_deadline.fods", licence),
             ("licence_unknown_value.fods", build_private.licence_private),
             ("uncertain_counterparty.fods", build_uncertain.uncertain),
             ("deal_template.fods", build_template.template)]


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--profile", required=True)
    ap.add_argument("--out", default=HERE)
    ap.add_argument("only", nargs="*", help="file names to write (default: all)")
    args = ap.parse_args()
    with Office(args.profile) as office:
        if not office.has_addin():
            print("error: the counteroffer add-in does not answer in profile " + args.profile,
                  file=sys.stderr)
            return 1
        for fname, fn in TEMPLATES:
            if args.only and fname not in args.only:
                continue
            path = os.path.join(args.out, fname)
            if fn(office, path) is False:  # needs add-in functions this build lacks
                print("skipped %s: the add-in has no DEALRANGE yet (no sheet with #NAME? "
                      "is written)" % fname)
                continue
            print("wrote", path)
    return 0


if __name__ == "__main__":
    sys.exit(main())
