#!/usr/bin/env python3
"""What the shipped extension holds, read from the .oxt itself (no office needed).

  check_oxt.py SHIPPED.oxt --test-build TEST.oxt

Checks, in the shipped counteroffer.oxt:
  1. no diagnostic function: none in the Function Wizard data (CalcAddIns.xcu: category
     Add-In, a display name with PROBE, a description that says "diagnostic"), none in
     the UNO type library (counteroffer_types.rdb: every interface method has Wizard
     data), and none of the test build's diagnostic names anywhere in the package
     (type library, Wizard data, component library);
  2. #N/A explained: every function that can give "no deal" (its statuses in
     lib/functions/*.toml name no_deal, directly or as another function's) says in its
     Wizard description that it shows #N/A then, and no other function says so; the
     functions whose reference tables (tests/reference) hold a no-deal row are among
     them; no Wizard text calls anything a defect;
  3. the caution (model estimates, not advice) stands once, in the extension's
     description, and in no function's description.
The test build (counteroffer-test.oxt) must hold the diagnostic DEALCALLPROBE and
be flagged by the same rules: that shows the checks of point 1 find what they look for.

Source of the expectations: the one definition of each function (lib/functions, read by
lib/gen/catalogue.py) and the reference tables; addin/README.md states the rules.
Exit status 0 only if everything passed.
"""
import argparse
import csv
import glob
import os
import re
import sys
import xml.etree.ElementTree as ET
import zipfile

ROOT = os.path.abspath(os.path.join(os.path.dirname(__file__), "..", ".."))
sys.path.insert(0, os.path.join(ROOT, "lib", "gen"))
import catalogue  # noqa: E402  (the one reader of the definitions)

OOR = "{http://openoffice.org/2001/registry}"
NO_DEAL = "Shows #N/A when no deal is rational for both sides"
CAUTION = "not financial, legal or tax advice"
# A catalogue function without a Calc name of its own is served by an add-in function
# that is not a catalogue row (addin/src/range_args.h, addin/README.md).
CALC_FORM = {"offer_path": "DEALOFFERPATH"}


def wizard(oxt):
    """{method: (display name, description, category)} of CalcAddIns.xcu."""
    with zipfile.ZipFile(oxt) as z:
        root = ET.fromstring(z.read("CalcAddIns.xcu"))
    out = {}
    for funcs in root.iter("node"):
        if funcs.get(OOR + "name") != "AddInFunctions":
            continue
        for node in funcs.findall("node"):
            props = {p.get(OOR + "name"): "".join(p.itertext()).strip()
                     for p in node.findall("prop")}
            out[node.get(OOR + "name")] = (props["DisplayName"], props["Description"],
                                           props["Category"])
    return out


def idl_methods(oxt):
    """Interface method names in the UNO type library (get + CamelCase, as stored)."""
    with zipfile.ZipFile(oxt) as z:
        rdb = z.read("counteroffer_types.rdb")
    return set(m.decode() for m in re.findall(rb"get[A-Z][A-Za-z0-9]*", rdb))


def diagnostic(name, desc, category):
    return category != "Financial" or "PROBE" in name.upper() or "diagnostic" in desc.lower()


def statuses_name_no_deal(f, by_name, depth=0):
    if "no_deal" in f.statuses:
        return True
    m = re.match(r"as (\w+)", f.statuses)
    return bool(m) and depth < 8 and statuses_name_no_deal(by_name[m.group(1)], by_name,
                                                           depth + 1)


