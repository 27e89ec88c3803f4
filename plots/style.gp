# style.gp -- the house style of every volev figure (gnuplot >= 5.4), loaded by each
# figure script with
#     load vl_dir . "style.gp"
# after it has set vl_dir (the folder of the script, from ARG0) and vl_out (the figure
# path). It provides:
#
#   vl_fmt            png | pdf | svg, from the extension of vl_out
#   VL_TERM           eval VL_TERM after setting vl_w, vl_h (inches): the terminal
#                     (pngcairo at 100 px per inch for screens; pdfcairo and svg, both
#                     vector, for papers), white background, one font family
#   VL_BASE           eval VL_BASE: separators, comment lines, column headers, grid,
#                     border and key defaults shared by all figures
#   VL_LOGTIME        eval VL_LOGTIME: logarithmic stellar-age axis with 10^n labels
#   vl_fail(msg)      print "SCRIPT: msg" and stop with status 2 (usage) -- a macro:
#                     vl_msg = "..."; eval VL_FAIL
#   colours           one colour per species, element, run, regime and outcome class,
#                     kept across every figure (Okabe & Ito 2008 colour-blind-safe
#                     palette; common practice in the figures of journals)
#
# Colours (Okabe-Ito): black #000000, orange #E69F00, sky blue #56B4E9, bluish green
# #009E73, yellow #F0E442, blue #0072B2, vermillion #D55E00, reddish purple #CC79A7.

if (!exists("vl_out") || strlen(vl_out) == 0) {
    print "style.gp: the figure script must set vl_out"
    exit status 2
}
vl_ext(f) = (strstrt(f, ".") > 0) ? f[strlen(f) - 2:strlen(f)] : ""
vl_fmt = vl_ext(vl_out)
if (vl_fmt ne "png" && vl_fmt ne "pdf" && vl_fmt ne "svg") {
    print sprintf("%s: the output '%s' must end in .png, .pdf or .svg", vl_script, vl_out)
    exit status 2
}
VL_FAIL = 'print sprintf("%s: %s", vl_script, vl_msg); exit status 2'

# terminal: vl_w x vl_h inches
if (!exists("vl_w")) { vl_w = 8.0 }
if (!exists("vl_h")) { vl_h = 6.0 }
VL_TERM = 'if (vl_fmt eq "png") { \
    eval sprintf("set terminal pngcairo size %d,%d enhanced font \"sans,11\" linewidth 1 background \"white\"", int(vl_w * 100), int(vl_h * 100)) \
} else { if (vl_fmt eq "pdf") { \
    eval sprintf("set terminal pdfcairo size %gin,%gin enhanced font \"sans,9\" linewidth 1", vl_w, vl_h) \
} else { \
    eval sprintf("set terminal svg size %d,%d dynamic enhanced font \"sans,11\" linewidth 1 background \"white\"", int(vl_w * 100), int(vl_h * 100)) \
} }; set output vl_out'

VL_BASE = 'set datafile separator comma; set datafile commentschars "#"; \
    set datafile columnheaders; set datafile missing ""; \
    set grid xtics ytics lc rgb "#dddddd" lw 1 dt 1; set border lw 1; \
    set key spacing 1.2 samplen 2 Left reverse noautotitle; set tics nomirror'

VL_LOGTIME = 'set logscale x; set format x "10^{%L}"; set mxtics 10; \
    set xlabel "Stellar age (yr)"'

