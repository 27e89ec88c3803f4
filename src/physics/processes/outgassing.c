/* outgassing.c: volcanic outgassing of CO2, N2 and H2O from the mantle reservoirs,
 * driven by the interior heat flow Q(t)/Q0 = env->heat_flow_rel (interior.c):
 *   mobile lid:    V = V0 (Q/Q0)^m             (Lehmer et al. 2020, Nat. Commun.
 *                                                11:6153: m = 1-2)
 *   stagnant lid:  V = f_sl V0 (Q/Q0)^m_sl      (melting under a thick lid only: no
 *                                                ridges or arcs; Foley & Smye 2018,
 *                                                Astrobiology 18:873; Tosi et al. 2017,
 *                                                A&A 605:A71, both from memory)
 * V0 is the mantle-derived flux of a planet of one Earth mass; by default it scales with
 * the planet's mass (mantle volume, and so melt production at a given relative heat
 * flow, taken proportional to it: the per-unit-mass rule the reference scenarios use,
 * docs/cycles.md). CO2 returned at arcs from subducted carbonate is the
 * carbonate_recycling process (docs/cycles.md).
 * Water: a fixed flux h2o_tmol_yr (water_source = fixed), or (water_source = mantle_melt)
 * the water the melt carries out of the mantle,
 *   W = s rho V_melt (x_m / F) f_deg,      x_m = M_mantle_water / (share M_p),
 * with s the heat-flow scale above (mass scaling included), V_melt the reference melt
 * production, F the degree of melting (water is incompatible: the melt holds x_m / F)
 * and f_deg the share of the melt's water that escapes to the surface; the deuterium
 * goes along at the mantle's D/H through the transfer. */
#include <stddef.h>

#include "scaling.h"
#include "volev/process.h"
#include "volev/units.h"

typedef struct {
    double co2_mol_s, n2_mol_s, h2o_mol_s; /* V0 at the interior's reference age */
    double exponent;                       /* m */
    double stagnant_factor;                /* f_sl */
    double stagnant_exponent;              /* m_sl */
    int per_mass;                          /* scale V0 by M_p / M_earth */
    int water_source;                      /* WATER_FIXED or WATER_MELT */
    double melt_m3_s;                      /* V_melt at the reference age, per Earth mass */
    double melt_density;                   /* rho, kg/m^3 */
    double melt_fraction;                  /* F */
    double degassed_share;                 /* f_deg */
    double mantle_share;                   /* mantle mass over planet mass */
} params;

enum { WATER_FIXED, WATER_MELT };

#define TMOL_YR (1e12 / VL_YR)
#define MOBILE "planet.interior.tectonics=mobile_lid"
#define STAGNANT "planet.interior.tectonics=stagnant_lid"
#define MELT "processes.outgassing.water_source=mantle_melt"
#define FIXED "processes.outgassing.water_source=fixed"
#define R(k, unit, si, d, lo, hi, f, doc, ref, needs) \
    VL_PARAM_ROW(params, VL_PT_REAL, k, unit, si, d, lo, hi, f, doc, ref, needs)

