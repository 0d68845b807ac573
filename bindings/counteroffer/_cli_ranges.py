"""The command line's range mode: share_range over the rows of a CSV file.

    counteroffer --function share_range deals.csv -o ranges.csv

Each row is one deal.  An input of solve_from_rates is a column named like it (a fixed
value), or the columns ``<input>_low`` and ``<input>_high`` (uniform), with
``<input>_mode`` as well for PERT (or triangular with ``--shape triangular``); an empty
``_mode`` cell makes that row's range uniform.  Columns of neither form are copied
through.  The output has every input column, then ``status`` and, for each probability
p, ``own_p<p>``, ``own_p<p>_half_width``, ``other_p<p>``, ``other_p<p>_half_width``,
then the means, the probabilities of a rational deal and of each walk-away value binding,
the fraction of edge-case draws and the points used.  A row the library finds invalid is
reported on stderr with the library's reason (``cto_range_explain``) and written with
status ``invalid`` and empty results; a row short of the digit target is written with
status ``precision_not_reached`` and listed in the summary with the library's reason, as
is a row with a range end outside its argument's plausible range (a percentage typed as a
whole number?).  A progress bar appears on stderr for files of 20 rows or more.  Exit status as
the main command.

Results are model estimates under stated assumptions, not financial, legal or tax advice.
"""

from __future__ import annotations

import argparse
import csv
import sys
from typing import IO, Any, Dict, List, Optional, Sequence, Tuple

from . import _errors
from ._batch import Tally, format_number
from ._convert import CellError, parse_cell
from ._distributions import Distribution
from ._ranges import INPUTS, model_spec, share_range
from ._spec import ArgSpec

FUNCTION = "share_range"
PROGRESS_MIN_ROWS = 20
ENDS = ("low", "mode", "high")


def wants_ranges(argv: Sequence[str]) -> bool:
    """The command asks for the range mode (--function share_range)."""
    args = list(argv)
    for k, a in enumerate(args):
        if a in ("-f", "--function") and k + 1 < len(args) and args[k + 1] == FUNCTION:
            return True
        if a in (f"--function={FUNCTION}", f"-f{FUNCTION}"):
            return True
    return False


def _parser() -> argparse.ArgumentParser:
    p = argparse.ArgumentParser(
        prog="counteroffer --function share_range",
        description="Quantiles of the split per row when inputs are ranges: columns X, or "
        "X_low/X_high (uniform), or X_low/X_mode/X_high (PERT, or triangular with "
        "--shape). Model estimates, not financial, legal or tax advice.",
        epilog="inputs: " + ", ".join(INPUTS))
    p.add_argument("input", nargs="?", default="-", help="input CSV file (default: stdin)")
    p.add_argument("-f", "--function", required=True, choices=[FUNCTION])
    p.add_argument("-o", "--output", default="-", help="output CSV file (default: stdout)")
    p.add_argument("-d", "--delimiter", default=",", help="field delimiter (default ,)")
    p.add_argument("--decimal", default=".", choices=[".", ","], help="decimal mark")
    p.add_argument("--shape", default="pert", choices=["pert", "triangular"],
                   help="distribution of an input with a _mode column (default pert)")
    p.add_argument("--probabilities", default="0.1,0.5,0.9",
                   help="probabilities of the quantiles, separated by ';' or ',' "
                        "(default 0.1,0.5,0.9)")
    p.add_argument("--seed", type=int, default=0, help="seed of the scrambling (default 0)")
    p.add_argument("--replicates", type=int, default=16, help="replicates (default 16)")
    p.add_argument("--digits", type=int, default=3, help="significant digits (default 3)")
    p.add_argument("--log2-max", type=int, default=20, help="largest 2^m points (default 20)")
    group = p.add_mutually_exclusive_group()
    group.add_argument("--progress", dest="progress", action="store_const", const=True)
    group.add_argument("--no-progress", dest="progress", action="store_const", const=False)
    p.add_argument("--max-errors", type=int, default=50)
    return p


