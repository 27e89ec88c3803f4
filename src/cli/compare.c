/* compare.c: `volev compare DIR_A DIR_B [-o DIR] [--format png|pdf|svg] [--labels A,B]`:
 * two runs side by side. Reads each folder's summary.csv and events.csv and prints a
 * table of every summary quantity (value in A and B, B - A, B / A) and the stellar age
 * at which each kind of event first happened in either run. With -o it also writes
 * DIR/compare.csv (the same table, machine-readable) and DIR/compare.FORMAT, the runs'
 * series.csv drawn on shared axes by plots/comparison.gp. Both files are written under
 * temporary names and renamed into place only when both succeeded. */
#define _XOPEN_SOURCE 700 /* realpath */
#include <ctype.h>
#include <errno.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include "cli.h"
#include "gnuplot.h"
#include "volev/output.h"

enum { LABEL_MAX = 256 };

static const char *const summary_header = "name,value,unit";
static const char *const events_header = "time_yr,event,detail";
/* series.csv columns drawn by plots/comparison.gp (it finds them by name) */
static const char *const figure_columns[] = {"time_yr", "surface_water_to", "p_co2_bar",
                                             "p_o2_bar", "surface_temp_k"};
#define NFIGCOLS (sizeof figure_columns / sizeof figure_columns[0])

/* One row of summary.csv: the value both as written (shown verbatim) and parsed. */
typedef struct quantity {
    char *name, *unit, *text;
    double v;
    int line;
} quantity;

/* The first (earliest) occurrence of one kind of event in events.csv. */
typedef struct event {
    char *name, *text;
    double t;
} event;

typedef struct run {
    const char *dir;            /* borrowed from argv */
    char label[LABEL_MAX];
    char version[128];          /* from summary.csv's "# volev ..." line, "" if absent */
    char hash[64];              /* resolved scenario hash from the same header, "" if absent */
    quantity *q;
    size_t nq, capq;
    event *ev;
    size_t nev, capev;
} run;

/* A row of the merged tables: index into run A's and run B's list, -1 where absent. */
typedef struct pair {
    long a, b;
} pair;

static void run_free(run *r)
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

