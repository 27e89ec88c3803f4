/* sweep_spec.c: the top-level `sweep` group of a scenario -> vl_sweep_spec (sweep_spec.h,
 * docs/ensembles.md), read with the loader's typed reads (scenario_value.c): each
 * setting has a parameter row (type, bounds, choices, default, where it is stored);
 * lists are read element by element with their row. Unknown settings are refused with
 * a suggestion among the group's settings. What the settings mean together is the
 * sweep's to check (src/ensembles/sweep_check.c). */
#include "volev/sweep_spec.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "scenario_internal.h"
#include "volev/design.h"

/* How a setting is written: one value, a list of values of its row, a list of quoted
 * names, a list of axis groups. */
enum shape { SCALAR, NUMBERS, NAMES, AXES };

typedef struct {
    vl_param p;   /* key = the setting's name; for SCALAR and NUMBERS its type, bounds,
                     default and the offset of its storage (of the first element) */
    int shape;
} setting;

/* One row; the value lives in struct s at field. */
#define ROW(s, type, name, unit, def, lo, hi, choices, field, doc)                       \
    {name, type, unit, 1.0, def, lo, hi, choices, "", offsetof(s, field), doc, "", NULL, 0}
#define SPEC(type, name, unit, def, lo, hi, choices, field, doc, shape)                 \
    {ROW(vl_sweep_spec, type, name, unit, def, lo, hi, choices, field, doc), shape}
#define AXIS(type, name, def, lo, hi, choices, field, doc)                                \
    ROW(vl_sweep_axis_spec, type, name, "", def, lo, hi, choices, field, doc)

static const setting settings[VL_SPEC_NKEYS] = {
    [VL_SPEC_DESIGN] = SPEC(VL_PT_CHOICE, "design", "", 0, 0, 0, VL_DESIGN_CHOICES, design,
                            "how the members are chosen", SCALAR),
    [VL_SPEC_MEMBERS] = SPEC(VL_PT_INT, "members", "", 1, 1, (double)VL_DESIGN_MEMBERS_MAX,
                             NULL, members, "samples (saltelli: base samples)", SCALAR),
    [VL_SPEC_SEED] = SPEC(VL_PT_INT, "seed", "", 1, 0, 4294967295.0, NULL, seed,
                          "random generator seed", SCALAR),
    [VL_SPEC_AXES] = SPEC(VL_PT_REAL, "axes", "", 0, 0, 0, NULL, axes,
                          "the inputs that vary: a list of axis groups", AXES),
    [VL_SPEC_CATALOGUE] = SPEC(VL_PT_PATH, "catalogue", "", 0, 0, 0, NULL, catalogue,
                               "CSV of candidate planets", SCALAR),
    [VL_SPEC_WATER_TO] = SPEC(VL_PT_REAL, "water_to", "TO", 0, 0, HUGE_VAL, NULL, water_to,
                              "initial water amounts of each candidate", NUMBERS),
    [VL_SPEC_SENSITIVITY] = SPEC(VL_PT_REAL, "sensitivity", "", 0, 0, 0, NULL, sensitivity,
                                 "outcomes whose Sobol indices are computed", NAMES),
    [VL_SPEC_BOOTSTRAP] = SPEC(VL_PT_INT, "bootstrap", "", 200, 0, 100000, NULL, bootstrap,
                               "bootstrap resamples of the Sobol intervals", SCALAR),
    [VL_SPEC_CONFIDENCE] = SPEC(VL_PT_REAL, "confidence", "", 0.95, 0, 1, NULL, confidence,
                                "level of the Sobol intervals", SCALAR),
    [VL_SPEC_O2_RICH_BAR] = SPEC(VL_PT_REAL, "o2_rich_bar", "bar", 0.1, 0, HUGE_VAL, NULL,
                                 o2_rich_bar, "threshold of the o2_rich class", SCALAR),
};

