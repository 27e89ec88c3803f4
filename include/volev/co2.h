/* co2.h: the saturation curve of carbon dioxide, which limits the upper troposphere of
 * thick CO2 atmospheres on cold planets (the column condenses CO2 where its partial
 * pressure exceeds saturation). */
#ifndef VOLEV_CO2_H
#define VOLEV_CO2_H

#define VL_CO2_TC_K 304.1282      /* critical temperature (Span & Wagner 1996) */
#define VL_CO2_PC_PA 7.3773e6     /* critical pressure */
#define VL_CO2_TT_K 216.592       /* triple point temperature */
#define VL_CO2_PT_PA 0.51795e6    /* triple point pressure */

/* Saturation pressure, Pa: over the liquid from the triple to the critical point, over
 * the solid below the triple point (Span & Wagner 1996, J. Phys. Chem. Ref. Data 25:1509,
 * eqs. 3.13 and 3.12); +INFINITY above the critical point. */
double vl_co2_psat(double t_k);

/* The temperature at which the saturation pressure is p_pa (the inverse of
 * vl_co2_psat; VL_CO2_TC_K at and above the critical pressure), K. */
double vl_co2_tsat(double p_pa);

#endif
