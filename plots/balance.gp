# balance.gp -- energy-balance figure for `volev balance` (gnuplot >= 5.4).
#
# Variables (pass with -e "name='value'; ..."):
#   datafile   balance.csv (required)
#   outfile    figure to write (required)
#   fmt        png | pdf | svg (default png)
#   title      figure title (optional)
# Example:
#   gnuplot -e "datafile='earth-balance/balance.csv'; outfile='b.png'" plots/balance.gp
#
# Top: outgoing longwave radiation and absorbed stellar flux against surface
# temperature; where absorbed falls through OLR the climate has a stable equilibrium,
# and where absorbed stays above the OLR limit a runaway begins. Bottom: planetary
# albedo and the stratospheric water mixing ratio (log axis) with the moist-greenhouse
# threshold 3e-3 (Kasting 1988).

if (!exists("datafile") || strlen(datafile) == 0) {
    print "balance.gp: set datafile='DIR/balance.csv'"
    exit status 2
}
if (!exists("outfile") || strlen(outfile) == 0) {
    print "balance.gp: set outfile='FIGURE'"
    exit status 2
}
if (!exists("fmt") || strlen(fmt) == 0) { fmt = "png" }
if (!exists("title")) { title = "energy balance: " . datafile }

if (fmt eq "png") {
    set terminal pngcairo size 900,900 enhanced font "sans,11"
} else {
    if (fmt eq "pdf") {
        set terminal pdfcairo size 7in,7in enhanced font "sans,9"
    } else {
        if (fmt eq "svg") {
            set terminal svg size 900,900 dynamic enhanced font "sans,11" background "white"
        } else {
            print sprintf("balance.gp: unknown fmt '%s' (png, pdf or svg)", fmt)
            exit status 2
        }
    }
}
set output outfile
set datafile separator comma
set datafile commentschars "#"
set datafile columnheaders

# Okabe-Ito colours, kept across figures
c_olr = "#0072B2"; c_abs = "#D55E00"; c_alb = "#009E73"; c_h2o = "#56B4E9"

stats datafile using "surface_temp_k" nooutput
tmax = STATS_max < 700 ? STATS_max : 700

set multiplot layout 2,1 title title
set xrange [150:tmax]
set grid
set key bottom right
set ylabel "Flux (W m^{-2})"
set xlabel ""
set format x ""
plot datafile using "surface_temp_k":"olr_w_m2" with lines lw 2 lc rgb c_olr title "outgoing longwave", \
     "" using "surface_temp_k":"absorbed_w_m2" with lines lw 2 lc rgb c_abs title "absorbed stellar"

set format x "%g"
set xlabel "Surface temperature (K)"
set ylabel "Albedo"
set yrange [0:1]
set y2label "Stratospheric H_2O mixing ratio"
set logscale y2
set y2range [1e-12:1]
set y2tics
set format y2 "10^{%L}"
set key top left
plot datafile using "surface_temp_k":"albedo" with lines lw 2 lc rgb c_alb title "albedo", \
     "" using "surface_temp_k":(column("strat_h2o") > 0 ? column("strat_h2o") : 1/0) axes x1y2 with lines lw 2 lc rgb c_h2o title "stratospheric H_2O", \
     3e-3 axes x1y2 with lines dt 2 lc rgb "gray40" title "moist greenhouse (3e-3)"
unset multiplot
