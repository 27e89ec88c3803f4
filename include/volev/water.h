/* water.h: water thermodynamics used by the climate. */
#ifndef VOLEV_WATER_H
#define VOLEV_WATER_H

#define VL_WATER_TC_K 647.096      /* critical temperature (IAPWS-95) */
#define VL_WATER_PC_PA 22.064e6    /* critical pressure (IAPWS-95) */
#define VL_WATER_TTRIPLE_K 273.16  /* triple point (IAPWS-95) */

/* Saturation vapour pressure over liquid water, Pa, 273.16 K <= T <= T_c
 * (Wagner & Pruss 1993, J. Phys. Chem. Ref. Data 22:783, eq. 2.5). */
double vl_water_psat_liquid(double t_k);

/* Saturation vapour pressure over ice Ih, Pa, T > 110 K
 * (Murphy & Koop 2005, QJRMS 131:1539, eq. 7). */
double vl_water_psat_ice(double t_k);

/* Saturation pressure over the stable condensed phase: ice below the triple point,
 * liquid up to T_c; above T_c returns +INFINITY (no condensed phase); 0 at and below
 * 0 K (the ice curve's limit), NaN for NaN. */
double vl_water_psat(double t_k);

/* The temperature at which vl_water_psat equals p_pa, K (its inverse, by bisection in
 * ln p to 1e-9 relative; T_c at and above the critical pressure, 110 K below the
 * saturation pressure there). */
double vl_water_tsat(double p_pa);

/* Latent heat of vaporisation, J/kg, 273.16 K <= T <= T_c: Watson (1943) correlation
 * L = L_tp ((T_c - T)/(T_c - T_tp))^0.38 anchored at L_tp = 2.5009e6 J/kg at the triple
 * point (IAPWS-95 tables, from memory); 0 at and above T_c. Within 2 % of the steam
 * tables up to 500 K. */
double vl_water_latent_vap(double t_k);

/* Latent heat of the phase change from the stable condensed phase to vapour, J/kg:
 * sublimation below the triple point (L_vap(T_tp) + 3.337e5 J/kg of fusion, common
 * practice), vaporisation above. */
double vl_water_latent(double t_k);

/* Specific heat of water vapour at constant pressure, J kg^-1 K^-1 (ideal gas near
 * 300 K: 1864, NIST-JANAF, from memory). */
#define VL_WATER_CP_VAPOUR 1864.0

#endif
