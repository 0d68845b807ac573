"""Writes the function tables of README.md and addin/README.md from the definitions.

    python3 lib/gen/gen_docs.py           rewrite the tables in place
    python3 lib/gen/gen_docs.py --check   exit 1 (naming the file) when a table is stale

Each table stands between the markers <!-- generated:NAME --> and <!-- end:NAME --> in
its file; the text around the markers is hand-written and left alone.  The accuracy
table of README.md is written by lib/gen/gen_accuracy.py from the C++ test run's report.
"""

from __future__ import annotations

import pathlib
import re
import sys
from typing import Callable, Dict, List

sys.path.insert(0, str(pathlib.Path(__file__).resolve().parent))
import catalogue  # noqa: E402
from catalogue import Function  # noqa: E402

ROOT = catalogue.ROOT


def _default_text(a: catalogue.Arg) -> str:
    v = catalogue.python_default(a)
    if isinstance(v, str):
        return f'{a.name}="{v}"'
    return f"{a.name}={v}"


def inputs_text(f: Function) -> str:
    return ", ".join(_default_text(a) if a.has_default else a.name for a in f.args)


def camel(name: str) -> str:
    return "".join(part[:1].upper() + part[1:] for part in name.split("_"))


def _calc_home(f: Function, functions: List[Function]) -> str:
    """The Calc function that serves a function without a Calc name of its own: the
    function with the same arguments whose first output has its name."""
    for g in functions:
        if g.calc_name and g.outputs[0].name == f.name and [a.name for a in g.args] == [a.name for a in f.args]:
            return g.calc_name
    return "no Calc form"


def readme_functions(functions: List[Function]) -> str:
    rows = ["| name | Calc | inputs (Python defaults) | result | source |", "|---|---|---|---|---|"]
    for f in functions:
        calc = f.calc_name or "(see " + _calc_home(f, functions) + ")"
        rows.append(f"| {f.name} | {calc} | {inputs_text(f)} | {f.summary} | {f.source} |")
    return "\n".join(rows)


def addin_functions(functions: List[Function]) -> str:
    rows = ["| Calc name | method | result |", "|---|---|---|"]
    for f in functions:
        if not f.calc_name:
            continue
        rows.append(f"| {f.calc_name} | get{camel(f.name)} | {f.summary} |")
        if len(f.outputs) > 1:
            outs = ", ".join(o.name + (" (" + " / ".join(o.words) + ")" if o.words else "")
                             for o in f.outputs)
            rows.append(f"| {f.calc_name}OUTCOME | get{camel(f.name)}Outcome | "
                        f"array, a row per case with the columns {outs} |")
    rows.append("| DEALRANGE | getShareRange | own share at a probability (a quantile) when inputs "
                "are ranges (share_range; an array for a range of probabilities; see \"Ranges\") |")
    rows.append("| DEALRANGEOUTCOME | getShareRangeOutcome | array, a row per output of share_range "
                "with the columns label, estimate, 95% half-width, digits (see \"Ranges\") |")
    rows.append("| DEALSWING | getShareSwing | array, a row per uncertain input: its name, own share "
                "at its low, at its high, largest swing first (share_swing) |")
    rows.append("| DEALOFFERPATH | getOfferPath | array, a row per round of offer_path: round, offer, "
                "cutoff, probability in that round, by that round (see \"DEALOFFERPATH\") |")
    rows.append("| DEALREASON | getReason | why a DEAL function gives its result, in words: the "
                "function's name, then its arguments (see \"Why a cell fails\") |")
    # The diagnostic DEALCALLPROBE is in the test build only (addin/README.md "Tests and
    # benchmark"), not in the shipped extension this table describes.
    return "\n".join(rows)


#: file -> {table name: writer}
TABLES: Dict[str, Dict[str, Callable[[List[Function]], str]]] = {
    "README.md": {"functions": readme_functions},
    "addin/README.md": {"functions": addin_functions},
}


def replace_block(text: str, name: str, body: str, path: str) -> str:
    pattern = re.compile(rf"(<!-- generated:{name} -->\n)(.*?)(<!-- end:{name} -->)", re.S)
    if not pattern.search(text):
        raise SystemExit(f"error: {path} has no <!-- generated:{name} --> ... <!-- end:{name} --> block")
    return pattern.sub(lambda m: m.group(1) + body + "\n" + m.group(3), text)


def render(path: str, text: str, functions: List[Function]) -> str:
    for name, writer in TABLES[path].items():
        text = replace_block(text, name, writer(functions), path)
    return text


def main(argv: List[str]) -> int:
    check = "--check" in argv[1:]
    functions = catalogue.load()
    stale = []
    for rel in TABLES:
        path = ROOT / rel
        old = path.read_text(encoding="utf-8")
        new = render(rel, old, functions)
        if new != old:
            if check:
                stale.append(rel)
            else:
                path.write_text(new, encoding="utf-8")
                print(f"updated {rel}")
    if stale:
        print("stale generated tables in: " + ", ".join(stale)
              + " (run python3 lib/gen/gen_docs.py)", file=sys.stderr)
        return 1
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
