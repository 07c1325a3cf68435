#!/usr/bin/python3
"""Write mm_plan.dxf: a house-sized second-floor framing plan in millimetres,
drawn the way a CAD user draws one, on layers of the user's own naming.

Run with Debian's ezdxf: /usr/bin/python3 gen_mm_plan.py [OUT.dxf]

Plan (x east, y north, mm, $INSUNITS 4):
  * 9144 x 7315.2 footprint (30 ft x 24 ft).
  * S-WALL-BRG: double-line bearing walls. South wall y 0 / 139.7 and north
    wall y 7175.5 / 7315.2 (2x6 walls, 139.7 mm thick) full width; interior
    wall y 3600 / 3688.9 (2x4, 88.9 mm) under the west bay, x 0 to 4267.
  * S-BEAM: a flush beam (single line, its centre-line) at y 3644.45 under the
    east bay, x 4200 to 9144; a stair-opening header at y 4500 between the
    inner lines of the doubled trimmers, x 870 to 2012.95.
  * S-JOIS: 2x10 joists at 406.4 mm (16 in) centres as 2-vertex LWPOLYLINEs.
    West bay (k = 0..10, x = 19.05 + 406.4 k): full length, y 0 to 7315.2,
    continuous over the interior wall; k = 3, 4 are tail joists, y 0 to the
    header at 4500; k = 2 and 5 are trimmers, each doubled by a second line
    38.1 mm inside the opening. East bay south half (k = 11..22): y 0 to the
    flush beam at 3644.45; every other one drawn from the beam end back to the
    wall (right-to-left in the drawing's sense).
  * Block JST-N: 12 joists drawn along +x, 3670.75 mm long, at 406.4 mm
    centres; inserted at (9124.95, 3644.45) rotated 90 degrees, so they run
    from the flush beam to the north wall at x = 9124.95 - 406.4 j.
  * A-WALL: the east and west end walls (not bearing); S-RIM: rim boards.
  * A-ANNO: an MTEXT size callout with formatting codes and a room name.
  * No load-zone outlines.
"""
import sys

import ezdxf

OUT = sys.argv[1] if len(sys.argv) > 1 else "mm_plan.dxf"

W = 9144.0  # 30 ft
D = 7315.2  # 24 ft
SP = 406.4  # 16 in
X0 = 19.05  # first joist centre, 3/4 in in from the west face

doc = ezdxf.new("R2013", setup=False)
doc.header["$INSUNITS"] = 4
doc.header["$MEASUREMENT"] = 1
doc.header["$LUNITS"] = 2
for name, colour in [("S-JOIS", 3), ("S-WALL-BRG", 1), ("S-BEAM", 5),
                     ("A-ANNO", 7), ("A-WALL", 8), ("S-RIM", 4)]:
    doc.layers.add(name, color=colour)
msp = doc.modelspace()


def line(a, b, layer):
    msp.add_line(a, b, dxfattribs={"layer": layer})


def joist(a, b, space=None):
    (space or msp).add_lwpolyline([a, b], dxfattribs={"layer": "S-JOIS"})


# Bearing walls, double-line.
for y in (0.0, 139.7, D - 139.7, D):
    line((0, y), (W, y), "S-WALL-BRG")
for y in (3600.0, 3688.9):
    line((0, y), (4267, y), "S-WALL-BRG")
# End walls (not bearing) and rims.
for x in (0.0, 139.7, W - 139.7, W):
    line((x, 0), (x, D), "A-WALL")
for y in (19.05, D - 19.05):
    line((0, y), (W, y), "S-RIM")

# Flush beam centre-line and stair header.
BEAM_Y = 3644.45
HEADER_Y = 4500.0
line((4200, BEAM_Y), (W, BEAM_Y), "S-BEAM")
line((870.0, HEADER_Y), (2012.95, HEADER_Y), "S-BEAM")

# West bay.
for k in range(0, 11):
    x = X0 + SP * k
    if k in (3, 4):
        joist((x, 0), (x, HEADER_Y))  # tail joists
    else:
        joist((x, D), (x, 0)) if k % 2 else joist((x, 0), (x, D))
# Doubled trimmers: second line inside the opening.
joist((X0 + SP * 2 + 38.1, 0), (X0 + SP * 2 + 38.1, D))
joist((X0 + SP * 5 - 38.1, D), (X0 + SP * 5 - 38.1, 0))

# East bay, south half: wall to flush beam; odd ones drawn beam to wall.
for k in range(11, 23):
    x = X0 + SP * k
    if k % 2:
        joist((x, BEAM_Y), (x, 0))
    else:
        joist((x, 0), (x, BEAM_Y))

# East bay, north half: a block of joists drawn along +x, inserted rotated.
blk = doc.blocks.new("JST-N")
L_N = D - BEAM_Y
for j in range(12):
    blk.add_lwpolyline([(0, SP * j), (L_N, SP * j)], dxfattribs={"layer": "S-JOIS"})
msp.add_blockref("JST-N", (W - X0, BEAM_Y), dxfattribs={"rotation": 90, "layer": "S-JOIS"})

# Annotation: a size callout with MTEXT formatting codes, and a room name.
msp.add_mtext("{\\fArial|b1|i0|c0|p34;2x10} @ 16\" O.C.\\PDF-L No.2 U.N.O.",
              dxfattribs={"layer": "A-ANNO", "char_height": 100,
                          "insert": (2500, 2000), "rotation": 90})
msp.add_text("BEDROOM 2", dxfattribs={"layer": "A-ANNO", "height": 150,
                                      "insert": (6000, 5500)})

doc.saveas(OUT)
print("wrote", OUT)
