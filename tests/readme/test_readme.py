#!/usr/bin/python3
"""Every formula and every command of README.md works as written.

Reads the pages given with --readme (README.md, and engine/DATA.md if it has formulas) and
checks two kinds of example, literally as the page writes them:

- Formulas: every inline code span that starts with `=NAME(` is typed into a cell of a real
  headless LibreOffice with the built add-in installed (into a throw-away profile, through the
  office's own ExtensionManager, as tests/addin/test_e2e.py does) and recalculated. A span
  `` `text` in A1 `` before it puts that text into that cell first, and a formula followed by
  "in B1" goes into B1. The cell must not be an error, unless the page says "(an error" right
  after the formula (before the next formula); then it must be one. Where the page states a
  value after the formula, "about −890.6", the result must round to it at the precision written
  (±0.05 here); where it states a text, "reads `ok`" (or "gives `…`", "shows `…`"), the cell
  must hold exactly that text.
- Commands: every line of a code block that starts with `rxnheat ` is run with the built CLI
  (--cli) from the folder of the first page, split as a shell would split it (no shell runs).
  It must exit 0, or the status a trailing `# exit N` states. The lines right after it in the
  same block, up to a blank line or the next command, are its expected standard output, compared
  line by line.

Prints every example with its result and a final "N passed, M failed" line; exit status 0 when
nothing failed. Run by CTest (tests/CMakeLists.txt) as test_readme. The office is killed on any
failure or after --timeout seconds.
"""
import argparse
import os
import re
import shlex
import signal
import subprocess
import sys
import tempfile
import time
import traceback
import shutil

sys.dont_write_bytecode = True  # no __pycache__ in the source tree
sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "scripts"))

MINUS = "\u2212"


class Timeout(Exception):
    pass


# ---- reading the page ----------------------------------------------------------------------

def blocks(text):
    """The page as ("code", [lines]) and ("prose", paragraph text) blocks. Code blocks are
    fenced (```) or indented by four spaces after a blank line, as CommonMark has them."""
    out = []
    lines = text.split("\n")
    i = 0
    para = []

    def flush():
        if para:
            out.append(("prose", " ".join(l.strip() for l in para)))
            para.clear()

    while i < len(lines):
        line = lines[i]
        if line.strip().startswith("```"):
            flush()
            i += 1
            code = []
            while i < len(lines) and not lines[i].strip().startswith("```"):
                code.append(lines[i])
                i += 1
            out.append(("code", code))
            i += 1
            continue
        if line.startswith("    ") and not para:
            code = []
            while i < len(lines) and (lines[i].startswith("    ") or not lines[i].strip()):
                code.append(lines[i][4:])
                i += 1
            while code and not code[-1].strip():
                code.pop()
            out.append(("code", code))
            continue
        if not line.strip():
            flush()
        else:
            para.append(line)
        i += 1
    flush()
    return out


SPAN = re.compile(r"`([^`]+)`")
FORMULA = re.compile(r"^=[A-Z][A-Z0-9.]*\(")
CELL_AFTER = re.compile(r"^\s+in\s+([A-Z]{1,2}[1-9][0-9]{0,4})\b")
ABOUT = re.compile(r"\babout\s+([" + MINUS + r"+-]?\d[\d,]*(?:\.\d+)?)")
TEXT_STATED = re.compile(r"\b(?:reads|gives|shows)\s+`([^`]*)`")


def stated_number(token):
    """'−7,710' -> (-7710.0, 0.5); '−890.6' -> (-890.6, 0.05): the value and half a unit of
    its last written digit."""
    t = token.replace(MINUS, "-").replace(",", "")
    decimals = len(t.split(".")[1]) if "." in t else 0
    return float(t), 0.5 * 10.0 ** (-decimals)


class Formula:
    def __init__(self, page, text, cell, inputs, expect):
        self.page, self.text, self.cell, self.inputs, self.expect = page, text, cell, inputs, expect


