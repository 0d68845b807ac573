#!/usr/bin/env python3
"""Writes tests/hostile/hostile.fods: more than 10,000 DEAL... calls with hostile
arguments, each with its expected value or expected Calc error code.

  .venv/bin/python tests/hostile/make_hostile.py [--out FILE]

The sheet (about 12 MB) is not committed: scripts/test.d/50-hostile.sh writes it
afresh into a temporary folder; it is deterministic (seeded).  The counteroffer package is NOT used: expected values come
from the published closed forms below, evaluated with mpmath at 50 digits; expected
errors from the documented rules:

* argument kinds and domains: lib/include/counteroffer/counteroffer.h (CTO_ARG_*:
  unit [0,1], nonneg >= 0, positive > 0, bool 0/1, count whole >= min within int64,
  choice an index or its text) and CATALOGUE.md "What every function must do with bad
  input";
* status -> Calc error: addin/README.md "Error values" (invalid -> Err:502 (502),
  no deal -> #N/A (32767), indeterminate -> #NUM! (503), no convergence -> Err:523);
* argument values: addin/README.md "Argument values" (text where a number is needed is
  Err:502; booleans TRUE/FALSE, 1/0 or "true"/"false"; choices as text in any case or
  their index; an empty cell referred to alone reaches the add-in as 0, Calc 7.4
  limitation; inside a range an empty cell of a required argument is Err:502);
  addin/README.md "Whole columns" (ranges of another shape: Err:502; a 1x1 range
  applies to every element);
* Calc 7.4's own behaviour, observed on this office and marked "Calc 7.4 (observed)":
  an error value in an argument is passed on unchanged (#DIV/0! 532, #N/A 32767,
  Err:502 of SQRT(-1), #REF! 524); a range holding an error cell makes the whole
  call Err:504; a wrong number of arguments is Err:504; cells of a matrix formula
  outside the result are #N/A; an array result in a plain (non-matrix) cell shows its
  top-left element.

Results are model estimates under the stated assumptions, not financial, legal or tax
advice.  This sheet is test data only.
"""
import argparse
import math
import os
import random
import sys

import mpmath as mp

HERE = os.path.dirname(os.path.abspath(__file__))
sys.path.insert(0, HERE)
import fods  # noqa: E402

mp.mp.dps = 50
OUT = os.path.join(os.environ.get("TMPDIR", "/tmp"), "cto_hostile.fods")
DBL_MAX = 1.7976931348623157e308

# Error values (addin/README.md "Error values"; Calc's error numbers).
E_INVALID, E_NODEAL, E_INDET, E_PARAM = 502, 32767, 503, 504
NAMES = {502: "Err:502", 32767: "#N/A", 503: "#NUM!", 523: "Err:523", 504: "Err:504",
         532: "#DIV/0!", 524: "#REF!", -1: "any error"}

# Argument kinds (counteroffer.h CTO_ARG_*).
REAL, UNIT, NONNEG, POS, BOOL, COUNT, CHOICE, OPTIONAL = range(8)
INT64 = 2.0 ** 63

