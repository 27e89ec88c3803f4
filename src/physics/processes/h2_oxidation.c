/* h2_oxidation.c: hydrogen oxidised back to water by the air's oxygen,
 *   2 H2 + O2 -> 2 H2O,
 * photochemically, limited by the scarcer of the two: where O2 is in excess H2 lives tau_H
 * (its oxidation by OH), where H2 is in excess O2 lives tau_O (its reactions with H, CO
 * and the other reduced radicals of an anoxic air), and the two limits are joined
 * harmonically,
 *   a = n_H2 / tau_H,  b = 2 n_O2 / tau_O,  rate = a b / (a + b)   mol H2/s
 * (with tau_O = tau_H this is (n_H2/tau_H) n_O2 / (n_O2 + n_H2/2)). In an oxygen-rich
 * air H2 lives about tau_H; in an anoxic one O2 lives about tau_O and H2 accumulates
 * until escape removes it
 * (Kasting 1993, Science 259:920; Catling & Kasting 2017). With volcanic_reductants this
 * is the supply-limited volcanic sink of abiotic O2 (docs/model.md section 4). */
#include <stddef.h>

#include "volev/process.h"
#include "volev/units.h"

typedef struct {
    double lifetime_s; /* tau_H */
    double o2_lifetime_s; /* tau_O */
} params;

static const vl_param table[] = {
    {"lifetime_yr", VL_PT_REAL, "yr", VL_YR, 10.0, 1e-3, 1e9, NULL, NULL,
     offsetof(params, lifetime_s),
     "e-folding time of atmospheric H2 against oxidation where O2 is in excess",
     "abiotic (OH) lifetime of H2 in present air ~10 yr: Novelli et al. 1999, JGR 104:30427 "
     "give ~2 yr in all, a quarter of the loss to OH (from memory)", NULL, 0},
    {"o2_lifetime_yr", VL_PT_REAL, "yr", VL_YR, 0.1, 1e-6, 1e9, NULL, NULL,
     offsetof(params, o2_lifetime_s),
     "e-folding time of atmospheric O2 against reduction where H2 is in excess",
     "from memory: photochemical O2 in an anoxic air lives days to months (Kasting 1993, "
     "Science 259:920; Kasting & Catling 2003, ARA&A 41:429)", NULL, 0},
};

static const vl_flux_column columns[] = {
    {"h2_oxidised_kg_s", "atmospheric H2 oxidised back to water by O2"},
};

enum { OXIDISE };
static const vl_reaction reactions[] = {
    [OXIDISE] = {"2 H2 + O2 -> 2 H2O", 3, {VL_R_H2, VL_R_O2, VL_R_WATER}, {-2.0, -1.0, 2.0}},
};

static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const params *p = pv;
    double n_h2 = v->y[VL_R_H2] / vl_species_molar_mass(VL_SP_H2);
    double n_o2 = v->y[VL_R_O2] / vl_species_molar_mass(VL_SP_O2);
    if (!(n_h2 > 0.0) || !(n_o2 > 0.0))
        return;
    double a = n_h2 / p->lifetime_s, b = 2.0 * n_o2 / p->o2_lifetime_s;
    double h2_s = a * b / (a + b); /* mol H2/s */
    vl_flux_react(fx, OXIDISE, 0.5 * h2_s, 0);
}

const vl_process vl_process_h2_oxidation = {
    .name = "h2_oxidation",
    .summary = "2 H2 + O2 -> 2 H2O in the air, limited by the scarcer reactant",
    .refs = "Kasting 1993; Novelli et al. 1999; Catling & Kasting 2017",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_REACTIONS(reactions),
    .default_enabled = 1,
    .rates = rates,
};
