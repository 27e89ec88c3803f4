/* scaling.h: how processes scale from their reference planet (Earth today) to the run's
 * planet and age: with the interior's activity (the heat flow relative to its reference,
 * and the tectonic mode) and with the surface area. Shared by outgassing,
 * volcanic_reductants, crust_oxidation, rock_oxidation and the weathering processes.
 * Private to src/physics/processes. */
#ifndef VOLEV_PROCESSES_SCALING_H
#define VOLEV_PROCESSES_SCALING_H

#include "volev/env.h"
#include "volev/planet.h"

/* The interior's activity: (Q/Q0)^exponent with Q/Q0 = env->heat_flow_rel (0 where it is
 * negative), or (Q/Q0)^stagnant_exponent under a stagnant lid. */
double vl_scaling_activity(const vl_planet *pl, const vl_env *env, double exponent,
                           double stagnant_exponent);
/* The stagnant lid's share of the mobile-lid rate: stagnant_factor under a stagnant lid,
 * else 1. */
double vl_scaling_lid(const vl_planet *pl, double stagnant_factor);
/* The planet's surface area over Earth's, A_p / (4 pi R_earth^2). */
double vl_scaling_area(const vl_planet *pl);

#endif
