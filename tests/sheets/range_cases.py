"""The cases of the add-in's range and offer-path sheet (tests/sheets/addin_ranges.fods):
DEALRANGE, DEALRANGEOUTCOME, DEALSWING and DEALOFFERPATH.  Written by make_sheets.py.

Expected values come from outside the project: mpmath at 50 digits (the Rubinstein
share at the rates, the inverse CDFs of docs/models/ranges.md, a quadrature for a mean),
the check values D1-D16 of tests/cpp/test_range_distributions.cpp, the closed form of
another function in the
sheet (DEALSHARERATE), and the 50-digit reference row of the two-round offer path
(tests/reference/private/offer_path.csv, first row).  A quantile of own share is the
share at the input's quantile because the share is monotone in each rate (the exact
quantiles of docs/models/ranges.md, "The two examples", rest on the same fact); its
tolerance is the three significant digits the estimator targets (its digit target), or
the reported 95% half-width.
"""
import csv
import os

import mpmath as mp

HERE = os.path.dirname(os.path.abspath(__file__))
OFFER_CSV = os.path.join(HERE, "..", "reference", "private", "offer_path.csv")
# the 15 positions after the three required inputs: 11 optional inputs, then probability
SKIP_TO_PROB = ";" * 12


class Text(str):
    """An expected text result (set by make_sheets to its own Text class)."""


def tri_inv(lo, m, hi, u):
    """Triangular inverse CDF, docs/models/ranges.md "Input distributions"."""
    lo, m, hi, u = (mp.mpf(x) for x in (lo, m, hi, u))
    fm = (m - lo) / (hi - lo)
    if u < fm:
        return lo + mp.sqrt(u * (hi - lo) * (m - lo))
    return hi - mp.sqrt((1 - u) * (hi - lo) * (hi - m))


def offer_row():
    """The two-round row: [0, 1], factors 0.9, seller offers, cost 0."""
    with open(OFFER_CSV, newline="", encoding="utf-8") as f:
        for row in csv.DictReader(f):
            if (row["private_low"], row["private_high"], row["offerer_factor"],
                    row["responder_factor"], row["rounds"], row["known_value"],
                    row["offerer"]) == ("0.0", "1.0", "0.9", "0.9", "2", "0.0", "0"):
                return {k: mp.mpf(v) for k, v in row.items()
                        if k not in ("status", "source", "offerer")}
    raise SystemExit("offer_path.csv: the two-round reference row is missing")


