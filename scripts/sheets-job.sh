#!/usr/bin/env bash
# The sample deal sheets, end to end (called by scripts/main-job.sh; usable alone):
#
#   scripts/sheets-job.sh OUTPUT_DIR
#
# builds the Calc add-in (build/samples), installs it into a private LibreOffice
# profile (build/samples/profile, made afresh), recalculates every template in
# sample-sheets/*.fods headless, and writes OUTPUT_DIR/<sheet>.pdf (charts included)
# and OUTPUT_DIR/<sheet>.csv, with one progress line per sheet and a summary table.
# Exits non-zero with a message naming the sheet and cell if any sheet shows an error
# cell or a file could not be produced.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
OUT="${1:?usage: scripts/sheets-job.sh OUTPUT_DIR}"
mkdir -p "$OUT"
OUT="$(cd "$OUT" && pwd)"
ensure_apt libreoffice-calc-nogui libreoffice-dev libreoffice-dev-common python3-uno zip

say "building the Calc add-in (build/samples)"
build_core "$CTO_BUILD/samples" -DCTO_BUILD_TESTS=OFF -DCTO_BUILD_ADDIN=ON
OXT="$CTO_BUILD/samples/addin/counteroffer.oxt"
[ -f "$OXT" ] || die "the add-in package was not built: $OXT"

say "installing the add-in into a private profile"
PROFILE="$CTO_BUILD/samples/profile"
rm -rf "$PROFILE"
"$CTO_ROOT/scripts/install-addin.sh" --profile "$PROFILE" "$OXT"

# Debian's Python carries python3-uno; the project venv is built on it.
PY="$CTO_VENV/bin/python"
[ -x "$PY" ] || PY=/usr/bin/python3
shopt -s nullglob
sheets=("$CTO_ROOT"/sample-sheets/*.fods)
[ "${#sheets[@]}" -gt 0 ] || die "no sample sheets in $CTO_ROOT/sample-sheets"

say "recalculating ${#sheets[@]} sample sheets headless; PDFs and CSVs into $OUT"
timeout 900 "$PY" "$CTO_ROOT/sample-sheets/run_samples.py" --profile "$PROFILE" \
  --out "$OUT" "${sheets[@]}" || die "the sample sheets failed (see the messages above)"
