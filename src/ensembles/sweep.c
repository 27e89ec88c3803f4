/* sweep.c: the sweep group of a scenario, members and their outcomes (sweep.h,
 * docs/ensembles.md). */
#include "volev/sweep.h"

#include <errno.h>
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "volev/climate.h"
#include "volev/integrate.h"
#include "volev/model.h"
#include "volev/output.h"
#include "volev/units.h"
#include "sweep_internal.h"

const char *const vl_outcome_name[VL_NOUT] = {
    "final_water_to", "water_lost_to",  "o2_bar",         "co2_bar",
    "surface_temp_k", "surface_pressure_bar", "dh_enrichment", "runaway_time_yr",
    "moist_time_yr",  "desiccation_yr", "first_runaway_yr", "first_moist_yr",
    "first_freeze_yr"};
const char *const vl_outcome_unit[VL_NOUT] = {"TO", "TO", "bar", "bar", "K", "bar", "ratio",
                                              "yr", "yr", "yr", "yr", "yr", "yr"};
const char *const vl_class_name[VL_NCLASS] = {"failed", "steam", "o2_rich", "desiccated",
                                              "frozen", "ocean_kept"};

#define MAX_MEMBERS VL_DESIGN_MEMBERS_MAX

/* ------------------------------------------------------------------ set-up */

/* Canonical text of the settings (for the hash). */
static int spec_text(const vl_sweep *sw, char *buf, size_t n)
{
    int len = snprintf(buf, n, "cat=%d design=%d n=%ld seed=%lu boot=%ld conf=%.17g o2=%.17g\n",
                       sw->catalogue_mode, sw->design, sw->n, sw->seed, sw->bootstrap,
                       sw->confidence, sw->o2_rich_bar);
    for (size_t a = 0; a < sw->k && len > 0 && (size_t)len < n; a++) {
        const vl_axis *x = &sw->axes[a];
        len += snprintf(buf + len, n - (size_t)len,
                        "axis %s %d %.17g %.17g %ld %d %.17g %.17g %.17g %.17g\n", x->key,
                        x->spacing, x->from, x->to, x->points, x->dist, x->low, x->high, x->mean,
                        x->sd);
    }
    for (size_t w = 0; w < sw->nwaters && len > 0 && (size_t)len < n; w++)
        len += snprintf(buf + len, n - (size_t)len, "water %.17g\n", sw->waters[w]);
    for (size_t j = 0; j < sw->nsens && len > 0 && (size_t)len < n; j++)
        len += snprintf(buf + len, n - (size_t)len, "sens %d\n", sw->sens[j]);
    return len > 0 && (size_t)len < n ? len : -1;
}

/* The whole catalogue file's bytes into the hash. */
static int hash_file(const char *path, uint64_t *h, vl_status *st)
{
    FILE *f = fopen(path, "rb");
    if (!f)
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot read: %s", strerror(errno));
    char buf[8192];
    size_t got;
    while ((got = fread(buf, 1, sizeof buf, f)) > 0)
        *h = vl_output_fnv1a(buf, got, *h);
    int bad = ferror(f);
    fclose(f);
    return bad ? vl_fail(st, VL_ERR_IO, path, 0, "read error") : VL_OK;
}

