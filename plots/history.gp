# history.gp -- four-panel evolution figure for a volev run (gnuplot >= 5.4).
#
# Variables (pass with -e "name='value'; ..."):
#   datafile   series.csv of the run (required)
#   outfile    figure to write (required)
#   fmt        png | pdf | svg (default png)
#   title      figure title (optional; default: the run folder of datafile)
#   eventfile  events.csv of the run (optional; events drawn as dotted lines)
#   datafile2  series.csv of a second run, overlaid dashed (optional)
#   label1, label2  names of the two runs in the overlay legend (optional)
# Example:
#   gnuplot -e "datafile='out/series.csv'; outfile='out/history.png'; fmt='png'" plots/history.gp
#
# Panels, sharing a logarithmic time axis in years:
#   (a) surface water inventory (TO), (b) partial pressures (bar),
#   (c) surface temperature (K) with the climate regime as a strip,
#   (d) H and O escape rates (kg/s) with the XUV flux on the right axis.
# Zero or non-positive values are left out of the logarithmic panels, and every
# axis range is computed here, so all-zero columns never stop the plot.

if (!exists("datafile") || strlen(datafile) == 0) {
    print "history.gp: set datafile='DIR/series.csv'"
    exit status 2
}
if (!exists("outfile") || strlen(outfile) == 0) {
    print "history.gp: set outfile='FIGURE'"
    exit status 2
}
if (!exists("fmt") || strlen(fmt) == 0) { fmt = "png" }
use2 = exists("datafile2") ? (strlen(datafile2) > 0) : 0
nrun = use2 ? 2 : 1
if (!exists("label1")) { label1 = datafile }
if (!exists("label2")) { label2 = use2 ? datafile2 : "" }
figtitle = exists("title") ? title : ""
if (strlen(figtitle) == 0) {
    # default: the run folder, i.e. datafile without a trailing "/series.csv"
    figtitle = datafile
    n_sfx = strlen("/series.csv")
    if (strlen(datafile) > n_sfx && datafile[strlen(datafile) - n_sfx + 1:] eq "/series.csv") {
        figtitle = "volev run " . datafile[1:strlen(datafile) - n_sfx]
    }
}

if (fmt eq "png") {
    set terminal pngcairo size 1000,1200 enhanced font "sans,11" linewidth 1
} else {
    if (fmt eq "pdf") {
        set terminal pdfcairo size 8in,9.6in enhanced font "sans,9" linewidth 1
    } else {
        if (fmt eq "svg") {
            set terminal svg size 1000,1200 dynamic enhanced font "sans,11" linewidth 1 background "white"
        } else {
            print sprintf("history.gp: unknown fmt '%s' (png, pdf or svg)", fmt)
            exit status 2
        }
    }
}

set datafile separator comma
set datafile commentschars "#"
set datafile columnheaders

runfile(r) = (r == 1) ? datafile : datafile2
runlabel(r) = (r == 1) ? label1 : label2

# data rows of a CSV file: lines that are not comments, minus the header
datarows(f) = system(sprintf("cat '%s' 2>/dev/null | grep -vc '^#'", f)) - 1

# ---------------------------------------------------------------- data scan
do for [r = 1:nrun] {
    if (datarows(runfile(r)) < 1) {
        print sprintf("history.gp: no data rows in '%s'", runfile(r))
        exit status 1
    }
}
# SCAN: for column name SC over all runs, sets pmax (largest value, or 0),
# pmin (smallest value > 0, only meaningful when pmax > 0) and run1max.
SCAN = 'pmax = 0.0; pmin = 1e300; run1max = 0.0; \
do for [r = 1:nrun] { \
    stats runfile(r) using (column(SC)) nooutput; \
    m = STATS_max; \
    if (r == 1) { run1max = m }; \
    if (m > pmax) { pmax = m }; \
    if (m > 0) { \
        stats runfile(r) using (v = column(SC), v > 0 ? v : m) nooutput; \
        if (STATS_min < pmin) { pmin = STATS_min } \
    } \
}'

# Nice decade bounds for a log axis showing at most `dec` decades below the maximum.
decfloor(mn, mx, dec) = 10.0**floor(log10(mn > mx * 10.0**(-dec) ? mn : mx * 10.0**(-dec)) - 0.02)
decceil(mx) = 10.0**ceil(log10(mx) + 0.02)

