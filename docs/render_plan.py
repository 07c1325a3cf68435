"""Renders an annotated framecheck DXF to PNG for the README.

Uses ezdxf's drawing add-on with matplotlib (Debian python3-ezdxf and
python3-matplotlib), an independent renderer of our DXF output.
Usage: /usr/bin/python3 docs/render_plan.py plan-checked.dxf out.png
"""
import sys

import ezdxf
import matplotlib

matplotlib.use("Agg")
import matplotlib.pyplot as plt
from ezdxf.addons.drawing import Frontend, RenderContext
from ezdxf.addons.drawing.matplotlib import MatplotlibBackend
from ezdxf.addons.drawing.properties import LayoutProperties


def main(src, out):
    doc = ezdxf.readfile(src)
    msp = doc.modelspace()
    fig = plt.figure(figsize=(14, 6))
    ax = fig.add_axes([0, 0, 1, 1])
    ctx = RenderContext(doc)
    props = LayoutProperties.from_layout(msp)
    props.set_colors("#ffffff")
    Frontend(ctx, MatplotlibBackend(ax)).draw_layout(msp, finalize=True, layout_properties=props)
    fig.savefig(out, dpi=110)


if __name__ == "__main__":
    main(sys.argv[1], sys.argv[2])
