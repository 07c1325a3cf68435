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


def members_of(res):
    """results.json's members, each with the fields its mark shares filled
    in (schema 3: a member's keys are its mark's "shared" plus its own)."""
    shared = {}
    for mk in res["marks"]:
        shared.setdefault(mk["mark"], mk.get("shared", {}))
    return [{**shared.get(m["mark"], {}), **m} for m in res["members"]]


def layer_counts(msp):
    c = collections.Counter()
    for e in msp:
        c[(e.dxf.layer.upper(), e.dxftype())] += 1
    return c


def main(demo, overlay_dir):
    res = json.load(open(os.path.join(demo, "results.json")))
    if res.get("schema") != "framecheck-results/3":
        fail("results.json schema %r" % res.get("schema"))
    members = members_of(res)
    # Schema 3: a member's checks, with their traces, are in the calculation
    # it names, its info lines in the info list it names; each trace ends on
    # its check's ratio, and the member's max_ratio and governing check are
    # its calculation's largest.
    calcs = res["calculations"]
    infos = res["info_lists"]
    for m in members:
        if "checks" in m or "info" in m:
            fail("member %s carries its checks or info lines, want references" % m["id"])
        if m.get("info_list") is not None and m["info_list"] not in infos:
            fail("member %s: info list %r missing" % (m["id"], m["info_list"]))
        if not m.get("calculation"):
            if m["status"] != "error":
                fail("member %s (%s) has no calculation" % (m["id"], m["status"]))
            continue
        c = calcs.get(m["calculation"])
        if c is None:
            fail("member %s: calculation %r missing" % (m["id"], m.get("calculation")))
        if c["checks"]:
            top = max(c["checks"], key=lambda k: k["ratio"])
            if abs(top["ratio"] - m["max_ratio"]) > 1e-9 * max(1, m["max_ratio"]):
                fail("member %s: max_ratio %r, its calculation's largest ratio %r" % (m["id"], m["max_ratio"], top["ratio"]))
        for k in c["checks"]:
            if not k["trace"] or abs(k["trace"][-1]["value"] - k["ratio"]) > 1e-9 * max(1, k["ratio"]):
                fail("calculation %s %s: trace does not end on the ratio %r" % (m["calculation"], k["kind"], k["ratio"]))
    print("results.json: %d members share %d calculations and %d info lists" % (len(members), len(calcs), len(infos)))
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
    def on_kind(layer, kind):
        return ours.get((layer, kind), 0)
    n_fail = sum(1 for m in members if m["status"] == "fail")
    n_err = sum(1 for m in members if m["status"] == "error")
    if on_kind("FC-FAIL", "LINE") != n_fail or on("FC-FAIL") != n_fail:
        fail("FC-FAIL holds %d entities, results.json has %d failing members" % (on("FC-FAIL"), n_fail))
    # Each member in error: its highlight and one short reason beside it.
    if on_kind("FC-ERROR", "LINE") != n_err or on_kind("FC-ERROR", "TEXT") != n_err:
        fail("FC-ERROR holds %d lines, %d texts; results.json has %d members in error" % (
            on_kind("FC-ERROR", "LINE"), on_kind("FC-ERROR", "TEXT"), n_err))
    for e in doc.modelspace().query('TEXT[layer=="FC-ERROR"]'):
        if " ERROR: " not in e.dxf.text or e.dxf.text.endswith("ERROR: "):
            fail("error label %r gives no reason" % e.dxf.text)
    runs_to_add = {r["run"] for r in res["blocking_rows"] if not r.get("existing")}
    if on_kind("FC-BLOCKING-ADD", "LINE") != to_add or on_kind("FC-BLOCKING-ADD", "TEXT") != len(runs_to_add):
        fail("FC-BLOCKING-ADD holds %d lines, %d notes; results.json has %d rows to add in %d runs" % (
            on_kind("FC-BLOCKING-ADD", "LINE"), on_kind("FC-BLOCKING-ADD", "TEXT"), to_add, len(runs_to_add)))
    for e in doc.modelspace().query('TEXT[layer=="FC-BLOCKING-ADD"]'):
        if not e.dxf.text.startswith("ADD BLOCKING "):
            fail("blocking note %r" % e.dxf.text)
    # One label per run and mark (not one per member), naming the mark.
    groups = {(m.get("run"), m["mark"]) for m in members if m["status"] != "error"}
    beams = (res.get("load_path") or {}).get("beams") or []
    labels = [e for e in doc.modelspace().query('TEXT[layer=="FC-LABEL"]')]
    beam_ids = {b["id"] for b in beams}
    labels = [e for e in labels if e.dxf.text.split()[0] not in beam_ids]  # one label per beam besides
    if len(labels) != len(groups) or len(labels) >= len(members):
        fail("FC-LABEL holds %d labels, results.json has %d runs x marks (%d members)" % (len(labels), len(groups), len(members)))
    marks = {m["mark"] for m in members if m["mark"]}
    for e in labels:
        parts = e.dxf.text.split()
        if parts[0] not in marks or "@" not in parts[1] or not parts[-1].replace(".", "").isdigit():
            fail("label %r is not 'MARK SIZE@SPACING CHECK RATIO'" % e.dxf.text)
    if on_kind("FC-ID", "TEXT") != len(members):
        fail("FC-ID holds %d ids, results.json has %d members" % (on_kind("FC-ID", "TEXT"), len(members)))
    if on("FC-UPLIFT") != flagged or ours.get(("FC-UPLIFT", "TEXT"), 0) != flagged:
        fail("FC-UPLIFT holds %d entities, results.json flags %d bearings" % (on("FC-UPLIFT"), flagged))
    # Colours: ours distinct from each other and from every layer of the
    # source drawing, never yellow (ACI 2), which does not print on white.
    src_colours = {abs(l.dxf.color) for l in src.layers}
    mine = {}
    for name in ("FC-FAIL", "FC-ERROR", "FC-BLOCKING-ADD", "FC-LABEL", "FC-UPLIFT", "FC-ID", "FC-KEY"):
        if name not in doc.layers:
            fail("plan-checked.dxf: no layer %s" % name)
        c = abs(doc.layers.get(name).dxf.color)
        if c in src_colours or c == 2 or c in mine.values():
            fail("layer %s colour %d clashes (source uses %s, ours %s)" % (name, c, sorted(src_colours), mine))
        mine[name] = c
    # The key: a title and one line per layer, right of every source entity.
    key = [e for e in doc.modelspace().query('TEXT[layer=="FC-KEY"]')]
    if not any(e.dxf.text == "FRAMECHECK MARKUP KEY" for e in key) or \
            not all(any(e.dxf.text.startswith(n + " ") for e in key) for n in mine if n != "FC-KEY"):
        fail("the key lacks its title or a layer: %r" % [e.dxf.text for e in key])
    if not any(("FRAMECHECK " + res.get("tool_version", "?")).upper() in e.dxf.text for e in key):
        fail("the key does not stamp the tool version %r" % res.get("tool_version"))
    xs = []
    for e in src.modelspace():
        if e.dxftype() == "LINE":
            xs += [e.dxf.start.x, e.dxf.end.x]
        elif e.dxftype() == "LWPOLYLINE":
            xs += [p[0] for p in e.get_points("xy")]
    if min(e.dxf.insert.x for e in key) <= max(xs):
        fail("the key overlaps the plan (x %.1f <= %.1f)" % (min(e.dxf.insert.x for e in key), max(xs)))
    # Labels beside the joist lines, not on them: the centre of every label
    # (error reason, uplift) is farther than half its height from every joist.
    joists = [(e.dxf.start, e.dxf.end) for e in src.modelspace().query("LINE")
              if e.dxf.layer.upper().startswith("JOIST")]
    def dist(p, a, b):
        ax, ay, bx, by = a.x, a.y, b.x, b.y
        dx, dy = bx - ax, by - ay
        t = 0.0 if dx == dy == 0 else max(0.0, min(1.0, ((p.x - ax) * dx + (p.y - ay) * dy) / (dx * dx + dy * dy)))
        return ((p.x - ax - t * dx) ** 2 + (p.y - ay - t * dy) ** 2) ** 0.5
    for e in labels + list(doc.modelspace().query('TEXT[layer=="FC-ERROR"]')) + \
            list(doc.modelspace().query('TEXT[layer=="FC-UPLIFT"]')):
        p = e.dxf.align_point
        d = min(dist(p, a, b) for a, b in joists)
        if d <= e.dxf.height / 2:
            fail("label %r at %s lies on a joist line (%.2f from it, height %.2f)" % (e.dxf.text, p, d, e.dxf.height))
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
    if not layers <= {"FC-FAIL", "FC-ERROR", "FC-BLOCKING-ADD", "FC-LABEL", "FC-UPLIFT", "FC-ID", "FC-KEY", "FC-GENERATED"}:
        fail("overlay holds entities on other layers: %r" % sorted(layers))

    # Schedule: sheets, one row per member, totals.
    wb = openpyxl.load_workbook(os.path.join(demo, "schedule.xlsx"), read_only=False)
    want = ["Members", "Marks", "Blocking", "Takeoff", "Uplift", "Inputs", "Notes"]
    if res.get("load_path"):
        want = want[:5] + ["Beams", "Posts", "Connections", "Foundation"] + want[5:]
    if wb.sheetnames != want:
        fail("sheets %r, want %r" % (wb.sheetnames, want))
    if res.get("load_path"):
        lp = res["load_path"]
        n = wb["Beams"].max_row - 3
        if n != len(lp["beams"]):
            fail("Beams sheet: %d rows, results.json load_path.beams has %d" % (n, len(lp["beams"])))
        # Posts, Connections and Foundation: items alike share a row naming
        # them all (a wall line has its own); every item of results.json is
        # named exactly once, with what its row says of it.
        def grouped(name, names_col, item):
            ws = wb[name]
            head = [c.value for c in ws[3]]
            named = []
            for row in ws.iter_rows(min_row=4, values_only=True):
                r = dict(zip(head, row))
                ids = r[names_col].split(", ")
                if len(ids) != r["Count"] or (r.get("Kind") == "wall" and len(ids) != 1):
                    fail("%s row %r: %d named, count %r" % (name, r, len(ids), r["Count"]))
                named += [item(r, i) for i in ids]
            return sorted(named)
        for name, col, item, want_items in (
                ("Posts", "Posts", lambda r, i: i, [p["id"] for p in lp["posts"]]),
                ("Connections", "Members", lambda r, m: (r["Joint"], m, r["Bearing"], r["Carried by"]),
                 [(c["kind"], m, c["bearing"], c["carrier"]) for c in lp["connections"] for m in c["members"]]),
                ("Foundation", "IDs", lambda r, i: (r["Kind"], i), [(f["kind"], f["id"]) for f in lp["foundation"]])):
            if grouped(name, col, item) != sorted(want_items):
                fail("%s sheet does not name the %d items of results.json once each" % (name, len(want_items)))
        a, d = lp["applied"], lp["delivered"]
        for k in ("dead_lb", "live_lb", "roof_live_lb", "snow_lb", "wind_up_lb"):
            if abs(a[k] - d[k]) > 0.1:
                fail("load path: %s applied %.1f, delivered %.1f: lost on the way" % (k, a[k], d[k]))
    # Uplift sheet: one row per support line, bearing counts adding up to
    # results.json's list.
    # Each sheet: two title rows (project, version), the header, the data.
    skip = 3
    for ws in wb.worksheets:
        v = str(ws.cell(2, 1).value or "")
        if "framecheck " not in v or res.get("tool_version", "") not in v:
            fail("%s: row 2 %r does not stamp the tool version %r" % (ws.title, v, res.get("tool_version")))
    up_rows = [r for r in list(wb["Uplift"].iter_rows(values_only=True))[skip:] if r and r[0]]
    # schema 3 leaves a bearing's support out when it is its layer and handle
    lines = {b.get("support", b["support_layer"] + " handle " + b["support_handle"]) for b in up["bearings"]}
    if len(up_rows) != len(lines) or sum(r[2] for r in up_rows) != len(up["bearings"]):
        fail("Uplift sheet: %d lines, %d bearings; results.json %d lines, %d bearings" % (
            len(up_rows), sum(r[2] for r in up_rows), len(lines), len(up["bearings"])))
    rows = list(wb["Members"].iter_rows(values_only=True))
    data = [r for r in rows[skip:] if any(v not in (None, "") for v in r)]
    if len(data) != len(members):
        fail("Members sheet has %d rows, results.json %d members" % (len(data), len(members)))
    ids = [r[0] for r in data]
    if ids != [m["id"] for m in members]:
        fail("Members sheet ids differ from results.json")
    marks = [r for r in list(wb["Marks"].iter_rows(values_only=True))[skip:] if r and r[0]]
    if len(marks) != len(res["marks"]):
        fail("Marks sheet has %d rows, results.json %d marks" % (len(marks), len(res["marks"])))
    notes = " ".join(str(v) for r in wb["Notes"].iter_rows(values_only=True) for v in r if v)
    if "licensed professional" not in notes:
        fail("Notes sheet lacks the cautions")
    print("demo_check: %d members (%d failing or error), %d rows to add, %d marks, %d run labels, %d uplift labels, colours %s: DXF, overlay and XLSX agree"
          % (len(members), failing, to_add, len(res["marks"]), len(labels), flagged, mine))


if __name__ == "__main__":
    main(sys.argv[1], sys.argv[2])
