/* integrate.h: the history driver. Runs one history from run.start to run.end with
 * SUNDIALS CVODE, events located by its root finding, and hands rows and events to the
 * caller. */
#ifndef VOLEV_INTEGRATE_H
#define VOLEV_INTEGRATE_H

#include "volev/env.h"
#include "volev/model.h"
#include "volev/redox_ledger.h"

#define VL_MAX_COLUMNS 128

typedef struct vl_run_stats {
    long rhs_calls;            /* right-hand-side evaluations, Jacobian included */
    long steps;                /* accepted steps */
    long events;               /* events logged */
    long restarts;             /* stepper restarts after a failed step (stiff drains) */
    long jacobians;            /* Jacobian evaluations */
    double wall_s;             /* wall-clock time */
    double y_final[VL_NSTATE]; /* the final state as written (vl_written_state: no dip) */
    double totals0[VL_NELEMENTS], totals1[VL_NELEMENTS]; /* element inventories, kg */
    double written1[VL_NELEMENTS]; /* ... at the end as written: dips below zero as 0 */
    vl_redox_state redox0, redox1; /* the redox ledger at the start and the end */
    double time_in_regime_s[VL_NREGIMES];
    double min_mass_kg;        /* smallest reservoir mass seen in an output row */
    double overshoot_tolerances; /* deepest dip below zero in an output row, in units of
                                    the reservoir's tolerance (invariants.h; at most
                                    VL_DIP_TOLERANCES in a run that succeeded) */
    double channel_kg[VL_MAX_COLUMNS]; /* time integral of each output column, kg (of mass,
                                          or of O-equivalent for a redox column; trapezoid
                                          over accepted steps) */
    vl_env env_last;           /* every stage at the last output row (the run's end once
                                  it succeeded) */
    double water_dh_last;      /* D/H of the surface water after the last accepted step
                                  at which it was above its depletion floor (0: never) */
    long climate_nodes;        /* climate table nodes the run built */
    double climate_build_s;    /* wall time spent building them */
} vl_run_stats;

typedef struct vl_run_sink {
    void *ctx;
    /* One output row. columns has m->ncolumns entries; dydt VL_NSTATE. */
    int (*row)(void *ctx, double t_s, const double *y, const double *dydt, const vl_env *env,
               const double *columns, vl_status *st);
    /* One event: name (e.g. "runaway_onset") and free-text detail. */
    int (*event)(void *ctx, double t_s, const char *name, const char *detail, vl_status *st);
} vl_run_sink;

int vl_integrate(const vl_model *m, const vl_run_sink *sink, vl_run_stats *stats, vl_status *st);

/* Ask every running integration to stop at its next step (async-signal-safe: for a
 * signal handler); they return VL_ERR_STOPPED. sig is remembered for the exit status. */
void vl_integrate_request_stop(int sig);
/* The signal of the stop request, 0 if none. */
int vl_integrate_stop_signal(void);

#endif
