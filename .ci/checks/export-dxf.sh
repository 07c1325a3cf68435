#!/usr/bin/env bash
# Annotated DXF (R12, R2000, hand-written minimal R12) and the R12 overlay,
# read back with ezdxf: audit clean, original entities unchanged, our layers
# holding the expected markup.
set -euo pipefail
cd "$(dirname "$0")/../.."
PY="${PY:-/usr/bin/python3}"
out=$(mktemp -d)
trap 'rm -rf "$out"' EXIT
go run ./export/internal/cifiles -testdata export/testdata -out "$out"
"$PY" .ci/checks/export_check.py dxf "$out"
