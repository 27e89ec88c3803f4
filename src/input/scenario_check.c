/* scenario_check.c: the sanity of the parameter tables (once per process) and the
 * checks that need the complete scenario: required keys, needs clauses, consistency
 * between keys, and the check hooks of the enabled processes (scenario_internal.h). */
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <string.h>

#include "scenario_internal.h"
#include "volev/process.h"
#include "volev/units.h"

/* ------------------------------------------------------------------ table sanity */

/* Checks a needs clause "other.key=a|b": other is a CHOICE or BOOL row and every value
 * names one of its states. Fills *other with its index. Returns 0 when well formed. */
static int parse_needs(const char *needs, long *other, const char **values)
{
    char key[VL_SCENARIO_KEY_MAX];
    const char *eq = strchr(needs, '=');
    if (!eq || (size_t)(eq - needs) >= sizeof key || !eq[1])
        return -1;
    memcpy(key, needs, (size_t)(eq - needs));
    key[eq - needs] = '\0';
    *other = vl_scenario_find_key(key);
    *values = eq + 1;
    if (*other < 0)
        return -1;
    const vl_param *q = vl_scenario_param_key((size_t)*other, key, sizeof key);
    char name[128];
    for (int k = 0; vl_choice_name(*values, k, name, sizeof name)[0]; k++) {
        int known = q->type == VL_PT_CHOICE ? vl_choice_index(q->choices, name) >= 0
                    : q->type == VL_PT_BOOL ? vl_choice_index("true|false", name) >= 0
                                            : 0;
        if (!known)
            return -1;
    }
    return 0;
}

/* Problems with the default and bounds of row p for its type, or NULL. */
static const char *type_problem(const vl_param *p)
{
    char name[8];
    switch (p->type) {
    case VL_PT_REAL:
        if (!(isfinite(p->to_si) && p->to_si > 0.0))
            return "to_si is not a positive number";
        /* fall through */
    case VL_PT_INT:
        if (!(p->lo <= p->def && p->def <= p->hi))
            return "default outside its bounds";
        return NULL;
    case VL_PT_BOOL:
        return p->def != 0.0 && p->def != 1.0 ? "boolean default is not 0 or 1" : NULL;
    case VL_PT_CHOICE:
        if (!p->choices || p->def < 0.0 || p->def != floor(p->def) ||
            !vl_choice_name(p->choices, (int)p->def, name, sizeof name)[0])
            return "choice default is not one of its choices";
        return NULL;
    case VL_PT_PATH: return NULL;
    default: return "unknown type";
    }
}

/* Problems with row p's own definition, or NULL. */
static const char *row_problem(const vl_param *p)
{
    const char *values, *why;
    long other;
    if (!p->key || !p->key[0] || p->key[0] == '.' || p->key[strlen(p->key) - 1] == '.' ||
        strstr(p->key, ".."))
        return "malformed key";
    if (!p->doc)
        return "no doc";
    if ((why = type_problem(p)) != NULL)
        return why;
    if (p->needs && parse_needs(p->needs, &other, &values))
        return "needs clause does not name a choice or boolean key and its values";
    return NULL;
}

/* Row i's problem (its own definition, its key's length and uniqueness), or NULL. */
static const char *index_problem(size_t i, const char *key)
{
    const vl_param *p;
    void *base;
    const char *prefix;
    vl_param_at(NULL, i, &p, &base, &prefix);
    const char *why = row_problem(p);
    if (!why && strlen(prefix) + strlen(p->key) >= VL_SCENARIO_CACHE_KEY)
        why = "key too long";
    if (!why && vl_scenario_find_key(key) != (long)i)
        why = "key defined twice";
    if (!why && vl_scenario_is_group(key))
        why = "key is also a group";
    return why;
}

/* Checks every table once: rows well formed, full keys unique and never also a group,
 * process prefixes matching the registry. A failure is a bug: VL_ERR_INTERNAL. */
