# regime_map.gp -- a 2-D grid sweep of `volev sweep` as a map (gnuplot >= 5.4; house
# style: style.gp).
#
# Usage:
#   gnuplot -c plots/regime_map.gp MEMBERS.csv OUT XKEY YKEY WHAT XSCALE YSCALE [HZ] [TITLE]
#     MEMBERS.csv     members.csv of a grid sweep with two axes (docs/ensembles.md)
#     OUT             figure to write: .png, .pdf or .svg
#     XKEY, YKEY      the scenario keys of the two axes, as in the header of
#                     members.csv (e.g. planet.orbit_au, inventory.surface_water_to)
#     WHAT            water: colour = final surface water (final_water_to, TO) on a
#                            logarithmic colour scale (sequential, perceptually uniform,
#                            colour-blind safe); members that end dry (final water zero
#                            or empty, or outcome class desiccated) in a neutral grey
#                     class: colour = outcome class (column outcome), style.gp colours,
#                            legend of the classes present with their member counts
#     XSCALE, YSCALE  linear | log: scaling of each axis
#     HZ              optional, may be "": vertical lines at x-axis values, given as
#                     "LABEL=VALUE;LABEL=VALUE" in x-axis units, e.g.
#                     "runaway greenhouse=0.093;maximum greenhouse=0.181"; values
#                     outside the x range are listed in a note instead
#     TITLE           optional; default the sweep file's name (from the "# sweep hash
#                     ... of FILE" comment of MEMBERS.csv, else its folder) and what
#                     is mapped over which keys, in words
#
# Each member is a rectangle centred on its grid point; cell edges lie halfway
# between neighbouring grid values (in log space on a log axis), the outer cells as
# wide as their inner neighbours. Failed members are hatched (water) or in the grey
# of the failed class (class). Axis labels are the keys in words with their units,
# taken from the key's suffix (_au, _to, _bar, _k, _yr, _msun, ...): "Orbit (au)".
# The HZ lines are labelled with their value to three digits in the x axis's unit. The script stops with a
# message and a non-zero status when a needed column is missing or the members do not
# form a complete 2-D grid over XKEY and YKEY.

vl_script = "regime_map.gp"
vl_dir = system(sprintf("dirname '%s'", ARG0)) . "/"
rm_members = ARG1
vl_out = ARG2
rm_xkey = ARG3
rm_ykey = ARG4
rm_what = ARG5
rm_xscale = ARG6
rm_yscale = ARG7
rm_hz = ARG8
rm_title = ARG9
rm_usage = 0
do for [i = 1:7] { if (strlen(value(sprintf("ARG%d", i))) == 0) { rm_usage = 1 } }
# a missing argument: load the style with a placeholder output only to report usage
if (rm_usage) { vl_out = "usage.png" }
vl_w = 8.0
vl_h = 6.2
load vl_dir . "style.gp"
RM_USAGE = 'vl_msg = "usage: gnuplot -c regime_map.gp MEMBERS.csv OUT.{png,pdf,svg} XKEY YKEY water|class linear|log linear|log [HZ] [TITLE]"; eval VL_FAIL'
if (rm_usage) { eval RM_USAGE }
if (rm_what ne "water" && rm_what ne "class") {
    vl_msg = sprintf("WHAT must be water or class, not '%s'", rm_what); eval VL_FAIL
}
if ((rm_xscale ne "linear" && rm_xscale ne "log") || (rm_yscale ne "linear" && rm_yscale ne "log")) {
    vl_msg = sprintf("XSCALE and YSCALE must be linear or log, not '%s' and '%s'", rm_xscale, rm_yscale)
    eval VL_FAIL
}
if (rm_xkey eq rm_ykey) {
    vl_msg = sprintf("XKEY and YKEY are the same key '%s'", rm_xkey); eval VL_FAIL
}
# data problems (as opposed to usage): status 1
RM_DATAFAIL = 'print sprintf("%s: %s", vl_script, vl_msg); exit status 1'

