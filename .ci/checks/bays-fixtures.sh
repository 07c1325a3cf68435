#!/usr/bin/env bash
# Regenerates the bay fixtures (cmd/framecheck/testdata/bays, written by
# ezdxf) into a temporary directory and fails if they differ from the
# committed ones; reads the annotated copy of one bay plan back with ezdxf
# (one LINE per generated joist on FC-GENERATED, results.json marking them
# generated); then runs the Go tests that read the fixtures. The generator
# is deterministic (fixed metadata, sequential handles, PYTHONHASHSEED=0).
set -euo pipefail
cd "$(dirname "$0")/../.."
PY="${PY:-/usr/bin/python3}"
dir=cmd/framecheck/testdata/bays
tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT
"$PY" "$dir/gen_bays.py" "$tmp/gen"
status=0
for f in "$tmp"/gen/*.dxf; do
  base="$(basename "$f")"
  if ! cmp -s "$f" "$dir/$base"; then
    echo "bay fixture differs from a fresh ezdxf run: $dir/$base" >&2
    diff -u "$dir/$base" "$f" | head -40 >&2 || true
    status=1
  fi
done
n_new=$(ls "$tmp"/gen/*.dxf | wc -l)
n_old=$(ls "$dir"/*.dxf | wc -l)
if [ "$n_new" -ne "$n_old" ]; then
  echo "bay fixtures: $n_old committed, the generator writes $n_new" >&2
  status=1
fi
if [ "$status" -ne 0 ]; then
  echo "regenerate with: $PY $dir/gen_bays.py" >&2
  exit "$status"
fi
cat >"$tmp/conv.toml" <<'TOML'
[[support]]
layers = ["WALL*"]
kind = "bearing-wall"
bearing_in = 3.5
TOML
go build -o "$tmp/framecheck" ./cmd/framecheck
"$tmp/framecheck" check "$dir/turned_arrows.dxf" -p "$tmp/conv.toml" -o "$tmp/res" >"$tmp/stdout.txt"
"$PY" - "$tmp/res" <<'PYEOF'
import json, sys
import ezdxf

res = sys.argv[1]
def fail(msg):
    print("bays-fixtures: " + msg, file=sys.stderr)
    sys.exit(1)

r = json.load(open(res + "/results.json"))
shared = {}
for mk in r["marks"]:  # schema 3: fields the members of a mark share are in its "shared"
    shared.setdefault(mk["mark"], mk.get("shared", {}))
members = [{**shared.get(m["mark"], {}), **m} for m in r["members"]]
gen = [m for m in members if m.get("generated") is True]
if len(members) != 9 or len(gen) != 9:
    fail("results.json: %d members, %d generated; want 9 and 9" % (len(members), len(gen)))
doc = ezdxf.readfile(res + "/turned_arrows-checked.dxf")
if doc.audit().has_errors:
    fail("ezdxf audit errors in the annotated copy")
if "FC-GENERATED" not in doc.layers:
    fail("no FC-GENERATED layer in the annotated copy")
lines = [e for e in doc.modelspace().query("LINE") if e.dxf.layer == "FC-GENERATED"]
if len(lines) != 9:
    fail("%d LINEs on FC-GENERATED, want 9" % len(lines))
# each generated line lies where results.json puts its member (drawing units, mm)
for m in gen:
    s, e = m["start"], m["end"]
    if not any(min(abs(l.dxf.start.x - s[0]) + abs(l.dxf.start.y - s[1]) + abs(l.dxf.end.x - e[0]) + abs(l.dxf.end.y - e[1]),
                   abs(l.dxf.start.x - e[0]) + abs(l.dxf.start.y - e[1]) + abs(l.dxf.end.x - s[0]) + abs(l.dxf.end.y - s[1])) < 0.01
               for l in lines):
        fail("no FC-GENERATED line on member %s %r-%r" % (m["id"], s, e))
print("bays-fixtures: %d generated joists marked in results.json and on FC-GENERATED" % len(gen))
PYEOF
go test -count=1 -run 'TestBays' ./cmd/framecheck
