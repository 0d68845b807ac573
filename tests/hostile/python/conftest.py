"""Shared helpers for the Python-under-load tests: valid inputs per argument kind.

The argument kinds and domains are those of lib/include/counteroffer/counteroffer.h
(CTO_ARG_*); they are read from the package's catalogue so that every function is
covered; relations between arguments are left to the library's statuses.
"""
import math

import numpy as np
import pytest

import counteroffer as co
from counteroffer._spec import Kind, Status

SPECS = list(co.catalogue)
#: argument kinds by name, from the header's constants (CTO_ARG_*, exported by _core)
KIND = {name.lower(): getattr(Kind, name) for name in
        ("REAL", "UNIT", "NONNEG", "POSITIVE", "BOOL", "COUNT", "CHOICE", "OPTIONAL")}


def _draw(a, n, rng):
    """n values of argument `a` by its kind, away from the edges where a status other
    than ok is likely, inside its plausible range (cto_arg_plausible_range)."""
    k = a.kind
    if k == KIND["unit"]:
        v = rng.uniform(0.05, 0.95, n)
    elif k == KIND["nonneg"]:
        v = rng.uniform(0.01, 0.3, n)
    elif k == KIND["positive"]:
        v = rng.uniform(0.3, 1.0, n) if "curvature" in a.name else rng.uniform(1, 400, n)
    elif k == KIND["bool"]:
        v = rng.integers(0, 2, n).astype(np.float64)
    elif k == KIND["count"]:
        v = rng.integers(max(a.min_count, 1) + 1, 9, n).astype(np.float64)
    elif k == KIND["choice"]:
        v = rng.integers(0, len(a.choices), n).astype(np.float64)
    elif k == KIND["optional"]:
        v = np.full(n, -math.inf)
    else:  # real: money; fallbacks small against the surplus
        v = rng.uniform(1.0, 3.0, n) if a.name == "surplus" else rng.uniform(0, 0.2, n)
    if a.plausible is not None:
        v = np.clip(v, *a.plausible)
    return v


def valid_arrays(spec, n, rng):
    """One valid float64 input per argument (n elements).  Each argument is drawn by its
    kind; relations between arguments (position below parties, a reachable observed
    share, ...) are met by drawing again every element the library calls invalid (its
    status ufunc), so no function needs a rule of its own here."""
    out = [_draw(a, n, rng) for a in spec.args]
    status_ufunc = getattr(co, spec.name).status_ufunc
    for _ in range(200):
        bad = status_ufunc(*out)[-1] == Status.INVALID
        if not bad.any():
            break
        m = int(bad.sum())
        for j, a in enumerate(spec.args):
            out[j][bad] = _draw(a, m, rng)
    return out


@pytest.fixture(params=SPECS, ids=[s.name for s in SPECS])
def spec(request):
    return request.param