eval VL_BASE

# ---------------------------------------------------------------- columns
rm_hj(i) = (i > 500) ? "" : (strlen(columnhead(i)) == 0 ? "" : columnhead(i) . "," . rm_hj(i + 1))
undefine STATS_*
stats rm_members using (0) nooutput
rm_nrow = exists("STATS_records") ? int(STATS_records) : 0
if (rm_nrow < 1) {
    vl_msg = sprintf("no data rows in '%s'", rm_members); eval RM_DATAFAIL
}
rm_hdr = ""
stats rm_members every ::0::0 using (rm_hdr = rm_hj(1), 0) nooutput
rm_hdr = "," . rm_hdr
rm_has(name) = strstrt(rm_hdr, "," . name . ",") > 0
rm_need = rm_xkey . " " . rm_ykey . " outcome" . ((rm_what eq "water") ? " final_water_to" : "")
do for [k = 1:words(rm_need)] {
    if (!rm_has(word(rm_need, k))) {
        vl_msg = sprintf("'%s' has no column '%s'", rm_members, word(rm_need, k)); eval RM_DATAFAIL
    }
}
rm_hasstatus = rm_has("status")
# a member failed: its status (when the column is there) or its class says so
rm_failed(dummy) = (strcol("outcome") eq "failed") || (rm_hasstatus && strcol("status") eq "failed")

# ---------------------------------------------------------------- axis labels
# A key in words with its unit, in gnuplot's enhanced text: the field after the last
# "." without its unit suffix, "_" as spaces and chemical formulae with subscripts,
# "Initial" before an inventory key and "Stellar" before a star key, e.g.
# planet.orbit_au -> "Orbit (au)", inventory.surface_water_to -> "Initial surface
# water (TO)", star.mass_msun -> "Stellar mass (M_{sun})"; a key of another section
# keeps the section's name in front ("escape: efficiency").
rm_last_us(s) = (rm_p = 0, sum [i = 1:strlen(s)] ((s[i:i] eq "_") ? (rm_p = i, 0) : 0), rm_p)
rm_last_dot(s) = (rm_p = 0, sum [i = 1:strlen(s)] ((s[i:i] eq ".") ? (rm_p = i, 0) : 0), rm_p)
rm_unit1(t) = (t eq "au") ? "au" : (t eq "to") ? "TO" : (t eq "bar") ? "bar" : \
              (t eq "k") ? "K" : (t eq "yr") ? "yr" : (t eq "gyr") ? "Gyr" : \
              (t eq "msun") ? "M_{sun}" : (t eq "mearth") ? "M_{Earth}" : (t eq "rearth") ? "R_{Earth}" : \
              (t eq "lsun") ? "L_{sun}" : (t eq "tw") ? "TW" : (t eq "pa") ? "Pa" : \
              (t eq "ppmv") ? "ppmv" : (t eq "m2") ? "m^2" : (t eq "rp") ? "R_{planet}" : ""
rm_unit2(t) = (t eq "cm2_s") ? "cm^{-2} s^{-1}" : (t eq "km_s") ? "km s^{-1}" : (t eq "m2_kg") ? "m^2 kg^{-1}" : \
              (t eq "kg_m2") ? "kg m^{-2}" : (t eq "msun_yr") ? "M_{sun} yr^{-1}" : (t eq "w_m2") ? "W m^{-2}" : \
              (t eq "kg_s") ? "kg s^{-1}" : ""
# a lower-case letter as a capital (gnuplot 5.4 has no toupper)
rm_upper(c) = (strstrt("abcdefghijklmnopqrstuvwxyz", c) > 0 && strlen(c) == 1) ? \
    "ABCDEFGHIJKLMNOPQRSTUVWXYZ"[strstrt("abcdefghijklmnopqrstuvwxyz", c):strstrt("abcdefghijklmnopqrstuvwxyz", c)] : c
