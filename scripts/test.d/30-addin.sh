#!/usr/bin/env bash
# The Calc add-in: build the .oxt (build/addin), test the UNO glue's status mapping,
# install it into a private profile, run every sheet test headless, check the Function Wizard metadata over UNO, and
# the round trip of a saved sheet through an office without the add-in.
source "$(dirname "${BASH_SOURCE[0]}")/../lib.sh"
ensure_apt libreoffice-calc-nogui libreoffice-dev libreoffice-dev-common python3-uno zip
build_core "$CTO_BUILD/addin" -DCTO_BUILD_TESTS=OFF -DCTO_BUILD_ADDIN=ON
OXT="$CTO_BUILD/addin/addin/counteroffer.oxt"
GEN="$CTO_BUILD/addin/addin/generated"
[ -f "$OXT" ] || die "the add-in package was not built: $OXT"

# Debian's Python carries python3-uno; the project venv is built on it.
PY="$CTO_VENV/bin/python"
[ -x "$PY" ] || PY=/usr/bin/python3

say "UNO glue: status mapping and argument conversion"
"$CTO_BUILD/addin/addin/addin_glue_test"

work="$(mktemp -d "${TMPDIR:-/tmp}/cto_addin_test.XXXXXX")"
trap 'rm -rf "$work"' EXIT
say "installing the add-in into a private profile"
"$CTO_ROOT/scripts/install-addin.sh" --profile "$work/profile" "$OXT"

say "sheet tests and Function Wizard metadata"
timeout 600 "$PY" "$CTO_ROOT/tests/sheets/run_sheets.py" --profile "$work/profile" \
  --functions "$GEN/deal_functions.txt" "$CTO_ROOT"/tests/sheets/*.fods

say "saved with the add-in, reopened without it, computed after reinstalling"
timeout 600 "$PY" "$CTO_ROOT/tests/sheets/run_sheets.py" --roundtrip --profile "$work/profile" \
  --bare-profile "$work/bare" --oxt "$OXT" "$CTO_ROOT/tests/sheets/addin_values.fods"

say "removing the add-in again"
"$CTO_ROOT/scripts/install-addin.sh" --remove --profile "$work/profile"
