#!/usr/bin/env bash
# Hostile input (issue 6, parts 4 and 5):
#  1. the Calc add-in's test build, in its shared private profile (ensure_addin_profile
#     test: the sheet calls the diagnostic DEALCALLPROBE too), recalculates
#     a generated sheet of more than 10,000 DEAL... calls with hostile arguments
#     headless; every cell is its expected value or error code, a watchdog turns a hang
#     into a failure, and LibreOffice must exit cleanly (tests/hostile/run_hostile.py);
#  2. the Python package under load: threads against serial calls (bitwise), the GIL
#     released (speed-up of 2 threads), 10^8-element arrays without copies (peak RSS),
#     and a hypothesis run of hostile inputs over every function (tests/hostile/python).
source "$(dirname "${BASH_SOURCE[0]}")/../lib.sh"
ensure_package
ensure_addin_profile test
PY="$CTO_VENV/bin/python"
work="$(mktemp -d "${TMPDIR:-/tmp}/cto_hostile_test.XXXXXX")"
trap 'rm -rf "$work"' EXIT

say "hostile sheet: generate, recalculate headless, check every cell and a clean exit"
"$PY" "$CTO_ROOT/tests/hostile/make_hostile.py" --out "$work/hostile.fods"
timeout 600 "$PY" "$CTO_ROOT/tests/hostile/run_hostile.py" --profile "$CTO_PROFILE" \
  --deadline 300 "$work/hostile.fods"

say "Python under load: threads, the GIL, 10^8 elements, hypothesis"
cd "$CTO_ROOT"
timeout 900 "$PY" -m pytest -q -p no:cacheprovider tests/hostile/python