# (Calc name, [(argument, kind, default or None, min_count or choices)], base call).
# The base call is a valid call; hostile values replace one argument at a time.
F = [
    ("DEALFACTOR", [("rate", NONNEG, None), ("days", NONNEG, None), ("basis", POS, 365.0),
                    ("continuous", BOOL, 0.0)], [0.08, 30.0, 365.0, False]),
    ("DEALSHARE", [("own_factor", UNIT, None), ("other_factor", UNIT, None),
                   ("surplus", REAL, 1.0), ("own_opens", BOOL, 1.0)],
     [0.95, 0.9, 1000.0, True]),
    ("DEALSHARERATE", [("own_rate", NONNEG, None), ("other_rate", NONNEG, None),
                       ("days", NONNEG, None), ("surplus", REAL, 1.0), ("own_opens", BOOL, 1.0),
                       ("basis", POS, 365.0), ("continuous", BOOL, 0.0)],
     [0.08, 0.12, 30.0, 1000.0, True, 365.0, False]),
    ("DEALSHARELIMIT", [("own_rate", NONNEG, None), ("other_rate", NONNEG, None),
                        ("surplus", REAL, 1.0)], [0.1, 0.05, 1000.0]),
    ("DEALBREAKDOWN", [("own_factor", UNIT, None), ("other_factor", UNIT, None),
                       ("breakdown_prob", UNIT, None), ("own_fallback", REAL, None),
                       ("other_fallback", REAL, None), ("surplus", REAL, 1.0),
                       ("own_opens", BOOL, 1.0)], [0.95, 0.9, 0.05, 0.2, 0.1, 1.0, True]),
    ("DEALOUTSIDE", [("own_factor", UNIT, None), ("other_factor", UNIT, None),
                     ("own_outside", REAL, None), ("other_outside", REAL, None),
                     ("surplus", REAL, 1.0), ("own_opens", BOOL, 1.0)],
     [0.9, 0.9, 0.0, 0.3, 1.0, True]),
    ("DEALINSIDE", [("own_factor", UNIT, None), ("other_factor", UNIT, None),
                    ("own_inside", REAL, None), ("other_inside", REAL, None),
                    ("surplus", REAL, 1.0), ("own_opens", BOOL, 1.0)],
     [0.9, 0.9, 0.1, 0.3, 1.0, True]),
    ("DEALSOLVE", [("own_factor", UNIT, None), ("other_factor", UNIT, None),
                   ("breakdown_prob", UNIT, 0.0), ("own_fallback", REAL, 0.0),
                   ("other_fallback", REAL, 0.0), ("own_inside", REAL, 0.0),
                   ("other_inside", REAL, 0.0), ("own_outside", OPTIONAL, -math.inf),
                   ("other_outside", OPTIONAL, -math.inf), ("surplus", REAL, 1.0),
                   ("own_opens", BOOL, 1.0)],
     [0.95, 0.9, 0.05, 0.2, 0.1, 0.0, 0.0, 0.0, 0.0, 1.0, True]),
    ("DEALSOLVEOUTCOME", None, None),  # same arguments as DEALSOLVE (filled in below)
    ("DEALDEADLINE", [("own_factor", UNIT, None), ("other_factor", UNIT, None),
                      ("rounds", COUNT, None, 0), ("own_fallback", REAL, 0.0),
                      ("other_fallback", REAL, 0.0), ("surplus", REAL, 1.0),
                      ("own_opens", BOOL, 1.0)], [0.9, 0.9, 3.0, 0.1, 0.2, 1.0, True]),
    ("DEALFIXEDCOST", [("own_cost", NONNEG, None), ("other_cost", NONNEG, None),
                       ("surplus", REAL, 1.0), ("own_opens", BOOL, 1.0)],
     [0.1, 0.2, 1.0, True]),
    ("DEALDELAYCOST", [("factor", UNIT, None), ("stake", REAL, None),
                       ("breakdown_prob", UNIT, 0.0), ("fallback", REAL, 0.0)],
     [0.9, 100.0, 0.1, 20.0]),
    ("DEALFIRSTMOVER", [("own_factor", UNIT, None), ("other_factor", UNIT, None),
                        ("surplus", REAL, 1.0)], [0.8, 0.8, 1.0]),
    ("DEALNASH", [("own_fallback", REAL, None), ("other_fallback", REAL, None),
                  ("own_weight", UNIT, 0.5), ("surplus", REAL, 1.0),
                  ("own_curvature", POS, 1.0), ("other_curvature", POS, 1.0)],
     [0.1, 0.2, 0.3, 1.0, 1.0, 1.0]),
    ("DEALRISKAVERSE", [("own_factor", UNIT, None), ("other_factor", UNIT, None),
                        ("own_curvature", POS, None), ("other_curvature", POS, None),
                        ("utility", CHOICE, 0.0, ("power", "exponential")),
                        ("breakdown_prob", UNIT, 0.0), ("own_fallback", REAL, 0.0),
                        ("other_fallback", REAL, 0.0), ("surplus", REAL, 1.0),
                        ("own_opens", BOOL, 1.0)],
     [0.9, 0.9, 0.5, 1.0, "power", 0.0, 0.0, 0.0, 1.0, True]),
    ("DEALGROUP", [("factor", UNIT, None), ("parties", COUNT, None, 1),
                   ("position", COUNT, 0.0, 0), ("surplus", REAL, 1.0)],
     [0.9, 3.0, 2.0, 1.0]),
    ("DEALMAJORITY", [("factor", UNIT, None), ("parties", COUNT, None, 1),
                      ("votes_needed", COUNT, 0.0, 0),
                      ("role", CHOICE, 0.0, ("proposer", "partner")), ("surplus", REAL, 1.0)],
     [0.9, 5.0, 3.0, "partner", 1.0]),
    ("DEALIMPLIEDFACTOR", [("observed_share", UNIT, None), ("other_factor", UNIT, None),
                           ("own_opens", BOOL, 1.0)], [0.6, 0.9, True]),
    ("DEALIMPLIEDRATE", [("observed_share", UNIT, None), ("other_rate", NONNEG, None),
                         ("days", NONNEG, None), ("own_opens", BOOL, 1.0),
                         ("basis", POS, 365.0), ("continuous", BOOL, 0.0)],
     [0.4, 0.07, 30.0, True, 365.0, True]),
    ("DEALSENSITIVITY", [("own_rate", NONNEG, None), ("other_rate", NONNEG, None),
                         ("days", NONNEG, None), ("wrt", CHOICE, 0.0, ("own", "other")),
                         ("surplus", REAL, 1.0), ("own_opens", BOOL, 1.0),
                         ("basis", POS, 365.0), ("continuous", BOOL, 0.0)],
     [0.08, 0.12, 30.0, "own", 1.0, True, 365.0, False]),
    ("DEALSCREEN", [("high_value", POS, None), ("low_value", POS, None),
                    ("high_prob", UNIT, None), ("seller_factor", UNIT, None),
                    ("buyer_factor", UNIT, None)], [1.0, 0.5, 0.45, 0.9, 0.8]),
    # the diagnostic probe (addin/README.md): DEALSHARE's argument shape, two optional
    ("DEALCALLPROBE", [("value", REAL, None), ("other", REAL, None), ("third", REAL, 1.0),
                       ("fourth", REAL, 1.0)], [3.0, 4.0, 1.0, 1.0]),
]
F[8] = ("DEALSOLVEOUTCOME", F[7][1], F[7][2])
FUN = {f[0]: f for f in F}


