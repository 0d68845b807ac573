"""The ``counteroffer`` command: one catalogue function over a CSV file of deals.

    counteroffer --function share deals.csv -o results.csv

Each row is one deal; columns are named like the function's arguments, or mapped with
``--map own_rate=cost_of_capital`` (any other columns are copied through).  A missing
optional column, or an empty cell in one, takes the function's default.  The output
has every input column and row, in order, then ``status`` and the function's outputs.
Each bad row is reported on stderr with its line number, column and value; no row is
dropped; rows with valid but implausible values (a rate typed as 8 for 8%) are listed
in the summary.  Exit status: 0 when every row was evaluated, 1 when some rows had
invalid input (they are still written, with status "invalid" and empty results), 2 for
a usage error.

Results are model estimates under stated assumptions, not financial, legal or tax advice.
"""

from __future__ import annotations

import argparse
import csv
import os
import sys
import time
from typing import IO, Any, Dict, List, Optional, Sequence, Tuple

from . import _core
from ._batch import CHUNK, Options, Tally, evaluate_chunk
from ._spec import FunctionSpec, load_specs

PROGRESS_MIN_ROWS = 20_000


class UsageError(Exception):
    """A problem with the command or the file as a whole (exit status 2)."""


class _Progress:
    def __init__(self, total: int, stream: IO[str], enabled: bool) -> None:
        self.total, self.stream, self.enabled = total, stream, enabled
        self.last = -1.0
        self.start = time.monotonic()

    def update(self, done: int, final: bool = False) -> None:
        if not self.enabled or self.total <= 0:
            return
        now = time.monotonic()
        if not final and now - self.last < 0.2:
            return
        self.last = now
        frac = min(done / self.total, 1.0)
        width = 30
        bar = "#" * int(frac * width) + "-" * (width - int(frac * width))
        self.stream.write(
            f"\r[{bar}] {frac * 100:5.1f}% {done}/{self.total} rows {now - self.start:6.1f}s"
        )
        if final:
            self.stream.write("\n")
        self.stream.flush()


def _count_rows(path: str) -> int:
    with open(path, "rb") as f:
        return max(sum(1 for _ in f) - 1, 0)


def _function_list(specs: Sequence[FunctionSpec]) -> str:
    lines = []
    for s in specs:
        cols = ", ".join(a.name + ("" if not a.has_default else "?") for a in s.args)
        lines.append(f"  {s.name:<22} {cols}")
    return "\n".join(lines)


