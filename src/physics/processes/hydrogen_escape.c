/* hydrogen_escape.c: thermal escape of the hydrogen carried by H2. The escape stage
 * (escape.c) sets the budget: the H flux (least of the diffusion, Jeans and energy
 * limits), its deuterium fractionation and the share of the homopause hydrogen that
 * water carries; this process removes the rest, the H2-borne share, from the H2
 * reservoir (photolysis.c removes the water-borne share). Its parameters are the escape
 * stage's (escape.* in the scenario). */
#include "volev/process.h"
#include "volev/units.h"

static const vl_flux_column columns[] = {
    {"h_escape_from_h2_kg_s", "hydrogen escaping thermally from atmospheric H2 only (hydrogen of photolysed water that escapes directly: photolysis_h2o_lost_kg_s; all hydrogen lost: summary final_space_h)"},
};

enum { H2_TO_SPACE };
static const vl_transfer transfers[] = {[H2_TO_SPACE] = {VL_R_H2, VL_R_SPACE_H}};

static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    (void)pv;
    const vl_escape *e = &v->env->escape;
    double atoms = (1.0 - e->water_share) * e->h_flux * v->planet->area_m2;
    vl_flux_transfer_f(fx, H2_TO_SPACE, atoms * VL_AW_H * 1e-3 / VL_AVOGADRO, 0, e->d_frac);
}

const vl_process vl_process_hydrogen_escape = {
    .name = "hydrogen_escape",
    .summary = "thermal escape of H2-borne hydrogen at the escape budget's flux",
    .refs = "Hunten 1973; Chamberlain & Hunten 1987; Watson, Donahue & Walker 1981; "
            "Erkaev et al. 2007",
    .columns = columns,
    .ncolumns = VL_COUNT(columns),
    VL_PROCESS_TRANSFERS(transfers),
    .default_enabled = 1,
    .rates = rates,
};
