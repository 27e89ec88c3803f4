#!/bin/sh
# bench/ensemble.sh BIN [THREADS [REPEATS [MEMBERS...]]] -- how `volev sweep` scales with
# the ensemble size: the Earth-like ensemble of bench/sweep.sh (bench/lib.sh,
# ensemble_scenario) with MEMBERS members (default 100 1000 5000) on THREADS threads
# (default 2), each size REPEATS times (default 3). Per size (medians over the repeats):
# the wall time of the whole `volev sweep` process and members per second; the CPU time
# it used (user + system, GNU time -v) and the CPU time per member; the share of CPU it
# got (about THREADS x 100 % on an otherwise idle machine; a run that got less than 90 %
# of that shared the cores with other programs and is marked "contended": its wall time
# says little, its CPU time still does); the peak resident set size.
# Then least-squares lines through the medians, wall = a + b x members,
# CPU = a' + b' x members and peak RSS = c + d x members: b, b' are the marginal cost of
# a member, d its marginal memory, which the driver's own record of a finished member
# (sizeof(vl_cli_record) in src/cli/sweep_internal.h, read from the binary's debug information with gdb
# when available) can be set against.
# Informational: exits 0 whatever the timings (2 for bad arguments, 1 if a sweep fails).
set -u

usage() { echo "usage: sh bench/ensemble.sh path/to/volev [THREADS [REPEATS [MEMBERS...]]]" >&2; exit 2; }
[ "$#" -ge 1 ] || usage
bin=$1
shift
threads=${1:-2}
[ "$#" -ge 1 ] && shift
repeats=${1:-3}
[ "$#" -ge 1 ] && shift
sizes=${*:-100 1000 5000}
for v in "$threads" "$repeats" $sizes; do
    case "$v" in ''|*[!0-9]*) usage ;; esac
    [ "$v" -ge 1 ] || usage
