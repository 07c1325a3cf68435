#!/usr/bin/python3
"""Write the drawing-convention fixtures with ezdxf, independently of
framecheck's own writer (conventions_test.go draws the same plan itself).

Usage: /usr/bin/python3 gen_conventions.py [OUTDIR]   (Debian python3-ezdxf 0.18.1)

One floor plan, drawn once with single centre lines (ref) and again in
each convention framecheck reads (DOMAIN.md "Drawings as people draw
them"). Laid out in inches:

  WALL       2x6 walls y = 0..5.5 and 300..305.5, x -12..140, and one
             parallel to the joists, x = -18.75..-13.25, y -12..317.5
  BEAM-DROP  a 3-ply dropped beam y = 150..154.5
  JOIST      9 joists x = 0, 16, ..., 128 from y = 0.5 to 305, 1.5 in thick
  BLOCKING   a row across the joists at y = 75, pieces staggered at
             y = 220 / 223 bay by bay

Variants:
  ref        centre lines, supports as two lines each, blocking on BLOCKING
  lines4     each joist a rectangle of 4 LINEs
  lwpoly     each joist a closed 4-vertex LWPOLYLINE
  poly2d     each joist a closed 4-vertex POLYLINE (VERTEX/SEQEND)
  pair       each joist two parallel lines, no end caps
  many       the beam as 4 lines (its plies), the wall at 300 as 4 lines
             (sheathing and plates) with two door swings (ARC), ticks and
             the wall's end on its layer
  joistblk   the blocking as pieces on the JOIST layer, in line and staggered
  all        lines4 + many + joistblk
  notrect    lines4, but joist x = 32 drawn tapered (4 LINEs, 1.5 in wide
             at y = 0.5 and 5.5 in at y = 305) and joist x = 80 a closed
             5-vertex LWPOLYLINE with a pointed end: each named by handle,
             the other seven joists as in ref

Each is written twice: plan_<variant>.dxf in inches, and
turned_<variant>.dxf turned 30 degrees about the origin and scaled to
millimetres ($INSUNITS 4) by ezdxf's own Matrix44 transform of every
entity. Deterministic: fixed metadata, sequential handles,
PYTHONHASHSEED=0.
"""
import math
import os
import sys

import ezdxf
from ezdxf.math import Matrix44

ezdxf.options.write_fixed_meta_data_for_testing = True

N, OC, Y0, Y1, HALF = 9, 16.0, 0.5, 305.0, 0.75
XL, XR = -12.0, 140.0
VARIANTS = ["ref", "lines4", "lwpoly", "poly2d", "pair", "many", "joistblk", "all", "notrect"]


def draw(msp, variant):
    joists = {"lines4": "lines4", "lwpoly": "lwpoly", "poly2d": "poly2d", "pair": "pair",
              "all": "lines4", "notrect": "lines4"}.get(variant, "centre")
    many = variant in ("many", "all")
    joistblk = variant in ("joistblk", "all")

    def line(layer, a, b):
        msp.add_line(a, b, dxfattribs={"layer": layer})

    def hline(layer, y):
        line(layer, (XL, y), (XR, y))

    for y in (0, 5.5):
        hline("WALL", y)
    for y in ((150, 151.5, 153, 154.5) if many else (150, 154.5)):
        hline("BEAM-DROP", y)
    if many:
        for y in (300, 300.5, 305, 305.5):
            hline("WALL", y)
        msp.add_arc((40, 305.5), 32, 0, 90, dxfattribs={"layer": "WALL"})
        msp.add_arc((88, 305.5), 30, 90, 180, dxfattribs={"layer": "WALL"})
        line("WALL", (62, 301), (66, 305))
        line("WALL", (6, 299), (10, 303))
        line("WALL", (XR, 300), (XR, 305.5))
    else:
        for y in (300, 305.5):
            hline("WALL", y)
    # a 2x6 wall parallel to the joists, its mid-line 16 in west of the
    # first: that joist's edge strip bears on it
    for x in (-18.75, -13.25):
        line("WALL", (x, -12), (x, 317.5))

    for i in range(N):
        x = i * OC
        corners = [(x - HALF, Y0), (x + HALF, Y0), (x + HALF, Y1), (x - HALF, Y1)]
        if variant == "notrect" and x == 32:
            corners = [(x - HALF, Y0), (x + HALF, Y0), (x + 4.75, Y1), (x - HALF, Y1)]
            for k in range(4):
                line("JOIST", corners[k], corners[(k + 1) % 4])
            continue
        if variant == "notrect" and x == 80:
            pts = [(x - HALF, Y0), (x + HALF, Y0), (x + HALF, Y1 - 6), (x, Y1), (x - HALF, Y1 - 6)]
            msp.add_lwpolyline(pts, close=True, dxfattribs={"layer": "JOIST"})
            continue
        if joists == "centre":
            line("JOIST", (x, Y0), (x, Y1))
        elif joists == "lines4":
            for k in range(4):
                line("JOIST", corners[k], corners[(k + 1) % 4])
        elif joists == "lwpoly":
            msp.add_lwpolyline(corners, close=True, dxfattribs={"layer": "JOIST"})
        elif joists == "poly2d":
            msp.add_polyline2d(corners, close=True, dxfattribs={"layer": "JOIST"})
        elif joists == "pair":
            line("JOIST", corners[0], corners[3])
            line("JOIST", corners[2], corners[1])

    layer = "JOIST" if joistblk else "BLOCKING"
    if not joistblk:
        line("BLOCKING", (-2, 75), (130, 75))
    for i in range(N - 1):
        x = i * OC
        if joistblk:
            line("JOIST", (x + HALF, 75), (x + OC - HALF, 75))
        yb = 220 + 3 * (i % 2)
        line(layer, (x + HALF, yb), (x + OC - HALF, yb))


def main():
    if os.environ.get("PYTHONHASHSEED") != "0":
        env = dict(os.environ, PYTHONHASHSEED="0")
        os.execve(sys.executable, [sys.executable] + sys.argv, env)
    out = sys.argv[1] if len(sys.argv) > 1 else os.path.dirname(os.path.abspath(__file__))
    os.makedirs(out, exist_ok=True)
    turn = Matrix44.chain(Matrix44.z_rotate(math.radians(30)), Matrix44.scale(25.4, 25.4, 25.4))
    for variant in VARIANTS:
        for name, units, m in (("plan", 1, None), ("turned", 4, turn)):
            doc = ezdxf.new("R2010")
            doc.units = units
            for ly in ("WALL", "BEAM-DROP", "JOIST", "BLOCKING"):
                doc.layers.new(ly)
            msp = doc.modelspace()
            draw(msp, variant)
            if m is not None:
                for e in msp:
                    e.transform(m)
            doc.saveas(os.path.join(out, "%s_%s.dxf" % (name, variant)))


if __name__ == "__main__":
    main()
