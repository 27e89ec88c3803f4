/* scaling.c: scaling from the reference planet to the run's (scaling.h). */
#include "scaling.h"

#include <math.h>

#include "volev/units.h"

double vl_scaling_activity(const vl_planet *pl, const vl_env *env, double exponent,
                           double stagnant_exponent)
{
    double q = env->heat_flow_rel > 0.0 ? env->heat_flow_rel : 0.0;
    return pow(q, pl->tectonics == VL_TECTONICS_STAGNANT ? stagnant_exponent : exponent);
}

double vl_scaling_lid(const vl_planet *pl, double stagnant_factor)
{
    return pl->tectonics == VL_TECTONICS_STAGNANT ? stagnant_factor : 1.0;
}

double vl_scaling_area(const vl_planet *pl)
{
    return pl->area_m2 / (4.0 * VL_PI * VL_R_EARTH * VL_R_EARTH);
}
