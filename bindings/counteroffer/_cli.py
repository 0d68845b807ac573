"""The ``counteroffer`` command: one catalogue function over a CSV file of deals.

    counteroffer --function share deals.csv -o results.csv

Each row is one deal; columns are named like the function's arguments (any other
columns are copied through).  A missing optional column, or an empty cell in one,
takes the function's default.  The output has every input column and row, in order,
then ``status`` and the function's outputs.  Each bad row is reported on stderr with
its line number, column and value; no row is dropped.  Exit status: 0 when every row
was evaluated, 1 when some rows had invalid input (they are still written, with
status "invalid" and empty results), 2 for a usage error.

Results are model estimates under stated assumptions, not financial, legal or tax advice.
"""

from __future__ import annotations

import argparse
import csv
import math
import os
import sys
import time
from typing import IO, Any, Dict, List, Optional, Sequence, Tuple

import numpy as np

from . import _core
from ._api import KIND, ArgSpec, FunctionSpec, load_specs
from ._present import DEFAULT_OVERRIDES

CHUNK = 1 << 16
PROGRESS_MIN_ROWS = 20_000
_TRUE = {"1", "true", "yes", "y", "t"}
_FALSE = {"0", "false", "no", "n", "f"}


class _CellError(Exception):
    pass


def _parse(arg: ArgSpec, text: str, spec: FunctionSpec) -> float:
    """One cell -> the double the library takes (conversion only, no domain checks)."""
    t = text.strip()
    if arg.kind == KIND["bool"]:
        low = t.lower()
        if low in _TRUE:
            return 1.0
        if low in _FALSE:
            return 0.0
        raise _CellError("expected TRUE/FALSE or 1/0")
    if arg.kind == KIND["choice"] and not _is_number(t):
        for k, c in enumerate(arg.choices):
            if t.lower() == c.lower():
                return float(k)
        raise _CellError("expected one of " + ", ".join(arg.choices))
    if t.lower() == "none":
        if arg.kind == KIND["optional"]:
            return -math.inf
        override = DEFAULT_OVERRIDES.get(spec.name, {}).get(arg.name)
        if override is not None and override[0] is None:
            return override[1]
        raise _CellError("a number is required")
    try:
        return float(t)
    except ValueError:
        raise _CellError("not a number") from None


def _is_number(t: str) -> bool:
    try:
        float(t)
    except ValueError:
        return False
    return True


def _fmt(x: float) -> str:
    return "" if x != x else repr(x)  # NaN (no value) -> empty cell


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


