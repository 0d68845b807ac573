# Ranges under uncertainty, the offer path's rows and the plot helpers (bindings/counteroffer
# _distributions, _range_results, _ranges, _offers, _plots): appended by gen_stubs.py.
_Input = Union[_Real, bool, None, Tuple[_Real, _Real], Tuple[_Real, _Real, _Real], List[_Real], Distribution]
PLOT_PROBABILITIES: Tuple[float, ...]

@dataclass(frozen=True)
class Distribution:
    shape: str
    low: float
    mode: Optional[float]
    high: float

def uniform(low: float, high: float) -> Distribution: ...
def triangular(low: float, mode: float, high: float) -> Distribution: ...
def pert(low: float, mode: float, high: float) -> Distribution: ...

@dataclass(frozen=True)
class Estimate:
    value: float
    se: float
    half_width: float
    digits: int

@dataclass(frozen=True)
class RangeResult:
    probabilities: Tuple[float, ...]
    own: Tuple[Estimate, ...]
    other: Tuple[Estimate, ...]
    own_mean: Estimate
    other_mean: Estimate
    p_rational: Estimate
    p_own_binds: Estimate
    p_other_binds: Estimate
    edge_fraction: Estimate
    points_per_replicate: int
    replicates: int
    dimension: int
    spec_version: int
    status: str
    precision_reached: bool
    inputs: Tuple[Tuple[str, Any], ...] = ...
    reason: str = ...
    def quantile(self, p: float) -> Estimate: ...
    def to_frame(self) -> Any: ...

@dataclass(frozen=True)
class SwingRow:
    input: str
    low: float
    high: float
    at_low: float
    at_high: float
    swing: float
    status_low: str
    status_high: str

@dataclass(frozen=True)
class SwingResult:
    base: float
    base_status: str
    rows: Tuple[SwingRow, ...]
    reason: str = ...
    def to_frame(self) -> Any: ...

def share_range(
    own_rate: _Input,
    other_rate: _Input,
    days: _Input,
    breakdown_prob: _Input = 0,
    own_fallback: _Input = 0,
    other_fallback: _Input = 0,
    own_inside: _Input = 0,
    other_inside: _Input = 0,
    own_outside: _Input = None,
    other_outside: _Input = None,
    surplus: _Input = 1,
    own_opens: _Input = True,
    basis: _Input = 365,
    continuous: _Input = False,
    *,
    shape: str = 'pert',
    probabilities: Any = (0.1, 0.5, 0.9),
    seed: int = 0,
    replicates: int = 16,
    digits: int = 3,
    log2_start: int = 10,
    log2_max: int = 20,
    threads: int = 1,
) -> RangeResult: ...
def share_swing(
    own_rate: _Input,
    other_rate: _Input,
    days: _Input,
    breakdown_prob: _Input = 0,
    own_fallback: _Input = 0,
    other_fallback: _Input = 0,
    own_inside: _Input = 0,
    other_inside: _Input = 0,
    own_outside: _Input = None,
    other_outside: _Input = None,
    surplus: _Input = 1,
    own_opens: _Input = True,
    basis: _Input = 365,
    continuous: _Input = False,
    *,
    shape: str = 'pert',
) -> SwingResult: ...

@dataclass(frozen=True)
class OfferPathRows:
    totals: Any
    offer: np.ndarray[Any, Any]
    cutoff: np.ndarray[Any, Any]
    round_probability: np.ndarray[Any, Any]
    cumulative_probability: np.ndarray[Any, Any]
    days: Optional[float]
    complete: bool
    @property
    def rounds(self) -> np.ndarray[Any, Any]: ...
    @property
    def day(self) -> Optional[np.ndarray[Any, Any]]: ...
    def to_frame(self) -> Any: ...

def offer_path_rows(
    private_low: float,
    private_high: float,
    offerer_factor: float,
    responder_factor: float,
    rounds: int = 0,
    known_value: float = 0.0,
    offerer: str = 'seller',
    *,
    days: Optional[float] = None,
    max_rows: int = 10000,
) -> OfferPathRows: ...

def plot_share_range(result: RangeResult, marks: Sequence[float] = (0.1, 0.5, 0.9), ax: Any = None, title: Optional[str] = None) -> Any: ...
def plot_swing(result: SwingResult, ax: Any = None, title: Optional[str] = None) -> Any: ...
def plot_offer_path(path: OfferPathRows, ax: Any = None, title: Optional[str] = None) -> Tuple[Any, Any]: ...
