# history.gp -- evolution of one volev run in six panels (gnuplot >= 5.4).
#
#   gnuplot -c plots/history.gp SERIES.csv OUT.png|pdf|svg [EVENTS] [TITLE]
#
#   SERIES.csv  series.csv of the run (required)
#   OUT         the figure; its extension picks the format (required)
#   EVENTS      the run's events, as `volev plot` makes them from events.csv (optional;
#               "" means none): one line "TIME GROUP TEXT" per time with events, e.g.
#               "6.694747607e+08 1 magma ocean solidified (669 Myr)". Each TIME is a vertical
#               line through every panel, numbered GROUP above the top panel; the
#               numbers and their TEXT are listed below the figure (times too close to
#               tell apart share a number; only the first line of a group has TEXT;
#               GROUP 0: a line without number or words, counted in the list).
#   TITLE       figure title (optional; default the folder of SERIES.csv; `volev plot`
#               passes the scenario, planet and star)
#
# Panels, sharing a logarithmic stellar-age axis:
#   (a) surface water (TO)
#   (b) partial pressures of H2O, CO2, N2, O2 and H2 (bar), one colour per species
#   (c) surface temperature (K) over a strip coloured by climate regime, and the
#       mantle's potential temperature (dashed) while a magma ocean cools, when the run
#       started molten (column mantle_temp_k)
#   (d) escape of each element (kg/s of the element): H, O, C and N totals
#   (e) escape by channel of the element the run loses most of by mass (the last
#       space_<element>_kg; the largest total flux when those columns are absent): one
#       colour per channel (solid for the first four, dashed for the rest, so that
#       neighbouring Okabe-Ito colours also differ in pattern), the element total in
#       grey behind; channels that stay zero
#       or below the axis are left out of the plot and of the legend
#   (f) stellar luminosity (L_sun) and the XUV flux at the planet (W m^-2, right axis)
# Each panel's legend is one or two rows above it, so the panels take the full width.
# Columns are looked up by header name. A missing required column, an unreadable file
# or a file without data rows stops the script with status 1 before anything is drawn;
# a wrong command line stops it with status 2. Every axis range is computed here from
# the data, and zero or negative values are left out of the logarithmic panels, so
# all-zero columns never break an axis.

vl_script = "history.gp"
vl_dir = system(sprintf("dirname '%s'", ARG0)) . "/"
# arguments past ARGC are not defined
hs_arg(i) = (ARGC >= i) ? ARGV[i] : ""
hs_data = hs_arg(1)
vl_out = hs_arg(2)
hs_events = hs_arg(3)
hs_title = hs_arg(4)
vl_usage = (strlen(hs_data) == 0 || strlen(vl_out) == 0 || ARGC > 4)
if (vl_usage) { vl_out = "usage.png" }
load vl_dir . "style.gp"
if (vl_usage) {
    vl_msg = "usage: gnuplot -c history.gp SERIES.csv OUT.png|pdf|svg [EVENTS] [TITLE]"
    eval VL_FAIL
}
vl_w = 9.0; vl_h = 14.0

# data problems (as opposed to usage): status 1
HS_DIE = 'print sprintf("%s: %s", vl_script, vl_msg); exit status 1'

# ------------------------------------------------------------------ file checks
# a file name as one single-quoted shell word
hs_sqesc(s) = (strstrt(s, "'") == 0) ? s : \
    s[1:strstrt(s, "'") - 1] . "'\\''" . hs_sqesc(s[strstrt(s, "'") + 1:])
hs_sh(s) = "'" . hs_sqesc(s) . "'"
hs_readable(f) = int(system(sprintf("test -r %s && test -f %s && echo 1 || echo 0", hs_sh(f), hs_sh(f))))
# header names (space separated) and number of data rows of a CSV file
hs_header(f) = system(sprintf("sed -n '/^#/!{p;q;}' %s | tr ',' ' '", hs_sh(f)))
hs_rows(f) = int(system(sprintf("grep -v '^#' %s | wc -l", hs_sh(f)))) - 1
hs_has(hdr, name) = strstrt(" " . hdr . " ", " " . name . " ") > 0
# last position of character c in s (0 if none)
hs_rpos(s, c, i) = (i < 1) ? 0 : (s[i:i] eq c ? i : hs_rpos(s, c, i - 1))

