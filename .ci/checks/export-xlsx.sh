#!/usr/bin/env bash
# schedule.xlsx from the fixture results, read back with openpyxl: sheet
# names, row counts, frozen header, autofilter and a few cells.
set -euo pipefail
cd "$(dirname "$0")/../.."
PY="${PY:-/usr/bin/python3}"
out=$(mktemp -d)
trap 'rm -rf "$out"' EXIT
go run ./export/internal/cifiles -testdata export/testdata -out "$out"
"$PY" .ci/checks/export_check.py xlsx "$out"