static int finish_setup(vl_sweep *sw, const vl_scenario *base, vl_status *st)
{
    int rc;
    if (sw->catalogue_mode) {
        sw->cat = vl_catalogue_read(sw->cat_path, st);
        if (!sw->cat)
            return st->code;
        if ((rc = vl_sweep_check_candidates(sw, st)))
            return rc;
        long per = sw->nwaters ? (long)sw->nwaters : 1;
        sw->members = (long)sw->cat->nrows * per;
    } else {
        sw->members = vl_design_size(sw->design, sw->axes, sw->k, sw->n, st);
        if (sw->members < 0) { /* at the axis the library names, else at members */
            char msg[VL_MSG_MAX];
            snprintf(msg, sizeof msg, "%s", st->msg);
            int line = st->line > 0 ? st->line : sw->members_line ? sw->members_line : sw->line;
            return vl_fail(st, st->code, sw->sweep_path, line, "%s", msg);
        }
        if (sw->members > MAX_MEMBERS)
            return vl_fail(st, VL_ERR_INPUT, sw->sweep_path, sw->line,
                           "sweep: %ld members, more than the %ld allowed", sw->members, MAX_MEMBERS);
        sw->x = malloc((size_t)sw->members * sw->k * sizeof *sw->x);
        if (!sw->x)
            return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory for %ld members",
                           sw->members);
        if ((rc = vl_design_generate(sw->design, sw->axes, sw->k, sw->n, sw->seed, sw->x, st)))
            return rc;
    }
    /* sample ages: log-spaced over the base run */
    double t0 = base->run.start_s, t1 = base->run.end_s;
    for (int j = 0; j < VL_SWEEP_NT; j++)
        sw->t_grid_s[j] = j == VL_SWEEP_NT - 1 ? t1 : t0 * pow(t1 / t0, (double)j / (VL_SWEEP_NT - 1));
    /* hash: version, resolved base scenario, settings, catalogue bytes */
    char base_hash[17], spec[1 << 14];
    if ((rc = vl_output_scenario_hash(base, base_hash, st)))
        return rc;
    if (spec_text(sw, spec, sizeof spec) < 0)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "sweep settings too long to hash");
    uint64_t h = vl_output_fnv1a(vl_version(), strlen(vl_version()), VL_FNV_OFFSET);
    h = vl_output_fnv1a(base_hash, 16, h);
    h = vl_output_fnv1a(spec, strlen(spec), h);
    if (sw->catalogue_mode && (rc = hash_file(sw->cat_path, &h, st)))
        return rc;
    snprintf(sw->hash, sizeof sw->hash, "%016llx", (unsigned long long)h);
    /* every axis must name a scenario key that takes its typical value */
    return vl_sweep_check_axes(sw, st);
}

vl_sweep *vl_sweep_load(const char *path, vl_status *st)
{
    vl_status_clear(st);
    vl_scenario *base = vl_scenario_load(path, NULL, 0, st);
    if (!base)
        return NULL;
    vl_sweep *sw = calloc(1, sizeof *sw);
    if (!sw) {
        vl_scenario_free(base);
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        return NULL;
    }
    snprintf(sw->path, sizeof sw->path, "%s", path);
    snprintf(sw->sweep_path, sizeof sw->sweep_path, "%s", path);
    int rc = base->sweep ? vl_sweep_check_spec(sw, base->sweep, st)
                         : vl_fail(st, VL_ERR_INPUT, path, 0,
                                   "no sweep group: add sweep = { design = ...; axes = (...); }; "
                                   "(docs/ensembles.md)");
    if (rc == VL_OK)
        rc = finish_setup(sw, base, st);
    vl_scenario_free(base);
    if (rc != VL_OK) {
        vl_sweep_free(sw);
        return NULL;
    }
    return sw;
}

void vl_sweep_free(vl_sweep *sw)
{
    if (!sw)
        return;
    free(sw->axes);
    free(sw->x);
    free(sw->waters);
    vl_catalogue_free(sw->cat);
    free(sw);
}

/* ------------------------------------------------------------------ members */

