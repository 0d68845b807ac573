#!/usr/bin/env bash
# The Calc add-in: build the shipped .oxt and the test build, check what the shipped one
# holds (no diagnostic function, #N/A explained, the caution once), install the test
# build into its shared private profile (ensure_addin_profile test: the sheets call the
# diagnostic DEALCALLPROBE), test the UNO glue's status mapping, run every sheet test
# headless, check the Function Wizard metadata over UNO, and the round trip of a saved
# sheet through an office without the add-in (install and remove on that profile).
source "$(dirname "${BASH_SOURCE[0]}")/../lib.sh"
ensure_venv
ensure_addin_profile test
GEN="$CTO_ADDIN_GEN"
PY="$CTO_VENV/bin/python"

say "the shipped extension: no diagnostic function, #N/A explained, the caution once"
"$PY" "$CTO_ROOT/tests/sheets/check_oxt.py" "$CTO_ADDIN_BUILD/addin/counteroffer.oxt" \
  --test-build "$CTO_OXT"

say "the shipped .oxt and the test build carry the direction numbers' source and licence note"
/usr/bin/python3 "$CTO_ROOT/tests/install/check-notice.py" \
  "$CTO_ADDIN_BUILD/addin/counteroffer.oxt" "$CTO_OXT"

say "UNO glue: status mapping and argument conversion"
"$CTO_ADDIN_BUILD/addin/addin_glue_test"

work="$(mktemp -d "${TMPDIR:-/tmp}/cto_addin_test.XXXXXX")"
trap 'rm -rf "$work"' EXIT

say "sheet tests and Function Wizard metadata"
timeout 600 "$PY" "$CTO_ROOT/tests/sheets/run_sheets.py" --profile "$CTO_PROFILE" \
  --functions "$GEN/deal_functions.txt" "$CTO_ROOT"/tests/sheets/*.fods

say "saved with the add-in, reopened without it, computed after reinstalling"
timeout 600 "$PY" "$CTO_ROOT/tests/sheets/run_sheets.py" --roundtrip --profile "$CTO_PROFILE" \
  --bare-profile "$work/bare" --oxt "$CTO_OXT" "$CTO_ROOT/tests/sheets/addin_values.fods"

say "removing the add-in again (from the round trip's profile)"
"$CTO_ROOT/scripts/install-addin.sh" --remove --profile "$work/bare"
"$CTO_ROOT/scripts/install-addin.sh" --list --profile "$work/bare" | grep -q org.counteroffer.calc \
  && die "the add-in is still listed after --remove"
true
