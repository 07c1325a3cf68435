#!/usr/bin/env bash
# Regenerates the drawing-convention fixtures (cmd/framecheck/testdata/
# conventions, written by ezdxf) into a temporary directory and fails if
# they differ from the committed ones; then runs the Go tests that read
# them. The generator is deterministic (fixed metadata, sequential
# handles, PYTHONHASHSEED=0).
set -euo pipefail
cd "$(dirname "$0")/../.."
PY="${PY:-/usr/bin/python3}"
dir=cmd/framecheck/testdata/conventions
tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT
"$PY" "$dir/gen_conventions.py" "$tmp"
status=0
for f in "$tmp"/*.dxf; do
  base="$(basename "$f")"
  if ! cmp -s "$f" "$dir/$base"; then
    echo "conventions fixture differs from a fresh ezdxf run: $dir/$base" >&2
    diff -u "$dir/$base" "$f" | head -40 >&2 || true
    status=1
  fi
done
n_new=$(ls "$tmp"/*.dxf | wc -l)
n_old=$(ls "$dir"/*.dxf | wc -l)
if [ "$n_new" -ne "$n_old" ]; then
  echo "conventions fixtures: $n_old committed, the generator writes $n_new" >&2
  status=1
fi
if [ "$status" -ne 0 ]; then
  echo "regenerate with: $PY $dir/gen_conventions.py" >&2
  exit "$status"
fi
go test -count=1 -run 'TestConventions' ./cmd/framecheck
