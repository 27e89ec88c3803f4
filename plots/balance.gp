# balance.gp -- energy-balance figure of `volev balance` (gnuplot >= 5.4).
#
#   gnuplot -c plots/balance.gp BALANCE.csv OUT.png|pdf|svg [TITLE]
#
#   BALANCE.csv  balance.csv written by `volev balance` (required)
#   OUT          the figure; its extension picks the format (required)
#   TITLE        figure title (optional; default "Energy balance at a stellar age of"
#                and the age of BALANCE.csv's `# stellar age` comment line, or of the
#                folder of BALANCE.csv without one); the instellation, S_eff, the
#                star's Teff and the runaway threshold from the comment lines of
#                BALANCE.csv, when present, go underneath in proper units
#
# Both panels share the surface-temperature axis:
# The surface-temperature axis covers the whole table (150-3000 K), logarithmic; the flux
# axis is logarithmic too when the fluxes span more than a factor 30.
#   (a) outgoing longwave radiation (OLR) and absorbed stellar flux (W m^-2). Where the
#       absorbed flux falls through the OLR from above the climate has a stable
#       equilibrium (filled circle, with a dotted line through both panels); where it
#       rises through it an unstable one (open circle). Absorbed flux above the OLR
#       everywhere means a runaway greenhouse.
#   (b) planetary albedo and the stratospheric water mixing ratio (log, right axis)
#       with the moist-greenhouse threshold 3e-3 (Kasting 1988).
# Columns are looked up by header name (surface_temp_k, olr_w_m2, absorbed_w_m2,
# albedo, strat_h2o). A missing column, an unreadable file or a file without data rows
# stops the script with status 1; a wrong command line with status 2.

vl_script = "balance.gp"
vl_dir = system(sprintf("dirname '%s'", ARG0)) . "/"
# arguments past ARGC are not defined
bl_arg(i) = (ARGC >= i) ? ARGV[i] : ""
bl_data = bl_arg(1)
vl_out = bl_arg(2)
bl_title = bl_arg(3)
vl_usage = (strlen(bl_data) == 0 || strlen(vl_out) == 0 || ARGC > 3)
if (vl_usage) { vl_out = "usage.png" }
load vl_dir . "style.gp"
if (vl_usage) {
    vl_msg = "usage: gnuplot -c balance.gp BALANCE.csv OUT.png|pdf|svg [TITLE]"
    eval VL_FAIL
}
vl_w = 9.0; vl_h = 8.0
BL_DIE = 'print sprintf("%s: %s", vl_script, vl_msg); exit status 1'

# ------------------------------------------------------------------ file checks
bl_sqesc(s) = (strstrt(s, "'") == 0) ? s : \
    s[1:strstrt(s, "'") - 1] . "'\\''" . bl_sqesc(s[strstrt(s, "'") + 1:])
bl_sh(s) = "'" . bl_sqesc(s) . "'"
bl_rpos(s, c, i) = (i < 1) ? 0 : (s[i:i] eq c ? i : bl_rpos(s, c, i - 1))
bl_has(hdr, name) = strstrt(" " . hdr . " ", " " . name . " ") > 0

if (int(system(sprintf("test -r %s && test -f %s && echo 1 || echo 0", bl_sh(bl_data), bl_sh(bl_data)))) == 0) {
    vl_msg = sprintf("cannot read '%s'", bl_data); eval BL_DIE
}
bl_hdr = system(sprintf("sed -n '/^#/!{p;q;}' %s | tr ',' ' '", bl_sh(bl_data)))
if (int(system(sprintf("grep -v '^#' %s | wc -l", bl_sh(bl_data)))) < 2) {
    vl_msg = sprintf("no data rows in '%s'", bl_data); eval BL_DIE
}
bl_required = "surface_temp_k olr_w_m2 absorbed_w_m2 albedo strat_h2o"
do for [k = 1:words(bl_required)] {
    if (!bl_has(bl_hdr, word(bl_required, k))) {
        vl_msg = sprintf("'%s' has no column '%s'", bl_data, word(bl_required, k))
        eval BL_DIE
    }
}
# "# stellar age 1e+07 yr: instellation 19930.5 W/m^2 (s_eff 14.644), Teff 3250 K" and
# "# runaway threshold s_eff 0.901828; ...": their numbers, "" when the lines are absent
bl_nums = system(sprintf("sed -n 's/^# *stellar age \\([^ ]*\\) yr: instellation \\([^ ]*\\) W\\/m^2 (s_eff \\([^)]*\\)), Teff \\([^ ]*\\) K.*$/\\1 \\2 \\3 \\4/p' %s | head -n 1", bl_sh(bl_data)))
bl_run = system(sprintf("sed -n 's/^# *runaway threshold s_eff \\([^ ;]*\\).*$/\\1/p' %s | head -n 1", bl_sh(bl_data)))
# an age in words: "1 Gyr", "350 Myr", "20 kyr"
bl_age(y) = (y >= 1e9) ? sprintf("%.3g Gyr", y / 1e9) : (y >= 1e6) ? sprintf("%.3g Myr", y / 1e6) : \
            (y >= 1e3) ? sprintf("%.3g kyr", y / 1e3) : sprintf("%.3g yr", y)
