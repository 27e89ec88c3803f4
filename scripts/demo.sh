#!/bin/sh
# demo.sh BIN -- run the wet and dry demo scenarios with the volev binary BIN,
# render each run (volev plot: plots/history.gp) and both on shared axes
# (plots/comparison.gp), and list the files produced.
# Run from anywhere; outputs go to demo-out/ in the source tree.
set -eu

if [ "$#" -ne 1 ]; then
    echo "usage: sh scripts/demo.sh path/to/volev" >&2
    exit 2
fi
bin=$1

# Make BIN usable after changing to the top of the tree.
case "$bin" in
    */*)
        [ -x "$bin" ] || { echo "demo.sh: $bin is not an executable; run 'make' first" >&2; exit 1; }
        bin="$(cd "$(dirname "$bin")" && pwd)/$(basename "$bin")"
        ;;
esac

here=$(pwd)
top=$(cd "$(dirname "$0")/.." && pwd)
cd "$top"
# paths are printed relative to where the script was started from when possible
if [ "$here" = "$top" ]; then prefix=""; else prefix="$top/"; fi

command -v gnuplot >/dev/null 2>&1 || {
    echo "demo.sh: gnuplot not found; run 'make deps' (or sh scripts/deps.sh)" >&2
    exit 1
}

out=demo-out
rm -rf "$out/wet" "$out/dry" "$out/wide" "$out/wet-vs-dry.png" "$out/near-vs-wide.png"
mkdir -p "$out"

echo "== running scenarios/demo.cfg (wet)"
"$bin" run scenarios/demo.cfg -o "$out/wet"
echo "== running scenarios/demo-dry.cfg (dry)"
"$bin" run scenarios/demo-dry.cfg -o "$out/dry"
echo "== running scenarios/demo-wide.cfg (the wet planet on a wider orbit)"
"$bin" run scenarios/demo-wide.cfg -o "$out/wide"

echo "== rendering"
"$bin" plot "$out/wet"
"$bin" plot "$out/dry"
# both runs on shared axes (the comparison figure, plots/comparison.gp)
"$bin" plot "$out/wet" "$out/dry" -o "$out/wet-vs-dry.png" --title "Demo: wet vs dry start"
# the two kinds of magma-ocean history: molten while the star is bright, or frozen early
"$bin" plot "$out/wet" "$out/wide" -o "$out/near-vs-wide.png" --title "Demo: 0.110 au vs 0.25 au"

for f in "$out/wet/history.png" "$out/dry/history.png" "$out/wet-vs-dry.png" \
         "$out/near-vs-wide.png" \
         "$out/wet/summary.csv" "$out/dry/summary.csv"; do
    [ -s "$f" ] || { echo "demo.sh: expected output $f is missing or empty" >&2; exit 1; }
done

echo "== demo done"
echo "figures:"
echo "  ${prefix}$out/wet/history.png"
echo "  ${prefix}$out/dry/history.png"
echo "  ${prefix}$out/wet-vs-dry.png"
echo "  ${prefix}$out/near-vs-wide.png"
echo "summaries:"
echo "  ${prefix}$out/wet/summary.csv"
echo "  ${prefix}$out/dry/summary.csv"
