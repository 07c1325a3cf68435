#!/usr/bin/python3
"""Write the dxfimport test fixtures with ezdxf, and beside each DXF a JSON
dump of what ezdxf itself reads back from that file.

Usage: /usr/bin/python3 gen_fixtures.py OUTDIR   (Debian python3-ezdxf 0.18.1)

The dump is ezdxf's reading, not ours: the DXF is written, then loaded again
with ezdxf.readfile, and each model-space entity is dumped in world
coordinates. Block references are expanded with ezdxf's own
Insert.multi_insert() (MINSERT grids) and Insert.virtual_entities() (block
transformation), recursively for nested blocks. Two rules are applied here on
top of ezdxf, because ezdxf leaves them to the caller:
  * entities on layer "0" inside a block take the layer of the INSERT (DXF
    rule; virtual_entities keeps "0");
  * \\U+XXXX escapes are decoded with ezdxf.decode_dxf_unicode (ezdxf keeps
    them in the text attribute).
OCS entities are dumped in world coordinates with ezdxf's OCS.to_wcs.
Coordinates are multiplied by ezdxf.units.conversion_factor(drawing units,
inches); a drawing without $INSUNITS (or 0) is dumped with factor 1.

The output is deterministic: ezdxf writes fixed dates and GUIDs when
ezdxf.options.write_fixed_meta_data_for_testing is set, handles are
sequential, the script re-runs itself with PYTHONHASHSEED=0 (ezdxf writes
the CLASSES section in set order), and the JSON is written with sorted keys
and rounded floats.
"""
import json
import math
import os
import sys

import ezdxf
from ezdxf import units
from ezdxf.math import Vec3
from ezdxf.tools.text import plain_mtext

ezdxf.options.write_fixed_meta_data_for_testing = True

MIRROR = (0, 0, -1)


def add_joist_blocks(doc):
    """Nested blocks: a bay of joists (inner) inserted twice, rotated and
    scaled, inside an outer block; entities on layer 0 and on own layers."""
    bay = doc.blocks.new("JBAY", base_point=(1, 2))
    bay.add_line((0, 0), (0, 120), dxfattribs={"layer": "0"})
    bay.add_line((16, 0), (16, 120), dxfattribs={"layer": "JOIST-BLK"})
    bay.add_text("J", dxfattribs={"layer": "0", "height": 2.5, "rotation": 30,
                                  "insert": (8, 60)})
    bay.add_circle((8, 10), 1.5, dxfattribs={"layer": "0"})
    bay.add_arc((8, 100), 3, 10, 120, dxfattribs={"layer": "0"})
    outer = doc.blocks.new("JFLOOR", base_point=(0, 0))
    outer.add_blockref("JBAY", (0, 0), dxfattribs={"layer": "0"})
    outer.add_blockref("JBAY", (40, 10), dxfattribs={
        "layer": "JOIST-NEST", "rotation": 90, "xscale": 2, "yscale": 2})
    outer.add_line((-5, -5), (60, -5), dxfattribs={"layer": "WALL-OUTER"})
    return bay, outer


