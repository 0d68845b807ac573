#!/usr/bin/env python3
"""Recalculates every sample sheet headless and writes a PDF and a CSV of each.

  run_samples.py --profile DIR --out DIR SHEET.fods...

DIR (profile) is a private LibreOffice profile with the counteroffer add-in installed.
For each sheet: load, recalculate everything, refuse any error cell (the add-in's
error values are listed in addin/README.md), write OUT/<name>.pdf (every page, charts
included) and OUT/<name>.csv (the sheet's cells, UTF-8, comma separated, full
precision), check that both exist and are not empty, and print one progress line.
Ends with a summary table of the key results (named cells key_*).  Exit status 0
only when every sheet passed; otherwise the failures are named on stderr.
"""
import argparse
import os
import sys
import time

from officekit.office import CSV, PDF, SERVICE, Office, prop, url

# Calc's CSV filter: comma, double quote, UTF-8 (76), from line 1, full precision
# (not "as shown"), formulas as results (STYLE.md s.6).
CSV_OPTIONS = "44,34,76,1,,0,false,true,false,false,false"
ERROR_RESULT = 4
OK_TEXT = "every input filled"  # the sheets' input check (build_samples.py)  # com.sun.star.sheet.FormulaResult.ERROR


def used_range(sheet):
    cur = sheet.createCursor()
    cur.gotoEndOfUsedArea(False)
    return cur.RangeAddress.EndColumn + 1, cur.RangeAddress.EndRow + 1


def col_name(i):
    s = ""
    i += 1
    while i:
        i, rem = divmod(i - 1, 26)
        s = chr(65 + rem) + s
    return s


def error_cells(doc):
    """[(sheet, cell, error code, formula)] for every formula cell showing an error."""
    found = []
    for sheet in doc.Sheets:
        ranges = sheet.queryFormulaCells(ERROR_RESULT)
        for addr in ranges.RangeAddresses:
            for r in range(addr.StartRow, addr.EndRow + 1):
                for c in range(addr.StartColumn, addr.EndColumn + 1):
                    cell = sheet.getCellByPosition(c, r)
                    found.append((sheet.Name, "%s%d" % (col_name(c), r + 1),
                                  cell.getError(), cell.getFormula()))
    return found


def count_cells(doc):
    formulas = addin = 0
    for sheet in doc.Sheets:
        ncol, nrow = used_range(sheet)
        for r in range(nrow):
            for c in range(ncol):
                f = sheet.getCellByPosition(c, r).getFormula()
                if f.startswith("="):
                    formulas += 1
                    addin += SERVICE in f.upper()
    return formulas, addin


def key_results(doc):
    """{name: display text} of the named cells key_*, in name order."""
    out = {}
    names = doc.NamedRanges
    for nm in sorted(names.ElementNames):
        if nm.startswith("key_"):
            cell = names.getByName(nm).ReferredCells.getCellByPosition(0, 0)
            out[nm[4:]] = cell.getString()
    return out


def charts(doc):
    return sum(sheet.Charts.getCount() for sheet in doc.Sheets)