/* Strip surrounding blanks of s in place; returns the trimmed start. */
static char *trim(char *s)
{
    while (*s == ' ' || *s == '\t')
        s++;
    size_t n = strlen(s);
    while (n > 0 && (s[n - 1] == ' ' || s[n - 1] == '\t'))
        s[--n] = '\0';
    return s;
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

/* Split line at commas in place, at most max fields (the last keeps any further
 * commas); returns the number of fields found had the line been split fully. */
static size_t split(char *line, char **field, size_t max)
{
    size_t n = 0;
    char *s = line;
    for (;;) {
        char *c = strchr(s, ',');
        if (n < max)
            field[n] = s;
        n++;
        if (!c)
            break;
        if (n < max)
            *c = '\0';
        s = c + 1;
    }
    return n;
}

/* A line read by next_line: text without its line ending, 1-based number. */
typedef struct reader {
    FILE *f;
    const char *path;
    char *buf;
    size_t cap;
    int line;
} reader;

/* Next line into r->buf; 1, or 0 at the end of the file, or -1 on a read error. */
static int next_line(reader *r)
{
    ssize_t n = getline(&r->buf, &r->cap, r->f);
    if (n < 0)
        return ferror(r->f) ? -1 : 0;
    r->line++;
    while (n > 0 && (r->buf[n - 1] == '\n' || r->buf[n - 1] == '\r'))
        r->buf[--n] = '\0';
    return 1;
}

static int reader_open(reader *r, const char *path, vl_status *st)
{
    memset(r, 0, sizeof *r);
    r->path = path;
    r->f = fopen(path, "r");
    if (!r->f)
        return vl_fail(st, VL_ERR_IO, path, 0,
                       "cannot open: %s (compare needs the output folders of two `volev run`s)",
                       strerror(errno));
    return VL_OK;
}

static void reader_close(reader *r)
{
    if (r->f)
        fclose(r->f);
    free(r->buf);
}

static int read_error(reader *r, vl_status *st)
{
    return vl_fail(st, VL_ERR_IO, r->path, r->line, "cannot read: %s", strerror(errno));
}

/* Skip '#' comment lines (recording the provenance lines of run rr, if given) and
 * blank lines up to the column header; VL_OK with the header in r->buf, or an error. */
static int read_header(reader *r, const char *what, run *rr, vl_status *st)
{
    static const char ver[] = "# volev ", hash[] = "# resolved scenario hash (FNV-1a 64): ";
    int k;
    while ((k = next_line(r)) > 0) {
        if (r->buf[0] == '#') {
            if (rr && strncmp(r->buf, ver, sizeof ver - 1) == 0)
                snprintf(rr->version, sizeof rr->version, "%s", r->buf + sizeof ver - 1);
            else if (rr && strncmp(r->buf, hash, sizeof hash - 1) == 0)
                snprintf(rr->hash, sizeof rr->hash, "%s", trim(r->buf + sizeof hash - 1));
            continue;
        }
        if (trim(r->buf)[0] == '\0')
            continue;
        return VL_OK;
    }
    if (k < 0)
        return read_error(r, st);
    return vl_fail(st, VL_ERR_INPUT, r->path, 0,
                   "not a volev run %s: no column header line (the file is empty or all "
                   "comments)",
                   what);
}

/* The header line must be exactly `expected`. */
static int expect_header(reader *r, const char *expected, const char *what, vl_status *st)
{
    char *h = trim(r->buf);
    if (strcmp(h, expected) == 0)
        return VL_OK;
    return vl_fail(st, VL_ERR_INPUT, r->path, r->line,
                   "not a volev run %s: header is '%.60s%s', expected '%s'", what, h,
                   strlen(h) > 60 ? "..." : "", expected);
}

static long find_quantity(const run *r, const char *name, const char *unit)
{
    for (size_t i = 0; i < r->nq; i++)
        if (strcmp(r->q[i].name, name) == 0 && strcmp(r->q[i].unit, unit) == 0)
            return (long)i;
    return -1;
}

static long find_event(const run *r, const char *name)
{
    for (size_t i = 0; i < r->nev; i++)
        if (strcmp(r->ev[i].name, name) == 0)
            return (long)i;
    return -1;
}

/* Read DIR/summary.csv: rows name,value,unit. A quantity is identified by its name and
 * unit together (a name may appear with two units, e.g. a reservoir in kg and in TO). */
static int read_summary(run *r, vl_status *st)
{
    char path[VL_PATH_MAX + 32];
    snprintf(path, sizeof path, "%s/summary.csv", r->dir);
    reader rd;
    if (reader_open(&rd, path, st) != VL_OK)
        return st->code;
    int k = 0;
    if (read_header(&rd, "summary", r, st) == VL_OK &&
        expect_header(&rd, summary_header, "summary", st) == VL_OK) {
        while ((k = next_line(&rd)) > 0) {
            if (rd.buf[0] == '#' || trim(rd.buf)[0] == '\0')
                continue;
            char *f[3];
            size_t nf = split(rd.buf, f, 3);
            if (nf != 3) {
                vl_fail(st, VL_ERR_INPUT, path, rd.line,
                        "malformed row: expected 3 fields (name,value,unit), found %zu", nf);
                break;
            }
            char *name = trim(f[0]), *text = trim(f[1]), *unit = trim(f[2]);
            double v;
            if (!*name || !*unit) {
                vl_fail(st, VL_ERR_INPUT, path, rd.line, "malformed row: empty %s",
                        *name ? "unit" : "quantity name");
                break;
            }
            if (parse_number(text, &v) != 0) {
                vl_fail(st, VL_ERR_INPUT, path, rd.line, "value '%s' of %s is not a number", text,
                        name);
                break;
            }
            long dup = find_quantity(r, name, unit);
            if (dup >= 0) {
                vl_fail(st, VL_ERR_INPUT, path, rd.line, "%s (%s) already given on line %d", name,
                        unit, r->q[dup].line);
                break;
            }
            if (reserve((void **)&r->q, &r->capq, r->nq, sizeof *r->q) != 0) {
                oom(st);
                break;
            }
            quantity *q = &r->q[r->nq];
            q->name = strdup(name);
            q->unit = strdup(unit);
            q->text = strdup(text);
            q->v = v;
            q->line = rd.line;
            r->nq++;
            if (!q->name || !q->unit || !q->text) {
                oom(st);
                break;
            }
        }
        if (k < 0 && st->code == VL_OK)
            read_error(&rd, st);
    }
    reader_close(&rd);
    return st->code;
}

/* Read DIR/events.csv: rows time_yr,event,detail (detail may hold commas); keeps the
 * earliest time of each event kind, in the order the kinds first appear. */
static int read_events(run *r, vl_status *st)
{
    char path[VL_PATH_MAX + 32];
    snprintf(path, sizeof path, "%s/events.csv", r->dir);
    reader rd;
    if (reader_open(&rd, path, st) != VL_OK)
        return st->code;
    int k = 0;
    if (read_header(&rd, "event list", NULL, st) == VL_OK &&
        expect_header(&rd, events_header, "event list", st) == VL_OK) {
        while ((k = next_line(&rd)) > 0) {
            if (rd.buf[0] == '#' || trim(rd.buf)[0] == '\0')
                continue;
            char *f[3];
            size_t nf = split(rd.buf, f, 3);
            if (nf < 3) {
                vl_fail(st, VL_ERR_INPUT, path, rd.line,
                        "malformed row: expected 3 fields (time_yr,event,detail), found %zu", nf);
                break;
            }
            char *text = trim(f[0]), *name = trim(f[1]);
            double t;
            if (parse_number(text, &t) != 0) {
                vl_fail(st, VL_ERR_INPUT, path, rd.line, "time_yr '%s' is not a number", text);
                break;
            }
            if (!*name) {
                vl_fail(st, VL_ERR_INPUT, path, rd.line, "malformed row: empty event name");
                break;
            }
            long i = find_event(r, name);
            if (i >= 0) {
                event *e = &r->ev[i];
                if (t < e->t) {
                    char *s = strdup(text);
                    if (!s) {
                        oom(st);
                        break;
                    }
                    free(e->text);
                    e->text = s;
                    e->t = t;
                }
                continue;
            }
            if (reserve((void **)&r->ev, &r->capev, r->nev, sizeof *r->ev) != 0) {
                oom(st);
                break;
            }
            event *e = &r->ev[r->nev++];
            e->name = strdup(name);
            e->text = strdup(text);
            e->t = t;
            if (!e->name || !e->text) {
                oom(st);
                break;
            }
        }
        if (k < 0 && st->code == VL_OK)
            read_error(&rd, st);
    }
    reader_close(&rd);
    return st->code;
}

/* Check DIR/series.csv for the figure: a run's header (first column time_yr) holding
 * every column comparison.gp draws, and data rows with one number per column. */
static int check_series(const run *r, vl_status *st)
{
    char path[VL_PATH_MAX + 32];
    snprintf(path, sizeof path, "%s/series.csv", r->dir);
    reader rd;
    if (reader_open(&rd, path, st) != VL_OK)
        return st->code;
    char **cols = NULL, *header = NULL;
    size_t ncols = 0;
    long rows = 0;
    int k = 0;
    if (read_header(&rd, "series", NULL, st) == VL_OK) {
        header = strdup(trim(rd.buf));
        if (!header) {
            oom(st);
        } else {
            size_t n = split(header, NULL, 0);
            cols = malloc(n * sizeof *cols);
            if (!cols)
                oom(st);
            else
                ncols = split(header, cols, n);
        }
    }
    if (st->code == VL_OK && strcmp(trim(cols[0]), "time_yr") != 0)
        vl_fail(st, VL_ERR_INPUT, path, rd.line,
                "not a volev run series: the header starts with '%.40s', expected 'time_yr'",
                cols[0]);
    for (size_t c = 0; st->code == VL_OK && c < NFIGCOLS; c++) {
        size_t j = 0;
        while (j < ncols && strcmp(trim(cols[j]), figure_columns[c]) != 0)
            j++;
        if (j == ncols)
            vl_fail(st, VL_ERR_INPUT, path, rd.line,
                    "column '%s' (needed for the figure) is missing from the header",
                    figure_columns[c]);
    }
    char **f = NULL;
    if (st->code == VL_OK && !(f = malloc(ncols * sizeof *f)))
        oom(st);
    while (st->code == VL_OK && (k = next_line(&rd)) > 0) {
        if (rd.buf[0] == '#' || trim(rd.buf)[0] == '\0')
            continue;
        size_t nf = split(rd.buf, f, ncols);
        if (nf != ncols) {
            vl_fail(st, VL_ERR_INPUT, path, rd.line,
                    "malformed row: %zu fields, the header has %zu columns", nf, ncols);
            break;
        }
        for (size_t j = 0; j < ncols; j++) {
            double v;
            char *s = trim(f[j]);
            if (parse_number(s, &v) != 0) {
                vl_fail(st, VL_ERR_INPUT, path, rd.line, "%s '%.40s' is not a number",
                        trim(cols[j]), s);
                break;
            }
        }
        rows++;
    }
    if (st->code == VL_OK && k < 0)
        read_error(&rd, st);
    if (st->code == VL_OK && rows == 0)
        vl_fail(st, VL_ERR_INPUT, path, rd.line, "no data rows below the header");
    free(f);
    free(cols);
    free(header);
    reader_close(&rd);
    return st->code;
}

/* Merge two ordered lists into rows: all of A in its order; an item only in B goes
 * right after the item that precedes it in B, so related rows stay together.
 * find_in_a(ra, rb, j) is the index in A of B's item j, or -1. */
static pair *merge(const run *ra, const run *rb, size_t na, size_t nb,
                   long (*find_in_a)(const run *, const run *, size_t), size_t *n)
{
    pair *p = malloc((na + nb + 1) * sizeof *p);
    if (!p)
        return NULL;
    for (size_t i = 0; i < na; i++)
        p[i] = (pair){(long)i, -1};
    size_t np = na, cursor = 0;
    for (size_t j = 0; j < nb; j++) {
        long i = find_in_a(ra, rb, j);
        if (i >= 0) {
            for (size_t k = 0; k < np; k++)
                if (p[k].a == i) {
                    p[k].b = (long)j;
                    cursor = k + 1;
                    break;
                }
        } else {
            memmove(&p[cursor + 1], &p[cursor], (np - cursor) * sizeof *p);
            p[cursor++] = (pair){-1, (long)j};
            np++;
        }
    }
    *n = np;
    return p;
}

static long quantity_in_a(const run *ra, const run *rb, size_t j)
{
    return find_quantity(ra, rb->q[j].name, rb->q[j].unit);
}

static long event_in_a(const run *ra, const run *rb, size_t j)
{
    return find_event(ra, rb->ev[j].name);
}

/* Columns of terminal output: UTF-8 characters, not bytes. */
static int width(const char *s)
{
    int w = 0;
    for (; *s; s++)
        if (((unsigned char)*s & 0xC0) != 0x80)
            w++;
    return w;
}

static void cell(const char *s, int w, int right)
{
    int pad = w - width(s);
    if (right)
        printf("%*s%s", pad > 0 ? pad : 0, "", s);
    else
        printf("%s%*s", s, pad > 0 ? pad : 0, "");
}

static int imax(int a, int b) { return a > b ? a : b; }

static const char *const dash = "\xe2\x80\x94"; /* em dash: no value */

/* B - A and B / A of one summary row as text ("" where not defined). */
static void derived(const quantity *a, const quantity *b, char *diff, char *ratio, size_t n)
{
    diff[0] = ratio[0] = '\0';
    if (!a || !b || !isfinite(a->v) || !isfinite(b->v))
        return;
    snprintf(diff, n, "%.10g", b->v - a->v);
    if (a->v != 0.0)
        snprintf(ratio, n, "%.10g", b->v / a->v);
}

static void print_tables(const run *ra, const run *rb, const pair *qp, size_t nqp,
                         const pair *ep, size_t nep)
{
    char diff[64], ratio[64];
    int wn = (int)strlen("quantity"), wu = (int)strlen("unit");
    int wa = imax(width(ra->label), 1), wb = imax(width(rb->label), 1);
    int wd = (int)strlen("B-A"), wr = (int)strlen("B/A");
    for (size_t i = 0; i < nqp; i++) {
        const quantity *a = qp[i].a >= 0 ? &ra->q[qp[i].a] : NULL;
        const quantity *b = qp[i].b >= 0 ? &rb->q[qp[i].b] : NULL;
        const quantity *any = a ? a : b;
        derived(a, b, diff, ratio, sizeof diff);
        wn = imax(wn, width(any->name));
        wu = imax(wu, width(any->unit));
        wa = imax(wa, a ? width(a->text) : 1);
        wb = imax(wb, b ? width(b->text) : 1);
        wd = imax(wd, width(diff));
        wr = imax(wr, width(ratio));
    }
    int we = (int)strlen("event");
    for (size_t i = 0; i < nep; i++) {
        const event *a = ep[i].a >= 0 ? &ra->ev[ep[i].a] : NULL;
        const event *b = ep[i].b >= 0 ? &rb->ev[ep[i].b] : NULL;
        we = imax(we, width(a ? a->name : b->name));
        wa = imax(wa, a ? width(a->text) : (int)strlen("never"));
        wb = imax(wb, b ? width(b->text) : (int)strlen("never"));
    }
    printf("A: %s (%s)\nB: %s (%s)\n\n", ra->label, ra->dir, rb->label, rb->dir);
    cell("quantity", wn, 0);
    printf("  ");
    cell("unit", wu, 0);
    printf("  ");
    cell(ra->label, wa, 1);
    printf("  ");
    cell(rb->label, wb, 1);
    printf("  ");
    cell("B-A", wd, 1);
    printf("  ");
    cell("B/A", wr, 1);
    printf("\n");
    for (size_t i = 0; i < nqp; i++) {
        const quantity *a = qp[i].a >= 0 ? &ra->q[qp[i].a] : NULL;
        const quantity *b = qp[i].b >= 0 ? &rb->q[qp[i].b] : NULL;
        const quantity *any = a ? a : b;
        derived(a, b, diff, ratio, sizeof diff);
        cell(any->name, wn, 0);
        printf("  ");
        cell(any->unit, wu, 0);
        printf("  ");
        cell(a ? a->text : dash, wa, 1);
        printf("  ");
        cell(b ? b->text : dash, wb, 1);
        printf("  ");
        cell(diff[0] ? diff : dash, wd, 1);
        printf("  ");
        cell(ratio[0] ? ratio : dash, wr, 1);
        printf("\n");
    }
    printf("\nfirst occurrence of each event (stellar age, yr)\n");
    cell("event", imax(we, wn), 0);
    printf("  ");
    cell(ra->label, wa, 1);
    printf("  ");
    cell(rb->label, wb, 1);
    printf("\n");
    for (size_t i = 0; i < nep; i++) {
        const event *a = ep[i].a >= 0 ? &ra->ev[ep[i].a] : NULL;
        const event *b = ep[i].b >= 0 ? &rb->ev[ep[i].b] : NULL;
        cell(a ? a->name : b->name, imax(we, wn), 0);
        printf("  ");
        cell(a ? a->text : "never", wa, 1);
        printf("  ");
        cell(b ? b->text : "never", wb, 1);
        printf("\n");
    }
}

/* s with control characters replaced, for one-line comments. */
static void comment_safe(const char *s, char *out, size_t n)
{
    size_t k = 0;
    for (; *s && k + 1 < n; s++)
        out[k++] = iscntrl((unsigned char)*s) ? '?' : *s;
    out[k] = '\0';
}

static void provenance(FILE *f, const char *key, const run *r)
{
    char label[LABEL_MAX], dir[VL_PATH_MAX];
    comment_safe(r->label, label, sizeof label);
    comment_safe(r->dir, dir, sizeof dir);
    fprintf(f, "# %s = %s: run folder %s (volev %s; resolved scenario hash %s)\n", key, label, dir,
            r->version[0] ? r->version : "unknown", r->hash[0] ? r->hash : "unknown");
}

/* Write compare.csv to path (a temporary name; the caller renames it). */
static int write_csv(const char *path, const run *ra, const run *rb, const pair *qp, size_t nqp,
                     const pair *ep, size_t nep, vl_status *st)
{
    FILE *f = fopen(path, "w");
    if (!f)
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot write: %s", strerror(errno));
    char diff[64], ratio[64];
    fprintf(f, "# volev %s: comparison of two runs\n", vl_version());
    provenance(f, "a", ra);
    provenance(f, "b", rb);
    fprintf(f, "# summary rows: every quantity of either run's summary.csv (quantity and unit "
               "as there), its value in a and b as written there, difference = b - a, "
               "ratio = b / a\n");
    fprintf(f, "# event rows: quantity event:KIND, unit yr: the stellar age of the first "
               "occurrence of KIND in each run's events.csv, difference = b - a, ratio = b / a\n");
    fprintf(f, "# an empty a or b: the run lacks the quantity or never logged the event; an "
               "empty difference or ratio: not defined (a value missing or not finite, or "
               "a = 0)\n");
    fprintf(f, "quantity,unit,a,b,difference,ratio\n");
    for (size_t i = 0; i < nqp; i++) {
        const quantity *a = qp[i].a >= 0 ? &ra->q[qp[i].a] : NULL;
        const quantity *b = qp[i].b >= 0 ? &rb->q[qp[i].b] : NULL;
        const quantity *any = a ? a : b;
        derived(a, b, diff, ratio, sizeof diff);
        fprintf(f, "%s,%s,%s,%s,%s,%s\n", any->name, any->unit, a ? a->text : "",
                b ? b->text : "", diff, ratio);
    }
    for (size_t i = 0; i < nep; i++) {
        const event *a = ep[i].a >= 0 ? &ra->ev[ep[i].a] : NULL;
        const event *b = ep[i].b >= 0 ? &rb->ev[ep[i].b] : NULL;
        diff[0] = ratio[0] = '\0';
        if (a && b && isfinite(a->t) && isfinite(b->t)) {
            snprintf(diff, sizeof diff, "%.10g", b->t - a->t);
            if (a->t != 0.0)
                snprintf(ratio, sizeof ratio, "%.10g", b->t / a->t);
        }
        fprintf(f, "event:%s,yr,%s,%s,%s,%s\n", a ? a->name : b->name, a ? a->text : "",
                b ? b->text : "", diff, ratio);
    }
    if (ferror(f) | fclose(f))
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot write: %s", strerror(errno));
    return VL_OK;
}

/* Write DIR/compare.csv and render DIR/compare.FMT: both under temporary names first,
 * renamed only when both succeeded; on failure nothing is left (DIR removed again if
 * it was created here). */
static int write_outputs(const char *dir, const char *fmt, const run *ra, const run *rb,
                         const pair *qp, size_t nqp, const pair *ep, size_t nep, vl_status *st)
{
    char script[4200];
    if (vl_gnuplot_find_script("comparison.gp", script, sizeof script) != 0)
        return vl_fail(st, VL_ERR_TOOL, NULL, 0,
                       "cannot find plots/comparison.gp (set VOLEV_PLOTS_DIR to the plots "
                       "folder)");
    int created = mkdir(dir, 0777) == 0;
    if (!created && errno != EEXIST)
        return vl_fail(st, VL_ERR_IO, dir, 0, "cannot create output folder: %s", strerror(errno));
    char csv_tmp[VL_PATH_MAX + 64], fig_tmp[VL_PATH_MAX + 64];
    char csv[VL_PATH_MAX + 32], fig[VL_PATH_MAX + 32];
    long pid = (long)getpid();
    snprintf(csv_tmp, sizeof csv_tmp, "%s/.compare.csv.%ld.tmp", dir, pid);
    /* the figure's temporary name keeps the extension: comparison.gp picks the format
     * from it */
    snprintf(fig_tmp, sizeof fig_tmp, "%s/.compare.%ld.tmp.%s", dir, pid, fmt);
    snprintf(csv, sizeof csv, "%s/compare.csv", dir);
    snprintf(fig, sizeof fig, "%s/compare.%s", dir, fmt);
    int renamed_fig = 0;

    if (write_csv(csv_tmp, ra, rb, qp, nqp, ep, nep, st) == VL_OK) {
        /* gnuplot -c comparison.gp OUT TITLE SERIES_A LABEL_A SERIES_B LABEL_B: each an
         * argv word of its own, so labels and paths need no quoting */
        char fa[VL_PATH_MAX + 32], fb[VL_PATH_MAX + 32], title[2 * LABEL_MAX + 8];
        snprintf(fa, sizeof fa, "%s/series.csv", ra->dir);
        snprintf(fb, sizeof fb, "%s/series.csv", rb->dir);
        snprintf(title, sizeof title, "%s and %s", ra->label, rb->label);
        const char *const args[] = {fig_tmp, title, fa, ra->label, fb, rb->label};
        vl_gnuplot_call(script, args, sizeof args / sizeof args[0], st);
    }
    if (st->code == VL_OK) {
        if (rename(fig_tmp, fig) != 0)
            vl_fail(st, VL_ERR_IO, fig, 0, "cannot rename into place: %s", strerror(errno));
        else
            renamed_fig = 1;
    }
    if (st->code == VL_OK && rename(csv_tmp, csv) != 0)
        vl_fail(st, VL_ERR_IO, csv, 0, "cannot rename into place: %s", strerror(errno));
    if (st->code != VL_OK) {
        unlink(csv_tmp);
        unlink(fig_tmp);
        if (renamed_fig)
            unlink(fig);
        if (created)
            rmdir(dir);
        return st->code;
    }
    printf("\noutput: %s, %s\n", csv, fig);
    return VL_OK;
}

/* The last component of path, for a default label; "." and ".." are resolved. */
static void base_name(const char *path, char *out, size_t n)
{
    char buf[VL_PATH_MAX];
    snprintf(buf, sizeof buf, "%s", path);
    size_t len = strlen(buf);
    while (len > 1 && buf[len - 1] == '/')
        buf[--len] = '\0';
    const char *slash = strrchr(buf, '/');
    const char *b = slash && slash[1] ? slash + 1 : buf;
    if (strcmp(b, ".") == 0 || strcmp(b, "..") == 0) {
        char *real = realpath(path, NULL);
        if (real) {
            const char *rs = strrchr(real, '/');
            snprintf(out, n, "%s", rs && rs[1] ? rs + 1 : real);
            free(real);
            return;
        }
    }
    snprintf(out, n, "%s", b);
}

static int has_control(const char *s)
{
    for (; *s; s++)
        if (iscntrl((unsigned char)*s))
            return 1;
    return 0;
}

/* The folder exists and is a folder. */
static int check_dir(const char *dir, vl_status *st)
{
    struct stat sb;
    if (stat(dir, &sb) != 0)
        return vl_fail(st, VL_ERR_IO, dir, 0, "cannot read run folder: %s", strerror(errno));
    if (!S_ISDIR(sb.st_mode))
        return vl_fail(st, VL_ERR_INPUT, dir, 0,
                       "not a folder (compare needs the output folders of two `volev run`s)");
    return VL_OK;
}

int vl_cli_compare(int argc, char **argv)
{
    const char *cmd = argv[0], *dirs[2] = {NULL, NULL}, *out = NULL, *fmt = "png",
               *labels = NULL;
    int ndirs = 0;
    for (int i = 1; i < argc; i++) {
        const char *s = argv[i];
        if (strcmp(s, "--format") == 0 || strcmp(s, "-f") == 0) {
            if (i + 1 >= argc)
                return vl_cli_usage_error(cmd, "%s needs png, pdf or svg", s);
            fmt = argv[++i];
        } else if (strcmp(s, "-o") == 0 || strcmp(s, "--output") == 0) {
            if (i + 1 >= argc)
                return vl_cli_usage_error(cmd, "%s needs a folder", s);
            out = argv[++i];
        } else if (strcmp(s, "--labels") == 0) {
            if (i + 1 >= argc)
                return vl_cli_usage_error(cmd, "--labels needs two names, A,B");
            labels = argv[++i];
        } else if (s[0] == '-' && s[1] != '\0') {
            return vl_cli_usage_error(cmd, "unknown option '%s'", s);
        } else if (ndirs == 2) {
            return vl_cli_usage_error(cmd, "more than two folders ('%s', '%s' and '%s')", dirs[0],
                                      dirs[1], s);
        } else {
            dirs[ndirs++] = s;
        }
    }
    if (ndirs < 2)
        return vl_cli_usage_error(cmd, "%s (two output folders of `volev run`)",
                                  ndirs ? "missing DIR_B" : "missing DIR_A and DIR_B");
    if (strcmp(fmt, "png") && strcmp(fmt, "pdf") && strcmp(fmt, "svg"))
        return vl_cli_usage_error(cmd, "unknown format '%s' (png, pdf or svg)", fmt);
    for (int k = 0; k < 2; k++)
        if (strlen(dirs[k]) >= VL_PATH_MAX - 32 || has_control(dirs[k]))
            return vl_cli_usage_error(cmd, "folder name '%s' is too long or has control characters",
                                      dirs[k]);
    if (out && (strlen(out) >= VL_PATH_MAX - 32 || has_control(out)))
        return vl_cli_usage_error(cmd, "output folder name is too long or has control characters");

    run r[2];
    memset(r, 0, sizeof r);
    for (int k = 0; k < 2; k++)
        r[k].dir = dirs[k];
    if (labels) {
        const char *comma = strchr(labels, ',');
        size_t la = comma ? (size_t)(comma - labels) : 0;
        if (!comma || la == 0 || comma[1] == '\0' || strchr(comma + 1, ',') ||
            has_control(labels) || la >= LABEL_MAX || strlen(comma + 1) >= LABEL_MAX)
            return vl_cli_usage_error(cmd,
                                      "--labels '%s': expected two names separated by one comma, "
                                      "e.g. --labels wet,dry",
                                      labels);
        snprintf(r[0].label, LABEL_MAX, "%.*s", (int)la, labels);
        snprintf(r[1].label, LABEL_MAX, "%s", comma + 1);
    } else {
        for (int k = 0; k < 2; k++)
            base_name(dirs[k], r[k].label, LABEL_MAX);
        /* same base name (x/run, y/run): the paths as given tell them apart */
        if (strcmp(r[0].label, r[1].label) == 0 && strcmp(dirs[0], dirs[1]) != 0)
            for (int k = 0; k < 2; k++)
                snprintf(r[k].label, LABEL_MAX, "%s", dirs[k]);
    }

    vl_status st;
    vl_status_clear(&st);
    for (int k = 0; k < 2 && st.code == VL_OK; k++)
        if (check_dir(r[k].dir, &st) == VL_OK && read_summary(&r[k], &st) == VL_OK)
            read_events(&r[k], &st);
    for (int k = 0; k < 2 && out && st.code == VL_OK; k++)
        check_series(&r[k], &st);

    pair *qp = NULL, *ep = NULL;
    size_t nqp = 0, nep = 0;
    if (st.code == VL_OK) {
        qp = merge(&r[0], &r[1], r[0].nq, r[1].nq, quantity_in_a, &nqp);
        ep = merge(&r[0], &r[1], r[0].nev, r[1].nev, event_in_a, &nep);
        if (!qp || !ep)
            oom(&st);
    }
    if (st.code == VL_OK) {
        print_tables(&r[0], &r[1], qp, nqp, ep, nep);
        if (out)
            write_outputs(out, fmt, &r[0], &r[1], qp, nqp, ep, nep, &st);
    }
    free(qp);
    free(ep);
    run_free(&r[0]);
    run_free(&r[1]);
    return st.code == VL_OK ? VL_OK : vl_cli_report(&st);
}
