/* star.c: bolometric luminosity, effective temperature, XUV, Lyman-alpha and wind
 * against stellar age (star.h). Luminosity: the Gough 1981 solar track, a constant,
 * pre-main-sequence contraction, or a CSV track interpolated in log-log. XUV: a
 * saturated ratio with power-law decay, the solar fit of Ribas et al. 2005, or the
 * track's own column. */
#include "volev/star.h"

#include <errno.h>
#include <limits.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include <gsl/gsl_interp.h>

#include "volev/text.h"
#include "volev/units.h"

#define GYR_S (1.0e9 * VL_YR)
/* Age of the present Sun, the reference of the Lyman-alpha scaling
 * (4.57 Gyr, Bahcall, Pinsonneault & Wasserburg 1995, from memory). */
#define SUN_AGE_S (4.57e9 * VL_YR)

/* Columns of a track file; the age column is the abscissa. */
enum { COL_AGE, COL_LUM, COL_TEFF, COL_XUV, NCOL };

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

struct vl_star {
    vl_star_params p;           /* copy of the scenario's star block */
    double l_xuv_sun_now_w;     /* present solar XUV (Ribas et al. 2005 at SUN_AGE_S), W */
    track *tab;                 /* owned; luminosity_model = table only, else NULL */
};

/* State of the header while reading a track. */
typedef struct reader {
    const char *path;           /* file name in messages */
    int line;                   /* current 1-based line */
    int header_line;            /* line of the header, 0 before it */
    int nfields;                /* fields per row, from the header */
    int field_col[NCOL];        /* column of each field */
} reader;

/* ---------------------------------------------------------------- published laws */

/* Orbit-averaged flux: the time mean of L / (4 pi r^2) over a Kepler orbit. */
double vl_star_orbit_flux(double l_w, double a_m, double e)
{
    return l_w / (4.0 * VL_PI * a_m * a_m * sqrt(1.0 - e * e));
}

/* Gough 1981, Sol. Phys. 74:21, eq. 1: L(t)/L_now = [1 + (2/5)(1 - t/t_now)]^-1. */
double vl_star_gough_ratio(double t_s, double t_now_s)
{
    return 1.0 / (1.0 + 0.4 * (1.0 - t_s / t_now_s));
}

/* Ribas et al. 2005, ApJ 622:680, eq. 1: F(1-1200 A, 1 au) = 29.7 tau^-1.23 erg cm^-2 s^-1
 * (tau in Gyr), held at its 0.1 Gyr value before; 1 erg cm^-2 s^-1 = 1e-3 W/m^2. */
double vl_star_ribas_flux_1au(double t_s)
{
    double tau = t_s / GYR_S;
    if (tau < 0.1)
        tau = 0.1;
    return 29.7e-3 * pow(tau, -1.23);
}

/* ---------------------------------------------------------------- track file */

/* Strip leading and trailing white space (including CR/LF) in place. */
static char *trim(char *s)
{
    while (*s == ' ' || *s == '\t')
        s++;
    size_t n = strlen(s);
    while (n > 0 && (s[n - 1] == ' ' || s[n - 1] == '\t' || s[n - 1] == '\r' || s[n - 1] == '\n'))
        s[--n] = '\0';
    return s;
}

/* Next comma-separated field of *cur, trimmed, or NULL after the last; splits in place. */
static char *next_field(char **cur)
{
    char *f = *cur;
    if (!f)
        return NULL;
    char *comma = strchr(f, ',');
    if (comma) {
        *comma = '\0';
        *cur = comma + 1;
    } else {
        *cur = NULL;
    }
    return trim(f);
}

/* Index of the column called name, or -1. */
static int column_index(const char *name)
{
    for (int c = 0; c < NCOL; c++)
        if (strcmp(name, columns[c].name) == 0)
            return c;
    return -1;
}

