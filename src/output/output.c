/* output.c: CSV and resolved-scenario writers (output.h). */
#include "volev/output.h"

#include <errno.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include "volev/units.h"

#ifndef VL_VERSION
#define VL_VERSION "unknown"
#endif
#ifndef VL_GIT_REV
#define VL_GIT_REV "unknown"
#endif

enum { F_SERIES, F_EVENTS, F_SUMMARY, F_RESOLVED, NFILES };
static const char *const file_name[NFILES] = {"series.csv", "events.csv", "summary.csv",
                                              "scenario.resolved.cfg"};

struct vl_output {
    const vl_model *m;
    char dir[VL_PATH_MAX];
    int created_dir;
    FILE *f[NFILES];
    char tmp[NFILES][VL_PATH_MAX + 64];
    char hash[17];
    char *resolved;           /* resolved scenario text (owned): hashed at open, written at commit */
    size_t resolved_len;
    double first_event[64];   /* first time of each distinct event name, s */
    char event_names[64][32];
    int nevent_names;
    int last_regime;          /* regime of the latest row (the summary's split of the CO2) */
};

const char *vl_version(void) { return VL_VERSION " (git " VL_GIT_REV ")"; }

uint64_t vl_output_fnv1a(const char *s, size_t n, uint64_t h)
{
    for (size_t i = 0; i < n; i++) {
        h ^= (unsigned char)s[i];
        h *= 1099511628211ULL;
    }
    return h;
}

/* The resolved scenario as text (malloc'd), for writing and hashing. */
static char *resolved_text(const vl_scenario *sc, size_t *len, vl_status *st)
{
    char *buf = NULL;
    FILE *f = open_memstream(&buf, len);
    if (!f) {
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        return NULL;
    }
    int rc = vl_scenario_write_resolved(sc, f, st);
    if (fclose(f) != 0 || rc != VL_OK) {
        free(buf);
        if (rc == VL_OK)
            vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        return NULL;
    }
    return buf;
}

int vl_output_scenario_hash(const vl_scenario *sc, char out[17], vl_status *st)
{
    size_t len;
    char *txt = resolved_text(sc, &len, st);
    if (!txt)
        return st->code;
    snprintf(out, 17, "%016llx", (unsigned long long)vl_output_fnv1a(txt, len, VL_FNV_OFFSET));
    free(txt);
    return VL_OK;
}

/* Provenance lines. The scenario's path is not among them (only in summary.csv), so
 * rerunning scenario.resolved.cfg reproduces series.csv and events.csv byte for byte. */
static void header(vl_output *o, FILE *f)
{
    fprintf(f, "# volev %s\n", vl_version());
    fprintf(f, "# resolved scenario hash (FNV-1a 64): %s\n", o->hash);
}

static int io_fail(vl_status *st, const char *path)
{
    return vl_fail(st, VL_ERR_IO, path, 0, "cannot write: %s", strerror(errno));
}

static void series_header(vl_output *o)
{
    FILE *f = o->f[F_SERIES];
    header(o, f);
    fprintf(f, "# regime: ");
    for (int r = 0; r < VL_NREGIMES; r++)
        fprintf(f, "%s%d=%s", r ? " " : "", r, vl_regime_name(r));
    fprintf(f, "\n# p_*_bar: partial pressures (mole fraction x surface pressure); "
               "*_to: terrestrial oceans of %.4g kg; *_kg_s: process fluxes\n",
            VL_TO_KG);
    fprintf(f, "time_yr,regime,surface_temp_k,surface_water_to,ocean_to,p_surf_bar,p_h2o_bar,"
               "p_co2_bar,p_n2_bar,p_o2_bar,p_h2_bar,instellation_w_m2,s_eff,f_xuv_w_m2,"
               "luminosity_lsun,strat_h2o,h_escape_kg_s,o_escape_kg_s,c_escape_kg_s,"
               "n_escape_kg_s,exobase_temp_k,exobase_alt_km,magnetopause_rp,escape_lambda_h,"
               "h_escape_limit,ocean_co2_kg");
    for (int r = 0; r < VL_NRES; r++)
        fprintf(f, ",%s_kg", vl_reservoir_name(r));
    for (size_t c = 0; c < o->m->ncolumns; c++)
        fprintf(f, ",%s", o->m->col_name[c]);
    fputc('\n', f);
}

vl_output *vl_output_open(const char *dir, const vl_model *m, vl_status *st)
{
    vl_output *o = calloc(1, sizeof *o);
    if (!o) {
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        return NULL;
    }
    o->m = m;
    o->last_regime = VL_REGIME_TEMPERATE;
    snprintf(o->dir, sizeof o->dir, "%s", dir);
    o->resolved = resolved_text(m->sc, &o->resolved_len, st);
    if (!o->resolved) {
        free(o);
        return NULL;
    }
    snprintf(o->hash, sizeof o->hash, "%016llx",
             (unsigned long long)vl_output_fnv1a(o->resolved, o->resolved_len, VL_FNV_OFFSET));
    if (mkdir(dir, 0777) == 0)
        o->created_dir = 1;
    else if (errno != EEXIST) {
        vl_fail(st, VL_ERR_IO, dir, 0, "cannot create output folder: %s", strerror(errno));
        free(o->resolved);
        free(o);
        return NULL;
    }
    for (int i = 0; i < NFILES; i++) {
        snprintf(o->tmp[i], sizeof o->tmp[i], "%s/.%s.%ld.tmp", dir, file_name[i], (long)getpid());
        o->f[i] = fopen(o->tmp[i], "w");
        if (!o->f[i]) {
            io_fail(st, o->tmp[i]);
            vl_output_abort(o);
            return NULL;
        }
    }
    series_header(o);
    header(o, o->f[F_EVENTS]);
    fprintf(o->f[F_EVENTS], "time_yr,event,detail\n");
    return o;
}

