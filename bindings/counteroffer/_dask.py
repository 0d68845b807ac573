"""Lazy evaluation over dask arrays and dask DataFrame columns.

The graph evaluates each chunk with the NumPy path and the error policy in force when
the graph was built; an error's position counts from the start of the whole array
(the chunk's place is added).  Works on any scheduler, dask.distributed included: a
chunk's function carries everything it needs.
"""

from __future__ import annotations

from typing import Any, Dict, List, Sequence

import numpy as np

from . import _errors, _present
from ._results import ArrayResult
from ._spec import FunctionSpec


def _origin(block_info: Any, ndim: int) -> Any:
    if not block_info or None not in block_info:
        return None
    return tuple(int(start) for start, _stop in block_info[None]["array-location"][:ndim])


def _chunk_function(spec: FunctionSpec, vals: Sequence[Any], positions: List[int],
                    policy: Dict[str, str], ndim: int) -> Any:
    from ._evaluate import evaluate_array

    multi = len(spec.outputs) > 1

    def chunk(*blocks: Any, block_info: Any = None) -> Any:
        full = list(vals)
        for j, b in zip(positions, blocks):
            full[j] = b
        with _errors.errstate(**policy):
            r = evaluate_array(spec, full, origin=_origin(block_info, ndim))
        return np.stack(r, axis=-1) if multi else r

    return chunk


def evaluate_lazy(spec: FunctionSpec, vals: Sequence[Any]) -> Any:
    """A dask array (one output) or an ArrayResult of dask arrays."""
    import dask.array as da

    positions = [j for j, v in enumerate(vals) if np.ndim(v) != 0]
    arrays = da.broadcast_arrays(*(da.asarray(vals[j]) for j in positions))
    pairs: List[Any] = []
    for a in arrays:
        pairs += [a, tuple(range(a.ndim))]
    _chunks, arrays = da.core.unify_chunks(*pairs)
    ndim = arrays[0].ndim
    chunk = _chunk_function(spec, vals, positions, _errors.geterr(), ndim)
    names = spec.output_names
    if len(names) == 1:
        return da.map_blocks(chunk, *arrays, dtype=np.float64)
    # one evaluation for all outputs: a stacked block with the outputs on a new last axis
    stacked = da.map_blocks(chunk, *arrays, dtype=np.float64, new_axis=ndim,
                            chunks=arrays[0].chunks + ((len(names),),))
    return ArrayResult({n: _present.array(spec.words(k), stacked[..., k])
                        for k, n in enumerate(names)})


def _meta(spec: FunctionSpec) -> Any:
    import pandas as pd  # type: ignore[import-untyped,unused-ignore]

    if len(spec.outputs) == 1:
        return pd.Series([], dtype=np.float64, name=spec.name)
    columns: Dict[str, Any] = {name: pd.Series([], dtype=_present.dtype(spec.words(k)))
                               for k, name in enumerate(spec.output_names)}
    return pd.DataFrame(columns)


def evaluate_frame(spec: FunctionSpec, fn: Any, values: Sequence[Any]) -> Any:
    """dask DataFrame columns in: a dask Series (or DataFrame for several outputs) out,
    partition by partition through the pandas path (errors name the row's index label)."""
    import dask.dataframe as dd

    policy = _errors.geterr()
    positions = [j for j, v in enumerate(values) if isinstance(v, dd.Series)]

    def partition(*parts: Any) -> Any:
        full = list(values)
        for j, p in zip(positions, parts):
            full[j] = p
        with _errors.errstate(**policy):
            return fn(*full)

    return dd.map_partitions(partition, *[values[j] for j in positions], meta=_meta(spec))
