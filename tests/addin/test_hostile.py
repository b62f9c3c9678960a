#!/usr/bin/python3
"""Hostile and malformed input through every rxnheat function in a real headless LibreOffice.

The functions and their arguments come from the catalogue (`rxnheat functions --json`), never
from a list kept here. For every Calc function and every argument, the argument is replaced by
each value of two lists while the others keep a working value:

  - every kind of Calc value (the catalogue's argument reader): a missing argument, an empty
    cell, TRUE/FALSE, text, blank text, numbers (0, -1, ±1e308, 1e-320), a 1x1 range, 2-D ranges
    of mixed cells, a 10,000-row range, inline arrays {1;2}, error values (NA(), a cell holding
    =NA() or =1/0, a range holding an error), a lone UTF-16 surrogate, text over the engine's
    4 KiB input limit;
  - hostile values of the argument's kind: reaction syntax, units, temperatures such as "NaN",
    -1, 1e308 and "0 K", pressures, factors, feeds, step lists, and species tables of 10,000
    rows (valid, malformed near the end, 1e306 kJ/mol, headers renamed or swapped).

One sheet holds every formula; one recalculation; then each cell must be
  - an error value, and then RXNWHY with the same arguments (beside it, same recalculation) gives
    words (not empty, not "ok"), or, when an argument is itself an error value, the office's own
    error (the add-in is never called then, and RXNWHY cannot be either); or
  - a value equal to the `rxnheat` command line's answer for the same inputs (the same engine
    behind another host: numbers exactly, texts exactly), the inputs put to the CLI by the
    catalogue's own argument options; for a range where one value is read, the range's first cell.
Finally the office must still be alive and answer a simple call within a time bound.

Run by CTest (tests/CMakeLists.txt). Exit status 0 when every check passed.
"""
import argparse
import csv
import json
import math
import os
import shutil
import signal
import subprocess
import sys
import tempfile
import threading
import time
import traceback
from concurrent.futures import ThreadPoolExecutor

sys.dont_write_bytecode = True  # no __pycache__ in the source tree
sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "scripts"))
import office as officelib  # noqa: E402  (scripts/office.py; needs the system python3 with python3-uno)
from common import Checks, Timeout  # noqa: E402

CH4_GAS = "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)"
# Argument kinds the command line can only give as text (`functions --json` kind words).
TEXT_KINDS = ("reaction", "species", "formula", "unit", "text", "species, or range (species, mole fraction)")
HESS_TARGET = "C(s) + 1/2 O2(g) -> CO(g)"
DATA = "Data"          # the sheet of input cells and ranges
BIG = 10000            # rows of the big tables, feeds and ranges

# Calc's own error codes (formula/errorcodes.hxx): the add-in is not called for these inputs.
ERR_NA = 32767         # #N/A
ERR_DIV0 = 532         # #DIV/0!
ERR_PARAMETER = 504    # Err:504, a range holding an error value given to an add-in


def q(text):
    """A Calc formula string literal."""
    return '"' + text.replace('"', '""') + '"'


def cli_number(x):
    """A double as text that reads back as the same double."""
    return repr(float(x))


class Value:
    """One argument value: how the formula writes it, and what the add-in receives.

    kind: 'omit' (nothing written: void), 'num' (a double), 'text', 'range' (rows of cells,
    each None, a float or a str), 'calcerr' (an error value: Calc never calls the add-in; `err`
    is the error the cell must show), 'nocli' (a value the command line cannot be given, e.g. a
    lone surrogate: the cell must be an error)."""

    def __init__(self, label, expr, kind, py=None, err=None):
        self.label, self.expr, self.kind, self.py, self.err = label, expr, kind, py, err


