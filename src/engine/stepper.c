/* stepper.c: one history's ODE integrator (integrate_internal.h): SUNDIALS CVODE's BDF
 * (variable order, Newton iteration, dense linear solver) over the model's right-hand
 * side with a finite-difference Jacobian, per-reservoir absolute scales (floor / 1e3;
 * the mantle's potential temperature: TP_ABS_K), the run's relative tolerance, the
 * run's end as stop time, and the event watch's root functions. CVODE's vector holds
 * only the components the history can change (active.c): its error norm, Jacobian
 * columns and linear solve are sized to them. One SUNDIALS context per stepper, so the
 * runs of a sweep's threads and ranks share nothing. */
#include <float.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

#include <cvode/cvode_ls.h>
#include <nvector/nvector_serial.h>
#include <sunmatrix/sunmatrix_dense.h>

#include "integrate_internal.h"
#include "volev/units.h"

/* Absolute accuracy asked of the mantle's potential temperature, K, and the size it
 * counts as for the Jacobian's increments. */
#define TP_ABS_K 1e-3
#define TP_SIZE_K 1.0

/* The highest BDF order. BDF5 is stable only within 51.8 degrees of the negative real
 * axis, BDF4 within 73.4 (Hairer & Wanner 1996, Solving Ordinary Differential Equations
 * II, section V.2, Table 2.3): trace O2 and H2 coupled through water and oxidation have
 * stiff modes that BDF5 cannot hold, and at order 5 some small, cold planets stalled
 * with their O2 jumping between 2e3 and 4e4 kg from step to step (docs/model.md
 * section 6); at order 4 they finish and the bundled scenarios take about as many steps. */
#define MAX_ORDER 4

/* Size of state component j below which its Jacobian increment stops shrinking. */
static double component_size(int j) { return j < VL_NRES ? vl_reservoir_floor(j) : TP_SIZE_K; }

/* The whole state from the active components p (the others keep their start). */
static double *unpack(vl_ode *c, const double *p)
{
    for (int k = 0; k < c->na; k++)
        c->full[c->idx[k]] = p[k];
    return c->full;
}

/* The active components of the whole state y into p. */
static void pack(const vl_ode *c, const double *y, double *p)
{
    for (int k = 0; k < c->na; k++)
        p[k] = y[c->idx[k]];
}

int vl_stepper_finite(const double *v, size_t n)
{
    for (size_t i = 0; i < n; i++)
        if (!isfinite(v[i]))
            return 0;
    return 1;
}

/* The model's right-hand side (CVRhsFn); a non-finite result is a recoverable failure
 * (CVODE retries with a smaller step). */
static int rhs(double t, N_Vector yv, N_Vector fv, void *pv)
{
    vl_ode *c = pv;
    double f[VL_NSTATE];
    c->rhs_calls++;
    vl_model_rhs(c->m, c->w, t, unpack(c, N_VGetArrayPointer(yv)), c->regime, f, NULL, NULL);
    pack(c, f, N_VGetArrayPointer(fv));
    return vl_stepper_finite(f, VL_NSTATE) ? 0 : 1;
}

/* The event watch's root functions (CVRootFn) on the whole state. */
static int roots(double t, N_Vector yv, double *g, void *pv)
{
    vl_ode *c = pv;
    vl_events_roots(c, t, unpack(c, N_VGetArrayPointer(yv)), g);
    return 0;
}

/* Forward-difference Jacobian (CVLsJacFn) of the active components from CVODE's f(t, y);
 * increments scale with each reservoir's floor band. */
static int jac(double t, N_Vector yv, N_Vector fy, SUNMatrix jm, void *pv, N_Vector t1,
               N_Vector t2, N_Vector t3)
{
    (void)t1, (void)t2, (void)t3;
    vl_ode *c = pv;
    const double *f0 = N_VGetArrayPointer(fy);
    double sq = sqrt(DBL_EPSILON);
    memcpy(c->yt, unpack(c, N_VGetArrayPointer(yv)), sizeof c->yt);
    for (int k = 0; k < c->na; k++) {
        int j = c->idx[k];
        double *col = SUNDenseMatrix_Column(jm, k), yj = c->yt[j];
        /* a mantle that never was molten has no temperature. Space is differenced like
         * any reservoir: the reversed flows of flux.c (give_back) draw on it, ramped by
         * what it holds, so its columns are not zero; left out, the Newton iteration did
         * not see that a reversal stops as space_o empties, and space_o chattered about
         * zero under O2 below zero (campaign seed 3 members 24 and 44 stalled, issue 18) */
        if (j == VL_S_MANTLE_TP && yj == 0.0) {
            for (int i = 0; i < c->na; i++)
                col[i] = 0.0;
            continue;
        }
        double h = sq * fmax(fabs(yj), component_size(j));
        c->yt[j] = yj + h;
        c->rhs_calls++;
        vl_model_rhs(c->m, c->w, t, c->yt, c->regime, c->f1, NULL, NULL);
        if (!vl_stepper_finite(c->f1, VL_NSTATE))
            return 1;
        c->yt[j] = yj;
        for (int i = 0; i < c->na; i++)
            col[i] = (c->f1[c->idx[i]] - f0[i]) / h;
        vl_jacobian_balance(c, col); /* its round-off must not make or lose matter */
    }
    return 0;
}