/* The axis settings; `key` is a quoted scenario key (read as text, not with its row). */
static const vl_param axis_rows[VL_SPEC_AX_NKEYS] = {
    [VL_SPEC_AX_KEY] = AXIS(VL_PT_PATH, "key", 0, 0, 0, NULL, key, "the scenario key it varies"),
    [VL_SPEC_AX_SPACING] = AXIS(VL_PT_CHOICE, "spacing", 0, 0, 0, VL_SPACING_CHOICES, spacing,
                                "grid: linear or logarithmic steps"),
    [VL_SPEC_AX_FROM] = AXIS(VL_PT_REAL, "from", 0, -HUGE_VAL, HUGE_VAL, NULL, from,
                             "grid: first value"),
    [VL_SPEC_AX_TO] = AXIS(VL_PT_REAL, "to", 0, -HUGE_VAL, HUGE_VAL, NULL, to,
                           "grid: last value"),
    [VL_SPEC_AX_POINTS] = AXIS(VL_PT_INT, "points", 1, 1, (double)VL_DESIGN_MEMBERS_MAX, NULL,
                               points, "grid: number of values"),
    [VL_SPEC_AX_DISTRIBUTION] = AXIS(VL_PT_CHOICE, "distribution", 0, 0, 0, VL_DIST_CHOICES,
                                     dist, "sampled: the distribution of the values"),
    [VL_SPEC_AX_LOW] = AXIS(VL_PT_REAL, "low", 0, -HUGE_VAL, HUGE_VAL, NULL, low,
                            "sampled: lower bound"),
    [VL_SPEC_AX_HIGH] = AXIS(VL_PT_REAL, "high", 0, -HUGE_VAL, HUGE_VAL, NULL, high,
                             "sampled: upper bound"),
    [VL_SPEC_AX_MEAN] = AXIS(VL_PT_REAL, "mean", 0, -HUGE_VAL, HUGE_VAL, NULL, mean,
                             "sampled: mean of a normal"),
    [VL_SPEC_AX_SD] = AXIS(VL_PT_REAL, "sd", 0, -HUGE_VAL, HUGE_VAL, NULL, sd,
                           "sampled: standard deviation of a normal"),
};

const char *vl_sweep_spec_name(int k)
{
    return k >= 0 && k < VL_SPEC_NKEYS ? settings[k].p.key : "";
}

const char *vl_sweep_spec_axis_name(int k)
{
    return k >= 0 && k < VL_SPEC_AX_NKEYS ? axis_rows[k].key : "";
}

/* What reading the group needs. */
typedef struct {
    vl_loader *ld;
    vl_sweep_spec *spec;
} reader;

/* The place of setting s in the file (an element without a line of its own: its list's). */
static vl_where where_of(const reader *r, const config_setting_t *s)
{
    while (config_setting_source_line(s) == 0 && config_setting_parent(s))
        s = config_setting_parent(s);
    return (vl_where){r->ld->path, (int)config_setting_source_line(s), NULL};
}

/* Index of name among the count names of name_of, or -1. */
static int index_of(const char *name, const char *(*name_of)(int), int count)
{
    for (int k = 0; k < count; k++)
        if (strcmp(name, name_of(k)) == 0)
            return k;
    return -1;
}

/* A setting of the group PREFIX ("sweep." or "sweep.axes.") that it does not take: the
 * closest of its settings, or the list of them (who: "the sweep group"). */
static int unknown(const reader *r, const config_setting_t *s, const char *prefix,
                   const char *who, const char *(*name_of)(int), int count)
{
    const char *names[VL_SPEC_NKEYS + VL_SPEC_AX_NKEYS];
    char full[VL_SCENARIO_KEY_MAX], hint[VL_SCENARIO_KEY_MAX + 256];
    vl_where w = where_of(r, s);
    for (int k = 0; k < count; k++)
        names[k] = name_of(k);
    snprintf(full, sizeof full, "%s%s", prefix, config_setting_name(s));
    vl_scenario_suggest_among(full, prefix, names, (size_t)count, hint, sizeof hint);
    if (!hint[0]) {
        size_t len = (size_t)snprintf(hint, sizeof hint, " (%s takes:", who);
        for (int k = 0; k < count && len < sizeof hint; k++)
            len += (size_t)snprintf(hint + len, sizeof hint - len, "%s %s", k ? "," : "",
                                    names[k]);
        if (len < sizeof hint)
            snprintf(hint + len, sizeof hint - len, ")");
    }
    return vl_scenario_fail_at(r->ld->st, &w, "unknown %s '%s'%s",
                               config_setting_is_group(s) ? "group" : "key", full, hint);
}

