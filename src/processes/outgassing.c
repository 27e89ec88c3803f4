/* outgassing.c: volcanic outgassing of CO2, N2 and H2O from the mantle reservoirs,
 * V(t) = V0 (Q(t)/Q0)^m with an exponentially declining heat flow
 * Q(t)/Q0 = exp((t_ref - t)/tau_Q) (the power law in heat flow: Lehmer et al. 2020,
 * Nat. Commun. 11:6153, m = 1-2). */
#include <math.h>
#include <stddef.h>

#include "volev/model.h"
#include "volev/units.h"

typedef struct {
    double co2_mol_s, n2_mol_s, h2o_mol_s; /* V0 at reference age */
    double efold_s;                        /* tau_Q */
    double exponent;                       /* m */
    double ref_age_s;                      /* t_ref */
} params;

#define TMOL_YR (1e12 / VL_YR)
#define R(k, unit, si, d, lo, hi, f, doc, ref)                                             \
    {k, VL_PT_REAL, unit, si, d, lo, hi, NULL, NULL, offsetof(params, f), doc, ref, NULL, 0}

static const vl_param table[] = {
    R("co2_tmol_yr", "Tmol/yr", TMOL_YR, 5.9, 0.0, 1e6, co2_mol_s,
      "CO2 outgassing at the reference age",
      "Gerlach 2011, Eos 92:201: 0.26 Gt CO2/yr = 5.9 Tmol/yr"),
    R("n2_tmol_yr", "Tmol/yr", TMOL_YR, 1e-3, 0.0, 1e6, n2_mol_s,
      "N2 outgassing at the reference age", "order of the mantle N flux, from memory"),
    R("h2o_tmol_yr", "Tmol/yr", TMOL_YR, 0.0, 0.0, 1e6, h2o_mol_s,
      "net (juvenile) H2O outgassing at the reference age",
      "0: arc water is recycled; net mantle exchange arrives with the interior cycles"),
    R("heat_flow_efold_gyr", "Gyr", 1e9 * VL_YR, 4.3, 0.1, 1e3, efold_s,
      "e-folding time of the mantle heat flow",
      "radiogenic heat about twice today's 3 Gyr ago, from memory"),
    R("heat_flow_exponent", "", 1.0, 1.0, 0.0, 3.0, exponent,
      "m in V ~ Q^m", "Lehmer et al. 2020: m = 1-2"),
    R("reference_age_yr", "yr", VL_YR, 4.57e9, 1e6, 2e10, ref_age_s,
      "stellar age at which the rates apply", "present solar age, from memory"),
};

static const char *const columns[] = {"outgas_co2_kg_s", "outgas_n2_kg_s", "outgas_h2o_kg_s"};

static void rates(const void *pv, const vl_model *m, const double *y, const vl_env *env,
                  vl_flux *fx)
{
    const params *p = pv;
    (void)m;
    (void)y;
    double s = exp(p->exponent * (p->ref_age_s - env->t_s) / p->efold_s);
    vl_flux_move(fx, VL_R_MANTLE_C, VL_R_CO2, s * p->co2_mol_s * vl_species_molar_mass(VL_SP_CO2), 0);
    vl_flux_move(fx, VL_R_MANTLE_N, VL_R_N2, s * p->n2_mol_s * vl_species_molar_mass(VL_SP_N2), 1);
    vl_flux_move(fx, VL_R_MANTLE_WATER, VL_R_WATER,
                 s * p->h2o_mol_s * vl_species_molar_mass(VL_SP_H2O), 2);
}

const vl_process vl_process_outgassing = {
    .name = "outgassing",
    .summary = "volcanic outgassing of CO2, N2, H2O scaled by a declining heat flow",
    .refs = "Gerlach 2011; Lehmer et al. 2020",
    VL_PROCESS_TABLES(table, params, columns),
    .default_enabled = 1,
    .rates = rates,
};
