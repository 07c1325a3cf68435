"""Independent checks of framecheck's export outputs.

    export_check.py dxf  OUTDIR   # annotated DXFs and overlay, with ezdxf
    export_check.py xlsx OUTDIR   # schedule.xlsx, with openpyxl

OUTDIR holds what `go run ./export/internal/cifiles` wrote, with
expect.json saying what should be there. Exit status 1 on any failure.
"""

import json
import math
import os
import sys
from collections import Counter

OUR_LAYERS = ("FC-FAIL", "FC-ERROR", "FC-BLOCKING-ADD", "FC-LABEL", "FC-UPLIFT", "FC-ID", "FC-KEY", "FC-GENERATED")
TEXT_LAYERS = ("FC-LABEL", "FC-UPLIFT", "FC-ID")
LINE_LAYERS = ("FC-FAIL",)  # the others hold lines and texts
failures = []
# Every sheet starts with the project's title block (two rows), then the
# header row; the table's data follow it.
TITLE_ROWS = 2
HEAD = TITLE_ROWS + 1


def fail(msg):
    failures.append(msg)
    print("FAIL:", msg)


def members_of(res):
    """results.json's members, each with the fields its mark shares filled
    in (schema 3: a member's keys are its mark's "shared" plus its own)."""
    shared = {}
    for mk in res["marks"]:
        shared.setdefault(mk["mark"], mk.get("shared", {}))
    return [{**shared.get(m["mark"], {}), **m} for m in res["members"]]


def support_of(b):
    """An uplift bearing's support line; schema 3 leaves it out when it is
    its layer and handle."""
    if "support" in b:
        return b["support"]
    return b["support_layer"] + " handle " + b["support_handle"]


def r(v):
    return round(float(v), 6)


def pt(p):
    return (r(p[0]), r(p[1]))


def signature(e):
    """Type, layer and geometry of an entity, rounded to 1e-6 drawing units."""
    t = e.dxftype()
    layer = e.dxf.layer.upper()
    if t == "LINE":
        geo = (pt(e.dxf.start), pt(e.dxf.end))
    elif t == "LWPOLYLINE":
        geo = tuple(pt(p) for p in e.get_points("xy")) + (bool(e.closed),)
    elif t == "POLYLINE":
        geo = tuple(pt(v.dxf.location) for v in e.vertices) + (bool(e.is_closed),)
    elif t in ("TEXT",):
        geo = (pt(e.dxf.insert), e.dxf.text, r(e.dxf.height))
    elif t == "CIRCLE":
        geo = (pt(e.dxf.center), r(e.dxf.radius))
    elif t == "INSERT":
        geo = (e.dxf.name, pt(e.dxf.insert))
    else:
        geo = ()
    return (t, layer, geo)


def raw_pairs(path):
    with open(path, "rb") as f:
        lines = f.read().decode("latin-1").splitlines()
    return [(int(lines[i].strip()), lines[i + 1].strip()) for i in range(0, len(lines) - 1, 2)]


def raw_checks(path, modern):
    """Handles unique and below $HANDSEED; LAYER count covers the records."""
    pairs = raw_pairs(path)
    section = table = record = None
    seed = None
    handles = []
    layer_count = None
    layer_records = 0
    want_sect = want_table = False
    var = None
    for code, value in pairs:
        if code == 0:
            v = value.upper()
            if v == "SECTION":
                want_sect, section = True, None
            elif v == "ENDSEC":
                section = table = record = None
            elif v == "TABLE":
                want_table, record = True, "TABLE"
            elif v == "ENDTAB":
                table = record = None
            else:
                record = v
                if table == "LAYER" and v == "LAYER":
                    layer_records += 1
            continue
        if code == 2 and want_sect:
            section, want_sect = value.upper(), False
            continue
        if code == 2 and want_table:
            table, want_table = value.upper(), False
            continue
        if section == "HEADER":
            if code == 9:
                var = value
            elif var == "$HANDSEED" and code == 5:
                seed = int(value, 16)
            continue
        if table == "LAYER" and record == "TABLE" and code == 70:
            layer_count = int(value)
        if code == 105 or (code == 5 and not (table == "DIMSTYLE" and record == "DIMSTYLE")):
            handles.append(int(value, 16))
    dup = [h for h, n in Counter(handles).items() if n > 1]
    if dup:
        fail("%s: duplicate handles %s" % (path, [hex(h) for h in dup]))
    if handles and seed is not None and max(handles) >= seed:
        fail("%s: $HANDSEED %x not above the largest handle %x" % (path, seed, max(handles)))
    if modern and seed is None:
        fail("%s: no $HANDSEED" % path)
    if layer_count is not None and layer_count < layer_records:
        fail("%s: LAYER table count %d < %d records" % (path, layer_count, layer_records))
    print("  %s: %d handles, $HANDSEED %s, LAYER count %s for %d records" % (
        os.path.basename(path), len(handles), hex(seed) if seed is not None else "-", layer_count, layer_records))


