"""A headless LibreOffice driven through Python-UNO: for the add-in's end-to-end tests
(tests/addin/), the benchmark (tests/bench/bench_addin.py), scripts/make-examples and scripts/demo.

Each Office runs with its own throw-away profile (-env:UserInstallation) in its own process
group, listens on a private pipe, and is killed (the whole group) when stopped or when anything
goes wrong. Needs the system Python with the `uno` module (Debian: python3-uno).
"""
import contextlib
import os
import shutil
import signal
import socket
import subprocess
import time

import uno
import unohelper
from com.sun.star.beans import PropertyValue
from com.sun.star.connection import NoConnectException
from com.sun.star.task import XInteractionHandler
from com.sun.star.ucb import XCommandEnvironment, XProgressHandler

SOFFICE = os.environ.get("RXNHEAT_SOFFICE", shutil.which("soffice") or "/usr/bin/soffice")


def prop(name, value):
    p = PropertyValue()
    p.Name = name
    p.Value = value
    return p


def file_url(path):
    return uno.systemPathToFileUrl(os.path.abspath(path))


class OfficeError(RuntimeError):
    pass


def free_port():
    with socket.socket() as s:
        s.bind(("127.0.0.1", 0))
        return s.getsockname()[1]


class Office:
    """One soffice process with a private profile under `workdir`."""

    def __init__(self, workdir, name, log=print, run_as=None):
        """run_as: None, or a command prefix that runs soffice as another (unprivileged)
        user, e.g. ["setpriv", "--reuid=65534", ...]; the office then listens on a local TCP
        port instead of a pipe, since pipes are private to their user."""
        self.workdir = workdir
        self.profile_url = file_url(os.path.join(workdir, "profile"))
        self.pipe = "rxnheat_%s_%d" % (name, os.getpid())
        self.run_as = run_as
        self.log = log
        self.proc = None
        self.ctx = None
        self.smgr = None
        self.desktop = None

    def start(self, timeout=60):
        logpath = os.path.join(self.workdir, "soffice-%s.log" % self.pipe)
        self.logfile = open(logpath, "ab")
        if self.run_as:
            connection = "socket,host=127.0.0.1,port=%d" % free_port()
        else:
            connection = "pipe,name=%s" % self.pipe
        args = [SOFFICE, "-env:UserInstallation=" + self.profile_url, "--headless", "--invisible",
                "--nologo", "--norestore", "--nodefault", "--nolockcheck", "--nofirststartwizard",
                "--accept=%s;urp;StarOffice.ComponentContext" % connection]
        # The office's temporary files go into the work folder, which the tests remove.
        tmp = os.path.join(self.workdir, "tmp")
        os.makedirs(tmp, exist_ok=True)
        os.chmod(tmp, 0o1777)
        env = dict(os.environ, TMPDIR=tmp)
        t0 = time.monotonic()
        self.proc = subprocess.Popen((self.run_as or []) + args, stdin=subprocess.DEVNULL,
                                     stdout=self.logfile, stderr=subprocess.STDOUT,
                                     start_new_session=True, env=env)
        local = uno.getComponentContext()
        resolver = local.ServiceManager.createInstanceWithContext(
            "com.sun.star.bridge.UnoUrlResolver", local)
        url = "uno:%s;urp;StarOffice.ComponentContext" % connection
        while True:
            if self.proc.poll() is not None:
                raise OfficeError("soffice exited with status %s before accepting a connection "
                                  "(log: %s)" % (self.proc.returncode, logpath))
            try:
                self.ctx = resolver.resolve(url)
                break
            except NoConnectException:
                if time.monotonic() - t0 > timeout:
                    raise OfficeError("soffice did not accept a connection within %d s" % timeout)
                time.sleep(0.25)
        self.smgr = self.ctx.ServiceManager
        self.desktop = self.smgr.createInstanceWithContext("com.sun.star.frame.Desktop", self.ctx)
        self.log("office started in %.1f s (%s)" % (time.monotonic() - t0, connection))
        return self

    def alive(self):
        return self.proc is not None and self.proc.poll() is None

    def stop(self, timeout=20):
        """Terminate politely, then kill the whole process group."""
        if self.proc is None:
            return
        if self.proc.poll() is None and self.desktop is not None:
            try:
                self.desktop.terminate()
            except Exception:  # the bridge drops when the office exits: expected
                pass
        try:
            self.proc.wait(timeout=timeout)
        except subprocess.TimeoutExpired:
            self.log("office did not exit within %d s: killing it" % timeout)
        self.kill()

    def kill(self):
        if self.proc is None:
            return
        try:
            os.killpg(self.proc.pid, signal.SIGKILL)
        except ProcessLookupError:
            pass
        try:
            self.proc.wait(timeout=10)
        except subprocess.TimeoutExpired:
            pass
        self.proc = None
        self.desktop = None
        try:
            self.logfile.close()
        except Exception:
            pass

    # --- documents ------------------------------------------------------------------------
    def new_calc(self):
        return self.desktop.loadComponentFromURL("private:factory/scalc", "_blank", 0,
                                                 (prop("Hidden", True),))

    def load(self, path):
        return self.desktop.loadComponentFromURL(file_url(path), "_blank", 0,
                                                 (prop("Hidden", True),))

    @contextlib.contextmanager
    def opened(self, path):
        """The document at `path`, closed (unsaved) when the block ends, however it ends; an
        OfficeError if the office cannot open it."""
        doc = self.load(path)
        if doc is None:
            raise OfficeError("LibreOffice could not open %s" % path)
        try:
            yield doc
        finally:
            doc.close(True)

    # --- extensions -----------------------------------------------------------------------
    def extension_manager(self):
        return self.ctx.getValueByName("/singletons/com.sun.star.deployment.ExtensionManager")

    def install_extension(self, oxt_path):
        """Installs for the profile's user through the office's own ExtensionManager (works
        as root too, where the unopkg command refuses per-user installs). Approves the
        licence; any other question from the office aborts the installation."""
        em = self.extension_manager()
        env = _CommandEnv()
        em.addExtension(file_url(oxt_path), (), "user", em.createAbortChannel(), env)
        if env.refused:
            raise OfficeError("installation asked: %s" % "; ".join(env.refused))
        return env

    def user_extensions(self):
        em = self.extension_manager()
        out = []
        for ext in em.getDeployedExtensions("user", em.createAbortChannel(), _CommandEnv()):
            out.append(ext)
        return out


class _CommandEnv(unohelper.Base, XCommandEnvironment, XInteractionHandler, XProgressHandler):
    def __init__(self):
        self.approvals = 0
        self.refused = []

    def getInteractionHandler(self):
        return self

    def getProgressHandler(self):
        return self

    def handle(self, request):
        # PyUNO here cannot read the request itself (an exception inside an any), so the
        # continuations decide: a question that can be approved (on a fresh profile, only the
        # licence) is approved and counted; anything else is aborted and recorded.
        conts = list(request.getContinuations())

        def find(kind):
            t = uno.getTypeByName("com.sun.star.task.XInteraction" + kind)
            for c in conts:
                if c.queryInterface(t) is not None:
                    return c
            return None

        approve = find("Approve")
        if approve is not None:
            self.approvals += 1
            approve.select()
            return
        self.refused.append("a question that could only be aborted")
        abort = find("Abort")
        if abort is not None:
            abort.select()

    def push(self, status):
        pass

    def update(self, status):
        pass

    def pop(self):
        pass
