/* sweep.c: the sweep group of a scenario, members and their outcomes (sweep.h,
 * docs/ensembles.md). */
#include "volev/sweep.h"

#include <errno.h>
#include <libconfig.h>
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

const char *const vl_outcome_name[VL_NOUT] = {
    "final_water_to", "water_lost_to",  "o2_bar",         "co2_bar",
    "surface_temp_k", "surface_pressure_bar", "dh_enrichment", "runaway_time_yr",
    "moist_time_yr",  "desiccation_yr", "first_runaway_yr", "first_moist_yr",
    "first_freeze_yr"};
const char *const vl_outcome_unit[VL_NOUT] = {"TO", "TO", "bar", "bar", "K", "bar", "ratio",
                                              "yr", "yr", "yr", "yr", "yr", "yr"};
const char *const vl_class_name[VL_NCLASS] = {"failed", "steam", "o2_rich", "desiccated",
                                              "frozen", "ocean_kept"};

#define MAX_AXES 40      /* the Sobol generator's dimension limit (2k for saltelli) */
#define MAX_WATERS 64
#define MAX_MEMBERS 100000000L

/* ------------------------------------------------------------------ reading */

typedef struct {
    const char *file;
    vl_status *st;
} rd;

static int fail_line(const rd *r, int line, const char *fmt, ...) __attribute__((format(printf, 3, 4)));
static int fail_line(const rd *r, int line, const char *fmt, ...)
{
    char msg[VL_MSG_MAX];
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(msg, sizeof msg, fmt, ap);
    va_end(ap);
    return vl_fail(r->st, VL_ERR_INPUT, r->file, line, "%s", msg);
}

static int line_of(const config_setting_t *s) { return (int)config_setting_source_line(s); }

/* A finite number (int or float setting). */
static int get_real(const rd *r, const config_setting_t *s, const char *what, double *v)
{
    int t = config_setting_type(s);
    if (t == CONFIG_TYPE_INT)
        *v = config_setting_get_int(s);
    else if (t == CONFIG_TYPE_INT64)
        *v = (double)config_setting_get_int64(s);
    else if (t == CONFIG_TYPE_FLOAT)
        *v = config_setting_get_float(s);
    else
        return fail_line(r, line_of(s), "%s: expected a number", what);
    if (!isfinite(*v))
        return fail_line(r, line_of(s), "%s: expected a finite number", what);
    return VL_OK;
}

/* A whole number in [lo, hi]. */
static int get_long(const rd *r, const config_setting_t *s, const char *what, long lo, long hi,
                    long *v)
{
    int t = config_setting_type(s);
    if (t == CONFIG_TYPE_INT)
        *v = config_setting_get_int(s);
    else if (t == CONFIG_TYPE_INT64)
        *v = (long)config_setting_get_int64(s);
    else
        return fail_line(r, line_of(s), "%s: expected a whole number", what);
    if (*v < lo || *v > hi)
        return fail_line(r, line_of(s), "%s = %ld is out of bounds [%ld, %ld]", what, *v, lo, hi);
    return VL_OK;
}

static int get_string(const rd *r, const config_setting_t *s, const char *what, const char **v)
{
    *v = "";
    if (config_setting_type(s) != CONFIG_TYPE_STRING)
        return fail_line(r, line_of(s), "%s: expected a string in double quotes", what);
    *v = config_setting_get_string(s);
    return VL_OK;
}

/* Index of word in the '|'-separated choices, or -1. */
static int choice(const char *word, const char *choices)
{
    int k = 0;
    size_t n = strlen(word);
    for (const char *c = choices; *c; k++) {
        const char *bar = strchr(c, '|');
        size_t len = bar ? (size_t)(bar - c) : strlen(c);
        if (len == n && strncmp(c, word, n) == 0)
            return k;
        if (!bar)
            break;
        c = bar + 1;
    }
    return -1;
}

static int get_choice(const rd *r, const config_setting_t *s, const char *what,
                      const char *choices, int *v)
{
    const char *w;
    int rc = get_string(r, s, what, &w);
    if (rc)
        return rc;
    *v = choice(w, choices);
    if (*v < 0)
        return fail_line(r, line_of(s), "%s = \"%s\": expected one of %s", what, w, choices);
    return VL_OK;
}

#define SPACING_CHOICES "linear|log"
const char *const vl_sweep_design_name[] = {"grid", "random", "latin_hypercube", "sobol",
                                            "saltelli"};
