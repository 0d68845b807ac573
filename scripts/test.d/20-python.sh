#!/usr/bin/env bash
# The Python package: its wheel (and sdist, both checked for the Joe-Kuo notice) built
# with the project venv's tools (scripts/requirements.txt, so no build isolation is
# needed) and installed there, then pytest on tests/python (which includes mypy's
# stubtest against the installed module).
source "$(dirname "${BASH_SOURCE[0]}")/../lib.sh"
ensure_venv
# The wheel and the source distribution are built and inspected: each carries the
# direction numbers' source and licence note (tests/install/check-notice.py); the wheel
# is what gets installed.  The sdist is made from the repository's files alone (as from
# a clean clone), so that build trees and the venv inside the checkout stay out of it.
dist="$(mktemp -d "${TMPDIR:-/tmp}/cto_dist.XXXXXX")"
trap 'rm -rf "$dist"' EXIT
say "pip wheel . and the sdist (counteroffer Python package)"
"$CTO_VENV/bin/python" -m pip wheel -q --no-build-isolation --no-deps -w "$dist" "$CTO_ROOT"
mkdir "$dist/src"
git -C "$CTO_ROOT" ls-files -z | (cd "$CTO_ROOT" && xargs -0 cp --parents -t "$dist/src")
(cd "$dist/src" && "$CTO_VENV/bin/python" -c \
  'import sys, scikit_build_core.build as b; b.build_sdist(sys.argv[1])' "$dist" >/dev/null)
"$CTO_VENV/bin/python" "$CTO_ROOT/tests/install/check-notice.py" "$dist"/counteroffer-*.whl \
  "$dist"/counteroffer-*.tar.gz
say "pip install the wheel"
"$CTO_VENV/bin/python" -m pip install -q --no-deps --force-reinstall "$dist"/counteroffer-*.whl
say "pytest tests/python"
cd "$CTO_ROOT"
"$CTO_VENV/bin/python" -m pytest -q -p no:cacheprovider tests/python
# The README's "Python only" command, word for word, in a copy of the tracked files.
say "the README's Python-only path"
bash "$CTO_ROOT/tests/install/check-python-only.sh"
