# The extension module counteroffer._structs (bindings/ext/_structs.cpp).
from typing import Any, Dict, List, Sequence, Tuple

E_PRECISION: int
RANGE_FIXED: int
RANGE_UNIFORM: int
RANGE_TRIANGULAR: int
RANGE_PERT: int
RANGE_INPUTS: int
RANGE_MAX_PROBS: int
RANGE_DEFAULTS: Dict[str, Any]

def share_range(
    args: Sequence[Tuple[int, float, float, float]],
    probabilities: Sequence[float],
    seed: int,
    replicates: int,
    digits: int,
    log2_start: int,
    log2_max: int,
    threads: int,
) -> Dict[str, Any]: ...
def share_swing(args: Sequence[Tuple[int, float, float, float]]) -> Dict[str, Any]: ...
def offer_path_rows(
    private_low: float,
    private_high: float,
    offerer_factor: float,
    responder_factor: float,
    rounds: int,
    known_value: float,
    offerer: int,
    capacity: int,
) -> Tuple[int, Dict[str, Any], List[Tuple[float, float, float, float]]]: ...
