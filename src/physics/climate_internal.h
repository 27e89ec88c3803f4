/* climate_internal.h: the contract between climate.c (interface, dispatch, shared
 * water partition) and the climate backends. Not installed; src/ only. */
#ifndef VOLEV_CLIMATE_INTERNAL_H
#define VOLEV_CLIMATE_INTERNAL_H

#include "volev/climate.h"

/* A backend: one constant table per enum vl_climate_model, listed in climate.c. */
typedef struct vl_climate_backend {
    const char *name;   /* its choice name in climate.model */
    /* Backend state for sc (copied what it needs), NULL with st filled on error; fixed
     * once created, so that runs on several threads can share it. */
    void *(*create)(const vl_scenario *sc, vl_status *st);
    void (*destroy)(void *state);   /* accepts NULL */
    /* Optional: a run's workspace for what changes during the run (caches, tables built
     * on demand), NULL when out of memory; without it the backend gets work = NULL. */
    void *(*work_new)(const void *state);
    void (*work_free)(void *work);  /* accepts NULL */
    /* The vl_climate_eval contract (climate.h). */
    void (*eval)(const void *state, void *work, double water_kg, vl_env *env);
    /* The vl_climate_classify contract (climate.h). */
    int (*classify)(const void *state, void *work, double water_kg, const vl_env *env);
    /* Optional: the vl_climate_curve contract. */
    size_t (*curve)(const void *state, void *work, const vl_env *env, int wet, const double *t_k,
                     size_t n, vl_curve *out);
    /* Optional: table statistics of a workspace. */
    void (*stats)(const void *work, long *nodes, double *build_s);
} vl_climate_backend;

extern const vl_climate_backend vl_hzfit_backend;   /* climate_hzfit.c */
extern const vl_climate_backend vl_column_backend;  /* climate_column.c */

/* The dry part of the atmosphere: every gas in env->mass_kg except H2O. */
typedef struct vl_dry_air {
    double mass_kg;     /* total dry mass, kg */
    double mol;         /* total dry moles, mol */
    double co2_mol;     /* CO2 moles, mol */
} vl_dry_air;

/* Sum the dry gases of env->mass_kg (molar masses from reservoir.h). */
void vl_climate_dry_air(const vl_env *env, vl_dry_air *air);

/* Vapour mass (kg) whose partial pressure x_v * p_surf (thin shell, vapour + dry air)
 * equals p_sat_pa, capped at water_kg; continuous in every argument. */
double vl_climate_saturated_vapour(double p_sat_pa, double g, double area_m2,
                                   const vl_dry_air *air, double water_kg);

/* Fill env->vapour_kg, ocean_kg and mass_kg[VL_GAS_H2O] for the surface water water_kg
 * at env->t_surf_k: all vapour when all_vapour (runaway) or above T_c, else saturated
 * over the stable phase (vl_climate_saturated_vapour). */
void vl_climate_partition(double water_kg, int all_vapour, const vl_dry_air *air, vl_env *env);

#endif
