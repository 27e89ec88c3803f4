# divergence.gp -- Venus, Earth and Mars histories on shared axes (gnuplot >= 5.4).
#
# Variables (pass with -e "name='value'; ..."):
#   venus, earth, mars   series.csv of each run (required)
#   outfile              figure to write (required)
#   fmt                  png | pdf | svg (default png)
# Example (what `make validation` does):
#   gnuplot -e "venus='v/series.csv'; earth='e/series.csv'; mars='m/series.csv'; outfile='d.png'" plots/divergence.gp
#
# Panels on a shared logarithmic axis of stellar age: surface water (TO), CO2 and O2
# partial pressures (bar), surface temperature (K). One colour per planet, kept across
# panels (Okabe-Ito: Venus orange, Earth blue, Mars vermillion).

do for [v in "venus earth mars outfile"] {
    if (!exists(v)) {
        print sprintf("divergence.gp: set %s", v)
        exit status 2
    }
}
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
            print sprintf("divergence.gp: unknown fmt '%s' (png, pdf or svg)", fmt)
            exit status 2
        }
    }
}
set output outfile
set datafile separator comma
set datafile commentschars "#"
set datafile columnheaders

c_v = "#E69F00"; c_e = "#0072B2"; c_m = "#D55E00"
pos(x) = x > 0 ? x : 1/0

set multiplot layout 4,1 title "Venus, Earth and Mars from one starting inventory"
set logscale x
set format x ""
set grid
set key top right
set lmargin 12

set ylabel "Surface water (TO)"
set logscale y
set format y "10^{%L}"
set yrange [1e-6:10]
plot venus using "time_yr":(pos(column("surface_water_to"))) with lines lw 2 lc rgb c_v title "Venus", \
     earth using "time_yr":(pos(column("surface_water_to"))) with lines lw 2 lc rgb c_e title "Earth", \
     mars using "time_yr":(pos(column("surface_water_to"))) with lines lw 2 lc rgb c_m title "Mars"

set yrange [*:*]
set ylabel "CO_2 (bar)"
plot venus using "time_yr":(pos(column("p_co2_bar"))) with lines lw 2 lc rgb c_v notitle, \
     earth using "time_yr":(pos(column("p_co2_bar"))) with lines lw 2 lc rgb c_e notitle, \
     mars using "time_yr":(pos(column("p_co2_bar"))) with lines lw 2 lc rgb c_m notitle

set ylabel "O_2 (bar)"
set yrange [1e-12:*]
plot venus using "time_yr":(pos(column("p_o2_bar"))) with lines lw 2 lc rgb c_v notitle, \
     earth using "time_yr":(pos(column("p_o2_bar"))) with lines lw 2 lc rgb c_e notitle, \
     mars using "time_yr":(pos(column("p_o2_bar"))) with lines lw 2 lc rgb c_m notitle
set yrange [*:*]

unset logscale y
set format y "%g"
set format x "10^{%L}"
set xlabel "Stellar age (yr)"
set ylabel "Surface temperature (K)"
plot venus using "time_yr":"surface_temp_k" with lines lw 2 lc rgb c_v notitle, \
     earth using "time_yr":"surface_temp_k" with lines lw 2 lc rgb c_e notitle, \
     mars using "time_yr":"surface_temp_k" with lines lw 2 lc rgb c_m notitle
unset multiplot
