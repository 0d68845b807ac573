"""What the add-in must show for a call: the functions' signatures (read from the
library's table through officekit.catalogue), a valid base call of each, what the
library receives for each argument as written, and the expected value or error code.

Sources of the rules: the argument kinds of lib/include/counteroffer/counteroffer.h
(CTO_ARG_*), docs/reference/functions.md "Bad input, on each surface", and
addin/README.md ("Argument values", "Error values"); expected values from the closed
forms in closed_forms.py.
"""
import math

import mpmath as mp

from closed_forms import ORACLE, Invalid
from officekit.catalogue import KIND, functions

DBL_MAX = 1.7976931348623157e308

# Error values (addin/README.md "Error values"; Calc's error numbers).
E_INVALID, E_NODEAL, E_INDET, E_PARAM = 502, 32767, 503, 504
NAMES = {502: "Err:502", 32767: "#N/A", 503: "#NUM!", 523: "Err:523", 504: "Err:504",
         532: "#DIV/0!", 524: "#REF!", -1: "any error"}

# Argument kinds, named by the library (counteroffer.h CTO_ARG_*).
REAL, UNIT, NONNEG, POS, BOOL, COUNT, CHOICE, OPTIONAL = (
    KIND[k] for k in ("real", "unit", "nonneg", "positive", "bool", "count", "choice",
                      "optional"))
INT64 = 2.0 ** 63

# A valid call of each function, by catalogue name (test data): hostile values replace
# one argument at a time.  A function without an entry gets a call made from its
# argument kinds (typical_call), which serves the argument-kind cases.
BASE = {
    "round_factor": [0.08, 30.0, 365.0, False],
    "share": [0.95, 0.9, 1000.0, True],
    "share_from_rates": [0.08, 0.12, 30.0, 1000.0, True, 365.0, False],
    "limit_share": [0.1, 0.05, 1000.0],
    "breakdown_share": [0.95, 0.9, 0.05, 0.2, 0.1, 1.0, True],
    "outside_option_share": [0.9, 0.9, 0.0, 0.3, 1.0, True],
    "inside_option_share": [0.9, 0.9, 0.1, 0.3, 1.0, True],
    "solve": [0.95, 0.9, 0.05, 0.2, 0.1, 0.0, 0.0, 0.0, 0.0, 1.0, True],
    "deadline_share": [0.9, 0.9, 3.0, 0.1, 0.2, 1.0, True],
    "fixed_cost_share": [0.1, 0.2, 1.0, True],
    "delay_cost": [0.9, 100.0, 0.1, 20.0],
    "first_mover_advantage": [0.8, 0.8, 1.0],
    "nash_share": [0.1, 0.2, 0.3, 1.0, 1.0, 1.0],
    "risk_averse_share": [0.9, 0.9, 0.5, 1.0, "power", 0.0, 0.0, 0.0, 1.0, True],
    "group_share": [0.9, 3.0, 2.0, 1.0],
    "majority_share": [0.9, 5.0, 3.0, "partner", 1.0],
    "implied_factor": [0.6, 0.9, True],
    "implied_rate": [0.4, 0.07, 30.0, True, 365.0, True],
    "share_sensitivity": [0.08, 0.12, 30.0, "own", 1.0, True, 365.0, False],
    "screening_profit": [1.0, 0.5, 0.45, 0.9, 0.8],
    "call_probe": [3.0, 4.0, 1.0, 1.0],  # the add-in's probe: returns its first argument
}
TYPICAL = {REAL: 0.0, UNIT: 0.9, NONNEG: 0.1, POS: 1.0, BOOL: True, OPTIONAL: 0.0}


def typical_call(args):
    """A valid call from the argument kinds alone: the default where there is one, else
    a typical value of the kind (money 0, factors 0.9, rates 0.1, counts 2)."""
    out = []
    for a in args:
        if a.kind == CHOICE:
            out.append(a.extra[int(a.default or 0)])
        elif a.default is not None and a.kind != OPTIONAL:
            out.append(bool(a.default) if a.kind == BOOL else a.default)
        elif a.kind == COUNT:
            out.append(float(max(a.extra, 2)))
        else:
            out.append(TYPICAL[a.kind])
    return out


# (Calc name, [(argument, kind, default or None, min_count or choices)], base call),
# in the add-in's order.
def base_call(f):
    """The hand-written base call, completed from the kinds for arguments appended later
    (deadline_share's breakdown_prob in 1.1: its default)."""
    base = list(BASE.get(f.name) or [])
    return base + typical_call(f.args)[len(base):]


