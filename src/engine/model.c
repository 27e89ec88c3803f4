/* model.c: builds a model from a scenario (model.h): the run's constants, star, climate
 * and the process list, with every declared transfer and reaction checked; the per-run
 * workspace; the initial state. The evaluation pipeline is in rhs.c. */
#include "volev/model.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "model_internal.h"
#include "volev/redox_ledger.h"
#include "volev/units.h"

/* A track column replaces keys: xuv_lsun replaces star.xuv.*, teff_k replaces
 * star.teff_k. Setting a replaced key is an error, not a silent no-op. */
static int check_track_keys(const vl_scenario *sc, const vl_star *star, vl_status *st)
{
    int xuv = vl_star_xuv_from_track(star), teff = vl_star_teff_from_track(star);
    for (size_t i = 0; (xuv || teff) && i < vl_param_count(); i++) {
        const vl_param *p;
        void *base;
        const char *prefix;
        vl_param_at(sc, i, &p, &base, &prefix);
        if (prefix[0] != '\0' || sc->origin[i] == VL_FROM_DEFAULT || sc->origin[i] == VL_FROM_MASS)
            continue;
        const char *where = sc->origin[i] == VL_FROM_FILE ? sc->path : NULL;
        if (xuv && strncmp(p->key, "star.xuv.", 9) == 0)
            return vl_fail(st, VL_ERR_INPUT, where, sc->line[i],
                           "%s is not used: the XUV history comes from the xuv_lsun column of %s",
                           p->key, sc->star.track_file);
        if (teff && strcmp(p->key, "star.teff_k") == 0)
            return vl_fail(st, VL_ERR_INPUT, where, sc->line[i],
                           "%s is not used: the effective temperature comes from the teff_k "
                           "column of %s", p->key, sc->star.track_file);
    }
    return VL_OK;
}

static vl_model *out_of_memory(vl_model *m, vl_status *st)
{
    vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    vl_model_free(m);
    return NULL;
}

/* m->sum_order: indices into m->proc in the order of the processes' names (insertion
 * sort: a few tens of entries). */
static void sort_by_name(vl_model *m)
{
    for (size_t i = 0; i < m->nproc; i++)
        m->sum_order[i] = i;
    for (size_t i = 1; i < m->nproc; i++)
        for (size_t j = i; j > 0 && strcmp(m->proc[m->sum_order[j - 1]]->name,
                                           m->proc[m->sum_order[j]]->name) > 0; j--) {
            size_t t = m->sum_order[j];
            m->sum_order[j] = m->sum_order[j - 1];
            m->sum_order[j - 1] = t;
        }
}

/* The redox columns (model.h): one per process that can change the surface's redox
 * content, named into m->redox_names, from column n on; returns the column count. */
static size_t redox_columns(vl_model *m, size_t n)
{
    size_t k = 0;
    for (size_t i = 0; i < m->nproc; i++)
        if (vl_redox_touches_surface(m->proc[i])) {
            if (m->col_name) {
                snprintf(m->redox_names[k], sizeof m->redox_names[k], "redox_%s_kg_s",
                         m->proc[i]->name);
                m->col_name[n + k] = m->redox_names[k];
                m->col_proc[n + k] = i;
            }
            k++;
        }
    return k;
}

/* The output columns: each process's flux columns in list order, then the redox
 * columns. */
static int lay_out_columns(vl_model *m)
{
    size_t n = 0;
    for (size_t i = 0; i < m->nproc; i++)
        n += m->proc[i]->ncolumns;
    size_t nredox = redox_columns(m, n);
    m->nflux = n;
    m->ncolumns = n + nredox;
    m->col_name = calloc(m->ncolumns ? m->ncolumns : 1, sizeof *m->col_name);
    m->col_proc = calloc(m->ncolumns ? m->ncolumns : 1, sizeof *m->col_proc);
    m->redox_names = calloc(nredox ? nredox : 1, sizeof *m->redox_names);
    if (!m->col_name || !m->col_proc || !m->redox_names)
        return 0;
    n = 0;
    for (size_t i = 0; i < m->nproc; i++) {
        m->col_base[i] = n;
        for (size_t c = 0; c < m->proc[i]->ncolumns; c++, n++) {
            m->col_name[n] = m->proc[i]->columns[c].name;
            m->col_proc[n] = i;
        }
    }
    redox_columns(m, n);
    return 1;
}

/* Copy the process list, refusing duplicates, too many processes and unbalanced
 * declarations. */
static int take_processes(vl_model *m, const vl_process *const *procs,
                          const void *const *params, size_t n, vl_status *st)
{
    if (n > VL_MAX_PROCESSES)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "more than %d processes", VL_MAX_PROCESSES);
    m->proc = calloc(n ? n : 1, sizeof *m->proc);
    m->params = calloc(n ? n : 1, sizeof *m->params);
    m->sum_order = calloc(n ? n : 1, sizeof *m->sum_order);
    m->col_base = calloc(n ? n : 1, sizeof *m->col_base);
    if (!m->proc || !m->params || !m->sum_order || !m->col_base)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    for (size_t i = 0; i < n; i++) {
        for (size_t j = 0; j < i; j++)
            if (strcmp(procs[i]->name, procs[j]->name) == 0)
                return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "process '%s' listed twice",
                               procs[i]->name);
        int rc = vl_process_check_declarations(procs[i], st);
        if (rc != VL_OK)
            return rc;
        m->proc[i] = procs[i];
        m->params[i] = params ? params[i] : NULL;
    }
    m->nproc = n;
    sort_by_name(m);
    return VL_OK;
}

