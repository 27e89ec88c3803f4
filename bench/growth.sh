#!/bin/sh
# bench/growth.sh BIN [N] -- how the cost of one run grows with the simulated duration.
# Cases: Earth (scenarios/earth.cfg, from its start at 70 Myr) on hz_fit, on hz_fit with
# no intermediate output ages, and on the column climate, over 0.5, 1, 2 and 4.5 Gyr; the
# demo M dwarf (scenarios/demo.cfg, from 10 Myr; the star lives far longer) on the column
# and on hz_fit over 0.5, 1, 2, 4.5 and 10 Gyr. Each run ends at start + duration
# (--set run.end_yr). N runs per point (default 5): the median of volev's own
# wall_time_s, its steps, RHS evaluations and column-climate table nodes, and the cost
# per Gyr and per step.
# Informational: exits 0 whatever the timings (2 for bad arguments).
set -u

usage() { echo "usage: sh bench/growth.sh path/to/volev [N]" >&2; exit 2; }
[ "$#" -ge 1 ] && [ "$#" -le 2 ] || usage
bin=$1
n=${2:-5}
case "$n" in ''|*[!0-9]*) usage ;; esac
[ "$n" -ge 1 ] || usage
case "$bin" in */*) ;; *) bin=./$bin ;; esac
[ -x "$bin" ] || { echo "bench: $bin is not an executable; run 'make' first" >&2; exit 2; }
bin="$(cd "$(dirname "$bin")" && pwd)/$(basename "$bin")"
cd "$(dirname "$0")/.." || exit 2
. bench/lib.sh

work=$(mktemp -d "${TMPDIR:-/tmp}/volev-growth.XXXXXX") || exit 2
trap 'rm -rf "$work"' EXIT
trap 'exit 130' INT TERM

# case = tag | scenario | start age (yr) | durations (Gyr) | overrides (space-separated)
cases="earth-hz_fit|scenarios/earth.cfg|7.0e7|0.5 1 2 4.5|climate.model=hz_fit
earth-hz_fit-norows|scenarios/earth.cfg|7.0e7|0.5 1 2 4.5|climate.model=hz_fit run.log_points=0 run.linear_points=0
earth|scenarios/earth.cfg|7.0e7|0.5 1 2 4.5|
demo|scenarios/demo.cfg|1.0e7|0.5 1 2 4.5 10|
demo-hz_fit|scenarios/demo.cfg|1.0e7|0.5 1 2 4.5 10|climate.model=hz_fit"

echo "volev cost against simulated duration: $bin, $n runs per point (load $(load1) at the start)"
echo "(wall = median of wall_time_s; per Gyr and per step from the median; *-norows: no output ages but start and end)"
printf '%-20s %6s %10s %8s %7s %9s %6s %9s %9s %8s\n' \
    case gyr wall_ms min_ms steps rhs_evals nodes ms_per_gyr us_per_step rhs_step

old_ifs=$IFS
IFS='
'
for line in $cases; do
    IFS=$old_ifs
    tag=${line%%|*}; rest=${line#*|}
    scen=${rest%%|*}; rest=${rest#*|}
    start=${rest%%|*}; rest=${rest#*|}
    durations=${rest%%|*}; overrides=${rest#*|}
    for d in $durations; do
        end=$(awk -v s="$start" -v d="$d" 'BEGIN { printf "%.10g", s + d * 1e9 }')
        : > "$work/walls"
        err=""
        i=0
        while [ "$i" -lt "$n" ]; do
            i=$((i + 1))
            set -- --set "run.end_yr=$end"
            for kv in $overrides; do set -- "$@" --set "$kv"; done
            if ! "$bin" run "$scen" -o "$work/out" "$@" > "$work/stdout" 2> "$work/stderr"; then
                err="run failed: $(head -n 1 "$work/stderr")"
                break
            fi
            summary_value "$work/out/summary.csv" wall_time_s >> "$work/walls"
            steps=$(summary_value "$work/out/summary.csv" steps)
            rhs=$(summary_value "$work/out/summary.csv" rhs_evaluations)
            nodes=$(summary_value "$work/out/summary.csv" climate_table_nodes)
            rm -rf "$work/out"
        done
        if [ -n "$err" ]; then
            printf '%-20s %6s  FAIL (%s)\n' "$tag" "$d" "$err"
            continue
        fi
        # shellcheck disable=SC2046  # three numbers, split on purpose
        set -- $(stats_of "$work/walls" 1000)
        awk -v tag="$tag" -v d="$d" -v med="$1" -v lo="$2" -v steps="$steps" -v rhs="$rhs" \
            -v nodes="$nodes" 'BEGIN {
            printf "%-20s %6s %10.2f %8.2f %7d %9d %6d %9.2f %9.2f %8.2f\n", tag, d, med, lo,
                steps, rhs, nodes, med / d, 1000 * med / steps, rhs / steps }'
    done
    IFS='
'
done
IFS=$old_ifs
exit 0