F = [(f.calc, [tuple(a) for a in f.args], base_call(f)) for f in functions()]
FUN = {f[0]: f for f in F}


class Item:
    """One argument as written: a literal in the formula, a cell, or left out.
    how: "lit" (text of the literal), "cell" (value of the input cell), "omit"."""

    def __init__(self, how, value, text=None):
        self.how, self.value, self.text = how, value, text


def lit_text(v):
    if isinstance(v, bool):
        return "TRUE()" if v else "FALSE()"
    if isinstance(v, str):
        return '"%s"' % v
    return repr(float(v)).upper().replace("INF", "1E999")


def received(arg, item):
    """The double the library sees for this argument (addin/README.md "Argument
    values"), or raise Invalid.  Error values are handled by the caller."""
    kind = arg[1]
    v = item.value
    if item.how == "omit":
        return arg[2]
    if v is None:  # a single empty cell: Calc 7.4 reads it as 0 (addin/README.md)
        v = 0.0
    if isinstance(v, bool):
        v = 1.0 if v else 0.0
    if isinstance(v, str):
        if kind == CHOICE:
            names = [c.lower() for c in arg[3]]
            if v.lower() in names:
                return float(names.index(v.lower()))
        elif kind == BOOL and v.lower() in ("true", "false"):
            return 1.0 if v.lower() == "true" else 0.0
        raise Invalid("text where a number is needed")
    return float(v)


def check_kind(arg, x):
    """The argument kinds of counteroffer.h (CTO_ARG_*)."""
    kind = arg[1]
    if math.isnan(x):
        raise Invalid("NaN")
    if kind == OPTIONAL:
        if x == -math.inf or math.isfinite(x):
            return
        raise Invalid("not finite")
    if not math.isfinite(x):
        raise Invalid("not finite")
    if kind == UNIT and not (0 <= x <= 1):
        raise Invalid("outside [0, 1]")
    if kind == NONNEG and not x >= 0:
        raise Invalid("negative")
    if kind == POS and not x > 0:
        raise Invalid("not positive")
    if kind == BOOL and x not in (0.0, 1.0):
        raise Invalid("a boolean is 0 or 1")
    if kind == COUNT and (x != math.floor(x) or x < arg[3] or abs(x) >= INT64):
        raise Invalid("a count is a whole number >= %d" % arg[3])
    if kind == CHOICE and x not in tuple(float(i) for i in range(len(arg[3]))):
        raise Invalid("not a choice index")


def expect(calc, doubles):
    """(code, expected value or None, why) for the library's arguments, or None when
    no independent oracle covers the call."""
    args = FUN[calc][1]
    try:
        for a, x in zip(args, doubles):
            check_kind(a, x)
    except Invalid as e:
        return (E_INVALID, None, "invalid: %s (counteroffer.h argument kinds; "
                "addin/README.md: invalid -> Err:502)" % e)
    oracle = ORACLE.get(calc)
    if oracle is None:
        return None
    try:
        res = oracle(*[mp.mpf(x) for x in doubles])
    except Invalid as e:
        return (E_INVALID, None, "invalid: %s; addin/README.md: Err:502" % e)
    if res is None:
        return None
    status, value = res[0], res[1]
    scale = res[2] if len(res) > 2 else None
    if status == "nodeal":
        return (E_NODEAL, None, "no deal (%s); addin/README.md: #N/A" % oracle.__doc__.split(";")[0])
    if status == "indet":
        return (E_INDET, None, "indeterminate (%s); addin/README.md: #NUM!" %
                oracle.__doc__.split(";")[0])
    if abs(value) > DBL_MAX:
        return (-1, None, "the value %s is beyond the largest double: an error value, "
                "never a number (header: a value returned with CTO_OK is finite)" %
                mp.nstr(value, 5))
    why = "mpmath 50 digits: " + oracle.__doc__.strip().split("\n")[0]
    tol = 1e-13
    if scale is not None and value != 0 and scale > abs(value):
        tol = 1e-13 * float(scale / abs(value))
    return (0, float(value), why, tol)



def expect_items(calc, items):
    args = FUN[calc][1]
    doubles = []
    try:
        for a, it in zip(args, items):
            doubles.append(received(a, it))
    except Invalid as e:
        return (E_INVALID, None, "invalid: %s (addin/README.md: text where a number is "
                "needed, an unknown choice or a bad boolean is Err:502)" % e)
    return expect(calc, doubles)


def base_items(calc):
    return [Item("lit", v, lit_text(v)) for v in FUN[calc][2]]

