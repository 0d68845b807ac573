"""A headless LibreOffice on a private profile, driven over UNO (python3-uno).

Office(profile) starts soffice on a private pipe and connects.  It runs on a private
copy of the profile (a temporary folder, removed by close()), so several offices may
start from one profile at once (the test parts and the main job share the one profile
ensure_addin_profile installs) and a run never changes it.  With deadline=S a
watchdog thread kills soffice's whole process group after S seconds, so a hung
recalculation ends the UNO call with an exception instead of blocking for ever.
close() ends the office and returns a list of problems (empty: a clean exit): exit
status, the watchdog, processes of this office still alive, crash dumps in the
profile, a crash message in its log.
"""
import os
import shutil
import signal
import subprocess
import tempfile
import threading
import time
import uuid

import uno
from com.sun.star.beans import PropertyValue
from com.sun.star.connection import NoConnectException

SOFFICE = "/usr/lib/libreoffice/program/soffice"
# A cell formula keeps the add-in's service and method name, never the display name
# (addin/README.md "Stable names").
SERVICE = "ORG.COUNTEROFFER.DEALFUNCTIONS."
# Words soffice prints on a fatal signal or an abort (its own crash handler).
CRASH_WORDS = ("Fatal exception", "Unspecified Application Error", "signal 11",
               "Segmentation fault", "core dumped", "terminate called", "Aborted")
# Calc's filters (names as LibreOffice 7.4 registers them).
FLAT_ODS = "OpenDocument Spreadsheet Flat XML"
ODS = "calc8"
XLSX = "Calc MS Excel 2007 XML"
PDF = "calc_pdf_Export"
CSV = "Text - txt - csv (StarCalc)"


def prop(name, value):
    p = PropertyValue()
    p.Name = name
    p.Value = value
    return p


def url(path):
    return uno.systemPathToFileUrl(os.path.abspath(path))


def processes_with(marker):
    """Ids of live processes whose command line contains `marker` (read from /proc)."""
    found = []
    for pid in os.listdir("/proc"):
        if not pid.isdigit():
            continue
        try:
            with open("/proc/%s/cmdline" % pid, "rb") as f:
                if marker.encode() in f.read():
                    found.append(int(pid))
        except OSError:
            continue
    return found


def crash_files(profile):
    """Crash dumps LibreOffice leaves in a profile (user/crash) or core files there."""
    out = []
    for base, _dirs, files in os.walk(profile):
        for name in files:
            if "/crash" in base or name.startswith("core") or name.endswith(".dmp"):
                out.append(os.path.join(base, name))
    return out


class Office:
    """One soffice process on `profile`, reached over a private pipe."""

    def __init__(self, profile, start_timeout=90.0, deadline=None):
        self.source = os.path.abspath(profile)
        self.tmp = tempfile.mkdtemp(prefix="cto_office_")
        self.profile = os.path.join(self.tmp, "profile")
        if os.path.isdir(self.source):
            shutil.copytree(self.source, self.profile, symlinks=True)
        else:
            os.makedirs(self.profile)
        self.pipe = "cto_office_" + uuid.uuid4().hex
        self.timed_out = False
        self.proc = None
        self.log_text = ""
        self.before = set(crash_files(self.profile))
        self._done = threading.Event()
        if deadline is not None:
            threading.Thread(target=self._watch, args=(deadline,), daemon=True).start()
        try:
            self._start(start_timeout, new_session=deadline is not None)
        except Exception:
            self._kill()
            self._done.set()
            shutil.rmtree(self.tmp, ignore_errors=True)
            raise
        self.smgr = self.ctx.ServiceManager
        self.desktop = self.smgr.createInstanceWithContext(
            "com.sun.star.frame.Desktop", self.ctx)

    def _start(self, start_timeout, new_session):
        env = dict(os.environ, LC_ALL="C.UTF-8", SAL_USE_VCLPLUGIN="svp")
        self.log = tempfile.TemporaryFile()
        self.proc = subprocess.Popen(
            [SOFFICE, "--headless", "--invisible", "--norestore", "--nologo",
             "--nodefault", "--nolockcheck",
             "-env:UserInstallation=" + url(self.profile),
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
                    raise RuntimeError("soffice exited (status %s) before it accepted a "
                                       "connection" % self.proc.returncode)
                if time.monotonic() - t0 > start_timeout:
                    raise RuntimeError("soffice did not start within %.0f s" % start_timeout)
                time.sleep(0.1)
        self.start_seconds = time.monotonic() - t0

    def _kill(self):
        if self.proc is None or self.proc.poll() is not None:
            return
        try:
            if self.proc.pid == os.getpgid(self.proc.pid):
                os.killpg(self.proc.pid, signal.SIGKILL)  # its own process group only
            else:
                self.proc.kill()
        except ProcessLookupError:
            pass
        self.proc.wait()

    def _watch(self, deadline):
        if not self._done.wait(deadline):
            self.timed_out = True
            self._kill()

    # ---- documents -----------------------------------------------------------------
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

    # ---- the end -------------------------------------------------------------------
    def close(self):
        """End the office; returns a list of problems (empty: it exited cleanly)."""
        problems = []
        try:
            self.desktop.terminate()
        except Exception:  # the bridge goes away with the office
            pass
        try:
            rc = self.proc.wait(timeout=60)
        except subprocess.TimeoutExpired:
            problems.append("soffice did not exit within 60 s of terminate()")
            self._kill()
            rc = self.proc.wait()
        self._done.set()
        if self.timed_out:
            problems.append("the watchdog killed soffice (a hang)")
        if rc != 0:
            problems.append("soffice exit status %d" % rc)
        problems += self._leftovers()
        self.log.seek(0)
        self.log_text = self.log.read().decode("utf-8", "replace")
        self.log.close()
        for word in CRASH_WORDS:
            if word in self.log_text:
                problems.append("soffice log shows %r: %s" % (word, self.log_text[-2000:]))
                break
        shutil.rmtree(self.tmp, ignore_errors=True)
        return problems

    def _leftovers(self):
        problems = []
        time.sleep(0.2)
        left = processes_with(self.pipe)
        if left:
            problems.append("soffice processes still alive: %s" % left)
            for pid in left:
                try:
                    os.kill(pid, signal.SIGKILL)
                except ProcessLookupError:
                    pass
        new = sorted(set(crash_files(self.profile)) - self.before)
        if new:
            problems.append("crash dumps: %s" % new)
        return problems

    def __enter__(self):
        return self

    def __exit__(self, *exc):
        self.close()
