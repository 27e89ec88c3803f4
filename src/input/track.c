/* track.c: the stellar track (track.h): a luminosity table read from CSV through the CSV
 * reader (csv.h), checked row by row, and interpolated in log-log for the star
 * (src/physics/star.c). Format: docs/model.md, "Star". */
#include "volev/track.h"

#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include <gsl/gsl_interp.h>

#include "volev/csv.h"
#include "volev/number.h"
#include "volev/scenario.h"
#include "volev/text.h"
#include "volev/units.h"

enum { COL_AGE = VL_TRACK_AGE, COL_LUM = VL_TRACK_LUM, COL_TEFF = VL_TRACK_TEFF,
       COL_XUV = VL_TRACK_XUV, NCOL = VL_TRACK_NCOL };

/* Value ranges, so that nothing derived from a track overflows: luminosity within the
 * bounds of star.luminosity_lsun (looked up in the core table, lum_bounds), Teff within
 * generous physical limits, XUV at most the bolometric luminosity of its row (read_row). */
static const struct {
    const char *name;   /* header name */
    double to_si;       /* file value * to_si = SI value */
    int required;
    double lo, hi;      /* accepted range, file units (values are also > 0) */
} columns[NCOL] = {
    {"age_yr", VL_YR, 1, 0.0, HUGE_VAL},
    {"luminosity_lsun", VL_L_SUN, 1, 0.0, HUGE_VAL},
    {"teff_k", 1.0, 0, 1000.0, 1e5},
    {"xuv_lsun", VL_L_SUN, 0, 0.0, HUGE_VAL},
};

/* A tabulated track: natural logs of SI values, ages strictly increasing. */
struct vl_star_track {
    char label[VL_PATH_MAX];    /* file name in messages */
    size_t n, cap;              /* rows held, rows allocated */
    double first_s, last_s;     /* ages of the first and last rows, s (ln[COL_AGE] = their logs) */
    double *ln[NCOL];           /* owned; NULL for an absent column */
    gsl_interp *interp[NCOL];   /* owned; NULL for the age column and absent columns */
};
typedef struct vl_star_track track;

/* State of the header while reading a track. */
typedef struct reader {
    const char *path;           /* file name in messages */
    int line;                   /* line of the record being read */
    int header_line;            /* line of the header, 0 before it */
    int field_col[NCOL];        /* column of each field */
    track *t;                   /* being filled */
} reader;

/* The reader's settings for track files: plain fields, its own words in messages. */
static const vl_csv_options track_csv = {0, VL_TRACK_SIZE_MAX, 0, 0, "star track", "a track CSV"};

/* Index of the column called name, or -1. */
static int column_index(const char *name)
{
    for (int c = 0; c < NCOL; c++)
        if (strcmp(name, columns[c].name) == 0)
            return c;
    return -1;
}

/* Read the header: every name known, none twice, the required ones present. */
static int read_header(reader *r, const vl_csv_record *rec, vl_status *st)
{
    int have[NCOL] = {0};
    char shown[VL_EXCERPT_SIZE];
    track *t = r->t;
    for (size_t k = 0; k < rec->n; k++) {
        const char *name = rec->field[k];
        int c = column_index(name);
        if (c < 0)
            return vl_fail(st, VL_ERR_INPUT, r->path, r->line,
                           "unknown column '%s' (columns: age_yr, luminosity_lsun, optional "
                           "teff_k, xuv_lsun)", vl_text_excerpt_str(name, shown, sizeof shown));
        if (have[c])
            return vl_fail(st, VL_ERR_INPUT, r->path, r->line, "column '%s' appears twice",
                           name);
        have[c] = 1;
        r->field_col[k] = c;
    }
    for (int c = 0; c < NCOL; c++)
        if (columns[c].required && !have[c])
            return vl_fail(st, VL_ERR_INPUT, r->path, r->line, "missing column '%s'",
                           columns[c].name);
    r->header_line = r->line;
    t->cap = 8;
    for (int c = 0; c < NCOL; c++)
        if (have[c] && !(t->ln[c] = malloc(t->cap * sizeof(double))))
            return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    return VL_OK;
}

/* The bounds of star.luminosity_lsun (L_sun), the range of a track's luminosity. */
static void lum_bounds(double *lo, double *hi)
{
    *lo = 0.0;
    *hi = HUGE_VAL;
    for (size_t i = 0; i < vl_core_nparams; i++)
        if (strcmp(vl_core_params[i].key, "star.luminosity_lsun") == 0) {
            *lo = vl_core_params[i].lo;
            *hi = vl_core_params[i].hi;
        }
}

