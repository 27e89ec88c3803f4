/* photochemical_h2.c: water photolysis that leaves molecular hydrogen in the air,
 *   2 H2O -> 2 H2 + O2,
 * the photochemical source of H2 on planets whose water is frozen or cold-trapped
 * (present Mars keeps ~15 ppmv of H2 this way: Krasnopolsky & Feldman 2001, Science
 * 294:1914). H2 is not cold-trapped, so it carries hydrogen past the tropopause to the
 * homopause, where the escape budget (escape.c) counts it with the water. A steady-state
 * parameterisation after Zahnle, Haberle, Catling & Kasting 2008 (JGR 113:E11004): the
 * stellar photons that dissociate water (env->lya_flux) are shared among the absorbers
 * in proportion to their column cross-sections,
 *   s_w = sigma_w x_w / (sigma_w x_w + sigma_CO2 x_CO2 + sigma_O2 x_O2),
 * with x the mole fractions of the whole atmosphere (N2 does not absorb at Lyman alpha);
 * y is the H2 left per Lyman-alpha photon water absorbs, an order-one efficiency that
 * lumps the 175-200 nm photolysis reaching lower and the recombination of most H and OH
 * to water through HOx catalysis, so
 *   P = y F pi R^2 s_w            mol H2 per second (F: photons m^-2 s^-1)
 * The H2 is removed again by escape (hydrogen_escape) and by oxidation back to water
 * (h2_oxidation). Over the H2's life the atmosphere's redox budget, not P, sets its level:
 * hydrogen escape balances the oxidant the air loses, to space (oxygen escape) and to the
 * surface, less the volcanic reductants (Zahnle et al. 2008). On a frozen or dry surface
 * under a thin air a share d of the oxidant made beside the H2 (H2O2, O3: HOx chemistry)
 * is deposited and oxidises the regolith instead of staying as O2 (the oxidised soil of
 * Mars: Hunten 1979, J. Mol. Evol. 14:71; Zent & McKay 1994, Icarus 108:146; both from
 * memory); over an ocean, or under a moist or runaway greenhouse, none is (d = 0):
 *   2 H2O -> 2 H2 + O2                 share 1 - d
 *   2 H2O -> 2 H2 + 2 O(oxidised rock) share d
 * d is calibrated once to present Mars's 15 ppmv of H2 (tests/test_photochem_h2.c;
 * docs/model.md section 4); it is the same on every planet. HDO is dissociated less
 * readily than H2O, so the HD/H2 of the product is a share f_ph of the water's D/H. */
#include <math.h>
#include <stddef.h>

#include "volev/process.h"
#include "volev/units.h"

typedef struct {
    double net_yield;         /* y */
    double sigma_water;       /* sigma_w, m^2 */
    double sigma_co2;         /* m^2 */
    double sigma_o2;          /* m^2 */
    double hd_share;          /* f_ph */
    double deposited;         /* d */
} params;

#define CM2 1e-4 /* m^2 per cm^2 */
#define R(k, unit, si, d, lo, hi, f, doc, ref) \
    VL_PARAM_ROW(params, VL_PT_REAL, k, unit, si, d, lo, hi, f, doc, ref, NULL)

