/* model.h: a ready-to-run model (star, climate, processes) and its right-hand side.
 *
 * A model is fixed once built and may be shared by runs on several threads; what changes
 * during a run (the climate's tables and caches, the ocean split's cache, the per-process
 * tendency rows) lives in a per-run workspace (vl_work). One evaluation is a fixed
 * pipeline of stages, then the processes: star and orbit -> interior heat flow ->
 * atmosphere and ocean CO2 split -> climate -> upper atmosphere -> escape budget (with
 * the processes' declared non-thermal hydrogen demands) -> process rates, each into its
 * own row -> rows added up in the order of the processes' names. */
#ifndef VOLEV_MODEL_H
#define VOLEV_MODEL_H

#include <stddef.h>
#include "volev/climate.h"
#include "volev/env.h"
#include "volev/planet.h"
#include "volev/process.h"
#include "volev/reservoir.h"
#include "volev/scenario.h"
#include "volev/star.h"

/* Longest name of a redox column, "redox_<process>_kg_s", with its NUL. */
#define VL_REDOX_NAME_MAX 64

/* The output columns of a model: every process's flux columns (kg/s, in list order),
 * then one redox column "redox_<process>_kg_s" for each process whose declarations can
 * change the surface's redox content (redox_ledger.h; in list order): that process's
 * tendency of the surface's content, kg O-equivalent/s, signed (positive: an oxidant
 * source for the surface). */
struct vl_model {
    const vl_scenario *sc;     /* borrowed: the stages' parameters */
    vl_planet planet;          /* the run's constants */
    vl_star *star;             /* owned */
    vl_climate *climate;       /* owned */
    size_t nproc;              /* processes in the model */
    const vl_process **proc;   /* owned array of borrowed descriptors, in output order */
    const void **params;       /* owned array of borrowed parameter blocks, one per process */
    size_t *sum_order;         /* owned; indices into proc sorted by process name: the
                                  order in which tendencies and hydrogen demands are
                                  added up, so that no total depends on the list's order */
    size_t *col_base;          /* owned; first output column of each process */
    size_t ncolumns;           /* output columns in all: the flux columns, then the redox
                                  columns */
    size_t nflux;              /* the processes' flux columns (kg/s, one-way, >= 0): the
                                  first nflux columns */
    const char **col_name;     /* owned array of names (the flux columns' borrowed from
                                  their process, the redox columns' in redox_names) */
    size_t *col_proc;          /* owned; index into proc of each column */
    char (*redox_names)[VL_REDOX_NAME_MAX]; /* owned; the redox columns' names */
};

typedef struct vl_model vl_model;
typedef struct vl_work vl_work;

/* The model of sc with every process the scenario enables, in registry order. */
vl_model *vl_model_new(const vl_scenario *sc, vl_status *st);

/* The model of sc with the n processes procs (in this order for the outputs) and their
 * parameter blocks params (NULL for a process without parameters). Every declared
 * transfer and reaction is checked for element balance; an unbalanced one is refused
 * with a message naming the process. */
vl_model *vl_model_new_with(const vl_scenario *sc, const vl_process *const *procs,
                            const void *const *params, size_t n, vl_status *st);
void vl_model_free(vl_model *m);   /* accepts NULL */

/* A workspace for one run of m at a time (not shared between threads); NULL with st
 * filled when out of memory. */
vl_work *vl_work_new(const vl_model *m, vl_status *st);
void vl_work_free(vl_work *w);     /* accepts NULL */
/* The climate part of w (tables and their statistics). */
vl_climate_work *vl_work_climate(vl_work *w);

/* Initial reservoir masses, kg, from the inventory. */
void vl_model_initial_state(const vl_model *m, double y[VL_NSTATE]);

/* Every stage at (t, y) for the given regime. */
void vl_model_env(const vl_model *m, vl_work *w, double t_s, const double *y, int regime,
                  vl_env *env);

/* Tendencies dydt (kg/s) at (t, y) under regime; columns (m->ncolumns, kg/s) and env
 * may be NULL. */
void vl_model_rhs(const vl_model *m, vl_work *w, double t_s, const double *y, int regime,
                  double *dydt, double *columns, vl_env *env);

/* The share of the processes' declared non-thermal hydrogen demands (process.h
 * h_demand, added up in name order) at (y, env) that fits the room the diffusion limit
 * of env->escape leaves: what the escape stage publishes as env->escape.nt_h_factor. */
double vl_model_h_room_factor(const vl_model *m, const double *y, const vl_env *env);

/* The regime the conditions in env call for (the climate's classification). */
int vl_model_classify(const vl_model *m, vl_work *w, const double *y, const vl_env *env);

#endif