int vl_scenario_check_tables(vl_status *st)
{
    size_t n = vl_param_count();
    if (n > VL_SCENARIO_CACHE_MAX)
        return vl_fail(st, VL_ERR_INTERNAL, "", 0, "more than %d parameters",
                       VL_SCENARIO_CACHE_MAX);
    char key[VL_SCENARIO_KEY_MAX], other[VL_SCENARIO_KEY_MAX];
    for (size_t i = 0; i < n; i++) {
        vl_scenario_param_key(i, key, sizeof key);
        const char *why = index_problem(i, key);
        if (why)
            return vl_fail(st, VL_ERR_INTERNAL, "", 0, "parameter table, %s: %s", key, why);
    }
    for (size_t k = 0, first = vl_core_nparams; k < vl_nprocesses; k++) {
        const vl_param *p;
        void *base;
        const char *prefix;
        vl_param_at(NULL, first, &p, &base, &prefix);
        snprintf(other, sizeof other, "processes.%s.", vl_processes[k]->name);
        if (strcmp(prefix, other) != 0)
            return vl_fail(st, VL_ERR_INTERNAL, "", 0,
                           "process %s: registry and processes.def disagree",
                           vl_processes[k]->name);
        first += 1 + vl_processes[k]->nparams;
    }
    return VL_OK;
}

/* ------------------------------------------------------------------ cross-checks */

/* Fails with a message located where row i's value came from. */
__attribute__((format(printf, 4, 5)))
int vl_scenario_fail_param(const vl_scenario *sc, size_t i, vl_status *st, const char *fmt, ...)
{
    char key[VL_SCENARIO_KEY_MAX], msg[VL_MSG_MAX];
    vl_scenario_param_key(i, key, sizeof key);
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(msg, sizeof msg, fmt, ap);
    va_end(ap);
    vl_where w = {sc->path, sc->line[i], NULL};
    if (sc->origin[i] == VL_FROM_OVERRIDE)
        w = (vl_where){NULL, 0, key};
    return vl_scenario_fail_at(st, &w, "%s", msg);
}

void vl_scenario_state_text(const vl_scenario *sc, size_t i, char *buf, size_t n)
{
    const vl_param *p;
    const int *v = vl_scenario_slot(sc, i, &p);
    if (p->type == VL_PT_BOOL)
        snprintf(buf, n, "%s", *v ? "true" : "false");
    else
        vl_choice_name(p->choices, *v, buf, n);
}

int vl_scenario_needs_hold(const vl_scenario *sc, size_t i, char *other, size_t on,
                           char *state, size_t sn, const char **values)
{
    const vl_param *p;
    vl_scenario_slot(sc, i, &p);
    long j;
    if (!p->needs || parse_needs(p->needs, &j, values))
        return 1;
    vl_scenario_param_key((size_t)j, other, on);
    vl_scenario_state_text(sc, (size_t)j, state, sn);
    return vl_choice_index(*values, state) >= 0;
}

/* Every row set by the file or an override must be meaningful under its needs clause.
 * One exception: a row of the file made meaningless by a --set of the key it depends on
 * (--set star.luminosity_model=table leaves the file's star.luminosity_lsun unused) is a
 * warning naming both, so a model can be switched from the command line; a file that
 * contradicts itself, or a --set of a row that is not used, stays an error. */
static int check_needs(vl_scenario *sc, vl_status *st)
{
    char key[VL_SCENARIO_KEY_MAX], other[VL_SCENARIO_KEY_MAX], state[128], list[512];
    const char *values;
    for (size_t i = 0, n = vl_param_count(); i < n; i++) {
        if (sc->origin[i] == VL_FROM_DEFAULT ||
            vl_scenario_needs_hold(sc, i, other, sizeof other, state, sizeof state, &values))
            continue;
        vl_scenario_param_key(i, key, sizeof key);
        long ctrl = vl_scenario_find_key(other);
        if (sc->origin[i] == VL_FROM_FILE && ctrl >= 0 && sc->origin[ctrl] == VL_FROM_OVERRIDE) {
            vl_scenario_warn(sc, "%s (line %d) is not used now that --set makes %s %s", key,
                             sc->line[i], other, state);
            continue;
        }
        vl_scenario_list_text(values, "or", list, sizeof list);
        return vl_scenario_fail_param(sc, i, st, "%s is only used when %s is %s (it is %s)", key,
                                      other, list, state);
    }
    return VL_OK;
}

