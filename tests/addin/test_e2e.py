#!/usr/bin/python3
"""End-to-end test of the rxnheat Calc add-in in a real headless LibreOffice.

Installs the built rxnheat.oxt into a private profile through the office's ExtensionManager,
restarts the office, types formulas with the display names users type, recalculates, and
checks the cells: values against the engine's own answers (the `rxnheat` CLI, when built) and
against published reference values (sources named beside each one), optional arguments,
ranges -> arrays, Unicode, errors in cells with RXNCHECK's words, the office still answering
afterwards, and a saved document reloading to the same values.

Run by CTest (tests/CMakeLists.txt). Everything is time-bound: the office is killed on any
failure or after --timeout seconds. Exit status 0 when every check passed.
"""
import argparse
import os
import shutil
import signal
import subprocess
import sys
import tempfile
import time
import traceback
import zipfile
import json

sys.dont_write_bytecode = True  # no __pycache__ in the source tree
sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "scripts"))
import office as officelib  # noqa: E402  (scripts/office.py; needs the system python3 with python3-uno)
from common import Checks, EngineCli, Timeout, iupac_molar_mass  # noqa: E402
import uno  # noqa: E402

R = 8.314462618  # J/(mol K), CODATA 2018 exact value of the molar gas constant
CH4_COMBUSTION = "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)"
CH4_COMBUSTION_UNICODE = "CH\u2084(g) + 2O\u2082(g) \u2192 CO\u2082(g) + 2H\u2082O(l)"
CH4_COMBUSTION_GAS = "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)"
CH4_COMBUSTION_GAS_UNICODE = "CH\u2084(g) + 2O\u2082(g) \u2192 CO\u2082(g) + 2H\u2082O(g)"

# The display names and argument names of engine/FUNCTIONS.md, exactly.
DOCUMENTED_FUNCTIONS = {
    "RXNDH": ["reaction", "temperature", "unit", "per", "table"],
    "RXNDU": ["reaction", "temperature", "unit", "per", "table"],
    "RXNDS": ["reaction", "temperature", "unit", "table"],
    "RXNDG": ["reaction", "temperature", "unit", "table"],
    "RXNLOGK": ["reaction", "temperature", "table"],
    "RXNLOAD": ["reaction", "quantity", "quantity_unit", "key", "result_unit", "temperature",
                "table"],
    "RXNKIND": ["reaction", "temperature", "tolerance", "table"],
    "RXNCHECK": ["reaction", "temperature", "table"],
    "RXNBALANCE": ["reaction", "table"],
    "RXNREVERSE": ["reaction"],
    "RXNSCALE": ["reaction", "factor"],
    "SPECIESHF": ["species", "temperature", "unit", "table"],
    "SPECIESCP": ["species", "temperature", "table"],
    "SPECIESH": ["species", "temperature", "reference_temperature", "table"],
    "MOLARMASS": ["formula"],
    "RXNEQX": ["reaction", "temperature", "pressure", "feed", "key", "table"],
    "RXNHESS": ["target", "steps", "step_dh", "unit"],
    "RXNHESSPLAN": ["target", "steps"],
    "STEAMTSAT": ["pressure"],
    "STEAMPSAT": ["temperature"],
    "STEAMH": ["pressure", "temperature", "state"],
    "STEAMLATENT": ["pressure"],
    "FUELHV": ["fuel", "basis", "unit", "table"],
    "STREAMH": ["stream", "temperature", "flow_unit", "result_unit", "table"],
    "RXNDUTY": ["reaction", "feed", "conversion", "key", "inlet_temperature", "outlet_temperature",
                "flow_unit", "result_unit", "table"],
    "RXNTAD": ["reaction", "feed_temperature", "extra_feed", "conversion", "table"],
    "RXNSOURCE": ["reaction_or_species", "table", "temperature"],
    "RXNVERSION": [],
}

ERR_ILLEGAL_ARGUMENT = 502  # what Calc shows as Err:502


def q(text):
    """A Calc formula string literal."""
    return '"' + text.replace('"', '""') + '"'


class Cell:
    """A formula cell's result after recalculation."""

    def __init__(self, cell):
        self.error = cell.getError()
        kind = cell.FormulaResultType2  # com.sun.star.sheet.FormulaResult: 1 value, 2 text, 4 error
        self.kind = {1: "value", 2: "text", 4: "error"}.get(kind, str(kind))
        self.value = cell.getValue() if self.kind == "value" and not self.error else None
        self.text = cell.getString()
        self.formula = cell.getFormula()

    @property
    def number(self):
        return float(self.value) if self.value is not None else None

    def __repr__(self):
        if self.error:
            return "<error %d>" % self.error
        return repr(self.value if self.kind == "value" else self.text)


class Sheet:
    """A scratch sheet: formulas go into column B of fresh rows, inputs wherever asked."""

    def __init__(self, doc, index=0):
        self.doc = doc
        self.sheet = doc.Sheets.getByIndex(index)
        self.row = 1

    def cell(self, address):
        return self.sheet.getCellRangeByName(address)

    def put(self, address, value):
        c = self.cell(address)
        if isinstance(value, str):
            c.setString(value)
        else:
            c.setValue(value)

    def evaluate(self, formulas):
        """Writes each formula into its own cell, recalculates once, returns Cells."""
        addresses = []
        for f in formulas:
            a = "B%d" % self.row
            self.row += 1
            self.cell(a).setFormula(f)
            addresses.append(a)
        self.doc.calculateAll()
        return [Cell(self.cell(a)) for a in addresses]

    def one(self, formula):
        return self.evaluate([formula])[0]

    def array(self, target, formula):
        rng = self.cell(target)
        rng.setArrayFormula(formula)
        self.doc.calculateAll()
        rows = []
        for r in range(rng.Rows.Count):
            rows.append([Cell(rng.getCellByPosition(c, r)) for c in range(rng.Columns.Count)])
        return rows


def gnu_units(frm, to):
    """GNU units (Debian package `units`): the factor from `frm` to `to`, or None."""
    exe = shutil.which("units")
    if not exe:
        return None
    out = subprocess.run([exe, "-t", frm, to], capture_output=True, text=True, timeout=10)
    try:
        return float(out.stdout.split()[0])
    except (ValueError, IndexError):
        return None


# ------------------------------------------------------------------------------------------
def check_install(checks, office, version):
    exts = [e for e in office.user_extensions() if e is not None]
    ids = {e.getIdentifier().Value: e for e in exts}
    checks.ok("installed: identifier org.rxnheat.calc", "org.rxnheat.calc" in ids, str(list(ids)))
    e = ids.get("org.rxnheat.calc")
    if e is not None:
        checks.ok("installed: version", e.getVersion() == version,
                  "%s vs %s" % (e.getVersion(), version))
        checks.ok("installed: publisher", e.getPublisherInfo().First == "rxnheat developers",
                  e.getPublisherInfo().First)
        checks.ok("installed: display name", "rxnheat" in e.getDisplayName(), e.getDisplayName())


def check_wizard_texts(checks, office):
    fd = office.smgr.createInstanceWithContext("com.sun.star.sheet.FunctionDescriptions",
                                                office.ctx)
    found = {}
    for i in range(fd.getCount()):
        d = {p.Name: p.Value for p in fd.getByIndex(i)}
        if d.get("Name") in DOCUMENTED_FUNCTIONS:
            found[d["Name"]] = d
    for name, args in DOCUMENTED_FUNCTIONS.items():
        d = found.get(name)
        if not checks.ok("wizard: %s listed" % name, d is not None):
            continue
        arguments = list(d.get("Arguments") or ())
        names = [a.Name for a in arguments]
        checks.ok("wizard: %s argument names" % name, names == args, "%s vs %s" % (names, args))
        checks.ok("wizard: %s has a description" % name, len(d["Description"]) > 30,
                  d["Description"])
        for a in arguments:
            checks.ok("wizard: %s(%s) described" % (name, a.Name), len(a.Description) > 15,
                      a.Description)
    if "RXNLOAD" in found:
        text = found["RXNLOAD"]["Description"].lower()
        for words in ("screening estimate", "standard state", "complete conversion",
                      "thermal runaway", "relief sizing", "calorimetry",
                      "process hazard analysis", "local codes", "licensed engineers"):
            checks.ok("wizard: RXNLOAD caution says '%s'" % words, words in text)
        units = " ".join(a.Description for a in found["RXNLOAD"]["Arguments"])
        for u in ("kg/h", "Nm3", "scf", "lbmol", "kW", "BTU/h", "MMBTU", "TR"):
            checks.ok("wizard: RXNLOAD arguments name unit %s" % u, u in units)
    if "RXNDH" in found:
        # Non-ASCII texts from the component arrive intact in the office (UTF-8 -> UTF-16).
        checks.ok("wizard: RXNDH description keeps ΔrH°", "\u0394rH\u00b0" in
                  found["RXNDH"]["Description"], found["RXNDH"]["Description"])
        temp = found["RXNDH"]["Arguments"][1].Description
        checks.ok("wizard: temperature argument shows °C", "350 \u00b0C" in temp, temp)