class DataSheet:
    """Input cells and ranges on their own sheet, each in its own columns (no formula row ever
    shares their rows' sheet, so no implicit intersection picks one cell of them)."""

    def __init__(self, doc):
        doc.Sheets.insertNewByName(DATA, 0)
        self.sheet = doc.Sheets.getByName(DATA)
        self.col = 0
        self.tables = {}

    @staticmethod
    def colname(c):
        s = ""
        c += 1
        while c:
            c, r = divmod(c - 1, 26)
            s = chr(65 + r) + s
        return s

    def put(self, rows, errors=()):
        """Writes `rows` (lists of None, float, str) at a fresh block of columns; `errors` are
        (row, col, formula) cells given a formula instead. Returns the absolute reference."""
        width = max(len(r) for r in rows)
        c0 = self.col
        self.col += width
        rng = self.sheet.getCellRangeByPosition(c0, 0, c0 + width - 1, len(rows) - 1)
        data = tuple(tuple("" if v is None else v for v in list(r) + [None] * (width - len(r)))
                     for r in rows)
        rng.setDataArray(data)  # "" leaves a cell empty (checked by the test: empty_cells_stay_empty)
        for r, c, f in errors:
            rng.getCellByPosition(c, r).setFormula(f)
        ref = "$%s.$%s$1:$%s$%d" % (DATA, self.colname(c0), self.colname(c0 + width - 1), len(rows))
        return ref

    def cell(self, value=None, formula=None):
        """One cell: a value, a formula, or empty (both None)."""
        c0 = self.col
        self.col += 1
        cell = self.sheet.getCellByPosition(c0, 0)
        if formula is not None:
            cell.setFormula(formula)
        elif isinstance(value, str):
            cell.setString(value)
        elif value is not None:
            cell.setValue(value)
        return "$%s.$%s$1" % (DATA, self.colname(c0))


# ------------------------------------------------------------------------------------------
# The values. Texts of the hostile lists are our own; where a value's meaning matters it says why.

def species_table(n, override_ch4=True, bad_row=None, header=("formula", "phase", "dHf", "S")):
    """A user species table of n rows of distinct hydrocarbons CxHy(g) (made-up figures: these
    rows test reading, not data), and CH4(g) last with a made-up dHf so that a reaction over the
    table must read its last row."""
    rows = [list(header)]
    for k in range(n - 1):
        x, y = 10 + k // 100, 1 + k % 100 * 2
        rows.append(["C%dH%d" % (x, y), "g", -10.0 - k * 0.01, 200.0 + k * 0.001])
    if override_ch4:
        rows.append(["CH4", "g", -70.0, 190.0])
    if bad_row is not None:
        rows[bad_row][2] = "12,5 kJ"  # a decimal comma and a unit: not a number
    return rows


def generic_values(d):
    """Every kind of Calc value (the catalogue's argument reader under each)."""
    mixed = [[CH4_GAS, 500.0], [None, "x"], [1.0, None]]
    big_mixed = [[CH4_GAS if k % 3 == 0 else (float(k) if k % 3 == 1 else None)] for k in range(BIG)]
    return [
        Value("missing", "", "omit"),
        Value("empty cell", d.cell(), "num", 0.0),
        Value("empty text", '""', "text", ""),
        Value("blank text", '"   "', "text", "   "),
        Value("tab text", "CHAR(9)", "text", "\t"),
        Value("TRUE", "TRUE()", "num", 1.0),
        Value("FALSE", "FALSE()", "num", 0.0),
        Value("cell TRUE", d.cell(formula="=TRUE()"), "num", 1.0),
        Value("0", "0", "num", 0.0),
        Value("-1", "-1", "num", -1.0),
        Value("1.5", "1.5", "num", 1.5),
        Value("1e308", "1E+308", "num", 1e308),
        Value("-1e308", "-1E+308", "num", -1e308),
        # Calc refuses a denormal literal itself (Err:502), so the formula computes one.
        Value("1e-320 (denormal)", "1E-300*1E-20", "num", 1e-300 * 1e-20),
        Value("text NaN", '"NaN"', "text", "NaN"),
        Value("text inf", '"inf"', "text", "inf"),
        Value("text -1", '"-1"', "text", "-1"),
        Value("text 1e308", '"1e308"', "text", "1e308"),
        Value("text 1e999", '"1e999"', "text", "1e999"),
        Value("text =1+1", '"=1+1"', "text", "=1+1"),
        Value("Unicode text", q("\u2211 \u00fcn\u00efc\u00f8d\u00e9 \u221e"), "text", "\u2211 \u00fcn\u00efc\u00f8d\u00e9 \u221e"),
        Value("5000 characters", 'REPT("H2";2500)', "text", "H2" * 2500),
        Value("lone surrogate", "UNICHAR(55357)", "nocli"),
        # The office's text converter drops a high surrogate at the end of a text silently: the
        # add-in must still refuse it, not read the reaction before it.
        Value("text + lone surrogate at the end", q(CH4_GAS) + "&UNICHAR(55357)", "nocli"),
        Value("reaction text", q(CH4_GAS), "text", CH4_GAS),
        Value("species text", q("CH4(g)"), "text", "CH4(g)"),
        Value("1x1 range (text)", d.put([["CH4(g)"]]), "range", [["CH4(g)"]]),
        Value("1x1 range (number)", d.put([[500.0]]), "range", [[500.0]]),
        Value("2-D mixed range", d.put(mixed), "range", mixed),
        Value("2-D range, blank first", d.put([[None, 1.0], [CH4_GAS, "y"]]), "range",
              [[None, 1.0], [CH4_GAS, "y"]]),
        Value("10,000-row mixed range", d.put(big_mixed), "range", big_mixed),
        Value("inline {1;2}", "{1;2}", "range", [[1.0, 2.0]]),
        Value("inline {\"a\";\"b\"}", '{"a";"b"}', "range", [["a", "b"]]),
        Value("NA()", "NA()", "calcerr", err=ERR_NA),
        Value("cell =NA()", d.cell(formula="=NA()"), "calcerr", err=ERR_NA),
        Value("cell =1/0", d.cell(formula="=1/0"), "calcerr", err=ERR_DIV0),
        Value("range with an error", d.put([[CH4_GAS], [None]], errors=[(1, 0, "=1/0")]), "calcerr",
              err=ERR_PARAMETER),
    ]


