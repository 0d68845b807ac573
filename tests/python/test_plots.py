"""The plot helpers with matplotlib's Agg backend: the artists drawn (bars, lines, labels,
titles), not pixels.  The numbers drawn must be the results' own (the results are
checked against outside sources in test_ranges.py and test_offer_path.py).

Fictional scenario: Ferncastle Foods' supply contract (see test_ranges.py).
"""

import sys

import pytest

matplotlib = pytest.importorskip("matplotlib")
matplotlib.use("Agg")
import matplotlib.pyplot as plt  # noqa: E402

import counteroffer as co  # noqa: E402


@pytest.fixture(autouse=True)
def _close_figures():
    yield
    plt.close("all")


def test_share_range_histogram_marks_the_quantiles():
    r = co.share_range(0.08, (0.04, 0.08, 0.16), 30, probabilities=co.PLOT_PROBABILITIES,
                       digits=2)
    ax = co.plot_share_range(r)
    bars = [p for p in ax.patches if p.get_gid() == "share_range_bar"]
    assert len(bars) == len(r.probabilities) - 1
    # each bar spans two consecutive quantiles and its area is the probability between them
    for bar, (p0, p1), (q0, q1) in zip(bars, zip(r.probabilities, r.probabilities[1:]),
                                         zip(r.own, r.own[1:])):
        assert bar.get_x() == pytest.approx(q0.value, abs=1e-15)
        assert bar.get_width() == pytest.approx(q1.value - q0.value, rel=1e-12)
        assert bar.get_width() * bar.get_height() == pytest.approx(p1 - p0, rel=1e-12)
    lines = [l for l in ax.get_lines() if l.get_label().endswith(tuple("0123456789"))]
    assert [l.get_xdata()[0] for l in lines] == [r.quantile(p).value for p in (0.1, 0.5, 0.9)]
    assert ax.get_xlabel() == "own share" and ax.get_ylabel() == "probability density"
    assert "model estimate" in ax.get_title()
    assert [t.get_text() for t in ax.get_legend().get_texts()][0].startswith("10%")


def test_share_range_mark_not_in_the_result():
    r = co.share_range(0.08, (0.04, 0.16), 30)
    with pytest.raises(ValueError, match="probability 0.25 is not in the result"):
        co.plot_share_range(r, marks=(0.25,))


def test_tornado_bars_follow_the_swing():
    s = co.share_swing((0.05, 0.08, 0.12), (0.04, 0.16), 30, breakdown_prob=(0, 0.02))
    fig, ax = plt.subplots()
    assert co.plot_swing(s, ax=ax) is ax
    bars = ax.patches
    assert len(bars) == 2 * len(s.rows)
    labels = [t.get_text() for t in ax.get_yticklabels()]
    assert labels == [r.input for r in reversed(s.rows)]  # largest swing on top
    for k, r in enumerate(s.rows):
        low, high = bars[2 * k], bars[2 * k + 1]
        assert low.get_y() + low.get_height() / 2 == pytest.approx(len(s.rows) - 1 - k)
        assert low.get_x() + low.get_width() == pytest.approx(r.at_low, abs=1e-15)
        assert high.get_x() + high.get_width() == pytest.approx(r.at_high, abs=1e-15)
    assert ax.get_xlabel() == "own share" and ax.get_ylabel() == "uncertain input"
    assert ax.get_title()


def test_offer_path_plot_has_offers_and_probabilities():
    p = co.offer_path_rows(0, 1e6, 0.9, 0.9, rounds=6, days=30)
    ax, right = co.plot_offer_path(p)
    (offers,) = ax.get_lines()
    assert list(offers.get_xdata()) == list(p.day)
    assert list(offers.get_ydata()) == list(p.offer)
    (prob,) = right.get_lines()
    assert list(prob.get_ydata()) == list(p.cumulative_probability)
    assert ax.get_xlabel() == "day of the offer" and right.get_ylabel().startswith("probability")
    assert right.get_ylim() == (0, 1)
    ax2, _ = co.plot_offer_path(co.offer_path_rows(0, 1, 0.9, 0.9, rounds=3))
    assert ax2.get_xlabel() == "round"


def test_missing_matplotlib_gives_a_clear_message(monkeypatch):
    monkeypatch.setitem(sys.modules, "matplotlib", None)
    monkeypatch.setitem(sys.modules, "matplotlib.pyplot", None)
    with pytest.raises(ImportError, match=r"counteroffer\[plot\]"):
        co.plot_swing(co.share_swing(0.08, (0.04, 0.16), 30))
