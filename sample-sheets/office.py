"""A headless LibreOffice on a private profile, driven over UNO (python3-uno).

The project's one way to start and reach an office: used by build_samples.py (writes
the templates), run_samples.py (the main job's recalculation and export), tests/samples,
the add-in's sheet tests (tests/sheets/lo.py) and the hostile sheet (tests/hostile).
Run with Debian's /usr/bin/python3 or the project venv (created with
--system-site-packages, so it sees python3-uno)."""
import os
import subprocess
import tempfile
import time
import uuid

import uno
from com.sun.star.beans import PropertyValue
from com.sun.star.connection import NoConnectException

SOFFICE = "/usr/lib/libreoffice/program/soffice"
# The add-in's stored names (STYLE.md s.6; addin/gen/addin_gen.cpp): a cell formula
# keeps the service and method name, never the display name.
SERVICE = "ORG.COUNTEROFFER.DEALFUNCTIONS."


def prop(name, value):
    p = PropertyValue()
    p.Name = name
    p.Value = value
    return p


def url(path):
    return uno.systemPathToFileUrl(os.path.abspath(path))


class Office:
    """One soffice process on `profile`, reached over a private pipe."""

    def __init__(self, profile, start_timeout=90.0, new_session=False):
        """new_session: run soffice in a process group of its own (so that a watchdog
        can kill it and everything it started)."""
        self.pipe = "cto_office_" + uuid.uuid4().hex
        env = dict(os.environ, LC_ALL="C.UTF-8", SAL_USE_VCLPLUGIN="svp")
        self.log = tempfile.TemporaryFile()
        self.proc = subprocess.Popen(
            [SOFFICE, "--headless", "--invisible", "--norestore", "--nologo",
             "--nodefault", "--nolockcheck",
             "-env:UserInstallation=" + url(profile),
             "--accept=pipe,name=%s;urp;StarOffice.ComponentContext" % self.pipe],
            env=env, stdout=self.log, stderr=self.log, start_new_session=new_session)
        local = uno.getComponentContext()
        resolver = local.ServiceManager.createInstanceWithContext(
            "com.sun.star.bridge.UnoUrlResolver", local)
        t0 = time.monotonic()
        while True:
            try:
                self.ctx = resolver.resolve(
                    "uno:pipe,name=%s;urp;StarOffice.ComponentContext" % self.pipe)
                break
            except NoConnectException:
                if self.proc.poll() is not None:
                    self.log.close()
                    raise RuntimeError("soffice exited (status %s) before it accepted a "
                                       "connection" % self.proc.returncode)
                if time.monotonic() - t0 > start_timeout:
                    self.proc.kill()
                    self.proc.wait()
                    self.log.close()
                    raise RuntimeError("soffice did not start within %.0f s" % start_timeout)
                time.sleep(0.1)
        self.start_seconds = time.monotonic() - t0
        self.smgr = self.ctx.ServiceManager
        self.desktop = self.smgr.createInstanceWithContext(
            "com.sun.star.frame.Desktop", self.ctx)

    def load(self, path):
        if not os.path.isfile(path):
            raise RuntimeError("no such file: " + path)
        doc = self.desktop.loadComponentFromURL(url(path), "_blank", 0,
                                                (prop("Hidden", True),))
        if doc is None:
            raise RuntimeError("LibreOffice could not load " + path)
        return doc

    def new_sheet(self):
        return self.desktop.loadComponentFromURL("private:factory/scalc", "_blank", 0,
                                                 (prop("Hidden", True),))

    def has_addin(self):
        """True when the counteroffer add-in answers in this office."""
        doc = self.new_sheet()
        try:
            cell = doc.Sheets.getByIndex(0).getCellByPosition(0, 0)
            cell.setFormula("=" + SERVICE + "GETSHARE(0.5;0.5)")
            doc.calculateAll()
            return cell.getError() == 0
        finally:
            doc.close(True)

    def close(self):
        try:
            self.desktop.terminate()
        except Exception:  # the bridge goes away with the office
            pass
        try:
            self.proc.wait(timeout=30)
        except subprocess.TimeoutExpired:
            self.proc.kill()
            self.proc.wait()
        self.log.close()

    def __enter__(self):
        return self

    def __exit__(self, *exc):
        self.close()