def check_wizard_from_catalogue(checks, office, svc, path):
    """The Function Wizard's texts are the catalogue's (rxnheat-gen texts wrote them out)."""
    with open(path, encoding="utf-8") as f:
        catalogue = json.load(f)
    fd = office.smgr.createInstanceWithContext("com.sun.star.sheet.FunctionDescriptions",
                                                office.ctx)
    found = {}
    for i in range(fd.getCount()):
        d = {p.Name: p.Value for p in fd.getByIndex(i)}
        if d.get("Name") in catalogue:
            found[d["Name"]] = d
    checks.ok("wizard: every catalogue function listed (%d)" % len(catalogue),
              sorted(found) == sorted(catalogue), "%s vs %s" % (sorted(found), sorted(catalogue)))
    for name, spec in catalogue.items():
        d = found.get(name)
        if d is None:
            continue
        checks.ok("wizard: %s description = catalogue" % name,
                  d["Description"] == spec["description"], d["Description"])
        checks.ok("XAddIn: %s <-> %s" % (name, spec["method"]),
                  svc.getDisplayFunctionName(spec["method"]) == name and
                  svc.getProgrammaticFuntionName(name) == spec["method"])
        arguments = list(d.get("Arguments") or ())
        want = [a["name"] for a in spec["arguments"]]
        checks.ok("wizard: %s argument names = catalogue" % name,
                  [a.Name for a in arguments] == want, "%s vs %s" % ([a.Name for a in arguments], want))
        for a, w in zip(arguments, spec["arguments"]):
            checks.ok("wizard: %s(%s) text holds the catalogue's help" % (name, a.Name),
                      w["help"] in a.Description, a.Description)
            direct = svc.getArgumentDescription(spec["method"], spec["arguments"].index(w))
            checks.ok("XAddIn: %s(%s) description = the wizard's" % (name, a.Name),
                      direct == a.Description, "%r vs %r" % (direct, a.Description))


def check_why_and_tables(checks, sh):
    """RXNWHY over a variable argument list, and a column of reactions × a row of temperatures."""
    sh.put("AC1", CH4_COMBUSTION)
    why = sh.evaluate(['=RXNWHY("RXNLOAD";AC1;500;"kg/hour";"CH4";"kW")',
                       '=RXNWHY("RXNLOAD";AC1;500;"kg/hr";"CH4";"kW")',
                       '=RXNWHY("RXNDH";AC1)',
                       '=RXNWHY("RXNDH";AC1;"350 Q")',
                       '=RXNWHY("NOSUCH";AC1)'])
    checks.ok("RXNWHY names the bad unit kg/hour", why[0].kind == "text" and "kg/hour" in why[0].text,
              repr(why[0]))
    checks.ok("RXNWHY of a good RXNLOAD call (kg/hr, as the trade writes it): ok", why[1].text == "ok",
              repr(why[1]))
    checks.ok("RXNWHY(\"RXNDH\"; A1): ok", why[2].text == "ok", repr(why[2]))
    checks.ok("RXNWHY names the bad temperature", why[3].text not in ("", "ok") and
              "temperature" in why[3].text, repr(why[3]))
    checks.ok("RXNWHY of an unknown function says so", "NOSUCH" in why[4].text, repr(why[4]))
    # RXNSOURCE at a temperature names the phase used there and notes a liquid above its 1-bar
    # boiling point (NASA Glenn records 'H2O' and 'H2O(L)'; normal boiling point 373.12 K, from memory).
    src = sh.evaluate(['=RXNSOURCE("H2O";;500)', '=RXNSOURCE("H2O(l) -> H2O(g)";;"400 K")',
                       '=RXNSOURCE("H2O")'])
    checks.ok("RXNSOURCE at 500 K: steam", src[0].text.startswith("H2O(g)"), repr(src[0]))
    checks.ok("RXNSOURCE notes a liquid above its boiling point",
              "above its 1-bar boiling point" in src[1].text, repr(src[1]))
    checks.ok("RXNSOURCE at 298.15 K: liquid water", src[2].text.startswith("H2O(l)"), repr(src[2]))
    # RXNEQX with its feed as a two-column range (a blank row between): N2O4 <=> 2 NO2 at 298.15 K
    # and 1 bar, ξ = sqrt(K/(K + 4)) with ΔrG° 4.73 kJ/mol (NBS tables, Wagman et al. 1982, from
    # memory): about 0.19; a pressure in MPa as text.
    sh.put("AX1", "N2O4")
    sh.put("AY1", 1)
    sh.put("AX3", "Ar")
    sh.put("AY3", 0)
    eqx = sh.evaluate(['=RXNEQX("N2O4(g) <=> 2 NO2(g)";298.15;1;AX1:AY3)',
                       '=RXNEQX("N2O4(g) <=> 2 NO2(g)";298.15;"0.1 MPa";AX1:AY3)',
                       '=RXNEQX("N2O4(g) <=> 2 NO2(g)";298.15;0;AX1:AY3)'])
    checks.ok("RXNEQX of N2O4 near 0.19", eqx[0].number is not None and abs(eqx[0].number - 0.19) < 0.02,
              repr(eqx[0]))
    checks.ok("RXNEQX: 0.1 MPa is 1 bar", eqx[1].number is not None and eqx[0].number is not None and
              abs(eqx[1].number - eqx[0].number) < 1e-12, repr(eqx[1]))
    checks.ok("RXNEQX: a pressure of 0 is Err:502", eqx[2].error == ERR_ILLEGAL_ARGUMENT, repr(eqx[2]))
    # RXNHESS and RXNHESSPLAN with the steps and their ΔH in two columns, a blank row between:
    # CODATA Key Values (Cox et al. 1989) ΔfH°(CO2, g) −393.51 and ΔfH°(CO, g) −110.53 kJ/mol, so
    # CO + ½ O2 → CO2 is −282.98 and C + ½ O2 → CO is (1) − (3).
    sh.put("BA1", "C(s) + O2(g) -> CO2(g)")
    sh.put("BB1", -393.51)
    sh.put("BA3", "CO(g) + 1/2 O2(g) -> CO2(g)")
    sh.put("BB3", -282.98)
    hess = sh.evaluate(['=RXNHESS("C(s) + 1/2 O2(g) -> CO(g)";BA1:BA3;BB1:BB3)',
                        '=RXNHESSPLAN("C(s) + 1/2 O2(g) -> CO(g)";BA1:BA3)',
                        '=RXNHESS("C(s) + 1/2 O2(g) -> CO(g)";BA1:BA3;BB1:BB2)',
                        '=RXNWHY("RXNHESS";"C(s) + O2(g) -> CO(g)";BA1:BA3;BB1:BB3)'])
    checks.ok("RXNHESS: CODATA ΔfH°(CO, g) from the two combustions",
              hess[0].number is not None and abs(hess[0].number - (-110.53)) < 1e-9, repr(hess[0]))
    checks.ok("RXNHESSPLAN: step numbers are the range's rows", hess[1].text == "1×(1) − 1×(3)", repr(hess[1]))
    checks.ok("RXNHESS: ranges of different lengths are Err:502", hess[2].error == ERR_ILLEGAL_ARGUMENT,
              repr(hess[2]))
    checks.ok("RXNWHY of an unbalanced RXNHESS target says so", "not balanced" in hess[3].text, repr(hess[3]))
    # RXNTAD, the example: N2 and 7.52 in a range (3.76 mol N2 per mol O2, common practice);
    # the no-dissociation flame temperature of stoichiometric methane-air is about 2320-2330 K
    # (combustion textbooks, from memory). STREAMH of an element at 298.15 K is 0 (formation
    # basis); RXNDUTY with inlet = outlet is RXNLOAD of the amount converted.
    sh.put("BA1", "N2")
    sh.put("BB1", 7.52)
    sh.put("BA3", "CO")
    sh.put("BB3", 36)
    sh.put("BA4", "H2O")
    sh.put("BB4", 36)
    heat = sh.evaluate(['=RXNTAD(%s;298.15;BA1:BB1)' % q(CH4_COMBUSTION_GAS),
                        '=RXNTAD(%s;"25 C";BA1:BB1;0.5)' % q(CH4_COMBUSTION_GAS),
                        '=STREAMH(BA1:BB1;298.15)',
                        '=RXNDUTY("CO(g) + H2O(g) -> CO2(g) + H2(g)";BA3:BB4;0.5;"CO";500;500)',
                        '=RXNLOAD("CO(g) + H2O(g) -> CO2(g) + H2(g)";18;"kmol/h";"CO";;500)',
                        '=RXNDUTY("CO(g) + H2O(g) -> CO2(g) + H2(g)";BA3:BB4;1.5;"CO";500;500)'])
    checks.ok("RXNTAD of methane in air near 2325 K", heat[0].number is not None and
              abs(heat[0].number - 2325) < 15, repr(heat[0]))
    checks.ok("RXNTAD at half conversion is cooler", heat[1].number is not None and heat[0].number is not None
              and 298.15 < heat[1].number < heat[0].number, repr(heat[1]))
    checks.ok("STREAMH of N2 at 298.15 K is 0", heat[2].number == 0, repr(heat[2]))
    checks.ok("RXNDUTY at one temperature is RXNLOAD of the amount converted", heat[3].number is not None and
              heat[4].number is not None and abs(heat[3].number - heat[4].number) < 1e-9 * abs(heat[4].number),
              repr(heat[3:5]))
    checks.ok("RXNDUTY: a conversion of 1.5 is Err:502", heat[5].error == ERR_ILLEGAL_ARGUMENT, repr(heat[5]))
    # A column of 3 reactions with a row of 5 temperatures: the whole 3×5 table in one call.
    reactions = [CH4_COMBUSTION_GAS, "2 H2(g) + O2(g) -> 2 H2O(g)", "1/2 N2(g) + 3/2 H2(g) -> NH3(g)"]
    temperatures = [298.15, 400, "176.85 C", 500, "990 R"]  # 450 K = 176.85 °C, 550 K = 990 °R
    for i, r in enumerate(reactions):
        sh.put("AD%d" % (i + 1), r)
    columns = ["AE", "AF", "AG", "AH", "AI"]
    for j, t in enumerate(temperatures):
        sh.put("%s5" % columns[j], t)
    grid = sh.array("AE1:AI3", "=RXNDH(AD1:AD3;AE5:AI5)")
    singles = sh.evaluate(["=RXNDH(AD%d;%s5)" % (i + 1, columns[j])
                           for i in range(3) for j in range(5)])
    checks.ok("RXNDH(column of 3; row of 5) fills 3×5 with numbers",
              len(grid) == 3 and all(len(row) == 5 and all(c.number is not None for c in row)
                                     for row in grid), repr(grid))
    for i in range(3):
        for j in range(5):
            checks.close("table element (%d,%d) = single-cell RXNDH" % (i + 1, j + 1),
                         grid[i][j].number, singles[5 * i + j].number, 1e-9)
    # CODATA Key Values (Cox et al. 1989): ΔfH° H2O(g) −241.826 kJ/mol at 298.15 K.
    checks.close("table (2,1): 2 H2 + O2 -> 2 H2O(g) at 298.15 K (CODATA)", grid[1][0].number,
                 -483.65, 0.1)