def audit(doc, path):
    auditor = doc.audit()
    for e in auditor.errors:
        fail("%s: audit error %s: %s" % (path, e.code, e.message))
    if auditor.fixes:
        print("  %s: audit applied %d fixes (not errors)" % (os.path.basename(path), len(auditor.fixes)))


def check_dxf(out):
    import ezdxf

    exp = json.load(open(os.path.join(out, "expect.json")))
    for plan in exp["plans"]:
        src, dst = plan["input"], plan["output"]
        print("-", src, "->", dst)
        din = ezdxf.readfile(src)
        dout = ezdxf.readfile(dst)
        audit(dout, dst)
        if dout.dxfversion != din.dxfversion:
            fail("%s: version %s, input %s" % (dst, dout.dxfversion, din.dxfversion))
        before = Counter(signature(e) for e in din.modelspace())
        after_all = [signature(e) for e in dout.modelspace()]
        after = Counter(s for s in after_all if s[1] not in OUR_LAYERS)
        if before != after:
            fail("%s: original entities changed: missing %s, extra %s" % (
                dst, list((before - after).items())[:5], list((after - before).items())[:5]))
        ours = Counter(s[1] for s in after_all if s[1] in OUR_LAYERS)
        for layer, n in exp["layers"].items():
            if ours.get(layer, 0) != n:
                fail("%s: layer %s holds %d entities, want %d" % (dst, layer, ours.get(layer, 0), n))
            if layer not in dout.layers:
                fail("%s: layer %s not in the LAYER table" % (dst, layer))
        kinds = Counter((s[0], s[1]) for s in after_all if s[1] in OUR_LAYERS)
        for (t, layer), n in kinds.items():
            want = "TEXT" if layer in TEXT_LAYERS else "LINE" if layer in LINE_LAYERS else t
            if t != want:
                fail("%s: %d %s on %s, want %s" % (dst, n, t, layer, want))
        # The highlight of a failing member lies on a drawn joist (checks the
        # inch factor: the R2000 plan is in feet).
        joists = {s[2] for s in before if s[0] == "LINE" and s[1].startswith("JOIST")}
        for s in after_all:
            if s[1] == "FC-FAIL" and s[2] not in joists:
                fail("%s: highlight %s is not over a drawn joist" % (dst, s[2]))
        # One uplift label per flagged bearing of results.json, each saying
        # that bearing's uplift rounded up to the pound.
        res = json.load(open(exp["json"]))
        flagged = sorted("uplift %d lb" % math.ceil(b["uplift_lb"]) for b in res["uplift"]["bearings"] if b["flagged"])
        labels = sorted(e.dxf.text for e in dout.modelspace() if e.dxf.layer.upper() == "FC-UPLIFT")
        if labels != flagged:
            fail("%s: FC-UPLIFT labels %s, want %s" % (dst, labels, flagged))
        for layer in din.layers:
            if layer.dxf.name not in dout.layers:
                fail("%s: layer %s lost" % (dst, layer.dxf.name))
        raw_checks(dst, dout.dxfversion > "AC1009")
        print("  %d original entities kept, ours %s" % (sum(before.values()), dict(ours)))

    ov = exp["overlay"]
    print("-", ov)
    doc = ezdxf.readfile(ov)
    audit(doc, ov)
    if doc.dxfversion != "AC1009":
        fail("%s: version %s, want AC1009" % (ov, doc.dxfversion))
    got = Counter(e.dxf.layer for e in doc.modelspace())
    for layer, n in exp["layers"].items():
        if got.get(layer, 0) != n:
            fail("%s: layer %s holds %d entities, want %d" % (ov, layer, got.get(layer, 0), n))
    if sum(got.values()) != sum(exp["layers"].values()):
        fail("%s: %d entities, want %d" % (ov, sum(got.values()), sum(exp["layers"].values())))
    print("  overlay entities", dict(got))


