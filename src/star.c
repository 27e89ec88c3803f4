/* star.c: bolometric luminosity, effective temperature, XUV, Lyman-alpha and wind
 * against stellar age (star.h). Luminosity: the Gough 1981 solar track, a constant,
 * pre-main-sequence contraction, or a CSV track interpolated in log-log. XUV: a
 * saturated ratio with power-law decay, the solar fit of Ribas et al. 2005, or the
 * track's own column. */
#include "volev/star.h"

#include <errno.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include <gsl/gsl_interp.h>

#include "volev/units.h"

#define GYR_S (1.0e9 * VL_YR)
/* Age of the present Sun, the reference of the Lyman-alpha scaling
 * (4.57 Gyr, Bahcall, Pinsonneault & Wasserburg 1995, from memory). */
#define SUN_AGE_S (4.57e9 * VL_YR)

/* Columns of a track file; the age column is the abscissa. */
enum { COL_AGE, COL_LUM, COL_TEFF, COL_XUV, NCOL };

static const struct {
    const char *name;   /* header name */
    double to_si;       /* file value * to_si = SI value */
    int required;
} columns[NCOL] = {
    {"age_yr", VL_YR, 1},
    {"luminosity_lsun", VL_L_SUN, 1},
    {"teff_k", 1.0, 0},
    {"xuv_lsun", VL_L_SUN, 0},
};

/* A tabulated track: natural logs of SI values, ages strictly increasing. */
typedef struct track {
    size_t n, cap;              /* rows held, rows allocated */
    double *ln[NCOL];           /* owned; NULL for an absent column */
    gsl_interp *interp[NCOL];   /* owned; NULL for the age column and absent columns */
} track;

struct vl_star {
    vl_star_params p;           /* copy of the scenario's star block */
    double l_xuv_sun_now_w;     /* present solar XUV (Ribas et al. 2005 at SUN_AGE_S), W */
    track tab;                  /* filled for luminosity_model = table only */
};

/* State of the header while reading a track file. */
typedef struct reader {
    const char *path;
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

/* Convert one field: a finite positive number in the column's file unit. */
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
    double ln[NCOL];
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
        ln[c] = log(v * columns[c].to_si);
    }
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
    t->n++;
    return VL_OK;
}

/* Read every line of f: '#' comments and blank lines skipped, a header, then rows. */
static int read_lines(FILE *f, reader *r, track *t, vl_status *st)
{
    char *buf = NULL;
    size_t size = 0;
    int rc = VL_OK;
    while (rc == VL_OK && getline(&buf, &size, f) >= 0) {
        r->line++;
        char *s = trim(buf);
        if (*s == '\0' || *s == '#')
            continue;
        rc = r->header_line ? read_row(r, s, t, st) : read_header(r, s, t, st);
    }
    free(buf);
    if (rc == VL_OK && ferror(f))
        rc = vl_fail(st, VL_ERR_IO, r->path, 0, "read error: %s", strerror(errno));
    return rc;
}

/* The track must hold two rows or more and cover the run without extrapolation. */
static int track_check(const reader *r, const track *t, double t0, double t1, vl_status *st)
{
    if (!r->header_line)
        return vl_fail(st, VL_ERR_INPUT, r->path, 0,
                       "no header line (needs columns age_yr,luminosity_lsun; optional "
                       "teff_k,xuv_lsun)");
    if (t->n < 2)
        return vl_fail(st, VL_ERR_INPUT, r->path, 0,
                       "%zu data row(s); a track needs at least 2", t->n);
    double a0 = exp(t->ln[COL_AGE][0]), a1 = exp(t->ln[COL_AGE][t->n - 1]);
    if (log(t0) < t->ln[COL_AGE][0] || log(t1) > t->ln[COL_AGE][t->n - 1])
        return vl_fail(st, VL_ERR_INPUT, r->path, 0,
                       "track covers ages %.6g-%.6g yr but the run needs %.6g-%.6g yr "
                       "(no extrapolation)", a0 / VL_YR, a1 / VL_YR, t0 / VL_YR, t1 / VL_YR);
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

/* Read, check and interpolate the track file for ages [t0, t1]. */
static int track_load(track *t, const char *path, double t0, double t1, vl_status *st)
{
    reader r = {.path = path};
    if (path[0] == '\0')
        return vl_fail(st, VL_ERR_INPUT, NULL, 0,
                       "star.luminosity_model = table needs star.track_file");
    FILE *f = fopen(path, "r");
    if (!f)
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot open star track: %s", strerror(errno));
    int rc = read_lines(f, &r, t, st);
    fclose(f);
    if (rc == VL_OK)
        rc = track_check(&r, t, t0, t1, st);
    if (rc == VL_OK)
        rc = track_interp(t, st);
    return rc;
}

/* Release the interpolants and columns (absent ones are NULL). */
static void track_free(track *t)
{
    for (int c = 0; c < NCOL; c++) {
        gsl_interp_free(t->interp[c]);
        free(t->ln[c]);
    }
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
        return track_load(&s->tab, p->track_file, t0, t1, st);
    default:
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "unknown luminosity model %d",
                       p->luminosity_model);
    }
}

vl_star *vl_star_new(const vl_star_params *p, double t_start_s, double t_end_s, vl_status *st)
{
    if (!(t_start_s > 0.0 && t_end_s >= t_start_s && isfinite(t_end_s))) {
        vl_fail(st, VL_ERR_INPUT, NULL, 0,
                "star: the run needs 0 < start age <= end age (got %g and %g yr)",
                t_start_s / VL_YR, t_end_s / VL_YR);
        return NULL;
    }
    vl_star *s = calloc(1, sizeof *s);
    if (!s) {
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        return NULL;
    }
    s->p = *p;
    s->l_xuv_sun_now_w = vl_star_ribas_flux_1au(SUN_AGE_S) * 4.0 * VL_PI * VL_AU * VL_AU;
    if (star_check(s, t_start_s, t_end_s, st) != VL_OK) {
        vl_star_free(s);
        return NULL;
    }
    return s;
}

void vl_star_free(vl_star *s)
{
    if (!s)
        return;
    track_free(&s->tab);
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
        return track_eval(&s->tab, COL_LUM, t_s);
    default:
        return NAN;
    }
}

int vl_star_xuv_from_track(const vl_star *s)
{
    return s->p.luminosity_model == VL_LUM_TABLE && s->tab.interp[COL_XUV] != NULL;
}

/* XUV luminosity, W: the track's column when present, else the XUV model.
 * Ratio (Luger & Barnes 2015, Astrobiology 15:119): f_sat L_bol, times (t/t_sat)^-beta
 * after saturation. Solar: Ribas et al. 2005 flux at 1 au times 4 pi au^2. */
static double star_lxuv(const vl_star *s, double t_s, double l_bol)
{
    const vl_star_params *p = &s->p;
    if (vl_star_xuv_from_track(s))
        return track_eval(&s->tab, COL_XUV, t_s);
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
    out->teff_k = p->luminosity_model == VL_LUM_TABLE && s->tab.interp[COL_TEFF]
                      ? track_eval(&s->tab, COL_TEFF, t_s)
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
