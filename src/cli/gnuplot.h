/* gnuplot.h: locating the bundled gnuplot scripts and running gnuplot on one
 * (shared by plot and compare). Scripts take their inputs as arguments:
 * `gnuplot -c plots/NAME.gp ARG1 ARG2 ...` (vl_gnuplot_call). */
#ifndef VOLEV_CLI_GNUPLOT_H
#define VOLEV_CLI_GNUPLOT_H

#include <stddef.h>

#include "volev/status.h"

/* Most runs one comparison figure draws (plots/comparison.gp; vl_max_runs of
 * plots/style.gp, which holds a colour and dash pattern for each): beyond twelve the
 * lines cannot be told apart. `volev compare` and `volev plot` refuse more. */
enum { VL_GNUPLOT_MAX_RUNS = 12 };

/* Find plots/NAME into out[n]: $VOLEV_PLOTS_DIR, then ../plots, ../share/volev/plots
 * and plots beside the executable. 0 if found and readable, -1 otherwise. */
int vl_gnuplot_find_script(const char *name, char *out, size_t n);

/* Run `gnuplot -c SCRIPT ARGS[0] ... ARGS[n-1]` and wait for it; the script reads them
 * as ARG1 ... ARGn (a NULL entry is passed as an empty string, i.e. "absent"). No
 * quoting is involved: each entry reaches gnuplot as one argv word. On failure st
 * holds VL_ERR_TOOL (gnuplot missing, killed, or exited non-zero); the caller removes
 * whatever partial figure it no longer wants. */
int vl_gnuplot_call(const char *script, const char *const args[], size_t n, vl_status *st);

/* The runs of plots/comparison.gp as its one RUNS argument: for each run its series.csv
 * path and its legend label (NULL: the folder), each on a line of its own (neither may
 * hold a line break; the callers refuse names with control characters). A script takes
 * at most nine arguments, so any number of runs goes in one. malloc'd; NULL when out of
 * memory. */
char *vl_gnuplot_runs_word(const char *const *series, const char *const *labels, int n);

/* The series.csv columns (schema.h IDs, -1 terminated) each figure of a run draws:
 * plots/history.gp and plots/comparison.gp look them up by name. */
extern const int vl_gnuplot_history_columns[];
extern const int vl_gnuplot_comparison_columns[];

/* Their names into names[cap] (NULL-terminated); returns the count. */
size_t vl_gnuplot_column_names(const int *ids, const char **names, size_t cap);

#endif
