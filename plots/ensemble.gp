# ensemble.gp -- what became of the water and the oxygen across the members of a
# `volev sweep` (gnuplot >= 5.4; house style: style.gp).
#
# Usage:
#   gnuplot -c plots/ensemble.gp ENSEMBLE_SERIES.csv ENSEMBLE_SUMMARY.csv OUT [TITLE]
#     ENSEMBLE_SERIES.csv   quantiles at common ages (docs/ensembles.md)
#     ENSEMBLE_SUMMARY.csv  outcome quantiles and outcome-class counts
#     OUT                   figure to write: .png, .pdf or .svg
#     TITLE                 figure title (default: the sweep file named in the
#                           "# sweep hash ... of FILE" line of ENSEMBLE_SERIES.csv,
#                           else "volev sweep " and the folder of ENSEMBLE_SERIES.csv)
#
# Panels:
#   (a) surface water (TO, log axis) against stellar age (log axis): the median over
#       the members, the 25-75 % band and the 5-95 % band (lighter);
#   (b) O2 (bar, log axis), the same (a note instead of an empty log panel when O2 is
#       zero throughout);
#   (c) the outcome classes: fraction of all members in each class, in the order of
#       docs/ensembles.md, each bar in its class colour with the member count on it.
# Columns are found by their header names. An empty cell (no member covers that age)
# or a non-positive median leaves a gap; a band whose lower quantile is zero (or below
# the axis) is drawn down to the bottom of the axis, since zero lies below every
# value a log axis can show. The number of members (sum of the class counts) goes
# in the subtitle.

vl_script = "ensemble.gp"
vl_dir = system(sprintf("dirname '%s'", ARG0)) . "/"
en_series = ARG1
en_summary = ARG2
vl_out = ARG3
en_title = ARG4
# a missing argument: load the style with a placeholder output only to report usage
en_usage = (strlen(ARG1) == 0 || strlen(ARG2) == 0 || strlen(ARG3) == 0)
if (en_usage) { vl_out = "usage.png" }
vl_w = 8.0
vl_h = 9.0
load vl_dir . "style.gp"
if (en_usage) {
    vl_msg = "usage: gnuplot -c ensemble.gp ENSEMBLE_SERIES.csv ENSEMBLE_SUMMARY.csv OUT.{png,pdf,svg} [TITLE]"
    eval VL_FAIL
}
# data problems (as opposed to usage): status 1
EN_DATAFAIL = 'print sprintf("%s: %s", vl_script, vl_msg); exit status 1'

eval VL_BASE

# ---------------------------------------------------------------- inputs
# comma-framed header line of a CSV file, to test for columns by name; en_nrow: the
# number of data rows (0 when there are none)
en_hj(i) = (i > 500) ? "" : (strlen(columnhead(i)) == 0 ? "" : columnhead(i) . "," . en_hj(i + 1))
EN_HEADER = 'undefine STATS_*; stats en_file using (0) nooutput; \
    en_nrow = exists("STATS_records") ? STATS_records : 0; en_hdr = ""; \
    if (en_nrow > 0) { stats en_file every ::0::0 using (en_hdr = en_hj(1), 0) nooutput }; \
    en_hdr = "," . en_hdr'
en_has(name) = strstrt(en_hdr, "," . name . ",") > 0

en_file = en_series; eval EN_HEADER
if (en_nrow < 1) {
    vl_msg = sprintf("no data rows in '%s'", en_series); eval EN_DATAFAIL
}
en_need = "time_yr water_to_p05 water_to_p25 water_to_p50 water_to_p75 water_to_p95 o2_bar_p05 o2_bar_p25 o2_bar_p50 o2_bar_p75 o2_bar_p95"
do for [k = 1:words(en_need)] {
    if (!en_has(word(en_need, k))) {
        vl_msg = sprintf("'%s' has no column '%s' (not an ensemble_series.csv?)", en_series, word(en_need, k))
        eval EN_DATAFAIL
    }
}

en_file = en_summary; eval EN_HEADER
do for [c in "kind name count"] {
    if (!en_has(c)) {
        vl_msg = sprintf("'%s' has no column '%s' (not an ensemble_summary.csv?)", en_summary, c)
        eval EN_DATAFAIL
    }
}