const char *const vl_sweep_spacing_name[] = {"linear", "log"};
const char *const vl_sweep_dist_name[] = {"uniform", "log_uniform", "normal", "truncated_normal"};
#define DIST_CHOICES "uniform|log_uniform|normal|truncated_normal"

/* One axis group; design decides which keys belong. */
static int read_axis(const rd *r, const config_setting_t *g, int design, vl_axis *a)
{
    int line = line_of(g);
    if (!config_setting_is_group(g))
        return fail_line(r, line, "sweep.axes: each axis is a group { key = \"...\"; ... }");
    memset(a, 0, sizeof *a);
    a->line = line;
    a->points = 0;
    int grid = design == VL_DESIGN_GRID;
    int have[16] = {0};
    static const char *const grid_keys[] = {"key", "spacing", "from", "to", "points", NULL};
    static const char *const samp_keys[] = {"key", "distribution", "low", "high", "mean", "sd", NULL};
    const char *const *keys = grid ? grid_keys : samp_keys;
    for (int e = 0; e < config_setting_length(g); e++) {
        const config_setting_t *s = config_setting_get_elem(g, (unsigned)e);
        const char *name = config_setting_name(s);
        int k = 0;
        while (keys[k] && strcmp(keys[k], name) != 0)
            k++;
        if (!keys[k])
            return fail_line(r, line_of(s),
                             "sweep.axes: unknown setting '%s' for a %s axis (expected: %s)", name,
                             grid ? "grid" : "sampled",
                             grid ? "key, spacing, from, to, points"
                                  : "key, distribution, low, high, mean, sd");
        have[k] = 1;
        int rc = VL_OK;
        const char *str;
        long pts;
        if (k == 0) {
            rc = get_string(r, s, "sweep.axes.key", &str);
            if (!rc && (strlen(str) == 0 || strlen(str) >= sizeof a->key))
                rc = fail_line(r, line_of(s), "sweep.axes.key: expected a scenario key");
            if (!rc)
                snprintf(a->key, sizeof a->key, "%s", str);
        } else if (grid) {
            if (k == 1)
                rc = get_choice(r, s, "sweep.axes.spacing", SPACING_CHOICES, &a->spacing);
            else if (k == 2)
                rc = get_real(r, s, "sweep.axes.from", &a->from);
            else if (k == 3)
                rc = get_real(r, s, "sweep.axes.to", &a->to);
            else if (!(rc = get_long(r, s, "sweep.axes.points", 1, MAX_MEMBERS, &pts)))
                a->points = pts;
        } else {
            if (k == 1)
                rc = get_choice(r, s, "sweep.axes.distribution", DIST_CHOICES, &a->dist);
            else
                rc = get_real(r, s, keys[k], k == 2 ? &a->low : k == 3 ? &a->high
                                                  : k == 4 ? &a->mean : &a->sd);
        }
        if (rc)
            return rc;
    }
    if (!have[0])
        return fail_line(r, line, "sweep.axes: an axis needs key = \"SCENARIO.KEY\"");
    if (grid) {
        for (int k = 1; k <= 4; k++)
            if (!have[k])
                return fail_line(r, line, "sweep.axes: grid axis '%s' needs %s", a->key, grid_keys[k]);
        return VL_OK;
    }
    if (!have[1])
        return fail_line(r, line, "sweep.axes: sampled axis '%s' needs distribution = \"%s\"",
                         a->key, DIST_CHOICES);
    /* the settings each distribution takes, no more and no fewer */
    static const int uses[4][4] = {{1, 1, 0, 0}, {1, 1, 0, 0}, {0, 0, 1, 1}, {1, 1, 1, 1}};
    for (int k = 2; k <= 5; k++) {
        if (uses[a->dist][k - 2] && !have[k])
            return fail_line(r, line, "sweep.axes: axis '%s' (%s) needs %s", a->key,
                             vl_sweep_dist_name[a->dist], samp_keys[k]);
        if (!uses[a->dist][k - 2] && have[k])
            return fail_line(r, line, "sweep.axes: axis '%s': %s has no meaning for this distribution",
                             a->key, samp_keys[k]);
    }
    return VL_OK;
}

static const char *const top_keys[] = {"design",     "members",    "seed",        "axes",
                                       "catalogue",  "water_to",   "sensitivity", "bootstrap",
                                       "confidence", "o2_rich_bar", NULL};