rm_chem(w) = (w eq "co2") ? "CO_2" : (w eq "n2") ? "N_2" : (w eq "o2") ? "O_2" : (w eq "h2") ? "H_2" : \
             (w eq "h2o") ? "H_2O" : (w eq "xuv") ? "XUV" : (w eq "fe3") ? "Fe^{3+}" : w
RM_UNIT = 'rm_u = ""; rm_base = rm_k[rm_last_dot(rm_k) + 1:]; rm_p1 = rm_last_us(rm_base); \
    if (rm_p1 > 0 && rm_p1 < strlen(rm_base)) { \
        rm_u = rm_unit1(rm_base[rm_p1 + 1:]); \
        if (strlen(rm_u) > 0) { rm_stem = rm_base[1:rm_p1 - 1] } else { rm_stem = rm_base }; \
        rm_p2 = rm_last_us(rm_base[1:rm_p1 - 1]); \
        if (rm_p2 > 0 && strlen(rm_unit2(rm_base[rm_p2 + 1:])) > 0) { \
            rm_u = rm_unit2(rm_base[rm_p2 + 1:]); rm_stem = rm_base[1:rm_p2 - 1] } \
    } else { rm_stem = rm_base }; \
    rm_words = ""; rm_w = ""; \
    do for [i = 1:strlen(rm_stem) + 1] { \
        if (i > strlen(rm_stem) || rm_stem[i:i] eq "_") { \
            rm_words = rm_words . (strlen(rm_words) > 0 ? " " : "") . rm_chem(rm_w); rm_w = "" \
        } else { rm_w = rm_w . rm_stem[i:i] } \
    }; \
    rm_sect = (strstrt(rm_k, ".") > 0) ? rm_k[1:strstrt(rm_k, ".") - 1] : ""; \
    if (rm_sect eq "inventory") { rm_words = "initial " . rm_words } else { \
    if (rm_sect eq "star") { rm_words = "stellar " . rm_words } else { \
    if (strlen(rm_sect) > 0 && rm_sect ne "planet") { rm_words = rm_k[1:rm_last_dot(rm_k) - 1] . ": " . rm_words } } }; \
    rm_name = rm_words; \
    rm_label = rm_upper(rm_words[1:1]) . rm_words[2:] . ((strlen(rm_u) > 0) ? " (" . rm_u . ")" : ""); \
    rm_unit = rm_u'
rm_k = rm_xkey; eval RM_UNIT; rm_xlabel = rm_label; rm_xname = rm_name; rm_xu = rm_unit
rm_k = rm_ykey; eval RM_UNIT; rm_ylabel = rm_label; rm_yname = rm_name

# ---------------------------------------------------------------- default title
# the sweep file of "# sweep hash H of FILE: ..." above the header, without folder and
# ".cfg"; the folder of MEMBERS.csv without that line
if (strlen(rm_title) == 0) {
    rm_sq(s) = "'" . s . "'"
    rm_sweep = system(sprintf("sed -n 's/^# sweep hash [^ ]* of \\(.*\\): .*$/\\1/p' %s | head -n 1 | sed 's|.*/||; s|\\.cfg$||'", \
        (strstrt(rm_members, "'") > 0) ? "/dev/null" : rm_sq(rm_members)))
    if (strlen(rm_sweep) == 0) {
        rm_slash = 0
        do for [i = 1:strlen(rm_members)] { if (rm_members[i:i] eq "/") { rm_slash = i } }
        rm_sweep = (rm_slash > 1) ? rm_members[1:rm_slash - 1] : "sweep"
    }
    # the names without enhanced-text markup (the title is shown as written)
    rm_plain(s) = (strlen(s) == 0) ? "" : \
        ((s[1:1] eq "_" || s[1:1] eq "{" || s[1:1] eq "}" || s[1:1] eq "^") ? "" : s[1:1]) . rm_plain(s[2:])
    rm_title = sprintf("%s: %s by %s and %s", rm_sweep, \
        (rm_what eq "water") ? "final surface water" : "outcome", rm_plain(rm_xname), rm_plain(rm_yname))
}

