/* upper.h: the upper atmosphere and magnetosphere at one instant: exobase temperature
 * and height, magnetopause stand-off, polar-cap area. Equations: docs/escape.md. */
#ifndef VOLEV_UPPER_H
#define VOLEV_UPPER_H

#include "volev/env.h"
#include "volev/scenario.h"

/* Present Earth's XUV flux at 1 au (Ribas et al. 2005: 4.6 erg cm^-2 s^-1 [C]), W/m^2. */
#define VL_F_XUV_EARTH 4.6e-3

/* Fill the upper-atmosphere fields of env (after the climate and the atmosphere's
 * mole fractions). */
void vl_upper_eval(const vl_scenario *sc, vl_env *env);

/* Chapman-Ferraro stand-off, planet radii: [2 B_eq^2 / (mu0 p_ram)]^(1/6). */
double vl_upper_magnetopause_rp(double b_eq_t, double p_ram_pa);

/* Jeans escape flux, particles m^-2 s^-1, of particles of mass m_kg from number density
 * n_m3 at radius r_m around a planet of mass mp_kg, temperature t_k:
 * n v0/(2 sqrt(pi)) (1 + lambda) e^-lambda, v0 = sqrt(2kT/m), lambda = G Mp m/(k T r).
 * *lambda_out (if not NULL) gets lambda. */
double vl_upper_jeans_flux(double n_m3, double m_kg, double t_k, double r_m, double mp_kg,
                           double *lambda_out);

/* Thermal hydrogen escape, atoms m^-2 s^-1 of surface: the lesser of the diffusion limit
 * and the exobase cap, where the cap blends the Jeans limit (min with the energy limit
 * h_el) into the energy limit as the flow turns hydrodynamic (weight env->esc_hydro).
 * Sets env->esc_h_flux and env->esc_h_limit; continuous in every input. */
void vl_upper_h_escape(vl_env *env, double h_el);

/* Deuterium fractionation factor of thermal hydrogen escape, set into env->esc_d_frac:
 * the factors of the diffusion limit (env->esc_f_dl), the Jeans limit (env->esc_f_jeans)
 * and the energy limit (f_el: drag, (m_c - m_D)/(m_c - m_H)), blended with smooth weights
 * that follow the least-of-the-limits rule of vl_upper_h_escape (h_el: the energy-limited
 * H flux), so the factor is continuous where the binding limit changes. */
void vl_upper_d_fractionation(vl_env *env, double h_el, double f_el);

/* Drag fractionation factor (Hunten, Pepin & Walker 1987): (m_c - m_D)/(m_c - m_H)
 * clipped to [0, 1]; m_c the crossover mass, kg. */
double vl_upper_drag_fractionation(double m_c_kg);

#endif
