/* sweep_check.c: what the settings of a scenario's sweep group mean together
 * (docs/ensembles.md). The scenario loader has read them (sweep_spec.h: types, bounds,
 * choice names, unknown settings); here: a design or a catalogue and the settings each
 * design takes, what each axis needs, no axis twice, the sensitivity outcomes; then,
 * against the base scenario, that every axis key and every candidate loads. Messages
 * name the scenario file and the setting's line. */
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "sweep_internal.h"
#include "volev/params.h"
#include "volev/text.h"

/* Fails st with an input error at line of the sweep's scenario file. */
__attribute__((format(printf, 4, 5)))
static int fail_line(const vl_sweep *sw, vl_status *st, int line, const char *fmt, ...)
{
    char msg[VL_MSG_MAX];
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(msg, sizeof msg, fmt, ap);
    va_end(ap);
    return vl_fail(st, VL_ERR_INPUT, sw->sweep_path, line, "%s", msg);
}

/* ------------------------------------------------------------------ the mode */

/* 1 if setting k has a meaning for sw's mode (catalogue) or design. */
static int allowed(const vl_sweep *sw, int k)
{
    int d = sw->design;
    if (k == VL_SPEC_O2_RICH_BAR)
        return 1;
    if (sw->catalogue_mode)
        return k == VL_SPEC_CATALOGUE || k == VL_SPEC_WATER_TO;
    switch (k) {
    case VL_SPEC_DESIGN:
    case VL_SPEC_AXES: return 1;
    case VL_SPEC_MEMBERS: return d != VL_DESIGN_GRID;
    case VL_SPEC_SEED: return d == VL_DESIGN_RANDOM || d == VL_DESIGN_LHS || d == VL_DESIGN_SALTELLI;
    case VL_SPEC_SENSITIVITY:
    case VL_SPEC_BOOTSTRAP:
    case VL_SPEC_CONFIDENCE: return d == VL_DESIGN_SALTELLI;
    default: return 0;
    }
}

/* A design or a catalogue (not both), the settings they take, a member count. */
static int check_mode(vl_sweep *sw, const vl_sweep_spec *sp, vl_status *st)
{
    char name[64];
    sw->catalogue_mode = sp->at[VL_SPEC_CATALOGUE] != 0;
    if (sw->catalogue_mode && (sp->at[VL_SPEC_DESIGN] || sp->at[VL_SPEC_AXES]))
        return fail_line(sw, st, sp->at[VL_SPEC_DESIGN] ? sp->at[VL_SPEC_DESIGN] : sp->at[VL_SPEC_AXES],
                         "sweep: a catalogue sweep takes no design or axes (one or the other)");
    if (!sw->catalogue_mode && !sp->at[VL_SPEC_DESIGN])
        return fail_line(sw, st, sw->line, "sweep: needs design = \"%s\" (or catalogue = \"FILE\")",
                         VL_DESIGN_CHOICES);
    sw->design = sw->catalogue_mode ? VL_DESIGN_GRID : sp->design;
    for (int k = 0; k < VL_SPEC_NKEYS; k++)
        if (sp->at[k] && !allowed(sw, k))
            return fail_line(sw, st, sp->at[k], "sweep.%s has no meaning for %s",
                             vl_sweep_spec_name(k),
                             sw->catalogue_mode ? "a catalogue sweep" : "this design");
    if (sp->at[VL_SPEC_MEMBERS]) {
        sw->n = sp->members;
        sw->members_line = sp->at[VL_SPEC_MEMBERS];
    } else if (!sw->catalogue_mode && sw->design != VL_DESIGN_GRID) {
        return fail_line(sw, st, sw->line, "sweep: design \"%s\" needs members = N",
                         vl_choice_name(VL_DESIGN_CHOICES, sw->design, name, sizeof name));
    }
    return VL_OK;
}

