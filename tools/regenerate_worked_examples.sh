#!/usr/bin/env bash
# Write every output of the worked examples afresh with a built binary, exactly as
# tests/worked_examples.rs runs them (same folders, same arguments), after a change that
# alters them on purpose (say why in the commit; then update the figures quoted in
# worked-examples/README.md):
#
#   cargo build --release && tools/regenerate_worked_examples.sh target/release/transit-parallax
#
# The 1769 example's timings are the embedded historical demonstration: regenerate that
# first (cargo run --release --example regenerate_demo).
set -euo pipefail
bin=$(realpath "$1")
root=$(cd "$(dirname "$0")/.." && pwd)
we=$root/worked-examples

cd "$we/venus-2012-school-network"
"$bin" reduce "$PWD/timings.csv" >reduction.txt
"$bin" reduce "$PWD/timings.csv" --format json >reduction.json

cd "$we/mercury-2032-planning"
event=(--planet mercury --date 2032-11-13 --stations "$PWD/stations.csv")
"$bin" predict "${event[@]}" >predictions.txt
"$bin" predict "${event[@]}" --format csv >predictions.csv
"$bin" transits --planet mercury --from 2030 --to 2060 >transits-2030-2060.txt

cd "$we/venus-2117-planning"
here=$PWD
work=$(mktemp -d)
event=(--planet venus --date 2117-12-11)
plan=(plan "${event[@]}" --sites "$here/candidate_sites.csv" --choose 8)
(cd "$work" && "$bin" "${plan[@]}" --format json) >plan.json
(cd "$work" && "$bin" "${plan[@]}" --contact 2 --grid-deg 2 --map contact2-sensitivity.svg) >plan.txt
cp "$work/contact2-sensitivity.svg" .
(cd "$work" && "$bin" simulate "${event[@]}" --network "$here/chosen_network.csv" --trials 1000 --seed 2117 \
  --black-drop 5 --weather-loss 0.2 --blunder-rate 0.03 --histogram au-histogram.svg) >simulate.txt
cp "$work/au-histogram.svg" .
rm -r "$work"

cd "$we/venus-1769-expeditions"
cp "$root/src/data/expeditions_1769_campaign.csv" timings.csv
"$bin" reduce "$PWD/timings.csv" >reduction.txt
"$bin" reduce "$PWD/timings.csv" --format json >reduction.json
"$bin" predict --planet venus --date 1769-06-03 --stations "$PWD/stations.csv" --local-time apparent >predictions-apparent.txt
echo "regenerated the worked examples under $we"
