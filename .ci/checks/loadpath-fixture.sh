#!/usr/bin/env bash
# Regenerates framing's load-path fixture (framing/testdata/loadpath.dxf,
# written by ezdxf) into a temporary directory and fails if it differs
# from the committed one; then runs the Go tests that read it. The
# generator is deterministic (fixed metadata, sequential handles,
# PYTHONHASHSEED=0).
set -euo pipefail
cd "$(dirname "$0")/../.."
PY="${PY:-/usr/bin/python3}"
dir=framing/testdata
tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT
"$PY" "$dir/gen_loadpath.py" "$tmp"
if ! cmp -s "$tmp/loadpath.dxf" "$dir/loadpath.dxf"; then
  echo "load-path fixture differs from a fresh ezdxf run: $dir/loadpath.dxf" >&2
  diff -u "$dir/loadpath.dxf" "$tmp/loadpath.dxf" | head -40 >&2 || true
  echo "regenerate with: $PY $dir/gen_loadpath.py" >&2
  exit 1
fi
go test -count=1 -run 'TestLoadPathFixture|TestBeamsOfTheLoadPath' ./framing
