/* rock_oxidation.c: atmospheric O2 taken up by the oxidative weathering of rock that
 * erosion exposes on land: its ferrous iron (4 FeO + O2 -> 2 Fe2O3) and its sulfide
 * (pyrite to sulfate, 15/8 O2 per S). The sink is limited by the supply of fresh rock,
 * like crust_oxidation's on the seafloor:
 *   E = E0 (f_land/f_land,0) (Q/Q0)^m          mobile lid (uplift ~ heat flow)
 *   E = f_sl E0 (f_land/f_land,0) (Q/Q0)^m     stagnant lid (volcanic relief only)
 *   S = E [w_FeO s_ox / (4 M_FeO) + 15/8 w_S / M_S]               mol O2/s
 *   F = S pO2 / (pO2 + p_half)
 * with E the mass of rock eroded per second, Q/Q0 = env->heat_flow_rel, w_FeO the FeO
 * mass fraction of the exposed rock, s_ox the share of it oxidised on weathering, w_S
 * its sulfide sulfur and p_half the O2 pressure that halves the uptake. E0 is for a
 * planet of Earth's surface area; by default it scales with the planet's area. Erosion
 * needs running water: E is scaled by the ice-free share of the ocean (env->liquid, 0 on a
 * frozen, dry or runaway planet and in the magma-ocean regime). The oxygen goes to oxidised_rock (the
 * sulfate's oxygen included: the model has no sulfate reservoir). Equations and
 * references: docs/model.md section 4. */
#include <stddef.h>

#include "oxidation.h"
#include "scaling.h"
#include "volev/process.h"
#include "volev/units.h"

typedef struct {
    double erosion_kg_s;    /* E0 */
    double land;            /* f_land */
    double land_ref;        /* f_land,0 */
    double exponent;        /* m */
    double stagnant_factor; /* f_sl */
    double feo_fraction;    /* w_FeO */
    double oxidised_share;  /* s_ox */
    double sulfide_s;       /* w_S */
    double p_half_pa;       /* p_half */
    int per_area;           /* scale E0 by A_p / A_earth */
} params;

#define STAGNANT "planet.interior.tectonics=stagnant_lid"
#define GT_YR (1e12 / VL_YR)
#define R(k, unit, si, d, lo, hi, f, doc, ref, needs) \
    VL_PARAM_ROW(params, VL_PT_REAL, k, unit, si, d, lo, hi, f, doc, ref, needs)