# ---------------------------------------------------------------- the grid
# distinct values of an axis, in increasing order: `smooth unique` sorts them (at 6
# digits); each is then replaced by the exact value of the members
RM_AXIS = 'set table $rm_u; \
    plot rm_members using (column(rm_k)):(column(0)) smooth unique; \
    unset table; \
    rm_n = 0; \
    do for [i = 1:|$rm_u|] { \
        rm_l = $rm_u[i]; \
        if (strlen(rm_l) > 0 && rm_l[1:1] ne "#" && words(rm_l) >= 1) { rm_n = rm_n + 1 } \
    }; \
    array rm_v[rm_n > 0 ? rm_n : 1]; \
    rm_j = 0; \
    do for [i = 1:|$rm_u|] { \
        rm_l = $rm_u[i]; \
        if (strlen(rm_l) > 0 && rm_l[1:1] ne "#" && words(rm_l) >= 1) { \
            rm_j = rm_j + 1; rm_a = word(rm_l, 1) + 0.0; \
            stats rm_members using (v = column(rm_k), \
                abs(v - rm_a) <= 1e-5 * abs(rm_a) + 1e-300 ? v : NaN) nooutput; \
            rm_v[rm_j] = STATS_min \
        } \
    }'

rm_k = rm_xkey; eval RM_AXIS
rm_nx = rm_n
array rm_X[rm_nx > 0 ? rm_nx : 1]
do for [i = 1:rm_nx] { rm_X[i] = rm_v[i] }
rm_k = rm_ykey; eval RM_AXIS
rm_ny = rm_n
array rm_Y[rm_ny > 0 ? rm_ny : 1]
do for [i = 1:rm_ny] { rm_Y[i] = rm_v[i] }
if (rm_nx < 1 || rm_ny < 1) {
    vl_msg = sprintf("no numbers in the columns '%s' and '%s' of '%s'", rm_xkey, rm_ykey, rm_members)
    eval RM_DATAFAIL
}
if (rm_xscale eq "log" && rm_X[1] <= 0) {
    vl_msg = sprintf("a log x axis needs positive values of %s (smallest: %g)", rm_xkey, rm_X[1])
    eval RM_DATAFAIL
}
if (rm_yscale eq "log" && rm_Y[1] <= 0) {
    vl_msg = sprintf("a log y axis needs positive values of %s (smallest: %g)", rm_ykey, rm_Y[1])
    eval RM_DATAFAIL
}

# index of a value among the grid values (0: not one of them)
rm_near(v, g) = abs(v - g) <= 1e-9 * (abs(g) > abs(v) ? abs(g) : abs(v)) || v == g
rm_fx(v, i) = (i > rm_nx) ? 0 : rm_near(v, rm_X[i]) ? i : rm_fx(v, i + 1)
rm_fy(v, i) = (i > rm_ny) ? 0 : rm_near(v, rm_Y[i]) ? i : rm_fy(v, i + 1)
rm_ix(dummy) = (v = column(rm_xkey), v == v ? rm_fx(v, 1) : 0)
rm_iy(dummy) = (v = column(rm_ykey), v == v ? rm_fy(v, 1) : 0)
# every member on a grid point, each grid point once: count, sum and sum of squares of
# the cell numbers match those of 1 .. nx ny
rm_cell(dummy) = (a = rm_ix(0), b = rm_iy(0), (a > 0 && b > 0) ? (a - 1) * rm_ny + b : 0)
stats rm_members using (rm_cell(0)) nooutput
rm_ncell = rm_nx * rm_ny
if (STATS_records != rm_ncell || STATS_min < 1 || STATS_sum != rm_ncell * (rm_ncell + 1) / 2.0 || \
    STATS_sumsq != rm_ncell * (rm_ncell + 1) * (2 * rm_ncell + 1) / 6.0) {
    vl_msg = sprintf("the %d members of '%s' do not form a complete %d x %d grid over %s and %s (a grid sweep with these two axes is needed)", \
        rm_nrow, rm_members, rm_nx, rm_ny, rm_xkey, rm_ykey)
    eval RM_DATAFAIL
}

