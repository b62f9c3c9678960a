#!/usr/bin/python3
"""Benchmark of the rxnheat Calc add-in in a real headless LibreOffice (issue 3, item 6).

Not a CTest test: run by hand, with the system Python that has the `uno` module (Debian:
python3-uno), one run at a time (it starts one office at a time, each with its own throw-away
profile, and kills it afterwards):

    cmake -S . -B build-bench -DRXNHEAT_TESTS=ON
    cmake --build build-bench --target rxnheat_oxt bench_noop_oxt -j2
    /usr/bin/python3 tests/bench/bench_addin.py \\
        --oxt build-bench/addin/rxnheat.oxt \\
        --noop-oxt build-bench/tests/bench/noop_addin/bench_noop.oxt \\
        [--rows 20000] [--runs 9] [--trials 5] [--markdown table.md]

It takes about 7 minutes on 2 cores (4 installs, 1 + 15 office starts).

What it measures (medians over --runs recalculations, or over --trials fresh offices):
  recalculation  the time of XCalculatable.calculateAll() on a sheet whose column A holds
                 --rows reaction texts, with column B holding, in turn: nothing; =LEN(An) (a
                 built-in function of the same shape); =BENCHNOOP(An) (bench_noop.oxt: the shape
                 and argument handling of RXNDH, no engine, returns 0); =RXNDH(An); one array
                 formula {=RXNDH(A1:An)}; one array formula {=BENCHNOOP(A1:An)}. Two sheets of
                 texts: "mix", 20 distinct reactions repeated, and "distinct", the same reactions
                 with their whitespace varied so that every text differs and the engine's cache
                 of prepared reactions (by exact text) cannot help. Every run's results are
                 checked (no error cells; RXNDH equal on both sheets and in the array form; LEN
                 equal to the text length; BENCHNOOP 0). Wall time, the office's CPU time and
                 its time spent waiting for a CPU (all soffice.bin threads, from
                 /proc/PID/task/*/schedstat) are reported: on a machine shared with other work,
                 CPU time is the steadier figure, and the wait says how much others took.
  first call     from starting a fresh office (the add-in installed in its profile) to the
                 first =RXNDH result, split into office start, new document, first formula;
                 the same with =BENCHNOOP (add-in loading without the engine) and =LEN (no
                 add-in) in offices whose profiles hold only that add-in or none. The office
                 start is quantised by scripts/office.py, which polls for the connection
                 every 0.25 s; the first-result time is measured to the microsecond.
  memory         VmRSS (and the peak, VmHWM) of soffice.bin from /proc/PID/status: with an
                 empty document before the first add-in call, after the first call, and after
                 recalculating the --rows-cell sheet (mix, then distinct).

Exit status 0 when every run's results checked out, 1 otherwise.
"""
import argparse
import os
import platform
import shutil
import signal
import statistics
import subprocess
import sys
import tempfile
import time

sys.dont_write_bytecode = True  # no __pycache__ in the source tree
HERE = os.path.dirname(os.path.abspath(__file__))
sys.path.insert(0, os.path.join(HERE, "..", "..", "scripts"))
import office as officelib  # noqa: E402  (scripts/office.py; needs python3-uno)

# A realistic mix of 20 reactions a process engineer's sheet would hold (combustion, synthesis
# gas, ammonia and acid plants, calcination, hydrogenation), written the ways grammar/SYNTAX.md
# allows (phases omitted, fractions, Unicode arrows and subscripts, aliases).
REACTIONS = [
    "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)",
    "C2H6(g) + 7/2 O2(g) -> 2 CO2(g) + 3 H2O(l)",
    "C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(g)",
    "2H2 + O2 = 2H2O",
    "CO(g) + 1/2 O2(g) -> CO2(g)",
    "CO(g) + H2O(g) -> CO2(g) + H2(g)",
    "CH4(g) + H2O(g) -> CO(g) + 3 H2(g)",
    "1/2 N2(g) + 3/2 H2(g) \u2192 NH3(g)",
    "SO2(g) + 0.5 O2(g) \u21cc SO3(g)",
    "CaCO3(s) -> CaO(s) + CO2(g)",
    "C2H4(g) + H2(g) -> C2H6(g)",
    "ethanol(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)",
    "CH\u2084(g) + 2O\u2082(g) \u2192 CO\u2082(g) + 2H\u2082O(l)",
    "N2(g) + O2(g) -> 2 NO(g)",
    "4 NH3(g) + 5 O2(g) -> 4 NO(g) + 6 H2O(g)",
    "2 NO(g) + O2(g) -> 2 NO2(g)",
    "C(s) + O2(g) -> CO2(g)",
    "Ca(OH)2(s) + CO2(g) -> CaCO3(s) + H2O(l)",
    "CO(g) + 2 H2(g) -> CH3OH(g)",
    "acetylene(g) + 5/2 O2(g) -> 2 CO2(g) + H2O(l)",
]
CH4_COMBUSTION = REACTIONS[0]

