/* compare.h: the pieces of `volev compare` (compare.c): reading two runs' output files
 * (compare_read.c), merging and printing their table (compare_table.c), and writing
 * compare.csv and the figure (compare_write.c). */
#ifndef VOLEV_CLI_COMPARE_H
#define VOLEV_CLI_COMPARE_H

#include <stddef.h>

#include "volev/status.h"

enum { VL_COMPARE_LABEL_MAX = 256 };

/* One row of summary.csv: the value both as written (shown verbatim) and parsed. */
typedef struct vl_compare_quantity {
    char *name, *unit, *text;
    double v;
    int line;
} vl_compare_quantity;

/* The first (earliest) occurrence of one kind of event in events.csv. */
typedef struct vl_compare_event {
    char *name, *text;
    double t;
} vl_compare_event;

/* One run folder and what compare read from it. */
typedef struct vl_compare_run {
    const char *dir;            /* borrowed from argv */
    char label[VL_COMPARE_LABEL_MAX];
    char version[128];          /* from summary.csv's "# volev ..." line, "" if absent */
    char hash[64];              /* resolved scenario hash from the same header, "" if absent */
    vl_compare_quantity *q;
    size_t nq, capq;
    vl_compare_event *ev;
    size_t nev, capev;
} vl_compare_run;

/* A row of the merged tables: index into run A's and run B's list, -1 where absent. */
typedef struct vl_compare_pair {
    long a, b;
} vl_compare_pair;

/* The two runs and their merged rows: summary quantities (q) and event kinds (e). */
typedef struct vl_compare_table {
    const vl_compare_run *a, *b;
    vl_compare_pair *q, *e;
    size_t nq, ne;
} vl_compare_table;

/* Reads DIR/summary.csv (quantities and the provenance comments) and DIR/events.csv (the
 * first time of each event kind) of r->dir into r; st filled on error. */
int vl_compare_read_run(vl_compare_run *r, vl_status *st);
/* Checks DIR/series.csv for the figure: a run's header holding every column the figure
 * draws, and at least one row of numbers. */
int vl_compare_read_series(const vl_compare_run *r, vl_status *st);
/* Releases what vl_compare_read_run allocated in r. */
void vl_compare_read_free(vl_compare_run *r);

/* Merges the rows of a and b into t (all of A in its order; an item only in B right after
 * the item that precedes it in B); VL_ERR_INTERNAL when out of memory. */
int vl_compare_table_merge(const vl_compare_run *a, const vl_compare_run *b,
                           vl_compare_table *t, vl_status *st);
void vl_compare_table_free(vl_compare_table *t);
/* B - A and B / A of two values as text ("" where not defined: a value missing or not
 * finite, or A = 0 for the ratio). */
void vl_compare_table_derived(const double *a, const double *b, char *diff, char *ratio,
                              size_t n);
/* Prints the summary table and the first occurrence of each event to stdout. */
void vl_compare_table_print(const vl_compare_table *t);

/* Writes DIR/compare.csv and renders DIR/compare.FMT, both under temporary names first and
 * renamed only when both succeeded; on failure nothing is left (DIR removed again if it
 * was created here). Prints the two paths on success. */
int vl_compare_write_outputs(const char *dir, const char *fmt, const vl_compare_table *t,
                             vl_status *st);

#endif