# cell edges: halfway between neighbours (in log10 on a log axis); an outer cell is as
# wide as its neighbour, a single value gets a cell one decade (log) or 20 % wide
RM_EDGES = 'array rm_lo[rm_n]; array rm_hi[rm_n]; \
    do for [i = 1:rm_n] { rm_t[i] = rm_lg ? log10(rm_g[i]) : rm_g[i] }; \
    if (rm_n == 1) { \
        rm_hw = rm_lg ? 0.5 : ((rm_t[1] != 0) ? 0.1 * abs(rm_t[1]) : 0.5); \
        rm_lo[1] = rm_t[1] - rm_hw; rm_hi[1] = rm_t[1] + rm_hw \
    } else { \
        do for [i = 1:rm_n] { \
            rm_lo[i] = (i > 1) ? 0.5 * (rm_t[i - 1] + rm_t[i]) : rm_t[1] - 0.5 * (rm_t[2] - rm_t[1]); \
            rm_hi[i] = (i < rm_n) ? 0.5 * (rm_t[i] + rm_t[i + 1]) : rm_t[rm_n] + 0.5 * (rm_t[rm_n] - rm_t[rm_n - 1]) \
        } \
    }; \
    if (rm_lg) { do for [i = 1:rm_n] { rm_lo[i] = 10.0**rm_lo[i]; rm_hi[i] = 10.0**rm_hi[i] } }'
rm_n = rm_nx; rm_lg = (rm_xscale eq "log")
array rm_g[rm_n]; array rm_t[rm_n]
do for [i = 1:rm_n] { rm_g[i] = rm_X[i] }
eval RM_EDGES
array rm_XL[rm_nx]; array rm_XH[rm_nx]
do for [i = 1:rm_nx] { rm_XL[i] = rm_lo[i]; rm_XH[i] = rm_hi[i] }
rm_n = rm_ny; rm_lg = (rm_yscale eq "log")
array rm_g[rm_n]; array rm_t[rm_n]
do for [i = 1:rm_n] { rm_g[i] = rm_Y[i] }
eval RM_EDGES
array rm_YL[rm_ny]; array rm_YH[rm_ny]
do for [i = 1:rm_ny] { rm_YL[i] = rm_lo[i]; rm_YH[i] = rm_hi[i] }
rm_xmin = rm_XL[1]; rm_xmax = rm_XH[rm_nx]
rm_ymin = rm_YL[1]; rm_ymax = rm_YH[rm_ny]

# ---------------------------------------------------------------- colours
rm_cls(s) = (rm_c = 0, sum [i = 1:words(cls_names)] ((s eq word(cls_names, i)) ? (rm_c = i, 0) : 0), rm_c)
stats rm_members using (rm_cls(strcol("outcome")) == 0 ? 1 : 0) nooutput
if (STATS_sum > 0) {
    vl_msg = sprintf("%d members of '%s' have an outcome that is not a class of docs/ensembles.md (%s)", \
        int(STATS_sum), rm_members, cls_names)
    eval RM_DATAFAIL
}
array rm_ncls[words(cls_names)]
do for [i = 1:words(cls_names)] {
    stats rm_members using (rm_cls(strcol("outcome")) == i ? 1 : 0) nooutput
    rm_ncls[i] = int(STATS_sum)
}
stats rm_members using (rm_failed(0) ? 1 : 0) nooutput
rm_nfail = int(STATS_sum)

