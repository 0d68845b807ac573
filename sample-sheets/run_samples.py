#!/usr/bin/env python3
"""Recalculates every sample sheet headless and writes its report and shareable copies.

  run_samples.py --profile DIR --out DIR SHEET.fods...

DIR (profile) is a private LibreOffice profile with the counteroffer add-in installed.
For each sheet: load, recalculate everything, refuse any error cell (the add-in's
error values are listed in addin/README.md) and a failed input check, hide the empty
rows of its tables (named ranges report_rows*) for the report, write OUT/<name>.pdf
(every page, charts included) and OUT/<name>.csv (the sheet's cells, UTF-8, comma
separated, full precision), then the frozen copies OUT/<name>-values.xlsx and .ods for
colleagues without the add-in (share.py); check that every file exists and is not
empty, and print one progress line.  The blank template (named cell blank_template,
inputs empty) gets its PDF and is copied to OUT as it is.  Ends with a summary table of
the key results (named cells key_*).  Exit status 0 only when every sheet passed;
otherwise the failures are named on stderr.
"""
import argparse
import os
import shutil
import sys
import time

import share

from officekit.office import CSV, PDF, SERVICE, Office, prop, url

# Calc's CSV filter: comma, double quote, UTF-8 (76), from line 1, full precision
# (not "as shown"), formulas as results (LibreOffice's CSV filter option string, tokens
# 9 and 10; from memory).
CSV_OPTIONS = "44,34,76,1,,0,false,true,false,false,false"
ERROR_RESULT = 4  # com.sun.star.sheet.FormulaResult.ERROR
OK_TEXT = "every input filled"  # the sheets' input check (layout.py)


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
                if f.startswith(("=", "{=")):  # a cell of a matrix formula reads {=...}
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


def trim_report_rows(doc):
    """The report shows tables as long as their data: in each named range report_rows*
    the rows whose cells (after the first column) are all empty are hidden, and the
    charts drawing from them stop at the last row with data.  Only the exported report
    changes; the file is not saved.  Returns the number of rows hidden."""
    hidden = 0
    names = doc.NamedRanges
    for nm in names.ElementNames:
        if not nm.startswith("report_rows"):
            continue
        rng = names.getByName(nm).ReferredCells
        addr = rng.RangeAddress
        sheet = doc.Sheets.getByIndex(addr.Sheet)
        data = rng.getDataArray()
        empty = [all(v == "" for v in row[1:]) for row in data]
        last = addr.StartRow - 1
        for i, is_empty in enumerate(empty):
            if is_empty:
                sheet.Rows.getByIndex(addr.StartRow + i).IsVisible = False
                hidden += 1
            else:
                last = addr.StartRow + i
        for chart in sheet.Charts:
            ranges = list(chart.getRanges())
            for r in ranges:
                if r.StartRow <= addr.EndRow and r.EndRow >= addr.StartRow:
                    r.EndRow = min(r.EndRow, max(last, r.StartRow))
            chart.setRanges(tuple(ranges))
    return hidden


def check_text(doc):
    if not doc.NamedRanges.hasByName("check_inputs"):
        return None
    return doc.NamedRanges.getByName("check_inputs").ReferredCells \
        .getCellByPosition(0, 0).getString()


def export(doc, base, out_dir, blank, when, problems):
    """The report (PDF, CSV) and, for a filled sheet, the frozen copies."""
    pdf = os.path.join(out_dir, base + ".pdf")
    csv = os.path.join(out_dir, base + ".csv")
    doc.storeToURL(url(pdf), (prop("FilterName", PDF),))
    doc.storeToURL(url(csv), (prop("FilterName", CSV), prop("FilterOptions", CSV_OPTIONS)))
    files = [pdf, csv]
    if not blank:
        share.freeze(doc, base + ".fods", when)
        files += share.write_copies(doc, out_dir, base)
    for f in files:
        if not os.path.isfile(f):
            problems.append("%s: %s was not written" % (base, f))
        elif os.path.getsize(f) == 0:
            problems.append("%s: %s is empty" % (base, f))
    return files