/* Convert one field: a finite positive number in the column's file unit, in range. */
static int read_value(const reader *r, const char *text, int c, double *v, vl_status *st)
{
    char shown[VL_EXCERPT_SIZE];
    int kind = vl_number_parse_str(text, v);
    vl_text_excerpt_str(text, shown, sizeof shown);
    if (kind != VL_NUMBER_OK && kind != VL_NUMBER_WORD && kind != VL_NUMBER_OVERFLOW)
        return vl_fail(st, VL_ERR_INPUT, r->path, r->line, "%s: '%s' %s", columns[c].name,
                       shown, vl_number_why(kind));
    if (!isfinite(*v) || !isfinite(*v * columns[c].to_si))
        return vl_fail(st, VL_ERR_INPUT, r->path, r->line, "%s: '%s' is not finite (in SI)",
                       columns[c].name, shown);
    if (*v <= 0.0)
        return vl_fail(st, VL_ERR_INPUT, r->path, r->line, "%s = %g must be positive",
                       columns[c].name, *v);
    double lo = columns[c].lo, hi = columns[c].hi;
    if (c == COL_LUM)
        lum_bounds(&lo, &hi);
    if (*v < lo || *v > hi)
        return vl_fail(st, VL_ERR_INPUT, r->path, r->line, "%s = %g is outside [%g, %g]%s",
                       columns[c].name, *v, lo, hi,
                       c == COL_LUM ? " (the bounds of star.luminosity_lsun)" : "");
    return VL_OK;
}

/* Make room for one more row in every present column. */
static int track_grow(track *t, vl_status *st)
{
    if (t->n < t->cap)
        return VL_OK;
    size_t cap = 2 * t->cap;
    for (int c = 0; c < NCOL; c++) {
        if (!t->ln[c])
            continue;
        double *p = realloc(t->ln[c], cap * sizeof *p);
        if (!p)
            return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        t->ln[c] = p;
    }
    t->cap = cap;
    return VL_OK;
}

/* Read one data row (the reader has checked its field count): values valid, XUV within
 * the luminosity, age increasing. */
static int read_row(const reader *r, const vl_csv_record *rec, vl_status *st)
{
    double ln[NCOL], file[NCOL], age_s = 0.0;
    track *t = r->t;
    for (size_t k = 0; k < rec->n; k++) {
        int c = r->field_col[k];
        double v;
        int rc = read_value(r, rec->field[k], c, &v, st);
        if (rc)
            return rc;
        file[c] = v;
        ln[c] = log(v * columns[c].to_si);
        if (c == COL_AGE)
            age_s = v * columns[c].to_si;
    }
    if (t->ln[COL_XUV] && file[COL_XUV] > file[COL_LUM])
        return vl_fail(st, VL_ERR_INPUT, r->path, r->line,
                       "xuv_lsun = %g exceeds luminosity_lsun = %g (XUV is part of the "
                       "bolometric output)", file[COL_XUV], file[COL_LUM]);
    if (t->n > 0 && !(ln[COL_AGE] > t->ln[COL_AGE][t->n - 1]))
        return vl_fail(st, VL_ERR_INPUT, r->path, r->line,
                       "age_yr = %.9g is not greater than %.9g on the previous row",
                       exp(ln[COL_AGE]) / VL_YR, exp(t->ln[COL_AGE][t->n - 1]) / VL_YR);
    int rc = track_grow(t, st);
    if (rc)
        return rc;
    for (int c = 0; c < NCOL; c++)
        if (t->ln[c])
            t->ln[c][t->n] = ln[c];
    if (t->n == 0)
        t->first_s = age_s;
    t->last_s = age_s;
    t->n++;
    return VL_OK;
}

/* The CSV reader's callback: the header, then the rows; comments are not needed. */
static int take_record(void *ctx, const vl_csv_record *rec, vl_status *st)
{
    reader *r = ctx;
    r->line = rec->line;
    if (rec->kind == VL_CSV_HEADER)
        return read_header(r, rec, st);
    if (rec->kind == VL_CSV_ROW)
        return read_row(r, rec, st);
    return VL_OK;
}

