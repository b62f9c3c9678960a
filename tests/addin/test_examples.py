#!/usr/bin/python3
"""The example workbooks (examples/*.fods) in a real headless LibreOffice with the add-in.

Installs the built rxnheat.oxt into a private profile, opens each workbook, recalculates it
(calculateAll) and checks its key numbers against values computed outside the office:

- heat-load costing sheet: every RXNDH / RXNKIND / RXNLOAD cell against the `rxnheat` CLI
  (same engine, other code path), every RXNLOAD cell against plain arithmetic
  ΔrH° × n(key)/|ν(key)| with molar masses from IUPAC atomic weights (python3-periodictable)
  and normal volumes from the ideal-gas law; the heat of 1 kg of HP steam (STEAMLATENT of the
  header pressure) against `rxnheat steam latent` and python3-iapws; utility costs and totals
  against the arithmetic of the sheet's own input cells; inputs changed -> results follow;
- operator template: sheet protected, input cells unlocked and marked, formula cells locked,
  status "ok" for good inputs and RXNCHECK's words (the CLI's `check` text) for bad ones;
- design sheet: the plant's operating points in °C, the table one array formula of the
  reactions against the temperatures as text with the unit C, every cell against `rxnheat batch`
  and `rxnheat dh` (in K), the phases written and the note on them, the chart (XY scatter, one
  series per reaction over the temperature row, °C axis), an edited temperature followed, an
  out-of-range temperature giving an error in its column only;
- Hess's-law worksheet: each target's RXNHESS and RXNHESSPLAN against `rxnheat hess` and
  `rxnheat hess-plan` on the sheet's own steps, the plans against the algebra done by hand,
  the step values against CODATA Key Values, RXNDH beside them against `rxnheat dh`, the two
  within 0.05 kJ/mol (NASA Glenn takes these species from CODATA), an edited step followed and
  an inconsistent redundant step refused with words in the status cell;
- batch neutralisation template: protected with its inputs unlocked and marked, ΔrH° of
  H+ + OH- -> H2O(l) against the CLI and near -55.8 kJ/mol (common practice), the charges in
  kmol from IUPAC molar masses, the limiting charge, the heat and the adiabatic rise recomputed
  from the sheet's inputs, the warning cell flipping at the limit and when the charges double,
  bad inputs giving words and no rise check;
- equilibrium design sheet: every RXNEQX cell against `rxnheat eqx` and against a bisection
  here on K from `rxnheat logk`, conversion higher at the higher pressure and lower at higher
  temperature (common practice), the heat released against -ΔrH° × converted N2, the chart
  (XY scatter, one series per pressure over the temperature column), an edited pressure
  followed and 0 bar giving Err:502;
- furnace sheet: the atom columns against python3-periodictable, HHV and LHV against `rxnheat hv`
  and the sum of the parts (per-species `hv` in kJ/mol, ideal-gas Sm3, IUPAC molar masses), the
  combustion reaction and extra feed rebuilt here, the flame temperature against `rxnheat tad` and
  the energy balance by `rxnheat streamh`, fuel, air and cost by arithmetic, edits followed;
- reactor duty sheet: RXNDUTY against `rxnheat duty` and H(outlet) - H(feed) by `rxnheat streamh`
  (the outlet by stoichiometry here), the sensible part by Hess's law, steam and cooling water
  against `rxnheat steam` and python3-iapws (IAPWS-IF97), edits and errors followed;
- all of them: the stored numbers are the ones the engine computes now (else: run
  scripts/make-examples), the add-in calls are stored the way LibreOffice stores them, the
  invented plant and the cautions are on the sheet.

Run by CTest. Time-bound (--timeout); the office is killed on any failure. Exit status 0 when
every check passed.
"""
import argparse
import math
import os
import re
import shutil
import signal
import sys
import tempfile
import time
import traceback
import xml.etree.ElementTree as ET

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "scripts"))
import office as officelib  # noqa: E402  (scripts/office.py; needs the system python3 with python3-uno)
from common import Checks, EngineCli, Timeout, iupac_molar_mass  # noqa: E402

TOP = os.path.dirname(os.path.dirname(os.path.dirname(os.path.abspath(__file__))))
COSTING = "heat-load-costing.fods"
OPERATOR = "operator-template.fods"
DESIGN = "design-dh-vs-temperature.fods"
HESS = "hess-law-worksheet.fods"
NEUTRALISATION = "batch-neutralisation.fods"
EQUILIBRIUM = "design-equilibrium.fods"
FURNACE = "furnace-fuel-gas.fods"
DUTY = "reactor-duty-steam.fods"

# Molar gas constant, CODATA 2018 (exact in the 2019 SI): 8.31446261815324 J/(mol K).
R = 8.31446261815324
# Normal cubic metre: 0 °C and 101.325 kPa (engine/DATA.md, Units); ideal gas, n = pV/(RT).
MOL_PER_NM3 = 101325.0 / (R * 273.15)
# Common names used as key species in the workbooks -> formula (from memory: ethanol C2H5OH).
FORMULA_OF = {"ethanol": "C2H5OH"}
ERR_ILLEGAL_ARGUMENT = 502  # Calc's Err:502


def key_coefficient(reaction, key):
    """|ν| of species `key` in a reaction written as `a A(p) + b B(p) -> ...`."""
    sides = re.split(r"\s*(?:->|=>|<=>|<->|=|\u2192|\u27f6|\u21cc)\s*", reaction)
    found = []
    for side in sides:
        for term in side.split(" + "):
            m = re.match(r"^\s*(\d+(?:\.\d+)?(?:/\d+)?)?\s*(.+?)(\((?:g|l|s|aq|cr)\))?\s*$",
                         term)
            if m and m.group(2) == key:
                num = m.group(1) or "1"
                if "/" in num:
                    a, b = num.split("/")
                    found.append(float(a) / float(b))
                else:
                    found.append(float(num))
    if len(found) != 1:
        raise ValueError("key %r appears %d times in %r" % (key, len(found), reaction))
    return found[0]


def mol_per_s(quantity, unit, key):
    """Flow of the key species in mol/s, from the sheet's throughput and unit."""
    amount, per = unit.split("/")
    seconds = {"s": 1.0, "min": 60.0, "h": 3600.0, "d": 86400.0}[per]
    if amount == "Nm3":
        mol = quantity * MOL_PER_NM3
    elif amount in ("kg", "g", "t"):
        grams = quantity * {"g": 1.0, "kg": 1e3, "t": 1e6}[amount]
        mol = grams / iupac_molar_mass(FORMULA_OF.get(key, key))
    elif amount in ("mol", "kmol"):
        mol = quantity * {"mol": 1.0, "kmol": 1e3}[amount]
    else:
        raise ValueError("no arithmetic for unit %r" % unit)
    return mol / seconds


def rng(doc, name):
    """The cell range of a named range of the workbook."""
    content = doc.NamedRanges.getByName(name).getContent()   # e.g. $'Heat loads'.$C$6
    sheet_name, ref = content.rsplit(".", 1)
    sheet_name = sheet_name.lstrip("$").strip("'")
    return doc.Sheets.getByName(sheet_name).getCellRangeByName(ref.replace("$", ""))


def cell_number(cell):
    if cell.getError() != 0:
        return None
    return float(cell.getValue())


def sheet_text(sheet):
    cur = sheet.createCursor()
    cur.gotoEndOfUsedArea(False)
    end = cur.RangeAddress
    data = sheet.getCellRangeByPosition(0, 0, end.EndColumn, end.EndRow).getDataArray()
    return "\n".join(str(v) for row in data for v in row if v != "")


def stored_formulas(path):
    """Every table:formula attribute of the flat ODF file (outside the chart)."""
    ns = "urn:oasis:names:tc:opendocument:xmlns:table:1.0"
    tree = ET.parse(path)
    return [el.get("{%s}formula" % ns) for el in tree.iter()
            if el.get("{%s}formula" % ns) is not None]


def _rows(element, t):
    """The table's own rows, in order (not the rows of a table inside a cell, e.g. a chart's)."""
    for child in element:
        if child.tag == "{%s}table-row" % t:
            yield child
        elif child.tag in ("{%s}table-header-rows" % t, "{%s}table-rows" % t,
                           "{%s}table-row-group" % t):
            yield from _rows(child, t)


def stored_cells(path, sheet_name):
    """What the file itself holds for each cell of one sheet: {(col, row): (type, value,
    text)}, read from the flat ODF XML (repeated rows and columns expanded) -- the numbers a
    user sees who opens the file without the add-in."""
    t = "urn:oasis:names:tc:opendocument:xmlns:table:1.0"
    o = "urn:oasis:names:tc:opendocument:xmlns:office:1.0"
    tx = "urn:oasis:names:tc:opendocument:xmlns:text:1.0"
    tree = ET.parse(path)
    out = {}
    for table in tree.iter("{%s}table" % t):
        if table.get("{%s}name" % t) != sheet_name:
            continue
        row = 0
        for tr in _rows(table, t):
            col = 0
            for cell in tr:
                if cell.tag not in ("{%s}table-cell" % t, "{%s}covered-table-cell" % t):
                    continue
                n = int(cell.get("{%s}number-columns-repeated" % t, "1"))
                kind = cell.get("{%s}value-type" % o)
                if kind is not None:
                    text = "\n".join("".join(p.itertext()) for p in cell.iter("{%s}p" % tx))
                    value = cell.get("{%s}value" % o)
                    for k in range(n):
                        out[(col + k, row)] = (kind, value, text)
                col += n
            row += int(tr.get("{%s}number-rows-repeated" % t, "1"))
    return out


CAUTION_WORDS = ("Hallistry Marsh Works", "invented plant", "screening estimate", "calorimetry",
                 "process hazard analysis", "licensed engineers", "complete conversion",
                 "standard-state")