if (!hs_readable(hs_data)) { vl_msg = sprintf("cannot read '%s'", hs_data); eval HS_DIE }
hs_hdr = hs_header(hs_data)
hs_nrows = hs_rows(hs_data)
if (hs_nrows < 1) { vl_msg = sprintf("no data rows in '%s'", hs_data); eval HS_DIE }
# curves: lines, or points when there is a single row
HS_W = (hs_nrows > 1) ? "lines" : "linespoints pt 7 ps 0.8"
hs_required = "time_yr regime surface_temp_k surface_water_to " . \
    "p_h2o_bar p_co2_bar p_n2_bar p_o2_bar p_h2_bar " . \
    "h_escape_kg_s o_escape_kg_s c_escape_kg_s n_escape_kg_s luminosity_lsun f_xuv_w_m2"
do for [k = 1:words(hs_required)] {
    if (!hs_has(hs_hdr, word(hs_required, k))) {
        vl_msg = sprintf("'%s' has no column '%s'", hs_data, word(hs_required, k))
        eval HS_DIE
    }
}
# the events: lines "TIME GROUP TEXT" (see above) in hs_ev_t[], hs_ev_g[], hs_ev_x[]
nl = "\n"
hs_evs = hs_events
if (strlen(hs_evs) > 0 && hs_evs[strlen(hs_evs):] ne nl) { hs_evs = hs_evs . nl }
hs_nev = 0
do for [c = 1:strlen(hs_evs)] { if (hs_evs[c:c] eq nl) { hs_nev = hs_nev + 1 } }
array hs_ev_t[hs_nev > 0 ? hs_nev : 1]
array hs_ev_g[hs_nev > 0 ? hs_nev : 1]
array hs_ev_x[hs_nev > 0 ? hs_nev : 1]
hs_rest = hs_evs
do for [i = 1:hs_nev] {
    hs_cut = strstrt(hs_rest, nl); hs_line = hs_rest[1:hs_cut - 1]; hs_rest = hs_rest[hs_cut + 1:]
    hs_s1 = strstrt(hs_line, " ")
    hs_s2 = (hs_s1 > 0) ? strstrt(hs_line[hs_s1 + 1:], " ") : 0
    if (hs_s1 == 0 || hs_s2 == 0) {
        vl_msg = sprintf("EVENTS line %d, '%s', is not TIME GROUP TEXT", i, hs_line); eval VL_FAIL
    }
    hs_ev_t[i] = vl_num(hs_line[1:hs_s1 - 1])
    hs_ev_g[i] = int(hs_line[hs_s1 + 1:hs_s1 + hs_s2 - 1])
    hs_ev_x[i] = hs_line[hs_s1 + hs_s2 + 1:]
}

if (strlen(hs_title) == 0) {
    hs_slash = hs_rpos(hs_data, "/", strlen(hs_data))
    hs_title = (hs_slash == 0) ? "." : (hs_slash == 1) ? "/" : hs_data[1:hs_slash - 1]
}

eval VL_BASE

# ------------------------------------------------------------------ data scan
# SCAN: column SC times factor SF (default 1): smax (largest value, or 0 if none is
# positive) and smin (smallest positive value, meaningful when smax > 0).
SF = 1.0
SCAN = 'stats hs_data using (column(SC) * SF) nooutput; \
    smax = STATS_max; smin = 1e300; \
    if (smax > 0) { \
        stats hs_data using (hs_v = column(SC) * SF, hs_v > 0 ? hs_v : 1/0) nooutput; \
        smin = STATS_min \
    } else { smax = 0.0 }'

# positive values only, for logarithmic axes
pos(v) = (v > 0) ? v : 1/0

