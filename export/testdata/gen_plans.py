"""Generate the DXF inputs for the export package's annotation tests.

Run with Debian's ezdxf (0.18.1):

    /usr/bin/python3 export/testdata/gen_plans.py export/testdata

It writes plan_r12.dxf (AC1009, inches) and plan_r2000.dxf (AC1015, feet).
The outputs are committed so the Go tests need no Python. Both plans hold
the same small floor: four joists on JOIST-FLOOR between two walls, one
polyline outline, a text, a circle and a block insert, so the annotator
has more than LINEs to pass through unchanged.
"""

import os
import sys

import ezdxf


def build(version, units, scale):
    doc = ezdxf.new(version)
    if version != "R12":
        doc.header["$INSUNITS"] = units
    doc.layers.add("JOIST-FLOOR", color=3)
    doc.layers.add("WALL", color=7)
    doc.layers.add("NOTE", color=2)
    blk = doc.blocks.new(name="POST")
    blk.add_circle((0, 0), 1.75 * scale)
    msp = doc.modelspace()
    s = scale  # inches -> drawing units
    # Walls at x = 0 and x = 144 in, 64 in long.
    msp.add_line((0, 0), (0, 64 * s), dxfattribs={"layer": "WALL"})
    msp.add_line((144 * s, 0), (144 * s, 64 * s), dxfattribs={"layer": "WALL"})
    for i in range(4):
        y = (8 + 16 * i) * s
        msp.add_line((0, y), (144 * s, y), dxfattribs={"layer": "JOIST-FLOOR"})
    outline = [(-6 * s, -6 * s), (150 * s, -6 * s), (150 * s, 70 * s), (-6 * s, 70 * s)]
    if version == "R12":
        msp.add_polyline2d(outline, close=True, dxfattribs={"layer": "NOTE"})
    else:
        msp.add_lwpolyline(outline, close=True, dxfattribs={"layer": "NOTE"})
    msp.add_text("FLOOR 1", dxfattribs={"layer": "NOTE", "height": 4 * s}).set_pos((10 * s, 74 * s))
    msp.add_circle((72 * s, 80 * s), 3 * s, dxfattribs={"layer": "NOTE"})
    msp.add_blockref("POST", (72 * s, -12 * s), dxfattribs={"layer": "NOTE"})
    return doc


def main():
    out = sys.argv[1] if len(sys.argv) > 1 else os.path.dirname(os.path.abspath(__file__))
    build("R12", 1, 1.0).saveas(os.path.join(out, "plan_r12.dxf"))
    build("R2000", 2, 1.0 / 12.0).saveas(os.path.join(out, "plan_r2000.dxf"))


if __name__ == "__main__":
    main()
