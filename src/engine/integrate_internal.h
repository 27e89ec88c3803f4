/* integrate_internal.h: the layers under vl_integrate (integrate.c): the stepper (one
 * GSL multistep BDF integrator over the model's right-hand side, stepper.c) and the
 * event watch (the regime the conditions call for and exhausted reservoirs, located by
 * bisection, events.c). Private to src/engine. */
#ifndef VOLEV_INTEGRATE_INTERNAL_H
#define VOLEV_INTEGRATE_INTERNAL_H

#include <gsl/gsl_odeiv2.h>

#include "volev/model.h"

/* What the right-hand side needs: the model, the run's workspace, the regime held fixed
 * during a step; counts its evaluations. */
typedef struct {
    const vl_model *m;
    vl_work *w;
    int regime;
    long rhs_calls;
    double f0[VL_NSTATE], f1[VL_NSTATE], yt[VL_NSTATE]; /* Jacobian scratch */
} vl_ode;

/* A GSL driver owning step, control and evolve (msbdf reaches its control through the
 * driver, so one is needed even when stepping by hand). */
typedef struct {
    gsl_odeiv2_system sys;
    gsl_odeiv2_driver *drv;
    gsl_odeiv2_step *step;
    gsl_odeiv2_control *ctrl;
    gsl_odeiv2_evolve *ev;
} vl_stepper;

/* 1 when every entry of v is finite. */
int vl_stepper_finite(const double *v, size_t n);
/* A stepper over ode with the run's tolerances; 0 when out of memory. */
int vl_stepper_init(vl_stepper *s, vl_ode *ode, const vl_run_params *rp);
void vl_stepper_free(vl_stepper *s);
/* Forget the step history (after an event: no step straddles a discontinuity). */
void vl_stepper_reset(vl_stepper *s);
/* Advance (t, y) to exactly t1 under the current regime, counting steps if given. */
int vl_stepper_advance_to(vl_stepper *s, double *t, double t1, double *h, double *y,
                          long *steps, vl_status *st);
/* One accepted step from (t, y) towards t1. A stiff drain reaching a reservoir's floor
 * can stall the Newton iteration on a stale Jacobian: the step is then retried from
 * (t, y) with a fresh stepper and a hundred times smaller step, up to 8 times
 * (*restarts counts them). VL_OK, or VL_ERR_NUMERIC with the age in st. */
int vl_stepper_step(vl_stepper *s, double *t, double t1, double *h, double *y, long *restarts,
                    vl_status *st);

/* What the event watch sees at one point: the regime the conditions call for and the
 * reservoirs newly below their floor (bit r: reservoir r, among the armed ones). */
typedef struct {
    int regime;
    unsigned long exhausted;
} vl_signature;

/* The signature at (t, y) under regime; with cols (m->ncolumns) also the process flux
 * columns there. A change is taken only to a regime consistent with itself. */
vl_signature vl_events_signature(const vl_ode *ode, double t, const double *y, int regime,
                                 unsigned long armed, double *cols);
/* 1 when sig calls for nothing new under regime. */
int vl_events_same(vl_signature sig, int regime);
/* The regime at (t, y) once classification stops changing it (at most 4 passes). */
int vl_events_settle(const vl_ode *ode, double t, const double *y, int regime);
/* armed plus the reservoirs well above their floor in y (each is logged once). */
unsigned long vl_events_rearm(const double *y, unsigned long armed);
/* Locate the first time in (t0, t1] where the signature departs from ode->regime, by
 * bisection with re-integration from (t0, y0) on sub, to run.event_tolerance. On return
 * (t1, y1) is the located point (just after the change) and *sig its signature. */
int vl_events_locate(const vl_ode *ode, vl_stepper *sub, double t0, const double *y0,
                     double *t1, double *y1, unsigned long armed, vl_signature *sig,
                     vl_status *st);

#endif
