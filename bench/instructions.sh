#!/bin/sh
# bench/instructions.sh BIN -- machine-independent cost: instructions executed (valgrind
# callgrind's "I refs") by one `volev run` of every case of bench/run.sh, of the SciPy
# comparison's core (bench/scipy/core.cfg), and by a 100-member Earth-like sweep on one
# thread (bench/lib.sh; per member = total / 100). Wall times on a shared or virtual
# machine drift between sessions; instruction counts do not (they change only with the
# code, the compiler and the libraries). Needs valgrind; runs about 50 times slower than
# the program itself. Informational: exits 0 (2 for bad arguments or no valgrind).
set -u

usage() { echo "usage: sh bench/instructions.sh path/to/volev" >&2; exit 2; }
[ "$#" -eq 1 ] || usage
bin=$1
case "$bin" in */*) ;; *) bin=./$bin ;; esac
[ -x "$bin" ] || { echo "bench: $bin is not an executable; run 'make' first" >&2; exit 2; }
command -v valgrind >/dev/null 2>&1 || { echo "bench: needs valgrind" >&2; exit 2; }
bin="$(cd "$(dirname "$bin")" && pwd)/$(basename "$bin")"
cd "$(dirname "$0")/.." || exit 2
. bench/lib.sh

work=$(mktemp -d "${TMPDIR:-/tmp}/volev-instr.XXXXXX") || exit 2
trap 'rm -rf "$work"' EXIT
trap 'exit 130' INT TERM

# instructions of COMMAND... (callgrind's total), or "-" if it failed
irefs() {
    valgrind --tool=callgrind --callgrind-out-file=/dev/null "$@" > /dev/null 2> "$work/vg" || { echo -; return; }
    awk '/Collected :|I *refs:/ { v = $NF; gsub(/,/, "", v); print v; exit }' "$work/vg"
}

echo "instructions per run (valgrind callgrind), $bin"
printf '%-18s %14s %8s %10s %10s\n' case instructions steps rhs_evals instr/rhs
for line in "earth|scenarios/earth.cfg|" "earth-hz_fit|scenarios/earth.cfg|climate.model=hz_fit" \
    "venus|scenarios/venus.cfg|" "venus-hz_fit|scenarios/venus.cfg|climate.model=hz_fit" \
    "mars|scenarios/mars.cfg|" "mars-hz_fit|scenarios/mars.cfg|climate.model=hz_fit" \
    "demo|scenarios/demo.cfg|" "demo-hz_fit|scenarios/demo.cfg|climate.model=hz_fit" \
    "demo-dry|scenarios/demo-dry.cfg|" "demo-dry-hz_fit|scenarios/demo-dry.cfg|climate.model=hz_fit" \
    "scipy-core|bench/scipy/core.cfg|"; do
    tag=${line%%|*}; rest=${line#*|}; scen=${rest%%|*}; kv=${rest#*|}
    rm -rf "$work/out"
    if [ -n "$kv" ]; then set -- --set "$kv"; else set --; fi
    ir=$(irefs "$bin" run "$scen" -o "$work/out" "$@")
    steps=$(summary_value "$work/out/summary.csv" steps 2>/dev/null)
    rhs=$(summary_value "$work/out/summary.csv" rhs_evaluations 2>/dev/null)
    awk -v t="$tag" -v ir="$ir" -v s="${steps:--}" -v r="${rhs:--}" 'BEGIN {
        printf "%-18s %14s %8s %10s %10s\n", t, ir, s, r, (r + 0 > 0 && ir != "-") ? sprintf("%.0f", ir / r) : "-" }'
done
ensemble_scenario "$work/ens.cfg" 100 || { echo "bench: could not derive the ensemble scenario" >&2; exit 2; }
ir=$(irefs "$bin" sweep "$work/ens.cfg" -o "$work/sweep" -j 1 --quiet)
awk -v ir="$ir" 'BEGIN { printf "%-18s %14s  (sweep of 100 members on 1 thread; per member %.0f)\n", "sweep-100", ir, ir / 100 }'
exit 0
