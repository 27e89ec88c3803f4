/* gnuplot.h: locating the bundled gnuplot scripts and running gnuplot on one
 * (shared by plot and compare). Scripts take their inputs as arguments:
 * `gnuplot -c plots/NAME.gp ARG1 ARG2 ...` (vl_gnuplot_call). */
#ifndef VOLEV_CLI_GNUPLOT_H
#define VOLEV_CLI_GNUPLOT_H

#include <stddef.h>

#include "volev/status.h"

/* Find plots/NAME into out[n]: $VOLEV_PLOTS_DIR, then ../plots, ../share/volev/plots
 * and plots beside the executable. 0 if found and readable, -1 otherwise. */
int vl_gnuplot_find_script(const char *name, char *out, size_t n);

/* Run `gnuplot -c SCRIPT ARGS[0] ... ARGS[n-1]` and wait for it; the script reads them
 * as ARG1 ... ARGn (a NULL entry is passed as an empty string, i.e. "absent"). No
 * quoting is involved: each entry reaches gnuplot as one argv word. On failure st
 * holds VL_ERR_TOOL (gnuplot missing, killed, or exited non-zero); the caller removes
 * whatever partial figure it no longer wants. */
int vl_gnuplot_call(const char *script, const char *const args[], size_t n, vl_status *st);

/* The series.csv columns (schema.h IDs, -1 terminated) each figure of a run draws:
 * plots/history.gp and plots/comparison.gp look them up by name. */
extern const int vl_gnuplot_history_columns[];
extern const int vl_gnuplot_comparison_columns[];

/* Their names into names[cap] (NULL-terminated); returns the count. */
size_t vl_gnuplot_column_names(const int *ids, const char **names, size_t cap);

#endif
