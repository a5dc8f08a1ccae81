#!/usr/bin/env bash
# Time the same predictions (contacts I-IV for the 26 reference stations, Venus 2012) in
# transit-parallax and in the Skyfield/DE421 reference script, in one run, and print the ratio.
# Needs: pip install skyfield==1.53 jplephem==2.24 de421==2008.1 de423==2010.1 numpy
set -euo pipefail
cd "$(dirname "$0")/.."
ours=$(cargo run --release --quiet --example time_predict)
theirs=$(cd tests/reference && python3 generate_contacts.py --timing-only)
python3 - "$ours" "$theirs" <<'PY'
import sys
ours, theirs = float(sys.argv[1]), float(sys.argv[2])
print(f"transit-parallax: {ours*1e6:.2f} microseconds per station ({1/ours:,.0f} stations/s)")
print(f"Skyfield + DE421: {theirs:.3f} s per station")
print(f"ratio: {theirs/ours:,.0f} times faster")
PY
