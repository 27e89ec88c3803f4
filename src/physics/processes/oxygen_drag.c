/* oxygen_drag.c: oxygen dragged to space by escaping hydrogen (Hunten, Pepin & Walker
 * 1987, Icarus 69:532). With crossover mass m_c = m_H + k T F_H / (b g X_H), oxygen
 * escapes only if m_c > m_O:
 *   F_O = F_H (X_O/X_H)(m_c - m_O)/(m_c - m_H) = (X_O/X_H) F_H - X_O Phi,
 *   Phi = b g (m_O - m_H) / (k T), crossover flux F_ref = X_H Phi.
 * Above F_ref the energy-limited mass flux F_m = m_H F_H + m_O F_O is shared:
 *   F_H = (F_m + m_O X_O Phi) / (m_H + m_O X_O / X_H).
 * X_H = 2/3, X_O = 1/3 for the products of water photolysis; b(H-O) = 4.8e17 T^0.75
 * cm^-1 s^-1 (Zahnle & Kasting 1986, Icarus 68:462, from memory). Below F_ref no O
 * escapes and photolytic O2 accumulates. */
#include <math.h>
#include <stddef.h>

#include "volev/model.h"
#include "volev/units.h"
#include "volev/upper.h"

typedef struct {
    double temp_k; /* temperature of the escaping flow */
} params;

static const vl_param table[] = {
    {"flow_temp_k", VL_PT_REAL, "K", 1.0, 400.0, 100.0, 10000.0, NULL, NULL,
     offsetof(params, temp_k), "temperature of the escaping flow in the crossover mass",
     "Hunten, Pepin & Walker 1987; Luger & Barnes 2015 use 400 K, from memory", NULL, 0},
};

static const char *const columns[] = {"o_drag_kg_s"};

#define X_H (2.0 / 3.0)
#define X_O (1.0 / 3.0)

/* b(H-O), m^-1 s^-1 (Zahnle & Kasting 1986, from memory). */
static double b_h_o(double t_k) { return 4.8e19 * pow(t_k, 0.75); }

static void prepare(const void *pv, const vl_model *m, const double *y, vl_env *env)
{
    const params *p = pv;
    (void)m;
    (void)y;
    double m_h = VL_AW_H * VL_AMU, m_o = VL_AW_O * VL_AMU;
    double phi = b_h_o(p->temp_k) * env->g * (m_o - m_h) / (VL_K_BOLTZMANN * p->temp_k);
    double h_el = env->esc_mass_flux / m_h;
    if (h_el > X_H * phi)
        h_el = (env->esc_mass_flux + m_o * X_O * phi) / (m_h + m_o * X_O / X_H);
    vl_upper_h_escape(env, h_el);
    /* crossover mass of the escaping flow and its deuterium fractionation */
    double m_c = m_h + VL_K_BOLTZMANN * p->temp_k * env->esc_h_flux / (b_h_o(p->temp_k) * env->g * X_H);
    vl_upper_d_fractionation(env, h_el, vl_upper_drag_fractionation(m_c));
    double f_o = (X_O / X_H) * env->esc_h_flux - X_O * phi;
    env->esc_o_flux = f_o > 0.0 ? f_o : 0.0;
}

/* Atmospheric O2 is dragged along by the H2-borne share of the escaping hydrogen;
 * the oxygen of photolysed water leaves with it inside photolysis.c. */
static void rates(const void *pv, const vl_model *m, const double *y, const vl_env *env,
                  vl_flux *fx)
{
    (void)pv;
    double share = (1.0 - env->esc_water_share) * vl_flux_ramp(VL_R_H2, y[VL_R_H2]);
    double atoms = env->esc_o_flux * m->area_m2 * share;
    vl_flux_move(fx, VL_R_O2, VL_R_SPACE_O, atoms * VL_AW_O * 1e-3 / VL_AVOGADRO, 0);
}

const vl_process vl_process_oxygen_drag = {
    .name = "oxygen_drag",
    .summary = "oxygen dragged off by hydrodynamic hydrogen escape above the crossover flux",
    .refs = "Hunten, Pepin & Walker 1987; Zahnle & Kasting 1986",
    VL_PROCESS_TABLES(table, params, columns),
    .default_enabled = 1,
    .prepare = prepare,
    .rates = rates,
};
