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
};

#endif
