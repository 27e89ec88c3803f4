#!/bin/sh
# bench/sweep.sh BIN [MEMBERS] [MPI_BIN] -- ensemble throughput of `volev sweep`.
# An Earth-like ensemble: scenarios/earth.cfg on the habitable-zone-fit climate with 40
# log-spaced and 20 linear output ages per member, a Latin hypercube over initial water
# (0.1-10 TO, log-uniform), the XUV heating efficiency (0.05-0.3) and the orbit
# (0.95-1.10 au). It is swept with 1 thread, 2 threads and, given an MPI build, 2 ranks
# of 1 thread; prints members per second, the projected time for 10 000 members and the
# peak memory of the whole process (bench/ensemble.sh measures the marginal memory of a
# member), and checks that the three members.csv files are identical.
# Also prints the CPU time per member (user + system of the whole process over the
# members) and the parallel efficiency of 2 threads and of 2 ranks against one thread.
# Target (issue 17, speed): 10 000 Earth-like members in under 60 s on 2 cores, 2-rank
# efficiency at least 90 %.
# Informational: exits 0 whatever the timings (2 for bad arguments, 1 if outputs differ).
set -u

usage() { echo "usage: sh bench/sweep.sh path/to/volev [MEMBERS] [path/to/mpi/volev]" >&2; exit 2; }
[ "$#" -ge 1 ] && [ "$#" -le 3 ] || usage
abs() { echo "$(cd "$(dirname "$1")" && pwd)/$(basename "$1")"; }
bin=$(abs "$1")
[ -x "$bin" ] || { echo "bench: $1 is not an executable" >&2; exit 2; }
n=${2:-1000}
case "$n" in ''|*[!0-9]*) usage ;; esac
mpi=""
[ "$#" -eq 3 ] && [ -x "$3" ] && mpi=$(abs "$3")
cd "$(dirname "$0")/.." || exit 2
. bench/lib.sh

work=$(mktemp -d "${TMPDIR:-/tmp}/volev-sweep-bench.XXXXXX") || exit 2
trap 'rm -rf "$work"' EXIT
trap 'exit 130' INT TERM

scen="$work/earth-ensemble.cfg"
ensemble_scenario "$scen" "$n" || {
    echo "bench: could not derive the ensemble scenario from scenarios/earth.cfg" >&2; exit 2; }

now() { date +%s.%N; }

# run TAG COMMAND...: time the sweep into $work/TAG, print one line
run() {
    tag=$1; shift
    t0=$(now)
    /usr/bin/time -v "$@" -o "$work/$tag" --quiet > "$work/$tag.out" 2> "$work/$tag.time"
    rc=$?
    t1=$(now)
    if [ $rc -ne 0 ]; then
        echo "$tag: FAILED (exit $rc)"; tail -3 "$work/$tag.time"; return
    fi
    cpu=$(awk -F: '/User time|System time/ { s += $2 } END { printf "%.3f", s }' "$work/$tag.time")
    awk -v tag="$tag" -v n="$n" -v t0="$t0" -v t1="$t1" -v cpu="$cpu" -v kb="$(peak_kb "$work/$tag.time")" 'BEGIN {
        s = t1 - t0; r = n / s
        printf "%-10s %7d members %8.2f s %8.1f members/s  CPU %6.2f ms/member  10000 members: %6.1f s  peak RSS %.1f MB\n",
            tag, n, s, r, 1000 * cpu / n, 10000 / r, kb / 1024 }'
    echo "$n $t0 $t1" > "$work/$tag.rate"
}

# efficiency TAG WORKERS: members per second of TAG over WORKERS times those of threads-1
efficiency() {
    [ -f "$work/$1.rate" ] && [ -f "$work/threads-1.rate" ] || return 0
    awk -v tag="$1" -v k="$2" '
        FNR == 1 && NR == 1 { r1 = $1 / ($3 - $2) }
        FNR == 1 && NR > 1 { r = $1 / ($3 - $2) }
        END { printf "%-10s parallel efficiency %.0f %% (members/s over %d x threads-1)\n", tag, 100 * r / (k * r1), k }
    ' "$work/threads-1.rate" "$work/$1.rate"
}

echo "Earth-like ensemble: $n members (scenarios/earth.cfg, hz_fit climate, 60 output ages)"
run threads-1 "$bin" sweep "$scen" -j 1
run threads-2 "$bin" sweep "$scen" -j 2
if [ -n "$mpi" ] && command -v mpirun >/dev/null 2>&1; then
    OMPI_ALLOW_RUN_AS_ROOT=1 OMPI_ALLOW_RUN_AS_ROOT_CONFIRM=1 \
        run mpi-2x1 mpirun --oversubscribe -n 2 "$mpi" sweep "$scen" -j 1
else
    echo "mpi-2x1: skipped (no MPI build given, or no mpirun)"
fi
efficiency threads-2 2
efficiency mpi-2x1 2
status=0
for tag in threads-2 mpi-2x1; do
    [ -f "$work/$tag/members.csv" ] || continue
    if cmp -s "$work/threads-1/members.csv" "$work/$tag/members.csv"; then
        echo "$tag members.csv identical to threads-1"
    else
        echo "$tag members.csv DIFFERS from threads-1"; status=1
    fi
done
[ -f "$work/threads-1/ensemble_summary.csv" ] && {
    echo "outcome classes (threads-1):"
    awk -F, '$1 == "class" && $4 > 0 { printf "  %-11s %s\n", $2, $4 }' "$work/threads-1/ensemble_summary.csv"
}
exit $status
