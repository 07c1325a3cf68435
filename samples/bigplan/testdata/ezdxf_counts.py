"""Read the 500-joist synthetic plans (R2000 and R12) with ezdxf, audit
them and count model-space entities per layer; print JSON.

    go run ./samples/bigplan -joists 500 -o /tmp/b.dxf
    go run ./samples/bigplan -joists 500 -r12 -o /tmp/b12.dxf
    /usr/bin/python3 samples/bigplan/testdata/ezdxf_counts.py /tmp/b.dxf /tmp/b12.dxf \
        > samples/bigplan/testdata/ezdxf_500.json

and the same with -beams on both commands into ezdxf_500_beams.json.
"""
import collections
import json
import sys

import ezdxf

out = {}
for path, flavour in zip(sys.argv[1:3], ["R2000", "R12"]):
    doc = ezdxf.readfile(path)
    auditor = doc.audit()
    layers = collections.Counter(e.dxf.layer for e in doc.modelspace())
    out[flavour] = {
        "acadver": doc.dxfversion,
        "audit_errors": len(auditor.errors),
        "audit_fixes": len(auditor.fixes),
        "layers": dict(sorted(layers.items())),
    }
json.dump(out, sys.stdout, indent=1, sort_keys=True)
print()