def texts(label_prefix, items, d=None):
    """Text values; one longer than Calc's formula string literals (1024 characters, else
    Err:513) goes into a cell of the data sheet."""
    return [Value("%s %r" % (label_prefix, t if len(t) < 60 else t[:60] + "..."),
                  q(t) if len(t) < 1000 else d.cell(t), "text", t) for t in items]


def kind_values(d):
    """Hostile values by the catalogue's argument kind (the kind words of `functions --json`)."""
    long_unbalanced = " + ".join("%d H%d(g)" % (k + 1, k + 2) for k in range(150)) + " -> H2O(g)"
    reactions = texts("reaction", [
        "CH4 + O2 -> CO2 + H2O", "->", "CH4(g) + 2 O2(g)", "CH4(g) -> CH4(g)",
        "2 2 H2(g) + O2(g) -> 2 H2O(g)", "H2O0.9999999(g) -> H2O(g)", "H2O1.0000001(g) -> H2O(g)",
        "1e13 H2(g) + 5e12 O2(g) -> 1e13 H2O(g)", "1e-7 H2(g) + 5e-8 O2(g) -> 1e-7 H2O(g)",
        "Xy(g) -> Xy(g)", "2 H2(g) + O2(g) -> 2 H2O(g) -> 2 H2O(l)", "((((((((CH4(g) -> C(s)",
        "NaN H2(g) -> NaN H2(g)", "-1 H2(g) -> -1 H2(g)", "2 H2(g) + O2(g) = 2 H2O(g)",
        "\u00bd N2(g) + \u00b3\u2044\u2082 H2(g) \u2192 NH3(g)", "CH4(q) + 2 O2(g) -> CO2(g) + 2 H2O(g)",
        "H+(aq) + OH-(aq) -> H2O(l)", "Fe+3(aq) + e- -> Fe+2(aq)", "CH4(g) + 2 O2(g) <=> CO2(g) + 2 H2O(g)",
        "0 H2(g) + O2(g) -> O2(g)", "1/0 H2(g) -> H2(g)", "C1e308H4(g) -> C1e308H4(g)",
        "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)\n+ N2(g)", long_unbalanced], d)
    temperatures = texts("temperature", [
        "NaN", "-1", "-1 K", "1e308", "1e308 K", "0 K", "0", "4.9e-324 K", "1e-320", "350 Q",
        "350 C C", "350C", "K", "-300 C", "-459.67 F", "1e999 K", "inf K", "-inf", "0x1F4",
        "1,000 K", "500 \u00b0C", "1100 R", "300 k", "300 kelvin", "1e-300 C"]) + [
        Value("temperature 6001 K", "6001", "num", 6001.0), Value("temperature 199", "199", "num", 199.0)]
    pressures = texts("pressure", [
        "-1 bar", "0 MPa", "1e308 bar", "20 barg", "-2 barg", "NaN bar", "1 atm", "10 psi", "10 psig",
        "1e-320 bar", "bar", "2 MPa", "300 kPa", "1e999 bar"]) + [
        Value("pressure 1000", "1000", "num", 1000.0), Value("pressure 1e-9", "1E-9", "num", 1e-9)]
    units = texts("unit", [
        "kJ/hour", "kJ/mol/mol", "kg", "kJ / mol", "KJ/MOL", "kcal", "MJ/kg", "kW", "W/mol",
        "J/mol\u00b7K", "\u00b0C", "1/0", "kJ/mol extra", "kmol/h", "kg/h", "Nm3/h", "BTU/h", "kJ/(mol\u00b7K)",
        "mol", "lb/h", "t/d"])
    species = texts("species", [
        "Unobtainium", "H2O(q)", "CH4(g", "CH4(g)(g)", "h2o", "water", "CH4 + O2", "e-", "H2O(l)",
        "O2(g)", "N2", "CO2"])
    formulas = texts("formula", ["CH4(g)", "C1e308H4", "Xx", "C-1H4", "CH4CH4CH4", "(((C)))", "C0",
                                 "H2O0.9999999", "C999999999999H4"])
    numbers = texts("number", ["1/2", "5", "1e400", "NaN"]) + [
        Value("number -1e-300", "-1E-300", "num", -1e-300), Value("number 2", "2", "num", 2.0)]
    factors = texts("factor", ["1/0", "0", "1e-7", "1e13", "1/3", "\u00bd", "-1", "1/2/3", "0.5",
                               "\u2153", "2/4", "1e308"]) + [
        Value("factor 1e-7", "1E-7", "num", 1e-7), Value("factor 1e13", "1E+13", "num", 1e13)]
    text_words = texts("text", ["NOSUCH", "rxndh", "dh", "HHV", "LHV", "liquid", "vapour", "steam",
                                "RXNWHY"])
    feeds = [
        ("feed text amounts", [["CH4", "1"], ["O2", "2"]]),
        ("feed number species", [[1.0, 1.0], ["O2", 2.0]]),
        ("feed 3 columns", [["CH4", 1.0, 1.0], ["O2", 2.0, 2.0]]),
        ("feed 1 column", [["CH4"], ["O2"]]),
        ("feed all blank", [[None, None], [None, None]]),
        ("feed negative amount", [["CH4", -1.0], ["O2", 2.0]]),
        ("feed 1e308 amount", [["CH4", 1e308], ["O2", 1e308]]),
        ("feed duplicate species", [["CH4", 1.0], ["CH4", 1.0], ["O2", 4.0]]),
        ("feed unknown species", [["Unobtainium", 1.0], ["O2", 2.0]]),
        ("feed amount without species", [[None, 1.0], ["O2", 2.0]]),
        ("feed species without amount", [["CH4", None], ["O2", 2.0]]),
        ("feed 10,000 rows", [["CH4", 1.0], ["O2", 2.0]] + [["N2", 0.001]] * (BIG - 2)),
    ]
    feed_values = [Value(label, d.put(rows), "range", rows) for label, rows in feeds]
    lists = [
        ("steps with a blank between", [["C(s) + O2(g) -> CO2(g)"], [None], ["CO(g) + 1/2 O2(g) -> CO2(g)"]]),
        ("steps 2-D", [["C(s) + O2(g) -> CO2(g)", "CO(g) + 1/2 O2(g) -> CO2(g)"], ["x", "y"]]),
        ("steps numbers", [[1.0], [2.0]]),
        ("steps one", [["C(s) + O2(g) -> CO2(g)"]]),
        ("steps unbalanced", [["C + O2 -> CO"], ["CO(g) + O2(g) -> CO2(g)"]]),
        ("numbers as text", [["-393.51"], ["-282.98"]]),
        ("numbers 3 long", [[-393.51], [-282.98], [1.0]]),
        ("numbers NaN text", [["NaN"], [1.0]]),
        ("numbers 1e308", [[1e308], [1e308]]),
    ]
    list_values = [Value(label, d.put(rows), "range", rows) for label, rows in lists]
    fuels = [
        ("fuel mixture", [["CH4", 0.9], ["C2H6", 0.1]]),
        ("fuel mol %", [["CH4", 90.0], ["C2H6", 10.0]]),
        ("fuel not summing to 1", [["CH4", 0.5], ["C2H6", 0.1]]),
        ("fuel negative", [["CH4", -0.5], ["C2H6", 1.5]]),
        ("fuel unknown", [["Unobtainium", 1.0]]),
    ]
    fuel_values = [Value(label, d.put(rows), "range", rows) for label, rows in fuels] + texts(
        "fuel", ["CH4", "H2", "Unobtainium", "CO2", "N2", "C8H18(l)", "H2O(l)"])
    tables = [
        ("table 10,000 rows", species_table(BIG)),
        ("table 10,000 rows, bad cell near the end", species_table(BIG, bad_row=BIG - 2)),
        ("table 10,000 rows, header renamed S->cp", species_table(BIG, header=("formula", "phase", "dHf", "cp"))),
        ("table 10,000 rows, columns swapped", [[r[1], r[0], r[2], r[3]] for r in species_table(BIG)]),
        ("table 1e306 kJ/mol", [["formula", "phase", "dHf"], ["CH4", "g", 1e306]]),
        ("table header only", [["formula", "phase", "dHf"]]),
        ("table no header", [["CH4", "g", -70.0]]),
        ("table NaN cell", [["formula", "phase", "dHf"], ["CH4", "g", "NaN"]]),
        ("table duplicate rows", [["formula", "phase", "dHf"], ["CH4", "g", -70.0], ["CH4", "g", -71.0]]),
        ("table one column", [["formula"], ["CH4"]]),
    ]
    table_values = [Value(label, d.put(rows), "range", rows) for label, rows in tables]
    return {
        "reaction": reactions,
        "species": species,
        "formula": formulas,
        "temperature": temperatures,
        "pressure": pressures,
        "unit": units,
        "number": numbers,
        "number or fraction": factors,
        "text": text_words,
        "range (species table)": table_values,
        "range (species, amount)": feed_values,
        "range (reactions)": list_values,
        "range (numbers)": list_values,
        "species, or range (species, mole fraction)": fuel_values,
        "arguments": reactions[:5] + temperatures[:5],
    }


