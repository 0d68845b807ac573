"""Tests of the deal-comparison sample sheets (sample-sheets/*.fods), run headless.

Each sheet is loaded in an office with the add-in, recalculated and read over UNO.
Sources of the expected values, named beside each check:
  - the Python package `counteroffer` (bindings/) for the same inputs: the sheets must
    show the same numbers as the project's other surface (rel. 1e-12);
  - published formulas and procedures written out here: Rubinstein (1982) main theorem
    (share from rates, with mpmath at 50 digits and a 50-digit central difference for
    the sensitivity); the stationary conditions of BRW (1986) / Muthoo (1999) chs. 4-6
    / Shaked & Sutton (1984) solved by fixed-point iteration (a contraction); backward
    induction for the finite game of Stahl (1972), Gibbons (1992) s.2.1.D;
  - edits of input cells, checked for the direction and size of the change the model
    predicts (first-order sensitivity; Muthoo 1999 ch. 6 slope of the inside option;
    the outside option principle, Binmore, Shaked & Sutton 1989).
"""
import os
import subprocess
import sys
import tempfile

import mpmath as mp
import pytest

import counteroffer as co

from conftest import SAMPLES, SHEETS
from officekit.office import FLAT_ODS, Office, prop, url

sys.path.insert(0, SAMPLES)
import run_samples  # noqa: E402

sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "python"))
from oracles import stationary_shares  # noqa: E402

REL = 1e-12
# The sheets show the library's words for the walk-away value that binds (none, ours,
# theirs, both: cto_output_word); the package said own/other before 1.1.
BIND = {"none": "none", "own": "ours", "other": "theirs", "ours": "ours",
        "theirs": "theirs", "both": "both"}


def close(a, b, rel=REL, absolute=1e-12):
    return abs(a - b) <= max(rel * max(abs(a), abs(b)), absolute)


class Cells:
    """Reads and writes one sheet by A1 address; a read refuses error cells."""

    def __init__(self, doc):
        self.doc = doc
        self.sh = doc.Sheets.getByIndex(0)

    def cell(self, a1):
        return self.sh.getCellRangeByName(a1)

    def v(self, a1):
        c = self.cell(a1)
        assert c.getError() == 0, "%s shows error %d (%s)" % (a1, c.getError(),
                                                              c.getFormula())
        return c.getValue()

    def s(self, a1):
        c = self.cell(a1)
        assert c.getError() == 0, "%s shows error %d" % (a1, c.getError())
        return c.getString()

    def b(self, a1):
        return bool(self.v(a1))

    def set(self, a1, x):
        self.cell(a1).setValue(float(x))
        self.doc.calculateAll()


# ---- independent references ---------------------------------------------------------
mp.mp.dps = 50


def rubinstein_rates(r_own, r_oth, days, surplus, opens, basis):
    """Rubinstein (1982) main theorem with delta = (1 + r)^(-days/basis), mpmath."""
    d1 = mp.power(1 + mp.mpf(r_own), -mp.mpf(days) / basis)
    d2 = mp.power(1 + mp.mpf(r_oth), -mp.mpf(days) / basis)
    x = surplus * (1 - d2) / (1 - d1 * d2)
    return x if opens else d1 * x


def backward_induction(rounds, a_own, a_oth, b_own, b_oth, surplus, own_first):
    """(own, other) round-1 payoffs of the finite alternating-offers game (Stahl 1972;
    Gibbons 1992 s.2.1.D): in the last round the proposer keeps the surplus less the
    responder's deadline payoff; earlier, the responder is offered its (survival-
    weighted) factor times what it gets as proposer one round later."""
    # value of (proposer, responder) with k rounds left, walking back from the deadline
    k_last_prop_is_own = (rounds % 2 == 1) == own_first
    prop, resp = (surplus - b_oth, b_oth) if k_last_prop_is_own else (surplus - b_own, b_own)
    prop_is_own = k_last_prop_is_own
    for _ in range(rounds - 1):
        # one round earlier the roles swap: today's responder is tomorrow's proposer
        a_resp = a_own if prop_is_own else a_oth  # tomorrow's proposer responds today
        new_resp = a_resp * prop
        prop, resp = surplus - new_resp, new_resp
        prop_is_own = not prop_is_own
    return (prop, resp) if prop_is_own else (resp, prop)


