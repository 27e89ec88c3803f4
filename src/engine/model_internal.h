/* model_internal.h: the per-run workspace, shared by model.c (allocation) and rhs.c
 * (use). Private to src/engine. */
#ifndef VOLEV_MODEL_INTERNAL_H
#define VOLEV_MODEL_INTERNAL_H

#include "volev/model.h"

/* One entry of the ocean-atmosphere CO2 split's cache (rhs.c). */
typedef struct {
    int valid;
    double key[5];             /* surface CO2 kg, ocean m^3, T K, other gas kg, mol */
    double atm_kg;             /* result */
} vl_ocean_cache;

struct vl_work {
    vl_climate_work *climate;  /* owned: the climate's tables and caches */
    /* the ocean split, one entry per pass (the Jacobian's perturbations of reservoirs
     * that do not touch it reuse it) */
    vl_ocean_cache ocean[2];
    double (*rows)[VL_NRES];   /* owned; one tendency row per process (m->nproc) */
    /* owned; for reservoir r, the processes that may write its row entry (a declared
     * transfer or reaction term, or its deuterium companion), in m->sum_order's order:
     * touch[r * m->nproc + k] for k < ntouch[r]; the others' entries stay exact zeros */
    size_t *touch;
    size_t ntouch[VL_NRES];
};

/* The magma-ocean stage (melt_stage.c): the melt and the volatiles it holds from the
 * state (before the climate), then the mantle's heating from the climate's net flux. */
void vl_melt_stage_state(const vl_model *m, const double *y, vl_env *env);
void vl_melt_stage_heat(vl_env *env);
/* 1 if the surface is molten: T_p above the rheological transition at the surface. */
int vl_melt_molten(const vl_model *m, const vl_env *env);

#endif
