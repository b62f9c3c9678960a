"""Pieces shared by the add-in's end-to-end tests: the check tally, the time limit, the engine's
own answers from the `rxnheat` CLI, and IUPAC molar masses from Debian's python3-periodictable."""
import json
import math
import subprocess


class Timeout(Exception):
    pass


class Checks:
    """Counts passed checks; prints and keeps each failure and skip."""

    def __init__(self):
        self.passed = 0
        self.failed = []
        self.skipped = []

    def ok(self, name, condition, detail=""):
        if condition:
            self.passed += 1
        else:
            self.failed.append(name + (": " + detail if detail else ""))
            print("FAIL  " + name + (": " + detail if detail else ""), flush=True)
        return condition

    def close(self, name, got, want, tol, source=""):
        """|got - want| <= tol (absolute)."""
        good = (isinstance(got, float) and isinstance(want, (int, float))
                and math.isfinite(got) and abs(got - want) <= tol)
        return self.ok(name, good, "got %r, want %r ± %g %s" % (got, want, tol, source))

    def rel(self, name, got, want, rtol, atol=1e-9):
        """|got - want| <= max(atol, rtol·|want|)."""
        good = (isinstance(got, float) and isinstance(want, float) and math.isfinite(got)
                and math.isfinite(want) and abs(got - want) <= max(atol, rtol * abs(want)))
        return self.ok(name, good, "got %r, want %r (rtol %g)" % (got, want, rtol))

    def skip(self, name, why):
        self.skipped.append("%s: %s" % (name, why))
        print("SKIP  %s: %s" % (name, why), flush=True)


class EngineCli:
    """The engine's own answers from the `rxnheat` command line (cli/CLI.md)."""

    def __init__(self, path):
        self.path = path

    def json(self, *args, stdin=None):
        out = subprocess.run([self.path] + list(args) + ["--json"], input=stdin,
                             capture_output=True, text=True, timeout=30)
        return json.loads(out.stdout)

    def value(self, *args):
        return float(self.json(*args)["value"])

    def text(self, *args):
        out = subprocess.run([self.path] + list(args), capture_output=True, text=True,
                             timeout=30)
        return out.stdout.strip()


def iupac_molar_mass(formula):
    """g/mol from IUPAC standard atomic weights via Debian's python3-periodictable, or None
    when that package is missing."""
    try:
        import periodictable
    except ImportError:
        return None
    return float(periodictable.formula(formula).mass)
