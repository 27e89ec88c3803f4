/* track.h: a stellar track, the luminosity table of star.luminosity_model = table, read
 * from a CSV file (format in docs/model.md, "Star") by src/input/track.c through the CSV
 * reader (csv.h) and interpolated in log-log. The star (star.h) evaluates it. */
#ifndef VOLEV_TRACK_H
#define VOLEV_TRACK_H

#include <stddef.h>

#include "volev/status.h"

typedef struct vl_star_track vl_star_track;   /* opaque; a checked luminosity table */

/* Largest track file, bytes (16 MiB: some 300 000 rows of four columns; published
 * evolutionary tracks have thousands). A larger one is refused before it is read. */
#define VL_TRACK_SIZE_MAX ((size_t)16 << 20)

/* Columns of a track; the age column is the abscissa. */
enum vl_track_column { VL_TRACK_AGE, VL_TRACK_LUM, VL_TRACK_TEFF, VL_TRACK_XUV, VL_TRACK_NCOL };

/* A stellar track CSV held in memory (len bytes; format in docs/model.md, "Star"):
 * '#' comments and blank lines, a header naming age_yr and luminosity_lsun (optional
 * teff_k, xuv_lsun, any order), then rows of finite positive numbers with ages strictly
 * increasing, at least two. A NUL byte is an input error. label (NULL: "(text)") is the
 * file name in messages. The interpolants are set up. NULL on error, st filled
 * (VL_ERR_INPUT with the line, VL_ERR_INTERNAL when out of memory). */
vl_star_track *vl_star_track_parse(const char *text, size_t len, const char *label,
                                   vl_status *st);
/* The same from a file (VL_ERR_IO when it cannot be read or is not a regular file);
 * path names it in messages. */
vl_star_track *vl_star_track_read(const char *path, vl_status *st);
void vl_star_track_free(vl_star_track *t);   /* accepts NULL */
/* Data rows, and the first and last ages (s) of a parsed track: a run over exactly
 * [first_s, last_s] is covered. */
size_t vl_star_track_rows(const vl_star_track *t);
void vl_star_track_span(const vl_star_track *t, double *first_s, double *last_s);

/* VL_OK if the track covers the run [t0_s, t1_s] without extrapolation, else an input
 * error naming the track's file. */
int vl_star_track_covers(const vl_star_track *t, double t0_s, double t1_s, vl_status *st);
/* 1 if the track has column c (enum vl_track_column). */
int vl_star_track_has(const vl_star_track *t, int c);
/* Column c (SI: W or K) at age t_s (s), interpolated in log-log; NaN outside the track
 * (never extrapolated) or for an absent column. Allocation-free. */
double vl_star_track_eval(const vl_star_track *t, int c, double t_s);

#endif