# ---- 1. every sheet: no error cell, exports, caution and sources -------------------
@pytest.mark.parametrize("name", SHEETS)
def test_recalculates_and_exports(office, out_dir, name):
    """No error cell after a full recalculation; PDF (charts included) and CSV written
    and not empty (the main job's checks, run_samples.process)."""
    row, problems = run_samples.process(office, os.path.join(SAMPLES, name), out_dir)
    assert problems == []
    assert row["errors"] == 0 and row["addin"] >= 20 and row["charts"] >= 1
    assert row["pages"] >= 1 and row["csv_rows"] >= 20
    base = os.path.join(out_dir, os.path.splitext(name)[0])
    text = subprocess.run(["pdftotext", "-layout", base + ".pdf", "-"], check=True,
                          capture_output=True, text=True).stdout
    text = " ".join(text.split())  # a phrase may wrap, depending on the fonts installed
    assert "not financial, legal or tax advice" in text
    assert "Method and sources" in text
    for source in SOURCES[name]:
        assert source in text, source
    assert "fictional" in text
    with open(base + ".csv", encoding="utf-8") as fh:
        csv = fh.read()
    assert "not financial, legal or tax advice" in csv


SOURCES = {
    "synergy_split.fods": ["Rubinstein (1982)", "Binmore, Rubinstein & Wolinsky (1986)",
                           "Shaked & Sutton (1984)", "Muthoo (1999)"],
    "supply_renegotiation.fods": ["Rubinstein (1982)", "Muthoo (1999) ch. 6",
                                  "Shaked & Sutton (1984)"],
    "licence_deadline.fods": ["Ståhl (1972)", "Gibbons (1992)", "Muthoo 1999 ch. 4"],
    "licence_unknown_value.fods": ["Sobel & Takahashi (1983)", "Fudenberg, Levine & Tirole "
                                   "(1985)", "Chatterjee & Samuelson (1983)",
                                   "Myerson & Satterthwaite (1983)"],
    "uncertain_counterparty.fods": ["Rubinstein (1982)", "Shaked & Sutton (1984)",
                                    "Clemen & Reilly 2014", "Hyndman & Fan (1996)"],
}

CHART_TITLES = {
    "synergy_split.fods": ["Split of the synergy by candidate",
                           "Expected loss if agreement slips one round"],
    "supply_renegotiation.fods": ["Our share against days between offers",
                                  "First-mover advantage against days between offers"],
    "licence_deadline.fods": ["The split if agreement is reached in round k",
                              "Value lost against rounds of delay"],
    "licence_unknown_value.fods": ["Our opening offer against the deadline",
                                   "Chance of a licence by the deadline"],
    "uncertain_counterparty.fods": ["Our share by percentile",
                                    "One input at a time: our share at each input's"],
}


@pytest.mark.parametrize("name", SHEETS)
def test_charts_reach_the_pdf(office, out_dir, name):
    """The charts are drawn in the PDF: their titles are in its text layer."""
    run_samples.process(office, os.path.join(SAMPLES, name), out_dir)
    pdf = os.path.join(out_dir, os.path.splitext(name)[0] + ".pdf")
    text = subprocess.run(["pdftotext", pdf, "-"], check=True, capture_output=True,
                          text=True).stdout
    # A title may wrap inside its chart (how far depends on the fonts installed).
    text = " ".join(text.split())
    for title in CHART_TITLES[name]:
        assert title in text, title


