"""Start a headless LibreOffice on a private profile and talk to it over UNO.

The implementation is the project's one office module, sample-sheets/office.py; this
name is kept for the add-in's sheet tests and benchmark.  Run with Debian's
/usr/bin/python3 (the interpreter python3-uno belongs to) or the project venv."""
import os
import sys

sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..",
                                "sample-sheets"))

from office import SOFFICE, Office, prop, url  # noqa: E402,F401
