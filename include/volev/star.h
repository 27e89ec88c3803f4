/* star.h: stellar luminosity, effective temperature, XUV, Lyman-alpha and wind
 * against stellar age. Equations and references: docs/model.md, "Star". */
#ifndef VOLEV_STAR_H
#define VOLEV_STAR_H

#include <stddef.h>

#include "volev/scenario.h"
#include "volev/status.h"
#include "volev/track.h"

typedef struct vl_star vl_star;   /* opaque; immutable after vl_star_new */

typedef struct vl_star_state {
    double l_bol_w;          /* bolometric luminosity, W */
    double teff_k;           /* effective temperature, K */
    double l_xuv_w;          /* X-ray + EUV luminosity (1-1200 A), W */
    double lya_flux_1au;     /* H2O-dissociating photon flux at 1 au, photons m^-2 s^-1 */
    double wind_mdot_kg_s;   /* wind mass-loss rate, kg/s */
    double wind_speed_m_s;   /* wind speed, m/s */
} vl_star_state;

/* Build the star for ages [t_start_s, t_end_s]; a table star reads its track file with
 * vl_star_track_read and checks that it covers the run. NULL on error. */
vl_star *vl_star_new(const vl_star_params *p, double t_start_s, double t_end_s, vl_status *st);
/* The same with a track already read: a table star whatever p->luminosity_model and
 * p->track_file say. Takes track over in every case (freed with the star, or at once on
 * error). */
vl_star *vl_star_new_track(const vl_star_params *p, vl_star_track *track, double t_start_s,
                           double t_end_s, vl_status *st);
void vl_star_free(vl_star *s);   /* accepts NULL */

/* State of the star at age t_s (s). Requires t_s > 0 and, for a table, inside the table. */
void vl_star_eval(const vl_star *s, double t_s, vl_star_state *out);

/* 1 if the star's XUV comes from a track column (xuv_lsun), so star.xuv.* is unused. */
int vl_star_xuv_from_track(const vl_star *s);
/* 1 if the star's effective temperature comes from a track column (teff_k), so
 * star.teff_k is unused. */
int vl_star_teff_from_track(const vl_star *s);

/* Orbit-averaged flux at distance a (m) with eccentricity e: L / (4 pi a^2 sqrt(1-e^2)). */
double vl_star_orbit_flux(double l_w, double a_m, double e);

/* Sun analytic track (Gough 1981, Sol. Phys. 74:21, eq. 1): L(t)/L_now. */
double vl_star_gough_ratio(double t_s, double t_now_s);

/* Solar XUV (1-1200 A) flux at 1 au (Ribas et al. 2005, ApJ 622:680, eq. 1),
 * W/m^2; constant before 0.1 Gyr. */
double vl_star_ribas_flux_1au(double t_s);

#endif
