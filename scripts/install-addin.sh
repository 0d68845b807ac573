#!/usr/bin/env bash
# Install or remove the counteroffer Calc add-in (.oxt) with LibreOffice's unopkg.
#
#   scripts/install-addin.sh [--remove] [--profile DIR] [OXT]
#
#   OXT            the package (default: build/addin/addin/counteroffer.oxt)
#   --profile DIR  a private LibreOffice profile (-env:UserInstallation) instead of
#                  the current user's own profile
#   --remove       remove the add-in instead of installing it
#   --list         list what is installed in the profile
#
# unopkg refuses to run as root unless it changes the office installation for all
# users (--shared).  Run as root, this script therefore runs unopkg as the
# unprivileged user "nobody" on a copy of the profile in a folder nobody owns, and
# copies the result back (owned as before), so root's own or a private profile is
# changed and the office installation is not.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export LC_ALL=C.UTF-8
action=add
profile=""
oxt="$ROOT/build/addin/addin/counteroffer.oxt"
while [ $# -gt 0 ]; do
  case "$1" in
    --remove) action=remove ;;
    --list) action=list ;;
    --profile) profile="$2"; shift ;;
    -h|--help) sed -n '2,17p' "$0"; exit 0 ;;
    *) oxt="$1" ;;
  esac
  shift
done
ID=org.counteroffer.calc
UNOPKG="$(command -v unopkg || echo /usr/lib/libreoffice/program/unopkg)"
[ -x "$UNOPKG" ] || { echo "error: unopkg not found (install libreoffice-calc-nogui)" >&2; exit 1; }

if [ -z "$profile" ]; then
  # The user's own profile, where soffice looks by default.
  profile="${XDG_CONFIG_HOME:-$HOME/.config}/libreoffice/4"
fi
mkdir -p "$profile"
profile="$(cd "$profile" && pwd)"
env_arg="-env:UserInstallation=file://$profile"

case "$action" in
  add) [ -f "$oxt" ] || { echo "error: $oxt not found (build with -DCTO_BUILD_ADDIN=ON)" >&2; exit 1; }
       oxt="$(cd "$(dirname "$oxt")" && pwd)/$(basename "$oxt")"
       args=(add --force "$env_arg" "$oxt") ;;
  remove) args=(remove "$env_arg" "$ID") ;;
  list) args=(list "$env_arg") ;;
esac

run_unopkg() {
  if [ "$(id -u)" -ne 0 ]; then
    "$UNOPKG" "${args[@]}"
    return
  fi
  # As root: unopkg runs as nobody on a staged copy of the profile in a folder
  # nobody owns; the result is copied back and given back to the profile's owner.
  local owner tmp rc=0
  owner="$(stat -c %u:%g "$profile")"
  tmp="$(mktemp -d)"
  mkdir -p "$tmp/home" "$tmp/profile"
  cp -a "$profile/." "$tmp/profile/"
  if [ "$action" = add ]; then
    cp "$oxt" "$tmp/"
    args=(add --force "-env:UserInstallation=file://$tmp/profile" "$tmp/$(basename "$oxt")")
  elif [ "$action" = remove ]; then
    args=(remove "-env:UserInstallation=file://$tmp/profile" "$ID")
  else
    args=(list "-env:UserInstallation=file://$tmp/profile")
  fi
  chmod 755 "$tmp"
  chown -R nobody:nogroup "$tmp"
  runuser -u nobody -- env HOME="$tmp/home" LC_ALL=C.UTF-8 "$UNOPKG" "${args[@]}" || rc=$?
  if [ $rc -eq 0 ] && [ "$action" != list ]; then
    find "$profile" -mindepth 1 -delete
    cp -a "$tmp/profile/." "$profile/"
    chown -R "$owner" "$profile"
  fi
  rm -rf "$tmp"
  return $rc
}

if [ "$action" = remove ]; then
  run_unopkg || echo "note: $ID was not installed in $profile"
else
  run_unopkg
fi
[ "$action" = list ] || echo "$action $ID: done (profile $profile)"
