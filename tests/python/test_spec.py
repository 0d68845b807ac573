"""The package's view of the library's table: constants named from the public header,
one spec per table row, one worked example per function keyed by the table's names.

Source: lib/include/counteroffer/counteroffer.h and its parts (the #define lines, read
here)."""

import re

import counteroffer as co
from conftest import ROOT
from counteroffer import _core
from counteroffer._examples import EXAMPLES
from counteroffer._spec import Kind, Status

HEADER = "\n".join(p.read_text() for p in sorted((ROOT / "lib/include/counteroffer").glob("*.h")))


def define(name):
    return int(re.search(rf"#define {name} (\d+)", HEADER).group(1))


def test_kinds_and_statuses_are_the_headers_constants():
    for attr in ("REAL", "UNIT", "NONNEG", "POSITIVE", "BOOL", "COUNT", "CHOICE", "OPTIONAL"):
        assert getattr(Kind, attr) == define(f"CTO_ARG_{attr}")
    assert Status.OK == define("CTO_OK")
    for attr in ("INVALID", "NO_DEAL", "INDETERMINATE", "NO_CONVERGENCE", "INTERNAL"):
        assert getattr(Status, attr) == define(f"CTO_E_{attr}")
    for attr in ("NONE", "OWN", "OTHER", "BOTH"):
        assert getattr(_core, f"BINDS_{attr}") == define(f"CTO_BINDS_{attr}")


def test_one_spec_per_table_row_in_order():
    rows = _core.catalogue()
    assert [(s.id, s.name, s.calc_name) for s in co.catalogue] == [
        (r["id"], r["name"], r["calc_name"]) for r in rows]
    for s, r in zip(co.catalogue, rows):
        assert [a.name for a in s.args] == [a["name"] for a in r["args"]]
        assert s.output_names == [o["name"] for o in r["outputs"]]


def test_every_function_has_one_example_and_no_example_is_orphaned():
    assert set(EXAMPLES) == {s.name for s in co.catalogue}
    for name, example in EXAMPLES.items():
        assert example.scenario and f"co.{name}(" in example.python, name