class Invalid(Exception):
    pass


# ---- published closed forms (mpmath, 50 digits) -----------------------------------
# Each returns ("ok", value), ("nodeal", None), ("indet", None); raises Invalid for a
# domain violation the header documents beyond the argument kinds; None: no oracle
# here for these arguments (the case is then not generated).
def rubinstein(d1, d2, s, opens):
    """Rubinstein (1982) main theorem; Muthoo (1999) ch.3; REFERENCE.md s.1."""
    if d1 == 1 and d2 == 1:
        return None if s <= 0 else ("indet", None)  # both apply: no order documented
    if s <= 0:
        return ("nodeal", None)
    x = (1 - d2) / (1 - d1 * d2)
    return ("ok", s * x if opens else s * d1 * x)


def o_factor(rate, days, basis, cont):
    """Standard compounding (common practice, no source); Muthoo (1999) s.3.2."""
    if cont:
        return ("ok", mp.exp(-rate * days / basis))
    return ("ok", mp.exp(-mp.log1p(rate) * days / basis))  # = (1 + rate)^(-days/basis)


def o_share(d1, d2, s, opens):
    """Rubinstein (1982) main theorem; Muthoo (1999) ch.3; REFERENCE.md s.1."""
    return rubinstein(d1, d2, s, opens)


def o_share_rates(r1, r2, days, s, opens, basis, cont):
    """Rubinstein (1982) with delta_i = factor(rate_i); Muthoo (1999) s.3.2."""
    c = (lambda r: r) if cont else (lambda r: mp.log1p(r))
    rho1, rho2 = c(r1) * days / basis, c(r2) * days / basis
    if rho1 == 0 and rho2 == 0:
        return None if s <= 0 else ("indet", None)
    if s <= 0:
        return ("nodeal", None)
    x = mp.expm1(-rho2) / mp.expm1(-(rho1 + rho2))
    return ("ok", s * x if opens else s * mp.exp(-rho1) * x)


def o_limit(r1, r2, s):
    """Binmore, Rubinstein & Wolinsky (1986); Muthoo (1999) ch.3."""
    if r1 == 0 and r2 == 0:
        return None if s <= 0 else ("indet", None)
    if s <= 0:
        return ("nodeal", None)
    return ("ok", s * r2 / (r1 + r2))


def o_breakdown(d1, d2, p, b1, b2, s, opens):
    """BRW (1986); Muthoo (1999) ch.4; the header's closed form (REFERENCE.md s.4.2)."""
    if p == 0 and d1 == 1 and d2 == 1:
        return None if s <= 0 else ("indet", None)
    a1, a2 = (1 - p) * d1, (1 - p) * d2
    n1 = p * b1 / (1 - a1) if p > 0 else mp.mpf(0)
    n2 = p * b2 / (1 - a2) if p > 0 else mp.mpf(0)
    if s <= n1 + n2:
        return ("nodeal", None)
    # the header states the accuracy relative to the share above the no-deal value
    scale = max(abs(s - n1 - n2), abs(n1), abs(n2))
    if opens:
        return ("ok", n1 + (s - n1 - n2) * (1 - a2) / (1 - a1 * a2), scale)
    return ("ok", s - (n2 + (s - n1 - n2) * (1 - a1) / (1 - a1 * a2)), scale)


