"""Shared helpers for the Python-under-load tests: valid inputs per argument kind.

The argument kinds and domains are those of lib/include/counteroffer/counteroffer.h
(CTO_ARG_*); they are read from the package's catalogue so that every function is
covered, and the domain rules themselves are written out here independently.
"""
import math

import numpy as np
import pytest

import counteroffer as co
from counteroffer._spec import Kind

SPECS = list(co.catalogue)
#: argument kinds by name, from the header's constants (CTO_ARG_*, exported by _core)
KIND = {name.lower(): getattr(Kind, name) for name in
        ("REAL", "UNIT", "NONNEG", "POSITIVE", "BOOL", "COUNT", "CHOICE", "OPTIONAL")}


def valid_arrays(spec, n, rng):
    """One valid float64 input per argument (n elements), away from the edges where a
    status other than ok is likely; counts and relations kept in their documented
    ranges (position < parties, votes_needed <= parties, low_value <= high_value)."""
    out = []
    for a in spec.args:
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
        out.append(v)
    names = [a.name for a in spec.args]
    if "position" in names:
        i, j = names.index("parties"), names.index("position")
        out[j] = np.floor(rng.uniform(0, 1, n) * out[i])
    if "votes_needed" in names:
        i, j = names.index("parties"), names.index("votes_needed")
        out[j] = np.floor(rng.uniform(0, 1, n) * (out[i] + 1))
        # a partner exists only with at least 2 votes needed (header)
        out[j] = np.where(out[j] == 1, 2, out[j])
    if spec.name == "screening_profit":
        out[0], out[1] = np.maximum(out[0], out[1]), np.minimum(out[0], out[1])
    if spec.name == "implied_factor" or spec.name == "implied_rate":
        out[0] = rng.uniform(0.55, 0.95, n)  # a reachable observed share
    return out


@pytest.fixture(params=SPECS, ids=[s.name for s in SPECS])
def spec(request):
    return request.param