# stellar age: positive values (a run may start at t = 0)
SC = "time_yr"; eval SCAN
if (smax > 0) {
    tmin = smin; tmax = smax
    if (tmax <= tmin * 1.0001) { tmin = tmin / 10.0; tmax = tmax * 10.0 }
} else {
    tmin = 1.0; tmax = 10.0
}
tclamp(t) = (t > tmin) ? t : tmin
# boxes of the regime strip overlap by about a pixel so anti-aliasing leaves no seams
tover = (tmax / tmin)**0.002

# (a) surface water
SC = "surface_water_to"; eval SCAN
wat_on = (smax > 0)
if (wat_on) { wat_lo = decfloor(smin, smax, 8); wat_hi = decceil(smax) }

# (b) partial pressures, one colour per species
sp_cols  = "p_h2o_bar p_co2_bar p_n2_bar p_o2_bar p_h2_bar"
sp_names = "H_2O CO_2 N_2 O_2 H_2"
sp_rgb   = c_h2o . " " . c_co2 . " " . c_n2 . " " . c_o2 . " " . c_h2
sp_max = ""
p_lo = 1e300; p_hi = 0.0
do for [k = 1:words(sp_cols)] {
    SC = word(sp_cols, k); eval SCAN
    sp_max = sp_max . sprintf(" %.6e", smax)
    if (smax > 0) {
        if (smin < p_lo) { p_lo = smin }
        if (smax > p_hi) { p_hi = smax }
    }
}
if (p_hi > 0) { pr_lo = decfloor(p_lo, p_hi, 10); pr_hi = decceil(p_hi) } else { pr_lo = 1e300 }
# species drawn: those that reach the axis; those that stay below it are named in
# the legend
sp_on = ""; sp_low = ""
do for [k = 1:words(sp_cols)] {
    if (word(sp_max, k) + 0.0 >= pr_lo) {
        sp_on = sp_on . sprintf(" %d", k)
    } else {
        if (word(sp_max, k) + 0.0 > 0) {
            sp_low = sp_low . (strlen(sp_low) > 0 ? ", " : "") . word(sp_names, k)
        }
    }
}
np = words(sp_on)
sp_low_note = (strlen(sp_low) > 0) ? sprintf("%s: below 10^{%d} bar", sp_low, int(floor(log10(pr_lo) + 0.5))) : ""

# (c) surface temperature (linear axis) and the regimes that occur
stats hs_data using (column("surface_temp_k")) nooutput
T_lo = STATS_min; T_hi = STATS_max
# the mantle's potential temperature while it changes (a molten start)
mtp_on = 0
if (hs_has(hs_hdr, "mantle_temp_k")) {
    stats hs_data using (column("mantle_temp_k")) nooutput
    if (STATS_max > 0) {
        mtp_on = 1
        T_hi = (STATS_max > T_hi) ? STATS_max : T_hi
    }
}
if (T_hi - T_lo < 20.0) { T_mid = 0.5 * (T_hi + T_lo); T_lo = T_mid - 10.0; T_hi = T_mid + 10.0 }
# the regime strip takes the bottom of the panel (y2 in [0, strip_h]); the curve
# stays above it
strip_h = 0.07
curve_base = strip_h + 0.06
T_span = T_hi - T_lo
T_ax_lo = T_lo - T_span * curve_base / (0.95 - curve_base)
T_ax_hi = T_hi + T_span * 0.05 / (0.95 - curve_base)
reg_on = ""
do for [k = 0:5] {
    stats hs_data using (column("regime") == k ? 1 : 0) nooutput
    if (STATS_sum > 0) { reg_on = reg_on . sprintf(" %d", k + 1) }
}

# (d) escape. Element k of "h o c n": colour word(el_rgb, k), total column
# word(tot_cols, k). Channels: legend label ch_lab[i], dash type 10 + i.
el_keys  = "h o c n"
el_names = "H O C N"
el_rgb   = c_el_h . " " . c_el_o . " " . c_el_c . " " . c_el_n
tot_cols = "h_escape_kg_s o_escape_kg_s c_escape_kg_s n_escape_kg_s"
ch_keys  = "h2 h2o o2drag jeans pickup sputter photochem polar"
ch_lab   = '"thermal, from H_2" "thermal, from H_2O" "O drag (from O_2)" ' . \
           '"Jeans" "ion pickup" "sputtering" "photochemical" "polar outflow"'
