#!/usr/bin/env bash
# The main job on a fresh Debian 12 machine (or again on a used one): install what is
# missing, build, and produce the deal comparisons with a report in out/.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
ensure_apt "${CTO_APT_PACKAGES[@]}"
OUT="${CTO_OUT:-$CTO_ROOT/out}"
mkdir -p "$OUT"
say "building the core and the example programs"
build_core "$CTO_BUILD/main" -DCTO_BUILD_TESTS=OFF -DCTO_BUILD_EXAMPLES=ON
say "deal comparison from the C interface (fictional scenario)"
"$CTO_BUILD/main/deal_comparison" | tee "$OUT/deal_comparison.txt"
# The sample deal sheets: the add-in is built and installed into a private profile, every
# sheet is recalculated headless and exported (PDF and CSV), with a summary table; any
# error cell or missing output fails the job.
ensure_venv
bash "$CTO_ROOT/scripts/sheets-job.sh" "$OUT"
say "done: results in $OUT"
