"""The command line's engine: one catalogue function over the rows of a CSV file.

Rows are read in chunks, each chunk's cells converted (``_convert.parse_cell``) into
one float64 column per argument and evaluated with the row's status ufunc; every row
is written back with its status and results.  Coded outputs are written as the words
Python shows (``_present``), numbers in shortest round-trip form.
"""

from __future__ import annotations

import math
from typing import IO, Any, Dict, List, Optional, Sequence, Tuple

import numpy as np

from . import _core, _present
from ._convert import CellError, parse_cell
from ._spec import STATUS_NAMES, ArgSpec, FunctionSpec, Status

CHUNK = 1 << 16


class Options:
    """What the command line asked for (delimiter, decimal mark, column map...)."""

    def __init__(self, delimiter: str = ",", decimal: str = ".", max_errors: int = 50,
                 column_of_arg: Optional[Dict[str, str]] = None) -> None:
        self.delimiter = delimiter
        self.decimal = decimal
        self.max_errors = max_errors
        self.column_of_arg = dict(column_of_arg or {})


class Tally:
    """Per-status row counts, rows with implausible values, and the error reporter."""

    def __init__(self, stderr: IO[str], max_errors: int) -> None:
        self.counts: Dict[str, int] = {}
        self.implausible: List[Tuple[int, str]] = []
        self.reported = 0
        self.stderr = stderr
        self.max_errors = max_errors

    def report(self, row_no: int, line: int, message: str) -> None:
        self.reported += 1
        if self.reported <= self.max_errors:
            self.stderr.write(f"row {row_no} (line {line}): {message}\n")
        elif self.reported == self.max_errors + 1:
            self.stderr.write("counteroffer: more bad rows; see the status column\n")

    def summary(self, spec: FunctionSpec) -> str:
        n_rows = sum(self.counts.values())
        parts = ", ".join(f"{v} {k}" for k, v in self.counts.items() if v)
        text = f"counteroffer: {spec.name}: {n_rows} rows ({parts or 'none'})\n"
        if self.implausible:
            shown = "; ".join(f"row {r}: {m}" for r, m in self.implausible[:5])
            more = ", ..." if len(self.implausible) > 5 else ""
            text += (f"counteroffer: {len(self.implausible)} rows with implausible values "
                     f"(valid, used as given; a typo or a percentage typed as a whole "
                     f"number?): {shown}{more}\n")
        return text


def format_number(x: float, decimal: str = ".") -> str:
    """A result cell: shortest round-trip form, empty for NaN (no value)."""
    if x != x:
        return ""
    text = repr(x)
    return text.replace(".", decimal) if decimal != "." else text


def _cell_value(spec: FunctionSpec, arg: ArgSpec, text: str, options: Options) -> float:
    if text.strip() == "":
        if not arg.has_default:
            raise CellError("empty (a value is required)")
        return spec.default_double(arg)
    return parse_cell(spec, arg, text, options.decimal)


def _column(spec: FunctionSpec, arg: ArgSpec, texts: List[str], options: Options,
            errors: Dict[int, str], shown_name: str) -> np.ndarray:
    if options.decimal == ".":
        try:  # fast path: a column of plain numbers
            return np.array(texts, dtype=np.float64)
        except ValueError:
            pass
    col = np.empty(len(texts), dtype=np.float64)
    for i, text in enumerate(texts):
        try:
            col[i] = _cell_value(spec, arg, text, options)
        except CellError as e:
            col[i] = math.nan
            if text.strip() == "":
                errors.setdefault(i, f"column {shown_name} is {e}")
            else:
                errors.setdefault(i, f"column {shown_name} = {text!r} is invalid ({e}; "
                                     f"{arg.help})")
    return col


