#!/bin/sh
# bench/run.sh BIN [N] -- time volev on the reference scenarios.
# Each case is run N times (default 20); the median of the solver's own
# wall_time_s (from summary.csv) is reported with steps, RHS evaluations and the
# column climate's table (nodes built, build time). The 20 ms per-run target of the
# core simulator applies to the habitable-zone-fit climate; column-climate runs are
# reported against it too, with their table build time shown separately.
# Informational only: the exit status is 0 whatever the timings are.
set -u

usage() { echo "usage: sh bench/run.sh path/to/volev [N]" >&2; exit 2; }
if [ "$#" -lt 1 ] || [ "$#" -gt 2 ]; then usage; fi
bin=$1
n=${2:-20}
case "$n" in ''|*[!0-9]*) usage ;; esac
[ "$n" -ge 1 ] || usage

case "$bin" in
    */*)
        [ -x "$bin" ] || { echo "bench: $bin is not an executable; run 'make' first" >&2; exit 2; }
        bin="$(cd "$(dirname "$bin")" && pwd)/$(basename "$bin")"
        ;;
esac
cd "$(dirname "$0")/.." || exit 2
. bench/lib.sh

target_ms=20
# case = tag, scenario, optional override (KEY=VALUE), separated by '|'
# every bundled single-run scenario on its default climate (the column) and on hz_fit
cases="earth|scenarios/earth.cfg|
earth-hz_fit|scenarios/earth.cfg|climate.model=hz_fit
venus|scenarios/venus.cfg|
venus-hz_fit|scenarios/venus.cfg|climate.model=hz_fit
mars|scenarios/mars.cfg|
mars-hz_fit|scenarios/mars.cfg|climate.model=hz_fit
demo|scenarios/demo.cfg|
demo-hz_fit|scenarios/demo.cfg|climate.model=hz_fit
demo-dry|scenarios/demo-dry.cfg|
demo-dry-hz_fit|scenarios/demo-dry.cfg|climate.model=hz_fit"

work=$(mktemp -d "${TMPDIR:-/tmp}/volev-bench.XXXXXX") || exit 2
trap 'rm -rf "$work"' EXIT
trap 'exit 130' INT TERM

echo "volev benchmark: $bin, $n runs per scenario, target ${target_ms} ms per run (load $(load1) at the start)"
echo "(solver time = median of wall_time_s in summary.csv; process time = whole 'volev run' incl. start-up and output)"
printf '%-16s %10s %9s %9s %10s %8s %10s %6s %9s  %s\n' \
    case solver_ms min_ms max_ms process_ms steps rhs_evals nodes table_ms result

old_ifs=$IFS
IFS='
'
for line in $cases; do
    IFS=$old_ifs
    tag=${line%%|*}
    rest=${line#*|}
    scen=${rest%%|*}
    set_kv=${rest#*|}
    : >"$work/$tag.wall"
    : >"$work/$tag.proc"
    steps=-
    rhs=-
    err=""
    if [ ! -r "$scen" ]; then
        err="scenario file not found"
    fi
    i=0
    while [ -z "$err" ] && [ "$i" -lt "$n" ]; do
        i=$((i + 1))
        out="$work/$tag-$i"
        t0=$(now_ns)
        if [ -n "$set_kv" ]; then
            set -- --set "$set_kv"
        else
            set --
        fi
        if ! "$bin" run "$scen" -o "$out" "$@" >"$work/stdout" 2>"$work/stderr"; then
            err="run $i failed: $(head -n 1 "$work/stderr")"
            break
        fi
        t1=$(now_ns)
        if [ -n "$t0" ] && [ -n "$t1" ]; then
            echo $((t1 - t0)) >>"$work/$tag.proc"
        fi
        w=$(summary_value "$out/summary.csv" wall_time_s 2>/dev/null)
        if [ -z "$w" ]; then
            err="no wall_time_s in $out/summary.csv"
            break
        fi
        echo "$w" >>"$work/$tag.wall"
        steps=$(summary_value "$out/summary.csv" steps)
        rhs=$(summary_value "$out/summary.csv" rhs_evaluations)
        nodes=$(summary_value "$out/summary.csv" climate_table_nodes)
        build=$(summary_value "$out/summary.csv" climate_table_build_s)
        rm -rf "$out"
    done

    if [ -n "$err" ]; then
        printf '%-16s %10s %9s %9s %10s %8s %10s %6s %9s  %s\n' "$tag" - - - - - - - - "FAIL ($err)"
        continue
    fi
    # shellcheck disable=SC2046  # three numbers, split on purpose
    set -- $(stats_of "$work/$tag.wall" 1000)
    med=$1 lo=$2 hi=$3
    if [ -s "$work/$tag.proc" ]; then
        proc=$(stats_of "$work/$tag.proc" 0.000001 | cut -d' ' -f1)
    else
        proc=-
    fi
    result=$(awk -v m="$med" -v t="$target_ms" 'BEGIN { print (m + 0 <= t + 0) ? "PASS" : "FAIL" }')
    table_ms=$(awk -v b="${build:-0}" 'BEGIN { printf "%.1f", b * 1000 }')
    printf '%-16s %10s %9s %9s %10s %8s %10s %6s %9s  %s\n' \
        "$tag" "$med" "$lo" "$hi" "$proc" "${steps:--}" "${rhs:--}" "${nodes:--}" "$table_ms" "$result"
done
IFS=$old_ifs
exit 0