def range_values(share_rates, text):
    """(case, formula, expected, source[, tolerance]) of DEALRANGE, DEALRANGEOUTCOME and
    DEALSWING; share_rates(r_own, r_other, days) is the mpmath Rubinstein share."""
    uni = "DEALRANGE(0.08;{0.04;0.16};30)"
    outcome = "DEALRANGEOUTCOME(0.08;{0.04;0.16};30)"
    rub = "mpmath 50 digits: Rubinstein (1982) share at "
    mono = ("; own share rises with the other's rate, so its quantile is the share at the "
            "rate's quantile (as for the exact quantiles of docs/models/ranges.md); "
            "tolerance: 3 significant digits (the digit target)")
    median = share_rates(0.08, 0.10, 30)
    mean = mp.quad(lambda r: share_rates(0.08, r, 30), [0.04, 0.16]) / mp.mpf("0.12")
    p_tri = tri_inv(0.04, 0.08, 0.16, 0.1)
    # DEALSWING: own_rate (0.06, 0.10) and other_rate (0.04, 0.16), modes 0.08 and 0.10
    ends = {"own_rate": (share_rates(0.06, 0.10, 30), share_rates(0.10, 0.10, 30)),
            "other_rate": (share_rates(0.08, 0.04, 30), share_rates(0.08, 0.16, 30))}
    order = sorted(ends, key=lambda k: -abs(ends[k][1] - ends[k][0]))
    swing = "DEALSWING({0.06;0.1};{0.04;0.16};30)"
    cases = [
        ("every input fixed", "=DEALRANGE(0.08;0.12;30)", share_rates(0.08, 0.12, 30),
         rub + "(0.08, 0.12), 30 days; no uncertainty: the value itself", 1e-14),
        ("every input fixed = DEALSHARERATE", "=DEALRANGE(0.08;0.12;30)-DEALSHARERATE(0.08;0.12;30)",
         0.0, "the closed form of DEALSHARERATE (Rubinstein 1982; Muthoo 1999 s.3.2)", 1e-15),
        ("degenerate ranges equal the fixed input exactly",
         "=DEALRANGE({0.08;0.08};{0.12;0.12;0.12};30)-DEALRANGE(0.08;0.12;30)", 0.0,
         "issue 12 and docs/models/ranges.md: low = high is the fixed-input result exactly",
         0.0),
        ("one uniform rate: the median", "=" + uni, median,
         rub + "the median 0.10 of U(0.04, 0.16)" + mono, 1e-3),
        ("the median within its reported 95% half-width",
         "=ABS(%s-DEALSHARERATE(0.08;0.1;30))<=INDEX(%s;2;3)" % (uni, outcome), 1.0,
         "docs/models/ranges.md (95% half-width) around the share at the median rate "
         "(DEALSHARERATE; monotone share)", 0.0),
        ("one triangular rate at p = 0.1",
         "=DEALRANGE(0.08;{0.04;0.08;0.16};30%s0.1;\"Triangular\")" % SKIP_TO_PROB,
         share_rates(0.08, p_tri, 30),
         rub + "the triangular(0.04, 0.08, 0.16) 10% point (docs/models/ranges.md)" + mono,
         2e-3),
        ("PERT own rate (default shape), median",
         "=DEALRANGE({0.05;0.1;0.2};0.05;30)", share_rates(mp.mpf("0.106371876050618"), 0.05, 30),
         rub + "check value D10 (PERT(0.05, 0.10, 0.20) at u = 0.5)" + mono, 1e-3),
        ("PERT own rate at p = 0.9",
         "=DEALRANGE({0.05;0.1;0.2};0.05;30%s0.9)" % SKIP_TO_PROB,
         share_rates(mp.mpf("0.0729541540514719"), 0.05, 30),
         rub + "check value D9 (PERT(0.05, 0.10, 0.20) at u = 0.1): own share falls with own "
         "rate, so its 90% point is the share at the rate's 10% point; 3 digits (the digit "
         "target)", 2e-3),
        ("outcome: the status word", "=INDEX(%s;16;2)" % outcome, text("ok"),
         "cto_status_name(CTO_OK); 3 digits reached (docs/models/ranges.md digit target)"),
        ("outcome: the label of the median", "=INDEX(%s;2;1)" % outcome,
         text("own share, p = 0.5"), "addin/README.md: DEALRANGEOUTCOME layout"),
        ("outcome: other share median = 1 - own median", "=INDEX(%s;5;2)" % outcome,
         1 - median,
         "surplus 1: other = 1 - own in every draw (complete-information.md s.1)" + mono, 1e-3),
        ("outcome: the mean", "=INDEX(%s;7;2)" % outcome, mean,
         "mpmath quadrature of the share over U(0.04, 0.16)", 1e-4),
        ("outcome: every draw a rational deal", "=INDEX(%s;9;2)" % outcome, 1.0,
         "positive surplus, no walk-away values: always a deal (complete-information.md s.1)", 0.0),
        ("outcome: replicates", "=INDEX(%s;14;2)" % outcome, 16.0,
         "docs/models/ranges.md options: replicates = 16 by default", 0.0),
        ("outcome: one uncertain input", "=INDEX(%s;15;2)" % outcome, 1.0,
         "one input given as a range", 0.0),
        ("outcome: spec version", "=INDEX(%s;17;2)" % outcome, 3.0,
         "docs/models/ranges.md, Reproducibility: the spec version of the rules", 0.0),
        ("swing: the larger swing first", "=INDEX(%s;1;1)" % swing, text(order[0]),
         rub + "each input's ends, the other at its mode; sorted by swing (Clemen & Reilly "
         "2014 ch.5)"),
    ]
    for i, name in enumerate(order):
        for j, end in enumerate(("low", "high")):
            cases.append(("swing: %s at its %s" % (name, end),
                          "=INDEX(%s;%d;%d)" % (swing, i + 1, j + 2), ends[name][j],
                          rub + "the %s end, the other rate at its mode" % end, 1e-13))
    return cases


