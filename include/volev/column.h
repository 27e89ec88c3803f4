/* column.h: one point of the radiative column climate: for a surface temperature and
 * the column's gases, the profile (profile.h) with its stratosphere at the skin
 * temperature of the column's own outgoing radiation, and the radiation through it
 * (radiation.h), clear and cloudy. Equations, coefficients and calibration:
 * docs/model.md sections 3.2-3.4. */
#ifndef VOLEV_COLUMN_H
#define VOLEV_COLUMN_H

#include "volev/profile.h"
#include "volev/radiation.h"

typedef struct vl_column_opts {
    double g;                  /* surface gravity, m/s^2 */
    vl_opacity_scales scales;  /* on the tabulated absorption */
    double strat_offset_k;     /* stratosphere = skin temperature (OLR/2 sigma)^(1/4) less this */
    vl_cloud cloud;            /* the cloud layer (tau_sw 0: none) */
} vl_column_opts;

/* What the climate keeps of one point. */
typedef struct vl_column_point {
    double olr[2];             /* W/m^2: clear, cloudy */
    vl_starlight sw[2];        /* clear, cloudy */
    double f_strat;            /* H2O mole fraction above the cold trap */
    double t_strat;            /* stratosphere temperature, K */
    double p_surf;             /* surface pressure, Pa */
    double vapour;             /* water vapour in the air, kg/m^2 */
} vl_column_point;

/* The point at surface temperature t_s over the gases gs (kg/m^2). The stratosphere
 * temperature follows the clear-sky OLR by fixed-point iteration (three passes from a
 * guess: the OLR changes by far less than its tolerance after the second). */
void vl_column_point_eval(const vl_column_opts *o, const vl_column_gases *gs, double t_s,
                          vl_column_point *out);

#endif