# columns that do not follow <channel>_<element>_kg_s: column, element, channel,
# factor to kg/s of the element (photolysis_h2o_lost_kg_s is water: 2 M_H / M_H2O is H)
ex_cols = "h_escape_from_h2_kg_s photolysis_h2o_lost_kg_s photolysis_o_dragged_kg_s o_drag_from_o2_kg_s"
ex_el   = "1 1 2 2"
ex_ch   = "1 2 2 3"
ex_fac  = sprintf("1 %.9g 1 1", 2.0 * 1.00794 / 18.01528)
# index of word w in list (0 if absent)
windex(list, w, i) = (i > words(list)) ? 0 : (word(list, i) eq w ? i : windex(list, w, i + 1))
# candidates: e_cols, e_el, e_ch, e_fac (parallel lists)
e_cols = ""; e_el = ""; e_ch = ""; e_fac = ""
do for [k = 1:words(ex_cols)] {
    if (hs_has(hs_hdr, word(ex_cols, k))) {
        e_cols = e_cols . " " . word(ex_cols, k)
        e_el = e_el . " " . word(ex_el, k)
        e_ch = e_ch . " " . word(ex_ch, k)
        e_fac = e_fac . " " . word(ex_fac, k)
    }
}
# every other column named <channel>_<element>_kg_s, element one of h o c n; a channel
# not in ch_keys gets its own legend entry named after it
do for [k = 1:words(hs_hdr)] {
    hs_n = word(hs_hdr, k)
    hs_L = strlen(hs_n)
    if (hs_L > 7) {
        if (hs_n[hs_L - 4:hs_L] eq "_kg_s" && hs_n[hs_L - 6:hs_L - 6] eq "_") {
            hs_el = windex(el_keys, hs_n[hs_L - 5:hs_L - 5], 1)
            if (hs_el > 0) {
                hs_ch = hs_n[1:hs_L - 7]
                hs_ci = windex(ch_keys, hs_ch, 1)
                if (hs_ci == 0) {
                    ch_keys = ch_keys . " " . hs_ch
                    hs_lab = ""
                    do for [j = 1:strlen(hs_ch)] {
                        hs_lab = hs_lab . (hs_ch[j:j] eq "_" ? " " : hs_ch[j:j])
                    }
                    ch_lab = ch_lab . ' "' . hs_lab . '"'
                    hs_ci = words(ch_keys)
                }
                e_cols = e_cols . " " . hs_n
                e_el = e_el . sprintf(" %d", hs_el)
                e_ch = e_ch . sprintf(" %d", hs_ci)
                e_fac = e_fac . " 1"
            }
        }
    }
}
# (d) the element totals: the axis spans their values
SF = 1.0
t_max = ""
e_lo = 1e300; e_hi = 0.0
do for [k = 1:4] {
    SC = word(tot_cols, k); eval SCAN
    t_max = t_max . sprintf(" %.6e", smax)
    if (smax > 0) {
        if (smin < e_lo) { e_lo = smin }
        if (smax > e_hi) { e_hi = smax }
    }
}
esc_on = (e_hi > 0)
if (esc_on) { es_lo = decfloor(e_lo, e_hi, 12); es_hi = decceil(e_hi) } else { es_lo = 1e300 }
# elements drawn (reaching the axis) and those named as below it
t_el = ""; el_low = ""
do for [k = 1:4] {
    if (word(t_max, k) + 0.0 >= es_lo) {
        t_el = t_el . sprintf(" %d", k)
    } else {
        if (word(t_max, k) + 0.0 > 0) {
            el_low = el_low . (strlen(el_low) > 0 ? ", " : "") . word(el_names, k)
        }
    }
}
nt = words(t_el)
el_low_note = (strlen(el_low) > 0 && esc_on) ? sprintf("%s below 10^{%d}", el_low, int(floor(log10(es_lo) + 0.5))) : ""