def range_matrix_rows(share_rates, first_row):
    """A column of probabilities (cells H<first_row>..) in one matrix formula: a column of
    quantiles."""
    probs = [0.1, 0.5, 0.9]
    rows = []
    for i, p in enumerate(probs):
        rate = mp.mpf("0.04") + mp.mpf(p) * mp.mpf("0.12")
        row = {"case": "quantile column, p = %g" % p, "expected": float(share_rates(0.08, rate, 30)),
               "source": "mpmath 50 digits: the share at the uniform rate's %g point; monotone "
                         "share; 3 digits (docs/models/ranges.md digit target)" % p,
               "tol": 2e-3, "inputs": {"H": p}}
        if i == 0:
            row["formula"] = "=DEALRANGE(0.08;{0.04;0.16};30%sH%d:H%d)" % (
                SKIP_TO_PROB, first_row, first_row + len(probs) - 1)
            row["matrix_rows"] = len(probs)
        rows.append(row)
    return rows


def offer_values():
    """DEALOFFERPATH against the 50-digit two-round reference row."""
    ref = offer_row()
    path = "DEALOFFERPATH(0;1;0.9;0.9;2)"
    src = ("tests/reference/private/offer_path.csv row 1 (50-digit backward induction; "
           "Sobel & Takahashi 1983): ")
    uni = "; responder values uniform on [0, 1]: P = 1 - cutoff (private-information.md s.2.1)"
    return [
        ("offer path: the opening offer", "=INDEX(%s;1;2)" % path, ref["opening_offer"],
         src + "opening offer 0.4653846153846154", 1e-14),
        ("offer path: the second offer", "=INDEX(%s;2;2)" % path, ref["offer_2"],
         src + "offer_2", 1e-14),
        ("offer path: cutoff after round 1", "=INDEX(%s;1;3)" % path, ref["cutoff_1"],
         src + "cutoff_1", 1e-14),
        ("offer path: cutoff after round 2", "=INDEX(%s;2;3)" % path, ref["cutoff_2"],
         src + "cutoff_2", 1e-14),
        ("offer path: agreement in round 1", "=INDEX(%s;1;4)" % path, 1 - ref["cutoff_1"],
         src + "1 - cutoff_1" + uni, 1e-14),
        ("offer path: agreement by round 2 = 15/26", "=INDEX(%s;2;5)" % path,
         mp.mpf(15) / 26, src + "agreement_probability 15/26", 1e-14),
        ("offer path: round numbers", "=INDEX(%s;2;1)" % path, 2.0, "the second row is round 2",
         0.0),
        ("offer path: a row per round", "=ROWS(%s)" % path, 2.0, "2 rounds: 2 rows", 0.0),
        ("offer path without a deadline: the first 1,000 rounds",
         "=ROWS(DEALOFFERPATH(0;1;0.9;0.9))", 1000.0,
         "addin/README.md: at most 1,000 rows", 0.0),
    ]


def offer_matrix_rows():
    """The offer column of the two-round path in one matrix formula (INDEX column 2)."""
    ref = offer_row()
    src = "tests/reference/private/offer_path.csv row 1 (50 digits): "
    return [
        {"case": "offer column, round 1", "expected": float(ref["opening_offer"]),
         "source": src + "opening_offer", "tol": 1e-14,
         "formula": "=INDEX(DEALOFFERPATH(0;1;0.9;0.9;2);0;2)", "matrix_rows": 2},
        {"case": "offer column, round 2", "expected": float(ref["offer_2"]),
         "source": src + "offer_2", "tol": 1e-14},
    ]


