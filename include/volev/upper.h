/* upper.h: the upper atmosphere and magnetosphere at one instant: exobase temperature
 * and height, magnetopause stand-off, polar-cap area. Equations: docs/escape.md. */
#ifndef VOLEV_UPPER_H
#define VOLEV_UPPER_H

#include "volev/env.h"
#include "volev/scenario.h"

/* Present Earth's XUV flux at 1 au (Ribas et al. 2005: 4.6 erg cm^-2 s^-1 [C]), W/m^2. */
#define VL_F_XUV_EARTH 4.6e-3

/* Fill env->upper from the planet's parameters pl (after the climate and the
 * atmosphere's mole fractions). */
void vl_upper_eval(const vl_planet_params *pl, vl_env *env);

/* Chapman-Ferraro stand-off, planet radii: [2 B_eq^2 / (mu0 p_ram)]^(1/6). */
double vl_upper_magnetopause_rp(double b_eq_t, double p_ram_pa);

/* Jeans escape flux, particles m^-2 s^-1, of particles of mass m_kg from number density
 * n_m3 at radius r_m around a planet of mass mp_kg, temperature t_k:
 * n v0/(2 sqrt(pi)) (1 + lambda) e^-lambda, v0 = sqrt(2kT/m), lambda = G Mp m/(k T r).
 * *lambda_out (if not NULL) gets lambda. */
double vl_upper_jeans_flux(double n_m3, double m_kg, double t_k, double r_m, double mp_kg,
                           double *lambda_out);

#endif