def baseline(d, fn, arg):
    """A working value of an argument, chosen by its kind (and for the few names that need
    another: a required unit, RXNHESS's target)."""
    kind, name, required = arg["kind"], arg["name"], arg["required"]
    has_steps = any(a["kind"] == "range (reactions)" for a in fn["arguments"])
    if kind == "reaction":
        return Value("base", q(HESS_TARGET if has_steps else CH4_GAS), "text", HESS_TARGET if has_steps else CH4_GAS)
    if kind in ("species", "species, or range (species, mole fraction)") and required:
        return Value("base", q("CH4(g)"), "text", "CH4(g)")
    if kind == "formula":
        return Value("base", q("CH4"), "text", "CH4")
    if kind == "temperature" and required:
        return Value("base", "500", "num", 500.0)
    if kind == "pressure":
        return Value("base", "10", "num", 10.0)
    if kind == "unit" and required:
        return Value("base", q("kmol/h"), "text", "kmol/h")
    if kind == "number" and required:
        return Value("base", "0.5", "num", 0.5)
    if kind == "number or fraction":
        return Value("base", "2", "num", 2.0)
    if kind == "text" and required:
        return Value("base", q("RXNDH"), "text", "RXNDH")
    if kind == "range (species, amount)" and required:
        rows = [["CH4", 1.0], ["O2", 2.0], ["N2", 7.52]]
        return Value("base", d.base_ref("feed", rows), "range", rows)
    if kind == "range (reactions)":
        rows = [["C(s) + O2(g) -> CO2(g)"], ["CO(g) + 1/2 O2(g) -> CO2(g)"]]
        return Value("base", d.base_ref("steps", rows), "range", rows)
    if kind == "range (numbers)":
        rows = [[-393.51], [-282.98]]  # CODATA (Cox et al. 1989) ΔfH°(CO2, g) and CO → CO2
        return Value("base", d.base_ref("step_dh", rows), "range", rows)
    if kind == "arguments":
        return Value("base", q(CH4_GAS), "text", CH4_GAS)
    return Value("base", "", "omit")


