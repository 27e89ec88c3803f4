/* output.h: writers for series.csv, events.csv, summary.csv and
 * scenario.resolved.cfg. Files are written under temporary names and renamed only
 * when the whole run succeeded; on failure nothing is left behind. */
#ifndef VOLEV_OUTPUT_H
#define VOLEV_OUTPUT_H

#include <stddef.h>
#include <stdint.h>
#include <stdio.h>

#include "volev/integrate.h"
#include "volev/model.h"
#include "volev/scenario.h"
#include "volev/schema.h"

typedef struct vl_output vl_output;

/* Prepare dir (created if missing, and then removed again on abort). */
vl_output *vl_output_open(const char *dir, const vl_model *m, vl_status *st);

/* The row and event callbacks for vl_integrate. */
vl_run_sink vl_output_sink(vl_output *o);

/* Write the summary and resolved scenario, then rename every file into place and free o. */
/* The first time of each kind of event the run logged so far (for the end-of-run
 * report; call before vl_output_commit, which frees o). */
void vl_output_events(const vl_output *o, vl_event_firsts *out);
int vl_output_commit(vl_output *o, const vl_run_stats *stats, vl_status *st);

/* Remove every temporary file (and dir, if created here) and free o. Accepts NULL. */
void vl_output_abort(vl_output *o);

/* FNV-1a 64-bit hash of the resolved scenario text, as 16 hex digits in buf[17]. */
int vl_output_scenario_hash(const vl_scenario *sc, char buf[17], vl_status *st);

/* FNV-1a 64-bit hash of n bytes of s, continuing from h (VL_FNV_OFFSET to start). */
#define VL_FNV_OFFSET 1469598103934665603ULL
uint64_t vl_output_fnv1a(const char *s, size_t n, uint64_t h);
/* D/H atom ratio of H-bearing reservoir r in state y (0 for a reservoir without
 * deuterium; NaN, undefined, when the reservoir is below its floor band). */
double vl_output_dh(const double *y, int r);

/* v printed with printf format fmt (one double conversion) into buf (size n): the one
 * rule for every number volev writes into a CSV file. A value that is not finite (no
 * value: NaN, or an infinity) is the empty string, never "nan" or "inf"; a zero is never
 * written with a sign ("-0", "-0.000" become "0", "0.000"). Returns the length. */
size_t vl_output_number(char *buf, size_t n, const char *fmt, double v);
/* fprintf(f, "%s%s", sep, vl_output_number(v)): sep, then the number or nothing. */
int vl_output_put(FILE *f, const char *sep, const char *fmt, double v);

/* Version string "VERSION (git REV)". */
const char *vl_version(void);

#endif