int vl_sweep_overrides(const vl_sweep *sw, long i, char ***out, size_t *n, vl_status *st)
{
    size_t cap = sw->catalogue_mode ? sw->cat->ncols + 1 : sw->k;
    char **ov = calloc(cap ? cap : 1, sizeof *ov);
    size_t m = 0;
    if (!ov)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    int bad = 0;
    if (sw->catalogue_mode) {
        size_t per = sw->nwaters ? sw->nwaters : 1;
        size_t row = (size_t)i / per, w = (size_t)i % per;
        m = vl_catalogue_overrides(sw->cat, row, ov);
        if (sw->nwaters) {
            char buf[128];
            snprintf(buf, sizeof buf, "inventory.surface_water_to=%.17g", sw->waters[w]);
            if (!(ov[m++] = strdup(buf)))
                bad = 1;
        }
    } else {
        for (size_t a = 0; a < sw->k && !bad; a++) {
            char buf[256];
            snprintf(buf, sizeof buf, "%s=%.17g", sw->axes[a].key, sw->x[(size_t)i * sw->k + a]);
            if (!(ov[m++] = strdup(buf)))
                bad = 1;
        }
    }
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

/* What a member's run reports through the sink. */
typedef struct {
    const vl_model *m;
    double *t, *w, *o;        /* row ages (s), water (TO), O2 (bar) */
    size_t n, cap;
    double first[VL_NREGIMES]; /* age of first entry into each regime, s (NaN: never) */
    double ocean_lost;         /* first ocean_lost, s */
    int end_regime;
} catcher;

static int regime_of(const char *name)
{
    for (int r = 0; r < VL_NREGIMES; r++)
        if (strcmp(vl_regime_name(r), name) == 0)
            return r;
    return -1;
}

static int catch_row(void *ctx, double t, const double *y, const double *dydt, const vl_env *env,
                     const double *columns, vl_status *st)
{
    catcher *c = ctx;
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
    c->o[c->n] = fmax(y[VL_R_O2], 0.0) * c->m->pa_per_kg / VL_BAR;
    c->n++;
    return VL_OK;
}

static int catch_event(void *ctx, double t, const char *name, const char *detail, vl_status *st)
{
    catcher *c = ctx;
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
static void sample(const vl_sweep *sw, const catcher *c, const double *v, double *out)
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

static int classify(const vl_sweep *sw, const vl_member *res)
{
    if (res->status != VL_OK)
        return VL_CLASS_FAILED;
    if (res->regime == VL_REGIME_RUNAWAY || res->regime == VL_REGIME_MOIST)
        return VL_CLASS_STEAM;
    if (res->out[VL_OUT_O2] >= sw->o2_rich_bar)
        return VL_CLASS_O2_RICH;
    if (res->regime == VL_REGIME_DRY)
        return VL_CLASS_DESICCATED;
    if (res->regime == VL_REGIME_FROZEN)
        return VL_CLASS_FROZEN;
    return VL_CLASS_OCEAN_KEPT;
}

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

void vl_sweep_run_member(const vl_sweep *sw, long i, vl_member *res)
{
    memset(res, 0, sizeof *res);
    res->index = i;
    res->regime = -1;
    for (int o = 0; o < VL_NOUT; o++)
        res->out[o] = NAN;
    for (int j = 0; j < VL_SWEEP_NT; j++)
        res->water_to[j] = res->o2_bar[j] = NAN;
    vl_status st;
    vl_status_clear(&st);
    char **ov = NULL;
    size_t nov = 0;
    vl_scenario *sc = NULL;
    vl_model *m = NULL;
    catcher c = {0};
    if (vl_sweep_overrides(sw, i, &ov, &nov, &st) == VL_OK)
        sc = vl_scenario_load(sw->path, (const char *const *)ov, nov, &st);
    if (sc)
        m = vl_model_new(sc, &st);
    if (m) {
        c.m = m;
        c.ocean_lost = NAN;
        c.end_regime = -1;
        for (int r = 0; r < VL_NREGIMES; r++)
            c.first[r] = NAN;
        vl_run_sink sink = {&c, catch_row, catch_event};
        vl_run_stats s;
        if (vl_integrate(m, &sink, &s, &st) == VL_OK) {
            const double *y = s.y_final;
            double pa = m->pa_per_kg / VL_BAR;
            double h_per_water = 2.0 * VL_AW_H * 1e-3 / vl_species_molar_mass(VL_SP_H2O);
            vl_env env;
            res->regime = c.end_regime;
            vl_model_env(m, sc->run.end_s, y, res->regime >= 0 ? res->regime : VL_REGIME_TEMPERATE,
                         &env);
            res->steps = s.steps;
            res->out[VL_OUT_WATER] = fmax(y[VL_R_WATER], 0.0) / VL_TO_KG;
            res->out[VL_OUT_WATER_LOST] = y[VL_R_SPACE_H] / h_per_water / VL_TO_KG;
            res->out[VL_OUT_O2] = fmax(y[VL_R_O2], 0.0) * pa;
            res->out[VL_OUT_CO2] = env.mass_kg[VL_GAS_CO2] * pa;
            res->out[VL_OUT_TEMP] = env.t_surf_k;
            res->out[VL_OUT_PRESSURE] = env.p_surf_pa / VL_BAR;
            res->out[VL_OUT_DH] = sc->inventory.initial_dh > 0.0
                                      ? vl_output_dh(y, VL_R_WATER) / sc->inventory.initial_dh
                                      : NAN;
            res->out[VL_OUT_RUNAWAY_TIME] = s.time_in_regime_s[VL_REGIME_RUNAWAY] / VL_YR;
            res->out[VL_OUT_MOIST_TIME] = s.time_in_regime_s[VL_REGIME_MOIST] / VL_YR;
            res->out[VL_OUT_DESICCATION] = c.ocean_lost / VL_YR;
            res->out[VL_OUT_FIRST_RUNAWAY] = c.first[VL_REGIME_RUNAWAY] / VL_YR;
            res->out[VL_OUT_FIRST_MOIST] = c.first[VL_REGIME_MOIST] / VL_YR;
            res->out[VL_OUT_FIRST_FREEZE] = c.first[VL_REGIME_FROZEN] / VL_YR;
            sample(sw, &c, c.w, res->water_to);
            sample(sw, &c, c.o, res->o2_bar);
            res->status = VL_OK;
            for (int o = 0; o < VL_NOUT; o++) /* defined outcomes must be finite */
                if (isinf(res->out[o]))
                    vl_fail(&st, VL_ERR_NUMERIC, NULL, 0, "outcome %s is not finite",
                            vl_outcome_name[o]);
        }
    }
    if (st.code != VL_OK)
        record_failure(res, &st);
    res->cls = classify(sw, res);
    free(c.t);
    free(c.w);
    free(c.o);
    vl_model_free(m);
    vl_scenario_free(sc);
    vl_sweep_free_overrides(ov, nov);
}

/* ------------------------------------------------------------------ text */

typedef struct {
    char *s;
    size_t n, cap;
    int bad;
} buf_t;

static void put(buf_t *b, const char *fmt, ...) __attribute__((format(printf, 2, 3)));
static void put(buf_t *b, const char *fmt, ...)
{
    if (b->bad)
        return;
    for (;;) {
        va_list ap;
        va_start(ap, fmt);
        int len = vsnprintf(b->s ? b->s + b->n : NULL, b->s ? b->cap - b->n : 0, fmt, ap);
        va_end(ap);
        if (len < 0) {
            b->bad = 1;
            return;
        }
        if (b->s && b->n + (size_t)len < b->cap) {
            b->n += (size_t)len;
            return;
        }
        size_t cap = (b->cap ? 2 * b->cap : 256) + (size_t)len;
        char *s = realloc(b->s, cap);
        if (!s) {
            b->bad = 1;
            return;
        }
        b->s = s;
        b->cap = cap;
    }
}

static char *done(buf_t *b)
{
    if (b->bad || !b->s) {
        free(b->s);
        return NULL;
    }
    return b->s;
}

/* A CSV field: quoted when it holds a comma, quote or line break. */
static void put_field(buf_t *b, const char *text)
{
    if (!strpbrk(text, ",\"\r\n")) {
        put(b, "%s", text);
        return;
    }
    put(b, "\"");
    for (const char *p = text; *p; p++) {
        if (*p == '"')
            put(b, "\"\"");
        else if (*p == '\n' || *p == '\r')
            put(b, " ");
        else
            put(b, "%c", *p);
    }
    put(b, "\"");
}

char *vl_sweep_header(const vl_sweep *sw)
{
    buf_t b = {0};
    put(&b, "member");
    if (sw->catalogue_mode) {
        put(&b, ",candidate");
        for (size_t c = 0; c < sw->cat->ncols; c++) {
            put(&b, ",");
            put_field(&b, sw->cat->headers[c]);
        }
        if (sw->nwaters)
            put(&b, ",initial_water_to");
    } else {
        for (size_t a = 0; a < sw->k; a++)
            put(&b, ",%s", sw->axes[a].key);
    }
    put(&b, ",status,outcome,final_regime");
    for (int o = 0; o < VL_NOUT; o++)
        put(&b, ",%s", vl_outcome_name[o]);
    put(&b, ",steps,reason");
    return done(&b);
}

static void put_num(buf_t *b, double v)
{
    if (isfinite(v))
        put(b, ",%.10g", v);
    else
        put(b, ",");
}

char *vl_sweep_row(const vl_sweep *sw, const vl_member *res)
{
    buf_t b = {0};
    long i = res->index;
    put(&b, "%ld", i);
    if (sw->catalogue_mode) {
        size_t per = sw->nwaters ? sw->nwaters : 1;
        size_t row = (size_t)i / per;
        put(&b, ",");
        put_field(&b, sw->cat->names[row]);
        for (size_t c = 0; c < sw->cat->ncols; c++) {
            put(&b, ",");
            if (sw->cat->cells[row][c])
                put_field(&b, sw->cat->cells[row][c]);
        }
        if (sw->nwaters)
            put(&b, ",%.10g", sw->waters[(size_t)i % per]);
    } else {
        for (size_t a = 0; a < sw->k; a++)
            put(&b, ",%.10g", sw->x[(size_t)i * sw->k + a]);
    }
    put(&b, ",%s,%s,%s", res->status == VL_OK ? "ok" : "failed", vl_class_name[res->cls],
        res->regime >= 0 ? vl_regime_name(res->regime) : "");
    for (int o = 0; o < VL_NOUT; o++)
        put_num(&b, res->out[o]);
    put(&b, ",%ld,", res->steps);
    put_field(&b, res->reason);
    return done(&b);
}

/* Journal: "index status regime cls steps | out... | water... | o2... | reason\n", numbers
 * %.17g (nan for undefined), tab-separated. */
char *vl_sweep_journal_line(const vl_member *res)
{
    buf_t b = {0};
    put(&b, "%ld\t%d\t%d\t%d\t%ld", res->index, res->status, res->regime, res->cls, res->steps);
    for (int o = 0; o < VL_NOUT; o++)
        put(&b, "\t%.17g", res->out[o]);
    for (int j = 0; j < VL_SWEEP_NT; j++)
        put(&b, "\t%.17g", res->water_to[j]);
    for (int j = 0; j < VL_SWEEP_NT; j++)
        put(&b, "\t%.17g", res->o2_bar[j]);
    put(&b, "\t");
    for (const char *p = res->reason; *p; p++)
        put(&b, "%c", *p == '\t' || *p == '\n' || *p == '\r' ? ' ' : *p);
    put(&b, "\n");
    return done(&b);
}

static int next_num(const char **p, double *v)
{
    char *end;
    if (**p != '\t')
        return -1;
    (*p)++;
    errno = 0;
    *v = strtod(*p, &end);
    if (end == *p)
        return -1;
    *p = end;
    return 0;
}

int vl_sweep_journal_parse(const char *line, vl_member *res)
{
    size_t len = strlen(line);
    if (len == 0 || line[len - 1] != '\n')
        return -1; /* a line cut short by an interruption */
    memset(res, 0, sizeof *res);
    const char *p = line;
    double v[5];
    char *end;
    v[0] = strtod(p, &end);
    if (end == p)
        return -1;
    p = end;
    for (int f = 1; f < 5; f++)
        if (next_num(&p, &v[f]))
            return -1;
    res->index = (long)v[0];
    res->status = (int)v[1];
    res->regime = (int)v[2];
    res->cls = (int)v[3];
    res->steps = (long)v[4];
    if (res->index < 0 || res->cls < 0 || res->cls >= VL_NCLASS || res->regime < -1 ||
        res->regime >= VL_NREGIMES)
        return -1;
    for (int o = 0; o < VL_NOUT; o++)
        if (next_num(&p, &res->out[o]))
            return -1;
    for (int j = 0; j < VL_SWEEP_NT; j++)
        if (next_num(&p, &res->water_to[j]))
            return -1;
    for (int j = 0; j < VL_SWEEP_NT; j++)
        if (next_num(&p, &res->o2_bar[j]))
            return -1;
    if (*p != '\t')
        return -1;
    p++;
    size_t n = strlen(p) - 1; /* drop the newline */
    if (n >= sizeof res->reason)
        n = sizeof res->reason - 1;
    memcpy(res->reason, p, n);
    res->reason[n] = '\0';
    return 0;
}
