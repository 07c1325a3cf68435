#!/usr/bin/env bash
# The demo's schedule.xlsx opened by LibreOffice Calc (headless, every
# sheet saved as CSV) and held to openpyxl's reading of it and to
# results.json: a spreadsheet application placing the reference-less row
# cells by their order.
set -euo pipefail
cd "$(dirname "$0")/../.."
PY="${PY:-/usr/bin/python3}"
if ! command -v soffice >/dev/null 2>&1; then
  echo "schedule-calc: soffice not installed (.ci/run installs libreoffice-calc-nogui)" >&2
  exit 1
fi
out=$(mktemp -d)
trap 'rm -rf "$out"' EXIT
go build -o "$out/framecheck" ./cmd/framecheck
"$out/framecheck" demo -o "$out/demo" >/dev/null 2>&1 || true
test -s "$out/demo/schedule.xlsx"
mkdir "$out/calc"
# 44,34,76,1: comma, double quote, UTF-8, from line 1; the last field
# (-1) writes every sheet as schedule-SHEET.csv
HOME="$out" timeout 300 soffice --headless \
  --convert-to 'csv:Text - txt - csv (StarCalc):44,34,76,1,,0,false,true,false,false,false,-1' \
  --outdir "$out/calc" "$out/demo/schedule.xlsx" >"$out/calc.log" 2>&1 || { cat "$out/calc.log" >&2; exit 1; }
"$PY" .ci/checks/schedule_calc_check.py "$out/calc" "$out/demo/results.json" "$out/demo/schedule.xlsx"
