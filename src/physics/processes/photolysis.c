/* photolysis.c: net photolysis of water. "Net" means the water whose hydrogen escapes:
 * its hydrogen goes straight to space; of its oxygen, the share the escaping hydrogen
 * drags along (o_flux / h_flux of the escape budget, escape.c) goes to space too, the
 * rest stays as O2. Two balanced reactions carry this:
 *   2 H2O -> 4 H(space) + O2          and          2 H2O -> 4 H(space) + 2 O(space).
 * Photolysed water whose hydrogen does not escape recombines and is not counted. The
 * rate is therefore the water-borne share of the hydrogen escape budget (water-loss
 * studies assume photolysis keeps up with escape: Luger & Barnes 2015, Astrobiology
 * 15:119), optionally capped by the dissociating photon supply eta F_photon / 4 per unit
 * surface area. */
#include <stddef.h>

#include "volev/process.h"
#include "volev/units.h"

typedef struct {
    int photon_limited;       /* cap the rate by the photon supply */
    double photon_efficiency; /* H2O molecules dissociated per photon */
} params;

static const vl_param table[] = {
    {"photon_limited", VL_PT_BOOL, "", 1.0, 0.0, 0.0, 1.0, NULL, NULL,
     offsetof(params, photon_limited), "cap photolysis by the dissociating photon flux",
     "off: Luger & Barnes 2015 assume photolysis keeps up with escape", NULL, 0},
    {"photon_efficiency", VL_PT_REAL, "", 1.0, 1.0, 0.0, 1.0, NULL, NULL,
     offsetof(params, photon_efficiency), "H2O molecules dissociated per incident photon",
     "upper bound (every photon dissociates), common practice", "processes.photolysis.photon_limited=true", 0},
};

static const vl_flux_column columns[] = {
    {"photolysis_h2o_lost_kg_s", "water photolysed whose hydrogen escapes directly to space (net photolysis; kg of water: its hydrogen is 2 x 1.008 / 18.015 of it)"},
    {"photolysis_o_dragged_kg_s", "oxygen of photolysed water dragged to space with its hydrogen"},
};

enum { KEEP_O2, LOSE_O };
static const vl_reaction reactions[] = {
    [KEEP_O2] = {"2 H2O -> 4 H(space) + O2", 3, {VL_R_WATER, VL_R_SPACE_H, VL_R_O2},
                 {-2.0, 4.0, 1.0}},
    [LOSE_O] = {"2 H2O -> 4 H(space) + 2 O(space)", 3, {VL_R_WATER, VL_R_SPACE_H, VL_R_SPACE_O},
                {-2.0, 4.0, 2.0}},
};

/* Water molecules per second, mol/s, before the depletion ramp. */
static double demand(const params *p, const vl_view *v)
{
    double area = v->planet->area_m2;
    const vl_escape *e = &v->env->escape;
    double mol_s = e->water_share * e->h_flux * area / (2.0 * VL_AVOGADRO);
    if (p->photon_limited) {
        double cap = p->photon_efficiency * v->env->lya_flux * area / (4.0 * VL_AVOGADRO);
        if (cap < mol_s)
            mol_s = cap;
    }
    return mol_s;
}

/* Split the water between the two reactions by the dragged share of the oxygen. */
static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const vl_escape *e = &v->env->escape;
    double extent = 0.5 * demand(pv, v);
    double lost = e->h_flux > 0.0 ? 2.0 * e->o_flux / e->h_flux : 0.0;
    if (lost > 1.0)
        lost = 1.0;
    vl_flux_react_f(fx, KEEP_O2, (1.0 - lost) * extent, 0, e->d_frac);
    double r = vl_flux_react_f(fx, LOSE_O, lost * extent, 0, e->d_frac);
    vl_flux_add_column(fx, 1, 2.0 * r * VL_AW_O * 1e-3);
}

const vl_process vl_process_photolysis = {
    .name = "photolysis",
    .summary = "net water photolysis: its H escapes, its O escapes by drag or stays as O2",
    .refs = "Luger & Barnes 2015; Hunten 1973",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_REACTIONS(reactions),
    .default_enabled = 1,
    .rates = rates,
};
