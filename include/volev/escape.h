/* escape.h: the escape-budget stage. Once per evaluation, after the upper atmosphere,
 * it computes what several processes share: the thermal hydrogen escape flux (least of
 * the diffusion, Jeans and energy limits), the oxygen the escaping hydrogen drags, the
 * deuterium fractionation of that flux, and the room the diffusion limit leaves for
 * non-thermal hydrogen. Processes read the result (env->escape); none computes it.
 * Equations: docs/escape.md. */
#ifndef VOLEV_ESCAPE_H
#define VOLEV_ESCAPE_H

#include "volev/env.h"
#include "volev/planet.h"
#include "volev/scenario.h"

/* The whole thermal budget into env->escape (nt_h_factor excepted, see
 * vl_escape_h_room_factor): vl_escape_limits, then vl_escape_share. With p->thermal off
 * env->escape is all zero. env holds the atmosphere, climate and upper stages. */
void vl_escape_eval(const vl_escape_params *p, const vl_planet *pl, vl_env *env);

/* The limits: energy-limited mass flux, diffusion limit, Jeans limit with the
 * hydrodynamic weights, the fractionation factors of the diffusion and Jeans limits
 * (vl_escape_diffusion_fractionation; the Jeans flux ratio times
 * vl_escape_jeans_separation) and the water-borne share of the homopause hydrogen. */
void vl_escape_limits(const vl_escape_params *p, const vl_planet *pl, vl_env *env);

/* The energy shared between hydrogen and the oxygen it drags (p->drag; Hunten, Pepin &
 * Walker 1987), the resulting H flux (vl_escape_h_flux), O flux and deuterium
 * fractionation (vl_escape_d_fractionation). Reads the limits in env->escape. */
void vl_escape_share(const vl_escape_params *p, vl_env *env);

/* Thermal hydrogen escape, atoms m^-2 s^-1 of surface: the lesser of the diffusion limit
 * and the exobase cap, where the cap blends the Jeans limit (min with the energy limit
 * h_el) into the energy limit as the flow turns hydrodynamic (weight e->hydro). Sets
 * e->h_flux and e->h_limit; continuous in every input. */
void vl_escape_h_flux(vl_escape *e, double h_el);

/* Deuterium fractionation factor of thermal hydrogen escape, into e->d_frac: the
 * factors of the diffusion limit (e->f_dl), the Jeans limit (e->f_jeans) and the energy
 * limit (f_el: drag, (m_c - m_D)/(m_c - m_H)), blended with smooth weights that follow
 * the least-of-the-limits rule of vl_escape_h_flux (h_el: the energy-limited H flux), so
 * the factor is continuous where the binding limit changes. */
void vl_escape_d_fractionation(vl_escape *e, double h_el, double f_el);

/* Deuterium fractionation factor of diffusion-limited escape: (b_D/b_H)(m_bg - m_cD) /
 * (m_bg - m_cH), the escaping D/H over the homopause's. The carriers are H2 and HD in
 * the molecular background (mean mass m_mol_kg) and H and D in the atomic O of
 * dissociated water, blended with that O's share w_o (clipped to [0, 1]) as the
 * diffusion limit blends them: m_bg = (1 - w) m_mol + w m_O, m_cH = (1 - w) m_H2 + w m_H,
 * m_cD = (1 - w) m_HD + w m_D, and b by Blanc's law with b ~ mu^-1/2 (t_k: the
 * homopause temperature of the b's). In [0, 1], continuous; 0 once m_bg <= m_cD. */
double vl_escape_diffusion_fractionation(double m_mol_kg, double w_o, double t_k);

/* Diffusive separation of D from H between the homopause and the exobase: the D/H at
 * the exobase over the homopause's for isotopes in diffusive equilibrium with their
 * own scale heights H_i = k T_exo/(m_i g_exo) over r_exo - r_tb (u's fields),
 * exp(-(r_exo - r_tb)(m_D - m_H) g_exo/(k T_exo)); the same for HD/H2 (equal mass
 * difference). In (0, 1]; 1 without a thermosphere. */
double vl_escape_jeans_separation(const vl_upper *u);

/* Drag fractionation factor (Hunten, Pepin & Walker 1987): (m_c - m_D)/(m_c - m_H)
 * clipped to [0, 1]; m_c the crossover mass, kg. */
double vl_escape_drag_fractionation(double m_c_kg);

/* Share of a non-thermal hydrogen demand (particles/s, summed over the processes that
 * declare one) that fits the room the diffusion limit leaves above thermal escape,
 * (h_diffusion - h_flux) x area (Hunten 1973: all escaping H crosses the homopause);
 * a smooth minimum. 1 without a thermal budget or with an unbounded diffusion limit. */
double vl_escape_h_room_factor(const vl_escape_params *p, const vl_planet *pl,
                               const vl_escape *e, double demand);

/* Smooth minimum of a, b >= 0: min (1 + (min/max)^4)^(-1/4); within 1e-10 of the
 * smaller when it is below 2.5e-3 of the larger; 0 if either is 0 (common practice). */
double vl_escape_softmin(double a, double b);

#endif