def check_common(checks, name, path, doc, sheet, formula_cells, words=CAUTION_WORDS):
    """Stored file form, plant, cautions, and stored numbers equal to the recalculated ones."""
    formulas = stored_formulas(path)
    ours = [f for f in formulas if re.search(r"RXN|SPECIES|MOLARMASS", f)]
    checks.ok("%s: has rxnheat formulas" % name, len(ours) > 0)
    bad = [f for f in ours if not f.startswith("of:=") or re.search(
        r"(?<!FUNCTIONS\.)\b(RXNDH|RXNKIND|RXNLOAD|RXNCHECK|RXNSOURCE|RXNVERSION|RXNEQX|"
        r"MOLARMASS|RXNWHY|RXNDUTY|RXNTAD|FUELHV|STEAMLATENT|STEAMH|STEAMTSAT)\(", f)]
    checks.ok("%s: add-in calls stored as LibreOffice stores them (programmatic name)" % name,
              not bad, "; ".join(bad[:3]))
    text = sheet_text(sheet)
    for w in words:
        checks.ok("%s: the sheet says %r" % (name, w), w in text)
    doc.calculateAll()
    stored = stored_cells(path, sheet.Name)
    stale = []
    for c in formula_cells:
        a = c.CellAddress
        kind, value, text = stored.get((a.Column, a.Row), (None, None, None))
        if c.getError() != 0:
            good = False
        elif kind in ("float", "percentage"):   # a % format stores its number as a percentage
            good = abs(float(value) - c.getValue()) <= 1e-9 * max(1.0, abs(c.getValue()))
        else:
            # (an empty text result is stored with no value type at all)
            good = (kind == "string" and text == c.getString()) or (
                kind is None and c.getString() == "")
        if not good:
            stale.append("%s: stored %r, now %r" % (c.AbsoluteName, value if kind in (
                "float", "percentage") else text, c.getString()))
    checks.ok("%s: the numbers stored in the file are what the add-in computes now (else run "
              "scripts/make-examples)" % name, not stale and formula_cells,
              "; ".join(stale[:3]))


# ------------------------------------------------------------------------------------------
def check_costing(checks, office, path, cli):
    name = "costing"
    with office.opened(path) as doc:
        table = rng(doc, "LoadTable")
        sheet = table.getSpreadsheet()
        rows = table.Rows.Count
        checks.ok("costing: a table of at least 5 reactions", rows >= 5, str(rows))
        formula_cells = [table.getCellByPosition(c, r) for r in range(rows)
                         for c in (6, 7, 8, 10, 11)]
        formula_cells += [rng(doc, n) for n in ("HeatToSupply", "HeatToRemove", "TotalCost",
                                                "SteamHeat")]
        check_common(checks, name, path, doc, sheet, formula_cells)
        ps = doc.StyleFamilies.getByName("PageStyles").getByName(sheet.PageStyle)
        checks.ok("costing: printed landscape, one page wide", ps.IsLandscape and
                  ps.ScaleToPagesX == 1)
        checks.ok("costing: print area set", len(sheet.getPrintAreas()) == 1)

        # The heat of the HP steam: STEAMLATENT of the header pressure typed in the sheet,
        # against the CLI and python3-iapws (IAPWS-IF97), not a typed-in figure.
        header = rng(doc, "SteamPressure")
        steam_heat = rng(doc, "SteamHeat")
        checks.ok("costing: the steam header pressure is an input, its heat STEAMLATENT of it",
                  header.CellStyle == "rxnheat Input" and re.sub(r"\$", "", steam_heat.getFormula())
                  .upper().endswith("STEAMLATENT(C%d)" % (header.CellAddress.Row + 1)),
                  steam_heat.getFormula())
        if cli:
            checks.rel("costing: heat of 1 kg of steam = CLI steam latent %r" % header.getString(),
                       cell_number(steam_heat), cli.value("steam", "latent", header.getString()),
                       1e-12)
        w = iapws97()
        if w is None:
            checks.skip("costing: steam against python3-iapws", "python3-iapws not installed")
        else:
            p = iapws_mpa(header.getString())
            checks.rel("costing: heat of 1 kg of steam at %s = python3-iapws (IAPWS-IF97)"
                       % header.getString(), cell_number(steam_heat),
                       w(P=p, x=1).h - w(P=p, x=0).h, 1e-6)

        # The sheet's own inputs
        hours = cell_number(rng(doc, "OperatingHours"))
        per_mwh = {
            "fuel gas": cell_number(rng(doc, "FuelPrice")) * 3.6
            / cell_number(rng(doc, "HeaterEfficiency")),
            "HP steam": cell_number(rng(doc, "SteamPrice")) * 3600.0
            / cell_number(rng(doc, "SteamHeat")),
            "cooling water": cell_number(rng(doc, "CoolingWaterPrice")) * 3600.0
            / (cell_number(rng(doc, "CoolingWaterCp"))
               * cell_number(rng(doc, "CoolingWaterRise"))),
        }
        utab = rng(doc, "UtilityCosts")
        for r in range(utab.Rows.Count):
            u = utab.getCellByPosition(0, r).getString()
            checks.rel("costing: EUR/MWh of %s from the price inputs" % u,
                       cell_number(utab.getCellByPosition(2, r)), per_mwh.get(u), 1e-12)

        total = 0.0
        supply = 0.0
        remove = 0.0
        for r in range(rows):
            cell = lambda c: table.getCellByPosition(c, r)  # noqa: E731
            reaction = cell(1).getString()
            key = cell(2).getString()
            qty = cell_number(cell(3))
            unit = cell(4).getString()
            t_k = cell_number(cell(5)) + 273.15
            dh = cell_number(cell(6))
            kind = cell(7).getString()
            load = cell_number(cell(8))
            utility = cell(9).getString()
            label = "costing row %d (%s)" % (r + 1, reaction)
            if not checks.ok(label + ": RXNDH and RXNLOAD computed", dh is not None
                             and load is not None, "errors %d %d" % (cell(6).getError(),
                                                                     cell(8).getError())):
                continue
            # Plain arithmetic, independent of the engine's unit code: ΔrH° × n(key)/|ν(key)|.
            # Molar masses: IUPAC standard atomic weights (python3-periodictable); the engine's
            # own table (data/elements.csv, CIAAW) differs by a few parts in 1e5 at most.
            want = dh * mol_per_s(qty, unit, key) / key_coefficient(reaction, key)
            checks.rel(label + ": load = dH x n/nu", load, want, 2e-4 if "Nm3" not in unit
                       else 1e-9)
            checks.ok(label + ": kind matches the sign of dH",
                      kind == ("endothermic" if dh > 0.1 else "exothermic" if dh < -0.1
                               else "thermoneutral"), kind)
            if cli:
                j = cli.json("dh", reaction, "-T", repr(t_k))
                checks.rel(label + ": RXNDH = CLI dh", dh, float(j["value"]), 1e-12)
                checks.ok(label + ": RXNKIND = CLI kind", kind == j["kind"],
                          kind + " / " + j["kind"])
                j = cli.json("load", reaction, repr(qty), unit, key, "-u", "kW", "-T", repr(t_k))
                checks.rel(label + ": RXNLOAD = CLI load", load, float(j["value"]), 1e-12)
            cost = abs(load) / 1000.0 * hours * per_mwh[utility]
            checks.rel(label + ": cost/yr = |load| x hours x EUR/MWh", cell_number(cell(11)),
                       cost, 1e-12)
            total += cost
            supply += max(load, 0.0)
            remove += max(-load, 0.0)
        checks.rel("costing: total cost/yr = sum of the rows", cell_number(rng(doc, "TotalCost")),
                   total, 1e-12)
        checks.rel("costing: heat to supply", cell_number(rng(doc, "HeatToSupply")), supply, 1e-12)
        checks.rel("costing: heat to remove", cell_number(rng(doc, "HeatToRemove")), remove, 1e-12)
        checks.ok("costing: both endothermic and exothermic loads", supply > 0 and remove > 0)

        # Inputs drive the results: halve the hours, double the first throughput.
        rng(doc, "OperatingHours").setValue(hours / 2)
        load0 = cell_number(table.getCellByPosition(8, 0))
        table.getCellByPosition(3, 0).setValue(2 * cell_number(table.getCellByPosition(3, 0)))
        doc.calculateAll()
        checks.rel("costing: doubled throughput doubles the load",
                   cell_number(table.getCellByPosition(8, 0)), 2 * load0, 1e-12)
        u0 = table.getCellByPosition(9, 0).getString()
        new_total = total / 2 + abs(load0) / 1000.0 * (hours / 2) * per_mwh[u0]
        checks.rel("costing: total follows the hours input", cell_number(rng(doc, "TotalCost")),
                   new_total, 1e-12)
        # A bad reaction gives an error in its cells, never a number.
        table.getCellByPosition(1, 0).setString("CH4(g) + H2O(g) -> CO(g) + H2(g)")
        doc.calculateAll()
        checks.ok("costing: unbalanced reaction -> Err:502 in RXNDH and RXNLOAD",
                  table.getCellByPosition(6, 0).getError() == ERR_ILLEGAL_ARGUMENT and
                  table.getCellByPosition(8, 0).getError() == ERR_ILLEGAL_ARGUMENT)
        checks.ok("costing: ... and the total is an error too, not a smaller number",
                  rng(doc, "TotalCost").getError() != 0)


