#!/usr/bin/env bash
# Installs the core into a scratch prefix (with the Joe-Kuo notice), then builds and runs
# a consumer twice: once with find_package(counteroffer) and once with pkg-config.
set -euo pipefail
root="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
cmake -S "$root" -B "$work/build" -DCTO_BUILD_TESTS=OFF -DCTO_BUILD_EXAMPLES=OFF >/dev/null
cmake --build "$work/build" -j2 >/dev/null
cmake --install "$work/build" --prefix "$work/prefix" >/dev/null
# The direction numbers' source and licence note is installed (share/doc/counteroffer).
/usr/bin/python3 "$root/tests/install/check-notice.py" "$work/prefix"
lib="$(ls -d "$work"/prefix/lib*/ | head -n1)"
test -L "$lib/libcounteroffer.so.1" || { echo "missing SONAME link libcounteroffer.so.1"; exit 1; }
readelf -d "$lib/libcounteroffer.so" | grep -q 'SONAME.*libcounteroffer.so.1' || { echo "bad SONAME"; exit 1; }
cmake -S "$root/tests/install" -B "$work/consumer" -DCMAKE_PREFIX_PATH="$work/prefix" >/dev/null
cmake --build "$work/consumer" >/dev/null
LD_LIBRARY_PATH="$lib" "$work/consumer/consumer"
export PKG_CONFIG_PATH="$lib/pkgconfig"
# shellcheck disable=SC2046
cc -std=c99 -Wall -Werror "$root/tests/install/consumer.c" -o "$work/pc-consumer" $(pkg-config --cflags --libs counteroffer) -lm
LD_LIBRARY_PATH="$lib" "$work/pc-consumer"
echo "install check: find_package and pkg-config consumers OK"