/* Reads the single value s with row p into base + p->offset (+ element index). */
static int read_one(const reader *r, const config_setting_t *s, const vl_param *p, void *base,
                    size_t element, const char *key)
{
    vl_slot t = {p, (char *)base + p->offset, key, NULL};
    if (p->type == VL_PT_REAL)
        t.at = (double *)t.at + element;
    vl_where w = where_of(r, s);
    return vl_scenario_read_value(s, &t, r->ld->dir, &w, r->ld->st);
}

/* The elements of the list or array s, between 1 and max of them (what: "amounts"). */
static int list_length(const reader *r, const config_setting_t *s, const char *key,
                       const char *what, int max, int *n)
{
    vl_where w = where_of(r, s);
    int type = config_setting_type(s);
    if (type != CONFIG_TYPE_LIST && type != CONFIG_TYPE_ARRAY)
        return vl_scenario_fail_at(r->ld->st, &w, "%s must be a list [ ... ] of %s, not %s",
                                   key, what, vl_scenario_type_word(type));
    *n = config_setting_length(s);
    if (*n < 1 || *n > max)
        return vl_scenario_fail_at(r->ld->st, &w, "%s: 1 to %d %s (got %d)", key, max, what, *n);
    return VL_OK;
}

/* sweep.water_to = [w1, w2, ...]: each a number >= 0 in TO. */
static int read_numbers(const reader *r, const config_setting_t *s, const vl_param *p)
{
    int n, rc = list_length(r, s, "sweep.water_to", "amounts in TO", VL_SWEEP_WATERS_MAX, &n);
    for (int j = 0; !rc && j < n; j++)
        rc = read_one(r, config_setting_get_elem(s, (unsigned)j), p, r->spec, (size_t)j,
                      "sweep.water_to");
    if (!rc)
        r->spec->nwater = (size_t)n;
    return rc;
}

/* sweep.sensitivity = ["outcome", ...]: quoted names, kept as written. */
static int read_names(const reader *r, const config_setting_t *s)
{
    const char *key = "sweep.sensitivity";
    int n, rc = list_length(r, s, key, "outcome names", VL_SWEEP_SENS_MAX, &n);
    for (int j = 0; !rc && j < n; j++) {
        const config_setting_t *e = config_setting_get_elem(s, (unsigned)j);
        vl_where w = where_of(r, e);
        rc = vl_scenario_read_text(e, key, "an outcome name", r->spec->sensitivity[j],
                                   VL_SWEEP_NAME_MAX, &w, r->ld->st);
    }
    if (!rc)
        r->spec->nsens = (size_t)n;
    return rc;
}

/* One axis group { key = "..."; ... }. */
static int read_axis(const reader *r, const config_setting_t *g, vl_sweep_axis_spec *a)
{
    vl_where w = where_of(r, g);
    a->line = w.line;
    for (int k = 0; k < VL_SPEC_AX_NKEYS; k++) {
        vl_slot t = {&axis_rows[k], (char *)a + axis_rows[k].offset, "", NULL};
        if (k != VL_SPEC_AX_KEY)
            vl_scenario_store_default(&t);
    }
    for (int e = 0, n = config_setting_length(g); e < n; e++) {
        const config_setting_t *s = config_setting_get_elem(g, (unsigned)e);
        int k = index_of(config_setting_name(s), vl_sweep_spec_axis_name, VL_SPEC_AX_NKEYS);
        char key[64];
        snprintf(key, sizeof key, "sweep.axes.%s", vl_sweep_spec_axis_name(k));
        vl_where at = where_of(r, s);
        int rc = k < 0 ? unknown(r, s, "sweep.axes.", "an axis", vl_sweep_spec_axis_name, VL_SPEC_AX_NKEYS)
                 : k == VL_SPEC_AX_KEY
                     ? vl_scenario_read_text(s, key, "a scenario key", a->key, sizeof a->key,
                                             &at, r->ld->st)
                     : read_one(r, s, &axis_rows[k], a, 0, key);
        if (rc)
            return rc;
        a->at[k] = at.line;
    }
    return VL_OK;
}

