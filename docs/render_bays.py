"""Renders the bay conventions framecheck reads to one small PNG for the
README: a bay outline with its callout, a span line with arrowheads, a
span line with half-arrows (the fixtures cmd/framecheck/testdata/bays,
written by ezdxf), and the annotated copy of the span-line plan, whose
generated joists are on layer FC-GENERATED.

Uses ezdxf's drawing add-on with matplotlib (Debian python3-ezdxf and
python3-matplotlib), an independent renderer of the DXF files.
Usage: /usr/bin/python3 docs/render_bays.py ARROWS-CHECKED.dxf docs/bays.png
(ARROWS-CHECKED.dxf: `framecheck check cmd/framecheck/testdata/bays/plan_arrows.dxf`'s
annotated copy; the project file gives WALL* the bearing-wall kind.)
"""
import logging
import os
import sys

import ezdxf
import matplotlib

matplotlib.use("Agg")
import matplotlib.pyplot as plt
from ezdxf.addons.drawing import Frontend, RenderContext
from ezdxf.addons.drawing.matplotlib import MatplotlibBackend
from ezdxf.addons.drawing.properties import LayoutProperties

FIXTURES = os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "cmd", "framecheck", "testdata", "bays")


def panel(ax, path, title):
    doc = ezdxf.readfile(path)
    msp = doc.modelspace()
    ctx = RenderContext(doc)
    props = LayoutProperties.from_layout(msp)
    props.set_colors("#ffffff")
    Frontend(ctx, MatplotlibBackend(ax)).draw_layout(msp, finalize=False, layout_properties=props)
    ax.set_aspect("equal")
    ax.axis("off")
    ax.set_xlim(-12, 140)  # the plan: x 0..128, y 0..185.5 in
    ax.set_ylim(-8, 194)
    ax.set_title(title, fontsize=10)


def main(checked, out):
    logging.getLogger("matplotlib.font_manager").setLevel(logging.ERROR)  # the DXF's "txt" font
    fig, axes = plt.subplots(1, 4, figsize=(10, 4.2))
    panel(axes[0], os.path.join(FIXTURES, "plan_outline.dxf"), "bay outline + callout")
    panel(axes[1], os.path.join(FIXTURES, "plan_arrows.dxf"), "span line, arrowheads")
    panel(axes[2], os.path.join(FIXTURES, "plan_halfarrows.dxf"), "span line, half-arrows")
    panel(axes[3], checked, "checked: joists laid out")
    fig.tight_layout()
    fig.savefig(out, dpi=90)


if __name__ == "__main__":
    main(sys.argv[1], sys.argv[2])
