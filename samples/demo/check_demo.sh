#!/usr/bin/env bash
# Cross-check of the demo plan, independent of our own DXF code:
#  1. samples/demo/plan.dxf is what samples/demogen writes now;
#  2. ezdxf (Debian's python3-ezdxf) reads it, its audit finds no error, and
#     what it counts per layer equals the committed ezdxf_counts.json that
#     the Go tests in samples/ compare with their own group-code scan.
# CI runs this with $PY set to /usr/bin/python3.
set -euo pipefail
cd "$(dirname "$0")/../.."
PY="${PY:-/usr/bin/python3}"
tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT

go run ./samples/demogen -o "$tmp" >/dev/null
if ! cmp -s "$tmp/plan.dxf" samples/demo/plan.dxf; then
  echo "samples/demo/plan.dxf is stale: run 'go run ./samples/demogen -o samples/demo' and commit it" >&2
  exit 1
fi
"$PY" samples/demo/check_demo.py samples/demo/plan.dxf >"$tmp/counts.json"
if ! diff -u samples/demo/ezdxf_counts.json "$tmp/counts.json"; then
  echo "samples/demo/ezdxf_counts.json differs from what ezdxf reads now:" >&2
  echo "  $PY samples/demo/check_demo.py samples/demo/plan.dxf > samples/demo/ezdxf_counts.json" >&2
  exit 1
fi
echo "samples/demo: plan.dxf is current, ezdxf audit clean, counts match"
