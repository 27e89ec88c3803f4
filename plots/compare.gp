# compare.gp -- two volev runs side by side on shared axes (gnuplot >= 5.4).
#
# Variables (pass with -e "name='value'; ..."):
#   fileA, fileB     series.csv of the two runs (required)
#   labelA, labelB   names of the runs in the legend (default: the file names)
#   outfile          figure to write (required)
#   fmt              png | pdf | svg (default png)
# Example (what `volev compare wet dry -o cmp` does):
#   gnuplot -e "fileA='wet/series.csv'; fileB='dry/series.csv'; labelA='wet'; labelB='dry'; outfile='cmp/compare.png'; fmt='png'" plots/compare.gp
#
# Four panels on a shared logarithmic axis of stellar age: surface water (TO), CO2
# and O2 partial pressures (bar) on logarithmic axes, surface temperature (K).
# Columns are found by their names in the header line of series.csv. Run A is
# drawn solid blue, run B dashed vermillion (Okabe-Ito, safe for colour-blind
# readers and distinct in greyscale). Non-positive values are left out of the
# logarithmic panels; a quantity that is zero throughout both runs leaves its panel
# empty with a note instead of stopping the plot.

do for [v in "fileA fileB outfile"] {
    if (!exists(v)) {
        print sprintf("compare.gp: set %s", v)
        exit status 2
    }
}
if (!exists("labelA") || strlen(labelA) == 0) { labelA = fileA }
if (!exists("labelB") || strlen(labelB) == 0) { labelB = fileB }
if (!exists("fmt") || strlen(fmt) == 0) { fmt = "png" }
if (fmt eq "png") {
    set terminal pngcairo size 900,1100 enhanced font "sans,11"
} else {
    if (fmt eq "pdf") {
        set terminal pdfcairo size 7in,8.5in enhanced font "sans,9"
    } else {
        if (fmt eq "svg") {
            set terminal svg size 900,1100 dynamic enhanced font "sans,11" background "white"
        } else {
            print sprintf("compare.gp: unknown fmt '%s' (png, pdf or svg)", fmt)
            exit status 2
        }
    }
}
set datafile separator comma
set datafile commentschars "#"
set datafile columnheaders

c_a = "#0072B2"; c_b = "#D55E00"
runfile(r) = (r == 1) ? fileA : fileB
pos(x) = x > 0 ? x : 1/0

# SCAN: for the column named SC in both runs, sets pmax (largest value, or 0) and
# pmin (smallest value > 0, meaningful only when pmax > 0).
SCAN = 'pmax = 0.0; pmin = 1e300; \
do for [r = 1:2] { \
    stats runfile(r) using (column(SC)) nooutput; \
    m = STATS_max; \
    if (m > pmax) { pmax = m }; \
    if (m > 0) { \
        stats runfile(r) using (v = column(SC), v > 0 ? v : m) nooutput; \
        if (STATS_min < pmin) { pmin = STATS_min } \
    } \
}'
# decade bounds of a log axis showing at most `dec` decades below the maximum
decfloor(mn, mx, dec) = 10.0**floor(log10(mn > mx * 10.0**(-dec) ? mn : mx * 10.0**(-dec)) - 0.02)
decceil(mx) = 10.0**ceil(log10(mx) + 0.02)

# time axis: positive ages only
SC = "time_yr"; eval SCAN
if (pmax > 0) {
    tmin = pmin; tmax = pmax
    if (tmax <= tmin * 1.0001) { tmin = tmin / 10.0; tmax = tmax * 10.0 }
} else {
    tmin = 1.0; tmax = 10.0
}

# the three logarithmic panels: column, axis label, decades shown, note when empty
lg_cols = "surface_water_to p_co2_bar p_o2_bar"
lg_labels = '"Surface water (TO)" "CO_2 (bar)" "O_2 (bar)"'
lg_decades = "8 12 12"
lg_empty = '"no surface water in either run" "no CO_2 in either run" "no O_2 in either run"'
array lg_on[3]
array lg_lo[3]
array lg_hi[3]
do for [k = 1:3] {
    SC = word(lg_cols, k); eval SCAN
    lg_on[k] = (pmax > 0)
    if (pmax > 0) {
        lg_lo[k] = decfloor(pmin, pmax, int(word(lg_decades, k)))
        lg_hi[k] = decceil(pmax)
    }
}

# surface temperature: linear axis, at least 20 K tall
T_lo = 1e300; T_hi = -1e300
do for [r = 1:2] {
    stats runfile(r) using (column("surface_temp_k")) nooutput
    if (STATS_min < T_lo) { T_lo = STATS_min }
    if (STATS_max > T_hi) { T_hi = STATS_max }
}
if (T_hi - T_lo < 20.0) { T_mid = 0.5 * (T_hi + T_lo); T_lo = T_mid - 10.0; T_hi = T_mid + 10.0 }
T_pad = 0.05 * (T_hi - T_lo)

set output outfile
# layout in screen coordinates: title, one legend for the whole figure (runs keep
# their colours throughout), then four panels sharing the time axis
P_top = 0.925; P_bot = 0.065; P_gap = 0.015
P_h = (P_top - P_bot - 3 * P_gap) / 4.0
ptop(i) = P_top - (i - 1) * (P_h + P_gap)
set multiplot
set label 100 sprintf("%s and %s", labelA, labelB) at screen 0.5, 0.982 center noenhanced font ",13"
set lmargin at screen 0.12
set rmargin at screen 0.96
set logscale x
set xrange [tmin:tmax]
set format x ""
set mxtics 10
set grid xtics ytics lc rgb "#dddddd" lw 1 dt 1
set key at screen 0.5, 0.962 center top horizontal samplen 4 spacing 1.2 width 2

do for [k = 1:3] {
    set tmargin at screen ptop(k)
    set bmargin at screen ptop(k) - P_h
    set ylabel word(lg_labels, k)
    set logscale y
    if (lg_on[k]) {
        set format y "10^{%L}"
        set yrange [lg_lo[k]:lg_hi[k]]
        plot fileA using (pos(column("time_yr"))):(pos(column(word(lg_cols, k)))) \
                 with lines lw 2 dt 1 lc rgb c_a title labelA noenhanced, \
             fileB using (pos(column("time_yr"))):(pos(column(word(lg_cols, k)))) \
                 with lines lw 2 dt 2 lc rgb c_b title labelB noenhanced
    } else {
        set format y ""
        set yrange [1e-3:1]
        set label 1 word(lg_empty, k) at graph 0.5, 0.5 center
        plot NaN with lines lw 2 dt 1 lc rgb c_a title labelA noenhanced, \
             NaN with lines lw 2 dt 2 lc rgb c_b title labelB noenhanced
        unset label 1
    }
    if (k == 1) { unset key; unset label 100 }
}

unset logscale y
set format y "%g"
set yrange [T_lo - T_pad:T_hi + T_pad]
set format x "10^{%L}"
set xlabel "Stellar age (yr)"
set tmargin at screen ptop(4)
set bmargin at screen ptop(4) - P_h
set ylabel "Surface temperature (K)"
plot fileA using (pos(column("time_yr"))):(column("surface_temp_k")) \
         with lines lw 2 dt 1 lc rgb c_a title labelA noenhanced, \
     fileB using (pos(column("time_yr"))):(column("surface_temp_k")) \
         with lines lw 2 dt 2 lc rgb c_b title labelB noenhanced
unset multiplot
unset output