def o_deadline(d1, d2, rounds, b1, b2, s, opens):
    """Stahl (1972) by backward induction (REFERENCE.md s.3: the last proposer keeps
    pie - b_responder; earlier proposers offer delta_r x the responder's next share)."""
    t = int(rounds)
    if t == 0:
        return ("nodeal", None)
    if t > 200 or b1 < 0 or b2 < 0 or b1 + b2 >= s or d1 == 0 or d2 == 0:
        return None  # keep to the plain setting of s.3 (b_A + b_B <= pie)
    # proposer in round k (1-based): own when (k odd) == opens
    own_prop = [((k % 2 == 1) == bool(opens)) for k in range(1, t + 1)]
    # the last round
    own = s - b2 if own_prop[-1] else b1
    for k in range(t - 2, -1, -1):
        nxt_own = own
        if own_prop[k]:
            own = s - d2 * (s - nxt_own)
        else:
            own = d1 * nxt_own
    return ("ok", own)


def o_delay(f, stake, p, b):
    """CATALOGUE.md: stake - ((1-p) factor stake + p fallback) (REFERENCE.md s.10)."""
    return ("ok", p * (stake - b) + (1 - p) * (1 - f) * stake)


def o_first(d1, d2, s):
    """REFERENCE.md s.10: surplus (1-d_own)(1-d_oth)/(1-d_own d_oth); Rubinstein (1982)."""
    if d1 == 1 and d2 == 1:
        return None if s <= 0 else ("indet", None)
    if s <= 0:
        return ("nodeal", None)
    return ("ok", s * (1 - d1) * (1 - d2) / (1 - d1 * d2))


def o_nash(b1, b2, tau, s, a1, a2):
    """Nash (1950), generalised (Kalai 1977); linear utilities: b_o + tau (S - b_o - b_t)."""
    if a1 != 1 or a2 != 1:
        return None
    if s <= b1 + b2:
        return ("nodeal", None)
    return ("ok", b1 + tau * (s - b1 - b2))


def o_group(d, n, k, s):
    """Herrero (1985); Sutton (1986): S d^k (1-d)/(1-d^n); n = 1 takes S."""
    n, k = int(n), int(k)
    if k > n - 1:
        raise Invalid("position outside [0, n-1] (header)")
    if d == 1 and n >= 2 and s <= 0:
        return None
    if s <= 0:
        return ("nodeal", None)
    if n == 1:
        return ("ok", s)
    if d == 1:
        return ("indet", None)
    return ("ok", s * mp.power(d, k) * (1 - d) / (1 - mp.power(d, n)))


def o_majority(d, n, q, role, s):
    """Baron & Ferejohn (1989): proposer S (1 - d (q-1)/n), partner S d/n."""
    n, q = int(n), int(q)
    if q == 0:
        q = n // 2 + 1
    if q > n:
        raise Invalid("votes needed above parties (header)")
    if role == 1 and q < 2:
        raise Invalid("no coalition partner when q = 1 (header)")
    if s <= 0:
        return ("nodeal", None)
    if role == 0:
        return ("ok", s * (1 - d * mp.mpf(q - 1) / n))
    return ("ok", s * d / n)


def o_implied(s, d2, opens):
    """Inverse of Rubinstein (1982) with surplus 1 (the header's closed forms)."""
    if d2 == 0 or d2 == 1:
        return None  # the indeterminate edges: not generated here
    if opens:
        if s < 1 - d2:
            raise Invalid("share not reachable (header)")
        # 1 - m with m = (1 - s)(1 - d_oth)/(s d_oth), without cancellation
        return ("ok", (s * d2 - (1 - s) * (1 - d2)) / (s * d2))
    # other opens: 1 - m with m = (1 - s)(1 - d_oth)/(s + (1 - s)(1 - d_oth))
    return ("ok", s / (s + (1 - s) * (1 - d2)))


def o_screen(vh, vl, q, ds, db):
    """Fudenberg & Tirole (1983) setting; REFERENCE.md s.9: max of pool, screen, skim."""
    if vh < vl:
        raise Invalid("high value below low value (header)")
    best = max(vl, q * ((1 - db) * vh + db * vl) + (1 - q) * ds * vl)
    if q > vl / vh:
        best = max(best, vh * ((q * vh - vl) + ds * (1 - q) * vl) / (vh - vl))
    return ("ok", best)


