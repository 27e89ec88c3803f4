/* magma_oxidation.c: oxygen taken up by a magma ocean. Oxygen left in the air by
 * hydrogen escape dissolves into the convecting melt and oxidises its ferrous iron,
 * 2 FeO + 1/2 O2 -> Fe2O3 (Schaefer et al. 2016, ApJ 829:63): first order in the air's
 * O2 with an uptake time, times the share of the melt open to the air, and limited by
 * the melt's iron: the uptake fades as the oxygen taken approaches max_fe3_ratio of
 * what the present melt's FeO can bind (the oxidised iron is counted as staying in the
 * melt, the conservative limit). The oxygen is kept in mantle_ferric_oxygen. Nothing
 * happens without a magma ocean (docs/model.md section 5b). */
#include <stddef.h>

#include "volev/magma.h"
#include "volev/process.h"
#include "volev/units.h"

typedef struct {
    double uptake_s;  /* e-folding time of the air's O2 against uptake by an open melt */
    double max_fe3;   /* Fe3+/total Fe at which the melt takes no more */
} params;

static const vl_param table[] = {
    {"uptake_time_yr", VL_PT_REAL, "yr", VL_YR, 100.0, 1e-3, 1e9, NULL, NULL,
     offsetof(params, uptake_s),
     "e-folding time of atmospheric O2 against dissolution into an open magma ocean",
     "assumption: fast against escape (Schaefer et al. 2016 take up the oxygen as it is made); "
     "slower uptake leaves more O2 in the air", NULL, 0},
    {"max_fe3_ratio", VL_PT_REAL, "", 1.0, 1.0, 0.0, 1.0, NULL, NULL, offsetof(params, max_fe3),
     "Fe3+/total Fe of the melt above which it takes no more oxygen",
     "1 = all FeO oxidised (stoichiometric limit); lower values stand for a kinetic limit, "
     "Schaefer et al. 2016 and Wordsworth et al. 2018 (AJ 155:195) bracket the efficiency",
     NULL, 0},
};

static const vl_flux_column columns[] = {
    {"o2_into_melt_kg_s", "atmospheric O2 taken up by the magma ocean (oxidising its FeO)"},
};

enum { O2_INTO_MELT };
static const vl_transfer transfers[] = {[O2_INTO_MELT] = {VL_R_O2, VL_R_MELT_O}};

static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const params *p = pv;
    const vl_melt *ml = &v->env->melt;
    double o2 = v->y[VL_R_O2];
    if (!(ml->open > 0.0) || !(o2 > 0.0) || !(p->max_fe3 > 0.0))
        return;
    double feo = v->env->melt.feo_fraction;
    double room = p->max_fe3 * vl_magma_o_capacity(feo) * ml->melt_kg;
    double taken = v->y[VL_R_MELT_O] > 0.0 ? v->y[VL_R_MELT_O] : 0.0;
    double headroom = room > 0.0 ? 1.0 - taken / room : 0.0;
    if (!(headroom > 0.0))
        return;
    vl_flux_transfer(fx, O2_INTO_MELT, o2 / p->uptake_s * ml->open * headroom, 0);
}

const vl_process vl_process_magma_oxidation = {
    .name = "magma_oxidation",
    .summary = "O2 dissolved into a magma ocean, oxidising its FeO",
    .refs = "Schaefer et al. 2016, ApJ 829:63; Wordsworth, Schaefer & Fischer 2018, AJ 155:195",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_TRANSFERS(transfers),
    .default_enabled = 1,
    .rates = rates,
};