# default title: the sweep file of the "# sweep hash H of FILE: ..." line of the
# series file (without folder and ".cfg"), else the folder of the series file
en_sweep = ""
if (strlen(en_title) == 0 && strstrt(en_series, "'") == 0) {
    en_sweep = system(sprintf("sed -n 's/^# sweep hash [^ ]* of \\(.*\\): .*$/\\1/p' '%s' | head -n 1 | sed 's|.*/||; s|\\.cfg$||'", en_series))
}
if (strlen(en_title) == 0 && strlen(en_sweep) > 0) {
    en_title = en_sweep . ": surface water, O2 and outcome across the members"
}
if (strlen(en_title) == 0) {
    en_slash = 0
    do for [i = 1:strlen(en_series)] { if (en_series[i:i] eq "/") { en_slash = i } }
    if (en_slash > 1) {
        en_folder = en_series[1:en_slash - 1]
    } else {
        if (en_slash == 1) { en_folder = "/" } else {
            # a bare file name: the current folder
            en_folder = GPVAL_PWD
            en_s2 = 0
            do for [i = 1:strlen(en_folder)] { if (en_folder[i:i] eq "/") { en_s2 = i } }
            if (en_s2 > 0 && en_s2 < strlen(en_folder)) { en_folder = en_folder[en_s2 + 1:] }
        }
    }
    en_title = "volev sweep " . en_folder
}

# ---------------------------------------------------------------- outcome classes
en_ncls = words(cls_names)
array en_count[en_ncls]
en_total = 0
en_found = 0
do for [i = 1:en_ncls] {
    en_cname = word(cls_names, i)
    stats en_summary using \
        ((strcol("kind") eq "class" && strcol("name") eq en_cname) ? 1 : 0): \
        ((strcol("kind") eq "class" && strcol("name") eq en_cname) ? column("count") : 0) nooutput
    en_count[i] = int(STATS_sum_y)
    en_found = en_found + STATS_sum_x
    en_total = en_total + en_count[i]
}
if (en_found < 1) {
    vl_msg = sprintf("no 'class' rows in '%s'", en_summary); eval EN_DATAFAIL
}
if (en_total < 1) {
    vl_msg = sprintf("the class counts of '%s' add up to no member", en_summary); eval EN_DATAFAIL
}
en_fmax = 0.0
set print $en_cls
print "class,count,fraction"
do for [i = 1:en_ncls] {
    print sprintf("%d,%d,%.10g", i, en_count[i], en_count[i] * 1.0 / en_total)
    if (en_count[i] * 1.0 / en_total > en_fmax) { en_fmax = en_count[i] * 1.0 / en_total }
}
set print

# ---------------------------------------------------------------- ranges
en_ok(v) = (v == v && v > 0)
# positive range of a group of columns: sets en_max (0 if none is positive), en_min
EN_RANGE = 'en_max = 0.0; en_min = 1e300; \
    do for [k = 1:words(en_cols)] { \
        stats en_series using (v = column(word(en_cols, k)), en_ok(v) ? v : 0) nooutput; \
        if (STATS_max > en_max) { en_max = STATS_max }; \
        stats en_series using (v = column(word(en_cols, k)), en_ok(v) ? v : 1e300) nooutput; \
        if (STATS_min < en_min) { en_min = STATS_min } \
    }'

stats en_series using (v = column("time_yr"), en_ok(v) ? v : 0) nooutput
en_tmax = STATS_max
stats en_series using (v = column("time_yr"), en_ok(v) ? v : 1e300) nooutput
en_tmin = STATS_min
if (en_tmax <= 0) {
    vl_msg = sprintf("no positive ages in '%s'", en_series); eval EN_DATAFAIL
}
if (en_tmax <= en_tmin * 1.0001) { en_tmin = en_tmin / 3.0; en_tmax = en_tmax * 3.0 }

en_cols = "water_to_p05 water_to_p25 water_to_p50 water_to_p75 water_to_p95"
eval EN_RANGE
en_w_on = (en_max > 0)
if (en_w_on) { en_w_lo = decfloor(en_min, en_max, 8); en_w_hi = decceil(en_max) }
en_cols = "o2_bar_p05 o2_bar_p25 o2_bar_p50 o2_bar_p75 o2_bar_p95"
eval EN_RANGE
en_o_on = (en_max > 0)
if (en_o_on) { en_o_lo = decfloor(en_min, en_max, 12); en_o_hi = decceil(en_max) }

# ages where no member is covered: gaps to explain in the legend
stats en_series using (v = column("water_to_p50"), v == v ? 0 : 1) nooutput
en_gaps = STATS_sum