vl_model *vl_model_new_with(const vl_scenario *sc, const vl_process *const *procs,
                            const void *const *params, size_t n, vl_status *st)
{
    vl_model *m = calloc(1, sizeof *m);
    if (!m)
        return out_of_memory(m, st);
    m->sc = sc;
    vl_planet_from_scenario(sc, &m->planet);
    m->star = vl_star_new(&sc->star, sc->run.start_s, sc->run.end_s, st);
    if (!m->star || check_track_keys(sc, m->star, st) != VL_OK ||
        !(m->climate = vl_climate_new(sc, st)) ||
        take_processes(m, procs, params, n, st) != VL_OK) {
        vl_model_free(m);
        return NULL;
    }
    if (!lay_out_columns(m))
        return out_of_memory(m, st);
    return m;
}

vl_model *vl_model_new(const vl_scenario *sc, vl_status *st)
{
    const vl_process *procs[VL_MAX_PROCESSES];
    const void *params[VL_MAX_PROCESSES];
    size_t n = 0;
    for (size_t i = 0; i < vl_nprocesses && n < VL_MAX_PROCESSES; i++)
        if (sc->proc[i].enabled) {
            procs[n] = vl_processes[i];
            params[n++] = sc->proc[i].params;
        }
    return vl_model_new_with(sc, procs, params, n, st);
}

void vl_model_free(vl_model *m)
{
    if (!m)
        return;
    vl_star_free(m->star);
    vl_climate_free(m->climate);
    free(m->proc);
    free(m->params);
    free(m->sum_order);
    free(m->col_base);
    free(m->col_name);
    free(m->col_proc);
    free(m->redox_names);
    free(m);
}

/* Whether process p may write reservoir r's entry of its row: r, or r as the deuterium
 * companion, in one of its declared transfers or reaction terms (flux.c writes no other). */
static int may_write(const vl_process *p, int r)
{
    for (size_t k = 0; k < p->ntransfers; k++) {
        int a = p->transfers[k].from, b = p->transfers[k].to;
        if (a == r || b == r || vl_reservoir_deuterium(a) == r || vl_reservoir_deuterium(b) == r)
            return 1;
    }
    for (size_t k = 0; k < p->nreactions; k++)
        for (int q = 0; q < p->reactions[k].n; q++) {
            int a = p->reactions[k].res[q];
            if (a == r || vl_reservoir_deuterium(a) == r)
                return 1;
        }
    return 0;
}

/* w->touch and w->ntouch for m. */
static void touch_lists(const vl_model *m, vl_work *w)
{
    for (int r = 0; r < VL_NRES; r++) {
        w->ntouch[r] = 0;
        for (size_t k = 0; k < m->nproc; k++)
            if (may_write(m->proc[m->sum_order[k]], r))
                w->touch[(size_t)r * m->nproc + w->ntouch[r]++] = m->sum_order[k];
    }
}

vl_work *vl_work_new(const vl_model *m, vl_status *st)
{
    vl_work *w = calloc(1, sizeof *w);
    if (!w) {
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        return NULL;
    }
    w->rows = calloc(m->nproc ? m->nproc : 1, sizeof *w->rows);
    w->touch = calloc((size_t)VL_NRES * (m->nproc ? m->nproc : 1), sizeof *w->touch);
    if (!w->rows || !w->touch) {
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        vl_work_free(w);
        return NULL;
    }
    if (!(w->climate = vl_climate_work_new(m->climate, st))) {
        vl_work_free(w);
        return NULL;
    }
    touch_lists(m, w);
    return w;
}

void vl_work_free(vl_work *w)
{
    if (!w)
        return;
    vl_climate_work_free(w->climate);
    free(w->rows);
    free(w->touch);
    free(w);
}

vl_climate_work *vl_work_climate(vl_work *w) { return w->climate; }

void vl_model_initial_state(const vl_model *m, double y[VL_NSTATE])
{
    const vl_inventory_params *in = &m->sc->inventory;
    double kg_per_pa = 1.0 / m->planet.pa_per_kg;
    memset(y, 0, VL_NSTATE * sizeof y[0]);
    y[VL_R_WATER] = in->surface_water_kg;
    y[VL_R_MANTLE_WATER] = in->mantle_water_kg;
    y[VL_R_CO2] = in->co2_pa * kg_per_pa;
    y[VL_R_N2] = in->n2_pa * kg_per_pa;
    y[VL_R_O2] = in->o2_pa * kg_per_pa;
    y[VL_R_H2] = in->h2_pa * kg_per_pa;
    y[VL_R_CARBONATE] = in->carbonate_pa * kg_per_pa;
    y[VL_R_MANTLE_C] = in->mantle_co2_pa * kg_per_pa;
    y[VL_R_MANTLE_N] = in->mantle_n2_pa * kg_per_pa;
    if (m->sc->interior.magma.molten_start)
        y[VL_S_MANTLE_TP] = m->sc->interior.magma.start_tp_k;
    /* deuterium at the initial D/H in every hydrogen reservoir: kg D = kg H x R m_D/m_H */
    for (int r = 0; r < VL_NRES; r++) {
        int d = vl_reservoir_deuterium(r);
        if (d >= 0)
            y[d] = vl_reservoir_deuterium_kg(r, y[r], in->initial_dh);
    }
    /* then what the processes add, with its own deuterium (process.h) */
    for (size_t i = 0; i < m->nproc; i++)
        if (m->proc[i]->initial)
            m->proc[i]->initial(m->params[i], &m->planet, y);
}