def check_xlsx(out):
    import openpyxl

    exp = json.load(open(os.path.join(out, "expect.json")))
    res = json.load(open(exp["json"]))
    wb = openpyxl.load_workbook(exp["xlsx"])
    want = ["Members", "Marks", "Blocking", "Takeoff", "Uplift", "Inputs", "Notes"]
    if res.get("load_path"):
        want = want[:5] + ["Beams", "Posts", "Connections", "Foundation"] + want[5:]
    if wb.sheetnames != want:
        fail("sheet names %s, want %s" % (wb.sheetnames, want))
        return
    check_uplift_sheet(wb["Uplift"], res)
    t = res["takeoff"]
    rows = {
        "Members": exp["members"] + 1,
        "Marks": exp["marks"] + 1,
        "Blocking": exp["blocking_rows"] + 1,
        "Takeoff": 1 + len(t["joists"]) + len(t["blocking"]) + len(t["hangers"]) + 4,
    }
    for name, n in rows.items():
        if wb[name].max_row != n + TITLE_ROWS:
            fail("%s: %d rows, want %d" % (name, wb[name].max_row, n + TITLE_ROWS))
    for ws in wb.worksheets:
        if ws.freeze_panes != "A%d" % (HEAD + 1):
            fail("%s: frozen panes %s, want A%d" % (ws.title, ws.freeze_panes, HEAD + 1))
        if not str(ws.cell(1, 1).value or ""):
            fail("%s: no title block in row 1" % ws.title)
        # excelize writes the range absolute ($A$1:$Y$5); both forms are valid.
        if not (ws.auto_filter.ref or "").replace("$", "").startswith("A%d:" % HEAD):
            fail("%s: no autofilter (%r)" % (ws.title, ws.auto_filter.ref))
    ms = wb["Members"]
    head = [c.value for c in ms[HEAD]]
    col = {h: i for i, h in enumerate(head)}
    for h in ("ID", "Mark", "Spans (ft-in)", "Max ratio", "Status", "Governing", "Combination"):
        if h not in col:
            fail("Members: no column %r" % h)
            return
    by_id = {row[col["ID"]].value: row for row in ms.iter_rows(min_row=HEAD + 1)}
    members = members_of(res)
    for m in members:
        row = by_id.get(m["id"])
        if row is None:
            fail("Members: no row for %s" % m["id"])
            continue
        ratio = row[col["Max ratio"]]
        # results.json (schema 3) writes ratios to 6 significant digits
        if abs(ratio.value - m["max_ratio"]) > 5e-6 * max(1, abs(ratio.value)) or ratio.number_format != "0.00":
            fail("Members %s: max ratio %r (%s), want %r as 0.00" % (m["id"], ratio.value, ratio.number_format, m["max_ratio"]))
        if row[col["Status"]].value != m["status"]:
            fail("Members %s: status %r" % (m["id"], row[col["Status"]].value))
        shaded = row[col["ID"]].fill.fgColor.rgb not in (None, "00000000")
        if shaded != (m["status"] != "pass"):
            fail("Members %s: shading %s for status %s" % (m["id"], shaded, m["status"]))
        if m["max_ratio"] > 1 and not ratio.font.b:
            fail("Members %s: ratio over 1.00 not bold" % m["id"])
    first = members[0]
    # 144 in = 12'-0" (12 in to the foot).
    if by_id[first["id"]][col["Spans (ft-in)"]].value != "12'-0\"":
        fail("Members %s: span text %r, want 12'-0\"" % (first["id"], by_id[first["id"]][col["Spans (ft-in)"]].value))
    tk = wb["Takeoff"]
    j = t["joists"][0]
    r2 = [c.value for c in tk[HEAD + 1]]
    if r2[0] != "Joists" or r2[1] != j["size"] or r2[4] != j["count"] or abs(r2[5] - j["board_feet"]) > 5e-7:  # board feet to 6 decimals
        fail("Takeoff row 2 %s, want joists %s" % (r2, j))
    notes = " ".join(str(c.value) for row in wb["Notes"].iter_rows() for c in row)
    if "does not replace engineering judgement" not in notes:
        fail("Notes: the caution is missing")
    print("  sheets", wb.sheetnames, {ws.title: ws.max_row for ws in wb.worksheets})