# water: dry = ran, but final water zero, empty or the desiccated class
rm_dry(dummy) = !rm_failed(0) && (w = column("final_water_to"), !(w == w && w > 0) || strcol("outcome") eq "desiccated")
rm_wet(dummy) = !rm_failed(0) && !rm_dry(0)
rm_c_dry = "#cccccc"
rm_c_fail = "#555555"
if (rm_what eq "water") {
    stats rm_members using (rm_dry(0) ? 1 : 0) nooutput
    rm_ndry = int(STATS_sum)
    stats rm_members using (rm_wet(0) ? 1 : 0) nooutput
    rm_nwet = int(STATS_sum)
    if (rm_nwet > 0) {
        stats rm_members using (rm_wet(0) ? column("final_water_to") : NaN) nooutput
        rm_cb_lo = 10.0**floor(log10(STATS_min) + 1e-9)
        rm_cb_hi = 10.0**ceil(log10(STATS_max) - 1e-9)
        if (rm_cb_hi <= rm_cb_lo) { rm_cb_hi = rm_cb_lo * 10.0 }
    }
}

# ---------------------------------------------------------------- HZ lines
# "LABEL=VALUE;LABEL=VALUE": labels and values in rm_hzl[], rm_hzv[]
rm_trim(s) = (rm_a = 1, rm_b = strlen(s), \
    sum [i = 1:strlen(s)] ((rm_a == i && s[i:i] eq " ") ? (rm_a = i + 1, 0) : 0), \
    sum [i = 1:strlen(s)] ((rm_b == strlen(s) - i + 1 && rm_b >= rm_a && s[rm_b:rm_b] eq " ") ? (rm_b = rm_b - 1, 0) : 0), \
    (rm_b >= rm_a) ? s[rm_a:rm_b] : "")
rm_isnum(s) = (rm_ok = (strlen(s) > 0 && strstrt("0123456789.+-", s[1:1]) > 0), \
    rm_dig = 0, \
    sum [i = 1:strlen(s)] ((strstrt("0123456789.eE+-", s[i:i]) == 0) ? (rm_ok = 0, 0) : \
                           (strstrt("0123456789", s[i:i]) > 0) ? (rm_dig = 1, 0) : 0), \
    rm_ok && rm_dig)
rm_nhz = 0
if (strlen(rm_hz) > 0) {
    rm_nhz = 1
    do for [i = 1:strlen(rm_hz)] { if (rm_hz[i:i] eq ";") { rm_nhz = rm_nhz + 1 } }
}
array rm_hzl[rm_nhz > 0 ? rm_nhz : 1]
array rm_hzv[rm_nhz > 0 ? rm_nhz : 1]
rm_rest = rm_hz
rm_j = 0
do for [k = 1:rm_nhz] {
    rm_p = strstrt(rm_rest, ";")
    rm_item = rm_trim((rm_p > 0) ? rm_rest[1:rm_p - 1] : rm_rest)
    rm_rest = (rm_p > 0) ? rm_rest[rm_p + 1:] : ""
    if (strlen(rm_item) > 0) {
        rm_eq = 0
        do for [i = 1:strlen(rm_item)] { if (rm_item[i:i] eq "=") { rm_eq = i } }
        if (rm_eq < 2) {
            vl_msg = sprintf("HZ: '%s' is not LABEL=VALUE", rm_item); eval VL_FAIL
        }
        rm_val = rm_trim(rm_item[rm_eq + 1:])
        if (!rm_isnum(rm_val)) {
            vl_msg = sprintf("HZ: '%s' in '%s' is not a number", rm_val, rm_item); eval VL_FAIL
        }
        rm_j = rm_j + 1
        rm_hzl[rm_j] = rm_trim(rm_item[1:rm_eq - 1])
        rm_hzv[rm_j] = real(rm_val)
    }
}
rm_nhz = rm_j

