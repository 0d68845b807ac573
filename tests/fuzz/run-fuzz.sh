#!/usr/bin/env bash
# Builds the libFuzzer harness with clang (ASan + UBSan; -ffp-contract=off as the library
# build has) and runs it on the committed
# corpus.  Usage: run-fuzz.sh [max_total_time_seconds] [extra libFuzzer flags...]
# CI runs a short pass; a long pass (for example -runs=100000000 -jobs=2) is run by hand.
set -euo pipefail
root="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
out="${CTO_BUILD:-$root/build}/fuzz-${CTO_FUZZ_SANITIZE-address,undefined}"
mkdir -p "$out"
seconds="${1:-60}"
shift || true
# With no extra flags (CI), the run is deterministic: a fixed seed and a fixed number of
# executions after the committed corpus, so a green run here is green in CI.
if [ "$#" -eq 0 ]; then set -- -seed=20261202 -runs=400000; fi
# CTO_FUZZ_SANITIZE: sanitizers besides the fuzzer (default address,undefined).  The long
# run may use undefined alone, or none (CTO_FUZZ_SANITIZE=): the library allocates nothing,
# and the contract checks in the harness are what the run is for.
san="${CTO_FUZZ_SANITIZE-address,undefined}"
# The catalogue's generated sources (named functions, table rows, the named dispatch).
/usr/bin/python3 "$root/lib/gen/gen_core.py" "$out/generated"
mapfile -t sources < <(find "$root/lib/src" -name '*.cpp' | sort)
# Warnings are errors here too (clang sees what GCC does not).
clang++ -std=c++17 -O2 -g -fno-omit-frame-pointer -ffp-contract=off -Wall -Wextra -Werror \
  -fsanitize=fuzzer${san:+,$san} -fno-sanitize-recover=all \
  -I"$root/lib/include" -I"$root/lib/src" -I"$out/generated" "${sources[@]}" \
  "$out/generated/named_entries.cpp" "$root/tests/fuzz/fuzz_capi.cpp" \
  -o "$out/fuzz_capi"
corpus="$root/tests/fuzz/corpus"
mkdir -p "$corpus"
work="$out/corpus"
mkdir -p "$work"
# New inputs go to the scratch folder; the committed corpus is only read (merge by hand:
#   fuzz_capi -merge=1 tests/fuzz/corpus <scratch folder>).
"$out/fuzz_capi" -max_total_time="$seconds" -print_final_stats=1 -artifact_prefix="$out/" \
  "$@" "$work" "$corpus"
