#!/usr/bin/python3
"""Opens the heat-load costing workbook in a headless LibreOffice with the rxnheat add-in,
recalculates it, prints its main table and writes a PDF of it (OUT/heat-load-costing.pdf);
then the same for the furnace sheet (fuel gas heating values, fuel flow, flame temperature,
fuel cost) and the reactor duty sheet (duty, steam at the header pressure, cooling water),
whose key results it prints beside the costing table. Run by scripts/demo.

    /usr/bin/python3 scripts/demo-costing.py --oxt build/addin/rxnheat.oxt --out build/demo

The office runs with a private profile under OUT/office (scripts/office.py), in which the
add-in is installed through the office's own Extension Manager: this works the same for root
and for a normal user, and never touches a LibreOffice the user has open. Everything is
time-bound; the office is killed on exit. Exit status 0 when every heat load and every printed result was computed.
"""
import argparse
import os
import re
import shutil
import signal
import sys
import time

TOP = os.path.dirname(os.path.dirname(os.path.abspath(__file__)))
sys.path.insert(0, os.path.join(TOP, "scripts"))
import office as officelib  # noqa: E402  (the system python3 with python3-uno)


def named(doc, name):
    content = doc.NamedRanges.getByName(name).getContent()      # $'Heat loads'.$A$19:$L$25
    sheet_name, ref = content.rsplit(".", 1)
    return doc.Sheets.getByName(sheet_name.lstrip("$").strip("'")).getCellRangeByName(
        ref.replace("$", ""))


def table_text(doc):
    """The main table as aligned text, and whether every heat load was computed."""
    table = named(doc, "LoadTable")
    cols = [("Reaction", "l"), ("Key feed", "l"), ("T, \u00b0C", "r"),
            ("\u0394rH\u00b0, kJ/mol", "r"), ("Load, kW", "r"), ("Cost, EUR/yr", "r")]
    rows = []
    good = True
    for r in range(table.Rows.Count):
        c = lambda i: table.getCellByPosition(i, r)  # noqa: E731
        for i in (6, 8, 11):
            if c(i).getError() != 0:
                good = False
        rows.append([c(1).getString(),
                     "%s %s %s" % (c(3).getString(), c(4).getString(), c(2).getString()),
                     c(5).getString(), c(6).getString(), c(8).getString(), c(11).getString()])
    widths = [max(len(h), *(len(row[i]) for row in rows)) for i, (h, _) in enumerate(cols)]

    def line(cells):
        out = []
        for (h, align), w, text in zip(cols, widths, cells):
            out.append(text.ljust(w) if align == "l" else text.rjust(w))
        return "  ".join(out).rstrip()

    lines = [line([h for h, _ in cols]), line(["-" * w for w in widths])]
    lines += [line(row) for row in rows]
    return lines, good


# (label, text with {NamedCell} fields) printed for the furnace and the reactor duty sheets
FURNACE_LINES = [
    ("Fuel gas HHV / LHV", "{HHVVolume} / {LHVVolume} MJ/Sm3 ({LHVMass} MJ/kg LHV)"),
    ("Fuel for the duty", "{AbsorbedDuty} MW at {Efficiency} efficiency: {FuelVolumeFlow} "
     "Sm3/h, {FuelMassFlow} kg/h"),
    ("Adiabatic flame temperature", "{FlameTemperature} \u00b0C at {ExcessAir} % excess air "
     "(no dissociation)"),
    ("Fuel cost", "{FuelCostYear} EUR/yr at {FuelPrice} EUR/GJ (LHV), {OperatingHours} h/yr"),
]
DUTY_LINES = [
    ("Reaction", "{Reaction}, {Conversion} of the {KeySpecies} converted"),
    ("Inlet / outlet", "{InletTemperature} / {OutletTemperature} \u00b0C"),
    ("Reaction heat at the inlet T", "{ReactionHeat} kW"),
    ("Reactor duty (RXNDUTY)", "{Duty} kW (sensible heat {SensibleHeat} kW)"),
    ("Steam at the header", "{SteamPressure}: latent heat {SteamLatent} kJ/kg (IAPWS-IF97)"),
    ("Steam raised", "{SteamFlow} kg/h from boiling water, {SteamFromFeedWater} kg/h from "
     "feed water at {FeedWaterTemperature} \u00b0C"),
    ("Or cooling water", "{CoolingWater} t/h"),
]


def results_text(doc, lines):
    """One line per result, the named cells' texts put into it; and whether every one of them
    was computed."""
    out, good = [], True
    for label, text in lines:
        names = re.findall(r"\{(\w+)\}", text)
        cells = {n: named(doc, n) for n in names}
        good = good and all(c.getError() == 0 for c in cells.values())
        out.append("  %-30s %s" % (label, text.format(**{n: c.getString().strip()
                                                          for n, c in cells.items()})))
    return out, good


