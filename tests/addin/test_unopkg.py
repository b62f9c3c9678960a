#!/usr/bin/python3
"""Installs and removes rxnheat.oxt with the `unopkg` commands of addin/README-install.md.

Per-user, into a private profile (-env:UserInstallation), as a desktop user would. unopkg
refuses per-user work as root, so when this runs as root it first checks that refusal and then
does everything (unopkg and the office) as the unprivileged user `nobody` via setpriv, with a
private HOME. The office makes the profile first (as on a desktop). Checks: `unopkg add` succeeds, `unopkg list` shows org.rxnheat.calc and its
version, the office then computes =RXNDH(...), `unopkg remove org.rxnheat.calc` succeeds, the
list no longer shows it, and the office no longer knows RXNDH. Nothing outside the work folder
is touched; the office is killed on any failure or timeout.
"""
import argparse
import os
import pwd
import shutil
import signal
import subprocess
import sys
import tempfile
import time

sys.dont_write_bytecode = True  # no __pycache__ in the source tree
sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "scripts"))
from common import Timeout  # noqa: E402
import office as officelib  # noqa: E402  (scripts/office.py)

UNOPKG = shutil.which("unopkg") or "/usr/bin/unopkg"
IDENTIFIER = "org.rxnheat.calc"
REACTION = "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)"


def main():
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--oxt", required=True)
    ap.add_argument("--version", required=True)
    ap.add_argument("--timeout", type=int, default=150)
    args = ap.parse_args()

    def on_alarm(signum, frame):
        raise Timeout("ran over %d s" % args.timeout)

    signal.signal(signal.SIGALRM, on_alarm)
    signal.alarm(args.timeout)
    failures = []
    passed = 0

    def ok(name, condition, detail=""):
        nonlocal passed
        if condition:
            passed += 1
        else:
            failures.append(name)
            print("FAIL  %s%s" % (name, ": " + detail if detail else ""), flush=True)

    workdir = tempfile.mkdtemp(prefix="rxnheat-unopkg-")
    os.chmod(workdir, 0o755)
    home = os.path.join(workdir, "home")
    os.makedirs(home)
    os.makedirs(os.path.join(workdir, "profile"))
    oxt = os.path.join(workdir, "rxnheat.oxt")
    shutil.copy(args.oxt, oxt)
    os.chmod(oxt, 0o644)
    profile_arg = "-env:UserInstallation=" + officelib.file_url(os.path.join(workdir, "profile"))
    env = dict(os.environ, HOME=home)
    os.environ["HOME"] = home  # for the office too (started with this process's environment)

    run_as = None
    if os.geteuid() == 0:
        user = pwd.getpwnam("nobody")
        for d in (home, os.path.join(workdir, "profile")):
            os.chown(d, user.pw_uid, user.pw_gid)
        run_as = ["setpriv", "--reuid=%d" % user.pw_uid, "--regid=%d" % user.pw_gid,
                  "--clear-groups", "--"]

    def unopkg(*words, as_user=True, timeout=60):
        if as_user:
            cmd = (run_as or []) + [UNOPKG] + list(words) + [profile_arg]
            cmd_env = env
        else:  # as root, in a profile and HOME of its own, so nothing root-owned is left behind
            cmd = [UNOPKG] + list(words) + [
                "-env:UserInstallation=" + officelib.file_url(os.path.join(workdir, "root-profile"))]
            cmd_env = dict(os.environ, HOME=os.path.join(workdir, "root-home"))
        t0 = time.monotonic()
        p = subprocess.run(cmd, env=cmd_env, capture_output=True, text=True, timeout=timeout,
                           stdin=subprocess.DEVNULL)
        print("$ unopkg %s  -> %d (%.1f s)" % (" ".join(words), p.returncode,
                                              time.monotonic() - t0), flush=True)
        return p

    off = None
    try:
        if run_as:
            p = unopkg("add", "-s", oxt, as_user=False)
            ok("as root, per-user unopkg add is refused", p.returncode != 0,
               p.stdout + p.stderr)
        # A desktop user's profile exists before they add an extension. On a profile that
        # unopkg itself created, the office's first start drops the registration (seen with
        # LibreOffice 7.4), so the office makes the profile first, as it would on a desktop.
        off = officelib.Office(workdir, "first-start", run_as=run_as)
        off.start()
        off.stop()
        off = None
        p = unopkg("add", "-s", oxt)
        ok("unopkg add", p.returncode == 0, p.stdout + p.stderr)
        p = unopkg("list")
        ok("unopkg list shows %s" % IDENTIFIER, IDENTIFIER in p.stdout, p.stdout + p.stderr)
        ok("unopkg list shows version %s" % args.version, ("Version: %s" % args.version) in p.stdout,
           p.stdout)

        off = officelib.Office(workdir, "unopkg", run_as=run_as)
        off.start()
        doc = off.new_calc()
        cell = doc.Sheets.getByIndex(0).getCellRangeByName("A1")
        cell.setFormula('=RXNDH("%s")' % REACTION)
        doc.calculateAll()
        # CODATA Key Values (Cox et al. 1989) with CH4(g) from NASA/TP-2002-211556: −890.57.
        ok("installed with unopkg: RXNDH computes", cell.getError() == 0 and
           abs(cell.getValue() - (-890.57)) < 0.15,
           "error %d value %r" % (cell.getError(), cell.getValue()))
        doc.close(True)
        off.stop()
        off = None

        p = unopkg("remove", IDENTIFIER)
        ok("unopkg remove", p.returncode == 0, p.stdout + p.stderr)
        p = unopkg("list")
        ok("unopkg list no longer shows it", IDENTIFIER not in p.stdout, p.stdout)

        off = officelib.Office(workdir, "unopkg2", run_as=run_as)
        off.start()
        doc = off.new_calc()
        cell = doc.Sheets.getByIndex(0).getCellRangeByName("A1")
        cell.setFormula('=RXNDH("%s")' % REACTION)
        doc.calculateAll()
        # Err:525 is Calc's #NAME? (an unknown function name).
        ok("removed: RXNDH is an unknown name again (#NAME?)", cell.getError() == 525,
           "error %d value %r" % (cell.getError(), cell.getValue()))
        doc.close(True)
        off.stop()
        off = None
    except Timeout as e:
        ok("finished in time", False, str(e))
    except Exception as e:
        ok("ran to the end", False, "%s: %s" % (type(e).__name__, e))
    finally:
        signal.alarm(0)
        if off is not None:
            off.kill()
        shutil.rmtree(workdir, ignore_errors=True)
    print("%d checks passed, %d failed" % (passed, len(failures)))
    return 0 if not failures else 1


if __name__ == "__main__":
    sys.exit(main())
