/* weathering.c: continental silicate weathering (Walker, Hays & Kasting 1981, JGR
 * 86:9776): W_kin = k f_liq (f_land/f_land,0) (pCO2/pCO2_0)^beta exp((T - T0)/Te) R(T),
 * drawing CO2 into carbonate rock; f_liq is the ice-free share of the ocean from the
 * climate (0 without liquid water), which keeps the rate continuous through freezing.
 * R(T) is an optional runoff factor, [max(0, 1 + RUN (T - T0))]^0.65 (Berner &
 * Kothavala 2001, AJS 301:182, GEOCARB III, from memory), off by default because Te
 * already stands for the whole temperature dependence in the estimates it comes from
 * (Lehmer et al. 2020). The kinetic rate is capped by the supply of fresh rock (West
 * 2012; Foley 2015, ApJ 812:36): W = W_max (1 - exp(-W_kin / W_max)), with k chosen so
 * that W equals reference_rate in the reference state. W0 and W_max are rates of a
 * planet with Earth's surface area; by default they scale with the planet's surface
 * area (the land fraction is a share of it). */
#include <math.h>
#include <stddef.h>

#include "scaling.h"
#include "volev/process.h"
#include "volev/units.h"

typedef struct {
    double ref_mol_s;  /* W0 */
    double beta;       /* pCO2 exponent */
    double te_k;       /* temperature e-folding */
    double t0_k;       /* reference temperature */
    double pco2_0_pa;  /* reference CO2 partial pressure */
    double land;       /* land fraction */
    double land_ref;   /* land fraction at W0 */
    double max_mol_s;  /* W_max, supply limit */
    int runoff;        /* apply R(T) */
    double runoff_per_k; /* RUN */
    double runoff_exp; /* exponent of the runoff factor */
    int per_area;      /* scale W0 and W_max by A_p / A_earth */
} params;

#define R(k, unit, si, d, lo, hi, f, doc, ref) \
    VL_PARAM_ROW(params, VL_PT_REAL, k, unit, si, d, lo, hi, f, doc, ref, NULL)

static const vl_param table[] = {
    R("reference_rate_tmol_yr", "Tmol/yr", 1e12 / VL_YR, 4.4, 0.0, 1e6, ref_mol_s,
      "CO2 drawdown at the reference state",
      "present total CO2 supply 5.9 Tmol/yr (Gerlach 2011, Eos 92:201) less the default "
      "seafloor weathering 1.5 Tmol/yr: steady state today (docs/cycles.md)"),
    R("co2_exponent", "", 1.0, 0.3, 0.0, 1.0, beta, "beta",
      "Walker, Hays & Kasting 1981, from memory; Lehmer et al. 2020: 0.1-0.5"),
    R("temp_efold_k", "K", 1.0, 13.7, 1.0, 100.0, te_k, "Te",
      "Walker, Hays & Kasting 1981, from memory; Lehmer et al. 2020: 10-40 K"),
    R("reference_temp_k", "K", 1.0, 288.0, 200.0, 400.0, t0_k, "T0",
      "present Earth mean surface temperature, common practice"),
    R("co2_reference_bar", "bar", VL_BAR, 2.837e-4, 1e-9, 1e3, pco2_0_pa, "pCO2_0",
      "280 ppmv x 1.01325 bar, common practice"),
    R("land_fraction", "", 1.0, 0.29, 0.0, 1.0, land, "fraction of the surface that is land",
      "present Earth, common practice"),
    R("reference_land_fraction", "", 1.0, 0.29, 1e-3, 1.0, land_ref, "land fraction at W0",
      "present Earth, common practice"),
    R("supply_limit_tmol_yr", "Tmol/yr", 1e12 / VL_YR, 59.0, 1e-6, 1e9, max_mol_s,
      "W_max: the most CO2 the supply of fresh rock can draw down",
      "ten times the present rate, order of Foley 2015's supply limit, from memory"),
    {"runoff", VL_PT_BOOL, "", 1.0, 0.0, 0.0, 1.0, NULL, NULL, offsetof(params, runoff),
     "multiply the kinetic rate by the runoff factor [max(0, 1 + RUN (T - T0))]^exponent",
     "off: Te of Walker, Hays & Kasting 1981 and Lehmer et al. 2020 is the whole "
     "temperature dependence", NULL, 0},
    {"runoff_per_k", VL_PT_REAL, "1/K", 1.0, 0.038, 0.0, 1.0, NULL, NULL,
     offsetof(params, runoff_per_k), "RUN: fractional rise of runoff per kelvin",
     "Berner & Kothavala 2001 (GEOCARB III), from memory", "processes.weathering.runoff=true",
     0},
    {"runoff_exponent", VL_PT_REAL, "", 1.0, 0.65, 0.0, 2.0, NULL, NULL,
     offsetof(params, runoff_exp), "exponent of the runoff factor",
     "Berner & Kothavala 2001 (GEOCARB III), from memory", "processes.weathering.runoff=true",
     0},
    {"scale_by_surface_area", VL_PT_BOOL, "", 1.0, 1.0, 0.0, 1.0, NULL, NULL,
     offsetof(params, per_area),
     "the rates above are for Earth's surface area and scale with A_p / A_earth (false: "
     "absolute rates)", "common practice: weathering per unit land area", NULL, 0},
};

