"""Fixtures of the sample-sheet tests: one headless office with the add-in installed.

The profile comes from CTO_SAMPLES_PROFILE (scripts/test.d/40-samples.sh makes it with
scripts/install-addin.sh); CTO_SAMPLES_OUT is where the export test writes its files.
"""
import os
import sys
import tempfile

import pytest

ROOT = os.path.abspath(os.path.join(os.path.dirname(__file__), "..", ".."))
SAMPLES = os.path.join(ROOT, "sample-sheets")
sys.path.insert(0, SAMPLES)  # the folder under test: its runner, run_samples.py

from officekit.office import Office  # noqa: E402

TEMPLATE = "deal_template.fods"  # the blank template (tests/samples/test_template.py)
ALL_FILES = sorted(f for f in os.listdir(SAMPLES) if f.endswith(".fods"))
SHEETS = [f for f in ALL_FILES if f != TEMPLATE]  # the filled sample sheets


@pytest.fixture(scope="session")
def office():
    profile = os.environ.get("CTO_SAMPLES_PROFILE")
    if not profile:
        raise RuntimeError("set CTO_SAMPLES_PROFILE to a profile with the add-in installed "
                           "(scripts/test.d/40-samples.sh does this)")
    with Office(profile) as o:
        assert o.has_addin(), "the counteroffer add-in does not answer in " + profile
        yield o


@pytest.fixture(scope="session")
def bare_office():
    """An office without the add-in (a fresh profile): what a colleague without it has."""
    with tempfile.TemporaryDirectory(prefix="cto_bare_") as bare:
        with Office(os.path.join(bare, "profile")) as o:
            assert not o.has_addin()
            yield o


@pytest.fixture(scope="session")
def out_dir():
    d = os.environ.get("CTO_SAMPLES_OUT") or tempfile.mkdtemp(prefix="cto_samples_out_")
    os.makedirs(d, exist_ok=True)
    return d


@pytest.fixture
def book(office):
    """Opens a sample sheet by file name; closed (unsaved) after the test."""
    opened = []

    def open_(name):
        doc = office.load(os.path.join(SAMPLES, name))
        doc.calculateAll()
        opened.append(doc)
        return doc

    yield open_
    for doc in opened:
        doc.close(True)
