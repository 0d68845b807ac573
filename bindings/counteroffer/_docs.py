"""Docstrings: the library's table (summary, formula, source, arguments, outputs,
statuses) plus the Python text: argument types, how coded outputs are shown, the error
policy, and the function's worked example (_examples.py)."""

from __future__ import annotations

import textwrap
from typing import Dict, List

from . import _present
from ._examples import EXAMPLES
from ._spec import FunctionSpec, Kind

DISCLAIMER = (
    "Results are model estimates under the stated assumptions, not financial, legal or "
    "tax advice."
)

KIND_NAMES: Dict[int, str] = {
    Kind.REAL: "float (money)",
    Kind.UNIT: "float in [0, 1]",
    Kind.NONNEG: "float >= 0",
    Kind.POSITIVE: "float > 0",
    Kind.BOOL: "bool",
    Kind.COUNT: "int",
    Kind.CHOICE: "str",
    Kind.OPTIONAL: "float or None",
}

_POLICY = (
    "Errors\n------\n"
    "A call with scalar arguments only raises ``ValueError`` (``InvalidArgumentError``)\n"
    "naming the first invalid argument and its value.  Other statuses, and every status\n"
    "in an array call, follow ``counteroffer.errstate``: by default invalid arguments\n"
    "raise, ``no_deal`` returns own's no-deal payoff with a ``NoDealWarning``,\n"
    "``indeterminate`` / ``no_convergence`` give NaN with a warning, and a value outside\n"
    "its plausible range gives an ``ImplausibleInputWarning`` (the result uses it as\n"
    "given)."
)

_NO_DEAL = (
    "No deal\n-------\n"
    "When the surplus does not exceed what the parties get without a deal, no split is\n"
    "rational: the result is own's no-deal payoff (what own gets without a deal), not a\n"
    "bargained share, and a ``NoDealWarning`` says so (``errstate(no_deal=\"raise\")``\n"
    "makes it an error).  The Calc add-in shows #N/A in that case."
)


def _wrap(text: str, indent: str = "    ") -> str:
    return textwrap.fill(text, 84, initial_indent=indent, subsequent_indent=indent)


def _parameters(spec: FunctionSpec) -> List[str]:
    lines = ["Parameters", "----------"]
    for a in spec.args:
        kind = KIND_NAMES.get(a.kind, "float")
        if a.choices:
            kind = "str, one of " + ", ".join(repr(c) for c in a.choices)
        default = f", default {spec.default(a)!r}" if a.has_default else ""
        lines.append(f"{a.name} : {kind} or array_like{default}")
        text = f"{a.label}: {a.help}."
        if a.plausible is not None:
            text += (f" Plausible from {a.plausible[0]:g} to {a.plausible[1]:g}; a value "
                     "outside is used as given, with an ImplausibleInputWarning.")
        lines.append(_wrap(text))
    lines.append("out : ndarray or tuple of ndarray, optional")
    lines.append(_wrap("Where to write the results (float64), as for NumPy ufuncs; coded "
                       "outputs are then written as their codes."))
    return lines


def _returns(spec: FunctionSpec) -> List[str]:
    lines = ["Returns", "-------"]
    if len(spec.outputs) == 1:
        lines.append("float or ndarray (a pandas Series for Series input)")
        lines.append(_wrap(spec.outputs[0][1] + "."))
        return lines
    lines.append(
        "a frozen result object for scalar input; an ArrayResult (a mapping of arrays,\n"
        ".to_records() for a record array) for arrays; a DataFrame for Series"
    )
    for k, (name, help_) in enumerate(spec.outputs):
        lines.append(_wrap(f"{name}: {help_}."))
        shown = _present.legend(name, spec.words(k), spec.is_count(k))
        if shown:
            lines.append(_wrap(f"Shown in Python as follows: {shown}."))
    return lines


def _examples(spec: FunctionSpec) -> List[str]:
    lines = ["Examples", "--------"]
    example = EXAMPLES.get(spec.name)
    if example is None:
        return lines + ["(no example has been written for this catalogue row yet)"]
    lines.append(_wrap("Fictional scenario: " + example.scenario, ""))
    lines += ["", ">>> import counteroffer as co"]
    return lines + example.python.splitlines()


def build_doc(spec: FunctionSpec) -> str:
    lines = [spec.summary[:1].upper() + spec.summary[1:] + ".", ""]
    lines += ["Formula", "-------", _wrap(spec.formula), ""]
    lines += ["Source", "------", _wrap(spec.source), ""]
    lines += _parameters(spec) + [""] + _returns(spec)
    lines += ["", "Statuses", "--------", _wrap(spec.statuses + "."), "", _POLICY, ""]
    if "no_deal" in spec.statuses:
        lines += [_NO_DEAL, ""]
    lines += _examples(spec)
    lines += ["", DISCLAIMER, f"Calc: {spec.calc_name}."]
    return "\n".join(lines)