def common_model(doc, msp, lw):
    """Entities every fixture has."""
    for name, color in (("JOIST", 3), ("WALL", 1), ("TEXT", 2),
                        ("JOIST-BLK", 4), ("JOIST-NEST", 5), ("WALL-OUTER", 6)):
        doc.layers.new(name, dxfattribs={"color": color})
    doc.layers.get("WALL").off()
    doc.layers.get("TEXT").freeze()
    msp.add_line((0, 0), (0, 144), dxfattribs={"layer": "JOIST"})
    msp.add_line((16, 0), (16, 144.25), dxfattribs={"layer": "JOIST"})
    msp.add_line((-3.5, -1.75), (200.125, -1.75), dxfattribs={"layer": "WALL"})
    msp.add_point((5, 5), dxfattribs={"layer": "JOIST"})
    msp.add_text("2x10 @ 16 o.c. 45%%d", dxfattribs={
        "layer": "TEXT", "height": 4, "insert": (10, 70), "rotation": 90})
    msp.add_text("Café 2×10 € ≥ 12", dxfattribs={
        "layer": "TEXT", "height": 3, "insert": (10, 20)})
    add_joist_blocks(doc)
    msp.add_blockref("JFLOOR", (300, 0), dxfattribs={"layer": "FLOOR-1"})
    msp.add_blockref("JFLOOR", (600, 50), dxfattribs={
        "layer": "FLOOR-2", "rotation": 33, "xscale": 0.5, "yscale": 0.5})
    # A MINSERT: 2 rows x 3 columns of the inner bay, rotated.
    m = msp.add_blockref("JBAY", (0, 400), dxfattribs={"layer": "MINS", "rotation": 15})
    m.grid(size=(2, 3), spacing=(150, 40))
    # Mirrored block reference (negative x scale).
    msp.add_blockref("JBAY", (-100, 0), dxfattribs={"layer": "MIRROR", "xscale": -1})
    if lw:
        msp.add_lwpolyline([(0, 0), (48, 0), (48, 96), (0, 96)], close=True,
                           dxfattribs={"layer": "LOAD-ZONE"})
        msp.add_lwpolyline([(100, 0, 0, 0, 0.5), (148, 0, 0, 0, 0), (148, 20)],
                           format="xyseb", dxfattribs={"layer": "JOIST"})
        # Mirrored OCS entities: extrusion (0, 0, -1).
        msp.add_lwpolyline([(10, 10), (30, 10, 0, 0, -0.25), (30, 40)], format="xyseb",
                           dxfattribs={"layer": "JOIST", "extrusion": MIRROR})
        msp.add_circle((50, 60), 5, dxfattribs={"layer": "JOIST", "extrusion": MIRROR})
        msp.add_arc((50, 60), 8, 20, 80, dxfattribs={"layer": "JOIST", "extrusion": MIRROR})
        msp.add_text("MIR", dxfattribs={"layer": "TEXT", "height": 2, "insert": (70, 5),
                                        "rotation": 10, "extrusion": MIRROR})
        msp.add_blockref("JBAY", (500, -200), dxfattribs={
            "layer": "MIRROR-OCS", "extrusion": MIRROR, "rotation": 20})
        msp.add_mtext("{\\fArial|b1;FLOOR} \\H1.5x;ZONE\\PD=15 psf\\~L=40\\S1^ 2; \\S3/4;in done\\P",
                      dxfattribs={"layer": "TEXT", "char_height": 3, "insert": (40, 50),
                                  "rotation": 45})
        msp.add_mtext("2nd floor \\U+00D8 10\\Pline\\\\two",
                      dxfattribs={"layer": "TEXT", "char_height": 2.5, "insert": (40, 80)})
    # Old-style 2D polyline (R12 has only this kind).
    msp.add_polyline2d([(200, 0), (264, 0), (264, 48)], dxfattribs={"layer": "BEAM"})
    p = msp.add_polyline2d([(300, 300), (400, 300), (400, 350)], dxfattribs={"layer": "ZONE"})
    p.close(True)
    msp.add_polyline2d([(0, -50), (50, -50)], dxfattribs={"layer": "BEAM", "elevation": (0, 0, 7)})


def wcs_angle(ocs, deg):
    v = ocs.to_wcs(Vec3.from_deg_angle(deg))
    return math.degrees(math.atan2(v.y, v.x)) % 360


def dump_entity(e, layer, src, k, out):
    """Append e (a real or virtual entity) to out, world inches."""
    t = e.dxftype()
    d = {"type": t, "layer": layer, "from": src}

    def pts(ps):
        return [[p.x * k, p.y * k] for p in ps]

    if t == "LINE":
        d["points"] = pts([e.dxf.start, e.dxf.end])
    elif t == "POINT":
        d["points"] = pts([e.dxf.location])
    elif t in ("CIRCLE", "ARC"):
        ocs = e.ocs()
        d["points"] = pts([ocs.to_wcs(e.dxf.center)])
        d["radius"] = e.dxf.radius * k
        if t == "ARC":
            c = ocs.to_wcs(e.dxf.center)
            a = [math.degrees(math.atan2(p.y - c.y, p.x - c.x)) % 360
                 for p in (e.start_point, e.end_point)]
            if e.dxf.extrusion.z < 0:  # CCW in OCS is CW in the world
                a.reverse()
            d["start"], d["end"] = a
    elif t == "TEXT":
        ocs = e.ocs()
        d["points"] = pts([ocs.to_wcs(e.dxf.insert)])
        d["text"] = ezdxf.decode_dxf_unicode(e.plain_text())
        d["height"] = e.dxf.height * k
        d["rotation"] = wcs_angle(ocs, e.dxf.rotation)
    elif t == "MTEXT":
        d["points"] = pts([e.dxf.insert])
        d["text"] = plain_mtext(ezdxf.decode_dxf_unicode(e.text))
        d["height"] = e.dxf.char_height * k
        d["rotation"] = e.get_rotation() % 360
    elif t == "LWPOLYLINE":
        sign = -1 if e.dxf.extrusion.z < 0 else 1
        d["points"] = pts(e.vertices_in_wcs())
        b = [sign * v[2] for v in e.get_points("xyb")]
        d["bulges"] = b if any(b) else None
        d["closed"] = e.closed
    elif t == "POLYLINE":
        ocs = e.ocs()
        sign = -1 if e.dxf.extrusion.z < 0 else 1
        d["points"] = pts(ocs.points_to_wcs(v.dxf.location for v in e.vertices))
        b = [sign * v.dxf.bulge for v in e.vertices]
        d["bulges"] = b if any(b) else None
        d["closed"] = e.is_closed
        d["type"] = "POLYLINE"
    else:
        return
    out.append(d)


