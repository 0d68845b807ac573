#!/usr/bin/env bash
# ABI stability of the public C interface: compares the shared library built now with the
# committed baseline (abidiff from Debian's abigail-tools).  Fails on an incompatible
# change (abidiff exit bit 8) or an error; additions (new functions) are compatible.
#   --update   rewrite the baseline after a deliberate, versioned change.
set -euo pipefail
root="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
build="${CTO_BUILD:-$root/build}/abi"
baseline="$root/tests/abi/libcounteroffer.abi"
cmake -S "$root" -B "$build" -DCMAKE_BUILD_TYPE=RelWithDebInfo -DCTO_BUILD_TESTS=OFF \
  -DCTO_BUILD_EXAMPLES=OFF >/dev/null
cmake --build "$build" -j2 --target counteroffer >/dev/null
so="$build/lib/libcounteroffer.so"
current="$build/libcounteroffer.abi"
abidw --headers-dir "$root/lib/include/counteroffer" --no-corpus-path --out-file "$current" "$so"
if [ "${1:-}" = "--update" ]; then
  cp "$current" "$baseline"
  echo "ABI baseline updated: $baseline"
  exit 0
fi
set +e
abidiff --headers-dir2 "$root/lib/include/counteroffer" "$baseline" "$current"
rc=$?
set -e
if (( rc & 1 )) || (( rc & 2 )); then echo "abidiff failed (exit $rc)"; exit 1; fi
if (( rc & 8 )); then echo "INCOMPATIBLE change to the C ABI (see above)"; exit 1; fi
if (( rc & 4 )); then echo "compatible ABI change (additions): consider --update with a minor version bump"; fi
echo "ABI check: compatible with the baseline"
