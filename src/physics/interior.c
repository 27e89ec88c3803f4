/* interior.c: heat flow history (interior.h).
 *  - radiogenic: Q/Q_ref = sum_i s_i exp(ln 2 (t_ref - t)/tau_i) over U-238, U-235,
 *    Th-232 and K-40 with present heat shares s_i (normalised to 1): the heat flow is
 *    taken proportional to the radiogenic heat production (a constant Urey ratio;
 *    secular cooling is not modelled separately);
 *  - exponential: Q/Q_ref = exp((t_ref - t)/tau);
 *  - power law: Q/Q_ref = (t/t_ref)^-n. */
#include "volev/interior.h"

#include <math.h>

#include "volev/units.h"

double vl_interior_heat_flow_rel(const vl_interior_params *p, double t_s)
{
    double dt = p->ref_age_s - t_s;
    switch (p->heat_model) {
    case VL_HEAT_EXPONENTIAL:
        return exp(dt / p->efold_s);
    case VL_HEAT_POWER_LAW:
        return pow(t_s / p->ref_age_s, -p->power_exp);
    default: {
        static const double half[4] = {VL_HALF_LIFE_U238_GYR, VL_HALF_LIFE_U235_GYR,
                                       VL_HALF_LIFE_TH232_GYR, VL_HALF_LIFE_K40_GYR};
        double sum = 0.0, norm = 0.0;
        for (int i = 0; i < 4; i++) {
            sum += p->share[i] * exp(log(2.0) * dt / (half[i] * 1e9 * VL_YR));
            norm += p->share[i];
        }
        return norm > 0.0 ? sum / norm : 1.0;
    }
    }
}
