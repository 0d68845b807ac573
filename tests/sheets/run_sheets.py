#!/usr/bin/env python3
"""The add-in's sheet tests, run headless over UNO (python3-uno).

  run_sheets.py --profile DIR --functions deal_functions.txt SHEET.fods...
      recalculates every sheet and asserts every check cell and expected error code,
      then reads the Function Wizard metadata back and checks every function and
      argument
  run_sheets.py --roundtrip --profile DIR --bare-profile DIR2 --oxt OXT SHEET.fods
      saves SHEET with the add-in, reopens it in an office without the add-in
      (formulas must survive and be saved again unchanged), installs the add-in
      into that profile and checks that the sheet computes again

The profile given with --profile must have the add-in installed
(scripts/install-addin.sh --profile DIR).  Exit status 0 only if everything passed.
"""
import argparse
import os
import shutil
import struct
import subprocess
import sys
import tempfile

from officekit.office import ODS, SERVICE, Office, prop, url

ROOT = os.path.abspath(os.path.join(os.path.dirname(__file__), "..", ".."))
# Calc's function category ids (com.sun.star.sheet.FunctionCategory).
CATEGORY = {"Financial": 3, "Add-In": 11}
NAME_ERROR = 525  # #NAME?: the function is unknown (add-in absent)


class Failures:
    def __init__(self):
        self.items = []
        self.checked = 0

    def check(self, ok, what):
        self.checked += 1
        if not ok:
            self.items.append(what)
            print("FAIL:", what)


def rows_of(sheet):
    cursor = sheet.createCursor()
    cursor.gotoEndOfUsedArea(False)
    return cursor.RangeAddress.EndRow + 1


def results(cases, n):
    """Every result cell (column B) as (error code, the value's bits, its text)."""
    out = []
    for r in range(1, n):
        c = cases.getCellByPosition(1, r)
        out.append((c.getError(), struct.pack("<d", c.getValue()), c.getString()))
    return out


def check_sheet(office, path, fails, expect_name_errors=False):
    """Every case row: the check cell is TRUE and an expected error has its code."""
    doc = office.load(path)
    try:
        doc.calculateAll()
        cases = doc.Sheets.getByName("Cases")
        n = rows_of(cases)
        count = 0
        for r in range(1, n):
            case = cases.getCellByPosition(0, r).getString()
            if not case:
                continue
            count += 1
            res = cases.getCellByPosition(1, r)
            exp = cases.getCellByPosition(2, r)
            chk = cases.getCellByPosition(3, r)
            code = cases.getCellByPosition(6, r)
            where = "%s row %d (%s): %s" % (os.path.basename(path), r + 1, case,
                                             cases.getCellByPosition(4, r).getString())
            if expect_name_errors:
                # without the add-in the cells must still hold the stored names
                f = res.getFormula()
                if f:
                    fails.check(SERVICE in f.upper(), where + ": formula lost: " + f)
                continue
            got = ("error %d" % res.getError()) if res.getError() else repr(res.getValue())
            if exp.getType().value == "TEXT":
                fails.check(res.getError() == int(code.getValue()),
                            "%s: expected %s (code %d), got %s" % (
                                where, exp.getString(), int(code.getValue()), got))
            fails.check(chk.getError() == 0 and chk.getValue() == 1.0,
                        "%s: check cell not TRUE (expected %s, got %s)" % (
                            where, exp.getString(), got))
        if not expect_name_errors:
            # Never volatile, never random: a second hard recalculation gives the same bits.
            first = results(cases, n)
            doc.calculateAll()
            fails.check(results(cases, n) == first,
                        os.path.basename(path) + ": a second recalculation changed a result")
            summary = doc.Sheets.getByName("Summary")
            fails.check(summary.getCellByPosition(1, 0).getValue() == 1.0
                        and summary.getCellByPosition(1, 0).getError() == 0,
                        os.path.basename(path) + ": Summary.B1 is not TRUE")
            fails.check(count == int(summary.getCellByPosition(1, 1).getValue()),
                        os.path.basename(path) + ": %d case rows, Summary says %d" % (
                            count, int(summary.getCellByPosition(1, 1).getValue())))
        print("%s: %d cases" % (os.path.basename(path), count))
        return count
    finally:
        doc.close(True)