def no_deal_functions():
    """{Calc name} of every plain (not OUTCOME) form that can give no deal."""
    funcs = catalogue.load()
    by_name = {f.name: f for f in funcs}
    out = set()
    for f in funcs:
        calc = f.calc_name or CALC_FORM.get(f.name)
        if calc and statuses_name_no_deal(f, by_name):
            out.add(calc)
    # Independent of the definitions' wording: a function whose reference table has a
    # no-deal row can give no deal.
    tables = glob.glob(os.path.join(ROOT, "tests", "reference", "*.csv")) + \
        glob.glob(os.path.join(ROOT, "tests", "reference", "private", "*.csv"))
    for path in tables:
        name = os.path.basename(path)[:-4]
        if name not in by_name:
            continue
        with open(path, newline="") as fh:
            if any(row.get("status") == "no_deal" for row in csv.DictReader(fh)):
                calc = by_name[name].calc_name or CALC_FORM.get(name)
                if calc:
                    assert calc in out, "%s has no-deal rows but its statuses say none" % name
    return out


class Failures:
    def __init__(self):
        self.items, self.checked = [], 0

    def check(self, ok, what):
        self.checked += 1
        if not ok:
            self.items.append(what)
            print("FAIL:", what)


def check_shipped(oxt, test_oxt, fails):
    wiz = wizard(oxt)
    test_wiz = wizard(test_oxt)
    # 1. the test build holds the diagnostic function, and the rules flag it
    extra = {m: v for m, v in test_wiz.items() if m not in wiz}
    fails.check("getCallProbe" in extra and extra["getCallProbe"][0] == "DEALCALLPROBE",
                "the test build lacks DEALCALLPROBE (the check would prove nothing)")
    for m, (name, desc, cat) in extra.items():
        fails.check(diagnostic(name, desc, cat),
                    "test build: %s is not marked as diagnostic" % name)
    # ... and the shipped extension holds none
    for m, (name, desc, cat) in wiz.items():
        fails.check(not diagnostic(name, desc, cat),
                    "shipped: %s (%s) is a diagnostic function in the Function Wizard"
                    % (name, m))
    methods = idl_methods(oxt)
    fails.check(methods == set(wiz),
                "shipped: type library and Wizard data differ: %s"
                % sorted(methods.symmetric_difference(wiz)))
    fails.check("getCallProbe" in idl_methods(test_oxt),
                "the test build's type library lacks getCallProbe")
    with zipfile.ZipFile(oxt) as z:
        blobs = {n: z.read(n) for n in z.namelist()}
    for m, (name, _, _) in extra.items():
        for n, blob in blobs.items():
            fails.check(m.encode() not in blob and name.encode() not in blob,
                        "shipped: %s names the diagnostic %s" % (n, name))
    # 2. #N/A where the user meets it
    expected = no_deal_functions()
    names = {v[0]: v for v in wiz.values()}
    for calc in sorted(expected):
        fails.check(calc in names, "shipped: %s is missing" % calc)
        if calc in names:
            fails.check(NO_DEAL in names[calc][1],
                        "%s can give no deal but its description does not say #N/A" % calc)
    for calc, (_, desc, _) in names.items():
        if calc not in expected and not calc.endswith("OUTCOME"):
            fails.check(NO_DEAL not in desc, "%s says #N/A for no deal but cannot give it"
                        % calc)
        fails.check("defect" not in desc.lower(), "%s: the description speaks of a defect"
                    % calc)
    # 3. the caution once, in the extension's description only
    text = blobs["description-en.txt"].decode("utf-8")
    fails.check(text.count(CAUTION) == 1, "the extension's description states the caution "
                "%d times" % text.count(CAUTION))
    for calc, (_, desc, _) in names.items():
        fails.check(CAUTION not in desc, "%s repeats the caution" % calc)
    print("%s: %d functions, none diagnostic; %d say #N/A for no deal" % (
        os.path.basename(oxt), len(wiz), len(expected)))


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("oxt")
    ap.add_argument("--test-build", required=True)
    args = ap.parse_args()
    fails = Failures()
    check_shipped(args.oxt, args.test_build, fails)
    print("%d assertions, %d failed" % (fails.checked, len(fails.items)))
    return 1 if fails.items else 0


if __name__ == "__main__":
    sys.exit(main())