# (e) the element lost most by mass: the largest space_<element>_kg (mass gone to
# space by the end), or without those columns the largest total flux
el_sel = 0; sel_best = 0.0
do for [k = 1:4] {
    hs_sp = "space_" . word(el_keys, k) . "_kg"
    if (hs_has(hs_hdr, hs_sp)) {
        SC = hs_sp; eval SCAN
    } else {
        smax = word(t_max, k) + 0.0
    }
    if (smax > sel_best) { sel_best = smax; el_sel = k }
}
# its channels with a positive value, and the axis over them and its total
c_cols = ""; c_ch = ""; c_fac = ""; c_max = ""
ch_lo = 1e300; ch_hi = 0.0
do for [k = 1:words(e_cols)] {
    if (int(word(e_el, k)) == el_sel) {
        SC = word(e_cols, k); SF = word(e_fac, k) + 0.0; eval SCAN
        if (smax > 0) {
            c_cols = c_cols . " " . word(e_cols, k)
            c_ch = c_ch . " " . word(e_ch, k)
            c_fac = c_fac . " " . word(e_fac, k)
            c_max = c_max . sprintf(" %.6e", smax)
            if (smin < ch_lo) { ch_lo = smin }
            if (smax > ch_hi) { ch_hi = smax }
        }
    }
}
SF = 1.0
if (el_sel > 0) {
    SC = word(tot_cols, el_sel); eval SCAN
    if (smax > 0) {
        if (smin < ch_lo) { ch_lo = smin }
        if (smax > ch_hi) { ch_hi = smax }
    }
}
ch_on = (ch_hi > 0 && words(c_cols) > 0)
if (ch_on) { cs_lo = decfloor(ch_lo, ch_hi, 10); cs_hi = decceil(ch_hi) } else { cs_lo = 1e300 }
# channels drawn: those reaching the axis, in ch_keys order (which fixes their colour)
ch_draw = ""
do for [j = 1:words(ch_keys)] {
    do for [k = 1:words(c_cols)] {
        if (int(word(c_ch, k)) == j && word(c_max, k) + 0.0 >= cs_lo) { ch_draw = ch_draw . sprintf(" %d", k) }
    }
}
nc = words(ch_draw)
el_full = "Hydrogen Oxygen Carbon Nitrogen"
hs_ch_title = (el_sel > 0) ? sprintf("%s escape (kg s^{-1})", word(el_full, el_sel)) : "Escape (kg s^{-1})"

# (e) luminosity and XUV flux
SC = "luminosity_lsun"; eval SCAN
lum_on = (smax > 0)
if (lum_on) {
    lum_log = (smax / smin > 8.0)
    if (lum_log) {
        lum_lo = decfloor(smin, smax, 8); lum_hi = decceil(smax)
    } else {
        lum_lo = 0.0; lum_hi = smax * 1.12
    }
}
SC = "f_xuv_w_m2"; eval SCAN
xuv_on = (smax > 0)
if (xuv_on) { xuv_lo = decfloor(smin, smax, 10); xuv_hi = decceil(smax) }

