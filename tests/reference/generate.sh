#!/bin/sh
# Regenerates the reference tables (tests/reference/*.csv) with mpmath.
# Uses the project venv (.venv) when it exists, otherwise a scratch venv with mpmath
# under build/ref/venv.  Arguments (function names) are passed to generate.py.
set -eu
here=$(cd "$(dirname "$0")" && pwd)
root=$(cd "$here/../.." && pwd)
if [ -x "$root/.venv/bin/python" ]; then
    py="$root/.venv/bin/python"
else
    venv="$root/build/ref/venv"
    if [ ! -x "$venv/bin/python" ]; then
        python3 -m venv "$venv"
        "$venv/bin/pip" install --quiet 'mpmath>=1.3'
    fi
    py="$venv/bin/python"
fi
exec "$py" "$here/generate.py" "$@"