def _layout(header: List[str]) -> Dict[str, Dict[str, int]]:
    """input name -> {"value" | "low" | "mode" | "high": column index}."""
    col = {h: i for i, h in enumerate(header)}
    found: Dict[str, Dict[str, int]] = {}
    for name in INPUTS:
        cols = {end: col[f"{name}_{end}"] for end in ENDS if f"{name}_{end}" in col}
        if name in col:
            cols["value"] = col[name]
        if cols:
            found[name] = cols
    return found


def _output_names(probs: Sequence[float]) -> List[str]:
    names = []
    for side in ("own", "other"):
        for p in probs:
            names += [f"{side}_p{p:g}", f"{side}_p{p:g}_half_width"]
    return names + ["own_mean", "other_mean", "p_rational", "p_own_binds", "p_other_binds",
                    "edge_fraction", "points"]


def _cell(arg: ArgSpec, text: str, decimal: str) -> float:
    return parse_cell(model_spec(), arg, text, decimal)


def _value(arg: ArgSpec, row: List[str], cols: Dict[str, int], decimal: str) -> Any:
    """One input of one row: a number, None, or a Distribution (conversion only)."""
    if "value" in cols and row[cols["value"]].strip():
        return _cell(arg, row[cols["value"]], decimal)
    texts = {end: row[c].strip() for end, c in cols.items() if end != "value"}
    if not any(texts.values()):
        return "default"
    for end in ("low", "high"):
        if not texts.get(end):
            raise CellError(f"column {arg.name}_{end} is empty (a range needs a low and a high)")
    lo, hi = (_cell(arg, texts[e], decimal) for e in ("low", "high"))
    if texts.get("mode"):
        return (lo, _cell(arg, texts["mode"], decimal), hi)
    return Distribution("uniform", lo, None, hi)


def _row_values(row: List[str], layout: Dict[str, Dict[str, int]],
                decimal: str) -> Dict[str, Any]:
    spec = model_spec()
    kwargs: Dict[str, Any] = {}
    for arg in spec.args:
        if arg.name not in layout:
            continue
        v = _value(arg, row, layout[arg.name], decimal)
        if v != "default":
            kwargs[arg.name] = v
    return kwargs


def _cells(result: Any, decimal: str) -> List[str]:
    out: List[str] = []
    for ests in (result.own, result.other):
        for e in ests:
            out += [format_number(e.value, decimal), format_number(e.half_width, decimal)]
    for e in (result.own_mean, result.other_mean, result.p_rational, result.p_own_binds,
              result.p_other_binds, result.edge_fraction):
        out.append(format_number(e.value, decimal))
    return out + [str(result.points_per_replicate * result.replicates)]


class RowResult:
    """One row's status, result cells, error message (invalid rows) and the library's
    reason when it is more than "ok" (a precision not reached, a typing slip)."""

    def __init__(self, status: str, cells: List[str], error: Optional[str] = None,
                 reason: str = "ok") -> None:
        self.status, self.cells, self.error, self.reason = status, cells, error, reason


def _one_row(row: List[str], layout: Dict[str, Dict[str, int]], ns: argparse.Namespace,
             probs: List[float]) -> RowResult:
    try:
        kwargs = _row_values(row, layout, ns.decimal)
    except CellError as e:
        return RowResult("invalid", [], str(e))
    missing = [n for n in ("own_rate", "other_rate", "days") if n not in kwargs]
    if missing:
        return RowResult("invalid", [],
                         f"no value for {', '.join(missing)} (a value is required)")
    try:
        with _errors.errstate(precision="ignore", implausible="ignore", indeterminate="ignore"):
            r = share_range(**kwargs, shape=ns.shape, probabilities=probs, seed=ns.seed,
                            replicates=ns.replicates, digits=ns.digits, log2_max=ns.log2_max)
    except _errors.InvalidArgumentError as e:
        return RowResult("invalid", [], str(e))
    return RowResult(r.status, _cells(r, ns.decimal), reason=r.reason)