# events: grey dotted vertical lines over every panel, numbered above the top panel
# and listed in words below the figure (events at the ends of the time axis, such as
# the start and end of the run, fall on the frame and are left out)
ev_in(t) = (t > tmin * 1.0001 && t < tmax / 1.0001)
nev_drawn = 0
ev_unnumbered = 0
hs_ev_list = ""
do for [i = 1:hs_nev] {
    if (ev_in(hs_ev_t[i])) {
        set arrow from first hs_ev_t[i], graph 0 to first hs_ev_t[i], graph 1 nohead \
            lc rgb c_event lw 1 dt 3 back
        nev_drawn = nev_drawn + 1
        if (strlen(hs_ev_x[i]) > 0) {
            hs_ev_list = hs_ev_list . sprintf("%s%d %s", strlen(hs_ev_list) > 0 ? "\t" : "", hs_ev_g[i], hs_ev_x[i])
        }
        if (hs_ev_g[i] == 0) { ev_unnumbered = ev_unnumbered + 1 }
    }
}
if (ev_unnumbered > 0) {
    hs_ev_list = hs_ev_list . sprintf("%s%d more not numbered (events.csv)", strlen(hs_ev_list) > 0 ? "\t" : "", ev_unnumbered)
}
# the list, wrapped to lines of at most ev_wrap characters
ev_wrap = 120
ev_lines = 0
ev_text = ""
if (strlen(hs_ev_list) > 0) {
    hs_ev_list = hs_ev_list . "\t"
    ev_cur = "Events:"
    hs_rest = hs_ev_list
    do for [i = 1:hs_nev] {
        hs_cut = strstrt(hs_rest, "\t")
        if (hs_cut > 0) {
            ev_item = hs_rest[1:hs_cut - 1]; hs_rest = hs_rest[hs_cut + 1:]
            if (strlen(ev_cur) + 3 + strlen(ev_item) > ev_wrap && strlen(ev_cur) > 8) {
                ev_text = ev_text . ev_cur . "\n"; ev_lines = ev_lines + 1; ev_cur = ""
            }
            ev_cur = ev_cur . (strlen(ev_cur) > 0 ? "   " : "") . ev_item
        }
    }
    ev_text = ev_text . ev_cur; ev_lines = ev_lines + 1
}

# ------------------------------------------------------------------ layout
# six panels in proportion to these weights, top to bottom; above each, its legend in
# rows of at most key_cols entries (K_rows), the top one the event numbers
P_wt = "0.85 1.1 1.0 1.0 1.2 0.85"
P_rowh = 0.0135
# (entries of panels (c) and (e) are long: at most 3 to a row; the others fit 6)
K_cols = "6 6 3 6 3 6"
K_rows = sprintf("%d 1 %d 1 %d 1", nev_drawn > 0 ? 1 : 0, \
    (1 + mtp_on + words(reg_on) + 2) / 3, (nc + 1 + 2) / 3)
P_top = 0.955 - P_rowh * word(K_rows, 1)
P_bot = 0.055 + 0.011 * ev_lines
P_gap = 0.012
P_units = 0.0; P_keys = 0.0
do for [i = 1:6] { P_units = P_units + word(P_wt, i); P_keys = P_keys + (i > 1 ? P_rowh * word(K_rows, i) : 0) }
P_unit = (P_top - P_bot - 5 * P_gap - P_keys) / P_units
# ptop(i): the top of panel i; pbot(i): its bottom
ptop(i) = (i <= 1) ? P_top : pbot(i - 1) - P_gap - P_rowh * word(K_rows, i)
pbot(i) = ptop(i) - P_unit * word(P_wt, i)
L_left = 0.105; L_right = 0.875
# the i-th number of a list, 1 past its end (gnuplot reads the options of a plot
# clause even when its iteration is empty)
nth(list, i) = (i >= 1 && i <= words(list)) ? int(word(list, i)) : 1
# dash type of the i-th channel drawn in panel (e)
ch_dt(i) = (i > 4) ? 2 : 1

# the figure file is opened only now that every check has passed
eval VL_TERM
set multiplot
set label 100 hs_title at screen 0.5, 0.982 center noenhanced font ",13"
if (ev_lines > 0) {
    set label 101 ev_text at screen L_left, 0.012 + 0.011 * (ev_lines - 1) left noenhanced font ",9" tc rgb "#333333"
}
set lmargin at screen L_left
set rmargin at screen L_right
eval VL_LOGTIME
set xrange [tmin:tmax]
set xlabel ""
set format x ""
set style fill solid 1.0 noborder
# the legend of panel hs_p: rows above its frame, right-aligned, left to right
PANEL = 'set tmargin at screen ptop(hs_p); set bmargin at screen pbot(hs_p); \
    set key at screen L_right, ptop(hs_p) + P_rowh * word(K_rows, hs_p) + 0.002 right top \
        horizontal maxcols int(word(K_cols, hs_p)) width 1 spacing 1.0 samplen 2.5; \
    set label 1 sprintf("(%c)", 96 + hs_p) at screen 0.012, ptop(hs_p) + 0.008 left font ",12"'