/* Rows marked required must come from the file or an override. */
static int check_required(const vl_scenario *sc, vl_status *st)
{
    char key[VL_SCENARIO_KEY_MAX];
    for (size_t i = 0, n = vl_param_count(); i < n; i++) {
        const vl_param *p = vl_scenario_param_key(i, key, sizeof key);
        if (p->required && sc->origin[i] == VL_FROM_DEFAULT)
            return vl_fail(st, VL_ERR_INPUT, sc->path, 0, "%s must be set (%s)", key, p->doc);
    }
    return VL_OK;
}

/* The largest mean density of a planet, kg/m^3: about twice that of a pure-iron planet
 * of 20 Earth masses, the largest planet.mass_mearth (radius 1.74 Earth radii, about
 * 21 g/cm^3, from the mass-radius fit of Seager et al. 2007, ApJ 669:1279, eq. 23 and
 * table 4; from memory); a smaller iron planet is less compressed, so less dense. There
 * is no lower bound: planets with thick envelopes measure below 0.1 g/cm^3. */
#define DENSITY_MAX 40000.0

/* The planet's mass and radius give a mean density a planet can have. */
static int check_density(const vl_scenario *sc, vl_status *st)
{
    double r = sc->planet.radius_m;
    double rho = sc->planet.mass_kg / (4.0 / 3.0 * VL_PI * r * r * r);
    if (rho <= DENSITY_MAX)
        return VL_OK;
    size_t mass = (size_t)vl_scenario_find_key("planet.mass_mearth");
    size_t radius = (size_t)vl_scenario_find_key("planet.radius_rearth");
    size_t at = sc->origin[radius] != VL_FROM_DEFAULT ? radius : mass;
    return vl_scenario_fail_param(sc, at, st,
                      "planet.mass_mearth = %.6g and planet.radius_rearth = %.6g give a mean "
                      "density of %.3g g/cm^3, above %g g/cm^3: denser than a planet of pure "
                      "iron can be",
                      sc->file_value[mass], sc->file_value[radius], rho / 1000.0,
                      DENSITY_MAX / 1000.0);
}

/* The run ends after it starts; a luminosity table has a file; the planet's density. */
static int check_consistency(const vl_scenario *sc, vl_status *st)
{
    size_t start = (size_t)vl_scenario_find_key("run.start_yr");
    size_t end = (size_t)vl_scenario_find_key("run.end_yr");
    size_t lum = (size_t)vl_scenario_find_key("star.luminosity_model");
    if (!(sc->run.end_s > sc->run.start_s)) {
        size_t at = sc->origin[end] != VL_FROM_DEFAULT ? end : start;
        return vl_scenario_fail_param(sc, at, st, "run.end_yr = %.10g must be later than run.start_yr = %.10g",
                          sc->file_value[end], sc->file_value[start]);
    }
    if (sc->star.luminosity_model == VL_LUM_TABLE && !sc->star.track_file[0])
        return vl_scenario_fail_param(sc, lum, st,
                          "star.luminosity_model is table but star.track_file is not set");
    if (sc->interior.magma.molten_start && sc->climate.model != VL_CLIMATE_COLUMN)
        return vl_scenario_fail_param(sc, (size_t)vl_scenario_find_key("planet.interior.magma_ocean.molten_start"),
                          st, "a molten start needs climate.model = column (the hot surface's "
                              "outgoing radiation comes from the column)");
    return check_density(sc, st);
}

/* The check hook of every enabled process. */
static int run_hooks(const vl_scenario *sc, vl_status *st)
{
    for (size_t k = 0; k < vl_nprocesses; k++) {
        const vl_process *proc = vl_processes[k];
        if (!proc->check || !sc->proc[k].enabled || proc->check(sc->proc[k].params, sc, st) == 0)
            continue;
        if (st->code == VL_OK)
            return vl_fail(st, VL_ERR_INTERNAL, sc->path, 0,
                           "process %s rejected the scenario without a message", proc->name);
        if (!st->file[0])
            snprintf(st->file, sizeof st->file, "%s", sc->path);
        return st->code;
    }
    return VL_OK;
}

int vl_scenario_cross_check(vl_scenario *sc, vl_status *st)
{
    int rc = check_required(sc, st);
    if (!rc)
        rc = check_needs(sc, st);
    if (!rc)
        rc = check_consistency(sc, st);
    if (!rc)
        rc = run_hooks(sc, st);
    return rc;
}
