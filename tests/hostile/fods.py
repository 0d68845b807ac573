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
import re
from xml.sax.saxutils import escape, quoteattr

NS = "ORG.COUNTEROFFER.DEALFUNCTIONS."
INPUT_COLS = "IJKLMNOPQRSTUVWXYZ"


def method_name(calc, table):
    return table[calc]


def stored(formula, methods):
    """=DEALSHARE(I2;J2:J5) as typed -> the ODF of: form with stored method names."""
    out = formula[1:]
    for calc in sorted(methods, key=len, reverse=True):
        out = re.sub(r"\b%s\(" % calc, NS + methods[calc].upper() + "(", out)
    out = re.sub(r"\bERRORTYPE\(", "ORG.OPENOFFICE.ERRORTYPE(", out)
    out = re.sub(r"\b([A-Z]{1,2}[0-9]+):([A-Z]{1,2}[0-9]+)\b", r"[.\1:.\2]", out)
    out = re.sub(r"(?<![.\w\"])([A-Z]{1,2}[0-9]+)\b(?![(:\]\"])", r"[.\1]", out)
    return "of:=" + out


def num(x):
    return repr(float(x))


def value_cell(v, methods):
    """An input cell: None empty, str text, ("=", formula) a formula, else a number."""
    if v is None:
        return "<table:table-cell/>"
    if isinstance(v, tuple) and v[0] == "=":
        return "<table:table-cell table:formula=%s/>" % quoteattr(stored(v[1], methods))
    if isinstance(v, bool):
        return ('<table:table-cell office:value-type="boolean" office:boolean-value="%s"/>'
                % ("true" if v else "false"))
    if isinstance(v, str):
        return ('<table:table-cell office:value-type="string"><text:p>%s</text:p>'
                "</table:table-cell>" % escape(v))
    return '<table:table-cell office:value-type="float" office:value="%s"/>' % num(v)


def text(s):
    return ('<table:table-cell office:value-type="string"><text:p>%s</text:p>'
            "</table:table-cell>" % escape(str(s)))


def document(title, rows, methods, n_calls):
    """rows: dicts with case, formula (None under a matrix anchor), matrix (rows, cols)
    on the anchor, expected (float or error name), code, tol, why, inputs (list)."""
    out = []
    whys = {}  # the reasons, written once each on the sheet "Why"
    head = ["Case", "Result", "Expected", "Expected code", "Tolerance", "Observed code",
            "Check", "Why"]
    out.append("<table:table-row>%s</table:table-row>" % "".join(text(h) for h in head))
    for i, row in enumerate(rows):
        r = i + 2
        cells = [text(row["case"])]
        if row.get("formula"):
            extra = ""
            if row.get("matrix"):
                extra = (' table:number-matrix-rows-spanned="%d"'
                         ' table:number-matrix-columns-spanned="%d"' % row["matrix"])
            cells.append("<table:table-cell table:formula=%s%s/>" % (
                quoteattr(stored(row["formula"], methods)), extra))
        else:
            cells.append("<table:table-cell/>")
        exp = row["expected"]
        cells.append(text(exp) if isinstance(exp, str) else value_cell(exp, methods))
        cells.append(value_cell(row["code"], methods))
        cells.append(value_cell(row.get("tol", 1e-13), methods))
        cells.append(value_cell(("=", "=IF(ISERROR(B%d);ERRORTYPE(B%d);0)" % (r, r)), methods))
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
        cells.append(value_cell(("=", chk), methods))
        cells.append(text(why))
        for v in row.get("inputs", []):
            cells.append(value_cell(v, methods))
        out.append("<table:table-row>%s</table:table-row>" % "".join(cells))
    n = len(rows) + 1
    summary = ("<table:table table:name=\"Summary\">"
               "<table:table-row>%s%s</table:table-row>"
               "<table:table-row>%s%s</table:table-row>"
               "<table:table-row>%s%s</table:table-row></table:table>" % (
                   text("All checks"),
                   "<table:table-cell table:formula=%s/>" % quoteattr(
                       "of:=AND([$Cases.G2:.G%d])" % n),
                   text("Cases"), value_cell(len(rows), methods),
                   text("DEAL... calls"), value_cell(n_calls, methods)))
    why_sheet = '<table:table table:name="Why">%s</table:table>' % "".join(
        "<table:table-row>%s%s</table:table-row>" % (text(k), text(w))
        for w, k in whys.items())
    summary += why_sheet
    return """<?xml version="1.0" encoding="UTF-8"?>
<office:document xmlns:office="urn:oasis:names:tc:opendocument:xmlns:office:1.0"
 xmlns:table="urn:oasis:names:tc:opendocument:xmlns:table:1.0"
 xmlns:text="urn:oasis:names:tc:opendocument:xmlns:text:1.0"
 xmlns:of="urn:oasis:names:tc:opendocument:xmlns:of:1.2"
 office:version="1.3" office:mimetype="application/vnd.oasis.opendocument.spreadsheet">
 <!-- %s: generated by tests/hostile/make_hostile.py. Test data only; results are
      model estimates under the stated assumptions, not financial, legal or tax advice. -->
 <office:body><office:spreadsheet>
  <table:table table:name="Cases">
%s
  </table:table>
  %s
 </office:spreadsheet></office:body>
</office:document>
""" % (escape(title), "\n".join(out), summary)