bl_sub = ""
if (words(bl_nums) == 4) {
    bl_sub = sprintf("instellation %.4g W m^{-2} (S_{eff} %.3g%s), stellar T_{eff} %.0f K", \
        vl_num(word(bl_nums, 2)), vl_num(word(bl_nums, 3)), \
        strlen(bl_run) > 0 ? sprintf("; runaway greenhouse above %.3g", vl_num(bl_run)) : "", \
        vl_num(word(bl_nums, 4)))
}
if (strlen(bl_title) == 0) {
    bl_slash = bl_rpos(bl_data, "/", strlen(bl_data))
    bl_title = (words(bl_nums) == 4) ? "Energy balance at a stellar age of " . bl_age(vl_num(word(bl_nums, 1))) : \
        "Energy balance, " . ((bl_slash == 0) ? "." : (bl_slash == 1) ? "/" : bl_data[1:bl_slash - 1])
}

eval VL_BASE

# ------------------------------------------------------------------ data scan
stats bl_data using (column("surface_temp_k")) nooutput
T_min = STATS_min; T_max = STATS_max
stats bl_data using (column("olr_w_m2")):(column("absorbed_w_m2")) nooutput
F_max = (STATS_max_x > STATS_max_y) ? STATS_max_x : STATS_max_y
F_min = (STATS_min_x < STATS_min_y) ? STATS_min_x : STATS_min_y
# fluxes over more than a factor 30 (the OLR of a hot surface): log axis
F_log = (F_min > 0 && F_max > 30.0 * F_min)
stats bl_data using (column("absorbed_w_m2") - column("olr_w_m2")) nooutput
net_min = STATS_min; net_max = STATS_max

# Equilibria: sign changes of absorbed - OLR between consecutive rows, placed by
# linear interpolation. Rows of $bl_eq: temperature, OLR there, 1 stable / 0 unstable.
EQ = 'T1 = column("surface_temp_k"), o1 = column("olr_w_m2"), \
    n1 = column("absorbed_w_m2") - o1, \
    eq_ok = (column(0) > 0 && T1 > T0 && ((n0 > 0 && n1 <= 0) || (n0 < 0 && n1 >= 0))), \
    Tx = eq_ok ? T0 + (T1 - T0) * n0 / (n0 - n1) : 0, \
    ox = eq_ok ? o0 + (o1 - o0) * (Tx - T0) / (T1 - T0) : 0, \
    st = (n0 > 0) ? 1 : 0, T0 = T1, o0 = o1, n0 = n1'
T0 = 0; o0 = 0; n0 = 0
set print $bl_eq
print "# equilibria: T (K), OLR (W m^-2), 1 stable / 0 unstable"
unset print
set table $bl_eq append
plot bl_data using (@EQ, Tx):(ox):(st) with table if (eq_ok)
unset table
n_eq = |$bl_eq| - 1
eq_T(i) = word($bl_eq[i + 1], 1) + 0.0
eq_F(i) = word($bl_eq[i + 1], 2) + 0.0
eq_stable(i) = int(word($bl_eq[i + 1], 3)) == 1
# temperature axis: the whole tabulated range (150-3000 K from `volev balance`), log
T_hi = T_max
if (T_hi <= T_min) { T_hi = T_min + 1.0 }
# equilibria in range: a point on the OLR curve; stable ones also a dotted line
# through both panels
n_stable = 0; n_unstable = 0
do for [i = 1:n_eq] {
    if (eq_T(i) <= T_hi) {
        if (eq_stable(i)) {
            n_stable = n_stable + 1
            set arrow from first eq_T(i), graph 0 to first eq_T(i), graph 1 nohead \
                lc rgb "#888888" lw 1 dt 3 back
        } else {
            n_unstable = n_unstable + 1
        }
    }
}
# legend note when there is no stable equilibrium
bl_note = (n_stable > 0) ? "" : (net_min > 0) ? "no equilibrium: runaway" : \
          (net_max < 0) ? sprintf("no equilibrium above %g K", T_min) : "no stable equilibrium"

