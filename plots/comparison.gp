# comparison.gp -- two to twelve volev runs on shared axes (gnuplot >= 5.4).
#
# Usage:
#   gnuplot -c plots/comparison.gp OUT TITLE RUNS
#   gnuplot -c plots/comparison.gp OUT TITLE SERIES1 LABEL1 SERIES2 LABEL2 [SERIES3 LABEL3]
#
#   OUT       figure to write; its extension (.png, .pdf or .svg) picks the format
#   TITLE     figure title; "" gives "Runs A, B and C" from the labels (or "Comparison
#             of N runs" when that is longer than 70 characters)
#   RUNS      one argument holding, for each run, its series.csv and its label, each on
#             a line of its own (2 to 12 runs): what `volev compare` and `volev plot`
#             pass. gnuplot hands a script at most nine arguments, so any number of runs
#             goes in one.
#   SERIESi   series.csv of run i (`volev run`); the pair form takes up to three runs
#   LABELi    name of run i in the legend, shown as written (no markup); "" gives the
#             run folder (SERIESi without its "/series.csv")
#
# Examples (what `volev compare wet dry -o cmp` and `make validation` run):
#   gnuplot -c plots/comparison.gp cmp/compare.png "wet and dry" "$(printf '%s\n' wet/series.csv wet dry/series.csv dry)"
#   gnuplot -c plots/comparison.gp docs/divergence.png "Venus, Earth and Mars from one starting inventory" \
#       v/series.csv Venus e/series.csv Earth m/series.csv Mars
#
# Five panels, lettered (a)-(e), share a logarithmic axis of stellar age (yr): surface
# water (TO), CO2 and O2 partial pressures (bar) on logarithmic axes, surface
# temperature (K) on a linear one, and the climate regime of each run as a strip of
# its own (one row per run, labelled with its number in the legend, colours of
# style.gp, a key of the regimes that occur above it). Run i keeps colour run_colour(i) and dash pattern run_dash(i) of
# style.gp in every panel (no two runs share both); one legend above the panels names
# the runs, as many to a row as fit. Columns are found by their names
# in the header line of series.csv; a file lacking one of them stops the script (exit
# status 2) naming file and column. Non-positive values are left out of the logarithmic
# panels; a quantity that is zero throughout every run leaves its panel empty with a
# note, and the runs in which it is zero throughout are named above the panel.

vl_script = "comparison.gp"
vl_dir = system(sprintf("dirname '%s'", ARG0)) . "/"
vl_out = ARG1
if (ARGC < 3 || ARGC == 4) {
    print "comparison.gp: usage: gnuplot -c comparison.gp OUT TITLE RUNS, or OUT TITLE SERIES1 LABEL1 SERIES2 LABEL2 [SERIES3 LABEL3]"
    exit status 2
}
load vl_dir . "style.gp"
vl_w = 8.0; vl_h = 10.0
# the data settings first: arguments and files are checked, and axis ranges found,
# before the output is opened, so a refused call leaves no figure file behind
eval VL_BASE

if (ARGC > 8) {
    vl_msg = sprintf("at most three SERIES/LABEL pairs (a ninth argument, '%s', was given); pass more runs as one RUNS argument", ARG9)
    eval VL_FAIL
}

