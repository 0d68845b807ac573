#!/usr/bin/env python3
"""Writes the add-in's test sheets tests/sheets/*.fods (flat ODF) from the case lists
below.  Run it after changing a case; the .fods files are committed.

Layout of every sheet "Cases" (the layout of LibreOffice's own add-in sheet tests,
sc/qa/unit/data/functions/addin/fods):
  A Case | B Result (the formula) | C Expected | D Check | E Formula text | F Source |
  G Tolerance (relative, numbers) or expected Calc error code (errors) | H.. inputs
The sheet "Summary" has B1 = AND of every check.  tests/sheets/run_sheets.py loads
each file in a headless office with the add-in installed, recalculates, and asserts
every check cell and every expected error code.

Expected values are the numbered check values of tests/cpp/test_published.cpp (mpmath
50 digits, each confirmed by an independent method), published examples of
docs/models/complete-information.md, or are computed here with mpmath at 50 digits from
the published formula named beside the case.  The error cases follow the bad-input rules
of docs/reference/functions.md and the error mapping in addin/README.md.

Run with the project venv's Python (it has mpmath and the counteroffer package, whose
table gives the stored method names) and the repository root on PYTHONPATH:
  PYTHONPATH=. .venv/bin/python tests/sheets/make_sheets.py
"""
import os
import sys

import mpmath as mp

import range_cases

from officekit.flat_odf import document as odf_document, formula_cell, of_cell
from officekit.flat_odf import row as odf_row, text_cell, value_cell as cell_value

mp.mp.dps = 50
HERE = os.path.dirname(os.path.abspath(__file__))
# Calc error values (addin/README.md).
ERR = {"Err:502": 502, "#N/A": 32767, "#NUM!": 503, "Err:523": 523, "#VALUE!": 519}


# ---- mpmath references for functions without a check value in test_published.cpp -----
def factor_eff(rate, days, basis=365):  # (1 + r)^(-days/basis): standard compounding
    return mp.power(1 + mp.mpf(rate), -mp.mpf(days) / basis)


def factor_cont(rate, days, basis=365):  # exp(-r days/basis): Muthoo (1999) s.3.2
    return mp.exp(-mp.mpf(rate) * days / basis)


def share_rates(r1, r2, days, basis=365, cont=False, opens=True):
    """Rubinstein (1982) share with delta = factor(rate): docs/models/complete-information.md
    s.1."""
    f = factor_cont if cont else factor_eff
    d1, d2 = f(r1, days, basis), f(r2, days, basis)
    x = (1 - d2) / (1 - d1 * d2)
    return x if opens else d1 * x


def sensitivity(r1, r2, days, wrt, opens=True, cont=False):
    """d share / d rate by mpmath numerical differentiation of the closed form."""
    if wrt == "own":
        return mp.diff(lambda r: share_rates(r, r2, days, cont=cont, opens=opens), r1)
    return mp.diff(lambda r: share_rates(r1, r, days, cont=cont, opens=opens), r2)


def implied_rate_cont(share, r2, days):
    """Root of share_rates(r, r2, days, continuous) = share (mpmath findroot)."""
    return mp.findroot(lambda r: share_rates(r, r2, days, cont=True) - share, 0.1)


R11 = "check value %d of tests/cpp/test_published.cpp (mpmath 50 digits)"
MPM = "mpmath 50 digits: %s"

# (case, formula, expected number or error text, source[, tolerance])
class Text(str):
    """An expected text result (a word of a coded output), as opposed to an error name."""


