/* sweep_member.c: one member of a sweep (sweep.h): its "KEY=VALUE" overrides, and its
 * run -- the base scenario with those overrides, integrated with a sink that keeps the
 * water and O2 histories and the regime events -- into a vl_member. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "sweep_internal.h"
#include "volev/climate.h"
#include "volev/units.h"

/* ------------------------------------------------------------------ overrides */

/* Catalogue member i: its candidate's cells and, with water amounts, its amount. */
static int candidate_overrides(const vl_sweep *sw, long i, char **ov, size_t *m)
{
    size_t per = sw->nwaters ? sw->nwaters : 1;
    size_t row = (size_t)i / per, w = (size_t)i % per;
    *m = vl_catalogue_overrides(sw->cat, row, ov);
    if (*m == (size_t)-1) {
        *m = 0;
        return -1;
    }
    if (sw->nwaters) {
        char buf[128];
        snprintf(buf, sizeof buf, "inventory.surface_water_to=%.17g", sw->waters[w]);
        if (!(ov[(*m)++] = strdup(buf)))
            return -1;
    }
    return 0;
}

/* Design member i: one override per axis, at 17 significant digits. */
static int design_overrides(const vl_sweep *sw, long i, char **ov, size_t *m)
{
    for (size_t a = 0; a < sw->k; a++) {
        char buf[256];
        snprintf(buf, sizeof buf, "%s=%.17g", sw->axes[a].key, sw->x[(size_t)i * sw->k + a]);
        if (!(ov[(*m)++] = strdup(buf)))
            return -1;
    }
    return 0;
}

int vl_sweep_overrides(const vl_sweep *sw, long i, char ***out, size_t *n, vl_status *st)
{
    size_t cap = sw->catalogue_mode ? sw->cat->ncols + 1 : sw->k;
    char **ov = calloc(cap ? cap : 1, sizeof *ov);
    size_t m = 0;
    if (!ov)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    int bad = sw->catalogue_mode ? candidate_overrides(sw, i, ov, &m)
                                 : design_overrides(sw, i, ov, &m);
    if (bad) {
        vl_sweep_free_overrides(ov, m);
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    }
    *out = ov;
    *n = m;
    return VL_OK;
}

void vl_sweep_free_overrides(char **ov, size_t n)
{
    if (!ov)
        return;
    for (size_t j = 0; j < n; j++)
        free(ov[j]);
    free(ov);
}

/* ------------------------------------------------------------------ the sink */

/* The regime named name, or -1. */
static int regime_of(const char *name)
{
    for (int r = 0; r < VL_NREGIMES; r++)
        if (strcmp(vl_regime_name(r), name) == 0)
            return r;
    return -1;
}

/* Keeps the row's age, surface water (TO) and O2 (bar). */
static int catch_row(void *ctx, double t, const double *y, const double *dydt, const vl_env *env,
                     const double *columns, vl_status *st)
{
    vl_sweep_trace *c = ctx;
    (void)dydt;
    (void)env;
    (void)columns;
    if (c->n == c->cap) {
        size_t cap = c->cap ? 2 * c->cap : 512;
        double *t2 = realloc(c->t, cap * sizeof *t2);
        if (t2)
            c->t = t2;
        double *w2 = t2 ? realloc(c->w, cap * sizeof *w2) : NULL;
        if (w2)
            c->w = w2;
        double *o2 = w2 ? realloc(c->o, cap * sizeof *o2) : NULL;
        if (!o2)
            return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        c->o = o2;
        c->cap = cap;
    }
    c->t[c->n] = t;
    c->w[c->n] = fmax(y[VL_R_WATER], 0.0) / VL_TO_KG;
    c->o[c->n] = fmax(y[VL_R_O2], 0.0) * c->m->planet.pa_per_kg / VL_BAR;
    c->n++;
    return VL_OK;
}

/* Keeps the first age of each regime (start, transitions), the final regime and the
 * first ocean_lost event. */
