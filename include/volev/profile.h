/* profile.h: the temperature and composition of a one-dimensional atmosphere from the
 * surface up, on fixed pressure levels: a dry adiabat where the air is unsaturated,
 * the non-dilute moist pseudo-adiabat of water where it is saturated (the
 * Clausius-Clapeyron curve in a pure steam column), CO2 condensation where its partial
 * pressure exceeds saturation, and an isothermal stratosphere with the water of the
 * cold trap above. Equations: docs/model.md section 3.2. */
#ifndef VOLEV_PROFILE_H
#define VOLEV_PROFILE_H

#include "volev/env.h"

#ifndef VL_PROFILE_LEVELS
#define VL_PROFILE_LEVELS 40
#endif

/* Specific heat at constant pressure near 300 K, J kg^-1 K^-1 (NIST-JANAF tables,
 * from memory): N2 1040, O2 918, CO2 846, H2 14310. */
#define VL_CP_N2 1040.0
#define VL_CP_O2 918.0
#define VL_CP_CO2 846.0
#define VL_CP_H2 14310.0

/* The gases of the column: masses per unit area, kg/m^2 (water: what the surface holds
 * in all, ocean and vapour; the atmosphere takes what saturation allows). */
typedef struct vl_column_gases {
    double co2, bg, h2;        /* CO2; the N2-like background (N2, O2); H2 */
    double water;              /* surface water available (HUGE_VAL: an ocean that never runs out) */
} vl_column_gases;

typedef struct vl_profile {
    int n;                     /* levels, surface first */
    double p[VL_PROFILE_LEVELS];             /* pressure, Pa */
    double t[VL_PROFILE_LEVELS];             /* temperature, K */
    double x[VL_PROFILE_LEVELS][VL_NGASES];  /* mole fractions (enum vl_gas) */
    double m_mean[VL_PROFILE_LEVELS];        /* mean molar mass, kg/mol */
    double p_surf;             /* surface pressure, Pa */
    double vapour;             /* water in the air, kg/m^2 */
    double t_strat;            /* stratosphere temperature, K */
    double p_trop;             /* tropopause pressure, Pa */
    double f_strat;            /* H2O mole fraction above the tropopause (the cold trap) */
    int saturated_surface;     /* 1: the surface holds liquid or ice in equilibrium with the air */
} vl_profile;

/* The profile over a surface at t_s with the gases gs, gravity g and stratosphere
 * temperature t_strat (clamped to t_s). */
void vl_profile_build(const vl_column_gases *gs, double g, double t_s, double t_strat,
                      vl_profile *out);

/* Water vapour (kg/m^2) in the air over a surface at t_s holding water_kg_m2, with the
 * dry gases gs: saturated (thin shell, mole-fraction partial pressure) while the
 * surface keeps some, all of it above the critical point or when it would not saturate. */
double vl_profile_vapour(const vl_column_gases *gs, double g, double t_s);

#endif