def o_probe(x, y, z, w):
    """DEALCALLPROBE returns its first argument (addin/README.md)."""
    return ("ok", x)


ORACLE = {
    "DEALFACTOR": o_factor, "DEALSHARE": o_share, "DEALSHARERATE": o_share_rates,
    "DEALSHARELIMIT": o_limit, "DEALBREAKDOWN": o_breakdown, "DEALDEADLINE": o_deadline,
    "DEALDELAYCOST": o_delay, "DEALFIRSTMOVER": o_first, "DEALNASH": o_nash,
    "DEALGROUP": o_group, "DEALMAJORITY": o_majority, "DEALIMPLIEDFACTOR": o_implied,
    "DEALSCREEN": o_screen, "DEALCALLPROBE": o_probe,
}


# ---- what the add-in receives, and what it must show --------------------------------
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


# ---- open library issues (reported by the hostile-sheet work, issue 6 part 4) -------
# TODO(lib): each entry is a library defect found by this sheet and reported to the
# core engineer; the cases it covers keep their true expected value and are asserted
# to FAIL still (run_hostile.py treats them as strict expected failures), so the entry
# must be removed here when the library is fixed.
KNOWN = {
    "L1": "lib issue L1: screening_profit rejects values above ~1e154 as invalid "
          "(an intermediate product overflows) although the result is representable",
    "L2": "lib issue L2: majority_share rejects a surplus near the largest double as "
          "invalid (surplus x parties overflows) although the result is representable",
    "L3": "lib issue L3: round_factor with a subnormal basis returns 0 (days/basis "
          "overflows) instead of exp(-log1p(rate) days/basis): a wrong number",
    "L4": "lib issue L4: share_from_rates loses relative accuracy (about 4%) when a "
          "rate x days/basis underflows to a subnormal (other_rate 5e-324, basis 1e300)",
    "L5": "lib issue L5: limit_share loses relative accuracy when other_rate/(sum) is "
          "subnormal (S x (r2/(r1+r2)) instead of (S r2)/(r1+r2))",
}
# The cases of this sheet that fall under an open issue (all of them fail today).
KNOWN_CASES = {
    # L1-L5 fixed in lib (mul_div, ratios formed before scaling); none left.
}


# ---- cases ---------------------------------------------------------------------------
def known(case, code):
    key = KNOWN_CASES.get(case) if code == 0 else None
    return KNOWN[key] if key else None


class Sheet:
    def __init__(self):
        self.rows = []
        self.calls = 0

    def next_row(self):
        return len(self.rows) + 2

    def scalar(self, calc, items, case, exp=None):
        """One formula in one cell.  exp: (code, value, why) to override."""
        r = self.next_row()
        parts, inputs = [], []
        for it in items:
            if it.how == "lit":
                parts.append(it.text)
            elif it.how == "cell":
                parts.append("%s%d" % (fods.INPUT_COLS[len(inputs)], r))
                inputs.append(it.value)
            elif it.how == "omit":
                break  # trailing arguments left out
        if exp is None:
            exp = expect_items(calc, items)
        if exp is None:
            return False
        code, value, why = exp[:3]
        self.rows.append({"case": case, "formula": "=%s(%s)" % (calc, ";".join(parts)),
                          "expected": value if code == 0 else NAMES[code], "code": code,
                          "why": why, "inputs": inputs,
                          "tol": exp[3] if len(exp) > 3 else 1e-13,
                          "known": known(case, code)})
        self.calls += 1
        return True

    def matrix(self, calc, parts_of_row, elements, case, shape=None, n_calls=None):
        """One matrix formula over len(elements) rows (one column).  parts_of_row(r0)
        gives the argument texts; elements: list of (code, value, why, inputs)."""
        r0 = self.next_row()
        parts = parts_of_row(r0)
        for k, el in enumerate(elements):
            code, value, why, inputs = el[:4]
            row = {"case": "%s [%d]" % (case, k + 1), "expected":
                   value if code == 0 else NAMES[code], "code": code, "why": why,
                   "inputs": inputs, "tol": el[4] if len(el) > 4 else 1e-13,
                   "known": known("%s [%d]" % (case, k + 1), code)}
            if k == 0:
                row["formula"] = "=%s(%s)" % (calc, ";".join(parts))
                row["matrix"] = shape or (len(elements), 1)
            self.rows.append(row)
        self.calls += len(elements) if n_calls is None else n_calls