# ---- the runs ----------------------------------------------------------------------
# the pair form becomes a RUNS list; then RUNS is cut into its lines
nl = "\n"
if (ARGC == 3) {
    runs = ARG3
} else {
    runs = ARG3 . nl . ARG4 . nl . ARG5 . nl . (ARGC >= 6 ? ARG6 : "") . nl
    if (ARGC >= 7 && strlen(ARG7) > 0) { runs = runs . ARG7 . nl . (ARGC >= 8 ? ARG8 : "") . nl }
}
if (strlen(runs) > 0 && runs[strlen(runs):] ne nl) { runs = runs . nl }
nlines = 0
do for [c = 1:strlen(runs)] { if (runs[c:c] eq nl) { nlines = nlines + 1 } }
if (nlines % 2 != 0) {
    vl_msg = sprintf("RUNS has %d lines: expected a series.csv and a label for each run", nlines)
    eval VL_FAIL
}
nrun = nlines / 2
if (nrun < 2 || nrun > vl_max_runs) {
    vl_msg = sprintf("%d run%s given: a comparison takes 2 to %d", nrun, nrun == 1 ? "" : "s", vl_max_runs)
    eval VL_FAIL
}
array run_file[nrun]
array run_lab[nrun]
rest = runs
do for [i = 1:nrun] {
    cut = strstrt(rest, nl); run_file[i] = rest[1:cut - 1]; rest = rest[cut + 1:]
    cut = strstrt(rest, nl); run_lab[i] = rest[1:cut - 1]; rest = rest[cut + 1:]
}
sfx = "/series.csv"
do for [i = 1:nrun] {
    f = run_file[i]
    if (strlen(f) == 0) {
        vl_msg = sprintf("the series.csv of run %d is empty: give the series.csv of every run", i)
        eval VL_FAIL
    }
    if (strlen(run_lab[i]) == 0) {
        run_lab[i] = f
        if (strlen(f) > strlen(sfx) && f[strlen(f) - strlen(sfx) + 1:] eq sfx) {
            run_lab[i] = f[1:strlen(f) - strlen(sfx)]
        }
    }
    # a very long name keeps its end (the distinctive part of a path)
    if (strlen(run_lab[i]) > 80) { run_lab[i] = "..." . run_lab[i][strlen(run_lab[i]) - 76:] }
}
# default title: the runs' names ("wet, dry and venus"), or their number when that is
# too long to read
fig_title = ""
do for [i = 1:nrun] {
    fig_title = fig_title . (i == 1 ? "" : (i == nrun ? " and " : ", ")) . run_lab[i]
}
fig_title = (strlen(fig_title) <= 70) ? "Runs " . fig_title : sprintf("Comparison of %d runs", nrun)
fig_title = strlen(ARG2) > 0 ? ARG2 : fig_title

# every column drawn, checked by name in each run's header before anything is drawn
need_cols = "time_yr regime surface_water_to p_co2_bar p_o2_bar surface_temp_k"
do for [i = 1:nrun] {
    undefine STATS_*
    stats run_file[i] using 0 nooutput
    if (!exists("STATS_columns") || !exists("STATS_records") || STATS_records < 1) {
        vl_msg = sprintf("%s: no data (cannot be read, or no rows below the header)", run_file[i])
        eval VL_FAIL
    }
    hdr = ","
    do for [j = 1:STATS_columns] {
        stats run_file[i] every ::0::0 using (hdr = hdr . columnheader(j) . ",", 0) nooutput
    }
    do for [c in need_cols] {
        if (strstrt(hdr, "," . c . ",") == 0) {
            vl_msg = sprintf("%s: column '%s' (needed for the figure) is missing from the header", run_file[i], c)
            eval VL_FAIL
        }
    }
}

pos(x) = x > 0 ? x : NaN

# SCAN: for column SC of every run, sets s_max (largest value over the runs, or 0),
# s_min (smallest positive value, meaningful when s_max > 0), s_zero (labels of the
# runs with no positive value, comma-separated), s_znum (their numbers, likewise) and
# s_nzero (how many such runs).
SCAN = 's_max = 0.0; s_min = 1e300; s_zero = ""; s_znum = ""; s_nzero = 0; \
do for [r = 1:nrun] { \
    undefine STATS_*; \
    stats run_file[r] using (column(SC)) nooutput; \
    if (exists("STATS_max") && STATS_max > 0) { \
        s_m = STATS_max; \
        if (s_m > s_max) { s_max = s_m }; \
        stats run_file[r] using (s_v = column(SC), s_v > 0 ? s_v : s_m) nooutput; \
        if (STATS_min < s_min) { s_min = STATS_min } \
    } else { \
        s_zero = s_zero . (s_nzero > 0 ? ", " : "") . run_lab[r]; \
        s_znum = s_znum . (s_nzero > 0 ? ", " : "") . r; s_nzero = s_nzero + 1 \
    } \
}'
# "either run" for two, "any of the N runs" otherwise
any_run = (nrun == 2) ? "either run" : sprintf("any of the %d runs", nrun)

# time axis: positive ages only
SC = "time_yr"; eval SCAN
if (s_max > 0) {
    t_lo = s_min; t_hi = s_max
    if (t_hi <= t_lo * 1.0001) { t_lo = t_lo / 10.0; t_hi = t_hi * 10.0 }
} else {
    vl_msg = "no positive stellar age (time_yr) in any run"
    eval VL_FAIL
}

