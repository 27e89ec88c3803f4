/* compare_table.c: the rows of `volev compare` (compare.h): the runs' summary quantities
 * and event kinds merged into rows, the summary rows ordered by topic
 * (compare_groups.c), and the derived cells (difference to the first run, ratio to it
 * where both values are resolved). */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "compare.h"
#include "volev/output.h"

typedef vl_compare_row row;
typedef vl_compare_run run;

/* Whether item j of run r and item i of run s are the same row: a quantity by name and
 * unit (a name may come with two units, e.g. a reservoir in kg and in TO), an event by
 * kind. */
typedef int (*same_fn)(const run *r, size_t j, const run *s, size_t i);

static int same_quantity(const run *r, size_t j, const run *s, size_t i)
{
    return strcmp(r->q[j].name, s->q[i].name) == 0 && strcmp(r->q[j].unit, s->q[i].unit) == 0;
}

static int same_event(const run *r, size_t j, const run *s, size_t i)
{
    return strcmp(r->ev[j].name, s->ev[i].name) == 0;
}

/* The row holding run k's item j's counterpart in an earlier run, or -1. */
static long find_row(const row *p, size_t np, const run *runs, int k, size_t j, same_fn same)
{
    for (size_t x = 0; x < np; x++)
        for (int m = 0; m < k; m++)
            if (p[x].idx[m] >= 0 && same(&runs[k], j, &runs[m], (size_t)p[x].idx[m]))
                return (long)x;
    return -1;
}

static row empty_row(void)
{
    row r;
    for (int k = 0; k < VL_COMPARE_MAX_RUNS; k++)
        r.idx[k] = -1;
    r.group = r.rank = 0;
    return r;
}

/* Merge the runs' ordered lists into rows: all of run 0 in its order; an item first met
 * in run k goes right after the row of the item that precedes it in run k, so related
 * rows stay together. count(r) is the length of run r's list. */
static row *merge(const run *runs, int n, size_t (*count)(const run *), same_fn same,
                  size_t *nrows)
{
    size_t total = 1;
    for (int k = 0; k < n; k++)
        total += count(&runs[k]);
    row *p = malloc(total * sizeof *p);
    if (!p)
        return NULL;
    size_t np = 0;
    for (int k = 0; k < n; k++) {
        size_t cursor = 0;
        for (size_t j = 0; j < count(&runs[k]); j++) {
            long x = k ? find_row(p, np, runs, k, j, same) : -1;
            if (x < 0) {
                memmove(&p[cursor + 1], &p[cursor], (np - cursor) * sizeof *p);
                p[cursor] = empty_row();
                x = (long)cursor;
                np++;
            }
            p[x].idx[k] = (long)j;
            cursor = (size_t)x + 1;
        }
    }
    *nrows = np;
    return p;
}

static size_t quantities(const run *r) { return r->nq; }
static size_t event_kinds(const run *r) { return r->nev; }

/* Topic, then rule, then merged order: an insertion sort keeps it stable. */
static void order_by_topic(const vl_compare_table *t, row *p, size_t n)
{
    for (size_t i = 0; i < n; i++) {
        const vl_compare_quantity *q = NULL;
        for (int k = 0; k < t->nruns && !q; k++)
            q = p[i].idx[k] >= 0 ? &t->runs[k].q[p[i].idx[k]] : NULL;
        p[i].group = vl_compare_group_of(q->name, q->unit, &p[i].rank);
    }
    for (size_t i = 1; i < n; i++) {
        row x = p[i];
        size_t j = i;
        while (j > 0 && (p[j - 1].group > x.group ||
                         (p[j - 1].group == x.group && p[j - 1].rank > x.rank))) {
            p[j] = p[j - 1];
            j--;
        }
        p[j] = x;
    }
}

int vl_compare_table_merge(const run *runs, int n, vl_compare_table *t, vl_status *st)
{
    memset(t, 0, sizeof *t);
    t->runs = runs;
    t->nruns = n;
    t->q = merge(runs, n, quantities, same_quantity, &t->nq);
    t->e = merge(runs, n, event_kinds, same_event, &t->ne);
    if (!t->q || !t->e)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    order_by_topic(t, t->q, t->nq);
    return VL_OK;
}

void vl_compare_table_free(vl_compare_table *t)
{
    free(t->q);
    free(t->e);
    t->q = t->e = NULL;
}

const vl_compare_quantity *vl_compare_cell(const vl_compare_table *t, size_t i, int k)
{
    long j = t->q[i].idx[k];
    return j >= 0 ? &t->runs[k].q[j] : NULL;
}

const vl_compare_event *vl_compare_event_cell(const vl_compare_table *t, size_t i, int k)
{
    long j = t->e[i].idx[k];
    return j >= 0 ? &t->runs[k].ev[j] : NULL;
}

/* Run k's value of row i (events: ev), or NULL. */
static const double *value(const vl_compare_table *t, size_t i, int ev, int k)
{
    if (ev) {
        const vl_compare_event *e = vl_compare_event_cell(t, i, k);
        return e ? &e->t : NULL;
    }
    const vl_compare_quantity *q = vl_compare_cell(t, i, k);
    return q ? &q->v : NULL;
}

void vl_compare_difference(const vl_compare_table *t, size_t i, int ev, int k, char *out,
                           size_t n)
{
    const double *a = value(t, i, ev, 0), *b = value(t, i, ev, k);
    out[0] = '\0';
    if (!ev && ((vl_compare_cell(t, i, 0) && vl_compare_cell(t, i, 0)->categorical) ||
                (vl_compare_cell(t, i, k) && vl_compare_cell(t, i, k)->categorical)))
        return; /* a code: no difference */
    if (a && b && isfinite(*a) && isfinite(*b) && isfinite(*b - *a))
        vl_output_number(out, n, "%.10g", *b - *a); /* the output number rule: no -0 */
}

void vl_compare_ratio(const vl_compare_table *t, size_t i, int ev, int k, char *out, size_t n)
{
    const double *a = value(t, i, ev, 0), *b = value(t, i, ev, k);
    out[0] = '\0';
    int resolved = ev ? vl_compare_event_resolved(t, i, 0) && vl_compare_event_resolved(t, i, k)
                      : vl_compare_resolved(t, i, 0) && vl_compare_resolved(t, i, k);
    if (a && b && resolved && isfinite(*b / *a))
        vl_output_number(out, n, "%.10g", *b / *a);
}