/* The numbers: seed, bootstrap, an open confidence interval, a positive threshold. */
static int check_numbers(vl_sweep *sw, const vl_sweep_spec *sp, vl_status *st)
{
    sw->seed = (unsigned long)sp->seed;
    sw->bootstrap = sp->bootstrap;
    sw->confidence = sp->confidence;
    sw->o2_rich_bar = sp->o2_rich_bar;
    if (!(sw->confidence > 0.0 && sw->confidence < 1.0))
        return fail_line(sw, st, sp->at[VL_SPEC_CONFIDENCE],
                         "sweep.confidence = %g: expected 0 < c < 1", sw->confidence);
    if (!(sw->o2_rich_bar > 0.0))
        return fail_line(sw, st, sp->at[VL_SPEC_O2_RICH_BAR], "sweep.o2_rich_bar must be positive");
    return VL_OK;
}

/* ------------------------------------------------------------------ axes */

/* Axis setting k of as, or 0 when it was not written (vl_axis leaves it 0). */
static double written(const vl_sweep_axis_spec *as, int k, double v)
{
    return as->at[k] ? v : 0.0;
}

/* The vl_axis of as. */
static void to_axis(const vl_sweep_axis_spec *as, vl_axis *a)
{
    memset(a, 0, sizeof *a);
    snprintf(a->key, sizeof a->key, "%s", as->key);
    a->line = as->line;
    a->spacing = as->at[VL_SPEC_AX_SPACING] ? as->spacing : 0;
    a->from = written(as, VL_SPEC_AX_FROM, as->from);
    a->to = written(as, VL_SPEC_AX_TO, as->to);
    a->points = as->at[VL_SPEC_AX_POINTS] ? as->points : 0;
    a->dist = as->at[VL_SPEC_AX_DISTRIBUTION] ? as->dist : 0;
    a->low = written(as, VL_SPEC_AX_LOW, as->low);
    a->high = written(as, VL_SPEC_AX_HIGH, as->high);
    a->mean = written(as, VL_SPEC_AX_MEAN, as->mean);
    a->sd = written(as, VL_SPEC_AX_SD, as->sd);
}

/* A grid axis: spacing, from, to, points, and no distribution settings. */
static int check_grid_axis(const vl_sweep *sw, const vl_sweep_axis_spec *as, vl_status *st)
{
    for (int k = VL_SPEC_AX_DISTRIBUTION; k <= VL_SPEC_AX_SD; k++)
        if (as->at[k])
            return fail_line(sw, st, as->at[k],
                             "sweep.axes: axis '%s': %s has no meaning for a grid axis (it "
                             "takes key, spacing, from, to, points)",
                             as->key, vl_sweep_spec_axis_name(k));
    for (int k = VL_SPEC_AX_SPACING; k <= VL_SPEC_AX_POINTS; k++)
        if (!as->at[k])
            return fail_line(sw, st, as->line, "sweep.axes: grid axis '%s' needs %s", as->key,
                             vl_sweep_spec_axis_name(k));
    return VL_OK;
}

/* A sampled axis: a distribution and exactly the settings it takes. */
static int check_sampled_axis(const vl_sweep *sw, const vl_sweep_axis_spec *as, vl_status *st)
{
    /* low, high, mean, sd used by uniform, log_uniform, normal, truncated_normal */
    static const int uses[4][4] = {{1, 1, 0, 0}, {1, 1, 0, 0}, {0, 0, 1, 1}, {1, 1, 1, 1}};
    char design[64], dist[64];
    for (int k = VL_SPEC_AX_SPACING; k <= VL_SPEC_AX_POINTS; k++)
        if (as->at[k])
            return fail_line(sw, st, as->at[k],
                             "sweep.axes: axis '%s': %s has no meaning for a sampled axis "
                             "(design \"%s\")",
                             as->key, vl_sweep_spec_axis_name(k),
                             vl_choice_name(VL_DESIGN_CHOICES, sw->design, design, sizeof design));
    if (!as->at[VL_SPEC_AX_DISTRIBUTION])
        return fail_line(sw, st, as->line, "sweep.axes: sampled axis '%s' needs distribution = \"%s\"",
                         as->key, VL_DIST_CHOICES);
    vl_choice_name(VL_DIST_CHOICES, as->dist, dist, sizeof dist);
    for (int k = VL_SPEC_AX_LOW; k <= VL_SPEC_AX_SD; k++) {
        int used = uses[as->dist][k - VL_SPEC_AX_LOW];
        if (used && !as->at[k])
            return fail_line(sw, st, as->line, "sweep.axes: axis '%s' (%s) needs %s", as->key,
                             dist, vl_sweep_spec_axis_name(k));
        if (!used && as->at[k])
            return fail_line(sw, st, as->at[k],
                             "sweep.axes: axis '%s': %s has no meaning for this distribution",
                             as->key, vl_sweep_spec_axis_name(k));
    }
    return VL_OK;
}