def check_steam(checks, sh):
    """IAPWS-IF97 water and steam in a real office: release verification values (Tables 5, 15,
    35, 36), steam-table values (from memory), a blank temperature with a state, and Err:502 in
    region 3 and for a state that is neither liquid nor vapour."""
    sh.put("BA1", "10 bar")
    sh.put("BA2", 30)      # bar
    sh.put("BA3", 0.035)   # bar
    sh.put("BB1", 300)     # K
    sh.put("BC1", 700)     # K
    cells = sh.evaluate(['=STEAMTSAT("1 MPa")',                 # 0 IF97 Table 36: 453.035632 K
                         '=STEAMPSAT(500)',                     # 1 IF97 Table 35: 2.63889776 MPa
                         '=STEAMH("3 MPa";300)',                # 2 IF97 Table 5: 115.331273 kJ/kg
                         '=STEAMH(0.035;"426.85 C")',           # 3 IF97 Table 15: 3335.68375 kJ/kg
                         '=STEAMLATENT(BA1)',                   # 4 steam tables, from memory: about 2015
                         '=STEAMLATENT(STEAMPSAT("250 C"))',    # 5 steam tables, from memory: about 1715
                         '=STEAMH(BA1;;"vapour")',              # 6 steam tables, from memory: 2777.1
                         '=STEAMH(BA1;0;"liquid")',             # 7 a blank temperature (0): 762.7
                         '=STEAMH("250 bar";650)',              # 8 region 3: Err:502
                         '=STEAMH(BA1;;"gas")',                 # 9 not a state: Err:502
                         '=STEAMTSAT(0)',                       # 10 a pressure of 0: Err:502
                         '=STEAMH(BA1;;"vapour")-STEAMH(BA1;;"liquid")-STEAMLATENT(BA1)'])  # 11 exactly 0

    def near(i, want, tol):
        return cells[i].number is not None and abs(cells[i].number - want) <= tol

    checks.ok("STEAMTSAT 1 MPa (IF97 Table 36)", near(0, 453.035632, 5e-7), repr(cells[0]))
    checks.ok("STEAMPSAT 500 K in bar (IF97 Table 35)", near(1, 26.3889776, 5e-7), repr(cells[1]))
    checks.ok("STEAMH 3 MPa, 300 K (IF97 Table 5)", near(2, 115.331273, 5e-7), repr(cells[2]))
    checks.ok("STEAMH 0.035 bar, 700 K (IF97 Table 15)", near(3, 3335.68375, 5e-6), repr(cells[3]))
    checks.ok("STEAMLATENT 10 bar about 2015 kJ/kg (steam tables, from memory)", near(4, 2015, 2), repr(cells[4]))
    checks.ok("latent heat at 250 C about 1715 kJ/kg (steam tables, from memory)", near(5, 1715, 2), repr(cells[5]))
    checks.ok("STEAMH saturated vapour at 10 bar (steam tables, from memory)", near(6, 2777.1, 0.3), repr(cells[6]))
    checks.ok("STEAMH saturated liquid at 10 bar, temperature 0 = blank", near(7, 762.7, 0.3), repr(cells[7]))
    for i, what in [(8, "region 3"), (9, "state gas"), (10, "pressure 0")]:
        checks.ok("STEAMH/STEAMTSAT %s is Err:502" % what, cells[i].error == ERR_ILLEGAL_ARGUMENT, repr(cells[i]))
    checks.ok("saturated vapour − liquid = STEAMLATENT", near(11, 0, 0), repr(cells[11]))
    why = sh.one('=RXNWHY("STEAMH";"250 bar";650)')
    checks.ok("RXNWHY names region 3", "region 3" in why.text, repr(why))
    # A column of pressures with a row of temperatures: the whole table (IF97 Tables 5 and 15).
    grid = sh.array("BE1:BF2", "=STEAMH(BA2:BA3;BB1:BC1)")
    checks.ok("STEAMH table: 30 bar, 300 K (IF97 Table 5)",
              grid[0][0].number is not None and abs(grid[0][0].number - 115.331273) <= 5e-7, repr(grid))
    checks.ok("STEAMH table: 0.035 bar, 700 K (IF97 Table 15)",
              grid[1][1].number is not None and abs(grid[1][1].number - 3335.68375) <= 5e-6, repr(grid))


