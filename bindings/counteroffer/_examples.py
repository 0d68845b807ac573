"""Worked examples of the catalogue functions, one per function, keyed by its name in
the library's table (a test checks that the keys are exactly the table's names).

Each is a fictional scenario of our own and doctest lines; each expected output was
worked out by hand from the formula named in the function's docstring (the model
descriptions are in docs/models/), so the doctests compare the library with that
formula.  The shape (scenario, python) is the one the function definitions use, so
these can move into the definitions unchanged.
"""

from __future__ import annotations

from typing import Dict, NamedTuple


class Example(NamedTuple):
    scenario: str
    python: str


#: name -> Example.  Fictional scenarios only.
EXAMPLES: Dict[str, Example] = {
    "round_factor": Example(
        "Harbourline Logistics prices delay at 8% a year; counter-offers come every 30 days. "
        "Hand check: 1.08 ** (-30/365).",
        ">>> round(co.round_factor(0.08, 30), 6)\n0.993694",
    ),
    "share": Example(
        "Quillon Pharma licenses a compound to Brightwater Bio; the deal creates "
        "EUR 12m. Per monthly round Quillon discounts by 0.97, Brightwater by 0.95, and "
        "Quillon opens. Hand check: 12e6 (1 - 0.95) / (1 - 0.97 x 0.95).",
        ">>> round(co.share(0.97, 0.95, surplus=12e6), 2)\n7643312.1\n"
        ">>> co.share([0.97, 0.99], 0.95, surplus=12e6).shape\n(2,)",
    ),
    "share_from_rates": Example(
        "Arden Foods (10% a year) and Mistral Retail (15%) trade offers every 14 days "
        "over a USD 5m supply contract. Hand check: the expm1 formula above.",
        ">>> round(co.share_from_rates(0.10, 0.15, 14, surplus=5e6), 2)\n2978178.23",
    ),
    "limit_share": Example(
        "Two fictional utilities, Corvane Power (rate 0.10) and Selkirk Grid (0.15), "
        "split USD 8m with offers arbitrarily close together. Hand check: 8e6 x 0.15/0.25.",
        ">>> round(co.limit_share(0.10, 0.15, surplus=8e6), 2)\n4800000.0",
    ),
    "breakdown_share": Example(
        "Tallis Mining and Orrin Metals negotiate a USD 10m joint venture; after each "
        "rejection there is a 10% chance talks end, leaving Tallis USD 1m and Orrin "
        "USD 2m. Hand check: the formula above with a = 0.9 d.",
        ">>> round(co.breakdown_share(0.95, 0.9, 0.1, 1e6, 2e6, surplus=10e6), 2)\n"
        "5792811.84",
    ),
    "outside_option_share": Example(
        "Pell Robotics sells a USD 2m line; the buyer, Garnet Auto, can walk away to a "
        "rival worth USD 1.2m. The option binds: Pell gets 2m - 1.2m.",
        ">>> round(co.outside_option_share(0.9, 0.9, 0.0, 1.2e6, surplus=2e6), 2)\n"
        "800000.0",
    ),
    "inside_option_share": Example(
        "Hollis Media and Crane Studios renegotiate a USD 6m carriage deal; meanwhile "
        "Hollis keeps USD 1m of status-quo income and Crane USD 0.5m (present values). "
        "Hand check: g_own + (S - g_own - g_oth)(1 - d_oth)/(1 - d_own d_oth).",
        ">>> round(co.inside_option_share(0.9, 0.85, 1e6, 0.5e6, surplus=6e6), 2)\n"
        "3872340.43",
    ),
    "solve": Example(
        "The Pell Robotics deal again, through the combined model: Garnet's walk-away "
        "option binds.",
        ">>> r = co.solve(0.9, 0.9, other_outside=1.2e6, surplus=2e6)\n"
        ">>> round(r.own_share, 2), round(r.other_share, 2), r.binding, r.rational\n"
        "(800000.0, 1200000.0, 'theirs', True)",
    ),
    "deadline_share": Example(
        "Fenwick Tools and Ostrava Steel have two offers before a tender closes; Fenwick "
        "opens and both get nothing if the last offer fails. Ostrava would take all in "
        "round 2, so Fenwick keeps S (1 - 0.9).",
        ">>> round(co.deadline_share(0.95, 0.9, 2, surplus=1e6), 2)\n100000.0",
    ),
    "fixed_cost_share": Example(
        "Delay costs Juniper Labs USD 10k a round and Redfern Capital USD 25k; Juniper "
        "opens, so it takes the whole USD 3m (Rubinstein 1982, fixed-cost case).",
        ">>> co.fixed_cost_share(10e3, 25e3, surplus=3e6)\n3000000.0",
    ),
    "delay_cost": Example(
        "Ashby Freight stands to receive USD 3m now; a round of delay discounts by 0.98 "
        "and risks a 5% breakdown leaving USD 1m. Hand check: "
        "0.05 (3m - 1m) + 0.95 x 0.02 x 3m.",
        ">>> round(co.delay_cost(0.98, 3e6, 0.05, 1e6), 2)\n157000.0",
    ),
    "first_mover_advantage": Example(
        "In a USD 4m settlement with factors 0.9 and 0.8, opening is worth "
        "4e6 (0.1)(0.2)/(1 - 0.72).",
        ">>> round(co.first_mover_advantage(0.9, 0.8, surplus=4e6), 2)\n285714.29",
    ),
    "nash_share": Example(
        "Marlow Software and Tern Telecom split USD 5m; without a deal Marlow keeps "
        "USD 0.3m and Tern USD 1.2m; Marlow's bargaining weight is 0.6. Hand check: "
        "0.3m + 0.6 (5m - 0.3m - 1.2m).",
        ">>> round(co.nash_share(0.3e6, 1.2e6, own_weight=0.6, surplus=5e6), 2)\n2400000.0",
    ),
    "risk_averse_share": Example(
        "Lindqvist Shipping (risk averse, u = x^0.5, factor 0.96) opens against Oduya "
        "Ports (risk neutral, factor 0.9) over USD 20m; with no breakdown risk this is "
        "Rubinstein's formula with effective factors 0.96^(1/0.5) and 0.9.",
        ">>> round(co.risk_averse_share(0.96, 0.9, 0.5, 1.0, surplus=20e6), 2)\n"
        "11726078.8\n"
        ">>> x = co.risk_averse_share(0.96, 0.9, 2e-7, 1e-7, utility='exponential',"
        " surplus=20e6)\n>>> 0.0 < x < 20e6\nTrue",
    ),
    "group_share": Example(
        "Four fictional partners of the Vantor consortium split USD 9m by unanimity with "
        "factor 0.9; the partner two places after the proposer gets "
        "9e6 x 0.9^2 x 0.1/(1 - 0.9^4).",
        ">>> round(co.group_share(0.9, 4, position=2, surplus=9e6), 2)\n2119802.27",
    ),
    "majority_share": Example(
        "A seven-member fictional creditor committee needs four votes to approve a "
        "USD 21m plan (factor 0.8): the proposer gets 21m (1 - 0.8 x 3/7), each partner "
        "21m x 0.8/7.",
        ">>> round(co.majority_share(0.8, 7, 4, surplus=21e6), 2)\n13800000.0\n"
        ">>> round(co.majority_share(0.8, 7, 4, role='partner', surplus=21e6), 2)\n"
        "2400000.0",
    ),
    "implied_factor": Example(
        "Quillon Pharma got 63.694% of the surplus against a partner with factor 0.95; "
        "the factor that makes this the equilibrium is Quillon's 0.97 from the share() "
        "example.",
        ">>> round(co.implied_factor(0.6369426751592361, 0.95), 12)\n0.97",
    ),
    "implied_rate": Example(
        "Arden Foods got 59.563564...% of the surplus in the share_from_rates() example; "
        "its implied annual rate is the 10% used there.",
        ">>> s = co.share_from_rates(0.10, 0.15, 14)\n"
        ">>> round(co.implied_rate(s, 0.15, 14), 10)\n0.1",
    ),
    "share_sensitivity": Example(
        "A higher own rate (more impatience) lowers Arden Foods' share, a higher rate of "
        "Mistral Retail raises it.",
        ">>> co.share_sensitivity(0.10, 0.15, 14, surplus=5e6) < 0\nTrue\n"
        ">>> co.share_sensitivity(0.10, 0.15, 14, wrt='other', surplus=5e6) > 0\nTrue",
    ),
    "screening_profit": Example(
        "Kestrel Analytics sells a licence to a buyer worth USD 10m (probability 0.5) or "
        "USD 6m; screening beats pooling: 0.5 (0.2 x 10m + 0.8 x 6m) + 0.5 x 0.9 x 6m.",
        ">>> round(co.screening_profit(10e6, 6e6, 0.5, 0.9, 0.8), 2)\n6100000.0",
    ),
}