# one colour per species (partial pressures) and per element (escape). H2O (blue) and
# O2 (black) differ in lightness as well as hue, so the two main products of a runaway
# stay apart in grey print and for every colour-vision deficiency.
c_h2o = "#0072B2"; c_co2 = "#D55E00"; c_n2 = "#009E73"; c_o2 = "#000000"; c_h2 = "#CC79A7"
c_el_h = c_h2; c_el_o = c_o2; c_el_c = c_co2; c_el_n = c_n2
# escape channels (plots/history.gp, panel of one element's channels): the Okabe-Ito
# colours in turn, black last (the element total is drawn in grey)
c_chan = "#0072B2 #D55E00 #009E73 #CC79A7 #E69F00 #56B4E9 #F0E442 #000000"
c_event = "#666666"
c_water = c_h2o
c_temp = "#000000"
c_xuv = "#E69F00"; c_lum = "#000000"
# runs of a comparison: at most vl_max_runs (plots/comparison.gp, `volev compare`).
# Run i draws in colour run_colour(i) with dash pattern run_dash(i): the eight
# Okabe-Ito colours in turn (yellow, the faintest on white, last), then again from the
# first; the dash patterns are twelve different ones (dash types 101-112, defined here
# so that the numbered types 1-5 other figures use keep their meaning), so no two runs
# share both colour and dash, and runs stay apart in grey print and for colour-blind
# readers.
vl_max_runs = 12
c_runs = "#0072B2 #D55E00 #009E73 #CC79A7 #E69F00 #56B4E9 #000000 #F0E442"
run_colour(i) = word(c_runs, (i - 1) % 8 + 1)
run_dash(i) = 100 + i
set dashtype 101 solid
set dashtype 102 (10, 5)
set dashtype 103 (2, 4)
set dashtype 104 (10, 4, 2, 4)
set dashtype 105 (18, 6)
set dashtype 106 (10, 4, 2, 4, 2, 4)
set dashtype 107 (5, 5)
set dashtype 108 (18, 5, 5, 5)
set dashtype 109 (2, 8)
set dashtype 110 (18, 4, 2, 4, 2, 4)
set dashtype 111 (14, 3, 3, 3, 3, 3)
set dashtype 112 (6, 3, 6, 9)
# regimes (enum vl_regime: 0 dry, 1 frozen, 2 temperate, 3 moist greenhouse, 4 runaway,
# 5 magma ocean). Hue follows the state of the water (ice blue, liquid green, steam
# yellow to vermillion, melt dark red) and the lightness (CIE L*) differs between
# neighbours in that order, so the strip reads in grey print and for colour-blind
# readers: dry pale sand (L* 83: no water; no curve uses it), frozen sky blue (70),
# temperate bluish green (57), moist greenhouse yellow (88), runaway vermillion (55),
# magma ocean dark red (23).
reg_names = 'dry frozen temperate "moist greenhouse" runaway "magma ocean"'
reg_rgb   = "#DDCCA1 #56B4E9 #009E73 #F0E442 #D55E00 #7A1F1F"
regcol(x) = (x == 0) ? 0xDDCCA1 : (x == 1) ? 0x56B4E9 : (x == 2) ? 0x009E73 : \
            (x == 3) ? 0xF0E442 : (x == 4) ? 0xD55E00 : (x == 5) ? 0x7A1F1F : 0x999999
# outcome classes of a sweep, in docs/ensembles.md order; colours follow the regime
# each class ends in (o2_rich: reddish purple, failed: grey, hatched in the maps)
cls_names = "failed steam o2_rich desiccated frozen ocean_kept molten"
# and as the figures name them (plain text: no markup)
cls_text  = 'failed steam O2-rich desiccated frozen "ocean kept" molten'
cls_rgb   = "#999999 #D55E00 #CC79A7 #DDCCA1 #56B4E9 #009E73 #7A1F1F"
clscol(i) = (i == 1) ? 0x999999 : (i == 2) ? 0xD55E00 : (i == 3) ? 0xCC79A7 : \
            (i == 4) ? 0xDDCCA1 : (i == 5) ? 0x56B4E9 : (i == 7) ? 0x7A1F1F : 0x009E73

# the number a string holds: gnuplot 5.4's real() refuses a mantissa without a point
# before its exponent ("1e+09"), so one is put in ("1.0e+09")
vl_epos(s) = (strstrt(s, "e") > 0) ? strstrt(s, "e") : strstrt(s, "E")
vl_num(s) = (vl_epos(s) > 1 && strstrt(s, ".") == 0) ? \
    real(s[1:vl_epos(s) - 1] . ".0" . s[vl_epos(s):]) : real(s)

# decade bounds for a log axis showing at most `dec` decades below the maximum
decfloor(mn, mx, dec) = 10.0**floor(log10(mn > mx * 10.0**(-dec) ? mn : mx * 10.0**(-dec)) - 0.02)
decceil(mx) = 10.0**ceil(log10(mx) + 0.02)