ERROR_INPUTS = [  # (as written, how, expected code, why)
    ("1/0", "lit", 532, "#DIV/0! in the argument is passed on (Calc 7.4, observed)"),
    ("NA()", "lit", 32767, "#N/A in the argument is passed on (Calc 7.4, observed)"),
    ("#REF!", "lit", 524, "#REF! in the argument is passed on (Calc 7.4, observed)"),
    ("=1/0", "cell", 532, "a #DIV/0! cell is passed on (Calc 7.4, observed)"),
    ("=SQRT(-1)", "cell", 502, "a NaN-producing cell is Calc's Err:502, passed on "
     "(Calc 7.4, observed)"),
    ("=NA()", "cell", 32767, "a #N/A cell is passed on (Calc 7.4, observed)"),
    ("=LN(0)", "cell", 502, "LN(0) is Calc's Err:502, passed on (Calc 7.4, observed)"),
]

NUMBERS = [0.0, -0.0, 1.0, -1.0, 0.5, 2.0, 3.5, 1e308, -1e308, DBL_MAX, -DBL_MAX, 1e-300,
           5e-324, -5e-324, 2.2250738585072014e-308, 1e20, -1e20, 1e15, 0.9999999999999999,
           1.0000000000000002, 9.223372036854776e18, 100.0]
LIT_NUMBERS = [0.0, 1.0, -1.0, 0.5, 2.0, 3.5, 1e308, -1e308, 1e20, 1e-300, 1e999]
TEXTS = ["abc", "0.5", "", " ", "TRUE ", "1", "maybe", "chair", "POWER", "Exponential",
         "partner", "OWN", "other", "false", "True", "#N/A", "1e308", "NaN", "inf"]


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


def scalar_cases(sheet):
    for calc, args, base in F:
        n = len(args)
        sheet.scalar(calc, base_items(calc), "%s base call" % calc)
        # trailing optional arguments left out: the catalogue default applies
        first_opt = next((j for j, a in enumerate(args) if a[2] is not None), n)
        for j in range(first_opt, n):
            items = base_items(calc)[:j] + [Item("omit", None)] * (n - j)
            sheet.scalar(calc, items, "%s with arguments %d.. left out (defaults)" % (calc, j + 1))
        for j, a in enumerate(args):
            name = a[0]
            for v in NUMBERS:
                items = base_items(calc)
                items[j] = Item("cell", v)
                sheet.scalar(calc, items, "%s %s = cell %r" % (calc, name, v))
            for v in LIT_NUMBERS:
                items = base_items(calc)
                items[j] = Item("lit", float(v) if v != 1e999 else None, lit_text(v))
                if v == 1e999:  # 1E999 overflows in Calc's parser: #NUM! (Calc 7.4)
                    continue
                sheet.scalar(calc, items, "%s %s = %s" % (calc, name, lit_text(v)))
            for v in (True, False):
                items = base_items(calc)
                items[j] = Item("lit", v, lit_text(v))
                sheet.scalar(calc, items, "%s %s = %s" % (calc, name, lit_text(v)))
                items = base_items(calc)
                items[j] = Item("cell", v)
                sheet.scalar(calc, items, "%s %s = boolean cell %s" % (calc, name, v))
            for t in TEXTS:
                items = base_items(calc)
                items[j] = Item("lit", t, lit_text(t))
                sheet.scalar(calc, items, "%s %s = text %r" % (calc, name, t))
                items = base_items(calc)
                items[j] = Item("cell", t)
                sheet.scalar(calc, items, "%s %s = text cell %r" % (calc, name, t))
            items = base_items(calc)
            items[j] = Item("cell", None)
            ok = sheet.scalar(calc, items, "%s %s = empty cell" % (calc, name))
            if ok:
                sheet.rows[-1]["why"] += ("; an empty cell referred to alone reaches the "
                                          "add-in as 0 (addin/README.md, Calc 7.4 limitation)")
            for text, how, code, why in ERROR_INPUTS:
                items = base_items(calc)
                items[j] = (Item("lit", None, text) if how == "lit"
                            else Item("cell", ("=", text)))
                sheet.scalar(calc, items, "%s %s = %s" % (calc, name, text),
                             exp=(code, None, why))
        # wrong number of arguments: Calc's own check (Calc 7.4, observed)
        req = sum(1 for a in args if a[2] is None)
        if req > 1:
            sheet.scalar(calc, base_items(calc)[:req - 1] + [Item("omit", None)] * (n - req + 1),
                         "%s with too few arguments" % calc,
                         exp=(E_PARAM, None, "too few arguments: Calc's Err:504 (Calc 7.4, observed)"))
        sheet.scalar(calc, base_items(calc) + [Item("lit", 1.0, "1")],
                     "%s with one argument too many" % calc,
                     exp=(E_PARAM, None, "too many arguments: Calc's Err:504 (Calc 7.4, observed)"))


