#!/bin/sh
# bench/scipy/compare.sh BIN [N] [KEY=VALUE]... -- volev against a plain SciPy solve_ivp
# implementation of the same core equations (bench/scipy/core.cfg, core.py).
# 1. runs `volev run bench/scipy/core.cfg` N times (default 10; KEY=VALUE pairs are passed
#    as --set overrides, e.g. run.rel_tolerance=1e-9 run.abs_tolerance_kg=10) and takes the
#    median of its own wall_time_s, its steps and RHS evaluations;
# 2. runs core.py on volev's resolved scenario: the right-hand side at volev's output rows,
#    solve_ivp with BDF, LSODA and Radau (each with SciPy's own finite-difference Jacobian
#    and with volev's), a tight Radau reference, the table of wall times, steps, RHS
#    evaluations and ratios to volev, and the differences at the shared output ages.
# Python: $PYTHON if set, else /usr/bin/python3, else python3 on PATH -- the first that
# imports SciPy (sh scripts/deps.sh --bench installs Debian's python3-scipy); without one
# the script prints a skip line and exits 0. `compare.sh --have-scipy` only tells (exit 0
# if such a Python exists, 1 if not).
# Informational: exit 0 whatever the timings; 1 if the results disagree beyond the
# tolerance (core.py's verdict) or a run fails; 2 for bad arguments or a missing binary.
set -u

usage() { echo "usage: sh bench/scipy/compare.sh path/to/volev [N] [KEY=VALUE]... | --have-scipy" >&2; exit 2; }
[ "$#" -ge 1 ] || usage

# the first of $PYTHON, /usr/bin/python3, python3 that imports SciPy, or nothing
find_python() {
    for cand in ${PYTHON:-} /usr/bin/python3 python3; do
        if command -v "$cand" >/dev/null 2>&1 && "$cand" -c 'import scipy.integrate' >/dev/null 2>&1; then
            echo "$cand"
            return 0
        fi
    done
    return 1
}
if [ "$1" = "--have-scipy" ]; then
    [ "$#" -eq 1 ] || usage
    find_python >/dev/null
    exit
fi
bin=$1
shift
n=10
if [ "$#" -ge 1 ]; then
    case "$1" in
        *=*) ;;
        ''|*[!0-9]*) usage ;;
        *) n=$1; shift ;;
    esac
fi
[ "$n" -ge 1 ] || usage
for kv in "$@"; do
    case "$kv" in *=*) ;; *) usage ;; esac
done
case "$bin" in */*) ;; *) bin=./$bin ;; esac
[ -x "$bin" ] || { echo "compare: $bin is not an executable; run 'make' first" >&2; exit 2; }
bin="$(cd "$(dirname "$bin")" && pwd)/$(basename "$bin")"
here=$(cd "$(dirname "$0")" && pwd)
cd "$here/../.." || exit 2

py=$(find_python)
if [ -z "$py" ]; then
    echo "compare: skipped: no Python with SciPy (sh scripts/deps.sh --bench installs it)"
    exit 0
fi

work=$(mktemp -d "${TMPDIR:-/tmp}/volev-scipy.XXXXXX") || exit 2
trap 'rm -rf "$work"' EXIT
trap 'exit 130' INT TERM

summary_value() {
    awk -F, -v key="$2" '
        /^#/ { next }
        !seen_header { seen_header = 1; next }
        $1 == key { print $2; exit }
    ' "$1"
}

sets=""
for kv in "$@"; do sets="$sets --set $kv"; done
echo "volev vs SciPy: $bin, bench/scipy/core.cfg${sets:+ with$sets}, $n volev runs; $("$py" -c 'import sys, scipy, numpy; print("Python %s, SciPy %s, NumPy %s" % (sys.version.split()[0], scipy.__version__, numpy.__version__))')"
: > "$work/walls"
i=0
while [ "$i" -lt "$n" ]; do
    i=$((i + 1))
    out="$work/volev-$i"
    # shellcheck disable=SC2086  # the --set pairs, split on purpose
    if ! "$bin" run bench/scipy/core.cfg -o "$out" $sets > "$work/stdout" 2> "$work/stderr"; then
        echo "compare: volev run failed: $(head -n 1 "$work/stderr")"
        exit 1
    fi
    summary_value "$out/summary.csv" wall_time_s >> "$work/walls"
    [ "$i" -eq 1 ] || rm -rf "$out"
done
steps=$(summary_value "$work/volev-1/summary.csv" steps)
rhs=$(summary_value "$work/volev-1/summary.csv" rhs_evaluations)
ms=$(sort -g "$work/walls" | awk '{ v[NR] = $1 * 1000 } END {
    printf "%.3f", (NR % 2) ? v[(NR + 1) / 2] : (v[NR / 2] + v[NR / 2 + 1]) / 2 }')
range=$(sort -g "$work/walls" | awk 'NR == 1 { lo = $1 } { hi = $1 } END { printf "%.3f-%.3f", lo * 1000, hi * 1000 }')
echo "volev: median wall_time_s ${ms} ms (range $range ms over $n runs), $steps steps, $rhs RHS evaluations"
echo

"$py" bench/scipy/core.py "$work/volev-1/scenario.resolved.cfg" \
    --volev-dir "$work/volev-1" --reference --repeat 3 \
    --volev-ms "$ms" --volev-steps "$steps" --volev-rhs "$rhs"
rc=$?
case $rc in
    0) exit 0 ;;
    1) echo "compare: results disagree (see above)"; exit 1 ;;
    *) echo "compare: core.py failed (exit $rc)"; exit 1 ;;
esac
