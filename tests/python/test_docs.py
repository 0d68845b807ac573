"""The project explains itself: the generated function contract is current, its C
prototypes are the header's, every Markdown link in the project's documents points to a
file inside the repository, and no tracked file sends a reader to the notes the
project was written from, which are not part of it (issue 14 point 11).

Source: the files themselves (the header, the documents), read here."""

import re
import subprocess
import sys

import pytest

from conftest import ROOT

DOCUMENTS = sorted(
    {ROOT / "README.md", ROOT / "DEVELOPERS.md", ROOT / "addin" / "README.md",
     ROOT / "sample-sheets" / "README.md", ROOT / "bindings" / "README.md"}
    | set((ROOT / "docs").rglob("*.md"))
    | set((ROOT / "tests").rglob("README.md"))
)
INLINE = re.compile(r"!?\[[^\]]*\]\(\s*<?([^)\s>]+)>?(?:\s+\"[^\"]*\")?\s*\)")
LINK_DEFINITION = re.compile(r"^\s*\[[^\]]+\]:\s*(\S+)", re.MULTILINE)
FENCE = re.compile(r"^(```|~~~).*?^\1", re.MULTILINE | re.DOTALL)
CODE = re.compile(r"`[^`\n]*`")


def links(text):
    """Link targets of a Markdown text, outside code blocks and code spans."""
    text = CODE.sub("", FENCE.sub("", text))
    return INLINE.findall(text) + LINK_DEFINITION.findall(text)


def broken(path):
    bad = []
    for target in links(path.read_text(encoding="utf-8")):
        if re.match(r"^(https?|mailto):", target) or target.startswith("#"):
            continue
        file_part = target.split("#", 1)[0]
        resolved = (path.parent / file_part).resolve()
        if ROOT.resolve() not in resolved.parents and resolved != ROOT.resolve():
            bad.append(f"{target} (outside the repository)")
        elif not resolved.exists():
            bad.append(f"{target} (no such file)")
    return bad


def test_the_link_checker_finds_what_it_should(tmp_path):
    text = ("[ok](docs/index.md) [gone](docs/none.md) `[code](x.md)` "
            "[web](https://example.org/a.md) [anchor](#top)\n```\n[fenced](y.md)\n```\n"
            "[ref]: other.md\n")
    assert links(text) == ["docs/index.md", "docs/none.md", "https://example.org/a.md",
                           "#top", "other.md"]


@pytest.mark.parametrize("path", DOCUMENTS, ids=[str(p.relative_to(ROOT)) for p in DOCUMENTS])
def test_every_link_points_to_a_file_in_the_repository(path):
    assert not broken(path), broken(path)


def test_the_documents_that_must_exist_do():
    for name in ("docs/index.md", "docs/reference/functions.md",
                 "docs/models/complete-information.md"):
        assert (ROOT / name).is_file(), name


def test_the_function_contract_is_current():
    proc = subprocess.run([sys.executable, str(ROOT / "bindings/tools/gen_contract.py"),
                           "--check"], capture_output=True, text=True, timeout=120)
    assert proc.returncode == 0, proc.stderr


def test_the_contracts_c_prototypes_are_the_headers():
    # the public header and its parts (lib/include/counteroffer/*.h)
    header = " ".join(" ".join(p.read_text().split())
                      for p in sorted((ROOT / "lib/include/counteroffer").glob("*.h")))
    header = header.replace("( ", "(").replace(" )", ")")
    doc = (ROOT / "docs/reference/functions.md").read_text(encoding="utf-8")
    prototypes = re.findall(r"`int (cto_\w+\([^`]*\))`", doc)
    assert len(prototypes) >= 15
    for p in prototypes:
        assert f"CTO_API int {p};" in header, p


# The notes the project was designed from (the catalogue, the two model references and
# the style notes) lie beside the repository and are not shipped with it: the project's
# own docs/ replace them.  No file may name them, by file name, with a section number
# ("s.12", "C.8.1"), as the notes or reference of the design, or by their folder.  The
# names are spelled in pieces here so that this file does not match itself.
_CAT, _REF, _STY = "CATA" + "LOGUE", "REFER" + "ENCE", "STY" + "LE"
_DES, _DIR = "des" + "ign", "/work/" + "shared"
OUTSIDE = re.compile(
    r"(?<![\w-])(?:%s|%s)(?!\w)|(?<![\w-])%s\.md\b|\b%s (?:notes|reference)\b|%s"
    % (_CAT, _REF, _STY, _DES, _DIR))


def tracked_files():
    """Every file of the repository: git's list, or the tree without build outputs."""
    try:
        out = subprocess.run(["git", "ls-files", "-z"], cwd=ROOT, capture_output=True,
                             check=True, timeout=60).stdout.decode()
        return [ROOT / name for name in out.split("\0") if name]
    except (OSError, subprocess.SubprocessError):
        skip = {".git", "build", ".venv", "out", "__pycache__"}
        return [p for p in ROOT.rglob("*")
                if p.is_file() and not skip.intersection(p.relative_to(ROOT).parts)]


def outside_mentions(text):
    return [m.group(0) for m in OUTSIDE.finditer(text)]


def test_the_outside_name_checker_finds_what_it_should():
    found = outside_mentions(
        "see %s.md, %s s.12, %s-PRIVATE C.8.1, the %s contract, %s.md s.6, the %s "
        "notes, the %s reference's tables; %s/x.md" % (
            _CAT, _REF, _REF, _CAT, _STY, _DES, _DES, _DIR))
    assert len(found) == 8, found
    # identifiers of the project's own code are not mentions
    assert outside_mentions("CTO_%s_DIR, NON_%s, CTO_%s_ROWS, a reference table, "
                            "docs/reference/functions.md" % (_REF, _CAT, _CAT)) == []


def test_no_tracked_file_names_the_design_notes():
    files = tracked_files()
    assert len(files) > 200
    bad = {}
    for path in files:
        if not path.is_file():
            continue
        found = outside_mentions(path.read_bytes().decode("utf-8", errors="ignore"))
        if found:
            bad[str(path.relative_to(ROOT))] = sorted(set(found))
    assert not bad, bad


def test_value_error_is_not_called_a_library_defect():
    # Issue 14 point 12: Calc itself shows #VALUE! for an argument it cannot pass to the
    # add-in, so no document may present #VALUE! as a defect of the library, and the
    # three places that map statuses to Calc's errors say so.
    for path in DOCUMENTS:
        for line in path.read_text(encoding="utf-8").splitlines():
            if "#VALUE!" in line:
                assert "defect" not in line.lower(), (path, line)
    for name in ("README.md", "addin/README.md", "docs/reference/functions.md"):
        text = " ".join((ROOT / name).read_text(encoding="utf-8").split())
        assert re.search(r"#VALUE![^|]*(range (that )?hold(s|ing) an error cell)", text), name