/* Axis j of spec into sw->axes[j]: its settings, its values, no key twice. */
static int check_axis(vl_sweep *sw, const vl_sweep_spec *sp, size_t j, vl_status *st)
{
    const vl_sweep_axis_spec *as = &sp->axes[j];
    if (!as->at[VL_SPEC_AX_KEY])
        return fail_line(sw, st, as->line, "sweep.axes: an axis needs key = \"SCENARIO.KEY\"");
    int rc = sw->design == VL_DESIGN_GRID ? check_grid_axis(sw, as, st)
                                          : check_sampled_axis(sw, as, st);
    if (rc)
        return rc;
    to_axis(as, &sw->axes[j]);
    if ((rc = vl_axis_check(&sw->axes[j], sw->design, sw->sweep_path, st)))
        return rc;
    for (size_t b = 0; b < j; b++)
        if (strcmp(sw->axes[j].key, sw->axes[b].key) == 0)
            return fail_line(sw, st, sw->axes[j].line, "sweep.axes: '%s' already set at line %d",
                             sw->axes[j].key, sw->axes[b].line);
    return VL_OK;
}

/* A design sweep's axes: a non-empty list, each axis complete. */
static int check_axes(vl_sweep *sw, const vl_sweep_spec *sp, vl_status *st)
{
    if (sw->catalogue_mode)
        return VL_OK;
    if (sp->naxes == 0)
        return fail_line(sw, st, sp->at[VL_SPEC_AXES] ? sp->at[VL_SPEC_AXES] : sw->line,
                         "sweep: needs axes = ( { key = ...; ... }, ... ); a non-empty list");
    sw->axes = calloc(sp->naxes, sizeof *sw->axes);
    if (!sw->axes)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    sw->k = sp->naxes;
    for (size_t j = 0; j < sp->naxes; j++) {
        int rc = check_axis(sw, sp, j, st);
        if (rc)
            return rc;
    }
    return VL_OK;
}

/* ------------------------------------------------------------------ lists */

/* Index of an outcome name, or -1. */
static int outcome_index(const char *name)
{
    for (int o = 0; o < VL_NOUT; o++)
        if (strcmp(vl_outcome_name[o], name) == 0)
            return o;
    return -1;
}

/* The outcomes of the Sobol indices (saltelli): as listed, or final water and O2. */
static int check_sensitivity(vl_sweep *sw, const vl_sweep_spec *sp, vl_status *st)
{
    char names[VL_MSG_MAX / 2] = "";
    int line = sp->at[VL_SPEC_SENSITIVITY];
    if (sw->design != VL_DESIGN_SALTELLI || sw->catalogue_mode)
        return VL_OK;
    if (!line) {
        sw->sens[0] = VL_OUT_WATER;
        sw->sens[1] = VL_OUT_O2;
        sw->nsens = 2;
        return VL_OK;
    }
    for (int o = 0; o < VL_NOUT; o++)
        snprintf(names + strlen(names), sizeof names - strlen(names), "%s%s", o ? ", " : "",
                 vl_outcome_name[o]);
    for (size_t j = 0; j < sp->nsens; j++) {
        const char *w = sp->sensitivity[j];
        int o = outcome_index(w);
        if (o < 0)
            return fail_line(sw, st, line, "sweep.sensitivity: unknown outcome '%s' (outcomes: %s)",
                             w, names);
        for (size_t k = 0; k < sw->nsens; k++)
            if (sw->sens[k] == o)
                return fail_line(sw, st, line, "sweep.sensitivity: '%s' twice", w);
        sw->sens[sw->nsens++] = o;
    }
    return VL_OK;
}