def check_typical_values(checks, sh, cli, version):
    r = CH4_COMBUSTION
    cells = sh.evaluate([
        "=RXNDH(%s)" % q(r),                                       # 0
        "=RXNDU(%s)" % q(r),                                       # 1
        "=MOLARMASS(\"CH4\")",                                     # 2
        "=RXNLOAD(%s;500;\"kg/h\";\"CH4\";\"kW\")" % q(r),         # 3
        "=RXNLOAD(%s;10;\"kmol\";\"CH4\")" % q(r),                 # 4
        "=RXNLOAD(%s;500;\"kg/h\";\"CH4\";\"BTU/h\")" % q(r),      # 5
        "=RXNDH(\"2H2 + O2 = 2H2O\")",                             # 6
        "=RXNDH(\"1/2 N2(g) + 3/2 H2(g) \u2192 NH3(g)\")",         # 7
        "=RXNKIND(%s)" % q(r),                                     # 8
        "=RXNKIND(RXNREVERSE(%s))" % q(r),                         # 9
        "=RXNKIND(%s;;1000)" % q(r),                               # 10
        "=RXNCHECK(%s)" % q(r),                                    # 11
        "=RXNBALANCE(\"H2 + O2 -> H2O\")",                         # 12
        "=RXNDH(RXNBALANCE(\"H2 + O2 -> H2O\"))",                  # 13
        "=RXNCHECK(RXNBALANCE(\"H2 + O2 -> H2O\"))",               # 14
        "=RXNREVERSE(%s)" % q(r),                                  # 15
        "=RXNDH(RXNREVERSE(%s))" % q(r),                           # 16
        "=RXNSCALE(%s;\"1/2\")" % q(r),                            # 17
        "=RXNDH(RXNSCALE(%s;\"1/2\"))" % q(r),                     # 18
        "=RXNDH(RXNSCALE(%s;2))" % q(r),                           # 19
        "=SPECIESHF(\"CO2(g)\")",                                  # 20
        "=SPECIESHF(\"H2O(l)\")",                                  # 21
        "=SPECIESHF(\"H2O(g)\")",                                  # 22
        "=SPECIESCP(\"N2(g)\";298.15)",                            # 23
        "=SPECIESCP(\"N2(g)\";1000)",                              # 24
        "=SPECIESH(\"N2(g)\";1000)",                               # 25
        "=MOLARMASS(\"H2O\")",                                     # 26
        "=MOLARMASS(\"Ca(OH)2\")",                                 # 27
        "=MOLARMASS(\"CuSO4\u00b75H2O\")",                         # 28
        "=RXNSOURCE(%s)" % q(r),                                   # 29
        "=RXNVERSION()",                                           # 30
        "=RXNDH(\"SO2(g) + 0.5 O2(g) \u21cc SO3(g)\")",            # 31
        "=RXNDH(%s;;\"MJ/kg\";\"CH4\")" % q(r),                    # 32
        "=RXNDH(%s;;;\"O2\")" % q(r),                              # 33
        "=RXNDH(%s;;\"kcal/mol\")" % q(r),                         # 34
        "=RXNDH(%s;;\"J/mol\")" % q(r),                            # 35
        "=SPECIESHF(\"CO2(g)\";;\"kcal/mol\")",                    # 36
    ])
    dh, du, m_ch4 = cells[0].number, cells[1].number, cells[2].number
    # CODATA Key Values (Cox et al. 1989): ΔfH° CO2(g) −393.51, H2O(l) −285.83 kJ/mol;
    # CH4(g) −74.6 kJ/mol (NASA/TP-2002-211556, from Gurvich): −393.51 − 2·285.83 + 74.6.
    checks.close("RXNDH CH4 combustion (CODATA/NASA)", dh, -890.57, 0.15)
    # ΔrU° = ΔrH° − Δn(gas)·R·T with Δn(gas) = 1 − 3 = −2, R CODATA 2018, T = 298.15 K.
    if dh is not None:
        checks.close("RXNDU = RXNDH + 2RT", du, dh + 2 * R * 298.15 / 1000, 2e-3)
    want_m = iupac_molar_mass("CH4")
    if want_m is None:
        checks.skip("MOLARMASS CH4 vs periodictable", "python3-periodictable not installed")
    else:
        checks.close("MOLARMASS CH4 (IUPAC, python3-periodictable)", m_ch4, want_m, 0.005)
    if dh is not None and m_ch4:
        # 500 kg/h of CH4 = 500000/M mol/h; × ΔrH° (kJ/mol, one CH4 per extent) / 3600 s/h.
        load_kw = dh * 500000.0 / m_ch4 / 3600.0
        checks.close("RXNLOAD 500 kg/h CH4 in kW (from RXNDH and MOLARMASS)", cells[3].number,
                     load_kw, abs(load_kw) * 1e-9)
        checks.close("RXNLOAD about -7,700 kW (issue 3's example)", cells[3].number, -7710, 15)
        checks.close("RXNLOAD 10 kmol CH4, default kJ", cells[4].number, dh * 10000, 1e-6)
        f = gnu_units("kW", "btu/hr")
        if f is None:
            checks.skip("RXNLOAD BTU/h", "GNU units not installed")
        else:  # GNU units: 1 kW = 3412.1416 BTU/h (IT Btu)
            checks.close("RXNLOAD BTU/h (GNU units kW -> btu/hr)", cells[5].number,
                         load_kw * f, abs(load_kw * f) * 1e-6)
    # CODATA Key Values: ΔfH° H2O(l) −285.83 kJ/mol; NH3(g) −45.94 kJ/mol.
    checks.close("RXNDH 2H2 + O2 = 2H2O (CODATA)", cells[6].number, -571.66, 0.1)
    checks.close("RXNDH 1/2 N2 + 3/2 H2 → NH3 (CODATA)", cells[7].number, -45.94, 0.35)
    checks.ok("RXNKIND exothermic", cells[8].text == "exothermic", repr(cells[8]))
    checks.ok("RXNKIND of the reverse endothermic", cells[9].text == "endothermic",
              repr(cells[9]))
    checks.ok("RXNKIND tolerance 1000 kJ/mol: thermoneutral", cells[10].text == "thermoneutral",
              repr(cells[10]))
    checks.ok("RXNCHECK ok", cells[11].text == "ok", repr(cells[11]))
    checks.ok("RXNBALANCE gives text", cells[12].kind == "text" and "H2O" in cells[12].text,
              repr(cells[12]))
    checks.close("RXNDH of RXNBALANCE(H2 + O2 -> H2O) = 2 ΔfH° H2O(l) (CODATA)",
                 cells[13].number, -571.66, 0.1)
    checks.ok("RXNCHECK of the balanced reaction ok", cells[14].text == "ok", repr(cells[14]))
    checks.ok("RXNREVERSE gives text", cells[15].kind == "text" and "CH4" in cells[15].text,
              repr(cells[15]))
    if dh is not None:
        checks.close("RXNDH of RXNREVERSE = −RXNDH", cells[16].number, -dh, 1e-9)
        checks.close("RXNDH of RXNSCALE 1/2 = RXNDH/2", cells[18].number, dh / 2, 1e-9)
        checks.close("RXNDH of RXNSCALE 2 = 2·RXNDH", cells[19].number, 2 * dh, 1e-9)
    checks.ok("RXNSCALE keeps the fraction 1/2", "1/2" in cells[17].text, repr(cells[17]))
    # CODATA Key Values (Cox et al. 1989).
    checks.close("SPECIESHF CO2(g) (CODATA)", cells[20].number, -393.51, 0.13)
    checks.close("SPECIESHF H2O(l) (CODATA)", cells[21].number, -285.83, 0.04)
    checks.close("SPECIESHF H2O(g) (CODATA)", cells[22].number, -241.826, 0.04)
    # NIST-JANAF 4th ed. (1998), N2 table (typed from memory): Cp 29.124 J/(mol K) at
    # 298.15 K and 32.697 at 1000 K; H − H(298.15) = 21.463 kJ/mol at 1000 K.
    checks.close("SPECIESCP N2(g) 298.15 K (JANAF, from memory)", cells[23].number, 29.124, 0.02)
    checks.close("SPECIESCP N2(g) 1000 K (JANAF, from memory)", cells[24].number, 32.697, 0.05)
    checks.close("SPECIESH N2(g) 1000 K (JANAF, from memory)", cells[25].number, 21.463, 0.03)
    for i, formula in ((26, "H2O"), (27, "Ca(OH)2"), (28, "CuSO4(H2O)5")):
        want = iupac_molar_mass(formula)
        if want is None:
            checks.skip("MOLARMASS " + formula, "python3-periodictable not installed")
        else:
            checks.close("MOLARMASS %s (IUPAC, python3-periodictable)" % formula,
                         cells[i].number, want, 0.01)
    checks.ok("RXNSOURCE names NASA", cells[29].kind == "text" and "NASA" in cells[29].text,
              repr(cells[29]))
    checks.ok("RXNVERSION names the add-in version",
              cells[30].text.startswith("rxnheat Calc add-in %s" % version), repr(cells[30]))
    # ΔfH° SO2(g) −296.81 kJ/mol (CODATA Key Values); SO3(g) −395.77 kJ/mol (NIST-JANAF
    # 4th ed., 1998, typed from memory): ΔrH° = −98.96 kJ/mol.
    checks.close("RXNDH SO2 + 1/2 O2 ⇌ SO3 (JANAF, from memory)", cells[31].number, -98.96, 0.3)
    if dh is not None and m_ch4:
        checks.close("RXNDH per CH4 in MJ/kg = RXNDH/M", cells[32].number, dh / m_ch4, 1e-6)
        checks.close("RXNDH per O2 = RXNDH/2", cells[33].number, dh / 2, 1e-9)
        kcal = gnu_units("kcal/mol", "kJ/mol")  # GNU units: 4.184 (thermochemical calorie)
        if kcal is None:
            checks.skip("RXNDH kcal/mol", "GNU units not installed")
        else:
            checks.close("RXNDH kcal/mol (GNU units)", cells[34].number, dh / kcal, 1e-6)
        checks.close("RXNDH J/mol = 1000 × kJ/mol", cells[35].number, dh * 1000, 1e-6)
    if cells[20].number is not None and gnu_units("kcal/mol", "kJ/mol"):
        checks.close("SPECIESHF kcal/mol (GNU units)", cells[36].number,
                     cells[20].number / gnu_units("kcal/mol", "kJ/mol"), 1e-6)

    if cli is None:
        checks.skip("engine CLI comparisons", "target rxnheat_cli not built")
        return
    try:
        checks.close("RXNDH = CLI dh", dh, cli.value("dh", r), 1e-9 * abs(dh or 1))
        checks.close("RXNDU = CLI du", du, cli.value("du", r), 1e-9 * abs(du or 1))
        checks.close("RXNLOAD = CLI load", cells[3].number,
                     cli.value("load", r, "500", "kg/h", "CH4", "-u", "kW"),
                     1e-9 * abs(cells[3].number or 1))
        checks.close("RXNDH per CH4 MJ/kg = CLI", cells[32].number,
                     cli.value("dh", r, "-u", "MJ/kg", "--per", "CH4"), 1e-9 * 60)
        checks.ok("RXNBALANCE = CLI balance", cells[12].text == cli.text("balance", "H2 + O2 -> H2O"),
                  "%r vs %r" % (cells[12].text, cli.text("balance", "H2 + O2 -> H2O")))
        checks.ok("RXNREVERSE = CLI reverse", cells[15].text == cli.text("reverse", r))
        checks.ok("RXNSCALE = CLI scale", cells[17].text == cli.text("scale", r, "1/2"))
        checks.ok("RXNKIND = CLI kind", cells[8].text == cli.text("kind", r))
    except Exception as e:  # a CLI that does not answer as cli/CLI.md says is a failure
        checks.ok("engine CLI answers", False, "%s: %s" % (type(e).__name__, e))


def check_temperatures(checks, sh):
    r = CH4_COMBUSTION_GAS  # water as gas: liquid water's data stop at 600 K
    forms = ["623.15", q("350 C"), q("350 \u00b0C"), q("662 F"), q("1121.67 R"), q("623.15 K")]
    cells = sh.evaluate(["=RXNDH(%s;%s)" % (q(r), t) for t in forms] +
                        ["=RXNDH(%s;%s)" % (q(r), q("25 C")), "=RXNDH(%s)" % q(r),
                         "=SPECIESH(\"N2(g)\";1000)", "=SPECIESH(\"N2(g)\";\"726.85 C\")",
                         "=SPECIESH(\"N2(g)\";1000;\"25 C\")",
                         "=SPECIESH(\"N2(g)\";1000;400)",
                         "=SPECIESH(\"N2(g)\";400)"])
    base = cells[0].number
    checks.ok("RXNDH at 623.15 K is a number", base is not None, repr(cells[0]))
    if base is not None:
        # 350 °C = 662 °F = 1121.67 °R = 623.15 K (GNU units: tempF(662), tempR(1121.67)).
        for form, c in zip(forms[1:], cells[1:6]):
            checks.close("temperature %s = 623.15 K" % form, c.number, base, 1e-6)
    checks.close("temperature \"25 C\" = default 298.15 K", cells[6].number, cells[7].number, 1e-9)
    checks.close("SPECIESH at \"726.85 C\" = at 1000 K", cells[9].number, cells[8].number, 1e-9)
    checks.close("SPECIESH reference \"25 C\" = default", cells[10].number, cells[8].number, 1e-9)
    if None not in (cells[8].number, cells[11].number, cells[12].number):
        # H(1000) − H(400) = [H(1000) − H(298.15)] − [H(400) − H(298.15)]
        checks.close("SPECIESH with a reference temperature", cells[11].number,
                     cells[8].number - cells[12].number, 1e-9)


