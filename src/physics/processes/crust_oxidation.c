/* crust_oxidation.c: atmospheric O2 taken up when freshly made oceanic crust is altered
 * by seawater and part of its ferrous iron is oxidised, 4 FeO + O2 -> 2 Fe2O3. The sink
 * is limited by the supply of fresh crust, not by the O2 inventory (unlike the
 * first-order oxygen_sink):
 *   P = P0 (Q/Q0)^m          mobile lid (spreading; P0 ~ 3.4 km^2/yr, Parsons 1981)
 *   P = f_sl P0 (Q/Q0)^m     stagnant lid (slow volcanic resurfacing only)
 *   S = P d rho w_FeO s_ox / (4 M_FeO)                          mol O2/s
 *   F = S f_liq pO2 / (pO2 + p_half)
 * with Q/Q0 = env->heat_flow_rel, d the altered depth, rho the rock density, w_FeO the
 * FeO mass fraction of the crust, s_ox the share of it oxidised to Fe3+, f_liq the
 * ice-free share of the ocean (env->liquid: dissolved O2 reaches the seafloor from the
 * open ocean surface) and p_half the O2 partial pressure that halves the uptake (an
 * anoxic deep ocean). P0 is for a planet of Earth's surface area; by default it scales
 * with the planet's area, as seafloor_weathering's crust production does. O2 -> oxygen
 * bound in rock. Equations and references: docs/model.md section 4. */
#include <stddef.h>

#include "oxidation.h"
#include "scaling.h"
#include "volev/process.h"
#include "volev/units.h"

typedef struct {
    double production_m2_s; /* P0 */
    double exponent;        /* m */
    double stagnant_factor; /* f_sl */
    double depth_m;         /* d */
    double density;         /* rho, kg/m^3 */
    double feo_fraction;    /* w_FeO */
    double oxidised_share;  /* s_ox */
    double p_half_pa;       /* p_half */
    int per_area;           /* scale P0 by A_p / A_earth */
} params;

#define STAGNANT "planet.interior.tectonics=stagnant_lid"
#define R(k, unit, si, d, lo, hi, f, doc, ref, needs) \
    VL_PARAM_ROW(params, VL_PT_REAL, k, unit, si, d, lo, hi, f, doc, ref, needs)

static const vl_param table[] = {
    R("crust_production_km2_yr", "km^2/yr", 1e6 / VL_YR, 3.4, 0.0, 1e3, production_m2_s,
      "P0: new oceanic crust made per year at the reference age of the heat flow (mobile lid)",
      "present seafloor creation ~3.4 km^2/yr (Parsons 1981, Geophys. J. R. astr. Soc. "
      "67:437, from memory)", NULL),
    R("heat_flow_exponent", "", 1.0, 1.0, 0.0, 3.0, exponent,
      "m in P ~ (Q/Q0)^m",
      "from memory: 1, as seafloor_weathering's spreading rate; half-space cooling "
      "(Q ~ sqrt of the plate creation rate, Turcotte & Schubert 2002, Geodynamics) gives 2",
      NULL),
    R("stagnant_lid_factor", "", 1.0, 0.1, 0.0, 1.0, stagnant_factor,
      "f_sl: crust production under a stagnant lid over the mobile-lid rate at the same heat "
      "flow",
      "from memory: the factor outgassing uses (Tosi et al. 2017, A&A 605:A71: a stagnant lid "
      "processes an order of magnitude less mantle)", STAGNANT),
    R("altered_depth_m", "m", 1.0, 500.0, 0.0, 1e4, depth_m,
      "d: depth of the new crust oxidised by low-temperature seawater circulation",
      "the extrusive upper crust (pillow lavas, ~0.5 km), where most oxidation occurs (Bach & "
      "Edwards 2003, GCA 67:3871, from memory)", NULL),
    R("crust_density_kg_m3", "kg/m^3", 1.0, 2900.0, 1000.0, 6000.0, density,
      "rho: density of the upper oceanic crust", "basalt 2.9-3.0 g/cm^3, common practice",
      NULL),
    R("feo_wt_percent", "wt%", 1e-2, 10.0, 0.0, 100.0, feo_fraction,
      "w_FeO: total iron of the new crust, as FeO",
      "mid-ocean-ridge basalt ~10 wt% FeO total (Gale et al. 2013, G3 14:489, from memory)",
      NULL),
    R("oxidised_share", "", 1.0, 0.3, 0.0, 1.0, oxidised_share,
      "s_ox: share of that FeO oxidised to Fe3+ by the alteration",
      "Fe3+/total Fe rises from ~0.15 in fresh basalt to ~0.45 in altered upper crust (Bach & "
      "Edwards 2003, from memory)", NULL),
    R("o2_half_bar", "bar", VL_BAR, 0.021, 1e-12, 1e3, p_half_pa,
      "p_half: O2 partial pressure at which the uptake is half the crust's supply",
      "from memory: a tenth of present pO2, about where the deep ocean turns anoxic "
      "(Canfield 1998, Nature 396:450)", NULL),
    {"scale_by_surface_area", VL_PT_BOOL, "", 1.0, 1.0, 0.0, 1.0, NULL, NULL,
     offsetof(params, per_area),
     "the crust production is for Earth's surface area and scales with A_p / A_earth (false: "
     "absolute rate)", "common practice: crust production per unit area", NULL, 0},
};

static const vl_flux_column columns[] = {
    {"crust_ox_o2_kg_s", "atmospheric O2 bound as Fe3+ in newly altered oceanic crust"},
};

enum { O2_TO_OX_ROCK };
static const vl_transfer transfers[] = {[O2_TO_OX_ROCK] = {VL_R_O2, VL_R_OX_ROCK}};

/* Crust production P (m^2/s) at the heat flow in env for the run's tectonic mode. */
static double production(const params *p, const vl_planet *pl, const vl_env *env)
{
    double f = p->production_m2_s * vl_scaling_activity(pl, env, p->exponent, p->exponent) *
               vl_scaling_lid(pl, p->stagnant_factor);
    return p->per_area ? f * vl_scaling_area(pl) : f;
}

/* Moves F (mol O2/s, as kg/s) from atmospheric O2 into oxidised rock. */
static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const vl_env *env = v->env;
    const params *p = pv;
    double liquid = env->liquid > 0.0 ? env->liquid : 0.0;
    double supply = production(p, v->planet, env) * p->depth_m * p->density *
                    vl_oxidation_feo_o2(p->feo_fraction, p->oxidised_share);
    double mol_s = supply * liquid * vl_oxidation_o2_share(env->p_pa[VL_GAS_O2], p->p_half_pa);
    vl_flux_transfer(fx, O2_TO_OX_ROCK, mol_s * vl_species_molar_mass(VL_SP_O2), 0);
}

const vl_process vl_process_crust_oxidation = {
    .name = "crust_oxidation",
    .summary = "O2 -> Fe3+ in fresh oceanic crust altered by seawater (supply-limited)",
    .refs = "Parsons 1981; Bach & Edwards 2003; Gale et al. 2013; Canfield 1998",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_TRANSFERS(transfers),
    .default_enabled = 1,
    .rates = rates,
};