VALUES = [
    ("Rubinstein, equal factors", "=DEALSHARE(0.5;0.5)", 2 / 3.0, R11 % 9),
    ("Rubinstein, d=(0.95,0.9)", "=DEALSHARE(0.95;0.9)", 0.689655172413793, R11 % 14),
    ("Rubinstein, own responds", "=DEALSHARE(0.5;0.5;1;FALSE())", 1 / 3.0,
     "docs/models/complete-information.md s.1: responder gets d x* = 1/3"),
    ("own_opens as text \"false\"", "=DEALSHARE(0.5;0.5;1;\"false\")", 1 / 3.0,
     "docs/models/complete-information.md s.1; docs/reference/functions.md: booleans TRUE/FALSE"),
    ("own_opens as 0", "=DEALSHARE(0.5;0.5;1;0)", 1 / 3.0,
     "docs/models/complete-information.md s.1; docs/reference/functions.md: 1/0"),
    ("money surplus", "=DEALSHARE(0.95;0.9;1000)", 689.655172413793, R11 % 14 + " x 1000"),
    ("one patient side", "=DEALSHARE(1;0.9)", 1.0, R11 % 79),
    ("other side patient", "=DEALSHARE(0.9;1)", 0.0, R11 % 80),
    ("ultimatum", "=DEALSHARE(0;0)", 1.0, R11 % 81),
    ("factor, annual effective", "=DEALFACTOR(0.08;30)", factor_eff(0.08, 30),
     MPM % "(1+r)^(-days/basis), standard compounding (common practice, no source)"),
    ("factor, continuous", "=DEALFACTOR(0.08;30;360;TRUE())", factor_cont(0.08, 30, 360),
     MPM % "exp(-r days/basis), Muthoo (1999) s.3.2"),
    ("rates, yearly offers", "=DEALSHARERATE(0.1;0.05;365;1;TRUE();365;TRUE())",
     0.350131861448953, R11 % 10),
    ("rates, offers every 0.1 year", "=DEALSHARERATE(0.1;0.05;36.5;1;TRUE();365;TRUE())",
     0.335001381935802, R11 % 11),
    ("rates, annual effective", "=DEALSHARERATE(0.08;0.12;30)",
     share_rates(0.08, 0.12, 30), MPM % "Rubinstein (1982) with delta=(1+r)^(-days/365)"),
    ("frequent-offer limit", "=DEALSHARELIMIT(0.1;0.05)", 1 / 3.0, R11 % 12),
    ("breakdown, no discounting", "=DEALBREAKDOWN(1;1;0.1;0.2;0.1)", 0.568421052631579,
     R11 % 33),
    ("breakdown, own responds", "=DEALBREAKDOWN(1;1;0.1;0.1;0.2;1;FALSE())",
     0.431578947368421, R11 % 34),
    ("breakdown certain", "=DEALBREAKDOWN(1;1;1;0.2;0.1)", 0.9, R11 % 35),
    ("breakdown and discounting", "=DEALBREAKDOWN(0.95;0.9;0.05;0.2;0.1)", 0.650500848431770,
     R11 % 36),
    ("outside options, none binds", "=DEALOUTSIDE(0.9;0.9;0;0.3)", 0.526315789473684,
     R11 % 40),
    ("outside option of other binds", "=DEALOUTSIDE(0.9;0.9;0;0.5)", 0.5, R11 % 42),
    ("own option binds, own opens", "=DEALOUTSIDE(0.9;0.9;0.5;0)", 0.55, R11 % 44),
    ("both options bind", "=DEALOUTSIDE(0.5;0.5;0.4;0.4)", 0.6, R11 % 46),
    ("asymmetric, other's option binds", "=DEALOUTSIDE(0.95;0.9;0.2;0.45)", 0.55, R11 % 48),
    ("B opens, B's option binds (own = B)", "=DEALOUTSIDE(0.9;0.95;0.45;0.2;1;TRUE())",
     0.4775, R11 % 49),
    ("inside options", "=DEALINSIDE(0.9;0.9;0.1;0.3)", 0.415789473684211, R11 % 51),
    ("solve = breakdown model", "=DEALSOLVE(0.95;0.9;0.05;0.2;0.1)", 0.650500848431770,
     R11 % 36),
    ("solve = outside-option model", "=DEALSOLVE(0.9;0.9;0;0;0;0;0;0;0.5)", 0.5, R11 % 42),
    ("solve outcome: other share", "=INDEX(DEALSOLVEOUTCOME(0.9;0.9;0;0;0;0;0;0;0.5);1;2)",
     0.5, R11 % 42 + ": 1 - 0.5"),
    ("solve outcome: other's option binds",
     "=INDEX(DEALSOLVEOUTCOME(0.9;0.9;0;0;0;0;0;0;0.5);1;3)", Text("theirs"),
     R11 % 42 + " [B's option binds]; the word of CTO_BINDS_OTHER (cto_output_word)"),
    ("solve outcome: deal rational", "=INDEX(DEALSOLVEOUTCOME(0.9;0.9;0;0;0;0;0;0;0.5);1;4)",
     Text("yes"), R11 % 42 + ": agreement"),
    ("solve outcome: no deal, own takes option",
     "=INDEX(DEALSOLVEOUTCOME(0.9;0.9;0;0;0;0;0;0.6;0.5);1;1)", 0.6, R11 % 83),
    ("solve outcome: no deal flagged", "=INDEX(DEALSOLVEOUTCOME(0.9;0.9;0;0;0;0;0;0.6;0.5);1;4)",
     Text("no"), R11 % 83 + ": no agreement"),
    ("solve outcome: no deal, which option binds",
     "=INDEX(DEALSOLVEOUTCOME(0.9;0.9;0;0;0;0;0;0.6;0.5);1;3)", Text("none"),
     R11 % 83 + ": nobody's option binds a deal that is not made"),
    ("deadline T=1", "=DEALDEADLINE(0.9;0.9;1)", 1.0, R11 % 23),
    ("double auction, uniform on [0, 1], k = 1/2", "=DEALTRADE(0;1;0;1)", 9 / 32,
     "Chatterjee & Samuelson (1983); Gibbons (1992) s.3.2.C: trade iff v >= c + 1/4, "
     "probability (3/4)^2/2 = 9/32"),
    ("reason: a factor outside 0 to 1", '=DEALREASON("DEALSHARE";1.2;0.95)',
     Text("DEALSHARE: own_factor = 1.2 is outside 0 to 1"),
     "the library's reason (cto_explain); docs/reference/functions.md: a factor is in [0, 1]"),
    ("reason: a rate typed as 8 for 8%", '=DEALREASON("dealsharerate";8;0.05;30)',
     Text("DEALSHARERATE: ok, but own_rate = 8 is outside the usual 0 to 1: above 100% a "
          "year: a percentage typed as a whole number? (8% is 0.08)"),
     "plausible range of a rate (common practice, no source)"),
    ("reason: no deal", '=DEALREASON("DEALSOLVE";0.9;0.95;0;0;0;0;0;70;60;100)',
     Text("DEALSOLVE: no rational deal (#N/A in Calc): the surplus 100 does not exceed "
          "what the parties get without a deal (own 70, other 60); the result is own's "
          "no-deal payoff"),
     "walk-away values 70 + 60 above the surplus 100: no deal (docs/reference/functions.md)"),
    ("reason: ok", '=DEALREASON("DEALSHARE";0.9;0.95)', Text("DEALSHARE: ok"),
     "the library's reason for a valid call"),
    ("reason: an unknown name", '=DEALREASON("DEALNONE";1)',
     Text('unknown function "DEALNONE": give the name of a DEAL function, e.g. "DEALSOLVE"'),
     "the reason function never fails on the user's input"),
    ("reason: DEALOFFERPATH, a factor outside 0 to 1",
     '=DEALREASON("DEALOFFERPATH";0;1000000;1.9;0.9;2)',
     Text("DEALOFFERPATH: offerer_factor = 1.9 is outside 0 to 1"),
     "the library's reason for offer_path's arguments, which DEALOFFERPATH takes; "
     "docs/reference/functions.md: a factor is in [0, 1]"),
    ("reason: DEALOFFERPATH ok", '=DEALREASON("DEALOFFERPATH";0;1000000;0.9;0.9;2)',
     Text("DEALOFFERPATH: ok"), "the library's reason for a valid call"),
    ("deadline T=2", "=DEALDEADLINE(0.9;0.9;2)", 0.1, R11 % 24),
    ("deadline T=3", "=DEALDEADLINE(0.9;0.9;3)", 0.91, R11 % 25),
    ("deadline T=10", "=DEALDEADLINE(0.9;0.9;10)", 0.342800821, R11 % 27),
    ("deadline T=11", "=DEALDEADLINE(0.9;0.9;11)", 0.6914792611, R11 % 28),
    ("deadline T=6, d=(0.95,0.9)", "=DEALDEADLINE(0.95;0.9;6)", 0.2586025, R11 % 30),
    ("deadline with fallbacks", "=DEALDEADLINE(0.9;0.9;3;0.1;0.2)", 0.748, R11 % 31),
    ("deadline T=4 with fallbacks", "=DEALDEADLINE(0.95;0.9;4;0.1;0.2)", 0.26245, R11 % 32),
    ("fixed costs, own cheaper", "=DEALFIXEDCOST(0.1;0.2)", 1.0, R11 % 15),
    ("fixed costs, own dearer", "=DEALFIXEDCOST(0.2;0.1)", 0.1, R11 % 17),
    ("fixed costs, money", "=DEALFIXEDCOST(20;10;1000)", 10.0, R11 % 19),
    ("fixed costs, money, other opens role", "=DEALFIXEDCOST(10;20;1000)", 1000.0, R11 % 20),
    ("delay cost, holding cost", "=DEALDELAYCOST(0.9;100)", 10.0,
     "docs/models/complete-information.md s.4: delay cost (1 - d) s = 0.1 x 100"),
    ("delay cost with breakdown", "=DEALDELAYCOST(0.9;100;0.1;20)", 17.0,
     "docs/reference/functions.md formula s - ((1-p) d s + p b) = 100 - (81 + 2)"),
    ("first-mover advantage", "=DEALFIRSTMOVER(0.8;0.8)", 1 / 9.0,
     "docs/models/complete-information.md s.10 example: 1/9"),
    ("first-mover, monthly offers",
     "=DEALFIRSTMOVER(DEALFACTOR(0.1;1;12;TRUE());DEALFACTOR(0.05;1;12;TRUE());1000)",
     2.77776974025657, R11 % 78),
    ("Nash, linear", "=DEALNASH(0.1;0.2)", 0.45, R11 % 54),
    ("Nash, weighted", "=DEALNASH(0.1;0.2;0.3)", 0.31, R11 % 55),
    ("Nash, CRRA", "=DEALNASH(0;0;0.5;1;0.5;1)", 1 / 3.0, R11 % 56),
    ("Nash, CRRA with fallbacks", "=DEALNASH(0.1;0.2;0.5;1;0.5;1)", 0.4, R11 % 57),
    ("risk averse, power", "=DEALRISKAVERSE(0.9;0.9;0.5;1)", 0.369003690036900, R11 % 58),
    ("risk averse, exponential", "=DEALRISKAVERSE(EXP(-0.1);EXP(-0.05);2;0.5;\"exponential\")",
     0.324276325976081, R11 % 59),
    ("choice text any case", "=DEALRISKAVERSE(EXP(-0.1);EXP(-0.05);2;0.5;\"EXPONENTIAL\")",
     0.324276325976081, R11 % 59 + "; docs/reference/functions.md: choices case-insensitive"),
    ("group, proposer", "=DEALGROUP(0.9;3)", 0.369003690036900, R11 % 61),
    ("group, last responder", "=DEALGROUP(0.9;3;2)", 0.298892988929889, R11 % 62),
    ("group of 5, proposer", "=DEALGROUP(0.95;5)", 0.221024698128612, R11 % 63),
    ("group of 5, last", "=DEALGROUP(0.95;5;4)", 0.180025998030117, R11 % 64),
    ("majority, proposer", "=DEALMAJORITY(0.9;5;3)", 0.64, R11 % 65),
    ("majority, partner", "=DEALMAJORITY(0.9;5;3;\"partner\")", 0.18, R11 % 66),
    ("majority, simple majority default", "=DEALMAJORITY(0.9;5)", 0.64,
     R11 % 65 + "; q = floor(5/2)+1 = 3"),
    ("majority of 101", "=DEALMAJORITY(0.95;101;51)", 0.529702970297030, R11 % 67),
    ("majority of 101, partner", "=DEALMAJORITY(0.95;101;51;\"Partner\")",
     0.00940594059405941, R11 % 68),
    ("unanimity quota", "=DEALMAJORITY(0.9;5;5)", 0.28, R11 % 69),
    ("implied factor", "=DEALIMPLIEDFACTOR(20/29;0.9)", 0.95,
     R11 % 14 + " inverted: share 20/29 at other 0.9"),
    ("implied rate", "=DEALIMPLIEDRATE(0.350131861448953;0.05;365;TRUE();365;TRUE())", 0.1,
     R11 % 10 + " inverted (share given to 15 digits)", 1e-12),
    ("implied rate, mpmath root", "=DEALIMPLIEDRATE(0.4;0.07;30;TRUE();365;TRUE())",
     implied_rate_cont(mp.mpf("0.4"), 0.07, 30),
     MPM % "findroot of the Rubinstein share in the own rate"),
    ("sensitivity to own rate", "=DEALSENSITIVITY(0.08;0.12;30;\"own\")",
     sensitivity(0.08, 0.12, 30, "own"), MPM % "mp.diff of the Rubinstein share", 1e-12),
    ("sensitivity to other rate", "=DEALSENSITIVITY(0.08;0.12;30;\"other\";1000)",
     1000 * sensitivity(0.08, 0.12, 30, "other"), MPM % "mp.diff of the Rubinstein share",
     1e-12),
    ("screening, screen", "=DEALSCREEN(1;0.5;0.45;0.9;0.8)", 0.5175, R11 % 71),
    ("screening, skim", "=DEALSCREEN(1;0.5;0.8;0.9;0.8)", 0.78, R11 % 72),
    ("screening, pool", "=DEALSCREEN(1;0.5;0.3;0.9;0.8)", 0.5, R11 % 73),
    ("call probe", "=DEALCALLPROBE(3;4)", 3.0, "the probe returns its first argument"),
    ("inline arrays, one call", "=SUMPRODUCT(DEALSHARE({0.5;0.95};{0.5;0.9}))",
     2 / 3.0 + 0.689655172413793, R11 % 9 + " + check value 14"),
    ("a single value applies to every element", "=SUMPRODUCT(DEALSHARE({0.5;0.5};0.5))",
     4 / 3.0, R11 % 9 + " twice"),
    ("outcome form, second case", "=INDEX(DEALSOLVEOUTCOME({0.5|0.95};{0.5|0.9});2;1)",
     0.689655172413793, R11 % 14),
    ("outcome form, second case, other share",
     "=INDEX(DEALSOLVEOUTCOME({0.5|0.95};{0.5|0.9});2;2)", 1 - 0.689655172413793,
     R11 % 14 + ": 1 - x*"),
]