# ------------------------------------------------------------------------------------------
# The command line's answer for the same inputs.

def first_cell(v):
    """What one read value of a range is: its first cell (Calc shows an array's first element in a
    single cell; a 1x1 range is its cell)."""
    if v.kind != "range":
        return v
    c = v.py[0][0] if v.py and v.py[0] else None
    if c is None:
        return Value("first cell", "", "num", 0.0)
    return Value("first cell", "", "num" if isinstance(c, float) else "text", c)


def calc_blank(v, arg):
    """The catalogue's Calc rule (HostRules::zero_is_blank): a 0 means 'not given' except in a
    required number, factor or pressure; blank text is not given anywhere."""
    if v.kind == "omit":
        return True
    if v.kind == "text":
        return v.py.strip(" \t\r\n") == ""
    if v.kind == "num" and v.py == 0:
        return not (arg["required"] and arg["kind"] in ("number", "number or fraction", "pressure"))
    return False


class CliCall:
    def __init__(self, cli, workdir):
        self.cli = cli
        self.workdir = workdir
        self.files = {}
        self.lock = threading.Lock()

    def csv_file(self, rows):
        key = json.dumps(rows)
        with self.lock:
            return self._csv_file(key, rows)

    def _csv_file(self, key, rows):
        if key not in self.files:
            path = os.path.join(self.workdir, "table%d.csv" % len(self.files))
            with open(path, "w", newline="", encoding="utf-8") as f:
                w = csv.writer(f)
                for r in rows:
                    w.writerow(["" if c is None else (cli_number(c) if isinstance(c, float) else c) for c in r])
            self.files[key] = path
        return self.files[key]

    def argv(self, fn, values):
        """The command line for the call, or None when the CLI cannot be given these inputs."""
        if not fn["cli_command"]:
            return None
        opts, pos = [], []
        for arg, v in zip(fn["arguments"], values):
            kind = arg["kind"]
            if v.kind in ("nocli", "calcerr"):
                return None
            if kind == "range (species table)":
                if v.kind == "omit" or calc_blank(v, arg):
                    continue
                if v.kind != "range":
                    opts.append("%s=%s" % (arg["option"], v.py if v.kind == "text" else cli_number(v.py)))
                    continue
                opts.append("%s=%s" % (arg["option"], self.csv_file(v.py)))
                continue
            if v.kind == "num" and kind in TEXT_KINDS:
                return None  # the command line has only text: a number cell has no form there
            if kind in ("range (species, amount)", "species, or range (species, mole fraction)") and v.kind == "range":
                words = []
                for r in v.py:
                    if len(r) != 2:
                        return None
                    s, a = r
                    if s is None and a is None:
                        continue
                    if not isinstance(s, str) or a is None or "=" in s:
                        return None
                    words.append("%s=%s" % (s.strip(), cli_number(a) if isinstance(a, float) else a))
                if arg["option"]:
                    opts += ["%s=%s" % (arg["option"], w) for w in words]
                else:
                    pos += words
                continue
            if arg["repeated"] and calc_blank(v, arg):
                continue
            if arg["repeated"]:  # a list (steps, step values), or a feed given one value
                if v.kind == "range":
                    if len(v.py) != 1 and any(len(r) != 1 for r in v.py):
                        return None
                    cells = [c for r in v.py for c in r]
                else:
                    cells = [None if v.kind == "omit" else v.py]
                if any(c is None for c in cells):
                    return None  # a blank kept in place: no command-line form
                opts += ["%s=%s" % (arg["option"], cli_number(c) if isinstance(c, float) else c) for c in cells]
                continue
            if kind == "arguments":
                if v.kind in ("range", "num"):
                    return None  # no command-line form (the inner argument's kind is not known here)
                pos.append("" if calc_blank(v, arg) else (cli_number(v.py) if v.kind == "num" else v.py))
                continue
            one = first_cell(v)
            if calc_blank(one, arg):
                if arg["option"] is None:
                    pos.append("")
                continue
            text = cli_number(one.py) if one.kind == "num" else one.py
            if arg["option"] is None:
                pos.append(text)
            else:
                opts.append("%s=%s" % (arg["option"], text))
        return [self.cli] + fn["cli_command"].split() + opts + ["--json", "--"] + pos

    def run(self, argv):
        out = subprocess.run(argv, capture_output=True, text=True, timeout=60)
        try:
            j = json.loads(out.stdout)
        except ValueError:
            return ("cli-broken", out.stdout[:200] + out.stderr[:200])
        if "error" in j:
            return ("error", j["error"])
        if j.get("ok") is False:  # check, why: the reason, with exit status 2
            return ("error", j.get("result", j.get("check", "")))
        if "value" in j:
            return ("num", float(j["value"]))
        for key in ("result", "check", "kind", "reaction"):
            if key in j:
                return ("text", j[key])
        return ("cli-broken", out.stdout[:200])