ERROR = 4  # com.sun.star.sheet.FormulaResult.ERROR
CLEAR_ALL = 1 | 2 | 4 | 16 | 512  # CellFlags VALUE | DATETIME | STRING | FORMULA | EDITATTR


class Timeout(Exception):
    pass


class CheckFailed(Exception):
    pass


# --- the office process, from /proc ---------------------------------------------------------
def soffice_bin_pid(office, timeout=10):
    """The soffice.bin process in the office's process group (the soffice script and oosplash
    start it; Office starts the group with start_new_session)."""
    group = office.proc.pid
    t0 = time.monotonic()
    while True:
        for name in os.listdir("/proc"):
            if not name.isdigit():
                continue
            try:
                with open("/proc/%s/stat" % name) as f:
                    stat = f.read()
            except OSError:
                continue
            comm = stat[stat.index("(") + 1:stat.rindex(")")]
            fields = stat[stat.rindex(")") + 2:].split()
            if comm == "soffice.bin" and int(fields[2]) == group:  # fields[2]: pgrp
                return int(name)
        if time.monotonic() - t0 > timeout:
            raise RuntimeError("no soffice.bin in process group %d" % group)
        time.sleep(0.1)


def memory_kib(pid):
    """VmRSS and VmHWM of a process, in KiB."""
    out = {}
    with open("/proc/%d/status" % pid) as f:
        for line in f:
            key, _, rest = line.partition(":")
            if key in ("VmRSS", "VmHWM"):
                out[key] = int(rest.split()[0])
    return out["VmRSS"], out["VmHWM"]


def sched_seconds(pid):
    """(time on a CPU, time waiting for a CPU) of all the process's threads, in seconds, from
    /proc/PID/task/*/schedstat (nanoseconds; threads that ended meanwhile are not counted)."""
    run = wait = 0
    for tid in os.listdir("/proc/%d/task" % pid):
        try:
            with open("/proc/%d/task/%s/schedstat" % (pid, tid)) as f:
                fields = f.read().split()
        except OSError:
            continue
        run += int(fields[0])
        wait += int(fields[1])
    return run / 1e9, wait / 1e9


def mapped(pid, names):
    """Which of the library file names are mapped into the process."""
    with open("/proc/%d/maps" % pid) as f:
        maps = f.read()
    return [n for n in names if n in maps]


LIBRARIES = ("rxnheat_calc.uno.so", "librxnheat.so", "bench_noop.uno.so")


def loadavg():
    with open("/proc/loadavg") as f:
        return " ".join(f.read().split()[:3])


# --- sheets ---------------------------------------------------------------------------------
def spaced(reaction, variant):
    """The reaction with the spaces between its words widened, one base-8 digit of `variant`
    per gap (1 to 8 spaces): same reaction, different text."""
    words = reaction.split(" ")
    out = [words[0]]
    v = variant
    for w in words[1:]:
        out.append(" " * (1 + v % 8) + w)
        v //= 8
    if v:
        raise ValueError("too few gaps in %r for variant %d" % (reaction, variant))
    return "".join(out)


def texts_mix(rows):
    return [REACTIONS[i % len(REACTIONS)] for i in range(rows)]


