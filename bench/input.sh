#!/bin/sh
# bench/input.sh BIN [OLD_BIN] [N] -- the cost of reading large and hostile scenarios.
# Each case is a generated file read by `volev validate FILE` (no run): unknown keys in
# one group and spread over groups, full groups up to the 1 MiB limit, a valid file
# at the limit, 16 MiB and 200 MiB files,
# devices.
# Reported per case: the file size, the exit status, the median wall time of N runs
# (default 3) and the peak memory (GNU time's maximum resident set, "-" without it), for
# BIN and, given, OLD_BIN (a build from before the input limits, to compare). A case that
# runs longer than 120 s (reading /dev/zero: 10 s) is stopped (status 124; with GNU time
# the status is then its own, 124 or 137) and every run is kept under 4 GB of address space. Informational: exit 0 whatever the
# timings (docs/performance.md, section 13).
set -u

usage() { echo "usage: sh bench/input.sh path/to/volev [path/to/old/volev] [N]" >&2; exit 2; }
[ "$#" -ge 1 ] && [ "$#" -le 3 ] || usage
absolute() { case "$1" in /*) echo "$1" ;; *) echo "$(pwd)/$1" ;; esac; }
bin=$(absolute "$1")
[ -x "$bin" ] || { echo "bench: $bin is not an executable; run 'make' first" >&2; exit 2; }
old=
if [ "$#" -ge 2 ]; then
    case "$2" in
        *[!0-9]*) old=$(absolute "$2"); [ -x "$old" ] || usage ;;
        *) set -- "$1" "" "$2" ;;
    esac
fi
n=${3:-3}
case "$n" in ''|*[!0-9]*) usage ;; esac
cd "$(dirname "$0")/.." || exit 2
. bench/lib.sh

dir=$(mktemp -d "${TMPDIR:-/tmp}/volev-input-bench.XXXXXX") || exit 2
trap 'rm -rf "$dir"' EXIT INT TERM
valid='climate = { model = "hz_fit"; };'

# KEYS unknown keys in one group (the top level), one per line
one_group() { awk -v n="$1" -v v="$valid" 'BEGIN { print v; for (i = 0; i < n; i++) printf "bogus_%d = 1;\n", i }'; }
# KEYS unknown keys in groups of 200 (each group within the limit of 256)
spread() {
    awk -v n="$1" -v v="$valid" 'BEGIN {
        print v
        for (i = 0; i < n; i++) {
            if (i % 200 == 0) printf "%sg%d = {\n", i ? "};\n" : "", i / 200
            printf "  bogus_%d = 1;\n", i
        }
        print "};"
    }'
}
# the costliest text for libconfig within the limits: groups of 256 settings (the limit)
# with short names, 200 such groups in each of three outer groups, about 1 MiB; the first
# setting is an unknown key, so the walk stops at once and the time is libconfig's parse
full_groups() {
    awk -v v="$valid" 'BEGIN {
        print v
        for (g = 0; g < 520; g++) {
            if (g % 200 == 0) printf "%so%d = {\n", g ? "};\n" : "", g / 200
            printf "g%d = {\n", g
            for (i = 0; i < 256; i++) printf "k%d=1;\n", i
            print "};"
        }
        print "};"
    }'
}
# a valid scenario padded with comment lines to BYTES bytes, the last byte a newline
padded() {
    { echo "$valid"; yes '# a comment line of padding, 64 bytes long, for the size cases.' ; } |
        head -c "$(($1 - 1))"
    echo
}

one_group 5000 > "$dir/keys5k.cfg"
one_group 10000 > "$dir/keys10k.cfg"
one_group 20000 > "$dir/keys20k.cfg"
spread 5000 > "$dir/spread5k.cfg"
spread 10000 > "$dir/spread10k.cfg"
spread 20000 > "$dir/spread20k.cfg"
full_groups > "$dir/groups1m.cfg"
padded 1048576 > "$dir/pad1m.cfg"     # 1 MiB: the limit
padded 16777216 > "$dir/pad16m.cfg"
padded 209715200 > "$dir/pad200m.cfg" # the 200 MB scenario of issue 18
printf 'star = { luminosity_model = "table"; track_file = "/dev/zero"; };\n%s\n' "$valid" \
    > "$dir/track-zero.cfg"

# median seconds, peak KB and exit status of `BIN validate FILE`, N times, each stopped
# after LIMIT seconds (status 124) and kept under 4 GB of address space
measure() {
    b=$1; f=$2; limit=$3; rss=-; rc=0
    : > "$dir/times"
    i=0
    while [ "$i" -lt "$n" ]; do
        t0=$(now_ns)
        if [ -x /usr/bin/time ]; then
            (ulimit -v 4000000; /usr/bin/time -f %M -o "$dir/rss" timeout "$limit" "$b" \
                validate "$f" >/dev/null 2>&1)
            rc=$?
            rss=$(tail -n 1 "$dir/rss")
        else
            (ulimit -v 4000000; timeout "$limit" "$b" validate "$f" >/dev/null 2>&1); rc=$?
        fi
        t1=$(now_ns)
        [ -n "$t0" ] && [ -n "$t1" ] && echo "$(( (t1 - t0) / 1000 ))" >> "$dir/times"
        i=$((i + 1))
    done
    s=$(stats_of "$dir/times" 1e-6 | awk '{ printf "%.3f", $1 }')
    echo "$s $rss $rc"
}

printf '%-12s %10s   %-24s %s\n' case bytes "new: s KB exit" "old: s KB exit"
for c in keys5k keys10k keys20k spread5k spread10k spread20k groups1m pad1m pad16m pad200m dev-zero \
    track-zero; do
    limit=120
    case "$c" in
        dev-zero) f=/dev/zero; bytes=-; limit=10 ;;
        *) f="$dir/$c.cfg"; bytes=$(wc -c < "$f" | tr -d ' ') ;;
    esac
    new=$(measure "$bin" "$f" "$limit")
    was=-
    [ -n "$old" ] && was=$(measure "$old" "$f" "$limit")
    printf '%-12s %10s   %-24s %s\n' "$c" "$bytes" "$new" "$was"
done
exit 0
