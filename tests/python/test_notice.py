"""The installed package carries the Sobol' direction numbers' source and licence note
(lib/src/range/JOE-KUO-NOTICE.txt, installed beside the module that uses the numbers).

Source: the notice file in the repository, compared byte for byte; the wheel, the sdist,
the CMake install and the .oxt are checked by tests/install/check-notice.py (run by
scripts/test.d/20-python.sh, tests/install/check-install.sh, scripts/test.d/30-addin.sh).
"""

import importlib.resources

from conftest import ROOT


def test_installed_package_has_the_joe_kuo_notice():
    notice = importlib.resources.files("counteroffer") / "JOE-KUO-NOTICE.txt"
    assert notice.is_file()
    source = ROOT / "lib" / "src" / "range" / "JOE-KUO-NOTICE.txt"
    assert notice.read_bytes() == source.read_bytes()
