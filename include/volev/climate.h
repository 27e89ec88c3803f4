/* climate.h: the climate interface. A backend turns the instantaneous state
 * (star, atmosphere) into surface temperature, ocean/vapour partition,
 * stratospheric water and regime. Backends: hz_fit (climate_hzfit.c). */
#ifndef VOLEV_CLIMATE_H
#define VOLEV_CLIMATE_H

#include "volev/env.h"
#include "volev/scenario.h"

typedef struct vl_climate vl_climate;  /* opaque; fixed once created, shareable */
/* What a run keeps between calls (tables built on demand, caches): one per run, never
 * shared between threads. */
typedef struct vl_climate_work vl_climate_work;

vl_climate *vl_climate_new(const vl_scenario *sc, vl_status *st);
void vl_climate_free(vl_climate *c);   /* accepts NULL */

/* A fresh workspace for runs of c; NULL with st filled when out of memory. */
vl_climate_work *vl_climate_work_new(const vl_climate *c, vl_status *st);
void vl_climate_work_free(vl_climate_work *w);  /* accepts NULL */

/* Fill env->t_surf_k, t_balance_k, vapour_kg, ocean_kg, mass_kg[VL_GAS_H2O], f_strat,
 * s_runaway, s_moist and liquid for the regime env->regime. Before the call env holds
 * star, instellation, s_eff, g, area_m2 and mass_kg of every gas but H2O; water_kg is
 * the surface water reservoir. The caller then derives p_pa, x, p_surf_pa and
 * m_mean_kg from mass_kg. The hz_fit greenhouse uses the CO2 partial pressure in dry
 * air (no circular dependence on the vapour). Continuous in the state for a fixed
 * regime. */
void vl_climate_eval(const vl_climate *c, vl_climate_work *w, double water_kg, vl_env *env);

/* The regime the conditions in env call for (env filled by vl_climate_eval). */
int vl_climate_classify(const vl_climate *c, vl_climate_work *w, double water_kg,
                        const vl_env *env);

/* The energy-balance curves at the instant in env (star and dry atmosphere): for each
 * surface temperature of the climate's grid (t_k NULL) or of t_k[0..n-1] (n at most
 * VL_CURVE_MAX), OLR, absorbed stellar flux, planetary albedo and stratospheric H2O
 * mixing ratio, as the balance interpolates them. wet: over an ocean (1) or without
 * water (0). The thresholds s_runaway and s_moist always come from the grid. Returns
 * the number of points, or 0 if the backend has no such curves (hz_fit). */
#define VL_CURVE_MAX 512
typedef struct vl_curve {
    double t_k[VL_CURVE_MAX];
    double olr[VL_CURVE_MAX];       /* W/m^2 */
    double absorbed[VL_CURVE_MAX];  /* W/m^2 */
    double albedo[VL_CURVE_MAX];
    double f_strat[VL_CURVE_MAX];
    double s_runaway;               /* the largest S_eff with a warm equilibrium */
    double s_moist;                 /* S_eff at which it reaches the moist greenhouse (inf: never) */
} vl_curve;
size_t vl_climate_curve(const vl_climate *c, vl_climate_work *w, const vl_env *env, int wet,
                        const double *t_k, size_t n, vl_curve *out);

/* Table statistics of a workspace: points computed so far and the wall time spent. */
void vl_climate_work_stats(const vl_climate_work *w, long *nodes, double *build_s);

/* The column climate's table cache on disk (climate_disk.c). Off until configured:
 * folder NULL or "" turns it off; otherwise tables are read from and appended to
 * FOLDER/column-KEY.pts (the folder and its parents are made if missing). Points
 * buffered under the previous configuration are written first, and the previous error
 * is forgotten. Returns VL_OK, or VL_ERR_IO with st filled (the cache then off) when
 * the folder cannot be made. Tables made before the call are not read again. */
int vl_climate_cache_configure(const char *folder, vl_status *st);
/* Write every point computed since the last flush (safe to call at any time, from any
 * thread; also called at exit once configured). */
void vl_climate_cache_flush(void);
/* NULL, or the first write error of the cache since it was configured ("PATH: reason");
 * the cache has then turned itself off for the rest of the process. A write error
 * never fails a run: the program reports it as a warning. The text stays valid until
 * the next vl_climate_cache_configure. */
const char *vl_climate_cache_error(void);

/* Kopparapu et al. 2013 (ApJ 765:131, erratum ApJ 770:82) effective-flux limits. */
enum vl_hz_limit { VL_HZ_RECENT_VENUS, VL_HZ_RUNAWAY, VL_HZ_MOIST, VL_HZ_MAX_GREENHOUSE,
                   VL_HZ_EARLY_MARS, VL_NHZ };
/* S_eff (units of VL_S_EARTH) of limit at teff_k, valid 2600-7200 K (clamped outside). */
double vl_hz_seff_2013(int limit, double teff_k);
/* Kopparapu et al. 2014 (ApJL 787:L29) runaway greenhouse S_eff for planet mass in
 * Earth masses, interpolated linearly in log mass between the 0.1, 1 and 5 M_earth
 * fits and clamped outside [0.1, 5]. */
double vl_hz_seff_runaway_2014(double mass_mearth, double teff_k);
/* hz_fit's greenhouse term bounded below: g for g >= 2 K, 0 for g <= -2 K, a C1
 * quadratic between (never negative, never below g). */
double vl_hzfit_greenhouse_knee(double g_k);
/* hz_fit's equilibrium temperature, K: [S (1 - A) / (4 sigma) + T_CMB^4]^(1/4) for
 * instellation S (W/m^2) and Bond albedo A; at least VL_T_CMB_K. */
double vl_hzfit_equilibrium_temp(double instellation, double bond_albedo);

const char *vl_regime_name(int regime);

#endif
