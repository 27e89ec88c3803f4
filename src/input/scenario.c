/* scenario.c: scenario files (libconfig 1.5) -> struct vl_scenario: the life cycle of a
 * scenario (defaults, load, parse, free). The loader's other parts are listed in
 * scenario_internal.h: the parameter index, typed values, the pre-scan, the file walk,
 * the sweep group, overrides, the cross-checks, the resolved writer and the listing.
 *
 * Everything is driven by the global parameter index of params.c: a setting is
 * accepted only if its full dotted key names a row there, or a group that some row
 * lives in (or is the top-level `sweep` group). Values are checked in file units and
 * stored in SI. */
#include "volev/scenario.h"

#include <stdarg.h>
#include <pthread.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "scenario_internal.h"
#include "volev/process.h"

/* A scenario holding every default (NULL if out of memory). */
vl_scenario *vl_scenario_new(void)
{
    size_t n = vl_param_count();
    vl_scenario *sc = calloc(1, sizeof *sc);
    if (!sc)
        return NULL;
    sc->proc = calloc(vl_nprocesses ? vl_nprocesses : 1, sizeof *sc->proc);
    sc->origin = calloc(n, sizeof *sc->origin);
    sc->line = calloc(n, sizeof *sc->line);
    sc->file_value = calloc(n, sizeof *sc->file_value);
    int ok = sc->proc && sc->origin && sc->line && sc->file_value;
    for (size_t k = 0; ok && k < vl_nprocesses; k++) {
        size_t size = vl_processes[k]->params_size;
        sc->proc[k].params = calloc(1, size ? size : 1);
        ok = sc->proc[k].params != NULL;
    }
    if (!ok) {
        vl_scenario_free(sc);
        return NULL;
    }
    for (size_t i = 0; i < n; i++) {
        vl_slot t = vl_scenario_row_slot(sc, i);
        vl_scenario_store_default(&t);
        vl_scenario_mark(sc, i, VL_FROM_DEFAULT, 0);
    }
    return sc;
}

/* Frees everything sc owns; accepts NULL. */
void vl_scenario_free(vl_scenario *sc)
{
    if (!sc)
        return;
    for (size_t k = 0; sc->proc && k < vl_nprocesses; k++)
        free(sc->proc[k].params);
    free(sc->proc);
    free(sc->origin);
    free(sc->line);
    free(sc->file_value);
    free(sc->sweep);
    free(sc);
}

/* sc->path as given and sc->name: the file name without folder and extension. */
static int set_identity(vl_scenario *sc, const char *path, vl_status *st)
{
    if (strlen(path) >= sizeof sc->path)
        return vl_fail(st, VL_ERR_INPUT, "", 0, "scenario path longer than %zu bytes",
                       sizeof sc->path - 1);
    snprintf(sc->path, sizeof sc->path, "%s", path);
    const char *base = strrchr(path, '/');
    base = base ? base + 1 : path;
    const char *dot = strrchr(base, '.');
    int len = dot && dot != base ? (int)(dot - base) : (int)strlen(base);
    snprintf(sc->name, sizeof sc->name, "%.*s", len, base);
    return VL_OK;
}

/* The table check once per process (the tables are constant): its result is kept. */
static vl_status tables_status;
static pthread_once_t tables_once = PTHREAD_ONCE_INIT;
static void check_tables_once(void)
{
    vl_status_clear(&tables_status);
    vl_scenario_check_tables(&tables_status);
}

/* The table check, a scenario of defaults and its identity (path or label); NULL with
 * st filled on error. */
static vl_scenario *begin(const char *label, vl_status *st)
{
    vl_status_clear(st);
    pthread_once(&tables_once, check_tables_once);
    if (tables_status.code != VL_OK) {
        *st = tables_status;
        return NULL;
    }
    vl_scenario *sc = vl_scenario_new();
    if (!sc) {
        vl_fail(st, VL_ERR_INTERNAL, label, 0, "out of memory");
        return NULL;
    }
    if (set_identity(sc, label, st)) {
        vl_scenario_free(sc);
        return NULL;
    }
    return sc;
}

/* After the text was read with result rc: the overrides in order, the star's values
 * from its mass (scenario_star.c), then the cross-checks; frees sc and returns NULL on any error. */
static vl_scenario *finish(vl_scenario *sc, int rc, const char *const *overrides,
                           size_t n_overrides, vl_status *st)
{
    for (size_t k = 0; !rc && k < n_overrides; k++)
        rc = vl_scenario_override(sc, overrides[k], st);
    if (!rc)
        rc = vl_scenario_derive_star(sc, st);
    if (!rc)
        rc = vl_scenario_cross_check(sc, st);
    if (!rc)
        vl_scenario_advise(sc);
    if (rc) {
        vl_scenario_free(sc);
        return NULL;
    }
    return sc;
}

/* Defaults, then the file, then the overrides in order, then the cross-checks. */
vl_scenario *vl_scenario_load(const char *path, const char *const *overrides, size_t n_overrides,
                              vl_status *st)
{
    vl_scenario *sc = begin(path, st);
    return sc ? finish(sc, vl_scenario_read_file(sc, st), overrides, n_overrides, st) : NULL;
}

/* The same from memory: defaults, the text (relative paths against the current folder),
 * the cross-checks. */
vl_scenario *vl_scenario_parse(const char *text, size_t len, const char *label, vl_status *st)
{
    if (!label)
        label = "(text)";
    if (!text && len > 0) {
        vl_status_clear(st);
        vl_fail(st, VL_ERR_INTERNAL, label, 0, "vl_scenario_parse: no text");
        return NULL;
    }
    vl_scenario *sc = begin(label, st);
    if (!sc)
        return NULL;
    char cwd[VL_PATH_MAX];
    int rc = vl_scenario_current_dir(cwd, sizeof cwd, st);
    if (!rc)
        rc = vl_scenario_read_memory(sc, text ? text : "", len, cwd, st);
    return finish(sc, rc, NULL, 0, st);
}

void vl_scenario_warn(vl_scenario *sc, const char *fmt, ...)
{
    size_t n = sizeof sc->warnings[0];
    if (sc->nwarnings >= VL_SCENARIO_WARNINGS) {
        snprintf(sc->warnings[VL_SCENARIO_WARNINGS - 1], n, "and %d more warnings",
                 ++sc->nwarnings - VL_SCENARIO_WARNINGS + 1);
        return;
    }
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(sc->warnings[sc->nwarnings++], n, fmt, ap);
    va_end(ap);
}
