"""The deadline model's parity swing is stated, with its reason, wherever a user meets
the model (issue 14 point 10): the function's help (its definition's summary, which the
Python docstring, the Function Wizard and the function contract all show), the README,
the licence sample built on the model and the blank deal template.

What the statement must hold: the share jumps between odd and even numbers of offers,
the reason (whoever makes the last offer gains), and that this is not a forecast.
Source of the fact: Ståhl (1972); Gibbons (1992) s.2.1.D (docs/models/
complete-information.md s.3, "The parity swing"); the first check below shows it on
the library itself.
"""
import re
import xml.etree.ElementTree as ET

import pytest

import counteroffer as co
from conftest import ROOT

TEXT_P = "{urn:oasis:names:tc:opendocument:xmlns:text:1.0}p"


def states_the_swing(text):
    t = " ".join(text.split()).lower()
    return ("odd" in t and "even" in t and "last offer" in t and "not a forecast" in t)


def test_the_swing_is_real():
    # d = 0.9, no deadline payoffs: 1, 0.1, 0.91, 0.181 for 1 to 4 offers (Ståhl 1972,
    # x_T = (1 - (-d)^T)/(1 + d)): the share jumps with the parity of the count.
    got = [co.deadline_share(0.9, 0.9, t) for t in (1, 2, 3, 4)]
    assert got == pytest.approx([1.0, 0.1, 0.91, 0.181], rel=1e-14)


def test_the_help_states_it():
    row = next(f for f in co._core.catalogue() if f["name"] == "deadline_share")
    assert states_the_swing(row["summary"])          # the Wizard and the contract
    assert states_the_swing(co.deadline_share.__doc__.split("\n\n")[0])  # Python help


def test_the_readme_states_it():
    text = (ROOT / "README.md").read_text(encoding="utf-8")
    paragraphs = re.split(r"\n(?=\* )|\n\n", text)
    assert any("deadline_share" in p and states_the_swing(p) and "parity" in p
               for p in paragraphs)


@pytest.mark.parametrize("sheet", ["licence_deadline.fods", "deal_template.fods"])
def test_the_sheets_state_it(sheet):
    root = ET.parse(ROOT / "sample-sheets" / sheet).getroot()
    cells = ["".join(p.itertext()) for p in root.iter(TEXT_P)]
    assert any(states_the_swing(c) for c in cells), sheet