# a logarithmic y axis over lo..hi: a label every decade, every second or third one
# over many decades (minor tics on the decades between)
LOGY = 'hs_dec = log10(hs_hi / hs_lo); \
    if (hs_dec > 13) { set ytics 1000; set mytics 3 } else { if (hs_dec > 7) { set ytics 100; set mytics 2 } else { set ytics autofreq; set mytics 10 } }; \
    set yrange [hs_lo:hs_hi]'
EMPTY = 'set yrange [1e-3:1]; set format y ""; \
    set label 2 hs_empty at graph 0.5, 0.5 center'

# ------------------------------------------------------------ (a) surface water
hs_p = 1; eval PANEL
# the event numbers above the top frame
do for [i = 1:hs_nev] {
    if (ev_in(hs_ev_t[i]) && strlen(hs_ev_x[i]) > 0) {
        set label 200 + i sprintf("%d", hs_ev_g[i]) at first hs_ev_t[i], graph 1 \
            center offset 0, 0.7 font ",9" tc rgb "#333333"
    }
}
set logscale y
set ylabel "Surface water (TO)"
if (wat_on) {
    set format y "10^{%L}"
    hs_lo = wat_lo; hs_hi = wat_hi; eval LOGY
    plot hs_data using (tclamp(column("time_yr"))):(pos(column("surface_water_to"))) \
            with @HS_W lw 2 lc rgb c_water notitle
} else {
    hs_empty = "no surface water"; eval EMPTY
    plot NaN notitle
    unset label 2
}
do for [i = 1:hs_nev] { unset label 200 + i }
unset label 101

# ------------------------------------------------------------ (b) partial pressures
hs_p = 2; eval PANEL
set ylabel "Partial pressure (bar)"
if (np > 0) {
    set format y "10^{%L}"
    hs_lo = pr_lo; hs_hi = pr_hi; eval LOGY
    plot for [i = 1:np] hs_data \
            using (tclamp(column("time_yr"))):(pos(column(word(sp_cols, nth(sp_on, i))))) \
            with @HS_W lw 2 lc rgb word(sp_rgb, nth(sp_on, i)) \
            title word(sp_names, nth(sp_on, i)), \
         for [z = 1:(strlen(sp_low_note) > 0 ? 1 : 0)] keyentry with boxes fc rgb "#ffffff" \
            title sp_low_note
} else {
    hs_empty = "no atmosphere"; eval EMPTY
    plot NaN notitle
    unset label 2
}

# ------------------------------------------------------------ (c) temperature, regime
hs_p = 3; eval PANEL
unset logscale y
set format y "%g"
set ytics autofreq; set mytics default
set yrange [T_ax_lo:T_ax_hi]
set y2range [0:1]
set ylabel "Temperature (K)"
# Each pair of consecutive rows (t0, t1) is split at its geometric mean: the left
# half takes the regime of the earlier row, the right half the later one.
plot hs_data \
        using (t1 = tclamp(column("time_yr")), t0 = (column(0) == 0) ? t1 : tp, tp = t1, \
               r0 = (column(0) == 0) ? column("regime") : rp, rp = column("regime"), \
               sqrt(t0 * t1)):(0.5 * strip_h): \
              (t0):(sqrt(t0 * t1) * tover):(0.0):(strip_h):(regcol(r0)) \
        with boxxyerror lc rgb variable axes x1y2 notitle, \
     hs_data \
        using (t1 = tclamp(column("time_yr")), t0 = (column(0) == 0) ? t1 : tp, tp = t1, \
               sqrt(t0 * t1)):(0.5 * strip_h): \
              (sqrt(t0 * t1)):(t1 * tover):(0.0):(strip_h):(regcol(column("regime"))) \
        with boxxyerror lc rgb variable axes x1y2 notitle, \
     hs_data using (tclamp(column("time_yr"))):(column("surface_temp_k")) \
        with @HS_W lw 2 lc rgb c_temp title "surface", \
     for [z = 1:mtp_on] hs_data using (tclamp(column("time_yr"))): \
        (column("regime") == 5 ? column("mantle_temp_k") : 1/0) \
        with @HS_W lw 1.5 dt 2 lc rgb "#7A1F1F" title "mantle (molten)", \
     for [k = 1:words(reg_on)] keyentry with boxes fc rgb word(reg_rgb, nth(reg_on, k)) \
        title word(reg_names, nth(reg_on, k))