done
case "$bin" in */*) ;; *) bin=./$bin ;; esac
[ -x "$bin" ] || { echo "bench: $bin is not an executable; run 'make' first" >&2; exit 2; }
[ -x /usr/bin/time ] || { echo "bench: needs GNU time (/usr/bin/time)" >&2; exit 2; }
bin="$(cd "$(dirname "$bin")" && pwd)/$(basename "$bin")"
cd "$(dirname "$0")/.." || exit 2
. bench/lib.sh

work=$(mktemp -d "${TMPDIR:-/tmp}/volev-ensemble.XXXXXX") || exit 2
trap 'rm -rf "$work"' EXIT
trap 'exit 130' INT TERM

record=-
if command -v gdb >/dev/null 2>&1; then
    record=$(gdb -batch -ex 'print sizeof(vl_cli_record)' "$bin" 2>/dev/null | awk '/^\$1 = / { print $3 }')
    [ -n "$record" ] || record=-
fi

echo "Earth-like ensemble (bench/sweep.sh's scenario): sizes $sizes, $threads threads, $repeats runs per size (load $(load1) at the start)"
printf '%8s %9s %8s %10s %9s %13s %6s %8s  %s\n' members wall_s min_s members/s cpu_s cpu_ms/member cpu_% peak_MB classes
: > "$work/points"
status=0
for n in $sizes; do
    scen="$work/ens-$n.cfg"
    ensemble_scenario "$scen" "$n" || {
        echo "bench: could not derive the ensemble scenario from scenarios/earth.cfg" >&2; exit 2; }
    : > "$work/walls"
    : > "$work/peaks"
    : > "$work/cpus"
    : > "$work/cpusec"
    i=0
    failed=""
    while [ "$i" -lt "$repeats" ]; do
        i=$((i + 1))
        rm -rf "$work/out"
        t0=$(date +%s.%N)
        /usr/bin/time -v "$bin" sweep "$scen" -o "$work/out" -j "$threads" --quiet \
            > "$work/stdout" 2> "$work/time"
        rc=$?
        t1=$(date +%s.%N)
        if [ $rc -ne 0 ]; then
            failed="exit $rc: $(grep -v '^\s' "$work/time" | head -n 1)"
            break
        fi
        awk -v a="$t0" -v b="$t1" 'BEGIN { printf "%.6f\n", b - a }' >> "$work/walls"
        peak_kb "$work/time" >> "$work/peaks"
        awk -F: '/Percent of CPU this job got/ { gsub(/[ %]/, "", $2); print $2 }' "$work/time" >> "$work/cpus"
        awk -F: '/(User|System) time \(seconds\)/ { s += $2 } END { print s }' "$work/time" >> "$work/cpusec"
    done
    if [ -n "$failed" ]; then
        printf '%8d  FAILED (%s)\n' "$n" "$failed"
        status=1
        continue
    fi
    classes=$(awk -F, '$1 == "class" && $4 > 0 { printf "%s%s %s", sep, $2, $4; sep = ", " }' \
        "$work/out/ensemble_summary.csv" 2>/dev/null)
    # shellcheck disable=SC2046  # three numbers, split on purpose
    set -- $(stats_of "$work/walls" 1)
    wmed=$1 wmin=$2
    # shellcheck disable=SC2046
    set -- $(stats_of "$work/peaks" 1)
    pmed=$1
    cpu=$(stats_of "$work/cpus" 1 | cut -d' ' -f1)
    csec=$(stats_of "$work/cpusec" 1 | cut -d' ' -f1)
    echo "$n $wmed $pmed $csec" >> "$work/points"
    awk -v n="$n" -v w="$wmed" -v lo="$wmin" -v t="$threads" -v p="$pmed" -v c="$csec" \
        -v cpu="$cpu" -v cl="$classes" 'BEGIN {
        printf "%8d %9.2f %8.2f %10.1f %9.2f %13.2f %6.0f %8.2f  %s%s\n", n, w, lo, n / w, c,
            1000 * c / n, cpu, p / 1024, cl, (cpu < 90 * t ? "  (contended)" : "") }'
done
awk -v rec="$record" '
    { n[NR] = $1; w[NR] = $2; p[NR] = $3; c[NR] = $4; sn += $1; sw += $2; sp += $3; sc += $4 }
    END {
        if (NR < 2) { print "(one size: no fit)"; exit }
        mn = sn / NR; mw = sw / NR; mp = sp / NR; mc = sc / NR
        for (i = 1; i <= NR; i++) {
            sxx += (n[i] - mn) ^ 2; sxw += (n[i] - mn) * (w[i] - mw)
            sxp += (n[i] - mn) * (p[i] - mp); sxc += (n[i] - mn) * (c[i] - mc)
        }
        b = sxw / sxx; a = mw - b * mn; d = sxp / sxx; cc = mp - d * mn; bc = sxc / sxx; ac = mc - bc * mn
        for (i = 1; i <= NR; i++) {
            r = w[i] - (a + b * n[i]); if (r < 0) r = -r; if (r > dw) dw = r
            r = c[i] - (ac + bc * n[i]); if (r < 0) r = -r; if (r > dc) dc = r
            q = w[i] / n[i]; if (i == 1 || q < qlo) qlo = q; if (i == 1 || q > qhi) qhi = q
        }
        printf "wall     = %.3f s + %.3f ms x members (largest residual %.2f s)\n", a, 1000 * b, dw
        printf "CPU      = %.3f s + %.3f ms x members (largest residual %.2f s)\n", ac, 1000 * bc, dc
        printf "wall per member: %.2f-%.2f ms over the sizes (%.1f %% apart)\n", 1000 * qlo, 1000 * qhi, 100 * (qhi / qlo - 1)
        printf "peak RSS = %.2f MB + %.0f bytes x members\n", cc / 1024, 1024 * d
        printf "driver record of a finished member (sizeof(vl_cli_record), src/cli/sweep_internal.h): %s bytes\n", rec
    }' "$work/points"
exit $status
