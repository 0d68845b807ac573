#!/usr/bin/env python3
"""What the shipped extension holds, read from the .oxt itself (no office needed).

  check_oxt.py SHIPPED.oxt --test-build TEST.oxt

Checks, in the shipped counteroffer.oxt:
  1. no diagnostic function: none in the Function Wizard data (CalcAddIns.xcu: category
     Add-In, a display name with PROBE, a description that says "diagnostic"), none in
     the UNO type library (counteroffer_types.rdb: every interface method has Wizard
     data), and none of the test build's diagnostic names anywhere in the package
     (type library, Wizard data, component library);
  2. the caution (model estimates, not advice) stands once, in the extension's
     description, and in no function's description.
The test build (counteroffer-test.oxt) must hold the diagnostic DEALCALLPROBE and
be flagged by the same rules: that shows the checks of point 1 find what they look for.

Source of the expectations: addin/README.md states the rules.
Exit status 0 only if everything passed.
"""
import argparse
import os
import re
import sys
import xml.etree.ElementTree as ET
import zipfile

OOR = "{http://openoffice.org/2001/registry}"
CAUTION = "not financial, legal or tax advice"


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
    # 2. the caution once, in the extension's description only
    text = blobs["description-en.txt"].decode("utf-8")
    fails.check(text.count(CAUTION) == 1, "the extension's description states the caution "
                "%d times" % text.count(CAUTION))
    for _, desc, _ in wiz.values():
        fails.check(CAUTION not in desc, "a function repeats the caution: " + desc[:40])
    print("%s: %d functions, none diagnostic" % (os.path.basename(oxt), len(wiz)))


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
