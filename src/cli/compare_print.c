/* compare_print.c: the table `volev compare` prints (compare.h): one section per topic,
 * science first, the conservation checks, integrator statistics and timings last; each
 * run's value as its summary.csv writes it, and with two runs B-A and B/A (a ratio only
 * where both values are resolved, compare_groups.c). The stellar age of the first
 * occurrence of each event kind closes the section on regimes and events (in place of
 * the summary's first_<event> rows, which compare.csv keeps). */
#include <stdio.h>
#include <string.h>

#include "compare.h"

static const char *const dash = "\xe2\x80\x94"; /* em dash: no value */

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

/* Widths of the printed columns: name (quantity or event), unit, each run's value,
 * B-A and B/A (two runs only). */
typedef struct widths {
    int n, u, v[VL_COMPARE_MAX_RUNS], d, r;
} widths;

/* B-A and B/A are shown for two runs. */
static int derived_columns(const vl_compare_table *t) { return t->nruns == 2; }

static const vl_compare_quantity *any_cell(const vl_compare_table *t, size_t i)
{
    const vl_compare_quantity *q = NULL;
    for (int k = 0; k < t->nruns && !q; k++)
        q = vl_compare_cell(t, i, k);
    return q;
}

static const char *event_name(const vl_compare_table *t, size_t i)
{
    const vl_compare_event *e = NULL;
    for (int k = 0; k < t->nruns && !e; k++)
        e = vl_compare_event_cell(t, i, k);
    return e->name;
}

/* The widest text of every column. */
static widths measure(const vl_compare_table *t)
{
    char text[64];
    widths w = {(int)strlen("quantity"), (int)strlen("unit"), {0}, (int)strlen("B-A"),
                (int)strlen("B/A")};
    for (int k = 0; k < t->nruns; k++)
        w.v[k] = imax(width(t->runs[k].label), (int)strlen("never"));
    for (size_t i = 0; i < t->nq; i++) {
        const vl_compare_quantity *any = any_cell(t, i);
        w.n = imax(w.n, width(any->name));
        w.u = imax(w.u, width(any->unit));
        for (int k = 0; k < t->nruns; k++) {
            const vl_compare_quantity *q = vl_compare_cell(t, i, k);
            w.v[k] = imax(w.v[k], q ? width(q->text) : 1);
        }
        if (derived_columns(t)) {
            vl_compare_difference(t, i, 0, 1, text, sizeof text);
            w.d = imax(w.d, width(text));
            vl_compare_ratio(t, i, 0, 1, text, sizeof text);
            w.r = imax(w.r, width(text));
        }
    }
    for (size_t i = 0; i < t->ne; i++) {
        w.n = imax(w.n, width(event_name(t, i)));
        for (int k = 0; k < t->nruns; k++) {
            const vl_compare_event *e = vl_compare_event_cell(t, i, k);
            w.v[k] = imax(w.v[k], e ? width(e->text) : 1);
        }
    }
    return w;
}

/* The column names: first (quantity or event), unit (quantities), the runs' labels. */
static void print_header(const vl_compare_table *t, const widths *w, int events)
{
    int derived = !events && derived_columns(t);
    cell(events ? "event" : "quantity", w->n, 0, "  ");
    if (!events)
        cell("unit", w->u, 0, "  ");
    for (int k = 0; k < t->nruns; k++)
        cell(t->runs[k].label, w->v[k], 1, k + 1 < t->nruns || derived ? "  " : "\n");
    if (derived) {
        cell("B-A", w->d, 1, "  ");
        cell("B/A", w->r, 1, "\n");
    }
}

static void print_quantity(const vl_compare_table *t, const widths *w, size_t i)
{
    char diff[64], ratio[64];
    const vl_compare_quantity *any = any_cell(t, i);
    int derived = derived_columns(t);
    cell(any->name, w->n, 0, "  ");
    cell(any->unit, w->u, 0, "  ");
    for (int k = 0; k < t->nruns; k++) {
        const vl_compare_quantity *q = vl_compare_cell(t, i, k);
        cell(q ? q->text : dash, w->v[k], 1, k + 1 < t->nruns || derived ? "  " : "\n");
    }
    if (derived) {
        vl_compare_difference(t, i, 0, 1, diff, sizeof diff);
        vl_compare_ratio(t, i, 0, 1, ratio, sizeof ratio);
        cell(diff[0] ? diff : dash, w->d, 1, "  ");
        cell(ratio[0] ? ratio : dash, w->r, 1, "\n");
    }
}

static void print_events(const vl_compare_table *t, const widths *w)
{
    printf("\nfirst occurrence of each event (stellar age, yr)\n");
    print_header(t, w, 1);
    for (size_t i = 0; i < t->ne; i++) {
        cell(event_name(t, i), w->n, 0, "  ");
        for (int k = 0; k < t->nruns; k++) {
            const vl_compare_event *e = vl_compare_event_cell(t, i, k);
            cell(e ? e->text : "never", w->v[k], 1, k + 1 < t->nruns ? "  " : "\n");
        }
    }
}

/* One topic: its heading, the column names, its rows; the events go with the times. */
static void print_group(const vl_compare_table *t, const widths *w, int g)
{
    size_t first = 0;
    while (first < t->nq && t->q[first].group != g)
        first++;
    int events = g == VL_CG_TIMES && t->ne > 0;
    if (first == t->nq && !events)
        return;
    printf("\n== %s ==\n", vl_compare_group_heading(g));
    if (first < t->nq)
        print_header(t, w, 0);
    for (size_t i = first; i < t->nq && t->q[i].group == g; i++)
        if (!(events && strncmp(any_cell(t, i)->name, "first_", 6) == 0))
            print_quantity(t, w, i); /* summary's first_<event>: the event table says it */
    if (events)
        print_events(t, w);
}

void vl_compare_table_print(const vl_compare_table *t)
{
    widths w = measure(t);
    for (int k = 0; k < t->nruns; k++)
        printf("%c: %s (%s)\n", vl_compare_letter(k), t->runs[k].label, t->runs[k].dir);
    if (derived_columns(t))
        printf("B-A: difference; B/A: ratio, shown only where both values are above the "
               "quantity's numerical resolution\n");
    for (int g = 0; g < VL_NCOMPARE_GROUPS; g++)
        print_group(t, &w, g);
}
