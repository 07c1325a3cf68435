#!/usr/bin/python3
"""Write the structural composite lumber fixture scl.dxf with ezdxf,
independently of framecheck's own writer.

Usage: /usr/bin/python3 gen_scl.py [OUTDIR]   (Debian python3-ezdxf 0.18.1)

Laid out in inches ($INSUNITS = 1):

  WALL          single-line bearing walls on x = 0 and x = 288 (y -20..164)
  JOIST         8 joists at y = 16..128 (16 in o.c.) from x = 0 to the
                beam's centre line x = 144, and 8 from there to x = 288
  BEAM-DROP     the beam: one LINE on x = 144 from y = 0 to y = 144
  POST          its posts: CIRCLEs r 2.75 at (144, 0) and (144, 144)
  FRAMING-NOTE  "1 3/4 x 14 LVL (2)" TEXT at (147, 100): two plies of a
                user material named LVL in scl-materials.csv
  POINT-LOAD    a post above, drawn as a closed LWPOLYLINE 3.5 x 3.5
                centred on the beam at (144, 56), with "P: 1200 D, 800 L"
                at (148, 57); a post above drawn as 4 LINEs 3.5 x 3.5
                centred on the beam at (144, 88) with no text (an error
                naming its handle, never a load of zero)

A bay of LVL joists called out on the plan (issue 17 item 4):

  WALL          single-line bearing walls on x = 400 and x = 592 (y 0..96)
  JOIST         5 joists at y = 16..80 (16 in o.c.) from x = 400 to 592
  FRAMING-NOTE  a label line on x = 420 from y = 8 to 88 crossing them, and
                '1 3/4 x 11 7/8 LVL @ 16" O.C.' TEXT at (423, 40): the
                joists are LVL of scl-materials.csv, 1.75 x 11.875 in

and a bay whose callout gives a size in actual inches with no material:

  WALL          single-line bearing walls on x = 700 and x = 892 (y 0..64)
  JOIST         3 joists at y = 16..48 (16 in o.c.) from x = 700 to 892
  FRAMING-NOTE  a label line on x = 720 from y = 8 to 56, and
                "1 3/4 x 9 1/2 @ 16" TEXT at (723, 30): an error on the
                three joists naming the text's handle, never a default

Deterministic: fixed metadata, sequential handles, PYTHONHASHSEED=0.
"""
import os
import sys

import ezdxf

ezdxf.options.write_fixed_meta_data_for_testing = True


def main():
    if os.environ.get("PYTHONHASHSEED") != "0":  # the order of the OBJECTS section follows string hashing
        env = dict(os.environ, PYTHONHASHSEED="0")
        os.execve(sys.executable, [sys.executable] + sys.argv, env)
    out = sys.argv[1] if len(sys.argv) > 1 else os.path.dirname(os.path.abspath(__file__))
    os.makedirs(out, exist_ok=True)
    doc = ezdxf.new("R2010")
    doc.units = 1  # inches
    for name in ("WALL", "JOIST", "BEAM-DROP", "POST", "FRAMING-NOTE", "POINT-LOAD"):
        doc.layers.new(name)
    msp = doc.modelspace()

    def line(layer, a, b):
        msp.add_line(a, b, dxfattribs={"layer": layer})

    def text(layer, s, at, h):
        msp.add_text(s, dxfattribs={"layer": layer, "height": h, "insert": at})

    line("WALL", (0, -20), (0, 164))
    line("WALL", (288, -20), (288, 164))
    y = 16
    while y <= 128:
        line("JOIST", (0, y), (144, y))
        line("JOIST", (144, y), (288, y))
        y += 16
    line("BEAM-DROP", (144, 0), (144, 144))
    msp.add_circle((144, 0), 2.75, dxfattribs={"layer": "POST"})
    msp.add_circle((144, 144), 2.75, dxfattribs={"layer": "POST"})
    text("FRAMING-NOTE", "1 3/4 x 14 LVL (2)", (147, 100), 3)
    msp.add_lwpolyline([(142.25, 54.25), (145.75, 54.25), (145.75, 57.75), (142.25, 57.75)], close=True,
                       dxfattribs={"layer": "POINT-LOAD"})
    text("POINT-LOAD", "P: 1200 D, 800 L", (148, 57), 3)
    x0, y0 = 142.25, 86.25
    for a, b in (((x0, y0), (x0 + 3.5, y0)), ((x0 + 3.5, y0), (x0 + 3.5, y0 + 3.5)),
                 ((x0 + 3.5, y0 + 3.5), (x0, y0 + 3.5)), ((x0, y0 + 3.5), (x0, y0))):
        line("POINT-LOAD", a, b)
    line("WALL", (400, 0), (400, 96))
    line("WALL", (592, 0), (592, 96))
    for y in (16, 32, 48, 64, 80):
        line("JOIST", (400, y), (592, y))
    line("FRAMING-NOTE", (420, 8), (420, 88))
    text("FRAMING-NOTE", '1 3/4 x 11 7/8 LVL @ 16" O.C.', (423, 40), 3)
    line("WALL", (700, 0), (700, 64))
    line("WALL", (892, 0), (892, 64))
    for y in (16, 32, 48):
        line("JOIST", (700, y), (892, y))
    line("FRAMING-NOTE", (720, 8), (720, 56))
    text("FRAMING-NOTE", "1 3/4 x 9 1/2 @ 16", (723, 30), 3)
    doc.saveas(os.path.join(out, "scl.dxf"))


if __name__ == "__main__":
    main()
