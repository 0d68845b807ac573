"""Why an argument value is invalid, in words, for the error messages.

The library decides validity (it reports the first invalid argument of each element);
this module only words the reason.  When the value lies inside its kind's documented
domain (CTO_ARG_* in the public header), the library rejected it together with the
other arguments, and the message says so, with the row's own words on invalid input
(for implied_factor: a share no factor from 0 to 1 can produce).
"""

from __future__ import annotations

import math
import re
from typing import Any, Optional

from ._spec import ArgSpec, FunctionSpec, Kind


def _in_kind_domain(arg: ArgSpec, x: float) -> bool:
    """The value satisfies the domain its kind documents in the header."""
    if arg.kind == Kind.OPTIONAL and x == -math.inf:
        return True
    if not math.isfinite(x):
        return False
    if arg.kind == Kind.UNIT:
        return 0.0 <= x <= 1.0
    if arg.kind == Kind.NONNEG:
        return x >= 0.0
    if arg.kind == Kind.POSITIVE:
        return x > 0.0
    if arg.kind == Kind.BOOL:
        return x in (0.0, 1.0)
    if arg.kind == Kind.COUNT:
        return x == math.floor(x) and x >= arg.min_count
    if arg.kind == Kind.CHOICE:
        return x == math.floor(x) and 0 <= x < len(arg.choices)
    return True


def _row_invalid_text(spec: FunctionSpec) -> Optional[str]:
    """The row's own words on invalid input: "invalid (unreachable share)" -> the text."""
    found = re.search(r"invalid \(([^)]*)\)", spec.statuses)
    return found.group(1) if found else None


def reason(spec: FunctionSpec, j: int, value: Any) -> str:
    """Why argument j with this value is invalid (the library said it is)."""
    arg = spec.args[j]
    try:
        x = float(value)
    except (TypeError, ValueError):
        return arg.help
    if not _in_kind_domain(arg, x):
        return arg.help
    row = _row_invalid_text(spec)
    if row:
        result = spec.summary.split(" that ")[0] if " that " in spec.summary else "result"
        return (f"{row}: no {result} is consistent with this {arg.label.lower()} and the "
                f"other arguments; {arg.help}")
    return f"not allowed with the other arguments; {arg.help}"
