# bench/lib.sh -- helpers shared by the benchmark scripts (sourced, not run).
# shellcheck shell=sh

# The benchmarks time the column climate's table building too: no table cache on disk
# (docs/performance.md section 6), whatever the environment says.
VOLEV_CACHE_DIR=
export VOLEV_CACHE_DIR

# value of NAME in a summary.csv (comment lines, header "name,value,unit", rows)
summary_value() {
    awk -F, -v key="$2" '
        /^#/ { next }
        !seen_header { seen_header = 1; next }
        { name = $1; gsub(/^[ \t]+|[ \t\r]+$/, "", name) }
        name == key { v = $2; gsub(/^[ \t]+|[ \t\r]+$/, "", v); print v; exit }
    ' "$1"
}

# process wall clock in ns when date supports %N (GNU), else empty
now_ns() {
    t=$(date +%s%N 2>/dev/null)
    case "$t" in *N*|'') echo "" ;; *) echo "$t" ;; esac
}

# median / min / max of the numbers in file $1 (one per line), scaled by $2
stats_of() {
    sort -g "$1" | awk -v k="$2" '
        { v[NR] = $1 * k }
        END {
            if (NR == 0) { print "- - -"; exit }
            m = (NR % 2) ? v[(NR + 1) / 2] : (v[NR / 2] + v[NR / 2 + 1]) / 2
            printf "%.2f %.2f %.2f\n", m, v[1], v[NR]
        }'
}

# peak resident set size, kB, from the output of GNU time -v
peak_kb() { awk -F: '/Maximum resident set size/ { gsub(/ /, "", $2); print $2 }' "$1"; }

# ensemble_scenario OUT MEMBERS: the Earth-like ensemble of bench/sweep.sh --
# scenarios/earth.cfg on the habitable-zone-fit climate with 40 log-spaced and 20 linear
# output ages, a Latin hypercube of MEMBERS over initial water (0.1-10 TO, log-uniform),
# the XUV heating efficiency (0.05-0.3) and the orbit (0.95-1.10 au), seed 4242.
# Run from the repository's top folder. Returns 1 if earth.cfg no longer has the lines
# it edits.
ensemble_scenario() {
    sed 's/^run:$/climate: { model = "hz_fit"; };\nrun:/' scenarios/earth.cfg |
        sed 's/^  end_yr = 4.57e9;.*/  end_yr = 4.57e9;\n  log_points = 40;\n  linear_points = 20;/' > "$1"
    cat >> "$1" <<CFG

sweep:
{
  design = "latin_hypercube";
  members = $2;
  seed = 4242;
  axes = (
    { key = "inventory.surface_water_to"; distribution = "log_uniform"; low = 0.1; high = 10.0; },
    { key = "escape.xuv_efficiency"; distribution = "uniform"; low = 0.05; high = 0.3; },
    { key = "planet.orbit_au"; distribution = "uniform"; low = 0.95; high = 1.10; }
  );
};
CFG
    grep -q 'model = "hz_fit"' "$1" && grep -q 'log_points = 40' "$1"
}

# load average over the last minute (Linux), or "-"
load1() { cut -d' ' -f1 /proc/loadavg 2>/dev/null || echo -; }