static const vl_flux_column columns[] = {
    {"weathering_co2_kg_s", "CO2 taken into carbonate by continental silicate weathering"},
};

enum { CO2_TO_CARBONATE };
static const vl_transfer transfers[] = {[CO2_TO_CARBONATE] = {VL_R_CO2, VL_R_CARBONATE}};

/* The supply limit must exceed the reference rate. */
static int check(const void *pv, const vl_scenario *sc, vl_status *st)
{
    const params *p = pv;
    if (p->max_mol_s <= p->ref_mol_s)
        return vl_fail(st, VL_ERR_INPUT, sc->path, 0,
                       "processes.weathering.supply_limit_tmol_yr must exceed "
                       "reference_rate_tmol_yr");
    return VL_OK;
}

/* Runoff factor R(T) = [max(0, 1 + RUN (T - T0))]^e (Berner & Kothavala 2001), 1 when off. */
static double runoff(const params *p, double t_k)
{
    if (!p->runoff)
        return 1.0;
    double r = 1.0 + p->runoff_per_k * (t_k - p->t0_k);
    return r > 0.0 ? pow(r, p->runoff_exp) : 0.0;
}

static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const vl_env *env = v->env;
    const vl_planet *pl = v->planet;
    const params *p = pv;
    if (env->liquid <= 0.0)
        return;
    double pco2 = env->p_pa[VL_GAS_CO2] > 0.0 ? env->p_pa[VL_GAS_CO2] : 0.0;
    double kin0 = -p->max_mol_s * log1p(-p->ref_mol_s / p->max_mol_s);
    double w = kin0 * env->liquid * (p->land / p->land_ref) * pow(pco2 / p->pco2_0_pa, p->beta) *
               exp((env->t_surf_k - p->t0_k) / p->te_k) * runoff(p, env->t_surf_k);
    w = p->max_mol_s * -expm1(-w / p->max_mol_s);
    if (p->per_area)
        w *= vl_scaling_area(pl);
    vl_flux_transfer(fx, CO2_TO_CARBONATE, w * vl_species_molar_mass(VL_SP_CO2), 0);
}

const vl_process vl_process_weathering = {
    .name = "weathering",
    .summary = "continental silicate weathering, CO2 -> carbonate, while an ocean is liquid",
    .refs = "Walker, Hays & Kasting 1981",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_TRANSFERS(transfers),
    .default_enabled = 1,
    .check = check,
    .rates = rates,
};
