#!/usr/bin/env bash
# The C++ core: Catch2 tests (Release), then again under ASan+UBSan.
source "$(dirname "${BASH_SOURCE[0]}")/../lib.sh"
# The benchmarks are built (warnings are errors) so that they keep compiling; they are run
# by hand (DEVELOPERS.md), never timed here.
build_core "$CTO_BUILD/core" -DCTO_BUILD_TESTS=ON -DCTO_BUILD_BENCH=ON
ctest --test-dir "$CTO_BUILD/core" --output-on-failure -j "$(nproc)"
# The README's accuracy table is this run's report (lib/gen/gen_accuracy.py writes it).
/usr/bin/python3 "$CTO_ROOT/lib/gen/gen_accuracy.py" "$CTO_BUILD/core/accuracy-report.tsv" --check
build_core "$CTO_BUILD/asan" -DCTO_BUILD_TESTS=ON -DCTO_SANITIZE=address,undefined \
  -DCMAKE_BUILD_TYPE=RelWithDebInfo
ASAN_OPTIONS=detect_leaks=1:abort_on_error=1 UBSAN_OPTIONS=print_stacktrace=1:halt_on_error=1 \
  ctest --test-dir "$CTO_BUILD/asan" --output-on-failure -j "$(nproc)"
# Install rules: a consumer builds through find_package(counteroffer) and pkg-config.
bash "$CTO_ROOT/tests/install/check-install.sh"
# ThreadSanitizer: every function from two threads at once, compared with a serial run.
build_core "$CTO_BUILD/tsan" -DCTO_BUILD_TESTS=ON -DCTO_BUILD_EXAMPLES=OFF -DCTO_SANITIZE=thread \
  -DCMAKE_BUILD_TYPE=RelWithDebInfo
TSAN_OPTIONS=halt_on_error=1 "$CTO_BUILD/tsan/tests/cpp/cto_tests" '[threads]'
# ABI stability against the committed baseline (abidiff).
bash "$CTO_ROOT/tests/abi/check-abi.sh"
# libFuzzer over every C entry point (ASan + UBSan), a short pass on the committed corpus.
bash "$CTO_ROOT/tests/fuzz/run-fuzz.sh" 60
