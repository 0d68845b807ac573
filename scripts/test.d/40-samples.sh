#!/usr/bin/env bash
# The deal-comparison sample sheets, with the add-in in the shared private profile
# (ensure_addin_profile): pytest tests/samples: every sheet recalculates with no error
# cell, writes a non-empty PDF (charts included), CSV and shareable copies, shows the
# Python package's numbers for the same inputs, and moves as the model says when inputs
# are edited; the formulas survive an office without the add-in.
source "$(dirname "${BASH_SOURCE[0]}")/../lib.sh"
ensure_package
ensure_addin_profile
PY="$CTO_VENV/bin/python"
work="$(mktemp -d "${TMPDIR:-/tmp}/cto_samples_test.XXXXXX")"
trap 'rm -rf "$work"' EXIT
say "pytest tests/samples"
cd "$CTO_ROOT"
CTO_SAMPLES_PROFILE="$CTO_PROFILE" CTO_SAMPLES_OUT="$work/out" \
  timeout 900 "$PY" -m pytest -q -p no:cacheprovider tests/samples