# ------------------------------------------------------------------------------------------
def check_operator(checks, office, path, cli):
    name = "operator"
    with office.opened(path) as doc:
        inputs = ["Reaction", "KeySpecies", "Feed", "FeedUnit", "InletTemperature"]
        results = ["Status", "ReactionEnthalpy", "Kind", "HeatLoad", "HeatReleased", "Sources",
                   "Version"]
        sheet = rng(doc, "Status").getSpreadsheet()
        check_common(checks, name, path, doc, sheet, [rng(doc, n) for n in results])
        checks.ok("operator: the sheet is protected", sheet.isProtected())
        for n in inputs:
            c = rng(doc, n)
            checks.ok("operator: input %s unlocked" % n, not c.CellProtection.IsLocked)
            checks.ok("operator: input %s marked with the input style" % n,
                      c.CellStyle == "rxnheat Input", c.CellStyle)
        for n in results:
            c = rng(doc, n)
            checks.ok("operator: result %s is a locked formula" % n,
                      c.CellProtection.IsLocked and c.getFormula().startswith("="))
        locked_inputs = [n for n in inputs if rng(doc, n).CellProtection.IsLocked]
        checks.ok("operator: no input is locked", not locked_inputs, str(locked_inputs))
        style = doc.StyleFamilies.getByName("CellStyles").getByName("rxnheat Input")
        checks.ok("operator: the input style is unlocked and coloured",
                  not style.CellProtection.IsLocked and style.CellBackColor not in (-1, 0xFFFFFF))
        checks.ok("operator: a legend explains the input colour",
                  "type into" in sheet_text(sheet))

        def status():
            doc.calculateAll()
            return rng(doc, "Status").getString()

        reaction = rng(doc, "Reaction").getString()
        t_k = cell_number(rng(doc, "InletTemperature")) + 273.15
        checks.ok("operator: status ok for the template's inputs", status() == "ok", status())
        dh = cell_number(rng(doc, "ReactionEnthalpy"))
        load = cell_number(rng(doc, "HeatLoad"))
        key = rng(doc, "KeySpecies").getString()
        feed = cell_number(rng(doc, "Feed"))
        unit = rng(doc, "FeedUnit").getString()
        if cli:
            checks.rel("operator: dH = CLI dh", dh, float(cli.json("dh", reaction, "-T", repr(t_k))
                                                          ["value"]), 1e-12)
            checks.rel("operator: load = CLI load", load, float(cli.json(
                "load", reaction, repr(feed), unit, key, "-u", "kW", "-T", repr(t_k))["value"]),
                1e-12)
        checks.rel("operator: load = dH x n/nu", load,
                   dh * mol_per_s(feed, unit, key) / key_coefficient(reaction, key), 1e-9)
        checks.rel("operator: heat released = -load for an exothermic bed",
                   cell_number(rng(doc, "HeatReleased")), max(0.0, -load), 1e-12)
        checks.ok("operator: data sources named", "NASA/TP-2002-211556" in
                  rng(doc, "Sources").getString())

        # Bad inputs: the status says what is wrong, in words; the numbers are errors.
        bad_reactions = ["CO(g) + H2O(g) -> CO2(g)",          # unbalanced
                         "CO(g) + H2O(g) -> CO2(g) + Xx(g)",   # not an element
                         "CO(g) + H2O(g) ->"]                  # no products
        for bad in bad_reactions:
            rng(doc, "Reaction").setString(bad)
            s = status()
            if cli:
                words = cli.json("check", bad, "-T", repr(t_k))
                checks.ok("operator: status for %r is RXNCHECK's words" % bad,
                          s == words.get("check") and s != "ok", "%r vs %r" % (s, words))
            else:
                checks.ok("operator: status for %r is words" % bad, s != "ok" and len(s) > 15, s)
            checks.ok("operator: %r -> Err:502 in dH and load" % bad,
                      rng(doc, "ReactionEnthalpy").getError() == ERR_ILLEGAL_ARGUMENT and
                      rng(doc, "HeatLoad").getError() == ERR_ILLEGAL_ARGUMENT)
        rng(doc, "Reaction").setString(reaction)
        rng(doc, "InletTemperature").setValue(9000)   # 9273 K: beyond the data (6000 K)
        s = status()
        checks.ok("operator: temperature beyond the data -> words naming the range",
                  "outside" in s and "K" in s, s)
        rng(doc, "InletTemperature").setValue(t_k - 273.15)
        rng(doc, "KeySpecies").setString("CH4")
        s = status()
        checks.ok("operator: key species not in the reaction -> words", s.startswith(
            "the heat load cannot be computed"), s)
        checks.ok("operator: ... and the load is Err:502",
                  rng(doc, "HeatLoad").getError() == ERR_ILLEGAL_ARGUMENT)
        rng(doc, "KeySpecies").setString(key)
        rng(doc, "Feed").setString("")
        s = status()
        checks.ok("operator: blank feed -> words", s.startswith("enter the feed"), s)
        rng(doc, "Feed").setValue(-5)
        checks.ok("operator: negative feed -> words",
                  status() == "the feed must be greater than zero")
        rng(doc, "Feed").setValue(feed)
        checks.ok("operator: good inputs again -> ok", status() == "ok", status())


# ------------------------------------------------------------------------------------------
# 0 °C = 273.15 K (definition of the Celsius scale, SI Brochure 9th ed.; GNU units: tempC(0)).
ZERO_CELSIUS_K = 273.15