# ------------------------------------------------------------------------------------------

class Case:
    def __init__(self, fn, values, label):
        self.fn, self.values, self.label = fn, values, label

    def args_text(self):
        vals = list(self.values)
        while vals and vals[-1].kind == "omit":
            vals.pop()
        return ";".join(v.expr for v in vals)

    def formula(self):
        return "=%s(%s)" % (self.fn["calc_name"], self.args_text())

    def why_formula(self):
        a = self.args_text()
        return "=RXNWHY(%s%s)" % (q(self.fn["calc_name"]), ";" + a if a else "")


def build_cases(functions, d):
    generic = generic_values(d)
    by_kind = kind_values(d)
    cases = []
    for fn in functions:
        base = [baseline(d, fn, a) for a in fn["arguments"]]
        cases.append(Case(fn, base, "working call"))
        for i, arg in enumerate(fn["arguments"]):
            for v in generic + by_kind.get(arg["kind"], []):
                values = list(base)
                values[i] = v
                cases.append(Case(fn, values, "%s = %s" % (arg["name"], v.label)))
    return cases


def main():
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--oxt", required=True)
    ap.add_argument("--cli", required=True, help="the rxnheat command line: the catalogue and the engine's answers")
    ap.add_argument("--timeout", type=int, default=540)
    ap.add_argument("--keep", action="store_true", help="keep the work folder")
    ap.add_argument("--only", help="only the functions named (comma-separated), for debugging")
    args = ap.parse_args()

    def on_alarm(signum, frame):
        raise Timeout("the hostile-input test ran over %d s" % args.timeout)

    signal.signal(signal.SIGALRM, on_alarm)
    signal.alarm(args.timeout)
    t_start = time.monotonic()
    checks = Checks()
    workdir = tempfile.mkdtemp(prefix="rxnheat-hostile-")
    off = None
    try:
        catalogue = json.loads(subprocess.run([args.cli, "functions", "--json"], capture_output=True,
                                              text=True, timeout=30, check=True).stdout)["functions"]
        functions = [f for f in catalogue if "calc" in f["layers"]]
        if args.only:
            functions = [f for f in functions if f["calc_name"] in args.only.split(",")]
        checks.ok("the catalogue lists Calc functions", len(functions) >= (1 if args.only else 20), str(len(functions)))

        off = officelib.Office(workdir, "install").start()
        off.install_extension(args.oxt)
        off.stop()
        off = officelib.Office(workdir, "run").start()
        doc = off.new_calc()
        d = DataSheet(doc)
        bases = {}

        def base_ref(name, rows):
            if name not in bases:
                bases[name] = d.put(rows)
            return bases[name]
        d.base_ref = base_ref

        cases = build_cases(functions, d)
        # The blanks of the ranges above are empty cells, not empty text (setDataArray with "").
        probe = d.put([[None, "x"]])
        first = d.sheet.getCellRangeByName(probe.split(":")[0].replace("$%s." % DATA, ""))
        checks.ok("empty_cells_stay_empty: a blank of a range is an empty cell",
                  first.getType().value == "EMPTY", first.getType().value)
        names = sorted({c.fn["calc_name"] for c in cases})
        checks.ok("every Calc function of the catalogue is tried", names == sorted(f["calc_name"] for f in functions))
        checks.ok("at least 300 hostile formulas", len(cases) >= 300, str(len(cases)))
        sheet = doc.Sheets.getByIndex(1)  # the document's own first sheet, after Data
        t0 = time.monotonic()
        for k, c in enumerate(cases):
            sheet.getCellByPosition(0, k).setFormula(c.formula())
            sheet.getCellByPosition(1, k).setFormula(c.why_formula())
        print("%d formulas (and as many RXNWHY) written in %.1f s" % (len(cases), time.monotonic() - t0), flush=True)
        t0 = time.monotonic()
        doc.calculateAll()
        t_calc = time.monotonic() - t0
        print("recalculated in %.1f s" % t_calc, flush=True)
        checks.ok("office alive after the recalculation", off.alive())

        results = []
        for k, c in enumerate(cases):
            cell, why = sheet.getCellByPosition(0, k), sheet.getCellByPosition(1, k)
            err = cell.getError()
            rtype = cell.FormulaResultType2  # 1 value, 2 text, 4 error
            results.append((err, rtype, cell.getValue(), cell.getString(), why.getError(), why.getString()))

        # RXNCHECK and RXNWHY answer "ok" to a working call and every problem in words: their
        # cells are texts where the command line exits with the reason.
        in_words = {c.fn["calc_name"] for c, r in zip(cases, results) if c.label == "working call" and r[3] == "ok"}
        print("functions answering problems in words:", sorted(in_words), flush=True)
        cli = CliCall(args.cli, workdir)
        todo = []
        for c, r in zip(cases, results):
            err, rtype, value, text, why_err, why_text = r
            calc_errs = [v for v in c.values if v.kind == "calcerr"]
            where = "%s(%s) [%s]" % (c.fn["calc_name"], c.args_text()[:120], c.label)
            if calc_errs:
                # The add-in is never called with an error value: the office's own error shows.
                want = {v.err for v in calc_errs}
                checks.ok("office error for an error-valued argument: " + where, err in want,
                          "error %d, want one of %s" % (err, sorted(want)))
                continue
            if any(v.kind == "nocli" for v in c.values):
                checks.ok("no value from text that is not valid Unicode: " + where,
                          err != 0 or (c.fn["calc_name"] in in_words and "not valid Unicode" in text),
                          "got %r" % (text,))
            if err:
                checks.ok("RXNWHY explains: " + where, not why_err and why_text.strip() not in ("", "ok"),
                          "cell error %d; RXNWHY error %d, %r" % (err, why_err, why_text))
                continue
            todo.append((c, r, where))

        def expected(item):
            c, r, where = item
            argv = cli.argv(c.fn, c.values)
            return (argv, cli.run(argv) if argv else None)

        with ThreadPoolExecutor(max_workers=2) as pool:
            answers = list(pool.map(expected, todo))
        compared = unchecked = blanks = 0

        for (c, r, where), (argv, ans) in zip(todo, answers):
            err, rtype, value, text, why_err, why_text = r
            got = ("num", value) if rtype == 1 else ("text", text)
            if c.fn["calc_name"] == "RXNVERSION":
                got = ("text", text.replace("rxnheat Calc add-in ", "rxnheat command line ", 1))
            if ans is None:
                # No command-line form (blanks kept in a list, a range in RXNWHY's arguments):
                # the value is still a value of the right kind, and RXNWHY agrees it is fine.
                unchecked += 1
                spread = any(v.kind == "range" for v in c.values)
                fine = (got[0] == "num" and math.isfinite(got[1])) or (got[0] == "text" and got[1].strip() != "")
                checks.ok("value without a CLI form is a value, and RXNWHY agrees: " + where,
                          fine and (c.fn["calc_name"] in in_words or spread or why_text == "ok"),
                          "%r; RXNWHY %r" % (got, why_text))
                continue
            blank_first = [v for v in c.values if v.kind == "range" and first_cell(v).kind == "num"
                           and first_cell(v).py == 0.0 and (not v.py[0] or v.py[0][0] is None)]
            if blank_first and got in (("num", 0.0), ("text", "")):
                # A range whose first cell is blank: a blank element of the array (the
                # catalogue's rule: a blank cell of a range stays blank in the result).
                blanks += 1
                continue
            compared += 1
            if c.fn["calc_name"] in in_words and ans[0] == "error":
                # The command line exits with the reason; the cell holds a reason in words (the
                # hosts may word a missing argument differently: "required" / "required but empty").
                checks.ok("a problem in words where the CLI fails: " + where,
                          got[0] == "text" and got[1].strip() not in ("", "ok"), "office %r, CLI %r" % (got, ans))
                continue
            good = ans[0] == got[0] and (ans[1] == got[1] if got[0] == "text" else
                                         (isinstance(ans[1], float) and math.isfinite(got[1]) and got[1] == ans[1]))
            checks.ok("value = the CLI's: " + where, good, "office %r, CLI %r (%s)" % (got, ans, " ".join(argv[1:])[:300]))
        n_err = sum(1 for r in results if r[0])
        print("%d cells: %d errors, %d values (%d compared with the CLI, %d blank elements, %d without a "
              "CLI form)" % (len(cases), n_err, len(cases) - n_err, compared, blanks, unchecked), flush=True)

        # Responsive at the end: a simple call answers within a bound, and the answer is right.
        t0 = time.monotonic()
        probe = sheet.getCellByPosition(3, 0)
        probe.setFormula("=RXNDH(%s)" % q(CH4_GAS))
        doc.calculate()
        v = probe.getValue()
        dt = time.monotonic() - t0
        want = cli.run([args.cli, "dh", CH4_GAS, "--json"])
        checks.ok("office answers RXNDH at the end within 2 s", dt < 2.0 and v == want[1],
                  "%.3f s, %r vs %r" % (dt, v, want))
        checks.ok("office process alive at the end", off.alive())
        doc.close(True)
        off.stop()
        off = None
    except Timeout as e:
        checks.ok("finished in time", False, str(e))
    except Exception as e:
        checks.ok("test ran to the end", False, "%s: %s\n%s" % (type(e).__name__, e, traceback.format_exc()))
    finally:
        signal.alarm(0)
        if off is not None:
            off.kill()
        if not args.keep:
            shutil.rmtree(workdir, ignore_errors=True)
    print("%d checks passed, %d failed in %.1f s" % (checks.passed, len(checks.failed), time.monotonic() - t_start))
    return 0 if not checks.failed else 1


if __name__ == "__main__":
    sys.exit(main())