# ---- 2. synergy split ------------------------------------------------------------------
def synergy_expected(c, col):
    S, r_o, opens, basis = c.v("B7"), c.v("B8"), c.b("B9"), c.v("B10")
    r_t, days, p = c.v(col + "13"), c.v(col + "14"), c.v(col + "15")
    w_o, w_t = c.v(col + "16"), c.v(col + "17")
    fo, ft = co.round_factor(r_o, days, basis), co.round_factor(r_t, days, basis)
    own = co.solve(fo, ft, p, w_o, w_t, 0, 0, w_o, w_t, S, opens)
    oth = co.solve(ft, fo, p, w_t, w_o, 0, 0, w_t, w_o, S, not opens)
    fma = (co.solve(fo, ft, p, w_o, w_t, 0, 0, w_o, w_t, S, True).own_share
           - co.solve(fo, ft, p, w_o, w_t, 0, 0, w_o, w_t, S, False).own_share)
    return {
        "20": own.own_share, "21": oth.own_share, "22": own.own_share / S,
        "23": co.delay_cost(fo, own.own_share, p, w_o),
        "25": co.delay_cost(ft, oth.own_share, p, w_t), "24": fma,
        "35": fo, "36": ft,
        "27": co.share_from_rates(r_o, r_t, days, S, opens, basis),
        "28": co.share_sensitivity(r_o, r_t, days, "own", S, opens, basis) / 100,
        "29": co.share_sensitivity(r_o, r_t, days, "other", S, opens, basis) / 100,
    }, BIND[own.binding]


def test_synergy_equals_python_package(book):
    """Every result row of every candidate equals the Python package (rel. 1e-12)."""
    c = Cells(book("synergy_split.fods"))
    shares = {}
    for col in "BCD":
        exp, binding = synergy_expected(c, col)
        for row, x in exp.items():
            assert close(c.v(col + row), x), (col + row, c.v(col + row), x)
        assert c.s(col + "26") == binding
        shares[c.s(col + "12")] = exp["20"]
    best = max(shares, key=shares.get)
    assert c.s("B31") == best
    assert close(c.v("B32"), shares[best])


def test_synergy_independent_references(book):
    """Our share against the stationary conditions by fixed-point iteration (BRW 1986;
    Shaked & Sutton 1984; Muthoo 1999 chs. 4-5, with the walk-away value as both the
    breakdown payoff and the outside option); both shares add up to the synergy; the
    delay-cost-only share against Rubinstein (1982) at 50 digits, and its sensitivity
    against a 50-digit central difference."""
    c = Cells(book("synergy_split.fods"))
    S, r_o, opens, basis = c.v("B7"), c.v("B8"), c.b("B9"), c.v("B10")
    for col in "BCD":
        r_t, days, p = c.v(col + "13"), c.v(col + "14"), c.v(col + "15")
        w_o, w_t = c.v(col + "16"), c.v(col + "17")
        fo, ft = c.v(col + "35"), c.v(col + "36")
        x_open, y = stationary_shares(S, fo, ft, p, w_o, w_t, wA=w_o, wB=w_t)
        x_resp = S - y
        assert close(c.v(col + "20"), x_open if opens else x_resp, rel=1e-11)
        assert close(c.v(col + "20") + c.v(col + "21"), S)
        assert close(c.v(col + "24"), x_open - x_resp, rel=1e-9, absolute=1e-10)
        if c.s(col + "26") == "none":
            # the responder is offered exactly the value of waiting (BRW 1986;
            # complete-information.md s.10), so the opener's loss from one round of delay is the first-mover
            # advantage: p (x - w) + (1 - p)(1 - d) x = x - (p w + (1 - p) d x)
            assert close(c.v(col + "23"), c.v(col + "24"), rel=1e-9)
        ref = rubinstein_rates(r_o, r_t, days, S, opens, basis)
        assert close(c.v(col + "27"), float(ref))
        h = mp.mpf("1e-20")
        slope = (rubinstein_rates(r_o + h, r_t, days, S, opens, basis)
                 - rubinstein_rates(r_o - h, r_t, days, S, opens, basis)) / (2 * h)
        assert close(c.v(col + "28"), float(slope) / 100)


