"""Writes the README's accuracy table from the C++ test run's report.

    python3 lib/gen/gen_accuracy.py REPORT            rewrite the table in README.md
    python3 lib/gen/gen_accuracy.py REPORT --check    exit 1 when README.md differs

REPORT is the accuracy-report.tsv that the reference-table test (tests/cpp/
test_reference.cpp) writes into its build folder: one line per function with the number
of reference rows and the worst error measured against the 50-digit values.  The table
stands between <!-- generated:accuracy --> and <!-- end:accuracy --> in README.md.
"""

from __future__ import annotations

import csv
import pathlib
import sys
from typing import List

sys.path.insert(0, str(pathlib.Path(__file__).resolve().parent))
import catalogue  # noqa: E402
from gen_docs import replace_block  # noqa: E402


def table(report: pathlib.Path) -> str:
    with report.open(encoding="utf-8") as fh:
        rows = list(csv.DictReader(fh, delimiter="\t"))
    if not rows:
        raise SystemExit(f"error: {report} holds no rows")
    total = sum(int(r["rows"]) for r in rows)
    cells = [f"| {r['function']} | {int(r['rows'])} | {float(r['worst']):.1e} |" for r in rows]
    lines = [f"Measured over {total:,} reference rows of {len(rows)} functions "
             "(the C++ test run writes this table's source, `accuracy-report.tsv`):", "",
             "| function | rows | worst error |", "|---|---|---|"] + cells
    return "\n".join(lines)


def main(argv: List[str]) -> int:
    args = [a for a in argv[1:] if a != "--check"]
    if len(args) != 1:
        print(__doc__, file=sys.stderr)
        return 2
    readme = catalogue.ROOT / "README.md"
    old = readme.read_text(encoding="utf-8")
    new = replace_block(old, "accuracy", table(pathlib.Path(args[0])), "README.md")
    if new == old:
        return 0
    if "--check" in argv:
        print("README.md: the accuracy table differs from this test run's report "
              "(run python3 lib/gen/gen_accuracy.py " + args[0] + ")", file=sys.stderr)
        return 1
    readme.write_text(new, encoding="utf-8")
    print("updated README.md (accuracy)")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
