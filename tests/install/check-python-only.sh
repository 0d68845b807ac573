#!/usr/bin/env bash
# The README's "Python only" path, as a user takes it: the command of its code block, run
# word for word in a copy of the repository's tracked files (no build outputs, no project
# venv), then the installed package computes a textbook value.  The command installs the
# build tools from PyPI (build isolation), so this also shows that pyproject.toml names
# everything the build needs.
set -euo pipefail
root="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
# The one command between "### Python only" and the next heading, inside ```sh ... ```.
cmd="$(awk '/^### Python only/{p=1; next} p && /^#/{exit} p && /^```sh/{c=1; next} c && /^```/{exit} c' \
  "$root/README.md")"
[ -n "$cmd" ] || { echo "README.md: no command under \"### Python only\""; exit 1; }
[ "$(printf '%s\n' "$cmd" | wc -l)" -eq 1 ] || { echo "README.md: the Python-only path is not one command"; exit 1; }
mkdir "$work/clone"
(cd "$root" && git ls-files -z --cached --others --exclude-standard) |
  (cd "$root" && xargs -0 cp --parents -t "$work/clone" 2>/dev/null) || true
test -f "$work/clone/pyproject.toml" || { echo "copy of the repository failed"; exit 1; }
echo "python-only check: $cmd"
(cd "$work/clone" && bash -euo pipefail -c "$cmd") > "$work/log" 2>&1 ||
  { tail -n 40 "$work/log"; echo "python-only check: the README's command failed"; exit 1; }
# Rubinstein (1982): the first mover's share (1 - d2)/(1 - d1 d2) = 0.2/0.28 = 5/7.
"$work/clone/.venv-py/bin/python" - <<'EOF'
import counteroffer
x = counteroffer.share(0.9, 0.8)
assert abs(x - 5 / 7) <= 1e-15, x
print("python-only check: counteroffer %s installed; share(0.9, 0.8) = %r" % (counteroffer.__version__, x))
EOF