def test_synergy_our_cost_of_capital_edit(book):
    """Raising our cost of capital by 0.01 point (1 basis point) lowers the delay-cost-only share by what
    the sensitivity row predicts to first order (error of second order, below 1e-3
    relative at that step), and lowers our share in the full model for every candidate."""
    c = Cells(book("synergy_split.fods"))
    h = 0.0001
    before = {col: (c.v(col + "27"), c.v(col + "28") * 100, c.v(col + "20"))
              for col in "BCD"}
    c.set("B8", c.v("B8") + h)
    for col in "BCD":
        share0, slope, full0 = before[col]
        change = c.v(col + "27") - share0
        assert change < 0 and slope < 0
        assert abs(change / (slope * h) - 1) < 1e-3, (col, change, slope * h)
        assert c.v(col + "20") < full0


def test_synergy_best_candidate_moves(book):
    """Raising a candidate's cost of capital makes it more eager to close (Rubinstein
    1982: the more impatient side gets less): our share with it rises and, raised far
    enough, it becomes the best candidate."""
    c = Cells(book("synergy_split.fods"))
    # the highlight: a conditional format on the results block keyed to the largest share
    cf = c.cell("B19:D22").ConditionalFormat
    assert cf.getCount() == 1
    entry = cf.getByIndex(0)
    assert entry.StyleName == "CtoBest" and "MAX($B$20:$D$20)" in entry.Formula1
    # the relative reference B$20 is read from the block's top-left cell B19, so the
    # column of the largest share is the one highlighted
    src = entry.getSourcePosition()
    assert (src.Column, src.Row) == (1, 18) and entry.Formula1.startswith("B$20")
    assert c.s("B31") != "Norrvik Sensors"
    share0 = c.v("B20")
    c.set("B13", 0.40)
    assert c.v("B20") > share0
    assert c.s("B31") == "Norrvik Sensors"
    assert close(c.v("B32"), c.v("B20"))


# ---- 3. supply contract --------------------------------------------------------------
def supply_inputs(c):
    return dict(S=c.v("B7"), ro=c.v("B8"), rt=c.v("B9"), go=c.v("B10"), gt=c.v("B11"),
                wo=c.v("B12"), wt=c.v("B13"), opens=c.b("B14"), days=c.v("B15"),
                basis=c.v("B16"))


def test_supply_equals_python_package(book):
    """Headline results and every row of the days table equal the Python package."""
    c = Cells(book("supply_renegotiation.fods"))
    i = supply_inputs(c)
    fo = co.round_factor(i["ro"], i["days"], i["basis"])
    ft = co.round_factor(i["rt"], i["days"], i["basis"])
    own = co.solve(fo, ft, 0, 0, 0, i["go"], i["gt"], i["wo"], i["wt"], i["S"], i["opens"])
    oth = co.solve(ft, fo, 0, 0, 0, i["gt"], i["go"], i["wt"], i["wo"], i["S"],
                   not i["opens"])
    assert close(c.v("B19"), own.own_share) and close(c.v("B20"), oth.own_share)
    assert close(c.v("B21"), own.own_share / i["S"])
    assert c.s("B22") == BIND[own.binding]
    assert close(c.v("B23"), co.outside_option_share(fo, ft, i["wo"], i["wt"], i["S"],
                                                     i["opens"]))
    assert close(c.v("B24"), c.v("B19") - c.v("B23"), absolute=1e-12)
    days_seen = []
    for r in range(28, 41):
        d = c.v("A%d" % r)
        days_seen.append(d)
        fo = co.round_factor(i["ro"], d, i["basis"])
        ft = co.round_factor(i["rt"], d, i["basis"])
        args_o = (0, 0, 0, i["go"], i["gt"], i["wo"], i["wt"], i["S"])
        args_t = (0, 0, 0, i["gt"], i["go"], i["wt"], i["wo"], i["S"])
        we_open = co.solve(fo, ft, *args_o, True)
        exp = {"B": we_open.own_share, "C": co.solve(fo, ft, *args_o, False).own_share,
               "D": co.solve(ft, fo, *args_t, False).own_share,
               "E": co.solve(ft, fo, *args_t, True).own_share, "I": fo, "J": ft}
        exp["F"] = exp["B"] - exp["C"]
        for col, x in exp.items():
            assert close(c.v("%s%d" % (col, r)), x, absolute=1e-12), (col, r)
        assert c.s("G%d" % r) == BIND[we_open.binding]
    assert days_seen[0] == 1 and days_seen[-1] == 90  # the issue: 1 to 90 days apart