def check_equilibrium(checks, sh, cli):
    """RXNDS, RXNDG, RXNLOGK in a real office: values, a row of temperatures, an error cell."""
    nh3 = "N2(g) + 3 H2(g) -> 2 NH3(g)"
    cells = sh.evaluate(["=RXNLOGK(%s;700)" % q(nh3),                        # 0
                         "=RXNDG(%s)" % q(nh3),                              # 1
                         "=RXNDS(%s)" % q(nh3),                              # 2
                         "=RXNDS(%s;;%s)" % (q(nh3), q("kJ/(mol*K)")),       # 3
                         "=RXNDG(%s;700;%s)" % (q(nh3), q("kJ/kg")),         # 4
                         "=RXNLOGK(%s;%s)" % (q(nh3), q("426.85 C")),        # 5
                         "=RXNDH(%s)-298.15*RXNDS(%s)/1000" % (q(nh3), q(nh3))])  # 6
    # NIST-JANAF 4th ed. (1998), from memory: log Kf(NH3, 700 K) = −2.029, ΔfG°(NH3, 298.15 K)
    # = −16.367 kJ/mol; S° N2 191.609, H2 130.680, NH3 192.774 J/(mol·K).
    checks.close("RXNLOGK ammonia at 700 K (JANAF, from memory)", cells[0].number, -4.058, 0.03)
    checks.close("RXNDG ammonia at 298.15 K (JANAF, from memory)", cells[1].number, -32.73, 0.15)
    checks.close("RXNDS ammonia at 298.15 K (JANAF, from memory)", cells[2].number, -198.10, 0.2)
    if cells[2].number is not None:
        checks.close("RXNDS kJ/(mol*K) = J/(mol·K) / 1000", cells[3].number, cells[2].number / 1000, 1e-12)
    checks.ok("RXNDG per-mass unit is Err:502", cells[4].error == ERR_ILLEGAL_ARGUMENT, repr(cells[4]))
    checks.close("RXNLOGK at \"426.85 C\" = at 700 K", cells[5].number, cells[0].number, 1e-9)
    checks.close("RXNDG = RXNDH − T·RXNDS", cells[1].number, cells[6].number, 1e-9)
    sh.put("D40", 500)
    sh.put("E40", 700)
    sh.put("F40", 900)
    rows = sh.array("G40:I40", "=RXNLOGK(%s;D40:F40)" % q(nh3))
    checks.close("RXNLOGK over a row of temperatures: 700 K", rows[0][1].number, cells[0].number, 1e-9)
    checks.ok("RXNLOGK over a row falls with temperature (exothermic)",
              None not in (rows[0][0].number, rows[0][2].number) and rows[0][0].number > rows[0][2].number,
              repr(rows))
    if cli is not None:
        checks.close("RXNLOGK = CLI logk", cells[0].number, cli.value("logk", nh3, "-T", "700"), 1e-9)


def check_fuel(checks, sh, cli):
    """FUELHV in a real office: one species, a composition range with a blank row, errors."""
    for cell, value in [("BA1", "CH4"), ("BB1", 95), ("BA3", "C2H6"), ("BB3", 3), ("BA4", "N2"), ("BB4", 2),
                        ("BA6", "CH4"), ("BB6", 90), ("BA7", "N2"), ("BB7", 5)]:
        sh.put(cell, value)
    cells = sh.evaluate(['=FUELHV("CH4(g)")',                      # 0
                         '=FUELHV(BA1:BB4;"HHV";"MJ/Sm3")',        # 1
                         '=FUELHV(BA1:BB4;"lhv";"BTU/scf")',       # 2
                         '=FUELHV(BA6:BB7)',                       # 3: sums to 95 %
                         '=FUELHV("CH4";"GHV")',                   # 4
                         '=FUELHV("methanol";;"MJ/Nm3")',          # 5: a liquid per gas volume
                         '=FUELHV("CH4";0;0)'])                    # 6: blanks are the defaults
    # Methane HHV 55.5 MJ/kg (engineering handbooks, from memory); the natural gas per Sm3
    # "somewhat above 36 MJ" (issue 9): 0.95 × 890.6 + 0.03 × 1560.7 kJ/mol over 23.645 L/mol.
    checks.close("FUELHV methane about 55.5 MJ/kg (handbooks, from memory)", cells[0].number, 55.5, 0.3)
    checks.ok("FUELHV natural gas per Sm3 between 36 and 39 MJ",
              cells[1].number is not None and 36 < cells[1].number < 39, repr(cells[1]))
    checks.ok("FUELHV of a composition summing to 95 % is Err:502", cells[3].error == ERR_ILLEGAL_ARGUMENT,
              repr(cells[3]))
    checks.ok("FUELHV with an unknown basis is Err:502", cells[4].error == ERR_ILLEGAL_ARGUMENT, repr(cells[4]))
    checks.ok("FUELHV of a liquid per Nm3 is Err:502", cells[5].error == ERR_ILLEGAL_ARGUMENT, repr(cells[5]))
    checks.close("FUELHV blanks (0) are HHV and MJ/kg", cells[6].number, cells[0].number, 1e-12)
    why = sh.evaluate(['=RXNWHY("FUELHV";BA6:BB7)'])
    checks.ok("RXNWHY of FUELHV gives the sum", "95" in why[0].text, repr(why[0]))
    if cli is not None:
        checks.close("FUELHV = CLI hv", cells[0].number, cli.value("hv", "CH4(g)"), 1e-9)
        checks.close("FUELHV range = CLI hv with SPECIES=FRACTION words", cells[2].number,
                     cli.value("hv", "CH4=95", "C2H6=3", "N2=2", "--basis", "LHV", "-u", "BTU/scf"), 1e-9)


def check_optional_arguments(checks, sh):
    r = CH4_COMBUSTION
    for a in ("Z1", "Z2", "Z3", "Z4", "Z5"):  # left blank on purpose
        sh.cell(a).setString("")
    cells = sh.evaluate([
        "=RXNDH(%s)" % q(r),
        "=RXNDH(%s;;;;)" % q(r),
        "=RXNDH(%s;Z1;Z2;Z3;Z4)" % q(r),
        "=RXNDH(%s;\"\";\"\";\"\";\"\")" % q(r),
        "=RXNDH(%s;298.15;\"kJ/mol\")" % q(r),
        "=RXNDU(%s)" % q(r),
        "=RXNDU(%s;Z1;Z2;Z3;Z4)" % q(r),
        "=RXNLOAD(%s;500;\"kg/h\";\"CH4\")" % q(r),
        "=RXNLOAD(%s;500;\"kg/h\";\"CH4\";\"kW\")" % q(r),
        "=RXNLOAD(%s;500;\"kg/h\";\"CH4\";Z1;Z2;Z3)" % q(r),
        "=RXNLOAD(%s;500;\"kg/h\";\"CH4\";;;)" % q(r),
        "=RXNKIND(%s;Z1;Z2;Z3)" % q(r),
        "=RXNKIND(%s;;;)" % q(r),
        "=RXNCHECK(%s;Z1;Z2)" % q(r),
        "=SPECIESHF(\"CO2(g)\";Z1;Z2;Z3)",
        "=SPECIESHF(\"CO2(g)\")",
        "=SPECIESH(\"N2(g)\";1000;Z1;Z2)",
        "=SPECIESH(\"N2(g)\";1000)",
        "=RXNBALANCE(\"H2 + O2 -> H2O\";Z1)",
        "=RXNBALANCE(\"H2 + O2 -> H2O\")",
        "=RXNSOURCE(\"CO2(g)\";Z1)",
        "=RXNSOURCE(\"CO2(g)\")",
    ])
    d = cells[0].number
    checks.ok("RXNDH with everything omitted is a number", d is not None, repr(cells[0]))
    for i, how in ((1, "empty"), (2, "blank cells"), (3, "empty strings"), (4, "explicit defaults")):
        checks.close("RXNDH optional arguments %s = omitted" % how, cells[i].number, d, 0)
    checks.close("RXNDU blank cells = omitted", cells[6].number, cells[5].number, 0)
    checks.close("RXNLOAD result_unit omitted = kW", cells[7].number, cells[8].number, 0)
    checks.close("RXNLOAD blank cells = omitted", cells[9].number, cells[7].number, 0)
    checks.close("RXNLOAD empty = omitted", cells[10].number, cells[7].number, 0)
    checks.ok("RXNKIND blank cells", cells[11].text == "exothermic", repr(cells[11]))
    checks.ok("RXNKIND empty", cells[12].text == "exothermic", repr(cells[12]))
    checks.ok("RXNCHECK blank cells", cells[13].text == "ok", repr(cells[13]))
    checks.close("SPECIESHF blank cells = omitted", cells[14].number, cells[15].number, 0)
    checks.close("SPECIESH blank cells = omitted", cells[16].number, cells[17].number, 0)
    checks.ok("RXNBALANCE blank table = omitted", cells[18].text == cells[19].text
              and cells[19].kind == "text", "%r %r" % (cells[18], cells[19]))
    checks.ok("RXNSOURCE blank table = omitted", cells[20].text == cells[21].text
              and cells[21].kind == "text", "%r %r" % (cells[20], cells[21]))


