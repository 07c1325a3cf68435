"""Independent reading of samples/demo/plan.dxf with ezdxf.

Run with Debian's /usr/bin/python3 and python3-ezdxf (0.18.1):

    /usr/bin/python3 samples/demo/check_demo.py samples/demo/plan.dxf

Prints JSON: the DXF version and $INSUNITS ezdxf reads, the number of audit
errors and fixes, whether $HANDSEED is above every handle in use, the layer
table, and the model-space entities counted per layer and type. The output
is committed as samples/demo/ezdxf_counts.json; the Go test in samples/
compares it with counts it takes from the file's group codes itself.
Exit status 1 when ezdxf's audit reports an error.
"""

import json
import sys

import ezdxf
from ezdxf.lldxf.tagger import ascii_tags_loader


def main(path):
    doc = ezdxf.readfile(path)
    auditor = doc.audit()
    seed = int(doc.header.get("$HANDSEED", "0"), 16)
    # Handles as written in the file (ezdxf's loader adds objects of its
    # own, such as layouts, with handles from the seed onwards).
    with open(path, encoding="cp1252") as f:
        tags = list(ascii_tags_loader(f))
    handles = []
    for prev, tag in zip([None] + tags, tags):
        is_seed = prev is not None and prev.code == 9 and prev.value == "$HANDSEED"
        if tag.code in (5, 105) and not is_seed:
            handles.append(int(tag.value, 16))
    counts = {}
    for e in doc.modelspace():
        layer = counts.setdefault(e.dxf.layer, {})
        layer[e.dxftype()] = layer.get(e.dxftype(), 0) + 1
    out = {
        "acadver": doc.dxfversion,
        "insunits": doc.header.get("$INSUNITS", 0),
        "audit_errors": len(auditor.errors),
        "audit_fixes": len(auditor.fixes),
        "handles_unique": len(handles) == len(set(handles)),
        "handseed_above_all_handles": bool(handles) and seed > max(handles),
        "layers": sorted(layer.dxf.name for layer in doc.layers),
        "entities": {k: counts[k] for k in sorted(counts)},
    }
    print(json.dumps(out, indent=2, sort_keys=True))
    for err in auditor.errors:
        print("audit error:", err.message, file=sys.stderr)
    return 1 if auditor.errors else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1] if len(sys.argv) > 1 else "samples/demo/plan.dxf"))
