#!/usr/bin/python3
"""Write framing's load-path fixture loadpath.dxf with ezdxf, independently
of framecheck's own writer (../beams_test.go draws the same plan itself in
loadPathPlan; keep the two alike).

Usage: /usr/bin/python3 gen_loadpath.py [OUTDIR]   (Debian python3-ezdxf 0.18.1)

Laid out in inches ($INSUNITS = 1):

  WALL          single-line bearing walls on y = 0 and y = 288 (x -20..300),
                on x = 0 (y -20..300) and on y = 500 (x -20..100)
  JOIST         8 joists at x = 16..128 from y = 0 to the flush beam's
                centre line y = 144, 8 from there to y = 288, and 4 at
                x = 16..64 from the header (y = 400) to y = 500
  BEAM-FLUSH    the flush beam: 4 LINEs (3 plies of 2x, 4.5 in) at
                y = 141.75, 143.25, 144.75, 146.25 from x = 0 to 198.25
  BEAM-DROP     the girder: 4 LINEs, sides x = 198.25 and 201.75 from
                y = 72 to 216 and end caps; the header: one line on
                y = 400, x 0..72; a loose beam on y = 600, x 0..100
  POST          the girder's posts: a CIRCLE r 2.75 at (200, 72) with the
                TEXT "6x6" beside it, and block POSTSYM (a circle and a
                cross on layer 0) inserted at (200, 216) on layer POST; the
                header's posts: a closed LWPOLYLINE 3.5 x 3.5 centred at
                (1.75, 400) and 4 LINEs 3.5 x 3.5 centred at (70.25, 400)
  FRAMING-NOTE  "(3) 2x12" TEXT at (150, 150); MTEXT
                "5 1/8 x 12 GLB 24F-1.8E" at (206, 150); "4x12" at (40, 396)
  POINT-LOAD    POINT (64, 72) with "P: 1200 D, 800 L"; CIRCLE (96, 216)
                with "RTU-1"; POINT (250, 600) with "P: 500 D" (on no
                member); POINT (32, 100) with "P: lots D" (unreadable)

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
    for name in ("WALL", "JOIST", "BEAM-FLUSH", "BEAM-DROP", "POST", "FRAMING-NOTE", "POINT-LOAD"):
        doc.layers.new(name)
    msp = doc.modelspace()

    def line(layer, a, b):
        msp.add_line(a, b, dxfattribs={"layer": layer})

    def text(layer, s, at, h):
        msp.add_text(s, dxfattribs={"layer": layer, "height": h, "insert": at})

    line("WALL", (-20, 0), (300, 0))
    line("WALL", (-20, 288), (300, 288))
    line("WALL", (0, -20), (0, 300))
    x = 16
    while x <= 128:
        line("JOIST", (x, 0), (x, 144))
        line("JOIST", (x, 144), (x, 288))
        x += 16
    for y in (141.75, 143.25, 144.75, 146.25):
        line("BEAM-FLUSH", (0, y), (198.25, y))
    text("FRAMING-NOTE", "(3) 2x12", (150, 150), 4)
    line("BEAM-DROP", (198.25, 72), (198.25, 216))
    line("BEAM-DROP", (201.75, 72), (201.75, 216))
    line("BEAM-DROP", (198.25, 72), (201.75, 72))
    line("BEAM-DROP", (198.25, 216), (201.75, 216))
    msp.add_mtext("5 1/8 x 12 GLB 24F-1.8E", dxfattribs={"layer": "FRAMING-NOTE", "char_height": 4, "insert": (206, 150)})
    msp.add_circle((200, 72), 2.75, dxfattribs={"layer": "POST"})
    text("POST", "6x6", (204, 70), 3)
    sym = doc.blocks.new("POSTSYM", base_point=(0, 0))
    sym.add_circle((0, 0), 2.75, dxfattribs={"layer": "0"})
    sym.add_line((-2.75, 0), (2.75, 0), dxfattribs={"layer": "0"})
    sym.add_line((0, -2.75), (0, 2.75), dxfattribs={"layer": "0"})
    msp.add_blockref("POSTSYM", (200, 216), dxfattribs={"layer": "POST"})

    line("BEAM-DROP", (0, 400), (72, 400))
    text("FRAMING-NOTE", "4x12", (40, 396), 4)
    msp.add_lwpolyline([(0, 398.25), (3.5, 398.25), (3.5, 401.75), (0, 401.75)], close=True, dxfattribs={"layer": "POST"})
    x0, y0 = 68.5, 398.25
    for a, b in (((x0, y0), (x0 + 3.5, y0)), ((x0 + 3.5, y0), (x0 + 3.5, y0 + 3.5)),
                 ((x0 + 3.5, y0 + 3.5), (x0, y0 + 3.5)), ((x0, y0 + 3.5), (x0, y0))):
        line("POST", a, b)
    line("WALL", (-20, 500), (100, 500))
    for x in (16, 32, 48, 64):
        line("JOIST", (x, 400), (x, 500))
    line("BEAM-DROP", (0, 600), (100, 600))

    msp.add_point((64, 72), dxfattribs={"layer": "POINT-LOAD"})
    text("POINT-LOAD", "P: 1200 D, 800 L", (66, 73), 3)
    msp.add_circle((96, 216), 1, dxfattribs={"layer": "POINT-LOAD"})
    text("POINT-LOAD", "RTU-1", (98, 217), 3)
    msp.add_point((250, 600), dxfattribs={"layer": "POINT-LOAD"})
    text("POINT-LOAD", "P: 500 D", (252, 601), 3)
    msp.add_point((32, 100), dxfattribs={"layer": "POINT-LOAD"})
    text("POINT-LOAD", "P: lots D", (34, 101), 3)
    doc.saveas(os.path.join(out, "loadpath.dxf"))


if __name__ == "__main__":
    main()