/* Which settings each mode accepts: design name -> allowed top keys (by index). */
static int allowed(const vl_sweep *sw, int key)
{
    if (key == 9) /* o2_rich_bar */
        return 1;
    if (sw->catalogue_mode)
        return key == 4 || key == 5;
    switch (key) {
    case 0: case 3: return 1;
    case 1: return sw->design != VL_DESIGN_GRID;
    case 2: return sw->design == VL_DESIGN_RANDOM || sw->design == VL_DESIGN_LHS ||
                   sw->design == VL_DESIGN_SALTELLI;
    case 6: case 7: case 8: return sw->design == VL_DESIGN_SALTELLI;
    default: return 0;
    }
}

static int outcome_index(const char *name)
{
    for (int o = 0; o < VL_NOUT; o++)
        if (strcmp(vl_outcome_name[o], name) == 0)
            return o;
    return -1;
}

/* folder of path + rel (rel absolute: as is). */
static void resolve(const char *path, const char *rel, char *out, size_t n)
{
    const char *slash = strrchr(path, '/');
    if (rel[0] == '/' || !slash)
        snprintf(out, n, "%s", rel);
    else
        snprintf(out, n, "%.*s/%s", (int)(slash - path), path, rel);
}

static int read_group(vl_sweep *sw, const config_setting_t *g, vl_status *st)
{
    rd r = {sw->sweep_path, st};
    sw->line = line_of(g);
    const config_setting_t *set[16] = {NULL};
    for (int e = 0; e < config_setting_length(g); e++) {
        const config_setting_t *s = config_setting_get_elem(g, (unsigned)e);
        const char *name = config_setting_name(s);
        int k = 0;
        while (top_keys[k] && strcmp(top_keys[k], name) != 0)
            k++;
        if (!top_keys[k])
            return fail_line(&r, line_of(s),
                             "unknown setting 'sweep.%s' (expected: design, members, seed, axes, "
                             "catalogue, water_to, sensitivity, bootstrap, confidence, "
                             "o2_rich_bar)", name);
        set[k] = s;
    }
    sw->catalogue_mode = set[4] != NULL;
    if (sw->catalogue_mode && (set[0] || set[3]))
        return fail_line(&r, line_of(set[0] ? set[0] : set[3]),
                         "sweep: a catalogue sweep takes no design or axes (one or the other)");
    if (!sw->catalogue_mode) {
        if (!set[0])
            return fail_line(&r, sw->line, "sweep: needs design = \"%s\" (or catalogue = \"FILE\")",
                             VL_DESIGN_CHOICES);
        int rc = get_choice(&r, set[0], "sweep.design", VL_DESIGN_CHOICES, &sw->design);
        if (rc)
            return rc;
    }
    for (int k = 0; top_keys[k]; k++)
        if (set[k] && !allowed(sw, k))
            return fail_line(&r, line_of(set[k]), "sweep.%s has no meaning for %s", top_keys[k],
                             sw->catalogue_mode ? "a catalogue sweep" : "this design");
    int rc = VL_OK;
    sw->seed = 1;
    sw->bootstrap = 200;
    sw->confidence = 0.95;
    sw->o2_rich_bar = 0.1;
    long v;
    if (set[1]) {
        if ((rc = get_long(&r, set[1], "sweep.members", 1, MAX_MEMBERS, &sw->n)))
            return rc;
        sw->members_line = line_of(set[1]);
    } else if (!sw->catalogue_mode && sw->design != VL_DESIGN_GRID) {
        return fail_line(&r, sw->line, "sweep: design \"%s\" needs members = N",
                         vl_sweep_design_name[sw->design]);
    }
    if (set[2]) {
        if ((rc = get_long(&r, set[2], "sweep.seed", 0, 4294967295L, &v)))
            return rc;
        sw->seed = (unsigned long)v;
    }
    if (set[7] && (rc = get_long(&r, set[7], "sweep.bootstrap", 0, 100000, &sw->bootstrap)))
        return rc;
    if (set[8]) {
        if ((rc = get_real(&r, set[8], "sweep.confidence", &sw->confidence)))
            return rc;
        if (!(sw->confidence > 0.0 && sw->confidence < 1.0))
            return fail_line(&r, line_of(set[8]), "sweep.confidence = %g: expected 0 < c < 1",
                             sw->confidence);
    }
    if (set[9]) {
        if ((rc = get_real(&r, set[9], "sweep.o2_rich_bar", &sw->o2_rich_bar)))
            return rc;
        if (!(sw->o2_rich_bar > 0.0))
            return fail_line(&r, line_of(set[9]), "sweep.o2_rich_bar must be positive");
    }
    if (!sw->catalogue_mode) {
        if (!set[3] || !config_setting_is_list(set[3]) || config_setting_length(set[3]) == 0)
            return fail_line(&r, set[3] ? line_of(set[3]) : sw->line,
                             "sweep: needs axes = ( { key = ...; ... }, ... ); a non-empty list");
        int na = config_setting_length(set[3]);
        if (na > MAX_AXES)
            return fail_line(&r, line_of(set[3]), "sweep.axes: at most %d axes", MAX_AXES);
        sw->axes = calloc((size_t)na, sizeof *sw->axes);
        if (!sw->axes)
            return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        sw->k = (size_t)na;
        for (int a = 0; a < na; a++) {
            if ((rc = read_axis(&r, config_setting_get_elem(set[3], (unsigned)a), sw->design,
                                &sw->axes[a])))
                return rc;
            if ((rc = vl_axis_check(&sw->axes[a], sw->design, sw->sweep_path, st)))
                return rc;
            for (int b = 0; b < a; b++)
                if (strcmp(sw->axes[a].key, sw->axes[b].key) == 0)
                    return fail_line(&r, sw->axes[a].line, "sweep.axes: '%s' already set at line %d",
                                     sw->axes[a].key, sw->axes[b].line);
        }
    }
    if (set[5]) {
        if (!config_setting_is_array(set[5]) && !config_setting_is_list(set[5]))
            return fail_line(&r, line_of(set[5]), "sweep.water_to: expected [w1, w2, ...] in TO");
        int nw = config_setting_length(set[5]);
        if (nw < 1 || nw > MAX_WATERS)
            return fail_line(&r, line_of(set[5]), "sweep.water_to: 1 to %d amounts", MAX_WATERS);
        sw->waters = calloc((size_t)nw, sizeof *sw->waters);
        if (!sw->waters)
            return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        sw->nwaters = (size_t)nw;
        for (int w = 0; w < nw; w++) {
            if ((rc = get_real(&r, config_setting_get_elem(set[5], (unsigned)w), "sweep.water_to",
                               &sw->waters[w])))
                return rc;
            if (sw->waters[w] < 0.0)
                return fail_line(&r, line_of(set[5]), "sweep.water_to: amounts must be >= 0 TO");
        }
    }
    if (sw->design == VL_DESIGN_SALTELLI && !sw->catalogue_mode) {
        if (!set[6]) {
            sw->sens[0] = VL_OUT_WATER;
            sw->sens[1] = VL_OUT_O2;
            sw->nsens = 2;
        } else {
            if (!config_setting_is_array(set[6]) && !config_setting_is_list(set[6]))
                return fail_line(&r, line_of(set[6]), "sweep.sensitivity: expected [\"outcome\", ...]");
            for (int e = 0; e < config_setting_length(set[6]); e++) {
                const char *w;
                const config_setting_t *s = config_setting_get_elem(set[6], (unsigned)e);
                if ((rc = get_string(&r, s, "sweep.sensitivity", &w)))
                    return rc;
                int o = outcome_index(w);
                if (o < 0)
                    return fail_line(&r, line_of(set[6]),
                                     "sweep.sensitivity: unknown outcome '%s' (outcomes: "
                                     "final_water_to, water_lost_to, o2_bar, co2_bar, "
                                     "surface_temp_k, surface_pressure_bar, dh_enrichment, "
                                     "runaway_time_yr, moist_time_yr, desiccation_yr, "
                                     "first_runaway_yr, first_moist_yr, first_freeze_yr)", w);
                for (size_t j = 0; j < sw->nsens; j++)
                    if (sw->sens[j] == o)
                        return fail_line(&r, line_of(set[6]), "sweep.sensitivity: '%s' twice", w);
                sw->sens[sw->nsens++] = o;
            }
            if (sw->nsens == 0)
                return fail_line(&r, line_of(set[6]), "sweep.sensitivity: name at least one outcome");
        }
    }
    if (sw->catalogue_mode) {
        const char *file;
        if ((rc = get_string(&r, set[4], "sweep.catalogue", &file)))
            return rc;
        resolve(sw->sweep_path, file, sw->cat_path, sizeof sw->cat_path);
    }
    return VL_OK;
}

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