# the three logarithmic panels: column, axis label, decades shown, quantity named in notes
lg_cols = "surface_water_to p_co2_bar p_o2_bar"
lg_labels = '"Surface water (TO)" "CO_2 pressure (bar)" "O_2 pressure (bar)"'
lg_decades = "8 12 12"
lg_what = '"surface water" "CO2" "O2"'
array lg_on[3]
array lg_lo[3]
array lg_hi[3]
array lg_note[3]
do for [k = 1:3] {
    SC = word(lg_cols, k); eval SCAN
    lg_on[k] = (s_max > 0)
    lg_note[k] = ""
    if (s_max > 0) {
        lg_lo[k] = decfloor(s_min, s_max, int(word(lg_decades, k)))
        lg_hi[k] = 10.0**ceil(log10(s_max) + 0.15)   # a line at its top stays off the border
        if (s_nzero > 0) {
            lg_note[k] = sprintf("no %s throughout: %s", word(lg_what, k), s_zero)
            # names too long for one line: the runs' places in the legend instead
            if (strlen(lg_note[k]) > 100) {
                lg_note[k] = sprintf("no %s throughout: run%s %s of the legend", word(lg_what, k), s_nzero > 1 ? "s" : "", s_znum)
            }
        }
    }
}

# surface temperature: linear axis, at least 20 K tall
T_on = 0; T_lo = 1e300; T_hi = -1e300
do for [r = 1:nrun] {
    undefine STATS_*
    stats run_file[r] using (column("surface_temp_k")) nooutput
    if (exists("STATS_max") && STATS_records > 0) {
        T_on = 1
        if (STATS_min < T_lo) { T_lo = STATS_min }
        if (STATS_max > T_hi) { T_hi = STATS_max }
    }
}
if (!T_on) { T_lo = 0.0; T_hi = 1.0 }
if (T_hi - T_lo < 20.0) { T_mid = 0.5 * (T_hi + T_lo); T_lo = T_mid - 10.0; T_hi = T_mid + 10.0 }
T_pad = 0.05 * (T_hi - T_lo)

# the regimes that occur in any run (their numbers + 1, for the key)
reg_on = ""
do for [k = 0:5] {
    reg_n = 0
    do for [r = 1:nrun] {
        stats run_file[r] using (column("regime") == k ? 1 : 0) nooutput
        reg_n = reg_n + STATS_sum
    }
    if (reg_n > 0) { reg_on = reg_on . sprintf(" %d", k + 1) }
}
nth(list, i) = (i >= 1 && i <= words(list)) ? int(word(list, i)) : 1
# boxes of the strip overlap by about a pixel so anti-aliasing leaves no seams
tover = (t_hi / t_lo)**0.002
tclamp(t) = (t > t_lo) ? t : t_lo

eval VL_TERM; eval VL_BASE

# ---- layout (screen coordinates) ---------------------------------------------------
# title, the legend (as many runs to a row as their names fit across), then four
# panels; the gaps between panels hold the notes on runs without a quantity
key_w = 0
do for [i = 1:nrun] {
    if (strlen(run_lab[i]) > key_w) { key_w = strlen(run_lab[i]) }
}
key_cols = int(95 / (key_w + 13))
key_cols = key_cols < 1 ? 1 : (key_cols > nrun ? nrun : key_cols)
key_rows = int((nrun + key_cols - 1) / key_cols)
L_x0 = 0.12; L_x1 = 0.96
K_top = 0.955
P_top = K_top - 0.024 * key_rows - 0.03
P_bot = 0.065; P_gap = 0.028
# the regime strip: a row per run, at least 0.05 of the height, with its key above
S_h = (0.016 * nrun > 0.05) ? 0.016 * nrun : 0.05
S_key = 0.004 + 0.019 * int((words(reg_on) + 2) / 3)
P_h = (P_top - P_bot - 4 * P_gap - S_h - S_key) / 4.0
ptop(i) = P_top - (i - 1) * (P_h + P_gap)
LETTER = 'set label 5 sprintf("(%c)", 96 + p_i) at screen 0.015, ptop(p_i) + 0.012 left font ",12"'

set multiplot
set label 100 fig_title at screen 0.5, 0.982 center noenhanced font ",13"
set lmargin at screen L_x0
set rmargin at screen L_x1

