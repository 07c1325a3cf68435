"""Cross-checks framecheck's demo outputs with independent readers.

ezdxf (Debian python3-ezdxf) reads the annotated DXF and the overlay;
openpyxl (Debian python3-openpyxl) reads the schedule. Both are compared
with results.json. Exits non-zero with a message on the first mismatch.
"""
import collections
import json
import os
import sys

import ezdxf
import openpyxl


def fail(msg):
    print("demo_check: " + msg, file=sys.stderr)
    sys.exit(1)


def layer_counts(msp):
    c = collections.Counter()
    for e in msp:
        c[(e.dxf.layer.upper(), e.dxftype())] += 1
    return c


def main(demo, overlay_dir):
    res = json.load(open(os.path.join(demo, "results.json")))
    if res.get("schema") != "framecheck-results/2":
        fail("results.json schema %r" % res.get("schema"))
    members = res["members"]
    # Schema 2: each member's traces are in the calculation it names; its
    # checks there match its own, and each trace ends on the check's ratio.
    calcs = res["calculations"]
    for m in members:
        if not m["checks"]:
            continue
        c = calcs.get(m.get("calculation"))
        if c is None:
            fail("member %s: calculation %r missing" % (m["id"], m.get("calculation")))
        if [(k["kind"], k["ratio"]) for k in m["checks"]] != [(k["kind"], k["ratio"]) for k in c["checks"]]:
            fail("member %s: checks differ from calculation %s" % (m["id"], m["calculation"]))
        for k in c["checks"]:
            if not k["trace"] or abs(k["trace"][-1]["value"] - k["ratio"]) > 1e-9 * max(1, k["ratio"]):
                fail("calculation %s %s: trace does not end on the ratio %r" % (m["calculation"], k["kind"], k["ratio"]))
    print("results.json: %d members share %d calculations" % (len(members), len(calcs)))
    s = res["summary"]
    if s["members"] != len(members) or s["pass"] + s["fail"] + s["error"] != len(members):
        fail("summary counts do not add up: %r" % s)
    failing = sum(1 for m in members if m["status"] != "pass")
    to_add = sum(1 for r in res["blocking_rows"] if not r.get("existing"))
    # Uplift: every listed bearing has a positive reaction, flagged exactly
    # from report_lb up; the demo's roof bays are under net uplift.
    up = res["uplift"]
    ids = {m["id"] for m in members}
    for b in up["bearings"]:
        if b["uplift_lb"] <= 0 or b["flagged"] != (b["uplift_lb"] >= up["report_lb"]) or b["member"] not in ids:
            fail("uplift entry %r inconsistent with report_lb %r" % (b, up["report_lb"]))
    flagged = sum(1 for b in up["bearings"] if b["flagged"])
    if flagged == 0:
        fail("the demo's roof bays are under net uplift, results.json flags none")

    # Annotated DXF: audit clean, original entities untouched, our markup there.
    src = ezdxf.readfile(os.path.join(demo, "plan.dxf"))
    doc = ezdxf.readfile(os.path.join(demo, "plan-checked.dxf"))
    auditor = doc.audit()
    if auditor.has_errors:
        fail("ezdxf audit errors in plan-checked.dxf: %r" % [str(e) for e in auditor.errors][:5])
    before, after = layer_counts(src.modelspace()), layer_counts(doc.modelspace())
    for key, n in before.items():
        if after.get(key, 0) != n:
            fail("plan-checked.dxf: %s %s count %d, original %d" % (key[0], key[1], after.get(key, 0), n))
    ours = {k: n for k, n in after.items() if k not in before}
    def on(layer):
        return sum(n for (l, _), n in ours.items() if l == layer)
    if on("FC-FAIL") != failing:
        fail("FC-FAIL holds %d entities, results.json has %d failing or error members" % (on("FC-FAIL"), failing))
    if on("FC-BLOCKING-ADD") != to_add:
        fail("FC-BLOCKING-ADD holds %d entities, results.json has %d rows to add" % (on("FC-BLOCKING-ADD"), to_add))
    if on("FC-LABEL") != len(members):
        fail("FC-LABEL holds %d labels, results.json has %d members" % (on("FC-LABEL"), len(members)))
    if on("FC-UPLIFT") != flagged or ours.get(("FC-UPLIFT", "TEXT"), 0) != flagged:
        fail("FC-UPLIFT holds %d entities, results.json flags %d bearings" % (on("FC-UPLIFT"), flagged))
    # Geometry of the original joists is unchanged (first LINE on each layer).
    for e_src, e_out in zip(src.modelspace().query("LINE"), doc.modelspace().query("LINE")):
        if e_src.dxf.start.isclose(e_out.dxf.start, abs_tol=1e-9) is False or e_src.dxf.layer != e_out.dxf.layer:
            fail("LINE %s moved or changed layer" % e_src.dxf.handle)

    # Overlay: valid R12 holding the markup alone.
    ov = os.path.join(overlay_dir, "plan-overlay.dxf")
    if not os.path.exists(ov):
        fail("--overlay wrote no plan-overlay.dxf")
    odoc = ezdxf.readfile(ov)
    if odoc.dxfversion != "AC1009":
        fail("overlay is %s, want R12 (AC1009)" % odoc.dxfversion)
    if odoc.audit().has_errors:
        fail("ezdxf audit errors in the overlay")
    layers = {e.dxf.layer.upper() for e in odoc.modelspace()}
    if not layers <= {"FC-FAIL", "FC-BLOCKING-ADD", "FC-LABEL", "FC-UPLIFT", "FC-GENERATED"}:
        fail("overlay holds entities on other layers: %r" % sorted(layers))

    # Schedule: sheets, one row per member, totals.
    wb = openpyxl.load_workbook(os.path.join(demo, "schedule.xlsx"), read_only=False)
    want = ["Members", "Marks", "Blocking", "Takeoff", "Uplift", "Inputs", "Notes"]
    if wb.sheetnames != want:
        fail("sheets %r, want %r" % (wb.sheetnames, want))
    # Uplift sheet: one row per support line, bearing counts adding up to
    # results.json's list.
    up_rows = [r for r in list(wb["Uplift"].iter_rows(values_only=True))[1:] if r and r[0]]
    lines = {b["support"] for b in up["bearings"]}
    if len(up_rows) != len(lines) or sum(r[2] for r in up_rows) != len(up["bearings"]):
        fail("Uplift sheet: %d lines, %d bearings; results.json %d lines, %d bearings" % (
            len(up_rows), sum(r[2] for r in up_rows), len(lines), len(up["bearings"])))
    rows = list(wb["Members"].iter_rows(values_only=True))
    data = [r for r in rows[1:] if any(v not in (None, "") for v in r)]
    if len(data) != len(members):
        fail("Members sheet has %d rows, results.json %d members" % (len(data), len(members)))
    ids = [r[0] for r in data]
    if ids != [m["id"] for m in members]:
        fail("Members sheet ids differ from results.json")
    marks = [r for r in list(wb["Marks"].iter_rows(values_only=True))[1:] if r and r[0]]
    if len(marks) != len(res["marks"]):
        fail("Marks sheet has %d rows, results.json %d marks" % (len(marks), len(res["marks"])))
    notes = " ".join(str(v) for r in wb["Notes"].iter_rows(values_only=True) for v in r if v)
    if "licensed professional" not in notes:
        fail("Notes sheet lacks the cautions")
    print("demo_check: %d members (%d failing or error), %d rows to add, %d marks, %d uplift labels: DXF, overlay and XLSX agree"
          % (len(members), failing, to_add, len(res["marks"]), flagged))


if __name__ == "__main__":
    main(sys.argv[1], sys.argv[2])
