/* compare.h: the pieces of `volev compare` (compare.c): reading the runs' output files
 * (compare_read.c), merging their rows and sorting them into topics (compare_table.c,
 * compare_groups.c), printing the table (compare_print.c), and writing compare.csv and
 * the figure (compare_write.c). */
#ifndef VOLEV_CLI_COMPARE_H
#define VOLEV_CLI_COMPARE_H

#include <stddef.h>

#include "gnuplot.h"
#include "volev/status.h"

/* At most as many runs as the figure draws (gnuplot.h): beyond twelve neither its lines
 * nor the printed table's columns can be read. */
enum { VL_COMPARE_LABEL_MAX = 256, VL_COMPARE_MAX_RUNS = VL_GNUPLOT_MAX_RUNS };

/* One row of summary.csv, or a final:COLUMN row from the last row of series.csv: the value
 * both as written (shown verbatim) and parsed; a categorical one (the regime) is a code
 * shown by its name, with no difference or ratio. */
typedef struct vl_compare_quantity {
    char *name, *unit, *text;
    double v;
    int line, categorical;
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

/* The topics of the table, in the order they are printed: the science first, the
 * conservation checks, integrator statistics and timings last (compare_groups.c). */
enum vl_compare_group {
    VL_CG_FINAL,    /* final state */
    VL_CG_BUDGET,   /* water and escape budgets */
    VL_CG_REDOX,    /* redox budget */
    VL_CG_ISOTOPE,  /* isotopes */
    VL_CG_TIMES,    /* time in regimes and first events */
    VL_CG_OTHER,    /* a quantity no rule places (a newer volev's summary row) */
    VL_CG_NUMERICS, /* conservation, numerics and cost */
    VL_NCOMPARE_GROUPS
};

/* A row of the merged tables: the index into each run's list, -1 where that run lacks
 * the item; group and rank (position of the placing rule) order the summary rows. */
typedef struct vl_compare_row {
    long idx[VL_COMPARE_MAX_RUNS];
    int group, rank;
} vl_compare_row;

/* The runs and their merged rows: summary quantities (q) and event kinds (e). */
typedef struct vl_compare_table {
    const vl_compare_run *runs;
    int nruns;
    vl_compare_row *q, *e;
    size_t nq, ne;
} vl_compare_table;

/* Reads DIR/summary.csv (quantities and the provenance comments) and DIR/events.csv (the
 * first time of each event kind) of r->dir into r; st filled on error. */
int vl_compare_read_run(vl_compare_run *r, vl_status *st);
/* Reads DIR/series.csv: a run's header, at least one row of numbers; the final regime,
 * surface temperature and pressure of its last row appended to r's quantities
 * (final:COLUMN); with figure set, the header must also hold every column the figure
 * draws. */
int vl_compare_read_series(vl_compare_run *r, int figure, vl_status *st);
/* Releases what vl_compare_read_run allocated in r. */
void vl_compare_read_free(vl_compare_run *r);

/* Merges the rows of runs[0..n) into t (all of the first run in its order; an item
 * first met in a later run right after the item that precedes it there), then orders
 * the summary rows by topic (stable within a topic); VL_ERR_INTERNAL when out of
 * memory. */
int vl_compare_table_merge(const vl_compare_run *runs, int n, vl_compare_table *t,
                           vl_status *st);
void vl_compare_table_free(vl_compare_table *t);
/* Quantity of run k in summary row i, or NULL; event of run k in event row i, or NULL. */
const vl_compare_quantity *vl_compare_cell(const vl_compare_table *t, size_t i, int k);
const vl_compare_event *vl_compare_event_cell(const vl_compare_table *t, size_t i, int k);
/* Run k's value minus run 0's of summary row i (events: ev set) as text, "" where not
 * defined (a value missing or not finite, or a categorical one). */
void vl_compare_difference(const vl_compare_table *t, size_t i, int ev, int k, char *out,
                           size_t n);
/* Run k's value over run 0's as text, "" unless both are resolved
 * (vl_compare_resolved). */
void vl_compare_ratio(const vl_compare_table *t, size_t i, int ev, int k, char *out, size_t n);

/* The topic of a summary quantity and the position of the rule that placed it. */
int vl_compare_group_of(const char *name, const char *unit, int *rank);
/* The heading of a topic, and its one-word id in compare.csv. */
const char *vl_compare_group_heading(int group);
const char *vl_compare_group_id(int group);
/* Whether run k's value of summary row i is above the numerical resolution of the
 * quantity, so that a ratio with it means something (docs/figures.md, "The table of
 * volev compare"): a reservoir's mass at or above its depletion floor; a quantity derived from one
 * reservoir only while that reservoir is; any other value a normal (not subnormal)
 * number of at least 1e-30 of the largest magnitude the runs give it. */
int vl_compare_resolved(const vl_compare_table *t, size_t i, int k);
/* The same for event row i (a stellar age): a normal positive number. */
int vl_compare_event_resolved(const vl_compare_table *t, size_t i, int k);

/* Prints the table by topic, with the first occurrence of each event, to stdout. */
void vl_compare_table_print(const vl_compare_table *t);

/* Writes DIR/compare.csv and renders DIR/compare.FMT, both under temporary names first and
 * renamed only when both succeeded; on failure nothing is left (DIR removed again if it
 * was created here). Prints the two paths on success. */
int vl_compare_write_outputs(const char *dir, const char *fmt, const vl_compare_table *t,
                             vl_status *st);

/* Letter of run k in the table and compare.csv: A, B, C, ... */
static inline char vl_compare_letter(int k) { return (char)('A' + k); }

#endif