/* The loader's message without its "--set KEY: " prefix: in a sweep the overrides
 * come from the sweep group or the catalogue, not from the command line. */
static const char *without_set(const char *msg)
{
    if (strncmp(msg, "--set ", 6) != 0)
        return msg;
    const char *colon = strstr(msg, ": ");
    return colon ? colon + 2 : msg;
}

/* Every candidate's values must load onto the base scenario: a key that does not
 * exist or a value out of its bounds is an error at the catalogue's line, before any
 * member runs (docs/catalogue.md). */
static int probe_catalogue(const vl_sweep *sw, vl_status *st)
{
    for (size_t r = 0; r < sw->cat->nrows; r++) {
        char **ov = calloc(sw->cat->ncols + 1, sizeof *ov);
        if (!ov)
            return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        size_t n = vl_catalogue_overrides(sw->cat, r, ov);
        if (n == (size_t)-1) {
            free(ov);
            return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        }
        vl_status e;
        vl_scenario *probe = vl_scenario_load(sw->path, (const char *const *)ov, n, &e);
        vl_sweep_free_overrides(ov, n);
        if (!probe)
            return vl_fail(st, e.code, sw->cat_path, sw->cat->lines[r], "candidate '%s': %s",
                           sw->cat->names[r], without_set(e.msg));
        vl_scenario_free(probe);
    }
    return VL_OK;
}

