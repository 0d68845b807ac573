"""Writes the reference tables of the private-information models (mpmath, 50 digits):

    double_auction.csv   trade_reference.py   (quadrature of black-box strategies,
                                               best-response grids)
    offer_path.csv       offers_reference.py  (backward induction by first-order
                                               conditions; Monte Carlo of buyer types)

Run from the repository root:  .venv/bin/python tests/reference/private/generate_private.py [name...]
The tables are committed; CI does not regenerate them.  Values are model estimates under
the models' stated assumptions, not financial, legal or tax advice.
"""
import csv
import os
import sys

import mpmath as mp

HERE = os.path.dirname(os.path.abspath(__file__))
sys.path.insert(0, HERE)


def write(name, header, rows):
    path = os.path.join(HERE, name + ".csv")
    with open(path, "w", newline="") as fh:
        w = csv.writer(fh, lineterminator="\n")
        w.writerow(header)
        w.writerows(rows)
    print("wrote", path, len(rows), "rows")


def main(argv):
    mp.mp.dps = 50
    wanted = set(argv) or {"double_auction", "offer_path"}
    if "double_auction" in wanted:
        import trade_reference
        write("double_auction", *trade_reference.table())
    if "offer_path" in wanted:
        import offers_reference
        write("offer_path", *offers_reference.table())


if __name__ == "__main__":
    main(sys.argv[1:])