def test_supply_independent_references(book):
    """Table rows against the stationary conditions with inside and outside options
    (Muthoo 1999 ch. 6, 'inside and outside options together') by fixed-point
    iteration; the shares when we open add up to the contract value."""
    c = Cells(book("supply_renegotiation.fods"))
    i = supply_inputs(c)
    for r in (28, 34, 40):  # 1, 14 and 90 days
        fo, ft = c.v("I%d" % r), c.v("J%d" % r)
        x_open, y = stationary_shares(i["S"], fo, ft, gA=i["go"], gB=i["gt"],
                                      wA=i["wo"], wB=i["wt"], rounds=2000000)
        x_resp = i["S"] - y
        assert close(c.v("B%d" % r), x_open, rel=1e-9), r
        assert close(c.v("C%d" % r), x_resp, rel=1e-9), r
        assert close(c.v("B%d" % r) + c.v("D%d" % r), i["S"])


def test_supply_inside_option_edit(book):
    """With no walk-away option binding, one more EUR m of our status-quo income raises
    our share by d_B (1 - d_A) / (1 - d_A d_B), the slope of Muthoo (1999) ch. 6's
    x* = g_A + (pi - g_A - g_B)(1 - d_B)/(1 - d_A d_B); with our walk-away binding it
    changes nothing (outside option principle, Binmore, Shaked & Sutton 1989)."""
    c = Cells(book("supply_renegotiation.fods"))
    assert c.s("B22") == "ours" and c.b("B14")
    x0 = c.v("B19")
    c.set("B10", c.v("B10") + 0.1)
    assert c.s("B22") == "ours"
    assert close(c.v("B19"), x0, absolute=1e-11)
    c.set("B12", 0)  # walk-away values too small to bind
    c.set("B13", 0)
    assert c.s("B22") == "none"
    fo = co.round_factor(c.v("B8"), c.v("B15"), c.v("B16"))
    ft = co.round_factor(c.v("B9"), c.v("B15"), c.v("B16"))
    x1 = c.v("B19")
    c.set("B10", c.v("B10") + 1)
    assert c.v("B19") > x1
    assert close(c.v("B19") - x1, ft * (1 - fo) / (1 - fo * ft), rel=1e-9)


def test_supply_days_edit(book):
    """Longer gaps between offers widen the first-mover advantage (Rubinstein 1982;
    docs/models/complete-information.md s.10: it vanishes as offers become frequent): the
    column rises with days."""
    c = Cells(book("supply_renegotiation.fods"))
    fma = [c.v("F%d" % r) for r in range(28, 41)]
    assert all(a < b for a, b in zip(fma, fma[1:]))
    c.set("A40", 180)
    assert c.v("F40") > fma[-1]


# ---- 4. licence deadline ---------------------------------------------------------------
def licence_inputs(c):
    return dict(S=c.v("B7"), ro=c.v("B8"), rt=c.v("B9"), days=c.v("B10"),
                n=int(c.v("B11")), p=c.v("B12"), bo=c.v("B13"), bt=c.v("B14"),
                opens=c.b("B15"), basis=c.v("B16"))