def reason_values(text):
    """DEALREASON for DEALRANGE, DEALRANGEOUTCOME and DEALSWING: the library's reason
    (cto_range_explain, cto_swing_explain) for the same arguments, read as the range
    functions read them.  The rules are docs/models/ranges.md "Inputs, options, outputs";
    the words are the project's contract, docs/models/ranges.md "Reasons in words"; the
    add-in's own words for a value it cannot convert are addin/README.md's."""
    words = 'docs/models/ranges.md "Reasons in words": '
    slip = ("DEALRANGE: ok, but other_rate high = 8 is outside the usual 0 to 1: above 100% a "
            "year: a percentage typed as a whole number? (8% is 0.08)")
    precision = ('=ISNUMBER(FIND("precision not reached: 15 significant digits not reached '
                 'at 2^20 points per replicate (16 replicates): own share at p = 0.5 has";'
                 'DEALREASON("DEALRANGE";0.08;{0.04;0.16};30%s0.5;;0;15)))' % SKIP_TO_PROB)
    return [
        ("reason: range ok", '=DEALREASON("DEALRANGE";0.08;{0.04;0.16};30)',
         text("DEALRANGE: ok"), words + "a valid run"),
        ("reason: a low above its high", '=DEALREASON("DEALRANGE";0.08;{0.16;0.04};30)',
         text("DEALRANGE: other_rate: low 0.16 is above high 0.04"),
         words + "low <= high (the engine's first check of a range)"),
        ("reason: a mode outside its range",
         '=DEALREASON("DEALRANGE";0.08;{0.04;0.2;0.16};30)',
         text("DEALRANGE: other_rate: mode 0.2 is outside low 0.04 to high 0.16"),
         words + "low <= mode <= high"),
        ("reason: a range reaching a value the model refuses",
         '=DEALREASON("DEALRANGE";0.08;0.1;30;{0;1.5})',
         text("DEALRANGE: breakdown_prob at its high: breakdown_prob = 1.5 is outside 0 to 1"),
         words + "the model at each uncertain input's high; a probability is in [0, 1]"),
        ("reason: text where a number is needed", '=DEALREASON("DEALRANGE";"x";0.1;30)',
         text("DEALRANGE: own_rate is empty or not a number"),
         words + "text is NaN (addin/README.md), which the library refuses"),
        ("reason: own_opens as a range", '=DEALREASON("DEALRANGE";0.08;0.1;30;;;;;;;;;{0;1})',
         text("DEALRANGE: own_opens must be a fixed 0 or 1 (FALSE or TRUE), not a range"),
         words + "own_opens and continuous must be fixed at 0 or 1"),
        ("reason: probability 1",
         '=DEALREASON("DEALRANGE";0.08;{0.04;0.16};30%s1)' % SKIP_TO_PROB,
         text("DEALRANGE: probability 1 is not strictly between 0 and 1"),
         words + "every probability in (0, 1)"),
        ("reason: an unknown shape",
         '=DEALREASON("DEALRANGE";0.08;{0.04;0.08;0.16};30%s0.5;"normal")' % SKIP_TO_PROB,
         text('DEALRANGE: invalid argument 16 (Shape): "pert" or "triangular"'),
         "addin/README.md: the shape is \"pert\" or \"triangular\" (the add-in's words)"),
        ("reason: 4 cells for one input",
         '=DEALREASON("DEALRANGE";0.08;{0.04;0.08;0.12;0.16};30)',
         text("DEALRANGE: invalid argument 2 (Other rate): one cell, or 2 cells (low, high) "
              "or 3 (low, mode, high) in a row or a column"),
         "addin/README.md: an input is 1, 2 or 3 cells (the add-in's words)"),
        ("reason: a range end typed as 8 for 8%", '=DEALREASON("DEALRANGE";0.08;{0.04;8};30)',
         text(slip), words + "plausible range of a rate (common practice, no source)"),
        ("reason: precision not reached (Err:523 in DEALRANGE)", precision, 1.0,
         words + "15 digits are beyond the cap of 16 x 2^20 points; the rest of the text "
         "holds the estimate and its half-width", 0.0),
        ("reason: the outcome form", '=DEALREASON("DEALRANGEOUTCOME";0.08;{0.04;0.16};30)',
         text("DEALRANGEOUTCOME: ok"), words + "a valid run"),
        ("reason: the swing", '=DEALREASON("DEALSWING";0.08;{0.16;0.04};30)',
         text("DEALSWING: other_rate: low 0.16 is above high 0.04"),
         words + "the swing checks its inputs as share_range does"),
    ]