def run(argv: Optional[Sequence[str]] = None, stdin: Optional[IO[str]] = None,
        stdout: Optional[IO[str]] = None, stderr: Optional[IO[str]] = None) -> int:
    stdin = stdin or sys.stdin
    stdout = stdout or sys.stdout
    stderr = stderr or sys.stderr
    specs = load_specs()
    by_name = {s.name: s for s in specs}
    parser = argparse.ArgumentParser(
        prog="counteroffer",
        description="Evaluate one counteroffer catalogue function over a CSV of deals "
        "(one row per deal, columns named like the function's arguments). Results are "
        "model estimates, not financial, legal or tax advice.",
        epilog="functions and their columns (? = optional):\n" + _function_list(specs),
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    parser.add_argument("input", nargs="?", default="-", help="input CSV file (default: stdin)")
    parser.add_argument("-f", "--function", required=True, choices=sorted(by_name),
                        metavar="NAME", help="catalogue function to evaluate")
    parser.add_argument("-o", "--output", default="-", help="output CSV file (default: stdout)")
    parser.add_argument("-d", "--delimiter", default=",", help="field delimiter (default ,)")
    group = parser.add_mutually_exclusive_group()
    group.add_argument("--progress", dest="progress", action="store_const", const=True,
                       help="always show the progress bar on stderr")
    group.add_argument("--no-progress", dest="progress", action="store_const", const=False,
                       help="never show the progress bar")
    parser.add_argument("--max-errors", type=int, default=50,
                        help="bad rows reported one by one before a summary (default 50)")
    try:
        ns = parser.parse_args(argv)
    except SystemExit as e:
        return int(e.code or 0)
    spec = by_name[ns.function]

    if ns.input == "-":
        src: IO[str] = stdin
        total = 0
    else:
        try:
            src = open(ns.input, newline="", encoding="utf-8-sig")
        except OSError as e:
            stderr.write(f"counteroffer: cannot read {ns.input}: {e.strerror}\n")
            return 2
        total = _count_rows(ns.input)
    try:
        return _process(spec, src, ns, stdout, stderr, total)
    finally:
        if src is not stdin:
            src.close()


def _process(spec: FunctionSpec, src: IO[str], ns: argparse.Namespace, stdout: IO[str],
             stderr: IO[str], total: int) -> int:
    reader = csv.reader(src, delimiter=ns.delimiter)
    try:
        header = next(reader)
    except StopIteration:
        stderr.write("counteroffer: the input is empty (a header row is required)\n")
        return 2
    header = [h.strip() for h in header]
    col_of: Dict[str, int] = {}
    for i, h in enumerate(header):
        if h in col_of:
            stderr.write(f"counteroffer: column {h!r} appears twice in the header\n")
            return 2
        col_of[h] = i
    missing = [a.name for a in spec.args if not a.has_default and a.name not in col_of]
    if missing:
        stderr.write(f"counteroffer: {spec.name} needs the column(s) {', '.join(missing)}; "
                     f"the header has {', '.join(header)}\n")
        return 2
    out_names = [name for name, _h in spec.outputs]
    clash = [n for n in ["status", *out_names] if n in col_of]
    if clash:
        stderr.write(f"counteroffer: the input already has column(s) {', '.join(clash)}\n")
        return 2

    if ns.output == "-":
        dst: IO[str] = stdout
    else:
        try:
            dst = open(ns.output, "w", newline="", encoding="utf-8")
        except OSError as e:
            stderr.write(f"counteroffer: cannot write {ns.output}: {e.strerror}\n")
            return 2
    show = ns.progress if ns.progress is not None else total >= PROGRESS_MIN_ROWS
    progress = _Progress(total, stderr, bool(show) and total > 0)
    try:
        counts = _stream(spec, reader, header, col_of, dst, stderr, ns, progress)
    finally:
        if dst is not stdout:
            dst.close()
    n_rows = sum(counts.values())
    progress.update(n_rows, final=True)
    summary = ", ".join(f"{v} {k}" for k, v in counts.items() if v)
    stderr.write(f"counteroffer: {spec.name}: {n_rows} rows ({summary or 'none'})\n")
    return 1 if counts.get("invalid", 0) else 0


def _stream(spec: FunctionSpec, reader: Any, header: List[str], col_of: Dict[str, int],
            dst: IO[str], stderr: IO[str], ns: argparse.Namespace,
            progress: _Progress) -> Dict[str, int]:
    writer = csv.writer(dst, delimiter=ns.delimiter, lineterminator="\n")
    out_names = [name for name, _h in spec.outputs]
    writer.writerow(header + ["status"] + out_names)
    status_ufunc = _core.status_ufuncs[spec.name]
    names = {code: _core.status_name(code) for code in range(_core.REPORT_SLOTS)}
    counts: Dict[str, int] = {}
    reported = 0
    done = 0

    def report(row_no: int, line: int, message: str) -> None:
        nonlocal reported
        reported += 1
        if reported <= ns.max_errors:
            stderr.write(f"row {row_no} (line {line}): {message}\n")
        elif reported == ns.max_errors + 1:
            stderr.write("counteroffer: more bad rows; see the status column\n")

    while True:
        rows: List[Tuple[int, List[str]]] = []
        for row in reader:
            rows.append((reader.line_num, row))
            if len(rows) >= CHUNK:
                break
        if not rows:
            break
        n = len(rows)
        cols = np.empty((len(spec.args), n), dtype=np.float64)
        errors: Dict[int, str] = {}
        for i, (line, row) in enumerate(rows):
            if len(row) != len(header):
                errors[i] = (f"expected {len(header)} fields, found {len(row)}: "
                             f"{ns.delimiter.join(row)!r}")
        for j, arg in enumerate(spec.args):
            c = col_of.get(arg.name)
            if c is None:  # an optional column that is not there: its default
                cols[j] = _default_double(spec, arg)
                continue
            texts = [row[c] if i not in errors else "nan" for i, (_l, row) in enumerate(rows)]
            try:  # fast path: a column of plain numbers
                cols[j] = np.array(texts, dtype=np.float64)
                continue
            except ValueError:
                pass
            for i, text in enumerate(texts):
                if text.strip() == "":
                    if not arg.has_default:
                        errors.setdefault(i, f"column {arg.name} is empty (a value is required)")
                        cols[j, i] = math.nan
                        continue
                    cols[j, i] = _default_double(spec, arg)
                    continue
                try:
                    cols[j, i] = _parse(arg, text, spec)
                except _CellError as e:
                    errors.setdefault(i, f"column {arg.name} = {text!r} is invalid ({e}; "
                                         f"{arg.help})")
                    cols[j, i] = math.nan
        for i in errors:
            cols[:, i] = math.nan
        res = status_ufunc(*cols)
        status = res[-1].tolist()
        outs = [o.tolist() for o in res[:-1]]
        width = len(header)
        for i, (line, row) in enumerate(rows):
            code = status[i]
            if i in errors:
                code = 1
                report(done + i + 1, line, errors[i])
            elif code == 1:
                st, bad, _o = _core.call(spec.id, [float(x) for x in cols[:, i]])
                if 0 <= bad < len(spec.args):
                    arg = spec.args[bad]
                    c = col_of.get(arg.name)
                    shown = row[c] if c is not None else f"(default {_default_double(spec, arg)!r})"
                    report(done + i + 1, line,
                           f"column {arg.name} = {shown!r} is invalid ({arg.help})")
                else:
                    report(done + i + 1, line, f"invalid arguments ({_core.status_message(1)})")
            name = names.get(code) or _core.status_name(code)
            counts[name] = counts.get(name, 0) + 1
            if code == 1:
                values = [""] * len(outs)
            else:
                values = [_fmt(o[i]) for o in outs]
            if len(row) != width:  # bad rows (reported above) keep the header's width
                row = (row + [""] * width)[:width]
            writer.writerow(row + [name] + values)
        done += n
        progress.update(done)
    return counts


def _default_double(spec: FunctionSpec, arg: ArgSpec) -> float:
    override = DEFAULT_OVERRIDES.get(spec.name, {}).get(arg.name)
    if override is not None:
        return float(override[1])
    return float(arg.default)


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