def random_value(rng, kind, arg):
    """A valid value of this kind, sometimes at an edge, sometimes tiny or huge."""
    r = rng.random()
    if kind == UNIT:
        return rng.choice([0.0, 1.0, 5e-324, 1e-300, 0.9999999999999999]) if r < 0.15 \
            else round(rng.uniform(0.05, 0.99), 6)
    if kind == NONNEG:
        return rng.choice([0.0, 5e-324, 1e-300, 1e300]) if r < 0.15 \
            else round(rng.uniform(0.001, 0.5), 6)
    if kind == POS:
        return rng.choice([5e-324, 1e-300, 1e300]) if r < 0.1 \
            else round(rng.uniform(0.5, 400), 4)
    if kind == REAL:
        return rng.choice([0.0, -1.0, 1e-300, 1e300, -1e300, DBL_MAX]) if r < 0.15 \
            else round(rng.uniform(-0.2, 5), 4)
    if kind == BOOL:
        return rng.random() < 0.5
    if kind == COUNT:
        return float(rng.randint(arg[3], 12))
    if kind == CHOICE:
        return rng.choice(arg[3])
    return round(rng.uniform(-1, 3), 4)


def random_cases(sheet, rng, per_function):
    """Valid-looking calls (cells as inputs) with edges, tiny and huge values, for the
    functions with an independent closed form."""
    for calc in ORACLE:
        args = FUN[calc][1]
        made = tries = 0
        while made < per_function and tries < per_function * 20:
            tries += 1
            vals = [random_value(rng, a[1], a) for a in args]
            if calc == "DEALSCREEN" and vals[0] < vals[1]:
                vals[0], vals[1] = vals[1], vals[0]
            if calc in ("DEALGROUP",):
                vals[2] = float(rng.randint(0, int(vals[1]) - 1))
            if calc == "DEALMAJORITY":
                vals[2] = float(rng.randint(0, int(vals[1])))
            if calc == "DEALDEADLINE":
                vals[3], vals[4] = abs(vals[3]) % 0.3, abs(vals[4]) % 0.3
                vals[5] = abs(vals[5]) + 1.0 if abs(vals[5]) < 1e300 else 1.0
            items = [Item("cell", v) for v in vals]
            if sheet.scalar(calc, items, "%s random %d" % (calc, made + 1)):
                made += 1


def matrix_cases(sheet, rng):
    """Whole-column calls: one argument a range of hostile and valid cells, the others
    single values; each element its own value or error (addin/README.md "Whole
    columns").  Inside a range an empty cell of a required argument is Err:502."""
    for calc, args, base in F:
        if calc == "DEALCALLPROBE":
            continue  # the probe reads the first element only (not an array function)
        for j, a in enumerate(args):
            pool = NUMBERS + [True, False, "abc", "0.5", None] + list(
                a[3] if a[1] == CHOICE else []) + (["TRUE", "false"] if a[1] == BOOL else [])
            pool += [random_value(rng, a[1], a) for _ in range(4)]
            elements = []
            for v in pool:
                items = base_items(calc)
                items[j] = Item("cell", v)
                if v is None:
                    exp = (E_INVALID, None, "an empty cell inside a range is Err:502 "
                           "(addin/README.md \"Empty cells\"; for an optional argument as "
                           "well, Calc 7.4 observed)")
                else:
                    exp = expect_items(calc, items)
                if exp is None:
                    continue
                elements.append((exp[0], exp[1], exp[2], [v]) + tuple(exp[3:]))
            if not elements:
                continue

            def parts(r0, j=j, n=len(elements)):
                p = [lit_text(v) for v in base]
                p[j] = "I%d:I%d" % (r0, r0 + n - 1)
                return p
            sheet.matrix(calc, parts, elements, "%s %s as a range" % (calc, args[j][0]))


