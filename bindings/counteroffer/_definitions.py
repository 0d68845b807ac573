"""The functions' one definition as data: definitions.json, which the build writes from
lib/functions/*.toml beside the library's table and installs in this package.

The C table (``_core.catalogue()``) carries everything a double can say; this file adds
what Python needs beyond it: each function's worked example, and which defaults mean
"absent" (majority_share's votes_needed = None, a simple majority).
"""

from __future__ import annotations

import importlib.resources
import json
from typing import Any, Dict


_CACHE: Dict[str, Dict[str, Dict[str, Any]]] = {}


def definitions() -> Dict[str, Dict[str, Any]]:
    """name -> the function's definition; empty when the package has no build data."""
    if "all" not in _CACHE:
        _CACHE["all"] = _read()
    return _CACHE["all"]


def _read() -> Dict[str, Dict[str, Any]]:
    try:
        text = importlib.resources.files(__package__).joinpath("definitions.json").read_text(
            encoding="utf-8")
    except (FileNotFoundError, OSError):
        return {}
    return {f["name"]: f for f in json.loads(text)["functions"]}