def export_pdf(doc, out_dir, workbook):
    pdf = os.path.join(os.path.abspath(out_dir),
                       os.path.splitext(os.path.basename(workbook))[0] + ".pdf")
    if os.path.exists(pdf):
        os.remove(pdf)
    doc.storeToURL(officelib.file_url(pdf), (officelib.prop("FilterName", "calc_pdf_Export"),))
    return pdf


def main():
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--oxt", required=True)
    ap.add_argument("--workbook", default=os.path.join(TOP, "examples", "heat-load-costing.fods"))
    ap.add_argument("--furnace", default=os.path.join(TOP, "examples", "furnace-fuel-gas.fods"))
    ap.add_argument("--duty", default=os.path.join(TOP, "examples", "reactor-duty-steam.fods"))
    ap.add_argument("--out", required=True, help="folder for the PDFs (named after the workbooks)")
    ap.add_argument("--timeout", type=int, default=240)
    args = ap.parse_args()

    def on_alarm(signum, frame):
        raise TimeoutError("the demo ran over %d s" % args.timeout)

    def on_term(signum, frame):
        raise TimeoutError("stopped by signal %d" % signum)

    signal.signal(signal.SIGALRM, on_alarm)
    signal.signal(signal.SIGTERM, on_term)
    signal.alarm(args.timeout)
    os.makedirs(args.out, exist_ok=True)
    workdir = os.path.join(os.path.abspath(args.out), "office")
    shutil.rmtree(workdir, ignore_errors=True)
    os.makedirs(workdir)
    pdf = os.path.join(os.path.abspath(args.out),
                       os.path.splitext(os.path.basename(args.workbook))[0] + ".pdf")
    if os.path.exists(pdf):
        os.remove(pdf)
    quiet = lambda msg: None  # noqa: E731
    off = None
    t0 = time.monotonic()
    try:
        off = officelib.Office(workdir, "demo-install", log=quiet).start()
        off.install_extension(args.oxt)
        off.stop()
        off = officelib.Office(workdir, "demo", log=quiet).start()
        with off.opened(args.workbook) as doc:
            doc.calculateAll()
            sheet = named(doc, "LoadTable").getSpreadsheet()
            print(sheet.getCellRangeByName("A1").getString())
            print(sheet.getCellRangeByName("A2").getString())
            print()
            lines, good = table_text(doc)
            for text in lines:
                print("  " + text)
            print()
            for label, name in (("Heat to supply (endothermic)", "HeatToSupply"),
                                ("Heat to remove (exothermic)", "HeatToRemove")):
                print("  %-30s %12s kW" % (label, named(doc, name).getString()))
            print("  %-30s %12s EUR/yr  (at %s h/yr, example prices)" % (
                "Total utility cost", named(doc, "TotalCost").getString(),
                named(doc, "OperatingHours").getString()))
            print()
            print("  Screening estimates: standard state, ideal gas, complete conversion, reaction")
            print("  heat only. Runaway and relief sizing need calorimetry and a process hazard")
            print("  analysis; defer to local codes and licensed engineers.")
            doc.storeToURL(officelib.file_url(pdf),
                           (officelib.prop("FilterName", "calc_pdf_Export"),))
        pdfs = [pdf]
        for workbook, lines in ((args.furnace, FURNACE_LINES), (args.duty, DUTY_LINES)):
            with off.opened(workbook) as doc:
                doc.calculateAll()
                print()
                print(doc.Sheets.getByIndex(0).getCellRangeByName("A1").getString())
                text, ok = results_text(doc, lines)
                for t in text:
                    print(t)
                good = good and ok
                pdfs.append(export_pdf(doc, args.out, workbook))
        print()
        print("  The same cautions hold for the furnace and the duty: screening estimates, not")
        print("  a design; the steam figures are IAPWS-IF97 properties of real water.")
        off.stop()
        off = None
        print()
        for p in pdfs:
            print("PDF: %s" % p)
        print("(%.0f s)" % (time.monotonic() - t0))
        if not good:
            print("demo: some results were not computed (Err:502 above)", file=sys.stderr)
            return 1
        return 0
    except Exception as e:  # includes the timeout
        print("demo: %s: %s (office log and profile kept in %s)" % (type(e).__name__, e,
                                                                    workdir), file=sys.stderr)
        workdir = None
        return 1
    finally:
        signal.alarm(0)
        if off is not None:
            off.kill()
        if workdir:
            shutil.rmtree(workdir, ignore_errors=True)


if __name__ == "__main__":
    sys.exit(main())
