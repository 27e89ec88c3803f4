/* sweep.c: a sweep of one base scenario (sweep.h, docs/ensembles.md): loading it (the
 * scenario with its sweep group, whose meaning sweep_check.c checks), the members of its
 * design or catalogue, the common sample ages and the sweep hash. The module's other
 * files are listed in sweep_internal.h. */
#include "volev/sweep.h"

#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "volev/output.h"
#include "sweep_internal.h"

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

/* Text t and its terminating NUL into the hash (so "ab","c" and "a","bc" differ); an
 * empty cell (NULL) as a lone 0x01, which no cell text holds. */
static uint64_t hash_text(const char *t, uint64_t h)
{
    return t ? vl_output_fnv1a(t, strlen(t) + 1, h) : vl_output_fnv1a("\1", 1, h);
}

/* The catalogue as read (vl_catalogue_read bounded the file): its keys, then every
 * candidate's name and cells. The parsed content, not a second read of the file, so the
 * hash describes exactly the members this sweep runs. */
static uint64_t hash_catalogue(const vl_catalogue *c, uint64_t h)
{
    for (size_t k = 0; k < c->ncols; k++)
        h = hash_text(c->keys[k], h);
    for (size_t r = 0; r < c->nrows; r++) {
        h = hash_text(c->names[r], h);
        for (size_t k = 0; k < c->ncols; k++)
            h = hash_text(c->cells[r][k], h);
    }
    return h;
}

/* Catalogue mode: the candidates (each must load onto the base scenario), times the
 * water amounts. */
static int catalogue_members(vl_sweep *sw, vl_status *st)
{
    sw->cat = vl_catalogue_read(sw->cat_path, st);
    if (!sw->cat)
        return st->code;
    int rc = vl_sweep_check_candidates(sw, st);
    if (rc)
        return rc;
    long per = sw->nwaters ? (long)sw->nwaters : 1;
    sw->members = (long)sw->cat->nrows * per;
    return VL_OK;
}

/* Design mode: the member count and the design's values (members x k). */
static int design_members(vl_sweep *sw, vl_status *st)
{
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
    return vl_design_generate(sw->design, sw->axes, sw->k, sw->n, sw->seed, sw->x, st);
}

/* The sweep hash: FNV-1a of the version, the resolved base scenario, the settings and
 * the catalogue's content. */
static int sweep_hash(vl_sweep *sw, const vl_scenario *base, vl_status *st)
{
    char base_hash[17], spec[1 << 14];
    int rc = vl_output_scenario_hash(base, base_hash, st);
    if (rc)
        return rc;
    if (spec_text(sw, spec, sizeof spec) < 0)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "sweep settings too long to hash");
    uint64_t h = vl_output_fnv1a(vl_version(), strlen(vl_version()), VL_FNV_OFFSET);
    h = vl_output_fnv1a(base_hash, 16, h);
    h = vl_output_fnv1a(spec, strlen(spec), h);
    if (sw->catalogue_mode)
        h = hash_catalogue(sw->cat, h);
    snprintf(sw->hash, sizeof sw->hash, "%016llx", (unsigned long long)h);
    return VL_OK;
}

/* The members, the sample ages (log-spaced over the base run), the hash; then every
 * axis key is tried on the base scenario. */
static int finish_setup(vl_sweep *sw, const vl_scenario *base, vl_status *st)
{
    int rc = sw->catalogue_mode ? catalogue_members(sw, st) : design_members(sw, st);
    if (rc)
        return rc;
    double t0 = base->run.start_s, t1 = base->run.end_s;
    for (int j = 0; j < VL_SWEEP_NT; j++)
        sw->t_grid_s[j] = j == VL_SWEEP_NT - 1 ? t1 : t0 * pow(t1 / t0, (double)j / (VL_SWEEP_NT - 1));
    if ((rc = sweep_hash(sw, base, st)))
        return rc;
    return vl_sweep_check_axes(sw, st);
}

/* The base scenario (with its sweep group), the settings' meaning, the set-up. */
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

/* Frees sw and what it owns; accepts NULL. */
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

