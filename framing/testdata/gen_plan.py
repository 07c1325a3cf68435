#!/usr/bin/python3
"""Write framing's end-to-end fixture plan_ft.dxf with ezdxf.

Usage: /usr/bin/python3 gen_plan.py [OUTDIR]   (Debian python3-ezdxf 0.18.1)

A small floor framing plan drawn in feet ($INSUNITS = 2), laid out here in
inches and divided by 12 when written, so the reader's unit conversion is
part of the test. Layout (inches, before /12):

  WALL        double-line 2x6 wall, lines at y = 0 and y = 5.5, x -12..240
  WALL        single-line bearing wall at y = 150
  BEAM-FLUSH  flush beam at y = 300 (joists hang in hangers)
  JOIST       block JBAY3 (3 joists on layer 0 at x = 0, 16, 32, y 0..300)
              inserted on layer JOIST at x = 0 and x = 48; then x = 96 as a
              2-vertex LWPOLYLINE and x = 112 as a 3-vertex collinear
              POLYLINE, y 0..300
  JOIST-CANT  x = 128, 144, 160, y 0..180 (30 in past the wall at 150)
  LOAD-ZONE   FLOOR outline (-24,-24)-(250,170) named by MTEXT,
              DECK outline (-24,170)-(250,320) named by TEXT
  FRAMING-NOTE span line (-8,75)-(120,75) with text 2X12 @ 16" O.C. on it,
              and a note "SEE NOTE 3" that is not a callout
  BLOCKING    line (120,75)-(168,75) across the cantilevered joists
  A-ANNO      a text on a layer with no role

The expected members are worked out by hand in ../fixture_test.go.
"""
import os
import sys

import ezdxf

ezdxf.options.write_fixed_meta_data_for_testing = True

FT = 1 / 12.0


def p(x, y):
    return (x * FT, y * FT)


def main():
    out = sys.argv[1] if len(sys.argv) > 1 else os.path.dirname(os.path.abspath(__file__))
    doc = ezdxf.new("R2010")
    doc.units = 2  # feet
    for name in ("WALL", "BEAM-FLUSH", "JOIST", "JOIST-CANT", "LOAD-ZONE",
                 "FRAMING-NOTE", "BLOCKING", "A-ANNO"):
        doc.layers.new(name)
    msp = doc.modelspace()
    for y in (0, 5.5, 150):
        msp.add_line(p(-12, y), p(240, y), dxfattribs={"layer": "WALL"})
    msp.add_line(p(-12, 300), p(240, 300), dxfattribs={"layer": "BEAM-FLUSH"})

    bay = doc.blocks.new("JBAY3", base_point=(0, 0))
    for x in (0, 16, 32):
        bay.add_line(p(x, 0), p(x, 300), dxfattribs={"layer": "0"})
    for x in (0, 48):
        msp.add_blockref("JBAY3", p(x, 0), dxfattribs={"layer": "JOIST"})
    msp.add_lwpolyline([p(96, 0), p(96, 300)], dxfattribs={"layer": "JOIST"})
    msp.add_polyline2d([p(112, 0), p(112, 120), p(112, 300)], dxfattribs={"layer": "JOIST"})
    for x in (128, 144, 160):
        msp.add_line(p(x, 0), p(x, 180), dxfattribs={"layer": "JOIST-CANT"})

    msp.add_lwpolyline([p(-24, -24), p(250, -24), p(250, 170), p(-24, 170)], close=True,
                       dxfattribs={"layer": "LOAD-ZONE"})
    msp.add_mtext("FLOOR", dxfattribs={"layer": "LOAD-ZONE", "insert": p(200, 20),
                                       "char_height": 6 * FT})
    msp.add_lwpolyline([p(-24, 170), p(250, 170), p(250, 320), p(-24, 320)], close=True,
                       dxfattribs={"layer": "LOAD-ZONE"})
    msp.add_text("DECK", dxfattribs={"layer": "LOAD-ZONE", "insert": p(200, 250),
                                     "height": 6 * FT})

    msp.add_line(p(-8, 75), p(120, 75), dxfattribs={"layer": "FRAMING-NOTE"})
    msp.add_text('2X12 @ 16" O.C.', dxfattribs={"layer": "FRAMING-NOTE", "insert": p(20, 76),
                                                "height": 4 * FT})
    msp.add_text("SEE NOTE 3", dxfattribs={"layer": "FRAMING-NOTE", "insert": p(400, 400),
                                           "height": 4 * FT})
    msp.add_line(p(120, 75), p(168, 75), dxfattribs={"layer": "BLOCKING"})
    msp.add_text("FLOOR FRAMING PLAN", dxfattribs={"layer": "A-ANNO", "insert": p(0, -60),
                                                   "height": 8 * FT})
    doc.saveas(os.path.join(out, "plan_ft.dxf"))


if __name__ == "__main__":
    main()
