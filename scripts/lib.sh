# Shared helpers for the project's scripts (sourced, not run).
# Every helper is idempotent: it installs only what is missing.
set -euo pipefail
CTO_ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
CTO_BUILD="${CTO_BUILD:-$CTO_ROOT/build}"
CTO_VENV="${CTO_VENV:-$CTO_ROOT/.venv}"
export LC_ALL=C.UTF-8
# The repository root on PYTHONPATH, so that officekit/ (the office driver and flat-ODF
# writer the sheet tools share) imports cleanly in every script and test part.
export PYTHONPATH="$CTO_ROOT${PYTHONPATH:+:$PYTHONPATH}"

say() { printf '\n== %s\n' "$*"; }
die() { printf 'error: %s\n' "$*" >&2; exit 1; }

# ensure_apt PKG...: install the Debian packages that are not installed yet.
ensure_apt() {
  local missing=()
  local p
  for p in "$@"; do
    dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q 'install ok installed' || missing+=("$p")
  done
  if [ "${#missing[@]}" -gt 0 ]; then
    say "installing Debian packages: ${missing[*]}"
    local sudo=""
    [ "$(id -u)" -eq 0 ] || sudo="sudo"
    $sudo apt-get update -q
    DEBIAN_FRONTEND=noninteractive $sudo apt-get install -y -q --no-install-recommends "${missing[@]}"
  fi
}

# The Debian packages every part of the build and tests needs (one list).
CTO_APT_PACKAGES=(
  build-essential cmake pkg-config catch2 pybind11-dev
  python3 python3-venv python3-dev python3-uno
  clang libclang-rt-14-dev abigail-tools
  libreoffice-calc-nogui libreoffice-dev libreoffice-dev-common
  zip unzip poppler-utils fonts-dejavu-core
)

# ensure_venv: the project's virtual environment, from Debian's Python (which is also
# the interpreter LibreOffice's Python-UNO bridge belongs to), with the pinned tools.
ensure_venv() {
  local stamp="$CTO_VENV/.requirements.sha256"
  local want
  want="$(sha256sum "$CTO_ROOT/scripts/requirements.txt" | cut -d' ' -f1)"
  if [ ! -x "$CTO_VENV/bin/python" ]; then
    say "creating $CTO_VENV"
    /usr/bin/python3 -m venv --system-site-packages "$CTO_VENV"
  fi
  if [ ! -f "$stamp" ] || [ "$(cat "$stamp")" != "$want" ]; then
    say "installing Python tools into $CTO_VENV"
    "$CTO_VENV/bin/python" -m pip install -q --upgrade pip
    "$CTO_VENV/bin/python" -m pip install -q -r "$CTO_ROOT/scripts/requirements.txt"
    echo "$want" > "$stamp"
  fi
}

# build_core DIR [CMAKE ARGS...]: configure and build the C++ tree into DIR.
build_core() {
  local dir="$1"; shift
  cmake -S "$CTO_ROOT" -B "$dir" -DCMAKE_BUILD_TYPE=Release "$@" >/dev/null
  cmake --build "$dir" -j "$(nproc)"
}

# ensure_addin_profile [test]: the Calc add-in built into $CTO_BUILD/addin (incremental)
# and installed into a private LibreOffice profile which every sheet tool shares.
# Without an argument: the shipped extension (counteroffer.oxt, the user functions only,
# what users and the main job get) in $CTO_BUILD/addin/profile.  With "test": the test
# build (counteroffer-test.oxt, which adds the diagnostic DEALCALLPROBE that the sheet
# tests, the hostile sheet and the add-in benchmark call) in $CTO_BUILD/addin/profile-test.
# Sets CTO_ADDIN_BUILD, CTO_ADDIN_GEN (its generated sources), CTO_OXT and CTO_PROFILE.
# Idempotent: a profile is made afresh only when its .oxt differs from the one installed
# (a checksum beside the profile), so the test parts and the main job install it once.
# Every office starts on a private copy of it (officekit/office.py), so they may run at
# once.
ensure_addin_profile() {
  local variant="${1:-shipped}"
  ensure_apt "${CTO_APT_PACKAGES[@]}"
  CTO_ADDIN_BUILD="$CTO_BUILD/addin"
  say "the Calc add-in ($CTO_ADDIN_BUILD, $variant build)"
  build_core "$CTO_ADDIN_BUILD" -DCTO_BUILD_TESTS=OFF -DCTO_BUILD_ADDIN=ON
  case "$variant" in
    shipped)
      CTO_ADDIN_GEN="$CTO_ADDIN_BUILD/addin/generated"
      CTO_OXT="$CTO_ADDIN_BUILD/addin/counteroffer.oxt"
      CTO_PROFILE="$CTO_ADDIN_BUILD/profile" ;;
    test)
      cmake --build "$CTO_ADDIN_BUILD" -j "$(nproc)" --target counteroffer_test_oxt
      CTO_ADDIN_GEN="$CTO_ADDIN_BUILD/addin/test/generated"
      CTO_OXT="$CTO_ADDIN_BUILD/addin/test/counteroffer-test.oxt"
      CTO_PROFILE="$CTO_ADDIN_BUILD/profile-test" ;;
    *) die "ensure_addin_profile: unknown build '$variant' (give none, or test)" ;;
  esac
  [ -f "$CTO_OXT" ] || die "the add-in package was not built: $CTO_OXT"
  local want stamp="$CTO_PROFILE.oxt.sha256"
  want="$(sha256sum "$CTO_OXT" | cut -d' ' -f1)"
  if [ ! -d "$CTO_PROFILE" ] || [ "$(cat "$stamp" 2>/dev/null)" != "$want" ]; then
    say "installing the add-in into the private profile $CTO_PROFILE"
    rm -rf "$CTO_PROFILE" "$stamp"
    "$CTO_ROOT/scripts/install-addin.sh" --profile "$CTO_PROFILE" "$CTO_OXT"
    echo "$want" > "$stamp"
  fi
}

# ensure_package: the counteroffer Python package in the project venv (the sheet tools
# read the library's table through it; scripts/test.d/20-python.sh installs it too).
ensure_package() {
  ensure_venv
  if ! "$CTO_VENV/bin/python" -c "import counteroffer" 2>/dev/null; then
    say "pip install . (counteroffer Python package)"
    "$CTO_VENV/bin/python" -m pip install -q --no-build-isolation "$CTO_ROOT"
  fi
}
