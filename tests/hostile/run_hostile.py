#!/usr/bin/env python3
"""Recalculates the hostile-argument sheet (make_hostile.py) headless with the add-in installed and
asserts every case: a number within its tolerance, or exactly its expected Calc error
code; then that LibreOffice exits cleanly (exit status 0, no crash dump, no crash in
its log, no process of it left).  A watchdog kills the office after --deadline
seconds: a hang is a failure.

  run_hostile.py --profile DIR [--deadline S] SHEET.fods

The profile must have the add-in installed (scripts/install-addin.sh --profile DIR).
Run with the project venv (Debian's Python with python3-uno).  Exit status 0 only if
every case passed and the office ended cleanly.
"""
import argparse
import math
import sys
import time

from officekit.office import Office

# Column numbers of the sheet "Cases" (tests/hostile/fods.py).
CASE, RESULT, EXPECTED, CODE, TOL, OBSERVED, CHECK, WHY = range(8)


def read_cases(doc):
    """The rows of the sheet "Cases" (columns CASE..WHY), with the reasons spelt out."""
    cases = doc.Sheets.getByName("Cases")
    cursor = cases.createCursor()
    cursor.gotoEndOfUsedArea(False)
    data = cases.getCellRangeByPosition(0, 1, WHY, cursor.RangeAddress.EndRow).getDataArray()
    why_sheet = doc.Sheets.getByName("Why")
    cursor = why_sheet.createCursor()
    cursor.gotoEndOfUsedArea(False)
    whys = dict(why_sheet.getCellRangeByPosition(
        0, 0, 1, cursor.RangeAddress.EndRow).getDataArray())
    rows = []
    for row in data:
        row = list(row)
        if row[CASE]:
            row[WHY] = whys.get(row[WHY], row[WHY])
        rows.append(row)
    return cases, rows


def check_row(row, where, failures):
    """Appends what is wrong with one case row (value, tolerance or error code)."""
    code = int(row[CODE])
    observed = int(row[OBSERVED]) if isinstance(row[OBSERVED], float) else None
    got = row[RESULT]
    if observed is None:
        failures.append("%s: the observed-code cell is not a number" % where)
    elif code == 0:
        ok = (observed == 0 and isinstance(got, float) and math.isfinite(got)
              and abs(got - row[EXPECTED]) <= max(row[TOL] * abs(row[EXPECTED]), 1e-300))
        if not ok:
            failures.append("%s: expected %r, got %s (%s)" % (
                where, row[EXPECTED], ("error %d" % observed) if observed else repr(got),
                row[WHY]))
    elif code == -1:
        if observed == 0:
            failures.append("%s: expected an error value, got the number %r (%s)" % (
                where, got, row[WHY]))
    elif observed != code:
        failures.append("%s: expected %s (code %d), got %s (%s)" % (
            where, row[EXPECTED], code,
            ("error %d" % observed) if observed else "the number %r" % got, row[WHY]))


def check_cases(doc, failures):
    """Every case row, the known open issues, a sample read cell by cell, the summary;
    returns (cases, DEAL... calls)."""
    cases, data = read_cases(doc)
    known, n_cases = {}, 0
    for i, row in enumerate(data):
        if not row[CASE]:
            continue
        n_cases += 1
        n_before = len(failures)
        where = "row %d %s" % (i + 2, row[CASE])
        check_row(row, where, failures)
        failed = len(failures) > n_before
        if row[WHY].startswith("KNOWN "):
            # an open library issue: strict expected failure
            del failures[n_before:]
            if failed:
                key = row[WHY].split(":")[0]
                known[key] = known.get(key, 0) + 1
            else:
                failures.append("%s passes now: remove its entry from KNOWN in "
                                "make_hostile.py (%s)" % (where, row[WHY]))
        if bool(row[CHECK]) != (len(failures) == n_before):
            failures.append("%s: the sheet's own check cell disagrees" % where)
    # every tenth result cell read directly, against the ERRORTYPE column
    for i in range(0, len(data), 10):
        cell = cases.getCellByPosition(RESULT, i + 1)
        if int(data[i][OBSERVED]) != cell.getError():
            failures.append("row %d: getError() %d, ERRORTYPE column %d" % (
                i + 2, cell.getError(), int(data[i][OBSERVED])))
    summary = doc.Sheets.getByName("Summary")
    if int(summary.getCellByPosition(1, 1).getValue()) != n_cases:
        failures.append("Summary says %d cases, the sheet has %d" % (
            int(summary.getCellByPosition(1, 1).getValue()), n_cases))
    all_ok = summary.getCellByPosition(1, 0)
    if (all_ok.getError() != 0 or all_ok.getValue() != 1.0) and not failures:
        failures.append("Summary.B1 (AND of the check cells) is not TRUE")
    for key, n in sorted(known.items()):
        print("known open library issue, %d cases: %s" % (n, key))
    return n_cases, int(summary.getCellByPosition(1, 2).getValue())


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--profile", required=True)
    ap.add_argument("--deadline", type=float, default=300.0)
    ap.add_argument("--max-report", type=int, default=40)
    ap.add_argument("sheet")
    args = ap.parse_args()
    failures = []
    t0 = time.monotonic()
    office = Office(args.profile, start_timeout=60.0, deadline=args.deadline)
    print("office started in %.2f s" % office.start_seconds)
    n_cases = 0
    try:
        doc = office.load(args.sheet)
        t1 = time.monotonic()
        doc.calculateAll()
        t2 = time.monotonic()
        n_cases, n_calls = check_cases(doc, failures)
        print("loaded in %.1f s, recalculated in %.1f s: %d cases, %d DEAL... calls" % (
            t1 - t0 - office.start_seconds, t2 - t1, n_cases, n_calls))
        doc.close(True)
    except Exception as e:  # a dead office (crash, watchdog) ends the UNO call here
        failures.append("the office failed during the run: %s: %s" % (type(e).__name__, e))
    problems = office.close()
    for p in problems:
        failures.append("LibreOffice did not exit cleanly: " + p)
    for f in failures[:args.max_report]:
        print("FAIL:", f)
    if len(failures) > args.max_report:
        print("... and %d more failures" % (len(failures) - args.max_report))
    print("%d cases checked, %d failures; office exit clean: %s; %.1f s in all" % (
        n_cases, len(failures), "yes" if not problems else "no", time.monotonic() - t0))
    return 1 if failures or n_cases < 10000 else 0


if __name__ == "__main__":
    sys.exit(main())