# Time axis: positive times only (the first row is usually t = 0).
SC = "time_yr"; eval SCAN
if (pmax > 0) {
    tmin = pmin; tmax = pmax
    if (tmax <= tmin * 1.0001) { tmin = tmin / 10.0; tmax = tmax * 10.0 }
} else {
    tmin = 1.0; tmax = 10.0
}
# first box of the regime strip starts at the left edge instead of t = 0
tclamp(t) = (t > tmin) ? t : tmin
# boxes of the strip overlap by ~1 pixel so anti-aliasing leaves no seams
tover = (tmax / tmin)**0.002

# (a) surface water
SC = "surface_water_to"; eval SCAN
wat_on = (pmax > 0)
if (wat_on) { wat_lo = decfloor(pmin, pmax, 8); wat_hi = decceil(pmax) }

# (b) partial pressures: one fixed colour per species (Okabe-Ito)
sp_cols  = "p_h2o_bar p_co2_bar p_n2_bar p_o2_bar p_h2_bar"
sp_names = "H_2O CO_2 N_2 O_2 H_2"
sp_rgb   = "#0072B2 #D55E00 #009E73 #56B4E9 #CC79A7"
sp_on = ""
sp_titled = ""
p_lo = 1e300; p_hi = 0.0
do for [k = 1:words(sp_cols)] {
    SC = word(sp_cols, k); eval SCAN
    if (pmax > 0) {
        sp_on = sp_on . sprintf(" %d", k)
        if (pmin < p_lo) { p_lo = pmin }
        if (pmax > p_hi) { p_hi = pmax }
        # legend entry from run 1, or from run 2 when run 1 never has the gas
        sp_titled = sp_titled . sprintf(" %d", (run1max > 0) ? 1 : 2)
    }
}
np = words(sp_on)
if (np > 0) { pr_lo = decfloor(p_lo, p_hi, 10); pr_hi = decceil(p_hi) }

# (c) surface temperature (linear axis)
T_lo = 1e300; T_hi = -1e300
do for [r = 1:nrun] {
    stats runfile(r) using (column("surface_temp_k")) nooutput
    if (STATS_min < T_lo) { T_lo = STATS_min }
    if (STATS_max > T_hi) { T_hi = STATS_max }
}
if (T_hi - T_lo < 20.0) { T_mid = 0.5 * (T_hi + T_lo); T_lo = T_mid - 10.0; T_hi = T_mid + 10.0 }
# the regime strip(s) use the bottom of the panel; the curve stays above them
strip_h = 0.06; strip_gap = 0.01
curve_base = nrun * (strip_h + strip_gap) + 0.05
T_span = T_hi - T_lo
T_ax_lo = T_lo - T_span * curve_base / (0.95 - curve_base)
T_ax_hi = T_hi + T_span * 0.05 / (0.95 - curve_base)
strip_lo(r) = (r - 1) * (strip_h + strip_gap)
strip_hi(r) = strip_lo(r) + strip_h
reg_names = 'dry frozen temperate "moist greenhouse" runaway'
reg_rgb   = "#E69F00 #56B4E9 #009E73 #F0E442 #D55E00"
regcol(x) = (x == 0) ? 0xE69F00 : (x == 1) ? 0x56B4E9 : (x == 2) ? 0x009E73 : \
            (x == 3) ? 0xF0E442 : (x == 4) ? 0xD55E00 : 0x999999

# (d) escape rates and XUV flux
esc_cols  = "h_escape_kg_s o_escape_kg_s"
esc_names = '"H escape" "O escape"'
esc_rgb   = "#CC79A7 #56B4E9"
esc_on = ""
esc_titled = ""
e_lo = 1e300; e_hi = 0.0
do for [k = 1:words(esc_cols)] {
    SC = word(esc_cols, k); eval SCAN
    if (pmax > 0) {
        esc_on = esc_on . sprintf(" %d", k)
        if (pmin < e_lo) { e_lo = pmin }
        if (pmax > e_hi) { e_hi = pmax }
        esc_titled = esc_titled . sprintf(" %d", (run1max > 0) ? 1 : 2)
    }
}
ne = words(esc_on)
if (ne > 0) { es_lo = decfloor(e_lo, e_hi, 8); es_hi = decceil(e_hi) }
SC = "f_xuv_w_m2"; eval SCAN
xuv_on = (pmax > 0); xuv_run1 = (run1max > 0)
if (xuv_on) { xuv_lo = decfloor(pmin, pmax, 6); xuv_hi = decceil(pmax) }