def licence_check(c):
    i = licence_inputs(c)
    ao = (1 - i["p"]) * co.round_factor(i["ro"], i["days"], i["basis"])
    at = (1 - i["p"]) * co.round_factor(i["rt"], i["days"], i["basis"])
    assert close(c.v("B42"), ao) and close(c.v("B43"), at)
    n = i["n"]
    ours = co.deadline_share(ao, at, n, i["bo"], i["bt"], i["S"], i["opens"])
    theirs = co.deadline_share(at, ao, n, i["bt"], i["bo"], i["S"], not i["opens"])
    assert close(c.v("B19"), ours) and close(c.v("B20"), theirs)
    bi = backward_induction(n, ao, at, i["bo"], i["bt"], i["S"], i["opens"])
    assert close(c.v("B19"), bi[0], rel=1e-11) and close(c.v("B20"), bi[1], rel=1e-11)
    last_is_ours = (n % 2 == 1) == i["opens"]
    assert c.s("B21") == ("we" if last_is_ours else "they")
    fo = co.round_factor(i["ro"], i["days"], i["basis"])
    ft = co.round_factor(i["rt"], i["days"], i["basis"])
    assert close(c.v("B22"), co.breakdown_share(fo, ft, i["p"], 0, 0, i["S"], i["opens"]))
    for k in range(1, 13):
        r = 26 + k
        if k > n:
            for col in "BCDEFGHIJ":
                assert c.s("%s%d" % (col, r)) == "", (col, r)
            continue
        we_propose = (k % 2 == 1) == i["opens"]
        assert c.s("F%d" % r) == ("we" if we_propose else "they")
        left = n - k + 1
        assert c.v("G%d" % r) == left
        o = co.deadline_share(ao, at, left, i["bo"], i["bt"], i["S"], we_propose)
        t = co.deadline_share(at, ao, left, i["bt"], i["bo"], i["S"], not we_propose)
        assert close(c.v("B%d" % r), o) and close(c.v("C%d" % r), t)
        assert close(c.v("B%d" % r) + c.v("C%d" % r), i["S"])
        alive = (1 - i["p"]) ** (k - 1)
        pv_o = o * alive * co.round_factor(i["ro"], (k - 1) * i["days"], i["basis"])
        pv_t = t * alive * co.round_factor(i["rt"], (k - 1) * i["days"], i["basis"])
        assert close(c.v("I%d" % r), pv_o) and close(c.v("J%d" % r), pv_t)
        assert close(c.v("D%d" % r), c.v("I27") - pv_o, absolute=1e-11)
        assert close(c.v("E%d" % r), c.v("J27") - pv_t, absolute=1e-11)
    return i


def test_licence_equals_python_package_and_backward_induction(book):
    """Round-1 shares, the round table and present values equal the Python package,
    and the round-1 shares equal backward induction written here (Stahl 1972)."""
    licence_check(Cells(book("licence_deadline.fods")))


def test_licence_rounds_edit(book):
    """One more round before the deadline hands us the last offer: our share jumps up
    (docs/models/complete-information.md s.3: the last-offer advantage does not vanish);
    the table grows by a row; both match backward induction and the package."""
    c = Cells(book("licence_deadline.fods"))
    n = int(c.v("B11"))
    assert c.s("B21") == "they"
    ours = c.v("B19")
    c.set("B11", n + 1)
    assert c.s("B21") == "we"
    assert c.v("B19") > ours
    licence_check(c)
    assert c.s("F%d" % (27 + n)) != ""


def test_licence_breakdown_edit(book):
    """Breakdown risk is what ends talks early: with p = 0 the survival-weighted factor
    is the plain discount factor (BRW 1986), and the no-deadline share is Rubinstein's
    (1982) share from rates."""
    c = Cells(book("licence_deadline.fods"))
    c.set("B12", 0)
    i = licence_check(c)
    assert close(c.v("B42"), co.round_factor(i["ro"], i["days"], i["basis"]))
    ref = rubinstein_rates(i["ro"], i["rt"], i["days"], i["S"], i["opens"], i["basis"])
    assert close(c.v("B22"), float(ref))


