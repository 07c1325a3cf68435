#!/usr/bin/python3
"""Write the bay fixtures with ezdxf, independently of framecheck's own
writer (bays_test.go draws the same plans itself).

Usage: /usr/bin/python3 gen_bays.py [OUTDIR]   (Debian python3-ezdxf 0.18.1)

One bay of floor joists, drawn once with every joist as its centre line
(ref) and again as a bay shown by a span symbol (framing/bays.go).
Laid out in inches:

  WALL          2x6 walls, two lines each: y = 0 and 5.5, y = 180 and
                185.5, x = 0..128
  JOIST         (ref) 9 joists x = 0, 16, ..., 128 from y = 0 to 185.5
  FRAMING-NOTE  the callout 2x10 @ 16" o.c.: (ref) on a line across the
                joists at y = 92; (span symbols) beside the span line
                x = 64, y = 5.5..180
  FRAMING-BAY   (outline) the bay's closed outline, x 0..128, y 5.5..180

Forms:
  ref         every joist drawn as its centre line
  outline     a closed LWPOLYLINE on FRAMING-BAY with the callout inside
  arrows      the span line with an arrowhead of two short lines at each end
  halfarrows  the span line with a half-arrow (one short line) at each end
  solid       the span line with SOLID arrowheads
  pwidth      the span line as one LWPOLYLINE whose end segments have a
              width tapering to 0 at the tips (arrowheads drawn by width)

Bad input, each with the ref bay as drawn plus a second bay 300 in above:
  noside      a bay outline with no wall at its top
  spacing     a span line whose callout reads 2x10 @ 99" O.C.
  drawn       a span line (callout 2x12 @ 16" o.c.) over 9 joists that
              are also drawn

Each form is written twice: plan_<form>.dxf in inches, and
turned_<form>.dxf turned 30 degrees about the origin and scaled to
millimetres ($INSUNITS 4) by ezdxf's own Matrix44 transform of every
entity; the bad-input plans in inches only. Deterministic: fixed
metadata, sequential handles, PYTHONHASHSEED=0.
"""
import math
import os
import sys

import ezdxf
from ezdxf.math import Matrix44

ezdxf.options.write_fixed_meta_data_for_testing = True

FORMS = ["ref", "outline", "arrows", "halfarrows", "solid", "pwidth"]
BAD = ["noside", "spacing", "drawn"]
CALLOUT = '2x10 @ 16" o.c.'
NOTE = "FRAMING-NOTE"


def draw(msp, form, bad):
    def line(layer, a, b):
        msp.add_line(a, b, dxfattribs={"layer": layer})

    def text(s, x, y):
        msp.add_text(s, dxfattribs={"layer": NOTE, "height": 4, "insert": (x, y)})

    def walls(dy, top=True):
        ys = (0, 5.5, 180, 185.5) if top else (0, 5.5)
        for y in ys:
            line("WALL", (0, dy + y), (128, dy + y))

    def outline(dy):
        msp.add_lwpolyline([(0, dy + 5.5), (128, dy + 5.5), (128, dy + 180), (0, dy + 180)],
                           close=True, dxfattribs={"layer": "FRAMING-BAY"})

    def span_line(dy, arrows):
        x, y0, y1 = 64, dy + 5.5, dy + 180
        if arrows == "pwidth":
            # x, y, start width, end width, bulge: the arrowheads are the
            # end segments, 4 in wide at their base and 0 at the tips
            msp.add_lwpolyline([(x, y0, 0, 4, 0), (x, y0 + 6, 0, 0, 0), (x, y1 - 6, 4, 0, 0), (x, y1, 0, 0, 0)],
                               format="xyseb", dxfattribs={"layer": NOTE})
            return
        line(NOTE, (x, y0), (x, y1))
        if arrows == "arrows":
            for dx in (-2, 2):
                line(NOTE, (x, y0), (x + dx, y0 + 6))
                line(NOTE, (x, y1), (x + dx, y1 - 6))
        elif arrows == "halfarrows":
            line(NOTE, (x, y0), (x + 3, y0 + 5.5))
            line(NOTE, (x, y1), (x - 3, y1 - 5.5))
        elif arrows == "solid":
            msp.add_solid([(x, y0), (x - 2, y0 + 6), (x + 2, y0 + 6)], dxfattribs={"layer": NOTE})
            msp.add_solid([(x, y1), (x - 2, y1 - 6), (x + 2, y1 - 6)], dxfattribs={"layer": NOTE})

    walls(0)
    if form == "ref":
        for i in range(9):
            line("JOIST", (16 * i, 0), (16 * i, 185.5))
        line(NOTE, (-6, 92), (134, 92))
        text(CALLOUT, 40, 95)
    elif form == "outline":
        outline(0)
        text(CALLOUT, 40, 95)
    else:
        span_line(0, form)
        text(CALLOUT, 67, 95)

    dy = 300
    if bad == "noside":
        walls(dy, top=False)
        outline(dy)
        text(CALLOUT, 40, dy + 95)
    elif bad == "spacing":
        walls(dy)
        span_line(dy, "arrows")
        text('2x10 @ 99" O.C.', 67, dy + 95)
    elif bad == "drawn":
        walls(dy)
        for i in range(9):
            line("JOIST", (16 * i, dy), (16 * i, dy + 185.5))
        span_line(dy, "arrows")
        text('2x12 @ 16" o.c.', 67, dy + 95)


def write(path, form, bad, units, m):
    doc = ezdxf.new("R2010")
    doc.units = units
    for ly in ("WALL", "JOIST", NOTE, "FRAMING-BAY"):
        doc.layers.new(ly)
    msp = doc.modelspace()
    draw(msp, form, bad)
    if m is not None:
        for e in msp:
            e.transform(m)
    doc.saveas(path)


def main():
    if os.environ.get("PYTHONHASHSEED") != "0":
        env = dict(os.environ, PYTHONHASHSEED="0")
        os.execve(sys.executable, [sys.executable] + sys.argv, env)
    out = sys.argv[1] if len(sys.argv) > 1 else os.path.dirname(os.path.abspath(__file__))
    os.makedirs(out, exist_ok=True)
    turn = Matrix44.chain(Matrix44.z_rotate(math.radians(30)), Matrix44.scale(25.4, 25.4, 25.4))
    for form in FORMS:
        for name, units, m in (("plan", 1, None), ("turned", 4, turn)):
            write(os.path.join(out, "%s_%s.dxf" % (name, form)), form, "", units, m)
    for bad in BAD:
        write(os.path.join(out, "bad_%s.dxf" % bad), "ref", bad, 1, None)


if __name__ == "__main__":
    main()
