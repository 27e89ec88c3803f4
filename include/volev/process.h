/* process.h: a physical process is a plug-in. Each file in src/physics/processes
 * exports one constant descriptor, listed once in src/physics/processes/processes.def.
 *
 * The contract. A process's rates function sees only what it needs, read-only: its own
 * typed parameters, the run's constants (planet.h), the environment with every stage
 * computed before processes run (env.h: star, atmosphere, climate, upper atmosphere,
 * escape budget) and the state. It changes the state only through the transfers and
 * reactions it declares (flux.h), which the model checks for element balance when it is
 * built. It never writes anything another process reads and never reads another
 * process's parameters; what several processes share is computed by a stage. So the
 * order of the registry cannot change a result (tests/test_contract.c). */
#ifndef VOLEV_PROCESS_H
#define VOLEV_PROCESS_H

#include <stddef.h>
#include "volev/env.h"
#include "volev/flux.h"
#include "volev/params.h"
#include "volev/planet.h"
#include "volev/scenario.h"

/* What a process sees at one instant. */
typedef struct vl_view {
    const double *y;           /* state: VL_NRES reservoirs, kg, then VL_S_MANTLE_TP, K */
    const vl_planet *planet;   /* the run's constants */
    const vl_env *env;         /* every stage at this instant */
} vl_view;

/* An output column of a process: the mass flux of one of its channels, kg/s. */
typedef struct vl_flux_column {
    const char *name;          /* CSV header name, ending in _kg_s */
    const char *meaning;       /* one line: what flows, from where to where */
} vl_flux_column;

typedef struct vl_process {
    const char *name;          /* key under `processes` in the scenario */
    const char *summary;       /* one line */
    const char *refs;          /* references for its equations */
    const vl_param *params;    /* its parameter table, keys relative to processes.<name>. */
    size_t nparams;
    size_t params_size;        /* bytes of its parameter block */
    const vl_flux_column *columns; /* its output columns (each a flux in kg/s) */
    size_t ncolumns;
    /* What it may do to the state (flux.h): index k of vl_flux_transfer / vl_flux_react
     * is a row of these tables. Checked for element balance at model build. */
    const vl_transfer *transfers;
    size_t ntransfers;
    const vl_reaction *reactions;
    size_t nreactions;
    int default_enabled;
    /* Optional: add to the initial state (kg) after the inventory (its deuterium
     * included), e.g. a pool that the process will draw from during the run. A hook
     * that adds to a hydrogen reservoir adds its deuterium too (vl_reservoir_deuterium_kg;
     * pl->initial_dh is the inventory's D/H). */
    void (*initial)(const void *params, const vl_planet *pl, double *y);
    /* Optional: cross-check parameters against the scenario at load time. */
    int (*check)(const void *params, const vl_scenario *sc, vl_status *st);
    /* Optional: non-thermal hydrogen this process would remove, particles/s, before the
     * room the diffusion limit leaves (escape.h): the escape stage adds up every
     * declared demand and publishes the share that fits as env->escape.nt_h_factor,
     * which the process then applies to its own hydrogen. */
    double (*h_demand)(const void *params, const vl_view *v);
    /* Tendencies through the flux API only. */
    void (*rates)(const void *params, const vl_view *v, vl_flux *fx);
} vl_process;

/* Number of rows of a table (an array, not a pointer). */
#define VL_COUNT(table) (sizeof(table) / sizeof((table)[0]))

/* Designated initialisers for a descriptor's tables: parameter table, parameter
 * struct type and column-name array (both arrays, so their sizes are known). */
#define VL_PROCESS_TABLES(table, param_type, column_names)                              \
    .params = (table), .nparams = VL_COUNT(table), .params_size = sizeof(param_type),  \
    .columns = (column_names), .ncolumns = VL_COUNT(column_names)

/* The same for its declared transfers and reactions. */
#define VL_PROCESS_TRANSFERS(table) .transfers = (table), .ntransfers = VL_COUNT(table)
#define VL_PROCESS_REACTIONS(table) .reactions = (table), .nreactions = VL_COUNT(table)

/* The registry, in processes.def order (at most VL_MAX_PROCESSES). The order only sets
 * where each process's columns appear in the outputs. */
#define VL_MAX_PROCESSES 64
extern const vl_process *const vl_processes[];
extern const size_t vl_nprocesses;

/* Index of the process called name, or -1. */
int vl_process_find(const char *name);

/* 0 if every transfer and reaction p declares conserves every element and names valid,
 * distinct reservoirs; else an internal error naming the process and the declaration. */
int vl_process_check_declarations(const vl_process *p, vl_status *st);

#endif
