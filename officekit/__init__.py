"""officekit: the project's one way to drive LibreOffice Calc from Python.

Serves every spreadsheet part of the project: the sample sheets (sample-sheets/), the
add-in's sheet tests (tests/sheets/), the sample-sheet tests (tests/samples/), the
hostile sheets (tests/hostile/) and the add-in benchmark (tests/bench/).

  officekit.office     start a headless soffice on a private profile, load,
                       recalculate, export, close; a watchdog and a clean-exit report
  officekit.flat_odf   write flat ODF (.fods) test sheets: of: formulas with the add-in's
                       stored names, cells, the document
  officekit.catalogue  the add-in's functions (Calc name, stored method name, arguments)
                       read from the library's table through the Python package

The scripts put the repository root on PYTHONPATH (scripts/lib.sh); by hand:
PYTHONPATH=. .venv/bin/python ...  Run with Debian's /usr/bin/python3 or the project
venv built on it (python3-uno).
"""
