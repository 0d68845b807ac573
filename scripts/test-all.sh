#!/usr/bin/env bash
# Every test of the project, on a fresh Debian 12 machine or again on a used one.
# Installs what is missing (Debian packages, the project venv), builds, then runs each
# part in scripts/test.d/ in order.  Exits non-zero if any part fails.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
ensure_apt "${CTO_APT_PACKAGES[@]}"
ensure_venv
failed=()
for part in "$CTO_ROOT"/scripts/test.d/*.sh; do
  say "test part: $(basename "$part")"
  if ! bash "$part"; then failed+=("$(basename "$part")"); fi
done
if [ "${#failed[@]}" -gt 0 ]; then
  printf '\nFAILED parts: %s\n' "${failed[*]}" >&2
  exit 1
fi
printf '\nall test parts passed\n'
