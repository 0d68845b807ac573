"""The add-in's functions, read from the library's table (cto_function_at, through the
Python package's counteroffer._core.catalogue()); nothing here lists a function by hand.

The stored names follow the add-in's stable naming rule (addin/README.md "Stable
names"; addin/gen/addin_gen.cpp): method "get" + the catalogue name in CamelCase, and
for a function with several outputs an array form whose Calc name adds OUTCOME and
whose method adds Outcome.  The functions that are not catalogue rows are the
call-overhead probe DEALCALLPROBE (getCallProbe) of the add-in's test build only
(counteroffer-test.oxt; the shipped extension has no such function), with DEALSHARE's
argument shape (two required, two optional arguments), DEALREASON, and the range and
offer-path functions of NON_CATALOGUE (their stored names only: methods()).
"""
import collections

from counteroffer import _core

KIND_NAMES = ("real", "unit", "nonneg", "positive", "bool", "count", "choice", "optional")


def _kinds():
    """Argument kinds named by the library (CTO_ARG_*): the module's ARG_* constants,
    or its older ARG_KINDS table."""
    if hasattr(_core, "ARG_REAL"):
        return {k: int(getattr(_core, "ARG_" + k.upper())) for k in KIND_NAMES}
    return {k: int(_core.ARG_KINDS[k]) for k in KIND_NAMES}


KIND = _kinds()

# name, kind (KIND), default (None: required), extra (min_count for a count, the
# tuple of choice names for a choice, else None)
Arg = collections.namedtuple("Arg", "name kind default extra")
Function = collections.namedtuple("Function", "calc method name args outcome")


def camel(snake):
    return "".join(part[:1].upper() + part[1:] for part in snake.split("_"))


def _arg(a):
    extra = None
    if a["kind"] == KIND["count"]:
        extra = int(a["min_count"])
    elif a["kind"] == KIND["choice"]:
        extra = tuple(a["choices"])
    return Arg(a["name"], a["kind"], float(a["default"]) if a["has_default"] else None,
               extra)


PROBE = Function("DEALCALLPROBE", "getCallProbe", "call_probe",
                 (Arg("value", KIND["real"], None, None),
                  Arg("other", KIND["real"], None, None),
                  Arg("third", KIND["real"], 1.0, None),
                  Arg("fourth", KIND["real"], 1.0, None)), False)


def functions(probe=True):
    """Every Calc function of the add-in, in the add-in's order; with probe (the
    default), also the test build's DEALCALLPROBE."""
    out = []
    for row in _core.catalogue():
        if not row["calc_name"]:  # served in Calc by another function (trade_probability)
            continue
        args = tuple(_arg(a) for a in row["args"])
        method = "get" + camel(row["name"])
        out.append(Function(row["calc_name"], method, row["name"], args, False))
        if len(row["outputs"]) > 1:
            out.append(Function(row["calc_name"] + "OUTCOME", method + "Outcome",
                                row["name"], args, True))
    if probe:
        out.append(PROBE)
    return out


#: The reason function: a function's name, then that function's arguments (varargs).
REASON = ("DEALREASON", "getReason")

#: The add-in's functions that are not catalogue rows (addin/src/range_args.h): the
#: ranges (share_range, share_swing) and the offer path's rows (offer_path).
NON_CATALOGUE = {"DEALRANGE": "getShareRange", "DEALRANGEOUTCOME": "getShareRangeOutcome",
                 "DEALSWING": "getShareSwing", "DEALOFFERPATH": "getOfferPath"}


def methods():
    """{Calc name: stored method name} for every function of the add-in."""
    out = {f.calc: f.method for f in functions()}
    out[REASON[0]] = REASON[1]
    out.update(NON_CATALOGUE)
    return out


def plausible_range(name, arg):
    """(low, high) of the values of argument `arg` of catalogue function `name` that
    look like what a user means (cto_arg_plausible_range), or None when the argument
    has no such range."""
    row = next(f for f in _core.catalogue() if f["name"] == name)
    index = [a["name"] for a in row["args"]].index(arg)
    got = _core.arg_plausible_range(row["id"], index)
    return None if got is None else (float(got[0]), float(got[1]))