def formulas_of(page, text):
    """Formulas in document order, each with the cell inputs the page states before it."""
    found = []
    inputs = {}  # cell -> text, as stated so far on the page
    for kind, body in blocks(text):
        if kind != "prose":
            continue
        spans = list(SPAN.finditer(body))
        starts = [m.start() for m in spans if FORMULA.match(m.group(1))] + [len(body)]
        for m in spans:
            where = CELL_AFTER.match(body[m.end():])
            if not FORMULA.match(m.group(1)):
                if where:
                    inputs[where.group(1)] = m.group(1)
                continue
            # What the page says of this formula: the text up to the next formula.
            tail = body[m.end():min(s for s in starts if s > m.start())]
            if "(an error" in tail:
                expect = ("error", None)
            elif ABOUT.search(tail):
                expect = ("number", stated_number(ABOUT.search(tail).group(1)))
            elif TEXT_STATED.search(tail):
                expect = ("text", TEXT_STATED.search(tail).group(1))
            else:
                expect = ("any", None)
            found.append(Formula(page, m.group(1), where.group(1) if where else None,
                                 sorted(inputs.items()), expect))
    return found


class Command:
    def __init__(self, page, line, status, output):
        self.page, self.line, self.status, self.output = page, line, status, output


EXIT_COMMENT = re.compile(r"#\s*exit\s+(\d+)\s*$")


def commands_of(page, text):
    found = []
    for kind, body in blocks(text):
        if kind != "code":
            continue
        i = 0
        while i < len(body):
            line = body[i].rstrip()
            if not line.startswith("rxnheat "):
                i += 1
                continue
            m = EXIT_COMMENT.search(line)
            status = int(m.group(1)) if m else 0
            output = []
            i += 1
            while i < len(body) and body[i].strip() and not body[i].startswith("rxnheat "):
                output.append(body[i].rstrip())
                i += 1
            found.append(Command(page, line, status, output))
    return found


# ---- running them --------------------------------------------------------------------------

class Tally:
    def __init__(self):
        self.passed = 0
        self.failed = []

    def report(self, ok, what, detail):
        print("%s  %s\n      %s" % ("PASS" if ok else "FAIL", what, detail), flush=True)
        if ok:
            self.passed += 1
        else:
            self.failed.append(what)


def run_command(tally, cli, top, c):
    argv = shlex.split(c.line, comments=True)
    argv[0] = cli
    try:
        out = subprocess.run(argv, cwd=top, capture_output=True, text=True, timeout=30)
    except subprocess.TimeoutExpired:
        tally.report(False, "%s: %s" % (c.page, c.line), "did not finish within 30 s")
        return
    got = [l.rstrip() for l in out.stdout.rstrip("\n").split("\n")] if out.stdout else []
    ok = out.returncode == c.status
    detail = "exit %d (want %d)" % (out.returncode, c.status)
    if c.output:
        same = got == c.output
        ok = ok and same
        detail += "; output %s" % ("as written" if same else "differs:\n        got:  %s\n        want: %s"
                                   % ("\n              ".join(got), "\n              ".join(c.output)))
    else:
        detail += "; %s" % (got[0][:100] + (" …" if len(got) > 1 or len(got[0]) > 100 else "") if got else "no output")
    if out.returncode != c.status and out.stderr:
        detail += "; stderr: " + out.stderr.strip()[:300]
    tally.report(ok, "%s: %s" % (c.page, c.line), detail)


def cell_result(cell):
    """('error', code) or ('number', value) or ('text', text) after recalculation."""
    err = cell.getError()
    if err:
        return ("error", err)
    kind = cell.FormulaResultType2  # com.sun.star.sheet.FormulaResult: 1 value, 2 text, 4 error
    if kind == 1:
        return ("number", cell.getValue())
    if kind == 2:
        return ("text", cell.getString())
    return ("error", "result type %s" % kind)