# ---------------------------------------------------------------- layout
eval VL_TERM
rm_L = 0.13; rm_R = 0.70; rm_B = 0.15; rm_T = 0.855
set lmargin at screen rm_L
set rmargin at screen rm_R
set bmargin at screen rm_B
set tmargin at screen rm_T
set label 100 rm_title at screen 0.5, 0.965 center noenhanced font ",14"
rm_sub = sprintf("%d members, %d × %d grid; colour: %s", rm_nrow, rm_nx, rm_ny, \
    (rm_what eq "water") ? "surface water at the end" : "outcome class")
if (rm_nfail > 0) { rm_sub = rm_sub . sprintf("; %d failed", rm_nfail) }
set label 101 rm_sub at screen 0.5, 0.925 center noenhanced font ",10"

unset grid
set tics front
set border front
set xrange [rm_xmin:rm_xmax]
set yrange [rm_ymin:rm_ymax]
set xlabel rm_xlabel enhanced
set ylabel rm_ylabel enhanced
# axes: ticks on the grid values (up to 12 of them), else automatic
RM_TICS = 'if (rm_n <= 12) { \
        rm_tl = ""; \
        do for [i = 1:rm_n] { rm_tl = rm_tl . ((i > 1) ? ", " : "") . \
            sprintf("\"%.3g\" %.17g", rm_g[i], rm_g[i]) }; \
        eval sprintf("set %stics (%s) out nomirror", rm_ax, rm_tl); \
        eval sprintf("unset m%stics", rm_ax) \
    } else { \
        eval sprintf("set %stics out nomirror", rm_ax); \
        if (rm_lg) { eval sprintf("set format %s \"10^{%%L}\"", rm_ax) } \
    }'
rm_ax = "x"; rm_n = rm_nx; rm_lg = (rm_xscale eq "log")
array rm_g[rm_n]; do for [i = 1:rm_n] { rm_g[i] = rm_X[i] }
if (rm_lg) { set logscale x }
eval RM_TICS
rm_ax = "y"; rm_n = rm_ny; rm_lg = (rm_yscale eq "log")
array rm_g[rm_n]; do for [i = 1:rm_n] { rm_g[i] = rm_Y[i] }
if (rm_lg) { set logscale y }
eval RM_TICS

# HZ lines: a white halo under a dark dashed line reads on light and dark cells
set style textbox opaque fillcolor rgb "white" noborder margins 2, 1
rm_out = ""
# position of an x value across the plot, 0 .. 1
rm_fpos(v) = (rm_xscale eq "log") ? log(v / rm_xmin) / log(rm_xmax / rm_xmin) : (v - rm_xmin) / (rm_xmax - rm_xmin)
rm_tops = ""
do for [k = 1:rm_nhz] {
    rm_v = rm_hzv[k]
    rm_in = (rm_v >= rm_xmin && rm_v <= rm_xmax && (rm_xscale ne "log" || rm_v > 0))
    if (rm_in) {
        set arrow from first rm_v, graph 0 to first rm_v, graph 1 nohead front lc rgb "white" lw 4 dt 1
        set arrow from first rm_v, graph 0 to first rm_v, graph 1 nohead front lc rgb "#000000" lw 1.6 dt 2
        # the label at the top, or at the bottom when a line close by has its label there
        rm_f = rm_fpos(rm_v)
        rm_clash = 0
        do for [j = 1:words(rm_tops)] { if (abs(real(word(rm_tops, j)) - rm_f) < 0.05) { rm_clash = 1 } }
        if (rm_clash) {
            set label sprintf("%s: %#.3g %s", rm_hzl[k], rm_v, rm_xu) at first rm_v, graph 0.03 \
                rotate by 90 left front boxed noenhanced font ",9" offset character -0.9, 0
        } else {
            rm_tops = rm_tops . sprintf(" %.6f", rm_f)
            set label sprintf("%s: %#.3g %s", rm_hzl[k], rm_v, rm_xu) at first rm_v, graph 0.97 \
                rotate by 90 right front boxed noenhanced font ",9" offset character -0.9, 0
        }
    } else {
        rm_out = rm_out . ((strlen(rm_out) > 0) ? "; " : "") . sprintf("%s = %#.3g %s", rm_hzl[k], rm_v, rm_xu)
    }
}
if (strlen(rm_out) > 0) {
    set label 102 "outside the x range, not drawn: " . rm_out at screen 0.02, 0.025 left noenhanced font ",9"
}

