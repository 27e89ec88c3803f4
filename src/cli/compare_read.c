/* compare_read.c: what `volev compare` reads from a run folder (compare.h), through the
 * CSV reader (csv.h), record by record so that a wrong header is reported before any
 * row: summary.csv (name,value,unit; its "# volev ..." and scenario-hash comments),
 * events.csv (time_yr,event,detail, the detail free text that may hold commas) and
 * series.csv (every field a number): its last row gives the final regime, surface
 * temperature and pressure, which summary.csv lacks (rows final:COLUMN), and for the
 * figure it must hold the columns comparison.gp draws. */
#include <errno.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "compare.h"
#include "gnuplot.h"
#include "volev/climate.h"
#include "volev/csv.h"
#include "volev/schema.h"

static const char *const summary_header[] = {"name", "value", "unit"};

/* How each file is read: its name in messages; events.csv's last column takes the rest of
 * the line; series.csv is only checked, row by row, so its size is not limited. */
static const vl_csv_options summary_csv = {0, 0, 0, 0, "run summary", NULL};
static const vl_csv_options events_csv = {VL_CSV_REST, 0, 0, 0, "run event list", NULL};
static const vl_csv_options series_csv = {0, SIZE_MAX, 0, 0, "run series", NULL};

/* The series.csv columns whose last value is the final state, in the order shown. */
static const int final_columns[] = {VL_SER_REGIME, VL_SER_SURFACE_TEMP, VL_SER_P_SURF};
enum { NFINAL = sizeof final_columns / sizeof final_columns[0] };

/* One file being read. */
typedef struct reading {
    vl_compare_run *r;          /* filled (summary, events, the final state) */
    int header_line;            /* 0 before the header */
    long rows;                  /* data rows seen */
    int figure;                 /* series.csv: check the figure's columns too */
    size_t col[NFINAL];         /* series.csv: where the final-state columns are */
    char last[NFINAL][64];      /* ... and their values in the last row */
    int last_line;
} reading;