BAD = "docs/reference/functions.md: bad input -> invalid argument"
ERRORS = [
    ("factor above 1", "=DEALSHARE(1.5;0.5)", "Err:502", BAD + " (factor outside [0,1])"),
    ("negative factor", "=DEALSHARE(-0.1;0.5)", "Err:502", BAD),
    ("text where a number is needed", "=DEALSHARE(\"half\";0.5)", "Err:502",
     "docs/reference/functions.md: a text cell where a number is required is an error value"),
    ("text cell where a number is needed", "=DEALSHARE(H2;0.5)", "Err:502",
     "docs/reference/functions.md: text cell -> error value", {"H2": "abc"}),
    ("bad boolean", "=DEALSHARE(0.5;0.5;1;2)", "Err:502", "docs/reference/functions.md: booleans 1/0"),
    ("bad boolean text", "=DEALSHARE(0.5;0.5;1;\"maybe\")", "Err:502",
     "docs/reference/functions.md: booleans TRUE/FALSE"),
    ("both factors 1", "=DEALSHARE(1;1)", "#NUM!",
     "docs/models/complete-information.md s.1 edge cases: both factors 1 -> indeterminate"),
    ("negative surplus", "=DEALSHARE(0.9;0.9;-1)", "#N/A",
     R11 % 84 + "; docs/models/complete-information.md s.1 edge cases: no agreement"),
    ("zero surplus", "=DEALSHARE(0.9;0.9;0)", "#N/A", "header: no deal when surplus <= 0"),
    ("negative days", "=DEALFACTOR(0.05;-1)", "Err:502", BAD + " (negative days)"),
    ("zero basis", "=DEALFACTOR(0.05;30;0)", "Err:502", BAD + " (basis must be > 0)"),
    ("both rates 0", "=DEALSHARELIMIT(0;0)", "#NUM!",
     "docs/models/complete-information.md s.1 edge cases: r_A = r_B = 0"),
    ("days 0 with rates", "=DEALSHARERATE(0.1;0.05;0)", "#NUM!",
     "header: rho_own = rho_oth = 0 is indeterminate"),
    ("breakdown prob above 1", "=DEALBREAKDOWN(0.9;0.9;1.5;0;0)", "Err:502", BAD),
    ("breakdown, no gains from trade", "=DEALBREAKDOWN(0.9;0.9;1;0.6;0.5)", "#N/A",
     "docs/models/complete-information.md s.4 edge cases: b_A + b_B >= pie -> no agreement "
     "(p = 1: no-deal values = b)"),
    ("options exceed the surplus", "=DEALOUTSIDE(0.9;0.9;0.6;0.5)", "#N/A",
     R11 % 83 + "; docs/models/complete-information.md s.5 edge cases"),
    ("inside options exceed the surplus", "=DEALINSIDE(0.9;0.9;0.6;0.5)", "#N/A",
     "docs/models/complete-information.md s.6: g_A + g_B >= pie"),
    ("solve indeterminate", "=DEALSOLVE(1;1)", "#NUM!",
     "docs/models/combined.md: p = 0 and both factors 1"),
    ("rounds not whole", "=DEALDEADLINE(0.9;0.9;2.5)", "Err:502",
     "docs/reference/functions.md: counts must be whole numbers"),
    ("rounds negative", "=DEALDEADLINE(0.9;0.9;-1)", "Err:502",
     "docs/models/complete-information.md s.3 edge cases: reject T < 0"),
    ("no rounds", "=DEALDEADLINE(0.9;0.9;0)", "#N/A",
     "docs/models/complete-information.md s.3 edge cases: T = 0 means no bargaining (no deal)"),
    ("equal fixed costs", "=DEALFIXEDCOST(0.1;0.1)", "#NUM!",
     "check values 21-22 of tests/cpp/test_published.cpp: any x in [c,1] "
     "(docs/models/complete-information.md s.2)"),
    ("negative cost", "=DEALFIXEDCOST(-0.1;0.1)", "Err:502", BAD),
    ("Nash, no gains", "=DEALNASH(0.6;0.5)", "#N/A",
     "docs/reference/functions.md (nash_share statuses): no gains from trade"),
    ("Nash weight above 1", "=DEALNASH(0.1;0.2;1.2)", "Err:502", BAD),
    ("unknown utility", "=DEALRISKAVERSE(0.9;0.9;0.5;1;\"cubic\")", "Err:502",
     "docs/reference/functions.md: choices are \"power\" or \"exponential\""),
    ("curvature 0", "=DEALRISKAVERSE(0.9;0.9;0;1)", "Err:502", "header: curvature in (0, 1]"),
    ("parties not whole", "=DEALGROUP(0.9;3.5)", "Err:502",
     "docs/reference/functions.md: 3.5 parties is an error, not 3"),
    ("no parties", "=DEALGROUP(0.9;0)", "Err:502", "docs/reference/functions.md: parties < 1 is invalid"),
    ("position outside", "=DEALGROUP(0.9;3;3)", "Err:502", "header: position in [0, n-1]"),
    ("group indeterminate", "=DEALGROUP(1;3)", "#NUM!", "header: d = 1 and n >= 2"),
    ("quota above parties", "=DEALMAJORITY(0.9;5;6)", "Err:502",
     "docs/models/complete-information.md s.9: validate 1 <= q <= n"),
    ("unknown role", "=DEALMAJORITY(0.9;5;3;\"chair\")", "Err:502",
     "docs/reference/functions.md: role \"proposer\" or \"partner\""),
    ("unreachable share", "=DEALIMPLIEDFACTOR(0.05;0.9)", "Err:502",
     "header: own opens needs s >= 1 - d_oth"),
    ("unknown wrt", "=DEALSENSITIVITY(0.08;0.12;30;\"both\")", "Err:502",
     "docs/reference/functions.md: wrt \"own\" or \"other\""),
    ("screening, low above high", "=DEALSCREEN(0.5;1;0.5;0.9;0.8)", "Err:502",
     "header: high_value >= low_value"),
    ("probe with text", "=DEALCALLPROBE(\"x\";1)", "Err:502", "the probe needs numbers"),
    ("ranges of different shapes", "=SUMPRODUCT(DEALSHARE({0.5;0.5};{0.5;0.5;0.5}))",
     "Err:502", "addin/README.md: every range argument must have the same shape"),
    ("one bad element in an array", "=SUMPRODUCT(DEALSHARE({0.5;1.5};{0.5;0.5}))", "Err:502",
     BAD + " (the element's Err:502 reaches the sum)"),
]

