"""The shipped stubs against the built module (mypy's stubtest), the stub generator's
output against the shipped stub, py.typed, and the docstring examples (doctest).

The doctest outputs were worked out by hand from each docstring's published formula;
they live in each function's definition (lib/functions/<name>.toml, installed with the
package as definitions.json), so they compare the library with that formula.
"""

import doctest
import importlib.resources
import os
import pathlib
import subprocess
import sys

import counteroffer as co
from conftest import ROOT


def test_stubtest_against_the_built_module(tmp_path):
    env = dict(os.environ, MYPY_CACHE_DIR=str(tmp_path / "mypy-cache"))
    proc = subprocess.run([sys.executable, "-m", "mypy.stubtest", "counteroffer"],
                          capture_output=True, text=True, cwd=tmp_path, env=env, timeout=600)
    assert proc.returncode == 0, proc.stdout + proc.stderr


def test_shipped_stub_is_the_generated_one():
    proc = subprocess.run([sys.executable, str(ROOT / "bindings/tools/gen_stubs.py"), "--check"],
                          capture_output=True, text=True, timeout=120)
    assert proc.returncode == 0, proc.stderr


def test_typed_package_ships_stub_and_marker():
    files = importlib.resources.files("counteroffer")
    assert files.joinpath("py.typed").is_file()
    assert files.joinpath("__init__.pyi").is_file()


def test_mypy_accepts_typical_user_code(tmp_path):
    user = tmp_path / "deal_model.py"
    user.write_text(
        "import numpy as np\nimport counteroffer as co\n"
        "x: float = co.share(0.9, 0.95, surplus=1e6)\n"
        "r = co.solve(0.9, 0.9, other_outside=0.4)\n"
        "b: str | None = r.binding\n"
        "arr = co.share(np.linspace(0, 0.9, 5), 0.9)\n"
        "with co.errstate(no_deal='raise'):\n    pass\n")
    env = dict(os.environ, MYPY_CACHE_DIR=str(tmp_path / "mypy-cache"))
    proc = subprocess.run([sys.executable, "-m", "mypy", "--strict", str(user)],
                          capture_output=True, text=True, cwd=tmp_path, env=env, timeout=600)
    assert proc.returncode == 0, proc.stdout + proc.stderr


def test_docstring_examples():
    flags = doctest.ELLIPSIS | doctest.NORMALIZE_WHITESPACE
    finder = doctest.DocTestFinder()
    runner = doctest.DocTestRunner(optionflags=flags)
    n = 0
    for spec in co.catalogue:
        for test in finder.find(getattr(co, spec.name), spec.name, globs={}):
            n += len(test.examples)
            runner.run(test)
    import counteroffer._errors as errs
    for test in finder.find(errs.errstate, "errstate", globs={}):
        n += len(test.examples)
        runner.run(test)
    result = runner.summarize(verbose=False)
    assert result.failed == 0
    assert n >= 2 * len(co.catalogue)  # every function has an example
