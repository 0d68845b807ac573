"""Start a headless LibreOffice on a private profile and talk to it over UNO.

Run with Debian's /usr/bin/python3 (the interpreter python3-uno belongs to)."""
import os
import subprocess
import tempfile
import time
import uuid

import uno  # noqa: F401  (python3-uno)
from com.sun.star.beans import PropertyValue
from com.sun.star.connection import NoConnectException

SOFFICE = "/usr/lib/libreoffice/program/soffice"


def prop(name, value):
    p = PropertyValue()
    p.Name = name
    p.Value = value
    return p


def url(path):
    return uno.systemPathToFileUrl(os.path.abspath(path))


class Office:
    """One soffice process on `profile`, connected over a private pipe."""

    def __init__(self, profile, start_timeout=60.0):
        self.pipe = "cto_" + uuid.uuid4().hex
        env = dict(os.environ, LC_ALL="C.UTF-8", SAL_USE_VCLPLUGIN="svp")
        self.log = tempfile.TemporaryFile()
        self.proc = subprocess.Popen(
            [SOFFICE, "--headless", "--invisible", "--norestore", "--nologo",
             "--nodefault", "--nolockcheck",
             "-env:UserInstallation=" + url(profile),
             "--accept=pipe,name=%s;urp;StarOffice.ComponentContext" % self.pipe],
            env=env, stdout=self.log, stderr=self.log)
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
                if self.proc.poll() is not None or time.monotonic() - t0 > start_timeout:
                    raise RuntimeError("soffice did not start")
                time.sleep(0.1)
        self.start_seconds = time.monotonic() - t0
        self.smgr = self.ctx.ServiceManager
        self.desktop = self.smgr.createInstanceWithContext(
            "com.sun.star.frame.Desktop", self.ctx)

    def load(self, path):
        doc = self.desktop.loadComponentFromURL(
            url(path), "_blank", 0, (prop("Hidden", True),))
        if doc is None:
            raise RuntimeError("could not load " + path)
        return doc

    def new_sheet(self):
        return self.desktop.loadComponentFromURL(
            "private:factory/scalc", "_blank", 0, (prop("Hidden", True),))

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

    def __enter__(self):
        return self

    def __exit__(self, *exc):
        self.close()
