"""Why a call gives what it gives, in the library's words (``cto_explain``).

The library words every reason (the argument and its rule, a value the other arguments
rule out, no deal with the no-deal payoffs, indeterminate); this module only asks it,
for one element, and trims the text to fit the package's messages.
"""

from __future__ import annotations

import re
from typing import Any, Optional, Sequence, Tuple

import numpy as np

from . import _core
from ._spec import FunctionSpec


def explain(spec: FunctionSpec, args: Sequence[float]) -> str:
    """The library's reason for these arguments (every one given, as doubles)."""
    return _core.explain(spec.id, [float(a) for a in args])[1]


def invalid_reason(spec: FunctionSpec, j: int, args: Sequence[float]) -> str:
    """Why argument j is invalid, without the "<name> = <value>" the message already has:
    "outside 0 to 1", "does not fit the other arguments or the model's range (...)"."""
    text = explain(spec, args)
    name = re.escape(spec.args[j].name)
    return re.sub(rf"^{name}(?: = \S+)? (?:is )?", "", text)


def element(vals: Sequence[Any], shape: Tuple[int, ...],
            where: Tuple[int, ...]) -> Optional[list]:
    """The doubles of one element of a broadcast call, or None when the arguments are not
    plain arrays (an xarray DataArray broadcasts by name, not by position)."""
    out = []
    for v in vals:
        if not isinstance(v, (np.ndarray, float, int, np.floating, np.integer)):
            return None
        a = np.asarray(v, dtype=np.float64)
        out.append(float(a) if a.ndim == 0 else float(np.broadcast_to(a, shape)[where]))
    return out
