#!/usr/bin/python3
"""Opens the heat-load costing workbook in a headless LibreOffice with the rxnheat add-in,
recalculates it, prints its main table and writes a PDF of it (OUT/heat-load-costing.pdf).
Run by scripts/demo.

    /usr/bin/python3 scripts/demo-costing.py --oxt build/addin/rxnheat.oxt --out build/demo

The office runs with a private profile under OUT/office (scripts/office.py), in which the
add-in is installed through the office's own Extension Manager: this works the same for root
and for a normal user, and never touches a LibreOffice the user has open. Everything is
time-bound; the office is killed on exit. Exit status 0 when every heat load was computed.
"""
import argparse
import os
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


def main():
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--oxt", required=True)
    ap.add_argument("--workbook", default=os.path.join(TOP, "examples", "heat-load-costing.fods"))
    ap.add_argument("--out", required=True, help="folder for the PDF (named after the workbook)")
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
        doc = off.load(args.workbook)
        if doc is None:
            raise officelib.OfficeError("LibreOffice could not open %s" % args.workbook)
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
        doc.close(True)
        off.stop()
        off = None
        print()
        print("PDF: %s  (%.0f s)" % (pdf, time.monotonic() - t0))
        if not good:
            print("demo: some heat loads were not computed (Err:502 above)", file=sys.stderr)
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
