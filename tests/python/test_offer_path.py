"""offer_path_rows: the offer path a row per round, against the 50-digit reference rows.

Sources named beside each check:
* tests/reference/private/offer_path.csv (50 digits, backward induction by first-order
  conditions with Chebyshev interpolation, checked by a Monte Carlo of responder types;
  Sobel & Takahashi 1983): opening offer, second offer, cutoffs, agreement probability;
* the two-round closed form of docs/models/private-information.md s.2.2 for [0, 1] and
  factors 0.9:
  P(agreement) = 15/26 (exact fraction, by hand: m_2 = 0.55/0.65, H_2 = m_2/2);
* the stationary no-deadline equilibrium of s.2.3 (Stokey 1981; Gul, Sonnenschein &
  Wilson 1986): mu = 1/(1 + sqrt(1 - d_s)), P(by round t) = (1 - mu^t) H/L,
  price c + lambda mu^(t-1) H with lambda = (1 - d_b) mu/(1 - d_b mu).

Fictional scenario: Calloway Instruments licenses a sensor design to a buyer of unknown
value, one offer a month.
"""

import csv
import math
from fractions import Fraction

import numpy as np
import pytest

import counteroffer as co
from conftest import REFERENCE_DIR


def reference_rows():
    with open(REFERENCE_DIR / "private" / "offer_path.csv", newline="") as f:
        return list(csv.DictReader(f))


def two_round_row():
    for row in reference_rows():
        if (row["private_low"], row["private_high"], row["rounds"], row["offerer"]) == \
                ("0.0", "1.0", "2", "0") and row["offerer_factor"] == "0.9" \
                and row["responder_factor"] == "0.9" and row["known_value"] == "0.0":
            return row
    raise AssertionError("the two-round reference row is missing")


def test_two_round_rows_against_the_50_digit_reference():
    ref = two_round_row()  # tests/reference/private/offer_path.csv row 1
    p = co.offer_path_rows(0, 1, 0.9, 0.9, rounds=2)
    assert len(p.offer) == 2 and p.complete
    assert abs(p.offer[0] - float("0.4653846153846153896737972")) <= 1e-15
    assert abs(p.offer[0] - float(ref["opening_offer"])) <= 1e-15
    assert abs(p.offer[1] - float(ref["offer_2"])) <= 1e-15
    assert abs(p.cutoff[0] - float(ref["cutoff_1"])) <= 1e-15
    assert abs(p.cutoff[1] - float(ref["cutoff_2"])) <= 1e-15
    # P(agreement by the deadline) = 15/26 exactly (private-information.md s.2.2, two rounds)
    assert abs(p.cumulative_probability[-1] - float(Fraction(15, 26))) <= 1e-15
    assert abs(p.cumulative_probability[-1] - float(ref["agreement_probability"])) <= 1e-15
    # per round: (K_(t-1) - K_t)/L with K_0 = 1 (private-information.md s.2.1)
    assert abs(p.round_probability[0] - (1 - float(ref["cutoff_1"]))) <= 1e-15
    assert abs(p.round_probability[1] -
               (float(ref["cutoff_1"]) - float(ref["cutoff_2"]))) <= 1e-15
    assert p.totals.rows_written == 2 and p.totals.rounds_used == 2


@pytest.mark.parametrize("row", [r for r in reference_rows() if r["status"] == "ok"][:20],
                         ids=lambda r: f"{r['private_low']}-{r['private_high']}-{r['rounds']}")
