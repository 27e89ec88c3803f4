/* carbonate_recycling.c: subduction of carbonate rock under a mobile lid,
 *   S = (Q/Q0) M_carb / tau,
 * plate speed taken proportional to the heat flow Q/Q0 (env->heat_flow_rel) and tau the
 * residence time of carbonate in the crust at today's plate speed. A fraction f of S
 * reaches the mantle carbon reservoir; the rest, (1 - f) S, is driven off by
 * metamorphism and returns to the surface CO2 through arc volcanism (most subducted
 * carbon comes back: Kelemen & Manning 2015, PNAS 112:E3997, from memory).
 * Stagnant lid: nothing is subducted. Carbonate buried under lava and decarbonated at
 * the base of a stagnant lid (Foley & Smye 2018) is not modelled: carbonate is then a
 * sink (docs/cycles.md). */
#include <stddef.h>

#include "volev/process.h"
#include "volev/units.h"

typedef struct {
    double tau_s;          /* residence time at Q = Q0 */
    double mantle_share;   /* f */
} params;

#define MOBILE "planet.interior.tectonics=mobile_lid"
#define STAGNANT "planet.interior.tectonics=stagnant_lid"
#define R(k, unit, si, d, lo, hi, f, doc, ref, needs) \
    VL_PARAM_ROW(params, VL_PT_REAL, k, unit, si, d, lo, hi, f, doc, ref, needs)

static const vl_param table[] = {
    R("residence_time_gyr", "Gyr", 1e9 * VL_YR, 1.7, 1e-3, 1e3, tau_s,
      "tau: crustal residence time of carbonate at the present heat flow",
      "[C] crustal carbonate ~7.5e21 mol (from memory; 63 bar CO2-equivalent on Earth) over "
      "the carbon entering trenches, 40-66 Mt C/yr ~ 4.4 Tmol/yr (Kelemen & Manning 2015, "
      "from memory)", MOBILE),
    R("mantle_fraction", "", 1.0, 0.3, 0.0, 1.0, mantle_share,
      "f: share of the subducted carbonate that reaches the mantle (the rest degasses at arcs)",
      "from memory: Kelemen & Manning 2015 find that most subducted carbon returns to the "
      "surface; the deep flux is uncertain (0 to about half of the input)", MOBILE),
};

static const vl_flux_column columns[] = {
    {"recycled_to_mantle_kg_s", "carbonate carried into the mantle by subduction, as CO2"},
    {"recycled_to_surface_kg_s", "carbonate returned to the atmosphere as CO2 by metamorphism and arc volcanism"},
};

enum { CARBONATE_TO_MANTLE_C, CARBONATE_TO_CO2 };
static const vl_transfer transfers[] = {
    [CARBONATE_TO_MANTLE_C] = {VL_R_CARBONATE, VL_R_MANTLE_C},
    [CARBONATE_TO_CO2] = {VL_R_CARBONATE, VL_R_CO2},
};

static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const double *y = v->y;
    const vl_env *env = v->env;
    const vl_planet *pl = v->planet;
    const params *p = pv;
    double q = env->heat_flow_rel;
    if (pl->tectonics != VL_TECTONICS_MOBILE || q <= 0.0 || y[VL_R_CARBONATE] <= 0.0)
        return;
    double s = q * y[VL_R_CARBONATE] / p->tau_s;
    vl_flux_transfer(fx, CARBONATE_TO_MANTLE_C, p->mantle_share * s, 0);
    vl_flux_transfer(fx, CARBONATE_TO_CO2, (1.0 - p->mantle_share) * s, 1);
}

const vl_process vl_process_carbonate_recycling = {
    .name = "carbonate_recycling",
    .summary = "subduction of carbonate under a mobile lid: to the mantle or back to the surface",
    .refs = "Kelemen & Manning 2015",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_TRANSFERS(transfers),
    .default_enabled = 1,
    .rates = rates,
};