# Whole columns: one matrix formula over ranges, each element with its own result.
# (rows of inputs H, I, J, expected, source)
ARRAY_ROWS = [
    (0.5, 0.5, 1, 2 / 3.0, R11 % 9),
    (0.95, 0.9, 1, 0.689655172413793, R11 % 14),
    (1, 1, 1, "#NUM!", "docs/models/complete-information.md s.1 edge cases: indeterminate"),
    (1.5, 0.5, 1, "Err:502", BAD),
    (None, 0.5, 1, "Err:502", "docs/reference/functions.md: an empty cell where a number is required"),
    ("abc", 0.5, 1, "Err:502", "docs/reference/functions.md: a text cell where a number is required"),
    (0.9, 0.9, -1, "#N/A", R11 % 84),
    (0.95, 0.9, 1000, 689.655172413793, R11 % 14 + " x 1000"),
]


def check_formula(r, expected):
    if isinstance(expected, Text):
        return "=IF(ISERROR(B%d);FALSE();EXACT(B%d;C%d))" % (r, r, r)
    if isinstance(expected, str):
        return "=IFERROR(ERRORTYPE(B%d)=G%d;FALSE())" % (r, r)
    return "=IF(ISERROR(B%d);FALSE();ABS(B%d-C%d)<=G%d*MAX(1;ABS(C%d)))" % (r, r, r, r, r)


