#!/usr/bin/env bash
# The sample deal sheets, end to end (called by scripts/main-job.sh; usable alone):
#
#   scripts/sheets-job.sh OUTPUT_DIR
#
# builds the Calc add-in and installs it into the shared private profile
# (ensure_addin_profile in scripts/lib.sh), recalculates every template in
# sample-sheets/*.fods headless, and writes OUTPUT_DIR/<sheet>.pdf (the report, charts
# included), OUTPUT_DIR/<sheet>.csv and the frozen copies OUTPUT_DIR/<sheet>-values.xlsx
# and .ods for colleagues without the add-in; the blank template deal_template.fods is
# copied there with its PDF.  One progress line per sheet and a summary table.  Exits
# non-zero with a message naming the sheet and cell if any sheet shows an error cell,
# fails its input check, or a file could not be produced.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
OUT="${1:?usage: scripts/sheets-job.sh OUTPUT_DIR}"
mkdir -p "$OUT"
OUT="$(cd "$OUT" && pwd)"
ensure_venv
ensure_addin_profile

PY="$CTO_VENV/bin/python"
shopt -s nullglob
sheets=("$CTO_ROOT"/sample-sheets/*.fods)
[ "${#sheets[@]}" -gt 0 ] || die "no sample sheets in $CTO_ROOT/sample-sheets"

say "recalculating ${#sheets[@]} sample sheets headless; reports, CSVs and frozen copies into $OUT"
timeout 900 "$PY" "$CTO_ROOT/sample-sheets/run_samples.py" --profile "$CTO_PROFILE" \
  --out "$OUT" "${sheets[@]}" || die "the sample sheets failed (see the messages above)"