# events (optional): times of the rows of eventfile, drawn as dotted lines
nev = 0
if (exists("eventfile") && strlen(eventfile) > 0) {
    nev = datarows(eventfile)
}
if (nev > 0) {
    set table $vl_events
    plot eventfile using (sprintf("%.9e", column("time_yr"))) with table
    unset table
    do for [i = 1:|$vl_events|] {
        tev = $vl_events[i] + 0.0
        if (tev >= tmin && tev <= tmax) {
            set arrow from first tev, graph 0 to first tev, graph 1 nohead \
                lc rgb "#888888" lw 1 dt 3 back
        }
    }
}

# ---------------------------------------------------------------- layout
set output outfile
L_left = 0.11; L_right = 0.73
P_top = use2 ? 0.925 : 0.945
P_bot = 0.065
P_gap = 0.012
P_h = (P_top - P_bot - 3 * P_gap) / 4.0
ptop(i) = P_top - (i - 1) * (P_h + P_gap)
pbot(i) = ptop(i) - P_h
key_x = 0.815
dash(r) = (r == 1) ? 1 : 2
# i-th number of a space-separated list; 1 past its end (gnuplot parses the
# options of a plot clause even when its iteration turns out to be empty)
nth(list, i) = (i >= 1 && i <= words(list)) ? int(word(list, i)) : 1

set multiplot
set label 100 figtitle at screen 0.5, 0.982 center noenhanced font ",13"
if (use2) {
    set label 101 sprintf("solid: %s     dashed: %s", label1, label2) \
        at screen 0.5, 0.955 center noenhanced
}

set lmargin at screen L_left
set rmargin at screen L_right
set logscale x
set xrange [tmin:tmax]
set format x ""
set mxtics 10
set grid xtics ytics lc rgb "#dddddd" lw 1 dt 1
set border lw 1
set key spacing 1.2 samplen 2 Left reverse noautotitle
set style fill solid 1.0 noborder
set ytics nomirror
set format y "10^{%L}"

# ------------------------------------------------------------ (a) water
set tmargin at screen ptop(1)
set bmargin at screen pbot(1)
set key at screen key_x, ptop(1) left top
set label 1 "(a)" at screen 0.015, ptop(1) - 0.008 left font ",12"
set logscale y
set ylabel "Surface water (TO)"
if (wat_on) {
    set format y "10^{%L}"
    set yrange [wat_lo:wat_hi]
    plot for [r = 1:nrun] runfile(r) \
            using (column("time_yr")):(v = column("surface_water_to"), v > 0 ? v : 1/0) \
            with lines lw 2 dt dash(r) lc rgb "#0072B2" \
            title (use2 ? runlabel(r) : "surface water"), \
         for [z = 1:(nev > 0 ? 1 : 0)] keyentry with lines lw 1 dt 3 lc rgb "#888888" title "event"
} else {
    set yrange [1e-3:1]
    set format y ""
    set label 2 "no surface water" at graph 0.5, 0.5 center
    plot NaN notitle, \
         for [z = 1:(nev > 0 ? 1 : 0)] keyentry with lines lw 1 dt 3 lc rgb "#888888" title "event"
    unset label 2
}

# ------------------------------------------------------ (b) pressures
set tmargin at screen ptop(2)
set bmargin at screen pbot(2)
set key at screen key_x, ptop(2) left top
set label 1 "(b)" at screen 0.015, ptop(2) - 0.008 left font ",12"
set ylabel "Partial pressure (bar)"
if (np > 0) {
    set format y "10^{%L}"
    set yrange [pr_lo:pr_hi]
    plot for [r = 1:nrun] for [i = 1:np] runfile(r) \
            using (column("time_yr")):(v = column(word(sp_cols, nth(sp_on, i))), v > 0 ? v : 1/0) \
            with lines lw 2 dt dash(r) lc rgb word(sp_rgb, nth(sp_on, i)) \
            title (nth(sp_titled, i) == r ? word(sp_names, nth(sp_on, i)) : "")
} else {
    set yrange [1e-3:1]
    set format y ""
    set label 2 "all partial pressures are zero" at graph 0.5, 0.5 center
    plot NaN notitle
    unset label 2
}

