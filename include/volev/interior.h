/* interior.h: the planet's interior heat flow history, which scales outgassing,
 * spreading and the exchange of volatiles with the mantle. Equations: docs/cycles.md. */
#ifndef VOLEV_INTERIOR_H
#define VOLEV_INTERIOR_H

#include "volev/scenario.h"

/* Half-lives (Gyr) of the heat-producing isotopes (common practice; e.g. Turcotte &
 * Schubert 2014, Geodynamics, table 4.2): U-238 4.468, U-235 0.7038, Th-232 14.05,
 * K-40 1.248. */
#define VL_HALF_LIFE_U238_GYR 4.468
#define VL_HALF_LIFE_U235_GYR 0.7038
#define VL_HALF_LIFE_TH232_GYR 14.05
#define VL_HALF_LIFE_K40_GYR 1.248

/* Heat flow at age t_s relative to its value at the reference age (1 there). */
double vl_interior_heat_flow_rel(const vl_interior_params *p, double t_s);

#endif
