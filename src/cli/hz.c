/* hz.c: `volev hz SCENARIO [--age-yr AGE] [-o DIR] [--set KEY=VALUE]...`: the edges of
 * the habitable zone of the scenario's star at one age (docs/model.md section 3.6), as
 * effective flux S_eff (units of 1361 W/m^2) and as the circular orbit's semi-major axis:
 * the fits of Kopparapu et al. 2013 (ApJ 765:131, erratum ApJ 770:82) for the star's
 * Teff, the 2014 runaway fit for the planet's mass (ApJL 787:L29), and, with the column
 * climate, the column's own runaway and moist-greenhouse thresholds for the scenario's
 * atmosphere and its maximum-greenhouse outer edge (the least S_eff at which some CO2
 * pressure keeps a 273.15 K surface in balance). Printed, and with -o written to
 * DIR/hz.csv. */
#include <errno.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>

#include "args.h"
#include "cli.h"
#include "csv_file.h"
#include "volev/climate.h"
#include "volev/model.h"
#include "volev/output.h"
#include "volev/units.h"

enum { MAX_EDGES = 12 };

typedef struct edge {
    const char *name;   /* the row's name in hz.csv */
    double s_eff;
    const char *method; /* where it comes from */
    double co2_bar;     /* the maximum greenhouse's CO2 pressure (0: not that edge) */
} edge;

typedef struct edges {
    edge e[MAX_EDGES];
    int n;
    double l_lsun, teff_k, s_planet, t_yr;
} edges;

static void add(edges *E, const char *name, double s, const char *method)
{
    if (E->n < MAX_EDGES && isfinite(s) && s > 0.0)
        E->e[E->n++] = (edge){name, s, method, 0.0};
}

/* Semi-major axis (au) of a circular orbit receiving s_eff from a star of l_lsun. */
static double distance_au(double l_lsun, double s_eff)
{
    return sqrt(l_lsun * VL_L_SUN / (4.0 * VL_PI * s_eff * VL_S_EARTH)) / VL_AU;
}

/* The fits: Kopparapu et al. 2013 for the star's Teff, 2014 for the planet's mass. */
static void fit_edges(const vl_model *m, edges *E)
{
    double t = E->teff_k;
    const char *k13 = "Kopparapu et al. 2013 fit (Teff)";
    add(E, "recent_venus", vl_hz_seff_2013(VL_HZ_RECENT_VENUS, t), k13);
    add(E, "runaway_greenhouse", vl_hz_seff_2013(VL_HZ_RUNAWAY, t), k13);
    add(E, "runaway_greenhouse_planet_mass",
        vl_hz_seff_runaway_2014(m->sc->planet.mass_kg / VL_M_EARTH, t),
        "Kopparapu et al. 2014 fit (Teff, planet mass)");
    add(E, "moist_greenhouse", vl_hz_seff_2013(VL_HZ_MOIST, t), k13);
    add(E, "maximum_greenhouse", vl_hz_seff_2013(VL_HZ_MAX_GREENHOUSE, t), k13);
    add(E, "early_mars", vl_hz_seff_2013(VL_HZ_EARLY_MARS, t), k13);
}

/* S_eff at which the atmosphere of y (with its CO2 in the air set to p_bar) balances a
 * 273.15 K surface over an ocean: absorbed flux scales with S at a fixed surface
 * temperature, so S_eff x OLR / absorbed. NAN when the column gives no curve. */
static double s_at_freezing(const vl_model *m, vl_work *w, double t_s, double *y, double p_bar,
                            vl_curve *cv)
{
    y[VL_R_CO2] = p_bar * VL_BAR / m->planet.pa_per_kg;
    vl_env env;
    vl_model_env(m, w, t_s, y, VL_REGIME_TEMPERATE, &env);
    const double t_freeze = 273.15;
    if (vl_climate_curve(m->climate, vl_work_climate(w), &env, 1, &t_freeze, 1, cv) != 1 ||
        !(cv->absorbed[0] > 0.0))
        return NAN;
    return env.s_eff * cv->olr[0] / cv->absorbed[0];
}

/* The column's outer edge: the least S_eff over CO2 pressures 0.1-50 bar (Kopparapu et
 * al. 2013 find the optimum near 8 bar for the Sun), by golden-section search on log p
 * to 0.01 dex (S_eff(p) has one minimum: more CO2 warms until its Rayleigh scattering
 * and condensation win). */
static double column_outer(const vl_model *m, vl_work *w, double t_s, double *y, vl_curve *cv,
                           double *p_best)
{
    const double phi = 0.5 * (sqrt(5.0) - 1.0);
    double a = -1.0, b = log10(50.0);
    double c = b - phi * (b - a), d = a + phi * (b - a);
    double fc = s_at_freezing(m, w, t_s, y, pow(10.0, c), cv);
    double fd = s_at_freezing(m, w, t_s, y, pow(10.0, d), cv);
    while (b - a > 0.01 && isfinite(fc) && isfinite(fd)) {
        if (fc < fd) {
            b = d, d = c, fd = fc;
            c = b - phi * (b - a);
            fc = s_at_freezing(m, w, t_s, y, pow(10.0, c), cv);
        } else {
            a = c, c = d, fc = fd;
            d = a + phi * (b - a);
            fd = s_at_freezing(m, w, t_s, y, pow(10.0, d), cv);
        }
    }
    *p_best = pow(10.0, 0.5 * (a + b));
    return fmin(fc, fd);
}