def check_metadata(office, functions_txt, fails):
    """Function Wizard data for every function and argument, read over UNO."""
    fd = office.smgr.createInstanceWithContext(
        "com.sun.star.sheet.FunctionDescriptions", office.ctx)
    by_name = {}
    for i in range(fd.getCount()):
        d = {p.Name: p.Value for p in fd.getByIndex(i)}
        by_name[d["Name"]] = d
    n_args = 0
    with open(functions_txt, encoding="utf-8") as f:
        lines = [ln.rstrip("\n").split("\t") for ln in f if ln.strip()]
    for calc, method, category, *params in lines:
        d = by_name.get(calc)
        fails.check(d is not None, "Function Wizard: %s (%s) is missing" % (calc, method))
        if d is None:
            continue
        fails.check(d["Category"] == CATEGORY[category],
                    "%s: category %s, expected %s" % (calc, d["Category"], category))
        desc = d["Description"]
        fails.check(len(desc) > 20, "%s: no description" % calc)
        # The caution stands once, in the extension's description (addin/pkg/
        # description-en.txt, checked in the .oxt), not in every function.
        fails.check("not financial, legal or tax advice" not in desc,
                    "%s: the advice notice is repeated in the function" % calc)
        if category == "Financial":
            fails.check("Source:" in desc, "%s: description names no source" % calc)
        args = d["Arguments"]
        fails.check(len(args) == len(params),
                    "%s: %d arguments, expected %d" % (calc, len(args), len(params)))
        for a, param in zip(args, params):
            n_args += 1
            p, label = param.split("=", 1)
            optional = p.endswith("?")
            fails.check(a.Name == label, "%s: argument %s shows as %r, catalogue label %r" % (
                calc, p, a.Name, label))
            fails.check(len(a.Description) > 10,
                        "%s: argument %s has no description" % (calc, p))
            fails.check(bool(a.IsOptional) == optional,
                        "%s: argument %s optional=%s, expected %s" % (
                            calc, p, a.IsOptional, optional))
            fails.check(a.Description.endswith("Optional." if optional else "Required."),
                        "%s: argument %s description does not say %s" % (
                            calc, p, "optional" if optional else "required"))
    print("Function Wizard: %d functions, %d arguments checked" % (len(lines), n_args))


def roundtrip(args, fails):
    tmp = tempfile.mkdtemp(prefix="cto_roundtrip_")
    saved = os.path.join(tmp, "with_addin.ods")
    resaved = os.path.join(tmp, "without_addin.ods")
    sheet = args.sheets[0]
    # 1. computed and saved with the add-in
    with Office(args.profile) as office:
        doc = office.load(sheet)
        doc.calculateAll()
        doc.storeToURL(url(saved), (prop("FilterName", ODS),))
        doc.close(True)
    # 2. reopened and saved again in an office without the add-in
    if os.path.exists(args.bare_profile):
        shutil.rmtree(args.bare_profile)
    with Office(args.bare_profile) as office:
        doc = office.load(saved)
        doc.calculateAll()
        cases = doc.Sheets.getByName("Cases")
        res = cases.getCellByPosition(1, 1)
        fails.check(res.getError() == NAME_ERROR,
                    "without the add-in B2 should be #NAME?, got error %d value %r" % (
                        res.getError(), res.getValue()))
        doc.storeToURL(url(resaved), (prop("FilterName", ODS),))
        doc.close(True)
    with Office(args.bare_profile) as office:
        check_sheet(office, resaved, fails, expect_name_errors=True)
    # 3. add-in installed again: the file saved without it computes
    subprocess.run([os.path.join(ROOT, "scripts", "install-addin.sh"), "--profile",
                    args.bare_profile, args.oxt], check=True)
    with Office(args.bare_profile) as office:
        check_sheet(office, resaved, fails)
    shutil.rmtree(tmp, ignore_errors=True)
    print("round trip: formulas kept without the add-in and computed after reinstalling")


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--profile", required=True)
    ap.add_argument("--functions")
    ap.add_argument("--roundtrip", action="store_true")
    ap.add_argument("--bare-profile")
    ap.add_argument("--oxt")
    ap.add_argument("sheets", nargs="+")
    args = ap.parse_args()
    fails = Failures()
    if args.roundtrip:
        roundtrip(args, fails)
    else:
        with Office(args.profile) as office:
            print("office started in %.2f s" % office.start_seconds)
            for s in args.sheets:
                check_sheet(office, s, fails)
            if args.functions:
                check_metadata(office, args.functions, fails)
    print("%d assertions, %d failed" % (fails.checked, len(fails.items)))
    return 1 if fails.items else 0


if __name__ == "__main__":
    sys.exit(main())