class Notes:
    """The rows whose reason from the library is more than "ok" (precision not reached,
    a range end that looks like a typing slip), for the summary, in the library's words."""

    SHOWN = 5

    def __init__(self) -> None:
        self.rows: List[Tuple[int, str]] = []

    def add(self, row_no: int, result: RowResult) -> None:
        if result.status != "invalid" and result.reason != "ok":
            self.rows.append((row_no, result.reason))

    def summary(self) -> str:
        if not self.rows:
            return ""
        shown = "; ".join(f"row {r}: {m}" for r, m in self.rows[:self.SHOWN])
        more = ", ..." if len(self.rows) > self.SHOWN else ""
        return (f"counteroffer: {len(self.rows)} rows with a reason to look at (the results "
                f"are written): {shown}{more}\n")


def _probabilities(text: str, decimal: str) -> List[float]:
    """--probabilities: separated by ';' (and by ',' when the decimal mark is '.')."""
    from ._cli import UsageError

    parts = text.split(";") if decimal == "," else text.replace(";", ",").split(",")
    try:
        return [float(p.strip().replace(decimal, ".")) for p in parts if p.strip()]
    except ValueError:
        raise UsageError(f"--probabilities {text!r} is invalid (numbers)") from None


def _process(src: IO[str], dst: IO[str], ns: argparse.Namespace, stderr: IO[str],
             total: int) -> int:
    from ._cli import UsageError, _Progress

    reader = csv.reader(src, delimiter=ns.delimiter)
    try:
        header = [h.strip() for h in next(reader)]
    except StopIteration:
        raise UsageError("the input is empty (a header row is required)") from None
    layout = _layout(header)
    need = [n for n in ("own_rate", "other_rate", "days") if n not in layout]
    if need:
        raise UsageError(f"share_range needs the column(s) {', '.join(need)} (or "
                         f"<name>_low and <name>_high); the header has {', '.join(header)}")
    probs = _probabilities(ns.probabilities, ns.decimal)
    show = ns.progress if ns.progress is not None else total >= PROGRESS_MIN_ROWS
    progress = _Progress(total, stderr, bool(show) and total > 0)
    tally = Tally(stderr, ns.max_errors)
    writer = csv.writer(dst, delimiter=ns.delimiter, lineterminator="\n")
    writer.writerow(header + ["status"] + _output_names(probs))
    notes = Notes()
    done = 0
    for row in reader:
        done += 1
        row = (row + [""] * len(header))[:len(header)]
        result = _one_row(row, layout, ns, probs)
        if result.error:
            tally.report(done, reader.line_num, result.error)
        notes.add(done, result)
        tally.counts[result.status] = tally.counts.get(result.status, 0) + 1
        writer.writerow(row + [result.status] +
                        (result.cells or [""] * len(_output_names(probs))))
        progress.update(done)
    progress.update(done, final=True)
    stderr.write(tally.summary(model_spec()) + notes.summary())
    return 1 if tally.counts.get("invalid", 0) else 0


def run(argv: Sequence[str], stdin: IO[str], stdout: IO[str], stderr: IO[str]) -> int:
    """The range mode of ``counteroffer`` (dispatched from _cli.run)."""
    from ._cli import UsageError, _open_input

    try:
        ns = _parser().parse_args(list(argv))
    except SystemExit as e:
        return int(e.code or 0)
    try:
        if ns.decimal == ns.delimiter:
            raise UsageError(f"--decimal {ns.decimal} needs another delimiter (e.g. -d ';')")
        src, total = _open_input(ns.input, stdin)
        try:
            dst = stdout if ns.output == "-" else open(ns.output, "w", newline="",
                                                       encoding="utf-8")
        except OSError as e:
            raise UsageError(f"cannot write {ns.output}: {e.strerror}") from None
        try:
            return _process(src, dst, ns, stderr, total)
        finally:
            if dst is not stdout:
                dst.close()
            if src is not stdin:
                src.close()
    except UsageError as e:
        stderr.write(f"counteroffer: {e}\n")
        return 2


if __name__ == "__main__":  # pragma: no cover
    sys.exit(run(sys.argv[1:], sys.stdin, sys.stdout, sys.stderr))