def check_design(checks, office, path, cli):
    name = "design"
    with office.opened(path) as doc:
        table = rng(doc, "DesignTable")
        reactions_rng = rng(doc, "DesignReactions")
        temps_rng = rng(doc, "DesignTemperatures")
        points_rng = rng(doc, "DesignPoints")
        sheet = table.getSpreadsheet()
        n_r = table.Rows.Count
        n_t = table.Columns.Count
        cells = [table.getCellByPosition(c, r) for r in range(n_r) for c in range(n_t)]
        check_common(checks, name, path, doc, sheet, cells)
        temps = [cell_number(temps_rng.getCellByPosition(c, 0)) for c in range(n_t)]
        points = [points_rng.getCellByPosition(c, 0).getString() for c in range(n_t)]
        reactions = [reactions_rng.getCellByPosition(0, r).getString() for r in range(n_r)]
        checks.ok("design: two or three reactions", n_r in (2, 3), str(reactions))
        checks.ok("design: at least five operating points, one temperature each",
                  n_t >= 5 and temps_rng.Columns.Count == n_t and points_rng.Columns.Count == n_t)
        checks.ok("design: every operating point named after a unit of the plant",
                  all(re.search(r"\b[A-Z]-\d{3}\b", p) for p in points), str(points))
        checks.ok("design: the temperatures are numbers in rising order (the chart joins "
                  "neighbours)", None not in temps and temps == sorted(temps)
                  and len(set(temps)) == n_t, str(temps))
        checks.ok("design: the temperatures are °C operating points (200..1000 °C)",
                  None not in temps and all(200 <= t <= 1000 for t in temps), str(temps))
        checks.ok("design: the temperature inputs are yellow input cells",
                  all(temps_rng.getCellByPosition(c, 0).CellStyle == "rxnheat Input"
                      for c in range(n_t)))
        checks.ok("design: the heading says the temperatures are in °C",
                  "Temperature, \u00b0C" in sheet_text(sheet))
        # The table is one array formula: the column of reactions against the row of
        # temperatures, each made text with the unit C.
        # (the API gives it in braces with ',' between arguments: {=RXNDH(B8:B10,C7:I7&" C")})
        array = table.getArrayFormula().strip("{}").replace(",", ";")
        want_array = "=RXNDH(%s;%s&\" C\")" % (
            reactions_rng.AbsoluteName.split(".")[1].replace("$", ""),
            temps_rng.AbsoluteName.split(".")[1].replace("$", ""))
        checks.ok("design: the table is one array formula %s" % want_array,
                  array.replace(" ", "") == want_array.replace(" ", ""), array)
        checks.ok("design: the note on the sheet shows the array formula",
                  "{=RXNDH(" in sheet_text(sheet))
        # Phases chosen on purpose: every species of every reaction carries one.
        unphased = [term for rx in reactions
                    for term in re.split(r"\s*(?:->|\+)\s*", rx)
                    if not re.search(r"\((?:g|l|s|aq|cr)\)$", term)]
        checks.ok("design: every species is written with its phase", not unphased,
                  str(unphased))
        text = sheet_text(sheet)
        checks.ok("design: a note says which phases were used and why",
                  "Phases:" in text and "(g)" in text and "steam" in text
                  and "without a phase" in text)
        if cli:
            # The note's claim about water, from the engine: liquid at 90 °C, gas at 110 °C.
            below = cli.json("species", "H2O", "-T", "90 C")
            above = cli.json("species", "H2O", "-T", "110 C")
            checks.ok("design: the note holds: unphased H2O is liquid at 90 °C, gas at 110 °C "
                      "(CLI species)", below.get("species") == "H2O(l)"
                      and above.get("species") == "H2O(g)",
                      "%r / %r" % (below.get("species"), above.get("species")))

        if cli:
            # Every cell against `rxnheat batch` given the same temperature text ("370 C").
            csv = "".join('"%s","%s C"\n' % (rx, "%g" % t) for rx in reactions for t in temps)
            j = cli.json("batch", "-", stdin=csv)
            want = [float(x["value"]) if "value" in x else None for x in j["results"]]
            for i, c in enumerate(cells):
                checks.rel("design: %s at %g °C = CLI batch" % (reactions[i // n_t],
                                                                 temps[i % n_t]),
                           cell_number(c), want[i], 1e-12)
            # ... and against `rxnheat dh` at the same temperature in kelvin (another command,
            # and the add-in's °C text against plain arithmetic: T/K = t/°C + 273.15).
            for r, rx in enumerate(reactions):
                for c in (0, n_t - 1):
                    t_k = temps[c] + ZERO_CELSIUS_K
                    j = cli.json("dh", rx, "-T", repr(t_k))
                    checks.rel("design: %s at %g °C = CLI dh at %r K" % (rx, temps[c], t_k),
                               cell_number(table.getCellByPosition(c, r)), float(j["value"]),
                               1e-12)
            j = cli.json("dh", reactions[0], "-T", "%g C" % temps[0])
            checks.close("design: CLI reads \"%g C\" as %g + 273.15 K" % (temps[0], temps[0]),
                         float(j["temperature_K"]), temps[0] + ZERO_CELSIUS_K, 1e-9,
                         "(SI: 0 °C = 273.15 K)")

        # The chart: one, XY scatter, a series per reaction row over the temperature row.
        charts = sheet.getCharts()
        checks.ok("design: one chart on the sheet", charts.Count == 1, str(charts.Count))
        if charts.Count:
            chart = charts.getByIndex(0).getEmbeddedObject()
            series = []
            kinds = []
            for cs in chart.getFirstDiagram().getCoordinateSystems():
                for ct in cs.getChartTypes():
                    kinds.append(ct.getChartType())
                    series.extend(ct.getDataSeries())
            checks.ok("design: the chart is an XY scatter", kinds ==
                      ["com.sun.star.chart2.ScatterChartType"], str(kinds))
            checks.ok("design: %d series, one per reaction" % n_r, len(series) == n_r,
                      str(len(series)))
            t_row = temps_rng.AbsoluteName
            for i, s in enumerate(series):
                roles = {}
                label = None
                for ls in s.getDataSequences():
                    v = ls.getValues()
                    roles[v.getPropertyValue("Role")] = v.getSourceRangeRepresentation()
                    if ls.getLabel() is not None and v.getPropertyValue("Role") == "values-y":
                        label = ls.getLabel().getData()[0]
                y_row = table.getCellRangeByPosition(0, i, n_t - 1, i).AbsoluteName
                checks.ok("design: series %d x = the temperature row (°C)" % (i + 1),
                          roles.get("values-x") == t_row, "%r vs %r" % (roles, t_row))
                checks.ok("design: series %d y = its reaction's row" % (i + 1),
                          roles.get("values-y") == y_row, "%r vs %r" % (roles, y_row))
                checks.ok("design: series %d named by its reaction as written" % (i + 1),
                          label == reactions[i], "%r vs %r" % (label, reactions[i]))
            diagram = chart.getDiagram()
            checks.ok("design: chart has a title and axis titles",
                      chart.HasMainTitle and diagram.HasXAxisTitle and diagram.HasYAxisTitle)
            checks.ok("design: the temperature axis is in °C",
                      diagram.getXAxisTitle().String == "Temperature, \u00b0C",
                      diagram.getXAxisTitle().String)
            checks.ok("design: the ΔrH° axis is in kJ/mol",
                      "kJ/mol" in diagram.getYAxisTitle().String)

        # An edited temperature: its column follows, in °C.
        t_new = temps[0] + 10.0
        temps_rng.getCellByPosition(0, 0).setValue(t_new)
        doc.calculateAll()
        if cli:
            for r, rx in enumerate(reactions):
                checks.rel("design: edited to %g °C -> %s = CLI dh -T \"%g C\""
                           % (t_new, rx, t_new),
                           cell_number(table.getCellByPosition(0, r)),
                           float(cli.json("dh", rx, "-T", "%g C" % t_new)["value"]), 1e-12)
        # A temperature beyond the data: errors in that column, never an extrapolated number;
        # the other columns still computed.
        temps_rng.getCellByPosition(n_t - 1, 0).setValue(6000)   # 6273.15 K > 6000 K
        doc.calculateAll()
        errs = [table.getCellByPosition(n_t - 1, r).getError() for r in range(n_r)]
        checks.ok("design: 6000 °C -> Err:502 in every reaction's cell of that column",
                  errs == [ERR_ILLEGAL_ARGUMENT] * n_r, str(errs))
        others = [cell_number(table.getCellByPosition(c, r)) for r in range(n_r)
                  for c in range(n_t - 1)]
        checks.ok("design: ... and the other columns are still numbers", None not in others)


# ------------------------------------------------------------------------------------------
def check_hess(checks, office, path, cli):
    name = "hess"
    with office.opened(path) as doc:
        sheet = doc.Sheets.getByName("Hess")
        steps = rng(doc, "HessSteps")
        values = rng(doc, "HessStepValues")
        targets = rng(doc, "HessTargets")
        results = rng(doc, "HessResults")
        doc.calculateAll()
        step_rows = [(steps.getCellByPosition(0, i).getString(),
                      values.getCellByPosition(0, i)) for i in range(steps.Rows.Count)]
        given = [(r, v.getValue()) for r, v in step_rows if r.strip()]
        # The step values: CODATA Key Values (Cox et al. 1989), ΔfH° at 298.15 K of CO2(g)
        # −393.51, CO(g) −110.53, H2O(g) −241.826, H2O(l) −285.830 kJ/mol, combined by hand.
        codata = {"C(s) + O2(g) -> CO2(g)": -393.51,
                  "CO(g) + 1/2 O2(g) -> CO2(g)": -393.51 + 110.53,
                  "H2(g) + 1/2 O2(g) -> H2O(g)": -241.826,
                  "H2O(l) -> H2O(g)": -241.826 + 285.830}
        checks.ok("hess: the four steps carry the CODATA values",
                  len(given) == 4 and all(abs(codata.get(r, 1e9) - v) < 1e-9 for r, v in given),
                  repr(given))
        # Plans by hand (Hess's law, common practice) and the values they give.
        by_hand = {
            "C(s) + 1/2 O2(g) -> CO(g)": ("1×(1) − 1×(2)", -110.53),
            "CO(g) + H2O(g) -> CO2(g) + H2(g)": ("1×(2) − 1×(3)", -282.98 + 241.826),
            "C(s) + H2O(g) -> CO(g) + H2(g)": ("1×(1) − 1×(2) − 1×(3)", -393.51 + 282.98 + 241.826),
            "CO(g) + H2O(l) -> CO2(g) + H2(g)": ("1×(2) − 1×(3) + 1×(4)", -282.98 + 241.826 + 44.004),
        }
        formula_cells = []
        for i in range(targets.Rows.Count):
            target = targets.getCellByPosition(0, i).getString()
            dh, plan, data, diff, status = (results.getCellByPosition(c, i) for c in range(5))
            formula_cells += [dh, plan, data, diff, status]
            want_plan, want = by_hand[target]
            checks.ok("hess %s: RXNHESSPLAN by hand" % target, plan.getString() == want_plan,
                      plan.getString())
            checks.ok("hess %s: RXNHESS by hand" % target,
                      cell_number(dh) is not None and abs(dh.getValue() - want) < 1e-9,
                      dh.getString())
            checks.ok("hess %s: status ok" % target, status.getString() == "ok", status.getString())
            if cli:
                argv = [target]
                for r, v in given:
                    argv += ["--step", r, "--dh", repr(v)]
                checks.ok("hess %s: the CLI's hess" % target,
                          abs(cli.value("hess", *argv) - dh.getValue()) < 1e-9)
                plan_argv = [target] + [w for r, _ in given for w in ("--step", r)]
                checks.ok("hess %s: the CLI's hess-plan" % target,
                          cli.text("hess-plan", *plan_argv) == plan.getString())
                checks.ok("hess %s: RXNDH is the CLI's dh" % target,
                          abs(cli.value("dh", target) - data.getValue()) < 1e-9)
            # NASA Glenn's records of these species carry the CODATA values (NASA/TP-2002-211556
            # cites them), so the two routes agree closely.
            checks.ok("hess %s: steps and data within 0.05 kJ/mol" % target,
                      cell_number(diff) is not None and abs(diff.getValue()) < 0.05, diff.getString())
        check_common(checks, name, path, doc, sheet, formula_cells)

        # An edited step value is followed; a redundant step that disagrees is refused in words.
        co_step = values.getCellByPosition(0, 1)
        first_dh = results.getCellByPosition(0, 0)
        co_step.setValue(-283.0)
        doc.calculateAll()
        checks.ok("hess: an edited step value is followed",
                  cell_number(first_dh) is not None and abs(first_dh.getValue() - (-393.51 + 283.0)) < 1e-9,
                  first_dh.getString())
        co_step.setValue(-282.98)
        steps.getCellByPosition(0, 4).setString("2 CO(g) + O2(g) -> 2 CO2(g)")
        values.getCellByPosition(0, 4).setValue(-566.0)
        doc.calculateAll()
        first_status = results.getCellByPosition(4, 0)
        checks.ok("hess: inconsistent dependent steps give Err:502", first_dh.getError() == ERR_ILLEGAL_ARGUMENT,
                  first_dh.getString())
        checks.ok("hess: the status says why", "do not cancel" in first_status.getString(),
                  first_status.getString())


def check_neutralisation(checks, office, path, cli):
    name = "neutralisation"
    with office.opened(path) as doc:
        inputs = ["Reaction", "Acid", "AcidCharge", "AcidStrength", "AcidProtons", "Base",
                  "BaseCharge", "BaseStrength", "BaseHydroxides", "BatchMass", "BatchCp",
                  "StartTemperature", "RiseLimit"]
        results = ["Status", "RiseCheck", "NeutralisationEnthalpy", "Kind", "AcidKmol",
                   "BaseKmol", "Limiting", "Neutralised", "LeftOver", "HeatReleased",
                   "TemperatureRise", "EndTemperature", "Sources", "Version"]
        sheet = rng(doc, "Status").getSpreadsheet()
        check_common(checks, name, path, doc, sheet, [rng(doc, n) for n in results])
        checks.ok("neutralisation: the sheet is protected", sheet.isProtected())
        for n in inputs:
            c = rng(doc, n)
            checks.ok("neutralisation: input %s unlocked and marked" % n,
                      not c.CellProtection.IsLocked and c.CellStyle == "rxnheat Input",
                      c.CellStyle)
        for n in results:
            c = rng(doc, n)
            checks.ok("neutralisation: result %s is a locked formula" % n,
                      c.CellProtection.IsLocked and c.getFormula().startswith("="))
        text = sheet_text(sheet)
        checks.ok("neutralisation: a legend explains the input colour", "type into" in text)
        checks.ok("neutralisation: the sheet says the heat of dilution is left out",
                  "heat of diluting" in text)

        def calc(n):
            doc.calculateAll()
            return rng(doc, n).getString()

        def num(n):
            return cell_number(rng(doc, n))

        def expected():
            """The rise from the sheet's own inputs: kmol = kg x w / M (IUPAC atomic weights,
            python3-periodictable), heat = -dH x min(kmol) x 1000 (the CLI's dh of the
            sheet's reaction at its start temperature), rise = heat / (m cp)."""
            t_k = num("StartTemperature") + ZERO_CELSIUS_K
            dh = float(cli.json("dh", rng(doc, "Reaction").getString(), "-T", repr(t_k))
                       ["value"]) if cli else num("NeutralisationEnthalpy")
            acid = (num("AcidCharge") * num("AcidStrength") / 100.0
                    / iupac_molar_mass(rng(doc, "Acid").getString()) * num("AcidProtons"))
            base = (num("BaseCharge") * num("BaseStrength") / 100.0
                    / iupac_molar_mass(rng(doc, "Base").getString()) * num("BaseHydroxides"))
            heat = -dh * min(acid, base) * 1000.0
            return dh, acid, base, heat, heat / (num("BatchMass") * num("BatchCp"))

        checks.ok("neutralisation: status ok for the template's inputs",
                  calc("Status") == "ok", calc("Status"))
        reaction = rng(doc, "Reaction").getString()
        checks.ok("neutralisation: the reaction is the aqueous H+ + OH- one",
                  "H+" in reaction and "OH-" in reaction, reaction)
        dh, acid, base, heat, rise = expected()
        # Strong acid with strong base near -55.8 kJ/mol of water (common practice).
        checks.close("neutralisation: dH of neutralisation near -55.8 kJ/mol (common practice)",
                     num("NeutralisationEnthalpy"), -55.8, 0.5)
        checks.rel("neutralisation: dH = CLI dh at the start temperature",
                   num("NeutralisationEnthalpy"), dh, 1e-12)
        checks.rel("neutralisation: H+ kmol = kg x strength / M(HCl) (IUPAC)",
                   num("AcidKmol"), acid, 2e-4)
        checks.rel("neutralisation: OH- kmol = kg x strength / M(NaOH) (IUPAC)",
                   num("BaseKmol"), base, 2e-4)
        checks.rel("neutralisation: neutralised = the smaller charge", num("Neutralised"),
                   min(acid, base), 2e-4)
        checks.ok("neutralisation: the limiting charge named", calc("Limiting").startswith(
            "acid" if acid < base else "caustic"), calc("Limiting"))
        checks.rel("neutralisation: heat = -dH x limiting kmol", num("HeatReleased"), heat, 2e-4)
        if cli:
            t_k = num("StartTemperature") + ZERO_CELSIUS_K
            checks.rel("neutralisation: heat = -(CLI load)", num("HeatReleased"), -float(
                cli.json("load", reaction, repr(num("Neutralised")), "kmol", "H+", "-u", "kJ",
                         "-T", repr(t_k))["value"]), 1e-12)
        checks.rel("neutralisation: rise = heat / (mass x cp), from the inputs",
                   num("TemperatureRise"), rise, 2e-4)
        checks.rel("neutralisation: end temperature = start + rise", num("EndTemperature"),
                   num("StartTemperature") + num("TemperatureRise"), 1e-12)
        print("      neutralisation: dH %.3f kJ/mol, H+ %.3f kmol, OH- %.3f kmol, heat %.0f kJ, "
              "rise %.2f K (limit %.1f K)" % (num("NeutralisationEnthalpy"), num("AcidKmol"),
                                               num("BaseKmol"), num("HeatReleased"),
                                               num("TemperatureRise"), num("RiseLimit")))
        limit = num("RiseLimit")
        checks.ok("neutralisation: the template's batch is within its limit",
                  rise < limit and calc("RiseCheck").startswith("within"), calc("RiseCheck"))

        # The warning flips at the limit.
        rng(doc, "RiseLimit").setValue(rise - 0.5)
        checks.ok("neutralisation: limit below the rise -> WARNING",
                  calc("RiseCheck").startswith("WARNING"), calc("RiseCheck"))
        rng(doc, "RiseLimit").setValue(rise + 0.5)
        checks.ok("neutralisation: limit above the rise -> within",
                  calc("RiseCheck").startswith("within"), calc("RiseCheck"))
        rng(doc, "RiseLimit").setValue(limit)
        # Twice both charges: twice the heat, in the same batch mass -> past the limit.
        a0, b0 = num("AcidCharge"), num("BaseCharge")
        rng(doc, "AcidCharge").setValue(2 * a0)
        rng(doc, "BaseCharge").setValue(2 * b0)
        doc.calculateAll()
        dh2, acid2, base2, heat2, rise2 = expected()
        checks.rel("neutralisation: doubled charges -> rise from the inputs",
                   num("TemperatureRise"), rise2, 2e-4)
        checks.ok("neutralisation: doubled charges pass the limit -> WARNING",
                  rise2 > limit and calc("Status") == "ok"
                  and calc("RiseCheck").startswith("WARNING"), calc("RiseCheck"))
        rng(doc, "AcidCharge").setValue(a0)
        rng(doc, "BaseCharge").setValue(b0)
        # Sulfuric acid: two H+ per molecule.
        rng(doc, "Acid").setString("H2SO4")
        rng(doc, "AcidProtons").setValue(2)
        doc.calculateAll()
        dh3, acid3, base3, heat3, rise3 = expected()
        checks.rel("neutralisation: H2SO4, 2 H+ -> kmol from M(H2SO4) (IUPAC)",
                   num("AcidKmol"), acid3, 2e-4)
        checks.rel("neutralisation: H2SO4 -> rise from the inputs", num("TemperatureRise"),
                   rise3, 2e-4)
        rng(doc, "Acid").setString("HCl")
        rng(doc, "AcidProtons").setValue(1)

        # Bad inputs: words in the status, no check of the rise.
        t_k = num("StartTemperature") + ZERO_CELSIUS_K
        bad = "H+ + OH- -> H2(g)"
        rng(doc, "Reaction").setString(bad)
        s = calc("Status")
        if cli:
            checks.ok("neutralisation: unbalanced reaction -> RXNCHECK's words (CLI check)",
                      s != "ok" and s == cli.json("check", bad, "-T", repr(t_k)).get("check"), s)
        checks.ok("neutralisation: ... and no rise check", calc("RiseCheck").startswith(
            "no check"), calc("RiseCheck"))
        rng(doc, "Reaction").setString(reaction)
        rng(doc, "StartTemperature").setValue(150)
        s = calc("Status")
        checks.ok("neutralisation: 150 °C, past the aqueous data -> words naming the range",
                  "373.15" in s, s)
        rng(doc, "StartTemperature").setValue(t_k - ZERO_CELSIUS_K)
        for cell, value, start in (("AcidStrength", 120, "a strength is"),
                                   ("BaseCharge", -10, "a charge cannot"),
                                   ("BatchMass", 1000, "the batch mass after dosing"),
                                   ("AcidProtons", 1.5, "the H+ and OH- counts"),
                                   ("Acid", "Hq", "the charges cannot be converted"),
                                   ("BatchCp", "", "enter every")):
            old = rng(doc, cell).getString() if cell == "Acid" else num(cell)
            if isinstance(value, str):
                rng(doc, cell).setString(value)
            else:
                rng(doc, cell).setValue(value)
            s = calc("Status")
            checks.ok("neutralisation: %s = %r -> status in words" % (cell, value),
                      s.startswith(start), s)
            checks.ok("neutralisation: %s = %r -> no rise check" % (cell, value),
                      calc("RiseCheck").startswith("no check"), calc("RiseCheck"))
            if isinstance(old, str):
                rng(doc, cell).setString(old)
            else:
                rng(doc, cell).setValue(old)
        checks.ok("neutralisation: good inputs again -> ok", calc("Status") == "ok",
                  calc("Status"))


# ------------------------------------------------------------------------------------------
def ammonia_conversion(log10_k, feed, pressure_bar):
    """Equilibrium conversion of N2 in N2 + 3 H2 -> 2 NH3 from K, solved here by bisection on
    the extent: K = y(NH3)^2 / (y(N2) y(H2)^3) x (1 bar / P)^2, ideal gas, the other feed
    species inert. Independent of the engine's solver; K is the engine's (CLI logk)."""
    a, b = feed["N2"], feed["H2"]
    total = sum(feed.values())
    ln_k = log10_k * math.log(10.0)

    def f(x):
        return (2 * math.log(2 * x) + 2 * math.log(total - 2 * x) - math.log(a - x)
                - 3 * math.log(b - 3 * x) - 2 * math.log(pressure_bar) - ln_k)

    lo, hi = 0.0, min(a, b / 3.0)
    for _ in range(200):
        mid = 0.5 * (lo + hi)
        if mid in (lo, hi):
            break
        if f(mid) > 0:
            hi = mid
        else:
            lo = mid
    return 0.5 * (lo + hi) / a


def check_equilibrium(checks, office, path, cli):
    name = "equilibrium"
    with office.opened(path) as doc:
        temps_rng = rng(doc, "EqTemperatures")
        conv = rng(doc, "EqConversion")
        heat = rng(doc, "EqHeat")
        sheet = conv.getSpreadsheet()
        n_t = temps_rng.Rows.Count
        cells = ([conv.getCellByPosition(c, r) for r in range(n_t) for c in range(2)]
                 + [heat.getCellByPosition(c, r) for r in range(n_t) for c in range(2)]
                 + [rng(doc, "KeyFeedRate")])
        check_common(checks, name, path, doc, sheet, cells)
        reaction = rng(doc, "Reaction").getString()
        key = rng(doc, "KeySpecies").getString()
        feed_rng = rng(doc, "Feed")
        feed = {feed_rng.getCellByPosition(0, r).getString():
                cell_number(feed_rng.getCellByPosition(1, r)) for r in range(feed_rng.Rows.Count)}
        temps = [cell_number(temps_rng.getCellByPosition(0, r)) for r in range(n_t)]
        pressures = [cell_number(rng(doc, "Pressure1")), cell_number(rng(doc, "Pressure2"))]
        checks.ok("equilibrium: ammonia synthesis, key N2",
                  reaction == "N2(g) + 3 H2(g) -> 2 NH3(g)" and key == "N2", reaction)
        checks.ok("equilibrium: a 1:3 N2:H2 feed with inerts",
                  abs(feed.get("H2", 0) / feed.get("N2", 1) - 3.0) < 1e-12 and len(feed) > 2,
                  str(feed))
        checks.ok("equilibrium: at least five temperatures, rising, 600..800 K",
                  n_t >= 5 and None not in temps and temps == sorted(temps)
                  and temps[0] >= 600 and temps[-1] <= 800, str(temps))
        checks.ok("equilibrium: two pressures, the second higher", None not in pressures
                  and pressures[1] > pressures[0], str(pressures))
        n_key = cell_number(rng(doc, "FeedRate")) * feed["N2"] / sum(feed.values())
        checks.rel("equilibrium: N2 feed = feed rate x its mol fraction",
                   cell_number(rng(doc, "KeyFeedRate")), n_key, 1e-12)

        x = [[cell_number(conv.getCellByPosition(c, r)) for c in range(2)] for r in range(n_t)]
        q = [[cell_number(heat.getCellByPosition(c, r)) for c in range(2)] for r in range(n_t)]
        checks.ok("equilibrium: every cell a number", all(v is not None for row in x + q
                                                          for v in row))
        if all(v is not None for row in x + q for v in row):
            for c in range(2):
                col = [x[r][c] for r in range(n_t)]
                # Common practice (no source): higher temperature lowers ammonia conversion.
                checks.ok("equilibrium: at %g bar the conversion falls as T rises (common "
                          "practice)" % pressures[c],
                          all(col[i + 1] < col[i] for i in range(n_t - 1)), str(col))
            # Common practice (no source): higher pressure raises ammonia conversion.
            checks.ok("equilibrium: conversion higher at %g than at %g bar at every T (common "
                      "practice)" % (pressures[1], pressures[0]),
                      all(row[1] > row[0] for row in x), str(x))
            checks.ok("equilibrium: conversions between 0 and 1",
                      all(0 < v < 1 for row in x for v in row))
            print("      equilibrium: X(N2) at %g K: %.4f (%g bar), %.4f (%g bar); at %g K: "
                  "%.4f, %.4f; heat at %g K, %g bar: %.0f kW"
                  % (temps[0], x[0][0], pressures[0], x[0][1], pressures[1], temps[-1],
                     x[-1][0], x[-1][1], temps[0], pressures[1], q[0][1]))
        if cli:
            feed_args = ["%s=%r" % (sp, v) for sp, v in feed.items()]
            for r, t_k in enumerate(temps):
                log10_k = float(cli.json("logk", reaction, "-T", repr(t_k))["value"])
                dh = float(cli.json("dh", reaction, "-T", repr(t_k))["value"])
                for c, p in enumerate(pressures):
                    j = cli.json("eqx", reaction, repr(t_k), repr(p), *feed_args, "--key", key)
                    checks.rel("equilibrium: X at %g K, %g bar = CLI eqx" % (t_k, p), x[r][c],
                               float(j.get("value", "nan")), 1e-12)
                    checks.rel("equilibrium: X at %g K, %g bar = bisection on K from CLI logk"
                               % (t_k, p), x[r][c], ammonia_conversion(log10_k, feed, p), 1e-6)
                    # heat released = -dH x converted N2 (kmol/h -> mol/s), |nu(N2)| = 1
                    if x[r][c] is not None:
                        checks.rel("equilibrium: heat at %g K, %g bar = -dH x X x N2 feed"
                                   % (t_k, p), q[r][c],
                                   -dh * x[r][c] * n_key * 1000.0 / 3600.0, 1e-9)

        # The chart: XY scatter, one series per pressure over the temperature column.
        charts = sheet.getCharts()
        checks.ok("equilibrium: one chart on the sheet", charts.Count == 1, str(charts.Count))
        if charts.Count:
            chart = charts.getByIndex(0).getEmbeddedObject()
            series, kinds = [], []
            for cs in chart.getFirstDiagram().getCoordinateSystems():
                for ct in cs.getChartTypes():
                    kinds.append(ct.getChartType())
                    series.extend(ct.getDataSeries())
            checks.ok("equilibrium: the chart is an XY scatter",
                      kinds == ["com.sun.star.chart2.ScatterChartType"], str(kinds))
            checks.ok("equilibrium: two series, one per pressure", len(series) == 2,
                      str(len(series)))
            for i, s in enumerate(series):
                roles = {}
                label = None
                for ls in s.getDataSequences():
                    v = ls.getValues()
                    roles[v.getPropertyValue("Role")] = v.getSourceRangeRepresentation()
                    if ls.getLabel() is not None and v.getPropertyValue("Role") == "values-y":
                        label = ls.getLabel().getData()[0]
                y = conv.getCellRangeByPosition(i, 0, i, n_t - 1).AbsoluteName
                checks.ok("equilibrium: series %d x = the temperature column" % (i + 1),
                          roles.get("values-x") == temps_rng.AbsoluteName, str(roles))
                checks.ok("equilibrium: series %d y = its pressure's column" % (i + 1),
                          roles.get("values-y") == y, "%r vs %r" % (roles, y))
                checks.ok("equilibrium: series %d named by its pressure" % (i + 1),
                          label is not None and ("%g bar" % pressures[i]) in label, str(label))
            diagram = chart.getDiagram()
            checks.ok("equilibrium: chart axes titled (K, conversion)",
                      diagram.HasXAxisTitle and "K" in diagram.getXAxisTitle().String
                      and diagram.HasYAxisTitle
                      and "conversion" in diagram.getYAxisTitle().String)

        # An edited pressure: its column follows; 0 bar -> Err:502, never a number.
        rng(doc, "Pressure1").setValue(50)
        doc.calculateAll()
        if cli:
            j = cli.json("eqx", reaction, repr(temps[0]), "50", *feed_args, "--key", key)
            checks.rel("equilibrium: pressure 1 edited to 50 bar -> CLI eqx",
                       cell_number(conv.getCellByPosition(0, 0)), float(j.get("value", "nan")),
                       1e-12)
        checks.ok("equilibrium: the heading follows the pressure",
                  "50 bar" in sheet_text(sheet))
        rng(doc, "Pressure1").setValue(0)
        doc.calculateAll()
        errs = [conv.getCellByPosition(0, r).getError() for r in range(n_t)]
        checks.ok("equilibrium: pressure 0 -> Err:502 in its column",
                  errs == [ERR_ILLEGAL_ARGUMENT] * n_t, str(errs))
        checks.ok("equilibrium: ... and its heat is an error too",
                  all(heat.getCellByPosition(0, r).getError() != 0 for r in range(n_t)))
        checks.ok("equilibrium: ... the other pressure still computed",
                  all(cell_number(conv.getCellByPosition(1, r)) is not None
                      for r in range(n_t)))


# ------------------------------------------------------------------------------------------
# Standard cubic metre: 15 °C and 101.325 kPa (engine/DATA.md, Units); ideal gas.
MOL_PER_SM3 = 101325.0 / (R * 288.15)
# Names used in the workbooks -> formula, for python3-periodictable (from memory).
NAMED_FORMULA = {"n-butane": "C4H10", "ethanol": "C2H5OH"}


def bare(species):
    """The species without its phase: 'CH4(g)' -> 'CH4'."""
    return re.sub(r"\((?:g|l|s|aq|cr)\)$", "", species.strip())


def reaction_terms(reaction):
    """{species as written: signed coefficient} (reactants negative) of a reaction written as
    `a A(p) + b B(p) -> ...`, coefficients plain decimals; a species on one side only."""
    left, right = re.split(r"\s*->\s*", reaction)
    out = {}
    for sign, side in ((-1.0, left), (1.0, right)):
        for term in side.split(" + "):
            m = re.match(r"^\s*(\d+(?:\.\d+)?)?\s*(\S+?)\s*$", term)
            if not m:
                raise ValueError("cannot read the term %r of %r" % (term, reaction))
            if m.group(2) in out:
                raise ValueError("%r stands twice in %r" % (m.group(2), reaction))
            out[m.group(2)] = sign * float(m.group(1) or "1")
    return out


def iapws_mpa(text):
    """'40 bar' -> 4.0 (MPa): the only pressure form the workbooks use."""
    m = re.match(r"^\s*(\d+(?:\.\d+)?)\s*bar\s*$", text)
    if not m:
        raise ValueError("no arithmetic here for the pressure %r" % text)
    return float(m.group(1)) / 10.0


def iapws97():
    """python3-iapws's IAPWS-IF97 class (Debian's python3-iapws, a test dependency), or None."""
    try:
        from iapws import IAPWS97
    except ImportError:
        return None
    return IAPWS97


def check_furnace(checks, office, path, cli):
    name = "furnace"
    with office.opened(path) as doc:
        results = ["HHVVolume", "LHVVolume", "HHVMass", "LHVMass", "LHVMolar", "AnalysisStatus",
                   "FiredHeat", "FuelVolumeFlow", "FuelMassFlow", "FuelMolarFlow",
                   "AirMolarFlow", "FuelReaction", "FuelReactionCheck", "StoichO2",
                   "FlameTemperatureK", "FlameTemperature", "FlameStatus", "FuelCostHour",
                   "FuelCostYear", "PricePer1000Sm3"]
        gas = rng(doc, "FuelGas")
        atoms_rng = rng(doc, "FuelAtoms")
        derived = rng(doc, "FuelChecks")
        extra_rng = rng(doc, "FlameExtraFeed")
        sheet = gas.getSpreadsheet()
        n = gas.Rows.Count
        cells = [rng(doc, r) for r in results]
        cells += [derived.getCellByPosition(c, r) for r in range(n) for c in range(4)]
        cells += [extra_rng.getCellByPosition(c, r) for r in range(extra_rng.Rows.Count)
                  for c in range(2)]
        check_common(checks, name, path, doc, sheet, cells)
        num = lambda k: cell_number(rng(doc, k))  # noqa: E731

        species = [gas.getCellByPosition(0, r).getString() for r in range(n)]
        x = [cell_number(gas.getCellByPosition(1, r)) for r in range(n)]
        atoms = [[cell_number(atoms_rng.getCellByPosition(c, r)) for c in range(5)]
                 for r in range(n)]
        checks.ok("furnace: a fuel gas of at least five components summing to 1",
                  n >= 5 and None not in x and abs(sum(x) - 1.0) < 1e-12, str(x))
        try:
            import periodictable
        except ImportError:
            periodictable = None
        demand = []
        for r, sp in enumerate(species):
            c, h, o, nn, s = atoms[r]
            demand.append(c + h / 4.0 + s - o / 2.0)
            formula = NAMED_FORMULA.get(bare(sp), bare(sp))
            if periodictable is not None:
                # IUPAC formula parsing (python3-periodictable) against the typed atom counts
                got = {str(el): k for el, k in periodictable.formula(formula).atoms.items()}
                want = {el: k for el, k in zip("CHONS", atoms[r]) if k}
                checks.ok("furnace: atoms typed for %s = its formula %s (periodictable)"
                          % (sp, formula), got == want, "%r vs %r" % (got, want))
                checks.rel("furnace: M of %s (IUPAC, periodictable)" % sp,
                           cell_number(derived.getCellByPosition(0, r)),
                           iupac_molar_mass(formula), 2e-4)
            checks.ok("furnace: atom check of %s says ok" % sp,
                      derived.getCellByPosition(1, r).getString() == "ok",
                      derived.getCellByPosition(1, r).getString())
            checks.rel("furnace: O2 to burn %s = C + H/4 + S - O/2" % sp,
                       cell_number(derived.getCellByPosition(2, r)), demand[r], 1e-12)
        stoich = sum(xi * d for xi, d in zip(x, demand))
        checks.rel("furnace: stoichiometric O2 = sum x (C + H/4 + S - O/2)", num("StoichO2"),
                   stoich, 1e-12)
        checks.ok("furnace: status of the analysis ok", rng(doc, "AnalysisStatus").getString()
                  == "ok", rng(doc, "AnalysisStatus").getString())

        # Heating values: the CLI on the same composition, and the sum of the parts computed
        # here from each component's own heating value (CLI hv per species, kJ/mol), weighted
        # by mole fraction, per Sm3 by the ideal-gas law and per kg with IUPAC molar masses.
        burning = [r for r in range(n) if demand[r] != 0]
        comp = ["%s=%r" % (sp, xi) for sp, xi in zip(species, x)]
        for basis in ("HHV", "LHV"):
            per_mol = 0.0
            if cli:
                for cell_name, unit in (("%sVolume" % basis, "MJ/Sm3"),
                                        ("%sMass" % basis, "MJ/kg")):
                    j = cli.json("hv", *comp, "--basis", basis, "-u", unit)
                    checks.rel("furnace: %s in %s = CLI hv" % (basis, unit), num(cell_name),
                               float(j.get("value", "nan")), 1e-12)
                for r in burning:
                    per_mol += x[r] * cli.value("hv", species[r], "--basis", basis, "-u",
                                                "kJ/mol")
                checks.rel("furnace: %s per Sm3 = sum of x x hv(kJ/mol) x mol/Sm3 (ideal gas, "
                           "15 C)" % basis, num("%sVolume" % basis),
                           per_mol * MOL_PER_SM3 / 1000.0, 1e-9)
                if periodictable is not None:
                    m_mix = sum(xi * iupac_molar_mass(NAMED_FORMULA.get(bare(sp), bare(sp)))
                                for sp, xi in zip(species, x))
                    checks.rel("furnace: %s per kg = sum of parts / M of the gas (IUPAC)"
                               % basis, num("%sMass" % basis), per_mol / m_mix, 2e-4)
                if basis == "LHV":
                    checks.rel("furnace: LHV per mol = sum of parts", num("LHVMolar"),
                               per_mol, 1e-9)
        ratio = num("HHVVolume") / num("LHVVolume")
        checks.ok("furnace: HHV/LHV about 1.1 for a methane-rich gas (common practice)",
                  1.08 < ratio < 1.13, repr(ratio))

        # The combustion reaction of 1 mol of fuel gas and the extra feed, from the analysis.
        reaction = rng(doc, "FuelReaction").getString()
        terms = reaction_terms(reaction)
        want = {species[r]: -x[r] for r in burning}
        want["O2(g)"] = -stoich
        for product, col, div in (("CO2(g)", 0, 1.0), ("H2O(g)", 1, 2.0), ("N2(g)", 3, 2.0),
                                  ("SO2(g)", 4, 1.0)):
            v = sum(x[r] * atoms[r][col] for r in burning) / div
            if v:
                want[product] = v
        checks.ok("furnace: the reaction in the sheet is the combustion of 1 mol of the gas",
                  set(terms) == set(want) and all(abs(terms[k] - want[k]) < 1e-9 for k in want),
                  "%r vs %r" % (terms, want))
        if cli:
            checks.ok("furnace: ... balanced (CLI check)", cli.text("check", reaction) == "ok")
        excess = num("ExcessAir") / 100.0
        extra = {}
        for r in range(extra_rng.Rows.Count):
            sp = extra_rng.getCellByPosition(0, r).getString()
            if sp:
                extra[sp] = cell_number(extra_rng.getCellByPosition(1, r))
        n2_fuel = sum(xi for sp, xi in zip(species, x) if bare(sp) == "N2")
        want_extra = {"O2(g)": excess * stoich,
                      "N2(g)": 3.76 * (1 + excess) * stoich + n2_fuel}   # 3.76: common practice
        for r in range(n):
            if demand[r] == 0 and bare(species[r]) != "N2":
                want_extra[species[r]] = x[r]
        checks.ok("furnace: extra feed = excess O2, air N2 (3.76 per O2) + fuel N2, inerts",
                  set(extra) == set(want_extra) and all(abs(extra[k] - want_extra[k]) < 1e-12
                                                        for k in want_extra),
                  "%r vs %r" % (extra, want_extra))

        t_feed = num("BurnerTemperature") + ZERO_CELSIUS_K
        t_ad = num("FlameTemperatureK")
        checks.ok("furnace: flame status ok", rng(doc, "FlameStatus").getString() == "ok")
        checks.rel("furnace: flame temperature in C = K - 273.15", num("FlameTemperature"),
                   t_ad - ZERO_CELSIUS_K, 1e-12)

        def tad_cli(extra_feed):
            args = [w for sp, v in extra_feed.items() for w in ("--extra", "%s=%r" % (sp, v))]
            return float(cli.json("tad", reaction, repr(t_feed), *args).get("value", "nan"))

        if cli:
            checks.rel("furnace: flame temperature = CLI tad", t_ad, tad_cli(extra), 1e-12)
            # The energy balance the answer must satisfy, with another command (streamh):
            # H(flue gas at T_ad) = H(fuel + air at the burner temperature).
            feed, flue = {}, {}
            for sp, v in terms.items():
                (feed if v < 0 else flue)[sp] = abs(v)
            for sp, v in extra.items():
                feed[sp] = feed.get(sp, 0.0) + v
                flue[sp] = flue.get(sp, 0.0) + v

            def streamh(t, stream):
                return cli.value("streamh", repr(t), *["%s=%r" % kv for kv in stream.items()],
                                 "--flow-unit", "mol/s", "-u", "W")

            gap = streamh(t_ad, flue) - streamh(t_feed, feed)
            checks.ok("furnace: H(flue gas at T_ad) = H(feed at %g K) within 1e-5 of the LHV "
                      "(CLI streamh)" % t_feed, abs(gap) < 1e-5 * num("LHVMolar") * 1000.0,
                      "%g W per mol/s" % gap)
        print("      furnace: HHV %.3f, LHV %.3f MJ/Sm3; LHV %.3f MJ/kg; fuel %.0f Sm3/h; "
              "T_ad %.1f K at %g %% excess air; %.0f EUR/yr"
              % (num("HHVVolume"), num("LHVVolume"), num("LHVMass"), num("FuelVolumeFlow"),
                 t_ad, excess * 100, num("FuelCostYear")))

        # Fuel, air and cost: plain arithmetic on the sheet's inputs.
        fired = num("AbsorbedDuty") / num("Efficiency")
        checks.rel("furnace: fired = duty / efficiency", num("FiredHeat"), fired, 1e-12)
        checks.rel("furnace: Sm3/h = MW x 3600 / LHV", num("FuelVolumeFlow"),
                   fired * 3600.0 / num("LHVVolume"), 1e-12)
        checks.rel("furnace: kg/h = MW x 3600 / LHV", num("FuelMassFlow"),
                   fired * 3600.0 / num("LHVMass"), 1e-12)
        checks.rel("furnace: kmol/h = MW x 3600 / LHV(kJ/mol)", num("FuelMolarFlow"),
                   fired * 3600.0 / num("LHVMolar"), 1e-12)
        checks.rel("furnace: Sm3/h and kmol/h agree by the ideal-gas law",
                   num("FuelVolumeFlow") * MOL_PER_SM3 / 1000.0, num("FuelMolarFlow"), 1e-9)
        checks.rel("furnace: air = fuel x 4.76 x (1 + excess) x O2 (common practice)",
                   num("AirMolarFlow"), num("FuelMolarFlow") * 4.76 * (1 + excess) * stoich,
                   1e-12)
        per_hour = fired * 3.6 * num("FuelPrice")
        checks.rel("furnace: EUR/h = MW x 3.6 GJ/MWh x EUR/GJ", num("FuelCostHour"), per_hour,
                   1e-12)
        checks.rel("furnace: EUR/yr = EUR/h x hours", num("FuelCostYear"),
                   per_hour * num("OperatingHours"), 1e-12)
        checks.rel("furnace: EUR per 1000 Sm3 = EUR/GJ x MJ/Sm3", num("PricePer1000Sm3"),
                   num("FuelPrice") * num("LHVVolume"), 1e-12)

        # Edits: more excess air -> a cooler flame (common practice), as the CLI says.
        rng(doc, "ExcessAir").setValue(30)
        doc.calculateAll()
        t_30 = num("FlameTemperatureK")
        checks.ok("furnace: 30 % excess air -> cooler flame (common practice)",
                  t_30 is not None and t_30 < t_ad, "%r vs %r" % (t_30, t_ad))
        if cli:
            extra30 = dict(extra)
            extra30["O2(g)"] = 0.30 * stoich
            extra30["N2(g)"] = 3.76 * 1.30 * stoich + n2_fuel
            checks.rel("furnace: 30 % excess air = CLI tad", t_30, tad_cli(extra30), 1e-12)
        rng(doc, "ExcessAir").setValue(excess * 100)
        # A composition that does not sum to 1: no heating value, words giving the sum.
        gas.getCellByPosition(1, 0).setValue(x[0] - 0.08)
        doc.calculateAll()
        status = rng(doc, "AnalysisStatus").getString()
        checks.ok("furnace: analysis summing to 0.92 -> Err:502 in the heating values and "
                  "the fuel flow",
                  rng(doc, "LHVVolume").getError() == ERR_ILLEGAL_ARGUMENT
                  and rng(doc, "FuelVolumeFlow").getError() != 0)
        checks.ok("furnace: ... and the status gives the sum in words", status != "ok"
                  and "0.92" in status, status)
        gas.getCellByPosition(1, 0).setValue(x[0])
        # Wrong atoms typed for ethane: the check says so and the reaction does not balance.
        row = next(r for r, sp in enumerate(species) if bare(sp) == "C2H6")
        atoms_rng.getCellByPosition(1, row).setValue(5)
        doc.calculateAll()
        checks.ok("furnace: C2H5 typed for C2H6 -> the atom check says no",
                  derived.getCellByPosition(1, row).getString().startswith("no")
                  and rng(doc, "AnalysisStatus").getString().startswith("the atoms"),
                  rng(doc, "AnalysisStatus").getString())
        checks.ok("furnace: ... no flame temperature, and the status says why",
                  rng(doc, "FlameTemperatureK").getError() == ERR_ILLEGAL_ARGUMENT
                  and "balance" in rng(doc, "FlameStatus").getString(),
                  rng(doc, "FlameStatus").getString())
        atoms_rng.getCellByPosition(1, row).setValue(atoms[row][1])
        doc.calculateAll()
        checks.rel("furnace: inputs restored -> the same flame temperature",
                   num("FlameTemperatureK"), t_ad, 1e-12)


def check_duty(checks, office, path, cli):
    name = "duty"
    with office.opened(path) as doc:
        results = ["KeyFed", "KeyConverted", "ReactionHeat", "Duty", "SensibleHeat",
                   "DutyStatus", "SteamTsat", "SteamLatent", "SteamFlow", "SteamFromFeedWater",
                   "SteamCheck", "CoolingWater", "CoolingWaterByCp"]
        feed_rng = rng(doc, "Feed")
        sheet = feed_rng.getSpreadsheet()
        check_common(checks, name, path, doc, sheet, [rng(doc, r) for r in results])
        num = lambda k: cell_number(rng(doc, k))  # noqa: E731
        txt = lambda k: rng(doc, k).getString()  # noqa: E731
        reaction, key, unit = txt("Reaction"), txt("KeySpecies"), txt("FlowUnit")
        conv = num("Conversion")
        t_in = num("InletTemperature") + ZERO_CELSIUS_K
        t_out = num("OutletTemperature") + ZERO_CELSIUS_K
        feed = {feed_rng.getCellByPosition(0, r).getString():
                cell_number(feed_rng.getCellByPosition(1, r))
                for r in range(feed_rng.Rows.Count)}
        checks.ok("duty: flows in kmol/h, an exothermic reactor cooled from its inlet",
                  unit == "kmol/h" and t_out > t_in and 0 < conv < 1, "%s %r %r" % (unit, t_in,
                                                                                 t_out))
        duty = num("Duty")
        checks.rel("duty: key fed from the feed table", num("KeyFed"), feed[key], 1e-12)
        checks.rel("duty: converted = conversion x fed", num("KeyConverted"), conv * feed[key],
                   1e-12)
        # The outlet by stoichiometry, here: n_out = n_in + nu x extent, extent = X n_key/|nu|.
        nu = {bare(sp): v for sp, v in reaction_terms(reaction).items()}
        extent = conv * feed[key] / abs(nu[key])
        outlet = dict(feed)
        for sp, v in nu.items():
            outlet[sp] = outlet.get(sp, 0.0) + v * extent

        def streamh(t, stream):
            return cli.value("streamh", repr(t), *["%s=%r" % kv for kv in stream.items()],
                             "--flow-unit", unit, "-u", "kW")

        feed_args = ["%s=%r" % kv for kv in feed.items()]
        if cli:
            j = cli.json("duty", reaction, repr(conv), key, repr(t_in), repr(t_out), *feed_args,
                         "--flow-unit", unit, "-u", "kW")
            checks.rel("duty: RXNDUTY = CLI duty", duty, float(j.get("value", "nan")), 1e-12)
            checks.rel("duty: reaction heat = CLI load of the converted amount",
                       num("ReactionHeat"), cli.value("load", reaction, repr(conv * feed[key]),
                                                      unit, key, "-u", "kW", "-T", repr(t_in)),
                       1e-12)
            checks.rel("duty: duty = H(outlet at T out) - H(feed at T in) (CLI streamh, the "
                       "outlet by stoichiometry here)", duty,
                       streamh(t_out, outlet) - streamh(t_in, feed), 1e-9)
            # Hess's law: duty - reaction heat at T in = the outlet heated from T in to T out.
            checks.rel("duty: sensible heat = H(outlet at T out) - H(outlet at T in)",
                       num("SensibleHeat"), streamh(t_out, outlet) - streamh(t_in, outlet), 1e-6)
        checks.ok("duty: heat to remove, and the status says so", duty is not None and duty < 0
                  and txt("DutyStatus").startswith("heat to remove"), txt("DutyStatus"))

        # Steam at the header pressure: the CLI and python3-iapws (IAPWS-IF97).
        header = txt("SteamPressure")
        latent = num("SteamLatent")
        if cli:
            checks.rel("duty: latent heat = CLI steam latent %r" % header, latent,
                       cli.value("steam", "latent", header), 1e-12)
            checks.rel("duty: saturation T = CLI steam tsat", num("SteamTsat"),
                       cli.value("steam", "tsat", header) - ZERO_CELSIUS_K, 1e-12)
        w = iapws97()
        if w is None:
            checks.skip("duty: steam against python3-iapws", "python3-iapws not installed")
        else:
            p = iapws_mpa(header)
            h_vap, h_liq = w(P=p, x=1).h, w(P=p, x=0).h
            checks.rel("duty: latent heat at %s = python3-iapws (IAPWS-IF97)" % header, latent,
                       h_vap - h_liq, 1e-6)
            checks.close("duty: saturation T at %s = python3-iapws" % header, num("SteamTsat"),
                         w(P=p, x=0).T - ZERO_CELSIUS_K, 1e-6)
            h_bfw = w(P=p, T=num("FeedWaterTemperature") + ZERO_CELSIUS_K).h
            checks.rel("duty: steam from feed water = heat / (h vapour - h water) (python3-iapws)",
                       num("SteamFromFeedWater"), -duty * 3600.0 / (h_vap - h_bfw), 1e-6)
            pc = iapws_mpa(txt("CoolingWaterPressure"))
            dh_cw = (w(P=pc, T=num("CoolingWaterOut") + ZERO_CELSIUS_K).h
                     - w(P=pc, T=num("CoolingWaterIn") + ZERO_CELSIUS_K).h)
            checks.rel("duty: cooling water t/h = heat x 3.6 / dh (python3-iapws)",
                       num("CoolingWater"), -duty * 3.6 / dh_cw, 1e-6)
        checks.rel("duty: steam kg/h = |duty| x 3600 / latent", num("SteamFlow"),
                   abs(duty) * 3600.0 / latent, 1e-12)
        checks.rel("duty: cooling water by cp = heat x 3.6 / (cp x rise)",
                   num("CoolingWaterByCp"), -duty * 3.6 / (num("CoolingWaterCp") * (
                       num("CoolingWaterOut") - num("CoolingWaterIn"))), 1e-12)
        checks.rel("duty: cp 4.18 (common practice) within 0.5 % of the IAPWS-IF97 figure",
                   num("CoolingWaterByCp"), num("CoolingWater"), 5e-3)
        checks.ok("duty: the outlet can raise the header's steam (above its saturation T)",
                  txt("SteamCheck").startswith("yes"), txt("SteamCheck"))
        print("      duty: %.0f kW (reaction heat %.0f kW, sensible %.0f kW); latent %.2f kJ/kg "
              "at %s; steam %.0f kg/h (from feed water %.0f kg/h); cooling water %.1f t/h"
              % (duty, num("ReactionHeat"), num("SensibleHeat"), latent, header,
                 num("SteamFlow"), num("SteamFromFeedWater"), num("CoolingWater")))

        # Edits. No conversion: the duty is the feed's own sensible heat.
        rng(doc, "Conversion").setValue(0)
        doc.calculateAll()
        if cli:
            checks.rel("duty: conversion 0 -> H(feed at T out) - H(feed at T in)", num("Duty"),
                       streamh(t_out, feed) - streamh(t_in, feed), 1e-9)
        checks.ok("duty: ... and no reaction heat", num("ReactionHeat") == 0.0,
                  txt("ReactionHeat"))
        rng(doc, "Conversion").setValue(1.2)
        doc.calculateAll()
        checks.ok("duty: conversion 1.2 -> Err:502 and words in the status",
                  rng(doc, "Duty").getError() == ERR_ILLEGAL_ARGUMENT
                  and "conversion" in txt("DutyStatus"), txt("DutyStatus"))
        checks.ok("duty: ... and no steam figure", rng(doc, "SteamFlow").getError() != 0)
        rng(doc, "Conversion").setValue(conv)
        # A header too hot for the outlet: 120 bar saturates above 320 °C.
        rng(doc, "SteamPressure").setString("120 bar")
        doc.calculateAll()
        checks.ok("duty: 120 bar header -> the outlet cannot raise it",
                  txt("SteamCheck").startswith("no"), txt("SteamCheck"))
        if cli:
            checks.rel("duty: latent at 120 bar = CLI", num("SteamLatent"),
                       cli.value("steam", "latent", "120 bar"), 1e-12)
        # Above 165.29 bar the saturated states are in region 3: an error, not a number.
        rng(doc, "SteamPressure").setString("200 bar")
        doc.calculateAll()
        checks.ok("duty: 200 bar (region 3) -> Err:502 in the latent heat and the steam flow",
                  rng(doc, "SteamLatent").getError() == ERR_ILLEGAL_ARGUMENT
                  and rng(doc, "SteamFlow").getError() != 0)
        rng(doc, "SteamPressure").setString(header)
        doc.calculateAll()
        checks.rel("duty: inputs restored -> the same duty", num("Duty"), duty, 1e-12)


def main():
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--oxt", required=True)
    ap.add_argument("--cli", help="the rxnheat command line, for the engine's own answers")
    ap.add_argument("--examples", default=os.path.join(TOP, "examples"))
    ap.add_argument("--timeout", type=int, default=170)
    args = ap.parse_args()

    def on_alarm(signum, frame):
        raise Timeout("ran over %d s" % args.timeout)

    signal.signal(signal.SIGALRM, on_alarm)
    signal.alarm(args.timeout)
    t_start = time.monotonic()
    checks = Checks()
    cli = EngineCli(args.cli) if args.cli and os.path.exists(args.cli) else None
    if cli is None:
        checks.skip("comparisons with the CLI", "no --cli given or not built")
    workdir = tempfile.mkdtemp(prefix="rxnheat-examples-")
    off = None
    try:
        off = officelib.Office(workdir, "examples-install").start()
        off.install_extension(args.oxt)
        off.stop()
        off = officelib.Office(workdir, "examples").start()
        for name, fn, check in ((COSTING, "costing", check_costing),
                                (OPERATOR, "operator", check_operator),
                                (DESIGN, "design", check_design),
                                (HESS, "hess", check_hess),
                                (NEUTRALISATION, "neutralisation", check_neutralisation),
                                (EQUILIBRIUM, "equilibrium", check_equilibrium),
                                (FURNACE, "furnace", check_furnace),
                                (DUTY, "duty", check_duty)):
            path = os.path.join(args.examples, name)
            if not checks.ok("%s exists" % name, os.path.exists(path)):
                continue
            t0 = time.monotonic()
            try:
                check(checks, off, path, cli)
            except Timeout:
                raise
            except Exception as e:
                checks.ok("%s checks ran" % fn, False, "%s: %s\n%s" % (
                    type(e).__name__, e, traceback.format_exc()))
            print("----  %s: %.1f s" % (name, time.monotonic() - t0), flush=True)
        checks.ok("office still alive at the end", off.alive())
        off.stop()
        off = None
    except Timeout as e:
        checks.ok("finished in time", False, str(e))
    except Exception as e:
        checks.ok("ran to the end", False, "%s: %s\n%s" % (type(e).__name__, e,
                                                         traceback.format_exc()))
    finally:
        signal.alarm(0)
        if off is not None:
            off.kill()
        shutil.rmtree(workdir, ignore_errors=True)
    print("%d checks passed, %d failed, %d skipped in %.1f s" %
          (checks.passed, len(checks.failed), len(checks.skipped), time.monotonic() - t_start))
    return 0 if not checks.failed else 1


if __name__ == "__main__":
    sys.exit(main())
