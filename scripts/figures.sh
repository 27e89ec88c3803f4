#!/bin/sh
# figures.sh BIN -- render one figure of every kind from the bundled scenarios into
# docs/figures/ (PNG, for docs/figures.md), with the commands docs/figures.md shows.
# Took about a minute on 2 cores with the grey column; with the non-grey column the two
# sweeps of the invented demo planet compute many table points (~7 and over 15 minutes
# with a cold cache, docs/performance.md section 7; faster once the cache holds them).
set -eu
[ "$#" -eq 1 ] || { echo "usage: sh scripts/figures.sh path/to/volev" >&2; exit 2; }
bin=$1
case "$bin" in */*) bin="$(cd "$(dirname "$bin")" && pwd)/$(basename "$bin")" ;; esac
cd "$(dirname "$0")/.."
command -v gnuplot >/dev/null 2>&1 || { echo "figures.sh: gnuplot not found (make deps)" >&2; exit 1; }

work=$(mktemp -d "${TMPDIR:-/tmp}/volev-figures.XXXXXX")
trap 'rm -rf "$work"' EXIT
out=docs/figures
mkdir -p "$out"
say() { echo "== $*"; }

say "runs"
"$bin" run scenarios/earth.cfg -o "$work/earth" >/dev/null
"$bin" run scenarios/demo.cfg -o "$work/wet" >/dev/null
"$bin" run scenarios/demo-dry.cfg -o "$work/dry" >/dev/null
"$bin" run scenarios/venus.cfg -o "$work/venus" >/dev/null
"$bin" run scenarios/mars.cfg -o "$work/mars" >/dev/null
"$bin" balance scenarios/demo.cfg --age-yr 1e9 -o "$work/balance" >/dev/null
say "sweeps"
"$bin" sweep scenarios/demo-sweep.cfg -o "$work/map" --quiet >/dev/null
"$bin" sweep scenarios/demo-sensitivity.cfg -o "$work/sens" --quiet >/dev/null

say "figures"
"$bin" plot "$work/earth" -o "$out/history-earth.png" --title "Earth (scenarios/earth.cfg)"
"$bin" plot "$work/wet" -o "$out/history-demo.png"
"$bin" plot "$work/balance" -o "$out/balance-demo.png" --title "Tessel b at 1 Gyr (volev balance scenarios/demo.cfg --age-yr 1e9)"
"$bin" plot "$work/wet" "$work/dry" -o "$out/comparison-demo.png" --title "Tessel b: wet and dry starts"
"$bin" plot "$work/venus" "$work/earth" "$work/mars" -o "$out/comparison-planets.png" --title "Venus, Earth and Mars from one starting inventory"
"$bin" plot "$work/sens" --kind ensemble -o "$out/ensemble-demo.png" --title "Tessel b: 160-member Saltelli ensemble (scenarios/demo-sensitivity.cfg)"
"$bin" plot "$work/map" --kind regime_map -o "$out/regime-map-demo.png" --title "Tessel b: outcome over orbit and initial water (scenarios/demo-sweep.cfg)"
"$bin" plot "$work/map" --kind water_map -o "$out/water-map-demo.png" --title "Tessel b: final water over orbit and initial water (scenarios/demo-sweep.cfg)"