static double clamp0(double v) { return v > 0.0 ? v : 0.0; }

double vl_output_dh(const double *y, int r)
{
    int d = vl_reservoir_deuterium(r);
    if (d >= 0 && y[r] < vl_reservoir_floor(r))
        return NAN; /* an exhausted reservoir's ratio is numerical noise: undefined */
    double h_mol = clamp0(y[r]) * vl_reservoir_element_fraction(r, VL_EL_H) / (VL_AW_H * 1e-3);
    if (d < 0 || !(h_mol > 0.0))
        return 0.0;
    return clamp0(y[d]) / (VL_AW_D * 1e-3) / h_mol;
}

/* CO2 dissolved in the ocean, kg: the surface CO2 less the atmospheric part that the
 * ocean partition (ocean.h, called by vl_model_env) left in env. */
static double ocean_co2(const double *y, const vl_env *env)
{
    return clamp0(clamp0(y[VL_R_CO2]) - env->mass_kg[VL_GAS_CO2]);
}

static int row_cb(void *ctx, double t, const double *y, const double *dydt, const vl_env *env,
                  const double *columns, vl_status *st)
{
    vl_output *o = ctx;
    FILE *f = o->f[F_SERIES];
    const double bar = 1.0 / VL_BAR;
    fprintf(f, "%.10g,%d,%.10g,%.10g,%.10g,%.10g,%.10g,%.10g,%.10g,%.10g,%.10g,%.10g,%.10g,%.10g,"
               "%.10g,%.10g,%.10g,%.10g",
            t / VL_YR, env->regime, env->t_surf_k, clamp0(y[VL_R_WATER]) / VL_TO_KG,
            env->ocean_kg / VL_TO_KG, env->p_surf_pa * bar, env->p_pa[VL_GAS_H2O] * bar,
            env->p_pa[VL_GAS_CO2] * bar, env->p_pa[VL_GAS_N2] * bar, env->p_pa[VL_GAS_O2] * bar,
            env->p_pa[VL_GAS_H2] * bar, env->instellation, env->s_eff, env->f_xuv,
            env->star.l_bol_w / VL_L_SUN, env->f_strat, clamp0(dydt[VL_R_SPACE_H]),
            clamp0(dydt[VL_R_SPACE_O]));
    fprintf(f, ",%.10g,%.10g,%.10g,%.10g,%.10g,%.10g,%d,%.10g", clamp0(dydt[VL_R_SPACE_C]),
            clamp0(dydt[VL_R_SPACE_N]), env->upper.t_exo_k, (env->upper.r_exo_m - o->m->planet.radius_m) * 1e-3,
            env->upper.r_mp_rp, env->escape.lambda_h, env->escape.h_limit, ocean_co2(y, env));
    o->last_regime = env->regime;
    for (int r = 0; r < VL_NRES; r++)
        fprintf(f, ",%.10g", clamp0(y[r]));
    /* a flux reversed by the depletion ramp (restoring an integrator overshoot below
     * zero, at the level of the tolerances) prints as 0: fluxes are one-way by name */
    for (size_t c = 0; c < o->m->ncolumns; c++)
        fprintf(f, ",%.10g", clamp0(columns[c]));
    if (fputc('\n', f) == EOF)
        return io_fail(st, o->tmp[F_SERIES]);
    return VL_OK;
}

static int event_cb(void *ctx, double t, const char *name, const char *detail, vl_status *st)
{
    vl_output *o = ctx;
    int k;
    for (k = 0; k < o->nevent_names; k++)
        if (strcmp(o->event_names[k], name) == 0)
            break;
    if (k == o->nevent_names && k < 64) {
        snprintf(o->event_names[k], sizeof o->event_names[k], "%s", name);
        o->first_event[k] = t;
        o->nevent_names++;
    }
    if (fprintf(o->f[F_EVENTS], "%.10g,%s,%s\n", t / VL_YR, name, detail) < 0)
        return io_fail(st, o->tmp[F_EVENTS]);
    return VL_OK;
}

vl_run_sink vl_output_sink(vl_output *o) { return (vl_run_sink){o, row_cb, event_cb}; }

