#!/usr/bin/env bash
# Write the outputs of every command on the worked examples and the demo into one folder, so
# that two builds can be compared byte for byte (a refactoring must leave them identical):
#
#   tools/capture_outputs.sh BINARY OUTDIR
#   git stash; cargo build --release; tools/capture_outputs.sh target/release/transit-parallax /tmp/before
#   git stash pop; cargo build --release; tools/capture_outputs.sh target/release/transit-parallax /tmp/after
#   diff -r /tmp/before /tmp/after && echo identical
#
# The simulation runs 200 trials (not the worked example's 1,000) to stay quick; it is seeded
# and independent of the thread count, so its output is reproducible.
set -euo pipefail
bin=$(realpath "$1")
out=$(mkdir -p "$2" && realpath "$2")
root=$(cd "$(dirname "$0")/.." && pwd)
cd "$out" # reports are named relative to it, so their paths print alike
we=$root/worked-examples
run() { # name, then the command's arguments; stdout, stderr and the exit status are kept
  local name=$1
  shift
  set +e
  "$bin" "$@" >"$name.out" 2>"$name.err"
  echo $? >"$name.status"
  set -e
}
run transits-venus transits --planet venus --from 1600 --to 2300
run transits-mercury-csv transits --planet mercury --from 2030 --to 2060 --format csv
run transits-mercury-json transits --planet mercury --from 1700 --to 1800 --format json
run predict-table predict --planet mercury --date 2032-11-13 --stations $we/mercury-2032-planning/stations.csv
run predict-csv predict --planet mercury --date 2032-11-13 --stations $we/mercury-2032-planning/stations.csv --format csv
run predict-json predict --planet venus --date 2117-12-11 --stations $we/venus-2117-planning/candidate_sites.csv --format json
run reduce-table reduce $we/venus-2012-school-network/timings.csv \
  --report "reduce-report.html"
run reduce-json reduce $we/venus-2012-school-network/timings.csv --format json \
  --report "reduce-report.md"
run reduce-strict reduce $we/venus-2012-school-network/timings.csv --strict
run reduce-campaign reduce $root/tests/reference/campaigns/mercury-2016-blunders.csv --format json
run plan-table plan --planet venus --date 2117-12-11 --sites $we/venus-2117-planning/candidate_sites.csv \
  --choose 8 --contact 2 --grid-deg 5 --map "plan-map.svg"
run plan-json plan --planet venus --date 2117-12-11 --sites $we/venus-2117-planning/candidate_sites.csv \
  --choose 8 --format json
run plan-csv plan --planet venus --date 2117-12-11 --sites $we/venus-2117-planning/candidate_sites.csv \
  --contact 2 --grid-deg 5 --grid-csv "plan-grid.csv" --format csv
run simulate-table simulate --planet venus --date 2117-12-11 --network $we/venus-2117-planning/chosen_network.csv \
  --trials 200 --seed 2117 --black-drop 5 --weather-loss 0.2 --blunder-rate 0.03 \
  --histogram "simulate-histogram.svg"
run simulate-json simulate --planet venus --date 2117-12-11 --network $we/venus-2117-planning/chosen_network.csv \
  --trials 100 --seed 7 --format json
run demo demo --report "demo.html"
run bad-usage reduce /nonexistent.csv
run help help
for command in transits predict reduce plan simulate demo; do
  run "help-$command" "$command" --help
done
echo "outputs written to $out"