def pdf_pages(pdf, base, problems):
    if not os.path.isfile(pdf):
        return 0
    with open(pdf, "rb") as fh:
        data = fh.read()
    if not data.startswith(b"%PDF"):
        problems.append("%s: %s is not a PDF" % (base, pdf))
    pages = data.count(b"/Type/Page") - data.count(b"/Type/Pages")
    if pages < 1:
        problems.append("%s: %s has no page" % (base, pdf))
    return pages


def process(office, path, out_dir, when=None):
    """Returns (row for the summary, [problems])."""
    base = os.path.splitext(os.path.basename(path))[0]
    when = when or time.strftime("%Y-%m-%d %H:%M UTC", time.gmtime())
    for ext in (".pdf", ".csv", "-values.xlsx", "-values.ods"):
        if os.path.exists(os.path.join(out_dir, base + ext)):
            os.remove(os.path.join(out_dir, base + ext))
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
        conclusion = ""
        if doc.NamedRanges.hasByName("conclusion"):
            conclusion = doc.NamedRanges.getByName("conclusion").ReferredCells \
                .getCellByPosition(0, 0).getString()
        check = check_text(doc)
        blank = doc.NamedRanges.hasByName("blank_template") and check != OK_TEXT
        if check is None:
            problems.append("%s: no input check (named cell check_inputs)" % base)
        elif check != OK_TEXT and not blank:
            problems.append("%s: input check says: %s" % (base, check))
        nchart = charts(doc)
        hidden = trim_report_rows(doc)
        files = export(doc, base, out_dir, blank, when, problems) if not errs else []
    finally:
        doc.close(True)
    if blank:
        shutil.copyfile(path, os.path.join(out_dir, base + ".fods"))
    pages = pdf_pages(os.path.join(out_dir, base + ".pdf"), base, problems)
    csv = os.path.join(out_dir, base + ".csv")
    csv_rows = 0
    if os.path.isfile(csv):
        with open(csv, encoding="utf-8") as fh:
            csv_rows = sum(1 for _ in fh)
    row = {"sheet": base, "formulas": nform, "addin": naddin, "errors": len(errs),
           "charts": nchart, "pages": pages, "csv_rows": csv_rows, "hidden": hidden,
           "copies": sum(1 for f in files if "-values." in f), "blank": blank,
           "seconds": time.monotonic() - t0, "keys": keys, "conclusion": conclusion}
    return row, problems


def summary(rows):
    head = "%-22s %8s %7s %6s %6s %5s %8s  %s" % ("sheet", "formulas", "add-in", "errors",
                                                 "charts", "pages", "csv rows",
                                                 "key results")
    print(head)
    print("-" * len(head))
    for r in rows:
        keys = "; ".join("%s = %s" % kv for kv in r["keys"].items())
        if r["blank"]:
            keys = "(blank template: no results until it is filled in)"
        print("%-22s %8d %7d %6d %6d %5d %8d  %s" % (
            r["sheet"], r["formulas"], r["addin"], r["errors"], r["charts"], r["pages"],
            r["csv_rows"], keys))
    print("(money amounts in EUR m, the sheets' unit; key results are the named cells key_*)")
    print("\nConclusions (model estimates, not financial, legal or tax advice):")
    for r in rows:
        if r["conclusion"] and not r["blank"]:
            print("  %s: %s" % (r["sheet"], r["conclusion"]))


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
                      "%d charts, PDF %d pages, CSV %d rows, %s, %.1f s" % (
                          i, len(args.sheets), row["sheet"], status, row["formulas"],
                          row["addin"], row["errors"], row["charts"], row["pages"],
                          row["csv_rows"], "blank template, copied" if row["blank"] else
                          "%d frozen copies" % row["copies"], row["seconds"]), flush=True)
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
    print("\nall %d sample sheets recalculated without error cells; PDFs, CSVs and frozen "
          "copies (*-values.xlsx, *-values.ods) in %s" % (len(rows), args.out))
    return 0


if __name__ == "__main__":
    sys.exit(main())
