#!/usr/bin/env bash
# Mutation testing, one folder at a time (the machine is shared: concurrency
# 2 by default, MUTATE_CONCURRENCY=1 to be gentler). Reports land in
# reports/mutation/<folder>.json; the score table is printed at the end.
#   bash scripts/mutation/run.sh                    all five folders (long: see DEVELOPERS.md)
#   bash scripts/mutation/run.sh lib/engine/solver  one folder
#   bash scripts/mutation/run.sh --sample           the small file set (see DEVELOPERS.md for its time)
#   bash scripts/mutation/run.sh --sampled lib/bundle [size=40] [seed=14]
#       a seeded uniform random sample of the folder's mutants (scripts/mutation/sample.ts);
#       report: npx tsx scripts/mutation/report.ts --sampled
#   bash scripts/mutation/run.sh --rerun lib/bundle  the sampled run's survivors again, after new tests
#   bash scripts/mutation/run.sh --ci [size=6]       the test command's small sample: every folder, seeded
#       by the commit; fails when the pooled sample is clearly below a floor (report.ts)
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
# The judging tests of a sampled run: the folder's own unit tests, without the
# ones that start an external tool per run (compilers, emulators, ngspice).
# Many mutants are "static" to Stryker (reached while a test file loads), and
# each static mutant reruns the whole set, so the set must be the fast one. A
# mutant the narrow set kills, the whole suite kills too: the figure is a
# lower bound. MUTATE_TESTS set by the caller wins.
sampled_tests() {
  case "$1" in
    lib/engine/solver) echo "tests/unit/engine/solver/**/*.test.ts" ;;
    lib/engine/devices)
      echo "tests/unit/engine/devices/**/*.test.ts,tests/unit/engine/solver/independent-reference.test.ts,tests/unit/engine/solver/datasheet-examples.test.ts" ;;
    lib/bundle)
      local b=tests/unit/bundle
      echo "$b/registers.test.ts,$b/golden.test.ts,$b/determinism.test.ts,$b/limits.test.ts,$b/adc-clock.test.ts,$b/avr-fuses.test.ts,$b/kept-control.test.ts,$b/triggered-refusal.test.ts,$b/adc-avr-source.test.ts,$b/pic12f1840-oscillator-text.test.ts,$b/rp2040-register-text.test.ts,$b/attiny85-timer1.test.ts,$b/build-target-checks.test.ts,$b/pic12f1840-clock-config.test.ts,$b/kept-part-limits.test.ts,$b/selector-error-fields.test.ts,$b/msp430-trigger-edge.test.ts,$b/rp2040-selector-part.test.ts,$b/stm32g031-alternate-function.test.ts,$b/pic12f1840-trigger-pr2.test.ts,$b/msp430-clock-and-timer.test.ts,$b/atmega328p-unknown-timer.test.ts,$b/caution-lines.test.ts,$b/avr-user-calibrated-rc.test.ts,$b/msp430-trigger-ccr-limit.test.ts,$b/msp430-trigger-shortest-delay.test.ts,$b/bit-expression.test.ts,$b/pic12f1840-trimmer-text.test.ts,$b/kept-trimmer.test.ts,$b/trimmer-range-refusal.test.ts,$b/msp430-trigger-active-low.test.ts,$b/image-listing.test.ts,$b/trim-writes.test.ts,$b/msp430-pin-and-clock-refusals.test.ts,$b/zip-order.test.ts" ;;
    lib/capture) echo "tests/unit/capture/*.test.ts" ;;
    lib/engine)
      # budget.ts and crystals.ts are judged by their tests in solver/ (they plan through the solver);
      # formatPpm (units.ts) by validation/presentation.test.ts; crystals.ts and timer-api.ts refusals
      # by solver/crystals-and-clock-choice-refusals.test.ts
      echo "tests/unit/engine/stages/**/*.test.ts,tests/unit/engine/tolerance/**/*.test.ts,tests/unit/engine/units/**/*.test.ts,tests/unit/engine/adjust/**/*.test.ts,tests/unit/engine/solver/budget-crystals.test.ts,tests/unit/engine/solver/budget-clock-source.test.ts,tests/unit/engine/solver/gate-drive.test.ts,tests/unit/engine/solver/crystals-and-clock-choice-refusals.test.ts,tests/unit/validation/presentation.test.ts" ;;
    *) echo "unknown folder: $1" >&2; exit 2 ;;
  esac
}
# The test command's sample: a few mutants per folder, drawn with the commit as
# the seed (each commit looks at other mutants; a run can be repeated), judged
# by the same narrow sets. Too few per folder for the folder targets: it prints
# each folder's figure and survivors, and fails when picks did not run or the
# pooled sample is below MUTATION_FLOOR (50 %) with 95 % confidence (report.ts).
if [[ "${1:-}" == "--ci" ]]; then
  size="${2:-6}"
  seed=$((16#$(git rev-parse --short=7 HEAD 2>/dev/null || echo 0e)))
  rm -f reports/mutation/sampled-ci-*.json
  npx tsx scripts/mutation/list-mutants.ts
  for folder in "${FOLDERS[@]}"; do
    name="${folder//\//-}"
    npx tsx scripts/mutation/sample.ts "$folder" "$size" "$seed"
    MUTATE_CONCURRENCY="${MUTATE_CONCURRENCY:-2}" MUTATE_TESTS="$(sampled_tests "$folder")" \
      MUTATE_PICKS="reports/mutation/picks-$name.json" MUTATE_NAME="sampled-ci-$name" \
      npx stryker run --tempDirName ".stryker-tmp-ci" --logLevel warn --reporters clear-text,json
  done
  MUTATION_GATE=confident npx tsx scripts/mutation/report.ts --sampled
  exit 0
fi
if [[ "${1:-}" == "--sampled" || "${1:-}" == "--rerun" ]]; then
  mode="$1" folder="${2:?name a folder, e.g. lib/engine/solver}"
  name="${folder//\//-}"
  if [[ "$mode" == "--sampled" ]]; then
    npx tsx scripts/mutation/list-mutants.ts
    npx tsx scripts/mutation/sample.ts "$folder" "${3:-40}" "${4:-14}"
    picks="reports/mutation/picks-$name.json" out="sampled-$name"
  else
    npx tsx scripts/mutation/survivor-picks.ts "$folder"
    picks="reports/mutation/picks-rerun-$name.json" out="rerun-$name"
  fi
  # its own temporary folder, so a sampled run can go beside another run
  MUTATE_TESTS="${MUTATE_TESTS:-$(sampled_tests "$folder")}" \
    MUTATE_PICKS="$picks" MUTATE_NAME="$out" npx stryker run --tempDirName ".stryker-tmp-$out"
  if [[ "$mode" == "--rerun" ]]; then
    npx tsx scripts/mutation/report.ts --sampled reports/mutation/rerun-*.json
  else
    npx tsx scripts/mutation/report.ts --sampled
  fi
  exit 0
fi
if [[ $# -gt 0 ]]; then FOLDERS=("$@"); fi
for f in "${FOLDERS[@]}"; do
  echo "== mutation: $f"
  MUTATE_FOLDER="$f" npx stryker run
done
npx tsx scripts/mutation/report.ts
