#!/usr/bin/env bash
# report.html rendered by a real browser: Debian's chromium, headless, to a
# PNG screenshot and a PDF (print CSS). Fails when either is missing or
# empty. The report is the one `framecheck demo -o DIR` writes.
set -euo pipefail
cd "$(dirname "$0")/../.."

CHROMIUM=/usr/bin/chromium
if [ ! -x "$CHROMIUM" ]; then
  export DEBIAN_FRONTEND=noninteractive
  apt-get install -y -qq chromium >/dev/null
fi

out=$(mktemp -d)
profile=$(mktemp -d)
trap 'rm -rf "$out" "$profile"' EXIT

# The demo exits 1 on purpose (some of its members fail); 2 would be an error.
set +e
go run ./cmd/framecheck demo -o "$out/demo" >"$out/demo.log" 2>&1
code=$?
set -e
if [ "$code" -gt 1 ]; then
  echo "report-chromium: framecheck demo exited $code" >&2
  cat "$out/demo.log" >&2
  exit 1
fi
report="$out/demo/report.html"
echo "report-chromium: demo report"
[ -s "$report" ] || { echo "report-chromium: no report written" >&2; exit 1; }

flags=(--headless --no-sandbox --disable-gpu --no-first-run
  --disable-background-networking --disable-component-update --disable-sync
  --hide-scrollbars --user-data-dir="$profile")
url="file://$report"
timeout 120 "$CHROMIUM" "${flags[@]}" --window-size=1400,1000 --screenshot="$out/report.png" "$url" >"$out/png.log" 2>&1 || true
timeout 120 "$CHROMIUM" "${flags[@]}" --no-pdf-header-footer --print-to-pdf="$out/report.pdf" "$url" >"$out/pdf.log" 2>&1 || true

fail=0
for f in report.png report.pdf; do
  if [ ! -s "$out/$f" ]; then
    echo "report-chromium: $f missing or empty" >&2
    cat "$out/${f#report.}.log" >&2 || true
    fail=1
  fi
done
[ "$fail" = 0 ] || exit 1
# Magic numbers: a PNG starts with \x89PNG, a PDF with %PDF.
head -c 4 "$out/report.png" | grep -q PNG || { echo "report-chromium: report.png is not a PNG" >&2; exit 1; }
head -c 4 "$out/report.pdf" | grep -q '%PDF' || { echo "report-chromium: report.pdf is not a PDF" >&2; exit 1; }
# The panel: click the first segment of the first member path not in error (the plan draws
# members by runs, one path per run and band) in a copy of the page, at that point on the
# screen, and read the panel back from the DOM; it must name the member and list its ratios.
probe="$(dirname "$report")/probe.html"
sed 's@</body>@<script>var p=document.querySelector("#members g.j:not(.err) path"),q=p.getPointAtLength(0.5),c=p.getScreenCTM();p.dispatchEvent(new MouseEvent("click",{bubbles:true,clientX:c.a*q.x+c.c*q.y+c.e,clientY:c.b*q.x+c.d*q.y+c.f}));var d=document.getElementById("details");document.body.setAttribute("data-probe","m-"+d.getAttribute("data-member")+"|"+d.textContent);</script></body>@' "$report" >"$probe"
dom=$(timeout 120 "$CHROMIUM" "${flags[@]}" --dump-dom "file://$probe" 2>/dev/null | grep -o 'data-probe="[^"]*"' || true)
id=$(printf '%s' "$dom" | sed -n 's/^data-probe="m-\([^|]*\)|.*/\1/p')
if [ -z "$id" ] || ! printf '%s' "$dom" | grep -q "|$id.*ratios: "; then
  echo "report-chromium: clicking a member did not show its details: $dom" >&2
  exit 1
fi
echo "report-chromium: details panel shows member $id"
# The load-path view: click the first beam of the plan; the panel must name it and the
# members it carries (its data-carries) must be drawn over the plan, one line each.
probe2="$(dirname "$report")/probe2.html"
sed 's@</body>@<script>var b=document.querySelector("#beams line.beam");if(b){b.dispatchEvent(new MouseEvent("click",{bubbles:true}));var d=document.getElementById("details"),n=b.getAttribute("data-carries").split(" ").filter(function(s){return s!=="";}).length;document.body.setAttribute("data-probe2",d.getAttribute("data-beam")+"|"+n+"|"+document.querySelectorAll("#carried line").length+"|"+d.textContent);}</script></body>@' "$report" >"$probe2"
dom2=$(timeout 120 "$CHROMIUM" "${flags[@]}" --dump-dom "file://$probe2" 2>/dev/null | grep -o 'data-probe2="[^"]*"' || true)
beam=$(printf '%s' "$dom2" | sed -n 's/^data-probe2="\([^|]*\)|\([0-9]*\)|\([0-9]*\)|.*/\1 \2 \3/p')
set -- $beam
if [ "$#" != 3 ] || [ "$2" = 0 ] || [ "$2" != "$3" ] || ! printf '%s' "$dom2" | grep -q "carries"; then
  echo "report-chromium: clicking a beam did not show it and the members it carries: $dom2" >&2
  exit 1
fi
echo "report-chromium: clicking beam $1 draws the $3 members it carries"
if [ -n "${REPORT_KEEP:-}" ]; then
  mkdir -p "$REPORT_KEEP" && cp "$out/report.png" "$out/report.pdf" "$report" "$REPORT_KEEP/"
fi
echo "report-chromium: PNG $(stat -c %s "$out/report.png") bytes, PDF $(stat -c %s "$out/report.pdf") bytes"