/* The column climate's edges at t_s; nothing with the fits' climate. */
static int column_edges(const vl_model *m, double t_s, edges *E, vl_status *st)
{
    vl_curve *cv = malloc(sizeof *cv);
    vl_work *w = cv ? vl_work_new(m, st) : NULL;
    if (!cv)
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    if (!w) {
        free(cv);
        return st->code;
    }
    double y[VL_NSTATE];
    vl_model_initial_state(m, y);
    vl_env env;
    vl_model_env(m, w, t_s, y, VL_REGIME_TEMPERATE, &env);
    if (vl_climate_curve(m->climate, vl_work_climate(w), &env, 1, NULL, 0, cv) > 0) {
        const char *own = "column climate, the scenario's starting atmosphere over an ocean";
        add(E, "column_runaway_greenhouse", cv->s_runaway, own);
        add(E, "column_moist_greenhouse", cv->s_moist, own);
        double p;
        double s = column_outer(m, w, t_s, y, cv, &p);
        add(E, "column_maximum_greenhouse", s,
            "column climate: least S_eff keeping 273.15 K over CO2 0.1-50 bar");
        if (E->n > 0 && strcmp(E->e[E->n - 1].name, "column_maximum_greenhouse") == 0)
            E->e[E->n - 1].co2_bar = p;
    }
    vl_work_free(w);
    free(cv);
    return VL_OK;
}

static void print_edges(FILE *f, const vl_scenario *sc, const edges *E)
{
    fprintf(f, "habitable zone at %.4g yr: star %.4g L_sun, Teff %.0f K; planet %.3g M_earth, "
               "now at S_eff %.4g (%.4g au)\n",
            E->t_yr, E->l_lsun, E->teff_k, sc->planet.mass_kg / VL_M_EARTH, E->s_planet,
            sc->planet.orbit_m / VL_AU);
    fprintf(f, "%-32s %8s %10s  %s\n", "edge", "S_eff", "au", "from");
    for (int i = 0; i < E->n; i++) {
        fprintf(f, "%-32s %8.4f %10.4g  %s", E->e[i].name, E->e[i].s_eff,
                distance_au(E->l_lsun, E->e[i].s_eff), E->e[i].method);
        if (E->e[i].co2_bar > 0.0)
            fprintf(f, " (optimum %.2g bar)", E->e[i].co2_bar);
        fputc('\n', f);
    }
}

/* DIR/hz.csv through a temporary renamed into place. */
static int write_csv(const char *dir, const vl_model *m, const edges *E, vl_status *st)
{
    char path[VL_PATH_MAX + 16], tmp[VL_PATH_MAX + 32];
    if (mkdir(dir, 0777) != 0 && errno != EEXIST)
        return vl_fail(st, VL_ERR_IO, dir, 0, "cannot create output folder: %s", strerror(errno));
    snprintf(path, sizeof path, "%s/hz.csv", dir);
    FILE *f = vl_cli_csv_begin(path, m->sc, tmp, sizeof tmp, st);
    if (!f)
        return st->code;
    fprintf(f, "# stellar age %.10g yr: luminosity %.10g L_sun, Teff %.10g K\n", E->t_yr,
            E->l_lsun, E->teff_k);
    fprintf(f, "edge,s_eff,distance_au,co2_bar,method\n");
    for (int i = 0; i < E->n; i++) {
        fprintf(f, "%s", E->e[i].name);
        vl_output_put(f, ",", "%.10g", E->e[i].s_eff);
        vl_output_put(f, ",", "%.10g", distance_au(E->l_lsun, E->e[i].s_eff));
        if (E->e[i].co2_bar > 0.0)
            vl_output_put(f, ",", "%.4g", E->e[i].co2_bar);
        else
            fputc(',', f);
        fprintf(f, ",\"%s\"\n", E->e[i].method);
    }
    return vl_cli_csv_commit(f, tmp, path, st);
}

int vl_cli_hz(int argc, char **argv)
{
    double age_yr = 0.0;
    int given;
    if (vl_cli_take_age(&argc, argv, &age_yr, &given))
        return VL_ERR_USAGE;
    vl_cli_args a;
    vl_status st;
    vl_scenario *sc;
    vl_model *m;
    vl_cli_cache_start();
    if (vl_cli_start(argc, argv, 1, &a, &sc, &m, &st)) {
        vl_cli_args_free(&a);
        return VL_ERR_USAGE;
    }
    if (m) {
        double t = given ? age_yr * VL_YR : sc->run.end_s;
        if (t < sc->run.start_s || t > sc->run.end_s)
            vl_fail(&st, VL_ERR_USAGE, NULL, 0,
                    "hz: --age-yr %.6g is outside the run's ages [%.6g, %.6g] yr", age_yr,
                    sc->run.start_s / VL_YR, sc->run.end_s / VL_YR);
        edges E = {.n = 0, .t_yr = t / VL_YR};
        vl_star_state ss;
        vl_star_eval(m->star, t, &ss);
        E.l_lsun = ss.l_bol_w / VL_L_SUN;
        E.teff_k = ss.teff_k;
        E.s_planet = vl_star_orbit_flux(ss.l_bol_w, sc->planet.orbit_m, sc->planet.eccentricity) /
                     VL_S_EARTH;
        if (st.code == VL_OK) {
            fit_edges(m, &E);
            column_edges(m, t, &E, &st);
        }
        if (st.code == VL_OK) {
            print_edges(stdout, sc, &E);
            if (a.out && write_csv(a.out, m, &E, &st) == VL_OK)
                printf("output: %s\n", a.out);
        }
    }
    vl_cli_cache_finish();
    return vl_cli_finish(&a, sc, m, &st);
}
