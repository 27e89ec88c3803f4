/* star.c: bolometric luminosity, effective temperature, XUV, Lyman-alpha and wind
 * against stellar age (star.h). Luminosity: the Gough 1981 solar track, a constant,
 * pre-main-sequence contraction, or a tabulated track (track.h, read and interpolated in
 * src/input/track.c). XUV: a saturated ratio with power-law decay, the solar fit of
 * Ribas et al. 2005, or the track's own column. */
#include "volev/star.h"

#include <math.h>
#include <stdlib.h>

#include "volev/units.h"

#define GYR_S (1.0e9 * VL_YR)
/* Age of the present Sun, the reference of the Lyman-alpha scaling
 * (4.57 Gyr, Bahcall, Pinsonneault & Wasserburg 1995, from memory). */
#define SUN_AGE_S (4.57e9 * VL_YR)

typedef struct vl_star_track track;

struct vl_star {
    vl_star_params p;           /* copy of the scenario's star block */
    double l_xuv_sun_now_w;     /* present solar XUV (Ribas et al. 2005 at SUN_AGE_S), W */
    track *tab;                 /* owned; luminosity_model = table only, else NULL */
};

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
        return vl_star_track_covers(s->tab, t0, t1, st);
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
        return vl_star_track_eval(s->tab, VL_TRACK_LUM, t_s);
    default:
        return NAN;
    }
}

int vl_star_xuv_from_track(const vl_star *s)
{
    return s->p.luminosity_model == VL_LUM_TABLE && vl_star_track_has(s->tab, VL_TRACK_XUV);
}

int vl_star_teff_from_track(const vl_star *s)
{
    return s->p.luminosity_model == VL_LUM_TABLE && vl_star_track_has(s->tab, VL_TRACK_TEFF);
}

/* XUV luminosity, W: the track's column when present, else the XUV model.
 * Ratio (Luger & Barnes 2015, Astrobiology 15:119): f_sat L_bol, times (t/t_sat)^-beta
 * after saturation. Solar: Ribas et al. 2005 flux at 1 au times 4 pi au^2. */
static double star_lxuv(const vl_star *s, double t_s, double l_bol)
{
    const vl_star_params *p = &s->p;
    if (vl_star_xuv_from_track(s))
        return vl_star_track_eval(s->tab, VL_TRACK_XUV, t_s);
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
    out->teff_k = vl_star_teff_from_track(s) ? vl_star_track_eval(s->tab, VL_TRACK_TEFF, t_s)
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