# ---- 5. without the add-in the formulas survive -----------------------------------------
def test_formulas_kept_without_addin(office):
    """In an office without the add-in every add-in call is still a formula with the
    add-in's stored name (addin/README.md, "Stable names") and shows #NAME? rather than a
    stale number."""
    counts = {}
    for name in SHEETS:
        doc = office.load(os.path.join(SAMPLES, name))
        try:
            counts[name] = run_samples.count_cells(doc)[1]
        finally:
            doc.close(True)
    with tempfile.TemporaryDirectory(prefix="cto_bare_") as bare:
        with Office(os.path.join(bare, "profile")) as plain:
            assert not plain.has_addin()
            for name in SHEETS:
                doc = plain.load(os.path.join(SAMPLES, name))
                try:
                    doc.calculateAll()
                    assert run_samples.count_cells(doc)[1] == counts[name] > 0
                    errs = run_samples.error_cells(doc)
                    assert any(code == 525 for _, _, code, _ in errs), name
                finally:
                    doc.close(True)


# ---- 6. the main job fails loudly ----------------------------------------------------------
def test_error_cell_is_reported(office, tmp_path):
    """A sheet with an invalid input (negative days between offers: docs/reference/
    functions.md, bad input -> Err:502 in Calc) is refused, naming the sheet, the cell and the code."""
    broken = str(tmp_path / "broken_synergy.fods")
    doc = office.load(os.path.join(SAMPLES, "synergy_split.fods"))
    try:
        doc.Sheets.getByIndex(0).getCellRangeByName("C14").setValue(-5)
        doc.storeToURL(url(broken), (prop("FilterName", FLAT_ODS),))
    finally:
        doc.close(True)
    row, problems = run_samples.process(office, broken, str(tmp_path))
    assert row["errors"] > 0
    assert any("broken_synergy: Synergy split!C35 shows error 502" in p for p in problems), \
        problems
    # the dependent results are errors too, never numbers
    assert any("!C20 shows error" in p for p in problems)


@pytest.mark.parametrize("name,cell", [("synergy_split.fods", "C16"),
                                       ("supply_renegotiation.fods", "B12"),
                                       ("licence_deadline.fods", "B13"),
                                       ("licence_unknown_value.fods", "B9")])
def test_empty_input_is_refused(office, tmp_path, name, cell):
    """Calc 7.4 hands a single empty cell to an add-in as 0 (addin/README.md, 'Empty
    cells'), so a cleared input would silently count as 0: the sheet's input check says
    so and the main job refuses the sheet."""
    broken = str(tmp_path / name)
    doc = office.load(os.path.join(SAMPLES, name))
    try:
        c = Cells(doc)
        check = doc.NamedRanges.getByName("check_inputs").ReferredCells
        assert check.getCellByPosition(0, 0).getString() == run_samples.OK_TEXT
        c.cell(cell).setString("")
        doc.calculateAll()
        doc.storeToURL(url(broken), (prop("FilterName", FLAT_ODS),))
    finally:
        doc.close(True)
    row, problems = run_samples.process(office, broken, str(tmp_path))
    assert row["errors"] == 0  # no error cell: only the input check can catch this
    assert any("input check says: an input cell is empty" in p for p in problems), problems


def test_rounds_outside_the_table_are_refused(book):
    """The round table has 12 rows: 13 rounds, or 2.5, fail the input check."""
    c = Cells(book("licence_deadline.fods"))
    for bad in (13, 2.5, 0):
        c.set("B11", bad)
        assert c.s("B17") == "rounds must be a whole number from 1 to 12", bad
    c.set("B11", 12)
    assert c.s("B17") == run_samples.OK_TEXT
    licence_check(c)
