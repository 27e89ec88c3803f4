/* oxygen_drag.c: oxygen dragged to space by the escaping H2-borne hydrogen (Hunten,
 * Pepin & Walker 1987, Icarus 69:532). The escape stage (escape.c) sets the dragged O
 * flux above the crossover flux (escape.oxygen_drag, escape.drag_flow_temp_k); this
 * process takes the H2-borne share of it from atmospheric O2. The oxygen of photolysed
 * water leaves with its hydrogen inside photolysis.c. */
#include "volev/process.h"
#include "volev/units.h"

static const vl_flux_column columns[] = {
    {"o_drag_from_o2_kg_s", "oxygen dragged to space from atmospheric O2 by escaping hydrogen (oxygen of photolysed water dragged with its hydrogen: photolysis_o_dragged_kg_s; all oxygen lost: summary final_space_o)"},
};

enum { O2_TO_SPACE };
static const vl_transfer transfers[] = {[O2_TO_SPACE] = {VL_R_O2, VL_R_SPACE_O}};

static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    (void)pv;
    const vl_escape *e = &v->env->escape;
    double share = (1.0 - e->water_share) * vl_flux_ramp(VL_R_H2, v->y[VL_R_H2]);
    double atoms = e->o_flux * v->planet->area_m2 * share;
    vl_flux_transfer(fx, O2_TO_SPACE, atoms * VL_AW_O * 1e-3 / VL_AVOGADRO, 0);
}

const vl_process vl_process_oxygen_drag = {
    .name = "oxygen_drag",
    .summary = "oxygen dragged off by hydrodynamic hydrogen escape above the crossover flux",
    .refs = "Hunten, Pepin & Walker 1987; Zahnle & Kasting 1986",
    .columns = columns,
    .ncolumns = VL_COUNT(columns),
    VL_PROCESS_TRANSFERS(transfers),
    .default_enabled = 1,
    .rates = rates,
};