def document(title, rows):
    """rows: list of dicts with case, formula (or None inside a matrix), expected,
    source, tol, inputs {col letter: value}, matrix_rows (for the anchor)."""
    out = []
    head = ["Case", "Result", "Expected", "Check", "Formula", "Source", "Tolerance / code"]
    out.append(odf_row(text_cell(h) for h in head))
    for i, row in enumerate(rows):
        r = i + 2
        cells = [text_cell(row["case"])]
        if row.get("formula"):
            matrix = (row["matrix_rows"], 1) if row.get("matrix_rows") else None
            cells.append(formula_cell(row["formula"], matrix))
        else:
            cells.append("<table:table-cell/>")  # covered by the matrix formula above
        exp = row["expected"]
        cells.append(text_cell(exp) if isinstance(exp, str) else cell_value(exp))
        cells.append(formula_cell(check_formula(r, exp)))
        cells.append(formula_cell("=FORMULA(B%d)" % r) if row.get("formula_text_row") is None
                     else formula_cell("=FORMULA(B%d)" % row["formula_text_row"]))
        cells.append(text_cell(row["source"]))
        cells.append(cell_value(0 if isinstance(exp, Text) else
                                ERR[exp] if isinstance(exp, str) else row.get("tol", 1e-13)))
        inputs = row.get("inputs", {})
        for col in "HIJ":
            cells.append(cell_value(inputs.get(col)))
        out.append(odf_row(cells))
    n = len(rows) + 1
    summary = '<table:table table:name="Summary">%s%s</table:table>' % (
        odf_row([text_cell("All checks"), of_cell("of:=AND([$Cases.D2:.D%d])" % n)]),
        odf_row([text_cell("Cases"), cell_value(len(rows))]))
    return odf_document(title, "tests/sheets/make_sheets.py", out, summary)


