#!/bin/sh
# fuzz.sh [SECONDS] -- build the libFuzzer targets (`make fuzz`, clang, build-fuzz/) and run
# each of fuzz_scenario, fuzz_track and fuzz_catalogue for SECONDS/3 seconds, one after
# the other (default 60 s in total). Exits non-zero when any target finds a crash, a
# leak, a sanitizer report or a timeout; the reproducers are left in build-fuzz/crashes/
# (replay one with `build-fuzz/fuzz_TARGET FILE`; keep it as a regression under
# tests/fuzz/regressions/TARGET/, see DEVELOPERS.md, "Fuzzing").
#
# Seeds: tests/fuzz/corpus/TARGET/ and tests/fuzz/regressions/TARGET/ (read only). New
# inputs go to build-fuzz/corpus/TARGET/, kept between local runs; logs to
# build-fuzz/fuzz_TARGET.log. Needs clang with libFuzzer: sh scripts/deps.sh --hardening.
set -eu

cd "$(dirname "$0")/.."
total=${1:-60}
case "$total" in
    '' | *[!0-9]*) echo "usage: sh scripts/fuzz.sh [SECONDS]" >&2; exit 2 ;;
esac
per=$((total / 3))
[ "$per" -ge 1 ] || per=1

if ! command -v "${FUZZ_CC:-clang}" >/dev/null 2>&1; then
    echo "fuzz.sh: ${FUZZ_CC:-clang} not found; install it with: sh scripts/deps.sh --hardening" >&2
    exit 1
fi

start=$(date +%s)
make -j2 --no-print-directory fuzz
echo "fuzz.sh: built in $(($(date +%s) - start)) s; ${per} s per target"

mkdir -p build-fuzz/crashes
export ASAN_OPTIONS="detect_leaks=1:abort_on_error=0${ASAN_OPTIONS:+:$ASAN_OPTIONS}"
export UBSAN_OPTIONS="print_stacktrace=1:halt_on_error=1${UBSAN_OPTIONS:+:$UBSAN_OPTIONS}"
failed=""
for target in scenario track catalogue; do
    case "$target" in
        scenario) max_len=8192; dict="-dict=tests/fuzz/scenario.dict" ;;
        track) max_len=2048; dict="" ;;
        catalogue) max_len=4096; dict="" ;;
    esac
    work=build-fuzz/corpus/$target
    log=build-fuzz/fuzz_$target.log
    mkdir -p "$work"
    seeds="tests/fuzz/corpus/$target"
    [ -d "tests/fuzz/regressions/$target" ] && seeds="$seeds tests/fuzz/regressions/$target"
    rc=0
    # $dict and $seeds are lists of words: split on purpose
    # shellcheck disable=SC2086
    "build-fuzz/fuzz_$target" -max_total_time="$per" -max_len="$max_len" -timeout=10 \
        -rss_limit_mb=2048 -print_final_stats=1 \
        -artifact_prefix="build-fuzz/crashes/$target-" $dict "$work" $seeds \
        >"$log" 2>&1 || rc=$?
    runs=$(sed -n 's/^stat::number_of_executed_units: *//p' "$log" | tail -n 1)
    if [ "$rc" -ne 0 ] || grep -Eq 'runtime error:|ERROR: [A-Za-z]+Sanitizer|ERROR: libFuzzer' "$log"; then
        failed="$failed $target"
        echo "fuzz.sh: fuzz_$target FAILED (exit $rc); end of $log:" >&2
        tail -n 60 "$log" >&2
    else
        echo "fuzz.sh: fuzz_$target: ${runs:-?} inputs in ${per} s, no finding"
    fi
done

echo "fuzz.sh: $(($(date +%s) - start)) s in total"
if [ -n "$failed" ]; then
    echo "fuzz.sh: findings in:$failed; reproducers in build-fuzz/crashes/:" >&2
    ls -l build-fuzz/crashes/ >&2
    exit 1
fi