def _parser(specs: Sequence[FunctionSpec]) -> argparse.ArgumentParser:
    parser = argparse.ArgumentParser(
        prog="counteroffer",
        description="Evaluate one counteroffer catalogue function over a CSV of deals "
        "(one row per deal, columns named like the function's arguments). Results are "
        "model estimates, not financial, legal or tax advice.",
        epilog="functions and their columns (? = optional):\n" + _function_list(specs) +
        "\n  share_range            ranges per row: X, or X_low/X_high, or "
        "X_low/X_mode/X_high\n                         (counteroffer -f share_range --help)",
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    parser.add_argument("input", nargs="?", default="-", help="input CSV file (default: stdin)")
    parser.add_argument("-f", "--function", required=True, choices=sorted(s.name for s in specs),
                        metavar="NAME", help="catalogue function to evaluate")
    parser.add_argument("-o", "--output", default="-", help="output CSV file (default: stdout)")
    parser.add_argument("-d", "--delimiter", default=",", help="field delimiter (default ,)")
    parser.add_argument("--decimal", default=".", choices=[".", ","],
                        help="decimal mark of numbers in and out (default .; with , use "
                             "another delimiter, e.g. -d ';')")
    parser.add_argument("-m", "--map", action="append", default=[], metavar="ARG=COLUMN",
                        help="read argument ARG from column COLUMN (repeatable, or "
                             "comma-separated: --map own_rate=wacc,days=cycle)")
    group = parser.add_mutually_exclusive_group()
    group.add_argument("--progress", dest="progress", action="store_const", const=True,
                       help="always show the progress bar on stderr")
    group.add_argument("--no-progress", dest="progress", action="store_const", const=False,
                       help="never show the progress bar")
    parser.add_argument("--max-errors", type=int, default=50,
                        help="bad rows reported one by one before a summary (default 50)")
    parser.add_argument("--version", action="version",
                        version=f"counteroffer {_core.version()}")
    return parser


def _column_map(spec: FunctionSpec, entries: List[str]) -> Dict[str, str]:
    names = {a.name for a in spec.args}
    mapping: Dict[str, str] = {}
    for entry in ",".join(entries).split(","):
        if not entry.strip():
            continue
        arg, sep, column = (p.strip() for p in entry.partition("="))
        if not sep or not arg or not column:
            raise UsageError(f"--map {entry!r} is invalid (expected ARG=COLUMN, e.g. "
                             "own_rate=cost_of_capital)")
        if arg not in names:
            raise UsageError(f"--map {entry!r}: {spec.name} has no argument {arg!r} (it "
                             f"takes {', '.join(a.name for a in spec.args)})")
        mapping[arg] = column
    return mapping


def _check_header(spec: FunctionSpec, header: List[str], options: Options) -> Dict[str, int]:
    col_of: Dict[str, int] = {}
    for i, h in enumerate(header):
        if h in col_of:
            raise UsageError(f"column {h!r} appears twice in the header")
        col_of[h] = i
    missing = [options.column_of_arg.get(a.name, a.name) for a in spec.args
               if not a.has_default and options.column_of_arg.get(a.name, a.name) not in col_of]
    if missing:
        raise UsageError(f"{spec.name} needs the column(s) {', '.join(missing)}; "
                         f"the header has {', '.join(header)}")
    clash = [n for n in ["status", *spec.output_names] if n in col_of]
    if clash:
        raise UsageError(f"the input already has column(s) {', '.join(clash)}")
    return col_of


def _rows(reader: Any) -> List[Tuple[int, List[str]]]:
    rows: List[Tuple[int, List[str]]] = []
    for row in reader:
        rows.append((reader.line_num, row))
        if len(rows) >= CHUNK:
            break
    return rows


def _process(spec: FunctionSpec, src: IO[str], ns: argparse.Namespace, options: Options,
             stdout: IO[str], stderr: IO[str], total: int) -> int:
    reader = csv.reader(src, delimiter=ns.delimiter)
    try:
        header = [h.strip() for h in next(reader)]
    except StopIteration:
        raise UsageError("the input is empty (a header row is required)") from None
    col_of = _check_header(spec, header, options)
    try:
        dst = stdout if ns.output == "-" else open(ns.output, "w", newline="", encoding="utf-8")
    except OSError as e:
        raise UsageError(f"cannot write {ns.output}: {e.strerror}") from None
    show = ns.progress if ns.progress is not None else total >= PROGRESS_MIN_ROWS
    progress = _Progress(total, stderr, bool(show) and total > 0)
    tally = Tally(stderr, ns.max_errors)
    done = 0
    try:
        writer = csv.writer(dst, delimiter=ns.delimiter, lineterminator="\n")
        writer.writerow(header + ["status"] + spec.output_names)
        while True:
            rows = _rows(reader)
            if not rows:
                break
            evaluate_chunk(spec, rows, header, col_of, options, tally, done, writer)
            done += len(rows)
            progress.update(done)
    finally:
        if dst is not stdout:
            dst.close()
    progress.update(done, final=True)
    stderr.write(tally.summary(spec))
    return 1 if tally.counts.get("invalid", 0) else 0


def _open_input(path: str, stdin: IO[str]) -> Tuple[IO[str], int]:
    if path == "-":
        return stdin, 0
    try:
        return open(path, newline="", encoding="utf-8-sig"), _count_rows(path)
    except OSError as e:
        raise UsageError(f"cannot read {path}: {e.strerror}") from None


def run(argv: Optional[Sequence[str]] = None, stdin: Optional[IO[str]] = None,
        stdout: Optional[IO[str]] = None, stderr: Optional[IO[str]] = None) -> int:
    stdin = stdin or sys.stdin
    stdout = stdout or sys.stdout
    stderr = stderr or sys.stderr
    from ._cli_ranges import run as run_ranges, wants_ranges

    if wants_ranges(sys.argv[1:] if argv is None else argv):  # ranges: a row per deal
        return run_ranges(sys.argv[1:] if argv is None else argv, stdin, stdout, stderr)
    specs = load_specs()
    try:
        ns = _parser(specs).parse_args(argv)
    except SystemExit as e:
        return int(e.code or 0)
    spec = next(s for s in specs if s.name == ns.function)
    try:
        if ns.decimal == ns.delimiter:
            raise UsageError(f"--decimal {ns.decimal} needs another delimiter (e.g. -d ';')")
        options = Options(ns.delimiter, ns.decimal, ns.max_errors, _column_map(spec, ns.map))
        src, total = _open_input(ns.input, stdin)
        try:
            return _process(spec, src, ns, options, stdout, stderr, total)
        finally:
            if src is not stdin:
                src.close()
    except UsageError as e:
        stderr.write(f"counteroffer: {e}\n")
        return 2


def main() -> None:
    """Console entry point."""
    try:
        code = run()
    except KeyboardInterrupt:
        code = 130
    except BrokenPipeError:  # e.g. piped into head
        devnull = os.open(os.devnull, os.O_WRONLY)
        os.dup2(devnull, sys.stdout.fileno())
        code = 1
    sys.exit(code)


if __name__ == "__main__":  # python -m counteroffer._cli
    main()
