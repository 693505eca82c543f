#!/usr/bin/env bash
# Mutation testing, one folder at a time (the machine is shared: concurrency
# 2 by default, MUTATE_CONCURRENCY=1 to be gentler). Reports land in
# reports/mutation/<folder>.json; the score table is printed at the end.
#   bash scripts/mutation/run.sh                    all five folders (long: see DEVELOPERS.md)
#   bash scripts/mutation/run.sh lib/engine/solver  one folder
#   bash scripts/mutation/run.sh --sample           the sampled set CI can afford
set -euo pipefail
cd "$(dirname "$0")/../.."
FOLDERS=(lib/engine/solver lib/engine/devices lib/engine lib/bundle lib/capture)
# The sample: small files whose mistakes the issue saw survive (clock-select
# tables, high-time rounding, IEEE 181 levels), a few minutes on 2 cores.
SAMPLE="lib/engine/solver/high-time.ts,lib/engine/devices/msp430g2553.ts,lib/capture/state-levels.ts"

if [[ "${1:-}" == "--sample" ]]; then
  MUTATE_FILES="$SAMPLE" MUTATE_NAME=sample npx stryker run
  npx tsx scripts/mutation/report.ts reports/mutation/sample.json
  exit 0
fi
if [[ $# -gt 0 ]]; then FOLDERS=("$@"); fi
for f in "${FOLDERS[@]}"; do
  echo "== mutation: $f"
  MUTATE_FOLDER="$f" npx stryker run
done
npx tsx scripts/mutation/report.ts