static void summary(vl_output *o, const vl_run_stats *s)
{
    FILE *f = o->f[F_SUMMARY];
    const vl_model *m = o->m;
    const double *y = s->y_final;
    double pa = m->planet.pa_per_kg / VL_BAR;
    double h_per_water = 2.0 * VL_AW_H * 1e-3 / vl_species_molar_mass(VL_SP_H2O);
    const vl_env env = s->env_last; /* the final row's stages */
    header(o, f);
    fprintf(f, "# scenario: %s\n", m->sc->path);
    fprintf(f, "name,value,unit\n");
    for (int r = 0; r < VL_NRES; r++)
        fprintf(f, "final_%s,%.10g,kg\n", vl_reservoir_name(r), clamp0(y[r]));
    fprintf(f, "final_surface_water_to,%.10g,TO\n", clamp0(y[VL_R_WATER]) / VL_TO_KG);
    fprintf(f, "water_lost_to_space,%.10g,TO\n", y[VL_R_SPACE_H] / h_per_water / VL_TO_KG);
    fprintf(f, "o2_accumulated,%.10g,bar\n", clamp0(y[VL_R_O2]) * pa);
    fprintf(f, "final_dh_water,%.10g,ratio\n", vl_output_dh(y, VL_R_WATER));
    fprintf(f, "dh_enrichment,%.10g,ratio\n",
            m->sc->inventory.initial_dh > 0.0
                ? vl_output_dh(y, VL_R_WATER) / m->sc->inventory.initial_dh
                : 0.0);
    fprintf(f, "final_co2,%.10g,bar\n", env.mass_kg[VL_GAS_CO2] * pa);
    fprintf(f, "final_ocean_co2,%.10g,kg\n", ocean_co2(y, &env));
    fprintf(f, "final_co2_mole_fraction,%.10g,ppmv\n", env.x[VL_GAS_CO2] * 1e6);
    for (int k = 0; k < o->nevent_names; k++)
        fprintf(f, "first_%s,%.10g,yr\n", o->event_names[k], o->first_event[k] / VL_YR);
    for (int r = 0; r < VL_NREGIMES; r++)
        fprintf(f, "time_%s,%.10g,yr\n", vl_regime_name(r), s->time_in_regime_s[r] / VL_YR);
    for (size_t c = 0; c < m->ncolumns; c++) {
        const char *name = m->col_name[c];
        size_t len = strlen(name);
        /* a column "x_kg_s" integrates to "x_kg" */
        int tail = len > 5 && strcmp(name + len - 5, "_kg_s") == 0;
        fprintf(f, "total_%.*s,%.10g,kg\n", (int)(tail ? len - 5 : len), name,
                clamp0(s->channel_kg[c]));
    }
    for (int el = 0; el < VL_NELEMENTS; el++) {
        double t0 = s->totals0[el], d = fabs(s->totals1[el] - t0);
        fprintf(f, "residual_%s,%.3e,relative\n", vl_element_name(el), t0 > 0.0 ? d / t0 : d);
    }
    /* rows and finals print overshoots below zero (integrator error, restored by the
     * depletion ramp) as 0; their largest depth, as a non-negative mass, is here */
    fprintf(f, "reservoir_overshoot,%.10g,kg\n", s->min_mass_kg < 0.0 ? -s->min_mass_kg : 0.0);
    fprintf(f, "rhs_evaluations,%ld,count\n", s->rhs_calls);
    fprintf(f, "steps,%ld,count\n", s->steps);
    fprintf(f, "events,%ld,count\n", s->events);
    fprintf(f, "climate_table_nodes,%ld,count\n", s->climate_nodes);
    fprintf(f, "climate_table_build_s,%.6f,s\n", s->climate_build_s);
    fprintf(f, "wall_time_s,%.6f,s\n", s->wall_s);
}

int vl_output_commit(vl_output *o, const vl_run_stats *stats, vl_status *st)
{
    summary(o, stats);
    int rc = fwrite(o->resolved, 1, o->resolved_len, o->f[F_RESOLVED]) == o->resolved_len
                 ? VL_OK
                 : io_fail(st, o->tmp[F_RESOLVED]);
    for (int i = 0; i < NFILES; i++) {
        if (o->f[i] && (ferror(o->f[i]) | fclose(o->f[i])) && rc == VL_OK)
            rc = io_fail(st, o->tmp[i]);
        o->f[i] = NULL;
    }
    for (int i = 0; i < NFILES && rc == VL_OK; i++) {
        char final[VL_PATH_MAX + 64];
        snprintf(final, sizeof final, "%s/%s", o->dir, file_name[i]);
        if (rename(o->tmp[i], final) != 0)
            rc = vl_fail(st, VL_ERR_IO, final, 0, "cannot rename into place: %s", strerror(errno));
    }
    if (rc != VL_OK) {
        vl_output_abort(o);
        return rc;
    }
    free(o->resolved);
    free(o);
    return VL_OK;
}

void vl_output_abort(vl_output *o)
{
    if (!o)
        return;
    for (int i = 0; i < NFILES; i++) {
        if (o->f[i])
            fclose(o->f[i]);
        if (o->tmp[i][0])
            unlink(o->tmp[i]);
    }
    if (o->created_dir)
        rmdir(o->dir);
    free(o->resolved);
    free(o);
}
