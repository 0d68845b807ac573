"""Shared settings of the Python tests of counteroffer."""

import pathlib

import hypothesis

ROOT = pathlib.Path(__file__).resolve().parents[2]
REFERENCE_DIR = ROOT / "tests" / "reference"

# Deterministic property tests in CI; no per-example deadline on the shared 2-core machine.
hypothesis.settings.register_profile("ci", derandomize=True, deadline=None, max_examples=150)
hypothesis.settings.load_profile("ci")


import pytest  # noqa: E402


@pytest.fixture(autouse=True)
def _reference_tables_span_implausible_values(request):
    """The 50-digit reference tables (tests/reference) deliberately include rates above
    100% a year and breakdown probabilities above 0.5: valid values outside the plausible
    ranges, which warn by default.  Their tests check values and statuses, not that
    warning (test_api.py does), so it is off there."""
    if request.module.__name__ != "test_reference_tables":
        yield
        return
    import counteroffer as co

    with co.errstate(implausible="ignore"):
        yield
