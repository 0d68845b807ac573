"""Shared settings of the Python tests of counteroffer."""

import pathlib

import hypothesis

ROOT = pathlib.Path(__file__).resolve().parents[2]
REFERENCE_DIR = ROOT / "tests" / "reference"

# Deterministic property tests in CI; no per-example deadline on the shared 2-core machine.
hypothesis.settings.register_profile("ci", derandomize=True, deadline=None, max_examples=150)
hypothesis.settings.load_profile("ci")

