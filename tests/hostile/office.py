"""One headless LibreOffice on a private profile, watched: a hang or a crash is a failure.

Run with Debian's /usr/bin/python3 or the project venv built on it (python3-uno).

Office(profile, deadline) starts soffice on a private pipe.  A watchdog thread kills
the whole soffice process group when `deadline` seconds have passed, so a hung
recalculation ends the UNO call with an exception instead of blocking for ever.
close() ends the office and reports how it ended: exit status, whether the watchdog
fired, whether any process of this office is still alive, and whether the profile or
the log show a crash.
"""
import os
import signal
import subprocess
import threading
import time

import importlib.util

# The project's one office module, sample-sheets/office.py, loaded under its own name
# (this file is also called office.py).
_spec = importlib.util.spec_from_file_location(
    "cto_office", os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..",
                               "sample-sheets", "office.py"))
cto_office = importlib.util.module_from_spec(_spec)
_spec.loader.exec_module(cto_office)
SOFFICE, prop, url = cto_office.SOFFICE, cto_office.prop, cto_office.url

# Words soffice prints on a fatal signal or an abort (its own crash handler).
CRASH_WORDS = ("Fatal exception", "Unspecified Application Error", "signal 11",
               "Segmentation fault", "core dumped", "terminate called", "Aborted")


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


class Office(cto_office.Office):
    def __init__(self, profile, deadline, start_timeout=60.0):
        self.profile = os.path.abspath(profile)
        self.timed_out = False
        self.proc = None
        self.before = set(crash_files(self.profile))
        self._done = threading.Event()
        self._watchdog = threading.Thread(target=self._watch, args=(deadline,), daemon=True)
        self._watchdog.start()
        try:
            super().__init__(self.profile, start_timeout=start_timeout, new_session=True)
        except Exception:
            self._kill()
            raise

    def _kill(self):
        if self.proc is None:
            return
        try:
            os.killpg(self.proc.pid, signal.SIGKILL)  # our own process group only
        except ProcessLookupError:
            pass

    def _watch(self, deadline):
        if not self._done.wait(deadline):
            self.timed_out = True
            self._kill()

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
        time.sleep(0.5)
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
        self.log.seek(0)
        text = self.log.read().decode("utf-8", "replace")
        for word in CRASH_WORDS:
            if word in text:
                problems.append("soffice log shows %r: %s" % (word, text[-2000:]))
                break
        self.log_text = text
        return problems