static int finish_setup(vl_sweep *sw, const vl_scenario *base, vl_status *st)
{
    int rc;
    if (sw->catalogue_mode) {
        sw->cat = vl_catalogue_read(sw->cat_path, st);
        if (!sw->cat)
            return st->code;
        if ((rc = probe_catalogue(sw, st)))
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
    /* every axis must name a scenario key that takes its typical value (the grid's
     * first value, a distribution's centre); single members whose values fall out of
     * bounds fail alone, later */
    for (size_t a = 0; a < sw->k; a++) {
        const vl_axis *x = &sw->axes[a];
        double v = sw->design == VL_DESIGN_GRID       ? x->from
                   : x->dist == VL_DIST_UNIFORM       ? 0.5 * (x->low + x->high)
                   : x->dist == VL_DIST_LOG_UNIFORM   ? sqrt(x->low * x->high)
                   : x->dist == VL_DIST_NORMAL        ? x->mean
                                                      : fmin(fmax(x->mean, x->low), x->high);
        char ov[256];
        snprintf(ov, sizeof ov, "%s=%.17g", x->key, v);
        const char *one[] = {ov};
        vl_status tmp;
        vl_scenario *probe = vl_scenario_load(sw->path, one, 1, &tmp);
        if (!probe)
            return vl_fail(st, VL_ERR_INPUT, sw->sweep_path, x->line, "sweep.axes: axis '%s' at %g: %s",
                           x->key, v, without_set(tmp.msg));
        vl_scenario_free(probe);
    }
    return VL_OK;
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
    int rc = VL_OK;
    if (!base->sweep_line) {
        rc = vl_fail(st, VL_ERR_INPUT, path, 0,
                     "no sweep group: add sweep = { design = ...; axes = (...); }; "
                     "(docs/ensembles.md)");
    } else {
        config_t cfg;
        config_init(&cfg);
        if (!config_read_file(&cfg, path)) {
            rc = vl_fail(st, VL_ERR_INPUT, path, config_error_line(&cfg), "%s",
                         config_error_text(&cfg));
        } else {
            const config_setting_t *g = config_lookup(&cfg, "sweep");
            rc = g ? read_group(sw, g, st)
                   : vl_fail(st, VL_ERR_INTERNAL, path, base->sweep_line, "sweep group vanished");
        }
        config_destroy(&cfg);
    }
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
    c->o[c->n] = fmax(y[VL_R_O2], 0.0) * c->m->planet.pa_per_kg / VL_BAR;
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
            double pa = m->planet.pa_per_kg / VL_BAR;
            double h_per_water = 2.0 * VL_AW_H * 1e-3 / vl_species_molar_mass(VL_SP_H2O);
            const vl_env env = s.env_last; /* the final row's stages */
            res->regime = c.end_regime;
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
