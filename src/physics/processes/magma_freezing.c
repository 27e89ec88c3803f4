/* magma_freezing.c: volatiles the crystals of a freezing magma ocean keep. While the
 * melt shrinks at -dM_melt/dt, the crystals take D x of each volatile (x its mass
 * fraction in the melt, D the solid/melt partition coefficient) into the solid mantle;
 * the rest stays in the melt, which the melt stage keeps in solubility equilibrium with
 * the air, so that it is outgassed as the melt disappears (Elkins-Tanton 2008, EPSL
 * 271:181; Lebrun et al. 2013, JGR Planets 118:1155). A melt that grows takes the solid's
 * volatiles back at the solid's mean concentration. Nothing happens without a magma
 * ocean (docs/model.md section 5b). */
#include <stddef.h>

#include "volev/magma.h"
#include "volev/process.h"

typedef struct {
    double d_water; /* solid/melt partition coefficient of H2O */
    double d_co2;   /* of CO2 */
} params;

static const vl_param table[] = {
    {"water_partition", VL_PT_REAL, "", 1.0, VL_MAGMA_D_H2O, 0.0, 1.0, NULL, NULL,
     offsetof(params, d_water), "solid/melt partition coefficient of H2O in the freezing mantle",
     "~0.01, Hirschmann et al. 2006 as used by Lebrun et al. 2013, from memory", NULL, 0},
    {"co2_partition", VL_PT_REAL, "", 1.0, VL_MAGMA_D_CO2, 0.0, 1.0, NULL, NULL,
     offsetof(params, d_co2), "solid/melt partition coefficient of CO2 in the freezing mantle",
     "~2e-3, Elkins-Tanton 2008, EPSL 271:181, from memory", NULL, 0},
};

static const vl_flux_column columns[] = {
    {"water_frozen_in_kg_s", "water the crystallising mantle keeps (surface water -> mantle water; "
                             "negative: given back by remelting)"},
    {"co2_frozen_in_kg_s", "CO2 the crystallising mantle keeps (surface CO2 -> mantle carbon; "
                           "negative: given back)"},
};

enum { WATER_IN, CO2_IN, WATER_OUT, CO2_OUT };
static const vl_transfer transfers[] = {
    [WATER_IN] = {VL_R_WATER, VL_R_MANTLE_WATER},
    [CO2_IN] = {VL_R_CO2, VL_R_MANTLE_C},
    [WATER_OUT] = {VL_R_MANTLE_WATER, VL_R_WATER},
    [CO2_OUT] = {VL_R_MANTLE_C, VL_R_CO2},
};

static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const params *p = pv;
    const vl_melt *ml = &v->env->melt;
    if (ml->dmelt_dt < 0.0) {
        double frozen = -ml->dmelt_dt * ml->open; /* crystals from the convecting melt */
        vl_flux_transfer(fx, WATER_IN, p->d_water * ml->x_water * frozen, 0);
        vl_flux_transfer(fx, CO2_IN, p->d_co2 * ml->x_co2 * frozen, 1);
    } else if (ml->dmelt_dt > 0.0) {
        double solid = ml->mantle_kg - ml->melt_kg;
        if (!(solid > 0.0))
            return;
        double share = ml->dmelt_dt / solid; /* of the solid melting per second */
        double w = v->y[VL_R_MANTLE_WATER] > 0.0 ? v->y[VL_R_MANTLE_WATER] * share : 0.0;
        double c = v->y[VL_R_MANTLE_C] > 0.0 ? v->y[VL_R_MANTLE_C] * share : 0.0;
        vl_flux_add_column(fx, 0, -vl_flux_transfer(fx, WATER_OUT, w, -1));
        vl_flux_add_column(fx, 1, -vl_flux_transfer(fx, CO2_OUT, c, -1));
    }
}

const vl_process vl_process_magma_freezing = {
    .name = "magma_freezing",
    .summary = "volatiles kept by the crystals of a freezing magma ocean (partition coefficients)",
    .refs = "Elkins-Tanton 2008, EPSL 271:181; Lebrun et al. 2013, JGR Planets 118:1155",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_TRANSFERS(transfers),
    .default_enabled = 1,
    .rates = rates,
};
