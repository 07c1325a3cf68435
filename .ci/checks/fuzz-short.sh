#!/usr/bin/env bash
# Runs every fuzz target for a short time (FUZZTIME, default 10s each,
# about 1.5 minutes for the seven), so that a crasher the corpus and the
# code changes make reachable is found in CI. A crasher is written under
# the package's testdata/fuzz/<target>/ and fails the check; commit it as
# a regression case once fixed. README "Tests" says how to run longer.
set -euo pipefail
cd "$(dirname "$0")/../.."
FUZZTIME="${FUZZTIME:-10s}"
targets=(
  "./dxfimport FuzzRead"
  "./framing FuzzGroup"
  "./framing FuzzParseCallout"
  "./export FuzzAnnotate"
  "./cmd/framecheck FuzzCheckPlan"
  "./project FuzzLoadProject"
  "./check/beam FuzzSolve"
)
# every Fuzz function of the module is in the list above
found="$(grep -rhoE '^func (Fuzz[A-Za-z0-9_]+)' --include='*_test.go' . | sed 's/^func //' | sort)"
listed="$(printf '%s\n' "${targets[@]}" | awk '{print $2}' | sort)"
if [ "$found" != "$listed" ]; then
  echo "fuzz-short.sh: the list of fuzz targets is out of date" >&2
  diff <(echo "$listed") <(echo "$found") >&2 || true
  exit 1
fi
for t in "${targets[@]}"; do
  set -- $t
  echo "-- fuzz $2 ($1, $FUZZTIME)"
  go test "$1" -run '^$' -fuzz "^$2\$" -fuzztime "$FUZZTIME"
done
