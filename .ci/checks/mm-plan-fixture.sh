#!/usr/bin/env bash
# The millimetre plan fixture (cmd/framecheck/testdata/mm_plan), read with
# ezdxf independently of our reader: audit clean, $INSUNITS 4, the joists
# the generator draws (model space and the rotated block) counted, and
# framecheck's member count, spans and annotated copy checked against them.
set -euo pipefail
cd "$(dirname "$0")/../.."
PY="${PY:-/usr/bin/python3}"
out=$(mktemp -d)
trap 'rm -rf "$out"' EXIT
dir=cmd/framecheck/testdata/mm_plan
go build -o "$out/framecheck" ./cmd/framecheck
# exit 1 is expected: the trimmers carrying the stair header are error members
"$out/framecheck" check "$dir/mm_plan.dxf" -p "$dir/mm_plan.toml" -o "$out/res" >"$out/stdout.txt" 2>"$out/stderr.txt" || [ $? -eq 1 ]
"$PY" - "$dir/mm_plan.dxf" "$out/res" <<'PYEOF'
import json, math, sys
import ezdxf

plan, res = sys.argv[1], sys.argv[2]
def fail(msg):
    print("mm-plan-fixture: " + msg, file=sys.stderr)
    sys.exit(1)

doc = ezdxf.readfile(plan)
if doc.audit().has_errors:
    fail("fixture does not audit clean")
if doc.header.get("$INSUNITS") != 4:
    fail("fixture $INSUNITS is %r, want 4 (mm)" % doc.header.get("$INSUNITS"))
msp = doc.modelspace()
joists = [e for e in msp.query("LWPOLYLINE") if e.dxf.layer == "S-JOIS"]
inserts = [e for e in msp.query("INSERT") if e.dxf.name == "JST-N"]
if len(inserts) != 1 or abs(inserts[0].dxf.rotation - 90) > 1e-9:
    fail("want one JST-N insert rotated 90 degrees")
in_block = [e for e in doc.blocks.get("JST-N") if e.dxftype() == "LWPOLYLINE"]
# world coordinates of every joist end, in mm, block joists through ezdxf's own transform
ends = []
for e in joists:
    p = [(x, y) for x, y in e.get_points("xy")]
    ends.append((p[0], p[-1]))
for e in inserts[0].virtual_entities():
    if e.dxftype() == "LWPOLYLINE":
        p = [(x, y) for x, y in e.get_points("xy")]
        ends.append((p[0], p[-1]))
if len(ends) != len(joists) + len(in_block):
    fail("block expansion gave %d joists, want %d" % (len(ends) - len(joists), len(in_block)))
# two parallel joist lines a 2x thickness (38.1 mm) apart that overlap are
# one member drawn as its outline (the doubled trimmers): one member on
# their centre line
def pair(e, f):
    (a0, a1), (b0, b1) = e, f
    if abs(a0[0] - a1[0]) > 1e-6 or abs(b0[0] - b1[0]) > 1e-6:
        return False  # only the vertical trimmers are drawn so
    lo = max(min(a0[1], a1[1]), min(b0[1], b1[1]))
    hi = min(max(a0[1], a1[1]), max(b0[1], b1[1]))
    return abs(abs(a0[0] - b0[0]) - 38.1) < 0.5 and hi - lo > 0
merged, used = [], set()
for i, e in enumerate(ends):
    if i in used:
        continue
    for j in range(i + 1, len(ends)):
        if j not in used and pair(e, ends[j]):
            f = ends[j]
            x = (e[0][0] + f[0][0]) / 2
            ys = [e[0][1], e[1][1], f[0][1], f[1][1]]
            e = ((x, min(ys)), (x, max(ys)))
            used.add(j)
            break
    merged.append(e)
if len(ends) - len(merged) != 2:
    fail("want the two doubled trimmers drawn as pairs of lines, found %d pairs" % (len(ends) - len(merged)))
ends = merged

r = json.load(open(res + "/results.json"))
shared = {}
for mk in r["marks"]:  # schema 3: fields the members of a mark share are in its "shared"
    shared.setdefault(mk["mark"], mk.get("shared", {}))
r["members"] = [{**shared.get(m["mark"], {}), **m} for m in r["members"]]
if r["drawing_units"] != "mm":
    fail("results drawing_units %r" % r["drawing_units"])
if len(r["members"]) != len(ends):
    fail("framecheck found %d members, ezdxf counts %d joists" % (len(r["members"]), len(ends)))
# every member is one of ezdxf's joists (either direction), and its length
# in inches is the joist's length in mm / 25.4 (to the 6 significant digits
# results.json writes)
for m in r["members"]:
    a, b = tuple(m["start"]), tuple(m["end"])
    match = [e for e in ends if (math.dist(a, e[0]) < 0.01 and math.dist(b, e[1]) < 0.01)
             or (math.dist(a, e[1]) < 0.01 and math.dist(b, e[0]) < 0.01)]
    if not match:
        fail("%s (%r-%r) is not a joist ezdxf sees" % (m["id"], a, b))
    want = math.dist(*match[0]) / 25.4
    if abs(m["length_in"] - want) > 5e-6 * want:  # results.json: 6 significant digits
        fail("%s length %.4f in, ezdxf %.4f in" % (m["id"], m["length_in"], want))

checked = ezdxf.readfile(res + "/mm_plan-checked.dxf")
if checked.audit().has_errors:
    fail("annotated copy does not audit clean")
# one label per run and mark, one id per member
labels = [e for e in checked.modelspace().query("TEXT") if e.dxf.layer == "FC-LABEL"]
groups = {(m.get("run"), m["mark"]) for m in r["members"] if m["status"] != "error"}
if len(labels) != len(groups):
    fail("%d FC-LABEL texts for %d runs x marks" % (len(labels), len(groups)))
ids = [e for e in checked.modelspace().query("TEXT") if e.dxf.layer == "FC-ID"]
if sorted(e.dxf.text for e in ids) != sorted(m["id"] for m in r["members"]):
    fail("FC-ID texts differ from the members' ids")
print("mm-plan-fixture: %d joists, members and labels agree" % len(ends))
PYEOF