def test_rows_against_the_reference_table(row):
    # tests/reference/private/offer_path.csv: opening offer, second offer, cutoffs and
    # the agreement probability, relative 1e-14 of the money scale
    rounds = int(row["rounds"])
    p = co.offer_path_rows(float(row["private_low"]), float(row["private_high"]),
                           float(row["offerer_factor"]), float(row["responder_factor"]),
                           rounds, float(row["known_value"]), int(float(row["offerer"])))
    scale = float(row["private_high"]) - float(row["private_low"])
    assert abs(p.offer[0] - float(row["opening_offer"])) <= 1e-14 * scale
    if len(p.offer) > 1 and row["offer_2"]:
        assert abs(p.offer[1] - float(row["offer_2"])) <= 1e-14 * scale
        assert abs(p.cutoff[1] - float(row["cutoff_2"])) <= 1e-14 * scale
    assert abs(p.cutoff[0] - float(row["cutoff_1"])) <= 1e-14 * scale
    total = float(row["agreement_probability"])
    if p.complete:
        assert abs(p.cumulative_probability[-1] - total) <= 1e-12


def test_no_deadline_rows_follow_the_stationary_closed_form():
    ds = db = 0.9  # s.2.3: mu = 1/(1 + sqrt(1 - d_s)), lambda = (1 - d_b) mu/(1 - d_b mu)
    mu = 1 / (1 + math.sqrt(1 - ds))
    lam = (1 - db) * mu / (1 - db * mu)
    p = co.offer_path_rows(0, 1, ds, db)
    t = p.rounds
    assert np.allclose(p.offer, lam * mu ** (t - 1), rtol=1e-13, atol=0)
    assert np.allclose(p.cumulative_probability, 1 - mu ** t, rtol=0, atol=1e-13)
    # the rows stop where the cumulative probability is within 1e-12 of the total (1)
    assert p.complete and 1 - p.cumulative_probability[-1] <= 1e-12
    assert 1 - p.cumulative_probability[-2] > 1e-12
    assert p.totals.rounds_used == -1


def test_frame_with_days_and_max_rows():
    p = co.offer_path_rows(0, 1e6, 0.9, 0.9, rounds=5, days=30)
    df = p.to_frame()
    assert list(df.columns) == ["day", "offer", "cutoff", "round_probability",
                                "cumulative_probability"]
    assert list(df.index) == [1, 2, 3, 4, 5] and df.index.name == "round"
    assert list(df["day"]) == [0.0, 30.0, 60.0, 90.0, 120.0]  # (round - 1) x days
    assert "day" not in co.offer_path_rows(0, 1, 0.9, 0.9, 5).to_frame().columns
    cut = co.offer_path_rows(0, 1, 0.9, 0.9, rounds=5, max_rows=3)
    assert len(cut.offer) == 3 and not cut.complete and "cut at max_rows" in repr(cut)
    # the totals are offer_path's (the table's function) whatever the rows
    full = co.offer_path(0, 1, 0.9, 0.9, 5)
    assert cut.totals.agreement_probability == full.agreement_probability


def test_buyer_offers_and_bad_input():
    p = co.offer_path_rows(0, 1, 0.9, 0.9, 2, known_value=1, offerer="buyer")
    # mirror of the seller's case (private-information.md s.2.1, the mirror case): offers 1 - p
    s = co.offer_path_rows(0, 1, 0.9, 0.9, 2)
    assert np.allclose(p.offer, 1 - s.offer, atol=1e-15, rtol=0)
    with pytest.raises(co.InvalidArgumentError, match="offer_path: private_high"):
        co.offer_path_rows(1, 0, 0.9, 0.9, 2)
    with pytest.raises(co.InvalidArgumentError, match="offerer"):
        co.offer_path_rows(0, 1, 0.9, 0.9, 2, offerer="broker")
    with pytest.raises(co.InvalidArgumentError, match="max_rows"):
        co.offer_path_rows(0, 1, 0.9, 0.9, 2, max_rows=-1)
    with pytest.raises(TypeError, match="one deal at a time"):
        co.offer_path_rows([0, 0.5], 1, 0.9, 0.9, 2)
    with pytest.warns(co.NoDealWarning):  # no type gains: no rows (s.2.6)
        nd = co.offer_path_rows(0, 1, 0.9, 0.9, 2, known_value=2)
    assert len(nd.offer) == 0 and nd.complete
