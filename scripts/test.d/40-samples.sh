#!/usr/bin/env bash
# The deal-comparison sample sheets: build the Calc add-in (build/samples), install it
# into a private profile, then pytest tests/samples: every sheet recalculates with no
# error cell, writes a non-empty PDF (charts included) and CSV, shows the Python
# package's numbers for the same inputs, and moves as the model says when inputs are
# edited; the formulas survive an office without the add-in.
source "$(dirname "${BASH_SOURCE[0]}")/../lib.sh"
ensure_apt libreoffice-calc-nogui libreoffice-dev libreoffice-dev-common python3-uno zip \
  poppler-utils
ensure_venv
build_core "$CTO_BUILD/samples" -DCTO_BUILD_TESTS=OFF -DCTO_BUILD_ADDIN=ON
OXT="$CTO_BUILD/samples/addin/counteroffer.oxt"
[ -f "$OXT" ] || die "the add-in package was not built: $OXT"
PY="$CTO_VENV/bin/python"
# The cross-checks need the Python package (scripts/test.d/20-python.sh installs it).
if ! "$PY" -c "import counteroffer" 2>/dev/null; then
  say "pip install . (counteroffer Python package, for the cross-checks)"
  "$PY" -m pip install -q --no-build-isolation "$CTO_ROOT"
fi

work="$(mktemp -d "${TMPDIR:-/tmp}/cto_samples_test.XXXXXX")"
trap 'rm -rf "$work"' EXIT
say "installing the add-in into a private profile"
"$CTO_ROOT/scripts/install-addin.sh" --profile "$work/profile" "$OXT"

say "pytest tests/samples"
cd "$CTO_ROOT"
CTO_SAMPLES_PROFILE="$work/profile" CTO_SAMPLES_OUT="$work/out" \
  timeout 900 "$PY" -m pytest -q -p no:cacheprovider tests/samples