/* The catalogue mode's file and water amounts. */
static int check_catalogue(vl_sweep *sw, const vl_sweep_spec *sp, vl_status *st)
{
    if (!sw->catalogue_mode)
        return VL_OK;
    snprintf(sw->cat_path, sizeof sw->cat_path, "%s", sp->catalogue);
    if (sp->nwater == 0)
        return VL_OK;
    sw->waters = malloc(sp->nwater * sizeof *sw->waters);
    if (!sw->waters)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    memcpy(sw->waters, sp->water_to, sp->nwater * sizeof *sw->waters);
    sw->nwaters = sp->nwater;
    return VL_OK;
}

int vl_sweep_check_spec(vl_sweep *sw, const vl_sweep_spec *spec, vl_status *st)
{
    sw->line = spec->line;
    int rc = check_mode(sw, spec, st);
    if (!rc)
        rc = check_numbers(sw, spec, st);
    if (!rc)
        rc = check_axes(sw, spec, st);
    if (!rc)
        rc = check_catalogue(sw, spec, st);
    if (!rc)
        rc = check_sensitivity(sw, spec, st);
    return rc;
}

/* ------------------------------------------------------------------ probes */

/* The loader's message without its "--set KEY: " prefix: in a sweep the overrides
 * come from the sweep group or the catalogue, not from the command line. */
static const char *without_set(const char *msg)
{
    if (strncmp(msg, "--set ", 6) != 0)
        return msg;
    const char *colon = strstr(msg, ": ");
    return colon ? colon + 2 : msg;
}

/* Every column of the catalogue names a parameter: an unknown key is an error at the
 * header's line, not at the first candidate's. */
static int check_columns(const vl_sweep *sw, vl_status *st)
{
    char msg[VL_MSG_MAX], shown[VL_EXCERPT_SIZE];
    for (size_t c = 0; c < sw->cat->ncols; c++)
        if (!vl_scenario_check_key(sw->cat->keys[c], msg, sizeof msg))
            return vl_fail(st, VL_ERR_INPUT, sw->cat_path, sw->cat->header_line,
                           "column '%s': %s",
                           vl_text_excerpt_str(sw->cat->headers[c], shown, sizeof shown), msg);
    return VL_OK;
}

/* Every candidate's values must load onto the base scenario: a key that does not
 * exist or a value out of its bounds is an error at the catalogue's line, before any
 * member runs (docs/catalogue.md). */
int vl_sweep_check_candidates(const vl_sweep *sw, vl_status *st)
{
    int rc = check_columns(sw, st);
    if (rc)
        return rc;
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
        char shown[VL_EXCERPT_SIZE];
        if (!probe)
            return vl_fail(st, e.code, sw->cat_path, sw->cat->lines[r], "candidate '%s': %s",
                           vl_text_excerpt_str(sw->cat->names[r], shown, sizeof shown),
                           without_set(e.msg));
        vl_scenario_free(probe);
    }
    return VL_OK;
}

/* The typical value of an axis: the grid's first value, a distribution's centre. */
static double typical(const vl_sweep *sw, const vl_axis *x)
{
    return sw->design == VL_DESIGN_GRID       ? x->from
           : x->dist == VL_DIST_UNIFORM       ? 0.5 * (x->low + x->high)
           : x->dist == VL_DIST_LOG_UNIFORM   ? sqrt(x->low * x->high)
           : x->dist == VL_DIST_NORMAL        ? x->mean
                                              : fmin(fmax(x->mean, x->low), x->high);
}

/* Every axis must name a scenario key that takes its typical value; single members
 * whose values fall out of bounds fail alone, later. */
int vl_sweep_check_axes(const vl_sweep *sw, vl_status *st)
{
    for (size_t a = 0; a < sw->k; a++) {
        const vl_axis *x = &sw->axes[a];
        double v = typical(sw, x);
        char ov[256];
        snprintf(ov, sizeof ov, "%s=%.17g", x->key, v);
        const char *one[] = {ov};
        vl_status tmp;
        vl_scenario *probe = vl_scenario_load(sw->path, one, 1, &tmp);
        char shown[VL_EXCERPT_SIZE];
        if (!probe)
            return vl_fail(st, VL_ERR_INPUT, sw->sweep_path, x->line,
                           "sweep.axes: axis '%s' at %g: %s",
                           vl_text_excerpt_str(x->key, shown, sizeof shown), v,
                           without_set(tmp.msg));
        vl_scenario_free(probe);
    }
    return VL_OK;
}
