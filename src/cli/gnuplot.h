/* gnuplot.h: locating the bundled gnuplot scripts and running gnuplot on one
 * (shared by plot and compare). */
#ifndef VOLEV_CLI_GNUPLOT_H
#define VOLEV_CLI_GNUPLOT_H

#include <stddef.h>

#include "volev/status.h"

/* Find plots/NAME into out[n]: $VOLEV_PLOTS_DIR, then ../plots, ../share/volev/plots
 * and plots beside the executable. 0 if found and readable, -1 otherwise. */
int vl_gnuplot_find_script(const char *name, char *out, size_t n);

/* Run `gnuplot -e EXPR SCRIPT` and wait for it. On failure outfile is removed and st
 * holds VL_ERR_TOOL (gnuplot missing, or it exited with an error). */
int vl_gnuplot_run(const char *script, const char *expr, const char *outfile, vl_status *st);

/* Copy s into out[n] as the body of a gnuplot single-quoted string (quotes doubled).
 * 0, or -1 if it does not fit. */
int vl_gnuplot_quote(const char *s, char *out, size_t n);

#endif