def expand(insert, layer, src, k, out):
    """Expand a block reference with ezdxf, nested blocks first-in-order."""
    eff = layer if insert.dxf.layer == "0" else insert.dxf.layer
    singles = list(insert.multi_insert()) if insert.mcount > 1 else [insert]
    for ins in singles:
        for v in ins.virtual_entities():
            if v.dxftype() == "INSERT":
                expand(v, eff, src, k, out)
            else:
                lay = eff if v.dxf.layer == "0" else v.dxf.layer
                dump_entity(v, lay, src, k, out)


def dump(path):
    doc = ezdxf.readfile(path)
    ins = doc.header.get("$INSUNITS", 0)
    if ins in (1, 2, 4, 5, 6):
        k = units.conversion_factor(ins, units.InsertUnits.Inches)
        uname = {1: "in", 2: "ft", 4: "mm", 5: "cm", 6: "m"}[ins]
    else:
        k, uname = 1.0, ""
    ents = []
    for e in doc.modelspace():
        if e.dxftype() == "INSERT":
            expand(e, "0", e.dxf.handle, k, ents)
        else:
            n = len(ents)
            dump_entity(e, e.dxf.layer, "", k, ents)
            if len(ents) > n:
                ents[-1]["handle"] = e.dxf.handle
    layers = [{"name": l.dxf.name, "color": abs(l.dxf.color), "on": l.is_on(),
               "frozen": l.is_frozen()} for l in doc.layers]
    return {
        "version": doc.dxfversion,
        "insunits": ins,
        "units": uname,
        "to_inch": k,
        "layers": sorted(layers, key=lambda l: l["name"].upper()),
        "entities": ents,
    }


def rounded(o):
    if isinstance(o, float):
        r = round(o, 9)
        return 0.0 if r == 0 else r
    if isinstance(o, list):
        return [rounded(x) for x in o]
    if isinstance(o, dict):
        return {key: rounded(v) for key, v in o.items()}
    return o


FIXTURES = [
    # name, DXF version, $INSUNITS (None: leave the header without it)
    ("r12_nounits", "R12", None),
    ("r2000_mm", "R2000", 4),
    ("r2018_ft", "R2018", 2),
]


def main():
    # ezdxf writes the CLASSES section from a set, whose order follows
    # Python's string hash; fix the hash seed so the DXF is reproducible.
    if os.environ.get("PYTHONHASHSEED") != "0":
        env = dict(os.environ, PYTHONHASHSEED="0")
        os.execve(sys.executable, [sys.executable] + sys.argv, env)
    out = sys.argv[1] if len(sys.argv) > 1 else os.path.dirname(os.path.abspath(__file__))
    os.makedirs(out, exist_ok=True)
    for name, ver, ins in FIXTURES:
        doc = ezdxf.new(ver)
        if ins is not None:
            doc.units = ins
        common_model(doc, doc.modelspace(), lw=ver != "R12")
        path = os.path.join(out, name + ".dxf")
        doc.saveas(path)
        with open(os.path.join(out, name + ".json"), "w", encoding="utf-8") as f:
            json.dump(rounded(dump(path)), f, indent=1, sort_keys=True, ensure_ascii=False)
            f.write("\n")


if __name__ == "__main__":
    main()