def check_ranges(checks, sh):
    reactions = [CH4_COMBUSTION, "2H2 + O2 = 2H2O", "this is not a reaction", "",
                 CH4_COMBUSTION_UNICODE, "1/2 N2(g) + 3/2 H2(g) \u2192 NH3(g)"]
    # A column D1:D6 (with one bad and one blank cell), a row D8:F8, a 2x2 block D10:E11.
    for i, r in enumerate(reactions):
        sh.put("D%d" % (i + 1), r)
    sh.put("D8", reactions[0])
    sh.put("E8", reactions[1])
    sh.put("F8", reactions[5])
    sh.put("D10", reactions[0])
    sh.put("E10", reactions[1])
    sh.put("D11", reactions[4])
    sh.put("E11", reactions[5])
    singles = sh.evaluate(["=RXNDH(D%d)" % (i + 1) for i in range(len(reactions))] +
                          ["=RXNCHECK(D%d)" % (i + 1) for i in range(len(reactions))])
    col = sh.array("G1:G6", "=RXNDH(D1:D6)")
    checks.ok("array RXNDH(D1:D6) has shape 6x1", len(col) == 6 and len(col[0]) == 1)
    for i in (0, 1, 4, 5):
        checks.close("array element %d = single-cell RXNDH" % (i + 1), col[i][0].number,
                     singles[i].number, 0)
    checks.ok("array: failing element shows Err:502", col[2][0].error == ERR_ILLEGAL_ARGUMENT,
              repr(col[2][0]))
    checks.ok("array: blank reaction gives a blank element", col[3][0].error == 0 and
              col[3][0].text == "" and col[3][0].number in (None, 0.0), repr(col[3][0]))
    checks.ok("single cell: the bad reaction shows Err:502",
              singles[2].error == ERR_ILLEGAL_ARGUMENT, repr(singles[2]))
    words = sh.array("H1:H6", "=RXNCHECK(D1:D6)")
    for i in range(len(reactions)):
        if i == 3:
            checks.ok("array RXNCHECK: blank stays blank", words[i][0].text == "",
                      repr(words[i][0]))
            continue
        checks.ok("array RXNCHECK element %d = single-cell words" % (i + 1),
                  words[i][0].text == singles[6 + i].text,
                  "%r vs %r" % (words[i][0].text, singles[6 + i].text))
    checks.ok("array RXNCHECK: the bad reaction gets words", words[2][0].text not in ("", "ok"),
              repr(words[2][0]))
    total = sh.one("=SUM(RXNDH(D1:D6))")
    checks.ok("SUM over an array with a failing element is an error, not a partial sum",
              total.error != 0, repr(total))
    row = sh.array("D9:F9", "=RXNDH(D8:F8)")
    checks.ok("array over a row has shape 1x3", len(row) == 1 and len(row[0]) == 3)
    for j, i in enumerate((0, 1, 5)):
        checks.close("row element %d = single-cell RXNDH" % (j + 1), row[0][j].number,
                     singles[i].number, 0)
    block = sh.array("G10:H11", "=RXNDH(D10:E11)")
    for (a, b), i in zip(((0, 0), (0, 1), (1, 0), (1, 1)), (0, 1, 4, 5)):
        checks.close("2x2 element (%d,%d) = single-cell RXNDH" % (a, b), block[a][b].number,
                     singles[i].number, 0)
    kinds = sh.array("I10:J11", "=RXNKIND(D10:E11)")
    checks.ok("array RXNKIND gives words", all(c.text == "exothermic" for r in kinds for c in r),
              repr(kinds))
    # Species and formulas in ranges.
    for i, s in enumerate(["CO2(g)", "H2O(l)", "H2O(g)", "Qq9(g)"]):
        sh.put("K%d" % (i + 1), s)
    for i, f in enumerate(["CH4", "H2O", "Ca(OH)2"]):
        sh.put("M%d" % (i + 1), f)
    hf = sh.array("L1:L4", "=SPECIESHF(K1:K4)")
    single_hf = sh.evaluate(["=SPECIESHF(K%d)" % (i + 1) for i in range(3)])
    for i in range(3):
        checks.close("array SPECIESHF element %d = single" % (i + 1), hf[i][0].number,
                     single_hf[i].number, 0)
    checks.ok("array SPECIESHF unknown species shows Err:502",
              hf[3][0].error == ERR_ILLEGAL_ARGUMENT, repr(hf[3][0]))
    mm = sh.array("N1:P1", "=MOLARMASS(TRANSPOSE(M1:M3))")
    checks.ok("MOLARMASS over an inline array of 3", len(mm[0]) == 3 and
              all(c.number is not None for c in mm[0]), repr(mm))
    mm_single = sh.evaluate(["=MOLARMASS(M%d)" % (i + 1) for i in range(3)])
    for i in range(3):
        checks.close("MOLARMASS array element %d = single" % (i + 1), mm[0][i].number,
                     mm_single[i].number, 0)
    bal = sh.array("Q1:Q2", "=RXNBALANCE(D1:D2)")
    checks.ok("array RXNBALANCE gives text", all(c[0].kind == "text" for c in bal), repr(bal))


def check_unicode(checks, sh, svc):
    cells = sh.evaluate([
        "=RXNDH(%s)" % q(CH4_COMBUSTION_UNICODE),
        "=RXNDH(%s)" % q(CH4_COMBUSTION),
        "=RXNDH(RXNREVERSE(%s))" % q(CH4_COMBUSTION_UNICODE),
        "=SPECIESHF(\"CO\u2082(g)\")",
        "=SPECIESHF(\"CO2(g)\")",
        "=RXNCHECK(%s)" % q(CH4_COMBUSTION_UNICODE),
        "=RXNCHECK(%s)" % q("CH\u2084(g) + O\u2082(g) \u2192 CO\u2082(g) \U0001F525"),
        "=RXNDH(%s)" % q("CH\u2084(g) + O\u2082(g) \u2192 CO\u2082(g) \U0001F525"),
        "=RXNDH(%s;\"350 \u00b0C\")" % q(CH4_COMBUSTION_GAS_UNICODE),
        "=RXNDH(%s;623.15)" % q(CH4_COMBUSTION_GAS),
    ])
    checks.close("Unicode subscripts and arrow = ASCII reaction", cells[0].number,
                 cells[1].number, 0)
    if cells[0].number is not None:
        checks.close("RXNREVERSE of the Unicode reaction = −RXNDH", cells[2].number,
                     -cells[0].number, 1e-9)
    checks.close("SPECIESHF CO₂(g) = CO2(g)", cells[3].number, cells[4].number, 0)
    checks.ok("RXNCHECK Unicode reaction ok", cells[5].text == "ok", repr(cells[5]))
    checks.ok("RXNCHECK with an emoji gives words", cells[6].text not in ("", "ok"),
              repr(cells[6]))
    checks.ok("RXNDH with an emoji is Err:502", cells[7].error == ERR_ILLEGAL_ARGUMENT,
              repr(cells[7]))
    checks.close("\"350 °C\" with a Unicode reaction", cells[8].number, cells[9].number, 1e-9)
    more = sh.evaluate([
        "=RXNCHECK(UNICHAR(128293)&\"H2\")",
        "=RXNDH(UNICHAR(55357)&\"H2\")",
        "=RXNCHECK(UNICHAR(55357)&\"H2\")",
        "=RXNSCALE(%s;\"\u00bd\")" % q(CH4_COMBUSTION),
        "=RXNSCALE(%s;\"1/2\")" % q(CH4_COMBUSTION),
        "=RXNSCALE(%s;0.5)" % q(CH4_COMBUSTION),
    ])
    # A character outside the BMP (a UTF-16 surrogate pair) goes in and comes back in the
    # engine's words intact.
    checks.ok("astral-plane character survives UTF-16 -> UTF-8 -> UTF-16",
              "\U0001F525" in more[0].text, repr(more[0]))
    # Calc can make a lone surrogate (UNICHAR(55357)): not valid Unicode, refused in words.
    checks.ok("lone surrogate: Err:502", more[1].error == ERR_ILLEGAL_ARGUMENT, repr(more[1]))
    checks.ok("lone surrogate: RXNCHECK says it is not valid Unicode",
              "not valid Unicode" in more[2].text, repr(more[2]))
    checks.ok("RXNSCALE factor \"½\" = \"1/2\"", more[3].text == more[4].text != "",
              "%r %r" % (more[3], more[4]))
    checks.ok("RXNSCALE factor 0.5 = \"1/2\"", more[5].text == more[4].text, repr(more[5]))
    # Text in and out of the component without loss: the same call made directly.
    direct = svc.rxnCheck("CH\u2084(g) + O\u2082(g) \u2192 CO\u2082(g) \U0001F525", None, None)
    checks.ok("RXNCHECK words identical through the cell and directly", direct == cells[6].text,
              "%r vs %r" % (direct, cells[6].text))