/* CVODE's error messages go to the stepper's buffer, never to a stream. */
static void quiet(int code, const char *module, const char *function, char *msg, void *pv)
{
    (void)code, (void)module;
    vl_stepper *s = pv;
    snprintf(s->msg, sizeof s->msg, "%s: %s", function, msg);
}

static int setup_failed(vl_status *st, const char *what)
{
    return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "integrator set-up failed: %s", what);
}

/* CVODE's settings after its creation: tolerances, limits, solver, Jacobian, roots. */
static int configure(vl_stepper *s, vl_ode *ode, const vl_run_params *rp, vl_status *st)
{
    int dir[VL_NROOTS];
    vl_events_directions(dir);
    if (CVodeSetErrHandlerFn(s->cv, quiet, s) || CVodeSetUserData(s->cv, ode) ||
        CVodeSVtolerances(s->cv, rp->rel_tol * s->norm_scale, s->abstol) ||
        CVodeSetMaxNumSteps(s->cv, rp->max_steps) || CVodeSetStopTime(s->cv, s->end_s) ||
        CVodeSetMaxOrd(s->cv, MAX_ORDER) ||
        CVodeSetMaxErrTestFails(s->cv, 20) ||
        CVodeSetLinearSolver(s->cv, s->ls, s->jm) || CVodeSetJacFn(s->cv, jac) ||
        CVodeRootInit(s->cv, VL_NROOTS, roots) || CVodeSetRootDirection(s->cv, dir) ||
        CVodeSetNoInactiveRootWarn(s->cv))
        return setup_failed(st, s->msg[0] ? s->msg : "a setting was refused");
    return VL_OK;
}

int vl_stepper_init(vl_stepper *s, vl_ode *ode, const vl_run_params *rp, double t0,
                    const double *y0, vl_status *st)
{
    memset(s, 0, sizeof *s);
    s->end_s = rp->end_s;
    s->ode = ode;
    memcpy(ode->full, y0, sizeof ode->full);
    ode->na = vl_active_components(ode->m, y0, ode->idx);
    int n = ode->na;
    if (SUNContext_Create(NULL, &s->ctx))
        return setup_failed(st, "no SUNDIALS context");
    s->y = N_VNew_Serial(n, s->ctx);
    s->abstol = N_VNew_Serial(n, s->ctx);
    s->jm = SUNDenseMatrix(n, n, s->ctx);
    s->ls = s->y && s->jm ? vl_dense_lu_new(n, s->ctx) : NULL;
    s->cv = CVodeCreate(CV_BDF, s->ctx);
    if (!s->y || !s->abstol || !s->jm || !s->ls || !s->cv)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    vl_kernels_vector(s->y);
    vl_kernels_vector(s->abstol);
    vl_kernels_matrix(s->jm);
    /* CVODE's error norm is a root mean square over its vector: the tolerances grow by
     * sqrt(VL_NSTATE / n) so that the norm is the whole state's, the fixed components
     * counting with zero error (the tolerances mean what they meant over the full state) */
    s->norm_scale = sqrt((double)VL_NSTATE / n);
    double *a = N_VGetArrayPointer(s->abstol);
    for (int k = 0; k < n; k++) {
        int j = ode->idx[k];
        a[k] = s->norm_scale *
               (j < VL_NRES ? rp->abs_tol_kg * vl_reservoir_floor(j) / 1e3 : TP_ABS_K);
    }
    pack(ode, y0, N_VGetArrayPointer(s->y));
    if (CVodeInit(s->cv, rhs, t0, s->y))
        return setup_failed(st, s->msg[0] ? s->msg : "CVodeInit");
    return configure(s, ode, rp, st);
}

void vl_stepper_free(vl_stepper *s)
{
    if (s->cv)
        CVodeFree(&s->cv);
    if (s->ls)
        SUNLinSolFree(s->ls);
    if (s->jm)
        SUNMatDestroy(s->jm);
    if (s->abstol)
        N_VDestroy(s->abstol);
    if (s->y)
        N_VDestroy(s->y);
    if (s->ctx)
        SUNContext_Free(&s->ctx);
}