static const vl_param table[] = {
    R("co2_tmol_yr", "Tmol/yr", TMOL_YR, 2.0, 0.0, 1e6, co2_mol_s,
      "mantle-derived CO2 outgassing at the reference age of the heat flow (arc return of "
      "subducted carbonate not included)",
      "Gerlach 2011, Eos 92:201: all volcanoes 5.9 Tmol/yr, less the ~3.9 Tmol/yr that "
      "carbonate_recycling returns in scenarios/earth.cfg today; of the order of the "
      "mid-ocean-ridge flux, ~2 Tmol/yr (Marty & Tolstikhin 1998, Chem. Geol. 145:233, "
      "from memory)", NULL),
    R("n2_tmol_yr", "Tmol/yr", TMOL_YR, 1e-3, 0.0, 1e6, n2_mol_s,
      "N2 outgassing at the reference age",
      "order of the mantle N2 flux at ridges and arcs, ~1e9 mol/yr (Sano et al. 2001, "
      "Chem. Geol. 171:263; review: Johnson & Goldblatt 2015, Earth-Sci. Rev. 148:150), "
      "from memory", NULL),
    R("h2o_tmol_yr", "Tmol/yr", TMOL_YR, 0.0, 0.0, 1e6, h2o_mol_s,
      "net (juvenile) H2O outgassing at the reference age",
      "chosen here: 0, arc water is recycled; net mantle exchange arrives with the interior cycles", FIXED),
    {"water_source", VL_PT_CHOICE, "", 1.0, WATER_FIXED, 0.0, 0.0, "fixed|mantle_melt", NULL,
     offsetof(params, water_source),
     "fixed: water at h2o_tmol_yr; mantle_melt: the melt carries the mantle's water, in "
     "proportion to its concentration (the mantle_water reservoir)",
     "fixed keeps the bundled scenarios' results; the melt law is common practice "
     "(e.g. Cowan & Abbot 2014, ApJ 781:27, for ridges)", NULL, 0},
    R("melt_km3_yr", "km^3/yr", 1e9 / VL_YR, 21.0, 0.0, 1e5, melt_m3_s,
      "V_melt: magma produced per year at the reference age of the heat flow (per Earth "
      "mass when scale_by_planet_mass)",
      "new oceanic crust ~3 km^2/yr x ~7 km = ~21 km^3/yr; Crisp 1984, JVGR 20:177: ~21 "
      "km^3/yr at ridges of 26-34 km^3/yr in all, from memory", MELT),
    R("melt_density_kg_m3", "kg/m^3", 1.0, 2900.0, 1000.0, 6000.0, melt_density,
      "rho: density of the magma produced (as rock)", "basalt 2.9 g/cm^3, common practice",
      MELT),
    R("melt_fraction", "", 1.0, 0.1, 1e-3, 1.0, melt_fraction,
      "F: mean degree of melting of the source; the melt holds the source's water / F",
      "mid-ocean-ridge basalt ~8-10 % melting (Klein & Langmuir 1987, JGR 92:8089), from "
      "memory; water is about as incompatible as Ce (Michael 1995, EPSL 131:301), from memory",
      MELT),
    R("water_degassed_share", "", 1.0, 0.9, 0.0, 1.0, degassed_share,
      "f_deg: share of the melt's water that reaches the surface",
      "Cowan & Abbot 2014, ApJ 781:27, nominal degassing fraction 0.9, from memory", MELT),
    R("mantle_mass_share", "", 1.0, 0.67, 0.01, 1.0, mantle_share,
      "mantle mass over planet mass (sets x_m = mantle water / mantle mass)",
      "[C] Earth's mantle 4.0e24 kg (PREM, Dziewonski & Anderson 1981, PEPI 25:297, "
      "from memory) over 5.9722e24 kg (NASA NSSDC Earth fact sheet)", MELT),
    R("heat_flow_exponent", "", 1.0, 1.0, 0.0, 3.0, exponent,
      "m in V ~ (Q/Q0)^m (mobile lid)", "Lehmer et al. 2020: m = 1-2", MOBILE),
    R("stagnant_lid_factor", "", 1.0, 0.1, 0.0, 1.0, stagnant_factor,
      "f_sl: stagnant-lid outgassing over the mobile-lid rate at the same heat flow",
      "from memory: a stagnant lid of Earth's size outgasses a few to a few tens of bar "
      "of CO2 over 4.5 Gyr (Tosi et al. 2017), an order of magnitude below Earth's "
      "time-integrated volcanic flux", STAGNANT),
    R("stagnant_lid_exponent", "", 1.0, 2.0, 0.0, 5.0, stagnant_exponent,
      "m_sl in V ~ (Q/Q0)^m_sl (stagnant lid): melting under the lid falls faster than "
      "the heat flow",
      "from memory: stagnant-lid outgassing wanes within a few Gyr as the mantle cools "
      "(Foley & Smye 2018); 2 is the top of the mobile-lid range of Lehmer et al. 2020", STAGNANT),
    {"scale_by_planet_mass", VL_PT_BOOL, "", 1.0, 1.0, 0.0, 1.0, NULL, NULL,
     offsetof(params, per_mass),
     "the rates above are per Earth mass of planet and scale with M_p / M_earth (false: "
     "absolute rates)",
     "common practice: mantle processing per unit mass (e.g. Kite, Manga & Gaidos 2009, "
     "ApJ 700:1732, from memory)", NULL, 0},
};

static const vl_flux_column columns[] = {
    {"outgas_co2_kg_s", "CO2 outgassed from the mantle"},
    {"outgas_n2_kg_s", "N2 outgassed from the mantle"},
    {"outgas_h2o_kg_s", "juvenile water outgassed from the mantle"},
};

enum { MANTLE_C_TO_CO2, MANTLE_N_TO_N2, MANTLE_WATER_TO_WATER };
static const vl_transfer transfers[] = {
    [MANTLE_C_TO_CO2] = {VL_R_MANTLE_C, VL_R_CO2},
    [MANTLE_N_TO_N2] = {VL_R_MANTLE_N, VL_R_N2},
    [MANTLE_WATER_TO_WATER] = {VL_R_MANTLE_WATER, VL_R_WATER},
};

/* Water degassed by the melt, kg/s, at heat scale s (mass scaling included). */
static double melt_water(const params *p, const vl_planet *pl, const double *y, double s)
{
    double x_m = (y[VL_R_MANTLE_WATER] > 0.0 ? y[VL_R_MANTLE_WATER] : 0.0) /
                 (p->mantle_share * pl->mass_kg);
    return s * p->melt_m3_s * p->melt_density * (x_m / p->melt_fraction) * p->degassed_share;
}

/* Mantle-derived CO2, N2 and water at the heat-flow scale of the tectonic mode. */
static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const vl_env *env = v->env;
    const vl_planet *pl = v->planet;
    const params *p = pv;
    double s = vl_scaling_lid(pl, p->stagnant_factor) *
               vl_scaling_activity(pl, env, p->exponent, p->stagnant_exponent);
    if (p->per_mass)
        s *= pl->mass_kg / VL_M_EARTH;
    vl_flux_transfer(fx, MANTLE_C_TO_CO2, s * p->co2_mol_s * vl_species_molar_mass(VL_SP_CO2), 0);
    vl_flux_transfer(fx, MANTLE_N_TO_N2, s * p->n2_mol_s * vl_species_molar_mass(VL_SP_N2), 1);
    double water = p->water_source == WATER_MELT
                       ? melt_water(p, pl, v->y, s)
                       : s * p->h2o_mol_s * vl_species_molar_mass(VL_SP_H2O);
    vl_flux_transfer(fx, MANTLE_WATER_TO_WATER, water, 2);
}

const vl_process vl_process_outgassing = {
    .name = "outgassing",
    .summary = "volcanic outgassing of CO2, N2, H2O scaled by the interior heat flow",
    .refs = "Gerlach 2011; Lehmer et al. 2020; Foley & Smye 2018; Tosi et al. 2017",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_TRANSFERS(transfers),
    .default_enabled = 1,
    .rates = rates,
};