static int catch_event(void *ctx, double t, const char *name, const char *detail, vl_status *st)
{
    vl_sweep_trace *c = ctx;
    (void)st;
    int r = -1;
    if (strcmp(name, "start") == 0 || strcmp(name, "end") == 0) {
        r = regime_of(detail);
        if (strcmp(name, "end") == 0)
            c->end_regime = r;
    } else {
        const char *arrow = strstr(detail, "-> ");
        if (arrow)
            r = regime_of(arrow + 3);
        if (strcmp(name, "ocean_lost") == 0 && isnan(c->ocean_lost))
            c->ocean_lost = t;
    }
    if (r >= 0 && isnan(c->first[r]))
        c->first[r] = t;
    return VL_OK;
}

/* Linear interpolation of the rows onto the sample ages (NaN outside the run). */
static void sample(const vl_sweep *sw, const vl_sweep_trace *c, const double *v, double *out)
{
    size_t k = 0;
    for (int j = 0; j < VL_SWEEP_NT; j++) {
        double t = sw->t_grid_s[j];
        out[j] = NAN;
        if (c->n == 0 || t < c->t[0] * (1.0 - 1e-12) || t > c->t[c->n - 1] * (1.0 + 1e-12))
            continue;
        while (k + 1 < c->n && c->t[k + 1] < t)
            k++;
        if (k + 1 >= c->n || c->t[k + 1] <= c->t[k]) {
            out[j] = v[k];
            continue;
        }
        double u = (t - c->t[k]) / (c->t[k + 1] - c->t[k]);
        u = u < 0.0 ? 0.0 : u > 1.0 ? 1.0 : u;
        out[j] = v[k] + u * (v[k + 1] - v[k]);
    }
}

/* ------------------------------------------------------------------ running */

/* res for member i with nothing known yet (outcomes and histories NaN). */
static void blank(vl_member *res, long i)
{
    memset(res, 0, sizeof *res);
    res->index = i;
    res->regime = -1;
    for (int o = 0; o < VL_NOUT; o++)
        res->out[o] = NAN;
    for (int j = 0; j < VL_SWEEP_NT; j++)
        res->water_to[j] = res->o2_bar[j] = NAN;
}

/* The member's status and reason from the error in st. */
static void record_failure(vl_member *res, const vl_status *st)
{
    char buf[VL_MSG_MAX + VL_PATH_MAX + 32];
    vl_status_format(st, buf, sizeof buf);
    res->status = st->code ? st->code : VL_ERR_INTERNAL;
    size_t n = strlen(buf);
    if (n >= sizeof res->reason)
        n = sizeof res->reason - 1;
    memcpy(res->reason, buf, n);
    res->reason[n] = '\0';
}

/* Integrates model m of scenario sc into the trace c; once it ran, res gets its
 * outcomes and histories. */
static void integrate(const vl_sweep *sw, const vl_scenario *sc, const vl_model *m,
                      vl_sweep_trace *c, vl_member *res, vl_status *st)
{
    c->m = m;
    c->ocean_lost = NAN;
    c->end_regime = -1;
    for (int r = 0; r < VL_NREGIMES; r++)
        c->first[r] = NAN;
    vl_run_sink sink = {c, catch_row, catch_event};
    vl_run_stats s;
    if (vl_integrate(m, &sink, &s, st) != VL_OK)
        return;
    vl_sweep_outcomes(m, sc, &s, c, res, st); /* a non-finite outcome fails st */
    sample(sw, c, c->w, res->water_to);
    sample(sw, c, c->o, res->o2_bar);
}

void vl_sweep_run_member(const vl_sweep *sw, long i, vl_member *res)
{
    blank(res, i);
    vl_status st;
    vl_status_clear(&st);
    char **ov = NULL;
    size_t nov = 0;
    vl_scenario *sc = NULL;
    vl_model *m = NULL;
    vl_sweep_trace c = {0};
    if (vl_sweep_overrides(sw, i, &ov, &nov, &st) == VL_OK)
        sc = vl_scenario_load(sw->path, (const char *const *)ov, nov, &st);
    if (sc)
        m = vl_model_new(sc, &st);
    if (m)
        integrate(sw, sc, m, &c, res, &st);
    if (st.code != VL_OK)
        record_failure(res, &st);
    res->cls = vl_sweep_classify(sw, res);
    free(c.t);
    free(c.w);
    free(c.o);
    vl_model_free(m);
    vl_scenario_free(sc);
    vl_sweep_free_overrides(ov, nov);
}
