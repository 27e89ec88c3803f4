/* run_report.c: the end-of-run report `volev run` prints (docs/volev.1, "run"): the final
 * state a researcher looks for first -- regime, surface temperature and pressure, water
 * kept and lost, O2 -- then the time in each regime, the first events and the cost. A
 * quantity below the mass the integrator resolves (its reservoir's depletion floor) is
 * "none", not a number like 1.9e-194 bar that is only round-off. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "run_report.h"
#include "volev/climate.h"
#include "volev/reservoir.h"
#include "volev/units.h"

/* v to three significant digits, without an exponent between 1e-3 and 1e5 (2880, not
 * 2.88e+03). */
static void number_text(double v, char *buf, size_t n)
{
    double a = fabs(v);
    if (a == 0.0 || a >= 1e5 || a < 1e-3) {
        snprintf(buf, n, "%.3g", v);
        return;
    }
    int decimals = 2 - (int)floor(log10(a));
    snprintf(buf, n, "%.*f", decimals > 0 ? decimals : 0, v);
}

/* An age in yr as "12.3 Myr" / "4.57 Gyr" / "850 yr". */
static void age_text(double yr, char *buf, size_t n)
{
    if (yr >= 1e9)
        snprintf(buf, n, "%.3g Gyr", yr / 1e9);
    else if (yr >= 1e6)
        snprintf(buf, n, "%.3g Myr", yr / 1e6);
    else if (yr >= 1e3)
        snprintf(buf, n, "%.3g kyr", yr / 1e3);
    else
        snprintf(buf, n, "%.3g yr", yr);
}

/* "none" when reservoir r ended below its depletion floor, else the value with unit. */
static void amount_text(const vl_run_stats *s, int r, double v, const char *unit, char *buf,
                        size_t n)
{
    char num[32];
    number_text(v, num, sizeof num);
    if (!(s->y_final[r] >= vl_reservoir_floor(r)))
        snprintf(buf, n, "none");
    else
        snprintf(buf, n, "%s %s", num, unit);
}

/* "temperate 7.9 Gyr, runaway 12 Myr" over the regimes the run spent time in. */
static void regimes_text(const vl_run_stats *s, char *buf, size_t n)
{
    size_t used = 0;
    buf[0] = '\0';
    for (int r = 0; r < VL_NREGIMES && used < n; r++) {
        if (!(s->time_in_regime_s[r] > 0.0))
            continue;
        char age[32];
        age_text(s->time_in_regime_s[r] / VL_YR, age, sizeof age);
        int k = snprintf(buf + used, n - used, "%s%s %s", used ? ", " : "", vl_regime_name(r), age);
        used += k > 0 ? (size_t)k : 0;
    }
}

/* "solidified 669 Myr, runaway_onset 669 Myr" over the events but start and end. */
static void events_text(const vl_event_firsts *ev, char *buf, size_t n)
{
    size_t used = 0;
    snprintf(buf, n, "none");
    for (int i = 0; i < ev->n && used < n; i++) {
        if (strcmp(ev->name[i], "start") == 0 || strcmp(ev->name[i], "end") == 0)
            continue;
        char age[32];
        age_text(ev->t_s[i] / VL_YR, age, sizeof age);
        int k = snprintf(buf + used, n - used, "%s%s at %s", used ? ", " : "", ev->name[i], age);
        used += k > 0 ? (size_t)k : 0;
    }
}

void vl_run_report(FILE *out, const vl_model *m, const vl_run_stats *s,
                   const vl_event_firsts *ev, const char *dir)
{
    vl_summary d;
    vl_summary_derive(m, s, &d);
    char age[32], water[48], o2[48], co2[48], line[1024];
    age_text(m->sc->run.end_s / VL_YR, age, sizeof age);
    char p[32], w0[32], lost[32];
    number_text(d.surface_pressure_bar, p, sizeof p);
    fprintf(out, "end at %s: %s, surface %.0f K and %s bar\n", age, vl_regime_name(d.regime),
            d.surface_temp_k, p);
    amount_text(s, VL_R_WATER, d.surface_water_to, "TO", water, sizeof water);
    number_text(m->sc->inventory.surface_water_kg / VL_TO_KG, w0, sizeof w0);
    number_text(d.water_lost_to, lost, sizeof lost);
    fprintf(out, "water: %s at the surface (%s TO at the start), %s TO lost to space\n", water,
            w0, lost);
    amount_text(s, VL_R_O2, d.o2_bar, "bar", o2, sizeof o2);
    amount_text(s, VL_R_CO2, d.co2_bar, "bar", co2, sizeof co2);
    fprintf(out, "air: O2 %s, CO2 %s\n", o2, co2);
    regimes_text(s, line, sizeof line);
    fprintf(out, "time in regimes: %s\n", line);
    events_text(ev, line, sizeof line);
    fprintf(out, "events: %s\n", line);
    fprintf(out, "cost: %ld steps, %ld right-hand sides, %ld Jacobians, %ld stepper restarts, "
                 "%.3g s\n",
            s->steps, s->rhs_calls, s->jacobians, s->restarts, s->wall_s);
    fprintf(out, "output: %s\n", dir);
}