BAD = "bad input -> invalid argument (docs/models/ranges.md; docs/reference/functions.md)"
ERRORS = [
    ("range: low above high", "=DEALRANGE(0.08;{0.16;0.04};30)", "Err:502",
     BAD + " (a low above its high)"),
    ("range: 4 cells", "=DEALRANGE(0.08;{0.04;0.08;0.12;0.16};30)", "Err:502",
     "addin/README.md: an input is 1, 2 or 3 cells"),
    ("range: a 2x2 block", "=DEALRANGE(0.08;{0.04;0.08|0.12;0.16};30)", "Err:502",
     "addin/README.md: an input is a row or a column of 1 to 3 cells"),
    ("range: text", "=DEALRANGE(\"x\";0.1;30)", "Err:502",
     "docs/reference/functions.md: text where a number is needed is an error value"),
    ("range: text inside a range", "=DEALRANGE(0.08;{0.04;\"x\"};30)", "Err:502",
     "docs/reference/functions.md: text where a number is needed is an error value"),
    ("range: mode outside", "=DEALRANGE(0.08;{0.04;0.2;0.16};30)", "Err:502",
     BAD + " (a mode outside its range)"),
    ("range: probability 1", "=DEALRANGE(0.08;{0.04;0.16};30%s1)" % SKIP_TO_PROB, "Err:502",
     BAD + " (a probability outside (0, 1): docs/models/ranges.md options)"),
    ("range: unknown shape", "=DEALRANGE(0.08;{0.04;0.08;0.16};30%s0.5;\"normal\")" % SKIP_TO_PROB,
     "Err:502", BAD + " (an unknown shape)"),
    ("range: own_opens as a range", "=DEALRANGE(0.08;0.1;30;;;;;;;;;{0;1})", "Err:502",
     "header: own_opens must be fixed at 0 or 1"),
    ("range: negative seed", "=DEALRANGE(0.08;{0.04;0.16};30%s0.5;;-1)" % SKIP_TO_PROB, "Err:502",
     "addin/README.md: the seed is a whole number from 0"),
    ("range: precision not reached", "=DEALRANGE(0.08;{0.04;0.16};30%s0.5;;0;15)" % SKIP_TO_PROB,
     "Err:523", "15 significant digits are beyond the cap of 16 x 2^20 points "
     "(docs/models/ranges.md: precision not reached, never a silent rough number)"),
    ("swing: low above high", "=DEALSWING(0.08;{0.16;0.04};30)", "Err:502", BAD),
    ("offer path: low above high", "=DEALOFFERPATH(1;0;0.9;0.9;2)", "Err:502",
     BAD + " (private_low > private_high)"),
    ("offer path: rounds not whole", "=DEALOFFERPATH(0;1;0.9;0.9;2.5)", "Err:502",
     BAD + " (rounds not whole)"),
    ("offer path: factor above 1", "=DEALOFFERPATH(0;1;1.5;0.9;2)", "Err:502",
     BAD + " (factors outside [0, 1])"),
    ("offer path: text", "=DEALOFFERPATH(\"x\";1;0.9;0.9;2)", "Err:502",
     "docs/reference/functions.md: text where a number is needed is an error value"),
    ("offer path: unknown offerer", "=DEALOFFERPATH(0;1;0.9;0.9;2;0;\"broker\")", "Err:502",
     BAD + " (an unknown offerer)"),
    ("offer path: no type gains", "=DEALOFFERPATH(0;1;0.9;0.9;2;2)", "#N/A",
     "private-information.md s.2.6: the cost 2 is above every value: no deal"),
]