# ------------------------------------------------- (c) temperature, regime
set tmargin at screen ptop(3)
set bmargin at screen pbot(3)
set key at screen key_x, ptop(3) left top
set label 1 "(c)" at screen 0.015, ptop(3) - 0.008 left font ",12"
unset logscale y
set format y "%g"
set yrange [T_ax_lo:T_ax_hi]
set y2range [0:1]
set ylabel "Surface temperature (K)"
if (use2) {
    do for [r = 1:nrun] {
        set label 10 + r runlabel(r) at graph 1.01, 0.5 * (strip_lo(r) + strip_hi(r)) \
            left noenhanced font ",9"
    }
}
# Each pair of consecutive rows (t0, t1) is split at its geometric mean: the
# left half takes the regime of the earlier row, the right half the later one.
plot for [r = 1:nrun] runfile(r) \
        using (t1 = tclamp(column("time_yr")), t0 = (column(0) == 0) ? t1 : tp, tp = t1, \
               r0 = (column(0) == 0) ? column("regime") : rp, rp = column("regime"), \
               sqrt(t0 * t1)):(0.5 * (strip_lo(r) + strip_hi(r))): \
              (t0):(sqrt(t0 * t1) * tover):(strip_lo(r)):(strip_hi(r)):(regcol(r0)) \
        with boxxyerror lc rgb variable axes x1y2 notitle, \
     for [r = 1:nrun] runfile(r) \
        using (t1 = tclamp(column("time_yr")), t0 = (column(0) == 0) ? t1 : tp, tp = t1, \
               sqrt(t0 * t1)):(0.5 * (strip_lo(r) + strip_hi(r))): \
              (sqrt(t0 * t1)):(t1 * tover):(strip_lo(r)):(strip_hi(r)):(regcol(column("regime"))) \
        with boxxyerror lc rgb variable axes x1y2 notitle, \
     for [r = 1:nrun] runfile(r) using (column("time_yr")):(column("surface_temp_k")) \
        with lines lw 2 dt dash(r) lc rgb "#000000" \
        title (r == 1 ? "surface T" : ""), \
     keyentry with boxes fc rgb "#ffffff" title "regime:", \
     for [k = 1:5] keyentry with boxes fc rgb word(reg_rgb, k) title word(reg_names, k)
unset label 11
unset label 12

# ----------------------------------------------------- (d) escape, XUV
set tmargin at screen ptop(4)
set bmargin at screen pbot(4)
set key at screen key_x, ptop(4) left top
set label 1 "(d)" at screen 0.015, ptop(4) - 0.008 left font ",12"
set format x "10^{%L}"
set xlabel "Time (yr)"
set logscale y
set format y "10^{%L}"
set ylabel "Escape rate (kg s^{-1})"
if (ne > 0) {
    set yrange [es_lo:es_hi]
} else {
    set yrange [1e-3:1]
    set format y ""
    set label 2 "no escape" at graph 0.5, 0.62 center
}
if (xuv_on) {
    set logscale y2
    set y2range [xuv_lo:xuv_hi]
    set y2tics nomirror textcolor rgb "#B07800"
    set format y2 "10^{%L}"
    set y2label "XUV flux (W m^{-2})" textcolor rgb "#B07800"
} else {
    set label 3 "no XUV flux" at graph 0.5, 0.38 center
}
plot for [r = 1:nrun] for [i = 1:ne] runfile(r) \
        using (column("time_yr")):(v = column(word(esc_cols, nth(esc_on, i))), v > 0 ? v : 1/0) \
        with lines lw 2 dt dash(r) lc rgb word(esc_rgb, nth(esc_on, i)) \
        title (nth(esc_titled, i) == r ? word(esc_names, nth(esc_on, i)) : ""), \
     for [r = 1:(xuv_on ? nrun : 0)] runfile(r) \
        using (column("time_yr")):(v = column("f_xuv_w_m2"), v > 0 ? v : 1/0) axes x1y2 \
        with lines lw 2 dt dash(r) lc rgb "#E69F00" \
        title ((r == 1 && xuv_run1) || (r == 2 && !xuv_run1) ? "XUV flux (right)" : ""), \
     NaN notitle

unset multiplot
unset output
