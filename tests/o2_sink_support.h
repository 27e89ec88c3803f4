/* o2_sink_support.h: present-Earth fixtures shared by the tests of the supply-limited O2
 * sinks (test_crust_oxidation.c, test_rock_oxidation.c). */
#ifndef VOLEV_TESTS_O2_SINK_SUPPORT_H
#define VOLEV_TESTS_O2_SINK_SUPPORT_H

#include <stddef.h>

#include "volev/model.h"

/* Present Earth's stellar age, s, and O2 partial pressure, Pa: mole fraction 0.2095 x
 * 1.01325 bar (common practice). */
#define VL_O2_T_NOW (4.57e9 * VL_YR)
#define VL_O2_P_NOW (0.2095 * 101325.0)

/* Present Earth: one ocean, N2 3.887e18 kg and O2 1.2e18 kg (common practice). */
void vl_o2_earth_state(double y[VL_NSTATE]);
/* The model of the default scenario with process switched on and the overrides
 * sets[0..n) (n < 7); the scenario into sc. */
vl_model *vl_o2_model(const char *process, const char *const *sets, size_t n,
                      vl_scenario **sc);
/* Present Earth's environment at y: present heat flow and O2, temperate, an ice-free
 * ocean. */
void vl_o2_earth_env(const vl_model *m, const double *y, vl_env *env);
/* The process's O2 uptake alone at (y, env), mol O2 per year (its first column); its
 * tendencies into dydt. */
double vl_o2_uptake(const vl_model *m, const char *process, const double *y, const vl_env *env,
                    double *dydt);

#endif