static const vl_param table[] = {
    R("erosion_gt_yr", "Gt/yr", GT_YR, 20.0, 0.0, 1e6, erosion_kg_s,
      "E0: rock eroded from the land per year at the reference age of the heat flow and the "
      "reference land fraction",
      "suspended sediment delivered to the oceans ~20 Gt/yr (Milliman & Syvitski 1992, J. "
      "Geol. 100:525), from memory", NULL),
    R("land_fraction", "", 1.0, 0.29, 0.0, 1.0, land, "f_land: fraction of the surface that is land",
      "present Earth, common practice", NULL),
    R("reference_land_fraction", "", 1.0, 0.29, 1e-3, 1.0, land_ref,
      "f_land,0: land fraction at which E0 applies", "present Earth, common practice", NULL),
    R("heat_flow_exponent", "", 1.0, 1.0, 0.0, 3.0, exponent,
      "m in E ~ (Q/Q0)^m: uplift, and so erosion, follows the interior's activity",
      "common practice: 1, as outgassing's and crust_oxidation's defaults", NULL),
    R("stagnant_lid_factor", "", 1.0, 0.1, 0.0, 1.0, stagnant_factor,
      "f_sl: erosion under a stagnant lid over the mobile-lid rate at the same heat flow",
      "from memory: the factor outgassing uses (Tosi et al. 2017, A&A 605:A71: a stagnant lid "
      "processes an order of magnitude less mantle); no orogens", STAGNANT),
    R("feo_wt_percent", "wt%", 1e-2, 5.04, 0.0, 100.0, feo_fraction,
      "w_FeO: total iron of the exposed rock, as FeO",
      "upper continental crust 5.04 wt% FeO total (Rudnick & Gao 2003, Treatise on "
      "Geochemistry 3:1), from memory", NULL),
    R("oxidised_share", "", 1.0, 0.2, 0.0, 1.0, oxidised_share,
      "s_ox: share of that iron oxidised from Fe2+ to Fe3+ by weathering",
      "from memory: Fe3+/total Fe ~0.3-0.4 in the upper crust and ~0.5-0.6 in shales and "
      "soils (e.g. Lecuyer & Ricard 1999, EPSL 165:197), a rise of about 0.2", NULL),
    R("sulfide_s_ppm", "ppm", 1e-6, 300.0, 0.0, 1e5, sulfide_s,
      "w_S: sulfide sulfur of the exposed rock, oxidised to sulfate",
      "from memory: about half the 621 ppm S of the upper continental crust (Rudnick & Gao "
      "2003), the rest being sulfate; order of magnitude", NULL),
    R("o2_half_bar", "bar", VL_BAR, 2.1e-3, 1e-12, 1e3, p_half_pa,
      "p_half: O2 partial pressure at which the uptake is half the rock's supply",
      "from memory: oxidative weathering of pyrite is complete above ~1 % of present pO2 "
      "and kinetically limited below (e.g. Daines, Mills & Lenton 2017, Nat. Commun. 8:14379)",
      NULL),
    {"scale_by_surface_area", VL_PT_BOOL, "", 1.0, 1.0, 0.0, 1.0, NULL, NULL,
     offsetof(params, per_area),
     "the erosion rate is for Earth's surface area and scales with A_p / A_earth (false: "
     "absolute rate)", "common practice: erosion per unit land area", NULL, 0},
};

static const vl_flux_column columns[] = {
    {"rock_ox_o2_kg_s", "atmospheric O2 bound by the oxidative weathering of eroded rock on "
                        "land (ferrous iron and sulfide)"},
};

enum { O2_TO_OX_ROCK };
static const vl_transfer transfers[] = {[O2_TO_OX_ROCK] = {VL_R_O2, VL_R_OX_ROCK}};

/* Rock eroded E (kg/s) at the heat flow in env for the run's tectonic mode and land. */
static double erosion(const params *p, const vl_planet *pl, const vl_env *env)
{
    double e = p->erosion_kg_s * (p->land / p->land_ref) *
               vl_scaling_activity(pl, env, p->exponent, p->exponent) *
               vl_scaling_lid(pl, p->stagnant_factor);
    return p->per_area ? e * vl_scaling_area(pl) : e;
}

/* Moves F (mol O2/s, as kg/s) from atmospheric O2 into oxidised rock; none without liquid
 * water (no runoff, no erosion) or in a magma ocean. */
static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const vl_env *env = v->env;
    const params *p = pv;
    if (env->regime == VL_REGIME_MAGMA || !(env->liquid > 0.0))
        return;
    double per_kg = vl_oxidation_feo_o2(p->feo_fraction, p->oxidised_share) +
                    vl_oxidation_sulfide_o2(p->sulfide_s);
    double mol_s = erosion(p, v->planet, env) * env->liquid * per_kg *
                   vl_oxidation_o2_share(env->p_pa[VL_GAS_O2], p->p_half_pa);
    vl_flux_transfer(fx, O2_TO_OX_ROCK, mol_s * vl_species_molar_mass(VL_SP_O2), 0);
}

const vl_process vl_process_rock_oxidation = {
    .name = "rock_oxidation",
    .summary = "O2 -> Fe3+ and sulfate in rock eroded on land (oxidative weathering, "
               "supply-limited)",
    .refs = "Milliman & Syvitski 1992; Rudnick & Gao 2003; Daines, Mills & Lenton 2017",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_TRANSFERS(transfers),
    .default_enabled = 1,
    .rates = rates,
};