def texts_distinct(rows):
    out = [spaced(REACTIONS[i % len(REACTIONS)], i // len(REACTIONS)) for i in range(rows)]
    if len(set(out)) != rows:
        raise RuntimeError("the distinct texts are not all distinct")
    return out


class Book:
    """One Calc document: texts in column A, the formulas under test in column B."""

    def __init__(self, office):
        self.office = office
        self.doc = office.new_calc()
        # Formulas are computed only by calculateAll() (the timed call), not while being set.
        self.doc.enableAutomaticCalculation(False)
        self.sheet = self.doc.Sheets.getByIndex(0)
        self.rows = 0
        self.texts = None

    def column(self, letter):
        return self.sheet.getCellRangeByName("%s1:%s%d" % (letter, letter, self.rows))

    def set_texts(self, texts):
        if self.rows:
            self.column("B").clearContents(CLEAR_ALL)
            self.column("A").clearContents(CLEAR_ALL)
        self.rows = len(texts)
        self.column("A").setDataArray(tuple((t,) for t in texts))
        self.texts = texts

    def set_cells(self, function):
        self.column("B").clearContents(CLEAR_ALL)
        if function:
            self.column("B").setFormulaArray(tuple(("=%s(A%d)" % (function, i + 1),)
                                                   for i in range(self.rows)))

    def set_array(self, function):
        self.column("B").clearContents(CLEAR_ALL)
        self.column("B").setArrayFormula("=%s(A1:A%d)" % (function, self.rows))

    def results(self):
        """Column B after recalculation: (values, number of error cells)."""
        errors = 0
        col = self.column("B")
        for a in col.queryFormulaCells(ERROR).getRangeAddresses():
            errors += (a.EndRow - a.StartRow + 1) * (a.EndColumn - a.StartColumn + 1)
        return [row[0] for row in col.getDataArray()], errors

    def close(self):
        self.doc.close(True)


def time_recalc(book, pid, runs):
    """calculateAll() `runs` times after one warm-up; returns (first, [wall], [cpu], [wait])."""
    t0 = time.perf_counter()
    book.doc.calculateAll()
    first = time.perf_counter() - t0
    walls, cpus, waits = [], [], []
    for _ in range(runs):
        c0, w0 = sched_seconds(pid)
        t0 = time.perf_counter()
        book.doc.calculateAll()
        walls.append(time.perf_counter() - t0)
        c1, w1 = sched_seconds(pid)
        cpus.append(c1 - c0)
        waits.append(w1 - w0)
    return first, walls, cpus, waits


# --- the benchmark --------------------------------------------------------------------------
class Bench:
    def __init__(self, args, base):
        self.args = args
        self.base = base
        self.failures = []
        self.seq = 0

    def fail(self, what):
        self.failures.append(what)
        print("FAIL  " + what, flush=True)

    def office(self, profile):
        """A fresh office on the given profile folder (its `profile` subfolder)."""
        self.seq += 1
        return officelib.Office(os.path.join(self.base, profile), "bench%d" % self.seq,
                                log=lambda s: None)

    def install(self, profile, oxts):
        os.makedirs(os.path.join(self.base, profile), exist_ok=True)
        off = self.office(profile)
        try:
            off.start(timeout=120)
            for oxt in oxts:
                off.install_extension(oxt)
            ids = sorted(e.getIdentifier().Value for e in off.user_extensions() if e is not None)
            print("profile %-5s extensions: %s" % (profile, ", ".join(ids) or "none"),
                  flush=True)
        finally:
            off.stop()

    # (a)-(d) --------------------------------------------------------------------------------
    def check(self, name, texts, function, values, errors, reference):
        if errors:
            self.fail("%s: %d error cells" % (name, errors))
            return
        if function == "LEN":
            bad = sum(1 for v, t in zip(values, texts) if v != len(t.encode("utf-16-le")) // 2)
        elif function == "BENCHNOOP":
            bad = sum(1 for v in values if v != 0.0)
        else:
            # RXNDH: the same number for the same reaction, whatever its whitespace and
            # whichever form (cells, array); CH4 combustion -890.57 kJ/mol (CODATA Key Values,
            # Cox et al. 1989, and NASA/TP-2002-211556, as in tests/addin/test_e2e.py).
            n = len(REACTIONS)
            bad = sum(1 for i, v in enumerate(values)
                      if not isinstance(v, float) or v != reference[i] or v != reference[i % n])
            if abs(reference[0] + 890.57) > 0.15:
                self.fail("%s: CH4 combustion gave %r" % (name, reference[0]))
        if bad:
            self.fail("%s: %d of %d results wrong" % (name, bad, len(values)))

    def recalculation(self):
        rows, runs = self.args.rows, self.args.runs
        off = self.office("both")
        results = []
        try:
            off.start(timeout=120)
            pid = soffice_bin_pid(off)
            book = Book(off)
            # Preflight: every reaction of the mix is good input (RXNCHECK says "ok").
            book.set_texts(REACTIONS)
            book.set_cells("RXNCHECK")
            book.doc.calculateAll()
            words, _ = book.results()
            for r, w in zip(REACTIONS, words):
                if w != "ok":
                    raise CheckFailed("reaction %r: RXNCHECK says %r" % (r, w))
            book.close()
            reference = {}  # RXNDH per row, from the first sheet's single-cell form
            for sheet_name, texts in (("mix", texts_mix(rows)), ("distinct", texts_distinct(rows))):
                cases = [("no formulas", None, None), ("=LEN(An)", "LEN", "cells"),
                         ("=BENCHNOOP(An)", "BENCHNOOP", "cells"), ("=RXNDH(An)", "RXNDH", "cells"),
                         ("{=RXNDH(A1:A%d)}" % rows, "RXNDH", "array"),
                         ("{=BENCHNOOP(A1:A%d)}" % rows, "BENCHNOOP", "array")]
                # One document per case, all open at once, and the runs interleaved (run k of
                # every case, in an order rotated by k): on a machine shared with other work,
                # each case and its floor are then measured side by side in time, and the
                # ratio of neighbouring runs is less disturbed than one of medians far apart.
                books = []
                for label, function, form in cases:
                    b = Book(off)
                    b.set_texts(texts)
                    if form == "array":
                        b.set_array(function)
                    else:
                        b.set_cells(function)
                    books.append(b)
                firsts = []
                for b in books:
                    t0 = time.perf_counter()
                    b.doc.calculateAll()
                    firsts.append(time.perf_counter() - t0)
                load0 = loadavg()
                walls = [[] for _ in cases]
                cpus = [[] for _ in cases]
                waits = [[] for _ in cases]
                for k in range(runs):
                    order = list(range(len(cases)))
                    order = order[k % len(order):] + order[:k % len(order)]
                    for i in order:
                        c0, w0 = sched_seconds(pid)
                        t0 = time.perf_counter()
                        books[i].doc.calculateAll()
                        walls[i].append(time.perf_counter() - t0)
                        c1, w1 = sched_seconds(pid)
                        cpus[i].append(c1 - c0)
                        waits[i].append(w1 - w0)
                load1 = loadavg()
                for i, (label, function, form) in enumerate(cases):
                    name = "%s %s" % (sheet_name, label)
                    if function:
                        values, errors = books[i].results()
                        if function == "RXNDH" and "ref" not in reference:
                            reference["ref"] = values
                        self.check(name, texts, function, values, errors, reference.get("ref"))
                    row = dict(sheet=sheet_name, label=label, function=function, form=form,
                               first=firsts[i], walls=walls[i], cpus=cpus[i], waits=waits[i],
                               wall=statistics.median(walls[i]), cpu=statistics.median(cpus[i]),
                               wait=statistics.median(waits[i]), load=(load0, load1))
                    results.append(row)
                    print("%-9s %-22s first %.3f s  median %.3f s (min %.3f, max %.3f)  "
                          "cpu %.3f s  wait %.3f s  load %s -> %s" %
                          (sheet_name, label, firsts[i], row["wall"], min(walls[i]), max(walls[i]),
                           row["cpu"], row["wait"], row["load"][0], row["load"][1]), flush=True)
                for b in books:
                    b.close()
            if not off.alive():
                self.fail("the office died during the recalculation runs")
        finally:
            off.stop()
        return results

    # (e), (f) -------------------------------------------------------------------------------
    def first_call(self, profile, function):
        """One fresh office: times to the first result of `function`, and memory."""
        off = self.office(profile)
        out = {}
        try:
            t0 = time.perf_counter()
            off.start(timeout=120)
            t_started = time.perf_counter()
            pid = soffice_bin_pid(off)
            book = Book(off)
            book.doc.enableAutomaticCalculation(True)
            t_doc = time.perf_counter()
            time.sleep(1.0)  # let the office settle before reading its memory
            out["rss_before"], out["hwm_before"] = memory_kib(pid)
            out["libs_before"] = mapped(pid, LIBRARIES)
            cell_a, cell_b = book.sheet.getCellRangeByName("A1"), book.sheet.getCellRangeByName("B1")
            cell_a.setString(CH4_COMBUSTION)
            c0, w0 = sched_seconds(pid)
            t1 = time.perf_counter()
            cell_b.setFormula("=%s(A1)" % function)
            value = cell_b.getValue()
            t_first = time.perf_counter() - t1
            c1, w1 = sched_seconds(pid)
            # On a shared machine the office's own CPU time is the steadier figure.
            out["first_cpu"], out["first_wait"] = c1 - c0, w1 - w0
            error = cell_b.getError()
            want = {"RXNDH": -890.57, "BENCHNOOP": 0.0, "LEN": float(len(CH4_COMBUSTION))}[function]
            # RXNDH: CODATA Key Values (Cox et al. 1989) CO2(g), H2O(l) and NASA/TP-2002-211556
            # CH4(g), as in tests/addin/test_e2e.py.
            if error or abs(value - want) > 0.15:
                self.fail("first %s in profile %s: got %r (error %d)" %
                          (function, profile, value, error))
            out["rss_first"], out["hwm_first"] = memory_kib(pid)
            out["libs_first"] = mapped(pid, LIBRARIES)
            out.update(start=t_started - t0, doc=t_doc - t_started, first=t_first,
                       total=t_started - t0 + (t_doc - t_started) + t_first)
            # The whole sheet, recalculated: mix, then distinct texts.
            book.doc.enableAutomaticCalculation(False)
            for sheet_name, texts in (("mix", texts_mix(self.args.rows)),
                                      ("distinct", texts_distinct(self.args.rows))):
                book.set_texts(texts)
                book.set_cells(function)
                book.doc.calculateAll()
                values, errors = book.results()
                if errors:
                    self.fail("%s sheet in profile %s: %d error cells" % (sheet_name, profile, errors))
                out["rss_" + sheet_name], out["hwm_" + sheet_name] = memory_kib(pid)
            book.close()
        finally:
            off.stop()
        return out

    def first_calls(self):
        trials = []
        for k in range(self.args.trials):
            for profile, function in (("rxn", "RXNDH"), ("noop", "BENCHNOOP"), ("none", "LEN")):
                r = self.first_call(profile, function)
                r.update(trial=k + 1, profile=profile, function=function)
                trials.append(r)
                print("trial %d %-9s start %.2f s, new doc %.2f s, first result %.3f s, "
                      "total %.2f s; RSS before %d MiB, after first %d MiB, after mix %d MiB, "
                      "after distinct %d MiB (peak %d MiB, before the first call %d MiB); "
                      "libraries mapped before/after the first call: %s / %s; load %s" %
                      (k + 1, function, r["start"], r["doc"], r["first"], r["total"],
                       r["rss_before"] // 1024, r["rss_first"] // 1024, r["rss_mix"] // 1024,
                       r["rss_distinct"] // 1024, r["hwm_distinct"] // 1024,
                       r["hwm_before"] // 1024, ",".join(r["libs_before"]) or "none",
                       ",".join(r["libs_first"]) or "none", loadavg()),
                      flush=True)
        return trials


# --- the report -----------------------------------------------------------------------------
def med(xs):
    return statistics.median(xs)


def report(args, recalc, trials, soffice_version):
    rows = args.rows
    lines = []
    add = lines.append
    add("Recalculation: calculateAll() of %d rows; median of %d runs after one warm-up run. "
        "wall = seconds the call took; CPU = the office's threads on a CPU meanwhile; wait = "
        "the office's threads ready but waiting for a CPU (other work on the machine) "
        "(/proc/PID/task/*/schedstat); µs/cell = median / %d." % (rows, args.runs, rows))
    add("")
    for sheet in ("mix", "distinct"):
        rs = [r for r in recalc if r["sheet"] == sheet]
        by = {r["label"]: r for r in rs}
        len_w, len_c = by["=LEN(An)"]["wall"], by["=LEN(An)"]["cpu"]
        noop_w, noop_c = by["=BENCHNOOP(An)"]["wall"], by["=BENCHNOOP(An)"]["cpu"]
        title = ("20 distinct reactions repeated" if sheet == "mix" else
                 "%d distinct texts (whitespace varied: the engine's cache cannot help)" % rows)
        add("Sheet \"%s\": %s" % (sheet, title))
        add("")
        add("| column B | wall s | min–max s | CPU s | wait s | µs/cell wall | µs/cell CPU | "
            "× LEN (wall) | × BENCHNOOP (wall) | × BENCHNOOP (CPU) |")
        add("|---|---:|---:|---:|---:|---:|---:|---:|---:|---:|")
        for r in rs:
            w, c = r["wall"], r["cpu"]
            if r["function"] is None:
                add("| %s | %.3f | %.3f–%.3f | %.3f | %.3f | — | — | — | — | — |" %
                    (r["label"], w, min(r["walls"]), max(r["walls"]), c, r["wait"]))
                continue
            add("| %s | %.3f | %.3f–%.3f | %.3f | %.3f | %.1f | %.1f | %.2f | %.2f | %.2f |" %
                (r["label"], w, min(r["walls"]), max(r["walls"]), c, r["wait"],
                 w / rows * 1e6, c / rows * 1e6, w / len_w, w / noop_w, c / noop_c))
        dh_w, dh_c = by["=RXNDH(An)"]["wall"], by["=RXNDH(An)"]["cpu"]
        add("")
        # Ratios of neighbouring runs (run k of one case against run k of its floor, measured
        # moments apart): the figure to trust on a shared machine.
        arr_dh = by["{=RXNDH(A1:A%d)}" % rows]
        arr_noop = by["{=BENCHNOOP(A1:A%d)}" % rows]
        for what, a, b in (("=RXNDH(An) / =BENCHNOOP(An)", by["=RXNDH(An)"], by["=BENCHNOOP(An)"]),
                           ("{=RXNDH(A1:A%d)} / {=BENCHNOOP(A1:A%d)}" % (rows, rows), arr_dh, arr_noop)):
            pw = [x / y for x, y in zip(a["walls"], b["walls"]) if y > 0]
            pc = [x / y for x, y in zip(a["cpus"], b["cpus"]) if y > 0]
            add("Paired ratio %s: median %.2f wall (%.2f–%.2f), %.2f CPU (%.2f–%.2f) over %d runs." %
                (what, med(pw), min(pw), max(pw), med(pc), min(pc), max(pc), len(pw)))
        add("")
        add("RXNDH's own cost (RXNDH − BENCHNOOP, single cells): %.1f µs a cell wall, %.1f µs CPU; "
            "the add-in call path (BENCHNOOP − LEN): %.1f µs a cell wall, %.1f µs CPU." %
            ((dh_w - noop_w) / rows * 1e6, (dh_c - noop_c) / rows * 1e6,
             (noop_w - len_w) / rows * 1e6, (noop_c - len_c) / rows * 1e6))
        add("")
    add("First call: a fresh office on a profile holding only that add-in (or none, for LEN); "
        "median of %d offices. \"first result\" = set A1 and B1 = FUNCTION(A1), read B1 "
        "(loads the add-in's library and, for RXNDH, the engine and its data)." % args.trials)
    add("")
    add("| function | office start s | new document s | first result s | first result, office CPU s | "
        "first result, waiting for a CPU s | total s |")
    add("|---|---:|---:|---:|---:|---:|---:|")
    for function in ("RXNDH", "BENCHNOOP", "LEN"):
        ts = [t for t in trials if t["function"] == function]
        add("| %s | %.2f | %.2f | %.3f | %.3f | %.3f | %.2f |" % (
            function, med([t["start"] for t in ts]), med([t["doc"] for t in ts]),
            med([t["first"] for t in ts]), med([t["first_cpu"] for t in ts]),
            med([t["first_wait"] for t in ts]), med([t["total"] for t in ts])))
    add("")
    add("Memory of soffice.bin, VmRSS in MiB (median of %d offices); peak = VmHWM at the end." %
        args.trials)
    add("")
    add("| profile / function | empty document | after the first call | Δ first call | "
        "after %d-row mix sheet | after %d-row distinct sheet | peak |" % (rows, rows))
    add("|---|---:|---:|---:|---:|---:|---:|")
    for function in ("RXNDH", "BENCHNOOP", "LEN"):
        ts = [t for t in trials if t["function"] == function]
        m = {k: med([t[k] for t in ts]) / 1024 for k in
             ("rss_before", "rss_first", "rss_mix", "rss_distinct", "hwm_distinct")}
        d = med([(t["rss_first"] - t["rss_before"]) for t in ts]) / 1024
        add("| %s | %.0f | %.0f | %+.0f | %.0f | %.0f | %.0f |" % (
            function, m["rss_before"], m["rss_first"], d, m["rss_mix"], m["rss_distinct"],
            m["hwm_distinct"]))
    add("")
    add("Every trial (s; MiB):")
    add("")
    add("| trial | function | start | new doc | first result | RSS before | after first | "
        "after mix | after distinct | peak before first call | peak at end | "
        "add-in libraries mapped before → after the first call |")
    add("|---|---|---:|---:|---:|---:|---:|---:|---:|---:|---:|---|")
    for t in trials:
        add("| %d | %s | %.2f | %.2f | %.3f | %.0f | %.0f | %.0f | %.0f | %.0f | %.0f | %s → %s |" % (
            t["trial"], t["function"], t["start"], t["doc"], t["first"],
            t["rss_before"] / 1024, t["rss_first"] / 1024, t["rss_mix"] / 1024,
            t["rss_distinct"] / 1024, t["hwm_before"] / 1024, t["hwm_distinct"] / 1024,
            ", ".join(t["libs_before"]) or "none", ", ".join(t["libs_first"]) or "none"))
    add("")
    add("Every recalculation run (s): first (warm-up, wall) | timed runs, wall | timed runs, "
        "CPU | load average before -> after")
    add("")
    for r in recalc:
        add("- %s %s: %.3f | %s | %s | %s -> %s" % (
            r["sheet"], r["label"], r["first"], " ".join("%.3f" % w for w in r["walls"]),
            " ".join("%.3f" % c for c in r["cpus"]), r["load"][0], r["load"][1]))
    head = ("Measured %s on %s (%d cores, %s), %s, Python %s." % (
        time.strftime("%Y-%m-%d %H:%M"), platform.node() or "this machine", os.cpu_count(),
        debian_release(), soffice_version, platform.python_version()))
    return head + "\n\n" + "\n".join(lines) + "\n"


def debian_release():
    try:
        with open("/etc/debian_version") as f:
            return "Debian " + f.read().strip()
    except OSError:
        return platform.platform()


def main():
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--oxt", required=True, help="rxnheat.oxt")
    ap.add_argument("--noop-oxt", required=True, help="bench_noop.oxt (target bench_noop_oxt)")
    ap.add_argument("--rows", type=int, default=20000)
    ap.add_argument("--runs", type=int, default=9, help="timed recalculations per case (>= 3)")
    ap.add_argument("--trials", type=int, default=5, help="fresh offices per first-call case")
    ap.add_argument("--markdown", help="also write the report to this file")
    ap.add_argument("--keep", action="store_true", help="keep the work folder")
    ap.add_argument("--timeout", type=int, default=3600)
    args = ap.parse_args()
    if args.runs < 3 or args.trials < 3:
        ap.error("--runs and --trials must be at least 3 (the figures are medians)")
    for path in (args.oxt, args.noop_oxt):
        if not os.path.exists(path):
            ap.error("%s not found: build the targets rxnheat_oxt and bench_noop_oxt" % path)

    def on_alarm(signum, frame):
        raise Timeout("the benchmark ran over %d s" % args.timeout)

    signal.signal(signal.SIGALRM, on_alarm)
    signal.alarm(args.timeout)
    version = subprocess.run([officelib.SOFFICE, "--version"], capture_output=True, text=True,
                             timeout=60).stdout.strip()
    base = tempfile.mkdtemp(prefix="rxnheat-bench-")
    bench = Bench(args, base)
    try:
        bench.install("both", [args.oxt, args.noop_oxt])
        bench.install("rxn", [args.oxt])
        bench.install("noop", [args.noop_oxt])
        bench.install("none", [])
        recalc = bench.recalculation()
        trials = bench.first_calls()
        text = report(args, recalc, trials, version)
        print()
        print(text)
        if args.markdown:
            with open(args.markdown, "w") as f:
                f.write(text)
    except (Timeout, CheckFailed) as e:
        bench.fail(str(e))
    finally:
        signal.alarm(0)
        if not args.keep:
            shutil.rmtree(base, ignore_errors=True)
    if bench.failures:
        print("%d checks failed:" % len(bench.failures))
        for f in bench.failures:
            print("  " + f)
        return 1
    return 0


if __name__ == "__main__":
    sys.exit(main())