# Malformed reactions (and temperatures) that every numeric function must refuse with an error
# in the cell, and that RXNCHECK must explain in words.
MALFORMED = [
    ("empty text", "", None),
    ("unbalanced", "H2 + O2 -> H2O", None),
    ("no products", "CH4(g) + 2 O2(g) ->", None),
    ("no reactants", "-> CO2(g)", None),
    ("doubled plus", "CH4(g) + + 2 O2(g) -> CO2(g) + 2 H2O(l)", None),
    ("trailing plus", "H2(g) + Cl2(g) -> 2 HCl(g) +", None),
    ("two arrows", "CH4(g) + 2 O2(g) -> -> CO2(g) + 2 H2O(l)", None),
    ("no arrow", "CH4(g) + 2 O2(g) CO2(g) + 2 H2O(l)", None),
    ("unknown element", "Qz(g) + O2(g) -> QzO2(g)", None),
    ("unknown phase", "CH4(x) + 2 O2(g) -> CO2(g) + 2 H2O(l)", None),
    ("zero denominator", "1/0 H2(g) + O2(g) -> H2O(l)", None),
    ("open parentheses", "((((", None),
    ("lower-case symbol", "ch4(g) + 2 o2(g) -> co2(g) + 2 h2o(l)", None),
    ("ambiguous isomer", "C3H6(g) + 9/2 O2(g) -> 3 CO2(g) + 3 H2O(l)", None),
    ("control character", "CH4(g)\u0001 + 2 O2(g) -> CO2(g) + 2 H2O(l)", None),
    ("only an arrow", "->", None),
    ("numbers only", "1 + 2 -> 3", None),
    ("too long (5000 chars)", "H2(g) + " * 625 + "O2(g) -> H2O(l)", None),
    ("temperature below the data", CH4_COMBUSTION, "10"),
    ("liquid water above its data (600 K)", CH4_COMBUSTION, q("350 C")),
    ("temperature above the data", CH4_COMBUSTION, "9000"),
    ("negative kelvin", CH4_COMBUSTION, q("-5 K")),
    ("unknown temperature unit", CH4_COMBUSTION, q("350 Q")),
    ("temperature text without a number", CH4_COMBUSTION, q("hot")),
]

# Bad arguments other than the reaction: an error in the cell (RXNCHECK has no such argument).
BAD_ARGUMENTS = [
    ("unknown energy unit", "=RXNDH(%s;;\"kJ/kmol\")" % q(CH4_COMBUSTION)),
    ("wrong case unit mJ/mol", "=RXNDH(%s;;\"mJ/mol\")" % q(CH4_COMBUSTION)),
    ("mass unit without per", "=RXNDH(%s;;\"MJ/kg\")" % q(CH4_COMBUSTION)),
    ("per species not in the reaction", "=RXNDH(%s;;;\"N2\")" % q(CH4_COMBUSTION)),
    ("unit given as a number", "=RXNDH(%s;;5)" % q(CH4_COMBUSTION)),
    ("reaction given as a number", "=RXNDH(42)"),
    ("RXNLOAD unknown quantity unit", "=RXNLOAD(%s;500;\"furlong\";\"CH4\")" % q(CH4_COMBUSTION)),
    ("RXNLOAD key not in the reaction", "=RXNLOAD(%s;500;\"kg/h\";\"N2\")" % q(CH4_COMBUSTION)),
    ("RXNLOAD quantity as text", "=RXNLOAD(%s;\"lots\";\"kg/h\";\"CH4\")" % q(CH4_COMBUSTION)),
    ("RXNLOAD total with a rate unit", "=RXNLOAD(%s;500;\"kg\";\"CH4\";\"kW\")" % q(CH4_COMBUSTION)),
    ("RXNLOAD missing key", "=RXNLOAD(%s;500;\"kg/h\")" % q(CH4_COMBUSTION)),
    ("RXNSCALE factor text", "=RXNSCALE(%s;\"twice\")" % q(CH4_COMBUSTION)),
    ("SPECIESCP without temperature", "=SPECIESCP(\"N2(g)\")"),
    ("SPECIESCP outside the data", "=SPECIESCP(\"N2(g)\";50)"),
    ("SPECIESHF unknown species", "=SPECIESHF(\"Xx(g)\")"),
    ("MOLARMASS not a formula", "=MOLARMASS(\"Hello\")"),
    # A range where one value is needed (a temperature range spreads into an array instead).
    ("unit as a range", "=RXNDH(%s;;Z1:Z3)" % q(CH4_COMBUSTION)),
    ("table that is one cell", "=RXNDH(%s;;;;\"CH4\")" % q(CH4_COMBUSTION)),
    ("RXNBALANCE of text that is no reaction", "=RXNBALANCE(\"water\")"),
]


def check_errors(checks, sh, svc):
    # Each malformed reaction sits in a cell of column AA, as on a user's sheet (a formula's
    # own string literals are limited in length by Calc).
    formulas = []
    for k, (name, reaction, temperature) in enumerate(MALFORMED):
        sh.put("AA%d" % (k + 1), reaction)
        r = "AA%d" % (k + 1)
        t = ";" + temperature if temperature else ""
        formulas += ["=RXNDH(%s%s)" % (r, t), "=RXNDU(%s%s)" % (r, t),
                     "=RXNKIND(%s%s)" % (r, t),
                     "=RXNLOAD(%s;500;\"kg/h\";\"CH4\";;%s)" % (r, temperature or ""),
                     "=RXNCHECK(%s%s)" % (r, t)]
    t0 = time.monotonic()
    cells = sh.evaluate(formulas)
    elapsed = time.monotonic() - t0
    checks.ok("%d malformed inputs × 5 functions recalculated in under 20 s" % len(MALFORMED),
              elapsed < 20, "%.1f s" % elapsed)
    for k, (name, reaction, temperature) in enumerate(MALFORMED):
        dh, du, kind, load, words = cells[5 * k:5 * k + 5]
        for fn, c in (("RXNDH", dh), ("RXNDU", du), ("RXNKIND", kind), ("RXNLOAD", load)):
            checks.ok("malformed (%s): %s shows Err:502" % (name, fn),
                      c.error == ERR_ILLEGAL_ARGUMENT, repr(c))
        checks.ok("malformed (%s): RXNCHECK explains in words" % name,
                  words.kind == "text" and words.text not in ("", "ok") and len(words.text) > 5,
                  repr(words))
        # The exception Calc receives carries the same words as RXNCHECK.
        tval = None
        if temperature:
            tval = float(temperature) if not temperature.startswith('"') else temperature[1:-1]
        try:
            # The text the cell holds ("" for the empty one: an omitted argument, None, is
            # "is required", while an empty cell or text is "is required but empty").
            svc.rxnDH(reaction, tval, None, None, None)
            checks.ok("malformed (%s): direct call raises" % name, False, "returned a value")
        except Exception as e:
            msg = getattr(e, "Message", None)
            checks.ok("malformed (%s): IllegalArgumentException" % name,
                      type(e).__name__.endswith("IllegalArgumentException"), type(e).__name__)
            checks.ok("malformed (%s): its message = RXNCHECK's words" % name,
                      msg == words.text, "%r vs %r" % (msg, words.text))
    literal = sh.evaluate(["=RXNDH(\"\")", "=RXNCHECK(\"\")", "=RXNDH()", "=RXNCHECK()"])
    checks.ok("RXNDH(\"\") shows Err:502", literal[0].error == ERR_ILLEGAL_ARGUMENT,
              repr(literal[0]))
    checks.ok("RXNCHECK(\"\") gives words", literal[1].text not in ("", "ok"), repr(literal[1]))
    checks.ok("RXNDH() shows Err:502", literal[2].error == ERR_ILLEGAL_ARGUMENT, repr(literal[2]))
    checks.ok("RXNCHECK() gives words", literal[3].text not in ("", "ok"), repr(literal[3]))
    bad = sh.evaluate([f for _, f in BAD_ARGUMENTS])
    for (name, _), c in zip(BAD_ARGUMENTS, bad):
        checks.ok("bad argument (%s) shows Err:502" % name, c.error == ERR_ILLEGAL_ARGUMENT,
                  repr(c))
    # A malformed species table (no header naming the columns) is an error naming it.
    sh.put("S1", "CH4")
    sh.put("T1", "g")
    sh.put("U1", -74.87)
    tbl = sh.evaluate(["=RXNDH(%s;;;;S1:U1)" % q(CH4_COMBUSTION),
                       "=RXNCHECK(%s;;S1:U1)" % q(CH4_COMBUSTION)])
    checks.ok("malformed table: Err:502", tbl[0].error == ERR_ILLEGAL_ARGUMENT, repr(tbl[0]))
    checks.ok("malformed table: RXNCHECK words", tbl[1].text not in ("", "ok"), repr(tbl[1]))
    # A huge input is refused quickly, not parsed slowly.
    sh.put("Y1", "H2(g) + " * 25000 + "O2(g) -> H2O(l)")
    t0 = time.monotonic()
    big = sh.evaluate(["=RXNDH(Y1)", "=RXNCHECK(Y1)"])
    elapsed = time.monotonic() - t0
    checks.ok("200,000-character reaction: Err:502", big[0].error == ERR_ILLEGAL_ARGUMENT,
              repr(big[0]))
    checks.ok("200,000-character reaction: RXNCHECK words", big[1].text not in ("", "ok"),
              repr(big[1])[:200])
    checks.ok("200,000-character reaction refused within 5 s", elapsed < 5, "%.2f s" % elapsed)


