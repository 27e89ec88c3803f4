#!/bin/sh
# deps.sh [--test] [--hardening] [--bench] [--man] -- make sure the Debian packages needed
# are installed. Without an option: what `make demo` needs to build, run and render volev
# (compiler, GSL, SUNDIALS, libconfig, gnuplot). Quiet when everything is present. As
# root, missing packages are installed with apt-get; otherwise the command to run is
# printed.
#   --test       also what `make check` needs: Check, OpenMPI (the MPI sweep test), python3
#   --hardening  --test and the fuzzing and leak-checking tools CI uses (clang with
#                libFuzzer, valgrind): make fuzz, the valgrind stage of .ci/run; and
#                pandas, so that make check tests python/ with pandas as well as without
#   --bench      also SciPy, for the side-by-side benchmark (bench/scipy)
#   --man        man-db, to read docs/volev.1 on a terminal (`make man`)
set -eu

PACKAGES="gcc make pkg-config libgsl-dev libsundials-dev libconfig-dev gnuplot-nox"
TEST="check openmpi-bin libopenmpi-dev python3"
for opt in "$@"; do
    case "$opt" in
        --test) PACKAGES="$PACKAGES $TEST" ;;
        --hardening) PACKAGES="$PACKAGES $TEST clang libclang-rt-14-dev valgrind python3-pandas" ;;
        --bench) PACKAGES="$PACKAGES python3 python3-scipy" ;;
        --man) PACKAGES="$PACKAGES man-db" ;;
        *) echo "usage: sh scripts/deps.sh [--test] [--hardening] [--bench] [--man]" >&2; exit 2 ;;
    esac
done

if ! command -v dpkg-query >/dev/null 2>&1; then
    echo "deps.sh: dpkg-query not found (not a Debian-based system?)." >&2
    echo "deps.sh: install the equivalents of these Debian packages by hand:" >&2
    echo "    $PACKAGES" >&2
    exit 1
fi

missing=""
for pkg in $PACKAGES; do
    status=$(dpkg-query -W -f='${Status}' "$pkg" 2>/dev/null || true)
    case "$status" in
        *" ok installed") ;;
        *) missing="$missing $pkg" ;;
    esac
done
missing=${missing# }

if [ -z "$missing" ]; then
    exit 0
fi

if [ "$(id -u)" -eq 0 ]; then
    echo "deps.sh: installing missing packages: $missing" >&2
    apt-get update
    # $missing is a space-separated list of package names: split it on purpose
    # shellcheck disable=SC2086
    DEBIAN_FRONTEND=noninteractive apt-get install -y --no-install-recommends $missing
    exit 0
fi

echo "deps.sh: missing packages: $missing" >&2
echo "deps.sh: install them with:" >&2
echo "sudo apt-get install -y $missing" >&2
exit 1