# ---------------------------------------------------------------- colours
# colour c (#RRGGBB) mixed with white: share f of the colour (opaque bands print
# and convert reliably in every format)
EN_MIX = 'eval sprintf("en_rgb = 0x%s", en_c[2:7]); \
    en_mixed = sprintf("#%02x%02x%02x", \
        int(255 - en_f * (255 - int(en_rgb / 65536))), \
        int(255 - en_f * (255 - int(en_rgb / 256) % 256)), \
        int(255 - en_f * (255 - en_rgb % 256)))'
en_c = c_water; en_f = 0.22; eval EN_MIX; en_w_outer = en_mixed
en_c = c_water; en_f = 0.50; eval EN_MIX; en_w_inner = en_mixed
en_c = c_o2;    en_f = 0.12; eval EN_MIX; en_o_outer = en_mixed
en_c = c_o2;    en_f = 0.30; eval EN_MIX; en_o_inner = en_mixed
# the O2 median in the O2 colour (black) over light grey bands
en_o_line = c_o2

# band edges on a log axis: the lower edge falls to the axis bottom `lo` when the
# quantile is zero or below the axis; no band where the upper edge is not positive
en_bot(v, up, lo) = en_ok(up) ? ((v == v && v > lo) ? v : lo) : NaN
en_top(v) = en_ok(v) ? v : NaN

# rows where a band is drawn down to the axis bottom (quantile zero or below the axis)
en_low(lo_q, up_q, lo) = (en_ok(up_q) && !(lo_q > lo)) ? 1 : 0
en_w_clip = 0; en_o_clip = 0
if (en_w_on) {
    stats en_series using (en_low(column("water_to_p05"), column("water_to_p95"), en_w_lo)) nooutput
    en_w_clip = STATS_sum
}
if (en_o_on) {
    stats en_series using (en_low(column("o2_bar_p05"), column("o2_bar_p95"), en_o_lo)) nooutput
    en_o_clip = STATS_sum
}

# ---------------------------------------------------------------- layout
eval VL_TERM
L_left = 0.12; L_right = 0.745
en_key_x = 0.775
en_pt(i) = (i == 1) ? 0.905 : (i == 2) ? 0.64 : 0.30
en_pb(i) = (i == 1) ? 0.655 : (i == 2) ? 0.39 : 0.075
en_sub = sprintf("%d members", en_total)
if (en_count[1] > 0) { en_sub = en_sub . sprintf(" (%d failed)", en_count[1]) }
en_sub = en_sub . "; quantiles at each age over the members that ran"
en_clipnote = "shaded to the axis bottom:\nthe lower quantile is zero\nor below the axis"
en_gapnote = "gaps: no member\ncovers the age"

set multiplot
set label 100 en_title at screen 0.5, 0.975 center noenhanced font ",14"
set label 101 en_sub at screen 0.5, 0.947 center noenhanced font ",10"
set lmargin at screen L_left
set rmargin at screen L_right
set style fill solid 1.0 noborder
set grid front

eval VL_LOGTIME
set xrange [en_tmin:en_tmax]
# less than two decades of age: ticks at 1, 2 and 5 times each power of ten, labelled
# on the bottom panel only (en_tics, en_tics_blank: tick lists for `set xtics`)
en_tics = ""; en_tics_blank = ""
if (en_tmax / en_tmin < 100.0) {
    do for [en_e = floor(log10(en_tmin)):ceil(log10(en_tmax))] {
        do for [en_m in "1 2 5"] {
            en_tv = en_m * 10.0**en_e
            # (gnuplot drops a tick placed exactly on the lower end of a log axis)
            en_tp = (en_tv < en_tmin * (1 + 1e-10)) ? en_tmin * (1 + 1e-10) : en_tv
            if (en_tv >= en_tmin * (1 - 1e-9) && en_tv <= en_tmax * (1 + 1e-9)) {
                en_sep = (strlen(en_tics) > 0) ? ", " : ""
                en_tics = en_tics . en_sep . sprintf("\"%s10^{%d}\" %.17g", \
                    (en_m eq "1") ? "" : en_m . "×", en_e, en_tp)
                en_tics_blank = en_tics_blank . en_sep . sprintf("\"\" %.17g", en_tp)
            }
        }
    }
}
if (strlen(en_tics) > 0) { eval "set xtics (" . en_tics_blank . ")" }