def parse_chunk(spec: FunctionSpec, rows: List[Tuple[int, List[str]]], width: int,
                col_of: Dict[str, int], options: Options) -> Tuple[np.ndarray, Dict[int, str]]:
    """The chunk's argument columns and the rows that could not be read."""
    cols = np.empty((len(spec.args), len(rows)), dtype=np.float64)
    errors: Dict[int, str] = {}
    for i, (_line, row) in enumerate(rows):
        if len(row) != width:
            errors[i] = (f"expected {width} fields, found {len(row)}: "
                         f"{options.delimiter.join(row)!r}")
    for j, arg in enumerate(spec.args):
        name = options.column_of_arg.get(arg.name, arg.name)
        c = col_of.get(name)
        if c is None:  # an optional column that is not there: its default
            cols[j] = spec.default_double(arg)
            continue
        texts = [row[c] if i not in errors else "nan" for i, (_l, row) in enumerate(rows)]
        cols[j] = _column(spec, arg, texts, options, errors, name)
    for i in errors:
        cols[:, i] = math.nan
    return cols, errors


def _invalid_reason(spec: FunctionSpec, args: List[float], row: List[str],
                    col_of: Dict[str, int], options: Options) -> str:
    from ._reasons import invalid_reason

    _st, bad, _o = _core.call(spec.id, args)
    if not 0 <= bad < len(spec.args):
        return f"invalid arguments ({_core.status_message(Status.INVALID)})"
    arg = spec.args[bad]
    name = options.column_of_arg.get(arg.name, arg.name)
    c = col_of.get(name)
    shown = row[c] if c is not None else f"(default {spec.default_double(arg)!r})"
    return f"column {name} = {shown!r} is invalid ({invalid_reason(spec, bad, args)})"


def _implausible(spec: FunctionSpec, args: Sequence[float], options: Options) -> Optional[str]:
    for j, arg in enumerate(spec.args):
        if arg.plausible is None or not math.isfinite(args[j]):
            continue
        low, high = arg.plausible
        if not low <= args[j] <= high:
            name = options.column_of_arg.get(arg.name, arg.name)
            return f"{name} = {args[j]!r} outside {low:g} to {high:g}"
    return None


def _output_cells(spec: FunctionSpec, outs: List[List[float]], i: int, decimal: str) -> List[str]:
    cells = []
    for k, values in enumerate(outs):
        words = spec.words(k)
        if words:
            cells.append(_present.cell(words, values[i]))
        elif spec.is_count(k):
            n = _present.whole(values[i])
            cells.append("" if n is None else str(n))
        else:
            cells.append(format_number(values[i], decimal))
    return cells


def evaluate_chunk(spec: FunctionSpec, rows: List[Tuple[int, List[str]]], header: List[str],
                   col_of: Dict[str, int], options: Options, tally: Tally, done: int,
                   writer: Any) -> None:
    """Evaluate and write one chunk of rows; count and report them in `tally`."""
    width = len(header)
    cols, errors = parse_chunk(spec, rows, width, col_of, options)
    res = _core.status_ufuncs[spec.name](*cols)
    status = res[-1].tolist()
    outs = [o.tolist() for o in res[:-1]]
    for i, (line, row) in enumerate(rows):
        code = Status.INVALID if i in errors else status[i]
        if i in errors:
            tally.report(done + i + 1, line, errors[i])
        elif code == Status.INVALID:
            tally.report(done + i + 1, line,
                         _invalid_reason(spec, [float(x) for x in cols[:, i]], row, col_of,
                                         options))
        else:
            flag = _implausible(spec, cols[:, i].tolist(), options)
            if flag:
                tally.implausible.append((done + i + 1, flag))
        name = STATUS_NAMES.get(code) or _core.status_name(code)
        tally.counts[name] = tally.counts.get(name, 0) + 1
        values = [""] * len(outs) if code == Status.INVALID else _output_cells(
            spec, outs, i, options.decimal)
        if len(row) != width:  # bad rows (reported above) keep the header's width
            row = (row + [""] * width)[:width]
        writer.writerow(row + [name] + values)
