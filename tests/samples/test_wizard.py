"""The Function Wizard of the shipped extension, which the sample sheets run on
(scripts/test.d/40-samples.sh installs counteroffer.oxt as users get it, not the test
build): no diagnostic function is visible or callable (issue 14 point 4), and a function
that can give no deal says #N/A in its description (point 12).

Source of the expectations: addin/README.md (the shipped extension has the user
functions only, in category Financial); the test build's diagnostic function from
officekit.catalogue.PROBE; the Wizard data read back over UNO
(com.sun.star.sheet.FunctionDescriptions); Calc's #NAME? code 525 for an unknown
function (LibreOffice 7.4 include/formula/errorcodes.hxx).
"""
import pytest

from officekit.catalogue import PROBE
from officekit.office import SERVICE

FINANCIAL = 3  # com.sun.star.sheet.FunctionCategory.FINANCIAL
NAME_ERROR = 525


@pytest.fixture(scope="module")
def wizard(office):
    fd = office.smgr.createInstanceWithContext("com.sun.star.sheet.FunctionDescriptions",
                                               office.ctx)
    out = {}
    for i in range(fd.getCount()):
        d = {p.Name: p.Value for p in fd.getByIndex(i)}
        if d["Name"].startswith("DEAL"):
            out[d["Name"]] = d
    return out


def test_no_diagnostic_function_in_the_wizard(wizard):
    assert "DEALSHARE" in wizard and "DEALREASON" in wizard
    assert PROBE.calc not in wizard
    for name, d in wizard.items():
        assert d["Category"] == FINANCIAL, name
        assert "diagnostic" not in d["Description"].lower(), name


def test_the_diagnostic_function_cannot_be_called(office):
    doc = office.new_sheet()
    try:
        cell = doc.Sheets.getByIndex(0).getCellByPosition(0, 0)
        cell.setFormula("=%s%s(3;4)" % (SERVICE, PROBE.method.upper()))
        doc.calculateAll()
        assert cell.getError() == NAME_ERROR
    finally:
        doc.close(True)


@pytest.mark.parametrize("name", ["DEALSHARE", "DEALSOLVE", "DEALDEADLINE", "DEALAGREEPROB"])
def test_no_deal_is_explained_as_na(wizard, name):
    assert "Shows #N/A when no deal is rational" in wizard[name]["Description"]
