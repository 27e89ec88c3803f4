/* integrate_internal.h: the layers under vl_integrate (integrate.c): the stepper (SUNDIALS
 * CVODE's BDF over the model's right-hand side with dense output and root finding,
 * stepper.c) and the event watch (the regime the conditions call for and exhausted
 * reservoirs, as CVODE root functions, events.c). Private to src/engine. */
#ifndef VOLEV_INTEGRATE_INTERNAL_H
#define VOLEV_INTEGRATE_INTERNAL_H

#include <cvode/cvode.h>
#include <sundials/sundials_context.h>
#include <sundials/sundials_linearsolver.h>
#include <sundials/sundials_matrix.h>
#include <sundials/sundials_nvector.h>

#include "volev/integrate.h"
#include "volev/model.h"

/* Root functions handed to CVODE: one per reservoir (its mass above its floor, while it
 * is armed) and the regime's (+1 while the conditions keep it, -1 once they call for
 * another). */
#define VL_NROOTS (VL_NRES + 1)

/* What the right-hand side and the root functions need: the model, the run's workspace,
 * the regime held fixed between events (and, after a change, held at least
 * run.event_tolerance), the reservoirs watched for exhaustion; counts evaluations. The last root evaluation's point and process flux columns are kept: at
 * the end of a step they are the channel budget's. */
typedef struct {
    const vl_model *m;
    vl_work *w;
    int regime;
    unsigned long armed;
    double hold_until;                   /* the regime's root function waits until then */
    long rhs_calls;
    double yt[VL_NSTATE], f1[VL_NSTATE]; /* Jacobian scratch */
    double g_t, g_y[VL_NSTATE], g_cols[VL_MAX_COLUMNS];
    int g_regime, g_valid;               /* the regime the conditions there call for */
    /* The integrator's vector holds the na active components idx[0..na) (active.c);
     * full is the whole state the right-hand side and the root functions see, its other
     * components fixed at their (zero) start. */
    int na, idx[VL_NSTATE];
    double full[VL_NSTATE];
} vl_ode;

/* The components of the state a history of m starting at y0 can change, in state order,
 * into idx; returns their number (active.c). */
int vl_active_components(const vl_model *m, const double *y0, int *idx);

/* Remove the element imbalances of a finite-difference Jacobian column col (the active
 * components of d f / d y_j) with the smallest change weighted by each entry's round-off
 * scale, the gross tendencies of the right-hand side's last evaluation in ode->w (the
 * column's own), so that every element's total is conserved by the Newton corrections
 * (jacobian_balance.c). */
void vl_jacobian_balance(const vl_ode *ode, double *col);

/* CVODE with its context, state vector (the active components), tolerances, dense
 * matrix and solver sized to them; the steps
 * taken before its last re-initialisation (which resets CVODE's own count), and the
 * last error message CVODE reported. */
typedef struct {
    SUNContext ctx;
    void *cv;
    N_Vector y, abstol;
    SUNMatrix jm;
    SUNLinearSolver ls;
    vl_ode *ode;
    double end_s, norm_scale;
    long steps_before, jacs_before;
    char msg[200];
} vl_stepper;

/* A direct linear solver for CVODE on an n x n dense matrix (dense_lu.c); NULL when out
 * of memory. */
SUNLinearSolver vl_dense_lu_new(sunindextype n, SUNContext ctx);

/* Install the project's compiled kernels for CVODE's hot operations in the tables of a
 * serial vector (clones inherit them) and of a dense square matrix
 * (sundials_kernels.c); the results are SUNDIALS's own to the bit. */
void vl_kernels_vector(N_Vector v);
void vl_kernels_matrix(SUNMatrix m);

/* 1 when every entry of v is finite. */
int vl_stepper_finite(const double *v, size_t n);
/* A stepper over ode starting at (t0, y0) with the run's tolerances, root functions
 * and stop time; VL_OK, or an error in st. */
int vl_stepper_init(vl_stepper *s, vl_ode *ode, const vl_run_params *rp, double t0,
                    const double *y0, vl_status *st);
/* Free what vl_stepper_init made (also after a partial init). */
void vl_stepper_free(vl_stepper *s);
/* Start afresh at (t, y) with trial step h0 (after an event: no step straddles a
 * discontinuity of the right-hand side). */
int vl_stepper_restart(vl_stepper *s, double t, const double *y, double h0, vl_status *st);
/* One accepted step towards the run's end: (t, y) become its end, or the first root
 * within it (*root = 1). A step CVODE gives up on is retried from the last accepted
 * point with a hundred times smaller trial step, up to 8 times (*restarts counts them).
 * VL_OK, or VL_ERR_NUMERIC with the age in st. */
int vl_stepper_step(vl_stepper *s, double *t, double *y, int *root, long *restarts,
                    vl_status *st);
/* The state at t within the last step (CVODE's interpolating polynomial). */
int vl_stepper_dense(vl_stepper *s, double t, double *y, vl_status *st);
/* Its time derivative at t (the polynomial's, the history the next step extrapolates). */
int vl_stepper_slope(vl_stepper *s, double t, double *dydt, vl_status *st);
/* The armed reservoirs whose root function vanished at the last root (bit r). */
unsigned long vl_stepper_exhausted(vl_stepper *s, unsigned long armed);
/* Accepted steps and Jacobian evaluations so far, re-initialisations included. */
long vl_stepper_steps(vl_stepper *s);
long vl_stepper_jacobians(vl_stepper *s);

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
/* The root functions (VL_NROOTS of them) at (t, y), y the whole state. */
void vl_events_roots(vl_ode *ode, double t, const double *y, double *g);
/* The root directions: every function is watched falling through zero. */
void vl_events_directions(int *dir);
/* The signature at (t, y) under the regime in force, among the armed reservoirs, and the
 * process flux columns there: from the last root evaluation when it was at this very
 * point (no second model evaluation), else evaluated. */
vl_signature vl_events_at(vl_ode *ode, double t, const double *y, double *cols);

#endif
