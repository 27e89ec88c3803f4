/* compare_table.c: the table of `volev compare` (compare.h): the two runs' summary
 * quantities and event kinds merged into rows, and printed with B - A and B / A. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "compare.h"
#include "volev/output.h"

typedef vl_compare_pair pair;
typedef vl_compare_run run;

static const char *const dash = "\xe2\x80\x94"; /* em dash: no value */

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
    for (size_t i = 0; i < ra->nq; i++)
        if (strcmp(ra->q[i].name, rb->q[j].name) == 0 && strcmp(ra->q[i].unit, rb->q[j].unit) == 0)
            return (long)i;
    return -1;
}

static long event_in_a(const run *ra, const run *rb, size_t j)
{
    for (size_t i = 0; i < ra->nev; i++)
        if (strcmp(ra->ev[i].name, rb->ev[j].name) == 0)
            return (long)i;
    return -1;
}

int vl_compare_table_merge(const run *a, const run *b, vl_compare_table *t, vl_status *st)
{
    memset(t, 0, sizeof *t);
    t->a = a;
    t->b = b;
    t->q = merge(a, b, a->nq, b->nq, quantity_in_a, &t->nq);
    t->e = merge(a, b, a->nev, b->nev, event_in_a, &t->ne);
    if (!t->q || !t->e)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    return VL_OK;
}

void vl_compare_table_free(vl_compare_table *t)
{
    free(t->q);
    free(t->e);
    t->q = t->e = NULL;
}

void vl_compare_table_derived(const double *a, const double *b, char *diff, char *ratio,
                              size_t n)
{
    diff[0] = ratio[0] = '\0';
    if (!a || !b || !isfinite(*a) || !isfinite(*b))
        return;
    vl_output_number(diff, n, "%.10g", *b - *a); /* the output number rule: no -0 */
    if (*a != 0.0)
        vl_output_number(ratio, n, "%.10g", *b / *a);
}

/* ---------------------------------------------------------------- printing */

/* Columns of terminal output: UTF-8 characters, not bytes. */
static int width(const char *s)
{
    int w = 0;
    for (; *s; s++)
        if (((unsigned char)*s & 0xC0) != 0x80)
            w++;
    return w;
}

/* s padded to w columns, right-aligned if right, then sep. */
static void cell(const char *s, int w, int right, const char *sep)
{
    int pad = w - width(s);
    if (right)
        printf("%*s%s%s", pad > 0 ? pad : 0, "", s, sep);
    else
        printf("%s%*s%s", s, pad > 0 ? pad : 0, "", sep);
}

static int imax(int a, int b) { return a > b ? a : b; }

/* Widths of the printed columns: quantity, unit, A, B, B-A, B/A, event. */
typedef struct widths {
    int n, u, a, b, d, r, e;
} widths;

/* Quantity q of a run (NULL where absent) of merged row i. */
static const vl_compare_quantity *qa(const vl_compare_table *t, size_t i)
{
    return t->q[i].a >= 0 ? &t->a->q[t->q[i].a] : NULL;
}

static const vl_compare_quantity *qb(const vl_compare_table *t, size_t i)
{
    return t->q[i].b >= 0 ? &t->b->q[t->q[i].b] : NULL;
}

static const vl_compare_event *ea(const vl_compare_table *t, size_t i)
{
    return t->e[i].a >= 0 ? &t->a->ev[t->e[i].a] : NULL;
}

static const vl_compare_event *eb(const vl_compare_table *t, size_t i)
{
    return t->e[i].b >= 0 ? &t->b->ev[t->e[i].b] : NULL;
}

/* B - A and B / A of merged summary row i. */
static void row_derived(const vl_compare_table *t, size_t i, char *diff, char *ratio, size_t n)
{
    const vl_compare_quantity *a = qa(t, i), *b = qb(t, i);
    vl_compare_table_derived(a ? &a->v : NULL, b ? &b->v : NULL, diff, ratio, n);
}

/* The widest text of every column. */
static widths measure(const vl_compare_table *t)
{
    char diff[64], ratio[64];
    widths w = {(int)strlen("quantity"), (int)strlen("unit"), imax(width(t->a->label), 1),
                imax(width(t->b->label), 1), (int)strlen("B-A"), (int)strlen("B/A"),
                (int)strlen("event")};
    for (size_t i = 0; i < t->nq; i++) {
        const vl_compare_quantity *a = qa(t, i), *b = qb(t, i), *any = a ? a : b;
        row_derived(t, i, diff, ratio, sizeof diff);
        w.n = imax(w.n, width(any->name));
        w.u = imax(w.u, width(any->unit));
        w.a = imax(w.a, a ? width(a->text) : 1);
        w.b = imax(w.b, b ? width(b->text) : 1);
        w.d = imax(w.d, width(diff));
        w.r = imax(w.r, width(ratio));
    }
    for (size_t i = 0; i < t->ne; i++) {
        const vl_compare_event *a = ea(t, i), *b = eb(t, i);
        w.e = imax(w.e, width(a ? a->name : b->name));
        w.a = imax(w.a, a ? width(a->text) : (int)strlen("never"));
        w.b = imax(w.b, b ? width(b->text) : (int)strlen("never"));
    }
    w.e = imax(w.e, w.n);
    return w;
}

static void print_summary(const vl_compare_table *t, const widths *w)
{
    char diff[64], ratio[64];
    cell("quantity", w->n, 0, "  ");
    cell("unit", w->u, 0, "  ");
    cell(t->a->label, w->a, 1, "  ");
    cell(t->b->label, w->b, 1, "  ");
    cell("B-A", w->d, 1, "  ");
    cell("B/A", w->r, 1, "\n");
    for (size_t i = 0; i < t->nq; i++) {
        const vl_compare_quantity *a = qa(t, i), *b = qb(t, i), *any = a ? a : b;
        row_derived(t, i, diff, ratio, sizeof diff);
        cell(any->name, w->n, 0, "  ");
        cell(any->unit, w->u, 0, "  ");
        cell(a ? a->text : dash, w->a, 1, "  ");
        cell(b ? b->text : dash, w->b, 1, "  ");
        cell(diff[0] ? diff : dash, w->d, 1, "  ");
        cell(ratio[0] ? ratio : dash, w->r, 1, "\n");
    }
}

static void print_events(const vl_compare_table *t, const widths *w)
{
    printf("\nfirst occurrence of each event (stellar age, yr)\n");
    cell("event", w->e, 0, "  ");
    cell(t->a->label, w->a, 1, "  ");
    cell(t->b->label, w->b, 1, "\n");
    for (size_t i = 0; i < t->ne; i++) {
        const vl_compare_event *a = ea(t, i), *b = eb(t, i);
        cell(a ? a->name : b->name, w->e, 0, "  ");
        cell(a ? a->text : "never", w->a, 1, "  ");
        cell(b ? b->text : "never", w->b, 1, "\n");
    }
}

void vl_compare_table_print(const vl_compare_table *t)
{
    widths w = measure(t);
    printf("A: %s (%s)\nB: %s (%s)\n\n", t->a->label, t->a->dir, t->b->label, t->b->dir);
    print_summary(t, &w);
    print_events(t, &w);
}
