# The extension module counteroffer._core (bindings/ext/_core.cpp).
from typing import Any, Dict, List, Optional, Tuple

import numpy as np

HEADER_VERSION: str
REPORT_SLOTS: int
OK: int
E_INVALID: int
E_NO_DEAL: int
E_INDETERMINATE: int
E_NO_CONVERGENCE: int
E_INTERNAL: int
ARG_REAL: int
ARG_UNIT: int
ARG_NONNEG: int
ARG_POSITIVE: int
ARG_BOOL: int
ARG_COUNT: int
ARG_CHOICE: int
ARG_OPTIONAL: int
BINDS_NONE: int
BINDS_OWN: int
BINDS_OTHER: int
BINDS_BOTH: int
ufuncs: Dict[str, np.ufunc]
status_ufuncs: Dict[str, np.ufunc]

def version() -> str: ...
def status_name(status: int) -> str: ...
def status_message(status: int) -> str: ...
def catalogue() -> List[Dict[str, Any]]: ...
def call(id: int, args: List[float]) -> Tuple[int, int, Tuple[float, ...]]: ...
def arg_plausible_range(id: int, arg_index: int) -> Optional[Tuple[float, float]]: ...
def explain(id: int, args: List[float]) -> Tuple[int, str]: ...
def set_num_threads(n: int) -> int: ...
def get_num_threads() -> int: ...
def tally_reset() -> None: ...
def tally_take() -> Tuple[Tuple[int, ...], int, float]: ...
