/* model.h: a ready-to-run model (star, climate, processes) and its RHS. */
#ifndef VOLEV_MODEL_H
#define VOLEV_MODEL_H

#include <stddef.h>
#include "volev/climate.h"
#include "volev/env.h"
#include "volev/process.h"
#include "volev/reservoir.h"
#include "volev/scenario.h"
#include "volev/star.h"

struct vl_model {
    const vl_scenario *sc;     /* borrowed */
    vl_star *star;             /* owned */
    vl_climate *climate;       /* owned */
    double g;                  /* surface gravity, m/s^2 */
    double area_m2;            /* surface area, m^2 */
    double pa_per_kg;          /* thin-shell pressure per kg of atmosphere, Pa/kg = g/area */
    size_t ncolumns;           /* process flux columns in all (enabled processes only) */
    size_t *col_base;          /* owned; first column of each process (registry order) */
    const char **col_name;     /* owned array of borrowed names */
    size_t *col_proc;          /* owned; process index of each column */
    size_t nenabled;           /* enabled processes */
    size_t *sum_order;         /* owned; the enabled processes' registry indices sorted by
                                  name: their tendencies are added up in this order, so the
                                  total does not depend on the registry's order */
    /* cache of the ocean-atmosphere CO2 split, one entry per pass (the Jacobian's
     * perturbations of reservoirs that do not touch it reuse it); a per-model cache,
     * not shared between threads */
    struct {
        int valid;
        double key[5];         /* surface CO2 kg, ocean m^3, T K, other gas kg, mol */
        double atm_kg;         /* result */
    } ocean_cache[2];
};

vl_model *vl_model_new(const vl_scenario *sc, vl_status *st);
void vl_model_free(vl_model *m);   /* accepts NULL */

/* Initial reservoir masses, kg, from the inventory. */
void vl_model_initial_state(const vl_model *m, double y[VL_NRES]);

/* Everything at (t, y) for the given regime: star, atmosphere, climate, prepare hooks. */
void vl_model_env(const vl_model *m, double t_s, const double *y, int regime, vl_env *env);

/* Tendencies dydt (kg/s) at (t, y) under regime; columns (m->ncolumns, kg/s) and env
 * may be NULL. */
void vl_model_rhs(const vl_model *m, double t_s, const double *y, int regime, double *dydt,
                  double *columns, vl_env *env);

#endif
