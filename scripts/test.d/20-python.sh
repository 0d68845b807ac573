#!/usr/bin/env bash
# The Python package: pip install . into the project venv (which holds the build tools
# from scripts/requirements.txt, so no build isolation is needed), then pytest on
# tests/python (which includes mypy's stubtest against the installed module).
source "$(dirname "${BASH_SOURCE[0]}")/../lib.sh"
ensure_venv
say "pip install . (counteroffer Python package)"
"$CTO_VENV/bin/python" -m pip install -q --no-build-isolation "$CTO_ROOT"
say "pytest tests/python"
cd "$CTO_ROOT"
"$CTO_VENV/bin/python" -m pytest -q -p no:cacheprovider tests/python
# The README's "Python only" command, word for word, in a copy of the tracked files.
say "the README's Python-only path"
bash "$CTO_ROOT/tests/install/check-python-only.sh"
