"""Writes the hostile-argument sheet as flat ODF (.fods): one case per row.

Layout of the sheet "Cases" (row 1 is the header):
  A Case | B Result (the DEAL... formula, or a cell covered by a matrix formula above)
  | C Expected (number, or the error's name) | D Expected code (0: a number is expected;
  a Calc error code; -1: any error value, no number) | E Tolerance (relative, with an
  absolute floor of 1e-300) | F Observed code =IF(ISERROR(B);ERRORTYPE(B);0)
  | G Check (TRUE when B is as expected) | H Why: the key (W1, W2, ...) of the rule or
  source of the expectation, spelt out on the sheet "Why" (A key, B text); a case
  under an open library issue reads "KNOWN lib issue ..." there and its check is TRUE
  while the case still fails | I.. inputs the formula refers to
The sheet "Summary": B1 = AND of every check, B2 = the number of cases, B3 = the number
of DEAL... calls (a matrix formula counts once per element it computes).
"""
from officekit.flat_odf import document as odf_document
from officekit.flat_odf import formula_cell, of_cell, text_cell as text, value_cell
from officekit.flat_odf import row as odf_row

INPUT_COLS = "IJKLMNOPQRSTUVWXYZ"


def document(title, rows, n_calls):
    """rows: dicts with case, formula (None under a matrix anchor), matrix (rows, cols)
    on the anchor, expected (float or error name), code, tol, why, inputs (list)."""
    out = []
    whys = {}  # the reasons, written once each on the sheet "Why"
    head = ["Case", "Result", "Expected", "Expected code", "Tolerance", "Observed code",
            "Check", "Why"]
    out.append(odf_row(text(h) for h in head))
    for i, row in enumerate(rows):
        r = i + 2
        cells = [text(row["case"])]
        if row.get("formula"):
            cells.append(formula_cell(row["formula"], row.get("matrix")))
        else:
            cells.append("<table:table-cell/>")
        exp = row["expected"]
        cells.append(text(exp) if isinstance(exp, str) else value_cell(exp))
        cells.append(value_cell(row["code"]))
        cells.append(value_cell(row.get("tol", 1e-13)))
        cells.append(value_cell(("=", "=IF(ISERROR(B%d);ERRORTYPE(B%d);0)" % (r, r))))
        if row["code"] == 0:
            chk = ("=IF(ISERROR(B%d);FALSE();ABS(B%d-C%d)<=MAX(E%d*ABS(C%d);1E-300))"
                   % (r, r, r, r, r))
        elif row["code"] == -1:
            chk = "=ISERROR(B%d)" % r
        else:
            chk = "=F%d=D%d" % (r, r)
        why = row["why"]
        if row.get("known"):
            # an open library issue: the check is TRUE while the case still fails
            chk = "=NOT(%s)" % chk[1:]
            why = "KNOWN %s; %s" % (row["known"], why)
        if why not in whys:
            whys[why] = "W%d" % (len(whys) + 1)
        why = whys[why]
        cells.append(value_cell(("=", chk)))
        cells.append(text(why))
        for v in row.get("inputs", []):
            cells.append(value_cell(v))
        out.append(odf_row(cells))
    n = len(rows) + 1
    summary = '<table:table table:name="Summary">%s%s%s</table:table>' % (
        odf_row([text("All checks"), of_cell("of:=AND([$Cases.G2:.G%d])" % n)]),
        odf_row([text("Cases"), value_cell(len(rows))]),
        odf_row([text("DEAL... calls"), value_cell(n_calls)]))
    why_sheet = '<table:table table:name="Why">%s</table:table>' % "".join(
        odf_row([text(k), text(w)]) for w, k in whys.items())
    return odf_document(title, "tests/hostile/make_hostile.py", out, summary + why_sheet)