static int oom(vl_status *st) { return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory"); }

/* Grow *p (elements of size sz, capacity *cap) to hold n + 1 elements. */
static int reserve(void **p, size_t *cap, size_t n, size_t sz)
{
    if (n < *cap)
        return 0;
    size_t nc = *cap ? 2 * *cap : 32;
    void *np = realloc(*p, nc * sz);
    if (!np)
        return -1;
    *p = np;
    *cap = nc;
    return 0;
}

/* Parse s completely as a number (strtod syntax, overflow refused); 0 or -1. */
static int parse_number(const char *s, double *v)
{
    if (!*s)
        return -1;
    char *end;
    errno = 0;
    *v = strtod(s, &end);
    if (*end != '\0' || end == s)
        return -1;
    if (errno == ERANGE && isinf(*v))
        return -1;
    return 0;
}

/* The header of rec must be exactly want[0..n) (what: "summary", "event list"). */
static int expect_header(const vl_csv_record *rec, const char *const *want, size_t n,
                         const char *what, vl_status *st)
{
    int same = rec->n == n;
    for (size_t k = 0; same && k < n; k++)
        same = strcmp(rec->field[k], want[k]) == 0;
    if (same)
        return VL_OK;
    char got[64], expected[64];
    vl_csv_join(rec->field, rec->n, got, sizeof got);
    vl_csv_join((char *const *)want, n, expected, sizeof expected);
    return vl_fail(st, VL_ERR_INPUT, rec->file, rec->line,
                   "not a volev run %s: header is '%s', expected '%s'", what, got, expected);
}

/* The provenance comments above summary.csv's header: version and scenario hash. */
static void provenance(vl_compare_run *r, const char *comment)
{
    static const char ver[] = "# volev ", hash[] = "# resolved scenario hash (FNV-1a 64): ";
    if (strncmp(comment, ver, sizeof ver - 1) == 0) {
        snprintf(r->version, sizeof r->version, "%s", comment + sizeof ver - 1);
    } else if (strncmp(comment, hash, sizeof hash - 1) == 0) {
        const char *h = comment + sizeof hash - 1;
        size_t n = strlen(h);
        while (*h == ' ' || *h == '\t')
            h++, n--;
        while (n > 0 && (h[n - 1] == ' ' || h[n - 1] == '\t'))
            n--;
        snprintf(r->hash, sizeof r->hash, "%.*s", (int)n, h);
    }
}

static long find_quantity(const vl_compare_run *r, const char *name, const char *unit)
{
    for (size_t i = 0; i < r->nq; i++)
        if (strcmp(r->q[i].name, name) == 0 && strcmp(r->q[i].unit, unit) == 0)
            return (long)i;
    return -1;
}

static long find_event(const vl_compare_run *r, const char *name)
{
    for (size_t i = 0; i < r->nev; i++)
        if (strcmp(r->ev[i].name, name) == 0)
            return (long)i;
    return -1;
}

/* Appends a quantity to r (categorical: a code shown by name, no difference or ratio). */
static int add_quantity(vl_compare_run *r, const char *name, const char *unit, const char *text,
                        double v, int line, int categorical, vl_status *st)
{
    if (reserve((void **)&r->q, &r->capq, r->nq, sizeof *r->q) != 0)
        return oom(st);
    vl_compare_quantity *q = &r->q[r->nq++];
    q->name = strdup(name);
    q->unit = strdup(unit);
    q->text = strdup(text);
    q->v = v;
    q->line = line;
    q->categorical = categorical;
    return q->name && q->unit && q->text ? VL_OK : oom(st);
}

/* One row of summary.csv. A quantity is identified by its name and unit together (a name
 * may appear with two units, e.g. a reservoir in kg and in TO). */
static int summary_row(vl_compare_run *r, const vl_csv_record *rec, vl_status *st)
{
    const char *name = rec->field[0], *text = rec->field[1], *unit = rec->field[2];
    double v;
    if (!*name || !*unit)
        return vl_fail(st, VL_ERR_INPUT, rec->file, rec->line, "malformed row: empty %s",
                       *name ? "unit" : "quantity name");
    if (!*text) /* no value (docs/columns.md): kept as NAN, shown empty, no difference */
        v = NAN;
    else if (parse_number(text, &v) != 0)
        return vl_fail(st, VL_ERR_INPUT, rec->file, rec->line,
                       "value '%s' of %s is not a number", text, name);
    long dup = find_quantity(r, name, unit);
    if (dup >= 0)
        return vl_fail(st, VL_ERR_INPUT, rec->file, rec->line, "%s (%s) already given on line %d",
                       name, unit, r->q[dup].line);
    return add_quantity(r, name, unit, text, v, rec->line, 0, st);
}

static int summary_record(void *ctx, const vl_csv_record *rec, vl_status *st)
{
    reading *g = ctx;
    if (rec->kind == VL_CSV_COMMENT && !g->header_line)
        provenance(g->r, rec->field[0]);
    if (rec->kind == VL_CSV_HEADER) {
        g->header_line = rec->line;
        return expect_header(rec, summary_header, 3, "summary", st);
    }
    return rec->kind == VL_CSV_ROW ? summary_row(g->r, rec, st) : VL_OK;
}

/* One row of events.csv: keeps the earliest time of each event kind, in the order the
 * kinds first appear. */
static int events_row(vl_compare_run *r, const vl_csv_record *rec, vl_status *st)
{
    const char *text = rec->field[0], *name = rec->field[1];
    double t;
    if (parse_number(text, &t) != 0)
        return vl_fail(st, VL_ERR_INPUT, rec->file, rec->line, "time_yr '%s' is not a number",
                       text);
    if (!*name)
        return vl_fail(st, VL_ERR_INPUT, rec->file, rec->line, "malformed row: empty event name");
    long i = find_event(r, name);
    if (i >= 0) {
        vl_compare_event *e = &r->ev[i];
        if (!(t < e->t))
            return VL_OK;
        char *s = strdup(text);
        if (!s)
            return oom(st);
        free(e->text);
        e->text = s;
        e->t = t;
        return VL_OK;
    }
    if (reserve((void **)&r->ev, &r->capev, r->nev, sizeof *r->ev) != 0)
        return oom(st);
    vl_compare_event *e = &r->ev[r->nev++];
    e->name = strdup(name);
    e->text = strdup(text);
    e->t = t;
    return e->name && e->text ? VL_OK : oom(st);
}

static int events_record(void *ctx, const vl_csv_record *rec, vl_status *st)
{
    reading *g = ctx;
    if (rec->kind == VL_CSV_HEADER) {
        const char *events_header[VL_NEVENT_COLUMNS];
        for (int i = 0; i < VL_NEVENT_COLUMNS; i++)
            events_header[i] = vl_event_columns[i].name;
        g->header_line = rec->line;
        return expect_header(rec, events_header, VL_NEVENT_COLUMNS, "event list", st);
    }
    return rec->kind == VL_CSV_ROW ? events_row(g->r, rec, st) : VL_OK;
}

/* The index of column name in the header rec, or rec->n. */
static size_t column_index(const vl_csv_record *rec, const char *name)
{
    size_t j = 0;
    while (j < rec->n && strcmp(rec->field[j], name) != 0)
        j++;
    return j;
}

/* series.csv's header: a run's (first column time_yr) with the final-state columns and,
 * for the figure, every column it draws. */
static int series_header(reading *g, const vl_csv_record *rec, vl_status *st)
{
    const char *need[VL_NSERIES + 1];
    size_t nneed = g->figure ? vl_gnuplot_column_names(vl_gnuplot_comparison_columns, need,
                                                       VL_NSERIES + 1)
                             : 0;
    if (strcmp(rec->field[0], vl_series_name(VL_SER_TIME)) != 0)
        return vl_fail(st, VL_ERR_INPUT, rec->file, rec->line,
                       "not a volev run series: the header starts with '%.40s', expected "
                       "'time_yr'", rec->field[0]);
    for (size_t c = 0; c < nneed; c++)
        if (column_index(rec, need[c]) == rec->n)
            return vl_fail(st, VL_ERR_INPUT, rec->file, rec->line,
                           "column '%s' (needed for the figure) is missing from the header",
                           need[c]);
    for (int c = 0; c < NFINAL; c++) {
        const char *name = vl_series_name(final_columns[c]);
        g->col[c] = column_index(rec, name);
        if (g->col[c] == rec->n)
            return vl_fail(st, VL_ERR_INPUT, rec->file, rec->line,
                           "column '%s' (needed for the final state) is missing from the "
                           "header", name);
    }
    return VL_OK;
}

static int series_record(void *ctx, const vl_csv_record *rec, vl_status *st)
{
    reading *g = ctx;
    if (rec->kind == VL_CSV_HEADER) {
        g->header_line = rec->line;
        return series_header(g, rec, st);
    }
    if (rec->kind != VL_CSV_ROW)
        return VL_OK;
    for (size_t j = 0; j < rec->n; j++) {
        double v;
        if (*rec->field[j] && parse_number(rec->field[j], &v) != 0) /* empty: no value */
            return vl_fail(st, VL_ERR_INPUT, rec->file, rec->line, "%s '%.40s' is not a number",
                           rec->header[j], rec->field[j]);
    }
    for (int c = 0; c < NFINAL; c++)
        snprintf(g->last[c], sizeof g->last[c], "%s", rec->field[g->col[c]]);
    g->last_line = rec->line;
    g->rows++;
    return VL_OK;
}

/* The final state from the last row of series.csv: final:regime (by name) and the
 * others as written. */
static int final_state(vl_compare_run *r, const reading *g, vl_status *st)
{
    for (int c = 0; c < NFINAL; c++) {
        const vl_series_column *col = &vl_series_columns[final_columns[c]];
        char name[96];
        double v = strtod(g->last[c], NULL);
        snprintf(name, sizeof name, "final:%s", col->name);
        int regime = final_columns[c] == VL_SER_REGIME;
        if (regime && !(v >= 0 && v < VL_NREGIMES && v == (int)v)) {
            char path[VL_PATH_MAX + 32];
            snprintf(path, sizeof path, "%s/series.csv", r->dir);
            return vl_fail(st, VL_ERR_INPUT, path, g->last_line,
                           "regime '%s' of the last row is not a regime code", g->last[c]);
        }
        const char *text = regime ? vl_regime_name((int)v) : g->last[c];
        if (add_quantity(r, name, regime ? "name" : col->unit, text, v, g->last_line, regime,
                         st) != VL_OK)
            return st->code;
    }
    return VL_OK;
}

/* Reads DIR/name with fn into g; a file that cannot be opened says what compare needs,
 * one without a header is not a run's (what: "summary", ...). */
static int read_file(const char *dir, const char *name, const char *what,
                     const vl_csv_options *o, vl_csv_fn fn, reading *g, vl_status *st)
{
    char path[VL_PATH_MAX + 32];
    snprintf(path, sizeof path, "%s/%s", dir, name);
    int rc = vl_csv_scan(path, o, fn, g, st);
    if (rc == VL_ERR_IO && strncmp(st->msg, "cannot open", 11) == 0) {
        size_t used = strlen(st->msg);
        snprintf(st->msg + used, sizeof st->msg - used,
                 " (compare needs the output folders of `volev run`s)");
    }
    if (rc == VL_OK && !g->header_line)
        rc = vl_fail(st, VL_ERR_INPUT, path, 0,
                     "not a volev run %s: no column header line (the file is empty or all "
                     "comments)", what);
    if (rc == VL_OK && fn == series_record && g->rows == 0)
        rc = vl_fail(st, VL_ERR_INPUT, path, g->header_line, "no data rows below the header");
    return rc;
}

int vl_compare_read_run(vl_compare_run *r, vl_status *st)
{
    reading g = {.r = r};
    int rc = read_file(r->dir, "summary.csv", "summary", &summary_csv, summary_record, &g, st);
    if (rc)
        return rc;
    g = (reading){.r = r};
    return read_file(r->dir, "events.csv", "event list", &events_csv, events_record, &g, st);
}

int vl_compare_read_series(vl_compare_run *r, int figure, vl_status *st)
{
    reading g = {r, 0, 0, figure, {0}, {{0}}, 0};
    if (read_file(r->dir, "series.csv", "series", &series_csv, series_record, &g, st) != VL_OK)
        return st->code;
    return final_state(r, &g, st);
}

void vl_compare_read_free(vl_compare_run *r)
{
    for (size_t i = 0; i < r->nq; i++) {
        free(r->q[i].name);
        free(r->q[i].unit);
        free(r->q[i].text);
    }
    for (size_t i = 0; i < r->nev; i++) {
        free(r->ev[i].name);
        free(r->ev[i].text);
    }
    free(r->q);
    free(r->ev);
}
