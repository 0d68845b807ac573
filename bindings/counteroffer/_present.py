"""Python-only presentation of the library's table: what a double cannot say.

Everything here is about how Python shows a value, never about what is valid.
"""

from typing import Any, Dict, Tuple

#: Python defaults the table's double cannot express: name -> (Python default, the
#: double passed to the library for it).  CATALOGUE.md: votes_needed=None means a
#: simple majority, which the C table encodes as 0.
# TODO(lib): the table could mark "0 means absent" for a count argument so that this
# row-specific entry is not needed (reported to the core engineer).
DEFAULT_OVERRIDES: Dict[str, Dict[str, Tuple[Any, float]]] = {
    "majority_share": {"votes_needed": (None, 0.0)},
}

#: Outputs that are codes, shown as names in scalar results (CTO_BINDS_* in the header).
OUTPUT_CODES: Dict[str, Tuple[str, ...]] = {
    "binding": ("none", "own", "other", "both"),
}

#: Outputs that are 0/1 flags, shown as bool in scalar results.
OUTPUT_BOOL = frozenset({"rational"})
