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

#include "volev/folder.h"
#include "volev/schema.h"
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
    vl_event_firsts events;   /* first time of each kind of event */
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

vl_output *vl_output_open(const char *dir, const vl_model *m, vl_status *st)
{
    vl_output *o = calloc(1, sizeof *o);
    if (!o) {
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        return NULL;
    }
    o->m = m;
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
        vl_folder_temp_name(o->tmp[i], sizeof o->tmp[i], dir, file_name[i]);
        o->f[i] = fopen(o->tmp[i], "w");
        if (!o->f[i]) {
            io_fail(st, o->tmp[i]);
            vl_output_abort(o);
            return NULL;
        }
    }
    header(o, o->f[F_SERIES]);
    vl_series_write_header(o->f[F_SERIES], m);
    header(o, o->f[F_EVENTS]);
    for (int i = 0; i < VL_NEVENT_COLUMNS; i++)
        fprintf(o->f[F_EVENTS], "%s%s", i ? "," : "", vl_event_columns[i].name);
    fputc('\n', o->f[F_EVENTS]);
    return o;
}


double vl_output_dh(const double *y, int r) { return vl_reservoir_dh(y, r); }

size_t vl_output_number(char *buf, size_t n, const char *fmt, double v)
{
    if (n == 0)
        return 0;
    buf[0] = '\0';
    if (!isfinite(v)) /* no value: an empty field */
        return 0;
    int len = snprintf(buf, n, fmt, v == 0.0 ? 0.0 : v); /* -0 as 0 */
    if (len < 0) {
        buf[0] = '\0';
        return 0;
    }
    if (buf[0] == '-' && strtod(buf, NULL) == 0.0) { /* rounded to zero, e.g. "-0.000" */
        memmove(buf, buf + 1, strlen(buf));
        len--;
    }
    return (size_t)len < n ? (size_t)len : n - 1;
}

int vl_output_put(FILE *f, const char *sep, const char *fmt, double v)
{
    char buf[64];
    vl_output_number(buf, sizeof buf, fmt, v);
    return fprintf(f, "%s%s", sep, buf);
}

static int row_cb(void *ctx, double t, const double *y, const double *dydt, const vl_env *env,
                  const double *columns, vl_status *st)
{
    vl_output *o = ctx;
    vl_row r = {t, y, dydt, columns, env, o->m};
    if (vl_series_write_row(o->f[F_SERIES], &r) != 0)
        return io_fail(st, o->tmp[F_SERIES]);
    return VL_OK;
}

static int event_cb(void *ctx, double t, const char *name, const char *detail, vl_status *st)
{
    vl_output *o = ctx;
    vl_event_firsts_note(&o->events, name, t);
    if (vl_output_put(o->f[F_EVENTS], "", "%.10g", t / VL_YR) < 0 ||
        fprintf(o->f[F_EVENTS], ",%s,%s\n", name, detail) < 0)
        return io_fail(st, o->tmp[F_EVENTS]);
    return VL_OK;
}

vl_run_sink vl_output_sink(vl_output *o) { return (vl_run_sink){o, row_cb, event_cb}; }

void vl_output_events(const vl_output *o, vl_event_firsts *out) { *out = o->events; }

/* summary.csv: provenance, the scenario's path, the rows of the schema. */
static void summary(vl_output *o, const vl_run_stats *s)
{
    FILE *f = o->f[F_SUMMARY];
    header(o, f);
    fprintf(f, "# scenario: %s\n", o->m->sc->path);
    vl_summary_write(f, o->m, s, &o->events);
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
