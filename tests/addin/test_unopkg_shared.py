#!/usr/bin/python3
"""Installs and removes rxnheat.oxt system-wide with `unopkg add --shared`, as an administrator would.

This changes the machine's LibreOffice installation (files under /usr/lib/libreoffice/share and
/var/spool/libreoffice), so it runs only as root and only when asked: CI=true or
RXNHEAT_SYSTEM_TESTS=1 in the environment. Otherwise it exits with status 77, which CTest
reports as skipped (SKIP_RETURN_CODE in tests/CMakeLists.txt). It also refuses to start (status
77, with a reason) when org.rxnheat.calc is already installed system-wide, since its clean-up
would remove an installation it did not make.

Checks: `unopkg add --shared -s` succeeds; `unopkg list --shared` shows org.rxnheat.calc and its
version and asks for no licence (the licence is accepted by the administrator); a headless office
on a fresh private profile (-env:UserInstallation) computes =RXNDH(...); `unopkg remove --shared`
succeeds and the list no longer shows it; a fresh office no longer knows RXNDH. The removal runs
in a `finally`, so the system is left as it was on any failure or timeout, and the office is
killed. unopkg itself runs with a private HOME and profile, so root's own profile is untouched.
Also reports (and removes) any lu*.tmp file or lu*.tmp_ folder that this run left in the shared
package cache.
"""
import argparse
import glob
import os
import shutil
import signal
import subprocess
import sys
import tempfile
import time

sys.dont_write_bytecode = True  # no __pycache__ in the source tree
sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "scripts"))
from common import Checks, Timeout  # noqa: E402
import office as officelib  # noqa: E402

UNOPKG = shutil.which("unopkg") or "/usr/bin/unopkg"
IDENTIFIER = "org.rxnheat.calc"
REACTION = "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)"
SKIP = 77  # CTest's SKIP_RETURN_CODE for this test
# Where a failed shared install leaves its half-unpacked copy: an empty file lu….tmp and a
# folder lu….tmp_ beside it (seen with LibreOffice 7.4).
SHARED_CACHE = "/var/spool/libreoffice/uno_packages/cache/uno_packages"


def wanted():
    return (os.environ.get("CI", "").lower() == "true"
            or os.environ.get("RXNHEAT_SYSTEM_TESTS", "") == "1")


def stale_folders():
    return set(glob.glob(os.path.join(SHARED_CACHE, "lu*.tmp"))
               + glob.glob(os.path.join(SHARED_CACHE, "lu*.tmp_")))