# cells: failed members hatched (water) or in the failed class grey (class)
# (boxxyerror ignores columns beyond the six of the cell, so a member is left out by
# an undefined x: RM_CELL(cond) keeps the members for which cond holds)
rm_bx(keep) = keep ? column(rm_xkey) : NaN
RM_CELL(cond) = sprintf("(rm_bx(%s)):(column(rm_ykey)):(rm_XL[rm_ix(0)]):(rm_XH[rm_ix(0)]):(rm_YL[rm_iy(0)]):(rm_YH[rm_iy(0)])", cond)
rm_edge = (rm_nx <= 40 && rm_ny <= 40) ? "border lc rgb \"white\"" : "noborder"
set key at screen 0.735, ((rm_what eq "water" && rm_nwet > 0) ? 0.39 : (rm_what eq "water") ? rm_T - 0.08 : rm_T) left top noenhanced samplen 1.5 spacing 1.3 \
    width -2 height 0.5

if (rm_what eq "water") {
    set logscale cb
    if (rm_nwet > 0) {
        set cbrange [rm_cb_lo:rm_cb_hi]
        set format cb "10^{%L}"
        if (rm_cb_lo >= 1e-3 && rm_cb_hi <= 1e4) { set format cb "%g" }
        set mcbtics 10
        set colorbox user origin screen 0.74, 0.44 size screen 0.025, rm_T - 0.44 front bdefault
        set cblabel "Final surface water (TO)" offset 0.5, 0
    } else {
        set cbrange [1:10]
        unset colorbox
        set label 103 "no member keeps\nsurface water" at screen 0.735, rm_T left front font ",10" offset 0, -0.5
    }
    # viridis-like: perceptually uniform, readable in greyscale and by colour-blind
    # readers; dark = little water, yellow = most
    set palette defined (0 "#440154", 1 "#472D7B", 2 "#3B528B", 3 "#2C728E", 4 "#21918C", \
                         5 "#28AE80", 6 "#5EC962", 7 "#ADDC30", 8 "#FDE725")
    set palette maxcolors 0
    eval "plot rm_members using " . RM_CELL("rm_wet(0)") . ":(column(\"final_water_to\")) \
            with boxxyerror fs solid 1.0 " . rm_edge . " fc palette z notitle, \
         rm_members using " . RM_CELL("rm_dry(0)") . " \
            with boxxyerror fs solid 1.0 " . rm_edge . " fc rgb rm_c_dry notitle, \
         rm_members using " . RM_CELL("rm_failed(0)") . " \
            with boxxyerror fs pattern 4 border lc rgb rm_c_fail fc rgb rm_c_fail notitle, \
         for [z = 1:(rm_ndry > 0 ? 1 : 0)] keyentry with boxes fs solid 1.0 fc rgb rm_c_dry \
            title sprintf(\"desiccated (%d)\", rm_ndry), \
         for [z = 1:(rm_nfail > 0 ? 1 : 0)] keyentry with boxes fs pattern 4 lc rgb rm_c_fail \
            title sprintf(\"failed (%d)\", rm_nfail)"
} else {
    unset colorbox
    set key title "Outcome class"
    eval "plot rm_members using " . RM_CELL("1") . ":(clscol(rm_cls(strcol(\"outcome\")))) \
            with boxxyerror fs solid 1.0 " . rm_edge . " lc rgb variable notitle, \
         for [i = 1:words(cls_names)] for [z = 1:(rm_ncls[i] > 0 ? 1 : 0)] keyentry with boxes \
            fs solid 1.0 fc rgb word(cls_rgb, i) title sprintf(\"%s (%d)\", word(cls_text, i), rm_ncls[i])"
}

unset output