def scalar_rows(cases):
    rows = []
    for i, c in enumerate(cases):
        case, formula, expected, source = c[:4]
        extra = c[4] if len(c) > 4 else None
        row = {"case": case, "formula": formula, "source": source,
               "expected": expected if isinstance(expected, str) else float(expected)}  # Text too
        if isinstance(extra, dict):
            # inputs named H2 etc. refer to this row: rewrite to the row's number
            r = i + 2
            row["inputs"] = {k[0]: v for k, v in extra.items()}
            row["formula"] = formula.replace("H2", "H%d" % r)
        elif extra is not None:
            row["tol"] = extra
        rows.append(row)
    return rows


def array_rows():
    rows = []
    n = len(ARRAY_ROWS)
    for i, (h, iv, j, expected, source) in enumerate(ARRAY_ROWS):
        row = {"case": "column element %d" % (i + 1), "expected": expected,
               "source": source, "inputs": {"H": h, "I": iv, "J": j},
               "formula_text_row": 2}
        if i == 0:
            row["formula"] = "=DEALSHARE(H2:H%d;I2:I%d;J2:J%d)" % (n + 1, n + 1, n + 1)
            row["matrix_rows"] = n
        rows.append(row)
    # The outcome form over two rows of inputs in one matrix formula would span four
    # columns; INDEX picks elements of it instead.
    return rows


def ranges_rows():
    """DEALRANGE, DEALRANGEOUTCOME, DEALSWING and DEALOFFERPATH (tests/sheets/range_cases.py):
    two matrix formulas first (rows 2-4 and 5-6), then single cells."""
    rows = range_cases.range_matrix_rows(share_rates, 2)
    rows += range_cases.offer_matrix_rows()
    for i, row in enumerate(rows):
        row["formula_text_row"] = 2 if i < 3 else 5
    cases = (range_cases.range_values(share_rates, Text) + range_cases.offer_values()
             + range_cases.ERRORS + range_cases.reason_values(Text))
    return rows + scalar_rows(cases)


def main():
    files = {
        "addin_values.fods": ("add-in values", scalar_rows(VALUES)),
        "addin_errors.fods": ("add-in error values", scalar_rows(ERRORS)),
        "addin_arrays.fods": ("add-in whole-column form", array_rows()),
        "addin_ranges.fods": ("add-in ranges and offer path", ranges_rows()),
    }
    for name, (title, rows) in files.items():
        with open(os.path.join(HERE, name), "w", encoding="utf-8") as f:
            f.write(document(title, rows))
        print("wrote", name, len(rows), "cases")


if __name__ == "__main__":
    sys.exit(main())