/* The track has a header and two rows or more. */
static int track_complete(const reader *r, const track *t, vl_status *st)
{
    if (!r->header_line)
        return vl_fail(st, VL_ERR_INPUT, r->path, 0,
                       "no header line (needs columns age_yr,luminosity_lsun; optional "
                       "teff_k,xuv_lsun)");
    if (t->n < 2)
        return vl_fail(st, VL_ERR_INPUT, r->path, 0,
                       "%zu data row(s); a track needs at least 2", t->n);
    return VL_OK;
}

/* Set up the interpolants: Steffen 1990 (A&A 239:443), monotone, for 3 rows or more;
 * with 2 rows the monotone interpolant is the straight line (in log-log). */
static int track_interp(track *t, vl_status *st)
{
    const gsl_interp_type *type = t->n >= 3 ? gsl_interp_steffen : gsl_interp_linear;
    for (int c = COL_AGE + 1; c < NCOL; c++) {
        if (!t->ln[c])
            continue;
        t->interp[c] = gsl_interp_alloc(type, t->n);
        if (!t->interp[c])
            return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        if (gsl_interp_init(t->interp[c], t->ln[COL_AGE], t->ln[c], t->n) != 0)
            return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "track interpolation setup failed");
    }
    return VL_OK;
}

/* Reads a track from a file (path) or from memory (text, len) labelled label. */
static track *track_load(const char *path, const char *text, size_t len, const char *label,
                         vl_status *st)
{
    vl_status_clear(st);
    track *t = calloc(1, sizeof *t);
    if (!t) {
        vl_fail(st, VL_ERR_INTERNAL, label, 0, "out of memory");
        return NULL;
    }
    snprintf(t->label, sizeof t->label, "%s", label);
    reader r = {.path = t->label, .t = t};
    int rc = path ? vl_csv_scan(path, &track_csv, take_record, &r, st)
                  : vl_csv_scan_buffer(text, len, t->label, &track_csv, take_record, &r, st);
    if (rc == VL_OK)
        rc = track_complete(&r, t, st);
    if (rc == VL_OK)
        rc = track_interp(t, st);
    if (rc != VL_OK) {
        vl_star_track_free(t);
        return NULL;
    }
    return t;
}

vl_star_track *vl_star_track_parse(const char *text, size_t len, const char *label,
                                   vl_status *st)
{
    if (!label)
        label = "(text)";
    if (!text && len > 0) {
        vl_status_clear(st);
        vl_fail(st, VL_ERR_INTERNAL, label, 0, "vl_star_track_parse: no text");
        return NULL;
    }
    return track_load(NULL, text, len, label, st);
}

vl_star_track *vl_star_track_read(const char *path, vl_status *st)
{
    return track_load(path, NULL, 0, path, st);
}

void vl_star_track_free(vl_star_track *t)
{
    if (!t)
        return;
    for (int c = 0; c < NCOL; c++) {
        gsl_interp_free(t->interp[c]);
        free(t->ln[c]);
    }
    free(t);
}

size_t vl_star_track_rows(const vl_star_track *t) { return t->n; }

void vl_star_track_span(const vl_star_track *t, double *first_s, double *last_s)
{
    *first_s = t->first_s;
    *last_s = t->last_s;
}

int vl_star_track_covers(const vl_star_track *t, double t0, double t1, vl_status *st)
{
    if (log(t0) < t->ln[COL_AGE][0] || log(t1) > t->ln[COL_AGE][t->n - 1])
        return vl_fail(st, VL_ERR_INPUT, t->label, 0,
                       "track covers ages %.6g-%.6g yr but the run needs %.6g-%.6g yr "
                       "(no extrapolation)", t->first_s / VL_YR, t->last_s / VL_YR, t0 / VL_YR,
                       t1 / VL_YR);
    return VL_OK;
}

int vl_star_track_has(const vl_star_track *t, int c)
{
    return t && c > COL_AGE && c < NCOL && t->interp[c] != NULL;
}

/* No accelerator: gsl_interp_eval accepts NULL and stays allocation-free. */
double vl_star_track_eval(const vl_star_track *t, int c, double t_s)
{
    if (!vl_star_track_has(t, c))
        return NAN;
    double x = log(t_s);
    if (!(x >= t->ln[COL_AGE][0] && x <= t->ln[COL_AGE][t->n - 1]))
        return NAN;
    return exp(gsl_interp_eval(t->interp[c], t->ln[COL_AGE], t->ln[c], x, NULL));
}