/* sweep.axes = ( { ... }, ... ): at most VL_SWEEP_AXES_MAX groups. */
static int read_axes(const reader *r, const config_setting_t *s)
{
    vl_where w = where_of(r, s);
    int type = config_setting_type(s), n = config_setting_length(s);
    if (type != CONFIG_TYPE_LIST)
        return vl_scenario_fail_at(r->ld->st, &w,
                                   "sweep.axes must be a list of axis groups ( { key = ...; "
                                   "... }, ... ), not %s",
                                   vl_scenario_type_word(type));
    if (n > VL_SWEEP_AXES_MAX)
        return vl_scenario_fail_at(r->ld->st, &w, "sweep.axes: at most %d axes (got %d)",
                                   VL_SWEEP_AXES_MAX, n);
    for (int j = 0; j < n; j++) {
        const config_setting_t *g = config_setting_get_elem(s, (unsigned)j);
        vl_where at = where_of(r, g);
        if (!config_setting_is_group(g))
            return vl_scenario_fail_at(r->ld->st, &at,
                                       "sweep.axes: each axis is a group { key = \"...\"; ... }, "
                                       "not %s",
                                       vl_scenario_type_word(config_setting_type(g)));
        int rc = read_axis(r, g, &r->spec->axes[j]);
        if (rc)
            return rc;
    }
    r->spec->naxes = (size_t)n;
    return VL_OK;
}

/* Setting k of the group, written as s. */
static int read_setting(const reader *r, const config_setting_t *s, int k)
{
    char key[64];
    snprintf(key, sizeof key, "sweep.%s", vl_sweep_spec_name(k));
    switch (settings[k].shape) {
    case AXES: return read_axes(r, s);
    case NUMBERS: return read_numbers(r, s, &settings[k].p);
    case NAMES: return read_names(r, s);
    default: return read_one(r, s, &settings[k].p, r->spec, 0, key);
    }
}

/* The defaults of the single-value settings. */
static void store_defaults(vl_sweep_spec *spec)
{
    for (int k = 0; k < VL_SPEC_NKEYS; k++) {
        if (settings[k].shape != SCALAR)
            continue;
        vl_slot t = {&settings[k].p, (char *)spec + settings[k].p.offset, "", NULL};
        vl_scenario_store_default(&t);
    }
}

int vl_sweep_spec_read(vl_loader *ld, const config_setting_t *g, int line)
{
    vl_where w = {ld->path, line, NULL};
    if (!config_setting_is_group(g))
        return vl_scenario_fail_at(ld->st, &w, "'sweep' must be a group: sweep = { ... };");
    reader r = {ld, calloc(1, sizeof(vl_sweep_spec))};
    if (!r.spec)
        return vl_fail(ld->st, VL_ERR_INTERNAL, ld->path, line, "out of memory reading the sweep group");
    ld->sc->sweep = r.spec; /* owned by the scenario from here on, even if reading fails */
    ld->sc->sweep_line = r.spec->line = line;
    store_defaults(r.spec);
    for (int e = 0, n = config_setting_length(g); e < n; e++) {
        const config_setting_t *s = config_setting_get_elem(g, (unsigned)e);
        int k = index_of(config_setting_name(s), vl_sweep_spec_name, VL_SPEC_NKEYS);
        int rc = k < 0 ? unknown(&r, s, "sweep.", "the sweep group", vl_sweep_spec_name, VL_SPEC_NKEYS)
                       : read_setting(&r, s, k);
        if (rc)
            return rc;
        r.spec->at[k] = (int)config_setting_source_line(s);
    }
    return VL_OK;
}
