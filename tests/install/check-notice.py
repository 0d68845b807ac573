#!/usr/bin/env python3
"""Every distribution carries the direction numbers' source and licence note,
lib/src/range/JOE-KUO-NOTICE.txt, byte for byte.

    check-notice.py ARTEFACT...

An artefact is an install prefix (a directory: share/doc/counteroffer/), a wheel (.whl:
counteroffer/), a source distribution (.tar.gz: <name>/lib/src/range/) or the Calc
extension (.oxt: at its top).  Exits 1 naming each artefact without the notice, or with
another text.  Standard library only (run by scripts/test.d/*.sh and
tests/install/check-install.sh).
"""
import os
import sys
import tarfile
import zipfile

ROOT = os.path.dirname(os.path.dirname(os.path.dirname(os.path.abspath(__file__))))
NAME = "JOE-KUO-NOTICE.txt"
SOURCE = os.path.join(ROOT, "lib", "src", "range", NAME)


def members(path):
    """(member name, reader) of every file in the artefact."""
    if os.path.isdir(path):
        for folder, _dirs, files in os.walk(path):
            for f in files:
                full = os.path.join(folder, f)
                yield os.path.relpath(full, path), lambda full=full: open(full, "rb").read()
    elif path.endswith((".whl", ".oxt", ".zip")):
        with zipfile.ZipFile(path) as z:
            for n in z.namelist():
                yield n, lambda n=n: z.read(n)
    elif path.endswith((".tar.gz", ".tgz")):
        with tarfile.open(path) as t:
            for m in t.getmembers():
                if m.isfile():
                    yield m.name, lambda m=m: t.extractfile(m).read()
    else:
        raise SystemExit("check-notice: unknown artefact %s" % path)


def expected_place(path):
    """Where the notice must be inside the artefact (a path suffix)."""
    if os.path.isdir(path):
        return "share/doc/counteroffer/" + NAME
    if path.endswith(".whl"):
        return "counteroffer/" + NAME
    if path.endswith((".tar.gz", ".tgz")):
        return "lib/src/range/" + NAME
    return NAME


def check(path, want):
    place = expected_place(path)
    in_folder = path.endswith((".tar.gz", ".tgz"))  # an sdist has one top folder
    for name, read in members(path):
        if name == place or (in_folder and name.endswith("/" + place)):
            if read() != want:
                return "%s: %s differs from lib/src/range/%s" % (path, name, NAME)
            print("check-notice: %s has %s" % (os.path.basename(path.rstrip("/")), name))
            return None
    return "%s: no %s (expected at %s)" % (path, NAME, place)


def main(argv):
    if not argv:
        raise SystemExit(__doc__)
    with open(SOURCE, "rb") as f:
        want = f.read()
    errors = [e for e in (check(p, want) for p in argv) if e]
    for e in errors:
        print("check-notice: " + e, file=sys.stderr)
    return 1 if errors else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