# stratospheric water: log axis reaching the threshold
c_olr = "#000000"; c_abs = c_xuv; c_alb = "#000000"; c_strat = c_h2o
mg_limit = 3e-3
stats bl_data using (column("strat_h2o")) nooutput
sw_max = STATS_max
if (sw_max > 0) {
    stats bl_data using (v = column("strat_h2o"), v > 0 ? v : 1/0) nooutput
    sw_min = STATS_min
    sw_top = (sw_max > mg_limit) ? sw_max : mg_limit
    sw_lo = decfloor(sw_min, sw_top, 12); sw_hi = decceil(sw_top)
    # a mixing ratio ends at 1
    if (sw_hi > 1.0 && sw_top <= 1.0) { sw_hi = 1.0 }
} else {
    sw_lo = 1e-12; sw_hi = 1.0
}

# ------------------------------------------------------------------ layout
L_left = 0.11; L_right = 0.87
P_top = (strlen(bl_sub) > 0) ? 0.905 : 0.935
P_bot = 0.08; P_gap = 0.025
P_h = (P_top - P_bot - P_gap) / 2.0
ptop(i) = P_top - (i - 1) * (P_h + P_gap)
pbot(i) = ptop(i) - P_h
pos(v) = (v > 0) ? v : 1/0

# the figure file is opened only now that every check has passed
eval VL_TERM
set multiplot
set label 100 bl_title at screen 0.5, 0.975 center noenhanced font ",13"
if (strlen(bl_sub) > 0) { set label 101 bl_sub at screen 0.5, 0.945 center enhanced }
set lmargin at screen L_left
set rmargin at screen L_right
set xrange [T_min:T_hi]
if (T_hi > 3.0 * T_min) {
    set logscale x
    set xtics (150, 200, 300, 400, 500, 700, 1000, 1500, 2000, 3000)
    set mxtics default
} else {
    set mxtics 5
}
PANEL = 'set tmargin at screen ptop(bl_p); set bmargin at screen pbot(bl_p); \
    set key opaque box lc rgb "#ffffff" at graph 0.02, 0.97 left top; \
    set label 1 sprintf("(%c)", 96 + bl_p) at screen 0.012, ptop(bl_p) + 0.012 left font ",12"'

# ------------------------------------------------------------ (a) fluxes
bl_p = 1; eval PANEL
set format x ""
set xlabel ""
set ylabel "Flux (W m^{-2})"
if (F_log) {
    set logscale y
    set yrange [decfloor(F_min, F_max, 6):F_max * 1.5]
    set format y "10^{%L}"
} else {
    set yrange [0:(F_max > 0 ? F_max * 1.08 : 1.0)]
    set format y "%g"
}
do for [i = 1:n_eq] {
    if (eq_T(i) <= T_hi) {
        set label 200 + i "" at first eq_T(i), first eq_F(i) front \
            point pt (eq_stable(i) ? 7 : 6) ps 1.4 lw 1.5 lc rgb c_olr
    }
}
plot bl_data using (column("surface_temp_k")):(column("olr_w_m2")) \
        with lines lw 2 lc rgb c_olr title "outgoing longwave (OLR)", \
     bl_data using (column("surface_temp_k")):(column("absorbed_w_m2")) \
        with lines lw 2 lc rgb c_abs title "absorbed stellar", \
     for [z = 1:(n_stable > 0 ? 1 : 0)] keyentry with points pt 7 ps 1.4 lc rgb c_olr \
        title "stable equilibrium", \
     for [z = 1:(n_unstable > 0 ? 1 : 0)] keyentry with points pt 6 ps 1.4 lw 1.5 lc rgb c_olr \
        title "unstable equilibrium", \
     for [z = 1:(strlen(bl_note) > 0 ? 1 : 0)] keyentry with boxes fc rgb "#ffffff" title bl_note

# ------------------------------------------------------------ (b) albedo, stratosphere
bl_p = 2; eval PANEL
do for [i = 1:n_eq] { unset label 200 + i }
# the key where the curves leave room: right of the middle (low albedo, moist top)
set key at graph 0.98, 0.62 right top
set format x "%g"
set xlabel "Surface temperature (K)"
set ylabel "Planetary albedo"
unset logscale y
set yrange [0:1]
set format y "%g"
set ytics 0.2 nomirror
set logscale y2
set y2range [sw_lo:sw_hi]
set y2tics nomirror
set format y2 "10^{%L}"
set y2label "Stratospheric H_2O mixing ratio" textcolor rgb c_strat
plot bl_data using (column("surface_temp_k")):(column("albedo")) \
        with lines lw 2 lc rgb c_alb title "albedo (left)", \
     bl_data using (column("surface_temp_k")):(pos(column("strat_h2o"))) axes x1y2 \
        with lines lw 2 lc rgb c_strat title "strat. H_2O (right)", \
     mg_limit axes x1y2 with lines lw 1.5 dt 2 lc rgb "#888888" \
        title "moist-greenhouse limit"

unset multiplot
unset output