# the panels (the title goes with the first)
eval VL_LOGTIME
set xrange [t_lo:t_hi]
set format x ""
unset xlabel
do for [k = 1:3] {
    p_i = k; eval LETTER
    set tmargin at screen ptop(k)
    set bmargin at screen ptop(k) - P_h
    set ylabel word(lg_labels, k)
    set logscale y
    set mytics 10
    if (strlen(lg_note[k]) > 0) {
        set label 2 lg_note[k] at graph 1, 1 right offset 0, 0.7 noenhanced font ",9" tc rgb "#555555"
    }
    if (lg_on[k]) {
        set format y "10^{%L}"
        set yrange [lg_lo[k]:lg_hi[k]]
        # a label every decade, every second one over more than seven
        if (log10(lg_hi[k] / lg_lo[k]) > 7) { set ytics 100; set mytics 2 } else { set ytics autofreq; set mytics 10 }
        plot for [i = 1:nrun] run_file[i] \
             using (pos(column("time_yr"))):(pos(column(word(lg_cols, k)))) \
             with lines lw 2 dt run_dash(i) lc rgb run_colour(i) notitle
    } else {
        unset ytics
        set yrange [1e-3:1]
        set label 1 sprintf("no %s in %s", word(lg_what, k), any_run) at graph 0.5, 0.5 center
        plot NaN notitle
        unset label 1
        set ytics nomirror
    }
    unset label 2
    unset label 100
}

unset logscale y
set format y "%g"
set mytics default
set ytics autofreq
set yrange [T_lo - T_pad:T_hi + T_pad]
p_i = 4; eval LETTER
set tmargin at screen ptop(4)
set bmargin at screen ptop(4) - P_h
set ylabel "Temperature (K)"
if (T_on) {
    plot for [i = 1:nrun] run_file[i] \
         using (pos(column("time_yr"))):(column("surface_temp_k")) \
         with lines lw 2 dt run_dash(i) lc rgb run_colour(i) notitle
} else {
    unset ytics
    set label 1 sprintf("no surface temperature in %s", any_run) at graph 0.5, 0.5 center
    plot NaN notitle
    unset label 1
}

# the regime strip: run i is the row from i - 0.5 to i + 0.5 (run 1 on top); each
# pair of consecutive rows (t0, t1) is split at its geometric mean, the left half in
# the regime of the earlier row, the right half in the later one's
p_i = 5
set tmargin at screen ptop(5) - S_key
set bmargin at screen ptop(5) - S_key - S_h
set label 5 sprintf("(%c)", 96 + p_i) at screen 0.015, ptop(5) - S_key + 0.012 left font ",12"
eval VL_LOGTIME
set ylabel "Regime" offset -1, 0
set yrange [nrun + 0.5:0.5]
set ytics 1 scale 0 nomirror
set format y "%g"
unset grid
set grid xtics lc rgb "#dddddd" lw 1 dt 1
set style fill solid 1.0 noborder
set key at screen L_x1, ptop(5) + 0.004 right top horizontal maxcols 3 samplen 1.5 width 1
plot for [i = 1:nrun] run_file[i] \
        using (t1 = tclamp(column("time_yr")), t0 = (column(0) == 0) ? t1 : tp, tp = t1, \
               r0 = (column(0) == 0) ? column("regime") : rp, rp = column("regime"), \
               sqrt(t0 * t1)):(i):(t0):(sqrt(t0 * t1) * tover):(i - 0.42):(i + 0.42):(regcol(r0)) \
        with boxxyerror lc rgb variable notitle, \
     for [i = 1:nrun] run_file[i] \
        using (t1 = tclamp(column("time_yr")), t0 = (column(0) == 0) ? t1 : tp, tp = t1, \
               sqrt(t0 * t1)):(i):(sqrt(t0 * t1)):(t1 * tover):(i - 0.42):(i + 0.42):(regcol(column("regime"))) \
        with boxxyerror lc rgb variable notitle, \
     for [k = 1:words(reg_on)] keyentry with boxes fc rgb word(reg_rgb, nth(reg_on, k)) \
        title word(reg_names, nth(reg_on, k))
unset label 5
set ylabel offset 0, 0

# the legend, drawn last: a plot with nothing in it but the key
set tmargin at screen K_top
set bmargin at screen P_top + 0.01
unset border; unset tics; unset grid; unset logscale; unset xlabel; unset ylabel
set xrange [0:1]; set yrange [0:1]
set key at screen 0.5 * (L_x0 + L_x1), K_top center top horizontal maxcols key_cols maxrows key_rows samplen 4 width 2
plot for [i = 1:nrun] NaN with lines lw 2 dt run_dash(i) lc rgb run_colour(i) title sprintf("%d %s", i, run_lab[i]) noenhanced

unset multiplot
unset output
