#!/usr/bin/env bash
# Regenerates dxfimport's ezdxf fixtures into a temporary directory and
# fails if they differ from the committed ones. The generator is
# deterministic (fixed metadata, sequential handles, sorted JSON), so both
# the DXF files and ezdxf's JSON dumps must be byte-identical.
set -euo pipefail
cd "$(dirname "$0")/../.."
PY="${PY:-/usr/bin/python3}"
tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT
"$PY" dxfimport/testdata/gen_fixtures.py "$tmp"
status=0
for f in "$tmp"/*.dxf "$tmp"/*.json; do
  base="$(basename "$f")"
  if ! cmp -s "$f" "dxfimport/testdata/$base"; then
    echo "dxfimport fixture differs from a fresh ezdxf run: dxfimport/testdata/$base" >&2
    diff -u "dxfimport/testdata/$base" "$f" | head -40 >&2 || true
    status=1
  fi
done
if [ "$status" -ne 0 ]; then
  echo "regenerate with: $PY dxfimport/testdata/gen_fixtures.py" >&2
fi
exit "$status"