def check_table(checks, sh):
    """A user species table (engine/DATA.md, User tables): CH4(g) with the NIST-JANAF ΔfH° −74.87 kJ/mol
    (4th ed., 1998; typed from memory) instead of the built-in −74.6."""
    rows = [["formula", "phase", "dHf", "source"], ["CH4", "g", -74.87, "NIST-JANAF (test)"]]
    for i, row in enumerate(rows):
        for j, v in enumerate(row):
            sh.put("%s%d" % ("VWXY"[j], 20 + i), v)
    cells = sh.evaluate(["=RXNDH(%s;;;;V20:Y21)" % q(CH4_COMBUSTION),
                         "=RXNDH(%s)" % q(CH4_COMBUSTION),
                         "=RXNCHECK(%s;;V20:Y21)" % q(CH4_COMBUSTION),
                         "=SPECIESHF(\"CH4(g)\";;;V20:Y21)"])
    if cells[0].error:
        # The engine may not support tables yet: then its error must reach the cell, in words.
        checks.ok("species table unsupported: Err:502 in the cell",
                  cells[0].error == ERR_ILLEGAL_ARGUMENT, repr(cells[0]))
        checks.ok("species table unsupported: RXNCHECK says why", cells[2].text not in ("", "ok"),
                  repr(cells[2]))
        print("NOTE  species table: the engine answered: %s" % cells[2].text, flush=True)
        return
    if cells[1].number is not None:
        # ΔrH° changes by −(−74.87 − (−74.6)) = +0.27 kJ/mol with the table's CH4.
        checks.close("species table overrides CH4(g)", cells[0].number - cells[1].number,
                     0.27, 0.05)
    checks.close("SPECIESHF from the table", cells[3].number, -74.87, 1e-9)
    checks.ok("RXNCHECK with the table ok", cells[2].text == "ok", repr(cells[2]))


def check_alive(checks, off, sh):
    checks.ok("office process still running", off.alive())
    c = sh.one("=RXNDH(%s)+0" % q(CH4_COMBUSTION))
    checks.close("office still answering: RXNDH after all the errors", c.number, -890.57, 0.15)
    c = sh.one("=1+1")
    checks.close("office still answering: =1+1", c.number, 2.0, 0)


def check_save_reload(checks, off, workdir):
    doc = off.new_calc()
    sh = Sheet(doc)
    sh.put("A1", CH4_COMBUSTION)
    sh.put("A2", "2H2 + O2 = 2H2O")
    sh.put("A3", "this is not a reaction")
    formulas = {
        "B1": "=RXNDH(A1)", "B2": "=RXNDH(A2;\"350 C\")", "B3": "=RXNDH(A3)",
        "B4": "=RXNLOAD(A1;500;\"kg/h\";\"CH4\";\"kW\")", "B5": "=RXNKIND(A1)",
        "B6": "=RXNCHECK(A3)", "B7": "=MOLARMASS(\"CH4\")", "B8": "=SPECIESCP(\"N2(g)\";\"500 K\")",
        "B9": "=RXNBALANCE(\"H2 + O2 -> H2O\")", "B10": "=RXNVERSION()",
    }
    for a, f in formulas.items():
        sh.cell(a).setFormula(f)
    sh.cell("C1:C3").setArrayFormula("=RXNDH(A1:A3)")
    doc.calculateAll()
    cells = list(formulas) + ["C1", "C2", "C3"]
    before = {a: repr(Cell(sh.cell(a))) for a in cells}
    path = os.path.join(workdir, "saved-with-rxnheat.ods")
    doc.storeToURL(officelib.file_url(path), (officelib.prop("FilterName", "calc8"),))
    doc.close(True)
    with zipfile.ZipFile(path) as z:
        content = z.read("content.xml").decode("utf-8")
    # ODF stores add-in calls by the service and method name (upper case), not the display name.
    checks.ok("saved file stores the add-in calls by programmatic name",
              "of:=ORG.RXNHEAT.CALC.FUNCTIONS.RXNDH([.A1])" in content)
    doc = off.load(path)
    sh2 = Sheet(doc)
    cached = {a: repr(Cell(sh2.cell(a))) for a in cells}
    checks.ok("reloaded cached results equal", cached == before, "%s vs %s" % (cached, before))
    doc.calculateAll()
    after = {a: repr(Cell(sh2.cell(a))) for a in cells}
    checks.ok("reloaded and recalculated results equal", after == before,
              "%s vs %s" % (after, before))
    checks.ok("reloaded B1 is a number, not a name error", Cell(sh2.cell("B1")).value is not None)
    doc.close(True)


# ------------------------------------------------------------------------------------------
def main():
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--oxt", required=True)
    ap.add_argument("--version", required=True, help="the project version the .oxt must carry")
    ap.add_argument("--cli", help="the rxnheat command line, for the engine's own answers")
    ap.add_argument("--wizard-texts", help="the catalogue's Function Wizard texts (rxnheat-gen texts)")
    ap.add_argument("--timeout", type=int, default=170)
    ap.add_argument("--keep", action="store_true", help="keep the work folder")
    args = ap.parse_args()

    def on_alarm(signum, frame):
        raise Timeout("the end-to-end test ran over %d s" % args.timeout)

    signal.signal(signal.SIGALRM, on_alarm)
    signal.alarm(args.timeout)
    t_start = time.monotonic()
    checks = Checks()
    workdir = tempfile.mkdtemp(prefix="rxnheat-e2e-")
    off = None
    cli = EngineCli(args.cli) if args.cli and os.path.exists(args.cli) else None
    try:
        # The component's types, so this process can talk to it directly over the bridge.
        with zipfile.ZipFile(args.oxt) as z:
            z.extract("rxnheat.rdb", workdir)
        local = uno.getComponentContext()
        local.getValueByName("/singletons/com.sun.star.reflection.theTypeDescriptionManager") \
            .insert(officelib.file_url(os.path.join(workdir, "rxnheat.rdb")))

        off = officelib.Office(workdir, "install").start()
        env = off.install_extension(args.oxt)
        checks.ok("licence shown and approved on installation", env.approvals >= 1)
        check_install(checks, off, args.version)
        off.stop()

        off = officelib.Office(workdir, "run").start()
        svc = off.smgr.createInstanceWithContext("org.rxnheat.calc.Functions", off.ctx)
        checks.ok("service org.rxnheat.calc.Functions can be created", svc is not None)
        checks.ok("service supports com.sun.star.sheet.AddIn",
                  svc.supportsService("com.sun.star.sheet.AddIn"))
        checks.ok("service name", svc.getServiceName() == "org.rxnheat.calc.Functions")
        checks.ok("display name of rxnDH", svc.getDisplayFunctionName("rxnDH") == "RXNDH")
        checks.ok("programmatic name of RXNLOAD",
                  svc.getProgrammaticFuntionName("RXNLOAD") == "rxnLoad")
        check_wizard_texts(checks, off)
        if args.wizard_texts:
            check_wizard_from_catalogue(checks, off, svc, args.wizard_texts)
        else:
            checks.skip("wizard texts = catalogue", "no --wizard-texts given")
        doc = off.new_calc()
        sh = Sheet(doc)
        sections = [("typical values", lambda: check_typical_values(checks, sh, cli, args.version)),
                    ("temperatures", lambda: check_temperatures(checks, sh)),
                    ("equilibrium", lambda: check_equilibrium(checks, sh, cli)),
                    ("fuel", lambda: check_fuel(checks, sh, cli)),
                    ("optional arguments", lambda: check_optional_arguments(checks, sh)),
                    ("ranges", lambda: check_ranges(checks, sh)),
                    ("unicode", lambda: check_unicode(checks, sh, svc)),
                    ("errors", lambda: check_errors(checks, sh, svc)),
                    ("species table", lambda: check_table(checks, sh)),
                    ("RXNWHY and tables", lambda: check_why_and_tables(checks, sh)),
                    ("steam", lambda: check_steam(checks, sh)),
                    ("alive", lambda: check_alive(checks, off, sh))]
        for name, run in sections:
            t0 = time.monotonic()
            try:
                run()
            except Timeout:
                raise
            except Exception as e:
                checks.ok("section %s ran" % name, False,
                          "%s: %s\n%s" % (type(e).__name__, e, traceback.format_exc()))
            print("----  %s: %.1f s" % (name, time.monotonic() - t0), flush=True)
        doc.close(True)
        check_save_reload(checks, off, workdir)
        off.stop()
        off = None
    except Timeout as e:
        checks.ok("finished in time", False, str(e))
    except Exception as e:
        checks.ok("test ran to the end", False,
                  "%s: %s\n%s" % (type(e).__name__, e, traceback.format_exc()))
    finally:
        signal.alarm(0)
        if off is not None:
            off.kill()
        if not args.keep:
            shutil.rmtree(workdir, ignore_errors=True)
    print("%d checks passed, %d failed, %d skipped in %.1f s" %
          (checks.passed, len(checks.failed), len(checks.skipped), time.monotonic() - t_start))
    for s in checks.skipped:
        print("  skipped: " + s)
    return 0 if not checks.failed else 1


if __name__ == "__main__":
    sys.exit(main())