# one quantile panel: column prefix EN_Q (water_to / o2_bar), axis [en_lo:en_hi],
# colours en_outer, en_inner, en_line, notes en_clip, en_gaps
EN_PANEL = 'set yrange [en_lo:en_hi]; set format y "10^{%L}"; \
    if (log10(en_hi / en_lo) > 7) { set ytics 100; set mytics 2 } else { set ytics autofreq; set mytics 10 }; \
    if (en_clip > 0 || en_gaps > 0) { \
        set label 3 (en_clip > 0 ? en_clipnote : "") . (en_clip > 0 && en_gaps > 0 ? "\n" : "") . \
            (en_gaps > 0 ? en_gapnote : "") at screen en_key_x, en_ptop - 0.105 left front font ",9" \
    }; \
    plot en_series using (column("time_yr")): \
            (en_bot(column(EN_Q . "_p05"), column(EN_Q . "_p95"), en_lo)):(en_top(column(EN_Q . "_p95"))) \
            with filledcurves fc rgb en_outer notitle, \
         en_series using (column("time_yr")): \
            (en_bot(column(EN_Q . "_p25"), column(EN_Q . "_p75"), en_lo)):(en_top(column(EN_Q . "_p75"))) \
            with filledcurves fc rgb en_inner notitle, \
         en_series using (column("time_yr")):(en_top(column(EN_Q . "_p50"))) \
            with lines lw 2.5 lc rgb en_line notitle, \
         keyentry with lines lw 2.5 lc rgb en_line title "median", \
         keyentry with boxes fc rgb en_inner title "25–75 %", \
         keyentry with boxes fc rgb en_outer title "5–95 %"; \
    unset label 3'

# ------------------------------------------------------------ (a) water
set tmargin at screen en_pt(1)
set bmargin at screen en_pb(1)
set format x ""
unset xlabel
set key at screen en_key_x, en_pt(1) left top title "across members" noenhanced
set label 1 "(a)" at screen 0.015, en_pt(1) - 0.005 left font ",12"
set logscale y
set ylabel "Surface water (TO)"
if (en_w_on) {
    EN_Q = "water_to"; en_lo = en_w_lo; en_hi = en_w_hi; en_ptop = en_pt(1)
    en_outer = en_w_outer; en_inner = en_w_inner; en_line = c_water; en_clip = en_w_clip
    eval EN_PANEL
} else {
    unset key
    set yrange [1e-3:1]
    set format y ""
    set label 2 "no surface water in any member at any age" at graph 0.5, 0.5 center
    plot NaN notitle
    unset label 2
}

# ------------------------------------------------------------ (b) O2
set tmargin at screen en_pt(2)
set bmargin at screen en_pb(2)
set format x "10^{%L}"
if (strlen(en_tics) > 0) { eval "set xtics (" . en_tics . ")" }
set xlabel "Stellar age (yr)"
set key at screen en_key_x, en_pt(2) left top
set label 1 "(b)" at screen 0.015, en_pt(2) - 0.005 left font ",12"
set ylabel "O_2 (bar)"
if (en_o_on) {
    EN_Q = "o2_bar"; en_lo = en_o_lo; en_hi = en_o_hi; en_ptop = en_pt(2)
    en_outer = en_o_outer; en_inner = en_o_inner; en_line = en_o_line; en_clip = en_o_clip
    eval EN_PANEL
} else {
    unset key
    set yrange [1e-3:1]
    set format y ""
    set label 2 "no O_2 in any member at any age" at graph 0.5, 0.5 center
    plot NaN notitle
    unset label 2
}

# ------------------------------------------------------------ (c) classes
set tmargin at screen en_pt(3)
set bmargin at screen en_pb(3)
unset key
set label 1 "(c)" at screen 0.015, en_pt(3) - 0.005 left font ",12"
unset logscale x
unset logscale y
unset mxtics
set xrange [0.4:en_ncls + 0.6]
set xtics () scale 0 noenhanced font ",10"
do for [i = 1:en_ncls] { set xtics add (word(cls_text, i) i) }
set xlabel "Outcome class"
set yrange [0:(en_fmax > 0.85 ? 1.12 : en_fmax * 1.15 + 0.05)]
set ytics 0.2 format "%.1f"
set mytics 2
set ylabel "Fraction of members"
set grid noxtics ytics
set boxwidth 0.7
plot $en_cls using (column("class")):(column("fraction")):(clscol(int(column("class")))) \
        with boxes fc rgb variable notitle, \
     $en_cls using (column("class")):(column("fraction")):(sprintf("%d", int(column("count")))) \
        with labels offset 0, 0.75 font ",10" notitle

unset multiplot
unset output