static const vl_param table[] = {
    R("net_yield", "", 1.0, 1.0, 0.0, 100.0, net_yield,
      "y: H2 molecules left per Lyman-alpha photon absorbed by water: an efficiency, not a "
      "quantum yield (it lumps the 175-200 nm photolysis that reaches lower and the "
      "recombination of most H and OH to water)",
      "common practice: order-one efficiency; with it present Earth's H2 comes out 1.1 ppmv "
      "against 0.53 measured (Novelli et al. 1999, JGR 104:30427), a prediction "
      "(tests/test_photochem_h2.c)"),
    R("water_cross_section_cm2", "cm^2", CM2, 1.5e-17, 0.0, 1e-14, sigma_water,
      "sigma_w: absorption cross-section of H2O at Lyman alpha",
      "~1.5e-17 cm^2 at 121.6 nm (Lee & Suto 1986, Chem. Phys. 110:161), from memory"),
    R("co2_cross_section_cm2", "cm^2", CM2, 6.0e-20, 0.0, 1e-14, sigma_co2,
      "CO2's absorption cross-section at Lyman alpha (it shields the water)",
      "~6e-20 cm^2 at 121.6 nm (Lewis & Carver 1983, JQSRT 30:297), from memory"),
    R("o2_cross_section_cm2", "cm^2", CM2, 1.0e-20, 0.0, 1e-14, sigma_o2,
      "O2's absorption cross-section at Lyman alpha (a window of the O2 continuum)",
      "~1e-20 cm^2 at 121.6 nm (Watanabe 1958, Adv. Geophys. 5:153), from memory"),
    R("hd_yield_ratio", "", 1.0, 0.4, 0.0, 1.0, hd_share,
      "f_ph: HD/H2 of the H2 made over the D/H of the water it comes from",
      "from memory: photolysis makes HD about 0.4 times as readily as H2 (Yung et al. 1988, "
      "Icarus 76:146; Cheng et al. 1999, GRL 26:3657: HDO absorbs less at 185-200 nm)"),
    R("deposited_share", "", 1.0, 0.7, 0.0, 1.0, deposited,
      "d: share of the oxidant made beside the H2 deposited on a frozen or dry surface",
      "[C] calibrated once to present Mars's H2, 15 ppmv (Krasnopolsky & Feldman 2001, "
      "Science 294:1914), in tests/test_photochem_h2.c; not tuned per planet"),
};

static const vl_flux_column columns[] = {
    {"photochem_h2_kg_s", "H2 made by water photolysis"},
    {"photochem_oxidant_deposited_kg_s", "oxygen of the oxidant made with it, deposited on the "
                                         "surface (to oxidised_rock)"},
};

enum { IN_AIR, DEPOSITED };
static const vl_reaction reactions[] = {
    [IN_AIR] = {"2 H2O -> 2 H2 + O2", 3, {VL_R_H2, VL_R_O2, VL_R_WATER}, {2.0, 1.0, -2.0}},
    [DEPOSITED] = {"2 H2O -> 2 H2 + 2 O(oxidised rock)", 3, {VL_R_H2, VL_R_OX_ROCK, VL_R_WATER},
                   {2.0, 2.0, -2.0}},
};

/* s_w: share of the dissociating photons water absorbs, 0 without vapour. */
static double water_share(const params *p, const vl_env *env)
{
    double w = p->sigma_water * env->x[VL_GAS_H2O];
    double rest = p->sigma_co2 * env->x[VL_GAS_CO2] + p->sigma_o2 * env->x[VL_GAS_O2];
    return w > 0.0 ? w / (w + rest) : 0.0;
}

/* H2 made at P (the column: kg of H2 per second), its HD at f_ph times the water's D/H. */
static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const params *p = pv;
    const vl_env *env = v->env;
    double photons = env->lya_flux * 0.25 * v->planet->area_m2; /* F pi R^2 */
    double h2_mol_s = p->net_yield * photons * water_share(p, env) / VL_AVOGADRO;
    if (!(h2_mol_s > 0.0))
        return;
    int cold_surface = env->regime == VL_REGIME_FROZEN || env->regime == VL_REGIME_DRY;
    double d = cold_surface ? p->deposited : 0.0;
    vl_flux_react_f(fx, IN_AIR, 0.5 * h2_mol_s * (1.0 - d), 0, p->hd_share);
    double r = vl_flux_react_f(fx, DEPOSITED, 0.5 * h2_mol_s * d, 0, p->hd_share);
    vl_flux_add_column(fx, 1, 2.0 * r * vl_species_molar_mass(VL_SP_O));
}

const vl_process vl_process_photochemical_h2 = {
    .name = "photochemical_h2",
    .summary = "water photolysis that leaves H2 (and its O2) in the air",
    .refs = "Zahnle et al. 2008, JGR 113:E11004; Krasnopolsky & Feldman 2001",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_REACTIONS(reactions),
    .default_enabled = 1,
    .rates = rates,
};