# ------------------------------------------------------------ (d) escape by element
hs_p = 4; eval PANEL
set logscale y
set ylabel "Escape (kg s^{-1})"
if (esc_on) {
    set format y "10^{%L}"
    hs_lo = es_lo; hs_hi = es_hi; eval LOGY
    plot for [i = 1:nt] hs_data \
            using (tclamp(column("time_yr"))):(pos(column(word(tot_cols, nth(t_el, i))))) \
            with @HS_W lw 2.5 lc rgb word(el_rgb, nth(t_el, i)) \
            title word(el_names, nth(t_el, i)), \
         for [z = 1:(strlen(el_low_note) > 0 ? 1 : 0)] keyentry with boxes fc rgb "#ffffff" \
            title el_low_note
} else {
    hs_empty = "no escape"; eval EMPTY
    plot NaN notitle
    unset label 2
}

# ------------------------------------------------------------ (e) channels of one element
hs_p = 5; eval PANEL
set ylabel hs_ch_title
if (ch_on) {
    set format y "10^{%L}"
    hs_lo = cs_lo; hs_hi = cs_hi; eval LOGY
    plot hs_data using (tclamp(column("time_yr"))):(pos(column(word(tot_cols, el_sel)))) \
            with @HS_W lw 5 lc rgb "#bbbbbb" title word(el_names, el_sel) . " total", \
         for [i = 1:nc] hs_data \
            using (tclamp(column("time_yr"))): \
                  (pos(column(word(c_cols, nth(ch_draw, i))) * (word(c_fac, nth(ch_draw, i)) + 0.0))) \
            with @HS_W lw 2 lc rgb word(c_chan, (i - 1) % 8 + 1) dt ch_dt(i) \
            title word(ch_lab, int(word(c_ch, nth(ch_draw, i))))
} else {
    hs_empty = "no escape channel above zero"; eval EMPTY
    plot NaN notitle
    unset label 2
}

# ------------------------------------------------------------ (f) luminosity, XUV
hs_p = 6; eval PANEL
eval VL_LOGTIME
set ylabel "Luminosity (L_{sun})"
if (lum_on) {
    set ytics autofreq; set mytics default
    if (lum_log) {
        set logscale y; set format y "10^{%L}"
    } else {
        unset logscale y; set format y "%g"
    }
    set yrange [lum_lo:lum_hi]
} else {
    hs_empty = "no luminosity"; eval EMPTY
    set label 2 at graph 0.5, 0.62
}
if (xuv_on) {
    set logscale y2
    set y2range [xuv_lo:xuv_hi]
    set y2tics nomirror
    set format y2 "10^{%L}"
    set y2label "XUV at the planet (W m^{-2})" textcolor rgb c_xuv
} else {
    set label 3 "no XUV flux" at graph 0.5, 0.38 center
}
plot for [z = 1:(lum_on ? 1 : 0)] hs_data \
        using (tclamp(column("time_yr"))):(pos(column("luminosity_lsun"))) \
        with @HS_W lw 2 lc rgb c_lum title "luminosity (left)", \
     for [z = 1:(xuv_on ? 1 : 0)] hs_data \
        using (tclamp(column("time_yr"))):(pos(column("f_xuv_w_m2"))) axes x1y2 \
        with @HS_W lw 2 lc rgb c_xuv title "XUV flux (right)", \
     NaN notitle

unset multiplot
unset output
