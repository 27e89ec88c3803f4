/* seafloor_weathering.c: CO2 taken up as carbonate by basalt altered at the seafloor
 * (low-temperature hydrothermal circulation through new crust). Kinetic rate
 *   F_kin = k (Q/Q0) f_liq (pCO2/pCO2_0)^alpha exp(-Ea/R (1/T_s - 1/T0)),
 * with the spreading rate proportional to the heat flow Q/Q0 (env->heat_flow_rel), the
 * Arrhenius law of basalt dissolution (Brady & Gislason 1997, GCA 61:965: Ea = 41-65
 * kJ/mol) and a pCO2 power (Krissansen-Totton & Catling 2017, Nat. Commun. 8:15423:
 * alpha = 0-0.5, from memory). The new crust a spreading ridge supplies caps the uptake:
 *   F = F_max (1 - exp(-F_kin / F_max)),  F_max = c_sup F0 (Q/Q0),
 * and k is chosen so that F = F0 in the reference state (the form of the continental
 * supply limit, Foley 2015, ApJ 812:36). Only under a mobile lid (a stagnant lid has
 * no spreading) and only with a liquid ocean (f_liq = env->liquid). CO2 -> carbonate.
 * F0 is the rate of a planet with Earth's surface area; by default it scales with the
 * planet's surface area (ridge length and crust production taken proportional to it). */
#include <math.h>
#include <stddef.h>

#include "scaling.h"
#include "volev/process.h"
#include "volev/units.h"

typedef struct {
    double ref_mol_s;  /* F0 */
    double alpha;      /* pCO2 exponent */
    double ea_j_mol;   /* activation energy */
    double t0_k;       /* reference temperature */
    double pco2_0_pa;  /* reference CO2 partial pressure */
    double supply;     /* c_sup: F_max / (F0 Q/Q0) */
    int per_area;      /* scale F0 by A_p / A_earth */
} params;

#define MOBILE "planet.interior.tectonics=mobile_lid"
#define STAGNANT "planet.interior.tectonics=stagnant_lid"
#define R(k, unit, si, d, lo, hi, f, doc, ref, needs) \
    VL_PARAM_ROW(params, VL_PT_REAL, k, unit, si, d, lo, hi, f, doc, ref, needs)

static const vl_param table[] = {
    R("reference_rate_tmol_yr", "Tmol/yr", 1e12 / VL_YR, 1.5, 0.0, 1e6, ref_mol_s,
      "F0: CO2 drawdown at the reference state (present heat flow, pCO2_0, T0, ice-free)",
      "a quarter of the present volcanic CO2 flux of 5.9 Tmol/yr (Gerlach 2011); carbonate "
      "uptake by the upper oceanic crust is of order 1-3 Tmol/yr (Staudigel et al. 1989; "
      "Alt & Teagle 1999, GCA 63:1527; both from memory)", MOBILE),
    R("co2_exponent", "", 1.0, 0.23, 0.0, 1.0, alpha, "alpha: exponent of pCO2 / pCO2_0",
      "Krissansen-Totton & Catling 2017, Nat. Commun. 8:15423, from memory; range 0-0.5, "
      "from memory",
      MOBILE),
    R("activation_energy_kj_mol", "kJ/mol", 1e3, 53.0, 0.0, 200.0, ea_j_mol,
      "Ea: activation energy of basalt dissolution",
      "middle of 41-65 kJ/mol, Brady & Gislason 1997, GCA 61:965", MOBILE),
    R("reference_temp_k", "K", 1.0, 288.0, 200.0, 400.0, t0_k,
      "T0: surface temperature of the reference state",
      "present Earth mean surface temperature, common practice", MOBILE),
    R("co2_reference_bar", "bar", VL_BAR, 2.837e-4, 1e-9, 1e3, pco2_0_pa,
      "pCO2_0: CO2 partial pressure of the reference state",
      "280 ppmv x 1.01325 bar, common practice", MOBILE),
    R("supply_limit_factor", "", 1.0, 10.0, 1.001, 1e12, supply,
      "c_sup: the most the new crust can take up, in units of F0 (Q/Q0)",
      "from memory: Archean altered basalt holds several wt% CO2 (Nakamura & Kato 2004, "
      "GCA 68:4595), modern upper crust a few tenths (Alt & Teagle 1999)", MOBILE),
    {"scale_by_surface_area", VL_PT_BOOL, "", 1.0, 1.0, 0.0, 1.0, NULL, NULL,
     offsetof(params, per_area),
     "the reference rate is for Earth's surface area and scales with A_p / A_earth "
     "(false: absolute rate)", "common practice: crust production per unit area", NULL, 0},
};

static const vl_flux_column columns[] = {
    {"seafloor_co2_kg_s", "CO2 taken into carbonate by seafloor weathering"},
};

enum { CO2_TO_CARBONATE };
static const vl_transfer transfers[] = {[CO2_TO_CARBONATE] = {VL_R_CO2, VL_R_CARBONATE}};

static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const vl_env *env = v->env;
    const vl_planet *pl = v->planet;
    const params *p = pv;
    double q = env->heat_flow_rel;
    if (pl->tectonics != VL_TECTONICS_MOBILE || env->liquid <= 0.0 || q <= 0.0)
        return;
    double pco2 = env->p_pa[VL_GAS_CO2] > 0.0 ? env->p_pa[VL_GAS_CO2] : 0.0;
    double cap0 = p->supply * p->ref_mol_s;
    double kin0 = -cap0 * log1p(-1.0 / p->supply);
    double g = kin0 * env->liquid * pow(pco2 / p->pco2_0_pa, p->alpha) *
               exp(-p->ea_j_mol / VL_R_GAS * (1.0 / env->t_surf_k - 1.0 / p->t0_k));
    double f = q * cap0 * -expm1(-g / cap0);
    if (p->per_area)
        f *= vl_scaling_area(pl);
    vl_flux_transfer(fx, CO2_TO_CARBONATE, f * vl_species_molar_mass(VL_SP_CO2), 0);
}

const vl_process vl_process_seafloor_weathering = {
    .name = "seafloor_weathering",
    .summary = "CO2 -> carbonate in basalt altered at the seafloor (spreading, liquid ocean)",
    .refs = "Brady & Gislason 1997; Krissansen-Totton & Catling 2017",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_TRANSFERS(transfers),
    .default_enabled = 1,
    .rates = rates,
};