long vl_stepper_steps(vl_stepper *s)
{
    long n = 0;
    CVodeGetNumSteps(s->cv, &n);
    return s->steps_before + n;
}

long vl_stepper_jacobians(vl_stepper *s)
{
    long n = 0;
    CVodeGetNumJacEvals(s->cv, &n);
    return s->jacs_before + n;
}

int vl_stepper_restart(vl_stepper *s, double t, const double *y, double h0, vl_status *st)
{
    s->steps_before = vl_stepper_steps(s);
    s->jacs_before = vl_stepper_jacobians(s);
    pack(s->ode, y, N_VGetArrayPointer(s->y));
    /* the stop time is set again: a re-initialisation may forget it */
    if (CVodeReInit(s->cv, t, s->y) || CVodeSetInitStep(s->cv, fmin(h0, s->end_s - t)) ||
        CVodeSetStopTime(s->cv, s->end_s))
        return vl_fail(st, VL_ERR_NUMERIC, NULL, 0, "integrator restart failed at age %.6g yr: %s",
                       t / VL_YR, s->msg);
    return VL_OK;
}

static int failed(vl_stepper *s, vl_status *st, double t)
{
    return vl_fail(st, VL_ERR_NUMERIC, NULL, 0, "integration failed at age %.6g yr: %s",
                   t / VL_YR, s->msg[0] ? s->msg : "non-finite state");
}

int vl_stepper_step(vl_stepper *s, double *t, double *y, int *root, long *restarts,
                    vl_status *st)
{
    double h = 0.0, t0 = *t;
    int rc = CVode(s->cv, s->end_s, s->y, t, CV_ONE_STEP);
    size_t n = (size_t)s->ode->na;
    const double *yv = N_VGetArrayPointer(s->y);
    for (int retry = 0; retry < 8 && (rc < 0 || !vl_stepper_finite(yv, n)); retry++) {
        /* CVODE leaves (t, y) at its last accepted point */
        if (retry == 0)
            CVodeGetLastStep(s->cv, &h);
        h = fmax(h, 1.0) * 1e-2;
        (*restarts)++;
        double p[VL_NSTATE];
        if (vl_stepper_finite(yv, n)) {
            memcpy(p, yv, n * sizeof *p);
        } else {
            *t = t0;
            pack(s->ode, y, p);
        }
        if (vl_stepper_restart(s, *t, unpack(s->ode, p), h, st) != VL_OK)
            return st->code;
        rc = CVode(s->cv, s->end_s, s->y, t, CV_ONE_STEP);
    }
    if (rc < 0 || !vl_stepper_finite(yv, n))
        return failed(s, st, *t);
    memcpy(y, unpack(s->ode, yv), VL_NSTATE * sizeof *y);
    *root = rc == CV_ROOT_RETURN;
    return VL_OK;
}

/* Derivative k of CVODE's interpolating polynomial at t, the active components into p. */
static int dky(vl_stepper *s, double t, int k, double *p, vl_status *st)
{
    N_Vector v = N_VMake_Serial(s->ode->na, p, s->ctx);
    int rc = v ? CVodeGetDky(s->cv, t, k, v) : -1;
    if (v)
        N_VDestroy(v);
    if (rc)
        return vl_fail(st, VL_ERR_NUMERIC, NULL, 0, "no dense output at age %.6g yr: %s",
                       t / VL_YR, s->msg);
    return VL_OK;
}

int vl_stepper_dense(vl_stepper *s, double t, double *y, vl_status *st)
{
    double p[VL_NSTATE];
    if (dky(s, t, 0, p, st) != VL_OK)
        return st->code;
    memcpy(y, unpack(s->ode, p), VL_NSTATE * sizeof *y);
    return VL_OK;
}

int vl_stepper_slope(vl_stepper *s, double t, double *dydt, vl_status *st)
{
    double p[VL_NSTATE];
    if (dky(s, t, 1, p, st) != VL_OK)
        return st->code;
    for (int j = 0; j < VL_NSTATE; j++) /* the fixed components do not move */
        dydt[j] = 0.0;
    for (int k = 0; k < s->ode->na; k++)
        dydt[s->ode->idx[k]] = p[k];
    return VL_OK;
}

unsigned long vl_stepper_exhausted(vl_stepper *s, unsigned long armed)
{
    int found[VL_NROOTS];
    unsigned long ex = 0;
    if (CVodeGetRootInfo(s->cv, found))
        return 0;
    for (int r = 0; r < VL_NRES; r++)
        if (found[r] && (armed >> r & 1UL))
            ex |= 1UL << r;
    return ex;
}
