#!/usr/bin/env bash
# Runs the README's demo command and reads what it wrote with independent
# readers: the annotated DXF (and overlay) with ezdxf, the schedule with
# openpyxl, both compared against results.json.
set -euo pipefail
cd "$(dirname "$0")/../.."
PY="${PY:-/usr/bin/python3}"
out=$(mktemp -d)
trap 'rm -rf "$out"' EXIT
go build -o "$out/framecheck" ./cmd/framecheck
set +e
"$out/framecheck" demo -o "$out/demo" >"$out/stdout.txt" 2>"$out/stderr.txt"
code=$?
set -e
# The demo plan has members that fail on purpose: exit 1 is expected.
if [ "$code" -ne 1 ]; then
  echo "framecheck demo exited $code, want 1 (some members fail by design)" >&2
  cat "$out/stderr.txt" >&2
  exit 1
fi
"$out/framecheck" check "$out/demo/plan.dxf" -p "$out/demo/framecheck.toml" -o "$out/overlay" --overlay >/dev/null 2>&1 || true
"$PY" .ci/checks/demo_check.py "$out/demo" "$out/overlay"
# The README's Python reader, run as written on the demo's results.json: it
# follows the references (mark's shared fields, source line, calculation,
# info list) and must print the first three members.
awk '/^```python$/{p=1; next} /^```$/{p=0} p' README.md | grep -q 'res\["calculations"\]'
(cd "$out" && ln -s demo demo-out && awk '/^```python$/{p=1; next} /^```$/{p=0} p' "$OLDPWD/README.md" | "$PY" - >readme-reader.txt)
if [ "$(grep -c '^M[0-9]* .*plan.dxf:[0-9]* (handle ' "$out/readme-reader.txt")" -ne 3 ]; then
  echo "the README's Python reader printed:" >&2
  cat "$out/readme-reader.txt" >&2
  exit 1
fi
# ... and, following the load path's calculations and demands, its beams
# and first connections
if [ "$(grep -c '^B[0-9]* B[0-9]* .* pass \[(.bending-top' "$out/readme-reader.txt")" -ne 2 ] ||
   ! grep -q '^post base P1 on foundation [0-9.]* D' "$out/readme-reader.txt"; then
  echo "the README's Python reader printed (want the demo's two beams with their checks and the posts' bases):" >&2
  cat "$out/readme-reader.txt" >&2
  exit 1
fi
echo "README's Python reader: $(head -1 "$out/readme-reader.txt")"