def main():
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--oxt", required=True)
    ap.add_argument("--version", required=True)
    ap.add_argument("--timeout", type=int, default=150)
    args = ap.parse_args()

    if not wanted():
        print("skipped: changes the system's LibreOffice; set RXNHEAT_SYSTEM_TESTS=1 (or CI=true) "
              "to run it")
        return SKIP
    if os.geteuid() != 0:
        print("skipped: a shared (system-wide) install needs root")
        return SKIP

    workdir = tempfile.mkdtemp(prefix="rxnheat-unopkg-shared-")
    oxt = os.path.join(workdir, "rxnheat.oxt")
    shutil.copy(args.oxt, oxt)
    # unopkg keeps a user profile even for --shared work: give it one of its own, and a HOME.
    unopkg_env = dict(os.environ, HOME=os.path.join(workdir, "unopkg-home"))
    unopkg_profile = "-env:UserInstallation=" + officelib.file_url(
        os.path.join(workdir, "unopkg-profile"))
    os.environ["HOME"] = os.path.join(workdir, "office-home")  # the offices run with this HOME

    def unopkg(*words, timeout=60):
        t0 = time.monotonic()
        p = subprocess.run([UNOPKG] + list(words) + [unopkg_profile], env=unopkg_env,
                           capture_output=True, text=True, timeout=timeout,
                           stdin=subprocess.DEVNULL)
        print("$ unopkg %s  -> %d (%.1f s)" % (" ".join(words), p.returncode,
                                              time.monotonic() - t0), flush=True)
        return p

    p = unopkg("list", "--shared")
    if IDENTIFIER in p.stdout:
        shutil.rmtree(workdir, ignore_errors=True)
        print("skipped: %s is already installed system-wide; this test would remove it. "
              "Remove it first: unopkg remove --shared %s" % (IDENTIFIER, IDENTIFIER))
        return SKIP
    stale_before = stale_folders()

    def on_alarm(signum, frame):
        raise Timeout("ran over %d s" % args.timeout)

    signal.signal(signal.SIGALRM, on_alarm)
    signal.alarm(args.timeout)
    checks = Checks()
    off = None
    installed = False

    def compute(name):
        """A fresh office on a profile of its own: (error code, value) of =RXNDH(...)."""
        nonlocal off
        os.makedirs(os.path.join(workdir, name), exist_ok=True)
        off = officelib.Office(os.path.join(workdir, name), name)
        off.start()
        doc = off.new_calc()
        cell = doc.Sheets.getByIndex(0).getCellRangeByName("A1")
        cell.setFormula('=RXNDH("%s")' % REACTION)
        doc.calculateAll()
        result = (cell.getError(), cell.getValue())
        doc.close(True)
        off.stop()
        off = None
        return result

    try:
        t0 = time.monotonic()
        installed = True  # from here on, the finally removes it whatever happens
        p = unopkg("add", "--shared", "-s", oxt)
        checks.ok("unopkg add --shared -s", p.returncode == 0, p.stdout + p.stderr)
        p = unopkg("list", "--shared")
        checks.ok("unopkg list --shared shows %s" % IDENTIFIER, IDENTIFIER in p.stdout,
                  p.stdout + p.stderr)
        checks.ok("unopkg list --shared shows version %s" % args.version,
                  ("Version: %s" % args.version) in p.stdout, p.stdout)
        # With accept-by="user" the list prints the licence and a question instead, and the
        # extension is not registered (LibreOffice 7.4).
        checks.ok("unopkg list --shared asks for no licence",
                  "License Agreement" not in p.stdout and '"yes" or "no"' not in p.stdout,
                  p.stdout)

        err, value = compute("office-installed")
        # CODATA Key Values (Cox et al. 1989) with CH4(g) from NASA/TP-2002-211556: −890.57.
        checks.ok("shared install, fresh profile: RXNDH computes", err == 0
                  and abs(value - (-890.57)) < 0.15, "error %d value %r" % (err, value))

        p = unopkg("remove", "--shared", IDENTIFIER)
        checks.ok("unopkg remove --shared", p.returncode == 0, p.stdout + p.stderr)
        installed = p.returncode != 0
        p = unopkg("list", "--shared")
        checks.ok("unopkg list --shared no longer shows it", IDENTIFIER not in p.stdout, p.stdout)

        err, value = compute("office-removed")
        # Err:525 is Calc's #NAME? (an unknown function name).
        checks.ok("removed: RXNDH is an unknown name again (#NAME?)", err == 525,
                  "error %d value %r" % (err, value))
        print("install, use, remove: %.1f s" % (time.monotonic() - t0))
    except Timeout as e:
        checks.ok("finished in time", False, str(e))
    except Exception as e:
        checks.ok("ran to the end", False, "%s: %s" % (type(e).__name__, e))
    finally:
        signal.alarm(0)
        if off is not None:
            off.kill()
        if installed:
            p = unopkg("remove", "--shared", IDENTIFIER)
            if p.returncode != 0 and IDENTIFIER in unopkg("list", "--shared").stdout:
                checks.ok("clean-up: unopkg remove --shared", False, p.stdout + p.stderr)
        left = stale_folders() - stale_before
        checks.ok("no lu*.tmp(_) left in %s" % SHARED_CACHE, not left, " ".join(sorted(left)))
        for d in left:
            if os.path.isdir(d) and not os.path.islink(d):
                shutil.rmtree(d, ignore_errors=True)
            else:
                os.remove(d)
        shutil.rmtree(workdir, ignore_errors=True)
    print("%d passed, %d failed" % (checks.passed, len(checks.failed)))
    return 0 if not checks.failed else 1


if __name__ == "__main__":
    sys.exit(main())
