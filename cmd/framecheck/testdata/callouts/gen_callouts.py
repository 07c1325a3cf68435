#!/usr/bin/python3
"""Write callouts.dxf: one bay per size callout, each callout spelt as
drafters write them, written by ezdxf (independently of our own DXF
writers) as TEXT or as MTEXT with formatting codes and paragraph breaks.

Run with Debian's ezdxf: /usr/bin/python3 gen_callouts.py [OUT.dxf]

Plan (x east, y north, inches, $INSUNITS 1, R2013), bay i (i = 0, 1, ...)
side by side, x0 = 200 i, so that no joist of one bay neighbours another's:
  * WALL: two bearing walls (single lines) at x = x0 and x0 + 144 (12 ft
    span), y = 0 to 64.
  * JOIST: lines at y = 16, 32, 48 (16 in on centre), x = x0 to x0 + 144.
  * FRAMING-NOTE: a span line across the bay at x = x0 + 72, y = 8 to 56,
    and the bay's callout at (x0 + 74, 30), text height 4.
The callouts, in bay order, are CALLOUTS below; callout_e2e_test.go
expects, bay by bay, what each one says.
"""
import sys

import ezdxf

OUT = sys.argv[1] if len(sys.argv) > 1 else "callouts.dxf"

# (kind, text): kind "text" is a TEXT entity, "mtext" an MTEXT whose \P is
# a paragraph break and {\f...;} a font change.
CALLOUTS = [
    ("text", '2X8 @ 16" O.C. TYP.'),
    ("text", '2x10 DF-L #2 @ 16"'),
    ("mtext", "(2) 2x10\\PDF-L No.2"),
    ("mtext", "{\\fArial|b0|i0|c0|p34;2x12 HF No.1}\\P@ 1'-4\" o/c U.N.O."),
    ("text", "2x10 SP #2 @ 16 OC CJ"),
    ("text", '2x10 SPF #2 @16" RAFTERS'),
    ("text", "2x10 DFL No.2 @ 16 o.c."),
    ("text", "2x10 @ banana"),
    ("mtext", '2x10\\P@ 0"'),
    ("text", "140x45 @ 450"),
    ("text", '2x10 @ 200"'),
]

doc = ezdxf.new("R2013", setup=False)
doc.header["$INSUNITS"] = 1
for name, colour in [("JOIST", 3), ("WALL", 1), ("FRAMING-NOTE", 7)]:
    doc.layers.add(name, color=colour)
msp = doc.modelspace()

for i, (kind, text) in enumerate(CALLOUTS):
    x0 = 200.0 * i
    for x in (x0, x0 + 144):
        msp.add_line((x, 0), (x, 64), dxfattribs={"layer": "WALL"})
    for y in (16.0, 32.0, 48.0):
        msp.add_line((x0, y), (x0 + 144, y), dxfattribs={"layer": "JOIST"})
    msp.add_line((x0 + 72, 8), (x0 + 72, 56), dxfattribs={"layer": "FRAMING-NOTE"})
    at = (x0 + 74, 30)
    if kind == "text":
        msp.add_text(text, dxfattribs={"layer": "FRAMING-NOTE", "height": 4, "insert": at})
    else:
        msp.add_mtext(text, dxfattribs={"layer": "FRAMING-NOTE", "char_height": 4, "insert": at})

doc.saveas(OUT)