def run_formulas(tally, doc, formulas):
    sheet = doc.Sheets.getByIndex(0)
    scratch = 100  # rows of column Z for formulas the page places nowhere
    for f in formulas:
        for address, text in f.inputs:
            sheet.getCellRangeByName(address).setString(text)
        address = f.cell
        if address is None:
            scratch += 1
            address = "Z%d" % scratch
        cell = sheet.getCellRangeByName(address)
        cell.setFormula(f.text)
        doc.calculateAll()
        kind, value = cell_result(cell)
        want, arg = f.expect
        shown = "%s %r" % (kind, value)
        if want == "error":
            ok = kind == "error"
            detail = "%s (the page says it is an error)" % shown
        elif kind == "error":
            ok = False
            detail = "%s (Err:%s); the page does not say it is an error" % (shown, value)
        elif want == "number":
            v, tol = arg
            ok = kind == "number" and abs(value - v) <= tol * (1 + 1e-12)
            detail = "%s (the page says about %s, ± %g)" % (shown, ("%.10g" % v), tol)
        elif want == "text":
            ok = kind == "text" and value == arg
            detail = "%s (the page says %r)" % (shown, arg)
        else:
            ok = kind in ("number", "text") and (kind == "number" or value != "")
            detail = shown
        inputs = "".join("%s=%r, " % (a, t) for a, t in f.inputs if a in f.text)
        tally.report(ok, "%s: %s%s" % (f.page, inputs, f.text), detail)


def main():
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--oxt", required=True, help="the built rxnheat.oxt")
    ap.add_argument("--cli", required=True, help="the built rxnheat command line")
    ap.add_argument("--readme", action="append", required=True,
                    help="a page to check (repeatable); commands run in the folder of the first")
    ap.add_argument("--timeout", type=int, default=170)
    ap.add_argument("--keep", action="store_true", help="keep the work folder")
    args = ap.parse_args()

    def on_alarm(signum, frame):
        raise Timeout("the README test ran over %d s" % args.timeout)

    signal.signal(signal.SIGALRM, on_alarm)
    signal.alarm(args.timeout)
    tally = Tally()
    top = os.path.dirname(os.path.abspath(args.readme[0]))
    formulas, commands = [], []
    for page in args.readme:
        with open(page, encoding="utf-8") as fh:
            text = fh.read()
        name = os.path.relpath(os.path.abspath(page), top)
        formulas += formulas_of(name, text)
        commands += commands_of(name, text)
    print("%d formulas and %d commands found in %s" % (len(formulas), len(commands),
                                                       ", ".join(args.readme)), flush=True)
    tally.report(len(formulas) > 0 and len(commands) > 0, "the pages have formulas and commands",
                 "%d formulas, %d commands" % (len(formulas), len(commands)))

    for c in commands:
        run_command(tally, os.path.abspath(args.cli), top, c)

    workdir = tempfile.mkdtemp(prefix="rxnheat-readme-")
    off = None
    try:
        import office as officelib  # scripts/office.py; needs the system python3 with python3-uno
        off = officelib.Office(workdir, "readme-install").start()
        off.install_extension(args.oxt)
        off.stop()
        off = officelib.Office(workdir, "readme-run").start()
        doc = off.new_calc()
        run_formulas(tally, doc, formulas)
        doc.close(True)
        off.stop()
        off = None
    except Timeout as e:
        tally.report(False, "finished in time", str(e))
    except Exception as e:
        tally.report(False, "the office part ran to the end",
                     "%s: %s\n%s" % (type(e).__name__, e, traceback.format_exc()))
    finally:
        signal.alarm(0)
        if off is not None:
            off.kill()
        if not args.keep:
            shutil.rmtree(workdir, ignore_errors=True)
    print("%d passed, %d failed" % (tally.passed, len(tally.failed)), flush=True)
    for f in tally.failed:
        print("  failed: " + f)
    return 0 if not tally.failed else 1


if __name__ == "__main__":
    sys.exit(main())