/* Read the header: every name known, none twice, the required ones present. */
static int read_header(reader *r, char *line, track *t, vl_status *st)
{
    int have[NCOL] = {0};
    int n = 0;
    char *name;
    while ((name = next_field(&line))) {
        int c = column_index(name);
        if (c < 0)
            return vl_fail(st, VL_ERR_INPUT, r->path, r->line,
                           "unknown column '%s' (columns: age_yr, luminosity_lsun, optional "
                           "teff_k, xuv_lsun)", name);
        if (have[c])
            return vl_fail(st, VL_ERR_INPUT, r->path, r->line, "column '%s' appears twice",
                           name);
        have[c] = 1;
        r->field_col[n++] = c;
    }
    for (int c = 0; c < NCOL; c++)
        if (columns[c].required && !have[c])
            return vl_fail(st, VL_ERR_INPUT, r->path, r->line, "missing column '%s'",
                           columns[c].name);
    r->nfields = n;
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
    char *end;
    *v = strtod(text, &end);
    if (end == text || *end != '\0')
        return vl_fail(st, VL_ERR_INPUT, r->path, r->line, "%s: '%s' is not a number",
                       columns[c].name, text);
    if (!isfinite(*v) || !isfinite(*v * columns[c].to_si))
        return vl_fail(st, VL_ERR_INPUT, r->path, r->line, "%s: '%s' is not finite (in SI)",
                       columns[c].name, text);
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

/* Read one data row: field count as in the header, values valid, age increasing. */
static int read_row(const reader *r, char *line, track *t, vl_status *st)
{
    double ln[NCOL], file[NCOL], age_s = 0.0;
    int n = 1;
    for (const char *q = line; (q = strchr(q, ',')); q++)
        n++;
    if (n != r->nfields)
        return vl_fail(st, VL_ERR_INPUT, r->path, r->line,
                       "%d fields, but the header on line %d names %d", n, r->header_line,
                       r->nfields);
    for (int i = 0; i < n; i++) {
        int c = r->field_col[i];
        double v;
        int rc = read_value(r, next_field(&line), c, &v, st);
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

/* The line s[0..len) (a CR before its LF allowed) is UTF-8 text: no NUL, no control
 * character but TAB. */
static int check_text(const reader *r, const char *s, size_t len, vl_status *st)
{
    if (len > 0 && s[len - 1] == '\r')
        len--;
    int fault;
    size_t i = vl_text_scan(s, len, &fault);
    unsigned char c = i < len ? (unsigned char)s[i] : 0;
    if (fault == VL_TEXT_OK)
        return VL_OK;
    if (fault == VL_TEXT_NUL)
        return vl_fail(st, VL_ERR_INPUT, r->path, r->line,
                       "NUL byte at byte %zu of the line: binary data, not a track CSV", i + 1);
    if (fault == VL_TEXT_CONTROL)
        return vl_fail(st, VL_ERR_INPUT, r->path, r->line,
                       "binary data, not a track CSV: control character 0x%02X at byte %zu of "
                       "the line", c, i + 1);
    return vl_fail(st, VL_ERR_INPUT, r->path, r->line,
                   "binary data, not a track CSV: byte 0x%02X at byte %zu of the line is not "
                   "UTF-8 text", c, i + 1);
}

/* Read every line of the NUL-terminated buffer text (len bytes before the terminator;
 * split in place): '#' comments and blank lines skipped, a header, then rows. Lines
 * that are not text (binary data) are refused. */
static int read_lines(char *text, size_t len, reader *r, track *t, vl_status *st)
{
    char *end = text + len;
    int rc = VL_OK;
    for (char *s = text; rc == VL_OK && s < end;) {
        char *nl = memchr(s, '\n', (size_t)(end - s));
        char *stop = nl ? nl : end;
        if (r->line == INT_MAX)
            return vl_fail(st, VL_ERR_INPUT, r->path, r->line, "more than %d lines", INT_MAX);
        r->line++;
        rc = check_text(r, s, (size_t)(stop - s), st);
        if (rc != VL_OK)
            return rc;
        *stop = '\0';
        char *line = trim(s);
        if (*line != '\0' && *line != '#')
            rc = r->header_line ? read_row(r, line, t, st) : read_header(r, line, t, st);
        s = stop + 1;
    }
    return rc;
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

/* The track covers the run [t0, t1] without extrapolation. */
static int track_covers(const track *t, double t0, double t1, vl_status *st)
{
    if (log(t0) < t->ln[COL_AGE][0] || log(t1) > t->ln[COL_AGE][t->n - 1])
        return vl_fail(st, VL_ERR_INPUT, t->label, 0,
                       "track covers ages %.6g-%.6g yr but the run needs %.6g-%.6g yr "
                       "(no extrapolation)", t->first_s / VL_YR, t->last_s / VL_YR, t0 / VL_YR,
                       t1 / VL_YR);
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

vl_star_track *vl_star_track_parse(const char *text, size_t len, const char *label,
                                   vl_status *st)
{
    vl_status_clear(st);
    if (!label)
        label = "(text)";
    if (!text && len > 0) {
        vl_fail(st, VL_ERR_INTERNAL, label, 0, "vl_star_track_parse: no text");
        return NULL;
    }
    track *t = calloc(1, sizeof *t);
    char *buf = len < SIZE_MAX ? malloc(len + 1) : NULL;
    if (!t || !buf) {
        free(t);
        free(buf);
        vl_fail(st, VL_ERR_INTERNAL, label, 0, "out of memory");
        return NULL;
    }
    snprintf(t->label, sizeof t->label, "%s", label);
    if (len > 0)
        memcpy(buf, text, len);
    buf[len] = '\0';
    reader r = {.path = t->label};
    int rc = read_lines(buf, len, &r, t, st);
    free(buf);
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

vl_star_track *vl_star_track_read(const char *path, vl_status *st)
{
    FILE *f = fopen(path, "rb");
    if (!f) {
        vl_fail(st, VL_ERR_IO, path, 0, "cannot open star track: %s", strerror(errno));
        return NULL;
    }
    size_t len = 0, cap = 4096;
    char *buf = malloc(cap);
    while (buf) {
        len += fread(buf + len, 1, cap - len, f);
        if (len < cap)
            break;
        char *bigger = cap <= SIZE_MAX / 2 ? realloc(buf, cap *= 2) : NULL;
        if (!bigger)
            free(buf);
        buf = bigger;
    }
    int err = ferror(f) ? errno : 0;
    fclose(f);
    if (!buf) {
        vl_fail(st, VL_ERR_INTERNAL, path, 0, "out of memory reading the star track");
        return NULL;
    }
    if (err) {
        free(buf);
        vl_fail(st, VL_ERR_IO, path, 0, "read error: %s", strerror(err));
        return NULL;
    }
    vl_star_track *t = vl_star_track_parse(buf, len, path, st);
    free(buf);
    return t;
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

/* Column c (SI) at age t_s, interpolated in log-log; NaN outside the track (never
 * extrapolated). No accelerator: gsl_interp_eval accepts NULL and stays allocation-free. */
static double track_eval(const track *t, int c, double t_s)
{
    double x = log(t_s);
    if (!(x >= t->ln[COL_AGE][0] && x <= t->ln[COL_AGE][t->n - 1]))
        return NAN;
    return exp(gsl_interp_eval(t->interp[c], t->ln[COL_AGE], t->ln[c], x, NULL));
}

/* ---------------------------------------------------------------- the star */

/* Model choices known and the run inside the range where the chosen track is defined. */
static int star_check(vl_star *s, double t0, double t1, vl_status *st)
{
    const vl_star_params *p = &s->p;
    if (p->xuv_model != VL_XUV_RATIO && p->xuv_model != VL_XUV_SOLAR_RIBAS)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "unknown XUV model %d", p->xuv_model);
    switch (p->luminosity_model) {
    case VL_LUM_SUN_ANALYTIC:
        /* The Gough 1981 denominator 1 + 0.4 (1 - t/t_now) vanishes at t = 3.5 t_now. */
        if (!(t1 < 3.5 * p->present_age_s))
            return vl_fail(st, VL_ERR_INPUT, NULL, 0,
                           "star.luminosity_model = sun_analytic diverges at 3.5 x "
                           "star.present_age_yr = %.6g yr; the run ends at %.6g yr",
                           3.5 * p->present_age_s / VL_YR, t1 / VL_YR);
        return VL_OK;
    case VL_LUM_CONSTANT:
    case VL_LUM_CONTRACTING:
        return VL_OK;
    case VL_LUM_TABLE:
        return track_covers(s->tab, t0, t1, st);
    default:
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "unknown luminosity model %d",
                       p->luminosity_model);
    }
}

/* 0 < t0 <= t1, both finite. */
static int check_run(double t0, double t1, vl_status *st)
{
    if (t0 > 0.0 && t1 >= t0 && isfinite(t1))
        return VL_OK;
    return vl_fail(st, VL_ERR_INPUT, NULL, 0,
                   "star: the run needs 0 < start age <= end age (got %g and %g yr)",
                   t0 / VL_YR, t1 / VL_YR);
}

/* The star of p over [t0, t1], with tab (owned from here on, freed on failure) as its
 * luminosity table when not NULL. */
static vl_star *build(const vl_star_params *p, track *tab, double t0, double t1, vl_status *st)
{
    vl_star *s = NULL;
    if (check_run(t0, t1, st) == VL_OK && !(s = calloc(1, sizeof *s)))
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    if (!s) {
        vl_star_track_free(tab);
        return NULL;
    }
    s->p = *p;
    s->tab = tab;
    if (tab)
        s->p.luminosity_model = VL_LUM_TABLE;
    s->l_xuv_sun_now_w = vl_star_ribas_flux_1au(SUN_AGE_S) * 4.0 * VL_PI * VL_AU * VL_AU;
    if (star_check(s, t0, t1, st) != VL_OK) {
        vl_star_free(s);
        return NULL;
    }
    return s;
}

vl_star *vl_star_new(const vl_star_params *p, double t_start_s, double t_end_s, vl_status *st)
{
    if (p->luminosity_model != VL_LUM_TABLE)
        return build(p, NULL, t_start_s, t_end_s, st);
    if (check_run(t_start_s, t_end_s, st) != VL_OK)
        return NULL;
    if (p->track_file[0] == '\0') {
        vl_fail(st, VL_ERR_INPUT, NULL, 0, "star.luminosity_model = table needs star.track_file");
        return NULL;
    }
    track *tab = vl_star_track_read(p->track_file, st);
    return tab ? build(p, tab, t_start_s, t_end_s, st) : NULL;
}

vl_star *vl_star_new_track(const vl_star_params *p, vl_star_track *tab, double t_start_s,
                           double t_end_s, vl_status *st)
{
    if (!tab) {
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "vl_star_new_track: no track");
        return NULL;
    }
    return build(p, tab, t_start_s, t_end_s, st);
}

void vl_star_free(vl_star *s)
{
    if (!s)
        return;
    vl_star_track_free(s->tab);
    free(s);
}

/* Bolometric luminosity, W. Contracting: Hayashi-track scaling L ~ t^(-2/3)
 * (textbook) until the main sequence at contraction_end_s, constant after. */
static double star_lbol(const vl_star *s, double t_s)
{
    const vl_star_params *p = &s->p;
    switch (p->luminosity_model) {
    case VL_LUM_SUN_ANALYTIC:
        return p->luminosity_w * vl_star_gough_ratio(t_s, p->present_age_s);
    case VL_LUM_CONSTANT:
        return p->luminosity_w;
    case VL_LUM_CONTRACTING:
        if (t_s < p->contraction_end_s)
            return p->luminosity_w * pow(t_s / p->contraction_end_s, -2.0 / 3.0);
        return p->luminosity_w;
    case VL_LUM_TABLE:
        return track_eval(s->tab, COL_LUM, t_s);
    default:
        return NAN;
    }
}

int vl_star_xuv_from_track(const vl_star *s)
{
    return s->p.luminosity_model == VL_LUM_TABLE && s->tab && s->tab->interp[COL_XUV] != NULL;
}

/* XUV luminosity, W: the track's column when present, else the XUV model.
 * Ratio (Luger & Barnes 2015, Astrobiology 15:119): f_sat L_bol, times (t/t_sat)^-beta
 * after saturation. Solar: Ribas et al. 2005 flux at 1 au times 4 pi au^2. */
static double star_lxuv(const vl_star *s, double t_s, double l_bol)
{
    const vl_star_params *p = &s->p;
    if (vl_star_xuv_from_track(s))
        return track_eval(s->tab, COL_XUV, t_s);
    if (p->xuv_model == VL_XUV_SOLAR_RIBAS)
        return vl_star_ribas_flux_1au(t_s) * 4.0 * VL_PI * VL_AU * VL_AU;
    double l = p->xuv_sat_ratio * l_bol;
    if (t_s > p->xuv_sat_end_s)
        l *= pow(t_s / p->xuv_sat_end_s, -p->xuv_decay_exp);
    return l;
}

/* Outside a table's ages every table-derived field is NaN (never extrapolated). */
void vl_star_eval(const vl_star *s, double t_s, vl_star_state *out)
{
    const vl_star_params *p = &s->p;
    out->l_bol_w = star_lbol(s, t_s);
    out->teff_k = p->luminosity_model == VL_LUM_TABLE && s->tab && s->tab->interp[COL_TEFF]
                      ? track_eval(s->tab, COL_TEFF, t_s)
                      : p->teff_k;
    out->l_xuv_w = star_lxuv(s, t_s, out->l_bol_w);
    /* Assumption (no published law): the H2O-dissociating photon output scales with the
     * XUV luminosity, normalised so that the present Sun (Ribas et al. 2005 at 4.57 Gyr)
     * gives lya_photon_flux at 1 au. */
    out->lya_flux_1au = p->lya_photon_flux * out->l_xuv_w / s->l_xuv_sun_now_w;
    /* Wind: power-law decline, Wood et al. 2005, ApJ 628:L143. */
    out->wind_mdot_kg_s = p->wind_mdot_kg_s * pow(t_s / p->wind_ref_age_s, -p->wind_decay_exp);
    out->wind_speed_m_s = p->wind_speed_m_s;
}