def check_uplift_sheet(ws, res):
    """Uplift sheet: one row per support line, its counts and sums equal to
    those of results.json's uplift bearings grouped here independently."""
    groups = {}
    for b in res["uplift"]["bearings"]:
        g = groups.setdefault(support_of(b) or "(support not known)", {"n": 0, "flagged": 0, "max": 0.0, "total": 0.0})
        g["n"] += 1
        g["flagged"] += 1 if b["flagged"] else 0
        g["max"] = max(g["max"], b["uplift_lb"])
        g["total"] += b["uplift_lb"]
    rows = list(ws.iter_rows(values_only=True))[TITLE_ROWS:]
    head = rows[0]
    col = {h: i for i, h in enumerate(head)}
    need = "Required connector capacity per bearing, ASD (lb)"
    for h in ("Support line", "Bearings with uplift", "Flagged", "Largest uplift (lb)", "Total uplift (lb)", need, "CD"):
        if h not in col:
            fail("Uplift: no column %r" % h)
            return
    data = rows[1:]
    if not groups:
        if len(data) != 1 or data[0][0] != "none":
            fail("Uplift: no uplift in results.json, sheet rows %r" % (data,))
        return
    if len(data) != len(groups):
        fail("Uplift: %d rows, results.json has %d support lines with uplift" % (len(data), len(groups)))
    for row in data:
        g = groups.get(row[col["Support line"]])
        if g is None:
            fail("Uplift: support line %r not in results.json" % (row[col["Support line"]],))
            continue
        got = (row[col["Bearings with uplift"]], row[col["Flagged"]])
        if got != (g["n"], g["flagged"]):
            fail("Uplift %s: counts %s, want %s" % (row[0], got, (g["n"], g["flagged"])))
        # results.json (schema 3) writes loads to 6 significant digits
        if abs(row[col["Largest uplift (lb)"]] - g["max"]) > 5e-6 * max(1, g["max"]) or \
                abs(row[col["Total uplift (lb)"]] - g["total"]) > 5e-6 * max(1, g["total"]):
            fail("Uplift %s: largest %r total %r, want %r %r" % (row[0], row[col["Largest uplift (lb)"]],
                                                                  row[col["Total uplift (lb)"]], g["max"], g["total"]))
        req = row[col[need]]
        # the largest uplift rounded up to the pound: a demand is never rounded down
        if g["flagged"] and (req is None or req != math.ceil(g["max"] - 1e-9)):
            fail("Uplift %s: required capacity %r, want the largest uplift %r rounded up" % (row[0], req, g["max"]))
        if not g["flagged"] and req not in (None, ""):
            fail("Uplift %s: required capacity %r for a line with no flagged bearing" % (row[0], req))
        if row[col["CD"]] != 1.6:
            fail("Uplift %s: CD %r, want 1.6 (wind, NDS 2018 Table 2.3.2)" % (row[0], row[col["CD"]]))
    print("  Uplift sheet: %d support lines agree with results.json" % len(groups))


def main():
    mode, out = sys.argv[1], sys.argv[2]
    {"dxf": check_dxf, "xlsx": check_xlsx}[mode](out)
    if failures:
        print("%d failure(s)" % len(failures))
        sys.exit(1)
    print("ok")


if __name__ == "__main__":
    main()