def process(office, path, out_dir):
    """Returns (row for the summary, [problems])."""
    base = os.path.splitext(os.path.basename(path))[0]
    pdf = os.path.join(out_dir, base + ".pdf")
    csv = os.path.join(out_dir, base + ".csv")
    for f in (pdf, csv):
        if os.path.exists(f):
            os.remove(f)
    problems = []
    t0 = time.monotonic()
    doc = office.load(path)
    try:
        doc.calculateAll()
        errs = error_cells(doc)
        for sheet, cell, code, formula in errs:
            problems.append("%s: %s!%s shows error %d (%s)" % (base, sheet, cell, code,
                                                              formula))
        nform, naddin = count_cells(doc)
        if naddin == 0:
            problems.append("%s: no cell calls the counteroffer add-in" % base)
        keys = key_results(doc)
        if doc.NamedRanges.hasByName("check_inputs"):
            check = doc.NamedRanges.getByName("check_inputs").ReferredCells \
                .getCellByPosition(0, 0).getString()
            if check != OK_TEXT:
                problems.append("%s: input check says: %s" % (base, check))
        else:
            problems.append("%s: no input check (named cell check_inputs)" % base)
        nchart = charts(doc)
        doc.storeToURL(url(pdf), (prop("FilterName", PDF),))
        doc.storeToURL(url(csv), (prop("FilterName", CSV),
                                  prop("FilterOptions", CSV_OPTIONS)))
    finally:
        doc.close(True)
    for f in (pdf, csv):
        if not os.path.isfile(f):
            problems.append("%s: %s was not written" % (base, f))
        elif os.path.getsize(f) == 0:
            problems.append("%s: %s is empty" % (base, f))
    pages = 0
    if os.path.isfile(pdf):
        with open(pdf, "rb") as fh:
            data = fh.read()
        if not data.startswith(b"%PDF"):
            problems.append("%s: %s is not a PDF" % (base, pdf))
        pages = data.count(b"/Type/Page") - data.count(b"/Type/Pages")
        if pages < 1:
            problems.append("%s: %s has no page" % (base, pdf))
    csv_rows = 0
    if os.path.isfile(csv):
        with open(csv, encoding="utf-8") as fh:
            csv_rows = sum(1 for _ in fh)
    row = {"sheet": base, "formulas": nform, "addin": naddin, "errors": len(errs),
           "charts": nchart, "pages": pages, "csv_rows": csv_rows,
           "seconds": time.monotonic() - t0, "keys": keys}
    return row, problems


def summary(rows):
    head = "%-22s %8s %7s %6s %6s %5s %8s  %s" % ("sheet", "formulas", "add-in", "errors",
                                                 "charts", "pages", "csv rows",
                                                 "key results")
    print(head)
    print("-" * len(head))
    for r in rows:
        keys = "; ".join("%s = %s" % kv for kv in r["keys"].items())
        print("%-22s %8d %7d %6d %6d %5d %8d  %s" % (
            r["sheet"], r["formulas"], r["addin"], r["errors"], r["charts"], r["pages"],
            r["csv_rows"], keys))
    print("(money amounts in EUR m, the sheets' unit; key results are the named cells key_*)")


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--profile", required=True)
    ap.add_argument("--out", required=True)
    ap.add_argument("sheets", nargs="+")
    args = ap.parse_args()
    os.makedirs(args.out, exist_ok=True)
    rows, problems = [], []
    with Office(args.profile) as office:
        if not office.has_addin():
            print("error: the counteroffer add-in does not answer in profile %s "
                  "(install it with scripts/install-addin.sh --profile)" % args.profile,
                  file=sys.stderr)
            return 1
        for i, path in enumerate(args.sheets, 1):
            try:
                row, probs = process(office, path, args.out)
            except Exception as e:  # a failed load or export is a failure of this sheet
                base = os.path.basename(path)
                probs = ["%s: %s" % (base, e)]
                row = None
            status = "ok" if not probs else "FAILED"
            if row:
                rows.append(row)
                print("[%d/%d] %-22s %s: %d formulas (%d add-in calls), %d error cells, "
                      "%d charts, PDF %d pages, CSV %d rows, %.1f s" % (
                          i, len(args.sheets), row["sheet"], status, row["formulas"],
                          row["addin"], row["errors"], row["charts"], row["pages"],
                          row["csv_rows"], row["seconds"]), flush=True)
            else:
                print("[%d/%d] %-22s FAILED" % (i, len(args.sheets),
                                                os.path.basename(path)), flush=True)
            problems += probs
    print()
    summary(rows)
    if problems:
        print("\nerror: %d problem(s) in the sample sheets:" % len(problems), file=sys.stderr)
        for p in problems:
            print("  " + p, file=sys.stderr)
        return 1
    print("\nall %d sample sheets recalculated without error cells; PDFs and CSVs in %s"
          % (len(rows), args.out))
    return 0


if __name__ == "__main__":
    sys.exit(main())
