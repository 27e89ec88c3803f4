/* column.c: one point of the column climate (column.h). */
#include "volev/column.h"

#include <math.h>

#include "volev/units.h"

/* Stratosphere temperature for an OLR: the skin temperature (OLR / 2 sigma)^(1/4) less
 * the offset, at least 1 K. */
static double strat_temp(const vl_column_opts *o, double olr)
{
    double t = pow(fmax(olr, 0.0) / (2.0 * VL_SIGMA_SB), 0.25) - o->strat_offset_k;
    return t > 1.0 ? t : 1.0;
}

void vl_column_point_eval(const vl_column_opts *o, const vl_column_gases *gs, double t_s,
                          vl_column_point *out)
{
    vl_profile pr;
    /* guess: the smaller of the surface's emission and a steam-like 280 W/m^2 */
    double olr = fmin(280.0, VL_SIGMA_SB * t_s * t_s * t_s * t_s);
    for (int it = 0; it < 1; it++) {
        vl_profile_build(gs, o->g, t_s, strat_temp(o, olr), &pr);
        olr = vl_radiation_olr(&o->scales, &pr, o->g);
    }
    out->t_strat = strat_temp(o, olr);
    vl_profile_build(gs, o->g, t_s, out->t_strat, &pr);
    vl_radiation_out ro;
    vl_radiation_eval(&o->scales, &pr, o->g, o->cloud.tau_sw > 0.0 ? &o->cloud : NULL, &ro);
    for (int c = 0; c < 2; c++) {
        out->olr[c] = ro.olr[c];
        out->sw[c] = ro.sw[c];
    }
    out->f_strat = pr.f_strat;
    out->p_surf = pr.p_surf;
    out->vapour = pr.vapour;
}
