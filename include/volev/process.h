/* process.h: a physical process is a plug-in. Each file in src/physics/processes exports
 * one constant descriptor, listed once in src/physics/processes/processes.def. */
#ifndef VOLEV_PROCESS_H
#define VOLEV_PROCESS_H

#include <stddef.h>
#include "volev/env.h"
#include "volev/flux.h"
#include "volev/params.h"
#include "volev/scenario.h"

typedef struct vl_model vl_model;

typedef struct vl_process {
    const char *name;          /* key under `processes` in the scenario */
    const char *summary;       /* one line */
    const char *refs;          /* references for its equations */
    const vl_param *params;    /* its parameter table, keys relative to processes.<name>. */
    size_t nparams;
    size_t params_size;        /* bytes of its parameter block */
    const char *const *columns;/* output column names of its fluxes (each kg/s) */
    size_t ncolumns;
    int default_enabled;
    /* Optional: add to the initial state (kg) after the inventory, e.g. a pool that the
     * process will draw from during the run. */
    void (*initial)(const void *params, const vl_model *m, double *y);
    /* Optional: cross-check parameters against the scenario at load time. */
    int (*check)(const void *params, const vl_scenario *sc, vl_status *st);
    /* Optional: publish to env before any rates are evaluated (registry order). */
    void (*prepare)(const void *params, const vl_model *m, const double *y, vl_env *env);
    /* Tendencies through the flux API only. */
    void (*rates)(const void *params, const vl_model *m, const double *y, const vl_env *env,
                  vl_flux *fx);
} vl_process;

/* Designated initialisers for a descriptor's tables: parameter table, parameter
 * struct type and column-name array (both arrays, so their sizes are known). */
#define VL_PROCESS_TABLES(table, param_type, column_names)                              \
    .params = (table), .nparams = sizeof(table) / sizeof((table)[0]),                  \
    .params_size = sizeof(param_type), .columns = (column_names),                      \
    .ncolumns = sizeof(column_names) / sizeof((column_names)[0])

/* The registry, in processes.def order (at most VL_MAX_PROCESSES). */
#define VL_MAX_PROCESSES 64
extern const vl_process *const vl_processes[];
extern const size_t vl_nprocesses;

/* Index of the process called name, or -1. */
int vl_process_find(const char *name);

#endif
