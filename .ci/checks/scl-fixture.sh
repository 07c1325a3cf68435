#!/usr/bin/env bash
# Regenerates the structural composite lumber fixture
# (cmd/framecheck/testdata/scl/scl.dxf, written by ezdxf) into a temporary
# directory and fails if it differs from the committed one; then runs the
# end-to-end tests that read it. The generator is deterministic (fixed
# metadata, sequential handles, PYTHONHASHSEED=0).
set -euo pipefail
cd "$(dirname "$0")/../.."
PY="${PY:-/usr/bin/python3}"
dir=cmd/framecheck/testdata/scl
tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT
"$PY" "$dir/gen_scl.py" "$tmp"
if ! cmp -s "$tmp/scl.dxf" "$dir/scl.dxf"; then
  echo "SCL fixture differs from a fresh ezdxf run: $dir/scl.dxf" >&2
  diff -u "$dir/scl.dxf" "$tmp/scl.dxf" | head -40 >&2 || true
  echo "regenerate with: $PY $dir/gen_scl.py" >&2
  exit 1
fi
go test -count=1 -run 'TestCheckSCL' ./cmd/framecheck
