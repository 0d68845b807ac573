"""Worked examples of the catalogue functions, read from the functions' one definition.

Each function's definition (lib/functions/<name>.toml) holds its example: a fictional
scenario of our own and doctest lines whose expected output was worked out by hand
from the function's formula.  The build writes the definitions as data
(definitions.json, installed in this package); this module reads the examples from
there, keyed by the function's name in the library's table.
"""

from __future__ import annotations

from typing import Dict, NamedTuple

from ._definitions import definitions


class Example(NamedTuple):
    scenario: str
    python: str


def _load() -> Dict[str, Example]:
    out: Dict[str, Example] = {}
    for name, f in definitions().items():
        example = f.get("example") or {}
        if example.get("scenario") and example.get("python"):
            out[name] = Example(example["scenario"], example["python"])
    return out


#: name -> Example, for every function whose definition has one.
EXAMPLES: Dict[str, Example] = _load()