def range_shape_cases(sheet):
    """Wrong ranges and mismatched shapes (addin/README.md "Whole columns")."""
    for calc, args, base in F:
        if calc == "DEALCALLPROBE" or len(args) < 2:
            continue
        good = expect_items(calc, base_items(calc))
        why_shape = "ranges of different shapes: Err:502 in every element (addin/README.md)"
        # 3x1 against 2x1
        def p1(r0):
            p = [lit_text(v) for v in base]
            p[0], p[1] = "I%d:I%d" % (r0, r0 + 2), "J%d:J%d" % (r0, r0 + 1)
            return p
        sheet.matrix(calc, p1, [(E_INVALID, None, why_shape, [base[0], base[1]])] * 3,
                     "%s 3x1 against 2x1" % calc)
        # 3x1 against 1x3
        def p2(r0):
            p = [lit_text(v) for v in base]
            p[0], p[1] = "I%d:I%d" % (r0, r0 + 2), "J%d:L%d" % (r0, r0)
            return p
        vals = [[base[0], base[1], base[1], base[1]], [base[0]], [base[0]]]
        sheet.matrix(calc, p2, [(E_INVALID, None, why_shape, v) for v in vals],
                     "%s 3x1 against 1x3" % calc)
        # a 1x1 range applies to every element
        if good is not None:
            def p3(r0):
                p = [lit_text(v) for v in base]
                p[0], p[1] = "I%d:I%d" % (r0, r0 + 2), "J%d:J%d" % (r0, r0)
                return p
            sheet.matrix(calc, p3, [(good[0], good[1], good[2] + "; a 1x1 range applies "
                                     "to every element (addin/README.md)",
                                     [base[0], base[1]] if k == 0 else [base[0]])
                                    for k in range(3)], "%s 1x1 range broadcast" % calc)
            # the matrix area is larger than the result: the extra cells are #N/A
            def p4(r0):
                p = [lit_text(v) for v in base]
                p[0] = "I%d:I%d" % (r0, r0 + 1)
                return p
            els = [(good[0], good[1], good[2], [base[0]]), (good[0], good[1], good[2], [base[0]]),
                   (E_NODEAL, None, "a matrix cell outside the result is #N/A (Calc 7.4, "
                    "observed)", []), (E_NODEAL, None, "a matrix cell outside the result is "
                                           "#N/A (Calc 7.4, observed)", [])]
            sheet.matrix(calc, p4, els, "%s matrix area larger than the result" % calc,
                         n_calls=2)
            # a range in a plain cell: the top-left element (Calc 7.4, observed)
            r = sheet.next_row()
            p = [lit_text(v) for v in base]
            p[0] = "I%d:K%d" % (r, r)
            code, value, why = good[:3]
            sheet.rows.append({"case": "%s range in a plain cell" % calc,
                               "formula": "=%s(%s)" % (calc, ";".join(p)),
                               "expected": value if code == 0 else NAMES[code], "code": code,
                               "why": why + "; a range in a plain (non-matrix) cell shows the "
                               "top-left element of the array result (Calc 7.4, observed; not "
                               "documented by the add-in)",
                               "inputs": [base[0], "abc", None]})
            sheet.calls += 1
        # a range holding an error cell: the whole call is Err:504 (Calc 7.4, observed)
        for err in ("=1/0", "=NA()"):
            def p5(r0):
                p = [lit_text(v) for v in base]
                p[0] = "I%d:I%d" % (r0, r0 + 2)
                return p
            why = ("a range holding an error cell (%s): Calc passes no array, the whole "
                   "call is Err:504 (Calc 7.4, observed)" % err)
            sheet.matrix(calc, p5, [(E_PARAM, None, why, [base[0]]),
                                    (E_PARAM, None, why, [("=", err)]),
                                    (E_PARAM, None, why, [base[0]])],
                         "%s range with %s" % (calc, err))


def build():
    rng = random.Random(20261202)
    sheet = Sheet()
    scalar_cases(sheet)
    matrix_cases(sheet, rng)
    range_shape_cases(sheet)
    random_cases(sheet, rng, 260)
    return sheet


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--out", default=OUT, help="where to write (default %(default)s)")
    args = ap.parse_args()
    sheet = build()
    text = fods.document("hostile arguments", sheet.rows, sheet.calls)
    with open(args.out, "w", encoding="utf-8") as f:
        f.write(text)
    codes = {}
    for r in sheet.rows:
        codes[r["code"]] = codes.get(r["code"], 0) + 1
    print("wrote %s: %d cases, %d DEAL... calls; by expected code %s" % (
        args.out, len(sheet.rows), sheet.calls, dict(sorted(codes.items()))))
    return 0


if __name__ == "__main__":
    sys.exit(main())
