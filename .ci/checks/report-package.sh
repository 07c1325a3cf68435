#!/usr/bin/env bash
# The calculation package printed as a designer prints it: the demo checked
# with --package governing --pdf (headless Chromium, the report's print
# CSS), then read back with poppler's pdfinfo and pdftotext: fewer than 20
# Letter pages, the plan on a landscape page, "Page x of y" at every foot,
# no browser URL, no heading as the last line of a page.
set -euo pipefail
cd "$(dirname "$0")/../.."
PY="${PY:-/usr/bin/python3}"
if [ ! -x /usr/bin/chromium ]; then
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
fi
if ! command -v pdfinfo >/dev/null 2>&1; then
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq poppler-utils >/dev/null
fi
out=$(mktemp -d)
trap 'rm -rf "$out"' EXIT
go build -o "$out/framecheck" ./cmd/framecheck
set +e
"$out/framecheck" demo -o "$out/demo" >/dev/null 2>&1
"$out/framecheck" check "$out/demo/plan.dxf" -p "$out/demo/framecheck.toml" -o "$out/pkg" \
  --package governing --pdf >"$out/log.txt" 2>&1
code=$?
set -e
if [ "$code" -gt 1 ] || [ ! -s "$out/pkg/report.pdf" ]; then
  echo "report-package: check --package governing --pdf exited $code, no report.pdf" >&2
  cat "$out/log.txt" >&2
  exit 1
fi
"$PY" .ci/checks/report_package.py "$out/pkg/report.html" "$out/pkg/report.pdf"
