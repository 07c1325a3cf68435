"""Reads the schedule as LibreOffice Calc saw it (one CSV per sheet, written
by `soffice --convert-to csv`) and holds it to results.json and to openpyxl's
reading of the same file: every member's row (id, mark, size, status, max
ratio, handle) in the Members sheet, and every sheet's rows and cells as
openpyxl reads them. Rows are written without cell references (ECMA-376
Part 1, 18.3.1.4: optional), so this is a spreadsheet application placing
each cell by order alone."""
import csv
import glob
import json
import math
import os
import sys

import openpyxl


def cell_text(v):
    if v is None:
        return ""
    if isinstance(v, float):
        return repr(v)
    return str(v)


def same(calc, xl):
    """A Calc CSV cell against openpyxl's value: text alike, numbers to 1e-9."""
    if calc == xl:
        return True
    try:
        a, b = float(calc), float(xl)
    except ValueError:
        return False
    return math.isclose(a, b, rel_tol=1e-9, abs_tol=1e-12)


def main(folder, results_path, xlsx_path):
    res = json.load(open(results_path))
    wb = openpyxl.load_workbook(xlsx_path, read_only=True)
    sheets = 0
    for name in wb.sheetnames:
        path = os.path.join(folder, "schedule-%s.csv" % name)
        if not os.path.exists(path):
            sys.exit("Calc wrote no CSV for sheet %s (files: %s)" % (name, sorted(glob.glob(folder + "/*.csv"))))
        calc_rows = list(csv.reader(open(path, newline="", encoding="utf-8")))
        xl_rows = [[cell_text(v) for v in row] for row in wb[name].iter_rows(values_only=True)]
        # Calc leaves trailing empty rows and cells out
        xl_rows = [r for r in xl_rows]
        while xl_rows and not any(xl_rows[-1]):
            xl_rows.pop()
        if len(calc_rows) != len(xl_rows):
            sys.exit("sheet %s: Calc reads %d rows, openpyxl %d" % (name, len(calc_rows), len(xl_rows)))
        for i, (c, x) in enumerate(zip(calc_rows, xl_rows)):
            while x and x[-1] == "":
                x = x[:-1]
            while c and c[-1] == "":
                c = c[:-1]
            if len(c) != len(x) or not all(same(a, b) for a, b in zip(c, x)):
                sys.exit("sheet %s row %d: Calc %r, openpyxl %r" % (name, i + 1, c[:8], x[:8]))
        sheets += 1
    # the Members sheet against results.json, by column header
    rows = list(csv.reader(open(os.path.join(folder, "schedule-Members.csv"), newline="", encoding="utf-8")))
    head_at = next(i for i, r in enumerate(rows) if r and r[0] == "ID")
    head = rows[head_at]
    col = {h: k for k, h in enumerate(head)}
    data = [r for r in rows[head_at + 1:] if r and r[0]]
    members = res["members"]
    if len(data) != len(members):
        sys.exit("Members sheet: %d rows in Calc, %d members in results.json" % (len(data), len(members)))
    marks = {m["mark"]: m for m in res.get("marks", [])}
    for r, m in zip(data, members):
        if r[col["ID"]] != m["id"] or r[col["Mark"]] != m.get("mark", ""):
            sys.exit("Members row %s: mark %s, results.json %s %s" % (r[col["ID"]], r[col["Mark"]], m["id"], m.get("mark")))
        status = m.get("status") or marks.get(m.get("mark"), {}).get("status")
        if status and r[col["Status"]] != status:
            sys.exit("member %s: status %s in Calc, %s in results.json" % (m["id"], r[col["Status"]], status))
        if r[col["Handle"]] != m.get("handle", ""):
            sys.exit("member %s: handle %s in Calc, %s in results.json" % (m["id"], r[col["Handle"]], m.get("handle")))
    print("schedule_calc_check: LibreOffice Calc reads %d sheets as openpyxl does; %d member rows agree with results.json" % (sheets, len(data)))


if __name__ == "__main__":
    main(sys.argv[1], sys.argv[2], sys.argv[3])
