"""python -m counteroffer: the counteroffer command (see counteroffer._cli)."""

from ._cli import main

if __name__ == "__main__":
    main()
